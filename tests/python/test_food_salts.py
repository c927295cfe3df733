"""Salts and acids of food against the CRC Handbook freezing points (issue 12).

Source of every check value: CRC Handbook of Chemistry and Physics, 102nd ed. (2021),
"Concentrative Properties of Aqueous Solutions" (after Wolf 1966), depressions printed to
0.01 K; the rows are in tests/reference/crc_freezing_points.csv (source_key
crc_concentrative), read from the public copy named in NOTES_reference_data.md.
"""
from __future__ import annotations

import sys
import warnings
from pathlib import Path

import numpy as np
import pandas as pd
import pytest

import colligate as cg
from colligate.recipe import load_recipe

T0 = 273.15  # 0 degC in kelvin, by definition of the Celsius scale (common practice)

# Worst deviation of the rows each solute's constants were fitted to, as printed by
# tools/fit_crc_norrish.py (and written in the record's note, builtin_solutes.inc). A
# held-out row may be off by that much plus 0.02 K, two printed digits (the project's
# held-out rule, tests/reference/tolerances.toml check crc_fitted_held_out).
FIT_ROW_WORST = {
    "sodium_acetate": 0.022, "trisodium_citrate": 0.205, "monosodium_phosphate": 0.030,
    "monopotassium_phosphate": 0.034, "dipotassium_phosphate": 0.057,
    "sodium_bicarbonate": 0.026, "potassium_bicarbonate": 0.060, "sodium_carbonate": 0.062,
    "potassium_carbonate": 0.079,
    "phosphoric_acid": 0.095,
}


def depression(solute: str, percent: float) -> float:
    return T0 - cg.freezing_point(cg.Solution.from_mass_fractions({solute: percent / 100}))


@pytest.mark.parametrize("solute", sorted(FIT_ROW_WORST))
def test_held_out_crc_rows(crc_freezing, solute):
    rows = crc_freezing[(crc_freezing.solute == solute) & (crc_freezing.used_in_fit == "no")
                        & ~crc_freezing.note.str.contains("beyond the fitted range")]
    assert len(rows) >= 3 and set(rows.source_key) == {"crc_concentrative"}
    dev = np.array([depression(solute, w) for w in rows.mass_percent]) - rows.depression_K.to_numpy()
    assert np.max(np.abs(dev)) <= FIT_ROW_WORST[solute] + 0.02, dict(zip(rows.mass_percent, dev.round(3)))


def test_potassium_acetate_held_out_melinder_rows():
    # Melinder (2010), potassium acetate freezing curve as CoolProp INCOMP::MKA carries it
    # (tests/reference/melinder_freezing_curves.csv): the 6, 8, ..., 24 wt% rows, held out of
    # the fit of the record's K and K3 (tools/fit_crc_norrish.py potassium_acetate: fit rows'
    # worst 0.075 K); limits of check melinder_potassium_acetate_norrish (plus 0.02 K).
    table = pd.read_csv(Path(__file__).resolve().parents[1] / "reference" / "melinder_freezing_curves.csv",
                        keep_default_na=False)
    rows = table[(table.solute == "potassium_acetate") & (table.used_in_fit == "no")]
    assert len(rows) == 10 and set(rows.source_key) == {"melinder_2010"}
    dev = np.array([-depression("potassium_acetate", w) for w in rows.mass_percent]) - rows.freezing_point_C.to_numpy()
    assert np.max(np.abs(dev)) <= 0.075 + 0.02, dict(zip(rows.mass_percent, dev.round(3)))
    # the same record by its other names, and the single-salt Pitzer row on the ice line agrees
    # with it within the two fits' worst deviations (0.075 K + 0.10 K) at 15 wt%
    s = cg.Solution.from_mass_fractions({"CH3COOK": 0.15})
    assert cg.freezing_point(s) == pytest.approx(T0 - depression("potassium_acetate", 15), abs=1e-12)
    pitzer = cg.single_salt_freezing_point("potassium_acetate", cg.single_salt_molality("potassium_acetate", 0.15))
    assert cg.freezing_point(s) == pytest.approx(pitzer.freezing_point_K.iloc[0], abs=0.175)
    # beyond the fitted 25 wt%: computed and flagged
    with pytest.warns(cg.OutOfValidityRangeWarning, match="potassium_acetate|potassium acetate"):
        cg.freezing_point(cg.Solution.from_mass_fractions({"potassium acetate": 0.30}))


def test_potassium_carbonate_against_melinder_not_used_in_its_fit():
    # Melinder (2010), potassium carbonate freezing curve as CoolProp INCOMP::MKC carries it
    # (tests/reference/melinder_freezing_curves.csv), 1-10 wt%: neither the effective Norrish
    # record nor the single-salt Pitzer row was fitted to it (both to the CRC rows to 10 wt%).
    # Limits (checks melinder_potassium_carbonate_norrish and _single_salt): each fit's worst
    # deviation from the CRC rows (0.080 K, 0.010 K) plus the spread between the two sources
    # where both give a row (|CRC - Melinder| up to 0.056 K, at 2 wt%), rounded up.
    ref = Path(__file__).resolve().parents[1] / "reference"
    mel = pd.read_csv(ref / "melinder_freezing_curves.csv", keep_default_na=False)
    mel = mel[mel.solute == "potassium_carbonate"]
    assert list(mel.mass_percent) == list(range(1, 11)) and set(mel.used_in_fit) == {"no"}
    crc = pd.read_csv(ref / "crc_freezing_points.csv", keep_default_na=False)
    crc = crc[crc.solute == "potassium_carbonate"].set_index("mass_percent")
    spread = max(abs(-crc.depression_K[p] - t) for p, t in zip(mel.mass_percent, mel.freezing_point_C))
    assert 0.05 < spread <= 0.056 + 5e-4
    norrish = np.array([-depression("potassium_carbonate", p) for p in mel.mass_percent])
    assert np.max(np.abs(norrish - mel.freezing_point_C.to_numpy())) <= 0.14
    m = cg.single_salt_molality("potassium_carbonate", mel.mass_percent.to_numpy() / 100.0)
    with warnings.catch_warnings():
        warnings.simplefilter("error", cg.OutOfValidityRangeWarning)  # all within the row's window
        pitzer = cg.single_salt_freezing_point("potassium_carbonate", m).freezing_point_K.to_numpy() - T0
    assert np.max(np.abs(pitzer - mel.freezing_point_C.to_numpy())) <= 0.07


def test_potassium_acetate_water_activity_at_25c_meets_may_2011():
    # An independent look at the record fitted on the ice line: at 25 C its water activity
    # against May et al.'s (2011) published 25 C Pitzer parameters (data/single_salt_pitzer.hpp,
    # fitted to osmotic data, not to freezing points), 5-25 wt%. 0.003: the usual stated
    # accuracy of a water-activity meter (common practice).
    for w in (0.05, 0.10, 0.15, 0.20, 0.25):
        m = cg.single_salt_molality("potassium_acetate", w)
        may = cg.single_salt_activity("potassium_acetate", m, T=298.15).water_activity.iloc[0]
        ours = cg.water_activity(cg.Solution.from_mass_fractions({"potassium_acetate": w}), 298.15)
        assert ours == pytest.approx(may, abs=0.003), w


def _fit_tool():
    import importlib.util
    path = Path(__file__).resolve().parents[2] / "tools" / "fit_crc_norrish.py"
    spec = importlib.util.spec_from_file_location("fit_crc_norrish", path)
    module = importlib.util.module_from_spec(spec)
    sys.modules.setdefault("fit_crc_norrish", module)  # its dataclass looks itself up there
    spec.loader.exec_module(module)
    return module


@pytest.mark.parametrize("solute", sorted(FIT_ROW_WORST) + ["potassium_acetate"])
def test_constants_and_their_covariance_are_what_the_fit_tool_gives(solute):
    # Provenance: rerunning tools/fit_crc_norrish.py's fit on the rows marked used_in_fit gives
    # the record's K and K3 (builtin_solutes.inc, to their 6 printed digits), the worst fit-row
    # deviation the held-out checks build on, and the covariance and degrees of freedom that
    # data/builtin_uncertainty.hpp states (potassium acetate: fitted to a correlation, "not stated").
    fit = _fit_tool().fit_solute(solute)
    rec = cg.SoluteLibrary().find(solute)
    fitted = [rec.norrish_k, rec.norrish_k3][:len(fit.constants)]
    np.testing.assert_allclose(fitted, [float("%.6g" % c) for c in fit.constants], rtol=1e-12)
    if solute == "potassium_acetate":
        assert rec.uncertainty is None and fit.worst_fit <= 0.075 + 5e-4
        return
    assert fit.worst_fit <= FIT_ROW_WORST[solute] + 5e-4
    u = rec.uncertainty
    assert u["source"] == "colligate_fit_crc" and u["degrees_of_freedom"] == fit.degrees_of_freedom
    assert u["names"] == ["norrish_k", "norrish_k3"][:len(fit.constants)]
    np.testing.assert_allclose(u["covariance"], fit.covariance, rtol=1e-5)
    # and it propagates: the freezing point of the salt at half its range carries a stated u
    w = 0.5 * rec.max_mass_fraction
    r = cg.freezing_point(cg.Solution.from_mass_fractions({solute: w}), with_uncertainty=True)
    assert r.std > 0.0 and r.not_stated == [] and r.degrees_of_freedom == fit.degrees_of_freedom


def test_sulfates_with_the_default_pitzer_set(crc_freezing):
    # No row fitted. 0.02 K: two printed digits (as the lactose check). Na2SO4 beyond 4 wt%
    # lies past the ice-mirabilite eutectic (metastable rows, not checked; CSV note).
    rows = crc_freezing[(crc_freezing.solute == "potassium_sulfate")
                        | ((crc_freezing.solute == "sodium_sulfate") & (crc_freezing.mass_percent <= 4))]
    assert len(rows) == 14 and set(rows.used_in_fit) == {"no"}
    for solute, w, dT in zip(rows.solute, rows.mass_percent, rows.depression_K):
        assert depression(solute, w) == pytest.approx(dT, abs=0.02), (solute, w)


@pytest.mark.parametrize("name, solute_id", [
    ("baking soda", "sodium_bicarbonate"), ("NaHCO3", "sodium_bicarbonate"),
    ("sodium citrate", "trisodium_citrate"), ("KH2PO4", "monopotassium_phosphate"),
    ("sodium dihydrogen phosphate", "monosodium_phosphate"), ("K2HPO4", "dipotassium_phosphate"),
    ("Sodium Acetate", "sodium_acetate"), ("orthophosphoric acid", "phosphoric_acid"),
    ("potassium hydrogen carbonate", "potassium_bicarbonate"), ("Na2CO3", "sodium_carbonate"),
    ("K2CO3", "potassium_carbonate"), ("E501", "potassium_carbonate"),
])
def test_found_by_common_name_and_formula(name, solute_id):
    # 0.5 wt%: each name must give the record's own freezing point.
    assert cg.freezing_point(cg.Solution.from_mass_fractions({name: 0.005})) == pytest.approx(
        cg.freezing_point(cg.Solution.from_mass_fractions({solute_id: 0.005})), abs=1e-12)


def test_table_lists_each_salt_with_its_source_and_range():
    table = cg.solutes()
    for solute in FIT_ROW_WORST:
        row = table.loc[solute]
        assert "colligate_fit_crc" in set(row.astype(str))
    # particles per formula unit: complete dissociation (common practice)
    assert table.loc["trisodium_citrate", "particles"] == 4
    assert table.loc["dipotassium_phosphate", "particles"] == 3
    assert table.loc["phosphoric_acid", "particles"] == 1


def test_beyond_the_fitted_range_is_flagged():
    # sodium acetate is validated to 8 wt% (its constants' fit range)
    s = cg.Solution.from_mass_fractions({"sodium acetate": 0.12})
    with pytest.warns(cg.OutOfValidityRangeWarning, match="sodium_acetate|sodium acetate"):
        cg.freezing_point(s)


def test_a_recipe_takes_the_salts_by_name(tmp_path: Path):
    # A pickle brine of our own invention (demo scenario, not published data).
    p = tmp_path / "brine.toml"
    p.write_text('[recipe]\nname = "invented pickle brine"\nbasis = "kg"\n\n[composition]\n'
                 'water = 0.95\n"sodium acetate" = 0.03\n"baking soda" = 0.02\n', encoding="utf-8")
    recipe = load_recipe(p)
    direct = cg.Solution.from_mass_fractions({"sodium_acetate": 0.03, "sodium_bicarbonate": 0.02})
    assert recipe.freezing_point() == pytest.approx(cg.freezing_point(direct), abs=1e-9)
