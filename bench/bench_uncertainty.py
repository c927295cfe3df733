"""Cost of carrying a fitted constant's uncertainty, measured side by side in one run.

A one-parameter fitted solute (Norrish K fitted to the CRC Handbook sucrose freezing points
to 42 wt%, tests/reference/crc_freezing_points.csv, source key crc_concentrative), 5-40 wt%:

1. Batch (the issue's target): the C++ batch kernels on one thread, plain
   (``batch_freezing_points``, ``batch_ice_fractions``, ``batch_water_activities``) against
   the value and standard-uncertainty columns (``batch_predictions_with_uncertainty``, linear
   propagation), CPU time per row and the ratio per quantity, with the target (at most 3x
   the plain batch call) and whether it is met. The compiled calls are timed directly, so
   the ratio is that of the kernels; the public wrappers add the same pandas work to both.
2. Scalar: one call per solution (Python overhead included), plain against
   ``with_uncertainty=True`` and against Monte Carlo with 1000 draws (for scale).

    python3 bench/bench_uncertainty.py [repeats]
"""
from __future__ import annotations

import pathlib
import sys

import numpy as np
import pandas as pd

import colligate as cg
from colligate import _core
from _timing import best_of, best_of_cpu  # bench/_timing.py (run as python3 bench/<file>.py)

REF = pathlib.Path(__file__).resolve().parents[1] / "tests" / "reference"
TARGET = 3.0  # issue 15: propagation adds at most 3x the cost of the plain batch call
T_ICE = 271.15  # K (-2 C): ice fraction
T_AW = 298.15  # K: water activity


def fitted_library():
    t = pd.read_csv(REF / "crc_freezing_points.csv", keep_default_na=False)
    t = t[(t.solute == "sucrose") & (t.mass_percent <= 42.0)]
    res = cg.fit_norrish(t.molality_mol_per_kg.to_numpy(),
                         freezing_point=cg._core.ICE_POINT - t.depression_K.to_numpy())
    return cg.SoluteLibrary([res.as_solute("lab sucrose", molar_mass=0.3422965)])


def batch_table(lib, rows: int, repeats: int) -> None:
    w = pd.DataFrame({"lab sucrose": np.linspace(0.05, 0.40, rows)})
    b = cg.SolutionBatch.from_mass_fractions(w, library=lib)._core
    cases = {
        "freezing point": (lambda: _core.batch_freezing_points(b, "auto", 1, "extrapolate", 0.0),
                           lambda: _core.batch_predictions_with_uncertainty(b, "freezing_point", 0.0, "auto", 1)),
        f"ice fraction at {T_ICE} K": (
            lambda: _core.batch_ice_fractions(b, np.array([T_ICE]), "auto", 1, "extrapolate", 0.0),
            lambda: _core.batch_predictions_with_uncertainty(b, "ice_fraction", T_ICE, "auto", 1)),
        f"a_w at {T_AW} K": (lambda: _core.batch_water_activities(b, T_AW, "auto", 1, "extrapolate", "equilibrium"),
                             lambda: _core.batch_predictions_with_uncertainty(b, "water_activity", T_AW, "auto", 1)),
    }
    print(f"\nbatch of {rows} rows, one thread, CPU time per row (best of {repeats}):")
    print(f"  {'quantity':<26}{'plain ns/row':>14}{'with u ns/row':>15}{'ratio':>8}{'target':>9}  result")
    for name, (plain, linear) in cases.items():
        _, tp = best_of_cpu(plain, repeats)
        _, tl = best_of_cpu(linear, repeats)
        ratio = tl / tp
        print(f"  {name:<26}{tp / rows * 1e9:>14.0f}{tl / rows * 1e9:>15.0f}{ratio:>8.2f}{'<= 3':>9}  "
              f"{'met' if ratio <= TARGET else 'missed'}")


def scalar_table(lib, repeats: int) -> None:
    sols = [cg.Solution.from_mass_fractions({"lab sucrose": w}, table=lib) for w in np.linspace(0.05, 0.40, 200)]
    cases = {
        "freezing point": (lambda s: cg.freezing_point(s), lambda s: cg.freezing_point(s, with_uncertainty=True),
                           lambda s: cg.uncertainty.propagate(s, "freezing_point", method="monte_carlo", draws=1000)),
        f"ice fraction at {T_ICE} K": (lambda s: cg.ice_fraction(s, T_ICE),
                                       lambda s: cg.ice_fraction(s, T_ICE, with_uncertainty=True),
                                       lambda s: cg.uncertainty.propagate(s, "ice_fraction", T_ICE,
                                                                          method="monte_carlo", draws=1000)),
    }
    print("\nscalar, 200 solutions, one call each (Python overhead included), wall time:")
    for name, (plain, linear, mc) in cases.items():
        tp = best_of(lambda: [plain(s) for s in sols], repeats)
        tl = best_of(lambda: [linear(s) for s in sols], repeats)
        tm = best_of(lambda: [mc(s) for s in sols[:20]], 1) * 10  # 20 of the 200, scaled
        print(f"  {name}: plain {tp * 1e3:.2f} ms, linear {tl * 1e3:.2f} ms (ratio {tl / tp:.2f}), "
              f"Monte Carlo 1000 draws {tm * 1e3:.0f} ms (ratio {tm / tp:.0f})")


def main() -> None:
    repeats = int(sys.argv[1]) if len(sys.argv) > 1 else 5
    lib = fitted_library()
    for rows in (2_000, 20_000):
        batch_table(lib, rows, repeats)
    scalar_table(lib, repeats)


if __name__ == "__main__":
    main()
