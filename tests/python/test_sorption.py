"""Sorption isotherms, their fit, and moisture equilibrium (colligate.sorption)."""
import numpy as np
import pytest

import colligate as cg
from colligate.sorption import Isotherm, isosteric_heat, shift_water_activity

# GAB constants used to make test data (an identity check of the fitter; no published
# data set is used here).
TRUE = {"xm": 0.065, "c": 11.0, "k": 0.84}
AW = np.array([0.11, 0.23, 0.33, 0.43, 0.53, 0.64, 0.75, 0.85])


def _data(error=0.0):
    x = Isotherm("gab", TRUE).moisture(AW)
    return x * (1.0 + error * np.where(np.arange(len(AW)) % 2, 1.0, -1.0))


def test_fit_gab_recovers_constants_with_intervals(tmp_path):
    fit = cg.fit_gab(_data(0.02), AW, temperature=298.15)
    assert fit.success
    ci = fit.ci(0.95)
    for name, value in TRUE.items():
        assert ci.loc[name, "lower"] < value < ci.loc[name, "upper"]
    exact = cg.fit_gab(_data(), AW)
    for name, value in TRUE.items():
        assert exact.params[name] == pytest.approx(value, rel=1e-5)
    png = fit.plot(tmp_path / "gab.png")  # data, curve and residual panel
    assert (tmp_path / "gab.png").stat().st_size > 1000 and png.endswith("gab.png")


def test_fitted_isotherm_warns_outside_its_data_range():
    iso = cg.fit_gab(_data(), AW).isotherm
    assert iso.aw_range == (0.11, 0.85)
    with pytest.warns(cg.OutOfValidityRangeWarning, match="0.11-0.85"):
        iso.moisture(0.95)
    assert iso.water_activity(iso.moisture(0.5)) == pytest.approx(0.5, abs=1e-10)


def test_bad_input_names_the_field():
    with pytest.raises(ValueError, match="water_activity"):
        cg.fit_gab(_data(), np.where(AW > 0.8, 1.2, AW))
    with pytest.raises(ValueError, match="moisture"):
        cg.fit_gab(-_data(), AW)
    with pytest.raises(ValueError, match="water_activity"):
        Isotherm("gab", TRUE).moisture(0.0)
    with pytest.raises(ValueError, match="'henderson'"):
        Isotherm("henderson", TRUE).moisture(0.3)


def test_bet_and_oswin_fits_run():
    low = AW <= 0.45
    assert cg.fit_bet(_data()[low], AW[low]).success
    assert cg.fit_oswin(_data(), AW).success


def test_two_layer_moisture_migration_end_state():
    # An invented pair (not published): a dry wafer and a moist cream filling.
    wafer = Isotherm("gab", {"xm": 0.055, "c": 12.0, "k": 0.80})
    cream = Isotherm("gab", {"xm": 0.10, "c": 4.0, "k": 0.95})
    r = cg.moisture_equilibrium([(wafer, 0.30, 0.03), (cream, 0.10, 0.45)])
    assert r["converged"]
    assert sum(r["water_gained"]) == pytest.approx(0.0, abs=1e-12)
    assert r["initial_water_activity"][0] < r["water_activity"] < r["initial_water_activity"][1]
    assert wafer.water_activity(r["moisture"][0]) == pytest.approx(r["water_activity"], abs=1e-9)


def test_clausius_clapeyron_round_trip():
    cool = Isotherm("oswin", {"a": 0.11, "b": 0.4}, 298.15)
    warm = Isotherm("oswin", {"a": 0.09, "b": 0.4}, 318.15)
    q = isosteric_heat(cool, warm, 0.10)
    assert q > 0.0
    assert shift_water_activity(cool.water_activity(0.10), 298.15, 318.15, q) == pytest.approx(
        warm.water_activity(0.10), rel=1e-10)


def test_growth_limits_show_the_caution():
    # Beuchat (1981), table 1 (from memory): most spoilage moulds 0.80, most yeasts 0.88,
    # most bacteria 0.91; a 0.85 product sits between them.
    df = cg.sorption.growth_limits(0.85)
    lim = dict(zip(df["organisms"], df["minimum_water_activity"]))
    assert lim["most spoilage moulds"] == 0.80 and lim["most spoilage bacteria"] == 0.91
    grows = dict(zip(df["organisms"], df["growth_possible"]))
    assert grows["most spoilage moulds"] and not grows["most spoilage bacteria"]
    assert "does not make a food safe" in df.attrs["caution"]
    assert set(df["source"]) <= set(cg.citations().index)
    with pytest.raises(ValueError, match="water_activity"):
        cg.sorption.growth_limits(1.5)
