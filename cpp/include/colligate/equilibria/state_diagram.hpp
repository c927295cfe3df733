#pragma once
/// \file state_diagram.hpp
/// The supplemented state diagram of a solution: its ice curve (liquidus), its glass curve,
/// and where they meet, the maximally freeze-concentrated unfrozen phase (Tg', Cg').
///
/// Below its freezing point the unfrozen phase of a food gets more concentrated as ice
/// forms (the ice curve, ice_curve.hpp), and its glass transition rises with the
/// concentration (glass_transition.hpp). Tg' is the temperature at which the unfrozen
/// phase on the ice curve is at its own glass transition,
///
///     T - Tg(unfrozen phase at T) = 0,
///
/// and Cg' is the solute mass fraction of that phase (Levine & Slade 1986; Roos & Karel
/// 1991 locate it the same way, from the intersection of the extrapolated ice-melting and
/// glass curves). Below Tg' the unfrozen phase is a glass: ice crystals stop growing and
/// diffusion-limited changes nearly stop, so T - Tg' is the storage-temperature margin.
///
/// The unfrozen phase counts the liquid water and the bound (unfreezable) water, and every
/// dissolved solute; a salt crystallised on the path is not taken out of it (salts have no
/// glass data and are left out of Tg). The ice curve beyond a model's validated
/// concentration is an extrapolation: the validity record says so.

#include <cmath>
#include <limits>
#include <string>
#include <vector>

#include "colligate/core/roots.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/equilibria/freezing_point.hpp"
#include "colligate/equilibria/glass_transition.hpp"
#include "colligate/equilibria/ice_curve.hpp"
#include "colligate/equilibria/solver_status.hpp"
#include "colligate/water/ice.hpp"

namespace colligate::equilibria {

/// The maximally freeze-concentrated state of a solution.
struct maximal_freeze_concentration {
  double tg_prime = std::numeric_limits<double>::quiet_NaN();  ///< K
  /// Mass fraction of dissolved solutes in the unfrozen phase at Tg' (all solutes).
  double cg_prime = std::numeric_limits<double>::quiet_NaN();
  /// Unfrozen water (liquid + bound) per kg of dissolved solutes at Tg', kg/kg (Wg').
  double unfrozen_water_per_solids = std::numeric_limits<double>::quiet_NaN();
  /// Ice mass over total water at Tg'.
  double ice_fraction = std::numeric_limits<double>::quiet_NaN();
  /// converged, not_frozen (the solution never freezes above the ice data's limit), or
  /// below_search_limit (the curves do not meet above 215 K).
  solve_status status = solve_status::converged;
  glass_rule rule = glass_rule::gordon_taylor;
  std::vector<std::string> counted;  ///< solutes with glass data
  std::vector<std::string> lacking;  ///< dissolved solutes without glass data, left out of Tg
  validity check;  ///< the ice curve's validity at Tg' (an extrapolated model is named here)

  bool success() const noexcept { return status == solve_status::converged; }
  /// Storage-temperature margin T - Tg', K (positive: the unfrozen phase is not glassy).
  double margin(double temperature) const noexcept { return temperature - tg_prime; }
};

namespace detail {

/// T - Tg of the unfrozen phase of `curve` at T, NaN where the curve has no state.
inline double glass_gap(ice_curve& curve, double T, glass_rule rule, ice_curve_state* out = nullptr) {
  ice_curve_state st = curve.at(T);
  if (!st.success() || !(st.unfrozen_water > 0.0)) return std::numeric_limits<double>::quiet_NaN();
  const double water = st.unfrozen_water + st.bound_water;
  const double tg = glass_transition(curve.composition(), water, rule).temperature;
  if (out) *out = std::move(st);
  return T - tg;
}

}  // namespace detail

/// Tg' and Cg' of a prepared ice curve. Throws invalid_input (naming them) if no dissolved
/// solute has glass data.
inline maximal_freeze_concentration maximal_freeze_concentration_of(
    ice_curve& curve, glass_rule rule = glass_rule::gordon_taylor) {
  maximal_freeze_concentration r;
  r.rule = rule;
  const solution& s = curve.composition();
  {
    const auto probe = glass_transition(s, s.water_mass(), rule);  // throws without data
    r.counted = probe.counted;
    r.lacking = probe.lacking;
  }
  const auto& fp = curve.initial_freezing_point();
  if (!fp.success()) {
    r.status = fp.status == solve_status::not_frozen ? solve_status::not_frozen
                                                     : solve_status::below_search_limit;
    r.check = fp.check;
    return r;
  }
  // Walk down from just below the freezing point in 1 K steps until the unfrozen phase is
  // at or below its glass transition, then refine the bracket by TOMS 748.
  const double step = 1.0;
  double hi = fp.temperature - 1e-6;
  double g_hi = detail::glass_gap(curve, hi, rule);
  if (!(g_hi > 0.0)) {  // glassy at the freezing point already (a very concentrated phase)
    r.status = solve_status::below_search_limit;
    r.check = flagged(validity_code::not_converged, "state_diagram", "Tg'",
                      "the unfrozen phase is glassy at the freezing point: no freeze concentration", "");
    return r;
  }
  double lo = hi, g_lo = g_hi;
  while (g_lo > 0.0) {
    hi = lo;
    g_hi = g_lo;
    lo = hi - step;
    if (lo < water::ice_model_lowest_temperature) {
      r.status = solve_status::below_search_limit;
      r.check = flagged(validity_code::not_converged, "state_diagram", "Tg'",
                        "the glass and ice curves do not meet above 215 K (the ice data's limit)", "");
      return r;
    }
    g_lo = detail::glass_gap(curve, lo, rule);
    if (std::isnan(g_lo)) {
      r.status = solve_status::below_search_limit;
      r.check = flagged(validity_code::not_converged, "state_diagram", "Tg'",
                        "the ice curve has no state at " + validity::fmt(lo) + " K", "");
      return r;
    }
  }
  const auto root = toms748_root([&](double T) { return detail::glass_gap(curve, T, rule); }, lo,
                                 hi, g_lo, g_hi, 40, 100);
  if (root.status != root_status::converged) {
    r.status = solve_status::max_iterations;
    return r;
  }
  ice_curve_state st;
  detail::glass_gap(curve, root.x, rule, &st);
  const double water = st.unfrozen_water + st.bound_water;
  const double solids = s.total_solute_mass();
  r.tg_prime = root.x;
  r.cg_prime = solids / (solids + water);
  r.unfrozen_water_per_solids = water / solids;
  r.ice_fraction = st.ice_fraction();
  r.check = st.check;
  r.status = solve_status::converged;
  return r;
}

/// Tg' and Cg' of solution `s` under activity model `m` with `bound_water_kg` unfreezable water.
inline maximal_freeze_concentration maximal_freeze_concentration_of(
    const solution& s, const models::model_choice& m = "auto", double bound_water_kg = 0.0,
    glass_rule rule = glass_rule::gordon_taylor) {
  ice_curve curve(s, m, bound_water_kg);
  return maximal_freeze_concentration_of(curve, rule);
}

/// Water (kg) that puts the solutes of `s` at `solute_mass_fraction` (in (0, 1)).
inline double water_for_solute_mass_fraction(const solution& s, double solute_mass_fraction) {
  if (!(std::isfinite(solute_mass_fraction) && solute_mass_fraction > 0.0 && solute_mass_fraction < 1.0))
    throw invalid_input(colligate::detail::describe("state_diagram", "solute_mass_fraction",
                                                    solute_mass_fraction, "must be in (0, 1)"));
  const double solids = s.total_solute_mass();
  if (!(solids > 0.0))
    throw invalid_input("state_diagram: the solution has no solutes (a state diagram needs at least one)");
  return solids * (1.0 - solute_mass_fraction) / solute_mass_fraction;
}

/// The glass curve: Tg (K) of the solutes of `s` in their proportions at total solute mass
/// fraction `solute_mass_fraction` (in (0, 1]; 1 is the dry solids).
inline glass_transition_result glass_curve_point(const solution& s, double solute_mass_fraction,
                                                 glass_rule rule = glass_rule::gordon_taylor) {
  if (solute_mass_fraction == 1.0) return glass_transition(s, 0.0, rule);
  return glass_transition(s, water_for_solute_mass_fraction(s, solute_mass_fraction), rule);
}

/// The ice curve of the diagram (liquidus): the freezing point (K, with status and
/// validity) of the solutes of `s` in their proportions at total solute mass fraction
/// `solute_mass_fraction` in (0, 1).
inline freezing_point_result liquidus_point(const solution& s, double solute_mass_fraction,
                                            const models::model_choice& m = "auto") {
  return freezing_point(s.with_water(water_for_solute_mass_fraction(s, solute_mass_fraction)), m);
}

}  // namespace colligate::equilibria
