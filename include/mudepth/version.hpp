// The single source of mudepth's version number.
#pragma once

#include <string_view>

namespace mudepth {

inline constexpr int kVersionMajor = 0;
inline constexpr int kVersionMinor = 1;
inline constexpr int kVersionPatch = 0;
inline constexpr std::string_view kVersion = "0.1.0";

}  // namespace mudepth
