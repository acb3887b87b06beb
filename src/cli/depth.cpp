// `mudepth depth`: placeholder until the command is written.
#include "cli/commands.hpp"
#include "mudepth/error.hpp"

namespace mudepth::cli {

void register_depth(CLI::App& sub) {
    sub.callback([] { throw InputError("the depth command is not available yet"); });
}

}  // namespace mudepth::cli
