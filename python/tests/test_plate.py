"""Flat plates: every mode, incidence and windows, against `mudepth plate --json`."""
import pytest

np = pytest.importorskip("numpy")
import mudepth  # noqa: E402
from conftest import assert_close, cli_json  # noqa: E402

MODES = ["reflection", "transmission-normal", "transmission-symmetric"]


@pytest.mark.parametrize("mode", MODES)
@pytest.mark.parametrize("window", [None, 0.05])
def test_plate_equals_cli(mode, window):
    angles = "10:80:5" if mode == "transmission-normal" else "10:170:10"
    extra = ("--mu-t-window", window) if window else ()
    j = cli_json("plate", "--mu-t", 0.8, "--mode", mode, "--two-theta", angles, *extra)
    tt = np.array([p["two_theta_deg"] for p in j["points"]])
    a = mudepth.plate_transmission(0.8, tt, mode)
    assert_close(a, [p["sample_transmission"] for p in j["points"]])
    w = mudepth.window_transmission(window, tt, mode) if window else np.ones_like(tt)
    assert_close(w, [p["window_transmission"] for p in j["points"]])
    assert_close(a * w, [p["transmission"] for p in j["points"]])
    assert_close(1 / (a * w), [p["correction"] for p in j["points"]])
    if mode == "reflection":
        for entry in j["infinite_thickness"]:
            assert_close(mudepth.infinite_thickness_mu_t(entry["fraction"], tt).max(), entry["mu_t"])
    else:
        assert_close(mudepth.transmission_optimum_mu_t(tt, mode), [p["optimum_mu_t"] for p in j["points"]])


def test_reflection_incidence_and_material_equal_cli():
    j = cli_json("plate", "--formula", "ZnO", "--density", 5.61, "--packing", 0.5, "--thickness", "20um",
                 "--source", "Cu", "--incidence", 8, "--two-theta", "20:140:10", "--window-material", "polyimide",
                 "--window-thickness", "8um")
    e = mudepth.radiation_from_source("Cu").energy_keV
    mu = mudepth.linear_attenuation_per_cm(mudepth.material("ZnO", 5.61, 0.5), e)
    mu_w = mudepth.linear_attenuation_per_cm(mudepth.find_composition("polyimide").material, e)
    assert_close(mu, j["mu_per_cm"])
    assert_close(mu * 20e-4, j["mu_t"])
    tt = np.arange(20.0, 140.1, 10.0)
    a = mudepth.plate_transmission(mu * 20e-4, tt, "reflection", incidence_deg=8.0)
    w = mudepth.window_transmission(mu_w * 8e-4, tt, "reflection", incidence_deg=8.0)
    assert_close(a, [p["sample_transmission"] for p in j["points"]])
    assert_close(w, [p["window_transmission"] for p in j["points"]])
    for entry in j["infinite_thickness"]:
        assert_close(mudepth.infinite_thickness_mu_t(entry["fraction"], tt, incidence_deg=8.0).max(), entry["mu_t"])


def test_arrays_equal_scalar_calls():
    mu_t = np.array([0.1, 0.5, 1.0, 3.0])[:, None]
    tt = np.linspace(5, 85, 17)[None, :]
    for mode in MODES:
        a = mudepth.plate_transmission(mu_t, tt, mode)
        assert a.shape == (4, 17)
        for i in range(4):
            for k in range(17):
                assert a[i, k] == mudepth.plate_transmission(float(mu_t[i, 0]), float(tt[0, k]), mode)
