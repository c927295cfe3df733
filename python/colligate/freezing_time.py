"""How long it takes: freezing and thawing times, heat flow over time, boiling points.

Thin wrappers over the compiled core (``colligate._core``): Plank's equation, Pham's
(1986) two-stage method, shape factors of finite bodies (Hossain, Cleland & Cleland
1992), the one-dimensional implicit enthalpy-method simulation (slab, cylinder, sphere)
using the food's own enthalpy and conductivity from its ice curve, and the boiling point
of a solution from a_w(T) p_s(T) = P (IAPWS saturation line). SI units throughout:
temperatures in K, sizes in m, times in s, pressures in Pa.

Freezing and cooling times are estimates. For food safety, defer to validated process
controls, measured product temperatures and local codes.
"""
from __future__ import annotations

import math
import warnings
from dataclasses import dataclass, field
from typing import Any, Mapping, Sequence

import numpy as np

from . import _core
from ._files import atomic_write
from ._warnings import _warn

__all__ = [
    "FREEZING_TIME_CAUTION",
    "plank_time",
    "pham_time",
    "food_freezing_time",
    "pham_estimate",
    "pham_times",
    "brick_shape_factor",
    "rod_shape_factor",
    "finite_cylinder_shape_factor",
    "simulate_freezing",
    "FreezingSimulation",
    "freezing_inputs",
    "thermal_properties",
    "saturation_pressure",
    "saturation_temperature",
    "boiling_point",
    "boiling_point_elevation",
    "concentration_for_boiling_point",
]

#: Shown with every freezing-time output (CLI, plots).
FREEZING_TIME_CAUTION = (
    "Freezing, thawing and cooling times are estimates. For food safety, defer to validated "
    "process controls, measured product temperatures and local codes."
)

#: Equivalent heat-transfer dimensionality of the one-dimensional shapes.
_DIMENSIONALITY = {"slab": 1.0, "plate": 1.0, "cylinder": 2.0, "infinite_cylinder": 2.0, "sphere": 3.0}

brick_shape_factor = _core.brick_shape_factor
rod_shape_factor = _core.rod_shape_factor
finite_cylinder_shape_factor = _core.finite_cylinder_shape_factor
saturation_pressure = _core.saturation_pressure
saturation_temperature = _core.saturation_temperature


def _uncertain(r: dict, quantity: str, constants: Sequence[str] = (), not_stated: Sequence[str] = (),
               sensitivities: dict | None = None, method: str = "linear"):
    """An :class:`colligate.uncertainty.UncertainValue` from a core result dict."""
    from .uncertainty import UncertainValue

    samples = np.asarray(r["samples"]) if "samples" in r else None
    return UncertainValue(float(r["value"]), float(r["std"]), int(r["degrees_of_freedom"]), method=method,
                          constants=list(constants), not_stated=list(not_stated), sensitivities=sensitivities,
                          samples=samples, quantity=quantity)


def _linear_only(with_uncertainty: Any, where: str) -> None:
    if with_uncertainty is True or with_uncertainty == "linear":
        return
    raise _core.InvalidInputError(
        f"{where}: with_uncertainty = {with_uncertainty!r}: must be False or True (linear propagation "
        "with the closed-form partial derivatives); for a food's time by Monte Carlo use "
        "colligate.food_freezing_time(recipe, ..., with_uncertainty='monte_carlo')")


def plank_time(shape: str, size: float, density: float, latent_heat: float, T_freeze: float,
               T_medium: float, h: float, k_frozen: float, *, with_uncertainty: Any = False,
               u_size: float = 0.0, u_density: float = 0.0, u_latent_heat: float = 0.0,
               u_T_freeze: float = 0.0, u_T_medium: float = 0.0, u_h: float = 0.0,
               u_k_frozen: float = 0.0) -> Any:
    """Plank's freezing time, s.

    Parameters
    ----------
    shape : {"slab", "cylinder", "sphere"}
    size : float
        Full thickness (slab) or diameter (cylinder, sphere), m, as Plank defined it.
    density : float
        kg/m^3 (of the frozen food).
    latent_heat : float
        Latent heat of the food, J/kg of food.
    T_freeze, T_medium : float
        Initial freezing point of the food and medium temperature, K.
    h : float
        Surface heat-transfer coefficient, W/(m^2 K).
    k_frozen : float
        Conductivity of the frozen food, W/(m K).
    with_uncertainty : bool
        True: return an :class:`colligate.uncertainty.UncertainValue` (``.value``, ``.std``,
        ``.ci(level)``) from the stated standard uncertainties ``u_size`` (m), ``u_density``,
        ``u_latent_heat``, ``u_T_freeze`` (K), ``u_T_medium`` (K), ``u_h``, ``u_k_frozen`` (same units
        as the inputs), taken as uncorrelated, by the closed-form partial derivatives of the
        formula (normal law). For the uncertainty carried from a recipe's fitted constants use
        :func:`food_freezing_time`.
    """
    if with_uncertainty is False:
        return float(_core.plank_time(shape, size, density, latent_heat, T_freeze, T_medium, h, k_frozen))
    _linear_only(with_uncertainty, "plank_time")
    u = {"size": u_size, "density": u_density, "latent_heat": u_latent_heat, "T_freeze": u_T_freeze,
         "T_medium": u_T_medium, "h": u_h, "k_frozen": u_k_frozen}
    r = _core.plank_time_uncertainty(shape, size, density, latent_heat, T_freeze, T_medium, h, k_frozen,
                                     **{f"u_{k}": float(v) for k, v in u.items()})
    return _uncertain(r, "plank_time", [k for k, v in u.items() if v])


def _shape_factor(shape: str, shape_factor: float | None) -> float:
    if shape_factor is not None:
        return float(shape_factor)
    if shape not in _DIMENSIONALITY:
        raise _core.InvalidInputError(
            f"shape = '{shape}': valid shapes are slab, cylinder, sphere (or give shape_factor=E)")
    return _DIMENSIONALITY[shape]


def pham_estimate(shape: str, size: float, T_initial: float, T_medium: float, T_centre: float, *,
                  density_unfrozen: float, density_frozen: float, c_unfrozen: float, c_frozen: float,
                  latent_heat: float, k_frozen: float, h: float,
                  shape_factor: float | None = None) -> dict[str, float]:
    """Pham's (1986) freezing time with its parts (time s, mean freezing temperature K,
    precooling and freezing enthalpies J/m^3, Biot number).

    ``size`` is the full thickness or diameter, m; ``shape_factor`` (E) overrides the
    shape's 1, 2, 3 (see :func:`brick_shape_factor` for finite bodies).
    """
    return dict(_core.pham_estimate(size, _shape_factor(shape, shape_factor), T_initial, T_medium, T_centre,
                                    density_unfrozen, density_frozen, c_unfrozen, c_frozen, latent_heat,
                                    k_frozen, h))


def pham_time(shape: str, size: float, T_initial: float, T_medium: float, T_centre: float, *,
              density_unfrozen: float, density_frozen: float, c_unfrozen: float, c_frozen: float,
              latent_heat: float, k_frozen: float, h: float, shape_factor: float | None = None,
              with_uncertainty: Any = False, **uncertainties: float) -> Any:
    """Pham's (1986) freezing time, s (arguments as :func:`pham_estimate`).

    With ``with_uncertainty=True`` the result is an :class:`colligate.uncertainty.UncertainValue`
    from stated standard uncertainties of any input, given as ``u_<input>`` keywords
    (``u_size``, ``u_T_initial``, ``u_T_medium``, ``u_T_centre``, ``u_density_unfrozen``,
    ``u_density_frozen``, ``u_c_unfrozen``, ``u_c_frozen``, ``u_latent_heat``, ``u_k_frozen``,
    ``u_h``; units of the inputs), uncorrelated, by the closed-form partial derivatives of
    Pham's formula (normal law)."""
    if with_uncertainty is False:
        if uncertainties:
            raise _core.InvalidInputError(
                f"pham_time: {sorted(uncertainties)[0]} is given but with_uncertainty is False")
        return float(pham_estimate(shape, size, T_initial, T_medium, T_centre, density_unfrozen=density_unfrozen,
                                   density_frozen=density_frozen, c_unfrozen=c_unfrozen, c_frozen=c_frozen,
                                   latent_heat=latent_heat, k_frozen=k_frozen, h=h,
                                   shape_factor=shape_factor)["time"])
    _linear_only(with_uncertainty, "pham_time")
    u = {}
    for key, v in uncertainties.items():
        if not key.startswith("u_"):
            raise _core.InvalidInputError(f"pham_time: unexpected keyword {key!r}")
        u[key[2:]] = float(v)
    r = _core.pham_time_uncertainty(size, _shape_factor(shape, shape_factor), T_initial, T_medium, T_centre,
                                    density_unfrozen, density_frozen, c_unfrozen, c_frozen, latent_heat,
                                    k_frozen, h, u)
    return _uncertain(r, "pham_time", [k for k, v in u.items() if v])


def pham_times(shape: str, size, T_initial: float, T_medium: float, T_centre: float, *, h,
               density_unfrozen: float, density_frozen: float, c_unfrozen: float, c_frozen: float,
               latent_heat: float, k_frozen: float, shape_factor: float | None = None) -> np.ndarray:
    """Pham's freezing times, s, over arrays of ``size`` (m) and ``h`` (W/(m^2 K)), broadcast."""
    s, hh = np.broadcast_arrays(np.asarray(size, dtype=float), np.asarray(h, dtype=float))
    return _core.pham_times(np.ascontiguousarray(s), _shape_factor(shape, shape_factor), T_initial, T_medium,
                            T_centre, density_unfrozen, density_frozen, c_unfrozen, c_frozen, latent_heat,
                            k_frozen, np.ascontiguousarray(hh))


# --------------------------------------------------------------------------- foods


def _food_args(food: Any, composition: Mapping[str, float] | None, solution: Any,
               model: str | None, bound_water_fraction_of_water: float | None) -> tuple[dict, Any, float, str]:
    """(composition, solution, bound water as a share of all the water, model) from a
    Recipe or explicit parts."""
    if food is not None:
        if not hasattr(food, "proximate") or not hasattr(food, "solution"):
            raise _core.InvalidInputError(
                f"food must be a colligate.Recipe, got {type(food).__name__}; or pass composition= and solution=")
        comp = dict(food.proximate)
        sol = food.solution()
        bw = (float(food.bound_water_fraction_of_water or 0.0) if bound_water_fraction_of_water is None
              else float(bound_water_fraction_of_water))
        mdl = model or getattr(food, "model", "auto") or "auto"
    else:
        if composition is None or solution is None:
            raise _core.InvalidInputError("give a Recipe as food, or both composition= and solution=")
        comp, sol = dict(composition), solution
        bw = float(bound_water_fraction_of_water or 0.0)
        mdl = model or "auto"
    return {str(k): float(v) for k, v in comp.items()}, sol, bw, mdl


def freezing_inputs(food: Any = None, *, T_initial: float, T_target: float,
                    composition: Mapping[str, float] | None = None, solution: Any = None,
                    model: str | None = None, bound_water_fraction_of_water: float | None = None,
                    conductivity_rule: str = "parallel") -> dict[str, float]:
    """Inputs of Plank's and Pham's formulas for a food: T_freeze (K), latent_heat (J/kg),
    density_unfrozen/frozen (kg/m^3), c_unfrozen/frozen (J/(kg K)), k_frozen (W/(m K))."""
    comp, sol, bw, mdl = _food_args(food, composition, solution, model, bound_water_fraction_of_water)
    return dict(_core.food_freezing_inputs(comp, sol, bw, mdl, T_initial, T_target, conductivity_rule))


def food_freezing_time(food: Any = None, *, method: str = "pham", shape: str, size: float, T_initial: float,
                  T_medium: float, h: float, T_target: float, with_uncertainty: Any = False,
                  u_h: float = 0.0, u_size: float = 0.0, u_T_medium: float = 0.0, draws: int = 10_000,
                  seed: int = 0, shape_factor: float | None = None,
                  composition: Mapping[str, float] | None = None, solution: Any = None,
                  model: str | None = None, bound_water_fraction_of_water: float | None = None,
                  conductivity_rule: str = "parallel") -> Any:
    """A recipe's freezing time by Plank (``method="plank"``: phase change only, frozen
    density and conductivity at ``T_target``) or Pham (1986), s, with the inputs of
    :func:`freezing_inputs`.

    Parameters
    ----------
    food : Recipe, optional
        A :class:`colligate.Recipe`; or pass ``composition`` and ``solution``.
    shape, size, T_initial, T_medium, h, T_target
        As :func:`simulate_freezing` (K, m, W/(m^2 K)); ``shape_factor`` is Pham's E of a
        finite body (taken as exact).
    with_uncertainty : bool or str
        False: a float. True or "linear": an :class:`colligate.uncertainty.UncertainValue` from
        the covariance of the recipe's fitted constants (through its initial freezing point
        and its ice fraction at ``T_target``, which sets the frozen density and conductivity)
        and the stated standard uncertainties ``u_h`` (W/(m^2 K)), ``u_size`` (m) and
        ``u_T_medium`` (K), uncorrelated, by closed-form derivatives; Student t with the
        effective degrees of freedom. "monte_carlo": ``draws`` samples (seeded with ``seed``);
        prefer it when u(h)/h exceeds a few per cent, where the time's distribution is skewed
        towards long times.

    Notes
    -----
    Freezing times are estimates; for food safety defer to validated process controls,
    measured product temperatures and local codes.
    """
    if method not in ("plank", "pham"):
        raise _core.InvalidInputError(f"food_freezing_time: method = {method!r}: must be 'plank' or 'pham'")
    comp, sol, bw, mdl = _food_args(food, composition, solution, model, bound_water_fraction_of_water)
    E = 0.0 if shape_factor is None else float(shape_factor)
    if with_uncertainty is False:
        if u_h or u_size or u_T_medium:
            raise _core.InvalidInputError("food_freezing_time: u_h, u_size or u_T_medium given but with_uncertainty is False")
        inp = _core.food_freezing_inputs(comp, sol, bw, mdl, T_initial, T_target, conductivity_rule)
        if method == "plank":
            return plank_time(shape, size, inp["density_frozen"], inp["latent_heat"], inp["T_freeze"], T_medium, h,
                              inp["k_frozen"])
        return pham_time(shape, size, T_initial, T_medium, T_target, density_unfrozen=inp["density_unfrozen"],
                         density_frozen=inp["density_frozen"], c_unfrozen=inp["c_unfrozen"],
                         c_frozen=inp["c_frozen"], latent_heat=inp["latent_heat"], k_frozen=inp["k_frozen"], h=h,
                         shape_factor=shape_factor)
    from .uncertainty import _method

    how = _method(with_uncertainty)
    r = _core.food_freezing_time_uncertainty(comp, sol, bw, mdl, method, shape, size, E, T_initial, T_medium, h,
                                             T_target, float(u_h), float(u_size), float(u_T_medium),
                                             conductivity_rule, how, int(draws), int(seed))
    sens = None
    if how == "linear":
        sens = dict(zip(r["constants"], (float(v) for v in r["sensitivities"])))
    return _uncertain(r, f"{method}_time", r["constants"], r["not_stated"], sens, method=how)


def thermal_properties(food: Any = None, T: Any = 273.15, *, composition: Mapping[str, float] | None = None,
                       solution: Any = None, model: str | None = None, bound_water_fraction_of_water: float | None = None,
                       conductivity_rule: str = "parallel"):
    """Density (kg/m^3), conductivity (W/(m K)), enthalpy (J/kg, 0 at -40 C) and ice fraction
    of a food at temperatures T (K), as a pandas DataFrame indexed by T."""
    import pandas as pd

    comp, sol, bw, mdl = _food_args(food, composition, solution, model, bound_water_fraction_of_water)
    t = np.atleast_1d(np.asarray(T, dtype=float))
    d = _core.food_properties(comp, sol, bw, mdl, np.ascontiguousarray(t), conductivity_rule)
    frame = pd.DataFrame({"density_kg_m3": d["density"], "conductivity_W_mK": d["conductivity"],
                          "enthalpy_J_kg": d["enthalpy"], "ice_fraction": d["ice_fraction"]},
                         index=pd.Index(t, name="temperature_K"))
    return frame


@dataclass
class FreezingSimulation:
    """Result of :func:`simulate_freezing`.

    ``history`` is a DataFrame with columns time_s, centre_K, surface_K, medium_K,
    heat_flux_W_m2 (leaving the surface; negative while thawing), heat_flow_W_kg (per kg of
    product) and mean_enthalpy_J_m3. ``time_to_target`` is in s (NaN if not reached).
    """

    shape: str
    size: float
    status: str
    time_to_target: float
    history: Any
    positions: np.ndarray
    final_temperature: np.ndarray
    steps: int
    raw: dict = field(repr=False, default_factory=dict)
    #: The time to the target with its uncertainty (Monte Carlo), when asked for.
    time_uncertainty: Any = None

    @property
    def success(self) -> bool:
        return self.status == "reached_target"

    def plot(self, path, *, title: str | None = None, inputs: Sequence[str] = (), outputs: Any = None) -> str:
        """Write a PNG of the centre, surface and medium temperatures and the heat flow.

        With ``outputs`` (a ``_files.OutputSet``) the file is staged in that set and appears
        only when the set is committed, with the command's other outputs."""
        from .plot import _figure

        h = self.history
        fig = _figure(7.5, 6.0)
        ax1 = fig.add_subplot(2, 1, 1)
        hours = h["time_s"].to_numpy() / 3600.0
        for col, label in (("centre_K", "centre"), ("surface_K", "surface"), ("medium_K", "medium")):
            ax1.plot(hours, h[col].to_numpy() - 273.15, label=label)
        if not math.isnan(self.time_to_target):
            ax1.axvline(self.time_to_target / 3600.0, color="#777777", ls=":", lw=1)
        ax1.set_ylabel("temperature, °C")
        ax1.legend(fontsize=8)
        ax1.set_title(title or f"{self.shape}, {self.size * 100:.3g} cm: temperature histories")
        ax2 = fig.add_subplot(2, 1, 2, sharex=ax1)
        ax2.plot(hours, h["heat_flow_W_kg"].to_numpy(), color="#aa3333")
        ax2.set_ylabel("heat flow, W/kg")
        ax2.set_xlabel("time, h")
        fig.text(0.01, 0.01, "colligate estimate; " + FREEZING_TIME_CAUTION, fontsize=6, color="#555555",
                 wrap=True)
        fig.tight_layout(rect=(0, 0.05, 1, 1))
        return atomic_write(path, lambda fh: fig.savefig(fh, format="png"), inputs, "plot", into=outputs)


def _medium(T_medium: Any) -> tuple[list[float], list[float]]:
    """A constant temperature, or (times, temperatures) pairs / a 2-column array or DataFrame."""
    if np.ndim(T_medium) == 0:
        return [0.0], [float(T_medium)]
    arr = np.asarray(T_medium, dtype=float)
    if arr.ndim != 2 or arr.shape[1] != 2:
        raise _core.InvalidInputError(
            "T_medium must be a temperature (K) or a table of (time s, temperature K) rows")
    return arr[:, 0].tolist(), arr[:, 1].tolist()


def simulate_freezing(food: Any = None, *, shape: str, size: float, T_initial: float, T_medium: Any,
                      h: float, T_target: float | None = None, composition: Mapping[str, float] | None = None,
                      solution: Any = None, model: str | None = None, bound_water_fraction_of_water: float | None = None,
                      max_time: float = 1.0e7, intervals: int = 40, time_step: float = 0.0,
                      record_every: int = 1, conductivity_rule: str = "parallel", with_uncertainty: Any = False,
                      u_h: float = 0.0, u_size: float = 0.0, u_T_medium: float = 0.0, draws: int = 200,
                      seed: int = 0) -> FreezingSimulation:
    """Simulate freezing (medium colder than the food) or thawing (warmer) by the implicit
    enthalpy method with the food's H(T) and k(T).

    Parameters
    ----------
    food : Recipe, optional
        A :class:`colligate.Recipe`; or pass ``composition`` (proximate mass fractions) and
        ``solution`` (its water phase).
    shape : {"slab", "cylinder", "sphere"}
    size : float
        Full thickness or diameter, m.
    T_initial : float
        Uniform initial temperature, K.
    T_medium : float or table
        Medium temperature, K, or rows of (time s, temperature K), linear in between.
    h : float
        Surface heat-transfer coefficient, W/(m^2 K).
    T_target : float, optional
        Centre temperature that ends the run, K.
    max_time : float
        Longest time simulated, s.
    intervals, time_step : int, float
        Mesh intervals from centre to surface; time step in s (0: automatic).
    with_uncertainty : bool or str
        True or "monte_carlo": also run ``draws`` simulations (generator seeded with ``seed``)
        with the recipe's fitted constants drawn from their covariance and h, size and the
        medium temperature drawn with the stated standard uncertainties ``u_h``
        (W/(m^2 K)), ``u_size`` (m), ``u_T_medium`` (K; a schedule shifts as a whole), and
        put the time to ``T_target`` with its uncertainty in ``time_uncertainty``
        (:class:`colligate.uncertainty.UncertainValue`; ``.ci`` from the sample quantiles).
        Draws that do not reach the target are left out and counted (``draws``,
        ``finite_draws`` in ``time_uncertainty.samples``' length).
    """
    import pandas as pd

    comp, sol, bw, mdl = _food_args(food, composition, solution, model, bound_water_fraction_of_water)
    times, temps = _medium(T_medium)
    target = math.nan if T_target is None else float(T_target)
    r = _core.simulate_food(comp, sol, bw, mdl, shape, size, T_initial, times, temps, h, target, max_time,
                            intervals, time_step, record_every, conductivity_rule)
    props = _core.food_properties(comp, sol, bw, mdl, np.array([float(T_initial)]), conductivity_rule)
    density = float(props["density"][0])
    flux = np.asarray(r["heat_flux"])
    history = pd.DataFrame({
        "time_s": r["time"],
        "centre_K": r["centre_temperature"],
        "surface_K": r["surface_temperature"],
        "medium_K": r["medium_temperature"],
        "heat_flux_W_m2": flux,
        "heat_flow_W_kg": flux / (density * r["volume_per_area"]),
        "mean_enthalpy_J_m3": r["mean_enthalpy"],
    })
    unc = None
    if with_uncertainty is not False:
        if not (with_uncertainty is True or with_uncertainty == "monte_carlo"):
            raise _core.InvalidInputError(
                f"simulate_freezing: with_uncertainty = {with_uncertainty!r}: must be False, True or "
                "'monte_carlo' (the simulation's uncertainty is found by Monte Carlo)")
        if T_target is None:
            raise _core.InvalidInputError("simulate_freezing: T_target is required with with_uncertainty")
        ru = _core.simulate_food_time_uncertainty(comp, sol, bw, mdl, shape, size, T_initial, times, temps, h, target,
                                                  max_time, intervals, time_step, float(u_h), float(u_size),
                                                  float(u_T_medium), int(draws), int(seed), conductivity_rule)
        unc = _uncertain(ru, "simulation_time", ru["constants"], ru["not_stated"], method="monte_carlo")
        if ru["finite_draws"] < ru["draws"]:
            warnings.warn(f"simulate_freezing: {ru['draws'] - ru['finite_draws']} of {ru['draws']} Monte Carlo runs did "
                  "not reach the target and are left out of the time's uncertainty", UserWarning, stacklevel=2)
    elif u_h or u_size or u_T_medium:
        raise _core.InvalidInputError("simulate_freezing: u_h, u_size or u_T_medium given but with_uncertainty is False")
    return FreezingSimulation(shape=shape, size=float(size), status=r["status"],
                              time_to_target=float(r["time_to_target"]), history=history,
                              positions=np.asarray(r["positions"]),
                              final_temperature=np.asarray(r["final_temperature"]), steps=int(r["steps"]),
                              raw=dict(r), time_uncertainty=unc)


# --------------------------------------------------------------------------- boiling


def boiling_point(solution: Any, pressure: float = 101325.0, model: str = "auto", *,
                  range_policy: str = "extrapolate") -> float:
    """Boiling point of a solution, K, at ``pressure`` (Pa), from a_w(T) p_s(T) = P.

    Warns (:class:`OutOfValidityRangeWarning`) when the activity model is used outside its
    validated temperature range, which is the case for the Norrish constants (fitted near
    0-25 C) at atmospheric boiling points. For a sucrose syrup pass
    ``model="starzak_peacock"`` (temperature-dependent, Starzak & Peacock 1997).
    """
    r = _core.boiling_point(solution, pressure, model, range_policy)
    _warn(r["reason"])
    return float(r["temperature"])


def boiling_point_elevation(solution: Any, pressure: float = 101325.0, model: str = "auto", *,
                            range_policy: str = "extrapolate") -> float:
    """Boiling-point elevation over pure water at the same pressure, K."""
    r = _core.boiling_point(solution, pressure, model, range_policy)
    _warn(r["reason"])
    return float(r["elevation"])


def concentration_for_boiling_point(solution: Any, T: float, pressure: float = 101325.0,
                                    model: str = "auto", *, range_policy: str = "extrapolate"):
    """The :class:`colligate.Solution` with the same solutes (water adjusted) that boils at
    ``T`` (K) under ``pressure`` (Pa)."""
    r = _core.concentration_for_boiling_point(solution, T, pressure, model, range_policy)
    _warn(r["reason"])
    if r["status"] != "converged":
        raise _core.ConvergenceError(f"concentration_for_boiling_point: {r['status']}")
    return r["solution"]

