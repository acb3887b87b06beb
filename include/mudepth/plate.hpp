// Absorption factors of flat plates: finite-thickness reflection, transmission
// with the beam normal to the plate or symmetric, and window foils (ITC C §6.3.3).
#pragma once

#include <optional>
#include <string_view>

namespace mudepth {

enum class PlateMode { reflection, transmission_normal, transmission_symmetric };

/// "reflection", "transmission-normal", "transmission-symmetric"; throws InputError listing the modes.
PlateMode parse_plate_mode(std::string_view text);
std::string_view to_string(PlateMode mode);

/// reflection: intensity relative to an infinitely thick sample, 1 − exp(−μt(1/sinα + 1/sinβ)),
/// α the incidence (nullopt: symmetric, α = θ), β = 2θ − α (ITC C Table 6.3.3.1);
/// transmission modes: A = (1/V)∫exp(−μT)dV — symmetric exp(−μt/cosθ), normal
/// [e^(−μt) − e^(−μt/cos2θ)]/[μt(1/cos2θ − 1)] (derived). mu_t = μ × thickness > 0.
/// incidence_deg only for reflection. Throws InputError where the geometry does not
/// exist (reflection at 2θ = 0 or α outside (0, 2θ); normal at 2θ >= 90°; symmetric at 2θ = 180°).
double plate_transmission(PlateMode mode, double mu_t, double two_theta_deg,
                          std::optional<double> incidence_deg = std::nullopt);

/// Reflection: the μt from which `fraction` (0 < f < 1, e.g. 0.99, 0.999) of the
/// infinitely-thick intensity comes, ln(1/(1−f)) / (1/sinα + 1/sinβ); symmetric
/// ln(1/(1−f)) sinθ/2 (Cullity). Divide by μ for the thickness.
double infinite_thickness_mu_t(double fraction, double two_theta_deg, std::optional<double> incidence_deg = std::nullopt);

/// Transmission modes: the μt that maximises the diffracted intensity μt·A:
/// symmetric cosθ, normal ln(sec2θ)/(sec2θ − 1) (→ 1 at 2θ → 0) (derived). Throws for reflection.
double transmission_optimum_mu_t(PlateMode mode, double two_theta_deg);

/// Transmission of the window foils, mu_t_window = μ × thickness of ONE foil:
/// transmission modes have one foil on each side (the beam crosses one going in,
/// the other going out); reflection has one cover foil crossed going in and out.
/// Normal: exp(−μt_w(1 + 1/cos2θ)); symmetric: exp(−2μt_w/cosθ); reflection:
/// exp(−μt_w(1/sinα + 1/sinβ)) (Beer-Lambert along each path).
double window_transmission(PlateMode mode, double mu_t_window, double two_theta_deg,
                           std::optional<double> incidence_deg = std::nullopt);

}  // namespace mudepth
