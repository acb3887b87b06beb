// A sample as the physics needs it: element weight fractions and the density
// of the packed sample. Built from a formula, a mixture of phases, or a
// composition file (see composition.hpp).
#pragma once

#include <span>
#include <string>
#include <vector>

#include "mudepth/formula.hpp"

namespace mudepth {

/// One element's share of a material.
struct ElementShare {
    int Z;
    std::string label;        ///< "Fe", or "D"/"T"
    double weight_fraction;   ///< mass fraction, the shares of a material sum to 1
    double molar_mass_g_mol;  ///< mass of this label (isotope mass for D and T)
};

struct Material {
    std::string name;                  ///< formula text, material name or mixture description
    std::vector<ElementShare> elements;
    double solid_density_g_cm3 = 0;    ///< crystal (or glass) density, or the bulk density when given as such
    double packing_fraction = 1;       ///< 0 < f <= 1
    bool density_is_bulk = false;      ///< true when the density was given as a bulk density
    std::string density_source;        ///< where the density came from (for reports)

    /// The density used everywhere: solid density × packing fraction, g/cm³.
    double density_g_cm3() const { return solid_density_g_cm3 * packing_fraction; }
};

/// Densities mudepth accepts, g/cm³: anything outside is a typo.
inline constexpr double kMinDensity_g_cm3 = 1e-6;
inline constexpr double kMaxDensity_g_cm3 = 30.0;

/// Checks a density in g/cm³ (finite, within kMinDensity..kMaxDensity); throws InputError naming `what`.
void check_density_g_cm3(double density_g_cm3, std::string_view what);

/// Checks a packing fraction, 0 < f <= 1; throws InputError.
void check_packing_fraction(double packing_fraction);

/// A material of one phase.
Material material_from_formula(const Formula& formula, double solid_density_g_cm3,
                               double packing_fraction = 1.0);

/// Unit-cell parameters, Å and degrees.
struct UnitCell {
    double a_A, b_A, c_A;
    double alpha_deg, beta_deg, gamma_deg;
};

/// Cell volume in Å³ (general triclinic formula); throws InputError for an impossible cell.
double cell_volume_A3(const UnitCell& cell);

/// Crystal density from the cell: Z·M / (N_A·V), g/cm³.
double density_from_cell_g_cm3(const Formula& formula, const UnitCell& cell, double formula_units);

enum class FractionBasis { weight, volume };

/// One phase of a mixture.
struct Phase {
    Material material;  ///< its composition and solid density (its packing is ignored)
    double fraction;    ///< weight or volume fraction, > 0; fractions are normalised to sum 1
};

/// Mixes phases. The mixture's solid density is the density of the
/// pore-free mixture, 1/Σ(w_i/ρ_i); packing applies to the whole.
Material mix(std::span<const Phase> phases, FractionBasis basis, double packing_fraction = 1.0);

}  // namespace mudepth
