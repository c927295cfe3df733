#pragma once
/// \file fitted_uncertainty.hpp
/// A fit's parameter covariance as the uncertainty a fitted solute record carries
/// (data/constant_uncertainty.hpp), so that every prediction made with the record can
/// carry it on (equilibria/prediction_uncertainty.hpp); and the parameter correlation
/// matrix r_ij = u_ij / (u_i u_j) (GUM C.3.6) a fit reports.

#include <Eigen/Dense>
#include <cmath>
#include <cstddef>
#include <limits>

#include "colligate/data/constant_uncertainty.hpp"
#include "colligate/fit/levenberg_marquardt.hpp"

namespace colligate::fit {

/// The covariance of a fit with named parameters and its degrees of freedom (source key
/// colligate_fit_user). Empty ("not stated") when the fit did not converge or gave no
/// finite covariance (singular, or no degrees of freedom to scale it).
inline data::constant_uncertainty uncertainty_of(const fit_result& r) {
  data::constant_uncertainty u;
  const auto k = r.params.size();
  if (!r.success() || r.parameter_names.size() != static_cast<std::size_t>(k) ||
      r.covariance.rows() != k || !r.covariance.allFinite())
    return u;
  u.names = r.parameter_names;
  u.covariance.resize(static_cast<std::size_t>(k * k));
  for (Eigen::Index i = 0; i < k; ++i)
    for (Eigen::Index j = 0; j < k; ++j)
      u.covariance[static_cast<std::size_t>(i * k + j)] = r.covariance(i, j);
  u.degrees_of_freedom = r.degrees_of_freedom;
  u.source = "colligate_fit_user";
  return u;
}

/// Correlation matrix of a covariance (NaN rows for a parameter with zero variance).
inline Eigen::MatrixXd correlation_matrix(const Eigen::MatrixXd& covariance) {
  const Eigen::Index k = covariance.rows();
  Eigen::MatrixXd c(k, k);
  for (Eigen::Index i = 0; i < k; ++i)
    for (Eigen::Index j = 0; j < k; ++j) {
      const double d = std::sqrt(covariance(i, i) * covariance(j, j));
      c(i, j) = d > 0.0 ? covariance(i, j) / d : std::numeric_limits<double>::quiet_NaN();
    }
  return c;
}

}  // namespace colligate::fit
