// Tests of the food data tables: relative sweetness and lactose solubility, against the
// sources their rows cite.
#include <catch2/catch.hpp>
#include <cmath>
#include <string>

#include "colligate/core/errors.hpp"
#include "colligate/data/citation.hpp"
#include "colligate/data/sugar_solubility.hpp"
#include "colligate/data/sweetness.hpp"

using namespace colligate::data;
using Catch::Matchers::WithinAbs;

TEST_CASE("every source key of the food tables resolves", "[data][citations]") {
  for (const auto& r : sweetness_table()) {
    INFO(r.solute);
    CHECK_NOTHROW(find_citation(r.source));
    CHECK(!r.note.empty());
  }
  for (const auto& p : lactose_solubility_table()) {
    INFO(p.temperature);
    CHECK_NOTHROW(find_citation(p.source));
  }
  CHECK_NOTHROW(find_citation("gaman_sherrington_1990"));
}

TEST_CASE("relative sweetness matches its sources", "[data][sweetness]") {
  // Bender, A Dictionary of Food and Nutrition, entry "sweeteners", sucrose = 100
  CHECK(relative_sweetness("sucrose") == 1.0);  // the reference of the scale
  CHECK_THAT(relative_sweetness("fructose"), WithinAbs(173.0 / 100.0, 1e-12));
  CHECK_THAT(relative_sweetness("glucose"), WithinAbs(74.0 / 100.0, 1e-12));
  CHECK_THAT(relative_sweetness("maltose"), WithinAbs(33.0 / 100.0, 1e-12));
  CHECK_THAT(relative_sweetness("lactose"), WithinAbs(16.0 / 100.0, 1e-12));
  // second source: Gaman & Sherrington (1990), The Science of Food: 170, 75, 30, 15;
  // the two agree within 0.05
  CHECK_THAT(relative_sweetness("fructose"), WithinAbs(1.70, 0.05));
  CHECK_THAT(relative_sweetness("glucose"), WithinAbs(0.75, 0.05));
  CHECK_THAT(relative_sweetness("maltose"), WithinAbs(0.30, 0.05));
  CHECK_THAT(relative_sweetness("lactose"), WithinAbs(0.15, 0.05));
  CHECK_THAT(relative_sweetness("maltotriose"), WithinAbs(0.1, 1e-12));  // from memory
  CHECK(relative_sweetness("maltodextrin") == 0.0);                      // common practice
  CHECK(relative_sweetness("sodium_chloride") == 0.0);  // not in the table: not sweet
}

TEST_CASE("lactose solubility matches Hudson's values in Lowe's table", "[data][solubility]") {
  // Lowe, Experimental Cookery, "Solubility of lactose in water (Hudson)", g per 100 g water
  const double zero_c = 273.15;  // scale definition (common practice)
  CHECK_THAT(lactose_solubility(zero_c + 0.0), WithinAbs(11.9 / 100.0, 1e-12));
  CHECK_THAT(lactose_solubility(zero_c + 15.0), WithinAbs(16.9 / 100.0, 1e-12));
  CHECK_THAT(lactose_solubility(zero_c + 25.0), WithinAbs(21.6 / 100.0, 1e-12));
  CHECK_THAT(lactose_solubility(zero_c + 39.0), WithinAbs(31.5 / 100.0, 1e-12));
  // between points: linear, e.g. 20 C halfway from 16.9 to 21.6
  CHECK_THAT(lactose_solubility(zero_c + 20.0), WithinAbs((16.9 + 21.6) / 2.0 / 100.0, 1e-12));
  // below 0 C the 0 C value (an upper bound), above 39 C the 39 C value
  CHECK_THAT(lactose_solubility(zero_c - 18.0), WithinAbs(0.119, 1e-12));
  CHECK_THAT(lactose_solubility(zero_c + 60.0), WithinAbs(0.315, 1e-12));
  // rises with temperature over the table
  double previous = 0.0;
  for (double t = zero_c - 5.0; t <= zero_c + 45.0; t += 0.5) {
    CHECK(lactose_solubility(t) >= previous);
    previous = lactose_solubility(t);
  }
  CHECK_THROWS_AS(lactose_solubility(-1.0), colligate::invalid_input);
  CHECK_THROWS_AS(lactose_solubility(std::nan("")), colligate::invalid_input);
}
