"""Attenuation: μ/ρ and parts, μ, 1/μ, δ, β, critical angle, against `mudepth mu/scan --json`."""
import pytest

np = pytest.importorskip("numpy")
import mudepth  # noqa: E402
from conftest import assert_close, cli_json  # noqa: E402

CASES = [
    ("Fe2O3", 5.24, 0.6, 8.04778, "elam"),
    ("Fe2O3", 5.24, 0.6, 7.2, "chantler"),
    ("LaB6", 4.72, 1.0, 17.479, "elam"),
    ("CeO2", 7.215, 0.5, 30.0, "chantler"),
    ("H2O", 1.0, 1.0, 1.5, "elam"),
    ("PbTiO3", 7.52, 0.7, 88.0, "elam"),
]


@pytest.mark.parametrize("formula,density,packing,energy,table", CASES)
def test_mu_equals_cli(formula, density, packing, energy, table):
    m = mudepth.material(formula, density, packing)
    j = cli_json("mu", "--formula", formula, "--density", density, "--packing", packing, "--energy", energy,
                 "--table", table, "--thickness", "0.1mm")
    parts = mudepth.mass_attenuation_parts_cm2_g(m, energy, table)
    for k in ("total", "photoelectric", "coherent", "incoherent"):
        assert_close(parts[k], j["mass_attenuation_cm2_g"][k], what=k)
    assert_close(mudepth.mass_attenuation_cm2_g(m, energy, table), j["mass_attenuation_cm2_g"]["total"])
    mu = mudepth.linear_attenuation_per_cm(m, energy, table)
    assert_close(mu, j["linear_attenuation_per_cm"])
    assert_close(mudepth.transmission(mu, 0.01), j["transmission"]["transmission"])
    r = mudepth.refraction(m, energy, table)
    for k in ("delta", "beta", "critical_angle_deg"):
        assert_close(r[k], j["refraction"][k], what=k)
    assert_close(mudepth.critical_angle_deg(r["delta"]), j["refraction"]["critical_angle_deg"])

    a = mudepth.attenuation(m, energy, table)
    assert a.table == j["table"]
    assert_close(a.mu_per_cm, j["linear_attenuation_per_cm"])
    assert_close(a.attenuation_length_um, j["attenuation_length_um"])
    assert_close(a.density_g_cm3, j["density_g_cm3"])
    assert [e.label for e in a.elements] == [e["symbol"] for e in j["elements"]]
    for e, je in zip(a.elements, j["elements"]):
        assert_close(e.mass_attenuation.total_cm2_g, je["mass_attenuation_cm2_g"])
        assert_close(e.share_of_total, je["share_of_total"])
        assert_close(mudepth.element_mass_attenuation_cm2_g(e.label, energy, table), je["mass_attenuation_cm2_g"])
    assert [(x.label, x.level) for x in mudepth.edges_near(m, energy)] == \
        [(x["symbol"], x["level"]) for x in j["edges_nearby"]]
    assert [w.label for w in mudepth.fluorescence_warnings(m, energy)] == [w["symbol"] for w in j["fluorescence"]]


@pytest.mark.parametrize("spacing", ["linear", "log"])
def test_energy_array_equals_cli_scan(spacing):
    m = mudepth.material("ZrO2", 5.68, 0.55)
    j = cli_json("scan", "--formula", "ZrO2", "--density", 5.68, "--packing", 0.55, "--from", 5, "--to", 40,
                 "--steps", 400, "--spacing", spacing)
    e = np.array([p["energy_keV"] for p in j["points"]])
    parts = mudepth.mass_attenuation_parts_cm2_g(m, e)
    assert_close(parts["total"], [p["mass_attenuation_cm2_g"] for p in j["points"]])
    assert_close(parts["photoelectric"], [p["photoelectric_cm2_g"] for p in j["points"]])
    assert_close(parts["coherent"], [p["coherent_cm2_g"] for p in j["points"]])
    assert_close(parts["incoherent"], [p["incoherent_cm2_g"] for p in j["points"]])
    assert_close(mudepth.linear_attenuation_per_cm(m, e), [p["linear_attenuation_per_cm"] for p in j["points"]])


def test_energy_array_equals_scalar_calls():
    m = mudepth.material("Fe2O3", 5.24, 0.6)
    e = np.linspace(1.0, 500.0, 301)
    arrays = {
        "mu_rho": mudepth.mass_attenuation_cm2_g(m, e, "chantler"),
        "mu": mudepth.linear_attenuation_per_cm(m, e, "chantler"),
    }
    parts = mudepth.mass_attenuation_parts_cm2_g(m, e, "chantler")
    refr = mudepth.refraction(m, e, "chantler")
    for i, x in enumerate(e):
        x = float(x)
        assert arrays["mu_rho"][i] == mudepth.mass_attenuation_cm2_g(m, x, "chantler")
        assert arrays["mu"][i] == mudepth.linear_attenuation_per_cm(m, x, "chantler")
        assert parts["coherent"][i] == mudepth.mass_attenuation_parts_cm2_g(m, x, "chantler")["coherent"]
        assert refr["beta"][i] == mudepth.refraction(m, x, "chantler")["beta"]
        assert refr["mu_per_cm"][i] == mudepth.attenuation(m, x, "chantler").mu_per_cm
