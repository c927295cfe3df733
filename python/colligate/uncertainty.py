"""Predictions with their standard uncertainty, in the GUM's terms (JCGM 100:2008).

A fitted solute keeps its fit's parameter covariance and degrees of freedom; every
prediction made with it can carry that covariance on. The numerics are in the C++ core
(``equilibria/prediction_uncertainty.hpp``): linear propagation u^2 = g^T Sigma g with
analytic sensitivities g (implicit differentiation on the ice line), or Monte Carlo with a
seeded generator. This module only shapes the result.

    >>> r = colligate.freezing_point(s, with_uncertainty=True)   # doctest: +SKIP
    >>> r.value, r.std, r.ci(0.95)                               # doctest: +SKIP

Solutes whose constants carry no covariance (the built-in ones: their sources state none)
enter as exact and are listed in ``not_stated``; a result whose every constant is "not
stated" has ``std == 0``, which means "no uncertainty propagated", not "exact".

Predictions are estimates: the interval covers the uncertainty of the fitted constants
only, not the model's own error or the variation of real ingredients. Verify by
measurement before relying on them for food safety.
"""
from __future__ import annotations

from typing import Any, Optional, Sequence, Union

import numpy as np

from . import _core
from ._warnings import _warn
from .batch import SolutionBatch, batch_with_uncertainty

__all__ = ["UncertainValue", "PoorlyDeterminedFitWarning", "propagate", "thermal", "QUANTITIES"]

QUANTITIES = ("freezing_point", "water_activity", "osmotic_coefficient", "ice_fraction", "unfrozen_water")
METHODS = ("linear", "monte_carlo")


class PoorlyDeterminedFitWarning(UserWarning):
    """A fit's constants are poorly determined by its data: strongly correlated, or an
    interval that spans zero or a physical bound (see the message)."""


class UncertainValue:
    """A prediction with its standard uncertainty.

    Attributes
    ----------
    value : float or numpy.ndarray
        The prediction (SI unit of the quantity).
    std : float or numpy.ndarray
        Standard uncertainty u (same unit); 0 when no constant has a stated uncertainty.
    degrees_of_freedom : int or numpy.ndarray
        Effective degrees of freedom (Welch-Satterthwaite over the fitted solutes); 0 means
        the normal law (covariance not from a fit, or Monte Carlo).
    method : str
        "linear" or "monte_carlo".
    constants : list of str
        The uncertain constants ("solute.constant") that were propagated.
    sensitivities : dict or None
        d value / d constant for the linear method (arrays for an array of temperatures).
    not_stated : list of str
        Solutes whose constants have no stated uncertainty (taken as exact).
    """

    def __init__(self, value: Any, std: Any, degrees_of_freedom: Any, *, method: str,
                 constants: Sequence[str], not_stated: Sequence[str],
                 sensitivities: Optional[dict] = None, samples: Optional[np.ndarray] = None,
                 quantity: str = "") -> None:
        self.value = value
        self.std = std
        self.degrees_of_freedom = degrees_of_freedom
        self.method = method
        self.constants = list(constants)
        self.not_stated = list(not_stated)
        self.sensitivities = sensitivities
        self.samples = samples
        self.quantity = quantity

    def coverage_factor(self, level: float = 0.95) -> Union[float, np.ndarray]:
        """k of the interval value -/+ k u: Student t with the degrees of freedom, normal for 0."""
        dof = np.asarray(self.degrees_of_freedom)
        k = np.vectorize(lambda d: _core.coverage_factor(float(level), int(d)), otypes=[float])(dof)
        return float(k) if k.ndim == 0 else k

    def ci(self, level: float = 0.95) -> tuple:
        """(lower, upper) coverage interval at ``level`` (e.g. 0.95). Linear method: value -/+ k u;
        Monte Carlo: the probabilistically symmetric interval of the draws (JCGM 101, 7.7)."""
        if self.samples is not None:
            if not 0.0 < float(level) < 1.0:
                raise _core.InvalidInputError(f"ci: level = {level!r}: must lie in (0, 1), e.g. 0.95")
            lo, hi = np.quantile(self.samples, [0.5 - 0.5 * level, 0.5 + 0.5 * level])
            return float(lo), float(hi)
        k = self.coverage_factor(level)
        v, u = self.value, self.std
        return (v - k * u, v + k * u)

    def __float__(self) -> float:
        return float(self.value)

    def __repr__(self) -> str:
        if np.ndim(self.value) == 0:
            return (f"UncertainValue({self.quantity}: {float(self.value):.6g} ± {float(self.std):.2g}, "
                    f"dof={int(self.degrees_of_freedom)}, method={self.method})")
        return f"UncertainValue({self.quantity}: {np.size(self.value)} values, method={self.method})"


def propagate(solution: Any, quantity: str, T: Any = 298.15, model: str = "auto", *,
              bound_water_fraction_of_water: float = 0.0, method: str = "linear",
              draws: int = 100_000, seed: int = 0, range_policy: str = "extrapolate",
              parameter_set: Any = None, salts_crystallise: bool = True) -> Any:
    """``quantity`` of ``solution`` at temperature(s) ``T`` (K) with its standard uncertainty.

    For a :class:`colligate.SolutionBatch` the result is a pandas DataFrame of value and
    standard-uncertainty columns (:func:`colligate.batch.batch_with_uncertainty`).

    Parameters
    ----------
    quantity : str
        One of :data:`QUANTITIES`. ``T`` is unused for the freezing point.
    method : str
        "linear" (analytic sensitivities: model 'norrish' with constants norrish_k and
        norrish_k3; model 'pitzer' with a fitted salt's beta0, beta1, beta2, cphi and their
        d/dT; model 'ross' with both, for a salt + sugar mixture; 'auto' where it resolves
        to one of those) or "monte_carlo" (any model and constant the record carries, e.g.
        an effective solute's molar mass or a state with a salt crystallised): ``draws``
        samples from a generator seeded with ``seed`` (the same seed gives the same draws).
    range_policy : str
        Outside the model's validated range: "extrapolate" (warn), "nan" (NaN value and
        uncertainty, warn) or "raise" (:class:`colligate.OutOfValidityRangeError`).
    parameter_set : str, optional
        Pitzer parameter set for the ions (one of :func:`colligate.pitzer_parameter_sets`);
        None: the default set. Both methods evaluate the model and its sensitivities with it;
        a :class:`colligate.SolutionBatch` passes it to every row.
    salts_crystallise : bool
        True (default, as the plain calls): a salt above its solubility crystallises, so the
        freezing point is that of the first solid and the water activity that of the
        equilibrium state; such a state has no closed form, so "linear" refuses it when a
        constant is uncertain (use "monte_carlo"; batch rows keep the value with std NaN).
        False: the metastable values of the solution as one liquid.
    """
    if quantity not in QUANTITIES:
        raise _core.InvalidInputError(f"propagate: quantity = {quantity!r}: must be one of {', '.join(QUANTITIES)}")
    if isinstance(solution, SolutionBatch):
        if method != "linear" or range_policy == "raise" or np.ndim(T) != 0:
            raise _core.InvalidInputError(
                f"propagate: a SolutionBatch takes the linear method, one temperature and range_policy "
                f"'extrapolate' or 'nan' (got method={method!r}, range_policy={range_policy!r}, "
                f"T of shape {np.shape(T)})")
        return batch_with_uncertainty(solution, quantity, float(T), model, range_policy=range_policy,
                                      bound_water_fraction_of_water=bound_water_fraction_of_water,
                                      salts_crystallise=salts_crystallise, parameter_set=parameter_set)
    if method not in METHODS:
        raise _core.InvalidInputError(f"propagate: method = {method!r}: must be 'linear' or 'monte_carlo'")
    if range_policy not in ("extrapolate", "nan", "raise"):
        raise _core.InvalidInputError(
            f"range_policy = {range_policy!r}: must be 'extrapolate', 'nan' or 'raise'")
    if isinstance(T, (int, float)) and method == "linear":  # one temperature: no array shaping
        r = _core.propagate_uncertainty(solution, quantity, float(T), model, float(bound_water_fraction_of_water),
                                        method, int(draws), int(seed), parameter_set or "",
                                        bool(salts_crystallise))
        if r["reason"]:
            if range_policy == "raise":
                raise _core.OutOfValidityRangeError(r["reason"])
            if range_policy == "nan":
                r["value"] = r["std"] = float("nan")
            _warn(r["reason"])
        names = r["constants"]
        sens = dict(zip(names, (float(v) for v in r["sensitivities"])))
        return UncertainValue(r["value"], r["std"], r["degrees_of_freedom"], method=method, constants=names,
                              not_stated=r["not_stated"], sensitivities=sens, quantity=quantity)
    scalar = np.ndim(T) == 0
    temps = np.atleast_1d(np.asarray(T, dtype=float))
    rows = [_core.propagate_uncertainty(solution, quantity, float(t), model, float(bound_water_fraction_of_water),
                                        method, int(draws), int(seed), parameter_set or "",
                                        bool(salts_crystallise)) for t in temps.ravel()]
    reasons = [r["reason"] for r in rows if r["reason"]]
    if reasons and range_policy == "raise":
        raise _core.OutOfValidityRangeError(reasons[0])
    if range_policy == "nan":
        for r in rows:
            if r["reason"]:
                r["value"] = r["std"] = float("nan")
    if reasons:
        _warn(reasons[0], len(reasons))
    first = rows[0]
    names = list(first["constants"])

    def col(key: str, dtype: Any = float) -> Any:
        a = np.array([r[key] for r in rows], dtype=dtype).reshape(temps.shape)
        return a.reshape(()).item() if scalar else a

    sens = None
    if method == "linear":
        g = np.array([np.asarray(r["sensitivities"], dtype=float) for r in rows]).reshape(len(rows), len(names))
        sens = {n: (float(g[0, j]) if scalar else g[:, j].reshape(temps.shape)) for j, n in enumerate(names)}
    samples = np.asarray(first["samples"]) if (method == "monte_carlo" and scalar) else None
    return UncertainValue(col("value"), col("std"), col("degrees_of_freedom", int), method=method,
                          constants=names, not_stated=first["not_stated"], sensitivities=sens,
                          samples=samples, quantity=quantity)


def thermal(composition: Any, solution: Any, quantity: str, from_T: Any, to_T: float = 0.0,
            model: str = "auto", *, bound_water_fraction_of_water: float = 0.0) -> UncertainValue:
    """Enthalpy at ``from_T`` (J/kg, H = 0 at 233.15 K; array allowed) or heat load from
    ``from_T`` to ``to_T`` (J/kg), with the standard uncertainty from the water phase's
    fitted constants (linear propagation through the ice fraction; sensible heats and
    the enthalpy of fusion taken as exact)."""
    comp = {str(k): float(v) for k, v in dict(composition).items()}
    scalar = np.ndim(from_T) == 0
    temps = np.atleast_1d(np.asarray(from_T, dtype=float))
    rows = [_core.food_thermal_uncertainty(comp, solution, quantity, float(t), float(to_T), model,
                                           float(bound_water_fraction_of_water)) for t in temps.ravel()]
    reasons = [r["reason"] for r in rows if r["reason"]]
    if reasons:
        _warn(reasons[0], len(reasons))
    names = list(rows[0]["constants"])
    g = np.array([np.asarray(r["sensitivities"], dtype=float) for r in rows]).reshape(len(rows), len(names))

    def col(key: str, dtype: Any = float) -> Any:
        a = np.array([r[key] for r in rows], dtype=dtype).reshape(temps.shape)
        return a.reshape(()).item() if scalar else a

    sens = {n: (float(g[0, j]) if scalar else g[:, j].reshape(temps.shape)) for j, n in enumerate(names)}
    return UncertainValue(col("value"), col("std"), col("degrees_of_freedom", int), method="linear",
                          constants=names, not_stated=rows[0]["not_stated"], sensitivities=sens,
                          quantity=quantity)


def _method(with_uncertainty: Any) -> str:
    """The method named by a ``with_uncertainty`` argument (True means "linear")."""
    if with_uncertainty is True:
        return "linear"
    if isinstance(with_uncertainty, str) and with_uncertainty in METHODS:
        return with_uncertainty
    raise _core.InvalidInputError(
        f"with_uncertainty = {with_uncertainty!r}: must be False, True (linear propagation), "
        "'linear' or 'monte_carlo'")
