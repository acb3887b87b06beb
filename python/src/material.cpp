// Bindings: formulas, materials (density × packing), mixtures, compositions, elements.
#include <string>
#include <vector>

#include <pybind11/stl.h>
#include <pybind11/stl/filesystem.h>

#include "bindings.hpp"
#include "mudepth/composition.hpp"
#include "mudepth/elements.hpp"
#include "mudepth/error.hpp"
#include "mudepth/formula.hpp"
#include "mudepth/material.hpp"

namespace mudepth::python {

namespace {

Formula as_formula(const py::object& formula) {
    if (py::isinstance<Formula>(formula)) return formula.cast<Formula>();
    if (py::isinstance<py::str>(formula)) return parse_formula(formula.cast<std::string>());
    throw py::type_error("formula: expected a formula text such as 'Fe2O3' or a mudepth.Formula");
}

}  // namespace

int atomic_number_of(const py::object& element_or_Z) {
    if (py::isinstance<py::str>(element_or_Z)) {
        const auto symbol = element_or_Z.cast<std::string>();
        const auto Z = atomic_number(symbol);
        if (!Z) throw InputError("unknown element '" + symbol + "'");
        return *Z;
    }
    if (PyBool_Check(element_or_Z.ptr()) || !py::isinstance<py::int_>(element_or_Z))
        throw py::type_error("element: expected a symbol such as 'Fe' or an atomic number");
    return element_or_Z.cast<int>();
}

void bind_material(py::module_& m) {
    py::class_<FormulaPart>(m, "FormulaPart", "One element of a formula with its count per formula unit.")
        .def_readonly("Z", &FormulaPart::Z, "Atomic number (D and T are 1).")
        .def_readonly("label", &FormulaPart::label, "Element symbol; 'D' or 'T' for the hydrogen isotopes.")
        .def_readonly("count", &FormulaPart::count, "Atoms per formula unit.")
        .def_readonly("molar_mass_g_mol", &FormulaPart::molar_mass_g_mol, "Mass of this label, g/mol.")
        .def("__repr__", [](const FormulaPart& p) {
            return "FormulaPart(" + p.label + ", count=" + py::repr(py::float_(p.count)).cast<std::string>() + ")";
        });

    py::class_<Formula>(m, "Formula", "A parsed chemical formula.")
        .def_readonly("text", &Formula::text, "The formula as given.")
        .def_readonly("parts", &Formula::parts, "One FormulaPart per label, in order of first appearance.")
        .def_property_readonly("molar_mass_g_mol", &Formula::molar_mass_g_mol, "Mass of one formula unit, g/mol.")
        .def("__repr__", [](const Formula& f) { return "Formula('" + f.text + "')"; });

    m.def("parse_formula", &parse_formula, py::arg("formula"),
          "Parses a formula in the trade's notation: Fe2O3, Ca5(PO4)3(OH), CuSO4.5H2O, [Co(NH3)6]Cl3, D2O.\n"
          "Raises ValueError naming the column, e.g. \"formula 'Fe2O3)': unmatched ')' at column 6\".");

    py::class_<ElementShare>(m, "ElementShare", "One element's share of a material.")
        .def_readonly("Z", &ElementShare::Z)
        .def_readonly("label", &ElementShare::label, "Element symbol, or 'D'/'T'.")
        .def_readonly("weight_fraction", &ElementShare::weight_fraction, "Mass fraction (the shares sum to 1).")
        .def_readonly("molar_mass_g_mol", &ElementShare::molar_mass_g_mol, "g/mol")
        .def("__repr__", [](const ElementShare& e) {
            return "ElementShare(" + e.label + ", weight_fraction=" +
                   py::repr(py::float_(e.weight_fraction)).cast<std::string>() + ")";
        });

    py::class_<Material>(m, "Material",
                         "A sample: element weight fractions, solid density and packing fraction.\n"
                         "Build one with material(), mix() or find_composition(...).material.")
        .def_readonly("name", &Material::name, "Formula text, material name or mixture description.")
        .def_readonly("elements", &Material::elements, "List of ElementShare.")
        .def_readonly("solid_density_g_cm3", &Material::solid_density_g_cm3,
                      "Crystal (or glass) density, g/cm³, or the bulk density when density_is_bulk.")
        .def_readonly("packing_fraction", &Material::packing_fraction, "0 < f <= 1.")
        .def_readonly("density_is_bulk", &Material::density_is_bulk)
        .def_readonly("density_source", &Material::density_source, "Where the density came from.")
        .def_property_readonly("density_g_cm3", &Material::density_g_cm3,
                               "The density used everywhere: solid density × packing fraction, g/cm³.")
        .def(
            "with_packing",
            [](Material mat, double packing_fraction) {
                check_packing_fraction(packing_fraction);
                mat.packing_fraction = packing_fraction;
                check_density_g_cm3(mat.density_g_cm3(), "density × packing");
                return mat;
            },
            py::arg("packing_fraction"), "A copy with this packing fraction (0 < f <= 1).")
        .def(
            "with_density",
            [](Material mat, double density_g_cm3) {
                check_density_g_cm3(density_g_cm3, "density");
                mat.solid_density_g_cm3 = density_g_cm3;
                mat.density_source = "given";
                return mat;
            },
            py::arg("density_g_cm3"), "A copy with this solid density, g/cm³ (the packing is kept).")
        .def("__repr__", [](const Material& mat) {
            return "Material('" + mat.name + "', solid_density_g_cm3=" +
                   py::repr(py::float_(mat.solid_density_g_cm3)).cast<std::string>() + ", packing_fraction=" +
                   py::repr(py::float_(mat.packing_fraction)).cast<std::string>() + ")";
        });

    m.def(
        "material",
        [](const py::object& formula, double density_g_cm3, double packing_fraction) {
            return material_from_formula(as_formula(formula), density_g_cm3, packing_fraction);
        },
        py::arg("formula"), py::arg("density_g_cm3"), py::arg("packing_fraction") = 1.0,
        "A material of one phase: formula (text or Formula), crystal density in g/cm³ and the packing\n"
        "fraction of the powder (0 < f <= 1). The density used is density_g_cm3 × packing_fraction.\n"
        "Equals the command line's --formula F --density D --packing P.");

    py::class_<UnitCell>(m, "UnitCell", "Unit-cell parameters, Å and degrees.")
        .def(py::init([](double a, double b, double c, double alpha, double beta, double gamma) {
                 return UnitCell{a, b, c, alpha, beta, gamma};
             }),
             py::arg("a_A"), py::arg("b_A"), py::arg("c_A"), py::arg("alpha_deg") = 90.0, py::arg("beta_deg") = 90.0,
             py::arg("gamma_deg") = 90.0)
        .def_readonly("a_A", &UnitCell::a_A)
        .def_readonly("b_A", &UnitCell::b_A)
        .def_readonly("c_A", &UnitCell::c_A)
        .def_readonly("alpha_deg", &UnitCell::alpha_deg)
        .def_readonly("beta_deg", &UnitCell::beta_deg)
        .def_readonly("gamma_deg", &UnitCell::gamma_deg);
    m.def("cell_volume_A3", &cell_volume_A3, py::arg("cell"), "Cell volume, Å³ (triclinic formula).");
    m.def(
        "density_from_cell_g_cm3",
        [](const py::object& formula, const UnitCell& cell, double formula_units) {
            return density_from_cell_g_cm3(as_formula(formula), cell, formula_units);
        },
        py::arg("formula"), py::arg("cell"), py::arg("formula_units"),
        "Crystal density Z·M/(N_A·V) from the unit cell, g/cm³ (formula_units = Z per cell).");

    m.def(
        "mix",
        [](const std::vector<std::pair<Material, double>>& phases, const std::string& basis, double packing_fraction) {
            if (basis != "weight" && basis != "volume")
                throw InputError("phase basis '" + basis + "' is not weight or volume");
            std::vector<Phase> p;
            for (const auto& [mat, fraction] : phases) p.push_back({mat, fraction});
            return mix(p, basis == "volume" ? FractionBasis::volume : FractionBasis::weight, packing_fraction);
        },
        py::arg("phases"), py::arg("basis") = "weight", py::arg("packing_fraction") = 1.0,
        "A mixture of phases: a list of (Material, fraction) with fractions by 'weight' or 'volume'\n"
        "(normalised to sum 1). Solid density 1/Σ(w_i/ρ_i); the packing fraction applies to the whole.\n"
        "Equals the command line's --phase ... --phase-basis B --packing P.");

    py::class_<Composition>(m, "Composition", "A material of the composition library.")
        .def_readonly("name", &Composition::name, "File stem, e.g. 'fused-silica'.")
        .def_readonly("title", &Composition::title)
        .def_readonly("material", &Composition::material, "Composition and density (packing 1).")
        .def_readonly("typical_packing", &Composition::typical_packing, "Packing fraction usually reached.")
        .def_readonly("origin", &Composition::origin, "'built-in' or the file path.")
        .def("__repr__", [](const Composition& c) { return "Composition('" + c.name + "')"; });
    m.def("find_composition", &find_composition, py::arg("name_or_path"),
          "A composition by name (MUDEPTH_COMPOSITION_PATH first, then the built-in library) or by path\n"
          "(anything containing '/' or ending '.toml'). ValueError for an unknown name or a malformed file,\n"
          "OSError when a file cannot be read.");
    m.def("load_composition_file", &load_composition_file, py::arg("path"),
          "Reads a composition file (format: docs/compositions.md); OSError if unreadable, ValueError if malformed.");
    m.def("builtin_composition_names", &builtin_composition_names, "Names of the built-in compositions, sorted.");

    py::class_<ElementInfo>(m, "ElementInfo", "Element data embedded in the library.")
        .def_readonly("Z", &ElementInfo::Z)
        .def_property_readonly("symbol", [](const ElementInfo& e) { return std::string(e.symbol); })
        .def_readonly("molar_mass_g_mol", &ElementInfo::molar_mass_g_mol, "Standard atomic weight, g/mol.")
        .def_readonly("density_g_cm3", &ElementInfo::density_g_cm3, "Density of the pure element, g/cm³.");
    m.def(
        "element", [](const py::object& element_or_Z) { return element(atomic_number_of(element_or_Z)); },
        py::arg("element"), "The element with this symbol ('Fe') or atomic number (1..98).");
}

}  // namespace mudepth::python
