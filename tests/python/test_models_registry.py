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


def _summary(model_id):
    return next(r for r in cg._core.model_summaries() if r["id"] == model_id)


def test_every_model_declares_its_validated_range(model):
    # The registry descriptor carries the range the model's check applies (issue 18): the
    # "which model when" page is generated from it, not typed in.
    if model == "auto":
        return
    limits = _summary(model)["validated_range"]
    assert limits, f"model {model!r} declares no validated range"
    for limit in limits:
        assert limit["quantity"] and len(limit["basis"]) > 10
        bounded = limit["high"] == limit["high"] or limit["low"] == limit["low"]
        assert bounded or limit["per_solute"], limit
        if limit["source"]:
            assert cg.citation(limit["source"])["key"] == limit["source"]


def test_the_warning_quotes_the_declared_limit():
    # The out-of-range reason is built from the descriptor's limit objects: the numbers and
    # the basis of the warning are the declared ones.
    norrish_t = next(l for l in _summary("norrish")["validated_range"] if l["quantity"] == "temperature")
    s = cg.Solution.from_mass_fractions({"sucrose": 0.1})
    with pytest.warns(cg.OutOfValidityRangeWarning) as caught:
        cg.water_activity(s, norrish_t["high"] + 5.0, model="norrish")
    text = str(caught[0].message)
    assert f"outside {norrish_t['low']:g}-{norrish_t['high']:g} K" in text and norrish_t["basis"] in text
    ideal = _summary("ideal")["validated_range"][0]
    strong = cg.Solution.from_molalities({"glucose": 2.0 * ideal["high"]})
    with pytest.warns(cg.OutOfValidityRangeWarning) as caught:
        cg.water_activity(strong, 298.15, model="ideal")
    text = str(caught[0].message)
    assert f"above {ideal['high']:g} {ideal['unit']}" in text and ideal["basis"] in text
