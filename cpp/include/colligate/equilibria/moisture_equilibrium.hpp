#pragma once
/// \file moisture_equilibrium.hpp
/// The water activity a mix of dry or intermediate-moisture ingredients settles at, and
/// the end state of moisture migration between layers in contact (a closed package with
/// negligible headspace): at equilibrium every part has the same a_w and the water is
/// conserved,
///
///     sum_i D_i X_i(a) = sum_i D_i X_i,0            (D dry solids kg, X kg water / kg dry solids)
///
/// solved for a with each part's isotherm (the mass-balance solution). The Salwin-Slawson
/// estimate (Salwin & Slawson 1959) replaces each isotherm by its tangent at the part's
/// initial a_w:  a = sum_i a_i D_i s_i / sum_i D_i s_i, s_i = dX_i/da at a_i; it is exact
/// when the isotherms are straight lines.

#include <cmath>
#include <vector>

#include "colligate/core/errors.hpp"
#include "colligate/core/roots.hpp"
#include "colligate/equilibria/sorption_isotherm.hpp"

namespace colligate::equilibria {

/// One ingredient or layer: its dry solids and its water at the start.
struct moisture_part {
  sorption_isotherm isotherm;
  double dry_solids = 0.0;  ///< kg
  double moisture = 0.0;    ///< kg water per kg dry solids at the start (> 0)
};

/// The end state.
struct moisture_equilibrium_result {
  double water_activity = std::numeric_limits<double>::quiet_NaN();
  std::vector<double> moisture;          ///< kg water per kg dry solids, per part
  std::vector<double> water_gained;      ///< kg, per part (negative: lost)
  std::vector<double> initial_water_activity;
  bool converged = false;
};

namespace detail {

inline void check_parts(const char* where, const std::vector<moisture_part>& parts) {
  if (parts.empty()) throw invalid_input(std::string(where) + ": no parts given");
  for (std::size_t i = 0; i < parts.size(); ++i) {
    parts[i].isotherm.validate();
    if (!(std::isfinite(parts[i].dry_solids) && parts[i].dry_solids > 0.0))
      throw invalid_input(colligate::detail::describe(where, "dry_solids[" + std::to_string(i) + "]",
                                                      parts[i].dry_solids, "must be finite and > 0 kg"));
    if (!(std::isfinite(parts[i].moisture) && parts[i].moisture > 0.0))
      throw invalid_input(colligate::detail::describe(where, "moisture[" + std::to_string(i) + "]", parts[i].moisture,
                                                      "must be finite and > 0 kg water per kg dry solids"));
  }
}

}  // namespace detail

/// Mass-balance equilibrium of `parts`.
inline moisture_equilibrium_result moisture_equilibrium(const std::vector<moisture_part>& parts) {
  detail::check_parts("moisture_equilibrium", parts);
  moisture_equilibrium_result r;
  double water = 0.0;
  for (const auto& p : parts) {
    water += p.dry_solids * p.moisture;
    r.initial_water_activity.push_back(p.isotherm.water_activity(p.moisture));
  }
  auto excess = [&](double a) {
    double w = 0.0;
    for (const auto& p : parts) w += p.dry_solids * p.isotherm.moisture_unchecked(a);
    return w - water;
  };
  double hi = 1.0;
  for (const auto& p : parts)
    if (p.isotherm.model == isotherm_model::gab) hi = std::min(hi, 1.0 / p.isotherm.p3);
  const double lo = 1e-12;
  hi *= 1.0 - 1e-12;
  const auto root = toms748_root(excess, lo, hi, excess(lo), excess(hi), 50, 200);
  if (root.status != root_status::converged) return r;
  r.water_activity = root.x;
  r.converged = true;
  for (const auto& p : parts) {
    const double x = p.isotherm.moisture_unchecked(root.x);
    r.moisture.push_back(x);
    r.water_gained.push_back(p.dry_solids * (x - p.moisture));
  }
  return r;
}

/// Salwin-Slawson estimate of the equilibrium water activity of `parts`.
inline double salwin_slawson_water_activity(const std::vector<moisture_part>& parts) {
  detail::check_parts("salwin_slawson_water_activity", parts);
  double num = 0.0, den = 0.0;
  for (const auto& p : parts) {
    const double a = p.isotherm.water_activity(p.moisture);
    const double s = p.isotherm.moisture_slope(a);
    num += a * p.dry_solids * s;
    den += p.dry_solids * s;
  }
  return num / den;
}

}  // namespace colligate::equilibria
