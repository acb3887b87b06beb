// Cylinder absorption factor A: limits, closed one-dimensional integrals, an
// independent polar brute-force grid, and the published fits.
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

double integrate(auto f, double a, double b) {
    return boost::math::quadrature::gauss_kronrod<double, 61>::integrate(f, a, b, 20, 1e-15);
}

TEST(Cylinder, FirstOrderLimit) {
    // The mean in+out path is 16R/(3π) at every angle, so A = 1 − (16/3π)μR + O((μR)²) [derived].
    for (double tt : {0.0, 45.0, 90.0, 135.0, 180.0}) {
        const double k = 1e-5;
        EXPECT_NEAR((1 - cylinder_transmission(k, tt)) / k, 16 / (3 * kPi), 1e-4) << tt;
    }
}

TEST(Cylinder, ForwardAndBackScatteringIntegrals) {
    // 2θ = 0: A = (4/π)∫₀^{π/2} cos²φ exp(−2μR cosφ) dφ;
    // 2θ = 180°: A = [1 − ∫₀^{π/2} cosφ exp(−4μR cosφ) dφ]/(πμR) [derived].
    for (double k : {0.01, 0.3, 1.0, 2.5, 5.0, 10.0, 20.0, 30.0}) {
        const double a0 = 4 / kPi * integrate([k](double p) { return std::cos(p) * std::cos(p) * std::exp(-2 * k * std::cos(p)); }, 0, kPi / 2);
        const double a180 = (1 - integrate([k](double p) { return std::cos(p) * std::exp(-4 * k * std::cos(p)); }, 0, kPi / 2)) / (kPi * k);
        EXPECT_NEAR(cylinder_transmission(k, 0) / a0, 1, 1e-9) << k;
        EXPECT_NEAR(cylinder_transmission(k, 180) / a180, 1, 1e-9) << k;
    }
}

TEST(Cylinder, MatchesPolarBruteForce) {
    // Independent reference: polar Gauss–Legendre grid (support/disk_reference.hpp),
    // itself checked for convergence by halving its node counts.
    double worst = 0;
    for (double k : {0.05, 0.5, 1.0, 2.0, 5.0, 10.0, 30.0})
        for (double tt : {0.0, 0.01, 3.0, 27.0, 64.0, 90.0, 111.0, 148.0, 179.99, 180.0}) {
            const double fine = test::polar_cylinder_reference(k, tt, 400, 400);
            const double coarse = test::polar_cylinder_reference(k, tt, 200, 200);
            ASSERT_NEAR(coarse / fine, 1, 1e-9) << "reference not converged at " << k << ", " << tt;
            const double a = cylinder_transmission(k, tt);
            EXPECT_NEAR(a / fine, 1, 1e-8) << "μR " << k << " 2θ " << tt;
            worst = std::max(worst, std::abs(a / fine - 1));
        }
    RecordProperty("worst_relative_error", std::to_string(worst));
}

TEST(Cylinder, MeanPathIsSixteenOverThreePi) {
    // d A/d(μR) at μR → 0 is minus the mean path 16/(3π) [derived]: central difference.
    const double h = 1e-4;
    for (double tt : {10.0, 100.0})
        EXPECT_NEAR((cylinder_transmission(2 * h, tt) - cylinder_transmission(h, tt)) / h,
                    -16 / (3 * kPi) + 0, 1e-3);
}

double rouse(double k, double two_theta_deg) {
    // Rouse, Cooper, York & Chakera (1970), Acta Cryst. A26, 682.
    const double s2 = std::pow(std::sin(two_theta_deg / 2 * kPi / 180), 2);
    return std::exp(-(1.7133 - 0.0368 * s2) * k - (-0.0927 - 0.3750 * s2) * k * k);
}

double lobanov(double k, double two_theta_deg) {
    // Lobanov & Alte da Veiga (1998), EPDIC-6 abstract P12-16.
    const double s = std::pow(std::sin(two_theta_deg / 2 * kPi / 180), 2);
    if (k <= 3) {
        const double t0 = 16 / (3 * kPi);
        const double t1 = (25.99978 - 0.01911 * std::pow(s, 0.25)) * std::exp(-0.024551 * s) + 0.109561 * std::sqrt(s) - 26.04556;
        const double t2 = -0.02489 - 0.39499 * s + 1.219077 * std::pow(s, 1.5) - 1.31268 * s * s + 0.871081 * std::pow(s, 2.5) - 0.2327 * s * s * s;
        const double t3 = 0.003045 + 0.018167 * s - 0.03305 * s * s;
        return std::exp(-t0 * k - t1 * k * k - t2 * k * k * k - t3 * k * k * k * k);
    }
    const double t4 = 1.433902 + 11.07504 * s - 8.77629 * s * s + 10.02088 * s * s * s - 3.36778 * s * s * s * s;
    const double t5 = (0.013869 - 0.01249 * s) * std::exp(3.27094 * s) + (0.337894 + 13.77317 * s) / std::pow(1 + 11.53544 * s, 1.555039);
    const double t6 = 1.933433 / std::pow(1 + 23.12967 * s, 1.686715) - 0.13576 * std::sqrt(s) + 1.163198;
    const double t7 = 0.044365 - 0.04259 / std::pow(1 + 0.41051 * s, 148.4202);
    return ((t4 - t7) / std::pow(1 + t5 * (k - 3), t6) + t7) / 100;
}

TEST(Cylinder, PublishedFits) {
    for (double tt = 0; tt <= 180; tt += 15) {
        for (double k : {0.1, 0.25, 0.5, 0.75, 1.0})  // Rouse et al.: about 1% for μR <= 1
            EXPECT_NEAR(cylinder_transmission(k, tt) / rouse(k, tt), 1, 0.015) << k << " " << tt;
        for (double k : {0.2, 1.0, 2.0, 3.0, 4.0, 6.0, 8.0, 10.0})  // Lobanov & Alte da Veiga: about 1.3% for μR <= 10
            EXPECT_NEAR(cylinder_transmission(k, tt) / lobanov(k, tt), 1, 0.02) << k << " " << tt;
    }
}

TEST(Cylinder, PatternMatchesDirectAtEveryAngle) {
    // The interpolated pattern against direct evaluation, 0.01°–179.99° and both ends.
    std::vector<double> angles{0.0, 180.0};
    for (int i = 0; i < 1500; ++i) angles.push_back(0.01 + 179.98 * i / 1499.0);
    for (double k : {0.01, 0.5, 3.0, 10.0, 17.0, 30.0}) {
        const auto a = cylinder_transmission(k, angles);
        ASSERT_EQ(a.size(), angles.size());
        double worst = 0;
        for (std::size_t i = 0; i < angles.size(); ++i)
            worst = std::max(worst, std::abs(a[i] / cylinder_transmission(k, angles[i]) - 1));
        EXPECT_LT(worst, 1e-9) << "μR " << k;
    }
}

TEST(Cylinder, ShortListsAndMonotonicity) {
    const std::vector<double> angles{10, 60, 120, 170};
    const auto a = cylinder_transmission(2.0, angles);
    for (std::size_t i = 0; i < angles.size(); ++i) EXPECT_DOUBLE_EQ(a[i], cylinder_transmission(2.0, angles[i]));
    // A rises with 2θ for an absorbing cylinder (ITC C Table 6.3.3.1 trend, common practice).
    for (std::size_t i = 1; i < a.size(); ++i) EXPECT_GT(a[i], a[i - 1]);
}

TEST(Cylinder, RefusesBadInput) {
    EXPECT_THROW(cylinder_transmission(0, 10), InputError);
    EXPECT_THROW(cylinder_transmission(-1, 10), InputError);
    EXPECT_THROW(cylinder_transmission(30.01, 10), InputError);
    EXPECT_THROW(cylinder_transmission(std::nan(""), 10), InputError);
    EXPECT_THROW(cylinder_transmission(1, -0.1), InputError);
    EXPECT_THROW(cylinder_transmission(1, 180.1), InputError);
    const std::vector<double> bad{10, 200};
    EXPECT_THROW(cylinder_transmission(1, bad), InputError);
    try {
        cylinder_transmission(31, 10);
    } catch (const InputError& e) {
        EXPECT_NE(std::string(e.what()).find("above 30"), std::string::npos);
    }
}

}  // namespace
}  // namespace mudepth
