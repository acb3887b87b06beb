// Tests of the embedded cross-section tables and their evaluation
// (src/cross_section.cpp): exactness of the Elam splines, input checks, and
// comparisons with outside references (xraylib 4.0.0, the Henke tables).
#include <gtest/gtest.h>
#include <xraylib/xraylib.h>

#include <cmath>
#include <iostream>
#include <limits>
#include <string>
#include <vector>

#include "data/tables.hpp"
#include "mudepth/cross_section.hpp"
#include "mudepth/elements.hpp"
#include "mudepth/error.hpp"
#include "support/henke_table.hpp"
#include "support/xs_reference.hpp"

namespace {

using mudepth::CrossSectionTable;
using mudepth::element_mass_attenuation;
using xs_test::Worst;

void report(const char* name, const Worst& w) {
    std::cout << "[measured] " << name << ": worst relative difference " << w.relative << " (Z = " << w.Z
              << ", " << w.energy_keV << " keV)\n";
    ::testing::Test::RecordProperty(name, std::to_string(w.relative));
}

// 16 energies spread over 1..500 keV, for the per-element comparisons.
const std::vector<double> kSpread_keV = xs_test::log_spaced_keV(1.0, 500.0, 16);

double elam_photo(int Z, double e_keV) { return element_mass_attenuation(Z, e_keV).photoelectric_cm2_g; }

// ---------------------------------------------------------------- input

TEST(CrossSectionInput, EnergyOutsideRangeIsRefusedWithTheRange) {
    try {
        element_mass_attenuation(29, 600.0);
        FAIL() << "600 keV accepted";
    } catch (const mudepth::InputError& e) {
        EXPECT_EQ(std::string(e.what()), "energy 600 keV is outside 1..500 keV");
    }
    EXPECT_THROW(element_mass_attenuation(29, 0.999), mudepth::InputError);
    EXPECT_THROW(element_mass_attenuation(29, std::nan("")), mudepth::InputError);
    EXPECT_THROW(element_mass_attenuation(29, std::numeric_limits<double>::infinity()), mudepth::InputError);
    EXPECT_THROW(element_mass_attenuation(29, -std::numeric_limits<double>::infinity()), mudepth::InputError);
    EXPECT_THROW(mudepth::chantler_scattering_factors(29, 501.0), mudepth::InputError);
    EXPECT_NO_THROW(element_mass_attenuation(29, 1.0));
    EXPECT_NO_THROW(element_mass_attenuation(29, 500.0));
    EXPECT_NO_THROW(element_mass_attenuation(92, 500.0, CrossSectionTable::chantler));
}

TEST(CrossSectionInput, AtomicNumberOutsideTheTablesIsRefused) {
    EXPECT_THROW(element_mass_attenuation(0, 10.0), mudepth::InputError);
    EXPECT_THROW(element_mass_attenuation(99, 10.0), mudepth::InputError);
    EXPECT_NO_THROW(element_mass_attenuation(98, 10.0));
    try {
        element_mass_attenuation(98, 10.0, CrossSectionTable::chantler);
        FAIL() << "Cf accepted by chantler";
    } catch (const mudepth::InputError& e) {
        EXPECT_EQ(std::string(e.what()), "the chantler table covers Z = 1..92; U is the last; use --table elam for Cf");
    }
    EXPECT_THROW(mudepth::chantler_scattering_factors(93, 10.0), mudepth::InputError);
}

TEST(CrossSectionInput, TableNames) {
    EXPECT_EQ(mudepth::parse_cross_section_table("elam"), CrossSectionTable::elam);
    EXPECT_EQ(mudepth::parse_cross_section_table("chantler"), CrossSectionTable::chantler);
    EXPECT_EQ(mudepth::to_string(CrossSectionTable::chantler), "chantler");
    EXPECT_EQ(mudepth::to_string(CrossSectionTable::elam), "elam");
    EXPECT_THROW(mudepth::parse_cross_section_table("xcom"), mudepth::InputError);
    EXPECT_NE(mudepth::cross_section_data_source().find("xraydb"), std::string_view::npos);
}

// ---------------------------------------------------------------- spline exactness

// Every node that a segment starts from (the last of a run of equal energies:
// above an edge) is reproduced to 1e-12 relative: at a node a = 1, b = 0 and
// the cubic terms vanish, leaving only the rounding of exp(ln E) back to ln E.
TEST(CrossSectionSpline, ReproducesTheTabulatedNodes) {
    double worst = 0;
    for (int Z = 1; Z <= mudepth::data::kElementCount; ++Z) {
        const auto b = mudepth::data::kElamPhotoBegin[Z - 1], e = mudepth::data::kElamPhotoBegin[Z];
        for (auto k = b; k < e; ++k) {
            const auto& n = mudepth::data::kElamPhoto[k];
            // Step nodes (edges) are checked by the edge tests below: the exact edge energy,
            // not the 6-digit stored one, decides their side.
            if (k + 1 < e && mudepth::data::kElamPhoto[k + 1].log_energy_eV == n.log_energy_eV) continue;
            if (k > b && mudepth::data::kElamPhoto[k - 1].log_energy_eV == n.log_energy_eV) continue;
            const double e_keV = std::exp(n.log_energy_eV) / 1000.0;
            if (e_keV < 1.0 || e_keV > 500.0) continue;
            const double r = elam_photo(Z, e_keV) / std::exp(n.log_mu_cm2_g) - 1.0;
            worst = std::max(worst, std::abs(r));
        }
        const auto sb = mudepth::data::kElamScatterBegin[Z - 1], se = mudepth::data::kElamScatterBegin[Z];
        for (auto k = sb; k < se; ++k) {
            const auto& n = mudepth::data::kElamScatter[k];
            const double e_keV = std::exp(n.log_energy_eV) / 1000.0;
            if (e_keV < 1.0 || e_keV > 500.0) continue;
            const auto m = element_mass_attenuation(Z, e_keV);
            worst = std::max(worst, std::abs(m.coherent_cm2_g / std::exp(n.log_coherent_cm2_g) - 1.0));
            worst = std::max(worst, std::abs(m.incoherent_cm2_g / std::exp(n.log_incoherent_cm2_g) - 1.0));
        }
    }
    std::cout << "[measured] node reproduction: worst relative difference " << worst << "\n";
    EXPECT_LT(worst, 1e-12);
}

// At a tabulated edge energy, the value above the edge; just below, the value below.
TEST(CrossSectionSpline, AtAnEdgeTheValueAboveIsReturned) {
    int steps = 0;
    for (int Z = 1; Z <= mudepth::data::kElementCount; ++Z) {
        const auto b = mudepth::data::kElamPhotoBegin[Z - 1], e = mudepth::data::kElamPhotoBegin[Z];
        for (auto k = b; k + 1 < e; ++k) {
            // A run of equal energies: the first node is below the edge, the last above.
            const auto& below = mudepth::data::kElamPhoto[k];
            if (k > b && mudepth::data::kElamPhoto[k - 1].log_energy_eV == below.log_energy_eV) continue;
            auto last = k;
            while (last + 1 < e && mudepth::data::kElamPhoto[last + 1].log_energy_eV == below.log_energy_eV) ++last;
            if (last == k) continue;
            const auto& above = mudepth::data::kElamPhoto[last];
            const double step_keV = std::exp(above.log_energy_eV) / 1000.0;
            if (step_keV < 1.01 || step_keV > 500.0) continue;
            // The edge energy of the element data nearest to the stored step (within 5e-5 in ln E).
            double edge_keV = step_keV;
            for (const auto& edge : mudepth::edges(Z))
                if (std::abs(std::log(edge.energy_keV / step_keV)) < std::abs(std::log(edge_keV / step_keV)) ||
                    edge_keV == step_keV)
                    if (std::abs(std::log(edge.energy_keV / step_keV)) < 1e-4) edge_keV = edge.energy_keV;
            ++steps;
            // At the edge the value above it: the exact edge lies at most 5e-5 in ln E from the
            // stored step, so the value is the above-edge segment's within that distance of its
            // node; measured worst 7.6e-4 (Re L3, where the next node is very close), so 1e-3.
            EXPECT_NEAR(elam_photo(Z, edge_keV) / std::exp(above.log_mu_cm2_g), 1.0, 1e-3) << Z << " " << edge_keV << " step " << step_keV;
            // Below the edge (outside the 1e-4 step window), the limit from below,
            // extrapolated linearly in ln from 2e-4 and 4e-4 below the edge, is
            // the tabulated value below; what is left is the curvature term over
            // 4e-4 in ln E (<< 1e-4).
            const auto& previous = mudepth::data::kElamPhoto[k - 1];
            if (below.log_energy_eV - previous.log_energy_eV < 1e-3) continue;  // segment too short
            const double v1 = std::log(elam_photo(Z, step_keV * std::exp(-2e-4)));
            const double v2 = std::log(elam_photo(Z, step_keV * std::exp(-4e-4)));
            EXPECT_NEAR(std::exp(2 * v1 - v2 - below.log_mu_cm2_g), 1.0, 1e-4)
                << Z << " " << edge_keV;
        }
    }
    EXPECT_GT(steps, 150);  // K, L and M edges of 98 elements in 1..500 keV
}

// The edge energies that mudepth::edges() reports give the value above the edge
// (the table stores ln E to 6 digits, up to 5e-5 from them; see kEdgeSlack in
// src/cross_section.cpp): the value at the edge continues the segment above it.
// Tolerance: ln sigma rises with slopes up to ~500 just above some M5 edges
// (Re: +0.42 in ln sigma over 0.00085 in ln E), so 1e-6 in energy moves it 5e-4.
// A few eV below an edge is below it: the tables store the step to 6 digits
// (up to 12 eV off for heavy K edges), and the exact edge energy decides.
// Example: Pb K edge 88.005 keV; 87.996 keV is below it.
TEST(CrossSectionSpline, JustBelowAnEdgeTheValueBelowIsReturned) {
    int checked = 0;
    for (int Z = 10; Z <= 92; ++Z) {
        for (const char* level : {"K", "L3"}) {
            const auto* edge = mudepth::find_edge(Z, level);
            if (!edge || edge->energy_keV < 1.01 || edge->jump_ratio < 1.2) continue;
            const double e = edge->energy_keV;
            const double just_below = elam_photo(Z, e * (1 - 1e-5));
            const double further_below = elam_photo(Z, e * (1 - 3e-4));
            // Below the edge the curve is smooth: d ln σ / d ln E ≈ −3, so 3e-4 in E moves σ ~1e-3.
            EXPECT_NEAR(just_below / further_below, 1.0, 3e-3) << Z << " " << level;
            EXPECT_GT(elam_photo(Z, e) / just_below, 1.1) << Z << " " << level;
            ++checked;
        }
    }
    EXPECT_GT(checked, 120);
    const double pb_below = elam_photo(82, 87.996), pb_above = elam_photo(82, 88.006);
    EXPECT_GT(pb_above / pb_below, 3.0);  // the Pb K jump ratio is about 5 (common practice)
}

TEST(CrossSectionSpline, AtTheReportedEdgeEnergyTheValueAboveIsReturned) {
    int checked = 0;
    for (int Z = 1; Z <= 92; ++Z) {
        for (const auto& edge : mudepth::edges(Z)) {
            if (edge.energy_keV < 1.01) continue;
            const double at = elam_photo(Z, edge.energy_keV);
            const double just_above = elam_photo(Z, edge.energy_keV * (1 + 1e-6));
            EXPECT_NEAR(at / just_above, 1.0, 1e-3) << Z << " " << edge.level;
            ++checked;
        }
    }
    EXPECT_GT(checked, 300);
}

// Continuity: inside a segment the spline is a cubic polynomial; at every node
// that is not an edge, the values just left and right of it (1e-9 in ln E)
// both equal the node's value (to 1e-6: slopes of ln sigma stay below 500).
TEST(CrossSectionSpline, ContinuousAtEveryNodeExceptEdges) {
    const double eps = 1e-9;
    double worst = 0;
    for (int Z = 1; Z <= mudepth::data::kElementCount; ++Z) {
        const auto b = mudepth::data::kElamPhotoBegin[Z - 1], e = mudepth::data::kElamPhotoBegin[Z];
        for (auto k = b + 1; k + 1 < e; ++k) {
            const auto& n = mudepth::data::kElamPhoto[k];
            if (mudepth::data::kElamPhoto[k - 1].log_energy_eV == n.log_energy_eV ||
                mudepth::data::kElamPhoto[k + 1].log_energy_eV == n.log_energy_eV)
                continue;
            const double e_keV = std::exp(n.log_energy_eV) / 1000.0;
            if (e_keV < 1.001 || e_keV > 499.0) continue;
            for (double side : {-eps, eps})
                worst = std::max(worst, std::abs(elam_photo(Z, e_keV * std::exp(side)) / std::exp(n.log_mu_cm2_g) - 1));
        }
        const auto sb = mudepth::data::kElamScatterBegin[Z - 1], se = mudepth::data::kElamScatterBegin[Z];
        for (auto k = sb + 1; k + 1 < se; ++k) {
            const auto& n = mudepth::data::kElamScatter[k];
            const double e_keV = std::exp(n.log_energy_eV) / 1000.0;
            if (e_keV < 1.001 || e_keV > 499.0) continue;
            for (double side : {-eps, eps}) {
                const auto m = element_mass_attenuation(Z, e_keV * std::exp(side));
                worst = std::max(worst, std::abs(m.coherent_cm2_g / std::exp(n.log_coherent_cm2_g) - 1));
                worst = std::max(worst, std::abs(m.incoherent_cm2_g / std::exp(n.log_incoherent_cm2_g) - 1));
            }
        }
    }
    std::cout << "[measured] continuity at nodes: worst relative step " << worst << "\n";
    EXPECT_LT(worst, 1e-6);
}

// ---------------------------------------------------------------- Elam against xraylib

// xraylib 4.0.0 CS_Photo, CS_Rayl, CS_Compt, CS_Total, for Z = 1..92 at 16
// energies over 1..500 keV, skipping energies within 0.5% of an edge (ours or
// xraylib's EdgeEnergy, K..P5).
// Measured: agreement to about 3e-14 for every part (photo 2.5e-14, coherent
// 6e-15, incoherent 3e-15 over a 400-energy sweep): xraylib 4.0.0 evaluates the
// same Elam/Scofield/Hubbell spline tables, with the same 6-digit ln E nodes,
// so the only difference is floating-point rounding. The 0.1% is far
// looser than needed; 1e-9 still leaves six orders of margin for rounding and
// catches any wrong node, derivative or formula.
TEST(CrossSectionElam, MatchesXraylibForEveryPart) {
    constexpr double kTolerance = 1e-9;
    Worst photo, coherent, incoherent, total;
    int compared = 0;
    for (int Z = 1; Z <= 92; ++Z) {
        for (double e : kSpread_keV) {
            if (xs_test::relative_distance_to_edge(Z, e) < 0.005) continue;
            const auto m = element_mass_attenuation(Z, e);
            photo.update(m.photoelectric_cm2_g, CS_Photo(Z, e, nullptr), Z, e);      // xraylib 4.0.0 CS_Photo
            coherent.update(m.coherent_cm2_g, CS_Rayl(Z, e, nullptr), Z, e);         // xraylib 4.0.0 CS_Rayl
            incoherent.update(m.incoherent_cm2_g, CS_Compt(Z, e, nullptr), Z, e);    // xraylib 4.0.0 CS_Compt
            total.update(m.total_cm2_g(), CS_Total(Z, e, nullptr), Z, e);            // xraylib 4.0.0 CS_Total
            ++compared;
        }
    }
    report("elam_vs_xraylib_photo", photo);
    report("elam_vs_xraylib_coherent", coherent);
    report("elam_vs_xraylib_incoherent", incoherent);
    report("elam_vs_xraylib_total", total);
    EXPECT_GT(compared, 92 * 12);
    EXPECT_LT(std::abs(photo.relative), kTolerance);
    EXPECT_LT(std::abs(coherent.relative), kTolerance);
    EXPECT_LT(std::abs(incoherent.relative), kTolerance);
    EXPECT_LT(std::abs(total.relative), kTolerance);
}

// ---------------------------------------------------------------- Chantler

// Chantler total against xraylib 4.0.0 CS_Total (which follows Elam, see above).
// The issue hoped for 6% away from edges; measured, at the 40 energies below,
// at least 2% from any edge (a 400-energy sweep gives the same picture):
//   3..500 keV: worst 11.8% (Cr at 6.8 keV): photoabsorption, Chantler's DHF
//     values vs the Scofield values behind Elam, 5-12% apart at 3-10 keV for
//     many elements. Above 8 keV the worst is 8.5% (He at 30 keV) and 8.3% (Mg
//     at 500 keV), both from FFAST's coherent + incoherent column, 8% off the
//     Hubbell scattering behind Elam for those elements.
//   1..3 keV: worst 31% (Sm at 1.17 keV, among its M edges, where the two
//     compilations' edge structure differs; up to 100% within 0.5% of M edges).
// So: 13% above 3 keV (the measured 11.8% plus margin), and only a factor-2
// sanity bound below 3 keV, where the two compilations genuinely disagree.
TEST(CrossSectionChantler, TotalAgreesWithXraylibAwayFromEdges) {
    Worst above3, below3;
    for (int Z = 1; Z <= 92; ++Z) {
        for (double e : xs_test::log_spaced_keV(1.0, 500.0, 40)) {
            if (xs_test::relative_distance_to_edge(Z, e) < 0.02) continue;
            const double ours = element_mass_attenuation(Z, e, CrossSectionTable::chantler).total_cm2_g();
            const double theirs = CS_Total(Z, e, nullptr);  // xraylib 4.0.0 CS_Total
            (e >= 3.0 ? above3 : below3).update(ours, theirs, Z, e);
        }
    }
    report("chantler_vs_xraylib_total_3_500keV", above3);
    report("chantler_vs_xraylib_total_1_3keV", below3);
    EXPECT_LT(std::abs(above3.relative), 0.13);
    EXPECT_LT(std::abs(below3.relative), 1.0);
}

// The scattering column is coherent + incoherent combined; it is split in
// Elam's ratio, so the parts keep Elam's proportion.
TEST(CrossSectionChantler, ScatteringIsSplitInElamsRatio) {
    for (int Z : {1, 8, 29, 82, 92}) {
        for (double e : {1.5, 8.048, 17.48, 100.0, 450.0}) {
            const auto c = element_mass_attenuation(Z, e, CrossSectionTable::chantler);
            const auto m = element_mass_attenuation(Z, e);
            EXPECT_NEAR(c.coherent_cm2_g / c.incoherent_cm2_g, m.coherent_cm2_g / m.incoherent_cm2_g,
                        1e-12 * m.coherent_cm2_g / m.incoherent_cm2_g);
        }
    }
}

// From memory: f1 of Si at Cu K-alpha is about 14.3 (Z = 14 plus f' ~ +0.3 below
// the Si K edge, far above it). Tolerance 0.1 electron: the recalled value's digits.
TEST(CrossSectionChantler, SiliconF1AtCuKalpha) {
    const auto f = mudepth::chantler_scattering_factors(14, 8.048);
    EXPECT_NEAR(f.f1, 14.3, 0.1);
    EXPECT_GT(f.f2, 0.2);  // Si f'' at Cu K-alpha ~ 0.33 (from memory); positive in any case
    EXPECT_LT(f.f2, 0.5);
}

// f1 against Z + xraylib 4.0.0 Fi (anomalous f'), at least 5% from any edge and
// above the M1 edge (+5%). xraylib's Fi is a different computation, and
// Chantler's f1 carries the relativistic and nuclear-Thomson corrections
// (-0.1 e for Cu, -0.5 e for U), so agreement to ~1% is what to expect.
// Measured: 5..500 keV worst 0.66% (Pa at 6.2 keV); 2..5 keV worst 1.6% (S at
// 2.7 keV, just above its K edge). Tolerances: 1% and 2%.
TEST(CrossSectionChantler, F1AgreesWithXraylibFi) {
    Worst above5, below5;
    for (int Z = 1; Z <= 92; ++Z) {
        const auto* m1 = mudepth::find_edge(Z, "M1");
        for (double e : xs_test::log_spaced_keV(2.0, 500.0, 40)) {
            if (xs_test::relative_distance_to_edge(Z, e) < 0.05) continue;
            if (m1 && e < m1->energy_keV * 1.05) continue;
            xrl_error* error = nullptr;
            const double fi = Fi(Z, e, &error);  // xraylib 4.0.0 Fi
            if (error) {
                xrl_error_free(error);
                continue;
            }
            (e >= 5.0 ? above5 : below5).update(mudepth::chantler_scattering_factors(Z, e).f1, Z + fi, Z, e);
        }
    }
    report("chantler_f1_vs_xraylib_Z_plus_Fi_5_500keV", above5);
    report("chantler_f1_vs_xraylib_Z_plus_Fi_2_5keV", below5);
    EXPECT_LT(std::abs(above5.relative), 0.01);
    EXPECT_LT(std::abs(below5.relative), 0.02);
}

// ---------------------------------------------------------------- Henke

// Photoabsorption against Henke, Gullikson & Davis (1993) f2 (Debian
// python3-periodictable xsf/*.nff), converted with mu/rho = 2 r_e lambda f2 N_A / M
// (derived in support/henke_table.hpp), for Z = 3..92 between 2 and 30 keV, at
// Henke's own grid points at least 3% from any edge. Henke's f2 rests on
// measured photoabsorption (and, between data, on interpolation), Elam's on
// Scofield's 1973 Hartree-Slater calculation; they differ most just below
// K and L edges (absorption by the outer shells only) and among the M edges.
// Measured: above the M edges (E > 1.03 x M1) worst 14.6% (Sc at 3.87 keV,
// 14% below its K edge); among the M edges (2..3 keV for Z > 70) worst 30%
// (Ir at 2.19 keV). Tolerances: 16% and 32%: the measured spread, not a
// statement of accuracy; the typical difference is a few percent.
TEST(CrossSectionHenke, PhotoabsorptionAgreesWithHenkeF2) {
    Worst above_m, among_m;
    int compared = 0;
    for (int Z = 3; Z <= 92; ++Z) {
        const auto& info = mudepth::element(Z);
        const auto* m1 = mudepth::find_edge(Z, "M1");
        for (const auto& row : xs_test::read_henke(MUDEPTH_HENKE_DIR, info.symbol)) {
            const double e_keV = row.energy_eV / 1000.0;
            if (e_keV < 2.0 || e_keV > 30.0 || row.f2 <= 0) continue;
            if (xs_test::relative_distance_to_edge(Z, e_keV) < 0.03) continue;
            const double henke = xs_test::henke_photo_cm2_g(row.energy_eV, row.f2, info.molar_mass_g_mol);
            (m1 && e_keV < 1.03 * m1->energy_keV ? among_m : above_m).update(elam_photo(Z, e_keV), henke, Z, e_keV);
            ++compared;
        }
    }
    report("elam_photo_vs_henke_above_M_edges", above_m);
    report("elam_photo_vs_henke_among_M_edges", among_m);
    EXPECT_GT(compared, 1000);
    EXPECT_LT(std::abs(above_m.relative), 0.16);
    EXPECT_LT(std::abs(among_m.relative), 0.32);
}

// Speed against xraylib's CS_Total_CP is measured by tests/bench/bench_mass_attenuation.

}  // namespace
