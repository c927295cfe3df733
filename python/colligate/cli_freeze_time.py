"""The ``colligate freeze-time`` subcommand: three freezing-time estimates side by side.

::

    colligate freeze-time RECIPE.toml --shape slab --size 0.05 --initial 5 --medium -30
                          --h 20 --target -18 [--plot PNG] [--save FILE] [--json]
                          [--uncertainty [--u-h W_M2K] [--u-size M] [--u-medium K]
                           [--uncertainty-method linear|monte_carlo] [--draws N] [--seed N]]

Temperatures on the command line are in degC (converted to K here, at the edge); size is
the full thickness or diameter in m; h in W/(m^2 K). Prints Plank's time (phase change
only), Pham's (1986) time and the enthalpy-method simulation's time for the thermal centre
to reach the target, and writes a plot of the temperature histories and the heat flow.
The plot and the saved text are written together or not at all (``_files.OutputSet``).

With ``--uncertainty`` each estimate is printed as value ± standard uncertainty with its 95 %
interval: Plank and Pham from the recipe's fitted constants and the stated u(h), u(size),
u(T_medium) (linear propagation by default, or Monte Carlo), the simulation by Monte Carlo
(``--draws`` runs, seeded).
"""
from __future__ import annotations

import argparse
import json
import math
import os

__all__ = ["add_parser", "run"]

_C0 = 273.15


def add_parser(sub) -> None:
    p = sub.add_parser("freeze-time", help="freezing or thawing time of a recipe: Plank, Pham and a simulation")
    p.add_argument("recipe", metavar="RECIPE.toml", help="recipe file, or 'demo' for the invented demo ice cream")
    p.add_argument("--shape", choices=["slab", "cylinder", "sphere"], default="slab", help="body shape")
    p.add_argument("--size", type=float, required=True, metavar="M",
                   help="full thickness (slab) or diameter (cylinder, sphere), m")
    p.add_argument("--initial", type=float, required=True, metavar="DEGC", help="initial product temperature, degC")
    p.add_argument("--medium", type=float, required=True, metavar="DEGC", help="medium (air, brine) temperature, degC")
    p.add_argument("--h", type=float, required=True, metavar="W_M2K", help="surface heat-transfer coefficient, W/(m^2 K)")
    p.add_argument("--target", type=float, required=True, metavar="DEGC", help="target centre temperature, degC")
    p.add_argument("--plot", metavar="PNG", help="write the temperature histories and heat flow to this PNG")
    p.add_argument("--json", action="store_true", help="print machine-readable results (units in the keys)")
    p.add_argument("--save", metavar="FILE", help="also write the printed text (or JSON) to this file")
    u = p.add_argument_group("uncertainty (GUM: standard uncertainties, 95 % intervals)")
    u.add_argument("--uncertainty", action="store_true",
                   help="print each time as value ± standard uncertainty with its 95 %% interval")
    u.add_argument("--u-h", type=float, default=0.0, metavar="W_M2K",
                   help="standard uncertainty of h, W/(m^2 K) (default 0: exact)")
    u.add_argument("--u-size", type=float, default=0.0, metavar="M", help="standard uncertainty of the size, m")
    u.add_argument("--u-medium", type=float, default=0.0, metavar="K",
                   help="standard uncertainty of the medium temperature, K (= degC difference)")
    u.add_argument("--uncertainty-method", choices=["linear", "monte_carlo"], default="linear",
                   help="Plank and Pham: linear propagation (default) or Monte Carlo; prefer Monte Carlo "
                        "when u(h)/h exceeds a few per cent (the interval leans to long times)")
    u.add_argument("--draws", type=int, default=None, metavar="N",
                   help="Monte Carlo draws (default 10000 for Plank and Pham, 100 simulations)")
    u.add_argument("--seed", type=int, default=0, metavar="N", help="seed of the Monte Carlo generator (default 0)")


def _uncertainty_entry(r) -> dict:
    lo, hi = r.ci(0.95)
    d = {"value_s": r.value, "standard_uncertainty_s": r.std, "interval_95_s": [lo, hi],
         "degrees_of_freedom": int(r.degrees_of_freedom), "method": r.method}
    if r.samples is not None:
        d["draws_used"] = int(len(r.samples))
    return d


def _estimates(recipe, args) -> tuple[dict, object]:
    from . import freezing_time as ft

    Ti, Tm, Tt = args.initial + _C0, args.medium + _C0, args.target + _C0
    freezing = Tm < Ti
    out: dict = {"shape": args.shape, "size_m": args.size, "initial_K": Ti, "medium_K": Tm, "target_K": Tt,
                 "h_W_m2K": args.h, "mode": "freezing" if freezing else "thawing"}
    stated = {"u_h": args.u_h, "u_size": args.u_size, "u_T_medium": args.u_medium}
    if not args.uncertainty and any(stated.values()):
        raise ft._core.InvalidInputError("freeze-time: --u-h, --u-size and --u-medium need --uncertainty")
    sim_unc = {}
    if args.uncertainty:
        sim_unc = dict(with_uncertainty=True, draws=args.draws or 100, seed=args.seed, **stated)
    sim = ft.simulate_freezing(recipe, shape=args.shape, size=args.size, T_initial=Ti, T_medium=Tm, h=args.h,
                               T_target=Tt, **sim_unc)
    out["simulation_s"] = sim.time_to_target
    out["simulation_status"] = sim.status
    if args.uncertainty:
        out["stated_uncertainties"] = {"h_W_m2K": args.u_h, "size_m": args.u_size, "medium_K": args.u_medium}
        out["uncertainty"] = {"simulation": _uncertainty_entry(sim.time_uncertainty)}
    if freezing:
        inp = ft.freezing_inputs(recipe, T_initial=Ti, T_target=Tt)
        out["inputs"] = {"T_freeze_K": inp["T_freeze"], "latent_heat_J_kg": inp["latent_heat"],
                         "density_unfrozen_kg_m3": inp["density_unfrozen"],
                         "density_frozen_kg_m3": inp["density_frozen"],
                         "c_unfrozen_J_kgK": inp["c_unfrozen"], "c_frozen_J_kgK": inp["c_frozen"],
                         "k_frozen_W_mK": inp["k_frozen"]}
        out["plank_s"] = ft.plank_time(args.shape, args.size, inp["density_frozen"], inp["latent_heat"],
                                       inp["T_freeze"], Tm, args.h, inp["k_frozen"])
        out["pham_s"] = ft.pham_time(args.shape, args.size, Ti, Tm, Tt, density_unfrozen=inp["density_unfrozen"],
                                     density_frozen=inp["density_frozen"], c_unfrozen=inp["c_unfrozen"],
                                     c_frozen=inp["c_frozen"], latent_heat=inp["latent_heat"],
                                     k_frozen=inp["k_frozen"], h=args.h)
        if args.uncertainty:
            for method in ("plank", "pham"):
                r = ft.food_freezing_time(recipe, method=method, shape=args.shape, size=args.size, T_initial=Ti,
                                          T_medium=Tm, h=args.h, T_target=Tt,
                                          with_uncertainty=args.uncertainty_method, draws=args.draws or 10_000,
                                          seed=args.seed, **stated)
                out["uncertainty"][method] = _uncertainty_entry(r)
            out["uncertainty"]["not_stated"] = list(r.not_stated)
    else:
        out["plank_s"] = out["pham_s"] = math.nan  # the formulas here are for freezing
    out["caution"] = ft.FREEZING_TIME_CAUTION
    return out, sim


def _pm(entry) -> str:
    """'  ± 0.12 h  [1.23, 1.67] h' for an uncertainty entry."""
    if not entry or math.isnan(entry["value_s"]):
        return ""
    lo, hi = entry["interval_95_s"]
    return f"  ± {entry['standard_uncertainty_s'] / 3600.0:.2f} h  [{lo / 3600.0:.2f}, {hi / 3600.0:.2f}] h"


def _hours(seconds: float) -> str:
    return "n/a" if math.isnan(seconds) else f"{seconds / 3600.0:8.2f} h  ({seconds:9.0f} s)"


def run(args: argparse.Namespace, recipe, inputs: list[str]) -> str:
    """Computes, writes the plot if asked, and returns the text (or JSON) to print."""
    from ._warnings import CAUTIONS

    from ._files import OutputSet

    # All outputs or none (as ``colligate report``): every path is checked before computing,
    # files are staged and renamed into place together only once everything succeeded.
    with OutputSet(inputs) as out:
        if args.plot:
            from .plot import check_plot_path

            check_plot_path(args.plot, inputs, "--plot")
            out.plan(args.plot, "--plot")
        if args.save:
            out.plan(args.save, "--save")
        result, sim = _estimates(recipe, args)
        if args.plot:
            result["plot"] = os.path.abspath(sim.plot(args.plot, inputs=inputs, outputs=out))
        text = _format(result, recipe, args, CAUTIONS)
        if args.save:
            out.write_text(args.save, text)
        out.commit()
    return text


def _clean(v):
    """NaN -> None, through nested dicts and lists (JSON has no NaN)."""
    if isinstance(v, dict):
        return {k: _clean(x) for k, x in v.items()}
    if isinstance(v, (list, tuple)):
        return [_clean(x) for x in v]
    if isinstance(v, float) and math.isnan(v):
        return None
    return v


def _format(result: dict, recipe, args: argparse.Namespace, cautions) -> str:
    if args.json:
        clean = _clean(result)
        clean["cautions"] = list(cautions)
        return json.dumps(clean, indent=2) + "\n"
    unc = result.get("uncertainty", {})
    lines = [
        f"{result['mode'].capitalize()} time of '{getattr(recipe, 'name', 'recipe')}': {args.shape}, "
        f"size {args.size:g} m, {args.initial:g} C in {args.medium:g} C, h = {args.h:g} W/(m2 K), "
        f"target centre {args.target:g} C",
        "",
        f"  Plank (phase change only)   {_hours(result['plank_s'])}{_pm(unc.get('plank'))}",
        f"  Pham (1986)                 {_hours(result['pham_s'])}{_pm(unc.get('pham'))}",
        f"  enthalpy-method simulation  {_hours(result['simulation_s'])}{_pm(unc.get('simulation'))}"
        f"   [{result['simulation_status']}]",
    ]
    if unc:
        st = result["stated_uncertainties"]
        lines += ["", f"  ± standard uncertainty; [95 % interval], h. Stated: u(h) = {st['h_W_m2K']:g} W/(m2 K), "
                  f"u(size) = {st['size_m']:g} m, u(T_medium) = {st['medium_K']:g} K; uncorrelated.",
                  "  Plank and Pham: " + ("linear propagation (closed-form derivatives)"
                                          if args.uncertainty_method == "linear" else "Monte Carlo")
                  + f"; simulation: Monte Carlo, {unc['simulation'].get('draws_used', 0)} runs used."]
        if unc.get("not_stated"):
            lines += ["  Constants with no stated uncertainty (taken as exact): " + ", ".join(unc["not_stated"])]
    if "inputs" in result:
        i = result["inputs"]
        lines += ["", f"  inputs: T_freeze {i['T_freeze_K'] - _C0:.2f} C, latent heat {i['latent_heat_J_kg'] / 1e3:.1f} kJ/kg, "
                  f"density {i['density_unfrozen_kg_m3']:.0f}/{i['density_frozen_kg_m3']:.0f} kg/m3, "
                  f"c {i['c_unfrozen_J_kgK']:.0f}/{i['c_frozen_J_kgK']:.0f} J/(kg K), "
                  f"k_frozen {i['k_frozen_W_mK']:.2f} W/(m K)"]
    if result.get("plot"):
        lines += ["", f"  plot: {result['plot']}"]
    lines += ["", "Caution: " + result["caution"]] + ["Caution: " + c for c in cautions]
    return "\n".join(lines) + "\n"
