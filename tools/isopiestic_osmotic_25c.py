"""Osmotic coefficients at 25 C reduced from published isopiestic molalities.

tests/reference/isopiestic_osmotic_coefficients_25c.csv holds, per row, a pair of
molalities measured in isopiestic equilibrium at 298.15 K (the sample salt and a reference
salt, NaCl or KCl) as printed by the original authors (source_key; read in the compilation
of isopiestic data kept with the pytzer package, datasets/iso.xlsx, commit 0cd0d63, which
names the paper of every row). At isopiestic equilibrium the two solutions have the same
water activity, so

    phi_sample = nu_ref m_ref phi_ref / (nu_sample m_sample)

(Robinson & Stokes 1959, ch. 8: the isopiestic method). phi_ref is the reference salt's
osmotic coefficient at m_ref from a published evaluation, the standard practice of the
method:

  * NaCl: Archer (1992), colligate's parameter set ``archer_1992`` (Archer's Table 2
    coefficients; within 0.0036 of Hamer & Wu 1972 at 25 C);
  * KCl: Pitzer & Mayorga (1973) Table I (0.04835, 0.2122, -0.00084), the KCl row of
    colligate's ``harvie_1984`` set; the KCl rows of this table (Robinson & Sinclair 1934,
    against NaCl) check it.

The reference phi is a property of the reference salt only, never of the set under test,
so a wrong parameter of a sample salt shows as a residual. The derived columns
(reference_osmotic_coefficient, osmotic_coefficient) are written by this script:

    python3 tools/isopiestic_osmotic_25c.py --write     # recompute the derived columns
    python3 tools/isopiestic_osmotic_25c.py [--check]   # check them (exit 1 if stale) and
                                                        # print the residuals per salt and set

tests/python/test_published_magnitudes.py re-derives the columns, so a stale file fails.
"""
from __future__ import annotations

import argparse
import csv
import sys
import warnings
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
TABLE = ROOT / "tests" / "reference" / "isopiestic_osmotic_coefficients_25c.csv"

# ions per formula unit
NU = {"NaCl": 2, "KCl": 2, "CaCl2": 3, "MgCl2": 3, "Na2SO4": 3, "K2SO4": 3, "MgSO4": 2}
# the published evaluation that gives the reference salt's phi (see the module docstring)
REFERENCE_SET = {"NaCl": "archer_1992", "KCl": "harvie_1984"}
DIGITS = 5  # the molalities are printed to 4-5 significant figures


def osmotic(cg, salt: str, m: float, parameter_set: str | None, T: float = 298.15) -> float:
    with warnings.catch_warnings():
        # KCl references up to 4.81 mol/kg sit at the end of the Pitzer & Mayorga row (4.8)
        warnings.simplefilter("ignore", cg.OutOfValidityRangeWarning)
        return float(cg.osmotic_coefficient(cg.Solution.from_molalities({salt: m}), T, model="pitzer",
                                             parameter_set=parameter_set))


def derived(cg, row: dict) -> tuple[float, float]:
    """(phi of the reference salt, phi of the sample) of one row."""
    ref, m_ref = row["reference_salt"], float(row["reference_molality_mol_per_kg"])
    salt, m = row["salt"], float(row["molality_mol_per_kg"])
    phi_ref = osmotic(cg, ref, m_ref, REFERENCE_SET[ref], float(row["temperature_K"]))
    return phi_ref, NU[ref] * m_ref * phi_ref / (NU[salt] * m)


def main() -> int:
    ap = argparse.ArgumentParser(description=__doc__.split("\n")[0])
    ap.add_argument("--write", action="store_true", help="rewrite the derived columns")
    ap.add_argument("--check", action="store_true", help="check the derived columns (the default)")
    args = ap.parse_args()
    import colligate as cg

    with TABLE.open(newline="") as fh:
        reader = csv.DictReader(fh)
        fields = reader.fieldnames
        rows = list(reader)
    worst = 0.0
    for row in rows:
        phi_ref, phi = derived(cg, row)
        new = {"reference_osmotic_coefficient": f"{phi_ref:.{DIGITS}f}", "osmotic_coefficient": f"{phi:.{DIGITS}f}"}
        worst = max(worst, max(abs(float(row[k]) - float(v)) for k, v in new.items()))
        row.update(new)
    if args.write:
        tmp = TABLE.with_suffix(".csv.tmp")
        with tmp.open("w", newline="") as fh:
            w = csv.DictWriter(fh, fieldnames=fields, lineterminator="\n")
            w.writeheader()
            w.writerows(rows)
        tmp.replace(TABLE)
        print(f"wrote {TABLE.relative_to(ROOT)} ({len(rows)} rows)")
    else:
        print(f"largest change of a derived column: {worst:.2e}")
    # residuals per salt and source, default set and harvie_1984, relative to the derived phi
    groups: dict[tuple[str, str], list] = {}
    for row in rows:
        groups.setdefault((row["salt"], row["source_key"]), []).append(row)
    print(f"{'salt':7} {'source':28} {'n':>3} {'m range':>12}  {'default <=2':>13} {'>2':>8}  "
          f"{'harvie_1984 <=2':>15} {'>2':>8}")
    for (salt, key), rs in groups.items():
        cells = []
        for ps in (None, "harvie_1984"):
            for low in (True, False):
                sel = [r for r in rs if (float(r["molality_mol_per_kg"]) <= 2) == low]
                if not sel:
                    cells.append("-")
                    continue
                dev = [osmotic(cg, salt, float(r["molality_mol_per_kg"]), ps) / float(r["osmotic_coefficient"]) - 1
                       for r in sel]
                cells.append(f"{100 * max(dev, key=abs):+.2f}%")
        ms = [float(r["molality_mol_per_kg"]) for r in rs]
        print(f"{salt:7} {key:28} {len(rs):3d} {min(ms):5.3g}-{max(ms):<6.3g}  {cells[0]:>13} {cells[1]:>8}  "
              f"{cells[2]:>15} {cells[3]:>8}")
    return 0 if (args.write or worst < 0.5 * 10 ** -DIGITS) else 1


if __name__ == "__main__":
    sys.exit(main())
