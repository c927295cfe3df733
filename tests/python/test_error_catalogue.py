"""The error catalogue of DEVELOPERS.md, row by row: each error type is raised where the
table says, and its message names the field (or option, or file), the value and the
valid range or rule. Also checks that the table lists every error class of the package.
The limits checked are the package's own documented rules (common practice for input
checking); no check value comes from a publication."""

from __future__ import annotations

import importlib
import inspect
import re
from pathlib import Path

import numpy as np
import pytest

import colligate as cg
from colligate import _files, fit, units
from colligate.ingredients import Ingredient, IngredientError
from colligate.recipe import RecipeError, parse_recipe

ROOT = Path(__file__).resolve().parents[2]
MODULES = ["colligate", "colligate._core", "colligate._files", "colligate._warnings", "colligate.api",
           "colligate.batch", "colligate.cli", "colligate.fit", "colligate.ingredients", "colligate.recipe",
           "colligate.report", "colligate.report_layout", "colligate.plot", "colligate.units"]


def catalogue() -> dict[str, str]:
    """First-column type names of the two tables of the error catalogue -> the row."""
    text = (ROOT / "DEVELOPERS.md").read_text(encoding="utf-8")
    section = text[text.index("## Error catalogue"):]
    section = section[:section.index("\n## ", 5)]
    rows = {}
    for line in section.splitlines():
        m = re.match(r"\|\s*`([\w.]+)`", line)
        if m:
            rows[m.group(1)] = line
    return rows


def recipe_text(**changes: str) -> str:
    base = {"composition": "water = 0.8\nsucrose = 0.2\n", "temperatures": ""}
    base.update(changes)
    return f"[recipe]\nname = \"t\"\n[composition]\n{base['composition']}{base['temperatures']}"


# Each case: a call that must raise, and the fragments its message must contain:
# (field or option or file, value, valid range or rule); "TMP" stands for the test's folder.
CASES = {
    "colligate.InvalidInputError": [
        (lambda tmp: cg.Solution.from_molalities({"sucrose": -1.0}),
         ("molalities['sucrose']", "-1", "finite, >= 0 and <= 1e15 mol/kg")),
        (lambda tmp: cg.fit_effective_solute(np.array([0.9, 0.8, 0.7]), np.array([272.5, 271.5, 270.0]),
                                             molar_mass_start=0.0),
         ("molar_mass_start", "0", "[0.005, 100] kg/mol")),
    ],
    "colligate.OutOfValidityRangeError": [
        (lambda tmp: cg.water_activity(cg.Solution.from_molalities({"NaCl": 12.0}), T=298.15, range_policy="raise",
                                            saturation="metastable"),
         ("molality of 'sodium_chloride'", "12", "6.2 mol/kg")),
    ],
    "colligate.ConvergenceError": [
        (lambda tmp: fit.curve_fit(lambda x, p: np.exp(p[0] * x), np.arange(5.0), np.exp(0.7 * np.arange(5.0)),
                                   [5.0], max_iterations=1).raise_if_failed(),
         ("status", "'max_iterations'", "needs status 'converged'")),
    ],
    "colligate.recipe.RecipeError": [
        (lambda tmp: parse_recipe(recipe_text(composition="water = 0.8\nsucrose = -3\n"), "r.toml"),
         ("[composition].sucrose", "-3", ">= 0")),
        (lambda tmp: parse_recipe(recipe_text(temperatures="[temperatures_celsius]\nserving = -80\n"), "r.toml"),
         ("[temperatures_celsius].serving", "-80", "between -60 and +40 degC")),
    ],
    "colligate.LibraryError": [
        (lambda tmp: cg.Library.load(_write(tmp / "lib.toml", 'format = "colligate-library"\nversion = 99\n')),
         ("lib.toml", "version = 99", "reads versions 1 to")),
    ],
    "colligate.ingredients.IngredientError": [
        (lambda tmp: Ingredient("cream", water=1.5), ("water", "1.5", "[0, 1]")),
    ],
    "colligate._files.InputFileError": [
        (lambda tmp: fit.read_fit_data(_write(tmp / "lab.csv", "molality,water_activity\n1,0.98\n2,x\n")),
         ("lab.csv', line 3, column 'water_activity'", "'x'", "finite number")),
        (lambda tmp: _files.read_input_bytes(_write(tmp / "big.csv", "0" * 2048), "data file", limit=1024),
         ("big.csv", "2048 bytes", "limited to 0.000977 MB (1024 bytes)")),
    ],
    "colligate._files.OutputPathError": [
        (lambda tmp: _files.check_output_path(tmp, what="--csv"), ("--csv", "TMP", "give a file name")),
        (lambda tmp: _files.check_output_path(tmp / "no" / "x.png", what="--plot"),
         ("--plot", "x.png", "does not exist")),
    ],
    "ValueError": [
        (lambda tmp: units.kelvin_from_celsius(float("nan")), ("temperature", "nan", "finite number")),
    ],
    "TypeError": [
        (lambda tmp: cg.Solution(water="a"), ("water", "'a'", "SupportsFloat")),
    ],
}


def _write(path: Path, text: str) -> Path:
    path.write_text(text, encoding="utf-8")
    return path


CASE_LIST = [(name, i) for name, cases in CASES.items() for i in range(len(cases))]


def resolve(name: str) -> type:
    if name in ("ValueError", "TypeError"):
        return {"ValueError": ValueError, "TypeError": TypeError}[name]
    parts = name.split(".")
    for cut in range(len(parts) - 1, 0, -1):
        try:
            obj = importlib.import_module(".".join(parts[:cut]))
        except ImportError:
            continue
        for attr in parts[cut:]:
            obj = getattr(obj, attr)
        return obj
    raise LookupError(name)


@pytest.mark.parametrize("name, i", CASE_LIST, ids=[f"{n}-{i}" for n, i in CASE_LIST])
def test_catalogue_row(name, i, tmp_path):
    call, fragments = CASES[name][i]
    kind = resolve(name)
    with pytest.raises(kind) as info:
        call(tmp_path)
    if name in ("ValueError", "TypeError"):  # the plain rows: exactly that type, not a subclass
        assert type(info.value) is kind, type(info.value)
    message = str(info.value)
    for frag in fragments:
        frag = str(tmp_path) if frag == "TMP" else frag
        assert frag in message, (frag, message)


def test_every_catalogue_row_has_a_case_and_every_error_class_a_row():
    rows = catalogue()
    errors = {n for n in rows if not n.endswith("Warning")}
    assert errors == set(CASES), (errors ^ set(CASES))
    for name in rows:
        assert issubclass(resolve(name), (Exception, Warning)), name
    # every exception or warning class defined by the package appears in the table
    for modname in MODULES:
        mod = importlib.import_module(modname)
        for attr, obj in vars(mod).items():
            if not inspect.isclass(obj) or not issubclass(obj, BaseException):
                continue
            if not (obj.__module__ or "").startswith("colligate") or attr.startswith("_"):
                continue
            listed = {resolve(n) for n in rows}
            assert obj in listed, f"{modname}.{attr} is missing from the error catalogue in DEVELOPERS.md"


def test_catalogue_bases_are_as_documented():
    rows = catalogue()
    for name, row in rows.items():
        m = re.match(r"\|\s*`[\w.]+`\s*\((\w+)\)", row)
        if m:
            base = m.group(1)
            bases = {"ValueError": ValueError, "RuntimeError": RuntimeError,
                     "InvalidInputError": cg.InvalidInputError}
            assert issubclass(resolve(name), bases[base]), (name, base)
