// Refractive index n = 1 − δ − iβ of a material and its critical angle.
#include "mudepth/refraction.hpp"

#include <cmath>
#include <numbers>

#include "mudepth/cross_section.hpp"
#include "mudepth/radiation.hpp"

namespace mudepth {

Refraction refraction(const Material& material, double energy_keV, double mu_per_cm) {
    Refraction r;
    const double wavelength_cm = wavelength_A_from_energy_keV(energy_keV) * 1e-8;
    const double r_e_cm = kClassicalElectronRadius_m * 1e2;
    // Σ N_j f1_j, with N_j = ρ w_j N_A / M_j atoms per cm³.
    double electrons_per_cm3 = 0;
    for (const auto& share : material.elements) {
        double f1 = share.Z;
        if (share.Z <= kChantlerMaxAtomicNumber)
            f1 = chantler_scattering_factors(share.Z, energy_keV).f1;
        else
            r.f1_approximated = true;  // no Chantler data above U: f1 ≈ Z
        const double atoms_per_cm3 = material.density_g_cm3() * share.weight_fraction *
                                     kAvogadro_per_mol / share.molar_mass_g_mol;
        electrons_per_cm3 += atoms_per_cm3 * f1;
    }
    // δ = r_e λ² Σ N_j f1_j / (2π) (e.g. James, The Optical Principles of the Diffraction of X-rays).
    r.delta = r_e_cm * wavelength_cm * wavelength_cm * electrons_per_cm3 / (2 * std::numbers::pi);
    // β = λμ/(4π), from the same total μ used for every depth.
    r.beta = wavelength_cm * mu_per_cm / (4 * std::numbers::pi);
    r.critical_angle_deg = std::sqrt(2 * r.delta) * 180.0 / std::numbers::pi;
    return r;
}

}  // namespace mudepth
