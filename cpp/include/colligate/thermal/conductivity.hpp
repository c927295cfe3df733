#pragma once
/// \file conductivity.hpp
/// Density and thermal conductivity of a food from its components, above and below
/// freezing (the ice comes from the food's ice curve).
///
/// Choi & Okos (1986), as tabulated in ASHRAE Handbook - Refrigeration (2006), ch. 9
/// "Thermal properties of foods", Table 1 (source key choi_okos_1986; coefficients from
/// memory, not yet cross-checked against a re-read copy of the table; the ice and water rows
/// are tested against measured conductivities), t in degC, valid -40 to 150 C:
///
/// | component    | k, W/(m K)                                  | rho, kg/m^3                    |
/// |--------------|---------------------------------------------|--------------------------------|
/// | protein      | 1.7881e-1 + 1.1958e-3 t - 2.7178e-6 t^2     | 1.3299e3 - 5.1840e-1 t         |
/// | fat          | 1.8071e-1 - 2.7604e-4 t - 1.7749e-7 t^2     | 9.2559e2 - 4.1757e-1 t         |
/// | carbohydrate | 2.0141e-1 + 1.3874e-3 t - 4.3312e-6 t^2     | 1.5991e3 - 3.1046e-1 t         |
/// | fibre        | 1.8331e-1 + 1.2497e-3 t - 3.1683e-6 t^2     | 1.3115e3 - 3.6589e-1 t         |
/// | ash          | 3.2962e-1 + 1.4011e-3 t - 2.9069e-6 t^2     | 2.4238e3 - 2.8063e-1 t         |
/// | water        | 5.7109e-1 + 1.7625e-3 t - 6.7036e-6 t^2     | 9.9718e2 + 3.1439e-3 t - 3.7574e-3 t^2 |
/// | ice          | 2.2196 - 6.2489e-3 t + 1.0154e-4 t^2        | 9.1689e2 - 1.3071e-1 t         |
///
/// Mixing rules: density 1/rho = sum x_i / rho_i (mass fractions x_i, additive volumes,
/// Choi & Okos 1986). Conductivity: the parallel model on volume fractions
/// v_i = (x_i / rho_i) rho, k = sum v_i k_i (Choi & Okos 1986; ASHRAE ch. 9 eq. for the
/// "parallel" model). ASHRAE notes that the parallel model gives an upper bound and
/// overestimates frozen foods in which ice is not aligned with the heat flow; the series
/// model 1/k = sum v_i / k_i is the lower bound and is offered beside it. Liquid water below
/// 0 C takes the water row extrapolated (as Choi & Okos do).

#include <array>
#include <cmath>

#include "colligate/core/constants.hpp"
#include "colligate/thermal/components.hpp"

namespace colligate::thermal {

namespace detail {

/// {a0, a1, a2} of k = a0 + a1 t + a2 t^2, W/(m K), t in degC.
inline std::array<double, 3> choi_okos_conductivity(component c) {
  switch (c) {
    case component::protein: return {1.7881e-1, 1.1958e-3, -2.7178e-6};
    case component::fat: return {1.8071e-1, -2.7604e-4, -1.7749e-7};
    case component::carbohydrate: return {2.0141e-1, 1.3874e-3, -4.3312e-6};
    case component::fibre: return {1.8331e-1, 1.2497e-3, -3.1683e-6};
    case component::ash: return {3.2962e-1, 1.4011e-3, -2.9069e-6};
    case component::water: return {5.7109e-1, 1.7625e-3, -6.7036e-6};
    case component::ice: return {2.2196, -6.2489e-3, 1.0154e-4};
  }
  return {0.0, 0.0, 0.0};
}

/// {b0, b1, b2} of rho = b0 + b1 t + b2 t^2, kg/m^3, t in degC.
inline std::array<double, 3> choi_okos_density(component c) {
  switch (c) {
    case component::protein: return {1.3299e3, -5.1840e-1, 0.0};
    case component::fat: return {9.2559e2, -4.1757e-1, 0.0};
    case component::carbohydrate: return {1.5991e3, -3.1046e-1, 0.0};
    case component::fibre: return {1.3115e3, -3.6589e-1, 0.0};
    case component::ash: return {2.4238e3, -2.8063e-1, 0.0};
    case component::water: return {9.9718e2, 3.1439e-3, -3.7574e-3};
    case component::ice: return {9.1689e2, -1.3071e-1, 0.0};
  }
  return {1.0, 0.0, 0.0};
}

inline double poly(const std::array<double, 3>& a, double t) { return a[0] + t * (a[1] + t * a[2]); }

}  // namespace detail

/// Thermal conductivity of a component at T (K), W/(m K); Choi & Okos (1986).
inline double component_conductivity(component c, double temperature) {
  detail::check_component_temperature("component_conductivity", temperature);
  return detail::poly(detail::choi_okos_conductivity(c), temperature - constants::celsius_offset);
}

/// Density of a component at T (K), kg/m^3; Choi & Okos (1986).
inline double component_density(component c, double temperature) {
  detail::check_component_temperature("component_density", temperature);
  return detail::poly(detail::choi_okos_density(c), temperature - constants::celsius_offset);
}

/// Conductivity mixing rule.
enum class conductivity_rule { parallel, series };

/// Density and conductivity of a food at T given the ice fraction of its water.
struct food_transport {
  double density = 0.0;       ///< kg/m^3
  double conductivity = 0.0;  ///< W/(m K)
};

/// Density and conductivity of a food of composition `x` at T (K) with `ice_fraction` of
/// its water frozen (0 above the freezing point).
inline food_transport food_density_conductivity(const food_composition& x, double temperature,
                                                double ice_fraction,
                                                conductivity_rule rule = conductivity_rule::parallel) {
  x.validate("food_density_conductivity");
  detail::check_component_temperature("food_density_conductivity", temperature);
  if (!std::isfinite(ice_fraction) || ice_fraction < 0.0 || ice_fraction > 1.0)
    throw invalid_input(colligate::detail::describe("food_density_conductivity", "ice_fraction",
                                                    ice_fraction, "must lie in [0, 1]"));
  const double t = temperature - constants::celsius_offset;
  const std::pair<component, double> parts[] = {
      {component::water, x.water * (1.0 - ice_fraction)}, {component::ice, x.water * ice_fraction},
      {component::protein, x.protein}, {component::fat, x.fat},
      {component::carbohydrate, x.carbohydrate}, {component::fibre, x.fibre},
      {component::ash, x.ash}};
  double specific_volume = 0.0, mass = 0.0;
  for (const auto& [c, m] : parts) {
    specific_volume += m / detail::poly(detail::choi_okos_density(c), t);
    mass += m;
  }
  food_transport out;
  out.density = mass / specific_volume;
  double k = 0.0;
  for (const auto& [c, m] : parts) {
    if (m <= 0.0) continue;
    const double v = (m / detail::poly(detail::choi_okos_density(c), t)) / specific_volume;
    const double ki = detail::poly(detail::choi_okos_conductivity(c), t);
    k += rule == conductivity_rule::parallel ? v * ki : v / ki;
  }
  out.conductivity = rule == conductivity_rule::parallel ? k : 1.0 / k;
  return out;
}

}  // namespace colligate::thermal
