#pragma once
/// \file starzak_peacock.hpp
/// Water activity of sucrose solutions with its temperature dependence, from -15 C to
/// the boiling range: Starzak & Peacock (1997), Zuckerindustrie 122, 380-387, "Water
/// activity coefficient in aqueous solutions of sucrose - a comprehensive data analysis"
/// (source key starzak_peacock_1997). A regular-solution form fitted by the authors to
/// a century of vapour-pressure, boiling-point, osmotic and freezing data:
///
///     ln a_w = ln x_w + ln gamma_w,
///     ln gamma_w = (Q / (R T)) x_s^2 (1 + a x_s + b x_s^2)
///
/// with x_s the mole fraction of sucrose, Q = -17638 J/mol, a = -1.0038, b = -0.24653.
/// The three constants were read from a summary of the paper (Q, a, b as printed); the
/// paper itself was not read, and the functional form is the one those constants fit:
/// with it, the CRC freezing points of sucrose (0.5-42 wt%, -0.03 to -4.93 C) are met
/// within 0.05 K (the 25 C Norrish constant: 0.18 K), the 25 C osmotic coefficients of
/// Robinson & Stokes (1959) within 1.1 % from 3 to 6 mol/kg
/// (tests/cpp/models/test_starzak_peacock.cpp), and d(x_s^2 (1 + a x_s + b x_s^2))/dx_s
/// vanishes at x_s = 0.56 (96 wt%), the minimum of gamma_w the same authors report.
/// The temperature dependence is that of a constant excess enthalpy (ln gamma_w ~ 1/T):
/// at 70 wt% it raises a_w from 0.826 at 25 C to 0.838 at 100 C, which is what the
/// 25 C Norrish constant misses at the boiling point.
///
/// Solutes other than sucrose are counted as ideal particles (x_w counts every dissolved
/// particle) and flagged. 'auto' never picks the model: it would switch models when a trace
/// of a second solute is added (the freezing point of 6.25 wt% sucrose would rise by
/// 0.5 mK on adding 0.01 wt% glucose); callers ask for it by id (boiling points of syrups).
/// Validity: 233.15-423.15 K and up to 90 wt%. The upper end is that of the same authors'
/// 2006 Margules analysis (-15 to 150 C; the 1997 summary says only "all ranges studied");
/// the lower end is the Norrish constants' (models/norrish.hpp), so that the ice curve of
/// a sucrose solution keeps the range it had: between -40 and -15 C the constant excess
/// enthalpy is an extrapolation, checked only down to the CRC rows (-4.9 C).

#include <cmath>
#include <string>

#include "colligate/core/constants.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/models/detail/describe_constants.hpp"
#include "colligate/models/detail/static_evaluator.hpp"
#include "colligate/models/registry.hpp"

namespace colligate::models {

struct starzak_peacock {
  static constexpr const char* id = "starzak_peacock";
  static model_descriptor descriptor();
  static constexpr double excess_enthalpy_q = -17638.0;  ///< Q, J/mol
  static constexpr double coefficient_a = -1.0038;
  static constexpr double coefficient_b = -0.24653;
  static constexpr double min_temperature = 233.15;
  static constexpr double max_temperature = 423.15;
  static constexpr double max_mass_fraction = 0.90;

  /// The validated range (the descriptor lists it; check() applies it).
  static const range_limit& temperature_limit() {  // built once, immutable
    static const range_limit limit{"temperature", "K", min_temperature, max_temperature,
                                   "the range of the sucrose data analysed",
                                   "starzak_peacock_1997", ""};
    return limit;
  }
  static const range_limit& mass_fraction_limit() {  // built once, immutable
    static const range_limit limit{"mass fraction of sucrose", "", 0.0, max_mass_fraction,
                                   "the highest concentration checked here",
                                   "starzak_peacock_1997", ""};
    return limit;
  }
  static constexpr const char* solute_id = "sucrose";

  static double ln_water_activity(const solution& s, double water_kg, double temperature) {
    double ln_aw = 0.0;
    evaluate(s, water_kg, temperature, ln_aw, nullptr);
    return ln_aw;
  }

  /// ln a_w (bit-identical to ln_water_activity) and d ln a_w / d water_kg in closed form:
  /// with n_w = W / M_w, N = n_w + n_particles and x_s = n_s / N,
  /// d ln x_w / d n_w = n_p / (n_w N) and d x_s / d n_w = -x_s / N.
  static void ln_water_activity_with_slope(const solution& s, double water_kg, double temperature,
                                           double& ln_aw, double& slope) {
    evaluate(s, water_kg, temperature, ln_aw, &slope);
  }

  static validity check(const solution& s, double water_kg, double temperature) {
    const char* where = "model 'starzak_peacock'";
    if (const auto& limit = temperature_limit(); !limit.contains(temperature))
      return limit.outside(where, temperature);
    for (std::size_t i = 0; i < s.size(); ++i) {
      const auto& rec = s.species()[i];
      if (rec.id != solute_id)
        return flagged(validity_code::missing_constants, where, "solute '" + rec.id + "'",
                       "the model describes sucrose only; counted as an ideal (Raoult) particle",
                       "starzak_peacock_1997");
      const double mass = s.moles()[i] * rec.molar_mass;
      const double w = mass / (mass + water_kg);
      if (const auto& limit = mass_fraction_limit(); w > limit.high) return limit.above(where, w);
    }
    return validity{};
  }

 private:
  static void evaluate(const solution& s, double water_kg, double temperature, double& ln_aw,
                       double* slope) {
    const double nw = water_kg / constants::molar_mass_water;
    double particles = 0.0, sucrose = 0.0;
    for (std::size_t i = 0; i < s.size(); ++i) {
      const auto& rec = s.species()[i];
      particles += rec.particles * s.moles()[i];
      if (rec.id == solute_id) sucrose += s.moles()[i];
    }
    const double total = nw + particles;
    const double xs = sucrose / total;
    const double c = excess_enthalpy_q / (constants::gas_constant * temperature);
    const double g = xs * xs * (1.0 + coefficient_a * xs + coefficient_b * xs * xs);
    ln_aw = -std::log1p(particles / nw) + c * g;
    if (slope != nullptr) {
      const double dg = xs * (2.0 + xs * (3.0 * coefficient_a + 4.0 * coefficient_b * xs));
      *slope = (particles / (nw * total) - c * dg * xs / total) / constants::molar_mass_water;
    }
  }
};

/// The registry entry of model 'starzak_peacock' (models/builtin_models.hpp); never chosen
/// by 'auto'.
inline model_descriptor starzak_peacock::descriptor() {
  auto d = detail::static_model_descriptor<starzak_peacock>(
      "Starzak & Peacock (1997) sucrose water activity, ln gamma_w = (Q/RT) x_s^2 (1 + a x_s + b x_s^2), "
      "temperature dependent",
      {true, false}, nullptr,
      [](const data::solute_record& rec) -> std::string {
        if (rec.id != solute_id) return detail::describe_ideal_particles(rec);
        return "Q = -17638 J/mol, a = -1.0038, b = -0.24653 [starzak_peacock_1997]";
      });
  d.validated_range = {temperature_limit(), mass_fraction_limit()};
  return d;
}

}  // namespace colligate::models
