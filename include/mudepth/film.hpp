// Layered films on a substrate (D7): how much of the diffracted signal each
// layer gives, and how much the layers attenuate the substrate's signal.
#pragma once

#include <vector>

#include "mudepth/depth.hpp"

namespace mudepth {

/// One layer: its absorber (μ, and δ, β when refraction is wanted) and its thickness.
struct FilmLayer {
    DepthSample sample;
    double thickness_cm = 0;
};

/// Layers from the top down, on an infinitely thick substrate.
struct FilmStack {
    std::vector<FilmLayer> layers;
    DepthSample substrate;
};

/// Per angle: shares of the diffracted signal (sum 1) and the substrate's attenuation.
struct FilmShares {
    std::vector<double> layer_shares;   ///< top-down, same order as the stack
    double substrate_share = 0;
    /// Factor by which the layers attenuate the substrate signal, in and out:
    /// exp(−Σ t_j / Λ_j), Λ_j the 1/e depth of layer j's material at these angles.
    double substrate_attenuation = 0;
};

/// Share of the diffracted signal: the integrated intensity each layer diffracts per unit
/// incident beam, for the same diffracting power per unit volume everywhere, divided by the sum
/// over the stack and substrate. Within layer j the signal decays as exp(−z/Λ_j), Λ_j from
/// depth_1e_um (so with optics, each layer's own q(α) = √(sin²α − 2δ_j + 2iβ_j): refraction
/// with the parallel wave vector kept across the interfaces; Fresnel transmission and reflection
/// at the interfaces are left out). Layer j gives ∏_{i<j} e^(−t_i/Λ_i) · Λ_j (1 − e^(−t_j/Λ_j)),
/// the substrate ∏_i e^(−t_i/Λ_i) · Λ_s [derived from Beer-Lambert, ITC C Table 6.3.3.1].
/// Throws for an empty stack or a non-positive thickness.
FilmShares film_shares(const FilmStack& stack, BeamAngles angles);

}  // namespace mudepth
