#pragma once
/// \file glass_transition_data.hpp
/// Glass transition of water and of anhydrous solutes, for the glass curve of an unfrozen
/// phase (equilibria/glass_transition.hpp). SI inside: K, and J/(kg K) for the step in
/// heat capacity at the glass transition. Every row names its source key (citation.hpp).
///
/// k is the Gordon-Taylor constant of the solute with water in Roos's form
///     Tg = (w_s Tg_s + k w_w Tg_w) / (w_s + k w_w)                   (Roos 1993, eq. 2)
/// (w mass fractions, s the anhydrous solute, w water), fitted by the source to DSC onsets
/// of the solute at several water contents.

#include <string>
#include <vector>

namespace colligate::data {

/// Glass transition temperature of amorphous water, K (-135 degC; Johari, Hallbrucker &
/// Mayer 1987, the value the food-science glass curves use).
inline constexpr double water_glass_transition_temperature = 138.15;
/// Step in specific heat of amorphous water at its glass transition, J/(kg K): 1.94 J/(g K)
/// (Sugisaki, Suga & Seki 1968; value from memory), for the Couchman-Karasz rule.
inline constexpr double water_glass_heat_capacity_step = 1940.0;

/// Glass-transition constants of one anhydrous solute.
struct glass_transition_record {
  std::string solute_id;          ///< id in the solute table
  double temperature;             ///< Tg of the anhydrous solute (DSC onset), K
  double gordon_taylor_k;         ///< Gordon-Taylor k with water (dimensionless)
  double heat_capacity_step;      ///< Delta Cp at Tg, J/(kg K); 0 when not known
  std::string source;             ///< citation key of Tg and k
  std::string heat_capacity_source;  ///< citation key of Delta Cp ("" when 0)
  std::string note;               ///< the values as printed, and how they were read
};

/// The built-in glass-transition table.
inline const std::vector<glass_transition_record>& glass_transition_table() {
  static const std::vector<glass_transition_record> table = {
      {"sucrose", 273.15 + 62.0, 4.7, 600.0, "roos_1993", "roos_1993",
       "Tg 62 degC, k 4.7, Delta Cp 0.60 J/(g K) (Roos 1993, table 1; values from memory)"},
      {"glucose", 273.15 + 31.0, 4.5, 880.0, "roos_1993", "roos_1993",
       "Tg 31 degC, k 4.5, Delta Cp 0.88 J/(g K) (Roos 1993, table 1; values from memory)"},
      {"fructose", 273.15 + 5.0, 3.0, 750.0, "roos_1993", "roos_1993",
       "Tg 5 degC, k 3.0, Delta Cp 0.75 J/(g K) (Roos 1993, table 1; values from memory)"},
      {"lactose", 273.15 + 101.0, 6.7, 470.0, "roos_1993", "roos_1993",
       "Tg 101 degC, k 6.7, Delta Cp 0.47 J/(g K) (Roos 1993, table 1; values from memory)"},
      {"maltose", 273.15 + 87.0, 6.0, 610.0, "roos_1993", "roos_1993",
       "Tg 87 degC, k 6.0, Delta Cp 0.61 J/(g K) (Roos 1993, table 1; values from memory)"},
      {"maltodextrin", 273.15 + 160.0, 7.0, 0.0, "roos_karel_1991_maltodextrin", "",
       "DE 10 maltodextrin (Maltrin M100): Tg 160 degC, k 7.0 (Roos & Karel 1991, "
       "Biotechnol. Prog.; values from memory)"},
  };
  return table;
}

/// The record of `solute_id`, or nullptr when the table has none.
inline const glass_transition_record* find_glass_transition(const std::string& solute_id) {
  for (const auto& r : glass_transition_table())
    if (r.solute_id == solute_id) return &r;
  return nullptr;
}

}  // namespace colligate::data
