"""Sweeps beyond one machine with Dask: the same batch kernels, one partition at a time.

    import dask.dataframe as dd
    from colligate.dask import freezing_points, ice_fractions
    ddf = dd.from_pandas(mass_fractions_df, npartitions=64)   # one column per solute
    tf = freezing_points(ddf)            # lazy dask Series, K, with the caller's index
    tf.compute()                         # or client.compute(tf) on a distributed cluster

To use a real cluster, create a ``distributed.Client("tcp://scheduler:8786")`` before
calling ``compute``; every worker needs colligate installed. Each partition runs the
multi-threaded C++ kernel (``threads`` per worker process, default all its cores).
Dask is imported lazily; install it with ``pip install "dask[dataframe,distributed]"``.
"""
from __future__ import annotations

from typing import Sequence

import numpy as np
import pandas as pd

from .batch import SolutionBatch, batch_freezing_point, batch_ice_fraction, batch_water_activity


def _partition_freezing_point(part: pd.DataFrame, basis: str, model: str, threads: int) -> pd.Series:
    batch = _batch(part, basis)
    return batch_freezing_point(batch, model, threads=threads, range_policy="nan")


def _partition_water_activity(part: pd.DataFrame, basis: str, T: float, model: str, threads: int) -> pd.Series:
    return batch_water_activity(_batch(part, basis), T, model, threads=threads, range_policy="nan")


def _partition_ice_fraction(part: pd.DataFrame, basis: str, temps: np.ndarray, model: str,
                            threads: int) -> pd.DataFrame:
    return batch_ice_fraction(_batch(part, basis), temps, model, threads=threads, range_policy="nan")


def _batch(part: pd.DataFrame, basis: str) -> SolutionBatch:
    if basis == "mass_fractions":
        return SolutionBatch.from_mass_fractions(part)
    if basis == "molalities":
        return SolutionBatch.from_molalities(part)
    raise ValueError(f"basis = {basis!r}: valid values are 'mass_fractions' and 'molalities'")


def _quiet(fn):
    def run(*args, **kwargs):
        import warnings

        from ._warnings import OutOfValidityRangeWarning
        from .batch import BatchRowWarning

        with warnings.catch_warnings():  # status is carried by NaN in distributed sweeps
            warnings.simplefilter("ignore", OutOfValidityRangeWarning)
            warnings.simplefilter("ignore", BatchRowWarning)
            return fn(*args, **kwargs)

    return run


def freezing_points(ddf, basis: str = "mass_fractions", model: str = "auto", threads: int = 0):
    """Initial freezing point (K) of every row of a dask DataFrame (lazy Series).
    Rows that are invalid or outside the model's range give NaN."""
    meta = pd.Series(dtype=float, name="freezing_point_K")
    return ddf.map_partitions(_quiet(_partition_freezing_point), basis, model, threads, meta=meta)


def water_activities(ddf, T: float = 298.15, basis: str = "mass_fractions", model: str = "auto",
                     threads: int = 0):
    """Water activity at ``T`` (K) of every row of a dask DataFrame (lazy Series)."""
    meta = pd.Series(dtype=float, name="water_activity")
    return ddf.map_partitions(_quiet(_partition_water_activity), basis, float(T), model, threads, meta=meta)


def ice_fractions(ddf, T: Sequence[float], basis: str = "mass_fractions", model: str = "auto",
                  threads: int = 0):
    """Ice fraction at each temperature in ``T`` (K) for every row (lazy DataFrame)."""
    temps = np.atleast_1d(np.asarray(T, dtype=float))
    meta = pd.DataFrame({f"ice_fraction_{t:g}K": pd.Series(dtype=float) for t in temps})
    return ddf.map_partitions(_quiet(_partition_ice_fraction), basis, temps, model, threads, meta=meta)
