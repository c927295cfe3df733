#pragma once
/// \file boiling_point.hpp
/// Boiling point of a solution of non-volatile solutes, its elevation, and the inverse
/// (the concentration that boils at a given temperature and pressure).
///
/// The solution boils where the partial pressure of its water reaches the pressure above
/// it (solutes non-volatile, vapour ideal, Poynting factor neglected):
///
///     a_w(solution, T) p_s(T) = P
///
/// with p_s the IAPWS saturation line (water/saturation_pressure.hpp) and a_w from the
/// activity models (models/water_activity.hpp). The elevation is T_b - T_s(P).
///
/// Validity: every result carries the activity model's own validity record at the boiling
/// temperature. For a sucrose syrup, ask for the temperature-dependent model
/// 'starzak_peacock' (Starzak & Peacock 1997, models/starzak_peacock.hpp, in range to
/// 150 C; 'auto' does not pick it). The Norrish constants are fitted to data between about
/// -30 and +25 C and are used unchanged at 100 C (the model's temperature range ends at
/// 323.15 K, so boiling points at atmospheric pressure are flagged out of range); the Pitzer sets end
/// where their temperature functions end. Ethanol is volatile: its boiling point is not
/// described by this relation at all, and solutions with it are rejected.

#include <cmath>
#include <limits>
#include <string>

#include "colligate/core/errors.hpp"
#include "colligate/core/roots.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/equilibria/solver_status.hpp"
#include "colligate/models/water_activity.hpp"
#include "colligate/water/saturation_pressure.hpp"

namespace colligate::equilibria {

struct boiling_point_result {
  double temperature = std::numeric_limits<double>::quiet_NaN();  ///< K
  double elevation = std::numeric_limits<double>::quiet_NaN();    ///< K above pure water at P
  double water_activity = std::numeric_limits<double>::quiet_NaN();  ///< at the boiling point
  solve_status status = solve_status::converged;
  int iterations = 0;
  validity check;
  bool success() const noexcept { return status == solve_status::converged; }
};

namespace detail {

inline void check_pressure(const char* where, double pressure) {
  if (!std::isfinite(pressure) || pressure < water::triple_point_pressure ||
      pressure > 1.0e7)
    throw invalid_input(colligate::detail::describe(
        where, "pressure", pressure,
        "must lie between 611.657 Pa (triple point) and 10 MPa"));
}

inline void reject_volatile(const char* where, const solution& s) {
  for (const auto& r : s.species())
    if (r.id == "ethanol")
      throw invalid_input(std::string(where) +
                          ": solute 'ethanol' is volatile; the boiling relation a_w p_s(T) = P "
                          "holds only for non-volatile solutes");
}

}  // namespace detail

/// Boiling point of `s` at `pressure` (Pa), with the caller's range policy applied to the
/// model's validity at the boiling temperature.
inline boiling_point_result boiling_point(const solution& s, double pressure = 101325.0,
                                          const models::model_choice& m = "auto",
                                          range_policy policy = range_policy::extrapolate) {
  const char* where = "boiling_point";
  detail::check_pressure(where, pressure);
  detail::reject_volatile(where, s);
  boiling_point_result r;
  const double T_pure = water::saturation_temperature(pressure);
  if (s.size() == 0 || s.total_solute_mass() == 0.0) {
    r.temperature = T_pure;
    r.elevation = 0.0;
    r.water_activity = 1.0;
    return r;
  }
  models::ln_water_activity_evaluator ln_aw(m, s);
  const double W = s.water_mass();
  const double lnP = std::log(pressure);
  // f rises with T: p_s grows much faster than a_w changes.
  auto f = [&](double T) { return ln_aw(W, T) + water::ln_saturation_pressure(T) - lnP; };
  double lo = T_pure, hi = T_pure + 5.0;
  double f_lo = f(lo), f_hi = f(hi);
  for (int i = 0; i < 40 && !(f_hi > 0.0) && hi < water::critical_temperature - 10.0; ++i) {
    lo = hi;
    f_lo = f_hi;
    hi = std::min(hi + 10.0, water::critical_temperature - 1.0);
    f_hi = f(hi);
  }
  if (!(f_lo < 0.0)) {  // a_w = 1 to machine precision
    r.temperature = T_pure;
  } else {
    const auto root = toms748_root(f, lo, hi, f_lo, f_hi, 50, 100);
    r.iterations = root.iterations;
    if (root.status == root_status::no_sign_change) {
      r.status = solve_status::below_search_limit;
      return r;
    }
    if (root.status == root_status::max_iterations) r.status = solve_status::max_iterations;
    r.temperature = root.x;
  }
  r.elevation = r.temperature - T_pure;
  r.water_activity = std::exp(ln_aw(W, r.temperature));
  const auto applied = apply_policy(r.temperature, ln_aw.check(W, r.temperature), policy);
  r.temperature = applied.value;
  r.check = applied.check;
  if (std::isnan(r.temperature)) r.elevation = r.water_activity = r.temperature;
  return r;
}

/// The solution of the same solute proportions as `s` that boils at `temperature` (K)
/// under `pressure` (Pa): the water mass is changed, the solutes kept.
struct boiling_concentration_result {
  solution composition;  ///< same solutes as the input, water adjusted
  double water_activity = std::numeric_limits<double>::quiet_NaN();
  solve_status status = solve_status::converged;
  validity check;
  bool success() const noexcept { return status == solve_status::converged; }
};

inline boiling_concentration_result concentration_for_boiling_point(
    const solution& s, double temperature, double pressure = 101325.0,
    const models::model_choice& m = "auto", range_policy policy = range_policy::extrapolate) {
  const char* where = "concentration_for_boiling_point";
  detail::check_pressure(where, pressure);
  detail::reject_volatile(where, s);
  water::check_saturation_temperature(where, temperature);
  if (s.size() == 0 || s.total_solute_mass() == 0.0)
    throw invalid_input(std::string(where) + ": the solution has no solute to concentrate");
  const double T_pure = water::saturation_temperature(pressure);
  if (!(temperature > T_pure))
    throw invalid_input(colligate::detail::describe(
        where, "temperature", temperature,
        "must lie above the boiling point of pure water at this pressure (" +
            std::to_string(T_pure) + " K)"));
  const double target = std::log(pressure) - water::ln_saturation_pressure(temperature);
  models::ln_water_activity_evaluator ln_aw(m, s);
  auto h = [&](double u) { return ln_aw(std::exp(u), temperature) - target; };
  const auto root = solve_rising(h, std::log(s.water_mass()), 50);
  boiling_concentration_result r{s, std::numeric_limits<double>::quiet_NaN(), solve_status::converged, {}};
  if (root.status == root_status::no_sign_change) {
    r.status = solve_status::below_search_limit;
    return r;
  }
  if (root.status == root_status::max_iterations) r.status = solve_status::max_iterations;
  const double W = std::exp(root.x);
  r.composition = s.with_water(W);
  r.water_activity = std::exp(ln_aw(W, temperature));
  r.check = ln_aw.check(W, temperature);
  if (!r.check.in_range() && policy == range_policy::raise) throw out_of_validity_range(r.check.reason());
  if (!r.check.in_range() && policy == range_policy::nan) r.water_activity = std::numeric_limits<double>::quiet_NaN();
  return r;
}

}  // namespace colligate::equilibria
