// Tests of the formula parser: grammar, merging, isotopes, every error message
// with its column, outside checks of molar masses, and random input.
#include <gtest/gtest.h>

#include <random>
#include <string>

#include <xraylib/xraylib.h>

#include "mudepth/elements.hpp"
#include "mudepth/error.hpp"
#include "mudepth/formula.hpp"

using mudepth::Formula;
using mudepth::InputError;
using mudepth::parse_formula;

namespace {

double count_of(const Formula& f, const std::string& label) {
    for (const auto& p : f.parts)
        if (p.label == label) return p.count;
    return 0;
}

std::string labels(const Formula& f) {
    std::string s;
    for (const auto& p : f.parts) s += p.label + " ";
    return s;
}

std::string error_of(const std::string& text) {
    try {
        parse_formula(text);
    } catch (const InputError& e) {
        return e.what();
    }
    return "(no error)";
}

}  // namespace

TEST(Formula, SimpleCounts) {
    const auto f = parse_formula("Fe2O3");
    ASSERT_EQ(f.parts.size(), 2u);
    EXPECT_EQ(f.parts[0].label, "Fe");
    EXPECT_EQ(f.parts[0].Z, 26);
    EXPECT_EQ(f.parts[0].count, 2);
    EXPECT_EQ(f.parts[1].label, "O");
    EXPECT_EQ(f.parts[1].count, 3);
    EXPECT_EQ(f.text, "Fe2O3");
}

TEST(Formula, NestedGroupsAndOrderOfFirstAppearance) {
    const auto apatite = parse_formula("Ca5(PO4)3(OH)");
    EXPECT_EQ(labels(apatite), "Ca P O H ");
    EXPECT_EQ(count_of(apatite, "O"), 13);
    EXPECT_EQ(count_of(apatite, "H"), 1);

    const auto complex = parse_formula("[Co(NH3)6]Cl3");
    EXPECT_EQ(labels(complex), "Co N H Cl ");
    EXPECT_EQ(count_of(complex, "N"), 6);
    EXPECT_EQ(count_of(complex, "H"), 18);
    EXPECT_EQ(count_of(complex, "Cl"), 3);

    const auto acid = parse_formula("CH3COOH");  // repeated elements are merged
    EXPECT_EQ(labels(acid), "C H O ");
    EXPECT_EQ(count_of(acid, "C"), 2);
    EXPECT_EQ(count_of(acid, "H"), 4);
    EXPECT_EQ(count_of(acid, "O"), 2);

    EXPECT_EQ(count_of(parse_formula("Al2(SO4)3"), "O"), 12);
    EXPECT_EQ(count_of(parse_formula("K4[Fe(CN)6]"), "N"), 6);
}

TEST(Formula, Hydrates) {
    for (const char* text : {"CuSO4·5H2O", "CuSO4.5H2O", "CuSO4*5H2O", "CuSO4 · 5H2O", " CuSO4 .5H2O "}) {
        const auto f = parse_formula(text);
        EXPECT_EQ(labels(f), "Cu S O H ") << text;
        EXPECT_EQ(count_of(f, "O"), 9) << text;
        EXPECT_EQ(count_of(f, "H"), 10) << text;
    }
    const auto soda = parse_formula("Na2CO3.10H2O");
    EXPECT_EQ(count_of(soda, "O"), 13);
    EXPECT_EQ(count_of(soda, "H"), 20);
    for (const char* text : {"CaSO4·0.5H2O", "CaSO4.0.5H2O", "CaSO4*0.5H2O"}) {
        const auto f = parse_formula(text);
        EXPECT_DOUBLE_EQ(count_of(f, "O"), 4.5) << text;
        EXPECT_DOUBLE_EQ(count_of(f, "H"), 1.0) << text;
        EXPECT_EQ(count_of(f, "Ca"), 1) << text;
    }
    EXPECT_EQ(count_of(parse_formula("Al2(SO4)3.18H2O"), "H"), 36);
    EXPECT_EQ(count_of(parse_formula("LiOH.H2O"), "H"), 3);    // '.' after a letter
    EXPECT_EQ(count_of(parse_formula("Fe2O3.H2O"), "O"), 4);   // '.' before a letter
    EXPECT_EQ(count_of(parse_formula("CuSO4·5NH3"), "N"), 5);  // '·' and '*' take any part
    EXPECT_EQ(count_of(parse_formula("CaCl2·2H2O·2NH3"), "H"), 10);
}

TEST(Formula, DecimalCounts) {
    const auto f = parse_formula("Na0.5K0.5Cl");
    EXPECT_EQ(labels(f), "Na K Cl ");
    EXPECT_DOUBLE_EQ(count_of(f, "Na"), 0.5);
    EXPECT_DOUBLE_EQ(count_of(f, "K"), 0.5);
    EXPECT_DOUBLE_EQ(count_of(f, "Cl"), 1.0);
    const auto lsm = parse_formula("La0.7Sr0.3MnO3");
    EXPECT_DOUBLE_EQ(count_of(lsm, "Sr"), 0.3);
    // A '.' between digits is a decimal point unless a water part follows.
    EXPECT_DOUBLE_EQ(count_of(parse_formula("Li1.2Mn0.54Ni0.13Co0.13O2"), "Li"), 1.2);
    EXPECT_DOUBLE_EQ(count_of(parse_formula("Fe2.25O3"), "Fe"), 2.25);
    EXPECT_DOUBLE_EQ(count_of(parse_formula("(Fe0.5Mg0.5)2SiO4"), "Fe"), 1.0);
}

TEST(Formula, HydrogenIsotopes) {
    const auto heavy = parse_formula("D2O");
    ASSERT_EQ(heavy.parts.size(), 2u);
    EXPECT_EQ(heavy.parts[0].label, "D");
    EXPECT_EQ(heavy.parts[0].Z, 1);
    // AME2016 atomic mass of 2H, 2.01410177812 u (from memory); O from the element table.
    EXPECT_NEAR(heavy.parts[0].molar_mass_g_mol, 2.01410177812, 1e-10);
    // D2O molar mass 20.0276 g/mol (handbook value, from memory).
    EXPECT_NEAR(heavy.molar_mass_g_mol(), 20.028, 0.002);

    const auto hdo = parse_formula("HDO");  // H and D stay separate
    EXPECT_EQ(labels(hdo), "H D O ");
    const auto tritiated = parse_formula("T2O");
    // AME2016 atomic mass of 3H, 3.0160492779 u (from memory).
    EXPECT_NEAR(tritiated.parts[0].molar_mass_g_mol, 3.0160492779, 1e-9);
    // Two-letter symbols starting with D or T are read whole.
    EXPECT_EQ(parse_formula("Dy2O3").parts[0].Z, 66);
    EXPECT_EQ(parse_formula("TiO2").parts[0].Z, 22);
    EXPECT_EQ(parse_formula("Cf").parts[0].Z, 98);
}

TEST(Formula, CountsAndMolarMassAgreeWithXraylib) {
    // xraylib 4.0.0 CompoundParser: its nAtoms must equal our counts exactly; its
    // molarMass uses xraylib's atomic weights, rounded to 0.01 g/mol (H 1.01,
    // Ti 47.90), so molar masses agree only to 3e-3 relative.
    const std::pair<const char*, const char*> cases[] = {
        {"Fe2O3", "Fe2O3"},           {"Ca5(PO4)3(OH)", "Ca5(PO4)3(OH)"},
        {"CuSO4·5H2O", "CuSO4(H2O)5"}, {"Na0.5K0.5Cl", "Na0.5K0.5Cl"},
        {"C22H10N2O5", "C22H10N2O5"},  {"LaB6", "LaB6"},
        {"[Co(NH3)6]Cl3", "Co(NH3)6Cl3"}, {"PbZr0.52Ti0.48O3", "PbZr0.52Ti0.48O3"},
        {"Na2CO3.10H2O", "Na2CO3(H2O)10"}, {"CaSO4.0.5H2O", "CaSO4(H2O)0.5"},
    };
    for (const auto& [ours, theirs] : cases) {
        compoundData* cd = CompoundParser(theirs, nullptr);
        ASSERT_NE(cd, nullptr) << theirs;
        const Formula f = parse_formula(ours);
        ASSERT_EQ(static_cast<int>(f.parts.size()), cd->nElements) << ours;
        for (int k = 0; k < cd->nElements; ++k) {
            const std::string symbol(mudepth::element(cd->Elements[k]).symbol);
            EXPECT_NEAR(count_of(f, symbol), cd->nAtoms[k], 1e-12) << ours << " " << symbol;
        }
        EXPECT_NEAR(f.molar_mass_g_mol() / cd->molarMass, 1.0, 3e-3) << ours;
        FreeCompoundData(cd);
    }
}

TEST(Formula, ErrorsPointAtTheColumn) {
    EXPECT_EQ(error_of("Fe2O3)"), "formula 'Fe2O3)': unmatched ')' at column 6");
    EXPECT_EQ(error_of("(Fe2O3"), "formula '(Fe2O3': unmatched '(' at column 1");
    EXPECT_EQ(error_of("Xx2"), "formula 'Xx2': unknown element 'Xx' at column 1");
    EXPECT_EQ(error_of("Fe0O"), "formula 'Fe0O': zero count at column 3");
    EXPECT_EQ(error_of("Fe0.0O"), "formula 'Fe0.0O': zero count at column 3");
    EXPECT_EQ(error_of("fe2o3"),
              "formula 'fe2o3': element symbols start with a capital letter: 'fe' at column 1 "
              "(did you mean 'Fe'?)");
    EXPECT_EQ(error_of("Fe2o3"),
              "formula 'Fe2o3': element symbols start with a capital letter: 'o' at column 4 "
              "(did you mean 'O'?)");
    EXPECT_EQ(error_of(""), "empty formula");
    EXPECT_EQ(error_of("  \t "), "empty formula");
    EXPECT_EQ(error_of("(Fe]"), "formula '(Fe]': mismatched brackets: '(' at column 1 is closed by ']' at column 4");
    EXPECT_EQ(error_of("[Fe)"), "formula '[Fe)': mismatched brackets: '[' at column 1 is closed by ')' at column 4");
    EXPECT_EQ(error_of("Fe()"), "formula 'Fe()': empty brackets '()' at column 3");
    EXPECT_EQ(error_of("2H2O"), "formula '2H2O': count '2' has no element before it at column 1");
    EXPECT_EQ(error_of("Fe2(3)"), "formula 'Fe2(3)': count '3' has no element before it at column 5");
    EXPECT_EQ(error_of("H2O·5"), "formula 'H2O·5': count '5' has no element after it at column 5");
    EXPECT_EQ(error_of("Fe1000001"), "formula 'Fe1000001': count 1000001 is too large (at most 1000000) at column 3");
    EXPECT_EQ(error_of("Fe123456789012345678901"),
              "formula 'Fe123456789012345678901': count is too long (21 characters) at column 3");
    EXPECT_EQ(error_of("((H1000)1000)1000"),
              "formula '((H1000)1000)1000': the count of 'H' reaches 1e+09, more than 1000000 atoms per "
              "formula unit at column 13");
    // Columns count characters, not bytes: '·' is two bytes and one column.
    EXPECT_EQ(error_of("CuSO4·Xx"), "formula 'CuSO4·Xx': unknown element 'Xx' at column 7");
    EXPECT_EQ(error_of("Fe.5O"),
              "formula 'Fe.5O': ambiguous '.': write a decimal count with a leading digit (Fe0.95O) or a "
              "hydrate with '·' or '*' (CuSO4·5NH3) at column 3");
    EXPECT_EQ(error_of("Fe2.5.5O"), "formula 'Fe2.5.5O': a second decimal point in a count at column 6");
    EXPECT_EQ(error_of("H2O."), "formula 'H2O.': nothing after the hydrate separator '.' at column 4");
    EXPECT_EQ(error_of("H2O..H2O"), "formula 'H2O..H2O': empty hydrate part after '.' at column 4");
    EXPECT_EQ(error_of(".H2O"), "formula '.H2O': hydrate separator '.' with nothing before it at column 1");
    EXPECT_EQ(error_of("(CuSO4·5H2O)"), "formula '(CuSO4·5H2O)': hydrate separator '·' inside brackets at column 7");
    EXPECT_EQ(error_of("Fe2 O3"),
              "formula 'Fe2 O3': unexpected space (spaces are allowed only around a hydrate separator) at column 4");
    EXPECT_EQ(error_of("H₂O"), "formula 'H₂O': subscript digit '₂' (write counts as plain digits: H2O) at column 2");
    EXPECT_EQ(error_of("Fe\xff"), "formula 'Fe\\xFF': invalid UTF-8 byte 0xFF at column 3");
    EXPECT_EQ(error_of("Fe#"), "formula 'Fe#': unexpected character '#' at column 3");
    EXPECT_EQ(error_of("Uuo"), "formula 'Uuo': unknown element 'Uu' at column 1");
    EXPECT_EQ(error_of("Es"), "formula 'Es': unknown element 'Es' at column 1");  // Z = 99, beyond the data
}

TEST(Formula, NestingDepthIsLimited) {
    const std::string ok = std::string(64, '(') + "H" + std::string(64, ')');
    EXPECT_EQ(count_of(parse_formula(ok), "H"), 1);
    const std::string deep = std::string(65, '(') + "H" + std::string(65, ')');
    EXPECT_EQ(error_of(deep).substr(error_of(deep).find("': ") + 3), "brackets nested deeper than 64 at column 65");
    // Very deep input is refused without recursion.
    EXPECT_THROW(parse_formula(std::string(100000, '(')), InputError);
    EXPECT_THROW(parse_formula(std::string(3000, '(') + "H"), InputError);
}

TEST(Formula, LongInputIsShortenedInMessages) {
    const std::string text = std::string(500, 'H') + ")";
    const std::string msg = error_of(text);
    EXPECT_NE(msg.find("...': unmatched ')' at column 501"), std::string::npos) << msg;
    EXPECT_LT(msg.size(), 200u);
}

TEST(Formula, RandomInputNeverCrashes) {
    // Any byte sequence gives a formula or an InputError (run under the sanitizer build too).
    std::mt19937 rng(12345);
    const std::string alphabet = "HOFeCNaClKDT()[]..*0123456789 xb\xc2\xb7\xff";
    for (int i = 0; i < 20000; ++i) {
        std::string s(rng() % 24, ' ');
        for (auto& c : s) c = alphabet[rng() % alphabet.size()];
        try {
            const auto f = parse_formula(s);
            for (const auto& p : f.parts) {
                EXPECT_GT(p.count, 0) << s;
                EXPECT_LE(p.count, 1e6) << s;
            }
        } catch (const InputError&) {
        }
    }
    for (int i = 0; i < 5000; ++i) {
        std::string s(rng() % 16, ' ');
        for (auto& c : s) c = static_cast<char>(rng() % 256);
        try {
            parse_formula(s);
        } catch (const InputError&) {
        }
    }
}
