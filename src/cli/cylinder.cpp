// `mudepth cylinder`: capillary absorption factors A and A* = 1/A versus 2θ,
// with the container wall's Paalman & Pings factors.
#include <iostream>
#include <memory>
#include <optional>

#include <nlohmann/json.hpp>

#include "cli/commands.hpp"
#include "cli/common.hpp"
#include "cli/output.hpp"
#include "cli/plot.hpp"
#include "mudepth/attenuation.hpp"
#include "mudepth/composition.hpp"
#include "mudepth/cylinder.hpp"
#include "mudepth/error.hpp"

namespace mudepth::cli {

namespace {

constexpr const char* kDefaultAngles = "5:150:5";

struct CylinderOptions {
    SampleOptions sample;
    RadiationOptions radiation;
    std::string table = "elam";
    std::string diameter;
    std::string mu_R;
    std::string container_material;
    std::string wall;
    std::string mu_R_container;
    std::string radius_ratio;
    std::string two_theta;
    bool json = false;
    bool csv = false;
    std::string plot;
};

struct Wall {
    std::string material;                ///< empty on the direct route
    std::optional<double> mu_per_cm;     ///< material route
    std::optional<double> thickness_cm;  ///< material route
    double mu_R = 0;                     ///< wall μ × sample radius
    double radius_ratio = 1;
};

struct CylinderReport {
    std::string sample;
    std::string radiation;
    std::optional<double> energy_keV, mu_per_cm, diameter_cm;
    double mu_R = 0;
    std::optional<Wall> wall;
    std::vector<double> angles_deg;
    std::vector<double> transmission;
    std::vector<ContainerFactors> factors;
    std::vector<std::string> warnings;
};

bool has_material(const SampleOptions& s) { return !s.formula.empty() || !s.material.empty() || !s.phases.empty(); }

CylinderReport compute(const CylinderOptions& o) {
    CylinderReport r;
    const bool direct = !o.mu_R.empty();
    std::optional<Radiation> radiation;
    if (direct) {
        if (has_material(o.sample)) throw InputError("--mu-r gives μR directly; do not combine it with a sample material");
        if (!o.diameter.empty()) throw InputError("give either --mu-r or --diameter, not both");
        r.mu_R = parse_number("--mu-r", o.mu_R);
        if (r.mu_R <= 0) throw InputError("--mu-r: μR = " + o.mu_R + " must be positive");
        r.sample = "given as μR";
    } else {
        if (!has_material(o.sample))
            throw InputError("no sample given; use --mu-r, or a material (--formula, --material) with --diameter");
        if (o.diameter.empty()) throw InputError("the material route needs --diameter (inner diameter of the capillary)");
        const Material m = build_material(o.sample);
        radiation = build_radiation(o.radiation);
        r.diameter_cm = parse_length_cm("--diameter", o.diameter);
        r.sample = m.name;
        r.energy_keV = radiation->energy_keV;
        r.radiation = radiation->label;
        r.mu_per_cm = linear_attenuation_per_cm(m, radiation->energy_keV, build_table(o.table));
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
        Wall w;
        const Composition c = find_composition(o.container_material);
        w.material = c.name;
        w.thickness_cm = parse_length_cm("--wall", o.wall);
        w.mu_per_cm = linear_attenuation_per_cm(c.material, radiation->energy_keV, build_table(o.table));
        const double radius_cm = *r.diameter_cm / 2;
        w.mu_R = *w.mu_per_cm * radius_cm;
        w.radius_ratio = (radius_cm + *w.thickness_cm) / radius_cm;
        r.wall = w;
    } else if (wall_direct) {
        if (o.mu_R_container.empty() || o.radius_ratio.empty())
            throw InputError("a container wall needs both --mu-r-container and --radius-ratio");
        Wall w;
        w.mu_R = parse_number("--mu-r-container", o.mu_R_container);
        if (w.mu_R < 0) throw InputError("--mu-r-container: " + o.mu_R_container + " must be zero or positive");
        w.radius_ratio = parse_number("--radius-ratio", o.radius_ratio);
        if (w.radius_ratio <= 1)
            throw InputError("--radius-ratio: " + o.radius_ratio + " must be above 1 (outer wall radius over sample radius)");
        r.wall = w;
    }

    r.angles_deg = parse_angles_deg("--two-theta", o.two_theta.empty() ? kDefaultAngles : o.two_theta);
    for (double a : r.angles_deg)
        if (a < 0 || a > 180) throw InputError("--two-theta: 2θ = " + fmt(a, 6) + "° is outside 0..180°");
    if (r.wall) {
        r.factors = container_factors(r.mu_R, r.wall->mu_R, r.wall->radius_ratio, r.angles_deg);
        for (const auto& f : r.factors) r.transmission.push_back(f.A_s_s);
    } else {
        r.transmission = cylinder_transmission(r.mu_R, r.angles_deg);
    }
    // μR about 1 or below is the usual aim for capillaries (common practice).
    if (r.mu_R > 3)
        r.warnings.push_back("μR = " + fmt(r.mu_R, 4) +
                             " is high: the correction varies strongly with 2θ; a thinner capillary or a diluted "
                             "sample (μR near 1) is the usual choice");
    return r;
}

Plot cylinder_plot(const CylinderReport& r) {
    Plot p;
    p.title = "Cylinder absorption, μR = " + fmt(r.mu_R, 4) +
              (r.wall ? ", wall μR = " + fmt(r.wall->mu_R, 4) + ", radius ratio " + fmt(r.wall->radius_ratio, 5) : "");
    p.x_label = "2θ (degrees)";
    p.y_label = r.wall ? "correction A* and factors A (dimensionless)" : "correction A* = 1/A (dimensionless)";
    PlotSeries corr{"A* = 1/A (sample alone)", r.angles_deg, {}};
    for (double a : r.transmission) corr.y.push_back(1 / a);
    p.series.push_back(corr);
    std::vector<double> all = corr.y;
    if (r.wall) {
        const char* names[] = {"A_s,s", "A_s,sc", "A_c,sc", "A_c,c"};
        for (int i = 0; i < 4; ++i) {
            PlotSeries s{names[i], r.angles_deg, {}};
            for (const auto& f : r.factors) {
                const double v[] = {f.A_s_s, f.A_s_sc, f.A_c_sc, f.A_c_c};
                s.y.push_back(v[i]);
            }
            all.insert(all.end(), s.y.begin(), s.y.end());
            p.series.push_back(s);
        }
    }
    p.y_log = spans_decades(all, 1.0);
    return p;
}

nlohmann::json optional_json(const std::optional<double>& v) { return v ? nlohmann::json(*v) : nlohmann::json(); }

void print_json(const CylinderReport& r) {
    nlohmann::json j;
    j["geometry"] = "cylinder";
    j["sample"] = r.sample;
    j["radiation"] = r.radiation.empty() ? nlohmann::json() : nlohmann::json(r.radiation);
    j["energy_keV"] = optional_json(r.energy_keV);
    j["mu_per_cm"] = optional_json(r.mu_per_cm);
    j["diameter_mm"] = r.diameter_cm ? nlohmann::json(*r.diameter_cm * 10) : nlohmann::json();
    j["mu_R"] = r.mu_R;
    if (r.wall) {
        const Wall& w = *r.wall;
        j["container"] = {{"material", w.material.empty() ? nlohmann::json() : nlohmann::json(w.material)},
                          {"mu_per_cm", optional_json(w.mu_per_cm)},
                          {"wall_um", w.thickness_cm ? nlohmann::json(*w.thickness_cm * 1e4) : nlohmann::json()},
                          {"mu_R_container", w.mu_R},
                          {"radius_ratio", w.radius_ratio}};
    }
    j["points"] = nlohmann::json::array();
    for (std::size_t i = 0; i < r.angles_deg.size(); ++i) {
        nlohmann::json p{{"two_theta_deg", r.angles_deg[i]},
                         {"transmission", r.transmission[i]},
                         {"correction", 1 / r.transmission[i]}};
        if (r.wall) {
            const auto& f = r.factors[i];
            p["A_s_s"] = f.A_s_s;
            p["A_s_sc"] = f.A_s_sc;
            p["A_c_sc"] = f.A_c_sc;
            p["A_c_c"] = f.A_c_c;
        }
        j["points"].push_back(p);
    }
    j["warnings"] = r.warnings;
    std::cout << j.dump(2) << '\n';
}

void print_csv(const CylinderReport& r) {
    std::cout << "# mudepth cylinder: " << r.sample << ", mu_R " << fmt(r.mu_R, 8);
    if (r.wall) std::cout << ", wall mu_R " << fmt(r.wall->mu_R, 8) << ", radius ratio " << fmt(r.wall->radius_ratio, 8);
    std::cout << '\n';
    std::vector<std::string> header{"two_theta_deg", "transmission", "correction"};
    if (r.wall) header.insert(header.end(), {"A_s_s", "A_s_sc", "A_c_sc", "A_c_c"});
    Table t(header);
    for (std::size_t i = 0; i < r.angles_deg.size(); ++i) {
        std::vector<std::string> row{fmt(r.angles_deg[i], 8), fmt(r.transmission[i], 10), fmt(1 / r.transmission[i], 10)};
        if (r.wall) {
            const auto& f = r.factors[i];
            row.insert(row.end(), {fmt(f.A_s_s, 10), fmt(f.A_s_sc, 10), fmt(f.A_c_sc, 10), fmt(f.A_c_c, 10)});
        }
        t.add(row);
    }
    t.print_csv(std::cout);
}

void print_human(const CylinderReport& r) {
    auto& out = std::cout;
    print_field(out, "Sample", r.sample);
    if (r.mu_per_cm) {
        print_field(out, "Radiation", r.radiation);
        print_field(out, "μ", fmt(*r.mu_per_cm, 5) + " 1/cm (1/μ = " + length_from_um(1e4 / *r.mu_per_cm) + ")");
        print_field(out, "Inner diameter", fmt(*r.diameter_cm * 10, 5) + " mm");
    }
    print_field(out, "μR", fmt(r.mu_R, 5));
    if (r.wall) {
        const Wall& w = *r.wall;
        if (!w.material.empty())
            print_field(out, "Container wall", w.material + ", " + length_from_um(*w.thickness_cm * 1e4) + ", μ = " +
                                                   fmt(*w.mu_per_cm, 5) + " 1/cm");
        print_field(out, "Wall μR", fmt(w.mu_R, 5) + " (wall μ × sample radius)");
        print_field(out, "Radius ratio", fmt(w.radius_ratio, 6) + " (outer wall / sample)");
    }
    out << '\n';
    std::vector<std::string> header{"2θ (°)", "A", "A* = 1/A"};
    if (r.wall) header.insert(header.end(), {"A_s,s", "A_s,sc", "A_c,sc", "A_c,c"});
    Table t(header);
    for (std::size_t i = 0; i < r.angles_deg.size(); ++i) {
        std::vector<std::string> row{fmt(r.angles_deg[i], 6), fmt(r.transmission[i], 6), fmt(1 / r.transmission[i], 6)};
        if (r.wall) {
            const auto& f = r.factors[i];
            row.insert(row.end(), {fmt(f.A_s_s, 6), fmt(f.A_s_sc, 6), fmt(f.A_c_sc, 6), fmt(f.A_c_c, 6)});
        }
        t.add(row);
    }
    t.print(out);
    out << "\nA: absorption factor of the uniformly bathed cylinder (equatorial plane); multiply measured\n"
           "intensities by A* = 1/A.";
    if (r.wall)
        out << " With the wall (Paalman & Pings): I_s = [I_sc − (A_c,sc/A_c,c)·I_c] / A_s,sc,\n"
               "I_sc the sample in its container, I_c the empty container.";
    out << '\n';
    for (const auto& w : r.warnings) out << "Warning: " << w << '\n';
}

}  // namespace

void register_cylinder(CLI::App& sub) {
    auto o = std::make_shared<CylinderOptions>();
    add_sample_options(sub, o->sample);
    add_radiation_options(sub, o->radiation);
    add_table_option(sub, o->table);
    sub.add_option("--diameter", o->diameter, "Inner diameter of the capillary, filled with sample [nm, um, mm, cm; bare number: mm]")
        ->type_name("LENGTH")->check(nonempty())->group("Cylinder");
    sub.add_option("--mu-r", o->mu_R, "μR directly (μ times the sample radius), 0 < μR <= 30, instead of a material")
        ->type_name("X")->check(nonempty())->group("Cylinder");
    sub.add_option("--container-material", o->container_material,
                   "Material of the capillary wall, a composition name or file (e.g. borosilicate-3.3)")
        ->type_name("NAME|FILE")->check(nonempty())->group("Container");
    sub.add_option("--wall", o->wall, "Wall thickness of the capillary [nm, um, mm, cm; bare number: mm]")
        ->type_name("LENGTH")->check(nonempty())->group("Container");
    sub.add_option("--mu-r-container", o->mu_R_container, "The wall's μ times the SAMPLE radius, instead of a material")
        ->type_name("X")->check(nonempty())->group("Container");
    sub.add_option("--radius-ratio", o->radius_ratio, "Outer radius of the wall over the sample radius, > 1")
        ->type_name("X")->check(nonempty())->group("Container");
    add_two_theta_option(sub, o->two_theta);
    sub.get_option("--two-theta")->description(
        "Scattering angles 2θ: START:STOP:STEP or a list a,b,c, 0 to 180 [degrees] (default: 5:150:5)");
    auto* json = sub.add_flag("--json", o->json, "Print one JSON document instead of the table");
    sub.add_flag("--csv", o->csv, "Print CSV")->excludes(json);
    sub.add_option("--plot", o->plot, "Also draw the correction (and the container factors) versus 2θ into this SVG file")
        ->type_name("FILE.svg")->check(nonempty());
    sub.footer(std::string(kCautions) + "\n");
    sub.callback([o] {
        const CylinderReport r = compute(*o);
        if (!o->plot.empty()) write_svg(cylinder_plot(r), o->plot);
        if (o->json)
            print_json(r);
        else if (o->csv)
            print_csv(r);
        else
            print_human(r);
    });
}

}  // namespace mudepth::cli
