// The film stack syntax of `mudepth film`: --layer FORMULA_OR_MATERIAL,THICKNESS[,DENSITY]
// and --substrate FORMULA_OR_MATERIAL[,DENSITY]. Callable on its own so the
// tests and fuzzers can reach it.
#pragma once

#include <string>

#include "mudepth/material.hpp"

namespace mudepth::cli {

/// One --layer: its material (packing 1) and thickness.
struct FilmLayerSpec {
    Material material;
    double thickness_cm = 0;
};

/// Parses a --layer value; throws InputError naming the option and the value.
FilmLayerSpec parse_film_layer(const std::string& spec);

/// Parses a --substrate value; throws InputError naming the option and the value.
Material parse_film_substrate(const std::string& spec);

}  // namespace mudepth::cli
