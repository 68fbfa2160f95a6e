#!/usr/bin/env bash
# Sets up, builds and runs every test: Catch2 through ctest, then pytest.
set -euo pipefail
cd "$(dirname "$0")/.."
PYTHON="${PYTHON:-/usr/bin/python3}"
bash scripts/setup.sh
(cd build && ctest --output-on-failure -j"$(nproc)")
PYTHONPATH="$PWD/build/python" "$PYTHON" -m pytest -q tests/python
