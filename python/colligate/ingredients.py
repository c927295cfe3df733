"""Ingredients: what a recipe is made of, and the built-in ingredient library.

An :class:`Ingredient` is a list of mass fractions (kg per kg of ingredient): water,
fat, protein, fibre, non-dissolving ash, undissolved other solids, and the dissolved
solutes (sugars, acids, salts, ethanol) by colligate solute id. Dairy ingredients may
give milk solids-not-fat (``msnf``), which is split into lactose, protein and milk salts
by :data:`MSNF_SPLIT` (the average milk of Leighton 1927).

The built-in library lives in ``colligate/data/ingredients.toml``; every entry names its
source. :func:`ingredients` returns it as a pandas DataFrame, :func:`ingredient` looks one
up (unknown names raise an error listing the nearest names).
"""

from __future__ import annotations

import difflib
import functools
import math
import sys
from dataclasses import dataclass, field
from importlib import resources
from typing import Any, Mapping

if sys.version_info >= (3, 11):
    import tomllib
else:  # pragma: no cover
    import tomli as tomllib

from . import api

__all__ = [
    "Ingredient",
    "IngredientError",
    "MSNF_SPLIT",
    "BOUND_WATER_PER_PROTEIN",
    "SUM_TOLERANCE",
    "ingredient",
    "ingredients",
    "library",
]

#: Split of milk solids-not-fat into its dissolved and undissolved parts (mass fractions).
#: Lactose 54.5 % of MSNF (Goff & Hartel 2013, after Van Slyke & Bosworth 1915); protein
#: 3.2/8.99 and salts 0.89/8.99 of the MSNF of Leighton's (1927) average milk.
MSNF_SPLIT: dict[str, float] = {"lactose": 0.545, "protein": 0.356, "milk_salts": 0.099}

#: Unfreezable water per kg of protein (Schwartzberg 1976, as presented in ASHRAE
#: Refrigeration 2006, ch. 9; from memory).
BOUND_WATER_PER_PROTEIN = 0.4

#: Allowed excess of the sum of an ingredient's fractions over 1 (rounding in tables).
SUM_TOLERANCE = 0.005

_BASIC = ("water", "fat", "protein", "fibre", "ash", "other_solids", "ethanol")


class IngredientError(api.InvalidInputError):
    """An ingredient is malformed or unknown; the message names the field and range."""


def _fraction(owner: str, key: str, value: Any) -> float:
    if isinstance(value, bool) or not isinstance(value, (int, float)):
        raise IngredientError(f"ingredient '{owner}': {key} = {value!r}: must be a number in [0, 1] (mass fraction)")
    x = float(value)
    if not math.isfinite(x) or x < 0.0 or x > 1.0:
        raise IngredientError(f"ingredient '{owner}': {key} = {value!r}: a mass fraction must be finite and in [0, 1]")
    return x


@dataclass(frozen=True, eq=False)
class Ingredient:
    """An ingredient as mass fractions (kg per kg). Immutable.

    Parameters
    ----------
    name : str
        Display name.
    water, fat, protein, fibre, ash, other_solids, ethanol : float
        Mass fractions. ``ash`` is mineral matter that is *not* counted as dissolved;
        ``other_solids`` is undissolved carbohydrate (starch, gums, pectin).
    sugars, acids, salts, other_solutes : mapping of str to float
        Dissolved solutes by colligate solute id (see :func:`colligate.solutes`).
    msnf : float
        Milk solids-not-fat, split by :data:`MSNF_SPLIT` into lactose, protein and milk salts.
    source : str
        Where the numbers come from.
    """

    name: str
    water: float = 0.0
    fat: float = 0.0
    protein: float = 0.0
    fibre: float = 0.0
    ash: float = 0.0
    other_solids: float = 0.0
    ethanol: float = 0.0
    sugars: Mapping[str, float] = field(default_factory=dict)
    acids: Mapping[str, float] = field(default_factory=dict)
    salts: Mapping[str, float] = field(default_factory=dict)
    other_solutes: Mapping[str, float] = field(default_factory=dict)
    msnf: float = 0.0
    category: str = "other"
    source: str = ""
    note: str = ""
    key: str = ""
    #: Solute table the solute ids are checked against (default: the built-in one); a
    #: :class:`colligate.Library` passes its own so that own solutes resolve.
    solute_table: Any = field(default=None, compare=False, repr=False)

    def __post_init__(self) -> None:
        if not isinstance(self.name, str) or not self.name.strip():
            raise IngredientError("ingredient: name must be a non-empty string")
        for k in _BASIC + ("msnf",):
            object.__setattr__(self, k, _fraction(self.name, k, getattr(self, k)))
        for group in ("sugars", "acids", "salts", "other_solutes"):
            given = getattr(self, group)
            if not isinstance(given, Mapping):
                raise IngredientError(f"ingredient '{self.name}': {group} must be a mapping of solute id to mass fraction")
            object.__setattr__(self, group, {str(k): _fraction(self.name, f"{group}['{k}']", v) for k, v in given.items()})
        total = self.total()
        if total > 1.0 + SUM_TOLERANCE:
            raise IngredientError(
                f"ingredient '{self.name}': fractions sum to {total:.6g}; they must not exceed 1 "
                f"(+{SUM_TOLERANCE} for rounding)"
            )
        for sid in self.solutes():
            try:
                if self.solute_table is None:
                    api.Solution(water=1.0, solutes={sid: 0.0})
                else:
                    self.solute_table.find(sid)
            except ValueError as exc:
                raise IngredientError(f"ingredient '{self.name}': {exc}") from None

    # ------------------------------------------------------------------ derived

    def with_key(self, key: str) -> "Ingredient":
        """A copy under library key ``key``."""
        import dataclasses

        return dataclasses.replace(self, key=key)

    def entry(self) -> dict[str, Any]:
        """The ingredient as a TOML table of a library file (the keys of ingredients.toml);
        fractions that are 0 and empty groups are left out."""
        out: dict[str, Any] = {"name": self.name, "category": self.category}
        for k in _BASIC + ("msnf",):
            if getattr(self, k):
                out[k] = float(getattr(self, k))
        for group in ("sugars", "acids", "salts", "other_solutes"):
            if getattr(self, group):
                out[group] = {str(k): float(v) for k, v in getattr(self, group).items()}
        out["source"] = self.source
        if self.note:
            out["note"] = self.note
        return out

    def total(self) -> float:
        """Sum of every fraction given (1 for a complete analysis)."""
        s = sum(getattr(self, k) for k in _BASIC) + self.msnf
        for group in (self.sugars, self.acids, self.salts, self.other_solutes):
            s += sum(group.values())
        return s

    def unspecified(self) -> float:
        """1 minus the fractions given (>= 0), counted as undissolved solids."""
        return max(0.0, 1.0 - self.total())

    def solutes(self) -> dict[str, float]:
        """Dissolved solutes by solute id, kg per kg (MSNF split, ethanol included)."""
        out: dict[str, float] = {}

        def add(sid: str, x: float) -> None:
            if x > 0.0:
                out[sid] = out.get(sid, 0.0) + x

        for group in (self.sugars, self.acids, self.salts, self.other_solutes):
            for sid, x in group.items():
                add(sid, x)
        add("lactose", self.msnf * MSNF_SPLIT["lactose"])
        add("milk_salts", self.msnf * MSNF_SPLIT["milk_salts"])
        add("ethanol", self.ethanol)
        return out

    def total_protein(self) -> float:
        """Protein including the protein of the MSNF, kg per kg."""
        return self.protein + self.msnf * MSNF_SPLIT["protein"]

    def lactose_msnf(self) -> float:
        """Milk solids-not-fat, kg per kg (the msnf field)."""
        return self.msnf

    def proximate(self) -> dict[str, float]:
        """Composition for the thermal model: water, protein, fat, carbohydrate, fibre, ash.

        Dissolved sugars, acids, polyols and undissolved carbohydrate count as
        carbohydrate, salts and milk salts as ash; ethanol is counted with the
        carbohydrate polynomial (an approximation: its heat capacity is higher).
        """
        salts = sum(self.salts.values()) + self.msnf * MSNF_SPLIT["milk_salts"]
        carb = (
            sum(self.sugars.values())
            + sum(self.acids.values())
            + sum(self.other_solutes.values())
            + self.msnf * MSNF_SPLIT["lactose"]
            + self.other_solids
            + self.ethanol
            + self.unspecified()
        )
        return {
            "water": self.water,
            "protein": self.total_protein(),
            "fat": self.fat,
            "carbohydrate": carb,
            "fibre": self.fibre,
            "ash": self.ash + salts,
        }


# ---------------------------------------------------------------------- library

_LIBRARY_FILE = "ingredients.toml"
_ALLOWED = set(_BASIC) | {"msnf", "sugars", "acids", "salts", "other_solutes", "name", "category", "source", "note"}


_TEXT_KEYS = ("name", "category", "source", "note")


def ingredient_from_entry(key: str, entry: Any, where: str, *, table: Any = None) -> Ingredient:
    """An :class:`Ingredient` from one TOML table (keys as in ``ingredients.toml``; ``name``
    defaults to the key); ``where`` names the table in errors, ``table`` is the solute table
    its solutes must resolve in. Every problem is an :class:`IngredientError` naming
    ``where`` and the key."""
    if not isinstance(entry, dict):
        raise IngredientError(f"{where} = {entry!r}"[:200] + ": must be a table of the ingredient's mass fractions")
    extra = set(entry) - _ALLOWED
    if extra:
        raise IngredientError(f"{where}.{sorted(extra)[0]}: unknown key; allowed keys are {', '.join(sorted(_ALLOWED))}")
    for k in _TEXT_KEYS:
        if k in entry and not isinstance(entry[k], str):
            raise IngredientError(f"{where}.{k} = {entry[k]!r}"[:200] + ": must be a string")
    if not entry.get("source"):
        raise IngredientError(f"{where}: every ingredient needs a source (where its numbers come from)")
    entry = dict(entry)
    entry.setdefault("name", key)
    try:
        return Ingredient(key=key, solute_table=table, **entry)
    except IngredientError as exc:
        raise IngredientError(f"{where}: {exc}") from None


def _parse_library(text: str, source: str = "ingredient library") -> dict[str, Ingredient]:
    """Ingredients of a library file (TOML: one table per ingredient). Every problem is
    an :class:`IngredientError` naming ``source``, the table and key."""
    try:
        doc = tomllib.loads(text)
    except tomllib.TOMLDecodeError as exc:
        raise IngredientError(f"{source}: TOML syntax error: {exc}") from None
    except RecursionError:
        raise IngredientError(f"{source}: arrays or inline tables nested too deeply for the TOML reader; "
                              "an ingredient is a flat table of mass fractions") from None
    return {key: ingredient_from_entry(key, entry, f"{source}: [{key}]") for key, entry in doc.items()}


@functools.lru_cache(maxsize=1)
def _load() -> tuple[tuple[str, Ingredient], ...]:
    text = (resources.files("colligate") / "data" / _LIBRARY_FILE).read_text(encoding="utf-8")
    return tuple(_parse_library(text).items())


def library() -> dict[str, Ingredient]:
    """The built-in ingredients by key (a new dict each call; the ingredients are immutable)."""
    return dict(_load())


def normal_name(name: str) -> str:
    """The form names are compared in: lower case, spaces and dashes as underscores, no %."""
    return "_".join(name.strip().lower().replace("-", " ").replace("_", " ").replace("%", "").split())


_normal = normal_name


def ingredient(name: str | Ingredient) -> Ingredient:
    """Look up a built-in ingredient by key or display name (case-insensitive).

    Raises
    ------
    IngredientError
        For an unknown name; the message lists the nearest names.
    """
    if isinstance(name, Ingredient):
        return name
    lib = library()
    n = _normal(str(name))
    if n in lib:
        return lib[n]
    for ing in lib.values():
        if _normal(ing.name) == n:
            return ing
    near = difflib.get_close_matches(n, list(lib), n=3, cutoff=0.5)
    hint = f"; nearest names: {', '.join(near)}" if near else ""
    raise IngredientError(f"unknown ingredient '{name}'{hint} (see colligate.ingredients())")


def ingredients():
    """The built-in ingredient library as a pandas DataFrame (mass fractions, with sources)."""
    import pandas as pd

    rows = []
    for key, ing in library().items():
        prox = ing.proximate()
        rows.append(
            {
                "key": key,
                "name": ing.name,
                "category": ing.category,
                "water": ing.water,
                "fat": ing.fat,
                "protein": prox["protein"],
                "msnf": ing.msnf,
                "fibre": ing.fibre,
                "solutes": ", ".join(f"{k} {v:.4g}" for k, v in ing.solutes().items()),
                "total_solids": 1.0 - ing.water,
                "source": ing.source,
            }
        )
    return pd.DataFrame(rows).set_index("key")
