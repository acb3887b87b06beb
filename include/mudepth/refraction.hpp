// Refractive index decrement δ, absorption index β and the critical angle of
// total external reflection, n = 1 − δ − iβ.
#pragma once

#include "mudepth/constants.hpp"
#include "mudepth/material.hpp"

namespace mudepth {


struct Refraction {
    double delta = 0;               ///< δ = r_e λ²/(2π) Σ N_j f1_j, f1 from Chantler (2000)
    double beta = 0;                ///< β = λ μ/(4π), from the same μ used everywhere
    double critical_angle_deg = 0;  ///< α_c = √(2δ)
    bool f1_approximated = false;   ///< an element above Z = 92 used f1 ≈ Z
};

/// δ, β and α_c of the packed material at energy_keV with linear attenuation mu_per_cm.
Refraction refraction(const Material& material, double energy_keV, double mu_per_cm);

}  // namespace mudepth
