#!/usr/bin/env bash
# AddressSanitizer + UndefinedBehaviorSanitizer build (build-asan) running
# the C++ tests and the Python tests (the Python interpreter runs with the
# sanitizer runtimes preloaded; leak checking is off for it, since the
# interpreter keeps memory to the end by design). Any report fails the run.
set -euo pipefail
cd "$(dirname "$0")/.."
PYTHON="${PYTHON:-/usr/bin/python3}"
cmake -S . -B build-asan -DCMAKE_BUILD_TYPE=RelWithDebInfo -DARMATURE_SANITIZE="address,undefined" \
      -DPython3_EXECUTABLE="$PYTHON" >build-asan.log 2>&1 || { cat build-asan.log; exit 1; }
cmake --build build-asan -j"$(nproc)" 2>&1 | grep -E "error|warning: " || true
cmake --build build-asan -j"$(nproc)" >/dev/null
export UBSAN_OPTIONS=print_stacktrace=1:halt_on_error=1
(cd build-asan && ASAN_OPTIONS=detect_leaks=1 ctest --output-on-failure -j"$(nproc)")
preload="$(gcc -print-file-name=libasan.so):$(gcc -print-file-name=libubsan.so)"
# The pip install, notebook and browser tests build or start other programs and are
# covered by the ordinary run; the rest of the Python suite runs sanitized.
ARMATURE_BUILD_DIR="$PWD/build-asan" LD_PRELOAD="$preload" ASAN_OPTIONS=detect_leaks=0 \
  "$PYTHON" -m pytest -q -p no:cacheprovider tests/python \
  --deselect tests/python/test_install.py::test_pip_install_into_a_venv \
  --deselect tests/python/test_record.py::test_record_renders_in_a_real_browser \
  --ignore tests/python/test_notebooks.py
