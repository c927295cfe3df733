// Solubility of sugars and their supersaturation in the unfrozen phase.
#include <catch2/catch.hpp>

#include <string>

#include "../reference_csv.hpp"
#include "colligate/data/builtin_solutes.hpp"
#include "colligate/data/citation.hpp"
#include "colligate/equilibria/sugar_crystallisation.hpp"

using namespace colligate;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;

namespace {
constexpr double celsius(double t) { return t + 273.15; }
}  // namespace

// The held-out rows of tests/reference/sugar_solubility.csv are checked in
// tests/cpp/validation/test_published_checks.cpp, with the rows and tolerance of
// tests/reference/tolerances.toml (sugar_solubility_held_out).

TEST_CASE("Sucrose, lactose and glucose at 0, 20 and 50 degC", "[solubility][published]") {
  // Sucrose: Browne's Herzfeld table as tabulated by Lowe (table 5): 64.18, 67.09 and
  // 72.25 per cent at 0, 20 and 50 degC (rows held out of the fit). 1 %.
  CHECK_THAT(equilibria::sugar_solubility("sucrose", celsius(0.0)).mass_fraction, WithinRel(0.6418, 0.01));
  CHECK_THAT(equilibria::sugar_solubility("sucrose", celsius(20.0)).mass_fraction, WithinRel(0.6709, 0.01));
  CHECK_THAT(equilibria::sugar_solubility("sucrose", celsius(50.0)).mass_fraction, WithinRel(0.7225, 0.01));
  // Lactose: Hudson's table has no 20 and 50 degC rows; its held-out 0, 25 and 49 degC rows
  // are checked above (within 1 %).
  // Glucose: the monohydrate is stable below the transition, the anhydrous form above
  // (Jackson & Silsbee 1922, abstract: transition at 50 degC).
  CHECK(equilibria::sugar_solubility("glucose", celsius(30.0)).solid_phase == "alpha-glucose monohydrate");
  CHECK(equilibria::sugar_solubility("glucose", celsius(70.0)).solid_phase == "anhydrous alpha-glucose");
}

TEST_CASE("Lactose initial solubility and mutarotation", "[solubility][published]") {
  // Fox & McSweeney (1998), section 2.2.5: at 20 degC "about 7 g" alpha-lactose per 100 g
  // water dissolves at once and beta/alpha is about 1.6 at equilibrium. Printed to one
  // significant figure: +-0.5 g and +-0.05.
  CHECK_THAT(data::lactose_mutarotation_ratio(celsius(20.0)), WithinAbs(1.6, 0.05));
  CHECK_THAT(equilibria::lactose_initial_solubility(celsius(20.0)).kg_per_kg_water, WithinAbs(0.07, 0.005));
  // Identity: final = initial (1 + K).
  const double T = celsius(10.0);
  CHECK_THAT(equilibria::lactose_initial_solubility(T).kg_per_kg_water *
                 (1.0 + data::lactose_mutarotation_ratio(T)),
             WithinRel(equilibria::sugar_solubility("lactose", T).kg_per_kg_water, 1e-12));
}

TEST_CASE("Solubility outside the data is flagged; unknown sugars are named", "[solubility][errors]") {
  CHECK(equilibria::sugar_solubility("sucrose", celsius(20.0)).check.in_range());
  CHECK_FALSE(equilibria::sugar_solubility("sucrose", celsius(-18.0)).check.in_range());
  CHECK_THROWS_AS(equilibria::sugar_solubility("maltose", celsius(20.0)), invalid_input);
  CHECK_THROWS_AS(equilibria::sugar_solubility("sucrose", -1.0), invalid_input);
  for (const auto& rec : data::sugar_solubility_curves())
    for (const auto& b : rec.branches) CHECK_NOTHROW(data::find_citation(b.source));
}

TEST_CASE("Lactose in a frozen dairy mix becomes supersaturated as ice forms", "[solubility][crystallisation]") {
  // A milk-ice-cream-like serum (mass fractions of the mix; invented for the test).
  const auto s = solution::from_mass_fractions({{"sucrose", 0.14}, {"lactose", 0.065}, {"glucose", 0.03}});
  equilibria::crystallisation_check cc(s);
  REQUIRE(cc.sugars().size() == 3);
  REQUIRE(cc.glass().success());
  // At 20 degC nothing is supersaturated (all dissolved in the mix water).
  for (const auto& r : cc.at(celsius(20.0))) {
    INFO(r.solute_id);
    CHECK(r.ratio < 1.0);
    CHECK_FALSE(r.crystallisation_possible);
  }
  // At -18 degC about three quarters of the water is ice: lactose is several times its
  // (extrapolated) solubility, and the phase is above Tg'.
  const auto cold = cc.at(celsius(-18.0));
  CHECK(cold[1].solute_id == "lactose");
  CHECK(cold[1].ratio > 1.0);
  CHECK(cold[1].crystallisation_possible);
  CHECK_FALSE(cold[1].check.in_range());  // solubility extrapolated below 0 degC
  // Below Tg' nothing can crystallise.
  for (const auto& r : cc.at(cc.glass().tg_prime - 2.0)) CHECK_FALSE(r.crystallisation_possible);
  // The lactose range starts at Tg' and ends somewhat below the freezing point.
  const auto range = cc.crystallisation_range("lactose");
  REQUIRE(range.size() == 1);
  CHECK_THAT(range[0].low, WithinAbs(cc.glass().tg_prime, 0.02));
  CHECK(range[0].high < equilibria::freezing_point(s).temperature);
  CHECK(range[0].high > celsius(-18.0));
  // The edges are where the ratio crosses 1.
  const auto edge = cc.at(range[0].high + 0.02);
  CHECK(edge[1].ratio <= 1.0);
  CHECK_THROWS_AS(cc.crystallisation_range("fructose"), invalid_input);
}
