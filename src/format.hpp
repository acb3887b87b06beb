// Number formatting for messages (internal to the library).
#pragma once

#include <cmath>
#include <cstdio>
#include <string>

namespace mudepth {

/// A number in %g style with the given significant digits: 8.04778, 1e+308, nan.
inline std::string format_number(double value, int significant_digits = 6) {
    char buffer[64];
    std::snprintf(buffer, sizeof buffer, "%.*g", significant_digits, value);
    return buffer;
}

/// A length in the unit that reads best: "850 nm", "12.5 µm", "1.2 mm" (below 1 µm, below 1 mm, above).
inline std::string format_length_um(double length_um, int significant_digits = 4) {
    if (std::abs(length_um) < 1.0) return format_number(length_um * 1e3, significant_digits) + " nm";
    if (std::abs(length_um) < 1000.0) return format_number(length_um, significant_digits) + " µm";
    return format_number(length_um / 1e3, significant_digits) + " mm";
}

}  // namespace mudepth
