#pragma once
// Freezing points against the CRC Handbook rows in tests/reference/crc_freezing_points.csv
// (CRC Handbook of Chemistry and Physics, 102nd ed. 2021, concentrative properties table).
#include <catch2/catch.hpp>
#include <algorithm>
#include <cmath>
#include <string>

#include "colligate/core/constants.hpp"
#include "colligate/equilibria/freezing_point.hpp"
#include "reference_csv.hpp"

namespace colligate_test {

/// True for rows the copy notes flag as doubtful (values far below their
/// neighbours; see tests/reference/NOTES_reference_data.md).
inline bool doubtful_crc_row(const csv_row& row) {
  return row.at("note").find("below neighbours") != std::string::npos;
}

/// Largest |predicted - published| freezing-point depression (K) over the CRC rows of
/// `solute` up to `max_percent` wt%, model auto. With `require_in_range`, every row must
/// also be inside the model's validated range.
inline double worst_crc_deviation(const std::string& solute, double max_percent, int& rows,
                                  bool require_in_range = false) {
  double worst = 0.0;
  rows = 0;
  for (const auto& row : read_reference("crc_freezing_points.csv")) {
    if (row.at("solute") != solute || doubtful_crc_row(row)) continue;
    const double percent = std::stod(row.at("mass_percent"));
    if (percent > max_percent) continue;
    const auto s = colligate::solution::from_mass_fractions({{solute, percent / 100.0}});
    const auto r = colligate::equilibria::freezing_point(s);
    REQUIRE(r.success());
    if (require_in_range) {
      INFO(solute << " " << percent << " wt%: " << r.check.reason());
      CHECK(r.check.in_range());
    }
    worst = std::max(worst, std::abs(colligate::constants::ice_point - r.temperature -
                                     std::stod(row.at("depression_K"))));
    ++rows;
  }
  return worst;
}

}  // namespace colligate_test
