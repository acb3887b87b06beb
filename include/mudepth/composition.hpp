// The library of compositions: one human-readable TOML file per material in
// compositions/, built into the program and loadable by name, or a user's own
// file loaded by path or found on MUDEPTH_COMPOSITION_PATH.
#pragma once

#include <filesystem>
#include <string>
#include <string_view>
#include <vector>

#include "mudepth/material.hpp"

namespace mudepth {

struct Composition {
    std::string name;            ///< file stem, e.g. "fused-silica"
    std::string title;           ///< human description
    Material material;           ///< composition and density (packing 1)
    double typical_packing = 1;  ///< the packing fraction usually reached for this material
    std::string origin;          ///< "built-in" or the file path it was read from
};

/// Parses the text of a composition file; `origin` names it in error messages.
/// Throws InputError with the line and what is wrong.
Composition parse_composition(std::string_view text, std::string_view name, std::string origin);

/// Reads a composition file; FileError if unreadable, InputError if malformed.
Composition load_composition_file(const std::filesystem::path& path);

/// A composition by name (directories on MUDEPTH_COMPOSITION_PATH first, then
/// the built-in library, whose names also match case-insensitively) or by path
/// (anything containing '/' or ending ".toml"). Throws InputError "unknown
/// material 'x'; did you mean 'y'?" with the built-in names; FileError if a
/// file cannot be read. File format: docs/compositions.md.
Composition find_composition(std::string_view name_or_path);

/// Names of the built-in compositions, sorted.
std::vector<std::string> builtin_composition_names();

}  // namespace mudepth
