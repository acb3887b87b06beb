// Energy grids for scans.
#include "mudepth/energy_grid.hpp"

#include <cmath>
#include <string>

#include "format.hpp"
#include "mudepth/error.hpp"
#include "mudepth/radiation.hpp"

namespace mudepth {

GridSpacing parse_grid_spacing(std::string_view name) {
    if (name == "linear") return GridSpacing::linear;
    if (name == "log") return GridSpacing::log;
    throw InputError("unknown spacing '" + std::string(name) + "'; use linear or log");
}

std::string_view to_string(GridSpacing spacing) {
    return spacing == GridSpacing::log ? "log" : "linear";
}

std::vector<double> energy_grid_keV(double from_keV, double to_keV, std::size_t points,
                                    GridSpacing spacing) {
    check_energy_keV(from_keV);
    check_energy_keV(to_keV);
    if (!(from_keV < to_keV))
        throw InputError("scan start " + format_number(from_keV) + " keV must be below its end " +
                         format_number(to_keV) + " keV");
    if (points < 2 || points > kMaxScanPoints)
        throw InputError("a scan needs 2.." + std::to_string(kMaxScanPoints) + " points, not " +
                         std::to_string(points));
    std::vector<double> grid(points);
    const double n = static_cast<double>(points - 1);
    for (std::size_t i = 0; i < points; ++i) {
        const double t = static_cast<double>(i) / n;
        grid[i] = spacing == GridSpacing::log
                      ? std::exp(std::log(from_keV) + t * (std::log(to_keV) - std::log(from_keV)))
                      : from_keV + t * (to_keV - from_keV);
    }
    grid.front() = from_keV;  // exact ends despite rounding
    grid.back() = to_keV;
    return grid;
}

}  // namespace mudepth
