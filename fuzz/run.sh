#!/usr/bin/env bash
# Builds the libFuzzer target fuzz/fuzz_solution.cpp with clang (AddressSanitizer and
# UndefinedBehaviorSanitizer on) and runs it on the stored corpus fuzz/corpus/.
#   bash fuzz/run.sh                 # 1,000,000 executions (the issue-16 acceptance run)
#   bash fuzz/run.sh --ci            # about one minute (CI)
#   bash fuzz/run.sh -- ARGS...      # any libFuzzer arguments (e.g. -runs=100 or a crash file)
# New inputs go to build/fuzz/corpus (the stored corpus is read, never written); a crash
# leaves its input in build/fuzz/ and the script fails. As root on Debian, missing
# packages (clang, its libFuzzer runtime, Eigen, Boost) are installed with apt-get.
set -euo pipefail
cd "$(dirname "$0")/.."

clang_pkgs=(clang libclang-rt-14-dev libeigen3-dev libboost-dev)
missing=()
for p in "${clang_pkgs[@]}"; do dpkg -s "$p" >/dev/null 2>&1 || missing+=("$p"); done
if [ "${#missing[@]}" -gt 0 ]; then
  if [ "$(id -u)" = "0" ] && command -v apt-get >/dev/null; then
    echo "fuzz: installing Debian packages: ${missing[*]}"
    export DEBIAN_FRONTEND=noninteractive
    apt-get update -qq && apt-get install -y -qq "${missing[@]}" >/dev/null
  else
    echo "fuzz: missing packages; install them with:  sudo apt-get install ${missing[*]}" >&2
    exit 1
  fi
fi
CLANGXX="${CLANGXX:-$(command -v clang++ || command -v clang++-14)}"

out=build/fuzz
mkdir -p "$out/corpus"
bin="$out/fuzz_solution"
if [ ! -x "$bin" ] || [ -n "$(find fuzz/fuzz_solution.cpp cpp/include -newer "$bin" -print -quit)" ]; then
  echo "fuzz: building $bin with $CLANGXX"
  launcher=()
  command -v ccache >/dev/null && launcher=(ccache)
  "${launcher[@]}" "$CLANGXX" -std=c++17 -O2 -g -fno-omit-frame-pointer \
    -fsanitize=fuzzer,address,undefined -fno-sanitize-recover=undefined \
    -I cpp/include -isystem /usr/include/eigen3 \
    fuzz/fuzz_solution.cpp -o "$bin"
fi

args=(-timeout=60 -rss_limit_mb=2048 -max_len=64 -print_final_stats=1 -artifact_prefix="$out/")
case "${1:-}" in
  --ci) args+=(-max_total_time=60) ;;
  --) shift; args+=("$@") ;;
  "") args+=(-runs=1000000) ;;
  *) echo "usage: bash fuzz/run.sh [--ci | -- LIBFUZZER_ARGS...]" >&2; exit 2 ;;
esac
export UBSAN_OPTIONS=print_stacktrace=1:halt_on_error=1
export ASAN_OPTIONS=detect_leaks=1
"$bin" "${args[@]}" "$out/corpus" fuzz/corpus
