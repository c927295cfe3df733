#!/usr/bin/env python3
"""Heat to cool and freeze standard seawater, from TEOS-10 (the gsw package).

Writes tests/reference/seawater_teos10_enthalpy.csv (source_key teos10_2010), read by the
C++ validation suite (tests/cpp/validation/) and checked afresh against gsw by
tests/python/test_published_magnitudes.py.

Method (sea ice in equilibrium with its brine; salt stays in the brine; ice is pure ice Ih):
  * seawater of Absolute Salinity SA = 35.16504 g/kg (Reference Composition, Millero et
    al. 2008), sea pressure p = 0 dbar, air-free (saturation_fraction = 0);
  * below the freezing point gsw.t_freezing(SA, 0, 0) the brine at T has SA_b =
    gsw.SA_freezing_from_t(T, 0, 0); per kg of seawater the ice mass is w = 1 - SA/SA_b;
  * bulk specific enthalpy h(T) = (1 - w) gsw.enthalpy_t_exact(SA_b, T, 0)
    + w gsw.enthalpy_ice(T, 0) (J/kg of seawater; above the freezing point
    gsw.enthalpy_t_exact(SA, T, 0)). TEOS-10's seawater and ice Gibbs functions share
    one reference state, so h differences include the heat of fusion;
  * heat removed from `from` to `to` = h(from) - h(to);
  * latent part = integral of L(T) dw, with L = gsw.latentheat_melting(SA_b(T), 0), the
    TEOS-10 heat of melting ice into brine at its freezing temperature (midpoint rule on
    4000 steps; converged to 1e-6 relative);
  * ice_fraction_of_water = w / (1 - SA/1000).

Range: SA_b stays below 120 g/kg (the TEOS-10 range of the gsw freezing functions) down
to -7.67 C; the rows stop at -6 C, above the mirabilite onset of the equilibrium brine
path (-6.38 C, Butler et al. 2016), so the brine is salt-conservative.

It also writes tests/reference/seawater_teos10_freezing_points.csv: gsw.t_freezing(SA, 0, 0)
(air-free, p = 0) for SA = 5-40 g/kg.

Usage:  python tools/teos10_seawater_enthalpy.py [--out PATH] [--check]
"""
from __future__ import annotations

import argparse
import csv
import sys
from pathlib import Path

import gsw
import numpy as np

SA_SEAWATER = 35.16504  # g/kg
P_SEA = 0.0  # dbar
SATURATION_FRACTION = 0.0  # air-free
SOURCE_KEY = "teos10_2010"
STEPS = 4000
# (from C, to C): from above the freezing point (sensible + latent) and from just below it.
CASES = [(5.0, -2.0), (5.0, -3.0), (5.0, -4.0), (5.0, -5.0), (5.0, -6.0), (-2.0, -6.0), (-3.0, -5.0)]
FIELDS = ["from_temperature_C", "to_temperature_C", "heat_removed_J_per_kg", "latent_J_per_kg",
          "ice_fraction_of_water_to", "source_key", "used_in_fit", "note"]
DEFAULT_OUT = Path(__file__).resolve().parents[1] / "tests" / "reference" / "seawater_teos10_enthalpy.csv"
FREEZING_OUT = DEFAULT_OUT.with_name("seawater_teos10_freezing_points.csv")
FREEZING_SA = (5.0, 10.0, 20.0, 30.0, 35.16504, 40.0)
FREEZING_FIELDS = ["absolute_salinity_g_per_kg", "freezing_point_C", "source_key", "used_in_fit", "note"]


def freezing_rows() -> list[dict[str, str]]:
    return [{"absolute_salinity_g_per_kg": repr(sa),
             "freezing_point_C": f"{float(gsw.t_freezing(sa, P_SEA, SATURATION_FRACTION)):.6f}",
             "source_key": SOURCE_KEY, "used_in_fit": "no",
             "note": f"gsw.t_freezing(SA, p=0, saturation_fraction=0), gsw {gsw.__version__}"}
            for sa in FREEZING_SA]

T_FREEZE = float(gsw.t_freezing(SA_SEAWATER, P_SEA, SATURATION_FRACTION))


def brine_sa(t: float) -> float:
    return float(gsw.SA_freezing_from_t(t, P_SEA, SATURATION_FRACTION))


def ice_per_kg(t: float) -> float:
    return 1.0 - SA_SEAWATER / brine_sa(t) if t < T_FREEZE else 0.0


def bulk_enthalpy(t: float) -> float:
    if t >= T_FREEZE:
        return float(gsw.enthalpy_t_exact(SA_SEAWATER, t, P_SEA))
    sb, w = brine_sa(t), ice_per_kg(t)
    return (1.0 - w) * float(gsw.enthalpy_t_exact(sb, t, P_SEA)) + w * float(gsw.enthalpy_ice(t, P_SEA))


def latent(t_from: float, t_to: float) -> float:
    ts = np.linspace(min(t_from, T_FREEZE), t_to, STEPS + 1)
    total = 0.0
    for a, b in zip(ts[:-1], ts[1:]):
        mid = 0.5 * (a + b)
        total += (ice_per_kg(b) - ice_per_kg(a)) * float(gsw.latentheat_melting(brine_sa(mid), P_SEA))
    return total


def rows() -> list[dict[str, str]]:
    out = []
    for t1, t2 in CASES:
        assert brine_sa(t2) < 120.0
        out.append({
            "from_temperature_C": f"{t1:g}",
            "to_temperature_C": f"{t2:g}",
            "heat_removed_J_per_kg": f"{bulk_enthalpy(t1) - bulk_enthalpy(t2):.1f}",
            "latent_J_per_kg": f"{latent(t1, t2):.1f}",
            "ice_fraction_of_water_to": f"{ice_per_kg(t2) / (1.0 - SA_SEAWATER / 1000.0):.5f}",
            "source_key": SOURCE_KEY,
            "used_in_fit": "no",
            "note": (f"SA {SA_SEAWATER} g/kg, p = 0, air-free; freezing point {T_FREEZE:.4f} C; "
                     f"brine SA at the lower temperature {brine_sa(t2):.2f} g/kg (TEOS-10 range "
                     f"<= 120); gsw {gsw.__version__}"),
        })
    return out


def main(argv: list[str] | None = None) -> int:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--out", type=Path, default=DEFAULT_OUT)
    ap.add_argument("--check", action="store_true", help="compare with the file instead of writing it")
    args = ap.parse_args(argv)
    table = rows()
    freezing = freezing_rows()
    if args.check:
        with open(FREEZING_OUT, newline="") as fh:
            old_f = list(csv.DictReader(fh))
        if [(r["absolute_salinity_g_per_kg"], r["freezing_point_C"]) for r in old_f] != \
                [(r["absolute_salinity_g_per_kg"], r["freezing_point_C"]) for r in freezing]:
            print(f"{FREEZING_OUT}: DIFFERS from gsw {gsw.__version__}")
            return 1
        with open(args.out, newline="") as fh:
            old = list(csv.DictReader(fh))
        keys = FIELDS[:5]
        same = len(old) == len(table) and all(
            abs(float(a[k]) - float(b[k])) <= 1e-6 * max(1.0, abs(float(b[k]))) for a, b in zip(old, table) for k in keys)
        print(f"{args.out}: {'matches' if same else 'DIFFERS from'} gsw {gsw.__version__}")
        return 0 if same else 1
    with open(args.out, "w", newline="") as fh:
        w = csv.DictWriter(fh, fieldnames=FIELDS, lineterminator="\n")
        w.writeheader()
        w.writerows(table)
    with open(FREEZING_OUT, "w", newline="") as fh:
        w = csv.DictWriter(fh, fieldnames=FREEZING_FIELDS, lineterminator="\n")
        w.writeheader()
        w.writerows(freezing)
    print(f"wrote {args.out} and {FREEZING_OUT.name} (gsw {gsw.__version__})")
    for r in table:
        print("  " + "  ".join(f"{k}={r[k]}" for k in FIELDS[:5]))
    return 0


if __name__ == "__main__":
    raise SystemExit(main())
