"""Own solutes and ingredients: the library, recipe files that load or declare them, and a
solute fitted by ``colligate fit`` reaching a recipe file."""
from __future__ import annotations

import pathlib

import numpy as np
import pandas as pd
import pytest

import colligate as cg
from colligate import cli, fit
from colligate.recipe import RecipeError, load_recipe, parse_recipe
from colligate.units import kelvin_from_celsius

REFERENCE = pathlib.Path(__file__).resolve().parents[1] / "reference"
SUCROSE_MOLAR_MASS = 0.3422965  # kg/mol (IUPAC 2013 atomic weights; the built-in record's value)


def crc_sucrose() -> pd.DataFrame:
    """CRC Handbook sucrose freezing-point depressions (crc_concentrative), 2-30 wt%."""
    t = pd.read_csv(REFERENCE / "crc_freezing_points.csv")
    t = t[(t.solute == "sucrose") & t.mass_percent.between(2, 30)]
    assert set(t.source_key) == {"crc_concentrative"}
    return t


def lab_csv(tmp_path) -> pathlib.Path:
    """The CRC rows in a lab's own units: wt% and degC, named in the header."""
    t = crc_sucrose()
    path = tmp_path / "syrup.csv"
    pd.DataFrame({"mass_percent": t.mass_percent, "freezing_point_C": -t.depression_K}).to_csv(path, index=False)
    return path


def test_fitted_solute_in_a_recipe_file_equals_the_python_built_one(tmp_path, capsys):
    # colligate fit from wt% and degC columns, saved, loaded by a recipe file ...
    data = lab_csv(tmp_path)
    saved = tmp_path / "lab_syrup.toml"
    rc = cli.main(["fit", str(data), "--model", "norrish", "--molar-mass", str(SUCROSE_MOLAR_MASS),
                   "--save-solute", str(saved), "--name", "lab syrup", "--plot", str(tmp_path / "fit.png")])
    out = capsys.readouterr().out
    assert rc == cli.EXIT_OK, out
    assert "mass_percent -> molality" in out and "freezing_point_C -> freezing_point_K" in out
    recipe_path = tmp_path / "sorbet.toml"
    recipe_path.write_text(
        '[recipe]\nname = "lab sorbet"\n[library]\nload = ["lab_syrup.toml"]\n'
        '[composition]\nwater = 0.78\nlab_syrup = 0.22\n', encoding="utf-8")
    from_file = load_recipe(recipe_path)
    # ... and the same solute built in Python from the same numbers
    t = crc_sucrose()
    w = t.mass_percent.to_numpy() / 100.0
    m = w / ((1.0 - w) * SUCROSE_MOLAR_MASS)
    tf = np.array([kelvin_from_celsius(c) for c in -t.depression_K.to_numpy()])
    res = fit.fit_norrish(m, freezing_point=tf)
    lib = cg.SoluteLibrary([res.as_solute("lab syrup", molar_mass=SUCROSE_MOLAR_MASS)])
    s = cg.Solution(water=0.78, solutes={"lab_syrup": 0.22}, table=lib)
    assert from_file.freezing_point() == pytest.approx(cg.freezing_point(s), abs=1e-12)
    # the fit itself reproduces the CRC data it was given (printed to 0.01 K; max 0.05 K)
    assert np.max(np.abs(res.residuals)) < 0.05


def test_unknown_solute_fails_at_construction_with_nearest_names():
    with pytest.raises(RecipeError, match="unknown solute 'my syrup'.*nearest"):
        cg.Recipe(water=0.8, solutes={"my syrup": 0.2})
    with pytest.raises(RecipeError, match="unknown solute 'sucrse'.*sucrose"):
        cg.Recipe(water=0.8, solutes={"sucrse": 0.2})


def own_syrup() -> "fit.FittedSolute":
    """An invented solute (demo numbers): molar mass 0.3 kg/mol, Norrish K 5."""
    rec = cg._core.make_solute_record("house_syrup", "house syrup solids", 0.30, 5.0)
    return fit.FittedSolute(rec)


def test_recipe_with_a_library_of_own_solutes_and_ingredients():
    lib = cg.Library(solutes=[own_syrup()])
    lib.add_ingredient(cg.Ingredient(name="house base", water=0.7, sugars={"house_syrup": 0.3},
                                     source="invented for this test", solute_table=lib.solute_table))
    r = cg.Recipe(ingredients={"house base": 0.8, "sucrose": 0.2}, library=lib)
    assert r.solution().solutes == pytest.approx({"house_syrup": 0.24, "sucrose": 0.2})
    # identity: the recipe is the solution built by hand
    s = cg.Solution(water=0.56, solutes={"house_syrup": 0.24, "sucrose": 0.2}, table=lib.solute_table)
    assert r.freezing_point() == pytest.approx(cg.freezing_point(s), abs=1e-12)
    with pytest.raises(RecipeError, match="unknown ingredient 'house bse'.*house_base"):
        cg.Recipe(ingredients={"house bse": 1.0}, library=lib)
    with pytest.raises(RecipeError, match="unknown ingredient"):
        cg.Recipe(ingredients={"house base": 1.0})  # not in the built-in library


def test_library_round_trip_and_merge(tmp_path):
    lib = cg.Library(solutes=[own_syrup()])
    lib.add_ingredient(cg.Ingredient(name="house base", water=0.7, sugars={"house_syrup": 0.3},
                                     source="invented for this test", solute_table=lib.solute_table))
    path = lib.save(tmp_path / "house.toml")
    back = cg.Library.load(path)
    assert list(back.own_solutes) == ["house_syrup"] and list(back.own_ingredients) == ["house_base"]
    assert back.own_solutes["house_syrup"].record.norrish_k == 5.0
    assert back.ingredient("house base").sugars == {"house_syrup": 0.3}
    assert back.document() == lib.document()
    # merged with another library of its own
    other = cg.Library(ingredients=[cg.Ingredient(name="lime cordial", water=0.5, sugars={"sucrose": 0.5},
                                                  source="invented for this test")])
    both = back.merge(other)
    assert set(both.own_ingredients) == {"house_base", "lime_cordial"}
    assert "whole_milk" in both.ingredients  # the built-in ones stay


def test_name_clashes_name_both_entries(tmp_path):
    lib = cg.Library(solutes=[own_syrup()])
    path = lib.save(tmp_path / "a.toml")
    with pytest.raises(cg.LibraryError, match="house_syrup.*from .*a.toml.*already taken by solute 'house_syrup'"):
        cg.Library.load(path).merge(cg.Library.load(path))
    with pytest.raises(cg.LibraryError, match="'sucrose'.*already taken by solute 'sucrose' \\(built-in\\)"):
        cg.Library(solutes=[fit.FittedSolute(cg._core.make_solute_record("sucrose", "my sucrose", 0.34, 6.0))])
    with pytest.raises(cg.LibraryError, match="ingredient 'whole_milk'.*already taken by ingredient 'whole_milk' \\(built-in\\)"):
        cg.Library(ingredients=[cg.Ingredient(name="Whole Milk", key="whole_milk", water=0.9, fat=0.1,
                                              source="invented for this test")])


def test_recipe_file_declares_its_own_solutes_and_ingredients(tmp_path):
    text = """
[recipe]
name = "inline"
[library.solutes.house_syrup]
name = "house syrup solids"
molar_mass = 0.30
norrish_k = 5.0
[library.ingredients.house_base]
water = 0.7
sugars = { house_syrup = 0.3 }
source = "invented for this test"
[ingredients]
house_base = 0.8
sucrose = 0.2
"""
    r = parse_recipe(text, "inline.toml")
    lib = cg.Library(solutes=[own_syrup()])
    s = cg.Solution(water=0.56, solutes={"house_syrup": 0.24, "sucrose": 0.2}, table=lib.solute_table)
    assert r.freezing_point() == pytest.approx(cg.freezing_point(s), abs=1e-12)
    bad = text.replace("[library.solutes.house_syrup]", "[library.solutes.sucrose]")
    with pytest.raises(RecipeError, match="\\[library\\].*already taken by solute 'sucrose' \\(built-in\\)"):
        parse_recipe(bad, "bad.toml")
    missing = text.replace("[library.solutes.house_syrup]", '[library]\nload = ["missing.toml"]\n'
                           "[library.solutes.house_syrup]")
    with pytest.raises(RecipeError, match="\\[library\\]: .*missing.toml: file not found"):
        parse_recipe(missing, "x.toml")


def test_fit_asks_for_the_molar_mass_before_fitting(tmp_path, capsys):
    data = lab_csv(tmp_path)
    rc = cli.main(["fit", str(data), "--model", "norrish", "--plot", str(tmp_path / "f.png")])
    err = capsys.readouterr().err
    assert rc == cli.EXIT_ERROR and "--molar-mass" in err and "mass_percent" in err
    assert not (tmp_path / "f.png").exists()  # refused before fitting: nothing written
    molal = tmp_path / "m.csv"
    pd.DataFrame({"molality": [0.3, 0.6], "freezing_point_K": [272.5, 272.0]}).to_csv(molal, index=False)
    rc = cli.main(["fit", str(molal), "--model", "norrish", "--save-solute", str(tmp_path / "s.toml"),
                   "--plot", str(tmp_path / "g.png")])
    err = capsys.readouterr().err
    assert rc == cli.EXIT_ERROR and "--molar-mass" in err
    assert not (tmp_path / "g.png").exists()


def test_fit_from_lab_units_equals_fit_from_si(tmp_path, capsys):
    t = crc_sucrose()
    w = t.mass_percent.to_numpy() / 100.0
    m = w / ((1.0 - w) * SUCROSE_MOLAR_MASS)
    si = tmp_path / "si.csv"
    pd.DataFrame({"molality": m, "freezing_point_K": 273.15 - t.depression_K.to_numpy()}).to_csv(si, index=False)
    frac = tmp_path / "frac.csv"
    pd.DataFrame({"mass_fraction": w, "freezing_point_K": 273.15 - t.depression_K.to_numpy()}).to_csv(frac, index=False)
    outs = []
    for path in (si, frac, lab_csv(tmp_path)):
        assert cli.main(["fit", str(path), "--model", "norrish", "--molar-mass", str(SUCROSE_MOLAR_MASS),
                         "--plot", str(tmp_path / f"{path.stem}.png")]) == cli.EXIT_OK
        outs.append([ln for ln in capsys.readouterr().out.splitlines() if ln.startswith("norrish_k")])
    assert outs[0] == outs[1] == outs[2]


def test_fitted_effective_solute_brings_its_bound_water_into_a_recipe(tmp_path):
    # Identity (no literature value): an invented food of 80 % water whose solids act as one
    # solute of 0.12 kg/mol holding 0.2 kg water per kg; its ice curve from colligate itself.
    rec = cg._core.make_solute_record("demo_solids", "demo solids", 0.12, 0.0)
    t = cg._core.SoluteTable()
    t.add(rec)
    food = cg.Solution(water=0.8, solutes={"demo_solids": 0.2}, table=t)
    T = np.linspace(270.0, 245.0, 11)
    ice = cg.ice_fraction(food, T, bound_water_fraction_of_water=0.2 * 0.2 / 0.8)
    fs = fit.fit_effective_solute(0.8, temperature=T, ice_fraction=ice).as_solute("my food solids")
    path = cg.Library(solutes=[fs]).save(tmp_path / "food.toml")
    r = load_recipe(_write(tmp_path / "r.toml", '[recipe]\nname = "food"\n[library]\nload = ["food.toml"]\n'
                                                 '[composition]\nwater = 0.8\nmy_food_solids = 0.2\n'))
    lib = cg.SoluteLibrary([fs])
    s = cg.Solution(water=0.8, solutes={"my_food_solids": 0.2}, table=lib)
    share = lib.bound_water_fraction_of_water(s)
    assert share == pytest.approx(0.05, rel=1e-5)  # 0.2 kg/kg x 0.2 kg / 0.8 kg, as fitted
    assert r.bound_water_fraction_of_water == share
    assert r.freezing_point() == pytest.approx(cg.freezing_point(s, bound_water_fraction_of_water=share), abs=1e-12)
    assert path.endswith("food.toml")


def _write(path, text):
    path.write_text(text, encoding="utf-8")
    return path
