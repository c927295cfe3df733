"""Print the per-salt tables of docs/electrolytes.md and the README: 25 C and the ice line.

For each salt of tests/reference/crc_mean_activity_coefficients_25c.csv it evaluates
colligate's Pitzer model with the default set (`harvie_spencer_icefit`), the old default
(`spencer_1990_icefit`) and the 25 C set `harvie_1984`, and prints one Markdown table per
salt whose rows are the checks of both regimes, each with its source:

  * 25 C mean activity coefficients against the CRC table (worst deviation in per cent up to
    2 mol/kg and above; rows above a set's highest molality are left out);
  * 25 C osmotic coefficients of NaCl against Hamer & Wu (1972), and of the other salts
    against the isopiestic table (tests/reference/isopiestic_osmotic_coefficients_25c.csv,
    tools/isopiestic_osmotic_25c.py; worst deviation in per cent up to 2 mol/kg and above,
    rows above a set's highest molality left out);
  * freezing points against the CRC table (worst |residual|, K; harvie_1984 has no
    temperature functions and is extrapolated there);
  * freezing points against Melinder's (2010) evaluated ice lines (NaCl, CaCl2 from
    tests/reference/melinder_freezing_curves.csv; MgCl2 from CoolProp INCOMP::MMG, 1-21 wt%).

With --rows it also prints every CRC activity row (the per-molality table of the docs).
Run: python3 tools/activity_25c_table.py [--rows]
"""
from __future__ import annotations

import argparse
import math
import warnings
from pathlib import Path

import pandas as pd

import colligate as cg

REFERENCE = Path(__file__).resolve().parents[1] / "tests" / "reference"
SETS = ("spencer_1990_icefit", "harvie_spencer_icefit", "harvie_1984")
LABELS = {"spencer_1990_icefit": "old default", "harvie_spencer_icefit": "new default",
          "harvie_1984": "harvie_1984"}
# The CRC freezing rows each salt is checked on (tests/cpp/equilibria/test_eutectic.cpp and the
# README validation table): up to the eutectic composition and the rows the model meets.
CRC_MAX_PERCENT = {"NaCl": 23, "KCl": 13, "CaCl2": 20, "MgCl2": 5, "Na2SO4": 4, "K2SO4": 5,
                   "MgSO4": 12}
SOLUTE_ID = {"NaCl": "sodium_chloride", "KCl": "potassium_chloride", "CaCl2": "calcium_chloride",
             "MgCl2": "magnesium_chloride", "Na2SO4": "sodium_sulfate", "K2SO4": "potassium_sulfate",
             "MgSO4": "magnesium_sulfate"}


def _quiet(fn, *args, **kw):
    with warnings.catch_warnings(record=True) as caught:
        warnings.simplefilter("always")
        value = fn(*args, **kw)
    return value, [str(w.message) for w in caught]


def gamma_deviations(rows: pd.DataFrame, salt: str, parameter_set: str) -> tuple[float, float]:
    low, high = 0.0, math.nan
    for _, r in rows.iterrows():
        m = float(r.molality_mol_per_kg)
        g, msgs = _quiet(cg.mean_activity_coefficient, cg.Solution.from_molalities({salt: m}), salt, 298.15,
                         parameter_set=parameter_set)
        if any("molality" in w for w in msgs):
            continue  # beyond the set's range
        dev = 100.0 * (g / r.mean_activity_coefficient - 1.0)
        if m <= 2.0:
            low = dev if abs(dev) > abs(low) else low
        else:
            high = dev if math.isnan(high) or abs(dev) > abs(high) else high
    return low, high


def phi_deviations(rows: pd.DataFrame, salt: str, parameter_set: str) -> tuple[float, float]:
    low, high = math.nan, math.nan
    for _, r in rows.iterrows():
        m = float(r.molality_mol_per_kg)
        phi, msgs = _quiet(cg.osmotic_coefficient, cg.Solution.from_molalities({salt: m}), 298.15,
                           model="pitzer", parameter_set=parameter_set)
        if any("molality" in w for w in msgs):
            continue  # beyond the set's range
        dev = 100.0 * (phi / r.osmotic_coefficient - 1.0)
        if m <= 2.0:
            low = dev if math.isnan(low) or abs(dev) > abs(low) else low
        else:
            high = dev if math.isnan(high) or abs(dev) > abs(high) else high
    return low, high


def ratio_deviation(rows: pd.DataFrame, salt: str, parameter_set: str) -> float:
    """Worst deviation, per cent, of gamma(m)/gamma(0.1 mol/kg) from the table's, to 2 mol/kg
    (checks crc_sulfates_ratio_harvie and crc_sulfates_ratio_default)."""
    def g(m):
        return _quiet(cg.mean_activity_coefficient, cg.Solution.from_molalities({salt: m}), salt, 298.15,
                      parameter_set=parameter_set)[0]
    g01 = g(0.1)
    ref01 = float(rows[rows.molality_mol_per_kg == 0.1].mean_activity_coefficient.iloc[0])
    worst = 0.0
    for _, r in rows[rows.molality_mol_per_kg <= 2].iterrows():
        d = 100 * ((g(r.molality_mol_per_kg) / g01) / (r.mean_activity_coefficient / ref01) - 1)
        worst = d if abs(d) > abs(worst) else worst
    return worst


def freezing_residual(salt: str, table: pd.DataFrame, parameter_set: str, column: str) -> float:
    worst = 0.0
    for _, r in table.iterrows():
        s = cg.Solution.from_mass_fractions({salt: r.mass_percent / 100.0})
        tf, _ = _quiet(cg.freezing_point, s, parameter_set=parameter_set)
        d = (273.15 - tf) - r[column] if column == "depression_K" else (tf - 273.15) - r[column]
        worst = d if abs(d) > abs(worst) else worst
    return worst


def melinder_table(salt: str) -> pd.DataFrame | None:
    t = pd.read_csv(REFERENCE / "melinder_freezing_curves.csv")
    t = t[t.solute == SOLUTE_ID[salt]]
    if len(t):
        return t
    if salt == "MgCl2":
        import CoolProp.CoolProp as CP

        rows = [(w, CP.PropsSI("T_freeze", "T", 273.15, "P", 101325, f"INCOMP::MMG[{w / 100}]") - 273.15)
                for w in range(1, 22)]
        return pd.DataFrame(rows, columns=["mass_percent", "freezing_point_C"])
    return None


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--rows", action="store_true", help="also print every CRC activity row")
    args = parser.parse_args()
    gamma = pd.read_csv(REFERENCE / "crc_mean_activity_coefficients_25c.csv")
    crc_tf = pd.read_csv(REFERENCE / "crc_freezing_points.csv")
    hamer = pd.read_csv(REFERENCE / "nacl_osmotic_coefficients_25c.csv")
    iso = pd.read_csv(REFERENCE / "isopiestic_osmotic_coefficients_25c.csv")
    head = "| check (source) | " + " | ".join(f"{LABELS[s]} `{s}`" for s in SETS) + " |"
    for salt, rows in gamma.groupby("salt", sort=False):
        print(f"\n{salt}\n")
        print(head)
        print("|---|" + "---|" * len(SETS))
        dev = {s: gamma_deviations(rows, salt, s) for s in SETS}
        print("| 25 C ln gamma: worst dev. to 2 mol/kg, % (CRC) | "
              + " | ".join(f"{dev[s][0]:+.1f}" for s in SETS) + " |")
        print("| 25 C ln gamma: worst dev. above 2 mol/kg, % (CRC) | "
              + " | ".join("-" if math.isnan(dev[s][1]) else f"{dev[s][1]:+.1f}" for s in SETS) + " |")
        if salt in ("Na2SO4", "K2SO4", "MgSO4"):
            print("| 25 C gamma(m)/gamma(0.1 mol/kg): worst dev. to 2 mol/kg, % (CRC) | "
                  + " | ".join(f"{ratio_deviation(rows, salt, s):+.1f}" for s in SETS) + " |")
        if salt == "NaCl":
            cells = []
            for s in SETS:
                worst = 0.0
                for _, r in hamer.iterrows():
                    phi, msgs = _quiet(cg.osmotic_coefficient, cg.Solution.from_molalities({"NaCl": r.molality_mol_per_kg}),
                                       298.15, model="pitzer", parameter_set=s)
                    d = phi - r.osmotic_coefficient
                    worst = d if abs(d) > abs(worst) else worst
                cells.append(f"{worst:+.4f}")
            print("| 25 C phi: worst residual (Hamer & Wu 1972) | " + " | ".join(cells) + " |")
        irows = iso[iso.salt == salt]
        if len(irows):
            pdev = {s: phi_deviations(irows, salt, s) for s in SETS}
            fmt = lambda x: "-" if math.isnan(x) else f"{x:+.1f}"  # noqa: E731
            span = f"{irows.molality_mol_per_kg.min():.2g}-{irows.molality_mol_per_kg.max():.3g} mol/kg"
            print(f"| 25 C phi: worst dev. to 2 mol/kg, % (isopiestic, {span}) | "
                  + " | ".join(fmt(pdev[s][0]) for s in SETS) + " |")
            print("| 25 C phi: worst dev. above 2 mol/kg, % (isopiestic) | "
                  + " | ".join(fmt(pdev[s][1]) for s in SETS) + " |")
        t = crc_tf[(crc_tf.solute == SOLUTE_ID[salt]) & (crc_tf.mass_percent <= CRC_MAX_PERCENT.get(salt, 0))]
        if len(t):
            print(f"| freezing point: worst residual, K (CRC, {t.mass_percent.min():g}-{t.mass_percent.max():g} wt%) | "
                  + " | ".join(f"{freezing_residual(salt, t, s, 'depression_K'):+.2f}" for s in SETS) + " |")
        mel = melinder_table(salt)
        if mel is not None:
            print(f"| freezing point: worst residual, K (Melinder 2010, {mel.mass_percent.min():g}-"
                  f"{mel.mass_percent.max():g} wt%) | "
                  + " | ".join(f"{freezing_residual(salt, mel, s, 'freezing_point_C'):+.2f}" for s in SETS) + " |")
        if args.rows:
            print("\n| m (mol/kg) | CRC | " + " | ".join(f"`{s}`" for s in SETS) + " |")
            print("|---|---|" + "---|" * len(SETS))
            for _, r in rows.iterrows():
                m = float(r.molality_mol_per_kg)
                cells = []
                for s in SETS:
                    g, msgs = _quiet(cg.mean_activity_coefficient, cg.Solution.from_molalities({salt: m}), salt,
                                     298.15, parameter_set=s)
                    flag = " (beyond range)" if any("molality" in w for w in msgs) else ""
                    cells.append(f"{g:.4g} ({100 * (g / r.mean_activity_coefficient - 1):+.1f} %){flag}")
                print(f"| {m:g} | {r.mean_activity_coefficient:g} | " + " | ".join(cells) + " |")


if __name__ == "__main__":
    main()
