#pragma once
/// \file water_activity.hpp
/// One entry point for every activity model: ln a_w of a solution at temperature T, with
/// its validity, for a model named by id and looked up in a registry
/// (models/builtin_models.hpp). `auto` lets the registry choose for the solutes present
/// and describe_model() says which: Norrish when there are only non-electrolytes, Pitzer
/// when there are only electrolytes, and the Ross (1975) product rule (model 'ross':
/// Pitzer for the ions times Norrish for the non-electrolytes, each in the same water)
/// when there are both.

#include <cmath>
#include <memory>
#include <string>

#include "colligate/core/errors.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/models/builtin_models.hpp"
#include "colligate/models/evaluator.hpp"
#include "colligate/models/ideal.hpp"

namespace colligate::models {

/// A model prepared for one solution: ln a_w at many (water mass, temperature) pairs with
/// the work that depends only on the species done once (for Pitzer, the ions and
/// parameter rows, detail::pitzer_system; for Ross, the classes, detail::ross_system), so
/// an evaluation copies nothing and allocates nothing. Reads the amounts of `s` at each
/// call, so it follows a solution whose amounts are overwritten in place (batch rows).
/// Holds a pointer to `s` and a cache: one evaluator per solve or per thread.
class ln_water_activity_evaluator {
 public:
  ln_water_activity_evaluator(const model_choice& m, const solution& s)
      : model_(&m.resolve(s)), impl_(model_->prepare(s, m.options())) {}
  /// The concrete model (after resolving 'auto').
  const model_descriptor& model() const noexcept { return *model_; }
  double operator()(double water_kg, double temperature) {
    return impl_->ln_water_activity(water_kg, temperature);
  }
  /// ln a_w (bit-identical to operator()) and d ln a_w / d water_kg (1/kg) in closed
  /// form; false for a model without the derivative (activity_evaluator).
  bool with_slope(double water_kg, double temperature, double& ln_aw, double& slope) {
    return impl_->ln_water_activity_with_slope(water_kg, temperature, ln_aw, slope);
  }
  /// ln a_w (bit-identical to operator()) and d ln a_w / dT (1/K) in closed form; false
  /// for a model without it (activity_evaluator).
  bool with_temperature_slope(double water_kg, double temperature, double& ln_aw, double& slope) {
    return impl_->ln_water_activity_with_temperature_slope(water_kg, temperature, ln_aw, slope);
  }
  /// ln a_w and d ln a_w / dT at fixed amounts for a scan over temperature (the
  /// freezing point), equal to with_temperature_slope() within rounding; false for a model
  /// without a closed-form slope (activity_evaluator::ln_water_activity_along_temperature).
  bool along_temperature(double water_kg, double temperature, double& ln_aw, double& slope) {
    return impl_->ln_water_activity_along_temperature(water_kg, temperature, ln_aw, slope);
  }
  /// The water mass at which ln a_w equals `target`, below `water_kg`, in closed form;
  /// false for a model without it (activity_evaluator::water_for_ln_activity).
  bool water_for_ln_activity(double water_kg, double temperature, double target,
                             double& water_out, int& iterations) {
    return impl_->water_for_ln_activity(water_kg, temperature, target, water_out, iterations);
  }
  /// Validity of the prepared solution with `water_kg` at T.
  validity check(double water_kg, double temperature) { return impl_->check(water_kg, temperature); }
  /// Ion activities, or nullptr for a model without them.
  ion_activity_model* ions() noexcept { return impl_->ions(); }

 private:
  const model_descriptor* model_;
  std::unique_ptr<activity_evaluator> impl_;
};

/// ln a_w with `water_kg` of water in place of the solution's own (for the ice curve).
inline double ln_water_activity(const model_choice& m, const solution& s, double water_kg,
                                double temperature) {
  return ln_water_activity_evaluator(m, s)(water_kg, temperature);
}

/// Validity of model `m` for `s` with `water_kg` of water at T.
inline validity check(const model_choice& m, const solution& s, double water_kg,
                      double temperature) {
  return ln_water_activity_evaluator(m, s).check(water_kg, temperature);
}

/// Why a water activity outside (0, 1] is not returned.
inline constexpr const char* physical_bounds_note =
    "a solution's water activity lies in (0, 1]; the model, extrapolated this far beyond its "
    "validated range, gives no physical value";

inline void check_temperature_argument(const char* where, double temperature) {
  if (!std::isfinite(temperature) || !(temperature > 0.0))
    throw invalid_input(colligate::detail::describe(where, "temperature", temperature,
                                                    "must be finite and > 0 K"));
}

/// Water activity at temperature T with the caller's range policy.
inline checked_value water_activity(const solution& s, double temperature,
                                    const model_choice& m = "auto",
                                    range_policy policy = range_policy::extrapolate) {
  check_temperature_argument("water_activity", temperature);
  ln_water_activity_evaluator ln_aw(m, s);
  const double lnaw = ln_aw(s.water_mass(), temperature);
  return apply_policy_within(std::exp(lnaw), ln_aw.check(s.water_mass(), temperature), policy,
                             "water_activity", "water activity", 0.0, 1.0, true,
                             physical_bounds_note);
}

/// Osmotic coefficient phi = -ln a_w / (M_w sum nu_i m_i). For a solution without solutes, 1.
inline checked_value osmotic_coefficient(const solution& s, double temperature,
                                         const model_choice& m = "auto",
                                         range_policy policy = range_policy::extrapolate) {
  check_temperature_argument("osmotic_coefficient", temperature);
  const double mp = ideal::particle_molality(s, s.water_mass());
  ln_water_activity_evaluator ln_aw(m, s);
  const double lnaw = ln_aw(s.water_mass(), temperature);
  const double phi = mp > 0.0 ? -lnaw / (constants::molar_mass_water * mp) : 1.0;
  validity v = ln_aw.check(s.water_mass(), temperature);
  const double aw = std::exp(lnaw);
  // phi < 0 is a_w > 1: the same bound, named by the quantity asked for.
  if (!(aw > 0.0 && aw <= 1.0) || !std::isfinite(phi))
    v = outside_physical_bounds("osmotic_coefficient", "water activity", aw, 0.0, 1.0,
                                std::string("the osmotic coefficient would be ") +
                                    validity::fmt(phi) + "; " + physical_bounds_note);
  return apply_policy(phi, v, policy);
}

/// Readable description of which model and constants a calculation uses.
inline std::string describe_model(const solution& s, const model_choice& m = "auto") {
  const auto& d = m.resolve(s);
  std::string out = "model '" + d.id + "'";
  if (m.is_auto()) out += " (chosen by 'auto')";
  out += ": " + d.summary;
  if (d.describe) out += d.describe(s, m.options());
  return out;
}

}  // namespace colligate::models
