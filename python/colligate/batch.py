"""Many formulations at once: ``SolutionBatch`` and the vectorised calculations.

A batch is a table of compositions with one column per solute and one row per
formulation. The loops run in C++ on all cores with the GIL released; a bad row never
aborts the batch: it gets NaN and a status code (see :data:`ROW_STATUS`), and a warning
says how many rows were affected.
"""
from __future__ import annotations

import warnings
from typing import Any, Mapping, Optional, Sequence, Union

import numpy as np

from . import _core

#: Row status codes of the batch kernels and their meaning (index = code).
ROW_STATUS: tuple[str, ...] = tuple(_core.row_status_reasons())
#: The codes, one enum defined in the C++ core (colligate::batch::row_status).
RowStatus = _core.RowStatus
OK, OUT_OF_RANGE = int(RowStatus.ok), int(RowStatus.out_of_range)


class BatchRowWarning(UserWarning):
    """Some rows of a batch were invalid, out of range or did not converge."""


def _columns(table: Any) -> tuple[list[str], np.ndarray, Optional[Any]]:
    """Species names, a C-contiguous float64 matrix and the caller's index (if pandas)."""
    try:
        import pandas as pd
    except ImportError:  # pragma: no cover
        pd = None
    if pd is not None and isinstance(table, pd.DataFrame):
        return [str(c) for c in table.columns], np.ascontiguousarray(table.to_numpy(dtype=float)), table.index
    if isinstance(table, Mapping):
        names = [str(k) for k in table]
        cols = []
        for k in table:
            col = np.asarray(table[k], dtype=float)
            if col.ndim > 1:
                raise _core.InvalidInputError(
                    f"column '{k}' has shape {col.shape}: each column must be 1-D (one value per "
                    "row); give one column per solute")
            cols.append(col.ravel())
        lengths = {len(c) for c in cols}
        if len(lengths) > 1:
            raise _core.InvalidInputError(f"all columns must have the same length, got {sorted(lengths)}")
        return names, np.ascontiguousarray(np.column_stack(cols) if cols else np.zeros((0, 0))), None
    raise _core.InvalidInputError(
        "a batch is built from a pandas DataFrame or a dict of equal-length arrays "
        f"(one column per solute), got {type(table).__name__}"
    )


class SolutionBatch:
    """Many solutions with one species list (rows are formulations).

    Build with :meth:`from_mass_fractions` or :meth:`from_molalities`. The functions
    ``freezing_point``, ``water_activity`` and ``ice_fraction`` accept a batch and return
    arrays, or pandas objects with the caller's index when built from a DataFrame.
    """

    def __init__(self, core: "_core.SolutionBatchCore", index: Optional[Any] = None) -> None:
        self._core = core
        self.index = index

    @classmethod
    def from_mass_fractions(cls, table: Any) -> "SolutionBatch":
        """Rows of solute mass fractions (each row's remainder is water)."""
        names, data, index = _columns(table)
        return cls(_core.SolutionBatchCore.from_mass_fractions(names, data), index)

    @classmethod
    def from_molalities(cls, table: Any) -> "SolutionBatch":
        """Rows of molalities, mol per kg of water."""
        names, data, index = _columns(table)
        return cls(_core.SolutionBatchCore.from_molalities(names, data), index)

    @property
    def species(self) -> list[str]:
        return list(self._core.species)

    def __len__(self) -> int:
        return int(self._core.rows)

    def __repr__(self) -> str:
        return f"SolutionBatch(rows={len(self)}, species={self.species})"


def _report(status: np.ndarray, what: str) -> None:
    from ._warnings import OutOfValidityRangeWarning

    n_range = int(np.count_nonzero(status == OUT_OF_RANGE))
    if n_range:
        warnings.warn(f"{what}: {n_range} row(s) {ROW_STATUS[OUT_OF_RANGE]}",
                      OutOfValidityRangeWarning, stacklevel=3)
    bad = (status != OK) & (status != OUT_OF_RANGE)
    if np.any(bad):
        codes, counts = np.unique(status[bad], return_counts=True)
        parts = [f"{n} row(s): {ROW_STATUS[c]}" for c, n in zip(codes, counts)]
        warnings.warn(f"{what}: " + "; ".join(parts) + " (values NaN)", BatchRowWarning, stacklevel=3)


def _wrap(values: np.ndarray, batch: SolutionBatch, name: str, columns: Optional[Sequence[float]] = None):
    if batch.index is None:
        return values
    import pandas as pd

    if values.ndim == 1:
        return pd.Series(values, index=batch.index, name=name)
    return pd.DataFrame(values, index=batch.index, columns=[f"{name}_{t:g}K" for t in columns])


def batch_freezing_point(batch: SolutionBatch, model: str = "auto", *, threads: int = 0,
                         range_policy: str = "extrapolate", bound_water_fraction: float = 0.0,
                         return_status: bool = False):
    """Initial freezing point of every row, K (NaN for failed rows)."""
    values, status = _core.batch_freezing_points(batch._core, model, threads, range_policy, bound_water_fraction)
    _report(status, "freezing_point")
    out = _wrap(values, batch, "freezing_point_K")
    return (out, status) if return_status else out


def batch_water_activity(batch: SolutionBatch, T: float = 298.15, model: str = "auto", *,
                         threads: int = 0, range_policy: str = "extrapolate", return_status: bool = False):
    """Water activity of every row at temperature ``T`` (K)."""
    values, status = _core.batch_water_activities(batch._core, float(T), model, threads, range_policy)
    _report(status, "water_activity")
    out = _wrap(values, batch, "water_activity")
    return (out, status) if return_status else out


def batch_ice_fraction(batch: SolutionBatch, T: Union[float, Sequence[float]], model: str = "auto", *,
                       threads: int = 0, range_policy: str = "extrapolate",
                       bound_water_fraction: float = 0.0, return_status: bool = False):
    """Ice fraction of every row at each temperature in ``T`` (K): shape (rows,) for a
    scalar ``T``, (rows, len(T)) otherwise."""
    scalar = np.ndim(T) == 0
    temps = np.atleast_1d(np.asarray(T, dtype=float))
    values, status = _core.batch_ice_fractions(batch._core, temps, model, threads, range_policy,
                                               bound_water_fraction)
    _report(status, "ice_fraction")
    if scalar:
        values, status = values[:, 0], status[:, 0]
        out = _wrap(values, batch, "ice_fraction")
    else:
        out = _wrap(values, batch, "ice_fraction", temps)
    return (out, status) if return_status else out
