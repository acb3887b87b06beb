// `mudepth depth`: depth probed versus 2θ, incidence or tilt; the angle for a
// target depth; the transparency shift. The physics is in mudepth/depth.hpp.
#include <algorithm>
#include <cmath>
#include <iostream>
#include <memory>
#include <numbers>
#include <optional>

#include <nlohmann/json.hpp>

#include "cli/commands.hpp"
#include "cli/common.hpp"
#include "cli/output.hpp"
#include "cli/plot.hpp"
#include "mudepth/attenuation.hpp"
#include "mudepth/depth.hpp"
#include "mudepth/error.hpp"
#include "mudepth/refraction.hpp"

namespace mudepth::cli {

namespace {

struct DepthOptions {
    SampleOptions sample;
    RadiationOptions radiation;
    std::string table = "elam";
    std::string mu;
    std::string two_theta;
    std::string incidence;
    std::string tilt;
    std::string tilt_mode = "side";
    std::string fraction = "0.9";
    std::string target_depth;
    std::string radius;
    std::string thickness;
    bool json = false;
    bool csv = false;
    std::string plot;
    const CLI::Option* tilt_mode_option = nullptr;
};

enum class Mode { symmetric, incidence, tilt, inverse_incidence, inverse_tilt };

struct Point {
    double two_theta_deg = 0;
    std::optional<double> tilt_deg;
    bool reachable = true;
    BeamAngles angles;
    double depth_1e_um = 0;
    double depth_fraction_um = 0;
    std::optional<double> shift_deg;
    double min_depth_um = 0, max_depth_um = 0;  // inverse only
};

struct DepthReport {
    std::string sample_name;
    std::string radiation;  // empty with --mu
    double energy_keV = 0;
    double mu_per_cm = 0;
    std::optional<Refraction> refraction;
    std::optional<double> density_g_cm3;
    DepthSample sample;
    Mode mode = Mode::symmetric;
    TiltMode tilt_mode = TiltMode::side_inclination;
    double fraction = 0.9;
    std::optional<double> target_um, thickness_cm, radius_cm;
    std::vector<Point> points;
    enum class Axis { two_theta, incidence, tilt } axis = Axis::two_theta;
};

bool sample_given(const SampleOptions& s) {
    return !s.formula.empty() || !s.material.empty() || !s.phases.empty() || !s.density.empty() ||
           !s.bulk_density.empty() || !s.packing.empty() || !s.cell.empty();
}

std::string mode_name(const DepthReport& r) {
    const std::string tilt = r.tilt_mode == TiltMode::omega ? "omega-tilt" : "side-inclination";
    switch (r.mode) {
        case Mode::symmetric: return "symmetric";
        case Mode::incidence: return "fixed-incidence";
        case Mode::tilt: return tilt;
        case Mode::inverse_incidence: return "incidence-for-target-depth";
        case Mode::inverse_tilt: return tilt + "-for-target-depth";
    }
    return "";
}

void set_sample(const DepthOptions& o, DepthReport& r) {
    if (!o.mu.empty()) {
        if (sample_given(o.sample))
            throw InputError("give either --mu or the sample (--formula, --material, --phase), not both");
        if (!o.radiation.energy.empty() || !o.radiation.wavelength.empty() || !o.radiation.source.empty())
            throw InputError("--mu gives μ directly: leave out --energy, --wavelength and --source, or describe the "
                             "sample instead to have refraction applied");
        const double mu = parse_number("--mu", o.mu);
        if (mu <= 0) throw InputError("--mu: " + o.mu + " 1/cm must be positive");
        // Real samples at 1..500 keV lie within about 1e-7..3e5 1/cm, gases to heavy metals at 1 keV (from memory).
        if (mu < 1e-8 || mu > 1e6) throw InputError("--mu: " + o.mu + " 1/cm is outside 1e-8..1e6 1/cm");
        r.sample = geometric_sample(mu);
        r.mu_per_cm = mu;
        r.sample_name = "μ = " + fmt(mu, 6) + " 1/cm (given with --mu)";
        return;
    }
    const Material m = build_material(o.sample);
    const Radiation rad = build_radiation(o.radiation);
    const Attenuation a = attenuation(m, rad.energy_keV, build_table(o.table));
    r.sample_name = m.name;
    r.radiation = rad.label;
    r.energy_keV = rad.energy_keV;
    r.mu_per_cm = a.mu_per_cm;
    r.density_g_cm3 = m.density_g_cm3();
    r.refraction = refraction(m, rad.energy_keV, a.mu_per_cm);
    r.sample = refracting_sample(r.refraction->delta, r.refraction->beta, rad.wavelength_A());
    r.sample.mu_per_cm = a.mu_per_cm;  // the same μ, not its round trip through β
}

Point make_point(const DepthReport& r, double two_theta, BeamAngles angles) {
    Point p;
    p.two_theta_deg = two_theta;
    p.angles = angles;
    p.depth_1e_um = depth_1e_um(r.sample, angles);
    p.depth_fraction_um = depth_holding_fraction_um(p.depth_1e_um, r.fraction, r.thickness_cm);
    return p;
}

DepthReport compute(const DepthOptions& o) {
    DepthReport r;
    if (o.two_theta.empty()) throw InputError("depth needs --two-theta (START:STOP:STEP or a list, degrees)");
    const auto two_thetas = parse_angles_deg("--two-theta", o.two_theta);
    r.fraction = parse_number("--fraction", o.fraction);
    if (r.fraction <= 0 || r.fraction >= 1) throw InputError("--fraction " + o.fraction + " is outside (0, 1)");
    if (!o.thickness.empty()) r.thickness_cm = parse_length_cm("--thickness", o.thickness);
    if (!o.radius.empty()) r.radius_cm = parse_length_cm("--goniometer-radius", o.radius);
    if (!o.target_depth.empty()) r.target_um = parse_length_cm("--target-depth", o.target_depth) * 1e4;
    if (o.tilt_mode != "side" && o.tilt_mode != "omega")
        throw InputError("--tilt-mode: '" + o.tilt_mode + "' is not side or omega");
    r.tilt_mode = o.tilt_mode == "omega" ? TiltMode::omega : TiltMode::side_inclination;
    const bool tilt_mode_given = o.tilt_mode_option && o.tilt_mode_option->count() > 0;

    if (!o.incidence.empty() && !o.tilt.empty()) throw InputError("give either --incidence or --tilt, not both");
    if (r.target_um) {
        if (!o.incidence.empty() || !o.tilt.empty())
            throw InputError("--target-depth solves for the angle; leave out --incidence and --tilt");
        r.mode = tilt_mode_given ? Mode::inverse_tilt : Mode::inverse_incidence;
    } else if (!o.incidence.empty()) {
        r.mode = Mode::incidence;
    } else if (!o.tilt.empty()) {
        r.mode = Mode::tilt;
    }
    if (r.radius_cm && r.mode != Mode::symmetric)
        throw InputError("--goniometer-radius gives the transparency shift of symmetric (Bragg-Brentano) "
                         "reflection; leave out --incidence, --tilt and --target-depth");
    set_sample(o, r);

    std::vector<double> second;  // incidences or tilts
    if (r.mode == Mode::incidence) second = parse_angles_deg("--incidence", o.incidence);
    if (r.mode == Mode::tilt) second = parse_angles_deg("--tilt", o.tilt);
    if (second.size() > 1 && two_thetas.size() > 1)
        throw InputError(std::string(r.mode == Mode::tilt ? "--tilt" : "--incidence") +
                         " with several angles needs a single --two-theta");
    if (second.size() > 1) r.axis = r.mode == Mode::tilt ? DepthReport::Axis::tilt : DepthReport::Axis::incidence;

    for (double tt : two_thetas) {
        switch (r.mode) {
            case Mode::symmetric: {
                Point p = make_point(r, tt, symmetric_angles(tt));
                if (r.radius_cm) p.shift_deg = transparency_shift_deg(r.mu_per_cm, tt, *r.radius_cm, r.thickness_cm);
                r.points.push_back(p);
                break;
            }
            case Mode::incidence:
                for (double a : second) r.points.push_back(make_point(r, tt, fixed_incidence_angles(tt, a)));
                break;
            case Mode::tilt:
                for (double psi : second) {
                    Point p = make_point(r, tt, r.tilt_mode == TiltMode::omega ? omega_tilt_angles(tt, psi)
                                                                               : side_inclination_angles(tt, psi));
                    p.tilt_deg = psi;
                    r.points.push_back(p);
                }
                break;
            case Mode::inverse_incidence:
            case Mode::inverse_tilt: {
                symmetric_angles(tt);  // checks 2θ
                const AngleForDepth s = r.mode == Mode::inverse_tilt
                                            ? tilt_for_depth(r.sample, r.tilt_mode, tt, *r.target_um)
                                            : incidence_for_depth(r.sample, tt, *r.target_um);
                Point p;
                if (s.reachable) p = make_point(r, tt, s.angles);
                p.two_theta_deg = tt;
                p.reachable = s.reachable;
                if (r.mode == Mode::inverse_tilt && s.reachable) p.tilt_deg = s.angle_deg;
                p.min_depth_um = s.min_depth_um;
                p.max_depth_um = s.max_depth_um;
                r.points.push_back(p);
                break;
            }
        }
    }
    return r;
}

/// Unit for a column of depths: the one that reads best for their median.
struct LengthUnit {
    const char* name;
    double per_um;
};
LengthUnit unit_for(std::vector<double> depths_um) {
    depths_um.erase(std::remove_if(depths_um.begin(), depths_um.end(), [](double v) { return !(v > 0); }),
                    depths_um.end());
    if (depths_um.empty()) return {"µm", 1};
    std::nth_element(depths_um.begin(), depths_um.begin() + depths_um.size() / 2, depths_um.end());
    const double median = depths_um[depths_um.size() / 2];
    if (median < 1) return {"nm", 1e3};
    if (median < 1000) return {"µm", 1};
    return {"mm", 1e-3};
}

std::string percent_label(double fraction) { return fmt(100 * fraction, 4) + " %"; }

std::string range_text(const Point& p) {
    return "reachable " + length_from_um(p.min_depth_um) + " to " + length_from_um(p.max_depth_um);
}

std::string unreachable_text(const DepthReport& r, const Point& p) {
    const std::string target = length_from_um(*r.target_um);
    if (*r.target_um < p.min_depth_um)
        return "unreachable: " + target + " is shallower than the " +
               (r.refraction ? "evanescent minimum " : "minimum ") + length_from_um(p.min_depth_um) + "; " +
               range_text(p);
    return "unreachable: " + target + " is deeper than the symmetric maximum " + length_from_um(p.max_depth_um) +
           "; " + range_text(p);
}

bool inverse(const DepthReport& r) { return r.mode == Mode::inverse_incidence || r.mode == Mode::inverse_tilt; }
bool has_tilt(const DepthReport& r) { return r.mode == Mode::tilt || r.mode == Mode::inverse_tilt; }

double evanescent_um(const DepthReport& r) {
    const auto& o = *r.sample.optics;
    return beam_depth_1e_um(o.delta, o.beta, o.wavelength_A, 0.0);
}

void print_json(const DepthReport& r) {
    nlohmann::json j;
    j["sample"] = r.sample_name;
    j["geometry"] = mode_name(r);
    j["mu_per_cm"] = r.mu_per_cm;
    j["attenuation_length_um"] = 1e4 / r.mu_per_cm;
    if (r.density_g_cm3) j["density_g_cm3"] = *r.density_g_cm3;
    if (!r.radiation.empty()) {
        j["radiation"] = r.radiation;
        j["energy_keV"] = r.energy_keV;
        j["wavelength_A"] = r.sample.optics->wavelength_A;
    }
    j["refraction_applied"] = r.refraction.has_value();
    if (r.refraction) {
        j["delta"] = r.refraction->delta;
        j["beta"] = r.refraction->beta;
        j["critical_angle_deg"] = r.refraction->critical_angle_deg;
        j["evanescent_depth_um"] = evanescent_um(r);
    } else {
        j["delta"] = nullptr;
        j["beta"] = nullptr;
        j["critical_angle_deg"] = nullptr;
    }
    j["fraction"] = r.fraction;
    if (r.thickness_cm) j["thickness_um"] = *r.thickness_cm * 1e4;
    if (r.radius_cm) j["goniometer_radius_mm"] = *r.radius_cm * 10;
    if (r.target_um) j["target_depth_um"] = *r.target_um;
    j["points"] = nlohmann::json::array();
    for (const auto& p : r.points) {
        nlohmann::json q;
        q["two_theta_deg"] = p.two_theta_deg;
        if (inverse(r)) q["reachable"] = p.reachable;
        auto value = [&](double v) { return p.reachable ? nlohmann::json(v) : nlohmann::json(); };
        q["incidence_deg"] = value(p.angles.incidence_deg);
        q["exit_deg"] = value(p.angles.exit_deg);
        if (has_tilt(r)) q["tilt_deg"] = p.tilt_deg ? nlohmann::json(*p.tilt_deg) : nlohmann::json();
        q["depth_1e_um"] = value(p.depth_1e_um);
        q["depth_fraction_um"] = value(p.depth_fraction_um);
        if (p.shift_deg) q["peak_shift_deg"] = *p.shift_deg;
        if (inverse(r)) {
            q["min_depth_um"] = p.min_depth_um;
            q["max_depth_um"] = p.max_depth_um;
            if (!p.reachable) q["note"] = unreachable_text(r, p);
        }
        j["points"].push_back(q);
    }
    std::cout << j.dump(2) << '\n';
}

void print_csv(const DepthReport& r) {
    std::cout << "# mudepth depth: " << r.sample_name << ", mu " << fmt(r.mu_per_cm, 8) << " 1/cm, " << mode_name(r);
    if (r.refraction)
        std::cout << ", refraction delta " << fmt(r.refraction->delta, 6) << " beta " << fmt(r.refraction->beta, 6)
                  << " critical angle " << fmt(r.refraction->critical_angle_deg, 6) << " deg";
    else
        std::cout << ", refraction not applied";
    std::cout << ", fraction " << fmt(r.fraction, 6) << '\n';
    std::vector<std::string> header{"two_theta_deg", "incidence_deg", "exit_deg"};
    if (has_tilt(r)) header.push_back("tilt_deg");
    header.insert(header.end(), {"depth_1e_um", "depth_fraction_um"});
    if (r.radius_cm) header.push_back("peak_shift_deg");
    if (inverse(r)) header.insert(header.end(), {"reachable", "min_depth_um", "max_depth_um"});
    Table t(header);
    for (const auto& p : r.points) {
        auto v = [&](double x) { return p.reachable ? fmt(x, 10) : std::string(); };
        std::vector<std::string> row{fmt(p.two_theta_deg, 10), v(p.angles.incidence_deg), v(p.angles.exit_deg)};
        if (has_tilt(r)) row.push_back(p.tilt_deg ? fmt(*p.tilt_deg, 10) : std::string());
        row.insert(row.end(), {v(p.depth_1e_um), v(p.depth_fraction_um)});
        if (r.radius_cm) row.push_back(fmt(*p.shift_deg, 8));
        if (inverse(r)) row.insert(row.end(), {p.reachable ? "yes" : "no", fmt(p.min_depth_um, 10), fmt(p.max_depth_um, 10)});
        t.add(row);
    }
    t.print_csv(std::cout);
}

void print_human(const DepthReport& r) {
    auto& out = std::cout;
    print_field(out, "Sample", r.sample_name + (r.density_g_cm3 ? ", " + fmt(*r.density_g_cm3, 5) + " g/cm³" : ""));
    if (!r.radiation.empty())
        print_field(out, "Radiation", r.radiation + ": " + fmt(r.energy_keV, 6) + " keV, " +
                                          fmt(r.sample.optics->wavelength_A, 7) + " Å");
    print_field(out, "μ (linear)", fmt(r.mu_per_cm, 5) + " 1/cm (1/μ = " + length_from_um(1e4 / r.mu_per_cm) + ")");
    if (r.refraction)
        print_field(out, "Refraction", "δ = " + fmt(r.refraction->delta, 4) + ", β = " + fmt(r.refraction->beta, 4) +
                                           ", α_c = " + fmt(r.refraction->critical_angle_deg, 4) +
                                           "°, evanescent depth λ/(4π α_c) ≈ " + length_from_um(evanescent_um(r), 3));
    else
        print_field(out, "Refraction", "not applied (--mu gives no δ; describe the sample to include it)");
    std::string geometry;
    switch (r.mode) {
        case Mode::symmetric: geometry = "symmetric reflection (incidence = exit = θ)"; break;
        case Mode::incidence: geometry = "fixed incidence α, exit 2θ − α"; break;
        case Mode::tilt:
        case Mode::inverse_tilt:
            geometry = r.tilt_mode == TiltMode::omega ? "ω-tilt by ψ (incidence θ − ψ, exit θ + ψ)"
                                                      : "side inclination by ψ (both beams at asin(sinθ cosψ))";
            break;
        case Mode::inverse_incidence: geometry = "fixed incidence α ≤ θ (exit 2θ − α; 2θ − α gives the same depth)"; break;
    }
    print_field(out, "Geometry", geometry);
    if (r.target_um) print_field(out, "Target 1/e depth", length_from_um(*r.target_um));
    if (r.thickness_cm) print_field(out, "Thickness", length_from_um(*r.thickness_cm * 1e4));
    if (r.radius_cm) print_field(out, "Goniometer radius", fmt(*r.radius_cm * 10, 5) + " mm");
    out << '\n';
    std::vector<double> depths;
    for (const auto& p : r.points)
        if (p.reachable) depths.push_back(p.depth_1e_um);
    const LengthUnit u = unit_for(depths);
    const std::string unit = std::string(" (") + u.name + ")";
    std::vector<std::string> header{"2θ (°)", "incidence (°)", "exit (°)"};
    if (has_tilt(r)) header.push_back("ψ (°)");
    header.insert(header.end(), {"1/e depth" + unit, percent_label(r.fraction) + " of signal" + unit});
    if (r.radius_cm) header.push_back("shift Δ2θ (°)");
    const bool notes = inverse(r) && std::any_of(r.points.begin(), r.points.end(), [](const Point& p) { return !p.reachable; });
    if (notes) header.push_back("note");
    Table t(header);
    for (const auto& p : r.points) {
        auto v = [&](double x, int d) { return p.reachable ? fmt(x, d) : std::string("—"); };
        std::vector<std::string> row{fmt(p.two_theta_deg, 6), v(p.angles.incidence_deg, 6), v(p.angles.exit_deg, 6)};
        if (has_tilt(r)) row.push_back(p.tilt_deg ? fmt(*p.tilt_deg, 5) : std::string("—"));
        // At least 4 significant digits, and every integer digit (no 1.1e+04 in a column of nm).
        auto digits = [](double x) { return std::max(4, static_cast<int>(std::floor(std::log10(std::max(x, 1.0)))) + 1); };
        const double d1 = p.depth_1e_um * u.per_um, dg = p.depth_fraction_um * u.per_um;
        row.insert(row.end(), {v(d1, digits(d1)), v(dg, digits(dg))});
        if (r.radius_cm) row.push_back(fmt(*p.shift_deg, 3));
        if (notes) row.push_back(p.reachable ? "" : unreachable_text(r, p));
        t.add(row);
    }
    t.print(out);
    if (r.radius_cm)
        out << "\nThe shift is that of the profile's centroid (to lower 2θ), from the mean depth of the\n"
               "diffracting volume acting as a specimen displacement; it assumes a low-absorbing sample.\n";
}

Plot depth_plot(const DepthReport& r) {
    Plot plot;
    std::vector<double> x, d1, dg;
    for (const auto& p : r.points) {
        if (!p.reachable) continue;
        if (inverse(r)) {
            x.push_back(p.two_theta_deg);
            d1.push_back(r.mode == Mode::inverse_tilt ? *p.tilt_deg : p.angles.incidence_deg);
            continue;
        }
        x.push_back(r.axis == DepthReport::Axis::incidence ? p.angles.incidence_deg
                    : r.axis == DepthReport::Axis::tilt    ? *p.tilt_deg
                                                           : p.two_theta_deg);
        d1.push_back(p.depth_1e_um);
        dg.push_back(p.depth_fraction_um);
    }
    if (x.size() < 2) throw InputError("--plot needs at least two angles to draw a curve");
    const std::string where = r.sample_name + (r.radiation.empty() ? "" : ", " + r.radiation);
    if (inverse(r)) {
        const bool tilt = r.mode == Mode::inverse_tilt;
        plot.title = std::string(tilt ? "Tilt" : "Incidence angle") + " probing a 1/e depth of " +
                     length_from_um(*r.target_um) + " (" + where + ")";
        plot.x_label = "2θ (°)";
        plot.y_label = tilt ? "tilt ψ (°)" : "incidence angle α (°)";
        plot.series = {{tilt ? "ψ" : "α", x, d1}};
        plot.y_log = spans_decades(d1, 1.0);
        return plot;
    }
    const LengthUnit u = unit_for(d1);
    for (auto& v : d1) v *= u.per_um;
    for (auto& v : dg) v *= u.per_um;
    switch (r.axis) {
        case DepthReport::Axis::incidence:
            plot.x_label = "incidence angle α (°)";
            plot.title = "Depth probed at 2θ = " + fmt(r.points.front().two_theta_deg, 5) + "° (" + where + ")";
            if (r.refraction) plot.markers.push_back({r.refraction->critical_angle_deg, "α_c"});
            plot.x_log = spans_decades(x, 1.5);  // α from hundredths of a degree: show α_c's region
            break;
        case DepthReport::Axis::tilt:
            plot.x_label = "tilt ψ (°)";
            plot.title = "Depth probed versus tilt at 2θ = " + fmt(r.points.front().two_theta_deg, 5) + "° (" + where + ")";
            break;
        case DepthReport::Axis::two_theta:
            plot.x_label = "2θ (°)";
            plot.title = "Depth probed, " + mode_name(r) + " (" + where + ")";
            break;
    }
    plot.y_label = std::string("depth (") + u.name + ")";
    std::vector<double> all = d1;
    all.insert(all.end(), dg.begin(), dg.end());
    plot.y_log = spans_decades(all);
    plot.series = {{"1/e depth", x, d1}, {"depth holding " + percent_label(r.fraction) + " of the signal", x, dg}};
    return plot;
}

}  // namespace

void register_depth(CLI::App& sub) {
    auto o = std::make_shared<DepthOptions>();
    add_sample_options(sub, o->sample);
    add_radiation_options(sub, o->radiation);
    add_table_option(sub, o->table);
    sub.add_option("--mu", o->mu, "Linear attenuation coefficient instead of a sample (no refraction then) [1/cm]")
        ->type_name("PER_CM")->check(nonempty())->group("Sample");
    add_two_theta_option(sub, o->two_theta);
    sub.add_option("--incidence", o->incidence,
                   "Fixed incidence angle α from the surface, one value or (with one 2θ) START:STOP:STEP or a list "
                   "[degrees]; exit angle 2θ − α")
        ->type_name("ANGLES")->check(nonempty())->group("Angles");
    sub.add_option("--tilt", o->tilt,
                   "Specimen tilt ψ for stress work, one value or (with one 2θ) a range or list [degrees]")
        ->type_name("ANGLES")->check(nonempty())->group("Angles");
    o->tilt_mode_option = sub.add_option("--tilt-mode", o->tilt_mode,
                                         "How --tilt (or --target-depth, when given) tilts: side (side inclination, χ) or "
                                         "omega (ω-tilt, incidence θ − ψ)")
                              ->type_name("MODE")->capture_default_str()->check(nonempty())->group("Angles");
    sub.add_option("--fraction", o->fraction, "Signal fraction G for the second depth column, 0 < G < 1")
        ->type_name("G")->capture_default_str()->check(nonempty())->group("Depth");
    sub.add_option("--target-depth", o->target_depth,
                   "Find, per 2θ, the incidence angle (or with --tilt-mode the tilt) whose 1/e depth is this "
                   "[nm, um, mm, cm; bare number: mm]")
        ->type_name("LENGTH")->check(nonempty())->group("Depth");
    sub.add_option("--thickness", o->thickness,
                   "Sample thickness: the fraction depth and the peak shift are then those of a finite layer "
                   "[nm, um, mm, cm; bare number: mm]")
        ->type_name("LENGTH")->check(nonempty())->group("Depth");
    sub.add_option("--goniometer-radius", o->radius,
                   "Print the transparency peak shift for this Bragg-Brentano radius (symmetric reflection) "
                   "[nm, um, mm, cm; bare number: mm]")
        ->type_name("LENGTH")->check(nonempty())->group("Depth");
    auto* json = sub.add_flag("--json", o->json, "Print one JSON document");
    sub.add_flag("--csv", o->csv, "Print CSV (depths in µm)")->excludes(json);
    sub.add_option("--plot", o->plot, "Also draw depth versus 2θ, incidence or tilt into this SVG file")
        ->type_name("FILE.svg")->check(nonempty());
    sub.footer(
        "Depths are where the diffracted signal falls to 1/e (in plus out paths), and the depth above\n"
        "which the chosen fraction of the signal comes. With a sample (not --mu), refraction is included:\n"
        "1/Λ = 1/Λ(α) + 1/Λ(ε), Λ(α) = 1/(2k Im √(sin²α − 2δ + 2iβ)) (Parratt 1954; Dosch 1987).\n"
        "Examples:\n"
        "  mudepth depth --formula Si --source Cu --two-theta 20:120:20\n"
        "  mudepth depth --formula Si --source Cu --two-theta 28.44 --incidence 0.05:2:0.05 --plot si.svg\n"
        "  mudepth depth --mu 150 --two-theta 40:120:20 --target-depth 2um\n"
        "  mudepth depth --formula Fe --source Cr --two-theta 156 --tilt 0:60:15 --tilt-mode omega\n");
    sub.callback([o] {
        const DepthReport r = compute(*o);
        if (!o->plot.empty()) write_svg(depth_plot(r), o->plot);
        print_report(r, o->json, o->csv, print_json, print_csv, print_human);
    });
}

}  // namespace mudepth::cli
