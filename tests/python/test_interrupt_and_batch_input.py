"""Ctrl-C during a long batch call, and batch inputs refused by name (issue 16)."""
from __future__ import annotations

import os
import signal
import threading
import time

import numpy as np
import pytest

import colligate as cg


def _long_batch() -> cg.SolutionBatch:
    # Enough Pitzer seawater-like rows at many temperatures to take far longer than the
    # test waits (tens of seconds), so an interruption is the only way it returns quickly.
    n = 200_000
    rng = np.random.default_rng(3)
    return cg.SolutionBatch.from_molalities({
        "NaCl": rng.uniform(0.1, 0.6, n), "MgCl2": rng.uniform(0.0, 0.05, n),
        "Na2SO4": rng.uniform(0.0, 0.03, n)})


@pytest.mark.skipif(not hasattr(signal, "SIGINT") or os.name != "posix", reason="POSIX signals")
def test_ctrl_c_stops_a_long_batch_within_a_second():
    batch = _long_batch()
    temps = np.linspace(272.0, 250.0, 12)
    sent = {}

    def interrupt():
        sent["t"] = time.monotonic()
        os.kill(os.getpid(), signal.SIGINT)

    timer = threading.Timer(0.5, interrupt)
    timer.start()
    try:
        with pytest.raises(KeyboardInterrupt):
            cg.batch_ice_fraction(batch, temps, "pitzer", threads=2)
        returned = time.monotonic()
    finally:
        timer.cancel()
    assert "t" in sent
    assert returned - sent["t"] < 1.0


def test_batch_call_without_ctrl_c_is_unchanged_by_the_polling():
    # The polling hook changes nothing in the results (identity, bit for bit).
    rng = np.random.default_rng(5)
    data = {"sucrose": rng.uniform(0, 0.3, 50), "NaCl": rng.uniform(0, 0.03, 50)}
    batch = cg.SolutionBatch.from_mass_fractions(data)
    a = cg.batch_freezing_point(batch, threads=1)
    b = cg.batch_freezing_point(batch, threads=3)
    assert a.tobytes() == b.tobytes()


def test_two_dimensional_column_is_refused_by_name():
    with pytest.raises(cg.InvalidInputError, match="column 'sucrose'.*1-D"):
        cg.SolutionBatch.from_mass_fractions({"sucrose": [[0.1, 0.2], [0.1, 0.2]]})
    with pytest.raises(cg.InvalidInputError, match="column 'NaCl'"):
        cg.SolutionBatch.from_molalities({"sucrose": [0.1, 0.2], "NaCl": np.zeros((2, 1))})


@pytest.mark.parametrize("build", [
    lambda: cg.Solution(water=1.0, solutes={"sucrse": 0.0}),
    lambda: cg.Solution.from_mass_fractions({"sucrse": 0.0, "glucose": 0.1}),
    lambda: cg.Solution.from_molalities({"sucrse": 0.0}),
    lambda: cg.SolutionBatch.from_mass_fractions({"sucrse": [0.0, 0.0]}),
])
def test_unknown_solute_with_zero_amount_is_rejected_with_nearest_names(build):
    with pytest.raises(cg.InvalidInputError, match="sucrse.*sucrose"):
        build()


def test_ice_water_activity_gives_no_value_below_215_k():
    # The formulation turns unphysical below about 207 K (a_w,ice rising again): no value.
    with pytest.warns(cg.OutOfValidityRangeWarning, match="215"):
        assert np.isnan(cg.water_activity_of_ice(150.0))
    with pytest.raises(cg.OutOfValidityRangeError):
        cg.water_activity_of_ice(150.0, range_policy="raise")
    # A 20 % sucrose solution at 150 K: no ice fraction (it used to show 0).
    with pytest.warns(cg.OutOfValidityRangeWarning, match="215"):
        f = cg.ice_fraction(cg.Solution.from_mass_fractions({"sucrose": 0.2}), 150.0)
    assert np.isnan(f)


def test_no_physical_value_has_its_own_row_status():
    batch = cg.SolutionBatch.from_molalities({"K2SO4": [0.5, 2.75]})
    with pytest.warns(Warning):
        # The metastable liquid: 2.75 mol/kg K2SO4 at 240 K lies far above arcanite's
        # solubility, and its extrapolated a_w is not physical (the default equilibrium state,
        # arcanite crystallised, has a physical a_w).
        aw, status = cg.batch_water_activity(batch, 240.0, "pitzer", return_status=True,
                                             saturation="metastable")
    assert np.all(np.isnan(aw) | ((aw > 0) & (aw <= 1)))
    assert "no physical value" in cg.ROW_STATUS[int(cg.RowStatus.no_physical_value)]
