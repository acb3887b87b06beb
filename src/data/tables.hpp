// Declarations of the generated element tables (src/data/*_data.cpp).
// Internal to the library: use elements.hpp and cross_section.hpp instead.
#pragma once

#include <array>
#include <cstddef>

namespace mudepth::data {

struct ElementRow {
    int Z;
    const char* symbol;
    double molar_mass_g_mol;
    double density_g_cm3;
};

struct EdgeRow {
    int Z;
    const char* level;
    double energy_keV;
    double fluorescence_yield;
    double jump_ratio;
};

struct LineRow {
    int Z;
    const char* iupac;
    const char* siegbahn;
    const char* initial_level;
    const char* final_level;
    double energy_keV;
    double relative_intensity;
};

inline constexpr int kElementCount = 98;

/// Index 0 is Z = 1.
extern const std::array<ElementRow, kElementCount> kElements;

/// Edges sorted by Z; rows of element Z are [kEdgeBegin[Z-1], kEdgeBegin[Z]).
extern const EdgeRow kEdges[];
extern const std::array<std::size_t, kElementCount + 1> kEdgeBegin;

/// Lines sorted by Z; rows of element Z are [kLineBegin[Z-1], kLineBegin[Z]).
extern const LineRow kLines[];
extern const std::array<std::size_t, kElementCount + 1> kLineBegin;

extern const char* const kElementDataSource;

// ---- Elam, Ravel & Sieber (2002) cross sections (src/data/elam_data.cpp) ----
// Natural cubic splines in (ln E, ln sigma), E in eV, sigma in cm2/g, with the
// published second derivatives. An edge is a repeated ln E: the first node holds
// the value below the edge, the last the value above.

struct ElamPhotoNode {
    double log_energy_eV;         ///< ln(E / eV)
    double log_mu_cm2_g;          ///< ln(photoabsorption / (cm2/g))
    double second_derivative;     ///< d2 ln(sigma) / d(ln E)2 at this node
};

/// Coherent and incoherent scattering share one energy grid (no edges).
struct ElamScatterNode {
    double log_energy_eV;
    double log_coherent_cm2_g;
    double coherent_second_derivative;
    double log_incoherent_cm2_g;
    double incoherent_second_derivative;
};

/// Nodes of element Z are [kElamPhotoBegin[Z-1], kElamPhotoBegin[Z]).
extern const ElamPhotoNode kElamPhoto[];
extern const std::array<std::size_t, kElementCount + 1> kElamPhotoBegin;
/// Nodes of element Z are [kElamScatterBegin[Z-1], kElamScatterBegin[Z]).
extern const ElamScatterNode kElamScatter[];
extern const std::array<std::size_t, kElementCount + 1> kElamScatterBegin;
extern const char* const kElamDataSource;

// ---- Chantler (2000), NIST FFAST (src/data/chantler_data.cpp) ----
// 1..500 keV (one node beyond each end), thinned to 0.1% of the full grid.

inline constexpr int kChantlerElementCount = 92;

struct ChantlerNode {
    double log_energy_eV;         ///< ln(E / eV)
    double f1;                    ///< total f1 = Z + f' (e/atom); interpolate linearly in ln E
    double log_f2;                ///< ln f2 (f2 in e/atom)
    double log_photo_cm2_g;       ///< ln(photoabsorption / (cm2/g))
    double log_scatter_cm2_g;     ///< ln((coherent + incoherent scattering) / (cm2/g))
};

/// Nodes of element Z are [kChantlerBegin[Z-1], kChantlerBegin[Z]).
extern const ChantlerNode kChantler[];
extern const std::array<std::size_t, kChantlerElementCount + 1> kChantlerBegin;
extern const char* const kChantlerDataSource;

}  // namespace mudepth::data
