#pragma once
/// \file levenberg_marquardt.hpp
/// Weighted nonlinear least squares by Levenberg-Marquardt, with parameter bounds,
/// covariance, standard errors and Student-t confidence intervals.
///
/// Problem: find p minimising chi^2(p) = sum_i w_i (y_i - f(x_i, p))^2.
///
/// Method (Marquardt 1963, SIAM J. Appl. Math. 11, 431; damping update of Nielsen 1999,
/// IMM report REP-1999-05): each step solves the damped linear least-squares problem
///
///     min || J d + e ||^2 + lambda || D d ||^2,    e = sqrt(w) (f - y), J = de/dp,
///
/// by a column-pivoted QR of the stacked matrix [J; sqrt(lambda) D], never by the normal
/// equations, so ill-conditioned problems (NIST StRD "higher difficulty") keep their digits.
/// D holds the largest column norms of J seen so far (Moré 1978, Numerical Analysis,
/// Springer, vol. 630, p. 105), which makes the iteration invariant to the scale of each parameter. A trial
/// point is projected onto the bounds; the gain ratio uses the projected step.
///
/// Statistics at the solution, from the singular value decomposition of the column-scaled
/// weighted Jacobian (so the covariance is as accurate as J allows):
///
///     covariance = s^2 (J^T W J)^-1,  s^2 = chi^2 / (n - k)   (weights relative, default)
///     covariance =     (J^T W J)^-1                           (weights = 1 / sigma^2)
///     CI_j = p_j -/+ t_{n-k}(1 - (1 - level)/2) * se_j        (Boost.Math students_t)
///
/// Errors: caller mistakes (mismatched sizes, a non-finite value in a data row, fewer
/// points than parameters, a start outside the bounds) throw colligate::invalid_input
/// naming the field. Non-convergence, a singular Jacobian and a model that returns NaN are
/// statuses of the result. Thread-safe: no shared state; the model is called from the
/// calling thread only.

#include <Eigen/Dense>
#include <algorithm>
#include <boost/math/distributions/students_t.hpp>
#include <cmath>
#include <functional>
#include <limits>
#include <numeric>
#include <string>
#include <utility>
#include <vector>

#include "colligate/core/errors.hpp"
#include "colligate/fit/detail/finite_difference.hpp"

namespace colligate::fit {

enum class fit_status {
  converged,        ///< a convergence test passed
  max_iterations,   ///< stopped at options.max_iterations
  max_evaluations,  ///< stopped at options.max_evaluations
  singular,         ///< Jacobian rank-deficient at the solution: parameters not identifiable
  non_finite        ///< the model returned NaN or infinity at the start point
};

inline const char* to_string(fit_status s) {
  switch (s) {
    case fit_status::converged: return "converged";
    case fit_status::max_iterations: return "max_iterations";
    case fit_status::max_evaluations: return "max_evaluations";
    case fit_status::singular: return "singular";
    case fit_status::non_finite: return "non_finite";
  }
  return "unknown";
}

/// Model values at every data point: f(x, p), x has one row per point.
using model_function =
    std::function<Eigen::VectorXd(const Eigen::MatrixXd& x, const Eigen::VectorXd& params)>;
/// d f_i / d p_j, one row per point, one column per parameter.
using jacobian_function =
    std::function<Eigen::MatrixXd(const Eigen::MatrixXd& x, const Eigen::VectorXd& params)>;

struct fit_options {
  int max_iterations = 500;
  int max_evaluations = 0;      ///< 0: 1000 * (number of parameters + 1)
  double x_tolerance = 1e-12;   ///< stop when ||step|| <= x_tolerance (||p|| + x_tolerance)
  double f_tolerance = 1e-15;   ///< stop when the relative chi^2 reduction and its
                                ///< prediction are both below this
  double g_tolerance = 1e-13;   ///< stop when max_j |cos(angle(J_j, e))| is below this
  Eigen::VectorXd lower_bounds; ///< empty, or one per parameter (-inf allowed)
  Eigen::VectorXd upper_bounds; ///< empty, or one per parameter (+inf allowed)
  /// Reciprocal condition number of the column-scaled weighted Jacobian below which the
  /// solution is reported singular (fewer than about 5 reliable digits in the covariance).
  double singular_threshold = 1e-11;
  /// true: weights are relative and the covariance is scaled by s^2 = chi^2/dof;
  /// false: weights are 1/sigma^2 of known measurement errors.
  bool scale_covariance = true;
  /// Rows with identical x whose y differ by more than this are flagged as contradictory.
  /// NaN (default): 10 % of the range of y.
  double duplicate_y_tolerance = std::numeric_limits<double>::quiet_NaN();
};

struct fit_result {
  Eigen::VectorXd params;
  std::vector<std::string> parameter_names;  ///< filled by the fitters; empty from curve_fit
  fit_status status = fit_status::non_finite;
  std::string message;
  int iterations = 0;
  int function_evaluations = 0;  ///< model evaluations, finite differences included
  int jacobian_evaluations = 0;  ///< Jacobians formed (analytic or by differences)
  Eigen::VectorXd fitted;        ///< f(x_i, p)
  Eigen::VectorXd residuals;     ///< y_i - f(x_i, p), unweighted
  double chi_square = std::numeric_limits<double>::quiet_NaN();  ///< sum w_i r_i^2
  int n_points = 0;
  int degrees_of_freedom = 0;    ///< n_points - number of parameters
  double residual_variance = std::numeric_limits<double>::quiet_NaN();  ///< chi^2 / dof
  Eigen::MatrixXd covariance;    ///< NaN when singular or dof = 0
  Eigen::VectorXd standard_errors;
  double r_squared = std::numeric_limits<double>::quiet_NaN();  ///< weighted, about the weighted mean
  double reciprocal_condition = std::numeric_limits<double>::quiet_NaN();
  std::vector<bool> at_bound;    ///< parameter ended on a bound (its interval is one-sided)
  /// Groups of row indices with identical x but contradictory y (see fit_options).
  std::vector<std::vector<std::size_t>> contradictory_duplicates;

  bool success() const noexcept { return status == fit_status::converged; }

  /// Two-sided Student-t quantile for a confidence level in (0, 1).
  double t_quantile(double level) const {
    if (!(level > 0.0 && level < 1.0))
      throw invalid_input(colligate::detail::describe("confidence_intervals", "level", level,
                                                      "must lie in (0, 1), e.g. 0.95"));
    if (degrees_of_freedom <= 0) return std::numeric_limits<double>::quiet_NaN();
    const boost::math::students_t dist(static_cast<double>(degrees_of_freedom));
    return boost::math::quantile(dist, 0.5 + 0.5 * level);
  }

  /// k x 2 matrix of (lower, upper) confidence limits at `level` (e.g. 0.95).
  Eigen::MatrixXd confidence_intervals(double level) const {
    const double t = t_quantile(level);
    Eigen::MatrixXd ci(params.size(), 2);
    ci.col(0) = params - t * standard_errors;
    ci.col(1) = params + t * standard_errors;
    return ci;
  }
};

namespace detail {

inline void validate_fit_input(const Eigen::MatrixXd& x, const Eigen::VectorXd& y,
                               const Eigen::VectorXd& p0, const Eigen::VectorXd& weights,
                               const fit_options& opt) {
  const char* where = "curve_fit";
  if (x.rows() != y.size())
    throw invalid_input(std::string(where) + ": x has " + std::to_string(x.rows()) +
                        " rows but y has " + std::to_string(y.size()) +
                        " values; they must match");
  if (weights.size() != 0 && weights.size() != y.size())
    throw invalid_input(std::string(where) + ": weights has " + std::to_string(weights.size()) +
                        " values but y has " + std::to_string(y.size()) + "; they must match");
  if (p0.size() == 0) throw invalid_input(std::string(where) + ": no parameters to fit");
  if (y.size() < p0.size())
    throw invalid_input(std::string(where) + ": number of data points = " +
                        std::to_string(y.size()) + ": needs at least as many points as "
                        "parameters (" + std::to_string(p0.size()) + ")");
  for (Eigen::Index i = 0; i < y.size(); ++i) {
    for (Eigen::Index c = 0; c < x.cols(); ++c)
      if (!std::isfinite(x(i, c)))
        throw invalid_input(colligate::detail::describe(
            where, "x in data row " + std::to_string(i) + " (column " + std::to_string(c) + ")",
            x(i, c), "must be finite; remove or fix the row"));
    if (!std::isfinite(y[i]))
      throw invalid_input(colligate::detail::describe(where, "y in data row " + std::to_string(i),
                                                      y[i], "must be finite; remove or fix the row"));
    if (weights.size() != 0 && !(std::isfinite(weights[i]) && weights[i] > 0.0))
      throw invalid_input(colligate::detail::describe(
          where, "weight in data row " + std::to_string(i), weights[i],
          "must be finite and > 0"));
  }
  const auto k = p0.size();
  for (const auto* b : {&opt.lower_bounds, &opt.upper_bounds})
    if (b->size() != 0 && b->size() != k)
      throw invalid_input(std::string(where) + ": bounds have " + std::to_string(b->size()) +
                          " values; give one per parameter (" + std::to_string(k) + ")");
  for (Eigen::Index j = 0; j < k; ++j) {
    const double lo = opt.lower_bounds.size() ? opt.lower_bounds[j] : -INFINITY;
    const double hi = opt.upper_bounds.size() ? opt.upper_bounds[j] : INFINITY;
    if (!std::isfinite(p0[j]))
      throw invalid_input(colligate::detail::describe(
          where, "start value of parameter " + std::to_string(j), p0[j], "must be finite"));
    if (std::isnan(lo) || std::isnan(hi) || !(lo < hi))
      throw invalid_input(colligate::detail::describe(
          where, "lower bound of parameter " + std::to_string(j), lo,
          "must be below the upper bound " + std::to_string(hi)));
    if (p0[j] < lo || p0[j] > hi)
      throw invalid_input(colligate::detail::describe(
          where, "start value of parameter " + std::to_string(j), p0[j],
          "must lie within its bounds [" + std::to_string(lo) + ", " + std::to_string(hi) + "]"));
  }
  if (!(opt.max_iterations > 0))
    throw invalid_input(colligate::detail::describe(where, "max_iterations", opt.max_iterations,
                                                    "must be > 0"));
}

/// Groups of rows with identical x whose y spread exceeds the tolerance.
inline std::vector<std::vector<std::size_t>> contradictory_duplicates(const Eigen::MatrixXd& x,
                                                                      const Eigen::VectorXd& y,
                                                                      double tolerance) {
  std::vector<std::size_t> order(static_cast<std::size_t>(y.size()));
  std::iota(order.begin(), order.end(), std::size_t{0});
  auto less = [&](std::size_t a, std::size_t b) {
    for (Eigen::Index c = 0; c < x.cols(); ++c)
      if (x(a, c) != x(b, c)) return x(a, c) < x(b, c);
    return false;
  };
  std::stable_sort(order.begin(), order.end(), less);
  if (!std::isfinite(tolerance)) tolerance = 0.1 * (y.maxCoeff() - y.minCoeff());
  std::vector<std::vector<std::size_t>> out;
  for (std::size_t a = 0; a < order.size();) {
    std::size_t b = a + 1;
    while (b < order.size() && !less(order[a], order[b])) ++b;
    if (b - a > 1) {
      double lo = INFINITY, hi = -INFINITY;
      for (std::size_t i = a; i < b; ++i) {
        lo = std::min(lo, y[order[i]]);
        hi = std::max(hi, y[order[i]]);
      }
      if (hi - lo > tolerance) {
        std::vector<std::size_t> group(order.begin() + a, order.begin() + b);
        std::sort(group.begin(), group.end());
        out.push_back(std::move(group));
      }
    }
    a = b;
  }
  return out;
}

inline bool all_finite(const Eigen::MatrixXd& m) { return m.array().isFinite().all(); }

}  // namespace detail

/// Fits f(x, p) to (x, y) by weighted least squares. `jacobian` may be empty (central
/// differences are used). `weights` may be empty (all 1).
inline fit_result curve_fit(const model_function& model, const Eigen::MatrixXd& x,
                            const Eigen::VectorXd& y, const Eigen::VectorXd& p0,
                            const Eigen::VectorXd& weights = Eigen::VectorXd(),
                            const fit_options& options = fit_options(),
                            const jacobian_function& jacobian = jacobian_function()) {
  if (!model) throw invalid_input("curve_fit: model must be a callable");
  detail::validate_fit_input(x, y, p0, weights, options);
  const Eigen::Index n = y.size();
  const Eigen::Index k = p0.size();
  const Eigen::VectorXd w = weights.size() ? weights : Eigen::VectorXd::Ones(n);
  const Eigen::VectorXd sqrt_w = w.array().sqrt();
  const Eigen::VectorXd lower =
      options.lower_bounds.size() ? options.lower_bounds
                                  : Eigen::VectorXd::Constant(k, -INFINITY);
  const Eigen::VectorXd upper =
      options.upper_bounds.size() ? options.upper_bounds : Eigen::VectorXd::Constant(k, INFINITY);
  const int max_evaluations =
      options.max_evaluations > 0 ? options.max_evaluations : 1000 * static_cast<int>(k + 1);

  fit_result r;
  r.n_points = static_cast<int>(n);
  r.degrees_of_freedom = static_cast<int>(n - k);
  r.contradictory_duplicates = detail::contradictory_duplicates(x, y, options.duplicate_y_tolerance);

  auto evaluate = [&](const Eigen::VectorXd& p) -> Eigen::VectorXd {
    ++r.function_evaluations;
    Eigen::VectorXd f = model(x, p);
    if (f.size() != n)
      throw invalid_input("curve_fit: the model returned " + std::to_string(f.size()) +
                          " values for " + std::to_string(n) + " data points");
    return f;
  };
  auto model_of_p = [&](const Eigen::VectorXd& p) { return model(x, p); };
  auto form_jacobian = [&](const Eigen::VectorXd& p, const Eigen::VectorXd& f) {
    ++r.jacobian_evaluations;
    Eigen::MatrixXd J;
    if (jacobian) {
      J = jacobian(x, p);
      if (J.rows() != n || J.cols() != k)
        throw invalid_input("curve_fit: the Jacobian must have one row per point and one column "
                            "per parameter");
    } else {
      detail::finite_difference_jacobian(model_of_p, p, f, lower, upper, J,
                                         r.function_evaluations);
    }
    return Eigen::MatrixXd(sqrt_w.asDiagonal() * J);  // weighted: d e / d p
  };

  Eigen::VectorXd p = p0;
  Eigen::VectorXd f = evaluate(p);
  auto nan_stats = [&]() {
    r.params = p;
    r.covariance = Eigen::MatrixXd::Constant(k, k, std::numeric_limits<double>::quiet_NaN());
    r.standard_errors = Eigen::VectorXd::Constant(k, std::numeric_limits<double>::quiet_NaN());
    r.at_bound.assign(static_cast<std::size_t>(k), false);
  };
  if (!detail::all_finite(f)) {
    r.status = fit_status::non_finite;
    r.message = "the model returned a non-finite value at the start point";
    nan_stats();
    r.fitted = f;
    r.residuals = y - f;
    return r;
  }
  Eigen::VectorXd e = sqrt_w.cwiseProduct(f - y);
  double cost = e.squaredNorm();
  if (!std::isfinite(cost)) {
    r.status = fit_status::non_finite;
    r.message = "chi-square overflows at the start point (weighted residuals up to " +
                std::to_string(e.cwiseAbs().maxCoeff()) +
                "): rescale the data or the weights so that residuals stay below about 1e150";
    nan_stats();
    r.fitted = f;
    r.residuals = y - f;
    r.chi_square = cost;
    return r;
  }
  Eigen::MatrixXd J = form_jacobian(p, f);
  Eigen::VectorXd D = J.colwise().norm().transpose();
  double lambda = 1e-3;
  double nu = 2.0;
  r.status = fit_status::max_iterations;
  r.message = "iteration limit reached";
  bool jacobian_ok = detail::all_finite(J);

  for (r.iterations = 0; r.iterations < options.max_iterations;) {
    if (!jacobian_ok) {
      r.status = fit_status::non_finite;
      r.message = "the Jacobian has a non-finite entry at the current parameters";
      break;
    }
    if (cost == 0.0) {
      r.status = fit_status::converged;
      r.message = "exact fit (chi-square = 0)";
      break;
    }
    // scaled gradient test: |J_j . e| / (||J_j|| ||e||)
    const Eigen::VectorXd g = J.transpose() * e;
    const Eigen::VectorXd col_norm = J.colwise().norm().transpose();
    double gmax = 0.0;
    for (Eigen::Index j = 0; j < k; ++j)
      if (col_norm[j] > 0.0) gmax = std::max(gmax, std::abs(g[j]) / (col_norm[j] * std::sqrt(cost)));
    if (gmax <= options.g_tolerance) {
      r.status = fit_status::converged;
      r.message = "gradient orthogonal to the residuals (g_tolerance)";
      break;
    }
    for (Eigen::Index j = 0; j < k; ++j) D[j] = std::max(D[j], col_norm[j]);
    const double dmax = D.maxCoeff();
    if (!(dmax > 0.0)) {
      r.status = fit_status::singular;
      r.message = "the model does not depend on any parameter (zero Jacobian)";
      break;
    }
    Eigen::VectorXd Ds = D;
    for (Eigen::Index j = 0; j < k; ++j)
      if (!(Ds[j] > 0.0)) Ds[j] = dmax * std::numeric_limits<double>::epsilon();

    ++r.iterations;
    bool accepted = false;
    bool stop = false;
    while (!accepted) {
      if (r.function_evaluations >= max_evaluations) {
        r.status = fit_status::max_evaluations;
        r.message = "model-evaluation limit reached";
        stop = true;
        break;
      }
      // damped step from the stacked least-squares problem
      Eigen::MatrixXd A(n + k, k);
      A.topRows(n) = J;
      A.bottomRows(k) = (std::sqrt(lambda) * Ds).asDiagonal();
      Eigen::VectorXd rhs = Eigen::VectorXd::Zero(n + k);
      rhs.head(n) = -e;
      const Eigen::VectorXd step = A.colPivHouseholderQr().solve(rhs);
      const Eigen::VectorXd p_trial = (p + step).cwiseMax(lower).cwiseMin(upper);
      const Eigen::VectorXd d = p_trial - p;
      const double predicted = cost - (e + J * d).squaredNorm();
      const Eigen::VectorXd f_trial = evaluate(p_trial);
      const bool finite = detail::all_finite(f_trial);
      const Eigen::VectorXd e_trial = sqrt_w.cwiseProduct(f_trial - y);
      const double cost_trial = finite ? e_trial.squaredNorm() : INFINITY;
      const double actual = cost - cost_trial;
      const double rho = predicted > 0.0 ? actual / predicted : (actual > 0.0 ? 1.0 : -1.0);
      const double step_norm = d.norm();
      if (finite && rho > 1e-4) {
        accepted = true;
        p = p_trial;
        f = f_trial;
        e = e_trial;
        const double old_cost = cost;
        cost = cost_trial;
        lambda *= std::max(1.0 / 3.0, 1.0 - std::pow(2.0 * rho - 1.0, 3));
        nu = 2.0;
        J = form_jacobian(p, f);
        jacobian_ok = detail::all_finite(J);
        if (actual <= options.f_tolerance * old_cost && predicted <= options.f_tolerance * old_cost) {
          r.status = fit_status::converged;
          r.message = "relative reduction of chi-square below f_tolerance";
          stop = true;
        } else if (step_norm <= options.x_tolerance * (p.norm() + options.x_tolerance)) {
          r.status = fit_status::converged;
          r.message = "relative step below x_tolerance";
          stop = true;
        }
      } else {
        lambda *= nu;
        nu *= 2.0;
        if (step_norm <= options.x_tolerance * (p.norm() + options.x_tolerance) || lambda > 1e32) {
          // no step, however short, lowers chi-square: the minimum is resolved to rounding
          r.status = fit_status::converged;
          r.message = "no shorter step reduces chi-square (x_tolerance)";
          stop = true;
          break;
        }
      }
    }
    if (stop) break;
  }
  if (r.status == fit_status::max_iterations) r.iterations = options.max_iterations;
  if (!detail::all_finite(p) || !std::isfinite(cost)) {
    r.status = fit_status::non_finite;
    r.message = "the parameters or chi-square became non-finite during the fit";
  }

  // --- statistics at the final point ----------------------------------------------------
  r.params = p;
  r.fitted = f;
  r.residuals = y - f;
  r.chi_square = (w.array() * r.residuals.array().square()).sum();
  const double wsum = w.sum();
  const double ymean = w.dot(y) / wsum;
  const double ss_tot = (w.array() * (y.array() - ymean).square()).sum();
  r.r_squared = ss_tot > 0.0 ? 1.0 - r.chi_square / ss_tot : std::numeric_limits<double>::quiet_NaN();
  r.at_bound.assign(static_cast<std::size_t>(k), false);
  for (Eigen::Index j = 0; j < k; ++j) r.at_bound[j] = p[j] <= lower[j] || p[j] >= upper[j];
  r.residual_variance = r.degrees_of_freedom > 0 ? r.chi_square / r.degrees_of_freedom
                                                 : std::numeric_limits<double>::quiet_NaN();
  if (!std::isfinite(r.chi_square) && r.status != fit_status::non_finite) {
    r.status = fit_status::non_finite;
    r.message = "chi-square is not finite at the final parameters";
  }
  const double nan = std::numeric_limits<double>::quiet_NaN();
  r.covariance = Eigen::MatrixXd::Constant(k, k, nan);
  r.standard_errors = Eigen::VectorXd::Constant(k, nan);
  if (!jacobian_ok || !detail::all_finite(J)) return r;
  const Eigen::VectorXd scale = J.colwise().norm().transpose();
  if ((scale.array() > 0.0).all()) {
    const Eigen::MatrixXd Js = J * scale.cwiseInverse().asDiagonal();
    Eigen::JacobiSVD<Eigen::MatrixXd> svd(Js, Eigen::ComputeThinV);
    const Eigen::VectorXd sv = svd.singularValues();
    r.reciprocal_condition = sv[k - 1] / sv[0];
  } else {
    r.reciprocal_condition = 0.0;
  }
  if (!(r.reciprocal_condition >= options.singular_threshold)) {
    r.status = fit_status::singular;
    r.message = "Jacobian rank-deficient at the solution (reciprocal condition " +
                std::to_string(r.reciprocal_condition) +
                "): some parameters are not determined by these data";
    return r;
  }
  const Eigen::MatrixXd Js = J * scale.cwiseInverse().asDiagonal();
  Eigen::JacobiSVD<Eigen::MatrixXd> svd(Js, Eigen::ComputeThinV);
  const Eigen::MatrixXd V = svd.matrixV();
  const Eigen::VectorXd inv_s2 = svd.singularValues().array().square().inverse();
  Eigen::MatrixXd cov = V * inv_s2.asDiagonal() * V.transpose();
  cov = scale.cwiseInverse().asDiagonal() * cov * scale.cwiseInverse().asDiagonal();
  if (options.scale_covariance) {
    if (r.degrees_of_freedom <= 0) return r;  // no scatter estimate: covariance stays NaN
    cov *= r.residual_variance;
  }
  r.covariance = cov;
  r.standard_errors = cov.diagonal().cwiseSqrt();
  return r;
}

}  // namespace colligate::fit
