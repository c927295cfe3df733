#!/usr/bin/env python3
"""Validation gallery: colligate against every published table in tests/reference.

For each check of tests/reference/tolerances.toml (the tolerances shared with the tests)
this computes the model value of every selected row, draws the model against the
published values with the residuals inside the tolerance band and the source named under
the plot, and writes one PNG per check plus `gallery.md` (a page for the documentation
site). Tables that are shown but not checked (the `[[shown]]` entries) are drawn or listed
with the reason.

Exit status 1 when any point leaves its tolerance, or when a reference table is neither
checked nor listed as shown, so the gallery cannot drift from the tests.

    python tools/validation_gallery.py --out build/gallery
    python tools/validation_gallery.py --no-plots            # checks only
    python tools/validation_gallery.py --reference-dir DIR   # another copy of the tables
"""
from __future__ import annotations

import argparse
import pathlib
import sys
import tomllib
import warnings
from dataclasses import dataclass, field
from typing import Callable

import numpy as np
import pandas as pd

ROOT = pathlib.Path(__file__).resolve().parents[1]
REFERENCE = ROOT / "tests" / "reference"
# Celsius offset of the SI definition (not the model's ice point, so that a wrong ice
# point shows up as a wrong temperature).
CELSIUS = 273.15
STANDARD_SEAWATER_SA = 35.16504  # g/kg, Millero et al. (2008)


def _cg():
    import colligate

    return colligate


def _depression(row) -> float:
    cg = _cg()
    s = cg.Solution.from_mass_fractions({row.solute: row.mass_percent / 100.0})
    return CELSIUS - cg.freezing_point(s)


def _freezing_point_c(row) -> float:
    cg = _cg()
    s = cg.Solution.from_mass_fractions({row.solute: row.mass_percent / 100.0})
    return cg.freezing_point(s) - CELSIUS


def _osmotic(solute: str, model: str) -> Callable:
    def f(row) -> float:
        cg = _cg()
        s = cg.Solution.from_molalities({solute: row.molality_mol_per_kg})
        return cg.osmotic_coefficient(s, T=row.temperature_K, model=model)

    return f


def _seawater_freezing_point_c(row) -> float:
    cg = _cg()
    return cg.freezing_point(cg.Solution.seawater(row.absolute_salinity_g_per_kg)) - CELSIUS


def _seawater_ice_fraction(row) -> float:
    cg = _cg()
    return cg.ice_fraction(cg.Solution.seawater(STANDARD_SEAWATER_SA), row.temperature_C + CELSIUS)


def _seawater_heat(part: str) -> Callable:
    def f(row) -> float:
        cg = _cg()
        SA = STANDARD_SEAWATER_SA
        comp = {"water": 1.0 - SA / 1000.0, "ash": SA / 1000.0}
        q = cg.heat_load(comp, cg.Solution.seawater(SA), row.from_temperature_C + CELSIUS,
                         row.to_temperature_C + CELSIUS)
        return q[part]

    return f


def _food_composition(row) -> dict[str, float]:
    fibre = row.fibre_percent / 100.0
    return {"water": row.water_percent / 100.0, "protein": row.protein_percent / 100.0,
            "fat": row.fat_percent / 100.0, "fibre": fibre,
            "carbohydrate": row.carbohydrate_total_percent / 100.0 - fibre,
            "ash": row.ash_percent / 100.0}


def _food_cp_above(row) -> float:
    # At 0 C a food whose table freezing point is below 0 C holds no ice, so the apparent
    # specific heat is the Choi & Okos sum whatever the solutes; a glucose solution with the
    # dilute-limit depression of the table's freezing point stands for the aqueous phase.
    cg = _cg()
    comp = _food_composition(row)
    m = -row.initial_freezing_point_C / cg._core.CRYOSCOPIC_CONSTANT
    s = cg.Solution.from_molalities({"glucose": m})
    return cg.apparent_specific_heat(comp, s, CELSIUS) / 1e3


def _food_cp_below_chen(row) -> float:
    cg = _cg()
    xw = row.water_percent / 100.0
    return cg.frozen_specific_heat_chen(xw, 1.0 - xw, row.initial_freezing_point_C + CELSIUS,
                                        CELSIUS - 40.0) / 1e3


@dataclass(frozen=True)
class Quantity:
    compute: Callable
    x: str            # column on the horizontal axis
    x_label: str
    group: str = ""   # column that splits the rows into curves ("" for one curve)
    curve: bool = True  # False: separate items (foods), the model drawn as markers


QUANTITIES: dict[str, Quantity] = {
    "depression_from_mass_percent": Quantity(_depression, "mass_percent", "mass %", "solute"),
    "freezing_point_C_from_mass_percent": Quantity(_freezing_point_c, "mass_percent", "mass %", "solute"),
    "nacl_osmotic_coefficient": Quantity(_osmotic("NaCl", "pitzer"), "molality_mol_per_kg", "molality, mol/kg"),
    "sucrose_osmotic_coefficient": Quantity(_osmotic("sucrose", "norrish"), "molality_mol_per_kg",
                                            "molality, mol/kg"),
    "seawater_freezing_point_C": Quantity(_seawater_freezing_point_c, "absolute_salinity_g_per_kg",
                                          "absolute salinity, g/kg"),
    "seawater_ice_fraction": Quantity(_seawater_ice_fraction, "temperature_C", "temperature, C"),
    "seawater_heat_total": Quantity(_seawater_heat("total"), "to_temperature_C", "cooled to, C",
                                    "from_temperature_C"),
    "seawater_heat_latent": Quantity(_seawater_heat("latent"), "to_temperature_C", "cooled to, C",
                                     "from_temperature_C"),
    "food_specific_heat_above_freezing": Quantity(_food_cp_above, "water_percent", "water, mass %",
                                                  curve=False),
    "food_specific_heat_below_freezing_chen": Quantity(_food_cp_below_chen, "water_percent", "water, mass %",
                                                       curve=False),
}


@dataclass
class CheckResult:
    id: str
    title: str
    file: str
    unit: str
    basis: str
    table: pd.DataFrame          # selected rows plus model, residual, tolerance, passed
    quantity: Quantity
    published: str
    checked: bool = True
    failures: list[str] = field(default_factory=list)

    @property
    def beyond(self) -> int:
        """Points computed outside a validated range (the model warned)."""
        return int(self.table["beyond_validated_range"].sum())


def load_config(reference_dir: pathlib.Path) -> dict:
    with open(reference_dir / "tolerances.toml", "rb") as fh:
        config = tomllib.load(fh)
    if config.get("format") != 1:
        raise SystemExit(f"tolerances.toml: format {config.get('format')!r}, expected 1")
    return config


def _select(df: pd.DataFrame, rows: str) -> pd.DataFrame:
    return df.query(rows, engine="python") if rows else df


def evaluate(entry: dict, reference_dir: pathlib.Path, checked: bool = True) -> CheckResult:
    """Model values, residuals and (for a check) tolerances of one table entry."""
    quantity = QUANTITIES[entry["quantity"]]
    df = pd.read_csv(reference_dir / entry["file"], keep_default_na=False)
    rows = _select(df, entry.get("rows", "")).copy()
    if rows.empty:
        raise SystemExit(f"{entry.get('id', entry['file'])}: the row query selects no row")
    published = entry["published"]
    rows[published] = pd.to_numeric(rows[published])
    beyond = []
    with warnings.catch_warnings(record=True) as caught:
        warnings.simplefilter("always")
        values = []
        for r in rows.itertuples(index=False):
            before = len(caught)
            values.append(quantity.compute(r))
            beyond.append(len(caught) > before)
    rows["model"] = values
    rows["beyond_validated_range"] = beyond
    rows["residual"] = rows["model"] - rows[published]
    result = CheckResult(id=entry.get("id", pathlib.Path(entry["file"]).stem),
                         title=entry.get("title", entry["file"]), file=entry["file"],
                         unit=entry.get("unit", ""), basis=entry.get("basis", entry.get("reason", "")),
                         table=rows, quantity=quantity, published=published, checked=checked)
    if checked:
        tol = np.broadcast_to(np.asarray(rows.eval(entry["tolerance"], engine="python"), dtype=float),
                              len(rows)).copy()
        plus = entry.get("tolerance_plus")
        if plus:
            looked_up = rows[plus["column"]].map(plus["values"])
            if looked_up.isna().any():
                raise SystemExit(f"{entry['id']}: tolerance_plus has no value for "
                                 f"{sorted(set(rows[plus['column']][looked_up.isna()]))}")
            tol += looked_up.to_numpy(dtype=float)
        rows["tolerance"] = tol
        rows["passed"] = rows["residual"].abs() <= rows["tolerance"]
        for r in rows[~rows["passed"]].itertuples(index=False):
            label = ", ".join(f"{c}={getattr(r, c)}" for c in (quantity.group, quantity.x) if c)
            result.failures.append(
                f"{result.id}: {entry['file']} row {label} [{r.source_key}]: model {r.model:.6g}, "
                f"published {getattr(r, published):.6g}, |residual| {abs(r.residual):.3g} > "
                f"tolerance {r.tolerance:.3g} {result.unit}")
    return result


def _source_line(keys) -> str:
    cg = _cg()
    out = []
    for key in sorted(set(keys)):
        c = cg.citation(key)
        out.append(f"{c.get('authors', '')} ({c.get('year', '')}), {c.get('title', key)}".strip())
    return "Source: " + "; ".join(out)


def plot(result: CheckResult, path: pathlib.Path) -> None:
    import matplotlib

    matplotlib.use("Agg")
    import matplotlib.pyplot as plt

    t, q = result.table, result.quantity
    fig, (top, bottom) = plt.subplots(2, 1, figsize=(7.0, 6.2), sharex=True,
                                      gridspec_kw={"height_ratios": [2, 1]})
    groups = t.groupby(q.group, sort=False) if q.group else [("", t)]
    for name, g in groups:
        g = g.sort_values(q.x)
        line, = top.plot(g[q.x], g["model"], "-" if q.curve else "x", lw=1.4,
                         label=f"colligate {name}".strip())
        top.plot(g[q.x], g[result.published], "o", ms=4, mfc="none", color=line.get_color(),
                 label=f"published {name}".strip())
        bottom.plot(g[q.x], g["residual"], "o", ms=4, color=line.get_color())
        if result.checked:
            bottom.fill_between(g[q.x], -g["tolerance"], g["tolerance"], color=line.get_color(),
                                alpha=0.15, lw=0)
    if result.checked:
        bad = t[~t["passed"]]
        bottom.plot(bad[q.x], bad["residual"], "x", color="black", ms=8, label="outside tolerance")
    bottom.axhline(0.0, color="grey", lw=0.8)
    top.set_ylabel(f"{result.published} [{result.unit}]" if result.unit else result.published)
    bottom.set_ylabel("model - published")
    bottom.set_xlabel(q.x_label)
    top.set_title(result.title, fontsize=10)
    top.legend(fontsize=7, ncol=2)
    band = "shaded band: tolerance" if result.checked else "not a check: no tolerance"
    if result.beyond:
        band += f"; {result.beyond} points beyond a validated range"
    caption = f"{_source_line(t['source_key'])}\n{band}. {result.basis}"
    fig.text(0.01, 0.01, caption, fontsize=6.5, wrap=True, va="bottom")
    fig.tight_layout(rect=(0, 0.12, 1, 1))
    fig.savefig(path, dpi=110)
    plt.close(fig)


def run(reference_dir: pathlib.Path, out: pathlib.Path | None) -> tuple[list[CheckResult], list[str]]:
    """Every check and shown table; returns the results and the problems found."""
    config = load_config(reference_dir)
    results, problems = [], []
    for entry in config.get("check", []):
        r = evaluate(entry, reference_dir)
        results.append(r)
        problems.extend(r.failures)
    for entry in config.get("shown", []):
        if "quantity" in entry:
            results.append(evaluate(entry, reference_dir, checked=False))
    covered = {e["file"] for e in config.get("check", []) + config.get("shown", [])}
    for path in sorted(reference_dir.glob("*.csv")):
        if path.name not in covered:
            problems.append(f"{path.name}: neither checked nor listed as shown in tolerances.toml")
    if out is not None:
        out.mkdir(parents=True, exist_ok=True)
        for r in results:
            plot(r, out / f"{r.id}.png")
        write_page(config, results, out / "gallery.md")
    return results, problems


def write_page(config: dict, results: list[CheckResult], path: pathlib.Path) -> None:
    lines = ["# Validation gallery", "",
             "Generated by `tools/validation_gallery.py` from the published tables in "
             "`tests/reference/` and the tolerances in `tests/reference/tolerances.toml`, the "
             "same file the tests read. The build fails when a point leaves its tolerance.", "",
             "Predictions are estimates: verify by measurement, and defer to local codes and "
             "licensed practice where a result decides food safety.", ""]
    for r in results:
        t = r.table
        status = (f"{int(t['passed'].sum())} of {len(t)} points within tolerance; worst "
                  f"|residual| {t['residual'].abs().max():.3g} {r.unit}" if r.checked
                  else f"{len(t)} points shown, not checked")
        if r.beyond:
            status += f" ({r.beyond} computed outside a validated range, with a warning)"
        lines += [f"## {r.title}", "", f"![{r.title}]({r.id}.png)", "",
                  f"`{r.file}`: {status}. {'Tolerance basis' if r.checked else 'Why not checked'}: {r.basis}", ""]
    listed = [e for e in config.get("shown", []) if "quantity" not in e]
    if listed:
        lines += ["## Tables not drawn", ""]
        lines += [f"- `{e['file']}`: {e['reason']}" for e in listed]
        lines.append("")
    path.write_text("\n".join(lines), encoding="utf-8")


def main(argv=None) -> int:
    p = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    p.add_argument("--out", type=pathlib.Path, default=ROOT / "build" / "gallery",
                   help="folder for the PNGs and gallery.md (default build/gallery)")
    p.add_argument("--no-plots", action="store_true", help="run the checks only")
    p.add_argument("--reference-dir", type=pathlib.Path, default=REFERENCE,
                   help="the reference tables and tolerances.toml (default tests/reference)")
    args = p.parse_args(argv)
    results, problems = run(args.reference_dir, None if args.no_plots else args.out)
    for r in results:
        t = r.table
        if r.checked:
            print(f"{r.id}: {int(t['passed'].sum())}/{len(t)} within tolerance, worst "
                  f"{t['residual'].abs().max():.3g} {r.unit}")
        else:
            print(f"{r.id}: {len(t)} points shown (not a check)")
    for line in problems:
        print("FAIL " + line, file=sys.stderr)
    return 1 if problems else 0


if __name__ == "__main__":
    sys.exit(main())
