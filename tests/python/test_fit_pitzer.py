"""colligate.fit.fit_pitzer: NaCl refit vs Pitzer & Mayorga (1973), scipy agreement, the
fitted salt in calculations, bad data, CLI."""
from __future__ import annotations

import math
import pathlib

import numpy as np
import pandas as pd
import pytest
from scipy.optimize import least_squares

import colligate as cg
from colligate import cli, fit

REFERENCE = pathlib.Path(__file__).resolve().parents[1] / "reference"
MW = cg._core.MOLAR_MASS_WATER

# Pitzer & Mayorga (1973), Table 2, NaCl at 25 C, fitted to 6 mol/kg (values from memory;
# the harvie_1984 set adopts them).
PITZER_MAYORGA_NACL = {"beta0": 0.0765, "beta1": 0.2664, "cphi": 0.00127}


def nacl_table():
    """Hamer & Wu (1972), NaCl osmotic coefficients at 25 C, 0.1-6 mol/kg (values from
    memory; tests/reference/nacl_osmotic_coefficients_25c.csv, the table of
    tests/cpp/models/test_pitzer.cpp)."""
    t = pd.read_csv(REFERENCE / "nacl_osmotic_coefficients_25c.csv")
    assert set(t.source_key) == {"hamer_wu_1972"}
    assert t.note.str.contains("from memory").all()
    return t.molality_mol_per_kg.to_numpy(), t.osmotic_coefficient.to_numpy()


def crc_nacl_freezing(max_molality=4.1):
    """CRC Handbook (102nd ed., 2021) NaCl freezing-point depressions (crc_concentrative)."""
    t = pd.read_csv(REFERENCE / "crc_freezing_points.csv", keep_default_na=False)
    t = t[(t.solute == "sodium_chloride") & (t.molality_mol_per_kg <= max_molality)]
    assert set(t.source_key) == {"crc_concentrative"}
    return t.molality_mol_per_kg.to_numpy(), cg._core.ICE_POINT - t.depression_K.to_numpy()


def core_aphi(T=298.15):
    """A_phi the core uses for NaCl, from a salt record with all parameters zero: then
    phi - 1 = -A_phi sqrt(m) / (1 + 1.2 sqrt(m)) for a 1:1 salt (Pitzer 1991, identity)."""
    rec = cg._core.make_pitzer_solute_record("NaCl", "zero_nacl", "", 0.0, 0.0, 0.0,
                                             max_molality=10.0, min_temperature=200.0,
                                             max_temperature=400.0)
    lib = fit.SoluteLibrary()
    lib.add(rec)
    s = cg.Solution.from_molalities({"zero_nacl": 1.0}, table=lib)
    phi = cg.osmotic_coefficient(s, T, model="pitzer")
    return (1.0 - phi) * (1.0 + 1.2)


def phi_1_1(m, p, aphi):
    """Pitzer (1973) osmotic coefficient of a 1:1 salt, alpha = 2, b = 1.2 (written here
    independently of the C++ kernel)."""
    sm = np.sqrt(m)
    return 1 - aphi * sm / (1 + 1.2 * sm) + m * (p[0] + p[1] * np.exp(-2 * sm)) + m * m * p[2]


def test_nacl_refit_reproduces_pitzer_mayorga_within_95_percent_intervals():
    # Pitzer & Mayorga give no standard errors; our 95 % Student-t intervals from nine
    # four-decimal points over their 0.1-6 mol/kg range must contain their values (the
    # intervals also absorb our A_phi against their 0.392). The fit reproduces the table
    # within 0.002 in phi (twice their sigma of 0.001).
    m, phi = nacl_table()
    res = fit.fit_pitzer("NaCl", m, osmotic_coefficient=phi, T=298.15)
    assert res.success, res.message
    assert list(res.params) == ["beta0", "beta1", "cphi"]
    ci = res.ci(0.95)
    for name, published in PITZER_MAYORGA_NACL.items():
        assert ci.loc[name, "lower"] <= published <= ci.loc[name, "upper"], (name, res.params[name])
    assert np.max(np.abs(res.residuals)) < 0.002
    s = res.summary()
    assert s.loc["cphi", "unit"] == "kg^2/mol^2" and s.attrs["degrees_of_freedom"] == 6


def test_core_kernel_matches_the_independent_1_1_formula():
    # Identity: the fitted values at the data points equal phi_1_1 with the fitted
    # parameters and the core's A_phi (rel 1e-12, rounding of a few terms).
    m, phi = nacl_table()
    res = fit.fit_pitzer("NaCl", m, osmotic_coefficient=phi)
    p = [res.params[k] for k in ("beta0", "beta1", "cphi")]
    np.testing.assert_allclose(res.fitted, phi_1_1(m, p, core_aphi()), rtol=1e-12)
    # A_phi at 25 C: 0.3915 (Pitzer 1991, from memory), abs 1e-3 covering the correlations
    # colligate's parameter sets use.
    assert core_aphi() == pytest.approx(0.3915, abs=1e-3)


def test_osmotic_fit_agrees_with_scipy_least_squares():
    # Same data, same model (independent formula), same start: optima within 1e-6 relative
    # (the requirement); covariance s^2 (J^T J)^-1 from scipy's Jacobian: standard errors
    # within 1e-5 (MINPACK forward differences, relative error about 1e-8).
    m, phi = nacl_table()
    ours = fit.fit_pitzer("NaCl", m, osmotic_coefficient=phi)
    aphi = core_aphi()
    ref = least_squares(lambda p: phi_1_1(m, p, aphi) - phi, [0.1, 0.3, 0.0], method="lm",
                        xtol=1e-15, ftol=1e-15, gtol=1e-15)
    ours_p = np.array([ours.params[k] for k in ("beta0", "beta1", "cphi")])
    np.testing.assert_allclose(ours_p, ref.x, rtol=1e-6)
    J = ref.jac
    s2 = np.sum(ref.fun**2) / (len(m) - 3)
    se = np.sqrt(np.diag(s2 * np.linalg.inv(J.T @ J)))
    np.testing.assert_allclose([ours.stderr[k] for k in ("beta0", "beta1", "cphi")], se, rtol=1e-5)


def test_water_activity_fit_agrees_with_scipy_least_squares():
    # phi -> a_w by ln a_w = -2 M_w m phi (Robinson & Stokes 1959, definition); rel 1e-6.
    m, phi = nacl_table()
    aw = np.exp(-2 * MW * m * phi)
    # Converted to a_w the same table weights the dilute rows less, and beta0 and C-phi come out
    # correlated beyond |r| = 0.99 (-0.9925; -0.982 from the osmotic coefficients): the fit
    # says so (colligate.PoorlyDeterminedFitWarning, test_uncertainty.py).
    with pytest.warns(cg.PoorlyDeterminedFitWarning, match="beta0 and cphi"):
        ours = fit.fit_pitzer("sodium chloride", m, water_activity=aw, T=298.15)
    assert ours.success
    aphi = core_aphi()
    ref = least_squares(lambda p: np.exp(-2 * MW * m * phi_1_1(m, p, aphi)) - aw,
                        [0.1, 0.3, 0.0], method="lm", xtol=1e-15, ftol=1e-15, gtol=1e-15)
    np.testing.assert_allclose([ours.params[k] for k in ("beta0", "beta1", "cphi")], ref.x, rtol=1e-6)


def test_freezing_point_fit_agrees_with_scipy_least_squares():
    # CRC NaCl freezing points to 4 mol/kg (crc_concentrative). scipy gets the same model:
    # colligate's freezing point of a salt record carrying the trial parameters. rel 1e-6
    # (the requirement); 3-point differences in scipy because the model is a root solve.
    m, tf = crc_nacl_freezing()
    with pytest.warns(cg.PoorlyDeterminedFitWarning):  # freezing points alone (test_uncertainty.py)
        ours = fit.fit_pitzer("NaCl", m, freezing_point=tf)
    assert ours.success, ours.message

    def model(p):
        rec = cg._core.make_pitzer_solute_record("NaCl", "trial", "", *p, max_molality=10.0,
                                                 min_temperature=200.0, max_temperature=400.0)
        lib = fit.SoluteLibrary()
        lib.add(rec)
        # The data and the fitter are ice freezing points of the liquid as given: metastable
        # (a trial parameter set may saturate hydrohalite first, where the default freezing
        # point would be the salt's crystallisation temperature instead).
        return np.array([cg.freezing_point(cg.Solution.from_molalities({"trial": mi}, table=lib),
                                           model="pitzer", metastable=True) for mi in m])

    import warnings

    with warnings.catch_warnings():
        warnings.simplefilter("ignore", cg.OutOfValidityRangeWarning)  # trial range only
        ref = least_squares(lambda p: model(p) - tf, [0.1, 0.3, 0.0], method="lm", jac="3-point",
                            xtol=1e-14, ftol=1e-14, gtol=1e-14)
    np.testing.assert_allclose([ours.params[k] for k in ("beta0", "beta1", "cphi")], ref.x, rtol=1e-6)
    # The CRC depressions are printed to 0.01 K: the fit reproduces them within 0.05 K.
    assert np.max(np.abs(ours.residuals)) < 0.05


def test_fitted_salt_is_used_through_a_library_not_global_state(tmp_path):
    m, phi = nacl_table()
    res = fit.fit_pitzer("NaCl", m, osmotic_coefficient=phi)
    fs = res.as_solute("lab NaCl")
    assert fs.record.kind == "electrolyte" and fs.record.pitzer["max_molality"] == 6.0
    # data at 298.15 K only: valid 293.15-303.15 K (5 K margin, colligate's choice)
    assert fs.record.pitzer["min_temperature"] == pytest.approx(293.15)
    lib = fit.SoluteLibrary([fs])
    s = cg.Solution.from_molalities({"lab NaCl": 2.0}, table=lib)
    # identity: phi at 2 mol/kg equals the fit's fitted value (row 4), rel 1e-12
    assert cg.osmotic_coefficient(s, 298.15, model="pitzer") == pytest.approx(res.fitted[4], rel=1e-12)
    # built-in NaCl still resolves in the same library, and differs by < 0.005 in phi (both
    # describe NaCl at 25 C; the accuracy asked in tests/cpp/models/test_pitzer.cpp)
    builtin = cg.Solution.from_molalities({"NaCl": 2.0}, table=lib)
    assert cg.osmotic_coefficient(s, 298.15, model="pitzer") == pytest.approx(
        cg.osmotic_coefficient(builtin, 298.15, model="pitzer"), abs=0.005)
    assert "colligate_fit_user" in cg.describe_model(s, "pitzer")
    with pytest.raises(ValueError, match="unknown solute"):
        cg.Solution.from_molalities({"lab NaCl": 2.0})  # not registered globally
    # 25 C-only parameters used at the freezing point are flagged
    with pytest.warns(cg.OutOfValidityRangeWarning, match="lab_nacl"):
        cg.freezing_point(s)
    path = fs.save(tmp_path / "lab_nacl.toml")
    back = fit.load_solute(path)
    assert back.record.pitzer == fs.record.pitzer and back.salt == "sodium_chloride"
    lib2 = fit.SoluteLibrary()
    lib2.load(path)
    s2 = cg.Solution.from_molalities({"lab_nacl": 2.0}, table=lib2)
    assert cg.osmotic_coefficient(s2, 298.15, model="pitzer") == cg.osmotic_coefficient(
        s, 298.15, model="pitzer")


def test_temperature_terms_from_water_activity_at_three_temperatures():
    # Identity: a_w from a record with invented slopes (common practice magnitudes for 1:1
    # salts, 1e-4 to 1e-3 per K) at 263.15, 280.65 and 298.15 K (inside the spencer_1990 set's range); the fit returns all six
    # parameters (rel 1e-6). With one temperature only, the slopes are flagged singular.
    truth = dict(beta0=0.0765, beta1=0.2664, cphi=0.00127, dbeta0_dT=7e-4, dbeta1_dT=1e-3,
                 dcphi_dT=-1e-4)
    rec = cg._core.make_pitzer_solute_record("NaCl", "nacl_t", "", truth["beta0"], truth["beta1"],
                                             truth["cphi"], dbeta0_dT=truth["dbeta0_dT"],
                                             dbeta1_dT=truth["dbeta1_dT"], dcphi_dT=truth["dcphi_dT"],
                                             max_molality=6.0, min_temperature=258.15,
                                             max_temperature=303.15)
    lib = fit.SoluteLibrary()
    lib.add(rec)
    rows = [(mi, T) for T in (263.15, 280.65, 298.15) for mi in (0.2, 0.5, 1.0, 2.0, 3.0, 4.0)]
    m = np.array([r[0] for r in rows])
    T = np.array([r[1] for r in rows])
    aw = np.array([cg.water_activity(cg.Solution.from_molalities({"nacl_t": mi}, table=lib), Ti,
                                     model="pitzer") for mi, Ti in rows])
    res = fit.fit_pitzer("NaCl", m, water_activity=aw, T=T, temperature_terms=True)
    assert res.success, res.message
    for k, v in truth.items():
        assert res.params[k] == pytest.approx(v, rel=1e-6), k
    fs = res.as_solute("nacl with slopes")
    assert fs.record.pitzer["min_temperature"] == pytest.approx(258.15)
    one_t = fit.fit_pitzer("NaCl", m[T == 298.15], water_activity=aw[T == 298.15],
                           temperature_terms=True)
    assert one_t.status == "singular" and not one_t.success
    assert math.isnan(one_t.stderr["dbeta0_dT"])


def test_bad_data_gives_clear_errors():
    m, phi = nacl_table()
    with pytest.raises(ValueError, match="number of data points"):
        fit.fit_pitzer("NaCl", m[:2], osmotic_coefficient=phi[:2])
    bad = m.copy()
    bad[3] = np.nan
    with pytest.raises(ValueError, match="molality in data row 3"):
        fit.fit_pitzer("NaCl", bad, osmotic_coefficient=phi)
    with pytest.raises(ValueError, match="unknown solute 'NaCI'; nearest known names"):
        fit.fit_pitzer("NaCI", m, osmotic_coefficient=phi)
    with pytest.raises(ValueError, match="non-electrolyte"):
        fit.fit_pitzer("sucrose", m, osmotic_coefficient=phi)
    with pytest.raises(ValueError, match="exactly one"):
        fit.fit_pitzer("NaCl", m, osmotic_coefficient=phi, water_activity=phi / 2)
    with pytest.raises(ValueError, match="2:2"):
        fit.fit_pitzer("NaCl", m, osmotic_coefficient=phi, beta2=True)
    with pytest.raises(ValueError, match="temperature has 2 values"):
        fit.fit_pitzer("NaCl", m, osmotic_coefficient=phi, T=[298.15, 273.15])
    res = fit.fit_pitzer("NaCl", m, osmotic_coefficient=phi)
    with pytest.raises(ValueError, match="molar_mass is taken from the salt"):
        res.as_solute("x", molar_mass=0.058)


def test_cli_fit_pitzer(tmp_path, capsys):
    m, phi = nacl_table()
    data = tmp_path / "nacl.csv"
    pd.DataFrame({"molality": m, "osmotic_coefficient": phi}).to_csv(data, index=False)
    solute = tmp_path / "nacl.toml"
    rc = cli.main(["fit", str(data), "--model", "pitzer", "--salt", "NaCl",
                   "--save-solute", str(solute), "--name", "lab NaCl"])
    out = capsys.readouterr().out
    assert rc == cli.EXIT_OK
    assert "beta0" in out and "cphi" in out and "status: converged" in out
    assert (tmp_path / "nacl_fit.png").read_bytes()[:4] == b"\x89PNG"
    assert fit.load_solute(solute).record.pitzer is not None
    assert cli.main(["fit", str(data), "--model", "pitzer"]) == cli.EXIT_ERROR
    assert "--salt is required" in capsys.readouterr().err
