#pragma once
/// \file frozen_specific_heat.hpp
/// Published correlation for the apparent specific heat of frozen foods, kept beside the
/// physical model of enthalpy.hpp because handbook tables are built from it.
///
/// Chen (1985), J. Food Sci. 50, 1158, in the form presented by the ASHRAE Handbook -
/// Refrigeration (2006), ch. 9 (source keys chen_1985, ashrae_2006_refrigeration):
///
///     c_a = 1.55 + 1.26 x_s - (x_w - x_b) L0 t_f / t^2      kJ/(kg K),
///
/// with x_s the solids, x_w the water, x_b the unfreezable water (mass fractions of the
/// food; here x_b = bound_water_fraction_of_water * x_w, core/bound_water.hpp), L0 = 333.6 kJ/kg, t_f the initial freezing point and t the temperature, both in
/// degrees Celsius with t < t_f <= 0. The ASHRAE table's "specific heat below freezing"
/// column is this correlation at -40 C. It differs from enthalpy.hpp's apparent specific
/// heat mainly through its ice-like constant 1.55 kJ/(kg K); enthalpy.hpp uses the heat
/// capacity of ice (about 1.82 kJ/(kg K) at -40 C, IAPWS R10-06).

#include <cmath>
#include <string>

#include "colligate/core/bound_water.hpp"
#include "colligate/core/constants.hpp"
#include "colligate/core/errors.hpp"

namespace colligate::thermal {

/// Chen (1985) apparent specific heat of a frozen food, J/(kg K). Temperatures in K.
inline double chen_frozen_specific_heat(double water_fraction, double solids_fraction,
                                        double bound_water_fraction_of_water,
                                        double initial_freezing_point, double temperature) {
  const char* where = "chen_frozen_specific_heat";
  auto fraction = [&](const char* field, double v) {
    if (!std::isfinite(v) || v < 0.0 || v > 1.0)
      throw invalid_input(colligate::detail::describe(where, field, v, "must be a mass fraction in [0, 1]"));
  };
  fraction("water_fraction", water_fraction);
  fraction("solids_fraction", solids_fraction);
  check_bound_water_fraction_of_water(where, bound_water_fraction_of_water);
  if (water_fraction + solids_fraction > 1.0 + 1e-9)
    throw invalid_input(colligate::detail::describe(where, "water_fraction + solids_fraction",
                                                    water_fraction + solids_fraction, "must not exceed 1"));
  const double bound_fraction_of_food = bound_water_fraction_of_water * water_fraction;  // x_b
  const double tf = initial_freezing_point - constants::celsius_offset;
  const double t = temperature - constants::celsius_offset;
  if (!std::isfinite(tf) || tf > 0.0)
    throw invalid_input(colligate::detail::describe(where, "initial_freezing_point", initial_freezing_point,
                                                    "must be finite and <= 273.15 K"));
  if (!std::isfinite(t) || !(t < tf))
    throw invalid_input(colligate::detail::describe(where, "temperature", temperature,
                                                    "must lie below the initial freezing point"));
  constexpr double latent_kj = 333.6;  // kJ/kg, L0 of the correlation
  const double c_kj = 1.55 + 1.26 * solids_fraction -
                      (water_fraction - bound_fraction_of_food) * latent_kj * tf / (t * t);
  return 1e3 * c_kj;
}

}  // namespace colligate::thermal
