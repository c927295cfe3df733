"""Reports, third layer: the report dict laid out as text, JSON and CSV tables.

Nothing here calls the compiled core: :func:`format_text` and :func:`format_json` take
the dict of :func:`colligate.report_indicators.build_report`, :func:`write_table_csv` a
DataFrame such as :func:`colligate.report_compute.ice_enthalpy_table`.
"""

from __future__ import annotations

import json
import math
import warnings
from typing import Any, Mapping

from ._files import OutputSet, atomic_write_text, check_output_path
from .units import ZERO_CELSIUS_K

__all__ = ["format_text", "format_json", "write_table_csv", "NonFiniteValueWarning"]


class NonFiniteValueWarning(UserWarning):
    """A report value was infinite or NaN; strict JSON has no such numbers, so it was
    written as ``null`` (the message names the key and the value)."""


def _finite_or_null(value: Any, where: str, bad: list[str]) -> Any:
    """A copy of ``value`` with every non-finite float replaced by None; the keys of the
    replaced values are collected in ``bad``. Reports are shallow (a few levels)."""
    if isinstance(value, float):
        if math.isfinite(value):
            return value
        bad.append(f"{where} = {value}")
        return None
    if isinstance(value, Mapping):
        return {k: _finite_or_null(v, f"{where}.{k}" if where else str(k), bad) for k, v in value.items()}
    if isinstance(value, (list, tuple)):
        return [_finite_or_null(v, f"{where}[{i}]", bad) for i, v in enumerate(value)]
    return value

#: Names of the composition-summary components in the text report.
_COMPONENT_LABELS = {"other_sugars": "other sugars", "msnf": "milk solids-not-fat",
                     "other_solids": "other solids", "total_solids": "total solids"}


def format_json(report: Mapping[str, Any]) -> str:
    """Serialise a report to strict JSON, indented, ending with a newline.

    An infinite or NaN number (which strict JSON cannot hold) is written as ``null`` with
    a :class:`NonFiniteValueWarning` naming its key.
    """
    bad: list[str] = []
    clean = _finite_or_null(report, "", bad)
    if bad:
        more = f" and {len(bad) - 3} more" if len(bad) > 3 else ""
        warnings.warn(f"JSON report: {', '.join(bad[:3])}{more}: not a finite number, written as null",
                      NonFiniteValueWarning, stacklevel=2)
    return json.dumps(clean, indent=2, ensure_ascii=False, allow_nan=False) + "\n"


# --------------------------------------------------------------------------- text layout

_RULE_CHAR = "="
_WIDTH = 78


def _heading(text: str) -> list[str]:
    return ["", text, "-" * len(text)]


def _wrap(text: str, indent: str = "  ", first: str | None = None) -> list[str]:
    """Lines of at most _WIDTH characters: greedy filling of whitespace-separated words,
    a word longer than a line cut into line-long pieces; ``first`` indents the first line
    of the first paragraph, ``indent`` every other line.

    Written out instead of :func:`textwrap.wrap` because textwrap's time grows with the
    square of the length of a long word or a long run of spaces (minutes for a recipe
    note of a few megabytes); this takes time linear in the length of ``text``.
    """
    out: list[str] = []
    lead = first if first is not None else indent
    for para in str(text).splitlines() or [""]:
        words = para.split()
        if not words:
            out.append("")
            lead = indent
            continue
        parts, n, fresh = [lead], len(lead), True
        for w in words:
            i = 0
            while i < len(w):
                rest = len(w) - i
                room = _WIDTH - n - (0 if fresh else 1)
                if rest <= room:
                    if not fresh:
                        parts.append(" ")
                        n += 1
                    parts.append(w[i:] if i else w)
                    n += rest
                    fresh = False
                    i = len(w)
                elif fresh:  # longer than a whole line: cut a line-long piece
                    cut = max(room, 1)
                    parts.append(w[i:i + cut])
                    n += cut
                    fresh = False
                    i += cut
                else:
                    out.append("".join(parts))
                    parts, n, fresh = [indent], len(indent), True
        out.append("".join(parts))
        lead = indent
    return out


def _temp(t_c: float, t_f: float, fahrenheit: bool) -> str:
    s = f"{t_c:7.2f} °C"
    if fahrenheit:
        s += f"  ({t_f:6.1f} °F)"
    return s


def _uncertainty_text(u: Mapping[str, Any] | None) -> list[str]:
    """value ± standard uncertainty and the coverage interval of the key figures, when the
    report carries an ``uncertainty`` entry (a solute with stated covariance)."""
    if not u:
        return []
    pct = f"{100.0 * u['level']:g} %"
    lines = _wrap(f"with the uncertainty of the constants of {', '.join(u['constants'])} "
                  f"(value ± standard uncertainty; {pct} coverage interval):", indent="    ", first="  ")

    def band(label: str, b: Mapping[str, Any], scale: float = 1.0, offset: float = 0.0,
             unit: str = "", digits: int = 3) -> None:
        if b.get("value") is None or b.get("standard_uncertainty") is None:
            return
        lo, hi = b["interval"]
        k = f", k = {b['coverage_factor']:.2f}" if b.get("coverage_factor") is not None else ", Monte Carlo"
        lines.append(f"    {label[:24]:<24}{scale * b['value'] + offset:9.{digits}f} ± "
                     f"{scale * b['standard_uncertainty']:.2g}{unit}   "
                     f"[{scale * lo + offset:.{digits}f}, {scale * hi + offset:.{digits}f}]{k}")

    band("initial freezing point", u["freezing_point_K"], offset=-ZERO_CELSIUS_K, unit=" °C", digits=3)
    band("water activity 25 °C", u["water_activity_25C"], digits=5)
    for row in u.get("ice_fraction_of_water", []):
        band(f"ice % at {row['name']}", row, scale=100.0, unit=" %", digits=2)
    if u.get("not_stated"):
        lines.extend(_wrap(f"taken as exact (uncertainty not stated by their sources): {', '.join(u['not_stated'])}",
                           indent="    ", first="    "))
    lines.extend(_wrap(f"({u['note']})", indent="    ", first="    "))
    return lines


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
    summary = report.get("composition_summary")
    if summary:
        lines += _heading(f"Composition of the batch ({report['batch_mass_kg']:.4g} kg)")
        lines.append(f"  {'component':<22}{'kg':>10}{'% of batch':>12}")
        for row in summary:
            label = _COMPONENT_LABELS.get(row["component"], row["component"])
            lines.append(f"  {label:<22}{row['mass_kg']:10.4f}{row['mass_percent_of_batch']:12.2f}")
        lines.extend(_wrap("total solids leave out water and ethanol (what stays after drying); each "
                           "figure comes from the ingredient data, whose sources are in the JSON report."))
        if report.get("ethanol_abv_percent_of_water_and_ethanol") is not None:
            lines.extend(_wrap(
                f"alcohol: {report['ethanol_abv_percent_of_water_and_ethanol']:.2f} % ABV of the water-ethanol "
                "part at 20 °C (OIML R 22 densities; dissolved solids not counted in the volume, so the "
                "whole product's ABV is lower)"))
    lines += _heading(f"Water and dissolved solutes ({report['aqueous_phase_mass_kg']:.4g} kg)")
    lines.append(f"  {'component':<20}{'kg':>10}{'mass %':>10}{'mol/kg water':>15}")
    for row in report["aqueous_phase"]:
        m = row["molality_mol_per_kg"]
        molal = f"{m:15.4f}" if m is not None else f"{'':>15}"
        lines.append(f"  {row['component']:<20}{row['mass_kg']:10.4f}{row['mass_percent_of_aqueous_phase']:10.2f}{molal}")
    lines.append(f"  {'dissolved solids':<20}{'':>10}{report['dissolved_solids_mass_percent_of_aqueous_phase']:10.2f}"
                 "   (°Brix-like mass %, no ethanol)")
    if report.get("bound_water_fraction_of_water"):
        lines.extend(_wrap(f"water counted as unable to freeze: {100.0 * report['bound_water_fraction_of_water']:.2f} % "
                           f"of the water ({report['bound_water_kg_of_aqueous_phase']:.4g} kg)"))

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
    lines.extend(_uncertainty_text(report.get("uncertainty")))
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
        earlier = [s for s in eut.get("salts", []) if not (eut["found"] and s["phase"] == eut.get("phase"))]
        if earlier:
            steps = "; ".join(
                f"{s['phase']} ({s['formula']}) from {s['onset_temperature_C']:.1f} °C"
                + (f" to {s['ends_temperature_C']:.1f} °C" if s.get("ends_temperature_C") is not None else "")
                for s in earlier)
            lines.extend(_wrap(f"salts crystallising on the way down (equilibrium path): {steps}",
                               indent="    ", first="    "))

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
        solids = row["dissolved_solids_mass_percent_of_unfrozen_liquid"]
        lines.append(
            f"  {row['name']:<10}{t:>{tcol}}{row['ice_percent_of_water']:8.1f}{row['ice_kg_of_aqueous_phase']:9.4f}"
            f"{row['unfrozen_water_kg_of_aqueous_phase']:11.4f}"
            + (f"{solids:17.1f}" if solids is not None else f"{'all ice':>17}")
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
            lines.append(f"  {row['ingredient']:<28}{row['mass_kg']:10.4f} kg{row['mass_percent_of_batch']:9.2f} %")
    if report.get("heat_load"):
        q = report["heat_load"]
        lines += _heading("Heat to remove")
        lines.append(
            f"  from {q['from_C']:.1f} °C to {q['to_C']:.1f} °C: {q['total_kJ_per_kg_of_batch']:.1f} kJ/kg "
            f"(sensible {q['sensible_kJ_per_kg_of_batch']:.1f}, latent {q['latent_kJ_per_kg_of_batch']:.1f})"
        )
        if q.get("stopped_at") == "eutectic":
            lines.extend(_wrap("stops at the eutectic: colder, salt and ice crystallise together, "
                               "which this model does not follow"))
        elif q.get("stopped_at"):
            lines.extend(_wrap("stops at -40 °C, the cold end of the thermal model"))
    if report.get("indicators"):
        ind = report["indicators"]
        lines += _heading("Formulation indicators")
        if report.get("total_solids_mass_percent_of_batch") is not None:
            lines.append(f"  total solids               {report['total_solids_mass_percent_of_batch']:7.2f} % of batch")
        lines.append(f"  sweetness (as sucrose)     {ind['sweetness_sucrose_equivalent_mass_percent_of_batch']:7.2f} % of batch")
        fp = ", ".join(f"{k} {v:.2f}" for k, v in ind["freezing_power_relative_to_sucrose"].items() if v is not None)
        lines.extend(_wrap(f"freezing power per gram relative to sucrose (this model): {fp}"))
        for row in ind["unfrozen_phase"]:
            if row.get("state") == "below_eutectic":
                lines.append(f"  {row['name']:<8} {row['temperature_C']:6.1f} °C: below eutectic")
                continue
            lines.append(f"  {row['name']:<8} {row['temperature_C']:6.1f} °C: sugars "
                         f"{row['sugars_g_per_100g_unfrozen_water']:.0f} g, salts "
                         f"{row['salts_g_per_100g_unfrozen_water']:.1f} g per 100 g unfrozen water")
            if row["lactose_g_per_100g_unfrozen_water"] > 0:
                lines.append(f"           lactose {row['lactose_g_per_100g_unfrozen_water']:.1f} g per 100 g "
                             "unfrozen water")
        cry = ind.get("sugar_crystallisation")
        if cry:
            tgp = cry["tg_prime_C"]
            lines.extend(_wrap("glass transition of the maximally freeze-concentrated phase Tg' "
                               + (f"{tgp:.1f} °C" if tgp is not None else "unknown (no glass data)")))
            for sid, row in cry["sugars"].items():
                spots = [a for a in row["at"] if a["crystallisation_possible"]]
                where = ", ".join(f"{a['name']} ({a['supersaturation_ratio']:.1f} x its solubility)" for a in spots)
                verdict = (f"may crystallise at {where}" + (" (sandiness)" if sid == "lactose" else "")
                           if spots else "not supersaturated above Tg' at the named temperatures")
                lines.extend(_wrap(f"{sid}: {verdict}"))
            lines.extend(_wrap(f"({cry['basis']})"))
        lac = ind.get("lactose_in_solution")
        if lac:
            verdict = ("above it" if lac["at_risk"] else "within it")
            lines.extend(_wrap(
                f"trade rule cross-check: MSNF {lac['msnf_mass_percent_of_batch']:.2f} % of batch against at most "
                f"{lac['max_msnf_mass_percent_of_batch']:.2f} % ({lac['rule']}): {verdict}"))
    if report.get("contributions"):
        lines += _contributions_text(report["contributions"])
    if report.get("files"):
        lines += _heading("Files written")
        for what, path in report["files"].items():
            lines.append(f"  {what}: {path}")

    if report.get("warnings"):
        lines += _heading("Warnings")
        for w in report["warnings"]:
            times = f" (raised {w['occurrences']} times, values differing)" if w["occurrences"] > 1 else ""
            lines.extend(_wrap(w["message"] + times, indent="    ", first="  - "))

    lines += _heading("Cautions")
    for c in report["cautions"]:
        lines.extend(_wrap(c, indent="    ", first="  * "))
    if report.get("label"):
        lines.extend(_wrap(f"This report is labelled \"{report['label']}\": its composition is not a "
                           "tested recipe or a product specification.", indent="    ", first="  * "))
    return "\n".join(lines) + "\n"


def _contributions_text(c: Mapping[str, Any]) -> list[str]:
    """The per-ingredient contributions of a report as text lines."""
    where = f"{c['temperature_C']:.1f} °C" + (f" ({c['named']})" if c.get("named") else "")
    lines = _heading(f"What each ingredient does (water kept liquid at {where})")
    lines.append(f"  {'ingredient':<26}{'depression':>12}{'sweetness':>11}{'liquid water':>14}{'ice from':>10}")
    lines.append(f"  {'':<26}{'K (%)':>12}{'% of total':>11}{'held, kg (%)':>14}{'it, kg':>10}")
    for r in c["rows"]:
        dep = r["depression_K"]
        held = r["liquid_water_held_kg"]
        dep_s = f"{dep:.2f} ({r['depression_percent']:.0f})" if dep is not None else "-"
        held_s = f"{held:.3f} ({r['liquid_water_held_percent']:.0f})" if held is not None else "-"
        ice = r["ice_from_its_water_kg"]
        lines.append(f"  {r['ingredient'][:25]:<26}{dep_s:>12}{r['sweetness_percent']:>11.0f}{held_s:>14}"
                     + (f"{ice:>10.3f}" if ice is not None else f"{'-':>10}"))
    t = c["totals"]
    total_dep = t.get("depression_K")
    lines.append(
        f"  {'whole recipe':<26}{(f'{total_dep:.2f}' if total_dep is not None else '-'):>12}{100:>11.0f}"
        + (f"{t['liquid_water_held_kg']:>14.3f}" if t.get("liquid_water_held_kg") is not None else f"{'-':>14}")
        + (f"{t['ice_kg']:>10.3f}" if t.get("ice_kg") is not None else f"{'-':>10}"))
    lines.extend(_wrap("How the shares are counted: " + c["definition"] + "."))
    return lines


def write_table_csv(table, path, inputs=(), what: str = "--csv", *, outputs: OutputSet | None = None) -> str:
    """Write a DataFrame (e.g. :func:`ice_enthalpy_table`) as CSV, atomically.

    Empty cells stand for values not computed (below a eutectic). Refuses a path that
    names one of ``inputs``. With ``outputs`` the file joins that set of a command's
    outputs (renamed into place when it is committed). Returns the path written.
    """
    check_output_path(path, inputs, what)
    text = table.to_csv(index=False, float_format="%.10g", lineterminator="\n")
    return atomic_write_text(path, text, inputs, what, into=outputs)
