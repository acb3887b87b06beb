// Correcting measured pattern files: each input read, corrected (correct.hpp),
// and written as DIR/<stem>.corrected.<ext> with a provenance header, atomically,
// never over an input; many files in parallel. The `correct` command and the
// Python module both call these functions, so their files are the same.
#pragma once

#include <cstddef>
#include <filesystem>
#include <functional>
#include <optional>
#include <span>
#include <string>
#include <vector>

#include "mudepth/correct.hpp"
#include "mudepth/pattern.hpp"
#include "mudepth/specimen.hpp"

namespace mudepth {

/// The correction geometry of a specimen: a capillary is `cylinder` (with its wall when it
/// has one); a plate keeps its mode, incidence and windows.
CorrectionSetup correction_setup(const CapillarySpecimen& capillary);
CorrectionSetup correction_setup(const PlateSpecimen& plate);

/// Provenance lines (sample and density, radiation, μ and table, geometry with μR or μt,
/// wall or windows, the formula of the factor) for the header of a corrected file.
std::vector<std::string> provenance_lines(const CapillarySpecimen& capillary);
std::vector<std::string> provenance_lines(const PlateSpecimen& plate);

/// Everything a batch of files shares.
struct FileCorrectionSettings {
    CorrectionSetup setup;                   ///< correction_setup(specimen)
    std::vector<std::string> description;    ///< provenance_lines(specimen)
    std::vector<std::string> warnings;       ///< recorded as "warning: ..." lines
    Normalization normalization;
    std::optional<std::filesystem::path> empty_file;  ///< the empty container (needs setup.wall)
    double empty_scale = 1;                  ///< measured scale of the empty scan (monitor or time ratio)
    std::string command;                     ///< recorded as "command: ..." (how the files were made)
    std::string date_utc;                    ///< recorded as "date: ..."; empty: now (ISO 8601)
    bool replace_existing = false;           ///< replace existing outputs (an input never)
    std::string replace_hint = "ask to replace it";  ///< ends the message for an existing output
    std::size_t jobs = 0;                    ///< files at once; 0: one per core
};

/// Settings for correcting files of a specimen: its setup, provenance lines and warnings;
/// the rest at its defaults, for the caller to fill in.
FileCorrectionSettings file_correction_settings(const CapillarySpecimen& capillary);
FileCorrectionSettings file_correction_settings(const PlateSpecimen& plate);

enum class FileOutcome { written, bad_input, file_error, internal_error };

struct FileCorrectionResult {
    std::filesystem::path input, output;
    FileOutcome outcome = FileOutcome::written;
    std::string error;         ///< why it was not written
    std::string read_summary;  ///< points read and what the reader skipped
    double correction_min = 0, correction_max = 0;
};

/// "2451 points from 2455 lines; skipped 1 header line, 3 comment lines; separated by white space".
std::string read_summary(const Pattern& pattern);

/// Current UTC time, "2026-12-02T04:53:56Z".
std::string utc_now_iso8601();

/// Corrects every input into output_dir (created if missing), in parallel. Refuses the whole
/// batch (InputError) when an input is also the empty-container file, and reads the empty
/// file first (its errors refuse the batch too); FileError when the folder cannot be made.
/// Otherwise each file succeeds or fails on its own: a failed file leaves no output.
/// `on_progress(done, total)` is called on the calling thread while the files are worked on.
std::vector<FileCorrectionResult> correct_pattern_files(
    std::span<const std::filesystem::path> inputs, const std::filesystem::path& output_dir,
    const FileCorrectionSettings& settings,
    const std::function<void(std::size_t done, std::size_t total)>& on_progress = {});

/// Throws the failures of a batch as one error, as the command line reports them: a single
/// file its own error; several "K of N files failed (a, b, ...); M written to DIR". FileError
/// when any file could not be read or written, else InputError (std::runtime_error for an
/// internal error). Returns when every file was written.
void throw_failures(std::span<const FileCorrectionResult> results, const std::filesystem::path& output_dir);

}  // namespace mudepth
