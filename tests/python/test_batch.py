"""Batch (vectorised) calculations: equal to scalar calls, robust to bad rows."""
from __future__ import annotations

import warnings

import numpy as np
import pandas as pd
import pytest

import colligate as cg

SPECIES = ["sucrose", "glucose", "fructose", "lactose", "glycerol", "citric_acid"]


def random_molalities(n, seed=0):
    rng = np.random.default_rng(seed)
    return pd.DataFrame(rng.uniform(0.0, 0.25, (n, len(SPECIES))), columns=SPECIES,
                        index=pd.RangeIndex(100, 100 + n, name="formulation"))


def quiet(fn, *args, **kwargs):
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", cg.OutOfValidityRangeWarning)
        warnings.simplefilter("ignore", cg.BatchRowWarning)
        return fn(*args, **kwargs)


def test_batch_equals_scalar_bit_for_bit():
    df = random_molalities(50)
    batch = cg.SolutionBatch.from_molalities(df)
    tf = quiet(cg.freezing_point, batch)
    aw = quiet(cg.water_activity, batch, 298.15)
    ice = quiet(cg.ice_fraction, batch, [268.15, 258.15])
    assert list(tf.index) == list(df.index)  # the caller's index is kept
    for i, (idx, row) in enumerate(df.iterrows()):
        s = cg.Solution.from_molalities(row.to_dict())
        assert quiet(cg.freezing_point, s) == tf.loc[idx]
        assert quiet(cg.water_activity, s, 298.15) == aw.loc[idx]
        assert quiet(cg.ice_fraction, s, 258.15) == ice.iloc[i, 1]


def test_thread_count_does_not_change_results():
    batch = cg.SolutionBatch.from_molalities(random_molalities(2000, seed=3))
    one = quiet(cg.batch_freezing_point, batch, threads=1)
    two = quiet(cg.batch_freezing_point, batch, threads=2)
    assert np.array_equal(one.to_numpy(), two.to_numpy())


def test_bad_rows_get_nan_and_status_and_leave_good_rows_untouched():
    df = random_molalities(200, seed=5)
    clean = quiet(cg.batch_freezing_point, cg.SolutionBatch.from_molalities(df)).to_numpy()
    corrupted = df.copy()
    bad = np.arange(0, 200, 10)
    corrupted.iloc[bad, 0] = np.nan
    corrupted.iloc[bad[::2], 1] = -1.0
    with pytest.warns(cg.BatchRowWarning, match="20 row\\(s\\): invalid input"):
        values, status = cg.batch_freezing_point(cg.SolutionBatch.from_molalities(corrupted),
                                                 return_status=True)
    values = values.to_numpy()
    assert np.all(np.isnan(values[bad]))
    assert status.index.equals(corrupted.index)  # status codes come back with the caller's index
    assert np.all(status.to_numpy()[bad] == 2)
    good = np.setdiff1d(np.arange(200), bad)
    assert np.array_equal(values[good], clean[good])


def test_mass_fraction_rows_summing_to_one_are_invalid():
    df = pd.DataFrame({"sucrose": [0.2, 0.7], "glucose": [0.1, 0.4]})
    with pytest.warns(cg.BatchRowWarning):
        tf = cg.freezing_point(cg.SolutionBatch.from_mass_fractions(df))
    assert np.isfinite(tf.iloc[0]) and np.isnan(tf.iloc[1])


def test_dict_input_returns_arrays_and_errors_are_clear():
    batch = cg.SolutionBatch.from_mass_fractions({"sucrose": [0.1, 0.2], "glucose": [0.0, 0.05]})
    out = cg.freezing_point(batch)
    assert isinstance(out, np.ndarray) and out.shape == (2,)
    with pytest.raises(cg.InvalidInputError, match="unknown solute"):
        cg.SolutionBatch.from_mass_fractions({"sucrse": [0.1]})
    with pytest.raises(cg.InvalidInputError, match="same length"):
        cg.SolutionBatch.from_mass_fractions({"sucrose": [0.1], "glucose": [0.1, 0.2]})
    with pytest.raises(cg.InvalidInputError, match="raise"):
        cg.batch_freezing_point(batch, range_policy="raise")
