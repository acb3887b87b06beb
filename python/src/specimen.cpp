// Bindings: specimens, the μR of a capillary and the μt of a plate with the wall or
// window foils, built from a material at an energy or given directly — the sample and
// geometry options of `mudepth cylinder`, `plate` and `correct`. Thin: the library
// (mudepth/specimen.hpp) computes and checks everything.
#include <optional>
#include <string>

#include <pybind11/stl.h>

#include "bindings.hpp"
#include "mudepth/specimen.hpp"

namespace mudepth::python {

namespace {

std::optional<std::string> table_name(const std::optional<CrossSectionTable>& table) {
    if (!table) return std::nullopt;
    return std::string(to_string(*table));
}

std::optional<std::string> nonempty(const std::string& text) {
    if (text.empty()) return std::nullopt;
    return text;
}

/// The properties both specimen types share: where the sample's μ came from. `given` names
/// what is given directly on the other route ("μR", "μt").
template <class Specimen>
void def_source_properties(py::class_<Specimen>& cls, const std::string& given) {
    const std::string when_given = " (None when " + given + " was given directly)";
    cls.def_readonly("sample", &Specimen::sample, ("The material's name, or 'given as " + given + "'.").c_str())
        .def_property_readonly("radiation", [](const Specimen& s) { return nonempty(s.radiation); },
                               "Radiation label; None when nothing needed an energy.")
        .def_readonly("energy_keV", &Specimen::energy_keV, "keV, or None.")
        .def_readonly("mu_per_cm", &Specimen::mu_per_cm, ("The sample's μ, 1/cm" + when_given + ".").c_str())
        .def_readonly("density_g_cm3", &Specimen::density_g_cm3, "Density used (× packing), g/cm³.")
        .def_property_readonly("table", [](const Specimen& s) { return table_name(s.table); },
                               ("'elam' or 'chantler'" + when_given + ".").c_str());
}

}  // namespace

void bind_specimen(py::module_& m) {
    py::class_<CapillaryWall>(m, "CapillaryWall", "The capillary wall around the sample.")
        .def_property_readonly("material", [](const CapillaryWall& w) { return nonempty(w.material); },
                               "The wall material's name; None when given directly.")
        .def_readonly("mu_per_cm", &CapillaryWall::mu_per_cm, "The wall's μ, 1/cm (None when given directly).")
        .def_readonly("thickness_cm", &CapillaryWall::thickness_cm, "Wall thickness, cm (None when given directly).")
        .def_readonly("mu_R", &CapillaryWall::mu_R, "The WALL's μ times the SAMPLE radius (--mu-r-container).")
        .def_readonly("radius_ratio", &CapillaryWall::radius_ratio, "Outer wall radius / sample radius.");

    py::class_<CapillarySpecimen> capillary_class(
        m, "CapillarySpecimen",
        "A capillary filled with the sample: μR and the wall, with what they came from.\n"
        "Build one with capillary(...) or capillary_from_mu_R(...), add the wall with with_wall(...).");
    def_source_properties(capillary_class, "μR");
    capillary_class.def_readonly("inner_diameter_cm", &CapillarySpecimen::inner_diameter_cm, "Inner diameter, cm.")
        .def_readonly("mu_R", &CapillarySpecimen::mu_R, "μ × sample radius (0 < μR <= 30).")
        .def_readonly("wall", &CapillarySpecimen::wall, "CapillaryWall, or None.")
        .def_readonly("warnings", &CapillarySpecimen::warnings, "What the command line prints as warnings.")
        .def(
            "with_wall",
            [](const CapillarySpecimen& c, const Material& wall_material, double wall_thickness_cm) {
                return with_wall(c, wall_material, wall_thickness_cm);
            },
            py::arg("wall_material"), py::arg("wall_thickness_cm"),
            "A copy in a wall of this Material and thickness (cm), at the capillary's energy and table\n"
            "(needs a capillary built from a material). As --container-material M --wall T.")
        .def(
            "with_wall",
            [](const CapillarySpecimen& c, double wall_mu_R, double radius_ratio) {
                return with_wall(c, wall_mu_R, radius_ratio);
            },
            py::arg("wall_mu_R"), py::arg("radius_ratio"),
            "A copy in a wall given directly: the wall's μ × the SAMPLE radius (>= 0) and outer radius /\n"
            "sample radius (> 1). As --mu-r-container X --radius-ratio Y.")
        .def("__repr__", [](const CapillarySpecimen& c) {
            return "CapillarySpecimen('" + c.sample + "', mu_R=" + py::repr(py::float_(c.mu_R)).cast<std::string>() +
                   (c.wall ? ", with wall" : "") + ")";
        });

    m.def(
        "capillary",
        [](const Material& sample, const Radiation& radiation, double inner_diameter_cm, const std::string& table) {
            return capillary_from_material(sample, radiation, inner_diameter_cm, parse_cross_section_table(table));
        },
        py::arg("sample"), py::arg("radiation"), py::arg("inner_diameter_cm"), py::arg("table") = "elam",
        "A capillary of this inner diameter (cm) filled with the sample (Material) under the radiation:\n"
        "μR = μ·d/2. ValueError above μR = 30; a warning above 3. As `mudepth cylinder --formula ...\n"
        "--diameter D`.");
    m.def("capillary_from_mu_R", &capillary_from_mu_R, py::arg("mu_R"),
          "A capillary with μR given directly (0 < μR <= 30). As --mu-r.");

    py::class_<WindowFoils>(m, "WindowFoils",
                            "Window foils: one on each side in transmission, one cover foil in reflection.")
        .def_property_readonly("material", [](const WindowFoils& w) { return nonempty(w.material); },
                               "The foil material's name; None when given directly.")
        .def_readonly("mu_per_cm", &WindowFoils::mu_per_cm, "The foil's μ, 1/cm (None when given directly).")
        .def_readonly("thickness_cm", &WindowFoils::thickness_cm, "Thickness of ONE foil, cm.")
        .def_readonly("mu_t", &WindowFoils::mu_t, "μt of ONE foil.");

    py::class_<PlateSpecimen> plate_class(
        m, "PlateSpecimen",
        "A flat plate of the sample in one mode: μt, the incidence and the window foils, with what they\n"
        "came from. Build one with plate(...) or plate_from_mu_t(...).");
    def_source_properties(plate_class, "μt");
    plate_class.def_readonly("thickness_cm", &PlateSpecimen::thickness_cm, "Plate thickness, cm (None when μt was given).")
        .def_property_readonly("mode", [](const PlateSpecimen& p) { return std::string(to_string(p.mode)); },
                               "'reflection', 'transmission-normal' or 'transmission-symmetric'.")
        .def_readonly("mu_t", &PlateSpecimen::mu_t, "μ × thickness.")
        .def_readonly("incidence_deg", &PlateSpecimen::incidence_deg, "Fixed incidence, degrees; None: symmetric.")
        .def_readonly("window", &PlateSpecimen::window, "WindowFoils, or None.")
        .def("with_incidence", &with_incidence, py::arg("incidence_deg"),
             "A copy at a fixed incidence, degrees (reflection only). As --incidence.")
        .def(
            "with_windows", [](const PlateSpecimen& p, double mu_t_window) { return with_windows(p, mu_t_window); },
            py::arg("mu_t_window"), "A copy with window foils given as the μt of ONE foil. As --mu-t-window.")
        .def(
            "with_windows",
            [](const PlateSpecimen& p, const Material& foil_material, double foil_thickness_cm,
               const Radiation& radiation, const std::string& table) {
                return with_windows(p, foil_material, foil_thickness_cm, radiation, parse_cross_section_table(table));
            },
            py::arg("foil_material"), py::arg("foil_thickness_cm"), py::arg("radiation"), py::arg("table") = "elam",
            "A copy with window foils of this Material, ONE foil's thickness in cm, under the radiation\n"
            "(the plate's own when it has one). As --window-material M --window-thickness T.")
        .def("__repr__", [](const PlateSpecimen& p) {
            return "PlateSpecimen('" + p.sample + "', " + std::string(to_string(p.mode)) +
                   ", mu_t=" + py::repr(py::float_(p.mu_t)).cast<std::string>() + ")";
        });

    m.def(
        "plate",
        [](const Material& sample, const Radiation& radiation, double thickness_cm, const std::string& mode,
           const std::string& table) {
            return plate_from_material(parse_plate_mode(mode), sample, radiation, thickness_cm,
                                       parse_cross_section_table(table));
        },
        py::arg("sample"), py::arg("radiation"), py::arg("thickness_cm"), py::arg("mode") = "reflection",
        py::arg("table") = "elam",
        "A flat plate of the sample (Material), thickness in cm, under the radiation: μt = μ·t. mode\n"
        "'reflection', 'transmission-normal' or 'transmission-symmetric'. As `mudepth plate --formula ...\n"
        "--thickness T --mode M`.");
    m.def(
        "plate_from_mu_t",
        [](double mu_t, const std::string& mode) { return plate_from_mu_t(parse_plate_mode(mode), mu_t); },
        py::arg("mu_t"), py::arg("mode") = "reflection", "A plate with μt given directly (0 < μt <= 1e6). As --mu-t.");
}

}  // namespace mudepth::python
