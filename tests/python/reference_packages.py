"""Packages that carry published reference values (gsw for TEOS-10, CoolProp for Melinder 2010).

A missing reference package must not turn checks of published numbers into silent skips.
`reference_package(name)` imports it; when it is missing:
  * in CI (environment variable CI set to anything but "", "0", "false" or "no"; .ci/run sets
    CI=true) the test FAILS, naming the package and the requirements file that lists it;
  * elsewhere the test is skipped, and the skip is reported in a banner at the end of the
    run (conftest.py, pytest_terminal_summary), so it is never silent.
"""
from __future__ import annotations

import importlib
import os
from types import ModuleType

import pytest

REQUIREMENTS = "scripts/requirements-test.txt"

#: names of reference packages found missing in this run (read by conftest's summary hook)
MISSING: set[str] = set()


def in_ci() -> bool:
    return os.environ.get("CI", "").strip().lower() not in ("", "0", "false", "no")


def reference_package(name: str, *, module_level: bool = False) -> ModuleType:
    """Import `name` (e.g. "gsw", "CoolProp.CoolProp"); fail in CI, skip loudly elsewhere."""
    try:
        return importlib.import_module(name)
    except ImportError as exc:
        top = name.split(".")[0]
        msg = (f"reference package {top!r} is not installed ({exc}); the published checks that "
               f"need it did NOT run. Install it from {REQUIREMENTS}.")
        if in_ci():
            pytest.fail(f"CI: {msg}", pytrace=False)
        MISSING.add(top)
        pytest.skip(f"NOT RUN - {msg}", allow_module_level=module_level)
