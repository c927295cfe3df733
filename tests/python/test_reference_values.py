"""Published check values, computed independently of the C++ code where possible."""
from __future__ import annotations

import numpy as np
import pytest
from reference_packages import reference_package

import colligate as cg

T0 = 273.15
R = 8.314462618


def murphy_koop_ratio(T):
    """p_ice / p_liquid from Murphy & Koop (2005) eqs. 7 and 10, carried to one atmosphere
    by the Poynting factor with molar volumes 1.9652e-5 (ice, Feistel & Wagner 2006) and
    1.8018e-5 m3/mol (liquid, IAPWS-95)."""
    ln_ice = 9.550426 - 5723.265 / T + 3.53068 * np.log(T) - 0.00728332 * T
    ln_liq = (54.842763 - 6763.22 / T - 4.210 * np.log(T) + 0.000367 * T
              + np.tanh(0.0415 * (T - 218.8))
              * (53.878 - 1331.22 / T - 9.44523 * np.log(T) + 0.014025 * T))
    return np.exp(ln_ice - ln_liq + (1.9652e-5 - 1.8018e-5) * 101325.0 / (R * T))


def test_ice_water_activity_vs_murphy_koop_to_minus_40():
    # Murphy & Koop (2005) Q. J. R. Meteorol. Soc. 131, 1539; required within 2e-4 in a_w.
    T = np.linspace(T0 - 40.0, T0, 161)
    worst = np.max(np.abs(cg.water_activity_of_ice(T) - murphy_koop_ratio(T)))
    assert worst < 2e-4


# Tolerances, each with its basis (the rows include those the fitted constants were fitted
# to, so for maltose, glycerol and ethanol this shows the fit holds; held-out rows are
# checked alone in tests/cpp/validation/):
#   sucrose, glucose, fructose 0.2 K: a named limitation, one temperature-independent
#     Norrish constant taken from the literature (Chirife et al. 1980) over 0-42 wt%; the
#     K x^2 term alone is worth 1.1 K for sucrose at 42 wt% and 0.4 K for glucose at 30 wt%;
#   maltose 0.1 K, glycerol 0.05 K: the fit's stated worst deviation (0.051 and 0.019 K,
#     data/detail/builtin_solutes.inc), plus 0.01 K, the CRC's printed resolution, plus
#     0.02 K, the ice line's agreement with Murphy & Koop (2005) (2e-4 in a_w). Glycerol's
#     0.5 and 1 wt% rows lie outside the fit (2-40 wt%) and below the dilute limit
#     (0.07 K printed at 0.5 wt% where Kf m = 1.86 x 0.0546 = 0.10 K): the model is 0.032 K
#     off there, inside the same 0.05 K; achieved on the fitted range 0.019 K;
#   ethanol 0.4 K: the fit's stated worst deviation 0.35 K over 0.5-68 wt% plus 0.05 K for
#     the rounding of the published depressions (as tests/python/test_ethanol.py).
@pytest.mark.parametrize(
    "solute, top, tol",
    [("sucrose", 42, 0.2), ("glucose", 30, 0.2), ("fructose", 28, 0.2), ("maltose", 44, 0.1),
     ("glycerol", 40, 0.05), ("ethanol", 40, 0.4)],
)
def test_crc_freezing_points(crc_freezing, solute, top, tol):
    # CRC Handbook 102nd ed. (2021), concentrative properties (source_key per row).
    rows = crc_freezing[(crc_freezing.solute == solute) & (crc_freezing.mass_percent <= top)]
    assert len(rows) >= 15
    assert set(rows.source_key) == {"crc_concentrative"}
    predicted = np.array([
        T0 - cg.freezing_point(cg.Solution.from_mass_fractions({solute: w / 100}))
        for w in rows.mass_percent
    ])
    worst = np.max(np.abs(predicted - rows.depression_K.to_numpy()))
    assert worst < tol, f"{solute}: worst deviation {worst:.3f} K"


def test_ideal_model_cryoscopic_constant():
    # Kf = 1.86 K kg/mol (common practice) in the dilute limit.
    m = 0.005
    s = cg.Solution.from_molalities({"glucose": m})
    assert (T0 - cg.freezing_point(s, model="ideal")) / m == pytest.approx(1.86, rel=5e-3)
    for model in ("raoult", "norrish"):
        assert cg.freezing_point(s, model=model) == pytest.approx(cg.freezing_point(s, model="ideal"), abs=2e-5)


def test_propylene_glycol_vs_melinder_via_coolprop():
    # External reference: Melinder (2010) propylene glycol-water freezing curve as fitted in
    # CoolProp (INCOMP::MPG, T_freeze). Our constants were fitted to it (5-40 wt%); this
    # checks the implementation reproduces the fit within 0.2 K.
    PropsSI = reference_package("CoolProp.CoolProp").PropsSI

    for w in (0.05, 0.15, 0.25, 0.35, 0.40):
        ref = PropsSI("T_freeze", "T", 300, "P", 101325, f"INCOMP::MPG[{w:g}]")
        ours = cg.freezing_point(cg.Solution.from_mass_fractions({"propylene_glycol": w}))
        assert ours == pytest.approx(ref, abs=0.2), w
