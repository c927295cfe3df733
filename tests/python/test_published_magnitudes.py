"""The published reference tables made by tools/ scripts still match their sources, and a
missing reference package cannot silently skip a published check.

The C++ validation suite (tests/cpp/validation/, target colligate_validation) reads
tests/reference/seawater_teos10_*.csv and melinder_freezing_curves.csv; here they are
recomputed from gsw (TEOS-10) and CoolProp (Melinder 2010) so a stale file fails.
"""
from __future__ import annotations

import pathlib
import subprocess
import sys

import pandas as pd
import pytest
from reference_packages import in_ci, reference_package

import colligate as cg

ROOT = pathlib.Path(__file__).resolve().parents[2]
REFERENCE = ROOT / "tests" / "reference"


@pytest.mark.parametrize("tool", ["teos10_seawater_enthalpy.py", "melinder_freezing_curves.py",
                                  "teos10_brine_ice_fraction.py"])
def test_reference_tables_match_their_source(tool):
    reference_package("gsw")
    reference_package("CoolProp.CoolProp")
    out = subprocess.run([sys.executable, str(ROOT / "tools" / tool), "--check"],
                         capture_output=True, text=True, check=False)
    assert out.returncode == 0, out.stdout + out.stderr


def test_isopiestic_osmotic_coefficients_match_their_reduction():
    # tests/reference/isopiestic_osmotic_coefficients_25c.csv: phi of each row re-derived from
    # its published isopiestic molalities and the reference salt's phi (Archer 1992 NaCl,
    # Pitzer & Mayorga 1973 KCl) by tools/isopiestic_osmotic_25c.py; a stale column fails.
    out = subprocess.run([sys.executable, str(ROOT / "tools" / "isopiestic_osmotic_25c.py"), "--check"],
                         capture_output=True, text=True, check=False)
    assert out.returncode == 0, out.stdout + out.stderr


def test_isopiestic_reduction_identity():
    # Identity of the isopiestic method (Robinson & Stokes 1959, ch. 8): the two solutions of a
    # row have the same water activity, nu_s m_s phi_s = nu_r m_r phi_r, for every row.
    df = pd.read_csv(REFERENCE / "isopiestic_osmotic_coefficients_25c.csv")
    nu = {"NaCl": 2, "KCl": 2, "CaCl2": 3, "MgCl2": 3, "Na2SO4": 3, "K2SO4": 3, "MgSO4": 2}
    lhs = df.salt.map(nu) * df.molality_mol_per_kg * df.osmotic_coefficient
    rhs = df.reference_salt.map(nu) * df.reference_molality_mol_per_kg * df.reference_osmotic_coefficient
    assert ((lhs / rhs - 1).abs() < 2e-5).all()  # the derived columns are printed to 5 decimals
    assert set(df.salt) == {"KCl", "CaCl2", "MgCl2", "Na2SO4", "K2SO4", "MgSO4"}


def test_every_reference_row_has_used_in_fit():
    for path in sorted(REFERENCE.glob("*.csv")):
        df = pd.read_csv(path, keep_default_na=False)
        assert "used_in_fit" in df.columns, path.name
        assert set(df["used_in_fit"]) <= {"yes", "no"}, path.name


def test_fitted_constants_have_held_out_rows():
    # Every constant fitted to the CRC table has held-out rows (tools/fit_crc_norrish.py
    # fits the used_in_fit = yes rows); for the others every row is a check. Lactose takes
    # sucrose's published K (nothing fitted), so all its rows are checks.
    crc = pd.read_csv(REFERENCE / "crc_freezing_points.csv", keep_default_na=False)
    fitted = {"maltose", "glycerol", "citric_acid", "lactic_acid", "ethanol", "acetic_acid"}
    # food salts and phosphoric acid (issue 12); the CRC table prints fewer rows for
    # sodium carbonate (7, so 3 held out)
    food = {"sodium_acetate", "trisodium_citrate", "monosodium_phosphate",
            "monopotassium_phosphate", "dipotassium_phosphate", "sodium_bicarbonate",
            "potassium_bicarbonate", "sodium_carbonate", "potassium_carbonate", "phosphoric_acid"}
    used = crc[crc.used_in_fit == "yes"]
    assert set(used.solute) == fitted | food
    for solute in fitted | food:
        rows = crc[crc.solute == solute]
        assert (rows.used_in_fit == "no").sum() >= (3 if solute == "sodium_carbonate" else 5), solute
    assert (crc[crc.solute == "lactose"].used_in_fit == "no").all()
    for source_key in set(crc.source_key):
        assert cg.citation(source_key)


def test_heat_to_freeze_seawater_vs_teos10():
    # Same published rows and tolerances as the C++ check, through the Python API: 1 % of
    # the latent part; the total 1 % of the latent plus 3 % of the sensible part (colligate's
    # additive heat capacity of seawater is 2 % above TEOS-10's; see
    # tests/cpp/validation/test_published_checks.cpp for both bases).
    df = pd.read_csv(REFERENCE / "seawater_teos10_enthalpy.csv")
    SA = 35.16504
    comp = {"water": 1.0 - SA / 1000.0, "ash": SA / 1000.0}
    s = cg.Solution.seawater(SA)
    for r in df.itertuples():
        q = cg.heat_load(comp, s, r.from_temperature_C + 273.15, r.to_temperature_C + 273.15)
        sensible = r.heat_removed_J_per_kg - r.latent_J_per_kg
        tol = 0.01 * r.latent_J_per_kg + 0.03 * sensible
        assert q["total"] == pytest.approx(r.heat_removed_J_per_kg, abs=tol), r
        assert q["latent"] == pytest.approx(r.latent_J_per_kg, rel=0.01), r


def test_missing_reference_package_fails_in_ci(monkeypatch):
    monkeypatch.setenv("CI", "true")
    assert in_ci()
    with pytest.raises(pytest.fail.Exception, match="CI: reference package 'no_such_reference_pkg'"):
        reference_package("no_such_reference_pkg")


def test_missing_reference_package_skips_loudly_outside_ci(monkeypatch):
    monkeypatch.delenv("CI", raising=False)
    with pytest.raises(pytest.skip.Exception, match="NOT RUN"):
        reference_package("no_such_reference_pkg")
    import reference_packages

    reference_packages.MISSING.discard("no_such_reference_pkg")  # not a real miss of this run
