#pragma once
/// \file ice_line_inverse.hpp
/// The ice line read backwards: the temperature T at which ice is in equilibrium with
/// water of a given ln a_w, ln a_w,ice(T) = ln a_w (water/ice.hpp), without a root finder.
///
/// Over ln a_w,ice(ice_model_min_temperature) <= ln a_w <= 0 (the validated range of the
/// ice line, 233.15-273.15 K) T(ln a_w) is a smooth, almost linear function. It is held
/// as `pieces` Chebyshev interpolants of degree `degree`, on equal intervals of ln a_w,
/// built once from the Newton inverse of ice.hpp (temperature_of_ice_equilibrium) at the
/// Chebyshev points of each piece (16 pieces of degree 7: a short Clenshaw recurrence per
/// call, one of the kernels' costs). The interpolant is accurate to about 2e-12 K
/// (tests/cpp/water/test_ice_line_inverse.cpp checks 1e-10 K on a dense grid); one Newton
/// step on ln_water_activity_of_ice then takes it to the rounding of that function, so the
/// result follows ice.hpp exactly as the Newton inverse does. Outside that range the
/// function returns NaN and the caller keeps its general path (and its validity handling).
///
/// The table is a function-local static const, built thread-safely on first use; no
/// mutable state.

#include <array>
#include <cmath>
#include <cstddef>
#include <limits>

#include "colligate/core/constants.hpp"
#include "colligate/water/ice.hpp"

namespace colligate::water {

namespace detail {

struct ice_line_inverse_table {
  static constexpr std::size_t pieces = 16;
  static constexpr std::size_t degree = 7;
  double ln_aw_min = 0.0;  ///< ln a_w,ice at the lowest validated temperature
  double scale = 0.0;      ///< pieces / (0 - ln_aw_min)
  /// Chebyshev coefficients of T (K) in t = 2 (piece position) - 1, per piece.
  std::array<std::array<double, degree + 1>, pieces> c{};
};

inline ice_line_inverse_table build_ice_line_inverse_table() {
  using table = ice_line_inverse_table;
  constexpr std::size_t n = table::degree + 1;
  const double pi = 3.14159265358979323846;
  table tb;
  tb.ln_aw_min = ln_water_activity_of_ice(ice_model_min_temperature);
  const double width = -tb.ln_aw_min / static_cast<double>(table::pieces);
  tb.scale = 1.0 / width;
  for (std::size_t p = 0; p < table::pieces; ++p) {
    const double a = tb.ln_aw_min + width * static_cast<double>(p);
    std::array<double, n> f{};
    for (std::size_t j = 0; j < n; ++j) {  // Chebyshev points of the first kind
      const double theta = pi * (static_cast<double>(j) + 0.5) / static_cast<double>(n);
      const double y = a + 0.5 * width * (1.0 + std::cos(theta));
      f[j] = temperature_of_ice_equilibrium(y, ice_model_min_temperature - 10.0);
    }
    for (std::size_t k = 0; k < n; ++k) {
      double s = 0.0;
      for (std::size_t j = 0; j < n; ++j) {
        const double theta = pi * (static_cast<double>(j) + 0.5) / static_cast<double>(n);
        s += f[j] * std::cos(static_cast<double>(k) * theta);
      }
      tb.c[p][k] = (k == 0 ? 1.0 : 2.0) * s / static_cast<double>(n);
    }
  }
  return tb;
}

inline const ice_line_inverse_table& ice_line_inverse() {
  static const ice_line_inverse_table tb = build_ice_line_inverse_table();
  return tb;
}

/// The interpolant alone (no Newton step), K; NaN outside the table's range.
inline double temperature_on_ice_line_interpolated(double ln_aw) {
  const auto& tb = ice_line_inverse();
  if (!(ln_aw >= tb.ln_aw_min && ln_aw <= 0.0)) return std::numeric_limits<double>::quiet_NaN();
  const double s = (ln_aw - tb.ln_aw_min) * tb.scale;  // 0 .. pieces
  std::size_t p = static_cast<std::size_t>(s);
  if (p >= ice_line_inverse_table::pieces) p = ice_line_inverse_table::pieces - 1;
  const double t = 2.0 * (s - static_cast<double>(p)) - 1.0;
  const auto& c = tb.c[p];
  // Clenshaw recurrence
  double b1 = 0.0, b2 = 0.0;
  for (std::size_t k = ice_line_inverse_table::degree; k > 0; --k) {
    const double b0 = c[k] + 2.0 * t * b1 - b2;
    b2 = b1;
    b1 = b0;
  }
  return c[0] + t * b1 - b2;
}

}  // namespace detail

/// Temperature (K) at which ice is in equilibrium with water of activity exp(ln_aw), for
/// ln a_w,ice(233.15 K) <= ln_aw <= 0; NaN otherwise (use temperature_of_ice_equilibrium
/// there). Interpolated inverse plus one Newton step on ln_water_activity_of_ice.
inline double temperature_on_ice_line(double ln_aw) {
  if (ln_aw == 0.0) return constants::ice_point;
  const double T = detail::temperature_on_ice_line_interpolated(ln_aw);
  if (std::isnan(T)) return T;
  const double slope = enthalpy_of_fusion(T) / (constants::gas_constant * T * T);
  return T - (ln_water_activity_of_ice(T) - ln_aw) / slope;
}

}  // namespace colligate::water
