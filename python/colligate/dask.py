"""Sweeps beyond one machine with Dask: the same batch kernels, one partition at a time.

    import dask.dataframe as dd
    from colligate.dask import freezing_points, ice_fractions
    ddf = dd.from_pandas(mass_fractions_df, npartitions=64)   # one column per solute
    tf = freezing_points(ddf)            # lazy dask Series, K, with the caller's index
    tf.compute()                         # or client.compute(tf) on a distributed cluster

Every helper takes the arguments of its pandas counterpart
(:func:`colligate.batch_freezing_point`, :func:`colligate.batch_water_activity`,
:func:`colligate.batch_ice_fraction`) with the same defaults, so both paths give the same
numbers bit for bit, NaN in the same places: ``range_policy="extrapolate"`` computes and
flags rows outside a model's validated range, ``"nan"`` turns them into NaN.
``return_status=True`` adds the row status codes (:data:`colligate.ROW_STATUS`) as a lazy
Series (or DataFrame) with the caller's index, computed in the same pass as the values
(compute both together: ``dask.compute(values, status)``).

Warnings are not hidden: each partition issues the warnings of the pandas path (with a
local scheduler they reach the caller; on a cluster they go to the worker logs, so use the
status codes to count rows out of range there).

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

__all__ = ["freezing_points", "water_activities", "ice_fractions"]

_BASES = ("mass_fractions", "molalities")


def _batch(part: pd.DataFrame, basis: str) -> SolutionBatch:
    if basis == "mass_fractions":
        return SolutionBatch.from_mass_fractions(part)
    return SolutionBatch.from_molalities(part)


def _check_basis(basis: str) -> str:
    if basis not in _BASES:
        raise ValueError(f"basis = {basis!r}: valid values are 'mass_fractions' and 'molalities'")
    return basis


def _both(values, status) -> pd.DataFrame:
    """Values and status of one partition side by side (split again lazily)."""
    if isinstance(values, pd.Series):
        return pd.DataFrame({values.name: values, "status": status})
    return pd.concat([values, status.add_prefix("status_")], axis=1)


def _partition_freezing_point(part, basis, model, threads, range_policy, bound):
    values, status = batch_freezing_point(_batch(part, basis), model, threads=threads, range_policy=range_policy,
                                          bound_water_fraction_of_water=bound, return_status=True)
    return _both(values, status)


def _partition_water_activity(part, basis, T, model, threads, range_policy):
    values, status = batch_water_activity(_batch(part, basis), T, model, threads=threads,
                                          range_policy=range_policy, return_status=True)
    return _both(values, status)


def _partition_ice_fraction(part, basis, temps, model, threads, range_policy, bound):
    values, status = batch_ice_fraction(_batch(part, basis), temps, model, threads=threads,
                                        range_policy=range_policy, bound_water_fraction_of_water=bound,
                                        return_status=True)
    return _both(values, status)


def _split(combined, value_columns, return_status: bool, series: bool):
    if series:
        values = combined[value_columns[0]]
        status = combined["status"]
    else:
        values = combined[value_columns]
        status = combined[[f"status_{c}" for c in value_columns]].rename(columns=lambda c: c[len("status_"):])
    return (values, status) if return_status else values


def freezing_points(ddf, basis: str = "mass_fractions", model: str = "auto", *, threads: int = 0,
                    range_policy: str = "extrapolate", bound_water_fraction_of_water: float = 0.0,
                    return_status: bool = False):
    """Initial freezing point (K) of every row of a dask DataFrame (lazy Series), as
    :func:`colligate.batch_freezing_point` gives it for a pandas DataFrame."""
    _check_basis(basis)
    meta = pd.DataFrame({"freezing_point_K": pd.Series(dtype=float), "status": pd.Series(dtype=np.uint8)})
    combined = ddf.map_partitions(_partition_freezing_point, basis, model, threads, range_policy,
                                  float(bound_water_fraction_of_water), meta=meta)
    return _split(combined, ["freezing_point_K"], return_status, series=True)


def water_activities(ddf, T: float = 298.15, basis: str = "mass_fractions", model: str = "auto", *,
                     threads: int = 0, range_policy: str = "extrapolate", return_status: bool = False):
    """Water activity at ``T`` (K) of every row of a dask DataFrame (lazy Series), as
    :func:`colligate.batch_water_activity`."""
    _check_basis(basis)
    meta = pd.DataFrame({"water_activity": pd.Series(dtype=float), "status": pd.Series(dtype=np.uint8)})
    combined = ddf.map_partitions(_partition_water_activity, basis, float(T), model, threads, range_policy,
                                  meta=meta)
    return _split(combined, ["water_activity"], return_status, series=True)


def ice_fractions(ddf, T: Sequence[float], basis: str = "mass_fractions", model: str = "auto", *,
                  threads: int = 0, range_policy: str = "extrapolate",
                  bound_water_fraction_of_water: float = 0.0, return_status: bool = False):
    """Ice fraction at each temperature in ``T`` (K) for every row (lazy DataFrame, one
    column per temperature), as :func:`colligate.batch_ice_fraction` with a list of
    temperatures."""
    _check_basis(basis)
    temps = np.atleast_1d(np.asarray(T, dtype=float))
    cols = [f"ice_fraction_{t:g}K" for t in temps]
    meta = pd.DataFrame({**{c: pd.Series(dtype=float) for c in cols},
                         **{f"status_{c}": pd.Series(dtype=np.uint8) for c in cols}})
    combined = ddf.map_partitions(_partition_ice_fraction, basis, temps, model, threads, range_policy,
                                  float(bound_water_fraction_of_water), meta=meta)
    return _split(combined, cols, return_status, series=False)
