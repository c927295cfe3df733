#pragma once
/// \file components.hpp
/// Specific heat capacities of the food components, and the proximate composition they
/// apply to.
///
/// Choi & Okos (1986), "Effects of temperature and composition on the thermal properties
/// of foods", in Le Maguer & Jelen (eds.), Food Engineering and Process Applications,
/// vol. 1, 93-101, as tabulated in ASHRAE Handbook - Refrigeration (2006), chapter 9
/// "Thermal properties of foods", Table 1 (source key choi_okos_1986):
///
///     c_p = C1 + C2 t + C3 t^2,   kJ/(kg K), t in degC, valid -40 <= t <= 150 degC
///
/// | component    | C1     | C2          | C3           |
/// |--------------|--------|-------------|--------------|
/// | protein      | 2.0082 | 1.2089e-3   | -1.3129e-6   |
/// | fat          | 1.9842 | 1.4733e-3   | -4.8008e-6   |
/// | carbohydrate | 1.5488 | 1.9625e-3   | -5.9399e-6   |
/// | fibre        | 1.8459 | 1.8306e-3   | -4.6509e-6   |
/// | ash          | 1.0926 | 1.8896e-3   | -3.6817e-6   |
/// | water, > 0 C | 4.1762 | -9.0864e-5  | 5.4731e-6    |
/// | ice          | 2.0623 | 6.0769e-3   | 0            |
///
/// The fat slope is 1.4733e-3 (a copied code version prints another value) and the ice
/// row is linear; the water row above 0 degC is the one also printed in Singh & Heldman,
/// Introduction to Food Engineering, Table A.2.9. Check: the ice row gives 2.062 kJ/(kg K)
/// at 0 degC and 1.819 at -40 degC, within 2 % of IAPWS R10-06 (Feistel & Wagner 2006:
/// 2.097 and about 1.82). Below 0 degC liquid water is not described by a polynomial here:
/// the enthalpy model (enthalpy.hpp) takes supercooled water as ice plus the enthalpy of
/// fusion of water/ice.hpp, so it stays consistent with the ice equilibrium.

#include <array>
#include <cmath>
#include <string>

#include "colligate/core/constants.hpp"
#include "colligate/core/errors.hpp"

namespace colligate::thermal {

/// The components of a proximate analysis.
enum class component { water, ice, protein, fat, carbohydrate, fibre, ash };

inline const char* to_string(component c) {
  switch (c) {
    case component::water: return "water";
    case component::ice: return "ice";
    case component::protein: return "protein";
    case component::fat: return "fat";
    case component::carbohydrate: return "carbohydrate";
    case component::fibre: return "fibre";
    case component::ash: return "ash";
  }
  return "unknown";
}

inline component component_from_string(const std::string& s) {
  for (auto c : {component::water, component::ice, component::protein, component::fat,
                 component::carbohydrate, component::fibre, component::ash})
    if (s == to_string(c)) return c;
  if (s == "fiber") return component::fibre;
  throw invalid_input("component = '" + s +
                      "': valid components are water, ice, protein, fat, carbohydrate, "
                      "fibre, ash");
}

/// Lowest and highest temperature of the Choi & Okos (1986) correlations, K.
inline constexpr double component_min_temperature = 233.15;
inline constexpr double component_max_temperature = 423.15;

namespace detail {

/// {C1, C2, C3} in kJ/(kg K), kJ/(kg K^2), kJ/(kg K^3), argument t in degC.
inline std::array<double, 3> choi_okos_coefficients(component c) {
  switch (c) {
    case component::protein: return {2.0082, 1.2089e-3, -1.3129e-6};
    case component::fat: return {1.9842, 1.4733e-3, -4.8008e-6};
    case component::carbohydrate: return {1.5488, 1.9625e-3, -5.9399e-6};
    case component::fibre: return {1.8459, 1.8306e-3, -4.6509e-6};
    case component::ash: return {1.0926, 1.8896e-3, -3.6817e-6};
    case component::water: return {4.1762, -9.0864e-5, 5.4731e-6};
    case component::ice: return {2.0623, 6.0769e-3, 0.0};
  }
  return {0.0, 0.0, 0.0};
}

inline void check_component_temperature(const char* where, double temperature) {
  if (!std::isfinite(temperature) || temperature < component_min_temperature - 1e-9 ||
      temperature > component_max_temperature + 1e-9)
    throw invalid_input(colligate::detail::describe(
        where, "temperature", temperature,
        "must lie in 233.15-423.15 K (-40 to 150 C), the range of the Choi & Okos (1986) "
        "correlations"));
}

}  // namespace detail

/// Specific heat capacity of a component at temperature T (K), J/(kg K).
/// `component::water` is liquid water; it is meant for T >= 273.15 K.
inline double specific_heat(component c, double temperature) {
  detail::check_component_temperature("specific_heat", temperature);
  const auto k = detail::choi_okos_coefficients(c);
  const double t = temperature - constants::celsius_offset;
  return 1e3 * (k[0] + t * (k[1] + t * k[2]));
}

/// Integral of the specific heat of a component from T1 to T2 (K), J/kg.
inline double sensible_enthalpy(component c, double t1_kelvin, double t2_kelvin) {
  const auto k = detail::choi_okos_coefficients(c);
  auto antiderivative = [&](double T) {
    const double t = T - constants::celsius_offset;
    return 1e3 * t * (k[0] + t * (k[1] / 2.0 + t * k[2] / 3.0));
  };
  return antiderivative(t2_kelvin) - antiderivative(t1_kelvin);
}

/// Proximate composition of a food, mass fractions (kg per kg of food). Sugars, polyols
/// and organic acids belong to `carbohydrate`, salts to `ash`; fibre is counted apart from
/// carbohydrate here (unlike "total carbohydrate" in composition tables).
struct food_composition {
  double water = 0.0;
  double protein = 0.0;
  double fat = 0.0;
  double carbohydrate = 0.0;
  double fibre = 0.0;
  double ash = 0.0;

  /// Rounding allowance for published compositions whose fractions add up to just over 1.
  static constexpr double sum_tolerance = 5e-3;

  double total() const noexcept { return water + protein + fat + carbohydrate + fibre + ash; }

  /// Throws invalid_input naming the field if a fraction is outside [0, 1], the water is
  /// not positive, or the fractions sum above 1 + sum_tolerance.
  void validate(const char* where) const {
    const std::pair<const char*, double> fields[] = {
        {"water", water}, {"protein", protein}, {"fat", fat},
        {"carbohydrate", carbohydrate}, {"fibre", fibre}, {"ash", ash}};
    for (const auto& [name, v] : fields)
      if (!std::isfinite(v) || v < 0.0 || v > 1.0)
        throw invalid_input(colligate::detail::describe(
            where, std::string("composition.") + name, v,
            "a mass fraction must be finite and in [0, 1]"));
    if (!(water > 0.0))
      throw invalid_input(colligate::detail::describe(where, "composition.water", water,
                                                      "must be > 0 (kg water per kg food)"));
    if (total() > 1.0 + sum_tolerance)
      throw invalid_input(colligate::detail::describe(
          where, "sum of composition fractions", total(),
          "must not exceed 1 (0.005 allowed for rounding in published compositions)"));
  }
};

/// Specific heat of the unfrozen food at T (all water liquid), J/(kg K): the mass-weighted
/// sum of the Choi & Okos (1986) component values. Meant for T >= 273.15 K.
inline double unfrozen_specific_heat(const food_composition& x, double temperature) {
  x.validate("unfrozen_specific_heat");
  return x.water * specific_heat(component::water, temperature) +
         x.protein * specific_heat(component::protein, temperature) +
         x.fat * specific_heat(component::fat, temperature) +
         x.carbohydrate * specific_heat(component::carbohydrate, temperature) +
         x.fibre * specific_heat(component::fibre, temperature) +
         x.ash * specific_heat(component::ash, temperature);
}

/// Sensible heat of the components other than water between T1 and T2, J/kg of food.
inline double solids_sensible_enthalpy(const food_composition& x, double t1, double t2) {
  return x.protein * sensible_enthalpy(component::protein, t1, t2) +
         x.fat * sensible_enthalpy(component::fat, t1, t2) +
         x.carbohydrate * sensible_enthalpy(component::carbohydrate, t1, t2) +
         x.fibre * sensible_enthalpy(component::fibre, t1, t2) +
         x.ash * sensible_enthalpy(component::ash, t1, t2);
}

/// Specific heat of the components other than water at T, J/(kg K) of food.
inline double solids_specific_heat(const food_composition& x, double T) {
  return x.protein * specific_heat(component::protein, T) +
         x.fat * specific_heat(component::fat, T) +
         x.carbohydrate * specific_heat(component::carbohydrate, T) +
         x.fibre * specific_heat(component::fibre, T) + x.ash * specific_heat(component::ash, T);
}

}  // namespace colligate::thermal
