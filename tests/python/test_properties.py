"""Property tests (hypothesis) of the equilibrium calculations."""
from __future__ import annotations

import warnings

import numpy as np
from hypothesis import given, settings
from hypothesis import strategies as st

import colligate as cg

NON_ELECTROLYTES = ["sucrose", "glucose", "fructose", "maltose", "glycerol", "sorbitol",
                    "xylitol", "citric_acid", "lactose"]

fraction = st.floats(min_value=1e-3, max_value=0.08, allow_nan=False)
recipes = st.dictionaries(st.sampled_from(NON_ELECTROLYTES), fraction, min_size=1, max_size=4)


def quietly(fn, *args, **kwargs):
    """Calls fn with out-of-range warnings silenced (concentrated unfrozen phases at low
    temperature leave the validated range; the property must hold all the same)."""
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", cg.OutOfValidityRangeWarning)
        return fn(*args, **kwargs)


@settings(max_examples=60, deadline=None)
@given(recipes, st.sampled_from(NON_ELECTROLYTES), st.floats(min_value=1e-4, max_value=0.05))
def test_adding_solute_never_raises_the_freezing_point(recipe, extra, amount):
    base = cg.Solution.from_mass_fractions(recipe, total_mass=1.0)
    more = dict(base.solutes)
    more[extra] = more.get(extra, 0.0) + amount
    richer = cg.Solution(water=base.water, solutes=more)
    assert quietly(cg.freezing_point, richer) <= quietly(cg.freezing_point, base)


@settings(max_examples=40, deadline=None)
@given(recipes, st.floats(min_value=0.0, max_value=0.05))
def test_ice_fraction_rises_as_temperature_falls_and_balances(recipe, bound_share):
    s = cg.Solution.from_mass_fractions(recipe)
    temps = np.linspace(272.0, 238.15, 25)
    f = quietly(cg.ice_fraction, s, temps, bound_water_fraction_of_water=bound_share)
    assert np.all(f >= 0.0) and np.all(f < 1.0)
    assert np.all(np.diff(f) >= 0.0)
    for T in temps[::6]:
        u = quietly(cg.unfrozen_phase, s, float(T), bound_water_fraction_of_water=bound_share)
        total = u.ice + u.unfrozen_water + u.bound_water
        assert abs(total - s.water) <= 1e-12 * s.water


@settings(max_examples=60, deadline=None)
@given(recipes, st.floats(min_value=0.0, max_value=0.005))
def test_water_activity_in_unit_interval(recipe, salt):
    recipe = dict(recipe)
    recipe["NaCl"] = salt
    s = cg.Solution.from_mass_fractions(recipe)
    aw = quietly(cg.water_activity, s, 298.15)
    assert 0.0 < aw <= 1.0
