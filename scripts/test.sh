#!/usr/bin/env bash
# Fresh machine -> every test: Catch2 (ctest), the find_package consumer, the stub check,
# pytest (including the notebooks), with colligate installed into the project
# environment (.venv, see scripts/common.sh).
# COLLIGATE_SKIP_CPP=1 leaves out the C++ part (ctest and the consumer);
# COLLIGATE_SKIP_NOTEBOOKS=1 runs pytest without executing the notebooks.
set -euo pipefail
cd "$(dirname "$0")/.."
ROOT="$PWD"
source scripts/common.sh

bash scripts/install_deps.sh --test   # system check, .venv, build + test packages
use_env                               # that environment first on PATH (its cmake, ninja)

if [ "${COLLIGATE_SKIP_CPP:-0}" = "1" ]; then
  echo "== C++: SKIPPED (COLLIGATE_SKIP_CPP=1): no ctest, no find_package consumer"
else
  echo "== C++: configure, build, ctest"
  launcher=()   # ccache when the machine has it (rebuilds after small changes take seconds)
  command -v ccache >/dev/null && launcher=(-DCMAKE_CXX_COMPILER_LAUNCHER=ccache)
  cmake -S . -B build/cpp -G Ninja -DCOLLIGATE_BUILD_TESTS=ON "${launcher[@]}" >/dev/null
  cmake --build build/cpp -j2
  ctest --test-dir build/cpp --output-on-failure -j2

  echo "== C++: install and build an outside find_package(colligate) consumer"
  rm -rf build/install build/consumer
  cmake --install build/cpp --prefix "$ROOT/build/install" --component dev >/dev/null
  cmake -S tests/cmake_consumer -B build/consumer -G Ninja -DCMAKE_PREFIX_PATH="$ROOT/build/install" >/dev/null
  cmake --build build/consumer -j2
  ctest --test-dir build/consumer --output-on-failure
fi

echo "== Python: build and install the package into $(env_dir)"
install_colligate

echo "== Python: committed type stub matches the compiled module"
"$PY" scripts/check_stub.py

if [ "${COLLIGATE_SKIP_NOTEBOOKS:-0}" = "1" ]; then
  echo "== Python: pytest (unit, property, CLI); notebooks SKIPPED (COLLIGATE_SKIP_NOTEBOOKS=1)"
  "$PY" -m pytest tests/python -q -p no:cacheprovider
else
  echo "== Python: pytest (unit, property, CLI, notebooks)"
  "$PY" -m pytest tests/python notebooks_examples --nbmake -q -p no:cacheprovider
fi
