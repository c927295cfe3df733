#pragma once
/// \file unfrozen_water_newton.hpp
/// The unfrozen water of a solution in equilibrium with ice at one temperature, for a model
/// with d ln a_w / d W in closed form (ideal, Raoult, Norrish:
/// activity_evaluator::ln_water_activity_with_slope), without a general root finder.
///
/// Newton on h(u) = ln(-ln a_w,ice) - ln(-ln a_w(e^u)), u = ln W_u, rising in u, with
/// dh/du = -W_u (d ln a_w / d W) / ln a_w. For the ideal law ln a_w is proportional to 1/W,
/// so h is linear in u and one step lands on the root; for the others h is close to linear
/// (two to four steps). It starts from u = ln W (all freezable water liquid, h > 0 there
/// when the solution is below its freezing point). Every evaluation narrows the bracket
/// [lo, hi] (h(lo) < 0 < h(hi)); a step leaving it is bisected once lo is known. Stops when
/// a step is below 1e-8 (the error left is of the order of its square, about 1e-16).

#include <cmath>
#include <limits>

#include "colligate/core/roots.hpp"
#include "colligate/models/water_activity.hpp"

namespace colligate::equilibria::detail {

/// Root u = ln W_u (water in kg) of ln a_w(W_u) = ln_aw_ice at T, from W. Status
/// no_sign_change when the model has no closed-form derivative, ln a_w is not negative,
/// or h(ln W) <= 0 (not frozen); max_iterations after 60 evaluations. Callers fall back on
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
  double u = std::log(W);
  double Wu = W;  // e^u
  if (at_W != nullptr) {
    l = at_W[0];
    dl_dW = at_W[1];
  } else if (!ln_aw.with_slope(W, T, l, dl_dW)) {
    return r;
  }
  const double target = std::log(-ln_aw_ice);
  double lo = -std::numeric_limits<double>::infinity(), hi = u;
  for (int it = 0; it < 60; ++it) {
    r.iterations = it + 1;
    if (!(l < 0.0) || !std::isfinite(dl_dW)) return r;
    const double h = target - std::log(-l);
    if (h > 0.0) {
      hi = u;
    } else if (h < 0.0) {
      if (it == 0) return r;  // not below the freezing point
      lo = u;
    } else {
      r.x = r.lo = r.hi = u;
      r.status = root_status::converged;
      return r;
    }
    const double dh = -Wu * dl_dW / l;  // dh/du > 0
    double next = u - h / dh;
    if (!std::isfinite(next)) return r;
    // a step below the tolerance is accepted also when it lands on a bracket end
    const bool converged = std::abs(next - u) <= 1e-8 && next >= lo && next <= hi;
    if (!converged && !(next > lo && next < hi)) {
      if (std::isinf(lo)) return r;
      next = 0.5 * (lo + hi);
    }
    if (converged) {
      r.x = next;
      r.lo = lo;
      r.hi = hi;
      r.status = root_status::converged;
      return r;
    }
    u = next;
    Wu = std::exp(u);
    ln_aw.with_slope(Wu, T, l, dl_dW);
  }
  r.status = root_status::max_iterations;
  return r;
}

}  // namespace colligate::equilibria::detail
