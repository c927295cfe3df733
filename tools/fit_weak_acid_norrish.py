"""Fit the Norrish constant of the undissociated weak acids to the CRC Handbook freezing points.

Provenance script for `norrish_k_undissociated` in cpp/include/colligate/data/weak_acids.hpp
(source `colligate_fit_crc`). The freezing point is computed by colligate itself
(`colligate._core.weak_acid_freezing_point`: the acid split into its forms from its pKa,
equilibria/weak_acid_dissociation.hpp), so the fit uses the same equations as the library.
For each acid, K minimises the sum of squared deviations over the rows of
tests/reference/crc_freezing_points.csv marked used_in_fit = yes; the script prints K, the
worst deviation of those rows (the basis of the held-out check's tolerance) and of the
held-out rows. Run after building the package: python3 tools/fit_weak_acid_norrish.py
"""
from __future__ import annotations

import csv
import math
import pathlib

from scipy.optimize import minimize_scalar

from colligate import _core, solutes

ROOT = pathlib.Path(__file__).resolve().parents[1]
ACIDS = ("acetic_acid", "lactic_acid", "citric_acid")


def rows(acid: str, used_in_fit: str) -> list[tuple[float, float]]:
    with open(ROOT / "tests" / "reference" / "crc_freezing_points.csv", newline="") as fh:
        return [(float(r["mass_percent"]) / 100.0, float(r["depression_K"]))
                for r in csv.DictReader(fh)
                if r["solute"] == acid and r["used_in_fit"] == used_in_fit]


def deviations(acid: str, k: float, data, molar_mass: float) -> list[float]:
    out = []
    for w, depression in data:
        m = w / (molar_mass * (1.0 - w))
        t = _core.weak_acid_freezing_point(acid, m, k)["temperature_K"]
        out.append(273.15 - t - depression if math.isfinite(t) else math.inf)
    return out


def main() -> None:
    table = solutes()
    for acid in ACIDS:
        molar_mass = float(table.loc[acid, "molar_mass_kg_per_mol"])
        fit_rows, held_out = rows(acid, "yes"), rows(acid, "no")
        result = minimize_scalar(
            lambda k: sum(d * d for d in deviations(acid, k, fit_rows, molar_mass)),
            bounds=(-10.0, 10.0), method="bounded", options={"xatol": 1e-7})
        k = float(result.x)
        worst_fit = max(abs(d) for d in deviations(acid, k, fit_rows, molar_mass))
        worst_held = max(abs(d) for d in deviations(acid, k, held_out, molar_mass))
        print(f"{acid}: K = {k:.6g}; {len(fit_rows)} fit rows, worst {worst_fit:.4f} K; "
              f"{len(held_out)} held-out rows, worst {worst_held:.4f} K")


if __name__ == "__main__":
    main()
