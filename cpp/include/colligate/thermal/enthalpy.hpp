#pragma once
/// \file enthalpy.hpp
/// Enthalpy, apparent specific heat and heat loads of a food (DESIGN section 1, thermal).
///
/// A food is its proximate composition (components.hpp) plus the aqueous phase whose ice
/// curve comes from equilibria/ice_fraction.hpp, plus water that cannot freeze (bound).
/// Per kilogram of food, with x_w the water fraction, phi(T) the liquid share of the water
/// (1 - ice fraction; bound water counts as liquid), L(T) = dH_fus(T) / M_w from
/// water/ice.hpp and h_ice the Choi & Okos (1986) ice enthalpy:
///
///     T <= 273.15 K:  H(T) = H_solids(T) + x_w [h_ice(T) + phi(T) L(T)] - H_ref
///     T >  273.15 K:  H(T) = H_solids(T) + x_w [h_ice(T0) + L(T0) + h_water(T) - h_water(T0)] - H_ref
///
/// Reference state: H = 0 at 233.15 K (-40 C) for the food in ice equilibrium at that
/// temperature. When -40 C lies below a salt eutectic (brines), where the ice curve stops,
/// the reference counts all freezable water as solid (phi = bound share): the water of the
/// salt hydrate is counted as ice and the heat of the eutectic crystallisation is left out.
/// That changes only the constant H_ref, so every enthalpy difference above the eutectic is
/// unaffected; below the eutectic the functions throw, as the ice curve does. Liquid water below 0 C is taken as ice plus the enthalpy of fusion at the
/// same temperature, so the model is consistent with the ice equilibrium; above 0 C it
/// follows the Choi & Okos water polynomial (the heat capacity then jumps by about 0.2 %
/// at 0 C; the enthalpy is continuous). H_solids counts each component with its Choi &
/// Okos polynomial, except the dissolved solutes whose records carry an apparent specific
/// heat (salts, ethanol, acetic acid; thermal/dissolved_solutes.hpp), which count with
/// that. Crystallisation of fat and of solutes is not
/// included. The apparent specific heat is dH/dT, with the derivative of the ice
/// fraction taken from the ice equilibrium by implicit differentiation (not from H).

#include <algorithm>
#include <cmath>
#include <limits>
#include <utility>
#include <vector>

#include "colligate/core/bound_water.hpp"
#include "colligate/core/constants.hpp"
#include "colligate/core/errors.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/equilibria/freezing_point.hpp"
#include "colligate/equilibria/ice_curve.hpp"
#include "colligate/equilibria/ice_fraction.hpp"
#include "colligate/models/water_activity.hpp"
#include "colligate/thermal/components.hpp"
#include "colligate/thermal/dissolved_solutes.hpp"
#include "colligate/water/ice.hpp"

namespace colligate::thermal {

/// Reference temperature of the enthalpy, K (-40 C): H(reference_temperature) = 0.
inline constexpr double reference_temperature = 233.15;
/// Temperature range of the enthalpy functions, K (-40 C to +40 C).
inline constexpr double min_temperature = 233.15;
inline constexpr double max_temperature = 313.15;

/// A food for thermal calculations: composition per kg of food, the aqueous phase (any
/// scale; only its composition matters), water that cannot freeze as a share of all the
/// water (kg per kg water, core/bound_water.hpp) and the activity model of the ice curve.
class food {
 public:
  food(food_composition composition, solution water_phase, double bound_water_fraction_of_water = 0.0,
       models::model_choice model = "auto")
      : composition_(composition), water_phase_(std::move(water_phase)),
        bound_water_fraction_of_water_(bound_water_fraction_of_water), model_(model) {
    composition_.validate("food");
    check_bound_water_fraction_of_water("food", bound_water_fraction_of_water);
  }

  const food_composition& composition() const noexcept { return composition_; }
  const solution& water_phase() const noexcept { return water_phase_; }
  /// Unfreezable water, kg per kg of the food's water.
  double bound_water_fraction_of_water() const noexcept { return bound_water_fraction_of_water_; }
  const models::model_choice& model() const noexcept { return model_; }

  /// Bound water expressed on the scale of water_phase(), kg (core/bound_water.hpp).
  double bound_water_in_phase() const { return bound_water_kg(water_phase_, bound_water_fraction_of_water_); }

 private:
  food_composition composition_;
  solution water_phase_;
  double bound_water_fraction_of_water_;
  models::model_choice model_;
};

/// Liquid share of the water and its temperature derivative at T.
struct liquid_share {
  double phi = 1.0;        ///< (unfrozen + bound water) / total water
  double dphi_dT = 0.0;    ///< 1/K
  validity check;
};

namespace detail {

inline void check_temperature(const char* where, double temperature) {
  if (!std::isfinite(temperature) || temperature < min_temperature - 1e-9 ||
      temperature > max_temperature + 1e-9)
    throw invalid_input(colligate::detail::describe(
        where, "temperature", temperature,
        "must lie in 233.15-313.15 K (-40 to +40 C), the range of the enthalpy model"));
}

/// Specific enthalpy of fusion of ice at T, J/kg.
inline double latent_heat(double T) {
  return water::enthalpy_of_fusion(T) / constants::molar_mass_water;
}

}  // namespace detail

/// The ice curve of a food's water phase (model and bound water of the food). Thermal
/// functions prepare one per call and ask it at every temperature.
inline equilibria::ice_curve ice_curve_of(const food& f) {
  return equilibria::ice_curve(f.water_phase(), f.model(), f.bound_water_in_phase());
}

/// Liquid share of the water at T and d(phi)/dT, read from the food's ice curve. With
/// ice alone, from the ice equilibrium g(u, T) = ln a_w(W_u = e^u, T) - ln a_w,ice(T) = 0:
/// du/dT = -g_T / g_u; with salts crystallising, by a central difference on the curve.
inline liquid_share liquid_water_share(const food& f, equilibria::ice_curve& curve,
                                       double temperature) {
  liquid_share out;
  if (temperature >= constants::ice_point) return out;
  const solution& s = f.water_phase();
  const auto u = curve.at(temperature);
  out.check = u.check;
  if (u.status == equilibria::solve_status::not_frozen) return out;
  if (!u.success()) {
    // Below the end of the ice curve (a salt eutectic, 215 K) or where the activity model
    // gives no physical value there is no unfrozen phase to take the enthalpy of.
    const std::string at = "thermal model: temperature = " + validity::fmt(temperature) +
                           " K (" + validity::fmt(temperature - constants::celsius_offset) + " C)";
    if (u.status == equilibria::solve_status::below_eutectic ||
        u.check.code == validity_code::outside_physical_bounds)
      throw out_of_validity_range(at + ": no unfrozen phase is computed there: " +
                                  u.check.reason());
    throw convergence_error(at + ": the ice and salt equilibria did not converge" +
                            (u.check.in_range() ? "" : ": " + u.check.reason()));
  }
  const double W = s.water_mass();
  out.phi = 1.0 - u.ice / W;
  if (!(u.unfrozen_water > 0.0)) return out;  // pure water: all freezable water is ice
  const double T = temperature;
  if (u.state == equilibria::phase_state::ice_salts_liquid) {
    const double h = 1e-3;  // K; the salt path is smooth between onsets
    const auto up = curve.at(T + h), down = curve.at(T - h);
    if (up.success() && down.success()) out.dphi_dT = -(up.ice - down.ice) / (2.0 * h * W);
    return out;
  }
  const auto& m = f.model();
  const double ln_wu = std::log(u.unfrozen_water);
  const double hu = 1e-6, ht = 1e-4;
  models::ln_water_activity_evaluator ln_aw(m, s);
  const double g_u = (ln_aw(std::exp(ln_wu + hu), T) - ln_aw(std::exp(ln_wu - hu), T)) / (2.0 * hu);
  const double dlnaw_dT =
      (ln_aw(u.unfrozen_water, T + ht) - ln_aw(u.unfrozen_water, T - ht)) / (2.0 * ht);
  // d ln a_w,ice / dT = dH_fus(T) / (R T^2) (water/ice.hpp)
  const double dlnaice_dT =
      water::enthalpy_of_fusion(T) / (constants::gas_constant * T * T);
  const double du_dT = -(dlnaw_dT - dlnaice_dT) / g_u;
  out.dphi_dT = u.unfrozen_water * du_dT / W;
  return out;
}

/// Liquid share of the water at T (one ice curve prepared for this call).
inline liquid_share liquid_water_share(const food& f, double temperature) {
  auto curve = ice_curve_of(f);
  return liquid_water_share(f, curve, temperature);
}

namespace detail {

/// Liquid share of the water in the reference state (see the file comment).
inline double reference_liquid_share(const food& f, equilibria::ice_curve& curve) {
  const solution& s = f.water_phase();
  const auto u = curve.at(reference_temperature);
  if (u.status == equilibria::solve_status::below_eutectic)
    return f.bound_water_in_phase() / s.water_mass();
  return liquid_water_share(f, curve, reference_temperature).phi;
}

/// Enthalpy before the reference is subtracted, J/kg of food.
inline double raw_enthalpy(const food& f, double T, double phi) {
  const auto& x = f.composition();
  const double T0 = constants::ice_point;
  double h = solids_sensible_enthalpy(x, reference_temperature, T) +
             dissolved_solute_heat(x, f.water_phase()).sensible_enthalpy(reference_temperature, T);
  if (T <= T0) {
    h += x.water * (sensible_enthalpy(component::ice, reference_temperature, T) +
                    phi * latent_heat(T));
  } else {
    h += x.water * (sensible_enthalpy(component::ice, reference_temperature, T0) +
                    latent_heat(T0) + sensible_enthalpy(component::water, T0, T));
  }
  return h;
}

}  // namespace detail

/// enthalpy() on a prepared ice curve of the food (ice_curve_of).
inline checked_value enthalpy(const food& f, equilibria::ice_curve& curve, double temperature,
                              range_policy policy) {
  detail::check_temperature("enthalpy", temperature);
  const double ref_phi = detail::reference_liquid_share(f, curve);
  const auto now = liquid_water_share(f, curve, temperature);
  // Only the validity at T is reported: the reference state (-40 C) lies outside the
  // constants' range for most sugar solutions and would flag every temperature.
  const validity v = now.check;
  const double h = detail::raw_enthalpy(f, temperature, now.phi) -
                   detail::raw_enthalpy(f, reference_temperature, ref_phi);
  return apply_policy(h, v, policy);
}

/// Specific enthalpy of the food at T (K), J/kg, with H = 0 at 233.15 K (-40 C).
inline checked_value enthalpy(const food& f, double temperature,
                              range_policy policy = range_policy::extrapolate) {
  detail::check_temperature("enthalpy", temperature);
  auto curve = ice_curve_of(f);
  return enthalpy(f, curve, temperature, policy);
}

/// Apparent specific heat dH/dT at T (K), J/(kg K): sensible heat of every component plus
/// the latent heat of the ice that forms or melts per kelvin.
inline checked_value apparent_specific_heat(const food& f, equilibria::ice_curve& curve,
                                            double temperature, range_policy policy) {
  detail::check_temperature("apparent_specific_heat", temperature);
  const auto& x = f.composition();
  const double T = temperature;
  double cp = solids_specific_heat(x, T) + dissolved_solute_heat(x, f.water_phase()).specific_heat(T);
  validity v;
  if (T <= constants::ice_point) {
    const auto ls = liquid_water_share(f, curve, T);
    v = ls.check;
    const double dL_dT = water::delta_heat_capacity_of_fusion(T) / constants::molar_mass_water;
    cp += x.water * (specific_heat(component::ice, T) + ls.phi * dL_dT +
                     detail::latent_heat(T) * ls.dphi_dT);
  } else {
    cp += x.water * specific_heat(component::water, T);
  }
  return apply_policy(cp, v, policy);
}

/// apparent_specific_heat() with one ice curve prepared for this call.
inline checked_value apparent_specific_heat(const food& f, double temperature,
                                            range_policy policy = range_policy::extrapolate) {
  auto curve = ice_curve_of(f);
  return apparent_specific_heat(f, curve, temperature, policy);
}

/// Heat to remove per kg of food to cool it from `from_temperature` to `to_temperature`
/// (K), split into sensible and latent parts. Positive when cooling. The latent part is
/// the heat of fusion released by the ice formed, each increment at the temperature where
/// it forms: integral of x_w L(T) d(ice fraction).
struct heat_load_result {
  double total = 0.0;     ///< J/kg
  double sensible = 0.0;  ///< J/kg
  double latent = 0.0;    ///< J/kg
  double ice_fraction_from = 0.0;
  double ice_fraction_to = 0.0;
  validity check;
};

inline heat_load_result heat_load(const food& f, double from_temperature, double to_temperature,
                                  int steps = 400) {
  detail::check_temperature("heat_load", from_temperature);
  detail::check_temperature("heat_load", to_temperature);
  if (steps < 10 || steps > 100000)
    throw invalid_input(colligate::detail::describe("heat_load", "steps", steps,
                                                    "must be between 10 and 100000"));
  heat_load_result r;
  auto curve = ice_curve_of(f);
  const auto h_from = enthalpy(f, curve, from_temperature, range_policy::extrapolate);
  const auto h_to = enthalpy(f, curve, to_temperature, range_policy::extrapolate);
  r.total = h_from.value - h_to.value;
  r.check = h_from.check;
  r.check.merge(h_to.check);

  // Latent part on a grid between the two temperatures, with the freezing point as a node.
  const double hi = std::max(from_temperature, to_temperature);
  const double lo = std::min(from_temperature, to_temperature);
  std::vector<double> grid;
  for (int k = 0; k <= steps; ++k) grid.push_back(hi - (hi - lo) * k / steps);
  const auto& fp = curve.initial_freezing_point();
  if (fp.success() && fp.temperature < hi && fp.temperature > lo) grid.push_back(fp.temperature);
  std::sort(grid.begin(), grid.end(), std::greater<double>());
  const double W = f.composition().water;
  double latent = 0.0;
  double prev_phi = liquid_water_share(f, curve, grid.front()).phi;
  for (std::size_t k = 1; k < grid.size(); ++k) {
    const auto ls = liquid_water_share(f, curve, grid[k]);
    r.check.merge(ls.check);
    const double mid = 0.5 * (grid[k - 1] + grid[k]);
    latent += W * (prev_phi - ls.phi) * detail::latent_heat(std::min(mid, constants::ice_point));
    prev_phi = ls.phi;
  }
  r.latent = from_temperature >= to_temperature ? latent : -latent;
  r.sensible = r.total - r.latent;
  r.ice_fraction_from = 1.0 - liquid_water_share(f, curve, from_temperature).phi;
  r.ice_fraction_to = 1.0 - liquid_water_share(f, curve, to_temperature).phi;
  return r;
}

/// Latent heat of fusion of all the food's water at 0 C, J/kg of food (x_w L(T0)); the
/// quantity tabulated as "latent heat of fusion" in ASHRAE Refrigeration, ch. 9, Table 3.
inline double latent_heat_of_fusion(const food_composition& x) {
  x.validate("latent_heat_of_fusion");
  return x.water * detail::latent_heat(constants::ice_point);
}

}  // namespace colligate::thermal
