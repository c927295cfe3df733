// The temperature for a given ice fraction (equilibria/ice_fraction_temperature.hpp): the
// inverse of the ice curve, round trips, the dairy texts' worked freezing curve, and the
// errors for fractions the curve cannot reach.
#include <catch2/catch.hpp>
#include <cmath>

#include "colligate/core/constants.hpp"
#include "colligate/equilibria/ice_fraction.hpp"
#include "colligate/equilibria/ice_fraction_temperature.hpp"
#include "colligate/equilibria/leighton_method.hpp"

using namespace colligate;
namespace eq = colligate::equilibria;
using Catch::Matchers::Contains;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;

TEST_CASE("ice fraction -> temperature -> ice fraction round trip",
          "[equilibria][ice_fraction_temperature]") {
  // Identity: the solver inverts the ice curve; TOMS 748 to 52 bits in T, so the ice
  // fraction is recovered to 1e-9 (absolute) or better.
  struct case_t {
    solution s;
    const char* model;
    double bound;
  };
  const case_t cases[] = {
      {solution::from_mass_fractions({{"sucrose", 0.18}, {"glucose", 0.06}}), "auto", 0.0},
      {solution::from_mass_fractions({{"sucrose", 0.15}, {"lactose", 0.06}, {"milk_salts", 0.01}}),
       "auto", 0.02},
      {solution::from_mass_fractions({{"NaCl", 0.05}}), "auto", 0.0},
      {solution::from_mass_fractions({{"sucrose", 0.2}}), "ideal", 0.0},
  };
  for (const auto& c : cases) {
    eq::ice_curve curve(c.s, c.model, c.bound);
    double previous_T = curve.initial_freezing_point().temperature;
    for (double f : {0.05, 0.3, 0.5, 0.7, 0.75}) {
      INFO("model " << c.model << ", bound " << c.bound << ", fraction " << f);
      const auto r = eq::solve_temperature_for_ice_fraction(curve, f);
      REQUIRE(r.success());
      CHECK(r.temperature < previous_T);  // more ice, colder (monotone curve)
      previous_T = r.temperature;
      CHECK_THAT(eq::ice_fraction(c.s, r.temperature, c.model, range_policy::extrapolate, c.bound).value,
                 WithinAbs(f, 1e-9));
    }
  }
}

TEST_CASE("temperature -> ice fraction -> temperature round trip",
          "[equilibria][ice_fraction_temperature]") {
  // Identity, the other way round: rel 1e-9 in T.
  const auto s = solution::from_mass_fractions({{"sucrose", 0.22}, {"fructose", 0.04}});
  for (double t_c : {-3.0, -8.0, -12.0, -20.0}) {
    const double T = constants::ice_point + t_c;
    const double f = eq::ice_fraction(s, T).value;
    CHECK_THAT(eq::temperature_for_ice_fraction(s, f).value, WithinRel(T, 1e-9));
  }
}

TEST_CASE("a fraction of 0 is the initial freezing point", "[equilibria][ice_fraction_temperature]") {
  // Identity: at 0 ice the temperature is the freezing point itself.
  const auto s = solution::from_mass_fractions({{"sucrose", 0.25}});
  CHECK(eq::temperature_for_ice_fraction(s, 0.0).value == eq::freezing_point(s).temperature);
}

TEST_CASE("75 % frozen for Goff & Hartel's worked mix is near the dairy method's temperature",
          "[equilibria][ice_fraction_temperature][leighton]") {
  // Goff & Hartel (2013), Ice Cream, 7th ed., ch. 6, Example Problem 13 and Table 6.2: a mix
  // of 10 % MSNF, 2 % whey solids, 12 % sucrose, 4 % 42DE corn syrup solids, 60 % water
  // (12 % fat makes up the rest) has 75 % of its water frozen at a freezing-point
  // depression of 13.16 K (-13.16 C). Milk solids split as colligate's MSNF (lactose 0.545,
  // milk salts 0.099; Goff & Hartel 2013 after Van Slyke & Bosworth; Leighton 1927); whey
  // solids lactose 0.765 (Goff & Hartel 2013); 42DE solids DP1 19, DP2 14, DP3 12, DP4+ 55 %
  // (from memory). The dairy method counts no water as unable to freeze, so neither does
  // this comparison. Tolerance 1 K (the method's sucrose-equivalence factors and its
  // milk-salt term are approximations of the activity model).
  const auto s = solution::from_masses(
      0.60, {{"sucrose", 0.12},
             {"lactose", 0.545 * 0.10 + 0.765 * 0.02},
             {"milk_salts", 0.099 * 0.12},
             {"glucose", 0.19 * 0.04},
             {"maltose", 0.14 * 0.04},
             {"maltotriose", 0.12 * 0.04},
             {"higher_saccharides", 0.55 * 0.04}});
  const double T75 = eq::temperature_for_ice_fraction(s, 0.75).value;
  CHECK_THAT(T75 - constants::ice_point, WithinAbs(-13.16, 1.0));
  // The project's own implementation of the dairy method gives the same -13.16 C from the
  // method's inputs (identity with test_leighton_method.cpp; 0.015 K rounding of the book).
  eq::leighton::mix_terms mix;
  mix.sucrose_equivalent = 22.18;
  mix.milk_solids = 12.0;
  mix.water = 60.0;
  const double T75_dairy = constants::ice_point - eq::leighton::total_depression(mix, 0.75).value;
  CHECK_THAT(T75_dairy - constants::ice_point, WithinAbs(-13.16, 0.015));
  CHECK_THAT(T75, WithinAbs(T75_dairy, 1.0));
}

TEST_CASE("unreachable ice fractions are refused with the reachable range",
          "[equilibria][ice_fraction_temperature]") {
  SECTION("not a fraction") {
    const auto s = solution::from_mass_fractions({{"sucrose", 0.2}});
    CHECK_THROWS_WITH(eq::temperature_for_ice_fraction(s, 70.0), Contains("not a percentage"));
    CHECK_THROWS_AS(eq::temperature_for_ice_fraction(s, -0.1), invalid_input);
    CHECK_THROWS_AS(eq::temperature_for_ice_fraction(s, std::nan("")), invalid_input);
  }
  SECTION("past the final eutectic of a brine") {
    // NaCl 5 wt%: the curve ends at the ice + hydrohalite eutectic (Archer 1992: -21.2 C,
    // near 23.3 wt%), where the lever rule leaves 1 - 5.26/30.4 = 0.827 of the water frozen
    // (g NaCl per 100 g water before and at the eutectic); 0.95 cannot be reached.
    // Tolerance 0.02 (about 1 wt% in the eutectic composition).
    const auto s = solution::from_mass_fractions({{"NaCl", 0.05}});
    eq::ice_curve curve(s);
    CHECK_THAT(eq::reachable_ice_of(curve).largest_fraction, WithinAbs(0.827, 0.02));
    CHECK_THROWS_WITH(eq::temperature_for_ice_fraction(s, 0.95),
                      Contains("ice_fraction = 0.95") && Contains("not reachable") &&
                          Contains("final eutectic") && Contains("hydrohalite"));
  }
  SECTION("water unable to freeze") {
    const auto s = solution::from_masses(1.0, {{"sucrose", 0.05}});
    CHECK_THROWS_WITH(eq::temperature_for_ice_fraction(s, 0.95, "auto", range_policy::extrapolate, 0.1),
                      Contains("never exceed 0.9") && Contains("lowest temperature searched"));
  }
  SECTION("no ice at all") {
    // A solution the model does not freeze above the search limit (223.15 K) has no ice
    // curve to invert (identity with the freezing-point solver's status).
    const auto s = solution::from_mass_fractions({{"glycerol", 0.7}});
    REQUIRE_FALSE(eq::freezing_point(s).success());
    CHECK_THROWS_WITH(eq::temperature_for_ice_fraction(s, 0.1), Contains("forms no ice"));
  }
}
