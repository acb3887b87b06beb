// The shared sample-and-geometry options of cylinder, plate and correct.
#include "cli/geometry_options.hpp"

#include <optional>

#include "cli/output.hpp"
#include "mudepth/composition.hpp"
#include "mudepth/error.hpp"
#include "mudepth/specimen.hpp"

namespace mudepth::cli {

bool has_material(const SampleOptions& s) { return !s.formula.empty() || !s.material.empty() || !s.phases.empty(); }

void add_cylinder_geometry_options(CLI::App& sub, CylinderGeometryOptions& o) {
    sub.add_option("--diameter", o.diameter, "Inner diameter of the capillary, filled with sample [nm, um, mm, cm; bare number: mm]")
        ->type_name("LENGTH")->check(nonempty())->group("Cylinder");
    sub.add_option("--mu-r", o.mu_R, "μR directly (μ times the sample radius), 0 < μR <= 30, instead of a material")
        ->type_name("X")->check(nonempty())->group("Cylinder");
    sub.add_option("--container-material", o.container_material,
                   "Material of the capillary wall, a composition name or file (e.g. borosilicate-3.3)")
        ->type_name("NAME|FILE")->check(nonempty())->group("Container");
    sub.add_option("--wall", o.wall, "Wall thickness of the capillary [nm, um, mm, cm; bare number: mm]")
        ->type_name("LENGTH")->check(nonempty())->group("Container");
    sub.add_option("--mu-r-container", o.mu_R_container, "The wall's μ times the SAMPLE radius, instead of a material")
        ->type_name("X")->check(nonempty())->group("Container");
    sub.add_option("--radius-ratio", o.radius_ratio, "Outer radius of the wall over the sample radius, > 1")
        ->type_name("X")->check(nonempty())->group("Container");
}

bool any_given(const CylinderGeometryOptions& o) {
    return !o.diameter.empty() || !o.mu_R.empty() || !o.container_material.empty() || !o.wall.empty() ||
           !o.mu_R_container.empty() || !o.radius_ratio.empty();
}

CapillarySpecimen resolve_cylinder(const SampleOptions& sample, const RadiationOptions& radiation_options,
                                   const std::string& table, const CylinderGeometryOptions& o) {
    std::optional<CapillarySpecimen> c;
    if (!o.mu_R.empty()) {
        if (has_material(sample)) throw InputError("--mu-r gives μR directly; do not combine it with a sample material");
        if (!o.diameter.empty()) throw InputError("give either --mu-r or --diameter, not both");
        const double mu_R = parse_number("--mu-r", o.mu_R);
        if (mu_R <= 0) throw InputError("--mu-r: μR = " + o.mu_R + " must be positive");
        c = capillary_from_mu_R(mu_R);
    } else {
        if (!has_material(sample))
            throw InputError("no sample given; use --mu-r, or a material (--formula, --material) with --diameter");
        if (o.diameter.empty()) throw InputError("the material route needs --diameter (inner diameter of the capillary)");
        const Material m = build_material(sample);
        const Radiation radiation = build_radiation(radiation_options);
        const double diameter_cm = parse_length_cm("--diameter", o.diameter);
        c = capillary_from_material(m, radiation, diameter_cm, build_table(table));
    }

    const bool wall_by_material = !o.container_material.empty() || !o.wall.empty();
    const bool wall_direct = !o.mu_R_container.empty() || !o.radius_ratio.empty();
    if (wall_by_material && wall_direct)
        throw InputError("describe the wall either by --container-material and --wall, or by --mu-r-container and "
                         "--radius-ratio");
    if (wall_by_material) {
        if (o.container_material.empty() || o.wall.empty())
            throw InputError("a container wall needs both --container-material and --wall");
        if (!o.mu_R.empty())
            throw InputError("--container-material needs the sample's --diameter; with --mu-r use --mu-r-container "
                             "and --radius-ratio");
        const Composition wall = find_composition(o.container_material);
        c = with_wall(std::move(*c), wall.material, parse_length_cm("--wall", o.wall));
    } else if (wall_direct) {
        if (o.mu_R_container.empty() || o.radius_ratio.empty())
            throw InputError("a container wall needs both --mu-r-container and --radius-ratio");
        const double wall_mu_R = parse_number("--mu-r-container", o.mu_R_container);
        if (wall_mu_R < 0) throw InputError("--mu-r-container: " + o.mu_R_container + " must be zero or positive");
        const double radius_ratio = parse_number("--radius-ratio", o.radius_ratio);
        if (radius_ratio <= 1)
            throw InputError("--radius-ratio: " + o.radius_ratio + " must be above 1 (outer wall radius over sample radius)");
        c = with_wall(std::move(*c), wall_mu_R, radius_ratio);
    }
    return *c;
}

void add_plate_thickness_options(CLI::App& sub, PlateGeometryOptions& o) {
    sub.add_option("--thickness", o.thickness, "Thickness of the plate [nm, um, mm, cm; bare number: mm]")
        ->type_name("LENGTH")->check(nonempty())->group("Plate");
    sub.add_option("--mu-t", o.mu_t, "μt directly (μ times the thickness), instead of a material")
        ->type_name("X")->check(nonempty())->group("Plate");
}

void add_plate_incidence_and_window_options(CLI::App& sub, PlateGeometryOptions& o) {
    sub.add_option("--incidence", o.incidence, "Fixed incidence angle, reflection only (default: symmetric) [degrees]")
        ->type_name("DEG")->check(nonempty())->group("Plate");
    sub.add_option("--window-material", o.window_material,
                   "Window foils: a composition name or file (transmission: one foil each side; reflection: a cover foil)")
        ->type_name("NAME|FILE")->check(nonempty())->group("Windows");
    sub.add_option("--window-thickness", o.window_thickness, "Thickness of ONE window foil [nm, um, mm, cm; bare number: mm]")
        ->type_name("LENGTH")->check(nonempty())->group("Windows");
    sub.add_option("--mu-t-window", o.mu_t_window, "μt of one window foil directly, instead of a material")
        ->type_name("X")->check(nonempty())->group("Windows");
}

bool any_given(const PlateGeometryOptions& o) {
    return !o.thickness.empty() || !o.mu_t.empty() || !o.incidence.empty() || !o.window_material.empty() ||
           !o.window_thickness.empty() || !o.mu_t_window.empty();
}

PlateSpecimen resolve_plate(PlateMode mode, const SampleOptions& sample, const RadiationOptions& radiation_options,
                            const std::string& table, const PlateGeometryOptions& o) {
    std::optional<double> incidence_deg;
    if (!o.incidence.empty()) {
        if (mode != PlateMode::reflection)
            throw InputError("--incidence applies to reflection only, not to " + std::string(to_string(mode)));
        incidence_deg = parse_number("--incidence", o.incidence);
    }
    const bool direct = !o.mu_t.empty();
    if (!direct && !has_material(sample))
        throw InputError("no sample given; use --mu-t, or a material (--formula, --material) with --thickness");
    std::optional<Radiation> radiation;
    if (!direct || !o.window_material.empty()) radiation = build_radiation(radiation_options);
    std::optional<PlateSpecimen> p;
    if (direct) {
        if (has_material(sample)) throw InputError("--mu-t gives μt directly; do not combine it with a sample material");
        if (!o.thickness.empty()) throw InputError("give either --mu-t or --thickness, not both");
        const double mu_t = parse_number("--mu-t", o.mu_t);
        if (mu_t <= 0) throw InputError("--mu-t: μt = " + o.mu_t + " must be positive");
        if (mu_t > kMaxPlateMuT) throw InputError("--mu-t: μt = " + o.mu_t + " is above the limit 1e6");
        p = plate_from_mu_t(mode, mu_t);
    } else {
        if (o.thickness.empty()) throw InputError("the material route needs --thickness (the plate's thickness)");
        const Material m = build_material(sample);
        const double thickness_cm = parse_length_cm("--thickness", o.thickness);
        p = plate_from_material(mode, m, *radiation, thickness_cm, build_table(table));
    }
    if (incidence_deg) p = with_incidence(std::move(*p), *incidence_deg);

    const bool window_material = !o.window_material.empty() || !o.window_thickness.empty();
    if (window_material && !o.mu_t_window.empty())
        throw InputError("describe the windows either by --window-material and --window-thickness, or by --mu-t-window");
    if (window_material) {
        if (o.window_material.empty() || o.window_thickness.empty())
            throw InputError("windows need both --window-material and --window-thickness");
        const Composition foil = find_composition(o.window_material);
        const double foil_cm = parse_length_cm("--window-thickness", o.window_thickness);
        p = with_windows(std::move(*p), foil.material, foil_cm, *radiation, build_table(table));
    } else if (!o.mu_t_window.empty()) {
        const double mu_t_window = parse_number("--mu-t-window", o.mu_t_window);
        if (mu_t_window <= 0) throw InputError("--mu-t-window: " + o.mu_t_window + " must be positive");
        if (mu_t_window > kMaxPlateMuT) throw InputError("--mu-t-window: " + o.mu_t_window + " is above the limit 1e6");
        p = with_windows(std::move(*p), mu_t_window);
    }
    return *p;
}

}  // namespace mudepth::cli
