// Depth probed: closed forms, refraction against xraylib, limits, continuity,
// the inverse's round trip and the transparency shift by quadrature.
#include "mudepth/depth.hpp"

#include <gtest/gtest.h>
#include <xraylib/xraylib.h>

#include <algorithm>
#include <cmath>
#include <complex>
#include <iostream>
#include <numbers>
#include <string>

#include <boost/math/quadrature/gauss_kronrod.hpp>

#include "mudepth/attenuation.hpp"
#include "mudepth/error.hpp"
#include "mudepth/formula.hpp"
#include "mudepth/radiation.hpp"
#include "mudepth/refraction.hpp"
#include "support/input_error.hpp"

namespace mudepth {
namespace {

constexpr double kPi = std::numbers::pi;
double rad(double deg) { return deg * kPi / 180.0; }

double relative(double a, double b) { return std::abs(a / b - 1.0); }

// ---------------------------------------------------------------- closed forms

TEST(DepthClosedForm, SymmetricFixedAndTilts) {
    // Formulas as printed in ITC Vol. C Table 6.3.3.1 (symmetric, fixed incidence) and Noyan &
    // Cohen 1987 / Genzel 1994 (side inclination, ω-tilt), written out here independently.
    double worst = 0;
    for (double mu : {0.5, 37.2, 148.6, 2400.0})
        for (double tt : {5.0, 28.44, 90.0, 156.0}) {
            const double th = rad(tt / 2);
            const double sym = std::sin(th) / (2 * mu) * 1e4;
            worst = std::max(worst, relative(symmetric_depth_1e_um(mu, tt), sym));
            for (double a : {0.3, tt / 3, tt / 2, tt - 0.5}) {
                const double fixed = 1e4 / (mu * (1 / std::sin(rad(a)) + 1 / std::sin(rad(tt - a))));
                worst = std::max(worst, relative(fixed_incidence_depth_1e_um(mu, tt, a), fixed));
            }
            for (double psi : {0.0, 10.0, 45.0, 70.0}) {
                const double side = std::sin(th) * std::cos(rad(psi)) / (2 * mu) * 1e4;
                worst = std::max(worst, relative(side_inclination_depth_1e_um(mu, tt, psi), side));
                if (psi < tt / 2) {
                    const double s = std::sin(th), p = std::sin(rad(psi));
                    const double omega = (s * s - p * p) / (2 * mu * s * std::cos(rad(psi))) * 1e4;
                    worst = std::max(worst, relative(omega_tilt_depth_1e_um(mu, tt, psi), omega));
                }
            }
        }
    std::cout << "[ measured ] closed forms D1, D2, D4: worst relative difference " << worst << '\n';
    EXPECT_LT(worst, 1e-9);
}

TEST(DepthClosedForm, FractionDepth) {
    // x_G = ln(1/(1−G)) sinθ/(2μ) (Cullity, Elements of X-ray Diffraction) [from memory].
    for (double g : {0.1, 0.5, 0.9, 0.99, 0.999})
        for (double tt : {10.0, 60.0, 140.0}) {
            const double mu = 75.66;
            const double expected = std::log(1 / (1 - g)) * std::sin(rad(tt / 2)) / (2 * mu) * 1e4;
            EXPECT_NEAR(fraction_depth_um(mu, tt, g) / expected, 1.0, 1e-9) << g << ' ' << tt;
        }
    // ln(1/(1 − 0.99)) = 4.605 and the 99% "infinitely thick" rule t = 2.30 sinθ/μ (Cullity).
    EXPECT_NEAR(fraction_depth_um(1.0, 90.0, 0.99) / (std::sin(rad(45)) / 1.0 * 1e4), 2.30, 0.01);
}

TEST(DepthClosedForm, FractionOfAFiniteLayerByQuadrature) {
    // Independent check: integrate the signal e^(−z/Λ) numerically (Gauss-Kronrod) to the
    // returned depth and compare with G times the layer's total.
    const double lambda_um = 12.5, t_cm = 20e-4;
    for (double g : {0.3, 0.9}) {
        const double x = depth_holding_fraction_um(lambda_um, g, t_cm);
        auto w = [&](double z) { return std::exp(-z / lambda_um); };
        const double part = boost::math::quadrature::gauss_kronrod<double, 31>::integrate(w, 0.0, x);
        const double all = boost::math::quadrature::gauss_kronrod<double, 31>::integrate(w, 0.0, t_cm * 1e4);
        EXPECT_NEAR(part / all, g, 1e-12);
    }
}

TEST(DepthClosedForm, OmegaTiltIsFixedIncidenceAtThetaMinusPsi) {
    // Geometry: ω-tilt by ψ sets the incidence to θ − ψ and the exit to θ + ψ [derived].
    EXPECT_NEAR(omega_tilt_depth_1e_um(50, 80, 12) / fixed_incidence_depth_1e_um(50, 80, 28), 1.0, 1e-12);
}

// ---------------------------------------------------------------- refraction

struct Absorber {
    const char* formula;
    double density_g_cm3;  // handbook densities (from memory)
};
constexpr Absorber kAbsorbers[] = {{"Si", 2.329}, {"Cu", 8.96}, {"Au", 19.3}};
constexpr double kE = 8.048;  // keV, Cu Kα1 as quoted in xraylib examples

/// Λ(α) with xraylib's δ and β, computed here with std::complex (a different route from the library).
double xraylib_beam_depth_um(const Absorber& a, double alpha_deg) {
    const double delta = 1.0 - Refractive_Index_Re(a.formula, kE, a.density_g_cm3, nullptr);
    const double beta = Refractive_Index_Im(a.formula, kE, a.density_g_cm3, nullptr);
    const double lambda_cm = 12.39841984 / kE * 1e-8;
    const std::complex<double> q =
        std::sqrt(std::complex<double>(std::pow(std::sin(rad(alpha_deg)), 2) - 2 * delta, 2 * beta));
    return 1e4 / (2 * (2 * kPi / lambda_cm) * std::abs(q.imag()));
}

DepthSample ours(const Absorber& a) {
    const Material m = material_from_formula(parse_formula(a.formula), a.density_g_cm3);
    const double mu = linear_attenuation_per_cm(m, kE);
    const Refraction r = refraction(m, kE, mu);
    return refracting_sample(r.delta, r.beta, wavelength_A_from_energy_keV(kE));
}

TEST(DepthRefraction, GrazingDepthAgainstXraylib) {
    // xraylib 4.0.0 Refractive_Index_Re/Im (its own f1 and cross sections) give δ and β; the
    // depths below, at and above α_c agree within the two datasets' spread (3%).
    double worst = 0;
    for (const auto& a : kAbsorbers) {
        const DepthSample s = ours(a);
        const double ac = critical_angle_deg(s.optics->delta);
        for (double f : {0.1, 0.5, 0.9, 1.0, 1.1, 2.0, 5.0}) {
            const double alpha = f * ac;
            const double mine = beam_depth_1e_um(s.optics->delta, s.optics->beta, s.optics->wavelength_A, alpha);
            worst = std::max(worst, relative(mine, xraylib_beam_depth_um(a, alpha)));
            EXPECT_NEAR(mine / xraylib_beam_depth_um(a, alpha), 1.0, 0.03) << a.formula << " α = " << f << " α_c";
            // In diffraction, 2θ = 40°: 1/Λ = 1/Λ(α) + 1/Λ(2θ − α).
            const double both = 1 / (1 / xraylib_beam_depth_um(a, alpha) + 1 / xraylib_beam_depth_um(a, 40 - alpha));
            EXPECT_NEAR(depth_1e_um(s, fixed_incidence_angles(40, alpha)) / both, 1.0, 0.03) << a.formula;
        }
    }
    std::cout << "[ measured ] grazing depth vs xraylib δ, β (Si, Cu, Au; 0.1–5 α_c): worst " << worst << '\n';
}

TEST(DepthRefraction, EvanescentLimit) {
    // α → 0: Λ → λ/(4π α_c) (Dosch 1987); the exact root differs by (β/δ)²/8 [derived].
    for (const auto& a : kAbsorbers) {
        const auto o = *ours(a).optics;
        const double ac_rad = std::sqrt(2 * o.delta);
        const double limit_um = o.wavelength_A * 1e-4 / (4 * kPi * ac_rad);
        const double ratio = o.beta / o.delta;
        EXPECT_NEAR(beam_depth_1e_um(o.delta, o.beta, o.wavelength_A, 1e-7) / limit_um, 1.0,
                    0.2 * ratio * ratio + 1e-9)
            << a.formula;
    }
}

TEST(DepthRefraction, SiliconCommonPractice) {
    // Common practice at Cu Kα: α_c(Si) ≈ 0.22°, minimum depth ≈ 3 nm.
    const Material si = material_from_formula(parse_formula("Si"), 2.329);
    const double e = radiation_from_source("Cu").energy_keV;
    const Refraction r = refraction(si, e, linear_attenuation_per_cm(si, e));
    EXPECT_NEAR(r.critical_angle_deg, 0.22, 0.01);
    const double min_nm = beam_depth_1e_um(r.delta, r.beta, wavelength_A_from_energy_keV(e), 0.0) * 1e3;
    EXPECT_GT(min_nm, 2.5);
    EXPECT_LT(min_nm, 3.5);
}

TEST(DepthRefraction, AtTheCriticalAngle) {
    // α = α_c: q² = 2iβ, so Λ = λ/(4π√β) [derived]; sin²α_c differs from 2δ by O(δ²).
    for (const auto& a : kAbsorbers) {
        const auto o = *ours(a).optics;
        const double expected_um = o.wavelength_A * 1e-4 / (4 * kPi * std::sqrt(o.beta));
        EXPECT_NEAR(beam_depth_1e_um(o.delta, o.beta, o.wavelength_A, critical_angle_deg(o.delta)) / expected_um,
                    1.0, 1e-3)
            << a.formula;
    }
}

TEST(DepthRefraction, LargeAngleLimitIsTheGeometricDepth) {
    // Far above α_c the refracted depth tends to D2: the relative difference is −δ/sin²α to
    // leading order (Re q ≈ √(sin²α − 2δ), Λ = Re q / μ) [derived]. At 100 keV (δ ≈ 5e-8 for
    // Si) and 2θ = 90°, α = 45°, it is below 1e-6.
    const Material si = material_from_formula(parse_formula("Si"), 2.329);
    for (double e : {8.048, 100.0}) {
        const double mu = linear_attenuation_per_cm(si, e);
        const Refraction r = refraction(si, e, mu);
        const DepthSample s = refracting_sample(r.delta, r.beta, wavelength_A_from_energy_keV(e));
        for (double alpha : {10.0, 30.0, 45.0}) {
            const double geometric = fixed_incidence_depth_1e_um(s.mu_per_cm, 90, alpha);
            const double refracted = depth_1e_um(s, fixed_incidence_angles(90, alpha));
            const double leading = r.delta / std::pow(std::sin(rad(alpha)), 2);
            EXPECT_LT(relative(refracted, geometric), 1.1 * leading) << e << ' ' << alpha;
            if (e == 100.0 && alpha == 45.0) {
                EXPECT_LT(relative(refracted, geometric), 1e-6);
            }
        }
        // μ used for the geometric depth is the same μ the library derived from β.
        EXPECT_NEAR(s.mu_per_cm / mu, 1.0, 1e-12);
    }
    // With δ = 0 they differ only by O((β/sin²α)²) [derived: Re q = sinα (1 + (β/sin²α)²/2 + ...)].
    const DepthSample b = refracting_sample(0.0, 1e-7, 1.54);
    for (double alpha : {1.0, 5.0, 20.0}) {
        const double x = 1e-7 / std::pow(std::sin(rad(alpha)), 2);
        EXPECT_LT(relative(depth_1e_um(b, fixed_incidence_angles(60, alpha)),
                           fixed_incidence_depth_1e_um(b.mu_per_cm, 60, alpha)),
                  x * x + 1e-14);
    }
}

TEST(DepthRefraction, ContinuousThroughTheCriticalAngle) {
    // The depth is a smooth function of α: across α_c the jump over ±h shrinks linearly in h,
    // and a fine scan from 0 to 3 α_c never steps by more than the local slope allows.
    const auto o = *ours(kAbsorbers[0]).optics;
    const double ac = critical_angle_deg(o.delta);
    auto L = [&](double a) { return beam_depth_1e_um(o.delta, o.beta, o.wavelength_A, a); };
    double previous_jump = 0;
    for (double h : {1e-3, 1e-5, 1e-7}) {
        const double jump = std::abs(L(ac * (1 + h)) - L(ac * (1 - h))) / L(ac);
        if (previous_jump > 0) {
            EXPECT_NEAR(previous_jump / jump, 100.0, 5.0);
        }
        previous_jump = jump;
    }
    const int n = 30000;
    double worst_step = 0;
    for (int i = 1; i <= n; ++i) {
        const double a0 = 3 * ac * (i - 1) / n, a1 = 3 * ac * i / n;
        worst_step = std::max(worst_step, std::abs(L(a1) - L(a0)) / L(a0));
    }
    std::cout << "[ measured ] Si Λ(α), 0..3 α_c in 30000 steps: largest relative step " << worst_step << '\n';
    EXPECT_LT(worst_step, 1e-2);
    // Monotonic increase with α.
    for (int i = 1; i <= 300; ++i) EXPECT_GT(L(3 * ac * i / 300), L(3 * ac * (i - 1) / 300));
}

// ---------------------------------------------------------------- inverse

TEST(DepthInverse, RoundTripIncidence) {
    double worst = 0;
    const DepthSample samples[] = {geometric_sample(148.6), ours(kAbsorbers[0]), ours(kAbsorbers[2])};
    for (const auto& s : samples)
        for (double tt : {20.0, 69.1, 140.0}) {
            const auto range = incidence_for_depth(s, tt, 1e9);  // far too deep: gives the range
            EXPECT_FALSE(range.reachable);
            for (int i = 1; i < 40; ++i) {
                const double lo = std::max(range.min_depth_um, 1e-4);
                const double target = lo * std::pow(range.max_depth_um / lo, i / 40.0);
                const auto r = incidence_for_depth(s, tt, target);
                ASSERT_TRUE(r.reachable) << target;
                EXPECT_LE(r.angle_deg, tt / 2 + 1e-12);
                const double back = depth_1e_um(s, fixed_incidence_angles(tt, r.angle_deg));
                worst = std::max(worst, relative(back, target));
            }
        }
    std::cout << "[ measured ] depth → incidence → depth: worst relative difference " << worst << '\n';
    EXPECT_LT(worst, 1e-8);
}

TEST(DepthInverse, RoundTripTilts) {
    double worst = 0;
    const DepthSample samples[] = {geometric_sample(420.0), ours(kAbsorbers[1])};
    for (const auto& s : samples)
        for (auto mode : {TiltMode::side_inclination, TiltMode::omega})
            for (double tt : {30.0, 100.0, 156.0}) {
                const auto range = tilt_for_depth(s, mode, tt, 1e9);
                for (int i = 1; i < 30; ++i) {
                    const double lo = std::max(range.min_depth_um, 1e-4);
                    const double target = lo * std::pow(range.max_depth_um / lo, i / 30.0);
                    const auto r = tilt_for_depth(s, mode, tt, target);
                    ASSERT_TRUE(r.reachable);
                    const BeamAngles b = mode == TiltMode::omega ? omega_tilt_angles(tt, r.angle_deg)
                                                                 : side_inclination_angles(tt, r.angle_deg);
                    worst = std::max(worst, relative(depth_1e_um(s, b), target));
                }
            }
    std::cout << "[ measured ] depth → tilt → depth: worst relative difference " << worst << '\n';
    EXPECT_LT(worst, 1e-8);
}

TEST(DepthInverse, UnreachableTargetsReportTheRange) {
    const DepthSample si = ours(kAbsorbers[0]);
    const auto shallow = incidence_for_depth(si, 30, 1e-3);  // 1 nm: below the evanescent minimum
    EXPECT_FALSE(shallow.reachable);
    const auto o = *si.optics;
    EXPECT_NEAR(shallow.min_depth_um,
                1 / (1 / beam_depth_1e_um(o.delta, o.beta, o.wavelength_A, 0) +
                     1 / beam_depth_1e_um(o.delta, o.beta, o.wavelength_A, 30)),
                1e-12);
    EXPECT_NEAR(shallow.max_depth_um, depth_1e_um(si, symmetric_angles(30)), 1e-9);
    const auto deep = incidence_for_depth(si, 30, 1e5);
    EXPECT_FALSE(deep.reachable);
    // Without refraction every shallow depth is reachable at some small incidence.
    EXPECT_TRUE(incidence_for_depth(geometric_sample(148.6), 30, 1e-3).reachable);
}

// ---------------------------------------------------------------- transparency

TEST(DepthTransparency, ThickSampleClassicalForm) {
    // Δ2θ = −sin2θ/(2μR) rad for a thick low-absorbing sample in Bragg-Brentano geometry
    // (Wilson 1963; Klug & Alexander 1974) [from memory].
    for (double tt : {20.0, 90.0, 150.0}) {
        const double mu = 3.0, r_cm = 24.0;
        const double expected = -std::sin(rad(tt)) / (2 * mu * r_cm) * 180 / kPi;
        EXPECT_NEAR(transparency_shift_deg(mu, tt, r_cm) / expected, 1.0, 1e-12);
    }
}

TEST(DepthTransparency, CentroidByQuadrature) {
    // Independent: the intensity-weighted mean depth ∫ z e^(−2μz/sinθ) dz / ∫ e^(−2μz/sinθ) dz
    // over [0, t] by Gauss-Kronrod, turned into a displacement shift −2 z̄ cosθ/R.
    for (double mu : {0.2, 5.0, 80.0})
        for (double t_cm : {0.001, 0.05, 0.3})
            for (double tt : {25.0, 110.0}) {
                const double k = 2 * mu / std::sin(rad(tt / 2));
                auto w = [&](double z) { return std::exp(-k * z); };
                auto zw = [&](double z) { return z * std::exp(-k * z); };
                using GK = boost::math::quadrature::gauss_kronrod<double, 61>;
                const double zbar_cm = GK::integrate(zw, 0.0, t_cm, 15, 1e-14) / GK::integrate(w, 0.0, t_cm, 15, 1e-14);
                EXPECT_NEAR(diffracting_centroid_depth_um(mu, tt, t_cm) / (zbar_cm * 1e4), 1.0, 1e-10);
                const double expected = -2 * zbar_cm * std::cos(rad(tt / 2)) / 24.0 * 180 / kPi;
                EXPECT_NEAR(transparency_shift_deg(mu, tt, 24.0, t_cm) / expected, 1.0, 1e-10);
            }
}

TEST(DepthTransparency, ThinAndThickLimits) {
    // μ → 0: the centroid is mid-layer, Δ2θ = −t cosθ/R [derived]; t → ∞: the thick form.
    const double t = 0.02, r = 20.0, tt = 60.0;
    EXPECT_NEAR(transparency_shift_deg(1e-9, tt, r, t) / (-t * std::cos(rad(30)) / r * 180 / kPi), 1.0, 1e-8);
    EXPECT_NEAR(transparency_shift_deg(50, tt, r, 10.0) / transparency_shift_deg(50, tt, r), 1.0, 1e-12);
}

// ---------------------------------------------------------------- refusals

using test::expect_input_error;

TEST(DepthErrors, Messages) {
    expect_input_error([] { fixed_incidence_depth_1e_um(10, 30, 35); }, "incidence 35° must be below 2θ = 30°");
    expect_input_error([] { fixed_incidence_depth_1e_um(10, 30, 0); }, "incidence 0° must be above 0°");
    expect_input_error([] { symmetric_depth_1e_um(10, 180); }, "2θ = 180° is outside (0°, 180°)");
    expect_input_error([] { symmetric_depth_1e_um(10, -5); }, "outside (0°, 180°)");
    expect_input_error([] { fraction_depth_um(10, 30, 1.0); }, "signal fraction 1 is outside (0, 1)");
    expect_input_error([] { symmetric_depth_1e_um(0, 30); }, "must be a positive number");
    expect_input_error([] { transparency_shift_deg(1, 30, 0); }, "goniometer radius");
    expect_input_error([] { transparency_shift_deg(1, 30, 20, -1.0); }, "thickness");
    expect_input_error([] { omega_tilt_depth_1e_um(1, 30, 20); }, "smaller in size than θ = 15°");
    expect_input_error([] { side_inclination_depth_1e_um(1, 30, 90); }, "within (−90°, 90°)");
    expect_input_error([] { incidence_for_depth(geometric_sample(1), 30, -1); }, "target depth");
}

}  // namespace
}  // namespace mudepth
