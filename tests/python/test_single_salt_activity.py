"""Salts of food at 25 C by published Pitzer parameters, one salt in water (issue 12):
sodium and potassium acetate and the sodium and potassium phosphates, carbonates and
bicarbonates (May et al. 2011, read in pyEQL's database copy) in the closed binary form."""
from __future__ import annotations

import math
import tomllib
import warnings
from pathlib import Path

import numpy as np
import pandas as pd
import pytest

import colligate as cg

REFERENCE = Path(__file__).resolve().parents[1] / "reference"
M_W = 0.018015268  # kg/mol, molar mass of water (IAPWS, common practice)


def test_mean_activity_coefficients_vs_crc():
    # CRC Handbook mean activity coefficients at 25 C (tests/reference/
    # crc_mean_activity_food_salts_25c.csv, pyEQL's copy), rows and limits of check
    # crc_mean_activity_food_salts in tests/reference/tolerances.toml (2 % up to 2 mol/kg,
    # 5 % above). Not fitted by colligate (the basis there says what the check tests).
    with open(REFERENCE / "tolerances.toml", "rb") as fh:
        check = next(c for c in tomllib.load(fh)["check"] if c["id"] == "crc_mean_activity_food_salts")
    table = pd.read_csv(REFERENCE / check["file"]).query(check["rows"])
    tolerance = table.eval(check["tolerance"])
    assert set(table.source_key) == {"crc_mean_activity"}
    worst = 0.0
    for (_, row), tol in zip(table.iterrows(), tolerance):
        with warnings.catch_warnings():
            warnings.simplefilter("error")  # no row is above its salt's range
            out = cg.single_salt_activity(row.salt, row.molality_mol_per_kg, row.temperature_K)
        gamma = float(out.mean_activity_coefficient.iloc[0])
        assert abs(gamma - row.mean_activity_coefficient) <= tol, (row.salt, row.molality_mol_per_kg, gamma)
        worst = max(worst, abs(gamma / row.mean_activity_coefficient - 1))
    assert len(table) == 42 and set(table.salt) == {
        "sodium_acetate", "potassium_acetate", "monosodium_phosphate", "monopotassium_phosphate",
        "disodium_phosphate", "sodium_carbonate"}
    assert worst < 0.012  # as the basis states (worst -1.1 %)


def test_water_activity_and_arrays():
    # a_w = exp(-phi nu m M_w) (definition); one row per molality; names, formulas and ids.
    m = np.array([0.5, 1.0, 2.0])
    out = cg.single_salt_activity("potassium acetate", m)
    assert list(out.columns) == ["molality_mol_per_kg", "osmotic_coefficient", "mean_activity_coefficient",
                                 "water_activity"]
    np.testing.assert_allclose(out.water_activity, np.exp(-out.osmotic_coefficient * 2 * m * M_W), rtol=1e-14)
    same = cg.single_salt_activity("CH3COOK", m, T=298.15)
    pd.testing.assert_frame_equal(out, same)
    # a_w falls with molality; 2:1 phosphate lowers it more than 1:1 at the same molality
    assert np.all(np.diff(out.water_activity) < 0)
    one_one = cg.single_salt_activity("monosodium_phosphate", 1.0).water_activity.iloc[0]
    two_one = cg.single_salt_activity("disodium_phosphate", 1.0).water_activity.iloc[0]
    assert two_one < one_one


def test_parameter_table_names_its_source_and_range():
    table = cg.single_salt_parameters()
    assert set(table.parameter_set) == {"may_2011", "colligate_ice_line_fit"}
    may = table[table.parameter_set == "may_2011"]
    assert set(may.source) == {"may_2011"}
    assert (may.min_temperature_K == 297.65).all() and (may.max_temperature_K == 298.65).all()
    assert "potassium_acetate" in may.index and "trisodium_phosphate" in may.index
    assert (table.max_molality > 0).all() and (table.molar_mass_kg_per_mol > 0.05).all()
    assert "Pitzer" in cg.citation("may_2011")["title"]
    # the sodium acetate row as the copy gives it (May et al. 2011, pyEQL's database)
    row = may.loc["sodium_acetate"]
    assert (row.beta0, row.beta1, row.cphi) == (0.1382, 0.3317, -0.00496)
    ice = table[table.parameter_set == "colligate_ice_line_fit"]
    assert set(ice.index) == {"sodium_acetate", "potassium_acetate", "trisodium_citrate",
                              "monosodium_phosphate", "dipotassium_phosphate", "potassium_bicarbonate",
                              "potassium_carbonate"}
    assert set(ice.source) == {"colligate_fit_crc_pitzer", "colligate_fit_melinder_pitzer"}
    assert ice.loc["potassium_acetate"].source == "colligate_fit_melinder_pitzer"
    assert (ice.max_temperature_K == 273.15).all() and (ice.cphi == 0.0).all()
    for key in ("colligate_fit_crc_pitzer", "colligate_fit_melinder_pitzer"):
        assert "fit_single_salt_ice_line.py" in cg.citation(key)["container"]


def test_bad_input_names_what_is_wrong():
    # a temperature away from 25 C: the salt, the set and its range are named
    with pytest.raises(cg.InvalidInputError, match=r"sodium_acetate.*may_2011.*297.65 to 298.65 K"
                                                    r".*colligate_ice_line_fit.*269.17 to 273.15 K"):
        cg.single_salt_activity("sodium_acetate", 1.0, T=268.15)
    # a salt the table does not hold: the salts it does hold are listed
    with pytest.raises(cg.InvalidInputError, match="potassium lactate.*sodium_acetate"):
        cg.single_salt_activity("potassium lactate", 1.0)
    with pytest.raises(cg.InvalidInputError, match="molality"):
        cg.single_salt_activity("sodium_acetate", [-0.5])
    # above the data behind the fit: computed and flagged
    with pytest.warns(cg.OutOfValidityRangeWarning, match="1.8 mol/kg"):
        out = cg.single_salt_activity("monopotassium_phosphate", 2.5)
    assert math.isfinite(out.water_activity.iloc[0])
    # a mass fraction outside [0, 1) (a mass % passed as is, a negative or NaN): salt and range named
    for bad in (12.0, 1.0, -0.01, float("nan")):
        with pytest.raises(cg.InvalidInputError, match=r"mass fraction of 'trisodium_citrate'.*\[0, 1\)"):
            cg.single_salt_molality("Na3C6H5O7", [0.05, bad])


def test_single_salt_molality_is_the_mass_fraction_over_the_water():
    # m = w / (M (1 - w)) (common practice): 11.9976 g of NaH2PO4
    # (M 0.119976 kg/mol, standard atomic weights) in 100 g of water is 1 mol/kg
    w = 11.9976 / 111.9976
    assert cg.single_salt_molality("monosodium phosphate", w)[0] == pytest.approx(1.0, rel=1e-12)
    assert cg.single_salt_molality("NaH2PO4", [0.0]).tolist() == [0.0]
    assert cg.single_salt_molality("NaH2PO4", np.array([[0.1, 0.2]])).shape == (2,)


def _ice_line_check():
    with open(REFERENCE / "tolerances.toml", "rb") as fh:
        check = next(c for c in tomllib.load(fh)["check"] if c["id"] == "crc_single_salt_ice_line")
    table = pd.read_csv(REFERENCE / check["file"], keep_default_na=False).query(check["rows"])
    plus = table[check["tolerance_plus"]["column"]].map(check["tolerance_plus"]["values"])
    return check, table, float(check["tolerance"]) + plus


def test_freezing_points_vs_crc_held_out_rows():
    # CRC Handbook 102nd ed. (2021) freezing-point depressions of sodium acetate and sodium
    # citrate (tests/reference/crc_freezing_points.csv), the rows not used in the fit of the
    # ice-line rows; limits of check crc_single_salt_ice_line.
    check, table, tolerance = _ice_line_check()
    assert set(table.source_key) == {"crc_concentrative"} and set(table.used_in_fit) == {"no"}
    assert table.solute.value_counts().to_dict() == {
        "trisodium_citrate": 7, "sodium_acetate": 4, "monosodium_phosphate": 9, "dipotassium_phosphate": 7,
        "potassium_bicarbonate": 6, "potassium_carbonate": 5}
    for (_, row), tol in zip(table.iterrows(), tolerance):
        with warnings.catch_warnings():
            warnings.simplefilter("error")  # no row beyond the fitted range
            out = cg.single_salt_freezing_point(row.solute, row.molality_mol_per_kg)
        assert out.attrs["parameter_set"] == "colligate_ice_line_fit"
        assert abs(out.depression_K.iloc[0] - row.depression_K) <= tol, (row.solute, row.molality_mol_per_kg)


def test_potassium_acetate_vs_melinder_held_out_rows():
    # Melinder (2010), potassium acetate freezing curve as CoolProp INCOMP::MKA carries it
    # (tests/reference/melinder_freezing_curves.csv), the 6, 8, ..., 24 wt% rows held out of
    # the fit of the ice-line row; limits of check melinder_single_salt_ice_line.
    with open(REFERENCE / "tolerances.toml", "rb") as fh:
        check = next(c for c in tomllib.load(fh)["check"] if c["id"] == "melinder_single_salt_ice_line")
    table = pd.read_csv(REFERENCE / check["file"], keep_default_na=False).query(check["rows"])
    assert len(table) == 10 and set(table.source_key) == {"melinder_2010"}
    molar_mass = 0.098142  # CH3COOK, standard atomic weights (common practice)
    w = table.mass_percent.to_numpy() / 100.0
    m = cg.single_salt_molality("potassium_acetate", w)
    np.testing.assert_allclose(m, w / (molar_mass * (1.0 - w)), rtol=1e-14)  # m = w / (M (1 - w))
    with warnings.catch_warnings():
        warnings.simplefilter("error")  # every row within the fitted range
        out = cg.single_salt_freezing_point("potassium_acetate", m)
    assert out.attrs["parameter_set"] == "colligate_ice_line_fit"
    deviation = out.freezing_point_K.to_numpy() - 273.15 - table.freezing_point_C.to_numpy()
    assert np.abs(deviation).max() <= float(check["tolerance"])
    # below the fitted range (-16 C) the row still answers, flagged
    with pytest.warns(cg.OutOfValidityRangeWarning):
        cg.single_salt_freezing_point("potassium_acetate", 5.0)


def test_ice_line_rows_are_what_the_tool_fits():
    # Provenance: rerunning tools/fit_single_salt_ice_line.py's fit gives the constants in
    # data/single_salt_pitzer.hpp (to their printed digits), and each kept fit is well
    # determined; the fits it does not keep are the ones its rule rejects.
    import importlib.util
    spec = importlib.util.spec_from_file_location(
        "fit_single_salt_ice_line", REFERENCE.parents[1] / "tools" / "fit_single_salt_ice_line.py")
    tool = importlib.util.module_from_spec(spec)
    spec.loader.exec_module(tool)
    table = cg.single_salt_parameters()
    ice = table[table.parameter_set == "colligate_ice_line_fit"]
    for salt, row in ice.iterrows():
        r, fitted, _ = tool.fit_salt(salt)
        assert r.success and not r.poorly_determined()
        assert r.params["beta0"] == pytest.approx(row.beta0, rel=1e-6)
        assert r.params["beta1"] == pytest.approx(row.beta1, rel=1e-6)
        assert row.max_molality == fitted.molality_mol_per_kg.max()
        # the window opens at the lowest fitted freezing point, or at the row's own at its top
        # fitted molality where that is lower, so the row evaluated on its data never warns
        assert row.min_temperature_K == pytest.approx(tool.window_low(salt, r.params, fitted), abs=1e-9)
        with warnings.catch_warnings():
            warnings.simplefilter("error", cg.OutOfValidityRangeWarning)
            cg.single_salt_freezing_point(salt, fitted.molality_mol_per_kg.to_numpy())
    for salt in set(tool.SALTS) - set(ice.index):  # the salts the tool's rule does not keep
        r, _, _ = tool.fit_salt(salt)
        assert r.poorly_determined(), salt


def test_fit_single_salt_recovers_parameters_and_refuses_mixture_use():
    # Identity: freezing points made by the closed form with known 3:1 parameters are fitted
    # back to them; a single-salt fit makes no solute for mixtures.
    m = np.linspace(0.05, 1.0, 8)
    tf = cg._core.single_salt_closed_form_freezing_point(1, -3, 3, 1, 0.18, 4.3, -0.02, m.tolist())
    # with data to 1 mol/kg beta0 and C-phi are nearly collinear: the fit says so
    with pytest.warns(cg.fit.PoorlyDeterminedFitWarning, match="beta0 and cphi"):
        r = cg.fit.fit_single_salt(1, -3, 3, 1, m, tf)
    assert r.success
    assert r.params["beta0"] == pytest.approx(0.18, abs=1e-7)
    assert r.params["beta1"] == pytest.approx(4.3, abs=1e-6)
    assert r.params["cphi"] == pytest.approx(-0.02, abs=1e-7)
    with pytest.raises(cg.InvalidInputError, match="single-salt"):
        r.as_solute("my citrate")
    with pytest.raises(cg.InvalidInputError, match="not neutral"):
        cg.fit.fit_single_salt(1, -3, 1, 1, m, tf)
    with pytest.raises(cg.InvalidInputError, match="single_salt_freezing_point|ice line"):
        cg.single_salt_freezing_point("KH2PO4", 0.5)
