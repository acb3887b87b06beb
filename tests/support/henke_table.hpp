// Reader for the Henke, Gullikson & Davis (1993) atomic scattering factor
// tables as shipped in text form by Debian's python3-periodictable
// (MUDEPTH_HENKE_DIR/<symbol>.nff: a header line, then E(eV) f1 f2).
#pragma once

#include <algorithm>
#include <cctype>
#include <cmath>
#include <fstream>
#include <sstream>
#include <string>
#include <string_view>
#include <vector>

namespace xs_test {

struct HenkeRow {
    double energy_eV;
    double f1;  ///< -9999 where Henke gives no value
    double f2;
};

/// The rows of <dir>/<symbol in lower case>.nff; empty if the file is missing.
inline std::vector<HenkeRow> read_henke(const std::string& dir, std::string_view symbol) {
    std::string name(symbol);
    std::transform(name.begin(), name.end(), name.begin(),
                   [](unsigned char c) { return static_cast<char>(std::tolower(c)); });
    std::ifstream in(dir + "/" + name + ".nff");
    std::vector<HenkeRow> rows;
    std::string line;
    std::getline(in, line);  // header: E(eV) f1 f2
    while (std::getline(in, line)) {
        std::istringstream fields(line);
        HenkeRow row{};
        if (fields >> row.energy_eV >> row.f1 >> row.f2) rows.push_back(row);
    }
    return rows;
}

/// Photoabsorption mass coefficient (cm2/g) from f2.
/// The atomic photoabsorption cross section is sigma_a = 2 r_e lambda f2 (optical
/// theorem: beta = r_e lambda^2 n f2 / (2 pi), mu = 4 pi beta / lambda = 2 r_e lambda n f2,
/// sigma_a = mu / n; Henke, Gullikson & Davis 1993, eq. 5), and
/// mu/rho = sigma_a N_A / M.
inline double henke_photo_cm2_g(double energy_eV, double f2, double molar_mass_g_mol) {
    constexpr double kClassicalElectronRadius_cm = 2.8179403262e-13;  // CODATA 2018
    constexpr double kHc_keV_angstrom = 12.39841984;                  // CODATA 2018
    constexpr double kAvogadro_per_mol = 6.02214076e23;               // SI 2019, exact
    const double wavelength_cm = kHc_keV_angstrom / (energy_eV / 1000.0) * 1e-8;
    return 2.0 * kClassicalElectronRadius_cm * wavelength_cm * f2 * kAvogadro_per_mol / molar_mass_g_mol;
}

}  // namespace xs_test
