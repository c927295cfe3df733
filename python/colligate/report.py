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
from .units import celsius_from_kelvin, fahrenheit_from_kelvin, kelvin_from_celsius

__all__ = ["REPORT_FORMAT", "CAUTIONS", "build_report", "format_text", "format_json"]

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

_SALTS = {"sodium_chloride", "potassium_chloride", "calcium_chloride"}


def _f(x: Any) -> float | None:
    """Float for JSON: None instead of NaN or infinity."""
    try:
        v = float(x)
    except (TypeError, ValueError):
        return None
    return v if math.isfinite(v) else None


def _extra_cautions(solute_ids: set[str]) -> list[str]:
    out = []
    if "ethanol" in solute_ids:
        out.append(
            "This composition contains ethanol: alcohol content, labelling and sale are "
            "regulated; rely on measured alcohol content, not on this estimate."
        )
    if solute_ids & _SALTS:
        out.append(
            "This composition contains salt: brine strengths for curing, pickling or "
            "chilling must come from a validated process, not from this estimate."
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
        ``unfrozen_solids_mass_percent``, ...), ``composition`` (rows with
        ``mass_kg``, ``mass_percent``, ``molality_mol_per_kg``), ``model``,
        ``model_description``, ``warnings`` and ``cautions``.

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
        "cautions": list(CAUTIONS) + _extra_cautions(set(solution.solutes)),
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

    tf = float(cg.freezing_point(solution, model=model))
    freezes = math.isfinite(tf)  # NaN: the library found no freezing point in its search range
    aw = float(cg.water_activity(solution, T=AW_REFERENCE_T_K, model=model))

    rows = []
    for point, t_k in temps.items():
        t_k = float(t_k)
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
        "ice_table": rows,
    }


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

    # ice table
    unit = "°C" + (" / °F" if fahrenheit else "")
    lines += _heading(f"Ice at the named temperatures ({unit})")
    tcol = 24 if fahrenheit else 12
    lines.append(
        f"  {'point':<10}{'temperature':>{tcol}}{'ice %':>8}{'ice kg':>9}{'liquid kg':>11}{'liquid solids %':>17}"
    )
    for row in report["ice_table"]:
        t = _temp(row["temperature_C"], row["temperature_F"], fahrenheit)
        lines.append(
            f"  {row['name']:<10}{t:>{tcol}}{row['ice_percent_of_water']:8.1f}{row['ice_kg']:9.4f}"
            f"{row['unfrozen_water_kg']:11.4f}{row['unfrozen_solids_mass_percent']:17.1f}"
        )
    lines.append("  ice %: ice as a share of all the water; liquid kg: water still liquid,")
    lines.append("  including any counted as unable to freeze; liquid solids %: dissolved")
    lines.append("  solids as a mass share of the unfrozen liquid.")

    # model
    lines += _heading(f"Model: {report['model']}")
    lines.extend(_wrap(report.get("model_description", "")))

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
