// Benchmark: whole-pattern cylinder factors. 10,000 angles 0.01°–179.99°: A* at
// μR = 0.5, 3, 10 and the four container factors at one case; prints the time and
// the worst relative error against direct evaluation at every angle and against
// the independent brute-force grids of the tests at a subset.
#include <chrono>
#include <cmath>
#include <cstdio>
#include <vector>

#include "mudepth/cylinder.hpp"
#include "support/disk_reference.hpp"

namespace {

double ms_since(std::chrono::steady_clock::time_point t0) {
    return std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - t0).count();
}

}  // namespace

int main() {
    constexpr int kPoints = 10'000;
    std::vector<double> angles(kPoints);
    for (int i = 0; i < kPoints; ++i) angles[i] = 0.01 + 179.98 * i / (kPoints - 1);

    std::printf("cylinder A*, %d angles 0.01..179.99 deg\n", kPoints);
    for (double k : {0.5, 3.0, 10.0}) {
        const auto t0 = std::chrono::steady_clock::now();
        const auto a = mudepth::cylinder_transmission(k, angles);
        const double t = ms_since(t0);
        double vs_direct = 0, vs_polar = 0;
        for (int i = 0; i < kPoints; ++i)
            vs_direct = std::max(vs_direct, std::abs(a[i] / mudepth::cylinder_transmission(k, angles[i]) - 1));
        for (int i = 0; i < kPoints; i += 50)
            vs_polar = std::max(vs_polar, std::abs(a[i] / mudepth::test::polar_cylinder_reference(k, angles[i], 300, 300) - 1));
        std::printf("  muR = %4.1f: %7.1f ms; worst rel. error vs direct (all points) %.1e, vs polar grid (200 points) %.1e\n",
                    k, t, vs_direct, vs_polar);
    }

    const double ks = 2.0, kc = 0.5, rho = 1.1;
    std::printf("container factors, muR = %g, wall muR = %g, radius ratio %g\n", ks, kc, rho);
    const auto t0 = std::chrono::steady_clock::now();
    const auto f = mudepth::container_factors(ks, kc, rho, angles);
    const double t = ms_since(t0);
    double vs_direct = 0, vs_grid = 0;
    for (int i = 0; i < kPoints; i += 10) {
        const auto d = mudepth::container_factors(ks, kc, rho, angles[i]);
        vs_direct = std::max({vs_direct, std::abs(f[i].A_s_s / d.A_s_s - 1), std::abs(f[i].A_s_sc / d.A_s_sc - 1),
                              std::abs(f[i].A_c_sc / d.A_c_sc - 1), std::abs(f[i].A_c_c / d.A_c_c - 1)});
    }
    for (int i = 0; i < kPoints; i += 200) {
        const auto g = mudepth::test::cartesian_container_reference(ks, kc, rho, angles[i], 150);
        vs_grid = std::max({vs_grid, std::abs(f[i].A_s_sc / g.A_s_sc - 1), std::abs(f[i].A_c_sc / g.A_c_sc - 1),
                            std::abs(f[i].A_c_c / g.A_c_c - 1)});
    }
    std::printf("  %7.1f ms; worst rel. error vs direct (1000 points) %.1e, vs Cartesian grid (50 points) %.1e\n", t,
                vs_direct, vs_grid);
    return 0;
}
