"""Fit the solubility curves of sucrose, lactose and glucose to the rows of
tests/reference/sugar_solubility.csv marked used_in_fit = yes.

Provenance script for the constants in cpp/include/colligate/data/sugar_solubility.hpp.
Form (van't Hoff with a constant heat-capacity term), S in kg solute per kg water:

    ln S = a + b / T + c ln T            (c = 0 where a phase has two fit rows)

fitted by linear least squares in ln S. Prints the constants, and the deviation at every
row (fit and held out) as a percentage of the tabulated mass fraction.
Run: python3 tools/fit_sugar_solubility.py
"""
from __future__ import annotations

import csv
import pathlib

import numpy as np

ROOT = pathlib.Path(__file__).resolve().parents[1]
CSV = ROOT / "tests" / "reference" / "sugar_solubility.csv"


def main() -> None:
    rows = list(csv.DictReader(CSV.open()))
    keys = sorted({(r["solute"], r["solid_phase"]) for r in rows})
    for solute, phase in keys:
        sel = [r for r in rows if r["solute"] == solute and r["solid_phase"] == phase]
        fit = [r for r in sel if r["used_in_fit"] == "yes"]
        T = np.array([float(r["temperature_c"]) + 273.15 for r in fit])
        lnS = np.log([float(r["solubility_g_per_100g_water"]) / 100.0 for r in fit])
        cols = [np.ones_like(T), 1.0 / T] + ([np.log(T)] if len(fit) > 2 else [])
        A = np.column_stack(cols)
        coef, *_ = np.linalg.lstsq(A, lnS, rcond=None)
        a, b = coef[0], coef[1]
        c = coef[2] if len(coef) > 2 else 0.0
        print(f"{solute} [{phase}]: a = {a:.10g}, b = {b:.10g}, c = {c:.10g}")
        for r in sel:
            t = float(r["temperature_c"]) + 273.15
            s = np.exp(a + b / t + c * np.log(t))
            s_tab = float(r["solubility_g_per_100g_water"]) / 100.0
            w, w_tab = s / (1 + s), s_tab / (1 + s_tab)
            print(f"   {r['temperature_c']:>5} C  {r['used_in_fit']:>3}  w = {w:.4f}  table {w_tab:.4f}"
                  f"  dev {100 * (w - w_tab) / w_tab:+.2f} %")


if __name__ == "__main__":
    main()
