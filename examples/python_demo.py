#!/usr/bin/python3
"""Part of the demo scenario in Python: the fictional Tarnwick Institute powder lab.

The institute, its samples TW-118 (a cobalt-blue pigment, taken as CoAl2O4) and TW-N7
(a TiAlN-type coating, taken as Ti0.5Al0.5N) and their numbers are invented for the
demonstration. Reproduces the capillary and depth steps of examples/demo_cylinder.sh and
demo_depth.sh with the Python module, corrects the invented TW-118 and TW-205 pattern files
as demo_correct.sh does (the same files as `mudepth correct` writes), and draws the capillary
and depth curves with matplotlib when Debian's python3-matplotlib is installed (the numbers
and files are made either way).

Run: PYTHONPATH=build/python/module /usr/bin/python3 examples/python_demo.py [OUTPUT_DIR]
"""
import glob
import os
import subprocess
import sys

import numpy as np

import mudepth

out = sys.argv[1] if len(sys.argv) > 1 else os.path.join(os.path.dirname(os.path.abspath(__file__)), "output")

# TW-118 in a 0.5 mm capillary under the Mo tube, with and without a 10 µm borosilicate wall.
mo = mudepth.radiation_from_source("Mo")
tw118 = mudepth.material("CoAl2O4", density_g_cm3=4.4, packing_fraction=0.5)
glass = mudepth.find_composition("borosilicate-3.3").material
capillary = mudepth.capillary(tw118, mo, inner_diameter_cm=0.05)
in_glass = capillary.with_wall(glass, wall_thickness_cm=10e-4)
two_theta = np.arange(2.0, 150.0 + 1e-9, 0.05)
a = mudepth.cylinder_transmission(capillary.mu_R, two_theta)
f = mudepth.container_factors(in_glass.mu_R, in_glass.wall.mu_R, in_glass.wall.radius_ratio, two_theta)
print(f"TW-118, {mo.label} ({mo.energy_keV:.4f} keV): mu = {capillary.mu_per_cm:.3f} 1/cm, "
      f"muR = {capillary.mu_R:.4f}, wall muR = {in_glass.wall.mu_R:.4f}")
print(f"{'2theta (deg)':>12} {'A*':>8} {'A_s,sc':>8} {'A_c,sc':>8} {'A_c,c':>8}")
for t in (10, 50, 90, 130, 150):
    i = int(round((t - 2.0) / 0.05))
    print(f"{t:12.0f} {1 / a[i]:8.4f} {f['A_s_sc'][i]:8.4f} {f['A_c_sc'][i]:8.4f} {f['A_c_c'][i]:8.4f}")

# TW-N7 at its 2θ = 37.4°: depth versus incidence through the critical angle, Cu tube.
cu = mudepth.radiation_from_source("Cu")
tw_n7 = mudepth.depth_sample(mudepth.material("Ti0.5Al0.5N", density_g_cm3=4.6), cu.energy_keV)
incidence = np.arange(0.02, 6.0 + 1e-9, 0.02)
d = mudepth.depth(tw_n7, 37.4, incidence_deg=incidence)
alpha_c = mudepth.critical_angle_deg(tw_n7.optics.delta)
target = mudepth.angle_for_depth(tw_n7, [37.4, 43.5, 63.2], 0.2)
print(f"\nTW-N7, {cu.label}: critical angle {alpha_c:.4f} deg")
for t, inc in zip((37.4, 43.5, 63.2), target["incidence_deg"]):
    print(f"  2theta {t:5.1f} deg: incidence {inc:.4f} deg probes a 1/e depth of 200 nm")

# The invented pattern files of demo_correct.sh, corrected as `mudepth correct` does.
patterns = os.path.join(out, "patterns")
if not os.path.exists(os.path.join(patterns, "tw118_capillary.xye")):
    subprocess.run([sys.executable, os.path.join(os.path.dirname(os.path.abspath(__file__)), "make_patterns.py"),
                    patterns], check=True)
corrected = os.path.join(out, "python_corrected")
done = mudepth.correct_files(os.path.join(patterns, "tw118_capillary.xye"), output_dir=corrected,
                             specimen=in_glass, empty=os.path.join(patterns, "tw118_empty_capillary.xye"), force=True)
series = sorted(glob.glob(os.path.join(patterns, "tw205_insitu_*.csv")))
layer = mudepth.plate(mudepth.material("Fe3O4", density_g_cm3=5.17, packing_fraction=0.55), cu, thickness_cm=10e-4)
done += mudepth.correct_files(series, output_dir=os.path.join(corrected, "insitu"), specimen=layer,
                              normalization="max", force=True)
print(f"\nCorrected {len(done)} invented pattern files into {corrected}/")
for r in done[:2]:
    print(f"  {os.path.basename(r['input'])}: correction {r['correction_min']:.4f} to {r['correction_max']:.4f}")

try:
    import matplotlib

    matplotlib.use("Agg")
    import matplotlib.pyplot as plt
except ImportError:
    print("\nmatplotlib not installed (Debian: python3-matplotlib): plots skipped")
    sys.exit(0)

os.makedirs(out, exist_ok=True)
fig, (left, middle, right) = plt.subplots(1, 3, figsize=(16, 4))
left.plot(two_theta, 1 / a, label="A* = 1/A (sample alone)")
for key in ("A_s_sc", "A_c_sc", "A_c_c"):
    left.plot(two_theta, f[key], label=key)
left.set(xlabel="2θ (°)", ylabel="dimensionless", title=f"TW-118 (invented), 0.5 mm capillary, {mo.label}")
left.legend()
measured = mudepth.read_pattern(done[0]["input"])
columns = np.loadtxt(done[0]["output"], comments="#")  # 2θ, I, σ, correction, empty_subtracted
middle.plot(measured["two_theta_deg"], measured["intensity"], lw=0.7, label="measured (sample in capillary)")
middle.plot(columns[:, 0], columns[:, 1], lw=0.7, label="corrected, empty subtracted")
middle.set(xlabel="2θ (°)", ylabel="counts", xlim=(15, 70), title="TW-118 (invented pattern) corrected")
middle.legend()
right.loglog(incidence, d["depth_1e_um"] * 1e3, label="1/e depth")
right.axvline(alpha_c, color="grey", linestyle=":", label="α_c")
right.set(xlabel="incidence α (°)", ylabel="depth (nm)", title=f"TW-N7 (invented) at 2θ = 37.4°, {cu.label}")
right.legend()
fig.tight_layout()
path = os.path.join(out, "python_demo.png")
fig.savefig(path, dpi=120)
print(f"\nPlot: {path}")
