// Kβ filters for laboratory anodes: the foil element whose K edge lies
// between the anode's Kβ1 and Kα1 lines, the foil thickness for a target
// Kβ/Kα intensity ratio, and what the foil does to Kα.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "mudepth/cross_section.hpp"
#include "mudepth/radiation.hpp"

namespace mudepth {

/// One emission line of the anode's K spectrum as the filter sees it.
struct SpectrumLine {
    std::string name;     ///< Siegbahn name: Ka1, Ka2, Kb1, Kb3, Kb5, Kb2, ...
    double energy_keV;
    double relative_intensity;
    bool kbeta;           ///< part of the Kβ group (K-M and K-N transitions)
};

/// The Kα (K-L2, K-L3) and Kβ (K-M, K-N) lines of the anode with their
/// relative intensities from the element data; Kα1, Kα2 and Kβ1 at the
/// anode table's wavelengths.
std::vector<SpectrumLine> anode_k_spectrum(const Anode& anode);

/// Kβ/Kα intensity ratio of the bare anode (sums over each group).
double unfiltered_kbeta_ratio(const Anode& anode);

/// Elements whose K edge lies strictly between the anode's Kα1 and Kβ1
/// energies and that are solid at room temperature (density above 0.5 g/cm³).
std::vector<int> filter_candidates(const Anode& anode);

struct FilterResult {
    int Z = 0;
    std::string symbol;
    double k_edge_keV = 0;
    double density_g_cm3 = 0;          ///< density of the pure element (the foil)
    double thickness_cm = 0;
    double mass_thickness_g_cm2 = 0;   ///< ρ t
    double ratio_unfiltered = 0;       ///< Kβ/Kα before the foil
    double ratio_filtered = 0;         ///< Kβ/Kα after the foil
    double kalpha_transmission = 0;    ///< intensity-weighted over Kα1 and Kα2
    double kbeta_transmission = 0;     ///< intensity-weighted over the Kβ group
};

/// The foil of `element` (Z) that is `thickness_cm` thick, in front of the anode.
FilterResult filter_of_thickness(const Anode& anode, int element, double thickness_cm,
                                 CrossSectionTable table = CrossSectionTable::elam);

/// The foil thickness that brings Kβ/Kα to target_ratio (found with Boost.Math
/// TOMS 748). Throws InputError when the target is not below the unfiltered ratio.
FilterResult filter_for_ratio(const Anode& anode, int element, double target_ratio,
                              CrossSectionTable table = CrossSectionTable::elam);

/// The candidate that passes the most Kα at the target ratio; throws
/// InputError when the anode has no candidate.
int best_filter_element(const Anode& anode, double target_ratio,
                        CrossSectionTable table = CrossSectionTable::elam);

}  // namespace mudepth
