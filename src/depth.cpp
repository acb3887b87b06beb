// Depth probed in reflection geometries, with and without refraction, its
// inverse and the transparency shift. Formulas and sources: include/mudepth/depth.hpp.
#include "mudepth/depth.hpp"

#include <cmath>
#include <algorithm>
#include <cstdint>
#include <limits>
#include <numbers>
#include <string>

#include <boost/math/tools/roots.hpp>

#include "format.hpp"
#include "mudepth/error.hpp"

namespace mudepth {

namespace {

constexpr double kRadPerDeg = std::numbers::pi / 180.0;
constexpr double kUmPerCm = 1e4;

std::string num(double v) { return format_number(v); }

void check_mu(double mu_per_cm) {
    if (!std::isfinite(mu_per_cm) || mu_per_cm <= 0)
        throw InputError("linear attenuation μ = " + num(mu_per_cm) + " 1/cm must be a positive number");
}

void check_two_theta(double two_theta_deg) {
    if (!std::isfinite(two_theta_deg) || two_theta_deg <= 0 || two_theta_deg >= 180)
        throw InputError("2θ = " + num(two_theta_deg) + "° is outside (0°, 180°)");
}

void check_fraction(double fraction) {
    if (!std::isfinite(fraction) || fraction <= 0 || fraction >= 1)
        throw InputError("signal fraction " + num(fraction) + " is outside (0, 1)");
}

void check_thickness(std::optional<double> thickness_cm) {
    if (thickness_cm && (!std::isfinite(*thickness_cm) || *thickness_cm <= 0))
        throw InputError("thickness " + num(*thickness_cm) + " cm must be positive");
}

void check_sample(const DepthSample& s) {
    if (!s.optics) {
        check_mu(s.mu_per_cm);
        return;
    }
    const auto& o = *s.optics;
    if (!std::isfinite(o.delta) || o.delta < 0)
        throw InputError("refractive index decrement δ = " + num(o.delta) + " must be a finite number ≥ 0");
    if (!std::isfinite(o.beta) || o.beta <= 0)
        throw InputError("absorption index β = " + num(o.beta) + " must be positive");
    if (!std::isfinite(o.wavelength_A) || o.wavelength_A <= 0)
        throw InputError("wavelength " + num(o.wavelength_A) + " Å must be positive");
}

/// One beam's 1/e intensity depth in cm at grazing angle alpha_rad (REFERENCES: Parratt 1954,
/// Dosch 1987). q² = sin²α − 2δ + 2iβ; the root with Im q > 0, taken without cancellation:
/// for Re q² ≥ 0, Im q = β / Re q (since Im q² = 2 Re q Im q = 2β).
double beam_depth_cm(const OpticalConstants& o, double alpha_rad) {
    const double s = std::sin(alpha_rad);
    const double a = s * s - 2 * o.delta;
    const double b = 2 * o.beta;
    const double m = std::hypot(a, b);
    const double im_q = a >= 0 ? b / (2 * std::sqrt((m + a) / 2)) : std::sqrt((m - a) / 2);
    const double k_per_cm = 2 * std::numbers::pi / (o.wavelength_A * 1e-8);
    return 1.0 / (2 * k_per_cm * im_q);
}

/// 1/e depth in cm for beams at these angles (radians), no checks.
double depth_cm(const DepthSample& s, double in_rad, double out_rad) {
    if (s.optics) return 1.0 / (1.0 / beam_depth_cm(*s.optics, in_rad) + 1.0 / beam_depth_cm(*s.optics, out_rad));
    // ITC C Table 6.3.3.1: attenuation per unit depth μ(1/sinα + 1/sinε).
    const double si = std::sin(in_rad), so = std::sin(out_rad);
    if (si <= 0 || so <= 0) return 0.0;
    return si * so / (s.mu_per_cm * (si + so));
}

/// Solves depth(angle) = target over [lo, hi] where depth falls from lo to hi or rises; TOMS 748.
AngleForDepth solve(auto depth_of_deg, double lo_deg, double hi_deg, double target_um) {
    if (!std::isfinite(target_um) || target_um <= 0)
        throw InputError("target depth " + num(target_um) + " µm must be positive");
    AngleForDepth r;
    const double d_lo = depth_of_deg(lo_deg), d_hi = depth_of_deg(hi_deg);
    r.min_depth_um = std::min(d_lo, d_hi);
    r.max_depth_um = std::max(d_lo, d_hi);
    const double slack = 1e-12 * r.max_depth_um;
    if (target_um < r.min_depth_um - slack || target_um > r.max_depth_um + slack) return r;
    r.reachable = true;
    if (std::abs(target_um - d_lo) <= slack) {
        r.angle_deg = lo_deg;
    } else if (std::abs(target_um - d_hi) <= slack) {
        r.angle_deg = hi_deg;
    } else {
        auto f = [&](double x) { return depth_of_deg(x) - target_um; };
        std::uintmax_t iterations = 200;
        const auto [a, b] = boost::math::tools::toms748_solve(
            f, lo_deg, hi_deg, d_lo - target_um, d_hi - target_um,
            boost::math::tools::eps_tolerance<double>(std::numeric_limits<double>::digits - 2), iterations);
        r.angle_deg = 0.5 * (a + b);
    }
    return r;
}

}  // namespace

BeamAngles symmetric_angles(double two_theta_deg) {
    check_two_theta(two_theta_deg);
    return {two_theta_deg / 2, two_theta_deg / 2};
}

BeamAngles fixed_incidence_angles(double two_theta_deg, double incidence_deg) {
    check_two_theta(two_theta_deg);
    if (!std::isfinite(incidence_deg) || incidence_deg <= 0)
        throw InputError("incidence " + num(incidence_deg) + "° must be above 0°");
    if (incidence_deg >= two_theta_deg)
        throw InputError("incidence " + num(incidence_deg) + "° must be below 2θ = " + num(two_theta_deg) +
                         "° (the exit beam would leave below the surface)");
    return {incidence_deg, two_theta_deg - incidence_deg};
}

BeamAngles side_inclination_angles(double two_theta_deg, double psi_deg) {
    check_two_theta(two_theta_deg);
    if (!std::isfinite(psi_deg) || std::abs(psi_deg) >= 90)
        throw InputError("side-inclination tilt ψ = " + num(psi_deg) + "° must be within (−90°, 90°)");
    // Both beams keep the angle θ to the tilt axis' plane; their elevation above the surface
    // satisfies sin(angle) = sinθ cosψ (Noyan & Cohen 1987).
    const double theta = two_theta_deg / 2 * kRadPerDeg;
    const double a = std::asin(std::sin(theta) * std::cos(psi_deg * kRadPerDeg)) / kRadPerDeg;
    return {a, a};
}

BeamAngles omega_tilt_angles(double two_theta_deg, double psi_deg) {
    check_two_theta(two_theta_deg);
    const double theta = two_theta_deg / 2;
    if (!std::isfinite(psi_deg) || std::abs(psi_deg) >= theta)
        throw InputError("ω-tilt ψ = " + num(psi_deg) + "° must be smaller in size than θ = " + num(theta) +
                         "° (a beam would run below the surface)");
    return {theta - psi_deg, theta + psi_deg};
}

DepthSample geometric_sample(double mu_per_cm) {
    check_mu(mu_per_cm);
    return {mu_per_cm, std::nullopt};
}

DepthSample refracting_sample(double delta, double beta, double wavelength_A) {
    DepthSample s{4 * std::numbers::pi * beta / (wavelength_A * 1e-8), OpticalConstants{delta, beta, wavelength_A}};
    check_sample(s);
    return s;
}

double depth_1e_um(const DepthSample& sample, BeamAngles angles) {
    check_sample(sample);
    const bool bad = !std::isfinite(angles.incidence_deg) || !std::isfinite(angles.exit_deg) ||
                     angles.incidence_deg < 0 || angles.exit_deg < 0 || angles.incidence_deg > 180 ||
                     angles.exit_deg > 180;
    if (bad) throw InputError("beam angles " + num(angles.incidence_deg) + "° and " + num(angles.exit_deg) +
                              "° must lie between 0° and 180° from the surface");
    return depth_cm(sample, angles.incidence_deg * kRadPerDeg, angles.exit_deg * kRadPerDeg) * kUmPerCm;
}

double symmetric_depth_1e_um(double mu_per_cm, double two_theta_deg) {
    return depth_1e_um(geometric_sample(mu_per_cm), symmetric_angles(two_theta_deg));
}

double fraction_depth_um(double mu_per_cm, double two_theta_deg, double fraction) {
    return depth_holding_fraction_um(symmetric_depth_1e_um(mu_per_cm, two_theta_deg), fraction);
}

double fixed_incidence_depth_1e_um(double mu_per_cm, double two_theta_deg, double incidence_deg) {
    return depth_1e_um(geometric_sample(mu_per_cm), fixed_incidence_angles(two_theta_deg, incidence_deg));
}

double side_inclination_depth_1e_um(double mu_per_cm, double two_theta_deg, double psi_deg) {
    return depth_1e_um(geometric_sample(mu_per_cm), side_inclination_angles(two_theta_deg, psi_deg));
}

double omega_tilt_depth_1e_um(double mu_per_cm, double two_theta_deg, double psi_deg) {
    return depth_1e_um(geometric_sample(mu_per_cm), omega_tilt_angles(two_theta_deg, psi_deg));
}

double critical_angle_deg(double delta) {
    if (!std::isfinite(delta) || delta < 0) throw InputError("δ = " + num(delta) + " must be a finite number ≥ 0");
    return std::sqrt(2 * delta) / kRadPerDeg;
}

double beam_depth_1e_um(double delta, double beta, double wavelength_A, double angle_deg) {
    const DepthSample s = refracting_sample(delta, beta, wavelength_A);
    if (!std::isfinite(angle_deg) || angle_deg < 0 || angle_deg > 180)
        throw InputError("beam angle " + num(angle_deg) + "° must lie between 0° and 180° from the surface");
    return beam_depth_cm(*s.optics, angle_deg * kRadPerDeg) * kUmPerCm;
}

double grazing_depth_1e_um(double delta, double beta, double wavelength_A, double two_theta_deg,
                           double incidence_deg) {
    return depth_1e_um(refracting_sample(delta, beta, wavelength_A),
                       fixed_incidence_angles(two_theta_deg, incidence_deg));
}

double depth_holding_fraction_um(double depth_1e_um_value, double fraction, std::optional<double> thickness_cm) {
    check_fraction(fraction);
    check_thickness(thickness_cm);
    if (!std::isfinite(depth_1e_um_value) || depth_1e_um_value <= 0)
        throw InputError("1/e depth " + num(depth_1e_um_value) + " µm must be positive");
    // Signal above depth x: 1 − exp(−x/Λ) of the thick total, or of 1 − exp(−t/Λ) for thickness t.
    const double reachable = thickness_cm ? -std::expm1(-*thickness_cm * kUmPerCm / depth_1e_um_value) : 1.0;
    return -depth_1e_um_value * std::log1p(-fraction * reachable);
}

AngleForDepth incidence_for_depth(const DepthSample& sample, double two_theta_deg, double target_depth_um) {
    check_sample(sample);
    check_two_theta(two_theta_deg);
    const double theta = two_theta_deg / 2;
    auto depth_of = [&](double alpha_deg) {
        return depth_cm(sample, alpha_deg * kRadPerDeg, (two_theta_deg - alpha_deg) * kRadPerDeg) * kUmPerCm;
    };
    AngleForDepth r = solve(depth_of, 0.0, theta, target_depth_um);
    if (r.reachable) {
        r.angles = {r.angle_deg, two_theta_deg - r.angle_deg};
        // α → 0 is the edge of the range, never a measurable incidence.
        if (r.angle_deg <= 0) r.reachable = false;
    }
    return r;
}

AngleForDepth tilt_for_depth(const DepthSample& sample, TiltMode mode, double two_theta_deg, double target_depth_um) {
    check_sample(sample);
    check_two_theta(two_theta_deg);
    const double theta = two_theta_deg / 2;
    auto angles_of = [&](double psi_deg) -> BeamAngles {
        if (mode == TiltMode::omega) return {theta - psi_deg, theta + psi_deg};
        const double a = std::asin(std::sin(theta * kRadPerDeg) * std::cos(psi_deg * kRadPerDeg)) / kRadPerDeg;
        return {a, a};
    };
    auto depth_of = [&](double psi_deg) {
        const BeamAngles b = angles_of(psi_deg);
        return depth_cm(sample, b.incidence_deg * kRadPerDeg, b.exit_deg * kRadPerDeg) * kUmPerCm;
    };
    const double psi_max = mode == TiltMode::omega ? theta : 90.0;
    AngleForDepth r = solve(depth_of, 0.0, psi_max, target_depth_um);
    if (r.reachable) {
        r.angles = angles_of(r.angle_deg);
        if (r.angle_deg >= psi_max) r.reachable = false;  // a beam along the surface
    }
    return r;
}

double diffracting_centroid_depth_um(double mu_per_cm, double two_theta_deg, std::optional<double> thickness_cm) {
    check_thickness(thickness_cm);
    const double lambda_um = symmetric_depth_1e_um(mu_per_cm, two_theta_deg);
    if (!thickness_cm) return lambda_um;
    // z̄ = ∫₀ᵗ z e^(−z/Λ) dz / ∫₀ᵗ e^(−z/Λ) dz = Λ (1 − x/(eˣ − 1)), x = t/Λ [derived].
    const double x = *thickness_cm * kUmPerCm / lambda_um;
    const double g = x < 1e-3 ? x / 2 - x * x / 12 + x * x * x * x / 720 : 1 - x / std::expm1(x);
    return lambda_um * g;
}

double transparency_shift_deg(double mu_per_cm, double two_theta_deg, double goniometer_radius_cm,
                              std::optional<double> thickness_cm) {
    if (!std::isfinite(goniometer_radius_cm) || goniometer_radius_cm <= 0)
        throw InputError("goniometer radius " + num(goniometer_radius_cm) + " cm must be positive");
    // A scatterer a depth z below the surface diffracts as if the specimen were displaced by z:
    // Δ2θ = −2 z cosθ / R (specimen displacement; Wilson 1963, Mathematical Theory of X-ray Powder
    // Diffractometry; Klug & Alexander 1974, §5) [from memory]. The centroid of the profile is
    // shifted by the intensity-weighted mean depth z̄, which for a thick sample gives the classical
    // Δ2θ = −sin2θ/(2μR) [derived here; tests/depth_test.cpp checks it by quadrature].
    const double z_cm = diffracting_centroid_depth_um(mu_per_cm, two_theta_deg, thickness_cm) / kUmPerCm;
    const double theta = two_theta_deg / 2 * kRadPerDeg;
    return -2 * z_cm * std::cos(theta) / goniometer_radius_cm / kRadPerDeg;
}

}  // namespace mudepth
