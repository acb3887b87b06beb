// `mudepth cylinder`: placeholder until the command is written.
#include "cli/commands.hpp"
#include "mudepth/error.hpp"

namespace mudepth::cli {

void register_cylinder(CLI::App& sub) {
    sub.callback([] { throw InputError("the cylinder command is not available yet"); });
}

}  // namespace mudepth::cli
