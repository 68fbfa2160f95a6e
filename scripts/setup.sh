#!/usr/bin/env bash
# Installs the Debian packages armature needs (when run as root) and
# configures and builds it in ./build. PYTHON overrides /usr/bin/python3.
set -euo pipefail
cd "$(dirname "$0")/.."

PYTHON="${PYTHON:-/usr/bin/python3}"
packages=(g++ cmake make pkg-config nlohmann-json3-dev libboost-dev libeigen3-dev catch2 pybind11-dev
          python3-dev python3-pybind11 python3-pytest python3-numpy python3-pandas
          python3-matplotlib python3-nbformat python3-nbclient python3-ipykernel
          python3-distributed python3-dask python3-venv python3-pip python3-setuptools)

missing=()
for p in "${packages[@]}"; do
  dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed" || missing+=("$p")
done
if [ ${#missing[@]} -gt 0 ]; then
  if [ "$(id -u)" -eq 0 ] && command -v apt-get >/dev/null; then
    echo "setup: installing ${missing[*]}"
    export DEBIAN_FRONTEND=noninteractive
    apt-get update -qq
    apt-get install -y -qq --no-install-recommends "${missing[@]}" >/dev/null
  else
    echo "setup: missing Debian packages; install them with:" >&2
    echo "  sudo apt-get install ${missing[*]}" >&2
    exit 1
  fi
fi

werror=OFF
[ "${CI:-}" = "true" ] && werror=ON
cmake -S . -B build -DCMAKE_BUILD_TYPE=Release -DARMATURE_WERROR="$werror" \
      -DPython3_EXECUTABLE="$PYTHON" >build-configure.log 2>&1 || { cat build-configure.log; exit 1; }
cmake --build build -j"$(nproc)"
