"""The scalar API: one solution, scalar or array temperatures, SI units.

Thin wrappers over the compiled module ``colligate._core``: they check the argument
types, turn the validity reasons returned by the core into
:class:`OutOfValidityRangeWarning` and shape the results (floats, arrays, dicts, pandas
tables). No physics and no data tables here; ``colligate`` re-exports every public name.
"""
from __future__ import annotations

import math
from typing import Any, Mapping, Union

import numpy as np

from . import _core
from ._core import (  # noqa: F401
    ConvergenceError,
    IceCurve,
    IceCurveState,
    InvalidInputError,
    OutOfValidityRangeError,
    Solution,
    UnfrozenPhaseState,
    Validity,
)
from ._warnings import CAUTIONS, RANGE_POLICIES, OutOfValidityRangeWarning, _warn  # noqa: F401
from ._warnings import SupersaturatedWarning, _warn_supersaturated  # noqa: F401
from .batch import SolutionBatch, batch_freezing_point, batch_ice_fraction, batch_water_activity
from .uncertainty import UncertainValue, _method, propagate, thermal as _thermal_uncertainty

__all__ = [
    "Solution",
    "IceCurve",
    "IceCurveState",
    "Validity",
    "UnfrozenPhaseState",
    "UnfrozenPhase",
    "freezing_point",
    "water_activity",
    "osmotic_coefficient",
    "ice_fraction",
    "temperature_for_ice_fraction",
    "unfrozen_phase",
    "leighton_freezing_point",
    "leighton_ice_fraction",
    "solutes",
    "citations",
    "citation",
    "models",
    "describe_model",
    "water_activity_of_ice",
    "enthalpy",
    "apparent_specific_heat",
    "heat_load",
    "frozen_specific_heat_chen",
    "eutectic",
    "eutectic_of",
    "mean_activity_coefficient",
    "salt_equilibrium",
    "salt_crystallisation_temperature",
    "SupersaturatedWarning",
    "pitzer_parameter_sets",
    "weak_acids",
    "acid_dissociation",
    "acid_freezing_point",
    "sweetness_table",
    "lactose_solubility",
    "lactose_solubility_table",
    "alcohol_by_volume_20c",
    "ethanol_water_density_20c",
    "max_msnf_for_lactose_in_solution",
    "InvalidInputError",
    "OutOfValidityRangeError",
    "OutOfValidityRangeWarning",
    "ConvergenceError",
    "CAUTIONS",
    "RANGE_POLICIES",
]


Temperature = Union[float, "np.typing.ArrayLike"]


def _uncertain_input(solution: Any) -> Any:
    """A Solution, or a SolutionBatch (value and standard-uncertainty columns)."""
    return solution if isinstance(solution, SolutionBatch) else _as_solution(solution)


def _as_solution(solution: Any) -> Solution:
    if isinstance(solution, Solution):
        return solution
    raise InvalidInputError(
        f"expected a colligate.Solution, got {type(solution).__name__}; build one with "
        "Solution(water=..., solutes={...}) or Solution.from_mass_fractions({...})"
    )


def freezing_point(
    solution: Solution,
    model: str = "auto",
    *,
    bound_water_fraction_of_water: float = 0.0,
    range_policy: str = "extrapolate",
    with_uncertainty: Union[bool, str] = False,
    parameter_set: Union[str, None] = None,
    metastable: bool = False,
) -> Union[float, UncertainValue]:
    """Initial freezing point of a solution: the temperature where the first solid forms.

    For most solutions that solid is ice. A brine richer in salt than its eutectic
    composition (25 wt% NaCl, say) crystallises a salt first: by default the value is the
    temperature where that salt begins to crystallise, and a :class:`SupersaturatedWarning`
    names the phase (hydrohalite NaCl.2H2O, halite, ...) and its solubility source; ice then
    forms only at the eutectic. ``metastable=True`` gives the ice freezing point of the
    unprecipitated liquid instead. Brine temperatures are estimates: see :data:`CAUTIONS`.

    Parameters
    ----------
    solution : Solution
        The solution.
    model : str
        Activity model id: "auto", "ideal", "raoult", "norrish", "pitzer" or "ross" (see
        :func:`models`).
    bound_water_fraction_of_water : float
        Water that cannot freeze (e.g. bound to protein), kg per kg of all the water of the
        solution, in [0, 1); taken out of the solvent.
    range_policy : str
        Outside the model's validated range: "extrapolate" (compute and warn, default),
        "nan" (return NaN and warn) or "raise" (:class:`OutOfValidityRangeError`).
    with_uncertainty : bool or str
        False (default): return the value. True or "linear": return an
        :class:`~colligate.uncertainty.UncertainValue` (``.value``, ``.std``, ``.ci(level)``)
        carrying the covariance of fitted constants (linear propagation); "monte_carlo":
        the same by 10^5 seeded draws (:func:`colligate.uncertainty.propagate` sets both).
    parameter_set : str, optional
        Pitzer parameter set for the ions (one of :func:`pitzer_parameter_sets`, e.g.
        "harvie_1984" for work at 25 C); None: the default set. Used by the models with
        ion activities ("pitzer", "ross", and "auto" when ions are present), salt
        saturation included; an electrolyte without parameters in the set is an
        :class:`InvalidInputError` naming the sets that have it.
    metastable : bool
        False (default): a salt that saturates before ice gives its crystallisation
        temperature. True: the ice freezing point of the liquid as given, salt kept
        dissolved (supersaturated).

    Returns
    -------
    float
        Temperature, K, at which ice (or, above the eutectic composition, a salt) starts
        to form. NaN if the solution does not freeze above 223.15 K, or if it is already
        supersaturated in a salt at 298.15 K (the top of the solubility data).
    """
    if with_uncertainty is not False:
        return propagate(_uncertain_input(solution), "freezing_point", 0.0, model, range_policy=range_policy,
                         parameter_set=parameter_set, bound_water_fraction_of_water=bound_water_fraction_of_water,
                         method=_method(with_uncertainty), salts_crystallise=not metastable)
    if isinstance(solution, SolutionBatch):
        return batch_freezing_point(solution, model, range_policy=range_policy,
                                    bound_water_fraction_of_water=bound_water_fraction_of_water,
                                    parameter_set=parameter_set, metastable=metastable)
    value, reason, notice = _core.freezing_point(_as_solution(solution), model, range_policy,
                                                 bound_water_fraction_of_water, parameter_set or "",
                                                 bool(metastable))
    _warn_supersaturated(notice)
    _warn(reason)
    return value


def water_activity(
    solution: Solution,
    T: float = 298.15,
    model: str = "auto",
    *,
    range_policy: str = "extrapolate",
    saturation: str = "equilibrium",
    with_uncertainty: Union[bool, str] = False,
    parameter_set: Union[str, None] = None,
) -> Union[float, UncertainValue]:
    """Water activity of a solution (no ice) at temperature ``T``.

    A solution above a salt's solubility at ``T`` is supersaturated: by default
    (``saturation="equilibrium"``) the salt crystallises and the value is the a_w of the
    saturated liquid left (a :class:`SupersaturatedWarning` says so and names the salt);
    ``saturation="metastable"`` gives the solution taken as one liquid. Brine a_w values
    are estimates: see :data:`CAUTIONS`.

    Parameters
    ----------
    solution : Solution
        The solution.
    T : float
        Temperature, K (default 298.15 K, 25 C).
    model : str
        Activity model id (see :func:`models`).
    range_policy : str
        "extrapolate", "nan" or "raise" (see :func:`freezing_point`).
    with_uncertainty : bool or str
        See :func:`freezing_point`.
    parameter_set : str, optional
        Pitzer parameter set for the ions and their saturation (see :func:`freezing_point`).

    Returns
    -------
    float
        Water activity, dimensionless, in (0, 1].
    """
    if with_uncertainty is not False:
        if saturation not in ("equilibrium", "metastable"):
            raise InvalidInputError(f"saturation = {saturation!r}: valid values are 'equilibrium' and 'metastable'")
        return propagate(_uncertain_input(solution), "water_activity", T, model, range_policy=range_policy,
                         parameter_set=parameter_set, method=_method(with_uncertainty),
                         salts_crystallise=saturation == "equilibrium")
    if isinstance(solution, SolutionBatch):
        return batch_water_activity(solution, T, model, range_policy=range_policy, saturation=saturation,
                                    parameter_set=parameter_set)
    value, reason, notice = _core.water_activity(_as_solution(solution), float(T), model, range_policy,
                                                 saturation, parameter_set or "")
    _warn_supersaturated(notice)
    _warn(reason)
    return value


def salt_equilibrium(solution: Solution, T: float = 298.15, model: str = "auto", *,
                     parameter_set: Union[str, None] = None) -> dict:
    """The state of a solution at ``T`` (K) with salts allowed to crystallise (no ice).

    Returns a dict: ``supersaturated`` (bool), ``phase``, ``formula`` and ``phase_source``
    of the salt that crystallises (the most supersaturated; None without salt phases),
    ``saturation_index`` (ln IAP/K of the solution as given), ``precipitated_mol``,
    ``liquid_water_kg``, ``water_activity`` (of the equilibrium state),
    ``metastable_water_activity``, ``also_supersaturated`` (a second salt not solved, or
    None) and ``reason``. Solubility products hold from 219.15 to 298.15 K. Estimates:
    verify brine strength by measurement (see :data:`CAUTIONS`). ``parameter_set``: the
    Pitzer parameter set for the ions (see :func:`freezing_point`).
    """
    out = dict(_core.salt_equilibrium(_as_solution(solution), float(T), model, parameter_set or ""))
    _warn(out["reason"])
    return out


def salt_crystallisation_temperature(solution: Solution, model: str = "auto", *,
                                     parameter_set: Union[str, None] = None) -> dict:
    """Temperature at which a brine first crystallises salt on cooling (no ice yet).

    For a brine richer than its eutectic composition (25 wt% NaCl, say) this, not the
    metastable ice temperature, is where the first solid forms. Returns a dict:
    ``temperature_K`` (NaN when none between 219.15 and 298.15 K), ``phase``, ``formula``,
    ``phase_source``, ``above_data`` (already supersaturated at 298.15 K) and ``reason``.
    Estimates: verify by measurement before relying on a brine (see :data:`CAUTIONS`).
    ``parameter_set``: the Pitzer parameter set for the ions (see :func:`freezing_point`).
    """
    return dict(_core.salt_crystallisation_temperature(_as_solution(solution), model, parameter_set or ""))


def osmotic_coefficient(
    solution: Solution,
    T: float = 298.15,
    model: str = "auto",
    *,
    range_policy: str = "extrapolate",
    with_uncertainty: Union[bool, str] = False,
    parameter_set: Union[str, None] = None,
) -> Union[float, UncertainValue]:
    """Osmotic coefficient phi = -ln a_w / (M_w sum nu_i m_i) at temperature ``T`` (K).
    ``with_uncertainty`` and ``parameter_set`` (the Pitzer set for the ions): see
    :func:`freezing_point`."""
    if with_uncertainty is not False:
        return propagate(_uncertain_input(solution), "osmotic_coefficient", T, model, range_policy=range_policy,
                         parameter_set=parameter_set, method=_method(with_uncertainty))
    value, reason = _core.osmotic_coefficient(_as_solution(solution), float(T), model, range_policy,
                                              parameter_set or "")
    _warn(reason)
    return value


def ice_fraction(
    solution: Solution,
    T: Temperature,
    model: str = "auto",
    *,
    bound_water_fraction_of_water: float = 0.0,
    range_policy: str = "extrapolate",
    with_uncertainty: Union[bool, str] = False,
    parameter_set: Union[str, None] = None,
) -> Union[float, np.ndarray, UncertainValue]:
    """Ice mass over total water mass at temperature(s) ``T``.

    Parameters
    ----------
    solution : Solution
        The solution (or food water phase).
    T : float or array_like
        Temperature(s), K. Above the freezing point the ice fraction is 0.
    model : str
        Activity model id (see :func:`models`).
    bound_water_fraction_of_water : float
        Water that cannot freeze (neither ice nor solvent), kg per kg of all the water, in
        [0, 1); the ice fraction stays below 1 minus this share.
    range_policy : str
        "extrapolate", "nan" or "raise" (see :func:`freezing_point`).

    with_uncertainty : bool or str
        See :func:`freezing_point`; value and std then have the shape of ``T``.
    parameter_set : str, optional
        Pitzer parameter set for the ions, also on the salt steps of the path (see
        :func:`freezing_point`).

    Returns
    -------
    float or numpy.ndarray
        Ice fraction in [0, 1), same shape as ``T``.
    """
    if with_uncertainty is not False:
        return propagate(_uncertain_input(solution), "ice_fraction", T, model, range_policy=range_policy,
                         parameter_set=parameter_set, bound_water_fraction_of_water=bound_water_fraction_of_water,
                         method=_method(with_uncertainty))
    if isinstance(solution, SolutionBatch):
        return batch_ice_fraction(solution, T, model, range_policy=range_policy,
                                  bound_water_fraction_of_water=bound_water_fraction_of_water,
                                  parameter_set=parameter_set)
    scalar = np.ndim(T) == 0
    temps = np.asarray(T, dtype=float)
    values, reason, count = _core.ice_fraction(
        _as_solution(solution), temps, model, range_policy, bound_water_fraction_of_water, parameter_set or ""
    )
    _warn(reason, count)
    return float(values) if scalar else values


def temperature_for_ice_fraction(
    solution: Solution,
    ice_fraction: Union[float, "np.typing.ArrayLike"],
    model: str = "auto",
    *,
    bound_water_fraction_of_water: float = 0.0,
    range_policy: str = "extrapolate",
    parameter_set: Union[str, None] = None,
) -> Union[float, np.ndarray]:
    """Temperature at which a solution has a given ice fraction (the inverse of
    :func:`ice_fraction`), e.g. the serving temperature with 70 % of the water frozen.

    Parameters
    ----------
    solution : Solution
        The solution (or food water phase).
    ice_fraction : float or array_like
        Ice mass over all the water, in [0, 1) (0.70, not 70). 0 gives the initial
        freezing point.
    model : str
        Activity model id (see :func:`models`).
    bound_water_fraction_of_water : float
        Water that cannot freeze, kg per kg of all the water, in [0, 1).
    range_policy : str
        "extrapolate", "nan" or "raise" (see :func:`freezing_point`), applied to the
        model's validity at the temperature found.
    parameter_set : str, optional
        Pitzer parameter set for the ions (see :func:`freezing_point`).

    Returns
    -------
    float or numpy.ndarray
        Temperature(s), K, same shape as ``ice_fraction``.

    Raises
    ------
    InvalidInputError
        For a fraction outside [0, 1) or above the largest the ice curve reaches (at the
        final eutectic of a brine, at the lowest temperature searched, or because of water
        that cannot freeze); the message names the fraction and the reachable range.
    """
    scalar = np.ndim(ice_fraction) == 0
    fractions = np.asarray(ice_fraction, dtype=float)
    values, reason, count = _core.temperature_for_ice_fraction(
        _as_solution(solution), fractions, model, range_policy, float(bound_water_fraction_of_water),
        parameter_set or ""
    )
    _warn(reason, count)
    return float(values) if scalar else values


def leighton_freezing_point(solution: Solution) -> float:
    """Initial freezing point (K) by the dairy method of Leighton (1927) as given by Goff &
    Hartel (2013), Ice Cream, ch. 6: sugars as sucrose equivalents on their Table 6.1 plus
    2.37 K per g milk solids-not-fat per 100 g water for the milk salts.

    A cross-check against the figures of the dairy texts, not an activity model; see
    ``cpp/include/colligate/equilibria/leighton_method.hpp``. Electrolytes other than milk
    salts are left out with a warning.
    """
    value, reason = _core.leighton_freezing_point(_as_solution(solution))
    _warn(reason)
    return value


def leighton_ice_fraction(solution: Solution, T: Temperature) -> Union[float, np.ndarray]:
    """Fraction of the water frozen at ``T`` (K, scalar or array) by the Leighton (1927) /
    Goff & Hartel (2013) dairy method (see :func:`leighton_freezing_point`). Beyond the end
    of their sucrose table (180 g per 100 g water) the table is extrapolated and a warning
    says so."""
    s = _as_solution(solution)
    temps = np.asarray(T, dtype=float)
    out = np.empty(temps.shape)
    reasons = []
    for idx, t in np.ndenumerate(temps):
        out[idx], reason = _core.leighton_ice_fraction(s, float(t))
        if reason:
            reasons.append(reason)
    if reasons:
        _warn(reasons[0], len(reasons))
    return float(out) if np.ndim(T) == 0 else out


def unfrozen_phase(
    solution: Solution,
    T: float,
    model: str = "auto",
    *,
    bound_water_fraction_of_water: float = 0.0,
    parameter_set: Union[str, None] = None,
) -> UnfrozenPhase:
    """Ice, unfrozen water and the unfrozen solution at temperature ``T`` (K).

    Returns an :class:`UnfrozenPhase` with ``temperature`` (K), ``ice``,
    ``unfrozen_water``, ``bound_water``, ``total_water`` (kg, on the scale of the solution),
    ``ice_fraction``,
    ``water_activity`` and ``solution`` (the unfrozen liquid as a :class:`Solution`).
    ``parameter_set``: the Pitzer parameter set for the ions (see :func:`freezing_point`).
    """
    s = _as_solution(solution)
    state = _core.unfrozen_phase(s, float(T), model, bound_water_fraction_of_water, parameter_set or "")
    _warn(state.reason)
    return UnfrozenPhase(state, unfrozen_liquid(s, state))


def unfrozen_liquid(solution: Solution, state: Any) -> Union[Solution, None]:
    """The unfrozen liquid of ``solution`` in a curve state as a :class:`Solution`, or None
    where the state has no liquid computed (below the end of the curve, not solved).
    With salts crystallised it holds the dissolved amounts before crystallisation (the
    ions left in the liquid are in :class:`IceCurve`)."""
    w = float(state.unfrozen_water)
    return solution.with_water(w) if math.isfinite(w) and w > 0.0 else None


class UnfrozenPhase:
    """State of a partly frozen solution at one temperature (SI units)."""

    def __init__(self, state: UnfrozenPhaseState, liquid: Union[Solution, None]) -> None:
        self._state = state
        self.solution: Union[Solution, None] = liquid
        self.temperature: float = state.temperature
        self.ice: float = state.ice
        self.unfrozen_water: float = state.unfrozen_water
        self.bound_water: float = state.bound_water
        self.total_water: float = state.total_water
        self.ice_fraction: float = state.ice_fraction
        self.water_activity: float = state.water_activity
        self.status: str = state.status
        self.reason: str = state.reason

    def __repr__(self) -> str:
        return (
            f"UnfrozenPhase(T={self.temperature:.2f} K, ice_fraction={self.ice_fraction:.4f}, "
            f"unfrozen_water={self.unfrozen_water:.6g} kg, water_activity={self.water_activity:.4f})"
        )


def _thermal_call(core_fn, composition: Mapping[str, float], solution: Any, T: Temperature,
                  model: str, bound_water_fraction_of_water: float) -> Union[float, np.ndarray]:
    """Calls a compiled thermal function over scalar or array T, turning reasons into warnings."""
    comp = {str(k): float(v) for k, v in dict(composition).items()}
    scalar = np.ndim(T) == 0
    values, reason, count = core_fn(comp, _as_solution(solution), np.asarray(T, dtype=float), model,
                                    bound_water_fraction_of_water)
    _warn(reason, count)
    return float(values) if scalar else values


def enthalpy(
    composition: Mapping[str, float],
    solution: Solution,
    T: Temperature,
    model: str = "auto",
    *,
    bound_water_fraction_of_water: float = 0.0,
    with_uncertainty: bool = False,
) -> Union[float, np.ndarray, UncertainValue]:
    """Specific enthalpy of a food, J/kg, with H = 0 at 233.15 K (-40 C).

    Parameters
    ----------
    composition : mapping
        Mass fractions (kg per kg of food) of water, protein, fat, carbohydrate, fibre, ash.
    solution : Solution
        The aqueous phase whose ice curve applies (any scale; only its composition matters).
    T : float or array_like
        Temperature(s), K, 233.15-313.15.
    model : str
        Activity model id of the ice curve.
    bound_water_fraction_of_water : float
        Unfreezable water, kg per kg of the food's water, in [0, 1).
    with_uncertainty : bool
        True: an :class:`~colligate.uncertainty.UncertainValue` carrying the covariance of
        fitted constants of the water phase (linear propagation through the ice fraction).
    """
    if with_uncertainty is not False:
        if _method(with_uncertainty) != "linear":
            raise InvalidInputError("enthalpy: with_uncertainty = 'monte_carlo' is not available for the "
                                    "thermal quantities; use True (linear propagation)")
        return _thermal_uncertainty(composition, _as_solution(solution), "enthalpy", T, 0.0, model,
                                    bound_water_fraction_of_water=bound_water_fraction_of_water)
    return _thermal_call(_core.food_enthalpy, composition, solution, T, model, bound_water_fraction_of_water)


def apparent_specific_heat(
    composition: Mapping[str, float],
    solution: Solution,
    T: Temperature,
    model: str = "auto",
    *,
    bound_water_fraction_of_water: float = 0.0,
) -> Union[float, np.ndarray]:
    """Apparent specific heat dH/dT of a food, J/(kg K) (arguments as :func:`enthalpy`)."""
    return _thermal_call(_core.food_apparent_specific_heat, composition, solution, T, model,
                        bound_water_fraction_of_water)


def frozen_specific_heat_chen(
    water_fraction: float,
    solids_fraction: float,
    initial_freezing_point: float,
    T: float,
    *,
    bound_water_fraction_of_water: float = 0.0,
) -> float:
    """Apparent specific heat of a frozen food by the Chen (1985) correlation, J/(kg K).

    The form presented by the ASHRAE Handbook - Refrigeration (2006), ch. 9, whose table of
    "specific heat below freezing" is this correlation at -40 C. :func:`apparent_specific_heat`
    is the physical model (ice heat capacity from IAPWS); use this one to compare with
    handbook tables.

    Parameters
    ----------
    water_fraction, solids_fraction : float
        Mass fractions of the food.
    bound_water_fraction_of_water : float
        Unfreezable water, kg per kg of the food's water (Chen's x_b is this times
        ``water_fraction``).
    initial_freezing_point, T : float
        Initial freezing point and temperature, K (T below the freezing point).
    """
    return float(_core.chen_frozen_specific_heat(water_fraction, solids_fraction, bound_water_fraction_of_water,
                                                 initial_freezing_point, T))


def heat_load(
    composition: Mapping[str, float],
    solution: Solution,
    from_T: float,
    to_T: float,
    model: str = "auto",
    *,
    bound_water_fraction_of_water: float = 0.0,
    with_uncertainty: bool = False,
) -> Union[dict[str, float], UncertainValue]:
    """Heat to remove per kg of food from ``from_T`` to ``to_T`` (K).

    Returns a dict with ``total``, ``sensible`` and ``latent`` (J/kg, positive when
    cooling) and ``ice_fraction_from``, ``ice_fraction_to``. With ``with_uncertainty=True``,
    the ``total`` as an :class:`~colligate.uncertainty.UncertainValue` (linear propagation).
    """
    if with_uncertainty is not False:
        if _method(with_uncertainty) != "linear":
            raise InvalidInputError("heat_load: with_uncertainty = 'monte_carlo' is not available for the "
                                    "thermal quantities; use True (linear propagation)")
        return _thermal_uncertainty(composition, _as_solution(solution), "heat_load", from_T, float(to_T),
                                    model, bound_water_fraction_of_water=bound_water_fraction_of_water)
    comp = {str(k): float(v) for k, v in dict(composition).items()}
    out = dict(_core.food_heat_load(comp, _as_solution(solution), float(from_T), float(to_T), model,
                                    bound_water_fraction_of_water))
    _warn(out.pop("reason"))
    return out


def water_activity_of_ice(T: Temperature, *, range_policy: str = "extrapolate") -> Union[float, np.ndarray]:
    """Water activity of a solution in equilibrium with ice at ``T`` (K), one atmosphere.

    Validated 233.15-273.15 K; extrapolated (with a warning, or per ``range_policy``) down
    to 215 K. Below 215 K and above the ice point there is no value: NaN with a warning,
    or :class:`OutOfValidityRangeError` with ``range_policy="raise"``.
    """
    temps = np.asarray(T, dtype=float)
    out = np.empty(temps.shape)
    reasons = []
    for idx, t in np.ndenumerate(temps):
        out[idx], reason = _core.water_activity_of_ice(float(t), range_policy)
        if reason:
            reasons.append(reason)
    if reasons:
        _warn(reasons[0], len(reasons))
    return float(out) if np.ndim(T) == 0 else out


def models() -> list[str]:
    """Ids of the available activity models ("auto" picks one per solution)."""
    return list(_core.models())


def describe_model(solution: Solution, model: str = "auto", *, parameter_set: Union[str, None] = None) -> str:
    """Which model, constants and sources a calculation on ``solution`` uses
    (``parameter_set``: the Pitzer parameter set for the ions; None: the default)."""
    return _core.describe_model(_as_solution(solution), model, parameter_set or "")


def solutes():
    """The built-in solute table as a pandas DataFrame (SI units, source keys).

    Every source key resolves with :func:`citation`. ``constant_uncertainty`` gives the
    standard uncertainties of a solute's constants where a source gives them, or "not
    stated" (those enter a propagation with ``with_uncertainty`` as exact).
    """
    import pandas as pd

    df = pd.DataFrame(_core.solute_table()).set_index("id")
    df["aliases"] = df["aliases"].map(", ".join)
    df["constant_uncertainty"] = pd.Series(_core.uncertainty_statements())  # or "not stated"
    return df


def citations():
    """All sources cited by the built-in data, as a pandas DataFrame indexed by key."""
    import pandas as pd

    return pd.DataFrame(_core.citation_table()).set_index("key")


def citation(key: str) -> Mapping[str, Any]:
    """One source of the citation table, as a dict."""
    return dict(_core.citation(key))


def eutectic(solution: Solution, model: str = "auto", *, bound_water_fraction_of_water: float = 0.0,
             path: str = "equilibrium", parameter_set: Union[str, None] = None) -> dict:
    """Where the ice curve of a salt solution ends: its final eutectic.

    Below it no liquid remains (for a binary brine, the ice + salt hydrate eutectic; for a
    mixture such as seawater the curve goes on past the first salts, see
    :class:`IceCurve`). Returns a dict with ``temperature`` (K; NaN if none found),
    ``found``, ``phase`` (the salt whose saturation ends the curve, e.g. "hydrohalite"),
    ``formula``, ``source`` (citation key), ``reason`` and ``salts`` (every salt phase of
    the path with its onset). Brine and ice-salt-bath temperatures are model estimates:
    see :data:`CAUTIONS`.
    """
    return eutectic_of(IceCurve(_as_solution(solution), model, bound_water_fraction_of_water, path,
                                parameter_set or ""))


def eutectic_of(curve: IceCurve) -> dict:
    """:func:`eutectic` of a prepared :class:`IceCurve`."""
    out = dict(curve.eutectic())
    out["salts"] = list(curve.salts)
    return out


def mean_activity_coefficient(
    solution: Solution, solute: str, T: float = 298.15, *, parameter_set: str = "harvie_spencer_icefit"
) -> float:
    """Mean molal activity coefficient of electrolyte ``solute`` at ``T`` (K), Pitzer model."""
    value, reason = _core.mean_activity_coefficient(_as_solution(solution), solute, float(T), parameter_set)
    _warn(reason)
    return value


def pitzer_parameter_sets() -> list[str]:
    """Ids of the Pitzer parameter sets (the first is the default)."""
    return list(_core.pitzer_parameter_sets())


def single_salt_activity(salt: str, molality: Any, T: float = 298.15):
    """Osmotic coefficient, mean activity coefficient and water activity of one salt of food
    in water, from Pitzer parameters in the closed binary form.

    For salts the mixture model's ion tables do not hold: sodium and potassium acetate,
    trisodium citrate, the sodium and potassium phosphates, carbonates and bicarbonates
    (:func:`single_salt_parameters` lists them; ``salt`` is an id, name or formula).
    ``molality`` in mol/kg of water, a number or an array. Each salt's rows hold in their
    own temperature window: at 25 C (``T`` within 0.5 K of 298.15 K) the published
    parameters of May et al. (2011); on the ice line (273.15 K down to the lowest fitted
    freezing point) parameters fitted by colligate to CRC Handbook freezing points (potassium
    acetate: to Melinder's 2010 curve, 5-25 wt%), for the salts that have them. A ``T`` in no window of the salt raises
    :class:`InvalidInputError` naming the salt, its sets and their windows. A molality
    above the data behind the parameters warns (:class:`OutOfValidityRangeWarning`).

    Returns a pandas DataFrame with columns ``molality_mol_per_kg``,
    ``osmotic_coefficient``, ``mean_activity_coefficient`` and ``water_activity``.
    An estimate: verify the water activity of a food or brine by measurement before relying
    on it.
    """
    import pandas as pd

    m = np.atleast_1d(np.asarray(molality, dtype=float)).ravel()
    phi, ln_gamma, aw, reason = _core.single_salt_activity(str(salt), m.tolist(), float(T))
    _warn(reason)
    return pd.DataFrame({"molality_mol_per_kg": m, "osmotic_coefficient": phi,
                         "mean_activity_coefficient": np.exp(ln_gamma), "water_activity": aw})


def single_salt_freezing_point(salt: str, molality: Any):
    """Freezing point of one salt of food in water by its ice-line Pitzer parameters.

    For the salts with a row in the ``colligate_ice_line_fit`` set of
    :func:`single_salt_parameters` (fitted by colligate to CRC Handbook freezing points, or
    for potassium acetate to Melinder's 2010 curve, constant over the fitted freezing
    temperatures; A_phi follows T): the temperature at
    which the solution's water activity equals that of ice. ``molality`` in mol/kg of
    water, a number or an array. A salt without such a row raises
    :class:`InvalidInputError` naming the sets it has; a molality above the fitted data, or
    a freezing point below the lowest fitted one, warns
    (:class:`OutOfValidityRangeWarning`).

    Returns a pandas DataFrame with columns ``molality_mol_per_kg``, ``freezing_point_K``
    and ``depression_K`` (below 273.15 K); ``DataFrame.attrs["parameter_set"]`` names the
    set. An estimate: where freezing matters for safety, verify by measurement.
    """
    import pandas as pd

    m = np.atleast_1d(np.asarray(molality, dtype=float)).ravel()
    tf, set_id, reason = _core.single_salt_freezing_point(str(salt), m.tolist())
    _warn(reason)
    tf = np.asarray(tf, dtype=float)
    out = pd.DataFrame({"molality_mol_per_kg": m, "freezing_point_K": tf,
                        "depression_K": _core.ICE_POINT - tf})
    out.attrs["parameter_set"] = set_id
    return out


def single_salt_molality(salt: str, mass_fraction: Any) -> np.ndarray:
    """Molality (mol/kg of water) of one salt of food from its mass fraction in the solution.

    ``mass_fraction`` is kg of anhydrous salt per kg of solution (a number or an array in
    [0, 1); a mass % divided by 100); ``salt`` is an id, name or formula of
    :func:`single_salt_parameters`. m = w / (M (1 - w)) with the table's molar mass M of the
    anhydrous salt: for a hydrate as sold, convert its mass to the anhydrous salt first. A
    fraction outside [0, 1) raises :class:`InvalidInputError` naming the salt and the range.
    Feeds :func:`single_salt_freezing_point` and :func:`single_salt_activity`, whose tables
    and curves are often given in mass %.
    """
    w = np.atleast_1d(np.asarray(mass_fraction, dtype=float)).ravel()
    return np.asarray(_core.single_salt_molality(str(salt), w.tolist()), dtype=float)


def single_salt_parameters():
    """The Pitzer parameters used by :func:`single_salt_activity`, one row per salt and set.

    A pandas DataFrame indexed by salt id (a salt may have a row at 25 C and one on the ice
    line) with the name, formula, charges and stoichiometry, molar mass (kg/mol), beta0,
    beta1, beta2, cphi, alpha1, alpha2, the top of the molality range behind the fit
    (``max_molality``, mol/kg), the source key (:func:`citation`), the set
    (``parameter_set``: ``may_2011`` or ``colligate_ice_line_fit``) and the window in which
    the row is used (``min_temperature_K``, ``max_temperature_K``).
    """
    import pandas as pd

    return pd.DataFrame(list(_core.single_salt_table())).set_index("id")


def weak_acids():
    """Dissociation constants of the built-in weak acids, one row per step.

    Returns a pandas DataFrame with columns ``acid``, ``name``, ``step`` (1 for K1, ...),
    ``pka_25c`` (as the source prints it), ``pka_at_298_15_K`` (from the temperature
    function where there is one), ``temperature_function``, ``min_temperature_K`` and
    ``max_temperature_K`` (range of the measurements behind the function), ``source``
    (citation key, see :func:`citation`), ``norrish_k_undissociated`` and
    ``norrish_k_source`` (the constant used by :func:`acid_freezing_point`),
    ``norrish_k_fit_worst_deviation_K`` (worst deviation of its fit rows) and ``note``.
    """
    import pandas as pd

    return pd.DataFrame(_core.weak_acids())


def acid_dissociation(acid: str, molality: float, T: float = 298.15, *,
                      background_ionic_strength: float = 0.0,
                      activity: str = "debye_huckel") -> dict[str, Any]:
    """How far a weak acid dissociates in water (an estimate from published pKa values).

    Parameters
    ----------
    acid : str
        Id of a weak acid of :func:`weak_acids` (``"acetic_acid"``, ``"lactic_acid"``,
        ``"citric_acid"``, ``"malic_acid"``).
    molality : float
        Total acid, all forms, mol per kg of water (> 0).
    T : float
        Temperature, K.
    background_ionic_strength : float
        Ionic strength of the other salts of the solution, mol/kg (it raises the ions'
        activity coefficients but not the proton balance).
    activity : {"debye_huckel", "ideal"}
        Activity coefficients of the ions: the Debye-Hueckel term of Pitzer's equations
        (flagged above an ionic strength of 0.1 mol/kg) or 1.

    Returns
    -------
    dict
        ``fractions`` (undissociated form first), ``degree_of_dissociation``, ``pka`` at T,
        ``hydrogen_ion_molality_mol_per_kg``, ``ph`` (molal scale), ``ionic_strength_mol_per_kg``,
        ``particle_molality_mol_per_kg``, ``temperature_function`` (False: a 25 C pKa was
        used at T) and ``reason`` (empty when in range; otherwise also issued as an
        :class:`OutOfValidityRangeWarning`).

    Notes
    -----
    An estimate: pH and the acid split of a food depend on its buffers, proteins and salts;
    measure them for food-safety decisions and follow local codes.
    """
    out = dict(_core.acid_dissociation(acid, float(molality), float(T),
                                       float(background_ionic_strength), activity))
    _warn(out["reason"])
    return out


def acid_freezing_point(acid: str, molality: float) -> dict[str, Any]:
    """Freezing point (K) of a binary solution of a weak acid with the acid split into its forms.

    The undissociated acid is counted with its Norrish constant fitted on that basis
    (:func:`weak_acids`, ``norrish_k_undissociated``), the ions as particles with their
    Debye-Hueckel term. Returns a dict with ``temperature_K``, ``converged``,
    ``norrish_k_undissociated``, ``reason`` (above the highest CRC row that checks it; also
    issued as an :class:`OutOfValidityRangeWarning`) and ``speciation`` (as
    :func:`acid_dissociation` at the freezing point; its ``reason`` may name the pKa function
    extrapolated below 0 C, which the CRC rows check). Solutions given to :func:`freezing_point` still count the acid with
    its folded constant (dissociation included in K).
    """
    out = dict(_core.weak_acid_freezing_point(acid, float(molality)))
    if out["speciation"] is not None:
        out["speciation"] = dict(out["speciation"])
    _warn(out["reason"])
    return out


def sweetness_table():
    """Relative sweetness of sugars (sucrose = 1, mass basis), from the core's data table.

    Returns a pandas DataFrame indexed by solute id with columns ``relative_sweetness``,
    ``source`` (citation key, see :func:`citation`) and ``note``. Solutes not listed count
    as not sweet.
    """
    import pandas as pd

    return pd.DataFrame(_core.sweetness_table()).set_index("solute")


def lactose_solubility_table():
    """The points of the core's lactose solubility curve, as a pandas DataFrame.

    Columns ``temperature`` (K), ``solubility`` (kg anhydrous lactose per kg water),
    ``source`` (citation key, see :func:`citation`) and ``note``.
    """
    import pandas as pd

    return pd.DataFrame(_core.lactose_solubility_table())


def lactose_solubility(T: Temperature) -> Union[float, np.ndarray]:
    """Solubility of lactose in water at ``T`` (K, scalar or array), kg per kg water.

    Linear interpolation in :func:`lactose_solubility_table`; below its coldest point the
    value there (an upper bound), above its warmest point the value there.
    """
    out = _core.lactose_solubility(np.asarray(T, dtype=float))
    return float(out) if np.ndim(T) == 0 else out


def ethanol_water_density_20c(ethanol_mass_fraction: float) -> float:
    """Density of an ethanol-water mixture at 20 degC, kg/m3, for the ethanol mass fraction
    (kg per kg of ethanol + water); the OIML R 22 (1975) formula of the International
    Alcoholometric Tables, from the core (source key ``oiml_r22_1975``)."""
    return float(_core.ethanol_water_density_20c(float(ethanol_mass_fraction)))


def alcohol_by_volume_20c(ethanol_kg: float, water_kg: float) -> float:
    """Alcohol by volume at 20 degC (a volume fraction, 0..1; times 100 for % ABV) of
    ``ethanol_kg`` ethanol in ``water_kg`` water, from the OIML R 22 (1975) densities in the
    core. Dissolved solids are not part of this volume."""
    return float(_core.alcohol_by_volume_20c(float(ethanol_kg), float(water_kg)))


def max_msnf_for_lactose_in_solution(water_fraction: float, msnf_fraction: float) -> float:
    """Largest milk solids-not-fat, kg per kg of mix, that keeps the lactose of an ice-cream
    mix in solution by the rule of Hyde & Rothwell (1973): (water + MSNF) / 7 (from the
    core; source key ``hyde_rothwell_1973``)."""
    return float(_core.max_msnf_for_lactose_in_solution(float(water_fraction), float(msnf_fraction)))
