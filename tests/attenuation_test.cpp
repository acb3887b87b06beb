// Attenuation of compounds against xraylib's CS_Total_CP, and the closed forms
// behind μ, 1/μ, transmission and isotopes.
#include "mudepth/attenuation.hpp"

#include <gtest/gtest.h>
#include <xraylib/xraylib.h>

#include <cmath>
#include <iostream>

#include "mudepth/formula.hpp"

namespace mudepth {
namespace {

// Agreement of Elam (2002) with xraylib's compilation for compounds at
// energies away from edges; the element-by-element spread is measured in
// cross_section_test.cpp, and a compound's μ/ρ is a weighted mean of its
// elements', so it can be no worse than the worst element.
constexpr double kCompoundTolerance = 1e-3;

TEST(Attenuation, CompoundsAgainstXraylibCSTotalCP) {
    struct Case {
        const char* ours;     // our notation
        const char* xraylib;  // the same compound in xraylib's parser syntax
    };
    const Case cases[] = {
        {"Fe2O3", "Fe2O3"},
        {"Ca5(PO4)3(OH)", "Ca5(PO4)3(OH)"},
        {"CuSO4·5H2O", "CuSO4(H2O)5"},
        {"CaSO4.0.5H2O", "CaSO4(H2O)0.5"},
        {"Al2(SO4)3.18H2O", "Al2(SO4)3(H2O)18"},
        {"Na0.5K0.5Cl", "Na0.5K0.5Cl"},
        {"[Co(NH3)6]Cl3", "Co(NH3)6Cl3"},
        {"(Mg0.9Fe0.1)2SiO4", "(Mg0.9Fe0.1)2SiO4"},
        {"PbTiO3", "PbTiO3"},
        {"LaB6", "LaB6"},
    };
    // keV, none within 3% of an edge of these elements (Pb L3 13.04, L1 15.86; La K 38.9; Pb K 88.0).
    const double energies_keV[] = {8.04778, 17.479, 22.16, 30.0, 60.0, 100.0};
    double worst = 0;
    for (const auto& c : cases) {
        const Material m = material_from_formula(parse_formula(c.ours), 1.0);
        for (double e : energies_keV) {
            // xraylib 4.0.0 CS_Total_CP (cm²/g).
            const double reference = CS_Total_CP(c.xraylib, e, nullptr);
            const double ours = material_mass_attenuation(m, e).total_cm2_g();
            const double rel = std::abs(ours / reference - 1);
            worst = std::max(worst, rel);
            EXPECT_LT(rel, kCompoundTolerance) << c.ours << " at " << e << " keV: " << ours << " vs " << reference;
        }
    }
    std::cout << "[ measured ] compounds vs xraylib CS_Total_CP: worst relative difference " << worst << '\n';
}

TEST(Attenuation, LinearCoefficientLengthAndTransmission) {
    // Closed forms: μ = ρ_packed · μ/ρ, attenuation length 1/μ, Beer-Lambert exp(−μt).
    const Material m = material_from_formula(parse_formula("SiO2"), 2.2, 0.5);
    const Attenuation a = attenuation(m, 8.04778);
    EXPECT_DOUBLE_EQ(a.density_g_cm3, 1.1);
    EXPECT_NEAR(a.mu_per_cm, 1.1 * a.mass_attenuation.total_cm2_g(), 1e-12 * a.mu_per_cm);
    EXPECT_NEAR(a.attenuation_length_um, 1e4 / a.mu_per_cm, 1e-12 * a.attenuation_length_um);
    EXPECT_NEAR(transmission(a.mu_per_cm, 1.0 / a.mu_per_cm), std::exp(-1.0), 1e-15);
    double share_sum = 0;
    for (const auto& e : a.elements) share_sum += e.share_of_total;
    EXPECT_NEAR(share_sum, 1.0, 1e-12);
}

TEST(Attenuation, HeavyWaterHasWatersMolecularCrossSection) {
    // An isotope changes the mass, not the per-atom cross section, so
    // (μ/ρ)_D2O = (μ/ρ)_H2O · M(H2O)/M(D2O) exactly (derived).
    const Formula h2o = parse_formula("H2O");
    const Formula d2o = parse_formula("D2O");
    for (double e : {8.04778, 17.479, 60.0}) {
        const double water = material_mass_attenuation(material_from_formula(h2o, 1.0), e).total_cm2_g();
        const double heavy = material_mass_attenuation(material_from_formula(d2o, 1.1), e).total_cm2_g();
        EXPECT_NEAR(heavy, water * h2o.molar_mass_g_mol() / d2o.molar_mass_g_mol(), 1e-12 * water);
    }
}

}  // namespace
}  // namespace mudepth
