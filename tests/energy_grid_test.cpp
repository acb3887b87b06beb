// Energy grids for scans.
#include "mudepth/energy_grid.hpp"

#include <gtest/gtest.h>

#include <cmath>

#include "mudepth/error.hpp"

namespace mudepth {
namespace {

TEST(EnergyGrid, LinearAndLogEnds) {
    const auto lin = energy_grid_keV(5, 25, 5, GridSpacing::linear);
    ASSERT_EQ(lin.size(), 5u);
    EXPECT_DOUBLE_EQ(lin[1], 10.0);
    EXPECT_DOUBLE_EQ(lin.back(), 25.0);
    const auto log = energy_grid_keV(1, 100, 3, GridSpacing::log);
    EXPECT_NEAR(log[1], 10.0, 1e-12);  // geometric mean of the ends (closed form)
    EXPECT_DOUBLE_EQ(log.front(), 1.0);
    EXPECT_DOUBLE_EQ(log.back(), 100.0);
}

TEST(EnergyGrid, Refusals) {
    EXPECT_THROW(energy_grid_keV(10, 5, 10, GridSpacing::log), InputError);
    EXPECT_THROW(energy_grid_keV(0.5, 5, 10, GridSpacing::log), InputError);
    EXPECT_THROW(energy_grid_keV(5, 10, 1, GridSpacing::log), InputError);
    EXPECT_THROW(energy_grid_keV(5, 10, kMaxScanPoints + 1, GridSpacing::log), InputError);
    EXPECT_THROW(parse_grid_spacing("logarithmic"), InputError);
}

}  // namespace
}  // namespace mudepth
