#pragma once
/// \file saturation_pressure.hpp
/// Saturation (boiling) line of pure water from the triple point to the critical point.
///
/// Wagner & Pruss (1993), J. Phys. Chem. Ref. Data 22, 783, eq. 2.5, adopted by IAPWS as
/// the supplementary release SR1-86 (1992) on the saturation properties of ordinary water
/// substance (source key wagner_pruss_1993):
///
///     ln(p_s / p_c) = (T_c / T) (a1 t + a2 t^1.5 + a3 t^3 + a4 t^3.5 + a5 t^4 + a6 t^7.5),
///     t = 1 - T / T_c,  T_c = 647.096 K,  p_c = 22.064 MPa
///
/// It agrees with IAPWS-95 within its uncertainty (about 0.01 % near 100 C). Murphy & Koop
/// (2005, vapour_pressure.hpp) cover the supercooled and atmospheric range below 332 K;
/// boiling uses this line. Check: p_s = 101325 Pa at 373.124 K (99.974 C; IAPWS).

#include <cmath>

#include "colligate/core/errors.hpp"
#include "colligate/core/roots.hpp"

namespace colligate::water {

inline constexpr double critical_temperature = 647.096;   ///< K (IAPWS)
inline constexpr double critical_pressure = 22.064e6;     ///< Pa (IAPWS)
inline constexpr double triple_point_temperature = 273.16;  ///< K
inline constexpr double triple_point_pressure = 611.657;    ///< Pa (IAPWS R10-06)

/// d ln p_s / dT and ln p_s at T (K), the Wagner & Pruss (1993) line.
inline double ln_saturation_pressure(double temperature) {
  constexpr double a1 = -7.85951783, a2 = 1.84408259, a3 = -11.7866497, a4 = 22.6807411,
                   a5 = -15.9618719, a6 = 1.80122502;
  const double T = temperature;
  const double t = 1.0 - T / critical_temperature;
  const double st = std::sqrt(t);
  const double t3 = t * t * t;
  return std::log(critical_pressure) +
         critical_temperature / T *
             (a1 * t + a2 * t * st + a3 * t3 + a4 * t3 * st + a5 * t3 * t + a6 * t3 * t3 * t * st);
}

inline void check_saturation_temperature(const char* where, double temperature) {
  if (!std::isfinite(temperature) || temperature < triple_point_temperature - 1e-9 ||
      temperature > critical_temperature)
    throw invalid_input(colligate::detail::describe(
        where, "temperature", temperature,
        "must lie between the triple point 273.16 K and the critical point 647.096 K"));
}

/// Saturation vapour pressure of pure liquid water at T (K), Pa.
inline double saturation_pressure(double temperature) {
  check_saturation_temperature("saturation_pressure", temperature);
  return std::exp(ln_saturation_pressure(temperature));
}

/// Saturation (boiling) temperature of pure water at pressure P (Pa), K.
inline double saturation_temperature(double pressure) {
  if (!std::isfinite(pressure) || pressure < triple_point_pressure || pressure > critical_pressure)
    throw invalid_input(colligate::detail::describe(
        "saturation_temperature", "pressure", pressure,
        "must lie between the triple-point pressure 611.657 Pa and the critical pressure 22.064 MPa"));
  const double lnP = std::log(pressure);
  auto f = [&](double T) { return ln_saturation_pressure(T) - lnP; };
  const double lo = triple_point_temperature, hi = critical_temperature;
  const double f_lo = f(lo), f_hi = f(hi);
  if (!(f_lo < 0.0)) return lo;  // at the triple-point pressure
  if (!(f_hi > 0.0)) return hi;  // at the critical pressure
  return toms748_root(f, lo, hi, f_lo, f_hi, 52, 200).x;
}

}  // namespace colligate::water
