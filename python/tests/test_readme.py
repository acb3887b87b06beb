"""The five-line example of docs/python.md runs and prints what the page shows."""
import os
import re
import subprocess
import sys

import pytest

np = pytest.importorskip("numpy")
from conftest import ROOT  # noqa: E402


def blocks():
    text = open(os.path.join(ROOT, "docs", "python.md"), encoding="utf-8").read()
    section = text.split("## Five-line example", 1)[1]
    code = re.search(r"```python\n(.*?)```", section, re.S).group(1)
    output = re.search(r"```text\n(.*?)```", section, re.S).group(1)
    return code, output


def test_example_has_five_lines():
    code, _ = blocks()
    assert len(code.strip().splitlines()) == 5


def test_example_prints_what_the_page_shows():
    code, output = blocks()
    p = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, timeout=60, env=os.environ)
    assert p.returncode == 0, p.stderr
    assert p.stdout == output
