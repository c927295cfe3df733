"""Two builds of colligate side by side: the installed one against a baseline build.

Run:
    python3 -m pip install --no-build-isolation --target /tmp/colligate-base <older checkout>
    python3 bench/bench_revisions.py --baseline /tmp/colligate-base

Each workload runs in a fresh interpreter per build, alternating baseline and current
`--pairs` times; the best time of each build is kept and the ratio current/baseline is
printed (below 1: faster now). Workloads are the batch kernels and the curve queries that
the other benchmarks time, on invented sweeps (not product data). Timing lives here only.
"""
from __future__ import annotations

import argparse
import json
import os
import subprocess
import sys

WORKLOAD = r'''
import json, sys, time, warnings
import numpy as np
import colligate as cg
warnings.simplefilter("ignore")
rng = np.random.default_rng(7)
out = {}

def best(fn, repeat=3):
    ts = []
    for _ in range(repeat):
        t = time.perf_counter(); fn(); ts.append(time.perf_counter() - t)
    return min(ts)

n = int(sys.argv[1])
# six-solute Norrish sweep (mass fractions), one thread
sp = ["sucrose", "glucose", "fructose", "lactose", "glycerol", "citric_acid"]
x = rng.uniform(0.0, 0.06, size=(n, len(sp)))
b = cg.SolutionBatch.from_mass_fractions(dict(zip(sp, x.T)))
out["norrish_freezing_point_ns"] = best(lambda: cg.batch_freezing_point(b, threads=1)) / n * 1e9
out["norrish_ice_fraction_ns"] = best(lambda: cg.batch_ice_fraction(b, 263.15, threads=1)) / n * 1e9
# seawater freezing points and ice fractions through Pitzer, one thread
sa = rng.uniform(5.0, 40.0, size=n // 10)
import pandas as pd
mdf = pd.DataFrame([cg.Solution.seawater(float(v)).molalities() for v in sa])
swb = cg.SolutionBatch.from_molalities(mdf)
out["seawater_freezing_point_ns"] = best(lambda: cg.batch_freezing_point(swb, threads=1)) / len(sa) * 1e9
out["seawater_ice_fraction_at_-3C_ns"] = best(lambda: cg.batch_ice_fraction(swb, 270.15, threads=1)) / len(sa) * 1e9
# salt + sugar (Ross) freezing points
m2 = pd.DataFrame({"sucrose": rng.uniform(0.05, 0.3, n // 10), "NaCl": rng.uniform(0.005, 0.05, n // 10)})
rb = cg.SolutionBatch.from_mass_fractions(m2)
out["ross_freezing_point_ns"] = best(lambda: cg.batch_freezing_point(rb, threads=1)) / len(m2) * 1e9
# a scalar ice-fraction curve of a sorbet-like syrup, 200 temperatures
syrup = cg.Solution.from_mass_fractions({"sucrose": 0.2, "glucose": 0.05})
temps = np.linspace(272.0, 243.15, 200)
out["syrup_curve_200_points_us"] = best(lambda: cg.ice_fraction(syrup, temps)) * 1e6
# salt paths from a fresh curve: eutectics of NaCl brines, seawater's whole path
brines = [cg.Solution.from_mass_fractions({"NaCl": float(w)}) for w in np.linspace(0.01, 0.2, 20)]
out["nacl_eutectic_us"] = best(lambda: [cg.eutectic(s) for s in brines]) / len(brines) * 1e6
sea = cg.Solution.seawater(35.0)
out["seawater_path_salts_us"] = best(lambda: cg.IceCurve(sea).salts) * 1e6
print(json.dumps(out))
'''


def run(pythonpath: str | None, rows: int) -> dict:
    env = dict(os.environ)
    if pythonpath:
        env["PYTHONPATH"] = pythonpath + os.pathsep + env.get("PYTHONPATH", "")
    # Run outside the source tree so the installed package (not ./python) is imported.
    r = subprocess.run([sys.executable, "-c", WORKLOAD, str(rows)], env=env, cwd="/",
                       capture_output=True, text=True, check=True)
    return json.loads(r.stdout.strip().splitlines()[-1])


def main() -> int:
    ap = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    ap.add_argument("--baseline", required=True, help="site folder holding the baseline colligate")
    ap.add_argument("--rows", type=int, default=20000)
    ap.add_argument("--pairs", type=int, default=3)
    args = ap.parse_args()
    base: dict[str, float] = {}
    cur: dict[str, float] = {}
    for _ in range(args.pairs):
        for store, path in ((base, args.baseline), (cur, None)):
            for k, v in run(path, args.rows).items():
                store[k] = min(store.get(k, float("inf")), v)
    print(f"{'workload':38s} {'baseline':>12s} {'current':>12s} {'ratio':>7s}")
    worst = 0.0
    for k in base:
        ratio = cur[k] / base[k]
        worst = max(worst, ratio)
        print(f"{k:38s} {base[k]:12.1f} {cur[k]:12.1f} {ratio:7.2f}")
    print(f"largest ratio current/baseline: {worst:.2f}")
    return 0


if __name__ == "__main__":
    raise SystemExit(main())
