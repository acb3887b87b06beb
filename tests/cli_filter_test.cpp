// End-to-end tests of `mudepth filter`.
#include <gtest/gtest.h>

#include "support/process.hpp"

namespace mudepth::test {
namespace {

TEST(CliFilter, CopperJson) {
    const auto j = run_json({"filter", "--anode", "Cu", "--json"});
    EXPECT_EQ(j["anode"], "Cu");
    EXPECT_EQ(j["filter"]["symbol"], "Ni");  // common practice
    EXPECT_NEAR(j["filter"]["kbeta_kalpha_ratio"].get<double>(), 0.01, 1e-9);  // the default target
    const double t_um = j["filter"]["thickness_um"].get<double>();
    EXPECT_GT(t_um, 5.0);  // common practice: Ni Kβ filters are some 10-25 µm
    EXPECT_LT(t_um, 30.0);
}

TEST(CliFilter, GivenThickness) {
    const auto j = run_json({"filter", "--anode", "Cu", "--thickness", "20um", "--json"});
    EXPECT_NEAR(j["filter"]["thickness_um"].get<double>(), 20.0, 1e-9);
    // Cullity (from memory): ~40% of Cu Kα through 20 µm Ni.
    EXPECT_NEAR(j["filter"]["kalpha_transmission"].get<double>(), 0.4, 0.08);
}

TEST(CliFilter, AllAnodesTable) {
    const auto r = run_mudepth({"filter"});
    EXPECT_EQ(r.status, 0) << r.err;
    for (const char* s : {"Cr", "Fe", "Co", "Cu", "Mo", "Ag", "Zr", "Ni", "Cautions"})
        EXPECT_NE(r.out.find(s), std::string::npos) << s;
}

TEST(CliFilter, Refusals) {
    struct Case {
        std::vector<std::string> args;
        std::string message;
    };
    for (const auto& c : {Case{{"filter", "--anode", "Zn"}, "unknown anode 'Zn'"},
                          Case{{"filter", "--anode", "Cu", "--ratio", "0.5"}, "no filter is needed"},
                          Case{{"filter", "--anode", "Cu", "--ratio", "-1"}, "must be positive"},
                          Case{{"filter", "--anode", "Cu", "--element", "Fe"}, "does not lie between"},
                          Case{{"filter", "--anode", "Cu", "--element", "Qq"}, "unknown element 'Qq'"},
                          Case{{"filter", "--element", "Ni"}, "--element needs --anode"},
                          Case{{"filter", "--anode", "Cu", "--thickness", "0"}, "must be positive"},
                          Case{{"filter", "--anode", "Cu", "--thickness", "20um", "--ratio", "0.5"}, "not both"},
                          Case{{"filter", "--anode", "Cu", "--ratio", "1e-300"}, "with less than 1 mm of foil"}}) {
        const auto r = run_mudepth(c.args);
        EXPECT_EQ(r.status, 2) << c.message;
        EXPECT_TRUE(r.out.empty());
        EXPECT_EQ(r.err.rfind("mudepth: error: ", 0), 0u) << r.err;
        EXPECT_NE(r.err.find(c.message), std::string::npos) << r.err;
    }
}

}  // namespace
}  // namespace mudepth::test
