#pragma once
/// \file freezing_time_uncertainty.hpp
/// Freezing times with their standard uncertainty (GUM, JCGM 100:2008): Plank's and Pham's
/// formulas by the law of propagation of uncertainty with closed-form partial derivatives,
/// the enthalpy-method simulation by seeded Monte Carlo (JCGM 101:2008).
///
/// Two kinds of input carry uncertainty:
/// - the constants of the food's solutes (a fitted record's covariance, data/builtin_uncertainty.hpp
///   for the built-in ones): they reach the times through the initial freezing point T_f and the
///   ice fraction I(T_c) at the final centre temperature, which sets the frozen density and
///   conductivity (conductivity.hpp). dT_f/dp and dI/dp come from the implicit differentiation
///   of the ice line (equilibria/prediction_uncertainty.hpp); d rho/dI and d k/dI are the
///   derivatives of the Choi & Okos (1986) mixing rules below. The latent heat (freezable water
///   times the heat of fusion at 0 C) and the fully frozen specific heat do not depend on the
///   activity constants. Pham's unfrozen specific heat c_u is taken at T_mean, the mean of
///   T_i and T_f (food_freezing.hpp, not below 0 C), so it follows T_f with slope
///   dc_u/dT / 2: the Choi & Okos part of that slope is the derivative of their polynomials
///   (components.hpp) and is propagated; the dissolved salts' and ethanol's own apparent specific
///   heats (dissolved_solutes.hpp, Laliberte 2009) enter c_u with their slope left out (a
///   change of order 1e-4 of c_u per K for a brine; none for sugars, which count as carbohydrate);
/// - the process inputs the user states with a standard uncertainty: the heat-transfer
///   coefficient h, the size and the medium temperature. They are taken as uncorrelated with each
///   other and with the constants, with infinite degrees of freedom (their uncertainties are
///   taken as known, GUM G.4).
///
/// Plank (freezing_time.hpp), t = rho L / (T_f - T_m) (P a / h + R a^2 / k_f):
///
///     dt/drho = t/rho,  dt/dL = t/L,  dt/dT_f = -t/(T_f - T_m),  dt/dT_m = t/(T_f - T_m),
///     dt/dh = -A P a / h^2,  dt/dk_f = -A R a^2 / k_f^2,  dt/da = A (P/h + 2 R a/k_f),
///     A = rho L / (T_f - T_m).
///
/// Pham (1986), t = G Q with G = d/(E h) (1 + Bi/2) = d/(E h) + d^2/(2 E k_f), d = a/2, and
/// Q = dH1/dT1 + dH2/dT2 (symbols of freezing_time.hpp); T_fm = 1.8 + 0.263 T_c + 0.105 T_m
/// (degC) enters dH1, dH2, dT1 and dT2, so dT_fm/dT_c = 0.263 and dT_fm/dT_m = 0.105 are
/// chained in:
///
///     dQ/dT_fm = -rho_u c_u/dT1 - dH1/(2 dT1^2) + rho_f c_f/dT2 - dH2/dT2^2
///     dQ/dT_m  = dH1/dT1^2 + dH2/dT2^2 + 0.105 dQ/dT_fm
///     dQ/dT_c  = -rho_f c_f/dT2 + 0.263 dQ/dT_fm
///     dQ/dT_i  = rho_u c_u/dT1 - dH1/(2 dT1^2)
///     dQ/drho_u = c_u (T_i - T_fm)/dT1,  dQ/dc_u = rho_u (T_i - T_fm)/dT1,
///     dQ/drho_f = (L + c_f (T_fm - T_c))/dT2,  dQ/dc_f = rho_f (T_fm - T_c)/dT2,  dQ/dL = rho_f/dT2
///     dG/dh = -d/(E h^2),  dG/dk_f = -d^2/(2 E k_f^2),  dG/da = (1/(E h) + d/(E k_f))/2,  dt/dE = -t/E
///
/// Pham's time does not depend on T_f (his T_fm is empirical); it depends on the constants only
/// through rho_f and k_f. The shape factor E of a finite body is taken as exact.

#include <Eigen/Dense>
#include <cmath>
#include <cstdint>
#include <initializer_list>
#include <limits>
#include <random>
#include <string>
#include <utility>
#include <vector>

#include "colligate/core/constants.hpp"
#include "colligate/core/errors.hpp"
#include "colligate/equilibria/prediction_uncertainty.hpp"
#include "colligate/fit/propagation.hpp"
#include "colligate/thermal/conductivity.hpp"
#include "colligate/thermal/enthalpy_simulation.hpp"
#include "colligate/thermal/food_freezing.hpp"
#include "colligate/thermal/freezing_time.hpp"

namespace colligate::thermal {

/// Plank's time and its partial derivatives with respect to each input (SI).
struct plank_partials {
  double time = 0.0;
  double size = 0.0;                   ///< dt/da, s/m
  double density = 0.0;                ///< dt/drho
  double latent_heat = 0.0;            ///< dt/dL
  double freezing_temperature = 0.0;   ///< dt/dT_f, s/K
  double medium_temperature = 0.0;     ///< dt/dT_m, s/K
  double h = 0.0;                      ///< dt/dh
  double k_frozen = 0.0;               ///< dt/dk_f
};

inline plank_partials plank_time_partials(body_shape shape, double size, double density,
                                          double latent_heat, double freezing_temperature,
                                          double medium_temperature, double h, double k_frozen) {
  plank_partials d;
  d.time = plank_time(shape, size, density, latent_heat, freezing_temperature, medium_temperature,
                      h, k_frozen);  // validates the inputs
  const auto f = plank_shape_factors(shape);
  const double dT = freezing_temperature - medium_temperature;
  const double A = density * latent_heat / dT;
  d.size = A * (f.P / h + 2.0 * f.R * size / k_frozen);
  d.density = d.time / density;
  d.latent_heat = d.time / latent_heat;
  d.freezing_temperature = -d.time / dT;
  d.medium_temperature = d.time / dT;
  d.h = -A * f.P * size / (h * h);
  d.k_frozen = -A * f.R * size * size / (k_frozen * k_frozen);
  return d;
}

/// Pham's time and its partial derivatives with respect to each input of pham_inputs (SI).
struct pham_partials {
  double time = 0.0;
  double size = 0.0;
  double shape_factor = 0.0;
  double initial_temperature = 0.0;
  double medium_temperature = 0.0;
  double centre_temperature = 0.0;
  double density_unfrozen = 0.0;
  double density_frozen = 0.0;
  double specific_heat_unfrozen = 0.0;
  double specific_heat_frozen = 0.0;
  double latent_heat = 0.0;
  double k_frozen = 0.0;
  double h = 0.0;
};

inline pham_partials pham_time_partials(const pham_inputs& in) {
  const auto r = pham_estimate(in);  // validates the inputs
  pham_partials p;
  p.time = r.time;
  const double Tfm = r.mean_freezing_temperature;
  const double d = in.size / 2.0, E = in.shape_factor, h = in.h, k = in.k_frozen;
  const double dH1 = r.precooling_enthalpy, dH2 = r.freezing_enthalpy;
  const double dT1 = 0.5 * (in.initial_temperature + Tfm) - in.medium_temperature;
  const double dT2 = Tfm - in.medium_temperature;
  const double Q = dH1 / dT1 + dH2 / dT2;
  const double G = d / (E * h) + d * d / (2.0 * E * k);
  const double rcu = in.density_unfrozen * in.specific_heat_unfrozen;
  const double rcf = in.density_frozen * in.specific_heat_frozen;
  const double dQ_dTfm = -rcu / dT1 - dH1 / (2.0 * dT1 * dT1) + rcf / dT2 - dH2 / (dT2 * dT2);
  p.initial_temperature = G * (rcu / dT1 - dH1 / (2.0 * dT1 * dT1));
  p.medium_temperature = G * (dH1 / (dT1 * dT1) + dH2 / (dT2 * dT2) + 0.105 * dQ_dTfm);
  p.centre_temperature = G * (-rcf / dT2 + 0.263 * dQ_dTfm);
  p.density_unfrozen = G * in.specific_heat_unfrozen * (in.initial_temperature - Tfm) / dT1;
  p.specific_heat_unfrozen = G * in.density_unfrozen * (in.initial_temperature - Tfm) / dT1;
  p.density_frozen =
      G * (in.latent_heat + in.specific_heat_frozen * (Tfm - in.centre_temperature)) / dT2;
  p.specific_heat_frozen = G * in.density_frozen * (Tfm - in.centre_temperature) / dT2;
  p.latent_heat = G * in.density_frozen / dT2;
  p.h = Q * (-d / (E * h * h));
  p.k_frozen = Q * (-d * d / (2.0 * E * k * k));
  p.size = Q * 0.5 * (1.0 / (E * h) + d / (E * k));
  p.shape_factor = -p.time / E;
  return p;
}

/// d(density)/dI and d(conductivity)/dI of food_density_conductivity at fixed T: the ice
/// fraction I moves mass x_w I from the water row to the ice row. With the specific volume
/// v = sum m_i / rho_i (dv/dI = x_w (1/rho_ice - 1/rho_water)) and the total mass M:
/// rho = M / v, so drho/dI = -rho dv/dI / v; parallel k = N / v with
/// N = sum (m_i / rho_i) k_i, dk/dI = (dN/dI - k dv/dI) / v; series 1/k = S / v with
/// S = sum m_i / (rho_i k_i), d(1/k)/dI = (dS/dI - dv/dI / k) / v.
struct food_transport_slopes {
  double density = 0.0;       ///< kg/m^3 per unit ice fraction
  double conductivity = 0.0;  ///< W/(m K) per unit ice fraction
};

inline food_transport_slopes food_density_conductivity_ice_slopes(
    const food_composition& x, double temperature, double ice_fraction,
    conductivity_rule rule = conductivity_rule::parallel) {
  const auto base = food_density_conductivity(x, temperature, ice_fraction, rule);  // validates
  const double t = temperature - constants::celsius_offset;
  const double rho_w = detail::poly(detail::choi_okos_density(component::water), t);
  const double rho_i = detail::poly(detail::choi_okos_density(component::ice), t);
  const double k_w = detail::poly(detail::choi_okos_conductivity(component::water), t);
  const double k_i = detail::poly(detail::choi_okos_conductivity(component::ice), t);
  const double mass = x.water + x.protein + x.fat + x.carbohydrate + x.fibre + x.ash;
  const double v = mass / base.density;
  const double dv = x.water * (1.0 / rho_i - 1.0 / rho_w);
  food_transport_slopes s;
  s.density = -base.density * dv / v;
  const double k = base.conductivity;
  if (rule == conductivity_rule::parallel) {
    const double dN = x.water * (k_i / rho_i - k_w / rho_w);
    s.conductivity = (dN - k * dv) / v;
  } else {
    const double dS = x.water * (1.0 / (rho_i * k_i) - 1.0 / (rho_w * k_w));
    const double d_inv_k = (dS - dv / k) / v;
    s.conductivity = -k * k * d_inv_k;
  }
  return s;
}

/// Standard uncertainties of the inputs of Plank's formula given as numbers (0: exact).
struct plank_input_uncertainty {
  double size = 0.0, density = 0.0, latent_heat = 0.0, freezing_temperature = 0.0,
         medium_temperature = 0.0, h = 0.0, k_frozen = 0.0;
};

namespace detail {

inline void check_uncertainties(const char* where, std::initializer_list<std::pair<const char*, double>> all) {
  for (const auto& [name, v] : all)
    if (!std::isfinite(v) || v < 0.0)
      throw invalid_input(colligate::detail::describe(where, name, v, "must be a finite standard uncertainty >= 0"));
}

/// sqrt(sum (c_i u_i)^2): uncorrelated inputs (GUM eq. 10), normal law (degrees of freedom 0).
inline fit::uncertain_value combine(double value, std::initializer_list<std::pair<double, double>> terms) {
  fit::uncertain_value r;
  r.value = value;
  double u2 = 0.0;
  for (const auto& [c, u] : terms) u2 += (c * u) * (c * u);
  r.standard_uncertainty = std::sqrt(u2);
  return r;
}

}  // namespace detail

/// Plank's time from numbers with stated standard uncertainties of any of them,
/// uncorrelated (GUM eq. 10), coverage from the normal law.
inline fit::uncertain_value plank_time_with_uncertainty(body_shape shape, double size, double density,
                                                        double latent_heat, double freezing_temperature,
                                                        double medium_temperature, double h, double k_frozen,
                                                        const plank_input_uncertainty& u) {
  detail::check_uncertainties("plank_time", {{"u_size", u.size}, {"u_density", u.density},
                                             {"u_latent_heat", u.latent_heat},
                                             {"u_T_freeze", u.freezing_temperature},
                                             {"u_T_medium", u.medium_temperature}, {"u_h", u.h},
                                             {"u_k_frozen", u.k_frozen}});
  const auto d = plank_time_partials(shape, size, density, latent_heat, freezing_temperature,
                                     medium_temperature, h, k_frozen);
  return detail::combine(d.time, {{d.size, u.size}, {d.density, u.density}, {d.latent_heat, u.latent_heat},
                                  {d.freezing_temperature, u.freezing_temperature},
                                  {d.medium_temperature, u.medium_temperature}, {d.h, u.h},
                                  {d.k_frozen, u.k_frozen}});
}

/// Standard uncertainties of the inputs of Pham's method given as numbers (0: exact).
struct pham_input_uncertainty {
  double size = 0.0, initial_temperature = 0.0, medium_temperature = 0.0, centre_temperature = 0.0,
         density_unfrozen = 0.0, density_frozen = 0.0, specific_heat_unfrozen = 0.0,
         specific_heat_frozen = 0.0, latent_heat = 0.0, k_frozen = 0.0, h = 0.0;
};

/// Pham's time from numbers with stated standard uncertainties, as plank_time_with_uncertainty.
inline fit::uncertain_value pham_time_with_uncertainty(const pham_inputs& in, const pham_input_uncertainty& u) {
  detail::check_uncertainties("pham_time", {{"u_size", u.size}, {"u_T_initial", u.initial_temperature},
                                            {"u_T_medium", u.medium_temperature},
                                            {"u_T_centre", u.centre_temperature},
                                            {"u_density_unfrozen", u.density_unfrozen},
                                            {"u_density_frozen", u.density_frozen},
                                            {"u_c_unfrozen", u.specific_heat_unfrozen},
                                            {"u_c_frozen", u.specific_heat_frozen},
                                            {"u_latent_heat", u.latent_heat}, {"u_k_frozen", u.k_frozen},
                                            {"u_h", u.h}});
  const auto d = pham_time_partials(in);
  return detail::combine(d.time, {{d.size, u.size}, {d.initial_temperature, u.initial_temperature},
                                  {d.medium_temperature, u.medium_temperature},
                                  {d.centre_temperature, u.centre_temperature},
                                  {d.density_unfrozen, u.density_unfrozen}, {d.density_frozen, u.density_frozen},
                                  {d.specific_heat_unfrozen, u.specific_heat_unfrozen},
                                  {d.specific_heat_frozen, u.specific_heat_frozen},
                                  {d.latent_heat, u.latent_heat}, {d.k_frozen, u.k_frozen}, {d.h, u.h}});
}

/// d c_u / dT of the Choi & Okos (1986) part of the unfrozen food's specific heat
/// (components.hpp: c = 1e3 (k0 + k1 t + k2 t^2), t in degC), J/(kg K^2).
inline double unfrozen_specific_heat_slope(const food_composition& x, double temperature) {
  const double t = temperature - constants::celsius_offset;
  const auto slope = [t](component c) {
    const auto k = detail::choi_okos_coefficients(c);
    return 1e3 * (k[1] + 2.0 * k[2] * t);
  };
  return x.water * slope(component::water) + x.protein * slope(component::protein) +
         x.fat * slope(component::fat) + x.carbohydrate * slope(component::carbohydrate) +
         x.fibre * slope(component::fibre) + x.ash * slope(component::ash);
}

/// Which formula.
enum class freezing_time_method { plank, pham };

inline const char* to_string(freezing_time_method m) {
  return m == freezing_time_method::plank ? "plank" : "pham";
}

/// A freezing process for a food (SI). Plank uses the frozen density at the target
/// centre temperature; Pham uses shape_factor E (0: the 1-D shape's 1, 2, 3).
struct freezing_process {
  body_shape shape = body_shape::slab;
  double size = 0.0;                  ///< full thickness or diameter, m
  double shape_factor = 0.0;          ///< Pham's E; 0: dimensionality of `shape`
  double initial_temperature = 0.0;   ///< K
  double medium_temperature = 0.0;    ///< K
  double h = 0.0;                     ///< W/(m^2 K)
  double target_temperature = 0.0;    ///< final centre temperature, K
  conductivity_rule rule = conductivity_rule::parallel;
};

/// Standard uncertainties of the stated process inputs (0: taken as exact).
struct process_uncertainty {
  double h = 0.0;                   ///< u(h), W/(m^2 K)
  double size = 0.0;                ///< u(size), m
  double medium_temperature = 0.0;  ///< u(T_m), K

  void validate(const char* where) const {
    const std::pair<const char*, double> all[] = {{"u_h", h}, {"u_size", size}, {"u_T_medium", medium_temperature}};
    for (const auto& [name, v] : all)
      if (!std::isfinite(v) || v < 0.0)
        throw invalid_input(colligate::detail::describe(where, name, v,
                                                        "must be a finite standard uncertainty >= 0"));
  }
};

namespace detail {

inline double effective_shape_factor(const freezing_process& p) {
  return p.shape_factor > 0.0 ? p.shape_factor : dimensionality(p.shape);
}

inline pham_inputs pham_inputs_of(const food_freezing_inputs& in, const freezing_process& p) {
  pham_inputs q;
  q.size = p.size;
  q.shape_factor = effective_shape_factor(p);
  q.initial_temperature = p.initial_temperature;
  q.medium_temperature = p.medium_temperature;
  q.centre_temperature = p.target_temperature;
  q.density_unfrozen = in.density_unfrozen;
  q.density_frozen = in.density_frozen;
  q.specific_heat_unfrozen = in.specific_heat_unfrozen;
  q.specific_heat_frozen = in.specific_heat_frozen;
  q.latent_heat = in.latent_heat;
  q.k_frozen = in.k_frozen;
  q.h = p.h;
  return q;
}

/// The constants of the food's water phase plus the three process inputs, in that order,
/// as one block-diagonal set (each process input a block of its own with infinite degrees
/// of freedom).
struct time_inputs {
  equilibria::constant_set constants;  ///< the solutes' constants
  Eigen::VectorXd values;              ///< constants, then h, size, T_m
  Eigen::MatrixXd covariance;
  equilibria::constant_set extended;   ///< for the effective degrees of freedom
  std::vector<std::string> labels;
};

inline time_inputs gather_time_inputs(const food& f, const freezing_process& p, const process_uncertainty& u) {
  time_inputs t;
  const auto& s = f.water_phase();
  t.constants = equilibria::uncertain_constants(s);
  const auto n = t.constants.values.size();
  t.values.resize(n + 3);
  t.values.head(n) = t.constants.values;
  t.values[n] = p.h;
  t.values[n + 1] = p.size;
  t.values[n + 2] = p.medium_temperature;
  t.covariance = Eigen::MatrixXd::Zero(n + 3, n + 3);
  t.covariance.topLeftCorner(n, n) = t.constants.covariance;
  t.covariance(n, n) = u.h * u.h;
  t.covariance(n + 1, n + 1) = u.size * u.size;
  t.covariance(n + 2, n + 2) = u.medium_temperature * u.medium_temperature;
  t.extended = t.constants;
  t.extended.covariance = t.covariance;
  const int blocks = static_cast<int>(t.extended.block_dof.size());
  for (int b = 0; b < 3; ++b) {
    t.extended.constants.push_back({0, ""});
    t.extended.block_of.push_back(blocks + b);
    t.extended.block_dof.push_back(0);
  }
  for (std::size_t k = 0; k < t.constants.constants.size(); ++k) t.labels.push_back(t.constants.label(k, s));
  t.labels.insert(t.labels.end(), {"process.h", "process.size", "process.T_medium"});
  return t;
}

/// The food and process with the inputs `v` (order of time_inputs).
inline std::pair<food, freezing_process> with_time_inputs(const food& f, const freezing_process& p,
                                                          const time_inputs& t, const Eigen::VectorXd& v) {
  const auto n = t.constants.values.size();
  freezing_process q = p;
  q.h = v[n];
  q.size = v[n + 1];
  q.medium_temperature = v[n + 2];
  if (n == 0) return {f, q};
  food g(f.composition(), equilibria::with_constants(f.water_phase(), t.constants, v.head(n)),
         f.bound_water_fraction_of_water(), f.model());
  return {std::move(g), q};
}

}  // namespace detail

/// The plain freezing time of a food by Plank or Pham, s.
inline double food_freezing_time(const food& f, freezing_time_method method, const freezing_process& p) {
  const auto in = freezing_inputs_of_food(f, p.initial_temperature, p.target_temperature, p.rule);
  if (method == freezing_time_method::plank)
    return plank_time(p.shape, p.size, in.density_frozen, in.latent_heat, in.initial_freezing_point,
                      p.medium_temperature, p.h, in.k_frozen);
  return pham_time(detail::pham_inputs_of(in, p));
}

/// A food's freezing time by Plank or Pham with its standard uncertainty (linear
/// propagation; see the file comment). `constants` of the result lists the solutes'
/// uncertain constants, then "process.h", "process.size", "process.T_medium".
inline equilibria::prediction_uncertainty food_freezing_time_with_uncertainty(
    const food& f, freezing_time_method method, const freezing_process& p, const process_uncertainty& u) {
  const char* where = method == freezing_time_method::plank ? "plank_time" : "pham_time";
  u.validate(where);
  const auto t = detail::gather_time_inputs(f, p, u);
  const auto in = freezing_inputs_of_food(f, p.initial_temperature, p.target_temperature, p.rule);
  const auto& s = f.water_phase();
  const double bound = f.bound_water_in_phase();
  const auto n = t.constants.values.size();
  Eigen::VectorXd g = Eigen::VectorXd::Zero(n + 3);
  equilibria::prediction_uncertainty out;
  // d(ice fraction at T_c)/dp -> d rho_f/dp, d k_f/dp
  Eigen::VectorXd dI = Eigen::VectorXd::Zero(n);
  if (n > 0) {
    const auto ice = equilibria::propagate_linear(equilibria::predicted_quantity::ice_fraction, s,
                                                  p.target_temperature, f.model(), bound);
    dI = ice.sensitivities;
  }
  auto curve = ice_curve_of(f);
  const double I_c = food_properties(f, curve, p.target_temperature, p.rule).ice_fraction;
  const auto slopes = food_density_conductivity_ice_slopes(f.composition(), p.target_temperature, I_c, p.rule);
  double value = 0.0;
  if (method == freezing_time_method::plank) {
    const auto d = plank_time_partials(p.shape, p.size, in.density_frozen, in.latent_heat,
                                       in.initial_freezing_point, p.medium_temperature, p.h, in.k_frozen);
    value = d.time;
    if (n > 0) {
      const auto fp = equilibria::propagate_linear(equilibria::predicted_quantity::freezing_point, s, 0.0,
                                                   f.model(), bound);
      g.head(n) = d.freezing_temperature * fp.sensitivities +
                  (d.density * slopes.density + d.k_frozen * slopes.conductivity) * dI;
    }
    g[n] = d.h;
    g[n + 1] = d.size;
    g[n + 2] = d.medium_temperature;
  } else {
    const auto d = pham_time_partials(detail::pham_inputs_of(in, p));
    value = d.time;
    if (n > 0) {
      g.head(n) = (d.density_frozen * slopes.density + d.k_frozen * slopes.conductivity) * dI;
      const double T_mean = 0.5 * (p.initial_temperature + in.initial_freezing_point);
      if (T_mean > constants::ice_point) {  // c_u at T_mean follows T_f (file comment)
        const auto fp = equilibria::propagate_linear(equilibria::predicted_quantity::freezing_point, s, 0.0,
                                                     f.model(), bound);
        g.head(n) += d.specific_heat_unfrozen * 0.5 *
                     unfrozen_specific_heat_slope(f.composition(), T_mean) * fp.sensitivities;
      }
    }
    g[n] = d.h;
    g[n + 1] = d.size;
    g[n + 2] = d.medium_temperature;
  }
  out.constants = t.labels;
  out.not_stated = t.constants.not_stated;
  out.sensitivities = g;
  out.result.value = value;
  const double u2 = fit::delta_method_variance(g, t.covariance);
  out.result.standard_uncertainty = std::sqrt(u2);
  out.result.degrees_of_freedom = equilibria::detail::effective_dof(t.extended, g, u2);
  return out;
}

namespace detail {

/// Monte Carlo over the food's constants and the process inputs; `time_of(food, process)`
/// gives one time (NaN or an exception for a draw without one: left out and counted).
template <class TimeOf>
fit::monte_carlo_result time_monte_carlo(const food& f, const freezing_process& p, const process_uncertainty& u,
                                         int draws, std::uint64_t seed, const char* where, TimeOf&& time_of) {
  u.validate(where);
  const auto t = gather_time_inputs(f, p, u);
  std::mt19937_64 engine(seed);
  return fit::monte_carlo(t.values, t.covariance, draws, engine, [&](const Eigen::VectorXd& v) {
    try {
      const auto fq = with_time_inputs(f, p, t, v);
      return time_of(fq.first, fq.second);
    } catch (const invalid_input&) {  // a draw outside an input's domain (h <= 0, T_m above the target)
      return std::numeric_limits<double>::quiet_NaN();
    } catch (const convergence_error&) {
      return std::numeric_limits<double>::quiet_NaN();
    } catch (const out_of_validity_range&) {
      return std::numeric_limits<double>::quiet_NaN();
    }
  });
}

}  // namespace detail

/// Monte Carlo check of food_freezing_time_with_uncertainty: `draws` samples of the constants
/// and the process inputs (std::mt19937_64 seeded with `seed`).
inline fit::monte_carlo_result food_freezing_time_monte_carlo(const food& f, freezing_time_method method,
                                                              const freezing_process& p,
                                                              const process_uncertainty& u, int draws,
                                                              std::uint64_t seed) {
  return detail::time_monte_carlo(f, p, u, draws, seed, to_string(method),
                                  [method](const food& g, const freezing_process& q) {
                                    return food_freezing_time(g, method, q);
                                  });
}

/// The simulation's time for the centre to reach the target with its uncertainty by Monte
/// Carlo: each draw runs simulate_food with drawn constants, h, size and medium temperature
/// (a medium schedule is shifted as a whole by the drawn offset). `setup` must name a
/// target. A draw that does not reach the target within max_time is left out and counted
/// (finite_draws < draws).
inline fit::monte_carlo_result simulation_time_monte_carlo(const food& f, const simulation_setup& setup,
                                                           const process_uncertainty& u, int draws,
                                                           std::uint64_t seed,
                                                           conductivity_rule rule = conductivity_rule::parallel) {
  const char* where = "simulate_freezing";
  if (std::isnan(setup.target_temperature))
    throw invalid_input(std::string(where) +
                        ": T_target is required for the uncertainty of the time to reach it");
  setup.medium.validate(where);
  freezing_process p;
  p.shape = setup.shape;
  p.size = setup.size;
  p.initial_temperature = setup.initial_temperature;
  p.medium_temperature = setup.medium.temperature.front();
  p.h = setup.h;
  p.target_temperature = setup.target_temperature;
  p.rule = rule;
  return detail::time_monte_carlo(f, p, u, draws, seed, where, [&](const food& g, const freezing_process& q) {
    simulation_setup s = setup;
    s.h = q.h;
    s.size = q.size;
    const double shift = q.medium_temperature - p.medium_temperature;
    for (double& T : s.medium.temperature) T += shift;
    const auto r = simulate_food(g, s, rule);
    return r.status == simulation_status::reached_target ? r.time_to_target
                                                         : std::numeric_limits<double>::quiet_NaN();
  });
}

}  // namespace colligate::thermal
