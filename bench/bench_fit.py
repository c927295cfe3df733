"""Time of colligate's C++ fit against scipy.optimize.least_squares on the same problems,
measured in the same run. Prints the ratio (scipy time / colligate time; > 1 means the
C++ fit is faster).

Problems: Norrish K of sucrose from 25 C water activities (16 points, the data of
tests/reference/sucrose_osmotic_coefficients_25c.csv), fitted by colligate.fit.fit_norrish
(C++ model and Jacobian) and by scipy on a NumPy version of the same model; and NIST StRD
Thurber (37 points, 7 parameters), where colligate calls a Python model (so the ratio
measures the solver, not the model).

    python3 bench/bench_fit.py [repeats]
"""
from __future__ import annotations

import pathlib
import sys
import time

import numpy as np
import pandas as pd
from scipy.optimize import least_squares

import colligate as cg
from colligate import fit

REF = pathlib.Path(__file__).resolve().parents[1] / "tests" / "reference"
MW = cg._core.MOLAR_MASS_WATER


def best_of(fn, repeats):
    best = float("inf")
    for _ in range(repeats):
        t0 = time.perf_counter()
        fn()
        best = min(best, time.perf_counter() - t0)
    return best


def main() -> None:
    repeats = int(sys.argv[1]) if len(sys.argv) > 1 else 20
    t = pd.read_csv(REF / "sucrose_osmotic_coefficients_25c.csv")
    m = t.molality_mol_per_kg.to_numpy()
    aw = np.exp(-t.osmotic_coefficient.to_numpy() * MW * m)

    def norrish(k):
        x = m / (1 / MW + m)
        return np.exp(np.log1p(-x) - k[0] * x * x) - aw

    def norrish_jac(k):
        x = m / (1 / MW + m)
        return (-np.exp(np.log1p(-x) - k[0] * x * x) * x * x)[:, None]

    ours = lambda: fit.fit_norrish(m, water_activity=aw)  # noqa: E731
    theirs = lambda: least_squares(norrish, [2.0], jac=norrish_jac, method="lm")  # noqa: E731
    k_ours = ours().params["norrish_k"]
    k_theirs = theirs().x[0]
    t_ours, t_theirs = best_of(ours, repeats), best_of(theirs, repeats)
    print(f"Norrish K (sucrose, 16 points): colligate {t_ours * 1e3:.3f} ms, scipy {t_theirs * 1e3:.3f} ms, "
          f"ratio scipy/colligate = {t_theirs / t_ours:.2f}  (K {k_ours:.8f} vs {k_theirs:.8f})")

    d = pd.read_csv(REF / "nist_strd_data.csv")
    c = pd.read_csv(REF / "nist_strd_certified.csv")
    x = d[d.problem == "Thurber"].x.to_numpy()
    y = d[d.problem == "Thurber"].y.to_numpy()
    p0 = c[c.problem == "Thurber"].start2.to_numpy()

    def thurber(xx, b):
        return (b[0] + xx * (b[1] + xx * (b[2] + xx * b[3]))) / (1 + xx * (b[4] + xx * (b[5] + xx * b[6])))

    ours = lambda: fit.curve_fit(thurber, x, y, p0)  # noqa: E731
    theirs = lambda: least_squares(lambda b: thurber(x, b) - y, p0, method="lm")  # noqa: E731
    t_ours, t_theirs = best_of(ours, repeats), best_of(theirs, repeats)
    print(f"NIST Thurber (Python model, numerical Jacobian): colligate {t_ours * 1e3:.3f} ms, "
          f"scipy {t_theirs * 1e3:.3f} ms, ratio scipy/colligate = {t_theirs / t_ours:.2f}")


if __name__ == "__main__":
    main()
