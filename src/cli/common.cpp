// Shared options of the computing commands and unit parsing at the boundary.
#include "cli/common.hpp"

#include <cctype>
#include <charconv>
#include <cmath>
#include <sstream>

#include "mudepth/composition.hpp"
#include "mudepth/elements.hpp"
#include "mudepth/error.hpp"
#include "mudepth/formula.hpp"

namespace mudepth::cli {

namespace {

std::string trim(const std::string& s) {
    const auto b = s.find_first_not_of(" \t");
    if (b == std::string::npos) return {};
    const auto e = s.find_last_not_of(" \t");
    return s.substr(b, e - b + 1);
}

/// Parses a whole string as a double with from_chars (no locale); nullopt if it is not one.
std::optional<double> to_double(const std::string& text) {
    double value = 0;
    const char* begin = text.data();
    const char* end = begin + text.size();
    if (begin != end && *begin == '+') ++begin;
    const auto [ptr, ec] = std::from_chars(begin, end, value);
    if (ec != std::errc() || ptr != end) return std::nullopt;
    return value;
}

std::vector<std::string> split(const std::string& text, char separator) {
    std::vector<std::string> out;
    std::string item;
    std::istringstream in(text);
    while (std::getline(in, item, separator)) out.push_back(trim(item));
    if (!text.empty() && text.back() == separator) out.emplace_back();
    return out;
}

/// A phase of --phase: "FORMULA,DENSITY,FRACTION" or "MATERIAL,FRACTION".
Phase parse_phase(const std::string& spec) {
    const auto fields = split(spec, ',');
    const std::string where = "--phase '" + spec + "'";
    if (fields.size() == 2) {
        const Composition c = find_composition(fields[0]);
        return {c.material, parse_number(where + " fraction", fields[1])};
    }
    if (fields.size() == 3) {
        const double density = parse_number(where + " density", fields[1]);
        check_density_g_cm3(density, where + " density");
        return {material_from_formula(parse_formula(fields[0]), density),
                parse_number(where + " fraction", fields[2])};
    }
    throw InputError(where + ": expected FORMULA,DENSITY,FRACTION or MATERIAL,FRACTION");
}

}  // namespace

double parse_number(const std::string& option, const std::string& text) {
    const std::string t = trim(text);
    if (t.empty()) throw InputError(option + ": empty value; a number is needed");
    const auto value = to_double(t);
    if (!value) throw InputError(option + ": '" + text + "' is not a number");
    if (!std::isfinite(*value)) throw InputError(option + ": '" + text + "' is not a finite number");
    return *value;
}

std::size_t parse_count(const std::string& option, const std::string& text) {
    const std::string t = trim(text);
    std::size_t value = 0;
    const auto [ptr, ec] = std::from_chars(t.data(), t.data() + t.size(), value);
    if (t.empty() || ec != std::errc() || ptr != t.data() + t.size() || value == 0)
        throw InputError(option + ": '" + text + "' is not a positive whole number");
    return value;
}

std::vector<double> parse_angles_deg(const std::string& option, const std::string& text) {
    const std::string t = trim(text);
    if (t.empty()) throw InputError(option + ": empty value; give START:STOP:STEP or a list such as 20,40,60");
    if (t.find(':') != std::string::npos) {
        const auto fields = split(t, ':');
        if (fields.size() != 3)
            throw InputError(option + ": '" + text + "' is not START:STOP:STEP (degrees)");
        const double start = parse_number(option + " start", fields[0]);
        const double stop = parse_number(option + " stop", fields[1]);
        const double step = parse_number(option + " step", fields[2]);
        if (step <= 0) throw InputError(option + ": step " + fields[2] + " must be positive");
        if (stop < start) throw InputError(option + ": stop " + fields[1] + " is below start " + fields[0]);
        const double intervals = std::floor((stop - start) / step + 1e-9);
        if (intervals + 1 > static_cast<double>(kMaxAnglePoints))
            throw InputError(option + ": '" + text + "' gives more than " + std::to_string(kMaxAnglePoints) +
                             " angles");
        const auto n = static_cast<std::size_t>(intervals) + 1;
        std::vector<double> out(n);
        for (std::size_t i = 0; i < n; ++i) out[i] = start + static_cast<double>(i) * step;
        return out;
    }
    std::vector<double> out;
    for (const auto& f : split(t, ',')) {
        if (out.size() >= kMaxAnglePoints)
            throw InputError(option + ": more than " + std::to_string(kMaxAnglePoints) + " angles");
        out.push_back(parse_number(option, f));
    }
    return out;
}

void add_two_theta_option(CLI::App& app, std::string& two_theta, const std::string& default_value) {
    two_theta = default_value;
    auto* o = app.add_option("--two-theta", two_theta, "Scattering angles 2θ: START:STOP:STEP or a list a,b,c [degrees]")
                  ->type_name("ANGLES")
                  ->check(nonempty())
                  ->group("Angles");
    if (!default_value.empty()) o->capture_default_str();
}

double parse_length_cm(const std::string& option, const std::string& text) {
    const std::string t = trim(text);
    struct Unit {
        const char* suffix;
        double cm;
    };
    // Longest suffixes first so "um" is not read as "m".
    // "µm" with the micro sign U+00B5 or the Greek mu U+03BC.
    static const Unit units[] = {{"nm", 1e-7}, {"\u00b5m", 1e-4}, {"\u03bcm", 1e-4}, {"um", 1e-4}, {"mm", 0.1}, {"cm", 1.0}};
    double scale = 0.1;  // a bare number means mm
    std::string number = t;
    for (const auto& u : units) {
        const std::string s = u.suffix;
        if (t.size() > s.size() && t.compare(t.size() - s.size(), s.size(), s) == 0) {
            scale = u.cm;
            number = trim(t.substr(0, t.size() - s.size()));
            break;
        }
    }
    const std::string lowered = [&] {
        std::string l = number;
        for (auto& c : l) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
        return l;
    }();
    if (lowered == "nan" || lowered == "inf" || lowered == "-inf" || lowered == "+inf" || lowered == "infinity")
        throw InputError(option + ": '" + text + "' is not a finite number");
    if (!number.empty() && std::isalpha(static_cast<unsigned char>(number.back())))
        throw InputError(option + ": '" + text + "' has an unknown unit; use nm, um, mm or cm");
    const double value = parse_number(option, number);
    if (value <= 0) throw InputError(option + ": length '" + text + "' must be positive");
    if (value * scale > kMaxLength_cm) throw InputError(option + ": length '" + text + "' is longer than 10 m");
    if (value * scale < kMinLength_cm) throw InputError(option + ": length '" + text + "' is shorter than 0.001 nm");
    return value * scale;
}

const CLI::Validator& nonempty() {
    static const CLI::Validator v(
        [](std::string& value) { return value.empty() ? std::string("empty value; give a value or leave the option out") : std::string(); },
        "", "nonempty");
    return v;
}

void add_sample_options(CLI::App& app, SampleOptions& o) {
    app.add_option("--formula", o.formula, "Chemical formula of the sample, e.g. Fe2O3, CuSO4.5H2O")
        ->type_name("FORMULA")
        ->check(nonempty())
        ->group("Sample");
    app.add_option("--material", o.material,
                   "A composition by name (see `mudepth materials`) or a .toml file path")
        ->type_name("NAME|FILE")
        ->check(nonempty())
        ->group("Sample");
    app.add_option("--density", o.density, "Crystal density of the sample [g/cm3]")
        ->type_name("G_CM3")
        ->check(nonempty())
        ->group("Sample");
    app.add_option("--packing", o.packing, "Packing fraction of the powder, 0 < f <= 1 (default: 1)")
        ->type_name("FRACTION")
        ->check(nonempty())
        ->group("Sample");
    app.add_option("--bulk-density", o.bulk_density,
                   "Bulk density of the packed sample, mass over volume [g/cm3]")
        ->type_name("G_CM3")
        ->check(nonempty())
        ->group("Sample");
    app.add_option("--cell", o.cell, "Unit cell 'a b c alpha beta gamma' [Å, degrees] for the density")
        ->type_name("\"A B C AL BE GA\"")
        ->check(nonempty())
        ->group("Sample");
    app.add_option("--formula-units", o.formula_units, "Formula units per cell (Z), with --cell")
        ->type_name("Z")
        ->check(nonempty())
        ->group("Sample");
    app.add_option("--phase", o.phases,
                   "A phase of a mixture: FORMULA,DENSITY,FRACTION or MATERIAL,FRACTION (repeat)")
        ->type_name("PHASE")
        ->check(nonempty())
        ->group("Sample");
    app.add_option("--phase-basis", o.phase_basis, "Phase fractions are by weight or volume")
        ->type_name("BASIS")
        ->check(CLI::IsMember({"weight", "volume"}))
        ->capture_default_str()
        ->check(nonempty())
        ->group("Sample");
}

void add_radiation_options(CLI::App& app, RadiationOptions& o) {
    app.add_option("--energy", o.energy, "Photon energy [keV], 1 to 500")
        ->type_name("KEV")
        ->check(nonempty())
        ->group("Radiation");
    app.add_option("--wavelength", o.wavelength, "Wavelength [Å]")
        ->type_name("ANGSTROM")
        ->check(nonempty())
        ->group("Radiation");
    app.add_option("--source", o.source,
                   "Anode and line: Cr, Fe, Co, Cu, Ga, Mo, Ag, In, W with :Ka (default), :Ka1, :Ka2, :Kb")
        ->type_name("ANODE[:LINE]")
        ->check(nonempty())
        ->group("Radiation");
}

void add_table_option(CLI::App& app, std::string& table) {
    app.add_option("--table", table, "Cross-section table: elam or chantler")
        ->type_name("NAME")
        ->capture_default_str()
        ->check(nonempty())
        ->group("Radiation");
}

CrossSectionTable build_table(const std::string& table) { return parse_cross_section_table(table); }

namespace {

UnitCell parse_cell(const std::string& text) {
    std::istringstream in(text);
    std::vector<std::string> fields;
    for (std::string f; in >> f;) fields.push_back(f);
    if (fields.size() != 6)
        throw InputError("--cell: expected six numbers 'a b c alpha beta gamma' (Å, degrees), got " +
                         std::to_string(fields.size()));
    double v[6];
    for (std::size_t i = 0; i < 6; ++i) v[i] = parse_number("--cell", fields[i]);
    return {v[0], v[1], v[2], v[3], v[4], v[5]};
}

double packing_from(const SampleOptions& o, double fallback) {
    if (o.packing.empty()) return fallback;
    const double f = parse_number("--packing", o.packing);
    check_packing_fraction(f);
    return f;
}

void refuse_density_options(const SampleOptions& o, const std::string& why) {
    if (!o.density.empty()) throw InputError("--density cannot be combined with " + why);
    if (!o.cell.empty()) throw InputError("--cell cannot be combined with " + why);
}

Material material_from_phases(const SampleOptions& o) {
    if (!o.formula.empty() || !o.material.empty())
        throw InputError("--phase describes a mixture; do not combine it with --formula or --material");
    refuse_density_options(o, "--phase (each phase has its own density)");
    if (!o.formula_units.empty()) throw InputError("--formula-units needs --cell and --formula, not --phase");
    std::vector<Phase> phases;
    for (const auto& spec : o.phases) phases.push_back(parse_phase(spec));
    const auto basis = o.phase_basis == "volume" ? FractionBasis::volume : FractionBasis::weight;
    return mix(phases, basis, packing_from(o, 1.0));
}

}  // namespace

Material build_material(const SampleOptions& o) {
    if (!o.phases.empty()) {
        Material m = material_from_phases(o);
        if (!o.bulk_density.empty()) throw InputError("--bulk-density cannot be combined with --phase");
        return m;
    }
    if (o.formula.empty() == o.material.empty())
        throw InputError(o.formula.empty()
                             ? "no sample given; use --formula with --density, or --material"
                             : "give either --formula or --material, not both");
    if (!o.bulk_density.empty() && (!o.packing.empty() || !o.density.empty() || !o.cell.empty()))
        throw InputError(
            "--bulk-density is the density of the packed sample; do not combine it with "
            "--density, --cell or --packing");

    Material m;
    if (!o.material.empty()) {
        const Composition c = find_composition(o.material);
        m = c.material;
        if (!o.cell.empty()) throw InputError("--cell needs --formula");
        if (!o.density.empty()) {
            const double d = parse_number("--density", o.density);
            check_density_g_cm3(d, "--density");
            m.solid_density_g_cm3 = d;
            m.density_source = "given with --density";
        }
        m.packing_fraction = packing_from(o, 1.0);
    } else {
        const Formula f = parse_formula(o.formula);
        double density = 0;
        std::string source;
        if (!o.density.empty() && !o.cell.empty())
            throw InputError("give either --density or --cell, not both");
        if (!o.density.empty()) {
            density = parse_number("--density", o.density);
            check_density_g_cm3(density, "--density");
            source = "given with --density";
        } else if (!o.cell.empty()) {
            if (o.formula_units.empty())
                throw InputError("--cell needs --formula-units (formula units per cell, Z)");
            const double z = parse_number("--formula-units", o.formula_units);
            density = density_from_cell_g_cm3(f, parse_cell(o.cell), z);
            source = "from the unit cell given with --cell";
        } else if (!o.bulk_density.empty()) {
            density = 1;  // replaced below
        } else if (f.parts.size() == 1) {
            density = element(f.parts.front().Z).density_g_cm3;
            // The element table gives gases at 0 °C and 1 atm.
            source = density < 0.01 ? "density of the pure element as a gas at 0 °C and 1 atm"
                                     : "density of the pure element";
        } else {
            throw InputError("no density given for '" + o.formula +
                             "'; use --density (g/cm3), --bulk-density or --cell with --formula-units");
        }
        m = material_from_formula(f, density, packing_from(o, 1.0));
        m.density_source = source;
    }
    if (!o.bulk_density.empty()) {
        const double d = parse_number("--bulk-density", o.bulk_density);
        check_density_g_cm3(d, "--bulk-density");
        m.solid_density_g_cm3 = d;
        m.packing_fraction = 1;
        m.density_is_bulk = true;
        m.density_source = "bulk density given with --bulk-density";
    }
    if (!o.formula_units.empty() && o.cell.empty())
        throw InputError("--formula-units needs --cell");
    return m;
}

Radiation build_radiation(const RadiationOptions& o) {
    const int given = !o.energy.empty() + !o.wavelength.empty() + !o.source.empty();
    if (given == 0) throw InputError("no radiation given; use --energy (keV), --wavelength (Å) or --source (e.g. Cu)");
    if (given > 1) throw InputError("give only one of --energy, --wavelength and --source");
    if (!o.energy.empty()) {
        const double e = parse_number("--energy", o.energy);
        check_energy_keV(e);
        return radiation_from_energy(e);
    }
    if (!o.wavelength.empty()) return radiation_from_wavelength(parse_number("--wavelength", o.wavelength));
    return radiation_from_source(o.source);
}

}  // namespace mudepth::cli
