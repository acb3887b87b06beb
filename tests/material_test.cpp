// Tests of materials: weight fractions (against xraylib), checks and their
// messages, unit-cell volumes and densities, mixtures by weight and by volume.
#include <gtest/gtest.h>

#include <array>
#include <cmath>
#include <numbers>
#include <string>

#include <xraylib/xraylib.h>

#include "mudepth/elements.hpp"
#include "mudepth/error.hpp"
#include "mudepth/material.hpp"

using namespace mudepth;

namespace {

double share_of(const Material& m, const std::string& label) {
    for (const auto& e : m.elements)
        if (e.label == label) return e.weight_fraction;
    return 0;
}

std::string error_of(auto&& f) {
    try {
        f();
    } catch (const InputError& e) {
        return e.what();
    }
    return "(no error)";
}

constexpr double kAvogadro = 6.02214076e23;  // exact, SI 2019

}  // namespace

TEST(Material, WeightFractionsAgreeWithXraylib) {
    // xraylib 4.0.0 CompoundParser massFractions. xraylib's atomic weights are
    // rounded to 0.01 g/mol (H 1.01 against 1.0078: 0.22 %), so each fraction
    // agrees to 3e-3 relative; the counts themselves are pinned in formula_test.
    const std::pair<const char*, const char*> cases[] = {
        {"Fe2O3", "Fe2O3"},         {"SiO2", "SiO2"},
        {"Ca5(PO4)3(OH)", "Ca5(PO4)3(OH)"}, {"CuSO4·5H2O", "CuSO4(H2O)5"},
        {"LaB6", "LaB6"},           {"CaCO3", "CaCO3"},
        {"C22H10N2O5", "C22H10N2O5"}, {"Na0.5K0.5Cl", "Na0.5K0.5Cl"},
        {"Co(NH3)6Cl3", "Co(NH3)6Cl3"}, {"Al2(SO4)3.18H2O", "Al2(SO4)3(H2O)18"},
    };
    for (const auto& [ours, theirs] : cases) {
        const Material m = material_from_formula(parse_formula(ours), 1.0);
        compoundData* cd = CompoundParser(theirs, nullptr);
        ASSERT_NE(cd, nullptr) << theirs;
        ASSERT_EQ(static_cast<int>(m.elements.size()), cd->nElements) << ours;
        double sum = 0;
        for (int k = 0; k < cd->nElements; ++k) {
            const std::string symbol(element(cd->Elements[k]).symbol);
            EXPECT_NEAR(share_of(m, symbol), cd->massFractions[k], 3e-3 * cd->massFractions[k]) << ours << " " << symbol;
        }
        for (const auto& e : m.elements) sum += e.weight_fraction;
        EXPECT_NEAR(sum, 1.0, 1e-14) << ours;
        FreeCompoundData(cd);
    }
}

TEST(Material, DensityAndPacking) {
    const Material m = material_from_formula(parse_formula("SiO2"), 2.65, 0.5);
    EXPECT_DOUBLE_EQ(m.density_g_cm3(), 1.325);
    EXPECT_EQ(m.name, "SiO2");
    EXPECT_EQ(error_of([] { check_packing_fraction(1.5); }), "packing fraction 1.5 is outside (0, 1]");
    EXPECT_EQ(error_of([] { check_packing_fraction(0); }), "packing fraction 0 is outside (0, 1]");
    EXPECT_EQ(error_of([] { check_packing_fraction(std::nan("")); }), "packing fraction nan is outside (0, 1]");
    EXPECT_NO_THROW(check_packing_fraction(1.0));
    EXPECT_EQ(error_of([] { check_density_g_cm3(-2, "--density"); }),
              "--density -2 g/cm3 is not a density: it must be finite and > 0");
    EXPECT_THROW(check_density_g_cm3(INFINITY, "--density"), InputError);
    EXPECT_THROW(material_from_formula(parse_formula("SiO2"), 0), InputError);
    EXPECT_THROW(material_from_formula(parse_formula("SiO2"), 2.2, 1.01), InputError);
}

TEST(Material, CellVolumes) {
    // closed form: cubic a^3 and hexagonal (sqrt(3)/2) a^2 c
    EXPECT_DOUBLE_EQ(cell_volume_A3({4, 4, 4, 90, 90, 90}), 64.0);
    EXPECT_NEAR(cell_volume_A3({4.7589, 4.7589, 12.991, 90, 90, 120}),
                std::sqrt(3.0) / 2 * 4.7589 * 4.7589 * 12.991, 1e-9);
    // A triclinic cell by hand: V = |a . (b x c)| with the cell vectors built in
    // Cartesian coordinates (a along x, b in the xy plane).
    const double a = 5.1, b = 6.2, c = 7.3, al = 80, be = 95, ga = 103;
    const double r = std::numbers::pi / 180;
    const std::array<double, 3> va{a, 0, 0};
    const std::array<double, 3> vb{b * std::cos(ga * r), b * std::sin(ga * r), 0};
    const double cx = c * std::cos(be * r);
    const double cy = c * (std::cos(al * r) - std::cos(be * r) * std::cos(ga * r)) / std::sin(ga * r);
    const std::array<double, 3> vc{cx, cy, std::sqrt(c * c - cx * cx - cy * cy)};
    const double triple = va[0] * (vb[1] * vc[2] - vb[2] * vc[1]) - va[1] * (vb[0] * vc[2] - vb[2] * vc[0]) +
                          va[2] * (vb[0] * vc[1] - vb[1] * vc[0]);
    EXPECT_NEAR(cell_volume_A3({a, b, c, al, be, ga}), std::abs(triple), 1e-9);
}

TEST(Material, ImpossibleCellsAreRefused) {
    EXPECT_EQ(error_of([] { cell_volume_A3({-1, 4, 4, 90, 90, 90}); }),
              "cell length a = -1 A must be finite and > 0");
    EXPECT_EQ(error_of([] { cell_volume_A3({4, 4, 4, 90, 90, 190}); }),
              "cell angle gamma = 190 degrees must be between 0 and 180");
    // alpha + beta < gamma: the three vectors cannot close.
    EXPECT_NE(error_of([] { cell_volume_A3({4, 4, 4, 30, 40, 100}); }).find("do not form a cell"),
              std::string::npos);
    EXPECT_THROW(cell_volume_A3({4, 4, 4, 120, 120, 120}), InputError);  // sum 360: flat
    EXPECT_THROW(cell_volume_A3({4, std::nan(""), 4, 90, 90, 90}), InputError);
}

TEST(Material, DensityFromCell) {
    // Si: a = 5.431020511 A (CODATA 2018, from memory), Z = 8; closed form
    // 8 M / (N_A a^3) with the element table's M, and the handbook density 2.329 g/cm3.
    const Formula si = parse_formula("Si");
    const double a = 5.431020511;
    const double rho = density_from_cell_g_cm3(si, {a, a, a, 90, 90, 90}, 8);
    EXPECT_NEAR(rho, 8 * element(14).molar_mass_g_mol / (kAvogadro * a * a * a * 1e-24), 1e-12);
    EXPECT_NEAR(rho, 2.329, 0.0005);
    EXPECT_THROW(density_from_cell_g_cm3(si, {a, a, a, 90, 90, 90}, 0), InputError);
}

TEST(Material, MixtureByWeight) {
    const Material alumina = material_from_formula(parse_formula("Al2O3"), 3.987);
    const Material silica = material_from_formula(parse_formula("SiO2"), 2.65);
    const Phase phases[] = {{alumina, 0.7}, {silica, 0.3}};
    const Material m = mix(phases, FractionBasis::weight, 0.6);
    EXPECT_EQ(m.name, "70 wt% Al2O3 + 30 wt% SiO2");
    // closed form: 1/rho = sum w_i / rho_i; element shares sum_i w_i w_ij
    EXPECT_NEAR(m.solid_density_g_cm3, 1 / (0.7 / 3.987 + 0.3 / 2.65), 1e-12);
    EXPECT_DOUBLE_EQ(m.packing_fraction, 0.6);
    EXPECT_NEAR(share_of(m, "O"), 0.7 * share_of(alumina, "O") + 0.3 * share_of(silica, "O"), 1e-15);
    EXPECT_NEAR(share_of(m, "Al"), 0.7 * share_of(alumina, "Al"), 1e-15);
    EXPECT_NEAR(share_of(m, "Si"), 0.3 * share_of(silica, "Si"), 1e-15);
    ASSERT_EQ(m.elements.size(), 3u);
    EXPECT_EQ(m.elements[0].label, "Al");
    EXPECT_EQ(m.elements[1].label, "O");
    EXPECT_EQ(m.elements[2].label, "Si");

    // Fractions are normalised: 7 and 3 mean the same.
    const Phase unnormalised[] = {{alumina, 7}, {silica, 3}};
    const Material n = mix(unnormalised, FractionBasis::weight);
    EXPECT_EQ(n.name, m.name);
    EXPECT_NEAR(n.solid_density_g_cm3, m.solid_density_g_cm3, 1e-12);
}

TEST(Material, MixtureByVolume) {
    const Material si = material_from_formula(parse_formula("Si"), 2.329);
    const Material diamond = material_from_formula(parse_formula("C"), 3.515);
    const Phase phases[] = {{si, 0.25}, {diamond, 0.75}};
    const Material m = mix(phases, FractionBasis::volume);
    EXPECT_EQ(m.name, "25 vol% Si + 75 vol% C");
    // closed form: w_i = v_i rho_i / sum v_j rho_j, and the pore-free density sum v_i rho_i
    const double w_si = 0.25 * 2.329 / (0.25 * 2.329 + 0.75 * 3.515);
    EXPECT_NEAR(share_of(m, "Si"), w_si, 1e-15);
    EXPECT_NEAR(share_of(m, "C"), 1 - w_si, 1e-15);
    EXPECT_NEAR(m.solid_density_g_cm3, 0.25 * 2.329 + 0.75 * 3.515, 1e-12);
}

TEST(Material, BadMixturesAreRefused) {
    const Material si = material_from_formula(parse_formula("Si"), 2.329);
    const Phase negative[] = {{si, -0.1}, {si, 1.1}};
    EXPECT_EQ(error_of([&] { mix(negative, FractionBasis::weight); }),
              "weight fraction -0.1 of phase 1 (Si) must be finite and >= 0");
    const Phase zero[] = {{si, 0}, {si, 0}};
    EXPECT_EQ(error_of([&] { mix(zero, FractionBasis::volume); }),
              "the volume fractions of the mixture sum to 0; they must sum to more than 0");
    const Phase nan[] = {{si, std::nan("")}};
    EXPECT_THROW(mix(nan, FractionBasis::weight), InputError);
    EXPECT_THROW(mix(std::span<const Phase>{}, FractionBasis::weight), InputError);
    Material no_density = si;
    no_density.solid_density_g_cm3 = 0;
    const Phase bad_density[] = {{no_density, 1}};
    EXPECT_THROW(mix(bad_density, FractionBasis::volume), InputError);
    const Phase ok[] = {{si, 1}};
    EXPECT_THROW(mix(ok, FractionBasis::weight, 0), InputError);
}
