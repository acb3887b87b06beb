// Bindings: the incident radiation from an energy, a wavelength or an anode line.
#include <string>

#include <pybind11/stl.h>

#include "arrays.hpp"
#include "bindings.hpp"
#include "mudepth/radiation.hpp"

namespace mudepth::python {

void bind_radiation(py::module_& m) {
    py::class_<Radiation>(m, "Radiation", "The incident radiation: an energy with its label.")
        .def_readonly("energy_keV", &Radiation::energy_keV)
        .def_readonly("label", &Radiation::label, "'8.0478 keV', 'Cu Ka', ...")
        .def_property_readonly("wavelength_A", &Radiation::wavelength_A, "Wavelength, Å.")
        .def("__repr__", [](const Radiation& r) {
            return "Radiation('" + r.label + "', energy_keV=" + py::repr(py::float_(r.energy_keV)).cast<std::string>() +
                   ")";
        });
    m.def(
        "radiation_from_energy",
        [](double energy_keV) {
            check_energy_keV(energy_keV);
            return radiation_from_energy(energy_keV);
        },
        py::arg("energy_keV"), "Radiation of this photon energy, keV (1 to 500).");
    m.def("radiation_from_wavelength", &radiation_from_wavelength, py::arg("wavelength_A"),
          "Radiation of this wavelength, Å (its energy must lie within 1 to 500 keV).");
    m.def(
        "radiation_from_source", [](const std::string& source) { return radiation_from_source(source); },
        py::arg("source"),
        "An anode line: 'Cu' (Kα, the 2:1 mean of Kα1 and Kα2), 'Cu:Ka1', 'Mo:Ka2', 'Co:Kb'.\n"
        "Anodes Cr, Fe, Co, Cu, Ga, Mo, Ag, In, W. Equals the command line's --source.");
    m.def(
        "wavelength_A_from_energy_keV",
        [](const py::object& energy_keV) {
            return map_one<1>({{{energy_keV, "energy_keV"}}},
                              [](const std::array<double, 1>& x) { return wavelength_A_from_energy_keV(x[0]); });
        },
        py::arg("energy_keV"), "λ = hc/E: wavelength in Å from energies in keV (array or scalar).");
    m.def(
        "energy_keV_from_wavelength_A",
        [](const py::object& wavelength_A) {
            return map_one<1>({{{wavelength_A, "wavelength_A"}}},
                              [](const std::array<double, 1>& x) { return energy_keV_from_wavelength_A(x[0]); });
        },
        py::arg("wavelength_A"), "E = hc/λ: energy in keV from wavelengths in Å (array or scalar).");

    py::class_<Anode>(m, "Anode", "A laboratory anode and its line wavelengths, Å.")
        .def_property_readonly("symbol", [](const Anode& a) { return std::string(a.symbol); })
        .def_readonly("Z", &Anode::Z)
        .def_readonly("ka1_A", &Anode::ka1_A)
        .def_readonly("ka2_A", &Anode::ka2_A)
        .def_readonly("kb1_A", &Anode::kb1_A)
        .def_property_readonly("source", [](const Anode& a) { return std::string(a.source); },
                               "Where the wavelengths come from.")
        .def("__repr__", [](const Anode& a) { return "Anode('" + std::string(a.symbol) + "')"; });
    m.def(
        "anodes", [] { return std::vector<Anode>(anodes().begin(), anodes().end()); },
        "The known anodes, in order of Z.");
    m.def(
        "find_anode", [](const std::string& symbol) { return find_anode(symbol); }, py::arg("symbol"),
        "The anode with this symbol ('Cu'); ValueError listing the known ones.");
}

}  // namespace mudepth::python
