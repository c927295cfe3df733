#pragma once
/// \file sugar_solubility.hpp
/// Solubility of lactose in water against temperature, for the sandiness indicator of
/// dairy frozen desserts (lactose crystallising from the unfrozen phase). SI: K and kg of
/// anhydrous lactose per kg of water. Every row names its source key, which resolves in
/// citation.hpp.

#include <cmath>
#include <string>
#include <vector>

#include "colligate/core/constants.hpp"
#include "colligate/core/errors.hpp"

namespace colligate::data {

/// One point of a solubility curve.
struct solubility_point {
  double temperature;  ///< K
  double solubility;   ///< kg solute per kg water
  std::string source;  ///< citation key
  std::string note;    ///< the value as printed in the source
};

/// Final solubility of lactose in water: Hudson's values as tabulated in Lowe,
/// Experimental Cookery, table "Solubility of lactose in water (Hudson)" (read in a public
/// copy; Hudson's paper itself not read). Printed as g per 100 g water at 0, 15, 25 and
/// 39 degC.
inline const std::vector<solubility_point>& lactose_solubility_table() {
  static const std::vector<solubility_point> table = {
      {constants::ice_point + 0.0, 0.119, "lowe_experimental_cookery", "0 C: 11.9 g per 100 g water (Hudson)"},
      {constants::ice_point + 15.0, 0.169, "lowe_experimental_cookery", "15 C: 16.9 g per 100 g water (Hudson)"},
      {constants::ice_point + 25.0, 0.216, "lowe_experimental_cookery", "25 C: 21.6 g per 100 g water (Hudson)"},
      {constants::ice_point + 39.0, 0.315, "lowe_experimental_cookery", "39 C: 31.5 g per 100 g water (Hudson)"},
  };
  return table;
}

/// Solubility of lactose in water at `temperature` (K), kg per kg water: linear
/// interpolation in lactose_solubility_table(). Below its first point the first value is
/// returned (an upper bound: solubility falls with temperature), above its last point the
/// last value. Throws invalid_input for a temperature that is not finite and positive.
inline double lactose_solubility(double temperature) {
  if (!(std::isfinite(temperature) && temperature > 0.0))
    throw invalid_input("lactose_solubility: temperature = " + std::to_string(temperature) +
                        " K must be finite and > 0 K");
  const auto& pts = lactose_solubility_table();
  if (temperature <= pts.front().temperature) return pts.front().solubility;
  for (std::size_t i = 1; i < pts.size(); ++i) {
    if (temperature <= pts[i].temperature) {
      const auto& a = pts[i - 1];
      const auto& b = pts[i];
      return a.solubility + (b.solubility - a.solubility) * (temperature - a.temperature) /
                                (b.temperature - a.temperature);
    }
  }
  return pts.back().solubility;
}

}  // namespace colligate::data
