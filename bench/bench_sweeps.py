"""Benchmarks of the batch kernels, measured side by side in one run.

Run: python3 bench/bench_sweeps.py [--rows 1000000] [--stream-rows 10000000]
Prints ratios (ours vs a baseline measured in the same run) and PASS/FAIL against the
targets. Timing belongs here, never in unit tests. Solutions: random 6-solute sugar /
polyol / acid formulations (invented sweep, not product data).
"""
from __future__ import annotations

import argparse
import math
import os
import resource
import subprocess
import sys
import time
import warnings

import numpy as np
import pandas as pd
from scipy.optimize import brentq

import colligate as cg
from _timing import best_of  # bench/_timing.py (run as python3 bench/<file>.py)

SPECIES = ["sucrose", "glucose", "fructose", "lactose", "glycerol", "citric_acid"]
warnings.simplefilter("ignore", cg.OutOfValidityRangeWarning)
warnings.simplefilter("ignore", cg.BatchRowWarning)


def sweep(n: int, seed: int = 0) -> pd.DataFrame:
    rng = np.random.default_rng(seed)
    return pd.DataFrame(rng.uniform(0.0, 0.05, (n, len(SPECIES))), columns=SPECIES)




# --- the same Norrish + ice model written as an analyst would, for the brentq loop ----
R, MW, T0, H0 = 8.314462618, 0.018015268, 273.15, 6007.0
CP = [76.02 - 37.77, -0.1571134, -0.01728863, -0.00096686]
TABLE = cg.solutes()


GAUSS_X, GAUSS_W = (list(a) for a in np.polynomial.legendre.leggauss(8))


def ln_aw_ice(T):
    # integral of dH(t)/(R t^2) from T0 to T, 8-point Gauss-Legendre, plain floats
    total = 0.0
    for x, w in zip(GAUSS_X, GAUSS_W):
        t = 0.5 * (T - T0) * x + 0.5 * (T + T0)
        d = t - T0
        dH = H0 + CP[0] * d + CP[1] * d * d / 2 + CP[2] * d**3 / 3 + CP[3] * d**4 / 4
        total += w * dH / (R * t * t)
    return 0.5 * (T - T0) * total


MOLAR_MASS = [float(TABLE.loc[s, "molar_mass_kg_per_mol"]) for s in SPECIES]
K = [float(TABLE.loc[s, "norrish_k"]) for s in SPECIES]
K3 = [float(TABLE.loc[s, "norrish_k3"]) for s in SPECIES]


def python_freezing_point(row):
    mol = [w / M for w, M in zip(row, MOLAR_MASS)]
    nw = (1.0 - sum(row)) / MW
    n = nw + sum(mol)
    sq = sum(math.sqrt(k) * m / n for k, m in zip(K, mol) if k > 0)
    extra = sum(-k3 * (m / n) ** 3 for k3, m in zip(K3, mol))
    ln_aw = math.log(nw / n) - sq * sq + extra
    return brentq(lambda T: ln_aw - ln_aw_ice(T), 223.15, T0)


def stream_child(rows: int, chunk: int) -> None:
    """Child process: stream `rows` formulations in chunks, keep only summary statistics."""
    lo, hi, count = np.inf, -np.inf, 0
    for start in range(0, rows, chunk):
        df = sweep(min(chunk, rows - start), seed=start)
        tf = cg.batch_freezing_point(cg.SolutionBatch.from_mass_fractions(df)).to_numpy()
        lo, hi, count = min(lo, np.nanmin(tf)), max(hi, np.nanmax(tf)), count + len(tf)
    peak_kib = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss
    print(f"{count} {lo:.6f} {hi:.6f} {peak_kib}")


def main() -> int:
    ap = argparse.ArgumentParser()
    ap.add_argument("--rows", type=int, default=1_000_000)
    ap.add_argument("--stream-rows", type=int, default=10_000_000)
    ap.add_argument("--loop-rows", type=int, default=2000)
    ap.add_argument("--child", nargs=2, type=int)
    args = ap.parse_args()
    if args.child:
        stream_child(*args.child)
        return 0

    ok = True
    df = sweep(args.rows)
    batch = cg.SolutionBatch.from_mass_fractions(df)
    print(f"colligate {cg.__version__}; {os.cpu_count()} cores; {args.rows} six-solute Norrish formulations")

    t1 = best_of(lambda: cg.batch_freezing_point(batch, threads=1))
    t2 = best_of(lambda: cg.batch_freezing_point(batch, threads=2))
    r1, r2 = args.rows / t1, args.rows / t2
    print(f"[norrish freezing point] 1 thread: {r1:,.0f} solves/s (target >= 1e6): {'PASS' if r1 >= 1e6 else 'FAIL'}")
    print(f"[norrish freezing point] 2 threads: {r2:,.0f} solves/s, speed-up {r2 / r1:.2f}x (target >= 1.8x): "
          f"{'PASS' if r2 / r1 >= 1.8 else 'FAIL'}")
    ok &= r1 >= 1e6 and r2 / r1 >= 1.8

    sub = df.iloc[: args.loop_rows].to_numpy()
    t_loop = best_of(lambda: [python_freezing_point(r) for r in sub], repeat=1)
    per_row_loop = t_loop / len(sub)
    per_row_batch = t2 / args.rows
    check = np.array([python_freezing_point(r) for r in sub[:50]])
    ours = cg.batch_freezing_point(cg.SolutionBatch.from_mass_fractions(df.iloc[:50])).to_numpy()
    print(f"[sweep vs Python brentq loop] loop {per_row_loop * 1e6:.1f} us/row (measured on {len(sub)} rows, "
          f"scaled), batch {per_row_batch * 1e9:.0f} ns/row: {per_row_loop / per_row_batch:,.0f}x "
          f"(target >= 200x): {'PASS' if per_row_loop / per_row_batch >= 200 else 'FAIL'}; "
          f"max |difference| {np.max(np.abs(check - ours)):.1e} K")
    ok &= per_row_loop / per_row_batch >= 200

    one = cg.batch_freezing_point(batch, threads=1).to_numpy()
    two = cg.batch_freezing_point(batch, threads=2).to_numpy()
    same = np.array_equal(one, two, equal_nan=True)
    print(f"[determinism] 1 vs 2 threads bit-identical: {'PASS' if same else 'FAIL'}")
    corrupted = df.copy()
    bad = np.random.default_rng(7).choice(len(df), len(df) // 10, replace=False)
    corrupted.iloc[bad, 0] = np.nan
    dirty = cg.batch_freezing_point(cg.SolutionBatch.from_mass_fractions(corrupted), threads=2).to_numpy()
    good = np.setdiff1d(np.arange(len(df)), bad)
    clean_same = np.array_equal(dirty[good], one[good]) and np.all(np.isnan(dirty[bad]))
    print(f"[robustness] 10 % corrupted rows: good rows bit-identical, bad rows NaN: {'PASS' if clean_same else 'FAIL'}")
    ok &= same and clean_same

    t = time.perf_counter()
    out = subprocess.run([sys.executable, __file__, "--child", str(args.stream_rows), "1000000"],
                         check=True, capture_output=True, text=True).stdout.split()
    count, peak_mib = int(out[0]), int(out[3]) / 1024
    print(f"[streaming] {count:,} rows in 1e6-row chunks in {time.perf_counter() - t:.1f} s, peak RSS "
          f"{peak_mib:.0f} MiB (target < 1024 MiB): {'PASS' if peak_mib < 1024 else 'FAIL'}")
    ok &= peak_mib < 1024
    print("ALL PASS" if ok else "SOME TARGETS MISSED")
    return 0 if ok else 1


if __name__ == "__main__":
    sys.exit(main())
