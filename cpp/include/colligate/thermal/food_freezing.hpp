#pragma once
/// \file food_freezing.hpp
/// Freezing and thawing of a food from the library's own properties: the material table of
/// the enthalpy-method simulation (H(T) from enthalpy.hpp, k(T) from conductivity.hpp, both
/// reading the food's ice curve), and the inputs of Plank's and Pham's formulas with the
/// published definitions (freezing_time.hpp):
///
/// - T_f: the initial freezing point of the food's water phase (ice curve);
/// - L_f: latent heat of the food, the freezable water times the heat of fusion at 0 C
///   (ASHRAE Refrigeration, "Cooling and freezing times of foods", symbols);
/// - c_u: specific heat of the unfrozen food at the mean of T_i and T_f (Choi & Okos);
/// - c_f: specific heat of the fully frozen food at T_c, the freezable water counted as ice
///   (Choi & Okos); rho_u at T_i, rho_f at T_c; k_f at T_c (parallel model).
///
/// The density of the simulation's material is held at rho_u (mass per volume fixed).

#include <algorithm>
#include <cmath>
#include <string>
#include <vector>

#include "colligate/core/constants.hpp"
#include "colligate/core/errors.hpp"
#include "colligate/thermal/conductivity.hpp"
#include "colligate/thermal/enthalpy.hpp"
#include "colligate/thermal/enthalpy_simulation.hpp"
#include "colligate/thermal/freezing_time.hpp"

namespace colligate::thermal {

/// Density, conductivity, enthalpy and ice fraction of a food at T (K).
struct food_state_properties {
  double density = 0.0;       ///< kg/m^3
  double conductivity = 0.0;  ///< W/(m K)
  double enthalpy = 0.0;      ///< J/kg, H = 0 at -40 C
  double ice_fraction = 0.0;  ///< ice / total water
};

inline food_state_properties food_properties(const food& f, equilibria::ice_curve& curve, double T,
                                             conductivity_rule rule = conductivity_rule::parallel) {
  food_state_properties p;
  const auto ls = liquid_water_share(f, curve, T);
  p.ice_fraction = std::clamp(1.0 - ls.phi, 0.0, 1.0);
  const auto dk = food_density_conductivity(f.composition(), T, p.ice_fraction, rule);
  p.density = dk.density;
  p.conductivity = dk.conductivity;
  p.enthalpy = enthalpy(f, curve, T, range_policy::extrapolate).value;
  return p;
}

namespace detail {

/// Throws naming `field` if T lies outside the enthalpy model or below the final eutectic.
inline void check_food_temperature(const char* where, const char* field, double T,
                                   equilibria::ice_curve& curve) {
  if (!std::isfinite(T) || T < min_temperature - 1e-9 || T > max_temperature + 1e-9)
    throw invalid_input(colligate::detail::describe(
        where, field, T, "must lie in 233.15-313.15 K (-40 to +40 C), the range of the enthalpy model"));
  if (T < constants::ice_point) {
    const auto u = curve.at(T);
    if (u.status == equilibria::solve_status::below_eutectic)
      throw invalid_input(colligate::detail::describe(
          where, field, T,
          "lies below the final eutectic of the food's water phase, where the ice curve and "
          "the thermal model stop"));
  }
}

}  // namespace detail

/// Material table of a food between T_lo and T_hi (K), volumetric enthalpy at the density
/// at `density_temperature`. Nodes every `step` K plus the initial freezing point. Below a
/// final eutectic (brines), where the ice curve stops, the table goes on with the sensible
/// heat of the fully frozen food (solids plus all freezable water as ice, Choi & Okos) and
/// the conductivity at the eutectic: the heat of the eutectic crystallisation is left out,
/// as in enthalpy.hpp. This lets a medium lie below the eutectic; targets may not.
inline material_table food_material(const food& f, double T_lo, double T_hi, double density_temperature,
                                    conductivity_rule rule = conductivity_rule::parallel,
                                    double step = 0.1) {
  auto curve = ice_curve_of(f);
  const char* where = "food_material";
  auto in_model = [&](const char* field, double T) {
    if (!std::isfinite(T) || T < min_temperature - 1e-9 || T > max_temperature + 1e-9)
      throw invalid_input(colligate::detail::describe(
          where, field, T, "must lie in 233.15-313.15 K (-40 to +40 C), the range of the enthalpy model"));
  };
  in_model("T_lo", T_lo);
  in_model("T_hi", T_hi);
  detail::check_food_temperature(where, "density_temperature", density_temperature, curve);
  if (!(T_hi > T_lo + step))
    throw invalid_input(colligate::detail::describe(where, "T_hi", T_hi, "must exceed T_lo by more than one step"));
  double T_end = T_lo;  // lowest temperature the ice curve answers
  const auto& fp = curve.initial_freezing_point();
  if (fp.success() && curve.end_reason() == equilibria::curve_end::final_eutectic &&
      curve.end_temperature() + 0.02 > T_lo)
    T_end = curve.end_temperature() + 0.02;
  if (!(T_hi > T_end + step))
    throw invalid_input(colligate::detail::describe(where, "T_hi", T_hi,
                                                    "must lie above the final eutectic of the food"));
  const double rho = food_properties(f, curve, density_temperature, rule).density;
  std::vector<double> Ts;
  const int n = static_cast<int>(std::ceil((T_hi - T_end) / step));
  for (int i = 0; i <= n; ++i) Ts.push_back(std::min(T_end + i * step, T_hi));
  if (fp.success() && fp.temperature > T_end && fp.temperature < T_hi) Ts.push_back(fp.temperature);
  std::sort(Ts.begin(), Ts.end());
  Ts.erase(std::unique(Ts.begin(), Ts.end(), [](double a, double b) { return std::abs(a - b) < 1e-6; }),
           Ts.end());
  std::vector<double> H, k;
  H.reserve(Ts.size() + 1);
  k.reserve(Ts.size() + 1);
  for (double T : Ts) {
    const auto p = food_properties(f, curve, T, rule);
    H.push_back(rho * p.enthalpy);
    k.push_back(p.conductivity);
  }
  if (T_end > T_lo) {  // below the eutectic: fully frozen sensible heat
    const auto& x = f.composition();
    const double T_mid = 0.5 * (T_lo + T_end);
    const double cp = solids_specific_heat(x, T_mid) +
                      dissolved_solute_heat(x, f.water_phase()).specific_heat(T_mid) +
                      x.water * specific_heat(component::ice, T_mid);
    Ts.insert(Ts.begin(), T_lo);
    H.insert(H.begin(), H.front() - rho * cp * (T_end - T_lo));
    k.insert(k.begin(), k.front());
  }
  return material_table(std::move(Ts), std::move(H), std::move(k));
}

/// Runs the enthalpy-method simulation for a food (freezing or thawing). The medium and the
/// target must lie inside the enthalpy model's range and above the final eutectic.
inline simulation_result simulate_food(const food& f, const simulation_setup& in,
                                       conductivity_rule rule = conductivity_rule::parallel) {
  const char* where = "simulate_freezing";
  in.medium.validate(where);
  auto curve = ice_curve_of(f);
  detail::check_food_temperature(where, "T_initial", in.initial_temperature, curve);
  double lo = in.initial_temperature, hi = in.initial_temperature;
  for (double Tm : in.medium.temperature) {
    if (!std::isfinite(Tm) || Tm < min_temperature - 1e-9 || Tm > max_temperature + 1e-9)
      throw invalid_input(colligate::detail::describe(
          where, "T_medium", Tm, "must lie in 233.15-313.15 K (-40 to +40 C), the range of the enthalpy model"));
    lo = std::min(lo, Tm);
    hi = std::max(hi, Tm);
  }
  if (!std::isnan(in.target_temperature))
    detail::check_food_temperature(where, "T_target", in.target_temperature, curve);
  // a margin for the linear extrapolation of the table, kept inside the model's range
  lo = std::max(min_temperature, lo - 0.5);
  hi = std::min(max_temperature, hi + 0.5);
  const auto mat = food_material(f, lo, hi, in.initial_temperature, rule);
  return simulate(mat, in);
}

/// Inputs of Plank's and Pham's formulas for a food (see the file comment).
struct food_freezing_inputs {
  double initial_freezing_point = 0.0;  ///< K
  double latent_heat = 0.0;             ///< J/kg of food
  double density_unfrozen = 0.0;        ///< kg/m^3
  double density_frozen = 0.0;          ///< kg/m^3
  double specific_heat_unfrozen = 0.0;  ///< J/(kg K)
  double specific_heat_frozen = 0.0;    ///< J/(kg K)
  double k_frozen = 0.0;                ///< W/(m K)
};

inline food_freezing_inputs freezing_inputs_of_food(const food& f, double initial_temperature,
                                                    double centre_temperature,
                                                    conductivity_rule rule = conductivity_rule::parallel) {
  const char* where = "freezing_inputs_of_food";
  auto curve = ice_curve_of(f);
  detail::check_food_temperature(where, "T_initial", initial_temperature, curve);
  detail::check_food_temperature(where, "T_target", centre_temperature, curve);
  food_freezing_inputs r;
  const auto& fp = curve.initial_freezing_point();
  if (!fp.success())
    throw convergence_error(std::string(where) + ": the initial freezing point was not found");
  r.initial_freezing_point = fp.temperature;
  if (!(initial_temperature >= fp.temperature))
    throw invalid_input(colligate::detail::describe(
        where, "T_initial", initial_temperature,
        "must not lie below the initial freezing point (" + std::to_string(fp.temperature) + " K)"));
  const auto& x = f.composition();
  const double bound = f.bound_water_fraction_of_water() * x.water;  // kg per kg of food
  const double freezable = x.water - bound;
  r.latent_heat = freezable * detail::latent_heat(constants::ice_point);
  r.density_unfrozen = food_properties(f, curve, initial_temperature, rule).density;
  const auto frozen = food_properties(f, curve, centre_temperature, rule);
  r.density_frozen = frozen.density;
  r.k_frozen = frozen.conductivity;
  const double T_mean = std::max(constants::ice_point, 0.5 * (initial_temperature + fp.temperature));
  const dissolved_solute_heat dissolved(x, f.water_phase());
  r.specific_heat_unfrozen = unfrozen_specific_heat(x, T_mean) + dissolved.specific_heat(T_mean);
  r.specific_heat_frozen = solids_specific_heat(x, centre_temperature) +
                           dissolved.specific_heat(centre_temperature) +
                           freezable * specific_heat(component::ice, centre_temperature) +
                           bound * specific_heat(component::water, constants::ice_point);
  return r;
}

}  // namespace colligate::thermal
