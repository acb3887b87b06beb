"""Shared helpers: run the command line and compare its JSON with the module.

The command line is found through MUDEPTH_BINARY (set by the CTest test), else in
build-py/ or build/ of the source tree. numpy is needed by every test module, which
skips itself (pytest.importorskip) when numpy is missing.
"""
import json
import math
import os
import subprocess

import pytest

ROOT = os.environ.get("MUDEPTH_SOURCE_DIR", os.path.abspath(os.path.join(os.path.dirname(__file__), "..", "..")))
PREFIX = "mudepth: error: "


def _binary():
    path = os.environ.get("MUDEPTH_BINARY")
    if path:
        return path
    for build in ("build-py", "build"):
        candidate = os.path.join(ROOT, build, "mudepth")
        if os.access(candidate, os.X_OK):
            return candidate
    return None


BINARY = _binary()


def run_cli(*args):
    """(status, stdout, stderr) of the command line."""
    if BINARY is None:
        pytest.skip("the mudepth binary was not found; set MUDEPTH_BINARY")
    p = subprocess.run([BINARY, *map(str, args)], capture_output=True, text=True, timeout=120)
    return p.returncode, p.stdout, p.stderr


def cli_json(*args):
    status, out, err = run_cli(*args, "--json")
    assert status == 0, err
    return json.loads(out)


def cli_error(*args):
    """The command line's refusal: (exit status, the message after 'mudepth: error: ')."""
    status, out, err = run_cli(*args)
    lines = err.splitlines()
    assert status in (2, 3), (status, out, err)
    assert out == "", out
    assert len(lines) == 1 and lines[0].startswith(PREFIX), err
    return status, lines[0][len(PREFIX):]


def assert_close(actual, expected, rel=1e-12, what=""):
    import numpy as np

    a = np.atleast_1d(np.asarray(actual, dtype=float))
    e = np.atleast_1d(np.asarray([math.nan if v is None else v for v in np.atleast_1d(expected)], dtype=float))
    assert a.shape == e.shape, (what, a.shape, e.shape)
    both_nan = np.isnan(a) & np.isnan(e)
    err = np.where(both_nan, 0.0, np.abs(a - e) / np.maximum(np.abs(e), 1e-300))
    assert np.all(err <= rel), f"{what}: worst relative difference {np.nanmax(err):.3e}"


try:
    import numpy  # noqa: F401

    HAVE_NUMPY = True
except ImportError:
    HAVE_NUMPY = False


def pytest_sessionfinish(session, exitstatus):
    """Without numpy every module skips itself: that is a clean skip, not "no tests" (exit 5).
    Under CTest the status is MUDEPTH_SKIP_STATUS (its SKIP_RETURN_CODE), else 0."""
    if not HAVE_NUMPY and exitstatus in (0, 5):
        session.exitstatus = int(os.environ.get("MUDEPTH_SKIP_STATUS", "0"))
