#pragma once
/// \file dissolved_heat_capacity.hpp
/// Apparent specific heat capacity of a solute dissolved in water: what one more kilogram
/// of the solute adds to the heat capacity of the solution, beyond the water's own.
///
/// Salts in water have negative apparent heat capacities (the ions order the water around
/// them): NaCl near infinite dilution about -2.9 kJ/(kg K) at 1.5 C, while the Choi & Okos
/// (1986) "ash" polynomial gives +1.09. A food's thermal model that counts dissolved salt
/// as ash overstates the heat capacity of a brine by about 2 % at seawater strength.
///
/// Correlation of Laliberte (2009), J. Chem. Eng. Data 54, 1725-1760, fitted there to
/// measured heat capacities of binary aqueous solutions (about 6600 points for 79
/// solutes); its parameter table gives a1..a6 with each fit's temperature range and
/// highest mass fraction (source key laliberte_2009; the equation and the constants were
/// read from the copy in the chemicals package, chemicals/Electrolytes/Laliberte2009.tsv
/// and electrochem.py, whose worked example NaCl at 1.5 C, w_s = 0.00398, gives
/// -2930.7 J/(kg K), reproduced in tests/cpp/thermal/test_thermal.cpp):
///
///     c_p,app = a1 e^alpha + a5 w_s^a6     kJ/(kg K)
///     alpha   = a2 t + a3 e^(0.01 t) + a4 w_s
///
/// t in degC, w_s = 1 - w_w the mass fraction of all solutes in the solution; the
/// solution's heat capacity is w_w c_p,water + sum_i w_i c_p,app,i.
/// Outside the fit's range the value at the nearest end is kept (no extrapolation of the
/// exponential in t, which diverges below the data): below t_min the heat capacity of the
/// lowest measured temperature, above w_max that of the highest measured concentration.

#include <algorithm>
#include <cmath>
#include <string>

namespace colligate::data {

struct dissolved_heat_capacity {
  bool available = false;
  double a1 = 0.0, a2 = 0.0, a3 = 0.0, a4 = 0.0, a5 = 0.0, a6 = 0.0;
  double min_temperature = 0.0;      ///< K, lowest temperature of the fit's data
  double max_temperature = 0.0;      ///< K, highest temperature of the fit's data
  double max_solute_fraction = 0.0;  ///< highest solute mass fraction of the fit's data
  std::string source;                ///< citation key
};

/// Apparent specific heat capacity of the dissolved solute, J/(kg K), at temperature T (K)
/// in a solution whose solutes make up the mass fraction `solute_fraction` (the value is
/// held at the ends of the fit's ranges, see the file comment). Requires `c.available`.
inline double apparent_specific_heat(const dissolved_heat_capacity& c, double temperature,
                                     double solute_fraction) {
  const double T = std::clamp(temperature, c.min_temperature, c.max_temperature);
  const double t = T - 273.15;  // degC, as in the correlation
  // w_s > 0 always holds for a solute that is present; the floor keeps w_s^a6 finite
  // when a6 < 0 (ethanol) for a vanishing amount.
  const double w = std::clamp(solute_fraction, 1e-9, c.max_solute_fraction);
  const double alpha = c.a2 * t + c.a3 * std::exp(0.01 * t) + c.a4 * w;
  return 1e3 * (c.a1 * std::exp(alpha) + c.a5 * std::pow(w, c.a6));
}

namespace detail {

/// One record's constants from Laliberte's (2009) table (t range in degC).
inline dissolved_heat_capacity laliberte(double a1, double a2, double a3, double a4, double a5,
                                         double a6, double t_min, double t_max, double w_max) {
  dissolved_heat_capacity c;
  c.available = true;
  c.a1 = a1; c.a2 = a2; c.a3 = a3; c.a4 = a4; c.a5 = a5; c.a6 = a6;
  c.min_temperature = 273.15 + t_min;
  c.max_temperature = 273.15 + t_max;
  c.max_solute_fraction = w_max;
  c.source = "laliberte_2009";
  return c;
}

}  // namespace detail

}  // namespace colligate::data
