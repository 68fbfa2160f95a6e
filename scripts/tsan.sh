#!/usr/bin/env bash
# ThreadSanitizer build (build-tsan): designs with mixed codes from several
# threads on one registry, as design_many does, and design_many itself from
# Python (the interpreter runs with the TSan runtime preloaded). Any report
# stops the run with an error.
set -euo pipefail
cd "$(dirname "$0")/.."
PYTHON="${PYTHON:-/usr/bin/python3}"
cmake -S . -B build-tsan -DCMAKE_BUILD_TYPE=RelWithDebInfo -DARMATURE_SANITIZE=thread \
      -DPython3_EXECUTABLE="$PYTHON" >build-tsan.log 2>&1 || { cat build-tsan.log; exit 1; }
cmake --build build-tsan -j"$(nproc)" --target armature_tests armature_python armature_python_sources \
      armature_code_en1992 armature_code_aci318 >/dev/null
export TSAN_OPTIONS="halt_on_error=1 second_deadlock_stack=1"
build-tsan/bin/armature_tests "[threads]"
LD_PRELOAD="$(gcc -print-file-name=libtsan.so)" PYTHONPATH="$PWD/build-tsan/python" \
  "$PYTHON" tests/tsan/design_many.py
