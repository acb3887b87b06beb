"""Depth probed, every geometry of `mudepth depth`, the inverse and the shift, against its JSON."""
import pytest

np = pytest.importorskip("numpy")
import mudepth  # noqa: E402
from conftest import assert_close, cli_json  # noqa: E402

SI = ("--formula", "Si", "--density", 2.329, "--source", "Cu")


def si_sample(refraction=True):
    return mudepth.depth_sample(mudepth.material("Si", 2.329), mudepth.radiation_from_source("Cu").energy_keV,
                                refraction=refraction)


def points(j, key):
    return [p[key] for p in j["points"]]


def check(d, j, keys=("incidence_deg", "exit_deg", "depth_1e_um", "depth_fraction_um")):
    for k in keys:
        assert_close(d[k], points(j, k), what=k)


def test_sample_equals_cli():
    j = cli_json("depth", *SI, "--two-theta", 30)
    s = si_sample()
    assert s.refraction_applied and j["refraction_applied"]
    assert_close(s.mu_per_cm, j["mu_per_cm"])
    assert_close(s.optics.delta, j["delta"])
    assert_close(s.optics.beta, j["beta"])
    assert_close(s.optics.wavelength_A, j["wavelength_A"])
    assert_close(mudepth.beam_depth_1e_um(s.optics.delta, s.optics.beta, s.optics.wavelength_A, 0.0),
                 j["evanescent_depth_um"])


@pytest.mark.parametrize("fraction,thickness", [(0.9, None), (0.5, "3um"), (0.99, "20um")])
def test_symmetric_equals_cli(fraction, thickness):
    extra = ("--thickness", thickness) if thickness else ()
    j = cli_json("depth", *SI, "--two-theta", "10:170:5", "--fraction", fraction, *extra)
    t_cm = float(thickness[:-2]) * 1e-4 if thickness else None
    d = mudepth.depth(si_sample(), np.arange(10.0, 170.1, 5.0), fraction=fraction, thickness_cm=t_cm)
    check(d, j)


def test_geometric_mu_and_closed_forms_equal_cli():
    j = cli_json("depth", "--mu", 150, "--two-theta", "20,45.5,90,150")
    tt = np.array([20, 45.5, 90, 150])
    s = mudepth.geometric_sample(150.0)
    assert not s.refraction_applied and j["refraction_applied"] is False
    check(mudepth.depth(s, tt), j)
    assert_close(mudepth.symmetric_depth_1e_um(150.0, tt), points(j, "depth_1e_um"))
    assert_close(mudepth.fraction_depth_um(150.0, tt, 0.9), points(j, "depth_fraction_um"))
    assert_close(mudepth.depth_holding_fraction_um(mudepth.symmetric_depth_1e_um(150.0, tt), 0.9),
                 points(j, "depth_fraction_um"))


def test_fixed_incidence_scan_equals_cli():
    j = cli_json("depth", *SI, "--two-theta", 28.44, "--incidence", "0.05:2:0.05")
    inc = np.array([p["incidence_deg"] for p in j["points"]])
    d = mudepth.depth(si_sample(), 28.44, incidence_deg=inc)
    check(d, j)
    s = si_sample()
    assert_close(mudepth.grazing_depth_1e_um(s.optics.delta, s.optics.beta, s.optics.wavelength_A, 28.44, inc),
                 points(j, "depth_1e_um"), rel=1e-12)


def test_fixed_incidence_geometric_equals_cli():
    j = cli_json("depth", "--mu", 80, "--two-theta", "20:120:10", "--incidence", 5)
    tt = np.arange(20.0, 120.1, 10.0)
    check(mudepth.depth(mudepth.geometric_sample(80.0), tt, incidence_deg=5.0), j)
    assert_close(mudepth.fixed_incidence_depth_1e_um(80.0, tt, 5.0), points(j, "depth_1e_um"))


@pytest.mark.parametrize("mode", ["side", "omega"])
def test_tilt_equals_cli(mode):
    fe = ("--formula", "Fe", "--source", "Cr")
    j = cli_json("depth", *fe, "--two-theta", 156, "--tilt", "0:60:15", "--tilt-mode", mode)
    e = mudepth.radiation_from_source("Cr").energy_keV
    s = mudepth.depth_sample(mudepth.material("Fe", mudepth.element("Fe").density_g_cm3), e)
    psi = np.arange(0.0, 60.1, 15.0)
    check(mudepth.depth(s, 156.0, tilt_deg=psi, tilt_mode=mode), j)
    angles = mudepth.tilt_angles(156.0, psi, mode)
    assert_close(angles["incidence_deg"], points(j, "incidence_deg"))
    # the closed forms, geometric (μ only)
    jg = cli_json("depth", "--mu", 400, "--two-theta", 156, "--tilt", "0:60:15", "--tilt-mode", mode)
    f = mudepth.side_inclination_depth_1e_um if mode == "side" else mudepth.omega_tilt_depth_1e_um
    assert_close(f(400.0, 156.0, psi), points(jg, "depth_1e_um"))


def test_transparency_shift_equals_cli():
    for thickness in (None, 0.02):
        extra = ("--thickness", "0.2mm") if thickness else ()
        j = cli_json("depth", "--mu", 20, "--two-theta", "20:140:20", "--goniometer-radius", "240mm", *extra)
        tt = np.arange(20.0, 140.1, 20.0)
        d = mudepth.depth(mudepth.geometric_sample(20.0), tt, goniometer_radius_cm=24.0, thickness_cm=thickness)
        check(d, j, keys=("depth_1e_um", "depth_fraction_um", "peak_shift_deg"))
        assert_close(mudepth.transparency_shift_deg(20.0, tt, 24.0, thickness), points(j, "peak_shift_deg"))


@pytest.mark.parametrize("args,mode", [
    (("--mu", 150), None),
    (SI, None),
    (SI, "side"),
    (SI, "omega"),
])
def test_inverse_equals_cli(args, mode):
    extra = ("--tilt-mode", mode) if mode else ()
    j = cli_json("depth", *args, "--two-theta", "20:160:20", "--target-depth", "2um", *extra)
    s = mudepth.geometric_sample(150.0) if args[0] == "--mu" else si_sample()
    d = mudepth.angle_for_depth(s, np.arange(20.0, 160.1, 20.0), 2.0, tilt_mode=mode)
    assert list(d["reachable"]) == points(j, "reachable")
    keys = ["incidence_deg", "exit_deg", "depth_1e_um", "depth_fraction_um", "min_depth_um", "max_depth_um"]
    if mode:
        keys.append("tilt_deg")
    check(d, j, keys=keys)


def test_inverse_unreachable_equals_cli():
    j = cli_json("depth", "--mu", 150, "--two-theta", "20,90", "--target-depth", "1mm")
    d = mudepth.angle_for_depth(mudepth.geometric_sample(150.0), [20, 90], 1000.0)
    assert not d["reachable"].any() and not any(points(j, "reachable"))
    assert np.isnan(d["depth_1e_um"]).all()
    check(d, j, keys=("min_depth_um", "max_depth_um"))


def test_arrays_equal_scalar_calls():
    s = si_sample()
    tt = np.linspace(5.0, 175.0, 35)
    d = mudepth.depth(s, tt, fraction=0.8, thickness_cm=5e-4)
    inv = mudepth.angle_for_depth(s, tt, 3.0)
    for i, x in enumerate(tt):
        one = mudepth.depth(s, float(x), fraction=0.8, thickness_cm=5e-4)
        assert isinstance(one["depth_1e_um"], float)
        assert d["depth_1e_um"][i] == one["depth_1e_um"]
        assert d["depth_fraction_um"][i] == one["depth_fraction_um"]
        one_inv = mudepth.angle_for_depth(s, float(x), 3.0)
        assert bool(inv["reachable"][i]) == one_inv["reachable"]
        assert inv["max_depth_um"][i] == one_inv["max_depth_um"]
    # 2θ column against an incidence row: broadcasting gives the grid
    grid = mudepth.depth(s, np.array([[40.0], [80.0]]), incidence_deg=np.array([0.5, 1.0, 2.0]))
    assert grid["depth_1e_um"].shape == (2, 3)
    assert grid["depth_1e_um"][1, 2] == mudepth.depth(s, 80.0, incidence_deg=2.0)["depth_1e_um"]
