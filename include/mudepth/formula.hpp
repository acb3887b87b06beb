// Chemical formulas in the trade's notation: Fe2O3, Ca5(PO4)3(OH), CuSO4·5H2O,
// Na0.5K0.5Cl, [Co(NH3)6]Cl3, D2O. Errors point at the column of the input.
#pragma once

#include <string>
#include <string_view>
#include <vector>

namespace mudepth {

/// One element of a formula with its total count (atoms per formula unit).
struct FormulaPart {
    int Z;                    ///< atomic number (D and T are Z = 1)
    std::string label;        ///< "Fe"; "D" or "T" for the hydrogen isotopes
    double count;             ///< atoms per formula unit, > 0
    double molar_mass_g_mol;  ///< the mass of this label (D and T use their isotope mass)
};

struct Formula {
    std::string text;                ///< the formula as given
    std::vector<FormulaPart> parts;  ///< one entry per label, in order of first appearance
    /// Mass of one formula unit, g/mol.
    double molar_mass_g_mol() const;
};

/// Parses a formula. Grammar: element symbols Z = 1..98 plus D and T, integer or
/// decimal counts, nested ( ) and [ ], hydrate parts after '.' or '·' (U+00B7)
/// or '*' with an optional leading count. A '.' between digits is a decimal
/// point unless a water part follows (CuSO4.5H2O); spaces are allowed only at
/// the ends and around a hydrate separator (full rules: docs/compositions.md).
/// Throws InputError whose message names the formula and the 1-based column in
/// characters, e.g. "formula 'Fe2O3)': unmatched ')' at column 6".
Formula parse_formula(std::string_view text);

}  // namespace mudepth
