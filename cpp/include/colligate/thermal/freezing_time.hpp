#pragma once
/// \file freezing_time.hpp
/// Freezing-time estimates by formula: Plank's equation and Pham's (1986) two-stage method.
///
/// Plank (1913), as presented in ASHRAE Handbook - Refrigeration, "Cooling and freezing
/// times of foods" (source keys plank_1913, ashrae_2006_freezing_times):
///
///     t = rho L / (T_f - T_m) * (P a / h + R a^2 / k_f)
///
/// with a the full thickness of a slab or the diameter of an infinite cylinder or sphere
/// (Plank's definition), rho the density, L the latent heat of the food (J/kg of food),
/// T_f its initial freezing point, T_m the medium temperature, h the surface heat-transfer
/// coefficient and k_f the conductivity of the frozen food. P, R = 1/2, 1/8 (slab),
/// 1/4, 1/16 (infinite cylinder), 1/6, 1/24 (sphere). Plank's time is the phase change
/// alone: no precooling, no subcooling, the food freezing at one temperature.
///
/// Pham (1986), J. Food Technol. 21, 209-219 (source key pham_1986), the simplified
/// two-stage method, with the input definitions as presented by ASHRAE (temperatures in
/// degC only inside the empirical mean freezing temperature):
///
///     T_fm = 1.8 + 0.263 T_c + 0.105 T_m                          (mean freezing temperature)
///     dH1  = rho_u c_u (T_i - T_fm)                               (precooling, J/m^3)
///     dH2  = rho_f [L_f + c_f (T_fm - T_c)]                       (freezing + subcooling, J/m^3)
///     dT1  = (T_i + T_fm)/2 - T_m,   dT2 = T_fm - T_m
///     t    = d / (E h) * (dH1/dT1 + dH2/dT2) * (1 + Bi/2),    Bi = h d / k_f
///
/// with d the shortest distance from the surface to the thermal centre (half the
/// thickness, the radius) and E the equivalent heat-transfer dimensionality: 1 (slab),
/// 2 (infinite cylinder), 3 (sphere), or the value of shape_factors.hpp for a finite body.
/// Pham compared the method with the measured Tylose, minced-meat and other freezing times
/// it was derived from and reported errors of a few per cent (order 5 %, from memory; the
/// paper's exact statistics were not re-read for this header).
/// With T_i = T_fm (no precooling) and c_f = 0 it reduces exactly to Plank's equation
/// with T_f = T_fm, the identity tested beside the published examples.

#include <cmath>
#include <string>

#include "colligate/core/constants.hpp"
#include "colligate/core/errors.hpp"

namespace colligate::thermal {

/// The one-dimensional shapes of Plank's and Pham's formulas and of the simulation.
enum class body_shape { slab, infinite_cylinder, sphere };

inline const char* to_string(body_shape s) {
  switch (s) {
    case body_shape::slab: return "slab";
    case body_shape::infinite_cylinder: return "cylinder";
    case body_shape::sphere: return "sphere";
  }
  return "unknown";
}

inline body_shape body_shape_from_string(const std::string& s) {
  if (s == "slab" || s == "plate") return body_shape::slab;
  if (s == "cylinder" || s == "infinite_cylinder") return body_shape::infinite_cylinder;
  if (s == "sphere") return body_shape::sphere;
  throw invalid_input("shape = '" + s + "': valid shapes are slab, cylinder, sphere");
}

/// Equivalent heat-transfer dimensionality of the 1-D shapes: 1, 2, 3.
inline double dimensionality(body_shape s) {
  switch (s) {
    case body_shape::slab: return 1.0;
    case body_shape::infinite_cylinder: return 2.0;
    case body_shape::sphere: return 3.0;
  }
  return 1.0;
}

/// Plank's shape factors P and R (Plank 1913).
struct plank_factors {
  double P;
  double R;
};

inline plank_factors plank_shape_factors(body_shape s) {
  switch (s) {
    case body_shape::slab: return {1.0 / 2.0, 1.0 / 8.0};
    case body_shape::infinite_cylinder: return {1.0 / 4.0, 1.0 / 16.0};
    case body_shape::sphere: return {1.0 / 6.0, 1.0 / 24.0};
  }
  return {0.5, 0.125};
}

namespace detail {

inline void require_positive(const char* where, const char* field, double v, const char* unit) {
  if (!std::isfinite(v) || !(v > 0.0))
    throw invalid_input(colligate::detail::describe(where, field, v,
                                                    std::string("must be finite and > 0 ") + unit));
}

inline void require_temperature(const char* where, const char* field, double v) {
  if (!std::isfinite(v) || !(v > 0.0))
    throw invalid_input(
        colligate::detail::describe(where, field, v, "must be a finite absolute temperature > 0 K"));
}

}  // namespace detail

/// Plank's freezing time, s. `size` is the full thickness (slab) or the diameter, m;
/// `latent_heat` J/kg of food; temperatures K; `h` W/(m^2 K); `k_frozen` W/(m K).
inline double plank_time(body_shape shape, double size, double density, double latent_heat,
                         double freezing_temperature, double medium_temperature, double h,
                         double k_frozen) {
  const char* where = "plank_time";
  detail::require_positive(where, "size", size, "m (full thickness or diameter)");
  detail::require_positive(where, "density", density, "kg/m^3");
  detail::require_positive(where, "latent_heat", latent_heat, "J/kg");
  detail::require_temperature(where, "T_freeze", freezing_temperature);
  detail::require_temperature(where, "T_medium", medium_temperature);
  detail::require_positive(where, "h", h, "W/(m^2 K)");
  detail::require_positive(where, "k_frozen", k_frozen, "W/(m K)");
  if (!(medium_temperature < freezing_temperature))
    throw invalid_input(colligate::detail::describe(
        where, "T_medium", medium_temperature,
        "must be colder than T_freeze (" + std::to_string(freezing_temperature) +
            " K) for the food to freeze"));
  const auto f = plank_shape_factors(shape);
  return density * latent_heat / (freezing_temperature - medium_temperature) *
         (f.P * size / h + f.R * size * size / k_frozen);
}

/// Inputs of Pham's (1986) method, SI (temperatures in K).
struct pham_inputs {
  double size = 0.0;                 ///< full thickness or diameter, m (d = size / 2)
  double shape_factor = 1.0;         ///< E: 1 slab, 2 infinite cylinder, 3 sphere, or EHTD
  double initial_temperature = 0.0;  ///< T_i, K
  double medium_temperature = 0.0;   ///< T_m, K
  double centre_temperature = 0.0;   ///< final thermal-centre temperature T_c, K
  double density_unfrozen = 0.0;     ///< rho_u, kg/m^3
  double density_frozen = 0.0;       ///< rho_f, kg/m^3
  double specific_heat_unfrozen = 0.0;  ///< c_u, J/(kg K)
  double specific_heat_frozen = 0.0;    ///< c_f, J/(kg K)
  double latent_heat = 0.0;          ///< L_f, J/kg of food
  double k_frozen = 0.0;             ///< W/(m K)
  double h = 0.0;                    ///< W/(m^2 K)
};

/// The parts of Pham's estimate, for reports.
struct pham_result {
  double time = 0.0;                      ///< s
  double mean_freezing_temperature = 0.0;  ///< T_fm, K
  double precooling_enthalpy = 0.0;        ///< dH1, J/m^3
  double freezing_enthalpy = 0.0;          ///< dH2, J/m^3
  double biot = 0.0;                       ///< h d / k_f
};

/// Pham's mean freezing temperature T_fm (Pham 1986), K.
inline double pham_mean_freezing_temperature(double centre_temperature, double medium_temperature) {
  const double tc = centre_temperature - constants::celsius_offset;
  const double tm = medium_temperature - constants::celsius_offset;
  return constants::celsius_offset + 1.8 + 0.263 * tc + 0.105 * tm;
}

/// Pham's (1986) freezing time with its parts.
inline pham_result pham_estimate(const pham_inputs& in) {
  const char* where = "pham_time";
  detail::require_positive(where, "size", in.size, "m (full thickness or diameter)");
  detail::require_positive(where, "shape_factor", in.shape_factor, "(E: 1 slab, 2 cylinder, 3 sphere)");
  detail::require_temperature(where, "T_initial", in.initial_temperature);
  detail::require_temperature(where, "T_medium", in.medium_temperature);
  detail::require_temperature(where, "T_centre", in.centre_temperature);
  detail::require_positive(where, "density_unfrozen", in.density_unfrozen, "kg/m^3");
  detail::require_positive(where, "density_frozen", in.density_frozen, "kg/m^3");
  detail::require_positive(where, "c_unfrozen", in.specific_heat_unfrozen, "J/(kg K)");
  if (!std::isfinite(in.specific_heat_frozen) || in.specific_heat_frozen < 0.0)
    throw invalid_input(colligate::detail::describe(where, "c_frozen", in.specific_heat_frozen,
                                                    "must be finite and >= 0 J/(kg K)"));
  detail::require_positive(where, "latent_heat", in.latent_heat, "J/kg");
  detail::require_positive(where, "k_frozen", in.k_frozen, "W/(m K)");
  detail::require_positive(where, "h", in.h, "W/(m^2 K)");
  if (!(in.medium_temperature < in.centre_temperature))
    throw invalid_input(colligate::detail::describe(
        where, "T_medium", in.medium_temperature,
        "must be colder than the target centre temperature T_centre (" +
            std::to_string(in.centre_temperature) + " K)"));
  pham_result r;
  r.mean_freezing_temperature = pham_mean_freezing_temperature(in.centre_temperature, in.medium_temperature);
  const double Tfm = r.mean_freezing_temperature;
  if (!(in.initial_temperature >= Tfm))
    throw invalid_input(colligate::detail::describe(
        where, "T_initial", in.initial_temperature,
        "must not lie below Pham's mean freezing temperature T_fm = " + std::to_string(Tfm) +
            " K (the method starts from unfrozen food)"));
  if (!(in.centre_temperature <= Tfm))
    throw invalid_input(colligate::detail::describe(
        where, "T_centre", in.centre_temperature,
        "must not lie above Pham's mean freezing temperature T_fm = " + std::to_string(Tfm) + " K"));
  const double d = in.size / 2.0;
  r.biot = in.h * d / in.k_frozen;
  r.precooling_enthalpy = in.density_unfrozen * in.specific_heat_unfrozen * (in.initial_temperature - Tfm);
  r.freezing_enthalpy =
      in.density_frozen * (in.latent_heat + in.specific_heat_frozen * (Tfm - in.centre_temperature));
  const double dT1 = 0.5 * (in.initial_temperature + Tfm) - in.medium_temperature;
  const double dT2 = Tfm - in.medium_temperature;
  r.time = d / (in.shape_factor * in.h) *
           (r.precooling_enthalpy / dT1 + r.freezing_enthalpy / dT2) * (1.0 + r.biot / 2.0);
  return r;
}

/// Pham's (1986) freezing time, s.
inline double pham_time(const pham_inputs& in) { return pham_estimate(in).time; }

}  // namespace colligate::thermal
