"""Pitzer parameter sets chosen by the caller (``parameter_set=``) in every entry point, and
brines above a salt's solubility or richer than their eutectic composition (issue 12)."""
from __future__ import annotations

import math
import warnings
from pathlib import Path

import numpy as np
import pandas as pd
import pytest

import colligate as cg

REFERENCE = Path(__file__).resolve().parents[1] / "reference"
M_W = 0.018015268  # kg/mol, molar mass of water (IAPWS, common practice)


def _quiet(fn, *args, **kwargs):
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        return fn(*args, **kwargs)


# --- the default is unchanged ------------------------------------------------------------

@pytest.mark.parametrize("composition", [{"NaCl": 0.10}, {"NaCl": 0.05, "sucrose": 0.15},
                                         {"CaCl2": 0.15, "KCl": 0.02}])
def test_default_set_named_or_not_is_bit_identical(composition):
    # Identity: no set named and the default set named give the same numbers, bit for bit.
    s = cg.Solution.from_mass_fractions(composition)
    default = cg.pitzer_parameter_sets()[0]
    temps = np.array([268.15, 263.15, 258.15])
    assert cg.freezing_point(s) == cg.freezing_point(s, parameter_set=default)
    assert cg.water_activity(s, 298.15) == cg.water_activity(s, 298.15, parameter_set=default)
    assert cg.osmotic_coefficient(s, 298.15) == cg.osmotic_coefficient(s, 298.15, parameter_set=default)
    assert np.array_equal(_quiet(cg.ice_fraction, s, temps),
                          _quiet(cg.ice_fraction, s, temps, parameter_set=default))
    a, b = cg.IceCurve(s), cg.IceCurve(s, parameter_set=default)
    assert a.freezing_point == b.freezing_point
    assert _quiet(a.at, 263.15).ice == _quiet(b.at, 263.15).ice


# --- Harvie, Moller & Weare (1984) at 25 C through the entry points ------------------------

def test_harvie_osmotic_coefficient_of_nacl_vs_hamer_wu():
    # tests/reference/nacl_osmotic_coefficients_25c.csv: Hamer & Wu (1972), NaCl at 25 C
    # (from memory, as the CSV says). Tolerance 0.005: the accuracy asked of the model at
    # 25 C (the same as the C++ test of the set's own function).
    table = pd.read_csv(REFERENCE / "nacl_osmotic_coefficients_25c.csv")
    for row in table.itertuples():
        s = cg.Solution.from_molalities({"NaCl": row.molality_mol_per_kg})
        phi = cg.osmotic_coefficient(s, 298.15, model="pitzer", parameter_set="harvie_1984")
        assert phi == pytest.approx(row.osmotic_coefficient, abs=0.005), row.molality_mol_per_kg
        # Identity: a_w = exp(-M_w nu m phi) with the same set.
        aw = cg.water_activity(s, 298.15, model="pitzer", parameter_set="harvie_1984")
        assert aw == pytest.approx(math.exp(-M_W * 2 * row.molality_mol_per_kg * phi), rel=1e-13)


def test_harvie_mean_activity_coefficients_vs_crc():
    # CRC Handbook mean activity coefficients at 25 C (tests/reference/
    # crc_mean_activity_coefficients_25c.csv, the pyEQL copy) through the Python entry
    # point, with the rows and tolerances of check crc_mean_activity_harvie in
    # tests/reference/tolerances.toml (the limits of issue 12 and the basis written there;
    # the C++ validation suite reads the same check). Rows above the set's highest molality
    # of the salt are outside the model's range and are not checked (check_beyond_range).
    import tomllib

    with open(REFERENCE / "tolerances.toml", "rb") as fh:
        check = next(c for c in tomllib.load(fh)["check"] if c["id"] == "crc_mean_activity_harvie")
    table = pd.read_csv(REFERENCE / check["file"]).query(check["rows"])
    tolerance = table.eval(check["tolerance"])
    checked = 0
    for (_, row), tol in zip(table.iterrows(), tolerance):
        s = cg.Solution.from_molalities({row.salt: row.molality_mol_per_kg})
        with warnings.catch_warnings(record=True) as caught:
            warnings.simplefilter("always")
            gamma = cg.mean_activity_coefficient(s, row.salt, 298.15, parameter_set="harvie_1984")
        if any(issubclass(w.category, cg.OutOfValidityRangeWarning) for w in caught):
            assert row.molality_mol_per_kg > 0.7  # only rows beyond a salt's range
            continue
        assert abs(gamma - row.mean_activity_coefficient) <= tol, (row.salt, row.molality_mol_per_kg)
        checked += 1
    assert checked >= 50


def test_default_set_mean_activity_coefficients_vs_crc():
    # NaCl, KCl, CaCl2, MgCl2 and K2SO4 at 25 C through the DEFAULT set (no parameter_set;
    # its MgCl2 and K2SO4 rows have Harvie et al.'s 25 C values and Silvester & Pitzer's slopes):
    # CRC Handbook mean activity coefficients (tests/reference/
    # crc_mean_activity_coefficients_25c.csv, the pyEQL copy), rows and limits of check
    # crc_mean_activity_default in tests/reference/tolerances.toml (2 % up to 2 mol/kg, 5 %
    # above; the basis is written there). The table is not used in the set's fit.
    import tomllib

    with open(REFERENCE / "tolerances.toml", "rb") as fh:
        check = next(c for c in tomllib.load(fh)["check"] if c["id"] == "crc_mean_activity_default")
    table = pd.read_csv(REFERENCE / check["file"]).query(check["rows"])
    tolerance = table.eval(check["tolerance"])
    checked = 0
    for (_, row), tol in zip(table.iterrows(), tolerance):
        s = cg.Solution.from_molalities({row.salt: row.molality_mol_per_kg})
        with warnings.catch_warnings(record=True) as caught:
            warnings.simplefilter("always")
            gamma = cg.mean_activity_coefficient(s, row.salt, 298.15)
        if any(issubclass(w.category, cg.OutOfValidityRangeWarning) for w in caught):
            assert row.molality_mol_per_kg > 0.7  # only rows beyond a salt's range
            continue
        assert abs(gamma - row.mean_activity_coefficient) <= tol, (row.salt, row.molality_mol_per_kg, gamma)
        checked += 1
    assert checked >= 40
    # the old default (Spencer et al.'s 25 C values) misses CaCl2 at 5 mol/kg by about -24 %
    s5 = cg.Solution.from_molalities({"CaCl2": 5.0})
    old = cg.mean_activity_coefficient(s5, "CaCl2", 298.15, parameter_set="spencer_1990_icefit")
    new = cg.mean_activity_coefficient(s5, "CaCl2", 298.15)
    crc = pd.read_csv(REFERENCE / check["file"]).query("salt == 'CaCl2' and molality_mol_per_kg == 5")
    ref = float(crc.mean_activity_coefficient.iloc[0])
    assert old < 0.85 * ref and abs(new / ref - 1) < 0.05


def test_a_set_changes_the_salt_steps_of_the_phase_path():
    # The published set with the published solubility products (spencer_1990) and the
    # default set (its own ice-line curvature and solubility shifts) both put the NaCl
    # eutectic at Archer's (1992) -21.2 C (ice + NaCl.2H2O; from memory), tolerance 0.3 K as
    # the test of the default in test_electrolytes.py; the two curves differ at -10 C.
    s = cg.Solution.from_mass_fractions({"NaCl": 0.10})
    for parameter_set in ("spencer_1990_icefit", "spencer_1990"):
        e = cg.eutectic(s, parameter_set=parameter_set)
        assert e["found"] and e["phase"] == "hydrohalite"
        assert e["temperature"] - 273.15 == pytest.approx(-21.2, abs=0.3)
    assert cg.ice_fraction(s, 263.15) != cg.ice_fraction(s, 263.15, parameter_set="spencer_1990")


def test_batch_with_a_set_equals_scalar():
    rows = {"NaCl": [0.02, 0.08, 0.15], "KCl": [0.01, 0.0, 0.03]}
    batch = cg.SolutionBatch.from_mass_fractions(rows)
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        tf = cg.batch_freezing_point(batch, parameter_set="harvie_1984")
        aw = cg.batch_water_activity(batch, 298.15, parameter_set="harvie_1984")
        ice = cg.batch_ice_fraction(batch, 263.15, parameter_set="spencer_1990")
        for i in range(3):
            s = cg.Solution.from_mass_fractions({"NaCl": rows["NaCl"][i], "KCl": rows["KCl"][i]})
            assert tf[i] == cg.freezing_point(s, parameter_set="harvie_1984")
            assert aw[i] == cg.water_activity(s, 298.15, parameter_set="harvie_1984")
            assert ice[i] == cg.ice_fraction(s, 263.15, parameter_set="spencer_1990")


# --- bad input ---------------------------------------------------------------------------

def test_a_salt_without_parameters_in_the_set_is_named_with_the_sets_that_have_it():
    s = cg.Solution.from_molalities({"KCl": 1.0})
    with pytest.raises(cg.InvalidInputError,
                       match=r"parameter_set = 'archer_1992': salt 'potassium_chloride'.*"
                             r"'spencer_1990_icefit', 'spencer_1990', 'harvie_1984'"):
        cg.water_activity(s, 298.15, parameter_set="archer_1992")
    with pytest.raises(cg.InvalidInputError, match="potassium_chloride"):
        cg.mean_activity_coefficient(s, "KCl", 298.15, parameter_set="archer_1992")
    with pytest.raises(cg.InvalidInputError, match="parameter_set = 'nope'"):
        cg.freezing_point(s, parameter_set="nope")
    with pytest.raises(cg.InvalidInputError, match="model 'norrish' has no Pitzer parameter sets"):
        cg.freezing_point(cg.Solution.from_molalities({"sucrose": 1.0}), model="norrish",
                          parameter_set="harvie_1984")


def test_a_set_outside_its_temperature_range_warns_with_the_salts():
    # harvie_1984 holds at 293.15-303.15 K only: a freezing point with it is flagged.
    s = cg.Solution.from_molalities({"NaCl": 1.0})
    with pytest.warns(cg.OutOfValidityRangeWarning, match="harvie_1984.*293.15-303.15 K"):
        cg.freezing_point(s, parameter_set="harvie_1984")


# --- saturation as physics ----------------------------------------------------------------

def test_brine_richer_than_the_eutectic_freezes_by_crystallising_salt():
    # 25 wt% NaCl lies above the eutectic composition (23.3 wt%, ice + NaCl.2H2O at -21.2 C;
    # Archer 1992, from memory): on cooling hydrohalite crystallises first, above the
    # eutectic; ice forms only at the eutectic. The default freezing point is that salt
    # crystallisation temperature, with the phase named; metastable=True gives the ice
    # temperature of the unprecipitated liquid, below the eutectic.
    s = cg.Solution.from_mass_fractions({"NaCl": 0.25})
    with pytest.warns(cg.SupersaturatedWarning, match=r"hydrohalite \(NaCl.2H2O\).*spencer_1990"):
        first = cg.freezing_point(s)
    onset = cg.salt_crystallisation_temperature(s)
    assert first == onset["temperature_K"] and onset["phase"] == "hydrohalite"
    eutectic = cg.eutectic(cg.Solution.from_mass_fractions({"NaCl": 0.10}))["temperature"]
    assert eutectic < first < 273.15
    with warnings.catch_warnings():
        warnings.simplefilter("error", cg.SupersaturatedWarning)
        metastable = _quiet(cg.freezing_point, s, metastable=True)
    assert metastable < eutectic
    # No ice anywhere above the eutectic (the liquid follows the hydrohalite line).
    assert _quiet(cg.ice_fraction, s, 255.15) == 0.0
    # The batch gives the same numbers, both ways.
    batch = cg.SolutionBatch.from_mass_fractions({"NaCl": [0.10, 0.25]})
    assert _quiet(cg.batch_freezing_point, batch)[1] == first
    assert _quiet(cg.batch_freezing_point, batch, metastable=True)[1] == metastable


def test_brine_supersaturated_at_25c_has_no_crystallisation_temperature_in_the_data():
    # 30 wt% NaCl is above halite's solubility already at 25 C: NaN with the reason (the
    # salt crystallises above the solubility data), and a_w at 25 C is that of the saturated
    # brine (test_electrolytes.py checks it against Greenspan 1977).
    s = cg.Solution.from_mass_fractions({"NaCl": 0.30})
    with pytest.warns(cg.SupersaturatedWarning, match="halite"):
        with pytest.warns(cg.OutOfValidityRangeWarning, match="already supersaturated"):
            value = cg.freezing_point(s)
    assert math.isnan(value)
    with pytest.raises(cg.OutOfValidityRangeError, match="already supersaturated"):
        _quiet(cg.freezing_point, s, range_policy="raise")


@pytest.mark.parametrize("salt, phase, molality, expected, tolerance, source", [
    # Saturated KCl at 25 C: Greenspan (1977) 0.8435 (tests/reference/
    # greenspan_saturated_salts_25c.csv); tolerance 0.003, the limit of issue 12.
    ("KCl", "sylvite", 6.0, "greenspan", 0.003, "greenspan_1977_fit"),
    ("NaCl", "halite", 7.0, "greenspan", 0.003, "greenspan_1977_fit"),
])
def test_solution_above_solubility_gives_the_saturated_brine(salt, phase, molality, expected,
                                                             tolerance, source):
    ref = pd.read_csv(REFERENCE / "greenspan_saturated_salts_25c.csv").set_index("salt").loc[salt]
    assert ref.source_key == source
    s = cg.Solution.from_molalities({salt: molality})
    with pytest.warns(cg.SupersaturatedWarning, match=phase):
        aw = cg.water_activity(s, 298.15)
    assert aw == pytest.approx(ref.water_activity, abs=tolerance)
    # The same with the 25 C set of Harvie et al. (1984), the published solubility products.
    with pytest.warns(cg.SupersaturatedWarning, match=phase):
        aw_harvie = cg.water_activity(s, 298.15, parameter_set="harvie_1984")
    assert aw_harvie == pytest.approx(ref.water_activity, abs=tolerance)


def test_saturated_magnesium_chloride_at_25c():
    # Greenspan (1977): a_w of saturated MgCl2 at 25 C 0.3279 (tests/reference/
    # greenspan_saturated_salts_25c.csv); tolerance 0.003, the limit of issue 12. The default
    # set's bischofite K was fitted to a solubility table (0 and 20 C rows), not to a_w.
    ref = pd.read_csv(REFERENCE / "greenspan_saturated_salts_25c.csv").set_index("salt").loc["MgCl2"]
    s = cg.Solution.from_molalities({"MgCl2": 6.5})
    with pytest.warns(cg.SupersaturatedWarning, match="bischofite"):
        aw = cg.water_activity(s, 298.15)
    assert aw == pytest.approx(ref.water_activity, abs=0.003)
    # the metastable liquid is drier, and says so only when asked for
    assert _quiet(cg.water_activity, s, 298.15, saturation="metastable") < aw - 0.02  # warns: above 5.9
    # a MgCl2 solution above saturation reports where bischofite begins to crystallise
    state = _quiet(cg.salt_equilibrium, s, 298.15)
    assert state["phase"] == "bischofite" and state["supersaturated"]


def test_mgcl2_solubility_against_the_rows_held_out_of_its_fit():
    # tests/reference/mgcl2_solubility.csv (chemister.ru compiled table, g per 100 g water
    # printed to 0.1, 0.0105 mol/kg a step). The default set's bischofite K was fitted to the
    # 0 and 20 C rows (tools/fit_default_set.py); 10 and 25 C are held out: within 0.02
    # mol/kg (two printed steps), the fitted rows within 0.005.
    table = pd.read_csv(REFERENCE / "mgcl2_solubility.csv")
    table = table[table.temperature_C <= 25]
    assert set(table.source_key) == {"chemister_mgcl2_solubility"}
    for _, r in table.iterrows():
        m = _saturation_molality("MgCl2", r.temperature_C + 273.15)
        limit = 0.005 if r.used_in_fit == "yes" else 0.02
        assert m == pytest.approx(r.molality_mol_per_kg, abs=limit), r.temperature_C


def _saturation_molality(salt, T, parameter_set=None):
    state = _quiet(cg.salt_equilibrium, cg.Solution.from_molalities({salt: 8.0}), T,
                   parameter_set=parameter_set)
    assert state["supersaturated"]
    return (8.0 - state["precipitated_mol"]) / state["liquid_water_kg"]


@pytest.mark.parametrize("T, expected, tolerance", [
    # NaCl solubility in water, mol/kg: 6.15 at 25 C and 6.11 at 0 C (35.9 and 35.7 g per
    # 100 g water; CRC Handbook aqueous solubility table, from memory). Tolerance 0.05 mol/kg
    # (about 1 %, the spread of the compilations, from memory).
    (298.15, 6.15, 0.05),
    (273.25, 6.11, 0.05),
])
def test_nacl_solubility(T, expected, tolerance):
    assert _saturation_molality("NaCl", T) == pytest.approx(expected, abs=tolerance)


def test_nacl_solubility_falls_on_cooling_as_published():
    # Salt Institute solubility table (tests/reference/nacl_solubility.csv; mass per cent
    # printed to 0.01, about 0.004 mol/kg). The default set's halite K was fitted to the
    # used_in_fit rows (tools/fit_default_set.py); the held-out rows (4.44, 15.56 C) are
    # checked within 0.01 mol/kg (the fit's worst residual on its own rows, 0.007, plus the
    # printed digit), and every row within 0.01 as well.
    table = pd.read_csv(REFERENCE / "nacl_solubility.csv")
    assert set(table.source_key) == {"salt_institute_solubility"}
    assert set(table.used_in_fit) == {"yes", "no"}
    model = np.array([_saturation_molality("NaCl", t + 273.15) for t in table.temperature_C])
    np.testing.assert_allclose(model, table.molality_mol_per_kg, atol=0.01)
    # the slope from 0.1 to 21.11 C: the table rises 0.044 mol/kg; the model must rise too
    # (it fell by 0.036 mol/kg with the old default), within 0.015 mol/kg of the table's rise
    rise = model[-1] - model[0]
    published = table.molality_mol_per_kg.iloc[-1] - table.molality_mol_per_kg.iloc[0]
    assert rise > 0.0 and abs(rise - published) < 0.015
    old = [_saturation_molality("NaCl", T, "spencer_1990_icefit") for T in (273.25, 298.15)]
    assert old[0] > old[1]  # the cause: the ice-line curvature without a halite shift


# --- 25 C osmotic coefficients from published isopiestic molalities (issue 12) -------------

@pytest.mark.parametrize("check_id, parameter_set", [("isopiestic_osmotic_harvie", "harvie_1984"),
                                                     ("isopiestic_osmotic_default", None)])
def test_osmotic_coefficients_vs_isopiestic_data(check_id, parameter_set):
    # tests/reference/isopiestic_osmotic_coefficients_25c.csv: isopiestic molalities at
    # 298.15 K (Robinson & Sinclair 1934; Stokes 1945; Spedding et al. 1976; Kuschel & Seidel
    # 1985; Rard & Miller 1981; Platford 1968; Rard et al. 2000; Robinson, Wilson & Stokes
    # 1941), reduced to phi with Archer's (1992) NaCl and Pitzer & Mayorga's (1973) KCl
    # (tools/isopiestic_osmotic_25c.py). Rows and limits of the check in tolerances.toml
    # (2 % up to 2 mol/kg, 5 % above; the default set's known misses in its basis).
    import tomllib

    with open(REFERENCE / "tolerances.toml", "rb") as fh:
        check = next(c for c in tomllib.load(fh)["check"] if c["id"] == check_id)
    assert check["check_beyond_range"] is False
    table = pd.read_csv(REFERENCE / check["file"]).query(check["rows"])
    tolerance = table.eval(check["tolerance"])
    checked: dict[str, int] = {}
    for (_, row), tol in zip(table.iterrows(), tolerance):
        s = cg.Solution.from_molalities({row.salt: row.molality_mol_per_kg})
        with warnings.catch_warnings(record=True) as caught:
            warnings.simplefilter("always")
            phi = cg.osmotic_coefficient(s, row.temperature_K, model="pitzer", parameter_set=parameter_set)
        if any(issubclass(w.category, cg.OutOfValidityRangeWarning) for w in caught):
            continue  # beyond the set's highest molality for the salt: drawn, not checked
        assert abs(phi - row.osmotic_coefficient) <= tol, (row.salt, row.molality_mol_per_kg, phi,
                                                          row.source_key)
        checked[row.salt] = checked.get(row.salt, 0) + 1
    expected = {"KCl", "CaCl2", "MgCl2", "Na2SO4", "K2SO4", "MgSO4"}
    assert set(checked) == expected and min(checked.values()) >= 5, checked


def test_default_set_sulfate_rows_replace_the_rows_that_missed():
    # The Marion & Farren (1999) K2SO4 and MgSO4 rows of the earlier default
    # (spencer_1990_icefit) miss the isopiestic phi (K2SO4 -2.0 % at 0.69 mol/kg, MgSO4 -13 %
    # at 1.5 mol/kg) where Pitzer & Mayorga's rows (harvie_1984) meet the same rows within 1 %:
    # the rows, not the data, were the cause. The default set now has Harvie et al.'s (1984)
    # 25 C values for both (tools/fit_default_set.py, fit_sulfate), so it meets them as
    # harvie_1984 does. Data: tests/reference/isopiestic_osmotic_coefficients_25c.csv (Robinson,
    # Wilson & Stokes 1941 K2SO4; Rard & Miller 1981, Kuschel & Seidel 1985 MgSO4).
    table = pd.read_csv(REFERENCE / "isopiestic_osmotic_coefficients_25c.csv")
    for salt, worst_old in (("K2SO4", 0.015), ("MgSO4", 0.10)):
        rows = table[table.salt == salt]
        dev = {"old": [], "default": [], "harvie": []}
        for _, row in rows.iterrows():
            s = cg.Solution.from_molalities({salt: row.molality_mol_per_kg})
            for key, pset in (("old", "spencer_1990_icefit"), ("default", None), ("harvie", "harvie_1984")):
                phi = _quiet(cg.osmotic_coefficient, s, 298.15, model="pitzer", parameter_set=pset)
                dev[key].append(phi / row.osmotic_coefficient - 1)
        assert max(abs(x) for x in dev["harvie"]) < 0.01, salt
        assert max(abs(x) for x in dev["default"]) < 0.01, salt
        assert max(abs(x) for x in dev["old"]) > worst_old, salt
