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


def _numeric_column(name: str, values: Any) -> np.ndarray:
    """One column as float64; a column that is not numeric is an error naming it."""
    try:
        col = np.asarray(values, dtype=float)
    except (TypeError, ValueError) as exc:
        raise _core.InvalidInputError(
            f"column '{name}': not numeric ({exc}); give each solute's amounts as numbers") from None
    if col.ndim > 1:
        raise _core.InvalidInputError(
            f"column '{name}' has shape {col.shape}: each column must be 1-D (one value per "
            "row); give one column per solute")
    return col.ravel()


def _columns(table: Any) -> tuple[list[str], np.ndarray, Optional[Any]]:
    """Species names, a C-contiguous float64 matrix and the caller's index (if pandas)."""
    try:
        import pandas as pd
    except ImportError:  # pragma: no cover
        pd = None
    if pd is not None and isinstance(table, pd.DataFrame):
        names = [str(c) for c in table.columns]
        if len(set(names)) != len(names):
            dup = next(n for n in names if names.count(n) > 1)
            raise _core.InvalidInputError(f"column '{dup}' appears more than once; one column per solute")
        cols = [_numeric_column(n, table[c]) for n, c in zip(names, table.columns)]
        data = np.column_stack(cols) if cols else np.zeros((len(table.index), 0))
        return names, np.ascontiguousarray(data, dtype=float), table.index
    if isinstance(table, Mapping):
        names = [str(k) for k in table]
        cols = [_numeric_column(str(k), table[k]) for k in table]
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

    def __init__(self, core: "_core.SolutionBatchCore", index: Optional[Any] = None, *,
                 data: Optional[np.ndarray] = None, basis: str = "") -> None:
        self._core = core
        self.index = index
        self._data = data    # the caller's matrix, to name the bad cells in warnings
        self._basis = basis

    @classmethod
    def from_mass_fractions(cls, table: Any, *, library: Optional[Any] = None) -> "SolutionBatch":
        """Rows of solute mass fractions (each row's remainder is water). ``library``: a
        :class:`colligate.fit.SoluteLibrary` (own and fitted solutes next to the built-in
        ones), so a batch can hold fitted solutes and carry their uncertainty."""
        names, data, index = _columns(table)
        return cls(_core.SolutionBatchCore.from_mass_fractions(names, data, library), index, data=data,
                   basis="mass_fractions")

    @classmethod
    def from_molalities(cls, table: Any, *, library: Optional[Any] = None) -> "SolutionBatch":
        """Rows of molalities, mol per kg of water (``library`` as in :meth:`from_mass_fractions`)."""
        names, data, index = _columns(table)
        return cls(_core.SolutionBatchCore.from_molalities(names, data, library), index, data=data,
                   basis="molalities")

    @property
    def species(self) -> list[str]:
        return list(self._core.species)

    def __len__(self) -> int:
        return int(self._core.rows)

    def __repr__(self) -> str:
        return f"SolutionBatch(rows={len(self)}, species={self.species})"


def _row_problems(batch: "SolutionBatch", status: np.ndarray) -> str:
    """The first rows with a bad status, by the caller's index label (at most 5), each with
    the column at fault where the input shows it (negative or not finite, or mass fractions
    adding up to 1 or more)."""
    flat = status if status.ndim == 1 else status.max(axis=1)
    rows = np.flatnonzero((flat != OK) & (flat != OUT_OF_RANGE))[:5]
    if rows.size == 0:
        return ""
    names = batch.species
    parts = []
    for i in rows:
        label = str(batch.index[i]) if batch.index is not None else str(i)
        why = ""
        if batch._data is not None and batch._data.shape[1] == len(names):
            row = batch._data[i]
            bad = [f"{names[j]} = {row[j]:g}" for j in range(len(names)) if not (np.isfinite(row[j]) and row[j] >= 0.0)]
            if bad:
                why = f" ({', '.join(bad)})"
            elif batch._basis == "mass_fractions" and row.sum() >= 1.0:
                why = f" (mass fractions add up to {row.sum():g})"
        parts.append(label + why)
    return f"; first rows: {', '.join(parts)}"


def _report(status: np.ndarray, what: str, batch: "Optional[SolutionBatch]" = None) -> None:
    from ._warnings import OutOfValidityRangeWarning

    n_range = int(np.count_nonzero(status == OUT_OF_RANGE))
    if n_range:
        warnings.warn(f"{what}: {n_range} row(s) {ROW_STATUS[OUT_OF_RANGE]}",
                      OutOfValidityRangeWarning, stacklevel=3)
    bad = (status != OK) & (status != OUT_OF_RANGE)
    if np.any(bad):
        codes, counts = np.unique(status[bad], return_counts=True)
        parts = [f"{n} row(s): {ROW_STATUS[c]}" for c, n in zip(codes, counts)]
        where = _row_problems(batch, status) if batch is not None else ""
        warnings.warn(f"{what}: " + "; ".join(parts) + " (values NaN)" + where, BatchRowWarning, stacklevel=3)


def _wrap(values: np.ndarray, batch: SolutionBatch, name: str, columns: Optional[Sequence[float]] = None):
    """Values (or row status codes) with the caller's index when the batch came from pandas."""
    if batch.index is None:
        return values
    import pandas as pd

    if values.ndim == 1:
        return pd.Series(values, index=batch.index, name=name)
    return pd.DataFrame(values, index=batch.index, columns=[f"{name}_{t:g}K" for t in columns])


def _result(values, status, batch, name, return_status, temps=None):
    out = _wrap(values, batch, name, temps)
    if not return_status:
        return out
    # status codes: a Series named "status", or a DataFrame with the value columns' names
    return out, _wrap(status, batch, "status" if temps is None else name, temps)


def batch_freezing_point(batch: SolutionBatch, model: str = "auto", *, threads: int = 0,
                         range_policy: str = "extrapolate", bound_water_fraction_of_water: float = 0.0,
                         return_status: bool = False, parameter_set: Optional[str] = None,
                         metastable: bool = False):
    """Initial freezing point of every row, K (NaN for failed rows).

    ``bound_water_fraction_of_water``: water that cannot freeze, kg per kg of each row's
    water, in [0, 1) (as in :func:`colligate.freezing_point`). With ``return_status`` the
    row status codes (see :data:`ROW_STATUS`) come back too, with the caller's index.
    ``parameter_set`` and ``metastable`` as in :func:`colligate.freezing_point`: a row richer
    in salt than its eutectic composition gives the salt's crystallisation temperature
    unless ``metastable`` (no warning per row here; :func:`colligate.freezing_point` names
    the salt)."""
    values, status = _core.batch_freezing_points(batch._core, model, threads, range_policy,
                                                 bound_water_fraction_of_water, parameter_set or "",
                                                 bool(metastable))
    _report(status, "freezing_point", batch)
    return _result(values, status, batch, "freezing_point_K", return_status)


def seawater_freezing_point(absolute_salinity, *, parameter_set: Optional[str] = None, threads: int = 0,
                            return_status: bool = False):
    """Freezing point, K, of seawater of the TEOS-10 Reference Composition
    (:meth:`Solution.seawater`) from its absolute salinity alone (g of sea salt per kg of
    seawater; a number or an array of any shape, the result has the same shape).

    The same freezing points as :func:`batch_freezing_point` gives for those solutions under
    the Pitzer model, read from that model's freezing line (a Chebyshev series in
    sqrt(SA) of 40 of its exact freezing points, checked against the model when built:
    within 1e-10 K, in practice about 1e-11 K) up to 50 g/kg, where ice is the first solid
    and every point lies in the model's validated range; above 50 g/kg each salinity is
    solved by the exact path. A point on the line costs a square root and a 40-term
    recurrence, so long salinity sweeps run at about the cost of TEOS-10's fitted polynomial.
    ``parameter_set``: a Pitzer parameter set other than the default builds its own line
    (a few milliseconds per call), or, for a set whose validated range misses the
    freezing line, solves every salinity exactly. A salinity that is not finite or not in
    [0, 120) g/kg raises :class:`InvalidInputError` naming it. With ``return_status`` the
    row status codes (see :data:`ROW_STATUS`) come back too.

    Caution: seawater and brine freezing points are model estimates at sea-level pressure
    for air-free water of the Reference Composition; verify by measurement where it
    matters, and defer to local codes and licensed practice.
    """
    SA = np.asarray(absolute_salinity, dtype=float)
    flat = np.ascontiguousarray(SA.reshape(-1))
    bad = ~np.isfinite(flat) | (flat < 0.0) | (flat >= 120.0)
    if np.any(bad):
        i = int(np.flatnonzero(bad)[0])
        where = "" if SA.ndim == 0 else f"[{i}]"
        raise _core.InvalidInputError(
            f"seawater_freezing_point: absolute_salinity{where} = {flat[i]!r} g/kg: must be finite and "
            "in [0, 120) g/kg")
    values, status = _core.seawater_freezing_points(flat, threads, parameter_set or "")
    _report(status, "seawater_freezing_point")
    values = values.reshape(SA.shape)
    status = status.reshape(SA.shape)
    if SA.ndim == 0:
        values, status = float(values), int(status)
    return (values, status) if return_status else values


def batch_water_activity(batch: SolutionBatch, T: float = 298.15, model: str = "auto", *,
                         threads: int = 0, range_policy: str = "extrapolate", return_status: bool = False,
                         saturation: str = "equilibrium", parameter_set: Optional[str] = None):
    """Water activity of every row at temperature ``T`` (K).

    ``saturation`` as in :func:`colligate.water_activity`: a row above a salt's solubility
    gives the a_w of its equilibrium state (salt crystallised) unless "metastable" is asked
    (no warning per row here; :func:`colligate.salt_equilibrium` says which salt).
    ``parameter_set``: the Pitzer parameter set for the ions.
    """
    values, status = _core.batch_water_activities(batch._core, float(T), model, threads, range_policy,
                                                  saturation, parameter_set or "")
    _report(status, "water_activity", batch)
    return _result(values, status, batch, "water_activity", return_status)


def batch_ice_fraction(batch: SolutionBatch, T: Union[float, Sequence[float]], model: str = "auto", *,
                       threads: int = 0, range_policy: str = "extrapolate",
                       bound_water_fraction_of_water: float = 0.0, return_status: bool = False,
                       parameter_set: Optional[str] = None):
    """Ice fraction of every row at each temperature in ``T`` (K): shape (rows,) for a
    scalar ``T``, (rows, len(T)) otherwise. ``parameter_set``: the Pitzer parameter set for
    the ions."""
    scalar = np.ndim(T) == 0
    temps = np.atleast_1d(np.asarray(T, dtype=float))
    values, status = _core.batch_ice_fractions(batch._core, temps, model, threads, range_policy,
                                               bound_water_fraction_of_water, parameter_set or "")
    _report(status, "ice_fraction", batch)
    if scalar:
        return _result(values[:, 0], status[:, 0], batch, "ice_fraction", return_status)
    return _result(values, status, batch, "ice_fraction", return_status, temps)


UNCERTAIN_QUANTITIES = {"freezing_point": "freezing_point_K", "water_activity": "water_activity",
                        "osmotic_coefficient": "osmotic_coefficient", "ice_fraction": "ice_fraction",
                        "unfrozen_water": "unfrozen_water_kg"}


def batch_with_uncertainty(batch: SolutionBatch, quantity: str, T: float = 298.15, model: str = "auto", *,
                           threads: int = 0, range_policy: str = "extrapolate",
                           bound_water_fraction_of_water: float = 0.0, salts_crystallise: bool = True,
                           parameter_set: Optional[str] = None):
    """``quantity`` of every row with its standard uncertainty, as a pandas DataFrame with
    the batch's index: the value column (``freezing_point_K``, ``water_activity``,
    ``osmotic_coefficient``, ``ice_fraction`` or ``unfrozen_water_kg``), the same name with
    ``_std`` (standard uncertainty, same unit), ``degrees_of_freedom`` (0: normal law) and
    ``status`` (row status codes, :data:`ROW_STATUS`).

    Linear propagation (closed-form sensitivities, models 'norrish', 'pitzer' and 'ross') per
    row in the C++ core, prepared once per batch and thread, the rows shared among
    ``threads``; each row equals the scalar
    ``with_uncertainty=True`` result. ``T`` in K (unused for the freezing point). Solutes
    without a stated uncertainty contribute none (std 0). A row whose state has no closed
    form (a salt crystallises: a brine that forms a salt before ice, an a_w above a salt's
    solubility, an ice fraction below a salt's saturation) keeps the plain batch call's
    value with std NaN and a warning; ``salts_crystallise=False`` gives the metastable values
    of each row as one liquid instead. ``parameter_set``: the Pitzer parameter set for the
    ions (:func:`colligate.pitzer_parameter_sets`; None: the default set), as in the scalar
    ``with_uncertainty=True`` call."""
    import pandas as pd

    if quantity not in UNCERTAIN_QUANTITIES:
        raise _core.InvalidInputError(
            f"batch_with_uncertainty: quantity = {quantity!r}: must be one of {', '.join(UNCERTAIN_QUANTITIES)}")
    value, std, dof, status = _core.batch_predictions_with_uncertainty(
        batch._core, quantity, float(T), model, threads, range_policy, bound_water_fraction_of_water,
        bool(salts_crystallise), parameter_set or "")
    _report(status, quantity, batch)
    no_u = np.isfinite(value) & np.isnan(std)
    if np.any(no_u):
        warnings.warn(f"{quantity}: {int(no_u.sum())} row(s) have no closed-form standard uncertainty "
                      "(a salt crystallises in that state); use the Monte Carlo propagation "
                      "of single solutions for them (std NaN)", BatchRowWarning, stacklevel=2)
    name = UNCERTAIN_QUANTITIES[quantity]
    index = batch.index if batch.index is not None else pd.RangeIndex(len(value))
    return pd.DataFrame({name: value, f"{name}_std": std, "degrees_of_freedom": dof, "status": status},
                        index=index)
