#pragma once
/// \file mixing.hpp
/// Combining rules for solutions that hold both electrolytes and non-electrolytes
/// (salt + sugar + alcohol): the electrolytes are described by the Pitzer model, the
/// non-electrolytes by the Norrish model, and the two are combined.
///
/// - Ross (1975), Food Technol. 29(3), 26: product rule. Each class is evaluated alone in
///   the same mass of water and the activities multiply:
///       ln a_w = ln a_w,Pitzer(electrolytes in W) + ln a_w,Norrish(non-electrolytes in W).
///   This is what model 'ross' (and 'auto' for mixtures) computes.
/// - Zdanovskii-Stokes-Robinson (ZSR; Stokes & Robinson 1966, J. Phys. Chem. 70, 2126):
///   at the mixture's water activity, the water of the mixture is the sum of the water
///   each class would need alone to reach that activity: sum_k W_k(a_w) = W. Given by
///   zsr_ln_water_activity() for comparison.
///
/// Both rules neglect the interaction between the classes (salt-sugar); they agree to
/// second order in concentration and part where both classes are concentrated. The
/// 'ross' check flags a mixture when the two rules differ by more than 0.005 in a_w
/// (colligate's choice: the typical uncertainty of a water-activity measurement, common
/// practice), since beyond that the neglected cross interactions are no longer small.

#include <cmath>
#include <cstdint>
#include <cstdio>
#include <limits>
#include <algorithm>
#include <array>
#include <memory>
#include <optional>
#include <string>
#include <vector>

#include "colligate/core/roots.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/models/detail/pitzer_system.hpp"
#include "colligate/models/norrish.hpp"
#include "colligate/models/pitzer.hpp"
#include "colligate/models/detail/describe_constants.hpp"
#include "colligate/models/evaluator.hpp"
#include "colligate/models/registry.hpp"

namespace colligate::models {

namespace detail {

/// The Ross product rule prepared once for one species list: the indices of the
/// electrolytes (with a Pitzer system prepared for them alone) and the Norrish constants of
/// the non-electrolytes. Evaluating it reads the amounts of the solution it was prepared
/// for (or of any solution with the same species, such as batch rows) and does no
/// allocation and no copy. Gives the same values, bit for bit, as evaluating each class
/// on a solution holding that class only (solution::only). Caches the Pitzer coefficients
/// of the last temperature: one per solve or per thread.
class ross_system {
 public:
  ross_system(const solution& s, const data::pitzer_parameter_set& set) {
    std::vector<std::size_t> electrolytes;
    for (std::size_t i = 0; i < s.size(); ++i) {
      if (s.species()[i].kind == data::solute_class::electrolyte)
        electrolytes.push_back(i);
      else
        non_electrolytes_.push_back(norrish::term_of(s, i));
    }
    if (!electrolytes.empty())
      electrolytes_.emplace(s.only(data::solute_class::electrolyte), set, electrolytes);
  }

  bool has_electrolytes() const noexcept { return electrolytes_.has_value(); }
  /// The Pitzer system of the electrolytes (requires has_electrolytes()).
  pitzer_system& electrolytes() { return *electrolytes_; }
  bool has_non_electrolytes() const noexcept { return !non_electrolytes_.empty(); }

  /// ln a_w of the electrolytes alone in `water_kg` (Pitzer); requires has_electrolytes().
  double ln_electrolytes(const double* moles, double water_kg, double temperature) {
    return electrolytes_->ln_water_activity(moles, water_kg, temperature);
  }
  /// ln a_w of the non-electrolytes alone in `water_kg` (Norrish).
  double ln_non_electrolytes(const double* moles, double water_kg) const {
    return norrish::ln_water_activity(non_electrolytes_.data(), non_electrolytes_.size(), moles,
                                      water_kg);
  }
  /// Ross: ln a_w = ln a_w,Pitzer(electrolytes in W) + ln a_w,Norrish(non-electrolytes in W).
  double ln_water_activity(const double* moles, double water_kg, double temperature) {
    double out = 0.0;
    if (has_electrolytes()) out += ln_electrolytes(moles, water_kg, temperature);
    if (has_non_electrolytes()) out += ln_non_electrolytes(moles, water_kg);
    return out;
  }
  /// Whether the Ross ln a_w has a closed-form temperature slope (the Norrish part does not
  /// depend on T; the Pitzer part has one unless a pair row is in the extended form).
  bool has_temperature_slope() const noexcept {
    return !has_electrolytes() || electrolytes_->has_temperature_slope();
  }
  /// ln_water_activity() (bit-identical) and d ln a_w / dT (1/K): the Pitzer part's slope.
  double ln_water_activity_with_temperature_slope(const double* moles, double water_kg,
                                                  double temperature, double& slope) {
    double out = 0.0;
    slope = 0.0;
    if (has_electrolytes())
      out += electrolytes_->ln_water_activity_with_temperature_slope(moles, water_kg,
                                                                     temperature, slope);
    if (has_non_electrolytes()) out += ln_non_electrolytes(moles, water_kg);
    return out;
  }
  /// The same with the Pitzer part regrouped per composition
  /// (pitzer_system::ln_water_activity_along_temperature): equal within rounding.
  double ln_water_activity_along_temperature(const double* moles, double water_kg,
                                             double temperature, double& slope) {
    double out = 0.0;
    slope = 0.0;
    if (has_electrolytes())
      out += electrolytes_->ln_water_activity_along_temperature(moles, water_kg, temperature,
                                                                slope);
    if (has_non_electrolytes()) out += ln_non_electrolytes(moles, water_kg);
    return out;
  }

 private:
  std::optional<pitzer_system> electrolytes_;
  std::vector<norrish::term> non_electrolytes_;
};

/// Water (kg) that one class alone needs to reach ln a_w = target (< 0), found on ln W;
/// `ln_aw(W)` is that class's ln a_w with W of water.
template <class LnAw>
double water_for_activity(LnAw&& ln_aw, double target, double W_hint) {
  // ln a_w rises with W: the bracket on ln W is widened until it changes sign.
  const auto r = solve_rising([&](double u) { return ln_aw(std::exp(u)) - target; },
                              std::log(W_hint), 40);
  return r.status == root_status::no_sign_change ? std::nan("") : std::exp(r.x);
}

/// ZSR ln a_w of a mixture holding both classes, on a prepared system, given each class's
/// ln a_w in all the water (l_el, l_ne < 0); see zsr_ln_water_activity below.
///
/// The ZSR condition sum_k W_k(a_w) = W is solved as one equation: the water splits into
/// W_e + W_n = W so that each class alone reaches the same activity,
///     f(v) = ln a_w,el(W_e) - ln a_w,ne(W_n) = 0,  W_e = W / (1 + e^-v),  W_n = W / (1 + e^v),
/// and f rises in v (each class's ln a_w rises with its own water). The start is the split
/// that is exact when both classes are ideal (ln a_w,k proportional to 1/W, so W_k is
/// proportional to -ln a_w,k(W)); the first step uses the slope of that ideal case,
/// -(1 - s) ln a_w,el - s ln a_w,ne with s = W_e / W, later steps the secant slope, each
/// kept inside the bracket of the values seen (bisection otherwise). Stops when a step in v
/// is below 1e-12 (a few evaluations: the rules differ only through the non-ideality).
///
/// Every split brackets the answer: where f(v) > 0 the split gives the electrolytes too much
/// water, so ln a_w,ne(W_n) <= ln a_w(ZSR) <= ln a_w,el(W_e), and the other way round where
/// f(v) < 0 (both class activities are monotone in their own water). After each evaluation
/// `enough(lo, hi)` is asked with that interval of ln a_w(ZSR); when it returns true the
/// solve stops there and `interval` holds {lo, hi} (the caller needed no more). Otherwise
/// the return value is the converged ZSR ln a_w (NaN when it cannot be found) and
/// `interval` is {NaN, NaN}.
template <class Enough>
double zsr_ln_water_activity(ross_system& sys, const double* moles, double water_kg,
                             double temperature, double l_el, double l_ne, Enough&& enough,
                             std::array<double, 2>& interval) {
  const double nan = std::numeric_limits<double>::quiet_NaN();
  interval = {nan, nan};
  if (!(l_el < 0.0) || !(l_ne < 0.0)) return nan;
  double le = 0.0, ln = 0.0, share = 0.0;  // at the last v: both ln a_w, W_e / W
  const auto f = [&](double v) {
    share = 1.0 / (1.0 + std::exp(-v));
    le = sys.ln_electrolytes(moles, water_kg * share, temperature);
    ln = sys.ln_non_electrolytes(moles, water_kg / (1.0 + std::exp(v)));
    return le - ln;
  };
  const auto ideal_slope = [&] { return -(1.0 - share) * le - share * ln; };
  double v = std::log(l_el / l_ne);
  double fv = f(v);
  double slope = ideal_slope();
  double lo = -std::numeric_limits<double>::infinity(), hi = -lo;
  for (int it = 0; it < 100; ++it) {
    if (std::isnan(fv)) return nan;
    if (fv == 0.0) return le;
    if (enough(std::min(le, ln), std::max(le, ln))) {
      interval = {std::min(le, ln), std::max(le, ln)};
      return le;
    }
    (fv < 0.0 ? lo : hi) = v;
    double next = v - fv / slope;
    if (!(next > lo && next < hi)) {  // outside the bracket (or a bad slope): bisect or widen
      if (std::isinf(lo)) next = hi - 1.0;
      else if (std::isinf(hi)) next = lo + 1.0;
      else next = 0.5 * (lo + hi);
    }
    if (std::abs(next - v) <= 1e-12 * std::max(1.0, std::abs(v)))
      return le;  // the step left changes ln a_w by about 1e-13
    const double f_next = f(next);
    slope = (f_next - fv) / (next - v);
    if (!(slope > 0.0) || !std::isfinite(slope)) slope = ideal_slope();
    v = next;
    fv = f_next;
  }
  return nan;
}

/// ZSR ln a_w of a mixture holding both classes, on a prepared system (see
/// zsr_ln_water_activity below), solved to convergence.
inline double zsr_ln_water_activity(ross_system& sys, const double* moles, double water_kg,
                                    double temperature) {
  const double l_el = sys.ln_electrolytes(moles, water_kg, temperature);
  const double l_ne = sys.ln_non_electrolytes(moles, water_kg);
  if (l_el == 0.0) return l_ne;  // a class present with zero amounts counts as absent
  if (l_ne == 0.0) return l_el;
  std::array<double, 2> unused;
  return zsr_ln_water_activity(sys, moles, water_kg, temperature, l_el, l_ne,
                               [](double, double) { return false; }, unused);
}

}  // namespace detail

/// ZSR water activity of a salt + non-electrolyte mixture with `water_kg` of water.
/// Reduces to the single model when only one class is present.
inline double zsr_ln_water_activity(const solution& s, double water_kg, double temperature) {
  const bool el = s.has_electrolytes(), ne = s.has_non_electrolytes();
  if (!el && !ne) return 0.0;
  if (!ne) return pitzer::ln_water_activity(s, water_kg, temperature);
  if (!el) return norrish::ln_water_activity(s, water_kg, temperature);
  detail::ross_system sys(s, pitzer::default_parameters());
  return detail::zsr_ln_water_activity(sys, s.moles().data(), water_kg, temperature);
}

struct ross {
  static constexpr const char* id = "ross";
  /// The registry entry (defined below).
  static model_descriptor descriptor();
  /// Largest |a_w(Ross) - a_w(ZSR)| accepted before the mixture is flagged.
  static constexpr double max_rule_disagreement = 0.005;

  /// The validated range: each class's own (Pitzer for the ions, Norrish for the
  /// non-electrolytes, less the limits on the other class) and the agreement of the two
  /// combining rules (the descriptor lists it; check() applies it).
  static const range_limit& rule_disagreement_limit() {  // built once, immutable
    static const range_limit limit{"|a_w(Ross) - a_w(ZSR)| of a salt + non-electrolyte mixture", "",
                                   0.0, max_rule_disagreement,
                                   "salt-sugar interactions are no longer negligible beyond it",
                                   "", ""};
    return limit;
  }

  /// ln a_w. Prepares the species once (detail::ross_system); a solver calling this many
  /// times on one solution holds a ross_system itself (ln_water_activity_evaluator).
  static double ln_water_activity(const solution& s, double water_kg, double temperature) {
    detail::ross_system sys(s, pitzer::default_parameters());
    return sys.ln_water_activity(s.moles().data(), water_kg, temperature);
  }

  /// Validity of each class's model and, for a mixture of both classes, the comparison of
  /// the Ross and ZSR rules at this state (one ZSR solve, a 1-D root on the water split: a solver
  /// calls it once, at its final state). `sys` must be prepared for the species of `s`.
  static validity check(const solution& s, double water_kg, double temperature,
                        detail::ross_system& sys, pitzer::check_memo* memo = nullptr,
                        const data::pitzer_parameter_set& set = pitzer::default_parameters()) {
    validity v = check_classes(s, water_kg, temperature, memo, set);
    if (v.in_range() && s.has_electrolytes() && s.has_non_electrolytes())
      compare_rules(v, s, water_kg, temperature, sys);
    return v;
  }

  static validity check(const solution& s, double water_kg, double temperature) {
    validity v = check_classes(s, water_kg, temperature);
    if (v.in_range() && s.has_electrolytes() && s.has_non_electrolytes()) {
      detail::ross_system sys(s, pitzer::default_parameters());
      compare_rules(v, s, water_kg, temperature, sys);
    }
    return v;
  }

 private:
  /// Each class checked by its model, as on a solution holding that class only
  /// (solution::only), without copying the solution (one check per batch row).
  static validity check_classes(const solution& s, double water_kg, double temperature,
                                pitzer::check_memo* memo = nullptr,
                                const data::pitzer_parameter_set& set = pitzer::default_parameters()) {
    validity v;
    if (s.has_electrolytes())
      v.merge(pitzer::check(s, water_kg, temperature, set,
                            pitzer::species_checked::electrolytes_only, memo));
    if (s.has_non_electrolytes())
      v.merge(norrish::check(s, water_kg, temperature, norrish::species_checked::non_electrolytes_only));
    return v;
  }

  /// Flags the state when |a_w(Ross) - a_w(ZSR)| exceeds the limit. Ross is the sum of the
  /// two class values in all the water, which the ZSR solve starts from; the ZSR solve stops
  /// as soon as its bracket on a_w(ZSR) lies wholly within the limit of a_w(Ross) (mostly
  /// after its first evaluation), and runs to convergence otherwise, so the decision is the
  /// one the converged value gives and a flagged state prints the converged ZSR value.
  static void compare_rules(validity& v, const solution& s, double water_kg, double temperature,
                            detail::ross_system& sys) {
    const double* moles = s.moles().data();
    const double l_el = sys.ln_electrolytes(moles, water_kg, temperature);
    const double l_ne = sys.ln_non_electrolytes(moles, water_kg);
    const double a_ross = std::exp(l_el + l_ne);  // = sys.ln_water_activity, bit for bit
    if (l_el == 0.0 || l_ne == 0.0) return;  // a class with zero amounts: the rules coincide
    const double limit = rule_disagreement_limit().high;
    const auto within_limit = [&](double lo, double hi) {
      return a_ross - std::exp(lo) <= limit && std::exp(hi) - a_ross <= limit;
    };
    std::array<double, 2> interval;
    const double l_zsr = detail::zsr_ln_water_activity(sys, moles, water_kg, temperature, l_el,
                                                       l_ne, within_limit, interval);
    if (!std::isnan(interval[0])) return;  // the whole bracket agrees with Ross
    const double a_zsr = std::exp(l_zsr);
    if (!(std::abs(a_ross - a_zsr) <= limit)) {
      char buf[200];
      std::snprintf(buf, sizeof buf,
                    "the Ross (%.4f) and ZSR (%.4f) combining rules differ by more than 0.005 "
                    "in a_w; salt-sugar interactions are no longer negligible",
                    a_ross, a_zsr);
      v = flagged(validity_code::rules_disagree, "model 'ross'", "salt + non-electrolyte mixture",
                  buf);
    }
  }
};


namespace detail {

/// Model 'ross' prepared for one species list (ross_system); the ion activities on the
/// Pitzer system of its electrolytes.
class ross_evaluator final : public pitzer_family_evaluator<ross_system> {
 public:
  ross_evaluator(const solution& s, const data::pitzer_parameter_set& set)
      : pitzer_family_evaluator(s, set) {
    if (system_.has_electrolytes()) ions_.emplace(system_.electrolytes(), s);
  }
  validity check(double water_kg, double temperature) override {
    return ross::check(*s_, water_kg, temperature, system_, &memo_, *set_);
  }
  /// Ross: the ions (Pitzer, with the ions that have no parameters as ideal particles)
  /// times the non-electrolytes (Norrish), each in `water_kg`.
  double ln_water_activity_of_ions(const double* n, double water_kg, double temperature,
                                   double* ln_activity) override {
    return -constants::molar_mass_water * ions_->particle_sum(n, water_kg, temperature, ln_activity) +
           system_.ln_non_electrolytes(s_->moles().data(), water_kg);
  }
};

}  // namespace detail

/// The registry entry of model 'ross' (models/builtin_models.hpp).
inline model_descriptor ross::descriptor() {
  model_descriptor d;
  d.id = id;
  d.summary = "Ross (1975) product rule, a_w = a_w(ions, Pitzer, parameter set '" +
              pitzer::default_parameters().id +
              "') * a_w(non-electrolytes, Norrish 1966 / Chirife et al. 1980), each evaluated "
              "in the same water";
  d.traits = {true, true, true};
  d.auto_rank = [](const solution& s) {
    return s.has_electrolytes() && s.has_non_electrolytes() ? 10 : 0;
  };
  d.prepare = [](const solution& s, const model_options& o) -> std::unique_ptr<activity_evaluator> {
    const auto& set = pitzer::parameters_for(o);
    pitzer::require_binaries(s, set);
    return std::make_unique<detail::ross_evaluator>(s, set);
  };
  d.describe = [](const solution& s, const model_options& o) {
    const auto& set = pitzer::parameters_for(o);
    std::string out = o.parameter_set.empty() ? "" : "; parameter set '" + set.id + "' chosen";
    return out + detail::describe_each(s, [&set](const data::solute_record& r) {
      return r.kind == data::solute_class::electrolyte
                 ? detail::describe_pitzer_pair(r, set)
                 : detail::describe_norrish_constants(r);
    });
  };
  const auto& set = pitzer::default_parameters();
  d.validated_range = {pitzer::temperature_limit(set), pitzer::aphi_temperature_limit(set),
                       pitzer::salt_molality_limit(), norrish::temperature_limit(),
                       norrish::mass_fraction_limit(), rule_disagreement_limit()};
  return d;
}

}  // namespace colligate::models
