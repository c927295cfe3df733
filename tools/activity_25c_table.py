"""Print the 25 C mean-activity-coefficient table of docs/electrolytes.md and the README.

For each salt of tests/reference/crc_mean_activity_coefficients_25c.csv (the CRC Handbook
table, read in a public copy; see its note column) it evaluates colligate's Pitzer model
with the default parameter set and with the 25 C set `harvie_1984`, and prints one
Markdown table per salt: molality, the CRC value, each set's value and its deviation in
per cent. Rows above a set's highest molality are marked "(beyond range)".

Run: python3 tools/activity_25c_table.py
"""
from __future__ import annotations

import warnings
from pathlib import Path

import pandas as pd

import colligate as cg

CSV = Path(__file__).resolve().parents[1] / "tests" / "reference" / "crc_mean_activity_coefficients_25c.csv"
SETS = ("spencer_1990_icefit", "harvie_1984")


def main() -> None:
    table = pd.read_csv(CSV)
    for salt, rows in table.groupby("salt", sort=False):
        print(f"\n{salt}\n")
        print("| m (mol/kg) | CRC | " + " | ".join(f"`{s}` (dev.)" for s in SETS) + " |")
        print("|---|---|" + "---|" * len(SETS))
        for _, r in rows.iterrows():
            m = float(r.molality_mol_per_kg)
            cells = []
            for s in SETS:
                with warnings.catch_warnings(record=True) as caught:
                    warnings.simplefilter("always")
                    g = cg.mean_activity_coefficient(cg.Solution.from_molalities({salt: m}), salt, 298.15,
                                                     parameter_set=s)
                flag = " (beyond range)" if any("molality" in str(w.message) for w in caught) else ""
                cells.append(f"{g:.4g} ({100 * (g / r.mean_activity_coefficient - 1):+.1f} %){flag}")
            print(f"| {m:g} | {r.mean_activity_coefficient:g} | " + " | ".join(cells) + " |")


if __name__ == "__main__":
    main()
