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
    (extra,) = cg.Solution.from_molalities({extra: 1.0}).solutes  # its id ('NaCl' -> 'sodium_chloride')
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


# --- issue 16: bounds under every policy, monotonicity with salts, scalar == batch --------

SALTS = ["NaCl", "KCl", "CaCl2", "MgCl2"]
MODELS = ["auto", "ideal", "raoult", "norrish", "pitzer", "ross"]
salt_fraction = st.floats(min_value=0.0, max_value=0.06, allow_nan=False)
mixtures = st.tuples(
    st.dictionaries(st.sampled_from(NON_ELECTROLYTES), st.floats(min_value=0.0, max_value=0.12),
                    max_size=3),
    st.dictionaries(st.sampled_from(SALTS), salt_fraction, max_size=2),
).map(lambda t: {**t[0], **t[1]}).filter(lambda d: 0.0 < sum(d.values()) < 0.6)
any_temperature = st.floats(min_value=150.0, max_value=330.0, allow_nan=False)


def evaluate(fn, *args, **kwargs):
    """fn's value, or NaN when it refuses (an error under 'raise', an unusable model): the
    bounds must hold for every number that comes out."""
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        try:
            return fn(*args, **kwargs)
        except (cg.InvalidInputError, cg.OutOfValidityRangeError, cg.ConvergenceError):
            return float("nan")


@settings(max_examples=80, deadline=None)
@given(mixtures, any_temperature, st.sampled_from(MODELS), st.sampled_from(["extrapolate", "nan", "raise"]))
def test_no_policy_returns_a_value_outside_physical_bounds(recipe, T, model, policy):
    # Physical bounds (common practice): 0 < a_w <= 1, 0 <= ice fraction <= 1, T > 0.
    s = cg.Solution.from_mass_fractions(recipe)
    aw = evaluate(cg.water_activity, s, T, model, range_policy=policy)
    assert np.isnan(aw) or 0.0 < aw <= 1.0
    phi = evaluate(cg.osmotic_coefficient, s, T, model, range_policy=policy)
    assert np.isnan(phi) or phi >= 0.0
    f = evaluate(cg.ice_fraction, s, T, model, range_policy=policy)
    assert np.isnan(f) or 0.0 <= f <= 1.0
    tf = evaluate(cg.freezing_point, s, model, range_policy=policy)
    assert np.isnan(tf) or 0.0 < tf <= 273.15
    ice_aw = evaluate(cg.water_activity_of_ice, T, range_policy=policy)
    assert np.isnan(ice_aw) or 0.0 < ice_aw <= 1.0


@settings(max_examples=40, deadline=None)
@given(mixtures, st.sampled_from(NON_ELECTROLYTES + SALTS), st.floats(min_value=1e-3, max_value=0.03))
def test_more_solute_lowers_freezing_point_and_water_activity(recipe, extra, amount):
    base = cg.Solution.from_mass_fractions(recipe)
    more = dict(base.solutes)
    # base.solutes is keyed by the built-in ids ("sodium_chloride"), SALTS by formula ("NaCl")
    key = next(iter(cg.Solution(water=1.0, solutes={extra: 1.0}).solutes))
    more[key] = more.get(key, 0.0) + amount
    richer = cg.Solution(water=base.water, solutes=more)
    tf0, tf1 = quietly(cg.freezing_point, base), quietly(cg.freezing_point, richer)
    if np.isfinite(tf0) and np.isfinite(tf1):
        assert tf1 <= tf0
    aw0, aw1 = quietly(cg.water_activity, base, 298.15), quietly(cg.water_activity, richer, 298.15)
    assert aw1 <= aw0


@settings(max_examples=30, deadline=None)
@given(mixtures)
def test_ice_curve_rises_to_its_end_and_conserves_water(recipe):
    # Colder -> more ice, down to the end of the curve (the final eutectic of a brine);
    # below it no value (NaN), never a smaller one. Water balance: ice + unfrozen + bound +
    # salt-hydrate water = total water (to rounding).
    s = cg.Solution.from_mass_fractions(recipe)
    curve = cg.IceCurve(s)
    temps = np.linspace(273.0, 216.0, 58)
    states = [curve.at(float(T)) for T in temps]
    f = np.array([st_.ice_fraction for st_ in states])
    finite = np.isfinite(f)
    if finite.any():
        last = int(np.nonzero(finite)[0][-1])
        assert finite[: last + 1].all(), "a gap in the curve above its end"
        assert np.all(np.diff(f[: last + 1]) >= -1e-12)
        assert np.all((f[finite] >= 0.0) & (f[finite] <= 1.0))
    for st_ in states[::7]:
        if np.isfinite(st_.ice):
            total = st_.ice + st_.unfrozen_water + st_.bound_water + st_.hydrate_water
            assert abs(total - s.water) <= 1e-12 * s.water
        else:
            assert st_.reason


rows = st.lists(st.tuples(st.floats(0.0, 0.2), st.floats(0.0, 0.2), st.floats(0.0, 0.04)),
                min_size=1, max_size=12)


@settings(max_examples=25, deadline=None)
@given(rows, st.integers(min_value=1, max_value=4))
def test_batch_equals_scalar_bit_for_bit(table, threads):
    # The contributor guide promises bit-identical batch and scalar results (mass fractions
    # included) whatever the thread count.
    data = {"sucrose": [r[0] for r in table], "glucose": [r[1] for r in table],
            "NaCl": [r[2] for r in table]}
    batch = cg.SolutionBatch.from_mass_fractions(data)
    temps = np.array([268.0, 256.0])
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        tf = cg.batch_freezing_point(batch, threads=threads)
        aw = cg.batch_water_activity(batch, 298.15, threads=threads)
        ice = cg.batch_ice_fraction(batch, temps, threads=threads)
        for i, r in enumerate(table):
            s = cg.Solution.from_mass_fractions({"sucrose": r[0], "glucose": r[1], "NaCl": r[2]})
            assert tf[i] == cg.freezing_point(s) or (np.isnan(tf[i]) and np.isnan(cg.freezing_point(s)))
            assert aw[i] == cg.water_activity(s, 298.15)
            for k, T in enumerate(temps):
                scalar = evaluate(cg.ice_fraction, s, float(T))
                assert ice[i, k] == scalar or (np.isnan(ice[i, k]) and np.isnan(scalar))
