// What each fuzz target does with one input, shared by the libFuzzer targets
// (tests/fuzz/fuzz_*.cpp) and the regression test that replays the saved
// crashing inputs (tests/regression_test.cpp). An input is either refused with
// mudepth::InputError / FileError or gives a value that meets its contract;
// any other exception, a contract violation (ContractViolation) or a sanitizer
// report is a bug.
#pragma once

#include <cmath>
#include <cstddef>
#include <cstdint>
#include <stdexcept>
#include <string>
#include <string_view>
#include <vector>

#include "cli/common.hpp"
#include "cli/film_layers.hpp"
#include "mudepth/composition.hpp"
#include "mudepth/error.hpp"
#include "mudepth/formula.hpp"
#include "mudepth/material.hpp"
#include "mudepth/pattern.hpp"
#include "mudepth/radiation.hpp"

namespace mudepth::fuzz {

/// A value came back that breaks the function's documented contract.
struct ContractViolation : std::logic_error {
    using std::logic_error::logic_error;
};

inline void require(bool ok, const char* what) {
    if (!ok) throw ContractViolation(what);
}

/// Runs f; a refusal with mudepth's own error types is a good outcome.
template <class F>
void refused_or_valid(F&& f) {
    try {
        f();
    } catch (const InputError& e) {
        require(std::string_view(e.what()).size() > 0, "empty InputError message");
    } catch (const FileError& e) {
        require(std::string_view(e.what()).size() > 0, "empty FileError message");
    }
}

inline void check_material(const Material& m) {
    require(!m.elements.empty(), "material without elements");
    double sum = 0;
    for (const auto& e : m.elements) {
        require(e.Z >= 1 && e.Z <= 98, "element Z outside 1..98");
        require(std::isfinite(e.weight_fraction) && e.weight_fraction >= 0 && e.weight_fraction <= 1 + 1e-12,
                "weight fraction outside [0, 1]");
        require(std::isfinite(e.molar_mass_g_mol) && e.molar_mass_g_mol > 0, "bad molar mass");
        sum += e.weight_fraction;
    }
    require(std::abs(sum - 1) < 1e-9, "weight fractions do not sum to 1");
    require(std::isfinite(m.solid_density_g_cm3) && m.solid_density_g_cm3 >= kMinDensity_g_cm3 &&
                m.solid_density_g_cm3 <= kMaxDensity_g_cm3,
            "solid density outside the accepted range");
    require(m.packing_fraction > 0 && m.packing_fraction <= 1, "packing fraction outside (0, 1]");
}

/// The formula parser: the whole input is the formula text.
inline void formula_one(std::string_view text) {
    refused_or_valid([&] {
        const Formula f = parse_formula(text);
        require(!f.parts.empty(), "formula without parts");
        for (const auto& p : f.parts) {
            require(p.Z >= 1 && p.Z <= 98, "formula Z outside 1..98");
            require(std::isfinite(p.count) && p.count > 0, "formula count not finite and > 0");
        }
        const double M = f.molar_mass_g_mol();
        require(std::isfinite(M) && M > 0, "molar mass not finite and > 0");
    });
}

/// The composition-file reader: the whole input is the file text.
inline void composition_one(std::string_view text) {
    refused_or_valid([&] {
        const Composition c = parse_composition(text, "fuzz-input", "fuzz-input.toml");
        check_material(c.material);
        require(c.typical_packing > 0 && c.typical_packing <= 1, "typical packing outside (0, 1]");
        require(!c.title.empty(), "empty title");
    });
}

/// Splits at '\n' (the option parsers get one field each).
inline std::vector<std::string> lines(std::string_view text) {
    std::vector<std::string> out;
    std::size_t start = 0;
    while (true) {
        const auto nl = text.find('\n', start);
        out.emplace_back(text.substr(start, nl == std::string_view::npos ? std::string_view::npos : nl - start));
        if (nl == std::string_view::npos) break;
        start = nl + 1;
    }
    return out;
}

/// Option values: the first byte chooses the parser, the rest is the value
/// (for the sample options, one field per line).
inline void options_one(std::string_view input) {
    if (input.empty()) return;
    const auto kind = static_cast<unsigned char>(input.front()) % 9;
    const std::string text(input.substr(1));
    refused_or_valid([&] {
        using namespace mudepth::cli;
        switch (kind) {
            case 0: {
                const double v = parse_number("--x", text);
                require(std::isfinite(v), "parse_number gave a non-finite value");
                break;
            }
            case 1: {
                const double v = parse_length_cm("--thickness", text);
                require(std::isfinite(v) && v >= kMinLength_cm && v <= kMaxLength_cm,
                        "length outside the accepted range");
                break;
            }
            case 2: {
                const auto a = parse_angles_deg("--two-theta", text);
                require(!a.empty() && a.size() <= kMaxAnglePoints, "angle count outside 1..limit");
                for (std::size_t i = 0; i < a.size(); ++i) {
                    require(std::isfinite(a[i]), "non-finite angle");
                    if (text.find(':') != std::string::npos && i > 0)
                        require(a[i] >= a[i - 1], "range not increasing");
                }
                break;
            }
            case 3: require(parse_count("--steps", text) > 0, "count zero"); break;
            case 4:
            case 5:
            case 6: {
                RadiationOptions o;
                (kind == 4 ? o.energy : kind == 5 ? o.wavelength : o.source) = text;
                const Radiation r = build_radiation(o);
                require(std::isfinite(r.energy_keV) && r.energy_keV >= kMinEnergy_keV &&
                            r.energy_keV <= kMaxEnergy_keV,
                        "energy outside 1..500 keV");
                require(!r.label.empty(), "radiation without label");
                break;
            }
            default: {
                // Sample options: formula, material, density, packing, bulk density,
                // cell, formula units, then one --phase per line (kind 8: volume basis).
                const auto f = lines(text);
                SampleOptions o;
                std::string* fields[] = {&o.formula, &o.material, &o.density, &o.packing,
                                         &o.bulk_density, &o.cell, &o.formula_units};
                for (std::size_t i = 0; i < f.size(); ++i) {
                    if (i < std::size(fields)) *fields[i] = f[i];
                    else if (!f[i].empty()) o.phases.push_back(f[i]);
                }
                o.phase_basis = kind == 8 ? "volume" : "weight";
                check_material(build_material(o));
                break;
            }
        }
    });
}

/// The film stack syntax: the first byte chooses --layer or --substrate.
inline void film_layers_one(std::string_view input) {
    if (input.empty()) return;
    const bool substrate = static_cast<unsigned char>(input.front()) % 2 == 1;
    const std::string text(input.substr(1));
    refused_or_valid([&] {
        if (substrate) {
            check_material(cli::parse_film_substrate(text));
        } else {
            const auto layer = cli::parse_film_layer(text);
            check_material(layer.material);
            require(std::isfinite(layer.thickness_cm) && layer.thickness_cm >= cli::kMinLength_cm &&
                        layer.thickness_cm <= cli::kMaxLength_cm,
                    "layer thickness outside the accepted range");
        }
    });
}

/// The pattern readers: the first byte chooses plain text (even) or pdCIF (odd),
/// the rest is the file. A pattern read is re-read from its rendered copy.
inline void pattern_one(std::string_view input) {
    if (input.empty()) return;
    const bool cif = static_cast<unsigned char>(input.front()) % 2 == 1;
    const std::string_view text = input.substr(1);
    refused_or_valid([&] {
        const Pattern p = cif ? parse_cif_pattern(text, "fuzz.cif") : parse_text_pattern(text, "fuzz.xy");
        require(p.size() > 0 && p.size() <= kMaxPatternPoints, "point count outside 1..limit");
        require(p.intensity.size() == p.size() && p.line.size() == p.size(), "column lengths differ");
        require(p.sigma.empty() || p.sigma.size() == p.size(), "sigma column length differs");
        for (std::size_t i = 0; i < p.size(); ++i) {
            require(std::isfinite(p.two_theta_deg[i]) && p.two_theta_deg[i] >= 0 && p.two_theta_deg[i] < 180,
                    "2theta outside [0, 180)");
            if (i > 0) require(p.two_theta_deg[i] > p.two_theta_deg[i - 1], "2theta not increasing");
            require(std::isfinite(p.intensity[i]), "intensity not finite");
            if (p.has_sigma()) require(std::isfinite(p.sigma[i]) && p.sigma[i] >= 0, "sigma not finite and >= 0");
        }
        // The corrected copy of an unchanged pattern reads back with the same points.
        const std::string copy = render_pattern(p, p.intensity, p.sigma, {}, {});
        const Pattern q = cif ? parse_cif_pattern(copy, "copy.cif") : parse_text_pattern(copy, "copy.xy");
        require(q.size() == p.size(), "the rendered copy has another point count");
        if (!cif)
            for (std::size_t i = 0; i < p.size(); ++i)
                require(q.two_theta_deg[i] == p.two_theta_deg[i] && q.intensity[i] == p.intensity[i],
                        "the rendered copy reads back other numbers");
    });
}

}  // namespace mudepth::fuzz
