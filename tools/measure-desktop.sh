#!/usr/bin/env bash
# Desktop start-up time, idle memory and binary size of a release build, for each of
# Slint's winit renderers (chosen at run time with SLINT_BACKEND). Figures: BENCHMARKS.md.
# The desktop build compiles the software renderer only; BACKENDS=winit-femtovg measures
# the OpenGL one on a build that has it.
#
#   cargo build --release && tools/measure-desktop.sh [BINARY] [RUNS]
#
# Needs Xvfb (Debian: apt-get install xvfb) and, for the OpenGL renderer without a GPU,
# Mesa's software OpenGL (libgl1-mesa-dri). Start to first frame is the wall time of
# `TURNSHEET_EXIT_AFTER_FIRST_FRAME=1 turnsheet` (the app quits once its first frame is
# presented; process start and exit are included). Idle RSS is read from /proc three
# seconds after start.
set -euo pipefail
bin=${1:-target/release/turnsheet}
runs=${2:-15}
backends=${BACKENDS:-winit-software}
display=:${DISPLAY_NUMBER:-77}

Xvfb "$display" -screen 0 1280x1024x24 -nolisten tcp >/dev/null 2>&1 &
xvfb=$!
data=$(mktemp -d)
stripped=$(mktemp)
trap 'kill $xvfb 2>/dev/null; rm -rf "$data" "$stripped"' EXIT
sleep 1
export DISPLAY=$display TURNSHEET_DATA_DIR=$data

strip -o "$stripped" "$bin"
echo "binary $bin: $(stat -c %s "$bin") bytes, stripped $(stat -c %s "$stripped") bytes"

first_frame_ms() {
    local t0 t1
    t0=$(date +%s%N)
    SLINT_BACKEND=$1 TURNSHEET_EXIT_AFTER_FIRST_FRAME=1 timeout 30 "$bin" >/dev/null 2>&1
    t1=$(date +%s%N)
    echo $(((t1 - t0) / 1000000))
}

for backend in $backends; do
    first_frame_ms "$backend" >/dev/null # warm the page cache; the first launch writes settings
    times=()
    for _ in $(seq "$runs"); do
        times+=("$(first_frame_ms "$backend")")
    done
    sorted=$(printf '%s\n' "${times[@]}" | sort -n | tr '\n' ' ')
    median=$(printf '%s\n' "${times[@]}" | sort -n | awk '{a[NR]=$1} END {print a[int((NR+1)/2)]}')
    SLINT_BACKEND=$backend "$bin" >/dev/null 2>&1 &
    pid=$!
    sleep 3
    rss=$(awk '/VmRSS/ {print $2}' "/proc/$pid/status")
    kill "$pid"
    wait "$pid" 2>/dev/null || true
    echo "$backend: start to first frame median ${median} ms over $runs runs (${sorted% }), idle RSS $((rss / 1024)) MB"
done
