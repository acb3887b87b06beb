// `mudepth filter`: Kβ filter foils for the laboratory anodes.
#include <iostream>
#include <memory>
#include <optional>

#include <nlohmann/json.hpp>

#include "cli/commands.hpp"
#include "cli/common.hpp"
#include "cli/output.hpp"
#include "mudepth/elements.hpp"
#include "mudepth/error.hpp"
#include "mudepth/filter.hpp"

namespace mudepth::cli {

namespace {

/// Default target Kβ/Kα after the foil: 1 %.
constexpr const char* kDefaultRatio = "0.01";

struct FilterOptions {
    std::string anode;
    std::string ratio;  ///< empty: the default target kDefaultRatio
    std::string thickness;
    std::string element;
    std::string table = "elam";
    bool json = false;
};

struct AnodeFilter {
    const Anode* anode;
    FilterResult result;
    std::vector<FilterResult> alternatives;  ///< the other candidates at the same target (or thickness)
};

int element_from_symbol(const std::string& symbol) {
    const auto Z = atomic_number(symbol);
    if (!Z) throw InputError("--element: unknown element '" + symbol + "'");
    return *Z;
}

AnodeFilter compute(const Anode& anode, const FilterOptions& o) {
    const auto table = build_table(o.table);
    if (!o.ratio.empty() && !o.thickness.empty())
        throw InputError("give --ratio (the foil is found) or --thickness (the ratio is found), not both");
    // With --thickness the element is still chosen as the best at the default ratio.
    const double ratio = parse_number("--ratio", o.ratio.empty() ? kDefaultRatio : o.ratio);
    if (ratio <= 0) throw InputError("--ratio: the target Kb/Ka ratio must be positive");
    const std::optional<double> thickness_cm =
        o.thickness.empty() ? std::nullopt : std::optional(parse_length_cm("--thickness", o.thickness));
    auto evaluate = [&](int Z) {
        return thickness_cm ? filter_of_thickness(anode, Z, *thickness_cm, table)
                            : filter_for_ratio(anode, Z, ratio, table);
    };
    const int chosen = o.element.empty() ? best_filter_element(anode, ratio, table) : element_from_symbol(o.element);
    AnodeFilter f{&anode, evaluate(chosen), {}};
    for (int Z : filter_candidates(anode))
        if (Z != chosen) f.alternatives.push_back(evaluate(Z));
    return f;
}

nlohmann::json result_json(const FilterResult& r) {
    return {{"symbol", r.symbol},
            {"Z", r.Z},
            {"k_edge_keV", r.k_edge_keV},
            {"density_g_cm3", r.density_g_cm3},
            {"thickness_um", r.thickness_cm * 1e4},
            {"mass_thickness_mg_cm2", r.mass_thickness_g_cm2 * 1e3},
            {"kbeta_kalpha_ratio", r.ratio_filtered},
            {"kalpha_transmission", r.kalpha_transmission},
            {"kbeta_transmission", r.kbeta_transmission}};
}

nlohmann::json anode_json(const AnodeFilter& f) {
    nlohmann::json alternatives = nlohmann::json::array();
    for (const auto& a : f.alternatives) alternatives.push_back(result_json(a));
    return {{"anode", std::string(f.anode->symbol)},
            {"ka1_keV", energy_keV_from_wavelength_A(f.anode->ka1_A)},
            {"kb1_keV", energy_keV_from_wavelength_A(f.anode->kb1_A)},
            {"unfiltered_kbeta_kalpha_ratio", f.result.ratio_unfiltered},
            {"filter", result_json(f.result)},
            {"other_candidates", alternatives}};
}

void print_one(const AnodeFilter& f, bool by_thickness) {
    const auto& r = f.result;
    auto& out = std::cout;
    print_field(out, "Anode", std::string(f.anode->symbol) + ": Ka1 " + fmt(energy_keV_from_wavelength_A(f.anode->ka1_A), 6) +
                                  " keV, Kb1 " + fmt(energy_keV_from_wavelength_A(f.anode->kb1_A), 6) + " keV");
    print_field(out, "Kb/Ka unfiltered", fmt(r.ratio_unfiltered, 4) + " (line intensities of the element data)");
    print_field(out, "Filter", r.symbol + " foil, K edge " + fmt(r.k_edge_keV, 5) + " keV, density " +
                                   fmt(r.density_g_cm3, 4) + " g/cm³");
    print_field(out, "Foil thickness", length_from_um(r.thickness_cm * 1e4) + " (" +
                                           fmt(r.mass_thickness_g_cm2 * 1e3, 4) + " mg/cm²)" +
                                           (by_thickness ? " as given" : ""));
    print_field(out, "Kb/Ka after the foil", fmt(r.ratio_filtered, 4));
    print_field(out, "Ka transmission", fmt(r.kalpha_transmission, 4));
    print_field(out, "Kb transmission", fmt(r.kbeta_transmission, 4));
    if (!f.alternatives.empty()) {
        out << "\nOther elements with a K edge between Ka1 and Kb1:\n";
        Table t({"element", "K edge (keV)", "thickness", "Kb/Ka", "Ka transmission"});
        for (const auto& a : f.alternatives)
            t.add({a.symbol, fmt(a.k_edge_keV, 5), length_from_um(a.thickness_cm * 1e4), fmt(a.ratio_filtered, 4),
                   fmt(a.kalpha_transmission, 4)});
        t.print(out);
    }
}

void run_filter(const FilterOptions& o) {
    std::vector<AnodeFilter> results;
    if (!o.anode.empty()) {
        results.push_back(compute(find_anode(o.anode), o));
    } else {
        if (!o.element.empty()) throw InputError("--element needs --anode");
        for (const auto& a : anodes()) results.push_back(compute(a, o));
    }
    if (o.json) {
        if (results.size() == 1) {
            std::cout << anode_json(results[0]).dump(2) << '\n';
        } else {
            nlohmann::json j = nlohmann::json::array();
            for (const auto& r : results) j.push_back(anode_json(r));
            std::cout << j.dump(2) << '\n';
        }
        return;
    }
    if (results.size() == 1) {
        print_one(results[0], !o.thickness.empty());
    } else {
        std::cout << (o.thickness.empty() ? "Kb filters for Kb/Ka = " + (o.ratio.empty() ? std::string(kDefaultRatio) : o.ratio)
                                          : "Kb filters of thickness " + o.thickness)
                  << " (intensity ratios from the element data's line intensities)\n\n";
        Table t({"anode", "unfiltered Kb/Ka", "filter", "K edge (keV)", "thickness", "mg/cm²", "Kb/Ka",
                 "Ka transmission"});
        for (const auto& f : results) {
            const auto& r = f.result;
            t.add({std::string(f.anode->symbol), fmt(r.ratio_unfiltered, 4), r.symbol, fmt(r.k_edge_keV, 5),
                   length_from_um(r.thickness_cm * 1e4, 3), fmt(r.mass_thickness_g_cm2 * 1e3, 3),
                   fmt(r.ratio_filtered, 3), fmt(r.kalpha_transmission, 3)});
        }
        t.print(std::cout);
    }
    std::cout << '\n' << kCautions << '\n';
}

}  // namespace

void register_filter(CLI::App& sub) {
    auto o = std::make_shared<FilterOptions>();
    sub.add_option("--anode", o->anode, "Anode: Cr, Fe, Co, Cu, Ga, Mo, Ag, In or W (default: all)")
        ->type_name("ANODE")
        ->check(nonempty());
    sub.add_option("--ratio", o->ratio, std::string("Target Kb/Ka intensity ratio after the foil (default: ") + kDefaultRatio + ")")
        ->type_name("RATIO")
        ->check(nonempty());
    sub.add_option("--thickness", o->thickness,
                   "Instead of --ratio: the foil thickness, giving the resulting ratio [nm, um, mm, cm; bare number: mm]")
        ->type_name("LENGTH")
        ->check(nonempty());
    sub.add_option("--element", o->element, "Use this foil element instead of the best candidate")
        ->type_name("SYMBOL")
        ->check(nonempty());
    add_table_option(sub, o->table);
    sub.add_flag("--json", o->json, "Print one JSON document");
    sub.footer(std::string(kCautions) + "\n");
    sub.callback([o] { run_filter(*o); });
}

}  // namespace mudepth::cli
