#pragma once
/// \file norrish.hpp
/// Norrish model for non-electrolytes (sugars, polyols, glycols, ethanol, organic acids).
///
/// Single solute (Norrish 1966, J. Food Technol. 1, 25, eq. 7, in our sign convention,
/// K > 0 for sugars; cubic and quartic terms K3, K4 extend it to the concentrations of the freezing curve):
///
///     ln a_w = ln x_w - K x_s^2 - K3 x_s^3 - K4 x_s^4
///
/// Several solutes (Chirife, Ferro Fontan & Benmergui 1980, J. Food Technol. 15, 59, eq. 4):
///
///     ln a_w = ln x_w - (sum_{K_i > 0} sqrt(K_i) x_i)^2 - sum_{K_i <= 0} K_i x_i^2
///                     - sum_i (K3_i x_i^3 + K4_i x_i^4)
///
/// The published extension covers K > 0; solutes whose water activity lies above Raoult's
/// law (K < 0, e.g. lactic acid) and the higher-order terms are added per solute (colligate's
/// choice; it reduces to the single-solute form exactly).
///
/// Effective volume fraction (per solute, records with norrish_constants::volume_ratio
/// r != 1; only ethanol among the built-in solutes): the solute's K, K3 and K4 are taken in
/// z_i = x_i / (x_i + r (1 - x_i)), the effective volume fraction of Wohl's expansion
/// (Wohl 1946, Trans. AIChE 42, 215; r = q_water / q_solute), and the whole term is added
/// per solute, whatever the sign of K:
///
///     ln a_w = ... - (K_i z_i^2 + K3_i z_i^3 + K4_i z_i^4)
///
/// With r = 1, z = x and the term is the mole-fraction one; records with r = 1 go through
/// the mole-fraction code unchanged. Ethanol-water needs it: in x, three constants follow the
/// freezing curve only to 40 wt% and turn ln a_w upward beyond; in z they follow it to
/// 68 wt% with ln a_w falling strictly in x on [0, 1) (tools/fit_crc_norrish.py). A term
/// with d(ln a_w)/dx < 0 in its binary stays so in any mixture whose other terms do not rise
/// as water is removed (tests/cpp/models/test_ethanol.cpp). Mole fractions count every
/// dissolved particle: x_w = n_w / (n_w + sum nu_i n_i), so electrolytes, which have no
/// Norrish constant, contribute their ions as ideal particles until the electrolyte model
/// takes over.
///
/// Constants are at 25 C; they are used unchanged at other temperatures (the freezing
/// data they were checked against lie between 0 and -30 C). Validity per solute: its
/// binary-equivalent mass fraction (solute / (solute + water)) up to the record's
/// max_mass_fraction; temperatures 233.15-323.15 K.

#include <cmath>
#include <cstddef>
#include <string>
#include <vector>
#include <memory>

#include "colligate/core/constants.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/models/detail/describe_constants.hpp"
#include "colligate/models/detail/static_evaluator.hpp"
#include "colligate/models/registry.hpp"

namespace colligate::models {

struct norrish {
  static constexpr const char* id = "norrish";
  /// The registry entry (defined below).
  static model_descriptor descriptor();
  static constexpr double min_temperature = 233.15;
  static constexpr double max_temperature = 323.15;
  static constexpr double max_ionic_strength = 0.3;  // counted as Raoult particles

  /// The validated range (the descriptor lists it; check() applies it).
  static const range_limit& temperature_limit() {  // built once, immutable
    static const range_limit limit{"temperature", "K", min_temperature, max_temperature,
                                   "where its constants were checked",
                                   "", ""};
    return limit;
  }
  static const range_limit& mass_fraction_limit() {  // built once, immutable
    static const range_limit limit{"binary mass fraction of each solute", "",
                                   0.0, std::numeric_limits<double>::quiet_NaN(),
                                   "the highest concentration its constants were checked at",
                                   "",
                                   "each solute's Norrish range in the solute table (max mass "
                                   "fraction, source key)"};
    return limit;
  }
  static const range_limit& ionic_strength_limit() {  // built once, immutable
    static const range_limit limit{"ionic strength", "mol/kg", 0.0, max_ionic_strength,
                                   "electrolytes are counted as ideal ions, which fails beyond "
                                   "that",
                                   "", ""};
    return limit;
  }

  static double ln_water_activity(const solution& s, double water_kg, double /*temperature*/) {
    const auto& species = s.species();
    const double* moles = s.moles().data();
    return sum(s.size(), water_kg, [&](std::size_t i) {
      const auto& rec = species[i];
      return solute_view{static_cast<double>(rec.particles), moles[i], rec.norrish.available,
                         rec.norrish.k, rec.norrish.k3, rec.norrish.k4, rec.norrish.volume_ratio,
                         sqrt_of_positive(rec.norrish.k)};
    });
  }

  /// ln a_w (bit-identical to ln_water_activity) and its derivative with respect to the
  /// water mass, d ln a_w / d water_kg (1/kg), in closed form (see sum()).
  static void ln_water_activity_with_slope(const solution& s, double water_kg, double /*temperature*/,
                                           double& ln_aw, double& slope) {
    const auto& species = s.species();
    const double* moles = s.moles().data();
    ln_aw = sum(
        s.size(), water_kg,
        [&](std::size_t i) {
          const auto& rec = species[i];
          return solute_view{static_cast<double>(rec.particles), moles[i], rec.norrish.available,
                             rec.norrish.k, rec.norrish.k3, rec.norrish.k4, rec.norrish.volume_ratio,
                             sqrt_of_positive(rec.norrish.k)};
        },
        &slope);
  }

  /// The constants of one solute, copied out of its record, for evaluations on a subset of
  /// a solution's species (the non-electrolytes of a salt + sugar mixture, Ross rule).
  struct term {
    std::size_t species;  ///< index into the moles of the solution
    double particles;
    bool available;
    double k, k3, k4;
    double volume_ratio;  ///< 1: mole-fraction terms; else effective volume fraction
    double sqrt_k;        ///< sqrt(k) for k > 0, else 0
  };

  static term term_of(const solution& s, std::size_t i) {
    const auto& rec = s.species()[i];
    return {i, static_cast<double>(rec.particles), rec.norrish.available, rec.norrish.k,
            rec.norrish.k3, rec.norrish.k4, rec.norrish.volume_ratio,
            sqrt_of_positive(rec.norrish.k)};
  }

  /// ln a_w of the solutes `terms[0..n)` alone with `water_kg` of water, `moles` indexed
  /// like the solution the terms were taken from. The same sum as ln_water_activity() on a
  /// solution holding those solutes only, so bit-identical to it; no allocation.
  static double ln_water_activity(const term* terms, std::size_t n, const double* moles,
                                  double water_kg) {
    return sum(n, water_kg, [&](std::size_t i) {
      const auto& t = terms[i];
      return solute_view{t.particles, moles[t.species], t.available, t.k, t.k3, t.k4,
                         t.volume_ratio, t.sqrt_k};
    });
  }

  /// The same with d ln a_w / d water_kg (1/kg), as ln_water_activity_with_slope().
  static void ln_water_activity_with_slope(const term* terms, std::size_t n, const double* moles,
                                           double water_kg, double& ln_aw, double& slope) {
    ln_aw = sum(
        n, water_kg,
        [&](std::size_t i) {
          const auto& t = terms[i];
          return solute_view{t.particles, moles[t.species], t.available, t.k, t.k3, t.k4,
                             t.volume_ratio, t.sqrt_k};
        },
        &slope);
  }

  /// The water mass W_u (kg) at which ln a_w of the solutes `terms[0..n)` (amounts `moles`)
  /// equals `target` (< 0), below `water_kg`: the unfrozen water of the ice curve. With
  /// mole-fraction terms only (volume_ratio 1), every x_i is c_i t, where t = P / (n_w + P)
  /// is the total solute mole fraction and c_i = n_i / P is fixed by the amounts, so the
  /// sum of the file comment is a function of t alone:
  ///
  ///     ln a_w = ln(1 - t) - A2 t^2 - A3 t^3 - A4 t^4,
  ///     A2 = (sum_{K_i > 0} sqrt(K_i) c_i)^2 + sum_{K_i <= 0} K_i c_i^2,
  ///     A3 = sum K3_i c_i^3,  A4 = sum K4_i c_i^4,
  ///
  /// with closed-form first and second derivatives. Halley's iteration on
  /// g(t) = ln a_w(t) - target, inside the bracket (t(water_kg), 1) (g > 0 at its lower end
  /// when the solution is below its freezing point, g -> -inf at 1; a step leaving it is
  /// replaced by bisection), from the root of the series to second order,
  /// -t - (1/2 + A2) t^2 = target (one square root): about 1e-4 relative from the root,
  /// so one Halley step brings it within about 1e-12 and the next, whose size is below
  /// 1e-7 t, is taken without a further evaluation (what it leaves is of the order of the
  /// cube of it, below rounding). One logarithm per evaluation, two evaluations for the
  /// built-in sugars. Then W_u = M_w P (1 - t) / t. False (the caller takes the general
  /// Newton) for effective-volume-fraction terms (volume_ratio != 1), no solute, a target
  /// not below 0, a root not above t(water_kg), or no convergence in 60 steps.
  static bool water_for_ln_activity(const term* terms, std::size_t n, const double* moles,
                                    double water_kg, double target, double& water_out,
                                    int& iterations) {
    if (!(target < 0.0) || !(water_kg > 0.0)) return false;
    double P = 0.0;
    for (std::size_t i = 0; i < n; ++i) P += terms[i].particles * moles[terms[i].species];
    if (!(P > 0.0) || !std::isfinite(P)) return false;
    const double inv_P = 1.0 / P;
    double S = 0.0, A2 = 0.0, A3 = 0.0, A4 = 0.0;
    for (std::size_t i = 0; i < n; ++i) {
      const auto& t = terms[i];
      if (!t.available) continue;
      if (t.volume_ratio != 1.0) return false;
      const double c = moles[t.species] * inv_P, c2 = c * c;
      if (t.k > 0.0)
        S += t.sqrt_k * c;
      else
        A2 += t.k * c2;
      A3 += t.k3 * c2 * c;
      A4 += t.k4 * c2 * c2;
    }
    A2 += S * S;
    const double nw = water_kg / constants::molar_mass_water;
    double lo = P / (nw + P), hi = 1.0;  // g(lo) > 0 > g(hi)
    // Start: -t - (1/2 + A2) t^2 = target, the positive root written without cancellation.
    const double q = 0.5 + A2;
    double t = -2.0 * target / (1.0 + std::sqrt(1.0 - 4.0 * q * target));
    if (!(t > lo && t < hi)) t = 0.5 * (lo + hi);
    for (int it = 0; it < 60; ++it) {
      iterations = it + 1;
      const double u = 1.0 - t, inv_u = 1.0 / u;
      const double g = std::log1p(-t) - t * t * (A2 + t * (A3 + A4 * t)) - target;
      if (g > 0.0)
        lo = t;
      else if (g < 0.0)
        hi = t;
      else
        break;
      const double g1 = -inv_u - t * (2.0 * A2 + t * (3.0 * A3 + 4.0 * A4 * t));
      const double g2 = -inv_u * inv_u - (2.0 * A2 + t * (6.0 * A3 + 12.0 * A4 * t));
      const double step = 2.0 * g * g1 / (2.0 * g1 * g1 - g * g2);  // Halley
      double next = t - step;
      if (!std::isfinite(next)) return false;
      if (std::abs(step) <= 1e-7 * t && next >= lo && next <= hi) {
        t = next;
        break;
      }
      if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
      if (it == 59) return false;
      t = next;
    }
    if (!(t > P / (nw + P)) || !(t < 1.0)) return false;
    water_out = constants::molar_mass_water * P * ((1.0 - t) / t);
    return water_out > 0.0 && water_out <= water_kg;
  }

  /// Which species check() reads: all of them, or the non-electrolytes alone (the check of
  /// a solution holding only the non-electrolytes of `s`, as the Ross rule needs, without a
  /// copy: no ionic-strength limit then).
  enum class species_checked { all, non_electrolytes_only };

  static validity check(const solution& s, double water_kg, double temperature,
                        species_checked which = species_checked::all) {
    validity v;
    if (const auto& limit = temperature_limit(); !limit.contains(temperature)) {
      v = limit.outside("model 'norrish'", temperature);
      return v;
    }
    for (std::size_t i = 0; i < s.size(); ++i) {
      const auto& rec = s.species()[i];
      const double mass = s.moles()[i] * rec.molar_mass;
      if (rec.kind == data::solute_class::electrolyte) continue;
      if (!rec.norrish.available) {
        v = flagged(validity_code::missing_constants, "model 'norrish'", "solute '" + rec.id + "'",
                    "has no Norrish constant; counted as an ideal (Raoult) particle");
        return v;
      }
      const double w = mass / (mass + water_kg);
      if (w > rec.norrish.max_mass_fraction) {
        auto limit = mass_fraction_limit();  // per solute: the record's range and source
        limit.quantity = "binary mass fraction of '" + rec.id + "'";
        limit.high = rec.norrish.max_mass_fraction;
        limit.source = rec.norrish.k_source;
        v = limit.above("model 'norrish'", w, " (" + rec.norrish.note + ")");
        return v;
      }
    }
    if (which == species_checked::non_electrolytes_only) return v;
    const double I = s.ionic_strength(water_kg);
    if (const auto& limit = ionic_strength_limit(); I > limit.high)
      v = limit.above("model 'norrish'", I);
    return v;
  }

 private:
  /// One solute as the sum reads it: particles per formula unit, amount (mol) and the
  /// Norrish constants.
  struct solute_view {
    double particles;
    double moles;
    bool available;
    double k, k3, k4;
    double volume_ratio;
    double sqrt_k;  ///< sqrt(k) for k > 0 (correctly rounded: the same wherever it is taken)
  };

  static double sqrt_of_positive(double k) { return k > 0.0 ? std::sqrt(k) : 0.0; }

  /// K z^2 + K3 z^3 + K4 z^4 of one solute at mole fraction x, z = x / (x + r (1 - x)).
  static double volume_fraction_terms(const solute_view& v, double x) {
    const double r = v.volume_ratio;
    const double z = x / (x + r * (1.0 - x));
    return z * z * (v.k + z * (v.k3 + v.k4 * z));
  }

  /// The one implementation of the sum in the file comment (Norrish 1966 eq. 7; Chirife,
  /// Ferro Fontan & Benmergui 1980 eq. 4, extended as described there) over solutes
  /// 0..n-1, read through `view(i)` -> solute_view. Two passes: the mole total, then the
  /// terms, in index order (so every caller gets the same rounding).
  ///
  /// With `slope`, also d ln a_w / d water_kg (the value's arithmetic is unchanged). With
  /// n = n_w + sum nu_i n_i, every x_i = n_i / n has d x_i / d n_w = -x_i / n, so a term
  /// -g(x_i) contributes g'(x_i) x_i / n, -S^2 (S = sum sqrt(K_i) x_i) contributes
  /// 2 S^2 / n, and -ln(1 + P / n_w) contributes P / (n_w n); d n_w / d water_kg = 1 / M_w.
  template <class View>
  static double sum(std::size_t n, double water_kg, const View& view, double* slope = nullptr) {
    const double nw = water_kg / constants::molar_mass_water;
    // The particle moles are summed apart from the water: -ln x_w = ln(1 + P / n_w) keeps
    // its value for any P > 0 (a P below n_w's rounding made n_total - n_w exactly 0, and
    // a negative K then gave ln a_w > 0: found by fuzzing at 1e-77 kg of solute).
    double P = 0.0;
    for (std::size_t i = 0; i < n; ++i) {
      const solute_view v = view(i);
      P += v.particles * v.moles;
    }
    const double n_total = nw + P;
    // x_i = n_i / n_total as a product with one reciprocal (one division, not one per solute)
    const double inv_total = 1.0 / n_total;
    double sqrt_sum = 0.0, extra = 0.0;
    double d_extra = 0.0;  // sum of g'(x_i) x_i (slope only)
    for (std::size_t i = 0; i < n; ++i) {
      const solute_view v = view(i);
      if (!v.available) continue;
      const double x = v.moles * inv_total;
      if (v.volume_ratio != 1.0) {  // per-solute term in the effective volume fraction
        extra -= volume_fraction_terms(v, x);
        if (slope) {
          const double r = v.volume_ratio, q = x + r * (1.0 - x), z = x / q;
          d_extra += z * (2.0 * v.k + z * (3.0 * v.k3 + 4.0 * v.k4 * z)) * (r / (q * q)) * x;
        }
        continue;
      }
      if (v.k > 0.0)
        sqrt_sum += v.sqrt_k * x;
      else
        extra -= v.k * x * x;
      extra -= x * x * x * (v.k3 + v.k4 * x);
      if (slope)
        d_extra += (v.k > 0.0 ? 0.0 : 2.0 * v.k * x * x) + x * x * x * (3.0 * v.k3 + 4.0 * v.k4 * x);
    }
    if (slope) {
      *slope = (P / nw + 2.0 * sqrt_sum * sqrt_sum + d_extra) * inv_total /
               constants::molar_mass_water;
    }
    return -std::log1p(P / nw) - sqrt_sum * sqrt_sum + extra;
  }
};


namespace detail {

/// Model 'norrish' prepared for one species list: each solute's constants copied out of
/// its record once (norrish::term, sqrt(K) taken there), so an evaluation reads a short
/// array. The same sum as norrish::ln_water_activity on the solution, bit for bit.
///
/// The validity check is prepared too. For a species list of non-electrolytes that all have
/// Norrish constants (every batch of sugars, polyols and acids), a row is in range when T
/// lies in the temperature limit and each solute's binary mass fraction is at most its
/// record's limit: check() tests that on a short array of (molar mass, limit) with the same
/// arithmetic as norrish::check, and only a row that fails it (or a species list with
/// electrolytes or missing constants) goes through norrish::check, which builds the record.
/// So the record is the one norrish::check gives, and an in-range row costs no look-up in
/// the solute records.
class norrish_evaluator final : public activity_evaluator {
 public:
  explicit norrish_evaluator(const solution& s) : s_(&s) {
    terms_.reserve(s.size());
    for (std::size_t i = 0; i < s.size(); ++i) terms_.push_back(norrish::term_of(s, i));
    prepared_check_ = true;
    for (std::size_t i = 0; i < s.size(); ++i) {
      const auto& rec = s.species()[i];
      if (rec.kind == data::solute_class::electrolyte || !rec.norrish.available) {
        prepared_check_ = false;  // ionic strength or a missing-constants record: the full check
        break;
      }
      mass_limits_.push_back({i, rec.molar_mass, rec.norrish.max_mass_fraction});
    }
  }
  double ln_water_activity(double water_kg, double /*temperature*/) override {
    return norrish::ln_water_activity(terms_.data(), terms_.size(), s_->moles().data(), water_kg);
  }
  bool ln_water_activity_with_slope(double water_kg, double /*temperature*/, double& ln_aw,
                                    double& slope) override {
    norrish::ln_water_activity_with_slope(terms_.data(), terms_.size(), s_->moles().data(),
                                          water_kg, ln_aw, slope);
    return true;
  }
  bool water_for_ln_activity(double water_kg, double /*temperature*/, double target,
                             double& water_out, int& iterations) override {
    return norrish::water_for_ln_activity(terms_.data(), terms_.size(), s_->moles().data(),
                                          water_kg, target, water_out, iterations);
  }
  validity check(double water_kg, double temperature) override {
    if (prepared_check_ && in_range(water_kg, temperature)) return {};
    return norrish::check(*s_, water_kg, temperature);
  }

 private:
  /// One non-electrolyte's binary mass-fraction limit (norrish::check's test).
  struct mass_limit {
    std::size_t species;
    double molar_mass;         ///< kg/mol
    double max_mass_fraction;  ///< the record's Norrish range
  };

  /// True when norrish::check finds nothing (prepared_check_ only): the same comparisons
  /// on the same numbers, in the same order.
  bool in_range(double water_kg, double temperature) const {
    if (!temperature_limit_->contains(temperature)) return false;
    const double* moles = s_->moles().data();
    for (const auto& l : mass_limits_) {
      const double mass = moles[l.species] * l.molar_mass;
      const double w = mass / (mass + water_kg);
      if (w > l.max_mass_fraction) return false;
    }
    return true;
  }

  const solution* s_;
  std::vector<norrish::term> terms_;
  const range_limit* temperature_limit_ = &norrish::temperature_limit();
  bool prepared_check_ = false;  ///< non-electrolytes with constants only
  std::vector<mass_limit> mass_limits_;
};

}  // namespace detail

/// The registry entry of model 'norrish' (models/builtin_models.hpp).
inline model_descriptor norrish::descriptor() {
  auto d = detail::static_model_descriptor<norrish>(
      "Norrish (1966) with the multi-solute extension of Chirife et al. (1980)", {false, false},
      [](const solution& s) { return s.has_electrolytes() ? 0 : 10; }, &detail::describe_norrish_constants);
  d.prepare = [](const solution& s, const model_options&) -> std::unique_ptr<activity_evaluator> {
    return std::make_unique<detail::norrish_evaluator>(s);
  };
  d.validated_range = {temperature_limit(), mass_fraction_limit(), ionic_strength_limit()};
  return d;
}

}  // namespace colligate::models
