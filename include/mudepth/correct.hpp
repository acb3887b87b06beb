// Absorption correction of a measured pattern: the factor at each 2θ from the
// cylinder or plate functions (never a copy of their formulas), σ carried
// along, normalisation, and the Paalman & Pings container subtraction with the
// empty-container scan interpolated onto the sample's 2θ grid.
#pragma once

#include <optional>
#include <span>
#include <string>
#include <string_view>
#include <vector>

#include "mudepth/cylinder.hpp"
#include "mudepth/pattern.hpp"
#include "mudepth/plate.hpp"

namespace mudepth {

enum class CorrectionGeometry { cylinder, reflection, transmission_normal, transmission_symmetric };

/// "cylinder", "reflection", "transmission-normal", "transmission-symmetric"; InputError otherwise.
CorrectionGeometry parse_correction_geometry(std::string_view text);
std::string_view to_string(CorrectionGeometry geometry);

/// The geometry in dimensionless form.
struct CorrectionSetup {
    CorrectionGeometry geometry = CorrectionGeometry::cylinder;
    double mu_R = 0;                      ///< cylinder: μ × sample radius
    double mu_t = 0;                      ///< plates: μ × thickness
    std::optional<double> incidence_deg;  ///< reflection at fixed incidence (nullopt: symmetric)
    std::optional<double> mu_t_window;    ///< plates: one window foil's μt
    struct Wall {
        double mu_R;          ///< wall μ × SAMPLE radius
        double radius_ratio;  ///< outer wall radius / sample radius
    };
    std::optional<Wall> wall;  ///< cylinder in a container
};

/// The factor that multiplies the measured intensity at each 2θ, exactly the `correction`
/// the `cylinder` and `plate` commands print for the same list of angles:
/// plates 1/(plate_transmission × window_transmission); a cylinder 1/cylinder_transmission;
/// a cylinder in a wall 1/A_s,sc (the sample's scattering attenuated by sample and wall,
/// Paalman & Pings 1962). Throws InputError naming the angle where the geometry does not exist.
std::vector<double> correction_factors(const CorrectionSetup& setup, std::span<const double> two_theta_deg);

enum class NormalizationMode { none, max, at };

struct Normalization {
    NormalizationMode mode = NormalizationMode::none;
    double at_two_theta_deg = 0;  ///< mode at
};

/// "none", "max" or "at:2THETA" (degrees); InputError otherwise.
Normalization parse_normalization(std::string_view text);

struct CorrectionOptions {
    Normalization normalization;
    const Pattern* empty = nullptr;  ///< the empty container (needs setup.wall)
    double empty_scale = 1;          ///< measured scale of the empty scan (e.g. monitor or time ratio)
};

struct CorrectedPattern {
    std::vector<double> intensity;   ///< corrected (and normalised)
    std::vector<double> sigma;       ///< corrected σ; empty when the sample has none
    std::vector<double> correction;  ///< the factor per point (correction_factors)
    std::vector<double> subtracted;  ///< with an empty scan: scale·(A_c,sc/A_c,c)·I_c at each 2θ
    double normalization_divisor = 1;
    std::vector<std::string> notes;  ///< what a reader of the output should know
};

/// Without an empty scan: I' = I × factor, σ' = σ × factor. With one:
/// I_s = [I_sc − s·(A_c,sc/A_c,c)·I_c] / A_s,sc (container_corrected_intensity), I_c linearly
/// interpolated onto the sample's 2θ, σ_s² = [σ_sc² + (s·A_c,sc/A_c,c)² σ_c²] / A_s,sc².
/// Then both are divided by the normalisation divisor (max of I', or I' interpolated at a 2θ).
/// Errors name the file and line: InputError "NAME:LINE: what".
CorrectedPattern correct_pattern(const Pattern& pattern, const CorrectionSetup& setup, const CorrectionOptions& options);

/// Linear interpolation of (x, y) (x strictly increasing) at `at`, with the weight of the
/// upper neighbour; nullopt outside [x.front(), x.back()].
struct Bracket {
    std::size_t lower;
    double weight;  ///< y = (1 − weight)·y[lower] + weight·y[lower + 1]
};
std::optional<Bracket> bracket(std::span<const double> x, double at);

}  // namespace mudepth
