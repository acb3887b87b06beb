// Physical constants used across the library, each beside its source.
#pragma once

namespace mudepth {

/// hc in keV·Å (CODATA 2018).
inline constexpr double kHc_keV_A = 12.39841984;
/// Classical electron radius, m (CODATA 2018).
inline constexpr double kClassicalElectronRadius_m = 2.8179403262e-15;
/// Avogadro constant, 1/mol (exact, SI 2019).
inline constexpr double kAvogadro_per_mol = 6.02214076e23;

}  // namespace mudepth
