"""Recipe files: a small TOML format describing one solution to evaluate.

A recipe names the dissolved ingredients of a frozen dessert, brine or syrup,
the temperatures at which the product is looked at, and the model options.
It is read with :func:`load_recipe` (or :func:`parse_recipe` for text) into a
:class:`Recipe`, whose :meth:`Recipe.solution` gives a :class:`colligate.Solution`.

Schema (the full description, with examples, is in ``docs/recipe_format.md``)::

    [recipe]                     # required
    name = "Lemon sorbet"        # required, non-empty string
    note = "..."                 # optional free text
    label = "..."                # optional; shown under the title of a report
    basis = "kg"                 # optional, "kg" (default) or "percent"
    batch_kg = 1.0               # optional, percent basis only: batch mass in kg (default 1)

    [composition]                # required
    water = 0.62                 # required, > 0
    sucrose = 0.22               # any solute id or alias known to colligate
    glucose = 0.06
    citric_acid = 0.005

    [temperatures_celsius]       # optional; each key optional
    drawing = -5.5               # default -5
    serving = -11                # default -12
    storage = -18                # default -18

    [options]                    # optional
    model = "auto"               # one of colligate.models(); default "auto"
    bound_water = 0.0            # water that cannot freeze; kg, or percent of
                                 # the batch mass when basis = "percent"

Rules checked when a recipe is loaded (each error names the file, the table
and key, and the valid range):

* the file exists, is UTF-8 and is valid TOML (syntax errors give the line);
* only the tables and keys above appear (solute names excepted);
* every amount is a finite number >= 0; water is > 0;
* with ``basis = "percent"`` the amounts, water included, add up to
  100 +/- 0.01;
* solute names are known to colligate (the library's message lists the
  nearest names);
* temperatures lie between -60 degC and +40 degC;
* ``bound_water`` is finite, >= 0 and smaller than the water amount.

Inside the returned :class:`Recipe` everything is SI: amounts in kg,
temperatures in K.
"""

from __future__ import annotations

import math
import os
import sys

if sys.version_info >= (3, 11):
    import tomllib
else:  # pragma: no cover  (Python < 3.11: the same parser, packaged as tomli)
    import tomli as tomllib
from dataclasses import dataclass, field
from importlib import resources
from typing import Any, Mapping

import colligate as cg

from .units import kelvin_from_celsius

__all__ = [
    "Recipe",
    "RecipeError",
    "load_recipe",
    "parse_recipe",
    "load_demo_recipe",
    "demo_recipe_text",
    "DEFAULT_TEMPERATURES_C",
    "TEMPERATURE_RANGE_C",
    "PERCENT_TOLERANCE",
]

#: Named temperatures of a recipe and their defaults, degC (common practice
#: for scoop-shop sorbets and ice creams; change them per recipe).
DEFAULT_TEMPERATURES_C: dict[str, float] = {"drawing": -5.0, "serving": -12.0, "storage": -18.0}

#: Accepted range for recipe temperatures, degC (inclusive).
TEMPERATURE_RANGE_C: tuple[float, float] = (-60.0, 40.0)

#: Allowed deviation of a percent-basis composition from 100 (percentage points).
PERCENT_TOLERANCE = 0.01

_DEMO_RESOURCE = "demo_sorbet.toml"

_RECIPE_KEYS = {"name", "note", "label", "basis", "batch_kg"}
_OPTION_KEYS = {"model", "bound_water"}
_TABLES = {"recipe", "composition", "temperatures_celsius", "options"}
_REQUIRED_TABLES = ("recipe", "composition")
_BASES = ("kg", "percent")


class RecipeError(cg.InvalidInputError):
    """A recipe file is missing, unreadable or does not follow the schema.

    The message always starts with ``recipe '<source>':`` and names the table
    and key at fault together with the valid range.
    """


@dataclass(frozen=True)
class Recipe:
    """A validated recipe. Amounts are kg and temperatures K (SI).

    Attributes
    ----------
    name : str
        Recipe name.
    water : float
        Water, kg.
    solutes : dict[str, float]
        Solute name (as written in the file) -> kg, in file order.
    temperatures : dict[str, float]
        Named temperatures (``drawing``, ``serving``, ``storage``), K.
    model : str
        Activity model id passed to colligate.
    bound_water : float
        Water that cannot freeze, kg.
    note, label : str
        Free text from the ``[recipe]`` table ("" when absent).
    basis : str
        ``"kg"`` or ``"percent"``, as written in the file.
    source : str
        Where the recipe came from (the path, or a description).
    """

    name: str
    water: float
    solutes: dict[str, float]
    temperatures: dict[str, float]
    model: str = "auto"
    bound_water: float = 0.0
    note: str = ""
    label: str = ""
    basis: str = "kg"
    source: str = "<recipe>"
    path: str | None = field(default=None, compare=False)

    def solution(self) -> "cg.Solution":
        """Return the recipe as a :class:`colligate.Solution` (kg of water, kg of each solute)."""
        solutes = {k: v for k, v in self.solutes.items() if v > 0.0}
        return cg.Solution(water=self.water, solutes=solutes)

    @property
    def total_mass(self) -> float:
        """Total batch mass (water + solutes), kg."""
        return self.water + sum(self.solutes.values())

    @property
    def composition(self) -> dict[str, float]:
        """Water and solutes, kg, in file order (water first)."""
        return {"water": self.water, **self.solutes}


# --------------------------------------------------------------------------- helpers


def _fail(source: str, where: str, message: str) -> RecipeError:
    prefix = f"recipe '{source}': "
    return RecipeError(prefix + (f"{where}: " if where else "") + message)


def _number(source: str, where: str, value: Any, rule: str) -> float:
    """Return value as float if it is a real, finite TOML number, else raise."""
    if isinstance(value, bool) or not isinstance(value, (int, float)):
        raise _fail(source, f"{where} = {_show(value)}", f"must be a number; {rule}")
    x = float(value)
    if not math.isfinite(x):
        raise _fail(source, f"{where} = {_show(value)}", rule)
    return x


def _show(value: Any) -> str:
    if isinstance(value, str):
        return repr(value)
    if isinstance(value, bool):
        return "true" if value else "false"
    if isinstance(value, dict):
        return "{table}"
    if isinstance(value, float) and math.isnan(value):
        return "nan"
    return str(value)


def _table(source: str, doc: Mapping[str, Any], name: str, required: bool) -> dict[str, Any]:
    if name not in doc:
        if required:
            raise _fail(source, f"[{name}]", "missing table (required)")
        return {}
    value = doc[name]
    if not isinstance(value, dict):
        raise _fail(source, name, f"must be a table [{name}], got {_show(value)}")
    return value


def _unknown_keys(source: str, table: str, given: Mapping[str, Any], allowed: set[str]) -> None:
    extra = [k for k in given if k not in allowed]
    if extra:
        raise _fail(
            source,
            f"[{table}].{extra[0]}",
            f"unknown key; allowed keys are {', '.join(sorted(allowed))}",
        )


def _string(source: str, table: str, key: str, value: Any, *, nonempty: bool = False) -> str:
    if not isinstance(value, str):
        raise _fail(source, f"[{table}].{key} = {_show(value)}", "must be a string")
    if nonempty and not value.strip():
        raise _fail(source, f"[{table}].{key}", "must be a non-empty string")
    return value


# --------------------------------------------------------------------------- parsing


def parse_recipe(text: str, source: str = "<string>", *, path: str | None = None) -> Recipe:
    """Parse and validate recipe text (TOML). ``source`` is used in error messages.

    Raises
    ------
    RecipeError
        On any schema violation; the message names ``source``, the table/key
        and the valid range.
    """
    try:
        doc = tomllib.loads(text)
    except tomllib.TOMLDecodeError as exc:
        raise _fail(source, "", f"TOML syntax error: {exc}") from None

    extra = [k for k in doc if k not in _TABLES]
    if extra:
        raise _fail(source, f"[{extra[0]}]", f"unknown table or key; allowed tables are {', '.join(sorted(_TABLES))}")
    for name in _REQUIRED_TABLES:
        _table(source, doc, name, required=True)

    # [recipe]
    head = _table(source, doc, "recipe", required=True)
    _unknown_keys(source, "recipe", head, _RECIPE_KEYS)
    if "name" not in head:
        raise _fail(source, "[recipe].name", "missing key (required, non-empty string)")
    name = _string(source, "recipe", "name", head["name"], nonempty=True).strip()
    note = _string(source, "recipe", "note", head.get("note", ""))
    label = _string(source, "recipe", "label", head.get("label", ""))
    basis = _string(source, "recipe", "basis", head.get("basis", "kg")).strip().lower()
    if basis not in _BASES:
        raise _fail(source, f"[recipe].basis = {_show(head['basis'])}", 'must be "kg" or "percent"')
    batch_kg = 1.0
    if "batch_kg" in head:
        if basis != "percent":
            raise _fail(source, "[recipe].batch_kg", 'only allowed with basis = "percent"')
        batch_kg = _number(source, "[recipe].batch_kg", head["batch_kg"], "batch mass must be finite and > 0 (kg)")
        if not batch_kg > 0.0:
            raise _fail(source, f"[recipe].batch_kg = {_show(head['batch_kg'])}", "batch mass must be finite and > 0 (kg)")

    # [composition]
    comp = _table(source, doc, "composition", required=True)
    unit = "kg" if basis == "kg" else "% of batch"
    amounts: dict[str, float] = {}
    for key, value in comp.items():
        where = f"[composition].{key}"
        if isinstance(value, dict):
            raise _fail(source, where, f"must be a number (amount in {unit}), not a table")
        rule = f"amount must be finite and >= 0 ({unit})"
        x = _number(source, where, value, rule)
        if x < 0.0:
            raise _fail(source, f"{where} = {_show(value)}", rule)
        amounts[key] = x
    water_keys = [k for k in amounts if k.strip().lower() == "water"]
    if not water_keys:
        raise _fail(source, "[composition].water", f"missing key: a recipe needs water > 0 ({unit})")
    if len(water_keys) > 1:
        raise _fail(source, f"[composition].{water_keys[1]}", "water given more than once")
    water_amount = amounts.pop(water_keys[0])
    if not water_amount > 0.0:
        raise _fail(source, f"[composition].{water_keys[0]} = {_show(comp[water_keys[0]])}", f"water must be > 0 ({unit})")

    if basis == "percent":
        total = water_amount + sum(amounts.values())
        if abs(total - 100.0) > PERCENT_TOLERANCE:
            raise _fail(
                source,
                "[composition]",
                f"amounts add up to {total:.6g} %; with basis = \"percent\" they must add up to "
                f"100 +/- {PERCENT_TOLERANCE} (water included)",
            )
        scale = batch_kg / 100.0
    else:
        scale = 1.0
    water_kg = water_amount * scale
    solutes_kg = {k: v * scale for k, v in amounts.items()}

    # [temperatures_celsius]
    temps_c = _table(source, doc, "temperatures_celsius", required=False)
    _unknown_keys(source, "temperatures_celsius", temps_c, set(DEFAULT_TEMPERATURES_C))
    lo, hi = TEMPERATURE_RANGE_C
    temperatures: dict[str, float] = {}
    for key, default in DEFAULT_TEMPERATURES_C.items():
        where = f"[temperatures_celsius].{key}"
        rule = f"temperature must be finite and between {lo:g} and {hi:+g} degC"
        c = _number(source, where, temps_c[key], rule) if key in temps_c else default
        if not lo <= c <= hi:
            raise _fail(source, f"{where} = {_show(temps_c[key])}", rule)
        temperatures[key] = kelvin_from_celsius(c)

    # [options]
    opts = _table(source, doc, "options", required=False)
    _unknown_keys(source, "options", opts, _OPTION_KEYS)
    model = _string(source, "options", "model", opts.get("model", "auto")).strip().lower()
    known_models = list(cg.models())
    if model not in known_models:
        raise _fail(source, f"[options].model = {_show(opts['model'])}", f"must be one of {', '.join(known_models)}")
    bound_kg = 0.0
    if "bound_water" in opts:
        bunit = "kg" if basis == "kg" else "% of batch"
        rule = f"bound water must be finite, >= 0 and less than the water ({water_amount:g} {bunit})"
        b = _number(source, "[options].bound_water", opts["bound_water"], rule)
        if not 0.0 <= b < water_amount:
            raise _fail(source, f"[options].bound_water = {_show(opts['bound_water'])}", rule)
        bound_kg = b * scale

    recipe = Recipe(
        name=name,
        water=water_kg,
        solutes=solutes_kg,
        temperatures=temperatures,
        model=model,
        bound_water=bound_kg,
        note=note,
        label=label,
        basis=basis,
        source=source,
        path=path,
    )
    # Let the library validate solute names (its message lists the nearest names).
    try:
        recipe.solution()
    except ValueError as exc:
        raise _fail(source, "[composition]", str(exc)) from None
    return recipe


def load_recipe(path: str | os.PathLike[str]) -> Recipe:
    """Read and validate a recipe file (TOML, UTF-8). See the module docstring for the schema.

    Raises
    ------
    RecipeError
        When the file is missing or unreadable, or breaks the schema.
    """
    source = os.fspath(path)
    try:
        with open(source, "rb") as fh:
            raw = fh.read()
    except FileNotFoundError:
        raise _fail(source, "", "file not found") from None
    except IsADirectoryError:
        raise _fail(source, "", "is a directory, expected a .toml file") from None
    except OSError as exc:
        raise _fail(source, "", f"cannot read file ({exc.strerror or exc})") from None
    try:
        text = raw.decode("utf-8")
    except UnicodeDecodeError as exc:
        raise _fail(source, "", f"not UTF-8 text (byte {exc.start})") from None
    return parse_recipe(text, source, path=os.path.abspath(source))


def demo_recipe_text() -> str:
    """Return the text of the built-in demo recipe (an invented demo scenario)."""
    return (resources.files("colligate") / "data" / _DEMO_RESOURCE).read_text(encoding="utf-8")


def load_demo_recipe() -> Recipe:
    """Load the built-in demo recipe, an invented raspberry-lemon sorbet (invented demo scenario)."""
    return parse_recipe(demo_recipe_text(), f"built-in {_DEMO_RESOURCE}")
