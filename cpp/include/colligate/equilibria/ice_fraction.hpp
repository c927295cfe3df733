#pragma once
/// \file ice_fraction.hpp
/// Ice-fraction curve: below the initial freezing point, ice takes water out of the
/// solution; the solutes stay in the unfrozen phase. At temperature T the unfrozen water
/// W_u satisfies ln a_w(solutes in W_u, T) = ln a_w,ice(T) (DESIGN section 1). Water that
/// cannot freeze (bound) is neither ice nor solvent. Then
///
///     ice = W_total - W_u - W_bound,   ice fraction = ice / W_total.
///
/// W_u is found by TOMS 748 on ln W_u (a_w falls monotonically as water is removed).
/// Above the freezing point the ice fraction is 0 (not an error).
/// Not yet handled: crystallisation of a solute whose solubility is passed in the
/// unfrozen phase; the validity record flags concentrations beyond the model's range.

#include <boost/math/tools/roots.hpp>
#include <cmath>
#include <cstdint>
#include <limits>

#include "colligate/core/solution.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/equilibria/freezing_point.hpp"
#include "colligate/equilibria/solver_status.hpp"
#include "colligate/models/water_activity.hpp"
#include "colligate/water/ice.hpp"

namespace colligate::equilibria {

/// State of a partly frozen solution at one temperature. Masses in kg.
struct unfrozen_phase {
  double temperature = std::numeric_limits<double>::quiet_NaN();  ///< K
  double total_water = 0.0;      ///< water in the food, kg
  double bound_water = 0.0;      ///< water that cannot freeze, kg
  double unfrozen_water = 0.0;   ///< liquid (solvent) water, kg
  double ice = 0.0;              ///< ice, kg
  double water_activity = std::numeric_limits<double>::quiet_NaN();
  solve_status status = solve_status::converged;
  int iterations = 0;
  validity check;

  /// Ice mass over total water mass.
  double ice_fraction() const noexcept { return ice / total_water; }
  bool success() const noexcept {
    return status == solve_status::converged || status == solve_status::not_frozen;
  }
};

/// Ice, unfrozen water and water activity at temperature T (K).
inline unfrozen_phase unfrozen_phase_at(const solution& s, double temperature,
                                        models::model_id m = models::model_id::automatic,
                                        double bound_water_kg = 0.0) {
  models::check_temperature_argument("ice_fraction", temperature);
  detail::check_bound_water("ice_fraction", s, bound_water_kg);
  unfrozen_phase r;
  r.temperature = temperature;
  r.total_water = s.water_mass();
  r.bound_water = bound_water_kg;
  const double W = s.water_mass() - bound_water_kg;
  const double T = temperature;
  const double ln_aw_solution = models::ln_water_activity(m, s, W, T);
  const double ln_aw_ice = T < constants::ice_point ? water::ln_water_activity_of_ice(T) : 0.0;
  if (T >= constants::ice_point || !(ln_aw_solution > ln_aw_ice)) {
    // At or above the freezing point: no ice.
    r.status = solve_status::not_frozen;
    r.unfrozen_water = W;
    r.ice = 0.0;
    r.water_activity = std::exp(ln_aw_solution);
    r.check = models::check(m, s, W, T);
    return r;
  }
  double total_moles = 0.0;
  for (double n : s.moles()) total_moles += n;
  if (total_moles == 0.0) {  // pure water below the ice point: all freezable water is ice
    r.unfrozen_water = 0.0;
    r.ice = W;
    r.water_activity = std::exp(ln_aw_ice);
    r.check = water::ice_temperature_validity(T);
    return r;
  }
  // g(u) = ln a_w(W_u = exp(u)) - ln a_w,ice(T): positive at u = ln W, negative as W_u -> 0.
  auto g = [&](double u) { return models::ln_water_activity(m, s, std::exp(u), T) - ln_aw_ice; };
  const double u_hi = std::log(W);
  double u_lo = u_hi - 2.0;
  double g_lo = g(u_lo);
  while (!(g_lo < 0.0) && u_lo > u_hi - 60.0) {
    u_lo -= 4.0;
    g_lo = g(u_lo);
  }
  if (!(g_lo < 0.0)) {
    r.status = solve_status::max_iterations;
    r.check.reason = "ice_fraction: no unfrozen-water mass satisfies the ice equilibrium";
    return r;
  }
  std::uintmax_t max_iter = 100;
  boost::math::tools::eps_tolerance<double> tol(50);
  const auto [a, b] = boost::math::tools::toms748_solve(g, u_lo, u_hi, g_lo, g(u_hi), tol, max_iter);
  r.iterations = static_cast<int>(max_iter);
  r.status = max_iter >= 100 ? solve_status::max_iterations : solve_status::converged;
  const double Wu = std::exp(0.5 * (a + b));
  r.unfrozen_water = Wu;
  r.ice = s.water_mass() - Wu - bound_water_kg;
  r.water_activity = std::exp(ln_aw_ice);
  r.check = models::check(m, s, Wu, T);
  r.check.merge(water::ice_temperature_validity(T));
  return r;
}

/// Ice mass / total water at T with the caller's range policy.
inline checked_value ice_fraction(const solution& s, double temperature,
                                  models::model_id m = models::model_id::automatic,
                                  range_policy policy = range_policy::extrapolate,
                                  double bound_water_kg = 0.0) {
  const auto r = unfrozen_phase_at(s, temperature, m, bound_water_kg);
  if (!r.success())
    throw convergence_error(std::string("ice_fraction: root finder stopped: ") +
                            to_string(r.status) + (r.check.reason.empty() ? "" : ": ") +
                            r.check.reason);
  return apply_policy(r.ice_fraction(), r.check, policy);
}

}  // namespace colligate::equilibria
