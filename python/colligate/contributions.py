"""What each ingredient does in a recipe: its share of the freezing-point depression, of
the sweetness and of the water kept liquid (and of the ice) at a named temperature.

Each share is defined so that the shares of all the ingredients add up to the recipe's
whole, and every number comes from the compiled core (freezing points and ice curves of
:mod:`colligate.api`, relative sweetness from the core's table):

* **depression** (K): each ingredient's solutes alone in all the water of the batch give a
  freezing-point depression ``dT_i``; the recipe's own depression ``dT`` is split in the
  proportions of the ``dT_i``: ``share_i = dT * dT_i / sum_j dT_j``. For an ideal dilute
  solution the ``dT_i`` already add up to ``dT``; otherwise ``interaction = dT / sum dT_i``
  (reported) says how much the solutes' interactions change the sum.
* **sweetness** (kg of sucrose equivalent): each solute's mass times its relative
  sweetness (sucrose = 1), summed over the ingredient's solutes; this is additive, so the
  shares add up to the recipe's sucrose equivalent exactly.
* **water kept liquid** at a temperature T (kg): each ingredient's solutes alone in all the
  water leave ``W_i`` of it unfrozen at T; the recipe's unfrozen freezable water ``W_u``
  is split in the proportions of the ``W_i`` (same rule as the depression).
* **ice from its water** at T (kg): ice is pure water drawn from the one mixed liquid, so
  each ingredient's share of the ice is its share of the water.

For a recipe given as solutes (``[composition]``), each solute and the water count as
ingredients of their own. Water that cannot freeze (bound water) is shown apart.
"""

from __future__ import annotations

import math
import warnings
from typing import Any, Mapping

import numpy as np

from . import api
from .recipe import Recipe, _solute_id
from .units import ZERO_CELSIUS_K, celsius_from_kelvin

__all__ = [
    "CONTRIBUTION_COLUMNS",
    "sucrose_equivalent_kg",
    "ingredient_solutes",
    "contribution_table",
    "contributions",
    "contributions_entry",
    "contribution_temperature",
]

#: Columns of :func:`contributions`, units in the names.
CONTRIBUTION_COLUMNS: tuple[str, ...] = (
    "amount_kg",
    "water_kg",
    "dissolved_kg",
    "depression_alone_K",
    "depression_K",
    "depression_percent",
    "sweetness_sucrose_equivalent_kg",
    "sweetness_percent",
    "liquid_water_held_kg",
    "liquid_water_held_percent",
    "ice_from_its_water_kg",
)


def sucrose_equivalent_kg(solutes: Mapping[str, float]) -> float:
    """Sweetness of dissolved solutes (name -> kg) as kg of sucrose: each solute's mass
    times its relative sweetness from the core's table (sucrose = 1; solutes not in the
    table count as not sweet)."""
    rel = {str(k): float(v) for k, v in api.sweetness_table()["relative_sweetness"].items()}
    return float(sum(rel.get(_solute_id(k), 0.0) * float(v) for k, v in solutes.items()))


def ingredient_solutes(recipe: Recipe) -> dict[str, tuple[float, float, dict[str, float]]]:
    """Each ingredient of ``recipe`` as (amount kg, water kg, {solute id: kg}).

    For a recipe of solutes, the water and each solute are their own ingredients.
    """
    from .ingredients import ingredient as _lookup

    out: dict[str, tuple[float, float, dict[str, float]]] = {}
    if recipe.ingredients is not None:
        for key, kg in recipe.ingredients.items():
            ing = recipe.ingredient_records.get(key) or _lookup(key)
            out[key] = (float(kg), float(kg) * ing.water,
                        {sid: float(kg) * w for sid, w in ing.solutes().items()})
        return out
    out["water"] = (float(recipe.water), float(recipe.water), {})
    for name, kg in recipe.solutes.items():
        out[name] = (float(kg), 0.0, {name: float(kg)} if kg > 0.0 else {})
    return out


def _quiet(fn, *args, **kwargs):
    """Calls fn, collecting validity warnings instead of raising them (the caller reports)."""
    with warnings.catch_warnings(record=True) as caught:
        warnings.simplefilter("always")
        value = fn(*args, **kwargs)
    return value, [str(w.message) for w in caught]


def _split(total: float, parts: Mapping[str, float]) -> dict[str, float]:
    """``total`` split in the proportions of ``parts`` (0 everywhere when they add up to 0)."""
    s = sum(v for v in parts.values() if math.isfinite(v))
    if not (s > 0.0) or not math.isfinite(total):
        return {k: 0.0 for k in parts}
    return {k: (total * v / s if math.isfinite(v) else 0.0) for k, v in parts.items()}


def contribution_table(recipe: Recipe, temperature: float) -> tuple[Any, dict[str, Any]]:
    """The contributions (a DataFrame, see :func:`contributions`) and the recipe's totals
    (a dict) at ``temperature`` (K), with validity notes collected, not issued."""
    import pandas as pd

    parts = ingredient_solutes(recipe)
    solution = recipe.solution()
    water = float(solution.water)
    model = recipe.model
    bound = float(recipe.bound_water_fraction_of_water or 0.0)
    notes: list[str] = []

    table = recipe.library.solute_table if recipe.library is not None else None

    def alone(solutes: Mapping[str, float]) -> "api.Solution | None":
        s = {k: v for k, v in solutes.items() if v > 0.0}
        if not s:
            return None
        # the recipe's own solutes (a library's fitted ones) resolve in its table
        return api.Solution(water=water, solutes=s, table=table) if table is not None else \
            api.Solution(water=water, solutes=s)

    # depression
    tf, n = _quiet(api.freezing_point, solution, model=model, bound_water_fraction_of_water=bound)
    notes += n
    depression = ZERO_CELSIUS_K - tf if math.isfinite(tf) else math.nan
    dt_alone: dict[str, float] = {}
    for key, (_, _, solutes) in parts.items():
        s = alone(solutes)
        if s is None:
            dt_alone[key] = 0.0
            continue
        t, n = _quiet(api.freezing_point, s, model=model)
        notes += n
        dt_alone[key] = ZERO_CELSIUS_K - t if math.isfinite(t) else math.nan
    dt_share = _split(depression, dt_alone)

    # sweetness (additive)
    sweet = {key: sucrose_equivalent_kg(solutes) for key, (_, _, solutes) in parts.items()}
    sweet_total = sum(sweet.values())

    # water kept liquid and ice at the temperature
    phase, n = _quiet(api.unfrozen_phase, solution, float(temperature), model=model, bound_water_fraction_of_water=bound)
    notes += n
    ice = max(0.0, float(phase.ice)) if math.isfinite(phase.ice) else math.nan
    liquid_free = float(phase.unfrozen_water) if math.isfinite(phase.unfrozen_water) else math.nan
    held_alone: dict[str, float] = {}
    for key, (_, _, solutes) in parts.items():
        s = alone(solutes)
        if s is None or not (temperature < ZERO_CELSIUS_K):
            held_alone[key] = 0.0 if s is None else water
            continue
        f, n = _quiet(api.ice_fraction, s, float(temperature), model=model)
        notes += n
        held_alone[key] = water * (1.0 - f) if math.isfinite(f) else math.nan
    if ice == 0.0:
        # nothing frozen at T: the freezable water is all liquid; split as the depression
        held = _split(liquid_free, dt_alone)
    else:
        held = _split(liquid_free, held_alone)

    total_water = sum(p[1] for p in parts.values())
    rows = []
    for key, (kg, w, solutes) in parts.items():
        rows.append({
            "ingredient": key,
            "amount_kg": kg,
            "water_kg": w,
            "dissolved_kg": sum(solutes.values()),
            "depression_alone_K": dt_alone[key],
            "depression_K": dt_share[key],
            "depression_percent": 100.0 * dt_share[key] / depression if depression and depression > 0 else 0.0,
            "sweetness_sucrose_equivalent_kg": sweet[key],
            "sweetness_percent": 100.0 * sweet[key] / sweet_total if sweet_total > 0 else 0.0,
            "liquid_water_held_kg": held[key],
            "liquid_water_held_percent": (100.0 * held[key] / liquid_free
                                          if liquid_free and liquid_free > 0 else 0.0),
            "ice_from_its_water_kg": ice * w / total_water if total_water > 0 else 0.0,
        })
    df = pd.DataFrame(rows).set_index("ingredient")[list(CONTRIBUTION_COLUMNS)]
    summed = sum(v for v in dt_alone.values() if math.isfinite(v))
    totals = {
        "temperature_K": float(temperature),
        "temperature_C": celsius_from_kelvin(float(temperature)),
        "depression_K": depression,
        "interaction": depression / summed if summed > 0 else None,
        "sweetness_sucrose_equivalent_kg": sweet_total,
        "liquid_water_held_kg": liquid_free,
        "bound_water_kg": bound * water,  # the share of the water, as kg
        "ice_kg": ice,
        "notes": list(dict.fromkeys(notes)),
    }
    return df, totals


def contributions(recipe: Recipe, temperature: float | str = "serving"):
    """Each ingredient's share of the recipe's freezing-point depression, sweetness, water
    kept liquid and ice, as a pandas DataFrame indexed by ingredient.

    Parameters
    ----------
    recipe : Recipe
        The recipe.
    temperature : float or str
        Where the water kept liquid and the ice are counted: a temperature in K, or the
        name of one of the recipe's named temperatures (default ``"serving"``, else the
        recipe's first named temperature).

    Returns
    -------
    pandas.DataFrame
        Columns :data:`CONTRIBUTION_COLUMNS` (units in the names). The columns
        ``depression_K``, ``sweetness_sucrose_equivalent_kg``, ``liquid_water_held_kg`` and
        ``ice_from_its_water_kg`` add up to the recipe's totals, given in ``df.attrs``
        (with the temperature, the interaction factor and any validity notes). The module
        docstring defines each share.
    """
    t = contribution_temperature(recipe, temperature)
    df, totals = contribution_table(recipe, t)
    df.attrs.update(totals)
    for note in totals["notes"]:
        warnings.warn(note, api.OutOfValidityRangeWarning, stacklevel=2)
    return df


def contribution_temperature(recipe: Recipe, temperature: float | str) -> float:
    if isinstance(temperature, str):
        temps = dict(recipe.temperatures)
        if temperature in temps:
            return float(temps[temperature])
        if temperature == "serving" and temps:
            for name in ("scooping", "holding", "working", "frozen_storage"):
                if name in temps:
                    return float(temps[name])
            return float(next(iter(temps.values())))
        raise api.InvalidInputError(
            f"temperature = {temperature!r}: not a named temperature of the recipe; "
            f"valid names: {', '.join(temps) or '(none)'}, or a temperature in K")
    t = float(temperature)
    if not (math.isfinite(t) and t > 0.0):
        raise api.InvalidInputError(f"temperature = {temperature!r}: must be finite and > 0 K")
    return t


def contributions_entry(recipe: Recipe, temperature: float | str = "serving") -> dict[str, Any]:
    """:func:`contributions` as a JSON-ready report entry (rows, totals, definitions)."""
    t = contribution_temperature(recipe, temperature)
    df, totals = contribution_table(recipe, t)

    def clean(x: Any) -> Any:
        return float(x) if isinstance(x, (int, float, np.floating)) and math.isfinite(float(x)) else None

    rows = [{"ingredient": str(k), **{c: clean(v) for c, v in r.items()}} for k, r in df.iterrows()]
    return {
        "temperature_K": totals["temperature_K"],
        "temperature_C": totals["temperature_C"],
        "named": next((n for n, v in recipe.temperatures.items() if float(v) == t), None),
        "rows": rows,
        "totals": {k: clean(v) for k, v in totals.items() if k not in ("notes", "temperature_K", "temperature_C")},
        "definition": "shares add up to the recipe's whole: the depression and the water kept liquid are "
        "split in proportion to what each ingredient's solutes alone would do in all the water; "
        "sweetness is additive (sucrose = 1); ice is drawn from each ingredient's water in "
        "proportion to it",
        "notes": totals["notes"],
    }
