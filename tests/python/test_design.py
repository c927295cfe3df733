"""Design spaces and the formulation solver."""
from __future__ import annotations

import numpy as np
import pytest

import colligate as cg
from colligate.design import grid, latin_hypercube, solve_formulation, total_solids


def test_grid_and_constraints():
    df = grid({"sucrose": (0.1, 0.3, 5), "glucose": (0.0, 0.1, 3)}, constraints=[total_solids(0.2, 0.3)])
    assert set(df.columns) == {"sucrose", "glucose"}
    s = df.sum(axis=1)
    assert len(df) > 0 and (s >= 0.2 - 1e-12).all() and (s <= 0.3 + 1e-12).all()


def test_latin_hypercube_is_stratified_and_seeded():
    a = latin_hypercube({"sucrose": (0.1, 0.3), "glucose": (0.0, 0.1)}, 100, seed=1)
    b = latin_hypercube({"sucrose": (0.1, 0.3), "glucose": (0.0, 0.1)}, 100, seed=1)
    assert a.equals(b)
    # one sample in each of the 100 strata of every axis (the Latin-hypercube property)
    strata = np.floor((a["sucrose"] - 0.1) / 0.2 * 100).astype(int).clip(0, 99)
    assert len(set(strata)) == 100
    weighted = latin_hypercube({"sucrose": (0.1, 0.3)}, 50, seed=2, constraints=[({"sucrose": 1.0}, 0.0, 0.2)])
    assert (weighted["sucrose"] <= 0.2).all()


def test_bad_ranges_are_rejected():
    with pytest.raises(cg.InvalidInputError, match="ranges"):
        latin_hypercube({"sucrose": (0.3, 0.1)}, 10)


def test_solver_meets_freezing_point_and_solids_at_least_cost():
    # Invented pricing for the test: glucose cheaper than sucrose per kg.
    result = solve_formulation(
        variables={"sucrose": (0.05, 0.30), "glucose": (0.0, 0.15)},
        targets={"freezing_point": 273.15 - 3.0, "total_solids": 0.28},
        cost={"sucrose": 1.0, "glucose": 0.8},
    )
    assert result.success, result.message
    s = cg.Solution.from_mass_fractions({k: v for k, v in result.amounts.items()})
    assert cg.freezing_point(s) == pytest.approx(270.15, abs=1e-4)
    assert sum(result.amounts.values()) == pytest.approx(0.28, abs=1e-6)
    assert "freezing_point" in result.summary().index


def test_solver_ice_fraction_target():
    result = solve_formulation(
        variables={"sucrose": (0.05, 0.35)},
        fixed={"glucose": 0.04},
        targets={"ice_fraction": (255.15, 0.70)},
    )
    assert result.success, result.message
    s = cg.Solution.from_mass_fractions(result.amounts)
    assert cg.ice_fraction(s, 255.15) == pytest.approx(0.70, abs=1e-5)
