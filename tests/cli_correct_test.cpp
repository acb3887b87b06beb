// End-to-end tests of `mudepth correct`: the factor column against what
// `cylinder` and `plate` print, σ and normalisation, the readers through the
// binary, every refusal with nothing written, inputs untouched, batches.
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <filesystem>
#include <fstream>
#include <functional>
#include <sstream>

#include "mudepth/pattern.hpp"
#include "support/process.hpp"

namespace mudepth::test {
namespace {

namespace fs = std::filesystem;

fs::path fresh_dir(const std::string& tag) {
    const fs::path d = fs::path(::testing::TempDir()) / ("mudepth_cli_correct_" + tag);
    fs::remove_all(d);
    fs::create_directories(d);
    return d;
}

std::string slurp(const fs::path& p) {
    std::ifstream in(p, std::ios::binary);
    return std::string((std::istreambuf_iterator<char>(in)), {});
}

void spit(const fs::path& p, const std::string& text) { std::ofstream(p, std::ios::binary) << text; }

std::size_t files_in(const fs::path& dir) {
    if (!fs::exists(dir)) return 0;
    std::size_t n = 0;
    for ([[maybe_unused]] const auto& e : fs::directory_iterator(dir)) ++n;
    return n;
}

/// Rows of a corrected text file (comment lines skipped), split at white space.
std::vector<std::vector<double>> rows_of(const fs::path& p) {
    std::istringstream in(slurp(p));
    std::string line;
    std::vector<std::vector<double>> rows;
    while (std::getline(in, line)) {
        if (line.empty() || line[0] == '#') continue;
        std::istringstream f(line);
        std::vector<double> row;
        std::string x;
        while (f >> x) row.push_back(std::stod(x));
        rows.push_back(row);
    }
    return rows;
}

/// A 3-column pattern over the angles, intensity 1000 + 10·2θ, σ = √I.
std::string pattern_text(const std::vector<double>& angles) {
    std::ostringstream o;
    o << "# invented test pattern\n2theta intensity sigma\n";
    o.precision(17);
    for (double a : angles) o << a << ' ' << 1000 + 10 * a << ' ' << std::sqrt(1000 + 10 * a) << '\n';
    return o.str();
}

std::string list_of(const std::vector<double>& angles) {
    std::ostringstream o;
    o.precision(17);
    for (std::size_t i = 0; i < angles.size(); ++i) o << (i ? "," : "") << angles[i];
    return o.str();
}

std::vector<double> grid(double from, double to, double step) {
    std::vector<double> out;
    for (int i = 0; from + i * step <= to + 1e-9; ++i) out.push_back(from + i * step);
    return out;
}

struct RoundTrip {
    std::string label;
    std::vector<std::string> geometry;  // correct's options
    std::vector<std::string> command;   // the same sample in cylinder / plate
    std::string factor_key;             // the JSON key whose value the correction must equal
    bool reciprocal;                    // factor = 1/value
    std::vector<double> angles;
};

class CliCorrectRoundTrip : public ::testing::TestWithParam<RoundTrip> {};

TEST_P(CliCorrectRoundTrip, FactorIsWhatTheGeometryCommandPrints) {
    const auto& c = GetParam();
    const fs::path dir = fresh_dir("rt_" + c.label);
    spit(dir / "in.xy", pattern_text(c.angles));
    std::vector<std::string> args{"correct", (dir / "in.xy").string(), "--output-dir", (dir / "out").string()};
    args.insert(args.end(), c.geometry.begin(), c.geometry.end());
    const auto r = run_mudepth(args);
    ASSERT_EQ(r.status, 0) << r.err;
    EXPECT_TRUE(r.err.empty()) << r.err;  // no progress bar when stderr is not a terminal
    auto cmd = c.command;
    cmd.insert(cmd.end(), {"--two-theta", list_of(c.angles), "--json"});
    const auto j = run_json(cmd);
    const auto rows = rows_of(dir / "out" / "in.corrected.xy");
    ASSERT_EQ(rows.size(), c.angles.size());
    ASSERT_EQ(j["points"].size(), c.angles.size());
    for (std::size_t i = 0; i < rows.size(); ++i) {
        const double v = j["points"][i][c.factor_key].get<double>();
        const double expected = c.reciprocal ? 1 / v : v;
        EXPECT_EQ(rows[i][0], c.angles[i]);
        EXPECT_NEAR(rows[i][3], expected, 1e-12 * expected) << c.label << " at " << c.angles[i];
        const double I = 1000 + 10 * c.angles[i];
        EXPECT_NEAR(rows[i][1], I * rows[i][3], 1e-15 * rows[i][1]);  // intensity × correction
        EXPECT_NEAR(rows[i][2], std::sqrt(I) * rows[i][3], 1e-15 * rows[i][2]);  // σ × correction
    }
}

INSTANTIATE_TEST_SUITE_P(
    Geometries, CliCorrectRoundTrip,
    ::testing::Values(
        RoundTrip{"cylinder_long", {"--geometry", "cylinder", "--mu-r", "1.7"}, {"cylinder", "--mu-r", "1.7"},
                  "correction", false, grid(3, 160, 0.5)},
        RoundTrip{"cylinder_short", {"--geometry", "cylinder", "--mu-r", "0.4"}, {"cylinder", "--mu-r", "0.4"},
                  "correction", false, grid(10, 100, 10)},
        RoundTrip{"cylinder_material",
                  {"--geometry", "cylinder", "--formula", "SiO2", "--density", "2.2", "--packing", "0.5", "--source",
                   "Cu", "--diameter", "0.5"},
                  {"cylinder", "--formula", "SiO2", "--density", "2.2", "--packing", "0.5", "--source", "Cu",
                   "--diameter", "0.5"},
                  "correction", false, grid(5, 140, 1)},
        RoundTrip{"cylinder_wall",
                  {"--geometry", "cylinder", "--mu-r", "0.8", "--mu-r-container", "0.2", "--radius-ratio", "1.1"},
                  {"cylinder", "--mu-r", "0.8", "--mu-r-container", "0.2", "--radius-ratio", "1.1"}, "A_s_sc", true,
                  grid(10, 150, 1)},
        RoundTrip{"reflection", {"--geometry", "reflection", "--mu-t", "0.2"}, {"plate", "--mu-t", "0.2"},
                  "correction", false, grid(5, 150, 1)},
        RoundTrip{"reflection_incidence_window",
                  {"--geometry", "reflection", "--mu-t", "0.3", "--incidence", "2", "--mu-t-window", "0.01"},
                  {"plate", "--mu-t", "0.3", "--incidence", "2", "--mu-t-window", "0.01"}, "correction", false,
                  grid(5, 120, 0.25)},
        RoundTrip{"transmission_normal",
                  {"--geometry", "transmission-normal", "--formula", "C10H8O4", "--density", "1.38", "--source", "Mo",
                   "--thickness", "1mm", "--window-material", "polyimide", "--window-thickness", "25um"},
                  {"plate", "--mode", "transmission-normal", "--formula", "C10H8O4", "--density", "1.38", "--source",
                   "Mo", "--thickness", "1mm", "--window-material", "polyimide", "--window-thickness", "25um"},
                  "correction", false, grid(2, 80, 0.5)},
        RoundTrip{"transmission_symmetric", {"--geometry", "transmission-symmetric", "--mu-t", "1.1"},
                  {"plate", "--mode", "transmission-symmetric", "--mu-t", "1.1"}, "correction", false,
                  grid(5, 170, 1)}),
    [](const auto& test_info) { return test_info.param.label; });

TEST(CliCorrect, NormalizeModes) {
    const fs::path dir = fresh_dir("norm");
    spit(dir / "in.xy", "10 100 10\n20 400 20\n30 300 17\n");
    auto run = [&](const std::string& mode) {
        const auto r = run_mudepth({"correct", (dir / "in.xy").string(), "--geometry", "cylinder", "--mu-r", "1",
                                    "--output-dir", (dir / mode).string(), "--normalize", mode});
        EXPECT_EQ(r.status, 0) << r.err;
        return rows_of(dir / mode / "in.corrected.xy");
    };
    const auto none = run("none");
    EXPECT_NEAR(none[1][1], 400 * none[1][3], 1e-12 * none[1][1]);
    const auto max = run("max");
    EXPECT_DOUBLE_EQ(max[1][1], 1.0);
    EXPECT_NEAR(max[0][1], none[0][1] / none[1][1], 1e-15);
    EXPECT_NEAR(max[1][2], 20.0 / 400.0, 1e-15);
    EXPECT_EQ(max[0][3], none[0][3]);  // the factor column is never normalised
    const auto at = run("at:30");
    EXPECT_DOUBLE_EQ(at[2][1], 1.0);
    EXPECT_NE(slurp(dir / "at:30" / "in.corrected.xy").find("# normalisation: intensity and sigma divided by"),
              std::string::npos);
}

TEST(CliCorrect, ProvenanceHeader) {
    const fs::path dir = fresh_dir("prov");
    spit(dir / "in.xy", "10 100\n20 400\n");
    const auto r = run_mudepth({"correct", (dir / "in.xy").string(), "--geometry", "reflection", "--formula", "CeO2",
                                "--density", "7.2", "--packing", "0.6", "--source", "Cu", "--thickness", "50um",
                                "--output-dir", (dir / "out").string()});
    ASSERT_EQ(r.status, 0) << r.err;
    const std::string text = slurp(dir / "out" / "in.corrected.xy");
    for (const char* part : {"# mudepth 0.1.0 correct", "# command: ", "correct ", "--thickness 50um", "# date: 20",
                             "(UTC)", "# sample: CeO2, density used 4.32 g/cm3", "# radiation: Cu Ka",
                             " 1/cm; cross sections elam (Elam, Ravel & Sieber 2002)", "thickness 50 um",
                             "# columns: two_theta_deg", "# two_theta_deg intensity correction\n"})
        EXPECT_NE(text.find(part), std::string::npos) << part << "\n" << text;
    for (const char c : text) EXPECT_LT(static_cast<unsigned char>(c), 0x80);  // ASCII throughout
    EXPECT_NE(r.out.find("in.corrected.xy: 2 points from 2 lines"), std::string::npos) << r.out;
}

TEST(CliCorrect, ReadersThroughTheBinary) {
    const fs::path dir = fresh_dir("readers");
    spit(dir / "crlf.xy", "Header line\r\n# comment\r\n\r\n10 100 10\r\n20 200 14\r\n");
    spit(dir / "comma.csv", "2theta;I\n10,5;100,5\n20,5;200,25\n");
    spit(dir / "su.cif",
         "#\\#CIF_1.1\ndata_x\n_pd_block_id 'x|y'\nloop_\n_pd_meas_2theta_scan\n_pd_meas_counts_total\n"
         "10.0 1000(32)\n20.0 2000(45)\n");
    spit(dir / "range.cif",
         "data_r\n_pd_meas_2theta_range_min 10\n_pd_meas_2theta_range_inc 10\n_pd_meas_number_of_points 2\n"
         "loop_\n_pd_meas_intensity_total\n1000(32)\n2000(45)\n");
    const auto r = run_mudepth({"correct", (dir / "crlf.xy").string(), (dir / "comma.csv").string(),
                                (dir / "su.cif").string(), (dir / "range.cif").string(), "--geometry", "cylinder",
                                "--mu-r", "1", "--output-dir", (dir / "out").string()});
    ASSERT_EQ(r.status, 0) << r.err;
    EXPECT_NE(r.out.find("crlf.corrected.xy: 2 points from 5 lines; skipped 1 header line, 1 comment line, 1 blank line"),
              std::string::npos) << r.out;
    EXPECT_NE(r.out.find("CRLF line ends"), std::string::npos);
    EXPECT_NE(r.out.find("separated by semicolons, decimal commas"), std::string::npos);
    const auto crlf = rows_of(dir / "out" / "crlf.corrected.xy");
    ASSERT_EQ(crlf.size(), 2u);
    const std::string comma = slurp(dir / "out" / "comma.corrected.csv");
    EXPECT_NE(comma.find("\n10,5;"), std::string::npos) << comma;
    const Pattern cif = parse_cif_pattern(slurp(dir / "out" / "su.corrected.cif"), "su.corrected.cif");
    ASSERT_EQ(cif.size(), 2u);
    EXPECT_EQ(cif.report.intensity_item, "_pd_proc_intensity_total");
    ASSERT_EQ(cif.report.dropped_items.size(), 1u);
    EXPECT_EQ(cif.report.dropped_items[0], "_mudepth_absorption_correction");
    // The same angles as crlf.xy, so the same factors; σ 32 → 32 × 5.07 = 162.3 written with two digits,
    // "5070(160)": both rounded to the tens.
    EXPECT_NE(slurp(dir / "out" / "su.corrected.cif").find("\n10 5070(160) "), std::string::npos);
    EXPECT_NEAR(cif.intensity[0], 1000 * crlf[0][3], 5);
    EXPECT_NEAR(cif.sigma[0], 32 * crlf[0][3], 5);
    const Pattern range = parse_cif_pattern(slurp(dir / "out" / "range.corrected.cif"), "range.corrected.cif");
    EXPECT_EQ(range.two_theta_deg, (std::vector<double>{10, 20}));
    EXPECT_NE(slurp(dir / "out" / "range.corrected.cif").find("_pd_meas_2theta_range_min 10"), std::string::npos);
}

struct Refusal {
    std::string label;
    std::string file_text;            // written to bad.xy (or bad.cif when it starts with data_)
    std::vector<std::string> extra;   // options after the geometry
    std::string message;              // expected part of the one line
    int status;
};

class CliCorrectRefusal : public ::testing::TestWithParam<Refusal> {};

TEST_P(CliCorrectRefusal, OneLineAndNothingWritten) {
    const auto& c = GetParam();
    const fs::path dir = fresh_dir("refusal_" + c.label);
    const fs::path input = dir / (c.file_text.rfind("data_", 0) == 0 ? "bad.cif" : "bad.xy");
    spit(input, c.file_text);
    const std::string before = slurp(input);
    std::vector<std::string> args{"correct", input.string(), "--output-dir", (dir / "out").string()};
    if (std::find(c.extra.begin(), c.extra.end(), "--geometry") == c.extra.end())
        args.insert(args.end(), {"--geometry", "cylinder", "--mu-r", "1"});
    args.insert(args.end(), c.extra.begin(), c.extra.end());
    const auto r = run_mudepth(args);
    EXPECT_EQ(r.status, c.status) << r.err;
    EXPECT_TRUE(r.out.empty()) << r.out;
    EXPECT_EQ(r.err.rfind("mudepth: error: ", 0), 0u) << r.err;
    EXPECT_EQ(std::count(r.err.begin(), r.err.end(), '\n'), 1) << r.err;
    EXPECT_NE(r.err.find(c.message), std::string::npos) << r.err;
    EXPECT_EQ(files_in(dir / "out"), 0u);  // no output, no temporary file
    EXPECT_EQ(slurp(input), before);       // the input untouched
}

INSTANTIATE_TEST_SUITE_P(
    BadInput, CliCorrectRefusal,
    ::testing::Values(
        Refusal{"nan", "10 1\n20 NaN\n", {}, "bad.xy:2: the intensity is NaN", 2},
        Refusal{"inf", "10 1\ninf 1\n", {}, "bad.xy:2: 2θ is infinite", 2},
        Refusal{"angle", "10 1\n180 2\n", {}, "bad.xy:2: 2θ = 180° is outside [0°, 180°)", 2},
        Refusal{"columns", "10 1 1\n20 2\n", {}, "bad.xy:2: 2 columns where the first data row (line 1) has 3", 2},
        Refusal{"empty_file", "# nothing here\n", {}, "bad.xy:1: no data rows", 2},
        Refusal{"cif_su", "data_a\nloop_\n_pd_meas_2theta_scan\n_pd_meas_counts_total\n10 1(x)\n", {}, "bad.cif:5:", 2},
        Refusal{"normal_90", "30 1\n95 1\n", {"--geometry", "transmission-normal", "--mu-t", "1"},
                "bad.xy:2: transmission-normal", 2},
        Refusal{"incidence", "3 1\n20 1\n", {"--geometry", "reflection", "--mu-t", "1", "--incidence", "5"},
                "bad.xy:1: incidence 5° must be below 2θ = 3°", 2},
        Refusal{"no_geometry", "10 1\n", {"--geometry", "sphere"}, "unknown geometry 'sphere'", 2},
        Refusal{"plate_option_on_cylinder", "10 1\n", {"--thickness", "1mm"},
                "--thickness applies to the plate geometries", 2},
        Refusal{"cylinder_option_on_plate", "10 1\n", {"--geometry", "reflection", "--mu-t", "1", "--diameter", "1"},
                "--diameter applies to --geometry cylinder", 2},
        Refusal{"empty_without_wall", "10 1\n", {"--empty", "e.xy"}, "--empty needs --geometry cylinder with the container", 2},
        Refusal{"scale_without_empty", "10 1\n", {"--empty-scale", "2"}, "--empty-scale needs --empty", 2},
        Refusal{"normalize", "10 1\n", {"--normalize", "biggest"}, "unknown normalisation 'biggest'", 2},
        Refusal{"normalize_outside", "10 1\n20 1\n", {"--normalize", "at:50"}, "lies outside the pattern", 2},
        Refusal{"mu_r", "10 1\n", {"--geometry", "cylinder", "--mu-r", "40"}, "is above 30", 2},
        Refusal{"jobs", "10 1\n", {"--jobs", "0"}, "--jobs: '0' is not a positive whole number", 2}),
    [](const auto& test_info) { return test_info.param.label; });

TEST(CliCorrect, FileErrors) {
    const fs::path dir = fresh_dir("files");
    auto base = [&](std::vector<std::string> files, std::vector<std::string> more = {}) {
        std::vector<std::string> a{"correct"};
        a.insert(a.end(), files.begin(), files.end());
        a.insert(a.end(), {"--geometry", "cylinder", "--mu-r", "1", "--output-dir", dir.string()});
        a.insert(a.end(), more.begin(), more.end());
        return run_mudepth(a);
    };
    const auto missing = base({(dir / "missing.xy").string()});
    EXPECT_EQ(missing.status, 3);
    EXPECT_NE(missing.err.find("missing.xy: cannot read: No such file or directory"), std::string::npos) << missing.err;

    // An output equal to an input is refused even with --force; the input is untouched (compared byte for byte).
    spit(dir / "a.xy", "10 1\n20 2\n");
    spit(dir / "a.corrected.xy", "10 5\n20 6\n");
    const std::size_t hash_before = std::hash<std::string>{}(slurp(dir / "a.corrected.xy"));
    const auto same = base({(dir / "a.xy").string(), (dir / "a.corrected.xy").string()}, {"--force"});
    EXPECT_EQ(same.status, 3) << same.err;
    EXPECT_NE(same.err.find("a.corrected.xy: is the input file"), std::string::npos) << same.err;
    EXPECT_EQ(std::hash<std::string>{}(slurp(dir / "a.corrected.xy")), hash_before);
    EXPECT_TRUE(fs::exists(dir / "a.corrected.corrected.xy"));  // the other file was written
    EXPECT_NE(same.err.find("1 of 2 files failed (" + (dir / "a.xy").string() + ")"), std::string::npos) << same.err;

    // An existing output needs --force.
    const fs::path out = dir / "o";
    fs::create_directories(out);
    spit(out / "a.corrected.xy", "old\n");
    const auto exists = run_mudepth({"correct", (dir / "a.xy").string(), "--geometry", "cylinder", "--mu-r", "1",
                                     "--output-dir", out.string()});
    EXPECT_EQ(exists.status, 3);
    EXPECT_NE(exists.err.find("a.corrected.xy: exists; give --force to replace it"), std::string::npos) << exists.err;
    EXPECT_EQ(slurp(out / "a.corrected.xy"), "old\n");
    const auto forced = run_mudepth({"correct", (dir / "a.xy").string(), "--geometry", "cylinder", "--mu-r", "1",
                                     "--output-dir", out.string(), "--force"});
    EXPECT_EQ(forced.status, 0) << forced.err;
    EXPECT_NE(slurp(out / "a.corrected.xy").find("# mudepth"), std::string::npos);

    // A write that fails at the rename (a folder stands where the output goes) leaves no temporary file.
    const fs::path blocked = dir / "blocked";
    fs::create_directories(blocked / "a.corrected.xy" / "inside");
    const auto failed = run_mudepth({"correct", (dir / "a.xy").string(), "--geometry", "cylinder", "--mu-r", "1",
                                     "--output-dir", blocked.string(), "--force"});
    EXPECT_EQ(failed.status, 3);
    EXPECT_EQ(std::count(failed.err.begin(), failed.err.end(), '\n'), 1) << failed.err;
    EXPECT_EQ(files_in(blocked), 1u);

    // The output folder is a file.
    spit(dir / "plain_file", "x");
    const auto not_dir = run_mudepth({"correct", (dir / "a.xy").string(), "--geometry", "cylinder", "--mu-r", "1",
                                      "--output-dir", (dir / "plain_file").string()});
    EXPECT_EQ(not_dir.status, 3);
    EXPECT_NE(not_dir.err.find("is not a folder"), std::string::npos);
}

TEST(CliCorrect, BatchOfSixtyWithOneBadFile) {
    const fs::path dir = fresh_dir("batch");
    std::vector<std::string> args{"correct"};
    std::vector<fs::path> inputs;
    for (int i = 0; i < 60; ++i) {
        char name[32];
        std::snprintf(name, sizeof name, "scan_%02d.xy", i);
        inputs.push_back(dir / name);
        spit(inputs.back(), i == 30 ? "10 1 1\n20 2 2\n30 nan 3\n" : pattern_text(grid(5, 100, 0.5)));
        args.push_back(inputs.back().string());
    }
    std::vector<std::size_t> hashes;
    for (const auto& p : inputs) hashes.push_back(std::hash<std::string>{}(slurp(p)));
    args.insert(args.end(), {"--geometry", "cylinder", "--mu-r", "1.1", "--output-dir", (dir / "out").string()});
    const auto r = run_mudepth(args);
    EXPECT_EQ(r.status, 2);
    EXPECT_EQ(files_in(dir / "out"), 59u);
    EXPECT_FALSE(fs::exists(dir / "out" / "scan_30.corrected.xy"));
    // One line for the bad file, one summary line.
    EXPECT_EQ(std::count(r.err.begin(), r.err.end(), '\n'), 2) << r.err;
    EXPECT_NE(r.err.find("mudepth: error: " + inputs[30].string() + ":3: the intensity is NaN"), std::string::npos)
        << r.err;
    EXPECT_NE(r.err.find("1 of 60 files failed (" + inputs[30].string() + "); 59 written to"), std::string::npos)
        << r.err;
    for (std::size_t i = 0; i < inputs.size(); ++i) EXPECT_EQ(std::hash<std::string>{}(slurp(inputs[i])), hashes[i]);
    // Every written file has the same factors as a single-file run of the same scan.
    const auto single = run_mudepth({"correct", inputs[0].string(), "--geometry", "cylinder", "--mu-r", "1.1",
                                     "--output-dir", (dir / "single").string()});
    ASSERT_EQ(single.status, 0);
    EXPECT_EQ(rows_of(dir / "single" / "scan_00.corrected.xy"), rows_of(dir / "out" / "scan_59.corrected.xy"));
}

TEST(CliCorrect, ContainerSubtraction) {
    const fs::path dir = fresh_dir("empty");
    // Sample-in-container and empty scans on different grids; the empty covers the sample's range.
    spit(dir / "sc.xy", "10 1500 39\n20 1400 37\n30 1300 36\n");
    spit(dir / "e.xy", "5 400 20\n15 380 19\n25 360 19\n35 340 18\n");
    const auto r = run_mudepth({"correct", (dir / "sc.xy").string(), "--geometry", "cylinder", "--mu-r", "0.9",
                                "--mu-r-container", "0.15", "--radius-ratio", "1.08", "--empty", (dir / "e.xy").string(),
                                "--empty-scale", "0.5", "--output-dir", (dir / "out").string()});
    ASSERT_EQ(r.status, 0) << r.err;
    const auto rows = rows_of(dir / "out" / "sc.corrected.xy");
    const auto j = run_json({"cylinder", "--mu-r", "0.9", "--mu-r-container", "0.15", "--radius-ratio", "1.08",
                             "--two-theta", "10,20,30", "--json"});
    const double I_c[] = {390, 370, 350};  // the empty interpolated halfway between its points
    const double I_sc[] = {1500, 1400, 1300};
    for (int i = 0; i < 3; ++i) {
        const auto& p = j["points"][i];
        const double k = p["A_c_sc"].get<double>() / p["A_c_c"].get<double>();
        // Paalman & Pings (1962): I_s = [I_sc − s·(A_c,sc/A_c,c)·I_c] / A_s,sc.
        EXPECT_NEAR(rows[i][1], (I_sc[i] - 0.5 * k * I_c[i]) / p["A_s_sc"].get<double>(), 1e-9 * rows[i][1]);
        EXPECT_NEAR(rows[i][3], 1 / p["A_s_sc"].get<double>(), 1e-12 * rows[i][3]);
        EXPECT_NEAR(rows[i][4], 0.5 * k * I_c[i], 1e-9 * rows[i][4]);
    }
    const auto out_of_range = run_mudepth({"correct", (dir / "e.xy").string(), "--geometry", "cylinder", "--mu-r",
                                           "0.9", "--mu-r-container", "0.15", "--radius-ratio", "1.08", "--empty",
                                           (dir / "sc.xy").string(), "--output-dir", (dir / "out2").string()});
    EXPECT_EQ(out_of_range.status, 2);
    EXPECT_NE(out_of_range.err.find("e.xy:1: 2θ = 5° lies outside the empty-container scan"), std::string::npos)
        << out_of_range.err;
    EXPECT_EQ(files_in(dir / "out2"), 0u);
}

}  // namespace
}  // namespace mudepth::test
