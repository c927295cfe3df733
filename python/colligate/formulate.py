"""Formulating on ingredient amounts: the kilograms of chosen ingredients that meet targets
(initial freezing point, ice at a temperature, dissolved solids, sweetness) at least cost,
each ingredient within its own bounds, the rest of a recipe held fixed.

:func:`solve_recipe` builds each candidate as a copy of the recipe
(:meth:`Recipe.with_changes`) and evaluates it through the recipe's own path (its model and
its bound water, the compiled core), so a solved recipe rechecks exactly; ``scipy.optimize``
moves the amounts (least squares on the misfit within the bounds, then, with costs, the
cheapest amounts that keep the targets). Targets are checked for their units before anything is computed (a freezing point
of -3 where K is expected is refused), and a target that cannot be met is reported with the
bounds that block it.

Temperatures are K, amounts kg, shares and fractions dimensionless (0-1).
"""

from __future__ import annotations

import math
import warnings
from dataclasses import dataclass, field
from typing import Mapping, Optional, Sequence

import numpy as np

from . import api
from .contributions import sucrose_equivalent_kg
from .recipe import Recipe, RecipeError

__all__ = ["RecipeSolution", "TARGETS", "solve_recipe"]

#: Targets :func:`solve_recipe` knows, with their unit.
TARGETS: dict[str, str] = {
    "freezing_point": "K",
    "ice_fraction": "(temperature K, ice mass over all the water 0-1)",
    "dissolved_solids": "mass fraction of the batch, 0-1",
    "sweetness": "sucrose-equivalent mass fraction of the batch, 0-1",
}

# Below this a "temperature" is taken for degC or degF typed where K is expected.
_LOWEST_PLAUSIBLE_K = 150.0


@dataclass
class RecipeSolution:
    """Outcome of :func:`solve_recipe`."""

    recipe: Recipe
    amounts: dict[str, float]
    achieved: dict[str, float]
    targets: dict[str, float]
    success: bool
    message: str
    blocking: list[str] = field(default_factory=list)
    iterations: int = 0

    def summary(self):
        """Targets against what was achieved, as a pandas DataFrame."""
        import pandas as pd

        rows = [{"quantity": k, "target": self.targets[k], "achieved": v} for k, v in self.achieved.items()]
        return pd.DataFrame(rows).set_index("quantity")


def _check_kelvin(name: str, value: float) -> float:
    t = float(value)
    if not math.isfinite(t):
        raise api.InvalidInputError(f"solve_recipe: {name} = {value!r}: must be a finite temperature in K")
    if t < _LOWEST_PLAUSIBLE_K:
        raise api.InvalidInputError(
            f"solve_recipe: {name} = {value!r}: looks like degC or degF, not K; give kelvin "
            f"(e.g. {t + 273.15:g} K for {t:g} degC)")
    if t > 273.16:
        raise api.InvalidInputError(f"solve_recipe: {name} = {t:g} K: above the ice point (273.15 K); "
                                    "no ice forms there")
    return t


def _check_share(name: str, value: float) -> float:
    x = float(value)
    if not (math.isfinite(x) and 0.0 <= x < 1.0):
        raise api.InvalidInputError(f"solve_recipe: {name} = {value!r}: must be a share in [0, 1) "
                                    "(0.7, not 70)")
    return x


def _parse_targets(targets: Mapping[str, object]) -> dict[str, tuple]:
    out: dict[str, tuple] = {}
    problems = [f"unknown target {k!r}" for k in targets if k not in TARGETS]
    if problems:
        raise api.InvalidInputError("solve_recipe: " + "; ".join(problems) + f"; valid targets: {', '.join(TARGETS)}")
    if not targets:
        raise api.InvalidInputError(f"solve_recipe: no targets; valid targets: {', '.join(TARGETS)}")
    for key, value in targets.items():
        if key == "freezing_point":
            out[key] = (_check_kelvin("targets['freezing_point']", value),)
        elif key == "ice_fraction":
            if not (isinstance(value, (tuple, list)) and len(value) == 2):
                raise api.InvalidInputError("solve_recipe: targets['ice_fraction'] must be (temperature K, share 0-1)")
            out[key] = (_check_kelvin("targets['ice_fraction'] temperature", value[0]),
                        _check_share("targets['ice_fraction'] share", value[1]))
        else:
            out[key] = (_check_share(f"targets[{key!r}]", value),)
    return out


def solve_recipe(
    recipe: Recipe,
    variables: Mapping[str, Sequence[float]],
    targets: Mapping[str, object],
    cost: Optional[Mapping[str, float]] = None,
    *,
    tolerance: float = 1e-3,
    name: str | None = None,
) -> RecipeSolution:
    """The amounts (kg) of ``variables`` that meet ``targets`` at the lowest ``cost``.

    Parameters
    ----------
    recipe : Recipe
        An ingredient-based recipe; the ingredients not in ``variables`` keep their amounts.
    variables : mapping of str to (low, high)
        Ingredient (library key or name; it may be new to the recipe) -> bounds in kg.
    targets : mapping
        ``freezing_point`` (K), ``ice_fraction`` ((T in K, share 0-1)), ``dissolved_solids``
        and ``sweetness`` (sucrose-equivalent mass fraction of the batch, relative
        sweetness from the core's table). Units are checked first: a temperature below
        150 K is refused as degC or degF typed for K.
    cost : mapping of str to float, optional
        Price per kg of each variable ingredient (0 if omitted).
    tolerance : float
        Largest accepted misfit in scaled units: K for the freezing point, percentage
        points (0.01) for shares (default 1e-3).

    Returns
    -------
    RecipeSolution
        The new recipe, the amounts, what was achieved, ``success`` and a ``message``; when a
        target is not met, ``blocking`` names the bounds the solution sits on.
    """
    from scipy.optimize import minimize

    from .ingredients import ingredient as _lookup

    if recipe.ingredients is None:
        raise RecipeError(f"recipe '{recipe.source}': solve_recipe needs an ingredient-based recipe "
                          "(use colligate.design.solve_formulation for solute mass fractions)")
    parsed = _parse_targets(targets)
    problems: list[str] = []
    keys: list[str] = []
    lo, hi = [], []
    for given, bounds in variables.items():
        try:
            ing = recipe.ingredient_records.get(given) or _lookup(given)
        except ValueError as exc:
            problems.append(str(exc))
            continue
        try:
            a, b = (float(bounds[0]), float(bounds[1]))
        except (TypeError, ValueError, IndexError):
            problems.append(f"variables[{given!r}] = {bounds!r}: must be (low kg, high kg)")
            continue
        if not (math.isfinite(a) and math.isfinite(b) and 0.0 <= a <= b):
            problems.append(f"variables[{given!r}] = ({a:g}, {b:g}): need 0 <= low <= high (kg)")
            continue
        keys.append(ing.key or ing.name)
        lo.append(a)
        hi.append(b)
    if not variables:
        problems.append("no variables: name the ingredients to vary with their bounds in kg")
    if problems:
        raise api.InvalidInputError("solve_recipe: " + "; ".join(problems))
    lo_a, hi_a = np.array(lo), np.array(hi)

    def candidate(x: np.ndarray) -> Recipe:
        return recipe.with_changes({k: float(v) for k, v in zip(keys, x)}, name=recipe.name)

    def quantities(X: np.ndarray) -> dict[str, np.ndarray]:
        """Every target quantity of each row of X, through the recipe's own scalar path
        (its model and its bound water), so a solved recipe rechecks exactly."""
        X = np.atleast_2d(X)
        out = {k: np.empty(X.shape[0]) for k in parsed}
        with warnings.catch_warnings():
            warnings.simplefilter("ignore")
            for i, x in enumerate(X):
                r = candidate(x)
                if "freezing_point" in parsed:
                    out["freezing_point"][i] = r.freezing_point()
                if "ice_fraction" in parsed:
                    out["ice_fraction"][i] = float(r.ice_fraction(parsed["ice_fraction"][0]))
                solutes = r.solution().solutes
                if "dissolved_solids" in parsed:
                    out["dissolved_solids"][i] = float(sum(solutes.values())) / r.total_mass
                if "sweetness" in parsed:
                    out["sweetness"][i] = sucrose_equivalent_kg(solutes) / r.total_mass
        return out

    goal = {k: v[-1] for k, v in parsed.items()}
    scale = {"freezing_point": 1.0, "ice_fraction": 0.01, "dissolved_solids": 0.01, "sweetness": 0.01}
    order = list(parsed)
    h = 1e-6

    def residuals_and_jacobian(x: np.ndarray):
        X = np.vstack([x] + [x + h * np.eye(len(x))[j] for j in range(len(x))])
        q = quantities(X)
        r = np.array([(q[k][0] - goal[k]) / scale[k] for k in order])
        J = np.array([[(q[k][j + 1] - q[k][0]) / (h * scale[k]) for j in range(len(x))] for k in order])
        return r, J

    price = np.array([float((cost or {}).get(k, 0.0)) for k in keys])
    # least squares on the misfit first (always feasible), then the cheapest exact fit
    fit = minimize(lambda x: 0.5 * float(np.sum(residuals_and_jacobian(x)[0] ** 2)), 0.5 * (lo_a + hi_a),
                   jac=lambda x: residuals_and_jacobian(x)[1].T @ residuals_and_jacobian(x)[0],
                   method="L-BFGS-B", bounds=list(zip(lo_a, hi_a)),
                   options={"ftol": 1e-16, "gtol": 1e-12, "maxiter": 500})
    x = fit.x
    iterations = int(fit.nit)
    if np.any(price):
        res = minimize(lambda v: float(price @ v), x, jac=lambda v: price, method="SLSQP",
                       bounds=list(zip(lo_a, hi_a)),
                       constraints=[{"type": "eq", "fun": lambda v: residuals_and_jacobian(v)[0],
                                     "jac": lambda v: residuals_and_jacobian(v)[1]}],
                       options={"maxiter": 200, "ftol": 1e-10})
        if res.success:
            x = res.x
            iterations += int(res.nit)
    q = quantities(x)
    achieved = {k: float(q[k][0]) for k in order}
    misfit = {k: abs(achieved[k] - goal[k]) / scale[k] for k in order}
    ok = max(misfit.values()) <= tolerance
    blocking = []
    if not ok:
        for k, v, a, b in zip(keys, x, lo_a, hi_a):
            if abs(v - a) <= 1e-9 * max(1.0, a) + 1e-12:
                blocking.append(f"{k} at its lower bound {a:g} kg")
            elif abs(v - b) <= 1e-9 * max(1.0, b) + 1e-12:
                blocking.append(f"{k} at its upper bound {b:g} kg")
    amounts = {k: float(v) for k, v in zip(keys, x)}
    new = recipe.with_changes(amounts, name=name if name is not None else f"{recipe.name} (solved)")
    if ok:
        message = "targets met"
    else:
        worst = max(misfit, key=misfit.get)
        unit = "K" if worst == "freezing_point" else ""
        message = (f"target {worst} = {goal[worst]:g}{(' ' + unit) if unit else ''} not reached: best "
                   f"{achieved[worst]:.6g}{(' ' + unit) if unit else ''}; "
                   + ("blocked by " + ", ".join(blocking) if blocking
                      else "no bound is active: the targets conflict with each other"))
    return RecipeSolution(recipe=new, amounts=amounts, achieved=achieved, targets=goal, success=ok,
                          message=message, blocking=blocking, iterations=iterations)
