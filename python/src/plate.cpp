// Bindings: flat-plate absorption factors over arrays (ITC C §6.3.3), as `mudepth plate`.
#include <optional>
#include <string>

#include <pybind11/stl.h>

#include "arrays.hpp"
#include "bindings.hpp"
#include "mudepth/plate.hpp"

namespace mudepth::python {

namespace {
using P = std::pair<py::handle, const char*>;
using A2 = std::array<double, 2>;
using A3 = std::array<double, 3>;

std::optional<double> maybe(bool given, double value) { return given ? std::optional<double>(value) : std::nullopt; }
}  // namespace

void bind_plate(py::module_& m) {
    const char* modes = "mode: 'reflection', 'transmission-normal' or 'transmission-symmetric'.";
    m.def(
        "plate_transmission",
        [](const py::object& mu_t, const py::object& two_theta_deg, const std::string& mode,
           const py::object& incidence_deg) {
            const PlateMode pm = parse_plate_mode(mode);
            const bool inc = !incidence_deg.is_none();
            return map_one<3>(std::array<P, 3>{{{mu_t, "mu_t"}, {two_theta_deg, "two_theta_deg"},
                                                {or_zero(incidence_deg), "incidence_deg"}}},
                              [&](const A3& x) { return plate_transmission(pm, x[0], x[1], maybe(inc, x[2])); });
        },
        py::arg("mu_t"), py::arg("two_theta_deg"), py::arg("mode") = "reflection", py::kw_only(),
        py::arg("incidence_deg") = py::none(),
        (std::string("Flat plate of optical thickness mu_t = μ·t at 2θ (degrees). Reflection: intensity relative\n"
                     "to an infinitely thick sample, 1 − exp(−μt(1/sinα + 1/sinβ)) (incidence_deg α; default\n"
                     "symmetric); transmission modes: absorption factor A. The correction is 1/A. ") +
         modes)
            .c_str());
    m.def(
        "window_transmission",
        [](const py::object& mu_t_window, const py::object& two_theta_deg, const std::string& mode,
           const py::object& incidence_deg) {
            const PlateMode pm = parse_plate_mode(mode);
            const bool inc = !incidence_deg.is_none();
            return map_one<3>(std::array<P, 3>{{{mu_t_window, "mu_t_window"}, {two_theta_deg, "two_theta_deg"},
                                                {or_zero(incidence_deg), "incidence_deg"}}},
                              [&](const A3& x) { return window_transmission(pm, x[0], x[1], maybe(inc, x[2])); });
        },
        py::arg("mu_t_window"), py::arg("two_theta_deg"), py::arg("mode") = "reflection", py::kw_only(),
        py::arg("incidence_deg") = py::none(),
        "Transmission of the window foils, mu_t_window = μ × thickness of ONE foil: one foil each side in\n"
        "transmission, one cover foil crossed in and out in reflection. Multiply by plate_transmission for\n"
        "the total of `mudepth plate --mu-t-window`.");
    m.def(
        "infinite_thickness_mu_t",
        [](const py::object& fraction, const py::object& two_theta_deg, const py::object& incidence_deg) {
            const bool inc = !incidence_deg.is_none();
            return map_one<3>(std::array<P, 3>{{{fraction, "fraction"}, {two_theta_deg, "two_theta_deg"},
                                                {or_zero(incidence_deg), "incidence_deg"}}},
                              [&](const A3& x) { return infinite_thickness_mu_t(x[0], x[1], maybe(inc, x[2])); });
        },
        py::arg("fraction"), py::arg("two_theta_deg"), py::kw_only(), py::arg("incidence_deg") = py::none(),
        "Reflection: the μt from which `fraction` (e.g. 0.99) of the infinitely thick intensity comes,\n"
        "ln(1/(1−f))/(1/sinα + 1/sinβ). Divide by μ (1/cm) for the thickness in cm.");
    m.def(
        "transmission_optimum_mu_t",
        [](const py::object& two_theta_deg, const std::string& mode) {
            const PlateMode pm = parse_plate_mode(mode);
            return map_one<1>(std::array<P, 1>{{{two_theta_deg, "two_theta_deg"}}},
                              [&](const std::array<double, 1>& x) { return transmission_optimum_mu_t(pm, x[0]); });
        },
        py::arg("two_theta_deg"), py::arg("mode") = "transmission-normal",
        "Transmission modes: the μt that maximises the diffracted intensity μt·A (symmetric cosθ,\n"
        "normal ln(sec2θ)/(sec2θ − 1)).");
}

}  // namespace mudepth::python
