// Correcting pattern files: provenance, one file, and parallel batches.
#include "mudepth/correct_files.hpp"

#include <algorithm>
#include <atomic>
#include <chrono>
#include <cmath>
#include <condition_variable>
#include <ctime>
#include <map>
#include <mutex>
#include <thread>

#include "format.hpp"
#include "mudepth/error.hpp"
#include "mudepth/version.hpp"

namespace mudepth {

namespace fs = std::filesystem;

namespace {

std::string length_text(double cm) { return format_length_um(cm * 1e4); }

std::string table_text(std::optional<CrossSectionTable> table) {
    const CrossSectionTable t = table.value_or(CrossSectionTable::elam);
    return std::string(to_string(t)) + " (" + std::string(citation(t)) + ")";
}

CorrectionGeometry geometry_of(PlateMode mode) {
    switch (mode) {
        case PlateMode::reflection: return CorrectionGeometry::reflection;
        case PlateMode::transmission_normal: return CorrectionGeometry::transmission_normal;
        case PlateMode::transmission_symmetric: break;
    }
    return CorrectionGeometry::transmission_symmetric;
}

}  // namespace

CorrectionSetup correction_setup(const CapillarySpecimen& c) {
    CorrectionSetup s;
    s.geometry = CorrectionGeometry::cylinder;
    s.mu_R = c.mu_R;
    if (c.wall) s.wall = CorrectionSetup::Wall{c.wall->mu_R, c.wall->radius_ratio};
    return s;
}

CorrectionSetup correction_setup(const PlateSpecimen& p) {
    CorrectionSetup s;
    s.geometry = geometry_of(p.mode);
    s.mu_t = p.mu_t;
    s.incidence_deg = p.incidence_deg;
    if (p.window) s.mu_t_window = p.window->mu_t;
    return s;
}

std::vector<std::string> provenance_lines(const CapillarySpecimen& c) {
    std::vector<std::string> lines;
    std::string geometry = "cylinder (capillary, equatorial plane)";
    if (c.mu_per_cm) {
        lines.push_back("sample: " + c.sample + ", density used " + format_number(c.density_g_cm3.value_or(0), 6) +
                        " g/cm3");
        lines.push_back("radiation: " + c.radiation + " (" + format_number(c.energy_keV.value_or(0), 7) + " keV)");
        lines.push_back("mu: " + format_number(*c.mu_per_cm, 6) + " 1/cm; cross sections " + table_text(c.table));
        if (c.inner_diameter_cm) geometry += ", inner diameter " + format_number(*c.inner_diameter_cm * 10, 6) + " mm";
    } else {
        lines.push_back("sample: given directly as mu*R");
    }
    lines.push_back("geometry: " + geometry + ", mu*R = " + format_number(c.mu_R, 8));
    if (c.wall) {
        const CapillaryWall& w = *c.wall;
        const std::string what = w.material.empty() || !w.mu_per_cm || !w.thickness_cm
                                     ? std::string("given directly")
                                     : w.material + ", " + length_text(*w.thickness_cm) + ", mu " +
                                           format_number(*w.mu_per_cm, 6) + " 1/cm";
        lines.push_back("container wall: " + what + "; wall mu x sample radius " + format_number(w.mu_R, 8) +
                        ", radius ratio " + format_number(w.radius_ratio, 8));
        lines.push_back("correction: column 'correction' = 1/A_s,sc, the sample's scattering attenuated by sample "
                        "and wall (Paalman & Pings 1962)");
    } else {
        lines.push_back("correction: column 'correction' = A* = 1/A of the uniformly bathed cylinder (ITC C 6.3.3)");
    }
    if (!c.mu_per_cm) lines.push_back("cross sections: not used (optical thickness given directly)");
    return lines;
}

std::vector<std::string> provenance_lines(const PlateSpecimen& p) {
    std::vector<std::string> lines;
    if (p.mu_per_cm)
        lines.push_back("sample: " + p.sample + ", density used " + format_number(p.density_g_cm3.value_or(0), 6) +
                        " g/cm3");
    else
        lines.push_back("sample: given directly as mu*t");
    if (!p.radiation.empty())
        lines.push_back("radiation: " + p.radiation + " (" + format_number(p.energy_keV.value_or(0), 7) + " keV)");
    if (p.mu_per_cm)
        lines.push_back("mu: " + format_number(*p.mu_per_cm, 6) + " 1/cm; cross sections " + table_text(p.table));
    std::string geometry = "flat plate, " + std::string(to_string(p.mode));
    if (p.mode == PlateMode::reflection)
        geometry += p.incidence_deg ? ", fixed incidence " + format_number(*p.incidence_deg, 6) + " deg" : ", symmetric";
    if (p.thickness_cm) geometry += ", thickness " + length_text(*p.thickness_cm);
    lines.push_back("geometry: " + geometry + ", mu*t = " + format_number(p.mu_t, 8));
    const bool window_material = p.window && !p.window->material.empty() && p.window->thickness_cm;
    if (p.window)
        lines.push_back("windows: " +
                        (window_material ? p.window->material + ", " + length_text(*p.window->thickness_cm)
                                         : std::string("given directly")) +
                        ", mu*t per foil " + format_number(p.window->mu_t, 8) +
                        (p.mode == PlateMode::reflection ? " (one cover foil, crossed in and out)"
                                                         : " (one foil on each side)"));
    lines.push_back(p.mode == PlateMode::reflection
                        ? "correction: column 'correction' = 1/((I/I_inf) x windows), I/I_inf = 1 - "
                          "exp(-mu*t (1/sin(alpha) + 1/sin(beta))) (ITC C Table 6.3.3.1)"
                        : "correction: column 'correction' = 1/(A x windows), A = (1/V) integral of exp(-mu T) dV "
                          "(ITC C 6.3.3)");
    if (!p.mu_per_cm)
        lines.push_back(window_material ? "cross sections: " + table_text(p.table) +
                                              " for the windows only (the sample's optical thickness given directly)"
                                        : std::string("cross sections: not used (optical thickness given directly)"));
    return lines;
}

FileCorrectionSettings file_correction_settings(const CapillarySpecimen& c) {
    FileCorrectionSettings s;
    s.setup = correction_setup(c);
    s.description = provenance_lines(c);
    s.warnings = c.warnings;
    return s;
}

FileCorrectionSettings file_correction_settings(const PlateSpecimen& p) {
    FileCorrectionSettings s;
    s.setup = correction_setup(p);
    s.description = provenance_lines(p);
    return s;
}

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
        s += std::string("; separated by ") +
             (r.separator == ';' ? "semicolons" : r.separator == ',' ? "commas" : "white space");
        if (r.decimal_comma) s += ", decimal commas";
    }
    if (!p.has_sigma()) s += "; no sigma column";
    if (r.crlf) s += "; CRLF line ends";
    return s;
}

std::string utc_now_iso8601() {
    const std::time_t now = std::time(nullptr);
    std::tm tm{};
    gmtime_r(&now, &tm);
    char buffer[32];
    std::strftime(buffer, sizeof buffer, "%Y-%m-%dT%H:%M:%SZ", &tm);
    return buffer;
}

namespace {

/// What every output of the batch shares, resolved once.
struct Batch {
    const FileCorrectionSettings& settings;
    std::optional<Pattern> empty;
    std::vector<std::string> shared_provenance;  ///< description, empty container, warnings
    std::string date;
};

/// The provenance lines of one output, first to last.
std::vector<std::string> provenance_of(const Batch& b, const fs::path& input, const std::string& input_summary,
                                       const Pattern& p, const CorrectedPattern& c) {
    const FileCorrectionSettings& s = b.settings;
    std::vector<std::string> prov;
    prov.push_back("mudepth " + std::string(kVersion) + " correct: absorption-corrected powder pattern");
    prov.push_back("command: " + s.command);
    prov.push_back("date: " + b.date + " (UTC)");
    prov.push_back("input: " + input.string() + " (unchanged): " + input_summary);
    prov.insert(prov.end(), b.shared_provenance.begin(), b.shared_provenance.end());
    const Normalization& nm = s.normalization;
    if (nm.mode == NormalizationMode::none)
        prov.push_back("normalisation: none (intensity = measured x correction)");
    else
        prov.push_back("normalisation: intensity and sigma divided by " + format_number(c.normalization_divisor, 10) +
                       (nm.mode == NormalizationMode::max
                            ? ", the largest corrected intensity"
                            : ", the corrected intensity at 2theta = " + format_number(nm.at_two_theta_deg, 8) +
                                  " deg"));
    for (const auto& n : c.notes) prov.push_back("note: " + n);
    prov.push_back(p.format == PatternFormat::cif
                       ? "loop items: _pd_proc_intensity_total (corrected, sigma in parentheses); "
                         "_mudepth_absorption_correction and _mudepth_empty_subtracted are local names of this program"
                       : "columns: two_theta_deg, intensity (corrected), sigma (corrected, when the input has one), "
                         "correction" +
                             std::string(c.subtracted.empty() ? "" : ", empty_subtracted"));
    return prov;
}

/// Reads, corrects and writes one file; never throws.
FileCorrectionResult correct_one(const Batch& b, const fs::path& input, const fs::path& output,
                                 std::span<const fs::path> inputs) {
    const FileCorrectionSettings& s = b.settings;
    FileCorrectionResult r;
    r.input = input;
    r.output = output;
    try {
        check_output_path(output, inputs, s.replace_existing, s.replace_hint);
        const Pattern p = read_pattern(input);
        r.read_summary = read_summary(p);
        CorrectionOptions options;
        options.normalization = s.normalization;
        options.empty_scale = s.empty_scale;
        if (b.empty) options.empty = &*b.empty;
        const CorrectedPattern c = correct_pattern(p, s.setup, options);

        std::vector<PatternColumn> extra;
        extra.push_back({"correction", "_mudepth_absorption_correction", c.correction});
        if (!c.subtracted.empty()) extra.push_back({"empty_subtracted", "_mudepth_empty_subtracted", c.subtracted});
        const std::string text = render_pattern(p, c.intensity, c.sigma, extra, provenance_of(b, input, r.read_summary, p, c));
        write_file_atomically(output, text, s.replace_existing);
        const auto [lo, hi] = std::minmax_element(c.correction.begin(), c.correction.end());
        r.correction_min = *lo;
        r.correction_max = *hi;
    } catch (const InputError& e) {
        r.outcome = FileOutcome::bad_input;
        r.error = e.what();
    } catch (const FileError& e) {
        r.outcome = FileOutcome::file_error;
        r.error = e.what();
    } catch (const std::exception& e) {
        r.outcome = FileOutcome::internal_error;
        r.error = std::string("internal error: ") + e.what();
    }
    return r;
}

Batch prepare(std::span<const fs::path> inputs, const FileCorrectionSettings& s) {
    Batch b{s, std::nullopt, s.description, s.date_utc.empty() ? utc_now_iso8601() : s.date_utc};
    if (!(s.empty_scale > 0) || !std::isfinite(s.empty_scale))
        throw InputError("the empty-container scale " + format_number(s.empty_scale) + " must be positive");
    if (s.empty_file) {
        if (s.setup.geometry != CorrectionGeometry::cylinder || !s.setup.wall)
            throw InputError("an empty-container scan needs the cylinder geometry with its container wall");
        for (const auto& in : inputs) {
            std::error_code ec;
            if (in == *s.empty_file || fs::equivalent(in, *s.empty_file, ec))
                throw InputError(in.string() + ": is also the empty-container scan; give it only as the empty "
                                               "container");
        }
        b.empty = read_pattern(*s.empty_file);
        b.shared_provenance.push_back(
            "empty container: " + s.empty_file->string() + " (" + std::to_string(b.empty->size()) + " points) x scale " +
            format_number(s.empty_scale, 8) +
            "; I_s = [I_sc - s (A_c,sc/A_c,c) I_c] / A_s,sc (Paalman & Pings 1962), I_c linearly interpolated in "
            "2theta; column 'empty_subtracted' = s (A_c,sc/A_c,c) I_c in the measured intensity's units");
    }
    for (const auto& w : s.warnings) b.shared_provenance.push_back("warning: " + w);
    return b;
}

void make_output_folder(const fs::path& dir) {
    std::error_code ec;
    if (fs::exists(dir, ec) && !fs::is_directory(dir, ec))
        throw FileError(dir.string() + ": is not a folder; give a folder for the corrected files");
    fs::create_directories(dir, ec);
    if (ec) throw FileError(dir.string() + ": cannot create the output folder: " + ec.message());
}

}  // namespace

std::vector<FileCorrectionResult> correct_pattern_files(
    std::span<const fs::path> inputs, const fs::path& output_dir, const FileCorrectionSettings& settings,
    const std::function<void(std::size_t done, std::size_t total)>& on_progress) {
    if (inputs.empty()) throw InputError("no pattern file given");
    const Batch batch = prepare(inputs, settings);
    make_output_folder(output_dir);

    const std::size_t n = inputs.size();
    std::vector<FileCorrectionResult> results(n);
    std::vector<fs::path> outputs(n);
    std::vector<bool> todo(n, true);
    std::map<std::string, std::size_t> taken;
    for (std::size_t i = 0; i < n; ++i) {
        outputs[i] = corrected_output_path(inputs[i], output_dir);
        const auto [it, fresh] = taken.emplace(outputs[i].lexically_normal().string(), i);
        if (!fresh) {
            results[i].input = inputs[i];
            results[i].output = outputs[i];
            results[i].outcome = FileOutcome::bad_input;
            results[i].error = inputs[i].string() + ": its output " + outputs[i].string() + " is also the output of " +
                               inputs[it->second].string() + "; give files with different names";
            todo[i] = false;
        }
    }

    const std::size_t jobs = settings.jobs ? settings.jobs : std::max(1u, std::thread::hardware_concurrency());
    std::atomic<std::size_t> next{0}, done{0};
    std::mutex m;
    std::condition_variable cv;
    auto worker = [&] {
        for (;;) {
            const std::size_t i = next++;
            if (i >= n) break;
            if (todo[i]) results[i] = correct_one(batch, inputs[i], outputs[i], inputs);
            {
                std::lock_guard lock(m);
                ++done;
            }
            cv.notify_one();
        }
    };
    {
        std::vector<std::jthread> pool;
        for (std::size_t t = 0; t < std::min(jobs, n); ++t) pool.emplace_back(worker);
        if (on_progress) {
            std::unique_lock lock(m);
            while (done < n) {
                const std::size_t now = done;
                lock.unlock();
                on_progress(now, n);
                lock.lock();
                cv.wait_for(lock, std::chrono::milliseconds(100), [&] { return done != now; });
            }
            lock.unlock();
            on_progress(n, n);
        }
    }
    return results;
}

void throw_failures(std::span<const FileCorrectionResult> results, const fs::path& output_dir) {
    std::vector<std::size_t> failed;
    bool file_error = false, internal = false;
    for (std::size_t i = 0; i < results.size(); ++i)
        if (results[i].outcome != FileOutcome::written) {
            failed.push_back(i);
            file_error = file_error || results[i].outcome == FileOutcome::file_error;
            internal = internal || results[i].outcome == FileOutcome::internal_error;
        }
    if (failed.empty()) return;
    const std::size_t n = results.size();
    if (n == 1) {
        const auto& r = results[0];
        if (r.outcome == FileOutcome::bad_input) throw InputError(r.error);
        if (r.outcome == FileOutcome::file_error) throw FileError(r.error);
        throw std::runtime_error(r.error);
    }
    std::string names;
    for (std::size_t k = 0; k < failed.size() && k < 10; ++k) names += (k ? ", " : "") + results[failed[k]].input.string();
    if (failed.size() > 10) names += ", ...";
    const std::string summary = std::to_string(failed.size()) + " of " + std::to_string(n) + " files failed (" + names +
                                "); " + std::to_string(n - failed.size()) + " written to " + output_dir.string();
    if (internal) throw std::runtime_error(summary);
    if (file_error) throw FileError(summary);
    throw InputError(summary);
}

}  // namespace mudepth
