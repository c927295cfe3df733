#pragma once
/// \file finite_difference.hpp
/// Jacobian of a vector model by central differences, one-sided next to a bound.
/// Internal to fit/levenberg_marquardt.hpp.

#include <Eigen/Dense>
#include <cmath>
#include <functional>
#include <limits>

namespace colligate::fit::detail {

/// Step for parameter value p: cbrt(eps) * max(|p|, 1e-8 ... ) keeps the truncation and
/// rounding errors of a central difference balanced (common practice: Numerical Recipes,
/// section 5.7, h ~ eps^(1/3) x).
inline double difference_step(double p) {
  const double cbrt_eps = std::cbrt(std::numeric_limits<double>::epsilon());
  return cbrt_eps * (std::abs(p) > 0.0 ? std::abs(p) : 1.0);
}

/// Fills `jac` (n x k) with d f / d p at p. `f(p)` returns the model at every point.
/// Counts model evaluations in `evaluations`. A non-finite model value gives a
/// non-finite column, which the caller treats as a failed Jacobian.
inline void finite_difference_jacobian(
    const std::function<Eigen::VectorXd(const Eigen::VectorXd&)>& f, const Eigen::VectorXd& p,
    const Eigen::VectorXd& f_at_p, const Eigen::VectorXd& lower, const Eigen::VectorXd& upper,
    Eigen::MatrixXd& jac, int& evaluations) {
  const Eigen::Index k = p.size();
  jac.resize(f_at_p.size(), k);
  Eigen::VectorXd q = p;
  for (Eigen::Index j = 0; j < k; ++j) {
    const double h = difference_step(p[j]);
    const bool room_up = p[j] + h <= upper[j];
    const bool room_down = p[j] - h >= lower[j];
    if (room_up && room_down) {
      q[j] = p[j] + h;
      const Eigen::VectorXd f_up = f(q);
      q[j] = p[j] - h;
      const Eigen::VectorXd f_down = f(q);
      evaluations += 2;
      jac.col(j) = (f_up - f_down) / (2.0 * h);
    } else if (room_up) {
      q[j] = p[j] + h;
      jac.col(j) = (f(q) - f_at_p) / h;
      evaluations += 1;
    } else {
      q[j] = p[j] - h;
      jac.col(j) = (f_at_p - f(q)) / h;
      evaluations += 1;
    }
    q[j] = p[j];
  }
}

}  // namespace colligate::fit::detail
