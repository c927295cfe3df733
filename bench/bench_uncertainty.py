"""Cost of carrying a fitted constant's uncertainty, measured in the same run: the scalar
freezing point and ice fraction of 200 solutions of a one-parameter fitted solute (Norrish
K fitted to the CRC sucrose freezing points to 42 wt%), plain against
``with_uncertainty=True`` (linear propagation) and against Monte Carlo with 1000 draws.
Prints the ratios (with uncertainty / plain; the issue's target for linear propagation is at
most 3).

The scalar path is one call per solution (Python overhead included); the batch path runs
the same 200 rows (and 20,000 rows) through the C++ kernels, plain
(``batch_freezing_point``, ``batch_ice_fraction``) against the value and standard-uncertainty
columns (``batch_with_uncertainty``), one thread each, side by side.

    python3 bench/bench_uncertainty.py [repeats]
"""
from __future__ import annotations

import pathlib
import sys

import numpy as np
import pandas as pd

import colligate as cg
from _timing import best_of  # bench/_timing.py (run as python3 bench/<file>.py)

REF = pathlib.Path(__file__).resolve().parents[1] / "tests" / "reference"


def main() -> None:
    repeats = int(sys.argv[1]) if len(sys.argv) > 1 else 5
    t = pd.read_csv(REF / "crc_freezing_points.csv", keep_default_na=False)
    t = t[(t.solute == "sucrose") & (t.mass_percent <= 42.0)]
    res = cg.fit_norrish(t.molality_mol_per_kg.to_numpy(),
                         freezing_point=cg._core.ICE_POINT - t.depression_K.to_numpy())
    lib = cg.SoluteLibrary([res.as_solute("lab sucrose", molar_mass=0.3422965)])
    sols = [cg.Solution.from_mass_fractions({"lab sucrose": w}, table=lib) for w in np.linspace(0.05, 0.40, 200)]
    cases = {
        "freezing point": (lambda s: cg.freezing_point(s), lambda s: cg.freezing_point(s, with_uncertainty=True),
                           lambda s: cg.uncertainty.propagate(s, "freezing_point", method="monte_carlo", draws=1000)),
        "ice fraction at -2 C": (lambda s: cg.ice_fraction(s, 271.15),
                                 lambda s: cg.ice_fraction(s, 271.15, with_uncertainty=True),
                                 lambda s: cg.uncertainty.propagate(s, "ice_fraction", 271.15,
                                                                    method="monte_carlo", draws=1000)),
    }
    for name, (plain, linear, mc) in cases.items():
        tp = best_of(lambda: [plain(s) for s in sols], repeats)
        tl = best_of(lambda: [linear(s) for s in sols], repeats)
        tm = best_of(lambda: [mc(s) for s in sols[:20]], 1) * 10  # 20 of the 200, scaled
        print(f"{name}: plain {tp * 1e3:.2f} ms, linear {tl * 1e3:.2f} ms (ratio {tl / tp:.2f}), "
              f"Monte Carlo 1000 draws {tm * 1e3:.0f} ms (ratio {tm / tp:.0f})")
    from colligate import batch as cb

    for rows in (200, 20_000):
        w = pd.DataFrame({"lab sucrose": np.linspace(0.05, 0.40, rows)})
        b = cg.SolutionBatch.from_mass_fractions(w, library=lib)
        batch_cases = {
            "freezing point": (lambda: cb.batch_freezing_point(b, threads=1),
                               lambda: cb.batch_with_uncertainty(b, "freezing_point", threads=1)),
            "ice fraction at -2 C": (lambda: cb.batch_ice_fraction(b, 271.15, threads=1),
                                     lambda: cb.batch_with_uncertainty(b, "ice_fraction", 271.15, threads=1)),
        }
        for name, (plain, linear) in batch_cases.items():
            tp = best_of(plain, repeats)
            tl = best_of(linear, repeats)
            print(f"batch of {rows} rows, {name}: plain {tp * 1e3:.2f} ms, with standard uncertainty "
                  f"{tl * 1e3:.2f} ms (ratio {tl / tp:.2f}; target <= 3)")


if __name__ == "__main__":
    main()
