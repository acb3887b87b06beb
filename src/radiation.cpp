// Radiation: energies, wavelengths and the laboratory anode lines.
#include "mudepth/radiation.hpp"

#include <array>
#include <cctype>
#include <cmath>
#include <string>
#include <vector>

#include "format.hpp"
#include "mudepth/elements.hpp"
#include "mudepth/error.hpp"

namespace mudepth {

void check_energy_keV(double energy_keV) {
    if (!std::isfinite(energy_keV))
        throw InputError("energy is not a finite number");
    if (energy_keV < kMinEnergy_keV || energy_keV > kMaxEnergy_keV)
        throw InputError("energy " + format_number(energy_keV) + " keV is outside " +
                         format_number(kMinEnergy_keV) + ".." + format_number(kMaxEnergy_keV) +
                         " keV");
}

double wavelength_A_from_energy_keV(double energy_keV) { return kHc_keV_A / energy_keV; }
double energy_keV_from_wavelength_A(double wavelength_A) { return kHc_keV_A / wavelength_A; }

Radiation radiation_from_energy(double energy_keV) {
    check_energy_keV(energy_keV);
    return {energy_keV, format_number(energy_keV, 6) + " keV"};
}

Radiation radiation_from_wavelength(double wavelength_A) {
    if (!std::isfinite(wavelength_A) || wavelength_A <= 0)
        throw InputError("wavelength " + format_number(wavelength_A) +
                         " Å must be a positive number");
    const double energy_keV = energy_keV_from_wavelength_A(wavelength_A);
    if (energy_keV < kMinEnergy_keV || energy_keV > kMaxEnergy_keV)
        throw InputError("wavelength " + format_number(wavelength_A) + " Å (" +
                         format_number(energy_keV) + " keV) is outside " +
                         format_number(kHc_keV_A / kMaxEnergy_keV, 4) + ".." +
                         format_number(kHc_keV_A / kMinEnergy_keV, 4) + " Å (1..500 keV)");
    return {energy_keV, format_number(wavelength_A, 6) + " Å"};
}

namespace {

constexpr std::string_view kHoelzer =
    "Hölzer et al. (1997), Phys. Rev. A 56, 4554; International Tables Vol. C Table 4.2.2.1";
constexpr std::string_view kElementData = "emission-line energies of the embedded element data";

/// An anode whose lines come from the element data's emission energies.
Anode anode_from_element_lines(std::string_view symbol) {
    const int Z = *atomic_number(symbol);
    auto wavelength = [Z](std::string_view line) {
        return wavelength_A_from_energy_keV(find_line(Z, line)->energy_keV);
    };
    return {symbol, Z, wavelength("K-L3"), wavelength("K-L2"), wavelength("K-M3"), kElementData};
}

const std::vector<Anode>& anode_table() {
    static const std::vector<Anode> table = {
        // Å; Hölzer et al. (1997), as in ITC Vol. C Table 4.2.2.1.
        {"Cr", 24, 2.2897260, 2.2936510, 2.0848810, kHoelzer},
        {"Fe", 26, 1.9360410, 1.9399730, 1.7566040, kHoelzer},
        {"Co", 27, 1.7889960, 1.7928350, 1.6208260, kHoelzer},
        {"Cu", 29, 1.54059290, 1.54442740, 1.3922340, kHoelzer},
        anode_from_element_lines("Ga"),
        {"Mo", 42, 0.70931715, 0.713607, 0.632303, kHoelzer},
        {"Ag", 47, 0.55942178, 0.5638131, 0.4970817, kHoelzer},
        anode_from_element_lines("In"),
        anode_from_element_lines("W"),
    };
    return table;
}

constexpr std::array<std::string_view, 6> kStandardAnodes = {"Cr", "Fe", "Co", "Cu", "Mo", "Ag"};

std::string known_anodes() {
    std::string list;
    for (const auto& a : anode_table()) list += (list.empty() ? "" : ", ") + std::string(a.symbol);
    return list;
}

std::string lower(std::string_view s) {
    std::string out(s);
    for (auto& c : out) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
    return out;
}

AnodeLine parse_line(std::string_view text) {
    const std::string l = lower(text);
    if (l == "ka") return AnodeLine::Ka;
    if (l == "ka1") return AnodeLine::Ka1;
    if (l == "ka2") return AnodeLine::Ka2;
    if (l == "kb" || l == "kb1") return AnodeLine::Kb;
    throw InputError("unknown line '" + std::string(text) + "'; use Ka, Ka1, Ka2 or Kb");
}

}  // namespace

std::span<const Anode> anodes() { return anode_table(); }

std::span<const std::string_view> standard_anode_symbols() { return kStandardAnodes; }

const Anode& find_anode(std::string_view symbol) {
    for (const auto& a : anode_table())
        if (lower(a.symbol) == lower(symbol)) return a;
    throw InputError("unknown anode '" + std::string(symbol) + "'; known anodes: " + known_anodes());
}

double line_wavelength_A(const Anode& anode, AnodeLine line) {
    switch (line) {
        case AnodeLine::Ka1: return anode.ka1_A;
        case AnodeLine::Ka2: return anode.ka2_A;
        case AnodeLine::Kb: return anode.kb1_A;
        case AnodeLine::Ka: break;
    }
    // Kα2/Kα1 intensity ratio 0.5 (common practice): weighted mean wavelength.
    return (2.0 * anode.ka1_A + anode.ka2_A) / 3.0;
}

std::string_view to_string(AnodeLine line) {
    switch (line) {
        case AnodeLine::Ka1: return "Ka1";
        case AnodeLine::Ka2: return "Ka2";
        case AnodeLine::Kb: return "Kb1";
        case AnodeLine::Ka: break;
    }
    return "Ka";
}

Radiation radiation_from_source(std::string_view spec) {
    if (spec.empty()) throw InputError("empty source; give an anode such as Cu or Cu:Ka1");
    const auto colon = spec.find(':');
    const Anode& anode = find_anode(spec.substr(0, colon));
    const AnodeLine line =
        colon == std::string_view::npos ? AnodeLine::Ka : parse_line(spec.substr(colon + 1));
    const double wavelength_A = line_wavelength_A(anode, line);
    return {energy_keV_from_wavelength_A(wavelength_A),
            std::string(anode.symbol) + " " + std::string(to_string(line))};
}

}  // namespace mudepth
