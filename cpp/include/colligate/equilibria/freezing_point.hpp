#pragma once
/// \file freezing_point.hpp
/// Initial freezing point: the temperature T at which the whole solution is in
/// equilibrium with ice, ln a_w(solution, T) = ln a_w,ice(T) (DESIGN section 1).
/// Solved between the ice point and `search_min_temperature` by a safeguarded Newton
/// iteration (see freezing_point below); for models whose ln a_w does not depend on T, by
/// reading the ice line backwards (water/ice_line_inverse.hpp). Water that cannot freeze (`bound_water_kg`, e.g. bound to
/// protein) is taken out of the solvent.

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
#include "colligate/water/ice_line_inverse.hpp"

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

/// The error of check_bound_water, built out of line (the test inlines).
[[noreturn]] inline void throw_bad_bound_water(const char* where, const solution& s,
                                               double bound_water_kg) {
  throw invalid_input(colligate::detail::describe(
      where, "bound_water", bound_water_kg,
      "must be finite, >= 0 kg and below the water in the solution (" +
          std::to_string(s.water_mass()) + " kg)"));
}

inline void check_bound_water(const char* where, const solution& s, double bound_water_kg) {
  if (!std::isfinite(bound_water_kg) || bound_water_kg < 0.0 ||
      !(bound_water_kg < s.water_mass()))
    throw_bad_bound_water(where, s, bound_water_kg);
}

/// The water that can freeze, kg: the solution's water less `bound_water_kg` (checked).
inline double freezable_water(const char* where, const solution& s, double bound_water_kg) {
  check_bound_water(where, s, bound_water_kg);
  return s.water_mass() - bound_water_kg;
}

/// True when the solution holds no solute at all (it freezes at the ice point).
inline bool without_solutes(const solution& s) {
  double total_moles = 0.0;
  for (double n : s.moles()) total_moles += n;
  return total_moles == 0.0;
}

/// The result of a solution that does not freeze above the lowest temperature searched.
inline freezing_point_result below_search_limit() {
  freezing_point_result r;
  r.status = solve_status::below_search_limit;
  r.check = flagged(validity_code::no_freezing_point, "freezing_point",
                    "lowest temperature searched = 223.15 K",
                    "the solution does not freeze above this temperature (-50 C)");
  return r;
}

/// f(T) = ln a_w(solution with `water_kg`, T) - ln a_w,ice(T); negative above the
/// freezing point, positive below it.
inline double ice_imbalance(const models::model_choice& m, const solution& s, double water_kg, double T) {
  return models::ln_water_activity(m, s, water_kg, T) - water::ln_water_activity_of_ice(T);
}


}  // namespace detail

/// The freezing point of a solution whose ln a_w does not depend on T (equal to `ln_aw_0`
/// at every T), K: the ice line read backwards (water/ice_line_inverse.hpp: interpolated
/// inverse plus one Newton step) over its validated range; below it, the Newton inverse of
/// ice.hpp down to the lowest temperature searched; NaN below that. The middle step of
/// freezing_point for such models, apart so that a batch can run it for several rows
/// side by side (their latency chains overlap; each row's arithmetic is unchanged).
inline double temperature_on_ice_line_searched(double ln_aw_0) {
  double T = water::temperature_on_ice_line(ln_aw_0);
  if (std::isnan(T)) T = water::temperature_of_ice_equilibrium(ln_aw_0, search_min_temperature);
  return T;
}

/// The result for temperature T from temperature_on_ice_line_searched (NaN: below the
/// search limit) of the solution `ln_aw` is prepared for, with `water_kg` of water that can
/// freeze: the model's validity at T and that of the ice line. The last step of
/// freezing_point for models whose ln a_w does not depend on T.
inline freezing_point_result freezing_point_on_ice_line(double T, double water_kg,
                                                        models::ln_water_activity_evaluator& ln_aw) {
  if (std::isnan(T)) return detail::below_search_limit();
  freezing_point_result r;
  r.temperature = T;
  r.check = ln_aw.check(water_kg, T);
  water::merge_ice_temperature_validity(r.check, T);
  return r;
}

/// Initial freezing point of a solution, K, with status and validity, using `ln_aw`, an
/// evaluator prepared for `s` with model `m` (a batch thread keeps one for all its rows).
///
/// Temperature-dependent models (Pitzer, Ross) are solved by a safeguarded Newton
/// iteration on f(T) = ln a_w(T) - ln a_w,ice(T) from the ice point. When the evaluator
/// gives d ln a_w / dT in closed form (Pitzer and Ross with parameters in the analytic
/// temperature form; evaluated at the fixed amounts of the solve through
/// activity_evaluator::ln_water_activity_along_temperature, which prepares the
/// composition once and then costs little per temperature), each step meets the model linearised at the iterate with the ice
/// line itself (a few Newton steps on the cheap ice function), so only the curvature of
/// ln a_w in T is left as error: two model evaluations for seawater, the second result
/// accepted when its Taylor bound (curvature from the last two slopes) is below 1e-11 K.
/// Otherwise the first step is the linearised depression (slope of ln a_w,ice only) and
/// later steps use the exact slope of ln a_w,ice plus the secant slope of ln a_w of the
/// last two iterates. Every evaluation narrows a bracket [lo, hi] with f(lo) > 0 > f(hi); a
/// step leaving it is replaced by bisection, and f at the lowest temperature searched is
/// evaluated only then (a solution with f <= 0 there does not freeze above it). Stops when
/// a step is below 1e-9 K. The validity check (for Ross, the comparison with the ZSR rule,
/// itself a 1-D root solve) runs once, at the result, on the evaluator's prepared system.
inline freezing_point_result freezing_point(const solution& s, const models::model_choice& m,
                                            double bound_water_kg,
                                            models::ln_water_activity_evaluator& ln_aw) {
  static_cast<void>(m);  // values and check both come from `ln_aw`, prepared with m for s
  const double W = detail::freezable_water("freezing_point", s, bound_water_kg);
  freezing_point_result r;
  if (detail::without_solutes(s)) {
    r.temperature = constants::ice_point;
    return r;
  }
  if (!ln_aw.model().traits.temperature_dependent) {
    // a_w does not depend on T: read the ice line backwards at ln a_w.
    const double T = temperature_on_ice_line_searched(ln_aw(W, constants::ice_point));
    return freezing_point_on_ice_line(T, W, ln_aw);
  }
  const double R = constants::gas_constant;
  const auto ice_slope = [R](double T) {  // d ln a_w,ice / dT = dH_fus / (R T^2)
    return water::enthalpy_of_fusion(T) / (R * T * T);
  };
  double hi = constants::ice_point;
  double lo = search_min_temperature;
  bool lo_known = false;  // f(lo) > 0 established
  // With a closed-form d ln a_w / dT (Pitzer), the slope of the model at each iterate.
  double dL_analytic = 0.0, dL_prev = 0.0;
  double L_hi = 0.0;
  const bool analytic = ln_aw.along_temperature(W, hi, L_hi, dL_analytic);
  if (!analytic) L_hi = ln_aw(W, hi);
  const double f_hi = L_hi;  // ln a_w,ice(T0) = 0
  if (std::isnan(f_hi) &&
      !(ln_aw(W, lo) - water::ln_water_activity_of_ice(lo) > 0.0))  // no usable model value
    return detail::below_search_limit();
  if (f_hi > 0.0) {  // a_w > 1: the model, extrapolated, gives no physical value
    r.temperature = std::numeric_limits<double>::quiet_NaN();
    r.status = solve_status::max_iterations;
    r.check = outside_physical_bounds(
        "freezing_point", "water activity at 273.15 K", std::exp(f_hi), 0.0, 1.0,
        "the activity model, extrapolated to this composition, gives a_w above 1, so no "
        "freezing point can be computed; " + ln_aw.check(W, hi).reason());
    return r;
  }
  if (!(f_hi < 0.0)) {  // vanishingly dilute: depression below rounding
    r.temperature = hi;
    r.check = ln_aw.check(W, hi);
    return r;
  }
  // A Newton step below 1e-9 K is taken without a new evaluation: the error left is of
  // the order of the step squared times the curvature, far below 1e-12 K.
  constexpr double step_tolerance = 1e-9;  // K
  constexpr int max_iterations = 100;
  double T = hi, L = L_hi, f = f_hi;
  double T_prev = std::numeric_limits<double>::quiet_NaN(), L_prev = T_prev;
  int it = 0;
  bool converged = false;
  for (; it < max_iterations; ++it) {
    double next;
    if (analytic) {
      // The model linearised at T, L(T) + L'(T) (t - T), met with the ice line itself:
      // t solves L + L' (t - T) = ln a_w,ice(t), by Newton on the (cheap) ice line from T
      // (stopped after a step below 1e-6 K: what is left is of order 1e-2 * step^2 K).
      next = T - f / (dL_analytic - ice_slope(T));
      for (int k = 0; k < 8 && next > lo && next < hi; ++k) {
        const double g = L + dL_analytic * (next - T) - water::ln_water_activity_of_ice(next);
        const double step = g / (dL_analytic - ice_slope(next));
        next -= step;
        if (!(std::abs(step) > 1e-6)) break;
      }
      // Its error is L''(T) (t - T)^2 / 2 over |f'| (Taylor), with L'' from the slopes of
      // the last two iterates. From the ice point the first t is within about 1e-4 K of the
      // root and the second within about 1e-12 K (seawater): a t whose bound, with a
      // margin of 10, is below 1e-10 K is taken without evaluating the model there.
      if (!std::isnan(T_prev) && T_prev != T && next >= lo && next <= hi) {
        const double curvature = std::abs((dL_analytic - dL_prev) / (T - T_prev));
        const double error = 0.5 * curvature * (next - T) * (next - T) /
                             std::abs(dL_analytic - ice_slope(next));
        if (10.0 * error <= 1e-10) {
          T = next;
          converged = true;
          break;
        }
      }
    } else {
      // Newton step on f = L(T) - ln a_w,ice(T): f' = L'(T) - ice_slope(T).
      const double dL = std::isnan(T_prev) || T_prev == T ? 0.0 : (L - L_prev) / (T - T_prev);
      const double slope = dL - ice_slope(T);
      next = T - f / slope;
    }
    if (std::abs(next - T) <= step_tolerance && next >= lo && next <= hi) {
      T = next;  // converged (a step below one ulp lands on the bracket end: also accepted)
      converged = true;
      break;
    }
    if (!(next > lo && next < hi)) {
      if (!lo_known) {
        const double f_lo = ln_aw(W, lo) - water::ln_water_activity_of_ice(lo);
        if (!(f_lo > 0.0)) return detail::below_search_limit();
        lo_known = true;
      }
      next = 0.5 * (lo + hi);
    }
    T_prev = T;
    L_prev = L;
    dL_prev = dL_analytic;
    T = next;
    if (analytic)
      ln_aw.along_temperature(W, T, L, dL_analytic);
    else
      L = ln_aw(W, T);
    f = L - water::ln_water_activity_of_ice(T);
    if (f > 0.0) {
      lo = T;
      lo_known = true;
    } else if (f < 0.0) {
      hi = T;
    } else if (f == 0.0) {
      converged = true;
      break;
    } else {  // NaN from the model
      break;
    }
  }
  r.temperature = T;
  r.iterations = it + 1;
  r.status = converged ? solve_status::converged : solve_status::max_iterations;
  if (!converged && std::isnan(f)) r.temperature = std::numeric_limits<double>::quiet_NaN();
  r.check = ln_aw.check(W, r.temperature);
  water::merge_ice_temperature_validity(r.check, r.temperature);
  return r;
}

/// Initial freezing point of a solution, K, with status and validity.
inline freezing_point_result freezing_point(const solution& s,
                                            const models::model_choice& m = "auto",
                                            double bound_water_kg = 0.0) {
  models::ln_water_activity_evaluator ln_aw(m, s);
  return freezing_point(s, m, bound_water_kg, ln_aw);
}

/// Convenience: the freezing point with the caller's range policy; throws
/// convergence_error if the solve fails.
inline checked_value freezing_point_checked(const freezing_point_result& r,
                                            range_policy policy = range_policy::extrapolate) {
  if (r.status == solve_status::below_search_limit) {
    if (policy == range_policy::raise) throw out_of_validity_range(r.check.reason());
    return {std::numeric_limits<double>::quiet_NaN(), r.check};
  }
  if (r.check.code == validity_code::outside_physical_bounds)
    return apply_policy(std::numeric_limits<double>::quiet_NaN(), r.check, policy);
  if (!r.success())
    throw convergence_error(std::string("freezing_point: the freezing-point iteration stopped (") +
                            to_string(r.status) + ") without reaching 1e-9 K" +
                            (r.check.in_range() ? "" : ": " + r.check.reason()));
  return apply_policy(r.temperature, r.check, policy);
}

/// The same for a solution under model `m` (the ice freezing point of the liquid as given).
inline checked_value freezing_point_checked(const solution& s,
                                            const models::model_choice& m = "auto",
                                            range_policy policy = range_policy::extrapolate,
                                            double bound_water_kg = 0.0) {
  return freezing_point_checked(freezing_point(s, m, bound_water_kg), policy);
}

}  // namespace colligate::equilibria
