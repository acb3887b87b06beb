// `mudepth film`: placeholder until the command is written.
#include "cli/commands.hpp"
#include "mudepth/error.hpp"

namespace mudepth::cli {

void register_film(CLI::App& sub) {
    sub.callback([] { throw InputError("the film command is not available yet"); });
}

}  // namespace mudepth::cli
