"""The prepared ice curve from Python: seawater against TEOS-10 (gsw), the salt path,
binary brines ending at their hydrates, and the structured validity record."""
from __future__ import annotations

import math

import numpy as np
import pytest
from reference_packages import reference_package

import colligate as cg

gsw = reference_package("gsw", module_level=True)

SA = 35.16504  # g/kg, TEOS-10 standard seawater


def teos10_ice_fraction(t_c: float) -> float:
    """Ice / water of seawater frozen at t_c with the salt kept in the brine (TEOS-10 via
    gsw, IOC, SCOR & IAPSO 2010): brine salinity from the freezing line, p = 0, air-free."""
    sa_b = float(gsw.SA_freezing_from_t(t_c, 0.0, 0.0))
    return (1.0 - SA / sa_b) / (1.0 - SA / 1000.0)


@pytest.mark.parametrize("t_c", [-2.0, -3.0, -5.0, -6.0])
def test_seawater_follows_teos10_before_salts_change_the_brine(t_c):
    # Tolerance 0.003 of the water: TEOS-10 freezing temperatures agree with the measurements
    # within about 2 mK (from memory), plus 3 mK for the minor ions colligate lumps with a
    # major ion (0.005 K), times the steepest slope of the curve here (0.48 per K at -2 C).
    # A 0.01 K error of the ice point moves the -2 C value by 0.0048 and fails.
    curve = cg.IceCurve(cg.Solution.seawater(SA))
    assert curve.at(t_c + 273.15).ice_fraction == pytest.approx(teos10_ice_fraction(t_c), abs=0.003)


def test_seawater_curve_finite_and_monotonic_to_minus_30():
    curve = cg.IceCurve(cg.Solution.seawater(SA))
    temps = np.arange(-2.0, -30.01, -0.5) + 273.15
    ice, _, _ = curve.ice_fractions(temps)
    assert np.all(np.isfinite(ice))
    assert np.all(np.diff(ice) >= 0.0)  # ice only grows on cooling (common practice)
    names = [s["name"] for s in curve.salts]
    # Equilibrium path of standard seawater (Wolfenbarger et al. 2022, FREZCHEM v13.3 run):
    # gypsum, mirabilite, hydrohalite in that order, then the potassium and magnesium salts.
    assert names[:3] == ["gypsum", "mirabilite", "hydrohalite"]
    assert curve.end_reason == "final_eutectic"


def test_fractional_path_reaches_colder():
    eq = cg.IceCurve(cg.Solution.seawater(SA))
    fr = cg.IceCurve(cg.Solution.seawater(SA), path="fractional")
    assert fr.path == "fractional"
    assert fr.end_temperature < eq.end_temperature
    below = eq.at(eq.end_temperature - 1.0)
    assert below.state == "below_curve_end" and math.isnan(below.ice)
    assert below.validity.code == "below_curve_end"
    assert "final eutectic" in below.reason
    assert fr.at(eq.end_temperature - 1.0).state == "ice_salts_liquid"


@pytest.mark.parametrize("salt,hydrate", [("NaCl", "hydrohalite"), ("CaCl2", "antarcticite"),
                                          ("MgCl2", "magnesium chloride dodecahydrate")])
def test_binary_brine_ends_at_its_hydrate(salt, hydrate):
    curve = cg.IceCurve(cg.Solution.from_mass_fractions({salt: 0.05}))
    assert curve.end_reason == "final_eutectic"
    assert [s["name"] for s in curve.salts] == [hydrate]
    assert curve.at(curve.end_temperature + 0.01).state == "ice_and_liquid"


def test_above_freezing_point_no_ice_and_validity_record():
    curve = cg.IceCurve(cg.Solution.from_mass_fractions({"sucrose": 0.2}))
    st = curve.at(290.0)
    assert st.state == "liquid" and st.ice == 0.0
    assert st.validity.in_range and st.validity.code == "in_range"
    # Below the Norrish constants' range (checked 233.15-323.15 K, norrish.hpp): the first
    # limit crossed is reported as a record.
    cold = curve.at(220.0)
    assert cold.validity.code == "temperature_out_of_range"
    assert "norrish" in cold.validity.where
    assert cold.validity.value == 220.0
    assert cold.validity.range_low == pytest.approx(233.15)
    assert cold.validity.limit == pytest.approx(233.15)
    assert "233.15-323.15 K" in cold.reason


def test_unknown_path_names_the_valid_values():
    with pytest.raises(ValueError, match="equilibrium"):
        cg.IceCurve(cg.Solution.seawater(SA), path="sideways")


def test_table_columns_match_point_queries():
    import pandas as pd

    curve = cg.IceCurve(cg.Solution.seawater(SA))
    temps = np.array([275.0, 270.15, 265.15, 250.15, 230.0])
    df = pd.DataFrame(curve.table(temps))
    assert list(df["state"]) == ["liquid", "ice_and_liquid", "ice_salts_liquid", "ice_salts_liquid",
                                 "below_curve_end"]
    for i, t in enumerate(temps[:-1]):
        st = curve.at(float(t))
        assert df["ice_kg"][i] == st.ice  # the same states (bit-identical)
        assert df["hydrate_water_kg"][i] == st.hydrate_water
    # mass balance of the water (identity): ice + liquid + hydrate water = all the water
    ok = df["state"] != "below_curve_end"
    total = df["ice_kg"] + df["unfrozen_water_kg"] + df["hydrate_water_kg"]
    assert np.allclose(total[ok], cg.Solution.seawater(SA).water, rtol=0, atol=1e-12)
    assert (df["mirabilite_mol"][ok] >= 0).all() and df["mirabilite_mol"][3] > 0
