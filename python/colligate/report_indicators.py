"""Reports, second layer: figures derived from the core's numbers, and the report dict.

Total solids, sweetness as sucrose equivalent, freezing power relative to sucrose, the
concentrations of the unfrozen phase (sugars, salts, lactose), which sugars are
supersaturated in the unfrozen phase above its glass transition Tg' (crystallisation,
lactose sandiness; from the core), the trade's MSNF rule (Hyde & Rothwell 1973) as a
cross-check, and
the cautions that depend on the composition. :func:`build_report` puts them together with
the numbers of :mod:`colligate.report_compute` into one JSON-ready dict.
"""

from __future__ import annotations

import warnings
from typing import Any, Mapping, Sequence

from . import api
from ._warnings import CAUTIONS
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
    "LACTOSE_RULE",
    "build_report",
    "group_warnings",
    "lactose_in_solution",
    "sugar_crystallisation",
    "extra_cautions",
    "freezing_power",
    "indicators",
]

#: Identifier and version of the dict layout produced by :func:`build_report`.
REPORT_FORMAT = "colligate-report/4"



def freezing_power(sid: str) -> float | None:
    """Freezing-point depression of 10 g solute per 100 g water relative to sucrose (our model)."""
    try:
        ref = ZERO_C_K - api.freezing_point(api.Solution(water=1.0, solutes={"sucrose": 0.1}))
        dt = ZERO_C_K - api.freezing_point(api.Solution(water=1.0, solutes={sid: 0.1}))
    except ValueError:
        return None
    return dt / ref


def indicators(recipe: Recipe, path: IcePath, temps: Mapping[str, float]) -> dict[str, Any]:
    """Formulation indicators of a recipe: sweetness, freezing power, the unfrozen phase at
    serving and storage temperature and, for dairy mixes, whether the lactose stays in
    solution by the trade's rule."""
    batch = recipe.total_mass
    solution = path.solution
    solutes = dict(solution.solutes)
    sweet = sucrose_equivalent_kg(solutes)
    kinds = solute_kinds()
    out: dict[str, Any] = {
        "sweetness_sucrose_equivalent_mass_percent_of_batch": 100.0 * sweet / batch,
        "freezing_power_relative_to_sucrose": {
            k: freezing_power(k) for k in solutes if kinds.get(k) == "non_electrolyte" or k in kinds
        },
        "unfrozen_phase": [],
        "lactose_in_solution": lactose_in_solution(recipe),
        "sugar_crystallisation": sugar_crystallisation(recipe, temps),
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
        out["unfrozen_phase"].append({
            "name": point,
            "temperature_C": celsius_from_kelvin(t_k),
            "state": "partly_frozen" if phase.ice > 0.0 else "unfrozen",
            "sugars_g_per_100g_unfrozen_water": 100.0 * sugars / liquid,
            "salts_g_per_100g_unfrozen_water": 100.0 * salts / liquid,
            "lactose_g_per_100g_unfrozen_water": 100.0 * solutes.get("lactose", 0.0) / liquid,
        })
    return out


#: How the lactose indicator is judged, shown with it.
LACTOSE_RULE = ("milk solids-not-fat at most a seventh of the serum (water + MSNF), the rule of "
                "Hyde & Rothwell (1973) for keeping lactose in solution (no sandiness in storage)")


def lactose_in_solution(recipe: Recipe) -> dict[str, Any] | None:
    """Sandiness indicator of a dairy mix: its milk solids-not-fat against the largest that
    keeps lactose in solution by Hyde & Rothwell (1973) (from the core, source key
    ``hyde_rothwell_1973``). None for a recipe without milk solids-not-fat."""
    rows = {r["component"]: r for r in recipe.composition_summary()["components"]}
    batch = recipe.total_mass
    msnf = rows["msnf"]["kg"] / batch
    if not msnf > 0.0:
        return None
    water = rows["water"]["kg"] / batch
    limit = api.max_msnf_for_lactose_in_solution(water, msnf)
    return {
        "msnf_mass_percent_of_batch": 100.0 * msnf,
        "max_msnf_mass_percent_of_batch": 100.0 * limit,
        "at_risk": bool(msnf > limit),
        "rule": LACTOSE_RULE,
        "source": "hyde_rothwell_1973",
    }


#: What the crystallisation indicator means, shown with it.
CRYSTALLISATION_BASIS = (
    "a sugar can crystallise where its concentration in the unfrozen water exceeds its solubility "
    "in pure water (ratio > 1) and the unfrozen phase is above its glass transition Tg'; a "
    "supersaturated phase may still take months to nucleate; solubilities below 0 degC are "
    "extrapolated from tables starting at 0 degC, and Tg' lies where the ice curve is extrapolated")


def sugar_crystallisation(recipe: Recipe, temps: Mapping[str, float]) -> dict[str, Any] | None:
    """Supersaturation of sucrose, lactose and glucose in the unfrozen phase at each named
    temperature, Tg' and the ranges where each can crystallise (from the core,
    ``equilibria/sugar_crystallisation.hpp``). None without any of those sugars."""
    from . import storage

    solution = recipe.solution()
    sugars = [k for k in ("sucrose", "lactose", "glucose") if solution.solutes.get(k, 0.0) > 0.0]
    if not sugars:
        return None
    with warnings.catch_warnings():
        # Below 0 degC every solubility is extrapolated (the tables start at 0 degC) and the ice
        # curve near Tg' may be beyond its model's range: said once in the basis text instead.
        warnings.simplefilter("ignore", api.OutOfValidityRangeWarning)
        cc = storage.crystallisation_check(recipe, dict(temps))
    per: dict[str, Any] = {}
    for sid in sugars:
        rows = cc.states[cc.states["solute"] == sid]
        per[sid] = {
            "ranges_C": [[celsius_from_kelvin(lo), celsius_from_kelvin(hi)] for lo, hi in cc.ranges.get(sid, [])],
            "at": [{"name": str(r["name"]), "temperature_C": celsius_from_kelvin(float(r["temperature"])),
                    "supersaturation_ratio": (float(r["ratio"]) if r["ratio"] == r["ratio"] else None),
                    "glassy": bool(r["glassy"]),
                    "crystallisation_possible": bool(r["crystallisation_possible"])}
                   for _, r in rows.iterrows()],
        }
    tgp = cc.tg_prime
    return {
        "tg_prime_C": celsius_from_kelvin(tgp) if tgp == tgp else None,
        "sugars": per,
        "basis": CRYSTALLISATION_BASIS,
        "source_keys": sorted({c["source"] for c in storage.sugar_solubility_curves().to_dict("records")}
                              | {"roos_1993"}),
    }


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


def _warning_key(text: str) -> str:
    """A warning's text with its numbers masked: messages that differ only in values group."""
    import re

    return re.sub(r"[-+]?\d+(?:\.\d+)?(?:[eE][-+]?\d+)?", "#", text)


def group_warnings(caught: Sequence[warnings.WarningMessage]) -> list[dict[str, Any]]:
    """Distinct warnings, each once: ``message`` (the first of its kind), ``category`` and
    ``occurrences`` (how many were raised with the same text up to the numbers)."""
    groups: dict[tuple[str, str], dict[str, Any]] = {}
    for w in caught:
        text = str(w.message)
        key = (w.category.__name__, _warning_key(text))
        if key in groups:
            groups[key]["occurrences"] += 1
        else:
            groups[key] = {"message": text, "category": w.category.__name__, "occurrences": 1}
    return list(groups.values())


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
    bound_water_fraction_of_water: float | None = None,
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
    bound_water_fraction_of_water : float, optional
        Water that cannot freeze, kg per kg of water. Default: the recipe's, else 0.
    name, label : str, optional
        Title and label shown in the report (default from the recipe).

    Returns
    -------
    dict
        One key per quantity, its unit and its basis in the name (``..._of_batch``,
        ``..._of_aqueous_phase`` (the water and what is dissolved in it),
        ``..._of_unfrozen_liquid``, ``..._of_water``); the layout is described by the JSON
        schema :func:`colligate.report_schema.report_schema` (``report_format``
        "colligate-report/4"). ``warnings`` lists each distinct warning once (``message``,
        ``category``, ``occurrences``); ``cautions`` comes last. A recipe adds
        ``batch_mass_kg``, ``ingredients``, ``composition_summary``, ``indicators`` and
        ``heat_load``.

    Notes
    -----
    Warnings raised while computing are recorded in ``report["warnings"]``, grouped, and
    not issued again: the report is where they are shown.
    """
    if isinstance(subject, Recipe):
        solution = subject.solution()
        temps = dict(subject.temperatures) if temperatures is None else dict(temperatures)
        model = subject.model if model is None else model
        bound = subject.bound_water_fraction_of_water if bound_water_fraction_of_water is None \
            else bound_water_fraction_of_water
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
        bound = 0.0 if bound_water_fraction_of_water is None else bound_water_fraction_of_water
        name = "Solution" if name is None else name
        label = "" if label is None else label
        note = ""
        source = ""

    path = IcePath(solution, model, float(bound or 0.0))
    with warnings.catch_warnings(record=True) as caught:
        warnings.simplefilter("always")
        body = compute_solution(path, temps)
        if isinstance(subject, Recipe):
            body.update(recipe_entries(subject))
            # indicators and heat load follow the recipe's own model and bound water
            own = IcePath(solution, subject.model, float(subject.bound_water_fraction_of_water or 0.0))
            if (own.model, own.bound_water_fraction_of_water) == (path.model, path.bound_water_fraction_of_water):
                own = path
            body["indicators"] = indicators(subject, own, temps)
            body["heat_load"] = heat_load_entry(subject, own, temps)
            body["contributions"] = contributions_entry(subject)

    report: dict[str, Any] = {
        "report_format": REPORT_FORMAT,
        "colligate_version": _version(),
        "title": name,
        "label": label,
        "note": note,
        "source": source,
        **body,
        "warnings": group_warnings(caught),
        "cautions": list(CAUTIONS) + extra_cautions(set(solution.solutes), bool(electrolytes(solution))),
    }
    return report
