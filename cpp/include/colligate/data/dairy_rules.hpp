#pragma once
/// \file dairy_rules.hpp
/// Rules of the dairy trade used as formulation indicators, each with its source key.
///
/// Sandiness (lactose crystallising in storage): Hyde & Rothwell (1973) give the largest
/// milk solids-not-fat that keeps the lactose of an ice-cream mix in solution,
///
///     MSNF_max = (100 - fat - sugars - emulsifier - stabiliser) / 7      (% of the mix),
///
/// i.e. one seventh of the serum (the water plus the MSNF); MSNF holds about six times its
/// mass of water (source key hyde_rothwell_1973). Here every solid that is neither milk
/// solids-not-fat nor water counts with the sugars, so the serum is water + MSNF.

#include <cmath>

#include "colligate/core/errors.hpp"

namespace colligate::data {

/// Divisor of the Hyde & Rothwell (1973) rule.
inline constexpr double hyde_rothwell_serum_divisor = 7.0;

/// Largest milk solids-not-fat (kg per kg of mix) that keeps lactose in solution by the
/// Hyde & Rothwell (1973) rule, from the mix's water and MSNF (kg per kg of mix).
inline double max_msnf_for_lactose_in_solution(double water_fraction, double msnf_fraction) {
  const char* where = "max_msnf_for_lactose_in_solution";
  if (!(std::isfinite(water_fraction) && water_fraction >= 0.0 && water_fraction <= 1.0))
    throw invalid_input(colligate::detail::describe(where, "water_fraction", water_fraction, "must be in [0, 1]"));
  if (!(std::isfinite(msnf_fraction) && msnf_fraction >= 0.0 && msnf_fraction <= 1.0 - water_fraction))
    throw invalid_input(colligate::detail::describe(where, "msnf_fraction", msnf_fraction,
                                         "must be in [0, 1 - water_fraction]"));
  return (water_fraction + msnf_fraction) / hyde_rothwell_serum_divisor;
}

}  // namespace colligate::data
