// `mudepth cylinder`: capillary absorption factors A and A* = 1/A versus 2θ,
// with the container wall's Paalman & Pings factors.
#include <iostream>
#include <memory>
#include <optional>

#include <nlohmann/json.hpp>

#include "cli/commands.hpp"
#include "cli/common.hpp"
#include "cli/geometry_options.hpp"
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
    CylinderGeometryOptions geometry;
    std::string two_theta;
    bool json = false;
    bool csv = false;
    std::string plot;
};

using Wall = CapillaryWall;

/// The sample and wall (shared with `correct`) and the factors at each angle.
struct CylinderReport : CapillarySpecimen {
    std::vector<double> angles_deg;
    std::vector<double> transmission;
    std::vector<ContainerFactors> factors;
};

CylinderReport compute(const CylinderOptions& o) {
    CylinderReport r;
    static_cast<CapillarySpecimen&>(r) = resolve_cylinder(o.sample, o.radiation, o.table, o.geometry);

    r.angles_deg = parse_angles_deg("--two-theta", o.two_theta.empty() ? kDefaultAngles : o.two_theta);
    for (double a : r.angles_deg)
        if (a < 0 || a > 180) throw InputError("--two-theta: 2θ = " + fmt(a, 6) + "° is outside 0..180°");
    if (r.wall) {
        r.factors = container_factors(r.mu_R, r.wall->mu_R, r.wall->radius_ratio, r.angles_deg);
        for (const auto& f : r.factors) r.transmission.push_back(f.A_s_s);
    } else {
        r.transmission = cylinder_transmission(r.mu_R, r.angles_deg);
    }
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
    j["diameter_mm"] = r.inner_diameter_cm ? nlohmann::json(*r.inner_diameter_cm * 10) : nlohmann::json();
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
        print_field(out, "Inner diameter", fmt(*r.inner_diameter_cm * 10, 5) + " mm");
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
    add_cylinder_geometry_options(sub, o->geometry);
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
        print_report(r, o->json, o->csv, print_json, print_csv, print_human);
    });
}

}  // namespace mudepth::cli
