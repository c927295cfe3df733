"""Freezing times (Plank, Pham, simulation), shape factors and boiling points from Python."""
from __future__ import annotations

import math

import numpy as np
import pytest

import colligate as cg

C0 = 273.15


def test_plank_beef_steak_worked_example():
    # Singh & Heldman (2009), Introduction to Food Engineering, ch. 7 Plank example (from
    # memory): 5 cm steak, 970 kg/m3, 73 % water x 333.22 kJ/kg, k 1.1, Tf -1.75 C, -30 C,
    # h = 5; printed 12.26 h (4 significant figures).
    t = cg.plank_time("slab", 0.05, 970.0, 0.73 * 333.22e3, C0 - 1.75, C0 - 30.0, 5.0, 1.1)
    assert t / 3600.0 == pytest.approx(12.26, abs=0.005)


@pytest.mark.parametrize("shape", ["slab", "cylinder", "sphere"])
def test_pham_equals_plank_without_sensible_heat(shape):
    # identity of the two formulas (Pham 1986): no precooling (T_i = T_fm), c_f = 0
    Tc, Tm = C0 - 18.0, C0 - 35.0
    Tfm = C0 + 1.8 + 0.263 * (Tc - C0) + 0.105 * (Tm - C0)
    pham = cg.pham_time(shape, 0.08, Tfm, Tm, Tc, density_unfrozen=1050.0, density_frozen=1050.0,
                        c_unfrozen=3600.0, c_frozen=0.0, latent_heat=250e3, k_frozen=1.4, h=25.0)
    plank = cg.plank_time(shape, 0.08, 1050.0, 250e3, Tfm, Tm, 25.0, 1.4)
    assert pham == pytest.approx(plank, rel=1e-12)


def test_pham_sweep_equals_scalar():
    kw = dict(density_unfrozen=1050.0, density_frozen=1000.0, c_unfrozen=3600.0, c_frozen=1900.0,
              latent_heat=250e3, k_frozen=1.5)
    sizes = np.linspace(0.01, 0.2, 7)
    hs = np.linspace(5.0, 200.0, 7)
    many = cg.pham_times("slab", sizes, C0 + 5, C0 - 30, C0 - 18, h=hs, **kw)
    one = [cg.pham_time("slab", s, C0 + 5, C0 - 30, C0 - 18, h=h, **kw) for s, h in zip(sizes, hs)]
    assert np.array_equal(many, np.array(one))


def test_bad_inputs_name_the_field():
    with pytest.raises(ValueError, match="size"):
        cg.plank_time("slab", -0.05, 970.0, 2.4e5, C0 - 1.75, C0 - 30.0, 5.0, 1.1)
    with pytest.raises(ValueError, match="k_frozen"):
        cg.plank_time("slab", 0.05, 970.0, 2.4e5, C0 - 1.75, C0 - 30.0, 5.0, 0.0)
    with pytest.raises(ValueError, match="T_medium"):
        cg.plank_time("slab", 0.05, 970.0, 2.4e5, C0 - 1.75, C0 + 1.0, 5.0, 1.1)
    with pytest.raises(ValueError, match="shape"):
        cg.plank_time("cube", 0.05, 970.0, 2.4e5, C0 - 1.75, C0 - 30.0, 5.0, 1.1)


def _meat_like():
    # an invented demo food (not a check value): lean-meat-like proximate composition with a
    # dilute salt water phase
    comp = {"water": 0.74, "protein": 0.21, "fat": 0.04, "ash": 0.01}
    sol = cg.Solution.from_molalities({"NaCl": 0.15})
    return comp, sol


def test_simulation_history_and_refinement():
    comp, sol = _meat_like()
    kw = dict(composition=comp, solution=sol, shape="slab", size=0.05, T_initial=C0 + 5.0,
              T_medium=C0 - 30.0, h=20.0, T_target=C0 - 18.0)
    coarse = cg.simulate_freezing(**kw)  # automatic step, 40 intervals
    fine = cg.simulate_freezing(**kw, intervals=80, time_step=5.0)
    assert coarse.success and fine.success
    # converged to 1 % (issue 13)
    assert coarse.time_to_target == pytest.approx(fine.time_to_target, rel=0.01)
    h = coarse.history
    assert list(h.columns[:3]) == ["time_s", "centre_K", "surface_K"]
    assert h["centre_K"].iloc[-1] <= C0 - 18.0 + 0.5
    assert (h["heat_flux_W_m2"] > 0).all()  # cooling all along


def test_simulation_against_pham_for_a_food():
    # Two independent estimates of the same food: Pham's method was reported within about
    # +-10 % of measured freezing times (Pham 1986, from memory), so the two may differ by up to
    # about 15 % without either being wrong; a larger gap points at an input or a model error.
    comp, sol = _meat_like()
    inp = cg.freezing_inputs(composition=comp, solution=sol, T_initial=C0 + 5.0, T_target=C0 - 18.0)
    pham = cg.pham_time("slab", 0.05, C0 + 5.0, C0 - 30.0, C0 - 18.0, h=20.0,
                        **{k: inp[k] for k in ("density_unfrozen", "density_frozen", "c_unfrozen",
                                               "c_frozen", "latent_heat", "k_frozen")})
    sim = cg.simulate_freezing(composition=comp, solution=sol, shape="slab", size=0.05, T_initial=C0 + 5.0,
                               T_medium=C0 - 30.0, h=20.0, T_target=C0 - 18.0)
    assert sim.time_to_target == pytest.approx(pham, rel=0.15)


def test_thawing_and_varying_medium(tmp_path):
    comp, sol = _meat_like()
    thaw = cg.simulate_freezing(composition=comp, solution=sol, shape="cylinder", size=0.04,
                                T_initial=C0 - 18.0, T_medium=C0 + 10.0, h=15.0, T_target=C0 + 0.0)
    assert thaw.success and (thaw.history["heat_flux_W_m2"].iloc[1:] < 0).all()
    ramp = [[0.0, C0 - 10.0], [1800.0, C0 - 35.0]]
    run = cg.simulate_freezing(composition=comp, solution=sol, shape="sphere", size=0.03, T_initial=C0 + 4.0,
                               T_medium=ramp, h=25.0, T_target=C0 - 18.0)
    assert run.success
    assert run.history["medium_K"].iloc[-1] == pytest.approx(C0 - 35.0)
    png = run.plot(tmp_path / "histories.png")
    assert (tmp_path / "histories.png").stat().st_size > 1000 and png.endswith("histories.png")


def test_simulation_bad_input():
    comp, sol = _meat_like()
    with pytest.raises(ValueError, match="T_target"):
        cg.simulate_freezing(composition=comp, solution=sol, shape="slab", size=0.05, T_initial=C0 + 5,
                             T_medium=C0 - 30, h=20.0, T_target=C0 - 25.0)  # below the NaCl eutectic
    with pytest.raises(ValueError, match="T_medium"):
        cg.simulate_freezing(composition=comp, solution=sol, shape="slab", size=0.05, T_initial=C0 + 5,
                             T_medium=C0 - 10, h=20.0, T_target=C0 - 18.0)  # medium warmer than target
    with pytest.raises(ValueError, match="h ="):
        cg.simulate_freezing(composition=comp, solution=sol, shape="slab", size=0.05, T_initial=C0 + 5,
                             T_medium=C0 - 30, h=0.0, T_target=C0 - 18.0)


def test_boiling_point_of_water_and_sucrose():
    # IAPWS: pure water boils at 99.974 C at 101.325 kPa (Wagner & Pruss 2002)
    assert cg.boiling_point(cg.Solution.from_molalities({})) - C0 == pytest.approx(99.97, abs=0.005)
    assert cg.saturation_pressure(373.15) == pytest.approx(101418.0, rel=1e-5)
    s = cg.Solution.from_mass_fractions({"sucrose": 0.5})
    with pytest.warns(cg.OutOfValidityRangeWarning, match="norrish"):
        Tb = cg.boiling_point(s)
    assert Tb > 373.124
    with pytest.warns(cg.OutOfValidityRangeWarning):
        back = cg.concentration_for_boiling_point(cg.Solution.from_mass_fractions({"sucrose": 0.1}), Tb)
    # the 50 % solution boiling at Tb comes back (round trip)
    assert back.brix == pytest.approx(50.0, rel=1e-6)
    # the temperature-dependent sucrose model (Starzak & Peacock 1997) is in range at 100 C
    # and gives a lower elevation than the 25 C Norrish constant (no warning raised)
    sp = cg.boiling_point(s, model="starzak_peacock")
    assert C0 + 99.97 < sp < Tb


def test_thermal_properties_frame():
    comp, sol = _meat_like()
    frame = cg.thermal_properties(composition=comp, solution=sol, T=[C0 + 5.0, C0 - 20.0])
    assert frame.loc[C0 - 20.0, "conductivity_W_mK"] > 2 * frame.loc[C0 + 5.0, "conductivity_W_mK"]
    assert frame.loc[C0 + 5.0, "ice_fraction"] == 0.0


def test_cli_freeze_time(tmp_path, capsys):
    import json

    from colligate.cli import main

    png = tmp_path / "ft.png"
    rc = main(["freeze-time", "demo", "--size", "0.05", "--initial", "5", "--medium", "-30", "--h", "20",
               "--target", "-18", "--plot", str(png), "--json"])
    out = capsys.readouterr().out
    assert rc == 0 and png.stat().st_size > 1000
    data = json.loads(out)
    assert data["plank_s"] < data["pham_s"]  # Plank leaves out precooling and subcooling
    assert data["simulation_status"] == "reached_target"
    assert "validated process controls" in data["caution"]
    rc = main(["freeze-time", "demo", "--size", "0.05", "--initial", "5", "--medium", "-30", "--h", "20",
               "--target", "-18"])
    text = capsys.readouterr().out
    assert rc == 0 and "Pham (1986)" in text and "local codes" in text


def test_cli_freeze_time_bad_input(capsys):
    from colligate.cli import main

    rc = main(["freeze-time", "demo", "--size", "0.05", "--initial", "5", "--medium", "-10", "--h", "20",
               "--target", "-18"])
    err = capsys.readouterr().err
    assert rc == 2 and "T_medium" in err
    rc = main(["freeze-time", "demo", "--size", "-1", "--initial", "5", "--medium", "-30", "--h", "20",
               "--target", "-18"])
    assert rc == 2 and "size" in capsys.readouterr().err


def test_cli_freeze_time_writes_all_outputs_or_none(tmp_path, capsys):
    from colligate.cli import main

    png, txt = tmp_path / "ft.png", tmp_path / "ft.txt"
    base = ["freeze-time", "demo", "--size", "0.05", "--initial", "5", "--h", "20", "--target", "-18",
            "--plot", str(png), "--save", str(txt)]
    # A medium warmer than the target fails after both paths were planned: no file appears.
    rc = main(base + ["--medium", "-10"])
    assert rc == 2 and "T_medium" in capsys.readouterr().err
    assert not png.exists() and not txt.exists()
    assert [p.name for p in tmp_path.iterdir()] == []  # no temporary file left either
    # Both outputs on one file are refused before anything is computed.
    rc = main(["freeze-time", "demo", "--size", "0.05", "--initial", "5", "--h", "20", "--target", "-18",
               "--medium", "-30", "--plot", str(png), "--save", str(png)])
    assert rc == 2 and "same file" in capsys.readouterr().err and not png.exists()
    # A good run writes both; the saved text is what was printed, with the cautions.
    rc = main(base + ["--medium", "-30"])
    out = capsys.readouterr().out
    assert rc == 0 and png.stat().st_size > 1000
    assert txt.read_text(encoding="utf-8") == out and "local codes" in out
