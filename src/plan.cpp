// Sample planning over the attenuation, cylinder, plate and depth units.
#include "mudepth/plan.hpp"

#include <boost/math/tools/roots.hpp>
#include <cmath>

#include "format.hpp"
#include "mudepth/attenuation.hpp"
#include "mudepth/cylinder.hpp"
#include "mudepth/depth.hpp"
#include "mudepth/error.hpp"
#include "mudepth/plate.hpp"
#include "mudepth/radiation.hpp"

namespace mudepth {

namespace {

constexpr double kMmToCm = 0.1;

/// The sample diluted to weight fraction x, packed as the sample is.
Material diluted(const Material& sample, const Material& diluent, double x) {
    const Phase phases[] = {{sample, x}, {diluent, 1.0 - x}};
    return mix(phases, FractionBasis::weight, sample.packing_fraction);
}

/// Largest standard diameter with μR <= target; the smallest when none is.
double recommended_diameter_cm(double mu_per_cm, double target_mu_R, bool& smallest_exceeds) {
    double best_cm = kStandardCapillaryDiameters_mm.front() * kMmToCm;
    smallest_exceeds = true;
    for (double d_mm : kStandardCapillaryDiameters_mm) {
        if (mu_per_cm * d_mm * kMmToCm / 2 <= target_mu_R) {
            best_cm = d_mm * kMmToCm;
            smallest_exceeds = false;
        }
    }
    return best_cm;
}

void check_target_mu_R(double target_mu_R) {
    if (!std::isfinite(target_mu_R) || target_mu_R <= 0)
        throw InputError("target muR " + format_number(target_mu_R) + " must be positive");
}

}  // namespace

double dilution_weight_fraction(const Material& sample, const Material& diluent, double energy_keV,
                                double target_mu_per_cm, CrossSectionTable table) {
    auto mu_of = [&](double x) { return linear_attenuation_per_cm(diluted(sample, diluent, x), energy_keV, table); };
    const double mu_sample = mu_of(1.0);
    const double mu_diluent = mu_of(0.0);
    if (mu_diluent >= mu_sample)
        throw InputError("the diluent '" + diluent.name + "' absorbs at least as much as the sample (μ " +
                         format_number(mu_diluent, 4) + " vs " + format_number(mu_sample, 4) +
                         " 1/cm): no dilution with it can lower μ");
    if (mu_diluent > target_mu_per_cm)
        throw InputError("the diluent '" + diluent.name + "' alone has μ " + format_number(mu_diluent, 4) +
                         " 1/cm, above the target " + format_number(target_mu_per_cm, 4) +
                         " 1/cm: choose a lighter diluent or a smaller capillary");
    if (mu_sample <= target_mu_per_cm) return 1.0;  // no dilution needed
    boost::math::tools::eps_tolerance<double> tolerance(50);
    std::uintmax_t iterations = 200;
    const auto [lo, hi] = boost::math::tools::toms748_solve(
        [&](double x) { return mu_of(x) - target_mu_per_cm; }, 0.0, 1.0, mu_diluent - target_mu_per_cm,
        mu_sample - target_mu_per_cm, tolerance, iterations);
    return 0.5 * (lo + hi);
}

CapillaryPlan plan_capillaries(const Material& sample, double energy_keV, double target_mu_R,
                               const Material& diluent, double dilution_diameter_cm, CrossSectionTable table) {
    check_target_mu_R(target_mu_R);
    const double mu = linear_attenuation_per_cm(sample, energy_keV, table);
    CapillaryPlan plan;
    plan.target_mu_R = target_mu_R;
    for (double d_mm : kStandardCapillaryDiameters_mm) {
        CapillaryRow row{d_mm * kMmToCm, mu * d_mm * kMmToCm / 2, std::nullopt, std::nullopt, 0};
        if (row.mu_R <= kPlanMaxMuR) {
            row.correction_at_10_deg = 1.0 / cylinder_transmission(row.mu_R, 10.0);
            row.correction_at_150_deg = 1.0 / cylinder_transmission(row.mu_R, 150.0);
        }
        row.central_ray_transmission = std::exp(-2 * row.mu_R);
        plan.rows.push_back(row);
    }
    plan.recommended_diameter_cm = recommended_diameter_cm(mu, target_mu_R, plan.smallest_exceeds_target);
    if (plan.smallest_exceeds_target) {
        const double target_mu = target_mu_R / (dilution_diameter_cm / 2);
        const double diluent_mu = linear_attenuation_per_cm(diluted(sample, diluent, 0.0), energy_keV, table);
        if (diluent_mu > target_mu && diluent_mu < mu) {
            plan.dilution_note = "the diluent " + diluent.name + " alone gives μR " +
                                 format_number(diluent_mu * dilution_diameter_cm / 2, 4) + " in the " +
                                 format_number(dilution_diameter_cm * 10, 3) +
                                 " mm capillary: no dilution with it reaches the target there; choose a smaller "
                                 "capillary (--diameter) or a lighter diluent (--diluent)";
            return plan;
        }
        const double x = dilution_weight_fraction(sample, diluent, energy_keV, target_mu, table);
        const double mu_mix = linear_attenuation_per_cm(diluted(sample, diluent, x), energy_keV, table);
        plan.dilution = Dilution{diluent.name, dilution_diameter_cm, x, mu_mix, mu_mix * dilution_diameter_cm / 2};
    }
    return plan;
}

PlatePlan plan_plate(const Material& sample, double mu_per_cm, double two_theta_max_deg, double holder_area_cm2,
                     double holder_depth_cm) {
    PlatePlan p;
    p.two_theta_max_deg = two_theta_max_deg;
    p.infinite_99_cm = infinite_thickness_mu_t(0.99, two_theta_max_deg) / mu_per_cm;
    p.infinite_999_cm = infinite_thickness_mu_t(0.999, two_theta_max_deg) / mu_per_cm;
    p.transmission_optimum_cm = transmission_optimum_mu_t(PlateMode::transmission_normal, 0.0) / mu_per_cm;
    p.holder_area_cm2 = holder_area_cm2;
    p.holder_depth_cm = holder_depth_cm;
    p.powder_mass_g = sample.density_g_cm3() * holder_area_cm2 * holder_depth_cm;
    return p;
}

std::vector<SourceRow> plan_sources(const Material& sample, double target_mu_R, CrossSectionTable table) {
    check_target_mu_R(target_mu_R);
    std::vector<SourceRow> rows;
    for (std::string_view symbol : standard_anode_symbols()) {
        const Radiation r = radiation_from_source(symbol);
        SourceRow row;
        row.anode = std::string(symbol);
        row.energy_keV = r.energy_keV;
        row.mu_per_cm = linear_attenuation_per_cm(sample, r.energy_keV, table);
        row.depth_1e_at_30_deg_um = symmetric_depth_1e_um(row.mu_per_cm, 30.0);
        row.depth_1e_at_90_deg_um = symmetric_depth_1e_um(row.mu_per_cm, 90.0);
        row.recommended_diameter_cm = recommended_diameter_cm(row.mu_per_cm, target_mu_R, row.smallest_exceeds_target);
        row.fluorescence = fluorescence_warnings(sample, r.energy_keV);
        rows.push_back(std::move(row));
    }
    return rows;
}

}  // namespace mudepth
