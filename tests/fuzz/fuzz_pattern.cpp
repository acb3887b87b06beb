// libFuzzer target: see entry_points.hpp (pattern_one) for what one input means.
#include "entry_points.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    mudepth::fuzz::pattern_one(std::string_view(reinterpret_cast<const char*>(data), size));
    return 0;
}
