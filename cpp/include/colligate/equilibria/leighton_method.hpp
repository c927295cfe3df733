#pragma once
/// \file leighton_method.hpp
/// The dairy industry's freezing-curve method for ice-cream mixes: Leighton (1927),
/// J. Dairy Sci. 10, 300, in the form of Goff & Hartel (2013), Ice Cream, 7th ed., ch. 6
/// (Table 6.1 and Example Problems 13-14; read in a public reproduction of that section).
/// It is kept beside the thermodynamic ice curve (ice_fraction.hpp) so that a formulator
/// can compare with the figures of the dairy texts; it is not a water-activity model.
///
/// The method, all amounts in g per 100 g of mix:
///
///     SE      = sum of sugars as sucrose equivalents (g)
///     FPD_SE  = Table 6.1 at SE * 100 / W          (W = liquid water)
///     FPD_SA  = 2.37 (MSNF + WS) / W               (milk salts of the milk solids)
///     FPD_T   = FPD_SE + FPD_SA,   T = 273.15 K - FPD_T
///
/// and, for the freezing curve, W is replaced by the water left liquid, W (1 - f), for a
/// fraction f of the water frozen. Goff & Hartel's factors for SE are molar-mass ratios
/// to sucrose (1 for disaccharides, 1.9 for hexoses, 342/M for "low molecular weight
/// sweeteners"); here every dissolved non-electrolyte counts with 342.30 g/mol / M. The
/// factor 2.37 applies to the whole milk solids-not-fat; colligate's milk solids carry
/// milk salts at 0.099 of MSNF (ingredients.MSNF_SPLIT, Leighton's average milk), so the
/// milk-salt term is 2.37 / 0.099 = 23.94 K per g of milk salts per 100 g of water.
/// Electrolytes other than milk salts are outside the method: the result then carries a
/// reason (and they are left out).
///
/// Table 6.1 ends at 180 g sucrose per 100 g water (64.3 wt%). Beyond it the depression
/// is extrapolated linearly with the slope of the table's last interval and the result
/// carries a reason; Goff & Hartel's own example uses 14.27 C at 184.83 g, a steeper
/// extrapolation than this one (14.00 C).

#include <array>
#include <cmath>
#include <cstdio>
#include <limits>
#include <string>
#include <utility>

#include "colligate/core/roots.hpp"
#include "colligate/core/constants.hpp"
#include "colligate/core/errors.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/core/validity.hpp"

namespace colligate::equilibria::leighton {

/// Goff & Hartel (2013) Table 6.1: freezing-point depression (K) of sucrose solutions by
/// g sucrose per 100 g water ("extrapolated from Leighton (1927), originally derived from
/// Pickering", as the table's note says).
inline constexpr std::array<std::pair<double, double>, 60> sucrose_depression_table = {{
    {3, 0.18},    {6, 0.35},    {9, 0.53},    {12, 0.72},   {15, 0.90},   {18, 1.10},
    {21, 1.29},   {24, 1.47},   {27, 1.67},   {30, 1.86},   {33, 2.03},   {36, 2.21},
    {39, 2.40},   {42, 2.60},   {45, 2.78},   {48, 2.99},   {51, 3.20},   {54, 3.42},
    {57, 3.63},   {60, 3.85},   {63, 4.10},   {66, 4.33},   {69, 4.54},   {72, 4.77},
    {75, 5.00},   {78, 5.26},   {81, 5.53},   {84, 5.77},   {87, 5.99},   {90, 6.23},
    {93, 6.50},   {96, 6.80},   {99, 7.04},   {102, 7.32},  {105, 7.56},  {108, 7.80},
    {111, 8.04},  {114, 8.33},  {117, 8.62},  {120, 8.92},  {123, 9.19},  {126, 9.45},
    {129, 9.71},  {132, 9.96},  {135, 10.22}, {138, 10.47}, {141, 10.72}, {144, 10.97},
    {147, 11.19}, {150, 11.41}, {153, 11.63}, {156, 11.88}, {159, 12.14}, {162, 12.40},
    {165, 12.67}, {168, 12.88}, {171, 13.08}, {174, 13.28}, {177, 13.48}, {180, 13.68},
}};

/// Milk-salt depression factor of the method, K per (g MSNF / g water * 100) (Goff &
/// Hartel 2013, after Leighton 1927).
inline constexpr double milk_salt_factor = 2.37;
/// Milk salts per unit MSNF in colligate's milk solids (Leighton's 1927 average milk,
/// 0.89 / 8.99).
inline constexpr double milk_salts_per_msnf = 0.099;
/// Molar mass of sucrose, kg/mol, the reference of the sucrose equivalents.
inline constexpr double sucrose_molar_mass = 0.34229648;

/// The method's inputs, g per 100 g of mix (any common scale works: only ratios matter).
struct mix_terms {
  double sucrose_equivalent = 0.0;  ///< SE, g
  double milk_solids = 0.0;         ///< MSNF + WS carrying the milk salts, g
  double water = 0.0;               ///< W, g
  validity check;                   ///< solutes the method does not cover
};

/// Sucrose depression (K) at `grams_per_100g_water`; beyond the table's end the value is
/// extrapolated and `extrapolated` is set.
inline double sucrose_depression(double grams_per_100g_water, bool& extrapolated) {
  const auto& t = sucrose_depression_table;
  extrapolated = false;
  const double c = grams_per_100g_water;
  if (!(c >= 0.0) || !std::isfinite(c))
    throw invalid_input(colligate::detail::describe("leighton::sucrose_depression", "grams_per_100g_water",
                                         c, "must be finite and >= 0"));
  if (c <= t.front().first) return t.front().second * c / t.front().first;
  for (std::size_t i = 1; i < t.size(); ++i) {
    if (c <= t[i].first) {
      const double u = (c - t[i - 1].first) / (t[i].first - t[i - 1].first);
      return t[i - 1].second + u * (t[i].second - t[i - 1].second);
    }
  }
  extrapolated = true;
  const auto& a = t[t.size() - 2];
  const auto& b = t.back();
  return b.second + (c - b.first) * (b.second - a.second) / (b.first - a.first);
}

/// The method's terms of a solution (amounts as g per 100 g of mix; the solution's scale
/// cancels). Non-electrolytes give sucrose equivalents, milk salts the milk-salt term;
/// other electrolytes are left out with a reason.
inline mix_terms terms_of(const solution& s) {
  mix_terms m;
  const double total = s.water_mass() + s.total_solute_mass();
  if (!(total > 0.0)) return m;
  const double to_g = 100.0 / total;
  m.water = s.water_mass() * to_g;
  std::string left_out;
  for (std::size_t i = 0; i < s.size(); ++i) {
    const auto& rec = s.species()[i];
    const double grams = s.solute_mass(i) * to_g;
    if (rec.id == "milk_salts") {
      m.milk_solids += grams / milk_salts_per_msnf;
    } else if (rec.kind == data::solute_class::electrolyte) {
      left_out += (left_out.empty() ? "" : ", ") + rec.id;
    } else {
      m.sucrose_equivalent += grams * sucrose_molar_mass / rec.molar_mass;
    }
  }
  if (!left_out.empty())
    m.check = flagged(validity_code::missing_constants, "leighton method", left_out + " left out",
                      "the method covers sugars and the salts of milk solids only");
  return m;
}

namespace detail {
/// FPD_T (K) without the validity text (the bisection below calls this).
inline double depression(const mix_terms& m, double frozen, bool& extrapolated) {
  const double w = m.water * (1.0 - frozen);
  return sucrose_depression(m.sucrose_equivalent * 100.0 / w, extrapolated) +
         milk_salt_factor * m.milk_solids / w;
}
}  // namespace detail

/// Freezing-point depression FPD_T (K) with a fraction `frozen` of the water frozen.
inline checked_value total_depression(const mix_terms& m, double frozen) {
  if (!(frozen >= 0.0 && frozen < 1.0))
    throw invalid_input(colligate::detail::describe("leighton::total_depression", "frozen", frozen,
                                         "must be in [0, 1)"));
  if (!(m.water > 0.0))
    throw invalid_input(colligate::detail::describe("leighton::total_depression", "water", m.water,
                                         "must be > 0 g"));
  const double w = m.water * (1.0 - frozen);
  bool extrapolated = false;
  const double fpd = detail::depression(m, frozen, extrapolated);
  checked_value out{fpd, m.check};
  if (extrapolated && out.check.in_range()) {
    out.check = beyond_limit("leighton method", "sucrose equivalents (g per 100 g water)",
                             m.sucrose_equivalent * 100.0 / w, 180.0, " g",
                             "beyond the end of Goff & Hartel's Table 6.1; extrapolated",
                             "goff_hartel_2013");
  }
  return out;
}

/// Lowest freezing point the method's extrapolation is allowed to give, K (-50 C, the
/// lowest temperature colligate searches for a thermodynamic freezing point). Linear
/// extrapolation of Table 6.1 would otherwise reach 0 K near 2200 g sucrose per 100 g water.
inline constexpr double lowest_freezing_point = 223.15;

/// Initial freezing point (K) by the method; NaN with the reason where the extrapolated
/// depression would put it below lowest_freezing_point.
inline checked_value freezing_point(const mix_terms& m) {
  auto d = total_depression(m, 0.0);
  const double T = constants::ice_point - d.value;
  if (!(T >= lowest_freezing_point)) {
    d.check = outside_range("leighton method", "freezing point (K)", T, lowest_freezing_point,
                            constants::ice_point, " K",
                            "Table 6.1 extrapolated this far gives no physical freezing point "
                            "(sucrose equivalents " +
                                validity::fmt(m.sucrose_equivalent * 100.0 / m.water) +
                                " g per 100 g water; the table ends at 180 g)",
                            "goff_hartel_2013", validity_code::outside_physical_bounds);
    d.value = std::numeric_limits<double>::quiet_NaN();
    return d;
  }
  d.value = T;
  return d;
}

/// Fraction of the water frozen at temperature T (K); 0 above the initial freezing point.
/// FPD_T rises monotonically with the frozen fraction, so the fraction is bracketed and
/// bisected to 1e-12.
inline checked_value ice_fraction(const mix_terms& m, double temperature) {
  if (!std::isfinite(temperature) || temperature <= 0.0)
    throw invalid_input(colligate::detail::describe("leighton::ice_fraction", "temperature", temperature,
                                         "must be finite and > 0 K"));
  const double depression = constants::ice_point - temperature;
  const auto start = total_depression(m, 0.0);
  if (depression <= start.value) return {0.0, start.check};
  bool extrapolated = false;
  const auto r = bisect_boundary(
      [&](double x) { return detail::depression(m, x, extrapolated) < depression; }, 0.0,
      1.0 - 1e-12, 1e-12, 200);
  const double f = 0.5 * (r.lo + r.hi);
  return {f, total_depression(m, f).check};
}

}  // namespace colligate::equilibria::leighton
