// Helpers shared by the cross-section and element tests: test energies, the
// distance of an energy from the nearest absorption edge (ours and xraylib's),
// and thin wrappers over the xraylib C API (an outside reference, tests only).
#pragma once

#include <xraylib/xraylib.h>

#include <algorithm>
#include <cmath>
#include <limits>
#include <vector>

#include "mudepth/elements.hpp"

namespace xs_test {

/// n energies spread evenly in ln E over [lo_keV, hi_keV], both ends included.
inline std::vector<double> log_spaced_keV(double lo_keV, double hi_keV, int n) {
    std::vector<double> energies;
    for (int i = 0; i < n; ++i) {
        const double t = static_cast<double>(i) / (n - 1);
        energies.push_back(std::clamp(lo_keV * std::pow(hi_keV / lo_keV, t), lo_keV, hi_keV));
    }
    return energies;
}

/// xraylib 4.0.0 EdgeEnergy (keV), or 0 when xraylib has no such edge.
inline double xraylib_edge_keV(int Z, int shell) {
    xrl_error* error = nullptr;
    const double e = EdgeEnergy(Z, shell, &error);
    if (error) {
        xrl_error_free(error);
        return 0.0;
    }
    return e;
}

/// xraylib 4.0.0 LineEnergy (keV), or 0 when xraylib has no such line.
inline double xraylib_line_keV(int Z, int line) {
    xrl_error* error = nullptr;
    const double e = LineEnergy(Z, line, &error);
    if (error) {
        xrl_error_free(error);
        return 0.0;
    }
    return e;
}

/// Smallest |E/E_edge - 1| over mudepth::edges(Z) and every xraylib shell K..P5.
inline double relative_distance_to_edge(int Z, double energy_keV) {
    double d = std::numeric_limits<double>::infinity();
    for (const auto& e : mudepth::edges(Z)) d = std::min(d, std::abs(energy_keV / e.energy_keV - 1.0));
    for (int shell = K_SHELL; shell <= P5_SHELL; ++shell) {
        const double e = xraylib_edge_keV(Z, shell);
        if (e > 0) d = std::min(d, std::abs(energy_keV / e - 1.0));
    }
    return d;
}

/// Largest |relative difference| seen, and where.
struct Worst {
    double relative = 0;
    int Z = 0;
    double energy_keV = 0;
    void update(double ours, double theirs, int z, double e_keV) {
        const double r = ours / theirs - 1.0;
        if (std::abs(r) > std::abs(relative)) {
            relative = r;
            Z = z;
            energy_keV = e_keV;
        }
    }
};

}  // namespace xs_test
