"""Dask and pandas paths: the same arguments and defaults, the same numbers bit for bit
(NaN in the same places), status codes with the caller's index."""
from __future__ import annotations

import warnings

import numpy as np
import pandas as pd
import pytest

import colligate as cg

dask = pytest.importorskip("dask")
import dask.dataframe as dd  # noqa: E402

from colligate.dask import freezing_points, ice_fractions, water_activities  # noqa: E402

TEMPS = [263.15, 255.15, 243.15]


def dairy_sweep(n: int = 600, seed: int = 2) -> pd.DataFrame:
    """Ice-cream-like water phases (numbers of our own): sucrose, lactose and milk salts, with
    a few invalid rows (negative, NaN, fractions summing above 1)."""
    rng = np.random.default_rng(seed)
    df = pd.DataFrame({"sucrose": rng.uniform(0.05, 0.30, n), "lactose": rng.uniform(0.02, 0.10, n),
                       "milk_salts": rng.uniform(0.004, 0.012, n)},
                      index=pd.RangeIndex(5000, 5000 + n, name="mix"))
    df.iloc[7, 0] = -0.1
    df.iloc[11, 1] = np.nan
    df.iloc[13, 0] = 1.2
    return df


def both(fn_dask, fn_pandas, df, *args, **kwargs):
    ddf = dd.from_pandas(df, npartitions=6)
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")  # the same warnings on both paths; compared below
        remote_values, remote_status = dask.compute(*fn_dask(ddf, *args, return_status=True, **kwargs),
                                                    scheduler="sync")
        local_values, local_status = fn_pandas(cg.SolutionBatch.from_mass_fractions(df), *args,
                                               return_status=True, **kwargs)
    return remote_values, remote_status, local_values, local_status


@pytest.mark.parametrize("policy", [None, "nan"])
def test_dask_equals_pandas_bit_for_bit_on_a_dairy_sweep(policy):
    df = dairy_sweep()
    kw = {} if policy is None else {"range_policy": policy}
    rv, rs, lv, ls = both(freezing_points, cg.batch_freezing_point, df, **kw)
    pd.testing.assert_series_equal(rv, lv, check_exact=True)
    pd.testing.assert_series_equal(rs, ls, check_exact=True)
    assert rs.index.equals(df.index)
    rv, rs, lv, ls = both(ice_fractions, cg.batch_ice_fraction, df, TEMPS, bound_water_fraction_of_water=0.05, **kw)
    pd.testing.assert_frame_equal(rv, lv, check_exact=True)
    pd.testing.assert_frame_equal(rs, ls, check_exact=True)
    assert np.array_equal(np.isnan(rv.to_numpy()), np.isnan(lv.to_numpy()))  # NaN in the same places
    rv, rs, lv, ls = both(water_activities, cg.batch_water_activity, df, 298.15, **kw)
    pd.testing.assert_series_equal(rv, lv, check_exact=True)
    # the default computes out-of-range rows (flagged), as the pandas path does: only the
    # invalid rows are NaN
    if policy is None:
        rv, rs, _, _ = both(ice_fractions, cg.batch_ice_fraction, df, TEMPS)
        nan_rows = set(rv.index[rv.isna().any(axis=1)])
        assert {5007, 5011, 5013} <= nan_rows
        assert (rs.to_numpy() == int(cg.RowStatus.out_of_range)).any()


def test_dask_warnings_are_not_hidden():
    df = dairy_sweep(60)
    ddf = dd.from_pandas(df, npartitions=2)
    with pytest.warns(cg.BatchRowWarning, match="invalid input"):
        freezing_points(ddf).compute(scheduler="sync")


def test_bad_column_is_named():
    df = dairy_sweep(20).astype(object)
    df.iloc[3, 1] = "lots"
    with pytest.raises(ValueError, match="column 'lactose'"):
        cg.SolutionBatch.from_mass_fractions(df)
    # rows that are bad get NaN; the warning names their index label and the column at fault
    with pytest.warns(cg.BatchRowWarning, match=r"5007 \(sucrose = -0\.1\), 5011 \(lactose = nan\), "
                                                r"5013 \(mass fractions add up to"):
        cg.batch_freezing_point(cg.SolutionBatch.from_mass_fractions(dairy_sweep(20)))
    with pytest.raises(ValueError, match="sucrse"):
        cg.SolutionBatch.from_mass_fractions(dairy_sweep(20).rename(columns={"sucrose": "sucrse"}))
