// Parsing of option values with units at the command-line boundary.
#include "cli/common.hpp"

#include <gtest/gtest.h>

#include "mudepth/error.hpp"

namespace mudepth::cli {
namespace {

TEST(CliCommon, LengthsWithUnits) {
    // 1 nm = 1e-7 cm, 1 µm = 1e-4 cm, 1 mm = 0.1 cm (SI); a bare number is mm.
    EXPECT_DOUBLE_EQ(parse_length_cm("--t", "250nm"), 2.5e-5);
    EXPECT_DOUBLE_EQ(parse_length_cm("--t", "10um"), 1e-3);
    EXPECT_DOUBLE_EQ(parse_length_cm("--t", "10 µm"), 1e-3);
    EXPECT_DOUBLE_EQ(parse_length_cm("--t", "0.3mm"), 0.03);
    EXPECT_DOUBLE_EQ(parse_length_cm("--t", "0.3"), 0.03);
    EXPECT_DOUBLE_EQ(parse_length_cm("--t", "2cm"), 2.0);
    EXPECT_THROW(parse_length_cm("--t", "3 ft"), InputError);
    EXPECT_THROW(parse_length_cm("--t", "-1mm"), InputError);
    EXPECT_THROW(parse_length_cm("--t", "0"), InputError);
    EXPECT_THROW(parse_length_cm("--t", "mm"), InputError);
    EXPECT_THROW(parse_length_cm("--t", "1e308cm"), InputError);  // longer than 10 m
    EXPECT_THROW(parse_length_cm("--t", "11m"), InputError);
}

TEST(CliCommon, Angles) {
    const auto range = parse_angles_deg("--two-theta", "10:20:2.5");
    ASSERT_EQ(range.size(), 5u);
    EXPECT_DOUBLE_EQ(range.back(), 20.0);
    EXPECT_EQ(parse_angles_deg("--two-theta", "10:20:3").size(), 4u);  // 10, 13, 16, 19
    EXPECT_EQ(parse_angles_deg("--two-theta", "0:180:0.01").size(), 18001u);
    const auto list = parse_angles_deg("--two-theta", "20, 40.5,60");
    EXPECT_EQ(list, (std::vector<double>{20, 40.5, 60}));
    EXPECT_THROW(parse_angles_deg("--two-theta", "10:20:0"), InputError);
    EXPECT_THROW(parse_angles_deg("--two-theta", "10:20:-1"), InputError);
    EXPECT_THROW(parse_angles_deg("--two-theta", "20:10:1"), InputError);
    EXPECT_THROW(parse_angles_deg("--two-theta", "0:180:1e-6"), InputError);  // > 10^7 points
    EXPECT_THROW(parse_angles_deg("--two-theta", "10:20"), InputError);
    EXPECT_THROW(parse_angles_deg("--two-theta", "10,,20"), InputError);
    EXPECT_THROW(parse_angles_deg("--two-theta", "nan:20:1"), InputError);
    EXPECT_THROW(parse_angles_deg("--two-theta", ""), InputError);
}

TEST(CliCommon, Numbers) {
    EXPECT_DOUBLE_EQ(parse_number("--x", " 2.5 "), 2.5);
    EXPECT_DOUBLE_EQ(parse_number("--x", "+1e3"), 1000);
    EXPECT_THROW(parse_number("--x", "1,5"), InputError);
    EXPECT_THROW(parse_number("--x", "inf"), InputError);
    EXPECT_THROW(parse_number("--x", "1e400"), InputError);
    EXPECT_EQ(parse_count("--n", "12"), 12u);
    EXPECT_THROW(parse_count("--n", "0"), InputError);
    EXPECT_THROW(parse_count("--n", "-3"), InputError);
    EXPECT_THROW(parse_count("--n", "2.5"), InputError);
}

}  // namespace
}  // namespace mudepth::cli
