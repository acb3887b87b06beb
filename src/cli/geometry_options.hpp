// The sample-and-geometry options the cylinder, plate and correct commands
// share: the material route (--diameter, --thickness) or the direct route
// (--mu-r, --mu-t), the capillary wall and the window foils. One place parses
// them, so every command turns the same options into the same μR or μt.
#pragma once

#include <string>

#include <CLI/CLI.hpp>

#include "cli/common.hpp"
#include "mudepth/plate.hpp"
#include "mudepth/specimen.hpp"

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

/// --diameter, --mu-r (group "Cylinder") and the wall options (group "Container").
void add_cylinder_geometry_options(CLI::App& app, CylinderGeometryOptions& options);

/// The capillary the options describe (0 < μR <= 30, the wall); throws InputError naming the option.
CapillarySpecimen resolve_cylinder(const SampleOptions& sample, const RadiationOptions& radiation,
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

/// --thickness and --mu-t (group "Plate").
void add_plate_thickness_options(CLI::App& app, PlateGeometryOptions& options);
/// --incidence (group "Plate") and the window options (group "Windows").
void add_plate_incidence_and_window_options(CLI::App& app, PlateGeometryOptions& options);

/// The plate in `mode` the options describe (μt, incidence, windows); throws InputError naming the option.
PlateSpecimen resolve_plate(PlateMode mode, const SampleOptions& sample, const RadiationOptions& radiation,
                            const std::string& table, const PlateGeometryOptions& options);

/// True when any plate or window option was given (--incidence counted apart: see the field).
bool any_given(const PlateGeometryOptions& options);

}  // namespace mudepth::cli
