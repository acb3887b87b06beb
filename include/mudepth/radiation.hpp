// The incident radiation: an energy, a wavelength, or a laboratory anode line.
#pragma once

#include <span>
#include <string>
#include <string_view>

#include "mudepth/constants.hpp"

namespace mudepth {


/// Allowed energy range (SPEC R2); outside it mudepth refuses, never extrapolates.
inline constexpr double kMinEnergy_keV = 1.0;
inline constexpr double kMaxEnergy_keV = 500.0;

/// Throws InputError unless energy_keV is finite and within 1..500 keV.
void check_energy_keV(double energy_keV);

double wavelength_A_from_energy_keV(double energy_keV);
double energy_keV_from_wavelength_A(double wavelength_A);

struct Radiation {
    double energy_keV = 0;
    std::string label;  ///< "8.0478 keV", "Cu Ka", ...
    double wavelength_A() const { return wavelength_A_from_energy_keV(energy_keV); }
};

Radiation radiation_from_energy(double energy_keV);
Radiation radiation_from_wavelength(double wavelength_A);

enum class AnodeLine { Ka, Ka1, Ka2, Kb };

/// The wavelengths of one anode, Å.
struct Anode {
    std::string_view symbol;  ///< "Cu"
    int Z;
    double ka1_A;
    double ka2_A;
    double kb1_A;
    std::string_view source;  ///< where the wavelengths come from
};

/// Cr, Fe, Co, Cu, Ga, Mo, Ag, In, W in order of Z.
std::span<const Anode> anodes();

/// The anodes a diffraction lab commonly has: Cr, Fe, Co, Cu, Mo, Ag.
std::span<const std::string_view> standard_anode_symbols();

/// The anode with that symbol; throws InputError listing the known ones.
const Anode& find_anode(std::string_view symbol);

/// Wavelength of a line, Å; Ka is the 2:1 weighted mean (2·Kα1 + Kα2)/3.
double line_wavelength_A(const Anode& anode, AnodeLine line);

std::string_view to_string(AnodeLine line);

/// Parses "Cu", "Cu:Ka1", "Mo:Kb" (case of the line is free); throws InputError.
Radiation radiation_from_source(std::string_view spec);

}  // namespace mudepth
