#pragma once
/// \file seawater_freezing_line.hpp
/// The freezing point of seawater of the TEOS-10 Reference Composition
/// (solution::seawater) as a function of its absolute salinity alone, read from a
/// Chebyshev series of the library's own model rather than solved row by row.
///
/// For a fixed composition the first-solid temperature is a smooth function of the
/// salinity. The series is in s = sqrt(SA): the Debye-Hueckel terms go with sqrt(I), so
/// T_f has an SA^1.5 term that a series in SA itself would converge on only slowly. It is
/// built from `nodes` exact freezing points of the model (equilibria::ice_curve: ice must
/// be the first solid at every node, and each node in the model's validated range), at
/// the Chebyshev points of [0, sqrt(max_salinity)]; the coefficients come by the discrete
/// cosine sums. Built, it is compared with the model at the `nodes` - 1 points halfway
/// (in angle) between the nodes and at both ends: the largest difference is kept
/// (largest_difference) and construction throws if it exceeds `tolerance`. With the
/// default Pitzer set it is about 1e-11 K, the rounding level of the exact solve itself
/// (tests/cpp/equilibria/test_seawater_freezing_line.cpp compares 2000 salinities).
///
/// A point then costs one square root and a Clenshaw recurrence (no ion sums, no root
/// finder); batch/seawater_freezing_points.hpp runs it over arrays. The line is one
/// object per model: build it once and share it (it is immutable, so threads may read it
/// together); default_seawater_freezing_line() keeps the one of the default Pitzer set.

#include <array>
#include <cmath>
#include <limits>
#include <string>

#include "colligate/core/constants.hpp"
#include "colligate/core/errors.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/equilibria/ice_curve.hpp"
#include "colligate/models/builtin_models.hpp"

namespace colligate::equilibria {

/// Salinities seawater::seawater accepts: [0, seawater_salinity_limit) g/kg.
inline constexpr double seawater_salinity_limit = 120.0;

/// The first-solid temperature of solution::seawater(SA) under `m`, K, by the exact path
/// (ice_curve: the ice freezing point unless a salt forms first, then that salt's
/// crystallisation temperature), with the curve's salt test in `first` when not null.
inline checked_value seawater_first_solid_temperature(double absolute_salinity,
                                                      const models::model_choice& m,
                                                      salt_first_solid* first = nullptr) {
  ice_curve curve(solution::seawater(absolute_salinity), m);
  return first_solid_temperature_checked(curve, range_policy::extrapolate, first);
}

class seawater_freezing_line {
 public:
  /// Highest salinity on the line, g/kg (twice the open ocean's, below every salt's
  /// saturation at the freezing point: gypsum, the nearest, has a saturation index of
  /// about -0.9 at 40 g/kg). Above it the batch falls back to the exact path.
  static constexpr double max_salinity = 50.0;
  /// Chebyshev nodes (and terms) of the series.
  static constexpr int nodes = 40;
  /// Largest difference from the model allowed at the check points, K.
  static constexpr double tolerance = 1e-10;

  /// The line of model `m` (default: Pitzer with its default parameter set). Throws
  /// invalid_input if a salt forms before ice, or the model leaves its validated range,
  /// anywhere on [0, max_salinity]; logic_error if the series misses the model by more
  /// than `tolerance` at a check point.
  explicit seawater_freezing_line(const models::model_choice& m = "pitzer") : model_(m) {
    const double pi = 3.14159265358979323846;
    std::array<double, nodes> y{};
    for (int k = 0; k < nodes; ++k) y[k] = exact(angle_point(pi * (k + 0.5) / nodes));
    for (int j = 0; j < nodes; ++j) {
      double sum = 0.0;
      for (int k = 0; k < nodes; ++k) sum += y[k] * std::cos(pi * j * (k + 0.5) / nodes);
      c_[j] = (j == 0 ? 1.0 : 2.0) * sum / nodes;
    }
    // Check points: halfway in angle between nodes, and both ends.
    for (int k = 0; k <= nodes; ++k) {
      const double SA = angle_point(pi * k / nodes);
      const double d = std::abs((*this)(SA) - exact(SA));
      if (!(d <= largest_difference_)) {
        largest_difference_ = d;
        worst_salinity_ = SA;
      }
    }
    if (!(largest_difference_ <= tolerance))
      throw std::logic_error(
          "seawater_freezing_line: the series misses model '" + m.id() + "' by " +
          validity::fmt(largest_difference_) + " K at SA = " + validity::fmt(worst_salinity_) +
          " g/kg (allowed " + validity::fmt(tolerance) + " K); use the exact path");
  }

  /// The freezing point of solution::seawater(absolute_salinity), K, for a salinity in
  /// [0, max_salinity] g/kg; NaN outside (and for NaN).
  double operator()(double absolute_salinity) const noexcept {
    if (!(absolute_salinity >= 0.0 && absolute_salinity <= max_salinity))
      return std::numeric_limits<double>::quiet_NaN();
    if (absolute_salinity == 0.0) return constants::ice_point;  // pure water, as the exact path
    return series(2.0 * std::sqrt(absolute_salinity) / std::sqrt(max_salinity) - 1.0);
  }

  /// The line's variable u in [-1, 1] of a salinity on it (what operator() evaluates).
  static double variable(double absolute_salinity) noexcept {
    return 2.0 * std::sqrt(absolute_salinity) / std::sqrt(max_salinity) - 1.0;
  }
  /// The series at u (Clenshaw): operator() for the salinity with variable(SA) = u.
  double series(double u) const noexcept {
    const double u2 = 2.0 * u;
    double b1 = 0.0, b2 = 0.0;
    for (int j = nodes - 1; j >= 1; --j) {
      const double b0 = c_[j] + u2 * b1 - b2;
      b2 = b1;
      b1 = b0;
    }
    return c_[0] + u * b1 - b2;
  }

  /// The largest difference from the model found at the check points, K, and where.
  double largest_difference() const noexcept { return largest_difference_; }
  double worst_salinity() const noexcept { return worst_salinity_; }
  const models::model_choice& model() const noexcept { return model_; }
  const std::array<double, nodes>& coefficients() const noexcept { return c_; }

 private:
  /// The salinity at angle theta: s = sqrt(max) (1 + cos theta) / 2, SA = s^2.
  static double angle_point(double theta) {
    const double s = 0.5 * std::sqrt(max_salinity) * (1.0 + std::cos(theta));
    return s * s;
  }
  /// The model's freezing point at SA; ice must come first and the model be in range.
  double exact(double SA) const {
    salt_first_solid first;
    const checked_value v = seawater_first_solid_temperature(SA, model_, &first);
    if (first.phase != nullptr)
      throw invalid_input("seawater_freezing_line: under model '" + model_.id() + "' " +
                          first.phase->name + " forms before ice at SA = " + validity::fmt(SA) +
                          " g/kg, inside the line's range [0, " + validity::fmt(max_salinity) +
                          "] g/kg; use the exact path");
    if (!v.check.in_range())
      throw invalid_input("seawater_freezing_line: model '" + model_.id() +
                          "' leaves its validated range at SA = " + validity::fmt(SA) +
                          " g/kg: " + v.check.reason() + "; use the exact path");
    return v.value;
  }

  models::model_choice model_;
  std::array<double, nodes> c_{};
  double largest_difference_ = 0.0;
  double worst_salinity_ = 0.0;
};

/// The line of the default model for seawater (Pitzer, default parameter set), built on
/// first use (a few milliseconds) and then shared read-only (thread-safe initialisation).
inline const seawater_freezing_line& default_seawater_freezing_line() {
  static const seawater_freezing_line line("pitzer");
  return line;
}

}  // namespace colligate::equilibria
