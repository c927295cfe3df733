#pragma once
/// \file validity.hpp
/// Validity ranges of models and the caller's run-time policy for leaving them.
///
/// Every model declares the temperatures and concentrations over which its constants
/// were validated, and the citation key that sets those limits. A result carries a
/// `validity` record: empty when in range, otherwise a readable reason. The caller
/// chooses what happens outside the range (range_policy); the C++ core never prints.

#include <cmath>
#include <limits>
#include <string>

#include "colligate/core/errors.hpp"

namespace colligate {

/// What to do when an input lies outside a model's validated range.
enum class range_policy {
  extrapolate,  ///< compute anyway and report the reason (default)
  nan,          ///< return NaN and report the reason
  raise         ///< throw out_of_validity_range
};

inline range_policy range_policy_from_string(const std::string& s) {
  if (s == "extrapolate") return range_policy::extrapolate;
  if (s == "nan") return range_policy::nan;
  if (s == "raise") return range_policy::raise;
  throw invalid_input("range_policy = '" + s +
                      "': valid values are 'extrapolate', 'nan' and 'raise'");
}

/// Outcome of a validity check: empty reason means in range.
struct validity {
  std::string reason;
  bool in_range() const noexcept { return reason.empty(); }
  /// Keeps the first reason found.
  void merge(const validity& other) {
    if (reason.empty()) reason = other.reason;
  }
};

/// A value together with its validity.
struct checked_value {
  double value = std::numeric_limits<double>::quiet_NaN();
  validity check;
};

/// Applies the policy: raise throws, nan replaces the value, extrapolate keeps it.
inline checked_value apply_policy(double value, validity v, range_policy policy) {
  if (!v.in_range()) {
    if (policy == range_policy::raise) throw out_of_validity_range(v.reason);
    if (policy == range_policy::nan) value = std::numeric_limits<double>::quiet_NaN();
  }
  return {value, std::move(v)};
}

}  // namespace colligate
