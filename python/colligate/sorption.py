"""Water sorption isotherms (GAB, BET, Oswin), their fit to lab data, and the water
activity that mixed dry and intermediate-moisture ingredients settle at.

A thin layer over the compiled core (``equilibria/sorption_isotherm.hpp``,
``fit/sorption_fitter.hpp``, ``equilibria/moisture_equilibrium.hpp``). Moisture is in kg
water per kg dry solids, temperatures in K, heats in J/mol.

Water activity alone does not make a food safe: it is one hurdle among several. Predicted
values are estimates; measure a_w of the product, and follow local codes and validated
process controls.
"""
from __future__ import annotations

import warnings
from dataclasses import dataclass
from typing import Any, Iterable, Optional, Sequence

import numpy as np

from . import _core
from ._warnings import OutOfValidityRangeWarning
from .fit import FitResult, _column, _provenance

__all__ = ["GROWTH_LIMIT_CAUTION", "growth_limits", "Isotherm", "IsothermFit", "fit_gab", "fit_bet", "fit_oswin", "moisture_equilibrium",
           "isosteric_heat", "shift_water_activity"]

GROWTH_LIMIT_CAUTION = (
    "Water activity alone does not make a food safe: the limits are for growth under otherwise "
    "favourable conditions, and pH, temperature, preservatives, packaging and toxins matter too. "
    "Predicted a_w is an estimate: measure it, and defer to local codes and validated process "
    "controls (licensed practice).")

_PARAMS = {"gab": ("xm", "c", "k"), "bet": ("xm", "c"), "oswin": ("a", "b")}


@dataclass(frozen=True)
class Isotherm:
    """A sorption isotherm at one temperature.

    Parameters by model: ``gab`` xm (kg/kg dry solids), c, k; ``bet`` xm, c; ``oswin`` a
    (kg/kg dry solids), b. ``aw_range`` is the water-activity range of the data the
    constants come from; using the isotherm outside it warns (OutOfValidityRangeWarning).
    """

    model: str
    params: dict
    temperature: float = 298.15
    aw_range: Optional[tuple[float, float]] = None

    def _p(self) -> tuple[float, float, float]:
        names = _PARAMS.get(self.model)
        if names is None:
            raise _core.InvalidInputError(
                f"sorption isotherm model '{self.model}' is not known (use 'gab', 'bet' or 'oswin')")
        vals = [float(self.params[n]) for n in names] + [0.0]
        return vals[0], vals[1], vals[2]

    def _warn_range(self, aw: np.ndarray) -> None:
        if self.aw_range is None:
            return
        reason, count = _core.isotherm_range_reason(self.model, *self._p(), float(self.aw_range[0]),
                                                    float(self.aw_range[1]), np.atleast_1d(aw).astype(float))
        if count:
            prefix = f"{count} value(s) outside the fitted range; first: " if count > 1 else ""
            warnings.warn(prefix + reason, OutOfValidityRangeWarning, stacklevel=3)

    def moisture(self, water_activity):
        """Equilibrium moisture (kg water per kg dry solids) at water activity in (0, 1)."""
        aw = np.asarray(water_activity, dtype=float)
        self._warn_range(aw)
        out = _core.isotherm_moisture(self.model, *self._p(), np.atleast_1d(aw))
        return float(out[0]) if aw.ndim == 0 else out

    def water_activity(self, moisture):
        """Water activity at moisture (kg water per kg dry solids, > 0)."""
        x = np.asarray(moisture, dtype=float)
        out = _core.isotherm_water_activity(self.model, *self._p(), np.atleast_1d(x))
        self._warn_range(out)
        return float(out[0]) if x.ndim == 0 else out


class IsothermFit(FitResult):
    """A :class:`colligate.FitResult` of a sorption isotherm, with ``.isotherm`` to use it."""

    def __init__(self, core: Any, *, model: str, aw: np.ndarray, x: np.ndarray, temperature: float,
                 source: dict) -> None:
        super().__init__(core, model=model, x=aw, y=x, x_label="water activity",
                         y_label="moisture / (kg water per kg dry solids)", source=source,
                         extra={"temperature": temperature})
        self.temperature = float(temperature)
        self.isotherm = Isotherm(model, dict(self.params), self.temperature,
                                 (float(np.min(aw)), float(np.max(aw))))


def _fit(model: str, moisture, water_activity, temperature: float, weights, data, data_name) -> IsothermFit:
    x = _column(moisture, data, "moisture")
    aw = _column(water_activity, data, "water_activity")
    w = _column(weights, data, "weights")
    if x is None or aw is None:
        raise _core.InvalidInputError(f"fit_{model}: moisture and water_activity are both required")
    core = _core.fit_isotherm(model, aw, x, w)
    return IsothermFit(core, model=model, aw=aw, x=x, temperature=temperature,
                       source=_provenance(data_name, [aw, x]))


def fit_gab(moisture, water_activity, *, temperature: float = 298.15, weights=None, data=None,
            data_name: Optional[str] = None) -> IsothermFit:
    """Fit the GAB isotherm X = xm c k a / ((1 - k a)(1 - k a + c k a)) to lab data.

    Parameters
    ----------
    moisture : array_like or str
        Equilibrium moisture, kg water per kg dry solids (or a column of ``data``).
    water_activity : array_like or str
        Water activity of each sample, in (0, 1).
    temperature : float
        Temperature of the data, K.
    weights : array_like or str, optional
        Relative weights (e.g. 1/sigma^2).

    Returns
    -------
    IsothermFit
        Parameters xm, c, k with standard errors, ``ci()``, ``plot()`` with a residual
        panel, and ``.isotherm``.
    """
    return _fit("gab", moisture, water_activity, temperature, weights, data, data_name)


def fit_bet(moisture, water_activity, *, temperature: float = 298.15, weights=None, data=None,
            data_name: Optional[str] = None) -> IsothermFit:
    """Fit the BET isotherm (xm, c); meant for water activities up to about 0.45."""
    return _fit("bet", moisture, water_activity, temperature, weights, data, data_name)


def fit_oswin(moisture, water_activity, *, temperature: float = 298.15, weights=None, data=None,
              data_name: Optional[str] = None) -> IsothermFit:
    """Fit the Oswin isotherm X = a (aw / (1 - aw))^b."""
    return _fit("oswin", moisture, water_activity, temperature, weights, data, data_name)


def moisture_equilibrium(parts: Sequence[tuple[Isotherm, float, float]]) -> dict:
    """Where mixed ingredients, or layers in contact in a closed package, end up.

    ``parts``: (isotherm, dry solids kg, moisture kg water per kg dry solids) for each.
    Returns a dict: ``water_activity`` (common, at equilibrium), ``moisture`` and
    ``water_gained`` (kg; negative = lost) per part, ``initial_water_activity`` per part and
    ``salwin_slawson_water_activity`` (the tangent estimate of Salwin & Slawson 1959).
    """
    rows = [(iso.model, *iso._p(), float(dry), float(x)) for iso, dry, x in parts]
    return dict(_core.moisture_equilibrium(rows))


def isosteric_heat(cool: Isotherm, warm: Isotherm, moisture: float) -> float:
    """Net isosteric heat of sorption (J/mol) at ``moisture`` from isotherms at two temperatures."""
    return float(_core.isosteric_heat(cool.model, *cool._p(), cool.temperature,
                                      warm.model, *warm._p(), warm.temperature, float(moisture)))


def shift_water_activity(water_activity: float, reference_temperature: float, temperature: float,
                         isosteric_heat: float) -> float:
    """a_w at ``temperature`` (K) and the same moisture, by Clausius-Clapeyron (J/mol)."""
    return float(_core.shift_water_activity(float(water_activity), float(reference_temperature),
                                            float(temperature), float(isosteric_heat)))


def growth_limits(water_activity: float):
    """A product's a_w against published minimum a_w for growth (Beuchat 1981, values from
    memory): a DataFrame with ``organisms``, ``minimum_water_activity``, ``source`` and
    ``growth_possible`` (a_w at or above the limit). Read it with :data:`GROWTH_LIMIT_CAUTION`.
    """
    import pandas as pd

    aw = float(water_activity)
    if not (0.0 < aw <= 1.0):
        raise _core.InvalidInputError(f"growth_limits: water_activity = {aw}: must be in (0, 1]")
    df = pd.DataFrame(_core.water_activity_growth_limits())
    df["growth_possible"] = aw >= df["minimum_water_activity"]
    df.attrs["caution"] = GROWTH_LIMIT_CAUTION
    return df
