// Absorption correction of measured patterns. Every factor comes from the
// plate and cylinder units (plate_transmission, window_transmission,
// cylinder_transmission, container_factors, container_corrected_intensity).
#include "mudepth/correct.hpp"

#include <algorithm>
#include <cmath>
#include <string>

#include "format.hpp"
#include "mudepth/error.hpp"

namespace mudepth {

namespace {

PlateMode plate_mode(CorrectionGeometry g) {
    switch (g) {
        case CorrectionGeometry::reflection: return PlateMode::reflection;
        case CorrectionGeometry::transmission_normal: return PlateMode::transmission_normal;
        case CorrectionGeometry::transmission_symmetric: return PlateMode::transmission_symmetric;
        case CorrectionGeometry::cylinder: break;
    }
    throw InputError("a cylinder is not a plate");
}

struct Evaluated {
    std::vector<double> correction;
    std::vector<ContainerFactors> container;  ///< cylinder in a wall only
};

/// The factors; on an InputError, `failed` is the index of the angle at fault.
Evaluated evaluate(const CorrectionSetup& s, std::span<const double> angles, std::size_t& failed) {
    Evaluated e;
    failed = 0;
    if (s.geometry == CorrectionGeometry::cylinder) {
        if (s.incidence_deg) throw InputError("a fixed incidence applies to reflection only, not to a cylinder");
        if (s.mu_t_window) throw InputError("window foils apply to plates; a capillary's wall is a container wall");
        for (std::size_t i = 0; i < angles.size(); ++i)
            if (!(angles[i] >= 0 && angles[i] <= 180)) {
                failed = i;
                throw InputError("2θ = " + format_number(angles[i], 8) + "° is outside 0..180°");
            }
        if (s.wall) {
            e.container = container_factors(s.mu_R, s.wall->mu_R, s.wall->radius_ratio, angles);
            e.correction.reserve(angles.size());
            for (const auto& f : e.container) e.correction.push_back(1 / f.A_s_sc);
        } else {
            e.correction = cylinder_transmission(s.mu_R, angles);
            for (double& a : e.correction) a = 1 / a;
        }
    } else {
        if (s.wall) throw InputError("a container wall applies to a cylinder, not to a plate");
        const PlateMode mode = plate_mode(s.geometry);
        e.correction.resize(angles.size());
        for (std::size_t i = 0; i < angles.size(); ++i) {
            failed = i;
            // As `mudepth plate` prints it: 1/(sample × windows), windows 1 when there are none.
            const double sample = plate_transmission(mode, s.mu_t, angles[i], s.incidence_deg);
            const double window = s.mu_t_window ? window_transmission(mode, *s.mu_t_window, angles[i], s.incidence_deg) : 1.0;
            e.correction[i] = 1 / (sample * window);
        }
    }
    for (std::size_t i = 0; i < e.correction.size(); ++i)
        if (!std::isfinite(e.correction[i])) {
            failed = i;
            throw InputError("at 2θ = " + format_number(angles[i], 8) +
                             "° the sample lets through less than 1e-308 of the beam: nothing is left to correct");
        }
    return e;
}

std::string where(const Pattern& p, std::size_t index) {
    std::string w = p.name;
    w.append(":").append(std::to_string(index < p.line.size() ? p.line[index] : 0)).append(": ");
    return w;
}

double interpolate(std::span<const double> y, const Bracket& b) {
    if (b.weight == 0) return y[b.lower];
    return (1 - b.weight) * y[b.lower] + b.weight * y[b.lower + 1];
}

std::string deg(double v) { return format_number(v, 8) + "°"; }

}  // namespace

CorrectionGeometry parse_correction_geometry(std::string_view text) {
    if (text == "cylinder") return CorrectionGeometry::cylinder;
    if (text == "reflection") return CorrectionGeometry::reflection;
    if (text == "transmission-normal") return CorrectionGeometry::transmission_normal;
    if (text == "transmission-symmetric") return CorrectionGeometry::transmission_symmetric;
    throw InputError("unknown geometry '" + std::string(text) +
                     "'; geometries: cylinder, reflection, transmission-normal, transmission-symmetric");
}

std::string_view to_string(CorrectionGeometry g) {
    switch (g) {
        case CorrectionGeometry::cylinder: return "cylinder";
        case CorrectionGeometry::reflection: return "reflection";
        case CorrectionGeometry::transmission_normal: return "transmission-normal";
        case CorrectionGeometry::transmission_symmetric: return "transmission-symmetric";
    }
    return "?";
}

std::vector<double> correction_factors(const CorrectionSetup& setup, std::span<const double> two_theta_deg) {
    std::size_t failed = 0;
    return evaluate(setup, two_theta_deg, failed).correction;
}

Normalization parse_normalization(std::string_view text) {
    if (text == "none") return {};
    if (text == "max") return {NormalizationMode::max, 0};
    if (text.substr(0, 3) == "at:") {
        const std::string number(text.substr(3));
        char* end = nullptr;
        const double v = std::strtod(number.c_str(), &end);
        if (!number.empty() && end == number.c_str() + number.size() && std::isfinite(v) && v >= 0 && v <= 180)
            return {NormalizationMode::at, v};
        throw InputError("normalisation '" + std::string(text) + "': the angle after at: must be a 2θ from 0 to 180°");
    }
    throw InputError("unknown normalisation '" + std::string(text) + "'; use none, max or at:2THETA (degrees)");
}

std::optional<Bracket> bracket(std::span<const double> x, double at) {
    if (x.empty() || !(at >= x.front() && at <= x.back())) return std::nullopt;
    if (x.size() == 1) return Bracket{0, 0};
    const auto it = std::upper_bound(x.begin(), x.end(), at);
    std::size_t upper = static_cast<std::size_t>(it - x.begin());
    if (upper >= x.size()) return Bracket{x.size() - 1, 0};  // at == x.back()
    const std::size_t lower = upper - 1;
    const double w = (at - x[lower]) / (x[upper] - x[lower]);
    return Bracket{lower, w};
}

CorrectedPattern correct_pattern(const Pattern& p, const CorrectionSetup& setup, const CorrectionOptions& options) {
    CorrectedPattern out;
    const std::size_t n = p.size();
    Evaluated e;
    {
        std::size_t failed = 0;
        try {
            e = evaluate(setup, p.two_theta_deg, failed);
        } catch (const InputError& error) {
            throw InputError(where(p, failed) + error.what());
        }
    }
    out.correction = std::move(e.correction);
    out.intensity.resize(n);
    if (p.has_sigma()) out.sigma.resize(n);

    if (options.empty) {
        const Pattern& c = *options.empty;
        if (setup.geometry != CorrectionGeometry::cylinder || !setup.wall)
            throw InputError("an empty-container scan needs the cylinder geometry with its container wall");
        if (!(options.empty_scale > 0) || !std::isfinite(options.empty_scale))
            throw InputError("the empty-container scale " + format_number(options.empty_scale) + " must be positive");
        const double lo = c.two_theta_deg.front(), hi = c.two_theta_deg.back();
        const double tol = 1e-9 * std::max(1.0, hi);
        if (p.two_theta_deg.back() < lo - tol || p.two_theta_deg.front() > hi + tol)
            throw InputError(p.name + ": its 2θ range " + deg(p.two_theta_deg.front()) + " to " +
                             deg(p.two_theta_deg.back()) + " and the empty-container scan's (" + c.name + ", " +
                             deg(lo) + " to " + deg(hi) + ") do not overlap");
        const bool empty_sigma = c.has_sigma();
        if (p.has_sigma() && !empty_sigma)
            out.notes.push_back("the empty-container scan has no sigma: sigma covers the sample scan's only");
        out.subtracted.resize(n);
        for (std::size_t i = 0; i < n; ++i) {
            const double x = std::clamp(p.two_theta_deg[i], lo, hi);
            if (std::abs(x - p.two_theta_deg[i]) > tol)
                throw InputError(where(p, i) + "2θ = " + deg(p.two_theta_deg[i]) +
                                 " lies outside the empty-container scan (" + c.name + ", " + deg(lo) + " to " +
                                 deg(hi) + "); the empty container must be measured over the sample's whole range");
            const Bracket b = *bracket(c.two_theta_deg, x);
            const double I_c = options.empty_scale * interpolate(c.intensity, b);
            const ContainerFactors& f = e.container[i];
            out.intensity[i] = container_corrected_intensity(f, p.intensity[i], I_c);
            const double k = f.A_c_sc / f.A_c_c;
            out.subtracted[i] = k * I_c;
            if (p.has_sigma()) {
                double var_c = 0;
                if (empty_sigma) {
                    const double s0 = c.sigma[b.lower], s1 = b.weight == 0 ? 0.0 : c.sigma[b.lower + 1];
                    var_c = (1 - b.weight) * (1 - b.weight) * s0 * s0 + b.weight * b.weight * s1 * s1;
                    var_c *= options.empty_scale * options.empty_scale;
                }
                out.sigma[i] = std::sqrt(p.sigma[i] * p.sigma[i] + k * k * var_c) * out.correction[i];
            }
        }
    } else {
        for (std::size_t i = 0; i < n; ++i) out.intensity[i] = p.intensity[i] * out.correction[i];
        if (p.has_sigma())
            for (std::size_t i = 0; i < n; ++i) out.sigma[i] = p.sigma[i] * out.correction[i];
    }

    if (options.normalization.mode != NormalizationMode::none) {
        double divisor = 0;
        if (options.normalization.mode == NormalizationMode::max) {
            divisor = *std::max_element(out.intensity.begin(), out.intensity.end());
            if (!(divisor > 0))
                throw InputError(p.name + ": the largest corrected intensity is " + format_number(divisor) +
                                 "; cannot normalise to it");
        } else {
            const double at = options.normalization.at_two_theta_deg;
            const auto b = bracket(p.two_theta_deg, at);
            if (!b)
                throw InputError(p.name + ": the normalisation angle 2θ = " + deg(at) + " lies outside the pattern (" +
                                 deg(p.two_theta_deg.front()) + " to " + deg(p.two_theta_deg.back()) + ")");
            divisor = interpolate(out.intensity, *b);
            if (!(divisor > 0))
                throw InputError(p.name + ": the corrected intensity at 2θ = " + deg(at) + " is " +
                                 format_number(divisor) + "; cannot normalise to it");
        }
        out.normalization_divisor = divisor;
        for (double& v : out.intensity) v /= divisor;
        for (double& v : out.sigma) v /= divisor;
    }
    return out;
}

}  // namespace mudepth
