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

#include <boost/math/tools/roots.hpp>
#include <cmath>
#include <cstdint>
#include <cstdio>
#include <string>

#include "colligate/core/solution.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/models/norrish.hpp"
#include "colligate/models/pitzer.hpp"

namespace colligate::models {

namespace detail {

/// ln a_w of one class alone (electrolytes: Pitzer, non-electrolytes: Norrish).
inline double class_ln_water_activity(const solution& part, data::solute_class kind, double W,
                                      double T) {
  return kind == data::solute_class::electrolyte ? pitzer::ln_water_activity(part, W, T)
                                                 : norrish::ln_water_activity(part, W, T);
}

/// Water (kg) that `part` alone needs to reach ln a_w = target (< 0), found on ln W.
inline double water_for_activity(const solution& part, data::solute_class kind, double target,
                                  double T, double W_hint) {
  auto f = [&](double u) { return class_ln_water_activity(part, kind, std::exp(u), T) - target; };
  double lo = std::log(W_hint), hi = lo;
  double flo = f(lo), fhi = flo;
  // ln a_w rises with W: widen until f(lo) < 0 < f(hi).
  for (int i = 0; i < 60 && !(fhi > 0.0); ++i) fhi = f(hi += 1.0);
  for (int i = 0; i < 60 && !(flo < 0.0); ++i) flo = f(lo -= 1.0);
  if (!(flo < 0.0) || !(fhi > 0.0)) return std::nan("");
  std::uintmax_t it = 100;
  boost::math::tools::eps_tolerance<double> tol(40);
  const auto [a, b] = boost::math::tools::toms748_solve(f, lo, hi, flo, fhi, tol, it);
  return std::exp(0.5 * (a + b));
}

}  // namespace detail

/// ZSR water activity of a salt + non-electrolyte mixture with `water_kg` of water.
/// Reduces to the single model when only one class is present.
inline double zsr_ln_water_activity(const solution& s, double water_kg, double temperature) {
  using data::solute_class;
  const bool el = s.has_electrolytes(), ne = s.has_non_electrolytes();
  if (!el && !ne) return 0.0;
  if (!ne) return pitzer::ln_water_activity(s, water_kg, temperature);
  if (!el) return norrish::ln_water_activity(s, water_kg, temperature);
  const auto ions = s.only(solute_class::electrolyte);
  const auto neutral = s.only(solute_class::non_electrolyte);
  const double l_el = pitzer::ln_water_activity(ions, water_kg, temperature);
  const double l_ne = norrish::ln_water_activity(neutral, water_kg, temperature);
  if (l_el == 0.0) return l_ne;  // a class present with zero amounts counts as absent
  if (l_ne == 0.0) return l_el;
  // g(target) = sum_k W_k(target) - W rises with the target activity: at the lower of
  // the two single-class values one class needs all of W, so g > 0; far below, g < 0.
  auto g = [&](double target) {
    return detail::water_for_activity(ions, solute_class::electrolyte, target, temperature,
                                      water_kg) +
           detail::water_for_activity(neutral, solute_class::non_electrolyte, target,
                                      temperature, water_kg) -
           water_kg;
  };
  double hi = std::min(l_el, l_ne), lo = l_el + l_ne;
  double ghi = g(hi), glo = g(lo);
  for (int i = 0; i < 30 && !(glo < 0.0); ++i) glo = g(lo *= 1.5);
  if (!(glo < 0.0) || !(ghi > 0.0)) return std::nan("");
  std::uintmax_t it = 100;
  boost::math::tools::eps_tolerance<double> tol(40);
  const auto [a, b] = boost::math::tools::toms748_solve(g, lo, hi, glo, ghi, tol, it);
  return 0.5 * (a + b);
}

struct ross {
  static constexpr const char* id = "ross";
  /// Largest |a_w(Ross) - a_w(ZSR)| accepted before the mixture is flagged.
  static constexpr double max_rule_disagreement = 0.005;

  static double ln_water_activity(const solution& s, double water_kg, double temperature) {
    double out = 0.0;
    if (s.has_electrolytes())
      out += pitzer::ln_water_activity(s.only(data::solute_class::electrolyte), water_kg,
                                       temperature);
    if (s.has_non_electrolytes())
      out += norrish::ln_water_activity(s.only(data::solute_class::non_electrolyte), water_kg,
                                        temperature);
    return out;
  }

  static validity check(const solution& s, double water_kg, double temperature) {
    validity v;
    const bool el = s.has_electrolytes(), ne = s.has_non_electrolytes();
    if (el) v.merge(pitzer::check(s.only(data::solute_class::electrolyte), water_kg, temperature));
    if (ne)
      v.merge(norrish::check(s.only(data::solute_class::non_electrolyte), water_kg, temperature));
    if (!v.in_range() || !el || !ne) return v;
    const double a_ross = std::exp(ln_water_activity(s, water_kg, temperature));
    const double a_zsr = std::exp(zsr_ln_water_activity(s, water_kg, temperature));
    if (!(std::abs(a_ross - a_zsr) <= max_rule_disagreement)) {
      char buf[200];
      std::snprintf(buf, sizeof buf,
                    "the Ross (%.4f) and ZSR (%.4f) combining rules differ by more than 0.005 "
                    "in a_w; salt-sugar interactions are no longer negligible",
                    a_ross, a_zsr);
      v.reason = std::string("model 'ross': salt + non-electrolyte mixture: ") + buf;
    }
    return v;
  }
};

}  // namespace colligate::models
