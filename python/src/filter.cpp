// Bindings: Kβ filter foils for the laboratory anodes, as `mudepth filter`.
#include <string>
#include <vector>

#include <pybind11/stl.h>

#include "bindings.hpp"
#include "mudepth/filter.hpp"

namespace mudepth::python {

namespace {
const Anode& anode_of(const py::object& anode) {
    if (py::isinstance<Anode>(anode)) return anode.cast<const Anode&>();
    if (py::isinstance<py::str>(anode)) return find_anode(anode.cast<std::string>());
    throw py::type_error("anode: expected a symbol such as 'Cu' or a mudepth.Anode");
}
}  // namespace

void bind_filter(py::module_& m) {
    py::class_<SpectrumLine>(m, "SpectrumLine", "One line of the anode's K spectrum.")
        .def_readonly("name", &SpectrumLine::name, "Siegbahn name: Ka1, Ka2, Kb1, ...")
        .def_readonly("energy_keV", &SpectrumLine::energy_keV)
        .def_readonly("relative_intensity", &SpectrumLine::relative_intensity)
        .def_readonly("kbeta", &SpectrumLine::kbeta, "Part of the Kβ group.");
    py::class_<FilterResult>(m, "FilterResult", "A filter foil in front of an anode and what it does.")
        .def_readonly("Z", &FilterResult::Z)
        .def_readonly("symbol", &FilterResult::symbol)
        .def_readonly("k_edge_keV", &FilterResult::k_edge_keV)
        .def_readonly("density_g_cm3", &FilterResult::density_g_cm3, "Density of the pure element, g/cm³.")
        .def_readonly("thickness_cm", &FilterResult::thickness_cm)
        .def_readonly("mass_thickness_g_cm2", &FilterResult::mass_thickness_g_cm2, "ρt, g/cm².")
        .def_readonly("ratio_unfiltered", &FilterResult::ratio_unfiltered, "Kβ/Kα before the foil.")
        .def_readonly("ratio_filtered", &FilterResult::ratio_filtered, "Kβ/Kα after the foil.")
        .def_readonly("kalpha_transmission", &FilterResult::kalpha_transmission)
        .def_readonly("kbeta_transmission", &FilterResult::kbeta_transmission)
        .def("__repr__", [](const FilterResult& r) { return "FilterResult(" + r.symbol + ")"; });

    m.def(
        "anode_k_spectrum", [](const py::object& anode) { return anode_k_spectrum(anode_of(anode)); },
        py::arg("anode"), "The Kα and Kβ lines of the anode (symbol or Anode) with relative intensities.");
    m.def(
        "unfiltered_kbeta_ratio", [](const py::object& anode) { return unfiltered_kbeta_ratio(anode_of(anode)); },
        py::arg("anode"), "Kβ/Kα intensity ratio of the bare anode.");
    m.def(
        "filter_candidates", [](const py::object& anode) { return filter_candidates(anode_of(anode)); },
        py::arg("anode"), "Atomic numbers of the solid elements whose K edge lies between Kβ1 and Kα1.");
    m.def(
        "filter_of_thickness",
        [](const py::object& anode, const py::object& element, double thickness_cm, const std::string& table) {
            return filter_of_thickness(anode_of(anode), atomic_number_of(element), thickness_cm,
                                       parse_cross_section_table(table));
        },
        py::arg("anode"), py::arg("element"), py::arg("thickness_cm"), py::arg("table") = "elam",
        "A foil of this element (symbol or Z), thickness_cm thick, in front of the anode.");
    m.def(
        "filter_for_ratio",
        [](const py::object& anode, const py::object& element, double target_ratio, const std::string& table) {
            return filter_for_ratio(anode_of(anode), atomic_number_of(element), target_ratio,
                                    parse_cross_section_table(table));
        },
        py::arg("anode"), py::arg("element"), py::arg("target_ratio") = 0.01, py::arg("table") = "elam",
        "The foil of this element that brings Kβ/Kα to target_ratio (as `mudepth filter --ratio`).");
    m.def(
        "best_filter_element",
        [](const py::object& anode, double target_ratio, const std::string& table) {
            return best_filter_element(anode_of(anode), target_ratio, parse_cross_section_table(table));
        },
        py::arg("anode"), py::arg("target_ratio") = 0.01, py::arg("table") = "elam",
        "Z of the candidate that passes the most Kα at the target ratio.");
}

}  // namespace mudepth::python
