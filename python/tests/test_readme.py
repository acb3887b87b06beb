"""The five-line example of docs/python.md and of the README runs and prints what the pages show."""
import os
import re
import subprocess
import sys

import pytest

np = pytest.importorskip("numpy")
from conftest import ROOT  # noqa: E402


PAGES = {"docs/python.md": "## Five-line example", "README.md": "## From Python"}


def blocks(page):
    text = open(os.path.join(ROOT, page), encoding="utf-8").read()
    section = text.split(PAGES[page], 1)[1].split("\n## ", 1)[0]
    code = re.search(r"```python\n(.*?)```", section, re.S).group(1)
    output = re.search(r"```text\n(.*?)```", section, re.S).group(1)
    return code, output


@pytest.mark.parametrize("page", PAGES)
def test_example_has_five_lines(page):
    code, _ = blocks(page)
    assert len(code.strip().splitlines()) == 5


@pytest.mark.parametrize("page", PAGES)
def test_example_prints_what_the_page_shows(page):
    code, output = blocks(page)
    p = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, timeout=60, env=os.environ)
    assert p.returncode == 0, p.stderr
    assert p.stdout == output


def test_python_demo_runs(tmp_path):
    """examples/python_demo.py: the numbers, the corrected files (plot only with matplotlib)."""
    script = os.path.join(ROOT, "examples", "python_demo.py")
    p = subprocess.run([sys.executable, script, str(tmp_path)], capture_output=True, text=True, timeout=300,
                       env=os.environ)
    assert p.returncode == 0, p.stderr
    assert "Corrected 13 invented pattern files" in p.stdout
    assert (tmp_path / "python_corrected" / "tw118_capillary.corrected.xye").exists()
    assert len(list((tmp_path / "python_corrected" / "insitu").glob("tw205_insitu_*.corrected.csv"))) == 12
