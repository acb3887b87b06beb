// Flat-plate absorption factors (ITC C §6.3.3, Table 6.3.3.1).
#include "mudepth/plate.hpp"

#include <cmath>
#include <numbers>
#include <string>

#include "format.hpp"
#include "mudepth/error.hpp"

namespace mudepth {

namespace {

constexpr double kDeg = std::numbers::pi / 180;

std::string deg_text(double deg) { return format_number(deg) + "°"; }

void check_angle(double two_theta_deg) {
    if (!std::isfinite(two_theta_deg) || two_theta_deg < 0 || two_theta_deg > 180)
        throw InputError("2θ = " + deg_text(two_theta_deg) + " is outside 0..180°");
}

void check_mu_t(double mu_t, const char* what) {
    if (!std::isfinite(mu_t) || mu_t <= 0) throw InputError(std::string(what) + " = " + format_number(mu_t) + " must be a positive number");
}

/// 1/sinα + 1/sinβ of reflection: symmetric (α = β = θ) or fixed incidence α, β = 2θ − α.
double reflection_path_factor(double two_theta_deg, std::optional<double> incidence_deg) {
    check_angle(two_theta_deg);
    if (two_theta_deg == 0) throw InputError("reflection needs 2θ above 0°");
    if (!incidence_deg) return 2 / std::sin(two_theta_deg / 2 * kDeg);
    const double a = *incidence_deg;
    if (!std::isfinite(a) || a <= 0) throw InputError("incidence " + deg_text(a) + " must be above 0°");
    if (a >= two_theta_deg)
        throw InputError("incidence " + deg_text(a) + " must be below 2θ = " + deg_text(two_theta_deg));
    return 1 / std::sin(a * kDeg) + 1 / std::sin((two_theta_deg - a) * kDeg);
}

void refuse_incidence(PlateMode mode, std::optional<double> incidence_deg) {
    if (incidence_deg)
        throw InputError("a fixed incidence applies to reflection only, not to " + std::string(to_string(mode)));
}

/// sec 2θ − 1 = 2 sin²θ / cos 2θ for the normal-beam plate, which exists below 2θ = 90°.
double normal_excess(double two_theta_deg) {
    check_angle(two_theta_deg);
    if (two_theta_deg >= 90)
        throw InputError("transmission-normal: 2θ = " + deg_text(two_theta_deg) +
                         " does not exit through the back face; it needs 2θ below 90°");
    const double s = std::sin(two_theta_deg / 2 * kDeg);
    return 2 * s * s / std::cos(two_theta_deg * kDeg);
}

double symmetric_cos_theta(double two_theta_deg) {
    check_angle(two_theta_deg);
    if (two_theta_deg >= 180) throw InputError("transmission-symmetric needs 2θ below 180°");
    return std::cos(two_theta_deg / 2 * kDeg);
}

}  // namespace

PlateMode parse_plate_mode(std::string_view text) {
    for (auto m : {PlateMode::reflection, PlateMode::transmission_normal, PlateMode::transmission_symmetric})
        if (text == to_string(m)) return m;
    throw InputError("unknown plate mode '" + std::string(text) +
                     "'; modes: reflection, transmission-normal, transmission-symmetric");
}

std::string_view to_string(PlateMode mode) {
    switch (mode) {
        case PlateMode::reflection: return "reflection";
        case PlateMode::transmission_normal: return "transmission-normal";
        case PlateMode::transmission_symmetric: return "transmission-symmetric";
    }
    return "reflection";
}

double plate_transmission(PlateMode mode, double mu_t, double two_theta_deg, std::optional<double> incidence_deg) {
    check_mu_t(mu_t, "μt");
    switch (mode) {
        case PlateMode::reflection:
            // 1 − exp(−μt(1/sinα + 1/sinβ)) (ITC C Table 6.3.3.1), expm1 for thin plates.
            return -std::expm1(-mu_t * reflection_path_factor(two_theta_deg, incidence_deg));
        case PlateMode::transmission_symmetric:
            refuse_incidence(mode, incidence_deg);
            return std::exp(-mu_t / symmetric_cos_theta(two_theta_deg));
        case PlateMode::transmission_normal: {
            refuse_incidence(mode, incidence_deg);
            // e^(−μt) (1 − e^(−b)) / b with b = μt(sec2θ − 1): stable as b → 0 (limit e^(−μt)).
            const double b = mu_t * normal_excess(two_theta_deg);
            const double ratio = b < 1e-300 ? 1.0 : -std::expm1(-b) / b;
            return std::exp(-mu_t) * ratio;
        }
    }
    return 0;
}

double infinite_thickness_mu_t(double fraction, double two_theta_deg, std::optional<double> incidence_deg) {
    if (!std::isfinite(fraction) || fraction <= 0 || fraction >= 1)
        throw InputError("fraction " + format_number(fraction) + " must lie between 0 and 1");
    return -std::log1p(-fraction) / reflection_path_factor(two_theta_deg, incidence_deg);
}

double transmission_optimum_mu_t(PlateMode mode, double two_theta_deg) {
    switch (mode) {
        case PlateMode::reflection:
            throw InputError("reflection has no optimum thickness: thicker is always more intense");
        case PlateMode::transmission_symmetric: return symmetric_cos_theta(two_theta_deg);
        case PlateMode::transmission_normal: {
            // d/dx [e^(−x) − e^(−x s)] = 0 → x = ln s / (s − 1), s = sec 2θ; log1p(m)/m with m = s − 1.
            const double m = normal_excess(two_theta_deg);
            return m < 1e-12 ? 1 - m / 2 : std::log1p(m) / m;
        }
    }
    return 0;
}

double window_transmission(PlateMode mode, double mu_t_window, double two_theta_deg,
                           std::optional<double> incidence_deg) {
    check_mu_t(mu_t_window, "window μt");
    switch (mode) {
        case PlateMode::reflection:
            return std::exp(-mu_t_window * reflection_path_factor(two_theta_deg, incidence_deg));
        case PlateMode::transmission_symmetric:
            refuse_incidence(mode, incidence_deg);
            return std::exp(-2 * mu_t_window / symmetric_cos_theta(two_theta_deg));
        case PlateMode::transmission_normal:
            refuse_incidence(mode, incidence_deg);
            return std::exp(-mu_t_window * (2 + normal_excess(two_theta_deg)));
    }
    return 0;
}

}  // namespace mudepth
