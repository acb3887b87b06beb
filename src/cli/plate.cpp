// `mudepth plate`: flat-plate absorption factors versus 2θ — finite-thickness
// reflection, transmission (beam normal or symmetric), window foils.
#include <algorithm>
#include <cmath>
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
#include "mudepth/error.hpp"
#include "mudepth/plate.hpp"

namespace mudepth::cli {

namespace {

struct PlateOptions {
    SampleOptions sample;
    RadiationOptions radiation;
    std::string table = "elam";
    PlateGeometryOptions geometry;
    std::string mode = "reflection";
    std::string two_theta;
    bool json = false;
    bool csv = false;
    std::string plot;
};

using Window = WindowFoils;

struct Point {
    double two_theta_deg, sample, window, optimum_mu_t;
};

/// The sample, mode and windows (shared with `correct`) and the points.
struct PlateReport : PlateSpecimen {
    std::vector<Point> points;
    struct Infinite {
        double fraction, mu_t;
    };
    std::vector<Infinite> infinite;  ///< reflection: over the angle range
};

std::vector<double> default_angles(PlateMode mode, std::optional<double> incidence_deg) {
    std::vector<double> out;
    const double stop = mode == PlateMode::transmission_normal ? 85 : 150;
    for (double a = 5; a <= stop + 1e-9; a += 5)
        if (!incidence_deg || a > *incidence_deg) out.push_back(a);
    return out;
}

PlateReport compute(const PlateOptions& o) {
    PlateReport r;
    static_cast<PlateSpecimen&>(r) = resolve_plate(parse_plate_mode(o.mode), o.sample, o.radiation, o.table, o.geometry);

    const auto angles = o.two_theta.empty() ? default_angles(r.mode, r.incidence_deg)
                                            : parse_angles_deg("--two-theta", o.two_theta);
    if (angles.empty()) throw InputError("no default 2θ lies above the incidence; give --two-theta");
    for (double a : angles) {
        Point p{a, plate_transmission(r.mode, r.mu_t, a, r.incidence_deg), 1.0, 0.0};
        if (r.window) p.window = window_transmission(r.mode, r.window->mu_t, a, r.incidence_deg);
        if (r.mode != PlateMode::reflection) p.optimum_mu_t = transmission_optimum_mu_t(r.mode, a);
        // A factor that underflows would print an infinite correction.
        if (!std::isfinite(1 / (p.sample * p.window)))
            throw InputError("at 2θ = " + fmt(a, 6) + "° the plate and windows let through less than 1e-308 of the " +
                             "beam (μt = " + fmt(r.mu_t, 6) + "): nothing is left to correct");
        r.points.push_back(p);
    }
    if (r.mode == PlateMode::reflection)
        for (double f : {0.99, 0.999}) {
            double worst = 0;
            for (double a : angles) worst = std::max(worst, infinite_thickness_mu_t(f, a, r.incidence_deg));
            r.infinite.push_back({f, worst});
        }
    return r;
}

std::string length_text(double cm) { return length_from_um(cm * 1e4); }

nlohmann::json optional_json(const std::optional<double>& v) { return v ? nlohmann::json(*v) : nlohmann::json(); }

void print_json(const PlateReport& r) {
    nlohmann::json j;
    j["geometry"] = "plate";
    j["mode"] = std::string(to_string(r.mode));
    j["sample"] = r.sample;
    j["radiation"] = r.radiation.empty() ? nlohmann::json() : nlohmann::json(r.radiation);
    j["mu_per_cm"] = optional_json(r.mu_per_cm);
    j["thickness_um"] = r.thickness_cm ? nlohmann::json(*r.thickness_cm * 1e4) : nlohmann::json();
    j["mu_t"] = r.mu_t;
    j["incidence_deg"] = optional_json(r.incidence_deg);
    if (r.window)
        j["window"] = {{"material", r.window->material.empty() ? nlohmann::json() : nlohmann::json(r.window->material)},
                       {"mu_per_cm", optional_json(r.window->mu_per_cm)},
                       {"thickness_um", r.window->thickness_cm ? nlohmann::json(*r.window->thickness_cm * 1e4) : nlohmann::json()},
                       {"mu_t", r.window->mu_t},
                       {"foils", r.mode == PlateMode::reflection ? 1 : 2}};
    if (!r.infinite.empty()) {
        j["infinite_thickness"] = nlohmann::json::array();
        for (const auto& i : r.infinite)
            j["infinite_thickness"].push_back(
                {{"fraction", i.fraction},
                 {"mu_t", i.mu_t},
                 {"thickness_um", r.mu_per_cm ? nlohmann::json(i.mu_t / *r.mu_per_cm * 1e4) : nlohmann::json()}});
    }
    j["points"] = nlohmann::json::array();
    for (const auto& p : r.points) {
        nlohmann::json q{{"two_theta_deg", p.two_theta_deg},
                         {"transmission", p.sample * p.window},
                         {"correction", 1 / (p.sample * p.window)},
                         {"sample_transmission", p.sample},
                         {"window_transmission", p.window}};
        if (r.mode != PlateMode::reflection) {
            q["optimum_mu_t"] = p.optimum_mu_t;
            if (r.mu_per_cm) q["optimum_thickness_um"] = p.optimum_mu_t / *r.mu_per_cm * 1e4;
        }
        j["points"].push_back(q);
    }
    std::cout << j.dump(2) << '\n';
}

Table point_table(const PlateReport& r, bool csv) {
    const bool reflection = r.mode == PlateMode::reflection;
    std::vector<std::string> h = csv ? std::vector<std::string>{"two_theta_deg", "transmission", "correction"}
                                     : std::vector<std::string>{"2θ (°)", reflection ? "I/I∞" : "A", "correction"};
    if (r.window) {
        h.push_back(csv ? "sample_transmission" : "sample");
        h.push_back(csv ? "window_transmission" : "windows");
    }
    if (!reflection) h.push_back(csv ? "optimum_mu_t" : "optimum μt");
    Table t(h);
    const int digits = csv ? 10 : 6;
    for (const auto& p : r.points) {
        std::vector<std::string> row{fmt(p.two_theta_deg, csv ? 8 : 6), fmt(p.sample * p.window, digits),
                                     fmt(1 / (p.sample * p.window), digits)};
        if (r.window) row.insert(row.end(), {fmt(p.sample, digits), fmt(p.window, digits)});
        if (!reflection) row.push_back(fmt(p.optimum_mu_t, csv ? 10 : 4));
        t.add(row);
    }
    return t;
}

void print_human(const PlateReport& r) {
    auto& out = std::cout;
    print_field(out, "Sample", r.sample);
    print_field(out, "Mode", std::string(to_string(r.mode)) +
                                 (r.incidence_deg ? ", incidence " + fmt(*r.incidence_deg, 6) + "°"
                                                  : (r.mode == PlateMode::reflection ? ", symmetric" : "")));
    if (r.mu_per_cm) {
        print_field(out, "Radiation", r.radiation);
        print_field(out, "μ", fmt(*r.mu_per_cm, 5) + " 1/cm (1/μ = " + length_from_um(1e4 / *r.mu_per_cm) + ")");
        print_field(out, "Thickness", length_text(*r.thickness_cm));
    }
    print_field(out, "μt", fmt(r.mu_t, 5));
    if (r.window)
        print_field(out, "Windows", (r.window->material.empty() ? "" : r.window->material + " " +
                                         length_text(*r.window->thickness_cm) + ", ") +
                                        "μt " + fmt(r.window->mu_t, 4) +
                                        (r.mode == PlateMode::reflection ? " (one cover foil, crossed in and out)"
                                                                         : " per foil, one on each side"));
    for (const auto& i : r.infinite)
        print_field(out, "Infinite at " + fmt(i.fraction * 100, 4) + "%",
                    "μt >= " + fmt(i.mu_t, 4) +
                        (r.mu_per_cm ? " (" + length_text(i.mu_t / *r.mu_per_cm) + ")" : std::string()) +
                        " over this 2θ range");
    out << '\n';
    point_table(r, false).print(out);
    out << '\n';
    if (r.mode == PlateMode::reflection)
        out << "I/I∞: intensity relative to an infinitely thick sample; correction = 1/(I/I∞ × windows).\n";
    else
        out << "A: absorption factor (1/V)∫exp(−μT)dV; correction = 1/(A × windows). Optimum μt: the thickness\n"
               "giving the most diffracted intensity at that 2θ.\n";
}

Plot plate_plot(const PlateReport& r) {
    Plot p;
    p.title = "Flat plate, " + std::string(to_string(r.mode)) + ", μt = " + fmt(r.mu_t, 4);
    p.x_label = "2θ (degrees)";
    p.y_label = "correction (dimensionless)";
    PlotSeries s{"correction", {}, {}};
    for (const auto& q : r.points) {
        s.x.push_back(q.two_theta_deg);
        s.y.push_back(1 / (q.sample * q.window));
    }
    p.y_log = spans_decades(s.y, 1.0);
    p.series.push_back(s);
    if (r.window) {
        PlotSeries w{"windows alone", {}, {}};
        for (const auto& q : r.points) {
            w.x.push_back(q.two_theta_deg);
            w.y.push_back(1 / q.window);
        }
        p.series.push_back(w);
    }
    return p;
}

}  // namespace

void register_plate(CLI::App& sub) {
    auto o = std::make_shared<PlateOptions>();
    add_sample_options(sub, o->sample);
    add_radiation_options(sub, o->radiation);
    add_table_option(sub, o->table);
    add_plate_thickness_options(sub, o->geometry);
    sub.add_option("--mode", o->mode, "reflection, transmission-normal (beam normal to the plate) or transmission-symmetric")
        ->type_name("MODE")->capture_default_str()->check(nonempty())->group("Plate");
    add_plate_incidence_and_window_options(sub, o->geometry);
    add_two_theta_option(sub, o->two_theta);
    sub.get_option("--two-theta")->description(
        "Scattering angles 2θ: START:STOP:STEP or a list a,b,c [degrees] (default: 5:150:5; 5:85:5 for "
        "transmission-normal; with --incidence only the angles above it)");
    auto* json = sub.add_flag("--json", o->json, "Print one JSON document instead of the table");
    sub.add_flag("--csv", o->csv, "Print CSV")->excludes(json);
    sub.add_option("--plot", o->plot, "Also draw the correction versus 2θ into this SVG file")
        ->type_name("FILE.svg")->check(nonempty());
    sub.footer(std::string(kCautions) + "\n");
    sub.callback([o] {
        const PlateReport r = compute(*o);
        if (!o->plot.empty()) write_svg(plate_plot(r), o->plot);
        if (o->json) {
            print_json(r);
        } else if (o->csv) {
            std::cout << "# mudepth plate: " << r.sample << ", " << to_string(r.mode) << ", mu_t " << fmt(r.mu_t, 8)
                      << '\n';
            point_table(r, true).print_csv(std::cout);
        } else {
            print_human(r);
        }
    });
}

}  // namespace mudepth::cli
