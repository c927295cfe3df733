// Alcohol by volume from the OIML R 22 (1975) density formula, and the Hyde & Rothwell
// (1973) milk solids-not-fat rule, against the sources they cite.
#include <catch2/catch.hpp>
#include <cmath>
#include <utility>
#include <vector>

#include "colligate/core/errors.hpp"
#include "colligate/data/citation.hpp"
#include "colligate/data/dairy_rules.hpp"
#include "colligate/data/ethanol_water_density.hpp"

using namespace colligate::data;
using Catch::Matchers::WithinAbs;

namespace {
/// OIML R 22 (1975), International Alcoholometric Tables: density at 20 C (kg/m3) against
/// alcoholic strength by volume at 20 C (%vol), as printed in a public copy of the tables
/// (densities to 0.01 kg/m3).
const std::vector<std::pair<double, double>> oiml_table = {
    {10.0, 984.71}, {20.0, 973.56}, {30.0, 962.21}, {40.0, 948.05}, {50.0, 930.14},
    {60.0, 909.11}, {70.0, 885.56}, {80.0, 859.27}, {90.0, 829.18}, {95.0, 811.38}};
}  // namespace

TEST_CASE("OIML R 22 density formula reproduces the printed table at 20 C", "[data][ethanol]") {
  CHECK_NOTHROW(find_citation("oiml_r22_1975"));
  CHECK_NOTHROW(find_citation("hyde_rothwell_1973"));
  // pure water (A_1) and pure ethanol, OIML R 22: 998.20 and 789.24 kg/m3; the formula's
  // sum at p = 1 is 789.2391, printed to 0.01: abs 0.005.
  CHECK_THAT(ethanol_water_density_20c(0.0), WithinAbs(998.20123, 1e-9));
  CHECK_THAT(ethanol_water_density_20c(1.0), WithinAbs(789.24, 0.005));
  for (const auto& [vol_percent, rho] : oiml_table) {
    INFO(vol_percent << " %vol");
    // the table's mass fraction for that strength: volume fraction x rho_ethanol / rho
    const double p = vol_percent / 100.0 * ethanol_density_20c / rho;
    // printed to 0.01 kg/m3: abs 0.006
    CHECK_THAT(ethanol_water_density_20c(p), WithinAbs(rho, 0.006));
    // and back to the strength: 0.01 kg/m3 in ~950 is 1e-5 relative; abs 1e-4 (0.01 %vol)
    CHECK_THAT(100.0 * alcohol_by_volume_20c(p, 1.0 - p), WithinAbs(vol_percent, 1e-2));
  }
}

TEST_CASE("alcohol by volume: scale-free, validated inputs", "[data][ethanol]") {
  // identity: only the ratio of ethanol to water matters
  // (the two mass fractions differ by rounding only: 2 epsilon)
  CHECK_THAT(alcohol_by_volume_20c(3.33, 6.67), WithinAbs(alcohol_by_volume_20c(0.333, 0.667), 1e-15));
  CHECK(alcohol_by_volume_20c(0.0, 1.0) == 0.0);
  CHECK_THAT(alcohol_by_volume_20c(1.0, 0.0), WithinAbs(1.0, 1e-5));
  CHECK_THROWS_WITH(alcohol_by_volume_20c(-1.0, 1.0), Catch::Contains("ethanol_kg"));
  CHECK_THROWS_WITH(alcohol_by_volume_20c(0.0, 0.0), Catch::Contains("ethanol_kg + water_kg"));
  CHECK_THROWS_AS(ethanol_water_density_20c(1.2), colligate::invalid_input);
}

TEST_CASE("Hyde & Rothwell (1973): MSNF at most a seventh of the serum", "[data][dairy]") {
  // The rule as quoted (hyde_rothwell_1973): (100 - fat - sugar - emulsifier - stabiliser) / 7.
  // A mix of 10 % fat, 15 % sugar, 0.5 % emulsifier + stabiliser (numbers of our own) has a
  // serum (water + MSNF) of 74.5 %: limit 74.5 / 7 = 10.643 %.
  CHECK_THAT(max_msnf_for_lactose_in_solution(0.745 - 0.10, 0.10), WithinAbs(0.745 / 7.0, 1e-15));
  CHECK_THROWS_WITH(max_msnf_for_lactose_in_solution(0.9, 0.2), Catch::Contains("msnf_fraction"));
}
