// A 10,000-point grazing-incidence depth table with refraction (Si, Cu Kα,
// 2θ = 28.44°, α from 0.01° to 5°): compute time, plus the inverse per point.
#include <chrono>
#include <cstdio>
#include <vector>

#include "timing.hpp"
#include "mudepth/attenuation.hpp"
#include "mudepth/depth.hpp"
#include "mudepth/formula.hpp"
#include "mudepth/radiation.hpp"
#include "mudepth/refraction.hpp"

namespace {

using mudepth::bench::seconds;

}  // namespace

int main() {
    constexpr int kPoints = 10'000;
    const auto si = mudepth::material_from_formula(mudepth::parse_formula("Si"), 2.329);
    const auto cu = mudepth::radiation_from_source("Cu");
    std::vector<double> depth(kPoints), fraction(kPoints), inverse(kPoints);
    mudepth::DepthSample sample;
    const double setup = seconds([&] {
        const double mu = mudepth::linear_attenuation_per_cm(si, cu.energy_keV);
        const auto r = mudepth::refraction(si, cu.energy_keV, mu);
        sample = mudepth::refracting_sample(r.delta, r.beta, cu.wavelength_A());
    });
    const double table = seconds([&] {
        for (int i = 0; i < kPoints; ++i) {
            const double alpha = 0.01 + (5.0 - 0.01) * i / (kPoints - 1);
            depth[i] = mudepth::depth_1e_um(sample, mudepth::fixed_incidence_angles(28.44, alpha));
            fraction[i] = mudepth::depth_holding_fraction_um(depth[i], 0.9);
        }
    });
    const double solve = seconds([&] {
        for (int i = 0; i < kPoints; ++i) inverse[i] = mudepth::incidence_for_depth(sample, 28.44, depth[i]).angle_deg;
    });
    double sum = 0;
    for (int i = 0; i < kPoints; ++i) sum += fraction[i] + inverse[i];
    std::printf("depth: %d-point grazing-incidence table with refraction (Si, Cu Ka, 2theta 28.44 deg)\n", kPoints);
    std::printf("  mu and refraction setup   %.6f s\n", setup);
    std::printf("  table (1/e + 90%% depth)   %.6f s  (%.1f ns/point)\n", table, table / kPoints * 1e9);
    std::printf("  inverse (angle per depth) %.6f s  (%.2f us/point)\n", solve, solve / kPoints * 1e6);
    std::printf("  checksum %.6g\n", sum);
    return 0;
}
