// Benchmark: a 10^6-point three-column pattern corrected with a cylinder
// geometry end to end through the library's file pipeline (read, factors, σ,
// provenance, render, atomic write: what `mudepth correct` and Python's
// correct_files run) against merely reading and writing the same file, in one
// run. Target: within 2x and under 1 s.
#include <algorithm>
#include <cmath>
#include <cstdio>
#include <filesystem>
#include <fstream>
#include <string>
#include <vector>

#include "mudepth/correct_files.hpp"
#include "mudepth/pattern.hpp"
#include "timing.hpp"

namespace fs = std::filesystem;
using mudepth::Pattern;
using mudepth::bench::seconds;

int main() {
    const fs::path dir = fs::temp_directory_path() / "mudepth_bench_correct";
    fs::remove_all(dir);
    fs::create_directories(dir);
    const fs::path input = dir / "big.xye";
    constexpr std::size_t kPoints = 1'000'000;
    {
        std::ofstream out(input);
        char line[96];
        for (std::size_t i = 0; i < kPoints; ++i) {
            const double t = 2 + 1.4e-4 * static_cast<double>(i);  // 2° to 142°
            const double I = 1000 + 500 * std::sin(t) * std::sin(t);
            std::snprintf(line, sizeof line, "%.5f %.3f %.4f\n", t, I, std::sqrt(I));
            out << line;
        }
    }
    std::printf("input: %zu points, %.1f MB\n", kPoints, static_cast<double>(fs::file_size(input)) / 1e6);

    mudepth::FileCorrectionSettings settings = mudepth::file_correction_settings(mudepth::capillary_from_mu_R(1.5));
    settings.command = "bench_correct";
    settings.replace_existing = true;
    settings.jobs = 1;
    const std::vector<fs::path> inputs{input};
    double best_plain = 1e9, best_full = 1e9;
    for (int round = 0; round < 3; ++round) {
        best_plain = std::min(best_plain, seconds([&] {
            const Pattern p = mudepth::read_pattern(input);
            const std::string text = mudepth::render_pattern(p, p.intensity, p.sigma, {}, {});
            mudepth::write_file_atomically(dir / "plain.xye", text, true);
        }));
        best_full = std::min(best_full, seconds([&] {
            const auto results = mudepth::correct_pattern_files(inputs, dir / "out", settings);
            mudepth::throw_failures(results, dir / "out");
        }));
    }
    std::printf("read + write only:              %.3f s\n", best_plain);
    std::printf("read + cylinder correction + write: %.3f s (ratio %.2f; target <= 2 and < 1 s)\n", best_full,
                best_full / best_plain);
    fs::remove_all(dir);
    return 0;
}
