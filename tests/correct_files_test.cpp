// Correcting files through the library: the written columns against the closed
// forms of the factors, the provenance header, batches with failures, and the
// refusals that protect inputs and existing outputs.
#include <gtest/gtest.h>

#include <cmath>
#include <fstream>
#include <numbers>
#include <sstream>
#include <unistd.h>

#include "mudepth/correct_files.hpp"
#include "mudepth/cylinder.hpp"
#include "mudepth/error.hpp"

namespace mudepth {
namespace {

namespace fs = std::filesystem;

class CorrectFiles : public ::testing::Test {
protected:
    void SetUp() override {
        dir_ = fs::path(::testing::TempDir()) /
               ("mudepth-correct-files-" + std::to_string(::getpid()) + "-" +
                ::testing::UnitTest::GetInstance()->current_test_info()->name());
        fs::remove_all(dir_);
        fs::create_directories(dir_);
    }
    void TearDown() override { fs::remove_all(dir_); }

    fs::path write(const std::string& name, const std::string& text) const {
        const fs::path p = dir_ / name;
        fs::create_directories(p.parent_path());
        std::ofstream(p) << text;
        return p;
    }

    static std::string read(const fs::path& p) {
        std::ifstream in(p);
        std::stringstream s;
        s << in.rdbuf();
        return s.str();
    }

    /// The numeric rows of a corrected text file.
    static std::vector<std::vector<double>> rows(const fs::path& p) {
        std::vector<std::vector<double>> out;
        std::istringstream in(read(p));
        for (std::string line; std::getline(in, line);) {
            if (line.empty() || line[0] == '#') continue;
            std::istringstream fields(line);
            std::vector<double> row;
            for (double v; fields >> v;) row.push_back(v);
            out.push_back(row);
        }
        return out;
    }

    static FileCorrectionSettings settings_for(const CapillarySpecimen& c) {
        FileCorrectionSettings s = file_correction_settings(c);
        s.command = "test command";
        s.date_utc = "2026-01-02T03:04:05Z";
        return s;
    }

    fs::path dir_;
};

constexpr const char* kScan = "# invented scan\n10 100 10\n20 200 14\n30 150 12\n40 120 11\n";

TEST_F(CorrectFiles, CylinderColumnsAreMeasuredTimesOneOverA) {
    const fs::path in = write("scan.xy", kScan);
    const auto s = settings_for(capillary_from_mu_R(1.0));
    const auto results = correct_pattern_files(std::vector{in}, dir_ / "out", s);
    ASSERT_EQ(results.size(), 1u);
    EXPECT_EQ(results[0].outcome, FileOutcome::written) << results[0].error;
    EXPECT_EQ(results[0].output, dir_ / "out" / "scan.corrected.xy");
    const auto r = rows(results[0].output);
    ASSERT_EQ(r.size(), 4u);
    const double measured[][3] = {{10, 100, 10}, {20, 200, 14}, {30, 150, 12}, {40, 120, 11}};
    for (std::size_t i = 0; i < 4; ++i) {
        ASSERT_EQ(r[i].size(), 4u);
        const double c = 1 / cylinder_transmission(1.0, measured[i][0]);
        EXPECT_EQ(r[i][0], measured[i][0]);
        EXPECT_NEAR(r[i][3] / c, 1, 1e-15);
        EXPECT_NEAR(r[i][1] / (measured[i][1] * c), 1, 1e-15);
        EXPECT_NEAR(r[i][2] / (measured[i][2] * c), 1, 1e-15);
    }
    EXPECT_DOUBLE_EQ(results[0].correction_min, r[3][3]);  // A rises with 2θ: the largest angle corrects least
}

TEST_F(CorrectFiles, SymmetricReflectionMatchesTheClosedForm) {
    const fs::path in = write("plate.xy", kScan);
    const PlateSpecimen p = plate_from_mu_t(PlateMode::reflection, 0.3);
    const FileCorrectionSettings s = file_correction_settings(p);
    const auto results = correct_pattern_files(std::vector{in}, dir_, s);
    ASSERT_EQ(results[0].outcome, FileOutcome::written) << results[0].error;
    for (const auto& row : rows(results[0].output)) {
        // ITC C Table 6.3.3.1: symmetric reflection from a plate of finite μt, relative to an
        // infinitely thick one, 1 − exp(−2μt/sinθ).
        const double theta = row[0] / 2 * std::numbers::pi / 180;
        EXPECT_NEAR(row[3] * (1 - std::exp(-2 * 0.3 / std::sin(theta))), 1, 1e-14);
    }
}

TEST_F(CorrectFiles, ProvenanceHeader) {
    const fs::path in = write("scan.xy", kScan);
    const auto results = correct_pattern_files(std::vector{in}, dir_ / "out", settings_for(capillary_from_mu_R(4.0)));
    const std::string text = read(results.at(0).output);
    for (const std::string& part : std::vector<std::string>{
             "# mudepth ", " correct: absorption-corrected powder pattern", "# command: test command\n",
          "# date: 2026-01-02T03:04:05Z (UTC)\n", "# input: " + in.string() + " (unchanged): 4 points from 5 lines",
          "# sample: given directly as mu*R\n", "mu*R = 4\n", "# cross sections: not used",
          "# warning: muR = 4 is high", "# normalisation: none", "# > # invented scan\n",
          "# two_theta_deg intensity sigma correction\n"})
        EXPECT_NE(text.find(part), std::string::npos) << part << "\n" << text;
}

TEST_F(CorrectFiles, MaterialRouteProvenanceNamesSampleRadiationAndTable) {
    const Material fe2o3 = material_from_formula(parse_formula("Fe2O3"), 5.24, 0.6);
    const CapillarySpecimen c =
        with_wall(capillary_from_material(fe2o3, radiation_from_source("Mo"), 0.03, CrossSectionTable::chantler),
                  material_from_formula(parse_formula("SiO2"), 2.2), 0.001);
    const auto lines = provenance_lines(c);
    const std::string all = [&] {
        std::string t;
        for (const auto& l : lines) t += l + "\n";
        return t;
    }();
    for (const char* part : {"sample: Fe2O3, density used 3.144 g/cm3", "radiation: Mo Ka (",
                             "cross sections chantler (Chantler 2000, NIST FFAST)", "inner diameter 0.3 mm",
                             "container wall: SiO2, 10 µm, mu ", "1/A_s,sc"})
        EXPECT_NE(all.find(part), std::string::npos) << part << "\n" << all;
}

TEST_F(CorrectFiles, BatchGoesOnPastABadFileAndReportsIt) {
    std::vector<fs::path> inputs;
    for (int i = 0; i < 6; ++i) inputs.push_back(write("run_" + std::to_string(i) + ".xy", kScan));
    write("run_3.xy", "10 100\n5 200\n");  // 2θ decreases
    std::vector<std::pair<std::size_t, std::size_t>> progress;
    auto s = settings_for(capillary_from_mu_R(0.5));
    s.jobs = 2;
    const auto results = correct_pattern_files(inputs, dir_ / "out", s, [&](std::size_t done, std::size_t total) {
        progress.emplace_back(done, total);
    });
    ASSERT_EQ(results.size(), 6u);
    for (std::size_t i = 0; i < 6; ++i) {
        EXPECT_EQ(results[i].input, inputs[i]);
        EXPECT_EQ(fs::exists(results[i].output), i != 3);
        EXPECT_EQ(results[i].outcome, i == 3 ? FileOutcome::bad_input : FileOutcome::written);
    }
    EXPECT_NE(results[3].error.find("run_3.xy:2:"), std::string::npos) << results[3].error;
    ASSERT_FALSE(progress.empty());
    EXPECT_EQ(progress.back(), std::make_pair(std::size_t{6}, std::size_t{6}));
    for (std::size_t k = 1; k < progress.size(); ++k) EXPECT_LE(progress[k - 1].first, progress[k].first);
    // Nothing but the five outputs in the folder (no temporary files left behind).
    EXPECT_EQ(std::distance(fs::directory_iterator(dir_ / "out"), fs::directory_iterator()), 5);
    try {
        throw_failures(results, dir_ / "out");
        ADD_FAILURE() << "not thrown";
    } catch (const InputError& e) {
        EXPECT_EQ(std::string(e.what()),
                  "1 of 6 files failed (" + inputs[3].string() + "); 5 written to " + (dir_ / "out").string());
    }
}

TEST_F(CorrectFiles, OneFailedFileThrowsItsOwnError) {
    const auto results = correct_pattern_files(std::vector{dir_ / "missing.xy"}, dir_ / "out",
                                               settings_for(capillary_from_mu_R(1)));
    EXPECT_EQ(results[0].outcome, FileOutcome::file_error);
    EXPECT_THROW(throw_failures(results, dir_ / "out"), FileError);
}

TEST_F(CorrectFiles, ExistingOutputsAndInputsAreProtected) {
    const fs::path in = write("scan.xy", kScan);
    auto s = settings_for(capillary_from_mu_R(1));
    s.replace_hint = "say so to replace it";
    ASSERT_EQ(correct_pattern_files(std::vector{in}, dir_, s)[0].outcome, FileOutcome::written);
    const auto again = correct_pattern_files(std::vector{in}, dir_, s);
    EXPECT_EQ(again[0].outcome, FileOutcome::file_error);
    EXPECT_EQ(again[0].error, (dir_ / "scan.corrected.xy").string() + ": exists; say so to replace it");
    s.replace_existing = true;
    EXPECT_EQ(correct_pattern_files(std::vector{in}, dir_, s)[0].outcome, FileOutcome::written);
    // An input named like an output is never overwritten, whatever replace_existing says.
    const fs::path corrected_input = dir_ / "scan.corrected.xy";
    const std::string before = read(corrected_input);
    const auto self = correct_pattern_files(std::vector{in, corrected_input}, dir_, s);
    EXPECT_EQ(self[0].outcome, FileOutcome::file_error);
    EXPECT_NE(self[0].error.find("an input is never overwritten"), std::string::npos) << self[0].error;
    EXPECT_EQ(read(corrected_input), before);
}

TEST_F(CorrectFiles, TwoInputsWithOneOutputName) {
    const fs::path a = write("a/scan.xy", kScan), b = write("b/scan.xy", kScan);
    const auto results = correct_pattern_files(std::vector{a, b}, dir_ / "out", settings_for(capillary_from_mu_R(1)));
    EXPECT_EQ(results[0].outcome, FileOutcome::written);
    EXPECT_EQ(results[1].outcome, FileOutcome::bad_input);
    EXPECT_NE(results[1].error.find("is also the output of " + a.string()), std::string::npos) << results[1].error;
}

TEST_F(CorrectFiles, WholeBatchRefusals) {
    const fs::path in = write("scan.xy", kScan);
    auto s = settings_for(with_wall(capillary_from_mu_R(1), 0.1, 1.1));
    s.empty_file = in;
    EXPECT_THROW(correct_pattern_files(std::vector{in}, dir_ / "out", s), InputError);
    s.empty_file = dir_ / "no-such-empty.xy";
    EXPECT_THROW(correct_pattern_files(std::vector{in}, dir_ / "out", s), FileError);
    auto plate = settings_for(capillary_from_mu_R(1));
    plate.empty_file = in;  // an empty container without a wall
    EXPECT_THROW(correct_pattern_files(std::vector{write("other.xy", kScan)}, dir_ / "out", plate), InputError);
    const fs::path file = write("afile", "not a folder\n");
    EXPECT_THROW(correct_pattern_files(std::vector{in}, file, settings_for(capillary_from_mu_R(1))), FileError);
    EXPECT_THROW(correct_pattern_files(std::vector<fs::path>{}, dir_, settings_for(capillary_from_mu_R(1))), InputError);
    EXPECT_FALSE(fs::exists(dir_ / "out"));
}

}  // namespace
}  // namespace mudepth
