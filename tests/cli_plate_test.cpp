// End-to-end tests of `mudepth plate`: JSON for each mode, the material route,
// windows, infinite thickness, CSV, the plot, and every refusal.
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <fstream>
#include <numbers>

#include "support/process.hpp"

namespace mudepth::test {
namespace {

constexpr double kDeg = std::numbers::pi / 180;

TEST(CliPlate, JsonForEachMode) {
    // Closed forms (ITC C Table 6.3.3.1) at μt = 0.5.
    const double mt = 0.5;
    struct Mode {
        const char* name;
        double (*want)(double mt, double tt);
    };
    const Mode modes[] = {
        {"reflection", [](double m, double tt) { return 1 - std::exp(-2 * m / std::sin(tt / 2 * kDeg)); }},
        {"transmission-symmetric", [](double m, double tt) { return std::exp(-m / std::cos(tt / 2 * kDeg)); }},
        {"transmission-normal", [](double m, double tt) {
             const double s = 1 / std::cos(tt * kDeg);
             return (std::exp(-m) - std::exp(-m * s)) / (m * (s - 1));
         }}};
    for (const auto& m : modes) {
        const auto j = run_json({"plate", "--mu-t", "0.5", "--mode", m.name, "--two-theta", "10,40,70", "--json"});
        EXPECT_EQ(j["mode"], m.name);
        ASSERT_EQ(j["points"].size(), 3u);
        for (const auto& p : j["points"]) {
            for (const char* k : {"two_theta_deg", "transmission", "correction"}) EXPECT_TRUE(p.contains(k)) << k;
            const double tt = p["two_theta_deg"].get<double>();
            EXPECT_NEAR(p["transmission"].get<double>() / m.want(mt, tt), 1, 1e-9) << m.name << " " << tt;
            EXPECT_NEAR(p["correction"].get<double>() * p["transmission"].get<double>(), 1, 1e-14);
        }
    }
}

TEST(CliPlate, InfiniteThicknessAndFixedIncidence) {
    const auto j = run_json({"plate", "--mu-t", "1", "--two-theta", "20:100:40", "--json"});
    ASSERT_EQ(j["infinite_thickness"].size(), 2u);
    // The largest over the range, at 2θ = 100°: ln(1/(1−f)) sinθ/2 (Cullity's form).
    EXPECT_NEAR(j["infinite_thickness"][0]["mu_t"].get<double>(), std::log(100.0) * std::sin(50 * kDeg) / 2, 1e-12);
    const auto f = run_json({"plate", "--mu-t", "0.2", "--incidence", "5", "--json"});
    EXPECT_DOUBLE_EQ(f["points"][0]["two_theta_deg"].get<double>(), 10);  // defaults above the incidence
    const double want = 1 - std::exp(-0.2 * (1 / std::sin(5 * kDeg) + 1 / std::sin(5 * kDeg)));
    EXPECT_NEAR(f["points"][0]["transmission"].get<double>(), want, 1e-12);
}

TEST(CliPlate, MaterialRouteWithWindows) {
    const auto j = run_json({"plate", "--formula", "NaCl", "--density", "2.165", "--packing", "0.6", "--source", "Mo",
                             "--thickness", "0.5", "--mode", "transmission-normal", "--window-material", "polyimide",
                             "--window-thickness", "25um", "--two-theta", "5:45:20", "--json"});
    const double mu = j["mu_per_cm"].get<double>();
    EXPECT_NEAR(j["mu_t"].get<double>(), mu * 0.05, 1e-12);
    const double w = j["window"]["mu_t"].get<double>();
    EXPECT_EQ(j["window"]["foils"].get<int>(), 2);
    for (const auto& p : j["points"]) {
        const double tt = p["two_theta_deg"].get<double>();
        // Beer-Lambert through the entry foil and the exit foil.
        EXPECT_NEAR(p["window_transmission"].get<double>(), std::exp(-w) * std::exp(-w / std::cos(tt * kDeg)), 1e-12);
        EXPECT_NEAR(p["transmission"].get<double>(), p["sample_transmission"].get<double>() * p["window_transmission"].get<double>(), 1e-15);
        EXPECT_NEAR(p["optimum_thickness_um"].get<double>(), p["optimum_mu_t"].get<double>() / mu * 1e4, 1e-9);
    }
    const auto d = run_json({"plate", "--mu-t", "1", "--mode", "transmission-normal", "--json"});
    EXPECT_EQ(d["points"].size(), 17u);  // default 5:85:5 for the normal-beam plate
}

TEST(CliPlate, CsvHelpAndPlot) {
    const auto csv = run_mudepth({"plate", "--mu-t", "1", "--two-theta", "30", "--csv"});
    EXPECT_NE(csv.out.find("two_theta_deg,transmission,correction\n30,"), std::string::npos) << csv.out;
    const auto help = run_mudepth({"plate", "--help"});
    EXPECT_NE(help.out.find("radiation-protection"), std::string::npos);
    EXPECT_NE(help.out.find("5:150:5"), std::string::npos);
    const std::string path = ::testing::TempDir() + "/mudepth_plate_plot.svg";
    std::remove(path.c_str());
    const auto r = run_mudepth({"plate", "--mu-t", "0.3", "--plot", path});
    ASSERT_EQ(r.status, 0) << r.err;
    std::ifstream in(path);
    EXPECT_TRUE(in.good());
    std::remove(path.c_str());
}

struct Refusal {
    std::vector<std::string> args;
    std::string message;
};

class CliPlateRefusal : public ::testing::TestWithParam<Refusal> {};

TEST_P(CliPlateRefusal, ExitsTwoWithOneLine) {
    const auto& p = GetParam();
    const auto r = run_mudepth(p.args);
    expect_refusal(r, p.message);
}

INSTANTIATE_TEST_SUITE_P(
    BadInput, CliPlateRefusal,
    ::testing::Values(
        Refusal{{"plate", "--mu-t", "0"}, "must be positive"},
        Refusal{{"plate", "--mu-t", "-1"}, "must be positive"},
        Refusal{{"plate", "--formula", "Si", "--source", "Cu", "--thickness", "0"}, "must be positive"},
        Refusal{{"plate", "--formula", "Si", "--source", "Cu", "--thickness", "-1mm"}, "must be positive"},
        Refusal{{"plate", "--formula", "Si", "--source", "Cu"}, "needs --thickness"},
        Refusal{{"plate", "--mu-t", "1", "--mode", "sideways"}, "unknown plate mode 'sideways'"},
        Refusal{{"plate", "--mu-t", "1", "--mode", "transmission-normal", "--two-theta", "95"}, "below 90"},
        Refusal{{"plate", "--mu-t", "1", "--mode", "transmission-symmetric", "--two-theta", "180"}, "below 180"},
        Refusal{{"plate", "--mu-t", "1", "--two-theta", "-5"}, "outside 0..180"},
        Refusal{{"plate", "--mu-t", "1", "--two-theta", "185"}, "outside 0..180"},
        Refusal{{"plate", "--mu-t", "1", "--two-theta", "0"}, "2θ above 0"},
        Refusal{{"plate", "--mu-t", "1", "--incidence", "35", "--two-theta", "30"}, "incidence 35° must be below 2θ = 30°"},
        Refusal{{"plate", "--mu-t", "1", "--incidence", "5", "--mode", "transmission-symmetric"}, "reflection only"},
        Refusal{{"plate", "--mu-t", "1", "--mu-t-window", "0"}, "must be positive"},
        Refusal{{"plate", "--mu-t", "1", "--window-material", "polyimide"}, "no radiation given"},
        Refusal{{"plate", "--mu-t", "1", "--source", "Cu", "--window-material", "polyimide"}, "--window-thickness"},
        Refusal{{"plate"}, "no sample given"}));

}  // namespace
}  // namespace mudepth::test
