"""Capillaries and containers, against `mudepth cylinder --json`."""
import pytest

np = pytest.importorskip("numpy")
import mudepth  # noqa: E402
from conftest import assert_close, cli_json  # noqa: E402

KEYS = ("A_s_s", "A_s_sc", "A_c_sc", "A_c_c")


@pytest.mark.parametrize("mu_R", [0.05, 1.0, 4.0, 30.0])
def test_cylinder_equals_cli(mu_R):
    j = cli_json("cylinder", "--mu-r", mu_R, "--two-theta", "0:180:2.5")
    tt = np.array([p["two_theta_deg"] for p in j["points"]])
    a = mudepth.cylinder_transmission(mu_R, tt)
    assert_close(a, [p["transmission"] for p in j["points"]])
    assert_close(1 / a, [p["correction"] for p in j["points"]])
    assert_close(j["mu_R"], mu_R)


def test_container_direct_equals_cli():
    j = cli_json("cylinder", "--mu-r", 1.2, "--mu-r-container", 0.3, "--radius-ratio", 1.15, "--two-theta", "5:175:5")
    tt = np.arange(5.0, 175.1, 5.0)
    f = mudepth.container_factors(1.2, 0.3, 1.15, tt)
    for k in KEYS:
        assert_close(f[k], [p[k] for p in j["points"]], what=k)


def test_material_route_equals_cli():
    j = cli_json("cylinder", "--formula", "CeO2", "--density", 7.215, "--packing", 0.4, "--source", "Mo",
                 "--diameter", "0.3mm", "--container-material", "borosilicate-3.3", "--wall", "10um",
                 "--two-theta", "5:150:5")
    e = mudepth.radiation_from_source("Mo").energy_keV
    mu = mudepth.linear_attenuation_per_cm(mudepth.material("CeO2", 7.215, 0.4), e)
    mu_wall = mudepth.linear_attenuation_per_cm(mudepth.find_composition("borosilicate-3.3").material, e)
    radius_cm = 0.03 / 2
    mu_R, mu_R_wall, ratio = mu * radius_cm, mu_wall * radius_cm, (radius_cm + 10e-4) / radius_cm
    assert_close(mu_R, j["mu_R"])
    assert_close(mu_R_wall, j["container"]["mu_R_container"])
    assert_close(ratio, j["container"]["radius_ratio"])
    f = mudepth.container_factors(mu_R, mu_R_wall, ratio, np.arange(5.0, 150.1, 5.0))
    for k in KEYS:
        assert_close(f[k], [p[k] for p in j["points"]], what=k)


def test_arrays_equal_scalar_calls():
    tt = np.linspace(0.0, 180.0, 400)
    a = mudepth.cylinder_transmission(2.0, tt)
    f = mudepth.container_factors(2.0, 0.4, 1.2, tt)
    for i in range(0, 400, 7):
        # Long arrays use the library's interpolant, documented to reproduce direct values to 1e-10.
        assert_close(a[i], mudepth.cylinder_transmission(2.0, float(tt[i])), rel=1e-9)
        one = mudepth.container_factors(2.0, 0.4, 1.2, float(tt[i]))
        for k in KEYS:
            assert isinstance(one[k], float)
            assert_close(f[k][i], one[k], rel=1e-6)  # container factors: 1e-4 guaranteed, about 1e-7 in practice (cylinder.hpp)
    # 2-D input keeps its shape
    assert mudepth.cylinder_transmission(2.0, tt.reshape(20, 20)).shape == (20, 20)


def test_container_corrected_intensity():
    tt = np.array([10.0, 45.0, 90.0])
    f = mudepth.container_factors(1.0, 0.2, 1.1, tt)
    i_sc = np.array([1000.0, 800.0, 600.0])
    i_c = np.array([50.0, 40.0, 30.0])
    got = mudepth.container_corrected_intensity(f, i_sc, i_c)
    # Paalman & Pings (1962): I_s = [I_sc − (A_c,sc/A_c,c) I_c] / A_s,sc, written out here.
    want = (i_sc - f["A_c_sc"] / f["A_c_c"] * i_c) / f["A_s_sc"]
    assert_close(got, want, rel=1e-14)
    with pytest.raises(KeyError, match="A_c_c"):
        mudepth.container_corrected_intensity({"A_s_s": 1, "A_s_sc": 1, "A_c_sc": 1}, 1.0, 1.0)
