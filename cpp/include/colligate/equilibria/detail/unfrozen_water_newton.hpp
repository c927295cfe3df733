#pragma once
/// \file unfrozen_water_newton.hpp
/// The unfrozen water of a solution in equilibrium with ice at one temperature, for a model
/// with d ln a_w / d W in closed form (ideal, Raoult, Norrish:
/// activity_evaluator::ln_water_activity_with_slope), without a general root finder.
///
/// Newton on f(v) = ln a_w(1 / v) - ln a_w,ice in v = 1 / W_u, falling in v, with
/// df/dv = -W_u^2 (d ln a_w / d W). For the dilute ideal law ln a_w is proportional to v, so
/// one step lands on the root; for the others f is close to linear in v (two to four
/// steps). Working in 1 / W_u rather than ln W_u (the earlier form, Newton on
/// ln(-ln a_w) against ln W_u) needs no logarithm or exponential per step besides the model's
/// own. It starts from v = 1 / W (all freezable water liquid, f > 0 there when the solution
/// is below its freezing point). Every evaluation narrows the bracket [lo, hi] (f(lo) > 0 >
/// f(hi)); a step leaving it is bisected once hi is known. Stops when a step is below 1e-8 of
/// v (the error left is of the order of its square, about 1e-16 relative).

#include <cmath>
#include <limits>

#include "colligate/core/roots.hpp"
#include "colligate/models/water_activity.hpp"

namespace colligate::equilibria::detail {

/// Root u = ln W_u (water in kg) of ln a_w(W_u) = ln_aw_ice at T, from W. Status
/// no_sign_change when the model has no closed-form derivative, ln a_w is not negative,
/// or f(1 / W) <= 0 (not frozen); max_iterations after 60 evaluations. Callers fall back on
/// solve_on_log_water (core/roots.hpp) for anything but converged.
///
/// `at_W`, if given, holds ln a_w and d ln a_w / d W at W and T as with_slope() gives them
/// (the caller evaluated them already): the first evaluation is then skipped.
inline root_result unfrozen_water_by_slope(models::ln_water_activity_evaluator& ln_aw, double W,
                                          double T, double ln_aw_ice,
                                          const double* at_W = nullptr) {
  root_result r;
  if (!(ln_aw_ice < 0.0) || !(W > 0.0)) return r;
  double l = 0.0, dl_dW = 0.0;
  double v = 1.0 / W;
  double Wu = W;  // 1 / v (W itself at the start)
  if (at_W != nullptr) {
    l = at_W[0];
    dl_dW = at_W[1];
  } else if (!ln_aw.with_slope(W, T, l, dl_dW)) {
    return r;
  }
  double lo = v, hi = std::numeric_limits<double>::infinity();
  const auto done = [&r, &lo, &hi](double root) {
    r.x = -std::log(root);  // u = ln W_u
    r.lo = -std::log(hi);
    r.hi = -std::log(lo);
    r.status = root_status::converged;
    return r;
  };
  for (int it = 0; it < 60; ++it) {
    r.iterations = it + 1;
    if (!(l < 0.0) || !std::isfinite(dl_dW)) return r;
    const double f = l - ln_aw_ice;
    if (f > 0.0) {
      lo = v;
    } else if (f < 0.0) {
      if (it == 0) return r;  // not below the freezing point
      hi = v;
    } else {
      return done(v);
    }
    const double df = -(Wu * Wu) * dl_dW;  // df/dv < 0
    double next = v - f / df;
    if (!std::isfinite(next)) return r;
    // a step below the tolerance is accepted also when it lands on a bracket end
    const bool converged = std::abs(next - v) <= 1e-8 * v && next >= lo && next <= hi;
    if (converged) return done(next);
    if (!(next > lo && next < hi)) {
      if (std::isinf(hi)) return r;
      next = 0.5 * (lo + hi);
    }
    v = next;
    Wu = 1.0 / v;
    ln_aw.with_slope(Wu, T, l, dl_dW);
  }
  r.status = root_status::max_iterations;
  return r;
}

}  // namespace colligate::equilibria::detail
