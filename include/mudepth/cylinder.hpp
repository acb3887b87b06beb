// Absorption factors of a cylindrical sample (capillary) in the equatorial
// plane: the sample alone, and the sample in a container wall (Paalman & Pings).
#pragma once

#include <span>
#include <vector>

namespace mudepth {

/// Largest μR the cylinder factors accept.
inline constexpr double kMaxCylinderMuR = 30.0;

/// Absorption factor A = (1/V)∫exp(−μT)dV of a uniformly bathed, infinitely long
/// cylinder in the equatorial plane (ITC C §6.3.3); the correction is A* = 1/A.
/// 0 < mu_R <= 30 (μ times the radius), 0 <= 2θ <= 180. Exact to 1e-6 relative
/// (μR <= 10) and 1e-4 above; in practice about 1e-10. Throws InputError.
double cylinder_transmission(double mu_R, double two_theta_deg);

/// A at many angles at once (a whole pattern): the same accuracy at every angle.
/// Long lists use an interpolant in cos 2θ built on directly computed nodes and
/// refined until it reproduces fresh direct values to 1e-10.
std::vector<double> cylinder_transmission(double mu_R, std::span<const double> two_theta_deg);

/// Paalman & Pings (1962) factors A_{i,jk}: scattering in region i (s sample,
/// c container wall), attenuated in regions j, k. Each is a volume average over region i.
struct ContainerFactors {
    double A_s_s;   ///< sample scattering, attenuated by the sample (= cylinder_transmission)
    double A_s_sc;  ///< sample scattering, attenuated by sample and wall
    double A_c_sc;  ///< wall scattering, attenuated by sample and wall
    double A_c_c;   ///< wall scattering, attenuated by the wall only (empty container)
};

/// Largest outer-radius / sample-radius ratio accepted.
inline constexpr double kMaxRadiusRatio = 20.0;

/// The four factors of a sample of radius R filling a tube of outer radius
/// radius_ratio·R. mu_R_container is the WALL's μ times the SAMPLE radius;
/// 0 <= mu_R_sample <= 30 (0 only here: an empty tube), mu_R_container >= 0 with
/// a wall optical thickness μ_c·(radius_ratio − 1)·R <= 30, 1 < radius_ratio <= 20.
/// Accurate to 1e-4 relative (in practice 1e-7). Throws InputError.
ContainerFactors container_factors(double mu_R_sample, double mu_R_container, double radius_ratio,
                                   double two_theta_deg);

/// The factors at many angles (interpolated in cos 2θ like cylinder_transmission).
std::vector<ContainerFactors> container_factors(double mu_R_sample, double mu_R_container, double radius_ratio,
                                                std::span<const double> two_theta_deg);

/// Container subtraction (Paalman & Pings 1962): the sample's absorption-corrected
/// intensity I_s = [I_sc − (A_c,sc / A_c,c) I_c] / A_s,sc from the sample-in-container
/// intensity I_sc and the empty-container intensity I_c at the same angle.
double container_corrected_intensity(const ContainerFactors& factors, double I_sample_in_container,
                                     double I_empty_container);

}  // namespace mudepth
