# shellcheck shell=bash
# Shared by install_deps.sh, demo.sh and test.sh (sourced, not run).
#
# colligate is built and installed into one Python environment, never into the system
# interpreter:
#   - an active virtualenv ($VIRTUAL_ENV) or conda environment ($CONDA_PREFIX), as it is;
#   - otherwise the project's own .venv at the repository root, made with `python3 -m venv`
#     and made anew when python3 now names a different interpreter or .venv is broken.
# Stamp files inside that environment let a second run skip pip when nothing changed.

COLLIGATE_ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
export PIP_DISABLE_PIP_VERSION_CHECK=1
export CMAKE_BUILD_PARALLEL_LEVEL="${CMAKE_BUILD_PARALLEL_LEVEL:-2}"

say() { echo "colligate: $*"; }
die() { echo "colligate: $*" >&2; exit 1; }

# The environment to use: the active one, else the project's .venv.
env_dir() {
  if [ -n "${VIRTUAL_ENV:-}" ]; then echo "$VIRTUAL_ENV"
  elif [ -n "${CONDA_PREFIX:-}" ]; then echo "$CONDA_PREFIX"
  else echo "$COLLIGATE_ROOT/.venv"
  fi
}
uses_project_venv() { [ -z "${VIRTUAL_ENV:-}" ] && [ -z "${CONDA_PREFIX:-}" ]; }

# "<real path of the base interpreter> <major.minor>" of a Python (venv or not).
py_identity() {
  "$1" -c 'import os, sys
base = getattr(sys, "_base_executable", "") or sys.executable
print(os.path.realpath(base), "%d.%d" % sys.version_info[:2])'
}

# The interpreter the checks are about: the active environment's, else python3.
check_python() {
  if uses_project_venv; then
    command -v python3 >/dev/null ||
      die "python3 not found; install it with:  sudo apt-get install python3 python3-venv python3-dev"
    echo python3
  else
    local py; py="$(env_dir)/bin/python"
    [ -x "$py" ] || die "the active environment $(env_dir) has no bin/python; deactivate it or install python into it"
    echo "$py"
  fi
}

# Up-front check of what pip cannot install: a C++ compiler, CMake, Eigen, Boost (and
# Catch2 with --test) and, for Debian's own Python, its headers and venv module. As root
# on Debian the missing packages are installed with apt-get; otherwise the one command
# that installs them is printed and the script stops, before any build starts.
check_system() {
  local py deb=() missing=() what=() pydev="" pyvenv="" exe
  py="$(check_python)" || exit 1
  if command -v dpkg >/dev/null 2>&1; then
    deb=(g++ cmake libeigen3-dev libboost-dev)
    [ "${1:-}" = "--test" ] && deb+=(catch2)
    # A Debian-packaged interpreter takes its headers and venv from Debian too.
    exe="$(py_identity "$py" | cut -d' ' -f1)"
    if dpkg -S "$exe" >/dev/null 2>&1; then
      if [ "$exe" = "$(realpath /usr/bin/python3 2>/dev/null)" ]; then
        pydev=python3-dev; pyvenv=python3-venv
      else
        pydev="python$(py_identity "$py" | cut -d' ' -f2)-dev"; pyvenv="${pydev%-dev}-venv"
      fi
      deb+=("$pydev")
      uses_project_venv && deb+=("$pyvenv")
    fi
    local p
    for p in "${deb[@]}"; do dpkg -s "$p" >/dev/null 2>&1 || missing+=("$p"); done
    if [ "${#missing[@]}" -gt 0 ] && [ "$(id -u)" = "0" ] && command -v apt-get >/dev/null; then
      say "installing Debian packages: ${missing[*]}"
      export DEBIAN_FRONTEND=noninteractive
      if ! { apt-get update -qq && apt-get install -y -qq "${missing[@]}" >/dev/null; }; then
        die "apt-get could not install: ${missing[*]}"
      fi
      missing=()
    fi
  fi
  # What the build itself runs, whatever the packages say.
  local cxx="${CXX:-}"
  if [ -n "$cxx" ]; then
    command -v "${cxx%% *}" >/dev/null || die "CXX=$cxx is not a command; unset CXX or install that compiler"
  elif ! command -v c++ >/dev/null && ! command -v g++ >/dev/null; then
    what+=("a C++ compiler"); missing+=(g++)
  fi
  command -v cmake >/dev/null || { what+=("CMake"); missing+=(cmake); }
  if ! "$py" -c 'import os, sys, sysconfig
sys.exit(not os.path.isfile(os.path.join(sysconfig.get_paths()["include"], "Python.h")))'; then
    [ -n "$pydev" ] || die "the Python headers (Python.h) of $py are missing; install that" \
      "Python's development files, or use Debian's python3 with: sudo apt-get install python3-dev"
    what+=("the Python headers (Python.h) of $py"); missing+=("$pydev")
  fi
  if uses_project_venv && ! "$py" -c 'import venv, ensurepip' 2>/dev/null; then
    what+=("the venv module of $py"); missing+=("${pyvenv:-python3-venv}")
  fi
  if [ "${#missing[@]}" -gt 0 ]; then
    # one command for everything, duplicates removed, order kept
    local cmd; cmd="$(printf '%s\n' "${missing[@]}" | awk '!seen[$0]++' | tr '\n' ' ')"
    if [ "${#what[@]}" -gt 0 ]; then
      local list; list="$(printf '%s, ' "${what[@]}")"
      echo "colligate: not found: ${list%, }" >&2
    fi
    if command -v apt-get >/dev/null 2>&1; then
      die "missing system packages; install them with:  sudo apt-get install ${cmd% }"
    fi
    die "missing system packages (Debian names): ${cmd% }; install them with your package manager"
  fi
}

# Create or reuse the project's .venv (nothing to do for an active environment).
ensure_env() {
  uses_project_venv || { say "using the active environment $(env_dir)"; return 0; }
  local venv want have remade=""
  venv="$(env_dir)"
  want="$(py_identity python3)"
  if [ -e "$venv" ]; then
    have="$(py_identity "$venv/bin/python" 2>/dev/null)" &&
      "$venv/bin/python" -m pip --version >/dev/null 2>&1 || have="broken"
    if [ "$have" = "broken" ]; then
      say "recreating .venv: it is broken (its python or pip does not run)"
      rm -rf "$venv"; remade=1
    elif [ "$have" != "$want" ]; then
      say "recreating .venv: it was made by ${have% *} (Python ${have##* }), python3 is now ${want% *} (Python ${want##* })"
      rm -rf "$venv"; remade=1
    fi
  fi
  if [ ! -e "$venv" ]; then
    [ -n "$remade" ] || say "creating .venv with $(command -v python3) (${want% *}, Python ${want##* })"
    python3 -m venv "$venv" || die "python3 -m venv failed; on Debian:  sudo apt-get install python3-venv"
  fi
}

# Put the environment's bin/ first on PATH, as `source .venv/bin/activate` would.
use_env() {
  local venv; venv="$(env_dir)"
  uses_project_venv && export VIRTUAL_ENV="$venv"
  export PATH="$venv/bin:$PATH"
  hash -r
  PY="$venv/bin/python"
}

sha() { sha256sum | cut -d' ' -f1; }

# Hash of the requirement files of a set (test includes build).
requirements_hash() {
  local files=("$COLLIGATE_ROOT/scripts/requirements-build.txt")
  [ "$1" = "build" ] || files+=("$COLLIGATE_ROOT/scripts/requirements-$1.txt")
  cat "${files[@]}" | sha
}

# pip install -r scripts/requirements-<set>.txt, skipped when a stamp in the environment
# records the same requirement files. Sets: build (build + runtime) or test (build + test).
install_requirements() {
  local set="$1" venv stamp hash
  venv="$(env_dir)"
  hash="$(requirements_hash "$set")"
  stamp="$venv/.colligate-requirements-$set"
  if [ "$(cat "$stamp" 2>/dev/null)" = "$hash" ]; then
    say "$set packages already installed in $venv"
    return 0
  fi
  say "installing the $set packages into $venv"
  rm -f "$venv"/.colligate-requirements-*
  "$venv/bin/python" -m pip install -q -r "$COLLIGATE_ROOT/scripts/requirements-$set.txt"
  echo "$hash" >"$stamp"
  # the test set includes the build set
  if [ "$set" = "test" ]; then
    requirements_hash build >"$venv/.colligate-requirements-build"
  fi
  return 0
}

# Hash of everything that goes into the installed package, plus the build requirements.
source_hash() {
  (
    cd "$COLLIGATE_ROOT" || exit 1
    find cpp bindings python CMakeLists.txt pyproject.toml scripts/requirements-build.txt \
      -type f ! -name '*.pyc' ! -name '*.so' ! -path '*/__pycache__/*' \
      ! -path 'python/colligate/_version.py' -print0 |
      LC_ALL=C sort -z | xargs -0 sha256sum | sha
  )
}

# Build and install colligate into the environment (after use_env). Skipped when the
# sources hash to the stamp of the last install and colligate is still installed; when
# they changed, scikit-build-core's persistent build/{wheel_tag} rebuilds only what changed.
install_colligate() {
  local stamp hash
  stamp="$(env_dir)/.colligate-installed"
  hash="$(source_hash)"
  if [ "$(cat "$stamp" 2>/dev/null)" = "$hash" ] &&
     "$PY" -c 'import importlib.metadata as m; m.distribution("colligate")' 2>/dev/null; then
    say "colligate is up to date in $(env_dir) (sources unchanged since the last install)"
    return 0
  fi
  say "building and installing colligate into $(env_dir) (a few minutes the first time)"
  rm -f "$stamp"
  "$PY" -m pip install -q --no-build-isolation "$COLLIGATE_ROOT"
  echo "$hash" >"$stamp"
}
