// Tests of the embedded element data (src/elements.cpp over
// src/data/element_data.cpp): edges and lines against xraylib 4.0.0, and facts
// of the trade about anodes and K-beta filters.
#include <gtest/gtest.h>
#include <xraylib/xraylib.h>

#include <cmath>
#include <iostream>
#include <string>

#include "mudepth/elements.hpp"
#include "mudepth/error.hpp"
#include "support/xs_reference.hpp"

namespace {

constexpr double kHc_keV_angstrom = 12.39841984;  // CODATA 2018

TEST(ElementsBasics, LookupAndErrors) {
    EXPECT_EQ(mudepth::element(29).symbol, "Cu");
    EXPECT_EQ(mudepth::atomic_number("Cf"), 98);
    EXPECT_FALSE(mudepth::atomic_number("Xx").has_value());
    EXPECT_THROW(mudepth::element(0), mudepth::InputError);
    EXPECT_THROW(mudepth::element(99), mudepth::InputError);
    EXPECT_NE(mudepth::element_data_source().find("xraydb"), std::string_view::npos);
}

// Edge energies K, L1, L2, L3 against xraylib 4.0.0 EdgeEnergy, for every
// element where both have the edge. The two compilations differ (xraydb follows
// Elam et al.'s compilation, xraylib its own), by a few eV typically.
// Measured: worst |dE| 13.1 eV (N L1, an outer level of 37 eV); for edges above
// 1 keV worst 0.22% relative (Zn L1). Tolerance 15 eV: the measured spread.
TEST(ElementsEdges, MatchXraylibEdgeEnergy) {
    const struct {
        const char* level;
        int shell;
    } levels[] = {{"K", K_SHELL}, {"L1", L1_SHELL}, {"L2", L2_SHELL}, {"L3", L3_SHELL}};
    double worst_eV = 0;
    int compared = 0;
    for (const auto& l : levels) {
        for (int Z = 1; Z <= mudepth::kMaxAtomicNumber; ++Z) {
            const auto* edge = mudepth::find_edge(Z, l.level);
            const double theirs_keV = xs_test::xraylib_edge_keV(Z, l.shell);  // xraylib 4.0.0 EdgeEnergy
            if (!edge || theirs_keV <= 0) continue;
            const double d_eV = std::abs(edge->energy_keV - theirs_keV) * 1000.0;
            worst_eV = std::max(worst_eV, d_eV);
            EXPECT_LT(d_eV, 15.0) << "Z = " << Z << " " << l.level;
            ++compared;
        }
    }
    std::cout << "[measured] edges vs xraylib EdgeEnergy: worst " << worst_eV << " eV over " << compared << "\n";
    RecordProperty("edges_vs_xraylib_worst_eV", std::to_string(worst_eV));
    EXPECT_GT(compared, 350);
}

// Line energies Ka1, Ka2, Kb1, La1 against xraylib 4.0.0 LineEnergy.
// Measured: worst |dE| 11.0 eV (At Kb1); above 1 keV worst 0.22% relative
// (Kr La1). Tolerance 15 eV.
TEST(ElementsLines, MatchXraylibLineEnergy) {
    const struct {
        const char* name;
        int line;
    } names[] = {{"Ka1", KA1_LINE}, {"Ka2", KA2_LINE}, {"Kb1", KB1_LINE}, {"La1", LA1_LINE}};
    double worst_eV = 0;
    int compared = 0;
    for (const auto& n : names) {
        for (int Z = 1; Z <= mudepth::kMaxAtomicNumber; ++Z) {
            const auto* line = mudepth::find_line(Z, n.name);
            const double theirs_keV = xs_test::xraylib_line_keV(Z, n.line);  // xraylib 4.0.0 LineEnergy
            if (!line || theirs_keV <= 0) continue;
            const double d_eV = std::abs(line->energy_keV - theirs_keV) * 1000.0;
            worst_eV = std::max(worst_eV, d_eV);
            EXPECT_LT(d_eV, 15.0) << "Z = " << Z << " " << n.name;
            ++compared;
        }
    }
    std::cout << "[measured] lines vs xraylib LineEnergy: worst " << worst_eV << " eV over " << compared << "\n";
    RecordProperty("lines_vs_xraylib_worst_eV", std::to_string(worst_eV));
    EXPECT_GT(compared, 300);
    ASSERT_NE(mudepth::find_line(29, "K-L3"), nullptr);
    EXPECT_EQ(mudepth::find_line(29, "K-L3"), mudepth::find_line(29, "Ka1"));
}

// Anode wavelengths for diffraction work, Angstrom (Hoelzer et al. 1997, Phys.
// Rev. A 56, 4554; ITC Vol. C Table 4.2.2.1).
struct Anode {
    int Z;
    double ka1_A, kb1_A;
    int filter_Z;  // common practice: the K-beta filter
};
constexpr Anode kAnodes[] = {
    {24, 2.2897260, 2.0848810, 23}, {26, 1.9360410, 1.7566040, 25}, {27, 1.7889960, 1.6208260, 26},
    {29, 1.54059290, 1.3922340, 28}, {42, 0.70931715, 0.632303, 40},
};

double k_edge_keV(int Z) {
    const auto* edge = mudepth::find_edge(Z, "K");
    return edge ? edge->energy_keV : 0.0;
}

// Common practice: the Ni K edge lies between Cu Kb1 and Cu Ka1 (why Ni filters Cu radiation).
TEST(ElementsTrade, NickelKEdgeBetweenCopperKbetaAndKalpha) {
    const double ni_k = k_edge_keV(28);
    EXPECT_GT(ni_k, kHc_keV_angstrom / 1.54059290);  // above Cu Ka1
    EXPECT_LT(ni_k, kHc_keV_angstrom / 1.3922340);   // below Cu Kb1
    // The same from our own line data.
    EXPECT_GT(ni_k, mudepth::find_line(29, "Ka1")->energy_keV);
    EXPECT_LT(ni_k, mudepth::find_line(29, "Kb1")->energy_keV);
}

// Common practice: for Cr, Fe, Co and Cu the element Z-1 has its K edge between
// the anode's Kb1 and Ka1; for Mo it is Zr (Z-2).
TEST(ElementsTrade, KbetaFilterEdgesLieBetweenKbetaAndKalpha) {
    for (const auto& a : kAnodes) {
        const double edge = k_edge_keV(a.filter_Z);
        EXPECT_GT(edge, kHc_keV_angstrom / a.ka1_A) << "anode Z = " << a.Z;
        EXPECT_LT(edge, kHc_keV_angstrom / a.kb1_A) << "anode Z = " << a.Z;
        EXPECT_GT(edge, mudepth::find_line(a.Z, "Ka1")->energy_keV) << "anode Z = " << a.Z;
        EXPECT_LT(edge, mudepth::find_line(a.Z, "Kb1")->energy_keV) << "anode Z = " << a.Z;
    }
}

// Our line energies reproduce the diffraction wavelengths to 0.05% (they come
// from a different compilation: the xraydb line table, not Hoelzer et al.).
TEST(ElementsTrade, LineEnergiesMatchDiffractionWavelengths) {
    for (const auto& a : kAnodes) {
        EXPECT_NEAR(mudepth::find_line(a.Z, "Ka1")->energy_keV * a.ka1_A / kHc_keV_angstrom, 1.0, 5e-4) << a.Z;
        EXPECT_NEAR(mudepth::find_line(a.Z, "Kb1")->energy_keV * a.kb1_A / kHc_keV_angstrom, 1.0, 5e-4) << a.Z;
    }
}

// Common practice: unfiltered K-alpha is several times K-beta, about five. From
// the line data: sum of K-L intensities over sum of all other K lines; between
// 3 and 10 for each anode.
TEST(ElementsTrade, KalphaToKbetaIntensityRatioIsSeveral) {
    for (const auto& a : kAnodes) {
        double alpha = 0, beta = 0;
        for (const auto& line : mudepth::lines(a.Z)) {
            if (line.initial_level != "K") continue;
            (line.final_level.starts_with("L") ? alpha : beta) += line.relative_intensity;
        }
        ASSERT_GT(beta, 0) << a.Z;
        const double ratio = alpha / beta;
        std::cout << "[measured] " << mudepth::element(a.Z).symbol << " Ka/Kb intensity ratio " << ratio << "\n";
        EXPECT_GT(ratio, 3.0) << a.Z;
        EXPECT_LT(ratio, 10.0) << a.Z;
    }
}

}  // namespace
