// Kβ filters against the trade's rules and xraylib's attenuation coefficients.
#include "mudepth/filter.hpp"

#include <gtest/gtest.h>
#include <xraylib/xraylib.h>

#include <cmath>

#include "mudepth/elements.hpp"
#include "mudepth/error.hpp"

namespace mudepth {
namespace {

std::string best(const char* anode) {
    return std::string(element(best_filter_element(find_anode(anode), 0.01)).symbol);
}

TEST(Filter, TheTradesFilterElements) {
    // Common practice: Ni for Cu, Fe for Co, Mn for Fe, V for Cr, Zr for Mo.
    EXPECT_EQ(best("Cu"), "Ni");
    EXPECT_EQ(best("Co"), "Fe");
    EXPECT_EQ(best("Fe"), "Mn");
    EXPECT_EQ(best("Cr"), "V");
    EXPECT_EQ(best("Mo"), "Zr");
}

TEST(Filter, TwentyMicronsOfNickelOnCopper) {
    // Cullity, Elements of X-ray Diffraction (from memory, check loosely): about 20 µm of Ni
    // passes roughly 40% of Cu Kα and cuts Kβ/Kα by more than an order of magnitude.
    const auto r = filter_of_thickness(find_anode("Cu"), 28, 20e-4);
    EXPECT_NEAR(r.kalpha_transmission, 0.40, 0.08);
    EXPECT_GT(r.ratio_unfiltered / r.ratio_filtered, 10.0);
}

TEST(Filter, TransmissionsAgainstXraylib) {
    // Beer-Lambert exp(−(μ/ρ) ρ t) with xraylib 4.0.0 CS_Total for Ni at the Cu lines,
    // weighted by the line intensities. xraylib evaluates the same Elam tables (agreement
    // 1e-14, cross_section_test), so this checks the intensity weighting and Beer-Lambert
    // to 1e-9.
    const Anode& cu = find_anode("Cu");
    const double t_cm = 15e-4;
    const double rho = element(28).density_g_cm3;
    double in_a = 0, out_a = 0, in_b = 0, out_b = 0;
    for (const auto& line : anode_k_spectrum(cu)) {
        const double passed = line.relative_intensity * std::exp(-CS_Total(28, line.energy_keV, nullptr) * rho * t_cm);
        (line.kbeta ? in_b : in_a) += line.relative_intensity;
        (line.kbeta ? out_b : out_a) += passed;
    }
    const auto r = filter_of_thickness(cu, 28, t_cm);
    EXPECT_NEAR(r.kalpha_transmission / (out_a / in_a), 1.0, 1e-9);
    EXPECT_NEAR(r.kbeta_transmission / (out_b / in_b), 1.0, 1e-9);
}

TEST(Filter, RatioTargetRoundTrip) {
    // The thickness found for a target ratio gives that ratio back (root finding to ~1e-12).
    for (const char* a : {"Cr", "Cu", "Mo", "Ag"}) {
        const Anode& anode = find_anode(a);
        const int Z = best_filter_element(anode, 0.02);
        const auto r = filter_for_ratio(anode, Z, 0.02);
        EXPECT_NEAR(r.ratio_filtered, 0.02, 1e-9) << a;
        const auto again = filter_of_thickness(anode, Z, r.thickness_cm);
        EXPECT_NEAR(again.ratio_filtered, 0.02, 1e-9) << a;
    }
}

TEST(Filter, UnfilteredRatioIsSeveralTimesOne) {
    // Common practice: the unfiltered Kα intensity is several times Kβ (around five).
    for (const auto& a : anodes()) {
        const double ka_over_kb = 1.0 / unfiltered_kbeta_ratio(a);
        EXPECT_GT(ka_over_kb, 3.0) << a.symbol;
        EXPECT_LT(ka_over_kb, 10.0) << a.symbol;
    }
}

TEST(Filter, UnfilteredRatioAgainstXraylibRadiativeRates) {
    // xraylib 4.0.0 RadRate gives the K-shell radiative rates of another compilation:
    // Kβ/Kα = (KM2 + KM3 + KM4 + KM5 + KN lines)/(KL2 + KL3). The two differ by about 10%
    // (Cu: 0.134 there, 0.147 here), so a 20% bound.
    const int kbeta_lines[] = {KM2_LINE, KM3_LINE, KM4_LINE, KM5_LINE, KN2_LINE, KN3_LINE, KN4_LINE, KN5_LINE};
    for (const char* symbol : {"Cr", "Fe", "Co", "Cu", "Mo", "Ag"}) {
        const Anode& a = find_anode(symbol);
        double kbeta = 0;
        for (int line : kbeta_lines) kbeta += RadRate(a.Z, line, nullptr);
        const double kalpha = RadRate(a.Z, KL2_LINE, nullptr) + RadRate(a.Z, KL3_LINE, nullptr);
        EXPECT_NEAR(unfiltered_kbeta_ratio(a) / (kbeta / kalpha), 1.0, 0.2) << symbol;
    }
}

TEST(Filter, Refusals) {
    const Anode& cu = find_anode("Cu");
    EXPECT_THROW(filter_for_ratio(cu, 28, 0.5), InputError);     // above the unfiltered ratio
    EXPECT_THROW(filter_for_ratio(cu, 28, -0.1), InputError);
    EXPECT_THROW(filter_for_ratio(cu, 26, 0.01), InputError);    // Fe: K edge below Cu Kα
    EXPECT_THROW(filter_of_thickness(cu, 28, 0.0), InputError);
    EXPECT_THROW(filter_of_thickness(cu, 36, 1e-3), InputError);  // krypton: no foil
}

}  // namespace
}  // namespace mudepth
