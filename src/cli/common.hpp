// Options shared by the computing commands (sample, radiation, table, output)
// and the parsing of option values with units. This is the only place where
// user units are converted to the library's.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include <CLI/CLI.hpp>

#include "mudepth/cross_section.hpp"
#include "mudepth/material.hpp"
#include "mudepth/radiation.hpp"

namespace mudepth::cli {

/// How the user described the sample.
struct SampleOptions {
    std::string formula;
    std::string material;
    std::string density;        ///< g/cm³
    std::string packing;        ///< fraction
    std::string bulk_density;   ///< g/cm³
    std::string cell;           ///< "a b c alpha beta gamma", Å and degrees
    std::string formula_units;  ///< Z
    std::vector<std::string> phases;
    std::string phase_basis = "weight";
};

struct RadiationOptions {
    std::string energy;      ///< keV
    std::string wavelength;  ///< Å
    std::string source;      ///< ANODE[:LINE]
};

void add_sample_options(CLI::App& app, SampleOptions& options);
void add_radiation_options(CLI::App& app, RadiationOptions& options);
void add_table_option(CLI::App& app, std::string& table);

/// The material the options describe; throws InputError naming the option.
Material build_material(const SampleOptions& options);

/// The radiation the options describe; exactly one of --energy, --wavelength, --source.
Radiation build_radiation(const RadiationOptions& options);

CrossSectionTable build_table(const std::string& table);

/// Refuses an empty option value (`--energy ""`).
const CLI::Validator& nonempty();

/// A finite number from an option's text; throws InputError "--name: 'x' is not a number".
double parse_number(const std::string& option, const std::string& text);

/// Lengths an option accepts: 0.001 nm to 10 m; anything outside is a typo.
inline constexpr double kMaxLength_cm = 1000.0;
inline constexpr double kMinLength_cm = 1e-10;

/// A length with unit suffix nm, um (or µm), mm, cm; a bare number means mm. Returns cm.
double parse_length_cm(const std::string& option, const std::string& text);

/// Most angles one --two-theta may give.
inline constexpr std::size_t kMaxAnglePoints = 10'000'000;

/// Angles from "START:STOP:STEP" (STOP included when the steps land on it
/// within 1e-9 of a step) or a comma list "20,30.5,40", degrees. Checks only the
/// syntax, finiteness, step > 0, START <= STOP and the point limit: each command
/// checks the range its geometry allows.
std::vector<double> parse_angles_deg(const std::string& option, const std::string& text);

/// Adds --two-theta to a command.
void add_two_theta_option(CLI::App& app, std::string& two_theta, const std::string& default_value = "");

/// A positive whole number.
std::size_t parse_count(const std::string& option, const std::string& text);

}  // namespace mudepth::cli
