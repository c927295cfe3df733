"""The package's modules import one another in one direction only.

LAYER_ORDER lists every module of the package, lowest first. A module may import the
modules before it, never one after it (``colligate`` itself, the package's ``__init__``,
comes last: no submodule imports the package). Two checks:

* static: every import statement of every module, including those inside functions;
* dynamic: each module imported alone in a fresh interpreter, with the package's
  ``__init__`` not run, loads only modules before it.
"""
from __future__ import annotations

import ast
import importlib.util
import json
import pathlib
import subprocess
import sys

import pytest

#: Lowest first: api <- ingredients <- recipe <- report_compute <- report_indicators
#: <- report_layout <- cli, with plot beside the layout and report as a facade.
LAYER_ORDER = (
    "_version",
    "_core",
    "_warnings",
    "units",
    "_files",
    "batch",
    "uncertainty",
    "api",
    "fit",
    "storage",
    "sorption",
    "design",
    "dask",
    "ingredients",
    "library",
    "recipe",
    "contributions",
    "formulate",
    "report_compute",
    "report_indicators",
    "report_layout",
    "plot",
    "freezing_time",
    "compare",
    "report",
    "cli_freeze_time",
    "cli",
    "__main__",
    "__init__",
)
RANK = {name: i for i, name in enumerate(LAYER_ORDER)}

PACKAGE_DIR = pathlib.Path(importlib.util.find_spec("colligate").submodule_search_locations[0])


def _python_modules() -> list[str]:
    return sorted(p.stem for p in PACKAGE_DIR.glob("*.py"))


def _imported(module: str) -> set[str]:
    """Package modules named by the import statements of ``module``."""
    return _imports_of((PACKAGE_DIR / f"{module}.py").read_text(encoding="utf-8"), module)


def _imports_of(source: str, module: str = "<test>") -> set[str]:
    """Package modules named by the import statements in ``source`` (``__init__`` for the package)."""
    tree = ast.parse(source)
    out: set[str] = set()
    for node in ast.walk(tree):
        if isinstance(node, ast.Import):
            for alias in node.names:
                parts = alias.name.split(".")
                if parts[0] == "colligate":
                    out.add(parts[1] if len(parts) > 1 else "__init__")
        elif isinstance(node, ast.ImportFrom):
            if node.level == 0:
                parts = (node.module or "").split(".")
                if parts[0] != "colligate":
                    continue
            elif node.level == 1:
                parts = ["colligate"] + (node.module.split(".") if node.module else [])
            else:  # pragma: no cover - the package has no subpackages of Python modules
                raise AssertionError(f"{module}: relative import of level {node.level}")
            if len(parts) > 1:
                out.add(parts[1])
            else:  # from colligate import x / from . import x: x is a module or a name of __init__
                for alias in node.names:
                    out.add(alias.name if alias.name in RANK else "__init__")
    return out


def test_every_module_has_a_place_in_the_order():
    assert set(_python_modules()) - set(LAYER_ORDER) == set()


def test_the_static_check_sees_every_form_of_import():
    assert _imports_of("import colligate as cg\n") == {"__init__"}
    assert _imports_of("import colligate.report\n") == {"report"}
    assert _imports_of("from colligate import CAUTIONS\n") == {"__init__"}
    assert _imports_of("from . import OutOfValidityRangeWarning\n") == {"__init__"}
    assert _imports_of("from . import api, _core\n") == {"api", "_core"}
    assert _imports_of("def f():\n    from .report import build_report\n") == {"report"}
    assert _imports_of("import numpy as np\nfrom typing import Any\n") == set()


@pytest.mark.parametrize("module", [m for m in LAYER_ORDER if m not in ("_version", "_core", "__init__")])
def test_no_module_imports_a_later_one(module):
    if not (PACKAGE_DIR / f"{module}.py").exists():
        pytest.fail(f"{module}.py is listed in LAYER_ORDER but missing from {PACKAGE_DIR}")
    later = {m for m in _imported(module) if RANK.get(m, -1) >= RANK[module]}
    assert later == set(), f"colligate.{module} imports later module(s) {sorted(later)}"


_ALONE = r"""
import importlib, importlib.util, json, sys, types
spec = importlib.util.find_spec("colligate")
pkg = types.ModuleType("colligate")           # the package without running its __init__
pkg.__path__ = list(spec.submodule_search_locations)
sys.modules["colligate"] = pkg
importlib.import_module("colligate." + sys.argv[1])
print(json.dumps(sorted(m.split(".", 1)[1] for m in sys.modules if m.startswith("colligate."))))
"""


@pytest.mark.parametrize("module", [m for m in LAYER_ORDER if m not in ("_version", "__init__", "__main__")])
def test_module_imports_alone_in_a_fresh_interpreter(module):
    done = subprocess.run([sys.executable, "-c", _ALONE, module], capture_output=True, text=True, timeout=300)
    assert done.returncode == 0, done.stderr
    loaded = set(json.loads(done.stdout.strip().splitlines()[-1]))
    assert module in loaded
    later = {m for m in loaded if RANK.get(m, len(LAYER_ORDER)) > RANK[module]}
    assert later == set(), f"importing colligate.{module} alone loaded later module(s) {sorted(later)}"


def test_package_imports_in_a_fresh_interpreter():
    code = "import colligate, colligate.report, colligate.cli; print(len(colligate.__all__))"
    done = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, timeout=300)
    assert done.returncode == 0, done.stderr
