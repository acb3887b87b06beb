// `mudepth materials`: the built-in composition library.
#include <iostream>
#include <memory>

#include <nlohmann/json.hpp>

#include "cli/commands.hpp"
#include "cli/common.hpp"
#include "cli/output.hpp"
#include "mudepth/composition.hpp"

namespace mudepth::cli {

namespace {

struct MaterialsOptions {
    std::string name;
    bool json = false;
};

void run_materials(const MaterialsOptions& o) {
    std::vector<Composition> list;
    if (o.name.empty())
        for (const auto& n : builtin_composition_names()) list.push_back(find_composition(n));
    else
        list.push_back(find_composition(o.name));
    if (o.json) {
        nlohmann::json j = nlohmann::json::array();
        for (const auto& c : list) {
            nlohmann::json elements = nlohmann::json::array();
            for (const auto& e : c.material.elements)
                elements.push_back({{"symbol", e.label}, {"weight_fraction", e.weight_fraction}});
            j.push_back({{"name", c.name},
                         {"title", c.title},
                         {"density_g_cm3", c.material.solid_density_g_cm3},
                         {"density_source", c.material.density_source},
                         {"typical_packing", c.typical_packing},
                         {"origin", c.origin},
                         {"elements", elements}});
        }
        std::cout << j.dump(2) << '\n';
        return;
    }
    Table t({"name", "density (g/cm³)", "typical packing", "description"});
    for (const auto& c : list)
        t.add({c.name, fmt(c.material.solid_density_g_cm3, 4), fmt(c.typical_packing, 3), c.title});
    t.print(std::cout, "");
    if (list.size() == 1) {
        std::cout << "\ncomposition by weight: ";
        for (std::size_t i = 0; i < list[0].material.elements.size(); ++i) {
            const auto& e = list[0].material.elements[i];
            std::cout << (i ? ", " : "") << e.label << " " << fixed(e.weight_fraction, 5);
        }
        std::cout << "\ndensity source: " << list[0].material.density_source << "\n";
    }
}

}  // namespace

void register_materials(CLI::App& sub) {
    auto o = std::make_shared<MaterialsOptions>();
    sub.add_option("name", o->name, "Show this composition (name or .toml path) instead of the list")
        ->check(nonempty());
    sub.add_flag("--json", o->json, "Print JSON");
    sub.callback([o] { run_materials(*o); });
}

}  // namespace mudepth::cli
