#pragma once
/// \file ideal.hpp
/// Ideal dilute (colligative) model: ln a_w = -M_w * sum_i nu_i m_i, the limit of every
/// model as m -> 0; with the ice equilibrium linearised it gives dT = Kf sum nu_i m_i,
/// Kf = R T0^2 M_w / dH_fus = 1.86 K kg/mol (common practice).
/// Validity: dilute solutions; total particle molality up to 0.1 mol/kg, where it stays
/// within about 1 % of the CRC Handbook freezing-point depressions of sugars and salts.

#include <string>

#include "colligate/core/constants.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/models/detail/describe_constants.hpp"
#include "colligate/models/detail/static_evaluator.hpp"
#include "colligate/models/registry.hpp"

namespace colligate::models {

struct ideal {
  static constexpr const char* id = "ideal";
  /// The registry entry (defined below).
  static model_descriptor descriptor();
  static constexpr double max_particle_molality = 0.1;  // mol/kg

  /// The validated range (the descriptor lists it; check() applies it).
  static const range_limit& particle_molality_limit() {  // built once, immutable
    static const range_limit limit{"particle molality", "mol/kg", 0.0, max_particle_molality,
                                   "the dilute range where the colligative law holds within "
                                   "about 1 %",
                                   "", ""};
    return limit;
  }

  static double particle_molality(const solution& s, double water_kg) {
    double m = 0.0;
    for (std::size_t i = 0; i < s.size(); ++i) m += s.species()[i].particles * s.moles()[i];
    return m / water_kg;
  }

  /// ln a_w with `water_kg` of water in place of the solution's own.
  static double ln_water_activity(const solution& s, double water_kg, double /*temperature*/) {
    return -constants::molar_mass_water * particle_molality(s, water_kg);
  }

  /// ln a_w and d ln a_w / d water_kg = -ln a_w / water_kg (ln a_w is proportional to
  /// 1 / water_kg).
  static void ln_water_activity_with_slope(const solution& s, double water_kg, double temperature,
                                           double& ln_aw, double& slope) {
    ln_aw = ln_water_activity(s, water_kg, temperature);
    slope = -ln_aw / water_kg;
  }

  static validity check(const solution& s, double water_kg, double /*temperature*/) {
    validity v;
    const double m = particle_molality(s, water_kg);
    if (const auto& limit = particle_molality_limit(); m > limit.high)
      v = limit.above("model 'ideal'", m);
    return v;
  }
};


/// The registry entry of model 'ideal' (models/builtin_models.hpp).
inline model_descriptor ideal::descriptor() {
  auto d = detail::static_model_descriptor<ideal>(
      "ideal dilute solution, ln a_w = -M_w sum nu_i m_i", {false, false},
      nullptr, &detail::describe_ideal_particles);
  d.validated_range = {particle_molality_limit()};
  return d;
}

}  // namespace colligate::models
