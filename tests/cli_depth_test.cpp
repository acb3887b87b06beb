// End-to-end tests of `mudepth depth`: the SPEC §3 JSON, closed forms through
// the binary, refraction reporting, the inverse, CSV, the plot and refusals.
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

TEST(CliDepth, JsonContractSymmetricWithMu) {
    const auto j = run_json({"depth", "--mu", "148.6", "--two-theta", "20:140:20", "--json"});
    EXPECT_DOUBLE_EQ(j["mu_per_cm"].get<double>(), 148.6);
    EXPECT_FALSE(j["refraction_applied"].get<bool>());
    EXPECT_TRUE(j["delta"].is_null());
    ASSERT_EQ(j["points"].size(), 7u);
    for (const auto& p : j["points"]) {
        for (const char* key : {"two_theta_deg", "depth_1e_um", "depth_fraction_um", "incidence_deg", "exit_deg"})
            ASSERT_TRUE(p.contains(key)) << key;
        const double tt = p["two_theta_deg"].get<double>();
        // D1: sinθ/(2μ) and ln(1/(1−0.9)) sinθ/(2μ) (ITC C Table 6.3.3.1; Cullity).
        const double d = std::sin(rad(tt / 2)) / (2 * 148.6) * 1e4;
        EXPECT_NEAR(p["depth_1e_um"].get<double>() / d, 1.0, 1e-9);
        EXPECT_NEAR(p["depth_fraction_um"].get<double>() / (std::log(10.0) * d), 1.0, 1e-9);
        EXPECT_DOUBLE_EQ(p["incidence_deg"].get<double>(), tt / 2);
    }
}

TEST(CliDepth, FixedIncidenceAndTiltsClosedForms) {
    // D2 (ITC C Table 6.3.3.1) and D4 (Noyan & Cohen 1987; Genzel 1994), 1e-9 relative.
    const double mu = 420.0;
    auto j = run_json({"depth", "--mu", "420", "--two-theta", "30,60,90", "--incidence", "5", "--fraction", "0.5", "--json"});
    for (const auto& p : j["points"]) {
        const double tt = p["two_theta_deg"].get<double>();
        const double d = 1e4 / (mu * (1 / std::sin(rad(5)) + 1 / std::sin(rad(tt - 5))));
        EXPECT_NEAR(p["depth_1e_um"].get<double>() / d, 1.0, 1e-9);
        EXPECT_NEAR(p["depth_fraction_um"].get<double>() / (std::log(2.0) * d), 1.0, 1e-9);
        EXPECT_DOUBLE_EQ(p["exit_deg"].get<double>(), tt - 5);
    }
    j = run_json({"depth", "--mu", "420", "--two-theta", "156", "--tilt", "0:60:15", "--json"});
    ASSERT_EQ(j["points"].size(), 5u);
    for (const auto& p : j["points"]) {
        const double psi = p["tilt_deg"].get<double>();
        EXPECT_NEAR(p["depth_1e_um"].get<double>() / (std::sin(rad(78)) * std::cos(rad(psi)) / (2 * mu) * 1e4), 1.0, 1e-9);
    }
    j = run_json({"depth", "--mu", "420", "--two-theta", "156", "--tilt", "0:60:15", "--tilt-mode", "omega", "--json"});
    for (const auto& p : j["points"]) {
        const double psi = p["tilt_deg"].get<double>(), s = std::sin(rad(78));
        const double d = (s * s - std::pow(std::sin(rad(psi)), 2)) / (2 * mu * s * std::cos(rad(psi))) * 1e4;
        EXPECT_NEAR(p["depth_1e_um"].get<double>() / d, 1.0, 1e-9);
    }
}

TEST(CliDepth, GrazingScanWithRefraction) {
    const auto j = run_json({"depth", "--formula", "Si", "--source", "Cu", "--two-theta", "28.44", "--incidence",
                             "0.02:1:0.02", "--json"});
    EXPECT_TRUE(j["refraction_applied"].get<bool>());
    // Common practice: α_c(Si, Cu Kα) ≈ 0.22°, minimum depth ≈ 3 nm.
    EXPECT_NEAR(j["critical_angle_deg"].get<double>(), 0.22, 0.01);
    EXPECT_GT(j["beta"].get<double>(), 0);
    const auto& pts = j["points"];
    ASSERT_EQ(pts.size(), 50u);
    EXPECT_NEAR(pts[0]["depth_1e_um"].get<double>() * 1e3, 3.0, 0.5);
    for (std::size_t i = 1; i < pts.size(); ++i)
        EXPECT_GT(pts[i]["depth_1e_um"].get<double>(), pts[i - 1]["depth_1e_um"].get<double>());
    // Far above α_c it approaches D2 with the same μ (relative difference ≈ δ/sin²α, derived).
    const auto& last = pts.back();
    const double mu = j["mu_per_cm"].get<double>();
    const double d2 = 1e4 / (mu * (1 / std::sin(rad(1.0)) + 1 / std::sin(rad(27.44))));
    EXPECT_NEAR(last["depth_1e_um"].get<double>() / d2, 1.0, 0.05);
}

TEST(CliDepth, InverseReportsReachableAndUnreachable) {
    auto j = run_json({"depth", "--mu", "150", "--two-theta", "40,80", "--target-depth", "2um", "--json"});
    for (const auto& p : j["points"]) {
        EXPECT_TRUE(p["reachable"].get<bool>());
        EXPECT_NEAR(p["depth_1e_um"].get<double>(), 2.0, 2e-8);
        // Back through D2: the incidence found gives 2 µm (ITC C Table 6.3.3.1).
        const double a = p["incidence_deg"].get<double>(), tt = p["two_theta_deg"].get<double>();
        EXPECT_NEAR(1e4 / (150 * (1 / std::sin(rad(a)) + 1 / std::sin(rad(tt - a)))), 2.0, 2e-8);
    }
    j = run_json({"depth", "--formula", "Si", "--source", "Cu", "--two-theta", "30", "--target-depth", "1nm", "--json"});
    const auto& p = j["points"][0];
    EXPECT_FALSE(p["reachable"].get<bool>());
    EXPECT_TRUE(p["incidence_deg"].is_null());
    EXPECT_NE(p["note"].get<std::string>().find("shallower than the evanescent minimum"), std::string::npos);
    EXPECT_GT(p["min_depth_um"].get<double>(), 0.002);
    const auto r = run_mudepth({"depth", "--mu", "150", "--two-theta", "30", "--target-depth", "1mm"});
    EXPECT_EQ(r.status, 0);
    EXPECT_NE(r.out.find("deeper than the symmetric maximum"), std::string::npos) << r.out;
    // The tilt instead of the incidence.
    j = run_json({"depth", "--mu", "150", "--two-theta", "150", "--target-depth", "10um", "--tilt-mode", "side", "--json"});
    const double psi = j["points"][0]["tilt_deg"].get<double>();
    EXPECT_NEAR(std::sin(rad(75)) * std::cos(rad(psi)) / 300 * 1e4, 10.0, 1e-7);
}

TEST(CliDepth, TransparencyShift) {
    // Δ2θ = −sin2θ/(2μR) for a thick sample (Wilson 1963; Klug & Alexander 1974) [from memory].
    const auto j = run_json({"depth", "--mu", "10", "--two-theta", "30,90", "--goniometer-radius", "240mm", "--json"});
    for (const auto& p : j["points"]) {
        const double tt = p["two_theta_deg"].get<double>();
        EXPECT_NEAR(p["peak_shift_deg"].get<double>() / (-std::sin(rad(tt)) / (2 * 10 * 24.0) * 180 / std::numbers::pi),
                    1.0, 1e-9);
    }
    // Thin transparent layer: −t cosθ/R [derived].
    const auto t = run_json({"depth", "--mu", "0.001", "--two-theta", "60", "--goniometer-radius", "200",
                             "--thickness", "0.1mm", "--json"});
    EXPECT_NEAR(t["points"][0]["peak_shift_deg"].get<double>() / (-0.01 * std::cos(rad(30)) / 20 * 180 / std::numbers::pi),
                1.0, 1e-4);
}

TEST(CliDepth, HumanTableUnitAndCsv) {
    auto r = run_mudepth({"depth", "--formula", "Si", "--source", "Cu", "--two-theta", "28.44", "--incidence", "0.05:0.2:0.05"});
    ASSERT_EQ(r.status, 0) << r.err;
    EXPECT_NE(r.out.find("1/e depth (nm)"), std::string::npos) << r.out;
    EXPECT_NE(r.out.find("α_c = 0.22"), std::string::npos) << r.out;
    r = run_mudepth({"depth", "--mu", "10", "--two-theta", "20:40:10"});
    EXPECT_NE(r.out.find("1/e depth (µm)"), std::string::npos) << r.out;
    EXPECT_NE(r.out.find("refraction") == std::string::npos ? r.out.find("not applied") : 0, std::string::npos);
    r = run_mudepth({"depth", "--mu", "0.5", "--two-theta", "20:40:10"});
    EXPECT_NE(r.out.find("1/e depth (mm)"), std::string::npos) << r.out;
    r = run_mudepth({"depth", "--mu", "100", "--two-theta", "20:40:10", "--csv"});
    ASSERT_EQ(r.status, 0);
    EXPECT_NE(r.out.find("two_theta_deg,incidence_deg,exit_deg,depth_1e_um,depth_fraction_um\n20,10,10,"),
              std::string::npos)
        << r.out;
}

TEST(CliDepth, PlotIsValidSvgWithUnits) {
    const std::string path = ::testing::TempDir() + "/mudepth_depth_plot.svg";
    const auto r = run_mudepth({"depth", "--formula", "Si", "--source", "Cu", "--two-theta", "28.44", "--incidence",
                                "0.02:2:0.02", "--plot", path});
    ASSERT_EQ(r.status, 0) << r.err;
    std::ifstream in(path);
    std::stringstream text;
    text << in.rdbuf();
    const std::string svg = text.str();
    EXPECT_NE(svg.find("incidence angle α (°)"), std::string::npos);
    EXPECT_TRUE(svg.find("depth (nm)") != std::string::npos || svg.find("depth (µm)") != std::string::npos);
    EXPECT_NE(svg.find("α_c"), std::string::npos);
    // xmllint (libxml2-utils) checks it is well-formed XML when installed.
    if (run_shell("command -v xmllint >/dev/null").status == 0) {
        EXPECT_EQ(run_shell("xmllint --noout '" + path + "'").status, 0);
    }
}

struct Refusal {
    std::vector<std::string> args;
    std::string message;
};

class CliDepthRefusal : public ::testing::TestWithParam<Refusal> {};

TEST_P(CliDepthRefusal, ExitsTwoWithOneLine) {
    const auto& p = GetParam();
    const auto r = run_mudepth(p.args);
    expect_refusal(r, p.message);
}

std::vector<std::string> mu(std::vector<std::string> more) {
    std::vector<std::string> a{"depth", "--mu", "100"};
    a.insert(a.end(), more.begin(), more.end());
    return a;
}

INSTANTIATE_TEST_SUITE_P(
    BadInput, CliDepthRefusal,
    ::testing::Values(
        Refusal{mu({"--two-theta", "30", "--incidence", "35"}), "incidence 35° must be below 2θ = 30°"},
        Refusal{mu({"--two-theta", "30", "--incidence", "0"}), "incidence 0° must be above 0°"},
        Refusal{mu({"--two-theta", "30", "--incidence", "-1"}), "must be above 0°"},
        Refusal{mu({"--two-theta", "180"}), "2θ = 180° is outside (0°, 180°)"},
        Refusal{mu({"--two-theta", "0"}), "outside (0°, 180°)"},
        Refusal{mu({"--two-theta", "30", "--fraction", "1"}), "--fraction 1 is outside (0, 1)"},
        Refusal{mu({"--two-theta", "30", "--fraction", "0"}), "is outside (0, 1)"},
        Refusal{mu({"--two-theta", "30", "--thickness", "-1um"}), "must be positive"},
        Refusal{mu({"--two-theta", "30", "--goniometer-radius", "0"}), "must be positive"},
        Refusal{mu({"--two-theta", "30", "--target-depth", "0nm"}), "must be positive"},
        Refusal{mu({"--two-theta", "30", "--goniometer-radius", "240", "--incidence", "3"}), "symmetric"},
        Refusal{mu({"--two-theta", "30", "--tilt", "20", "--tilt-mode", "omega"}), "smaller in size than θ = 15°"},
        Refusal{mu({"--two-theta", "30", "--tilt", "5", "--tilt-mode", "chi"}), "not side or omega"},
        Refusal{mu({"--two-theta", "30,40", "--incidence", "1,2"}), "needs a single --two-theta"},
        Refusal{mu({"--two-theta", "30", "--incidence", "1", "--tilt", "2"}), "either --incidence or --tilt"},
        Refusal{mu({"--two-theta", "30", "--target-depth", "1um", "--incidence", "2"}), "solves for the angle"},
        Refusal{mu({"--two-theta", "30", "--plot", "/tmp/x.svg"}), "at least two angles"},
        Refusal{mu({}), "needs --two-theta"},
        Refusal{{"depth", "--mu", "-3", "--two-theta", "30"}, "must be positive"},
        Refusal{{"depth", "--mu", "10", "--formula", "Si", "--two-theta", "30"}, "either --mu or the sample"},
        Refusal{{"depth", "--mu", "10", "--source", "Cu", "--two-theta", "30"}, "leave out --energy"},
        Refusal{{"depth", "--formula", "Si", "--two-theta", "30"}, "no radiation given"}));

}  // namespace
}  // namespace mudepth::test
