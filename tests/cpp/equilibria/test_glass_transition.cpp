// Glass transition of an aqueous phase and the maximally freeze-concentrated state.
#include <catch2/catch.hpp>

#include "colligate/data/builtin_solutes.hpp"
#include "colligate/data/citation.hpp"
#include "colligate/equilibria/state_diagram.hpp"

#include "../reference_csv.hpp"

using namespace colligate;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;
using equilibria::glass_rule;

namespace {
constexpr double celsius(double t) { return t + 273.15; }

// A value of tests/reference/sucrose_freeze_concentration.csv (published, source_key per row).
double sucrose_published(const std::string& quantity) {
  for (const auto& row : colligate_test::read_reference("sucrose_freeze_concentration.csv"))
    if (row.at("quantity") == quantity) return std::stod(row.at("value"));
  throw std::runtime_error("no row " + quantity + " in sucrose_freeze_concentration.csv");
}
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

// Published magnitudes of the maximally freeze-concentrated sucrose phase, read from copies
// (tests/reference/sucrose_freeze_concentration.csv, used_in_fit = no):
//  - Tg' "around -47 degC": DSC of frozen 40 % sucrose aged 1-6 days at -70 to -55 degC, the
//    glass transition of the freeze-concentrated phase (Cryobiology 2006, "Enthalpy relaxation
//    of freeze concentrated sucrose-water glass", abstract; source key
//    cryobiology_2006_sucrose_glass). Roos & Karel (1991) give -46 degC (from memory).
//  - Cg' "close to 80 % (w/w)": thermomechanical analysis of frozen sucrose solutions
//    (Le Meste & Huang 1992, J. Food Sci., abstract; source key le_meste_huang_1992).
// Tolerances 3 K and 0.03, as issue 14 asks; the sources print -47 degC and 80 % only.
//
// Cause of the former 4.6 K miss: the ice curve. 'auto' describes sucrose with one Norrish
// constant fitted near 0-25 degC and no temperature dependence; at 80 wt% and -40 degC that
// sets the liquidus 3.7 K warmer than the temperature-dependent sucrose activity of Starzak &
// Peacock (1997, excess enthalpy Q = -17638 J/mol: ln gamma_w grows as 1/T, so a_w at a given
// concentration falls on cooling). The glass curve (Gordon-Taylor, Roos 1993 Tg and k) is
// unchanged. On the temperature-dependent ice curve the intersection meets both published
// values; on the 25 degC one it does not (the known miss below).
TEST_CASE("Sucrose Tg' and Cg' on the temperature-dependent ice curve against measurements",
          "[glass][published]") {
  const auto s = solution::from_mass_fractions({{"sucrose", 0.20}});
  const auto r = equilibria::maximal_freeze_concentration_of(s, "starzak_peacock");
  REQUIRE(r.success());
  // -47 degC, cryobiology_2006_sucrose_glass (DSC); 0.80, le_meste_huang_1992 (TMA)
  CHECK_THAT(r.tg_prime, WithinAbs(celsius(sucrose_published("tg_prime")), 3.0));
  CHECK_THAT(r.cg_prime, WithinAbs(sucrose_published("cg_prime"), 0.03));
  // Below -40 degC the sucrose model's temperature dependence is extrapolated, and says so.
  CHECK_FALSE(r.check.in_range());
  // The cause, shown: at 80 wt% the 25 degC Norrish liquidus lies more than 3 K above the
  // temperature-dependent one, while at 20 wt% the two agree within 0.1 K (both meet the CRC
  // freezing points there).
  const double norrish80 = equilibria::liquidus_point(s, 0.80, "norrish").temperature;
  const double sp80 = equilibria::liquidus_point(s, 0.80, "starzak_peacock").temperature;
  CHECK(norrish80 - sp80 > 3.0);
  CHECK_THAT(equilibria::liquidus_point(s, 0.20, "norrish").temperature,
             WithinAbs(equilibria::liquidus_point(s, 0.20, "starzak_peacock").temperature, 0.1));
}

TEST_CASE("Glass curve end point: Tg of dry amorphous sucrose against DSC", "[glass][published]") {
  // DSC of freeze-dried sucrose: Tg 60 degC (Int. J. Food Prop. 2006, "Glass transition and
  // crystallization of amorphous trehalose-sucrose mixtures", abstract; source key
  // ijfp_2006_trehalose_sucrose). The table's 62 degC is Roos (1993, from memory). Tolerance
  // 3 K: published DSC values of dry sucrose differ by a few K with heating rate and the
  // onset/midpoint reading.
  const auto s = solution::from_mass_fractions({{"sucrose", 0.5}});
  CHECK_THAT(equilibria::glass_curve_point(s, 1.0).temperature,
             WithinAbs(celsius(sucrose_published("tg_dry")), 3.0));  // 60 degC
}

// Known miss of the default, kept visible: 'auto' (the 25 degC Norrish constant) puts Tg' at
// -42.4 degC, 4.6 K above the DSC value; the cause is the ice curve (see above). Catch2's
// [!shouldfail] turns this red the day it passes, so the tag must then be removed.
TEST_CASE("Sucrose Tg' on the default ice curve against DSC within 3 K (known miss)",
          "[glass][published][!shouldfail]") {
  const auto r = equilibria::maximal_freeze_concentration_of(solution::from_mass_fractions({{"sucrose", 0.20}}));
  REQUIRE(r.success());
  CHECK_THAT(r.tg_prime, WithinAbs(celsius(sucrose_published("tg_prime")), 3.0));  // -47 degC
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
