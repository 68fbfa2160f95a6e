#!/usr/bin/env bash
# Fuzzes the request entry point and the NDP data files with libFuzzer
# (clang, AddressSanitizer + UndefinedBehaviorSanitizer) for SECONDS in all
# (default 600), split between the two targets. New inputs go to
# build-fuzz/corpus-*; copy the interesting ones into tests/fuzz/corpus/.
set -euo pipefail
cd "$(dirname "$0")/.."
seconds="${1:-600}"
if [ "$(id -u)" -eq 0 ] && ! command -v clang++ >/dev/null; then
  apt-get update -qq && apt-get install -y -qq clang libclang-rt-14-dev >/dev/null
fi
cmake -S . -B build-fuzz -DCMAKE_BUILD_TYPE=RelWithDebInfo -DCMAKE_CXX_COMPILER=clang++ \
      -DARMATURE_PYTHON=OFF -DARMATURE_TESTS=OFF -DARMATURE_FUZZ=ON \
      -DARMATURE_SANITIZE="address,undefined" >build-fuzz.log 2>&1 || { cat build-fuzz.log; exit 1; }
cmake --build build-fuzz -j"$(nproc)" --target armature_fuzz_request armature_fuzz_ndp armature_code_en1992 armature_code_aci318
half=$(( seconds / 2 ))
for target in request ndp; do
  mkdir -p "build-fuzz/corpus-$target"
  echo "fuzzing $target for ${half} s"
  ASAN_OPTIONS=detect_leaks=1 build-fuzz/bin/armature_fuzz_$target \
    -max_total_time="$half" -max_len=8192 -timeout=10 -print_final_stats=1 \
    "build-fuzz/corpus-$target" "tests/fuzz/corpus/$target" 2>&1 | tail -n 12
done
