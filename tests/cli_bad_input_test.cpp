// The bad-input table: every refusal of the command line, end to end. Each row
// is a command line, the exit status it must give (2 bad input, 3 file error,
// SPEC O2) and a part of the one-line message. A refusal prints nothing on
// stdout, exactly one line "mudepth: error: ..." on stderr, and leaves the
// scratch folder as it was (no partial output file).
#include <gtest/gtest.h>
#include <sys/stat.h>
#include <unistd.h>

#include <algorithm>
#include <cstdio>
#include <filesystem>
#include <fstream>
#include <set>
#include <string>
#include <vector>

#include "support/process.hpp"

namespace mudepth::test {
namespace {

namespace fs = std::filesystem;

struct BadInput {
    std::vector<std::string> args;  ///< "@TMP@" stands for the scratch folder
    int status;
    std::string message;  ///< expected part of the error line
    bool needs_non_root = false;  ///< permission checks do not apply to root
};

void PrintTo(const BadInput& b, std::ostream* os) {
    *os << "mudepth";
    for (const auto& a : b.args) *os << " '" << a << "'";
}

// ---------------------------------------------------------------------------
// Building command lines: a command with its good options, then one change.

using Options = std::vector<std::pair<std::string, std::string>>;
const std::string kDrop = "\x01drop";  ///< as a change's value: leave the option out
const std::string kFlag = "\x01flag";  ///< as a value: the option is a flag

std::vector<std::string> line(const std::string& command, Options options, const Options& changes) {
    for (const auto& [key, value] : changes) {
        auto it = std::find_if(options.begin(), options.end(), [&](const auto& o) { return o.first == key; });
        if (it == options.end()) options.emplace_back(key, value);
        else it->second = value;
    }
    std::vector<std::string> args{command};
    for (const auto& [key, value] : options) {
        if (value == kDrop) continue;
        args.push_back(key);
        if (value != kFlag) args.push_back(value);
    }
    return args;
}

const Options kMu{{"--formula", "Si"}, {"--density", "2.33"}, {"--energy", "8"}};
const Options kScan{{"--formula", "Si"}, {"--from", "5"}, {"--to", "20"}};
const Options kDepth{{"--formula", "Si"}, {"--source", "Cu"}, {"--two-theta", "30"}};
const Options kDepthMu{{"--mu", "100"}, {"--two-theta", "30"}};
const Options kFilm{{"--layer", "TiN,2um,5.4"}, {"--substrate", "Fe"}, {"--source", "Cu"}, {"--two-theta", "40"}};
const Options kPlate{{"--formula", "Si"}, {"--source", "Cu"}, {"--thickness", "0.1mm"}};
const Options kPlateMuT{{"--mu-t", "1"}};
const Options kCylinder{{"--formula", "Si"}, {"--source", "Cu"}, {"--diameter", "0.1mm"}};
const Options kCylinderMuR{{"--mu-r", "1"}};
const Options kFilter{{"--anode", "Cu"}};
const Options kPlan{{"--formula", "Si"}, {"--source", "Cu"}};

/// Rows for an option taking a plain number: empty, NaN, infinite, not a number.
std::vector<BadInput> number_rows(const std::string& command, const Options& base, const std::string& option) {
    const std::string o = option + ": ";
    return {{line(command, base, {{option, ""}}), 2, o + "empty value"},
            {line(command, base, {{option, "nan"}}), 2, o + "'nan' is not a finite number"},
            {line(command, base, {{option, "inf"}}), 2, o + "'inf' is not a finite number"},
            {line(command, base, {{option, "-inf"}}), 2, o + "'-inf' is not a finite number"},
            {line(command, base, {{option, "12abc"}}), 2, o + "'12abc' is not a number"}};
}

/// Rows for an option taking a length (nm, um, mm, cm; bare number mm).
std::vector<BadInput> length_rows(const std::string& command, const Options& base, const std::string& option) {
    const std::string o = option + ": ";
    return {{line(command, base, {{option, ""}}), 2, o + "empty value"},
            {line(command, base, {{option, "0"}}), 2, o + "length '0' must be positive"},
            {line(command, base, {{option, "-2um"}}), 2, o + "length '-2um' must be positive"},
            {line(command, base, {{option, "nan"}}), 2, o + "'nan'"},
            {line(command, base, {{option, "inf"}}), 2, o + "'inf'"},
            {line(command, base, {{option, "1e308"}}), 2, o + "length '1e308' is longer than 10 m"},
            {line(command, base, {{option, "1e308nm"}}), 2, o + "length '1e308nm' is longer than 10 m"},
            {line(command, base, {{option, "1e-30nm"}}), 2, o + "length '1e-30nm' is shorter than 0.001 nm"},
            {line(command, base, {{option, "2in"}}), 2, o + "'2in' has an unknown unit; use nm, um, mm or cm"},
            {line(command, base, {{option, "1m"}}), 2, o + "'1m' has an unknown unit"}};
}

/// Rows for an option taking angles (START:STOP:STEP or a list).
std::vector<BadInput> angle_rows(const std::string& command, const Options& base, const std::string& option) {
    const std::string o = option + ": ";
    return {{line(command, base, {{option, ""}}), 2, o + "empty value"},
            {line(command, base, {{option, "20:80:0"}}), 2, o + "step 0 must be positive"},
            {line(command, base, {{option, "20:80:-1"}}), 2, o + "step -1 must be positive"},
            {line(command, base, {{option, "80:20:1"}}), 2, o + "stop 20 is below start 80"},
            // 10^7 points is the limit (cli/common.hpp kMaxAnglePoints): 0..10 by 1e-6 is 10^7 + 1.
            {line(command, base, {{option, "0:10:1e-6"}}), 2, o + "'0:10:1e-6' gives more than 10000000 angles"},
            {line(command, base, {{option, "0:1e308:1e-308"}}), 2, "gives more than 10000000 angles"},
            {line(command, base, {{option, "20:80:nan"}}), 2, option + " step: 'nan' is not a finite number"},
            {line(command, base, {{option, "inf:80:1"}}), 2, option + " start: 'inf' is not a finite number"},
            {line(command, base, {{option, "20:80"}}), 2, o + "'20:80' is not START:STOP:STEP (degrees)"},
            {line(command, base, {{option, "1:2:3:4"}}), 2, o + "'1:2:3:4' is not START:STOP:STEP"},
            {line(command, base, {{option, "20,,30"}}), 2, o + "empty value; a number is needed"},
            {line(command, base, {{option, "nan"}}), 2, o + "'nan' is not a finite number"},
            {line(command, base, {{option, "30deg"}}), 2, o + "'30deg' is not a number"}};
}

/// Rows for the sample options every computing command shares.
std::vector<BadInput> sample_rows(const std::string& command, const Options& base) {
    std::vector<BadInput> rows;
    auto add = [&](std::vector<BadInput> more) { rows.insert(rows.end(), more.begin(), more.end()); };
    add(number_rows(command, base, "--density"));
    add({{line(command, base, {{"--formula", "Fe2O3)"}, {"--density", "5"}}), 2, "unmatched ')' at column 6"},
         {line(command, base, {{"--formula", ""}}), 2, "--formula: empty value"},
         {line(command, base, {{"--formula", "Xx2O"}, {"--density", "5"}}), 2, "unknown element 'Xx' at column 1"},
         {line(command, base, {{"--density", "-1"}}), 2, "--density -1 g/cm3 is not a density"},
         {line(command, base, {{"--density", "1e308"}}), 2, "--density 1e+308 g/cm3 is outside 1e-06..30 g/cm3"},
         {line(command, base, {{"--density", "2.33g/cm3"}}), 2, "--density: '2.33g/cm3' is not a number"},
         {line(command, base, {{"--packing", "nan"}}), 2, "--packing: 'nan' is not a finite number"},
         {line(command, base, {{"--packing", "-0.5"}}), 2, "packing fraction -0.5 is outside (0, 1]"},
         {line(command, base, {{"--packing", "1e308"}}), 2, "packing fraction 1e+308 is outside (0, 1]"},
         {line(command, base, {{"--packing", ""}}), 2, "--packing: empty value"},
         {line(command, base, {{"--density", kDrop}, {"--bulk-density", "1e308"}}), 2,
          "--bulk-density 1e+308 g/cm3 is outside 1e-06..30 g/cm3"},
         {line(command, base, {{"--density", kDrop}, {"--bulk-density", "-1"}}), 2,
          "--bulk-density -1 g/cm3 is not a density"},
         {line(command, base, {{"--formula", kDrop}, {"--material", ""}}), 2, "--material: empty value"},
         {line(command, base, {{"--formula", kDrop}, {"--material", "unobtainium"}}), 2,
          "unknown material 'unobtainium'"},
         {line(command, base, {{"--formula", "SiO2"}, {"--density", kDrop}}), 2, "no density given for 'SiO2'"},
         {line(command, base, {{"--formula", "SiO2"}, {"--density", kDrop}, {"--cell", "4.9 4.9 5.4 90 90 120"}}), 2,
          "--cell needs --formula-units"},
         {line(command, base,
               {{"--formula", "SiO2"}, {"--density", kDrop}, {"--cell", "4.9 4.9 5.4 90 90 120"},
                {"--formula-units", "1e308"}}),
          2, "density from the cell inf g/cm3 is not a density"},
         {line(command, base,
               {{"--formula", "SiO2"}, {"--density", kDrop}, {"--cell", "4.9 4.9 1e308 90 90 120"},
                {"--formula-units", "3"}}),
          2, "cell volume inf A^3 is not usable"},
         {line(command, base,
               {{"--formula", "SiO2"}, {"--density", kDrop}, {"--cell", "4.9 4.9 -5.4 90 90 120"},
                {"--formula-units", "3"}}),
          2, "cell length c = -5.4 A must be finite and > 0"},
         {line(command, base,
               {{"--formula", "SiO2"}, {"--density", kDrop}, {"--cell", "4.9 4.9 5.4 90 90 400"},
                {"--formula-units", "3"}}),
          2, "cell angle gamma = 400 degrees must be between 0 and 180"},
         {line(command, base, {{"--formula", kDrop}, {"--density", kDrop}, {"--phase", "Si,2.33,nan"}}), 2,
          "--phase 'Si,2.33,nan' fraction: 'nan' is not a finite number"},
         {line(command, base, {{"--formula", kDrop}, {"--density", kDrop}, {"--phase", "Si,1e308,0.5"}}), 2,
          "--phase 'Si,1e308,0.5' density 1e+308 g/cm3 is outside 1e-06..30 g/cm3"},
         {line(command, base, {{"--formula", kDrop}, {"--density", kDrop}, {"--phase", "Si,2.33,-1"}}), 2,
          "weight fraction -1 of phase 1 (Si) must be finite and >= 0"},
         {line(command, base, {{"--formula", kDrop}, {"--density", kDrop}, {"--phase", "Si,2,3,4"}}), 2,
          "expected FORMULA,DENSITY,FRACTION or MATERIAL,FRACTION"}});
    return rows;
}

/// Rows for the radiation options (commands with --energy/--wavelength/--source).
std::vector<BadInput> radiation_rows(const std::string& command, Options base) {
    for (auto& o : base)
        if (o.first == "--energy" || o.first == "--source") o.second = kDrop;
    std::vector<BadInput> rows = number_rows(command, base, "--energy");
    rows.push_back({line(command, base, {{"--energy", "1e308"}}), 2, "energy 1e+308 keV is outside 1..500 keV"});
    rows.push_back({line(command, base, {{"--energy", "-8"}}), 2, "energy -8 keV is outside 1..500 keV"});
    rows.push_back({line(command, base, {{"--energy", "0.5"}}), 2, "energy 0.5 keV is outside 1..500 keV"});
    rows.push_back({line(command, base, {{"--energy", "8keV"}}), 2, "--energy: '8keV' is not a number"});
    rows.push_back({line(command, base, {{"--wavelength", "nan"}}), 2, "--wavelength: 'nan' is not a finite number"});
    rows.push_back({line(command, base, {{"--wavelength", "1e308"}}), 2, "wavelength 1e+308 Å"});
    rows.push_back({line(command, base, {{"--wavelength", "-1.5"}}), 2, "wavelength -1.5 Å must be a positive number"});
    rows.push_back({line(command, base, {{"--wavelength", "1.54nm"}}), 2, "--wavelength: '1.54nm' is not a number"});
    rows.push_back({line(command, base, {{"--source", ""}}), 2, "--source: empty value"});
    rows.push_back({line(command, base, {{"--source", "Zn"}}), 2, "unknown anode 'Zn'"});
    rows.push_back({line(command, base, {{"--source", "Cu:Kc"}}), 2, "unknown line 'Kc'"});
    rows.push_back({line(command, base, {{"--energy", "8"}, {"--source", "Cu"}}), 2, "give only one of"});
    rows.push_back({line(command, base, {}), 2, "no radiation given"});
    rows.push_back({line(command, base, {{"--energy", "8"}, {"--table", "henke"}}), 2, "henke"});
    rows.push_back({line(command, base, {{"--energy", "8"}, {"--table", ""}}), 2, "--table: empty value"});
    return rows;
}

std::vector<BadInput> all_rows() {
    std::vector<BadInput> rows;
    auto add = [&](std::vector<BadInput> more) { rows.insert(rows.end(), more.begin(), more.end()); };

    // The command line itself.
    add({{{}, 2, "no command given"},
         {{"frobnicate"}, 2, "unknown command 'frobnicate'"},
         {line("mu", kMu, {{"--bogus", "1"}}), 2, "--bogus"},
         {{"mu", "--formula", "Si", "--density", "2.33", "--energy"}, 2, "--energy"},
         {line("mu", kMu, {{"--json", kFlag}, {"--csv", kFlag}}), 2, "--csv"}});

    // mu (SPEC M1, M2, M3, R1, R2, U1).
    add(sample_rows("mu", kMu));
    add(radiation_rows("mu", kMu));
    add(length_rows("mu", kMu, "--thickness"));
    add({{line("mu", {{"--energy", "8"}}, {}), 2, "no sample given"},
         {line("mu", {{"--formula", "PuO2"}, {"--density", "11.5"}, {"--energy", "20"}, {"--table", "chantler"}}, {}),
          2, "Z = 1..92"}});

    // scan (U4).
    add(sample_rows("scan", kScan));
    add(number_rows("scan", kScan, "--from"));
    add(number_rows("scan", kScan, "--to"));
    add({{line("scan", kScan, {{"--to", "1e308"}}), 2, "energy 1e+308 keV is outside 1..500 keV"},
         {line("scan", kScan, {{"--from", "-5"}}), 2, "energy -5 keV is outside 1..500 keV"},
         {line("scan", kScan, {{"--from", "20"}, {"--to", "5"}}), 2, "must be below"},
         {line("scan", kScan, {{"--to", kDrop}}), 2, "scan needs --from and --to (keV)"},
         {line("scan", kScan, {{"--steps", "0"}}), 2, "--steps: '0' is not a positive whole number"},
         {line("scan", kScan, {{"--steps", "-3"}}), 2, "--steps: '-3' is not a positive whole number"},
         {line("scan", kScan, {{"--steps", "2.5"}}), 2, "--steps: '2.5' is not a positive whole number"},
         {line("scan", kScan, {{"--steps", "1e308"}}), 2, "--steps: '1e308' is not a positive whole number"},
         {line("scan", kScan, {{"--steps", ""}}), 2, "--steps: empty value"},
         {line("scan", kScan, {{"--steps", "1"}}), 2, "a scan needs 2..1000000 points, not 1"},
         {line("scan", kScan, {{"--steps", "100000000"}}), 2, "a scan needs 2..1000000 points, not 100000000"},
         {line("scan", kScan, {{"--spacing", "cubic"}}), 2, "unknown spacing"}});

    // depth (D1-D6; issue 3 item 3).
    add(sample_rows("depth", kDepth));
    add(radiation_rows("depth", kDepth));
    add(angle_rows("depth", kDepth, "--two-theta"));
    add(angle_rows("depth", kDepth, "--incidence"));
    add(angle_rows("depth", kDepth, "--tilt"));
    add(length_rows("depth", kDepth, "--thickness"));
    add(length_rows("depth", kDepth, "--goniometer-radius"));
    add(length_rows("depth", kDepth, "--target-depth"));
    add(number_rows("depth", kDepthMu, "--mu"));
    add(number_rows("depth", kDepth, "--fraction"));
    add({{line("depth", kDepth, {{"--two-theta", "0"}}), 2, "2θ = 0° is outside (0°, 180°)"},
         {line("depth", kDepth, {{"--two-theta", "180"}}), 2, "2θ = 180° is outside (0°, 180°)"},
         {line("depth", kDepth, {{"--two-theta", "-30"}}), 2, "2θ = -30° is outside (0°, 180°)"},
         {line("depth", kDepth, {{"--two-theta", "1e308"}}), 2, "2θ = 1e+308° is outside (0°, 180°)"},
         {line("depth", kDepth, {{"--incidence", "0"}}), 2, "incidence 0° must be above 0°"},
         {line("depth", kDepth, {{"--incidence", "-1"}}), 2, "incidence -1° must be above 0°"},
         {line("depth", kDepth, {{"--incidence", "35"}}), 2, "incidence 35° must be below 2θ = 30°"},
         {line("depth", kDepth, {{"--incidence", "1e308"}}), 2, "incidence 1e+308° must be below 2θ = 30°"},
         {line("depth", kDepth, {{"--fraction", "0"}}), 2, "--fraction 0 is outside (0, 1)"},
         {line("depth", kDepth, {{"--fraction", "1"}}), 2, "--fraction 1 is outside (0, 1)"},
         {line("depth", kDepth, {{"--fraction", "1e308"}}), 2, "--fraction 1e308 is outside (0, 1)"},
         {line("depth", kDepth, {{"--tilt", "95"}}), 2, "tilt ψ = 95° must be within (−90°, 90°)"},
         {line("depth", kDepth, {{"--tilt", "10"}, {"--tilt-mode", "sideways"}}), 2,
          "--tilt-mode: 'sideways' is not side or omega"},
         {line("depth", kDepthMu, {{"--mu", "0"}}), 2, "--mu: 0 1/cm must be positive"},
         {line("depth", kDepthMu, {{"--mu", "-5"}}), 2, "--mu: -5 1/cm must be positive"},
         // Guard rail: μ of real samples lies within about 1e-7..3e5 1/cm (from memory).
         {line("depth", kDepthMu, {{"--mu", "1e308"}}), 2, "--mu: 1e308 1/cm is outside 1e-8..1e6 1/cm"},
         {line("depth", kDepthMu, {{"--mu", "1e-300"}}), 2, "--mu: 1e-300 1/cm is outside 1e-8..1e6 1/cm"},
         {line("depth", kDepthMu, {{"--source", "Cu"}}), 2, "--mu gives μ directly"}});

    // film (D7; issue 3 item 3: an empty stack).
    add(radiation_rows("film", kFilm));
    add(angle_rows("film", kFilm, "--two-theta"));
    add(angle_rows("film", kFilm, "--incidence"));
    for (const auto& r : length_rows("film", kFilm, "--layer")) {
        // The layer's thickness field: "--layer 'TiN,<value>,5.4' thickness: ..."
        const std::string value = r.args[std::find(r.args.begin(), r.args.end(), "--layer") - r.args.begin() + 1];
        if (value.empty()) continue;
        const std::string spec = "TiN," + value + ",5.4";
        std::string message = r.message;
        message.replace(0, std::string("--layer: ").size(), "--layer '" + spec + "' thickness: ");
        rows.push_back({line("film", kFilm, {{"--layer", spec}}), 2, message});
    }
    add({{line("film", kFilm, {{"--layer", ""}}), 2, "--layer: empty value"},
         {line("film", kFilm, {{"--layer", "TiN"}}), 2, "expected FORMULA_OR_MATERIAL,THICKNESS[,DENSITY]"},
         {line("film", kFilm, {{"--layer", "TiN,2um,5.4,7"}}), 2, "expected FORMULA_OR_MATERIAL,THICKNESS[,DENSITY]"},
         {line("film", kFilm, {{"--layer", ",2um"}}), 2, "--layer ',2um': no formula or material given"},
         {line("film", kFilm, {{"--layer", "TiN,2um"}}), 2, "give the density of TiN in g/cm3 as the last field"},
         {line("film", kFilm, {{"--layer", "TiN,2um,nan"}}), 2, "--layer 'TiN,2um,nan' density: 'nan' is not a finite number"},
         {line("film", kFilm, {{"--layer", "TiN,2um,1e308"}}), 2, "density 1e+308 g/cm3 is outside 1e-06..30 g/cm3"},
         {line("film", kFilm, {{"--layer", "TiN,2um,-1"}}), 2, "density -1 g/cm3 is not a density"},
         {line("film", kFilm, {{"--layer", "Ti)N,2um,5.4"}}), 2, "unmatched ')' at column 3"},
         {line("film", kFilm, {{"--layer", "unobtainium,2um"}}), 2, "unknown material 'unobtainium'"},
         {line("film", kFilm, {{"--layer", kDrop}}), 2, "the film stack is empty"},
         {line("film", kFilm, {{"--substrate", ""}}), 2, "--substrate: empty value"},
         {line("film", kFilm, {{"--substrate", kDrop}}), 2, "film needs --substrate"},
         {line("film", kFilm, {{"--substrate", "Fe,nan"}}), 2, "--substrate 'Fe,nan' density: 'nan' is not a finite number"},
         {line("film", kFilm, {{"--substrate", "Fe,-1"}}), 2, "--substrate 'Fe,-1' density -1 g/cm3 is not a density"},
         {line("film", kFilm, {{"--substrate", "Fe,1e308"}}), 2, "density 1e+308 g/cm3 is outside"},
         {line("film", kFilm, {{"--substrate", "Fe,1,2"}}), 2, "--substrate 'Fe,1,2': expected FORMULA_OR_MATERIAL[,DENSITY]"},
         {line("film", kFilm, {{"--two-theta", kDrop}}), 2, "film needs --two-theta"},
         {line("film", kFilm, {{"--two-theta", "0"}}), 2, "2θ = 0° is outside (0°, 180°)"},
         {line("film", kFilm, {{"--incidence", "45"}}), 2, "incidence 45° must be below 2θ = 40°"},
         {line("film", kFilm, {{"--two-theta", "30:40:1"}, {"--incidence", "1,2"}}), 2,
          "--incidence with several angles needs a single --two-theta"}});

    // plate (P1-P3; issue 4 item 4).
    add(sample_rows("plate", kPlate));
    add(radiation_rows("plate", kPlate));
    add(length_rows("plate", kPlate, "--thickness"));
    add(angle_rows("plate", kPlateMuT, "--two-theta"));
    add(number_rows("plate", kPlateMuT, "--mu-t"));
    add(number_rows("plate", kPlateMuT, "--incidence"));
    add(number_rows("plate", kPlateMuT, "--mu-t-window"));
    add({{line("plate", kPlateMuT, {{"--mu-t", "0"}}), 2, "--mu-t: μt = 0 must be positive"},
         {line("plate", kPlateMuT, {{"--mu-t", "-1"}}), 2, "--mu-t: μt = -1 must be positive"},
         // Guard rails: a direct μt above 1e6, a transmission that underflows to 0.
         {line("plate", kPlateMuT, {{"--mu-t", "1e308"}}), 2, "--mu-t: μt = 1e308 is above the limit 1e6"},
         {line("plate", kPlateMuT, {{"--mu-t", "800"}, {"--mode", "transmission-normal"}, {"--two-theta", "30"}}), 2,
          "at 2θ = 30° the plate and windows let through less than 1e-308 of the beam"},
         {line("plate", kPlateMuT, {{"--mu-t-window", "1e308"}}), 2, "--mu-t-window: 1e308 is above the limit 1e6"},
         {line("plate", kPlateMuT, {{"--mu-t-window", "-1"}}), 2, "--mu-t-window: -1 must be positive"},
         {line("plate", kPlateMuT, {{"--mode", "sideways"}}), 2, "unknown plate mode 'sideways'"},
         {line("plate", kPlateMuT, {{"--mode", "transmission-normal"}, {"--two-theta", "90"}}), 2,
          "transmission-normal: 2θ = 90° does not exit through the back face"},
         {line("plate", kPlateMuT, {{"--two-theta", "200"}}), 2, "2θ = 200° is outside 0..180°"},
         {line("plate", kPlateMuT, {{"--two-theta", "-5"}}), 2, "2θ = -5° is outside 0..180°"},
         {line("plate", kPlateMuT, {{"--incidence", "0"}, {"--two-theta", "30"}}), 2, "incidence 0° must be above 0°"},
         {line("plate", kPlateMuT, {{"--incidence", "40"}, {"--two-theta", "30"}}), 2,
          "incidence 40° must be below 2θ = 30°"},
         {line("plate", kPlate, {{"--thickness", kDrop}}), 2, "the material route needs --thickness"},
         {line("plate", kPlate, {{"--mu-t", "1"}}), 2, "--mu-t gives μt directly"},
         {line("plate", {}, {}), 2, "no sample given"}});

    // cylinder (C1-C3; issue 4 item 4).
    add(sample_rows("cylinder", kCylinder));
    add(radiation_rows("cylinder", kCylinder));
    add(length_rows("cylinder", kCylinder, "--diameter"));
    add(angle_rows("cylinder", kCylinderMuR, "--two-theta"));
    add(number_rows("cylinder", kCylinderMuR, "--mu-r"));
    add(number_rows("cylinder", {{"--mu-r", "1"}, {"--mu-r-container", "0.1"}}, "--radius-ratio"));
    const Options wall{{"--formula", "Si"}, {"--source", "Cu"}, {"--diameter", "0.1mm"},
                       {"--container-material", "fused-silica"}, {"--wall", "10um"}};
    for (auto r : length_rows("cylinder", wall, "--wall")) add({r});
    add({{line("cylinder", kCylinderMuR, {{"--mu-r", "0"}}), 2, "--mu-r: μR = 0 must be positive"},
         {line("cylinder", kCylinderMuR, {{"--mu-r", "-1"}}), 2, "--mu-r: μR = -1 must be positive"},
         {line("cylinder", kCylinderMuR, {{"--mu-r", "31"}}), 2, "μR = 31 is above 30"},
         {line("cylinder", kCylinderMuR, {{"--mu-r", "1e308"}}), 2, "μR = 1e+308 is above 30"},
         {line("cylinder", kCylinder, {{"--diameter", "50mm"}}), 2, "is above 30: too absorbing for a capillary"},
         {line("cylinder", kCylinderMuR, {{"--two-theta", "181"}}), 2, "2θ = 181° is outside 0..180°"},
         {line("cylinder", kCylinderMuR, {{"--two-theta", "-1"}}), 2, "2θ = -1° is outside 0..180°"},
         {line("cylinder", kCylinderMuR, {{"--mu-r-container", "0.1"}, {"--radius-ratio", "1"}}), 2,
          "--radius-ratio: 1 must be above 1"},
         {line("cylinder", kCylinderMuR, {{"--mu-r-container", "0.1"}, {"--radius-ratio", "0.5"}}), 2,
          "--radius-ratio: 0.5 must be above 1"},
         {line("cylinder", kCylinderMuR, {{"--mu-r-container", "0.1"}, {"--radius-ratio", "1e308"}}), 2,
          "radius ratio 1e+308 is above 20"},
         {line("cylinder", kCylinderMuR, {{"--mu-r-container", "-0.1"}, {"--radius-ratio", "1.1"}}), 2,
          "--mu-r-container: -0.1 must be zero or positive"},
         {line("cylinder", kCylinderMuR, {{"--mu-r-container", "nan"}, {"--radius-ratio", "1.1"}}), 2,
          "--mu-r-container: 'nan' is not a finite number"},
         {line("cylinder", kCylinder, {{"--container-material", "fused-silica"}}), 2,
          "a container wall needs both --container-material and --wall"}});

    // filter (U6).
    add(length_rows("filter", kFilter, "--thickness"));
    add(number_rows("filter", kFilter, "--ratio"));
    add({{line("filter", kFilter, {{"--anode", "Zn"}}), 2, "unknown anode 'Zn'"},
         {line("filter", kFilter, {{"--anode", ""}}), 2, "--anode: empty value"},
         {line("filter", kFilter, {{"--ratio", "0"}}), 2, "--ratio: the target Kb/Ka ratio must be positive"},
         {line("filter", kFilter, {{"--ratio", "-1"}}), 2, "--ratio: the target Kb/Ka ratio must be positive"},
         {line("filter", kFilter, {{"--ratio", "1e308"}}), 2, "target Kb/Ka ratio 1e+308 is not below the unfiltered"},
         {line("filter", kFilter, {{"--element", "Xx"}}), 2, "--element: unknown element 'Xx'"},
         {line("filter", kFilter, {{"--element", "Fe"}}), 2, "its K edge does not lie between Ka and Kb"},
         {line("filter", kFilter, {{"--ratio", "0.01"}, {"--thickness", "10um"}}), 2, "not both"}});

    // plan (L1-L3).
    add(sample_rows("plan", kPlan));
    add(radiation_rows("plan", kPlan));
    add(number_rows("plan", kPlan, "--target-mu-r"));
    add(number_rows("plan", kPlan, "--two-theta-max"));
    add(length_rows("plan", kPlan, "--diameter"));
    add(length_rows("plan", kPlan, "--holder-diameter"));
    add(length_rows("plan", kPlan, "--holder-depth"));
    add(number_rows("plan", kPlan, "--holder-area"));
    add({{line("plan", kPlan, {{"--target-mu-r", "0"}}), 2, "--target-mu-r: the target muR must be positive, not 0"},
         {line("plan", kPlan, {{"--target-mu-r", "-1"}}), 2, "--target-mu-r: the target muR must be positive, not -1"},
         // Guard rail: the capillary factors exist up to μR = 30 (cylinder.hpp kMaxCylinderMuR).
         {line("plan", kPlan, {{"--target-mu-r", "1e308"}}), 2, "--target-mu-r: 1e308 is above 30"},
         {line("plan", kPlan, {{"--diluent", "unobtainium"}}), 2, "unknown material 'unobtainium'"},
         {line("plan", kPlan, {{"--two-theta-max", "0"}}), 2, "--two-theta-max: 0° must lie in (0, 180)"},
         {line("plan", kPlan, {{"--two-theta-max", "200"}}), 2, "--two-theta-max: 200° must lie in (0, 180)"},
         {line("plan", kPlan, {{"--holder-area", "0"}}), 2, "--holder-area: area '0' must be positive"},
         {line("plan", kPlan, {{"--holder-area", "-1"}}), 2, "--holder-area: area '-1' must be positive"},
         // Guard rail: an area within (10 m)², as for lengths.
         {line("plan", kPlan, {{"--holder-area", "1e308"}}), 2, "--holder-area: area '1e308' is larger than 100 m2"},
         {line("plan", kPlan, {{"--holder-area", "5in2"}}), 2, "--holder-area: '5in2' is not a number"}});

    // materials (M4).
    add({{{"materials", "unobtainium"}, 2, "unknown material 'unobtainium'"},
         {{"materials", ""}, 2, "empty value"},
         {{"materials", "--json", "unobtainium"}, 2, "unknown material 'unobtainium'"}});

    // Files (SPEC O2: exit 3): directories, missing, too large, unreadable; outputs that cannot be written.
    add({{line("mu", kMu, {{"--formula", kDrop}, {"--density", kDrop}, {"--material", "@TMP@/dir.toml"}}), 3,
          "cannot read composition file '@TMP@/dir.toml': it is a directory"},
         {line("mu", kMu, {{"--formula", kDrop}, {"--density", kDrop}, {"--material", "@TMP@/missing.toml"}}), 3,
          "cannot read composition file '@TMP@/missing.toml': No such file or directory"},
         // Guard rail in the composition reader: 1 MiB (composition.cpp kMaxFileBytes).
         {line("mu", kMu, {{"--formula", kDrop}, {"--density", kDrop}, {"--material", "@TMP@/big.toml"}}), 3,
          "composition file '@TMP@/big.toml' is larger than 1 MiB"},
         {line("mu", kMu, {{"--formula", kDrop}, {"--density", kDrop}, {"--material", "/dev/zero"}}), 3,
          "composition file '/dev/zero' is larger than 1 MiB"},
         {line("mu", kMu, {{"--formula", kDrop}, {"--density", kDrop}, {"--material", "@TMP@/unreadable.toml"}}), 3,
          "cannot read composition file '@TMP@/unreadable.toml': Permission denied", true},
         {{"materials", "@TMP@/dir.toml"}, 3, "it is a directory"},
         {line("film", kFilm, {{"--layer", "@TMP@/dir.toml,2um"}}), 3, "it is a directory"},
         {line("plate", kPlateMuT, {{"--mode", "transmission-normal"}, {"--source", "Cu"},
                                    {"--window-material", "@TMP@/missing.toml"}, {"--window-thickness", "1um"}}),
          3, "No such file or directory"},
         {line("scan", kScan, {{"--plot", "@TMP@/afile/x.svg"}}), 3, "cannot write plot '@TMP@/afile/x.svg': Not a directory"},
         {line("scan", kScan, {{"--plot", "@TMP@/dir.toml"}}), 3, "it is a directory; give a file name such as plot.svg"},
         {line("scan", kScan, {{"--plot", "@TMP@/no-such-dir/x.svg"}}), 3, "No such file or directory"},
         {line("scan", kScan, {{"--plot", "@TMP@/readonly/x.svg"}}), 3, "Permission denied", true},
         {line("depth", kDepth, {{"--two-theta", "20:60:10"}, {"--plot", "@TMP@/afile/x.svg"}}), 3, "Not a directory"},
         {line("film", kFilm, {{"--two-theta", "20:60:10"}, {"--plot", "@TMP@/afile/x.svg"}}), 3, "Not a directory"},
         {line("plate", kPlateMuT, {{"--plot", "@TMP@/afile/x.svg"}}), 3, "Not a directory"},
         {line("cylinder", kCylinderMuR, {{"--plot", "@TMP@/afile/x.svg"}}), 3, "Not a directory"},
         {line("plan", kPlan, {{"--plot", "@TMP@/afile/x.svg"}}), 3, "Not a directory"}});

    // -----------------------------------------------------------------------
    // correct (X1-X4; issue 5 items 1, 3, 6). Extend here: the same helpers
    // work with kCorrect / kCorrectSample; files are made in the scratch folder
    // by BadInputTable::SetUpTestSuite (big200.xy is written only for its row).
    // Batches with some files refused print the good ones' results and are
    // tested in cli_correct_test.cpp, not in this one-line table.
    const Options kCorrect{{"@TMP@/good.xy", kFlag}, {"--geometry", "cylinder"}, {"--mu-r", "1"},
                           {"--output-dir", "@TMP@/out"}};
    const Options kCorrectSample{{"@TMP@/good.xy", kFlag}, {"--geometry", "cylinder"}, {"--formula", "Si"},
                                 {"--source", "Cu"}, {"--diameter", "0.1mm"}, {"--output-dir", "@TMP@/out"}};
    auto pattern = [&](const std::string& file) {
        return line("correct", {{file, kFlag}, {"--geometry", "cylinder"}, {"--mu-r", "1"}, {"--output-dir", "@TMP@/out"}},
                    {});
    };
    add(sample_rows("correct", kCorrectSample));
    add(radiation_rows("correct", kCorrectSample));
    add(length_rows("correct", kCorrectSample, "--diameter"));
    add(number_rows("correct", kCorrect, "--mu-r"));
    add({{line("correct", kCorrect, {{"--mu-r", "0"}}), 2, "--mu-r: μR = 0 must be positive"},
         {line("correct", kCorrect, {{"--mu-r", "1e308"}}), 2, "μR = 1e+308 is above 30"},
         {line("correct", kCorrect, {{"--jobs", "0"}}), 2, "--jobs: '0' is not a positive whole number"},
         {line("correct", kCorrect, {{"--jobs", "-2"}}), 2, "--jobs: '-2' is not a positive whole number"},
         {line("correct", kCorrect, {{"--jobs", "1e308"}}), 2, "--jobs: '1e308' is not a positive whole number"},
         {line("correct", kCorrect, {{"--geometry", "sphere"}}), 2, "unknown geometry 'sphere'"},
         {pattern("@TMP@/decreasing.xy"), 2,
          "decreasing.xy:3: 2θ = 15° does not increase (previous point 20°); points must be in increasing 2θ"},
         {pattern("@TMP@/repeated.xy"), 2, "repeated.xy:2: 2θ = 10° does not increase (previous point 10°)"},
         {pattern("@TMP@/dir.toml"), 3, "dir.toml: cannot read: it is a directory"},
         {pattern("@TMP@/missing.xy"), 3, "missing.xy: cannot read: No such file or directory"},
         // A file that vanished: the link is there, its target is gone.
         {pattern("@TMP@/vanished.xy"), 3, "vanished.xy: cannot read: No such file or directory"},
         {pattern("@TMP@/unreadable.toml"), 3, "unreadable.toml: cannot read: Permission denied", true},
         // Guard rail: 64 MiB per pattern file (pattern.hpp kMaxPatternFileBytes); reading
         // takes some times the file size in memory.
         {pattern("@TMP@/big200.xy"), 3, "big200.xy: cannot read: the file is 200000000 bytes, above the limit of 64 MiB"},
         {line("correct", kCorrect, {{"--output-dir", "@TMP@/afile"}}), 3,
          "afile: is not a folder; give a folder for the corrected files"},
         {line("correct", {{"@TMP@/good.xy", kFlag}, {"--geometry", "cylinder"}, {"--mu-r", "1"},
                           {"--mu-r-container", "0.1"}, {"--radius-ratio", "1.1"}, {"--empty", "@TMP@/good.xy"},
                           {"--output-dir", "@TMP@/out"}},
               {}),
          2, "good.xy: is also the empty-container scan; give it only as the empty container"},
         {line("correct", kCorrect, {{"--output-dir", "@TMP@/afile/sub"}}), 3,
          "afile/sub: cannot create the output folder: Not a directory"},
         {line("correct", kCorrect, {{"--output-dir", "@TMP@/readonly"}}), 3, "Permission denied", true}});
    // -----------------------------------------------------------------------
    return rows;
}

class BadInputTable : public ::testing::TestWithParam<BadInput> {
public:
    static void SetUpTestSuite() {
        dir_ = fs::path(::testing::TempDir()) / ("mudepth-bad-input-" + std::to_string(::getpid()));
        fs::create_directories(dir_ / "dir.toml");
        fs::create_directories(dir_ / "readonly");
        fs::permissions(dir_ / "readonly", fs::perms::owner_read | fs::perms::owner_exec);
        std::ofstream(dir_ / "afile") << "a file where a folder is expected\n";
        std::ofstream(dir_ / "big.toml") << std::string((1 << 20) + 1, '#');
        std::ofstream(dir_ / "unreadable.toml") << "title = \"x\"\n";
        fs::create_directories(dir_ / "out");
        std::ofstream(dir_ / "good.xy") << "10 1\n20 2\n30 3\n";
        std::ofstream(dir_ / "decreasing.xy") << "10 1\n20 2\n15 3\n";
        std::ofstream(dir_ / "repeated.xy") << "10 1\n10 2\n";
        fs::create_symlink(dir_ / "gone.xy", dir_ / "vanished.xy");
        fs::permissions(dir_ / "unreadable.toml", fs::perms::none);
    }
    static void TearDownTestSuite() {
        std::error_code ec;
        fs::permissions(dir_ / "readonly", fs::perms::owner_all, ec);
        fs::remove_all(dir_, ec);
    }

protected:
    static std::string expand(std::string s) {
        for (std::size_t at; (at = s.find("@TMP@")) != std::string::npos;) s.replace(at, 5, dir_.string());
        return s;
    }
    /// A plain two-column pattern of exactly `bytes` bytes, 2θ increasing.
    static void write_big_pattern(const fs::path& path, std::size_t bytes) {
        std::ofstream out(path, std::ios::binary);
        std::string chunk;
        std::size_t written = 0;
        char row[64];
        for (std::size_t i = 0; written < bytes; ++i) {
            // 24-byte rows: "017.9999820 0001000000\n" style, 2θ = i·1e-6 degrees.
            const int n = std::snprintf(row, sizeof row, "%011.7f %010zu\n", static_cast<double>(i) * 1e-6, i % 100000);
            chunk.append(row, static_cast<std::size_t>(n));
            if (chunk.size() >= (1u << 20) || written + chunk.size() >= bytes) {
                const std::size_t take = std::min(chunk.size(), bytes - written);
                out.write(chunk.data(), static_cast<std::streamsize>(take));
                written += take;
                chunk.clear();
            }
        }
    }
    static std::set<std::string> listing() {
        std::set<std::string> names;
        for (const auto& e : fs::recursive_directory_iterator(dir_, fs::directory_options::skip_permission_denied))
            names.insert(e.path().string() + " " + std::to_string(e.is_regular_file() ? e.file_size() : 0));
        return names;
    }
    static fs::path dir_;
};

fs::path BadInputTable::dir_;

TEST_P(BadInputTable, RefusedWithOneLine) {
    const BadInput& p = GetParam();
    if (p.needs_non_root && ::geteuid() == 0) GTEST_SKIP() << "permissions do not bind root";
    std::vector<std::string> args;
    for (const auto& a : p.args) args.push_back(expand(a));
    const fs::path big = dir_ / "big200.xy";
    const bool needs_big = std::find(args.begin(), args.end(), big.string()) != args.end();
    if (needs_big) write_big_pattern(big, 200'000'000);
    const auto before = listing();
    const auto r = run_mudepth(args);
    EXPECT_EQ(r.status, p.status) << r.err;
    EXPECT_TRUE(r.out.empty()) << "printed a result for bad input: " << r.out;
    EXPECT_EQ(r.err.rfind("mudepth: error: ", 0), 0u) << r.err;
    EXPECT_EQ(std::count(r.err.begin(), r.err.end(), '\n'), 1) << r.err;
    EXPECT_NE(r.err.find(expand(p.message)), std::string::npos) << "expected: " << expand(p.message)
                                                                 << "\nstderr: " << r.err;
    EXPECT_EQ(listing(), before) << "a refusal changed the scratch folder";
    if (needs_big) fs::remove(big);
}

INSTANTIATE_TEST_SUITE_P(EveryCommand, BadInputTable, ::testing::ValuesIn(all_rows()));

}  // namespace
}  // namespace mudepth::test
