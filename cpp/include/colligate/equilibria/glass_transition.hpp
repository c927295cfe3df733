#pragma once
/// \file glass_transition.hpp
/// Glass transition temperature of an aqueous phase (water plus dissolved solutes) from the
/// glass transitions of its pure components.
///
/// Gordon-Taylor (Gordon & Taylor 1952), in the multi-component form with water as the
/// reference component (each solute's k taken against water, as Roos 1993 fits them):
///
///     Tg = (w_w Tg_w + sum_i w_i Tg_i / k_i) / (w_w + sum_i w_i / k_i)
///
/// which for one solute is Roos's (w_s Tg_s + k w_w Tg_w) / (w_s + k w_w).
/// Couchman-Karasz (Couchman & Karasz 1978), linear form with the heat-capacity steps:
///
///     Tg = sum_j w_j dCp_j Tg_j / sum_j w_j dCp_j        (j over water and solutes).
///
/// Solutes without glass-transition data (data/glass_transition_data.hpp) are left out of
/// the sums and named in the result; with none left an invalid_input names them all.

#include <cmath>
#include <string>
#include <vector>

#include "colligate/core/errors.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/data/glass_transition_data.hpp"

namespace colligate::equilibria {

/// How the components' glass transitions are combined.
enum class glass_rule { gordon_taylor, couchman_karasz };

inline const char* to_string(glass_rule r) {
  return r == glass_rule::gordon_taylor ? "gordon_taylor" : "couchman_karasz";
}

inline glass_rule glass_rule_from_string(const std::string& s) {
  if (s == "gordon_taylor") return glass_rule::gordon_taylor;
  if (s == "couchman_karasz") return glass_rule::couchman_karasz;
  throw invalid_input("glass rule '" + s + "' is not known (use 'gordon_taylor' or 'couchman_karasz')");
}

/// Tg of one phase and which solutes it counted.
struct glass_transition_result {
  double temperature = 0.0;                ///< K
  std::vector<std::string> counted;        ///< solute ids with data, in the sums
  std::vector<std::string> lacking;        ///< solute ids without data, left out
  double counted_solute_mass_fraction = 0.0;  ///< of (water + counted solutes)
};

namespace detail {

inline bool has_glass_data(const data::glass_transition_record* r, glass_rule rule) {
  return r != nullptr && (rule == glass_rule::gordon_taylor || r->heat_capacity_step > 0.0);
}

inline std::string joined(const std::vector<std::string>& v) {
  std::string out;
  for (const auto& s : v) out += (out.empty() ? "" : ", ") + s;
  return out;
}

}  // namespace detail

/// Glass transition temperature (K) of a phase made of `water_kg` of water and the dissolved
/// solutes of `s` (their amounts as held by `s`). `water_kg` is the water in the phase (for
/// an unfrozen phase: liquid plus bound water); it may be 0 (the dry solids).
inline glass_transition_result glass_transition(const solution& s, double water_kg,
                                                glass_rule rule = glass_rule::gordon_taylor) {
  const char* where = "glass_transition";
  if (!(std::isfinite(water_kg) && water_kg >= 0.0))
    throw invalid_input(colligate::detail::describe(where, "water_kg", water_kg, "must be finite and >= 0"));
  glass_transition_result r;
  double num = 0.0, den = 0.0, solids = 0.0;
  for (std::size_t i = 0; i < s.size(); ++i) {
    const auto& id = s.species()[i].id;
    const double m = s.solute_mass(i);
    if (!(m > 0.0)) continue;
    const auto* g = data::find_glass_transition(id);
    if (!detail::has_glass_data(g, rule)) {
      r.lacking.push_back(id);
      continue;
    }
    r.counted.push_back(id);
    solids += m;
    const double weight = rule == glass_rule::gordon_taylor ? m / g->gordon_taylor_k
                                                            : m * g->heat_capacity_step;
    num += weight * g->temperature;
    den += weight;
  }
  if (r.counted.empty())
    throw invalid_input(std::string(where) + ": no dissolved solute has glass-transition data "
                        "for rule '" + to_string(rule) + "'; lacking: " +
                        (r.lacking.empty() ? std::string("(no solutes)") : detail::joined(r.lacking)) +
                        " (data/glass_transition_data.hpp lists the solutes with data)");
  const double w_weight = rule == glass_rule::gordon_taylor
                              ? water_kg
                              : water_kg * data::water_glass_heat_capacity_step;
  num += w_weight * data::water_glass_transition_temperature;
  den += w_weight;
  r.temperature = num / den;
  r.counted_solute_mass_fraction = solids / (solids + water_kg);
  return r;
}

/// Glass transition temperature (K) of the whole solution `s` (all of its water).
inline glass_transition_result glass_transition(const solution& s,
                                                glass_rule rule = glass_rule::gordon_taylor) {
  return glass_transition(s, s.water_mass(), rule);
}

}  // namespace colligate::equilibria
