#pragma once
/// \file vapour_pressure.hpp
/// Vapour pressures of ice and of liquid (including supercooled) water,
/// Murphy & Koop (2005), Q. J. R. Meteorol. Soc. 131, 1539, eq. 7 (ice, T > 110 K) and
/// eq. 10 (liquid, 123 K < T < 332 K). Pressures in Pa, temperatures in K.

#include <cmath>

namespace colligate::water {

/// Vapour pressure of hexagonal ice, Pa. Murphy & Koop (2005) eq. 7.
inline double ice_vapour_pressure(double temperature) {
  const double T = temperature;
  return std::exp(9.550426 - 5723.265 / T + 3.53068 * std::log(T) - 0.00728332 * T);
}

/// Vapour pressure of liquid water, stable or supercooled, Pa. Murphy & Koop (2005) eq. 10.
inline double liquid_vapour_pressure(double temperature) {
  const double T = temperature;
  const double lnT = std::log(T);
  return std::exp(54.842763 - 6763.22 / T - 4.210 * lnT + 0.000367 * T +
                  std::tanh(0.0415 * (T - 218.8)) *
                      (53.878 - 1331.22 / T - 9.44523 * lnT + 0.014025 * T));
}

}  // namespace colligate::water
