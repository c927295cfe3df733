"""Plots for product developers (PNG, matplotlib with the Agg backend).

* :func:`plot_ice_curve`: ice as a share of the water against temperature;
* :func:`plot_enthalpy`: enthalpy H(T) and apparent specific heat dH/dT (two panels);
* :func:`plot_cooling_curve`: temperature against the heat removed per kg, from the
  fill temperature down to storage, with the freezing point and the named
  temperatures marked.

matplotlib is imported inside the functions, so ``import colligate`` never
needs it. Files are written atomically and never over an input file. Inside,
everything is SI; the axes show degC, kJ/kg and kJ/(kg K). Where a salt
eutectic lies inside the range, the curves stop there and the eutectic is marked.
"""

from __future__ import annotations

import os
import warnings
from typing import Iterable, Mapping

import numpy as np

from . import api
from ._files import OutputSet, atomic_write, check_output_path
from .report_compute import EUTECTIC_MARGIN_K as _EUTECTIC_MARGIN_K
from .report_compute import IcePath
from .uncertainty import propagate
from .units import ZERO_CELSIUS_K, celsius_from_kelvin

__all__ = [
    "check_plot_path",
    "plot_ice_curve",
    "plot_enthalpy",
    "plot_cooling_curve",
    "plot_contributions",
    "CURVE_RANGE_C",
    "THERMAL_RANGE_C",
    "FILL_TEMPERATURE_C",
]

#: Temperature span of the curve, degC (warm end, cold end).
CURVE_RANGE_C: tuple[float, float] = (2.0, -40.0)

#: Temperature span of the enthalpy plot, degC (warm end, cold end; the cold end is the
#: -40 degC limit of the thermal model).
THERMAL_RANGE_C: tuple[float, float] = (10.0, -40.0)

#: Default fill temperature of the cooling curve, degC: the mix leaves ageing at about
#: 5 degC (common practice); the report's heat load starts there too.
FILL_TEMPERATURE_C = 5.0

_MARK_STYLES = ("--", "-.", ":", (0, (5, 2, 1, 2)))
_MARK_COLOURS = ("#1b7f79", "#c4622d", "#5b4a9e", "#7a7a2e", "#9e3b63")
_CURVE_COLOUR = "#174a7c"
_CP_COLOUR = "#2e6b3a"
_FREEZE_COLOUR = "#b8202a"
_EUTECTIC_COLOUR = "#6b6b6b"


def plot_ice_curve(
    solution: "api.Solution",
    path: str | os.PathLike[str],
    marks: Mapping[str, float] | None = None,
    model: str = "auto",
    *,
    bound_water_fraction_of_water: float = 0.0,
    title: str | None = None,
    label: str | None = None,
    inputs: Iterable[str | os.PathLike[str]] = (),
    outputs: OutputSet | None = None,
    points: int = 421,
    fahrenheit: bool = False,
) -> str:
    """Write a PNG of ice fraction (% of the water) against temperature (degC).

    Parameters
    ----------
    solution : colligate.Solution
        The solution to plot.
    path : path-like
        Output PNG file. Written atomically; refused if it names one of ``inputs``.
    marks : mapping of str to float, optional
        Named temperatures in K (e.g. ``{"drawing": 267.65}``), drawn as vertical lines.
    model : str
        Model id (``colligate.models()``).
    bound_water_fraction_of_water : float
        Water that cannot freeze, kg per kg of the water, in [0, 1).
    title, label : str, optional
        Plot title, and a label (e.g. "invented demo scenario") printed in the corner.
    inputs : iterable of path-like
        Input files that must never be overwritten.
    outputs : colligate._files.OutputSet, optional
        Write the file into this set of a command's outputs (renamed into place when the
        set is committed) instead of at once.
    points : int
        Number of temperatures on the curve (>= 10).
    fahrenheit : bool
        Also show a degF scale along the top.

    Returns
    -------
    str
        The path written (the file type follows the extension: .png, .svg, .pdf ...).
    """
    target = check_plot_path(path, inputs, "plot")
    if points < 10:
        raise ValueError(f"points = {points}: must be >= 10")

    ice_path = IcePath(solution, model, bound_water_fraction_of_water)
    tf = ice_path.freezing_point
    t_eut = _eutectic_K(ice_path)
    warm_c, cold_c = CURVE_RANGE_C
    temps_c = np.linspace(warm_c, cold_c, points)
    freezes = bool(np.isfinite(tf))  # NaN: no freezing point in the library's search range
    tf_c = celsius_from_kelvin(tf) if freezes else float("nan")
    if freezes and cold_c < tf_c < warm_c:
        temps_c = np.unique(np.append(temps_c, tf_c))[::-1]
    eut_c = celsius_from_kelvin(t_eut) if np.isfinite(t_eut) else float("nan")
    if np.isfinite(eut_c) and cold_c < eut_c < warm_c:
        stop_c = eut_c + _EUTECTIC_MARGIN_K
        temps_c = np.unique(np.append(temps_c[temps_c > stop_c], stop_c))[::-1]
    temps_k = temps_c + ZERO_CELSIUS_K
    frac = np.asarray(ice_path.ice_fraction(temps_k), dtype=float)
    if freezes:
        frac = np.where(temps_k >= tf, 0.0, frac)

    fig = _figure(8.0, 5.0)
    ax = fig.add_subplot(1, 1, 1)
    ax.plot(temps_c, 100.0 * frac, color=_CURVE_COLOUR, linewidth=2.0, label="ice, % of the water")
    band = _ice_band(ice_path, temps_k, frac)
    if band is not None:
        ax.fill_between(temps_c, 100.0 * band[0], 100.0 * band[1], color=_CURVE_COLOUR, alpha=0.25,
                        linewidth=0.0, label="95 % interval (uncertainty of fitted constants)")

    if freezes:
        ax.axvline(tf_c, color=_FREEZE_COLOUR, linestyle="-", linewidth=1.0, alpha=0.8)
        ax.plot([tf_c], [0.0], marker="o", color=_FREEZE_COLOUR, zorder=5,
                label=f"initial freezing point {tf_c:.2f} °C")
    if np.isfinite(eut_c) and cold_c < eut_c < warm_c:
        _mark_eutectic(ax, eut_c, vertical=True)
    _mark_salt_onsets(ax, ice_path, cold_c, warm_c)

    for i, (name, t_k) in enumerate((marks or {}).items()):
        t_c = celsius_from_kelvin(float(t_k))
        colour = _MARK_COLOURS[i % len(_MARK_COLOURS)]
        style = _MARK_STYLES[i % len(_MARK_STYLES)]
        if np.isfinite(t_eut) and t_k < t_eut:
            ax.axvline(t_c, color=colour, linestyle=style, linewidth=1.3,
                       label=f"{name} {t_c:.1f} °C: below the eutectic")
            continue
        frozen = t_k < tf if freezes else True
        f = float(ice_path.ice_fraction(float(t_k))) if frozen else 0.0
        ax.axvline(t_c, color=colour, linestyle=style, linewidth=1.3,
                   label=f"{name} {t_c:.1f} °C: {100.0 * f:.0f} % ice")
        ax.plot([t_c], [100.0 * f], marker="s", color=colour, zorder=5)

    _ice_axes(ax, warm_c, cold_c, _one_line(title) or "Ice curve", fahrenheit, "best")
    _footer(fig, model, label)
    return _save(fig, target, inputs, outputs)


# --------------------------------------------------------------------------- helpers


def _ice_band(ice_path: IcePath, temps_k: np.ndarray, frac: np.ndarray):
    """(lower, upper) 95 % coverage interval of the ice fraction along the curve when a
    solute's constants carry a stated covariance (linear propagation in the core); None
    when none does or no closed form applies (a salt + sugar mixture, a salt crystallised)."""
    bound = float(ice_path.bound_water_fraction_of_water)
    try:
        with warnings.catch_warnings():
            warnings.simplefilter("ignore")  # the curve itself already warned
            first = propagate(ice_path.solution, "freezing_point", 0.0, ice_path.model,
                              bound_water_fraction_of_water=bound)
            if not first.constants:
                return None  # nothing stated: no band (one call, not one per point)
            u = propagate(ice_path.solution, "ice_fraction", np.asarray(temps_k, dtype=float), ice_path.model,
                          bound_water_fraction_of_water=bound)
    except (api.InvalidInputError, api.ConvergenceError):
        return None
    lo, hi = u.ci(0.95)
    ok = np.isfinite(lo) & np.isfinite(hi)
    lo = np.clip(np.where(ok, lo, frac), 0.0, 1.0)
    hi = np.clip(np.where(ok, hi, frac), 0.0, 1.0)
    return lo, hi


def plot_formats() -> dict[str, str]:
    """File extensions matplotlib can write (without the dot) and what they are."""
    from matplotlib.backend_bases import FigureCanvasBase

    return dict(FigureCanvasBase.get_supported_filetypes())


def check_plot_path(path: str | os.PathLike[str], inputs: Iterable[str | os.PathLike[str]] = (),
                    what: str = "plot") -> str:
    """Validate a plot path before anything is computed: the checks of
    :func:`colligate._files.check_output_path` plus an extension matplotlib can write
    (``.png``, ``.svg``, ``.pdf`` ...). Returns the path as ``str``."""
    target = check_output_path(path, inputs, what)
    ext = os.path.splitext(target)[1].lower().lstrip(".")
    formats = plot_formats()
    if ext not in formats:
        from ._files import OutputPathError

        shown = f"'.{ext}'" if ext else "no extension"
        raise OutputPathError(
            f"{what} path '{target}': {shown} is not a file type matplotlib can write; "
            f"use one of {', '.join('.' + k for k in sorted(formats))}")
    return target


def _ice_axes(ax, warm_c: float, cold_c: float, title: str, fahrenheit: bool, legend: str) -> None:
    """Axes of an ice-curve plot: warm on the left (the product cools to the right), ice as
    % of the water, degC below and, on request, degF on top."""
    ax.set_xlim(warm_c, cold_c)
    ax.set_ylim(0.0, 100.0)
    ax.set_xlabel("temperature (°C)")
    ax.set_ylabel("ice (% of total water)")
    if fahrenheit:
        _fahrenheit_axis(ax)
    ax.grid(True, color="#d9d9d9", linewidth=0.6)
    ax.set_title(title)
    ax.legend(loc=legend, fontsize=8, framealpha=0.9)


def _fahrenheit_axis(ax) -> None:
    """A degF scale along the top of an axis whose x is degC."""
    top = ax.secondary_xaxis("top", functions=(lambda c: c * 1.8 + 32.0, lambda f: (f - 32.0) / 1.8))
    top.set_xlabel("temperature (°F)")


def _save(fig, target: str, inputs: Iterable[str | os.PathLike[str]], outputs: OutputSet | None = None) -> str:
    """Writes the figure atomically in the format its file extension names (into a command's
    set of outputs when one is given: renamed into place when the set is committed)."""
    fmt = os.path.splitext(target)[1].lower().lstrip(".")
    return atomic_write(target, lambda fh: fig.savefig(fh, format=fmt), inputs, "plot", into=outputs)




def _figure(width: float, height: float):
    """A bare matplotlib Figure on an Agg canvas: no pyplot, no global backend switch, no GUI."""
    from matplotlib.backends.backend_agg import FigureCanvasAgg
    from matplotlib.figure import Figure

    fig = Figure(figsize=(width, height), dpi=110)
    FigureCanvasAgg(fig)
    return fig


#: Longest title or label drawn on a plot, characters; longer ones are cut with "...".
#: Text layout in matplotlib grows with the length of a string, and a recipe name may be
#: anything up to the input size limit.
_MAX_PLOT_TEXT = 120


def _one_line(text: str | None, limit: int = _MAX_PLOT_TEXT) -> str:
    """``text`` on one line, at most ``limit`` characters (cut with "...")."""
    if not text:
        return ""
    head = str(text)[: 4 * limit]  # bounded work whatever the length
    flat = " ".join(head.split())
    if len(flat) > limit or len(text) > 4 * limit:
        flat = flat[: limit - 3].rstrip() + "..."
    return flat


def _footer(fig, model: str, label: str | None) -> None:
    footer = f"colligate, model: {model}; estimates only, verify by measurement"
    if label:
        footer = f"{_one_line(label).upper()}  |  " + footer
    fig.text(0.01, 0.01, footer, fontsize=7, color="#555555")
    fig.tight_layout(rect=(0, 0.03, 1, 1))


def _log_axis_plain(ax, values: np.ndarray) -> None:
    """Logarithmic y axis with plain-number ticks (1, 2, 5, 10, 20, ...)."""
    from matplotlib.ticker import FixedLocator, NullFormatter, ScalarFormatter

    ax.set_yscale("log")
    finite = values[np.isfinite(values) & (values > 0)]
    if finite.size == 0:
        return
    lo, hi = float(finite.min()), float(finite.max())
    ticks = [m * 10.0 ** e for e in range(-1, 5) for m in (1, 2, 3, 5)]
    ax.yaxis.set_major_locator(FixedLocator([t for t in ticks if lo / 1.5 <= t <= hi * 1.5]))
    ax.yaxis.set_major_formatter(ScalarFormatter())
    ax.yaxis.set_minor_formatter(NullFormatter())


def _eutectic_K(ice_path: IcePath) -> float:
    """Eutectic temperature of the solution, K; NaN when it has none (no salts)."""
    t = ice_path.eutectic_temperature
    return float("nan") if t is None else t


def _mark_salt_onsets(ax, ice_path: IcePath, cold_c: float, warm_c: float) -> None:
    """A thin line and a label where each salt of the freezing path starts to crystallise
    (the last one, which ends the curve, is marked as the eutectic)."""
    e = ice_path.eutectic() if ice_path.eutectic_temperature is not None or ice_path.curve.salts else None
    salts = list(e.get("salts", [])) if e else []
    if e and e.get("found") and salts:
        salts = salts[:-1]
    groups: list[tuple[float, list[str]]] = []  # onsets within 0.5 K share one label
    for s in salts:
        t_c = celsius_from_kelvin(float(s["onset_temperature_K"]))
        if not cold_c < t_c < warm_c:
            continue
        if groups and abs(groups[-1][0] - t_c) < 0.5:
            groups[-1][1].append(s["name"])
        else:
            groups.append((t_c, [s["name"]]))
    for t_c, names in groups:
        ax.axvline(t_c, color=_EUTECTIC_COLOUR, linestyle=":", linewidth=0.8, alpha=0.7)
        ax.annotate(f"{' + '.join(names)} from {t_c:.1f} °C", xy=(t_c, 2.0), xycoords=("data", "data"),
                    rotation=90, fontsize=7, color=_EUTECTIC_COLOUR, ha="right", va="bottom")


def _mark_eutectic(ax, eut_c: float, *, vertical: bool) -> None:
    line = ax.axvline if vertical else ax.axhline
    line(eut_c, color=_EUTECTIC_COLOUR, linestyle="-", linewidth=2.2, alpha=0.6,
         label=f"final eutectic {eut_c:.1f} °C: no liquid below, curve ends")


def _recipe_parts(recipe) -> tuple["api.Solution", str, float]:
    """Solution, model id and bound water (kg per kg of water) of a recipe."""
    return recipe.solution(), recipe.model, float(recipe.bound_water_fraction_of_water or 0.0)


def _thermal_grid(recipe, warm_c: float, cold_c: float, points: int) -> tuple[np.ndarray, float, float]:
    """Temperatures (degC, warm to cold) for the thermal plots, with the freezing point as a
    node and stopping just above a eutectic; also returns the freezing point and the
    eutectic in K (NaN when absent)."""
    solution, model, bound = _recipe_parts(recipe)
    ice_path = IcePath(solution, model, bound)
    tf = ice_path.freezing_point
    t_eut = _eutectic_K(ice_path)
    temps_c = np.linspace(warm_c, cold_c, points)
    if np.isfinite(t_eut):
        stop_c = celsius_from_kelvin(t_eut) + _EUTECTIC_MARGIN_K
        if stop_c > cold_c:
            temps_c = np.append(temps_c[temps_c > stop_c], stop_c)
    if np.isfinite(tf):
        tf_c = celsius_from_kelvin(tf)
        if temps_c.min() < tf_c < temps_c.max():
            # both sides of the kink, so the line shows the jump of the apparent specific heat
            temps_c = np.append(temps_c, [tf_c + 1e-6, tf_c - 1e-6])
    temps_c = np.unique(temps_c)[::-1]
    return temps_c, tf, t_eut


# --------------------------------------------------------------------------- enthalpy


def plot_enthalpy(
    recipe,
    path: str | os.PathLike[str],
    marks: Mapping[str, float] | None = None,
    *,
    title: str | None = None,
    label: str | None = None,
    inputs: Iterable[str | os.PathLike[str]] = (),
    outputs: OutputSet | None = None,
    points: int = 401,
) -> str:
    """Write a two-panel PNG: enthalpy H(T) (kJ/kg) and apparent specific heat (kJ/(kg K)).

    Parameters
    ----------
    recipe : colligate.Recipe
        The product (its composition enters the thermal model: water, fat, protein,
        carbohydrate, fibre, ash, and the ice curve of its aqueous phase).
    path : path-like
        Output PNG file. Written atomically; refused if it names one of ``inputs``.
    marks : mapping of str to float, optional
        Named temperatures in K, drawn as vertical lines (default: the recipe's).
    title, label : str, optional
        Plot title, and a label (e.g. "invented demo scenario") printed in the footer.
    inputs : iterable of path-like
        Input files that must never be overwritten.
    outputs : colligate._files.OutputSet, optional
        Write the file into this set of a command's outputs (renamed into place when the
        set is committed) instead of at once.
    points : int
        Number of temperatures on the curves (>= 10).

    Returns
    -------
    str
        The path written.

    Notes
    -----
    H = 0 at -40 degC (the reference of :func:`colligate.enthalpy`). The apparent
    specific heat is dH/dT: sensible heat plus the latent heat of the ice forming per
    kelvin; it jumps at the initial freezing point, and the axis is logarithmic so both
    the frozen and the unfrozen ranges read.
    """
    target = check_plot_path(path, inputs, "plot")
    if points < 10:
        raise ValueError(f"points = {points}: must be >= 10")
    marks = dict(recipe.temperatures if marks is None else marks)
    model = recipe.model
    warm_c, cold_c = THERMAL_RANGE_C
    temps_c, tf, t_eut = _thermal_grid(recipe, warm_c, cold_c, points)
    temps_k = temps_c + ZERO_CELSIUS_K
    h = np.asarray(recipe.enthalpy(temps_k), dtype=float) / 1e3
    cp = np.asarray(recipe.apparent_specific_heat(temps_k), dtype=float) / 1e3

    fig = _figure(8.0, 7.0)
    ax_h = fig.add_subplot(2, 1, 1)
    ax_c = fig.add_subplot(2, 1, 2, sharex=ax_h)
    ax_h.plot(temps_c, h, color=_CURVE_COLOUR, linewidth=2.0, label="enthalpy H")
    ax_c.plot(temps_c, cp, color=_CP_COLOUR, linewidth=2.0, label="apparent specific heat dH/dT")
    _log_axis_plain(ax_c, cp)

    if np.isfinite(tf):
        tf_c = celsius_from_kelvin(tf)
        for ax in (ax_h, ax_c):
            ax.axvline(tf_c, color=_FREEZE_COLOUR, linestyle="-", linewidth=1.0, alpha=0.8)
        h_tf = float(recipe.enthalpy(tf)) / 1e3
        ax_h.plot([tf_c], [h_tf], marker="o", color=_FREEZE_COLOUR, zorder=5,
                  label=f"initial freezing point {tf_c:.2f} °C")
    if np.isfinite(t_eut) and celsius_from_kelvin(t_eut) > cold_c:
        for ax in (ax_h, ax_c):
            _mark_eutectic(ax, celsius_from_kelvin(t_eut), vertical=True)
    for i, (name, t_k) in enumerate(marks.items()):
        t_c = celsius_from_kelvin(float(t_k))
        if not cold_c <= t_c <= warm_c:
            continue
        colour = _MARK_COLOURS[i % len(_MARK_COLOURS)]
        style = _MARK_STYLES[i % len(_MARK_STYLES)]
        below = np.isfinite(t_eut) and t_k < t_eut
        text = f"{name} {t_c:.1f} °C" + (": below the eutectic" if below
                                         else f": H = {float(recipe.enthalpy(float(t_k))) / 1e3:.0f} kJ/kg")
        ax_h.axvline(t_c, color=colour, linestyle=style, linewidth=1.2, label=text)
        ax_c.axvline(t_c, color=colour, linestyle=style, linewidth=1.2)

    ax_h.set_xlim(warm_c, cold_c)  # warm on the left, as the product cools to the right
    ax_h.set_ylabel("enthalpy (kJ/kg), H = 0 at -40 °C")
    ax_c.set_ylabel("apparent specific heat (kJ/(kg·K))")
    ax_c.set_xlabel("temperature (°C)")
    for ax in (ax_h, ax_c):
        ax.grid(True, color="#d9d9d9", linewidth=0.6, which="major")
    ax_h.set_title(_one_line(title) or "Enthalpy and apparent specific heat")
    ax_h.legend(loc="upper right", fontsize=8, framealpha=0.9)
    ax_c.legend(loc="upper left", fontsize=8, framealpha=0.9)
    _footer(fig, model, label)
    return _save(fig, target, inputs, outputs)


# --------------------------------------------------------------------------- cooling curve


def plot_cooling_curve(
    recipe,
    path: str | os.PathLike[str],
    marks: Mapping[str, float] | None = None,
    *,
    from_T: float | None = None,
    to_T: float | None = None,
    title: str | None = None,
    label: str | None = None,
    inputs: Iterable[str | os.PathLike[str]] = (),
    outputs: OutputSet | None = None,
    points: int = 401,
) -> str:
    """Write a PNG of temperature (degC) against the heat removed per kg (kJ/kg).

    The curve runs from the fill temperature ``from_T`` (K; default
    :data:`FILL_TEMPERATURE_C`) down to ``to_T`` (K; default the recipe's storage
    temperature), and stops early at a salt eutectic or at -40 degC. The initial freezing
    point and the named temperatures (``marks``, K; default the recipe's) are marked
    with the heat removed to reach them.

    Parameters are as for :func:`plot_enthalpy`. Returns the path written.
    """
    target = check_plot_path(path, inputs, "plot")
    if points < 10:
        raise ValueError(f"points = {points}: must be >= 10")
    marks = dict(recipe.temperatures if marks is None else marks)
    model = recipe.model
    t_from = float(FILL_TEMPERATURE_C + ZERO_CELSIUS_K if from_T is None else from_T)
    t_to = float(marks.get("storage", min(marks.values(), default=ZERO_CELSIUS_K - 18.0)) if to_T is None else to_T)
    if not t_to < t_from:
        raise ValueError(f"to_T = {t_to} K: must be below from_T = {t_from} K (a cooling curve)")
    cold_limit_c = THERMAL_RANGE_C[1]
    from_c, to_c = celsius_from_kelvin(t_from), max(celsius_from_kelvin(t_to), cold_limit_c)
    temps_c, tf, t_eut = _thermal_grid(recipe, from_c, to_c, points)
    stopped = ""
    if np.isfinite(t_eut) and t_eut > t_to:
        stopped = "eutectic"
    elif celsius_from_kelvin(t_to) < cold_limit_c:
        stopped = "model"
    temps_k = temps_c + ZERO_CELSIUS_K
    h_from = float(recipe.enthalpy(t_from))
    q = (h_from - np.asarray(recipe.enthalpy(temps_k), dtype=float)) / 1e3

    fig = _figure(8.0, 5.0)
    ax = fig.add_subplot(1, 1, 1)
    ax.plot(q, temps_c, color=_CURVE_COLOUR, linewidth=2.0, label="product temperature")
    ax.plot([0.0], [from_c], marker="D", color=_CURVE_COLOUR, zorder=5, label=f"fill {from_c:.1f} °C")

    if np.isfinite(tf) and to_c < celsius_from_kelvin(tf) < from_c:
        tf_c = celsius_from_kelvin(tf)
        q_tf = (h_from - float(recipe.enthalpy(tf))) / 1e3
        ax.axhline(tf_c, color=_FREEZE_COLOUR, linestyle="-", linewidth=1.0, alpha=0.8)
        ax.plot([q_tf], [tf_c], marker="o", color=_FREEZE_COLOUR, zorder=5,
                label=f"initial freezing point {tf_c:.2f} °C after {q_tf:.0f} kJ/kg")
    if stopped == "eutectic":
        _mark_eutectic(ax, celsius_from_kelvin(t_eut), vertical=False)
    for i, (name, t_k) in enumerate(marks.items()):
        t_c = celsius_from_kelvin(float(t_k))
        if not to_c - 1e-9 <= t_c <= from_c or (np.isfinite(t_eut) and t_k < t_eut):
            continue
        colour = _MARK_COLOURS[i % len(_MARK_COLOURS)]
        q_t = (h_from - float(recipe.enthalpy(float(t_k)))) / 1e3
        ax.axhline(t_c, color=colour, linestyle=_MARK_STYLES[i % len(_MARK_STYLES)], linewidth=1.2)
        ax.plot([q_t], [t_c], marker="s", color=colour, zorder=5,
                label=f"{name} {t_c:.1f} °C after {q_t:.0f} kJ/kg")

    note = {"eutectic": "curve stops at the eutectic: below it salt and ice crystallise together",
            "model": "curve stops at -40 °C, the cold end of the thermal model"}.get(stopped)
    if note:
        ax.text(0.01, 0.02, note, transform=ax.transAxes, fontsize=8, color="#555555")
    ax.set_xlim(0.0, max(float(np.nanmax(q)), 1.0) * 1.04)
    ax.set_xlabel("heat removed from the fill temperature (kJ per kg of product)")
    ax.set_ylabel("temperature (°C)")
    ax.grid(True, color="#d9d9d9", linewidth=0.6)
    ax.set_title(_one_line(title) or "Cooling curve")
    ax.legend(loc="upper right", fontsize=8, framealpha=0.9)
    _footer(fig, model, label)
    return _save(fig, target, inputs, outputs)


# --------------------------------------------------------------------------- contributions


def plot_contributions(
    recipe,
    path: str | os.PathLike[str],
    temperature: float | str = "serving",
    *,
    title: str | None = None,
    label: str | None = None,
    inputs: Iterable[str | os.PathLike[str]] = (),
    outputs: OutputSet | None = None,
) -> str:
    """Write a PNG with three horizontal bar panels: each ingredient's share (%) of the
    freezing-point depression, of the sweetness and of the water kept liquid at
    ``temperature`` (K or a named temperature). Returns the path written."""
    from .contributions import contribution_table, contribution_temperature

    target = check_plot_path(path, inputs)
    t = contribution_temperature(recipe, temperature)
    df, totals = contribution_table(recipe, t)
    df = df[(df["depression_percent"] > 0) | (df["sweetness_percent"] > 0) | (df["liquid_water_held_percent"] > 0)]
    names = list(df.index)[::-1]
    fig = _figure(11.0, 1.6 + 0.35 * max(len(names), 3))
    panels = (
        ("depression_percent", f"freezing-point depression\n(total {totals['depression_K']:.2f} K)", "#174a7c"),
        ("sweetness_percent", "sweetness as sucrose\n(total {:.3g} kg)".format(totals["sweetness_sucrose_equivalent_kg"]),
         "#c4622d"),
        ("liquid_water_held_percent",
         f"water kept liquid at {celsius_from_kelvin(t):.1f} °C\n(total {totals['liquid_water_held_kg']:.3g} kg)",
         "#1b7f79"),
    )
    y = np.arange(len(names))
    for i, (column, heading, colour) in enumerate(panels):
        ax = fig.add_subplot(1, 3, i + 1)
        values = df[column].to_numpy()[::-1]
        ax.barh(y, values, color=colour)
        for yy, v in zip(y, values):
            if v > 0:
                ax.text(v, yy, f" {v:.0f} %", va="center", fontsize=7)
        ax.set_yticks(y)
        ax.set_yticklabels(names if i == 0 else [""] * len(names), fontsize=8)
        ax.set_xlim(0, 115)
        ax.set_xlabel("share (%)")
        ax.set_title(heading, fontsize=9)
        ax.grid(True, axis="x", color="#d9d9d9", linewidth=0.6)
    fig.suptitle(_one_line(title) or _one_line(f"What each ingredient does: {recipe.name}"), fontsize=11)
    _footer(fig, recipe.model, label if label is not None else (recipe.label or None))
    return _save(fig, target, inputs, outputs)
