"""cg.seawater_freezing_point: the Pitzer model's freezing line of Reference-Composition
seawater against the exact batch path of the same model (identities), against TEOS-10
(gsw), and its handling of shapes, parameter sets and bad salinities."""
from __future__ import annotations

import numpy as np
import pandas as pd
import pytest

import colligate as cg

from reference_packages import reference_package

gsw = reference_package("gsw", module_level=True)


def exact(SA, parameter_set=None):
    """The batch path on the molalities of Solution.seawater(SA) (the line's model)."""
    rows = [cg.Solution.seawater(float(v)).molalities() for v in SA]
    b = cg.SolutionBatch.from_molalities(pd.DataFrame(rows))
    return np.asarray(cg.batch_freezing_point(b, "pitzer", parameter_set=parameter_set))


def test_line_equals_the_exact_path():
    # Identity: the line is a series of the model's own freezing points; 1e-10 K is the
    # tolerance it is built to (common practice for a tabulated inverse).
    SA = np.concatenate([np.linspace(0.0, 50.0, 301), [1e-6, 0.01, 35.16504]])
    line = cg.seawater_freezing_point(SA)
    assert np.max(np.abs(line - exact(SA))) <= 1e-10
    # Above the line (50-120 g/kg) the exact path itself: equal bit for bit, with the
    # exact path's status (the model's validated molality ends below 119 g/kg).
    high = np.array([50.5, 60.0, 80.0, 119.0])
    with pytest.warns(cg.OutOfValidityRangeWarning):
        values, status = cg.seawater_freezing_point(high, return_status=True)
    with pytest.warns(cg.OutOfValidityRangeWarning):
        assert np.array_equal(values, exact(high), equal_nan=True)
    assert status[-1] != 0


def test_line_against_teos10():
    # External reference: TEOS-10 (IOC, SCOR & IAPSO 2010), gsw.t_freezing(SA, p=0,
    # saturation_fraction=0), air-free; the model's tolerance against it is 0.003 K on
    # SA 5-40 g/kg (tests/reference/tolerances.toml, teos10_freezing_point).
    SA = np.linspace(5.0, 40.0, 71)
    d = cg.seawater_freezing_point(SA) - (gsw.t_freezing(SA, 0, 0) + 273.15)
    assert np.max(np.abs(d)) <= 0.003


def test_shapes_threads_and_status():
    SA = np.linspace(0.0, 70.0, 24).reshape(4, 6)
    one = cg.seawater_freezing_point(SA, threads=1)
    two, status = cg.seawater_freezing_point(SA, threads=2, return_status=True)
    assert one.shape == (4, 6) and status.shape == (4, 6)
    assert np.array_equal(one, two)  # bit for bit on any thread count
    assert np.all(status == 0)
    x = cg.seawater_freezing_point(35.0)
    assert isinstance(x, float)
    assert x == cg.seawater_freezing_point(np.array([35.0]))[0]
    assert cg.seawater_freezing_point(0.0) == 273.15


def test_other_parameter_sets():
    # A set with a validated range on the line builds its own line; one without (Harvie et
    # al. 1984: 293.15-303.15 K) is solved exactly at every salinity, flagged out of range.
    SA = np.array([10.0, 35.0])
    spencer = cg.seawater_freezing_point(SA, parameter_set="spencer_1990")
    assert np.max(np.abs(spencer - exact(SA, "spencer_1990"))) <= 1e-10
    with pytest.warns(cg.OutOfValidityRangeWarning):
        harvie = cg.seawater_freezing_point(SA, parameter_set="harvie_1984")
    with pytest.warns(cg.OutOfValidityRangeWarning):
        assert np.array_equal(harvie, exact(SA, "harvie_1984"))


@pytest.mark.parametrize("bad", [-1.0, 120.0, float("nan"), float("inf")])
def test_bad_salinity_names_the_input(bad):
    with pytest.raises(cg.InvalidInputError, match=r"absolute_salinity = .* \[0, 120\) g/kg"):
        cg.seawater_freezing_point(bad)
    with pytest.raises(cg.InvalidInputError, match=r"absolute_salinity\[1\]"):
        cg.seawater_freezing_point([35.0, bad])
