// Paalman & Pings container factors: limits, the thin-wall shell, an independent
// Cartesian brute-force grid, patterns against direct values, the subtraction.
#include <gtest/gtest.h>

#include <cmath>
#include <numbers>
#include <vector>

#include <boost/math/quadrature/gauss_kronrod.hpp>

#include "mudepth/cylinder.hpp"
#include "mudepth/error.hpp"
#include "support/disk_reference.hpp"

namespace mudepth {
namespace {

constexpr double kPi = std::numbers::pi;

TEST(Container, NoWallAbsorptionGivesTheBareCylinder) {
    // μ_c = 0 gives A_s,sc = A_s,s; μ_s = 0 gives A_c,sc = A_c,c (Paalman & Pings 1962).
    for (double tt : {0.0, 40.0, 95.0, 180.0}) {
        const auto f = container_factors(1.3, 0.0, 1.2, tt);
        EXPECT_NEAR(f.A_s_sc / f.A_s_s, 1, 1e-12);
        EXPECT_NEAR(f.A_c_c, 1, 1e-9);  // nothing absorbs in an empty, non-absorbing tube
        EXPECT_DOUBLE_EQ(f.A_s_s, cylinder_transmission(1.3, tt));
        const auto g = container_factors(0.0, 2.0, 1.1, tt);
        EXPECT_NEAR(g.A_c_sc / g.A_c_c, 1, 1e-12);
        EXPECT_DOUBLE_EQ(g.A_s_s, 1.0);
    }
}

TEST(Container, ThinWallLimit) {
    // A wall of vanishing thickness: A_s,sc → A_s,s, A_c,c → 1, and A_c,sc → the
    // average over the unit circle of exp(−μ_s(l_in + l_out)), with l_in = 2 max(cos ω, 0)
    // and l_out = 2 max(−cos(ω − 2θ), 0) the chords through the sample [derived].
    const double k_s = 0.8, k_c = 1.0, rho = 1 + 1e-6;
    for (double tt : {0.0, 30.0, 90.0, 150.0, 180.0}) {
        const double phi = tt * kPi / 180;
        auto shell = [&](double om) {
            return std::exp(-2 * k_s * (std::max(std::cos(om), 0.0) + std::max(-std::cos(om - phi), 0.0)));
        };
        double ring = 0;
        std::vector<double> cuts{0, kPi / 2, 3 * kPi / 2, 2 * kPi};
        for (double c : {phi + kPi / 2, phi - kPi / 2}) cuts.push_back(std::fmod(c + 4 * kPi, 2 * kPi));
        std::sort(cuts.begin(), cuts.end());
        for (std::size_t i = 0; i + 1 < cuts.size(); ++i)
            if (cuts[i + 1] > cuts[i])
                ring += boost::math::quadrature::gauss_kronrod<double, 61>::integrate(shell, cuts[i], cuts[i + 1], 15, 1e-14);
        const auto f = container_factors(k_s, k_c, rho, tt);
        EXPECT_NEAR(f.A_c_sc / (ring / (2 * kPi)), 1, 1e-4) << tt;
        EXPECT_NEAR(f.A_c_c, 1, 1e-4) << tt;
        EXPECT_NEAR(f.A_s_sc / f.A_s_s, 1, 1e-4) << tt;
    }
}

struct WallCase {
    double k_s, k_c, rho;
};

TEST(Container, MatchesCartesianBruteForce) {
    // Independent reference: Cartesian beam-frame grid (support/disk_reference.hpp),
    // checked for convergence by halving its node count.
    const WallCase cases[] = {{1, 0.3, 1.1}, {0.5, 2, 1.02}, {3, 1, 1.5}, {10, 5, 1.05},
                              {0.2, 0.5, 3}, {30, 30, 1.2}, {1, 10, 1.001}};
    double worst = 0;
    for (const auto& c : cases)
        for (double tt : {0.0, 7.0, 33.0, 61.0, 90.0, 118.0, 152.0, 180.0}) {
            const auto fine = test::cartesian_container_reference(c.k_s, c.k_c, c.rho, tt, 300);
            const auto coarse = test::cartesian_container_reference(c.k_s, c.k_c, c.rho, tt, 150);
            ASSERT_NEAR(coarse.A_c_sc / fine.A_c_sc, 1, 1e-8);
            ASSERT_NEAR(coarse.A_s_sc / fine.A_s_sc, 1, 1e-8);
            const auto f = container_factors(c.k_s, c.k_c, c.rho, tt);
            for (auto [got, want] : {std::pair{f.A_s_sc, fine.A_s_sc}, std::pair{f.A_c_sc, fine.A_c_sc},
                                     std::pair{f.A_c_c, fine.A_c_c}}) {
                EXPECT_NEAR(got / want, 1, 1e-5) << c.k_s << " " << c.k_c << " " << c.rho << " 2θ " << tt;
                worst = std::max(worst, std::abs(got / want - 1));
            }
        }
    RecordProperty("worst_relative_error", std::to_string(worst));
}

TEST(Container, PatternMatchesDirect) {
    std::vector<double> angles{0.0, 180.0};
    for (int i = 0; i < 300; ++i) angles.push_back(0.01 + 179.98 * i / 299.0);
    for (const WallCase c : {WallCase{1, 0.3, 1.1}, WallCase{10, 5, 1.05}, WallCase{0.4, 3, 1.001}}) {
        const auto v = container_factors(c.k_s, c.k_c, c.rho, angles);
        double worst = 0;
        for (std::size_t i = 0; i < angles.size(); ++i) {
            const auto d = container_factors(c.k_s, c.k_c, c.rho, angles[i]);
            worst = std::max({worst, std::abs(v[i].A_s_s / d.A_s_s - 1), std::abs(v[i].A_s_sc / d.A_s_sc - 1),
                              std::abs(v[i].A_c_sc / d.A_c_sc - 1), std::abs(v[i].A_c_c / d.A_c_c - 1)});
        }
        EXPECT_LT(worst, 1e-6) << c.k_s << " " << c.k_c << " " << c.rho;
    }
}

TEST(Container, SubtractionRecoversTheSample) {
    // I_sc = A_s,sc I_s + A_c,sc I_c0 and I_c = A_c,c I_c0 (Paalman & Pings 1962 model).
    const auto f = container_factors(1.0, 0.5, 1.1, 45);
    const double I_s = 1000, I_c0 = 300;
    EXPECT_NEAR(container_corrected_intensity(f, f.A_s_sc * I_s + f.A_c_sc * I_c0, f.A_c_c * I_c0), I_s, 1e-9);
}

TEST(Container, RefusesBadInput) {
    EXPECT_THROW(container_factors(1, 1, 1.0, 10), InputError);
    EXPECT_THROW(container_factors(1, 1, 0.9, 10), InputError);
    EXPECT_THROW(container_factors(1, -1, 1.1, 10), InputError);
    EXPECT_THROW(container_factors(31, 1, 1.1, 10), InputError);
    EXPECT_THROW(container_factors(-1, 1, 1.1, 10), InputError);
    EXPECT_THROW(container_factors(1, 1, 1.1, 181), InputError);
    EXPECT_THROW(container_factors(1, 100, 1.5, 10), InputError);  // wall μt 50 > 30
}

}  // namespace
}  // namespace mudepth
