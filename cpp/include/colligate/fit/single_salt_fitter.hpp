#pragma once
/// \file single_salt_fitter.hpp
/// Fit Pitzer's binary parameters beta0, beta1 and C-phi of one salt of any charge type
/// (M_(nu_M) X_(nu_X), alpha1 = 2, b = 1.2) to freezing points of its solutions, in the
/// closed binary form of models/pitzer_single_salt.hpp. For salts whose ions the mixture
/// tables do not hold (citrate, acetate, phosphates...): fit/pitzer_fitter.hpp fits salts
/// of the mixture kernel's ions.
///
/// The parameters are taken as constant over the freezing temperatures of the data (a
/// few kelvin below 0 C for food salts); A_phi follows T. The model value of a row is the
/// freezing temperature T_f(m; p), the root of ln a_w(m, T; p) = ln a_w,ice(T).
///
/// Jacobian. ln a_w = -phi nu m M_w and phi is linear in the parameters,
///     phi = phi_DH(m, T) + g0 beta0 + g1 beta1 + g3 C-phi
/// (models::single_salt::osmotic_parameter_weights), so by implicit differentiation
///     d T_f / d p_j = nu m M_w g_j / h'(T_f),
///     h'(T) = d ln a_w / dT - L_f(T) / (R T^2),
/// with d ln a_w / dT through dA_phi/dT and L_f the enthalpy of fusion of ice
/// (water/ice.hpp): no finite differences.
///
/// Inputs SI: molality mol/kg, temperature K. Caller mistakes (charges, counts, rows out of
/// range, fewer rows than parameters) throw invalid_input naming the field; fit failures
/// are statuses of the fit_result.

#include <Eigen/Dense>
#include <cmath>
#include <cstdlib>
#include <limits>
#include <string>

#include "colligate/core/constants.hpp"
#include "colligate/core/errors.hpp"
#include "colligate/data/single_salt_pitzer.hpp"
#include "colligate/fit/fitters.hpp"
#include "colligate/fit/levenberg_marquardt.hpp"
#include "colligate/models/pitzer_single_salt.hpp"
#include "colligate/water/ice.hpp"

namespace colligate::fit {

/// The salt's charges and counts per formula unit (the parameters are ignored) and the
/// starting values of beta0, beta1, C-phi.
struct single_salt_fit_options {
  double beta0_start = 0.1;   ///< kg/mol
  double beta1_start = 0.3;   ///< kg/mol
  double cphi_start = 0.0;    ///< kg^2/mol^2
  /// Fit C-phi too; false holds it at 0 (data that do not reach the molalities where the
  /// third virial term shows leave it undetermined).
  bool fit_cphi = true;
  fit_options least_squares;  ///< solver settings (bounds, tolerances)
};

namespace detail {

inline data::single_salt_parameters single_salt_trial(const data::single_salt_parameters& shape,
                                                      const Eigen::VectorXd& p) {
  data::single_salt_parameters r = shape;
  r.beta0 = p[0];
  r.beta1 = p[1];
  r.beta2 = 0.0;
  r.cphi = p.size() > 2 ? p[2] : 0.0;
  return r;
}

inline void check_single_salt_shape(const char* where, const data::single_salt_parameters& s) {
  const auto bad = [&](const char* field, int v, const char* range) {
    throw invalid_input(std::string(where) + ": " + field + " = " + std::to_string(v) +
                        " must be " + range);
  };
  if (s.cation_charge < 1 || s.cation_charge > 4) bad("cation_charge", s.cation_charge, "1 to 4");
  if (s.anion_charge > -1 || s.anion_charge < -4) bad("anion_charge", s.anion_charge, "-1 to -4");
  if (s.cation_count < 1 || s.cation_count > 4) bad("cation_count", s.cation_count, "1 to 4");
  if (s.anion_count < 1 || s.anion_count > 4) bad("anion_count", s.anion_count, "1 to 4");
  if (s.cation_charge * s.cation_count + s.anion_charge * s.anion_count != 0)
    throw invalid_input(std::string(where) + ": the formula unit is not neutral (" +
                        std::to_string(s.cation_count) + " x " + std::to_string(s.cation_charge) +
                        " + " + std::to_string(s.anion_count) + " x " +
                        std::to_string(s.anion_charge) + ")");
  if (s.cation_charge == 2 && s.anion_charge == -2)
    throw invalid_input(std::string(where) +
                        ": a 2:2 salt needs beta2 (alpha1 = 1.4, alpha2 = 12); fit it with "
                        "fit_pitzer when its ions are in the Pitzer tables");
}

}  // namespace detail

/// Pitzer parameters (beta0, beta1 and, unless options.fit_cphi is false, C-phi) of the
/// salt shaped like `shape` (charges and counts; alpha1 = 2) from the freezing temperatures `freezing_temperature` (K) of its
/// solutions at `molality` (mol/kg). Weights optional (relative, e.g. 1/sigma^2).
inline fit_result fit_single_salt_freezing_point(const data::single_salt_parameters& shape,
                                                 const Eigen::VectorXd& molality,
                                                 const Eigen::VectorXd& freezing_temperature,
                                                 const Eigen::VectorXd& weights = Eigen::VectorXd(),
                                                 const single_salt_fit_options& options = {}) {
  const char* where = "fit_single_salt (freezing point)";
  detail::check_single_salt_shape(where, shape);
  detail::check_same_size(where, molality, "molality", freezing_temperature, "freezing_temperature");
  detail::check_rows(where, "molality", molality, 0.0, INFINITY, true, true, "(0, inf) mol/kg");
  detail::check_rows(where, "freezing_temperature", freezing_temperature,
                     water::ice_model_lowest_temperature, constants::ice_point, false, true,
                     "[215, 273.15) K");
  Eigen::MatrixXd x(molality.size(), 1);
  x.col(0) = molality;
  const double nu = shape.cation_count + shape.anion_count;
  auto model = [shape](const Eigen::MatrixXd& xx, const Eigen::VectorXd& p) {
    const auto trial = detail::single_salt_trial(shape, p);
    Eigen::VectorXd f(xx.rows());
    for (Eigen::Index i = 0; i < xx.rows(); ++i)
      f[i] = models::single_salt::freezing_temperature_closed_form(trial, xx(i, 0));
    return f;
  };
  auto jacobian = [shape, nu, model](const Eigen::MatrixXd& xx, const Eigen::VectorXd& p) {
    const auto trial = detail::single_salt_trial(shape, p);
    const Eigen::VectorXd tf = model(xx, p);
    Eigen::MatrixXd J(xx.rows(), p.size());
    for (Eigen::Index i = 0; i < xx.rows(); ++i) {
      const double m = xx(i, 0), T = tf[i];
      if (!std::isfinite(T)) {
        J.row(i).setConstant(std::numeric_limits<double>::quiet_NaN());
        continue;
      }
      const double dh_dT =
          models::single_salt::ln_water_activity_temperature_slope(trial, m, T) -
          water::enthalpy_of_fusion(T) / (constants::gas_constant * T * T);
      const auto g = models::single_salt::osmotic_parameter_weights(trial, m);
      const double scale = nu * m * constants::molar_mass_water / dh_dT;
      J(i, 0) = scale * g[0];
      J(i, 1) = scale * g[1];
      if (p.size() > 2) J(i, 2) = scale * g[3];
    }
    return J;
  };
  Eigen::VectorXd p0(options.fit_cphi ? 3 : 2);
  p0[0] = options.beta0_start;
  p0[1] = options.beta1_start;
  if (options.fit_cphi) p0[2] = options.cphi_start;
  auto r = curve_fit(model, x, freezing_temperature, p0, weights, options.least_squares, jacobian);
  r.parameter_names = {"beta0", "beta1"};
  if (options.fit_cphi) r.parameter_names.push_back("cphi");
  return r;
}

}  // namespace colligate::fit
