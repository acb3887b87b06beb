// Bindings: μ/ρ and its parts, linear μ, δ, β and the critical angle over arrays
// of energies; the full report at one energy; nearby edges and fluorescence.
#include <string>

#include <pybind11/stl.h>

#include "arrays.hpp"
#include "bindings.hpp"
#include "mudepth/attenuation.hpp"
#include "mudepth/edges.hpp"
#include "mudepth/radiation.hpp"
#include "mudepth/refraction.hpp"

namespace mudepth::python {

namespace {

using E1 = std::array<double, 1>;

std::array<std::pair<py::handle, const char*>, 1> energies(const py::object& energy_keV) {
    return {{{energy_keV, "energy_keV"}}};
}

}  // namespace

void bind_attenuation(py::module_& m) {
    py::class_<MassAttenuation>(m, "MassAttenuation", "Mass attenuation coefficient and its parts, cm²/g.")
        .def_readonly("photoelectric_cm2_g", &MassAttenuation::photoelectric_cm2_g)
        .def_readonly("coherent_cm2_g", &MassAttenuation::coherent_cm2_g)
        .def_readonly("incoherent_cm2_g", &MassAttenuation::incoherent_cm2_g)
        .def_property_readonly("total_cm2_g", &MassAttenuation::total_cm2_g);
    py::class_<ElementAttenuation>(m, "ElementAttenuation", "One element's part of a material's attenuation.")
        .def_readonly("Z", &ElementAttenuation::Z)
        .def_readonly("label", &ElementAttenuation::label)
        .def_readonly("weight_fraction", &ElementAttenuation::weight_fraction)
        .def_readonly("mass_attenuation", &ElementAttenuation::mass_attenuation, "Of the element itself, cm²/g.")
        .def_readonly("share_of_total", &ElementAttenuation::share_of_total, "w_i (μ/ρ)_i / (μ/ρ), 0..1.");
    py::class_<Attenuation>(m, "Attenuation", "Everything about a material's attenuation at one energy.")
        .def_readonly("energy_keV", &Attenuation::energy_keV)
        .def_property_readonly("table", [](const Attenuation& a) { return std::string(to_string(a.table)); })
        .def_readonly("density_g_cm3", &Attenuation::density_g_cm3, "Density used (after packing), g/cm³.")
        .def_readonly("mass_attenuation", &Attenuation::mass_attenuation, "Of the material, cm²/g.")
        .def_readonly("mu_per_cm", &Attenuation::mu_per_cm, "Linear attenuation coefficient, 1/cm.")
        .def_readonly("attenuation_length_um", &Attenuation::attenuation_length_um, "1/μ, µm.")
        .def_readonly("elements", &Attenuation::elements, "List of ElementAttenuation.");

    m.def(
        "attenuation",
        [](const Material& material, double energy_keV, const std::string& table) {
            const auto t = parse_cross_section_table(table);
            check_energy_keV(energy_keV);
            return attenuation(material, energy_keV, t);
        },
        py::arg("material"), py::arg("energy_keV"), py::arg("table") = "elam",
        "The attenuation report at one energy (keV), table 'elam' or 'chantler': the numbers of\n"
        "`mudepth mu --json` (mass_attenuation in cm²/g, mu_per_cm, attenuation_length_um, elements).");

    m.def(
        "mass_attenuation_cm2_g",
        [](const Material& material, const py::object& energy_keV, const std::string& table) {
            const auto t = parse_cross_section_table(table);
            return map_one<1>(energies(energy_keV), [&](const E1& e) {
                check_energy_keV(e[0]);
                return material_mass_attenuation(material, e[0], t).total_cm2_g();
            });
        },
        py::arg("material"), py::arg("energy_keV"), py::arg("table") = "elam",
        "Total mass attenuation coefficient μ/ρ = Σ w_i (μ/ρ)_i, cm²/g, at energies in keV (1 to 500;\n"
        "array, list or scalar). table: 'elam' (Elam, Ravel & Sieber 2002) or 'chantler' (Chantler 2000).");

    m.def(
        "mass_attenuation_parts_cm2_g",
        [](const Material& material, const py::object& energy_keV, const std::string& table) {
            const auto t = parse_cross_section_table(table);
            auto out = map_elements<4>(energies(energy_keV), [&](const E1& e, std::array<double, 4>& y) {
                check_energy_keV(e[0]);
                const MassAttenuation a = material_mass_attenuation(material, e[0], t);
                y = {a.total_cm2_g(), a.photoelectric_cm2_g, a.coherent_cm2_g, a.incoherent_cm2_g};
            });
            return to_dict<4>({"total", "photoelectric", "coherent", "incoherent"}, out);
        },
        py::arg("material"), py::arg("energy_keV"), py::arg("table") = "elam",
        "μ/ρ and its parts, cm²/g, at energies in keV: a dict of arrays with keys 'total',\n"
        "'photoelectric', 'coherent', 'incoherent' (the keys of mu --json mass_attenuation_cm2_g).");

    m.def(
        "linear_attenuation_per_cm",
        [](const Material& material, const py::object& energy_keV, const std::string& table) {
            const auto t = parse_cross_section_table(table);
            return map_one<1>(energies(energy_keV), [&](const E1& e) {
                check_energy_keV(e[0]);
                return linear_attenuation_per_cm(material, e[0], t);
            });
        },
        py::arg("material"), py::arg("energy_keV"), py::arg("table") = "elam",
        "Linear attenuation coefficient μ = (μ/ρ)·ρ of the packed sample, 1/cm, at energies in keV.");

    m.def(
        "refraction",
        [](const Material& material, const py::object& energy_keV, const std::string& table) {
            const auto t = parse_cross_section_table(table);
            auto out = map_elements<4>(energies(energy_keV), [&](const E1& e, std::array<double, 4>& y) {
                check_energy_keV(e[0]);
                const double mu = linear_attenuation_per_cm(material, e[0], t);
                const Refraction r = refraction(material, e[0], mu);
                y = {r.delta, r.beta, r.critical_angle_deg, mu};
            });
            return to_dict<4>({"delta", "beta", "critical_angle_deg", "mu_per_cm"}, out);
        },
        py::arg("material"), py::arg("energy_keV"), py::arg("table") = "elam",
        "Refractive index n = 1 − δ − iβ of the packed sample at energies in keV: a dict of arrays\n"
        "'delta' (Chantler f1), 'beta' (= λμ/4π with μ from `table`), 'critical_angle_deg' (α_c = √(2δ),\n"
        "degrees) and the 'mu_per_cm' used (1/cm).");

    m.def(
        "transmission",
        [](const py::object& mu_per_cm, const py::object& thickness_cm) {
            return map_one<2>({{{mu_per_cm, "mu_per_cm"}, {thickness_cm, "thickness_cm"}}},
                              [](const std::array<double, 2>& x) { return transmission(x[0], x[1]); });
        },
        py::arg("mu_per_cm"), py::arg("thickness_cm"),
        "Beer-Lambert transmission exp(−μt): μ in 1/cm, thickness in cm (arrays broadcast).");

    m.def(
        "element_mass_attenuation_cm2_g",
        [](const py::object& element, const py::object& energy_keV, const std::string& table) {
            const int Z = atomic_number_of(element);
            const auto t = parse_cross_section_table(table);
            return map_one<1>(energies(energy_keV),
                              [&](const E1& e) { return element_mass_attenuation(Z, e[0], t).total_cm2_g(); });
        },
        py::arg("element"), py::arg("energy_keV"), py::arg("table") = "elam",
        "μ/ρ of one element (symbol or Z), cm²/g, at energies in keV.");

    py::class_<NearbyEdge>(m, "NearbyEdge", "An absorption edge of one of the material's elements.")
        .def_readonly("Z", &NearbyEdge::Z)
        .def_readonly("label", &NearbyEdge::label)
        .def_readonly("level", &NearbyEdge::level, "K, L1, ...")
        .def_readonly("energy_keV", &NearbyEdge::energy_keV);
    m.def("edges_near", &edges_near, py::arg("material"), py::arg("energy_keV"), py::arg("below_keV") = 2.0,
          py::arg("above_keV") = 1.0, "Edges within [E − below, E + above] keV, sorted.");
    py::class_<FluorescenceWarning>(m, "FluorescenceWarning", "An element the radiation makes fluoresce.")
        .def_readonly("Z", &FluorescenceWarning::Z)
        .def_readonly("label", &FluorescenceWarning::label)
        .def_readonly("edge_level", &FluorescenceWarning::edge_level)
        .def_readonly("edge_keV", &FluorescenceWarning::edge_keV)
        .def_readonly("line_iupac", &FluorescenceWarning::line_iupac)
        .def_readonly("line_siegbahn", &FluorescenceWarning::line_siegbahn)
        .def_readonly("line_keV", &FluorescenceWarning::line_keV)
        .def_readonly("avoiding_sources", &FluorescenceWarning::avoiding_sources,
                      "Standard anodes whose Kα1 lies below the edge.")
        .def_readonly("message", &FluorescenceWarning::message);
    m.def("fluorescence_warnings", &fluorescence_warnings, py::arg("material"), py::arg("energy_keV"),
          "One warning per element whose K or L3 edge lies below energy_keV and whose line is detectable.");
}

}  // namespace mudepth::python
