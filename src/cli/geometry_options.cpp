// The shared sample-and-geometry options of cylinder, plate and correct.
#include "cli/geometry_options.hpp"

#include "cli/output.hpp"
#include "mudepth/attenuation.hpp"
#include "mudepth/composition.hpp"
#include "mudepth/cylinder.hpp"
#include "mudepth/error.hpp"

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

CylinderSample resolve_cylinder(const SampleOptions& sample, const RadiationOptions& radiation_options,
                                const std::string& table, const CylinderGeometryOptions& o) {
    CylinderSample r;
    const bool direct = !o.mu_R.empty();
    std::optional<Radiation> radiation;
    if (direct) {
        if (has_material(sample)) throw InputError("--mu-r gives μR directly; do not combine it with a sample material");
        if (!o.diameter.empty()) throw InputError("give either --mu-r or --diameter, not both");
        r.mu_R = parse_number("--mu-r", o.mu_R);
        if (r.mu_R <= 0) throw InputError("--mu-r: μR = " + o.mu_R + " must be positive");
        r.sample = "given as μR";
    } else {
        if (!has_material(sample))
            throw InputError("no sample given; use --mu-r, or a material (--formula, --material) with --diameter");
        if (o.diameter.empty()) throw InputError("the material route needs --diameter (inner diameter of the capillary)");
        const Material m = build_material(sample);
        radiation = build_radiation(radiation_options);
        r.diameter_cm = parse_length_cm("--diameter", o.diameter);
        r.sample = m.name;
        r.density_g_cm3 = m.density_g_cm3();
        r.energy_keV = radiation->energy_keV;
        r.radiation = radiation->label;
        r.mu_per_cm = linear_attenuation_per_cm(m, radiation->energy_keV, build_table(table));
        r.mu_R = *r.mu_per_cm * *r.diameter_cm / 2;
    }
    if (r.mu_R > kMaxCylinderMuR)
        throw InputError("μR = " + fmt(r.mu_R, 5) +
                         " is above 30: too absorbing for a capillary; use a thinner capillary or dilute the sample");

    const bool wall_by_material = !o.container_material.empty() || !o.wall.empty();
    const bool wall_direct = !o.mu_R_container.empty() || !o.radius_ratio.empty();
    if (wall_by_material && wall_direct)
        throw InputError("describe the wall either by --container-material and --wall, or by --mu-r-container and "
                         "--radius-ratio");
    if (wall_by_material) {
        if (o.container_material.empty() || o.wall.empty())
            throw InputError("a container wall needs both --container-material and --wall");
        if (direct)
            throw InputError("--container-material needs the sample's --diameter; with --mu-r use --mu-r-container "
                             "and --radius-ratio");
        ContainerWall w;
        const Composition c = find_composition(o.container_material);
        w.material = c.name;
        w.thickness_cm = parse_length_cm("--wall", o.wall);
        w.mu_per_cm = linear_attenuation_per_cm(c.material, radiation->energy_keV, build_table(table));
        const double radius_cm = *r.diameter_cm / 2;
        w.mu_R = *w.mu_per_cm * radius_cm;
        w.radius_ratio = (radius_cm + *w.thickness_cm) / radius_cm;
        r.wall = w;
    } else if (wall_direct) {
        if (o.mu_R_container.empty() || o.radius_ratio.empty())
            throw InputError("a container wall needs both --mu-r-container and --radius-ratio");
        ContainerWall w;
        w.mu_R = parse_number("--mu-r-container", o.mu_R_container);
        if (w.mu_R < 0) throw InputError("--mu-r-container: " + o.mu_R_container + " must be zero or positive");
        w.radius_ratio = parse_number("--radius-ratio", o.radius_ratio);
        if (w.radius_ratio <= 1)
            throw InputError("--radius-ratio: " + o.radius_ratio + " must be above 1 (outer wall radius over sample radius)");
        r.wall = w;
    }
    // μR about 1 or below is the usual aim for capillaries (common practice).
    if (r.mu_R > 3)
        r.warnings.push_back("μR = " + fmt(r.mu_R, 4) +
                             " is high: the correction varies strongly with 2θ; a thinner capillary or a diluted "
                             "sample (μR near 1) is the usual choice");
    return r;
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

PlateSample resolve_plate(PlateMode mode, const SampleOptions& sample, const RadiationOptions& radiation_options,
                          const std::string& table, const PlateGeometryOptions& o) {
    PlateSample r;
    r.mode = mode;
    if (!o.incidence.empty()) {
        if (r.mode != PlateMode::reflection)
            throw InputError("--incidence applies to reflection only, not to " + std::string(to_string(r.mode)));
        r.incidence_deg = parse_number("--incidence", o.incidence);
    }
    const bool direct = !o.mu_t.empty();
    const bool needs_radiation = !direct || !o.window_material.empty();
    if (!direct && !has_material(sample))
        throw InputError("no sample given; use --mu-t, or a material (--formula, --material) with --thickness");
    std::optional<Radiation> radiation;
    if (needs_radiation) {
        radiation = build_radiation(radiation_options);
        r.radiation = radiation->label;
        r.energy_keV = radiation->energy_keV;
    }
    if (direct) {
        if (has_material(sample)) throw InputError("--mu-t gives μt directly; do not combine it with a sample material");
        if (!o.thickness.empty()) throw InputError("give either --mu-t or --thickness, not both");
        r.mu_t = parse_number("--mu-t", o.mu_t);
        if (r.mu_t <= 0) throw InputError("--mu-t: μt = " + o.mu_t + " must be positive");
        if (r.mu_t > kMaxDirectMuT) throw InputError("--mu-t: μt = " + o.mu_t + " is above the limit 1e6");
        r.sample = "given as μt";
    } else {
        if (!has_material(sample))
            throw InputError("no sample given; use --mu-t, or a material (--formula, --material) with --thickness");
        if (o.thickness.empty()) throw InputError("the material route needs --thickness (the plate's thickness)");
        const Material m = build_material(sample);
        r.thickness_cm = parse_length_cm("--thickness", o.thickness);
        r.sample = m.name;
        r.density_g_cm3 = m.density_g_cm3();
        r.mu_per_cm = linear_attenuation_per_cm(m, radiation->energy_keV, build_table(table));
        r.mu_t = *r.mu_per_cm * *r.thickness_cm;
    }
    const bool window_material = !o.window_material.empty() || !o.window_thickness.empty();
    if (window_material && !o.mu_t_window.empty())
        throw InputError("describe the windows either by --window-material and --window-thickness, or by --mu-t-window");
    if (window_material) {
        if (o.window_material.empty() || o.window_thickness.empty())
            throw InputError("windows need both --window-material and --window-thickness");
        WindowFoils w;
        const Composition c = find_composition(o.window_material);
        w.material = c.name;
        w.thickness_cm = parse_length_cm("--window-thickness", o.window_thickness);
        w.mu_per_cm = linear_attenuation_per_cm(c.material, radiation->energy_keV, build_table(table));
        w.mu_t = *w.mu_per_cm * *w.thickness_cm;
        r.window = w;
    } else if (!o.mu_t_window.empty()) {
        WindowFoils w;
        w.mu_t = parse_number("--mu-t-window", o.mu_t_window);
        if (w.mu_t <= 0) throw InputError("--mu-t-window: " + o.mu_t_window + " must be positive");
        if (w.mu_t > kMaxDirectMuT)
            throw InputError("--mu-t-window: " + o.mu_t_window + " is above the limit 1e6");
        r.window = w;
    }
    return r;
}

}  // namespace mudepth::cli
