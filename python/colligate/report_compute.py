"""Reports, first layer: the numbers the compiled core gives for one recipe or solution.

Freezing point, water activity at 25 degC, the eutectic of salt solutions, ice and
unfrozen liquid at the named temperatures, the heat load and the ice/enthalpy table.
Everything here calls the core through :mod:`colligate.api`; derived figures are in
:mod:`colligate.report_indicators`, text and tables in :mod:`colligate.report_layout`.

Every query of the ice curve (initial freezing point, eutectic, ice at a temperature)
goes through :class:`IcePath`, shared with :mod:`colligate.plot`: moving the reports and
plots onto another ice-curve object of the core changes that class only.
"""

from __future__ import annotations

import math
import warnings
from typing import Any, Mapping

import numpy as np

from . import api
from ._warnings import _warn
from .recipe import VOLATILE_SOLUTES, Recipe
from .uncertainty import propagate
from .units import ZERO_CELSIUS_K as ZERO_C_K
from .units import celsius_from_kelvin, fahrenheit_from_kelvin, kelvin_from_celsius

__all__ = [
    "AW_REFERENCE_T_K",
    "HEAT_LOAD_FROM_C",
    "THERMAL_MIN_K",
    "EUTECTIC_MARGIN_K",
    "VERIFY_NOTE",
    "WATER_ACTIVITY_NOTE",
    "TABLE_RANGE_C",
    "TABLE_COLUMNS",
    "IcePath",
    "solute_kinds",
    "electrolytes",
    "compute_solution",
    "uncertainty_entry",
    "UNCERTAINTY_LEVEL",
    "dairy_method",
    "eutectic_entry",
    "heat_load_end",
    "heat_load_entry",
    "report_eutectic_K",
    "recipe_entries",
    "ice_enthalpy_table",
]

#: Temperature at which the shelf-stability water activity is given, K (25 degC).
AW_REFERENCE_T_K = 298.15

#: Temperature the mix is taken from for the heat load, degC (ageing temperature; common practice).
HEAT_LOAD_FROM_C = 5.0

#: Coldest temperature of the thermal model, K (-40 degC, the enthalpy reference).
THERMAL_MIN_K = 233.15

#: Calculations that stop at a eutectic stop this far above it, K (the ice curve is
#: solved there; at the eutectic itself the salt phase is already saturated).
EUTECTIC_MARGIN_K = 0.01

#: Closing words of every salt, ethanol and water-activity safety statement.
VERIFY_NOTE = "verify by measurement and defer to local regulations"

#: Note shown next to the water activity.
WATER_ACTIVITY_NOTE = (
    "water activity is a model estimate, not a shelf-stability or safety finding; " + VERIFY_NOTE
)


def _f(x: Any) -> float | None:
    """Float for JSON: None instead of NaN or infinity."""
    try:
        v = float(x)
    except (TypeError, ValueError):
        return None
    return v if math.isfinite(v) else None


def solute_kinds() -> dict[str, str]:
    """Kind of every built-in solute (``electrolyte``, ``non_electrolyte``, ...) by id, from
    the core's solute table."""
    return {str(k): str(v) for k, v in api.solutes()["kind"].items()}


def electrolytes(solution: "api.Solution") -> list[str]:
    """Solutes of ``solution`` the core's solute table lists as electrolytes."""
    kinds = solute_kinds()
    return [k for k in solution.solutes if kinds.get(k) == "electrolyte"]


class IcePath:
    """The ice-curve queries of reports and plots for one solution, model and bound water.

    Parameters
    ----------
    solution : colligate.Solution
        The solution (or the water phase of a recipe).
    model : str
        Activity model id.
    bound_water_fraction_of_water : float
        Water that cannot freeze, kg per kg of the solution's water, in [0, 1).

    Every figure comes from one prepared :class:`colligate.IceCurve`: freezing point, the
    salt phases and the end of the curve (the final eutectic), ice at any temperature.
    """

    def __init__(self, solution: "api.Solution", model: str = "auto",
                 bound_water_fraction_of_water: float = 0.0) -> None:
        self.solution = api._as_solution(solution)
        self.model = model
        self.bound_water_fraction_of_water = float(bound_water_fraction_of_water or 0.0)
        self.curve = api.IceCurve(self.solution, model, self.bound_water_fraction_of_water)
        self._tf: float | None = None
        self._eutectic: dict[str, Any] | None = None

    @property
    def freezing_point(self) -> float:
        """Initial freezing point, K; NaN when the core finds none in its search range."""
        if self._tf is None:
            t, status, reason = self.curve.freezing_point
            _warn(reason)
            self._tf = float(t) if status == "converged" else math.nan
        return self._tf

    def eutectic(self) -> dict[str, Any]:
        """Where the curve ends (see :func:`colligate.eutectic`), with the salt phases."""
        if self._eutectic is None:
            self._eutectic = dict(api.eutectic_of(self.curve))
        return self._eutectic

    @property
    def eutectic_temperature(self) -> float | None:
        """Temperature, K, below which no liquid remains (final eutectic); None if none."""
        e = self.eutectic()
        t = _f(e.get("temperature"))
        return t if e.get("found") and t is not None else None

    def ice_fraction(self, T):
        """Ice over all the water at ``T`` (K, scalar or array)."""
        temps = np.asarray(T, dtype=float)
        values, reason, count = self.curve.ice_fractions(np.atleast_1d(temps))
        _warn(reason, count)
        return float(values[0]) if temps.ndim == 0 else values.reshape(temps.shape)

    def unfrozen_phase(self, T: float) -> "api.UnfrozenPhase":
        """Ice, unfrozen water and liquid at ``T`` (K)."""
        state = self.curve.at(float(T))
        _warn(state.reason)
        return api.UnfrozenPhase(state, api.unfrozen_liquid(self.solution, state))


def eutectic_entry(path: IcePath) -> dict[str, Any] | None:
    """The eutectic of a salt-containing solution as a report entry; None without salts."""
    if not electrolytes(path.solution):
        return None
    e = path.eutectic()
    t = _f(e.get("temperature"))
    found = bool(e.get("found")) and t is not None
    return {
        "found": found,
        "temperature_K": t if found else None,
        "temperature_C": celsius_from_kelvin(t) if found else None,
        "temperature_F": fahrenheit_from_kelvin(t) if found else None,
        "phase": str(e.get("phase") or ""),
        "formula": str(e.get("formula") or ""),
        "source": str(e.get("source") or ""),
        "reason": str(e.get("reason") or ""),
        "note": "below this temperature no liquid remains (the last salt crystallises with the "
        "ice) and the ice curve stops; a model estimate for brines and ice-salt baths: "
        + VERIFY_NOTE,
        "salts": [
            {
                "phase": str(s["name"]),
                "formula": str(s["formula"]),
                "source": str(s["source"]),
                "onset_temperature_C": celsius_from_kelvin(float(s["onset_temperature_K"])),
                "ends_temperature_C": (celsius_from_kelvin(float(s["ends_temperature_K"]))
                                       if math.isfinite(float(s["ends_temperature_K"])) else None),
            }
            for s in e.get("salts", [])
        ],
    }


def report_eutectic_K(path: IcePath) -> float | None:
    """Eutectic temperature (K) as the reports use it: salt solutions only, None otherwise."""
    eut = eutectic_entry(path)
    return eut["temperature_K"] if eut and eut["found"] else None


def compute_solution(path: IcePath, temps: Mapping[str, float]) -> dict[str, Any]:
    """The core's figures for ``path.solution`` at the named temperatures ``temps`` (K)."""
    solution, model = path.solution, path.model
    total = float(solution.total_mass)
    water = float(solution.water)
    volatile = sum(float(kg) for sid, kg in solution.solutes.items() if sid in VOLATILE_SOLUTES)
    solids = total - water - volatile  # dissolved solids: volatile liquids (ethanol) left out
    fractions = solution.mass_fractions()
    molal = solution.molalities()

    composition = [
        {"component": "water", "mass_kg": water, "mass_percent_of_aqueous_phase": 100.0 * fractions["water"],
         "molality_mol_per_kg": None}
    ]
    for sid, kg in solution.solutes.items():
        composition.append(
            {
                "component": sid,
                "mass_kg": float(kg),
                "mass_percent_of_aqueous_phase": 100.0 * float(fractions[sid]),
                "molality_mol_per_kg": _f(molal.get(sid)),
            }
        )

    tf = path.freezing_point
    freezes = math.isfinite(tf)  # NaN: the library found no freezing point in its search range
    aw = float(api.water_activity(solution, T=AW_REFERENCE_T_K, model=model))
    eutectic = eutectic_entry(path)
    t_eut = eutectic["temperature_K"] if eutectic and eutectic["found"] else None

    rows = []
    for point, t_k in temps.items():
        t_k = float(t_k)
        if t_eut is not None and t_k < t_eut:
            # Below the eutectic ice and the salt hydrate crystallise together; the ice
            # curve stops at the eutectic, so no number is given.
            rows.append(
                {
                    "name": point,
                    "temperature_K": t_k,
                    "temperature_C": celsius_from_kelvin(t_k),
                    "temperature_F": fahrenheit_from_kelvin(t_k),
                    "state": "below_eutectic",
                    "ice_fraction_of_water": None,
                    "ice_percent_of_water": None,
                    "ice_kg_of_aqueous_phase": None,
                    "ice_mass_percent_of_aqueous_phase": None,
                    "unfrozen_water_kg_of_aqueous_phase": None,
                    "dissolved_solids_mass_percent_of_unfrozen_liquid": None,
                    "water_activity_of_unfrozen_liquid": None,
                }
            )
            continue
        if freezes and t_k >= tf:
            ice = 0.0
            aw_t = None
        else:
            phase = path.unfrozen_phase(t_k)
            ice = max(0.0, float(phase.ice))
            aw_t = _f(phase.water_activity)
        liquid = water - ice
        rows.append(
            {
                "name": point,
                "temperature_K": t_k,
                "temperature_C": celsius_from_kelvin(t_k),
                "temperature_F": fahrenheit_from_kelvin(t_k),
                "state": ("frozen" if liquid <= 0.0 else "partly_frozen") if ice > 0.0 else "unfrozen",
                "ice_fraction_of_water": ice / water,
                "ice_percent_of_water": 100.0 * ice / water,
                "ice_kg_of_aqueous_phase": ice,
                "ice_mass_percent_of_aqueous_phase": 100.0 * ice / total,
                "unfrozen_water_kg_of_aqueous_phase": liquid,
                # pure water below 0 C is all ice: no liquid, so no liquid composition
                "dissolved_solids_mass_percent_of_unfrozen_liquid": (
                    100.0 * solids / (solids + volatile + liquid) if solids + volatile + liquid > 0.0 else None),
                "water_activity_of_unfrozen_liquid": aw_t,
            }
        )

    return {
        "dairy_method": dairy_method(solution, temps),
        "model": model,
        "model_description": str(api.describe_model(solution, model=model)),
        "aqueous_phase": composition,
        "aqueous_phase_mass_kg": total,
        "water_kg_of_aqueous_phase": water,
        "dissolved_solids_mass_percent_of_aqueous_phase": 100.0 * solids / total,
        "bound_water_fraction_of_water": path.bound_water_fraction_of_water,
        "bound_water_kg_of_aqueous_phase": path.bound_water_fraction_of_water * water,
        "freezing_point_K": tf if freezes else None,
        "freezing_point_C": celsius_from_kelvin(tf) if freezes else None,
        "freezing_point_F": fahrenheit_from_kelvin(tf) if freezes else None,
        "water_activity_25C": aw,
        "water_activity_note": WATER_ACTIVITY_NOTE,
        "eutectic": eutectic,
        "ice_table": rows,
        "uncertainty": uncertainty_entry(path, temps),
    }


UNCERTAINTY_LEVEL = 0.95
UNCERTAINTY_NOTE = ("the interval covers the uncertainty of the fitted constants only (their covariance), "
                    "not the model's own error or the variation of real ingredients; " + VERIFY_NOTE)
_MC_DRAWS = 4_000  # Monte Carlo fallback where no closed form applies (seeded: repeatable;
# a report holds several figures, so fewer draws than the 10^5 of the acceptance checks)


def _uncertain(solution, quantity, T, model, bound):
    """(UncertainValue, method): linear propagation, else seeded Monte Carlo."""
    try:
        return propagate(solution, quantity, T, model, bound_water_fraction_of_water=bound), "linear"
    except api.InvalidInputError:
        return propagate(solution, quantity, T, model, bound_water_fraction_of_water=bound,
                         method="monte_carlo", draws=_MC_DRAWS, seed=0), "monte_carlo"


def _band(u, method: str) -> dict[str, Any]:
    lo, hi = u.ci(UNCERTAINTY_LEVEL)
    return {"value": _f(u.value), "standard_uncertainty": _f(u.std), "method": method,
            "degrees_of_freedom": int(u.degrees_of_freedom),
            "coverage_factor": _f(u.coverage_factor(UNCERTAINTY_LEVEL)) if method == "linear" else None,
            "interval": [_f(lo), _f(hi)]}


def uncertainty_entry(path: IcePath, temps: Mapping[str, float]) -> dict[str, Any] | None:
    """The freezing point, a_w at 25 C and the ice fraction at each named temperature with
    their standard uncertainty and 95 % coverage interval, when a solute of the solution
    has constants with a stated covariance (a fitted solute, or a built-in constant whose
    source gives one); None otherwise. Computed by the core (colligate.uncertainty)."""
    solution, model, bound = path.solution, path.model, float(path.bound_water_fraction_of_water)
    tf, how = _uncertain(solution, "freezing_point", 0.0, model, bound)
    if not tf.constants:
        return None
    aw, how_aw = _uncertain(solution, "water_activity", AW_REFERENCE_T_K, model, 0.0)
    t_eut = report_eutectic_K(path)
    ice = []
    for point, t_k in temps.items():
        t_k = float(t_k)
        if t_eut is not None and t_k < t_eut:
            continue  # below the eutectic the report gives no ice figure
        u, how_ice = _uncertain(solution, "ice_fraction", t_k, model, bound)
        ice.append({"name": point, "temperature_K": t_k, **_band(u, how_ice)})
    return {
        "level": UNCERTAINTY_LEVEL,
        "constants": list(tf.constants),
        "not_stated": list(tf.not_stated),
        "freezing_point_K": _band(tf, how),
        "water_activity_25C": _band(aw, how_aw),
        "ice_fraction_of_water": ice,
        "note": UNCERTAINTY_NOTE,
    }


def dairy_method(solution: "api.Solution", temps: Mapping[str, float]) -> dict[str, Any] | None:
    """The Leighton (1927) / Goff & Hartel (2013) dairy method beside the model, for mixes
    of sugars and milk solids only (None otherwise)."""
    if "milk_salts" not in solution.solutes or [e for e in electrolytes(solution) if e != "milk_salts"]:
        return None
    notes: list[str] = []
    with warnings.catch_warnings(record=True) as caught:
        warnings.simplefilter("always")
        tf = float(api.leighton_freezing_point(solution))
        rows = [{"name": point, "temperature_K": float(t_k),
                 "ice_percent_of_water": 100.0 * float(api.leighton_ice_fraction(solution, float(t_k)))}
                for point, t_k in temps.items()]
    for w in caught:
        text = str(w.message)
        if text not in notes:
            notes.append(text)
    return {
        "method": "Leighton (1927) as given by Goff & Hartel (2013), Ice Cream, ch. 6, Table 6.1",
        "freezing_point_K": tf,
        "freezing_point_C": celsius_from_kelvin(tf),
        "ice_table": rows,
        "notes": notes,
    }


def recipe_entries(recipe: Recipe) -> dict[str, Any]:
    """Batch mass (kg), the ingredient rows and the composition summary of a recipe."""
    batch = recipe.total_mass
    out: dict[str, Any] = {"batch_mass_kg": batch}
    if recipe.ingredients is not None:
        out["ingredients"] = [
            {"ingredient": k, "mass_kg": v, "mass_percent_of_batch": 100.0 * v / batch}
            for k, v in recipe.ingredients.items()
        ]
    summary = recipe.composition_summary()
    out["composition_summary"] = [
        {"component": r["component"], "mass_kg": r["kg"], "mass_percent_of_batch": r["percent_of_batch"],
         "sources": r["sources"]} for r in summary["components"]]
    by = {r["component"]: r["percent_of_batch"] for r in summary["components"]}
    out["total_solids_mass_percent_of_batch"] = by["total_solids"]
    out["ethanol_mass_percent_of_batch"] = by["ethanol"]
    out["ethanol_abv_percent_of_water_and_ethanol"] = summary["ethanol_abv_percent"]
    return out


def heat_load_end(t_storage: float, t_eutectic: float | None) -> tuple[float, str | None]:
    """Where a cooling calculation towards ``t_storage`` (K) has to stop.

    Returns the end temperature (K) and why it differs from ``t_storage``: ``"eutectic"``
    (the ice curve stops there), ``"thermal_model_limit"`` (-40 degC) or None.
    """
    if t_eutectic is not None and t_storage < t_eutectic + EUTECTIC_MARGIN_K:
        return float(t_eutectic) + EUTECTIC_MARGIN_K, "eutectic"
    if t_storage < THERMAL_MIN_K:
        return THERMAL_MIN_K, "thermal_model_limit"
    return float(t_storage), None


def heat_load_entry(recipe: Recipe, path: IcePath, temps: Mapping[str, float]) -> dict[str, Any]:
    """Heat to remove per kg from the fill temperature to storage (or the eutectic), kJ/kg."""
    t_from = kelvin_from_celsius(HEAT_LOAD_FROM_C)
    t_storage = float(temps.get("storage", min(temps.values(), default=kelvin_from_celsius(-18.0))))
    t_to, stop = heat_load_end(t_storage, report_eutectic_K(path))
    q = recipe.heat_load(t_from, t_to)
    return {
        "from_C": HEAT_LOAD_FROM_C,
        "to_C": celsius_from_kelvin(t_to),
        "total_kJ_per_kg_of_batch": q["total"] / 1e3,
        "sensible_kJ_per_kg_of_batch": q["sensible"] / 1e3,
        "latent_kJ_per_kg_of_batch": q["latent"] / 1e3,
        "enthalpy_reference": "H = 0 at -40 C",
        "stopped_at": stop,
    }


# --------------------------------------------------------------------------- ice / enthalpy table

#: Temperature span and step of the ice/enthalpy table, degC (warm end, cold end, step in K).
TABLE_RANGE_C: tuple[float, float, float] = (HEAT_LOAD_FROM_C, -40.0, 0.5)

#: Columns of :func:`ice_enthalpy_table`, units in the names.
TABLE_COLUMNS: tuple[str, ...] = (
    "point",
    "temperature_C",
    "temperature_K",
    "temperature_F",
    "state",
    "ice_fraction",
    "ice_kg",
    "unfrozen_water_kg",
    "unfrozen_solids_mass_percent",
    "enthalpy_J_per_kg",
    "apparent_cp_J_per_kg_K",
    "heat_removed_from_fill_J_per_kg",
)


def ice_enthalpy_table(recipe: Recipe, *, step_K: float | None = None):
    """Ice and enthalpy of a recipe over temperature, as a pandas DataFrame.

    Rows run from the fill temperature (:data:`HEAT_LOAD_FROM_C`) down to -40 degC in
    steps of ``step_K`` (default 0.5 K), plus the named temperatures of the recipe, the
    initial freezing point and (for salt solutions) the eutectic; the ``point`` column
    names those rows. Columns (units in the names): see :data:`TABLE_COLUMNS`.
    ``ice_fraction`` is ice over all the water; ``ice_kg`` and ``unfrozen_water_kg`` are
    for the recipe's batch (unfrozen water includes water unable to freeze); enthalpy
    has H = 0 at -40 degC; ``heat_removed_from_fill_J_per_kg`` is H(fill) - H(T).

    Below a salt eutectic the ice curve stops: ``state`` is ``below_eutectic`` and the
    numbers are NaN (empty cells in CSV).
    """
    import numpy as np
    import pandas as pd

    warm_c, cold_c, default_step = TABLE_RANGE_C
    step = float(default_step if step_K is None else step_K)
    if not (math.isfinite(step) and 0.01 <= step <= 10.0):
        raise ValueError(f"step_K = {step_K}: must be between 0.01 and 10 K")
    solution = recipe.solution()
    model = recipe.model
    path = IcePath(solution, model, float(recipe.bound_water_fraction_of_water or 0.0))
    tf = path.freezing_point
    t_eut = report_eutectic_K(path)

    n = int(round((warm_c - cold_c) / step))
    points: dict[float, list[str]] = {}
    for k in range(n + 1):
        points.setdefault(round(warm_c - k * step, 9), [])
    points.setdefault(round(warm_c, 9), []).append("fill")
    for name, t_k in recipe.temperatures.items():
        points.setdefault(round(celsius_from_kelvin(float(t_k)), 9), []).append(name)
    if math.isfinite(tf):
        points.setdefault(celsius_from_kelvin(tf), []).append("initial_freezing_point")
    if t_eut is not None:
        points.setdefault(celsius_from_kelvin(t_eut), []).append("eutectic")

    temps_c = np.array(sorted(points, reverse=True), dtype=float)
    temps_k = temps_c + ZERO_C_K
    water = float(solution.water)
    volatile = sum(float(kg) for sid, kg in solution.solutes.items() if sid in VOLATILE_SOLUTES)
    solids = float(solution.total_mass) - water - volatile  # ethanol is liquid, not solids
    in_range = temps_k >= THERMAL_MIN_K - 1e-9
    if t_eut is not None:
        # at the eutectic itself the curve is evaluated a hair above it
        at_eut = np.isclose(temps_k, t_eut, rtol=0.0, atol=1e-9)
        temps_eval = np.where(at_eut, temps_k + EUTECTIC_MARGIN_K, temps_k)
        ok = in_range & (temps_eval > t_eut)
    else:
        temps_eval = temps_k
        ok = in_range
    nan = np.full(temps_k.shape, np.nan)
    ice = nan.copy()
    h = nan.copy()
    cp = nan.copy()
    if ok.any():
        te = np.minimum(temps_eval[ok], 313.15)
        f = np.asarray(path.ice_fraction(te), dtype=float)
        if math.isfinite(tf):
            f = np.where(te >= tf, 0.0, f)
        ice[ok] = np.maximum(f, 0.0)
        h[ok] = np.asarray(recipe.enthalpy(te), dtype=float)
        cp[ok] = np.asarray(recipe.apparent_specific_heat(te), dtype=float)
    h_fill = float(recipe.enthalpy(kelvin_from_celsius(warm_c)))
    state = np.where(ice > 0.0, "partly_frozen", "unfrozen").astype(object)
    if t_eut is not None:
        state[temps_k < t_eut - 1e-9] = "below_eutectic"
    state[~in_range] = "outside_thermal_model"
    ice_kg = ice * water
    liquid = water - ice_kg
    df = pd.DataFrame(
        {
            "point": [" ".join(points[t]) for t in sorted(points, reverse=True)],
            "temperature_C": temps_c,
            "temperature_K": temps_k,
            "temperature_F": temps_c * 1.8 + 32.0,
            "state": state,
            "ice_fraction": ice,
            "ice_kg": ice_kg,
            "unfrozen_water_kg": liquid,
            "unfrozen_solids_mass_percent": np.divide(100.0 * solids, solids + volatile + liquid,
                                                      out=np.full_like(liquid, np.nan),
                                                      where=(solids + volatile + liquid) > 0.0),
            "enthalpy_J_per_kg": h,
            "apparent_cp_J_per_kg_K": cp,
            "heat_removed_from_fill_J_per_kg": h_fill - h,
        },
        columns=list(TABLE_COLUMNS),
    )
    return df
