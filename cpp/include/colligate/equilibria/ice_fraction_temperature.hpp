#pragma once
/// \file ice_fraction_temperature.hpp
/// The inverse of the ice curve: the temperature at which a solution has a given ice
/// fraction (ice mass over all the water), e.g. the serving temperature at which 70 % of
/// the water is frozen.
///
/// On the ice curve (equilibria/ice_curve.hpp) the ice fraction falls monotonically with
/// temperature, from its largest value at the lowest temperature the curve reaches (the
/// final eutectic of a brine, the salt data's lower limit, or `search_min_temperature`
/// for models without salt phases) to 0 at the initial freezing point. The temperature is
/// therefore the root of
///
///     g(T) = ice_fraction(T) - target,     T in [T_end, T_f],
///
/// bracketed by the two ends (g(T_end) >= 0 >= g(T_f)) and solved by TOMS 748
/// (core/roots.hpp) to 52 bits in T. A target of 0 gives the freezing point itself.
///
/// A target that the curve cannot reach is a caller mistake and throws invalid_input
/// naming the target, the reachable range and why the curve stops there: the final
/// eutectic (with its salt), the lowest temperature searched, or water that cannot freeze
/// (the ice fraction never exceeds (W - W_bound) / W).

#include <cmath>
#include <cstdio>
#include <limits>
#include <string>

#include "colligate/core/constants.hpp"
#include "colligate/core/errors.hpp"
#include "colligate/core/roots.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/equilibria/ice_curve.hpp"
#include "colligate/equilibria/solver_status.hpp"

namespace colligate::equilibria {

/// The temperature at which a curve has a given ice fraction, with its solve record.
struct ice_fraction_temperature {
  double temperature = std::numeric_limits<double>::quiet_NaN();  ///< K
  double ice_fraction = std::numeric_limits<double>::quiet_NaN();  ///< achieved there
  solve_status status = solve_status::converged;
  int iterations = 0;
  validity check;  ///< the model's validity at the temperature found
  bool success() const noexcept { return status == solve_status::converged; }
};

/// The span of ice fractions a curve can reach.
struct reachable_ice {
  double lowest_temperature = std::numeric_limits<double>::quiet_NaN();  ///< K, the curve's end
  double largest_fraction = std::numeric_limits<double>::quiet_NaN();    ///< ice fraction there
  double freezing_point = std::numeric_limits<double>::quiet_NaN();      ///< K
  std::string end;  ///< why the curve stops at lowest_temperature (readable)
};

namespace detail {

inline std::string kelvin_and_celsius(double T) {
  char buf[64];
  std::snprintf(buf, sizeof buf, "%.2f K (%.2f C)", T, T - constants::celsius_offset);
  return buf;
}

inline std::string number(double x) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.6g", x);
  return buf;
}

}  // namespace detail

/// Where the curve ends and the ice fraction there. Throws invalid_input when the curve
/// has no ice at all (no freezing point, or a salt saturated before ice).
inline reachable_ice reachable_ice_of(ice_curve& curve) {
  const char* where = "temperature_for_ice_fraction";
  const auto& fp = curve.initial_freezing_point();
  if (!fp.success())
    throw invalid_input(std::string(where) + ": the solution forms no ice above " +
                        detail::kelvin_and_celsius(search_min_temperature) +
                        ", the lowest temperature searched" +
                        (fp.check.in_range() ? "" : ": " + fp.check.reason()));
  reachable_ice out;
  out.freezing_point = fp.temperature;
  const curve_end end = curve.end_reason();
  if (end == curve_end::saturated_before_ice) {
    const auto* ph = curve.saturated_phase();
    throw invalid_input(std::string(where) + ": the solution is already saturated in " +
                        ph->name + " (" + ph->formula +
                        ") at its freezing point; the salt crystallises before ice and the "
                        "ice curve is not followed");
  }
  out.lowest_temperature = curve.end_temperature();
  switch (end) {
    case curve_end::final_eutectic: {
      const auto& last = curve.salts().back();
      out.end = "the final eutectic at " + detail::kelvin_and_celsius(out.lowest_temperature) +
                ", where " + last.phase->name + " (" + last.phase->formula +
                ") crystallises and no liquid remains";
      break;
    }
    case curve_end::salt_data_limit:
      out.end = detail::kelvin_and_celsius(out.lowest_temperature) +
                ", the lower limit of the salt solubility data (or where the salt "
                "equilibria stop converging)";
      break;
    default:
      out.end = detail::kelvin_and_celsius(out.lowest_temperature) +
                ", the lowest temperature searched";
  }
  const auto st = curve.at(out.lowest_temperature);
  out.largest_fraction = st.ice_fraction();
  return out;
}

/// Temperature (K) at which `curve` has ice fraction `fraction` (ice over all the water).
/// Throws invalid_input for a fraction outside [0, 1) or above the largest reachable one.
inline ice_fraction_temperature solve_temperature_for_ice_fraction(ice_curve& curve,
                                                                   double fraction) {
  const char* where = "temperature_for_ice_fraction";
  if (!std::isfinite(fraction) || fraction < 0.0 || !(fraction < 1.0))
    throw invalid_input(colligate::detail::describe(
        where, "ice_fraction", fraction,
        "must be finite and in [0, 1) (ice mass over all the water, not a percentage)"));
  const auto reach = reachable_ice_of(curve);
  const double W = curve.composition().water_mass();
  const double bound = curve.bound_water();
  if (!(fraction <= reach.largest_fraction)) {
    std::string msg = colligate::detail::describe(
        where, "ice_fraction", fraction,
        "not reachable: the ice curve runs from 0 at the initial freezing point " +
            detail::kelvin_and_celsius(reach.freezing_point) + " to " +
            detail::number(reach.largest_fraction) + " at " + reach.end);
    if (bound > 0.0)
      msg += "; with " + detail::number(bound) + " kg of the " + detail::number(W) +
             " kg water unable to freeze the ice fraction can never exceed " +
             detail::number((W - bound) / W);
    throw invalid_input(msg);
  }
  ice_fraction_temperature out;
  if (fraction == 0.0) {
    out.temperature = reach.freezing_point;
    out.ice_fraction = 0.0;
    out.check = curve.initial_freezing_point().check;
    return out;
  }
  auto g = [&](double T) {
    const auto st = curve.at(T);
    return st.success() ? st.ice_fraction() - fraction : std::numeric_limits<double>::quiet_NaN();
  };
  const double T_lo = reach.lowest_temperature, T_hi = reach.freezing_point;
  const double g_lo = reach.largest_fraction - fraction;
  root_result r;
  if (g_lo == 0.0) {
    r.x = T_lo;
    r.status = root_status::converged;
  } else {
    r = toms748_root(g, T_lo, T_hi, g_lo, -fraction, 52, 200);
  }
  if (r.status != root_status::converged || !std::isfinite(r.x)) {
    out.status = solve_status::max_iterations;
    out.iterations = r.iterations;
    out.check = flagged(validity_code::not_converged, where, "temperature",
                        "the root finder did not converge on the ice curve");
    return out;
  }
  const auto st = curve.at(r.x);
  out.temperature = r.x;
  out.ice_fraction = st.ice_fraction();
  out.iterations = r.iterations;
  out.check = st.check;
  return out;
}

/// Temperature (K) for ice fraction `fraction` on a prepared curve, with the caller's range
/// policy applied to the model's validity there. A solver that stops throws
/// convergence_error (this wrapper promises a value).
inline checked_value temperature_for_ice_fraction(ice_curve& curve, double fraction,
                                                  range_policy policy = range_policy::extrapolate) {
  const auto r = solve_temperature_for_ice_fraction(curve, fraction);
  if (!r.success()) throw convergence_error("temperature_for_ice_fraction: " + r.check.reason());
  return apply_policy(r.temperature, r.check, policy);
}

/// Temperature (K) at which solution `s` has ice fraction `fraction` under model `m`, with
/// `bound_water_kg` of its water unable to freeze.
inline checked_value temperature_for_ice_fraction(const solution& s, double fraction,
                                                  const models::model_choice& m = "auto",
                                                  range_policy policy = range_policy::extrapolate,
                                                  double bound_water_kg = 0.0) {
  ice_curve curve(s, m, bound_water_kg);
  return temperature_for_ice_fraction(curve, fraction, policy);
}

}  // namespace colligate::equilibria
