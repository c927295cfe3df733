// Predictions with their standard uncertainty: linear propagation (analytic sensitivities on
// the ice line) against Monte Carlo, against central differences of the plain prediction,
// and the coverage of the intervals on synthetic data.
#include <catch2/catch.hpp>
#include <cmath>
#include <random>
#include <string>
#include <vector>

#include "../crc_reference.hpp"
#include "../uncertainty_checks.hpp"
#include "colligate/colligate.hpp"
#include "colligate/batch/uncertainty_kernels.hpp"
#include "colligate/equilibria/prediction_uncertainty.hpp"
#include "colligate/fit/fitters.hpp"
#include "colligate/fit/pitzer_fitter.hpp"
#include "colligate/models/pitzer_sensitivity.hpp"

using namespace colligate;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;
using equilibria::predicted_quantity;
using colligate_test::central_difference;
using colligate_test::check_delta_matches_monte_carlo;
using colligate_test::crc_sucrose_fit;

namespace {

Eigen::VectorXd vec(const std::vector<double>& v) {
  return Eigen::Map<const Eigen::VectorXd>(v.data(), static_cast<Eigen::Index>(v.size()));
}

data::solute_table table_with(const std::vector<data::solute_record>& extra) {
  std::vector<data::solute_record> recs = extra;
  return data::solute_table(std::move(recs));
}

}  // namespace

TEST_CASE("A fitted record carries its fit's covariance and degrees of freedom", "[uncertainty][fit]") {
  const auto r = crc_sucrose_fit(true);
  REQUIRE(r.success());
  const auto rec = fit::norrish_solute_record(r, "my_sucrose", "my sucrose", 0.3422965, 0.42, "test");
  REQUIRE(rec.uncertainty.stated());
  CHECK(rec.uncertainty.names == std::vector<std::string>{"norrish_k", "norrish_k3"});
  CHECK(rec.uncertainty.degrees_of_freedom == r.degrees_of_freedom);
  CHECK(rec.uncertainty.source == "colligate_fit_user");
  for (int i = 0; i < 2; ++i)
    for (int j = 0; j < 2; ++j)
      CHECK(rec.uncertainty.at(i, j) == r.covariance(i, j));
  // The correlation of K and K3 fitted together is strong (both scale x^2-like terms).
  const auto corr = fit::correlation_matrix(r.covariance);
  CHECK_THAT(corr(0, 0), WithinAbs(1.0, 1e-12));
  CHECK(std::abs(corr(0, 1)) > 0.9);
  // Built-in records state no uncertainty (their sources give none): they enter as exact.
  const auto s = solution::from_mass_fractions({{"sucrose", 0.3}});
  const auto u = equilibria::propagate_linear(predicted_quantity::freezing_point, s, 0.0, "norrish");
  CHECK(u.not_stated == std::vector<std::string>{"sucrose"});
  CHECK(u.result.standard_uncertainty == 0.0);
  CHECK(u.result.degrees_of_freedom == 0);
}

TEST_CASE("Analytic sensitivities equal central differences of the plain prediction", "[uncertainty]") {
  // Identity check (no literature): two fitted solutes in one mixture, so the multi-solute
  // Norrish sum (Chirife et al. 1980 eq. 4) with its square-root cross term is exercised.
  const auto r = crc_sucrose_fit(true);
  REQUIRE(r.success());
  auto su = fit::norrish_solute_record(r, "my_sucrose", "my sucrose", 0.3422965, 0.42, "test");
  auto gl = data::builtin_solutes().find("glucose");
  gl.id = "my_glucose";
  gl.aliases.clear();
  gl.uncertainty.names = {"norrish_k"};
  gl.uncertainty.covariance = {0.01};  // invented variance, test only
  gl.uncertainty.degrees_of_freedom = 8;
  const auto table = table_with({su, gl});
  const auto s = solution::from_mass_fractions({{"my_sucrose", 0.20}, {"my_glucose", 0.10}}, 1.0, table);
  struct probe { predicted_quantity q; double T; };
  for (const auto& p : {probe{predicted_quantity::freezing_point, 0.0},
                        probe{predicted_quantity::water_activity, 298.15},
                        probe{predicted_quantity::osmotic_coefficient, 298.15},
                        probe{predicted_quantity::ice_fraction, 263.15},
                        probe{predicted_quantity::unfrozen_water, 263.15}}) {
    const auto u = equilibria::propagate_linear(p.q, s, p.T, "norrish");
    REQUIRE(u.sensitivities.size() == 3);
    INFO(equilibria::to_string(p.q));
    for (std::size_t k = 0; k < 3; ++k) {
      const double h = 1e-3 * std::max(1.0, std::abs(equilibria::uncertain_constants(s).values[k]));
      const double fd = central_difference(p.q, s, p.T, k, h, "norrish");
      INFO("constant " << u.constants[k] << ": analytic " << u.sensitivities[k] << ", difference " << fd);
      // central difference error O(h^2) plus the solvers' 1e-9 K / 1e-12 kg tolerances
      CHECK_THAT(u.sensitivities[k], WithinRel(fd, 1e-5) || WithinAbs(fd, 1e-9));
    }
    CHECK(u.result.standard_uncertainty > 0.0);
  }
  // Bound water: the freezing point of the solvent left over
  const auto ub = equilibria::propagate_linear(predicted_quantity::freezing_point, s, 0.0, "norrish", 0.1);
  CHECK_THAT(ub.sensitivities[0], WithinRel(central_difference(predicted_quantity::freezing_point, s, 0.0, 0, 1e-4, "norrish", 0.1), 1e-5));
}

TEST_CASE("Delta method and Monte Carlo agree on a fitted sucrose-like solute", "[uncertainty][monte_carlo]") {
  // The acceptance check: within 5 % on the standard uncertainty and on the width of
  // the 95 % interval, with 10^5 draws (seed 20261202). K and K3 fitted together to the CRC
  // sucrose freezing points (strongly correlated, so the covariance's off-diagonal matters).
  const auto r = crc_sucrose_fit(true);
  REQUIRE(r.success());
  const auto rec = fit::norrish_solute_record(r, "my_sucrose", "my sucrose", 0.3422965, 0.42, "test");
  const auto table = table_with({rec});
  const auto s = solution::from_mass_fractions({{"my_sucrose", 0.40}}, 1.0, table);
  for (const auto q : {predicted_quantity::freezing_point, predicted_quantity::ice_fraction}) {
    const double T = 263.15;
    const auto lin = equilibria::propagate_linear(q, s, T, "norrish");
    const auto mc = equilibria::propagate_monte_carlo(q, s, T, "norrish", 0.0, 100000, 20261202u);
    INFO(equilibria::to_string(q) << ": delta " << lin.result.standard_uncertainty << ", Monte Carlo "
                                  << mc.standard_deviation);
    check_delta_matches_monte_carlo(lin, mc, 100000);
    CHECK(lin.result.degrees_of_freedom == r.degrees_of_freedom);
  }
}

TEST_CASE("Coverage of the 95 % interval on synthetic freezing data", "[uncertainty][coverage]") {
  // Synthetic data, invented for this test: a sucrose-like solute (molar mass 0.3423 kg/mol,
  // true K = 6.5), ten molalities 0.2-2.0 mol/kg, Gaussian noise of 0.02 K on each freezing
  // point, seed 20261202, 1000 data sets. Each set is fitted (K alone, 9 degrees of freedom)
  // and the 95 % Student-t interval on the freezing point at 2.6 mol/kg (beyond the data)
  // is asked to contain the true value. Binomial spread of the count: sqrt(1000 .95 .05) = 7;
  // the acceptance band 930-970 is about 3 of those either side. At this seed the
  // count is 933 (2.4 spreads low); the same experiment through the Python API with numpy's
  // generator (seeds 1-3, 2000 sets each) covered 95.25, 94.75 and 95.05 %, and the
  // standardised errors had the spread of Student's t with 9 dof (1.13), so the low count is
  // taken as the luck of this seed, not a bias; a standard library with another normal
  // sampler draws other sets.
  std::mt19937_64 rng(20261202u);
  std::normal_distribution<double> noise(0.0, 0.02);
  const auto truth_rec = fit::detail::trial_record(0.3423, 6.5, 0.0);
  const data::solute_table truth_table({truth_rec});
  std::vector<double> m;
  for (int i = 1; i <= 10; ++i) m.push_back(0.2 * i);
  std::vector<double> t_true;
  for (double mi : m)
    t_true.push_back(equilibria::freezing_point(
        solution::from_molalities({{fit::detail::fitted_id, mi}}, 1.0, truth_table), "norrish").temperature);
  const double m_new = 2.6;
  const double T_new_true = equilibria::freezing_point(
      solution::from_molalities({{fit::detail::fitted_id, m_new}}, 1.0, truth_table), "norrish").temperature;
  int covered = 0, fitted = 0;
  for (int set = 0; set < 1000; ++set) {
    std::vector<double> y = t_true;
    for (double& yi : y) yi += noise(rng);
    const auto r = fit::fit_norrish_freezing_point(vec(m), vec(y));
    if (!r.success()) continue;
    ++fitted;
    const auto rec = fit::norrish_solute_record(r, "syn", "syn", 0.3423, 0.6, "synthetic");
    const data::solute_table table({rec});
    const auto s = solution::from_molalities({{"syn", m_new}}, 1.0, table);
    const auto u = equilibria::propagate_linear(predicted_quantity::freezing_point, s, 0.0, "norrish");
    REQUIRE(u.result.degrees_of_freedom == 9);
    const auto ci = u.result.coverage_interval(0.95);
    if (ci.first <= T_new_true && T_new_true <= ci.second) ++covered;
  }
  REQUIRE(fitted == 1000);
  INFO("covered " << covered << " of 1000");
  CHECK(covered >= 930);
  CHECK(covered <= 970);
}

TEST_CASE("Propagation refuses what it cannot do and names it", "[uncertainty][errors]") {
  const auto r = crc_sucrose_fit(false);
  const auto rec = fit::norrish_solute_record(r, "my_sucrose", "my sucrose", 0.3422965, 0.42, "test");
  const auto table = table_with({rec});
  const auto s = solution::from_mass_fractions({{"my_sucrose", 0.30}}, 1.0, table);
  // 'raoult' has no constants: no closed-form sensitivity for a constant it does not use
  CHECK_THROWS_WITH(equilibria::propagate_linear(predicted_quantity::freezing_point, s, 0.0, "raoult"),
                    Catch::Contains("model 'raoult'") && Catch::Contains("Monte Carlo"));
  CHECK_THROWS_WITH(equilibria::propagate_linear(predicted_quantity::water_activity, s, -1.0, "norrish"),
                    Catch::Contains("temperature"));
  CHECK_THROWS_WITH(equilibria::propagate_monte_carlo(predicted_quantity::freezing_point, s, 0.0, "norrish", 0.0, 1, 1u),
                    Catch::Contains("draws"));
  fit::uncertain_value v{1.0, 0.1, 5};
  // Student t, 5 dof, 97.5 % quantile 2.5706 (common practice: any t table)
  CHECK_THAT(v.coverage_factor(0.95), WithinRel(2.5706, 1e-4));
  v.degrees_of_freedom = 0;
  // normal 97.5 % quantile 1.95996 (common practice)
  CHECK_THAT(v.coverage_factor(0.95), WithinRel(1.95996, 1e-5));
  CHECK_THROWS_WITH(v.coverage_factor(1.5), Catch::Contains("level"));
}

namespace {

/// A Pitzer fit (beta0, beta1, C-phi) to the CRC Handbook NaCl freezing points to
/// 4.1 mol/kg (source key crc_concentrative, printed to 0.01 K): a fitted salt whose
/// parameters are strongly correlated (freezing points alone), so the covariance's
/// off-diagonal terms carry the band.
fit::fit_result crc_salt_fit() {
  std::vector<double> m, tf;
  for (const auto& row : colligate_test::read_reference("crc_freezing_points.csv")) {
    if (row.at("solute") != "sodium_chloride" || colligate_test::doubtful_crc_row(row)) continue;
    const double mi = std::stod(row.at("molality_mol_per_kg"));
    if (mi > 4.1) continue;
    m.push_back(mi);
    tf.push_back(constants::ice_point - std::stod(row.at("depression_K")));
  }
  return fit::fit_pitzer_freezing_point(data::builtin_solutes().find("NaCl"), vec(m), vec(tf));
}

data::solute_record crc_salt_record(const fit::fit_result& r) {
  // valid to the data's 4.1 mol/kg, over the data's temperatures and below (test only)
  return fit::pitzer_solute_record(r, data::builtin_solutes().find("NaCl"), "my_salt", "my salt", 4.1,
                                   238.15, 278.15, "test");
}

}  // namespace

TEST_CASE("Pitzer slopes of ln a_w by T and by water equal central differences", "[uncertainty][pitzer]") {
  // Identity check (no literature): NaCl alone, and a seawater-like brine (invented
  // composition, test only) where theta, psi and the unsymmetrical E-theta of Na+/Ca+2,
  // Na+/Mg+2 and Cl-/SO4-2 enter.
  const auto nacl = solution::from_molalities({{"NaCl", 2.0}});
  const auto brine = solution::from_molalities(
      {{"NaCl", 0.9}, {"KCl", 0.05}, {"CaCl2", 0.08}, {"MgSO4", 0.1}});
  for (const auto* s : {&nacl, &brine}) {
    for (double T : {258.15, 271.15, 298.15}) {
      const double W = 0.8;
      const auto sl = models::pitzer_slopes(*s, W, T);
      const auto L = [&](double w, double t) { return models::pitzer::ln_water_activity(*s, w, t); };
      CHECK(sl.ln_water_activity == L(W, T));
      const double hT = 1e-3, hW = 1e-5;
      const double dT = (L(W, T + hT) - L(W, T - hT)) / (2 * hT);
      const double dW = (L(W + hW, T) - L(W - hW, T)) / (2 * hW);
      INFO("T " << T << ": d/dT " << sl.by_temperature << " vs " << dT << ", d/dW " << sl.by_water
                << " vs " << dW);
      // central differences: truncation O(h^2) and rounding ~1e-16 |L| / h
      CHECK_THAT(sl.by_temperature, WithinRel(dT, 1e-5) || WithinAbs(dT, 1e-10));
      CHECK_THAT(sl.by_water, WithinRel(dW, 1e-6));
    }
  }
  // d^2 J / dx^2 against a central difference of dJ/dx on both branches of the series
  for (double x : {0.05, 0.5, 0.99, 1.01, 3.0, 20.0}) {
    double J1 = 0, d1 = 0, J2 = 0, d2 = 0;
    const double h = 1e-5 * x;
    models::detail::mixing_j(x + h, J1, d1);
    models::detail::mixing_j(x - h, J2, d2);
    CHECK_THAT(models::detail::mixing_j_second_derivative(x), WithinRel((d1 - d2) / (2 * h), 1e-5));
  }
  // dA_phi/dT of both correlations
  for (double T : {240.0, 273.15, 298.15}) {
    using models::detail::debye_huckel_osmotic_slope;
    using data::aphi_correlation;
    for (auto c : {aphi_correlation::clegg_rard_pitzer_1994, aphi_correlation::spencer_1990}) {
      const double fd = (debye_huckel_osmotic_slope(T + 1e-3, c) - debye_huckel_osmotic_slope(T - 1e-3, c)) / 2e-3;
      CHECK_THAT(models::detail::debye_huckel_osmotic_slope_derivative(T, c), WithinRel(fd, 1e-6));
    }
  }
}

TEST_CASE("Pitzer sensitivities of a fitted salt equal central differences", "[uncertainty][pitzer]") {
  // Identity check (no literature): the fitted salt with a built-in CaCl2 in one brine, so
  // the shared Cl- and the Na+/Ca+2 mixing terms are in the slopes.
  const auto r = crc_salt_fit();
  REQUIRE(r.success());
  const auto rec = crc_salt_record(r);
  REQUIRE(rec.uncertainty.names == std::vector<std::string>{"beta0", "beta1", "cphi"});
  auto records = data::builtin_solutes().records();
  records.push_back(rec);
  const data::solute_table table(std::move(records));
  const auto s = solution::from_molalities({{"my_salt", 1.5}, {"CaCl2", 0.1}}, 1.0, table);
  struct probe { predicted_quantity q; double T; };
  for (const auto& p : {probe{predicted_quantity::freezing_point, 0.0},
                        probe{predicted_quantity::water_activity, 268.15},
                        probe{predicted_quantity::osmotic_coefficient, 268.15},
                        probe{predicted_quantity::ice_fraction, 263.15},
                        probe{predicted_quantity::unfrozen_water, 263.15}}) {
    const auto u = equilibria::propagate_linear(p.q, s, p.T, "pitzer");
    REQUIRE(u.sensitivities.size() == 3);
    INFO(equilibria::to_string(p.q));
    for (std::size_t k = 0; k < 3; ++k) {
      // h = 1e-4: C-phi is about 1e-3, so a larger step meets the curvature of the ice fraction
      const double fd = central_difference(p.q, s, p.T, k, 1e-4, "pitzer");
      INFO("constant " << u.constants[k] << ": analytic " << u.sensitivities[k] << ", difference " << fd);
      // ln a_w is affine in the constants; O(h^2) of the solvers' paths and their 1e-9 K tolerance
      CHECK_THAT(u.sensitivities[k], WithinRel(fd, 1e-5) || WithinAbs(fd, 1e-9));
    }
    CHECK(u.result.standard_uncertainty > 0.0);
    CHECK(u.result.degrees_of_freedom == r.degrees_of_freedom);
  }
  // A salt crystallised (hydrohalite from the fitted salt, above the CaCl2 eutectic) is no
  // case for the closed form
  const auto mix = solution::from_molalities({{"my_salt", 3.0}, {"CaCl2", 0.5}}, 1.0, table);
  const auto st = equilibria::ice_curve(mix, "pitzer").at(243.15);
  REQUIRE(st.success());
  double crystallised = 0.0;
  for (double x : st.precipitated) crystallised += x;
  REQUIRE(crystallised > 0.0);
  CHECK_THROWS_WITH(equilibria::propagate_linear(predicted_quantity::ice_fraction, mix, 243.15, "pitzer"),
                    Catch::Contains("Monte Carlo"));
}

TEST_CASE("Delta method and Monte Carlo agree on a fitted Pitzer salt", "[uncertainty][monte_carlo][pitzer]") {
  // The acceptance check on the Pitzer side: within 5 % on the standard
  // uncertainty and on the width of the 95 % interval, 10^5 draws (seed 20261202), for a
  // salt fitted to the CRC NaCl freezing points (crc_concentrative).
  const auto r = crc_salt_fit();
  REQUIRE(r.success());
  const auto table = table_with({crc_salt_record(r)});
  const auto s = solution::from_molalities({{"my_salt", 3.0}}, 1.0, table);
  struct probe { predicted_quantity q; double T; };
  for (const auto& p : {probe{predicted_quantity::freezing_point, 0.0},
                        probe{predicted_quantity::ice_fraction, 258.15},
                        probe{predicted_quantity::water_activity, 298.15}}) {
    const auto lin = equilibria::propagate_linear(p.q, s, p.T, "pitzer");
    const auto mc = equilibria::propagate_monte_carlo(p.q, s, p.T, "pitzer", 0.0, 100000, 20261202u);
    INFO(equilibria::to_string(p.q) << ": delta " << lin.result.standard_uncertainty << ", Monte Carlo "
                                    << mc.standard_deviation);
    check_delta_matches_monte_carlo(lin, mc, 100000);
  }
}

TEST_CASE("Batch rows carry value and standard uncertainty equal to the scalar path", "[uncertainty][batch]") {
  // Identity check (no literature): the batch kernel runs the scalar propagation per row,
  // so each row equals it bit for bit, whatever the thread count; a bad row gets NaN and
  // its status, a row with no closed form keeps its value with u = NaN.
  const auto r = crc_salt_fit();
  REQUIRE(r.success());
  auto records = data::builtin_solutes().records();
  records.push_back(crc_salt_record(r));
  const data::solute_table table(std::move(records));
  const std::vector<std::string> species{"my_salt", "CaCl2"};
  const std::vector<double> m{0.5, 0.0, 1.0, 0.0, 2.0, 0.1, 3.0, 0.0, -1.0, 0.0, 3.0, 0.5};
  const auto b = batch::solution_batch::from_molalities(species, m.data(), 6, table);
  struct probe { predicted_quantity q; double T; };
  int no_closed_form = 0;
  for (const auto& p : {probe{predicted_quantity::freezing_point, 0.0},
                        probe{predicted_quantity::water_activity, 298.15},
                        probe{predicted_quantity::ice_fraction, 263.15},
                        probe{predicted_quantity::ice_fraction, 243.15}}) {
    for (unsigned threads : {1u, 3u}) {
      batch::options o;
      o.threads = threads;
      std::vector<double> v(6), u(6);
      std::vector<std::int32_t> dof(6);
      std::vector<std::uint8_t> st(6);
      batch::predictions_with_uncertainty(b, p.q, p.T, "pitzer", o, v.data(), u.data(), dof.data(), st.data());
      INFO(equilibria::to_string(p.q) << ", threads " << threads);
      for (std::size_t i = 0; i < 6; ++i) {
        INFO("row " << i);
        if (i == 4) {
          CHECK(st[i] == static_cast<std::uint8_t>(batch::row_status::invalid_input));
          CHECK(std::isnan(v[i]));
          CHECK(std::isnan(u[i]));
          continue;
        }
        const auto s = solution::from_molalities({{"my_salt", m[2 * i]}, {"CaCl2", m[2 * i + 1]}}, 1.0, table);
        equilibria::prediction_uncertainty ref;
        try {
          ref = equilibria::propagate_linear(p.q, s, p.T, "pitzer");
        } catch (const invalid_input&) {  // hydrohalite has crystallised: no closed form
          CHECK(v[i] == equilibria::predict(p.q, s, p.T, "pitzer", 0.0));
          CHECK(std::isnan(u[i]));
          ++no_closed_form;
          continue;
        }
        if (std::isnan(ref.result.value)) {
          CHECK(std::isnan(v[i]));
          CHECK(st[i] != 0);
          continue;
        }
        CHECK(v[i] == ref.result.value);
        CHECK(u[i] == ref.result.standard_uncertainty);
        CHECK(dof[i] == ref.result.degrees_of_freedom);
      }
    }
  }
  CHECK(no_closed_form > 0);  // the crystallised rows were exercised
  // Model 'raoult' has no closed form: refused once, before any row runs
  batch::options o;
  std::vector<double> v(6), u(6);
  std::vector<std::int32_t> dof(6);
  std::vector<std::uint8_t> st(6);
  CHECK_THROWS_WITH(batch::predictions_with_uncertainty(b, predicted_quantity::freezing_point, 0.0, "raoult", o,
                                                        v.data(), u.data(), dof.data(), st.data()),
                    Catch::Contains("model 'raoult'") && Catch::Contains("Monte Carlo"));
}

TEST_CASE("Built-in constants fitted by colligate state their fit's uncertainty", "[uncertainty][data]") {
  // data/builtin_uncertainty.hpp holds the covariance printed by tools/fit_crc_norrish.py
  // --covariance (NumPy re-implementation, scipy least squares). The C++ fitter on the same
  // CRC Handbook rows (crc_concentrative, used_in_fit = yes, printed to 0.01 K) must give
  // the same K and variance: rel 1e-3 on K (two implementations of the ice line, ~1e-4 K
  // apart) and 2 % on the variance (its scaling by the residuals, which are ~0.02 K).
  std::vector<double> m, tf;
  for (const auto& row : colligate_test::read_reference("crc_freezing_points.csv")) {
    if (row.at("solute") != "maltose" || colligate_test::doubtful_crc_row(row) ||
        row.at("used_in_fit") != "yes" || std::stod(row.at("mass_percent")) > 44.0)
      continue;
    m.push_back(std::stod(row.at("molality_mol_per_kg")));
    tf.push_back(constants::ice_point - std::stod(row.at("depression_K")));
  }
  REQUIRE(m.size() == 17);
  const auto r = fit::fit_norrish_freezing_point(vec(m), vec(tf));
  REQUIRE(r.success());
  const auto& maltose = data::builtin_solutes().find("maltose");
  const auto u = data::stated_uncertainty(maltose);
  REQUIRE(u.names == std::vector<std::string>{"norrish_k"});
  CHECK(u.degrees_of_freedom == r.degrees_of_freedom);
  CHECK_THAT(r.params[0], WithinRel(maltose.norrish.k, 1e-3));
  CHECK_THAT(r.covariance(0, 0), WithinRel(u.at(0, 0), 0.02));
  // the statement a table shows, and "not stated" for a published K without one
  CHECK(data::uncertainty_statement(maltose).find("u(norrish_k) = 0.102") == 0);
  CHECK(data::uncertainty_statement(data::builtin_solutes().find("sucrose")) == "not stated");
  // a copy with other constants does not inherit it
  auto own = maltose;
  own.norrish.k = 7.0;
  CHECK_FALSE(data::stated_uncertainty(own).stated());
  // and it propagates: a maltose syrup's freezing point carries it
  const auto s = solution::from_mass_fractions({{"maltose", 0.3}});
  const auto p = equilibria::propagate_linear(predicted_quantity::freezing_point, s, 0.0, "norrish");
  CHECK(p.constants == std::vector<std::string>{"maltose.norrish_k"});
  CHECK(p.result.standard_uncertainty > 0.0);
  CHECK(p.result.degrees_of_freedom == 16);
}

namespace {

/// The salt + sugar table of the Ross checks: the salt fitted to the CRC NaCl freezing
/// points to 4.1 mol/kg (crc_salt_fit: beta0, beta1, C-phi) and the sucrose-like solute
/// fitted to the CRC sucrose freezing points to 42 wt% (crc_sucrose_fit: K and K3), both
/// from tests/reference/crc_freezing_points.csv (source key crc_concentrative, printed to
/// 0.01 K), with the built-in table for the rest.
data::solute_table ross_table() {
  const auto salt = crc_salt_fit();
  const auto sugar = crc_sucrose_fit(true);
  REQUIRE(salt.success());
  REQUIRE(sugar.success());
  auto records = data::builtin_solutes().records();
  records.push_back(crc_salt_record(salt));
  records.push_back(fit::norrish_solute_record(sugar, "my_sucrose", "my sucrose", 0.3422965, 0.42, "test"));
  return data::solute_table(std::move(records));
}

}  // namespace

TEST_CASE("Ross sensitivities of a salt + sugar mixture equal central differences", "[uncertainty][ross]") {
  // Identity check (no literature): under the Ross rule ln a_w is the Pitzer ln a_w of the
  // electrolytes alone plus the Norrish ln a_w of the non-electrolytes alone, each in the same
  // water, so the salt's constants take the Pitzer derivative, the sugar's the Norrish one
  // with the sugar alone, the T slope is the Pitzer factor's and the W slope the sum of both.
  const auto table = ross_table();
  const auto s = solution::from_molalities({{"my_salt", 0.5}, {"my_sucrose", 0.6}}, 1.0, table);
  struct probe { predicted_quantity q; double T; };
  for (const auto& p : {probe{predicted_quantity::freezing_point, 0.0},
                        probe{predicted_quantity::water_activity, 298.15},
                        probe{predicted_quantity::osmotic_coefficient, 298.15},
                        probe{predicted_quantity::ice_fraction, 263.15},
                        probe{predicted_quantity::unfrozen_water, 263.15}}) {
    const auto u = equilibria::propagate_linear(p.q, s, p.T, "ross");
    REQUIRE(u.constants == std::vector<std::string>{"my_salt.beta0", "my_salt.beta1", "my_salt.cphi",
                                                    "my_sucrose.norrish_k", "my_sucrose.norrish_k3"});
    // 'auto' picks 'ross' for salt + sugar: the same numbers
    const auto a = equilibria::propagate_linear(p.q, s, p.T, "auto");
    CHECK(a.result.value == u.result.value);
    CHECK(a.result.standard_uncertainty == u.result.standard_uncertainty);
    INFO(equilibria::to_string(p.q));
    for (std::size_t k = 0; k < 5; ++k) {
      // steps: 1e-4 for the Pitzer constants (C-phi is about 1e-3), 1e-3 |p| for K and K3
      const double h = k < 3 ? 1e-4 : 1e-3 * std::abs(equilibria::uncertain_constants(s).values[k]);
      const double fd = central_difference(p.q, s, p.T, k, h, "ross");
      INFO("constant " << u.constants[k] << ": analytic " << u.sensitivities[k] << ", difference " << fd);
      // ln a_w is affine in the Pitzer constants and in K, K3 (single sugar); O(h^2) of the
      // solvers' paths and their 1e-9 K / 1e-12 kg tolerances
      CHECK_THAT(u.sensitivities[k], WithinRel(fd, 1e-5) || WithinAbs(fd, 1e-9));
    }
    CHECK(u.result.standard_uncertainty > 0.0);
  }
}

TEST_CASE("Delta method and Monte Carlo agree on a salt + sugar mixture under Ross", "[uncertainty][monte_carlo][ross]") {
  // The acceptance check for the Ross path: within 5 % on the standard uncertainty
  // and on the width of the 95 % interval, 10^5 draws (seed 20261202), for 0.5 mol/kg of the
  // salt fitted to the CRC NaCl freezing points and 0.6 mol/kg of the sucrose-like solute
  // fitted to the CRC sucrose freezing points (ross_table; both covariances drawn together).
  const auto table = ross_table();
  const auto s = solution::from_molalities({{"my_salt", 0.5}, {"my_sucrose", 0.6}}, 1.0, table);
  struct probe { predicted_quantity q; double T; };
  for (const auto& p : {probe{predicted_quantity::freezing_point, 0.0},
                        probe{predicted_quantity::ice_fraction, 263.15},
                        probe{predicted_quantity::water_activity, 298.15}}) {
    const auto lin = equilibria::propagate_linear(p.q, s, p.T, "ross");
    const auto mc = equilibria::propagate_monte_carlo(p.q, s, p.T, "ross", 0.0, 100000, 20261202u);
    INFO(equilibria::to_string(p.q) << ": delta " << lin.result.standard_uncertainty << ", Monte Carlo "
                                    << mc.standard_deviation);
    check_delta_matches_monte_carlo(lin, mc, 100000);
    // two fits with their own degrees of freedom: Welch-Satterthwaite gives at least the
    // smaller of the two
    CHECK(lin.result.degrees_of_freedom > 0);
  }
}

TEST_CASE("Batch rows under Ross equal the scalar path at any thread count", "[uncertainty][batch][ross]") {
  // Identity check (no literature): salt + sugar rows (and a bad row) through the batch
  // kernel at 1 and 3 threads against the scalar propagation, bit for bit.
  const auto table = ross_table();
  const std::vector<std::string> species{"my_salt", "my_sucrose"};
  const std::vector<double> m{0.2, 0.3, 0.5, 0.6, 1.0, 0.2, -1.0, 0.5, 0.0, 1.0, 0.8, 0.0, 2.0, 1.0};
  const std::size_t rows = m.size() / 2;
  const auto b = batch::solution_batch::from_molalities(species, m.data(), rows, table);
  struct probe { predicted_quantity q; double T; };
  for (const auto& p : {probe{predicted_quantity::freezing_point, 0.0},
                        probe{predicted_quantity::water_activity, 298.15},
                        probe{predicted_quantity::osmotic_coefficient, 298.15},
                        probe{predicted_quantity::ice_fraction, 258.15},
                        probe{predicted_quantity::unfrozen_water, 258.15}}) {
    for (unsigned threads : {1u, 3u}) {
      batch::options o;
      o.threads = threads;
      std::vector<double> v(rows), u(rows);
      std::vector<std::int32_t> dof(rows);
      std::vector<std::uint8_t> st(rows);
      batch::predictions_with_uncertainty(b, p.q, p.T, "ross", o, v.data(), u.data(), dof.data(), st.data());
      INFO(equilibria::to_string(p.q) << ", threads " << threads);
      for (std::size_t i = 0; i < rows; ++i) {
        INFO("row " << i);
        if (m[2 * i] < 0.0) {
          CHECK(st[i] == static_cast<std::uint8_t>(batch::row_status::invalid_input));
          CHECK(std::isnan(u[i]));
          continue;
        }
        const auto s = solution::from_molalities({{"my_salt", m[2 * i]}, {"my_sucrose", m[2 * i + 1]}}, 1.0, table);
        const auto ref = equilibria::propagate_linear(p.q, s, p.T, "ross");
        REQUIRE(std::isfinite(ref.result.value));
        CHECK(v[i] == ref.result.value);
        CHECK(u[i] == ref.result.standard_uncertainty);
        CHECK(dof[i] == ref.result.degrees_of_freedom);
        CHECK(u[i] > 0.0);  // every row is frozen at 258.15 K and carries a fit's covariance
      }
    }
  }
}

TEST_CASE("A brine that crystallises a salt: uncertain predictions follow the plain calls", "[uncertainty][pitzer][saturation]") {
  // 25 wt% NaCl (5.703 mol/kg) is richer in salt than the NaCl eutectic composition
  // (23.3 wt%, common practice): hydrohalite forms before ice, so the plain freezing point
  // is its crystallisation temperature; 30 wt% NaCl (7.333 mol/kg) is above the solubility
  // at 25 C (6.15 mol/kg, CRC Handbook aqueous solubility table, from memory), so the plain
  // a_w is that of the saturated liquid. Predictions with uncertainty give the same values
  // by default, and the metastable ones when salts may not crystallise.
  const auto brine25 = solution::from_molalities({{"NaCl", 0.25 / 0.75 / 0.0584428}});
  const auto brine30 = solution::from_molalities({{"NaCl", 0.30 / 0.70 / 0.0584428}});
  equilibria::ice_curve curve(brine25, "pitzer", 0.0);
  const double first_solid = equilibria::first_solid_temperature_checked(curve, range_policy::extrapolate).value;
  const double ice_metastable = equilibria::freezing_point(brine25, "pitzer").temperature;
  REQUIRE(first_solid - ice_metastable > 10.0);
  models::ln_water_activity_evaluator ln_aw(models::model_choice("pitzer"), brine30);
  const double aw_saturated =
      equilibria::water_activity_at_equilibrium(ln_aw, brine30, 298.15, range_policy::extrapolate).value;
  const double aw_metastable = models::water_activity(brine30, 298.15, "pitzer").value;
  REQUIRE(aw_saturated - aw_metastable > 0.02);

  SECTION("no uncertain constant: the plain value with u = 0") {
    const auto fp = equilibria::propagate_linear(predicted_quantity::freezing_point, brine25, 0.0, "pitzer");
    CHECK(fp.result.value == first_solid);
    CHECK(fp.result.standard_uncertainty == 0.0);
    const auto aw = equilibria::propagate_linear(predicted_quantity::water_activity, brine30, 298.15, "pitzer");
    CHECK(aw.result.value == aw_saturated);
    CHECK(aw.result.standard_uncertainty == 0.0);
    CHECK(equilibria::predict(predicted_quantity::freezing_point, brine25, 0.0, "pitzer", 0.0) == first_solid);
    CHECK(equilibria::predict(predicted_quantity::water_activity, brine30, 298.15, "pitzer", 0.0) == aw_saturated);
    // metastable on request
    CHECK(equilibria::propagate_linear(predicted_quantity::freezing_point, brine25, 0.0, "pitzer", 0.0, false)
              .result.value == ice_metastable);
    CHECK(equilibria::propagate_linear(predicted_quantity::water_activity, brine30, 298.15, "pitzer", 0.0, false)
              .result.value == aw_metastable);
  }

  SECTION("a fitted salt: no closed form, Monte Carlo on the equilibrium state") {
    // the salt fitted to the CRC NaCl freezing points (crc_salt_record), same ions as NaCl
    const auto r = crc_salt_fit();
    REQUIRE(r.success());
    const auto table = table_with({crc_salt_record(r)});
    const auto s = solution::from_molalities({{"my_salt", 0.25 / 0.75 / 0.0584428}}, 1.0, table);
    CHECK_THROWS_WITH(equilibria::propagate_linear(predicted_quantity::freezing_point, s, 0.0, "pitzer"),
                      Catch::Contains("crystallises before ice") && Catch::Contains("Monte Carlo"));
    const double plain = equilibria::predict(predicted_quantity::freezing_point, s, 0.0, "pitzer", 0.0);
    const double metastable = equilibria::predict(predicted_quantity::freezing_point, s, 0.0, "pitzer", 0.0, false);
    REQUIRE(plain - metastable > 10.0);
    const auto mc = equilibria::propagate_monte_carlo(predicted_quantity::freezing_point, s, 0.0, "pitzer", 0.0,
                                                      400, 20261203u);
    REQUIRE(mc.finite_draws == 400);
    // the draws scatter about the salt's crystallisation temperature, far from the ice value
    CHECK(std::abs(mc.mean - plain) < 0.1 * (plain - metastable));
    // the metastable value keeps its closed form
    const auto lin = equilibria::propagate_linear(predicted_quantity::freezing_point, s, 0.0, "pitzer", 0.0, false);
    CHECK(lin.result.value == metastable);
    CHECK(lin.result.standard_uncertainty > 0.0);
  }

  SECTION("batch: the value of the plain batch call, u = NaN where a salt crystallises") {
    // NaCl with 0.1 mol/kg of the sucrose-like solute fitted to the CRC sucrose freezing
    // points (crc_sucrose_fit: K, K3 uncertain) under the Ross rule
    const auto sugar = crc_sucrose_fit(true);
    REQUIRE(sugar.success());
    auto records = data::builtin_solutes().records();
    records.push_back(fit::norrish_solute_record(sugar, "my_sucrose", "my sucrose", 0.3422965, 0.42, "test"));
    const data::solute_table table(std::move(records));
    const std::vector<std::string> species{"NaCl", "my_sucrose"};
    const std::vector<double> m{1.0, 0.1, 0.25 / 0.75 / 0.0584428, 0.1, 0.30 / 0.70 / 0.0584428, 0.1};
    const auto b = batch::solution_batch::from_molalities(species, m.data(), 3, table);
    batch::options o, meta;
    meta.salts_crystallise = false;
    std::vector<double> plain(3), plain_meta(3), v(3), u(3), v_meta(3), u_meta(3);
    std::vector<std::int32_t> dof(3);
    std::vector<std::uint8_t> st(3);
    batch::water_activities(b, 298.15, "ross", o, plain.data(), st.data());
    batch::water_activities(b, 298.15, "ross", meta, plain_meta.data(), st.data());
    REQUIRE(plain[2] - plain_meta[2] > 0.02);  // the 30 wt% row is above the solubility
    batch::predictions_with_uncertainty(b, predicted_quantity::water_activity, 298.15, "ross", o, v.data(),
                                        u.data(), dof.data(), st.data());
    batch::predictions_with_uncertainty(b, predicted_quantity::water_activity, 298.15, "ross", meta,
                                        v_meta.data(), u_meta.data(), dof.data(), st.data());
    for (std::size_t i = 0; i < 3; ++i) {
      INFO("row " << i);
      CHECK(v[i] == plain[i]);
      CHECK(v_meta[i] == plain_meta[i]);
      CHECK(u_meta[i] > 0.0);
    }
    CHECK(u[0] > 0.0);
    CHECK(u[1] > 0.0);        // 25 wt% is below the solubility at 25 C
    CHECK(std::isnan(u[2]));  // 30 wt%: NaCl crystallises, no closed form

  }
}
