#!/usr/bin/env bash
# Sets up, builds and designs the demo slab: the first floor of a small
# community workshop building. Prints the summary and writes the result JSON.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/setup.sh
request=examples/workshop-first-floor.json
mkdir -p out
set +e
build/bin/armature design "$request"
status=$?
build/bin/armature design --json "$request" --report out/workshop-first-floor.html \
  >out/workshop-first-floor.result.json
set -e
echo
echo "Result JSON written to out/workshop-first-floor.result.json"
echo "Calculation record written to out/workshop-first-floor.html"
[ "$status" -le 1 ] || exit "$status"
