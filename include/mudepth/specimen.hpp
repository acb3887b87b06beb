// A specimen in its geometry: the optical thickness the absorption factors need
// (μR of a capillary, μt of a flat plate), the capillary wall or the window
// foils, and what those numbers came from (sample, density, radiation, μ, sizes)
// for reports and provenance headers. Built either from a material at an energy
// and a size, or from the optical thickness given directly.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "mudepth/cross_section.hpp"
#include "mudepth/material.hpp"
#include "mudepth/plate.hpp"
#include "mudepth/radiation.hpp"

namespace mudepth {

// ---- capillary (cylinder) ----

/// The capillary wall around the sample.
struct CapillaryWall {
    std::string material;                ///< the wall material's name; empty when given directly
    std::optional<double> mu_per_cm;     ///< material route
    std::optional<double> thickness_cm;  ///< material route
    double mu_R = 0;                     ///< the WALL's μ times the SAMPLE radius
    double radius_ratio = 1;             ///< outer wall radius / sample radius
};

struct CapillarySpecimen {
    std::string sample;     ///< the material's name, or "given as μR"
    std::string radiation;  ///< radiation label; empty when μR is given directly
    std::optional<double> energy_keV, mu_per_cm, inner_diameter_cm, density_g_cm3;
    std::optional<CrossSectionTable> table;  ///< the cross sections μ came from (material route)
    double mu_R = 0;                         ///< μ × sample radius, 0 < μR <= 30
    std::optional<CapillaryWall> wall;
    std::vector<std::string> warnings;
};

/// μR given directly; InputError unless 0 < μR <= 30 (kMaxCylinderMuR).
CapillarySpecimen capillary_from_mu_R(double mu_R);

/// A capillary of that inner diameter filled with the material: μR = μ·d/2. InputError when
/// μR exceeds 30 ("too absorbing for a capillary"); a warning above μR = 3.
CapillarySpecimen capillary_from_material(const Material& sample, const Radiation& radiation,
                                          double inner_diameter_cm,
                                          CrossSectionTable table = CrossSectionTable::elam);

/// The same capillary in a wall given directly: the wall's μ × the sample radius (>= 0)
/// and outer radius / sample radius (> 1). InputError otherwise.
CapillarySpecimen with_wall(CapillarySpecimen capillary, double wall_mu_R, double radius_ratio);

/// The same capillary in a wall of `wall_material` and thickness (cm), at the capillary's
/// energy and table; needs a capillary built from a material (its diameter), InputError otherwise.
CapillarySpecimen with_wall(CapillarySpecimen capillary, const Material& wall_material, double wall_thickness_cm);

// ---- flat plate ----

/// Window foils: one on each side in transmission, one cover foil in reflection.
struct WindowFoils {
    std::string material;  ///< the foil material's name; empty when μt is given directly
    std::optional<double> mu_per_cm, thickness_cm;
    double mu_t = 0;  ///< of ONE foil
};

struct PlateSpecimen {
    std::string sample;     ///< the material's name, or "given as μt"
    std::string radiation;  ///< radiation label; empty when nothing needed an energy
    std::optional<double> energy_keV, mu_per_cm, thickness_cm, density_g_cm3;
    std::optional<CrossSectionTable> table;  ///< the cross sections μ came from (material route)
    PlateMode mode = PlateMode::reflection;
    double mu_t = 0;                      ///< μ × thickness
    std::optional<double> incidence_deg;  ///< reflection at a fixed incidence; nullopt: symmetric
    std::optional<WindowFoils> window;
};

/// Largest μt accepted for a plate or a foil: far beyond any real plate (e^-1e6 is zero in
/// double precision); above it the value is a typo.
inline constexpr double kMaxPlateMuT = 1e6;

/// μt given directly; InputError unless 0 < μt <= kMaxPlateMuT.
PlateSpecimen plate_from_mu_t(PlateMode mode, double mu_t);

/// A plate of the material and thickness (cm): μt = μ·t.
PlateSpecimen plate_from_material(PlateMode mode, const Material& sample, const Radiation& radiation,
                                  double thickness_cm, CrossSectionTable table = CrossSectionTable::elam);

/// Fixed incidence (degrees); reflection only, InputError otherwise.
PlateSpecimen with_incidence(PlateSpecimen plate, double incidence_deg);

/// Window foils given directly as the μt of one foil; InputError unless 0 < μt <= kMaxPlateMuT.
PlateSpecimen with_windows(PlateSpecimen plate, double mu_t_window);

/// Window foils of a material and thickness (cm, one foil) at the radiation (which the plate
/// records when μt was given directly and it had none).
PlateSpecimen with_windows(PlateSpecimen plate, const Material& foil_material, double foil_thickness_cm,
                           const Radiation& radiation, CrossSectionTable table = CrossSectionTable::elam);

}  // namespace mudepth
