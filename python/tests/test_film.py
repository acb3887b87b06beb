"""Film stacks: layer shares and substrate attenuation, against `mudepth film --json`."""
import pytest

np = pytest.importorskip("numpy")
import mudepth  # noqa: E402
from conftest import assert_close, cli_json  # noqa: E402


def stack(energy):
    tin = mudepth.depth_sample(mudepth.material("TiN", 5.4), energy)
    al2o3 = mudepth.depth_sample(mudepth.find_composition("corundum").material, energy)
    si = mudepth.depth_sample(mudepth.material("Si", mudepth.element("Si").density_g_cm3), energy)
    return [(tin, 2e-4), (al2o3, 0.5e-4)], si


@pytest.mark.parametrize("incidence", [None, 1.0])
def test_film_equals_cli(incidence):
    extra = ("--incidence", incidence) if incidence else ()
    j = cli_json("film", "--layer", "TiN,2um,5.4", "--layer", "corundum,0.5um", "--substrate", "Si",
                 "--source", "Cu", "--two-theta", "20:120:10", *extra)
    energy = mudepth.radiation_from_source("Cu").energy_keV
    layers, substrate = stack(energy)
    assert_close(layers[0][0].mu_per_cm, j["layers"][0]["mu_per_cm"])
    assert_close(substrate.optics.delta, j["substrate"]["delta"])
    d = mudepth.film_shares(layers, substrate, np.arange(20.0, 120.1, 10.0), incidence_deg=incidence)
    for k in ("incidence_deg", "exit_deg", "substrate_share", "substrate_attenuation"):
        assert_close(d[k], [p[k] for p in j["points"]], what=k)
    assert d["layer_shares"].shape == (11, 2)
    assert_close(d["layer_shares"], [p["layer_shares"] for p in j["points"]])


def test_film_incidence_scan_equals_cli_and_scalars():
    j = cli_json("film", "--layer", "TiN,2um,5.4", "--layer", "corundum,0.5um", "--substrate", "Si",
                 "--source", "Cu", "--two-theta", 36.7, "--incidence", "0.2:3:0.2")
    layers, substrate = stack(mudepth.radiation_from_source("Cu").energy_keV)
    inc = np.array([p["incidence_deg"] for p in j["points"]])
    d = mudepth.film_shares(layers, substrate, 36.7, incidence_deg=inc)
    assert_close(d["substrate_share"], [p["substrate_share"] for p in j["points"]])
    for i, a in enumerate(inc):
        one = mudepth.film_shares(layers, substrate, 36.7, incidence_deg=float(a))
        assert one["substrate_share"] == d["substrate_share"][i]
        assert list(one["layer_shares"]) == list(d["layer_shares"][i])
    # shares sum to 1 (their definition)
    assert_close(d["layer_shares"].sum(axis=1) + d["substrate_share"], np.ones(inc.size), rel=1e-13)
