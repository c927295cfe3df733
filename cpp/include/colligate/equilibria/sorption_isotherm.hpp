#pragma once
/// \file sorption_isotherm.hpp
/// Water sorption isotherms of foods: equilibrium moisture content X (kg water per kg dry
/// solids) against water activity a_w, and back.
///
///     GAB   (Guggenheim 1966; Anderson 1946; de Boer 1953; as in van den Berg 1985):
///           X = Xm C K a / ((1 - K a) (1 - K a + C K a))
///     BET   (Brunauer, Emmett & Teller 1938):  X = Xm C a / ((1 - a) (1 + (C - 1) a)),
///           meant for a_w up to about 0.45
///     Oswin (Oswin 1946):                      X = A (a / (1 - a))^B
///
/// Temperature: at constant moisture the net isosteric heat of sorption q_st (J/mol, the
/// heat beyond that of condensing pure water) moves a_w by Clausius-Clapeyron,
///     d ln a_w / d(1/T) = - q_st / R.
/// isosteric_heat() takes it from two isotherms at two temperatures; shift_water_activity()
/// applies it.

#include <cmath>
#include <limits>
#include <string>

#include "colligate/core/constants.hpp"
#include "colligate/core/errors.hpp"
#include "colligate/core/roots.hpp"
#include "colligate/core/validity.hpp"

namespace colligate::equilibria {

enum class isotherm_model { gab, bet, oswin };

inline const char* to_string(isotherm_model m) {
  switch (m) {
    case isotherm_model::gab: return "gab";
    case isotherm_model::bet: return "bet";
    case isotherm_model::oswin: return "oswin";
  }
  return "unknown";
}

inline isotherm_model isotherm_model_from_string(const std::string& s) {
  if (s == "gab") return isotherm_model::gab;
  if (s == "bet") return isotherm_model::bet;
  if (s == "oswin") return isotherm_model::oswin;
  throw invalid_input("sorption isotherm model '" + s + "' is not known (use 'gab', 'bet' or 'oswin')");
}

/// One isotherm at one temperature. Parameters by model:
///   gab: p1 = Xm (kg/kg dry solids), p2 = C, p3 = K (0 < K < 1)
///   bet: p1 = Xm, p2 = C
///   oswin: p1 = A (kg/kg dry solids), p2 = B
struct sorption_isotherm {
  isotherm_model model = isotherm_model::gab;
  double p1 = 0.0, p2 = 0.0, p3 = 0.0;
  double temperature = 298.15;  ///< K, of the data the constants come from
  /// Range of water activity of the data the constants were fitted to (NaN: not known).
  double aw_min = std::numeric_limits<double>::quiet_NaN();
  double aw_max = std::numeric_limits<double>::quiet_NaN();

  /// Checks the parameters; throws invalid_input naming the bad one.
  void validate() const {
    const char* where = "sorption_isotherm";
    auto positive = [&](const char* n, double v) {
      if (!(std::isfinite(v) && v > 0.0))
        throw invalid_input(colligate::detail::describe(where, n, v, "must be finite and > 0"));
    };
    positive(model == isotherm_model::oswin ? "A" : "Xm", p1);
    positive(model == isotherm_model::oswin ? "B" : "C", p2);
    if (model == isotherm_model::gab && !(std::isfinite(p3) && p3 > 0.0 && p3 < 1.0))
      throw invalid_input(colligate::detail::describe(where, "K", p3, "must be in (0, 1)"));
    if (!(std::isfinite(temperature) && temperature > 0.0))
      throw invalid_input(colligate::detail::describe(where, "temperature", temperature, "must be finite and > 0 K"));
  }

  /// Equilibrium moisture content X (kg water / kg dry solids) at water activity a in (0, 1).
  double moisture(double a) const {
    if (!(std::isfinite(a) && a > 0.0 && a < 1.0))
      throw invalid_input(colligate::detail::describe("sorption_isotherm.moisture", "water_activity", a,
                                                      "must be in (0, 1)"));
    return moisture_unchecked(a);
  }

  /// Water activity in (0, 1) at moisture X > 0 (kg/kg dry solids): the inverse of moisture().
  double water_activity(double x) const {
    if (!(std::isfinite(x) && x > 0.0))
      throw invalid_input(colligate::detail::describe("sorption_isotherm.water_activity", "moisture", x,
                                                      "must be finite and > 0 kg water per kg dry solids"));
    if (model == isotherm_model::oswin) {  // closed form
      const double r = std::pow(x / p1, 1.0 / p2);
      return r / (1.0 + r);
    }
    // X(a) rises monotonically from 0 to infinity on (0, a_max), a_max = 1 (BET) or 1/K (GAB).
    const double a_hi = model == isotherm_model::gab ? std::min(1.0, 1.0 / p3) : 1.0;
    auto f = [&](double a) { return moisture_unchecked(a) - x; };
    double lo = 1e-12, hi = a_hi * (1.0 - 1e-12);
    const double f_lo = f(lo), f_hi = f(hi);
    if (!(f_hi > 0.0)) return hi;  // beyond the isotherm's reach below a_w = 1 (GAB, K < 1)
    const auto r = toms748_root(f, lo, hi, f_lo, f_hi, 50, 200);
    return r.x;
  }

  /// The record of a water activity outside the data the constants were fitted to.
  validity check(double a) const {
    if (std::isnan(aw_min) || std::isnan(aw_max) || (a >= aw_min && a <= aw_max)) return {};
    return outside_range(std::string("sorption isotherm '") + to_string(model) + "'", "water activity", a,
                         aw_min, aw_max, "", "outside the water activities of the data it was fitted to");
  }

  /// d X / d a at a (for moisture balances).
  double moisture_slope(double a) const {
    const double h = 1e-6 * std::max(a, 1e-3);
    return (moisture_unchecked(a + h) - moisture_unchecked(a - h)) / (2.0 * h);
  }

  double moisture_unchecked(double a) const {
    switch (model) {
      case isotherm_model::gab: {
        const double ka = p3 * a;
        return p1 * p2 * ka / ((1.0 - ka) * (1.0 - ka + p2 * ka));
      }
      case isotherm_model::bet: return p1 * p2 * a / ((1.0 - a) * (1.0 + (p2 - 1.0) * a));
      case isotherm_model::oswin: return p1 * std::pow(a / (1.0 - a), p2);
    }
    return std::numeric_limits<double>::quiet_NaN();
  }
};

/// Net isosteric heat of sorption (J/mol) at moisture X from isotherms at two temperatures
/// (Clausius-Clapeyron between them): q = R ln(a2 / a1) / (1/T1 - 1/T2).
inline double isosteric_heat(const sorption_isotherm& at_t1, const sorption_isotherm& at_t2, double moisture) {
  if (!(at_t1.temperature != at_t2.temperature))
    throw invalid_input(colligate::detail::describe("isosteric_heat", "temperature", at_t2.temperature,
                                                    "the two isotherms need different temperatures"));
  const double a1 = at_t1.water_activity(moisture), a2 = at_t2.water_activity(moisture);
  return constants::gas_constant * std::log(a2 / a1) / (1.0 / at_t1.temperature - 1.0 / at_t2.temperature);
}

/// Water activity at T (K), same moisture, from a_w at T_ref and the net isosteric heat
/// q_st (J/mol): ln a(T) = ln a(T_ref) - q_st / R (1/T - 1/T_ref). Capped at 1.
inline double shift_water_activity(double aw_ref, double t_ref, double temperature, double isosteric_heat_j_per_mol) {
  if (!(std::isfinite(aw_ref) && aw_ref > 0.0 && aw_ref < 1.0))
    throw invalid_input(colligate::detail::describe("shift_water_activity", "water_activity", aw_ref, "must be in (0, 1)"));
  const double ln_a = std::log(aw_ref) - isosteric_heat_j_per_mol / constants::gas_constant *
                                             (1.0 / temperature - 1.0 / t_ref);
  return std::min(1.0, std::exp(ln_a));
}

}  // namespace colligate::equilibria
