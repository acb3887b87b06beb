// Kβ filters: Beer-Lambert attenuation of each line of the anode's K spectrum
// through a foil of a pure element.
#include "mudepth/filter.hpp"

#include <algorithm>
#include <boost/math/tools/roots.hpp>
#include <cmath>

#include "format.hpp"
#include "mudepth/elements.hpp"
#include "mudepth/error.hpp"

namespace mudepth {

namespace {

/// Foils are solids; gases and liquids are no filters (common practice).
constexpr double kMinFoilDensity_g_cm3 = 0.5;

double energy_of(const Anode& anode, AnodeLine line) {
    return energy_keV_from_wavelength_A(line_wavelength_A(anode, line));
}

/// Natural logs of the intensity-weighted transmissions of the Kα and Kβ
/// groups through the foil (log-sum-exp, so thick foils do not underflow).
struct GroupLogTransmission {
    double kalpha;
    double kbeta;
};

GroupLogTransmission group_log_transmission(const std::vector<SpectrumLine>& spectrum, int element,
                                            double thickness_cm, CrossSectionTable table) {
    const double density = mudepth::element(element).density_g_cm3;
    auto log_group = [&](bool kbeta) {
        std::vector<double> terms;  // ln(I_i) − μ_i t
        double total = 0;
        for (const auto& line : spectrum) {
            if (line.kbeta != kbeta) continue;
            const double mu_per_cm =
                density * element_mass_attenuation(element, line.energy_keV, table).total_cm2_g();
            terms.push_back(std::log(line.relative_intensity) - mu_per_cm * thickness_cm);
            total += line.relative_intensity;
        }
        const double top = *std::max_element(terms.begin(), terms.end());
        double sum = 0;
        for (double t : terms) sum += std::exp(t - top);
        return top + std::log(sum) - std::log(total);
    };
    return {log_group(false), log_group(true)};
}

void check_element(const Anode& anode, int element) {
    const auto& info = mudepth::element(element);
    const EdgeInfo* k = find_edge(element, "K");
    if (!k) throw InputError(std::string(info.symbol) + " has no K edge in the element data");
    if (info.density_g_cm3 < kMinFoilDensity_g_cm3)
        throw InputError(std::string(info.symbol) + " is not a solid at room temperature: no foil can be made of it");
    (void)anode;
}

}  // namespace

std::vector<SpectrumLine> anode_k_spectrum(const Anode& anode) {
    std::vector<SpectrumLine> out;
    for (const auto& l : lines(anode.Z)) {
        if (l.initial_level != "K" || l.final_level == "L1") continue;  // K-L1 is forbidden and negligible
        const bool kbeta = l.final_level.front() != 'L';
        double energy_keV = l.energy_keV;
        if (l.iupac == "K-L3") energy_keV = energy_of(anode, AnodeLine::Ka1);
        if (l.iupac == "K-L2") energy_keV = energy_of(anode, AnodeLine::Ka2);
        if (l.iupac == "K-M3") energy_keV = energy_of(anode, AnodeLine::Kb);
        out.push_back({std::string(l.siegbahn), energy_keV, l.relative_intensity, kbeta});
    }
    return out;
}

double unfiltered_kbeta_ratio(const Anode& anode) {
    double alpha = 0, beta = 0;
    for (const auto& line : anode_k_spectrum(anode)) (line.kbeta ? beta : alpha) += line.relative_intensity;
    return beta / alpha;
}

std::vector<int> filter_candidates(const Anode& anode) {
    const double ka1_keV = energy_of(anode, AnodeLine::Ka1);
    const double kb1_keV = energy_of(anode, AnodeLine::Kb);
    std::vector<int> out;
    for (int Z = 1; Z <= kMaxAtomicNumber; ++Z) {
        const EdgeInfo* k = find_edge(Z, "K");
        if (k && k->energy_keV > ka1_keV && k->energy_keV < kb1_keV &&
            element(Z).density_g_cm3 >= kMinFoilDensity_g_cm3)
            out.push_back(Z);
    }
    return out;
}

FilterResult filter_of_thickness(const Anode& anode, int element, double thickness_cm, CrossSectionTable table) {
    check_element(anode, element);
    if (!std::isfinite(thickness_cm) || thickness_cm <= 0)
        throw InputError("filter thickness must be positive");
    const auto spectrum = anode_k_spectrum(anode);
    const auto t = group_log_transmission(spectrum, element, thickness_cm, table);
    const auto& info = mudepth::element(element);
    FilterResult r;
    r.Z = element;
    r.symbol = std::string(info.symbol);
    r.k_edge_keV = find_edge(element, "K")->energy_keV;
    r.density_g_cm3 = info.density_g_cm3;
    r.thickness_cm = thickness_cm;
    r.mass_thickness_g_cm2 = info.density_g_cm3 * thickness_cm;
    r.ratio_unfiltered = unfiltered_kbeta_ratio(anode);
    r.ratio_filtered = r.ratio_unfiltered * std::exp(t.kbeta - t.kalpha);
    r.kalpha_transmission = std::exp(t.kalpha);
    r.kbeta_transmission = std::exp(t.kbeta);
    return r;
}

FilterResult filter_for_ratio(const Anode& anode, int element, double target_ratio, CrossSectionTable table) {
    check_element(anode, element);
    const double unfiltered = unfiltered_kbeta_ratio(anode);
    if (!std::isfinite(target_ratio) || target_ratio <= 0)
        throw InputError("target Kb/Ka ratio must be a positive number");
    if (target_ratio >= unfiltered)
        throw InputError("target Kb/Ka ratio " + format_number(target_ratio) + " is not below the unfiltered ratio " +
                         format_number(unfiltered, 4) + " of " + std::string(anode.symbol) + ": no filter is needed");
    const auto spectrum = anode_k_spectrum(anode);
    // ln of filtered ratio / target: decreasing in t when the edge lies between the groups.
    auto excess = [&](double t_cm) {
        const auto g = group_log_transmission(spectrum, element, t_cm, table);
        return std::log(unfiltered / target_ratio) + g.kbeta - g.kalpha;
    };
    const double thick_cm = 0.1;  // 1 mm of metal: far beyond any useful foil
    if (excess(thick_cm) > 0) {
        const double edge_keV = find_edge(element, "K")->energy_keV;
        const bool between = edge_keV > energy_of(anode, AnodeLine::Ka1) && edge_keV < energy_of(anode, AnodeLine::Kb);
        throw InputError(std::string(mudepth::element(element).symbol) + " cannot bring Kb/Ka of " +
                         std::string(anode.symbol) + " down to " + format_number(target_ratio) +
                         (between ? " with less than 1 mm of foil" : ": its K edge does not lie between Ka and Kb"));
    }
    boost::math::tools::eps_tolerance<double> tolerance(40);
    std::uintmax_t iterations = 200;
    const auto [lo, hi] = boost::math::tools::toms748_solve(excess, 0.0, thick_cm, tolerance, iterations);
    return filter_of_thickness(anode, element, 0.5 * (lo + hi), table);
}

int best_filter_element(const Anode& anode, double target_ratio, CrossSectionTable table) {
    const auto candidates = filter_candidates(anode);
    if (candidates.empty())
        throw InputError("no element has its K edge between Ka1 and Kb1 of " + std::string(anode.symbol) +
                         ": no Kb filter exists for this anode");
    int best = 0;
    double best_transmission = -1;
    std::string last_reason;
    for (int Z : candidates) {
        try {
            const double t = filter_for_ratio(anode, Z, target_ratio, table).kalpha_transmission;
            if (t > best_transmission) best_transmission = t, best = Z;
        } catch (const InputError& e) {
            last_reason = e.what();  // this candidate cannot reach the target; try the others
        }
    }
    if (best == 0) throw InputError(last_reason);
    return best;
}

}  // namespace mudepth
