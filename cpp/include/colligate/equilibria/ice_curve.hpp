#pragma once
/// \file ice_curve.hpp
/// The ice curve of one solution under one model: prepared once, it knows the initial
/// freezing point and the ordered solid phases along the freezing path (ice, then each
/// salt or salt hydrate as the unfrozen brine saturates in it, with the temperature where
/// each starts), and answers for any temperature: the phase state, ice, each salt
/// precipitated, the unfrozen liquid (water and ions), a_w and the validity (DESIGN
/// section 1). Freezing point, ice fraction, unfrozen phase, eutectic, enthalpy, the
/// batch kernels, the report and the plots all read it.
///
/// Equations. Ice (pure H2O) coexists with the liquid when
///     ln a_w(liquid, T) = ln a_w,ice(T);
/// a salt phase M_p X_q . h H2O that has crystallised coexists with it when
///     SI = p ln(m_M gamma_M) + q ln(m_X gamma_X) + h ln a_w - ln K(T) = 0
/// (equilibria/salt_solubility.hpp). With ice and the active salts k the unknowns are the
/// liquid water W_u and the amounts crystallised xi_k; water balance
///     W - W_bound = W_u + ice + M_w sum_k h_k xi_k.
/// One phase (ice) is a 1-D bracketed root on ln W_u (core/roots.hpp); with salts,
/// Newton on (ln W_u, xi) with a finite-difference Jacobian, warm-started from the
/// previous temperature of the path.
///
/// The path. Below the first salt onset the curve is followed downwards in steps of
/// `path_step` K; at each step a salt that becomes supersaturated is added (its onset
/// located by bisection to 1e-7 K), and, on the equilibrium path, a salt whose amount
/// would turn negative dissolves again. Two paths are offered:
/// - crystallisation_path::equilibrium: every solid stays in contact with the brine and
///   may redissolve (the whole system at equilibrium at each T);
/// - crystallisation_path::fractional: each salt is removed from the brine as it forms,
///   so it never redissolves (where the equilibrium path would dissolve it, it stays
///   crystallised and leaves the equilibrium).
/// The curve ends at the final eutectic, the temperature at which one more solid phase
/// saturates than the liquid's composition can accommodate (phase rule: the liquid is
/// used up; for a binary brine, the ice + salt hydrate eutectic), or where the salt
/// solubility data end (219.15 K), and says which. Below the end the masses are NaN with
/// a reason.
///
/// Models without ion activities (ideal, Raoult, Norrish) have no salt phases; their
/// curve is ice alone down to the search limit. Non-electrolyte crystallisation (lactose,
/// sucrose) is not part of the path.
///
/// An ice_curve caches the path it has explored and the model's last-temperature
/// coefficients: one per thread (copying is not offered; move it).

#include <Eigen/Dense>
#include <algorithm>
#include <array>
#include <cmath>
#include <cstdint>
#include <cstdio>
#include <limits>
#include <memory>
#include <stdexcept>
#include <string>
#include <utility>
#include <vector>

#include "colligate/core/constants.hpp"
#include "colligate/core/errors.hpp"
#include "colligate/core/roots.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/equilibria/detail/unfrozen_water_newton.hpp"
#include "colligate/equilibria/freezing_point.hpp"
#include "colligate/equilibria/salt_equilibrium.hpp"
#include "colligate/equilibria/salt_solubility.hpp"
#include "colligate/equilibria/solver_status.hpp"
#include "colligate/models/water_activity.hpp"
#include "colligate/water/ice.hpp"

namespace colligate::equilibria {

/// Which freezing path the curve follows once salts crystallise.
enum class crystallisation_path : std::uint8_t { equilibrium, fractional };

inline const char* to_string(crystallisation_path p) {
  return p == crystallisation_path::fractional ? "fractional" : "equilibrium";
}

inline crystallisation_path crystallisation_path_from_string(const std::string& s) {
  if (s == "equilibrium") return crystallisation_path::equilibrium;
  if (s == "fractional") return crystallisation_path::fractional;
  throw invalid_input("path = '" + s + "': valid values are 'equilibrium' and 'fractional'");
}

/// What a solution is at one temperature.
enum class phase_state : std::uint8_t {
  liquid,            ///< above the freezing point: no ice
  ice_and_liquid,    ///< ice and the unfrozen liquid
  ice_salts_liquid,  ///< ice, one or more salt phases and the liquid
  below_curve_end,   ///< below the final eutectic or the data's lower limit: not computed
  not_solved         ///< the solver did not converge (status says why)
};

inline const char* to_string(phase_state s) {
  switch (s) {
    case phase_state::liquid: return "liquid";
    case phase_state::ice_and_liquid: return "ice_and_liquid";
    case phase_state::ice_salts_liquid: return "ice_salts_liquid";
    case phase_state::below_curve_end: return "below_curve_end";
    case phase_state::not_solved: return "not_solved";
  }
  return "unknown";
}

/// Why the ice curve ends where it does.
enum class curve_end : std::uint8_t {
  final_eutectic,     ///< no liquid can remain below it
  salt_data_limit,    ///< the salt solubility data end (219.15 K)
  search_limit,       ///< models without salt phases: the lowest temperature searched
  saturated_before_ice,  ///< a salt is supersaturated already at the freezing point
  no_freezing_point   ///< the solution does not freeze above the search limit
};

inline const char* to_string(curve_end e) {
  switch (e) {
    case curve_end::final_eutectic: return "final_eutectic";
    case curve_end::salt_data_limit: return "salt_data_limit";
    case curve_end::search_limit: return "search_limit";
    case curve_end::saturated_before_ice: return "saturated_before_ice";
    case curve_end::no_freezing_point: return "no_freezing_point";
  }
  return "unknown";
}

/// The first solid that forms on cooling when it is a salt: a brine richer than its
/// eutectic composition (25 wt% NaCl) saturates in a salt phase before ice can form, so its
/// "freezing point" in the sense of the first solid is where the salt begins to crystallise
/// (ice_curve::salt_first()).
struct salt_first_solid {
  /// The salt that forms first; nullptr when ice forms first (the usual case).
  const salt_phase* phase = nullptr;
  /// K where it begins to crystallise; NaN when not found in the solubility data (above
  /// 298.15 K: the solution is already supersaturated at 25 C; see check).
  double temperature = std::numeric_limits<double>::quiet_NaN();
  /// The ice freezing point of the liquid as given (metastable: the salt would have
  /// crystallised first), K.
  double metastable_ice_temperature = std::numeric_limits<double>::quiet_NaN();
  /// The model's validity at that temperature, or why no temperature was found.
  validity check;
};

/// A solid salt phase on the path.
struct salt_onset {
  const salt_phase* phase = nullptr;
  double temperature = std::numeric_limits<double>::quiet_NaN();  ///< K where it starts to form
  /// K where it dissolves again (equilibrium path) or leaves the equilibrium (fractional
  /// path); NaN if it stays to the end of the curve.
  double ends = std::numeric_limits<double>::quiet_NaN();
};

/// The state of the solution at one temperature. Masses in kg, amounts in mol.
struct ice_curve_state {
  double temperature = std::numeric_limits<double>::quiet_NaN();  ///< K
  phase_state state = phase_state::liquid;
  solve_status status = solve_status::converged;
  int iterations = 0;
  double total_water = 0.0;     ///< water in the solution, kg
  double bound_water = 0.0;     ///< water that cannot freeze, kg
  double unfrozen_water = 0.0;  ///< liquid water (solvent), kg
  double ice = 0.0;             ///< kg
  double hydrate_water = 0.0;   ///< water held in crystallised salt hydrates, kg
  double water_activity = std::numeric_limits<double>::quiet_NaN();
  /// Salt crystallised, mol, one per entry of ice_curve::salts() (empty without salts).
  std::vector<double> precipitated;
  validity check;

  /// Ice mass over total water mass.
  double ice_fraction() const noexcept { return ice / total_water; }
  bool success() const noexcept {
    return status == solve_status::converged || status == solve_status::not_frozen;
  }
};

class ice_curve {
 public:
  /// Lowest temperature a salt path is followed to (the salt data's limit), K.
  static constexpr double lowest_salt_temperature = salt_phase_min_temperature;
  /// Step of the path below the first salt onset, K.
  static constexpr double path_step = 0.5;

  /// The curve of `s` (copied) under model `m`.
  explicit ice_curve(const solution& s, const models::model_choice& m = "auto",
                     double bound_water_kg = 0.0,
                     crystallisation_path path = crystallisation_path::equilibrium)
      : ice_curve(std::make_shared<const solution>(s), m, bound_water_kg, path) {}

  /// The curve of a shared solution. A batch passes a view of its workspace solution
  /// (amounts overwritten row by row) and calls reset() after each new row.
  ice_curve(std::shared_ptr<const solution> s, const models::model_choice& m,
            double bound_water_kg, crystallisation_path path)
      : s_(std::move(s)),
        ln_aw_(std::make_unique<models::ln_water_activity_evaluator>(m, *s_)),
        model_choice_(m),
        path_(path) {
    ions_ = s_->has_electrolytes() && ln_aw_->model().traits.ion_activities ? ln_aw_->ions()
                                                                             : nullptr;
    if (ions_) prepare_salts();
    reset(bound_water_kg);
  }

  /// Forgets everything that depends on the amounts (after they changed in place) and
  /// takes a new bound water, kg.
  void reset(double bound_water_kg) {
    detail::check_bound_water("ice_curve", *s_, bound_water_kg);
    bound_ = bound_water_kg;
    W_ = s_->water_mass() - bound_;
    fp_known_ = false;
    salts_started_ = false;
    onsets_.clear();
    onset_candidate_.clear();
    segments_.clear();
    nodes_.clear();
    solver_stopped_ = false;
    saturated_phase_ = nullptr;
    explored_to_ = -1.0;
    at_W_temperature_ = std::numeric_limits<double>::quiet_NaN();  // the amounts changed
    end_temperature_ = ions_ ? lowest_salt_temperature : search_min_temperature;
    end_ = ions_ ? curve_end::salt_data_limit : curve_end::search_limit;
    if (ions_) ions_->ion_moles(n0_.data());
  }

  ice_curve(const ice_curve&) = delete;
  ice_curve& operator=(const ice_curve&) = delete;
  ice_curve(ice_curve&&) noexcept = default;
  ice_curve& operator=(ice_curve&&) noexcept = default;

  const solution& composition() const noexcept { return *s_; }
  const models::model_descriptor& model() const noexcept { return ln_aw_->model(); }
  crystallisation_path path() const noexcept { return path_; }
  double bound_water() const noexcept { return bound_; }

  /// The initial freezing point (status and validity included), solved on first use.
  const freezing_point_result& initial_freezing_point() {
    if (!fp_known_) {
      fp_ = freezing_point(*s_, model_choice_, bound_, *ln_aw_);
      fp_known_ = true;
    }
    return fp_;
  }

  /// The salt phases along the path in the order they form (the whole path explored).
  const std::vector<salt_onset>& salts() {
    explore(lowest_salt_temperature);
    return onsets_;
  }

  /// Where the curve ends (the whole path explored), K, and why.
  double end_temperature() {
    explore(lowest_salt_temperature);
    return end_temperature_;
  }
  curve_end end_reason() {
    explore(lowest_salt_temperature);
    return end_;
  }
  /// The phase supersaturated at the freezing point (end_reason() saturated_before_ice).
  const salt_phase* saturated_phase() const noexcept { return saturated_phase_; }

  /// Whether a salt forms before ice (salt_first_solid): solves the freezing point of the
  /// liquid as given and tests the salt phases there; if one is supersaturated, finds the
  /// temperature where it begins to crystallise on cooling (equilibria/salt_equilibrium.hpp,
  /// salt_crystallisation_temperature) on this curve's model and freezable water.
  salt_first_solid salt_first() {
    salt_first_solid out;
    if (ions_ == nullptr) return out;
    start_salts();
    if (end_ != curve_end::saturated_before_ice) return out;
    out.metastable_ice_temperature = initial_freezing_point().temperature;
    const auto onset = salt_crystallisation_temperature(*ions_, W_);
    out.phase = onset.phase != nullptr ? onset.phase : saturated_phase_;
    out.temperature = onset.above_data ? std::numeric_limits<double>::quiet_NaN() : onset.temperature;
    if (std::isnan(out.temperature)) {
      out.check = flagged(validity_code::concentration_out_of_range, "freezing_point",
                          "salt crystallisation temperature",
                          onset.reason.empty() ? std::string("not found") : onset.reason,
                          out.phase->source);
    } else {
      out.check = ln_aw_->check(W_, out.temperature);
    }
    return out;
  }

  /// The first salt onset (the eutectic of a binary brine), exploring only as far as it.
  const salt_onset* first_salt() {
    if (start_salts() && onsets_.empty()) explore_first_onset(lowest_salt_temperature);
    return onsets_.empty() ? nullptr : &onsets_[0];
  }

  /// The state at temperature T (K). Above the freezing point: liquid, no ice.
  ice_curve_state at(double temperature) {
    models::check_temperature_argument("ice_curve", temperature);
    ice_curve_state r;
    r.temperature = temperature;
    r.total_water = s_->water_mass();
    r.bound_water = bound_;
    r.precipitated.assign(onsets_.size(), 0.0);
    const double T = temperature;
    if (T < water::ice_model_lowest_temperature) return below_formulation(r);
    // ln a_w at W (with its slope for a model that has one: the ice-only Newton on the water
    // mass starts there, detail/unfrozen_water_newton.hpp, and reuses it).
    double ln_aw_solution = 0.0;
    if (ln_aw_->with_slope(W_, T, at_W_[0], at_W_[1])) {
      ln_aw_solution = at_W_[0];
      at_W_temperature_ = T;
    } else {
      ln_aw_solution = (*ln_aw_)(W_, T);
      at_W_temperature_ = std::numeric_limits<double>::quiet_NaN();
    }
    const double ln_aw_ice = T < constants::ice_point ? ice_line(T) : 0.0;
    // exp(l) > 0 for any l above -700 (the exponential is taken only below that)
    if (!((ln_aw_solution > -700.0 || std::exp(ln_aw_solution) > 0.0) && ln_aw_solution <= 0.0))
      return no_physical_value(r, "water activity of the solution", std::exp(ln_aw_solution), T);
    if (T >= constants::ice_point || !(ln_aw_solution > ln_aw_ice)) {
      r.state = phase_state::liquid;
      r.status = solve_status::not_frozen;
      r.unfrozen_water = W_;
      r.water_activity = std::exp(ln_aw_solution);
      r.check = ln_aw_->check(W_, T);
      return r;
    }
    if (ions_ == nullptr) return ice_only(r, ln_aw_ice);
    // Salt path. No salt on the path yet: one ice solve and a saturation test decide
    // (the saturation of the brine grows as it freezes).
    if (onsets_.empty() && end_ != curve_end::saturated_before_ice) {
      liquid_state st;
      if (solve_ice_only(T, nullptr, st) && !(max_saturation(T, st, nullptr) > 0.0) &&
          T >= lowest_salt_temperature) {
        // Within the model's range the saturation index grows as the brine concentrates, so
        // unsaturated at T means no salt above T. Outside it the index can fall again (see
        // explore_first_onset): the path from the freezing point decides.
        ice_curve_state liquid = r;
        fill(liquid, st, {}, ln_aw_ice);
        if (liquid.check.in_range()) return liquid;
        if (!start_salts()) return below_end(r);
        explore(T);
        if (onsets_.empty() && explored_to_ <= T) return liquid;
      }
    }
    if (!start_salts()) return below_end(r);
    explore(T);
    if (T < end_temperature_) return below_end(r);
    if (segments_.empty()) {
      // No salt onset was located (the ice-only solve failed while looking for one): the
      // state is not solved, and says so (found by fuzz/fuzz_solution.cpp).
      r.state = phase_state::not_solved;
      r.status = solve_status::max_iterations;
      r.check = flagged(validity_code::not_converged, "ice_curve", "temperature",
                        "the ice equilibrium could not be followed to this temperature");
      r.check.value = T;
      r.unfrozen_water = r.ice = std::numeric_limits<double>::quiet_NaN();
      return r;
    }
    const segment& seg = segment_for(T);
    liquid_state st = guess_for(T, seg);
    if (!solve(T, seg, st)) {
      r.state = phase_state::not_solved;
      r.status = solve_status::max_iterations;
      r.check = flagged(validity_code::not_converged, "ice_curve", "temperature",
                        "the ice and salt equilibria did not converge at this temperature");
      r.check.value = T;
      r.unfrozen_water = r.ice = std::numeric_limits<double>::quiet_NaN();
      return r;
    }
    r.precipitated.assign(onsets_.size(), 0.0);
    return fill(r, st, seg, ln_aw_ice);
  }

 private:
  /// Unknowns of one state: u = ln W_u and the amounts crystallised per onset.
  struct liquid_state {
    double u = 0.0;
    std::vector<double> xi;  ///< per onset (active or fixed)
    int iterations = 0;
    /// W_u itself (kg) when a model's closed-form solve gave it (u is then NaN on a curve
    /// without salts, where nothing else reads it: fill() takes W_u from here).
    double water = std::numeric_limits<double>::quiet_NaN();
  };
  /// A stretch of the path with one set of active salts.
  struct segment {
    double t_hi = 0.0, t_lo = 0.0;
    std::vector<std::size_t> active;  ///< onset indices in equilibrium with the liquid
    std::vector<double> fixed;        ///< per onset: amounts removed for good (fractional)
  };
  struct node {
    double temperature;
    liquid_state state;
  };
  struct candidate {
    const salt_phase* phase;
    std::vector<std::pair<std::size_t, int>> slots;  ///< ion slot, count
    /// The shift of K that goes with the model's parameter set (nullptr: published K).
    const std::array<double, 6>* shift = nullptr;
    /// Lower bounds of ln K per temperature bin (ln_k_floor; NaN until first asked; empty
    /// until the bound first needs one).
    std::vector<double> ln_k_floors;
  };
  /// Temperature bins of the saturation bound's ln K: width 1/8 K from 219 K to the ice
  /// point. A bin's bound is a function of the bin alone (salt_phase::ln_k_lower_bound),
  /// so the result is the same whichever row filled it; later rows whose freezing points
  /// fall in the bin read it.
  static constexpr double ln_k_bin_start = 219.0;
  static constexpr double ln_k_bins_per_kelvin = 8.0;
  static constexpr std::size_t ln_k_bins = 55 * 8;
  /// A lower bound of ln K of candidate `k` valid at T (salt_phase::ln_k_lower_bound over
  /// T's bin), or ln K itself outside the bins.
  static double ln_k_floor(candidate& k, double T) {
    const double u = (T - ln_k_bin_start) * ln_k_bins_per_kelvin;
    if (!(u >= 0.0 && u < static_cast<double>(ln_k_bins))) return k.phase->ln_k(T, k.shift);
    const auto i = static_cast<std::size_t>(u);
    if (k.ln_k_floors.empty()) k.ln_k_floors.assign(ln_k_bins, std::numeric_limits<double>::quiet_NaN());
    double& f = k.ln_k_floors[i];
    if (std::isnan(f)) {
      const double a = ln_k_bin_start + static_cast<double>(i) / ln_k_bins_per_kelvin;
      f = k.phase->ln_k_lower_bound(a, a + 1.0 / ln_k_bins_per_kelvin, k.shift);
    }
    return f;
  }

  // --- preparation -----------------------------------------------------------------

  /// Solves the freezing point and starts the salt path there (once per reset). False
  /// when there is no path to follow (no freezing point, or a salt saturated before ice).
  bool start_salts() {
    if (ions_ == nullptr) return false;
    if (salts_started_) return explored_to_ >= 0.0 || !onsets_.empty();
    salts_started_ = true;
    const auto& fp = initial_freezing_point();
    if (!fp.success()) {
      end_ = curve_end::no_freezing_point;
      end_temperature_ = fp.temperature;
      return false;
    }
    // The liquid as given, in its freezable water (W itself, not exp(log W): the ion
    // molalities then equal those of the freezing-point solve bit for bit, and the
    // evaluator's molality-only terms are reused, models/detail/pitzer_system.hpp).
    const salt_phase* ph = nullptr;
    n_liq_ = n0_;
    if (!saturation_ruled_out(fp.temperature, W_) && max_saturation_in(fp.temperature, W_, &ph) > 0.0) {
      end_ = curve_end::saturated_before_ice;
      end_temperature_ = fp.temperature;
      saturated_phase_ = ph;
      return false;
    }
    explored_to_ = fp.temperature;
    return true;
  }

  /// The salt phases whose ions the species can supply (amounts are read at reset()).
  void prepare_salts() {
    n_slots_ = ions_->ion_slots();
    n0_.assign(n_slots_, 0.0);
    for (const auto& ph : salt_phases()) {
      candidate c{&ph, {}, ions_->parameter_set().find_solubility_shift(ph.formula), {}};
      bool present = true;
      for (const auto& [ion, count] : ph.ions) {
        const auto g = data::pitzer_ion_index(ion);
        const auto k = g < data::pitzer_ion_count ? ions_->slot_of(g) : n_slots_;
        if (k >= n_slots_) {
          present = false;
          break;
        }
        c.slots.emplace_back(k, count);
      }
      if (present) candidates_.push_back(std::move(c));
    }
    ln_act_.assign(n_slots_, 0.0);
    ln_act_hi_.assign(n_slots_, 0.0);
    n_liq_.assign(n_slots_, 0.0);
  }

  double ion_scale() const {
    double s = 0.0;
    for (double n : n0_) s += n;
    return s > 0.0 ? s : 1.0;
  }

  // --- evaluations -----------------------------------------------------------------

  /// Liquid ion amounts for crystallised amounts xi (per onset) and the fixed removals.
  void liquid_ions(const std::vector<double>& xi, const std::vector<double>* fixed) {
    n_liq_ = n0_;
    for (std::size_t j = 0; j < onsets_.size(); ++j) {
      const double x = (j < xi.size() ? xi[j] : 0.0) + (fixed && j < fixed->size() ? (*fixed)[j] : 0.0);
      if (x == 0.0) continue;
      for (const auto& [k, count] : candidate_of(j).slots) n_liq_[k] -= count * x;
    }
  }
  const candidate& candidate_of(std::size_t onset) const { return candidates_[onset_candidate_[onset]]; }

  double saturation_index(const candidate& c, double T, double ln_aw) const {
    return saturation_index(c, T, std::log10(T), ln_aw);
  }
  /// The same with log10(T) given (one logarithm for all the phases tested at T).
  double saturation_index(const candidate& c, double T, double log10_t, double ln_aw) const {
    double si = c.phase->water * ln_aw - c.phase->ln_k(T, log10_t, c.shift);
    for (const auto& [k, count] : c.slots) si += count * ln_act_[k];
    return si;
  }

  /// ln a_w of the liquid (n_liq_ in W_u) and ln(m gamma) into ln_act_.
  double evaluate_liquid(double Wu, double T) {
    for (double n : n_liq_)
      if (!(n >= 0.0)) return std::numeric_limits<double>::quiet_NaN();
    return ions_->ln_water_activity_of_ions(n_liq_.data(), Wu, T, ln_act_.data());
  }

  /// Whether no candidate can be saturated in the liquid n_liq_ in `water_kg` at the
  /// freezing point T of that liquid, decided on upper bounds of the saturation indices
  /// (the first-solid test, which max_saturation_in() then need not run): each ln(m gamma)
  /// from the model's upper bounds (ion_activity_model::ln_activity_upper_bounds), ln a_w
  /// from the ice line at T plus 1e-6 (the freezing-point solve leaves ln a_w within about
  /// 1e-11 of it: steps below 1e-9 K, |d(ln a_w - ln a_w,ice)/dT| below 0.02 per K), and
  /// ln K as max_saturation_in() computes it. Every bound below -1e-6 (far beyond the
  /// rounding of either computation) rules the candidate out; false (run the exact test)
  /// when any is not, or when the model gives no bound. So the decision, and every result,
  /// is the exact test's.
  bool saturation_ruled_out(double T, double water_kg) {
    for (double n : n_liq_)
      if (!(n >= 0.0)) return false;
    if (!(T < constants::ice_point)) return false;
    if (!ions_->ln_activity_upper_bounds(n_liq_.data(), water_kg, T, ln_act_hi_.data())) return false;
    const double ln_aw_hi = ice_line(T) + 1e-6;
    for (std::size_t c = 0; c < candidates_.size(); ++c) {
      if (on_path(c)) continue;
      candidate& k = candidates_[c];
      double si = k.phase->water * ln_aw_hi - ln_k_floor(k, T);
      for (const auto& [slot, count] : k.slots) si += count * ln_act_hi_[slot];
      if (!(si < -1e-6)) return false;
    }
    return true;
  }

  /// Largest saturation index over the candidates not yet on the path, at the state `st`
  /// (whose xi are already applied to n_liq_ by the caller when relevant).
  double max_saturation(double T, const liquid_state& st, const salt_phase** which) {
    if (st.xi.empty()) n_liq_ = n0_;
    return max_saturation_in(T, std::exp(st.u), which);
  }
  /// The same for the liquid n_liq_ in `water_kg` of water.
  double max_saturation_in(double T, double water_kg, const salt_phase** which) {
    const double ln_aw = evaluate_liquid(water_kg, T);
    const double log10_t = std::log10(T);
    double best = -std::numeric_limits<double>::infinity();
    for (std::size_t c = 0; c < candidates_.size(); ++c) {
      if (on_path(c)) continue;
      const double si = saturation_index(candidates_[c], T, log10_t, ln_aw);
      if (si > best) {
        best = si;
        if (which) *which = candidates_[c].phase;
      }
    }
    return best;
  }
  bool on_path(std::size_t c) const {
    // No onset yet (the first-solid test of every freezing point): nothing to search.
    return !onset_candidate_.empty() &&
           std::find(onset_candidate_.begin(), onset_candidate_.end(), c) != onset_candidate_.end();
  }

  /// ln a_w,ice(T), kept for the last temperature asked (a batch asks every row at the same
  /// temperatures; the value depends on T alone, so it survives reset()).
  double ice_line(double T) {
    if (!(T == ice_line_T_)) {
      ice_line_value_ = water::ln_water_activity_of_ice(T);
      ice_line_T_ = T;
    }
    return ice_line_value_;
  }

  /// exp(ln_aw_ice), kept for the last value asked (the same for every row at one T).
  double ice_line_activity(double ln_aw_ice) {
    if (!(ln_aw_ice == ice_activity_ln_)) {
      ice_activity_ = std::exp(ln_aw_ice);
      ice_activity_ln_ = ln_aw_ice;
    }
    return ice_activity_;
  }

  // --- solves ----------------------------------------------------------------------

  /// Ice alone (no salt): the 1-D root on ln W_u. `fixed` removals apply (fractional).
  bool solve_ice_only(double T, const std::vector<double>* fixed, liquid_state& st) {
    const double ln_aw_ice = ice_line(T);
    const bool plain = fixed == nullptr || std::all_of(fixed->begin(), fixed->end(),
                                                       [](double x) { return x == 0.0; });
    if (plain) n_liq_ = n0_;
    else liquid_ions({}, fixed);
    if (plain && solve_ice_only_by_slope(ln_aw_ice, T, st)) return true;
    auto g = [&](double u) {
      const double Wu = std::exp(u);
      const double l = plain ? (*ln_aw_)(Wu, T) : evaluate_liquid(Wu, T);
      return l - ln_aw_ice;
    };
    const auto root = solve_on_log_water(g, std::log(W_));
    st.u = root.x;
    st.xi.assign(onsets_.size(), 0.0);
    st.iterations = root.iterations;
    return root.status == root_status::converged;
  }

  /// Ice alone for a model that solves for the water mass itself
  /// (activity_evaluator::water_for_ln_activity) or has d ln a_w / d W in closed form
  /// (ideal, Raoult, Norrish): Newton on the water mass (detail/unfrozen_water_newton.hpp). False when that path does
  /// not apply or does not converge; the caller then takes the general root finder.
  bool solve_ice_only_by_slope(double ln_aw_ice, double T, liquid_state& st) {
    // A model that solves for the water mass in closed form (Norrish: Halley on the total
    // solute mole fraction, models/norrish.hpp) goes first.
    double Wu = 0.0;
    int iterations = 0;
    if (ln_aw_->water_for_ln_activity(W_, T, ln_aw_ice, Wu, iterations)) {
      st.water = Wu;
      st.u = ions_ ? std::log(Wu) : std::numeric_limits<double>::quiet_NaN();
      st.xi.assign(onsets_.size(), 0.0);
      st.iterations = iterations;
      return true;
    }
    const auto root = detail::unfrozen_water_by_slope(*ln_aw_, W_, T, ln_aw_ice,
                                                      at_W_temperature_ == T ? at_W_ : nullptr);
    if (root.status != root_status::converged) return false;
    st.u = root.x;
    st.xi.assign(onsets_.size(), 0.0);
    st.iterations = root.iterations;
    return true;
  }

  /// Ice and the active salts of `seg` at T by damped Newton from `st`.
  bool solve(double T, const segment& seg, liquid_state& st) {
    if (seg.active.empty()) return solve_ice_only(T, &seg.fixed, st);
    st.xi.resize(onsets_.size(), 0.0);
    const std::size_t k = seg.active.size(), n = k + 1;
    const double ln_aw_ice = water::ln_water_activity_of_ice(T);
    Eigen::VectorXd x(n), r(n), r_try(n), dx(n);
    Eigen::MatrixXd J(n, n);
    auto residual = [&](const Eigen::VectorXd& v, Eigen::VectorXd& out) {
      std::vector<double>& xi = work_xi_;
      xi.assign(onsets_.size(), 0.0);
      for (std::size_t a = 0; a < k; ++a) xi[seg.active[a]] = v[a + 1];
      liquid_ions(xi, &seg.fixed);
      const double ln_aw = evaluate_liquid(std::exp(v[0]), T);
      if (!std::isfinite(ln_aw)) return false;
      out[0] = ln_aw - ln_aw_ice;
      for (std::size_t a = 0; a < k; ++a)
        out[a + 1] = saturation_index(candidate_of(seg.active[a]), T, ln_aw);
      return std::isfinite(out.sum());
    };
    x[0] = st.u;
    for (std::size_t a = 0; a < k; ++a) x[a + 1] = st.xi[seg.active[a]];
    if (!residual(x, r)) return false;
    for (int it = 0; it < 60; ++it) {
      if (r.lpNorm<Eigen::Infinity>() < 1e-11) {
        st.u = x[0];
        for (std::size_t a = 0; a < k; ++a) st.xi[seg.active[a]] = x[a + 1];
        st.iterations = it;
        return true;
      }
      for (std::size_t j = 0; j < n; ++j) {
        Eigen::VectorXd xp = x;
        const double h = j == 0 ? 1e-7 : 1e-7 * std::max(std::abs(x[j]), 1e-4 * ion_scale());
        xp[j] += h;
        if (!residual(xp, r_try)) {
          xp[j] = x[j] - h;
          if (!residual(xp, r_try)) return false;
          J.col(j) = (r - r_try) / h;
        } else {
          J.col(j) = (r_try - r) / h;
        }
      }
      dx = J.partialPivLu().solve(-r);
      if (!dx.allFinite()) return false;
      // Keep every ion amount positive: limit the step, then backtrack on |r|.
      double lambda = 1.0;
      for (int bt = 0; bt < 40; ++bt, lambda *= 0.5) {
        Eigen::VectorXd xt = x + lambda * dx;
        if (residual(xt, r_try) && r_try.norm() < (1.0 - 1e-4 * lambda) * r.norm() + 1e-300) {
          x = xt;
          r = r_try;
          break;
        }
        if (bt == 39) return false;
      }
    }
    return false;
  }

  // --- the path --------------------------------------------------------------------

  /// Finds the first salt onset above `T_low` on the ice-only path. The saturation index
  /// grows as the brine concentrates while the model holds; far outside its range it can
  /// fall again (K2SO4 held unprecipitated at tens of mol/kg), and the ice-only solve can
  /// fail. So the search walks down from the freezing point in steps that double (1, 2, 4,
  /// ... K) to the first temperature that is saturated or unsolved, then bisects that step.
  void explore_first_onset(double T_low) {
    if (!onsets_.empty()) return;
    liquid_state st;
    const double lo_T = std::max(T_low, lowest_salt_temperature);
    const double fp_T = initial_freezing_point().temperature;
    // saturated, or an unsolved temperature, which counts as the cold side (the bracket
    // then closes on the last solved state)
    auto saturated_or_unsolved = [&](double T) {
      liquid_state sm;
      return !solve_ice_only(T, nullptr, sm) || max_saturation(T, sm, nullptr) >= 0.0;
    };
    // The steps do not depend on T_low (the walk only stops sooner for a warmer T_low), so
    // the onset found is the same whichever temperature was asked first.
    double warm = fp_T, cold = fp_T;
    bool found = false;
    for (double step = 1.0; !found && cold > lo_T && cold > lowest_salt_temperature; step *= 2.0) {
      warm = cold;
      cold = std::max(fp_T - step, lowest_salt_temperature);
      found = saturated_or_unsolved(cold);
    }
    if (!found) {
      explored_to_ = std::min(explored_to_, cold);
      if (cold <= lowest_salt_temperature) {
        end_temperature_ = lowest_salt_temperature;
        end_ = curve_end::salt_data_limit;
      }
      return;
    }
    const auto b = bisect_boundary(saturated_or_unsolved, cold, warm, 1e-7, 60);
    double T_on = 0.5 * (b.lo + b.hi);
    const salt_phase* first = nullptr;
    if (!solve_ice_only(T_on, nullptr, st) || (max_saturation(T_on, st, &first), first == nullptr)) {
      // The midpoint fell where the ice-only solve fails (no salt is then named): take the
      // bracket's cold end, saturated where it is solved.
      T_on = b.lo;
      first = nullptr;
      if (!solve_ice_only(T_on, nullptr, st) || (max_saturation(T_on, st, &first), first == nullptr)) {
        // No salt saturates before the ice-only solve stops: the curve ends there, and
        // at() says the equilibria stopped converging.
        explored_to_ = std::min(explored_to_, b.hi);
        end_temperature_ = b.hi;
        end_ = curve_end::salt_data_limit;
        solver_stopped_ = true;
        return;
      }
    }
    segments_.push_back({initial_freezing_point().temperature, T_on, {}, {}});
    add_onset(first, T_on, st);
  }

  /// Adds a salt at its onset T, or ends the curve there if the phase rule allows no
  /// more solids with the liquid.
  void add_onset(const salt_phase* phase, double T_on, const liquid_state& st) {
    std::size_t c = 0;
    while (c < candidates_.size() && candidates_[c].phase != phase) ++c;
    if (c == candidates_.size())
      throw std::logic_error("ice_curve::add_onset: the salt phase is not among the candidates");
    // Phase rule: the liquid's composition directions (its amounts and the removal
    // vector of each salt in equilibrium with it) must stay independent.
    const auto& prev = segments_.back();
    std::vector<std::size_t> active = prev.active;
    const bool has_non_electrolytes = s_->has_non_electrolytes();
    const std::size_t rows = n_slots_ + (has_non_electrolytes ? 1 : 0);
    Eigen::MatrixXd A(rows, active.size() + 2);
    A.setZero();
    liquid_ions(st.xi, &prev.fixed);
    for (std::size_t i = 0; i < n_slots_; ++i) A(i, 0) = n_liq_[i] / ion_scale();
    if (has_non_electrolytes) A(n_slots_, 0) = 1.0;
    for (std::size_t a = 0; a < active.size(); ++a)
      for (const auto& [k, count] : candidate_of(active[a]).slots) A(k, a + 1) = count;
    for (const auto& [k, count] : candidates_[c].slots) A(k, active.size() + 1) = count;
    Eigen::FullPivLU<Eigen::MatrixXd> lu(A);
    lu.setThreshold(1e-9);
    onsets_.push_back({phase, T_on, std::numeric_limits<double>::quiet_NaN()});
    onset_candidate_.push_back(c);
    if (lu.rank() < static_cast<Eigen::Index>(active.size() + 2)) {
      end_ = curve_end::final_eutectic;
      end_temperature_ = T_on;
      explored_to_ = T_on;
      return;
    }
    active.push_back(onsets_.size() - 1);
    std::vector<double> fixed = prev.fixed;
    fixed.resize(onsets_.size(), 0.0);
    segments_.push_back({T_on, T_on, active, fixed});
    liquid_state start = st;
    start.xi.resize(onsets_.size(), 0.0);
    nodes_.push_back({T_on, start});
    explored_to_ = T_on;
  }

  /// Follows the path down to `T_target` (or the end).
  void explore(double T_target) {
    if (!start_salts()) return;
    if (onsets_.empty()) {
      explore_first_onset(T_target);
      if (onsets_.empty()) return;
    }
    while (explored_to_ > T_target && end_ == curve_end::salt_data_limit &&
           explored_to_ > lowest_salt_temperature) {
      segment& seg = segments_.back();
      const double T_prev = explored_to_;
      double step = path_step;
      liquid_state st;
      double T = 0.0;
      bool ok = false;
      for (int tries = 0; tries < 12 && !ok; ++tries, step *= 0.5) {
        T = std::max(T_prev - step, lowest_salt_temperature);
        st = nodes_.back().state;
        ok = solve(T, seg, st);
      }
      if (!ok) {
        end_ = curve_end::salt_data_limit;  // stops where the solver does; say so in at()
        end_temperature_ = T_prev;
        solver_stopped_ = true;
        return;
      }
      // A new salt saturating?
      const salt_phase* ph = nullptr;
      liquid_ions(st.xi, &seg.fixed);
      if (max_saturation(T, st, &ph) > 0.0) {
        liquid_state s_hi = nodes_.back().state, s_lo = st;
        // Saturated at lo, not at hi; an unsolved midpoint counts as saturated (the
        // bracket then closes on the last solved state).
        const auto b = bisect_boundary(
            [&](double mid) {
              liquid_state sm = s_hi;
              if (!solve(mid, seg, sm)) return true;
              liquid_ions(sm.xi, &seg.fixed);
              const bool saturated = max_saturation(mid, sm, nullptr) >= 0.0;
              (saturated ? s_lo : s_hi) = sm;
              return saturated;
            },
            T, T_prev, 1e-7, 60);
        const double lo = b.lo;
        liquid_ions(s_lo.xi, &seg.fixed);
        const salt_phase* which = nullptr;
        max_saturation(lo, s_lo, &which);
        seg.t_lo = lo;
        nodes_.push_back({lo, s_lo});
        add_onset(which, lo, s_lo);
        continue;
      }
      // A salt dissolving (equilibrium) or leaving the equilibrium (fractional)?
      std::size_t leaving = onsets_.size();
      for (std::size_t a : seg.active) {
        const bool falls = path_ == crystallisation_path::fractional
                               ? st.xi[a] < nodes_.back().state.xi[a]
                               : st.xi[a] < 0.0;
        if (falls) {
          leaving = a;
          break;
        }
      }
      if (leaving < onsets_.size()) {
        double T_out = T;
        liquid_state s_out = st;
        if (path_ == crystallisation_path::equilibrium) {
          liquid_state s_hi = nodes_.back().state;
          // Dissolved (amount < 0) at lo, present at hi.
          const auto b = bisect_boundary(
              [&](double mid) {
                liquid_state sm = s_hi;
                if (!solve(mid, seg, sm)) return true;
                if (sm.xi[leaving] < 0.0) return true;
                s_hi = sm;
                return false;
              },
              T, T_prev, 1e-7, 60);
          T_out = b.hi;
          s_out = s_hi;
          s_out.xi[leaving] = 0.0;
        } else {
          T_out = T_prev;
          s_out = nodes_.back().state;
        }
        onsets_[leaving].ends = T_out;
        seg.t_lo = T_out;
        std::vector<std::size_t> active;
        for (std::size_t a : seg.active)
          if (a != leaving) active.push_back(a);
        std::vector<double> fixed = seg.fixed;
        if (path_ == crystallisation_path::fractional) {
          fixed[leaving] += s_out.xi[leaving];
          s_out.xi[leaving] = 0.0;
        }
            segments_.push_back({T_out, T_out, active, fixed});
        nodes_.push_back({T_out, s_out});
        explored_to_ = T_out;
        continue;
      }
      seg.t_lo = T;
      nodes_.push_back({T, st});
      explored_to_ = T;
      if (T <= lowest_salt_temperature) {
        end_ = curve_end::salt_data_limit;
        end_temperature_ = lowest_salt_temperature;
      }
    }
  }

  const segment& segment_for(double T) const {
    for (const auto& seg : segments_)
      if (T <= seg.t_hi && T >= seg.t_lo) return seg;
    return segments_.back();
  }

  /// The stored state nearest above T in its segment (the warm start).
  liquid_state guess_for(double T, const segment& seg) const {
    const liquid_state* best = nullptr;
    double best_dt = std::numeric_limits<double>::infinity();
    for (const auto& nd : nodes_) {
      if (nd.temperature > seg.t_hi || nd.temperature < seg.t_lo) continue;
      const double dt = std::abs(nd.temperature - T);
      if (dt < best_dt) {
        best_dt = dt;
        best = &nd.state;
      }
    }
    if (best) return *best;
    liquid_state st;
    st.u = std::log(W_);
    st.xi.assign(onsets_.size(), 0.0);
    return st;
  }

  // --- results ---------------------------------------------------------------------

  ice_curve_state& ice_only(ice_curve_state& r, double ln_aw_ice) {
    double total_moles = 0.0;
    for (double n : s_->moles()) total_moles += n;
    if (total_moles == 0.0) {  // pure water below the ice point: all freezable water is ice
      r.state = phase_state::ice_and_liquid;
      r.unfrozen_water = 0.0;
      r.ice = W_;
      r.water_activity = std::exp(ln_aw_ice);
      r.check = water::ice_temperature_validity(r.temperature);
      return r;
    }
    liquid_state st;
    const bool ok = solve_ice_only(r.temperature, nullptr, st);
    if (!ok) {
      r.state = phase_state::not_solved;
      r.status = solve_status::max_iterations;
      r.check = flagged(validity_code::not_converged, "ice_fraction", "unfrozen water",
                        "no unfrozen-water mass satisfies the ice equilibrium");
      r.unfrozen_water = r.ice = std::numeric_limits<double>::quiet_NaN();
      return r;
    }
    return fill(r, st, segment{}, ln_aw_ice);
  }

  ice_curve_state& fill(ice_curve_state& r, const liquid_state& st, const segment& seg,
                        double ln_aw_ice) {
    const double Wu = std::isnan(st.u) ? st.water : std::exp(st.u);
    r.iterations = st.iterations;
    r.unfrozen_water = Wu;
    r.water_activity = ice_line_activity(ln_aw_ice);
    double hydrate_mol = 0.0;
    r.precipitated.assign(onsets_.size(), 0.0);
    for (std::size_t j = 0; j < onsets_.size() && j < st.xi.size(); ++j) {
      const double x = st.xi[j] + (j < seg.fixed.size() ? seg.fixed[j] : 0.0);
      r.precipitated[j] = x;
      hydrate_mol += x * onsets_[j].phase->water;
    }
    r.hydrate_water = hydrate_mol * constants::molar_mass_water;
    r.ice = s_->water_mass() - Wu - bound_ - r.hydrate_water;
    // At the freezing point the root may sit a rounding error above the freezable water.
    if (r.ice < 0.0 && r.ice > -1e-12 * r.total_water) r.ice = 0.0;
    if (!(r.ice >= 0.0 && r.ice <= r.total_water) || !(Wu > 0.0) || !(r.hydrate_water >= 0.0))
      return no_physical_value(r, "ice fraction", r.ice / r.total_water, r.temperature);
    bool salts = false;
    for (double x : r.precipitated) salts = salts || x > 0.0;
    r.state = salts ? phase_state::ice_salts_liquid : phase_state::ice_and_liquid;
    r.status = solve_status::converged;
    r.check = ln_aw_->check(Wu, r.temperature);
    water::merge_ice_temperature_validity(r.check, r.temperature);
    return r;
  }

  /// Below 215 K, where a_w,ice(T) ends (water/ice.hpp): no state, whatever the solution.
  ice_curve_state& below_formulation(ice_curve_state& r) {
    r.state = phase_state::below_curve_end;
    r.status = solve_status::below_eutectic;
    r.unfrozen_water = r.ice = r.hydrate_water = std::numeric_limits<double>::quiet_NaN();
    r.precipitated.assign(onsets_.size(), std::numeric_limits<double>::quiet_NaN());
    r.check = water::ice_temperature_validity(r.temperature);
    return r;
  }

  /// A state the activity model cannot give physically (a_w above 1 from a model
  /// extrapolated far beyond its range, an ice fraction outside [0, 1]): masses NaN and
  /// the reason, never a number.
  ice_curve_state& no_physical_value(ice_curve_state& r, const char* quantity, double value,
                                     double T) {
    const validity range = ln_aw_->check(W_, T);
    r.state = phase_state::not_solved;
    r.status = solve_status::max_iterations;
    r.unfrozen_water = r.ice = r.hydrate_water = std::numeric_limits<double>::quiet_NaN();
    r.water_activity = std::numeric_limits<double>::quiet_NaN();
    r.precipitated.assign(onsets_.size(), std::numeric_limits<double>::quiet_NaN());
    r.check = outside_physical_bounds(
        "ice_curve (model '" + ln_aw_->model().id + "')", quantity, value, 0.0, 1.0,
        "the model gives no physical value at " + validity::fmt(T) + " K" +
            (range.in_range() ? std::string() : "; " + range.reason()));
    return r;
  }

  ice_curve_state& below_end(ice_curve_state& r) {
    r.state = phase_state::below_curve_end;
    r.status = solve_status::below_eutectic;
    r.unfrozen_water = r.ice = r.hydrate_water = std::numeric_limits<double>::quiet_NaN();
    r.precipitated.assign(onsets_.size(), std::numeric_limits<double>::quiet_NaN());
    char buf[64];
    std::snprintf(buf, sizeof buf, "%.2f K (%.2f C)", end_temperature_,
                  end_temperature_ - constants::celsius_offset);
    std::string why;
    if (end_ == curve_end::saturated_before_ice) {
      why = "the solution is already saturated in " + saturated_phase_->name + " (" +
            saturated_phase_->formula + ") at its freezing point [" + saturated_phase_->source +
            "]; the salt crystallises before ice and the curve is not followed";
    } else if (end_ == curve_end::final_eutectic) {
      const auto& last = onsets_.back();
      why = "below the final eutectic at " + std::string(buf) + ", where " + last.phase->name +
            " (" + last.phase->formula + ") crystallises from the unfrozen brine [" +
            last.phase->source + "] and no liquid remains; the ice curve stops there";
    } else if (solver_stopped_) {
      why = "below " + std::string(buf) + ", where the ice and salt equilibria stopped converging";
    } else {
      why = "below " + std::string(buf) + ", the lower limit of the salt solubility data [" +
            std::string(salt_phases().front().source) + "]";
    }
    r.check = flagged(validity_code::below_curve_end, "ice_fraction", "temperature", why);
    r.check.value = r.temperature;
    r.check.limit = end_temperature_;
    return r;
  }

  std::shared_ptr<const solution> s_;  // stable address: the evaluator points to it
  std::unique_ptr<models::ln_water_activity_evaluator> ln_aw_;
  models::model_choice model_choice_;
  double bound_ = 0.0;
  double W_ = 0.0;  // freezable water, kg
  crystallisation_path path_;
  freezing_point_result fp_;
  bool fp_known_ = false;
  bool salts_started_ = false;
  models::ion_activity_model* ions_ = nullptr;
  // salt path
  std::size_t n_slots_ = 0;
  std::vector<double> n0_, n_liq_, ln_act_, work_xi_;
  std::vector<double> ln_act_hi_;  ///< saturation_ruled_out(): bounds of ln(m gamma) per slot
  std::vector<candidate> candidates_;
  std::vector<salt_onset> onsets_;
  std::vector<std::size_t> onset_candidate_;
  std::vector<segment> segments_;
  std::vector<node> nodes_;
  double ice_line_T_ = std::numeric_limits<double>::quiet_NaN(), ice_line_value_ = 0.0;
  double ice_activity_ln_ = std::numeric_limits<double>::quiet_NaN(), ice_activity_ = 0.0;
  /// ln a_w and d ln a_w / d W at W_ and at_W_temperature_ (NaN: not known for these amounts).
  double at_W_[2] = {0.0, 0.0};
  double at_W_temperature_ = std::numeric_limits<double>::quiet_NaN();
  double explored_to_ = -1.0;  // K; < 0: nothing to explore
  double end_temperature_ = std::numeric_limits<double>::quiet_NaN();
  curve_end end_ = curve_end::search_limit;
  bool solver_stopped_ = false;
  const salt_phase* saturated_phase_ = nullptr;
};

/// One line saying that a salt, not ice, forms first and what was computed, or "" when ice
/// forms first (the edge turns it into a warning).
inline std::string salt_first_notice(const salt_first_solid& f) {
  if (f.phase == nullptr) return {};
  const std::string label = detail::salt_phase_label(*f.phase);
  const std::string where =
      std::isnan(f.temperature)
          ? "above 298.15 K, the top of the solubility data (the solution is already "
            "supersaturated there: no temperature is given)"
          : "at " + validity::fmt(f.temperature) + " K (" +
                validity::fmt(f.temperature - constants::celsius_offset) + " C)";
  return "the solution is richer in salt than its eutectic composition: on cooling " + label +
         " begins to crystallise " + where + ", before any ice (the liquid is saturated in it "
         "there; solubility product '" + f.phase->source + "'); ice forms only at the eutectic. "
         "The freezing point given is that salt crystallisation temperature; the metastable "
         "(unprecipitated) ice freezing point would be " +
         validity::fmt(f.metastable_ice_temperature) + " K (ask for metastable=True)";
}

/// The freezing point in the sense of the first solid to form, with the caller's range
/// policy: the initial (ice) freezing point as freezing_point_checked() gives it, or, for a
/// brine that saturates in a salt before ice (salt_first()), the temperature where the salt
/// begins to crystallise (NaN when the solution is supersaturated already at 298.15 K).
/// `first`, if not null, receives the salt (phase nullptr: ice first).
inline checked_value first_solid_temperature_checked(ice_curve& curve, range_policy policy,
                                                     salt_first_solid* first = nullptr) {
  auto f = curve.salt_first();
  if (f.phase == nullptr) {
    if (first) *first = f;
    return freezing_point_checked(curve.initial_freezing_point(), policy);
  }
  auto out = apply_policy(f.temperature, f.check, policy);
  if (first) *first = std::move(f);
  return out;
}

}  // namespace colligate::equilibria
