"""Specimens and file correction: the module's μR, μt, wall and windows equal `mudepth
cylinder/plate --json`, and correct_files() writes the same files as `mudepth correct` (every
line but the 'command:' and 'date:' lines of the provenance header), with the same refusals."""
import os

import pytest

np = pytest.importorskip("numpy")
import mudepth  # noqa: E402
from conftest import assert_close, cli_error, cli_json, run_cli  # noqa: E402

FE2O3 = mudepth.material("Fe2O3", 5.24, 0.6)
MO = mudepth.radiation_from_source("Mo")
CU = mudepth.radiation_from_source("Cu")
GLASS = mudepth.find_composition("borosilicate-3.3").material
FOIL = mudepth.find_composition("polyimide").material
FE_ARGS = ("--formula", "Fe2O3", "--density", 5.24, "--packing", 0.6)

# (Python specimen, the same sample and geometry as command-line options for `correct`).
CAPILLARIES = {
    "material": (lambda: mudepth.capillary(FE2O3, MO, 0.03), (*FE_ARGS, "--source", "Mo", "--diameter", 0.3)),
    "material-wall": (lambda: mudepth.capillary(FE2O3, MO, 0.03, table="chantler").with_wall(GLASS, 0.001),
                      (*FE_ARGS, "--source", "Mo", "--diameter", 0.3, "--table", "chantler",
                       "--container-material", "borosilicate-3.3", "--wall", "10um")),
    "direct-wall": (lambda: mudepth.capillary_from_mu_R(1.3).with_wall(wall_mu_R=0.2, radius_ratio=1.1),
                    ("--mu-r", 1.3, "--mu-r-container", 0.2, "--radius-ratio", 1.1)),
}
PLATES = {
    "reflection-material": (lambda: mudepth.plate(FE2O3, CU, 0.001),
                            ("reflection", (*FE_ARGS, "--source", "Cu", "--thickness", "10um"))),
    "reflection-incidence-windows": (
        lambda: mudepth.plate_from_mu_t(2.0).with_incidence(5.0).with_windows(FOIL, 8e-4, CU),
        ("reflection", ("--mu-t", 2, "--incidence", 5, "--window-material", "polyimide",
                        "--window-thickness", "8um", "--source", "Cu"))),
    "transmission-symmetric": (
        lambda: mudepth.plate(FE2O3, MO, 0.01, mode="transmission-symmetric").with_windows(0.02),
        ("transmission-symmetric", (*FE_ARGS, "--source", "Mo", "--thickness", "100um", "--mu-t-window", 0.02))),
    "transmission-normal": (lambda: mudepth.plate_from_mu_t(0.7, "transmission-normal"),
                            ("transmission-normal", ("--mu-t", 0.7))),
}


@pytest.mark.parametrize("name", CAPILLARIES)
def test_capillary_equals_cylinder_command(name):
    make, args = CAPILLARIES[name]
    c = make()
    j = cli_json("cylinder", *args, "--two-theta", "10:150:10")
    assert_close(c.mu_R, j["mu_R"])
    assert (c.mu_per_cm is None) == (j["mu_per_cm"] is None)
    if c.mu_per_cm is not None:
        assert_close(c.mu_per_cm, j["mu_per_cm"])
        assert c.radiation == j["radiation"] and c.sample == j["sample"]
    if c.wall is not None:
        assert_close(c.wall.mu_R, j["container"]["mu_R_container"])
        assert_close(c.wall.radius_ratio, j["container"]["radius_ratio"])
    want = [p["A_s_sc"] ** -1 if "A_s_sc" in p else p["correction"] for p in j["points"]]
    assert_close(mudepth.correction_factors(np.arange(10.0, 150.1, 10.0), c), want)
    assert c.warnings == j["warnings"]


@pytest.mark.parametrize("name", PLATES)
def test_plate_equals_plate_command(name):
    make, (mode, args) = PLATES[name]
    p = make()
    assert p.mode == mode
    angles = "10:80:5" if mode == "transmission-normal" else "10:150:5"
    j = cli_json("plate", *args, "--mode", mode, "--two-theta", angles)
    assert_close(p.mu_t, j["mu_t"])
    if p.window is not None:
        assert_close(p.window.mu_t, j["window"]["mu_t"])
    tt = [q["two_theta_deg"] for q in j["points"]]
    assert_close(mudepth.correction_factors(tt, p), [q["correction"] for q in j["points"]])


def _without_command_and_date(path):
    with open(path, encoding="utf-8") as f:
        return [line for line in f if not line.startswith(("# command: ", "# date: "))]


def _scan(path, rows, header="# invented test scan\n"):
    with open(path, "w", encoding="utf-8") as f:
        f.write(header)
        for row in rows:
            f.write(" ".join(str(v) for v in row) + "\n")
    return str(path)


def _series(tmp_path, n=3):
    rng = np.random.default_rng(11)
    tt = np.arange(10.0, 120.0, 0.5)
    paths = []
    for k in range(n):
        i = rng.uniform(50, 900, tt.size).round(1)
        paths.append(_scan(tmp_path / f"run_{k}.xy", zip(tt, i, np.sqrt(i).round(3))))
    return paths


def _compare_with_cli(tmp_path, python_kwargs, cli_args, inputs):
    (tmp_path / "py").mkdir()
    results = mudepth.correct_files(inputs, output_dir=str(tmp_path / "py"), **python_kwargs)
    status, out, err = run_cli("correct", *inputs, *cli_args, "--output-dir", tmp_path / "cli")
    assert status == 0, err
    for path, r in zip(inputs, results):
        assert r["outcome"] == "written" and r["error"] is None
        name = os.path.basename(r["output"])
        assert r["output"] == os.path.join(str(tmp_path / "py"), name)
        assert r["read_summary"] in out
        assert _without_command_and_date(r["output"]) == _without_command_and_date(tmp_path / "cli" / name)
    return results


@pytest.mark.parametrize("name", CAPILLARIES)
def test_correct_files_writes_what_the_command_writes_cylinder(tmp_path, name):
    make, args = CAPILLARIES[name]
    _compare_with_cli(tmp_path, dict(specimen=make(), normalization="max"),
                      ("--geometry", "cylinder", *args, "--normalize", "max"), _series(tmp_path))


@pytest.mark.parametrize("name", PLATES)
def test_correct_files_writes_what_the_command_writes_plate(tmp_path, name):
    make, (mode, args) = PLATES[name]
    inputs = _series(tmp_path, 2)
    if mode == "transmission-normal":  # this geometry exists below 2θ = 90° only
        inputs = [_scan(tmp_path / "low.xy", [(10, 100, 10), (30, 200, 14), (60, 150, 12)])]
    _compare_with_cli(tmp_path, dict(specimen=make(), normalization="at:30"),
                      ("--geometry", mode, *args, "--normalize", "at:30"), inputs)


def test_container_subtraction_and_pdcif(tmp_path):
    sample = _series(tmp_path, 1)
    tt = np.arange(5.0, 130.0, 1.0)
    empty = _scan(tmp_path / "empty.xy", zip(tt, 30 + 0.2 * tt, np.full(tt.size, 2.0)))
    cif = tmp_path / "run.cif"
    cif.write_text("data_run\n_pd_meas_2theta_range_min 10\n_pd_meas_2theta_range_max 30\n"
                   "_pd_meas_2theta_range_inc 10\nloop_\n_pd_meas_counts_total\n100(10)\n200(14)\n150(12)\n")
    c = CAPILLARIES["material-wall"][0]()
    results = _compare_with_cli(
        tmp_path, dict(specimen=c, empty=empty, empty_scale=0.8),
        ("--geometry", "cylinder", *CAPILLARIES["material-wall"][1], "--empty", empty, "--empty-scale", 0.8),
        [*sample, str(cif)])
    assert results[1]["output"].endswith("run.corrected.cif")


def test_results_and_the_recorded_command(tmp_path):
    [path] = _series(tmp_path, 1)
    out = tmp_path / "out"
    r = mudepth.correct_files(path, output_dir=out, specimen=mudepth.capillary_from_mu_R(1.0), command="my reduction")
    assert len(r) == 1 and r[0]["outcome"] == "written"
    text = open(r[0]["output"], encoding="utf-8").read()
    assert "# command: my reduction\n" in text and "# date: 20" in text
    f = mudepth.correction_factors(np.arange(10.0, 120.0, 0.5), "cylinder", mu_R=1.0)
    assert r[0]["correction_min"] == pytest.approx(f.min(), rel=1e-15)
    assert r[0]["correction_max"] == pytest.approx(f.max(), rel=1e-15)
    r = mudepth.correct_files([path], output_dir=out, specimen=mudepth.capillary_from_mu_R(1.0), force=True)
    text = open(r[0]["output"], encoding="utf-8").read()
    assert "# command: mudepth.correct_files() in Python" in text


def _cli_correct_error(*args):
    """(exit status, the command line's last error line without its prefix): a batch prints what it
    wrote on stdout and each failed file on stderr before the summary line."""
    status, out, err = run_cli("correct", *args)
    lines = err.splitlines()
    assert status in (2, 3) and lines and all(x.startswith("mudepth: error: ") for x in lines), (status, err)
    return status, lines[-1][len("mudepth: error: "):]


def test_errors_equal_the_command_line(tmp_path):
    good = _scan(tmp_path / "good.xy", [(10, 100, 10), (20, 200, 14)])
    bad = _scan(tmp_path / "bad.xy", [(10, 100), (5, 200)])
    missing = str(tmp_path / "missing.xy")
    afile = _scan(tmp_path / "afile", [(10, 1)])
    cap = mudepth.capillary_from_mu_R(1.0)
    direct = ("--geometry", "cylinder", "--mu-r", 1)
    cases = [
        ([bad], dict(), direct, mudepth.InputError, 2),
        ([missing], dict(), direct, mudepth.FileError, 3),
        ([good, bad], dict(), direct, mudepth.InputError, 2),
        ([good, missing, bad], dict(), direct, mudepth.FileError, 3),
        ([good], dict(output_dir=afile), direct, mudepth.FileError, 3),
    ]
    for k, (inputs, extra, args, error, status) in enumerate(cases):
        out_py, out_cli = str(tmp_path / f"py{k}"), str(tmp_path / f"cli{k}")
        kwargs = dict(output_dir=out_py, specimen=cap)
        kwargs.update(extra)
        with pytest.raises(error) as e:
            mudepth.correct_files(inputs, **kwargs)
        cli_out = afile if "output_dir" in extra else out_cli
        s, message = _cli_correct_error(*inputs, *args, "--output-dir", cli_out)
        assert s == status
        assert str(e.value) == message.replace(out_cli, kwargs["output_dir"])
        if len(inputs) > 1:
            assert [r["outcome"] for r in e.value.results][0] == "written"
    # The empty-container file among the inputs refuses the whole batch.
    wall = cap.with_wall(wall_mu_R=0.1, radius_ratio=1.1)
    with pytest.raises(mudepth.InputError) as e:
        mudepth.correct_files([good], output_dir=str(tmp_path / "e"), specimen=wall, empty=good)
    _, message = _cli_correct_error(good, *direct, "--mu-r-container", 0.1, "--radius-ratio", 1.1, "--empty", good,
                                    "--output-dir", tmp_path / "e")
    assert str(e.value) == message
    # An existing output: the same message but for how to ask for replacement.
    mudepth.correct_files(good, output_dir=str(tmp_path / "x"), specimen=cap)
    with pytest.raises(mudepth.FileError, match="exists; give force=True to replace it"):
        mudepth.correct_files(good, output_dir=str(tmp_path / "x"), specimen=cap)
    _, message = _cli_correct_error(good, *direct, "--output-dir", tmp_path / "x")
    assert message.endswith("exists; give --force to replace it")


def test_raise_on_error_false_returns_every_outcome(tmp_path):
    good = _scan(tmp_path / "good.xy", [(10, 100, 10), (20, 200, 14)])
    r = mudepth.correct_files([good, str(tmp_path / "missing.xy")], output_dir=str(tmp_path / "o"),
                              specimen=mudepth.capillary_from_mu_R(1.0), raise_on_error=False, jobs=1)
    assert [x["outcome"] for x in r] == ["written", "file_error"]
    assert r[1]["error"].endswith("missing.xy: cannot read: No such file or directory")
    assert r[1]["correction_min"] is None and r[1]["read_summary"] is None
    assert not os.path.exists(r[1]["output"])


@pytest.mark.parametrize("call,error,text", [
    (lambda p: mudepth.correct_files(p, output_dir="o", specimen="cylinder"), TypeError, "CapillarySpecimen"),
    (lambda p: mudepth.correct_files(3.0, output_dir="o", specimen=mudepth.capillary_from_mu_R(1)), TypeError,
     "paths"),
    (lambda p: mudepth.correct_files(p, output_dir="o", specimen=mudepth.capillary_from_mu_R(1),
                                     normalization="mean"), ValueError, "normalisation"),
    (lambda p: mudepth.correct_files(p, output_dir="o", specimen=mudepth.capillary_from_mu_R(1), empty=p),
     ValueError, "needs the cylinder geometry with its container wall"),
    (lambda p: mudepth.correct_files([], output_dir="o", specimen=mudepth.capillary_from_mu_R(1)), ValueError,
     "no pattern file given"),
    (lambda p: mudepth.correction_factors([10.0], mudepth.capillary_from_mu_R(1), mu_R=2.0), ValueError,
     "carries its own"),
    (lambda p: mudepth.correction_factors([10.0], 3), TypeError, "geometry"),
])
def test_refusals(tmp_path, call, error, text):
    with pytest.raises(error, match=text):
        call(_scan(tmp_path / "s.xy", [(10, 1)]))


@pytest.mark.parametrize("call,args", [
    (lambda: mudepth.capillary_from_mu_R(0.0), ("cylinder", "--mu-r", 0)),
    (lambda: mudepth.capillary_from_mu_R(40.0), ("cylinder", "--mu-r", 40)),
    (lambda: mudepth.capillary(mudepth.material("Pb", 11.34), CU, 0.1),
     ("cylinder", "--formula", "Pb", "--density", 11.34, "--source", "Cu", "--diameter", 1)),
    (lambda: mudepth.plate_from_mu_t(0.0), ("plate", "--mu-t", 0)),
])
def test_specimen_refusals_carry_the_library_message(call, args):
    # The command line names its option first (`--mu-r: ...`); the library's part is the same text.
    _, message = cli_error(*args, "--two-theta", 30)
    with pytest.raises(ValueError) as e:
        call()
    assert message.endswith(str(e.value)), (message, str(e.value))


def test_specimen_argument_refusals():
    with pytest.raises(ValueError, match="needs the capillary's inner diameter"):
        mudepth.capillary_from_mu_R(1.0).with_wall(GLASS, 0.001)
    with pytest.raises(ValueError, match="reflection only"):
        mudepth.plate_from_mu_t(1.0, "transmission-normal").with_incidence(5.0)
    with pytest.raises(ValueError, match="must be above 1"):
        mudepth.capillary_from_mu_R(1.0).with_wall(wall_mu_R=0.1, radius_ratio=0.9)
    with pytest.raises(ValueError, match="unknown plate mode|transmission"):
        mudepth.plate_from_mu_t(1.0, "transmission")


def test_correct_pattern_takes_a_specimen():
    tt = np.arange(10.0, 150.1, 5.0)
    i = np.linspace(1000, 400, tt.size)
    c = CAPILLARIES["direct-wall"][0]()
    by_specimen = mudepth.correct_pattern(tt, i, np.sqrt(i), geometry=c, normalization="max")
    by_numbers = mudepth.correct_pattern(tt, i, np.sqrt(i), geometry="cylinder", mu_R=1.3, mu_R_container=0.2,
                                         radius_ratio=1.1, normalization="max")
    for key in ("intensity", "sigma", "correction"):
        assert list(by_specimen[key]) == list(by_numbers[key])
