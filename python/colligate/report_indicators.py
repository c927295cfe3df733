"""Reports, second layer: figures derived from the core's numbers, and the report dict.

Total solids, sweetness as sucrose equivalent, freezing power relative to sucrose, the
concentrations of the unfrozen phase (sugars, salts, lactose against its solubility) and
the cautions that depend on the composition. :func:`build_report` puts them together with
the numbers of :mod:`colligate.report_compute` into one JSON-ready dict.
"""

from __future__ import annotations

import warnings
from typing import Any, Mapping

from . import api
from ._warnings import CAUTIONS, OutOfValidityRangeWarning
from .contributions import contributions_entry, sucrose_equivalent_kg
from .recipe import DEFAULT_TEMPERATURES_C, Recipe
from .report_compute import (
    VERIFY_NOTE,
    IcePath,
    compute_solution,
    electrolytes,
    heat_load_entry,
    recipe_entries,
    report_eutectic_K,
    solute_kinds,
)
from .units import ZERO_CELSIUS_K as ZERO_C_K
from .units import celsius_from_kelvin, kelvin_from_celsius

__all__ = [
    "REPORT_FORMAT",
    "build_report",
    "extra_cautions",
    "freezing_power",
    "indicators",
]

#: Identifier and version of the dict layout produced by :func:`build_report`.
REPORT_FORMAT = "colligate-report/1"

def _lactose_solubility_g_per_100g(t_k: float) -> float:
    """Lactose solubility at ``t_k`` (K) from the core, in g per 100 g water for display."""
    return 100.0 * float(api.lactose_solubility(t_k))


def freezing_power(sid: str) -> float | None:
    """Freezing-point depression of 10 g solute per 100 g water relative to sucrose (our model)."""
    try:
        ref = ZERO_C_K - api.freezing_point(api.Solution(water=1.0, solutes={"sucrose": 0.1}))
        dt = ZERO_C_K - api.freezing_point(api.Solution(water=1.0, solutes={sid: 0.1}))
    except ValueError:
        return None
    return dt / ref


def indicators(recipe: Recipe, path: IcePath, temps: Mapping[str, float]) -> dict[str, Any]:
    """Formulation indicators of a recipe: total solids, sweetness, freezing power and the
    unfrozen phase at serving and storage temperature."""
    batch = recipe.total_mass
    solution = path.solution
    solutes = dict(solution.solutes)
    sweet = sucrose_equivalent_kg(solutes)
    kinds = solute_kinds()
    out: dict[str, Any] = {
        "total_solids_mass_percent": 100.0 * (1.0 - recipe.water / batch),
        "sweetness_sucrose_equivalent_mass_percent": 100.0 * sweet / batch,
        "freezing_power_relative_to_sucrose": {
            k: freezing_power(k) for k in solutes if kinds.get(k) == "non_electrolyte" or k in kinds
        },
        "unfrozen_phase": [],
    }
    t_eut = report_eutectic_K(path)
    for point in ("serving", "scooping", "holding", "storage", "frozen_storage", "lowest_use"):
        if point not in temps:
            continue
        t_k = float(temps[point])
        if t_eut is not None and t_k < t_eut:
            out["unfrozen_phase"].append(
                {"name": point, "temperature_C": celsius_from_kelvin(t_k), "state": "below_eutectic"}
            )
            continue
        phase = path.unfrozen_phase(t_k)
        liquid = max(phase.unfrozen_water + phase.bound_water, 1e-12)
        sugars = sum(v for k, v in solutes.items() if kinds.get(k) == "non_electrolyte" and k not in ("ethanol", "milk_salts"))
        salts = sum(v for k, v in solutes.items() if kinds.get(k) == "electrolyte" or k == "milk_salts")
        lac = solutes.get("lactose", 0.0)
        t_c = celsius_from_kelvin(t_k)
        sol = _lactose_solubility_g_per_100g(t_k)
        out["unfrozen_phase"].append({
            "name": point,
            "temperature_C": t_c,
            "state": "partly_frozen" if phase.ice > 0.0 else "unfrozen",
            "sugars_g_per_100g_water": 100.0 * sugars / liquid,
            "salts_g_per_100g_water": 100.0 * salts / liquid,
            "lactose_g_per_100g_water": 100.0 * lac / liquid,
            "lactose_solubility_g_per_100g_water": sol,
            "lactose_supersaturation": (lac / liquid * 100.0) / sol if lac > 0 else 0.0,
        })
    return out


def extra_cautions(solute_ids: set[str], has_electrolytes: bool = False) -> list[str]:
    """Cautions added for ethanol and for salts (electrolytes of the core's solute table)."""
    out = []
    if "ethanol" in solute_ids:
        out.append(
            "This composition contains ethanol: alcohol content, labelling and sale are "
            "regulated; rely on measured alcohol content, not on this estimate; "
            + VERIFY_NOTE + "."
        )
    if has_electrolytes:
        out.append(
            "This composition contains salt: brine strengths for curing, pickling or "
            "chilling, brine freezing points and eutectic temperatures must come from a "
            "validated process, not from this estimate; " + VERIFY_NOTE + "."
        )
    return out


def _version() -> str:
    try:
        from ._version import __version__
    except ImportError:  # pragma: no cover - only in a source tree without a build
        from ._core import __version__
    return str(__version__)


def build_report(
    subject: Recipe | "api.Solution",
    temperatures: Mapping[str, float] | None = None,
    model: str | None = None,
    *,
    bound_water: float | None = None,
    name: str | None = None,
    label: str | None = None,
) -> dict[str, Any]:
    """Evaluate a recipe or solution and return a JSON-ready report dict.

    Parameters
    ----------
    subject : Recipe or colligate.Solution
        What to evaluate.
    temperatures : mapping of str to float, optional
        Named temperatures, K. Default: the recipe's, or drawing -5 degC,
        serving -12 degC and storage -18 degC for a bare solution.
    model : str, optional
        Model id (see ``colligate.models()``). Default: the recipe's, else "auto".
    bound_water : float, optional
        Water that cannot freeze, kg. Default: the recipe's, else 0.
    name, label : str, optional
        Title and label shown in the report (default from the recipe).

    Returns
    -------
    dict
        Keys carry units: ``freezing_point_K``, ``freezing_point_C``,
        ``freezing_point_F``, ``water_activity_25C``, ``ice_table`` (rows with
        ``temperature_K``, ``temperature_C``, ``temperature_F``,
        ``ice_fraction``, ``ice_kg``, ``unfrozen_water_kg``,
        ``unfrozen_solids_mass_percent``, ``state``: ``unfrozen``,
        ``partly_frozen`` or ``below_eutectic``, the numbers then None),
        ``eutectic`` (None without salts; else ``found``, ``temperature_K``/``_C``/``_F``,
        ``phase``, ``formula``, ``source``, ``reason``, ``note``),
        ``water_activity_note``, ``composition`` (rows with
        ``mass_kg``, ``mass_percent``, ``molality_mol_per_kg``), ``model``,
        ``model_description``, ``warnings`` and ``cautions`` (always last). A recipe
        adds ``batch_mass_kg``, ``ingredients``, ``indicators`` and ``heat_load``.

    Notes
    -----
    Any :class:`colligate.OutOfValidityRangeWarning` raised while computing is
    recorded in ``report["warnings"]`` and issued again once (per message).
    """
    if isinstance(subject, Recipe):
        solution = subject.solution()
        temps = dict(subject.temperatures) if temperatures is None else dict(temperatures)
        model = subject.model if model is None else model
        bound_water = subject.bound_water if bound_water is None else bound_water
        name = subject.name if name is None else name
        label = subject.label if label is None else label
        note = subject.note
        source = subject.source
    else:
        solution = subject
        temps = (
            {k: kelvin_from_celsius(c) for k, c in DEFAULT_TEMPERATURES_C.items()}
            if temperatures is None
            else dict(temperatures)
        )
        model = "auto" if model is None else model
        bound_water = 0.0 if bound_water is None else bound_water
        name = "Solution" if name is None else name
        label = "" if label is None else label
        note = ""
        source = ""

    path = IcePath(solution, model, float(bound_water))
    with warnings.catch_warnings(record=True) as caught:
        warnings.simplefilter("always")
        body = compute_solution(path, temps)
        if isinstance(subject, Recipe):
            body.update(recipe_entries(subject))
            # indicators and heat load follow the recipe's own model and bound water
            own = IcePath(solution, subject.model, float(subject.bound_water or 0.0))
            if (own.model, own.bound_water) == (path.model, path.bound_water):
                own = path
            body["indicators"] = indicators(subject, own, temps)
            body["heat_load"] = heat_load_entry(subject, own, temps)
            body["contributions"] = contributions_entry(subject)

    messages: list[str] = []
    for w in caught:
        text = str(w.message)
        if text not in messages:
            messages.append(text)
            if issubclass(w.category, OutOfValidityRangeWarning):
                warnings.warn(text, OutOfValidityRangeWarning, stacklevel=2)
            else:
                warnings.warn_explicit(w.message, w.category, w.filename, w.lineno)

    report: dict[str, Any] = {
        "report_format": REPORT_FORMAT,
        "colligate_version": _version(),
        "title": name,
        "label": label,
        "note": note,
        "source": source,
        **body,
        "warnings": messages,
        "cautions": list(CAUTIONS) + extra_cautions(set(solution.solutes), bool(electrolytes(solution))),
    }
    return report
