#!/usr/bin/env bash
# Sets up, builds and designs the demo slabs of a small community workshop
# building: the first floor (shorthand loads) and its store room and
# balcony strip (named actions: a partition wall, a kiln, stacked timber, a
# planter; an exposed top face; support widths), and the first floor of its
# US sister building (ACI 318-19, US variant: inches, psf, the summary and
# record in US units), its ground floor as a two-way slab on walls (a
# kiln and a timber rack placed in plan), and its studio wing's upper
# floor as a flat slab on columns with a wall along one side (punching at
# every column). Prints each summary and
# writes each result JSON and calculation record to out/.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/setup.sh
mkdir -p out
worst=0
for name in workshop-first-floor workshop-store-and-balcony workshop-us-first-floor workshop-ground-floor-two-way workshop-studio-floor-flat; do
  request="examples/$name.json"
  echo "=== $request"
  set +e
  build/bin/armature design "$request"
  status=$?
  build/bin/armature design --json "$request" --report "out/$name.html" >"out/$name.result.json"
  set -e
  echo
  echo "Result JSON written to out/$name.result.json"
  echo "Calculation record written to out/$name.html"
  echo
  [ "$status" -le "$worst" ] || worst=$status
done
# Exit 1 is a design that fails a check (reported above), not an error.
[ "$worst" -le 1 ] || exit "$worst"
