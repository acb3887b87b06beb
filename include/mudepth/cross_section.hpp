// Mass attenuation coefficients of the elements from the two embedded tables:
// Elam, Ravel & Sieber (2002) and Chantler (2000, NIST FFAST), and the
// Chantler anomalous scattering factors f1, f2.
#pragma once

#include <string_view>

namespace mudepth {

enum class CrossSectionTable { elam, chantler };

/// "elam" or "chantler".
std::string_view to_string(CrossSectionTable table);

/// The publication of the table: "Elam, Ravel & Sieber 2002", "Chantler 2000, NIST FFAST".
std::string_view citation(CrossSectionTable table);

/// Parses "elam" / "chantler"; throws InputError naming the allowed values.
CrossSectionTable parse_cross_section_table(std::string_view name);

/// Highest Z the Chantler table covers.
inline constexpr int kChantlerMaxAtomicNumber = 92;

/// Mass attenuation coefficient of one element and its parts, cm²/g.
struct MassAttenuation {
    double photoelectric_cm2_g = 0;
    double coherent_cm2_g = 0;
    double incoherent_cm2_g = 0;
    double total_cm2_g() const { return photoelectric_cm2_g + coherent_cm2_g + incoherent_cm2_g; }
};

/// μ/ρ of element Z at energy_keV (1..500 keV) from the chosen table.
/// Elam: natural cubic splines in (ln E, ln σ) with the published second
/// derivatives, never across an edge; at an edge energy the value above it
/// (also within 0.01% below the tabulated edge, the precision to which the
/// table stores it, so the energies edges() reports count as at the edge).
/// Chantler: log-log linear on its grid (thinned to 0.1%); the table gives
/// photoelectric and the sum of coherent + incoherent scattering (FFAST's
/// [μ/ρ]coh+inc), which is split in Elam's coherent : incoherent ratio at that energy.
/// Cheap: one logarithm, a binary search per grid, no allocation.
/// Throws InputError for Z out of range (Chantler: Z > 92) or energy outside
/// 1..500 keV (NaN and infinities included).
MassAttenuation element_mass_attenuation(int Z, double energy_keV,
                                         CrossSectionTable table = CrossSectionTable::elam);

/// Atomic scattering factor parts, electrons per atom (Chantler 2000).
struct ScatteringFactors {
    double f1 = 0;  ///< real part including Z: f1 = Z + f'
    double f2 = 0;  ///< imaginary part f''
};

/// Chantler f1 and f2 of element Z (1..92) at energy_keV; throws InputError above Z = 92.
/// f1 includes FFAST's relativistic and nuclear-Thomson terms and is
/// interpolated linearly in ln E; f2 log-log.
ScatteringFactors chantler_scattering_factors(int Z, double energy_keV);

/// Where the cross-section tables came from, for --version.
std::string_view cross_section_data_source();

}  // namespace mudepth
