// Edges near an energy and fluorescence warnings.
#include "mudepth/edges.hpp"

#include <gtest/gtest.h>

#include "mudepth/formula.hpp"
#include "mudepth/radiation.hpp"

namespace mudepth {
namespace {

Material hematite() { return material_from_formula(parse_formula("Fe2O3"), 5.26); }

TEST(Edges, IronOxideFluorescesUnderCopper) {
    // Common practice: the Fe K edge (7.11 keV) lies below Cu Kα, so iron
    // oxides fluoresce under Cu radiation; Co and Fe radiation avoid it.
    const auto warnings = fluorescence_warnings(hematite(), radiation_from_source("Cu").energy_keV);
    ASSERT_EQ(warnings.size(), 1u);
    const auto& w = warnings[0];
    EXPECT_EQ(w.label, "Fe");
    EXPECT_EQ(w.edge_level, "K");
    EXPECT_EQ(w.line_iupac, "K-L3");
    EXPECT_NEAR(w.line_keV, 6.40, 0.01);  // Fe Kα1 6.404 keV (common practice)
    EXPECT_EQ(w.avoiding_sources, (std::vector<std::string>{"Cr", "Fe", "Co"}));
    EXPECT_NE(w.message.find("Fe fluoresces"), std::string::npos);
}

TEST(Edges, IronOxideIsQuietUnderCobaltAndIron) {
    // Common practice: Co Kα (6.93 keV) and Fe Kα (6.40 keV) lie below the Fe K edge.
    EXPECT_TRUE(fluorescence_warnings(hematite(), radiation_from_source("Co").energy_keV).empty());
    EXPECT_TRUE(fluorescence_warnings(hematite(), radiation_from_source("Fe").energy_keV).empty());
}

TEST(Edges, HeavyElementLShellUnderMolybdenum) {
    // Pb L3 edge 13.04 keV lies below Mo Kα 17.4 keV while the K edge (88 keV) does not:
    // an L3 warning with the Lα1 (L3-M5) line near 10.55 keV (common practice).
    const Material m = material_from_formula(parse_formula("PbO"), 9.53);
    const auto warnings = fluorescence_warnings(m, radiation_from_source("Mo").energy_keV);
    ASSERT_EQ(warnings.size(), 1u);
    EXPECT_EQ(warnings[0].edge_level, "L3");
    EXPECT_EQ(warnings[0].line_iupac, "L3-M5");
    EXPECT_NEAR(warnings[0].line_keV, 10.55, 0.02);
}

TEST(Edges, LightElementsNeverWarn) {
    // O, Si, Al K lines lie below 2 keV and are absorbed before the detector.
    const Material m = material_from_formula(parse_formula("Al2SiO5"), 3.1);
    EXPECT_TRUE(fluorescence_warnings(m, 8.04).empty());
}

TEST(Edges, NearbyEdgesWindow) {
    const Material cu = material_from_formula(parse_formula("Cu"), 8.96);
    // Cu K edge 8.979 keV lies within +1 keV of 8.048 keV (window −2/+1 keV).
    const auto near = edges_near(cu, 8.048);
    ASSERT_EQ(near.size(), 1u);
    EXPECT_EQ(near[0].level, "K");
    EXPECT_TRUE(edges_near(cu, 6.0).empty());
    const auto crossed = edges_between(cu, 0.5, 10.0);
    EXPECT_EQ(crossed.back().level, "K");
}

}  // namespace
}  // namespace mudepth
