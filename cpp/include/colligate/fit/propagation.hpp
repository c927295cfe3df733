#pragma once
/// \file propagation.hpp
/// Uncertainty of a prediction y = f(p) from the covariance of the constants p, in the
/// terms of the GUM (JCGM 100:2008; Supplement 1, JCGM 101:2008, for Monte Carlo):
///
/// - Law of propagation of uncertainty (delta method, GUM eq. 13):
///       u^2(y) = g^T Sigma g,   g_j = d f / d p_j at the estimate,
///   with g computed by the caller analytically (never by finite differences here).
/// - Coverage interval y -/+ k u(y): k is the two-sided Student-t quantile with the
///   degrees of freedom of the covariance when it comes from a fit (GUM G.3), the normal
///   quantile when the covariance is taken as known (degrees of freedom 0 = infinite).
/// - Monte Carlo (JCGM 101): p drawn from N(p_hat, Sigma) by the Cholesky factor of Sigma
///   (an eigen-decomposition when Sigma is only semi-definite), f evaluated per draw; the
///   sample mean and standard deviation, and the probabilistically symmetric interval from
///   the sample quantiles. The random engine is the caller's (seeded, one per thread): no
///   global state.

#include <Eigen/Dense>
#include <algorithm>
#include <boost/math/distributions/normal.hpp>
#include <boost/math/distributions/students_t.hpp>
#include <cmath>
#include <cstdint>
#include <limits>
#include <random>
#include <string>
#include <utility>
#include <vector>

#include "colligate/core/errors.hpp"

namespace colligate::fit {

/// A value with its standard uncertainty and the degrees of freedom behind it.
struct uncertain_value {
  double value = std::numeric_limits<double>::quiet_NaN();
  double standard_uncertainty = std::numeric_limits<double>::quiet_NaN();
  int degrees_of_freedom = 0;  ///< 0: normal law (covariance known, or not from a fit)

  /// Coverage factor k for a two-sided interval at `level` in (0, 1).
  double coverage_factor(double level) const {
    if (!(level > 0.0 && level < 1.0))
      throw invalid_input(colligate::detail::describe("coverage_interval", "level", level,
                                                      "must lie in (0, 1), e.g. 0.95"));
    const double q = 0.5 + 0.5 * level;
    if (degrees_of_freedom > 0)
      return boost::math::quantile(
          boost::math::students_t(static_cast<double>(degrees_of_freedom)), q);
    return boost::math::quantile(boost::math::normal(), q);
  }
  /// (lower, upper) = value -/+ k u.
  std::pair<double, double> coverage_interval(double level) const {
    const double k = coverage_factor(level);
    return {value - k * standard_uncertainty, value + k * standard_uncertainty};
  }
};

namespace detail {

inline void check_covariance(const char* where, const Eigen::MatrixXd& cov, Eigen::Index n) {
  if (cov.rows() != n || cov.cols() != n)
    throw invalid_input(std::string(where) + ": the covariance is " + std::to_string(cov.rows()) +
                        " x " + std::to_string(cov.cols()) + " but there are " +
                        std::to_string(n) + " constants; it must be square, one row per constant");
  for (Eigen::Index i = 0; i < n; ++i) {
    if (!(cov(i, i) >= 0.0) || !std::isfinite(cov(i, i)))
      throw invalid_input(colligate::detail::describe(
          where, "covariance diagonal entry " + std::to_string(i), cov(i, i),
          "must be finite and >= 0 (a variance)"));
    for (Eigen::Index j = 0; j < i; ++j)
      if (!std::isfinite(cov(i, j)) ||
          std::abs(cov(i, j) - cov(j, i)) > 1e-12 * (std::abs(cov(i, j)) + std::abs(cov(j, i))))
        throw invalid_input(colligate::detail::describe(
            where, "covariance entry (" + std::to_string(i) + ", " + std::to_string(j) + ")",
            cov(i, j), "must be finite and equal to its mirror entry (a symmetric matrix)"));
  }
}

}  // namespace detail

/// u^2 = g^T Sigma g (GUM eq. 13).
inline double delta_method_variance(const Eigen::VectorXd& gradient, const Eigen::MatrixXd& covariance) {
  detail::check_covariance("delta_method", covariance, gradient.size());
  const double v = gradient.dot(covariance * gradient);
  return std::max(v, 0.0);
}

/// A square root L of a covariance (Sigma = L L^T): Cholesky, or, for a semi-definite
/// matrix (a constant held fixed has a zero row), the eigen-decomposition with negative
/// rounding eigenvalues set to zero.
inline Eigen::MatrixXd covariance_factor(const Eigen::MatrixXd& covariance) {
  detail::check_covariance("monte_carlo", covariance, covariance.rows());
  Eigen::LLT<Eigen::MatrixXd> llt(covariance);
  if (llt.info() == Eigen::Success) return llt.matrixL();
  Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd> eig(covariance);
  const Eigen::VectorXd ev = eig.eigenvalues().cwiseMax(0.0);
  return eig.eigenvectors() * ev.cwiseSqrt().asDiagonal();
}

/// Summary of a Monte Carlo propagation.
struct monte_carlo_result {
  double mean = std::numeric_limits<double>::quiet_NaN();
  double standard_deviation = std::numeric_limits<double>::quiet_NaN();
  int draws = 0;          ///< draws requested
  int finite_draws = 0;   ///< draws whose prediction was finite (the others are left out)
  std::vector<double> values;  ///< the finite predictions, sorted

  /// Probabilistically symmetric interval at `level` from the sorted sample (JCGM 101, 7.7).
  std::pair<double, double> interval(double level) const {
    if (!(level > 0.0 && level < 1.0))
      throw invalid_input(colligate::detail::describe("monte_carlo interval", "level", level,
                                                      "must lie in (0, 1), e.g. 0.95"));
    if (values.empty()) return {std::numeric_limits<double>::quiet_NaN(), std::numeric_limits<double>::quiet_NaN()};
    const auto q = [this](double p) {
      const double pos = p * static_cast<double>(values.size() - 1);
      const auto i = static_cast<std::size_t>(std::floor(pos));
      const double f = pos - static_cast<double>(i);
      return i + 1 < values.size() ? values[i] * (1.0 - f) + values[i + 1] * f : values[i];
    };
    return {q(0.5 - 0.5 * level), q(0.5 + 0.5 * level)};
  }
};

/// Monte Carlo propagation: `draws` samples p ~ N(estimate, covariance) from `engine`,
/// predictions `f(p)` (any callable double(const Eigen::VectorXd&)); non-finite predictions
/// are counted and left out.
template <class Prediction, class Engine>
monte_carlo_result monte_carlo(const Eigen::VectorXd& estimate, const Eigen::MatrixXd& covariance,
                               int draws, Engine& engine, Prediction&& f) {
  if (!(draws >= 2))
    throw invalid_input(colligate::detail::describe("monte_carlo", "draws", draws, "must be >= 2"));
  if (covariance.rows() != estimate.size())
    detail::check_covariance("monte_carlo", covariance, estimate.size());
  const Eigen::MatrixXd L = covariance_factor(covariance);
  std::normal_distribution<double> normal(0.0, 1.0);
  monte_carlo_result r;
  r.draws = draws;
  r.values.reserve(static_cast<std::size_t>(draws));
  Eigen::VectorXd z(estimate.size());
  double mean = 0.0, m2 = 0.0;  // Welford
  for (int d = 0; d < draws; ++d) {
    for (Eigen::Index j = 0; j < z.size(); ++j) z[j] = normal(engine);
    const double y = f(Eigen::VectorXd(estimate + L * z));
    if (!std::isfinite(y)) continue;
    r.values.push_back(y);
    const double delta = y - mean;
    mean += delta / static_cast<double>(r.values.size());
    m2 += delta * (y - mean);
  }
  r.finite_draws = static_cast<int>(r.values.size());
  if (r.finite_draws >= 2) {
    r.mean = mean;
    r.standard_deviation = std::sqrt(m2 / static_cast<double>(r.finite_draws - 1));
  }
  std::sort(r.values.begin(), r.values.end());
  return r;
}

}  // namespace colligate::fit
