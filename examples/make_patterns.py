#!/usr/bin/env python3
"""Writes the INVENTED pattern files of the demo scenario (the fictional Tarnwick
Institute powder lab) into the folder given as the first argument.

Every file here is synthetic: Gaussian peaks at made-up positions on a smooth
background, with Poisson-like noise from a fixed seed. They are for showing the
`correct` command, not measurements of any real sample.
"""
import math
import os
import random
import sys

out = sys.argv[1] if len(sys.argv) > 1 else "examples/output/patterns"
os.makedirs(out, exist_ok=True)
rng = random.Random(118)

PEAKS = [(19.0, 900), (31.3, 2600), (36.9, 5200), (44.8, 1500), (55.7, 800), (59.4, 1900), (65.2, 2800)]


def intensity(t, scale=1.0, shift=0.0):
    y = 300 + 2000 * math.exp(-t / 12)  # background
    for pos, height in PEAKS:
        y += scale * height * math.exp(-((t - pos - shift) / 0.12) ** 2)
    return y


def noisy(y):
    return max(0.0, y + rng.gauss(0, math.sqrt(y)))


def grid(start, stop, step):
    n = int(round((stop - start) / step))
    return [start + i * step for i in range(n + 1)]


# TW-118 (invented cobalt-blue pigment) in a 0.5 mm capillary: 2theta, counts, sigma, white space.
with open(os.path.join(out, "tw118_capillary.xye"), "w") as f:
    f.write("# Tarnwick Institute (fictional) -- TW-118, invented synthetic pattern, Mo Ka, 0.5 mm capillary\n")
    f.write("# 2theta(deg)  counts  sigma\n")
    for t in grid(5, 70, 0.01):
        y = noisy(intensity(t))
        f.write(f"{t:.2f} {y:.1f} {math.sqrt(max(y, 1)):.2f}\n")

# The same capillary, empty (borosilicate wall only): a broad glass hump, its own grid.
with open(os.path.join(out, "tw118_empty_capillary.xye"), "w") as f:
    f.write("# Tarnwick Institute (fictional) -- empty borosilicate capillary, invented synthetic scan\n")
    for t in grid(4, 72, 0.02):
        y = noisy(150 + 260 * math.exp(-((t - 10) / 6) ** 2) + 90 * math.exp(-((t - 22) / 9) ** 2))
        f.write(f"{t:.2f} {y:.1f} {math.sqrt(max(y, 1)):.2f}\n")

# An in-situ heating series of TW-205 (invented) on a flat plate, exported by a lab PC with
# semicolons and decimal commas, Windows line ends: 12 files.
for k in range(12):
    name = os.path.join(out, f"tw205_insitu_{k:02d}.csv")
    with open(name, "w", newline="") as f:
        f.write(f"Tarnwick Institute (fictional);TW-205 invented in-situ step {k};T = {25 + 25 * k} C\r\n")
        f.write("2Theta;Intensity\r\n")
        for t in grid(10, 80, 0.02):
            y = noisy(intensity(t, scale=1 - 0.03 * k, shift=-0.004 * k))
            f.write(f"{t:.2f};{y:.1f}".replace(".", ",") + "\r\n")

# TW-063 (invented) as a pdCIF with the 2theta range given as start / increment / count.
ts = grid(5, 60, 0.02)
with open(os.path.join(out, "tw063_transmission.cif"), "w") as f:
    f.write("#\\#CIF_1.1\n# Tarnwick Institute (fictional): TW-063, invented synthetic pattern\n")
    f.write("data_tw063_invented\n_pd_block_id 'TW-063|invented|synthetic'\n")
    f.write("_diffrn_radiation_wavelength 0.5594\n")
    f.write(f"_pd_meas_2theta_range_min {ts[0]:.2f}\n_pd_meas_2theta_range_inc 0.02\n")
    f.write(f"_pd_meas_number_of_points {len(ts)}\n")
    f.write("loop_\n_pd_meas_counts_total\n")
    for t in ts:
        y = noisy(intensity(t, scale=0.4))
        f.write(f"{y:.0f}({max(1, round(math.sqrt(y)))})\n")

print(f"invented patterns written to {out}/")
