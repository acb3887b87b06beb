// Sample planning: which capillary, whether and how much to dilute, how thick
// a plate, how much powder, which anode. Built on the attenuation, cylinder,
// plate and depth units; the numbers here are theirs, arranged for a decision.
#pragma once

#include <array>
#include <optional>
#include <string>
#include <vector>

#include "mudepth/cross_section.hpp"
#include "mudepth/edges.hpp"
#include "mudepth/material.hpp"

namespace mudepth {

/// Standard inner diameters of diffraction capillaries, mm (common practice).
inline constexpr std::array<double, 9> kStandardCapillaryDiameters_mm = {0.1, 0.2, 0.3, 0.4, 0.5,
                                                                         0.7, 1.0, 1.5, 2.0};

/// Capillaries: μR up to which absorption factors are computed (as `cylinder`).
inline constexpr double kPlanMaxMuR = 30.0;

struct CapillaryRow {
    double diameter_cm;
    double mu_R;
    std::optional<double> correction_at_10_deg;   ///< A* = 1/A at 2θ = 10°; none above μR 30
    std::optional<double> correction_at_150_deg;  ///< A* at 2θ = 150°
    double central_ray_transmission;              ///< exp(−2μR) along a diameter
};

struct Dilution {
    std::string diluent;              ///< the diluent's name
    double diameter_cm;               ///< the capillary the dilution is for
    double sample_weight_fraction;    ///< weight fraction of sample in sample + diluent
    double mixture_mu_per_cm;         ///< μ of the packed mixture
    double mu_R;                      ///< = the target
};

struct CapillaryPlan {
    double target_mu_R = 1;
    std::vector<CapillaryRow> rows;
    double recommended_diameter_cm = 0;
    bool smallest_exceeds_target = false;  ///< even 0.1 mm is above the target
    std::optional<Dilution> dilution;      ///< given when the smallest exceeds the target
    std::string dilution_note;             ///< why no dilution is given although one is needed
};

/// The weight fraction x of sample in a mixture with the diluent (at the
/// sample's packing fraction) whose μ equals target_mu_per_cm; found with
/// Boost.Math TOMS 748 on the mixture built by mix(). Throws InputError when
/// the diluent absorbs at least as much as the sample, or alone exceeds the target.
double dilution_weight_fraction(const Material& sample, const Material& diluent, double energy_keV,
                                double target_mu_per_cm, CrossSectionTable table = CrossSectionTable::elam);

/// The capillary table, the recommendation (largest standard diameter with
/// μR <= target) and, when even 0.1 mm is too large, the dilution for the
/// capillary of diameter dilution_diameter_cm.
CapillaryPlan plan_capillaries(const Material& sample, double energy_keV, double target_mu_R,
                               const Material& diluent, double dilution_diameter_cm,
                               CrossSectionTable table = CrossSectionTable::elam);

struct PlatePlan {
    double two_theta_max_deg;
    double infinite_99_cm;                ///< reflection: 99% of an infinitely thick sample's intensity at 2θ max
    double infinite_999_cm;               ///< 99.9%
    double transmission_optimum_cm;       ///< plate normal to the beam, at 2θ → 0 (μt = 1)
    double holder_area_cm2;
    double holder_depth_cm;
    double powder_mass_g;                 ///< to fill the holder at the packing used
};

PlatePlan plan_plate(const Material& sample, double mu_per_cm, double two_theta_max_deg, double holder_area_cm2,
                     double holder_depth_cm);

struct SourceRow {
    std::string anode;
    double energy_keV;
    double mu_per_cm;
    double depth_1e_at_30_deg_um;  ///< symmetric reflection, 2θ = 30°
    double depth_1e_at_90_deg_um;
    double recommended_diameter_cm;
    bool smallest_exceeds_target;
    std::vector<FluorescenceWarning> fluorescence;
};

/// One row per standard anode (Cr, Fe, Co, Cu, Mo, Ag), Kα.
std::vector<SourceRow> plan_sources(const Material& sample, double target_mu_R,
                                    CrossSectionTable table = CrossSectionTable::elam);

}  // namespace mudepth
