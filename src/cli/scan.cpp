// `mudepth scan`: attenuation versus energy, for choosing a synchrotron energy.
#include <iostream>
#include <memory>

#include <nlohmann/json.hpp>

#include "cli/commands.hpp"
#include "cli/common.hpp"
#include "cli/output.hpp"
#include "cli/plot.hpp"
#include "mudepth/attenuation.hpp"
#include "mudepth/edges.hpp"
#include "mudepth/energy_grid.hpp"
#include "mudepth/error.hpp"

namespace mudepth::cli {

namespace {

struct ScanOptions {
    SampleOptions sample;
    std::string table = "elam";
    std::string from_keV;
    std::string to_keV;
    std::string steps = "50";
    std::string spacing = "log";
    bool json = false;
    bool csv = false;
    std::string plot;
};

struct ScanPoint {
    double energy_keV;
    MassAttenuation mass_attenuation;
    double mu_per_cm;
};

Plot scan_plot(const Material& material, const std::vector<ScanPoint>& points, const std::vector<NearbyEdge>& edges,
               GridSpacing spacing) {
    Plot plot;
    plot.title = "Mass attenuation of " + material.name;
    plot.x_label = "photon energy (keV)";
    plot.y_label = "μ/ρ (cm²/g)";
    plot.x_log = spacing == GridSpacing::log;
    PlotSeries total{"total", {}, {}}, photo{"photoelectric", {}, {}};
    for (const auto& p : points) {
        total.x.push_back(p.energy_keV);
        total.y.push_back(p.mass_attenuation.total_cm2_g());
        photo.x.push_back(p.energy_keV);
        photo.y.push_back(p.mass_attenuation.photoelectric_cm2_g);
    }
    plot.y_log = spans_decades(total.y, 1.0);
    plot.series = {total, photo};
    for (const auto& e : edges) plot.markers.push_back({e.energy_keV, e.label + " " + e.level});
    return plot;
}

void run_scan(const ScanOptions& o) {
    const Material material = build_material(o.sample);
    const auto table = build_table(o.table);
    if (o.from_keV.empty() || o.to_keV.empty()) throw InputError("scan needs --from and --to (keV)");
    const double from = parse_number("--from", o.from_keV);
    const double to = parse_number("--to", o.to_keV);
    const auto grid = energy_grid_keV(from, to, parse_count("--steps", o.steps), parse_grid_spacing(o.spacing));
    std::vector<ScanPoint> points;
    points.reserve(grid.size());
    for (double e : grid) {
        const MassAttenuation m = material_mass_attenuation(material, e, table);
        points.push_back({e, m, material.density_g_cm3() * m.total_cm2_g()});
    }
    const auto edges = edges_between(material, from, to);
    if (!o.plot.empty()) write_svg(scan_plot(material, points, edges, parse_grid_spacing(o.spacing)), o.plot);

    if (o.json) {
        nlohmann::json j;
        j["sample"] = material.name;
        j["table"] = std::string(to_string(table));
        j["density_g_cm3"] = material.density_g_cm3();
        j["spacing"] = std::string(to_string(parse_grid_spacing(o.spacing)));
        j["edges_crossed"] = nlohmann::json::array();
        for (const auto& e : edges)
            j["edges_crossed"].push_back({{"symbol", e.label}, {"level", e.level}, {"energy_keV", e.energy_keV}});
        j["points"] = nlohmann::json::array();
        for (const auto& p : points)
            j["points"].push_back({{"energy_keV", p.energy_keV},
                                   {"wavelength_A", kHc_keV_A / p.energy_keV},
                                   {"mass_attenuation_cm2_g", p.mass_attenuation.total_cm2_g()},
                                   {"photoelectric_cm2_g", p.mass_attenuation.photoelectric_cm2_g},
                                   {"coherent_cm2_g", p.mass_attenuation.coherent_cm2_g},
                                   {"incoherent_cm2_g", p.mass_attenuation.incoherent_cm2_g},
                                   {"linear_attenuation_per_cm", p.mu_per_cm},
                                   {"attenuation_length_um", 1e4 / p.mu_per_cm}});
        std::cout << j.dump(2) << '\n';
        return;
    }
    Table t({"energy_keV", "wavelength_A", "mu_rho_cm2_g", "photo_cm2_g", "coherent_cm2_g",
             "incoherent_cm2_g", "mu_per_cm", "attenuation_length_um"});
    for (const auto& p : points)
        t.add({fmt(p.energy_keV, 7), fmt(kHc_keV_A / p.energy_keV, 7), fmt(p.mass_attenuation.total_cm2_g(), 6),
               fmt(p.mass_attenuation.photoelectric_cm2_g, 6), fmt(p.mass_attenuation.coherent_cm2_g, 6),
               fmt(p.mass_attenuation.incoherent_cm2_g, 6), fmt(p.mu_per_cm, 6), fmt(1e4 / p.mu_per_cm, 6)});
    if (o.csv) {
        std::cout << "# mudepth scan: " << material.name << ", density " << fmt(material.density_g_cm3(), 5)
                  << " g/cm3, table " << to_string(table) << '\n';
        for (const auto& e : edges)
            std::cout << "# edge crossed: " << e.label << ' ' << e.level << ' ' << fmt(e.energy_keV, 6) << " keV\n";
        t.print_csv(std::cout);
        return;
    }
    print_field(std::cout, "Sample", material.name);
    print_field(std::cout, "Density used", fmt(material.density_g_cm3(), 5) + " g/cm³");
    print_field(std::cout, "Cross sections", std::string(to_string(table)));
    std::string crossed;
    for (const auto& e : edges)
        crossed += (crossed.empty() ? "" : ", ") + e.label + " " + e.level + " " + fmt(e.energy_keV, 5) + " keV";
    print_field(std::cout, "Edges crossed", crossed.empty() ? "none" : crossed);
    std::cout << '\n';
    Table h({"E (keV)", "λ (Å)", "μ/ρ (cm²/g)", "photo (cm²/g)", "coh (cm²/g)", "incoh (cm²/g)", "μ (1/cm)", "1/μ"});
    for (const auto& p : points)
        h.add({fmt(p.energy_keV, 6), fmt(kHc_keV_A / p.energy_keV, 6), fmt(p.mass_attenuation.total_cm2_g(), 5),
               fmt(p.mass_attenuation.photoelectric_cm2_g, 5), fmt(p.mass_attenuation.coherent_cm2_g, 4),
               fmt(p.mass_attenuation.incoherent_cm2_g, 4), fmt(p.mu_per_cm, 5), length_from_um(1e4 / p.mu_per_cm)});
    h.print(std::cout);
}

}  // namespace

void register_scan(CLI::App& sub) {
    auto o = std::make_shared<ScanOptions>();
    add_sample_options(sub, o->sample);
    add_table_option(sub, o->table);
    sub.add_option("--from", o->from_keV, "First energy [keV]")
        ->type_name("KEV")->check(nonempty())->group("Scan");
    sub.add_option("--to", o->to_keV, "Last energy [keV]")
        ->type_name("KEV")->check(nonempty())->group("Scan");
    sub.add_option("--steps", o->steps, "Number of energies, ends included")
        ->type_name("N")->capture_default_str()->check(nonempty())->group("Scan");
    sub.add_option("--spacing", o->spacing, "Spacing of the energies: log or linear")
        ->type_name("SPACING")->capture_default_str()->check(nonempty())->group("Scan");
    auto* json = sub.add_flag("--json", o->json, "Print one JSON document");
    sub.add_flag("--csv", o->csv, "Print CSV")->excludes(json);
    sub.add_option("--plot", o->plot, "Also draw μ/ρ versus energy into this SVG file")
        ->type_name("FILE.svg")
        ->check(nonempty());
    sub.callback([o] { run_scan(*o); });
}

}  // namespace mudepth::cli
