// Element data embedded in the program: symbols, atomic masses, densities,
// absorption edges and emission lines, generated from the X-ray database that
// Debian ships as python3-xraydb (see src/data/generate_tables.py).
#pragma once

#include <optional>
#include <span>
#include <string_view>

namespace mudepth {

/// Highest atomic number with data (californium).
inline constexpr int kMaxAtomicNumber = 98;

struct ElementInfo {
    int Z;
    std::string_view symbol;
    double molar_mass_g_mol;  ///< standard atomic weight, g/mol
    double density_g_cm3;     ///< density of the pure element as usually found
};

/// The element with atomic number Z (1..98); throws InputError otherwise.
const ElementInfo& element(int Z);

/// Atomic number for a symbol such as "Fe" (case-sensitive); nullopt if unknown.
std::optional<int> atomic_number(std::string_view symbol);

/// One absorption edge (core level) of an element.
struct EdgeInfo {
    std::string_view level;      ///< IUPAC level name: K, L1, L2, L3, M1 .. M5
    double energy_keV;           ///< edge (binding) energy
    double fluorescence_yield;   ///< probability of radiative decay of a hole in this level
    double jump_ratio;           ///< ratio of μ just above to just below the edge
};

/// Edges K, L1-L3, M1-M5 of element Z in that order (only those the data has).
std::span<const EdgeInfo> edges(int Z);

/// The edge with the given level name, or nullptr.
const EdgeInfo* find_edge(int Z, std::string_view level);

/// One emission line (K and L lines).
struct LineInfo {
    std::string_view iupac;          ///< e.g. "K-L3"
    std::string_view siegbahn;       ///< e.g. "Ka1"
    std::string_view initial_level;  ///< level holding the hole, e.g. "K"
    std::string_view final_level;    ///< level the electron comes from, e.g. "L3"
    double energy_keV;
    double relative_intensity;       ///< relative to the other lines of the same initial level
};

/// K and L emission lines of element Z.
std::span<const LineInfo> lines(int Z);

/// The line with the given IUPAC or Siegbahn name ("K-L3" or "Ka1"), or nullptr.
const LineInfo* find_line(int Z, std::string_view name);

/// Where the element tables came from (database name and version), for --version.
std::string_view element_data_source();

}  // namespace mudepth
