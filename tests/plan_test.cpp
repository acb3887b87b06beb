// Sample planning against xraylib attenuation, closed forms and the trade's rules.
#include "mudepth/plan.hpp"

#include <gtest/gtest.h>
#include <xraylib/xraylib.h>

#include <cmath>

#include "mudepth/attenuation.hpp"
#include "mudepth/composition.hpp"
#include "mudepth/error.hpp"
#include "mudepth/formula.hpp"
#include "mudepth/radiation.hpp"

namespace mudepth {
namespace {

Material powder(const char* formula, double density, double packing) {
    return material_from_formula(parse_formula(formula), density, packing);
}

const Material& silica() {
    static const Material m = find_composition("fused-silica").material;
    return m;
}

TEST(Plan, CapillaryRuleAgainstXraylib) {
    // μ from xraylib 4.0.0 CS_Total_CP × density × packing; the recommended diameter is the
    // largest standard one with μR = μ d/2 <= 1 (the rule of SPEC L1, common practice μR ≲ 1).
    struct Case { const char* formula; double density; double packing; const char* source; };
    for (const auto& c : {Case{"SiO2", 2.65, 0.55, "Cu"}, Case{"Al2O3", 3.987, 0.6, "Cu"}, Case{"CeO2", 7.215, 0.5, "Mo"},
                          Case{"LaB6", 4.711, 0.55, "Mo"}, Case{"C6H12O6", 1.54, 0.5, "Cu"}, Case{"ZnO", 5.675, 0.55, "Ag"}}) {
        const double e = radiation_from_source(c.source).energy_keV;
        const double mu_reference = CS_Total_CP(c.formula, e, nullptr) * c.density * c.packing;
        double expected_mm = 0.1;
        for (double d : kStandardCapillaryDiameters_mm)
            if (mu_reference * d * 0.1 / 2 <= 1.0) expected_mm = d;
        const auto plan = plan_capillaries(powder(c.formula, c.density, c.packing), e, 1.0, silica(), 0.03);
        EXPECT_NEAR(plan.recommended_diameter_cm * 10, expected_mm, 1e-12) << c.formula << " " << c.source;
        for (const auto& row : plan.rows)  // μR from the same μ, to the 1e-3 spread of the compilations
            EXPECT_NEAR(row.mu_R / (mu_reference * row.diameter_cm / 2), 1.0, 1e-3) << c.formula;
    }
}

TEST(Plan, DilutionReachesTheTarget) {
    // A heavy absorber: PbO under Cu Kα. The diluted mixture's μR equals the target to 1e-9.
    const Material pbo = powder("PbO", 9.53, 0.5);
    const double e = radiation_from_source("Cu").energy_keV;
    const auto plan = plan_capillaries(pbo, e, 1.0, silica(), 0.03);
    ASSERT_TRUE(plan.smallest_exceeds_target);
    EXPECT_NEAR(plan.recommended_diameter_cm, 0.01, 1e-15);
    ASSERT_TRUE(plan.dilution.has_value());
    const double x = plan.dilution->sample_weight_fraction;
    EXPECT_GT(x, 0.0);
    EXPECT_LT(x, 1.0);
    const Phase phases[] = {{pbo, x}, {silica(), 1 - x}};
    const Material mixed = mix(phases, FractionBasis::weight, 0.5);
    EXPECT_NEAR(linear_attenuation_per_cm(mixed, e) * 0.03 / 2, 1.0, 1e-9);
}

TEST(Plan, DilutionRefusals) {
    const double e = radiation_from_source("Cu").energy_keV;
    // A diluent absorbing more than the sample cannot help: refused.
    EXPECT_THROW(dilution_weight_fraction(powder("SiO2", 2.2, 0.5), powder("PbO", 9.53, 0.5), e, 10.0), InputError);
    // A diluent that alone exceeds the target in that capillary: no dilution, a note.
    const auto plan = plan_capillaries(powder("Fe2O3", 5.26, 1.0), e, 1.0, silica(), 0.03);
    EXPECT_FALSE(plan.dilution.has_value());
    EXPECT_FALSE(plan.dilution_note.empty());
    EXPECT_THROW(plan_capillaries(powder("SiO2", 2.2, 0.5), e, 0.0, silica(), 0.03), InputError);
}

TEST(Plan, PlatesAgainstCullity) {
    // Cullity (from memory): a reflection sample is "infinitely thick" for 99.9% at
    // t = 3.45 sinθ/μ (ln 1000 / 2 = 3.454); 99% at 2.30 sinθ/μ (ln 100 / 2 = 2.303).
    const double mu = 250.0, two_theta = 150.0;
    const double s = std::sin(two_theta / 2 * M_PI / 180);
    const auto p = plan_plate(powder("SiO2", 2.2, 0.5), mu, two_theta, 3.0, 0.05);
    EXPECT_NEAR(p.infinite_999_cm, std::log(1000.0) / 2 * s / mu, 1e-12);
    EXPECT_NEAR(p.infinite_999_cm * mu / s, 3.45, 0.01);
    EXPECT_NEAR(p.infinite_99_cm * mu / s, 2.30, 0.01);
    // Transmission optimum of a plate normal to the beam at low angles: μt = 1 (derived).
    EXPECT_NEAR(p.transmission_optimum_cm * mu, 1.0, 1e-9);
    // Powder mass = packed density × area × depth.
    EXPECT_NEAR(p.powder_mass_g, 1.1 * 3.0 * 0.05, 1e-12);
}

TEST(Plan, SourcesFlagIronFluorescence) {
    // Common practice: an iron oxide fluoresces under Cu radiation, not under Co or Fe.
    const auto rows = plan_sources(powder("Fe2O3", 5.26, 0.5), 1.0);
    ASSERT_EQ(rows.size(), 6u);
    for (const auto& r : rows) {
        const bool flagged = !r.fluorescence.empty();
        if (r.anode == "Cu" || r.anode == "Mo" || r.anode == "Ag") {
            EXPECT_TRUE(flagged) << r.anode;
        } else {
            EXPECT_FALSE(flagged) << r.anode;  // Cr, Fe, Co
        }
        // Symmetric 1/e depth sinθ/(2μ) (ITC Vol. C Table 6.3.3.1).
        EXPECT_NEAR(r.depth_1e_at_30_deg_um, std::sin(15 * M_PI / 180) / (2 * r.mu_per_cm) * 1e4, 1e-9);
    }
}

}  // namespace
}  // namespace mudepth
