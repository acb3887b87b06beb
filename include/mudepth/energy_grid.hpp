// Energy grids for scans of attenuation versus energy.
#pragma once

#include <cstddef>
#include <string_view>
#include <vector>

namespace mudepth {

enum class GridSpacing { linear, log };

/// Parses "linear" or "log"; throws InputError.
GridSpacing parse_grid_spacing(std::string_view name);
std::string_view to_string(GridSpacing spacing);

/// Most points a scan may have.
inline constexpr std::size_t kMaxScanPoints = 1'000'000;

/// `points` energies from from_keV to to_keV inclusive (points >= 2, both ends
/// inside 1..500 keV, from < to), evenly spaced in E or in ln E.
std::vector<double> energy_grid_keV(double from_keV, double to_keV, std::size_t points,
                                    GridSpacing spacing);

}  // namespace mudepth
