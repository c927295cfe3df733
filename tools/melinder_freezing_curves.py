#!/usr/bin/env python3
"""Freezing curves of Melinder (2010) as represented in CoolProp's incompressible fluids.

Writes tests/reference/melinder_freezing_curves.csv (source_key melinder_2010), read by the
C++ validation suite and checked afresh against CoolProp by
tests/python/test_published_magnitudes.py.

Melinder, Properties of Secondary Working Fluids for Indirect Systems (IIR, 2010), evaluated
the published freezing data of aqueous secondary coolants; CoolProp (INCOMP::MGL glycerol,
MEA ethanol, MPG propylene glycol, MNA NaCl, MCA CaCl2, MKA potassium acetate, MKC potassium carbonate) carries
polynomial fits of those curves, T_freeze(w). The `used_in_fit` column says which rows colligate fitted constants to:
  * propylene glycol: K and K3 fitted at 5, 7.5, ..., 40 wt% (tools/fit_crc_norrish.py
    --propylene-glycol); the rows between (6.25, 8.75, ...) lie on the same fitted curve, so
    they are held out from the fit but NOT independent of it;
  * NaCl 1-23 wt% and CaCl2 1-30 wt%: the curvature of spencer_1990_icefit was fitted at
    1 wt% steps (tools/fit_brine_ice_line.py);
  * glycerol and ethanol: not used in any fit (those constants come from the CRC rows), so
    these rows are an independent check;
  * potassium acetate 5-25 wt% (0.54-3.4 mol/kg, to -16 C): beta0 and beta1 of its ice-line
    single-salt Pitzer row were fitted to the 5, 7, ..., 25 wt% rows
    (tools/fit_single_salt_ice_line.py); the rows between lie on the same fitted curve, held
    out but not independent of it. Rows below 5 wt% are not taken: the polynomial gives
    -0.027 C at zero concentration (its fit was made for coolant strengths, 10-45 wt%).
  * potassium carbonate 1-10 wt%: not used in any fit (its Norrish record and single-salt
    Pitzer row were fitted to the CRC rows to 10 wt%), so an independent check within the
    range of those fits.

Usage:  python tools/melinder_freezing_curves.py [--out PATH] [--check]
"""
from __future__ import annotations

import argparse
import csv
from pathlib import Path

import CoolProp
import CoolProp.CoolProp as CP
import numpy as np

DEFAULT_OUT = Path(__file__).resolve().parents[1] / "tests" / "reference" / "melinder_freezing_curves.csv"
FIELDS = ["solute", "mass_percent", "freezing_point_C", "source_key", "used_in_fit", "note"]


def grid():
    """(solute id, CoolProp fluid, mass percent, used_in_fit)."""
    out = []
    for p in range(5, 45, 5):
        out.append(("glycerol", "MGL", float(p), "no"))
    for p in range(5, 65, 5):
        out.append(("ethanol", "MEA", float(p), "no"))
    for p in np.arange(5.0, 40.001, 1.25):
        on_grid = abs((p - 5.0) / 2.5 - round((p - 5.0) / 2.5)) < 1e-9
        out.append(("propylene_glycol", "MPG", float(p), "yes" if on_grid else "no"))
    for p in range(1, 24):
        out.append(("sodium_chloride", "MNA", float(p), "yes"))
    for p in range(1, 31):
        out.append(("calcium_chloride", "MCA", float(p), "yes"))
    for p in range(5, 26):
        out.append(("potassium_acetate", "MKA", float(p), "yes" if p % 2 == 1 else "no"))
    for p in range(1, 11):
        out.append(("potassium_carbonate", "MKC", float(p), "no"))
    return out


def rows():
    table = []
    for solute, fluid, p, used in grid():
        t = CP.PropsSI("T_freeze", "T", 300.0, "P", 101325.0, f"INCOMP::{fluid}[{p / 100.0:g}]") - 273.15
        note = f"CoolProp {CoolProp.__version__} INCOMP::{fluid}"
        if solute in ("propylene_glycol", "potassium_acetate") and used == "no":
            note += "; between the fit's grid points: held out, but on the same fitted curve (not independent)"
        table.append({"solute": solute, "mass_percent": f"{p:g}", "freezing_point_C": f"{t:.4f}",
                      "source_key": "melinder_2010", "used_in_fit": used, "note": note})
    return table


def main(argv=None) -> int:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--out", type=Path, default=DEFAULT_OUT)
    ap.add_argument("--check", action="store_true", help="compare with the file instead of writing it")
    args = ap.parse_args(argv)
    table = rows()
    if args.check:
        with open(args.out, newline="") as fh:
            old = list(csv.DictReader(fh))
        same = len(old) == len(table) and all(
            a["solute"] == b["solute"] and a["mass_percent"] == b["mass_percent"]
            and abs(float(a["freezing_point_C"]) - float(b["freezing_point_C"])) <= 1e-4
            and a["used_in_fit"] == b["used_in_fit"] for a, b in zip(old, table))
        print(f"{args.out}: {'matches' if same else 'DIFFERS from'} CoolProp {CoolProp.__version__}")
        return 0 if same else 1
    with open(args.out, "w", newline="") as fh:
        w = csv.DictWriter(fh, fieldnames=FIELDS, lineterminator="\n")
        w.writeheader()
        w.writerows(table)
    print(f"wrote {args.out}: {len(table)} rows (CoolProp {CoolProp.__version__})")
    return 0


if __name__ == "__main__":
    raise SystemExit(main())
