"""Fit the default Pitzer set `harvie_spencer_icefit`: right at 25 C and along the ice line.

Provenance script for `harvie_spencer_icefit_parameters()` in
cpp/include/colligate/data/pitzer_parameters.hpp (issue 12, step 1).

The earlier default `spencer_1990_icefit` keeps Spencer, Moller & Weare's (1990) 25 C
values, which miss the CRC mean activity coefficients of CaCl2 (-24 % at 5 mol/kg) and
MgCl2 (+10 %) at 25 C, while Harvie, Moller & Weare (1984) (= Pitzer & Mayorga 1973) meet
them. For CaCl2 the new set takes Harvie et al.'s 25 C values and refits the temperature
functions below 25 C to the evaluated ice line:

    P(T) = P_spencer(T) + [P_harvie - P_spencer(T_r)] + sum_k c_k g_k(T)

The bracket is a constant (the 25 C values become Harvie et al.'s exactly; Spencer et
al.'s slope dP/dT at 25 C, their enthalpy data, is kept); the shapes g1, g2 (value and
slope zero at T_r, see fit_brine_ice_line.py) carry the change below 25 C. Their
coefficients are fitted, with scipy.optimize.least_squares, to

  * the freezing points of Melinder (2010) (CoolProp 8 INCOMP::MCA, CaCl2 1-30 wt%, 1 wt%
    steps), weight 1 per K;
  * a penalty that keeps the parameters near the old default's below 0 C: the change of
    beta0, beta1 and C-phi against `spencer_1990_icefit` at 10 temperatures 220-273.15 K,
    scaled by 0.05, 0.5 and 0.005, weight 0.1 K per unit.

The 25 C data are not fitted: Harvie et al.'s published values are the 25 C anchor (an
infinite weight on them), and every CRC row stays a held-out check.

MgCl2 (fit_mgcl2): with Spencer et al.'s slope kept, the same treatment (penalty weights 1
and 10 K) could not bring the parameters back to Spencer et al.'s by 0 C: the shapes have
zero value and slope at 25 C, so Harvie et al.'s beta1 offset (-0.14) was still -0.07 at
271 K, and seawater (whose magnesium these rows set) moved out of its checks (TEOS-10
latent heat 5 -> -2 C 2.3 % off, gypsum onset 1.2 K and sylvite onset 1.9 K from
FREZCHEM's). Spencer et al.'s dbeta1/dT at 25 C (0.0147 /K) is five times Silvester &
Pitzer's (0.00278 /K, from enthalpies of dilution); with the published slope too, the
curvature terms hold the row within 0.026 of Spencer et al.'s below 0 C (penalty weight
10 K), and every seawater check passes (TEOS-10 latent heat 5 -> -2 C +0.30 %, was
+0.56 %; gypsum onset 1.13 K, sylvite onset 1.36 K from FREZCHEM's, were 1.14 and
1.28 K). The MgCl2 ice line stays Spencer et al.'s (worst 1.05 K from Melinder's,
unchecked there; the CRC rows to 5 wt% move by 0.001 K; the MgCl2.12H2O eutectic of this
NumPy copy moves from -32.98 to -32.87 C, so its solubility product is not shifted). NaCl,
KCl and Na2SO4 keep the rows of `spencer_1990_icefit` (they meet the CRC table within the
issue's limits).

K2SO4 and MgSO4 (fit_sulfate): Marion & Farren's (1999) rows missed the isopiestic osmotic
coefficients at 25 C (-2.0 % and -13 %). They take Harvie et al.'s 25 C values and Silvester &
Pitzer's 25 C slopes (Pitzer 1991 Table 13, whose third column is dC/dT, converted to C-phi),
and four curvature shapes per parameter hold them at Marion & Farren's rows below 0 C (penalty
only: no freezing point in these fits). A MgSO4 row that follows the CRC freezing points
(SULFATE_REFERENCE "line" with used_in_fit rows) moved seawater out of its TEOS-10 latent-heat
and gypsum-onset checks, because the sulfate mixing terms were fitted with the old binary row
(docs/electrolytes.md).

Step 2 shifts the solubility product of antarcticite (CaCl2.6H2O) so that its published
solubility curve (Spencer et al. 1990 activities) holds with the new activities, 222-298 K,
as fit_brine_ice_line.py does for the old default. Step 3 fits halite's K (see
halite_shift), step 4 bischofite's (see bischofite_shift).

Run: python3 tools/fit_default_set.py     (prints the rows, the residuals and the
covariance of the fitted coefficients)
"""
from __future__ import annotations

import sys
from pathlib import Path

import numpy as np
from scipy.optimize import brentq, least_squares

import CoolProp.CoolProp as CP
import colligate as cg
from colligate import _core

sys.path.insert(0, str(Path(__file__).resolve().parent))
from fit_brine_ice_line import TR, MW, analytic, aphi_spencer, shape_to_coefficients, ln_k  # noqa: E402

# Rows of spencer_1990_icefit (a0..a5) and Harvie et al. (1984) 25 C values.
SALTS = {
    "CaCl2": {
        "old": {
            "beta0": [0.304058, 864.4903987, 11.94793, -0.05285165275, 3.783969605e-05, -3394.2],
            "beta1": [1.708132, -39643.40661, 0, -1.640686996, 0.002009494198, 0],
            "cphi": [-0.00199, 247.8404573, -0.64691, 0.009321530354, -9.066156702e-06, -12466.4],
        },
        "spencer": {
            "beta0": [0.304058, 1265.271, 11.94793, -0.03558926, 1.64514e-05, -3394.2],
            "beta1": [1.708132, 0, 0, -0.015417, 0.000031791, 0],
            "cphi": [-0.00199, 125.363, -0.64691, 0.00444735, -3.2027e-06, -12466.4],
        },
        "harvie": {"beta0": 0.3159, "beta1": 1.614, "cphi": -0.00034},
        "molar_mass": 0.110984, "melinder": "INCOMP::MCA", "w_max": 0.30,
    },
}
SHAPES = ("g1", "g2")
NAMES = ("beta0", "beta1", "cphi")
SCALE = {"beta0": 0.05, "beta1": 0.5, "cphi": 0.005}
# K per scaled unit.
REGULARISATION = {"CaCl2": 0.1}
PENALTY_TEMPS = np.linspace(220.0, 273.15, 10)


def rows_with(salt: str, x: np.ndarray) -> dict:
    rec = SALTS[salt]
    rows = {}
    i = 0
    for k in NAMES:
        a = np.array(rec["spencer"][k], dtype=float)
        a[0] = rec["harvie"][k]  # constant shift: the 25 C value becomes Harvie et al.'s
        for shape in SHAPES:
            a = a + shape_to_coefficients(shape, x[i])
            i += 1
        rows[k] = a
    return rows


def osmotic(m: float, T: float, rows: dict) -> float:
    """Binary 2:1 chloride (nu = 3), alpha1 = 2, b = 1.2."""
    s = np.sqrt(3.0 * m)
    b0, b1, cphi = (analytic(rows[k], T) for k in NAMES)
    return (1 - 2 * aphi_spencer(T) * s / (1 + 1.2 * s)
            + m * (4.0 / 3.0) * (b0 + b1 * np.exp(-2 * s))
            + m * m * (2 * 2 ** 1.5 / 3.0) * cphi)


def freezing_point(salt: str, w: float, rows: dict) -> float:
    m = w / (1 - w) / SALTS[salt]["molar_mass"]
    f = lambda T: -osmotic(m, T, rows) * 3 * m * MW - _core.ln_water_activity_of_ice(T)
    return brentq(f, 215.0, 273.15, xtol=1e-12)


def melinder(salt: str, w: float) -> float:
    return CP.PropsSI("T_freeze", "T", 273.15, "P", 101325, f"{SALTS[salt]['melinder']}[{w}]")


def fit(salt: str):
    rec = SALTS[salt]
    ws = np.round(np.arange(0.01, rec["w_max"] + 1e-9, 0.01), 2)
    target = np.array([melinder(salt, w) for w in ws])
    old = {k: np.array(rec["old"][k], dtype=float) for k in NAMES}
    # The NumPy copy must reproduce colligate's old default (osmotic coefficients).
    worst = max(abs(osmotic(m, T, old) - _core.pitzer_osmotic_coefficient(
        cg.Solution(1.0, {salt: m * rec["molar_mass"]}), T, "spencer_1990_icefit")[0])
        for m in (0.5, 2.0, 4.0) for T in (233.15, 263.15, 298.15))
    assert worst < 1e-6, f"{salt}: NumPy copy differs from colligate by {worst}"

    def residuals(x):
        rows = rows_with(salt, x)
        return np.array([freezing_point(salt, w, rows) for w in ws]) - target

    def penalised(x):
        rows = rows_with(salt, x)
        pen = [REGULARISATION[salt] * (analytic(rows[k], PENALTY_TEMPS) - analytic(old[k], PENALTY_TEMPS))
               / SCALE[k] for k in NAMES]
        return np.concatenate([residuals(x)] + pen)

    n = len(NAMES) * len(SHAPES)
    res = least_squares(penalised, np.zeros(n), x_scale=1e-3, xtol=1e-14, ftol=1e-14)
    r = residuals(res.x)
    r_old = np.array([freezing_point(salt, w, old) for w in ws]) - target
    dof = len(res.fun) - n
    s2 = float(res.fun @ res.fun) / dof
    cov = s2 * np.linalg.inv(res.jac.T @ res.jac)
    print(f"\n{salt}: {n} curvature terms on Harvie et al.'s 25 C values; ice line vs Melinder "
          f"{ws[0]:.2f}-{ws[-1]:.2f} wt fraction ({len(ws)} rows, all used in the fit):")
    print(f"  new rms {np.sqrt(np.mean(r**2)):.3f} K, worst {np.abs(r).max():.3f} K; "
          f"old default rms {np.sqrt(np.mean(r_old**2)):.3f} K, worst {np.abs(r_old).max():.3f} K; "
          f"copy within {worst:.1e}")
    print("  residuals (K) by wt%: " + ", ".join(f"{100 * w:.0f}:{d:+.3f}" for w, d in zip(ws, r)))
    print("  shape coefficients (beta0 g1 g2, beta1 g1 g2, cphi g1 g2):",
          ", ".join(f"{v:.10g}" for v in res.x))
    print(f"  covariance (s^2 = {s2:.4g} K^2, {dof} degrees of freedom), standard "
          "uncertainties: " + ", ".join(f"{np.sqrt(cov[i, i]):.3g}" for i in range(n)))
    corr = cov / np.sqrt(np.outer(np.diag(cov), np.diag(cov)))
    print("  correlation:\n" + "\n".join("    " + " ".join(f"{v:+.3f}" for v in row) for row in corr))
    rows = rows_with(salt, res.x)
    for k in NAMES:
        print(f"  {k}: tf(" + ", ".join(f"{v:.10g}" for v in rows[k]) + ")")
        grid = np.linspace(219.15, 298.15, 80)
        change = analytic(rows[k], grid) - analytic(old[k], grid)
        print(f"    change vs old default over 219-298 K: {change.min():+.4f} .. {change.max():+.4f}")
    return rows


# MgCl2 (issue 12, step 2): Harvie et al.'s (1984) 25 C values AND a published 25 C slope.
# Spencer et al.'s row has dP/dT at 25 C of -4.78e-4 (beta0), 1.470e-2 (beta1) and -1.06e-4
# (C-phi) per K, where Silvester & Pitzer's enthalpy-of-dilution fit gives -0.194e-3,
# 2.78e-3 and -0.580e-4 (Pitzer 1991, ch. 3, Table 13 part I, 2-1 electrolytes, read in
# pytzer's copy, pytzer/tables.py P91_Ch3_T13_I 'Mg-Cl', valid to 2 mol/kg; pytzer labels
# the third column C0, and it is C, not C-phi: see MGCL2_SLOPE). Keeping Spencer et al.'s slope left Harvie et al.'s beta1 offset (-0.14) at
# -0.07 at 271 K; with Silvester & Pitzer's slope the offset changes sign within 25 K, and
# the curvature terms g1, g2 can bring the row back to Spencer et al.'s below 0 C.
MGCL2_SPENCER = {
    "beta0": [0.351542, -392.241, -17.65506, 0.0703283, -4.17563e-05, -117885],
    "beta1": [1.821364, -65485.608, 1302.23382, -6.71036992, 0.004429219, 13522889.4],
    "cphi": [0.006507, 0, 0, -0.00024995, 2.418e-07, 0],
}
MGCL2_HARVIE = {"beta0": 0.35235, "beta1": 1.6815, "cphi": 0.00519}
# Table 13's third column is dC/dT with C = C-phi / (2 sqrt|z_M z_X|) (see SULFATES below), so
# dC-phi/dT = 2 sqrt(2) x (-0.580e-4) = -1.64e-4 /K (Silvester & Pitzer's Table II, as copied in
# pytzer's bC_Mg_Cl_SP78: -3.11e-4 x 3 / 2^(5/2) = -1.65e-4). The row before used -0.580e-4 for
# dC-phi/dT; the curvature terms absorbed most of it (ice line rms 0.577 -> 0.567 K now).
MGCL2_SLOPE = {"beta0": -0.194e-3, "beta1": 2.78e-3, "cphi": 2 * np.sqrt(2.0) * -0.580e-4}
# K per scaled unit: the seawater checks (TEOS-10 latent heat, FREZCHEM salt onsets) need the
# row at Spencer et al.'s below 0 C, so the penalty weighs 100 times the CaCl2 one.
MGCL2_REGULARISATION = 10.0
M_MGCL2 = 0.095211


def slope_at_tr(a) -> float:
    a = np.asarray(a, dtype=float)
    return -a[1] / TR**2 + a[2] / TR + a[3] + 2 * a[4] * TR - 2 * a[5] / TR**3


def mgcl2_rows_with(x: np.ndarray) -> dict:
    rows = {}
    i = 0
    for k in NAMES:
        a = np.array(MGCL2_SPENCER[k], dtype=float)
        a[0] = MGCL2_HARVIE[k]                                   # 25 C value: Harvie et al.
        a[3] += MGCL2_SLOPE[k] - slope_at_tr(MGCL2_SPENCER[k])  # 25 C slope: Silvester & Pitzer
        for shape in SHAPES:
            a = a + shape_to_coefficients(shape, x[i])
            i += 1
        rows[k] = a
    return rows


def fit_mgcl2() -> dict:
    """MgCl2 row of the default set: 25 C value and slope fixed (above), g1 and g2 on beta0,
    beta1 and C-phi fitted to Melinder's ice line (CoolProp INCOMP::MMG, 1-21 wt%) with the
    penalty of fit() against Spencer et al.'s row at 220-273.15 K (weight MGCL2_REGULARISATION)."""
    ws = np.round(np.arange(0.01, 0.21 + 1e-9, 0.01), 2)
    target = np.array([CP.PropsSI("T_freeze", "T", 273.15, "P", 101325, f"INCOMP::MMG[{w}]") for w in ws])
    old = {k: np.array(MGCL2_SPENCER[k], dtype=float) for k in NAMES}
    worst = max(abs(osmotic(m, T, old) - _core.pitzer_osmotic_coefficient(
        cg.Solution(1.0, {"MgCl2": m * M_MGCL2}), T, "spencer_1990_icefit")[0])
        for m in (0.5, 2.0, 4.0) for T in (233.15, 263.15, 298.15))
    assert worst < 1e-6, f"MgCl2: NumPy copy differs from colligate by {worst}"

    def tf(w, rows):
        m = w / (1 - w) / M_MGCL2
        f = lambda T: -osmotic(m, T, rows) * 3 * m * MW - _core.ln_water_activity_of_ice(T)
        return brentq(f, 215.0, 273.15, xtol=1e-12)

    def residuals(x):
        rows = mgcl2_rows_with(x)
        return np.array([tf(w, rows) for w in ws]) - target

    def penalised(x):
        rows = mgcl2_rows_with(x)
        pen = [MGCL2_REGULARISATION * (analytic(rows[k], PENALTY_TEMPS) - analytic(old[k], PENALTY_TEMPS))
               / SCALE[k] for k in NAMES]
        return np.concatenate([residuals(x)] + pen)

    n = len(NAMES) * len(SHAPES)
    res = least_squares(penalised, np.zeros(n), x_scale=1e-3, xtol=1e-14, ftol=1e-14)
    r = residuals(res.x)
    r_old = np.array([tf(w, old) for w in ws]) - target
    dof = len(res.fun) - n
    s2 = float(res.fun @ res.fun) / dof
    cov = s2 * np.linalg.inv(res.jac.T @ res.jac)
    print(f"\nMgCl2: Harvie et al.'s 25 C values, Silvester & Pitzer's 25 C slopes, {n} curvature "
          f"terms; ice line vs Melinder 1-21 wt% ({len(ws)} rows):")
    print(f"  new rms {np.sqrt(np.mean(r**2)):.3f} K, worst {np.abs(r).max():.3f} K; Spencer et al. "
          f"rms {np.sqrt(np.mean(r_old**2)):.3f} K, worst {np.abs(r_old).max():.3f} K; copy within {worst:.1e}")
    print("  residuals (K) by wt%: " + ", ".join(f"{100 * w:.0f}:{d:+.3f}" for w, d in zip(ws, r)))
    print("  shape coefficients (beta0 g1 g2, beta1 g1 g2, cphi g1 g2):", ", ".join(f"{v:.10g}" for v in res.x))
    print(f"  covariance (s^2 = {s2:.4g} K^2, {dof} degrees of freedom), standard uncertainties: "
          + ", ".join(f"{np.sqrt(cov[i, i]):.3g}" for i in range(n)))
    rows = mgcl2_rows_with(res.x)
    for k in NAMES:
        print(f"  {k}: tf(" + ", ".join(f"{v:.10g}" for v in rows[k]) + ")")
        grid = np.linspace(219.15, 298.15, 80)
        change = analytic(rows[k], grid) - analytic(old[k], grid)
        print(f"    change vs Spencer et al. over 219-298 K: {change.min():+.4f} .. {change.max():+.4f}; "
              f"at 271.15 K {analytic(rows[k], 271.15) - analytic(old[k], 271.15):+.4f}")
    return rows


# K2SO4 and MgSO4 (issue 12, step 3), as MgCl2: Harvie et al.'s (1984) 25 C values (Table 1,
# read in pytzer's copy, parameters.py bC_K_SO4_HMW84, bC_Mg_SO4_HMW84; = Pitzer & Mayorga
# 1973, 1974) and Silvester & Pitzer's (1978) 25 C slopes as Pitzer (1991, ch. 3, Table 13)
# prints them (pytzer/tables.py P91_Ch3_T13_I 'K-SO4', P91_Ch3_T13_II 'Mg-SO4'). Table 13's
# third column is dC/dT in the C = C-phi / (2 sqrt|z_M z_X|) convention (pytzer's label "C0" is
# right): Silvester & Pitzer's Table II, read in pytzer's bC_*_SP78 functions, prints the
# Pitzer & Mayorga scaled slopes, and for Mg-Cl (-3.11e-4) and Na-SO4 (-9.2e-4) times 3/2^(5/2)
# / (2 sqrt 2) they give Table 13's -0.580e-4 and -1.725e-4. So dC-phi/dT = 2 sqrt|z_M z_X|
# times the column: 0 for K2SO4 (printed 0), 4 x 0.131e-3 for MgSO4.
# The old rows (Marion & Farren 1999, frezchem.dat) miss the 25 C isopiestic osmotic
# coefficients (K2SO4 -2.0 %, MgSO4 -13 %); Harvie et al.'s rows meet them within 1 %.
# Curvature g1, g2 on every parameter is fitted to published freezing points (CRC, rows marked
# used_in_fit = yes in tests/reference/crc_freezing_points.csv) with the penalty of fit()
# against the old row at 220-273.15 K, which keeps the seawater sulfate phases (mirabilite,
# arcanite, epsomite/meridianiite, gypsum) on the old default's path.
SULFATES = {
    "K2SO4": {
        "crc": "potassium_sulfate", "molar_mass": 0.1742592, "nu": (2, 1), "z": 2.0,
        "alpha": (2.0, None),
        "names": ("beta0", "beta1", "cphi"),
        "old": {
            "beta0": [0.003795, 22.492, 0.2029, 0.00165088, 9.746e-07, -540.7],
            "beta1": [1.052416, 767.611, 6.36874, -0.03159629, 2.98397e-05, -16995.7],
            "cphi": [0.014845, 6.792, 0.12817, -0.00049111, 5.849e-07, -332],
        },
        "harvie": {"beta0": 0.04995, "beta1": 0.7793, "cphi": 0.0},
        "slope": {"beta0": 1.440e-3, "beta1": 6.70e-3, "cphi": 0.0},
    },
    "MgSO4": {
        "crc": "magnesium_sulfate", "molar_mass": 0.1203676, "nu": (1, 1), "z": 4.0,
        "alpha": (1.4, 12.0),
        "names": ("beta0", "beta1", "beta2", "cphi"),
        "old": {
            "beta0": [0.126545, 470.866, 6.08307, -0.03139609, 2.82462e-05, -15937.6],
            "beta1": [3.491512, 2603.294, 34.29203, -0.13991327, 0.000161578, -90018.9],
            "beta2": [-6.243985, 245008.193, 1276.67549, -6.82364722, 0.007402746, -3561447.4],
            "cphi": [0.05291, -6.004, -0.43928, 0.00120236, -1.9372e-06, 1116.1],
        },
        "harvie": {"beta0": 0.221, "beta1": 3.343, "beta2": -37.23, "cphi": 0.025},
        "slope": {"beta0": -0.690e-3, "beta1": 1.530e-2, "beta2": -2.53e-1, "cphi": 4 * 0.131e-3},
    },
}
SULFATE_SCALE = {"beta0": 0.05, "beta1": 0.5, "beta2": 5.0, "cphi": 0.005}
# K per scaled unit (as MGCL2_REGULARISATION).
SULFATE_REGULARISATION = {"K2SO4": 10.0, "MgSO4": 10.0}
# What the penalty holds the row to below 0 C: "old" (the old row) or "line" (Harvie et al.'s value
# and the published slope on the old row's curvature, the fitted terms zero).
SULFATE_REFERENCE = {"K2SO4": "old", "MgSO4": "old"}  # "line": see docs/electrolytes.md (seawater)
CRC_FREEZING_CSV = Path(__file__).resolve().parents[1] / "tests" / "reference" / "crc_freezing_points.csv"


def sulfate_osmotic(salt: str, m: float, T: float, rows: dict) -> float:
    """Binary sulfate (Pitzer 1991, ch. 3, eq. for phi), Spencer et al.'s A_phi, b = 1.2."""
    rec = SULFATES[salt]
    nm, nx = rec["nu"]
    nu = nm + nx
    zz = rec["z"]
    ionic = 3.0 * m if nu == 3 else 4.0 * m  # K2SO4: I = 3m; MgSO4: I = 4m
    s = np.sqrt(ionic)
    a1, a2 = rec["alpha"]
    p = {k: analytic(rows[k], T) for k in rec["names"]}
    bphi = p["beta0"] + p["beta1"] * np.exp(-a1 * s)
    if a2 is not None:
        bphi = bphi + p["beta2"] * np.exp(-a2 * s)
    return (1 - zz * aphi_spencer(T) * s / (1 + 1.2 * s)
            + m * (2 * nm * nx / nu) * bphi + m * m * (2 * (nm * nx) ** 1.5 / nu) * p["cphi"])


# The sulfate rows change more between 25 and 0 C than the chlorides' (MgSO4 beta2: -37.2 at 25 C
# in Harvie et al.'s row, +14 at 0 C in the old one), so two more shapes with value and slope zero
# at T_r, on the other terms of the analytic form: g3 = 1e6 [1/T^2 - 1/T_r^2 + 2 (T - T_r)/T_r^3],
# g4 = 100 [ln(T/T_r) - (T - T_r)/T_r].
SULFATE_SHAPES = ("g1", "g2", "g3", "g4")


def sulfate_shape(shape: str, c: float) -> np.ndarray:
    if shape in ("g1", "g2"):
        return shape_to_coefficients(shape, c)
    d = np.zeros(6)
    if shape == "g3":
        d[5] += 1e6 * c
        d[3] += 1e6 * c * 2 / TR**3
    elif shape == "g4":
        d[2] += 100 * c
        d[3] -= 100 * c / TR
    else:
        raise ValueError(shape)
    return d


def sulfate_rows_with(salt: str, x: np.ndarray) -> dict:
    rec = SULFATES[salt]
    rows = {}
    i = 0
    for k in rec["names"]:
        a = np.array(rec["old"][k], dtype=float)
        a[0] = rec["harvie"][k]                                # 25 C value: Harvie et al.
        a[3] += rec["slope"][k] - slope_at_tr(rec["old"][k])   # 25 C slope: Silvester & Pitzer
        for shape in SULFATE_SHAPES:
            a = a + sulfate_shape(shape, x[i])
            i += 1
        rows[k] = a
    return rows


def sulfate_freezing_point(salt: str, m: float, rows: dict) -> float:
    nu = sum(SULFATES[salt]["nu"])
    f = lambda T: -sulfate_osmotic(salt, m, T, rows) * nu * m * MW - _core.ln_water_activity_of_ice(T)
    return brentq(f, 250.0, 273.15, xtol=1e-12)


def fit_sulfate(salt: str) -> dict:
    """K2SO4 or MgSO4 row of the default set: 25 C values and slopes fixed (above), g1 and g2 on
    every parameter fitted to the used_in_fit = yes CRC freezing points with the penalty against
    the old row below 0 C; prints the residuals of every CRC row (fit and held out)."""
    import pandas as pd

    rec = SULFATES[salt]
    names = rec["names"]
    old = {k: np.array(rec["old"][k], dtype=float) for k in names}
    worst = max(abs(sulfate_osmotic(salt, m, T, old) - _core.pitzer_osmotic_coefficient(
        cg.Solution.from_molalities({salt: m}), T, "spencer_1990_icefit")[0])
        for m in (0.1, 0.5, 1.5) for T in (253.15, 273.15, 298.15))
    assert worst < 1e-6, f"{salt}: NumPy copy differs from colligate by {worst}"
    table = pd.read_csv(CRC_FREEZING_CSV)
    table = table[table.solute == rec["crc"]]
    used = table[table.used_in_fit == "yes"]
    m_fit = used.molality_mol_per_kg.to_numpy()
    target = 273.15 - used.depression_K.to_numpy()

    def residuals(x):
        rows = sulfate_rows_with(salt, x)
        return np.array([sulfate_freezing_point(salt, m, rows) for m in m_fit]) - target

    def penalised(x):
        rows = sulfate_rows_with(salt, x)
        line = sulfate_rows_with(salt, np.zeros(n))
        ref = old if SULFATE_REFERENCE[salt] == "old" else line
        pen = [SULFATE_REGULARISATION[salt] * (analytic(rows[k], PENALTY_TEMPS) - analytic(ref[k], PENALTY_TEMPS))
               / SULFATE_SCALE[k] for k in names]
        return np.concatenate([residuals(x)] + pen)

    n = len(names) * len(SULFATE_SHAPES)
    res = least_squares(penalised, np.zeros(n), x_scale=1e-3, xtol=1e-14, ftol=1e-14)
    dof = len(res.fun) - n
    s2 = float(res.fun @ res.fun) / dof
    cov = s2 * np.linalg.inv(res.jac.T @ res.jac)
    rows = sulfate_rows_with(salt, res.x)
    print(f"\n{salt}: Harvie et al.'s 25 C values, Silvester & Pitzer's 25 C slopes, {n} curvature "
          f"terms; {len(used)} CRC freezing points in the fit (copy within {worst:.1e}):")
    for _, r in table.iterrows():
        m = r.molality_mol_per_kg
        new = 273.15 - sulfate_freezing_point(salt, m, rows)
        was = 273.15 - sulfate_freezing_point(salt, m, old)
        print(f"  {r.mass_percent:5.1f} wt% ({m:.3f} mol/kg): CRC {r.depression_K:.2f} K, new "
              f"{new:.3f} ({new - r.depression_K:+.3f}), old {was:.3f} ({was - r.depression_K:+.3f}); "
              f"used_in_fit {r.used_in_fit}")
    print("  shape coefficients (g1 g2 g3 g4 per parameter):", ", ".join(f"{v:.10g}" for v in res.x))
    print(f"  covariance (s^2 = {s2:.4g} K^2, {dof} degrees of freedom), standard uncertainties: "
          + ", ".join(f"{np.sqrt(cov[i, i]):.3g}" for i in range(n)))
    for k in names:
        # 17 digits: the four shapes cancel each other in large coefficients
        print(f"  {k}: tf(" + ", ".join(f"{v:.17g}" for v in rows[k]) + ")")
        grid = np.linspace(219.15, 298.15, 80)
        change = analytic(rows[k], grid) - analytic(old[k], grid)
        print(f"    change vs old row over 219-298 K: {change.min():+.4f} .. {change.max():+.4f}; "
              f"at 271.15 K {analytic(rows[k], 271.15) - analytic(old[k], 271.15):+.4f}")
    for m in (0.1, 0.5, 0.7, 1.5, 2.5):
        print(f"  phi(25 C, {m} mol/kg): new {sulfate_osmotic(salt, m, TR, rows):.4f}, "
              f"old {sulfate_osmotic(salt, m, TR, old):.4f}")
    return rows


# Salt hydrates whose solubility product goes with the CaCl2 and MgCl2 activities:
# frezchem.dat log10 K (A1..A6), waters of hydration, the temperatures fitted (K).
HYDRATES = {
    "CaCl2": ("CaCl2.6H2O", 6,
              [-38613.99886, -14.14140164, 1381731.005, 15479.47256, -52024247.5, 0.005422163],
              (222.0, 298.15)),
}


def ln_gamma(m: float, T: float, rows: dict) -> float:
    """ln of the mean activity coefficient of a binary 2:1 chloride (Pitzer 1991, ch. 3)."""
    s = np.sqrt(3.0 * m)
    b0, b1, cphi = (analytic(rows[k], T) for k in NAMES)
    f = -aphi_spencer(T) * (s / (1 + 1.2 * s) + (2 / 1.2) * np.log(1 + 1.2 * s))
    x = 2 * s
    bg = 2 * b0 + 2 * b1 / (x * x) * (1 - (1 + x - x * x / 2) * np.exp(-x))
    return 2 * f + m * (4.0 / 3.0) * bg + m * m * (2 * 2 ** 1.5 / 3.0) * 1.5 * cphi


def ln_iap(m: float, T: float, rows: dict, waters: int) -> float:
    ln_aw = -osmotic(m, T, rows) * 3 * m * MW
    return np.log(m) + 2 * np.log(2 * m) + 3 * ln_gamma(m, T, rows) + waters * ln_aw


def solubility_shift(salt: str, rows: dict) -> None:
    phase, waters, a, (t_lo, t_hi) = HYDRATES[salt]
    spencer = {k: np.array(SALTS[salt]["spencer"][k], dtype=float) for k in NAMES}
    copy = max(abs(np.exp(ln_gamma(m, T, spencer)) - _core.mean_activity_coefficient(
        cg.Solution(1.0, {salt: m * SALTS[salt]["molar_mass"]}), salt, T, "spencer_1990")[0])
        for m in (0.5, 2.0, 5.0) for T in (238.15, 263.15, 298.15))
    assert copy < 1e-6, f"{salt}: NumPy gamma differs from colligate's spencer_1990 by {copy}"
    temps = np.linspace(t_lo, t_hi, 32)
    shift = []
    for T in temps:
        m_sat = brentq(lambda m: ln_iap(m, T, spencer, waters) - ln_k(a, T), 0.5, 4.5 if waters == 12 else 8.0)
        shift.append((ln_iap(m_sat, T, rows, waters) - ln_iap(m_sat, T, spencer, waters)) / np.log(10.0))
    shift = np.array(shift)
    basis = np.column_stack([np.ones_like(temps), temps, 1.0 / temps, np.log10(temps),
                             1.0 / temps**2, temps**2])
    # MgCl2.12H2O's curve spans 16 K only: three terms (A1..A3), so that the shift stays
    # tame where it is extrapolated (219-236 K).
    terms = 3 if salt == "MgCl2" else 6
    d = np.zeros(6)
    d[:terms], *_ = np.linalg.lstsq(basis[:, :terms], shift, rcond=None)
    worst = np.abs(basis @ d - shift).max()
    grid = np.linspace(219.15, 298.15, 80)
    wide = np.column_stack([np.ones_like(grid), grid, 1.0 / grid, np.log10(grid), 1.0 / grid**2, grid**2]) @ d
    print(f"\n{phase}: log10 K shift {shift.min():+.4f} .. {shift.max():+.4f} over "
          f"{t_lo}-{t_hi} K; A1..A6 += {', '.join(f'{v:.10g}' for v in d)} (fit within {worst:.1e}; "
          f"NumPy gamma within {copy:.1e} of colligate's spencer_1990)")
    print(f"  (shift over 219-298 K: {wide.min():+.4f} .. {wide.max():+.4f})")


# Halite (NaCl), frezchem.dat log10 K (A1..A6), and the NaCl rows of Spencer et al. (1990)
# and of the default set (spencer_1990_icefit's beta0 curvature).
HALITE = [596.809454, 0.73058662, 9360.9197, -315.516708, -1749318.4, -0.000495535]
NACL_SPENCER = {
    "beta0": [0.076276, -886.777, -4.19728, 0.00613645, -1.1006e-06, 8942.9],
    "beta1": [0.280431, -8677.858, -94.69966, 0.2944375, -0.000147476, -191956],
    "cphi": [0.001271, 52.6, 0.07951, 0.00031974, -3.195e-07, -1237.7],
}
NACL_DEFAULT = dict(NACL_SPENCER, beta0=[0.076276, -886.777, -4.19728, 0.007239381384,
                                         -2.950224994e-06, 8942.9])
M_NACL = 0.05844277
SOLUBILITY_CSV = Path(__file__).resolve().parents[1] / "tests" / "reference" / "nacl_solubility.csv"


def ln_gamma_nacl(m: float, T: float, rows: dict) -> float:
    """ln gamma of NaCl (1:1, alpha1 = 2, b = 1.2; Pitzer 1991, ch. 3) with Spencer's A_phi."""
    s = np.sqrt(m)
    b0, b1, cphi = (analytic(np.array(rows[k], dtype=float), T) for k in NAMES)
    f = -aphi_spencer(T) * (s / (1 + 1.2 * s) + (2 / 1.2) * np.log(1 + 1.2 * s))
    x = 2 * s
    return f + m * (2 * b0 + 2 * b1 / (x * x) * (1 - (1 + x - x * x / 2) * np.exp(-x))) + m * m * 1.5 * cphi


def halite_molality(T: float, rows: dict, shift=None) -> float:
    ln_k_t = ln_k(HALITE, T) + (0.0 if shift is None else ln_k(shift, T))
    return brentq(lambda m: 2 * np.log(m) + 2 * ln_gamma_nacl(m, T, rows) - ln_k_t, 3.0, 8.0)


def halite_shift() -> None:
    """Halite's log10 K for the default set: (1) the shift that keeps Spencer et al.'s
    saturation curve with the default set's NaCl curvature below 25 C (as the hydrohalite
    shift of fit_brine_ice_line.py; without it the curve rises on cooling, 6.106 -> 6.142
    mol/kg from 25 to 0.1 C), plus (2) c0 + c1 (T - T_r), fitted to the used_in_fit rows of
    the Salt Institute solubility table (tests/reference/nacl_solubility.csv: 0.1, 10,
    21.11 C; 4.44 and 15.56 C held out): a correction of halite's 25 C solubility product
    and of its enthalpy of solution."""
    import pandas as pd

    worst = max(abs(np.exp(ln_gamma_nacl(m, T, NACL_SPENCER)) - _core.mean_activity_coefficient(
        cg.Solution(1.0, {"NaCl": m * M_NACL}), "NaCl", T, "spencer_1990")[0])
        for m in (0.5, 3.0, 6.0) for T in (263.15, 283.15, 298.15))
    assert worst < 1e-6, f"NaCl: NumPy gamma differs from colligate's spencer_1990 by {worst}"
    temps = np.linspace(252.0, 298.15, 24)
    comp = np.array([(2 * ln_gamma_nacl(m, T, NACL_DEFAULT) - 2 * ln_gamma_nacl(m, T, NACL_SPENCER))
                     / np.log(10.0) for T in temps for m in [halite_molality(T, NACL_SPENCER)]])
    basis = lambda t: np.column_stack([np.ones_like(t), t, 1.0 / t, np.log10(t), 1.0 / t**2, t**2])
    d_comp, *_ = np.linalg.lstsq(basis(temps), comp, rcond=None)
    table = pd.read_csv(SOLUBILITY_CSV)
    used = table[table.used_in_fit == "yes"]
    t_used = used.temperature_C.to_numpy() + 273.15
    need = np.array([(2 * np.log(m) + 2 * ln_gamma_nacl(m, T, NACL_DEFAULT) - ln_k(HALITE, T)) / np.log(10.0)
                     for m, T in zip(used.molality_mol_per_kg, t_used)])
    resid = need - basis(t_used) @ d_comp
    design = np.column_stack([np.ones_like(t_used), t_used - TR])
    (c0, c1), *_ = np.linalg.lstsq(design, resid, rcond=None)
    shift = d_comp.copy()
    shift[0] += c0 - c1 * TR
    shift[1] += c1
    print(f"\nhalite: compensation fitted within {np.abs(basis(temps) @ d_comp - comp).max():.1e} in "
          f"log10 K over 252-298.15 K; data term c0 = {c0:+.6f}, c1 = {c1:+.3e} /K "
          f"(NumPy gamma within {worst:.1e} of colligate's spencer_1990)")
    print("  A1..A6 += " + ", ".join(f"{v:.10g}" for v in shift))
    for _, r in table.iterrows():
        T = r.temperature_C + 273.15
        m = halite_molality(T, NACL_DEFAULT, shift)
        print(f"  {r.temperature_C:6.2f} C: model {m:.4f}, table {r.molality_mol_per_kg:.4f} mol/kg "
              f"({m - r.molality_mol_per_kg:+.4f}; used_in_fit {r.used_in_fit})")
    for T in (273.25, 298.15):
        print(f"  {T} K: Spencer {halite_molality(T, NACL_SPENCER):.4f}, old default "
              f"{halite_molality(T, NACL_DEFAULT):.4f}, new default "
              f"{halite_molality(T, NACL_DEFAULT, shift):.4f} mol/kg")


# Bischofite (MgCl2.6H2O), frezchem.dat log10 K (A1..A6), and the MgCl2 solubility table.
BISCHOFITE = [326.68721, 0.05106637, -10563.0802, -121.990076, 0.0, 0.0]
MGCL2_SOLUBILITY_CSV = SOLUBILITY_CSV.with_name("mgcl2_solubility.csv")


def ln_iap_bischofite(m: float, T: float) -> float:
    """ln IAP of MgCl2.6H2O in an MgCl2 solution of molality m with the built default set
    (the liquid held unprecipitated): ln(4 m^3 gamma^3) + 6 ln a_w."""
    s = cg.Solution.from_molalities({"MgCl2": m})
    g = cg.mean_activity_coefficient(s, "MgCl2", T)
    aw = cg.water_activity(s, T, model="pitzer", saturation="metastable")
    return float(np.log(4.0 * m**3 * g**3) + 6.0 * np.log(aw))


def bischofite_shift() -> None:
    """Bischofite's log10 K for the default set: c0 + c1 (T - T_r) added to frezchem.dat's,
    fitted to the used_in_fit rows of the MgCl2 solubility table
    (tests/reference/mgcl2_solubility.csv: 0 and 20 C; 10 and 25 C held out). The default
    set's MgCl2 row (Harvie et al.'s 25 C values, Silvester & Pitzer's slopes) gives more
    soluble bischofite with the published K (6.03 mol/kg at 25 C) than the table (5.83);
    with Spencer et al.'s own row the published K meets the table within 0.02 mol/kg. The
    water activity of the saturated solution at 25 C is then checked against Greenspan
    (1977), which is not fitted."""
    import pandas as pd

    table = pd.read_csv(MGCL2_SOLUBILITY_CSV)
    table = table[table.temperature_C <= 25.0]
    used = table[table.used_in_fit == "yes"]
    t_used = used.temperature_C.to_numpy() + 273.15
    need = np.array([(ln_iap_bischofite(m, T) - ln_k(BISCHOFITE, T)) / np.log(10.0)
                     for m, T in zip(used.molality_mol_per_kg, t_used)])
    design = np.column_stack([np.ones_like(t_used), t_used - TR])
    (c0, c1), *_ = np.linalg.lstsq(design, need, rcond=None)
    shift = [c0 - c1 * TR, c1, 0.0, 0.0, 0.0, 0.0]
    print(f"\nbischofite: c0 = {c0:+.6f}, c1 = {c1:+.4e} /K; A1..A6 += "
          + ", ".join(f"{v:.10g}" for v in shift))
    for _, r in table.iterrows():
        T = r.temperature_C + 273.15
        ln_k_t = ln_k(BISCHOFITE, T) + ln_k(shift, T)
        m = brentq(lambda x: ln_iap_bischofite(x, T) - ln_k_t, 4.0, 7.5)
        print(f"  {r.temperature_C:5.1f} C: model {m:.4f}, table {r.molality_mol_per_kg:.4f} mol/kg "
              f"({m - r.molality_mol_per_kg:+.4f}; used_in_fit {r.used_in_fit})")


def main() -> None:
    rows = {salt: fit(salt) for salt in SALTS}
    fit_mgcl2()
    for salt in SULFATES:
        fit_sulfate(salt)
    for salt in HYDRATES:
        solubility_shift(salt, rows[salt])
    halite_shift()
    bischofite_shift()


if __name__ == "__main__":
    main()
