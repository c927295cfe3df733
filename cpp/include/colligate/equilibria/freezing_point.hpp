#pragma once
/// \file freezing_point.hpp
/// Initial freezing point: the temperature T at which the whole solution is in
/// equilibrium with ice, ln a_w(solution, T) = ln a_w,ice(T) (DESIGN section 1).
/// Solved by Boost.Math's TOMS 748 bracketed root finder between the ice point and
/// `search_min_temperature`. Water that cannot freeze (`bound_water_kg`, e.g. bound to
/// protein) is taken out of the solvent.

#include <boost/math/tools/roots.hpp>
#include <cmath>
#include <cstdint>
#include <limits>
#include <string>

#include "colligate/core/constants.hpp"
#include "colligate/core/errors.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/equilibria/solver_status.hpp"
#include "colligate/models/water_activity.hpp"
#include "colligate/water/ice.hpp"

namespace colligate::equilibria {

/// Lowest temperature searched for a freezing point, K (-50 C). The ice equilibrium is
/// validated to 233.15 K; results between 223.15 and 233.15 K are flagged.
inline constexpr double search_min_temperature = 223.15;

struct freezing_point_result {
  double temperature = std::numeric_limits<double>::quiet_NaN();  ///< K
  solve_status status = solve_status::converged;
  int iterations = 0;
  validity check;  ///< empty if every input was within its model's validated range
  bool success() const noexcept { return status == solve_status::converged; }
};

namespace detail {

inline void check_bound_water(const char* where, const solution& s, double bound_water_kg) {
  if (!std::isfinite(bound_water_kg) || bound_water_kg < 0.0 ||
      !(bound_water_kg < s.water_mass()))
    throw invalid_input(colligate::detail::describe(
        where, "bound_water", bound_water_kg,
        "must be finite, >= 0 kg and below the water in the solution (" +
            std::to_string(s.water_mass()) + " kg)"));
}

/// f(T) = ln a_w(solution with `water_kg`, T) - ln a_w,ice(T); negative above the
/// freezing point, positive below it.
inline double ice_imbalance(models::model_id m, const solution& s, double water_kg, double T) {
  return models::ln_water_activity(m, s, water_kg, T) - water::ln_water_activity_of_ice(T);
}

/// Models whose water activity does not depend on temperature (their constants are used
/// unchanged at every T); the freezing point then inverts the ice equilibrium directly.
inline bool temperature_independent(models::model_id resolved) {
  return resolved == models::model_id::ideal || resolved == models::model_id::raoult ||
         resolved == models::model_id::norrish;
}

}  // namespace detail

/// Initial freezing point of a solution, K, with status and validity.
inline freezing_point_result freezing_point(const solution& s,
                                            models::model_id m = models::model_id::automatic,
                                            double bound_water_kg = 0.0) {
  detail::check_bound_water("freezing_point", s, bound_water_kg);
  const double W = s.water_mass() - bound_water_kg;
  freezing_point_result r;
  double total_moles = 0.0;
  for (double n : s.moles()) total_moles += n;
  if (total_moles == 0.0) {
    r.temperature = constants::ice_point;
    return r;
  }
  if (detail::temperature_independent(models::resolve(m, s))) {
    // a_w does not depend on T: invert the ice equilibrium directly (Newton on ice.hpp).
    const double ln_aw = models::ln_water_activity(m, s, W, constants::ice_point);
    const double T = water::temperature_of_ice_equilibrium(ln_aw, search_min_temperature);
    if (std::isnan(T)) {
      r.status = solve_status::below_search_limit;
      r.check.reason = colligate::detail::describe(
          "freezing_point", "lowest temperature searched", search_min_temperature,
          "the solution does not freeze above this temperature (-50 C)");
      return r;
    }
    r.temperature = T;
    r.check = models::check(m, s, W, T);
    r.check.merge(water::ice_temperature_validity(T));
    return r;
  }
  auto f = [&](double T) { return detail::ice_imbalance(m, s, W, T); };
  const double hi = constants::ice_point;
  const double lo = search_min_temperature;
  const double f_hi = f(hi);
  const double f_lo = f(lo);
  if (!(f_lo > 0.0)) {
    r.status = solve_status::below_search_limit;
    r.check.reason = colligate::detail::describe(
        "freezing_point", "lowest temperature searched", lo,
        "the solution does not freeze above this temperature (-50 C)");
    return r;
  }
  if (!(f_hi < 0.0)) {  // vanishingly dilute: depression below rounding
    r.temperature = hi;
    r.check = models::check(m, s, W, hi);
    return r;
  }
  std::uintmax_t max_iter = 100;
  boost::math::tools::eps_tolerance<double> tol(48);
  const auto [a, b] = boost::math::tools::toms748_solve(f, lo, hi, f_lo, f_hi, tol, max_iter);
  r.temperature = 0.5 * (a + b);
  r.iterations = static_cast<int>(max_iter);
  r.status = max_iter >= 100 ? solve_status::max_iterations : solve_status::converged;
  r.check = models::check(m, s, W, r.temperature);
  r.check.merge(water::ice_temperature_validity(r.temperature));
  return r;
}

/// Convenience: the freezing point with the caller's range policy; throws
/// convergence_error if the solve fails.
inline checked_value freezing_point_checked(const solution& s,
                                            models::model_id m = models::model_id::automatic,
                                            range_policy policy = range_policy::extrapolate,
                                            double bound_water_kg = 0.0) {
  const auto r = freezing_point(s, m, bound_water_kg);
  if (r.status == solve_status::below_search_limit) {
    if (policy == range_policy::raise) throw out_of_validity_range(r.check.reason);
    return {std::numeric_limits<double>::quiet_NaN(), r.check};
  }
  if (!r.success())
    throw convergence_error(std::string("freezing_point: root finder stopped: ") +
                            to_string(r.status));
  return apply_policy(r.temperature, r.check, policy);
}

}  // namespace colligate::equilibria
