// Measured powder patterns in files: reading plain-text columns and the IUCr
// powder CIF (pdCIF), writing a corrected copy in the same family of format,
// and writing files atomically (a temporary file in the folder, then rename).
#pragma once

#include <cstddef>
#include <cstdint>
#include <filesystem>
#include <functional>
#include <iosfwd>
#include <span>
#include <string>
#include <string_view>
#include <vector>

namespace mudepth {

enum class PatternFormat { text, cif };

/// What the reader did with the file's lines.
struct PatternReadReport {
    std::size_t lines = 0;          ///< lines in the file
    std::size_t data_rows = 0;      ///< points read
    std::size_t header_lines = 0;   ///< text: non-numeric lines before the first data row
    std::size_t comment_lines = 0;  ///< `#` or `!` lines (text), `#` lines (CIF)
    std::size_t blank_lines = 0;
    bool crlf = false;              ///< CRLF line endings seen
    bool decimal_comma = false;     ///< text: a semicolon file with decimal commas
    char separator = ' ';           ///< text: ' ' (white space), ',' or ';'
    std::string angle_item;         ///< CIF: the 2θ loop item, or the range items used
    std::string intensity_item;     ///< CIF: the intensity loop item used
    std::vector<std::string> dropped_items;  ///< CIF: other items of the data loop (not written back)
};

/// A pattern: 2θ strictly increasing, intensity, σ (empty when the file has none).
/// line[i] is the file line of point i, for messages.
struct Pattern {
    std::string name;  ///< the file name used in messages
    PatternFormat format = PatternFormat::text;
    std::vector<double> two_theta_deg;
    std::vector<double> intensity;
    std::vector<double> sigma;
    std::vector<std::size_t> line;
    PatternReadReport report;
    std::vector<std::string> header;  ///< text: the header and comment lines, as read (without line ends)

    // CIF only: the source text and the byte range of the data loop a corrected copy replaces.
    std::string cif_text;
    std::size_t cif_loop_begin = 0, cif_loop_end = 0;
    bool cif_angle_column = false;  ///< false: 2θ came from the range items, which stay as they are

    bool has_sigma() const { return !sigma.empty(); }
    std::size_t size() const { return two_theta_deg.size(); }
};

/// Most points one pattern file may hold.
inline constexpr std::size_t kMaxPatternPoints = 50'000'000;

/// Largest pattern file read_pattern accepts (64 MiB, some millions of points): reading
/// takes about six times the file size in memory, per file corrected at once.
inline constexpr std::uintmax_t kMaxPatternFileBytes = std::uintmax_t{64} << 20;

/// Plain text: two or three columns (2θ in degrees, intensity, optional σ) separated by
/// white space, commas or semicolons (a semicolon file may use decimal commas); header
/// lines before the data, `#` and `!` comment lines, blank lines, CRLF endings. Numbers
/// are read with std::from_chars. Throws InputError "NAME:LINE: what" for NaN or infinity,
/// 2θ outside [0, 180) or not increasing, σ < 0, a row with another column count, text
/// after the data, or no data rows.
Pattern parse_text_pattern(std::string_view text, const std::string& name);

/// pdCIF (IUCr powder CIF, DDL1 names): the loop holding `_pd_meas_2theta_scan`,
/// `_pd_meas_angle_2theta` or `_pd_proc_2theta_corrected` and one of
/// `_pd_proc_intensity_total`, `_pd_meas_intensity_total`, `_pd_meas_counts_total`
/// (preferred in that order), values with standard uncertainties in parentheses;
/// or that intensity loop with the 2θ grid from `_pd_meas_2theta_range_min/max/inc`
/// (or `_pd_proc_...`), or from `..._range_min`, `..._range_inc` and `_pd_meas_number_of_points`.
/// Throws InputError "NAME:LINE: what".
Pattern parse_cif_pattern(std::string_view text, const std::string& name);

/// CIF when the name ends in .cif (any case) or the first item is a `data_` block; else text.
PatternFormat detect_pattern_format(std::string_view text, const std::string& name);

/// Reads and parses a file; FileError when it cannot be read or is larger than kMaxPatternFileBytes.
Pattern read_pattern(const std::filesystem::path& path);

/// An extra column written after 2θ, intensity and σ.
struct PatternColumn {
    std::string text_name;  ///< header name in a text file
    std::string cif_name;   ///< CIF loop item (a local name, `_mudepth_...`)
    std::vector<double> values;
};

/// The corrected copy of `source`: the provenance lines (printable ASCII; each becomes a
/// `#` comment), then for text the source's header lines as `# > ...` comments, a column
/// header and the rows (2θ, intensity, σ when given, the extra columns) with the source's
/// separator and decimal mark; for CIF the source text with its data loop replaced by
/// 2θ (when the source had a column), `_pd_proc_intensity_total` with σ in parentheses,
/// and the extra columns. Numbers in text are the shortest that read back exactly.
std::string render_pattern(const Pattern& source, std::span<const double> intensity, std::span<const double> sigma,
                           std::span<const PatternColumn> extra, std::span<const std::string> provenance);

/// DIR/<stem>.corrected.<ext> (DIR/<name>.corrected without an extension).
std::filesystem::path corrected_output_path(const std::filesystem::path& input, const std::filesystem::path& dir);

/// Refuses an output that is one of the inputs (std::filesystem::equivalent, whatever
/// `replace_existing` says), that exists when replace_existing is false ("NAME: exists; "
/// followed by `how_to_replace`), or that is a directory. FileError.
void check_output_path(const std::filesystem::path& output, std::span<const std::filesystem::path> inputs,
                       bool replace_existing, std::string_view how_to_replace = "it is not replaced unless asked");

/// Writes through a temporary file in the target's folder, renamed over the target at
/// the end; any failure (including `write` throwing) removes the temporary file and
/// leaves the target as it was. FileError (the exception `write` throws passes through).
void write_file_atomically(const std::filesystem::path& target, const std::function<void(std::ostream&)>& write,
                           bool replace_existing);
void write_file_atomically(const std::filesystem::path& target, std::string_view content, bool replace_existing);

/// The value with its standard uncertainty in CIF notation: two significant digits of the
/// uncertainty, the value rounded to the same place (a data file keeps one digit more than
/// the "rule of 19" of publications): (1234.5678, 1.234) → "1234.6(12)", (1234.5678, 38.9)
/// → "1235(39)", (12345, 250) → "12350(250)". su <= 0: the value alone, shortest form.
std::string cif_value_with_su(double value, double su);

}  // namespace mudepth
