// Correction of patterns: the factors against closed forms and independent
// integrations, σ scaling, normalisation, and the container subtraction
// recovering a known sample intensity.
#include <gtest/gtest.h>

#include <cmath>
#include <numbers>

#include "mudepth/correct.hpp"
#include "mudepth/cylinder.hpp"
#include "mudepth/error.hpp"
#include "mudepth/plate.hpp"

namespace mudepth {
namespace {

constexpr double kPi = std::numbers::pi;
double rad(double deg) { return deg * kPi / 180; }

Pattern make_pattern(std::vector<double> angles, std::vector<double> intensity, std::vector<double> sigma = {}) {
    Pattern p;
    p.name = "synthetic.xy";
    p.two_theta_deg = std::move(angles);
    p.intensity = std::move(intensity);
    p.sigma = std::move(sigma);
    for (std::size_t i = 0; i < p.two_theta_deg.size(); ++i) p.line.push_back(i + 1);
    return p;
}

std::vector<double> grid(double from, double to, double step) {
    std::vector<double> out;
    for (int i = 0; from + i * step <= to + 1e-9; ++i) out.push_back(from + i * step);
    return out;
}

/// A of a cylinder by a polar midpoint grid (independent of the library's rectangle map):
/// (1/π)∫∫exp(−μR(l_in + l_out)) r dr dφ, beam along +x, exit direction (cos2θ, sin2θ).
double brute_cylinder_A(double mu_R, double two_theta_deg) {
    const int nr = 600, nphi = 1200;
    const double c = std::cos(rad(two_theta_deg)), s = std::sin(rad(two_theta_deg));
    double sum = 0;
    for (int i = 0; i < nr; ++i) {
        const double r = (i + 0.5) / nr;
        for (int j = 0; j < nphi; ++j) {
            const double phi = 2 * kPi * (j + 0.5) / nphi;
            const double x = r * std::cos(phi), y = r * std::sin(phi);
            const double l_in = x + std::sqrt(1 - y * y);
            const double pd = x * c + y * s;
            const double l_out = -pd + std::sqrt(pd * pd - r * r + 1);
            sum += std::exp(-mu_R * (l_in + l_out)) * r;
        }
    }
    return sum * (1.0 / nr) * (2 * kPi / nphi) / kPi;
}

TEST(CorrectionFactors, CylinderIsTheCylinderFunctionAndMatchesABruteForceIntegral) {
    CorrectionSetup s;
    s.geometry = CorrectionGeometry::cylinder;
    s.mu_R = 1.2;
    const auto angles = grid(5, 150, 2.5);  // a long list: the same interpolant the cylinder command uses
    const auto f = correction_factors(s, angles);
    const auto a = cylinder_transmission(1.2, angles);
    for (std::size_t i = 0; i < angles.size(); ++i) EXPECT_EQ(f[i], 1 / a[i]);
    for (double t : {5.0, 60.0, 150.0}) {
        const auto one = correction_factors(s, std::vector<double>{t});
        // Independent polar-grid integration (midpoint rule, about 1e-5 accurate).
        EXPECT_NEAR(1 / one[0] / brute_cylinder_A(1.2, t), 1, 2e-4) << t;
    }
}

TEST(CorrectionFactors, CylinderInAWallUsesAssc) {
    CorrectionSetup s;
    s.geometry = CorrectionGeometry::cylinder;
    s.mu_R = 0.8;
    s.wall = CorrectionSetup::Wall{0.2, 1.1};
    const std::vector<double> angles{10, 50, 90, 130};
    const auto f = correction_factors(s, angles);
    for (std::size_t i = 0; i < angles.size(); ++i) {
        const auto c = container_factors(0.8, 0.2, 1.1, angles[i]);
        EXPECT_EQ(f[i], 1 / c.A_s_sc);
        EXPECT_GT(f[i], 1 / cylinder_transmission(0.8, angles[i]));  // the wall absorbs too
    }
}

TEST(CorrectionFactors, PlatesFollowTheClosedForms) {
    const std::vector<double> angles{20, 45, 80};
    CorrectionSetup s;
    s.mu_t = 0.3;
    s.geometry = CorrectionGeometry::reflection;
    auto f = correction_factors(s, angles);
    for (std::size_t i = 0; i < angles.size(); ++i)  // ITC C Table 6.3.3.1: 1 − exp(−2μt/sinθ)
        EXPECT_NEAR(f[i], 1 / (1 - std::exp(-2 * 0.3 / std::sin(rad(angles[i] / 2)))), 1e-12 * f[i]);
    s.incidence_deg = 5;
    f = correction_factors(s, angles);
    for (std::size_t i = 0; i < angles.size(); ++i)  // fixed incidence α, β = 2θ − α (same table)
        EXPECT_NEAR(f[i], 1 / (1 - std::exp(-0.3 * (1 / std::sin(rad(5)) + 1 / std::sin(rad(angles[i] - 5))))),
                    1e-12 * f[i]);
    s.incidence_deg.reset();
    s.geometry = CorrectionGeometry::transmission_symmetric;
    f = correction_factors(s, angles);
    for (std::size_t i = 0; i < angles.size(); ++i)  // exp(−μt/cosθ) (ITC C 6.3.3)
        EXPECT_NEAR(f[i], std::exp(0.3 / std::cos(rad(angles[i] / 2))), 1e-12 * f[i]);
    s.geometry = CorrectionGeometry::transmission_normal;
    s.mu_t_window = 0.05;
    f = correction_factors(s, angles);
    for (std::size_t i = 0; i < angles.size(); ++i) {
        // Brute force: mean over the depth z of exp(−μz − μ(t − z)/cos2θ), Simpson's rule, times the
        // two windows' Beer-Lambert exp(−μt_w(1 + 1/cos2θ)).
        const double sec = 1 / std::cos(rad(angles[i]));
        const int n = 2000;
        double sum = 0;
        for (int k = 0; k <= n; ++k) {
            const double z = 0.3 * k / n;
            const double w = (k == 0 || k == n) ? 1 : (k % 2 ? 4 : 2);
            sum += w * std::exp(-z - (0.3 - z) * sec);
        }
        const double A = sum / (3.0 * n);
        EXPECT_NEAR(f[i] * A * std::exp(-0.05 * (1 + sec)), 1, 1e-10);
    }
}

TEST(CorrectPattern, IntensityAndSigmaScaleByTheFactor) {
    CorrectionSetup s;
    s.geometry = CorrectionGeometry::cylinder;
    s.mu_R = 2;
    const Pattern p = make_pattern(grid(10, 100, 1), std::vector<double>(91, 250.0), std::vector<double>(91, 16.0));
    const auto c = correct_pattern(p, s, {});
    const auto f = correction_factors(s, p.two_theta_deg);
    for (std::size_t i = 0; i < p.size(); ++i) {
        EXPECT_EQ(c.correction[i], f[i]);
        EXPECT_EQ(c.intensity[i], 250.0 * f[i]);
        EXPECT_EQ(c.sigma[i], 16.0 * f[i]);
    }
    EXPECT_TRUE(c.subtracted.empty());
    const auto no_sigma = correct_pattern(make_pattern({10, 20}, {1, 2}), s, {});
    EXPECT_TRUE(no_sigma.sigma.empty());
}

TEST(CorrectPattern, NormalisationModes) {
    CorrectionSetup s;
    s.geometry = CorrectionGeometry::transmission_symmetric;
    s.mu_t = 0.5;
    const Pattern p = make_pattern({10, 20, 30, 40}, {100, 400, 300, 200}, {10, 20, 17, 14});
    CorrectionOptions o;
    o.normalization = parse_normalization("max");
    const auto m = correct_pattern(p, s, o);
    EXPECT_DOUBLE_EQ(*std::max_element(m.intensity.begin(), m.intensity.end()), 1.0);
    EXPECT_DOUBLE_EQ(m.intensity[1], 1.0);
    EXPECT_DOUBLE_EQ(m.sigma[1], 20.0 / 400.0);
    EXPECT_DOUBLE_EQ(m.normalization_divisor, 400 * m.correction[1]);
    o.normalization = parse_normalization("at:30");
    const auto a = correct_pattern(p, s, o);
    EXPECT_DOUBLE_EQ(a.intensity[2], 1.0);
    o.normalization = parse_normalization("at:25");  // halfway: the mean of the neighbours
    const auto h = correct_pattern(p, s, o);
    EXPECT_DOUBLE_EQ(h.normalization_divisor, 0.5 * (400 * h.correction[1] + 300 * h.correction[2]));
    EXPECT_EQ(parse_normalization("none").mode, NormalizationMode::none);
    for (const char* bad : {"at:", "at:x", "at:200", "maximum", ""}) EXPECT_THROW(parse_normalization(bad), InputError) << bad;
    o.normalization = parse_normalization("at:50");
    EXPECT_THROW(correct_pattern(p, s, o), InputError);
}

TEST(CorrectPattern, ContainerSubtractionRecoversTheSample) {
    // A known sample intensity I_s and wall intensity I_w; the measured I_sc = A_s,sc·I_s + A_c,sc·I_w and
    // the empty I_c = A_c,c·I_w (Paalman & Pings 1962), the empty measured on its own finer grid with a
    // scale s (its counting time was 1/s of the sample's). I_w linear in 2θ: the interpolation is exact.
    const double mu_R = 0.9, mu_R_c = 0.15, ratio = 1.08, scale = 2.5;
    const auto angles = grid(8, 126, 2);  // 60 points
    auto I_s = [](double t) { return 1000 + 800 * std::exp(-(t - 40) * (t - 40) / 4) + 5 * t; };
    auto I_w = [](double t) { return 300 - 1.5 * t; };
    std::vector<double> sc, sc_sigma;
    for (double t : angles) {
        const auto f = container_factors(mu_R, mu_R_c, ratio, t);
        sc.push_back(f.A_s_sc * I_s(t) + f.A_c_sc * I_w(t));
        sc_sigma.push_back(std::sqrt(sc.back()));
    }
    std::vector<double> e_angles, e, e_sigma;
    for (double t = 5; t <= 130 + 1e-9; t += 0.7) {
        e_angles.push_back(t);
        e.push_back(container_factors(mu_R, mu_R_c, ratio, t).A_c_c * I_w(t) / scale);
        e_sigma.push_back(std::sqrt(e.back()));
    }
    // The wall factor A_c,c varies with 2θ, so I_c is not exactly linear: evaluate the empty on the
    // sample's grid through the same linear interpolation to build the expected value.
    const Pattern sample = make_pattern(angles, sc, sc_sigma);
    const Pattern empty = make_pattern(e_angles, e, e_sigma);
    CorrectionSetup s;
    s.geometry = CorrectionGeometry::cylinder;
    s.mu_R = mu_R;
    s.wall = CorrectionSetup::Wall{mu_R_c, ratio};
    CorrectionOptions o;
    o.empty = &empty;
    o.empty_scale = scale;
    const auto c = correct_pattern(sample, s, o);
    ASSERT_EQ(c.intensity.size(), angles.size());
    for (std::size_t i = 0; i < angles.size(); ++i) {
        const double t = angles[i];
        const auto f = container_factors(mu_R, mu_R_c, ratio, t);
        const auto b = *bracket(e_angles, t);
        const double I_c = scale * ((1 - b.weight) * e[b.lower] + b.weight * (b.weight ? e[b.lower + 1] : 0));
        // With the empty interpolated exactly the recovery would be I_s(t); the interpolation of
        // A_c,c(2θ)·I_w over 0.7° steps is the only difference, and it is tiny (A_c,c is nearly flat).
        const double expected_exact = I_s(t);
        const double interpolation_error = f.A_c_sc / f.A_c_c * (I_c - f.A_c_c * I_w(t)) / f.A_s_sc;
        EXPECT_NEAR(c.intensity[i], expected_exact - interpolation_error, 1e-9 * expected_exact) << t;
        EXPECT_NEAR(c.intensity[i], expected_exact, 1e-3 * expected_exact) << t;
        EXPECT_EQ(c.correction[i], 1 / f.A_s_sc);
        EXPECT_NEAR(c.subtracted[i], f.A_c_sc / f.A_c_c * I_c, 1e-12 * c.subtracted[i]);
        // σ: the independent-error sum of the two terms, each weight squared (propagation of variance).
        const double k = f.A_c_sc / f.A_c_c;
        const double s0 = e_sigma[b.lower], s1 = b.weight ? e_sigma[b.lower + 1] : 0;
        const double var_c = scale * scale * ((1 - b.weight) * (1 - b.weight) * s0 * s0 + b.weight * b.weight * s1 * s1);
        EXPECT_NEAR(c.sigma[i], std::sqrt(sc_sigma[i] * sc_sigma[i] + k * k * var_c) / f.A_s_sc, 1e-12 * c.sigma[i]);
    }
}

TEST(CorrectPattern, ContainerSubtractionExactWhenTheGridsAgree) {
    // Same grid for both: no interpolation, so I_s is recovered to rounding (1e-9 asked).
    const double mu_R = 1.4, mu_R_c = 0.3, ratio = 1.2;
    const auto angles = grid(10, 130, 3);
    std::vector<double> sc, ec;
    for (double t : angles) {
        const auto f = container_factors(mu_R, mu_R_c, ratio, t);
        const double I_s = 500 + 3 * t, I_w = 80 + std::sin(rad(t)) * 40;
        sc.push_back(f.A_s_sc * I_s + f.A_c_sc * I_w);
        ec.push_back(f.A_c_c * I_w);
    }
    CorrectionSetup s;
    s.geometry = CorrectionGeometry::cylinder;
    s.mu_R = mu_R;
    s.wall = CorrectionSetup::Wall{mu_R_c, ratio};
    const Pattern sample = make_pattern(angles, sc), empty = make_pattern(angles, ec);
    CorrectionOptions o;
    o.empty = &empty;
    const auto c = correct_pattern(sample, s, o);
    for (std::size_t i = 0; i < angles.size(); ++i) EXPECT_NEAR(c.intensity[i] / (500 + 3 * angles[i]), 1, 1e-9);
}

TEST(CorrectPattern, Refusals) {
    CorrectionSetup cyl;
    cyl.geometry = CorrectionGeometry::cylinder;
    cyl.mu_R = 1;
    cyl.wall = CorrectionSetup::Wall{0.1, 1.1};
    const Pattern p = make_pattern({20, 30, 40}, {1, 2, 3});
    auto message = [](const std::function<void()>& f) {
        try {
            f();
        } catch (const InputError& e) {
            return std::string(e.what());
        }
        return std::string("(none)");
    };
    const Pattern far = make_pattern({100, 110}, {1, 1});
    CorrectionOptions o;
    o.empty = &far;
    EXPECT_NE(message([&] { correct_pattern(p, cyl, o); }).find("do not overlap"), std::string::npos);
    const Pattern part = make_pattern({25, 50}, {1, 1});
    o.empty = &part;
    EXPECT_NE(message([&] { correct_pattern(p, cyl, o); }).find("synthetic.xy:1: 2θ = 20° lies outside"),
              std::string::npos);
    CorrectionSetup plate;
    plate.geometry = CorrectionGeometry::transmission_normal;
    plate.mu_t = 1;
    EXPECT_NE(message([&] { correct_pattern(make_pattern({30, 60, 95}, {1, 1, 1}), plate, {}); })
                  .find("synthetic.xy:3: transmission-normal"),
              std::string::npos);
    o.empty = &part;
    EXPECT_THROW(correct_pattern(p, plate, o), InputError);  // an empty scan needs a container
    plate.geometry = CorrectionGeometry::reflection;
    EXPECT_NE(message([&] { correct_pattern(make_pattern({0, 10}, {1, 1}), plate, {}); }).find("synthetic.xy:1:"),
              std::string::npos);
    EXPECT_THROW(parse_correction_geometry("capillary"), InputError);
    EXPECT_EQ(parse_correction_geometry("transmission-symmetric"), CorrectionGeometry::transmission_symmetric);
}

}  // namespace
}  // namespace mudepth
