"""Weak acids of food from Python: the constants table, the speciation and the freezing point
with dissociation (C++: tests/cpp/equilibria/test_weak_acid_dissociation.cpp)."""
from __future__ import annotations

import csv
import math
import pathlib

import pytest

import colligate as cg

REFERENCE = pathlib.Path(__file__).resolve().parents[2] / "tests" / "reference"


def molality(acid: str, w: float) -> float:
    return w / (cg.solutes().loc[acid, "molar_mass_kg_per_mol"] * (1.0 - w))


def test_weak_acids_table_names_its_sources():
    table = cg.weak_acids()
    assert set(table["acid"]) == {"acetic_acid", "lactic_acid", "citric_acid", "malic_acid"}
    for key in set(table["source"]) | set(k for k in table["norrish_k_source"] if k):
        cg.citation(key)  # raises for a key that does not resolve
    citric = table[table["acid"] == "citric_acid"].sort_values("step")
    # Bates & Pinching (1949): pK 3.128, 4.761, 6.396 at 25 C; abs 0.002 (printed digits).
    assert citric["pka_at_298_15_K"].tolist() == pytest.approx([3.128, 4.761, 6.396], abs=0.002)


def test_acetic_acid_degree_of_dissociation_by_hand():
    # By hand from pKa 4.756 (Harned & Ehlers 1933) without activity coefficients:
    # alpha = (-K + sqrt(K^2 + 4 K m)) / (2 m); water's own ions change it below 1e-8.
    for w in (0.01, 0.10):
        m = molality("acetic_acid", w)
        out = cg.acid_dissociation("acetic_acid", m, 298.15, activity="ideal")
        k = 10.0 ** -out["pka"][0]
        alpha = (-k + math.sqrt(k * k + 4.0 * k * m)) / (2.0 * m)
        assert out["degree_of_dissociation"] == pytest.approx(alpha, rel=1e-8)
        assert sum(out["fractions"]) == pytest.approx(1.0, abs=1e-14)
        # Activity coefficients below 1 raise the dissociation.
        assert cg.acid_dissociation("acetic_acid", m)["degree_of_dissociation"] > alpha


def test_brine_background_is_flagged():
    # A cheese brine's ionic strength (about 3-5 mol/kg) is far beyond the Debye-Hueckel
    # term alone (0.1 mol/kg): computed, with a warning.
    with pytest.warns(cg.OutOfValidityRangeWarning, match="ionic strength"):
        out = cg.acid_dissociation("lactic_acid", 0.05, 285.15, background_ionic_strength=3.0)
    assert 0.0 < out["degree_of_dissociation"] < 1.0
    assert out["temperature_function"] is False  # lactic acid: 25 C pKa at every T


def test_bad_input_names_the_input():
    with pytest.raises(cg.InvalidInputError, match="acid = 'vinegar'.*acetic_acid"):
        cg.acid_dissociation("vinegar", 0.1)
    with pytest.raises(cg.InvalidInputError, match="molality"):
        cg.acid_dissociation("acetic_acid", -0.1)
    with pytest.raises(cg.InvalidInputError, match="activity = 'davies'"):
        cg.acid_dissociation("acetic_acid", 0.1, activity="davies")
    with pytest.raises(cg.InvalidInputError, match="malic_acid.*no Norrish constant"):
        cg.acid_freezing_point("malic_acid", 0.1)


@pytest.mark.parametrize("acid", ["acetic_acid", "lactic_acid", "citric_acid"])
def test_freezing_point_with_dissociation_on_held_out_crc_rows(acid):
    # CRC Handbook (2021) concentrative properties, rows with used_in_fit = no; tolerance:
    # the fit rows' worst deviation (weak_acids(), from tools/fit_weak_acid_norrish.py)
    # plus 0.02 K for two printed digits.
    row = cg.weak_acids().query("acid == @acid").iloc[0]
    with open(REFERENCE / "crc_freezing_points.csv", newline="") as fh:
        rows = [r for r in csv.DictReader(fh) if r["solute"] == acid and r["used_in_fit"] == "no"]
    assert len(rows) >= 8
    worst = row["norrish_k_fit_worst_deviation_K"]
    for r in rows:
        out = cg.acid_freezing_point(acid, molality(acid, float(r["mass_percent"]) / 100.0))
        assert out["converged"]
        assert out["norrish_k_undissociated"] == row["norrish_k_undissociated"]
        assert 273.15 - out["temperature_K"] == pytest.approx(float(r["depression_K"]),
                                                              abs=worst + 0.02)


def test_freezing_point_beyond_the_checked_rows_warns():
    # 40 wt% acetic acid lies above the highest CRC row that checks it (36 wt%).
    with pytest.warns(cg.OutOfValidityRangeWarning, match="molality"):
        out = cg.acid_freezing_point("acetic_acid", molality("acetic_acid", 0.40))
    assert out["reason"]
