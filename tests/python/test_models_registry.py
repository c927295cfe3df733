"""Every registered model gets the same smoke, batch-equals-scalar and range checks."""
from __future__ import annotations

import warnings

import numpy as np
import pytest

import colligate as cg


@pytest.fixture(params=cg.models())
def model(request):
    return request.param


def test_dilute_sugar_is_in_range_and_sane(model):
    # 1.5 wt% sucrose (0.045 mol/kg): every model is within its validated range (ideal: up to
    # 0.1 mol/kg; starzak_peacock describes sucrose only) and gives a_w in (0, 1) and a
    # freezing point below 0 C.
    s = cg.Solution.from_mass_fractions({"sucrose": 0.015})
    tf = cg.freezing_point(s, model=model)
    assert 272.0 < tf < 273.15
    assert 0.99 < cg.water_activity(s, 298.15, model=model) < 1.0


def test_array_equals_scalar(model):
    s = cg.Solution.from_mass_fractions({"sucrose": 0.02, "glucose": 0.01})
    temps = np.linspace(273.0, 260.0, 14)
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", cg.OutOfValidityRangeWarning)
        batch = cg.ice_fraction(s, temps, model=model)
        scalar = [cg.ice_fraction(s, float(t), model=model) for t in temps]
    assert np.array_equal(batch, np.array(scalar))  # bit-identical


def test_range_policy_raise(model):
    strong = cg.Solution.from_mass_fractions({"sucrose": 0.6, "NaCl": 0.05})
    with pytest.raises(cg.OutOfValidityRangeError):
        cg.water_activity(strong, 298.15, model=model, range_policy="raise")
