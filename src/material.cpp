// Materials: element weight fractions from a formula, densities from a unit
// cell, and mixtures of phases by weight or volume fraction.
#include "mudepth/material.hpp"

#include <charconv>
#include <cmath>
#include <numbers>
#include <string>

#include "mudepth/constants.hpp"
#include "mudepth/error.hpp"

namespace mudepth {

namespace {

// Avogadro constant, 1/mol: exact in the SI since 2019 (CODATA 2018).
constexpr double kCm3_per_A3 = 1e-24;

std::string num(double x) {
    char buf[64];
    auto r = std::to_chars(buf, buf + sizeof buf, x);
    return std::string(buf, r.ptr);
}

// A percentage for a mixture's name: at most 4 significant digits.
std::string percent(double fraction) {
    char buf[64];
    auto r = std::to_chars(buf, buf + sizeof buf, 100 * fraction, std::chars_format::general, 4);
    return std::string(buf, r.ptr);
}

// cos of an angle in degrees, exact for the right angle so that orthogonal
// cells give exactly abc.
double cos_deg(double deg) {
    if (deg == 90) return 0;
    return std::cos(deg * std::numbers::pi / 180);
}

void add_share(std::vector<ElementShare>& into, const ElementShare& share) {
    for (auto& e : into) {
        if (e.label == share.label) {
            e.weight_fraction += share.weight_fraction;
            return;
        }
    }
    into.push_back(share);
}

}  // namespace

void check_density_g_cm3(double density_g_cm3, std::string_view what) {
    if (!std::isfinite(density_g_cm3) || density_g_cm3 <= 0)
        throw InputError(std::string(what) + " " + num(density_g_cm3) +
                         " g/cm3 is not a density: it must be finite and > 0");
    // No solid exceeds 23 g/cm3 (osmium) and no gas at normal pressure is below
    // 1e-4 g/cm3 (hydrogen); outside these bounds, with margin, it is a typo.
    if (density_g_cm3 > kMaxDensity_g_cm3 || density_g_cm3 < kMinDensity_g_cm3)
        throw InputError(std::string(what) + " " + num(density_g_cm3) + " g/cm3 is outside " +
                         num(kMinDensity_g_cm3) + ".." + num(kMaxDensity_g_cm3) + " g/cm3");
}

void check_packing_fraction(double packing_fraction) {
    if (!(packing_fraction > 0 && packing_fraction <= 1))
        throw InputError("packing fraction " + num(packing_fraction) + " is outside (0, 1]");
}

Material material_from_formula(const Formula& formula, double solid_density_g_cm3,
                               double packing_fraction) {
    check_density_g_cm3(solid_density_g_cm3, "density");
    check_packing_fraction(packing_fraction);
    check_density_g_cm3(solid_density_g_cm3 * packing_fraction, "density × packing");
    const double M = formula.molar_mass_g_mol();
    if (formula.parts.empty() || !(M > 0) || !std::isfinite(M))
        throw InputError("formula '" + formula.text + "' has no elements");
    Material m;
    m.name = formula.text;
    for (const auto& p : formula.parts)
        add_share(m.elements, ElementShare{p.Z, p.label, p.count * p.molar_mass_g_mol / M,
                                           p.molar_mass_g_mol});
    m.solid_density_g_cm3 = solid_density_g_cm3;
    m.packing_fraction = packing_fraction;
    return m;
}

double cell_volume_A3(const UnitCell& cell) {
    const double lengths[] = {cell.a_A, cell.b_A, cell.c_A};
    const char* length_names[] = {"a", "b", "c"};
    for (int i = 0; i < 3; ++i)
        if (!std::isfinite(lengths[i]) || lengths[i] <= 0)
            throw InputError(std::string("cell length ") + length_names[i] + " = " + num(lengths[i]) +
                             " A must be finite and > 0");
    const double angles[] = {cell.alpha_deg, cell.beta_deg, cell.gamma_deg};
    const char* angle_names[] = {"alpha", "beta", "gamma"};
    for (int i = 0; i < 3; ++i)
        if (!(angles[i] > 0 && angles[i] < 180))
            throw InputError(std::string("cell angle ") + angle_names[i] + " = " + num(angles[i]) +
                             " degrees must be between 0 and 180");
    const double ca = cos_deg(cell.alpha_deg), cb = cos_deg(cell.beta_deg), cg = cos_deg(cell.gamma_deg);
    // Volume of a general (triclinic) cell, e.g. International Tables Vol. B, 1.1.
    const double d = 1 - ca * ca - cb * cb - cg * cg + 2 * ca * cb * cg;
    if (!(d > 1e-12))
        throw InputError("cell angles " + num(cell.alpha_deg) + " " + num(cell.beta_deg) + " " +
                         num(cell.gamma_deg) +
                         " degrees do not form a cell (each angle must be less than the sum of the "
                         "other two, and the three less than 360)");
    const double V = cell.a_A * cell.b_A * cell.c_A * std::sqrt(d);
    if (!std::isfinite(V) || V <= 0) throw InputError("cell volume " + num(V) + " A^3 is not usable");
    return V;
}

double density_from_cell_g_cm3(const Formula& formula, const UnitCell& cell, double formula_units) {
    if (!std::isfinite(formula_units) || formula_units <= 0)
        throw InputError("formula units per cell " + num(formula_units) + " must be finite and > 0");
    const double M = formula.molar_mass_g_mol();
    if (formula.parts.empty() || !(M > 0))
        throw InputError("formula '" + formula.text + "' has no elements");
    const double V = cell_volume_A3(cell);
    const double rho = formula_units * M / (kAvogadro_per_mol * V * kCm3_per_A3);
    check_density_g_cm3(rho, "density from the cell");
    return rho;
}

Material mix(std::span<const Phase> phases, FractionBasis basis, double packing_fraction) {
    check_packing_fraction(packing_fraction);
    if (phases.empty()) throw InputError("a mixture needs at least one phase");
    const char* unit = basis == FractionBasis::weight ? "weight" : "volume";
    double sum = 0;
    for (std::size_t i = 0; i < phases.size(); ++i) {
        const auto& p = phases[i];
        if (!std::isfinite(p.fraction) || p.fraction < 0)
            throw InputError(std::string(unit) + " fraction " + num(p.fraction) + " of phase " +
                             std::to_string(i + 1) + " (" + p.material.name +
                             ") must be finite and >= 0");
        check_density_g_cm3(p.material.solid_density_g_cm3,
                            "density of phase " + std::to_string(i + 1) + " (" + p.material.name + ")");
        double own = 0;
        for (const auto& e : p.material.elements) own += e.weight_fraction;
        if (p.material.elements.empty() || !(own > 0) || !std::isfinite(own))
            throw InputError("phase " + std::to_string(i + 1) + " (" + p.material.name +
                             ") has no elements");
        sum += p.fraction;
    }
    if (!(sum > 0) || !std::isfinite(sum))
        throw InputError(std::string("the ") + unit + " fractions of the mixture sum to " + num(sum) +
                         "; they must sum to more than 0");

    // Weight fractions: w_i = v_i ρ_i / Σ v_j ρ_j for volume fractions.
    std::vector<double> w(phases.size());
    double wsum = 0;
    for (std::size_t i = 0; i < phases.size(); ++i) {
        const double f = phases[i].fraction / sum;
        w[i] = basis == FractionBasis::weight ? f : f * phases[i].material.solid_density_g_cm3;
        wsum += w[i];
    }
    for (auto& x : w) x /= wsum;

    Material m;
    const char* tag = basis == FractionBasis::weight ? " wt% " : " vol% ";
    double inverse_density = 0;
    for (std::size_t i = 0; i < phases.size(); ++i) {
        const auto& p = phases[i].material;
        if (!m.name.empty()) m.name += " + ";
        m.name += percent(phases[i].fraction / sum) + tag + p.name;
        inverse_density += w[i] / p.solid_density_g_cm3;
        if (w[i] == 0) continue;
        double own_sum = 0;
        for (const auto& e : p.elements) own_sum += e.weight_fraction;
        for (const auto& e : p.elements)
            add_share(m.elements, ElementShare{e.Z, e.label, w[i] * e.weight_fraction / own_sum,
                                               e.molar_mass_g_mol});
    }
    // The pore-free mixture: volumes add, 1/ρ = Σ w_i/ρ_i.
    m.solid_density_g_cm3 = 1 / inverse_density;
    m.packing_fraction = packing_fraction;
    check_density_g_cm3(m.density_g_cm3(), "density × packing of the mixture");
    m.density_source = "mixture of the phases' densities, 1/sum(w_i/rho_i)";
    return m;
}

}  // namespace mudepth
