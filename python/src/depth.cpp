// Bindings: depth probed in reflection for every geometry of `mudepth depth`
// (symmetric, fixed incidence, side inclination, ω-tilt, with refraction when the
// sample has optics), the inverse (angle for a target depth) and the transparency shift.
#include <cmath>
#include <limits>
#include <optional>
#include <string>

#include <pybind11/stl.h>

#include "arrays.hpp"
#include "bindings.hpp"
#include "mudepth/attenuation.hpp"
#include "mudepth/depth.hpp"
#include "mudepth/error.hpp"
#include "mudepth/radiation.hpp"
#include "mudepth/refraction.hpp"

namespace mudepth::python {

namespace {

using A1 = std::array<double, 1>;
using A2 = std::array<double, 2>;
using A3 = std::array<double, 3>;
constexpr double kNaN = std::numeric_limits<double>::quiet_NaN();

TiltMode parse_tilt_mode(const std::string& mode) {
    if (mode == "side") return TiltMode::side_inclination;
    if (mode == "omega") return TiltMode::omega;
    throw InputError("tilt_mode: '" + mode + "' is not side or omega");
}

BeamAngles tilt_angles(TiltMode mode, double two_theta_deg, double psi_deg) {
    return mode == TiltMode::omega ? omega_tilt_angles(two_theta_deg, psi_deg)
                                   : side_inclination_angles(two_theta_deg, psi_deg);
}

/// The sample `mudepth depth --formula/--material ...` uses: μ from the table, δ and β (refraction).
DepthSample sample_of(const Material& material, double energy_keV, const std::string& table, bool with_refraction) {
    const auto t = parse_cross_section_table(table);
    check_energy_keV(energy_keV);
    const double mu = attenuation(material, energy_keV, t).mu_per_cm;
    if (!with_refraction) return geometric_sample(mu);
    const Refraction r = refraction(material, energy_keV, mu);
    DepthSample s = refracting_sample(r.delta, r.beta, wavelength_A_from_energy_keV(energy_keV));
    s.mu_per_cm = mu;  // the same μ, not its round trip through β
    return s;
}

py::dict angles_dict(const std::array<py::object, 2>& out) { return to_dict<2>({"incidence_deg", "exit_deg"}, out); }

}  // namespace

void bind_depth(py::module_& m) {
    py::class_<OpticalConstants>(m, "OpticalConstants", "n = 1 − δ − iβ and the wavelength (Å) it holds for.")
        .def_readonly("delta", &OpticalConstants::delta)
        .def_readonly("beta", &OpticalConstants::beta)
        .def_readonly("wavelength_A", &OpticalConstants::wavelength_A);
    py::class_<DepthSample>(m, "DepthSample",
                            "The sample as the depth functions see it: μ (1/cm) and, when known, its optical\n"
                            "constants; with optics every depth includes refraction (Parratt 1954).")
        .def_readonly("mu_per_cm", &DepthSample::mu_per_cm)
        .def_readonly("optics", &DepthSample::optics, "OpticalConstants or None (geometric).")
        .def_property_readonly("refraction_applied", [](const DepthSample& s) { return s.optics.has_value(); })
        .def("__repr__", [](const DepthSample& s) {
            return "DepthSample(mu_per_cm=" + py::repr(py::float_(s.mu_per_cm)).cast<std::string>() +
                   (s.optics ? ", refracting)" : ", geometric)");
        });
    m.def("geometric_sample", &geometric_sample, py::arg("mu_per_cm"),
          "A sample known only by μ (1/cm): geometric depths, no refraction (the command line's --mu).");
    m.def("refracting_sample", &refracting_sample, py::arg("delta"), py::arg("beta"), py::arg("wavelength_A"),
          "A refracting sample from δ, β and the wavelength in Å; μ = 4πβ/λ.");
    m.def("depth_sample", &sample_of, py::arg("material"), py::arg("energy_keV"), py::arg("table") = "elam",
          py::arg("refraction") = true,
          "The sample of `mudepth depth --formula/--material ... --energy E`: μ of the material at\n"
          "energy_keV from `table`, with δ and β (refraction) unless refraction=False.");

    // ---- beam angles ----
    m.def(
        "symmetric_angles",
        [](const py::object& two_theta_deg) {
            return angles_dict(map_elements<2>(std::array<std::pair<py::handle, const char*>, 1>{{{two_theta_deg, "two_theta_deg"}}},
                                               [](const A1& x, A2& y) {
                                                   const BeamAngles b = symmetric_angles(x[0]);
                                                   y = {b.incidence_deg, b.exit_deg};
                                               }));
        },
        py::arg("two_theta_deg"), "Symmetric reflection: incidence = exit = θ. Dict of 'incidence_deg', 'exit_deg'.");
    m.def(
        "fixed_incidence_angles",
        [](const py::object& two_theta_deg, const py::object& incidence_deg) {
            return angles_dict(map_elements<2>(
                std::array<std::pair<py::handle, const char*>, 2>{{{two_theta_deg, "two_theta_deg"}, {incidence_deg, "incidence_deg"}}},
                [](const A2& x, A2& y) {
                    const BeamAngles b = fixed_incidence_angles(x[0], x[1]);
                    y = {b.incidence_deg, b.exit_deg};
                }));
        },
        py::arg("two_theta_deg"), py::arg("incidence_deg"), "Fixed incidence α (degrees): exit 2θ − α; 0 < α < 2θ.");
    m.def(
        "tilt_angles",
        [](const py::object& two_theta_deg, const py::object& tilt_deg, const std::string& tilt_mode) {
            const TiltMode mode = parse_tilt_mode(tilt_mode);
            return angles_dict(map_elements<2>(
                std::array<std::pair<py::handle, const char*>, 2>{{{two_theta_deg, "two_theta_deg"}, {tilt_deg, "tilt_deg"}}},
                [&](const A2& x, A2& y) {
                    const BeamAngles b = tilt_angles(mode, x[0], x[1]);
                    y = {b.incidence_deg, b.exit_deg};
                }));
        },
        py::arg("two_theta_deg"), py::arg("tilt_deg"), py::arg("tilt_mode") = "side",
        "Tilted specimen, degrees: 'side' inclination (χ, both beams at asin(sinθ cosψ)) or 'omega'\n"
        "(incidence θ − ψ, exit θ + ψ).");

    // ---- the depth command ----
    m.def(
        "depth",
        [](const DepthSample& sample, const py::object& two_theta_deg, const py::object& incidence_deg,
           const py::object& tilt_deg, const std::string& tilt_mode, double fraction,
           std::optional<double> thickness_cm, std::optional<double> goniometer_radius_cm) {
            const TiltMode mode = parse_tilt_mode(tilt_mode);
            const bool by_incidence = !incidence_deg.is_none(), by_tilt = !tilt_deg.is_none();
            if (by_incidence && by_tilt) throw InputError("give either incidence_deg or tilt_deg, not both");
            if (goniometer_radius_cm && (by_incidence || by_tilt))
                throw InputError("goniometer_radius_cm gives the transparency shift of symmetric (Bragg-Brentano) "
                                 "reflection; leave out incidence_deg and tilt_deg");
            const py::object& second = by_incidence ? incidence_deg : tilt_deg;
            auto out = map_elements<5>(
                std::array<std::pair<py::handle, const char*>, 2>{
                    {{two_theta_deg, "two_theta_deg"}, {or_zero(second), by_incidence ? "incidence_deg" : "tilt_deg"}}},
                [&](const A2& x, std::array<double, 5>& y) {
                    const BeamAngles b = by_incidence ? fixed_incidence_angles(x[0], x[1])
                                         : by_tilt    ? tilt_angles(mode, x[0], x[1])
                                                      : symmetric_angles(x[0]);
                    const double d1 = depth_1e_um(sample, b);
                    y = {b.incidence_deg, b.exit_deg, d1, depth_holding_fraction_um(d1, fraction, thickness_cm),
                         goniometer_radius_cm
                             ? transparency_shift_deg(sample.mu_per_cm, x[0], *goniometer_radius_cm, thickness_cm)
                             : kNaN};
                });
            py::dict d = to_dict<4>({"incidence_deg", "exit_deg", "depth_1e_um", "depth_fraction_um"},
                                    {out[0], out[1], out[2], out[3]});
            if (goniometer_radius_cm) d["peak_shift_deg"] = out[4];
            return d;
        },
        py::arg("sample"), py::arg("two_theta_deg"), py::kw_only(), py::arg("incidence_deg") = py::none(),
        py::arg("tilt_deg") = py::none(), py::arg("tilt_mode") = "side", py::arg("fraction") = 0.9,
        py::arg("thickness_cm") = py::none(), py::arg("goniometer_radius_cm") = py::none(),
        "Depth probed, as `mudepth depth`: symmetric reflection by default, fixed incidence with\n"
        "incidence_deg, a tilted specimen with tilt_deg and tilt_mode 'side' or 'omega' (degrees;\n"
        "two_theta_deg and the second angle broadcast). Returns a dict of arrays: 'incidence_deg',\n"
        "'exit_deg', 'depth_1e_um' (1/e depth of the signal, in plus out, µm), 'depth_fraction_um' (depth\n"
        "above which `fraction` of the signal comes, of a layer thickness_cm thick when given, µm) and,\n"
        "with goniometer_radius_cm (symmetric only), 'peak_shift_deg' (transparency shift of the centroid, °2θ).");

    m.def(
        "angle_for_depth",
        [](const DepthSample& sample, const py::object& two_theta_deg, const py::object& target_depth_um,
           std::optional<std::string> tilt_mode, double fraction, std::optional<double> thickness_cm) {
            const bool by_tilt = tilt_mode.has_value();
            const TiltMode mode = by_tilt ? parse_tilt_mode(*tilt_mode) : TiltMode::side_inclination;
            auto out = map_elements<8>(
                std::array<std::pair<py::handle, const char*>, 2>{
                    {{two_theta_deg, "two_theta_deg"}, {target_depth_um, "target_depth_um"}}},
                [&](const A2& x, std::array<double, 8>& y) {
                    symmetric_angles(x[0]);  // checks 2θ as the command does
                    const AngleForDepth s = by_tilt ? tilt_for_depth(sample, mode, x[0], x[1])
                                                 : incidence_for_depth(sample, x[0], x[1]);
                    y.fill(kNaN);
                    y[0] = s.reachable ? 1.0 : 0.0;
                    if (s.reachable) {
                        const double d1 = depth_1e_um(sample, s.angles);
                        y[1] = s.angles.incidence_deg;
                        y[2] = s.angles.exit_deg;
                        y[3] = s.angle_deg;
                        y[4] = d1;
                        y[5] = depth_holding_fraction_um(d1, fraction, thickness_cm);
                    }
                    y[6] = s.min_depth_um;
                    y[7] = s.max_depth_um;
                });
            py::dict d;
            d["reachable"] = py::module_::import("numpy").attr("asarray")(out[0]).attr("astype")("bool");
            if (py::isinstance<py::float_>(out[0])) d["reachable"] = py::bool_(out[0].cast<double>() != 0);
            d["incidence_deg"] = out[1];
            d["exit_deg"] = out[2];
            if (by_tilt) d["tilt_deg"] = out[3];
            d["depth_1e_um"] = out[4];
            d["depth_fraction_um"] = out[5];
            d["min_depth_um"] = out[6];
            d["max_depth_um"] = out[7];
            return d;
        },
        py::arg("sample"), py::arg("two_theta_deg"), py::arg("target_depth_um"), py::kw_only(),
        py::arg("tilt_mode") = py::none(), py::arg("fraction") = 0.9, py::arg("thickness_cm") = py::none(),
        "The inverse, as `mudepth depth --target-depth`: per 2θ (degrees) the incidence α ≤ θ (or, with\n"
        "tilt_mode 'side'/'omega', the tilt ψ ≥ 0) whose 1/e depth is target_depth_um (µm). Dict of arrays:\n"
        "'reachable' (bool), 'incidence_deg', 'exit_deg', ('tilt_deg'), 'depth_1e_um', 'depth_fraction_um'\n"
        "(NaN where unreachable), 'min_depth_um' and 'max_depth_um' (the range this 2θ can reach).");

    // ---- closed forms and single-beam depths, vectorised ----
    using P = std::pair<py::handle, const char*>;
    m.def(
        "symmetric_depth_1e_um",
        [](const py::object& mu, const py::object& tt) {
            return map_one<2>(std::array<P, 2>{{{mu, "mu_per_cm"}, {tt, "two_theta_deg"}}},
                              [](const A2& x) { return symmetric_depth_1e_um(x[0], x[1]); });
        },
        py::arg("mu_per_cm"), py::arg("two_theta_deg"), "1/e depth of symmetric reflection sinθ/(2μ), µm.");
    m.def(
        "fraction_depth_um",
        [](const py::object& mu, const py::object& tt, double fraction) {
            return map_one<2>(std::array<P, 2>{{{mu, "mu_per_cm"}, {tt, "two_theta_deg"}}},
                              [&](const A2& x) { return fraction_depth_um(x[0], x[1], fraction); });
        },
        py::arg("mu_per_cm"), py::arg("two_theta_deg"), py::arg("fraction"),
        "Symmetric reflection: depth holding `fraction` of a thick sample's signal, ln(1/(1−G)) sinθ/(2μ), µm.");
    m.def(
        "fixed_incidence_depth_1e_um",
        [](const py::object& mu, const py::object& tt, const py::object& inc) {
            return map_one<3>(std::array<P, 3>{{{mu, "mu_per_cm"}, {tt, "two_theta_deg"}, {inc, "incidence_deg"}}},
                              [](const A3& x) { return fixed_incidence_depth_1e_um(x[0], x[1], x[2]); });
        },
        py::arg("mu_per_cm"), py::arg("two_theta_deg"), py::arg("incidence_deg"),
        "1/e depth at fixed incidence α, 1/(μ(1/sinα + 1/sin(2θ−α))), µm (no refraction).");
    m.def(
        "side_inclination_depth_1e_um",
        [](const py::object& mu, const py::object& tt, const py::object& psi) {
            return map_one<3>(std::array<P, 3>{{{mu, "mu_per_cm"}, {tt, "two_theta_deg"}, {psi, "psi_deg"}}},
                              [](const A3& x) { return side_inclination_depth_1e_um(x[0], x[1], x[2]); });
        },
        py::arg("mu_per_cm"), py::arg("two_theta_deg"), py::arg("psi_deg"),
        "Side inclination by ψ: sinθ cosψ/(2μ), µm.");
    m.def(
        "omega_tilt_depth_1e_um",
        [](const py::object& mu, const py::object& tt, const py::object& psi) {
            return map_one<3>(std::array<P, 3>{{{mu, "mu_per_cm"}, {tt, "two_theta_deg"}, {psi, "psi_deg"}}},
                              [](const A3& x) { return omega_tilt_depth_1e_um(x[0], x[1], x[2]); });
        },
        py::arg("mu_per_cm"), py::arg("two_theta_deg"), py::arg("psi_deg"),
        "ω-tilt by ψ: (sin²θ − sin²ψ)/(2μ sinθ cosψ), µm.");
    m.def(
        "critical_angle_deg",
        [](const py::object& delta) {
            return map_one<1>(std::array<P, 1>{{{delta, "delta"}}}, [](const A1& x) { return critical_angle_deg(x[0]); });
        },
        py::arg("delta"), "Critical angle of total external reflection √(2δ), degrees.");
    m.def(
        "beam_depth_1e_um",
        [](double delta, double beta, double wavelength_A, const py::object& angle_deg) {
            return map_one<1>(std::array<P, 1>{{{angle_deg, "angle_deg"}}},
                              [&](const A1& x) { return beam_depth_1e_um(delta, beta, wavelength_A, x[0]); });
        },
        py::arg("delta"), py::arg("beta"), py::arg("wavelength_A"), py::arg("angle_deg"),
        "One beam's 1/e intensity depth with refraction, 1/(2k Im q), q = √(sin²α − 2δ + 2iβ), µm\n"
        "(Parratt 1954); angle from the surface in degrees (0: the evanescent limit).");
    m.def(
        "grazing_depth_1e_um",
        [](double delta, double beta, double wavelength_A, const py::object& tt, const py::object& inc) {
            return map_one<2>(std::array<P, 2>{{{tt, "two_theta_deg"}, {inc, "incidence_deg"}}}, [&](const A2& x) {
                return grazing_depth_1e_um(delta, beta, wavelength_A, x[0], x[1]);
            });
        },
        py::arg("delta"), py::arg("beta"), py::arg("wavelength_A"), py::arg("two_theta_deg"), py::arg("incidence_deg"),
        "Grazing incidence with refraction: 1/Λ = 1/Λ(α) + 1/Λ(2θ − α), µm.");
    m.def(
        "depth_holding_fraction_um",
        [](const py::object& d1, double fraction, std::optional<double> thickness_cm) {
            return map_one<1>(std::array<P, 1>{{{d1, "depth_1e_um"}}},
                              [&](const A1& x) { return depth_holding_fraction_um(x[0], fraction, thickness_cm); });
        },
        py::arg("depth_1e_um"), py::arg("fraction"), py::arg("thickness_cm") = py::none(),
        "Depth above which `fraction` of a signal decaying as exp(−z/Λ) comes, Λ ln(1/(1−G)); for a layer\n"
        "thickness_cm thick −Λ ln(1 − G(1 − e^(−t/Λ))). µm.");
    m.def(
        "diffracting_centroid_depth_um",
        [](const py::object& mu, const py::object& tt, std::optional<double> thickness_cm) {
            return map_one<2>(std::array<P, 2>{{{mu, "mu_per_cm"}, {tt, "two_theta_deg"}}},
                              [&](const A2& x) { return diffracting_centroid_depth_um(x[0], x[1], thickness_cm); });
        },
        py::arg("mu_per_cm"), py::arg("two_theta_deg"), py::arg("thickness_cm") = py::none(),
        "Centroid depth of the diffracting volume in symmetric reflection, µm.");
    m.def(
        "transparency_shift_deg",
        [](const py::object& mu, const py::object& tt, double radius_cm, std::optional<double> thickness_cm) {
            return map_one<2>(std::array<P, 2>{{{mu, "mu_per_cm"}, {tt, "two_theta_deg"}}}, [&](const A2& x) {
                return transparency_shift_deg(x[0], x[1], radius_cm, thickness_cm);
            });
        },
        py::arg("mu_per_cm"), py::arg("two_theta_deg"), py::arg("goniometer_radius_cm"),
        py::arg("thickness_cm") = py::none(),
        "Transparency shift of the peak centroid in Bragg-Brentano geometry, degrees 2θ (negative: to\n"
        "lower angle): −sin2θ/(2μR) thick, the finite-layer form with thickness_cm.");
}

}  // namespace mudepth::python
