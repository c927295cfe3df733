#pragma once
/// \file raoult.hpp
/// Raoult's law with dissociated particles counted: a_w = x_w = n_w / (n_w + sum nu_i n_i).
/// Validity: particle molality up to 1 mol/kg, ionic strength up to 0.3 mol/kg (beyond
/// those, ion interactions and solute hydration matter; use Norrish or
/// the electrolyte models).

#include <cmath>

#include "colligate/core/solution.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/models/detail/describe_constants.hpp"
#include "colligate/models/detail/static_evaluator.hpp"
#include "colligate/models/registry.hpp"

namespace colligate::models {

struct raoult {
  static constexpr const char* id = "raoult";
  /// The registry entry (defined below).
  static model_descriptor descriptor();
  static constexpr double max_particle_molality = 1.0;        // mol/kg
  static constexpr double max_ionic_strength = 0.3;     // mol/kg of formula units

  /// The validated range (the descriptor lists it; check() applies it).
  static const range_limit& ionic_strength_limit() {  // built once, immutable
    static const range_limit limit{"ionic strength", "mol/kg", 0.0, max_ionic_strength,
                                   "where ideal ions fail",
                                   "", ""};
    return limit;
  }
  static const range_limit& particle_molality_limit() {  // built once, immutable
    static const range_limit limit{"particle molality", "mol/kg", 0.0, max_particle_molality,
                                   "the validated range",
                                   "", ""};
    return limit;
  }

  static double ln_water_activity(const solution& s, double water_kg, double /*temperature*/) {
    const double nw = water_kg / constants::molar_mass_water;
    double np = 0.0;
    for (std::size_t i = 0; i < s.size(); ++i) np += s.species()[i].particles * s.moles()[i];
    return -std::log1p(np / nw);
  }

  /// ln a_w and d ln a_w / d water_kg: with n_w = water_kg / M_w and n_p the particles,
  /// d(-ln(1 + n_p/n_w))/d n_w = n_p / (n_w (n_w + n_p)).
  static void ln_water_activity_with_slope(const solution& s, double water_kg, double temperature,
                                           double& ln_aw, double& slope) {
    static_cast<void>(temperature);
    const double nw = water_kg / constants::molar_mass_water;
    double np = 0.0;
    for (std::size_t i = 0; i < s.size(); ++i) np += s.species()[i].particles * s.moles()[i];
    ln_aw = -std::log1p(np / nw);
    slope = np / (nw * (nw + np)) / constants::molar_mass_water;
  }

  static validity check(const solution& s, double water_kg, double /*temperature*/) {
    validity v;
    double m = 0.0;
    for (std::size_t i = 0; i < s.size(); ++i) m += s.species()[i].particles * s.moles()[i] / water_kg;
    const double I = s.ionic_strength(water_kg);
    const auto& ionic = ionic_strength_limit();
    const auto& particles = particle_molality_limit();
    if (I > ionic.high)
      v = ionic.above("model 'raoult'", I);
    else if (m > particles.high)
      v = particles.above("model 'raoult'", m);
    return v;
  }
};


/// The registry entry of model 'raoult' (models/builtin_models.hpp).
inline model_descriptor raoult::descriptor() {
  auto d = detail::static_model_descriptor<raoult>(
      "Raoult's law with dissociated particles counted, a_w = x_w", {false, false},
      nullptr, &detail::describe_ideal_particles);
  d.validated_range = {ionic_strength_limit(), particle_molality_limit()};
  return d;
}

}  // namespace colligate::models
