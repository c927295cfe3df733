"""Tests for colligate.recipe: the TOML recipe format and its error messages."""

from __future__ import annotations

import math
from pathlib import Path

import pytest

import colligate as cg
from colligate.recipe import (
    DEFAULT_DEMO_SCENARIO,
    DEFAULT_TEMPERATURES_C,
    DEMO_SCENARIOS,
    Recipe,
    RecipeError,
    SuspectUnitWarning,
    demo_recipe_text,
    load_demo_recipe,
    load_recipe,
    parse_recipe,
)
from colligate.units import (
    celsius_from_kelvin,
    fahrenheit_from_kelvin,
    kelvin_from_celsius,
    kelvin_from_fahrenheit,
)

# 0 degC = 273.15 K exactly, by definition of the Celsius scale (common practice).
ZERO_C_K = 273.15

GOOD = """\
[recipe]
name = "Test syrup"
note = "plain sugar syrup"
basis = "kg"

[composition]
water = 0.80
sucrose = 0.20

[temperatures_celsius]
drawing = -4.5
serving = -11
storage = -20

[options]
model = "auto"
bound_water_fraction_of_water = 0.0125
"""


def write(tmp_path: Path, text: str, name: str = "r.toml") -> Path:
    p = tmp_path / name
    p.write_text(text, encoding="utf-8")
    return p


def replace(text: str, old: str, new: str) -> str:
    assert old in text, old
    return text.replace(old, new)


def expect_error(tmp_path: Path, text: str, *fragments: str, name: str = "r.toml") -> str:
    p = write(tmp_path, text, name)
    with pytest.raises(RecipeError) as info:
        load_recipe(p)
    msg = str(info.value)
    assert msg.startswith(f"recipe '{p}':"), msg
    for frag in fragments:
        assert frag in msg, f"{frag!r} not in {msg!r}"
    return msg


# ----------------------------------------------------------------- units


def test_units_points_and_round_trip():
    # Scale definitions (common practice): 0 degC = 273.15 K, 32 degF = 273.15 K,
    # -40 degC = -40 degF.
    assert kelvin_from_celsius(0.0) == ZERO_C_K
    assert celsius_from_kelvin(ZERO_C_K) == 0.0
    assert math.isclose(fahrenheit_from_kelvin(ZERO_C_K), 32.0, abs_tol=1e-12)
    assert math.isclose(fahrenheit_from_kelvin(kelvin_from_celsius(-40.0)), -40.0, abs_tol=1e-12)
    assert math.isclose(kelvin_from_fahrenheit(32.0), ZERO_C_K, abs_tol=1e-12)
    for c in (-60.0, -18.0, 0.0, 25.0, 100.0):
        assert math.isclose(celsius_from_kelvin(kelvin_from_celsius(c)), c, abs_tol=1e-12)


@pytest.mark.parametrize("bad", [float("nan"), float("inf"), -1.0, 0.0, "warm", None, True])
def test_units_reject_bad_kelvin(bad):
    with pytest.raises(ValueError, match="temperature"):
        celsius_from_kelvin(bad)
    with pytest.raises(ValueError, match="temperature"):
        fahrenheit_from_kelvin(bad)


def test_units_reject_below_absolute_zero_celsius():
    with pytest.raises(ValueError, match="absolute zero"):
        kelvin_from_celsius(-300.0)


# ----------------------------------------------------------------- good recipes


def test_load_good_recipe(tmp_path):
    r = load_recipe(write(tmp_path, GOOD))
    assert isinstance(r, Recipe)
    assert r.name == "Test syrup"
    assert r.note == "plain sugar syrup"
    assert r.water == pytest.approx(0.80, abs=1e-15)
    assert r.solutes == {"sucrose": pytest.approx(0.20, abs=1e-15)}
    assert r.model == "auto"
    assert r.bound_water_fraction_of_water == 0.0125
    # temperatures are kelvin inside (SI); offset 273.15 K (common practice)
    assert r.temperatures["drawing"] == pytest.approx(-4.5 + ZERO_C_K, abs=1e-12)
    assert r.temperatures["serving"] == pytest.approx(-11 + ZERO_C_K, abs=1e-12)
    assert r.temperatures["storage"] == pytest.approx(-20 + ZERO_C_K, abs=1e-12)
    s = r.solution()
    assert s.water == pytest.approx(0.80, abs=1e-12)
    assert sum(s.solutes.values()) == pytest.approx(0.20, abs=1e-12)


def test_optional_tables_take_defaults(tmp_path):
    text = '[recipe]\nname = "x"\n[composition]\nwater = 1.0\nglucose = 0.1\n'
    r = load_recipe(write(tmp_path, text))
    assert r.model == "auto"
    assert r.bound_water_fraction_of_water == 0.0
    assert r.basis == "kg"
    for key, c in DEFAULT_TEMPERATURES_C.items():
        assert r.temperatures[key] == pytest.approx(c + ZERO_C_K, abs=1e-12)


def test_percent_basis(tmp_path):
    text = """\
[recipe]
name = "percent"
basis = "percent"
batch_kg = 2.0
[composition]
water = 70
sucrose = 25
glucose = 5
[options]
bound_water_fraction_of_water = 0.02
"""
    r = load_recipe(write(tmp_path, text))
    assert r.water == pytest.approx(1.40, abs=1e-12)
    assert r.solutes["sucrose"] == pytest.approx(0.50, abs=1e-12)
    assert r.solutes["glucose"] == pytest.approx(0.10, abs=1e-12)
    assert r.bound_water_fraction_of_water == 0.02  # a share of the water: the basis does not scale it
    assert r.total_mass == pytest.approx(2.0, abs=1e-12)


def test_percent_basis_within_tolerance(tmp_path):
    text = '[recipe]\nname = "p"\nbasis = "percent"\n[composition]\nwater = 80.005\nsucrose = 20\n'
    r = load_recipe(write(tmp_path, text))
    assert r.total_mass == pytest.approx(1.00005, abs=1e-12)


def test_formula_and_common_names_pass_through(tmp_path):
    text = '[recipe]\nname = "brine"\n[composition]\nwater = 0.9\nNaCl = 0.05\ndextrose = 0.05\n'
    r = load_recipe(write(tmp_path, text))
    s = r.solution()
    assert set(s.solutes) == {"sodium_chloride", "glucose"}


@pytest.mark.parametrize("scenario", list(DEMO_SCENARIOS))
def test_demo_recipe_is_packaged_and_labelled(scenario):
    text = demo_recipe_text(scenario)
    assert "invented demo scenario" in text.lower()
    r = load_demo_recipe(scenario)
    assert "invented demo scenario" in r.label.lower()
    assert r.water > 0
    assert {"sucrose", "glucose", "fructose", "citric_acid"} <= set(r.solutes)
    assert set(r.temperatures) == {"drawing", "serving", "storage"}
    r.solution()


def test_default_demo_is_an_ingredient_based_ice_cream():
    r = load_demo_recipe()
    assert DEFAULT_DEMO_SCENARIO == "ice_cream"
    assert r.ingredient_based
    # built from library ingredients: dairy, sugars, a syrup, a stabiliser and fruit
    assert {"whole_milk", "cream_36", "skim_milk_powder", "sucrose", "dextrose",
            "glucose_syrup_de42", "stabiliser", "strawberry_puree"} <= set(r.ingredients)
    assert r.total_mass == pytest.approx(1.0, abs=1e-9)  # percent basis, batch_kg = 1
    assert r.proximate["fat"] > 0 and r.proximate["protein"] > 0
    assert load_demo_recipe("sorbet").name != r.name


def test_unknown_demo_scenario():
    with pytest.raises(RecipeError, match="ice_cream, sorbet"):
        load_demo_recipe("gelato")


def test_parse_recipe_from_text_uses_source_name():
    with pytest.raises(RecipeError, match=r"^recipe 'my text': \[composition\]\.water"):
        parse_recipe('[recipe]\nname = "x"\n[composition]\nsucrose = 1\n', "my text")


def test_recipe_error_is_library_input_error():
    assert issubclass(RecipeError, cg.InvalidInputError)
    assert issubclass(RecipeError, ValueError)


# ----------------------------------------------------------------- malformed recipes


def test_missing_file(tmp_path):
    p = tmp_path / "nope.toml"
    with pytest.raises(RecipeError, match=r"nope\.toml.*file not found"):
        load_recipe(p)


def test_directory_is_not_a_recipe(tmp_path):
    with pytest.raises(RecipeError, match="directory"):
        load_recipe(tmp_path)


def test_not_utf8(tmp_path):
    p = tmp_path / "latin1.toml"
    p.write_bytes('[recipe]\nname = "cr\xe8me"\n'.encode("latin-1"))
    with pytest.raises(RecipeError, match="UTF-8"):
        load_recipe(p)


def test_toml_syntax_error_gives_line(tmp_path):
    text = replace(GOOD, "sucrose = 0.20", "sucrose = = 0.20")
    msg = expect_error(tmp_path, text, "TOML syntax error")
    assert "line 8" in msg


@pytest.mark.parametrize("table", ["recipe", "composition"])
def test_missing_required_table(tmp_path, table):
    start = GOOD.index(f"[{table}]")
    end = GOOD.index("\n\n", start)
    text = GOOD[:start] + GOOD[end:]
    expect_error(tmp_path, text, f"[{table}]", "missing table")


def test_missing_name(tmp_path):
    expect_error(tmp_path, replace(GOOD, 'name = "Test syrup"\n', ""), "[recipe].name", "missing")


def test_empty_name(tmp_path):
    expect_error(tmp_path, replace(GOOD, 'name = "Test syrup"', 'name = "  "'), "[recipe].name", "non-empty")


@pytest.mark.parametrize(
    "old,new,where",
    [
        ('basis = "kg"', 'basis = "kg"\ncolour = "red"', "[recipe].colour"),
        ('model = "auto"', 'model = "auto"\nstrict = true', "[options].strict"),
        ("storage = -20", "storage = -20\nhardening = -30", "[temperatures_celsius].hardening"),
        ("[options]", "[extras]\nx = 1\n[options]", "[extras]"),
    ],
)
def test_unknown_keys_are_rejected(tmp_path, old, new, where):
    expect_error(tmp_path, replace(GOOD, old, new), where, "unknown")


@pytest.mark.parametrize(
    "value",
    ['"a lot"', "true", "-3", "-0.001", "nan", "inf", "-inf", "[0.1, 0.2]", "{ kg = 0.2 }"],
)
def test_bad_amounts(tmp_path, value):
    msg = expect_error(tmp_path, replace(GOOD, "sucrose = 0.20", f"sucrose = {value}"), "[composition].sucrose")
    assert ">= 0" in msg or "number" in msg


def test_negative_amount_message_has_range(tmp_path):
    msg = expect_error(tmp_path, replace(GOOD, "sucrose = 0.20", "sucrose = -3"), "[composition].sucrose = -3")
    assert "finite and >= 0 (kg)" in msg


def test_unknown_solute_lists_nearest_names(tmp_path):
    msg = expect_error(tmp_path, replace(GOOD, "sucrose = 0.20", "sucrse = 0.20"), "[composition]", "sucrse")
    # the library's message lists the nearest known names
    assert "sucrose" in msg


def test_no_water(tmp_path):
    expect_error(tmp_path, replace(GOOD, "water = 0.80\n", ""), "[composition].water", "missing", "> 0")


def test_zero_water(tmp_path):
    expect_error(tmp_path, replace(GOOD, "water = 0.80", "water = 0"), "[composition].water", "> 0")


def test_percent_not_summing_to_100(tmp_path):
    text = '[recipe]\nname = "p"\nbasis = "percent"\n[composition]\nwater = 70\nsucrose = 20\n'
    expect_error(tmp_path, text, "[composition]", "90", "100 +/- 0.01")


def test_bad_basis(tmp_path):
    expect_error(tmp_path, replace(GOOD, 'basis = "kg"', 'basis = "grams"'), "[recipe].basis", '"kg", "g" or "percent"')


def test_batch_kg_only_with_percent(tmp_path):
    expect_error(tmp_path, replace(GOOD, 'basis = "kg"', 'basis = "kg"\nbatch_kg = 2'), "[recipe].batch_kg", "percent")


@pytest.mark.parametrize("value", ["-61", "40.5", "-100", '"cold"', "nan"])
def test_temperature_out_of_range(tmp_path, value):
    expect_error(tmp_path, replace(GOOD, "serving = -11", f"serving = {value}"), "[temperatures_celsius].serving", "-60", "+40")


def test_temperature_range_edges_are_accepted(tmp_path):
    text = replace(replace(GOOD, "storage = -20", "storage = -60"), "drawing = -4.5", "drawing = 40")
    # accepted, but +40 C for a frozen product looks like degF typed as degC: a warning
    with pytest.warns(SuspectUnitWarning, match="drawing temperature"):
        r = load_recipe(write(tmp_path, text))
    assert r.temperatures["storage"] == pytest.approx(-60 + ZERO_C_K, abs=1e-12)


def test_unknown_model(tmp_path):
    msg = expect_error(tmp_path, replace(GOOD, 'model = "auto"', 'model = "magic"'), "[options].model", "magic")
    for m in cg.models():
        assert m in msg


@pytest.mark.parametrize("value", ["-0.1", "1.0", "5", "nan", '"some"'])
def test_bad_bound_water(tmp_path, value):
    expect_error(tmp_path, replace(GOOD, "bound_water_fraction_of_water = 0.0125",
                                   f"bound_water_fraction_of_water = {value}"),
                 "[options].bound_water_fraction_of_water")


def test_old_bound_water_key_is_refused(tmp_path):
    # the kg meaning was dropped: one meaning everywhere, the share of the water
    expect_error(tmp_path, replace(GOOD, "bound_water_fraction_of_water = 0.0125", "bound_water = 0.01"),
                 "[options].bound_water")


def test_input_file_is_not_modified_by_loading(tmp_path):
    p = write(tmp_path, GOOD)
    before = p.read_bytes()
    load_recipe(p)
    assert p.read_bytes() == before


def test_same_solute_under_two_names(tmp_path):
    text = replace(GOOD, "sucrose = 0.20", "NaCl = 0.01\nsodium_chloride = 0.01")
    expect_error(tmp_path, text, "[composition]", "sodium_chloride")
