#!/usr/bin/env bash
# The demo: builds mudepth from scratch in build/ (installing missing Debian
# packages first) and runs it on the samples of an invented lab, the fictional
# Tarnwick Institute powder lab. Every sample and batch name here is invented.
set -euo pipefail
cd "$(dirname "$0")/.."
source tests/deps.sh
mudepth_install_deps build
jobs="${MUDEPTH_JOBS:-$(nproc)}"
rm -rf build
cmake -S . -B build -DCMAKE_BUILD_TYPE=Release -DMUDEPTH_BUILD_TESTS=OFF -DMUDEPTH_BUILD_BENCH=OFF >/dev/null
cmake --build build -j"$jobs" --target mudepth_cli >/dev/null
mudepth=build/mudepth
out=examples/output
mkdir -p "$out"

step() { printf '\n\033[1m== %s\033[0m\n$ mudepth %s\n' "$1" "${*:2}"; "$mudepth" "${@:2}"; }

echo "Tarnwick Institute powder lab (fictional): planning this week's samples."

step "TW-041, cobalt ferrite nanopowder, loosely packed, on the Cu tube" \
    mu --formula CoFe2O4 --density 5.29 --packing 0.5 --source Cu

step "The same powder on the Co tube: Co Kα lies below the Fe K edge" \
    mu --formula CoFe2O4 --density 5.29 --packing 0.5 --source Co

step "TW-052 cathode with its 20 wt% Si internal standard (the lab's own composition file), Mo tube" \
    mu --material examples/compositions/tarnwick-cathode-with-si.toml --packing 0.5 --source Mo

step "TW-063 invented hydrate (C14H12N2O3·2H2O), diluted 1:1 by volume with corundum: transmission of a 0.5 mm plate at 17.479 keV" \
    mu --phase "C14H12N2O3·2H2O,1.38,0.5" --phase "corundum,0.5" --phase-basis volume --packing 0.6 \
       --energy 17.479 --thickness 0.5mm

step "Both cross-section tables for the cobalt ferrite at the beamline's 25 keV" \
    mu --formula CoFe2O4 --density 5.29 --packing 0.5 --energy 25 --table chantler

echo
echo "== Choosing a beamline energy for TW-041: mu across the Fe and Co K edges"
"$mudepth" scan --formula CoFe2O4 --density 5.29 --packing 0.5 --from 6 --to 9 --steps 13 --spacing linear
"$mudepth" scan --formula CoFe2O4 --density 5.29 --packing 0.5 --from 5 --to 60 --steps 200 --csv \
    --plot "$out/tw041_scan.svg" > "$out/tw041_scan.csv"
echo "(200-point scan written to $out/tw041_scan.csv, plotted in $out/tw041_scan.svg)"

step "Capillary and window materials in the built-in library" materials

# The geometry parts of the scenario, one fragment per command.
for part in depth film plate cylinder correct filter plan; do
    if [ -f "examples/demo_$part.sh" ]; then
        source "examples/demo_$part.sh"
    fi
done
echo
echo "Plots and tables written to $out/"
