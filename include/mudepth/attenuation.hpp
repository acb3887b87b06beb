// Attenuation of a material: mass attenuation coefficient and its parts, the
// linear coefficient of the packed sample, attenuation length, transmission.
#pragma once

#include <string>
#include <vector>

#include "mudepth/cross_section.hpp"
#include "mudepth/material.hpp"

namespace mudepth {

/// μ/ρ of one element share; D and T scale hydrogen's per-atom cross section by mass.
MassAttenuation share_mass_attenuation(const ElementShare& share, double energy_keV,
                                       CrossSectionTable table);

/// μ/ρ of the material, Σ w_i (μ/ρ)_i, cm²/g.
MassAttenuation material_mass_attenuation(const Material& material, double energy_keV,
                                          CrossSectionTable table = CrossSectionTable::elam);

/// Linear attenuation coefficient of the packed sample, 1/cm.
double linear_attenuation_per_cm(const Material& material, double energy_keV,
                                 CrossSectionTable table = CrossSectionTable::elam);

/// Beer-Lambert transmission exp(-μ t).
double transmission(double mu_per_cm, double thickness_cm);

struct ElementAttenuation {
    int Z;
    std::string label;
    double weight_fraction;
    MassAttenuation mass_attenuation;  ///< of the element itself, cm²/g
    /// Share of the material's total μ/ρ, w_i (μ/ρ)_i / (μ/ρ), 0..1.
    double share_of_total;
};

struct Attenuation {
    double energy_keV = 0;
    CrossSectionTable table = CrossSectionTable::elam;
    double density_g_cm3 = 0;          ///< density used (after packing)
    MassAttenuation mass_attenuation;  ///< of the material, cm²/g
    double mu_per_cm = 0;
    double attenuation_length_um = 0;  ///< 1/μ
    std::vector<ElementAttenuation> elements;
};

/// Everything about the material's attenuation at one energy.
Attenuation attenuation(const Material& material, double energy_keV,
                        CrossSectionTable table = CrossSectionTable::elam);

}  // namespace mudepth
