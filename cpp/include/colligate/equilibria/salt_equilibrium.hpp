#pragma once
/// \file salt_equilibrium.hpp
/// A solution above a salt's solubility, without ice: is it supersaturated, and what is
/// its equilibrium state (salt crystallised, the liquid left saturated)?
///
/// Equations. A salt phase M_p X_q . h H2O (equilibria/salt_solubility.hpp) is
/// supersaturated when its saturation index
///     SI = p ln(m_M gamma_M) + q ln(m_X gamma_X) + h ln a_w - ln K(T)
/// is positive. At equilibrium xi mol of it have crystallised, taking p xi and q xi mol of
/// the ions and h xi mol of water from the liquid, so that SI(xi) = 0:
///     n_i(xi) = n_i - nu_i xi,   W(xi) = W - M_w h xi.
/// SI falls monotonically as xi grows (the liquid loses the salt's ions) and tends to -inf
/// as one of its ions runs out, so the root is bracketed on [0, xi_max) and found by
/// TOMS 748 (core/roots.hpp). The phase is the most supersaturated one of the solution as
/// given; if a second phase is supersaturated in the liquid left, the state says so
/// (two-salt equilibria at one temperature are not solved here).
///
/// The a_w of the equilibrium state is that of the saturated liquid (the fixed points of
/// saturated salt solutions, Greenspan 1977); the metastable value, the supersaturated
/// solution taken as one liquid, is given beside it.
///
/// Valid where the solubility products are (219.15-298.15 K); outside, the state is
/// computed with K(T) extrapolated and flagged.

#include <cmath>
#include <limits>
#include <string>
#include <vector>

#include "colligate/core/constants.hpp"
#include "colligate/core/errors.hpp"
#include "colligate/core/roots.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/equilibria/salt_solubility.hpp"
#include "colligate/models/water_activity.hpp"

namespace colligate::equilibria {

/// The state of a solution at T with salts allowed to crystallise (no ice).
struct salt_equilibrium_state {
  double temperature = std::numeric_limits<double>::quiet_NaN();  ///< K
  /// A salt phase is supersaturated in the solution as given (SI > 0).
  bool supersaturated = false;
  /// The phase that crystallises (the most supersaturated); nullptr if none.
  const salt_phase* phase = nullptr;
  /// ln(IAP / K) of that phase in the solution as given (-inf without salt phases).
  double saturation_index = -std::numeric_limits<double>::infinity();
  double precipitated = 0.0;  ///< mol of the phase crystallised at equilibrium
  double liquid_water = std::numeric_limits<double>::quiet_NaN();  ///< kg, solvent left
  /// a_w of the equilibrium state (the saturated liquid when a salt crystallised).
  double water_activity = std::numeric_limits<double>::quiet_NaN();
  /// a_w of the solution as given, taken as one (supersaturated) liquid.
  double metastable_water_activity = std::numeric_limits<double>::quiet_NaN();
  /// A second phase still supersaturated in the liquid left (not solved); nullptr if none.
  const salt_phase* also_supersaturated = nullptr;
  validity check;
};

namespace detail {

inline std::string salt_phase_label(const salt_phase& p) {
  return p.name + " (" + p.formula + ")";
}

}  // namespace detail

/// The equilibrium state of `s` at T with salts allowed to crystallise, from an evaluator
/// prepared for `s` (or for a solution whose amounts `s` holds; the batch kernels pass
/// their workspace's). Models without ion activities (ideal, Raoult, Norrish) have no salt
/// phases: the state is the solution as given.
inline salt_equilibrium_state salt_equilibrium(models::ln_water_activity_evaluator& ln_aw,
                                               const solution& s, double temperature) {
  models::check_temperature_argument("salt_equilibrium", temperature);
  const double T = temperature;
  salt_equilibrium_state r;
  r.temperature = T;
  const double W = s.water_mass();
  const double ln_aw0 = ln_aw(W, T);
  r.metastable_water_activity = std::exp(ln_aw0);
  r.water_activity = r.metastable_water_activity;
  r.liquid_water = W;
  r.check = ln_aw.check(W, T);
  auto* ions = s.has_electrolytes() && ln_aw.model().traits.ion_activities ? ln_aw.ions() : nullptr;
  if (ions == nullptr || !(W > 0.0)) return r;

  // Candidate phases: those whose ions are all present.
  struct candidate {
    const salt_phase* phase;
    std::vector<std::pair<std::size_t, int>> slots;
    const std::array<double, 6>* shift;  ///< the parameter set's shift of K (or nullptr)
  };
  const std::size_t n = ions->ion_slots();
  std::vector<candidate> candidates;
  for (const auto& ph : salt_phases()) {
    candidate c{&ph, {}, ions->parameter_set().find_solubility_shift(ph.formula)};
    bool present = true;
    for (const auto& [ion, count] : ph.ions) {
      const auto g = data::pitzer_ion_index(ion);
      const auto k = g < data::pitzer_ion_count ? ions->slot_of(g) : n;
      if (k >= n) {
        present = false;
        break;
      }
      c.slots.emplace_back(k, count);
    }
    if (present) candidates.push_back(std::move(c));
  }
  if (candidates.empty()) return r;

  std::vector<double> n0(n), nl(n), ln_act(n);
  ions->ion_moles(n0.data());
  auto si_of = [&](const candidate& c, double ln_aw_liq) {
    double si = c.phase->water * ln_aw_liq - c.phase->ln_k(T, c.shift);
    for (const auto& [k, count] : c.slots) si += count * ln_act[k];
    return si;
  };
  const double ln_aw_given = ions->ln_water_activity_of_ions(n0.data(), W, T, ln_act.data());
  const candidate* best = nullptr;
  for (const auto& c : candidates) {
    const double si = si_of(c, ln_aw_given);
    if (si > r.saturation_index) {
      r.saturation_index = si;
      best = &c;
    }
  }
  if (best == nullptr) return r;
  r.phase = best->phase;
  validity range;
  if (T < salt_phase_min_temperature || T > salt_phase_max_temperature)
    range = outside_range("salt_equilibrium", "temperature", T, salt_phase_min_temperature,
                          salt_phase_max_temperature, "K",
                          "solubility product of " + detail::salt_phase_label(*best->phase) +
                              " extrapolated",
                          best->phase->source);
  if (!(r.saturation_index > 0.0)) {
    if (range.code != validity_code::in_range && r.check.code == validity_code::in_range) r.check = range;
    return r;
  }
  r.supersaturated = true;

  // SI(xi) of the liquid left after xi mol of the phase crystallised.
  const double h = best->phase->water;
  double xi_max = std::numeric_limits<double>::infinity();
  for (const auto& [k, count] : best->slots) xi_max = std::min(xi_max, n0[k] / count);
  if (h > 0) xi_max = std::min(xi_max, W / (constants::molar_mass_water * h));
  auto state_at = [&](double xi, double& ln_aw_liq) {
    nl = n0;
    for (const auto& [k, count] : best->slots) nl[k] = n0[k] - count * xi;
    const double w = W - constants::molar_mass_water * h * xi;
    ln_aw_liq = ions->ln_water_activity_of_ions(nl.data(), w, T, ln_act.data());
    return si_of(*best, ln_aw_liq);
  };
  double ln_aw_liq = 0.0;
  auto f = [&](double xi) { return state_at(xi, ln_aw_liq); };
  // Upper end just short of exhaustion, where SI -> -inf (one ion nearly used up).
  double hi = xi_max * (1.0 - 1e-12);
  double f_hi = f(hi);
  const double f_lo = r.saturation_index;
  if (!(f_hi < 0.0)) {
    // The water of hydration runs out first: no liquid is left at equilibrium.
    r.precipitated = hi;
    r.liquid_water = 0.0;
    r.water_activity = std::numeric_limits<double>::quiet_NaN();
    r.check = flagged(validity_code::outside_physical_bounds, "salt_equilibrium", "liquid",
                      "no liquid is left at equilibrium: " +
                          detail::salt_phase_label(*best->phase) + " takes up all the water");
    return r;
  }
  const auto root = toms748_root(f, 0.0, hi, f_lo, f_hi, 50, 200);
  if (root.status != root_status::converged) {
    r.water_activity = std::numeric_limits<double>::quiet_NaN();
    r.check = flagged(validity_code::not_converged, "salt_equilibrium", "amount crystallised",
                      "the saturation of " + detail::salt_phase_label(*best->phase) +
                          " did not converge");
    return r;
  }
  const double xi = root.x;
  state_at(xi, ln_aw_liq);
  r.precipitated = xi;
  r.liquid_water = W - constants::molar_mass_water * h * xi;
  r.water_activity = std::exp(ln_aw_liq);
  // Validity of the saturated liquid: the model's check of the liquid's ions is not
  // available per ion amounts, so the solution-level check of the given state is replaced
  // by the temperature range of the solubility product (the saturated liquid is inside
  // the molality range by construction).
  r.check = range;
  for (const auto& c : candidates) {
    if (&c == best) continue;
    if (si_of(c, ln_aw_liq) > 1e-9) {
      r.also_supersaturated = c.phase;
      r.check = flagged(validity_code::concentration_out_of_range, "salt_equilibrium",
                        "second salt", detail::salt_phase_label(*c.phase) +
                            " is also supersaturated in the liquid left; the equilibrium "
                            "with two salts is not computed",
                        c.phase->source);
      break;
    }
  }
  return r;
}

/// The equilibrium state of `s` at T under model `m` (see above).
inline salt_equilibrium_state salt_equilibrium(const solution& s, double temperature,
                                               const models::model_choice& m = "auto") {
  models::check_temperature_argument("salt_equilibrium", temperature);
  models::ln_water_activity_evaluator ln_aw(m, s);
  return salt_equilibrium(ln_aw, s, temperature);
}

/// The `saturation` option of the water-activity entry points: "equilibrium" (salts
/// crystallise where supersaturated; true) or "metastable" (the solution as one liquid).
inline bool salts_crystallise_from_string(const std::string& saturation) {
  if (saturation == "equilibrium") return true;
  if (saturation == "metastable") return false;
  throw invalid_input("saturation = '" + saturation +
                      "': valid values are 'equilibrium' and 'metastable'");
}

/// One line saying that a solution is supersaturated and what was computed, or "" when
/// it is not (the edge turns it into a warning).
inline std::string supersaturation_notice(const salt_equilibrium_state& st) {
  if (!st.supersaturated || st.phase == nullptr) return {};
  return "the solution is supersaturated in " + detail::salt_phase_label(*st.phase) +
         " at " + validity::fmt(st.temperature) + " K (saturation index ln(IAP/K) = " +
         validity::fmt(st.saturation_index) + ", solubility product '" + st.phase->source +
         "'): the equilibrium state has " + validity::fmt(st.precipitated) +
         " mol crystallised and a_w " + validity::fmt(st.water_activity) +
         " of the saturated liquid; the metastable (unprecipitated) a_w would be " +
         validity::fmt(st.metastable_water_activity);
}

/// Water activity of the equilibrium state (salts crystallised where supersaturated) with
/// the caller's range policy, as models::water_activity gives it for the solution as one
/// liquid.
inline checked_value water_activity_at_equilibrium(models::ln_water_activity_evaluator& ln_aw,
                                                   const solution& s, double temperature,
                                                   range_policy policy,
                                                   salt_equilibrium_state* state = nullptr) {
  auto st = salt_equilibrium(ln_aw, s, temperature);
  const double aw = st.water_activity;
  // No liquid left, or the saturation did not converge: NaN with the state's own reason.
  checked_value out = std::isnan(aw) && !st.check.in_range()
                          ? apply_policy(aw, st.check, policy)
                          : apply_policy_within(aw, st.check, policy, "water_activity",
                                          "water activity", 0.0, 1.0, true,
                                          models::physical_bounds_note);
  if (state) *state = std::move(st);
  return out;
}

/// Where a brine first crystallises salt on cooling, without ice.
struct salt_crystallisation {
  /// K; NaN when not found (see reason).
  double temperature = std::numeric_limits<double>::quiet_NaN();
  const salt_phase* phase = nullptr;  ///< the salt that crystallises there
  /// Already supersaturated at the top of the solubility data (298.15 K): it crystallises
  /// at a higher temperature, not computed.
  bool above_data = false;
  std::string reason;  ///< why no temperature was found ("" otherwise)
};

/// The temperature at which a solution of fixed composition (no ice, nothing crystallised
/// yet) becomes saturated in a salt phase on cooling: the highest T in 219.15-298.15 K
/// with max over phases SI(T) = 0, SI rising as T falls. For a brine richer than the
/// eutectic composition this is its freezing point in the sense of the first solid to
/// form (hydrohalite from 25 wt% NaCl), above the metastable ice temperature.
/// Scanned downwards in 0.5 K steps, each bracket refined by TOMS 748 to 1e-10 K.
/// The same on the ion activities of a prepared model (the amounts of the solution it was
/// prepared for) in `water_kg` of liquid water (the ice curve passes its freezable water).
inline salt_crystallisation salt_crystallisation_temperature(models::ion_activity_model& ion_model,
                                                             double water_kg) {
  salt_crystallisation out;
  auto* ions = &ion_model;
  const double W = water_kg;
  const std::size_t n = ions->ion_slots();
  std::vector<double> n0(n), ln_act(n);
  ions->ion_moles(n0.data());
  const salt_phase* which = nullptr;
  auto max_si = [&](double T) {
    const double lnw = ions->ln_water_activity_of_ions(n0.data(), W, T, ln_act.data());
    double best = -std::numeric_limits<double>::infinity();
    for (const auto& ph : salt_phases()) {
      double si = ph.water * lnw - ph.ln_k(T, ions->parameter_set());
      bool present = true;
      for (const auto& [ion, count] : ph.ions) {
        const auto g = data::pitzer_ion_index(ion);
        const auto k = g < data::pitzer_ion_count ? ions->slot_of(g) : n;
        if (k >= n || !(n0[k] > 0.0)) {
          present = false;
          break;
        }
        si += count * ln_act[k];
      }
      if (present && si > best) {
        best = si;
        which = &ph;
      }
    }
    return best;
  };
  double T_hi = salt_phase_max_temperature;
  double f_hi = max_si(T_hi);
  if (f_hi > 0.0) {
    out.above_data = true;
    out.phase = which;
    out.temperature = T_hi;
    out.reason = "salt_crystallisation_temperature: already supersaturated in " +
                 detail::salt_phase_label(*which) + " at " + validity::fmt(T_hi) +
                 " K, the top of the solubility data: it crystallises at a higher temperature";
    return out;
  }
  if (!std::isfinite(f_hi)) {
    out.reason = "salt_crystallisation_temperature: no salt phase can form from these ions";
    return out;
  }
  for (double T = T_hi - 0.5; T >= salt_phase_min_temperature - 1e-9; T -= 0.5) {
    const double f = max_si(T);
    if (f > 0.0) {
      const auto root = toms748_root(max_si, T, T_hi, f, f_hi, 50, 200);
      if (root.status != root_status::converged) break;
      out.temperature = root.x;
      max_si(std::nextafter(root.x, 0.0));  // the phase just below the crossing
      out.phase = which;
      return out;
    }
    T_hi = T;
    f_hi = f;
  }
  out.reason = "salt_crystallisation_temperature: no salt saturates between " +
               validity::fmt(salt_phase_min_temperature) + " and " +
               validity::fmt(salt_phase_max_temperature) + " K";
  return out;
}

inline salt_crystallisation salt_crystallisation_temperature(const solution& s,
                                                             const models::model_choice& m = "auto") {
  models::ln_water_activity_evaluator ln_aw(m, s);
  auto* ions = s.has_electrolytes() && ln_aw.model().traits.ion_activities ? ln_aw.ions() : nullptr;
  if (ions == nullptr) {
    salt_crystallisation out;
    out.reason = "salt_crystallisation_temperature: needs electrolytes and a model with ion "
                 "activities ('auto', 'pitzer' or 'ross')";
    return out;
  }
  return salt_crystallisation_temperature(*ions, s.water_mass());
}

}  // namespace colligate::equilibria
