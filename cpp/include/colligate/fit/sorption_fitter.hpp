#pragma once
/// \file sorption_fitter.hpp
/// Fits GAB, BET or Oswin isotherms (equilibria/sorption_isotherm.hpp) to a lab's
/// (water activity, moisture) data by Levenberg-Marquardt (levenberg_marquardt.hpp), with
/// the covariance and Student-t intervals of every fit. Moisture in kg water per kg dry
/// solids. Start values come from each model's linearised form (GAB: a/X quadratic in a,
/// van den Berg 1985; BET: a/((1-a) X) linear in a; Oswin: ln X linear in ln(a/(1-a))).

#include <Eigen/Dense>
#include <cmath>
#include <string>
#include <vector>

#include "colligate/core/errors.hpp"
#include "colligate/equilibria/sorption_isotherm.hpp"
#include "colligate/fit/levenberg_marquardt.hpp"

namespace colligate::fit {

namespace detail {

inline Eigen::VectorXd isotherm_start(equilibria::isotherm_model m, const Eigen::VectorXd& a,
                                      const Eigen::VectorXd& x) {
  const Eigen::Index n = a.size();
  if (m == equilibria::isotherm_model::oswin) {
    Eigen::MatrixXd A(n, 2);
    Eigen::VectorXd y(n);
    for (Eigen::Index i = 0; i < n; ++i) {
      A(i, 0) = 1.0;
      A(i, 1) = std::log(a[i] / (1.0 - a[i]));
      y[i] = std::log(x[i]);
    }
    const Eigen::VectorXd c = A.colPivHouseholderQr().solve(y);
    return (Eigen::VectorXd(2) << std::exp(c[0]), c[1] > 0.0 ? c[1] : 0.5).finished();
  }
  if (m == equilibria::isotherm_model::bet) {
    Eigen::MatrixXd A(n, 2);
    Eigen::VectorXd y(n);
    for (Eigen::Index i = 0; i < n; ++i) {
      A(i, 0) = 1.0;
      A(i, 1) = a[i];
      y[i] = a[i] / ((1.0 - a[i]) * x[i]);
    }
    const Eigen::VectorXd c = A.colPivHouseholderQr().solve(y);
    const double xm = 1.0 / (c[0] + c[1]), cc = 1.0 + c[1] / c[0];
    if (xm > 0.0 && cc > 0.0 && std::isfinite(xm) && std::isfinite(cc))
      return (Eigen::VectorXd(2) << xm, cc).finished();
    return (Eigen::VectorXd(2) << x.mean() / 2.0, 10.0).finished();
  }
  Eigen::VectorXd fallback(3);
  fallback << x.mean() / 2.0, 10.0, 0.8;
  if (n < 3) return fallback;
  Eigen::MatrixXd A(n, 3);
  Eigen::VectorXd y(n);
  for (Eigen::Index i = 0; i < n; ++i) {
    A(i, 0) = a[i] * a[i];
    A(i, 1) = a[i];
    A(i, 2) = 1.0;
    y[i] = a[i] / x[i];
  }
  const Eigen::VectorXd c = A.colPivHouseholderQr().solve(y);  // alpha, beta, gamma
  // alpha = K (1/C - 1)/Xm, beta = (1 - 2/C)/Xm, gamma = 1/(Xm C K), so that
  // beta^2 - 4 alpha gamma = 1/Xm^2; then C = 2 / (1 - beta Xm) and K = 1 / (Xm C gamma).
  const double disc = c[1] * c[1] - 4.0 * c[0] * c[2];
  if (!(disc > 0.0)) return fallback;
  const double xm = 1.0 / std::sqrt(disc);
  const double cc = 2.0 / (1.0 - c[1] * xm);
  const double k = 1.0 / (xm * cc * c[2]);
  if (!(std::isfinite(xm) && std::isfinite(k) && std::isfinite(cc) && xm > 0.0 && k > 0.0 && k < 1.0 && cc > 0.0))
    return fallback;
  return (Eigen::VectorXd(3) << xm, cc, k).finished();
}

}  // namespace detail

/// Fits `model` to water activities `aw` (each in (0, 1)) and moistures `moisture`
/// (kg water per kg dry solids, > 0) at `temperature` (K). Parameter names: xm, c, k (GAB);
/// xm, c (BET); a, b (Oswin). The returned isotherm carries the data's a_w range.
inline fit_result fit_isotherm(equilibria::isotherm_model model, const Eigen::VectorXd& aw,
                               const Eigen::VectorXd& moisture, const Eigen::VectorXd& weights = Eigen::VectorXd(),
                               fit_options options = fit_options()) {
  const char* where = "fit_isotherm";
  if (aw.size() != moisture.size())
    throw invalid_input(std::string(where) + ": water_activity has " + std::to_string(aw.size()) +
                        " rows but moisture has " + std::to_string(moisture.size()));
  for (Eigen::Index i = 0; i < aw.size(); ++i) {
    if (!(std::isfinite(aw[i]) && aw[i] > 0.0 && aw[i] < 1.0))
      throw invalid_input(colligate::detail::describe(where, "water_activity[" + std::to_string(i) + "]", aw[i],
                                                      "must be in (0, 1)"));
    if (!(std::isfinite(moisture[i]) && moisture[i] > 0.0))
      throw invalid_input(colligate::detail::describe(where, "moisture[" + std::to_string(i) + "]", moisture[i],
                                                      "must be finite and > 0 kg water per kg dry solids"));
  }
  const int k = model == equilibria::isotherm_model::gab ? 3 : 2;
  if (aw.size() < k)
    throw invalid_input(std::string(where) + ": " + std::to_string(aw.size()) + " rows; the " +
                        to_string(model) + " model needs at least " + std::to_string(k));
  auto f = [model](const Eigen::MatrixXd& x, const Eigen::VectorXd& p) {
    equilibria::sorption_isotherm iso{model, p[0], p[1], p.size() > 2 ? p[2] : 0.0};
    Eigen::VectorXd out(x.rows());
    for (Eigen::Index i = 0; i < x.rows(); ++i) out[i] = iso.moisture_unchecked(x(i, 0));
    return out;
  };
  if (options.lower_bounds.size() == 0) {
    options.lower_bounds = Eigen::VectorXd::Constant(k, 1e-12);
    options.upper_bounds = Eigen::VectorXd::Constant(k, INFINITY);
    if (model == equilibria::isotherm_model::gab) options.upper_bounds[2] = 1.0 - 1e-9;
  }
  auto r = curve_fit(f, aw, moisture, detail::isotherm_start(model, aw, moisture), weights, options);
  if (model == equilibria::isotherm_model::gab) r.parameter_names = {"xm", "c", "k"};
  else if (model == equilibria::isotherm_model::bet) r.parameter_names = {"xm", "c"};
  else r.parameter_names = {"a", "b"};
  return r;
}

/// The isotherm of a fit at `temperature` (K), carrying the data's water-activity range.
inline equilibria::sorption_isotherm isotherm_of_fit(equilibria::isotherm_model model, const fit_result& r,
                                                     double temperature, double aw_min, double aw_max) {
  equilibria::sorption_isotherm iso{model, r.params[0], r.params[1], r.params.size() > 2 ? r.params[2] : 0.0,
                                    temperature, aw_min, aw_max};
  iso.validate();
  return iso;
}

}  // namespace colligate::fit
