// End-to-end tests of `mudepth mu`, `scan` and `materials`: the binary's JSON,
// its refusals, and the README example.
#include <gtest/gtest.h>
#include <xraylib/xraylib.h>

#include <cmath>
#include <fstream>
#include <sstream>

#include "support/process.hpp"

namespace mudepth::test {
namespace {

TEST(CliMu, JsonContractForSilicon) {
    const auto j = run_json({"mu", "--formula", "Si", "--density", "2.329", "--packing", "0.6",
                             "--energy", "8.04778", "--json"});
    ASSERT_TRUE(j.is_object());
    for (const char* key : {"energy_keV", "wavelength_A", "density_g_cm3", "mass_attenuation_cm2_g",
                            "linear_attenuation_per_cm", "attenuation_length_um", "elements", "warnings"})
        EXPECT_TRUE(j.contains(key)) << key;
    EXPECT_DOUBLE_EQ(j["energy_keV"].get<double>(), 8.04778);
    // hc = 12.39841984 keV·Å (CODATA 2018).
    EXPECT_NEAR(j["wavelength_A"].get<double>(), 12.39841984 / 8.04778, 1e-12);
    EXPECT_NEAR(j["density_g_cm3"].get<double>(), 2.329 * 0.6, 1e-12);  // density × packing
    const auto& m = j["mass_attenuation_cm2_g"];
    for (const char* part : {"total", "photoelectric", "coherent", "incoherent"}) EXPECT_TRUE(m.contains(part));
    EXPECT_NEAR(m["total"].get<double>(),
                m["photoelectric"].get<double>() + m["coherent"].get<double>() + m["incoherent"].get<double>(),
                1e-12 * m["total"].get<double>());
    // xraylib 4.0.0 CS_Total(14, 8.04778 keV): the same quantity from another compilation (1%).
    EXPECT_NEAR(m["total"].get<double>() / CS_Total(14, 8.04778, nullptr), 1.0, 0.01);
    const double mu = j["linear_attenuation_per_cm"].get<double>();
    EXPECT_NEAR(mu, m["total"].get<double>() * 2.329 * 0.6, 1e-9 * mu);
    EXPECT_NEAR(j["attenuation_length_um"].get<double>(), 1e4 / mu, 1e-9 / mu * 1e4);
    ASSERT_EQ(j["elements"].size(), 1u);
    EXPECT_EQ(j["elements"][0]["symbol"], "Si");
    EXPECT_DOUBLE_EQ(j["elements"][0]["weight_fraction"].get<double>(), 1.0);
    EXPECT_TRUE(j["warnings"].empty());
}

TEST(CliMu, ElementsSumToTheSample) {
    const auto j = run_json({"mu", "--formula", "CuSO4·5H2O", "--density", "2.286", "--source", "Mo", "--json"});
    double weights = 0, weighted = 0;
    for (const auto& e : j["elements"]) {
        weights += e["weight_fraction"].get<double>();
        weighted += e["weight_fraction"].get<double>() * e["mass_attenuation_cm2_g"].get<double>();
    }
    EXPECT_NEAR(weights, 1.0, 1e-12);
    EXPECT_NEAR(weighted, j["mass_attenuation_cm2_g"]["total"].get<double>(), 1e-9 * weighted);
    // Mo Kα = 0.7107471 Å (derived from Hölzer et al. 1997).
    EXPECT_NEAR(j["wavelength_A"].get<double>(), 0.7107471, 1e-7);
    // Cu K edge (8.98 keV) is below Mo Kα: Cu fluoresces (common practice).
    ASSERT_FALSE(j["warnings"].empty());
    EXPECT_NE(j["warnings"][0].get<std::string>().find("Cu K edge"), std::string::npos);
}

TEST(CliMu, RadiationAlternativesAgree) {
    const std::vector<std::string> sample{"mu", "--formula", "Fe2O3", "--density", "5.26", "--json"};
    auto with = [&](std::vector<std::string> radiation) {
        auto args = sample;
        args.insert(args.end(), radiation.begin(), radiation.end());
        return run_json(args)["linear_attenuation_per_cm"].get<double>();
    };
    const double by_source = with({"--source", "Cu:Ka1"});
    EXPECT_NEAR(with({"--wavelength", "1.54059290"}), by_source, 1e-9 * by_source);
    EXPECT_NEAR(with({"--energy", std::to_string(12.39841984 / 1.54059290)}), by_source, 1e-6 * by_source);
}

TEST(CliMu, MaterialFromTheLibraryAndTransmission) {
    const auto j = run_json({"mu", "--material", "fused-silica", "--source", "Cu", "--thickness", "10um", "--json"});
    EXPECT_GT(j["density_g_cm3"].get<double>(), 2.0);
    const double mu = j["linear_attenuation_per_cm"].get<double>();
    // Beer-Lambert: exp(−μ t) with t = 10 µm = 1e-3 cm.
    EXPECT_NEAR(j["transmission"]["transmission"].get<double>(), std::exp(-mu * 1e-3), 1e-12);
}

TEST(CliMu, ChantlerTableAndSpread) {
    const auto j = run_json({"mu", "--formula", "Si", "--energy", "17.479", "--table", "chantler", "--json"});
    EXPECT_EQ(j["table"], "chantler");
    const double spread = j["table_spread"]["relative_difference"].get<double>();
    EXPECT_LT(std::abs(spread), 0.06);  // the two tables agree within a few % away from edges
}

TEST(CliScan, JsonAndCsv) {
    const auto j = run_json({"scan", "--formula", "Cu", "--from", "5", "--to", "20", "--steps", "31", "--json"});
    ASSERT_EQ(j["points"].size(), 31u);
    ASSERT_FALSE(j["edges_crossed"].empty());
    EXPECT_EQ(j["edges_crossed"][0]["level"], "K");  // Cu K edge at 8.98 keV (common practice)
    // Across the K edge the attenuation jumps up (common practice).
    double before = 0, after = 0;
    for (const auto& p : j["points"]) {
        const double e = p["energy_keV"].get<double>();
        if (e < 8.9) before = p["mass_attenuation_cm2_g"].get<double>();
        if (e > 9.1 && after == 0) after = p["mass_attenuation_cm2_g"].get<double>();
    }
    EXPECT_GT(after, 4 * before);
    const auto csv = run_mudepth({"scan", "--formula", "Cu", "--from", "5", "--to", "20", "--steps", "4",
                                  "--spacing", "linear", "--csv"});
    EXPECT_EQ(csv.status, 0);
    EXPECT_NE(csv.out.find("energy_keV,wavelength_A,mu_rho_cm2_g"), std::string::npos);
    EXPECT_NE(csv.out.find("\n10,"), std::string::npos);
}

TEST(CliScan, PlotIsAnSvgWithUnits) {
    const std::string path = ::testing::TempDir() + "/mudepth_scan_plot.svg";
    std::remove(path.c_str());
    const auto r = run_mudepth({"scan", "--formula", "Cu", "--from", "5", "--to", "50", "--plot", path});
    ASSERT_EQ(r.status, 0) << r.err;
    std::ifstream in(path);
    std::stringstream text;
    text << in.rdbuf();
    const std::string svg = text.str();
    EXPECT_EQ(svg.rfind("<?xml", 0), 0u);
    EXPECT_NE(svg.find("</svg>"), std::string::npos);
    EXPECT_NE(svg.find("photon energy (keV)"), std::string::npos);
    EXPECT_NE(svg.find("μ/ρ (cm²/g)"), std::string::npos);
    EXPECT_NE(svg.find("Cu K"), std::string::npos);  // the edge is marked
    // xmllint (libxml2-utils) or rsvg-convert may be absent; when rsvg-convert is there it must render.
    if (run_shell("command -v rsvg-convert >/dev/null").status == 0) {
        EXPECT_EQ(run_shell("rsvg-convert '" + path + "' -o '" + path + ".png'").status, 0);
        std::remove((path + ".png").c_str());
    }
    std::remove(path.c_str());
}

TEST(CliMaterials, ListsTheLibrary) {
    const auto r = run_mudepth({"materials"});
    EXPECT_EQ(r.status, 0);
    for (const char* name : {"fused-silica", "corundum", "lab6", "air", "helium", "beryllium"})
        EXPECT_NE(r.out.find(name), std::string::npos) << name;
}

struct Refusal {
    std::vector<std::string> args;
    std::string message;  // expected part of the one-line error
};

class CliRefusal : public ::testing::TestWithParam<Refusal> {};

TEST_P(CliRefusal, ExitsTwoWithOneLine) {
    const auto& p = GetParam();
    const auto r = run_mudepth(p.args);
    EXPECT_EQ(r.status, 2) << r.err;
    EXPECT_TRUE(r.out.empty()) << "printed a result for bad input: " << r.out;
    EXPECT_EQ(r.err.rfind("mudepth: error: ", 0), 0u) << r.err;
    EXPECT_EQ(std::count(r.err.begin(), r.err.end(), '\n'), 1) << r.err;
    EXPECT_NE(r.err.find(p.message), std::string::npos) << "stderr: " << r.err;
}

const std::vector<std::string> kSi{"mu", "--formula", "Si", "--density", "2.33"};
std::vector<std::string> si(std::vector<std::string> more) {
    auto a = kSi;
    a.insert(a.end(), more.begin(), more.end());
    return a;
}

INSTANTIATE_TEST_SUITE_P(
    BadInput, CliRefusal,
    ::testing::Values(
        Refusal{{"mu", "--formula", "Fe2O3)", "--density", "5", "--energy", "8"}, "unmatched ')' at column 6"},
        Refusal{{"mu", "--formula", "Xx2O", "--density", "5", "--energy", "8"}, "unknown element 'Xx' at column 1"},
        Refusal{{"mu", "--formula", "Fe0O", "--density", "5", "--energy", "8"}, "column 3"},
        Refusal{{"mu", "--formula", "SiO2", "--energy", "8"}, "no density given for 'SiO2'"},
        Refusal{{"mu", "--formula", "Si", "--density", "-1", "--energy", "8"}, "--density"},
        Refusal{{"mu", "--formula", "Si", "--density", "0", "--energy", "8"}, "--density"},
        Refusal{si({"--packing", "1.5", "--energy", "8"}), "packing fraction 1.5 is outside (0, 1]"},
        Refusal{si({"--packing", "0", "--energy", "8"}), "packing fraction 0 is outside (0, 1]"},
        Refusal{si({"--energy", "0.5"}), "energy 0.5 keV is outside 1..500 keV"},
        Refusal{si({"--energy", "501"}), "energy 501 keV is outside 1..500 keV"},
        Refusal{si({"--energy", "nan"}), "--energy: 'nan' is not a finite number"},
        Refusal{si({"--energy", "inf"}), "--energy: 'inf' is not a finite number"},
        Refusal{si({"--energy", "abc"}), "--energy: 'abc' is not a number"},
        Refusal{si({"--energy", ""}), "--energy: empty value"},
        Refusal{si({"--energy", "8", "--packing", ""}), "--packing: empty value"},
        Refusal{si({"--wavelength", "-1.5"}), "wavelength -1.5 Å must be a positive number"},
        Refusal{si({"--wavelength", "0"}), "wavelength 0 Å must be a positive number"},
        Refusal{si({"--source", "Zn"}), "unknown anode 'Zn'"},
        Refusal{si({"--source", "Cu:Kc"}), "unknown line 'Kc'"},
        Refusal{si({}), "no radiation given"},
        Refusal{si({"--energy", "8", "--source", "Cu"}), "give only one of"},
        Refusal{{"mu", "--material", "unobtainium", "--energy", "8"}, "unknown material 'unobtainium'"},
        Refusal{si({"--energy", "8", "--table", "henke"}), "henke"},
        Refusal{{"mu", "--formula", "PuO2", "--density", "11.5", "--energy", "20", "--table", "chantler"},
                "Z = 1..92"},
        Refusal{si({"--energy", "8", "--bogus"}), "--bogus"},
        Refusal{si({"--energy"}), "--energy"},
        Refusal{{"frobnicate"}, "frobnicate"},
        Refusal{{}, "no command given"},
        Refusal{{"mu", "--energy", "8"}, "no sample given"},
        Refusal{si({"--energy", "8", "--thickness", "-2mm"}), "must be positive"},
        Refusal{si({"--energy", "8", "--thickness", "2 furlongs"}), "unknown unit"},
        Refusal{{"scan", "--formula", "Si", "--from", "20", "--to", "5"}, "must be below"},
        Refusal{{"scan", "--formula", "Si", "--from", "5", "--to", "20", "--steps", "0"}, "--steps"},
        Refusal{{"scan", "--formula", "Si", "--from", "5", "--to", "20", "--spacing", "cubic"}, "unknown spacing"},
        Refusal{{"scan", "--formula", "Si", "--from", "5", "--to", "900"}, "energy 900 keV is outside"}));

/// The README's example: the block after "<!-- readme-example -->" holds a
/// "$ mudepth ..." line and the exact output it gives.
TEST(CliReadme, ExampleOutputIsCurrent) {
    std::ifstream in(std::string(MUDEPTH_SOURCE_DIR) + "/README.md");
    ASSERT_TRUE(in) << "README.md not found";
    std::string line;
    while (std::getline(in, line) && line != "<!-- readme-example -->") {}
    ASSERT_TRUE(std::getline(in, line));  // the ``` fence
    ASSERT_TRUE(std::getline(in, line));
    ASSERT_EQ(line.rfind("$ mudepth ", 0), 0u) << line;
    const std::string command = std::string(MUDEPTH_BINARY) + line.substr(9);
    std::string expected;
    while (std::getline(in, line) && line.rfind("```", 0) != 0) expected += line + "\n";
    const auto r = run_shell(command);
    EXPECT_EQ(r.status, 0) << r.err;
    EXPECT_EQ(r.out, expected);
}

}  // namespace
}  // namespace mudepth::test
