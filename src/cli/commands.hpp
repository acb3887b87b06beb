// Each command file defines register_<name>(CLI::App& sub), which declares the
// command's options on its subcommand and sets the callback that runs it.
#pragma once

#include <CLI/CLI.hpp>

namespace mudepth::cli {

void register_mu(CLI::App& sub);
void register_scan(CLI::App& sub);
void register_materials(CLI::App& sub);
void register_depth(CLI::App& sub);
void register_film(CLI::App& sub);
void register_plate(CLI::App& sub);
void register_cylinder(CLI::App& sub);
void register_filter(CLI::App& sub);
void register_plan(CLI::App& sub);
void register_correct(CLI::App& sub);

}  // namespace mudepth::cli
