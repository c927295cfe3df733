"""The food data tables read from the core (sweetness, lactose solubility) and their use
in the report indicators."""
from __future__ import annotations

import numpy as np
import pytest

import colligate as cg
from colligate.recipe import parse_recipe
from colligate.report import build_report

ZERO_C_K = 273.15  # scale definition (common practice)


def test_sweetness_table_rows_name_resolving_sources():
    df = cg.sweetness_table()
    assert {"relative_sweetness", "source", "note"} <= set(df.columns)
    for sid, row in df.iterrows():
        assert cg.citation(row["source"])["key"] == row["source"], sid
        cg.Solution(water=1.0, solutes={sid: 0.0})  # every row is a known solute id


def test_sweetness_values_match_bender():
    s = cg.sweetness_table()["relative_sweetness"]
    # Bender, A Dictionary of Food and Nutrition, entry "sweeteners" (sucrose = 100)
    assert s["sucrose"] == 1.0
    assert s["fructose"] == pytest.approx(1.73, abs=1e-12)
    assert s["glucose"] == pytest.approx(0.74, abs=1e-12)
    assert s["maltose"] == pytest.approx(0.33, abs=1e-12)
    assert s["lactose"] == pytest.approx(0.16, abs=1e-12)


def test_lactose_solubility_matches_hudson_and_converts_for_display():
    table = cg.lactose_solubility_table()
    assert list(table.columns) == ["temperature", "solubility", "source", "note"]
    for key in set(table["source"]):
        assert cg.citation(key)["key"] == key
    # Hudson's values in Lowe, Experimental Cookery, g per 100 g water at 0, 15, 25, 39 C
    for t_c, g_per_100g in [(0.0, 11.9), (15.0, 16.9), (25.0, 21.6), (39.0, 31.5)]:
        assert cg.lactose_solubility(ZERO_C_K + t_c) == pytest.approx(g_per_100g / 100.0, rel=1e-12)
    t = ZERO_C_K + np.array([-18.0, 20.0, 50.0])
    got = cg.lactose_solubility(t)
    assert isinstance(got, np.ndarray) and got.shape == (3,)
    # below 0 C the 0 C value; halfway 15-25 C; above 39 C the 39 C value (same source)
    assert got == pytest.approx([0.119, (0.169 + 0.216) / 2.0, 0.315], rel=1e-12)
    with pytest.raises(ValueError, match="temperature"):
        cg.lactose_solubility(-5.0)


def test_report_indicators_read_the_core_tables():
    r = parse_recipe(
        """
[recipe]
name = "sweetness check"
[composition]
water = 0.6
sucrose = 0.2
fructose = 0.1
lactose = 0.1
"""
    )
    rep = build_report(r)  # warnings are recorded in the report, not issued again
    # lactose counts as sucrose (the dairy texts' method), checked to 42 wt%: no range warning
    assert not any("lactose" in w["message"] for w in rep["warnings"])
    ind = rep["indicators"]
    # sucrose 1 and fructose 1.73, lactose 0.16 (Bender) over a 1 kg batch
    assert ind["sweetness_sucrose_equivalent_mass_percent_of_batch"] == pytest.approx(
        100.0 * (0.2 + 0.173 + 0.016), rel=1e-12)
    # no milk solids-not-fat in a solute recipe: no lactose indicator (its rule is about MSNF)
    assert ind["lactose_in_solution"] is None
    for row in ind["unfrozen_phase"]:
        assert row["lactose_g_per_100g_unfrozen_water"] > 10.0  # 0.1 kg lactose in < 0.6 kg water


def test_salt_caution_follows_the_solute_table_kind():
    kinds = cg.solutes()["kind"]
    salt = next(k for k, v in kinds.items() if v == "electrolyte")
    rep = build_report(cg.Solution(water=1.0, solutes={salt: 0.03}))
    assert any("contains salt" in c for c in rep["cautions"])
    sweet = build_report(cg.Solution(water=1.0, solutes={"sucrose": 0.2}))
    assert not any("contains salt" in c for c in sweet["cautions"])
