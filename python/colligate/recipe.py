"""Recipe files: a small TOML format describing one solution to evaluate.

A recipe names the dissolved ingredients of a frozen dessert, brine or syrup,
the temperatures at which the product is looked at, and the model options.
It is read with :func:`load_recipe` (or :func:`parse_recipe` for text) into a
:class:`Recipe`, whose :meth:`Recipe.solution` gives a :class:`colligate.Solution`.

Schema (the full description, with examples, is in ``docs/recipe_format.md``)::

    [recipe]                     # required
    name = "Lemon sorbet"        # required, non-empty string
    kind = "sorbet"              # optional: ice_cream (default), sorbet, slush,
                                 # frozen_cocktail, brine or syrup; sets the named
                                 # temperatures below
    note = "..."                 # optional free text
    label = "..."                # optional; shown under the title of a report
    basis = "kg"                 # optional, "kg" (default), "g" or "percent"
    batch_kg = 1.0               # optional, percent basis only: batch mass in kg (default 1)

    [composition]                # solute-based recipe: [composition] or [ingredients]
    water = 0.62                 # required, > 0
    sucrose = 0.22               # any solute id or alias known to colligate
    glucose = 0.06
    citric_acid = 0.005

    [ingredients]                # ingredient-based recipe (instead of [composition])
    whole_milk = 0.55            # built-in ingredient keys or names (colligate.ingredients())
    cream_36 = 0.20              # amounts in kg, g, or percent (the basis)
    sucrose = 0.15

    [temperatures_celsius]       # optional; or [temperatures_fahrenheit] or
    drawing = -5.5               # [temperatures_kelvin] (one of the three). Names per
    serving = -11                # kind (NAMED_TEMPERATURES): ice_cream drawing -5,
    storage = -18                # serving -12, storage -18; sorbet drawing, scooping,
                                 # storage; slush and frozen_cocktail pouring, holding;
                                 # brine working, lowest_use; syrup chilled,
                                 # frozen_storage

    [options]                    # optional
    model = "auto"               # one of colligate.models(); default "auto"
    bound_water_fraction_of_water = 0.0   # water that cannot freeze, kg per kg of
                                 # the recipe's water, in [0, 1); default 0, or for an
                                 # ingredient recipe 0.4 kg per kg protein over the water

    [library]                    # optional: own solutes and ingredients
    load = ["syrup_fit.toml"]    # library files or files of `colligate fit --save-solute`,
                                 # relative to the recipe file
    [library.solutes.house_syrup]        # inline solute (keys of a fitted-solute file)
    molar_mass = 0.31                    # kg/mol
    norrish_k = 5.2
    [library.ingredients.house_base]     # inline ingredient (keys of ingredients.toml)
    water = 0.7
    sugars = { house_syrup = 0.3 }
    source = "our lab"

Rules checked when a recipe is loaded (each error names the file, the table
and key, and the valid range; every problem of a file is reported at once):

* the file exists, is at most 10 MB, is UTF-8 and is valid TOML (syntax errors give
  the line; nesting too deep for the reader is named as such);
* only the tables and keys above appear (solute names excepted); two keys of one
  table that differ only by case, spaces, hyphens or underscores are an error, and so
  are two names of the same solute;
* every amount is a finite number >= 0; water is > 0;
* with ``basis = "percent"`` the amounts, water included, add up to
  100 +/- 0.01;
* solute and ingredient names are known to colligate (the message lists the
  nearest names);
* temperatures lie between -60 degC and +40 degC (in the table's unit); a named
  temperature above 0 degC for a frozen product draws a :class:`SuspectUnitWarning`
  (degF typed as degC?);
* ``bound_water_fraction_of_water`` is finite and in [0, 1);
* own solutes and ingredients load, and clash with no other name (the error names both).

Inside the returned :class:`Recipe` everything is SI: amounts in kg,
temperatures in K.
"""

from __future__ import annotations

import math
import os
import sys
import warnings

if sys.version_info >= (3, 11):
    import tomllib
else:  # pragma: no cover  (Python < 3.11: the same parser, packaged as tomli)
    import tomli as tomllib
from dataclasses import dataclass, field
from importlib import resources
from typing import Any, Mapping

from . import api
from .library import Library, LibraryError, as_library

from ._files import MAX_INPUT_BYTES, InputFileError, read_input_bytes
from .units import (
    celsius_from_kelvin,
    fahrenheit_from_kelvin,
    kelvin_from,
    kelvin_from_celsius,
    kelvin_from_fahrenheit,
)

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
    "NAMED_TEMPERATURES",
    "DEFAULT_KIND",
    "FROZEN_KINDS",
    "SuspectUnitWarning",
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
    "fig_gelato": "demo_fig_gelato.toml",
}

#: The scenario ``colligate demo`` runs without ``--scenario``.
DEFAULT_DEMO_SCENARIO = "ice_cream"

#: Kinds of product and their named temperatures with defaults, degC (our names; common
#: practice for the temperatures, change them per recipe). A brine is worked with and
#: used down to a lowest temperature; it is not drawn or served.
NAMED_TEMPERATURES: dict[str, dict[str, float]] = {
    "ice_cream": dict(DEFAULT_TEMPERATURES_C),
    "sorbet": {"drawing": -6.0, "scooping": -11.0, "storage": -18.0},
    "slush": {"pouring": -4.0, "holding": -8.0},
    "frozen_cocktail": {"pouring": -5.0, "holding": -10.0},
    "brine": {"working": -5.0, "lowest_use": -15.0},
    "syrup": {"chilled": 4.0, "frozen_storage": -18.0},
}

#: The kind a recipe is when it names none (its temperatures are drawing, serving, storage).
DEFAULT_KIND = "ice_cream"

#: Kinds whose named temperatures are all below freezing: one above 0 degC draws a warning.
FROZEN_KINDS = ("ice_cream", "sorbet", "slush", "frozen_cocktail")

_TEMPERATURE_TABLES = {"temperatures_celsius": "C", "temperatures_fahrenheit": "F", "temperatures_kelvin": "K"}
_RECIPE_KEYS = {"name", "note", "label", "basis", "batch_kg", "kind"}
_OPTION_KEYS = {"model", "bound_water_fraction_of_water"}
_TABLES = {"recipe", "composition", "ingredients", "options", "library", *_TEMPERATURE_TABLES}
_LIBRARY_KEYS = {"load", "solutes", "ingredients"}
#: Solutes that evaporate with the water when solids are dried, so not counted in total
#: solids (common practice: oven-drying methods drive off ethanol with the water).
VOLATILE_SOLUTES: tuple[str, ...] = ("ethanol",)
_REQUIRED_TABLES = ("recipe",)
_BASES = ("kg", "g", "percent")
_BASIS_UNIT = {"kg": "kg", "g": "g", "percent": "% of batch"}


class SuspectUnitWarning(UserWarning):
    """A number looks like it was given in another unit (e.g. degF typed as degC)."""


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
        Named temperatures, K (for an ice cream ``drawing``, ``serving``, ``storage``;
        other kinds: :data:`NAMED_TEMPERATURES`).
    model : str
        Activity model id passed to colligate.
    bound_water_fraction_of_water : float
        Water that cannot freeze, kg per kg of the recipe's water, in [0, 1). Default 0 for
        a solute recipe; 0.4 kg per kg protein (Schwartzberg 1976, as presented by ASHRAE)
        over the water for an ingredient recipe; plus the unfreezable water that fitted
        effective solutes of the library carry (their ``bound_water_per_solids``).
    library : colligate.Library, optional
        Own solutes and ingredients used next to the built-in ones.
    note, label : str
        Free text from the ``[recipe]`` table ("" when absent).
    basis : str
        ``"kg"``, ``"g"`` or ``"percent"``, as written in the file.
    kind : str
        Kind of product (a key of :data:`NAMED_TEMPERATURES`); sets the names and
        defaults of the named temperatures.
    source : str
        Where the recipe came from (the path, or a description).
    """

    name: str = "recipe"
    water: float = 0.0
    solutes: dict[str, float] = field(default_factory=dict)
    temperatures: dict[str, float] = field(default_factory=dict)
    model: str = "auto"
    bound_water_fraction_of_water: float | None = None
    note: str = ""
    label: str = ""
    basis: str = "kg"
    source: str = "<recipe>"
    path: str | None = field(default=None, compare=False)
    ingredients: dict[str, float] | None = None
    proximate: dict[str, float] = field(default_factory=dict, compare=False)
    library: Any = field(default=None, compare=False, repr=False)
    kind: str = DEFAULT_KIND
    #: The Ingredient behind each key of ``ingredients`` (library entries and the caller's own).
    ingredient_records: dict = field(default_factory=dict, compare=False, repr=False)

    def __post_init__(self) -> None:
        try:
            object.__setattr__(self, "library", as_library(self.library))
        except LibraryError as exc:
            raise RecipeError(f"Recipe: {exc}") from None
        given = self.bound_water_fraction_of_water is not None
        self._build()
        if not given and self.library is not None and self.library.own_solutes:
            # fitted effective solutes carry the food's unfreezable water (kg per kg of solute)
            try:
                extra = self.library.solute_table.bound_water_fraction_of_water(self.solution())
            except ValueError:
                extra = 0.0  # an unknown solute: reported below
            if extra > 0.0:
                object.__setattr__(self, "bound_water_fraction_of_water",
                                   min(float(self.bound_water_fraction_of_water) + extra, 0.999))
        b = self.bound_water_fraction_of_water
        if not (isinstance(b, (int, float)) and not isinstance(b, bool) and math.isfinite(b) and 0.0 <= b < 1.0):
            raise _fail(self.source, "bound_water_fraction_of_water",
                        f"= {b!r}: must be finite and in [0, 1) (kg of water that cannot freeze per kg of water)")
        try:
            self.solution()
        except ValueError as exc:
            where = "[ingredients]" if self.ingredients is not None else "[composition]"
            raise _fail(self.source, where, str(exc)) from None

    def _lookup(self, name: Any) -> Any:
        from .ingredients import ingredient as _builtin_lookup

        return self.library.ingredient(name) if self.library is not None else _builtin_lookup(name)

    def _build(self) -> None:
        # Ingredient-based: Recipe(ingredients={"whole_milk": 0.6, "sucrose": 0.15}) in kg.
        if self.ingredients is not None:
            _lookup = self._lookup
            if self.water or self.solutes:
                raise RecipeError("Recipe: give either ingredients or water and solutes, not both")
            if not isinstance(self.ingredients, Mapping) or not self.ingredients:
                raise RecipeError("Recipe: ingredients must be a non-empty mapping of ingredient name to kg")
            water = 0.0
            solutes: dict[str, float] = {}
            prox = dict.fromkeys(("water", "protein", "fat", "carbohydrate", "fibre", "ash"), 0.0)
            kg_by_key: dict[str, float] = {}
            records: dict[str, Any] = dict(self.ingredient_records)
            problems = _Problems(self.source)
            rule = "amount must be finite and >= 0 (kg)"
            for name, kg in self.ingredients.items():
                x = problems.guard(_number, self.source, f"ingredients['{name}']", kg, rule)
                if x is not None and x < 0.0:
                    problems.add(f"ingredients['{name}'] = {kg}", rule)
                try:
                    ing = records[name] if isinstance(name, str) and name in records else _lookup(name)
                except ValueError as exc:
                    problems.add(f"[ingredients].{name}", str(exc))
                    continue
                if x is None or x < 0.0:
                    continue
                kg_by_key[ing.key or ing.name] = kg_by_key.get(ing.key or ing.name, 0.0) + x
                records[ing.key or ing.name] = ing
                water += x * ing.water
                for sid, w in ing.solutes().items():
                    solutes[sid] = solutes.get(sid, 0.0) + x * w
                for k, v in ing.proximate().items():
                    prox[k] += x * v
            problems.raise_if_any()
            total = sum(kg_by_key.values())
            if not total > 0.0:
                raise _fail(self.source, "[ingredients]", "the amounts add up to 0 kg; a recipe needs a positive batch")
            if not water > 0.0:
                raise _fail(self.source, "[ingredients]", "the ingredients carry no water; a recipe needs water > 0")
            object.__setattr__(self, "ingredients", kg_by_key)
            object.__setattr__(self, "ingredient_records", records)
            object.__setattr__(self, "water", water)
            object.__setattr__(self, "solutes", solutes)
            object.__setattr__(self, "proximate", {k: v / total for k, v in prox.items()})
            if self.bound_water_fraction_of_water is None:
                from .ingredients import BOUND_WATER_PER_PROTEIN

                object.__setattr__(self, "bound_water_fraction_of_water",
                                   min(BOUND_WATER_PER_PROTEIN * prox["protein"] / water, 0.999))
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
        if self.bound_water_fraction_of_water is None:
            object.__setattr__(self, "bound_water_fraction_of_water", 0.0)
        if self.kind not in NAMED_TEMPERATURES:
            raise RecipeError(f"Recipe: kind = {self.kind!r}: must be one of {', '.join(NAMED_TEMPERATURES)}")
        if not self.temperatures:
            object.__setattr__(
                self, "temperatures", {k: kelvin_from_celsius(c) for k, c in NAMED_TEMPERATURES[self.kind].items()}
            )

    def with_changes(self, changes: Mapping[str, "float | None"] | None = None, *,
                     remove: "tuple[str, ...] | list[str]" = (), name: str | None = None) -> "Recipe":
        """A copy of the recipe with ingredients (or, for a recipe of solutes, the water and
        solutes) changed, added or removed; the recipe itself is unchanged.

        Parameters
        ----------
        changes : mapping of str to float or None
            Name -> new amount in kg (an ingredient not in the recipe is added); ``None``
            removes it. Names are matched as the library matches them (case, spaces).
        remove : sequence of str
            Names to take out.
        name : str, optional
            Name of the copy (default: the name with " (changed)").

        Notes
        -----
        Every problem (unknown name, negative amount, removing what is not there) is
        reported at once in one :class:`RecipeError`. Bound water given explicitly is kept;
        bound water that followed the protein (ingredient recipes) follows the new protein.
        """
        import dataclasses

        changes = dict(changes or {})
        for key in remove:
            changes[key] = None
        problems: list[str] = []
        ingredient_based = self.ingredients is not None
        current = dict(self.ingredients) if ingredient_based else {"water": self.water, **self.solutes}

        def match(key: str) -> str | None:
            if ingredient_based:
                if key in self.ingredient_records:
                    return key
                try:
                    ing = self._lookup(key)
                except ValueError as exc:
                    problems.append(str(exc))
                    return None
                return ing.key or ing.name
            k = key.strip()
            if k.lower() == "water":
                return "water"
            sid = _solute_id(k, self.library)
            for have in current:
                if have != "water" and _solute_id(have, self.library) == sid:
                    return have
            try:
                api.Solution(water=1.0, solutes={k: 0.0},
                             **({} if self.library is None else {"table": self.library.solute_table}))
            except ValueError as exc:
                problems.append(f"{key!r}: {exc}")
                return None
            return k

        for key, value in changes.items():
            target = match(str(key))
            if target is None:
                continue
            if value is None:
                if target not in current:
                    problems.append(f"remove {key!r}: not in the recipe (it has {', '.join(current)})")
                else:
                    del current[target]
                continue
            if isinstance(value, bool) or not isinstance(value, (int, float)) or not math.isfinite(value) \
                    or value < 0.0:
                problems.append(f"{key!r} = {value!r}: amount must be a finite number >= 0 (kg)")
                continue
            current[target] = float(value)
        if problems:
            raise RecipeError(f"recipe '{self.source}': with_changes: " + "; ".join(problems))
        new_name = name if name is not None else f"{self.name} (changed)"
        common = dict(name=new_name, source=f"{self.source} with changes", path=None, proximate={})
        if ingredient_based:
            # the share this recipe would get by default (protein, the library's fitted solutes)
            auto = dataclasses.replace(self, water=0.0, solutes={}, bound_water_fraction_of_water=None,
                                       **common).bound_water_fraction_of_water
            given = float(self.bound_water_fraction_of_water or 0.0)
            follows = abs(given - auto) <= 1e-12
            return dataclasses.replace(self, ingredients=current, water=0.0, solutes={},
                                       bound_water_fraction_of_water=None if follows else given, **common)
        water = current.pop("water", 0.0)
        if not water > 0.0:
            raise RecipeError(f"recipe '{self.source}': with_changes: water = {water}: a recipe needs water > 0 kg")
        return dataclasses.replace(self, water=water, solutes=current, **common)

    @classmethod
    def from_toml(cls, path: "str | os.PathLike[str]") -> "Recipe":
        """Read and validate a recipe file (see :func:`load_recipe`)."""
        return load_recipe(path)

    @property
    def ingredient_based(self) -> bool:
        """True for a recipe made of library ingredients."""
        return self.ingredients is not None

    # ------------------------------------------------------------ evaluations (SI)

    def freezing_point(self, *, with_uncertainty: "bool | str" = False) -> Any:
        """Initial freezing point, K (``with_uncertainty``: see :func:`colligate.freezing_point`)."""
        r = api.freezing_point(self.solution(), model=self.model, with_uncertainty=with_uncertainty,
                               bound_water_fraction_of_water=self.bound_water_fraction_of_water)
        return r if with_uncertainty is not False else float(r)

    def ice_fraction(self, T, *, with_uncertainty: "bool | str" = False):
        """Ice mass / total water at T (K, scalar or array)."""
        return api.ice_fraction(self.solution(), T, model=self.model, with_uncertainty=with_uncertainty,
                                bound_water_fraction_of_water=self.bound_water_fraction_of_water)

    def temperature_for_ice_fraction(self, ice_fraction):
        """Temperature, K, at which the recipe has ``ice_fraction`` of its water frozen (in
        [0, 1); scalar or array), with the recipe's model and bound water (see
        :func:`colligate.temperature_for_ice_fraction`)."""
        return api.temperature_for_ice_fraction(
            self.solution(), ice_fraction, model=self.model,
            bound_water_fraction_of_water=self.bound_water_fraction_of_water)

    def leighton_ice_fraction(self, T):
        """Fraction of the water frozen at T (K) by the dairy method of Leighton (1927) /
        Goff & Hartel (2013); a cross-check against the dairy texts (no bound water)."""
        return api.leighton_ice_fraction(self.solution(), T)

    def water_activity(self, T: float = 298.15, *, with_uncertainty: "bool | str" = False) -> Any:
        """Water activity of the unfrozen recipe at T (K), no ice."""
        r = api.water_activity(self.solution(), T=T, model=self.model, with_uncertainty=with_uncertainty)
        return r if with_uncertainty is not False else float(r)

    def enthalpy(self, T, *, with_uncertainty: bool = False):
        """Specific enthalpy, J/kg, with H = 0 at 233.15 K (-40 C); T in K (scalar or array)."""
        return api.enthalpy(self.proximate, self.solution(), T, model=self.model, with_uncertainty=with_uncertainty,
                            bound_water_fraction_of_water=self.bound_water_fraction_of_water)

    def apparent_specific_heat(self, T):
        """Apparent specific heat dH/dT, J/(kg K); T in K (scalar or array)."""
        return api.apparent_specific_heat(self.proximate, self.solution(), T, model=self.model,
                                          bound_water_fraction_of_water=self.bound_water_fraction_of_water)

    def heat_load(self, from_T: float, to_T: float, *, with_uncertainty: bool = False) -> Any:
        """Heat to remove per kg from ``from_T`` to ``to_T`` (K): total, sensible, latent (J/kg);
        with ``with_uncertainty=True`` the total with its standard uncertainty."""
        return api.heat_load(self.proximate, self.solution(), from_T, to_T, model=self.model,
                             with_uncertainty=with_uncertainty,
                             bound_water_fraction_of_water=self.bound_water_fraction_of_water)

    def solution(self) -> "api.Solution":
        """Return the recipe as a :class:`colligate.Solution` (kg of water, kg of each solute)."""
        solutes = {k: v for k, v in self.solutes.items() if v > 0.0}
        if self.library is not None:
            return api.Solution(water=self.water, solutes=solutes, table=self.library.solute_table)
        return api.Solution(water=self.water, solutes=solutes)

    @property
    def total_mass(self) -> float:
        """Total batch mass, kg: every ingredient, or water + solutes for a solute recipe."""
        if self.ingredients is not None:
            return float(sum(self.ingredients.values()))
        return self.water + sum(self.solutes.values())

    def composition_summary(self) -> dict[str, Any]:
        """What the recipe is made of, per component, with where each number comes from.

        Returns a dict with ``batch_kg`` and ``components``: one row per component
        (``water``, ``fat``, ``protein``, ``lactose``, ``other_sugars``, ``msnf`` (milk
        solids-not-fat), ``salts``, ``other_solids``, ``total_solids``, ``ethanol``), each
        with ``kg``, ``percent_of_batch`` and ``sources`` (per ingredient: its key, kg and
        the source of its composition). Total solids leave out water and volatile liquids
        (ethanol): they are what stays after drying. ``ethanol_abv_percent`` is the alcohol
        by volume at 20 degC of the water-ethanol part (OIML R 22, 1975; dissolved solids are
        not counted in the volume) or None without ethanol.
        """
        from .ingredients import MSNF_SPLIT

        names = ("water", "fat", "protein", "lactose", "other_sugars", "msnf", "salts",
                 "other_solids", "total_solids", "ethanol")
        parts: dict[str, list[tuple[str, float, str]]] = {n: [] for n in names}

        def add(component: str, who: str, kg: float, source: str) -> None:
            if kg > 0.0:
                parts[component].append((who, kg, source))

        if self.ingredients is not None:
            for key, kg in self.ingredients.items():
                ing = self.ingredient_records[key]
                sol = ing.solutes()
                lactose = float(ing.sugars.get("lactose", 0.0)) + ing.msnf * MSNF_SPLIT["lactose"]
                sugars = sum(float(v) for v in ing.sugars.values()) - float(ing.sugars.get("lactose", 0.0))
                salts = sum(float(v) for v in ing.salts.values()) + ing.msnf * MSNF_SPLIT["milk_salts"]
                ethanol = float(sol.get("ethanol", 0.0))
                solids = max(0.0, 1.0 - ing.water - ethanol)
                msnf = ing.msnf if ing.msnf > 0.0 or ing.category != "dairy" else max(0.0, solids - ing.fat)
                other = max(0.0, solids - ing.fat - ing.total_protein() - lactose - sugars - salts)
                for component, x in (("water", ing.water), ("fat", ing.fat), ("protein", ing.total_protein()),
                                     ("lactose", lactose), ("other_sugars", sugars), ("msnf", msnf),
                                     ("salts", salts), ("other_solids", other), ("total_solids", solids),
                                     ("ethanol", ethanol)):
                    add(component, key, kg * x, ing.source)
        else:
            kinds = _solute_kinds()
            sweet = set(api.sweetness_table().index)
            where = f"[composition] of {self.source}"
            add("water", "water", self.water, where)
            for name, kg in self.solutes.items():
                sid = _solute_id(name)
                if sid in VOLATILE_SOLUTES:
                    add("ethanol", name, kg, where)
                    continue
                add("total_solids", name, kg, where)
                if sid == "lactose":
                    add("lactose", name, kg, where)
                elif kinds.get(sid) == "electrolyte" or sid == "milk_salts":
                    add("salts", name, kg, where)
                elif sid in sweet:
                    add("other_sugars", name, kg, where)
                else:
                    add("other_solids", name, kg, where)
        batch = self.total_mass
        rows = []
        for n in names:
            kg = sum(x for _, x, _ in parts[n])
            rows.append({"component": n, "kg": kg, "percent_of_batch": 100.0 * kg / batch,
                         "sources": [{"ingredient": who, "kg": x, "source": src} for who, x, src in parts[n]]})
        by = {r["component"]: r["kg"] for r in rows}
        abv = None
        if by["ethanol"] > 0.0:
            abv = 100.0 * float(api.alcohol_by_volume_20c(by["ethanol"], by["water"]))
        return {"batch_kg": batch, "components": rows, "ethanol_abv_percent": abv}

    @property
    def total_solids_fraction(self) -> float:
        """Total solids, kg per kg of batch: everything but water and volatile liquids (ethanol)."""
        rows = self.composition_summary()["components"]
        return next(r["kg"] for r in rows if r["component"] == "total_solids") / self.total_mass

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


class _Problems:
    """Collects every problem of a recipe so that all are reported at once."""

    def __init__(self, source: str) -> None:
        self.source = source
        self.messages: list[str] = []

    def guard(self, fn, *args, default: Any = None, **kwargs) -> Any:
        """fn(*args, **kwargs), or ``default`` after recording the RecipeError it raised."""
        try:
            return fn(*args, **kwargs)
        except RecipeError as exc:
            self.messages.append(str(exc))
            return default

    def add(self, where: str, message: str) -> None:
        self.messages.append(str(_fail(self.source, where, message)))

    def raise_if_any(self) -> None:
        if len(self.messages) == 1:
            raise RecipeError(self.messages[0])
        if self.messages:
            prefix = f"recipe '{self.source}': "
            parts = [m[len(prefix):] if m.startswith(prefix) else m for m in dict.fromkeys(self.messages)]
            raise RecipeError(prefix + f"{len(parts)} problems: "
                              + "; ".join(f"({i}) {m}" for i, m in enumerate(parts, 1)))


def _key_form(key: str) -> str:
    """A key as compared for duplicates: case, spaces, hyphens and underscores ignored."""
    return "".join(ch for ch in str(key).lower() if ch not in " _-\t")


def _duplicate_keys(problems: _Problems, doc: Mapping[str, Any], where: str = "") -> None:
    """Keys of one table that differ only by case, spaces, hyphens or underscores."""
    seen: dict[str, str] = {}
    for key, value in doc.items():
        form = _key_form(key)
        if form in seen:
            place = f"[{where}]" if where else "top level"
            problems.add(f"{place}.{key}" if where else f"[{key}]",
                         f"duplicate of {seen[form]!r} ({place}): keys that differ only by case, spaces "
                         "or underscores name the same thing; keep one")
        else:
            seen[form] = key
        if isinstance(value, dict) and not where:
            _duplicate_keys(problems, value, key)


def parse_recipe(text: str, source: str = "<string>", *, path: str | None = None) -> Recipe:
    """Parse and validate recipe text (TOML). ``source`` is used in error messages.

    Every problem found is reported at once (one :class:`RecipeError` listing them all);
    a TOML syntax error stops the reading at once.

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

    problems = _Problems(source)
    _duplicate_keys(problems, doc)
    extra = [k for k in doc if k not in _TABLES]
    for k in extra:
        problems.add(f"[{k}]", f"unknown table or key; allowed tables are {', '.join(sorted(_TABLES))}")
    temperature_tables = [t for t in _TEMPERATURE_TABLES if t in doc]
    if len(temperature_tables) > 1:
        problems.add(f"[{temperature_tables[1]}]",
                     f"give the named temperatures in one table only (found {', '.join(temperature_tables)})")

    # [recipe]
    head = problems.guard(_table, source, doc, "recipe", required=True, default={}) or {}
    problems.guard(_unknown_keys, source, "recipe", head, _RECIPE_KEYS)
    name = "recipe"
    if "recipe" in doc and "name" not in head:
        problems.add("[recipe].name", "missing key (required, non-empty string)")
    elif "name" in head:
        name = (problems.guard(_string, source, "recipe", "name", head["name"], nonempty=True) or "recipe").strip()
    note = problems.guard(_string, source, "recipe", "note", head.get("note", ""), default="")
    label = problems.guard(_string, source, "recipe", "label", head.get("label", ""), default="")
    basis = (problems.guard(_string, source, "recipe", "basis", head.get("basis", "kg"), default="kg")
             .strip().lower())
    if basis not in _BASES:
        problems.add(f"[recipe].basis = {_show(head['basis'])}", 'must be "kg", "g" or "percent"')
        basis = "kg"
    kind = (problems.guard(_string, source, "recipe", "kind", head.get("kind", DEFAULT_KIND), default=DEFAULT_KIND)
            .strip().lower().replace(" ", "_").replace("-", "_"))
    if kind not in NAMED_TEMPERATURES:
        problems.add(f"[recipe].kind = {_show(head['kind'])}", f"must be one of {', '.join(NAMED_TEMPERATURES)}")
        kind = DEFAULT_KIND
    batch_kg = 1.0
    if "batch_kg" in head:
        if basis != "percent":
            problems.add("[recipe].batch_kg", 'only allowed with basis = "percent"')
        else:
            rule = "batch mass must be finite and > 0 (kg)"
            b = problems.guard(_number, source, "[recipe].batch_kg", head["batch_kg"], rule)
            if b is not None and not b > 0.0:
                problems.add(f"[recipe].batch_kg = {_show(head['batch_kg'])}", rule)
            elif b is not None:
                batch_kg = b

    library = problems.guard(_parse_library, source, doc, path)

    has_comp = "composition" in doc
    has_ing = "ingredients" in doc
    if not has_comp and not has_ing:
        problems.add("[composition]", "missing table (required): a recipe needs [composition] (solutes) or "
                     "[ingredients] (library ingredients)")
    if has_comp and has_ing:
        problems.add("[ingredients]", "give either [composition] (solutes) or [ingredients] (library "
                     "ingredients), not both")
        has_comp = False
    table_name = "ingredients" if has_ing else "composition"
    table = problems.guard(_table, source, doc, table_name, required=False, default={}) or {}
    amounts = _amounts(problems, table_name, table, basis) if (has_comp or has_ing) else {}
    unit = _BASIS_UNIT[basis]
    scale = {"kg": 1.0, "g": 1e-3, "percent": batch_kg / 100.0}[basis]
    water_amount: float | None = None
    if has_ing:
        if not table and isinstance(doc.get("ingredients"), dict):
            problems.add("[ingredients]", "empty table: list at least one ingredient with its amount")
        from .ingredients import ingredient as _builtin_ingredient

        _lookup = library.ingredient if library is not None else _builtin_ingredient
        seen_ingredient: dict[str, str] = {}
        for key in amounts:
            try:
                ing = _lookup(key)
            except ValueError as exc:
                problems.add(f"[ingredients].{key}", str(exc))
                continue
            first = seen_ingredient.setdefault(ing.key or ing.name, key)
            if first != key and _key_form(first) != _key_form(key):
                problems.add(f"[ingredients].{key}", f"names the same ingredient ({ing.key}) as {first!r}; keep one")
        total = sum(amounts.values())
        if basis == "percent" and amounts and abs(total - 100.0) > PERCENT_TOLERANCE:
            problems.add("[ingredients]", f"amounts add up to {total:.6g} %; with basis = \"percent\" they must "
                         f"add up to 100 +/- {PERCENT_TOLERANCE}")
    elif has_comp:
        water_keys = [k for k in amounts if k.strip().lower() == "water"]
        if not water_keys and "water" not in [k.strip().lower() for k in table]:
            problems.add("[composition].water", f"missing key: a recipe needs water > 0 ({unit})")
        elif water_keys:
            water_amount = amounts.pop(water_keys[0])
            if not water_amount > 0.0:
                problems.add(f"[composition].{water_keys[0]} = {_show(table[water_keys[0]])}",
                             f"water must be > 0 ({unit})")
        table_kw = {} if library is None else {"table": library.solute_table}
        for key in amounts:
            try:
                api.Solution(water=1.0, solutes={key: 0.0}, **table_kw)
            except ValueError as exc:
                problems.add(f"[composition].{key}", str(exc))
        same: dict[str, str] = {}
        for key in amounts:
            sid = _solute_id(key, library)
            if sid in same and _key_form(same[sid]) != _key_form(key):
                problems.add(f"[composition].{key}", f"names the same solute ({sid}) as {same[sid]!r}; keep one")
            same.setdefault(sid, key)
        if basis == "percent" and water_amount is not None:
            total = water_amount + sum(amounts.values())
            if abs(total - 100.0) > PERCENT_TOLERANCE:
                problems.add("[composition]", f"amounts add up to {total:.6g} %; with basis = \"percent\" they "
                             f"must add up to 100 +/- {PERCENT_TOLERANCE} (water included)")

    temperatures = _parse_temperatures(problems, doc, kind)
    model, bound = _parse_options(problems, doc)
    problems.raise_if_any()
    _warn_unit_slips(source, kind, temperatures)

    if has_ing:
        recipe = Recipe(
            name=name, temperatures=temperatures, model=model, bound_water_fraction_of_water=bound, note=note,
            label=label, basis=basis, source=source, path=path, kind=kind, library=library,
            ingredients={k: v * scale for k, v in amounts.items()},
        )
        return _finish(recipe)
    assert water_amount is not None
    return _finish(Recipe(
        name=name,
        water=water_amount * scale,
        solutes={k: v * scale for k, v in amounts.items()},
        temperatures=temperatures,
        model=model,
        bound_water_fraction_of_water=bound,
        note=note,
        label=label,
        basis=basis,
        source=source,
        path=path,
        kind=kind,
        library=library,
    ))


def _parse_temperatures(problems: _Problems, doc: Mapping[str, Any], kind: str) -> dict[str, float]:
    """The named temperatures of the recipe's kind, in K, from whichever of
    ``[temperatures_celsius]``, ``[temperatures_fahrenheit]`` or ``[temperatures_kelvin]``
    is given (defaults for the names not given)."""
    source = problems.source
    table_name = next((t for t in _TEMPERATURE_TABLES if t in doc), "temperatures_celsius")
    unit = _TEMPERATURE_TABLES[table_name]
    given = problems.guard(_table, source, doc, table_name, required=False, default={}) or {}
    defaults = NAMED_TEMPERATURES[kind]
    problems.guard(_unknown_keys, source, table_name, given, set(defaults))
    lo, hi = TEMPERATURE_RANGE_C
    lo_k, hi_k = kelvin_from_celsius(lo), kelvin_from_celsius(hi)
    shown = {"C": f"between {lo:g} and {hi:+g} degC",
             "F": f"between {fahrenheit_from_kelvin(lo_k):g} and {fahrenheit_from_kelvin(hi_k):+g} degF",
             "K": f"between {lo_k:g} and {hi_k:g} K"}[unit]
    temperatures: dict[str, float] = {}
    for key, default in defaults.items():
        where = f"[{table_name}].{key}"
        rule = f"temperature must be finite and {shown}"
        if key not in given:
            temperatures[key] = kelvin_from_celsius(default)
            continue
        x = problems.guard(_number, source, where, given[key], rule)
        if x is None:
            continue
        try:
            t_k = kelvin_from(x, unit)
        except ValueError:
            t_k = math.nan
        if not (lo_k - 1e-9 <= t_k <= hi_k + 1e-9):
            problems.add(f"{where} = {_show(given[key])}", rule)
            continue
        temperatures[key] = t_k
    return temperatures


def _warn_unit_slips(source: str, kind: str, temperatures: Mapping[str, float]) -> None:
    """Warns when a named temperature of a frozen product is above 0 degC: likely degF typed
    as degC (an ice cream served at +10 "degC" is served at 10 degF, -12.2 degC)."""
    if kind not in FROZEN_KINDS:
        return
    for name, t_k in temperatures.items():
        t_c = celsius_from_kelvin(t_k)
        if t_c > 0.0:
            as_f = celsius_from_kelvin(kelvin_from_fahrenheit(t_c))
            warnings.warn(
                f"recipe '{source}': {name} temperature {t_c:+g} degC is above 0 degC for a frozen "
                f"product (kind = \"{kind}\"); was it meant in degF ({t_c:g} degF = {as_f:.1f} degC)? "
                "Give degF in [temperatures_fahrenheit]",
                SuspectUnitWarning, stacklevel=4)


def _parse_options(problems: _Problems, doc: Mapping[str, Any]) -> tuple[str, float | None]:
    """[options]: model id and bound water as a share of the water (None: the recipe's default)."""
    source = problems.source
    opts = problems.guard(_table, source, doc, "options", required=False, default={}) or {}
    problems.guard(_unknown_keys, source, "options", opts, _OPTION_KEYS)
    model = (problems.guard(_string, source, "options", "model", opts.get("model", "auto"), default="auto")
             .strip().lower())
    known_models = list(api.models())
    if model not in known_models:
        problems.add(f"[options].model = {_show(opts['model'])}", f"must be one of {', '.join(known_models)}")
        model = "auto"
    bound: float | None = None
    key = "bound_water_fraction_of_water"
    if key in opts:
        rule = "must be finite and in [0, 1) (kg of water that cannot freeze per kg of the recipe's water)"
        b = problems.guard(_number, source, f"[options].{key}", opts[key], rule)
        if b is not None:
            if not 0.0 <= b < 1.0:
                problems.add(f"[options].{key} = {_show(opts[key])}", rule)
            else:
                bound = b
    return model, bound


def _parse_library(source: str, doc: Mapping[str, Any], path: str | None) -> Library | None:
    """[library]: own solutes and ingredients (files to load, inline tables); None if absent."""
    if "library" not in doc:
        return None
    table = _table(source, doc, "library", required=False)
    _unknown_keys(source, "library", table, _LIBRARY_KEYS)
    lib = Library()
    load = table.get("load", [])
    if isinstance(load, str):
        load = [load]
    if not isinstance(load, list) or not all(isinstance(f, str) for f in load):
        raise _fail(source, f"[library].load = {_show(load)}", "must be a file name or a list of file names")
    base = os.path.dirname(path) if path else os.getcwd()
    try:
        for name in load:
            lib.load_file(name if os.path.isabs(name) else os.path.join(base, name))
        lib.add_tables({k: v for k, v in table.items() if k != "load"}, "[library]")
    except ValueError as exc:
        raise _fail(source, "[library]", str(exc)) from None
    return lib


def _amounts(problems: _Problems, table_name: str, table: Mapping[str, Any], basis: str) -> dict[str, float]:
    """Amounts of a [composition] or [ingredients] table, validated (finite, >= 0); every
    bad amount is recorded."""
    unit = _BASIS_UNIT[basis]
    amounts: dict[str, float] = {}
    for key, value in table.items():
        where = f"[{table_name}].{key}"
        if isinstance(value, dict):
            problems.add(where, f"must be a number (amount in {unit}), not a table")
            continue
        rule = f"amount must be finite and >= 0 ({unit})"
        x = problems.guard(_number, problems.source, where, value, rule)
        if x is None:
            continue
        if x < 0.0:
            problems.add(f"{where} = {_show(value)}", rule)
            continue
        amounts[key] = x
    return amounts


def _solute_kinds() -> dict[str, str]:
    return {str(k): str(v) for k, v in api.solutes()["kind"].items()}


def _solute_id(name: str, library: Any = None) -> str:
    try:
        kw = {} if library is None else {"table": library.solute_table}
        sol = api.Solution(water=1.0, solutes={name: 0.0}, **kw)
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
