#!/usr/bin/env bash
# Builds mudepth from scratch in build/ and runs every test (unit, outside
# references, end to end, the find_package consumer). Installs missing Debian
# packages first. Set MUDEPTH_JOBS to limit parallelism.
set -euo pipefail
cd "$(dirname "$0")/.."
source tests/deps.sh
mudepth_install_deps test
jobs="${MUDEPTH_JOBS:-$(nproc)}"
rm -rf build
cmake -S . -B build -DCMAKE_BUILD_TYPE=Release -DMUDEPTH_WARNINGS_AS_ERRORS=ON
cmake --build build -j"$jobs"
ctest --test-dir build --output-on-failure -j"$jobs"
