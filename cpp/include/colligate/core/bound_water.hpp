#pragma once
/// \file bound_water.hpp
/// Water that cannot freeze ("bound" water, held by protein, fibre or starch), given one
/// way everywhere in the API: as its share of all the water of the solution or food,
/// `bound_water_fraction_of_water`, kg of unfreezable water per kg of water, in [0, 1).
///
/// The share is the one basis that means the same for a bare solution, a recipe's water
/// phase, a food's proximate composition and each row of a batch, and it is the basis of
/// the ice fraction (ice per kg of all the water), which it caps: ice fraction
/// <= 1 - bound_water_fraction_of_water. Per kg of food (ASHRAE's x_b, e.g. 0.4 kg per kg
/// protein times the protein fraction; Schwartzberg 1976) converts as x_b / x_w, with x_w the
/// water fraction of the food.
///
/// Inside the equilibria the amount is kg on the scale of the solution (ice_curve,
/// freezing_point); bound_water_kg() is the one conversion, so scalar and batch paths
/// multiply the same two numbers and agree bit for bit.

#include <cmath>
#include <string>

#include "colligate/core/errors.hpp"
#include "colligate/core/solution.hpp"

namespace colligate {

namespace detail {
/// The error of check_bound_water_fraction_of_water, built out of line (the test stays
/// small enough to inline where a kernel repeats it per row).
[[noreturn]] inline void throw_bad_bound_water_fraction(const char* where, double fraction) {
  throw invalid_input(describe(
      where, "bound_water_fraction_of_water", fraction,
      "must be finite and in [0, 1) (kg of water that cannot freeze per kg of all the water)"));
}
}  // namespace detail

/// Throws invalid_input unless 0 <= fraction < 1 (finite); the message names the input,
/// its value and the valid range.
inline void check_bound_water_fraction_of_water(const char* where, double fraction) {
  if (!(std::isfinite(fraction) && fraction >= 0.0 && fraction < 1.0))
    detail::throw_bad_bound_water_fraction(where, fraction);
}

/// Unfreezable water of `s`, kg: `fraction_of_water` times the water of `s`.
inline double bound_water_kg(const solution& s, double fraction_of_water,
                             const char* where = "bound_water_kg") {
  check_bound_water_fraction_of_water(where, fraction_of_water);
  return fraction_of_water * s.water_mass();
}

}  // namespace colligate
