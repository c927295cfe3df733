// Glass transition of an aqueous phase and the maximally freeze-concentrated state.
#include <catch2/catch.hpp>

#include "colligate/data/builtin_solutes.hpp"
#include "colligate/data/citation.hpp"
#include "colligate/equilibria/state_diagram.hpp"

using namespace colligate;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;
using equilibria::glass_rule;

namespace {
constexpr double celsius(double t) { return t + 273.15; }
}  // namespace

TEST_CASE("Gordon-Taylor reduces to Roos's binary form and to its end points", "[glass]") {
  const auto* su = data::find_glass_transition("sucrose");
  REQUIRE(su != nullptr);
  // Identity: one solute at w_s = 0.6 equals (w_s Tg_s + k w_w Tg_w) / (w_s + k w_w)
  // (Roos 1993, eq. 2), written out here independently of the multi-component sum.
  const auto s = solution::from_mass_fractions({{"sucrose", 0.6}});
  const double k = su->gordon_taylor_k;
  const double expected = (0.6 * su->temperature + k * 0.4 * data::water_glass_transition_temperature) /
                          (0.6 + k * 0.4);
  CHECK_THAT(equilibria::glass_transition(s).temperature, WithinRel(expected, 1e-12));
  // Dry solids: the solute's own Tg; almost pure water: water's Tg.
  CHECK_THAT(equilibria::glass_curve_point(s, 1.0).temperature, WithinRel(su->temperature, 1e-12));
  CHECK_THAT(equilibria::glass_curve_point(s, 1e-9).temperature,
             WithinAbs(data::water_glass_transition_temperature, 1e-6));
}

TEST_CASE("Gordon-Taylor of two sugars lies between their binary glass curves", "[glass]") {
  const auto both = solution::from_mass_fractions({{"sucrose", 0.4}, {"glucose", 0.4}});
  const auto su = solution::from_mass_fractions({{"sucrose", 0.8}});
  const auto gl = solution::from_mass_fractions({{"glucose", 0.8}});
  const double tb = equilibria::glass_transition(both).temperature;
  CHECK(tb < equilibria::glass_transition(su).temperature);
  CHECK(tb > equilibria::glass_transition(gl).temperature);
}

TEST_CASE("Couchman-Karasz uses the heat-capacity steps", "[glass]") {
  const auto* la = data::find_glass_transition("lactose");
  const auto s = solution::from_mass_fractions({{"lactose", 0.9}});
  const double expected =
      (0.9 * la->heat_capacity_step * la->temperature +
       0.1 * data::water_glass_heat_capacity_step * data::water_glass_transition_temperature) /
      (0.9 * la->heat_capacity_step + 0.1 * data::water_glass_heat_capacity_step);
  CHECK_THAT(equilibria::glass_transition(s, glass_rule::couchman_karasz).temperature,
             WithinRel(expected, 1e-12));
}

TEST_CASE("Lactose Tg at a published water content", "[glass][published]") {
  // Roos (2002), Lait 82, abstract: amorphous lactose is at its glass transition "in the
  // vicinity of room temperature" at about 6.8 g water per 100 g lactose. Room temperature
  // read as 25 degC (common practice); tolerance 5 K as the issue asks, wider than the
  // source's own wording can resolve.
  const auto s = solution::from_masses(0.068, {{"lactose", 1.0}});
  CHECK_THAT(equilibria::glass_transition(s).temperature, WithinAbs(celsius(25.0), 5.0));
}

TEST_CASE("Sucrose Cg' from the ice and glass curves against DSC", "[glass][published]") {
  // Roos & Karel (1991), Int. J. Food Sci. Technol. 26, 553: Cg' = 80 wt% sucrose for the
  // maximally freeze-concentrated phase (from memory). Tolerance 0.03 as the issue asks.
  const auto s = solution::from_mass_fractions({{"sucrose", 0.20}});
  const auto r = equilibria::maximal_freeze_concentration_of(s);
  REQUIRE(r.success());
  CHECK_THAT(r.cg_prime, WithinAbs(0.80, 0.03));
  // Mass balance: Cg' and Wg' describe the same phase.
  CHECK_THAT(r.unfrozen_water_per_solids, WithinRel((1.0 - r.cg_prime) / r.cg_prime, 1e-12));
  // Tg' does not depend on the starting concentration (same binary curves).
  const auto r2 = equilibria::maximal_freeze_concentration_of(solution::from_mass_fractions({{"sucrose", 0.40}}));
  CHECK_THAT(r2.tg_prime, WithinAbs(r.tg_prime, 1e-3));
  // At Tg' the phase on the ice curve is at its own glass transition.
  CHECK_THAT(equilibria::glass_curve_point(s, r.cg_prime).temperature, WithinAbs(r.tg_prime, 1e-3));
  // The ice curve beyond sucrose's validated 0.70 is an extrapolation, and says so.
  CHECK_FALSE(r.check.in_range());
}

// Known miss, kept visible: the library gives Tg' = -42.4 degC for sucrose (Gordon-Taylor
// with Roos 1993 Tg and k on the Norrish ice curve, extrapolated above 70 wt%), 3.6 K above
// the -46 degC of Roos & Karel (1991) (from memory). Cause not yet found (the ice curve above
// 70 wt% and the source's onset-versus-intersection definition are the suspects); this
// check fails today and Catch2's [!shouldfail] turns it red the day it passes, so the
// tag must then be removed.
TEST_CASE("Sucrose Tg' against DSC within 3 K (known miss)", "[glass][published][!shouldfail]") {
  const auto r = equilibria::maximal_freeze_concentration_of(solution::from_mass_fractions({{"sucrose", 0.20}}));
  REQUIRE(r.success());
  CHECK_THAT(r.tg_prime, WithinAbs(celsius(-46.0), 3.0));
}

TEST_CASE("Tg' lies below the freezing point and above the ice data's limit", "[glass]") {
  const auto s = solution::from_mass_fractions({{"sucrose", 0.15}, {"lactose", 0.05}, {"glucose", 0.03}});
  const auto r = equilibria::maximal_freeze_concentration_of(s);
  REQUIRE(r.success());
  const double fp = equilibria::freezing_point(s).temperature;
  CHECK(r.tg_prime < fp);
  CHECK(r.tg_prime > water::ice_model_lowest_temperature);
  CHECK(r.ice_fraction > 0.5);
  CHECK(r.ice_fraction < 1.0);
  CHECK(r.margin(celsius(-18.0)) > 0.0);
}

TEST_CASE("Solutes without glass data are named", "[glass][errors]") {
  const auto brine = solution::from_mass_fractions({{"sodium_chloride", 0.05}});
  try {
    equilibria::glass_transition(brine);
    FAIL("expected invalid_input");
  } catch (const invalid_input& e) {
    CHECK_THAT(std::string(e.what()), Catch::Matchers::Contains("sodium_chloride"));
  }
  CHECK_THROWS_AS(equilibria::maximal_freeze_concentration_of(brine), invalid_input);
  const auto mix = solution::from_mass_fractions({{"sucrose", 0.2}, {"sodium_chloride", 0.01}});
  const auto g = equilibria::glass_transition(mix);
  REQUIRE(g.lacking.size() == 1);
  CHECK(g.lacking[0] == "sodium_chloride");
  CHECK_THROWS_AS(equilibria::glass_curve_point(mix, 1.5), invalid_input);
  CHECK_THROWS_AS(equilibria::glass_transition(mix, -1.0), invalid_input);
  CHECK_THROWS_AS(equilibria::glass_rule_from_string("fox"), invalid_input);
}

TEST_CASE("Every glass-transition source key resolves", "[glass][data]") {
  for (const auto& r : data::glass_transition_table()) {
    CHECK_NOTHROW(data::find_citation(r.source));
    if (r.heat_capacity_step > 0.0) CHECK_NOTHROW(data::find_citation(r.heat_capacity_source));
  }
}
