// Benchmark baseline for python/bench_python.py: the same work as the Python calls,
// done in C++. 10^6 energies 5..50 keV through μ/ρ of Fe2O3 (with the energy check
// the binding makes), and 10^5 angles 0..180° through the capillary factor at μR = 1.
// Prints one "name seconds" line per task: the best of `repeats` runs (argument 1, default 5).
#include <algorithm>
#include <chrono>
#include <cstdio>
#include <cstdlib>
#include <vector>

#include "mudepth/attenuation.hpp"
#include "mudepth/cylinder.hpp"
#include "mudepth/formula.hpp"
#include "mudepth/material.hpp"
#include "mudepth/radiation.hpp"

namespace {

template <class F>
double best_seconds(int repeats, F&& f) {
    double best = 1e300;
    for (int r = 0; r < repeats; ++r) {
        const auto t0 = std::chrono::steady_clock::now();
        f();
        best = std::min(best, std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count());
    }
    return best;
}

}  // namespace

int main(int argc, char** argv) {
    const int repeats = argc > 1 ? std::max(1, std::atoi(argv[1])) : 5;
    constexpr std::size_t kEnergies = 1'000'000, kAngles = 100'000;
    const mudepth::Material m = mudepth::material_from_formula(mudepth::parse_formula("Fe2O3"), 5.24, 0.6);

    std::vector<double> energies(kEnergies), mu_rho(kEnergies);
    for (std::size_t i = 0; i < kEnergies; ++i) energies[i] = 5.0 + 45.0 * static_cast<double>(i) / (kEnergies - 1);
    const double t_mu = best_seconds(repeats, [&] {
        for (std::size_t i = 0; i < kEnergies; ++i) {
            mudepth::check_energy_keV(energies[i]);
            mu_rho[i] = mudepth::material_mass_attenuation(m, energies[i]).total_cm2_g();
        }
    });

    std::vector<double> angles(kAngles), a;
    for (std::size_t i = 0; i < kAngles; ++i) angles[i] = 180.0 * static_cast<double>(i) / (kAngles - 1);
    const double t_cyl = best_seconds(repeats, [&] { a = mudepth::cylinder_transmission(1.0, angles); });

    std::printf("mass_attenuation_1e6 %.6f\n", t_mu);
    std::printf("cylinder_transmission_1e5 %.6f\n", t_cyl);
    std::printf("checksum %.12g %.12g\n", mu_rho[kEnergies / 2], a[kAngles / 2]);
    return 0;
}
