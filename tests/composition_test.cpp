// Tests of the composition library: every file in compositions/, lookup by
// name, by path and on MUDEPTH_COMPOSITION_PATH, and bad files' messages.
#include <gtest/gtest.h>

#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <set>
#include <string>
#include <unistd.h>

#include "mudepth/composition.hpp"
#include "mudepth/error.hpp"

using namespace mudepth;
namespace fs = std::filesystem;

namespace {

const fs::path kLibraryDir = fs::path(MUDEPTH_SOURCE_DIR) / "compositions";

double share_of(const Material& m, const std::string& label) {
    for (const auto& e : m.elements)
        if (e.label == label) return e.weight_fraction;
    return 0;
}

// A scratch directory of its own per test, removed afterwards.
class CompositionFiles : public ::testing::Test {
protected:
    void SetUp() override {
        dir_ = fs::temp_directory_path() /
               ("mudepth-composition-test-" + std::to_string(::getpid()) + "-" +
                ::testing::UnitTest::GetInstance()->current_test_info()->name());
        fs::create_directories(dir_);
    }
    void TearDown() override {
        ::unsetenv("MUDEPTH_COMPOSITION_PATH");
        std::error_code ec;
        fs::remove_all(dir_, ec);
    }
    fs::path write(const std::string& file, const std::string& text) {
        const fs::path p = dir_ / file;
        std::ofstream(p) << text;
        return p;
    }
    std::string error_of(const fs::path& p) {
        try {
            load_composition_file(p);
        } catch (const Error& e) {
            return e.what();
        }
        return "(no error)";
    }
    fs::path dir_;
};

}  // namespace

TEST(Composition, EveryLibraryFileLoads) {
    std::set<std::string> stems;
    for (const auto& entry : fs::directory_iterator(kLibraryDir)) {
        if (entry.path().extension() != ".toml") continue;
        const std::string stem = entry.path().stem().string();
        stems.insert(stem);
        SCOPED_TRACE(stem);
        const Composition c = load_composition_file(entry.path());
        EXPECT_EQ(c.name, stem);
        EXPECT_FALSE(c.title.empty());
        EXPECT_FALSE(c.material.density_source.empty());
        EXPECT_GT(c.material.solid_density_g_cm3, 1e-5);
        EXPECT_LT(c.material.solid_density_g_cm3, 25.0);
        EXPECT_GT(c.typical_packing, 0);
        EXPECT_LE(c.typical_packing, 1);
        EXPECT_DOUBLE_EQ(c.material.packing_fraction, 1.0);
        double sum = 0;
        for (const auto& e : c.material.elements) {
            EXPECT_GT(e.weight_fraction, 0);
            sum += e.weight_fraction;
        }
        EXPECT_NEAR(sum, 1.0, 1e-12);

        // The same material, built in, by its name.
        const Composition b = find_composition(stem);
        EXPECT_EQ(b.name, stem);
        EXPECT_EQ(b.origin, "built-in");
        EXPECT_DOUBLE_EQ(b.material.solid_density_g_cm3, c.material.solid_density_g_cm3);
        EXPECT_EQ(b.material.elements.size(), c.material.elements.size());
    }
    const auto names = builtin_composition_names();
    EXPECT_EQ(std::set<std::string>(names.begin(), names.end()), stems);
}

TEST(Composition, TheLibraryHasTheMaterialsPractitionersNeed) {
    const auto names = builtin_composition_names();
    const std::set<std::string> have(names.begin(), names.end());
    for (const char* n : {"si", "lab6", "ceo2", "corundum", "zno", "rutile", "anatase", "quartz", "calcite",
                          "nacl", "diamond", "fused-silica", "borosilicate-3.3", "lithium-borate-glass",
                          "polyimide", "pet", "pmma", "soda-lime-glass", "beryllium", "air", "helium"})
        EXPECT_TRUE(have.count(n)) << n;
}

TEST(Composition, LibraryValues) {
    // Si from its cell, a = 5.431020511 A, Z = 8: 2.329 g/cm3 (handbook value, from memory).
    EXPECT_NEAR(find_composition("si").material.solid_density_g_cm3, 2.329, 0.0005);
    // Corundum 3.987 g/cm3 (handbook value, from memory).
    EXPECT_NEAR(find_composition("corundum").material.solid_density_g_cm3, 3.987, 0.002);
    // Dry air: ideal gas at 20 C, 1 atm, M = 28.9647 g/mol (closed form) and the
    // NIST weight fractions of dry air (from memory).
    const Composition air = find_composition("air");
    EXPECT_NEAR(air.material.solid_density_g_cm3, 101325 * 28.9647e-3 / (8.314462618 * 293.15) * 1e-3, 1e-7);
    EXPECT_NEAR(share_of(air.material, "N"), 0.755268, 1e-6);
    EXPECT_NEAR(share_of(air.material, "Ar"), 0.012827, 1e-6);
    // Borosilicate 3.3: the glass density is the measured one, not the oxides'.
    const Composition boro = find_composition("borosilicate-3.3");
    EXPECT_DOUBLE_EQ(boro.material.solid_density_g_cm3, 2.23);
    EXPECT_GT(share_of(boro.material, "B"), 0.03);
    // Case does not matter for built-in names.
    EXPECT_EQ(find_composition("LaB6").name, "lab6");
}

TEST(Composition, UnknownNameSuggestsTheClosest) {
    try {
        find_composition("quartzz");
        FAIL() << "no error";
    } catch (const InputError& e) {
        const std::string msg = e.what();
        EXPECT_EQ(msg.rfind("unknown material 'quartzz'; did you mean 'quartz'? (built-in: air, ", 0), 0u) << msg;
        EXPECT_NE(msg.find("; or give the path of a .toml file)"), std::string::npos) << msg;
    }
    try {
        find_composition("unobtainium");
        FAIL() << "no error";
    } catch (const InputError& e) {
        EXPECT_EQ(std::string(e.what()).rfind("unknown material 'unobtainium' (built-in: ", 0), 0u) << e.what();
    }
}

TEST_F(CompositionFiles, UserFilesByPathAndSearchPath) {
    const fs::path p = write("mysample.toml",
                             "title = \"My sample\"\nformula = \"Fe2O3\"\ndensity_g_cm3 = 5.25\n"
                             "density_source = \"pycnometer\"\ntypical_packing = 0.4\n");
    const Composition c = find_composition(p.string());
    EXPECT_EQ(c.name, "mysample");
    EXPECT_EQ(c.origin, p.string());
    EXPECT_DOUBLE_EQ(c.material.solid_density_g_cm3, 5.25);
    EXPECT_DOUBLE_EQ(c.typical_packing, 0.4);

    write("si.toml", "title = \"My silicon\"\nformula = \"Si\"\ndensity_g_cm3 = 2.0\n"
                     "density_source = \"mine\"\n");
    const std::string path = "/nonexistent-dir::" + dir_.string();
    ::setenv("MUDEPTH_COMPOSITION_PATH", path.c_str(), 1);
    EXPECT_EQ(find_composition("mysample").title, "My sample");
    EXPECT_DOUBLE_EQ(find_composition("si").material.solid_density_g_cm3, 2.0);  // the user's file first
    try {
        find_composition("mysampel");
        FAIL() << "no error";
    } catch (const InputError& e) {
        EXPECT_NE(std::string(e.what()).find("did you mean 'mysample'?"), std::string::npos) << e.what();
    }
}

TEST_F(CompositionFiles, MixtureOfNamedMaterialsByVolume) {
    const fs::path p = write("diluted.toml",
                             "title = \"Si diluted with glass\"\ndensity_source = \"phases\"\n"
                             "[[phases]]\nmaterial = \"si\"\nvolume_fraction = 0.25\n"
                             "[[phases]]\nmaterial = \"fused-silica\"\nvolume_fraction = 0.75\n");
    const Composition c = load_composition_file(p);
    // closed form: sum v_i rho_i with the library's densities
    const double rho_si = find_composition("si").material.solid_density_g_cm3;
    EXPECT_NEAR(c.material.solid_density_g_cm3, 0.25 * rho_si + 0.75 * 2.20, 1e-12);
    EXPECT_NEAR(share_of(c.material, "Si") + share_of(c.material, "O"), 1.0, 1e-12);
}

TEST_F(CompositionFiles, FileErrorsNameThePathAndReason) {
    const fs::path missing = dir_ / "nope.toml";
    try {
        load_composition_file(missing);
        FAIL() << "no error";
    } catch (const FileError& e) {
        EXPECT_EQ(std::string(e.what()),
                  "cannot read composition file '" + missing.string() + "': No such file or directory");
    }
    EXPECT_THROW(find_composition(missing.string()), FileError);
    EXPECT_THROW(load_composition_file(dir_), FileError);
}

TEST_F(CompositionFiles, BadFilesSayWhereAndWhat) {
    const std::string good_head = "title = \"x\"\nformula = \"SiO2\"\n";
    auto p = write("typo.toml", good_head + "densty_g_cm3 = 2.2\ndensity_source = \"x\"\n");
    EXPECT_EQ(error_of(p), p.string() +
                               ":3:1: unknown key 'densty_g_cm3' (allowed: title, formula, phases, "
                               "density_g_cm3, density_source, typical_packing, cell_lengths_A, "
                               "cell_angles_deg, formula_units_per_cell, notes)");
    p = write("nodensity.toml", good_head + "density_source = \"x\"\n");
    EXPECT_EQ(error_of(p), p.string() +
                               ": missing 'density_g_cm3' (or the cell: cell_lengths_A, cell_angles_deg, "
                               "formula_units_per_cell)");
    p = write("badformula.toml", "title = \"x\"\nformula = \"Fe2O3)\"\ndensity_g_cm3 = 5\ndensity_source = \"x\"\n");
    EXPECT_EQ(error_of(p), p.string() + ":2:11: formula 'Fe2O3)': unmatched ')' at column 6");
    p = write("nosource.toml", good_head + "density_g_cm3 = 2.2\n");
    EXPECT_EQ(error_of(p), p.string() + ": missing 'density_source'");
    p = write("badpacking.toml", good_head + "density_g_cm3 = 2.2\ndensity_source = \"x\"\ntypical_packing = 1.5\n");
    EXPECT_EQ(error_of(p), p.string() + ":5:19: typical_packing: packing fraction 1.5 is outside (0, 1]");
    p = write("baddensity.toml", good_head + "density_g_cm3 = \"2.2\"\ndensity_source = \"x\"\n");
    EXPECT_EQ(error_of(p), p.string() + ":3:17: 'density_g_cm3' must be a number");
    p = write("syntax.toml", "title = \"x\nformula = \"SiO2\"\n");
    EXPECT_EQ(error_of(p).rfind(p.string() + ":1:", 0), 0u) << error_of(p);
    p = write("phasekey.toml", "title = \"x\"\ndensity_source = \"x\"\n[[phases]]\nformula = \"SiO2\"\n"
                               "density_g_cm3 = 2.2\nweight_fractoin = 1\n");
    EXPECT_EQ(error_of(p).rfind(p.string() + ":6:1: unknown key 'weight_fractoin' in [[phases]] (allowed: ", 0), 0u)
        << error_of(p);
    p = write("mixedbasis.toml", "title = \"x\"\ndensity_source = \"x\"\n"
                                 "[[phases]]\nformula = \"SiO2\"\ndensity_g_cm3 = 2.2\nweight_fraction = 0.5\n"
                                 "[[phases]]\nformula = \"Si\"\ndensity_g_cm3 = 2.3\nvolume_fraction = 0.5\n");
    EXPECT_NE(error_of(p).find("all phases must use the same kind of fraction"), std::string::npos) << error_of(p);
    p = write("both.toml", good_head + "density_g_cm3 = 2.2\ncell_lengths_A = [1, 1, 1]\ndensity_source = \"x\"\n");
    EXPECT_NE(error_of(p).find(":3:17: give either 'density_g_cm3' or the cell"), std::string::npos) << error_of(p);
    p = write("badcell.toml", "title = \"x\"\nformula = \"Si\"\ncell_lengths_A = [5, 5]\n"
                              "cell_angles_deg = [90, 90, 90]\nformula_units_per_cell = 8\ndensity_source = \"x\"\n");
    EXPECT_EQ(error_of(p), p.string() + ":3:18: 'cell_lengths_A' must be an array of 3 numbers");
    p = write("unknownref.toml", "title = \"x\"\ndensity_source = \"x\"\n[[phases]]\nmaterial = \"quartzz\"\n"
                                 "weight_fraction = 1\n");
    EXPECT_NE(error_of(p).find(":4:12: unknown material 'quartzz'; did you mean 'quartz'?"), std::string::npos)
        << error_of(p);
}

TEST_F(CompositionFiles, ReferenceCyclesAreCaught) {
    write("a.toml", "title = \"a\"\ndensity_source = \"x\"\n[[phases]]\nmaterial = \"b.toml\"\nweight_fraction = 1\n");
    write("b.toml", "title = \"b\"\ndensity_source = \"x\"\n[[phases]]\nmaterial = \"a.toml\"\nweight_fraction = 1\n");
    const std::string msg = error_of(dir_ / "a.toml");
    EXPECT_NE(msg.find("levels deep (is there a cycle?)"), std::string::npos) << msg;
}

TEST(Composition, ParseFromText) {
    const Composition c = parse_composition(
        "title = \"t\"\nformula = \"NaCl\"\ndensity_g_cm3 = 2.165\ndensity_source = \"s\"\n", "salt", "notes/salt.toml");
    EXPECT_EQ(c.name, "salt");
    EXPECT_EQ(c.material.name, "salt");
    EXPECT_EQ(c.material.density_source, "s");
    EXPECT_THROW(parse_composition("title = 1\n", "x", "x.toml"), InputError);
}
