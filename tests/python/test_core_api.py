"""The public Python API of DESIGN.md section 4: names, units, errors, warnings."""
from __future__ import annotations

import math

import numpy as np
import pandas as pd
import pytest

import colligate as cg

T0 = 273.15


def test_public_names():
    for name in ["Solution", "freezing_point", "water_activity", "osmotic_coefficient",
                 "ice_fraction", "unfrozen_phase", "solutes", "models", "citation"]:
        assert hasattr(cg, name)
    assert set(cg.models()) >= {"auto", "ideal", "raoult", "norrish"}
    assert cg.__version__


def test_constructors_agree():
    a = cg.Solution.from_mass_fractions({"sucrose": 0.20, "NaCl": 0.01})
    b = cg.Solution(water=0.79, solutes={"sucrose": 0.20, "sodium chloride": 0.01})
    assert a.water == pytest.approx(b.water, rel=1e-15)
    assert a.moles == pytest.approx(b.moles, rel=1e-15)
    m = cg.Solution.from_molalities({"NaCl": 1.0})
    assert m.molalities() == {"sodium_chloride": pytest.approx(1.0, rel=1e-15)}
    assert cg.Solution.from_brix(25.0).brix == pytest.approx(25.0, rel=1e-14)
    fr = a.mass_fractions()
    assert sum(fr.values()) == pytest.approx(1.0, rel=1e-15)


def test_pandas_series_is_accepted():
    s = cg.Solution.from_mass_fractions(pd.Series({"glucose": 0.1, "fructose": 0.1}))
    assert s.species == ["glucose", "fructose"]


def test_freezing_point_in_kelvin_against_crc(crc_freezing):
    # CRC Handbook 102nd ed. (2021), concentrative properties: 42 wt% sucrose, 4.93 K.
    # 0.2 K: the limitation of one Norrish constant over the CRC sucrose rows (worst row
    # 0.18 K); without the Norrish term this row misses by about 0.8 K (the 20 wt% row,
    # 1.47 K, would pass either way).
    row = crc_freezing.query("solute == 'sucrose' and mass_percent == 42").iloc[0]
    assert row.source_key == "crc_concentrative"
    tf = cg.freezing_point(cg.Solution.from_mass_fractions({"sucrose": 0.42}))
    assert 273.15 - tf == pytest.approx(row.depression_K, abs=0.2)


def test_ice_fraction_scalar_and_array():
    s = cg.Solution.from_mass_fractions({"sucrose": 0.20})
    assert isinstance(cg.ice_fraction(s, 263.15), float)
    arr = cg.ice_fraction(s, np.array([[280.0, 270.0], [263.15, 258.15]]))
    assert arr.shape == (2, 2)
    assert arr[0, 0] == 0.0  # above the freezing point: 0, not an error
    assert arr[1, 0] == pytest.approx(cg.ice_fraction(s, 263.15), rel=1e-15)


def test_unfrozen_phase_object():
    s = cg.Solution.from_mass_fractions({"sucrose": 0.20})
    u = cg.unfrozen_phase(s, 263.15)
    assert u.ice + u.unfrozen_water + u.bound_water == pytest.approx(s.water, rel=1e-12)
    assert u.solution.water == pytest.approx(u.unfrozen_water, rel=1e-15)
    # the unfrozen liquid is exactly at its own freezing point (equilibrium identity)
    assert cg.freezing_point(u.solution) == pytest.approx(263.15, rel=1e-9)


def test_water_activity_and_osmotic_coefficient():
    s = cg.Solution.from_molalities({"glucose": 1e-5})
    assert cg.osmotic_coefficient(s, 298.15) == pytest.approx(1.0, abs=1e-5)  # limit law
    aw = cg.water_activity(cg.Solution.from_mass_fractions({"sucrose": 0.5}), 298.15)
    assert 0.0 < aw < 1.0


@pytest.mark.parametrize(
    "build, field",
    [
        (lambda: cg.Solution(water=1.0, solutes={"sucrose": -0.1}), "solutes['sucrose']"),
        (lambda: cg.Solution(water=1.0, solutes={"sucrose": float("nan")}), "finite"),
        (lambda: cg.Solution.from_mass_fractions({"sucrose": 0.7, "glucose": 0.4}), "sum of solute mass fractions"),
        (lambda: cg.Solution.from_mass_fractions({"sucrose": 20}), "[0, 1)"),
        (lambda: cg.Solution.from_molalities({"sucrse": 1.0}), "'sucrose'"),
        (lambda: cg.Solution.from_molalities({"sucrose": "lots"}), "must be a number"),
        (lambda: cg.freezing_point(cg.Solution.from_brix(10), model="pitzr"), "valid models"),
        (lambda: cg.ice_fraction(cg.Solution.from_brix(10), -5.0), "temperature"),
        (lambda: cg.freezing_point(cg.Solution.from_brix(10), range_policy="loose"), "range_policy"),
    ],
)
def test_bad_input_names_field_and_range(build, field):
    with pytest.raises(cg.InvalidInputError) as err:
        build()
    assert field in str(err.value)
    assert isinstance(err.value, ValueError)


def test_out_of_range_policies():
    strong = cg.Solution.from_mass_fractions({"ethanol": 0.75})  # above its 0.68
    with pytest.warns(cg.OutOfValidityRangeWarning, match="ethanol"):
        value = cg.water_activity(strong, 298.15)
    assert math.isfinite(value)
    with pytest.warns(cg.OutOfValidityRangeWarning):
        assert math.isnan(cg.water_activity(strong, 298.15, range_policy="nan"))
    with pytest.raises(cg.OutOfValidityRangeError, match="ethanol"):
        cg.water_activity(strong, 298.15, range_policy="raise")


def test_ice_fraction_warns_once_with_count():
    s = cg.Solution.from_mass_fractions({"sucrose": 0.3})
    with pytest.warns(cg.OutOfValidityRangeWarning, match="value\\(s\\) outside"):
        cg.ice_fraction(s, np.linspace(270.0, 225.0, 10))


def test_solute_table_and_citations():
    table = cg.solutes()
    for solute in ["sucrose", "glucose", "fructose", "lactose", "maltose", "glycerol",
                   "sorbitol", "xylitol", "erythritol", "propylene_glycol", "ethanol",
                   "citric_acid", "lactic_acid", "sodium_chloride", "potassium_chloride",
                   "calcium_chloride"]:
        assert solute in table.index
    keys = set(cg.citations().index)
    for col in ["molar_mass_source", "norrish_source"]:
        used = {k for k in table[col] if k}
        assert used <= keys, used - keys
    assert cg.citation("murphy_koop_2005")["year"] == 2005
    assert "Norrish" in cg.describe_model(cg.Solution.from_brix(20))


def test_bound_signatures_name_python_types_only():
    # The binding areas register in any order (bindings/declare_types.cpp declares every
    # class first): no signature of the compiled module falls back to a C++ type name.
    import inspect

    from colligate import _core

    texts = []
    for name, obj in vars(_core).items():
        doc = getattr(obj, "__doc__", None) or ""
        texts.append(doc)
        if inspect.isclass(obj):
            texts.extend((getattr(v, "__doc__", None) or "") for v in vars(obj).values())
    joined = "\n".join(texts)
    assert "colligate::" not in joined and "std::" not in joined
