// Freezing points against the CRC Handbook table and the dilute colligative limit.
#include <catch2/catch.hpp>
#include <cmath>
#include <map>
#include <string>

#include "colligate/core/constants.hpp"
#include "colligate/equilibria/freezing_point.hpp"
#include "../crc_reference.hpp"

using namespace colligate;
using Catch::Matchers::Contains;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;

namespace {

using colligate_test::worst_crc_deviation;

}  // namespace

TEST_CASE("sugars vs CRC Handbook freezing-point depressions within 0.2 K", "[equilibria][crc]") {
  // CRC Handbook of Chemistry and Physics, 102nd ed. (2021), "Concentrative properties of
  // aqueous solutions" (tests/reference/crc_freezing_points.csv). Tolerance 0.2 K.
  const std::map<std::string, double> max_percent = {
      {"sucrose", 42}, {"glucose", 30}, {"fructose", 28}, {"maltose", 44}};
  for (const auto& [solute, top] : max_percent) {
    int rows = 0;
    const double worst = worst_crc_deviation(solute, top, rows);
    INFO(solute << ": " << rows << " rows to " << top << " wt%, worst deviation " << worst << " K");
    CHECK(rows >= 20);
    CHECK(worst < 0.2);
  }
}

TEST_CASE("glycerol and ethanol vs CRC Handbook to 40 wt% within 0.5 K", "[equilibria][crc]") {
  // Same CRC table; tolerance 0.5 K.
  for (const char* solute : {"glycerol", "ethanol"}) {
    int rows = 0;
    const double worst = worst_crc_deviation(solute, 40, rows);
    INFO(solute << ": " << rows << " rows, worst deviation " << worst << " K");
    CHECK(rows >= 15);
    CHECK(worst < 0.5);
  }
}

TEST_CASE("other non-electrolytes vs CRC Handbook within 0.2 K", "[equilibria][crc]") {
  // Lactose (to 8 wt%), mannitol (to 15 wt%), citric acid (to 30 wt%), lactic acid (to 20 wt%),
  // acetic acid (to 36 wt%).
  for (const char* solute : {"lactose", "mannitol", "citric_acid", "lactic_acid", "acetic_acid"}) {
    int rows = 0;
    const double worst = worst_crc_deviation(solute, 100, rows);
    INFO(solute << ": " << rows << " rows, worst deviation " << worst << " K");
    CHECK(rows >= 10);
    CHECK(worst < 0.2);
  }
}

TEST_CASE("dilute salts vs CRC Handbook with the ideal-ion models", "[equilibria][crc]") {
  // Until the electrolyte model lands, salts count as dissociated ideal particles; in their
  // declared range (ionic strength <= 0.3 mol/kg) that stays within 0.1 K of the CRC table.
  for (const char* solute : {"sodium_chloride", "potassium_chloride", "calcium_chloride"}) {
    for (const auto& row : colligate_test::read_reference("crc_freezing_points.csv")) {
      if (row.at("solute") != solute || !solution::from_mass_fractions({{solute, std::stod(row.at("mass_percent")) / 100}}).ionic_strength() || solution::from_mass_fractions({{solute, std::stod(row.at("mass_percent")) / 100}}).ionic_strength() > 0.3) continue;
      const auto s = solution::from_mass_fractions({{solute, std::stod(row.at("mass_percent")) / 100}});
      const auto r = equilibria::freezing_point(s);
      INFO(solute << " " << row.at("mass_percent") << " wt%");
      CHECK(r.check.in_range());
      CHECK_THAT(constants::ice_point - r.temperature, WithinAbs(std::stod(row.at("depression_K")), 0.1));
    }
  }
}

TEST_CASE("ideal model gives Kf = 1.86 K kg/mol in the dilute limit", "[equilibria][ideal]") {
  // Kf of water 1.86 K kg/mol (common practice).
  for (double m : {1e-3, 1e-2}) {
    const auto s = solution::from_molalities({{"glucose", m}});
    const auto r = equilibria::freezing_point(s, "ideal");
    CHECK_THAT((constants::ice_point - r.temperature) / m, WithinRel(1.86, 5e-3));
  }
  // Raoult and Norrish agree with it as m -> 0 (limit law; rel 1e-3 at 1e-3 mol/kg).
  const auto s = solution::from_molalities({{"sucrose", 1e-3}});
  const double ideal = constants::ice_point - equilibria::freezing_point(s, "ideal").temperature;
  for (auto m : {"raoult", "norrish"}) {
    CHECK_THAT(constants::ice_point - equilibria::freezing_point(s, m).temperature, WithinRel(ideal, 1e-3));
  }
}

TEST_CASE("freezing point edge cases", "[equilibria]") {
  const auto water = solution::from_molalities({});
  CHECK(equilibria::freezing_point(water).temperature == constants::ice_point);
  // 60 wt% ethanol does not freeze above -50 C? It freezes near -45 C (CRC: 44.93 K at 60 wt%),
  // below the 233.15 K where the ice equilibrium is validated: flagged, not silent.
  const auto strong = solution::from_mass_fractions({{"ethanol", 0.6}});
  const auto r = equilibria::freezing_point(strong);
  CHECK_FALSE(r.check.in_range());
  // Bound water concentrates the solvent and lowers the freezing point.
  const auto s = solution::from_mass_fractions({{"sucrose", 0.2}});
  CHECK(equilibria::freezing_point(s, "auto", 0.1).temperature <
        equilibria::freezing_point(s).temperature);
  CHECK_THROWS_WITH(equilibria::freezing_point(s, "auto", 2.0), Contains("bound_water"));
}
