// End-to-end tests of `mudepth plan`.
#include <gtest/gtest.h>

#include "support/process.hpp"

namespace mudepth::test {
namespace {

TEST(CliPlan, JsonContract) {
    const auto j = run_json({"plan", "--formula", "SiO2", "--density", "2.65", "--packing", "0.55", "--source", "Cu",
                             "--json"});
    ASSERT_TRUE(j.contains("recommended_diameter_mm"));  // SPEC §3
    EXPECT_EQ(j["capillaries"].size(), 9u);
    EXPECT_EQ(j["sources"].size(), 6u);
    // Quartz powder at Cu Kα: μ ≈ 55 1/cm, μR ≤ 1 up to 0.3 mm (μR 0.83) (computed by hand from μ).
    const double mu = j["linear_attenuation_per_cm"].get<double>();
    double expected = 0.1;
    for (double d : {0.1, 0.2, 0.3, 0.4, 0.5, 0.7, 1.0, 1.5, 2.0})
        if (mu * d / 20 <= 1.0) expected = d;
    EXPECT_DOUBLE_EQ(j["recommended_diameter_mm"].get<double>(), expected);
    EXPECT_TRUE(j["dilution"].is_null());
}

TEST(CliPlan, NoPackingSaysWhatLoosePowderChanges) {
    const auto r = run_mudepth({"plan", "--formula", "CeO2", "--density", "7.215", "--source", "Mo"});
    EXPECT_EQ(r.status, 0) << r.err;
    EXPECT_NE(r.out.find("0.5–0.6"), std::string::npos);
    EXPECT_NE(r.out.find("Cautions"), std::string::npos);
}

TEST(CliPlan, Refusals) {
    struct Case {
        std::vector<std::string> args;
        std::string message;
    };
    const std::vector<std::string> base{"plan", "--formula", "SiO2", "--density", "2.2", "--source", "Cu"};
    auto with = [&](std::vector<std::string> more) {
        auto a = base;
        a.insert(a.end(), more.begin(), more.end());
        return a;
    };
    for (const auto& c : {Case{with({"--target-mu-r", "0"}), "must be positive"},
                          Case{with({"--target-mu-r", "-1"}), "must be positive"},
                          Case{with({"--packing", "1.2"}), "packing fraction 1.2 is outside (0, 1]"},
                          Case{with({"--diluent", "unobtainium"}), "unknown material 'unobtainium'"},
                          Case{{"plan", "--formula", "SiO2", "--density", "2.2", "--packing", "0.5", "--source", "Cu",
                                "--target-mu-r", "0.001", "--diluent", "ceo2"},
                               "absorbs at least as much as the sample"},
                          Case{with({"--two-theta-max", "190"}), "must lie in (0, 180)"},
                          Case{{"plan", "--formula", "SiO2", "--density", "2.2"}, "no radiation given"}}) {
        const auto r = run_mudepth(c.args);
        EXPECT_EQ(r.status, 2) << c.message << ": " << r.out;
        EXPECT_TRUE(r.out.empty());
        EXPECT_EQ(r.err.rfind("mudepth: error: ", 0), 0u) << r.err;
        EXPECT_NE(r.err.find(c.message), std::string::npos) << r.err;
    }
}

}  // namespace
}  // namespace mudepth::test
