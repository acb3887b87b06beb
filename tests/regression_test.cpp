// Replays the fuzzers' inputs through the same entry points the fuzz targets use
// (tests/fuzz/entry_points.hpp): every input that once crashed a target, saved
// under tests/fuzz/regressions/<target>/, and the seed corpora under
// tests/fuzz/corpus/<target>/. Each must be refused with InputError/FileError
// or give a value that meets its contract.
#include <gtest/gtest.h>

#include <filesystem>
#include <fstream>
#include <functional>
#include <map>
#include <sstream>
#include <string>

#include "fuzz/entry_points.hpp"

namespace {

namespace fs = std::filesystem;

const std::map<std::string, std::function<void(std::string_view)>>& targets() {
    static const std::map<std::string, std::function<void(std::string_view)>> t{
        {"formula", mudepth::fuzz::formula_one},
        {"composition", mudepth::fuzz::composition_one},
        {"options", mudepth::fuzz::options_one},
        {"film_layers", mudepth::fuzz::film_layers_one},
        {"pattern", mudepth::fuzz::pattern_one}};
    return t;
}

std::string slurp(const fs::path& p) {
    std::ifstream in(p, std::ios::binary);
    std::ostringstream s;
    s << in.rdbuf();
    return s.str();
}

/// Feeds every file under root/<target>/ to its target; returns how many ran.
std::size_t replay(const fs::path& root) {
    std::size_t count = 0;
    if (!fs::is_directory(root)) return 0;
    for (const auto& dir : fs::directory_iterator(root)) {
        if (!dir.is_directory()) continue;
        const auto target = targets().find(dir.path().filename().string());
        if (target == targets().end()) {
            ADD_FAILURE() << "no entry point for " << dir.path();
            continue;
        }
        for (const auto& file : fs::directory_iterator(dir.path())) {
            if (!file.is_regular_file() || file.path().filename().string().front() == '.') continue;
            const std::string input = slurp(file.path());
            EXPECT_NO_THROW(target->second(input)) << file.path();
            ++count;
        }
    }
    return count;
}

const fs::path kFuzzDir = fs::path(MUDEPTH_SOURCE_DIR) / "tests" / "fuzz";

TEST(FuzzRegressions, SavedCrashesStayFixed) { replay(kFuzzDir / "regressions"); }

TEST(FuzzRegressions, SeedCorporaAreRefusedOrValid) { EXPECT_GT(replay(kFuzzDir / "corpus"), 100u); }

}  // namespace
