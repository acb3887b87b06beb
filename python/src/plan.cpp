// Bindings: sample planning (capillary, dilution, plate, anode), as `mudepth plan`.
#include <string>

#include <pybind11/stl.h>

#include "bindings.hpp"
#include "mudepth/plan.hpp"

namespace mudepth::python {

void bind_plan(py::module_& m) {
    m.attr("STANDARD_CAPILLARY_DIAMETERS_MM") = py::cast(std::vector<double>(
        kStandardCapillaryDiameters_mm.begin(), kStandardCapillaryDiameters_mm.end()));
    py::class_<CapillaryRow>(m, "CapillaryRow", "One standard capillary for the sample.")
        .def_readonly("diameter_cm", &CapillaryRow::diameter_cm)
        .def_readonly("mu_R", &CapillaryRow::mu_R)
        .def_readonly("correction_at_10_deg", &CapillaryRow::correction_at_10_deg, "A* at 2θ = 10°; None above μR 30.")
        .def_readonly("correction_at_150_deg", &CapillaryRow::correction_at_150_deg, "A* at 2θ = 150°.")
        .def_readonly("central_ray_transmission", &CapillaryRow::central_ray_transmission, "exp(−2μR).");
    py::class_<Dilution>(m, "Dilution", "How much to dilute for the target μR.")
        .def_readonly("diluent", &Dilution::diluent)
        .def_readonly("diameter_cm", &Dilution::diameter_cm)
        .def_readonly("sample_weight_fraction", &Dilution::sample_weight_fraction)
        .def_readonly("mixture_mu_per_cm", &Dilution::mixture_mu_per_cm)
        .def_readonly("mu_R", &Dilution::mu_R);
    py::class_<CapillaryPlan>(m, "CapillaryPlan", "The capillary table and the recommendation.")
        .def_readonly("target_mu_R", &CapillaryPlan::target_mu_R)
        .def_readonly("rows", &CapillaryPlan::rows)
        .def_readonly("recommended_diameter_cm", &CapillaryPlan::recommended_diameter_cm)
        .def_readonly("smallest_exceeds_target", &CapillaryPlan::smallest_exceeds_target)
        .def_readonly("dilution", &CapillaryPlan::dilution, "A Dilution or None.")
        .def_readonly("dilution_note", &CapillaryPlan::dilution_note);
    py::class_<PlatePlan>(m, "PlatePlan", "Plate thicknesses and the powder mass for a holder.")
        .def_readonly("two_theta_max_deg", &PlatePlan::two_theta_max_deg)
        .def_readonly("infinite_99_cm", &PlatePlan::infinite_99_cm)
        .def_readonly("infinite_999_cm", &PlatePlan::infinite_999_cm)
        .def_readonly("transmission_optimum_cm", &PlatePlan::transmission_optimum_cm)
        .def_readonly("holder_area_cm2", &PlatePlan::holder_area_cm2)
        .def_readonly("holder_depth_cm", &PlatePlan::holder_depth_cm)
        .def_readonly("powder_mass_g", &PlatePlan::powder_mass_g);
    py::class_<SourceRow>(m, "SourceRow", "The sample under one standard anode's Kα.")
        .def_readonly("anode", &SourceRow::anode)
        .def_readonly("energy_keV", &SourceRow::energy_keV)
        .def_readonly("mu_per_cm", &SourceRow::mu_per_cm)
        .def_readonly("depth_1e_at_30_deg_um", &SourceRow::depth_1e_at_30_deg_um)
        .def_readonly("depth_1e_at_90_deg_um", &SourceRow::depth_1e_at_90_deg_um)
        .def_readonly("recommended_diameter_cm", &SourceRow::recommended_diameter_cm)
        .def_readonly("smallest_exceeds_target", &SourceRow::smallest_exceeds_target)
        .def_readonly("fluorescence", &SourceRow::fluorescence);

    m.def(
        "dilution_weight_fraction",
        [](const Material& sample, const Material& diluent, double energy_keV, double target_mu_per_cm,
           const std::string& table) {
            return dilution_weight_fraction(sample, diluent, energy_keV, target_mu_per_cm,
                                            parse_cross_section_table(table));
        },
        py::arg("sample"), py::arg("diluent"), py::arg("energy_keV"), py::arg("target_mu_per_cm"),
        py::arg("table") = "elam", "Weight fraction of sample in a mixture with the diluent whose μ is the target (1/cm).");
    m.def(
        "plan_capillaries",
        [](const Material& sample, double energy_keV, double target_mu_R, const Material& diluent,
           double dilution_diameter_cm, const std::string& table) {
            return plan_capillaries(sample, energy_keV, target_mu_R, diluent, dilution_diameter_cm,
                                    parse_cross_section_table(table));
        },
        py::arg("sample"), py::arg("energy_keV"), py::arg("target_mu_R"), py::arg("diluent"),
        py::arg("dilution_diameter_cm"), py::arg("table") = "elam",
        "The capillary table (standard diameters), the largest with μR <= target and, when even 0.1 mm is\n"
        "too large, the dilution for a capillary of dilution_diameter_cm (cm).");
    m.def("plan_plate", &plan_plate, py::arg("sample"), py::arg("mu_per_cm"), py::arg("two_theta_max_deg"),
          py::arg("holder_area_cm2"), py::arg("holder_depth_cm"),
          "Reflection plate thicknesses for 99% and 99.9% of an infinitely thick sample's intensity at\n"
          "2θ max, the transmission optimum, and the powder mass for the holder (cm², cm).");
    m.def(
        "plan_sources",
        [](const Material& sample, double target_mu_R, const std::string& table) {
            return plan_sources(sample, target_mu_R, parse_cross_section_table(table));
        },
        py::arg("sample"), py::arg("target_mu_R") = 1.0, py::arg("table") = "elam",
        "One SourceRow per standard anode (Cr, Fe, Co, Cu, Mo, Ag), Kα.");
}

}  // namespace mudepth::python
