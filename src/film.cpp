// Shares of the diffracted signal in a layered film: see include/mudepth/film.hpp.
#include "mudepth/film.hpp"

#include <cmath>
#include <string>

#include "format.hpp"
#include "mudepth/error.hpp"

namespace mudepth {

FilmShares film_shares(const FilmStack& stack, BeamAngles angles) {
    if (stack.layers.empty()) throw InputError("the film stack is empty; give at least one layer above the substrate");
    FilmShares r;
    r.layer_shares.reserve(stack.layers.size());
    double above = 1.0;  // attenuation by the layers above, in and out
    double total = 0;
    for (std::size_t j = 0; j < stack.layers.size(); ++j) {
        const auto& layer = stack.layers[j];
        if (!std::isfinite(layer.thickness_cm) || layer.thickness_cm <= 0)
            throw InputError("layer " + std::to_string(j + 1) + ": thickness " + format_number(layer.thickness_cm) +
                             " cm must be positive");
        const double lambda_cm = depth_1e_um(layer.sample, angles) * 1e-4;
        const double x = layer.thickness_cm / lambda_cm;
        // ∫₀ᵗ e^(−z/Λ) dz = Λ (1 − e^(−t/Λ)), times what the layers above let through.
        const double signal = above * lambda_cm * -std::expm1(-x);
        r.layer_shares.push_back(signal);
        total += signal;
        above *= std::exp(-x);
    }
    r.substrate_attenuation = above;
    r.substrate_share = above * depth_1e_um(stack.substrate, angles) * 1e-4;
    total += r.substrate_share;
    for (auto& s : r.layer_shares) s /= total;
    r.substrate_share /= total;
    return r;
}

}  // namespace mudepth
