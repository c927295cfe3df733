"""Design spaces and inverse design over solute compositions.

- :func:`grid` and :func:`latin_hypercube` build candidate formulations (mass fractions,
  one column per solute) within ranges, filtered by constraints on total solids or any
  weighted sum (sweetness with the caller's factors, cost ...).
- :func:`solve_formulation` finds the amounts that meet targets (initial freezing point,
  ice fraction at a serving temperature, total solids, weighted sums) at least cost, with
  ``scipy.optimize`` on top of the batch kernels: every objective and finite-difference
  Jacobian is one vectorised batch call.

All temperatures are in K; amounts are mass fractions of the whole mix (water is the rest).
"""
from __future__ import annotations

import itertools
import warnings
from dataclasses import dataclass, field
from typing import Callable, Mapping, Optional, Sequence, Union

import numpy as np
import pandas as pd

from . import _core
from .batch import SolutionBatch, batch_freezing_point, batch_ice_fraction

Range = tuple[float, float]
Constraint = Union[Callable[[pd.DataFrame], np.ndarray], tuple[Mapping[str, float], float, float]]


def _check_ranges(ranges: Mapping[str, Sequence[float]]) -> None:
    for name, r in ranges.items():
        lo, hi = float(r[0]), float(r[1])
        if not (0.0 <= lo <= hi < 1.0):
            raise _core.InvalidInputError(
                f"ranges[{name!r}] = ({lo}, {hi}): need 0 <= low <= high < 1 (mass fractions)")


def _apply(df: pd.DataFrame, constraints: Sequence[Constraint]) -> pd.DataFrame:
    keep = np.ones(len(df), dtype=bool)
    total = df.sum(axis=1).to_numpy()
    keep &= total < 1.0
    for c in constraints:
        if callable(c):
            keep &= np.asarray(c(df), dtype=bool)
        else:
            weights, lo, hi = c
            unknown = set(weights) - set(df.columns)
            if unknown:
                raise _core.InvalidInputError(f"constraint weights name unknown columns {sorted(unknown)}")
            value = sum(df[k].to_numpy() * w for k, w in weights.items())
            keep &= (value >= lo) & (value <= hi)
    return df[keep].reset_index(drop=True)


def total_solids(lo: float, hi: float) -> Constraint:
    """Constraint: total dissolved solids (sum of all columns) within [lo, hi]."""
    return lambda df: (df.sum(axis=1) >= lo) & (df.sum(axis=1) <= hi)


def grid(ranges: Mapping[str, tuple[float, float, int]], constraints: Sequence[Constraint] = ()) -> pd.DataFrame:
    """Full factorial grid: ``ranges = {solute: (low, high, points)}``."""
    _check_ranges({k: v[:2] for k, v in ranges.items()})
    axes = [np.linspace(lo, hi, int(n)) for lo, hi, n in ranges.values()]
    df = pd.DataFrame(list(itertools.product(*axes)), columns=list(ranges))
    return _apply(df, constraints)


def latin_hypercube(ranges: Mapping[str, Range], n: int, seed: Optional[int] = None,
                    constraints: Sequence[Constraint] = ()) -> pd.DataFrame:
    """``n`` Latin-hypercube samples (scipy.stats.qmc) within ``ranges``, then filtered."""
    from scipy.stats import qmc

    _check_ranges(ranges)
    lo = np.array([r[0] for r in ranges.values()], dtype=float)
    hi = np.array([r[1] for r in ranges.values()], dtype=float)
    unit = qmc.LatinHypercube(d=len(ranges), seed=seed).random(int(n))
    df = pd.DataFrame(lo + unit * (hi - lo), columns=list(ranges))
    return _apply(df, constraints)


def _check_target_units(targets: Mapping[str, object]) -> None:
    """Refuses targets given in the wrong unit before anything is computed: a temperature
    below 150 K is degC or degF typed where K is expected; an ice fraction above 1 is a
    percentage."""
    def kelvin(name: str, value: object) -> None:
        t = float(value)  # type: ignore[arg-type]
        if not np.isfinite(t) or t < 150.0:
            raise _core.InvalidInputError(
                f"targets[{name!r}] = {value!r}: looks like degC or degF, not K; give kelvin "
                f"(e.g. {t + 273.15:g} K for {t:g} degC)")

    if "freezing_point" in targets:
        kelvin("freezing_point", targets["freezing_point"])
    if "ice_fraction" in targets:
        T, f = targets["ice_fraction"]  # type: ignore[misc]
        kelvin("ice_fraction", T)
        if not 0.0 <= float(f) < 1.0:
            raise _core.InvalidInputError(
                f"targets['ice_fraction'] = ({T}, {f}): the fraction must be in [0, 1) (0.7, not 70)")


@dataclass
class FormulationResult:
    """Outcome of :func:`solve_formulation` (amounts as mass fractions)."""

    amounts: dict[str, float]
    achieved: dict[str, float]
    targets: dict[str, float]
    cost: float
    success: bool
    message: str
    iterations: int
    details: dict = field(default_factory=dict)

    def summary(self) -> pd.DataFrame:
        rows = [{"quantity": k, "target": self.targets.get(k, np.nan), "achieved": v}
                for k, v in self.achieved.items()]
        return pd.DataFrame(rows).set_index("quantity")


def solve_formulation(
    variables: Mapping[str, Range],
    targets: Mapping[str, object],
    fixed: Optional[Mapping[str, float]] = None,
    cost: Optional[Mapping[str, float]] = None,
    model: str = "auto",
    tolerance: float = 1e-4,
) -> FormulationResult:
    """Amounts of ``variables`` (mass fractions within their ranges) that meet ``targets``
    at the lowest ``cost`` (price per kg of each solute; 0 if omitted).

    ``targets`` keys:
      - ``"freezing_point"``: K
      - ``"ice_fraction"``: ``(T_K, fraction)`` — ice share of the water at ``T_K``
      - ``"total_solids"``: mass fraction of all solutes
      - ``"weighted_sum"``: ``(weights_dict, value)`` — e.g. sweetness with relative factors
    Solved with scipy.optimize.minimize (SLSQP) with the targets as equality constraints.
    Targets are checked for their units first (a temperature below 150 K is refused as
    degC or degF typed for K). When the targets cannot be met, the result holds the nearest
    amounts within the ranges and its message names the ranges that block the targets.
    """
    from scipy.optimize import minimize

    _check_ranges(variables)
    _check_target_units(targets)
    fixed = dict(fixed or {})
    cost = dict(cost or {})
    names = list(variables)
    lo = np.array([variables[k][0] for k in names])
    hi = np.array([variables[k][1] for k in names])
    columns = names + [k for k in fixed if k not in names]

    def frame(X: np.ndarray) -> pd.DataFrame:
        X = np.atleast_2d(X)
        df = pd.DataFrame(X, columns=names)
        for k, v in fixed.items():
            df[k] = v
        return df[columns]

    def quantities(X: np.ndarray) -> dict[str, np.ndarray]:
        df = frame(X)
        out: dict[str, np.ndarray] = {}
        batch = SolutionBatch.from_mass_fractions(df)
        with warnings.catch_warnings():
            warnings.simplefilter("ignore")
            if "freezing_point" in targets:
                out["freezing_point"] = np.asarray(batch_freezing_point(batch, model, range_policy="extrapolate"))
            if "ice_fraction" in targets:
                T, _ = targets["ice_fraction"]
                out["ice_fraction"] = np.asarray(batch_ice_fraction(batch, float(T), model))
        if "total_solids" in targets:
            out["total_solids"] = df.sum(axis=1).to_numpy()
        if "weighted_sum" in targets:
            weights, _ = targets["weighted_sum"]
            out["weighted_sum"] = sum(df[k].to_numpy() * w for k, w in weights.items())
        return out

    def target_value(key: str) -> float:
        t = targets[key]
        return float(t[1]) if isinstance(t, tuple) else float(t)

    scale = {"freezing_point": 1.0, "ice_fraction": 0.01, "total_solids": 0.01, "weighted_sum": 0.01}
    keys = [k for k in ("freezing_point", "ice_fraction", "total_solids", "weighted_sum") if k in targets]
    unknown = set(targets) - set(keys)
    if unknown:
        raise _core.InvalidInputError(f"unknown targets {sorted(unknown)}; valid: {keys or list(scale)}")

    h = 1e-6

    def residuals_and_jacobian(x: np.ndarray):
        # one batch call: the point and one forward step per variable
        X = np.vstack([x] + [x + h * np.eye(len(x))[j] for j in range(len(x))])
        q = quantities(X)
        r = np.array([(q[k][0] - target_value(k)) / scale[k] for k in keys])
        J = np.array([[(q[k][j + 1] - q[k][0]) / (h * scale[k]) for j in range(len(x))] for k in keys])
        return r, J

    price = np.array([cost.get(k, 0.0) for k in names])
    x0 = 0.5 * (lo + hi)
    res = minimize(
        lambda x: float(price @ x) + 0.0,
        x0,
        jac=lambda x: price,
        method="SLSQP",
        bounds=list(zip(lo, hi)),
        constraints=[{"type": "eq", "fun": lambda x: residuals_and_jacobian(x)[0],
                      "jac": lambda x: residuals_and_jacobian(x)[1]}],
        options={"maxiter": 300, "ftol": 1e-10},
    )
    q = quantities(res.x)
    achieved = {k: float(q[k][0]) for k in keys}
    misfit = max((abs(achieved[k] - target_value(k)) / scale[k] for k in keys), default=0.0)
    ok = bool(res.success) and misfit < tolerance / min(scale.values())
    message = str(res.message)
    x_out = res.x
    if not ok:
        # Where the targets are nearest within the ranges (bounded least squares on the
        # misfit) tells which range blocks them.
        near = minimize(lambda x: 0.5 * float(np.sum(residuals_and_jacobian(x)[0] ** 2)), x0,
                        jac=lambda x: residuals_and_jacobian(x)[1].T @ residuals_and_jacobian(x)[0],
                        method="L-BFGS-B", bounds=list(zip(lo, hi)))
        x_out = near.x  # the nearest reachable amounts are the ones returned
        q_near = quantities(near.x)
        achieved = {k: float(q_near[k][0]) for k in keys}
        at_bounds = [f"{k} at its {'lower' if abs(v - a) <= abs(v - b) else 'upper'} bound "
                     f"{a if abs(v - a) <= abs(v - b) else b:g}"
                     for k, v, a, b in zip(names, near.x, lo, hi) if min(abs(v - a), abs(v - b)) <= 1e-9]
        worst = max(keys, key=lambda k: abs(achieved[k] - target_value(k)) / scale[k])
        message = (f"target {worst} = {target_value(worst):g} not reached (achieved {achieved[worst]:.6g}); "
                   + (f"blocked by {', '.join(at_bounds)}" if at_bounds
                      else "no bound is active: the targets conflict with each other")
                   + f" ({res.message}; largest scaled misfit {misfit:.2e})")
    return FormulationResult(
        amounts={k: float(v) for k, v in zip(names, x_out)} | fixed,
        achieved=achieved,
        targets={k: target_value(k) for k in keys},
        cost=float(price @ x_out),
        success=ok,
        message=message,
        iterations=int(res.nit),
    )
