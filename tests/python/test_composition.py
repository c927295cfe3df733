"""Composition summary of a recipe, total solids without ethanol, % ABV, and the lactose
(sandiness) indicator."""
from __future__ import annotations

import pytest

import colligate as cg
from colligate.ingredients import MSNF_SPLIT, library
from colligate.recipe import load_demo_recipe
from colligate.report import build_report

#: OIML R 22 (1975), International Alcoholometric Tables: 40 %vol at 20 degC has a density of
#: 948.05 kg/m3; pure ethanol 789.24 kg/m3. Ethanol mass fraction of a 40 % ABV spirit:
#: 0.40 x 789.24 / 948.05 = 0.33300.
SPIRIT_40_ETHANOL = 0.40 * 789.24 / 948.05


def spirit_40() -> cg.Ingredient:
    return cg.Ingredient(name="neutral spirit 40 % ABV (test)", key="test_spirit_40", water=1.0 - SPIRIT_40_ETHANOL,
                         ethanol=SPIRIT_40_ETHANOL,
                         source="OIML R 22 (1975): 40 %vol = 948.05 kg/m3 at 20 C, ethanol 789.24 kg/m3")


def rows(recipe) -> dict:
    return {r["component"]: r for r in recipe.composition_summary()["components"]}


def test_abv_of_a_40_percent_spirit_is_reproduced():
    r = cg.Recipe(ingredients={"neutral spirit 40 % ABV (test)": 1.0}, library=cg.Library(ingredients=[spirit_40()]))
    # OIML R 22 table density, printed to 0.01 kg/m3: 40.0 % ABV to 0.1 % (abs 0.1)
    assert r.composition_summary()["ethanol_abv_percent"] == pytest.approx(40.0, abs=0.1)
    # the built-in 40 % spirit (its composition from the same table, to 4 decimals): same check
    built_in = cg.Recipe(ingredients={"spirit_40": 0.5})
    assert built_in.composition_summary()["ethanol_abv_percent"] == pytest.approx(40.0, abs=0.1)
    assert cg.alcohol_by_volume_20c(SPIRIT_40_ETHANOL, 1.0 - SPIRIT_40_ETHANOL) == pytest.approx(0.40, abs=1e-3)


def test_cocktail_total_solids_exclude_ethanol():
    lib = cg.Library(ingredients=[spirit_40()])
    r = cg.Recipe(ingredients={"test_spirit_40": 0.25, "sucrose": 0.15, "water": 0.60}, library=lib)
    by = rows(r)
    # total solids: the sucrose only (what stays after drying); ethanol reported apart
    assert by["total_solids"]["kg"] == pytest.approx(0.15, abs=1e-15)
    assert by["ethanol"]["kg"] == pytest.approx(0.25 * SPIRIT_40_ETHANOL, abs=1e-15)
    assert r.total_solids_fraction == pytest.approx(0.15, abs=1e-15)
    assert by["water"]["kg"] + by["total_solids"]["kg"] + by["ethanol"]["kg"] == pytest.approx(1.0, abs=1e-12)
    rep = build_report(r)
    assert rep["total_solids_mass_percent_of_batch"] == pytest.approx(15.0, abs=1e-12)
    assert rep["ethanol_mass_percent_of_batch"] == pytest.approx(25.0 * SPIRIT_40_ETHANOL, abs=1e-12)
    # dissolved solids of the water phase: sucrose over water + sucrose + ethanol
    assert rep["dissolved_solids_mass_percent_of_aqueous_phase"] == pytest.approx(15.0, abs=1e-12)
    # ABV of the water-ethanol part: 0.25 x 0.333 kg ethanol in 0.6 + 0.25 x 0.667 kg water
    p = 0.25 * SPIRIT_40_ETHANOL / (0.25 + 0.60)
    assert rep["ethanol_abv_percent_of_water_and_ethanol"] == pytest.approx(
        100.0 * p * cg.ethanol_water_density_20c(p) / 789.24, rel=1e-12)
    assert any("ethanol" in c for c in rep["cautions"])


def test_demo_composition_summary_adds_up_and_names_sources():
    r = load_demo_recipe("ice_cream")
    by = rows(r)
    lib = library()
    batch = r.total_mass
    # milk solids-not-fat and fat from the USDA entries of the library (their sources)
    msnf = sum(kg * lib[k].msnf for k, kg in r.ingredients.items())
    fat = sum(kg * lib[k].fat for k, kg in r.ingredients.items())
    assert by["msnf"]["kg"] == pytest.approx(msnf, rel=1e-12)
    assert by["fat"]["kg"] == pytest.approx(fat, rel=1e-12)
    assert by["lactose"]["kg"] == pytest.approx(MSNF_SPLIT["lactose"] * msnf, rel=1e-12)
    assert by["water"]["kg"] + by["total_solids"]["kg"] + by["ethanol"]["kg"] == pytest.approx(batch, rel=1e-12)
    parts = ("fat", "protein", "lactose", "other_sugars", "salts", "other_solids")
    assert sum(by[p]["kg"] for p in parts) == pytest.approx(by["total_solids"]["kg"], rel=1e-12)
    for src in by["msnf"]["sources"]:
        assert src["source"] == lib[src["ingredient"]].source and "USDA" in src["source"]
    assert r.composition_summary()["ethanol_abv_percent"] is None


def test_lactose_indicator_separates_mixes():
    # Hyde & Rothwell (1973): MSNF at most (100 - fat - sugars - E - S) / 7 % of the mix.
    demo = build_report(load_demo_recipe("ice_cream"))["indicators"]["lactose_in_solution"]
    assert demo["source"] == "hyde_rothwell_1973" and demo["at_risk"] is False
    # a mix loaded with skim milk powder (numbers of our own): 16 % powder, MSNF about 21 %
    heavy = cg.Recipe(ingredients={"whole_milk": 0.60, "skim_milk_powder": 0.16, "sucrose": 0.14,
                                   "cream_36": 0.10})
    ind = build_report(heavy)["indicators"]["lactose_in_solution"]
    assert ind["at_risk"] is True
    assert ind["msnf_mass_percent_of_batch"] > ind["max_msnf_mass_percent_of_batch"]
    by = rows(heavy)
    assert ind["max_msnf_mass_percent_of_batch"] == pytest.approx(
        100.0 * (by["water"]["kg"] + by["msnf"]["kg"]) / heavy.total_mass / 7.0, rel=1e-12)
    # a sorbet has no milk solids: no indicator at all
    assert build_report(load_demo_recipe("sorbet"))["indicators"]["lactose_in_solution"] is None
