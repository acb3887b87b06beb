// `mudepth correct`: absorption-corrected copies of measured patterns (plain
// text or pdCIF), one or many files, in parallel, with the container subtraction.
#include <unistd.h>

#include <filesystem>
#include <fstream>
#include <functional>
#include <iostream>
#include <memory>
#include <string>
#include <utility>
#include <vector>

#include "cli/commands.hpp"
#include "cli/common.hpp"
#include "cli/geometry_options.hpp"
#include "cli/output.hpp"
#include "mudepth/correct.hpp"
#include "mudepth/correct_files.hpp"
#include "mudepth/error.hpp"

namespace mudepth::cli {

namespace {

namespace fs = std::filesystem;

struct CorrectOptions {
    std::vector<std::string> files;
    std::string geometry;
    SampleOptions sample;
    RadiationOptions radiation;
    std::string table = "elam";
    CylinderGeometryOptions cylinder;
    PlateGeometryOptions plate;
    std::string normalize = "none";
    std::string empty;
    std::string empty_scale;
    std::string output_dir;
    std::string jobs;
    bool force = false;
};

/// The batch's settings and what stdout says about them.
struct Setup {
    FileCorrectionSettings settings;
    std::vector<std::pair<std::string, std::string>> summary;  ///< label, value for stdout
};

/// The command line as the process received it, shell-quoted where needed.
std::string command_line() {
    std::ifstream in("/proc/self/cmdline", std::ios::binary);
    std::string raw((std::istreambuf_iterator<char>(in)), std::istreambuf_iterator<char>());
    std::string out;
    std::size_t start = 0;
    while (start < raw.size()) {
        std::size_t end = raw.find('\0', start);
        if (end == std::string::npos) end = raw.size();
        const std::string arg = raw.substr(start, end - start);
        start = end + 1;
        if (!out.empty()) out += ' ';
        const bool plain = !arg.empty() && arg.find_first_not_of("abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ"
                                                                 "0123456789-_.,:/=+@%") == std::string::npos;
        if (plain) {
            out += arg;
        } else {
            out += '\'';
            for (const char c : arg) {
                if (c == '\'') out += "'\\''";
                else out += c;
            }
            out += '\'';
        }
    }
    return out.empty() ? "mudepth correct (command line not available)" : out;
}

std::string cm_text(double cm) { return length_from_um(cm * 1e4); }

std::string first_given(const CylinderGeometryOptions& o) {
    if (!o.diameter.empty()) return "--diameter";
    if (!o.mu_R.empty()) return "--mu-r";
    if (!o.container_material.empty()) return "--container-material";
    if (!o.wall.empty()) return "--wall";
    if (!o.mu_R_container.empty()) return "--mu-r-container";
    return "--radius-ratio";
}

std::string first_given(const PlateGeometryOptions& o) {
    if (!o.thickness.empty()) return "--thickness";
    if (!o.mu_t.empty()) return "--mu-t";
    if (!o.incidence.empty()) return "--incidence";
    if (!o.window_material.empty()) return "--window-material";
    if (!o.window_thickness.empty()) return "--window-thickness";
    return "--mu-t-window";
}

std::vector<std::pair<std::string, std::string>> summary_of(const CapillarySpecimen& c) {
    std::vector<std::pair<std::string, std::string>> sum;
    if (c.mu_per_cm) {
        sum.push_back({"Sample", c.sample + ", " + fmt(*c.density_g_cm3, 5) + " g/cm³"});
        sum.push_back({"Radiation", c.radiation});
        sum.push_back({"μ", fmt(*c.mu_per_cm, 5) + " 1/cm"});
        sum.push_back({"Inner diameter", fmt(*c.inner_diameter_cm * 10, 5) + " mm"});
    }
    sum.push_back({"Geometry", "cylinder, μR = " + fmt(c.mu_R, 5)});
    if (c.wall) {
        const CapillaryWall& w = *c.wall;
        sum.push_back({"Container wall", (w.material.empty() ? std::string() : w.material + ", " +
                                              cm_text(*w.thickness_cm) + "; ") +
                                             "wall μR " + fmt(w.mu_R, 5) + ", radius ratio " + fmt(w.radius_ratio, 6)});
    }
    return sum;
}

std::vector<std::pair<std::string, std::string>> summary_of(const PlateSpecimen& p) {
    std::vector<std::pair<std::string, std::string>> sum;
    if (p.mu_per_cm) sum.push_back({"Sample", p.sample + ", " + fmt(*p.density_g_cm3, 5) + " g/cm³"});
    if (!p.radiation.empty()) sum.push_back({"Radiation", p.radiation});
    if (p.mu_per_cm) sum.push_back({"μ", fmt(*p.mu_per_cm, 5) + " 1/cm"});
    sum.push_back({"Geometry", std::string(to_string(p.mode)) +
                                   (p.incidence_deg ? ", incidence " + fmt(*p.incidence_deg, 6) + "°" : "") +
                                   ", μt = " + fmt(p.mu_t, 5)});
    if (p.window)
        sum.push_back({"Windows", (p.window->material.empty() ? std::string() : p.window->material + ", ") +
                                      "μt per foil " + fmt(p.window->mu_t, 5)});
    return sum;
}

Setup resolve(const CorrectOptions& o) {
    Setup s;
    FileCorrectionSettings& f = s.settings;
    if (o.geometry.empty())
        throw InputError("--geometry is needed: cylinder, reflection, transmission-normal or transmission-symmetric");
    const CorrectionGeometry g = parse_correction_geometry(o.geometry);
    if (g == CorrectionGeometry::cylinder) {
        if (any_given(o.plate))
            throw InputError(first_given(o.plate) + " applies to the plate geometries, not to --geometry cylinder");
        const CapillarySpecimen c = resolve_cylinder(o.sample, o.radiation, o.table, o.cylinder);
        f = file_correction_settings(c);
        s.summary = summary_of(c);
    } else {
        if (any_given(o.cylinder))
            throw InputError(first_given(o.cylinder) + " applies to --geometry cylinder, not to " + o.geometry);
        // The plate geometries carry the names of the plate modes.
        const PlateSpecimen p = resolve_plate(parse_plate_mode(o.geometry), o.sample, o.radiation, o.table, o.plate);
        f = file_correction_settings(p);
        s.summary = summary_of(p);
    }

    // The empty container.
    if (!o.empty_scale.empty() && o.empty.empty()) throw InputError("--empty-scale needs --empty");
    if (!o.empty.empty()) {
        if (g != CorrectionGeometry::cylinder || !f.setup.wall)
            throw InputError("--empty needs --geometry cylinder with the container wall (--container-material and "
                             "--wall, or --mu-r-container and --radius-ratio)");
        f.empty_scale = o.empty_scale.empty() ? 1.0 : parse_number("--empty-scale", o.empty_scale);
        if (!(f.empty_scale > 0)) throw InputError("--empty-scale: " + o.empty_scale + " must be positive");
        f.empty_file = o.empty;
        s.summary.push_back({"Empty container", o.empty + " × " + fmt(f.empty_scale, 6) + ", subtracted"});
    }
    f.normalization = parse_normalization(o.normalize);
    f.command = command_line();
    f.replace_existing = o.force;
    f.replace_hint = "give --force to replace it";
    if (!o.jobs.empty()) f.jobs = parse_count("--jobs", o.jobs);
    return s;
}

/// The bar on stderr: "correcting [#####.....] 12/60 files".
void draw_progress(std::size_t done, std::size_t total) {
    constexpr std::size_t kWidth = 30;
    const std::size_t filled = total ? done * kWidth / total : kWidth;
    std::string bar(filled, '#');
    bar.append(kWidth - filled, '.');
    std::cerr << "\rcorrecting [" << bar << "] " << done << '/' << total << " files" << std::flush;
}

void run(const CorrectOptions& o) {
    if (o.files.empty()) throw InputError("no pattern file given");
    if (o.output_dir.empty()) throw InputError("--output-dir is needed: the folder for the corrected files");
    const Setup s = resolve(o);
    const std::vector<fs::path> inputs(o.files.begin(), o.files.end());
    const bool bar = ::isatty(2) && inputs.size() > 1;
    const auto results = correct_pattern_files(inputs, o.output_dir, s.settings,
                                               bar ? draw_progress : std::function<void(std::size_t, std::size_t)>());
    if (bar) std::cerr << "\r\033[K" << std::flush;
    if (results.size() == 1) throw_failures(results, o.output_dir);

    auto& out = std::cout;
    for (const auto& [label, value] : s.summary) print_field(out, label, value);
    const auto& nm = s.settings.normalization;
    print_field(out, "Normalisation", nm.mode == NormalizationMode::none ? std::string("none")
                                      : nm.mode == NormalizationMode::max
                                          ? std::string("to the largest corrected intensity")
                                          : "to the corrected intensity at 2θ = " + fmt(nm.at_two_theta_deg, 6) + "°");
    print_field(out, "Output folder", o.output_dir);
    out << '\n';
    std::size_t failed = 0;
    for (const auto& r : results) {
        if (r.outcome != FileOutcome::written) {
            ++failed;
            continue;
        }
        out << "  " << r.input.string() << " → " << r.output.string() << ": " << r.read_summary << "; correction "
            << fmt(r.correction_min, 5)
            << (r.correction_max != r.correction_min ? " to " + fmt(r.correction_max, 5) : std::string()) << '\n';
    }
    for (const auto& w : s.settings.warnings) out << "Warning: " << w << '\n';
    out << std::flush;
    if (failed == 0) {
        out << "\n" << results.size() << (results.size() == 1 ? " file" : " files")
            << " corrected; each output's header records how.\n";
        return;
    }
    for (const auto& r : results)
        if (r.outcome != FileOutcome::written) std::cerr << "mudepth: error: " << r.error << '\n';
    throw_failures(results, o.output_dir);
}

}  // namespace

void register_correct(CLI::App& sub) {
    auto o = std::make_shared<CorrectOptions>();
    sub.add_option("files", o->files, "Measured patterns: 2θ, intensity and optional σ columns, or pdCIF")
        ->type_name("FILE...")->required();
    sub.add_option("--geometry", o->geometry, "cylinder, reflection, transmission-normal or transmission-symmetric")
        ->type_name("GEOMETRY")->required()->check(nonempty());
    add_sample_options(sub, o->sample);
    add_radiation_options(sub, o->radiation);
    add_table_option(sub, o->table);
    add_cylinder_geometry_options(sub, o->cylinder);
    add_plate_thickness_options(sub, o->plate);
    add_plate_incidence_and_window_options(sub, o->plate);
    sub.add_option("--empty", o->empty,
                   "The empty container measured in the same geometry: subtracted with the Paalman & Pings factors")
        ->type_name("FILE")->check(nonempty())->group("Container");
    sub.add_option("--empty-scale", o->empty_scale, "Measured scale of the empty scan (monitor or time ratio; default 1)")
        ->type_name("X")->check(nonempty())->group("Container");
    sub.add_option("--normalize", o->normalize, "none, max, or at:2THETA (divide by the corrected intensity there)")
        ->type_name("MODE")->capture_default_str()->check(nonempty());
    sub.add_option("--output-dir", o->output_dir, "Folder for DIR/<name>.corrected.<ext> (created if missing)")
        ->type_name("DIR")->required()->check(nonempty());
    sub.add_flag("--force", o->force, "Replace existing outputs (an input is never replaced)");
    sub.add_option("--jobs", o->jobs, "Files corrected at once (default: one per core)")->type_name("N")->check(nonempty());
    sub.footer(std::string(kCautions) + "\n");
    sub.callback([o] { run(*o); });
}

}  // namespace mudepth::cli
