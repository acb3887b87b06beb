// Film stacks: shares against an independent depth integral, bulk and
// splitting limits, the substrate attenuation closed form.
#include "mudepth/film.hpp"

#include <gtest/gtest.h>

#include <cmath>
#include <numbers>
#include <numeric>

#include <boost/math/quadrature/gauss_kronrod.hpp>

#include "mudepth/error.hpp"

namespace mudepth {
namespace {

double rad(double deg) { return deg * std::numbers::pi / 180.0; }

FilmStack three_layers() {
    return {{{geometric_sample(800), 1e-4}, {geometric_sample(150), 3e-4}, {geometric_sample(2400), 0.5e-4}},
            geometric_sample(2300)};
}

TEST(Film, SharesSumToOne) {
    for (double alpha : {0.5, 2.0, 20.0}) {
        const auto s = film_shares(three_layers(), fixed_incidence_angles(44, alpha));
        const double sum = std::accumulate(s.layer_shares.begin(), s.layer_shares.end(), s.substrate_share);
        EXPECT_NEAR(sum, 1.0, 1e-14);
    }
}

TEST(Film, SharesByQuadratureOfTheDepthProfile) {
    // Independent: integrate e^(−∫₀ᶻ μ(z′) dz′ (1/sinα + 1/sinε)) over each layer numerically.
    const FilmStack st = three_layers();
    const double alpha = 3.0, tt = 44.0;
    const double k = 1 / std::sin(rad(alpha)) + 1 / std::sin(rad(tt - alpha));
    std::vector<double> top{0};
    for (const auto& l : st.layers) top.push_back(top.back() + l.thickness_cm);
    auto optical_depth = [&](double z) {
        double p = 0;
        for (std::size_t j = 0; j < st.layers.size(); ++j)
            p += st.layers[j].sample.mu_per_cm * std::clamp(z - top[j], 0.0, st.layers[j].thickness_cm);
        if (z > top.back()) p += st.substrate.mu_per_cm * (z - top.back());
        return p * k;
    };
    auto w = [&](double z) { return std::exp(-optical_depth(z)); };
    using GK = boost::math::quadrature::gauss_kronrod<double, 61>;
    std::vector<double> parts;
    for (std::size_t j = 0; j < st.layers.size(); ++j) parts.push_back(GK::integrate(w, top[j], top[j + 1], 15, 1e-14));
    parts.push_back(GK::integrate(w, top.back(), top.back() + 0.05, 15, 1e-14));  // 100+ depths: thick
    const double total = std::accumulate(parts.begin(), parts.end(), 0.0);
    const auto s = film_shares(st, fixed_incidence_angles(tt, alpha));
    for (std::size_t j = 0; j < st.layers.size(); ++j) EXPECT_NEAR(s.layer_shares[j], parts[j] / total, 1e-11);
    EXPECT_NEAR(s.substrate_share, parts.back() / total, 1e-11);
}

TEST(Film, SubstrateAttenuationClosedForm) {
    // exp[−μ_f t (1/sinα + 1/sinβ)] under a film of thickness t (REFERENCES, flat plates) [derived].
    const FilmStack st{{{geometric_sample(600), 2e-4}}, geometric_sample(2300)};
    for (double alpha : {1.0, 10.0, 30.0}) {
        const auto s = film_shares(st, fixed_incidence_angles(60, alpha));
        const double expected = std::exp(-600 * 2e-4 * (1 / std::sin(rad(alpha)) + 1 / std::sin(rad(60 - alpha))));
        EXPECT_NEAR(s.substrate_attenuation / expected, 1.0, 1e-12);
    }
}

TEST(Film, ThickLayerBehavesAsBulk) {
    // A layer thicker than 20 depths gives all but e^(−20) ≈ 2e-9 of the signal [derived].
    const DepthSample layer = geometric_sample(500);
    const BeamAngles b = symmetric_angles(50);
    const double t_cm = 20.5 * depth_1e_um(layer, b) * 1e-4;
    const auto s = film_shares({{{layer, t_cm}}, geometric_sample(2300)}, b);
    EXPECT_NEAR(s.layer_shares[0], 1.0, 1e-8);
    EXPECT_LT(s.substrate_attenuation, std::exp(-20.0));
    // On a substrate of the same material the stack is one bulk sample: the layer gives
    // 1 − e^(−t/Λ) of a thick sample's signal (REFERENCES, flat plates, 1 − exp(−2μt/sinθ)).
    const auto same = film_shares({{{layer, t_cm}}, layer}, b);
    EXPECT_NEAR(same.layer_shares[0], -std::expm1(-2 * 500 * t_cm / std::sin(rad(25))), 1e-14);
}

TEST(Film, TwoIdenticalLayersEqualOneOfTheirSummedThickness) {
    const DepthSample a = geometric_sample(900), sub = geometric_sample(2300);
    for (double alpha : {0.8, 7.0}) {
        const BeamAngles b = fixed_incidence_angles(38, alpha);
        const auto split = film_shares({{{a, 0.3e-4}, {a, 0.9e-4}}, sub}, b);
        const auto whole = film_shares({{{a, 1.2e-4}}, sub}, b);
        EXPECT_NEAR(split.layer_shares[0] + split.layer_shares[1], whole.layer_shares[0], 1e-13);
        EXPECT_NEAR(split.substrate_share, whole.substrate_share, 1e-13);
        EXPECT_NEAR(split.substrate_attenuation, whole.substrate_attenuation, 1e-13);
    }
}

TEST(Film, RefractionMakesTheTopLayerDominateBelowItsCriticalAngle) {
    // Below α_c of the top layer the wave is evanescent (depth ≈ 3-5 nm, Dosch 1987): a 50 nm
    // top layer then gives nearly all the signal; far above, the deeper layers take over.
    const double lambda = 1.5406;
    const DepthSample top = refracting_sample(1.2e-5, 4e-7, lambda), sub = refracting_sample(2.2e-5, 5e-7, lambda);
    const FilmStack st{{{top, 50e-7}}, sub};
    const double ac = critical_angle_deg(1.2e-5);
    EXPECT_GT(film_shares(st, fixed_incidence_angles(40, 0.5 * ac)).layer_shares[0], 0.999);
    EXPECT_LT(film_shares(st, fixed_incidence_angles(40, 10)).layer_shares[0], 0.2);
}

TEST(Film, Errors) {
    EXPECT_THROW(film_shares({{}, geometric_sample(1)}, symmetric_angles(30)), InputError);
    EXPECT_THROW(film_shares({{{geometric_sample(1), 0.0}}, geometric_sample(1)}, symmetric_angles(30)), InputError);
}

}  // namespace
}  // namespace mudepth
