// Number formatting for messages (internal to the library).
#pragma once

#include <cstdio>
#include <string>

namespace mudepth {

/// A number in %g style with the given significant digits: 8.04778, 1e+308, nan.
inline std::string format_number(double value, int significant_digits = 6) {
    char buffer[64];
    std::snprintf(buffer, sizeof buffer, "%.*g", significant_digits, value);
    return buffer;
}

}  // namespace mudepth
