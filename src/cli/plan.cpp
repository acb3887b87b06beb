// `mudepth plan`: what to do with this powder on this instrument.
#include <cmath>
#include <iostream>
#include <memory>
#include <numbers>

#include <nlohmann/json.hpp>

#include "cli/commands.hpp"
#include "cli/common.hpp"
#include "cli/output.hpp"
#include "cli/plot.hpp"
#include "mudepth/attenuation.hpp"
#include "mudepth/composition.hpp"
#include "mudepth/cylinder.hpp"
#include "mudepth/error.hpp"
#include "mudepth/plan.hpp"

namespace mudepth::cli {

namespace {

/// Loose powders fill about 0.5–0.6 of the volume (common practice); plan shows 0.55.
constexpr double kLoosePacking = 0.55;

struct PlanOptions {
    SampleOptions sample;
    RadiationOptions radiation;
    std::string table = "elam";
    std::string target_mu_r = "1.0";
    std::string diluent = "fused-silica";
    std::string diameter = "0.3mm";
    std::string two_theta_max = "150";
    std::string holder_diameter = "20mm";
    std::string holder_area;
    std::string holder_depth = "0.5mm";
    std::string plot;
    bool json = false;
};

/// An area: a number with mm2 or cm2 (also mm^2, cm^2); a bare number is mm². Returns cm².
double parse_area_cm2(const std::string& option, const std::string& text) {
    std::string t = text;
    double scale = 0.01;  // mm² → cm²
    for (const auto& [suffix, s] : {std::pair<std::string, double>{"mm2", 0.01}, {"mm^2", 0.01}, {"cm2", 1.0},
                                    {"cm^2", 1.0}}) {
        if (t.size() > suffix.size() && t.compare(t.size() - suffix.size(), suffix.size(), suffix) == 0) {
            t.resize(t.size() - suffix.size());
            scale = s;
            break;
        }
    }
    const double value = parse_number(option, t);
    if (value <= 0) throw InputError(option + ": area '" + text + "' must be positive");
    if (value * scale > kMaxLength_cm * kMaxLength_cm)
        throw InputError(option + ": area '" + text + "' is larger than 100 m2");
    return value * scale;
}

struct PlanReport {
    Material sample;
    Radiation radiation;
    double mu_per_cm;
    bool packing_given;
    CapillaryPlan capillaries;
    PlatePlan plate;
    std::vector<SourceRow> sources;
    std::optional<CapillaryPlan> loose;  ///< the capillary plan at kLoosePacking when no packing was given
};

PlanReport compute(const PlanOptions& o) {
    const Material sample = build_material(o.sample);
    const Radiation radiation = build_radiation(o.radiation);
    const auto table = build_table(o.table);
    const double target = parse_number("--target-mu-r", o.target_mu_r);
    if (target <= 0) throw InputError("--target-mu-r: the target muR must be positive, not " + o.target_mu_r);
    if (target > kMaxCylinderMuR)
        throw InputError("--target-mu-r: " + o.target_mu_r + " is above 30, the largest muR mudepth handles");
    Material diluent = find_composition(o.diluent).material;
    const double dilution_diameter_cm = parse_length_cm("--diameter", o.diameter);
    const double two_theta_max = parse_number("--two-theta-max", o.two_theta_max);
    if (two_theta_max <= 0 || two_theta_max >= 180)
        throw InputError("--two-theta-max: " + o.two_theta_max + "° must lie in (0, 180)");
    const double depth_cm = parse_length_cm("--holder-depth", o.holder_depth);
    double area_cm2 = 0;
    if (!o.holder_area.empty()) {
        area_cm2 = parse_area_cm2("--holder-area", o.holder_area);
    } else {
        const double d_cm = parse_length_cm("--holder-diameter", o.holder_diameter);
        area_cm2 = std::numbers::pi * d_cm * d_cm / 4;
    }
    PlanReport r{sample, radiation, linear_attenuation_per_cm(sample, radiation.energy_keV, table),
                 !o.sample.packing.empty() || sample.density_is_bulk, {}, {}, {}, std::nullopt};
    r.capillaries = plan_capillaries(sample, radiation.energy_keV, target, diluent, dilution_diameter_cm, table);
    r.plate = plan_plate(sample, r.mu_per_cm, two_theta_max, area_cm2, depth_cm);
    r.sources = plan_sources(sample, target, table);
    if (!r.packing_given && sample.packing_fraction == 1.0) {
        Material loose = sample;
        loose.packing_fraction = kLoosePacking;
        r.loose = plan_capillaries(loose, radiation.energy_keV, target, diluent, dilution_diameter_cm, table);
    }
    return r;
}

std::string mm(double cm, int digits = 3) { return fmt(cm * 10, digits) + " mm"; }

std::string fluorescence_flags(const std::vector<FluorescenceWarning>& warnings) {
    std::string s;
    for (const auto& w : warnings)
        s += (s.empty() ? "" : "; ") + w.label + " " + w.edge_level + " → " + w.line_siegbahn + " " +
             fmt(w.line_keV, 4) + " keV";
    return s.empty() ? "none" : s;
}

nlohmann::json capillaries_json(const CapillaryPlan& c) {
    nlohmann::json rows = nlohmann::json::array();
    for (const auto& row : c.rows)
        rows.push_back({{"diameter_mm", row.diameter_cm * 10},
                        {"mu_R", row.mu_R},
                        {"correction_10deg", row.correction_at_10_deg ? nlohmann::json(*row.correction_at_10_deg) : nlohmann::json()},
                        {"correction_150deg", row.correction_at_150_deg ? nlohmann::json(*row.correction_at_150_deg) : nlohmann::json()},
                        {"central_ray_transmission", row.central_ray_transmission}});
    return rows;
}

void print_json(const PlanReport& r) {
    nlohmann::json j;
    j["sample"] = r.sample.name;
    j["radiation"] = r.radiation.label;
    j["energy_keV"] = r.radiation.energy_keV;
    j["density_g_cm3"] = r.sample.density_g_cm3();
    j["packing_fraction"] = r.sample.packing_fraction;
    j["linear_attenuation_per_cm"] = r.mu_per_cm;
    j["target_mu_R"] = r.capillaries.target_mu_R;
    j["recommended_diameter_mm"] = r.capillaries.recommended_diameter_cm * 10;
    j["smallest_capillary_exceeds_target"] = r.capillaries.smallest_exceeds_target;
    j["capillaries"] = capillaries_json(r.capillaries);
    if (r.capillaries.dilution) {
        const auto& d = *r.capillaries.dilution;
        j["dilution"] = {{"diluent", d.diluent},
                         {"diameter_mm", d.diameter_cm * 10},
                         {"sample_weight_fraction", d.sample_weight_fraction},
                         {"mixture_mu_per_cm", d.mixture_mu_per_cm},
                         {"mu_R", d.mu_R}};
    } else {
        j["dilution"] = nullptr;
    }
    if (!r.capillaries.dilution_note.empty()) j["dilution_note"] = r.capillaries.dilution_note;
    const auto& p = r.plate;
    j["plate"] = {{"two_theta_max_deg", p.two_theta_max_deg},
                  {"infinite_thickness_99_um", p.infinite_99_cm * 1e4},
                  {"infinite_thickness_999_um", p.infinite_999_cm * 1e4},
                  {"transmission_optimum_um", p.transmission_optimum_cm * 1e4},
                  {"holder_area_mm2", p.holder_area_cm2 * 100},
                  {"holder_depth_mm", p.holder_depth_cm * 10},
                  {"powder_mass_mg", p.powder_mass_g * 1e3}};
    j["sources"] = nlohmann::json::array();
    for (const auto& s : r.sources) {
        nlohmann::json flags = nlohmann::json::array();
        for (const auto& w : s.fluorescence)
            flags.push_back({{"symbol", w.label}, {"edge", w.edge_level}, {"line", w.line_iupac},
                             {"line_siegbahn", w.line_siegbahn}, {"line_keV", w.line_keV}});
        j["sources"].push_back({{"anode", s.anode},
                                {"energy_keV", s.energy_keV},
                                {"mu_per_cm", s.mu_per_cm},
                                {"depth_1e_30deg_um", s.depth_1e_at_30_deg_um},
                                {"depth_1e_90deg_um", s.depth_1e_at_90_deg_um},
                                {"recommended_diameter_mm", s.recommended_diameter_cm * 10},
                                {"smallest_capillary_exceeds_target", s.smallest_exceeds_target},
                                {"fluorescence", flags}});
    }
    if (r.loose)
        j["if_loosely_packed"] = {{"packing_fraction", kLoosePacking},
                                  {"recommended_diameter_mm", r.loose->recommended_diameter_cm * 10}};
    std::cout << j.dump(2) << '\n';
}

void print_human(const PlanReport& r) {
    auto& out = std::cout;
    print_field(out, "Sample", r.sample.name);
    print_field(out, "Density used", fmt(r.sample.density_g_cm3(), 5) + " g/cm³" +
                                         (r.sample.packing_fraction < 1 ? " (packing " + fmt(r.sample.packing_fraction, 3) + ")" : ""));
    print_field(out, "Radiation", r.radiation.label + ", " + fmt(r.radiation.energy_keV, 6) + " keV");
    print_field(out, "μ (linear)", fmt(r.mu_per_cm, 5) + " 1/cm (1/μ = " + length_from_um(1e4 / r.mu_per_cm) + ")");
    if (r.loose)
        out << "\nNo --packing given: these numbers use the full density. Loose powders fill about 0.5–0.6\n"
               "of the volume; at "
            << fmt(kLoosePacking, 2) << " the recommended capillary would be " << mm(r.loose->recommended_diameter_cm)
            << ".\n";

    const auto& c = r.capillaries;
    out << "\nCapillaries (target μR ≤ " << fmt(c.target_mu_R, 3) << "):\n";
    Table t({"diameter", "μR", "A* at 10°", "A* at 150°", "central ray T"});
    for (const auto& row : c.rows)
        t.add({mm(row.diameter_cm, 2), fmt(row.mu_R, 4),
               row.correction_at_10_deg ? fmt(*row.correction_at_10_deg, 5) : "μR > 30",
               row.correction_at_150_deg ? fmt(*row.correction_at_150_deg, 5) : "μR > 30",
               fmt(row.central_ray_transmission, 3)});
    t.print(out);
    if (!c.smallest_exceeds_target) {
        out << "Recommended: " << mm(c.recommended_diameter_cm) << " (the largest standard diameter with μR ≤ "
            << fmt(c.target_mu_R, 3) << ")\n";
    } else {
        out << "Recommended: 0.1 mm, but even 0.1 mm exceeds the target (μR " << fmt(c.rows.front().mu_R, 4) << ").\n";
        if (!c.dilution_note.empty()) out << "No dilution: " << c.dilution_note << ".\n";
        if (c.dilution) {
            const auto& d = *c.dilution;
            out << "Dilute: " << fixed(100 * d.sample_weight_fraction, 2) << " wt% sample in " << d.diluent
                << " gives μR " << fmt(d.mu_R, 4) << " in a " << mm(d.diameter_cm) << " capillary (μ "
                << fmt(d.mixture_mu_per_cm, 4) << " 1/cm).\n";
        }
    }

    const auto& p = r.plate;
    out << "\nFlat plates:\n";
    print_field(out, "  infinitely thick", length_from_um(p.infinite_99_cm * 1e4) + " (99%), " +
                                               length_from_um(p.infinite_999_cm * 1e4) + " (99.9%) at 2θ = " +
                                               fmt(p.two_theta_max_deg, 4) + "°");
    print_field(out, "  transmission optimum", length_from_um(p.transmission_optimum_cm * 1e4) +
                                                   " (plate normal to the beam, low angles: μt = 1)");
    print_field(out, "  powder for holder", fmt(p.powder_mass_g * 1e3, 4) + " mg (" + fmt(p.holder_area_cm2 * 100, 4) +
                                                " mm² × " + mm(p.holder_depth_cm) + " at " +
                                                fmt(r.sample.density_g_cm3(), 4) + " g/cm³)");

    out << "\nSources (Kα; symmetric reflection depths):\n";
    Table s({"anode", "E (keV)", "μ (1/cm)", "1/e depth 30°", "1/e depth 90°", "capillary", "fluorescence"});
    for (const auto& row : r.sources)
        s.add({row.anode, fmt(row.energy_keV, 5), fmt(row.mu_per_cm, 4), length_from_um(row.depth_1e_at_30_deg_um, 3),
               length_from_um(row.depth_1e_at_90_deg_um, 3),
               row.smallest_exceeds_target ? "0.1 mm*" : mm(row.recommended_diameter_cm, 2),
               fluorescence_flags(row.fluorescence)});
    s.print(out);
    bool any_star = false;
    for (const auto& row : r.sources) any_star = any_star || row.smallest_exceeds_target;
    if (any_star) out << "  * even 0.1 mm exceeds the target μR: dilute\n";
    out << '\n' << kCautions << '\n';
}

Plot plan_plot(const PlanReport& r) {
    Plot plot;
    plot.title = "Capillary μR of " + r.sample.name + ", " + r.radiation.label;
    plot.x_label = "inner diameter (mm)";
    plot.y_label = "μR";
    PlotSeries s{"μR", {}, {}};
    for (const auto& row : r.capillaries.rows) {
        s.x.push_back(row.diameter_cm * 10);
        s.y.push_back(row.mu_R);
    }
    plot.y_log = spans_decades(s.y, 1.0);
    plot.series = {s};
    plot.levels.push_back({r.capillaries.target_mu_R, "target μR " + fmt(r.capillaries.target_mu_R, 3)});
    plot.markers.push_back({r.capillaries.recommended_diameter_cm * 10, "recommended"});
    return plot;
}

}  // namespace

void register_plan(CLI::App& sub) {
    auto o = std::make_shared<PlanOptions>();
    add_sample_options(sub, o->sample);
    add_radiation_options(sub, o->radiation);
    add_table_option(sub, o->table);
    auto opt = [&](const char* name, std::string& value, const char* help, const char* type, bool show_default) {
        auto* option = sub.add_option(name, value, help)->type_name(type)->check(nonempty())->group("Planning");
        if (show_default) option->capture_default_str();
    };
    opt("--target-mu-r", o->target_mu_r, "Largest μR wanted in a capillary", "X", true);
    opt("--diluent", o->diluent, "Diluent for heavy absorbers (a material name or .toml file)", "MATERIAL", true);
    opt("--diameter", o->diameter, "Capillary the dilution is computed for [LENGTH]", "LENGTH", true);
    opt("--two-theta-max", o->two_theta_max, "Highest 2θ measured, for the infinite thickness [degrees]", "DEG", true);
    opt("--holder-diameter", o->holder_diameter, "Diameter of the flat-plate holder's well [LENGTH]", "LENGTH", true);
    opt("--holder-area", o->holder_area, "Instead: the well's area [mm2 or cm2; bare number: mm2]", "AREA", false);
    opt("--holder-depth", o->holder_depth, "Depth of the holder's well [LENGTH]", "LENGTH", true);
    sub.add_option("--plot", o->plot, "Also draw μR versus capillary diameter into this SVG file")
        ->type_name("FILE.svg")
        ->check(nonempty());
    sub.add_flag("--json", o->json, "Print one JSON document");
    sub.footer(std::string(kCautions) + "\n");
    sub.callback([o] {
        const PlanReport r = compute(*o);
        if (!o->plot.empty()) write_svg(plan_plot(r), o->plot);
        if (o->json)
            print_json(r);
        else
            print_human(r);
    });
}

}  // namespace mudepth::cli
