#!/usr/bin/env bash
# Prints the speed figures: C++ designs on one core (Google Benchmark), then
# Python design_many on 1 and 2 threads and sweep. N (default 100000) is the
# number of Python designs. Figures only; nothing is asserted.
set -euo pipefail
cd "$(dirname "$0")/.."
PYTHON="${PYTHON:-/usr/bin/python3}"
if [ "$(id -u)" -eq 0 ] && ! dpkg-query -W -f='${Status}' libbenchmark-dev 2>/dev/null | grep -q "ok installed"; then
  apt-get update -qq && apt-get install -y -qq libbenchmark-dev >/dev/null
fi
bash scripts/setup.sh >/dev/null
cmake -S . -B build >/dev/null && cmake --build build -j"$(nproc)" --target armature_bench >/dev/null
build/bin/armature_bench --benchmark_min_time=0.2
PYTHONPATH="$PWD/build/python" "$PYTHON" tests/bench/bench_python.py "${1:-100000}"
