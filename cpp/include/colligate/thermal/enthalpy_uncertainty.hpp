#pragma once
/// \file enthalpy_uncertainty.hpp
/// The enthalpy of a food and the heat load between two temperatures with their standard
/// uncertainty from the covariance of the water phase's constants (linear propagation,
/// equilibria/prediction_uncertainty.hpp).
///
/// Only the latent term of thermal/enthalpy.hpp depends on the activity constants: with I(T)
/// the ice fraction of the water, x_w the water fraction of the food and L(T) the specific
/// enthalpy of fusion,
///
///     dH(T)/dp = x_w [ -L(T) dI(T)/dp + L(T_ref) dI(T_ref)/dp ]    (T <= 273.15 K)
///     dH(T)/dp = x_w L(T_ref) dI(T_ref)/dp                           (T >  273.15 K)
///
/// (T_ref = 233.15 K, the reference state H = 0), and the heat load H(from) - H(to) has the
/// difference of the two gradients, so the reference drops out of it. dI/dp comes from the
/// implicit differentiation of the ice equilibrium (prediction_uncertainty.hpp). The
/// sensible heats and L(T) are taken as exact here; their own uncertainties (Choi & Okos
/// 1986 correlations, IAPWS) are not propagated.

#include <Eigen/Dense>
#include <cmath>
#include <string>

#include "colligate/core/constants.hpp"
#include "colligate/equilibria/prediction_uncertainty.hpp"
#include "colligate/thermal/enthalpy.hpp"

namespace colligate::thermal {

namespace detail {

/// dH(T)/dp (J/kg per unit of each constant), by the file comment.
inline Eigen::VectorXd enthalpy_gradient(const food& f, double T) {
  const auto& s = f.water_phase();
  const double bound = f.bound_water_in_phase();
  const double xw = f.composition().water;
  const auto ice_ref = equilibria::propagate_linear(equilibria::predicted_quantity::ice_fraction, s,
                                                    reference_temperature, f.model(), bound);
  Eigen::VectorXd g = xw * latent_heat(reference_temperature) * ice_ref.sensitivities;
  if (T <= constants::ice_point) {
    const auto ice_t = equilibria::propagate_linear(equilibria::predicted_quantity::ice_fraction, s,
                                                    T, f.model(), bound);
    g -= xw * latent_heat(T) * ice_t.sensitivities;
  }
  return g;
}

inline equilibria::prediction_uncertainty finish(const food& f, double value, const validity& check,
                                                 const Eigen::VectorXd& g) {
  const auto c = equilibria::uncertain_constants(f.water_phase());
  equilibria::prediction_uncertainty out;
  out.not_stated = c.not_stated;
  for (std::size_t k = 0; k < c.constants.size(); ++k) out.constants.push_back(c.label(k, f.water_phase()));
  out.sensitivities = g;
  out.check = check;
  out.result.value = value;
  if (!std::isfinite(value)) return out;
  const double u2 = g.size() ? fit::delta_method_variance(g, c.covariance) : 0.0;
  out.result.standard_uncertainty = std::sqrt(u2);
  out.result.degrees_of_freedom = equilibria::detail::effective_dof(c, g, u2);
  return out;
}

}  // namespace detail

/// Specific enthalpy at T (J/kg, H = 0 at 233.15 K) with its standard uncertainty.
inline equilibria::prediction_uncertainty enthalpy_with_uncertainty(const food& f, double temperature) {
  const auto h = enthalpy(f, temperature, range_policy::extrapolate);
  return detail::finish(f, h.value, h.check, detail::enthalpy_gradient(f, temperature));
}

/// Heat removed from `from_temperature` to `to_temperature` (J/kg, H(from) - H(to)) with its
/// standard uncertainty.
inline equilibria::prediction_uncertainty heat_load_with_uncertainty(const food& f, double from_temperature,
                                                                     double to_temperature) {
  const auto a = enthalpy(f, from_temperature, range_policy::extrapolate);
  const auto b = enthalpy(f, to_temperature, range_policy::extrapolate);
  validity v = a.check;
  v.merge(b.check);
  return detail::finish(f, a.value - b.value, v,
                        detail::enthalpy_gradient(f, from_temperature) -
                            detail::enthalpy_gradient(f, to_temperature));
}

}  // namespace colligate::thermal
