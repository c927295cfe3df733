#!/usr/bin/env bash
# Build the documentation site into build/docs/html with warnings as errors:
# the validation gallery (tools/validation_gallery.py, fails when a published point leaves
# its tolerance), Doxygen XML of the C++ headers, then Sphinx. Installs colligate and the
# docs packages (scripts/requirements-docs.txt) into the project environment, and doxygen
# with apt-get when run as root.
set -euo pipefail
cd "$(dirname "$0")/.."
ROOT="$PWD"
source scripts/common.sh

if ! command -v doxygen >/dev/null 2>&1; then
  if [ "$(id -u)" = "0" ]; then
    apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq doxygen >/dev/null
  else
    echo "colligate: doxygen is missing; run: sudo apt-get install doxygen" >&2
    exit 1
  fi
fi

bash scripts/install_deps.sh --docs   # system check, .venv, build + docs packages
use_env
install_colligate

GEN="$ROOT/docs/_generated"
rm -rf "$GEN"
mkdir -p "$GEN/doxygen"
echo "== docs: validation gallery"
"$PY" tools/validation_gallery.py --out "$GEN/gallery"
echo "== docs: Doxygen XML of the C++ headers"
(cd docs && doxygen Doxyfile)
echo "== docs: Sphinx (warnings are errors)"
"$PY" -m sphinx -W --keep-going -q -b html docs build/docs/html
"$PY" docs/check_reference.py build/docs/html
echo "== docs: build/docs/html/index.html"
