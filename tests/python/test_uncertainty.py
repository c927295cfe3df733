"""Predictions with their standard uncertainty (colligate.uncertainty): a fitted solute
keeps its covariance (also through its TOML file), the scalar functions take
``with_uncertainty``, linear propagation agrees with Monte Carlo, and fits warn when their
constants are poorly determined."""
from __future__ import annotations

import json
import math
import pathlib
import tomllib
import warnings

import numpy as np
import pandas as pd
import pytest

import colligate as cg
from colligate import fit

REFERENCE = pathlib.Path(__file__).resolve().parents[1] / "reference"
SUCROSE_M = 0.3422965  # kg/mol (C12H22O11, IUPAC atomic weights; common practice)


def crc_rows(solute, max_percent):
    """CRC Handbook (102nd ed., 2021), concentrative properties (crc_concentrative):
    molality and freezing point of a binary solution."""
    t = pd.read_csv(REFERENCE / "crc_freezing_points.csv", keep_default_na=False)
    t = t[(t.solute == solute) & (t.mass_percent <= max_percent)]
    assert set(t.source_key) == {"crc_concentrative"}
    return t.molality_mol_per_kg.to_numpy(), cg._core.ICE_POINT - t.depression_K.to_numpy()


@pytest.fixture(scope="module")
def sucrose_fit():
    m, tf = crc_rows("sucrose", 42.0)
    res = fit.fit_norrish(m, freezing_point=tf)
    assert res.success
    return res


@pytest.fixture(scope="module")
def my_sucrose(sucrose_fit):
    fs = sucrose_fit.as_solute("my sucrose", molar_mass=SUCROSE_M)
    return fs, fit.SoluteLibrary([fs])


def test_fitted_record_keeps_covariance_and_dof(sucrose_fit, my_sucrose):
    fs, _ = my_sucrose
    u = fs.record.uncertainty
    assert u["names"] == ["norrish_k"]
    assert u["degrees_of_freedom"] == sucrose_fit.degrees_of_freedom
    assert u["source"] == "colligate_fit_user"
    np.testing.assert_array_equal(u["covariance"], sucrose_fit.covariance.to_numpy())


def test_toml_round_trip_keeps_the_covariance(my_sucrose, tmp_path):
    fs, lib = my_sucrose
    path = tmp_path / "my_sucrose.toml"
    fs.save(path)
    doc = tomllib.loads(path.read_text())
    assert doc["version"] == 3 and doc["solute"]["uncertainty"]["names"] == ["norrish_k"]
    back = fit.load_solute(path)
    np.testing.assert_array_equal(back.record.uncertainty["covariance"], fs.record.uncertainty["covariance"])
    assert back.record.uncertainty["degrees_of_freedom"] == fs.record.uncertainty["degrees_of_freedom"]
    s1 = cg.Solution.from_mass_fractions({"my sucrose": 0.35}, table=lib)
    s2 = cg.Solution.from_mass_fractions({"my sucrose": 0.35}, table=fit.SoluteLibrary([back]))
    a = cg.freezing_point(s1, with_uncertainty=True)
    b = cg.freezing_point(s2, with_uncertainty=True)
    assert (a.value, a.std, a.degrees_of_freedom) == (b.value, b.std, b.degrees_of_freedom)


def test_toml_covariance_errors_name_the_key(my_sucrose, tmp_path):
    fs, _ = my_sucrose
    doc = fs.document()
    doc["solute"]["uncertainty"]["covariance"] = [[1.0, 2.0]]
    with pytest.raises(cg.InvalidInputError, match=r"\[solute.uncertainty\] covariance"):
        fit.solute_from_document(doc, "test file")
    doc = fs.document()
    doc["solute"]["uncertainty"]["names"] = ["beta7"]
    with pytest.raises(cg.InvalidInputError, match="beta7"):
        fit.solute_from_document(doc, "test file")
    doc = fs.document()
    doc["solute"]["uncertainty"]["covariance"] = [[-1.0]]
    with pytest.raises(cg.InvalidInputError, match="variance"):
        fit.solute_from_document(doc, "test file")


def test_library_file_keeps_the_covariance(my_sucrose, tmp_path):
    fs, _ = my_sucrose
    lib = cg.Library([fs])
    path = tmp_path / "house.toml"
    lib.save(path)
    back = cg.Library.load(path)
    rec = back.solute_table.find("my sucrose")
    np.testing.assert_array_equal(rec.uncertainty["covariance"], fs.record.uncertainty["covariance"])


def test_with_uncertainty_on_every_scalar_function(my_sucrose):
    _, lib = my_sucrose
    # 20 wt%, ice fraction at -3 C: the unfrozen phase (about 34 wt%) stays inside the fitted
    # range (CRC rows to 42 wt%), so no range warning is expected
    s = cg.Solution.from_mass_fractions({"my sucrose": 0.20}, table=lib)
    for f, args in ((cg.freezing_point, ()), (cg.water_activity, (298.15,)),
                    (cg.osmotic_coefficient, (298.15,)), (cg.ice_fraction, (270.15,))):
        plain = f(s, *args)
        r = f(s, *args, with_uncertainty=True)
        assert r.value == plain, f.__name__  # the same prediction, bit for bit
        assert r.std > 0.0 and r.constants == ["my_sucrose.norrish_k"] and r.not_stated == []
        lo, hi = r.ci(0.95)
        # Student t with the fit's degrees of freedom (covariance from a fit)
        k = cg._core.coverage_factor(0.95, r.degrees_of_freedom)
        assert r.degrees_of_freedom > 0
        assert (hi - lo) == pytest.approx(2 * k * r.std, rel=1e-12)
        lo99, hi99 = r.ci(0.99)
        assert lo99 < lo and hi < hi99
    arr = cg.ice_fraction(s, np.array([272.0, 270.65, 270.15]), with_uncertainty=True)
    assert arr.value.shape == (3,) and arr.std[0] == 0.0 and np.all(arr.std[1:] > 0.0)


def test_coverage_factors_match_tables():
    # t(0.975, 10) = 2.2281 and z(0.975) = 1.9600 (common practice: any statistics table).
    assert cg._core.coverage_factor(0.95, 10) == pytest.approx(2.2281, abs=1e-4)
    assert cg._core.coverage_factor(0.95, 0) == pytest.approx(1.9600, abs=1e-4)


def test_builtin_solutes_state_no_uncertainty():
    # Chirife et al. (1980)'s sucrose K comes without a standard uncertainty: "not stated"
    assert cg.SoluteLibrary().find("sucrose").uncertainty is None
    s = cg.Solution.from_mass_fractions({"sucrose": 0.3})
    r = cg.freezing_point(s, with_uncertainty=True)
    assert r.std == 0.0 and r.not_stated == ["sucrose"] and r.constants == []
    assert r.value == cg.freezing_point(s)
    table = cg.solutes()
    assert table.loc["sucrose", "constant_uncertainty"] == "not stated"
    assert table.loc["sodium_chloride", "constant_uncertainty"] == "not stated"


def test_builtin_solutes_fitted_by_colligate_state_their_fit_uncertainty():
    # Maltose's K is colligate's fit to the CRC Handbook rows marked used_in_fit
    # (tools/fit_crc_norrish.py --covariance: u(K) = 0.102 with 16 degrees of freedom); the
    # same fit by the C++ fitter on those rows is checked in test_prediction_uncertainty.cpp.
    rec = cg.SoluteLibrary().find("maltose")
    assert rec.uncertainty["names"] == ["norrish_k"]
    assert rec.uncertainty["degrees_of_freedom"] == 16
    assert rec.uncertainty["source"] == "colligate_fit_crc"
    assert "u(norrish_k) = 0.102" in cg.solutes().loc["maltose", "constant_uncertainty"]
    s = cg.Solution.from_mass_fractions({"maltose": 0.3, "sucrose": 0.1})
    r = cg.freezing_point(s, with_uncertainty=True)
    assert r.constants == ["maltose.norrish_k"] and r.not_stated == ["sucrose"]
    assert r.std > 0.0 and r.degrees_of_freedom == 16


def test_linear_and_monte_carlo_agree_within_5_percent(my_sucrose):
    # The acceptance check on a fitted sucrose-like solute (10^5 draws, seed 7).
    _, lib = my_sucrose
    s = cg.Solution.from_mass_fractions({"my sucrose": 0.40}, table=lib)
    lin = cg.freezing_point(s, with_uncertainty=True)
    mc = cg.uncertainty.propagate(s, "freezing_point", method="monte_carlo", draws=100_000, seed=7)
    assert mc.std == pytest.approx(lin.std, rel=0.05)
    w_mc = np.subtract(*mc.ci(0.95)[::-1])
    z = cg._core.coverage_factor(0.95, 0)
    assert w_mc == pytest.approx(2 * z * lin.std, rel=0.05)
    again = cg.uncertainty.propagate(s, "freezing_point", method="monte_carlo", draws=1000, seed=7)
    same = cg.uncertainty.propagate(s, "freezing_point", method="monte_carlo", draws=1000, seed=7)
    assert again.std == same.std  # seeded: reproducible


def test_errors_name_the_input(my_sucrose):
    _, lib = my_sucrose
    s = cg.Solution.from_mass_fractions({"my sucrose": 0.30}, table=lib)
    with pytest.raises(cg.InvalidInputError, match="with_uncertainty"):
        cg.freezing_point(s, with_uncertainty="bootstrap")
    with pytest.raises(cg.InvalidInputError, match="model 'raoult'.*Monte Carlo"):
        cg.freezing_point(s, model="raoult", with_uncertainty=True)
    with pytest.raises(cg.InvalidInputError, match="level"):
        cg.freezing_point(s, with_uncertainty=True).ci(1.5)


def nacl_osmotic():
    """Hamer & Wu (1972), NaCl osmotic coefficients at 25 C, 0.1-6 mol/kg (from memory;
    tests/reference/nacl_osmotic_coefficients_25c.csv)."""
    t = pd.read_csv(REFERENCE / "nacl_osmotic_coefficients_25c.csv")
    assert set(t.source_key) == {"hamer_wu_1972"}
    return t.molality_mol_per_kg.to_numpy(), t.osmotic_coefficient.to_numpy()


def test_correlation_warning_fires_on_freezing_point_only_pitzer_fit():
    # CRC NaCl freezing points to 4.1 mol/kg: beta0, beta1 and C-phi from one kind of data
    # over a narrow temperature band are not separately determined.
    m, tf = crc_rows("sodium_chloride", 100.0)
    m, tf = m[m <= 4.1], tf[m <= 4.1]
    with pytest.warns(cg.PoorlyDeterminedFitWarning, match="correlated|spans zero"):
        res = fit.fit_pitzer("NaCl", m, freezing_point=tf)
    assert res.poorly_determined()
    corr = res.correlation
    assert list(corr.columns) == ["beta0", "beta1", "cphi"]
    np.testing.assert_allclose(np.diag(corr.to_numpy()), 1.0, rtol=1e-12)


def test_no_warning_on_wide_range_osmotic_fit():
    m, phi = nacl_osmotic()
    with warnings.catch_warnings():
        warnings.simplefilter("error", cg.PoorlyDeterminedFitWarning)
        res = fit.fit_pitzer("NaCl", m, osmotic_coefficient=phi)
    assert res.success and res.poorly_determined() == []


def test_propagation_with_a_non_default_parameter_set():
    # with_uncertainty carries the caller's Pitzer set (issue 12): a fitted salt (its own
    # Na-Cl row, with covariance) mixed with KCl, whose row, the Na-K mixing terms and A_phi
    # come from the set. With harvie_1984 the value is that set's, not the default's, and the
    # linear path and Monte Carlo (10^5 draws, seed 11) agree within 5 % of the standard
    # uncertainty, as for the default set in the test below.
    m, phi = nacl_osmotic()
    salt = fit.fit_pitzer("NaCl", m, osmotic_coefficient=phi).as_solute("my salt")
    s = cg.Solution.from_molalities({"my salt": 2.0, "KCl": 1.0}, table=fit.SoluteLibrary([salt]))
    plain = cg.osmotic_coefficient(s, model="pitzer", parameter_set="harvie_1984")
    assert plain != cg.osmotic_coefficient(s, model="pitzer")
    lin = cg.osmotic_coefficient(s, model="pitzer", parameter_set="harvie_1984", with_uncertainty=True)
    mc = cg.osmotic_coefficient(s, model="pitzer", parameter_set="harvie_1984",
                                with_uncertainty="monte_carlo")
    assert lin.value == mc.value == plain
    assert lin.std > 0.0
    assert mc.std == pytest.approx(lin.std, rel=0.05)
    aw_lin = cg.water_activity(s, 298.15, model="pitzer", parameter_set="harvie_1984", with_uncertainty=True)
    aw_mc = cg.water_activity(s, 298.15, model="pitzer", parameter_set="harvie_1984",
                              with_uncertainty="monte_carlo")
    assert aw_lin.value == cg.water_activity(s, 298.15, model="pitzer", parameter_set="harvie_1984")
    assert aw_mc.std == pytest.approx(aw_lin.std, rel=0.05)
    # a batch carries the set too: each row equals the scalar linear result bit for bit,
    # on one and two threads, and differs from the default set's
    from colligate.uncertainty import propagate

    table = fit.SoluteLibrary([salt])
    frame = pd.DataFrame({"my salt": [0.5, 2.0, 3.0], "KCl": [0.2, 1.0, 0.5]})
    batch = cg.SolutionBatch.from_molalities(frame, library=table)
    for threads in (1, 2):
        out = cg.batch.batch_with_uncertainty(batch, "water_activity", 298.15, model="pitzer",
                                              parameter_set="harvie_1984", threads=threads)
        for i, row in frame.iterrows():
            one = cg.Solution.from_molalities(row.to_dict(), table=table)
            ref = cg.water_activity(one, 298.15, model="pitzer", parameter_set="harvie_1984", with_uncertainty=True)
            assert out["water_activity"].iloc[i] == ref.value
            assert out["water_activity_std"].iloc[i] == ref.std
    default = cg.batch.batch_with_uncertainty(batch, "water_activity", 298.15, model="pitzer")
    assert not np.array_equal(default["water_activity"].to_numpy(), out["water_activity"].to_numpy())
    via_propagate = propagate(batch, "water_activity", 298.15, model="pitzer", parameter_set="harvie_1984")
    pd.testing.assert_frame_equal(via_propagate, out)
    with pytest.raises(cg.InvalidInputError, match="no_such_set"):
        cg.batch.batch_with_uncertainty(batch, "water_activity", 298.15, model="pitzer", parameter_set="no_such_set")


def test_fitted_salt_propagates_linearly_and_by_monte_carlo():
    # A salt fitted to the osmotic coefficients carries its Pitzer covariance; the linear
    # path (closed-form Pitzer sensitivities) and Monte Carlo (10^5 draws, seed 11) agree
    # within 5 % of the standard uncertainty and of the 95 % interval's width.
    m, phi = nacl_osmotic()
    res = fit.fit_pitzer("NaCl", m, osmotic_coefficient=phi)
    salt = res.as_solute("my salt")
    assert salt.record.uncertainty["names"] == ["beta0", "beta1", "cphi"]
    s = cg.Solution.from_molalities({"my salt": 2.0}, table=fit.SoluteLibrary([salt]))
    lin = cg.osmotic_coefficient(s, model="pitzer", with_uncertainty=True)
    mc = cg.osmotic_coefficient(s, model="pitzer", with_uncertainty="monte_carlo")
    assert lin.value == mc.value == cg.osmotic_coefficient(s, model="pitzer")
    # the fit reproduces its data within 0.002 (test_fit_pitzer.py): the band at 2 mol/kg,
    # inside the data, is of that order
    assert 1e-5 < lin.std < 2e-3
    assert mc.std == pytest.approx(lin.std, rel=0.05)
    lo, hi = mc.ci(0.95)
    k = 1.959964  # normal 97.5 % quantile (common practice)
    assert hi - lo == pytest.approx(2 * k * lin.std, rel=0.05)
    assert lin.degrees_of_freedom == res.degrees_of_freedom
    assert set(lin.sensitivities) == {"my_salt.beta0", "my_salt.beta1", "my_salt.cphi"}
    # the ice line of the fitted salt (its data are at 25 C: flagged as extrapolated)
    with pytest.warns(cg.OutOfValidityRangeWarning):
        tf = cg.freezing_point(s, model="pitzer", with_uncertainty=True)
    assert tf.std > 0.0
    # a salt + sugar mixture under the Ross rule takes the linear path too (the salt's
    # Pitzer sensitivities; built-in sucrose states no uncertainty and enters as exact)
    s2 = cg.Solution.from_molalities({"my salt": 1.0, "sucrose": 0.5}, table=fit.SoluteLibrary([salt]))
    aw2 = cg.water_activity(s2, model="ross", with_uncertainty=True)
    assert aw2.value == cg.water_activity(s2, model="ross")
    assert set(aw2.sensitivities) == {"my_salt.beta0", "my_salt.beta1", "my_salt.cphi"}
    assert aw2.std > 0.0
    # 'raoult' has no closed form: the error says what to use
    with pytest.raises(cg.InvalidInputError, match="Monte Carlo"):
        cg.water_activity(s2, model="raoult", with_uncertainty=True)


def test_ross_mixture_linear_against_monte_carlo_and_batch(sucrose_fit):
    # Salt + sugar under the Ross rule: the salt fitted to the Hamer & Wu (1972) NaCl
    # osmotic coefficients (nacl_osmotic) and the sucrose-like solute fitted to the CRC
    # sucrose freezing points to 42 wt% (crc_rows; crc_concentrative), both covariances
    # carried. Linear against Monte Carlo (2*10^4 draws, seed 5: the sample standard
    # deviation's own relative spread is 1/sqrt(2 N) = 0.5 %) within 5 %, as asked of the
    # C++ check with 10^5 draws; and the batch columns equal the scalar results (identity).
    m, phi = nacl_osmotic()
    salt = fit.fit_pitzer("NaCl", m, osmotic_coefficient=phi).as_solute("my salt")
    sugar = sucrose_fit.as_solute("my sucrose", molar_mass=SUCROSE_M)
    lib = fit.SoluteLibrary([salt, sugar])
    s = cg.Solution.from_molalities({"my salt": 0.5, "my sucrose": 0.6}, table=lib)
    for quantity, T in (("freezing_point", 298.15), ("ice_fraction", 263.15), ("water_activity", 298.15)):
        with warnings.catch_warnings():
            warnings.simplefilter("ignore", cg.OutOfValidityRangeWarning)  # salt fit: 25 C data
            lin = cg.uncertainty.propagate(s, quantity, T)
            mc = cg.uncertainty.propagate(s, quantity, T, method="monte_carlo", draws=20_000, seed=5)
        assert set(lin.sensitivities) == {"my_salt.beta0", "my_salt.beta1", "my_salt.cphi", "my_sucrose.norrish_k"}
        assert lin.std > 0.0
        assert mc.std == pytest.approx(lin.std, rel=0.05), quantity
        lo, hi = mc.ci(0.95)
        assert hi - lo == pytest.approx(2 * 1.959964 * lin.std, rel=0.05), quantity  # normal 97.5 % (common practice)
    rows = pd.DataFrame({"my salt": [0.2, 0.5, 1.0], "my sucrose": [0.3, 0.6, 0.2]})
    batch = cg.SolutionBatch.from_molalities(rows, library=lib)
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", cg.OutOfValidityRangeWarning)
        for threads in (1, 2):
            out = cg.batch.batch_with_uncertainty(batch, "freezing_point", threads=threads)
            for i in range(len(rows)):
                r = cg.freezing_point(cg.Solution.from_molalities(rows.iloc[i].to_dict(), table=lib),
                                      with_uncertainty=True)
                assert out["freezing_point_K"].iloc[i] == r.value
                assert out["freezing_point_K_std"].iloc[i] == r.std


def test_enthalpy_and_heat_load_carry_the_fitted_constant(sucrose_fit, my_sucrose):
    # Identity: the analytic sensitivity of the heat load to K equals a central difference
    # of the plain heat load with K -/+ h (rel 1e-4: h^2 term and the solvers' tolerances).
    # The food is invented: 20 % sucrose-like solids in water, cooled from -1 C to -3 C.
    _, lib = my_sucrose
    comp = {"water": 0.80, "carbohydrate": 0.20}
    s = cg.Solution.from_mass_fractions({"my sucrose": 0.20}, table=lib)
    hl = cg.heat_load(comp, s, 272.15, 270.15, with_uncertainty=True)
    assert hl.value == pytest.approx(cg.heat_load(comp, s, 272.15, 270.15)["total"], rel=1e-12)
    k = sucrose_fit.params["norrish_k"]

    def total(kk):
        rec = cg._core.make_solute_record("probe", "probe", SUCROSE_M, kk, 0.0, 0.42, "")
        probe = cg.Solution.from_mass_fractions({"probe": 0.20}, table=fit.SoluteLibrary([fit.FittedSolute(rec)]))
        return cg.heat_load(comp, probe, 272.15, 270.15)["total"]

    h = 1e-3 * k
    fd = (total(k + h) - total(k - h)) / (2 * h)
    assert hl.sensitivities["my_sucrose.norrish_k"] == pytest.approx(fd, rel=1e-4)
    assert hl.std == pytest.approx(abs(fd) * sucrose_fit.stderr["norrish_k"], rel=1e-4)
    h_u = cg.enthalpy(comp, s, 270.15, with_uncertainty=True)
    assert h_u.value == cg.enthalpy(comp, s, 270.15) and h_u.std > 0.0
    with pytest.raises(cg.InvalidInputError, match="monte_carlo"):
        cg.heat_load(comp, s, 272.15, 270.15, with_uncertainty="monte_carlo")


def test_recipe_methods_take_with_uncertainty(my_sucrose):
    # An invented recipe: 0.2 kg of the fitted syrup solids in 0.8 kg water.
    fs, _ = my_sucrose
    r = cg.Recipe(water=0.8, solutes={"my sucrose": 0.2}, library=cg.Library([fs]))
    tf = r.freezing_point(with_uncertainty=True)
    assert tf.value == r.freezing_point() and tf.std > 0.0
    assert r.ice_fraction(270.15, with_uncertainty=True).std > 0.0
    assert r.water_activity(with_uncertainty=True).value == r.water_activity()


def test_range_policy_applies_with_uncertainty(my_sucrose):
    # 50 wt% lies beyond the fitted solute's range (CRC rows to 42 wt%)
    _, lib = my_sucrose
    s = cg.Solution.from_mass_fractions({"my sucrose": 0.50}, table=lib)
    with pytest.warns(cg.OutOfValidityRangeWarning):
        r = cg.freezing_point(s, with_uncertainty=True)
    assert math.isfinite(r.value) and r.std > 0.0
    with pytest.raises(cg.OutOfValidityRangeError):
        cg.freezing_point(s, with_uncertainty=True, range_policy="raise")
    with pytest.warns(cg.OutOfValidityRangeWarning):
        r = cg.freezing_point(s, with_uncertainty=True, range_policy="nan")
    assert math.isnan(r.value) and math.isnan(r.std)
    with pytest.raises(cg.InvalidInputError, match="range_policy"):
        cg.freezing_point(s, with_uncertainty=True, range_policy="clip")


def test_batch_returns_value_and_standard_uncertainty_columns(my_sucrose):
    # A sweep over an invented range of syrup strengths (0-40 wt% of the fitted sucrose-like
    # solute), one row per strength: the C++ kernel's columns equal the scalar results row
    # by row (identity; no literature), in the caller's index.
    _, lib = my_sucrose
    w = np.linspace(0.0, 0.40, 9)
    df_in = pd.DataFrame({"my sucrose": w}, index=[f"mix{i}" for i in range(len(w))])
    batch = cg.SolutionBatch.from_mass_fractions(df_in, library=lib)
    out = cg.freezing_point(batch, with_uncertainty=True)
    assert list(out.columns) == ["freezing_point_K", "freezing_point_K_std", "degrees_of_freedom", "status"]
    assert list(out.index) == list(df_in.index)
    for name, wi in zip(df_in.index, w):
        s = cg.Solution.from_mass_fractions({"my sucrose": float(wi)}, table=lib)
        r = cg.freezing_point(s, with_uncertainty=True)
        assert out.loc[name, "freezing_point_K"] == r.value
        assert out.loc[name, "freezing_point_K_std"] == r.std
        assert out.loc[name, "degrees_of_freedom"] == r.degrees_of_freedom
    assert out["freezing_point_K_std"].iloc[0] == 0.0  # pure water: nothing to propagate
    assert (out["freezing_point_K_std"].iloc[1:] > 0.0).all()
    ice = cg.ice_fraction(batch, 270.15, with_uncertainty=True)  # -3 C: inside the fit's range
    assert list(ice.columns)[:2] == ["ice_fraction", "ice_fraction_std"]
    assert ice["ice_fraction"].iloc[0] == 1.0 and ice["ice_fraction_std"].iloc[0] == 0.0  # water: all ice
    for i in (2, 6):
        s = cg.Solution.from_mass_fractions({"my sucrose": float(w[i])}, table=lib)
        r = cg.ice_fraction(s, 270.15, with_uncertainty=True)
        assert ice["ice_fraction"].iloc[i] == r.value and ice["ice_fraction_std"].iloc[i] == r.std
    assert ice["ice_fraction_std"].iloc[6] > 0.0
    # built-in solutes state no uncertainty: std 0, not NaN
    plain = cg.SolutionBatch.from_mass_fractions({"sucrose": w[1:]})
    assert (cg.water_activity(plain, with_uncertainty=True)["water_activity_std"] == 0.0).all()
    with pytest.raises(cg.InvalidInputError, match="linear"):
        cg.freezing_point(batch, with_uncertainty="monte_carlo")


def test_report_shows_the_band_when_a_solute_has_stated_uncertainty(my_sucrose):
    # An invented recipe: 0.25 kg of the fitted syrup solids (CRC sucrose fit) in 0.75 kg
    # water. The report's figures carry value ± u and the 95 % interval, equal to the scalar
    # results (identity); a recipe of built-in solutes without stated uncertainty has none.
    import jsonschema
    from colligate.report import build_report, format_json, format_text, report_schema

    fs, _ = my_sucrose
    r = cg.Recipe(water=0.75, solutes={"my sucrose": 0.25}, library=cg.Library([fs]))
    rep = build_report(r)
    jsonschema.validate(json.loads(format_json(rep)), report_schema())
    u = rep["uncertainty"]
    assert u["constants"] == ["my_sucrose.norrish_k"] and u["level"] == 0.95
    tf = r.freezing_point(with_uncertainty=True)
    assert u["freezing_point_K"]["value"] == pytest.approx(tf.value, rel=1e-12)
    assert u["freezing_point_K"]["standard_uncertainty"] == pytest.approx(tf.std, rel=1e-12)
    assert u["freezing_point_K"]["interval"] == pytest.approx(list(tf.ci(0.95)), rel=1e-12)
    assert u["freezing_point_K"]["method"] == "linear"
    assert len(u["ice_fraction_of_water"]) == len(rep["ice_table"])
    text = format_text(rep)
    assert "initial freezing point" in text and "±" in text and "95 % coverage interval" in text
    plain = build_report(cg.Recipe(water=0.75, solutes={"sucrose": 0.25}))
    assert plain["uncertainty"] is None
    assert "coverage interval" not in format_text(plain)


def test_ice_curve_plot_draws_the_band(my_sucrose, tmp_path):
    # The band is the 95 % interval of the ice fraction along the curve (identity with the
    # scalar results); a solution of built-in solutes without stated uncertainty has none.
    from colligate import plot
    from colligate.report_compute import IcePath

    _, lib = my_sucrose
    s = cg.Solution.from_mass_fractions({"my sucrose": 0.20}, table=lib)
    temps = np.array([272.15, 270.15, 269.15])
    frac = np.asarray(cg.ice_fraction(s, temps), dtype=float)
    lo, hi = plot._ice_band(IcePath(s, "auto", 0.0), temps, frac)
    r = cg.ice_fraction(s, 270.15, with_uncertainty=True)
    assert (lo[1], hi[1]) == pytest.approx(r.ci(0.95), rel=1e-12)
    assert np.all(lo <= frac) and np.all(frac <= hi) and hi[2] > lo[2]
    plain = cg.Solution.from_mass_fractions({"sucrose": 0.20})
    assert plot._ice_band(IcePath(plain, "auto", 0.0), temps, frac) is None
    with pytest.warns(cg.OutOfValidityRangeWarning):  # the curve runs past the fit's 42 wt%
        out = plot.plot_ice_curve(s, str(tmp_path / "band.png"))
    assert pathlib.Path(out).stat().st_size > 0


def test_correlation_warning_on_synthetic_data_from_known_constants():
    # Synthetic data, invented for this test: the built-in NaCl (model 'pitzer') taken as the
    # truth, with Gaussian noise (seed 20261202) of 0.002 on osmotic coefficients at 25 C
    # over 0.1-6 mol/kg and of 0.01 K on freezing points over 0.2-4 mol/kg. The correlation
    # of the fitted constants follows from the design (which molalities, which kind of data),
    # so the freezing points alone tie beta0 to C-phi beyond |r| = 0.99 and the wide osmotic
    # range does not (|r| about 0.985 at this seed).
    rng = np.random.default_rng(20261202)
    m = np.linspace(0.1, 6.0, 15)
    phi = np.array([cg.osmotic_coefficient(cg.Solution.from_molalities({"NaCl": float(x)}), T=298.15,
                                           model="pitzer") for x in m]) + rng.normal(0.0, 0.002, m.size)
    with warnings.catch_warnings():
        warnings.simplefilter("error", cg.PoorlyDeterminedFitWarning)
        osm = fit.fit_pitzer("NaCl", m, osmotic_coefficient=phi)
    assert osm.success and osm.poorly_determined() == []
    mf = np.linspace(0.2, 4.0, 15)
    tf = np.array([cg.freezing_point(cg.Solution.from_molalities({"NaCl": float(x)}), model="pitzer")
                   for x in mf]) + rng.normal(0.0, 0.01, mf.size)
    with pytest.warns(cg.PoorlyDeterminedFitWarning, match="beta0 and cphi are correlated"):
        fp = fit.fit_pitzer("NaCl", mf, freezing_point=tf)
    assert abs(fp.correlation.loc["beta0", "cphi"]) > 0.99 > abs(osm.correlation.loc["beta0", "cphi"])


# ------------------------------------------------ a salt that crystallises


def test_uncertain_predictions_follow_the_plain_calls_where_a_salt_crystallises():
    # 25 wt% NaCl lies above the NaCl eutectic composition (23.3 wt%, common practice):
    # hydrohalite forms before ice; 30 wt% NaCl is above the solubility at 25 C (26.4 wt%,
    # CRC Handbook aqueous solubility table, from memory). With uncertainty the values are
    # those of the plain calls (first solid; saturated liquid), metastable on request.
    brine25 = cg.Solution.from_mass_fractions({"NaCl": 0.25})
    brine30 = cg.Solution.from_mass_fractions({"NaCl": 0.30})
    with warnings.catch_warnings():
        # the supersaturation notices and 30 wt% lying above the parameters' 6.2 mol/kg
        warnings.simplefilter("ignore")
        fp = cg.freezing_point(brine25)
        fp_meta = cg.freezing_point(brine25, metastable=True)
        aw = cg.water_activity(brine30)
        aw_meta = cg.water_activity(brine30, saturation="metastable")
        assert fp - fp_meta > 10.0 and aw - aw_meta > 0.02
        assert cg.freezing_point(brine25, with_uncertainty=True).value == fp
        assert cg.freezing_point(brine25, metastable=True, with_uncertainty=True).value == fp_meta
        assert cg.water_activity(brine30, with_uncertainty=True).value == aw
        assert cg.water_activity(brine30, saturation="metastable", with_uncertainty=True).value == aw_meta
        with pytest.raises(cg.InvalidInputError, match="saturation = 'ice'"):
            cg.water_activity(brine30, saturation="ice", with_uncertainty=True)


def test_batch_with_uncertainty_keeps_the_plain_batch_value_where_a_salt_crystallises():
    # rows of 10, 25 and 30 wt% NaCl at 25 C (30 wt% above the solubility, as above)
    batch = cg.SolutionBatch.from_mass_fractions(pd.DataFrame({"NaCl": [0.10, 0.25, 0.30]}))
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        plain = cg.batch.batch_water_activity(batch, 298.15)
        meta = cg.batch.batch_water_activity(batch, 298.15, saturation="metastable")
        with_u = cg.batch.batch_with_uncertainty(batch, "water_activity", 298.15)
        with_u_meta = cg.batch.batch_with_uncertainty(batch, "water_activity", 298.15, salts_crystallise=False)
    np.testing.assert_array_equal(with_u["water_activity"].to_numpy(), np.asarray(plain))
    np.testing.assert_array_equal(with_u_meta["water_activity"].to_numpy(), np.asarray(meta))
    assert with_u["water_activity"].iloc[2] - with_u_meta["water_activity"].iloc[2] > 0.02
