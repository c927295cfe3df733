// The interpolated inverse of the ice line against the Newton inverse of ice.hpp. These are
// identities (the same function read two ways); the tolerances are the accuracy asked of the
// table (1e-10 K) and the rounding left after its Newton step (common practice).
#include <catch2/catch.hpp>
#include <cmath>

#include "colligate/core/constants.hpp"
#include "colligate/water/ice.hpp"
#include "colligate/water/ice_line_inverse.hpp"

using namespace colligate;

TEST_CASE("interpolated inverse of the ice line within 1e-10 K over its validated range",
          "[water][ice]") {
  const double y_min = water::ln_water_activity_of_ice(water::ice_model_min_temperature);
  double worst_table = 0.0, worst_polished = 0.0;
  constexpr int n = 20000;
  for (int i = 0; i <= n; ++i) {
    const double y = y_min * static_cast<double>(i) / n;
    const double exact = water::temperature_of_ice_equilibrium(y, 223.15);
    worst_table = std::max(worst_table, std::abs(water::detail::temperature_on_ice_line_interpolated(y) - exact));
    worst_polished = std::max(worst_polished, std::abs(water::temperature_on_ice_line(y) - exact));
  }
  INFO("worst interpolant error " << worst_table << " K, after the Newton step " << worst_polished << " K");
  CHECK(worst_table < 1e-10);    // the accuracy asked of the table (common practice)
  CHECK(worst_polished < 1e-12);  // rounding of ln a_w,ice near 273 K (common practice)
}

TEST_CASE("inverse of the ice line: the ice point, and NaN outside the validated range",
          "[water][ice]") {
  const double y_min = water::ln_water_activity_of_ice(water::ice_model_min_temperature);
  CHECK(water::temperature_on_ice_line(0.0) == constants::ice_point);
  CHECK(std::isnan(water::temperature_on_ice_line(1e-6)));
  CHECK(std::isnan(water::temperature_on_ice_line(y_min * (1.0 + 1e-9))));
  CHECK(std::isnan(water::temperature_on_ice_line(std::nan(""))));
  // Every temperature on the line reads back to itself.
  for (double T = 233.15; T <= 273.15; T += 0.37)
    CHECK_THAT(water::temperature_on_ice_line(water::ln_water_activity_of_ice(T)),
               Catch::Matchers::WithinAbs(T, 1e-11));  // rounding (common practice)
}
