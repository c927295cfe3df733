"""Benchmarks of the Pitzer path, measured side by side in one run.

Run: python3 bench/bench_electrolytes.py [--rows 200000] [--compositions 300]
Prints costs, ratios against peers measured in the same run, and PASS/FAIL against the
targets. Timing belongs here, never in unit tests.

(a) Seawater freezing point: the batch kernel on ``cg.SolutionBatch`` rows of seawater
    (``Solution.seawater`` composition, SA 5-40 g/kg, 2 threads) against TEOS-10 as
    implemented by the gsw package, ``gsw.t_freezing(SA, 0, 0)``, on the same salinities.
    Target: cost per point within 3x of gsw's.
(b) Osmotic coefficient of a seawater-like mixture: ``cg.osmotic_coefficient(s, T,
    model="pitzer")`` per composition against the same Pitzer equations written with NumPy
    below (vectorised over ions, pairs and triplets, called once per composition), with
    the rows of the default set "harvie_spencer_icefit" (cpp/include/colligate/data/
    pitzer_parameters.hpp) typed in.
    Target: at least 30x faster per composition, agreeing to about 1e-12 relative.
(c) Salt + sugar freezing point (informational, no target): the batch kernel on NaCl +
    sucrose rows (sucrose 5-30 wt%, NaCl 0.5-5 wt%; 'auto' resolves to the Ross rule, whose
    check compares it with the ZSR rule once per row), 1 and 2 threads, and its cost
    against the seawater Pitzer freezing point of (a) measured in the same run.
"""
from __future__ import annotations

import argparse
import os
import sys
import warnings

import numpy as np
import pandas as pd

import colligate as cg
from _timing import best_of  # bench/_timing.py (run as python3 bench/<file>.py)

warnings.simplefilter("ignore", cg.OutOfValidityRangeWarning)
warnings.simplefilter("ignore", cg.BatchRowWarning)




# --- (b) the Pitzer osmotic coefficient in NumPy, as an analyst would write it -----------
# Harvie, Moller & Weare (1984) eqs. 1-8 with the unsymmetrical E-theta of Pitzer (1975) and
# Harvie's Chebyshev J(x) (Pitzer 1991, Appendix B); parameters P(T) = a . basis(T) in the
# analytic form of data/pitzer_parameters.hpp; A_phi of Spencer, Moller & Weare (1990).
IONS = ["Na+", "K+", "Ca+2", "Mg+2", "Cl-", "SO4-2"]
Z = np.array([1.0, 1.0, 2.0, 2.0, -1.0, -2.0])
IX = {n: i for i, n in enumerate(IONS)}
TR = 298.15
# harvie_spencer_icefit rows (spencer_1990 with the NaCl row of tools/fit_brine_ice_line.py and
# the CaCl2 and MgCl2 rows of tools/fit_default_set.py): cation, anion, (beta0, beta1, beta2,
# C-phi) coefficients a0..a5
BINARY = [
    ("Na+", "Cl-", [[0.076276, -886.777, -4.19728, 0.007239381384, -2.950224994e-06, 8942.9], [0.280431, -8677.858, -94.69966, 0.2944375, -0.000147476, -191956.0], [0] * 6, [0.001271, 52.6, 0.07951, 0.00031974, -3.195e-07, -1237.7]]),
    ("K+", "Cl-", [[0.048342, -758.497, -4.69717, 0.01003107, -3.7342e-06, 64.0], [0.210434, -14898.951, -173.19076, 0.55331238, -0.000283943, -412199.8], [0] * 6, [-0.000839, 91.27, 0.58481, -0.00129068, 4.911e-07, -11.4]]),
    ("Ca+2", "Cl-", [[0.3159, 2659.464537, 11.94793, 0.02187907678, -5.362148179e-05, -3394.2], [1.614, -55025.605, 0.0, -2.280400307, 0.002792107656, 0.0], [0] * 6, [-0.00034, 17.31607082, -0.64691, 9.150924018e-05, 2.063734344e-06, -12466.4]]),
    ("Mg+2", "Cl-", [[0.35235, -424.5691653, -17.65506, 0.06909479137, -4.029757902e-05, -117885.0], [1.6815, -73066.74366, 1302.23382, -7.03754026, 0.004834865342, 13522889.4], [0] * 6, [0.00519, -72.64403162, 0.0, -0.003382309736, 4.124335737e-06, 0.0]]),
    ("Na+", "SO4-2", [[0.038071, -26.946, -0.36262, 0.00595978, -1.6429e-06, 945.0], [1.035408, -106.397, -1.89717, 0.01819155, -8.1292e-06, 4580.4], [0] * 6, [-0.002331, -0.711, -0.04568, -0.00053454, -2.014e-07, 116.1]]),
    ("K+", "SO4-2", [[0.003795, 22.492, 0.2029, 0.00165088, 9.746e-07, -540.7], [1.052416, 767.611, 6.36874, -0.03159629, 2.98397e-05, -16995.7], [0] * 6, [0.014845, 6.792, 0.12817, -0.00049111, 5.849e-07, -332.0]]),
    ("Mg+2", "SO4-2", [[0.126545, 470.866, 6.08307, -0.03139609, 2.82462e-05, -15937.6], [3.491512, 2603.294, 34.29203, -0.13991327, 0.000161578, -90018.9], [-6.243985, 245008.193, 1276.67549, -6.82364722, 0.007402746, -3561447.4], [0.05291, -6.004, -0.43928, 0.00120236, -1.9372e-06, 1116.1]]),
    ("Ca+2", "SO4-2", [[0.115384, 145.327, 2.57051, -0.01120842, 1.68444e-05, -6826.8], [3.56045, -6591.464, -37.68237, 0.17530628, -0.000174047, 103372.0], [-61.685514, 21440.768, 133.72156, -0.59337506, 0.000399407, -359056.7], [0.039751, 70.752, 0.59046, -0.00274756, 3.6688e-06, -1597.7]]),
]
THETA = [
    ("Na+", "K+", [-0.00948, 612.415, 3.02995, -0.00369038, 0.0, 0.0]),
    ("Na+", "Ca+2", [0.048535, 39.673, 0.36653, -0.00159002, 1.6783e-06, -967.4]),
    ("Na+", "Mg+2", [0.07, 0, 0, 0, 0, 0]),
    ("K+", "Ca+2", [0.056416, -284.94, 0.0, -0.00454, 0.0, 0.0]),
    ("K+", "Mg+2", [0.1167, 0, 0, 0, 0, 0]),
    ("Ca+2", "Mg+2", [0.124367, -983.114, 0.0, -0.00634242, 0.0, 0.0]),
    ("Cl-", "SO4-2", [0.045973, -35.626, -0.29988, 0.00128989, -1.378e-06, 794.3]),
]
PSI = [
    ("Na+", "K+", "Cl-", [-0.002539, -204.354, -1.09448, 0.00146803, 0.0, 0.0]),
    ("Na+", "Ca+2", "Cl-", [-0.003297, 0.0, 1.8475, -0.01299, 1.106e-05, 0.0]),
    ("Na+", "Mg+2", "Cl-", [-0.008172, 1.994, 0.0, 5.446e-05, 0.0, 0.0]),
    ("K+", "Ca+2", "Cl-", [-0.028561, -13.439, 0.0, 0.00025428, 0.0, 0.0]),
    ("K+", "Mg+2", "Cl-", [-0.049483, -28.991, 0.0, -8.75e-06, 0.0, 0.0]),
    ("Ca+2", "Mg+2", "Cl-", [-0.02381, -981.659, -7.4062, 0.01303773, 0.0, 0.0]),
    ("Na+", "K+", "SO4-2", [0.003969, -1192.758, -7.92204, 0.03628726, -3.72313e-05, 21474.2]),
    ("Na+", "Ca+2", "SO4-2", [-0.073409, -7353.945, -53.26546, 0.23794424, -0.00024367, 143653.4]),
    ("Na+", "Mg+2", "SO4-2", [-0.009911, -36.718, -0.15613, 0.00124948, -1.3145e-06, 447.0]),
    ("K+", "Ca+2", "SO4-2", [-0.028561, -13.439, 0.0, 0.00025428, 0.0, 0.0]),
    ("K+", "Mg+2", "SO4-2", [-0.124362, -8.156, -0.36908, 0.00150172, -1.9823e-06, 954.2]),
    ("Ca+2", "Mg+2", "SO4-2", [0.024, 0, 0, 0, 0, 0]),
    ("Cl-", "SO4-2", "Na+", [-0.001451, 12.605, 0.1146, -0.00056411, 5.28e-07, -309.6]),
    ("Cl-", "SO4-2", "K+", [-0.003829, -9.341, -0.12911, 0.00036001, -6.009e-07, 334.0]),
    ("Cl-", "SO4-2", "Ca+2", [-0.054444, -27.382, -0.49859, 0.00202214, -2.5738e-06, 1303.4]),
    ("Cl-", "SO4-2", "Mg+2", [-0.01833, -21.244, 0.02933, -0.00019719, 1.618e-07, -66.2]),
]
B_C = np.array([IX[c] for c, _, _ in BINARY])
B_A = np.array([IX[a] for _, a, _ in BINARY])
B_COEF = np.array([p for _, _, p in BINARY])  # (pairs, 4, 6)
B_22 = (np.abs(Z[B_C]) == 2) & (np.abs(Z[B_A]) == 2)
B_ALPHA1 = np.where(B_22, 1.4, 2.0)
B_CSCALE = 2.0 * np.sqrt(np.abs(Z[B_C] * Z[B_A]))
T_I = np.array([IX[i] for i, _, _ in THETA])
T_J = np.array([IX[j] for _, j, _ in THETA])
T_COEF = np.array([p for _, _, p in THETA])
T_UNSYM = Z[T_I] != Z[T_J]
P_I = np.array([IX[i] for i, _, _, _ in PSI])
P_J = np.array([IX[j] for _, j, _, _ in PSI])
P_K = np.array([IX[k] for _, _, k, _ in PSI])
P_COEF = np.array([p for _, _, _, p in PSI])
# Harvie's Chebyshev coefficients for J(x), x < 1 and x >= 1 (Pitzer 1991, Table B-1)
AK = np.array([
    [1.925154014814667, -0.060076477753119, -0.029779077456514, -0.007299499690937, 0.000388260636404,
     0.000636874599598, 0.000036583601823, -0.000045036975204, -0.000004537895710, 0.000002937706971,
     0.000000396566462, -0.000000202099617, -0.000000025267769, 0.000000013522610, 0.000000001229405,
     -0.000000000821969, -0.000000000050847, 0.000000000046333, 0.000000000001943, -0.000000000002563,
     -0.000000000010991],
    [0.628023320520852, 0.462762985338493, 0.150044637187895, -0.028796057604906, -0.036552745910311,
     -0.001668087945272, 0.006519840398744, 0.001130378079086, -0.000887171310131, -0.000242107641309,
     0.000087294451594, 0.000034682122751, -0.000004583768938, -0.000003548684306, -0.000000250453880,
     0.000000216991779, 0.000000080779570, 0.000000004558555, -0.000000006944757, -0.000000002849257,
     0.000000000237816]])


def numpy_j(x):
    """J(x) and dJ/dx, vectorised (Harvie's Clenshaw recurrence)."""
    low = x < 1.0
    z = np.where(low, 4.0 * x**0.2 - 2.0, 40.0 / 9.0 * x**-0.1 - 22.0 / 9.0)
    dz = np.where(low, 0.8 * x**-0.8, -4.0 / 9.0 * x**-1.1)
    ak = AK[np.where(low, 0, 1)]  # (n, 21)
    b0 = b1 = b2 = d0 = d1 = d2 = np.zeros_like(x)
    for k in range(20, -1, -1):
        b2, b1 = b1, b0
        d2, d1 = d1, d0
        b0 = z * b1 - b2 + ak[:, k]
        d0 = b1 + z * d1 - d2
    return 0.25 * x - 1.0 + 0.5 * (b0 - b2), 0.25 + 0.5 * dz * (d0 - d2)


def numpy_osmotic_coefficient(m, T):
    """Pitzer osmotic coefficient of ion molalities m (mol/kg, order IONS) at T (K)."""
    basis = np.array([1.0, 1.0 / T - 1.0 / TR, np.log(T / TR), T - TR, T * T - TR * TR,
                      1.0 / (T * T) - 1.0 / (TR * TR)])
    aphi = (86.6836498 + 8.48795942e-2 * T - 8.88785150e-5 * T**2 + 4.88096393e-8 * T**3
            - 1327.31477 / T - 17.6460172 * np.log(T))
    I = 0.5 * np.sum(m * Z * Z)
    Zs = np.sum(m * np.abs(Z))
    sI = np.sqrt(I)
    b0, b1, b2, cphi = np.moveaxis(B_COEF @ basis, 1, 0)
    bphi = b0 + b1 * np.exp(-B_ALPHA1 * sI) + np.where(B_22, b2 * np.exp(-12.0 * sI), 0.0)
    osm = -aphi * I * sI / (1.0 + 1.2 * sI) + np.sum(m[B_C] * m[B_A] * (bphi + Zs * cphi / B_CSCALE))
    zi, zj = np.abs(Z[T_I]), np.abs(Z[T_J])
    s6 = 6.0 * aphi * sI
    x = np.concatenate([s6 * zi * zj, s6 * zi * zi, s6 * zj * zj])
    J, dJ = numpy_j(x)
    n = len(zi)
    Jij, Jii, Jjj = J[:n], J[n:2 * n], J[2 * n:]
    xdJ = x * dJ
    et = zi * zj / (4.0 * I) * (Jij - 0.5 * Jii - 0.5 * Jjj)
    etp = -et / I + zi * zj / (8.0 * I * I) * (xdJ[:n] - 0.5 * xdJ[n:2 * n] - 0.5 * xdJ[2 * n:])
    phiphi = T_COEF @ basis + np.where(T_UNSYM, et + I * etp, 0.0)
    osm += np.sum(m[T_I] * m[T_J] * phiphi)
    osm += np.sum(m[P_I] * m[P_J] * m[P_K] * (P_COEF @ basis))
    return 1.0 + 2.0 * osm / np.sum(m)


SALT_IONS = {"sodium_chloride": {"Na+": 1, "Cl-": 1}, "potassium_chloride": {"K+": 1, "Cl-": 1},
             "calcium_chloride": {"Ca+2": 1, "Cl-": 2}, "magnesium_chloride": {"Mg+2": 1, "Cl-": 2},
             "sodium_sulfate": {"Na+": 2, "SO4-2": 1}}


def ion_molalities(s) -> np.ndarray:
    m = np.zeros(len(IONS))
    for salt, molality in s.molalities().items():
        for ion, count in SALT_IONS[salt].items():
            m[IX[ion]] += count * molality
    return m


def main() -> int:
    ap = argparse.ArgumentParser()
    ap.add_argument("--rows", type=int, default=200_000)
    ap.add_argument("--compositions", type=int, default=300)
    ap.add_argument("--mixture-rows", type=int, default=20_000)
    args = ap.parse_args()
    import gsw

    ok = True
    print(f"colligate {cg.__version__}; gsw {gsw.__version__}; {os.cpu_count()} cores")

    # (a) seawater freezing point, batch kernel vs gsw.t_freezing
    SA = np.linspace(5.0, 40.0, args.rows)
    ref = cg.Solution.seawater(35.0).molalities()  # molality is proportional to SA / (1000 - SA)
    scale = (SA / (1000.0 - SA)) / (35.0 / 965.0)
    df = pd.DataFrame({name: m * scale for name, m in ref.items()})
    batch = cg.SolutionBatch.from_molalities(df)
    t_ours = best_of(lambda: cg.batch_freezing_point(batch, model="pitzer", threads=2))
    t_ours1 = best_of(lambda: cg.batch_freezing_point(batch, model="pitzer", threads=1), repeat=1)
    t_gsw = best_of(lambda: gsw.t_freezing(SA, 0, 0))
    ours = cg.batch_freezing_point(batch, model="pitzer", threads=2).to_numpy()
    diff = np.max(np.abs((ours - 273.15) - gsw.t_freezing(SA, 0, 0)))
    per_ours, per_gsw = t_ours / args.rows, t_gsw / args.rows
    ratio = per_ours / per_gsw
    print(f"[seawater freezing point] {args.rows} rows SA 5-40 g/kg: Pitzer batch 2 threads "
          f"{per_ours * 1e6:.3f} us/point (1 thread {t_ours1 / args.rows * 1e6:.3f}), gsw.t_freezing "
          f"{per_gsw * 1e6:.3f} us/point: {ratio:.2f}x gsw's cost (target <= 3x): "
          f"{'PASS' if ratio <= 3.0 else 'FAIL'}; max |difference| {diff:.4f} K")
    ok &= ratio <= 3.0

    # (b) osmotic coefficient per composition, colligate vs the NumPy implementation above
    T = 271.15
    sols = [cg.Solution.seawater(sa) for sa in np.linspace(5.0, 40.0, args.compositions)]
    ions = [ion_molalities(s) for s in sols]
    t_cg = best_of(lambda: [cg.osmotic_coefficient(s, T, model="pitzer") for s in sols])
    t_np = best_of(lambda: [numpy_osmotic_coefficient(m, T) for m in ions])
    ours = np.array([cg.osmotic_coefficient(s, T, model="pitzer") for s in sols])
    theirs = np.array([numpy_osmotic_coefficient(m, T) for m in ions])
    rel = np.max(np.abs(ours - theirs) / np.abs(theirs))
    speed = t_np / t_cg
    print(f"[osmotic coefficient] {args.compositions} seawater compositions at {T} K: colligate "
          f"{t_cg / len(sols) * 1e6:.2f} us, NumPy {t_np / len(sols) * 1e6:.1f} us per composition: "
          f"{speed:.0f}x (target >= 30x): {'PASS' if speed >= 30 else 'FAIL'}; max |difference| "
          f"{np.max(np.abs(ours - theirs)):.1e} (relative {rel:.1e}, target <= 1e-12): "
          f"{'PASS' if rel <= 1e-12 else 'FAIL'}")
    ok &= speed >= 30 and rel <= 1e-12

    # (c) NaCl + sucrose freezing point (Ross rule), informational
    n = args.mixture_rows
    k = np.arange(n)
    mix = cg.SolutionBatch.from_mass_fractions(pd.DataFrame({
        "sucrose": 0.05 + 0.25 * (k % 101) / 100.0,
        "NaCl": 0.005 + 0.045 * (k % 37) / 36.0,
    }))
    t_mix2 = best_of(lambda: cg.batch_freezing_point(mix, threads=2))
    t_mix1 = best_of(lambda: cg.batch_freezing_point(mix, threads=1), repeat=1)
    per_mix = t_mix2 / n
    print(f"[NaCl + sucrose freezing point] {n} rows, sucrose 5-30 wt%, NaCl 0.5-5 wt%, 'auto' "
          f"(Ross rule): batch 2 threads {per_mix * 1e6:.3f} us/point (1 thread "
          f"{t_mix1 / n * 1e6:.3f}), {per_mix / per_ours:.1f}x the seawater Pitzer cost above "
          f"(informational, no target)")
    print("ALL PASS" if ok else "SOME TARGETS MISSED")
    return 0 if ok else 1


if __name__ == "__main__":
    sys.exit(main())
