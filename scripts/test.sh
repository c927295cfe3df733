#!/usr/bin/env bash
# Fresh machine -> every test: Catch2 (ctest), the find_package consumer, the stub check,
# pytest (including the notebooks).
set -euo pipefail
cd "$(dirname "$0")/.."
ROOT="$PWD"
bash scripts/install_deps.sh --test
export CMAKE_BUILD_PARALLEL_LEVEL=2

echo "== C++: configure, build, ctest"
cmake -S . -B build/cpp -G Ninja -DCOLLIGATE_BUILD_TESTS=ON >/dev/null
cmake --build build/cpp -j2
ctest --test-dir build/cpp --output-on-failure -j2

echo "== C++: install and build an outside find_package(colligate) consumer"
rm -rf build/install build/consumer
cmake --install build/cpp --prefix "$ROOT/build/install" --component dev >/dev/null
cmake -S tests/cmake_consumer -B build/consumer -G Ninja -DCMAKE_PREFIX_PATH="$ROOT/build/install" >/dev/null
cmake --build build/consumer -j2
ctest --test-dir build/consumer --output-on-failure

echo "== Python: build and install the package"
python3 -m pip install -q --no-build-isolation .

echo "== Python: committed type stub matches the compiled module"
python3 scripts/check_stub.py

echo "== Python: pytest (unit, property, CLI, notebooks)"
cd "$ROOT"
python3 -m pytest tests/python notebooks_examples --nbmake -q -p no:cacheprovider
