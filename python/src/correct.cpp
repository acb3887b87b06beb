// Bindings: correcting arrays (2θ, intensity, σ) with the geometry options of
// `mudepth correct`, and reading pattern files. Thin: the factors, σ propagation,
// container subtraction and normalisation are the library's (mudepth/correct.hpp).
//
// Not bound yet: writing corrected files (the command's provenance lines and output
// naming are still being written with the `correct` command). Read a file with
// read_pattern(), correct its arrays with correct_pattern(), write them as you like.
#include <cmath>
#include <optional>
#include <string>
#include <vector>

#include <pybind11/stl.h>
#include <pybind11/stl/filesystem.h>

#include "arrays.hpp"
#include "bindings.hpp"
#include "mudepth/correct.hpp"
#include "mudepth/error.hpp"
#include "mudepth/pattern.hpp"

namespace mudepth::python {

namespace {

py::array_t<double> to_numpy(const std::vector<double>& v) {
    py::array_t<double> a(static_cast<py::ssize_t>(v.size()));
    std::copy(v.begin(), v.end(), a.mutable_data());
    return a;
}

CorrectionSetup make_setup(const std::string& geometry, std::optional<double> mu_R, std::optional<double> mu_t,
                           std::optional<double> incidence_deg, std::optional<double> mu_t_window,
                           std::optional<double> mu_R_container, std::optional<double> radius_ratio) {
    CorrectionSetup s;
    s.geometry = parse_correction_geometry(geometry);
    const bool cylinder = s.geometry == CorrectionGeometry::cylinder;
    if (cylinder) {
        if (!mu_R) throw InputError("the cylinder geometry needs mu_R (μ × sample radius)");
        if (mu_t || incidence_deg || mu_t_window)
            throw InputError("mu_t, incidence_deg and mu_t_window are for the plate geometries, not cylinder");
        if (mu_R_container.has_value() != radius_ratio.has_value())
            throw InputError("a container wall needs both mu_R_container and radius_ratio");
        s.mu_R = *mu_R;
        if (mu_R_container) s.wall = CorrectionSetup::Wall{*mu_R_container, *radius_ratio};
    } else {
        if (!mu_t) throw InputError("the plate geometries need mu_t (μ × thickness)");
        if (mu_R || mu_R_container || radius_ratio)
            throw InputError("mu_R, mu_R_container and radius_ratio are for the cylinder geometry");
        s.mu_t = *mu_t;
        s.incidence_deg = incidence_deg;
        s.mu_t_window = mu_t_window;
    }
    return s;
}

/// A Pattern from arrays, checked as the file readers check theirs (same lengths, finite,
/// 2θ increasing within [0, 180), σ >= 0).
Pattern make_pattern(const std::string& name, const py::object& two_theta_deg, const py::object& intensity,
                     const py::object& sigma) {
    Pattern p;
    p.name = name;
    const Flat tt = flatten(two_theta_deg, "two_theta_deg");
    const Flat in = flatten(intensity, "intensity");
    p.two_theta_deg.assign(tt.values.begin(), tt.values.end());
    p.intensity.assign(in.values.begin(), in.values.end());
    if (!sigma.is_none()) {
        const Flat s = flatten(sigma, "sigma");
        p.sigma.assign(s.values.begin(), s.values.end());
    }
    const std::size_t n = p.two_theta_deg.size();
    if (n == 0) throw InputError(name + ": no points");
    if (p.intensity.size() != n || (p.has_sigma() && p.sigma.size() != n))
        throw InputError(name + ": two_theta_deg, intensity and sigma must have the same length");
    for (std::size_t i = 0; i < n; ++i) {
        p.line.push_back(i + 1);
        const std::string at = name + ": point " + std::to_string(i) + ": ";
        if (!std::isfinite(p.two_theta_deg[i]) || !std::isfinite(p.intensity[i]) ||
            (p.has_sigma() && !std::isfinite(p.sigma[i])))
            throw InputError(at + "not a finite number");
        if (p.two_theta_deg[i] < 0 || p.two_theta_deg[i] >= 180) throw InputError(at + "2θ outside [0, 180)");
        if (i > 0 && !(p.two_theta_deg[i] > p.two_theta_deg[i - 1])) throw InputError(at + "2θ is not increasing");
        if (p.has_sigma() && p.sigma[i] < 0) throw InputError(at + "σ is negative");
    }
    return p;
}

}  // namespace

void bind_correct(py::module_& m) {
    m.def(
        "correction_factors",
        [](const py::object& two_theta_deg, const std::string& geometry, std::optional<double> mu_R,
           std::optional<double> mu_t, std::optional<double> incidence_deg, std::optional<double> mu_t_window,
           std::optional<double> mu_R_container, std::optional<double> radius_ratio) {
            const CorrectionSetup s =
                make_setup(geometry, mu_R, mu_t, incidence_deg, mu_t_window, mu_R_container, radius_ratio);
            const Flat tt = flatten(two_theta_deg, "two_theta_deg");
            std::vector<double> f;
            {
                py::gil_scoped_release release;
                f = correction_factors(s, tt.values);
            }
            return from_vector(f, tt.shape, tt.scalar);
        },
        py::arg("two_theta_deg"), py::arg("geometry"), py::kw_only(), py::arg("mu_R") = py::none(),
        py::arg("mu_t") = py::none(), py::arg("incidence_deg") = py::none(), py::arg("mu_t_window") = py::none(),
        py::arg("mu_R_container") = py::none(), py::arg("radius_ratio") = py::none(),
        "The factor that multiplies the measured intensity at each 2θ (degrees), the `correction` of\n"
        "`mudepth cylinder` / `mudepth plate`: geometry 'cylinder' (mu_R; with mu_R_container and\n"
        "radius_ratio the wall, factor 1/A_s,sc), 'reflection' (mu_t, incidence_deg), 'transmission-normal'\n"
        "or 'transmission-symmetric' (mu_t; mu_t_window = one window foil's μt).");

    m.def(
        "correct_pattern",
        [](const py::object& two_theta_deg, const py::object& intensity, const py::object& sigma,
           const std::string& geometry, std::optional<double> mu_R, std::optional<double> mu_t,
           std::optional<double> incidence_deg, std::optional<double> mu_t_window,
           std::optional<double> mu_R_container, std::optional<double> radius_ratio, const std::string& normalization,
           const py::object& empty, double empty_scale) {
            const CorrectionSetup s =
                make_setup(geometry, mu_R, mu_t, incidence_deg, mu_t_window, mu_R_container, radius_ratio);
            const Pattern p = make_pattern("pattern", two_theta_deg, intensity, sigma);
            CorrectionOptions o;
            o.normalization = parse_normalization(normalization);
            o.empty_scale = empty_scale;
            std::optional<Pattern> e;
            if (!empty.is_none()) {
                const auto t = empty.cast<py::tuple>();
                if (t.size() != 2 && t.size() != 3)
                    throw py::type_error("empty: expected (two_theta_deg, intensity) or (two_theta_deg, intensity, sigma)");
                e = make_pattern("empty container", t[0], t[1], t.size() == 3 ? py::object(t[2]) : py::object(py::none()));
                o.empty = &*e;
            }
            CorrectedPattern c;
            {
                py::gil_scoped_release release;
                c = correct_pattern(p, s, o);
            }
            py::dict d;
            d["intensity"] = to_numpy(c.intensity);
            d["sigma"] = p.has_sigma() ? py::object(to_numpy(c.sigma)) : py::object(py::none());
            d["correction"] = to_numpy(c.correction);
            d["subtracted"] = e ? py::object(to_numpy(c.subtracted)) : py::object(py::none());
            d["normalization_divisor"] = c.normalization_divisor;
            d["notes"] = c.notes;
            return d;
        },
        py::arg("two_theta_deg"), py::arg("intensity"), py::arg("sigma") = py::none(), py::kw_only(),
        py::arg("geometry"), py::arg("mu_R") = py::none(), py::arg("mu_t") = py::none(),
        py::arg("incidence_deg") = py::none(), py::arg("mu_t_window") = py::none(),
        py::arg("mu_R_container") = py::none(), py::arg("radius_ratio") = py::none(),
        py::arg("normalization") = "none", py::arg("empty") = py::none(), py::arg("empty_scale") = 1.0,
        "Corrects a pattern given as arrays (2θ in degrees, strictly increasing; intensity; σ or None):\n"
        "I' = I × factor, σ' = σ × factor, or with empty=(2θ, I_c[, σ_c]) of the empty container (cylinder\n"
        "with its wall) the Paalman & Pings subtraction with I_c interpolated onto the sample's 2θ and\n"
        "scaled by empty_scale; then normalization 'none', 'max' or 'at:2THETA'. Geometry arguments as\n"
        "correction_factors(). Dict: 'intensity', 'sigma', 'correction', 'subtracted', 'normalization_divisor',\n"
        "'notes'.");

    m.def(
        "read_pattern",
        [](const std::filesystem::path& path) {
            const Pattern p = read_pattern(path);
            py::dict d;
            d["name"] = p.name;
            d["format"] = p.format == PatternFormat::cif ? "cif" : "text";
            d["two_theta_deg"] = to_numpy(p.two_theta_deg);
            d["intensity"] = to_numpy(p.intensity);
            d["sigma"] = p.has_sigma() ? py::object(to_numpy(p.sigma)) : py::object(py::none());
            return d;
        },
        py::arg("path"),
        "Reads a measured pattern: plain-text columns (2θ in degrees, intensity, optional σ) or pdCIF.\n"
        "Dict 'name', 'format', 'two_theta_deg', 'intensity', 'sigma' (None when the file has none).\n"
        "OSError when the file cannot be read, ValueError 'NAME:LINE: what' when it is malformed.");
}

}  // namespace mudepth::python
