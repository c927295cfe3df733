// Tests of the built-in solute table and the citation table.
#include <catch2/catch.hpp>
#include <string>

#include "colligate/data/builtin_solutes.hpp"
#include "colligate/data/citation.hpp"
#include "../reference_csv.hpp"

using namespace colligate::data;
using Catch::Matchers::WithinRel;

TEST_CASE("every source key of the built-in table resolves", "[data][citations]") {
  for (const auto& r : builtin_solutes().records()) {
    INFO(r.id);
    CHECK_NOTHROW(find_citation(r.molar_mass_source));
    if (r.norrish.available) {
      CHECK_NOTHROW(find_citation(r.norrish.k_source));
      if (r.norrish.k3 != 0.0 || r.norrish.k4 != 0.0) CHECK_NOTHROW(find_citation(r.norrish.k3_source));
      CHECK(r.norrish.max_mass_fraction > 0.0);
      CHECK(!r.norrish.note.empty());
    }
  }
}

TEST_CASE("every source key of the reference tables resolves", "[data][citations]") {
  for (const char* table : {"crc_freezing_points.csv", "norrish_constants.csv",
                            "isopiestic_osmotic_coefficients_25c.csv"}) {
    for (const auto& row : colligate_test::read_reference(table)) {
      INFO(table << ": " << row.at("source_key"));
      CHECK_NOTHROW(find_citation(row.at("source_key")));
    }
  }
}

TEST_CASE("the core solutes are present", "[data]") {
  for (const char* id : {"sucrose", "glucose", "fructose", "lactose", "maltose", "glycerol",
                         "sorbitol", "xylitol", "erythritol", "propylene_glycol", "ethanol",
                         "citric_acid", "lactic_acid", "sodium_chloride", "potassium_chloride",
                         "calcium_chloride"}) {
    INFO(id);
    CHECK(builtin_solutes().try_find(id) != nullptr);
  }
}

TEST_CASE("names resolve case-insensitively by id, name, formula or alias", "[data]") {
  const auto& t = builtin_solutes();
  CHECK(t.find("NaCl").id == "sodium_chloride");
  CHECK(t.find("nacl").id == "sodium_chloride");
  CHECK(t.find("Sodium Chloride").id == "sodium_chloride");
  CHECK(t.find("Dextrose").id == "glucose");
  CHECK(t.find("propylene-glycol").id == "propylene_glycol");
  CHECK(t.find("CaCl2").particles == 3);
}

TEST_CASE("Norrish constants agree with the published table where we use them", "[data][norrish]") {
  // tests/reference/norrish_constants.csv copies Makinen (2010) Table 3 and recalled
  // Chirife et al. (1980) values; where the built-in record cites that source, K must match.
  for (const auto& row : colligate_test::read_reference("norrish_constants.csv")) {
    const auto* rec = builtin_solutes().try_find(row.at("solute"));
    REQUIRE(rec != nullptr);
    if (rec->norrish.k_source != row.at("source_key")) continue;
    const double k = std::abs(std::stod(row.at("norrish_k")));  // our sign: K > 0 for sugars
    INFO(rec->id);
    CHECK_THAT(rec->norrish.k, WithinRel(k, 1e-12));
  }
}
