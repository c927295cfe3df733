#!/usr/bin/env bash
# The Catch2 suite built and run under AddressSanitizer and UndefinedBehaviorSanitizer
# (GCC), in its own build directory build/sanitize; any report fails the run. Run after
# scripts/install_deps.sh --test (it uses that environment's CMake and Ninja). About five
# minutes cold on two cores (-O1, no debug info; ccache makes a rerun fast).
#   bash scripts/sanitize.sh
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/common.sh
use_env

flags="-O1 -fno-omit-frame-pointer -fsanitize=address,undefined -fno-sanitize-recover=undefined"
launcher=()
command -v ccache >/dev/null && launcher=(-DCMAKE_CXX_COMPILER_LAUNCHER=ccache)
echo "== C++ under ASan + UBSan: configure, build, ctest (build/sanitize)"
cmake -S . -B build/sanitize -G Ninja -DCOLLIGATE_BUILD_TESTS=ON -DCMAKE_BUILD_TYPE=sanitize \
  -DCMAKE_CXX_FLAGS="$flags" -DCMAKE_EXE_LINKER_FLAGS="-fsanitize=address,undefined" \
  "${launcher[@]}" >/dev/null
cmake --build build/sanitize -j2   # every Catch2 target, so ctest finds each one it lists
export ASAN_OPTIONS=detect_leaks=1:abort_on_error=1
export UBSAN_OPTIONS=print_stacktrace=1:halt_on_error=1
ctest --test-dir build/sanitize --output-on-failure -j2
