#!/usr/bin/python3
"""Benchmark of the Python module against the same work in C++.

10^6 energies (5..50 keV) through mu/rho of Fe2O3 and 10^5 angles (0..180 deg)
through the capillary factor at muR = 1, timed from Python, against
tests/bench/bench_python_baseline, which runs the identical loop in C++ (the binding's
energy check included). The two are measured in alternating rounds and the best time
of each is kept, so that load from other processes affects both alike.
Target: Python within 10 % of C++ (no per-element overhead).

Usage: PYTHONPATH=BUILD/python/module /usr/bin/python3 python/bench_python.py [BUILD]
"""
import os
import subprocess
import sys
import time

import numpy as np

import mudepth

ROUNDS, REPEATS = 5, 5


def best_seconds(f):
    best = float("inf")
    for _ in range(REPEATS):
        t0 = time.perf_counter()
        f()
        best = min(best, time.perf_counter() - t0)
    return best


def main():
    build = sys.argv[1] if len(sys.argv) > 1 else os.environ.get("MUDEPTH_BUILD_DIR", "build")
    baseline = os.path.join(build, "tests", "bench", "bench_python_baseline")
    sample = mudepth.material("Fe2O3", density_g_cm3=5.24, packing_fraction=0.6)
    energies = np.linspace(5.0, 50.0, 1_000_000)
    angles = np.linspace(0.0, 180.0, 100_000)
    tasks = {
        "mass_attenuation_1e6": lambda: mudepth.mass_attenuation_cm2_g(sample, energies),
        "cylinder_transmission_1e5": lambda: mudepth.cylinder_transmission(1.0, angles),
    }
    py = dict.fromkeys(tasks, float("inf"))
    cpp = dict.fromkeys(tasks, float("inf"))
    for _ in range(ROUNDS):
        for k, f in tasks.items():
            py[k] = min(py[k], best_seconds(f))
        out = subprocess.run([baseline, str(REPEATS)], capture_output=True, text=True, check=True).stdout
        for line in out.splitlines():
            name, value = line.split()[:2]
            if name in cpp:
                cpp[name] = min(cpp[name], float(value))
    print(f"{'task':28s} {'Python (s)':>11s} {'C++ (s)':>11s} {'Python/C++':>11s}")
    for k in tasks:
        print(f"{k:28s} {py[k]:11.4f} {cpp[k]:11.4f} {py[k] / cpp[k]:11.3f}")


if __name__ == "__main__":
    main()
