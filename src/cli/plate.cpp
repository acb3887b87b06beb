// `mudepth plate`: placeholder until the command is written.
#include "cli/commands.hpp"
#include "mudepth/error.hpp"

namespace mudepth::cli {

void register_plate(CLI::App& sub) {
    sub.callback([] { throw InputError("the plate command is not available yet"); });
}

}  // namespace mudepth::cli
