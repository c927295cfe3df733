#pragma once
/// \file sweetness.hpp
/// Relative sweetness of sugars and starch-hydrolysate oligomers, sucrose = 1 on a mass
/// basis. Used for the sweetness indicator of a formulation (sucrose-equivalent mass);
/// it plays no part in any equilibrium. Every row names its source key, which resolves
/// in citation.hpp.

#include <string>
#include <vector>

#include "colligate/core/errors.hpp"

namespace colligate::data {

/// One solute's relative sweetness.
struct sweetness_record {
  std::string solute;        ///< colligate solute id
  double relative_sweetness; ///< sweetness of 1 kg relative to 1 kg of sucrose
  std::string source;        ///< citation key
  std::string note;          ///< where in the source, and any other value seen
};

/// The relative-sweetness table. Sucrose is 1 by definition of the scale. Glucose,
/// fructose, maltose and lactose: Bender, A Dictionary of Food and Nutrition, entry
/// "sweeteners" (fructose 173, glucose 74, maltose 33, lactose 16 on sucrose = 100; read
/// in a public copy); Gaman & Sherrington (1990), The Science of Food, give 170, 75, 30
/// and 15. Maltotriose 0.1 from memory; higher saccharides and maltodextrin about 0 by
/// common practice. Solutes not listed count as not sweet.
inline const std::vector<sweetness_record>& sweetness_table() {
  static const std::vector<sweetness_record> table = {
      {"sucrose", 1.0, "bender_dictionary",
       "reference of the scale (sucrose = 100 in the source)"},
      {"glucose", 0.74, "bender_dictionary",
       "entry \"sweeteners\": glucose 74; Gaman & Sherrington (1990) give 75"},
      {"fructose", 1.73, "bender_dictionary",
       "entry \"sweeteners\": fructose 173; Gaman & Sherrington (1990) give 170"},
      {"maltose", 0.33, "bender_dictionary",
       "entry \"sweeteners\": maltose 33; Gaman & Sherrington (1990) give 30"},
      {"lactose", 0.16, "bender_dictionary",
       "entry \"sweeteners\": lactose 16; Gaman & Sherrington (1990) give 15"},
      {"maltotriose", 0.1, "colligate_sweetness_oligomers", "from memory"},
      {"higher_saccharides", 0.0, "colligate_sweetness_oligomers", "about 0, common practice"},
      {"maltodextrin", 0.0, "colligate_sweetness_oligomers", "about 0, common practice"},
  };
  return table;
}

/// Relative sweetness of `solute` (a colligate solute id); 0 for a solute not in the table.
inline double relative_sweetness(const std::string& solute) {
  for (const auto& r : sweetness_table())
    if (r.solute == solute) return r.relative_sweetness;
  return 0.0;
}

}  // namespace colligate::data
