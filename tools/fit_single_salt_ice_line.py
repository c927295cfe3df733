"""Fit the ice-line Pitzer rows of the single-salt table to published freezing points.

Provenance script for the rows of set ``colligate_ice_line_fit`` in
cpp/include/colligate/data/single_salt_pitzer.hpp. For each salt of food with published
freezing-point rows -- the CRC Handbook's (tests/reference/crc_freezing_points.csv) or, for
potassium acetate, which the CRC table does not hold, Melinder's (2010) curve as CoolProp
carries it (tests/reference/melinder_freezing_curves.csv, 5-25 wt%) -- it takes the
``used_in_fit`` split of that file (every other row fitted, the others held out) and fits
beta0 and beta1 of the
closed binary Pitzer form with colligate's own fitter (fit/single_salt_fitter.hpp through
``colligate.fit.fit_single_salt``), C-phi held at 0, the parameters constant over the
fitted freezing temperatures. It prints each fit, the worst deviation on the fit rows and
on the held-out rows within the fitted molalities, and whether the row is kept:

  kept when both parameters are determined by the data (each 95 % interval excludes zero
  and |r(beta0, beta1)| < 0.99, the limits of ``FitResult.poorly_determined``).

C-phi is held at 0 because with data to about 1 mol/kg its 95 % interval spans zero for
every salt (run with ``--with-cphi`` to see). The salts whose fits are not kept stay
effective Norrish solutes on the ice line (their CRC constants in builtin_solutes.inc);
their May et al. (2011) rows still give their activity at 25 C.

Run: python3 tools/fit_single_salt_ice_line.py [--with-cphi]
"""
from __future__ import annotations

import argparse
import math
import pathlib
import warnings

import numpy as np
import pandas as pd

import colligate as cg
from colligate import fit

ROOT = pathlib.Path(__file__).resolve().parents[1]

# Charges and ions per formula unit (the salts' formulas).
SALTS = {
    "sodium_acetate": (1, -1, 1, 1),
    "potassium_acetate": (1, -1, 1, 1),
    "trisodium_citrate": (1, -3, 3, 1),
    "monosodium_phosphate": (1, -1, 1, 1),
    "monopotassium_phosphate": (1, -1, 1, 1),
    "dipotassium_phosphate": (1, -2, 2, 1),
    "sodium_bicarbonate": (1, -1, 1, 1),
    "potassium_bicarbonate": (1, -1, 1, 1),
    "sodium_carbonate": (1, -2, 2, 1),
    "potassium_carbonate": (1, -2, 2, 1),
}


# Salts whose rows come from Melinder's curves rather than the CRC table.
MELINDER = {"potassium_acetate"}


def melinder_rows(salt: str) -> pd.DataFrame:
    """A salt's rows of the Melinder file with molality and freezing point in K (molality from
    mass % by cg.single_salt_molality, m = w / (M (1 - w)) with the table's molar mass)."""
    t = pd.read_csv(ROOT / "tests/reference/melinder_freezing_curves.csv", keep_default_na=False)
    t = t[t.solute == salt].copy()
    assert set(t.source_key) == {"melinder_2010"}
    t["molality_mol_per_kg"] = cg.single_salt_molality(salt, t.mass_percent.to_numpy() / 100.0)
    t["freezing_point_K"] = cg._core.ICE_POINT + t.freezing_point_C
    return t


def crc_rows(salt: str) -> tuple[pd.DataFrame, pd.DataFrame]:
    """(fit rows, held-out rows within the fitted molalities) of a salt, freezing point in K."""
    if salt in MELINDER:
        t = melinder_rows(salt)
    else:
        t = pd.read_csv(ROOT / "tests/reference/crc_freezing_points.csv", keep_default_na=False)
        t = t[(t.solute == salt) & ~t.note.str.contains("below neighbours")].copy()
        assert set(t.source_key) == {"crc_concentrative"}
        t["freezing_point_K"] = cg._core.ICE_POINT - t.depression_K
    fitted = t[t.used_in_fit == "yes"]
    held = t[(t.used_in_fit == "no") & (t.molality_mol_per_kg <= fitted.molality_mol_per_kg.max())]
    return fitted, held


def fit_salt(salt: str, with_cphi: bool = False):
    """The fit of one salt: (FitResult, fit rows, held-out rows)."""
    zc, za, nc, na = SALTS[salt]
    fitted, held = crc_rows(salt)
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", fit.PoorlyDeterminedFitWarning)
        r = fit.fit_single_salt(zc, za, nc, na, fitted.molality_mol_per_kg, fitted.freezing_point_K,
                                cphi=with_cphi)
    return r, fitted, held


def deviation(salt: str, params: dict, rows: pd.DataFrame) -> float:
    """Worst |T_f(model) - T_f(CRC)| over rows, K, with the closed form at these parameters."""
    zc, za, nc, na = SALTS[salt]
    tf = cg._core.single_salt_closed_form_freezing_point(
        zc, za, nc, na, params["beta0"], params["beta1"], params.get("cphi", 0.0),
        rows.molality_mol_per_kg.tolist())
    return float(np.max(np.abs(np.asarray(tf) - rows.freezing_point_K.to_numpy())))


def window_low(salt: str, params: dict, fitted: pd.DataFrame) -> float:
    """Lower end of the row's temperature window, K: the lowest fitted freezing point, or the
    row's own freezing point at its top fitted molality where that is lower (so that the row
    evaluated across its own data does not warn), rounded down to 0.1 mK."""
    zc, za, nc, na = SALTS[salt]
    at_top = cg._core.single_salt_closed_form_freezing_point(
        zc, za, nc, na, params["beta0"], params["beta1"], params.get("cphi", 0.0),
        [float(fitted.molality_mol_per_kg.max())])[0]
    return math.floor(min(float(fitted.freezing_point_K.min()), float(at_top)) * 1e4 + 1e-6) / 1e4


def main() -> int:
    ap = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    ap.add_argument("--with-cphi", action="store_true", help="fit C-phi as well")
    args = ap.parse_args()
    for salt in SALTS:
        r, fitted, held = fit_salt(salt, args.with_cphi)
        reasons = r.poorly_determined()
        kept = r.success and not reasons
        p = r.params
        print(f"{salt}: {r.status}, {len(fitted)} fit rows to {fitted.molality_mol_per_kg.max()} mol/kg, "
              f"{len(held)} held out; " + ", ".join(f"{k} = {v:.6g} +/- {r.stderr[k]:.2g}" for k, v in p.items()))
        print(f"    worst deviation: fit rows {deviation(salt, p, fitted):.4f} K, held-out rows "
              f"{deviation(salt, p, held):.4f} K; window from {window_low(salt, p, fitted):.4f} K; " + ("KEPT" if kept else "not kept: " + "; ".join(reasons)))
    return 0


if __name__ == "__main__":
    raise SystemExit(main())
