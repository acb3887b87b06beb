#!/usr/bin/env bash
# Builds mudepth from scratch and runs every test (unit, outside references, end
# to end, the find_package consumer). Installs missing Debian packages first.
# Set MUDEPTH_JOBS to limit parallelism.
#   tests/run.sh                    Release build in build/, the whole suite
#   tests/run.sh --sanitize         the suite again with address and undefined-behaviour
#                                   sanitizers, in build-asan/
#   tests/run.sh --fuzz [SECONDS]   builds the libFuzzer targets with clang in build-fuzz/
#                                   and runs each on its seed corpus (default 30 s)
set -euo pipefail
cd "$(dirname "$0")/.."
source tests/deps.sh
mudepth_install_deps test
jobs="${MUDEPTH_JOBS:-$(nproc)}"
mode="${1:-}"

case "$mode" in
"")
    rm -rf build
    cmake -S . -B build -DCMAKE_BUILD_TYPE=Release -DMUDEPTH_WARNINGS_AS_ERRORS=ON
    cmake --build build -j"$jobs"
    ctest --test-dir build --output-on-failure -j"$jobs"
    ;;
--sanitize)
    # The Python module and the installed-package consumer are left out: both
    # load or link the library outside the sanitizer runtime.
    rm -rf build-asan
    cmake -S . -B build-asan -DCMAKE_BUILD_TYPE=Release -DMUDEPTH_SANITIZE=ON -DMUDEPTH_WARNINGS_AS_ERRORS=ON \
          -DMUDEPTH_BUILD_PYTHON=OFF -DMUDEPTH_BUILD_BENCH=OFF
    cmake --build build-asan -j"$jobs"
    export ASAN_OPTIONS="detect_leaks=1:abort_on_error=1:strict_string_checks=1"
    export UBSAN_OPTIONS="print_stacktrace=1:halt_on_error=1"
    ctest --test-dir build-asan --output-on-failure -j"$jobs" -E '^consumer_find_package$'
    ;;
--fuzz)
    seconds="${2:-30}"
    cmake -S tests/fuzz -B build-fuzz -DCMAKE_CXX_COMPILER=clang++-14 -DMUDEPTH_WARNINGS_AS_ERRORS=ON
    cmake --build build-fuzz -j"$jobs"
    # Each target on a scratch copy of its seeds, two at a time; any crash fails.
    work="$(mktemp -d)"
    trap 'rm -rf "$work"' EXIT
    run_one() {
        local t="$1"
        mkdir -p "$work/$t/corpus" "$work/$t/artifacts"
        if ! build-fuzz/fuzz_"$t" "$work/$t/corpus" "tests/fuzz/corpus/$t" -max_total_time="$seconds" \
                -timeout=10 -max_len=4096 -print_final_stats=1 -artifact_prefix="$work/$t/artifacts/" \
                </dev/null >"$work/$t/log" 2>&1; then
            tail -n 40 "$work/$t/log"
            echo "fuzz_$t failed; the input is in $(ls "$work/$t/artifacts/"* 2>/dev/null)" >&2
            cp -r "$work/$t/artifacts" "build-fuzz/failed-$t" 2>/dev/null || true
            return 1
        fi
        printf 'fuzz_%-12s %10s runs %8s exec/s\n' "$t" \
            "$(sed -n 's/^stat::number_of_executed_units: *//p' "$work/$t/log")" \
            "$(sed -n 's/^stat::average_exec_per_sec: *//p' "$work/$t/log")"
    }
    targets=()
    for f in build-fuzz/fuzz_*; do [ -x "$f" ] && targets+=("${f#build-fuzz/fuzz_}"); done
    status=0
    for ((i = 0; i < ${#targets[@]}; i += 2)); do
        pids=()
        for t in "${targets[@]:i:2}"; do run_one "$t" & pids+=($!); done
        for p in "${pids[@]}"; do wait "$p" || status=1; done
    done
    exit $status
    ;;
*)
    echo "usage: tests/run.sh [--sanitize | --fuzz [SECONDS]]" >&2
    exit 2
    ;;
esac
