"""The formulator's workbench: the temperature for an ice fraction, per-ingredient
contributions, recipes side by side, what-if copies, units at the edges and recipe errors
reported all at once."""
from __future__ import annotations

import json
import math
import warnings
from pathlib import Path

import jsonschema
import numpy as np
import pytest

import colligate as cg
from colligate import cli
from colligate.compare import (
    compare_recipes,
    comparison_schema,
    format_comparison_json,
    format_comparison_text,
    plot_comparison,
)
from colligate.contributions import CONTRIBUTION_COLUMNS, contributions, contributions_entry
from colligate.ingredients import Ingredient
from colligate.plot import plot_contributions, plot_ice_curve
from colligate.recipe import NAMED_TEMPERATURES, RecipeError, SuspectUnitWarning, parse_recipe
from colligate.report import build_report, format_text
from colligate.units import parse_temperature

T0 = 273.15
PNG_MAGIC = b"\x89PNG\r\n\x1a\n"


def quiet(fn, *args, **kwargs):
    """Call fn, returning (value, messages) of the validity warnings it raised."""
    with warnings.catch_warnings(record=True) as caught:
        warnings.simplefilter("always")
        value = fn(*args, **kwargs)
    assert all(issubclass(w.category, cg.OutOfValidityRangeWarning) for w in caught), \
        [str(w.message) for w in caught]
    return value, [str(w.message) for w in caught]


SORBET = """\
[recipe]
name = "Lime sorbet A"
kind = "sorbet"
basis = "percent"

[composition]
water = 70
sucrose = 22
glucose = 7.5
citric_acid = 0.5
"""

SORBET_B = SORBET.replace("Lime sorbet A", "Lime sorbet B").replace("sucrose = 22", "sucrose = 17").replace(
    "glucose = 7.5", "glucose = 12.5")


# ----------------------------------------------------------------- temperature for an ice fraction


def test_round_trip_ice_fraction_temperature_ice_fraction():
    # Identity: the solver inverts the ice curve to 1e-9 in the ice fraction.
    s = cg.Solution.from_mass_fractions({"sucrose": 0.2, "glucose": 0.05})
    targets = np.array([0.1, 0.4, 0.7, 0.75])
    temps = cg.temperature_for_ice_fraction(s, targets)
    assert temps.shape == targets.shape
    assert np.all(np.diff(temps) < 0)  # more ice, colder
    back = cg.ice_fraction(s, temps)
    assert np.max(np.abs(back - targets)) < 1e-9
    t = cg.temperature_for_ice_fraction(s, 0.7)
    assert isinstance(t, float)
    assert abs(cg.ice_fraction(s, t) - 0.7) < 1e-9
    # the prepared curve answers the same (one curve, same solver)
    curve = cg.IceCurve(s)
    t2, reason = curve.temperature_for_ice_fraction(0.7)
    assert t2 == t and reason == ""


def test_recipe_temperature_for_ice_fraction_uses_its_bound_water():
    r = cg.Recipe(water=0.7, solutes={"sucrose": 0.25}, bound_water_fraction_of_water=0.07)
    t = r.temperature_for_ice_fraction(0.6)
    assert abs(r.ice_fraction(t) - 0.6) < 1e-9  # identity
    assert t < cg.temperature_for_ice_fraction(r.solution(), 0.6)  # less water free to freeze


def test_dairy_mix_75_percent_frozen_within_1_K_of_goff_hartel():
    # Goff & Hartel (2013), Ice Cream, 7th ed., ch. 6, Example Problem 13 / Table 6.2: their
    # worked mix (10 % MSNF, 2 % whey solids, 12 % sucrose, 4 % 42DE corn syrup solids, 60 %
    # water, 12 % fat) has 75 % of its water frozen at -13.16 C by Leighton's method. The
    # method counts no water as unable to freeze, so neither does this comparison.
    # Tolerance 1 K: a named limitation, the method's sucrose-equivalence factors and its
    # milk-salt term approximate the activity model (the same basis as the C++ check in
    # tests/cpp/equilibria/test_ice_fraction_temperature.cpp).
    css = {"glucose": 0.19 * 0.04, "maltose": 0.14 * 0.04, "maltotriose": 0.12 * 0.04,
           "higher_saccharides": 0.55 * 0.04}
    mix = Ingredient("Goff & Hartel example mix", water=0.60, fat=0.12, msnf=0.10,
                     sugars={"sucrose": 0.12, "lactose": 0.765 * 0.02, **css},
                     salts={"milk_salts": 0.099 * 0.02}, protein=0.02 * (1 - 0.765 - 0.099))
    r = cg.Recipe(ingredients={mix: 1.0}, bound_water_fraction_of_water=0.0)
    t75, _ = quiet(r.temperature_for_ice_fraction, 0.75)
    assert t75 - T0 == pytest.approx(-13.16, abs=1.0)
    # and the project's dairy method agrees with the book at that temperature (0.5 point)
    f, _ = quiet(r.leighton_ice_fraction, T0 - 13.16)
    assert f == pytest.approx(0.75, abs=0.005)


def test_unreachable_fractions_name_the_reachable_range():
    brine = cg.Solution.from_mass_fractions({"NaCl": 0.05})
    with pytest.raises(ValueError, match=r"ice_fraction = 0\.95.*not reachable.*final eutectic.*hydrohalite"):
        cg.temperature_for_ice_fraction(brine, 0.95)
    s = cg.Solution.from_mass_fractions({"sucrose": 0.2})
    with pytest.raises(ValueError, match="not a percentage"):
        cg.temperature_for_ice_fraction(s, 70)
    with pytest.raises(ValueError, match="never exceed"):
        cg.temperature_for_ice_fraction(s, 0.9, bound_water_fraction_of_water=0.25)
    # the curve's span is available to show before asking
    span = cg.IceCurve(brine).reachable_ice()
    assert 0.0 < span["largest_ice_fraction"] < 0.95 and "eutectic" in span["end"]


# ----------------------------------------------------------------- contributions


def test_contribution_shares_add_up_to_the_recipe():
    r = cg.recipe.load_demo_recipe("ice_cream")
    df, _ = quiet(contributions, r)
    assert tuple(df.columns) == CONTRIBUTION_COLUMNS
    totals = df.attrs
    # identities: each share column adds up to the recipe's whole (rel 1e-12)
    assert df["depression_K"].sum() == pytest.approx(totals["depression_K"], rel=1e-12)
    assert df["depression_K"].sum() == pytest.approx(T0 - quiet(r.freezing_point)[0], rel=1e-12)
    assert df["sweetness_sucrose_equivalent_kg"].sum() == pytest.approx(
        totals["sweetness_sucrose_equivalent_kg"], rel=1e-12)
    assert df["liquid_water_held_kg"].sum() == pytest.approx(totals["liquid_water_held_kg"], rel=1e-12)
    assert df["ice_from_its_water_kg"].sum() == pytest.approx(totals["ice_kg"], rel=1e-12)
    assert df["depression_percent"].sum() == pytest.approx(100.0, rel=1e-12)
    # sweetness of sucrose itself is its mass (sucrose = 1 by the scale's definition)
    assert df.loc["sucrose", "sweetness_sucrose_equivalent_kg"] == pytest.approx(0.125, rel=1e-12)
    # the gum stabiliser dissolves nothing: no share of the depression or sweetness
    assert df.loc["stabiliser", "depression_K"] == 0.0
    assert df.loc["stabiliser", "sweetness_percent"] == 0.0
    # temperature: the recipe's serving temperature
    assert totals["temperature_K"] == r.temperatures["serving"]


def test_contributions_of_an_ideal_dilute_solution_barely_interact():
    # For ideal dilute solutes the depressions add (common practice: colligative
    # additivity); the interaction factor stays within 1 % of 1 at 5 wt% solids.
    r = cg.Recipe(water=0.95, solutes={"glucose": 0.025, "sucrose": 0.025}, model="ideal")
    df, _ = quiet(contributions, r, T0 - 0.5)
    assert abs(df.attrs["interaction"] - 1.0) < 0.01
    # glucose (half the molar mass of sucrose) carries about twice the depression
    assert df.loc["glucose", "depression_K"] / df.loc["sucrose", "depression_K"] == pytest.approx(1.9, rel=0.02)


def test_contributions_in_report_and_plot(tmp_path):
    r = parse_recipe(SORBET, "sorbet.toml")
    rep, _ = quiet(build_report, r)
    entry = rep["contributions"]
    assert entry["named"] == "scooping"  # a sorbet's own named temperature
    assert {row["ingredient"] for row in entry["rows"]} == {"water", "sucrose", "glucose", "citric_acid"}
    assert sum(row["depression_K"] for row in entry["rows"]) == pytest.approx(entry["totals"]["depression_K"])
    text = format_text(rep)
    assert "What each ingredient does" in text and "How the shares are counted" in text
    json.dumps(rep, allow_nan=False)
    out = quiet(plot_contributions, r, tmp_path / "c.png")[0]
    assert Path(out).read_bytes()[:8] == PNG_MAGIC
    assert contributions_entry(r, "drawing")["named"] == "drawing"
    with pytest.raises(ValueError, match="not a named temperature"):
        contributions(r, "serving_hall")


# ----------------------------------------------------------------- side by side


def test_comparison_of_two_recipes_validates_against_its_schema(tmp_path):
    a = parse_recipe(SORBET, "a.toml")
    b = parse_recipe(SORBET_B, "b.toml")
    cmp_, _ = quiet(compare_recipes, [a, b])
    jsonschema.validate(json.loads(format_comparison_json(cmp_)), comparison_schema())
    assert [e["name"] for e in cmp_["recipes"]] == ["Lime sorbet A", "Lime sorbet B"]
    # B swaps 5 points of sucrose for glucose: more particles, colder freezing point
    assert cmp_["differences"][0]["freezing_point_K"] < 0
    assert cmp_["recipes"][0]["freezing_point_K"] == pytest.approx(a.freezing_point(), abs=0)
    # the temperature for 70 % frozen is the solver's (identity)
    t70 = cmp_["recipes"][1]["temperature_for_ice"][1]
    assert t70["ice_fraction"] == 0.7 and t70["temperature_K"] == pytest.approx(
        b.temperature_for_ice_fraction(0.7), abs=1e-9)
    assert cmp_["cautions"] and "verify" in " ".join(cmp_["cautions"]).lower()
    text = format_comparison_text(cmp_, fahrenheit=True)
    assert "Lime sorbet A" in text and "70 % of water frozen" in text and "°F" in text
    # a schema violation is caught (the schema is not vacuous)
    broken = json.loads(format_comparison_json(cmp_))
    broken["recipes"][0]["water_activity_25C"] = 1.5
    with pytest.raises(jsonschema.ValidationError):
        jsonschema.validate(broken, comparison_schema())
    png, _ = quiet(plot_comparison, [a, b], tmp_path / "both.svg", fahrenheit=True)
    assert Path(png).read_text(encoding="utf-8").lstrip().startswith("<?xml")


def test_comparison_needs_two_recipes():
    a = parse_recipe(SORBET, "a.toml")
    with pytest.raises(ValueError, match="at least two"):
        compare_recipes([a])
    with pytest.raises(ValueError, match="0.7 not 70"):
        compare_recipes([a, a], ice_fractions=[70])


def test_side_by_side_command(tmp_path, capsys):
    pa, pb = tmp_path / "a.toml", tmp_path / "b.toml"
    pa.write_text(SORBET, encoding="utf-8")
    pb.write_text(SORBET_B, encoding="utf-8")
    code = cli.main(["side-by-side", str(pa), str(pb), "--json", "--at", "-10C", "--at", "5F",
                     "--frozen", "0.6", "--plot", str(tmp_path / "cmp.png")])
    out, err = capsys.readouterr()
    assert code == 0, err
    data = json.loads(out)
    jsonschema.validate(data, comparison_schema())
    assert data["temperatures_K"] == pytest.approx([263.15, (5 + 459.67) * 5 / 9], abs=1e-12)
    assert data["ice_fractions"] == [0.6]
    assert (tmp_path / "cmp.png").read_bytes()[:8] == PNG_MAGIC
    code = cli.main(["side-by-side", str(pa), str(pb)])
    out, err = capsys.readouterr()
    assert code == 0 and "Lime sorbet B" in out and "Cautions" in out


def test_plot_extension_refused_before_computing(tmp_path, capsys, monkeypatch):
    pa = tmp_path / "a.toml"
    pa.write_text(SORBET, encoding="utf-8")
    import colligate.compare as compare_module

    def boom(*a, **k):  # computing would be a failure of the check
        raise AssertionError("computed before the plot path was checked")

    monkeypatch.setattr(compare_module, "compare_recipes", boom)
    code = cli.main(["side-by-side", str(pa), str(pa), "--plot", str(tmp_path / "cmp.xyz")])
    _, err = capsys.readouterr()
    assert code == 2 and "'.xyz' is not a file type matplotlib can write" in err
    code = cli.main(["report", str(pa), "--plot", str(tmp_path / "curve.docx")])
    _, err = capsys.readouterr()
    assert code == 2 and ".docx" in err
    with pytest.raises(ValueError, match="no extension"):
        plot_ice_curve(cg.Solution.from_mass_fractions({"sucrose": 0.2}), tmp_path / "curve")


# ----------------------------------------------------------------- what if


def test_with_changes_copies_and_changes():
    base = cg.recipe.load_demo_recipe("ice_cream")
    changed = base.with_changes({"sucrose": 0.10, "dextrose": None, "honey": 0.02}, name="less sugar")
    assert base.ingredients["sucrose"] == pytest.approx(0.125)  # the original is unchanged
    assert changed.ingredients["sucrose"] == 0.10 and "dextrose" not in changed.ingredients
    assert changed.ingredients["honey"] == 0.02 and changed.name == "less sugar"
    # bound water followed the protein in the original, so it does in the copy (0.4 kg/kg;
    # Schwartzberg 1976 as ASHRAE, from memory)
    # as a share of the copy's water
    protein_kg = changed.proximate["protein"] * changed.total_mass
    assert changed.bound_water_fraction_of_water == pytest.approx(0.4 * protein_kg / changed.water, rel=1e-12)
    with pytest.raises(RecipeError) as info:
        base.with_changes({"sucrse": 0.1, "cream_36": -1.0}, remove=["butter"])
    msg = str(info.value)
    assert "sucrose" in msg and "-1.0" in msg and "butter" in msg  # all three problems at once
    solutes = cg.Recipe(water=0.7, solutes={"sucrose": 0.2, "glucose": 0.1})
    copy = solutes.with_changes({"Sucrose": 0.25, "NaCl": 0.01}, remove=["glucose"])
    assert copy.solutes == {"sucrose": 0.25, "NaCl": 0.01} and copy.water == 0.7


# ----------------------------------------------------------------- recipe files: units, kinds, errors


def test_all_problems_of_a_recipe_are_reported_at_once():
    text = """\
[recipe]
name = "many problems"
basis = "kg"
[composition]
water = 0.7
sucrose = -0.1
sugarr = 0.1
glucose = "lots"
[temperatures_celsius]
serving = -99
[options]
model = "magic"
"""
    with pytest.raises(RecipeError) as info:
        parse_recipe(text, "bad.toml")
    msg = str(info.value)
    assert msg.startswith("recipe 'bad.toml': 5 problems: (1) ")
    for fragment in ("[composition].sucrose = -0.1", "[composition].glucose = 'lots'", "sugarr",
                     "[temperatures_celsius].serving = -99", "[options].model = 'magic'"):
        assert fragment in msg, fragment


@pytest.mark.parametrize("second", ['"Sucrose"', '"sucrose "', "SUCROSE", '"su crose"'])
def test_keys_differing_only_by_case_or_spaces_are_an_error(second):
    text = f'[recipe]\nname = "d"\n[composition]\nwater = 0.8\nsucrose = 0.1\n{second} = 0.1\n'
    with pytest.raises(RecipeError, match="duplicate of 'sucrose'"):
        parse_recipe(text, "dup.toml")


def test_two_names_of_one_solute_are_an_error():
    text = '[recipe]\nname = "d"\n[composition]\nwater = 0.8\nNaCl = 0.01\n"sodium chloride" = 0.01\n'
    with pytest.raises(RecipeError, match=r"same solute \(sodium_chloride\)"):
        parse_recipe(text, "dup.toml")


def test_amounts_in_grams_and_temperatures_in_fahrenheit_or_kelvin():
    text = """\
[recipe]
name = "grams"
basis = "g"
[composition]
water = 700
sucrose = 250
[temperatures_fahrenheit]
drawing = 23
serving = 10
storage = 0
"""
    r = parse_recipe(text, "g.toml")
    assert r.water == pytest.approx(0.7, abs=1e-15) and r.solutes["sucrose"] == pytest.approx(0.25, abs=1e-15)
    # 10 degF = -12.22 C; 0 degF = -17.78 C (definition of the scales)
    assert r.temperatures["serving"] == pytest.approx((10 + 459.67) * 5 / 9, abs=1e-12)
    assert r.temperatures["storage"] == pytest.approx(459.67 * 5 / 9, abs=1e-12)
    k = parse_recipe(text.replace("fahrenheit", "kelvin").replace("23", "268.15").replace(
        "= 10", "= 261.15").replace("= 0\n", "= 255.15\n"), "k.toml")
    assert k.temperatures["serving"] == 261.15
    with pytest.raises(RecipeError, match="one table only"):
        parse_recipe(text + "[temperatures_celsius]\nserving = -12\n", "two.toml")


def test_named_temperatures_follow_the_kind_of_product():
    brine = parse_recipe('[recipe]\nname = "b"\nkind = "brine"\n[composition]\nwater = 0.9\nNaCl = 0.1\n', "b")
    assert set(brine.temperatures) == set(NAMED_TEMPERATURES["brine"]) == {"working", "lowest_use"}
    with pytest.raises(RecipeError, match="allowed keys are lowest_use, working"):
        parse_recipe('[recipe]\nname = "b"\nkind = "brine"\n[composition]\nwater = 0.9\nNaCl = 0.1\n'
                     "[temperatures_celsius]\nserving = -5\n", "b")
    with pytest.raises(RecipeError, match="must be one of ice_cream, sorbet"):
        parse_recipe('[recipe]\nname = "b"\nkind = "gelato"\n[composition]\nwater = 0.9\nsucrose = 0.1\n', "b")


def test_fahrenheit_looking_celsius_draws_a_warning():
    text = ('[recipe]\nname = "ic"\n[composition]\nwater = 0.7\nsucrose = 0.3\n'
            "[temperatures_celsius]\nserving = 10\n")
    with pytest.warns(SuspectUnitWarning, match=r"serving temperature \+10 degC .*10 degF = -12\.2 degC"):
        parse_recipe(text, "ic.toml")
    # a brine may well be worked above 0 C: no warning
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        parse_recipe('[recipe]\nname = "b"\nkind = "brine"\n[composition]\nwater = 0.9\nNaCl = 0.05\n'
                     "[temperatures_celsius]\nworking = 4\n", "b")


def test_parse_temperature_typed_at_the_edge():
    # scale definitions (common practice)
    assert parse_temperature("-12") == pytest.approx(261.15, abs=1e-12)
    assert parse_temperature("-12 °C") == pytest.approx(261.15, abs=1e-12)
    assert parse_temperature("32F") == pytest.approx(273.15, abs=1e-12)
    assert parse_temperature("261.15 K") == 261.15
    with pytest.raises(ValueError, match="not a number"):
        parse_temperature("cold")


# ----------------------------------------------------------------- new ingredients


def test_vinegar_freezes_like_the_crc_acetic_acid_rows():
    # Vinegar (USDA SR NDB 02053, acetic acid taken as 5.16 g/100 g): acetic acid at 5.16 wt%
    # of the liquid; the CRC Handbook (102nd ed.) gives 1.58 K at 5 wt% and 1.90 K at 6 wt%,
    # 1.63 K by linear interpolation. Tolerance 0.1 K (the fit's 0.04 K plus the 0.04 %
    # glucose and rounding).
    r = cg.Recipe(ingredients={"vinegar": 1.0})
    assert T0 - r.freezing_point() == pytest.approx(1.58 + 0.16 * (1.90 - 1.58), abs=0.1)


@pytest.mark.parametrize("key", ["vinegar", "acetic_acid", "lime_juice", "whole_egg", "dark_chocolate",
                                 "maple_syrup", "red_wine", "white_wine", "spirit_43", "spirit_45",
                                 "spirit_47", "spirit_50", "honey", "invert_sugar", "lemon_juice", "egg_yolk",
                                 "cocoa_powder", "spirit_40"])
def test_workbench_ingredients_are_in_the_library(key):
    # Each entry names its source and its fractions add up to 1 within the library's
    # rounding allowance (USDA tables print 0.01 g/100 g); in water it freezes below 0 C.
    from colligate.ingredients import SUM_TOLERANCE, ingredient

    ing = ingredient(key)
    assert cg.ingredients().loc[key, "source"]
    assert abs(ing.total() - 1.0) <= SUM_TOLERANCE
    r = cg.Recipe(ingredients={key: 0.1, "water": 0.9})
    tf, _ = quiet(r.freezing_point)
    assert tf < T0


# ----------------------------------------------------------------- formulating on ingredient amounts


def _base_mix():
    return cg.Recipe(ingredients={"whole_milk": 0.60, "cream_36": 0.20, "sucrose": 0.12, "dextrose": 0.03,
                                  "skim_milk_powder": 0.05})


def test_solve_recipe_meets_targets_on_ingredient_amounts():
    from colligate.formulate import solve_recipe

    base = _base_mix()
    tf0, _ = quiet(base.freezing_point)
    target = tf0 - 0.3
    res, _ = quiet(solve_recipe, base, {"sucrose": (0.05, 0.25), "dextrose": (0.0, 0.10)},
                   {"freezing_point": target})
    assert res.success, res.message
    # identity: the solved recipe, rechecked through the scalar path, meets the target
    tf, _ = quiet(res.recipe.freezing_point)
    assert abs(tf - target) <= 1e-3
    assert 0.05 <= res.amounts["sucrose"] <= 0.25 and 0.0 <= res.amounts["dextrose"] <= 0.10
    assert res.recipe.ingredients["whole_milk"] == 0.60  # the rest is held fixed


def test_solve_recipe_names_the_blocking_bound_and_checks_units():
    from colligate.formulate import solve_recipe

    base = _base_mix()
    res, _ = quiet(solve_recipe, base, {"sucrose": (0.05, 0.15)}, {"freezing_point": 263.15})
    assert not res.success
    assert "sucrose at its upper bound 0.15 kg" in res.message and "not reached" in res.message
    with pytest.raises(ValueError, match="looks like degC or degF, not K"):
        solve_recipe(base, {"sucrose": (0.05, 0.15)}, {"freezing_point": -3})
    with pytest.raises(ValueError, match="0.7, not 70"):
        solve_recipe(base, {"sucrose": (0.05, 0.15)}, {"ice_fraction": (255.15, 70)})
    with pytest.raises(ValueError, match="unknown target 'freezing_pt'"):
        solve_recipe(base, {"sucrose": (0.05, 0.15)}, {"freezing_pt": 270.0})
    with pytest.raises(ValueError, match=r"need 0 <= low <= high"):
        solve_recipe(base, {"sucrose": (0.2, 0.1)}, {"freezing_point": 270.0})


def test_solute_formulation_solver_checks_units_too():
    from colligate.design import solve_formulation

    with pytest.raises(ValueError, match="looks like degC or degF, not K"):
        solve_formulation({"sucrose": (0.1, 0.3)}, {"freezing_point": -3})
    with pytest.raises(ValueError, match="0.7, not 70"):
        solve_formulation({"sucrose": (0.1, 0.3)}, {"ice_fraction": (255.15, 70)})


def test_report_command_writes_contributions_plot_and_fahrenheit_csv(tmp_path, capsys):
    p = tmp_path / "a.toml"
    p.write_text(SORBET, encoding="utf-8")
    code = cli.main(["report", str(p), "--contributions-plot", str(tmp_path / "who.png"),
                     "--csv", str(tmp_path / "t.csv"), "--json"])
    out, err = capsys.readouterr()
    assert code == 0, err
    data = json.loads(out)
    assert set(data["files"]) == {"contributions_png", "table_csv"}
    assert (tmp_path / "who.png").read_bytes()[:8] == PNG_MAGIC
    import pandas as pd

    table = pd.read_csv(tmp_path / "t.csv")
    # degF = degC * 9/5 + 32 (definition of the scales), every row
    assert np.allclose(table["temperature_F"], table["temperature_C"] * 1.8 + 32.0, atol=1e-9)


def test_ingredient_problems_are_reported_at_once():
    with pytest.raises(RecipeError) as info:
        cg.Recipe(ingredients={"whole milk": -1.0, "suggar": 0.1, "cream_36": 0.2, "lemon jiuce": 0.1})
    msg = str(info.value)
    assert "3 problems" in msg and "-1.0" in msg and "suggar" in msg and "lemon jiuce" in msg
    assert "nearest names" in msg  # unknown names list the nearest ones
    text = ('[recipe]\nname = "d"\n[ingredients]\nsucrose = 0.1\n"sucrose (white sugar)" = 0.1\n'
            "whole_milk = 0.8\n")
    with pytest.raises(RecipeError, match=r"same ingredient \(sucrose\)"):
        parse_recipe(text, "dup.toml")


def test_solute_formulation_solver_names_the_blocking_bound():
    from colligate.design import solve_formulation

    # 10-15 % sucrose cannot freeze at -10 C (CRC Handbook: 15 wt% sucrose depresses the
    # freezing point by about 0.9 K)
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        res = solve_formulation({"sucrose": (0.10, 0.15)}, {"freezing_point": T0 - 10.0})
    assert not res.success
    assert "target freezing_point" in res.message and "sucrose at its upper bound 0.15" in res.message


def test_comparison_keeps_ethanol_out_of_the_solids():
    # OIML R 22 (1975): a 40 %vol spirit is 33.30 g ethanol per 100 g (the spirit_40 entry);
    # 0.15 kg of it in a 1 kg batch is 4.995 % ethanol by mass, and none of it counts as
    # dissolved solids.
    r = cg.Recipe(ingredients={"spirit_40": 0.15, "sucrose": 0.12, "water": 0.73}, kind="frozen_cocktail")
    cmp_, _ = quiet(compare_recipes, [r, r.with_changes({"spirit_40": 0.10, "water": 0.78})])
    jsonschema.validate(cmp_, comparison_schema())
    first = cmp_["recipes"][0]
    assert first["ethanol_mass_percent"] == pytest.approx(4.995, abs=1e-9)
    assert first["dissolved_solids_mass_percent"] == pytest.approx(12.0, abs=1e-9)
    assert "ethanol (% of batch, by mass)" in format_comparison_text(cmp_)
