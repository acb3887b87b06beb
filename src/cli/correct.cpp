// `mudepth correct`: placeholder until the command is written.
#include "cli/commands.hpp"
#include "mudepth/error.hpp"

namespace mudepth::cli {

void register_correct(CLI::App& sub) {
    sub.callback([] { throw InputError("the correct command is not available yet"); });
}

}  // namespace mudepth::cli
