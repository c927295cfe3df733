"""Plots of the ice curve of a solution (PNG, matplotlib with the Agg backend).

matplotlib is imported inside the function, so ``import colligate`` never
needs it. Files are written atomically and never over an input file.
"""

from __future__ import annotations

import os
from typing import Iterable, Mapping

import numpy as np

import colligate as cg

from ._files import atomic_write, check_output_path
from .units import ZERO_CELSIUS_K, celsius_from_kelvin

__all__ = ["plot_ice_curve", "CURVE_RANGE_C"]

#: Temperature span of the curve, degC (warm end, cold end).
CURVE_RANGE_C: tuple[float, float] = (2.0, -40.0)

_MARK_STYLES = ("--", "-.", ":", (0, (5, 2, 1, 2)))
_MARK_COLOURS = ("#1b7f79", "#c4622d", "#5b4a9e", "#7a7a2e", "#9e3b63")
_CURVE_COLOUR = "#174a7c"
_FREEZE_COLOUR = "#b8202a"


def plot_ice_curve(
    solution: "cg.Solution",
    path: str | os.PathLike[str],
    marks: Mapping[str, float] | None = None,
    model: str = "auto",
    *,
    bound_water: float = 0.0,
    title: str | None = None,
    label: str | None = None,
    inputs: Iterable[str | os.PathLike[str]] = (),
    points: int = 421,
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
    bound_water : float
        Water that cannot freeze, kg.
    title, label : str, optional
        Plot title, and a label (e.g. "invented demo scenario") printed in the corner.
    inputs : iterable of path-like
        Input files that must never be overwritten.
    points : int
        Number of temperatures on the curve (>= 10).

    Returns
    -------
    str
        The path written.
    """
    target = check_output_path(path, inputs, "plot")
    if points < 10:
        raise ValueError(f"points = {points}: must be >= 10")

    tf = float(cg.freezing_point(solution, model=model))
    warm_c, cold_c = CURVE_RANGE_C
    temps_c = np.linspace(warm_c, cold_c, points)
    freezes = bool(np.isfinite(tf))  # NaN: no freezing point in the library's search range
    tf_c = celsius_from_kelvin(tf) if freezes else float("nan")
    if freezes and cold_c < tf_c < warm_c:
        temps_c = np.unique(np.append(temps_c, tf_c))[::-1]
    temps_k = temps_c + ZERO_CELSIUS_K
    frac = np.asarray(cg.ice_fraction(solution, temps_k, model=model, bound_water=bound_water), dtype=float)
    if freezes:
        frac = np.where(temps_k >= tf, 0.0, frac)

    # Agg canvas on a bare Figure: no pyplot, no global backend switch, no GUI.
    from matplotlib.backends.backend_agg import FigureCanvasAgg
    from matplotlib.figure import Figure

    fig = Figure(figsize=(8.0, 5.0), dpi=110)
    FigureCanvasAgg(fig)
    ax = fig.add_subplot(1, 1, 1)
    ax.plot(temps_c, 100.0 * frac, color=_CURVE_COLOUR, linewidth=2.0, label="ice, % of the water")

    if freezes:
        ax.axvline(tf_c, color=_FREEZE_COLOUR, linestyle="-", linewidth=1.0, alpha=0.8)
        ax.plot([tf_c], [0.0], marker="o", color=_FREEZE_COLOUR, zorder=5,
                label=f"initial freezing point {tf_c:.2f} °C")

    for i, (name, t_k) in enumerate((marks or {}).items()):
        t_c = celsius_from_kelvin(float(t_k))
        frozen = t_k < tf if freezes else True
        f = float(cg.ice_fraction(solution, float(t_k), model=model, bound_water=bound_water)) if frozen else 0.0
        colour = _MARK_COLOURS[i % len(_MARK_COLOURS)]
        ax.axvline(t_c, color=colour, linestyle=_MARK_STYLES[i % len(_MARK_STYLES)], linewidth=1.3,
                   label=f"{name} {t_c:.1f} °C: {100.0 * f:.0f} % ice")
        ax.plot([t_c], [100.0 * f], marker="s", color=colour, zorder=5)

    ax.set_xlim(warm_c, cold_c)  # warm on the left, as the product cools to the right
    ax.set_ylim(0.0, 100.0)
    ax.set_xlabel("temperature (°C)")
    ax.set_ylabel("ice (% of total water)")
    ax.grid(True, color="#d9d9d9", linewidth=0.6)
    ax.set_title(title or "Ice curve")
    ax.legend(loc="lower right", fontsize=8, framealpha=0.9)
    footer = f"colligate, model: {model}; estimates only, verify by measurement"
    if label:
        footer = f"{label.upper()}  |  " + footer
    fig.text(0.01, 0.01, footer, fontsize=7, color="#555555")
    fig.tight_layout(rect=(0, 0.03, 1, 1))

    return atomic_write(target, lambda fh: fig.savefig(fh, format="png"), inputs, "plot")
