// Tests of the solution value type: factories, conversions, validation.
#include <catch2/catch.hpp>
#include <cmath>
#include <limits>

#include "colligate/core/solution.hpp"

using colligate::invalid_input;
using colligate::solution;
using Catch::Matchers::Contains;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;

TEST_CASE("mass fractions round-trip through moles", "[core][solution]") {
  const auto s = solution::from_mass_fractions({{"sucrose", 0.20}, {"NaCl", 0.01}}, 2.0);
  REQUIRE(s.size() == 2);
  // Rounding only: 4 epsilon relative.
  CHECK_THAT(s.total_mass(), WithinRel(2.0, 4e-16 * 4));
  CHECK_THAT(s.mass_fraction(0), WithinRel(0.20, 1e-15));
  CHECK_THAT(s.mass_fraction(1), WithinRel(0.01, 1e-15));
  CHECK_THAT(s.water_mass(), WithinRel(1.58, 1e-15));
  // Molar mass of sucrose 342.2965 g/mol (IUPAC 2013 atomic weights): 0.4 kg -> 1.16858 mol.
  CHECK_THAT(s.moles()[0], WithinRel(0.4 / 0.3422965, 1e-15));
  CHECK(s.species()[1].id == "sodium_chloride");
}

TEST_CASE("molalities, mole fractions and Brix", "[core][solution]") {
  const auto m = solution::from_molalities({{"glucose", 1.5}}, 0.5);
  CHECK_THAT(m.molality(0), WithinRel(1.5, 1e-15));
  CHECK_THAT(m.moles()[0], WithinRel(0.75, 1e-15));

  const auto x = solution::from_mole_fractions({{"sucrose", 0.05}});
  CHECK_THAT(x.mole_fraction(0), WithinRel(0.05, 1e-14));
  CHECK_THAT(x.water_mole_fraction(), WithinRel(0.95, 1e-14));

  const auto b = solution::from_brix(30.0);
  CHECK_THAT(b.brix(), WithinRel(30.0, 1e-14));
  CHECK_THAT(b.mass_fraction(0), WithinRel(0.30, 1e-14));
}

TEST_CASE("ionic strength assumes complete dissociation", "[core][solution]") {
  // common practice: I = m for 1:1 salts, 3 m for 2:1 salts
  const auto s = solution::from_molalities({{"NaCl", 0.5}, {"CaCl2", 0.1}});
  CHECK_THAT(s.ionic_strength(), WithinRel(0.5 + 0.3, 1e-15));
}

TEST_CASE("bad amounts are rejected with the field and the valid range", "[core][solution][errors]") {
  CHECK_THROWS_WITH(solution::from_masses(1.0, {{"sucrose", -0.1}}),
                    Contains("solutes['sucrose']") && Contains(">= 0"));
  CHECK_THROWS_WITH(
      solution::from_masses(1.0, {{"sucrose", std::numeric_limits<double>::quiet_NaN()}}),
      Contains("finite"));
  CHECK_THROWS_WITH(solution::from_masses(0.0, {{"sucrose", 0.1}}), Contains("water > 0"));
  CHECK_THROWS_WITH(solution::from_mass_fractions({{"sucrose", 0.7}, {"glucose", 0.4}}),
                    Contains("sum of solute mass fractions") && Contains("below 1"));
  CHECK_THROWS_WITH(solution::from_mass_fractions({{"sucrose", 20.0}}), Contains("[0, 1)"));
  CHECK_THROWS_AS(solution::from_brix(120.0), invalid_input);
}

TEST_CASE("unknown and duplicate solutes", "[core][solution][errors]") {
  CHECK_THROWS_WITH(solution::from_molalities({{"sucrse", 1.0}}),
                    Contains("unknown solute 'sucrse'") && Contains("'sucrose'"));
  CHECK_THROWS_WITH(solution::from_molalities({{"NaCl", 1.0}, {"sodium chloride", 1.0}}),
                    Contains("given twice"));
  CHECK_THROWS_WITH(solution::from_molalities({{"C6H12O6", 1.0}}), Contains("ambiguous"));
}

TEST_CASE("with_water keeps the solutes", "[core][solution]") {
  const auto s = solution::from_molalities({{"sucrose", 1.0}});
  const auto t = s.with_water(0.25);
  CHECK_THAT(t.moles()[0], WithinRel(1.0, 1e-15));
  CHECK_THAT(t.molality(0), WithinRel(4.0, 1e-15));
}

TEST_CASE("a duplicate names both spellings", "[core][solution][errors]") {
  CHECK_THROWS_WITH(solution::from_molalities({{"NaCl", 1.0}, {"salt", 1.0}}),
                    Contains("'NaCl'") && Contains("'salt'"));
}
