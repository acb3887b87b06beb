"""Materials: formulas, density × packing, mixtures, compositions, against `mudepth mu/materials --json`."""
import os

import pytest

np = pytest.importorskip("numpy")
import mudepth  # noqa: E402
from conftest import ROOT, assert_close, cli_json  # noqa: E402

E = 8.04


def weight_fractions(material):
    return {e.label: e.weight_fraction for e in material.elements}


def json_fractions(j):
    return {e["symbol"]: e["weight_fraction"] for e in j["elements"]}


@pytest.mark.parametrize("formula,density,packing", [
    ("Fe2O3", 5.24, 0.6), ("Ca5(PO4)3(OH)", 3.16, 1.0), ("CuSO4.5H2O", 2.286, 0.5), ("D2O", 1.107, 1.0),
    ("[Co(NH3)6]Cl3", 1.71, 0.45),
])
def test_material_from_formula_equals_cli(formula, density, packing):
    m = mudepth.material(formula, density_g_cm3=density, packing_fraction=packing)
    j = cli_json("mu", "--formula", formula, "--density", density, "--packing", packing, "--energy", E)
    assert m.name == j["sample"]
    assert_close(m.density_g_cm3, j["density_g_cm3"], what="density")
    assert_close(m.solid_density_g_cm3, j["solid_density_g_cm3"])
    assert m.packing_fraction == j["packing_fraction"]
    wf, jf = weight_fractions(m), json_fractions(j)
    assert wf.keys() == jf.keys()
    for k in wf:
        assert_close(wf[k], jf[k], what=k)


def test_parse_formula_parts():
    f = mudepth.parse_formula("CuSO4·5H2O")
    counts = {p.label: p.count for p in f.parts}
    # Hydrate arithmetic: CuSO4 + 5 H2O = Cu1 S1 O9 H10.
    assert counts == {"Cu": 1, "S": 1, "O": 9, "H": 10}
    assert f.molar_mass_g_mol == pytest.approx(sum(p.count * p.molar_mass_g_mol for p in f.parts), rel=1e-14)
    # material() takes a Formula as well as text
    assert weight_fractions(mudepth.material(f, 2.286)) == weight_fractions(mudepth.material("CuSO4·5H2O", 2.286))


def test_density_from_cell_equals_cli():
    cell = mudepth.UnitCell(5.431, 5.431, 5.431, 90, 90, 90)
    rho = mudepth.density_from_cell_g_cm3("Si", cell, 8)
    j = cli_json("mu", "--formula", "Si", "--cell", "5.431 5.431 5.431 90 90 90", "--formula-units", 8, "--energy", E)
    assert_close(rho, j["solid_density_g_cm3"])
    assert_close(mudepth.cell_volume_A3(cell), 5.431 ** 3)  # cubic cell, a³


def test_element_density_equals_cli_default():
    j = cli_json("mu", "--formula", "Fe", "--energy", E)
    assert_close(mudepth.element("Fe").density_g_cm3, j["solid_density_g_cm3"])
    assert mudepth.element(26).symbol == "Fe"


@pytest.mark.parametrize("basis", ["weight", "volume"])
def test_mix_equals_cli(basis):
    si = mudepth.material("Si", 2.329)
    al2o3 = mudepth.material("Al2O3", 3.987)
    m = mudepth.mix([(si, 0.3), (al2o3, 0.7)], basis=basis, packing_fraction=0.55)
    j = cli_json("mu", "--phase", "Si,2.329,0.3", "--phase", "Al2O3,3.987,0.7", "--phase-basis", basis,
                 "--packing", 0.55, "--energy", E)
    assert m.name == j["sample"]
    assert_close(m.density_g_cm3, j["density_g_cm3"])
    assert_close(m.solid_density_g_cm3, j["solid_density_g_cm3"])
    for k, v in weight_fractions(m).items():
        assert_close(v, json_fractions(j)[k], what=k)


def test_mix_with_composition_equals_cli():
    c = mudepth.find_composition("fused-silica")
    m = mudepth.mix([(mudepth.material("CeO2", 7.215), 0.2), (c.material, 0.8)])
    j = cli_json("mu", "--phase", "CeO2,7.215,0.2", "--phase", "fused-silica,0.8", "--energy", E)
    assert_close(m.density_g_cm3, j["density_g_cm3"])
    assert_close(mudepth.linear_attenuation_per_cm(m, E), j["linear_attenuation_per_cm"])


def test_composition_with_packing_and_density_equals_cli():
    c = mudepth.find_composition("corundum")
    m = c.material.with_packing(0.5)
    j = cli_json("mu", "--material", "corundum", "--packing", 0.5, "--energy", E)
    assert_close(m.density_g_cm3, j["density_g_cm3"])
    m2 = c.material.with_density(3.9).with_packing(0.7)
    j2 = cli_json("mu", "--material", "corundum", "--density", 3.9, "--packing", 0.7, "--energy", E)
    assert_close(m2.density_g_cm3, j2["density_g_cm3"])


def test_builtin_compositions_equal_cli_materials():
    j = cli_json("materials")
    assert mudepth.builtin_composition_names() == [c["name"] for c in j]
    for entry in j:
        c = mudepth.find_composition(entry["name"])
        assert c.title == entry["title"] and c.origin == entry["origin"]
        assert_close(c.material.solid_density_g_cm3, entry["density_g_cm3"], what=c.name)
        assert_close(c.typical_packing, entry["typical_packing"], what=c.name)
        for k, v in weight_fractions(c.material).items():
            assert_close(v, {e["symbol"]: e["weight_fraction"] for e in entry["elements"]}[k], what=c.name + k)


def test_composition_by_path(tmp_path):
    path = tmp_path / "my-glass.toml"
    path.write_text(open(os.path.join(ROOT, "compositions", "fused-silica.toml")).read())
    c = mudepth.find_composition(str(path))
    assert c.origin == str(path)
    j = cli_json("mu", "--material", str(path), "--energy", E)
    assert_close(c.material.density_g_cm3, j["density_g_cm3"])
    assert_close(mudepth.load_composition_file(str(path)).material.density_g_cm3, j["density_g_cm3"])
