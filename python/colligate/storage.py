"""Storage stability: glass transition of the unfrozen phase and the state diagram.

A thin layer over the compiled core (``colligate._core``): the glass curves, Tg' and Cg'
are computed in C++ (``equilibria/glass_transition.hpp``, ``equilibria/state_diagram.hpp``);
this module converts units at the edge, turns validity reasons into warnings and draws
the plot. Every temperature is in K.

Below Tg' the unfrozen phase of a frozen food is a glass and ice crystals grow very
slowly; T - Tg' is the margin of a storage temperature. These are estimates from published
constants: confirm shelf life by storage trials.
"""
from __future__ import annotations

import os
import warnings
from dataclasses import dataclass, field
from typing import Any, Iterable, Union

import numpy as np

from . import _core, api
from ._files import OutputSet, atomic_write, check_output_path
from ._warnings import _warn
from .units import ZERO_CELSIUS_K

__all__ = ["GlassDataWarning", "StateDiagram", "glass_transition", "glass_transition_table",
           "state_diagram", "solubility", "lactose_initial_solubility", "sugar_solubility_curves",
           "CrystallisationCheck", "crystallisation_check"]

GLASS_RULES = ("gordon_taylor", "couchman_karasz")


def _celsius(kelvin):
    """K to degC for the plot axes (points, scalar or array)."""
    return np.asarray(kelvin, dtype=float) - ZERO_CELSIUS_K


class GlassDataWarning(UserWarning):
    """Some dissolved solutes have no glass-transition data and were left out of Tg."""


def _solution_and_bound(obj: Any, bound_water_fraction_of_water: float | None):
    """A Solution and its bound water from a Solution or a Recipe."""
    if isinstance(obj, api.Solution):
        return obj, float(bound_water_fraction_of_water or 0.0), "auto"
    if hasattr(obj, "solution") and hasattr(obj, "bound_water_fraction_of_water"):
        bound = (obj.bound_water_fraction_of_water if bound_water_fraction_of_water is None
                 else bound_water_fraction_of_water)
        return obj.solution(), float(bound or 0.0), getattr(obj, "model", "auto")
    raise api.InvalidInputError(
        f"expected a colligate.Solution or colligate.Recipe, got {type(obj).__name__}")


def _warn_lacking(lacking: list[str]) -> None:
    if lacking:
        warnings.warn("no glass-transition data for " + ", ".join(lacking)
                      + "; left out of Tg (colligate.storage.glass_transition_table() lists "
                      "the solutes with data)", GlassDataWarning, stacklevel=3)


def glass_transition_table():
    """The built-in glass-transition constants as a DataFrame (K, J/(kg K), source keys)."""
    import pandas as pd

    return pd.DataFrame(_core.glass_transition_table())


def glass_transition(solution: "api.Solution", rule: str = "gordon_taylor", *,
                     water_kg: float | None = None) -> float:
    """Glass transition temperature (K) of a solution's aqueous phase.

    Parameters
    ----------
    solution : colligate.Solution
        Its solutes; its water unless ``water_kg`` is given.
    rule : {"gordon_taylor", "couchman_karasz"}
        How the components' Tg are combined (Gordon & Taylor 1952 with each solute's k
        against water; Couchman & Karasz 1978 with the heat-capacity steps).
    water_kg : float, optional
        Water of the phase, kg (for example an unfrozen phase's liquid plus bound water).

    Notes
    -----
    Solutes without data are left out with a :class:`GlassDataWarning`; with none left a
    ValueError names them.
    """
    r = _core.glass_transition(api._as_solution(solution), water_kg, rule)
    _warn_lacking(r["lacking"])
    return float(r["temperature"])


@dataclass(frozen=True)
class StateDiagram:
    """The supplemented state diagram of a solution: ice curve, glass curve, Tg' and Cg'.

    Attributes
    ----------
    tg_prime : float
        K, where the unfrozen phase on the ice curve is at its glass transition.
    cg_prime : float
        Solute mass fraction of that maximally freeze-concentrated phase.
    unfrozen_water_per_solids : float
        Wg', kg of unfrozen (liquid + bound) water per kg of solutes.
    ice_fraction : float
        Ice over total water at Tg'.
    status : str
        ``converged`` or why not (``not_frozen``, ``below_search_limit``...).
    reason : str
        The ice curve's validity at Tg' ('' when in range).
    """

    solution: "api.Solution"
    model: str
    rule: str
    tg_prime: float
    cg_prime: float
    unfrozen_water_per_solids: float
    ice_fraction: float
    status: str
    reason: str
    counted: tuple[str, ...]
    lacking: tuple[str, ...]
    label: str | None = None
    named_temperatures: dict = field(default_factory=dict)

    def margin(self, T: Union[float, Iterable[float]]):
        """Storage margin T - Tg' (K) at temperature(s) T (K): > 0 means not glassy."""
        return np.asarray(T, dtype=float) - self.tg_prime if np.ndim(T) else float(T) - self.tg_prime

    def glass_curve(self, solute_mass_fraction) -> np.ndarray:
        """Tg (K) of the solutes, in their proportions, at each solute mass fraction in (0, 1]."""
        return _core.glass_curve(self.solution, np.asarray(solute_mass_fraction, dtype=float), self.rule)

    def liquidus(self, solute_mass_fraction) -> np.ndarray:
        """Freezing point (K) of the solutes, in their proportions, at each mass fraction in (0, 1)."""
        values, reason, count = _core.liquidus_curve(
            self.solution, np.asarray(solute_mass_fraction, dtype=float), self.model)
        _warn(reason, count)
        return values

    def plot(self, path: str | os.PathLike[str], *, inputs: Iterable[str | os.PathLike[str]] = (),
             outputs: OutputSet | None = None, points: int = 200) -> str:
        """Write the state diagram (degC against solute mass fraction) to ``path``.

        The ice curve ends where the library's freezing-point search stops; the glass curve
        runs to the dry solids; Tg' and Cg' are marked, and each named temperature of
        ``named_temperatures`` is drawn as a horizontal line with its margin to Tg'.
        Returns the path written.
        """
        from matplotlib.backends.backend_agg import FigureCanvasAgg
        from matplotlib.figure import Figure

        target = check_output_path(path, inputs, "plot")
        fmt = os.path.splitext(target)[1].lower().lstrip(".") or "png"
        if points < 10:
            raise ValueError(f"points = {points}: must be >= 10")
        w = np.linspace(0.005, 1.0, points)
        with warnings.catch_warnings():
            warnings.simplefilter("ignore")  # the diagram draws beyond the models' ranges on purpose
            tg = self.glass_curve(w)
            lw = w[w < 0.995]
            liq = self.liquidus(lw)
        fig = Figure(figsize=(8.0, 5.5), dpi=110)  # no pyplot: no global backend, no GUI
        FigureCanvasAgg(fig)
        ax = fig.add_subplot(1, 1, 1)
        ax.plot(lw, _celsius(liq), color="#174a7c", linewidth=2.0,
                label="ice curve (freezing point)")
        ax.plot(w, _celsius(tg), color="#b8202a", linewidth=2.0,
                label=f"glass curve ({self.rule.replace('_', '-')})")
        if self.status == "converged":
            tgp = float(_celsius(self.tg_prime))
            ax.plot([self.cg_prime], [tgp], marker="o", color="k", zorder=5,
                    label=f"Tg' {tgp:.1f} °C, Cg' {self.cg_prime:.3f}")
            ax.axhline(tgp, color="k", linestyle=":", linewidth=0.8)
            ax.axvline(self.cg_prime, color="k", linestyle=":", linewidth=0.8)
        for i, (name, t_k) in enumerate(self.named_temperatures.items()):
            ax.axhline(float(_celsius(t_k)), color=("#1b7f79", "#c4622d", "#5b4a9e")[i % 3],
                       linestyle="--", linewidth=1.0,
                       label=f"{name} {float(_celsius(t_k)):.1f} °C "
                             f"(T - Tg' {float(t_k) - self.tg_prime:+.1f} K)")
        ax.set_xlim(0.0, 1.0)
        ax.set_ylim(-140.0, max(120.0, float(np.nanmax(_celsius(tg))) + 10.0))
        ax.set_xlabel("solute mass fraction of the aqueous phase")
        ax.set_ylabel("temperature, °C")
        title = "State diagram: " + ", ".join(self.counted)
        if self.lacking:
            title += " (no glass data: " + ", ".join(self.lacking) + ")"
        ax.set_title(title, fontsize=10)
        if self.label:
            ax.text(0.99, 0.01, self.label, transform=ax.transAxes, ha="right", va="bottom",
                    fontsize=8, color="#555555")
        ax.legend(loc="upper left", fontsize=8)
        ax.grid(True, alpha=0.3)
        return atomic_write(target, lambda fh: fig.savefig(fh, format=fmt), inputs, "plot", into=outputs)


def state_diagram(solution_or_recipe: Any, model: str | None = None, *,
                  bound_water_fraction_of_water: float | None = None,
                  rule: str = "gordon_taylor", named_temperatures: dict | None = None,
                  label: str | None = None) -> StateDiagram:
    """The state diagram of a solution or recipe: Tg', Cg' and the curves to plot.

    Parameters
    ----------
    solution_or_recipe : colligate.Solution or colligate.Recipe
        A recipe brings its own model and bound water unless given here.
    model : str, optional
        Activity model id of the ice curve (default: the recipe's, else "auto").
    bound_water_fraction_of_water : float, optional
        Unfreezable water, kg per kg of the water, in [0, 1) (part of the unfrozen phase).
    rule : {"gordon_taylor", "couchman_karasz"}
    named_temperatures : dict of str to float, optional
        Storage temperatures (K) to mark on the plot with their margin T - Tg'.
    label : str, optional
        Printed in the plot's corner (e.g. "invented demo scenario").

    Tg' and Cg' are estimates from published constants; the ice curve above a model's
    validated concentration is an extrapolation (an OutOfValidityRangeWarning says so).
    Confirm storage stability by trials.
    """
    s, bound, recipe_model = _solution_and_bound(solution_or_recipe, bound_water_fraction_of_water)
    model = model or recipe_model
    if named_temperatures is None:  # a recipe's named temperatures (K), if it has any
        named_temperatures = dict(getattr(solution_or_recipe, "temperatures", None) or {})
        if label is None:
            label = getattr(solution_or_recipe, "label", None) or None
    r = _core.maximal_freeze_concentration(s, model, bound, rule)
    _warn_lacking(r["lacking"])
    _warn(r["reason"])
    return StateDiagram(
        solution=s, model=model, rule=rule, tg_prime=float(r["tg_prime"]),
        cg_prime=float(r["cg_prime"]), unfrozen_water_per_solids=float(r["unfrozen_water_per_solids"]),
        ice_fraction=float(r["ice_fraction"]), status=r["status"], reason=r["reason"],
        counted=tuple(r["counted"]), lacking=tuple(r["lacking"]), label=label,
        named_temperatures=dict(named_temperatures or {}))


def solubility(solute: str, T):
    """Solubility of a sugar at T (K, scalar or array): mass fraction of the saturated solution.

    ``solute``: "sucrose", "lactose" (final solubility, alpha and beta at equilibrium) or
    "glucose"/"dextrose" (the stable solid: monohydrate below about 50 degC, anhydrous
    above). Outside the data's temperatures the curve is extrapolated with an
    OutOfValidityRangeWarning. Sources: :func:`sugar_solubility_curves`.
    """
    sid = _sugar_id(solute)
    t = np.asarray(T, dtype=float)
    out = np.empty_like(np.atleast_1d(t))
    reason, count = "", 0
    for i, ti in enumerate(np.atleast_1d(t)):
        w, _s, _phase, why = _core.sugar_solubility(sid, float(ti))
        out[i] = w
        if why:
            reason, count = reason or why, count + 1
    _warn(reason, count)
    return float(out[0]) if t.ndim == 0 else out


def _sugar_id(solute: str) -> str:
    """The table id of a solute name ("dextrose" -> "glucose"), by the core's name lookup."""
    return api.Solution(water=1.0, solutes={solute: 1e-6}).species[0]


def lactose_initial_solubility(T: float) -> float:
    """Initial solubility of alpha-lactose at T (K): mass fraction of the solution that
    forms at once, before mutarotation (final over 1 + beta/alpha)."""
    w, _s, _phase, why = _core.lactose_initial_solubility(float(T))
    _warn(why)
    return float(w)


def sugar_solubility_curves():
    """The solubility curves (ln S = a + b/T + c ln T, S kg per kg water) as a DataFrame."""
    import pandas as pd

    return pd.DataFrame(_core.sugar_solubility_curves())


@dataclass(frozen=True)
class CrystallisationCheck:
    """Which sugars can crystallise in storage, and where.

    ``states`` is a DataFrame, one row per sugar and named temperature: concentration in the
    unfrozen water and solubility (kg per kg water), their ratio (> 1: supersaturated),
    ``glassy`` (at or below Tg') and ``crystallisation_possible``. ``ranges`` maps each sugar
    to the temperature intervals (K) where it is supersaturated above Tg'. Binary
    solubilities in pure water are used (other solutes' effect not counted); a
    supersaturated phase may take months to nucleate.
    """

    tg_prime: float
    states: Any
    ranges: dict


def crystallisation_check(solution_or_recipe: Any, temperatures: dict | Iterable[float],
                          model: str | None = None, *,
                          bound_water_fraction_of_water: float | None = None) -> CrystallisationCheck:
    """Supersaturation of sucrose, lactose and glucose in the unfrozen phase.

    ``temperatures``: a dict of named temperatures (K), e.g. {"display": 255.15}, or a list.
    Extrapolated solubilities and ice-curve states warn once (OutOfValidityRangeWarning).
    """
    import pandas as pd

    s, bound, recipe_model = _solution_and_bound(solution_or_recipe, bound_water_fraction_of_water)
    named = dict(temperatures) if isinstance(temperatures, dict) else {f"{t:.2f} K": t for t in temperatures}
    r = _core.crystallisation_check(s, [float(t) for t in named.values()], model or recipe_model, bound)
    rows = list(r["states"])
    n = len(r["sugars"])
    names = [name for name in named for _ in range(n)]
    df = pd.DataFrame(rows)
    if len(df):
        df.insert(0, "name", names)
        reasons = [x for x in df.pop("reason") if x]
        _warn(reasons[0] if reasons else "", len(reasons))
    return CrystallisationCheck(tg_prime=float(r["tg_prime"]), states=df,
                                ranges={k: [tuple(iv) for iv in v] for k, v in dict(r["ranges"]).items()})
