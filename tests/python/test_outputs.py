"""Product-developer outputs: brine eutectics in the report, the ice/enthalpy table (CSV),
and the enthalpy and cooling-curve plots."""

from __future__ import annotations

import csv
import json
import math
import os
import warnings
from pathlib import Path

import numpy as np
import pytest

import colligate as cg
from colligate.recipe import load_demo_recipe, parse_recipe
from colligate.report import (
    TABLE_COLUMNS,
    VERIFY_NOTE,
    build_report,
    format_json,
    format_text,
    ice_enthalpy_table,
    write_table_csv,
)

ZERO_C_K = 273.15  # scale definition (common practice)
PNG_MAGIC = b"\x89PNG\r\n\x1a\n"
REFERENCE = Path(__file__).resolve().parents[1] / "reference" / "crc_freezing_points.csv"

# A cheese-brine style recipe: 20 % salt in water. INVENTED TEST SCENARIO (brines for
# cheese are commonly around 18-23 % salt; common practice); storage is set below the
# NaCl eutectic on purpose.
BRINE = """\
[recipe]
name = "Cheese brine (test)"
label = "invented test scenario"
basis = "percent"

[ingredients]
water = 80
salt = 20

[temperatures_celsius]
drawing = -5
serving = -19
storage = -25
"""

SUGAR_SYRUP = """\
[recipe]
name = "Sugar syrup (test)"
[composition]
water = 0.80
sucrose = 0.20
[temperatures_celsius]
drawing = -4
serving = -8
storage = -12
"""


def quiet(fn, *args, **kwargs):
    """Call fn and return its value; validity warnings (only) are allowed and dropped."""
    with warnings.catch_warnings(record=True) as caught:
        warnings.simplefilter("always")
        value = fn(*args, **kwargs)
    assert all(issubclass(w.category, cg.OutOfValidityRangeWarning) for w in caught), [
        str(w.message) for w in caught
    ]
    return value


def crc_depression(solute: str, mass_percent: float) -> float:
    """depression_K of one row of tests/reference/crc_freezing_points.csv (source_key
    crc_concentrative: CRC Handbook of Chemistry and Physics, 102nd ed., 2021)."""
    with REFERENCE.open(newline="", encoding="utf-8") as fh:
        for row in csv.DictReader(fh):
            if row["solute"] == solute and math.isclose(float(row["mass_percent"]), mass_percent):
                assert row["source_key"] == "crc_concentrative"
                return float(row["depression_K"])
    raise LookupError((solute, mass_percent))


def brine():
    return parse_recipe(BRINE, "brine test")


# ----------------------------------------------------------------- brine eutectic


def test_brine_report_gives_the_eutectic_and_stops_the_ice_table():
    rep = build_report(brine())
    # CRC Handbook (2021), NaCl 20 wt%: depression 16.46 K. 0.3 K: Pitzer model near
    # saturation (common practice for a freezing-point estimate).
    assert rep["freezing_point_C"] == pytest.approx(-crc_depression("sodium_chloride", 20.0), abs=0.3)
    eut = rep["eutectic"]
    assert eut["found"] and eut["phase"] == "hydrohalite" and eut["formula"] == "NaCl.2H2O"
    # Archer (1992): ice + NaCl.2H2O eutectic at -21.2 C (from memory). Tolerance 0.3 K
    # (as in test_electrolytes).
    assert eut["temperature_C"] == pytest.approx(-21.2, abs=0.3)
    assert eut["source"] and VERIFY_NOTE in eut["note"]

    rows = {r["name"]: r for r in rep["ice_table"]}
    assert rows["drawing"]["state"] == "unfrozen" and rows["drawing"]["ice_fraction_of_water"] == 0.0
    assert rows["serving"]["state"] == "partly_frozen" and 0.0 < rows["serving"]["ice_fraction_of_water"] < 1.0
    assert rows["storage"]["state"] == "below_eutectic"
    assert rows["storage"]["ice_fraction_of_water"] is None and rows["storage"]["ice_kg_of_aqueous_phase"] is None

    # the heat load stops at the eutectic instead of extrapolating past it
    q = rep["heat_load"]
    assert q["stopped_at"] == "eutectic"
    assert q["to_C"] == pytest.approx(eut["temperature_C"], abs=0.02)
    assert q["latent_kJ_per_kg_of_batch"] > 0 and q["sensible_kJ_per_kg_of_batch"] > 0
    storage = [r for r in rep["indicators"]["unfrozen_phase"] if r["name"] == "storage"][0]
    assert storage["state"] == "below_eutectic"

    # salt safety statement with the measurement/regulations note; cautions last
    assert any("salt" in c and VERIFY_NOTE in c for c in rep["cautions"])
    assert list(rep)[-1] == "cautions"
    back = json.loads(format_json(rep))  # strict JSON: no NaN
    assert back["eutectic"]["phase"] == "hydrohalite"

    text = format_text(rep)
    storage_line = [ln for ln in text.splitlines() if ln.strip().startswith("storage") and "°C" in ln][0]
    assert "below eutectic" in storage_line
    assert "hydrohalite" in text and "eutectic" in text[text.index("Key figures"):text.index("Ice at")]
    assert "not computed yet" not in text
    assert "INVENTED TEST SCENARIO" in text
    assert text.rstrip().split("\nCautions\n")[1]


def test_dairy_method_beside_the_model_for_milk_mixes_only():
    # The demo ice cream (milk solids and sugars) carries the dairy texts' method (Leighton
    # 1927 as in Goff & Hartel 2013) beside the model; a brine does not. The values are the
    # library's cg.leighton_ice_fraction (identity).
    recipe = load_demo_recipe()
    rep = quiet(build_report, recipe)
    dm = rep["dairy_method"]
    assert dm is not None and "Goff & Hartel" in dm["method"]
    for row in dm["ice_table"]:
        expected = quiet(cg.leighton_ice_fraction, recipe.solution(), row["temperature_K"])
        assert row["ice_percent_of_water"] == pytest.approx(100.0 * expected, abs=1e-12)
    assert "dairy texts' method" in format_text(rep)
    json.loads(format_json(rep))
    assert build_report(brine())["dairy_method"] is None


def test_no_eutectic_entry_without_salts():
    rep = quiet(build_report, parse_recipe(SUGAR_SYRUP, "syrup"))
    assert rep["eutectic"] is None
    assert all(r["state"] != "below_eutectic" for r in rep["ice_table"])
    assert "eutectic" not in format_text(rep)[: format_text(rep).index("Ice at")]


def test_water_activity_statement_carries_the_note():
    rep = quiet(build_report, parse_recipe(SUGAR_SYRUP, "syrup"))
    assert VERIFY_NOTE in rep["water_activity_note"]
    text = format_text(rep)
    assert "verify by measurement and defer to local regulations" in " ".join(text.split())


# ----------------------------------------------------------------- ice / enthalpy table


def test_table_columns_rows_and_api_agreement():
    r = parse_recipe(SUGAR_SYRUP, "syrup")
    df = quiet(ice_enthalpy_table, r)
    assert tuple(df.columns) == TABLE_COLUMNS
    t = df["temperature_C"].to_numpy()
    assert np.all(np.diff(t) < 0)  # warm to cold
    assert t[0] == pytest.approx(5.0, abs=1e-12) and t[-1] == pytest.approx(-40.0, abs=1e-12)
    named = df.set_index("point", drop=False)
    for name in ("fill", "drawing", "serving", "storage", "initial_freezing_point"):
        assert name in set(df["point"]), name
    # the same numbers as the public API (same solver; 1e-9 relative)
    drawing = named.loc["drawing"]
    tk = drawing["temperature_K"]
    assert drawing["ice_fraction"] == pytest.approx(float(quiet(r.ice_fraction, tk)), rel=1e-9)
    assert drawing["enthalpy_J_per_kg"] == pytest.approx(float(quiet(r.enthalpy, tk)), rel=1e-9)
    assert drawing["apparent_cp_J_per_kg_K"] == pytest.approx(float(quiet(r.apparent_specific_heat, tk)), rel=1e-9)
    # heat removed is zero at the fill temperature and grows as the product cools
    assert named.loc["fill", "heat_removed_from_fill_J_per_kg"] == pytest.approx(0.0, abs=1e-9)
    assert np.all(np.diff(df["heat_removed_from_fill_J_per_kg"].to_numpy()) > 0)
    # mass balance: ice + unfrozen water = all the water (1e-12 kg: rounding only)
    np.testing.assert_allclose(df["ice_kg"] + df["unfrozen_water_kg"], r.water, atol=1e-12)
    # no ice above the freezing point
    tf_c = named.loc["initial_freezing_point", "temperature_C"]
    assert (df.loc[df["temperature_C"] > tf_c, "ice_fraction"] == 0.0).all()
    # the heat removed to storage equals the library's heat load (rel 1e-9: same enthalpies)
    storage_k = named.loc["storage", "temperature_K"]
    q = quiet(r.heat_load, 278.15, storage_k)
    assert named.loc["storage", "heat_removed_from_fill_J_per_kg"] == pytest.approx(q["total"], rel=1e-9)


def test_brine_table_stops_at_the_eutectic():
    df = ice_enthalpy_table(brine())
    eut = df[df["point"] == "eutectic"].iloc[0]
    below = df[df["temperature_C"] < eut["temperature_C"]]
    assert len(below) > 0
    assert (below["state"] == "below_eutectic").all()
    assert below[["ice_fraction", "enthalpy_J_per_kg", "apparent_cp_J_per_kg_K"]].isna().all().all()
    above = df[df["temperature_C"] >= eut["temperature_C"]]
    assert above["enthalpy_J_per_kg"].notna().all()


def test_csv_is_atomic_readable_and_never_overwrites_the_input(tmp_path):
    import pandas as pd
    from colligate._files import OutputPathError

    r = parse_recipe(SUGAR_SYRUP, "syrup")
    df = quiet(ice_enthalpy_table, r, step_K=2.0)
    out = tmp_path / "table.csv"
    out.write_text("old", encoding="utf-8")
    assert Path(write_table_csv(df, out)) == out
    back = pd.read_csv(out, keep_default_na=False)
    assert list(back.columns) == list(TABLE_COLUMNS)
    assert len(back) == len(df)
    assert sorted(os.listdir(tmp_path)) == ["table.csv"]  # no temporary file left
    src = tmp_path / "recipe.toml"
    src.write_text(SUGAR_SYRUP, encoding="utf-8")
    with pytest.raises(OutputPathError, match="input"):
        write_table_csv(df, src, inputs=[src])
    assert src.read_text(encoding="utf-8") == SUGAR_SYRUP
    with pytest.raises(ValueError, match="step_K"):
        ice_enthalpy_table(r, step_K=0.0)


# ----------------------------------------------------------------- plots


@pytest.mark.parametrize("which", ["enthalpy", "cooling"])
def test_thermal_plots_write_png_atomically(tmp_path, which):
    from colligate.plot import plot_cooling_curve, plot_enthalpy

    fn = plot_enthalpy if which == "enthalpy" else plot_cooling_curve
    out = tmp_path / f"{which}.png"
    out.write_bytes(b"old content")
    r = load_demo_recipe("sorbet")
    written = quiet(fn, r, out, title="t", label=r.label)
    assert Path(written) == out
    data = out.read_bytes()
    assert data[:8] == PNG_MAGIC and len(data) > 5000
    assert sorted(os.listdir(tmp_path)) == [f"{which}.png"]


@pytest.mark.parametrize("which", ["ice", "enthalpy", "cooling"])
def test_brine_plots_stop_at_the_eutectic_without_warnings(tmp_path, which):
    # pytest runs with warnings as errors: the curves never evaluate below the eutectic
    from colligate.plot import plot_cooling_curve, plot_enthalpy, plot_ice_curve

    r = brine()
    out = tmp_path / f"{which}.png"
    if which == "ice":
        plot_ice_curve(r.solution(), out, marks=r.temperatures, model=r.model, label=r.label)
    elif which == "enthalpy":
        plot_enthalpy(r, out, label=r.label)
    else:
        plot_cooling_curve(r, out, label=r.label)
    assert out.read_bytes()[:8] == PNG_MAGIC


def test_plots_refuse_input_and_bad_arguments(tmp_path):
    from colligate._files import OutputPathError
    from colligate.plot import plot_cooling_curve, plot_enthalpy

    r = brine()
    src = tmp_path / "brine.toml"
    src.write_text(BRINE, encoding="utf-8")
    for fn in (plot_enthalpy, plot_cooling_curve):
        with pytest.raises(OutputPathError, match="input"):
            fn(r, src, inputs=[src])
    assert src.read_text(encoding="utf-8") == BRINE
    with pytest.raises(ValueError, match="below from_T"):
        plot_cooling_curve(r, tmp_path / "x.png", from_T=260.0, to_T=270.0)
    assert sorted(os.listdir(tmp_path)) == ["brine.toml"]


def test_water_alone_is_all_ice_below_zero():
    # Pure water below 0 C is all ice (common practice): the report says so instead of
    # failing, and the liquid-composition figure is left empty.
    recipe = parse_recipe('[recipe]\nname = "water"\nbasis = "kg"\n[composition]\nwater = 1.0\n', "water")
    rep = quiet(build_report, recipe)
    storage = next(r for r in rep["ice_table"] if r["name"] == "storage")
    assert storage["ice_fraction_of_water"] == 1.0 and storage["state"] == "frozen"
    assert storage["dissolved_solids_mass_percent_of_unfrozen_liquid"] is None
    assert "all ice" in format_text(rep)
    json.loads(format_json(rep))  # strict JSON (null, not NaN)
