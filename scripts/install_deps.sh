#!/usr/bin/env bash
# Installs what colligate needs on a fresh Debian machine: the C++ toolchain, Eigen,
# Boost and Catch2 from Debian, and the Python build and test packages from PyPI.
set -euo pipefail
SUDO=""
if [ "$(id -u)" != "0" ]; then SUDO="sudo"; fi
need=""
for pkg in g++ cmake ninja-build libeigen3-dev libboost-dev catch2 python3-dev python3-pip; do
  dpkg -s "$pkg" >/dev/null 2>&1 || need="$need $pkg"
done
if [ -n "$need" ]; then
  export DEBIAN_FRONTEND=noninteractive
  $SUDO apt-get update -qq
  # shellcheck disable=SC2086
  $SUDO apt-get install -y -qq $need >/dev/null
fi
python3 -m pip install -q "scikit-build-core>=0.10" "pybind11==3.1.0" "cmake>=3.20" ninja numpy pandas matplotlib
if [ "${1:-}" = "--test" ]; then
  python3 -m pip install -q "pytest>=7" "hypothesis>=6" "nbmake>=1.4" "scipy>=1.8" \
    "pybind11-stubgen==3.0.0" ipykernel numpy pandas matplotlib CoolProp \
    "dask[dataframe,distributed]" gsw
fi
