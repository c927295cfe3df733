"""Freezing times with their uncertainty, and the effective solute's covariance on its record.

Finite differences appear here only as test references; the library computes the partial
derivatives in closed form (``thermal/freezing_time_uncertainty.hpp``).
"""
from __future__ import annotations

import json
import pathlib

import numpy as np
import pandas as pd
import pytest

import colligate as cg
from colligate import fit

REFERENCE = pathlib.Path(__file__).resolve().parents[1] / "reference"
SUCROSE_M = 0.3422965  # kg/mol (C12H22O11, IUPAC atomic weights; common practice)


def crc_rows(solute, max_percent):
    """CRC Handbook (102nd ed., 2021), concentrative properties (crc_concentrative): mass
    percent, molality and freezing point of a binary solution."""
    t = pd.read_csv(REFERENCE / "crc_freezing_points.csv", keep_default_na=False)
    t = t[(t.solute == solute) & (t.mass_percent <= max_percent)]
    assert set(t.source_key) == {"crc_concentrative"}
    return t.mass_percent.to_numpy(), t.molality_mol_per_kg.to_numpy(), cg._core.ICE_POINT - t.depression_K.to_numpy()


@pytest.fixture(scope="module")
def sucrose_recipe():
    """Norrish K fitted to the CRC sucrose freezing points to 42 wt%; an invented gel of
    0.3 kg of it in 0.7 kg water."""
    _, m, tf = crc_rows("sucrose", 42.0)
    fs = fit.fit_norrish(m, freezing_point=tf).as_solute("my sucrose", molar_mass=SUCROSE_M)
    return cg.Recipe(water=0.7, solutes={"my sucrose": 0.3}, library=cg.Library([fs]))


# A 5 cm slab from +5 C in -35 C air, h = 20 W/(m^2 K), to -18 C (invented demo process).
PROCESS = dict(shape="slab", size=0.05, T_initial=278.15, T_medium=238.15, h=20.0, T_target=255.15)


def test_plank_time_with_stated_input_uncertainties():
    # Inputs of the order of a beef slab (invented).
    args = ("slab", 0.05, 1050.0, 2.5e5, 271.9, 243.15, 20.0, 1.4)
    plain = cg.plank_time(*args)
    r = cg.plank_time(*args, with_uncertainty=True, u_h=2.0)
    assert r.value == plain and r.degrees_of_freedom == 0 and r.constants == ["h"]
    d = 1e-3
    slope = (cg.plank_time(*args[:6], 20.0 + d, 1.4) - cg.plank_time(*args[:6], 20.0 - d, 1.4)) / (2 * d)
    assert r.std == pytest.approx(abs(slope) * 2.0, rel=1e-6)  # central difference error O(d^2)
    lo, hi = r.ci(0.95)
    assert (hi - lo) == pytest.approx(2 * 1.959963985 * r.std, rel=1e-9)  # normal quantile, common practice
    both = cg.plank_time(*args, with_uncertainty=True, u_h=2.0, u_T_freeze=0.3)
    assert both.std > r.std
    with pytest.raises(cg.InvalidInputError, match="u_h"):
        cg.plank_time(*args, with_uncertainty=True, u_h=-1.0)


def test_pham_time_with_stated_input_uncertainties():
    kw = dict(density_unfrozen=1070.0, density_frozen=1000.0, c_unfrozen=3600.0, c_frozen=1900.0,
              latent_heat=2.3e5, k_frozen=1.3, h=20.0)
    plain = cg.pham_time("slab", 0.05, 278.15, 243.15, 255.15, **kw)
    r = cg.pham_time("slab", 0.05, 278.15, 243.15, 255.15, with_uncertainty=True, u_T_medium=1.0, **kw)
    assert r.value == plain
    d = 1e-3
    slope = (cg.pham_time("slab", 0.05, 278.15, 243.15 + d, 255.15, **kw)
             - cg.pham_time("slab", 0.05, 278.15, 243.15 - d, 255.15, **kw)) / (2 * d)
    assert r.std == pytest.approx(abs(slope) * 1.0, rel=1e-6)
    with pytest.raises(cg.InvalidInputError, match="u_colour"):
        cg.pham_time("slab", 0.05, 278.15, 243.15, 255.15, with_uncertainty=True, u_colour=1.0, **kw)
    with pytest.raises(cg.InvalidInputError, match="with_uncertainty"):
        cg.pham_time("slab", 0.05, 278.15, 243.15, 255.15, u_h=1.0, **kw)


def test_recipe_freezing_times_linear_and_monte_carlo_agree(sucrose_recipe):
    # Delta method against 10^4 seeded draws: 95 % interval ends within 5 % of its width.
    for method in ("plank", "pham"):
        plain = cg.food_freezing_time(sucrose_recipe, method=method, **PROCESS)
        lin = cg.food_freezing_time(sucrose_recipe, method=method, with_uncertainty=True, u_h=0.4,
                                    u_size=0.0005, u_T_medium=0.5, **PROCESS)
        assert lin.value == plain and lin.method == "linear"
        assert lin.constants == ["my_sucrose.norrish_k", "process.h", "process.size", "process.T_medium"]
        assert set(lin.sensitivities) == set(lin.constants) and lin.sensitivities["process.h"] < 0.0
        mc = cg.food_freezing_time(sucrose_recipe, method=method, with_uncertainty="monte_carlo", u_h=0.4,
                                   u_size=0.0005, u_T_medium=0.5, draws=10_000, seed=20261202, **PROCESS)
        assert mc.value == plain and mc.samples.size == 10_000
        (a0, a1), (b0, b1) = lin.ci(0.95), mc.ci(0.95)
        assert abs(a0 - b0) < 0.05 * (b1 - b0) and abs(a1 - b1) < 0.05 * (b1 - b0)
    # the fitted constant alone: Student t with the fit's degrees of freedom
    only = cg.food_freezing_time(sucrose_recipe, method="plank", with_uncertainty=True, **PROCESS)
    assert only.std > 0.0 and only.degrees_of_freedom > 0


def test_simulation_time_by_monte_carlo(sucrose_recipe):
    run = cg.simulate_freezing(sucrose_recipe, intervals=10, with_uncertainty=True, u_h=1.0, draws=20, seed=3,
                               **PROCESS)
    u = run.time_uncertainty
    assert u.value == run.time_to_target and u.method == "monte_carlo" and u.samples.size == 20
    assert u.std > 0.0 and u.ci(0.95)[0] < u.value < u.ci(0.95)[1]
    again = cg.simulate_freezing(sucrose_recipe, intervals=10, with_uncertainty=True, u_h=1.0, draws=20, seed=3,
                                 **PROCESS)
    np.testing.assert_array_equal(again.time_uncertainty.samples, u.samples)  # seeded
    with pytest.raises(cg.InvalidInputError, match="monte_carlo"):
        cg.simulate_freezing(sucrose_recipe, with_uncertainty="linear", **PROCESS)


def test_cli_freeze_time_prints_uncertainty(capsys):
    from colligate.cli import main

    base = ["freeze-time", "demo", "--size", "0.05", "--initial", "5", "--medium", "-30", "--h", "20",
            "--target", "-18"]
    rc = main(base + ["--uncertainty", "--u-h", "2", "--u-medium", "0.5", "--draws", "8"])
    text = capsys.readouterr().out
    assert rc == 0 and text.count("±") >= 4 and "95 % interval" in text and "local codes" in text
    rc = main(base + ["--uncertainty", "--u-h", "2", "--draws", "8", "--json"])
    data = json.loads(capsys.readouterr().out)
    assert rc == 0
    for key in ("plank", "pham", "simulation"):
        e = data["uncertainty"][key]
        assert e["standard_uncertainty_s"] > 0.0 and e["interval_95_s"][0] < e["value_s"] < e["interval_95_s"][1]
    assert data["uncertainty"]["pham"]["value_s"] == data["pham_s"]
    rc = main(base + ["--u-h", "2"])
    assert rc == 2 and "--uncertainty" in capsys.readouterr().err


@pytest.fixture(scope="module")
def glucose_solids():
    """Effective solute (M and bound water) fitted to the CRC glucose freezing points to 30 wt%,
    each row taken as a food of water fraction 1 - w."""
    w, _, tf = crc_rows("glucose", 30.0)
    res = fit.fit_effective_solute(1.0 - w / 100.0, freezing_point=tf)
    assert res.success
    return res, res.as_solute("my solids")


def test_effective_solute_record_keeps_its_molar_mass_uncertainty(glucose_solids, tmp_path):
    res, fs = glucose_solids
    u = fs.record.uncertainty
    assert u["names"] == ["molar_mass"] and u["degrees_of_freedom"] == res.degrees_of_freedom
    assert u["covariance"][0, 0] == res.covariance.iloc[0, 0]
    # library file round trip, then a recipe that loads it
    path = tmp_path / "house.toml"
    cg.Library([fs]).save(path)
    back = cg.Library.load(path).solute_table.find("my solids")
    np.testing.assert_array_equal(back.uncertainty["covariance"], u["covariance"])
    assert back.uncertainty["degrees_of_freedom"] == u["degrees_of_freedom"]
    (tmp_path / "r.toml").write_text('[recipe]\nname = "jam base"\n[library]\nload = ["house.toml"]\n'
                                     '[composition]\nwater = 0.8\nmy_solids = 0.2\n', encoding="utf-8")
    from colligate.recipe import load_recipe

    r = load_recipe(tmp_path / "r.toml")
    tf = r.freezing_point(with_uncertainty=True)
    assert tf.value == r.freezing_point() and tf.std > 0.0 and tf.constants == ["my_solids.molar_mass"]
    mc = r.freezing_point(with_uncertainty="monte_carlo")
    (a0, a1), (b0, b1) = tf.ci(0.95), mc.ci(0.95)
    assert abs(a0 - b0) < 0.05 * (b1 - b0) and abs(a1 - b1) < 0.05 * (b1 - b0)
