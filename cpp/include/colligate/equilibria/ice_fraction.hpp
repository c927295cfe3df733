#pragma once
/// \file ice_fraction.hpp
/// Point queries on the ice curve (equilibria/ice_curve.hpp): the unfrozen phase and the
/// ice fraction at one temperature, and the end of the curve (the eutectic). Each call
/// prepares an ice_curve; a caller asking many questions of one solution holds the curve.
///
///     ice = W_total - W_u - W_bound - W_hydrate,   ice fraction = ice / W_total.
///
/// Above the freezing point the ice fraction is 0 (not an error). Below the end of the
/// curve (the final eutectic of a brine, or the salt data's lower limit) the status is
/// below_eutectic, the masses are NaN and the reason names the temperature and the salt.

#include <cmath>
#include <limits>
#include <string>

#include "colligate/core/solution.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/equilibria/freezing_point.hpp"
#include "colligate/equilibria/ice_curve.hpp"
#include "colligate/equilibria/solver_status.hpp"
#include "colligate/models/water_activity.hpp"

namespace colligate::equilibria {

/// State of a partly frozen solution at one temperature: the ice curve's state (masses in
/// kg; ice_curve.hpp).
using unfrozen_phase = ice_curve_state;

/// Where the ice curve of a solution ends.
struct eutectic_result {
  double temperature = std::numeric_limits<double>::quiet_NaN();  ///< K
  bool found = false;
  std::string phase;    ///< mineral name ("hydrohalite"), empty if none found
  std::string formula;  ///< "NaCl.2H2O"
  std::string source;   ///< citation key of the solubility product
  std::string reason;   ///< why none was found, or a caution ("" otherwise)
};

/// The end of a curve as an eutectic_result: found for a final eutectic (the salt named
/// is the one whose saturation ends the curve; for a binary brine, its salt hydrate).
inline eutectic_result eutectic_of(ice_curve& curve) {
  eutectic_result out;
  if (!curve.model().traits.ion_activities || !curve.composition().has_electrolytes()) {
    out.reason = "eutectic: needs electrolytes and a model with ion activities ('auto', "
                 "'pitzer' or 'ross')";
    return out;
  }
  const auto end = curve.end_reason();
  if (end == curve_end::no_freezing_point) {
    out.reason = "eutectic: no freezing point: " + curve.initial_freezing_point().check.reason();
    return out;
  }
  if (end == curve_end::saturated_before_ice) {
    const auto* ph = curve.saturated_phase();
    out.phase = ph->name;
    out.formula = ph->formula;
    out.source = ph->source;
    out.reason = "eutectic: the solution is already saturated in " + out.phase + " (" +
                 out.formula + ") at its freezing point; the salt crystallises before ice";
    return out;
  }
  if (end == curve_end::final_eutectic) {
    const auto& last = curve.salts().back();
    out.found = true;
    out.temperature = curve.end_temperature();
    out.phase = last.phase->name;
    out.formula = last.phase->formula;
    out.source = last.phase->source;
    return out;
  }
  out.reason = "eutectic: no final eutectic above 219.15 K, the lower limit of the salt "
               "solubility data";
  return out;
}

/// Final eutectic of a solution: the temperature below which no liquid remains (for a
/// binary salt solution, the ice + salt eutectic). Needs a model with ion activities.
inline eutectic_result eutectic(const solution& s, const models::model_choice& m = "auto",
                                double bound_water_kg = 0.0,
                                crystallisation_path path = crystallisation_path::equilibrium) {
  ice_curve curve(s, m, bound_water_kg, path);
  return eutectic_of(curve);
}

/// Ice, unfrozen water and water activity at temperature T (K).
inline unfrozen_phase unfrozen_phase_at(const solution& s, double temperature,
                                        const models::model_choice& m = "auto",
                                        double bound_water_kg = 0.0) {
  models::check_temperature_argument("ice_fraction", temperature);
  ice_curve curve(s, m, bound_water_kg);
  return curve.at(temperature);
}

/// A curve state with the caller's range policy applied to its ice fraction.
inline checked_value ice_fraction_of(const ice_curve_state& r, range_policy policy) {
  if (r.status == solve_status::below_eutectic) {
    if (policy == range_policy::raise) throw out_of_validity_range(r.check.reason());
    return {std::numeric_limits<double>::quiet_NaN(), r.check};
  }
  if (r.check.code == validity_code::outside_physical_bounds)
    return apply_policy(std::numeric_limits<double>::quiet_NaN(), r.check, policy);
  if (!r.success())
    throw convergence_error(std::string("ice_fraction: temperature = ") + validity::fmt(r.temperature) +
                            " K: the ice-curve solve stopped (" + to_string(r.status) + ")" +
                            (r.check.in_range() ? "" : ": " + r.check.reason()));
  return apply_policy(r.ice_fraction(), r.check, policy);
}

/// Ice mass / total water at T with the caller's range policy.
inline checked_value ice_fraction(const solution& s, double temperature,
                                  const models::model_choice& m = "auto",
                                  range_policy policy = range_policy::extrapolate,
                                  double bound_water_kg = 0.0) {
  models::check_temperature_argument("ice_fraction", temperature);
  ice_curve curve(s, m, bound_water_kg);
  return ice_fraction_of(curve.at(temperature), policy);
}

}  // namespace colligate::equilibria
