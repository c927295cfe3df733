"""Reports: the numbers of one recipe or solution, as a dict and as plain text.

:func:`build_report` evaluates a :class:`~colligate.recipe.Recipe` or a
:class:`colligate.Solution` with the public colligate API and returns a plain,
JSON-ready dict whose keys carry their units (``freezing_point_K``,
``unfrozen_water_kg``, ...). :func:`format_text` lays that dict out as a plain
text report; :func:`format_json` serialises it.

Every report ends with cautions: the values are model estimates, to be checked
by measurement, and food-safety decisions follow local codes, regulations and
licensed practice.
"""

from __future__ import annotations

import json
import math
import textwrap
import warnings
from typing import Any, Mapping

import colligate as cg

from .recipe import DEFAULT_TEMPERATURES_C, Recipe
from .units import ZERO_CELSIUS_K as ZERO_C_K
from .units import celsius_from_kelvin, fahrenheit_from_kelvin, kelvin_from_celsius

__all__ = [
    "REPORT_FORMAT",
    "CAUTIONS",
    "VERIFY_NOTE",
    "build_report",
    "format_text",
    "format_json",
    "ice_enthalpy_table",
    "write_table_csv",
]

#: Identifier and version of the dict layout produced by :func:`build_report`.
REPORT_FORMAT = "colligate-report/1"

#: Temperature at which the shelf-stability water activity is given, K (25 degC).
AW_REFERENCE_T_K = 298.15

#: Cautions closing every report and CLI run when the core library does not
#: provide its own ``colligate.CAUTIONS``.
_FALLBACK_CAUTIONS: tuple[str, ...] = (
    "These figures are estimates from a thermodynamic model, not measurements. Real "
    "ingredients vary, and every model has a limited range of validity.",
    "Verify freezing behaviour and water activity by measurement on the actual product "
    "(for example with a calibrated water-activity meter and a thermometer) before "
    "relying on them.",
    "Water activity or a freezing point alone does not make a food safe. For food-safety "
    "decisions (shelf stability, brining and curing, alcohol content, storage and "
    "serving temperatures) follow local codes and regulations and the advice of a "
    "qualified food-safety professional or licensed laboratory.",
)

#: Cautions closing every report and CLI run (the library's own list when it has one).
CAUTIONS: tuple[str, ...] = tuple(getattr(cg, "CAUTIONS", None) or _FALLBACK_CAUTIONS)

#: Closing words of every salt, ethanol and water-activity safety statement.
VERIFY_NOTE = "verify by measurement and defer to local regulations"

#: Note shown next to the water activity.
WATER_ACTIVITY_NOTE = (
    "water activity is a model estimate, not a shelf-stability or safety finding; " + VERIFY_NOTE
)

_SALTS = {"sodium_chloride", "potassium_chloride", "calcium_chloride"}


def _electrolytes(solution: "cg.Solution") -> list[str]:
    kinds = {str(k): str(v) for k, v in cg.solutes()["kind"].items()}
    return [k for k in solution.solutes if kinds.get(k) == "electrolyte"]


def _f(x: Any) -> float | None:
    """Float for JSON: None instead of NaN or infinity."""
    try:
        v = float(x)
    except (TypeError, ValueError):
        return None
    return v if math.isfinite(v) else None


def _extra_cautions(solute_ids: set[str], electrolytes: bool = False) -> list[str]:
    out = []
    if "ethanol" in solute_ids:
        out.append(
            "This composition contains ethanol: alcohol content, labelling and sale are "
            "regulated; rely on measured alcohol content, not on this estimate; "
            + VERIFY_NOTE + "."
        )
    if electrolytes or solute_ids & _SALTS:
        out.append(
            "This composition contains salt: brine strengths for curing, pickling or "
            "chilling, brine freezing points and eutectic temperatures must come from a "
            "validated process, not from this estimate; " + VERIFY_NOTE + "."
        )
    return out


def build_report(
    subject: Recipe | "cg.Solution",
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

    with warnings.catch_warnings(record=True) as caught:
        warnings.simplefilter("always")
        body = _compute(solution, temps, model, float(bound_water))
        if isinstance(subject, Recipe):
            body.update(_recipe_extras(subject, solution, temps))

    messages: list[str] = []
    for w in caught:
        text = str(w.message)
        if text not in messages:
            messages.append(text)
            if issubclass(w.category, cg.OutOfValidityRangeWarning):
                warnings.warn(text, cg.OutOfValidityRangeWarning, stacklevel=2)
            else:
                warnings.warn_explicit(w.message, w.category, w.filename, w.lineno)

    report: dict[str, Any] = {
        "report_format": REPORT_FORMAT,
        "colligate_version": str(getattr(cg, "__version__", "unknown")),
        "title": name,
        "label": label,
        "note": note,
        "source": source,
        **body,
        "warnings": messages,
        "cautions": list(CAUTIONS) + _extra_cautions(set(solution.solutes), bool(_electrolytes(solution))),
    }
    return report


def _compute(solution: "cg.Solution", temps: Mapping[str, float], model: str, bound_water: float) -> dict[str, Any]:
    total = float(solution.total_mass)
    water = float(solution.water)
    solids = total - water
    fractions = solution.mass_fractions()
    molal = solution.molalities()

    composition = [
        {"component": "water", "mass_kg": water, "mass_percent": 100.0 * fractions["water"], "molality_mol_per_kg": None}
    ]
    for sid, kg in solution.solutes.items():
        composition.append(
            {
                "component": sid,
                "mass_kg": float(kg),
                "mass_percent": 100.0 * float(fractions[sid]),
                "molality_mol_per_kg": _f(molal.get(sid)),
            }
        )

    tf = float(cg.freezing_point(solution, model=model, bound_water=bound_water))
    freezes = math.isfinite(tf)  # NaN: the library found no freezing point in its search range
    aw = float(cg.water_activity(solution, T=AW_REFERENCE_T_K, model=model))
    eutectic = _eutectic(solution, model, bound_water)
    t_eut = eutectic["temperature_K"] if eutectic and eutectic["found"] else None

    rows = []
    for point, t_k in temps.items():
        t_k = float(t_k)
        if t_eut is not None and t_k < t_eut:
            # Below the eutectic ice and the salt hydrate crystallise together; the ice
            # curve stops at the eutectic, so no number is given.
            rows.append(
                {
                    "name": point,
                    "temperature_K": t_k,
                    "temperature_C": celsius_from_kelvin(t_k),
                    "temperature_F": fahrenheit_from_kelvin(t_k),
                    "state": "below_eutectic",
                    "ice_fraction": None,
                    "ice_percent_of_water": None,
                    "ice_kg": None,
                    "ice_mass_percent_of_batch": None,
                    "unfrozen_water_kg": None,
                    "unfrozen_solids_mass_percent": None,
                    "unfrozen_water_activity": None,
                }
            )
            continue
        if freezes and t_k >= tf:
            ice = 0.0
            aw_t = None
        else:
            phase = cg.unfrozen_phase(solution, t_k, model=model, bound_water=bound_water)
            ice = max(0.0, float(phase.ice))
            aw_t = _f(phase.water_activity)
        liquid = water - ice
        rows.append(
            {
                "name": point,
                "temperature_K": t_k,
                "temperature_C": celsius_from_kelvin(t_k),
                "temperature_F": fahrenheit_from_kelvin(t_k),
                "state": "partly_frozen" if ice > 0.0 else "unfrozen",
                "ice_fraction": ice / water,
                "ice_percent_of_water": 100.0 * ice / water,
                "ice_kg": ice,
                "ice_mass_percent_of_batch": 100.0 * ice / total,
                "unfrozen_water_kg": liquid,
                "unfrozen_solids_mass_percent": 100.0 * solids / (solids + liquid),
                "unfrozen_water_activity": aw_t,
            }
        )

    return {
        "dairy_method": _dairy_method(solution, temps),
        "model": model,
        "model_description": str(cg.describe_model(solution, model=model)),
        "composition": composition,
        "total_mass_kg": total,
        "water_kg": water,
        "total_solids_mass_percent": float(solution.brix),
        "bound_water_kg": bound_water,
        "freezing_point_K": tf if freezes else None,
        "freezing_point_C": celsius_from_kelvin(tf) if freezes else None,
        "freezing_point_F": fahrenheit_from_kelvin(tf) if freezes else None,
        "water_activity_25C": aw,
        "water_activity_note": WATER_ACTIVITY_NOTE,
        "eutectic": eutectic,
        "ice_table": rows,
    }


def _dairy_method(solution: "cg.Solution", temps: Mapping[str, float]) -> dict[str, Any] | None:
    """The Leighton (1927) / Goff & Hartel (2013) dairy method beside the model, for mixes
    of sugars and milk solids only (None otherwise)."""
    if "milk_salts" not in solution.solutes or [e for e in _electrolytes(solution) if e != "milk_salts"]:
        return None
    notes: list[str] = []
    with warnings.catch_warnings(record=True) as caught:
        warnings.simplefilter("always")
        tf = float(cg.leighton_freezing_point(solution))
        rows = [{"name": point, "temperature_K": float(t_k),
                 "ice_percent_of_water": 100.0 * float(cg.leighton_ice_fraction(solution, float(t_k)))}
                for point, t_k in temps.items()]
    for w in caught:
        text = str(w.message)
        if text not in notes:
            notes.append(text)
    return {
        "method": "Leighton (1927) as given by Goff & Hartel (2013), Ice Cream, ch. 6, Table 6.1",
        "freezing_point_K": tf,
        "freezing_point_C": celsius_from_kelvin(tf),
        "ice_table": rows,
        "notes": notes,
    }


def _eutectic(solution: "cg.Solution", model: str, bound_water: float) -> dict[str, Any] | None:
    """The eutectic of a salt-containing solution as a report entry; None without salts."""
    if not _electrolytes(solution):
        return None
    e = cg.eutectic(solution, model=model, bound_water=bound_water)
    t = _f(e.get("temperature"))
    found = bool(e.get("found")) and t is not None
    return {
        "found": found,
        "temperature_K": t if found else None,
        "temperature_C": celsius_from_kelvin(t) if found else None,
        "temperature_F": fahrenheit_from_kelvin(t) if found else None,
        "phase": str(e.get("phase") or ""),
        "formula": str(e.get("formula") or ""),
        "source": str(e.get("source") or ""),
        "reason": str(e.get("reason") or ""),
        "note": "below this temperature the salt hydrate crystallises with the ice and the ice "
        "curve stops; a model estimate for brines and ice-salt baths: " + VERIFY_NOTE,
    }


#: Relative sweetness, sucrose = 1 (mass basis). Sucrose by definition; glucose 0.74,
#: fructose 1.73, maltose 0.33, lactose 0.16: Bender, A Dictionary of Food and Nutrition
#: (Oxford University Press), entry "sweeteners" (fructose 173, glucose 74, maltose 33,
#: lactose 16; read in a public copy). Gaman & Sherrington (1990), The Science of Food,
#: give 170, 75, 30 and 15. Maltotriose 0.1 (from memory); higher saccharides and
#: maltodextrin about 0 (common practice).
RELATIVE_SWEETNESS: dict[str, float] = {
    "sucrose": 1.0, "glucose": 0.74, "fructose": 1.73, "maltose": 0.33, "lactose": 0.16,
    "maltotriose": 0.1, "higher_saccharides": 0.0, "maltodextrin": 0.0,
}

#: Final solubility of lactose in water, g per 100 g water, by degC: Hudson's values as
#: tabulated in Lowe, Experimental Cookery, table "Solubility of lactose in water (Hudson)"
#: (read in a public copy; Hudson's paper itself not read). Below 0 degC the 0 degC value
#: is used (an upper bound: solubility falls with temperature).
LACTOSE_SOLUBILITY_G_PER_100G: tuple[tuple[float, float], ...] = ((0.0, 11.9), (15.0, 16.9), (25.0, 21.6), (39.0, 31.5))

#: Temperature the mix is taken from for the heat load, degC (ageing temperature; common practice).
HEAT_LOAD_FROM_C = 5.0


def _lactose_solubility(t_c: float) -> float:
    pts = LACTOSE_SOLUBILITY_G_PER_100G
    if t_c <= pts[0][0]:
        return pts[0][1]
    for (t1, s1), (t2, s2) in zip(pts, pts[1:]):
        if t_c <= t2:
            return s1 + (s2 - s1) * (t_c - t1) / (t2 - t1)
    return pts[-1][1]


def _freezing_power(sid: str) -> float | None:
    """Freezing-point depression of 10 g solute per 100 g water relative to sucrose (our model)."""
    try:
        ref = ZERO_C_K - cg.freezing_point(cg.Solution(water=1.0, solutes={"sucrose": 0.1}))
        dt = ZERO_C_K - cg.freezing_point(cg.Solution(water=1.0, solutes={sid: 0.1}))
    except ValueError:
        return None
    return dt / ref


def _recipe_extras(recipe: Recipe, solution: "cg.Solution", temps: Mapping[str, float]) -> dict[str, Any]:
    batch = recipe.total_mass
    out: dict[str, Any] = {"batch_mass_kg": batch}
    if recipe.ingredients is not None:
        out["ingredients"] = [
            {"ingredient": k, "mass_kg": v, "mass_percent": 100.0 * v / batch} for k, v in recipe.ingredients.items()
        ]
    solutes = dict(solution.solutes)
    sweet = sum(RELATIVE_SWEETNESS.get(k, 0.0) * v for k, v in solutes.items())
    kinds = {str(k): str(v) for k, v in cg.solutes()["kind"].items()}
    indicators: dict[str, Any] = {
        "total_solids_mass_percent": 100.0 * (1.0 - recipe.water / batch),
        "sweetness_sucrose_equivalent_mass_percent": 100.0 * sweet / batch,
        "freezing_power_relative_to_sucrose": {
            k: _freezing_power(k) for k in solutes if kinds.get(k) == "non_electrolyte" or k in kinds
        },
        "unfrozen_phase": [],
    }
    eut = _eutectic(solution, recipe.model, float(recipe.bound_water or 0.0))
    t_eut = eut["temperature_K"] if eut and eut["found"] else None
    for point in ("serving", "storage"):
        if point not in temps:
            continue
        t_k = float(temps[point])
        if t_eut is not None and t_k < t_eut:
            indicators["unfrozen_phase"].append(
                {"name": point, "temperature_C": celsius_from_kelvin(t_k), "state": "below_eutectic"}
            )
            continue
        phase = cg.unfrozen_phase(solution, t_k, model=recipe.model, bound_water=recipe.bound_water)
        liquid = max(phase.unfrozen_water + phase.bound_water, 1e-12)
        sugars = sum(v for k, v in solutes.items() if kinds.get(k) == "non_electrolyte" and k not in ("ethanol", "milk_salts"))
        salts = sum(v for k, v in solutes.items() if kinds.get(k) == "electrolyte" or k == "milk_salts")
        lac = solutes.get("lactose", 0.0)
        t_c = celsius_from_kelvin(t_k)
        sol = _lactose_solubility(t_c)
        indicators["unfrozen_phase"].append({
            "name": point,
            "temperature_C": t_c,
            "state": "partly_frozen" if phase.ice > 0.0 else "unfrozen",
            "sugars_g_per_100g_water": 100.0 * sugars / liquid,
            "salts_g_per_100g_water": 100.0 * salts / liquid,
            "lactose_g_per_100g_water": 100.0 * lac / liquid,
            "lactose_solubility_g_per_100g_water": sol,
            "lactose_supersaturation": (lac / liquid * 100.0) / sol if lac > 0 else 0.0,
        })
    out["indicators"] = indicators
    t_from = kelvin_from_celsius(HEAT_LOAD_FROM_C)
    t_storage = float(temps.get("storage", kelvin_from_celsius(-18.0)))
    t_to, stop = heat_load_end(t_storage, t_eut)
    q = recipe.heat_load(t_from, t_to)
    out["heat_load"] = {
        "from_C": HEAT_LOAD_FROM_C,
        "to_C": celsius_from_kelvin(t_to),
        "total_kJ_per_kg": q["total"] / 1e3,
        "sensible_kJ_per_kg": q["sensible"] / 1e3,
        "latent_kJ_per_kg": q["latent"] / 1e3,
        "enthalpy_reference": "H = 0 at -40 C",
        "stopped_at": stop,
    }
    return out


#: Coldest temperature of the thermal model, K (-40 degC, the enthalpy reference).
THERMAL_MIN_K = 233.15

#: Calculations that stop at a eutectic stop this far above it, K (the ice curve is
#: solved there; at the eutectic itself the salt phase is already saturated).
EUTECTIC_MARGIN_K = 0.01


def heat_load_end(t_storage: float, t_eutectic: float | None) -> tuple[float, str | None]:
    """Where a cooling calculation towards ``t_storage`` (K) has to stop.

    Returns the end temperature (K) and why it differs from ``t_storage``: ``"eutectic"``
    (the ice curve stops there), ``"thermal_model_limit"`` (-40 degC) or None.
    """
    if t_eutectic is not None and t_storage < t_eutectic + EUTECTIC_MARGIN_K:
        return float(t_eutectic) + EUTECTIC_MARGIN_K, "eutectic"
    if t_storage < THERMAL_MIN_K:
        return THERMAL_MIN_K, "thermal_model_limit"
    return float(t_storage), None


def format_json(report: Mapping[str, Any]) -> str:
    """Serialise a report to strict JSON (no NaN), indented, ending with a newline."""
    return json.dumps(report, indent=2, ensure_ascii=False, allow_nan=False) + "\n"


# --------------------------------------------------------------------------- text layout

_RULE_CHAR = "="
_WIDTH = 78


def _heading(text: str) -> list[str]:
    return ["", text, "-" * len(text)]


def _wrap(text: str, indent: str = "  ", first: str | None = None) -> list[str]:
    out: list[str] = []
    for para in str(text).splitlines() or [""]:
        out.extend(
            textwrap.wrap(
                para,
                width=_WIDTH,
                initial_indent=first if first is not None else indent,
                subsequent_indent=indent,
            )
            or [""]
        )
        first = None
    return out


def _temp(t_c: float, t_f: float, fahrenheit: bool) -> str:
    s = f"{t_c:7.2f} °C"
    if fahrenheit:
        s += f"  ({t_f:6.1f} °F)"
    return s


def format_text(report: Mapping[str, Any], fahrenheit: bool = False) -> str:
    """Lay out a report dict (from :func:`build_report`) as plain text.

    Temperatures are shown in degC; with ``fahrenheit=True`` also in degF.
    The initial freezing point is always shown in both. The text ends with
    the cautions block.
    """
    lines: list[str] = []
    title = f"colligate | freezing and water activity | {report.get('title', '')}"
    lines.append(_RULE_CHAR * min(_WIDTH, max(len(title), 40)))
    lines.append(title)
    if report.get("label"):
        lines.append(f">>> {str(report['label']).upper()} <<<")
    lines.append(_RULE_CHAR * min(_WIDTH, max(len(title), 40)))
    if report.get("note"):
        lines.extend(_wrap(report["note"], indent="  ", first="  "))
    if report.get("source"):
        lines.append(f"  from: {report['source']}")

    # composition
    if report.get("ingredients") and report.get("batch_mass_kg"):
        lines += _heading(f"Composition: water and dissolved solids ({report['total_mass_kg']:.4g} kg of the "
                          f"{report['batch_mass_kg']:.4g} kg batch)")
    else:
        lines += _heading(f"Composition (batch {report['total_mass_kg']:.4g} kg)")
    lines.append(f"  {'component':<20}{'kg':>10}{'mass %':>10}{'mol/kg water':>15}")
    for row in report["composition"]:
        m = row["molality_mol_per_kg"]
        molal = f"{m:15.4f}" if m is not None else f"{'':>15}"
        lines.append(f"  {row['component']:<20}{row['mass_kg']:10.4f}{row['mass_percent']:10.2f}{molal}")
    lines.append(f"  {'dissolved solids':<20}{'':>10}{report['total_solids_mass_percent']:10.2f}   (°Brix-like, mass %)")
    if report.get("bound_water_kg"):
        lines.append(f"  water counted as unable to freeze: {report['bound_water_kg']:.4g} kg")

    # key numbers
    lines += _heading("Key figures")
    if report.get("freezing_point_K") is None:
        lines.append("  initial freezing point   not found: the model gives no ice in its search range")
    else:
        lines.append(
            f"  initial freezing point   {report['freezing_point_C']:7.2f} °C   "
            f"{report['freezing_point_F']:6.1f} °F   {report['freezing_point_K']:.2f} K"
        )
    lines.append(f"  water activity at 25 °C  {report['water_activity_25C']:8.4f}")
    if report.get("water_activity_note"):
        lines.extend(_wrap(f"({report['water_activity_note']})", indent="    ", first="    "))
    eut = report.get("eutectic")
    if eut:
        if eut["found"]:
            salt = f"{eut['phase']} ({eut['formula']})" if eut["phase"] else "a salt hydrate"
            lines.append(
                f"  eutectic                 {eut['temperature_C']:7.2f} °C   "
                f"{eut['temperature_F']:6.1f} °F   {eut['temperature_K']:.2f} K"
            )
            src = f" [{eut['source']}]" if eut.get("source") else ""
            lines.extend(_wrap(f"{salt} would crystallise there{src}; {eut['note']}",
                               indent="    ", first="    "))
        else:
            lines.extend(_wrap(f"eutectic: not found ({eut['reason'] or 'no salt limit in range'})",
                               indent="    ", first="  "))

    # ice table
    unit = "°C" + (" / °F" if fahrenheit else "")
    lines += _heading(f"Ice at the named temperatures ({unit})")
    tcol = 24 if fahrenheit else 12
    lines.append(
        f"  {'point':<10}{'temperature':>{tcol}}{'ice %':>8}{'ice kg':>9}{'liquid kg':>11}{'liquid solids %':>17}"
    )
    for row in report["ice_table"]:
        t = _temp(row["temperature_C"], row["temperature_F"], fahrenheit)
        if row.get("state") == "below_eutectic":
            lines.append(f"  {row['name']:<10}{t:>{tcol}}  below eutectic (salt crystallises; no ice figure)")
            continue
        lines.append(
            f"  {row['name']:<10}{t:>{tcol}}{row['ice_percent_of_water']:8.1f}{row['ice_kg']:9.4f}"
            f"{row['unfrozen_water_kg']:11.4f}{row['unfrozen_solids_mass_percent']:17.1f}"
        )
    lines.append("  ice %: ice as a share of all the water; liquid kg: water still liquid,")
    lines.append("  including any counted as unable to freeze; liquid solids %: dissolved")
    lines.append("  solids as a mass share of the unfrozen liquid.")
    dm = report.get("dairy_method")
    if dm:
        shares = ", ".join(f"{r['name']} {r['ice_percent_of_water']:.1f}" for r in dm["ice_table"])
        lines.extend(_wrap(
            f"For comparison, the dairy texts' method ({dm['method']}): initial freezing point "
            f"{dm['freezing_point_C']:.2f} °C; ice % {shares}"
            + (" (beyond the end of the sucrose table: extrapolated)"
               if any("beyond" in n for n in dm["notes"]) else "") + ".",
            indent="  ", first="  "))

    # model
    lines += _heading(f"Model: {report['model']}")
    lines.extend(_wrap(report.get("model_description", "")))

    if report.get("ingredients"):
        lines += _heading("Ingredients")
        for row in report["ingredients"]:
            lines.append(f"  {row['ingredient']:<28}{row['mass_kg']:10.4f} kg{row['mass_percent']:9.2f} %")
    if report.get("heat_load"):
        q = report["heat_load"]
        lines += _heading("Heat to remove")
        lines.append(
            f"  from {q['from_C']:.1f} °C to {q['to_C']:.1f} °C: {q['total_kJ_per_kg']:.1f} kJ/kg "
            f"(sensible {q['sensible_kJ_per_kg']:.1f}, latent {q['latent_kJ_per_kg']:.1f})"
        )
        if q.get("stopped_at") == "eutectic":
            lines.extend(_wrap("stops at the eutectic: colder, salt and ice crystallise together, "
                               "which this model does not follow"))
        elif q.get("stopped_at"):
            lines.extend(_wrap("stops at -40 °C, the cold end of the thermal model"))
    if report.get("indicators"):
        ind = report["indicators"]
        lines += _heading("Formulation indicators")
        lines.append(f"  total solids               {ind['total_solids_mass_percent']:7.2f} % of batch")
        lines.append(f"  sweetness (as sucrose)     {ind['sweetness_sucrose_equivalent_mass_percent']:7.2f} % of batch")
        fp = ", ".join(f"{k} {v:.2f}" for k, v in ind["freezing_power_relative_to_sucrose"].items() if v is not None)
        lines.extend(_wrap(f"freezing power per gram relative to sucrose (this model): {fp}"))
        for row in ind["unfrozen_phase"]:
            if row.get("state") == "below_eutectic":
                lines.append(f"  {row['name']:<8} {row['temperature_C']:6.1f} °C: below eutectic")
                continue
            lines.append(
                f"  {row['name']:<8} {row['temperature_C']:6.1f} °C: sugars {row['sugars_g_per_100g_water']:.0f} g, "
                f"salts {row['salts_g_per_100g_water']:.1f} g per 100 g liquid water"
            )
            if row["lactose_g_per_100g_water"] > 0:
                lines.append(
                    f"           lactose {row['lactose_g_per_100g_water']:.1f} g per 100 g water, "
                    f"{row['lactose_supersaturation']:.1f} x its solubility (sandiness risk above 1)"
                )
    if report.get("files"):
        lines += _heading("Files written")
        for what, path in report["files"].items():
            lines.append(f"  {what}: {path}")

    if report.get("warnings"):
        lines += _heading("Warnings")
        for w in report["warnings"]:
            lines.extend(_wrap(w, indent="    ", first="  - "))

    lines += _heading("Cautions")
    for c in report["cautions"]:
        lines.extend(_wrap(c, indent="    ", first="  * "))
    if report.get("label"):
        lines.extend(_wrap(f"This report is labelled \"{report['label']}\": its composition is not a "
                           "tested recipe or a product specification.", indent="    ", first="  * "))
    return "\n".join(lines) + "\n"


# --------------------------------------------------------------------------- ice / enthalpy table

#: Temperature span and step of the ice/enthalpy table, degC (warm end, cold end, step in K).
TABLE_RANGE_C: tuple[float, float, float] = (HEAT_LOAD_FROM_C, -40.0, 0.5)

#: Columns of :func:`ice_enthalpy_table`, units in the names.
TABLE_COLUMNS: tuple[str, ...] = (
    "point",
    "temperature_C",
    "temperature_K",
    "state",
    "ice_fraction",
    "ice_kg",
    "unfrozen_water_kg",
    "unfrozen_solids_mass_percent",
    "enthalpy_J_per_kg",
    "apparent_cp_J_per_kg_K",
    "heat_removed_from_fill_J_per_kg",
)


def ice_enthalpy_table(recipe: Recipe, *, step_K: float | None = None):
    """Ice and enthalpy of a recipe over temperature, as a pandas DataFrame.

    Rows run from the fill temperature (:data:`HEAT_LOAD_FROM_C`) down to -40 degC in
    steps of ``step_K`` (default 0.5 K), plus the named temperatures of the recipe, the
    initial freezing point and (for salt solutions) the eutectic; the ``point`` column
    names those rows. Columns (units in the names): see :data:`TABLE_COLUMNS`.
    ``ice_fraction`` is ice over all the water; ``ice_kg`` and ``unfrozen_water_kg`` are
    for the recipe's batch (unfrozen water includes water unable to freeze); enthalpy
    has H = 0 at -40 degC; ``heat_removed_from_fill_J_per_kg`` is H(fill) - H(T).

    Below a salt eutectic the ice curve stops: ``state`` is ``below_eutectic`` and the
    numbers are NaN (empty cells in CSV).
    """
    import numpy as np
    import pandas as pd

    warm_c, cold_c, default_step = TABLE_RANGE_C
    step = float(default_step if step_K is None else step_K)
    if not (math.isfinite(step) and 0.01 <= step <= 10.0):
        raise ValueError(f"step_K = {step_K}: must be between 0.01 and 10 K")
    solution = recipe.solution()
    model = recipe.model
    bound = float(recipe.bound_water or 0.0)
    tf = float(cg.freezing_point(solution, model=model, bound_water=bound))
    eut = _eutectic(solution, model, bound)
    t_eut = eut["temperature_K"] if eut and eut["found"] else None

    n = int(round((warm_c - cold_c) / step))
    points: dict[float, list[str]] = {}
    for k in range(n + 1):
        points.setdefault(round(warm_c - k * step, 9), [])
    points.setdefault(round(warm_c, 9), []).append("fill")
    for name, t_k in recipe.temperatures.items():
        points.setdefault(round(celsius_from_kelvin(float(t_k)), 9), []).append(name)
    if math.isfinite(tf):
        points.setdefault(celsius_from_kelvin(tf), []).append("initial_freezing_point")
    if t_eut is not None:
        points.setdefault(celsius_from_kelvin(t_eut), []).append("eutectic")

    temps_c = np.array(sorted(points, reverse=True), dtype=float)
    temps_k = temps_c + ZERO_C_K
    water = float(solution.water)
    solids = float(solution.total_mass) - water
    in_range = temps_k >= THERMAL_MIN_K - 1e-9
    if t_eut is not None:
        # at the eutectic itself the curve is evaluated a hair above it
        at_eut = np.isclose(temps_k, t_eut, rtol=0.0, atol=1e-9)
        temps_eval = np.where(at_eut, temps_k + EUTECTIC_MARGIN_K, temps_k)
        ok = in_range & (temps_eval > t_eut)
    else:
        temps_eval = temps_k
        ok = in_range
    nan = np.full(temps_k.shape, np.nan)
    ice = nan.copy()
    h = nan.copy()
    cp = nan.copy()
    if ok.any():
        te = np.minimum(temps_eval[ok], 313.15)
        f = np.asarray(recipe.ice_fraction(te), dtype=float)
        if math.isfinite(tf):
            f = np.where(te >= tf, 0.0, f)
        ice[ok] = np.maximum(f, 0.0)
        h[ok] = np.asarray(recipe.enthalpy(te), dtype=float)
        cp[ok] = np.asarray(recipe.apparent_specific_heat(te), dtype=float)
    h_fill = float(recipe.enthalpy(kelvin_from_celsius(warm_c)))
    state = np.where(ice > 0.0, "partly_frozen", "unfrozen").astype(object)
    if t_eut is not None:
        state[temps_k < t_eut - 1e-9] = "below_eutectic"
    state[~in_range] = "outside_thermal_model"
    ice_kg = ice * water
    liquid = water - ice_kg
    df = pd.DataFrame(
        {
            "point": [" ".join(points[t]) for t in sorted(points, reverse=True)],
            "temperature_C": temps_c,
            "temperature_K": temps_k,
            "state": state,
            "ice_fraction": ice,
            "ice_kg": ice_kg,
            "unfrozen_water_kg": liquid,
            "unfrozen_solids_mass_percent": 100.0 * solids / (solids + liquid),
            "enthalpy_J_per_kg": h,
            "apparent_cp_J_per_kg_K": cp,
            "heat_removed_from_fill_J_per_kg": h_fill - h,
        },
        columns=list(TABLE_COLUMNS),
    )
    return df


def write_table_csv(table, path, inputs=(), what: str = "--csv") -> str:
    """Write a DataFrame (e.g. :func:`ice_enthalpy_table`) as CSV, atomically.

    Empty cells stand for values not computed (below a eutectic). Refuses a path that
    names one of ``inputs``. Returns the path written.
    """
    from ._files import atomic_write_text, check_output_path

    check_output_path(path, inputs, what)
    text = table.to_csv(index=False, float_format="%.10g", lineterminator="\n")
    return atomic_write_text(path, text, inputs, what)
