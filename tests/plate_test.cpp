// Flat-plate factors against their closed forms and limits (ITC C Table 6.3.3.1;
// ITC Vol. C Table 6.3.3.1), the optimum thicknesses by direct maximisation, and windows.
#include <gtest/gtest.h>

#include <cmath>
#include <numbers>

#include <boost/math/tools/minima.hpp>

#include "mudepth/error.hpp"
#include "mudepth/plate.hpp"

namespace mudepth {
namespace {

constexpr double kDeg = std::numbers::pi / 180;

TEST(Plate, ModesByName) {
    for (auto m : {PlateMode::reflection, PlateMode::transmission_normal, PlateMode::transmission_symmetric})
        EXPECT_EQ(parse_plate_mode(to_string(m)), m);
    try {
        parse_plate_mode("transmission");
        FAIL();
    } catch (const InputError& e) {
        EXPECT_NE(std::string(e.what()).find("reflection, transmission-normal, transmission-symmetric"), std::string::npos);
    }
}

TEST(Plate, SymmetricReflection) {
    // Relative to thick: 1 − exp(−2μt/sinθ) (ITC C Table 6.3.3.1).
    for (double mt : {1e-3, 0.05, 0.4, 2.0})
        for (double tt : {5.0, 30.0, 90.0, 150.0, 180.0}) {
            const double want = 1 - std::exp(-2 * mt / std::sin(tt / 2 * kDeg));
            EXPECT_NEAR(plate_transmission(PlateMode::reflection, mt, tt), want, 1e-12 * want + 1e-15);
        }
    // Thick limit → 1; thin limit → 2μt/sinθ (first order of the same form) to 1e-9.
    EXPECT_NEAR(plate_transmission(PlateMode::reflection, 50, 40), 1, 1e-15);
    const double thin = 1e-12;
    EXPECT_NEAR(plate_transmission(PlateMode::reflection, thin, 40) / (2 * thin / std::sin(20 * kDeg)), 1, 1e-9);
}

TEST(Plate, FixedIncidenceReflection) {
    // 1 − exp[−μt(1/sinα + 1/sinβ)], β = 2θ − α (ITC C Table 6.3.3.1).
    const double mt = 0.3;
    for (auto [tt, a] : {std::pair{40.0, 5.0}, std::pair{90.0, 1.0}, std::pair{120.0, 100.0}}) {
        const double want = 1 - std::exp(-mt * (1 / std::sin(a * kDeg) + 1 / std::sin((tt - a) * kDeg)));
        EXPECT_NEAR(plate_transmission(PlateMode::reflection, mt, tt, a), want, 1e-12);
    }
    // α = θ is the symmetric case.
    EXPECT_NEAR(plate_transmission(PlateMode::reflection, mt, 50, 25.0), plate_transmission(PlateMode::reflection, mt, 50), 1e-14);
}

TEST(Plate, SymmetricTransmission) {
    // Every path is t/cosθ: A = exp(−μt/cosθ) [derived].
    for (double mt : {0.01, 1.0, 3.0})
        for (double tt : {0.0, 20.0, 100.0, 170.0})
            EXPECT_NEAR(plate_transmission(PlateMode::transmission_symmetric, mt, tt), std::exp(-mt / std::cos(tt / 2 * kDeg)), 1e-14);
}

TEST(Plate, NormalTransmission) {
    // [e^(−μt) − e^(−μt sec2θ)] / [μt(sec2θ − 1)], limit e^(−μt) at 2θ → 0 [derived].
    for (double mt : {0.01, 0.7, 2.0})
        for (double tt : {10.0, 45.0, 80.0, 89.0}) {
            const double sec = 1 / std::cos(tt * kDeg);
            const double want = (std::exp(-mt) - std::exp(-mt * sec)) / (mt * (sec - 1));
            EXPECT_NEAR(plate_transmission(PlateMode::transmission_normal, mt, tt) / want, 1, 1e-9) << mt << " " << tt;
        }
    for (double mt : {0.01, 0.7, 2.0}) {
        EXPECT_NEAR(plate_transmission(PlateMode::transmission_normal, mt, 0.0), std::exp(-mt), 1e-15);
        // Near the limit: e^(−a)(1 − b/2 + b²/6), b = a(sec2θ − 1) (series of (1 − e^(−b))/b).
        for (double tt : {1e-6, 1e-3, 0.1}) {
            const double b = mt * (1 / std::cos(tt * kDeg) - 1);
            const double want = std::exp(-mt) * (1 - b / 2 + b * b / 6);
            EXPECT_NEAR(plate_transmission(PlateMode::transmission_normal, mt, tt) / want, 1, 1e-9) << tt;
        }
    }
}

TEST(Plate, TransmissionOptimaMaximiseTheIntensity) {
    // Intensity ∝ μt·A(μt): optimum cosθ (symmetric) and ln(sec2θ)/(sec2θ − 1) (normal) [derived],
    // checked against Brent's maximisation (Boost.Math).
    for (auto mode : {PlateMode::transmission_symmetric, PlateMode::transmission_normal})
        for (double tt : {1.0, 20.0, 60.0, 85.0}) {
            auto minus_intensity = [&](double x) { return -x * plate_transmission(mode, x, tt); };
            const auto best = boost::math::tools::brent_find_minima(minus_intensity, 1e-3, 5.0, 40);
            EXPECT_NEAR(transmission_optimum_mu_t(mode, tt), best.first, 1e-6) << to_string(mode) << " " << tt;
        }
    EXPECT_NEAR(transmission_optimum_mu_t(PlateMode::transmission_symmetric, 60), std::cos(30 * kDeg), 1e-15);
    const double sec = 1 / std::cos(60 * kDeg);
    EXPECT_NEAR(transmission_optimum_mu_t(PlateMode::transmission_normal, 60), std::log(sec) / (sec - 1), 1e-14);
    EXPECT_NEAR(transmission_optimum_mu_t(PlateMode::transmission_normal, 0), 1, 1e-12);  // → 1 at 2θ → 0
    EXPECT_THROW(transmission_optimum_mu_t(PlateMode::reflection, 30), InputError);
}

TEST(Plate, InfiniteThickness) {
    // Cullity, Elements of X-ray Diffraction (from memory): 99% at t = 2.30 sinθ/μ, 99.9% at 3.45 sinθ/μ.
    for (double tt : {20.0, 90.0, 150.0}) {
        const double s = std::sin(tt / 2 * kDeg);
        EXPECT_NEAR(infinite_thickness_mu_t(0.99, tt), 2.30 * s, 0.005 * s);
        EXPECT_NEAR(infinite_thickness_mu_t(0.999, tt), 3.45 * s, 0.005 * s);
        // Exactly: that μt gives the fraction (ITC C Table 6.3.3.1 form).
        EXPECT_NEAR(plate_transmission(PlateMode::reflection, infinite_thickness_mu_t(0.99, tt), tt), 0.99, 1e-12);
    }
    EXPECT_NEAR(plate_transmission(PlateMode::reflection, infinite_thickness_mu_t(0.999, 60, 10.0), 60, 10.0), 0.999, 1e-12);
    EXPECT_THROW(infinite_thickness_mu_t(1.0, 30), InputError);
    EXPECT_THROW(infinite_thickness_mu_t(0.0, 30), InputError);
}

TEST(Plate, WindowsAreTheProductOfTheSeparateTransmissions) {
    // Beer-Lambert along each path: one foil crossed going in, one coming out.
    const double w = 0.04;
    for (double tt : {10.0, 50.0, 85.0}) {
        EXPECT_NEAR(window_transmission(PlateMode::transmission_normal, w, tt), std::exp(-w) * std::exp(-w / std::cos(tt * kDeg)), 1e-14);
        const double c = std::cos(tt / 2 * kDeg);
        EXPECT_NEAR(window_transmission(PlateMode::transmission_symmetric, w, tt), std::exp(-w / c) * std::exp(-w / c), 1e-14);
        EXPECT_NEAR(window_transmission(PlateMode::reflection, w, tt, 5.0),
                    std::exp(-w / std::sin(5 * kDeg)) * std::exp(-w / std::sin((tt - 5) * kDeg)), 1e-14);
    }
}

TEST(Plate, RefusesGeometriesThatDoNotExist) {
    EXPECT_THROW(plate_transmission(PlateMode::transmission_normal, 1, 90), InputError);
    EXPECT_THROW(plate_transmission(PlateMode::transmission_normal, 1, 120), InputError);
    EXPECT_THROW(plate_transmission(PlateMode::transmission_symmetric, 1, 180), InputError);
    EXPECT_THROW(plate_transmission(PlateMode::reflection, 1, 0), InputError);
    EXPECT_THROW(plate_transmission(PlateMode::reflection, 1, 30, 35.0), InputError);
    EXPECT_THROW(plate_transmission(PlateMode::reflection, 1, 30, 0.0), InputError);
    EXPECT_THROW(plate_transmission(PlateMode::transmission_symmetric, 1, 30, 10.0), InputError);
    EXPECT_THROW(plate_transmission(PlateMode::reflection, 0, 30), InputError);
    EXPECT_THROW(plate_transmission(PlateMode::reflection, -1, 30), InputError);
    EXPECT_THROW(plate_transmission(PlateMode::reflection, 1, 181), InputError);
    EXPECT_THROW(plate_transmission(PlateMode::reflection, 1, std::nan("")), InputError);
    try {
        plate_transmission(PlateMode::reflection, 1, 30, 35.0);
    } catch (const InputError& e) {
        EXPECT_STREQ(e.what(), "incidence 35° must be below 2θ = 30°");
    }
}

}  // namespace
}  // namespace mudepth
