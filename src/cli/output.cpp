// Printing helpers of the command line.
#include "cli/output.hpp"

#include <algorithm>
#include <cctype>
#include <cmath>
#include <cstdio>
#include <ostream>

#include "format.hpp"

namespace mudepth::cli {

const char* const kCautions =
    "Cautions: attenuation figures are narrow-beam figures for sample planning and data\n"
    "correction, not a radiation-shielding calculation; follow your local radiation-protection\n"
    "rules and your radiation safety officer. Many powders are toxic or respirable (compounds of\n"
    "Be, Pb, Cd, Tl, As, and fine silica): follow the safety data sheet. Capillaries are glass sharps.";

std::string fmt(double value, int digits) { return format_number(value, digits); }

std::string fixed(double value, int decimals) {
    char buffer[64];
    std::snprintf(buffer, sizeof buffer, "%.*f", decimals, value);
    return buffer;
}

std::string length_from_um(double length_um, int digits) { return format_length_um(length_um, digits); }

namespace {

/// Display width of UTF-8 text (counts code points, enough for µ, ρ, Å, θ).
std::size_t width(const std::string& s) {
    return static_cast<std::size_t>(
        std::count_if(s.begin(), s.end(), [](char c) { return (static_cast<unsigned char>(c) & 0xC0) != 0x80; }));
}

bool looks_numeric(const std::string& s) {
    return !s.empty() && (std::isdigit(static_cast<unsigned char>(s[0])) || s[0] == '-' || s[0] == '+' || s[0] == '.');
}

}  // namespace

void Table::print(std::ostream& out, const std::string& indent) const {
    std::vector<std::size_t> w(header_.size(), 0);
    for (std::size_t c = 0; c < header_.size(); ++c) w[c] = width(header_[c]);
    for (const auto& row : rows_)
        for (std::size_t c = 0; c < row.size() && c < w.size(); ++c) w[c] = std::max(w[c], width(row[c]));
    auto line = [&](const std::vector<std::string>& row, bool is_header) {
        std::string text = indent;
        for (std::size_t c = 0; c < row.size() && c < w.size(); ++c) {
            const std::string pad(w[c] - width(row[c]), ' ');
            const bool right = !is_header && looks_numeric(row[c]);
            text += right ? pad + row[c] : row[c] + pad;
            if (c + 1 < row.size()) text += "  ";
        }
        while (!text.empty() && text.back() == ' ') text.pop_back();
        out << text << '\n';
    };
    line(header_, true);
    for (const auto& row : rows_) line(row, false);
}

void Table::print_csv(std::ostream& out) const {
    auto line = [&](const std::vector<std::string>& row) {
        for (std::size_t c = 0; c < row.size(); ++c) out << (c ? "," : "") << row[c];
        out << '\n';
    };
    line(header_);
    for (const auto& row : rows_) line(row);
}

void print_field(std::ostream& out, const std::string& label, const std::string& value) {
    std::string padded = label;
    do padded += ' ';
    while (width(padded) < 22);
    out << padded << value << '\n';
}

}  // namespace mudepth::cli
