#!/usr/bin/env bash
# Fresh machine -> installed colligate -> the built-in demo report and plot.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/install_deps.sh
CMAKE_BUILD_PARALLEL_LEVEL=2 python3 -m pip install -q --no-build-isolation .
colligate demo
