"""Fit the cubic Norrish constant K3 (and K where no published value exists) of the
built-in non-electrolytes to the CRC Handbook freezing-point depressions.

Provenance script for the constants marked `colligate_fit_crc` in
cpp/include/colligate/data/detail/builtin_solutes.inc. It re-implements the equations
of ice.hpp and norrish.hpp in NumPy, fits by scipy.optimize.least_squares, and prints
the constants and the worst deviation per solute. Run: python3 tools/fit_crc_norrish.py

Ethanol (fit_ethanol below) is fitted differently: over the whole CRC table, 0.5-68 wt%,
in the effective volume fraction z = x / (x + r (1 - x)) of norrish.hpp, by a minimax
(Chebyshev) fit on every other row with a monotonicity constraint, validated on the rows
left out. Run `python3 tools/fit_crc_norrish.py --ethanol` for that fit alone; name
solutes (`python3 tools/fit_crc_norrish.py sodium_acetate phosphoric_acid`) to fit those alone.
"""
from __future__ import annotations

import csv
import dataclasses
import pathlib

import numpy as np
import sys

from scipy.optimize import brentq, least_squares, linprog, minimize_scalar

R = 8.314462618
MW = 0.018015268
T0 = 273.15
H0 = 6007.0
C = [76.02 - 37.77, -0.1571134, -0.01728863, -0.00096686]

MOLAR_MASS = {"sucrose": 0.3422965, "glucose": 0.1801559, "fructose": 0.1801559,
              "lactose": 0.3422965, "maltose": 0.3422965, "glycerol": 0.0920938,
              "ethanol": 0.0460684, "citric_acid": 0.1921235, "lactic_acid": 0.0900779,
              "mannitol": 0.1821718, "acetic_acid": 0.060052,
              # food salts and phosphoric acid (IUPAC 2013 standard atomic weights;
              # trisodium citrate anhydrous: the CRC molality column matches mass % of Na3C6H5O7,
              # not of the dihydrate its entry names)
              "sodium_acetate": 0.0820338, "trisodium_citrate": 0.2580683,
              "monosodium_phosphate": 0.1199755, "monopotassium_phosphate": 0.1360841,
              "dipotassium_phosphate": 0.1741744, "sodium_bicarbonate": 0.0840058,
              "potassium_bicarbonate": 0.1001143, "sodium_carbonate": 0.1059875,
              "phosphoric_acid": 0.0979938, "potassium_acetate": 0.0981423,
              "potassium_carbonate": 0.1382046}

# Dissolved particles per formula unit (complete dissociation of the salts, common
# practice); 1 for everything not listed. The salts below have no Pitzer parameters for
# their anions in the built-in sets, so they are effective Norrish solutes: nu ideal
# particles plus fitted constants (norrish.hpp counts x_w = n_w / (n_w + sum nu_i n_i)).
PARTICLES = {"sodium_acetate": 2, "trisodium_citrate": 4, "monosodium_phosphate": 2,
             "monopotassium_phosphate": 2, "dipotassium_phosphate": 3,
             "sodium_bicarbonate": 2, "potassium_bicarbonate": 2, "sodium_carbonate": 3,
             "potassium_acetate": 2, "potassium_carbonate": 3}

# Solutes the CRC table lacks, fitted to Melinder's (2010) curve as CoolProp carries it
# (tests/reference/melinder_freezing_curves.csv, written by tools/melinder_freezing_curves.py;
# the same used_in_fit split: 5, 7, ..., 25 wt% fitted, the rows between held out).
MELINDER = {"potassium_acetate"}


def enthalpy_of_fusion(T):
    d = T - T0
    return H0 + C[0] * d + C[1] * d**2 / 2 + C[2] * d**3 / 3 + C[3] * d**4 / 4


def ln_aw_ice(T: float) -> float:
    t = np.linspace(T0, T, 201)
    return float(np.trapezoid(enthalpy_of_fusion(t) / (R * t**2), t))


def freezing_depression(molality: float, k: float, k3: float) -> float:
    nw = 1.0 / MW
    x = molality / (nw + molality)
    ln_aw = np.log(nw / (nw + molality)) - k * x**2 - k3 * x**3
    return T0 - brentq(lambda T: ln_aw - ln_aw_ice(T), 200.0, T0 - 1e-9)


def rows(solute: str, max_percent: float, used_in_fit: str = "yes"):
    """(molality, depression K) of the CRC rows of a solute up to max_percent whose
    `used_in_fit` column is used_in_fit ("yes": the fit rows, "no": the held-out rows).
    The split lives in tests/reference/crc_freezing_points.csv: every other row from the
    first (rows flagged "below neighbours" excluded) is fitted, the others are held out.
    Solutes of MELINDER come from the Melinder file instead."""
    if solute in MELINDER:
        yield from melinder_rows(solute, max_percent, used_in_fit)
        return
    path = pathlib.Path(__file__).resolve().parents[1] / "tests/reference/crc_freezing_points.csv"
    with open(path, newline="") as fh:
        for r in csv.DictReader(fh):
            if (r["solute"] == solute and float(r["mass_percent"]) <= max_percent
                    and "below neighbours" not in r["note"] and r["used_in_fit"] == used_in_fit):
                w = float(r["mass_percent"]) / 100
                yield w / (1 - w) / MOLAR_MASS[solute], float(r["depression_K"])


def melinder_rows(solute: str, max_percent: float, used_in_fit: str):
    """(molality, depression K) of a solute's rows of the Melinder file, as rows() does."""
    path = pathlib.Path(__file__).resolve().parents[1] / "tests/reference/melinder_freezing_curves.csv"
    with open(path, newline="") as fh:
        for r in csv.DictReader(fh):
            if (r["solute"] == solute and float(r["mass_percent"]) <= max_percent
                    and r["used_in_fit"] == used_in_fit):
                assert r["source_key"] == "melinder_2010"
                w = float(r["mass_percent"]) / 100
                yield w / (1 - w) / MOLAR_MASS[solute], -float(r["freezing_point_C"])


# solute: (published K or None, max mass percent fitted, number of higher-order terms)
# K is fitted only where no published value reproduces the freezing data; the
# higher-order terms only where one constant cannot (glycerol to 40 wt%). Ethanol has its
# own fit (fit_ethanol). Lactose takes sucrose's published K (the dairy texts count it as
# sucrose; its CRC rows end at 8 wt%, too dilute to fix a constant for mixes).
# For a published K (sucrose, glucose, fructose, mannitol, lactose) nothing is fitted and
# every CRC row of the solute is marked used_in_fit = no.
PLAN = {
    "sucrose": (6.47, 42, 0), "glucose": (2.25, 30, 0), "fructose": (2.25, 28, 0),
    "maltose": (None, 44, 0), "lactose": (6.47, 100, 0), "glycerol": (None, 40, 1),
    "ethanol": None, "citric_acid": (None, 100, 0), "lactic_acid": (None, 100, 0),
    "mannitol": (0.906, 100, 0), "acetic_acid": (None, 100, 0),
    # food salts (K plus higher terms; the range is where the held-out rows stay within the
    # fit rows' worst deviation plus 0.02 K) and phosphoric acid
    "sodium_acetate": (None, 8, 1), "trisodium_citrate": (None, 100, 1),
    "monosodium_phosphate": (None, 10, 1), "monopotassium_phosphate": (None, 100, 1),
    "dipotassium_phosphate": (None, 100, 1), "sodium_bicarbonate": (None, 100, 1),
    "potassium_bicarbonate": (None, 100, 1), "sodium_carbonate": (None, 100, 1),
    "phosphoric_acid": (None, 20, 0),
    # Melinder's curve, 5-25 wt% (rows below 5 wt% are not in the file: her polynomial gives
    # -0.027 C at zero)
    "potassium_acetate": (None, 25, 1),
    # to 10 wt%: beyond it (2 wt% steps) the held-out rows leave the fit rows' worst + 0.02 K
    "potassium_carbonate": (None, 10, 1),
}


def depression(m: float, constants, r: float = 1.0, nu: int = 1) -> float:
    """Freezing-point depression (K) of a binary solution of molality m: norrish.hpp with
    the constants [K, K3, K4] in the mole fraction x (r = 1) or in z = x / (x + r (1 - x)),
    nu particles per formula unit (x = m / (n_w + nu m), x_w = n_w / (n_w + nu m))."""
    nw = 1.0 / MW
    x = m / (nw + nu * m)
    z = x if r == 1.0 else x / (x + r * (1.0 - x))
    ln_aw = np.log(nw / (nw + nu * m)) - sum(k * z ** (j + 2) for j, k in enumerate(constants))
    return T0 - brentq(lambda T: ln_aw - ln_aw_ice(T), 200.0, T0 - 1e-9)


def fit_propylene_glycol() -> None:
    """K and K3 of propylene glycol from the Melinder (2010) freezing curve in CoolProp."""
    from CoolProp.CoolProp import PropsSI

    w = np.arange(0.05, 0.401, 0.025)
    dT = np.array([T0 - PropsSI("T_freeze", "T", 300, "P", 101325, f"INCOMP::MPG[{x:g}]") for x in w])
    m = w / (1 - w) / 0.0760944
    fit = least_squares(lambda p: np.array([depression(mi, list(p)) for mi in m]) - dT, np.zeros(2))
    print(f"propylene_glycol constants={['%.6g' % c for c in fit.x]} max|dev|={np.max(np.abs(fit.fun)):.3f} K")


# --- ethanol -----------------------------------------------------------------------------
# One set of K, K3, K4 in the mole fraction cannot follow ethanol-water beyond about 40 wt%:
# fitted to 0.5-68 wt% it misses rows by about 0.8 K (least squares 0.86 K, minimax 0.79 K),
# and the former 0.5-40 wt% fit (K, K3, K4 = -1.17308, 48.3113, -177.976) has its minimum
# of ln a_w at 42.6 wt% and rises beyond, so freeze-concentrated spirits found no ice
# equilibrium. In the effective volume fraction z = x / (x + r (1 - x)) (the variable of
# Wohl's expansion, Wohl 1946; r = q_water / q_ethanol; r = 1 gives back x) three constants
# and r follow the whole CRC table.
#   Rows: every other CRC row from the first is fitted (0.5, 2, 4, ..., 20, 24, 28, ...,
#   68 wt%); the others are held out (1, 3, ..., 19, 22, 26, ..., 66 wt%).
#   Fit: minimax (Chebyshev) on the freezing temperature, linearised per row (model minus
#   CRC temperature = (ln a_w,model - ln a_w,ice(T_CRC)) / (d ln a_w,ice / dT at T_CRC)),
#   a linear program in K, K3, K4 for fixed r; r by a bounded scalar search; constants
#   rounded to 6 digits, then every row recomputed exactly.
#   Constraint: q(z) >= 0.01 r on 4001 points of z in [0, 1] (monotonicity_polynomial:
#   d ln a_w / dx < 0 iff q > 0); the report then proves q > 0 on all of [0, 1].
# Minimax, not least squares: the CRC ethanol column carries a systematic wave of about
# +-0.3 K against Melinder's evaluated curve (30-34 wt% and 40-46 wt%), not random scatter,
# and the check of interest is the worst row.
ETHANOL_MAX_PERCENT = 68.0
ETHANOL_MONOTONIC_MARGIN = 0.01  # q(z) >= margin * r on the grid (q / r = 1 is ideal)


def ethanol_rows():
    """(mass percent, depression K) of the CRC ethanol rows, and the fit / held-out split."""
    data = []
    path = pathlib.Path(__file__).resolve().parents[1] / "tests/reference/crc_freezing_points.csv"
    with open(path, newline="") as fh:
        for r in csv.DictReader(fh):
            if r["solute"] == "ethanol" and "below neighbours" not in r["note"]:
                if float(r["mass_percent"]) <= ETHANOL_MAX_PERCENT:
                    data.append((float(r["mass_percent"]), float(r["depression_K"]),
                                 r["used_in_fit"] == "yes"))
    data.sort()
    percent = np.array([d[0] for d in data])
    dT = np.array([d[1] for d in data])
    fit = np.array([d[2] for d in data])
    # the CSV's split is every other row from the first
    assert np.array_equal(fit, np.arange(len(percent)) % 2 == 0), "used_in_fit column changed"
    return percent, dT, fit


def molality_of(percent, molar_mass):
    w = np.asarray(percent) / 100.0
    return w / (1.0 - w) / molar_mass


def volume_fraction(x, r):
    return x / (x + r * (1.0 - x))


def monotonicity_polynomial(consts, r):
    """q(z) = r + (1 - z)(1 - (1 - r) z)(2 K z + 3 K3 z^2 + 4 K4 z^3), lowest power first.

    d ln a_w / dx = -(1 - (1 - r) z) / (r (1 - z)) * q(z), so ln a_w falls strictly with
    the mole fraction x on [0, 1) exactly when q > 0 on [0, 1)."""
    from numpy.polynomial import polynomial as P

    dP = [0.0] + [(j + 2) * k for j, k in enumerate(consts)]  # P'(z) = 2 K z + 3 K3 z^2 + ...
    q = P.polymul(P.polymul([1.0, -1.0], [1.0, -(1.0 - r)]), dP)
    q[0] += r
    return q


def ethanol_linear_minimax(r, percent, dT, idx):
    """Minimax K, K3, K4 for fixed r on the rows idx (linearised deviations), monotone."""
    m = molality_of(percent[idx], MOLAR_MASS["ethanol"])
    x = m / (1.0 / MW + m)
    T = T0 - dT[idx]
    slope = enthalpy_of_fusion(T) / (R * T**2)
    ln_gamma = np.array([ln_aw_ice(t) for t in T]) - np.log1p(-x)
    z = volume_fraction(x, r)
    A = -np.column_stack([z**2, z**3, z**4]) / slope[:, None]
    b = ln_gamma / slope
    # monotone on a dense grid of z: -(1-z)(1-(1-r)z) P'(z) <= r (1 - margin)
    zg = np.linspace(0.0, 1.0, 4001)
    G = ((1 - zg) * (1 - (1 - r) * zg))[:, None] * np.column_stack([2 * zg, 3 * zg**2, 4 * zg**3])
    n = len(idx)
    A_ub = np.vstack([np.hstack([A, -np.ones((n, 1))]), np.hstack([-A, -np.ones((n, 1))]),
                      np.hstack([-G, np.zeros((len(zg), 1))])])
    b_ub = np.concatenate([b, -b, np.full(len(zg), r * (1 - ETHANOL_MONOTONIC_MARGIN))])
    res = linprog(np.r_[np.zeros(3), 1.0], A_ub=A_ub, b_ub=b_ub,
                  bounds=[(None, None)] * 3 + [(0, None)], method="highs")
    assert res.status == 0, res.message
    return res.x[:3], res.x[3]


def fit_ethanol():
    """K, K3, K4 and r of ethanol; returns (constants, r, percent, dT, fit mask, deviations)."""
    percent, dT, fit = ethanol_rows()
    idx = np.flatnonzero(fit)
    best = minimize_scalar(lambda r: ethanol_linear_minimax(r, percent, dT, idx)[1],
                           bounds=(0.1, 1.0), method="bounded", options={"xatol": 1e-7})
    r = float("%.6g" % best.x)
    consts = [float("%.6g" % c) for c in ethanol_linear_minimax(r, percent, dT, idx)[0]]
    m = molality_of(percent, MOLAR_MASS["ethanol"])
    dev = np.array([depression(mi, consts, r) for mi in m]) - dT  # model minus CRC, K
    return consts, r, percent, dT, fit, dev


def report_ethanol(consts, r, percent, dT, fit, dev) -> None:
    from numpy.polynomial import polynomial as P

    fmt = lambda ps: ", ".join("%g" % p for p in ps)  # noqa: E731
    print(f"\nethanol: ln a_w = ln x_w - K z^2 - K3 z^3 - K4 z^4, z = x / (x + r (1 - x))")
    print(f"  K = {consts[0]:.6g}, K3 = {consts[1]:.6g}, K4 = {consts[2]:.6g}, r = {r:.6g}")
    print(f"  fit rows ({fit.sum()}), wt%: {fmt(percent[fit])}")
    print(f"  held-out rows ({(~fit).sum()}), wt%: {fmt(percent[~fit])}")
    print(f"  max |model - CRC| depression: fit rows {np.max(np.abs(dev[fit])):.3f} K, "
          f"held-out rows {np.max(np.abs(dev[~fit])):.3f} K")
    print("  wt%   CRC K   model K   dev K   row")
    for p_, d_, e_, f_ in zip(percent, dT, dev, fit):
        print(f"  {p_:4g}  {d_:6.2f}  {d_ + e_:7.3f}  {e_:+6.3f}   {'fit' if f_ else 'held out'}")
    # Monotonicity, exactly: q has no root in [0, 1] and q(0) = r > 0.
    q = monotonicity_polynomial(consts, r)
    roots = [z.real for z in P.polyroots(q) if abs(z.imag) < 1e-12 and -1e-12 <= z.real <= 1 + 1e-12]
    zg = np.linspace(0.0, 1.0, 100001)
    qmin = P.polyval(zg, q).min()
    print(f"  monotonicity: q(z) = {' '.join('%+.6g z^%d' % (c, j) for j, c in enumerate(q))}")
    print(f"  real roots of q in [0, 1]: {roots if roots else 'none'}; min q on [0, 1] = "
          f"{qmin:.4f} (r = {r:g}), so d ln a_w / dx < 0 for every x in [0, 1)")
    x1 = 1.0 - 1e-9
    z1 = volume_fraction(x1, r)
    print(f"  ln gamma_w as x -> 1: {-sum(k * z1 ** (j + 2) for j, k in enumerate(consts)):.3f} "
          "(water infinitely dilute in ethanol)")
    try:
        from CoolProp.CoolProp import PropsSI
    except ImportError:
        print("  (CoolProp not installed: no comparison with Melinder 2010)")
        return
    w = np.arange(0.05, 0.601, 0.05)
    mel = np.array([T0 - PropsSI("T_freeze", "T", 300, "P", 101325, f"INCOMP::MEA[{v:g}]") for v in w])
    mod = np.array([depression(mi, consts, r) for mi in molality_of(100 * w, MOLAR_MASS["ethanol"])])
    print("  independent check, Melinder (2010) via CoolProp INCOMP::MEA, 5-60 wt%: max |model - "
          f"Melinder| = {np.max(np.abs(mod - mel)):.3f} K")
    print("  " + "  ".join(f"{100 * v:.0f}%:{d:+.2f}" for v, d in zip(w, mod - mel)))


@dataclasses.dataclass
class SoluteFit:
    """One solute's constants as fitted (or published), with the fit's covariance."""
    constants: list            # [K, K3, ...] as fitted (full precision)
    covariance: object         # s^2 (J^T J)^-1 of the fitted constants, None when none fitted
    degrees_of_freedom: int    # rows - fitted constants (0 when none fitted)
    rows: int                  # rows fitted (or checked, for a published K)
    top_percent: float         # highest mass % among them
    worst_fit: float           # K, worst |model - table| on those rows
    held_rows: int             # held-out rows
    worst_held: float          # K, worst on the held-out rows with the constants at 6 digits


def fit_solute(solute: str) -> SoluteFit:
    """The fit of PLAN[solute] (not ethanol): least squares on the rows marked used_in_fit."""
    k_pub, wmax, n_high = PLAN[solute]
    n_fit = (k_pub is None) + n_high  # constants fitted; 0: all rows are checks
    data = list(rows(solute, wmax, "yes" if n_fit else "no"))
    m = np.array([d[0] for d in data])
    dT = np.array([d[1] for d in data])
    fixed = [] if k_pub is None else [k_pub]
    nu = PARTICLES.get(solute, 1)

    def resid(p):
        return np.array([depression(mi, fixed + list(p), nu=nu) for mi in m]) - dT

    sol = least_squares(resid, np.zeros(n_fit)) if n_fit else None
    p = sol.x if n_fit else np.array([])
    consts = fixed + list(p)
    r = resid(p)
    cov, dof = None, 0
    if n_fit:
        # Standard uncertainties of the fitted constants (GUM C.3.4): covariance
        # s^2 (J^T J)^-1 with s^2 = sum r^2 / (n - k), n - k degrees of freedom; the
        # rows data/builtin_uncertainty.hpp carries.
        dof = len(m) - n_fit
        cov = np.linalg.inv(sol.jac.T @ sol.jac) * float(r @ r) / dof
    top = max(100 * mi * MOLAR_MASS[solute] / (1 + mi * MOLAR_MASS[solute]) for mi in m)
    held = list(rows(solute, wmax, "no")) if n_fit else []
    dev_held = [depression(mh, [float("%.6g" % c) for c in consts], nu=nu) - dh for mh, dh in held]
    return SoluteFit(consts, cov, dof, len(m), float(top), float(np.max(np.abs(r))), len(held),
                     float(np.max(np.abs(dev_held))) if held else 0.0)


if __name__ == "__main__":

    if "--propylene-glycol" in sys.argv:
        fit_propylene_glycol()
        raise SystemExit
    if "--ethanol" in sys.argv:
        report_ethanol(*fit_ethanol())
        raise SystemExit
    ethanol = None
    only = [a for a in sys.argv[1:] if a in PLAN]  # e.g. `... sodium_acetate`: those alone
    for solute, plan in PLAN.items():
        if only and solute not in only:
            continue
        if plan is None:
            ethanol = fit_ethanol()
            consts, r, percent, _, fit, dev = ethanol
            print(f"{solute:12s} constants={['%.6g' % c for c in consts]} r={r:.6g} rows={fit.sum():2d} "
                  f"(+{(~fit).sum()} held out) to {percent.max():.0f} wt%  max|dev|={np.max(np.abs(dev[fit])):.3f} K "
                  f"(held out {np.max(np.abs(dev[~fit])):.3f} K)")
            continue
        f = fit_solute(solute)
        if f.covariance is not None and "--covariance" in sys.argv:
            print(f"{solute:12s} covariance={[['%.6g' % c for c in row] for row in f.covariance]} "
                  f"dof={f.degrees_of_freedom}")
        print(f"{solute:12s} constants={['%.6g' % c for c in f.constants]} rows={f.rows:2d} "
              f"to {f.top_percent:.0f} wt%  max|dev|={f.worst_fit:.3f} K"
              + (f"  (+{f.held_rows} held out: max|dev|={f.worst_held:.3f} K)" if f.held_rows else ""))
    if ethanol is not None:
        report_ethanol(*ethanol)
