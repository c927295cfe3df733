#pragma once
/// \file evaluator.hpp
/// What every activity model offers once it is prepared for one species list: ln a_w of the
/// solution it was prepared for (with a water mass in place of its own, for the ice
/// curve), the validity of that state, and, for models with ion activities, the ion
/// activities a salt-saturation test needs.
///
/// An evaluator holds a pointer to the solution it was prepared for and reads its amounts
/// at each call, so it follows a solution whose amounts are overwritten in place (batch
/// rows). It may cache work of the last temperature: one evaluator per solve or per thread.

#include <cstddef>

#include "colligate/core/validity.hpp"

namespace colligate::data {
struct pitzer_parameter_set;
}  // namespace colligate::data

namespace colligate::models {

/// Ion activities of a prepared model: the ions present ("slots", in the order of
/// data::pitzer_ions), their amounts in the prepared solution, and ln a_w and
/// ln(m_i gamma_i) for any ion amounts in any water mass. The non-electrolytes of the
/// prepared solution stay as they are; a salt phase that crystallises removes ions only.
class ion_activity_model {
 public:
  virtual ~ion_activity_model() = default;
  /// Number of ions present.
  virtual std::size_t ion_slots() const = 0;
  /// Index into data::pitzer_ions of slot k.
  virtual std::size_t global_ion(std::size_t slot) const = 0;
  /// Slot of a data::pitzer_ions index; ion_slots() when that ion is absent.
  virtual std::size_t slot_of(std::size_t global_ion) const = 0;
  /// Amounts of each ion in the prepared solution, mol (ion_slots() values).
  virtual void ion_moles(double* moles_per_slot) const = 0;
  /// ln a_w with `ion_moles` (mol per slot) and the solution's non-electrolytes in
  /// `water_kg` of water at T; if `ln_activity` is not null, also ln(m_i gamma_i) per slot
  /// (-inf for an ion with zero amount).
  virtual double ln_water_activity_of_ions(const double* ion_moles, double water_kg,
                                           double temperature, double* ln_activity) = 0;
  /// The Pitzer parameter set the activities come from (its solubility-product shifts go
  /// with it: data::pitzer_parameter_set::solubility_shifts).
  virtual const data::pitzer_parameter_set& parameter_set() const = 0;
  /// Upper bounds of ln(m_i gamma_i) per slot for `ion_moles` in `water_kg` at T, each at
  /// least the ln_activity that ln_water_activity_of_ions gives (-inf for an ion with zero
  /// amount), cheaper than it: a caller may rule a salt out on them and run the exact test
  /// otherwise. False (nothing written) when the model gives no bound (the default).
  virtual bool ln_activity_upper_bounds(const double* /*ion_moles*/, double /*water_kg*/,
                                        double /*temperature*/, double* /*ln_activity_hi*/) {
    return false;
  }
};

/// A model prepared for one species list.
class activity_evaluator {
 public:
  virtual ~activity_evaluator() = default;
  /// ln a_w of the prepared solution's amounts in `water_kg` of water at T (K).
  virtual double ln_water_activity(double water_kg, double temperature) = 0;
  /// Validity of that state.
  virtual validity check(double water_kg, double temperature) = 0;
  /// ln a_w as ln_water_activity() gives it (bit-identical) and its derivative with
  /// respect to the water mass, d ln a_w / d water_kg (1/kg), in closed form. False (and
  /// nothing written) for a model without one; the ice curve then uses a root finder.
  virtual bool ln_water_activity_with_slope(double /*water_kg*/, double /*temperature*/,
                                            double& /*ln_aw*/, double& /*slope*/) {
    return false;
  }
  /// ln a_w as ln_water_activity() gives it (bit-identical) and its derivative with
  /// respect to temperature at fixed amounts, d ln a_w / dT (1/K), in closed form. False
  /// (and nothing written) for a model without one; the freezing-point solver then uses
  /// secant slopes.
  virtual bool ln_water_activity_with_temperature_slope(double /*water_kg*/,
                                                        double /*temperature*/,
                                                        double& /*ln_aw*/, double& /*slope*/) {
    return false;
  }
  /// ln a_w and d ln a_w / dT (1/K) at fixed amounts for a solver that evaluates one
  /// composition at several temperatures (the freezing point): equal to
  /// ln_water_activity_with_temperature_slope() within rounding, not necessarily bit for
  /// bit (Pitzer regroups its sums per composition, pitzer_system::
  /// ln_water_activity_along_temperature). By default that function itself.
  virtual bool ln_water_activity_along_temperature(double water_kg, double temperature,
                                                   double& ln_aw, double& slope) {
    return ln_water_activity_with_temperature_slope(water_kg, temperature, ln_aw, slope);
  }
  /// The water mass W_u (kg) at which ln a_w of the prepared solution equals `target`
  /// (< 0) at T, solved by the model in closed form (no general root finder), searched
  /// below `water_kg`, where ln a_w must lie above `target`: the unfrozen water of the ice
  /// curve. False (and nothing written) for a model without such a solver, or when it does
  /// not find the root; the ice curve then takes the Newton on d ln a_w / dW.
  virtual bool water_for_ln_activity(double /*water_kg*/, double /*temperature*/,
                                     double /*target*/, double& /*water_out*/,
                                     int& /*iterations*/) {
    return false;
  }
  /// The ion activities, or nullptr for models without them.
  virtual ion_activity_model* ions() noexcept { return nullptr; }
};

}  // namespace colligate::models
