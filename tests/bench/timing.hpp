// Wall-clock timing for the benchmarks.
#pragma once

#include <chrono>

namespace mudepth::bench {

/// Seconds that f() takes (steady clock).
template <class F>
double seconds(F&& f) {
    const auto start = std::chrono::steady_clock::now();
    f();
    return std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
}

}  // namespace mudepth::bench
