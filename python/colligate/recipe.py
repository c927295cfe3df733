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

    [composition]                # solute-based recipe: [composition] or [ingredients]
    water = 0.62                 # required, > 0
    sucrose = 0.22               # any solute id or alias known to colligate
    glucose = 0.06
    citric_acid = 0.005

    [ingredients]                # ingredient-based recipe (instead of [composition])
    whole_milk = 0.55            # built-in ingredient keys or names (colligate.ingredients())
    cream_36 = 0.20              # amounts in kg, or percent with basis = "percent"
    sucrose = 0.15

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

* the file exists, is at most 10 MB, is UTF-8 and is valid TOML (syntax errors give
  the line; nesting too deep for the reader is named as such);
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

from . import api
from ._files import MAX_INPUT_BYTES, InputFileError, read_input_bytes
from .units import kelvin_from_celsius

__all__ = [
    "Recipe",
    "RecipeError",
    "load_recipe",
    "parse_recipe",
    "load_demo_recipe",
    "demo_recipe_text",
    "DEMO_SCENARIOS",
    "DEFAULT_DEMO_SCENARIO",
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

#: Built-in demo scenarios (all invented and labelled so): id -> file in colligate/data.
DEMO_SCENARIOS: dict[str, str] = {
    "ice_cream": "demo_strawberry_ice_cream.toml",
    "sorbet": "demo_sorbet.toml",
}

#: The scenario ``colligate demo`` runs without ``--scenario``.
DEFAULT_DEMO_SCENARIO = "ice_cream"

_RECIPE_KEYS = {"name", "note", "label", "basis", "batch_kg"}
_OPTION_KEYS = {"model", "bound_water"}
_TABLES = {"recipe", "composition", "ingredients", "temperatures_celsius", "options"}
_REQUIRED_TABLES = ("recipe",)
_BASES = ("kg", "percent")


class RecipeError(api.InvalidInputError):
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

    name: str = "recipe"
    water: float = 0.0
    solutes: dict[str, float] = field(default_factory=dict)
    temperatures: dict[str, float] = field(default_factory=dict)
    model: str = "auto"
    bound_water: float | None = None
    note: str = ""
    label: str = ""
    basis: str = "kg"
    source: str = "<recipe>"
    path: str | None = field(default=None, compare=False)
    ingredients: dict[str, float] | None = None
    proximate: dict[str, float] = field(default_factory=dict, compare=False)

    def __post_init__(self) -> None:
        # Ingredient-based: Recipe(ingredients={"whole_milk": 0.6, "sucrose": 0.15}) in kg.
        if self.ingredients is not None:
            from .ingredients import ingredient as _lookup

            if self.water or self.solutes:
                raise RecipeError("Recipe: give either ingredients or water and solutes, not both")
            if not isinstance(self.ingredients, Mapping) or not self.ingredients:
                raise RecipeError("Recipe: ingredients must be a non-empty mapping of ingredient name to kg")
            water = 0.0
            solutes: dict[str, float] = {}
            prox = dict.fromkeys(("water", "protein", "fat", "carbohydrate", "fibre", "ash"), 0.0)
            kg_by_key: dict[str, float] = {}
            for name, kg in self.ingredients.items():
                x = _number(self.source, f"ingredients['{name}']", kg, "amount must be finite and >= 0 (kg)")
                if x < 0.0:
                    raise RecipeError(f"recipe '{self.source}': ingredients['{name}'] = {kg}: amount must be finite and >= 0 (kg)")
                try:
                    ing = _lookup(name)
                except ValueError as exc:
                    raise _fail(self.source, f"[ingredients].{name}", str(exc)) from None
                kg_by_key[ing.key or ing.name] = kg_by_key.get(ing.key or ing.name, 0.0) + x
                water += x * ing.water
                for sid, w in ing.solutes().items():
                    solutes[sid] = solutes.get(sid, 0.0) + x * w
                for k, v in ing.proximate().items():
                    prox[k] += x * v
            total = sum(kg_by_key.values())
            if not total > 0.0:
                raise _fail(self.source, "[ingredients]", "the amounts add up to 0 kg; a recipe needs a positive batch")
            if not water > 0.0:
                raise _fail(self.source, "[ingredients]", "the ingredients carry no water; a recipe needs water > 0")
            object.__setattr__(self, "ingredients", kg_by_key)
            object.__setattr__(self, "water", water)
            object.__setattr__(self, "solutes", solutes)
            object.__setattr__(self, "proximate", {k: v / total for k, v in prox.items()})
            if self.bound_water is None:
                from .ingredients import BOUND_WATER_PER_PROTEIN

                object.__setattr__(self, "bound_water", BOUND_WATER_PER_PROTEIN * prox["protein"])
        else:
            if not self.proximate:
                tot = self.total_mass
                if tot > 0.0:
                    carb = ash = 0.0
                    kinds = _solute_kinds()
                    for sid, kg in self.solutes.items():
                        if kinds.get(_solute_id(sid)) == "electrolyte":
                            ash += kg
                        else:
                            carb += kg
                    object.__setattr__(
                        self,
                        "proximate",
                        {"water": self.water / tot, "protein": 0.0, "fat": 0.0,
                         "carbohydrate": carb / tot, "fibre": 0.0, "ash": ash / tot},
                    )
        if self.bound_water is None:
            object.__setattr__(self, "bound_water", 0.0)
        if not self.temperatures:
            object.__setattr__(
                self, "temperatures", {k: kelvin_from_celsius(c) for k, c in DEFAULT_TEMPERATURES_C.items()}
            )

    @classmethod
    def from_toml(cls, path: "str | os.PathLike[str]") -> "Recipe":
        """Read and validate a recipe file (see :func:`load_recipe`)."""
        return load_recipe(path)

    @property
    def ingredient_based(self) -> bool:
        """True for a recipe made of library ingredients."""
        return self.ingredients is not None

    # ------------------------------------------------------------ evaluations (SI)

    def freezing_point(self) -> float:
        """Initial freezing point, K."""
        return float(api.freezing_point(self.solution(), model=self.model, bound_water=self.bound_water))

    def ice_fraction(self, T):
        """Ice mass / total water at T (K, scalar or array)."""
        return api.ice_fraction(self.solution(), T, model=self.model, bound_water=self.bound_water)

    def leighton_ice_fraction(self, T):
        """Fraction of the water frozen at T (K) by the dairy method of Leighton (1927) /
        Goff & Hartel (2013); a cross-check against the dairy texts (no bound water)."""
        return api.leighton_ice_fraction(self.solution(), T)

    def water_activity(self, T: float = 298.15) -> float:
        """Water activity of the unfrozen recipe at T (K), no ice."""
        return float(api.water_activity(self.solution(), T=T, model=self.model))

    def enthalpy(self, T):
        """Specific enthalpy, J/kg, with H = 0 at 233.15 K (-40 C); T in K (scalar or array)."""
        return api.enthalpy(self.proximate, self.solution(), T, model=self.model, bound_water=self._bound_fraction())

    def apparent_specific_heat(self, T):
        """Apparent specific heat dH/dT, J/(kg K); T in K (scalar or array)."""
        return api.apparent_specific_heat(self.proximate, self.solution(), T, model=self.model,
                                         bound_water=self._bound_fraction())

    def heat_load(self, from_T: float, to_T: float) -> dict[str, float]:
        """Heat to remove per kg from ``from_T`` to ``to_T`` (K): total, sensible, latent (J/kg)."""
        return api.heat_load(self.proximate, self.solution(), from_T, to_T, model=self.model,
                            bound_water=self._bound_fraction())

    def _bound_fraction(self) -> float:
        """Bound water per kg of batch."""
        return float(self.bound_water or 0.0) / self.total_mass

    def solution(self) -> "api.Solution":
        """Return the recipe as a :class:`colligate.Solution` (kg of water, kg of each solute)."""
        solutes = {k: v for k, v in self.solutes.items() if v > 0.0}
        return api.Solution(water=self.water, solutes=solutes)

    @property
    def total_mass(self) -> float:
        """Total batch mass, kg: every ingredient, or water + solutes for a solute recipe."""
        if self.ingredients is not None:
            return float(sum(self.ingredients.values()))
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
    if len(text) > MAX_INPUT_BYTES:
        raise _fail(source, "", f"text of {len(text)} characters; recipes are limited to {MAX_INPUT_BYTES} "
                    "characters (10 MB)")
    try:
        doc = tomllib.loads(text)
    except tomllib.TOMLDecodeError as exc:
        raise _fail(source, "", f"TOML syntax error: {exc}") from None
    except RecursionError:
        raise _fail(source, "", "arrays or inline tables nested too deeply for the TOML reader; a recipe "
                    "holds only plain numbers and strings in its tables (no nesting)") from None

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

    has_comp = "composition" in doc
    has_ing = "ingredients" in doc
    if not has_comp and not has_ing:
        raise _fail(source, "[composition]", "missing table (required): a recipe needs [composition] (solutes) or [ingredients] (library ingredients)")
    if has_comp and has_ing:
        raise _fail(source, "[ingredients]", "give either [composition] (solutes) or [ingredients] (library ingredients), not both")
    if has_ing:
        return _parse_ingredient_recipe(doc, source, path, name, note, label, basis, batch_kg)

    # [composition]
    comp = _table(source, doc, "composition", required=True)
    amounts = _amounts(source, "composition", comp, basis)
    unit = "kg" if basis == "kg" else "% of batch"
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

    temperatures = _parse_temperatures(source, doc)
    model, bound_kg = _parse_options(source, doc, basis, water_amount, scale)
    return _finish(Recipe(
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
    ))


def _parse_temperatures(source: str, doc: Mapping[str, Any]) -> dict[str, float]:
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
    return temperatures


def _parse_options(source: str, doc: Mapping[str, Any], basis: str, water_amount: float | None,
                   scale: float) -> tuple[str, float | None]:
    """[options]: model id and bound water in kg (None: the recipe's default)."""
    opts = _table(source, doc, "options", required=False)
    _unknown_keys(source, "options", opts, _OPTION_KEYS)
    model = _string(source, "options", "model", opts.get("model", "auto")).strip().lower()
    known_models = list(api.models())
    if model not in known_models:
        raise _fail(source, f"[options].model = {_show(opts['model'])}", f"must be one of {', '.join(known_models)}")
    bound_kg: float | None = 0.0 if water_amount is not None else None
    if "bound_water" in opts:
        bunit = "kg" if basis == "kg" else "% of batch"
        limit = f"{water_amount:g} {bunit}" if water_amount is not None else "the water of the batch"
        rule = f"bound water must be finite, >= 0 and less than the water ({limit})"
        b = _number(source, "[options].bound_water", opts["bound_water"], rule)
        if not (0.0 <= b and (water_amount is None or b < water_amount)):
            raise _fail(source, f"[options].bound_water = {_show(opts['bound_water'])}", rule)
        bound_kg = b * scale
    return model, bound_kg


def _amounts(source: str, table_name: str, table: Mapping[str, Any], basis: str) -> dict[str, float]:
    """Amounts of a [composition] or [ingredients] table, validated (finite, >= 0)."""
    unit = "kg" if basis == "kg" else "% of batch"
    amounts: dict[str, float] = {}
    for key, value in table.items():
        where = f"[{table_name}].{key}"
        if isinstance(value, dict):
            raise _fail(source, where, f"must be a number (amount in {unit}), not a table")
        rule = f"amount must be finite and >= 0 ({unit})"
        x = _number(source, where, value, rule)
        if x < 0.0:
            raise _fail(source, f"{where} = {_show(value)}", rule)
        amounts[key] = x
    return amounts


def _parse_ingredient_recipe(doc: Mapping[str, Any], source: str, path: str | None, name: str, note: str,
                             label: str, basis: str, batch_kg: float) -> Recipe:
    table = _table(source, doc, "ingredients", required=True)
    amounts = _amounts(source, "ingredients", table, basis)
    if not amounts:
        raise _fail(source, "[ingredients]", "empty table: list at least one ingredient with its amount")
    if basis == "percent":
        total = sum(amounts.values())
        if abs(total - 100.0) > PERCENT_TOLERANCE:
            raise _fail(source, "[ingredients]", f"amounts add up to {total:.6g} %; with basis = \"percent\" they must add up to 100 +/- {PERCENT_TOLERANCE}")
        scale = batch_kg / 100.0
    else:
        scale = 1.0
    temperatures = _parse_temperatures(source, doc)
    model, bound_kg = _parse_options(source, doc, basis, None, scale)
    recipe = Recipe(
        name=name, temperatures=temperatures, model=model, bound_water=bound_kg, note=note, label=label,
        basis=basis, source=source, path=path,
        ingredients={k: v * scale for k, v in amounts.items()},
    )
    if recipe.bound_water is not None and not recipe.bound_water < recipe.water:
        raise _fail(source, "[options].bound_water", f"bound water must be less than the water of the batch ({recipe.water:.6g} kg)")
    return _finish(recipe)


def _solute_kinds() -> dict[str, str]:
    return {str(k): str(v) for k, v in api.solutes()["kind"].items()}


def _solute_id(name: str) -> str:
    try:
        sol = api.Solution(water=1.0, solutes={name: 0.0})
        return sol.species[0] if sol.species else name
    except ValueError:
        return name


def _finish(recipe: Recipe) -> Recipe:
    source = recipe.source
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
        raw = read_input_bytes(source, "recipe")
    except InputFileError as exc:
        raise RecipeError(str(exc)) from None
    try:
        text = raw.decode("utf-8")
    except UnicodeDecodeError as exc:
        raise _fail(source, "", f"not UTF-8 text (byte {exc.start})") from None
    return parse_recipe(text, source, path=os.path.abspath(source))


def _demo_resource(scenario: str) -> str:
    key = str(scenario).strip().lower()
    if key not in DEMO_SCENARIOS:
        raise RecipeError(
            f"demo scenario '{scenario}': unknown; choose one of {', '.join(DEMO_SCENARIOS)}"
        )
    return DEMO_SCENARIOS[key]


def demo_recipe_text(scenario: str = DEFAULT_DEMO_SCENARIO) -> str:
    """Return the text of a built-in demo recipe (an invented demo scenario).

    ``scenario`` is a key of :data:`DEMO_SCENARIOS` (default: the strawberry ice cream).
    """
    return (resources.files("colligate") / "data" / _demo_resource(scenario)).read_text(encoding="utf-8")


def load_demo_recipe(scenario: str = DEFAULT_DEMO_SCENARIO) -> Recipe:
    """Load a built-in demo recipe (invented demo scenario, labelled so).

    ``"ice_cream"`` (default) is an invented strawberry ice cream made of library
    ingredients; ``"sorbet"`` an invented raspberry-lemon sorbet given as solutes.
    """
    resource = _demo_resource(scenario)
    return parse_recipe(demo_recipe_text(scenario), f"built-in {resource}")
