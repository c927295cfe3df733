#pragma once
/// \file ice.hpp
/// Water activity of a solution in equilibrium with pure ice Ih at 101325 Pa.
///
/// Ice coexists with a solution when ln a_w(solution, T) = ln a_w,ice(T), where
///
///     ln a_w,ice(T) = (1/R) * integral from T0 to T of dH_fus(t) / t^2 dt,
///     dH_fus(T)    = dH_fus(T0) + integral from T0 to T of dCp(t) dt,
///     dCp(T)       = Cp,liquid(T) - Cp,ice(T) = c0 + c1 d + c2 d^2 + c3 d^3,  d = T - T0.
///
/// T0 = 273.15 K (the ice point at one atmosphere), dH_fus(T0) = 6007 J/mol and
/// c0 = 38.25 J/(mol K) from constants.hpp (IAPWS-95 liquid minus IAPWS R10-06 ice at
/// 0 C). c1..c3 describe the rising heat capacity of supercooled water; they were fitted
/// by colligate (source key colligate_fit_mk2005) to the ratio of the Murphy & Koop
/// (2005) vapour pressures of ice (eq. 7) and supercooled water (eq. 10), with a
/// Poynting correction to one atmosphere, over 233.15-273.15 K. The result reproduces
/// that ratio within 3e-5 in a_w over the range; tests/cpp/water/test_ice.cpp checks it.
/// Validated range: 233.15 K to 273.15 K.
///
/// Formulation limits. Below 233.15 K the polynomial is extrapolated (flagged; the range
/// policy applies) down to 215 K, where it still follows the Murphy & Koop ratio within
/// 1 % in a_w (0.4 % at 219.15 K, the end of the salt data). Further down the cubic dCp
/// turns the enthalpy of fusion negative near 206.6 K, so a_w,ice rises again and
/// exceeds 1 below about 175 K: below 215 K (and above the ice point, where ice melts)
/// the formulation gives no value (NaN; ice_temperature_validity says why, with the code
/// outside_physical_bounds, which no range policy turns into a number).

#include <array>
#include <cstddef>
#include <cmath>
#include <limits>

#include "colligate/core/constants.hpp"
#include "colligate/core/roots.hpp"
#include "colligate/core/validity.hpp"

namespace colligate::water {

/// Lowest temperature at which a_w,ice(T) is validated, K (-40 C).
inline constexpr double ice_model_min_temperature = 233.15;
/// Highest temperature at which ice can exist at one atmosphere, K.
inline constexpr double ice_model_max_temperature = constants::ice_point;
/// Lowest temperature at which a_w,ice(T) is given at all (extrapolated below 233.15 K),
/// K; see the file comment.
inline constexpr double ice_model_lowest_temperature = 215.0;

namespace detail {

/// dCp polynomial coefficients in d = T - T0: J/(mol K), J/(mol K^2), ...
inline constexpr std::array<double, 4> delta_cp_coefficients = {
    constants::heat_capacity_water_0c - constants::heat_capacity_ice_0c,  // 38.25
    -0.1571134, -0.01728863, -0.00096686};

/// Coefficients a_j of dH_fus(T) = sum_j a_j T^j (j = 0..4), expanded from the
/// polynomial in d = T - T0.
inline std::array<double, 5> enthalpy_power_coefficients() {
  // dH(d) = H0 + sum_k c_k d^(k+1)/(k+1) = sum_n b_n d^n, n = 0..4
  const auto& c = delta_cp_coefficients;
  const std::array<double, 5> b = {constants::enthalpy_of_fusion_ice, c[0], c[1] / 2.0,
                                   c[2] / 3.0, c[3] / 4.0};
  // d^n = (T - T0)^n = sum_j binom(n, j) T^j (-T0)^(n-j)
  std::array<double, 5> a{};
  const double T0 = constants::ice_point;
  for (int n = 0; n < 5; ++n) {
    double binom = 1.0;
    for (int j = 0; j <= n; ++j) {
      if (j > 0) binom = binom * (n - j + 1) / j;
      a[j] += b[n] * binom * std::pow(-T0, n - j);
    }
  }
  return a;
}

/// Antiderivative of dH_fus(t)/t^2.
inline double enthalpy_over_t2_antiderivative(const std::array<double, 5>& a, double t) {
  return -a[0] / t + a[1] * std::log(t) + a[2] * t + a[3] * t * t / 2.0 +
         a[4] * t * t * t / 3.0;
}

}  // namespace detail

/// Heat-capacity difference between liquid water and ice, J/(mol K).
inline double delta_heat_capacity_of_fusion(double temperature) {
  const double d = temperature - constants::ice_point;
  const auto& c = detail::delta_cp_coefficients;
  return c[0] + d * (c[1] + d * (c[2] + d * c[3]));
}

/// Molar enthalpy of fusion of ice at temperature T, J/mol.
inline double enthalpy_of_fusion(double temperature) {
  const double d = temperature - constants::ice_point;
  const auto& c = detail::delta_cp_coefficients;
  return constants::enthalpy_of_fusion_ice +
         d * (c[0] + d * (c[1] / 2.0 + d * (c[2] / 3.0 + d * c[3] / 4.0)));
}

namespace detail {

/// Number of terms of the series in w = (T - T0)/T used for |w| <= 0.3 (T from 210 to
/// 390 K); the terms fall below 1e-18 of the sum there.
inline constexpr std::size_t ice_series_terms = 48;

/// Coefficients e_j of ln a_w,ice = sum_j e_j w^(j+1), w = (T - T0)/T. With u = t - T0
/// and dH_fus = sum_n b_n u^n, the substitution w = u/t turns each
/// integral_0^d u^n/t^2 du into T0^(n-1) sum_k C(n+k-1, k) w^(n+k+1)/(n+k+1), so
/// e_j = [sum_n b_n T0^(n-1) C(j-1, n-1)] / ((j+1) R) (n = 0 only for j = 0: b_0/T0).
/// Unlike the antiderivative in powers of T, whose terms reach 1e5 and cancel (rounding
/// of about 1e-11 in ln a_w, 1e-9 K in a freezing point), the series is smooth to rounding.
inline std::array<double, ice_series_terms> ice_series_coefficients() {
  const auto& c = delta_cp_coefficients;
  const std::array<double, 5> b = {constants::enthalpy_of_fusion_ice, c[0], c[1] / 2.0,
                                   c[2] / 3.0, c[3] / 4.0};
  const double T0 = constants::ice_point;
  std::array<double, ice_series_terms> e{};
  e[0] = b[0] / T0;
  for (std::size_t j = 1; j < ice_series_terms; ++j) {
    double sum = 0.0, T0_power = 1.0, binom = 1.0;  // T0^(n-1), C(j-1, n-1)
    for (std::size_t n = 1; n <= 4 && n <= j; ++n) {
      sum += b[n] * T0_power * binom;
      T0_power *= T0;
      binom = binom * static_cast<double>(j - n) / static_cast<double>(n);
    }
    e[j] = sum;
  }
  for (std::size_t j = 0; j < ice_series_terms; ++j)
    e[j] /= static_cast<double>(j + 1) * constants::gas_constant;
  return e;
}

/// The first N terms of the series, Horner in w^4 on four interleaved chains (terms
/// j = 4i + k, k = 0..3), joined at the end: a quarter of the dependent steps of one chain,
/// with rounding of the same order.
template <std::size_t N>
inline double ice_series_sum(const std::array<double, ice_series_terms>& e, double w) {
  static_assert(N % 4 == 0 && N >= 8 && N <= ice_series_terms, "four chains of whole terms");
  const double w2 = w * w, w4 = w2 * w2;
  double s0 = e[N - 4], s1 = e[N - 3], s2 = e[N - 2], s3 = e[N - 1];
  for (std::size_t j = N - 4; j >= 4; j -= 4) {
    s0 = e[j - 4] + w4 * s0;
    s1 = e[j - 3] + w4 * s1;
    s2 = e[j - 2] + w4 * s2;
    s3 = e[j - 1] + w4 * s3;
  }
  return w * ((s0 + w * s1) + w2 * (s2 + w * s3));
}

/// |w| up to which the first 16 (24) terms are summed (ln_water_activity_of_ice).
inline constexpr double ice_series_w16 = 0.04;
inline constexpr double ice_series_w24 = 0.1;

/// Upper bound of the terms j >= n of the series at |w|, relative to the first term's size
/// e_0 |w| (the value is within a few per cent of it up to |w| = 0.3): sum |e_j| |w|^j / e_0
/// over n <= j < ice_series_terms.
inline double ice_series_tail_bound(std::size_t n, double w) {
  const auto e = ice_series_coefficients();
  const double aw = std::abs(w);
  double tail = 0.0, p = 1.0;
  for (std::size_t j = 1; j < ice_series_terms; ++j) {
    p *= aw;
    if (j >= n) tail += std::abs(e[j]) * p;
  }
  return tail / e[0];
}

}  // namespace detail

/// ln of the water activity of a solution in equilibrium with ice at T, one atmosphere.
/// Given from 215 K up (NaN below, and for a non-finite T); validated 233.15-273.15 K
/// (check with ice_temperature_validity). Above the ice point it continues the same
/// expression (positive: callers take ln a_w,ice = 0 there). From 210 to 390 K by the
/// series of detail::ice_series_coefficients (smooth to rounding, which root finders and
/// finite differences need), elsewhere by the antiderivative in powers of T.
inline double ln_water_activity_of_ice(double temperature) {
  if (!(temperature >= ice_model_lowest_temperature) || !std::isfinite(temperature))
    return std::numeric_limits<double>::quiet_NaN();
  const double w = (temperature - constants::ice_point) / temperature;
  const double aw = std::abs(w);
  if (aw <= 0.3) {
    // Near the ice point the series is cut short: its first 16 terms for |w| <= 0.04
    // (T >= 262.6 K, every kernel's usual range) and 24 for |w| <= 0.1, where the terms left
    // out add up to less than 2^-60 of the value (detail::ice_series_tail_bound; checked in
    // tests/cpp/water/test_ice.cpp), far below its rounding: the tiers join within a few
    // ulp, so the function stays smooth to rounding.
    static const auto e = detail::ice_series_coefficients();
    if (aw <= detail::ice_series_w16) return detail::ice_series_sum<16>(e, w);
    if (aw <= detail::ice_series_w24) return detail::ice_series_sum<24>(e, w);
    return detail::ice_series_sum<detail::ice_series_terms>(e, w);
  }
  static const std::array<double, 5> a = detail::enthalpy_power_coefficients();
  return (detail::enthalpy_over_t2_antiderivative(a, temperature) -
          detail::enthalpy_over_t2_antiderivative(a, constants::ice_point)) /
         constants::gas_constant;
}

/// Water activity of a solution in equilibrium with ice at T.
inline double water_activity_of_ice(double temperature) {
  return std::exp(ln_water_activity_of_ice(temperature));
}

/// Inverse of ln_water_activity_of_ice on [t_min, T0]: the temperature at which ice is in
/// equilibrium with water of activity exp(ln_aw). Safeguarded Newton (the function is
/// increasing there: d ln a / dT = dH_fus / (R T^2) > 0), bisection when a step leaves the
/// bracket. Returns NaN if ln_aw is outside [ln a_w,ice(t_min), 0].
inline double temperature_of_ice_equilibrium(double ln_aw, double t_min = 223.15) {
  if (!(ln_aw <= 0.0)) return std::numeric_limits<double>::quiet_NaN();
  if (ln_aw == 0.0) return constants::ice_point;
  double lo = t_min, hi = constants::ice_point;
  if (!(ln_water_activity_of_ice(lo) <= ln_aw)) return std::numeric_limits<double>::quiet_NaN();
  // First guess from the linearised relation dT = -ln_aw R T0^2 / dH_fus.
  const double T0 = constants::ice_point;
  const double T = T0 + ln_aw * constants::gas_constant * T0 * T0 / constants::enthalpy_of_fusion_ice;
  return safeguarded_newton(
             [ln_aw](double t) { return ln_water_activity_of_ice(t) - ln_aw; },
             [](double t) { return enthalpy_of_fusion(t) / (constants::gas_constant * t * t); },
             lo, hi, T, 4e-15, 60)
      .x;
}

/// True when ice_temperature_validity(temperature) is in range (no record to build): T at or
/// above 233.15 K (less 1e-9 K for temperatures converted from Celsius); false for NaN.
inline bool ice_temperature_in_validated_range(double temperature) {
  return temperature >= ice_model_min_temperature - 1e-9;
}

/// Range check for the ice equilibrium: outside_physical_bounds below 215 K (no value),
/// temperature_out_of_range from 215 to 233.15 K (extrapolated).
inline validity ice_temperature_validity(double temperature) {
  validity v;
  if (!(temperature >= ice_model_lowest_temperature))
    return outside_range("ice equilibrium", "temperature", temperature,
                         ice_model_lowest_temperature, ice_model_max_temperature, " K",
                         "a_w,ice is not given below 215 K: its heat-capacity polynomial, fitted "
                         "down to 233.15 K, departs from the Murphy & Koop (2005) ratio by more "
                         "than 1 % there and turns unphysical below about 207 K",
                         "murphy_koop_2005", validity_code::outside_physical_bounds);
  if (!ice_temperature_in_validated_range(temperature))
    v = outside_range("ice equilibrium", "temperature", temperature, ice_model_min_temperature,
                      ice_model_max_temperature, " K", "the validated range of a_w,ice",
                      "murphy_koop_2005");
  return v;
}

/// v.merge(ice_temperature_validity(temperature)), building the ice record only when it is
/// needed (v in range and T outside the validated range): the kernels' per-row form.
inline void merge_ice_temperature_validity(validity& v, double temperature) {
  if (v.in_range() && !ice_temperature_in_validated_range(temperature))
    v = ice_temperature_validity(temperature);
}

/// Water activity of a solution in equilibrium with ice at T (K) with the caller's range
/// policy: extrapolated (flagged) from 215 to 233.15 K; below 215 K, or above the ice
/// point where ice melts, no value (NaN with the reason, or out_of_validity_range under
/// `raise`). A non-finite or non-positive T is a caller mistake.
inline checked_value water_activity_of_ice_checked(double temperature,
                                                   range_policy policy = range_policy::extrapolate) {
  if (!std::isfinite(temperature) || !(temperature > 0.0))
    throw invalid_input(colligate::detail::describe("water_activity_of_ice", "temperature",
                                                    temperature, "must be finite and > 0 K"));
  if (temperature > ice_model_max_temperature)
    return apply_policy(std::numeric_limits<double>::quiet_NaN(),
                        outside_range("water_activity_of_ice", "temperature", temperature,
                                      ice_model_lowest_temperature, ice_model_max_temperature,
                                      " K", "ice melts above the ice point at one atmosphere",
                                      "murphy_koop_2005", validity_code::outside_physical_bounds),
                        policy);
  return apply_policy(water_activity_of_ice(temperature), ice_temperature_validity(temperature),
                      policy);
}

}  // namespace colligate::water
