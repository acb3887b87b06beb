// Cylinder and container absorption factors (ITC C §6.3.3; Paalman & Pings 1962).
//
// Sample region. Label a point p of the unit disk (radius R = 1) by the angles
// α, β of its incoming and outgoing rays' impact parameters, y = p·e_y = sin α and
// s = p·d⊥ = sin β (beam along +x, exit d = (cos2θ, sin2θ), d⊥ = (−sin2θ, cos2θ)).
// With u = (α+β)/2, v = (β−α)/2 the disk becomes the RECTANGLE |u| <= π/2 − θ,
// |v| <= θ; dx dy = 2 cos α cos β du dv / sin 2θ, cos α cos β = (cos2u + cos2v)/2,
// and the in+out path is T = 2 cos v cos(u+θ)/cos θ [derived: l_in = x + √(1−y²),
// l_out = −p·d + √(1−s²), x − p·d = −(y+s) tan θ]. The integrand is entire on a
// rectangle, so a product Gauss–Legendre rule converges spectrally; for large μR
// the panels are graded toward the edges where T → 0.
//
// Container region (annulus 1 <= r <= ρ). Polar coordinates, split in ω where a
// ray grazes the sample (r sin ω = ±1 incoming, r sin(ω−2θ) = ±1 outgoing) and in r
// where two such angles meet; each panel carries a sine substitution that removes
// the square-root behaviour at its ends.
//
// Patterns: A(2θ) is an even analytic function of 2θ about 0° and 180°, hence an
// analytic function of cos 2θ; long lists interpolate ln A with Chebyshev–Lobatto
// nodes 2θ_j = 180° j/N, doubling N until the previous interpolant reproduces the
// new nodes to 1e-10 (cylinder) or 1e-9 (container).
#include "mudepth/cylinder.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <numbers>
#include <string>

#include <boost/math/quadrature/gauss.hpp>

#include "format.hpp"
#include "mudepth/error.hpp"

namespace mudepth {

namespace {

constexpr double kPi = std::numbers::pi;

struct Node {
    double x;
    double w;
};

/// The full n-point Gauss–Legendre rule on [−1, 1] (Boost stores the x >= 0 half).
template <unsigned N>
std::vector<Node> legendre_rule() {
    using G = boost::math::quadrature::gauss<double, N>;
    std::vector<Node> out;
    const auto& x = G::abscissa();
    const auto& w = G::weights();
    for (std::size_t i = x.size(); i-- > 0;)
        if (x[i] != 0) out.push_back({-x[i], w[i]});
    for (std::size_t i = 0; i < x.size(); ++i) out.push_back({x[i], w[i]});
    return out;
}

const std::vector<Node>& rule20() {
    static const std::vector<Node> r = legendre_rule<20>();
    return r;
}

/// Composite rule on [−1, 1] graded toward the ends: panels of width h, h, 2h, 4h, ...
/// from each graded end (h >= 1 leaves that end ungraded), 20 Gauss points each.
std::vector<Node> graded_rule(double h_left, double h_right) {
    std::vector<double> cuts{-1.0, 1.0};
    if (h_left < 1 || h_right < 1) cuts.push_back(0.0);
    for (double w = h_left, at = -1 + h_left; h_left < 1 && at < -1e-3; w *= 2, at += w) cuts.push_back(at);
    for (double w = h_right, at = 1 - h_right; h_right < 1 && at > 1e-3; w *= 2, at -= w) cuts.push_back(at);
    std::sort(cuts.begin(), cuts.end());
    std::vector<Node> out;
    for (std::size_t p = 0; p + 1 < cuts.size(); ++p) {
        const double mid = 0.5 * (cuts[p] + cuts[p + 1]), half = 0.5 * (cuts[p + 1] - cuts[p]);
        for (const auto& n : rule20()) out.push_back({mid + half * n.x, half * n.w});
    }
    return out;
}

/// sin(x)/x, 1 at 0.
double sinc(double x) { return std::abs(x) < 1e-4 ? 1 - x * x / 6 : std::sin(x) / x; }

/// √(ρ² − sin²a) − cos a: the wall's share of a chord at impact parameter sin a.
double wall_chord(double rho2_minus_1, double a) {
    return rho2_minus_1 / (std::sqrt(rho2_minus_1 + std::cos(a) * std::cos(a)) + std::cos(a));
}

/// (1/V)∫ exp(−μ_s T_s − μ_c T_c) dV over the SAMPLE (unit disk) at Bragg angle θ
/// (radians); T_c is the wall path (ρ² − 1 = rho2_minus_1), ignored when k_c = 0.
/// With k_c = 0 this is the cylinder's A.
double sample_region(double k_s, double k_c, double rho2_minus_1, double theta) {
    const double c = kPi / 2 - theta;  // complement of θ
    // Panel grading where T → 0 (t → ±1, r → 1): the decay length in the
    // rescaled variables is about 1/(2k); the wall adds a scale √(ρ²−1) at the corners.
    const double k = std::max(k_s, 1e-300);
    double h = std::min(1.0, 2.0 / (2 * k));
    if (k_c > 0) h = std::min(h, std::max(std::sqrt(rho2_minus_1), 0.02));
    static thread_local std::vector<Node> t_nodes, r_nodes;
    t_nodes = graded_rule(h, h);
    r_nodes = graded_rule(1.0, h);
    // g(t) = cos(u + θ)/cos θ = sin(c(1−t))/sin c, written with sinc for c → 0.
    const double sinc_c = sinc(c);
    static thread_local std::vector<double> u_t, g_t, cos2u_t;
    u_t.resize(t_nodes.size());
    g_t.resize(t_nodes.size());
    cos2u_t.resize(t_nodes.size());
    for (std::size_t i = 0; i < t_nodes.size(); ++i) {
        const double t = t_nodes[i].x;
        u_t[i] = c * t;
        g_t[i] = (1 - t) * sinc(c * (1 - t)) / sinc_c;
        cos2u_t[i] = std::cos(2 * u_t[i]);
    }
    double sum = 0;
    for (const auto& rn : r_nodes) {
        const double r = 0.5 * (rn.x + 1);  // r in [0, 1]; the integrand is even in r
        const double v = theta * r;
        const double a_r = 2 * k_s * std::cos(v);
        const double cos2v = std::cos(2 * v);
        double row = 0;
        if (k_c > 0) {
            for (std::size_t i = 0; i < t_nodes.size(); ++i) {
                const double e = a_r * g_t[i] + k_c * (wall_chord(rho2_minus_1, u_t[i] - v) +
                                                       wall_chord(rho2_minus_1, u_t[i] + v));
                row += t_nodes[i].w * std::exp(-e) * (cos2u_t[i] + cos2v);
            }
        } else {
            for (std::size_t i = 0; i < t_nodes.size(); ++i)
                row += t_nodes[i].w * std::exp(-a_r * g_t[i]) * (cos2u_t[i] + cos2v);
        }
        sum += 0.5 * rn.w * row;
    }
    // A = θ c / (π sin 2θ) ∫∫ dt dr over t, r in [−1, 1] = (θ/sin θ)(c/sin c)/(2π) × 2∫_0^1 dr.
    return 2 * sum / (2 * kPi * sinc(theta) * sinc_c);
}

struct WallFactors {
    double with_sample;  ///< A_c,sc
    double empty;        ///< A_c,c
};

/// Wall-region averages at scattering angle phi (radians): ρ the outer radius.
WallFactors wall_region(double k_s, double k_c, double rho, double phi) {
    const double sin_phi = std::sin(phi), cos_phi = std::cos(phi);
    const double rho2 = rho * rho;
    // Radial cuts: 1, ρ, and the radii where an incoming and an outgoing grazing
    // angle coincide: 2a ≡ ±(2θ + δ) (mod 2π), δ in {0, π}, a = arcsin(1/r).
    std::vector<double> r_cuts{1.0, rho};
    const double a_min = std::asin(1 / rho);
    for (double base : {phi, phi + kPi, -phi, -phi + kPi}) {
        double a = std::fmod(base / 2, kPi);
        if (a < 0) a += kPi;
        if (a > a_min + 1e-12 && a < kPi / 2 - 1e-12) r_cuts.push_back(1 / std::sin(a));
    }
    std::sort(r_cuts.begin(), r_cuts.end());

    // Optical paths of a wall point: wall part and sample part, in and out.
    struct Paths {
        double wall, sample;
    };
    auto paths = [&](double r, double om) {
        const double x = r * std::cos(om), y = r * std::sin(om);
        // Incoming ray at height y: it crossed the sample if |y| < 1 and x > 0.
        double s_in = 0, c_in = x + std::sqrt(std::max(0.0, rho2 - y * y));
        if (std::abs(y) < 1 && x > 0) {
            s_in = 2 * std::sqrt(1 - y * y);
            c_in -= s_in;
        }
        // Outgoing ray: impact parameter s, position q along d; it crosses the sample if |s| < 1 and q < 0.
        const double s = -x * sin_phi + y * cos_phi, q = x * cos_phi + y * sin_phi;
        double s_out = 0, c_out = -q + std::sqrt(std::max(0.0, rho2 - s * s));
        if (std::abs(s) < 1 && q < 0) {
            s_out = 2 * std::sqrt(1 - s * s);
            c_out -= s_out;
        }
        return Paths{k_c * (c_in + c_out), k_s * (s_in + s_out)};
    };
    // Panels are cut into equal sub-panels (in the substituted variable) when the
    // attenuation exponent changes by more than about 6 across them (large μR).
    auto pieces = [](double spread) { return static_cast<int>(std::min(16.0, 1 + std::floor(spread / 6))); };

    double sum_sc = 0, sum_c = 0;
    std::vector<double> w_cuts;
    for (std::size_t rp = 0; rp + 1 < r_cuts.size(); ++rp) {
        const double r0 = r_cuts[rp], r1 = r_cuts[rp + 1];
        if (r1 - r0 < 1e-15) continue;
        const int m_r = pieces(2 * (k_c + k_s) * (r1 - r0));
        for (int sub_r = 0; sub_r < m_r; ++sub_r)
            for (const auto& rn : rule20()) {
                // τ in [0, 1]; r = r0 + (r1 − r0) sin²(πτ/2): square-root ends become smooth.
                const double tau = (sub_r + 0.5 * (rn.x + 1)) / m_r;
                const double arg = kPi / 2 * tau;
                const double r = r0 + (r1 - r0) * std::sin(arg) * std::sin(arg);
                const double dr = (r1 - r0) * std::sin(2 * arg) * kPi / 2 * (0.5 * rn.w / m_r);
                const double a = std::asin(std::min(1.0, 1 / r));
                w_cuts.clear();
                for (double base : {a, kPi - a, -a, kPi + a, kPi / 2, -kPi / 2})
                    for (double shift : {0.0, phi}) {
                        double w = std::fmod(base + shift, 2 * kPi);
                        if (w < 0) w += 2 * kPi;
                        w_cuts.push_back(w);
                    }
                w_cuts.push_back(0.0);
                w_cuts.push_back(2 * kPi);
                std::sort(w_cuts.begin(), w_cuts.end());
                double ring_sc = 0, ring_c = 0;
                for (std::size_t wp = 0; wp + 1 < w_cuts.size(); ++wp) {
                    const double w0 = w_cuts[wp], w1 = w_cuts[wp + 1];
                    if (w1 - w0 < 1e-13) continue;
                    const double mid = 0.5 * (w0 + w1), half = 0.5 * (w1 - w0);
                    // ω = mid + half·sin(πσ/2), σ in [−1, 1]: square-root ends become smooth.
                    auto omega = [&](double sigma) { return mid + half * std::sin(kPi / 2 * sigma); };
                    double lo = 1e300, hi = -1e300;
                    for (double sigma : {-1.0, -0.5, 0.0, 0.5, 1.0}) {
                        const Paths p = paths(r, omega(sigma));
                        lo = std::min(lo, p.wall + p.sample);
                        hi = std::max(hi, p.wall + p.sample);
                    }
                    const int m_w = pieces(hi - lo);
                    for (int sub_w = 0; sub_w < m_w; ++sub_w)
                        for (const auto& wn : rule20()) {
                            const double sigma = -1 + (2 * sub_w + wn.x + 1) / m_w;
                            const double dw = half * kPi / 2 * std::cos(kPi / 2 * sigma) * wn.w / m_w;
                            const Paths p = paths(r, omega(sigma));
                            const double wall = std::exp(-p.wall);
                            ring_c += dw * wall;
                            ring_sc += dw * wall * std::exp(-p.sample);
                        }
                }
                sum_sc += dr * r * ring_sc;
                sum_c += dr * r * ring_c;
            }
    }
    const double area = kPi * (rho2 - 1);
    return {sum_sc / area, sum_c / area};
}

void check_angle(double two_theta_deg) {
    if (!std::isfinite(two_theta_deg) || two_theta_deg < 0 || two_theta_deg > 180)
        throw InputError("2θ = " + format_number(two_theta_deg) + "° is outside 0..180°");
}

void check_mu_R(double mu_R, bool zero_allowed) {
    if (!std::isfinite(mu_R) || mu_R < 0 || (mu_R == 0 && !zero_allowed))
        throw InputError("μR = " + format_number(mu_R) + " must be a positive number");
    if (mu_R > kMaxCylinderMuR)
        throw InputError("μR = " + format_number(mu_R) +
                         " is above 30: too absorbing for a capillary; use a thinner capillary or dilute the sample");
}

void check_container(double mu_R_container, double radius_ratio) {
    if (!std::isfinite(radius_ratio) || radius_ratio <= 1)
        throw InputError("radius ratio " + format_number(radius_ratio) +
                         " must be above 1 (outer wall radius over sample radius)");
    if (radius_ratio > kMaxRadiusRatio)
        throw InputError("radius ratio " + format_number(radius_ratio) + " is above 20");
    if (!std::isfinite(mu_R_container) || mu_R_container < 0)
        throw InputError("container μR = " + format_number(mu_R_container) + " must be zero or positive");
    if (mu_R_container * (radius_ratio - 1) > 30)
        throw InputError("the wall's optical thickness μ·wall = " +
                         format_number(mu_R_container * (radius_ratio - 1)) + " is above 30");
}

double radians(double deg) { return deg * kPi / 180; }

/// Chebyshev interpolant on [−1, 1] of m functions, from values at the
/// Chebyshev–Lobatto nodes x_j = cos(πj/N).
class ChebyshevInterpolant {
public:
    /// values[j][i]: function i at node j (N + 1 nodes).
    explicit ChebyshevInterpolant(const std::vector<std::vector<double>>& values) {
        const std::size_t n = values.size() - 1, m = values.front().size();
        std::vector<double> cos_table(2 * n);
        for (std::size_t i = 0; i < 2 * n; ++i)
            cos_table[i] = std::cos(kPi * static_cast<double>(i) / static_cast<double>(n));
        coef_.assign(m, std::vector<double>(n + 1, 0.0));
        for (std::size_t f = 0; f < m; ++f)
            for (std::size_t k = 0; k <= n; ++k) {
                double s = 0;
                for (std::size_t j = 0; j <= n; ++j) {
                    const double term = values[j][f] * cos_table[(j * k) % (2 * n)];
                    s += (j == 0 || j == n) ? 0.5 * term : term;
                }
                s *= 2.0 / static_cast<double>(n);
                if (k == 0 || k == n) s *= 0.5;
                coef_[f][k] = s;
            }
    }
    /// Function f at x (Clenshaw).
    double operator()(std::size_t f, double x) const {
        const auto& a = coef_[f];
        double b1 = 0, b2 = 0;
        for (std::size_t k = a.size(); k-- > 1;) {
            const double b0 = a[k] + 2 * x * b1 - b2;
            b2 = b1;
            b1 = b0;
        }
        return a[0] + x * b1 - b2;
    }

private:
    std::vector<std::vector<double>> coef_;
};

/// ln of m positive functions of 2θ, interpolated piecewise on [0°, 180°] between
/// break angles. On each piece the node count doubles (16 .. 512) until the
/// interpolant from the previous nodes reproduces every new node to `tolerance`;
/// the finer interpolant is kept.
class PatternInterpolant {
public:
    template <class Direct>
    PatternInterpolant(Direct direct, std::vector<double> breaks_deg, double tolerance)
        : breaks_(std::move(breaks_deg)) {
        auto node = [](std::size_t j, std::size_t n) {
            return std::cos(kPi * static_cast<double>(j) / static_cast<double>(n));
        };
        for (std::size_t p = 0; p + 1 < breaks_.size(); ++p) {
            const double lo = breaks_[p], hi = breaks_[p + 1];
            auto log_values = [&](double x) {
                auto v = direct(lo + (hi - lo) * 0.5 * (x + 1));
                for (auto& y : v) y = std::log(y);
                return v;
            };
            std::size_t n = 16;
            std::vector<std::vector<double>> values(n + 1);
            for (std::size_t j = 0; j <= n; ++j) values[j] = log_values(node(j, n));
            for (;;) {
                const ChebyshevInterpolant previous(values);
                std::vector<std::vector<double>> refined(2 * n + 1);
                double worst = 0;
                for (std::size_t j = 0; j <= 2 * n; ++j) {
                    if (j % 2 == 0) {
                        refined[j] = std::move(values[j / 2]);
                        continue;
                    }
                    refined[j] = log_values(node(j, 2 * n));
                    for (std::size_t f = 0; f < refined[j].size(); ++f)
                        worst = std::max(worst, std::abs(previous(f, node(j, 2 * n)) - refined[j][f]));
                }
                values = std::move(refined);
                n *= 2;
                if (worst < tolerance || n >= 512) break;
            }
            parts_.emplace_back(values);
            nodes_ += n;
        }
    }
    /// Function f (exp of the interpolated ln) at 2θ in degrees.
    double operator()(std::size_t f, double two_theta_deg) const {
        std::size_t p = 0;
        while (p + 2 < breaks_.size() && two_theta_deg > breaks_[p + 1]) ++p;
        const double lo = breaks_[p], hi = breaks_[p + 1];
        return std::exp(parts_[p](f, 2 * (two_theta_deg - lo) / (hi - lo) - 1));
    }
    std::size_t node_count() const { return nodes_; }

private:
    std::vector<double> breaks_;
    std::vector<ChebyshevInterpolant> parts_;
    std::size_t nodes_ = 0;
};

/// Lists at most this long are computed point by point.
constexpr std::size_t kDirectUpTo = 24;
constexpr std::size_t kContainerDirectUpTo = 64;

}  // namespace

double cylinder_transmission(double mu_R, double two_theta_deg) {
    check_mu_R(mu_R, false);
    check_angle(two_theta_deg);
    return sample_region(mu_R, 0, 0, radians(two_theta_deg) / 2);
}

std::vector<double> cylinder_transmission(double mu_R, std::span<const double> two_theta_deg) {
    check_mu_R(mu_R, false);
    for (double a : two_theta_deg) check_angle(a);
    std::vector<double> out;
    out.reserve(two_theta_deg.size());
    if (two_theta_deg.size() <= kDirectUpTo) {
        for (double a : two_theta_deg) out.push_back(sample_region(mu_R, 0, 0, radians(a) / 2));
        return out;
    }
    // A is analytic in θ on [0°, 90°]: one piece, spectral convergence.
    const PatternInterpolant interpolant(
        [&](double a) { return std::vector<double>{sample_region(mu_R, 0, 0, radians(a) / 2)}; }, {0.0, 180.0},
        1e-10);
    for (double a : two_theta_deg) out.push_back(interpolant(0, a));
    return out;
}

namespace {

std::vector<double> container_direct(double k_s, double k_c, double rho, double two_theta_deg) {
    const double phi = radians(two_theta_deg);
    const double rho2_minus_1 = (rho - 1) * (rho + 1);
    const double a_ss = k_s > 0 ? sample_region(k_s, 0, 0, phi / 2) : 1.0;
    const double a_ssc = k_c > 0 ? sample_region(k_s, k_c, rho2_minus_1, phi / 2) : a_ss;
    const WallFactors wall = wall_region(k_s, k_c, rho, phi);
    return {a_ss, a_ssc, wall.with_sample, wall.empty};
}

}  // namespace

ContainerFactors container_factors(double mu_R_sample, double mu_R_container, double radius_ratio,
                                   double two_theta_deg) {
    check_mu_R(mu_R_sample, true);
    check_container(mu_R_container, radius_ratio);
    check_angle(two_theta_deg);
    const auto v = container_direct(mu_R_sample, mu_R_container, radius_ratio, two_theta_deg);
    return {v[0], v[1], v[2], v[3]};
}

std::vector<ContainerFactors> container_factors(double mu_R_sample, double mu_R_container, double radius_ratio,
                                                std::span<const double> two_theta_deg) {
    check_mu_R(mu_R_sample, true);
    check_container(mu_R_container, radius_ratio);
    for (double a : two_theta_deg) check_angle(a);
    std::vector<ContainerFactors> out;
    out.reserve(two_theta_deg.size());
    if (two_theta_deg.size() <= kContainerDirectUpTo) {
        for (double a : two_theta_deg) {
            const auto v = container_direct(mu_R_sample, mu_R_container, radius_ratio, a);
            out.push_back({v[0], v[1], v[2], v[3]});
        }
        return out;
    }
    const double k_s = mu_R_sample, k_c = mu_R_container, rho = radius_ratio;
    // The sample-region factors are analytic in θ (one piece); the wall factors
    // have weak singularities where a radial cut enters the wall at r = ρ, i.e.
    // at 2θ = 2 arcsin(1/ρ) and 180° − 2 arcsin(1/ρ): the pieces end there.
    const PatternInterpolant sample_part(
        [&](double a) {
            const double a_ss = k_s > 0 ? sample_region(k_s, 0, 0, radians(a) / 2) : 1.0;
            const double a_ssc = k_c > 0 ? sample_region(k_s, k_c, (rho - 1) * (rho + 1), radians(a) / 2) : a_ss;
            return std::vector<double>{a_ss, a_ssc};
        },
        {0.0, 180.0}, 1e-10);
    const double graze_deg = 2 * std::asin(1 / rho) * 180 / kPi;
    std::vector<double> breaks{0.0, 180.0};
    for (double b : {graze_deg, 180 - graze_deg})
        if (b > 1 && b < 179) breaks.push_back(b);
    std::sort(breaks.begin(), breaks.end());
    if (breaks.size() == 4 && breaks[2] - breaks[1] < 1) breaks.erase(breaks.begin() + 2);
    const PatternInterpolant wall_part(
        [&](double a) {
            const WallFactors w = wall_region(k_s, k_c, rho, radians(a));
            return std::vector<double>{w.with_sample, w.empty};
        },
        breaks, 3e-7);
    for (double a : two_theta_deg)
        out.push_back({sample_part(0, a), sample_part(1, a), wall_part(0, a), wall_part(1, a)});
    return out;
}

double container_corrected_intensity(const ContainerFactors& f, double I_sample_in_container,
                                     double I_empty_container) {
    return (I_sample_in_container - f.A_c_sc / f.A_c_c * I_empty_container) / f.A_s_sc;
}

}  // namespace mudepth
