// End-to-end tests of `mudepth cylinder`: the JSON contract, the material route,
// the container wall, CSV, the plot, and every refusal.
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <fstream>
#include <sstream>

#include "mudepth/cylinder.hpp"
#include "support/process.hpp"

namespace mudepth::test {
namespace {

TEST(CliCylinder, JsonContractDirect) {
    const auto j = run_json({"cylinder", "--mu-r", "1.5", "--two-theta", "0,90,180", "--json"});
    EXPECT_DOUBLE_EQ(j["mu_R"].get<double>(), 1.5);
    ASSERT_EQ(j["points"].size(), 3u);
    for (const auto& p : j["points"]) {
        for (const char* k : {"two_theta_deg", "transmission", "correction"}) EXPECT_TRUE(p.contains(k)) << k;
        EXPECT_FALSE(p.contains("A_s_sc"));
        EXPECT_NEAR(p["correction"].get<double>() * p["transmission"].get<double>(), 1, 1e-14);
        EXPECT_DOUBLE_EQ(p["transmission"].get<double>(), cylinder_transmission(1.5, p["two_theta_deg"].get<double>()));
    }
}

TEST(CliCylinder, DefaultAnglesAndMaterialRoute) {
    const auto j = run_json({"cylinder", "--formula", "SiO2", "--density", "2.2", "--packing", "0.5", "--source", "Cu",
                             "--diameter", "0.5", "--json"});
    ASSERT_EQ(j["points"].size(), 30u);  // default 5:150:5
    EXPECT_DOUBLE_EQ(j["points"][0]["two_theta_deg"].get<double>(), 5);
    // μR = μ × radius with μ from `mudepth mu` of the same sample (same program, another command).
    const auto mu = run_json({"mu", "--formula", "SiO2", "--density", "2.2", "--packing", "0.5", "--source", "Cu", "--json"});
    EXPECT_NEAR(j["mu_R"].get<double>(), mu["linear_attenuation_per_cm"].get<double>() * 0.025, 1e-12);
    EXPECT_NEAR(j["diameter_mm"].get<double>(), 0.5, 1e-12);
}

TEST(CliCylinder, ContainerFactorsBothRoutes) {
    const auto d = run_json({"cylinder", "--mu-r", "0.8", "--mu-r-container", "0.2", "--radius-ratio", "1.1",
                             "--two-theta", "10:170:40", "--json"});
    ASSERT_EQ(d["points"].size(), 5u);
    for (const auto& p : d["points"]) {
        for (const char* k : {"A_s_s", "A_s_sc", "A_c_sc", "A_c_c"}) EXPECT_TRUE(p.contains(k)) << k;
        const auto f = container_factors(0.8, 0.2, 1.1, p["two_theta_deg"].get<double>());
        EXPECT_NEAR(p["A_s_sc"].get<double>() / f.A_s_sc, 1, 1e-12);
        EXPECT_NEAR(p["A_c_c"].get<double>() / f.A_c_c, 1, 1e-12);
        EXPECT_DOUBLE_EQ(p["transmission"].get<double>(), p["A_s_s"].get<double>());
        EXPECT_LT(p["A_s_sc"].get<double>(), p["A_s_s"].get<double>());  // the wall only absorbs more
    }
    const auto m = run_json({"cylinder", "--material", "si", "--packing", "0.5", "--source", "Mo", "--diameter", "0.3",
                             "--container-material", "borosilicate-3.3", "--wall", "10um", "--json"});
    EXPECT_NEAR(m["container"]["radius_ratio"].get<double>(), (0.15 + 0.01) / 0.15, 1e-12);
    EXPECT_NEAR(m["container"]["wall_um"].get<double>(), 10, 1e-9);
    EXPECT_NEAR(m["container"]["mu_R_container"].get<double>(), m["container"]["mu_per_cm"].get<double>() * 0.015, 1e-12);
    EXPECT_TRUE(m["points"][0].contains("A_c_sc"));
}

TEST(CliCylinder, CsvTableAndPlot) {
    const auto csv = run_mudepth({"cylinder", "--mu-r", "1", "--two-theta", "20,40", "--csv"});
    EXPECT_EQ(csv.status, 0);
    EXPECT_NE(csv.out.find("two_theta_deg,transmission,correction\n20,"), std::string::npos) << csv.out;
    const auto human = run_mudepth({"cylinder", "--mu-r", "1", "--two-theta", "20"});
    EXPECT_NE(human.out.find("A* = 1/A"), std::string::npos);
    const auto help = run_mudepth({"cylinder", "--help"});
    EXPECT_NE(help.out.find("radiation-protection"), std::string::npos);  // cautions in the footer
    EXPECT_NE(help.out.find("5:150:5"), std::string::npos);
    const std::string path = ::testing::TempDir() + "/mudepth_cylinder_plot.svg";
    std::remove(path.c_str());
    const auto r = run_mudepth({"cylinder", "--mu-r", "2", "--mu-r-container", "0.3", "--radius-ratio", "1.2",
                                "--two-theta", "0:180:2", "--plot", path});
    ASSERT_EQ(r.status, 0) << r.err;
    std::ifstream in(path);
    std::stringstream text;
    text << in.rdbuf();
    EXPECT_NE(text.str().find("2θ (degrees)"), std::string::npos);
    EXPECT_NE(text.str().find("A_c,sc"), std::string::npos);
    std::remove(path.c_str());
}

struct Refusal {
    std::vector<std::string> args;
    std::string message;
};

class CliCylinderRefusal : public ::testing::TestWithParam<Refusal> {};

TEST_P(CliCylinderRefusal, ExitsTwoWithOneLine) {
    const auto& p = GetParam();
    const auto r = run_mudepth(p.args);
    expect_refusal(r, p.message);
}

const std::vector<std::string> kFe{"cylinder", "--formula", "Fe2O3", "--density", "5.24", "--source", "Cu"};
std::vector<std::string> fe(std::vector<std::string> more) {
    auto a = kFe;
    a.insert(a.end(), more.begin(), more.end());
    return a;
}

INSTANTIATE_TEST_SUITE_P(
    BadInput, CliCylinderRefusal,
    ::testing::Values(
        Refusal{{"cylinder", "--mu-r", "0"}, "must be positive"},
        Refusal{{"cylinder", "--mu-r", "-2"}, "must be positive"},
        Refusal{{"cylinder", "--mu-r", "31"}, "above 30"},
        Refusal{{"cylinder", "--mu-r", "abc"}, "--mu-r: 'abc' is not a number"},
        Refusal{fe({"--diameter", "2mm"}), "above 30"},  // Fe2O3 at Cu Kα, 2 mm: μR far above 30
        Refusal{fe({"--diameter", "0"}), "must be positive"},
        Refusal{fe({"--diameter", "-0.3"}), "must be positive"},
        Refusal{fe({}), "needs --diameter"},
        Refusal{{"cylinder"}, "no sample given"},
        Refusal{{"cylinder", "--mu-r", "1", "--diameter", "0.3"}, "either --mu-r or --diameter"},
        Refusal{{"cylinder", "--mu-r", "1", "--two-theta", "-5:20:5"}, "outside 0..180"},
        Refusal{{"cylinder", "--mu-r", "1", "--two-theta", "190"}, "outside 0..180"},
        Refusal{{"cylinder", "--mu-r", "1", "--mu-r-container", "0.1", "--radius-ratio", "1"}, "must be above 1"},
        Refusal{{"cylinder", "--mu-r", "1", "--mu-r-container", "0.1", "--radius-ratio", "0.8"}, "must be above 1"},
        Refusal{{"cylinder", "--mu-r", "1", "--mu-r-container", "0.1"}, "--radius-ratio"},
        Refusal{{"cylinder", "--mu-r", "1", "--mu-r-container", "-1", "--radius-ratio", "1.1"}, "zero or positive"},
        Refusal{{"cylinder", "--mu-r", "1", "--container-material", "fused-silica", "--wall", "10um"}, "--diameter"},
        Refusal{fe({"--diameter", "0.1", "--container-material", "fused-silica"}), "--wall"},
        Refusal{fe({"--diameter", "0.1", "--container-material", "unobtainium", "--wall", "10um"}), "unknown material"},
        Refusal{fe({"--diameter", "0.1", "--container-material", "fused-silica", "--wall", "-1um"}), "must be positive"}));

}  // namespace
}  // namespace mudepth::test
