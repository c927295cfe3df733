"""Fit the cubic Norrish constant K3 (and K where no published value exists) of the
built-in non-electrolytes to the CRC Handbook freezing-point depressions.

Provenance script for the constants marked `colligate_fit_crc` in
cpp/include/colligate/data/detail/builtin_solutes.inc. It re-implements the equations
of ice.hpp and norrish.hpp in NumPy, fits by scipy.optimize.least_squares, and prints
the constants and the worst deviation per solute. Run: python3 tools/fit_crc_norrish.py
"""
from __future__ import annotations

import csv
import pathlib

import numpy as np
from scipy.optimize import brentq, least_squares

R = 8.314462618
MW = 0.018015268
T0 = 273.15
H0 = 6007.0
C = [76.02 - 37.77, -0.1571134, -0.01728863, -0.00096686]

MOLAR_MASS = {"sucrose": 0.3422965, "glucose": 0.1801559, "fructose": 0.1801559,
              "lactose": 0.3422965, "maltose": 0.3422965, "glycerol": 0.0920938,
              "ethanol": 0.0460684, "citric_acid": 0.1921235, "lactic_acid": 0.0900779,
              "mannitol": 0.1821718}


def ln_aw_ice(T: float) -> float:
    t = np.linspace(T0, T, 201)
    d = t - T0
    dH = H0 + C[0] * d + C[1] * d**2 / 2 + C[2] * d**3 / 3 + C[3] * d**4 / 4
    return float(np.trapezoid(dH / (R * t**2), t))


def freezing_depression(molality: float, k: float, k3: float) -> float:
    nw = 1.0 / MW
    x = molality / (nw + molality)
    ln_aw = np.log(nw / (nw + molality)) - k * x**2 - k3 * x**3
    return T0 - brentq(lambda T: ln_aw - ln_aw_ice(T), 200.0, T0 - 1e-9)


def rows(solute: str, max_percent: float):
    path = pathlib.Path(__file__).resolve().parents[1] / "tests/reference/crc_freezing_points.csv"
    with open(path, newline="") as fh:
        for r in csv.DictReader(fh):
            if r["solute"] == solute and float(r["mass_percent"]) <= max_percent and "below neighbours" not in r["note"]:
                w = float(r["mass_percent"]) / 100
                yield w / (1 - w) / MOLAR_MASS[solute], float(r["depression_K"])


# solute: (published K or None, max mass percent fitted, number of higher-order terms)
# K is fitted only where no published value reproduces the freezing data; the
# higher-order terms only where one constant cannot (ethanol, glycerol to 40 wt%).
PLAN = {
    "sucrose": (6.47, 42, 0), "glucose": (2.25, 30, 0), "fructose": (2.25, 28, 0),
    "maltose": (None, 44, 0), "lactose": (None, 100, 0), "glycerol": (None, 40, 1),
    "ethanol": (None, 40, 2), "citric_acid": (None, 100, 0), "lactic_acid": (None, 100, 0),
    "mannitol": (0.906, 100, 0),
}


def depression(m: float, constants) -> float:
    nw = 1.0 / MW
    x = m / (nw + m)
    ln_aw = np.log(nw / (nw + m)) - sum(k * x ** (j + 2) for j, k in enumerate(constants))
    return T0 - brentq(lambda T: ln_aw - ln_aw_ice(T), 200.0, T0 - 1e-9)


def fit_propylene_glycol() -> None:
    """K and K3 of propylene glycol from the Melinder (2010) freezing curve in CoolProp."""
    from CoolProp.CoolProp import PropsSI

    w = np.arange(0.05, 0.401, 0.025)
    dT = np.array([T0 - PropsSI("T_freeze", "T", 300, "P", 101325, f"INCOMP::MPG[{x:g}]") for x in w])
    m = w / (1 - w) / 0.0760944
    fit = least_squares(lambda p: np.array([depression(mi, list(p)) for mi in m]) - dT, np.zeros(2))
    print(f"propylene_glycol constants={['%.6g' % c for c in fit.x]} max|dev|={np.max(np.abs(fit.fun)):.3f} K")


if __name__ == "__main__":
    import sys

    if "--propylene-glycol" in sys.argv:
        fit_propylene_glycol()
        raise SystemExit
    for solute, (k_pub, wmax, n_high) in PLAN.items():
        data = list(rows(solute, wmax))
        m = np.array([d[0] for d in data])
        dT = np.array([d[1] for d in data])
        fixed = [] if k_pub is None else [k_pub]

        def resid(p):
            return np.array([depression(mi, fixed + list(p)) for mi in m]) - dT

        n = (k_pub is None) + n_high
        p = least_squares(resid, np.zeros(n)).x if n else np.array([])
        consts = fixed + list(p)
        r = resid(p)
        wtop = max(float(w) for w, _ in [(100 * mi * MOLAR_MASS[solute] / (1 + mi * MOLAR_MASS[solute]), 0) for mi in m])
        print(f"{solute:12s} constants={['%.6g' % c for c in consts]} rows={len(m):2d} "
              f"to {wtop:.0f} wt%  max|dev|={np.max(np.abs(r)):.3f} K")
