// Ice-fraction curve: mass balance, monotonicity, limits.
#include <catch2/catch.hpp>
#include <cmath>

#include "colligate/core/constants.hpp"
#include "colligate/equilibria/freezing_point.hpp"
#include "colligate/equilibria/ice_fraction.hpp"

using namespace colligate;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;

TEST_CASE("ice + unfrozen + bound water = total water", "[equilibria][ice_fraction]") {
  const auto s = solution::from_mass_fractions({{"sucrose", 0.18}, {"glucose", 0.06}, {"citric_acid", 0.005}});
  for (double bound : {0.0, 0.02}) {
    for (double t_c = -1.0; t_c >= -40.0; t_c -= 3.0) {
      const auto u = equilibria::unfrozen_phase_at(s, constants::ice_point + t_c, "auto", bound);
      REQUIRE(u.success());
      // mass balance: identity to 1e-12 relative (rounding only)
      CHECK_THAT(u.ice + u.unfrozen_water + u.bound_water, WithinRel(s.water_mass(), 1e-12));
      CHECK(u.ice >= 0.0);
    }
  }
}

TEST_CASE("ice fraction is 0 above the freezing point and rises as T falls", "[equilibria][ice_fraction]") {
  const auto s = solution::from_mass_fractions({{"sucrose", 0.25}});
  const double tf = equilibria::freezing_point(s).temperature;
  CHECK(equilibria::ice_fraction(s, tf + 0.01).value == 0.0);
  CHECK(equilibria::ice_fraction(s, 290.0).value == 0.0);
  double previous = 0.0;
  for (double T = tf - 0.05; T > 233.0; T -= 0.5) {
    const double f = equilibria::ice_fraction(s, T).value;
    CHECK(f > previous);
    CHECK(f < 1.0);
    previous = f;
  }
}

TEST_CASE("the unfrozen phase is at the ice water activity", "[equilibria][ice_fraction]") {
  const auto s = solution::from_mass_fractions({{"sucrose", 0.2}});
  const double T = 263.15;
  const auto u = equilibria::unfrozen_phase_at(s, T);
  const auto liquid = s.with_water(u.unfrozen_water);
  // The unfrozen liquid freezes exactly at T (the equilibrium condition; rel 1e-9 in T).
  CHECK_THAT(equilibria::freezing_point(liquid).temperature, WithinRel(T, 1e-9));
  CHECK_THAT(u.water_activity, WithinRel(water::water_activity_of_ice(T), 1e-14));
}

TEST_CASE("ideal model ice fraction follows the lever rule near the freezing point",
          "[equilibria][ice_fraction][ideal]") {
  // With ln a_w = -M_w m: at ice equilibrium m_u = m0 W/W_u, so ice fraction
  // = 1 - ln a_w(solution) / ln a_w,ice(T) exactly (identity; rel 1e-10).
  const auto s = solution::from_molalities({{"glucose", 0.5}});
  const double T = 268.15;
  const double lnaw = models::ln_water_activity("ideal", s, s.water_mass(), T);
  const double expected = 1.0 - lnaw / water::ln_water_activity_of_ice(T);
  CHECK_THAT(equilibria::ice_fraction(s, T, "ideal").value, WithinRel(expected, 1e-10));
}

TEST_CASE("pure water below the ice point is all ice", "[equilibria][ice_fraction]") {
  const auto water = solution::from_molalities({});
  CHECK(equilibria::ice_fraction(water, 263.15).value == 1.0);
  CHECK(equilibria::ice_fraction(water, 273.15).value == 0.0);
}
