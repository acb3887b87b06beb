// `mudepth correct`: absorption-corrected copies of measured patterns (plain
// text or pdCIF), one or many files, in parallel, with the container subtraction.
#include <unistd.h>

#include <algorithm>
#include <atomic>
#include <chrono>
#include <condition_variable>
#include <ctime>
#include <filesystem>
#include <fstream>
#include <iostream>
#include <map>
#include <memory>
#include <mutex>
#include <optional>
#include <sstream>
#include <thread>

#include "cli/commands.hpp"
#include "cli/common.hpp"
#include "cli/geometry_options.hpp"
#include "cli/output.hpp"
#include "mudepth/correct.hpp"
#include "mudepth/error.hpp"
#include "mudepth/pattern.hpp"
#include "mudepth/version.hpp"

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

/// The geometry resolved once for the whole batch.
struct Setup {
    CorrectionSetup setup;
    CorrectionOptions options;
    std::optional<Pattern> empty;
    std::vector<std::string> provenance;  ///< lines shared by every output (ASCII)
    std::vector<std::pair<std::string, std::string>> summary;  ///< label, value for stdout
    std::vector<std::string> warnings;
};

std::string table_source(const std::string& table) {
    return table == "chantler" ? "chantler (Chantler 2000, NIST FFAST)" : "elam (Elam, Ravel & Sieber 2002)";
}

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

std::string utc_now() {
    const std::time_t now = std::time(nullptr);
    std::tm tm{};
    gmtime_r(&now, &tm);
    char buffer[32];
    std::strftime(buffer, sizeof buffer, "%Y-%m-%dT%H:%M:%SZ", &tm);
    return buffer;
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

Setup resolve(const CorrectOptions& o) {
    Setup s;
    auto& prov = s.provenance;
    auto& sum = s.summary;
    if (o.geometry.empty())
        throw InputError("--geometry is needed: cylinder, reflection, transmission-normal or transmission-symmetric");
    const CorrectionGeometry g = parse_correction_geometry(o.geometry);
    s.setup.geometry = g;
    const bool material_route = has_material(o.sample);
    if (g == CorrectionGeometry::cylinder) {
        if (any_given(o.plate))
            throw InputError(first_given(o.plate) + " applies to the plate geometries, not to --geometry cylinder");
        const CylinderSample c = resolve_cylinder(o.sample, o.radiation, o.table, o.cylinder);
        s.setup.mu_R = c.mu_R;
        s.warnings = c.warnings;
        std::string geometry = "cylinder (capillary, equatorial plane)";
        if (c.mu_per_cm) {
            prov.push_back("sample: " + c.sample + ", density used " + fmt(*c.density_g_cm3, 6) + " g/cm3");
            prov.push_back("radiation: " + c.radiation + " (" + fmt(*c.energy_keV, 7) + " keV)");
            prov.push_back("mu: " + fmt(*c.mu_per_cm, 6) + " 1/cm; cross sections " + table_source(o.table));
            geometry += ", inner diameter " + fmt(*c.diameter_cm * 10, 6) + " mm";
            sum.push_back({"Sample", c.sample + ", " + fmt(*c.density_g_cm3, 5) + " g/cm³"});
            sum.push_back({"Radiation", c.radiation});
            sum.push_back({"μ", fmt(*c.mu_per_cm, 5) + " 1/cm"});
            sum.push_back({"Inner diameter", fmt(*c.diameter_cm * 10, 5) + " mm"});
        } else {
            prov.push_back("sample: given directly as mu*R");
        }
        prov.push_back("geometry: " + geometry + ", mu*R = " + fmt(c.mu_R, 8));
        sum.push_back({"Geometry", "cylinder, μR = " + fmt(c.mu_R, 5)});
        if (c.wall) {
            const auto& w = *c.wall;
            s.setup.wall = CorrectionSetup::Wall{w.mu_R, w.radius_ratio};
            std::string text = w.material.empty() ? std::string("given directly")
                                                  : w.material + ", " + cm_text(*w.thickness_cm) + ", mu " +
                                                        fmt(*w.mu_per_cm, 6) + " 1/cm";
            prov.push_back("container wall: " + text + "; wall mu x sample radius " + fmt(w.mu_R, 8) +
                           ", radius ratio " + fmt(w.radius_ratio, 8));
            sum.push_back({"Container wall", (w.material.empty() ? std::string() : w.material + ", " +
                                                  cm_text(*w.thickness_cm) + "; ") +
                                                 "wall μR " + fmt(w.mu_R, 5) + ", radius ratio " + fmt(w.radius_ratio, 6)});
            prov.push_back("correction: column 'correction' = 1/A_s,sc, the sample's scattering attenuated by sample "
                           "and wall (Paalman & Pings 1962)");
        } else {
            prov.push_back("correction: column 'correction' = A* = 1/A of the uniformly bathed cylinder (ITC C 6.3.3)");
        }
    } else {
        if (any_given(o.cylinder))
            throw InputError(first_given(o.cylinder) + " applies to --geometry cylinder, not to " + o.geometry);
        const PlateMode mode = g == CorrectionGeometry::reflection            ? PlateMode::reflection
                               : g == CorrectionGeometry::transmission_normal ? PlateMode::transmission_normal
                                                                              : PlateMode::transmission_symmetric;
        const PlateSample p = resolve_plate(mode, o.sample, o.radiation, o.table, o.plate);
        s.setup.mu_t = p.mu_t;
        s.setup.incidence_deg = p.incidence_deg;
        if (p.mu_per_cm) {
            prov.push_back("sample: " + p.sample + ", density used " + fmt(*p.density_g_cm3, 6) + " g/cm3");
            sum.push_back({"Sample", p.sample + ", " + fmt(*p.density_g_cm3, 5) + " g/cm³"});
        } else {
            prov.push_back("sample: given directly as mu*t");
        }
        if (!p.radiation.empty()) {
            prov.push_back("radiation: " + p.radiation + " (" + fmt(*p.energy_keV, 7) + " keV)");
            sum.push_back({"Radiation", p.radiation});
        }
        if (p.mu_per_cm) {
            prov.push_back("mu: " + fmt(*p.mu_per_cm, 6) + " 1/cm; cross sections " + table_source(o.table));
            sum.push_back({"μ", fmt(*p.mu_per_cm, 5) + " 1/cm"});
        }
        std::string geometry = "flat plate, " + std::string(to_string(mode));
        if (mode == PlateMode::reflection)
            geometry += p.incidence_deg ? ", fixed incidence " + fmt(*p.incidence_deg, 6) + " deg" : ", symmetric";
        if (p.thickness_cm) geometry += ", thickness " + cm_text(*p.thickness_cm);
        prov.push_back("geometry: " + geometry + ", mu*t = " + fmt(p.mu_t, 8));
        sum.push_back({"Geometry", std::string(to_string(mode)) +
                                       (p.incidence_deg ? ", incidence " + fmt(*p.incidence_deg, 6) + "°" : "") +
                                       ", μt = " + fmt(p.mu_t, 5)});
        if (p.window) {
            s.setup.mu_t_window = p.window->mu_t;
            prov.push_back("windows: " +
                           (p.window->material.empty() ? std::string("given directly")
                                                       : p.window->material + ", " + cm_text(*p.window->thickness_cm)) +
                           ", mu*t per foil " + fmt(p.window->mu_t, 8) +
                           (mode == PlateMode::reflection ? " (one cover foil, crossed in and out)"
                                                          : " (one foil on each side)"));
            sum.push_back({"Windows", (p.window->material.empty() ? std::string() : p.window->material + ", ") +
                                          "μt per foil " + fmt(p.window->mu_t, 5)});
        }
        prov.push_back(mode == PlateMode::reflection
                           ? "correction: column 'correction' = 1/((I/I_inf) x windows), I/I_inf = 1 - "
                             "exp(-mu*t (1/sin(alpha) + 1/sin(beta))) (ITC C Table 6.3.3.1)"
                           : "correction: column 'correction' = 1/(A x windows), A = (1/V) integral of exp(-mu T) dV "
                             "(ITC C 6.3.3)");
    }
    if (!material_route) prov.push_back("cross sections: not used (optical thickness given directly)");

    // The empty container.
    if (!o.empty_scale.empty() && o.empty.empty()) throw InputError("--empty-scale needs --empty");
    if (!o.empty.empty()) {
        if (g != CorrectionGeometry::cylinder || !s.setup.wall)
            throw InputError("--empty needs --geometry cylinder with the container wall (--container-material and "
                             "--wall, or --mu-r-container and --radius-ratio)");
        s.options.empty_scale = o.empty_scale.empty() ? 1.0 : parse_number("--empty-scale", o.empty_scale);
        if (!(s.options.empty_scale > 0)) throw InputError("--empty-scale: " + o.empty_scale + " must be positive");
        s.empty = read_pattern(o.empty);
        prov.push_back("empty container: " + o.empty + " (" + std::to_string(s.empty->size()) + " points) x scale " +
                       fmt(s.options.empty_scale, 8) + "; I_s = [I_sc - s (A_c,sc/A_c,c) I_c] / A_s,sc (Paalman & "
                       "Pings 1962), I_c linearly interpolated in 2theta; column 'empty_subtracted' = s "
                       "(A_c,sc/A_c,c) I_c in the measured intensity's units");
        sum.push_back({"Empty container", o.empty + " × " + fmt(s.options.empty_scale, 6) + ", subtracted"});
    }
    s.options.normalization = parse_normalization(o.normalize);
    for (const auto& w : s.warnings) prov.push_back("warning: " + w);
    return s;
}

struct FileResult {
    int status = 0;  ///< 0 written, 2 bad input, 3 file error, 1 internal
    std::string error;
    std::string line;  ///< stdout report line
};

std::string read_summary(const Pattern& p) {
    const auto& r = p.report;
    std::string s = std::to_string(r.data_rows) + " points from " + std::to_string(r.lines) + " lines";
    std::vector<std::string> skipped;
    auto count = [&](std::size_t k, const char* what) {
        if (k) skipped.push_back(std::to_string(k) + " " + what + (k == 1 ? " line" : " lines"));
    };
    count(r.header_lines, "header");
    count(r.comment_lines, "comment");
    count(r.blank_lines, "blank");
    if (!skipped.empty()) {
        s += "; skipped ";
        for (std::size_t i = 0; i < skipped.size(); ++i) s += (i ? ", " : "") + skipped[i];
    }
    if (p.format == PatternFormat::cif) {
        s += "; pdCIF " + r.intensity_item + " versus " + r.angle_item;
        if (!r.dropped_items.empty()) {
            s += "; other loop items not copied:";
            for (const auto& d : r.dropped_items) s += " " + d;
        }
    } else {
        s += std::string("; separated by ") + (r.separator == ';' ? "semicolons" : r.separator == ',' ? "commas" : "white space");
        if (r.decimal_comma) s += ", decimal commas";
    }
    if (!p.has_sigma()) s += "; no sigma column";
    if (r.crlf) s += "; CRLF line ends";
    return s;
}

FileResult process(const fs::path& input, const fs::path& output, const std::vector<fs::path>& inputs,
                   const Setup& s, const std::string& command, const std::string& date, bool force) {
    FileResult r;
    try {
        std::error_code ec;
        bool is_input = false;
        if (fs::exists(output, ec))
            for (const auto& in : inputs) {
                std::error_code eq;
                is_input = is_input || fs::equivalent(output, in, eq);
            }
        if (!force && !is_input && fs::exists(output, ec))
            throw FileError(output.string() + ": exists; give --force to replace it");
        check_output_path(output, inputs, force);
        const Pattern p = read_pattern(input);
        CorrectionOptions options = s.options;
        if (s.empty) options.empty = &*s.empty;
        const CorrectedPattern c = correct_pattern(p, s.setup, options);

        std::vector<std::string> prov;
        prov.push_back("mudepth " + std::string(kVersion) + " correct: absorption-corrected powder pattern");
        prov.push_back("command: " + command);
        prov.push_back("date: " + date + " (UTC)");
        prov.push_back("input: " + input.string() + " (unchanged): " + read_summary(p));
        prov.insert(prov.end(), s.provenance.begin(), s.provenance.end());
        const auto& nm = s.options.normalization;
        if (nm.mode == NormalizationMode::none)
            prov.push_back("normalisation: none (intensity = measured x correction)");
        else
            prov.push_back("normalisation: intensity and sigma divided by " + fmt(c.normalization_divisor, 10) +
                           (nm.mode == NormalizationMode::max
                                ? ", the largest corrected intensity"
                                : ", the corrected intensity at 2theta = " + fmt(nm.at_two_theta_deg, 8) + " deg"));
        for (const auto& n : c.notes) prov.push_back("note: " + n);
        prov.push_back(p.format == PatternFormat::cif
                           ? "loop items: _pd_proc_intensity_total (corrected, sigma in parentheses); "
                             "_mudepth_absorption_correction and _mudepth_empty_subtracted are local names of this program"
                           : "columns: two_theta_deg, intensity (corrected), sigma (corrected, when the input has one), "
                             "correction" + std::string(c.subtracted.empty() ? "" : ", empty_subtracted"));

        std::vector<PatternColumn> extra;
        extra.push_back({"correction", "_mudepth_absorption_correction", c.correction});
        if (!c.subtracted.empty()) extra.push_back({"empty_subtracted", "_mudepth_empty_subtracted", c.subtracted});
        const std::string text = render_pattern(p, c.intensity, c.sigma, extra, prov);
        write_file_atomically(output, text, force);
        const auto [lo, hi] = std::minmax_element(c.correction.begin(), c.correction.end());
        r.line = input.string() + " → " + output.string() + ": " + read_summary(p) + "; correction " + fmt(*lo, 5) +
                 (*hi != *lo ? " to " + fmt(*hi, 5) : std::string());
    } catch (const InputError& e) {
        r.status = 2;
        r.error = e.what();
    } catch (const FileError& e) {
        r.status = 3;
        r.error = e.what();
    } catch (const std::exception& e) {
        r.status = 1;
        r.error = std::string("internal error: ") + e.what();
    }
    return r;
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
    std::size_t jobs = std::max(1u, std::thread::hardware_concurrency());
    if (!o.jobs.empty()) jobs = parse_count("--jobs", o.jobs);

    const Setup s = resolve(o);

    std::vector<fs::path> inputs(o.files.begin(), o.files.end());
    if (!o.empty.empty())
        for (const auto& in : inputs) {
            std::error_code ec;
            if (in == fs::path(o.empty) || fs::equivalent(in, o.empty, ec))
                throw InputError(in.string() + ": is also the --empty file; give the empty-container scan only "
                                               "with --empty");
        }
    const fs::path dir(o.output_dir);
    {
        std::error_code ec;
        if (fs::exists(dir, ec) && !fs::is_directory(dir, ec))
            throw FileError(o.output_dir + ": the --output-dir exists and is not a folder");
        fs::create_directories(dir, ec);
        if (ec) throw FileError(o.output_dir + ": cannot create the output folder: " + ec.message());
    }

    const std::size_t n = inputs.size();
    std::vector<fs::path> outputs(n);
    std::vector<FileResult> results(n);
    std::vector<bool> todo(n, true);
    std::map<std::string, std::size_t> taken;
    for (std::size_t i = 0; i < n; ++i) {
        outputs[i] = corrected_output_path(inputs[i], dir);
        const auto [it, fresh] = taken.emplace(outputs[i].lexically_normal().string(), i);
        if (!fresh) {
            results[i] = {2, inputs[i].string() + ": its output " + outputs[i].string() + " is also the output of " +
                                 inputs[it->second].string() + "; give files with different names",
                          {}};
            todo[i] = false;
        }
    }

    const std::string command = command_line(), date = utc_now();
    std::atomic<std::size_t> next{0}, done{0};
    std::mutex m;
    std::condition_variable cv;
    auto worker = [&] {
        for (;;) {
            const std::size_t i = next++;
            if (i >= n) break;
            if (todo[i]) results[i] = process(inputs[i], outputs[i], inputs, s, command, date, o.force);
            ++done;
            cv.notify_one();
        }
    };
    const bool bar = ::isatty(2) && n > 1;
    {
        std::vector<std::jthread> pool;
        for (std::size_t t = 0; t < std::min(jobs, n); ++t) pool.emplace_back(worker);
        if (bar) {
            std::unique_lock lock(m);
            while (done < n) {
                draw_progress(done, n);
                cv.wait_for(lock, std::chrono::milliseconds(100));
            }
            std::cerr << "\r\033[K" << std::flush;
        }
    }

    std::vector<std::size_t> failed;
    bool file_error = false, internal = false;
    for (std::size_t i = 0; i < n; ++i)
        if (results[i].status != 0) {
            failed.push_back(i);
            file_error = file_error || results[i].status == 3;
            internal = internal || results[i].status == 1;
        }
    if (n == 1 && !failed.empty()) {
        const auto& r = results[0];
        if (r.status == 2) throw InputError(r.error);
        if (r.status == 3) throw FileError(r.error);
        throw std::runtime_error(r.error);
    }
    auto& out = std::cout;
    for (const auto& [label, value] : s.summary) print_field(out, label, value);
    const auto& nm = s.options.normalization;
    print_field(out, "Normalisation", nm.mode == NormalizationMode::none ? std::string("none")
                                      : nm.mode == NormalizationMode::max
                                          ? std::string("to the largest corrected intensity")
                                          : "to the corrected intensity at 2θ = " + fmt(nm.at_two_theta_deg, 6) + "°");
    print_field(out, "Output folder", o.output_dir);
    out << '\n';
    for (std::size_t i = 0; i < n; ++i)
        if (results[i].status == 0) out << "  " << results[i].line << '\n';
    for (const auto& w : s.warnings) out << "Warning: " << w << '\n';
    out << std::flush;
    if (failed.empty()) {
        out << "\n" << n << (n == 1 ? " file" : " files") << " corrected; each output's header records how.\n";
        return;
    }
    for (const std::size_t i : failed) std::cerr << "mudepth: error: " << results[i].error << '\n';
    std::string names;
    for (std::size_t k = 0; k < failed.size() && k < 10; ++k) names += (k ? ", " : "") + inputs[failed[k]].string();
    if (failed.size() > 10) names += ", ...";
    const std::string summary = std::to_string(failed.size()) + " of " + std::to_string(n) +
                                " files failed (" + names + "); " + std::to_string(n - failed.size()) +
                                " written to " + o.output_dir;
    if (internal) throw std::runtime_error(summary);
    if (file_error) throw FileError(summary);
    throw InputError(summary);
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
