#pragma once
/// \file water_activity_limits.hpp
/// Published minimum water activities for the growth of groups of microorganisms, to show
/// a product's a_w against. These are growth limits under otherwise optimal conditions
/// (temperature, pH, nutrients): a_w alone does not make a food safe, toxin formation can
/// have other limits, and local codes and validated process controls decide.

#include <string>
#include <vector>

namespace colligate::data {

struct water_activity_limit {
  std::string organisms;      ///< group or species
  double minimum_water_activity;
  std::string source;         ///< citation key
  std::string note;
};

/// Minimum a_w for growth (Beuchat 1981, table 1; values from memory, not re-read).
inline const std::vector<water_activity_limit>& water_activity_growth_limits() {
  static const std::vector<water_activity_limit> table = {
      {"Clostridium botulinum type A", 0.94, "beuchat_1981", "from memory"},
      {"most spoilage bacteria", 0.91, "beuchat_1981", "from memory"},
      {"most spoilage yeasts", 0.88, "beuchat_1981", "from memory"},
      {"Staphylococcus aureus (aerobic growth)", 0.86, "beuchat_1981", "from memory"},
      {"most spoilage moulds", 0.80, "beuchat_1981", "from memory"},
      {"halophilic bacteria", 0.75, "beuchat_1981", "from memory"},
      {"xerophilic moulds", 0.61, "beuchat_1981", "from memory"},
      {"osmophilic yeasts", 0.61, "beuchat_1981", "from memory"},
  };
  return table;
}

}  // namespace colligate::data
