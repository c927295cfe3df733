#!/usr/bin/env python3
"""Brine-conservative ice fraction of standard seawater from TEOS-10 (the gsw package).

Writes tests/reference/seawater_teos10_ice_fraction.csv (source_key teos10_2010).

Method (salt stays in the brine, no salt precipitates, ice is pure H2O ice Ih):
  * seawater of Absolute Salinity SA = 35.16504 g/kg (Reference Composition,
    Millero et al. 2008), sea pressure p = 0 dbar, air-free (saturation_fraction = 0);
  * at temperature T the brine in equilibrium with ice has SA_b with
    gsw.t_freezing(SA_b, 0, 0) = T, found with gsw.SA_freezing_from_t(T, 0, 0);
  * per kg of seawater: ice mass = 1 - SA/SA_b, water mass = 1 - SA/1000 (kg);
  * ice_fraction_of_water = ice mass / water mass (ice per kg of the water that was in
    the original seawater).

Validity: GSW's freezing functions accept SA only up to 120 g/kg (gsw_sa_p_inrange in
GSW-C: SA > 120 g/kg is "out of the TEOS-10 range"; the saline Gibbs function at high
salinity is Feistel 2008, "... salinity up to 120 g/kg"). At p = 0, air-free, SA_b = 120
g/kg is reached at about -7.67 C, and gsw.SA_freezing_from_t returns NaN below that.
For such temperatures this script solves gsw.t_freezing(SA_b, 0, 0) = T by bisection on
SA_b > 120 g/kg -- an EXTRAPOLATION of the Gibbs function, flagged in the note column
with the prefix "beyond_teos10_range". Those rows are not check values.

Independently of TEOS-10's range, real seawater brine stops being salt-conservative when
mirabilite (Na2SO4.10H2O) starts to precipitate, near -6.4 C on the equilibrium path
(Butler et al. 2016: -6.38 C; FREZCHEM); see tests/reference/NOTES_seawater_path.md.

Usage:  python tools/teos10_brine_ice_fraction.py [--out PATH] [--check]
Needs:  gsw, numpy  (e.g. python3 -m venv /tmp/venv-sw && /tmp/venv-sw/bin/pip install gsw numpy)
"""
from __future__ import annotations

import argparse
import csv
import math
import sys
from pathlib import Path

import gsw
import numpy as np

SA_SEAWATER = 35.16504  # g/kg, Reference-Composition standard seawater (Millero et al. 2008)
P_SEA = 0.0  # dbar (sea pressure)
SATURATION_FRACTION = 0.0  # air-free
TEMPERATURES_C = (-2.0, -3.0, -4.0, -5.0, -6.0, -8.0, -10.0)
SA_MAX_TEOS10 = 120.0  # g/kg, upper limit of gsw_sa_p_inrange (GSW-C)
MIRABILITE_ONSET_C = -6.38  # Butler et al. (2016), equilibrium sea-ice brine
GYPSUM_ONSET_C = -6.2  # FREZCHEM v13.3 equilibrium path (Wolfenbarger et al. 2022 data)
IKAITE_ONSET_C = -4.9  # same run
SOURCE_KEY = "teos10_2010"

DEFAULT_OUT = Path(__file__).resolve().parents[1] / "tests" / "reference" / "seawater_teos10_ice_fraction.csv"


def t_freezing(sa: float) -> float:
    return float(gsw.t_freezing(sa, P_SEA, SATURATION_FRACTION))


def brine_sa(t: float) -> tuple[float, bool]:
    """SA_b (g/kg) of brine in equilibrium with ice at t (deg C); second value: within TEOS-10 range."""
    sa = float(gsw.SA_freezing_from_t(t, P_SEA, SATURATION_FRACTION))
    if math.isfinite(sa):
        return sa, sa <= SA_MAX_TEOS10
    # Beyond the GSW range check: bisection on the (unchecked) gsw.t_freezing.
    lo, hi = SA_MAX_TEOS10, 400.0
    if not (t_freezing(lo) > t > t_freezing(hi)):
        raise ValueError(f"t = {t} C: no brine salinity between {lo} and {hi} g/kg")
    for _ in range(200):
        mid = 0.5 * (lo + hi)
        if t_freezing(mid) > t:
            lo = mid
        else:
            hi = mid
    return 0.5 * (lo + hi), False


def ice_fraction_of_water(sa_b: float, sa: float = SA_SEAWATER) -> float:
    ice_per_kg_seawater = 1.0 - sa / sa_b
    water_per_kg_seawater = 1.0 - sa / 1000.0
    return ice_per_kg_seawater / water_per_kg_seawater


def rows() -> list[dict[str, str]]:
    out = []
    tf0 = t_freezing(SA_SEAWATER)
    for t in TEMPERATURES_C:
        sa_b, in_range = brine_sa(t)
        # The brine salinity must reproduce the temperature (round trip).
        assert abs(t_freezing(sa_b) - t) < 1e-8, (t, sa_b, t_freezing(sa_b))
        f = ice_fraction_of_water(sa_b)
        assert 0.0 < f < 1.0
        if in_range:
            note = (f"within_teos10_range; gsw.SA_freezing_from_t(T, p=0, saturation_fraction=0); "
                    f"seawater freezing point {tf0:.4f} C")
            dfdt = (ice_fraction_of_water(brine_sa(t - 0.005)[0])
                    - ice_fraction_of_water(brine_sa(t + 0.005)[0])) / 0.01
            if tf0 - t < 0.5:
                note += (f"; only {tf0 - t:.3f} K below the freezing point: a 0.01 K shift of the "
                         f"freezing point moves this value by about {0.01 * dfdt:.4f}")
            if t <= IKAITE_ONSET_C:
                note += ("; below the FREZCHEM equilibrium-path onset of trace ikaite CaCO3.6H2O "
                         "(-4.9 C; carbonate is not in colligate's system), negligible mass")
            if t <= MIRABILITE_ONSET_C + 0.5:
                note += (f"; {t - MIRABILITE_ONSET_C:.2f} K above mirabilite onset "
                         f"({MIRABILITE_ONSET_C} C, Butler et al. 2016) and "
                         f"{t - GYPSUM_ONSET_C:.1f} K above FREZCHEM trace gypsum (-6.2 C): "
                         f"brine still almost conservative")
        else:
            note = (f"beyond_teos10_range; SA_b > {SA_MAX_TEOS10:g} g/kg (gsw_sa_p_inrange), "
                    f"gsw.SA_freezing_from_t returns NaN; value = bisection root of gsw.t_freezing, "
                    f"an extrapolation - not a check value; also below mirabilite onset "
                    f"(-6.38 C) so real brine is not salt-conservative")
        out.append({
            "temperature_C": f"{t:g}",
            "brine_SA_g_per_kg": f"{sa_b:.4f}",
            "ice_fraction_of_water": f"{f:.5f}",
            "source_key": SOURCE_KEY,
            "used_in_fit": "no",
            "note": note,
        })
    return out


def main(argv: list[str] | None = None) -> int:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--out", type=Path, default=DEFAULT_OUT)
    ap.add_argument("--check", action="store_true",
                    help="compare with the existing file instead of writing it")
    args = ap.parse_args(argv)
    table = rows()
    fields = ["temperature_C", "brine_SA_g_per_kg", "ice_fraction_of_water", "source_key", "used_in_fit",
              "note"]
    if args.check:
        with open(args.out, newline="") as fh:
            old = list(csv.DictReader(fh))
        bad = [(a, b) for a, b in zip(old, table)
               if any(a[k] != b[k] for k in fields)] or (len(old) != len(table))
        if bad:
            print(f"{args.out}: differs from a fresh computation (gsw {gsw.__version__})", file=sys.stderr)
            return 1
        print(f"{args.out}: matches (gsw {gsw.__version__})")
        return 0
    with open(args.out, "w", newline="") as fh:
        w = csv.DictWriter(fh, fieldnames=fields, lineterminator="\n")
        w.writeheader()
        w.writerows(table)
    print(f"wrote {args.out} (gsw {gsw.__version__}, numpy {np.__version__})")
    for r in table:
        print(f"  T={r['temperature_C']:>4} C  SA_b={r['brine_SA_g_per_kg']:>9}  "
              f"ice/water={r['ice_fraction_of_water']}  {r['note'].split(';')[0]}")
    return 0


if __name__ == "__main__":
    raise SystemExit(main())
