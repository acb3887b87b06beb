"""Correcting arrays: the factors equal the `correction` of `mudepth cylinder/plate --json`
(the library's contract, correct.hpp); σ, subtraction and normalisation written out here."""
import pytest

np = pytest.importorskip("numpy")
import mudepth  # noqa: E402
from conftest import assert_close, cli_error, cli_json  # noqa: E402

TT = np.arange(10.0, 150.1, 5.0)


@pytest.mark.parametrize("kwargs,args", [
    (dict(geometry="cylinder", mu_R=1.3), ("cylinder", "--mu-r", 1.3)),
    (dict(geometry="cylinder", mu_R=1.3, mu_R_container=0.2, radius_ratio=1.1),
     ("cylinder", "--mu-r", 1.3, "--mu-r-container", 0.2, "--radius-ratio", 1.1)),
    (dict(geometry="reflection", mu_t=0.4), ("plate", "--mu-t", 0.4)),
    (dict(geometry="reflection", mu_t=0.4, incidence_deg=5.0, mu_t_window=0.02),
     ("plate", "--mu-t", 0.4, "--incidence", 5, "--mu-t-window", 0.02)),
    (dict(geometry="transmission-symmetric", mu_t=1.0, mu_t_window=0.05),
     ("plate", "--mu-t", 1, "--mode", "transmission-symmetric", "--mu-t-window", 0.05)),
])
def test_factors_equal_cli_correction(kwargs, args):
    j = cli_json(*args, "--two-theta", "10:150:5")
    want = [p["A_s_sc"] ** -1 if "A_s_sc" in p else p["correction"] for p in j["points"]]
    assert_close(mudepth.correction_factors(TT, **kwargs), want)


def test_transmission_normal_equals_cli():
    j = cli_json("plate", "--mu-t", 0.7, "--mode", "transmission-normal", "--two-theta", "10:80:5")
    f = mudepth.correction_factors(np.arange(10.0, 80.1, 5.0), "transmission-normal", mu_t=0.7)
    assert_close(f, [p["correction"] for p in j["points"]])


def test_correct_pattern_scales_intensity_and_sigma():
    rng = np.random.default_rng(7)
    i = rng.uniform(100, 1000, TT.size)
    s = np.sqrt(i)
    c = mudepth.correct_pattern(TT, i, s, geometry="cylinder", mu_R=2.0)
    f = mudepth.correction_factors(TT, "cylinder", mu_R=2.0)
    assert_close(c["correction"], f)
    assert_close(c["intensity"], i * f, rel=1e-15)
    assert_close(c["sigma"], s * f, rel=1e-15)
    n = mudepth.correct_pattern(TT, i, s, geometry="cylinder", mu_R=2.0, normalization="max")
    assert_close(n["intensity"], i * f / (i * f).max(), rel=1e-15)
    assert n["normalization_divisor"] == pytest.approx((i * f).max(), rel=1e-15)
    assert mudepth.correct_pattern(TT, i, geometry="reflection", mu_t=0.5)["sigma"] is None


def test_container_subtraction():
    i_sc = np.linspace(900, 500, TT.size)
    tt_c = np.arange(5.0, 155.1, 2.0)
    i_c = 40 + 0.1 * tt_c
    c = mudepth.correct_pattern(TT, i_sc, geometry="cylinder", mu_R=1.0, mu_R_container=0.3, radius_ratio=1.08,
                                empty=(tt_c, i_c), empty_scale=0.9)
    f = mudepth.container_factors(1.0, 0.3, 1.08, TT)
    # Paalman & Pings (1962), with the empty scan linearly interpolated (numpy.interp) and scaled.
    ic_here = 0.9 * np.interp(TT, tt_c, i_c)
    assert_close(c["intensity"], (i_sc - f["A_c_sc"] / f["A_c_c"] * ic_here) / f["A_s_sc"], rel=1e-12)
    assert_close(c["subtracted"], f["A_c_sc"] / f["A_c_c"] * ic_here, rel=1e-12)


def test_read_pattern(tmp_path):
    path = tmp_path / "scan.xy"
    path.write_text("# invented test scan\n10 100 10\n20 200 14\n30 150 12\n")
    p = mudepth.read_pattern(str(path))
    assert p["format"] == "text"
    assert list(p["two_theta_deg"]) == [10, 20, 30] and list(p["sigma"]) == [10, 14, 12]
    with pytest.raises(OSError):
        mudepth.read_pattern(str(tmp_path / "missing.xy"))
    bad = tmp_path / "bad.xy"
    bad.write_text("10 100\n5 200\n")
    with pytest.raises(ValueError, match="bad.xy:2"):
        mudepth.read_pattern(str(bad))


@pytest.mark.parametrize("call,text", [
    (lambda: mudepth.correction_factors(TT, "sphere", mu_R=1.0), "sphere"),
    (lambda: mudepth.correction_factors(TT, "cylinder"), "needs mu_R"),
    (lambda: mudepth.correction_factors(TT, "reflection", mu_R=1.0), "need mu_t"),
    (lambda: mudepth.correction_factors(TT, "cylinder", mu_R=1.0, radius_ratio=1.1), "needs both"),
    (lambda: mudepth.correct_pattern([10, 5], [1, 2], geometry="cylinder", mu_R=1.0), "not increasing"),
    (lambda: mudepth.correct_pattern([10, 20], [1], geometry="cylinder", mu_R=1.0), "same length"),
    (lambda: mudepth.correct_pattern([10, 20], [1, 2], [1, -1], geometry="cylinder", mu_R=1.0), "negative"),
    (lambda: mudepth.correct_pattern(TT, TT, geometry="cylinder", mu_R=1.0, normalization="mean"), "normalisation"),
    (lambda: mudepth.correct_pattern(TT, TT, geometry="cylinder", mu_R=1.0, empty=(TT, TT)), "empty-container"),
])
def test_refusals(call, text):
    with pytest.raises(ValueError, match=text):
        call()


def test_geometry_error_equals_cli_library_part():
    # 2θ = 100° does not exist for a plate normal to the beam: the plate command's message.
    _, message = cli_error("plate", "--mu-t", 1, "--mode", "transmission-normal", "--two-theta", "30,100")
    with pytest.raises(ValueError) as e:
        mudepth.correction_factors([30.0, 100.0], "transmission-normal", mu_t=1.0)
    assert message in str(e.value)
