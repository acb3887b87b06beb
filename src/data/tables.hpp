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

}  // namespace mudepth::data
