#!/usr/bin/env bash
# Fresh machine -> what colligate needs: checks the system packages (C++ compiler, CMake,
# Eigen, Boost, Catch2 with --test, Python headers), then creates or reuses the Python
# environment (scripts/common.sh says which) and installs the build and runtime packages
# (with --test, the test packages too; with --docs, the documentation packages) into it from
# PyPI. Never touches the system Python.
#   bash scripts/install_deps.sh [--test | --docs]
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/common.sh

check_system "${1:-}"
ensure_env
case "${1:-}" in
  --test) install_requirements test ;;
  --docs) install_requirements docs ;;
  *) install_requirements build ;;
esac
