// `mudepth film`: a stack of layers on a substrate, each layer's share of the
// diffracted signal and the substrate's attenuation. Physics: mudepth/film.hpp.
#include <cctype>
#include <iostream>
#include <memory>
#include <sstream>

#include <nlohmann/json.hpp>

#include "cli/commands.hpp"
#include "cli/common.hpp"
#include "cli/film_layers.hpp"
#include "cli/output.hpp"
#include "cli/plot.hpp"
#include "mudepth/attenuation.hpp"
#include "mudepth/composition.hpp"
#include "mudepth/elements.hpp"
#include "mudepth/error.hpp"
#include "mudepth/film.hpp"
#include "mudepth/formula.hpp"
#include "mudepth/refraction.hpp"

namespace mudepth::cli {

namespace {

struct FilmOptions {
    std::vector<std::string> layers;
    std::string substrate;
    RadiationOptions radiation;
    std::string table = "elam";
    std::string two_theta;
    std::string incidence;
    bool json = false;
    bool csv = false;
    std::string plot;
};

struct Part {
    std::string name;
    double density_g_cm3 = 0;
    double mu_per_cm = 0;
    Refraction refraction;
    std::optional<double> thickness_cm;  // none for the substrate
};

struct FilmPoint {
    double two_theta_deg;
    BeamAngles angles;
    FilmShares shares;
};

struct FilmReport {
    std::string radiation;
    double energy_keV = 0, wavelength_A = 0;
    std::vector<Part> layers;
    Part substrate;
    bool by_incidence = false;
    bool fixed_incidence = false;
    std::vector<FilmPoint> points;
};

std::vector<std::string> split_commas(const std::string& text) {
    std::vector<std::string> out;
    std::stringstream in(text);
    for (std::string f; std::getline(in, f, ',');) {
        const auto b = f.find_first_not_of(" \t"), e = f.find_last_not_of(" \t");
        out.push_back(b == std::string::npos ? std::string() : f.substr(b, e - b + 1));
    }
    return out;
}

/// A formula when the name starts with a capital letter (TiN, Al2O3), else a material name or file.
Material resolve(const std::string& where, const std::string& name, const std::string& density_text) {
    if (name.empty()) throw InputError(where + ": no formula or material given");
    std::optional<double> density;
    if (!density_text.empty()) {
        density = parse_number(where + " density", density_text);
        check_density_g_cm3(*density, where + " density");
    }
    if (std::isupper(static_cast<unsigned char>(name[0]))) {
        const Formula f = parse_formula(name);
        if (!density) {
            if (f.parts.size() != 1)
                throw InputError(where + ": give the density of " + name + " in g/cm3 as the last field");
            density = element(f.parts.front().Z).density_g_cm3;
        }
        return material_from_formula(f, *density);
    }
    Material m = find_composition(name).material;
    if (density) m.solid_density_g_cm3 = *density;
    m.packing_fraction = 1;
    m.name = name;
    return m;
}

}  // namespace

FilmLayerSpec parse_film_layer(const std::string& spec) {
    const std::string where = "--layer '" + spec + "'";
    const auto f = split_commas(spec);
    if (f.size() < 2 || f.size() > 3)
        throw InputError(where + ": expected FORMULA_OR_MATERIAL,THICKNESS[,DENSITY], e.g. TiN,2um,5.4");
    FilmLayerSpec layer;
    layer.material = resolve(where, f[0], f.size() == 3 ? f[2] : "");
    layer.thickness_cm = parse_length_cm(where + " thickness", f[1]);
    return layer;
}

Material parse_film_substrate(const std::string& spec) {
    const std::string where = "--substrate '" + spec + "'";
    const auto f = split_commas(spec);
    if (f.empty() || f.size() > 2) throw InputError(where + ": expected FORMULA_OR_MATERIAL[,DENSITY]");
    return resolve(where, f[0], f.size() == 2 ? f[1] : "");
}

namespace {

Part make_part(const Material& m, const Radiation& rad, CrossSectionTable table) {
    Part p;
    p.name = m.name;
    p.density_g_cm3 = m.density_g_cm3();
    p.mu_per_cm = linear_attenuation_per_cm(m, rad.energy_keV, table);
    p.refraction = refraction(m, rad.energy_keV, p.mu_per_cm);
    return p;
}

DepthSample sample_of(const Part& p, double wavelength_A) {
    DepthSample s = refracting_sample(p.refraction.delta, p.refraction.beta, wavelength_A);
    s.mu_per_cm = p.mu_per_cm;
    return s;
}

FilmReport compute(const FilmOptions& o) {
    FilmReport r;
    if (o.layers.empty())
        throw InputError("the film stack is empty; give at least one --layer FORMULA_OR_MATERIAL,THICKNESS[,DENSITY]");
    if (o.substrate.empty()) throw InputError("film needs --substrate FORMULA_OR_MATERIAL[,DENSITY]");
    if (o.two_theta.empty()) throw InputError("film needs --two-theta (START:STOP:STEP or a list, degrees)");
    const Radiation rad = build_radiation(o.radiation);
    const auto table = build_table(o.table);
    r.radiation = rad.label;
    r.energy_keV = rad.energy_keV;
    r.wavelength_A = rad.wavelength_A();
    for (const auto& spec : o.layers) {
        const FilmLayerSpec layer = parse_film_layer(spec);
        Part p = make_part(layer.material, rad, table);
        p.thickness_cm = layer.thickness_cm;
        r.layers.push_back(p);
    }
    r.substrate = make_part(parse_film_substrate(o.substrate), rad, table);
    FilmStack stack;
    for (const auto& p : r.layers) stack.layers.push_back({sample_of(p, r.wavelength_A), *p.thickness_cm});
    stack.substrate = sample_of(r.substrate, r.wavelength_A);

    const auto two_thetas = parse_angles_deg("--two-theta", o.two_theta);
    std::vector<double> incidences;
    if (!o.incidence.empty()) incidences = parse_angles_deg("--incidence", o.incidence);
    if (incidences.size() > 1 && two_thetas.size() > 1)
        throw InputError("--incidence with several angles needs a single --two-theta");
    r.fixed_incidence = !incidences.empty();
    r.by_incidence = incidences.size() > 1;
    for (double tt : two_thetas) {
        if (incidences.empty()) {
            const BeamAngles b = symmetric_angles(tt);
            r.points.push_back({tt, b, film_shares(stack, b)});
        }
        for (double a : incidences) {
            const BeamAngles b = fixed_incidence_angles(tt, a);
            r.points.push_back({tt, b, film_shares(stack, b)});
        }
    }
    return r;
}

std::string label(const FilmReport& r, std::size_t i) { return "L" + std::to_string(i + 1) + " " + r.layers[i].name; }

nlohmann::json part_json(const Part& p) {
    nlohmann::json j{{"name", p.name},
                     {"density_g_cm3", p.density_g_cm3},
                     {"mu_per_cm", p.mu_per_cm},
                     {"delta", p.refraction.delta},
                     {"beta", p.refraction.beta},
                     {"critical_angle_deg", p.refraction.critical_angle_deg}};
    if (p.thickness_cm) j["thickness_um"] = *p.thickness_cm * 1e4;
    return j;
}

void print_json(const FilmReport& r) {
    nlohmann::json j;
    j["radiation"] = r.radiation;
    j["energy_keV"] = r.energy_keV;
    j["wavelength_A"] = r.wavelength_A;
    j["geometry"] = r.fixed_incidence ? "fixed-incidence" : "symmetric";
    j["layers"] = nlohmann::json::array();
    for (const auto& p : r.layers) j["layers"].push_back(part_json(p));
    j["substrate"] = part_json(r.substrate);
    j["points"] = nlohmann::json::array();
    for (const auto& p : r.points)
        j["points"].push_back({{"two_theta_deg", p.two_theta_deg},
                               {"incidence_deg", p.angles.incidence_deg},
                               {"exit_deg", p.angles.exit_deg},
                               {"layer_shares", p.shares.layer_shares},
                               {"substrate_share", p.shares.substrate_share},
                               {"substrate_attenuation", p.shares.substrate_attenuation}});
    std::cout << j.dump(2) << '\n';
}

void print_csv(const FilmReport& r) {
    std::cout << "# mudepth film: " << r.radiation << ", " << (r.fixed_incidence ? "fixed incidence" : "symmetric");
    for (std::size_t i = 0; i < r.layers.size(); ++i)
        std::cout << "; layer " << i + 1 << " " << r.layers[i].name << " " << fmt(*r.layers[i].thickness_cm * 1e4, 8)
                  << " um";
    std::cout << "; substrate " << r.substrate.name << '\n';
    std::vector<std::string> header{"two_theta_deg", "incidence_deg", "exit_deg"};
    for (std::size_t i = 0; i < r.layers.size(); ++i) header.push_back("share_layer_" + std::to_string(i + 1));
    header.insert(header.end(), {"share_substrate", "substrate_attenuation"});
    Table t(header);
    for (const auto& p : r.points) {
        std::vector<std::string> row{fmt(p.two_theta_deg, 10), fmt(p.angles.incidence_deg, 10), fmt(p.angles.exit_deg, 10)};
        for (double s : p.shares.layer_shares) row.push_back(fmt(s, 8));
        row.insert(row.end(), {fmt(p.shares.substrate_share, 8), fmt(p.shares.substrate_attenuation, 8)});
        t.add(row);
    }
    t.print_csv(std::cout);
}

void print_human(const FilmReport& r) {
    auto& out = std::cout;
    print_field(out, "Radiation", r.radiation + ": " + fmt(r.energy_keV, 6) + " keV, " + fmt(r.wavelength_A, 7) + " Å");
    print_field(out, "Geometry", r.fixed_incidence ? "fixed incidence α, exit 2θ − α, refraction in each layer"
                                                   : "symmetric reflection, refraction in each layer");
    out << "\nStack, top down:\n";
    Table s({"layer", "thickness", "density (g/cm³)", "μ (1/cm)", "1/μ", "α_c (°)"});
    for (std::size_t i = 0; i < r.layers.size(); ++i) {
        const auto& p = r.layers[i];
        s.add({label(r, i), length_from_um(*p.thickness_cm * 1e4), fmt(p.density_g_cm3, 5), fmt(p.mu_per_cm, 5),
               length_from_um(1e4 / p.mu_per_cm), fmt(p.refraction.critical_angle_deg, 4)});
    }
    s.add({"substrate " + r.substrate.name, "thick", fmt(r.substrate.density_g_cm3, 5), fmt(r.substrate.mu_per_cm, 5),
           length_from_um(1e4 / r.substrate.mu_per_cm), fmt(r.substrate.refraction.critical_angle_deg, 4)});
    s.print(out);
    out << "\nShare of the diffracted signal (equal diffracting power per unit volume), and the\n"
           "attenuation of the substrate's signal by the layers above:\n";
    std::vector<std::string> header{"2θ (°)", "incidence (°)", "exit (°)"};
    for (std::size_t i = 0; i < r.layers.size(); ++i) header.push_back(label(r, i) + " (%)");
    header.insert(header.end(), {"substrate (%)", "substrate attenuation"});
    Table t(header);
    for (const auto& p : r.points) {
        std::vector<std::string> row{fmt(p.two_theta_deg, 6), fmt(p.angles.incidence_deg, 6), fmt(p.angles.exit_deg, 6)};
        for (double v : p.shares.layer_shares) row.push_back(fixed(100 * v, 2));
        row.insert(row.end(), {fixed(100 * p.shares.substrate_share, 2), fmt(p.shares.substrate_attenuation, 4)});
        t.add(row);
    }
    t.print(out);
}

Plot film_plot(const FilmReport& r) {
    if (r.points.size() < 2) throw InputError("--plot needs at least two angles to draw a curve");
    Plot plot;
    plot.title = "Share of the diffracted signal per layer (" + r.radiation + ")";
    plot.x_label = r.by_incidence ? "incidence angle α (°)" : "2θ (°)";
    if (r.by_incidence) plot.title += ", 2θ = " + fmt(r.points.front().two_theta_deg, 5) + "°";
    plot.y_label = "share of the diffracted signal (fraction)";
    std::vector<double> x;
    for (const auto& p : r.points) x.push_back(r.by_incidence ? p.angles.incidence_deg : p.two_theta_deg);
    for (std::size_t i = 0; i < r.layers.size(); ++i) {
        PlotSeries s{label(r, i), x, {}};
        for (const auto& p : r.points) s.y.push_back(p.shares.layer_shares[i]);
        plot.series.push_back(s);
    }
    PlotSeries sub{"substrate " + r.substrate.name, x, {}};
    for (const auto& p : r.points) sub.y.push_back(p.shares.substrate_share);
    plot.series.push_back(sub);
    if (r.by_incidence) plot.markers.push_back({r.layers.front().refraction.critical_angle_deg, "α_c top layer"});
    return plot;
}

}  // namespace

void register_film(CLI::App& sub) {
    auto o = std::make_shared<FilmOptions>();
    sub.add_option("--layer", o->layers,
                   "A layer, top first (repeat): FORMULA_OR_MATERIAL,THICKNESS[,DENSITY]. A name starting with a "
                   "capital is a formula (TiN,2um,5.4; the density in g/cm3 is needed unless it is one element), "
                   "otherwise a material from `mudepth materials` or a .toml file (fused-silica,500nm). "
                   "Thickness takes nm, um, mm, cm (bare number: mm)")
        ->type_name("SPEC")->check(nonempty())->group("Stack");
    sub.add_option("--substrate", o->substrate, "The (thick) substrate: FORMULA_OR_MATERIAL[,DENSITY], e.g. Fe or Al2O3,3.98")
        ->type_name("SPEC")->check(nonempty())->group("Stack");
    add_radiation_options(sub, o->radiation);
    add_table_option(sub, o->table);
    add_two_theta_option(sub, o->two_theta);
    sub.add_option("--incidence", o->incidence,
                   "Fixed incidence angle α from the surface, one value or (with one 2θ) a range or list [degrees]; "
                   "default: symmetric reflection")
        ->type_name("ANGLES")->check(nonempty())->group("Angles");
    auto* json = sub.add_flag("--json", o->json, "Print one JSON document");
    sub.add_flag("--csv", o->csv, "Print CSV (shares as fractions)")->excludes(json);
    sub.add_option("--plot", o->plot, "Also draw the shares versus 2θ or incidence into this SVG file")
        ->type_name("FILE.svg")->check(nonempty());
    sub.footer(
        "A layer's share is the intensity it diffracts per unit incident beam, for the same diffracting\n"
        "power per unit volume in every layer, over the total of stack and substrate (the shares sum to 1):\n"
        "layer j gives ∏(i<j) e^(−t_i/Λ_i) · Λ_j (1 − e^(−t_j/Λ_j)), with Λ the 1/e depth of `mudepth depth`\n"
        "(refraction included). Multiply by each phase's own scattering power for real intensities.\n"
        "Example:\n"
        "  mudepth film --layer Al2O3,100nm,3.95 --layer TiN,2um,5.4 --substrate Fe --source Cu \\\n"
        "               --two-theta 40 --incidence 0.1:5:0.1 --plot shares.svg\n");
    sub.callback([o] {
        const FilmReport r = compute(*o);
        if (!o->plot.empty()) write_svg(film_plot(r), o->plot);
        print_report(r, o->json, o->csv, print_json, print_csv, print_human);
    });
}

}  // namespace mudepth::cli
