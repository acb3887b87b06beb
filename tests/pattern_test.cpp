// Pattern files: the plain-text and pdCIF readers, their refusals, the writer
// (round trips), CIF numbers with standard uncertainties, and atomic writing.
#include <gtest/gtest.h>

#include <cmath>
#include <filesystem>
#include <fstream>
#include <sstream>
#include <stdexcept>

#include "mudepth/error.hpp"
#include "mudepth/pattern.hpp"

namespace mudepth {
namespace {

namespace fs = std::filesystem;

std::string message_of(const std::function<void()>& f) {
    try {
        f();
    } catch (const InputError& e) {
        return e.what();
    }
    return "(no InputError)";
}

fs::path fresh_dir(const std::string& tag) {
    const fs::path d = fs::path(::testing::TempDir()) / ("mudepth_pattern_" + tag);
    fs::remove_all(d);
    fs::create_directories(d);
    return d;
}

std::size_t file_count(const fs::path& dir) {
    std::size_t n = 0;
    for ([[maybe_unused]] const auto& e : fs::directory_iterator(dir)) ++n;
    return n;
}

TEST(TextPattern, WhiteSpaceHeaderCommentsBlankLinesAndCrlf) {
    const std::string text =
        "Invented test scan\r\n2theta  counts  esd\r\n# a comment\r\n\r\n10.00  100  10\r\n"
        "! another comment\r\n10.02\t121\t11\r\n10.04 144 12 # trailing note\r\n";
    const Pattern p = parse_text_pattern(text, "scan.xy");
    ASSERT_EQ(p.size(), 3u);
    EXPECT_TRUE(p.has_sigma());
    EXPECT_DOUBLE_EQ(p.two_theta_deg[1], 10.02);
    EXPECT_DOUBLE_EQ(p.intensity[2], 144);
    EXPECT_DOUBLE_EQ(p.sigma[1], 11);
    EXPECT_EQ(p.line[0], 5u);
    EXPECT_EQ(p.line[2], 8u);
    EXPECT_EQ(p.report.lines, 8u);
    EXPECT_EQ(p.report.header_lines, 2u);
    EXPECT_EQ(p.report.comment_lines, 2u);
    EXPECT_EQ(p.report.blank_lines, 1u);
    EXPECT_TRUE(p.report.crlf);
    EXPECT_EQ(p.report.separator, ' ');
    EXPECT_FALSE(p.report.decimal_comma);
    ASSERT_EQ(p.header.size(), 3u);  // the two header lines and the comment before the data
    EXPECT_EQ(p.header[0], "Invented test scan");
}

TEST(TextPattern, CommasAndTwoColumns) {
    const Pattern p = parse_text_pattern("angle,intensity\n5.5, 12\n6.5 ,13.25\n", "a.csv");
    ASSERT_EQ(p.size(), 2u);
    EXPECT_FALSE(p.has_sigma());
    EXPECT_EQ(p.report.separator, ',');
    EXPECT_DOUBLE_EQ(p.intensity[1], 13.25);
}

TEST(TextPattern, SemicolonsWithDecimalCommas) {
    const Pattern p = parse_text_pattern("2Theta;Intensity;Sigma\n10,5;1234,75;35,1\n11;1300;36\n", "de.csv");
    ASSERT_EQ(p.size(), 2u);
    EXPECT_TRUE(p.report.decimal_comma);
    EXPECT_EQ(p.report.separator, ';');
    EXPECT_DOUBLE_EQ(p.two_theta_deg[0], 10.5);
    EXPECT_DOUBLE_EQ(p.intensity[0], 1234.75);
    EXPECT_DOUBLE_EQ(p.sigma[0], 35.1);
    // Semicolons without decimal commas are reported as such.
    EXPECT_FALSE(parse_text_pattern("10.5;3\n11;4\n", "x").report.decimal_comma);
}

TEST(TextPattern, NumbersReadWithFromChars) {
    // Exponents, a leading '+', and values that need every digit (shortest round trip, C++17 from_chars).
    const Pattern p = parse_text_pattern("1e1 +2.5E3\n10.000000000000002 0.1\n", "x");
    EXPECT_EQ(p.two_theta_deg[0], 10.0);
    EXPECT_EQ(p.intensity[0], 2500.0);
    EXPECT_EQ(p.two_theta_deg[1], 10.000000000000002);
}

struct BadText {
    std::string text;
    std::string expected;  // "name:line: ..." part
};

class TextRefusal : public ::testing::TestWithParam<BadText> {};

TEST_P(TextRefusal, NamesTheLine) {
    const std::string m = message_of([&] { parse_text_pattern(GetParam().text, "bad.xy"); });
    EXPECT_NE(m.find(GetParam().expected), std::string::npos) << m;
}

INSTANTIATE_TEST_SUITE_P(
    Cases, TextRefusal,
    ::testing::Values(BadText{"10 1\n20 nan\n", "bad.xy:2: the intensity is NaN"},
                      BadText{"10 1\r\n20 2\r\ninf 3\r\n", "bad.xy:3: 2θ is infinite"},
                      BadText{"10 1 -inf\n", "bad.xy:1: σ is infinite"},
                      BadText{"10 1\n180 2\n", "bad.xy:2: 2θ = 180° is outside [0°, 180°)"},
                      BadText{"-0.5 1\n", "bad.xy:1: 2θ = -0.5° is outside"},
                      BadText{"10 1 1\n20 2\n", "bad.xy:2: 2 columns where the first data row (line 1) has 3"},
                      BadText{"10 1\n20 2 3\n", "bad.xy:2: 3 columns where the first data row (line 1) has 2"},
                      BadText{"10 1 2 3\n", "bad.xy:1: 4 columns; expected 2 or 3"},
                      BadText{"# nothing\nheader\n\n", "bad.xy:3: no data rows"},
                      BadText{"", "bad.xy:1: no data rows"},
                      BadText{"10 1\n20 2\nEND\n", "bad.xy:3: 2θ 'END' is not a number (text after the data rows?)"},
                      BadText{"10 1\n20 x\n", "bad.xy:2: intensity 'x' is not a number"},
                      BadText{"20 1\n10 2\n", "bad.xy:2: 2θ = 10° does not increase"},
                      BadText{"10 1\n10 2\n", "bad.xy:2: 2θ = 10° does not increase"},
                      BadText{"10 1 -2\n", "bad.xy:1: σ = -2 is negative"},
                      BadText{"10;1\n10,5;1,2,3\n", "bad.xy:2: intensity '1,2,3' is not a number"}));

// ---- pdCIF

const char* const kCifWithSu = R"(#\#CIF_1.1
# invented pattern for the tests
data_test_pattern
_pd_block_id 'test|pattern'
_diffrn_radiation_wavelength 1.5406
loop_
_pd_meas_2theta_scan
_pd_meas_counts_total
_pd_proc_ls_weight
 10.00 1234(35) 0.0008
 10.02 1250.5(12) 0.0008  10.04
   1.2e3(4) 0.0008
)";

TEST(CifPattern, LoopWithParenthesisedUncertainties) {
    const Pattern p = parse_cif_pattern(kCifWithSu, "t.cif");
    ASSERT_EQ(p.size(), 3u);
    EXPECT_EQ(p.report.intensity_item, "_pd_meas_counts_total");
    EXPECT_EQ(p.report.angle_item, "_pd_meas_2theta_scan");
    ASSERT_EQ(p.report.dropped_items.size(), 1u);
    EXPECT_EQ(p.report.dropped_items[0], "_pd_proc_ls_weight");
    // CIF 1.1 syntax: the s.u. in parentheses is in units of the last digit of the value (from memory).
    EXPECT_DOUBLE_EQ(p.intensity[0], 1234);
    EXPECT_NEAR(p.sigma[0], 35, 1e-12);
    EXPECT_DOUBLE_EQ(p.intensity[1], 1250.5);
    EXPECT_NEAR(p.sigma[1], 1.2, 1e-12);
    EXPECT_DOUBLE_EQ(p.intensity[2], 1200);
    EXPECT_NEAR(p.sigma[2], 400, 1e-9);  // 1.2e3(4): 0.4e3
    EXPECT_DOUBLE_EQ(p.two_theta_deg[2], 10.04);
    EXPECT_EQ(p.line[0], 10u);
    EXPECT_EQ(p.line[2], 12u);  // the row's intensity is on the next line
    EXPECT_EQ(detect_pattern_format(kCifWithSu, "no_extension"), PatternFormat::cif);
    EXPECT_EQ(detect_pattern_format("10 1\n", "x.CIF"), PatternFormat::cif);
    EXPECT_EQ(detect_pattern_format("# data_ in a comment\n10 1\n", "x.dat"), PatternFormat::text);
}

TEST(CifPattern, RangeStartIncrementCountAndStartIncrementStop) {
    const Pattern c = parse_cif_pattern(
        "data_r\n_pd_meas_2theta_range_min 5.0\n_pd_meas_2theta_range_inc 0.25\n_pd_meas_number_of_points 4\n"
        "loop_ _pd_meas_intensity_total 10 11 12 13\n",
        "r.cif");
    ASSERT_EQ(c.size(), 4u);
    EXPECT_DOUBLE_EQ(c.two_theta_deg[3], 5.75);
    EXPECT_FALSE(c.has_sigma());
    EXPECT_FALSE(c.cif_angle_column);
    const Pattern m = parse_cif_pattern(
        "data_r\n_pd_proc_2theta_range_min 20\n_pd_proc_2theta_range_max 20.3\n_pd_proc_2theta_range_inc 0.1\n"
        "loop_\n_pd_proc_intensity_total\n1(1)\n2(1)\n3(1)\n4(1)\n",
        "r.cif");
    ASSERT_EQ(m.size(), 4u);
    EXPECT_NEAR(m.two_theta_deg[3], 20.3, 1e-12);
    EXPECT_EQ(m.report.intensity_item, "_pd_proc_intensity_total");
}

struct BadCif {
    std::string text;
    std::string expected;
};

class CifRefusal : public ::testing::TestWithParam<BadCif> {};

TEST_P(CifRefusal, NamesTheLine) {
    const std::string m = message_of([&] { parse_cif_pattern(GetParam().text, "bad.cif"); });
    EXPECT_NE(m.find(GetParam().expected), std::string::npos) << m;
}

INSTANTIATE_TEST_SUITE_P(
    Cases, CifRefusal,
    ::testing::Values(
        BadCif{"data_a\n_pd_meas_2theta_range_min 5\n_pd_meas_2theta_range_inc 1\n_pd_meas_number_of_points 3\n"
               "loop_ _pd_meas_intensity_total 1 2\n",
               "bad.cif:5: the pattern loop has 2 rows but the 2θ range gives 3 points"},
        BadCif{"data_a\nloop_\n_pd_meas_2theta_scan\n_pd_meas_counts_total\n10 1\n20\n", "bad.cif:2: the loop has 3 values"},
        BadCif{"data_a\nloop_\n_pd_meas_2theta_scan\n_pd_meas_counts_total\n10 1\n20 ?\n", "bad.cif:6: intensity '?'"},
        BadCif{"data_a\nloop_\n_pd_meas_2theta_scan\n_pd_meas_counts_total\n10 1\n190 2\n", "bad.cif:6: 2θ = 190°"},
        BadCif{"data_a\nloop_\n_pd_meas_angle_2theta\n_pd_meas_intensity_total\n10 1(1.0)\n",
               "bad.cif:5: intensity '1(1.0)' is not a number with a standard uncertainty"},
        BadCif{"data_a\n_cell_length_a 5.43\n", "bad.cif:1: no powder pattern"},
        BadCif{"data_a\nloop_ _pd_meas_intensity_total 1 2\n", "the pattern loop has no 2θ item"},
        BadCif{"_cell_length_a 5\n", "no data_ block"},
        BadCif{"data_a\nloop_\n_pd_meas_2theta_scan\n_pd_meas_counts_total\n10 nan\n", "bad.cif:5: the intensity is NaN"}));

TEST(CifNumbers, ValueWithTwoDigitUncertainty) {
    EXPECT_EQ(cif_value_with_su(1234.5678, 1.234), "1234.6(12)");
    EXPECT_EQ(cif_value_with_su(1234.5678, 38.9), "1235(39)");
    EXPECT_EQ(cif_value_with_su(12345, 250), "12350(250)");
    EXPECT_EQ(cif_value_with_su(0.012341, 0.00021), "0.01234(21)");
    EXPECT_EQ(cif_value_with_su(5.0, 0.996), "5.0(10)");
    EXPECT_EQ(cif_value_with_su(2.5, 0), "2.5");
}

// ---- writing

TEST(PatternWriting, TextRoundTripKeepsEveryDouble) {
    const Pattern p = parse_text_pattern("# h\n10.02 123.456 7\n10.04 0.1 0.2\n", "x.xy");
    const std::vector<double> intensity{1.0 / 3.0, 2e-300};
    const std::vector<double> sigma{0.1 + 0.2, 1e300};
    const std::vector<PatternColumn> extra{{"correction", "_mudepth_absorption_correction", {std::sqrt(2.0), 1.5}}};
    const std::vector<std::string> prov{"made by a test, μ in 1/cm"};
    const std::string text = render_pattern(p, intensity, sigma, extra, prov);
    EXPECT_EQ(text.rfind("# made by a test, mu in 1/cm\n", 0), 0u) << text;  // ASCII provenance first
    EXPECT_NE(text.find("# > # h\n"), std::string::npos);
    // Read back: 4 columns is more than a pattern has, so split by hand.
    std::istringstream in(text);
    std::string line;
    std::vector<std::vector<double>> rows;
    while (std::getline(in, line)) {
        if (line.empty() || line[0] == '#') continue;
        std::istringstream fields(line);
        std::vector<double> row;
        std::string f;
        while (fields >> f) row.push_back(std::stod(f));
        rows.push_back(row);
    }
    ASSERT_EQ(rows.size(), 2u);
    EXPECT_EQ(rows[0][0], 10.02);
    EXPECT_EQ(rows[0][1], 1.0 / 3.0);
    EXPECT_EQ(rows[0][2], 0.1 + 0.2);
    EXPECT_EQ(rows[0][3], std::sqrt(2.0));
    EXPECT_EQ(rows[1][1], 2e-300);
    EXPECT_EQ(rows[1][2], 1e300);
}

TEST(PatternWriting, DecimalCommaFileStaysInItsFamily) {
    const Pattern p = parse_text_pattern("10,5;1\n11,5;2\n", "de.csv");
    const std::vector<double> intensity{1.25, 2.5};
    const std::string text = render_pattern(p, intensity, {}, {}, {});
    EXPECT_NE(text.find("\n10,5;1,25\n11,5;2,5\n"), std::string::npos) << text;
    const Pattern back = parse_text_pattern(text, "back.csv");
    EXPECT_DOUBLE_EQ(back.intensity[0], 1.25);
}

TEST(PatternWriting, CifCopyIsCifAgain) {
    const Pattern p = parse_cif_pattern(kCifWithSu, "t.cif");
    const std::vector<double> intensity{2468.0, 2501.0, 2400.0};
    const std::vector<double> sigma{70.0, 2.4, 800.0};
    const std::vector<PatternColumn> extra{{"correction", "_mudepth_absorption_correction", {2.0, 2.0, 2.0}}};
    const std::vector<std::string> prov{"line one"};
    const std::string text = render_pattern(p, intensity, sigma, extra, prov);
    EXPECT_EQ(text.rfind("#\\#CIF_1.1\n# line one\n", 0), 0u) << text;  // the version line stays first
    EXPECT_NE(text.find("_pd_block_id 'test|pattern'"), std::string::npos);  // the rest is kept
    EXPECT_EQ(text.find("_pd_proc_ls_weight"), std::string::npos);           // the old loop is gone
    const Pattern back = parse_cif_pattern(text, "back.cif");
    EXPECT_EQ(back.report.intensity_item, "_pd_proc_intensity_total");
    ASSERT_EQ(back.size(), 3u);
    EXPECT_EQ(back.two_theta_deg, p.two_theta_deg);
    EXPECT_DOUBLE_EQ(back.intensity[0], 2468.0);
    EXPECT_NEAR(back.sigma[1], 2.4, 1e-12);
    EXPECT_EQ(back.report.dropped_items, std::vector<std::string>{"_mudepth_absorption_correction"});
}

TEST(PatternWriting, OutputNames) {
    EXPECT_EQ(corrected_output_path("a/b/run_01.xy", "out"), fs::path("out/run_01.corrected.xy"));
    EXPECT_EQ(corrected_output_path("scan.tar.cif", "o"), fs::path("o/scan.tar.corrected.cif"));
    EXPECT_EQ(corrected_output_path("noext", "o"), fs::path("o/noext.corrected"));
}

TEST(AtomicWrite, AFailureHalfWayLeavesNothing) {
    const fs::path dir = fresh_dir("fail");
    const fs::path target = dir / "x.corrected.xy";
    EXPECT_THROW(write_file_atomically(
                     target,
                     [](std::ostream& out) {
                         out << "10 1\n20 2\n";  // half the file, then the simulated failure
                         throw FileError("simulated failure: disk full");
                     },
                     false),
                 FileError);
    EXPECT_FALSE(fs::exists(target));
    EXPECT_EQ(file_count(dir), 0u);  // no temporary file either
}

TEST(AtomicWrite, AnExistingTargetIsKeptUnlessReplacing) {
    const fs::path dir = fresh_dir("exists");
    const fs::path target = dir / "x.corrected.xy";
    write_file_atomically(target, std::string_view("old\n"), false);
    EXPECT_THROW(write_file_atomically(target, std::string_view("new\n"), false), FileError);
    std::ifstream a(target);
    std::string text((std::istreambuf_iterator<char>(a)), {});
    EXPECT_EQ(text, "old\n");
    EXPECT_EQ(file_count(dir), 1u);
    write_file_atomically(target, std::string_view("new\n"), true);
    std::ifstream b(target);
    EXPECT_EQ(std::string((std::istreambuf_iterator<char>(b)), {}), "new\n");
    EXPECT_EQ(file_count(dir), 1u);
}

TEST(AtomicWrite, ARenameThatFailsLeavesNoTemporaryFile) {
    const fs::path dir = fresh_dir("rename");
    const fs::path target = dir / "x.corrected.xy";
    fs::create_directories(target / "inside");  // a non-empty folder where the file should go
    EXPECT_THROW(write_file_atomically(target, std::string_view("data\n"), true), FileError);
    EXPECT_TRUE(fs::is_directory(target));
    EXPECT_EQ(file_count(dir), 1u);
    EXPECT_THROW(write_file_atomically(dir / "missing" / "x.xy", std::string_view("data\n"), true), FileError);
}

TEST(AtomicWrite, AnInputIsNeverAnOutput) {
    const fs::path dir = fresh_dir("same");
    const fs::path input = dir / "a.corrected.xy";
    std::ofstream(input) << "10 1\n";
    const std::vector<fs::path> inputs{dir / "a.xy", dir / "." / "a.corrected.xy"};
    try {
        check_output_path(input, inputs, true);
        FAIL() << "no error";
    } catch (const FileError& e) {
        EXPECT_NE(std::string(e.what()).find("is the input file"), std::string::npos) << e.what();
    }
    EXPECT_THROW(check_output_path(input, std::vector<fs::path>{dir / "a.xy"}, false), FileError);
    EXPECT_NO_THROW(check_output_path(input, std::vector<fs::path>{dir / "a.xy"}, true));
    EXPECT_NO_THROW(check_output_path(dir / "new.xy", inputs, false));
}

}  // namespace
}  // namespace mudepth
