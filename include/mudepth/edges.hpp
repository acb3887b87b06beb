// Absorption edges near an energy and fluorescence warnings for a material.
#pragma once

#include <string>
#include <vector>

#include "mudepth/material.hpp"

namespace mudepth {

struct NearbyEdge {
    int Z;
    std::string label;  ///< element label
    std::string level;  ///< K, L1, ...
    double energy_keV;
};

/// Edges of the material's elements with energy in [energy − below, energy + above], sorted.
std::vector<NearbyEdge> edges_near(const Material& material, double energy_keV,
                                   double below_keV = 2.0, double above_keV = 1.0);

/// Edges of the material's elements between two energies, sorted (for scans).
std::vector<NearbyEdge> edges_between(const Material& material, double from_keV, double to_keV);

/// Lines below this energy are mostly absorbed in the air path and the
/// detector window before they count (about 3 keV, common practice: at 3 keV
/// air attenuates by 1/e in about 5 cm).
inline constexpr double kDetectableFluorescence_keV = 3.0;

struct FluorescenceWarning {
    int Z;
    std::string label;
    std::string edge_level;                   ///< "K" or "L3"
    double edge_keV;
    std::string line_iupac;                   ///< strongest line from that level, e.g. "K-L3"
    std::string line_siegbahn;                ///< e.g. "Ka1"
    double line_keV;
    std::vector<std::string> avoiding_sources; ///< standard anodes whose Kα1 lies below the edge
    std::string message;                      ///< one sentence for the user
};

/// One warning per element whose K or L3 edge lies below energy_keV and whose
/// strongest line from that level lies above kDetectableFluorescence_keV.
std::vector<FluorescenceWarning> fluorescence_warnings(const Material& material, double energy_keV);

}  // namespace mudepth
