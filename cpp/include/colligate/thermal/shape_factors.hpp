#pragma once
/// \file shape_factors.hpp
/// Equivalent heat-transfer dimensionality (EHTD) E of finite bodies, for Pham's method
/// (freezing_time.hpp): t(body) = t(slab of the same shortest half-dimension) / E.
///
/// Hossain, Cleland & Cleland (1992), Int. J. Refrig. 15, 227-234, "Prediction of freezing
/// and thawing times for foods of regular multi-dimensional shape by using an analytically
/// derived geometric factor", as presented in ASHRAE Handbook - Refrigeration, "Cooling and
/// freezing times of foods" (source key hossain_1992; coefficients from memory):
///
///     E   = G1 + G2 E1 + G3 E2
///     E_j = X(2.32 beta_j^-1.77) / beta_j + [1 - X(2.32 beta_j^-1.77)] 0.73 / beta_j^2.5
///     X(lambda) = lambda / (Bi^1.34 + lambda),      Bi = h d / k_f
///
/// with d half the shortest dimension, beta_1 = (second dimension) / (shortest),
/// beta_2 = (longest) / (shortest), and (G1, G2, G3) = (1, 1, 1) for a rectangular brick,
/// (1, 1, 0) for an infinite rectangular rod, (1, 2, 0) for a finite cylinder whose height
/// is below its diameter (beta_1 = diameter / height), (2, 0, 1) for a finite cylinder whose
/// height exceeds its diameter (beta_2 = height / diameter). Identities tested: at Bi -> 0
/// E equals the surface-to-volume ratio times d (a cube and a cylinder of equal height and
/// diameter give 3, as a sphere); a very long body tends to its 1-D limit.

#include <algorithm>
#include <array>
#include <cmath>
#include <string>

#include "colligate/core/errors.hpp"

namespace colligate::thermal {

namespace detail {

inline double ehtd_term(double beta, double biot) {
  const double lambda = 2.32 * std::pow(beta, -1.77);
  const double x = lambda / (std::pow(biot, 1.34) + lambda);
  return x / beta + (1.0 - x) * 0.73 / std::pow(beta, 2.5);
}

inline void check_dimension(const char* where, const char* field, double v) {
  if (!std::isfinite(v) || !(v > 0.0))
    throw invalid_input(colligate::detail::describe(where, field, v, "must be finite and > 0 m"));
}

inline double ehtd_biot(const char* where, double shortest, double h, double k_frozen) {
  if (!std::isfinite(h) || !(h > 0.0))
    throw invalid_input(colligate::detail::describe(where, "h", h, "must be finite and > 0 W/(m^2 K)"));
  if (!std::isfinite(k_frozen) || !(k_frozen > 0.0))
    throw invalid_input(
        colligate::detail::describe(where, "k_frozen", k_frozen, "must be finite and > 0 W/(m K)"));
  return h * (shortest / 2.0) / k_frozen;
}

}  // namespace detail

/// EHTD of a rectangular brick with sides a, b, c (any order), m.
inline double brick_shape_factor(double a, double b, double c, double h, double k_frozen) {
  const char* where = "brick_shape_factor";
  detail::check_dimension(where, "a", a);
  detail::check_dimension(where, "b", b);
  detail::check_dimension(where, "c", c);
  std::array<double, 3> s{a, b, c};
  std::sort(s.begin(), s.end());
  const double bi = detail::ehtd_biot(where, s[0], h, k_frozen);
  return 1.0 + detail::ehtd_term(s[1] / s[0], bi) + detail::ehtd_term(s[2] / s[0], bi);
}

/// EHTD of an infinitely long rectangular rod with cross-section a x b, m.
inline double rod_shape_factor(double a, double b, double h, double k_frozen) {
  const char* where = "rod_shape_factor";
  detail::check_dimension(where, "a", a);
  detail::check_dimension(where, "b", b);
  const double lo = std::min(a, b), hi = std::max(a, b);
  const double bi = detail::ehtd_biot(where, lo, h, k_frozen);
  return 1.0 + detail::ehtd_term(hi / lo, bi);
}

/// EHTD of a finite cylinder of diameter D and height H, m.
inline double finite_cylinder_shape_factor(double diameter, double height, double h, double k_frozen) {
  const char* where = "finite_cylinder_shape_factor";
  detail::check_dimension(where, "diameter", diameter);
  detail::check_dimension(where, "height", height);
  if (height < diameter) {
    const double bi = detail::ehtd_biot(where, height, h, k_frozen);
    return 1.0 + 2.0 * detail::ehtd_term(diameter / height, bi);
  }
  const double bi = detail::ehtd_biot(where, diameter, h, k_frozen);
  return 2.0 + detail::ehtd_term(height / diameter, bi);
}

}  // namespace colligate::thermal
