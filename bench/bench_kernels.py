"""The batch kernels against references measured in the same run, in one table.

Run:
    python3 bench/bench_kernels.py [--rows 200000] [--baseline SITE] [--pairs 3]

For each kernel (six-solute Norrish freezing point; Norrish ice fraction at 263.15 K;
seawater freezing point through Pitzer; NaCl + sucrose freezing point through the Ross
rule) the table gives: ns per point on one thread (prebuilt batch), the speed-up on 2
threads, the ns per point of a vectorised NumPy implementation of the same equations
(Norrish kernels), of a scipy.optimize.brentq loop in plain Python over the same equations
(the Pitzer ones typed in NumPy in bench_electrolytes.py), and of gsw.t_freezing (TEOS-10)
on the same salinities (seawater), each measured here with the largest difference from
colligate's values, and, with --baseline SITE (a folder holding another build, e.g.
`pip install --no-build-isolation --no-deps --target SITE <older checkout>`), that
build's figures measured in the same run: each build is timed in a fresh interpreter,
alternating, `--pairs` times, best kept. Then the peak memory of a 1e7-row streamed sweep
(bench/bench_sweeps.py --child). The load average is printed before and after: other
work on the machine slows every column alike, the ratios less than the absolute figures.
One-thread figures are given as CPU time of the process (with wall time beside them): on a
shared machine that is the cost per core, and the targets are judged on it.
Solutions: random six-solute sugar / polyol / acid formulations, seawater of SA 5-40 g/kg
and NaCl + sucrose mixtures, invented sweeps (not product data). Timing lives in bench/
only.
"""
from __future__ import annotations

import argparse
import json
import math
import os
import subprocess
import sys
import time
import warnings

import numpy as np

HERE = os.path.dirname(os.path.abspath(__file__))
SPECIES = ["sucrose", "glucose", "fructose", "lactose", "glycerol", "citric_acid"]
T_ICE = 263.15  # K, the ice-fraction temperature
KERNELS = ("freezing point", "ice fraction", "seawater", "seawater line", "ross")
LABELS = {"freezing point": "Norrish six-solute freezing point",
          "ice fraction": f"Norrish ice fraction at {T_ICE} K",
          "seawater": "seawater freezing point (Pitzer), SA 5-40 g/kg: general kernel, rows of molalities",
          "seawater line": "seawater freezing point (Pitzer) by SA, 5-40 g/kg: cg.seawater_freezing_point",
          "ross": "NaCl + sucrose freezing point (Ross rule)"}
# text, largest ns per point, smallest 2-thread speed-up
TARGETS = {"freezing point": ("<= 120 ns, >= 1.8x on 2 threads", 120.0, 1.8),
           "ice fraction": ("<= 250 ns", 250.0, None),
           "seawater": ("any brine, informational (the seawater target is judged on the row below)", None, None),
           "seawater line": ("<= 1.0x gsw.t_freezing, within 0.003 K", None, None),
           "ross": ("<= 2000 ns", 2000.0, None)}
SEAWATER_TOLERANCE = 0.003  # K, against gsw.t_freezing (issue target)


def sweep(n: int, seed: int = 0) -> np.ndarray:
    """Mass fractions, n x 6, each solute 0-5 wt% (invented sweep)."""
    return np.random.default_rng(seed).uniform(0.0, 0.05, (n, len(SPECIES)))


def seawater_salinities(n: int) -> np.ndarray:
    """Absolute salinities, g/kg (invented sweep)."""
    return np.linspace(5.0, 40.0, n)


def seawater_batch(cg, pd, SA):
    """Seawater rows as molalities: Solution.seawater's composition scaled with SA."""
    ref = cg.Solution.seawater(35.0).molalities()  # molality is proportional to SA / (1000 - SA)
    scale = (SA / (1000.0 - SA)) / (35.0 / 965.0)
    return cg.SolutionBatch.from_molalities(pd.DataFrame({k: m * scale for k, m in ref.items()}))


def mixture_fractions(n: int) -> np.ndarray:
    """NaCl + sucrose mass fractions (n x 2): sucrose 5-30 wt%, NaCl 0.5-5 wt% (invented)."""
    k = np.arange(n)
    return np.column_stack([0.05 + 0.25 * (k % 101) / 100.0, 0.005 + 0.045 * (k % 37) / 36.0])


def best_of(fn, repeat: int = 3) -> float:
    sys.path.insert(0, HERE)
    from _timing import best_of as b  # bench/_timing.py
    return b(fn, repeat)


def best_of_cpu(fn, repeat: int = 3) -> tuple[float, float]:
    """(wall, CPU time of this thread), each the smallest of `repeat` calls, seconds."""
    sys.path.insert(0, HERE)
    from _timing import best_of_cpu as b  # bench/_timing.py
    return b(fn, repeat)


# --- colligate timings (run in a child interpreter per build) ---------------------------

def measure(rows: int) -> dict:
    import pandas as pd
    import colligate as cg
    warnings.simplefilter("ignore")
    x = sweep(rows)
    b = cg.SolutionBatch.from_mass_fractions(pd.DataFrame(x, columns=SPECIES))
    SA = seawater_salinities(rows)
    sw = seawater_batch(cg, pd, SA)
    mix_rows = max(rows // 10, 1)
    mix = cg.SolutionBatch.from_mass_fractions(pd.DataFrame(mixture_fractions(mix_rows),
                                                            columns=["sucrose", "NaCl"]))
    out = {}
    for name, fn, n in (
            ("freezing point", lambda th: cg.batch_freezing_point(b, "norrish", threads=th), rows),
            ("ice fraction", lambda th: cg.batch_ice_fraction(b, T_ICE, "norrish", threads=th), rows),
            ("seawater", lambda th: cg.batch_freezing_point(sw, "pitzer", threads=th), rows),
            ("seawater line", lambda th: cg.seawater_freezing_point(SA, threads=th), rows),
            ("ross", lambda th: cg.batch_freezing_point(mix, "ross", threads=th), mix_rows)):
        if name == "seawater line" and not hasattr(cg, "seawater_freezing_point"):
            continue  # a build before it
        fn(1)  # warm up (tables, pages; the seawater line is built on first use)
        wall1, cpu1 = best_of_cpu(lambda: fn(1), 5)  # one thread: one core's work at a time
        out[name] = {"ns1": wall1 / n * 1e9, "cpu1": cpu1 / n * 1e9,
                     "ns2": best_of(lambda: fn(2), 5) / n * 1e9}
    return out


def run_child(pythonpath: str | None, rows: int) -> dict:
    env = dict(os.environ)
    if pythonpath:
        env["PYTHONPATH"] = pythonpath + os.pathsep + env.get("PYTHONPATH", "")
    # outside the source tree, so the installed package (not ./python) is imported
    r = subprocess.run([sys.executable, os.path.join(HERE, "bench_kernels.py"), "--measure", str(rows)],
                       env=env, cwd="/", capture_output=True, text=True, check=True)
    return json.loads(r.stdout.strip().splitlines()[-1])


# --- references: the same equations in NumPy (vectorised) and a brentq loop ------------

R, MW, T0, H0 = 8.314462618, 0.018015268, 273.15, 6007.0
CP = [38.25, -0.1571134, -0.01728863, -0.00096686]  # dCp polynomial in T - T0 (water/ice.hpp)


def _power_coefficients():
    b = [H0, CP[0], CP[1] / 2, CP[2] / 3, CP[3] / 4]  # dH_fus as a polynomial in d = T - T0
    a = [0.0] * 5
    for n in range(5):
        for j in range(n + 1):
            a[j] += b[n] * math.comb(n, j) * (-T0) ** (n - j)
    return a


A = _power_coefficients()


def _antiderivative(t):
    return -A[0] / t + A[1] * np.log(t) + A[2] * t + A[3] * t * t / 2 + A[4] * t ** 3 / 3


def ln_aw_ice(T):
    """ln a_w of water in equilibrium with ice (integral of dH_fus / (R t^2) from T0)."""
    return (_antiderivative(T) - _antiderivative(T0)) / R


def dh_fus(T):
    d = T - T0
    return H0 + d * (CP[0] + d * (CP[1] / 2 + d * (CP[2] / 3 + d * CP[3] / 4)))


class NorrishRef:
    """Norrish (1966) with the Chirife et al. (1980) sum, cubic and quartic terms, for the
    six solutes (each one particle, volume ratio 1), with d ln a_w / d n_w in closed form."""

    def __init__(self, table):
        self.M = np.array([table.loc[s, "molar_mass_kg_per_mol"] for s in SPECIES], float)
        self.K = np.array([table.loc[s, "norrish_k"] for s in SPECIES], float)
        self.K3 = np.array([table.loc[s, "norrish_k3"] for s in SPECIES], float)
        self.K4 = np.array([table.loc[s, "norrish_k4"] for s in SPECIES], float)
        assert np.all(np.array([table.loc[s, "norrish_volume_ratio"] for s in SPECIES]) == 1.0)
        self.sqrtK = np.sqrt(np.clip(self.K, 0.0, None))
        self.Kneg = np.where(self.K > 0, 0.0, self.K)

    def ln_aw(self, moles, nw):
        """moles: (n, 6) mol; nw: (n,) mol of water. Returns ln a_w and d ln a_w / d n_w."""
        P = moles.sum(axis=-1)
        n = nw + P
        x = moles / n[..., None]
        S = x @ self.sqrtK
        g = self.Kneg * x * x + x ** 3 * (self.K3 + self.K4 * x)
        dg = 2 * self.Kneg * x * x + x ** 3 * (3 * self.K3 + 4 * self.K4 * x)
        lnaw = -np.log1p(P / nw) - S * S - g.sum(axis=-1)
        slope = P / (nw * n) + (2 * S * S + dg.sum(axis=-1)) / n
        return lnaw, slope

    def scalar_ln_aw(self, moles, nw):
        P = sum(moles)
        n = nw + P
        x = [m / n for m in moles]
        S = sum(k * xi for k, xi in zip(self.sqrtK, x))
        g = sum(kn * xi * xi + xi ** 3 * (k3 + k4 * xi) for kn, k3, k4, xi in zip(self.Kneg, self.K3, self.K4, x))
        return -math.log1p(P / nw) - S * S - g


def moles_and_water(x, M):
    """Per kg of solution: solute moles (n, 6) and water moles (n,)."""
    return x / M, (1.0 - x.sum(axis=1)) / MW


def numpy_freezing_point(ref, moles, nw):
    y, _ = ref.ln_aw(moles, nw)
    T = T0 + y * R * T0 * T0 / H0
    for _ in range(5):  # Newton on the ice line; quadratic from the linearised start
        T = T - (ln_aw_ice(T) - y) / (dh_fus(T) / (R * T * T))
    return T


def numpy_ice_fraction(ref, moles, nw, T):
    L = ln_aw_ice(T)
    y0, _ = ref.ln_aw(moles, nw)
    frozen = y0 > L
    u = np.log(nw)
    for _ in range(8):  # Newton on h(u) = ln(-ln a_w(e^u)) - ln(-L), u = ln n_w,unfrozen
        w = np.exp(u)
        y, s = ref.ln_aw(moles, w)
        u = u - (np.log(-y) - np.log(-L)) / (w * s / y)
    return np.where(frozen, 1.0 - np.exp(u) / nw, 0.0)


def brentq_freezing_point(ref, moles, nw):
    from scipy.optimize import brentq
    y = ref.scalar_ln_aw(moles, nw)
    return brentq(lambda T: float(ln_aw_ice(T)) - y, 223.15, T0, xtol=1e-12)


def brentq_ice_fraction(ref, moles, nw, T):
    from scipy.optimize import brentq
    L = float(ln_aw_ice(T))
    if not ref.scalar_ln_aw(moles, nw) > L:
        return 0.0
    w = brentq(lambda v: ref.scalar_ln_aw(moles, v) - L, 1e-6 * nw, nw, xtol=1e-12 * nw)
    return 1.0 - w / nw


# --- Pitzer and Ross references: a brentq loop over the NumPy Pitzer equations -----------

def _pitzer_numpy():
    sys.path.insert(0, HERE)
    import bench_electrolytes as be  # the Pitzer equations typed in NumPy (same parameter rows)
    return be


def brentq_pitzer_freezing_point(be, m_ions, other_ln_aw=lambda: 0.0):
    """Freezing point of ion molalities m_ions (order be.IONS): ln a_w = -M_w sum(m) phi
    (+ the ln a_w of other solutes in the same water, Ross rule) on the ice line."""
    from scipy.optimize import brentq
    mt = float(np.sum(m_ions))
    extra = other_ln_aw()
    return brentq(lambda T: -MW * mt * be.numpy_osmotic_coefficient(m_ions, T) + extra
                  - float(ln_aw_ice(T)), 240.0, T0 - 1e-9, xtol=1e-12)


def sucrose_ln_aw(table, sucrose_mol, water_mol):
    """Norrish ln a_w of sucrose alone (constants from colligate.solutes())."""
    k, k3, k4 = (float(table.loc["sucrose", c]) for c in ("norrish_k", "norrish_k3", "norrish_k4"))
    x = sucrose_mol / (water_mol + sucrose_mol)
    return -math.log1p(sucrose_mol / water_mol) - k * x * x - x ** 3 * (k3 + k4 * x)


# --- the table -----------------------------------------------------------------------

def main() -> int:
    ap = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    ap.add_argument("--rows", type=int, default=200_000)
    ap.add_argument("--loop-rows", type=int, default=2000)
    ap.add_argument("--pitzer-loop-rows", type=int, default=100)
    ap.add_argument("--stream-rows", type=int, default=10_000_000)
    ap.add_argument("--baseline", help="site folder holding the build to compare with")
    ap.add_argument("--pairs", type=int, default=3)
    ap.add_argument("--measure", type=int, help=argparse.SUPPRESS)
    args = ap.parse_args()
    if args.measure:
        print(json.dumps(measure(args.measure)))
        return 0

    import pandas as pd
    import colligate as cg
    warnings.simplefilter("ignore")
    load0 = os.getloadavg()
    print(f"colligate {cg.__version__}; {os.cpu_count()} cores; {args.rows} rows a kernel ("
          f"{max(args.rows // 10, 1)} NaCl + sucrose rows; invented sweeps); load average {load0[0]:.2f} {load0[1]:.2f} {load0[2]:.2f}")

    cur: dict = {}
    base: dict = {}
    for _ in range(args.pairs):
        for store, path in ((base, args.baseline), (cur, None)):
            if store is base and not args.baseline:
                continue
            for k, v in run_child(path, args.rows).items():
                d = store.setdefault(k, {"ns1": math.inf, "cpu1": math.inf, "ns2": math.inf})
                for col in d:
                    d[col] = min(d[col], v.get(col, math.inf))

    table = cg.solutes()
    ref = NorrishRef(table)
    x = sweep(args.rows)
    moles, nw = moles_and_water(x, ref.M)
    b = cg.SolutionBatch.from_mass_fractions(pd.DataFrame(x, columns=SPECIES))
    SA = seawater_salinities(args.rows)
    sw = seawater_batch(cg, pd, SA)
    mix_x = mixture_fractions(max(args.rows // 10, 1))
    mix = cg.SolutionBatch.from_mass_fractions(pd.DataFrame(mix_x, columns=["sucrose", "NaCl"]))
    ours = {"freezing point": cg.batch_freezing_point(b, "norrish").to_numpy(),
            "ice fraction": cg.batch_ice_fraction(b, T_ICE, "norrish").to_numpy(),
            "seawater": cg.batch_freezing_point(sw, "pitzer").to_numpy(),
            "seawater line": cg.seawater_freezing_point(SA),
            "ross": cg.batch_freezing_point(mix, "ross").to_numpy()}
    numpy_fn = {"freezing point": lambda: numpy_freezing_point(ref, moles, nw),
                "ice fraction": lambda: numpy_ice_fraction(ref, moles, nw, T_ICE)}
    k = args.loop_rows
    be = _pitzer_numpy()
    kp = args.pitzer_loop_rows
    sw_ions = be.ion_molalities(cg.Solution.seawater(35.0))
    sw_scale = (SA / (1000.0 - SA)) / (35.0 / 965.0)
    pick_sw = np.linspace(0, args.rows - 1, kp).astype(int)
    pick_mix = np.linspace(0, len(mix_x) - 1, kp).astype(int)
    m_suc, m_nacl = (float(table.loc[c, "molar_mass_kg_per_mol"]) for c in ("sucrose", "sodium_chloride"))

    def ross_loop():
        out = []
        for i in pick_mix:
            w_suc, w_salt = mix_x[i]
            water = 1.0 - w_suc - w_salt
            m = w_salt / m_nacl / water
            ions = np.zeros(len(be.IONS))
            ions[be.IX["Na+"]] = ions[be.IX["Cl-"]] = m
            out.append(brentq_pitzer_freezing_point(
                be, ions, lambda: sucrose_ln_aw(table, w_suc / m_suc, water / MW)))
        return out

    loop_fn = {"freezing point": lambda: [brentq_freezing_point(ref, moles[i], nw[i]) for i in range(k)],
               "ice fraction": lambda: [brentq_ice_fraction(ref, moles[i], nw[i], T_ICE) for i in range(k)],
               "seawater": lambda: [brentq_pitzer_freezing_point(be, sw_ions * sw_scale[i]) for i in pick_sw],
               "ross": ross_loop}
    loop_fn["seawater line"] = loop_fn["seawater"]
    loop_rows = {"freezing point": np.arange(k), "ice fraction": np.arange(k), "seawater": pick_sw,
                 "seawater line": pick_sw, "ross": pick_mix}
    import gsw
    t_gsw, c_gsw = (x / args.rows * 1e9 for x in best_of_cpu(lambda: gsw.t_freezing(SA, 0, 0), 5))
    d_gsw = {name: np.nanmax(np.abs(ours[name] - (T0 + gsw.t_freezing(SA, 0, 0))))
             for name in ("seawater", "seawater line")}

    rows = []
    ok = True
    for name in KERNELS:
        c = cur[name]
        cell_np = "not written"
        if name in numpy_fn:
            t_np, c_np = (x / args.rows * 1e9 for x in best_of_cpu(numpy_fn[name], 3))
            d_np = np.nanmax(np.abs(numpy_fn[name]() - ours[name]))
            cell_np = f"{c_np:.0f} ({c_np / c['cpu1']:.1f}x; {d_np:.0e})"
        n_loop = len(loop_rows[name])
        t_loop = best_of_cpu(loop_fn[name], 1)[1] / n_loop * 1e9
        d_loop = np.nanmax(np.abs(np.array(loop_fn[name]()) - ours[name][loop_rows[name]]))
        target, max_ns, min_speedup = TARGETS[name]
        speedup = c["ns1"] / c["ns2"]
        if name in ("seawater", "seawater line"):
            # the general kernel on rows of molalities is informational; the target is judged
            # on the salinity path (the same model, read from its freezing line)
            met = name == "seawater" or (c["cpu1"] <= c_gsw and d_gsw[name] <= SEAWATER_TOLERANCE)
            cell_peer = (f"gsw {c_gsw:.0f} ({t_gsw:.0f}) ns (ours {c['cpu1'] / c_gsw:.2f}x its CPU "
                         f"cost, {c['ns1'] / t_gsw:.2f}x wall; {d_gsw[name]:.4f} K)")
        else:
            met = c["cpu1"] <= max_ns and (min_speedup is None or speedup >= min_speedup)
            cell_peer = ""
        ok &= met
        verdict = "" if name == "seawater" else f": {'met' if met else 'MISSED'}"
        before = base.get(name)
        if before is None and name == "seawater line" and base.get("seawater"):
            before = base["seawater"]  # a build without the line: its general kernel
        rows.append([LABELS[name], f"{c['cpu1']:.0f} ({c['ns1']:.0f})", f"{speedup:.2f}x", cell_np,
                     f"{t_loop / 1e3:.1f} us ({t_loop / c['cpu1']:,.0f}x; {d_loop:.0e})", cell_peer,
                     f"{before['cpu1']:.0f} ({before['cpu1'] / c['cpu1']:.1f}x)" if before and
                     math.isfinite(before['cpu1']) else
                     (f"wall {before['ns1']:.0f} ({before['ns1'] / c['ns1']:.1f}x)" if before else "not measured"),
                     f"{target}{verdict}"])

    t = time.perf_counter()
    out = subprocess.run([sys.executable, os.path.join(HERE, "bench_sweeps.py"), "--child",
                          str(args.stream_rows), "1000000"], check=True, capture_output=True, text=True,
                         cwd="/").stdout.split()
    peak_mib = int(out[3]) / 1024
    stream_ok = peak_mib < 1024
    ok &= stream_ok
    rows.append([f"streamed sweep, {int(out[0]):,} rows in 1e6-row chunks", f"peak {peak_mib:.0f} MiB",
                 "", "", "", "", "", f"< 1024 MiB: {'met' if stream_ok else 'MISSED'} "
                 f"({time.perf_counter() - t:.0f} s)"])

    head = ["kernel", "ns/point, 1 thread: CPU (wall)", "2 threads (wall)",
            "NumPy vectorised, CPU ns (÷ ours; max diff)", "brentq loop, CPU (÷ ours; max diff)",
            "peer, CPU (wall)", "before, CPU ns (÷ now)", "target (on CPU time)"]
    print("| " + " | ".join(head) + " |")
    print("|" + "|".join("---" for _ in head) + "|")
    for r in rows:
        print("| " + " | ".join(r) + " |")
    load1 = os.getloadavg()
    print(f"load average at the end {load1[0]:.2f} {load1[1]:.2f} {load1[2]:.2f}; differences in K "
          "(freezing points) and in ice fraction; 'before' is the build given by --baseline; "
          "2 threads = speed-up of 2 threads over 1 in wall time on this machine (meaningful only "
          "when both cores are free); CPU = CPU time of the process (one-thread batch calls, "
          "NumPy, brentq and gsw each keep one core busy), which a loaded machine inflates "
          "less than wall time; targets are judged on it")
    print("ALL TARGETS MET" if ok else "SOME TARGETS MISSED")
    return 0


if __name__ == "__main__":
    sys.exit(main())
