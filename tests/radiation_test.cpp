// Radiation: anode wavelengths, Ka weighting, energy range, parsing of --source.
#include "mudepth/radiation.hpp"

#include <gtest/gtest.h>
#include <xraylib/xraylib.h>

#include <cmath>

#include "mudepth/error.hpp"

namespace mudepth {
namespace {

TEST(Radiation, CuKaIsTheTwoToOneMean) {
    // Derived from Hölzer et al. (1997): (2·1.54059290 + 1.54442740)/3 = 1.5418711 Å.
    EXPECT_NEAR(radiation_from_source("Cu").wavelength_A(), 1.5418711, 1e-7);
    EXPECT_NEAR(radiation_from_source("Cu:Ka").wavelength_A(), 1.5418711, 1e-7);
    // Mo Kα = (2·0.70931715 + 0.713607)/3 = 0.7107471 Å (derived from Hölzer et al. 1997).
    EXPECT_NEAR(radiation_from_source("Mo").wavelength_A(), 0.7107471, 1e-7);
}

TEST(Radiation, HoelzerLines) {
    // Hölzer et al. (1997) / ITC Vol. C Table 4.2.2.1.
    EXPECT_DOUBLE_EQ(radiation_from_source("Cu:Ka1").wavelength_A(), 1.54059290);
    EXPECT_DOUBLE_EQ(radiation_from_source("Cu:Ka2").wavelength_A(), 1.54442740);
    EXPECT_DOUBLE_EQ(radiation_from_source("Cu:Kb").wavelength_A(), 1.3922340);
    EXPECT_DOUBLE_EQ(radiation_from_source("co:kA1").wavelength_A(), 1.7889960);
    EXPECT_DOUBLE_EQ(radiation_from_source("Ag:Kb").wavelength_A(), 0.4970817);
    // hc = 12.39841984 keV·Å (CODATA 2018): Cu Kα1 is 8.04778 keV.
    EXPECT_NEAR(radiation_from_source("Cu:Ka1").energy_keV, 8.047823, 1e-6);
}

TEST(Radiation, ElementDataAnodesMatchXraylib) {
    // Ga, In and W come from the element data's line energies; xraylib 4.0 LineEnergy (keV)
    // is an independent compilation: agreement within 0.05%.
    struct Case { const char* spec; int Z; int line; };
    for (const Case c : {Case{"Ga:Ka1", 31, KL3_LINE}, Case{"Ga:Ka2", 31, KL2_LINE}, Case{"Ga:Kb", 31, KM3_LINE},
                         Case{"In:Ka1", 49, KL3_LINE}, Case{"In:Kb", 49, KM3_LINE}, Case{"W:Ka1", 74, KL3_LINE},
                         Case{"W:Ka2", 74, KL2_LINE}}) {
        const double reference_keV = LineEnergy(c.Z, c.line, nullptr);
        EXPECT_NEAR(radiation_from_source(c.spec).energy_keV / reference_keV, 1.0, 5e-4) << c.spec;
    }
}

TEST(Radiation, EnergyAndWavelength) {
    EXPECT_DOUBLE_EQ(radiation_from_energy(17.0).energy_keV, 17.0);
    EXPECT_NEAR(radiation_from_wavelength(1.0).energy_keV, 12.39841984, 1e-12);
    EXPECT_NO_THROW(radiation_from_energy(1.0));
    EXPECT_NO_THROW(radiation_from_energy(500.0));
}

void expect_input_error(auto f, const std::string& message) {
    try {
        f();
        ADD_FAILURE() << "no error, expected: " << message;
    } catch (const InputError& e) {
        EXPECT_EQ(std::string(e.what()), message);
    }
}

TEST(Radiation, Refusals) {
    expect_input_error([] { radiation_from_energy(0.5); }, "energy 0.5 keV is outside 1..500 keV");
    expect_input_error([] { radiation_from_energy(600); }, "energy 600 keV is outside 1..500 keV");
    expect_input_error([] { radiation_from_energy(std::nan("")); }, "energy is not a finite number");
    expect_input_error([] { radiation_from_wavelength(-1); }, "wavelength -1 Å must be a positive number");
    expect_input_error([] { radiation_from_wavelength(20); },
                       "wavelength 20 Å (0.619921 keV) is outside 0.0248..12.4 Å (1..500 keV)");
    expect_input_error([] { radiation_from_source("Xx"); },
                       "unknown anode 'Xx'; known anodes: Cr, Fe, Co, Cu, Ga, Mo, Ag, In, W");
    expect_input_error([] { radiation_from_source("Cu:La"); }, "unknown line 'La'; use Ka, Ka1, Ka2 or Kb");
}

}  // namespace
}  // namespace mudepth
