"""Side by side: two or more recipes compared on the same temperatures and ice fractions.

:func:`compare_recipes` evaluates each recipe (freezing point, water activity at 25 degC,
dissolved solids, sweetness as sucrose, ice at common temperatures, the temperature at
which a given share of the water is frozen, the eutectic of a brine) and returns a
JSON-ready dict whose layout is described by a JSON schema
(``colligate/data/comparison.schema.json``, :func:`comparison_schema`).
:func:`format_comparison_text` lays it out with one column per recipe,
:func:`plot_comparison` draws the recipes' ice curves on one set of axes.

Every number comes from the compiled core through :mod:`colligate.api`; nothing here
computes physics. Like every report, the comparison ends with the cautions.
"""

from __future__ import annotations

import json
import math
import os
import warnings
from importlib import resources
from typing import Any, Iterable, Mapping, Sequence

import numpy as np

from . import api
from ._warnings import CAUTIONS, OutOfValidityRangeWarning
from .contributions import sucrose_equivalent_kg
from .recipe import Recipe, _solute_id
from .report_compute import AW_REFERENCE_T_K, EUTECTIC_MARGIN_K, IcePath, _f, electrolytes
from .report_indicators import extra_cautions
from .units import ZERO_CELSIUS_K, celsius_from_kelvin, fahrenheit_from_kelvin, kelvin_from_celsius

__all__ = [
    "COMPARISON_FORMAT",
    "DEFAULT_COMPARISON_TEMPERATURES_C",
    "DEFAULT_ICE_FRACTIONS",
    "compare_recipes",
    "comparison_schema",
    "format_comparison_text",
    "format_comparison_json",
    "plot_comparison",
]

#: Identifier and version of the dict layout of :func:`compare_recipes`.
COMPARISON_FORMAT = "colligate-comparison/1"

#: Temperatures every recipe is evaluated at, degC (common practice for frozen desserts:
#: leaving the freezer, dipping cabinet, storage).
DEFAULT_COMPARISON_TEMPERATURES_C: tuple[float, ...] = (-6.0, -12.0, -18.0)

#: Shares of the water frozen whose temperatures are compared (0.5, and 0.7 often quoted
#: for a scoopable texture; common practice).
DEFAULT_ICE_FRACTIONS: tuple[float, ...] = (0.5, 0.7)


def _temps(t_k: float) -> dict[str, float]:
    return {"temperature_K": t_k, "temperature_C": celsius_from_kelvin(t_k),
            "temperature_F": fahrenheit_from_kelvin(t_k)}


def _one(recipe: Recipe, temps_k: Sequence[float], fractions: Sequence[float]) -> dict[str, Any]:
    solution = recipe.solution()
    bound = float(recipe.bound_water_fraction_of_water or 0.0)
    path = IcePath(solution, recipe.model, bound)
    batch = float(recipe.total_mass)
    tf = path.freezing_point
    eut = path.eutectic_temperature if electrolytes(solution) else None
    reach = None
    if math.isfinite(tf):
        try:
            reach = dict(path.curve.reachable_ice())
        except ValueError:
            reach = None

    ice_at = []
    for t in temps_k:
        row = _temps(float(t))
        if eut is not None and t < eut:
            row.update(state="below_eutectic", ice_fraction=None)
        elif math.isfinite(tf) and t >= tf:
            row.update(state="unfrozen", ice_fraction=0.0)
        else:
            row.update(state="partly_frozen", ice_fraction=_f(path.ice_fraction(float(t))))
        ice_at.append(row)

    for_ice = []
    for f in fractions:
        entry: dict[str, Any] = {"ice_fraction": float(f)}
        try:
            t, reason = path.curve.temperature_for_ice_fraction(float(f))
            if reason:
                warnings.warn(reason, OutOfValidityRangeWarning, stacklevel=3)
            entry.update(_temps(float(t)), reachable=True, note="")
        except ValueError as exc:
            entry.update(temperature_K=None, temperature_C=None, temperature_F=None, reachable=False,
                         note=str(exc))
        for_ice.append(entry)

    named = []
    for name, t in recipe.temperatures.items():
        t = float(t)
        row = {"name": name, **_temps(t)}
        if eut is not None and t < eut:
            row["ice_fraction"] = None
        elif math.isfinite(tf) and t >= tf:
            row["ice_fraction"] = 0.0
        else:
            row["ice_fraction"] = _f(path.ice_fraction(t))
        named.append(row)

    return {
        "name": recipe.name,
        "label": recipe.label,
        "source": recipe.source,
        "model": recipe.model,
        "batch_mass_kg": batch,
        # ethanol is a volatile liquid, not a solid: shown apart
        "dissolved_solids_mass_percent": 100.0 * float(sum(v for k, v in solution.solutes.items()
                                                           if _solute_id(k) != "ethanol")) / batch,
        "ethanol_mass_percent": 100.0 * float(sum(v for k, v in solution.solutes.items()
                                                  if _solute_id(k) == "ethanol")) / batch,
        "sweetness_sucrose_equivalent_mass_percent": 100.0 * sucrose_equivalent_kg(solution.solutes) / batch,
        "bound_water_kg": bound * float(solution.water),  # the share of the water, as kg
        "freezing_point_K": _f(tf),
        "freezing_point_C": _f(celsius_from_kelvin(tf)) if math.isfinite(tf) else None,
        "freezing_point_F": _f(fahrenheit_from_kelvin(tf)) if math.isfinite(tf) else None,
        "water_activity_25C": _f(api.water_activity(solution, T=AW_REFERENCE_T_K, model=recipe.model)),
        "eutectic_K": eut,
        "largest_ice_fraction": _f(reach["largest_ice_fraction"]) if reach else None,
        "ice_at": ice_at,
        "temperature_for_ice": for_ice,
        "named_temperatures": named,
    }


def compare_recipes(
    recipes: Sequence[Recipe],
    temperatures: Iterable[float] | None = None,
    ice_fractions: Iterable[float] = DEFAULT_ICE_FRACTIONS,
) -> dict[str, Any]:
    """Compare two or more recipes on the same temperatures and ice fractions.

    Parameters
    ----------
    recipes : sequence of Recipe
        At least two recipes; the first is the reference of the ``differences``.
    temperatures : iterable of float, optional
        Temperatures, K, at which every recipe's ice is given (default
        :data:`DEFAULT_COMPARISON_TEMPERATURES_C` converted to K).
    ice_fractions : iterable of float
        Shares of the water frozen (in (0, 1)) whose temperatures are given.

    Returns
    -------
    dict
        JSON-ready, units in the keys, valid against :func:`comparison_schema`:
        ``comparison_format``, ``colligate_version``, ``temperatures_K``,
        ``ice_fractions``, ``recipes`` (one entry each), ``differences`` (each later recipe
        against the first), ``warnings`` and ``cautions`` (last).
    """
    recipes = list(recipes)
    if len(recipes) < 2:
        raise api.InvalidInputError(f"compare_recipes: got {len(recipes)} recipe(s); give at least two")
    for i, r in enumerate(recipes):
        if not isinstance(r, Recipe):
            raise api.InvalidInputError(f"compare_recipes: recipes[{i}] is a {type(r).__name__}, expected a Recipe")
    temps = ([kelvin_from_celsius(c) for c in DEFAULT_COMPARISON_TEMPERATURES_C]
             if temperatures is None else [float(t) for t in temperatures])
    for t in temps:
        if not (math.isfinite(t) and t > 0.0):
            raise api.InvalidInputError(f"compare_recipes: temperature = {t}: must be finite and > 0 K")
    fractions = [float(f) for f in ice_fractions]
    for f in fractions:
        if not (0.0 < f < 1.0):
            raise api.InvalidInputError(
                f"compare_recipes: ice fraction = {f}: must be in (0, 1) (a share of the water, 0.7 not 70)")

    with warnings.catch_warnings(record=True) as caught:
        warnings.simplefilter("always")
        entries = [_one(r, temps, fractions) for r in recipes]
    messages: list[str] = []
    for w in caught:
        text = str(w.message)
        if text not in messages:
            messages.append(text)
            warnings.warn(text, OutOfValidityRangeWarning, stacklevel=2)

    ref = entries[0]

    def diff(a: float | None, b: float | None) -> float | None:
        return None if a is None or b is None else b - a

    differences = []
    for e in entries[1:]:
        differences.append({
            "name": e["name"],
            "against": ref["name"],
            "freezing_point_K": diff(ref["freezing_point_K"], e["freezing_point_K"]),
            "water_activity_25C": diff(ref["water_activity_25C"], e["water_activity_25C"]),
            "dissolved_solids_mass_percent": diff(ref["dissolved_solids_mass_percent"],
                                                  e["dissolved_solids_mass_percent"]),
            "sweetness_sucrose_equivalent_mass_percent": diff(ref["sweetness_sucrose_equivalent_mass_percent"],
                                                              e["sweetness_sucrose_equivalent_mass_percent"]),
            "ice_fraction_at": [diff(a["ice_fraction"], b["ice_fraction"])
                                for a, b in zip(ref["ice_at"], e["ice_at"])],
            "temperature_for_ice_K": [diff(a["temperature_K"], b["temperature_K"])
                                      for a, b in zip(ref["temperature_for_ice"], e["temperature_for_ice"])],
        })

    ids: set[str] = set()
    salts = False
    for r in recipes:
        s = r.solution()
        ids |= {_solute_id(k) for k in s.solutes}
        salts = salts or bool(electrolytes(s))
    from .report_indicators import _version

    return {
        "comparison_format": COMPARISON_FORMAT,
        "colligate_version": _version(),
        "temperatures_K": temps,
        "ice_fractions": fractions,
        "recipes": entries,
        "differences": differences,
        "warnings": messages,
        "cautions": list(CAUTIONS) + extra_cautions(ids, salts),
    }


def comparison_schema() -> dict[str, Any]:
    """The JSON schema (draft 2020-12) of :func:`compare_recipes`'s dict."""
    text = (resources.files("colligate") / "data" / "comparison.schema.json").read_text(encoding="utf-8")
    return json.loads(text)


def format_comparison_json(comparison: Mapping[str, Any]) -> str:
    """The comparison as strict JSON (no NaN), indented, ending with a newline."""
    return json.dumps(comparison, indent=2, ensure_ascii=False, allow_nan=False) + "\n"


def _cell(value: float | None, fmt: str, missing: str = "-") -> str:
    return missing if value is None else format(value, fmt)


def format_comparison_text(comparison: Mapping[str, Any], fahrenheit: bool = False) -> str:
    """Lay out a comparison as plain text: one column per recipe, one row per figure.

    Temperatures in degC (with ``fahrenheit=True`` in degF as well, on a second row)."""
    import textwrap

    entries = comparison["recipes"]
    width = max(14, min(24, max(len(e["name"]) for e in entries) + 2))
    head = 34

    def line(label: str, cells: Sequence[str]) -> str:
        return f"  {label:<{head}}" + "".join(f"{c:>{width}}" for c in cells)

    def temp_cells(values: Sequence[float | None]) -> list[list[str]]:
        rows = [[_cell(celsius_from_kelvin(v) if v is not None else None, ".2f") for v in values]]
        if fahrenheit:
            rows.append([_cell(fahrenheit_from_kelvin(v) if v is not None else None, ".1f") for v in values])
        return rows

    out = ["=" * 78, "colligate | recipes side by side", "=" * 78]
    for i, e in enumerate(entries, 1):
        lab = f"  [{e['label']}]" if e.get("label") else ""
        out.append(f"  {i}. {e['name']}{lab}  ({e['source']}, model {e['model']})")
    out += ["", line("", [textwrap.shorten(e["name"], width - 1, placeholder="~") for e in entries]),
            "  " + "-" * (head + width * len(entries))]
    unit = "°C" + (" / °F" if fahrenheit else "")
    rows = temp_cells([e["freezing_point_K"] for e in entries])
    out.append(line(f"initial freezing point ({unit})", rows[0]))
    if fahrenheit:
        out.append(line("", rows[1]))
    out.append(line("water activity at 25 °C", [_cell(e["water_activity_25C"], ".4f") for e in entries]))
    out.append(line("dissolved solids, no ethanol (%)", [_cell(e["dissolved_solids_mass_percent"], ".2f")
                                                      for e in entries]))
    if any(e["ethanol_mass_percent"] > 0 for e in entries):
        out.append(line("ethanol (% of batch, by mass)", [_cell(e["ethanol_mass_percent"], ".2f") for e in entries]))
    out.append(line("sweetness as sucrose (% of batch)",
                    [_cell(e["sweetness_sucrose_equivalent_mass_percent"], ".2f") for e in entries]))
    if any(e["eutectic_K"] is not None for e in entries):
        out.append(line("eutectic (°C)", [_cell(celsius_from_kelvin(e["eutectic_K"]) if e["eutectic_K"] else None,
                                                ".2f", "none") for e in entries]))
    for k, t in enumerate(comparison["temperatures_K"]):
        t_c = celsius_from_kelvin(t)
        lab = f"ice % of water at {t_c:.1f} °C" + (f" ({fahrenheit_from_kelvin(t):.1f} °F)" if fahrenheit else "")
        cells = []
        for e in entries:
            row = e["ice_at"][k]
            cells.append("below eut." if row["state"] == "below_eutectic" else _cell(
                100.0 * row["ice_fraction"] if row["ice_fraction"] is not None else None, ".1f"))
        out.append(line(lab, cells))
    for k, f in enumerate(comparison["ice_fractions"]):
        vals = [e["temperature_for_ice"][k]["temperature_K"] for e in entries]
        rows = [[c if c != "-" else "unreached" for c in r] for r in temp_cells(vals)]
        out.append(line(f"{100 * f:.0f} % of water frozen at ({unit})", rows[0]))
        if fahrenheit:
            out.append(line("", rows[1]))
    for d in comparison["differences"]:
        dt = d["freezing_point_K"]
        if dt is not None:
            out.append("")
            out += textwrap.wrap(
                f"{d['name']} against {d['against']}: freezing point {dt:+.2f} K, dissolved solids "
                f"{_cell(d['dissolved_solids_mass_percent'], '+.2f')} points, sweetness "
                f"{_cell(d['sweetness_sucrose_equivalent_mass_percent'], '+.2f')} points.",
                width=78, initial_indent="  ", subsequent_indent="  ")
    notes = [(e["name"], x["note"]) for e in entries for x in e["temperature_for_ice"] if x["note"]]
    if notes:
        out += ["", "Ice fractions not reached", "-" * 25]
        for name, note in notes:
            out += textwrap.wrap(f"{name}: {note}", width=78, initial_indent="  - ", subsequent_indent="    ")
    if comparison.get("warnings"):
        out += ["", "Warnings", "--------"]
        for w in comparison["warnings"]:
            out += textwrap.wrap(w, width=78, initial_indent="  - ", subsequent_indent="    ")
    out += ["", "Cautions", "--------"]
    for c in comparison["cautions"]:
        out += textwrap.wrap(c, width=78, initial_indent="  * ", subsequent_indent="    ")
    if any(e.get("label") for e in entries):
        out += textwrap.wrap("Recipes marked with a label in brackets are not tested recipes or product "
                             "specifications.", width=78, initial_indent="  * ", subsequent_indent="    ")
    return "\n".join(out) + "\n"


_COLOURS = ("#174a7c", "#c4622d", "#1b7f79", "#5b4a9e", "#9e3b63", "#7a7a2e")
_STYLES = ("-", "--", "-.", ":")


def plot_comparison(
    recipes: Sequence[Recipe],
    path: str | os.PathLike[str],
    *,
    temperatures: Iterable[float] | None = None,
    fahrenheit: bool = False,
    title: str | None = None,
    inputs: Iterable[str | os.PathLike[str]] = (),
    points: int = 301,
) -> str:
    """Write one plot with the ice curves (ice, % of the water, against temperature) of
    every recipe, their initial freezing points marked and ``temperatures`` (K; default
    :data:`DEFAULT_COMPARISON_TEMPERATURES_C`) drawn as thin lines. ``fahrenheit`` adds a
    degF scale on top. The file type follows the extension (``.png``, ``.svg`` ...).
    Returns the path written."""
    from .plot import CURVE_RANGE_C, _figure, _ice_axes, _save, check_plot_path

    target = check_plot_path(path, inputs)
    recipes = list(recipes)
    if not recipes:
        raise api.InvalidInputError("plot_comparison: no recipes given")
    temps = ([kelvin_from_celsius(c) for c in DEFAULT_COMPARISON_TEMPERATURES_C]
             if temperatures is None else [float(t) for t in temperatures])
    warm_c, cold_c = CURVE_RANGE_C
    fig = _figure(8.5, 5.2)
    ax = fig.add_subplot(1, 1, 1)
    for i, r in enumerate(recipes):
        solution = r.solution()
        p = IcePath(solution, r.model, float(r.bound_water_fraction_of_water or 0.0))
        tf = p.freezing_point
        eut = p.eutectic_temperature if electrolytes(solution) else None
        grid = np.linspace(warm_c, cold_c, points)
        if eut is not None:
            stop = celsius_from_kelvin(eut) + EUTECTIC_MARGIN_K
            grid = np.unique(np.append(grid[grid > stop], stop))[::-1] if stop > cold_c else grid
        if math.isfinite(tf):
            grid = np.unique(np.append(grid, celsius_from_kelvin(tf)))[::-1]
        tk = grid + ZERO_CELSIUS_K
        frac = np.asarray(p.ice_fraction(tk), dtype=float)
        if math.isfinite(tf):
            frac = np.where(tk >= tf, 0.0, frac)
        colour = _COLOURS[i % len(_COLOURS)]
        name = r.name + (f" [{r.label}]" if r.label else "")
        ax.plot(grid, 100.0 * frac, color=colour, linestyle=_STYLES[i % len(_STYLES)], linewidth=2.0,
                label=name + (f": freezes at {celsius_from_kelvin(tf):.2f} °C" if math.isfinite(tf) else ""))
        if math.isfinite(tf):
            ax.plot([celsius_from_kelvin(tf)], [0.0], marker="o", color=colour, zorder=5)
        if eut is not None:
            ax.axvline(celsius_from_kelvin(eut), color=colour, linewidth=1.5, alpha=0.5)
    for t in temps:
        ax.axvline(celsius_from_kelvin(t), color="#9a9a9a", linestyle=":", linewidth=0.9)
    _ice_axes(ax, warm_c, cold_c, title or "Ice curves side by side", fahrenheit, "lower right")
    fig.text(0.01, 0.01, "colligate; estimates only, verify by measurement", fontsize=7, color="#555555")
    fig.tight_layout(rect=(0, 0.03, 1, 1))
    return _save(fig, target, inputs)
