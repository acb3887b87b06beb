// Independent brute-force references for the cylinder tests: Gauss–Legendre
// rules of any order from Boost's Legendre zeros, ray chords through circles,
// a POLAR grid over the sample disk and a CARTESIAN (beam-frame) grid over the
// sample and the wall — different coordinates and cuts from production.
#pragma once

#include <algorithm>
#include <cmath>
#include <numbers>
#include <vector>

#include <boost/math/special_functions/legendre.hpp>

namespace mudepth::test {

struct LegendreRule {
    std::vector<double> x, w;
};

/// n-point Gauss–Legendre on [−1, 1] (nodes: Boost legendre_p_zeros; w = 2/((1−x²)P'ₙ(x)²)).
inline LegendreRule legendre_rule(unsigned n) {
    LegendreRule g;
    for (double xi : boost::math::legendre_p_zeros<double>(static_cast<int>(n))) {
        const double p = boost::math::legendre_p_prime(static_cast<int>(n), xi);
        const double wi = 2 / ((1 - xi * xi) * p * p);
        if (xi != 0) {
            g.x.push_back(-xi);
            g.w.push_back(wi);
        }
        g.x.push_back(xi);
        g.w.push_back(wi);
    }
    return g;
}

/// Length of the half-ray {p + l d, l >= 0} inside the circle of radius R (d a unit vector).
inline double ray_chord(double px, double py, double dx, double dy, double R) {
    const double b = px * dx + py * dy, c = px * px + py * py - R * R, disc = b * b - c;
    if (disc <= 0) return 0;
    const double root = std::sqrt(disc);
    return std::max(0.0, -b + root - std::max(0.0, -b - root));
}

/// A of the unit disk by a polar grid: r = 1 − σ² (σ Gauss–Legendre, nr nodes),
/// ω cut at the four boundary points where a chord is tangent, nw nodes per cut.
inline double polar_cylinder_reference(double mu_R, double two_theta_deg, unsigned nr, unsigned nw) {
    const double pi = std::numbers::pi, phi = two_theta_deg * pi / 180;
    const auto gr = legendre_rule(nr), gw = legendre_rule(nw);
    std::vector<double> cuts{0, 2 * pi};
    for (double c : {pi / 2, -pi / 2, phi + pi / 2, phi - pi / 2}) {
        c = std::fmod(c, 2 * pi);
        cuts.push_back(c < 0 ? c + 2 * pi : c);
    }
    std::sort(cuts.begin(), cuts.end());
    const double dx = std::cos(phi), dy = std::sin(phi);
    double sum = 0;
    for (std::size_t i = 0; i < gr.x.size(); ++i) {
        const double sigma = 0.5 * (gr.x[i] + 1), r = 1 - sigma * sigma, dr = sigma * gr.w[i];
        for (std::size_t p = 0; p + 1 < cuts.size(); ++p) {
            const double a = cuts[p], b = cuts[p + 1];
            if (b - a < 1e-14) continue;
            for (std::size_t j = 0; j < gw.x.size(); ++j) {
                const double om = 0.5 * (a + b) + 0.5 * (b - a) * gw.x[j], dw = 0.5 * (b - a) * gw.w[j];
                const double x = r * std::cos(om), y = r * std::sin(om);
                const double path = ray_chord(x, y, -1, 0, 1) + ray_chord(x, y, dx, dy, 1);
                sum += dr * dw * r * std::exp(-mu_R * path);
            }
        }
    }
    return sum / pi;
}

struct WallReference {
    double A_s_sc, A_c_sc, A_c_c;
};

/// The container factors by a Cartesian beam-frame grid (radii in units of the sample
/// radius, wall outer radius rho): y cut at ±1, ±ρ, ±cos2θ, ±ρcos2θ and where the
/// outgoing grazing lines meet the outer circle; x cut at the inner circle and the
/// outgoing grazing lines; each panel with x = mid + half·sin(πs/2), n nodes.
inline WallReference cartesian_container_reference(double k_s, double k_c, double rho, double two_theta_deg,
                                                   unsigned n) {
    const double pi = std::numbers::pi, phi = two_theta_deg * pi / 180, cp = std::cos(phi), sp = std::sin(phi);
    const auto g = legendre_rule(n);
    std::vector<double> ycuts{-rho, rho, -1, 1, cp, -cp, rho * cp, -rho * cp};
    const double q = std::sqrt(rho * rho - 1) * sp;
    for (double a : {cp, -cp})
        for (double b : {q, -q}) ycuts.push_back(a + b);
    std::sort(ycuts.begin(), ycuts.end());
    auto sine_map = [&](double lo, double hi, std::size_t i, double& x, double& w) {
        const double s = std::sin(pi / 2 * g.x[i]);
        x = 0.5 * (lo + hi) + 0.5 * (hi - lo) * s;
        w = 0.5 * (hi - lo) * pi / 2 * std::cos(pi / 2 * g.x[i]) * g.w[i];
    };
    double ssc = 0, csc = 0, cc = 0;
    for (std::size_t p = 0; p + 1 < ycuts.size(); ++p) {
        const double y0 = std::max(-rho, ycuts[p]), y1 = std::min(rho, ycuts[p + 1]);
        if (y1 - y0 < 1e-14) continue;
        for (std::size_t i = 0; i < g.x.size(); ++i) {
            double y, wy;
            sine_map(y0, y1, i, y, wy);
            const double X = std::sqrt(std::max(0.0, rho * rho - y * y));
            std::vector<double> xc{-X, X};
            if (std::abs(y) < 1) {
                xc.push_back(-std::sqrt(1 - y * y));
                xc.push_back(std::sqrt(1 - y * y));
            }
            if (sp > 1e-12)
                for (double s : {1.0, -1.0}) {
                    const double x = (y * cp - s) / sp;
                    if (x > -X && x < X) xc.push_back(x);
                }
            std::sort(xc.begin(), xc.end());
            for (std::size_t k = 0; k + 1 < xc.size(); ++k) {
                const double x0 = xc[k], x1 = xc[k + 1];
                if (x1 - x0 < 1e-14) continue;
                const double xm = 0.5 * (x0 + x1);
                const bool in_sample = xm * xm + y * y < 1;
                for (std::size_t j = 0; j < g.x.size(); ++j) {
                    double x, wx;
                    sine_map(x0, x1, j, x, wx);
                    const double w = wy * wx;
                    const double si = ray_chord(x, y, -1, 0, 1), so = ray_chord(x, y, cp, sp, 1);
                    const double ci = ray_chord(x, y, -1, 0, rho) - si, co = ray_chord(x, y, cp, sp, rho) - so;
                    if (in_sample) {
                        ssc += w * std::exp(-k_s * (si + so) - k_c * (ci + co));
                    } else {
                        const double wall = std::exp(-k_c * (ci + co));
                        cc += w * wall;
                        csc += w * wall * std::exp(-k_s * (si + so));
                    }
                }
            }
        }
    }
    const double wall_area = pi * (rho * rho - 1);
    return {ssc / pi, csc / wall_area, cc / wall_area};
}

}  // namespace mudepth::test
