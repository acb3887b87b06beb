// Chemical formula parser: element symbols, counts, nested ( ) and [ ], hydrate
// parts, D and T. A hand-written scanner over code points with an explicit
// stack (no recursion), so any byte sequence gives a result or an InputError.
#include "mudepth/formula.hpp"

#include <charconv>
#include <cmath>
#include <cstdint>
#include <string>
#include <system_error>
#include <vector>

#include "mudepth/elements.hpp"
#include "mudepth/error.hpp"

namespace mudepth {

namespace {

// Atomic masses of the hydrogen isotopes, g/mol: AME2016 (Wang et al., Chinese
// Physics C 41 (2017) 030003), from memory.
constexpr double kDeuteriumMass_g_mol = 2.01410177812;
constexpr double kTritiumMass_g_mol = 3.0160492779;

constexpr std::size_t kMaxFormulaLength = 4096;  // characters
constexpr int kMaxNesting = 64;
constexpr double kMaxCount = 1e6;   // atoms per formula unit, written or after multiplying (messages say 1000000)
constexpr double kMinCount = 1e-9;  // an effective count below this is a typing mistake
constexpr std::size_t kMaxCountLength = 20;

// One code point of the input, with the 1-based column it starts at.
struct Char {
    char32_t cp;      // code point; 0xFFFFFFFF for an invalid byte
    unsigned char byte;  // the first byte (for messages about invalid bytes)
    int column;
};

constexpr char32_t kInvalid = 0xFFFFFFFF;
constexpr char32_t kMiddleDot = 0x00B7;

std::vector<Char> decode_utf8(std::string_view s) {
    std::vector<Char> out;
    out.reserve(s.size());
    int column = 1;
    std::size_t i = 0;
    while (i < s.size()) {
        const auto b0 = static_cast<unsigned char>(s[i]);
        char32_t cp = kInvalid;
        std::size_t len = 1;
        if (b0 < 0x80) {
            cp = b0;
        } else {
            std::size_t need = 0;
            char32_t min = 0;
            if ((b0 & 0xE0) == 0xC0) { need = 1; cp = b0 & 0x1Fu; min = 0x80; }
            else if ((b0 & 0xF0) == 0xE0) { need = 2; cp = b0 & 0x0Fu; min = 0x800; }
            else if ((b0 & 0xF8) == 0xF0) { need = 3; cp = b0 & 0x07u; min = 0x10000; }
            bool ok = need > 0 && i + need < s.size();
            for (std::size_t k = 1; ok && k <= need; ++k) {
                const auto b = static_cast<unsigned char>(s[i + k]);
                if ((b & 0xC0) != 0x80) ok = false;
                else cp = (cp << 6) | (b & 0x3Fu);
            }
            if (ok && (cp < min || cp > 0x10FFFF || (cp >= 0xD800 && cp <= 0xDFFF))) ok = false;
            if (ok) len = need + 1;
            else cp = kInvalid;
        }
        out.push_back(Char{cp, b0, column});
        ++column;
        i += len;
    }
    return out;
}

std::string encode_utf8(char32_t cp) {
    std::string s;
    if (cp < 0x80) {
        s += static_cast<char>(cp);
    } else if (cp < 0x800) {
        s += static_cast<char>(0xC0 | (cp >> 6));
        s += static_cast<char>(0x80 | (cp & 0x3F));
    } else if (cp < 0x10000) {
        s += static_cast<char>(0xE0 | (cp >> 12));
        s += static_cast<char>(0x80 | ((cp >> 6) & 0x3F));
        s += static_cast<char>(0x80 | (cp & 0x3F));
    } else {
        s += static_cast<char>(0xF0 | (cp >> 18));
        s += static_cast<char>(0x80 | ((cp >> 12) & 0x3F));
        s += static_cast<char>(0x80 | ((cp >> 6) & 0x3F));
        s += static_cast<char>(0x80 | (cp & 0x3F));
    }
    return s;
}

std::string hex_byte(unsigned char b) {
    const char* digits = "0123456789ABCDEF";
    return std::string("0x") + digits[b >> 4] + digits[b & 0xF];
}

// A character as shown in a message: printable text as is, others escaped.
std::string show(const Char& c) {
    if (c.cp == kInvalid) return "\\x" + hex_byte(c.byte).substr(2);
    if (c.cp < 0x20 || c.cp == 0x7F) return "\\x" + hex_byte(static_cast<unsigned char>(c.cp)).substr(2);
    if (c.cp >= 0x80 && c.cp < 0xA0) return "U+00" + hex_byte(static_cast<unsigned char>(c.cp)).substr(2);
    return encode_utf8(c.cp);
}

// The formula as echoed in messages: invalid bytes and control characters
// escaped, long input shortened.
std::string echo(const std::vector<Char>& chars) {
    std::string s;
    std::size_t n = 0;
    for (const auto& c : chars) {
        if (++n > 80) {
            s += "...";
            break;
        }
        s += show(c);
    }
    return s;
}

bool is_upper(char32_t c) { return c >= 'A' && c <= 'Z'; }
bool is_lower(char32_t c) { return c >= 'a' && c <= 'z'; }
bool is_digit(char32_t c) { return c >= '0' && c <= '9'; }
bool is_space(char32_t c) { return c == ' ' || c == '\t'; }
bool is_open(char32_t c) { return c == '(' || c == '['; }
bool is_close(char32_t c) { return c == ')' || c == ']'; }
char32_t partner(char32_t open) { return open == '(' ? U')' : U']'; }

std::string format_count(double x) {
    char buf[64];
    auto r = std::to_chars(buf, buf + sizeof buf, x, std::chars_format::general, 6);
    return std::string(buf, r.ptr);
}

struct Entry {
    std::size_t label;  // index into Parser::labels
    double count;
};

struct Frame {
    std::vector<Entry> entries;
    char32_t open = 0;  // '(' or '['; 0 for the top level of a part
    int column = 0;     // column of the opening bracket
};

class Parser {
public:
    explicit Parser(std::string_view text) : text_(text), chars_(decode_utf8(text)) {}

    Formula parse() {
        if (text_.size() > kMaxFormulaLength * 4 || chars_.size() > kMaxFormulaLength)
            fail("the formula is longer than " + std::to_string(kMaxFormulaLength) + " characters");
        trim();
        if (begin_ == end_) throw InputError("empty formula");

        pos_ = begin_;
        parse_part(/*first=*/true);
        while (pos_ < end_) {
            // parse_part stops only at a hydrate separator.
            const Char sep = chars_[pos_];
            ++pos_;
            skip_space();
            if (pos_ >= end_)
                fail("nothing after the hydrate separator '" + show(sep) + "' at column " +
                     std::to_string(sep.column));
            if (is_separator_start(pos_))
                fail("empty hydrate part after '" + show(sep) + "' at column " +
                     std::to_string(sep.column));
            parse_part(/*first=*/false);
        }
        return finish();
    }

private:
    [[noreturn]] void fail(const std::string& what) const {
        throw InputError("formula '" + echo(chars_) + "': " + what);
    }
    [[noreturn]] void fail_at(const std::string& what, std::size_t i) const {
        fail(what + " at column " + std::to_string(column(i)));
    }
    int column(std::size_t i) const {
        return i < chars_.size() ? chars_[i].column
                                 : (chars_.empty() ? 1 : chars_.back().column + 1);
    }
    char32_t at(std::size_t i) const { return i < end_ ? chars_[i].cp : 0; }

    void trim() {
        begin_ = 0;
        end_ = chars_.size();
        while (begin_ < end_ && is_space(chars_[begin_].cp)) ++begin_;
        while (end_ > begin_ && is_space(chars_[end_ - 1].cp)) --end_;
    }

    void skip_space() {
        while (pos_ < end_ && is_space(at(pos_))) ++pos_;
    }

    // Length of a count (digits with at most one decimal point followed by a
    // digit) starting at i; 0 if none. A count after a symbol or bracket
    // (`trailing`) stops before a '.' that starts a water hydrate part.
    std::size_t count_length(std::size_t i, bool trailing = false) const {
        std::size_t j = i;
        while (is_digit(at(j))) ++j;
        if (j == i) return 0;
        if (at(j) == '.' && is_digit(at(j + 1)) && !(trailing && count_then_water(j + 1))) {
            ++j;
            while (is_digit(at(j))) ++j;
        }
        return j - i;
    }

    // True when a count starting at i is followed by a water group (H2O, D2O,
    // T2O) that ends the formula or is followed by a hydrate separator: then a
    // '.' before the count starts a hydrate part (CuSO4.5H2O), not a decimal.
    bool count_then_water(std::size_t i) const {
        const std::size_t n = count_length(i);
        if (n == 0) return false;
        std::size_t j = i + n;
        const char32_t h = at(j);
        if (!(h == 'H' || h == 'D' || h == 'T') || at(j + 1) != '2' || at(j + 2) != 'O') return false;
        j += 3;
        while (j < end_ && is_space(at(j))) ++j;
        return j >= end_ || is_separator_start(j);
    }

    // Is the character at i a hydrate separator? A '.' is one unless it is the
    // decimal point of a count (see docs/compositions.md, "Formulas").
    bool is_separator_start(std::size_t i) const {
        const char32_t c = at(i);
        if (c == kMiddleDot || c == '*') return true;
        if (c != '.') return false;
        const bool digit_before = i > begin_ && is_digit(at(i - 1));
        const bool digit_after = is_digit(at(i + 1));
        if (digit_before && digit_after) return count_then_water(i + 1);
        return true;
    }

    std::size_t label_index(const std::string& label, int Z, double mass) {
        for (std::size_t k = 0; k < labels_.size(); ++k)
            if (labels_[k].label == label) return k;
        labels_.push_back(FormulaPart{Z, label, 0.0, mass});
        return labels_.size() - 1;
    }

    // Reads a count at pos_ (caller checked a digit is there) and advances.
    double read_count(bool trailing) {
        const std::size_t start = pos_;
        const std::size_t n = count_length(pos_, trailing);
        if (n > kMaxCountLength) fail_at("count is too long (" + std::to_string(n) + " characters)", start);
        std::string digits;
        for (std::size_t k = 0; k < n; ++k) digits += static_cast<char>(at(start + k));
        pos_ = start + n;
        double value = 0;
        auto r = std::from_chars(digits.data(), digits.data() + digits.size(), value);
        if (r.ec != std::errc{} || !std::isfinite(value))
            fail_at("count '" + digits + "' is not a number", start);
        if (value == 0) fail_at("zero count", start);
        if (value > kMaxCount)
            fail_at("count " + digits + " is too large (at most 1000000)", start);
        return value;
    }

    // An element symbol at pos_ (an upper-case letter there).
    void read_element(Frame& frame) {
        const std::size_t start = pos_;
        std::string symbol(1, static_cast<char>(at(pos_)));
        ++pos_;
        if (is_lower(at(pos_))) {
            symbol += static_cast<char>(at(pos_));
            ++pos_;
        }
        int Z = 0;
        double mass = 0;
        if (symbol == "D") {
            Z = 1;
            mass = kDeuteriumMass_g_mol;
        } else if (symbol == "T") {
            Z = 1;
            mass = kTritiumMass_g_mol;
        } else if (auto z = atomic_number(symbol)) {
            Z = *z;
            mass = element(Z).molar_mass_g_mol;
        } else {
            fail_at("unknown element '" + symbol + "'", start);
        }
        double count = 1;
        if (is_digit(at(pos_))) count = read_count(/*trailing=*/true);
        frame.entries.push_back(Entry{label_index(symbol, Z, mass), count});
    }

    void lowercase_hint(std::size_t i) {
        std::size_t j = i;
        std::string run;
        while (is_lower(at(j)) && run.size() < 2) {
            run += static_cast<char>(at(j));
            ++j;
        }
        std::string msg = "element symbols start with a capital letter: '" + run + "'";
        std::string cap = run;
        cap[0] = static_cast<char>(cap[0] - 'a' + 'A');
        if (atomic_number(cap)) {
            msg += " at column " + std::to_string(column(i)) + " (did you mean '" + cap + "'?)";
        } else if (atomic_number(cap.substr(0, 1))) {
            msg += " at column " + std::to_string(column(i)) + " (did you mean '" + cap.substr(0, 1) + "'?)";
        } else {
            msg += " at column " + std::to_string(column(i));
        }
        fail(msg);
    }

    void unexpected(std::size_t i) {
        const Char& c = chars_[i];
        if (c.cp == kInvalid) fail_at("invalid UTF-8 byte " + hex_byte(c.byte), i);
        if (c.cp >= 0x2080 && c.cp <= 0x2089)
            fail_at("subscript digit '" + show(c) + "' (write counts as plain digits: H2O)", i);
        if (is_space(c.cp))
            fail_at("unexpected space (spaces are allowed only around a hydrate separator)", i);
        fail_at("unexpected character '" + show(c) + "'", i);
    }

    // Adds a frame's entries, times `factor`, to `into`, merging equal labels.
    void merge_into(Frame& into, const Frame& from, double factor, std::size_t where) {
        for (const auto& e : from.entries) {
            const double c = e.count * factor;
            bool merged = false;
            for (auto& d : into.entries) {
                if (d.label == e.label) {
                    d.count += c;
                    check_total(d, where);
                    merged = true;
                    break;
                }
            }
            if (!merged) {
                into.entries.push_back(Entry{e.label, c});
                check_total(into.entries.back(), where);
            }
        }
    }

    void check_total(const Entry& e, std::size_t where) const {
        if (!(e.count <= kMaxCount))
            fail_at("the count of '" + labels_[e.label].label + "' reaches " + format_count(e.count) +
                        ", more than 1000000 atoms per formula unit",
                    where);
    }

    // One part: the formula, or a hydrate part with its optional leading count.
    // Stops at the end or at a hydrate separator (pos_ left on it).
    void parse_part(bool first) {
        const std::size_t part_start = pos_;
        double multiplier = 1;
        if (is_digit(at(pos_))) {
            if (first) fail_at("count '" + digits_at(pos_) + "' has no element before it", pos_);
            multiplier = read_count(/*trailing=*/false);
            if (pos_ >= end_ || is_separator_start(pos_))
                fail_at("count '" + digits_at(part_start) + "' has no element after it", part_start);
        }
        std::vector<Frame> stack(1);
        stack.reserve(8);
        while (pos_ < end_) {
            const char32_t c = at(pos_);
            if (is_upper(c)) {
                read_element(stack.back());
            } else if (is_open(c)) {
                if (static_cast<int>(stack.size()) > kMaxNesting)
                    fail_at("brackets nested deeper than " + std::to_string(kMaxNesting), pos_);
                Frame f;
                f.open = c;
                f.column = column(pos_);
                stack.push_back(std::move(f));
                ++pos_;
            } else if (is_close(c)) {
                if (stack.size() == 1)
                    fail_at("unmatched '" + encode_utf8(c) + "'", pos_);
                Frame& top = stack.back();
                if (partner(top.open) != c)
                    fail("mismatched brackets: '" + encode_utf8(top.open) + "' at column " +
                         std::to_string(top.column) + " is closed by '" + encode_utf8(c) +
                         "' at column " + std::to_string(column(pos_)));
                if (top.entries.empty())
                    fail("empty brackets '" + encode_utf8(top.open) + encode_utf8(c) + "' at column " +
                         std::to_string(top.column));
                const std::size_t close_pos = pos_;
                ++pos_;
                double count = 1;
                if (is_digit(at(pos_))) count = read_count(/*trailing=*/true);
                Frame done = std::move(stack.back());
                stack.pop_back();
                merge_into(stack.back(), done, count, close_pos);
            } else if (c == '.' || c == kMiddleDot || c == '*') {
                if (c == '.' && pos_ > begin_ && is_digit(at(pos_ - 1)) && is_digit(at(pos_ + 1)) &&
                    !is_separator_start(pos_)) {
                    // A count stops before a '.' only in the water case, so a
                    // decimal point here follows a complete count: "Fe2.5.5O".
                    fail_at("a second decimal point in a count", pos_);
                }
                if (stack.size() > 1)
                    fail_at("hydrate separator '" + show(chars_[pos_]) + "' inside brackets", pos_);
                if (c == '.' && is_digit(at(pos_ + 1)) && !count_then_water(pos_ + 1) &&
                    !(pos_ > begin_ && is_digit(at(pos_ - 1))))
                    fail_at("ambiguous '.': write a decimal count with a leading digit (Fe0.95O) or a "
                            "hydrate with '·' or '*' (CuSO4·5NH3)",
                            pos_);
                if (pos_ == part_start)
                    fail_at("hydrate separator '" + show(chars_[pos_]) + "' with nothing before it", pos_);
                break;
            } else if (is_space(c)) {
                std::size_t j = pos_;
                while (j < end_ && is_space(at(j))) ++j;
                if (j < end_ && is_separator_start(j) && stack.size() == 1) {
                    pos_ = j;
                    continue;
                }
                unexpected(pos_);
            } else if (is_digit(c)) {
                fail_at("count '" + digits_at(pos_) + "' has no element before it", pos_);
            } else if (is_lower(c)) {
                lowercase_hint(pos_);
            } else {
                unexpected(pos_);
            }
        }
        if (stack.size() > 1) {
            const Frame& open = stack[1];
            fail("unmatched '" + encode_utf8(open.open) + "' at column " + std::to_string(open.column));
        }
        if (stack[0].entries.empty()) fail_at("no element", part_start);
        merge_into(total_, stack[0], multiplier, part_start);
    }

    std::string digits_at(std::size_t i) const {
        std::string s;
        const std::size_t n = count_length(i);
        for (std::size_t k = 0; k < n && k < kMaxCountLength; ++k) s += static_cast<char>(at(i + k));
        return s;
    }

    Formula finish() {
        Formula f;
        f.text = std::string(text_);
        for (const auto& e : total_.entries) {
            if (!(e.count >= kMinCount))
                fail("the count of '" + labels_[e.label].label + "' is " + format_count(e.count) +
                     ", too small");
            labels_[e.label].count = e.count;
        }
        // Order of first appearance in the text: labels_ is in that order.
        for (const auto& p : labels_)
            if (p.count > 0) f.parts.push_back(p);
        return f;
    }

    std::string_view text_;
    std::vector<Char> chars_;
    std::size_t begin_ = 0, end_ = 0, pos_ = 0;
    std::vector<FormulaPart> labels_;
    Frame total_;
};

}  // namespace

double Formula::molar_mass_g_mol() const {
    double m = 0;
    for (const auto& p : parts) m += p.count * p.molar_mass_g_mol;
    return m;
}

Formula parse_formula(std::string_view text) { return Parser(text).parse(); }

}  // namespace mudepth
