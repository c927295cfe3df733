#!/usr/bin/env bash
# Fresh machine -> colligate installed into the project environment (.venv) -> the demo.
set -euo pipefail
cd "$(dirname "$0")/.."
source scripts/common.sh

bash scripts/install_deps.sh   # system check, .venv, build and runtime packages
use_env                        # that environment first on PATH
install_colligate              # skipped when the sources are unchanged
colligate demo
