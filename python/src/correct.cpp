// Bindings: correcting arrays (2θ, intensity, σ) with the geometry options of
// `mudepth correct`, reading pattern files, and correcting files into corrected
// copies exactly as the command writes them. Thin: the factors, σ propagation,
// container subtraction, normalisation, provenance and writing are the library's
// (mudepth/correct.hpp, mudepth/correct_files.hpp).
#include <cmath>
#include <filesystem>
#include <optional>
#include <string>
#include <vector>

#include <pybind11/stl.h>
#include <pybind11/stl/filesystem.h>

#include "arrays.hpp"
#include "bindings.hpp"
#include "mudepth/correct.hpp"
#include "mudepth/correct_files.hpp"
#include "mudepth/error.hpp"
#include "mudepth/pattern.hpp"

namespace mudepth::python {

namespace {

py::array_t<double> to_numpy(const std::vector<double>& v) {
    py::array_t<double> a(static_cast<py::ssize_t>(v.size()));
    std::copy(v.begin(), v.end(), a.mutable_data());
    return a;
}

CorrectionSetup make_setup(const py::object& geometry, std::optional<double> mu_R, std::optional<double> mu_t,
                           std::optional<double> incidence_deg, std::optional<double> mu_t_window,
                           std::optional<double> mu_R_container, std::optional<double> radius_ratio) {
    const bool specimen = py::isinstance<CapillarySpecimen>(geometry) || py::isinstance<PlateSpecimen>(geometry);
    if (specimen) {
        if (mu_R || mu_t || incidence_deg || mu_t_window || mu_R_container || radius_ratio)
            throw InputError("a specimen carries its own μR or μt, incidence, wall and windows; give no other "
                             "geometry arguments with it");
        return py::isinstance<CapillarySpecimen>(geometry) ? correction_setup(geometry.cast<CapillarySpecimen>())
                                                           : correction_setup(geometry.cast<PlateSpecimen>());
    }
    if (!py::isinstance<py::str>(geometry))
        throw py::type_error("geometry: expected 'cylinder', 'reflection', 'transmission-normal', "
                             "'transmission-symmetric', a CapillarySpecimen or a PlateSpecimen");
    CorrectionSetup s;
    s.geometry = parse_correction_geometry(geometry.cast<std::string>());
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

/// One path (str or os.PathLike) or a sequence of them.
std::vector<std::filesystem::path> as_paths(const py::object& paths) {
    if (py::isinstance<py::str>(paths) || py::hasattr(paths, "__fspath__"))
        return {paths.cast<std::filesystem::path>()};
    if (py::isinstance<py::bytes>(paths) || !py::isinstance<py::sequence>(paths))
        throw py::type_error("paths: expected a path (str or os.PathLike) or a list of paths");
    return paths.cast<std::vector<std::filesystem::path>>();
}

/// What the provenance header records as the command: the Python script and its arguments.
std::string python_command() {
    const std::string text = "mudepth.correct_files() in Python";
    const py::module_ sys = py::module_::import("sys");
    if (!py::hasattr(sys, "argv") || !py::isinstance<py::list>(sys.attr("argv"))) return text;  // embedded
    py::list argv;
    for (const py::handle arg : sys.attr("argv").cast<py::list>()) argv.append(py::str(arg));
    const std::string script = argv.size() > 0 ? argv[0].cast<std::string>() : std::string();
    if (script.empty()) return text + ", interactive";
    if (script == "-c") return text + " (python3 -c)";
    return text + ", script: " + py::module_::import("shlex").attr("join")(argv).cast<std::string>();
}

py::dict result_dict(const FileCorrectionResult& r) {
    static const char* const kOutcome[] = {"written", "bad_input", "file_error", "internal_error"};
    py::dict d;
    d["input"] = r.input.string();
    d["output"] = r.output.string();
    d["outcome"] = kOutcome[static_cast<int>(r.outcome)];
    const bool written = r.outcome == FileOutcome::written;
    d["error"] = written ? py::object(py::none()) : py::object(py::str(r.error));
    d["read_summary"] = written ? py::object(py::str(r.read_summary)) : py::object(py::none());
    d["correction_min"] = written ? py::object(py::float_(r.correction_min)) : py::object(py::none());
    d["correction_max"] = written ? py::object(py::float_(r.correction_max)) : py::object(py::none());
    return d;
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
        [](const py::object& two_theta_deg, const py::object& geometry, std::optional<double> mu_R,
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
        "or 'transmission-symmetric' (mu_t; mu_t_window = one window foil's μt); or a CapillarySpecimen or\n"
        "PlateSpecimen (capillary(), plate(), ...), which carries all of these.");

    m.def(
        "correct_pattern",
        [](const py::object& two_theta_deg, const py::object& intensity, const py::object& sigma,
           const py::object& geometry, std::optional<double> mu_R, std::optional<double> mu_t,
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

    m.def(
        "correct_files",
        [](const py::object& paths, const std::filesystem::path& output_dir, const py::object& specimen,
           const std::string& normalization, std::optional<std::filesystem::path> empty, double empty_scale,
           bool force, std::optional<std::size_t> jobs, std::optional<std::string> command, bool raise_on_error) {
            FileCorrectionSettings settings;
            if (py::isinstance<CapillarySpecimen>(specimen)) {
                settings = file_correction_settings(specimen.cast<CapillarySpecimen>());
            } else if (py::isinstance<PlateSpecimen>(specimen)) {
                settings = file_correction_settings(specimen.cast<PlateSpecimen>());
            } else {
                throw py::type_error("specimen: expected a CapillarySpecimen or a PlateSpecimen (capillary(), "
                                     "capillary_from_mu_R(), plate(), plate_from_mu_t())");
            }
            settings.normalization = parse_normalization(normalization);
            settings.empty_file = empty;
            settings.empty_scale = empty_scale;
            settings.command = command ? *command : python_command();
            settings.replace_existing = force;
            settings.replace_hint = "give force=True to replace it";
            settings.jobs = jobs.value_or(0);
            const std::vector<std::filesystem::path> inputs = as_paths(paths);
            std::vector<FileCorrectionResult> results;
            {
                py::gil_scoped_release release;
                results = correct_pattern_files(inputs, output_dir, settings);
            }
            py::list out;
            for (const auto& r : results) out.append(result_dict(r));
            if (raise_on_error) {
                try {
                    throw_failures(results, output_dir);
                } catch (const Error& e) {
                    // The command line's message; every file's result rides along on the exception.
                    const bool file = dynamic_cast<const FileError*>(&e) != nullptr;
                    const py::object type = py::module_::import("mudepth").attr(file ? "FileError" : "InputError");
                    const py::object error = type(e.what());
                    error.attr("results") = out;
                    PyErr_SetObject(type.ptr(), error.ptr());
                    throw py::error_already_set();
                }
            }
            return out;
        },
        py::arg("paths"), py::kw_only(), py::arg("output_dir"), py::arg("specimen"), py::arg("normalization") = "none",
        py::arg("empty") = py::none(), py::arg("empty_scale") = 1.0, py::arg("force") = false,
        py::arg("jobs") = py::none(), py::arg("command") = py::none(), py::arg("raise_on_error") = true,
        "Corrects pattern files (plain-text columns or pdCIF; one path or a list) into\n"
        "output_dir/<stem>.corrected.<ext>, as `mudepth correct FILE... --output-dir DIR` does: the same\n"
        "columns, the same provenance header (its 'command:' line names this script, or `command`), written\n"
        "atomically, never over an input, files in parallel (jobs; default one per core).\n"
        "specimen: a CapillarySpecimen (geometry cylinder, with its wall) or a PlateSpecimen (its mode,\n"
        "incidence and windows). normalization 'none', 'max' or 'at:2THETA'. empty: the empty-container\n"
        "file (a capillary with its wall), scaled by empty_scale. force=True replaces existing outputs.\n"
        "Returns one dict per input: 'input', 'output', 'outcome' ('written', 'bad_input', 'file_error',\n"
        "'internal_error'), 'error', 'read_summary', 'correction_min', 'correction_max'. When a file fails\n"
        "(and raise_on_error) the others are still written, then InputError or FileError is raised with the\n"
        "command line's message and the list as its `results` attribute.");
}

}  // namespace mudepth::python
