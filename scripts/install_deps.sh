#!/usr/bin/env bash
# Fresh machine -> what colligate needs: checks the system packages (C++ compiler, CMake,
# Eigen, Boost, Catch2 with --test, Python headers), then creates or reuses the Python
# environment (scripts/common.sh says which) and installs the build and runtime packages
# (with --test, the test packages too) into it from PyPI. Never touches the system Python.
#   bash scripts/install_deps.sh [--test]
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/common.sh

check_system "${1:-}"
ensure_env
if [ "${1:-}" = "--test" ]; then install_requirements test; else install_requirements build; fi
