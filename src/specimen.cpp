// Specimens: μR of a capillary and μt of a plate, from a material or directly.
#include "mudepth/specimen.hpp"

#include <cmath>
#include <string>
#include <utility>

#include "format.hpp"
#include "mudepth/attenuation.hpp"
#include "mudepth/cylinder.hpp"
#include "mudepth/error.hpp"

namespace mudepth {

namespace {

/// μR about 1 or below is the usual aim for capillaries (common practice); above 3 the
/// correction varies strongly with 2θ.
constexpr double kHighCapillaryMuR = 3.0;

/// The sample's μ at the radiation and what it came from, on either specimen type.
template <class Specimen>
void attenuate(Specimen& s, const Material& sample, const Radiation& radiation, CrossSectionTable table) {
    s.sample = sample.name;
    s.density_g_cm3 = sample.density_g_cm3();
    s.radiation = radiation.label;
    s.energy_keV = radiation.energy_keV;
    s.table = table;
    s.mu_per_cm = linear_attenuation_per_cm(sample, radiation.energy_keV, table);
}

CapillarySpecimen checked(CapillarySpecimen c) {
    if (c.mu_R > kMaxCylinderMuR)
        throw InputError("μR = " + format_number(c.mu_R, 5) +
                         " is above 30: too absorbing for a capillary; use a thinner capillary or dilute the sample");
    if (c.mu_R > kHighCapillaryMuR)
        c.warnings.push_back("μR = " + format_number(c.mu_R, 4) +
                             " is high: the correction varies strongly with 2θ; a thinner capillary or a diluted "
                             "sample (μR near 1) is the usual choice");
    return c;
}

void check_positive_length_cm(double length_cm, const char* what) {
    if (!std::isfinite(length_cm) || length_cm <= 0)
        throw InputError(std::string(what) + " = " + format_number(length_cm) + " cm must be positive");
}

void check_direct_mu_t(double mu_t, const char* what) {
    if (!std::isfinite(mu_t) || mu_t <= 0) throw InputError(std::string(what) + " = " + format_number(mu_t) + " must be positive");
    if (mu_t > kMaxPlateMuT)
        throw InputError(std::string(what) + " = " + format_number(mu_t) + " is above the limit 1e6");
}

}  // namespace

CapillarySpecimen capillary_from_mu_R(double mu_R) {
    if (!std::isfinite(mu_R) || mu_R <= 0) throw InputError("μR = " + format_number(mu_R) + " must be positive");
    CapillarySpecimen c;
    c.sample = "given as μR";
    c.mu_R = mu_R;
    return checked(std::move(c));
}

CapillarySpecimen capillary_from_material(const Material& sample, const Radiation& radiation,
                                          double inner_diameter_cm, CrossSectionTable table) {
    check_positive_length_cm(inner_diameter_cm, "inner diameter");
    CapillarySpecimen c;
    attenuate(c, sample, radiation, table);
    c.inner_diameter_cm = inner_diameter_cm;
    c.mu_R = *c.mu_per_cm * inner_diameter_cm / 2;
    return checked(std::move(c));
}

CapillarySpecimen with_wall(CapillarySpecimen capillary, double wall_mu_R, double radius_ratio) {
    if (!std::isfinite(wall_mu_R) || wall_mu_R < 0)
        throw InputError("wall μR = " + format_number(wall_mu_R) + " must be zero or positive");
    if (!std::isfinite(radius_ratio) || radius_ratio <= 1)
        throw InputError("radius ratio " + format_number(radius_ratio) +
                         " must be above 1 (outer wall radius over sample radius)");
    CapillaryWall w;
    w.mu_R = wall_mu_R;
    w.radius_ratio = radius_ratio;
    capillary.wall = std::move(w);
    return capillary;
}

CapillarySpecimen with_wall(CapillarySpecimen capillary, const Material& wall_material, double wall_thickness_cm) {
    if (!capillary.inner_diameter_cm || !capillary.energy_keV)
        throw InputError("a wall material needs the capillary's inner diameter and radiation; with μR given "
                         "directly give the wall's μR and radius ratio");
    check_positive_length_cm(wall_thickness_cm, "wall thickness");
    CapillaryWall w;
    w.material = wall_material.name;
    w.thickness_cm = wall_thickness_cm;
    w.mu_per_cm = linear_attenuation_per_cm(wall_material, *capillary.energy_keV,
                                            capillary.table.value_or(CrossSectionTable::elam));
    const double radius_cm = *capillary.inner_diameter_cm / 2;
    w.mu_R = *w.mu_per_cm * radius_cm;
    w.radius_ratio = (radius_cm + wall_thickness_cm) / radius_cm;
    capillary.wall = std::move(w);
    return capillary;
}

PlateSpecimen plate_from_mu_t(PlateMode mode, double mu_t) {
    check_direct_mu_t(mu_t, "μt");
    PlateSpecimen p;
    p.sample = "given as μt";
    p.mode = mode;
    p.mu_t = mu_t;
    return p;
}

PlateSpecimen plate_from_material(PlateMode mode, const Material& sample, const Radiation& radiation,
                                  double thickness_cm, CrossSectionTable table) {
    check_positive_length_cm(thickness_cm, "plate thickness");
    PlateSpecimen p;
    attenuate(p, sample, radiation, table);
    p.mode = mode;
    p.thickness_cm = thickness_cm;
    p.mu_t = *p.mu_per_cm * thickness_cm;
    return p;
}

PlateSpecimen with_incidence(PlateSpecimen plate, double incidence_deg) {
    if (plate.mode != PlateMode::reflection)
        throw InputError("a fixed incidence applies to reflection only, not to " + std::string(to_string(plate.mode)));
    if (!std::isfinite(incidence_deg)) throw InputError("the incidence angle is not a finite number");
    plate.incidence_deg = incidence_deg;
    return plate;
}

PlateSpecimen with_windows(PlateSpecimen plate, double mu_t_window) {
    check_direct_mu_t(mu_t_window, "window μt");
    WindowFoils w;
    w.mu_t = mu_t_window;
    plate.window = std::move(w);
    return plate;
}

PlateSpecimen with_windows(PlateSpecimen plate, const Material& foil_material, double foil_thickness_cm,
                           const Radiation& radiation, CrossSectionTable table) {
    if (plate.energy_keV && *plate.energy_keV != radiation.energy_keV)
        throw InputError("the window foils need the plate's radiation (" + plate.radiation + ")");
    check_positive_length_cm(foil_thickness_cm, "window thickness");
    if (!plate.energy_keV) {
        plate.energy_keV = radiation.energy_keV;
        plate.radiation = radiation.label;
    }
    WindowFoils w;
    w.material = foil_material.name;
    w.thickness_cm = foil_thickness_cm;
    w.mu_per_cm = linear_attenuation_per_cm(foil_material, radiation.energy_keV, plate.table.value_or(table));
    w.mu_t = *w.mu_per_cm * foil_thickness_cm;
    plate.window = std::move(w);
    return plate;
}

}  // namespace mudepth
