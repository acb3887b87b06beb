// Depth probed in reflection: symmetric, fixed and grazing incidence (with
// refraction), tilted specimens for stress work, the inverse (the angle that
// probes a target depth) and the transparency peak shift of Bragg-Brentano.
// Angles in degrees at this interface (to the sample surface), lengths in cm
// or µm as the names say, μ in 1/cm.
#pragma once

#include <optional>

namespace mudepth {

/// Incidence and exit angles of the two beams, measured from the sample surface, degrees.
struct BeamAngles {
    double incidence_deg = 0;
    double exit_deg = 0;
};

/// Symmetric reflection: both angles θ = 2θ/2.
BeamAngles symmetric_angles(double two_theta_deg);
/// Fixed incidence α: exit 2θ − α. Throws unless 0 < α < 2θ.
BeamAngles fixed_incidence_angles(double two_theta_deg, double incidence_deg);
/// Side inclination (χ tilt) by ψ about the axis in the diffraction plane and the
/// surface: both beams make the angle asin(sinθ cosψ) with the surface. |ψ| < 90°.
BeamAngles side_inclination_angles(double two_theta_deg, double psi_deg);
/// ω-tilt (iso-inclination) by ψ about the goniometer axis: incidence θ − ψ, exit θ + ψ. |ψ| < θ.
BeamAngles omega_tilt_angles(double two_theta_deg, double psi_deg);

/// Refractive index n = 1 − δ − iβ of the sample, and the wavelength it holds for.
/// For depths, β should be λμ/(4π) with the same μ used everywhere (REFERENCES, grazing incidence).
struct OpticalConstants {
    double delta = 0;
    double beta = 0;
    double wavelength_A = 0;
};

/// The sample as the depth functions see it: μ and, when known, its optical constants.
/// With optics, every depth includes refraction (Parratt 1954); without, it is geometric.
struct DepthSample {
    double mu_per_cm = 0;
    std::optional<OpticalConstants> optics;
};

/// A sample without refraction (only μ known).
DepthSample geometric_sample(double mu_per_cm);
/// A refracting sample; μ = 4πβ/λ follows from β.
DepthSample refracting_sample(double delta, double beta, double wavelength_A);

// ---- closed forms without refraction (ITC Vol. C Table 6.3.3.1; Noyan & Cohen 1987) ----

/// D1: 1/e depth of symmetric reflection, sinθ/(2μ), µm.
double symmetric_depth_1e_um(double mu_per_cm, double two_theta_deg);
/// D1: depth holding `fraction` of the symmetric signal of a thick sample,
/// ln(1/(1−G)) sinθ/(2μ), µm (Cullity).
double fraction_depth_um(double mu_per_cm, double two_theta_deg, double fraction);
/// D2: 1/e depth at fixed incidence α, 1/(μ(1/sinα + 1/sin(2θ−α))), µm.
double fixed_incidence_depth_1e_um(double mu_per_cm, double two_theta_deg, double incidence_deg);
/// D4: side inclination by ψ, sinθ cosψ/(2μ), µm.
double side_inclination_depth_1e_um(double mu_per_cm, double two_theta_deg, double psi_deg);
/// D4: ω-tilt by ψ, (sin²θ − sin²ψ)/(2μ sinθ cosψ), µm.
double omega_tilt_depth_1e_um(double mu_per_cm, double two_theta_deg, double psi_deg);

// ---- grazing incidence with refraction (D3) ----

/// Critical angle of total external reflection α_c = √(2δ), degrees.
double critical_angle_deg(double delta);
/// One beam's 1/e intensity depth Λ(α) = 1/(2k Im q), q = √(sin²α − 2δ + 2iβ), k = 2π/λ,
/// µm (Parratt 1954; Dosch 1987; Toney & Brennan 1989). α ≥ 0 degrees (0 gives the evanescent limit).
double beam_depth_1e_um(double delta, double beta, double wavelength_A, double angle_deg);
/// D3: 1/e depth of the diffracted signal at incidence α, exit 2θ − α, with refraction:
/// 1/Λ = 1/Λ(α) + 1/Λ(2θ − α), µm.
double grazing_depth_1e_um(double delta, double beta, double wavelength_A, double two_theta_deg,
                           double incidence_deg);

// ---- any geometry ----

/// 1/e depth of the diffracted signal for beams at these angles to the surface, µm:
/// geometric (1/(μ(1/sinα + 1/sinε))) or refracted (1/Λ(α) + 1/Λ(ε)) as the sample says.
/// This is the one function every depth goes through. Angles ≥ 0 (0 only with optics).
double depth_1e_um(const DepthSample& sample, BeamAngles angles);

/// Depth above which `fraction` of the signal comes, for a signal decaying as exp(−z/Λ):
/// Λ ln(1/(1−G)); with a finite thickness t (cm) the fraction of that layer's signal,
/// −Λ ln(1 − G(1 − exp(−t/Λ))). µm.
double depth_holding_fraction_um(double depth_1e_um, double fraction,
                                 std::optional<double> thickness_cm = std::nullopt);

// ---- the inverse (D5) ----

/// Result of solving for the angle that probes a target 1/e depth.
struct AngleForDepth {
    bool reachable = false;
    double angle_deg = 0;         ///< the incidence angle or tilt found (when reachable)
    BeamAngles angles;            ///< the beams at that angle (when reachable)
    double min_depth_um = 0;      ///< shallowest 1/e depth this 2θ can reach
    double max_depth_um = 0;      ///< deepest (symmetric reflection)
};

/// The incidence α in (0, θ] whose 1/e depth equals target_depth_um at this 2θ (Boost.Math
/// TOMS 748). The mirror 2θ − α gives the same depth. Unreachable targets report the range:
/// from α → 0 (the evanescent limit with refraction, 0 without) to the symmetric maximum.
AngleForDepth incidence_for_depth(const DepthSample& sample, double two_theta_deg, double target_depth_um);

enum class TiltMode { side_inclination, omega };

/// The tilt ψ ≥ 0 whose 1/e depth equals target_depth_um (ψ = 0 is the deepest).
AngleForDepth tilt_for_depth(const DepthSample& sample, TiltMode mode, double two_theta_deg,
                             double target_depth_um);

// ---- transparency (D6) ----

/// Depth of the centroid of the diffracting volume in symmetric reflection, µm:
/// Λ for a thick sample, Λ − t e^(−t/Λ)/(1 − e^(−t/Λ)) for thickness t (Λ = sinθ/2μ).
double diffracting_centroid_depth_um(double mu_per_cm, double two_theta_deg,
                                     std::optional<double> thickness_cm = std::nullopt);

/// Transparency shift of the peak centroid in Bragg-Brentano (symmetric) geometry, degrees 2θ
/// (negative: to lower angle): a centroid depth z̄ acts as a specimen displacement,
/// Δ2θ = −2 z̄ cosθ / R. Thick: −sin2θ/(2μR); thickness t with μ → 0: −t cosθ/R.
double transparency_shift_deg(double mu_per_cm, double two_theta_deg, double goniometer_radius_cm,
                              std::optional<double> thickness_cm = std::nullopt);

}  // namespace mudepth
