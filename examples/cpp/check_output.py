"""Checks the output of the C++ embedding example against the Python package.

    python examples/cpp/check_output.py OUTPUT.txt

The example prints the mass fractions it used and its freezing point (%.17g); this builds
the same solution in Python and requires the same freezing point within 1e-12 K (both call
the same C++ core, so only the last bits may differ), plus the ice-curve lines and the
rejected input.
"""
from __future__ import annotations

import math
import sys

import colligate as cg


def main(path: str) -> int:
    lines = open(path, encoding="utf-8").read().splitlines()
    fields = {line.split(" ", 1)[0]: line.split(" ", 1)[1] for line in lines if " " in line}
    fractions = dict(kv.split("=") for kv in fields["mass_fractions"].split())
    solution = cg.Solution.from_mass_fractions({k: float(v) for k, v in fractions.items()})
    cpp = float(fields["freezing_point_K"])
    py = cg.freezing_point(solution)
    print(f"freezing point: C++ {cpp!r} K, Python {py!r} K, difference {abs(cpp - py):.3g} K")
    ok = math.isfinite(cpp) and abs(cpp - py) <= 1e-12
    curve = [line.split() for line in lines if line.startswith("ice_fraction_at_C")]
    ok &= len(curve) >= 5
    for _, t_c, ice, *_ in curve:
        expected = cg.ice_fraction(solution, float(t_c) + 273.15)
        ok &= abs(float(ice) - expected) <= 1e-6  # printed to 6 decimals
    ok &= any(line.startswith("rejected_input ") and "sucrose" in line for line in lines)
    return 0 if ok else 1


if __name__ == "__main__":
    sys.exit(main(sys.argv[1]))
