"""Bound water: one meaning everywhere (kg per kg of all the water), scalar and batch equal."""
from __future__ import annotations

import warnings

import numpy as np
import pandas as pd
import pytest

import colligate as cg
from colligate.ingredients import BOUND_WATER_PER_PROTEIN

SHARE = 0.08


def quiet(fn, *args, **kwargs):
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", cg.OutOfValidityRangeWarning)
        return fn(*args, **kwargs)


def dairy_rows(n=40, seed=4):
    """Molalities (mol per kg water) of ice-cream-like water phases (numbers of our own)."""
    rng = np.random.default_rng(seed)
    return pd.DataFrame({"sucrose": rng.uniform(0.4, 0.8, n), "lactose": rng.uniform(0.15, 0.30, n),
                         "milk_salts": rng.uniform(0.1, 0.2, n)},
                        index=pd.RangeIndex(10, 10 + n, name="mix"))


def test_scalar_and_batch_are_bit_identical_with_bound_water():
    df = dairy_rows()
    batch = cg.SolutionBatch.from_molalities(df)
    tf = quiet(cg.freezing_point, batch, bound_water_fraction_of_water=SHARE)
    ice = quiet(cg.ice_fraction, batch, [263.15, 255.15], bound_water_fraction_of_water=SHARE)
    ice1 = quiet(cg.ice_fraction, batch, 258.15, bound_water_fraction_of_water=SHARE)
    for i, (idx, row) in enumerate(df.iterrows()):
        s = cg.Solution.from_molalities(row.to_dict())
        assert quiet(cg.freezing_point, s, bound_water_fraction_of_water=SHARE) == tf.loc[idx]
        assert quiet(cg.ice_fraction, s, 255.15, bound_water_fraction_of_water=SHARE) == ice.iloc[i, 1]
        assert quiet(cg.ice_fraction, s, 258.15, bound_water_fraction_of_water=SHARE) == ice1.loc[idx]
        curve = cg.IceCurve(s, "auto", SHARE)
        assert curve.bound_water == SHARE * s.water


def test_batch_ice_fraction_no_longer_ignores_bound_water():
    batch = cg.SolutionBatch.from_molalities(dairy_rows(5))
    free = quiet(cg.ice_fraction, batch, 255.15)
    bound = quiet(cg.ice_fraction, batch, 255.15, bound_water_fraction_of_water=SHARE)
    assert np.all(bound.to_numpy() < free.to_numpy())
    # the share caps the ice: ice fraction < 1 - share (identity of the definition)
    assert np.all(quiet(cg.ice_fraction, batch, 233.15, bound_water_fraction_of_water=SHARE).to_numpy() < 1 - SHARE)


def test_same_meaning_in_ice_curve_enthalpy_and_recipe():
    s = cg.Solution.from_mass_fractions({"sucrose": 0.2})
    u = cg.unfrozen_phase(s, 258.15, bound_water_fraction_of_water=SHARE)
    assert u.bound_water == SHARE * s.water
    assert cg.IceCurve(s, "auto", SHARE).at(258.15).ice == u.ice
    # enthalpy: the latent part at -40 C equals that of the freezable water only
    comp = {"water": 0.8, "carbohydrate": 0.2}
    q0 = cg.heat_load(comp, s, 278.15, 258.15)
    qb = cg.heat_load(comp, s, 278.15, 258.15, bound_water_fraction_of_water=SHARE)
    assert qb["latent"] < q0["latent"]
    assert qb["ice_fraction_to"] == pytest.approx(cg.ice_fraction(s, 258.15, bound_water_fraction_of_water=SHARE),
                                                  abs=1e-9)
    # a recipe of ingredients: 0.4 kg per kg protein (Schwartzberg 1976 as presented by ASHRAE)
    r = cg.Recipe(ingredients={"whole_milk": 0.8, "sucrose": 0.2})
    protein = r.proximate["protein"] * r.total_mass
    assert r.bound_water_fraction_of_water == pytest.approx(BOUND_WATER_PER_PROTEIN * protein / r.water, rel=1e-12)
    assert r.freezing_point() == cg.freezing_point(
        r.solution(), bound_water_fraction_of_water=r.bound_water_fraction_of_water)


@pytest.mark.parametrize("bad", [-0.1, 1.0, float("nan")])
def test_bad_share_names_the_input(bad):
    s = cg.Solution.from_mass_fractions({"sucrose": 0.2})
    with pytest.raises(ValueError, match="bound_water_fraction_of_water"):
        cg.freezing_point(s, bound_water_fraction_of_water=bad)
    with pytest.raises(ValueError, match="bound_water_fraction_of_water"):
        cg.batch_freezing_point(cg.SolutionBatch.from_molalities(dairy_rows(2)),
                                bound_water_fraction_of_water=bad)
