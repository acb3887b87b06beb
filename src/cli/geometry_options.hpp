// The sample-and-geometry options the cylinder, plate and correct commands
// share: the material route (--diameter, --thickness) or the direct route
// (--mu-r, --mu-t), the capillary wall and the window foils. One place parses
// them, so every command turns the same options into the same μR or μt.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include <CLI/CLI.hpp>

#include "cli/common.hpp"
#include "mudepth/plate.hpp"

namespace mudepth::cli {

bool has_material(const SampleOptions& sample);

// ---- cylinder ----

struct CylinderGeometryOptions {
    std::string diameter;
    std::string mu_R;
    std::string container_material;
    std::string wall;
    std::string mu_R_container;
    std::string radius_ratio;
};

/// The capillary wall as the options describe it.
struct ContainerWall {
    std::string material;                ///< empty on the direct route
    std::optional<double> mu_per_cm;     ///< material route
    std::optional<double> thickness_cm;  ///< material route
    double mu_R = 0;                     ///< wall μ × sample radius
    double radius_ratio = 1;
};

/// The cylinder sample: μR and the wall, with what they came from.
struct CylinderSample {
    std::string sample;
    std::string radiation;
    std::optional<double> energy_keV, mu_per_cm, diameter_cm, density_g_cm3;
    double mu_R = 0;
    std::optional<ContainerWall> wall;
    std::vector<std::string> warnings;
};

/// --diameter, --mu-r (group "Cylinder") and the wall options (group "Container").
void add_cylinder_geometry_options(CLI::App& app, CylinderGeometryOptions& options);

/// μR (0 < μR <= 30) and the wall from the options; throws InputError naming the option.
CylinderSample resolve_cylinder(const SampleOptions& sample, const RadiationOptions& radiation,
                                const std::string& table, const CylinderGeometryOptions& options);

/// True when any cylinder or container option was given.
bool any_given(const CylinderGeometryOptions& options);

// ---- plate ----

struct PlateGeometryOptions {
    std::string thickness;
    std::string mu_t;
    std::string incidence;
    std::string window_material;
    std::string window_thickness;
    std::string mu_t_window;
};

/// Largest μt accepted with --mu-t and --mu-t-window: far beyond any real plate
/// (e^-1e6 is zero in double precision); above it the value is a typo.
inline constexpr double kMaxDirectMuT = 1e6;

struct WindowFoils {
    std::string material;
    std::optional<double> mu_per_cm, thickness_cm;
    double mu_t = 0;  ///< of one foil
};

struct PlateSample {
    std::string sample, radiation;
    std::optional<double> mu_per_cm, thickness_cm, incidence_deg, energy_keV, density_g_cm3;
    double mu_t = 0;
    PlateMode mode = PlateMode::reflection;
    std::optional<WindowFoils> window;
};

/// --thickness and --mu-t (group "Plate").
void add_plate_thickness_options(CLI::App& app, PlateGeometryOptions& options);
/// --incidence (group "Plate") and the window options (group "Windows").
void add_plate_incidence_and_window_options(CLI::App& app, PlateGeometryOptions& options);

/// μt, the incidence and the windows for a plate in `mode`; throws InputError naming the option.
PlateSample resolve_plate(PlateMode mode, const SampleOptions& sample, const RadiationOptions& radiation,
                          const std::string& table, const PlateGeometryOptions& options);

/// True when any plate or window option was given (--incidence counted apart: see the field).
bool any_given(const PlateGeometryOptions& options);

}  // namespace mudepth::cli
