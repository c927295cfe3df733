#pragma once
/// \file roots.hpp
/// The one root-finding layer of colligate: thin wrappers over Boost.Math tools/roots
/// (TOMS 748, Alefeld, Potra & Shi 1995) that return a status instead of throwing, the
/// bracket searches the models and equilibria need, bisection of a boundary, and a
/// safeguarded Newton iteration. The freezing-point solver (equilibria/freezing_point.hpp)
/// is the one specialised iteration kept apart: it mixes an exact and a secant slope. A reversed bracket or a bracket without a
/// sign change is reported as a status (the callers turn it into an error where it is
/// a caller mistake).

#include <boost/math/policies/error_handling.hpp>
#include <boost/math/tools/roots.hpp>
#include <cmath>
#include <cstdint>
#include <exception>
#include <limits>
#include <stdexcept>
#include <utility>

#include "colligate/core/errors.hpp"

namespace colligate {

enum class root_status : std::uint8_t {
  converged,       ///< bracket narrowed to the tolerance
  no_sign_change,  ///< f has the same sign at both ends (or is NaN there)
  max_iterations   ///< stopped before reaching the tolerance
};

struct root_result {
  double x = std::numeric_limits<double>::quiet_NaN();  ///< midpoint of the final bracket
  double lo = std::numeric_limits<double>::quiet_NaN(), hi = lo;
  root_status status = root_status::no_sign_change;
  int iterations = 0;
};

/// Root of f in [lo, hi] given f(lo) and f(hi) of opposite signs, by TOMS 748 to `bits`
/// bits of relative precision in at most `max_iterations` evaluations.
template <class F>
root_result toms748_root(F&& f, double lo, double hi, double f_lo, double f_hi, int bits = 50,
                         int max_iterations = 100) {
  root_result r;
  if (!(f_lo * f_hi < 0.0)) return r;
  if (!(lo < hi)) return r;
  std::uintmax_t it = static_cast<std::uintmax_t>(max_iterations);
  boost::math::tools::eps_tolerance<double> tol(bits);
  std::pair<double, double> ab;
  try {
    // Boost reports a lost bracket (f NaN inside, say) by throwing its own text; the
    // callers get a status and phrase the error in their own terms.
    ab = boost::math::tools::toms748_solve(f, lo, hi, f_lo, f_hi, tol, it);
  } catch (const out_of_validity_range&) {
    throw;  // a colligate error from f: not Boost's
  } catch (const std::domain_error&) {
    return r;
  } catch (const boost::math::evaluation_error&) {
    return r;
  }
  const auto [a, b] = ab;
  r.lo = a;
  r.hi = b;
  r.x = 0.5 * (a + b);
  r.iterations = static_cast<int>(it);
  r.status = it >= static_cast<std::uintmax_t>(max_iterations) ? root_status::max_iterations
                                                               : root_status::converged;
  return r;
}

/// Root of g(u) on u = ln W (water mass) below u_hi, where g(u_hi) > 0 and g falls as
/// water is removed (the ice equilibrium of the unfrozen water). The lower end is moved
/// down by 2 (86 % of the water frozen), then by 1/2 at a time to 8 below u_hi, then by 4
/// at a time to 60 below u_hi, until g < 0 there. The fine steps matter: a virial model
/// (Pitzer) far beyond its fitted molality may turn back up or give no value, so a coarse
/// step can jump over the one physical root into that region and find no sign change
/// (a KCl + CaCl2 brine at 87 % ice lost its curve from 252 to 232 K that way).
template <class G>
root_result solve_on_log_water(G&& g, double u_hi) {
  const double g_hi = g(u_hi);
  double u_top = u_hi, g_top = g_hi;  // the last point above the root (g > 0)
  double u_lo = u_hi - 2.0;
  double g_lo = g(u_lo);
  for (int k = 0; !(g_lo < 0.0) && k < 12 + 13; ++k) {
    if (g_lo > 0.0) u_top = u_lo, g_top = g_lo;
    u_lo -= k < 12 ? 0.5 : 4.0;  // to 8 below u_hi by 1/2, then to 60 below by 4
    g_lo = g(u_lo);
  }
  if (!(g_lo < 0.0)) return {};
  return toms748_root(g, u_lo, u_top, g_lo, g_top, 50, 100);
}

/// Root of h(u) (rising in u) near u0: the bracket is widened by 1 at a time on each side
/// (at most 60 steps) until h changes sign, then TOMS 748 to `bits` bits.
template <class H>
root_result solve_rising(H&& h, double u0, int bits = 40) {
  double lo = u0, hi = u0;
  double flo = h(lo), fhi = flo;
  for (int i = 0; i < 60 && !(fhi > 0.0); ++i) fhi = h(hi += 1.0);
  for (int i = 0; i < 60 && !(flo < 0.0); ++i) flo = h(lo -= 1.0);
  if (!(flo < 0.0) || !(fhi > 0.0)) return {};
  return toms748_root(h, lo, hi, flo, fhi, bits, 100);
}

/// The boundary between `pred` true (at lo) and false (at hi) by bisection, until the
/// bracket is at most `tolerance` wide or `max_iterations` halvings are done; x is the
/// last `lo` (where pred holds).
template <class P>
root_result bisect_boundary(P&& pred, double lo, double hi, double tolerance,
                            int max_iterations = 200) {
  root_result r;
  int k = 0;
  for (; k < max_iterations && std::abs(hi - lo) > tolerance; ++k) {
    const double mid = 0.5 * (lo + hi);
    (pred(mid) ? lo : hi) = mid;
  }
  r.lo = lo;
  r.hi = hi;
  r.x = lo;
  r.iterations = k;
  r.status = std::abs(hi - lo) <= tolerance ? root_status::converged : root_status::max_iterations;
  return r;
}

/// Root of an increasing f on [lo, hi] by Newton steps with `slope(x)`, replaced by
/// bisection when a step leaves the bracket; stops when a step is at most
/// `relative_tolerance * |x|` (tested before the bracket, since at the root a step may
/// land on a bound).
template <class F, class S>
root_result safeguarded_newton(F&& f, S&& slope, double lo, double hi, double x0,
                               double relative_tolerance, int max_iterations = 60) {
  root_result r;
  double x = (x0 > lo && x0 < hi) ? x0 : 0.5 * (lo + hi);
  for (int i = 0; i < max_iterations; ++i) {
    const double fx = f(x);
    if (fx > 0.0) hi = x; else lo = x;
    double next = x - fx / slope(x);
    if (std::abs(next - x) <= relative_tolerance * std::abs(x)) {
      r.x = next;
      r.lo = lo;
      r.hi = hi;
      r.iterations = i + 1;
      r.status = root_status::converged;
      return r;
    }
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    x = next;
  }
  r.x = x;
  r.lo = lo;
  r.hi = hi;
  r.iterations = max_iterations;
  r.status = root_status::max_iterations;
  return r;
}

}  // namespace colligate
