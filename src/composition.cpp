// The composition library: TOML files (format in docs/compositions.md) built
// into the program from compositions/*.toml, or read from the user's files.
#include "mudepth/composition.hpp"

#include <algorithm>
#include <cerrno>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <memory>
#include <optional>
#include <string>
#include <utility>

#include <toml++/toml.h>

#include "mudepth/error.hpp"

namespace mudepth {

namespace data {
// Defined in the file that cmake/embed_compositions.cmake generates: (file
// stem, file text) of every compositions/*.toml, sorted by stem.
const std::vector<std::pair<std::string_view, std::string_view>>& builtin_composition_texts();
}  // namespace data

namespace {

constexpr int kMaxReferenceDepth = 8;
constexpr std::uintmax_t kMaxFileBytes = 1 << 20;

constexpr std::string_view kTopKeys[] = {
    "title", "formula", "phases", "density_g_cm3", "density_source", "typical_packing",
    "cell_lengths_A", "cell_angles_deg", "formula_units_per_cell", "notes"};
constexpr std::string_view kPhaseKeys[] = {"formula", "material", "density_g_cm3", "weight_fraction",
                                           "volume_fraction"};

std::string join(std::span<const std::string_view> items) {
    std::string s;
    for (auto k : items) {
        if (!s.empty()) s += ", ";
        s += k;
    }
    return s;
}

std::string lower(std::string_view s) {
    std::string out(s);
    for (auto& c : out)
        if (c >= 'A' && c <= 'Z') c = static_cast<char>(c - 'A' + 'a');
    return out;
}

std::size_t edit_distance(std::string_view a, std::string_view b) {
    std::vector<std::size_t> prev(b.size() + 1), cur(b.size() + 1);
    for (std::size_t j = 0; j <= b.size(); ++j) prev[j] = j;
    for (std::size_t i = 1; i <= a.size(); ++i) {
        cur[0] = i;
        for (std::size_t j = 1; j <= b.size(); ++j)
            cur[j] = std::min({prev[j] + 1, cur[j - 1] + 1, prev[j - 1] + (a[i - 1] == b[j - 1] ? 0u : 1u)});
        std::swap(prev, cur);
    }
    return prev[b.size()];
}

// Reads the composition text of one source and turns TOML into a Composition.
class Reader {
public:
    Reader(std::string_view name, std::string origin, std::filesystem::path base_dir, int depth)
        : name_(name), origin_(std::move(origin)), base_dir_(std::move(base_dir)), depth_(depth) {
        where_ = origin_ == "built-in" ? "built-in/" + name_ + ".toml" : origin_;
    }

    Composition read(std::string_view text) {
        toml::table root;
        try {
            root = toml::parse(text, std::string_view(where_));
        } catch (const toml::parse_error& e) {
            throw InputError(at(e.source()) + std::string(e.description()));
        }
        check_keys(root, kTopKeys, "");

        Composition c;
        c.name = name_;
        c.origin = origin_;
        c.title = required_string(root, "title");
        const std::string source = required_string(root, "density_source");
        c.typical_packing = 1;
        if (const auto* node = root.get("typical_packing")) {
            c.typical_packing = number(*node, "typical_packing");
            try {
                check_packing_fraction(c.typical_packing);
            } catch (const InputError& e) {
                throw InputError(at(node->source()) + "typical_packing: " + e.what());
            }
        }

        const auto* formula = root.get("formula");
        const auto* phases = root.get("phases");
        if (formula && phases)
            throw InputError(at(phases->source()) + "give either 'formula' or [[phases]], not both");
        if (!formula && !phases)
            throw InputError(where_ + ": missing 'formula' (one phase) or [[phases]] (a mixture)");
        c.material = formula ? one_phase(root, *formula) : mixture(root, *phases);
        c.material.name = name_;
        c.material.packing_fraction = 1;
        c.material.density_source = source;
        return c;
    }

private:
    std::string at(const toml::source_region& r) const {
        return where_ + ":" + std::to_string(r.begin.line) + ":" + std::to_string(r.begin.column) + ": ";
    }

    void check_keys(const toml::table& t, std::span<const std::string_view> allowed,
                    const std::string& context) const {
        for (auto&& [key, node] : t) {
            (void)node;
            if (std::find(allowed.begin(), allowed.end(), key.str()) == allowed.end())
                throw InputError(at(key.source()) + "unknown key '" + std::string(key.str()) + "'" +
                                 context + " (allowed: " + join(allowed) + ")");
        }
    }

    std::string required_string(const toml::table& t, std::string_view key) const {
        const auto* node = t.get(key);
        if (!node) throw InputError(where_ + ": missing '" + std::string(key) + "'");
        return string(*node, key);
    }

    std::string string(const toml::node& node, std::string_view key) const {
        const auto v = node.value<std::string>();
        if (!node.is_string() || !v)
            throw InputError(at(node.source()) + "'" + std::string(key) + "' must be a string");
        if (v->find_first_not_of(" \t") == std::string::npos)
            throw InputError(at(node.source()) + "'" + std::string(key) + "' is empty");
        return *v;
    }

    double number(const toml::node& node, std::string_view key) const {
        const auto v = node.value<double>();
        if (!node.is_number() || !v)
            throw InputError(at(node.source()) + "'" + std::string(key) + "' must be a number");
        return *v;
    }

    double density(const toml::node& node, std::string_view key) const {
        const double d = number(node, key);
        try {
            check_density_g_cm3(d, key);
        } catch (const InputError& e) {
            throw InputError(at(node.source()) + e.what());
        }
        return d;
    }

    Formula formula(const toml::node& node) const {
        const std::string text = string(node, "formula");
        try {
            return parse_formula(text);
        } catch (const InputError& e) {
            throw InputError(at(node.source()) + e.what());
        }
    }

    std::vector<double> numbers(const toml::node& node, std::string_view key, std::size_t n) const {
        const auto* arr = node.as_array();
        if (!arr || arr->size() != n)
            throw InputError(at(node.source()) + "'" + std::string(key) + "' must be an array of " +
                             std::to_string(n) + " numbers");
        std::vector<double> out;
        for (const auto& item : *arr) out.push_back(number(item, key));
        return out;
    }

    Material one_phase(const toml::table& root, const toml::node& formula_node) const {
        const Formula f = formula(formula_node);
        const auto* dens = root.get("density_g_cm3");
        const auto* lengths = root.get("cell_lengths_A");
        const auto* angles = root.get("cell_angles_deg");
        const auto* z = root.get("formula_units_per_cell");
        const bool any_cell = lengths || angles || z;
        if (dens && any_cell)
            throw InputError(at(dens->source()) +
                             "give either 'density_g_cm3' or the cell (cell_lengths_A, cell_angles_deg, "
                             "formula_units_per_cell), not both");
        if (dens) return material_from_formula(f, density(*dens, "density_g_cm3"));
        if (!any_cell)
            throw InputError(where_ + ": missing 'density_g_cm3' (or the cell: cell_lengths_A, "
                                      "cell_angles_deg, formula_units_per_cell)");
        if (!lengths || !angles || !z)
            throw InputError(where_ + ": a cell needs all of cell_lengths_A, cell_angles_deg and "
                                      "formula_units_per_cell");
        const auto l = numbers(*lengths, "cell_lengths_A", 3);
        const auto a = numbers(*angles, "cell_angles_deg", 3);
        const double units = number(*z, "formula_units_per_cell");
        double rho = 0;
        try {
            rho = density_from_cell_g_cm3(f, UnitCell{l[0], l[1], l[2], a[0], a[1], a[2]}, units);
        } catch (const InputError& e) {
            throw InputError(at(lengths->source()) + e.what());
        }
        return material_from_formula(f, rho);
    }

    Material mixture(const toml::table& root, const toml::node& phases_node) const {
        for (auto key : {"cell_lengths_A", "cell_angles_deg", "formula_units_per_cell"})
            if (const auto* n = root.get(key))
                throw InputError(at(n->source()) + "'" + key + "' belongs to a one-phase composition");
        const auto* arr = phases_node.as_array();
        if (!arr || !arr->is_array_of_tables() || arr->empty())
            throw InputError(at(phases_node.source()) + "'phases' must be an array of tables ([[phases]])");
        const auto* top_density = root.get("density_g_cm3");
        const std::optional<double> overall =
            top_density ? std::optional<double>(density(*top_density, "density_g_cm3")) : std::nullopt;

        std::vector<Phase> phases;
        std::optional<FractionBasis> basis;
        for (const auto& item : *arr) {
            const auto& t = *item.as_table();
            check_keys(t, kPhaseKeys, " in [[phases]]");
            const auto* f = t.get("formula");
            const auto* m = t.get("material");
            const auto* d = t.get("density_g_cm3");
            const auto* wf = t.get("weight_fraction");
            const auto* vf = t.get("volume_fraction");
            const std::string here = at(t.source());
            if ((f != nullptr) == (m != nullptr))
                throw InputError(here + "a phase needs one of 'formula' or 'material'");
            if ((wf != nullptr) == (vf != nullptr))
                throw InputError(here + "a phase needs one of 'weight_fraction' or 'volume_fraction'");
            const FractionBasis b = wf ? FractionBasis::weight : FractionBasis::volume;
            if (basis && *basis != b)
                throw InputError(here + "all phases must use the same kind of fraction (weight_fraction "
                                        "or volume_fraction)");
            basis = b;
            const auto* frac_node = wf ? wf : vf;
            const double fraction = number(*frac_node, wf ? "weight_fraction" : "volume_fraction");
            if (!std::isfinite(fraction) || fraction <= 0)
                throw InputError(at(frac_node->source()) + "a fraction must be finite and > 0");

            Material pm;
            if (m) {
                const std::string ref = string(*m, "material");
                try {
                    pm = lookup(ref).material;
                } catch (const Error& e) {
                    throw InputError(at(m->source()) + e.what());
                }
                if (d) pm.solid_density_g_cm3 = density(*d, "density_g_cm3");
            } else {
                const Formula pf = formula(*f);
                double rho = 0;
                if (d) rho = density(*d, "density_g_cm3");
                else if (overall && b == FractionBasis::weight) rho = 1;  // not used: the overall density rules
                else
                    throw InputError(here + "missing 'density_g_cm3' of this phase (needed for " +
                                     (b == FractionBasis::volume ? std::string("volume fractions")
                                                                 : std::string("the mixture's density, "
                                                                               "unless the top-level "
                                                                               "density_g_cm3 is given")) +
                                     ")");
                pm = material_from_formula(pf, rho);
            }
            phases.push_back(Phase{std::move(pm), fraction});
        }
        Material mixed;
        try {
            mixed = mix(phases, *basis);
        } catch (const InputError& e) {
            throw InputError(at(phases_node.source()) + e.what());
        }
        if (overall) mixed.solid_density_g_cm3 = *overall;
        return mixed;
    }

    Composition lookup(const std::string& ref) const;

    std::string name_;
    std::string origin_;
    std::string where_;
    std::filesystem::path base_dir_;
    int depth_;
};

bool looks_like_path(std::string_view s) {
    return s.find('/') != std::string_view::npos || (s.size() >= 5 && s.substr(s.size() - 5) == ".toml");
}

std::string read_file(const std::filesystem::path& path) {
    std::error_code ec;
    if (std::filesystem::is_directory(path, ec))
        throw FileError("cannot read composition file '" + path.string() + "': it is a directory");
    std::unique_ptr<std::FILE, int (*)(std::FILE*)> f(std::fopen(path.c_str(), "rb"), &std::fclose);
    if (!f)
        throw FileError("cannot read composition file '" + path.string() + "': " + std::strerror(errno));
    std::string text;
    char buf[8192];
    std::size_t n = 0;
    while ((n = std::fread(buf, 1, sizeof buf, f.get())) > 0) {
        text.append(buf, n);
        if (text.size() > kMaxFileBytes)
            throw FileError("composition file '" + path.string() + "' is larger than 1 MiB");
    }
    if (std::ferror(f.get()))
        throw FileError("cannot read composition file '" + path.string() + "': " + std::strerror(errno));
    return text;
}

Composition load_file(const std::filesystem::path& path, int depth) {
    const std::string text = read_file(path);
    return Reader(path.stem().string(), path.string(), path.parent_path(), depth).read(text);
}

std::vector<std::filesystem::path> search_dirs() {
    std::vector<std::filesystem::path> dirs;
    const char* env = std::getenv("MUDEPTH_COMPOSITION_PATH");
    if (!env) return dirs;
    std::string_view rest(env);
    while (true) {
        const auto colon = rest.find(':');
        const auto dir = rest.substr(0, colon);
        if (!dir.empty()) dirs.emplace_back(std::string(dir));
        if (colon == std::string_view::npos) break;
        rest.remove_prefix(colon + 1);
    }
    return dirs;
}

Composition find(std::string_view name_or_path, const std::filesystem::path& base_dir, int depth) {
    if (depth > kMaxReferenceDepth)
        throw InputError("materials refer to each other more than " + std::to_string(kMaxReferenceDepth) +
                         " levels deep (is there a cycle?) at '" + std::string(name_or_path) + "'");
    if (name_or_path.empty()) throw InputError("empty material name");
    if (looks_like_path(name_or_path)) {
        std::filesystem::path p{std::string(name_or_path)};
        if (p.is_relative() && !base_dir.empty()) p = base_dir / p;
        return load_file(p, depth);
    }
    const auto dirs = search_dirs();
    for (const auto& dir : dirs) {
        const auto p = dir / (std::string(name_or_path) + ".toml");
        std::error_code ec;
        if (std::filesystem::exists(p, ec)) return load_file(p, depth);
    }
    const auto& texts = data::builtin_composition_texts();
    for (const auto& [stem, text] : texts)
        if (stem == name_or_path) return Reader(stem, "built-in", {}, depth).read(text);
    const std::string key = lower(name_or_path);
    for (const auto& [stem, text] : texts)
        if (lower(stem) == key) return Reader(stem, "built-in", {}, depth).read(text);

    // Not found: suggest the closest name among the user's files and the built-ins.
    std::vector<std::string> candidates;
    for (const auto& dir : dirs) {
        std::error_code ec;
        for (const auto& entry : std::filesystem::directory_iterator(dir, ec))
            if (entry.path().extension() == ".toml") candidates.push_back(entry.path().stem().string());
    }
    for (const auto& [stem, text] : texts) candidates.emplace_back(stem);
    std::string best;
    std::size_t best_d = 3;
    for (const auto& c : candidates) {
        const std::size_t d = edit_distance(key, lower(c));
        if (d < best_d && d < c.size()) {
            best_d = d;
            best = c;
        }
    }
    std::string msg = "unknown material '" + std::string(name_or_path) + "'";
    if (!best.empty()) msg += "; did you mean '" + best + "'?";
    std::string names;
    for (const auto& n : builtin_composition_names()) names += (names.empty() ? "" : ", ") + n;
    msg += " (built-in: " + names + "; or give the path of a .toml file)";
    throw InputError(msg);
}

Composition Reader::lookup(const std::string& ref) const { return find(ref, base_dir_, depth_ + 1); }

}  // namespace

Composition parse_composition(std::string_view text, std::string_view name, std::string origin) {
    std::filesystem::path base;
    if (origin != "built-in") base = std::filesystem::path(origin).parent_path();
    return Reader(name, std::move(origin), std::move(base), 0).read(text);
}

Composition load_composition_file(const std::filesystem::path& path) { return load_file(path, 0); }

Composition find_composition(std::string_view name_or_path) { return find(name_or_path, {}, 0); }

std::vector<std::string> builtin_composition_names() {
    std::vector<std::string> names;
    for (const auto& [stem, text] : data::builtin_composition_texts()) names.emplace_back(stem);
    std::sort(names.begin(), names.end());
    return names;
}

}  // namespace mudepth
