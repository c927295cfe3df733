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
/// Salt limits (models 'pitzer', 'ross' and 'auto' with electrolytes): the ice curve
/// stops where the unfrozen brine becomes saturated in a salt phase
/// (equilibria/salt_solubility.hpp). Below that temperature (the eutectic of a binary
/// salt solution; the first salt crystallisation of a mixture) the result has status
/// below_eutectic, NaN masses, and a reason naming the eutectic temperature and the salt,
/// instead of an extrapolated ice fraction. eutectic() returns that temperature.
/// Non-electrolyte crystallisation (lactose) is not handled yet.

#include <boost/math/tools/roots.hpp>
#include <cmath>
#include <cstdint>
#include <cstdio>
#include <limits>
#include <string>

#include "colligate/core/solution.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/equilibria/freezing_point.hpp"
#include "colligate/equilibria/salt_solubility.hpp"
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

namespace detail {

/// The ice equilibrium at T without the salt limit. `with_check` false leaves r.check
/// without the model's validity (the eutectic search, which reads only the masses, runs
/// many of these; the Ross rule comparison is a nested root solve).
inline unfrozen_phase solve_ice_equilibrium(const solution& s, double temperature,
                                            models::model_id m, double bound_water_kg,
                                            bool with_check = true) {
  models::check_temperature_argument("ice_fraction", temperature);
  detail::check_bound_water("ice_fraction", s, bound_water_kg);
  unfrozen_phase r;
  r.temperature = temperature;
  r.total_water = s.water_mass();
  r.bound_water = bound_water_kg;
  const double W = s.water_mass() - bound_water_kg;
  const double T = temperature;
  // The species are prepared once for the whole search (same values as ln_water_activity).
  models::ln_water_activity_evaluator ln_aw(m, s);
  const double ln_aw_solution = ln_aw(W, T);
  const double ln_aw_ice = T < constants::ice_point ? water::ln_water_activity_of_ice(T) : 0.0;
  if (T >= constants::ice_point || !(ln_aw_solution > ln_aw_ice)) {
    // At or above the freezing point: no ice.
    r.status = solve_status::not_frozen;
    r.unfrozen_water = W;
    r.ice = 0.0;
    r.water_activity = std::exp(ln_aw_solution);
    if (with_check) r.check = ln_aw.check(W, T);
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
  auto g = [&](double u) { return ln_aw(std::exp(u), T) - ln_aw_ice; };
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
  if (with_check) {
    r.check = ln_aw.check(Wu, T);
    r.check.merge(water::ice_temperature_validity(T));
  }
  return r;
}

/// True if the model computes ion activities, so salt saturation can be evaluated.
inline bool has_salt_limits(models::model_id m, const solution& s) {
  const auto r = models::resolve(m, s);
  return s.has_electrolytes() && (r == models::model_id::pitzer || r == models::model_id::ross);
}

}  // namespace detail

/// Where the ice curve of a solution ends because a salt crystallises.
struct eutectic_result {
  double temperature = std::numeric_limits<double>::quiet_NaN();  ///< K
  bool found = false;
  std::string phase;    ///< mineral name ("hydrohalite"), empty if none found
  std::string formula;  ///< "NaCl.2H2O"
  std::string source;   ///< citation key of the solubility product
  std::string reason;   ///< why none was found, or a caution ("" otherwise)
};

/// Eutectic temperature of a solution: the highest temperature below its freezing
/// point at which the unfrozen brine in equilibrium with ice is saturated in a salt
/// phase (for a binary salt solution, the ice + salt eutectic; for a mixture, the first
/// salt to crystallise on cooling). Searched down to 219.15 K. Needs a model with ion
/// activities ('auto', 'pitzer', 'ross').
inline eutectic_result eutectic(const solution& s,
                                models::model_id m = models::model_id::automatic,
                                double bound_water_kg = 0.0) {
  eutectic_result out;
  if (!detail::has_salt_limits(m, s)) {
    out.reason = "eutectic: needs electrolytes and a model with ion activities ('auto', "
                 "'pitzer' or 'ross')";
    return out;
  }
  const auto fp = freezing_point(s, m, bound_water_kg);
  if (!fp.success()) {
    out.reason = "eutectic: no freezing point: " + fp.check.reason;
    return out;
  }
  const double W = s.water_mass() - bound_water_kg;
  const auto at_fp = most_saturated_phase(s, W, fp.temperature,
                                          models::ln_water_activity(m, s, W, fp.temperature));
  if (at_fp.index > 0.0) {
    out.phase = at_fp.phase->name;
    out.formula = at_fp.phase->formula;
    out.source = at_fp.phase->source;
    out.reason = "eutectic: the solution is already saturated in " + out.phase + " (" +
                 out.formula + ") at its freezing point; the salt crystallises before ice";
    return out;
  }
  auto si = [&](double T, const salt_phase** ph) {
    const auto u = detail::solve_ice_equilibrium(s, T, m, bound_water_kg, false);
    if (!(u.unfrozen_water > 0.0)) return std::numeric_limits<double>::quiet_NaN();
    const auto sat = most_saturated_phase(s, u.unfrozen_water, T, std::log(u.water_activity));
    if (ph) *ph = sat.phase;
    return sat.index;
  };
  const double step = 0.5;
  double hi = fp.temperature - 1e-6;
  for (double T = fp.temperature - step; T >= salt_phase_min_temperature - 1e-9; T -= step) {
    const salt_phase* ph = nullptr;
    const double v = si(T, &ph);
    if (v >= 0.0) {
      double lo = T;
      for (int i = 0; i < 50 && hi - lo > 1e-7; ++i) {
        const double mid = 0.5 * (lo + hi);
        (si(mid, nullptr) >= 0.0 ? lo : hi) = mid;
      }
      out.found = true;
      out.temperature = 0.5 * (lo + hi);
      si(lo, &ph);
      out.phase = ph->name;
      out.formula = ph->formula;
      out.source = ph->source;
      return out;
    }
    hi = T;
  }
  out.reason = "eutectic: no salt phase saturates above 219.15 K, the lower limit of the "
               "salt solubility data";
  return out;
}

/// Ice, unfrozen water and water activity at temperature T (K). Below the eutectic
/// (see eutectic()) the status is below_eutectic and the masses are NaN.
inline unfrozen_phase unfrozen_phase_at(const solution& s, double temperature,
                                        models::model_id m = models::model_id::automatic,
                                        double bound_water_kg = 0.0) {
  auto r = detail::solve_ice_equilibrium(s, temperature, m, bound_water_kg);
  if (r.status != solve_status::converged || !detail::has_salt_limits(m, s) ||
      !(r.unfrozen_water > 0.0))
    return r;
  const auto sat = most_saturated_phase(s, r.unfrozen_water, temperature,
                                        std::log(r.water_activity));
  if (!(sat.index > 0.0)) return r;
  const auto e = eutectic(s, m, bound_water_kg);
  char buf[64];
  std::snprintf(buf, sizeof buf, "%.2f K (%.2f C)", e.temperature,
                e.temperature - constants::celsius_offset);
  r.status = solve_status::below_eutectic;
  r.check.reason = colligate::detail::describe(
      "ice_fraction", "temperature", temperature,
      "below the eutectic at " + (e.found ? std::string(buf) : std::string("an unknown temperature")) +
          ", where " + sat.phase->name + " (" + sat.phase->formula +
          ") crystallises from the unfrozen brine [" + sat.phase->source +
          "]; the ice curve stops there");
  r.unfrozen_water = std::numeric_limits<double>::quiet_NaN();
  r.ice = std::numeric_limits<double>::quiet_NaN();
  return r;
}

/// Ice mass / total water at T with the caller's range policy.
inline checked_value ice_fraction(const solution& s, double temperature,
                                  models::model_id m = models::model_id::automatic,
                                  range_policy policy = range_policy::extrapolate,
                                  double bound_water_kg = 0.0) {
  const auto r = unfrozen_phase_at(s, temperature, m, bound_water_kg);
  if (r.status == solve_status::below_eutectic) {
    if (policy == range_policy::raise) throw out_of_validity_range(r.check.reason);
    return {std::numeric_limits<double>::quiet_NaN(), r.check};
  }
  if (!r.success())
    throw convergence_error(std::string("ice_fraction: root finder stopped: ") +
                            to_string(r.status) + (r.check.reason.empty() ? "" : ": ") +
                            r.check.reason);
  return apply_policy(r.ice_fraction(), r.check, policy);
}

}  // namespace colligate::equilibria
