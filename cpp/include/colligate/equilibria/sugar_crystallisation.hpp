#pragma once
/// \file sugar_crystallisation.hpp
/// Solubility of sugars against temperature, and their supersaturation in the unfrozen
/// phase of a frozen food: whether sucrose, lactose or dextrose can crystallise in storage.
///
/// Supersaturation ratio of a sugar in the unfrozen phase at T:
///
///     sigma = (kg sugar / kg unfrozen water) / S(T)
///
/// with S(T) the binary solubility in pure water (data/sugar_solubility.hpp; the other
/// solutes' effect on it is not counted, as in the dairy texts' lactose-in-serum-water
/// reckoning). Crystallisation is possible where sigma > 1 and the unfrozen phase is above
/// its glass transition Tg' (state_diagram.hpp); below Tg' it is kinetically arrested. A
/// supersaturated phase need not crystallise (nucleation may take months, and other
/// solutes slow it): sigma > 1 is a possibility, not a prediction.
///
/// Lactose: its final solubility (alpha and beta at the mutarotation equilibrium) is the
/// curve; the initial solubility, what dissolves at once of alpha-lactose, is the final
/// over (1 + K), K = beta/alpha at equilibrium (data::lactose_mutarotation_ratio).

#include <cmath>
#include <limits>
#include <string>
#include <vector>

#include "colligate/core/errors.hpp"
#include "colligate/core/roots.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/data/sugar_solubility.hpp"
#include "colligate/equilibria/ice_curve.hpp"
#include "colligate/equilibria/state_diagram.hpp"

namespace colligate::equilibria {

/// Solubility of a sugar at one temperature.
struct sugar_solubility_result {
  double kg_per_kg_water = std::numeric_limits<double>::quiet_NaN();
  double mass_fraction = std::numeric_limits<double>::quiet_NaN();  ///< of the saturated solution
  std::string solid_phase;  ///< the stable phase (lowest solubility)
  validity check;           ///< temperature outside the data of that phase
};

/// Solubility of `solute_id` ("sucrose", "lactose", "glucose") at T (K). Throws
/// invalid_input for a solute without a curve (naming those with one) or a bad T.
inline sugar_solubility_result sugar_solubility(const std::string& solute_id, double temperature) {
  const char* where = "sugar_solubility";
  if (!(std::isfinite(temperature) && temperature > 0.0))
    throw invalid_input(colligate::detail::describe(where, "temperature", temperature, "must be finite and > 0 K"));
  const auto* rec = data::find_sugar_solubility(solute_id);
  if (!rec) {
    std::string known;
    for (const auto& r : data::sugar_solubility_curves()) known += (known.empty() ? "" : ", ") + r.solute_id;
    throw invalid_input(std::string(where) + ": no solubility curve for '" + solute_id + "' (curves: " + known + ")");
  }
  sugar_solubility_result out;
  const data::solubility_branch* best = nullptr;
  for (const auto& b : rec->branches) {
    const double s = b.kg_per_kg_water(temperature);
    if (!best || s < out.kg_per_kg_water) {
      best = &b;
      out.kg_per_kg_water = s;
    }
  }
  out.solid_phase = best->solid_phase;
  out.mass_fraction = out.kg_per_kg_water / (1.0 + out.kg_per_kg_water);
  double lo = best->t_min, hi = best->t_max;
  for (const auto& b : rec->branches) {  // the data of all phases together bound the curve
    lo = std::min(lo, b.t_min);
    hi = std::max(hi, b.t_max);
  }
  if (temperature < lo || temperature > hi)
    out.check = outside_range(std::string(where) + " of '" + solute_id + "'", "temperature", temperature, lo, hi,
                              " K", "extrapolated beyond the solubility data", best->source);
  return out;
}

/// Initial solubility of alpha-lactose at T (K), kg per kg water: the final solubility
/// over 1 + K(T).
inline sugar_solubility_result lactose_initial_solubility(double temperature) {
  auto r = sugar_solubility("lactose", temperature);
  r.kg_per_kg_water /= 1.0 + data::lactose_mutarotation_ratio(temperature);
  r.mass_fraction = r.kg_per_kg_water / (1.0 + r.kg_per_kg_water);
  r.solid_phase = "alpha-lactose monohydrate (initial, before mutarotation)";
  return r;
}

/// A sugar's state in the unfrozen phase at one temperature.
struct sugar_supersaturation {
  std::string solute_id;
  double temperature = std::numeric_limits<double>::quiet_NaN();        ///< K
  double concentration = std::numeric_limits<double>::quiet_NaN();      ///< kg per kg unfrozen water
  double solubility = std::numeric_limits<double>::quiet_NaN();         ///< kg per kg water
  double ratio = std::numeric_limits<double>::quiet_NaN();              ///< concentration / solubility
  bool glassy = false;            ///< T at or below Tg' (crystallisation arrested)
  bool crystallisation_possible = false;  ///< ratio > 1 and not glassy
  validity check;                 ///< solubility or ice-curve extrapolation
};

/// One temperature interval [low, high], K.
struct temperature_interval {
  double low = std::numeric_limits<double>::quiet_NaN();
  double high = std::numeric_limits<double>::quiet_NaN();
};

/// Where each sugar of a solution can crystallise along its ice curve.
class crystallisation_check {
 public:
  /// Highest temperature scanned for the crystallisation range, K (a warm room).
  static constexpr double scan_top = constants::ice_point + 40.0;

  crystallisation_check(const solution& s, const models::model_choice& m = "auto",
                        double bound_water_kg = 0.0)
      : curve_(s, m, bound_water_kg) {
    for (std::size_t i = 0; i < s.size(); ++i)
      if (s.moles()[i] > 0.0 && data::find_sugar_solubility(s.species()[i].id)) sugars_.push_back(i);
    try {
      glass_ = maximal_freeze_concentration_of(curve_);
    } catch (const invalid_input&) {
      glass_.status = solve_status::below_search_limit;  // no glass data: Tg' unknown
    }
  }

  /// Solute ids with a solubility curve, in the solution's order.
  std::vector<std::string> sugars() const {
    std::vector<std::string> out;
    for (auto i : sugars_) out.push_back(curve_.composition().species()[i].id);
    return out;
  }
  const maximal_freeze_concentration& glass() const noexcept { return glass_; }

  /// Each sugar's supersaturation at T (K).
  std::vector<sugar_supersaturation> at(double temperature) {
    std::vector<sugar_supersaturation> out;
    const ice_curve_state st = curve_.at(temperature);
    const double water = st.unfrozen_water + st.bound_water;
    for (auto i : sugars_) {
      sugar_supersaturation r;
      r.solute_id = curve_.composition().species()[i].id;
      r.temperature = temperature;
      const auto sol = sugar_solubility(r.solute_id, temperature);
      r.solubility = sol.kg_per_kg_water;
      r.check = sol.check;
      r.check.merge(st.check);
      if (st.success() && water > 0.0) {
        r.concentration = curve_.composition().solute_mass(i) / water;
        r.ratio = r.concentration / r.solubility;
      }
      r.glassy = glass_.success() && temperature <= glass_.tg_prime;
      r.crystallisation_possible = r.ratio > 1.0 && !r.glassy;
      out.push_back(std::move(r));
    }
    return out;
  }

  /// The temperature intervals (K) between the lower of Tg' (or the ice data's limit)
  /// and scan_top in which `solute_id` is supersaturated and not glassy, found on a
  /// 0.5 K grid and refined by bisection to 0.01 K.
  std::vector<temperature_interval> crystallisation_range(const std::string& solute_id) {
    std::size_t k = sugars_.size();
    for (std::size_t j = 0; j < sugars_.size(); ++j)
      if (curve_.composition().species()[sugars_[j]].id == solute_id) k = j;
    if (k == sugars_.size())
      throw invalid_input("crystallisation_range: '" + solute_id + "' is not a sugar of this solution with a solubility curve");
    auto possible = [&](double T) { return at(T)[k].crystallisation_possible; };
    const double bottom = glass_.success() ? glass_.tg_prime : water::ice_model_lowest_temperature;
    std::vector<temperature_interval> out;
    const double step = 0.5;
    double prev_T = bottom + 1e-6;
    bool prev = possible(prev_T);
    temperature_interval cur;
    if (prev) cur.low = prev_T;
    for (double T = bottom + step; T <= scan_top + 1e-9; T += step) {
      const bool now = possible(T);
      if (now != prev) {
        const auto edge = bisect_boundary(
            [&](double x) { return possible(x) == prev; }, prev_T, T, 0.01);
        if (now) cur.low = edge.hi;
        else {
          cur.high = edge.lo;
          out.push_back(cur);
          cur = temperature_interval{};
        }
      }
      prev = now;
      prev_T = T;
    }
    if (prev) {
      cur.high = prev_T;
      out.push_back(cur);
    }
    return out;
  }

 private:
  ice_curve curve_;
  std::vector<std::size_t> sugars_;
  maximal_freeze_concentration glass_;
};

}  // namespace colligate::equilibria
