// End-to-end tests of `mudepth film`: JSON, shares, the bulk limit, layer
// syntax, the plot and refusals.
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <fstream>
#include <numbers>
#include <sstream>

#include "support/process.hpp"

namespace mudepth::test {
namespace {

double rad(double deg) { return deg * std::numbers::pi / 180.0; }

TEST(CliFilm, JsonSharesSumToOneAndSubstrateAttenuation) {
    const auto j = run_json({"film", "--layer", "Al2O3,100nm,3.95", "--layer", "TiN,2um,5.4", "--substrate", "Fe",
                             "--source", "Cu", "--two-theta", "40", "--incidence", "0.1,0.5,2,10", "--json"});
    ASSERT_EQ(j["layers"].size(), 2u);
    EXPECT_NEAR(j["layers"][1]["thickness_um"].get<double>(), 2.0, 1e-12);
    for (const auto& p : j["points"]) {
        double sum = p["substrate_share"].get<double>();
        for (const auto& s : p["layer_shares"]) sum += s.get<double>();
        EXPECT_NEAR(sum, 1.0, 1e-12);
    }
    // Far above every α_c: exp[−Σ μ_j t_j (1/sinα + 1/sinβ)] (REFERENCES, flat plates) [derived];
    // the refracted depth differs from the geometric one by ≈ δ/sin²α (< 0.1% at 10°).
    const auto& p = j["points"][3];
    const double k = 1 / std::sin(rad(10)) + 1 / std::sin(rad(30));
    const double mt = j["layers"][0]["mu_per_cm"].get<double>() * 1e-5 + j["layers"][1]["mu_per_cm"].get<double>() * 2e-4;
    EXPECT_NEAR(p["substrate_attenuation"].get<double>() / std::exp(-mt * k), 1.0, 2e-3);
    // Below the top layer's α_c the evanescent wave stays in the top 100 nm.
    EXPECT_GT(j["points"][0]["layer_shares"][0].get<double>(), 0.999);
}

TEST(CliFilm, ThickLayerIsBulkAndMaterialsByName) {
    // 2 mm of fused silica (Cu Kα 1/e depth tens of µm): all the signal (thicker than 20 depths).
    const auto j = run_json({"film", "--layer", "fused-silica,2mm", "--substrate", "Si", "--source", "Cu",
                             "--two-theta", "20:120:50", "--json"});
    for (const auto& p : j["points"]) EXPECT_NEAR(p["layer_shares"][0].get<double>(), 1.0, 1e-8);
    EXPECT_EQ(j["layers"][0]["name"], "fused-silica");
}

TEST(CliFilm, TwoIdenticalLayersEqualOne) {
    const std::vector<std::string> common{"--substrate", "Fe", "--source", "Cu", "--two-theta", "44", "--incidence", "1", "--json"};
    auto args = std::vector<std::string>{"film", "--layer", "TiN,1um,5.4", "--layer", "TiN,500nm,5.4"};
    args.insert(args.end(), common.begin(), common.end());
    const auto split = run_json(args);
    args = {"film", "--layer", "TiN,1.5um,5.4"};
    args.insert(args.end(), common.begin(), common.end());
    const auto whole = run_json(args);
    const auto& a = split["points"][0]["layer_shares"];
    EXPECT_NEAR(a[0].get<double>() + a[1].get<double>(), whole["points"][0]["layer_shares"][0].get<double>(), 1e-12);
}

TEST(CliFilm, HumanCsvAndPlot) {
    auto r = run_mudepth({"film", "--layer", "TiN,2um,5.4", "--substrate", "Fe", "--source", "Cu", "--two-theta", "30:90:30"});
    ASSERT_EQ(r.status, 0) << r.err;
    EXPECT_NE(r.out.find("L1 TiN (%)"), std::string::npos) << r.out;
    EXPECT_NE(r.out.find("substrate Fe"), std::string::npos);
    r = run_mudepth({"film", "--layer", "TiN,2um,5.4", "--substrate", "Fe", "--source", "Cu", "--two-theta", "30", "--csv"});
    EXPECT_NE(r.out.find("two_theta_deg,incidence_deg,exit_deg,share_layer_1,share_substrate,substrate_attenuation"),
              std::string::npos)
        << r.out;
    const std::string path = ::testing::TempDir() + "/mudepth_film_plot.svg";
    r = run_mudepth({"film", "--layer", "TiN,2um,5.4", "--substrate", "Fe", "--source", "Cu", "--two-theta", "40",
                     "--incidence", "0.1:5:0.1", "--plot", path});
    ASSERT_EQ(r.status, 0) << r.err;
    std::ifstream in(path);
    std::stringstream text;
    text << in.rdbuf();
    EXPECT_NE(text.str().find("incidence angle α (°)"), std::string::npos);
    EXPECT_NE(text.str().find("share of the diffracted signal (fraction)"), std::string::npos);
    if (run_shell("command -v xmllint >/dev/null").status == 0) {
        EXPECT_EQ(run_shell("xmllint --noout '" + path + "'").status, 0);
    }
}

struct Refusal {
    std::vector<std::string> args;
    std::string message;
};
class CliFilmRefusal : public ::testing::TestWithParam<Refusal> {};

TEST_P(CliFilmRefusal, ExitsTwoWithOneLine) {
    const auto& p = GetParam();
    const auto r = run_mudepth(p.args);
    expect_refusal(r, p.message);
}

std::vector<std::string> film(std::vector<std::string> more) {
    std::vector<std::string> a{"film", "--source", "Cu", "--two-theta", "40"};
    a.insert(a.end(), more.begin(), more.end());
    return a;
}

INSTANTIATE_TEST_SUITE_P(
    BadInput, CliFilmRefusal,
    ::testing::Values(
        Refusal{film({"--substrate", "Fe"}), "the film stack is empty"},
        Refusal{film({"--layer", "TiN,2um,5.4"}), "needs --substrate"},
        Refusal{film({"--layer", "TiN,0um,5.4", "--substrate", "Fe"}), "must be positive"},
        Refusal{film({"--layer", "TiN,-2um,5.4", "--substrate", "Fe"}), "must be positive"},
        Refusal{film({"--layer", "TiN,2um", "--substrate", "Fe"}), "give the density of TiN"},
        Refusal{film({"--layer", "TiN", "--substrate", "Fe"}), "expected FORMULA_OR_MATERIAL,THICKNESS"},
        Refusal{film({"--layer", "unobtainium,2um", "--substrate", "Fe"}), "unknown material 'unobtainium'"},
        Refusal{film({"--layer", "TiN,2um,5.4", "--substrate", "Fe", "--incidence", "45"}), "must be below 2θ = 40°"},
        Refusal{film({"--layer", "TiN,2um,5.4", "--substrate", "Fe", "--incidence", "0"}), "must be above 0°"},
        Refusal{{"film", "--source", "Cu", "--two-theta", "190", "--layer", "TiN,2um,5.4", "--substrate", "Fe"},
                "outside (0°, 180°)"}));

}  // namespace
}  // namespace mudepth::test
