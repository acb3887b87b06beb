// δ, β and the critical angle against xraylib and the trade's figures.
#include "mudepth/refraction.hpp"

#include <gtest/gtest.h>
#include <xraylib/xraylib.h>

#include <cmath>
#include <iostream>

#include "mudepth/attenuation.hpp"
#include "mudepth/formula.hpp"

namespace mudepth {
namespace {

struct Sample {
    const char* formula;
    double density_g_cm3;
};

// Densities: Si 2.329, Cu 8.96, Au 19.3, SiO2 2.2 g/cm³ (handbook values, from memory).
constexpr Sample kSamples[] = {{"Si", 2.329}, {"Cu", 8.96}, {"Au", 19.3}, {"SiO2", 2.2}, {"GaAs", 5.32}};

TEST(Refraction, DeltaAgainstXraylibRefractiveIndexRe) {
    // xraylib 4.0.0 Refractive_Index_Re returns 1 − δ with f1 = Z + f′ from its own
    // anomalous-scattering data; Chantler's f1 agrees within 1% away from edges.
    double worst = 0;
    for (const auto& s : kSamples) {
        const Material m = material_from_formula(parse_formula(s.formula), s.density_g_cm3);
        for (double e : {8.04778, 17.479, 30.0}) {
            const double mu = linear_attenuation_per_cm(m, e);
            const double delta = refraction(m, e, mu).delta;
            const double reference = 1.0 - Refractive_Index_Re(s.formula, e, s.density_g_cm3, nullptr);
            worst = std::max(worst, std::abs(delta / reference - 1));
            EXPECT_NEAR(delta / reference, 1.0, 0.01) << s.formula << " at " << e << " keV";
        }
    }
    std::cout << "[ measured ] delta vs xraylib Refractive_Index_Re: worst relative difference " << worst << '\n';
}

TEST(Refraction, BetaAgainstXraylibRefractiveIndexIm) {
    // xraylib 4.0.0 Refractive_Index_Im is λμ/(4π) from its CS_Total, like our β; the two
    // cross-section compilations differ by up to a few per cent: 5% tolerance.
    for (const auto& s : kSamples) {
        const Material m = material_from_formula(parse_formula(s.formula), s.density_g_cm3);
        for (double e : {8.04778, 17.479}) {
            const double beta = refraction(m, e, linear_attenuation_per_cm(m, e)).beta;
            const double reference = Refractive_Index_Im(s.formula, e, s.density_g_cm3, nullptr);
            EXPECT_NEAR(beta / reference, 1.0, 0.05) << s.formula << " at " << e << " keV";
        }
    }
}

TEST(Refraction, CriticalAnglesAtCuKalpha) {
    // Common practice (from memory): at Cu Kα the critical angle is
    // about 0.22° for Si, 0.40° for Cu and 0.55° for Au.
    struct Case { const char* formula; double density; double expected_deg; };
    for (const auto& c : {Case{"Si", 2.329, 0.22}, Case{"Cu", 8.96, 0.40}, Case{"Au", 19.3, 0.55}}) {
        const Material m = material_from_formula(parse_formula(c.formula), c.density);
        const double e = 8.048;
        const double angle = refraction(m, e, linear_attenuation_per_cm(m, e)).critical_angle_deg;
        EXPECT_NEAR(angle, c.expected_deg, 0.02) << c.formula;
    }
}

TEST(Refraction, CriticalAngleIsRootOfTwoDelta) {
    // Closed form α_c = √(2δ).
    const Material m = material_from_formula(parse_formula("Si"), 2.329);
    const Refraction r = refraction(m, 12.0, linear_attenuation_per_cm(m, 12.0));
    EXPECT_NEAR(r.critical_angle_deg * M_PI / 180.0, std::sqrt(2 * r.delta), 1e-15);
}

}  // namespace
}  // namespace mudepth
