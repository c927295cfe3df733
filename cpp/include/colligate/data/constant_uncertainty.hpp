#pragma once
/// \file constant_uncertainty.hpp
/// The standard uncertainties of a solute record's constants and their covariance, in the
/// vocabulary of the GUM (JCGM 100:2008, sections 3.3.5, 5.2): which constants are
/// uncertain, their covariance matrix u(p_i, p_j), the degrees of freedom it rests on, and
/// where it comes from.
///
/// Names are the record's constant names as the fitters write them: "norrish_k",
/// "norrish_k3" (Norrish constants), "molar_mass" (kg/mol), and for a record's own Pitzer
/// row "beta0", "beta1", "beta2", "cphi" (the 298.15 K term a[0] of each t_function; an
/// uncertainty of that term shifts the parameter equally at every temperature) and
/// "dbeta0_dT", "dbeta1_dT", "dbeta2_dT", "dcphi_dT" (the linear term a[3], per K).
///
/// A record without an entry has uncertainty "not stated": its constants enter a
/// propagation as exact, and the propagation lists them as such.

#include <cstddef>
#include <string>
#include <vector>

namespace colligate::data {

struct constant_uncertainty {
  std::vector<std::string> names;  ///< uncertain constants, in covariance order
  /// n x n covariance, row-major, in the constants' SI units squared.
  std::vector<double> covariance;
  /// Degrees of freedom of the covariance estimate: n_points - n_parameters of a fit;
  /// 0 when the covariance is taken as exactly known (coverage from the normal law).
  int degrees_of_freedom = 0;
  std::string source;  ///< citation key, or "colligate_fit_user" for a fit of the user's data

  bool stated() const noexcept { return !names.empty(); }
  std::size_t size() const noexcept { return names.size(); }
  double at(std::size_t i, std::size_t j) const { return covariance.at(i * names.size() + j); }
};

}  // namespace colligate::data
