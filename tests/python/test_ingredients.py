"""Ingredient library, milk solids, ingredient-based recipes and the thermal API."""

from __future__ import annotations

import csv
import math
import os
import tomllib
import warnings
from pathlib import Path

import numpy as np
import pytest

import colligate as cg
from colligate import cli
from colligate.ingredients import MSNF_SPLIT, Ingredient, IngredientError, ingredient, library
from colligate.recipe import Recipe, RecipeError, load_recipe

ZERO_C_K = 273.15  # scale definition (common practice)


def quiet(fn, *args, **kwargs):
    """Call fn, returning (value, warning messages) without failing on validity warnings."""
    with warnings.catch_warnings(record=True) as caught:
        warnings.simplefilter("always")
        value = fn(*args, **kwargs)
    assert all(issubclass(w.category, cg.OutOfValidityRangeWarning) for w in caught)
    return value, [str(w.message) for w in caught]


# ----------------------------------------------------------------- library


def test_every_library_ingredient_names_its_source_and_sums_to_one():
    df = cg.ingredients()
    assert len(df) >= 30
    assert df["source"].map(lambda s: len(s) > 10).all()
    for key, ing in library().items():
        assert ing.total() == pytest.approx(1.0, abs=0.021), key  # table rounding (common practice)
        assert ing.key == key


def test_msnf_split_adds_up():
    # lactose 54.5 % (Goff & Hartel 2013), protein 3.2/8.99 and salts 0.89/8.99 (Leighton 1927)
    assert sum(MSNF_SPLIT.values()) == pytest.approx(1.0, abs=1e-3)


def test_unknown_ingredient_lists_nearest_names():
    with pytest.raises(IngredientError, match="nearest names: whole_milk"):
        ingredient("whole milkk")


@pytest.mark.parametrize(
    "kwargs, fragment",
    [
        ({"water": 0.5, "fat": 1.2}, "fat = 1.2"),
        ({"water": 0.8, "fat": 0.3}, "sum to 1.1"),
        ({"water": 0.9, "sugars": {"sucrose": -0.1}}, "sugars['sucrose']"),
        ({"water": 0.9, "sugars": {"sucrosse": 0.1}}, "sucrose"),
    ],
)
def test_bad_ingredients_name_the_field(kwargs, fragment):
    with pytest.raises(IngredientError, match=".*") as info:
        Ingredient("bad", **kwargs)
    assert fragment in str(info.value)


# ----------------------------------------------------------------- milk solids


def test_cows_milk_freezes_at_minus_0_55():
    # Leighton (1927), J. Dairy Sci. 10, 300: average milk (after Van Slyke) fat 3.9,
    # MSNF 8.99, water 87.11 %; freezing point -0.55 C (also common practice in dairy
    # testing). Tolerance 0.03 K.
    milk = Ingredient("Leighton's average milk", water=0.8711, fat=0.039, msnf=0.0899, source="Leighton 1927")
    r = Recipe(ingredients={milk: 1.0})
    assert r.freezing_point() - ZERO_C_K == pytest.approx(-0.55, abs=0.03)
    # the library's whole milk too (USDA composition, from memory)
    assert Recipe(ingredients={"whole_milk": 1.0}).freezing_point() - ZERO_C_K == pytest.approx(-0.55, abs=0.03)


def test_ice_cream_mix_freezing_point_and_ice_at_minus_18():
    # Mix of 12 % fat, 11 % MSNF, 15 % sucrose, 0.3 % stabiliser, 61.7 % water: initial
    # freezing point about -2.5 C (Goff & Hartel 2013 by Leighton's method; dairy texts give
    # -2.5 to -3.0 C for such mixes; from memory).
    mix = Ingredient("mix", water=0.617, fat=0.12, msnf=0.11, sugars={"sucrose": 0.15}, other_solids=0.003)
    r = Recipe(ingredients={mix: 1.0})
    assert -3.0 <= r.freezing_point() - ZERO_C_K <= -2.5
    # Ice at -18 C. The figure "70-75 % of the water frozen" belongs to serving and
    # display temperatures, not to -18 C: Goff & Hartel (2013), Ice Cream, 7th ed., Table
    # 6.2 (their worked mix, 40 % total solids) puts 70 % at -10.79 C, 75 % at -13.16 C and
    # 80 % at -16.61 C, so more than 80 % at -18 C; their method (Leighton 1927 with their
    # Table 6.1) gives this mix 83.5 % at -18 C (beyond the end of the table, extrapolated)
    # and 75.0 % at -12 C. The model gives 79.7 % and 72.6 % (0.4 g of water per g protein
    # counted as unable to freeze); the test below checks it against Table 6.2 itself.
    # Checked: 77-84 % at -18 C, 70-75 % at -12 C, and within 5 points of the dairy method
    # (achieved 3.8 at -18 C, 2.4 at -12 C).
    f18, messages = quiet(r.ice_fraction, ZERO_C_K - 18.0)
    assert 0.77 <= f18 <= 0.84
    # lactose is counted as sucrose (the dairy texts' method), whose range covers the unfrozen
    # phase of such a mix at -18 C: no warning about lactose's range any more
    assert not any("lactose" in m for m in messages)
    f12, _ = quiet(r.ice_fraction, ZERO_C_K - 12.0)
    assert 0.70 <= f12 <= 0.75
    dairy18, notes18 = quiet(r.leighton_ice_fraction, ZERO_C_K - 18.0)
    dairy12, notes12 = quiet(r.leighton_ice_fraction, ZERO_C_K - 12.0)
    assert abs(f18 - dairy18) <= 0.05 and abs(f12 - dairy12) <= 0.05
    assert any("beyond the end" in m for m in notes18)  # past Table 6.1: extrapolated
    assert not notes12  # -12 C is inside the table


# Goff & Hartel (2013), Ice Cream, 7th ed., ch. 6, Table 6.2: percent of the water frozen
# against the freezing-point depression for their Example Problem 13 mix (10 % MSNF, 2 %
# whey solids, 12 % sucrose, 4 % 42DE corn syrup solids, 60 % water; 12 % fat makes up the
# rest), read in a public reproduction of that section
# (tests/reference/goff_hartel_ice_cream_freezing_curve.csv; its rows and tolerances in
# tests/reference/tolerances.toml, shared with the validation gallery and the C++ suite).
_REFERENCE = Path(__file__).resolve().parents[1] / "reference"
with open(_REFERENCE / "goff_hartel_ice_cream_freezing_curve.csv", encoding="utf-8", newline="") as _fh:
    _GOFF_HARTEL = list(csv.DictReader(_fh))
GOFF_HARTEL_TABLE_6_2 = [(float(r["percent_of_water_frozen"]), float(r["depression_K"])) for r in _GOFF_HARTEL]


def _goff_hartel_tolerance(check_id):
    """Rows (percent frozen) and the constant tolerance of a check of tolerances.toml."""
    with open(_REFERENCE / "tolerances.toml", "rb") as fh:
        entry = next(e for e in tomllib.load(fh)["check"] if e["id"] == check_id)
    return float(entry["tolerance"]), entry.get("rows", "")


def test_ice_curve_vs_goff_hartel_worked_freezing_curve():
    # Whey solids: lactose 76.5 % (Goff & Hartel 2013) and milk salts 0.099 as in MSNF;
    # 42DE corn syrup solids: DP1 19, DP2 14, DP3 12, DP4+ 55 % (the profile of the
    # library's glucose_syrup_de42; from memory). The model counts 0.4 g water per g protein
    # as unable to freeze, which the dairy method does not; achieved: 1.2-2.5 points below
    # the table at every row. Tolerance 3 points of the water.
    css = {"glucose": 0.19 * 0.04, "maltose": 0.14 * 0.04, "maltotriose": 0.12 * 0.04,
           "higher_saccharides": 0.55 * 0.04}
    mix = Ingredient("Goff & Hartel example mix", water=0.60, fat=0.12, msnf=0.10,
                     sugars={"sucrose": 0.12, "lactose": 0.765 * 0.02, **css},
                     salts={"milk_salts": 0.099 * 0.02}, protein=0.02 * (1 - 0.765 - 0.099))
    r = Recipe(ingredients={mix: 1.0})
    # Example Problem 13: initial freezing point -2.74 C. Tolerance 0.1 K.
    assert r.freezing_point() - ZERO_C_K == pytest.approx(-2.74, abs=0.1)
    model_tolerance, _ = _goff_hartel_tolerance("ice_cream_goff_hartel")  # 3 points
    for percent, depression in GOFF_HARTEL_TABLE_6_2:
        f, _ = quiet(r.ice_fraction, ZERO_C_K - depression)
        assert 100.0 * f == pytest.approx(percent, abs=model_tolerance), (percent, depression)
    # The dairy method itself reproduces the table (rows to 75 % inside Table 6.1): 0.5 point.
    dairy_tolerance, rows = _goff_hartel_tolerance("ice_cream_dairy_method")
    assert rows == "percent_of_water_frozen <= 75"
    for percent, depression in GOFF_HARTEL_TABLE_6_2[:-1]:
        f, _ = quiet(r.leighton_ice_fraction, ZERO_C_K - depression)
        assert 100.0 * f == pytest.approx(percent, abs=dairy_tolerance), (percent, depression)


# ----------------------------------------------------------------- recipes

ICE_CREAM = """\
[recipe]
name = "Test ice cream"
basis = "percent"

[ingredients]
whole_milk = 55
cream_36 = 22
skim_milk_powder = 5
sucrose = 15
dextrose = 2.7
stabiliser = 0.3
"""


def test_ingredient_recipe_from_toml(tmp_path):
    p = tmp_path / "ic.toml"
    p.write_text(ICE_CREAM, encoding="utf-8")
    r = Recipe.from_toml(p)
    assert r.ingredient_based
    assert r.total_mass == pytest.approx(1.0, abs=1e-9)
    assert set(r.ingredients) == {"whole_milk", "cream_36", "skim_milk_powder", "sucrose", "dextrose", "stabiliser"}
    assert sum(r.proximate.values()) == pytest.approx(1.0, abs=0.01)
    tf, _ = quiet(r.freezing_point)
    assert -4.0 < tf - ZERO_C_K < -1.5
    aw, _ = quiet(r.water_activity, 298.15)
    assert 0.9 < aw < 1.0


@pytest.mark.parametrize(
    "old, new, fragments",
    [
        ("whole_milk = 55", "whole_milk = -55", ("[ingredients].whole_milk = -55", ">= 0")),
        ("whole_milk = 55", "whole_milk = 50", ("add up to 95", "100")),
        ("whole_milk = 55", "whole_mlik = 55", ("whole_mlik", "nearest names", "whole_milk")),
    ],
)
def test_bad_ingredient_recipes(tmp_path, old, new, fragments):
    p = tmp_path / "bad.toml"
    p.write_text(ICE_CREAM.replace(old, new), encoding="utf-8")
    with pytest.raises(RecipeError) as info:
        load_recipe(p)
    for frag in fragments:
        assert frag in str(info.value)


def test_bad_recipe_leaves_existing_outputs_untouched(tmp_path, capsys):
    p = tmp_path / "bad.toml"
    p.write_text(ICE_CREAM.replace("whole_milk = 55", "whole_mlik = 55"), encoding="utf-8")
    plot = tmp_path / "out.png"
    plot.write_bytes(b"previous")
    code = cli.main(["report", str(p), "--plot", str(plot)])
    _, err = capsys.readouterr()
    assert code == 2 and "nearest names" in err
    assert plot.read_bytes() == b"previous"
    assert sorted(os.listdir(tmp_path)) == ["bad.toml", "out.png"]


def test_cli_report_of_ingredient_recipe(tmp_path, capsys):
    p = tmp_path / "ic.toml"
    p.write_text(ICE_CREAM, encoding="utf-8")
    code = cli.main(["report", str(p), "--plot", str(tmp_path / "ic.png")])
    out, err = capsys.readouterr()
    assert code == 0, err
    assert "Test ice cream" in out and "Heat to remove" in out
    assert out.rstrip().split("\nCautions\n")[1]
    assert (tmp_path / "ic.png").read_bytes()[:4] == b"\x89PNG"


# ----------------------------------------------------------------- thermal API


def sucrose_food():
    comp = {"water": 0.8, "carbohydrate": 0.2}
    return comp, cg.Solution.from_mass_fractions({"sucrose": 0.2})


def test_enthalpy_reference_and_continuity():
    comp, s = sucrose_food()
    h_ref, _ = quiet(cg.enthalpy, comp, s, 233.15)
    assert h_ref == pytest.approx(0.0, abs=1e-9)  # reference state
    tf = cg.freezing_point(s)
    # continuous at the freezing point: < 1 J/kg over 2e-7 K
    assert cg.enthalpy(comp, s, tf - 1e-7) == pytest.approx(cg.enthalpy(comp, s, tf + 1e-7), abs=1.0)


def test_apparent_specific_heat_is_dh_dt():
    comp, s = sucrose_food()
    T = np.array([240.0, 255.0, 268.0, 290.0])
    h = 1e-3
    numeric = (quiet(cg.enthalpy, comp, s, T + h)[0] - quiet(cg.enthalpy, comp, s, T - h)[0]) / (2 * h)
    # central difference, smooth away from the kinks: rel 1e-4
    np.testing.assert_allclose(quiet(cg.apparent_specific_heat, comp, s, T)[0], numeric, rtol=1e-4)


def test_heat_load_parts():
    comp, s = sucrose_food()
    q = cg.heat_load(comp, s, 293.15, 255.15)
    assert q["sensible"] + q["latent"] == pytest.approx(q["total"], rel=1e-12)
    assert q["latent"] > q["sensible"] > 0
    with pytest.raises(ValueError, match="233.15-313.15 K"):
        cg.heat_load(comp, s, 293.15, 200.0)
    with pytest.raises(ValueError, match="composition.fat"):
        cg.enthalpy({"water": 0.8, "fat": 1.5}, s, 260.0)


def test_chen_frozen_specific_heat_matches_the_ashrae_table():
    # ASHRAE Handbook - Refrigeration (2006) ch. 9 Table 3, row Broccoli: water 90.69 %,
    # initial freezing point -0.6 C, specific heat below freezing 1.82 kJ/(kg K)
    # (tests/reference/ashrae_food_properties.csv); the column is Chen (1985) at -40 C.
    c = cg.frozen_specific_heat_chen(0.9069, 1 - 0.9069, 273.15 - 0.6, 273.15 - 40.0)
    assert c == pytest.approx(1820.0, rel=0.05)
    with pytest.raises(cg.InvalidInputError, match="below the initial freezing point"):
        cg.frozen_specific_heat_chen(0.9, 0.1, 272.5, 273.0)
