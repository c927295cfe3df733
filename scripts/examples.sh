#!/usr/bin/env bash
# Builds and runs the C++ embedding example two ways and checks its output against the
# Python package (examples/cpp/check_output.py: freezing point within 1e-12 K):
#   1. against an installed colligate (cmake --install ... --component dev, find_package);
#   2. from the source tree with FetchContent.
# Needs the project environment with colligate installed (scripts/test.sh makes it).
set -euo pipefail
cd "$(dirname "$0")/.."
ROOT="$PWD"
source scripts/common.sh
use_env
install_colligate

launcher=()
command -v ccache >/dev/null 2>&1 && launcher=(-DCMAKE_CXX_COMPILER_LAUNCHER=ccache)
B="$ROOT/build/examples"
rm -rf "$B"
echo "== examples: install colligate (headers and CMake package) into $B/prefix"
cmake -S . -B "$B/lib" -G Ninja -DCOLLIGATE_BUILD_TESTS=OFF >/dev/null
cmake --install "$B/lib" --prefix "$B/prefix" --component dev >/dev/null

echo "== examples: find_package(colligate) against the installed tree"
cmake -S examples/cpp/installed -B "$B/installed" -G Ninja "${launcher[@]}" \
  -DCMAKE_PREFIX_PATH="$B/prefix" >/dev/null
cmake --build "$B/installed" -j2
"$B/installed/embed_example" | tee "$B/installed.txt"
"$PY" examples/cpp/check_output.py "$B/installed.txt"

echo "== examples: FetchContent on the source tree"
cmake -S examples/cpp/fetch_content -B "$B/fetch" -G Ninja "${launcher[@]}" >/dev/null
cmake --build "$B/fetch" -j2
"$B/fetch/embed_example" | tee "$B/fetch.txt"
"$PY" examples/cpp/check_output.py "$B/fetch.txt"
echo "== examples: both builds agree with the Python package"
