// Attenuation of a material: Σ w_i (μ/ρ)_i, μ = ρ·μ/ρ, Beer-Lambert transmission.
#include "mudepth/attenuation.hpp"

#include <cmath>

#include "mudepth/elements.hpp"

namespace mudepth {

MassAttenuation share_mass_attenuation(const ElementShare& share, double energy_keV,
                                       CrossSectionTable table) {
    MassAttenuation m = element_mass_attenuation(share.Z, energy_keV, table);
    // The table is per gram of the natural element; an isotope (D, T) has the
    // same per-atom cross section, so per gram it scales by M_natural / M_isotope.
    const double scale = element(share.Z).molar_mass_g_mol / share.molar_mass_g_mol;
    if (scale != 1.0) {
        m.photoelectric_cm2_g *= scale;
        m.coherent_cm2_g *= scale;
        m.incoherent_cm2_g *= scale;
    }
    return m;
}

MassAttenuation material_mass_attenuation(const Material& material, double energy_keV,
                                          CrossSectionTable table) {
    MassAttenuation sum;
    for (const auto& share : material.elements) {
        const MassAttenuation m = share_mass_attenuation(share, energy_keV, table);
        sum.photoelectric_cm2_g += share.weight_fraction * m.photoelectric_cm2_g;
        sum.coherent_cm2_g += share.weight_fraction * m.coherent_cm2_g;
        sum.incoherent_cm2_g += share.weight_fraction * m.incoherent_cm2_g;
    }
    return sum;
}

double linear_attenuation_per_cm(const Material& material, double energy_keV,
                                 CrossSectionTable table) {
    return material.density_g_cm3() *
           material_mass_attenuation(material, energy_keV, table).total_cm2_g();
}

double transmission(double mu_per_cm, double thickness_cm) {
    return std::exp(-mu_per_cm * thickness_cm);
}

Attenuation attenuation(const Material& material, double energy_keV, CrossSectionTable table) {
    Attenuation a;
    a.energy_keV = energy_keV;
    a.table = table;
    a.density_g_cm3 = material.density_g_cm3();
    a.mass_attenuation = material_mass_attenuation(material, energy_keV, table);
    a.mu_per_cm = a.density_g_cm3 * a.mass_attenuation.total_cm2_g();
    a.attenuation_length_um = 1e4 / a.mu_per_cm;  // 1 cm = 1e4 µm
    const double total_cm2_g = a.mass_attenuation.total_cm2_g();
    for (const auto& share : material.elements) {
        const MassAttenuation m = share_mass_attenuation(share, energy_keV, table);
        a.elements.push_back({share.Z, share.label, share.weight_fraction, m,
                              share.weight_fraction * m.total_cm2_g() / total_cm2_g});
    }
    return a;
}

}  // namespace mudepth
