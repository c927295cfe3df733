#pragma once
// Shared pieces of the uncertainty tests: the CRC sucrose Norrish fit used as a fitted
// solute, central differences of a plain prediction in one constant (test only: the library
// itself never differentiates numerically), and the delta-method-against-Monte-Carlo
// comparison every model's acceptance check makes.
#include <catch2/catch.hpp>
#include <Eigen/Dense>
#include <cstddef>
#include <string>
#include <vector>

#include "colligate/core/constants.hpp"
#include "colligate/equilibria/prediction_uncertainty.hpp"
#include "colligate/fit/fitters.hpp"
#include "crc_reference.hpp"

namespace colligate_test {

/// A Norrish fit (K, optionally K3) to the CRC Handbook sucrose freezing points to 42 wt%
/// (source key crc_concentrative, "Concentrative properties of aqueous solutions", sucrose
/// rows of tests/reference/crc_freezing_points.csv, printed to 0.01 K; doubtful rows left
/// out): a fitted sucrose-like solute.
inline colligate::fit::fit_result crc_sucrose_fit(bool k3) {
  std::vector<double> m, tf;
  for (const auto& row : read_reference("crc_freezing_points.csv")) {
    if (row.at("solute") != "sucrose" || std::stod(row.at("mass_percent")) > 42.0) continue;
    if (doubtful_crc_row(row)) continue;
    m.push_back(std::stod(row.at("molality_mol_per_kg")));
    tf.push_back(colligate::constants::ice_point - std::stod(row.at("depression_K")));
  }
  colligate::fit::norrish_fit_options o;
  o.fit_k3 = k3;
  return colligate::fit::fit_norrish_freezing_point(
      Eigen::Map<const Eigen::VectorXd>(m.data(), static_cast<Eigen::Index>(m.size())),
      Eigen::Map<const Eigen::VectorXd>(tf.data(), static_cast<Eigen::Index>(tf.size())),
      Eigen::VectorXd(), o);
}

/// Central difference of the plain prediction `q` in the solution's uncertain constant `k`
/// (step h) under `model`, with `bound` kg of bound water.
inline double central_difference(colligate::equilibria::predicted_quantity q,
                                 const colligate::solution& s, double T, std::size_t k, double h,
                                 const std::string& model, double bound = 0.0) {
  namespace eq = colligate::equilibria;
  const auto c = eq::uncertain_constants(s);
  Eigen::VectorXd p = c.values;
  p[static_cast<Eigen::Index>(k)] += h;
  const double up = eq::predict(q, eq::with_constants(s, c, p), T, model, bound);
  p[static_cast<Eigen::Index>(k)] -= 2.0 * h;
  const double down = eq::predict(q, eq::with_constants(s, c, p), T, model, bound);
  return (up - down) / (2.0 * h);
}

/// The acceptance check of a linear propagation against Monte Carlo: every draw finite, the
/// standard uncertainties and the widths of the 95 % intervals (normal law against the
/// sample quantiles) within `rel` of each other, the Monte Carlo mean within `rel` standard
/// uncertainties of the value.
inline void check_delta_matches_monte_carlo(const colligate::equilibria::prediction_uncertainty& lin,
                                            const colligate::fit::monte_carlo_result& mc,
                                            int draws, double rel = 0.05) {
  using Catch::Matchers::WithinAbs;
  using Catch::Matchers::WithinRel;
  REQUIRE(mc.finite_draws == draws);
  CHECK_THAT(mc.standard_deviation, WithinRel(lin.result.standard_uncertainty, rel));
  CHECK_THAT(mc.mean, WithinAbs(lin.result.value, rel * lin.result.standard_uncertainty + 1e-12));
  colligate::fit::uncertain_value normal = lin.result;
  normal.degrees_of_freedom = 0;
  const auto a = normal.coverage_interval(0.95);
  const auto b = mc.interval(0.95);
  CHECK_THAT(a.second - a.first, WithinRel(b.second - b.first, rel));
}

}  // namespace colligate_test
