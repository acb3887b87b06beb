// Reading and writing powder pattern files: plain-text columns and pdCIF.
// Numbers are read with std::from_chars and written with std::to_chars (the
// shortest text that reads back to the same double), so no locale is involved.
#include "mudepth/pattern.hpp"

#include <fcntl.h>
#include <unistd.h>

#include <algorithm>
#include <array>
#include <atomic>
#include <cerrno>
#include <charconv>
#include <cmath>
#include <cstdio>
#include <cstring>
#include <fstream>
#include <optional>
#include <sstream>
#include <system_error>

#include "format.hpp"
#include "mudepth/error.hpp"

namespace mudepth {

namespace {

namespace fs = std::filesystem;

bool is_blank(char c) { return c == ' ' || c == '\t' || c == '\v' || c == '\f'; }

std::string_view trim(std::string_view s) {
    while (!s.empty() && is_blank(s.front())) s.remove_prefix(1);
    while (!s.empty() && is_blank(s.back())) s.remove_suffix(1);
    return s;
}

std::string lower(std::string_view s) {
    std::string out(s);
    for (char& c : out)
        if (c >= 'A' && c <= 'Z') c = static_cast<char>(c - 'A' + 'a');
    return out;
}

/// The text as it may go into a message: at most 40 characters, control characters escaped.
std::string shown(std::string_view s) {
    std::string out;
    for (const char c : s.substr(0, 40)) {
        const auto u = static_cast<unsigned char>(c);
        if (u < 0x20 || u == 0x7f) {
            char escaped[8];
            std::snprintf(escaped, sizeof escaped, "\\x%02x", u);
            out += escaped;
        } else {
            out += c;
        }
    }
    if (s.size() > 40) out += "...";
    return out;
}

[[noreturn]] void fail(const std::string& name, std::size_t line, const std::string& what) {
    std::string message = name;
    message.append(":").append(std::to_string(line)).append(": ").append(what);
    throw InputError(message);
}

/// A number by std::from_chars: an optional leading '+', then the whole field.
std::optional<double> to_number(std::string_view s) {
    if (!s.empty() && s.front() == '+') s.remove_prefix(1);
    if (s.empty() || s.front() == '+') return std::nullopt;
    double v = 0;
    const auto [ptr, ec] = std::from_chars(s.data(), s.data() + s.size(), v, std::chars_format::general);
    if (ptr != s.data() + s.size()) return std::nullopt;
    if (ec == std::errc::result_out_of_range) return std::nullopt;
    if (ec != std::errc()) return std::nullopt;
    return v;
}

/// Checks one point against the previous; `what` names the columns for messages.
void check_point(const std::string& name, std::size_t line, double two_theta, double intensity,
                 const double* sigma, const std::vector<double>& previous_angles) {
    auto finite = [&](double v, const char* column) {
        if (std::isnan(v)) fail(name, line, std::string(column) + " is NaN; every value must be a finite number");
        if (std::isinf(v)) fail(name, line, std::string(column) + " is infinite; every value must be a finite number");
    };
    finite(two_theta, "2θ");
    finite(intensity, "the intensity");
    if (sigma) finite(*sigma, "σ");
    if (two_theta < 0 || two_theta >= 180)
        fail(name, line, "2θ = " + format_number(two_theta, 8) + "° is outside [0°, 180°)");
    if (sigma && *sigma < 0) fail(name, line, "σ = " + format_number(*sigma, 6) + " is negative");
    if (!previous_angles.empty() && !(two_theta > previous_angles.back()))
        fail(name, line, "2θ = " + format_number(two_theta, 10) + "° does not increase (previous point " +
                             format_number(previous_angles.back(), 10) + "°); points must be in increasing 2θ");
}

// ---------------------------------------------------------------- plain text

/// Up to 4 fields of a line split at `sep` (' ': runs of blanks). Returns the field count.
std::size_t split_fields(std::string_view line, char sep, std::array<std::string_view, 4>& fields) {
    std::size_t n = 0;
    if (sep == ' ') {
        std::size_t i = 0;
        while (i < line.size()) {
            while (i < line.size() && is_blank(line[i])) ++i;
            if (i >= line.size()) break;
            const std::size_t start = i;
            while (i < line.size() && !is_blank(line[i])) ++i;
            if (n < fields.size()) fields[n] = line.substr(start, i - start);
            ++n;
        }
        return n;
    }
    std::size_t start = 0;
    for (;;) {
        const std::size_t end = line.find(sep, start);
        const std::string_view f = trim(line.substr(start, end == std::string_view::npos ? line.npos : end - start));
        if (n < fields.size()) fields[n] = f;
        ++n;
        if (end == std::string_view::npos) break;
        start = end + 1;
    }
    // A separator closing the line ("10;20;") leaves an empty last field: not a column.
    if (n > 0 && n <= fields.size() && fields[n - 1].empty() && n > 1) --n;
    return n;
}

/// A field as a number; in a semicolon file a decimal comma counts as the decimal point.
std::optional<double> field_number(std::string_view f, bool comma_decimal, bool& saw_comma) {
    if (!comma_decimal || f.find(',') == std::string_view::npos) return to_number(f);
    if (f.find('.') != std::string_view::npos || f.size() > 63) return std::nullopt;
    char buffer[64];
    std::size_t commas = 0;
    for (std::size_t i = 0; i < f.size(); ++i) {
        buffer[i] = f[i] == ',' ? '.' : f[i];
        commas += f[i] == ',';
    }
    if (commas != 1) return std::nullopt;
    saw_comma = true;
    return to_number(std::string_view(buffer, f.size()));
}

char separator_of(std::string_view line) {
    if (line.find(';') != std::string_view::npos) return ';';
    if (line.find(',') != std::string_view::npos) return ',';
    return ' ';
}

const char* separator_name(char sep) { return sep == ';' ? "semicolons" : sep == ',' ? "commas" : "white space"; }

}  // namespace

Pattern parse_text_pattern(std::string_view text, const std::string& name) {
    Pattern p;
    p.name = name;
    p.format = PatternFormat::text;
    auto& rep = p.report;
    if (text.substr(0, 3) == "\xEF\xBB\xBF") text.remove_prefix(3);  // a UTF-8 byte-order mark
    bool in_data = false;
    char sep = ' ';
    std::size_t columns = 0, first_data_line = 0;
    std::size_t line_no = 0;
    std::size_t pos = 0;
    std::array<std::string_view, 4> fields;
    while (pos < text.size()) {
        std::size_t end = text.find('\n', pos);
        if (end == std::string_view::npos) end = text.size();
        std::string_view line = text.substr(pos, end - pos);
        pos = end + 1;
        ++line_no;
        if (!line.empty() && line.back() == '\r') {
            line.remove_suffix(1);
            rep.crlf = true;
        }
        const std::string_view t = trim(line);
        if (t.empty()) {
            ++rep.blank_lines;
            continue;
        }
        if (t.front() == '#' || t.front() == '!') {
            ++rep.comment_lines;
            if (!in_data && p.header.size() < 200) p.header.emplace_back(line);
            continue;
        }
        std::string_view data = t;
        if (const auto hash = data.find('#'); hash != std::string_view::npos) data = trim(data.substr(0, hash));
        if (!in_data) {
            // Before the data: a line whose fields are all numbers starts the data; any other is a header.
            const char candidate = separator_of(data);
            const std::size_t n = split_fields(data, candidate, fields);
            bool numeric = n >= 1;
            bool comma = false;
            for (std::size_t i = 0; i < std::min(n, fields.size()) && numeric; ++i)
                numeric = field_number(fields[i], candidate == ';', comma).has_value();
            if (!numeric || n == 1) {
                ++rep.header_lines;
                if (p.header.size() < 200) p.header.emplace_back(line);
                continue;
            }
            if (n > 3)
                fail(name, line_no, std::to_string(n) + " columns; expected 2 or 3 (2θ in degrees, intensity, optional σ)");
            in_data = true;
            sep = candidate;
            columns = n;
            first_data_line = line_no;
            rep.separator = sep;
            if (columns == 3) p.sigma.reserve(text.size() / 24);
            p.two_theta_deg.reserve(text.size() / 16);
            p.intensity.reserve(text.size() / 16);
            p.line.reserve(text.size() / 16);
        }
        const std::size_t n = split_fields(data, sep, fields);
        double v[3] = {0, 0, 0};
        for (std::size_t i = 0; i < std::min<std::size_t>(n, 3); ++i) {
            bool comma = false;
            const auto x = field_number(fields[i], sep == ';', comma);
            if (!x) {
                const char* column = i == 0 ? "2θ" : i == 1 ? "intensity" : "σ";
                std::string what = std::string(column) + " '" + shown(fields[i]) + "' is not a number";
                if (p.two_theta_deg.empty()) what += " (the header, if any, must come before the data)";
                else what += " (text after the data rows?)";
                fail(name, line_no, what);
            }
            rep.decimal_comma = rep.decimal_comma || comma;
            v[i] = *x;
        }
        if (n != columns)
            fail(name, line_no,
                 std::to_string(n) + (n == 1 ? " column" : " columns") + " where the first data row (line " +
                     std::to_string(first_data_line) + ") has " + std::to_string(columns) + " separated by " +
                     separator_name(sep));
        check_point(name, line_no, v[0], v[1], columns == 3 ? &v[2] : nullptr, p.two_theta_deg);
        if (p.two_theta_deg.size() >= kMaxPatternPoints)
            fail(name, line_no, "more than " + std::to_string(kMaxPatternPoints) + " points in one file");
        p.two_theta_deg.push_back(v[0]);
        p.intensity.push_back(v[1]);
        if (columns == 3) p.sigma.push_back(v[2]);
        p.line.push_back(line_no);
    }
    rep.lines = line_no;
    rep.data_rows = p.two_theta_deg.size();
    if (p.two_theta_deg.empty())
        fail(name, std::max<std::size_t>(line_no, 1),
             "no data rows: expected lines of 2θ (degrees), intensity and optional σ separated by white space, "
             "commas or semicolons");
    return p;
}

// ---------------------------------------------------------------- pdCIF

namespace {

enum class TokenKind { tag, value, loop, data, other_keyword };

struct Token {
    TokenKind kind;
    std::string_view text;
    std::size_t line;
    std::size_t begin, end;  ///< byte offsets in the source
};

std::vector<Token> tokenize_cif(std::string_view s, const std::string& name, std::size_t& comment_lines,
                                std::size_t& lines, bool& crlf) {
    std::vector<Token> tokens;
    tokens.reserve(s.size() / 8);
    std::size_t i = 0, line = 1;
    bool line_start = true;  // only blanks since the last newline
    comment_lines = 0;
    while (i < s.size()) {
        const char c = s[i];
        if (c == '\n') {
            ++line;
            ++i;
            line_start = true;
            continue;
        }
        if (c == '\r') {
            crlf = true;
            ++i;
            continue;
        }
        if (is_blank(c)) {
            ++i;
            continue;
        }
        if (c == '#') {
            if (line_start) ++comment_lines;
            while (i < s.size() && s[i] != '\n') ++i;
            continue;
        }
        const std::size_t begin = i, start_line = line;
        const bool at_line_start = line_start && (i == 0 || s[i - 1] == '\n');
        line_start = false;
        if (c == ';' && at_line_start) {
            // A text field: up to a line that begins with ';'.
            std::size_t j = i + 1;
            for (;;) {
                const std::size_t nl = s.find('\n', j);
                if (nl == std::string_view::npos) fail(name, start_line, "text field opened by ';' is never closed");
                ++line;
                if (nl + 1 < s.size() && s[nl + 1] == ';') {
                    i = nl + 2;
                    break;
                }
                j = nl + 1;
            }
            tokens.push_back({TokenKind::value, s.substr(begin + 1, i - begin - 2), start_line, begin, i});
            continue;
        }
        if (c == '\'' || c == '"') {
            std::size_t j = i + 1;
            for (;;) {
                if (j >= s.size() || s[j] == '\n' || s[j] == '\r') fail(name, start_line, std::string("quoted value opened by ") + c + " is never closed");
                if (s[j] == c && (j + 1 >= s.size() || is_blank(s[j + 1]) || s[j + 1] == '\n' || s[j + 1] == '\r')) break;
                ++j;
            }
            tokens.push_back({TokenKind::value, s.substr(i + 1, j - i - 1), start_line, begin, j + 1});
            i = j + 1;
            continue;
        }
        std::size_t j = i;
        while (j < s.size() && !is_blank(s[j]) && s[j] != '\n' && s[j] != '\r') ++j;
        const std::string_view word = s.substr(i, j - i);
        i = j;
        TokenKind kind = TokenKind::value;
        if (word.front() == '_') {
            kind = TokenKind::tag;
        } else if (word.size() >= 5) {
            const std::string head = lower(word.substr(0, 5));
            if (head == "loop_" && word.size() == 5) kind = TokenKind::loop;
            else if (head == "data_") kind = TokenKind::data;
            else if (head == "save_" || (word.size() >= 7 && lower(word.substr(0, 7)) == "global_") ||
                     (head == "stop_" && word.size() == 5))
                kind = TokenKind::other_keyword;
        }
        tokens.push_back({kind, word, start_line, begin, j});
    }
    lines = line - (s.empty() || s.back() == '\n' ? 1 : 0);
    return tokens;
}

struct CifLoop {
    std::vector<std::string> tags;  ///< lower case
    std::vector<std::string_view> spelled;
    std::vector<std::size_t> values;  ///< token indices
    std::size_t begin = 0, end = 0, line = 0;
    std::size_t block = 0;
};

struct CifItem {
    std::string_view value;
    std::size_t line;
    std::size_t block;
};

/// A CIF number with its standard uncertainty in parentheses: "123.4(12)" → 123.4, 1.2.
std::optional<std::pair<double, double>> cif_number(std::string_view s) {
    double su = 0;
    const auto open = s.find('(');
    std::string_view value = s;
    if (open != std::string_view::npos) {
        if (s.back() != ')') return std::nullopt;
        const std::string_view digits = s.substr(open + 1, s.size() - open - 2);
        value = s.substr(0, open);
        std::uint64_t d = 0;
        const auto [ptr, ec] = std::from_chars(digits.data(), digits.data() + digits.size(), d);
        if (digits.empty() || ec != std::errc() || ptr != digits.data() + digits.size()) return std::nullopt;
        // The uncertainty applies to the last digit of the mantissa.
        std::string_view mantissa = value;
        int exponent = 0;
        if (const auto e = value.find_first_of("eE"); e != std::string_view::npos) {
            mantissa = value.substr(0, e);
            std::string_view ex = value.substr(e + 1);
            if (!ex.empty() && ex.front() == '+') ex.remove_prefix(1);
            const auto [p2, ec2] = std::from_chars(ex.data(), ex.data() + ex.size(), exponent);
            if (ec2 != std::errc() || p2 != ex.data() + ex.size()) return std::nullopt;
        }
        int decimals = 0;
        if (const auto dot = mantissa.find('.'); dot != std::string_view::npos)
            decimals = static_cast<int>(mantissa.size() - dot - 1);
        su = static_cast<double>(d) * std::pow(10.0, exponent - decimals);
    }
    const auto v = to_number(value);
    if (!v) return std::nullopt;
    return std::pair{*v, su};
}

constexpr std::array<const char*, 3> kAngleItems = {"_pd_meas_2theta_scan", "_pd_meas_angle_2theta",
                                                    "_pd_proc_2theta_corrected"};
constexpr std::array<const char*, 3> kIntensityItems = {"_pd_proc_intensity_total", "_pd_meas_intensity_total",
                                                        "_pd_meas_counts_total"};

}  // namespace

Pattern parse_cif_pattern(std::string_view text, const std::string& name) {
    Pattern p;
    p.name = name;
    p.format = PatternFormat::cif;
    auto& rep = p.report;
    const auto tokens = tokenize_cif(text, name, rep.comment_lines, rep.lines, rep.crlf);

    std::vector<CifLoop> loops;
    std::vector<std::pair<std::string, CifItem>> items;
    std::vector<std::string> blocks;
    std::size_t k = 0;
    while (k < tokens.size()) {
        const Token& t = tokens[k];
        if (t.kind == TokenKind::data) {
            blocks.emplace_back(t.text);
            ++k;
        } else if (t.kind == TokenKind::tag) {
            if (k + 1 >= tokens.size() || tokens[k + 1].kind != TokenKind::value)
                fail(name, t.line, "item " + shown(t.text) + " has no value");
            items.push_back({lower(t.text), {tokens[k + 1].text, tokens[k + 1].line, blocks.size()}});
            k += 2;
        } else if (t.kind == TokenKind::loop) {
            CifLoop loop;
            loop.begin = t.begin;
            loop.line = t.line;
            loop.block = blocks.size();
            loop.end = t.end;
            ++k;
            while (k < tokens.size() && tokens[k].kind == TokenKind::tag) {
                loop.tags.push_back(lower(tokens[k].text));
                loop.spelled.push_back(tokens[k].text);
                loop.end = tokens[k].end;
                ++k;
            }
            if (loop.tags.empty()) fail(name, t.line, "loop_ without item names");
            while (k < tokens.size() && tokens[k].kind == TokenKind::value) {
                loop.values.push_back(k);
                loop.end = tokens[k].end;
                ++k;
            }
            if (loop.values.size() % loop.tags.size() != 0)
                fail(name, t.line,
                     "the loop has " + std::to_string(loop.values.size()) + " values, not a whole number of rows of " +
                         std::to_string(loop.tags.size()) + " items");
            loops.push_back(std::move(loop));
        } else if (t.kind == TokenKind::value) {
            fail(name, t.line, "value '" + shown(t.text) + "' without an item name");
        } else {
            ++k;  // save_ frames and global_ are not used by pdCIF patterns: passed over
        }
    }
    if (blocks.empty()) fail(name, 1, "no data_ block: not a CIF file");

    // The pattern loop: the one holding an intensity item.
    const CifLoop* loop = nullptr;
    std::size_t intensity_col = 0;
    std::size_t patterns = 0;
    for (const auto& l : loops) {
        for (const char* item : kIntensityItems) {
            const auto it = std::find(l.tags.begin(), l.tags.end(), item);
            if (it == l.tags.end()) continue;
            ++patterns;
            if (!loop) {
                loop = &l;
                intensity_col = static_cast<std::size_t>(it - l.tags.begin());
            }
            break;
        }
    }
    if (!loop)
        fail(name, 1, "no powder pattern: no loop with _pd_proc_intensity_total, _pd_meas_intensity_total or "
                      "_pd_meas_counts_total");
    if (patterns > 1)
        fail(name, loop->line, "holds " + std::to_string(patterns) + " powder patterns; give one pattern per file");
    const std::size_t columns = loop->tags.size();
    const std::size_t rows = loop->values.size() / columns;
    rep.intensity_item = std::string(loop->spelled[intensity_col]);

    std::optional<std::size_t> angle_col;
    for (const char* item : kAngleItems) {
        const auto it = std::find(loop->tags.begin(), loop->tags.end(), item);
        if (it != loop->tags.end()) {
            angle_col = static_cast<std::size_t>(it - loop->tags.begin());
            break;
        }
    }
    for (std::size_t c = 0; c < columns; ++c)
        if (c != intensity_col && (!angle_col || c != *angle_col)) rep.dropped_items.emplace_back(loop->spelled[c]);
    if (rows == 0) fail(name, loop->line, "the pattern loop has no rows");

    auto block_item = [&](const std::string& tag) -> const CifItem* {
        for (const auto& [t, item] : items)
            if (t == tag && item.block == loop->block) return &item;
        return nullptr;
    };
    // The corrected copy adds _pd_proc_intensity_total: it must not be in the block already.
    if (rep.intensity_item != "_pd_proc_intensity_total")
        if (const CifItem* clash = block_item("_pd_proc_intensity_total"))
            fail(name, clash->line, "_pd_proc_intensity_total is already given outside the pattern loop; the "
                                    "corrected copy would repeat it");

    std::vector<double> grid;
    if (angle_col) {
        rep.angle_item = std::string(loop->spelled[*angle_col]);
        p.cif_angle_column = true;
    } else {
        // The 2θ grid from the range items (start, increment and a stop or a count).
        auto number_item = [&](const std::string& tag) -> std::optional<std::pair<double, std::size_t>> {
            const CifItem* item = block_item(tag);
            if (!item) return std::nullopt;
            const auto v = cif_number(item->value);
            if (!v || !std::isfinite(v->first)) fail(name, item->line, tag + " '" + shown(item->value) + "' is not a number");
            return std::pair{v->first, item->line};
        };
        bool found = false;
        for (const char* prefix : {"_pd_meas_", "_pd_proc_"}) {
            const std::string pre = prefix;
            const auto min = number_item(pre + "2theta_range_min");
            const auto inc = number_item(pre + "2theta_range_inc");
            const auto max = number_item(pre + "2theta_range_max");
            const auto count = number_item(pre + "number_of_points");
            if (!min) continue;
            if (!inc) fail(name, min->second, pre + "2theta_range_min is given without " + pre + "2theta_range_inc");
            if (!(inc->first > 0)) fail(name, inc->second, pre + "2theta_range_inc must be positive");
            std::size_t n = 0;
            if (count) {
                if (count->first < 1 || count->first != std::floor(count->first) || count->first > 1e9)
                    fail(name, count->second, pre + "number_of_points must be a positive whole number");
                n = static_cast<std::size_t>(count->first);
            }
            if (max) {
                const double steps = (max->first - min->first) / inc->first;
                if (steps < 0 || std::abs(steps - std::round(steps)) > 1e-6 || steps > 1e9)
                    fail(name, max->second, "the 2θ range " + format_number(min->first, 10) + "° to " +
                                                format_number(max->first, 10) + "° is not a whole number of steps of " +
                                                format_number(inc->first, 10) + "°");
                const auto from_range = static_cast<std::size_t>(std::llround(steps)) + 1;
                if (count && from_range != n)
                    fail(name, count->second, pre + "number_of_points " + std::to_string(n) + " disagrees with the range (" +
                                                  std::to_string(from_range) + " points)");
                n = from_range;
            }
            if (n == 0)
                fail(name, min->second, pre + "2theta_range_min needs " + pre + "2theta_range_max or " + pre +
                                            "number_of_points");
            if (n != rows)
                fail(name, loop->line, "the pattern loop has " + std::to_string(rows) + " rows but the 2θ range gives " +
                                           std::to_string(n) + " points");
            grid.resize(n);
            for (std::size_t i = 0; i < n; ++i) grid[i] = min->first + static_cast<double>(i) * inc->first;
            rep.angle_item = pre + "2theta_range_min/inc/" + (max ? "max" : "number_of_points");
            found = true;
            break;
        }
        if (!found)
            fail(name, loop->line, "the pattern loop has no 2θ item (_pd_meas_2theta_scan, _pd_meas_angle_2theta) "
                                   "and the block gives no _pd_meas_2theta_range_min/inc/max");
    }

    p.two_theta_deg.reserve(rows);
    p.intensity.reserve(rows);
    p.line.reserve(rows);
    bool any_su = false;
    std::vector<double> su(rows, 0.0);
    for (std::size_t r = 0; r < rows; ++r) {
        const Token& it = tokens[loop->values[r * columns + intensity_col]];
        double two_theta = 0;
        if (angle_col) {
            const Token& at = tokens[loop->values[r * columns + *angle_col]];
            const auto a = cif_number(at.text);
            if (!a) fail(name, at.line, "2θ '" + shown(at.text) + "' is not a number");
            two_theta = a->first;
        } else {
            two_theta = grid[r];
        }
        if (it.text == "?" || it.text == ".")
            fail(name, it.line, "intensity '" + std::string(it.text) + "' (unknown) in the pattern loop");
        const auto v = cif_number(it.text);
        if (!v)
            fail(name, it.line, "intensity '" + shown(it.text) + "' is not a number" +
                                    (it.text.find('(') != std::string_view::npos
                                         ? " with a standard uncertainty (digits in parentheses, as 100.5(10))"
                                         : ""));
        su[r] = v->second;
        any_su = any_su || v->second > 0;
        check_point(name, it.line, two_theta, v->first, &su[r], p.two_theta_deg);
        p.two_theta_deg.push_back(two_theta);
        p.intensity.push_back(v->first);
        p.line.push_back(it.line);
    }
    if (any_su) p.sigma = std::move(su);
    rep.data_rows = rows;
    p.cif_text = std::string(text);
    p.cif_loop_begin = loop->begin;
    p.cif_loop_end = loop->end;
    return p;
}

PatternFormat detect_pattern_format(std::string_view text, const std::string& name) {
    const std::string ext = lower(fs::path(name).extension().string());
    if (ext == ".cif") return PatternFormat::cif;
    std::size_t pos = 0;
    while (pos < text.size()) {
        std::size_t end = text.find('\n', pos);
        if (end == std::string_view::npos) end = text.size();
        const std::string_view t = trim(text.substr(pos, end - pos));
        pos = end + 1;
        if (t.empty() || t.front() == '#' || t == "\r") continue;
        return lower(t.substr(0, 5)) == "data_" ? PatternFormat::cif : PatternFormat::text;
    }
    return PatternFormat::text;
}

Pattern read_pattern(const fs::path& path) {
    const std::string name = path.string();
    std::error_code ec;
    if (fs::is_directory(path, ec)) throw FileError(name + ": cannot read: it is a directory");
    std::ifstream in(path, std::ios::binary);
    if (!in) throw FileError(name + ": cannot read: " + std::strerror(errno));
    std::string text;
    in.seekg(0, std::ios::end);
    const auto size = in.tellg();
    if (size > 0 && static_cast<std::uintmax_t>(size) > kMaxPatternFileBytes)
        throw FileError(name + ": cannot read: the file is " + std::to_string(static_cast<std::uintmax_t>(size)) +
                        " bytes, above the limit of 64 MiB for one pattern");
    if (size > 0) {
        text.resize(static_cast<std::size_t>(size));
        in.seekg(0);
        in.read(text.data(), static_cast<std::streamsize>(size));
    }
    if (in.bad()) throw FileError(name + ": cannot read: read error");
    return detect_pattern_format(text, name) == PatternFormat::cif ? parse_cif_pattern(text, name)
                                                                    : parse_text_pattern(text, name);
}

// ---------------------------------------------------------------- writing

namespace {

void append_number(std::string& out, double v, bool decimal_comma) {
    char buffer[32];
    const auto [ptr, ec] = std::to_chars(buffer, buffer + sizeof buffer, v);
    if (ec != std::errc()) throw InputError("cannot format a number");
    if (decimal_comma)
        for (char* c = buffer; c != ptr; ++c)
            if (*c == '.') *c = ',';
    out.append(buffer, ptr);
}

/// ASCII spellings of the symbols messages use (CIF 1.1 comments are ASCII).
constexpr std::pair<std::string_view, std::string_view> kAsciiSpellings[] = {
    {"μ", "mu"}, {"µ", "u"}, {"θ", "theta"}, {"σ", "sigma"}, {"α", "alpha"}, {"β", "beta"}, {"°", " deg"},
    {"²", "2"}, {"³", "3"}, {"·", "."}, {"×", "x"}, {"−", "-"}, {"→", "->"}, {"∞", "inf"}, {"Å", "A"}};

/// Provenance as comment lines: printable ASCII only (CIF 1.1 allows nothing else), long lines wrapped.
void append_comments(std::string& out, std::span<const std::string> lines) {
    for (const auto& l : lines) {
        std::string clean;
        for (std::size_t i = 0; i < l.size(); ++i) {
            const char c = l[i];
            const auto u = static_cast<unsigned char>(c);
            bool spelled = false;
            for (const auto& [utf8, ascii] : kAsciiSpellings)
                if (std::string_view(l).substr(i, utf8.size()) == utf8) {
                    clean += ascii;
                    i += utf8.size() - 1;
                    spelled = true;
                    break;
                }
            if (spelled) continue;
            if (u >= 0x20 && u < 0x7f) {
                clean += c;
            } else {
                char escaped[8];
                std::snprintf(escaped, sizeof escaped, "\\x%02x", u);
                clean += escaped;
            }
        }
        constexpr std::size_t kWidth = 1000;  // CIF 1.1 lines stay below 2048 characters
        std::size_t start = 0;
        do {
            out.append(start == 0 ? "# " : "#   ");
            out.append(clean, start, kWidth);
            out.push_back('\n');
            start += kWidth;
        } while (start < clean.size());
    }
}

}  // namespace

std::string cif_value_with_su(double value, double su) {
    if (!(su > 0) || !std::isfinite(su) || !std::isfinite(value)) {
        std::string out;
        append_number(out, value, false);
        return out;
    }
    // Two significant digits of the uncertainty; the value rounded to the same place.
    int place = static_cast<int>(std::floor(std::log10(su))) - 1;
    double digits = std::round(su / std::pow(10.0, place));
    if (digits >= 100) {  // 99.6 rounds up to 100: one place further
        ++place;
        digits = std::round(su / std::pow(10.0, place));
    }
    char buffer[400];
    if (place < 0) {
        std::snprintf(buffer, sizeof buffer, "%.*f(%.0f)", -place, value, digits);
    } else {
        const double scale = std::pow(10.0, place);
        std::snprintf(buffer, sizeof buffer, "%.0f(%.0f)", std::round(value / scale) * scale, digits * scale);
    }
    return buffer;
}

std::string render_pattern(const Pattern& source, std::span<const double> intensity, std::span<const double> sigma,
                           std::span<const PatternColumn> extra, std::span<const std::string> provenance) {
    const std::size_t n = source.size();
    if (intensity.size() != n || (!sigma.empty() && sigma.size() != n))
        throw InputError("render_pattern: columns of different lengths");
    for (const auto& c : extra)
        if (c.values.size() != n) throw InputError("render_pattern: columns of different lengths");
    std::string out;
    if (source.format == PatternFormat::text) {
        out.reserve(n * (24 * (3 + extra.size())) + 4096);
        append_comments(out, provenance);
        if (!source.header.empty()) {
            out.append("# The input's header and comment lines:\n");
            std::vector<std::string> quoted;
            for (const auto& h : source.header) quoted.push_back("> " + h);
            append_comments(out, quoted);
        }
        const bool comma = source.report.decimal_comma;
        const char sep = source.report.separator;
        out.append("# two_theta_deg");
        out.push_back(sep);
        out.append("intensity");
        if (!sigma.empty()) {
            out.push_back(sep);
            out.append("sigma");
        }
        for (const auto& c : extra) {
            out.push_back(sep);
            out.append(c.text_name);
        }
        out.push_back('\n');
        for (std::size_t i = 0; i < n; ++i) {
            append_number(out, source.two_theta_deg[i], comma);
            out.push_back(sep);
            append_number(out, intensity[i], comma);
            if (!sigma.empty()) {
                out.push_back(sep);
                append_number(out, sigma[i], comma);
            }
            for (const auto& c : extra) {
                out.push_back(sep);
                append_number(out, c.values[i], comma);
            }
            out.push_back('\n');
        }
        return out;
    }
    // CIF: the source with its pattern loop replaced; the provenance after the CIF version line.
    const std::string_view text = source.cif_text;
    out.reserve(text.size() + n * 24 * (1 + extra.size()) + 4096);
    std::size_t head = 0;
    if (text.substr(0, 7) == "#\\#CIF_") {
        head = text.find('\n');
        head = head == std::string_view::npos ? text.size() : head + 1;
        out.append(text.substr(0, head));
        if (out.back() != '\n') out.push_back('\n');
    }
    append_comments(out, provenance);
    out.append(text.substr(head, source.cif_loop_begin - head));
    out.append("loop_\n");
    std::string angle_name = source.report.angle_item;
    if (source.cif_angle_column) out.append(angle_name).append("\n");
    out.append("_pd_proc_intensity_total\n");
    for (const auto& c : extra) out.append(c.cif_name).append("\n");
    for (std::size_t i = 0; i < n; ++i) {
        if (source.cif_angle_column) {
            append_number(out, source.two_theta_deg[i], false);
            out.push_back(' ');
        }
        if (sigma.empty()) append_number(out, intensity[i], false);
        else out.append(cif_value_with_su(intensity[i], sigma[i]));
        for (const auto& c : extra) {
            out.push_back(' ');
            append_number(out, c.values[i], false);
        }
        out.push_back('\n');
    }
    std::string_view rest = text.substr(source.cif_loop_end);
    if (!rest.empty() && rest.front() == '\r') rest.remove_prefix(1);
    if (!rest.empty() && rest.front() == '\n') rest.remove_prefix(1);
    out.append(rest);
    return out;
}

fs::path corrected_output_path(const fs::path& input, const fs::path& dir) {
    const fs::path file = input.filename();
    std::string name = file.stem().string();
    name.append(".corrected");
    name.append(file.extension().string());
    return dir / name;
}

void check_output_path(const fs::path& output, std::span<const fs::path> inputs, bool replace_existing,
                       std::string_view how_to_replace) {
    std::error_code ec;
    const auto status = fs::status(output, ec);
    if (!fs::exists(status)) return;
    for (const auto& in : inputs) {
        std::error_code eq;
        if (fs::equivalent(output, in, eq))
            throw FileError(output.string() + ": is the input file " + in.string() + "; an input is never overwritten");
    }
    if (!replace_existing) throw FileError(output.string() + ": exists; " + std::string(how_to_replace));
    if (fs::is_directory(status)) throw FileError(output.string() + ": is a directory");
}

void write_file_atomically(const fs::path& target, const std::function<void(std::ostream&)>& write,
                           bool replace_existing) {
    static std::atomic<unsigned long> counter{0};
    const std::string where = target.string();
    std::string tmp_name = ".";
    tmp_name.append(target.filename().string());
    tmp_name.append(".tmp-");
    tmp_name.append(std::to_string(::getpid()));
    tmp_name.append("-");
    tmp_name.append(std::to_string(counter++));
    const fs::path tmp = target.parent_path() / tmp_name;
    auto cleanup = [&] {
        std::error_code ignored;
        fs::remove(tmp, ignored);
    };
    {
        const int fd = ::open(tmp.c_str(), O_WRONLY | O_CREAT | O_EXCL | O_CLOEXEC, 0666);
        if (fd < 0) throw FileError(where + ": cannot write: " + std::strerror(errno));
        ::close(fd);
        std::ofstream out(tmp, std::ios::binary | std::ios::trunc);
        if (!out) {
            cleanup();
            throw FileError(where + ": cannot write: " + std::strerror(errno));
        }
        try {
            write(out);
            out.flush();
        } catch (...) {
            out.close();
            cleanup();
            throw;
        }
        if (!out) {
            const int err = errno;
            out.close();
            cleanup();
            throw FileError(where + ": cannot write: " + (err ? std::strerror(err) : "write error"));
        }
        out.close();
        if (!out) {
            cleanup();
            throw FileError(where + ": cannot write: error on closing");
        }
    }
    if (!replace_existing) {
        // link() fails when the target exists: no window in which another file could be replaced.
        if (::link(tmp.c_str(), target.c_str()) == 0) {
            cleanup();
            return;
        }
        const int err = errno;
        if (err == EEXIST) {
            cleanup();
            throw FileError(where + ": exists; it is not replaced unless asked");
        }
        std::error_code exists_ec;
        if (fs::exists(target, exists_ec)) {
            cleanup();
            throw FileError(where + ": exists; it is not replaced unless asked");
        }
        // File systems without hard links: fall back to rename.
    }
    std::error_code ec;
    fs::rename(tmp, target, ec);
    if (ec) {
        cleanup();
        throw FileError(where + ": cannot write: " + ec.message());
    }
}

void write_file_atomically(const fs::path& target, std::string_view content, bool replace_existing) {
    write_file_atomically(
        target, [&](std::ostream& out) { out.write(content.data(), static_cast<std::streamsize>(content.size())); },
        replace_existing);
}

}  // namespace mudepth
