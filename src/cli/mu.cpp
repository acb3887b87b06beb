// `mudepth mu`: attenuation of a sample at one energy.
#include <cmath>
#include <iostream>
#include <memory>
#include <numbers>
#include <optional>

#include <nlohmann/json.hpp>

#include "cli/commands.hpp"
#include "cli/common.hpp"
#include "cli/output.hpp"
#include "mudepth/attenuation.hpp"
#include "mudepth/edges.hpp"
#include "mudepth/refraction.hpp"

namespace mudepth::cli {

namespace {

struct MuOptions {
    SampleOptions sample;
    RadiationOptions radiation;
    std::string table = "elam";
    std::string thickness;
    bool json = false;
};

/// The other table's total μ/ρ, when it covers every element.
struct TableSpread {
    CrossSectionTable other;
    std::optional<double> total_cm2_g;  ///< nullopt when the other table lacks an element
    std::optional<double> relative_difference() const;
    double of_total_cm2_g = 0;
};

std::optional<double> TableSpread::relative_difference() const {
    if (!total_cm2_g) return std::nullopt;
    return *total_cm2_g / of_total_cm2_g - 1.0;
}

TableSpread table_spread(const Material& m, double energy_keV, CrossSectionTable table, double total_cm2_g) {
    TableSpread s{table == CrossSectionTable::elam ? CrossSectionTable::chantler : CrossSectionTable::elam,
                  std::nullopt, total_cm2_g};
    for (const auto& e : m.elements)
        if (s.other == CrossSectionTable::chantler && e.Z > kChantlerMaxAtomicNumber) return s;
    s.total_cm2_g = material_mass_attenuation(m, energy_keV, s.other).total_cm2_g();
    return s;
}

struct MuReport {
    Material material;
    Radiation radiation;
    Attenuation attenuation;
    Refraction refraction;
    std::vector<NearbyEdge> edges;
    std::vector<FluorescenceWarning> fluorescence;
    TableSpread spread;
    std::optional<double> thickness_cm;
    std::vector<std::string> warnings;
};

MuReport compute(const MuOptions& o) {
    MuReport r{build_material(o.sample), build_radiation(o.radiation), {}, {}, {}, {}, {}, {}, {}};
    const double e = r.radiation.energy_keV;
    const auto table = build_table(o.table);
    r.attenuation = attenuation(r.material, e, table);
    r.refraction = refraction(r.material, e, r.attenuation.mu_per_cm);
    r.edges = edges_near(r.material, e);
    r.fluorescence = fluorescence_warnings(r.material, e);
    r.spread = table_spread(r.material, e, table, r.attenuation.mass_attenuation.total_cm2_g());
    if (!o.thickness.empty()) r.thickness_cm = parse_length_cm("--thickness", o.thickness);
    for (const auto& f : r.fluorescence) r.warnings.push_back(f.message);
    if (r.refraction.f1_approximated)
        r.warnings.push_back("no Chantler f1 above Z = 92: delta uses f1 = Z for those elements");
    if (!r.spread.total_cm2_g)
        r.warnings.push_back("the chantler table stops at Z = 92: no table spread for this sample");
    return r;
}

nlohmann::json mass_json(const MassAttenuation& m) {
    return {{"total", m.total_cm2_g()},
            {"photoelectric", m.photoelectric_cm2_g},
            {"coherent", m.coherent_cm2_g},
            {"incoherent", m.incoherent_cm2_g}};
}

void print_json(const MuReport& r) {
    const auto& a = r.attenuation;
    nlohmann::json j;
    j["sample"] = r.material.name;
    j["radiation"] = r.radiation.label;
    j["energy_keV"] = r.radiation.energy_keV;
    j["wavelength_A"] = r.radiation.wavelength_A();
    j["table"] = std::string(to_string(a.table));
    j["density_g_cm3"] = a.density_g_cm3;
    j["solid_density_g_cm3"] = r.material.solid_density_g_cm3;
    j["packing_fraction"] = r.material.packing_fraction;
    j["density_is_bulk"] = r.material.density_is_bulk;
    j["density_source"] = r.material.density_source;
    j["mass_attenuation_cm2_g"] = mass_json(a.mass_attenuation);
    j["linear_attenuation_per_cm"] = a.mu_per_cm;
    j["attenuation_length_um"] = a.attenuation_length_um;
    j["elements"] = nlohmann::json::array();
    for (const auto& e : a.elements)
        j["elements"].push_back({{"symbol", e.label},
                                 {"Z", e.Z},
                                 {"weight_fraction", e.weight_fraction},
                                 {"mass_attenuation_cm2_g", e.mass_attenuation.total_cm2_g()},
                                 {"parts_cm2_g", mass_json(e.mass_attenuation)},
                                 {"share_of_total", e.share_of_total}});
    j["edges_nearby"] = nlohmann::json::array();
    for (const auto& e : r.edges)
        j["edges_nearby"].push_back({{"symbol", e.label}, {"level", e.level}, {"energy_keV", e.energy_keV}});
    j["refraction"] = {{"delta", r.refraction.delta},
                       {"beta", r.refraction.beta},
                       {"critical_angle_deg", r.refraction.critical_angle_deg}};
    j["table_spread"] = {{"other_table", std::string(to_string(r.spread.other))},
                         {"other_total_cm2_g", r.spread.total_cm2_g ? nlohmann::json(*r.spread.total_cm2_g) : nlohmann::json()},
                         {"relative_difference", r.spread.relative_difference() ? nlohmann::json(*r.spread.relative_difference()) : nlohmann::json()}};
    j["fluorescence"] = nlohmann::json::array();
    for (const auto& f : r.fluorescence)
        j["fluorescence"].push_back({{"symbol", f.label},
                                     {"edge", f.edge_level},
                                     {"edge_keV", f.edge_keV},
                                     {"line", f.line_iupac},
                                     {"line_siegbahn", f.line_siegbahn},
                                     {"line_keV", f.line_keV},
                                     {"avoided_by", f.avoiding_sources}});
    if (r.thickness_cm)
        j["transmission"] = {{"thickness_um", *r.thickness_cm * 1e4},
                             {"transmission", transmission(a.mu_per_cm, *r.thickness_cm)}};
    j["warnings"] = r.warnings;
    std::cout << j.dump(2) << '\n';
}

std::string density_text(const Material& m) {
    if (m.density_is_bulk) return fmt(m.density_g_cm3(), 5) + " g/cm³ (bulk)";
    if (m.packing_fraction == 1.0) return fmt(m.density_g_cm3(), 5) + " g/cm³";
    return fmt(m.solid_density_g_cm3, 5) + " g/cm³ × packing " + fmt(m.packing_fraction, 4) + " = " +
           fmt(m.density_g_cm3(), 5) + " g/cm³";
}

void print_human(const MuReport& r) {
    const auto& a = r.attenuation;
    auto& out = std::cout;
    print_field(out, "Sample", r.material.name);
    print_field(out, "Density used", density_text(r.material) +
                                         (r.material.density_source.empty() ? "" : " (" + r.material.density_source + ")"));
    const bool by_energy = r.radiation.label.ends_with("keV");
    print_field(out, "Radiation", (by_energy ? "" : r.radiation.label + ": ") + fmt(r.radiation.energy_keV, 6) +
                                      " keV, " + fmt(r.radiation.wavelength_A(), 7) + " Å");
    print_field(out, "Cross sections", std::string(to_string(a.table)) + " (" + std::string(citation(a.table)) + ")");
    out << '\n';
    print_field(out, "μ/ρ total", fmt(a.mass_attenuation.total_cm2_g(), 5) + " cm²/g");
    print_field(out, "  photoelectric", fmt(a.mass_attenuation.photoelectric_cm2_g, 5) + " cm²/g");
    print_field(out, "  coherent", fmt(a.mass_attenuation.coherent_cm2_g, 5) + " cm²/g");
    print_field(out, "  incoherent", fmt(a.mass_attenuation.incoherent_cm2_g, 5) + " cm²/g");
    print_field(out, "μ (linear)", fmt(a.mu_per_cm, 5) + " 1/cm");
    print_field(out, "1/μ", length_from_um(a.attenuation_length_um, 5));
    if (r.thickness_cm)
        print_field(out, "Transmission", fmt(transmission(a.mu_per_cm, *r.thickness_cm), 5) + " through " +
                                             length_from_um(*r.thickness_cm * 1e4));
    out << '\n';
    Table t({"element", "weight fraction", "μ/ρ (cm²/g)", "share of μ"});
    for (const auto& e : a.elements)
        t.add({e.label, fixed(e.weight_fraction, 5), fmt(e.mass_attenuation.total_cm2_g(), 5),
               fixed(100 * e.share_of_total, 1) + " %"});
    t.print(out);
    out << '\n';
    std::string edges;
    for (const auto& e : r.edges)
        edges += (edges.empty() ? "" : ", ") + e.label + " " + e.level + " " + fmt(e.energy_keV, 5) + " keV";
    print_field(out, "Edges (−2/+1 keV)", edges.empty() ? "none" : edges);
    print_field(out, "Refraction", "δ = " + fmt(r.refraction.delta, 4) + ", β = " + fmt(r.refraction.beta, 4));
    print_field(out, "Critical angle", fmt(r.refraction.critical_angle_deg, 4) + "° (" +
                                           fmt(r.refraction.critical_angle_deg * std::numbers::pi / 180.0 * 1e3, 4) + " mrad)");
    if (auto d = r.spread.relative_difference())
        print_field(out, "Table spread", std::string(to_string(r.spread.other)) + " gives " +
                                             fmt(*r.spread.total_cm2_g, 5) + " cm²/g (" +
                                             (*d >= 0 ? "+" : "") + fixed(100 * *d, 2) + " %)");
    if (!r.warnings.empty()) {
        out << "\nWarnings:\n";
        for (const auto& w : r.warnings) out << "  - " << w << '\n';
    }
}

}  // namespace

void register_mu(CLI::App& sub) {
    auto o = std::make_shared<MuOptions>();
    add_sample_options(sub, o->sample);
    add_radiation_options(sub, o->radiation);
    add_table_option(sub, o->table);
    sub.add_option("--thickness", o->thickness, "Also print the transmission through this thickness [nm, um, mm, cm; bare number: mm]")
        ->type_name("LENGTH")
        ->check(nonempty());
    sub.add_flag("--json", o->json, "Print one JSON document instead of the table");
    sub.footer(std::string(kCautions) + "\n");
    sub.callback([o] {
        const MuReport r = compute(*o);
        if (o->json)
            print_json(r);
        else
            print_human(r);
    });
}

}  // namespace mudepth::cli
