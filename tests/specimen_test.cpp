// Specimens: μR of a capillary and μt of a plate (with wall and windows) from a
// material, against xraylib's compound cross sections; the direct routes; refusals.
#include <gtest/gtest.h>

#include <xraylib/xraylib.h>

#include "mudepth/error.hpp"
#include "mudepth/formula.hpp"
#include "mudepth/specimen.hpp"
#include "support/input_error.hpp"

namespace mudepth {
namespace {

Material powder(const char* formula, double density_g_cm3, double packing = 1.0) {
    return material_from_formula(parse_formula(formula), density_g_cm3, packing);
}

/// μ (1/cm) from xraylib 4.0.0 CS_Total_CP (cm²/g) × density.
double xraylib_mu_per_cm(const char* formula, double energy_keV, double density_g_cm3) {
    return CS_Total_CP(formula, energy_keV, nullptr) * density_g_cm3;
}

// Compounds agree with xraylib's CS_Total_CP to 2.4e-4 (atomic weights; attenuation_test.cpp).
constexpr double kXraylibTolerance = 3e-4;

TEST(CapillarySpecimen, MuRFromMaterialIsMuTimesRadiusAsXraylibGivesIt) {
    const Radiation mo = radiation_from_source("Mo");
    const CapillarySpecimen c = capillary_from_material(powder("Fe2O3", 5.24, 0.6), mo, 0.03);
    const double mu = xraylib_mu_per_cm("Fe2O3", mo.energy_keV, 5.24 * 0.6);
    EXPECT_NEAR(*c.mu_per_cm / mu, 1, kXraylibTolerance);
    EXPECT_NEAR(c.mu_R / (mu * 0.015), 1, kXraylibTolerance);
    EXPECT_DOUBLE_EQ(*c.inner_diameter_cm, 0.03);
    EXPECT_DOUBLE_EQ(*c.density_g_cm3, 5.24 * 0.6);
    EXPECT_EQ(c.radiation, "Mo Ka");
    EXPECT_EQ(c.table, CrossSectionTable::elam);
    EXPECT_FALSE(c.wall);
}

TEST(CapillarySpecimen, WallOfAMaterialIsItsMuTimesTheSampleRadius) {
    const Radiation cu = radiation_from_source("Cu");
    const CapillarySpecimen c =
        with_wall(capillary_from_material(powder("CeO2", 7.215, 0.5), cu, 0.02), powder("SiO2", 2.2), 0.001);
    ASSERT_TRUE(c.wall);
    const double wall_mu = xraylib_mu_per_cm("SiO2", cu.energy_keV, 2.2);
    EXPECT_NEAR(c.wall->mu_R / (wall_mu * 0.01), 1, kXraylibTolerance);
    EXPECT_DOUBLE_EQ(c.wall->radius_ratio, 0.011 / 0.01);  // (r + t) / r
    EXPECT_EQ(c.wall->material, "SiO2");
    EXPECT_DOUBLE_EQ(*c.wall->thickness_cm, 0.001);
}

TEST(CapillarySpecimen, DirectRoute) {
    const CapillarySpecimen c = with_wall(capillary_from_mu_R(1.5), 0.2, 1.1);
    EXPECT_EQ(c.mu_R, 1.5);
    EXPECT_EQ(c.wall->mu_R, 0.2);
    EXPECT_EQ(c.wall->radius_ratio, 1.1);
    EXPECT_FALSE(c.mu_per_cm);
    EXPECT_TRUE(c.radiation.empty());
    EXPECT_TRUE(c.warnings.empty());
    // μR near 1 is the usual aim; above 3 the correction varies strongly (common practice).
    EXPECT_EQ(capillary_from_mu_R(4).warnings.size(), 1u);
}

using test::expect_input_error;

TEST(CapillarySpecimen, Refusals) {
    const Radiation cu = radiation_from_source("Cu");
    expect_input_error([] { capillary_from_mu_R(0); }, "μR = 0 must be positive");
    expect_input_error([] { capillary_from_mu_R(31); }, "is above 30: too absorbing for a capillary");
    // Lead at Cu Kα, μ about 2600 1/cm (from memory): a 1 mm capillary is far too thick.
    expect_input_error([&] { capillary_from_material(powder("Pb", 11.34), cu, 0.1); }, "too absorbing");
    expect_input_error([&] { capillary_from_material(powder("Si", 2.33), cu, 0); }, "inner diameter = 0 cm must be positive");
    expect_input_error([] { with_wall(capillary_from_mu_R(1), -0.1, 1.1); }, "must be zero or positive");
    expect_input_error([] { with_wall(capillary_from_mu_R(1), 0.1, 1.0); }, "must be above 1");
    expect_input_error([] { with_wall(capillary_from_mu_R(1), powder("SiO2", 2.2), 0.001); },
                   "a wall material needs the capillary's inner diameter");
    expect_input_error([&] { with_wall(capillary_from_material(powder("Si", 2.33), cu, 0.05), powder("SiO2", 2.2), 0); },
                   "wall thickness");
}

TEST(PlateSpecimen, MuTFromMaterialAndWindows) {
    const Radiation cu = radiation_from_source("Cu");
    PlateSpecimen p = plate_from_material(PlateMode::transmission_symmetric, powder("Al2O3", 3.987, 0.55), cu, 0.002);
    const double mu = xraylib_mu_per_cm("Al2O3", cu.energy_keV, 3.987 * 0.55);
    EXPECT_NEAR(p.mu_t / (mu * 0.002), 1, kXraylibTolerance);
    // Polyimide C22H10N2O5, 1.42 g/cm³ (from memory), 8 µm foils.
    p = with_windows(p, powder("C22H10N2O5", 1.42), 8e-4, cu);
    EXPECT_NEAR(p.window->mu_t / (xraylib_mu_per_cm("C22H10N2O5", cu.energy_keV, 1.42) * 8e-4), 1, kXraylibTolerance);
    EXPECT_EQ(p.window->material, "C22H10N2O5");
}

TEST(PlateSpecimen, DirectRouteWithWindowMaterialTakesItsRadiation) {
    const Radiation mo = radiation_from_source("Mo");
    const PlateSpecimen p = with_windows(with_incidence(plate_from_mu_t(PlateMode::reflection, 2), 5),
                                         powder("C22H10N2O5", 1.42), 8e-4, mo);
    EXPECT_EQ(p.mu_t, 2);
    EXPECT_EQ(p.incidence_deg, 5);
    EXPECT_EQ(p.radiation, "Mo Ka");
    EXPECT_FALSE(p.mu_per_cm);
    EXPECT_TRUE(p.window->mu_per_cm);
}

TEST(PlateSpecimen, Refusals) {
    const Radiation cu = radiation_from_source("Cu");
    const Radiation mo = radiation_from_source("Mo");
    expect_input_error([] { plate_from_mu_t(PlateMode::reflection, 0); }, "μt = 0 must be positive");
    expect_input_error([] { plate_from_mu_t(PlateMode::reflection, 2e6); }, "is above the limit 1e6");
    expect_input_error([] { with_windows(plate_from_mu_t(PlateMode::reflection, 1), -1); }, "window μt = -1 must be positive");
    expect_input_error([] { with_incidence(plate_from_mu_t(PlateMode::transmission_normal, 1), 5); },
                   "a fixed incidence applies to reflection only, not to transmission-normal");
    expect_input_error([&] { plate_from_material(PlateMode::reflection, powder("Si", 2.33), cu, -1); }, "plate thickness");
    expect_input_error(
        [&] { with_windows(plate_from_material(PlateMode::reflection, powder("Si", 2.33), cu, 0.1), powder("C", 2), 1e-3, mo); },
        "the window foils need the plate's radiation (Cu Ka)");
}

}  // namespace
}  // namespace mudepth
