#pragma once
/// \file fitters.hpp
/// Fit colligate's model constants to a lab's own data, and turn the result into a
/// solute record that solutions can use (through a solute_table: built-ins + fitted).
///
/// Norrish constants of one non-electrolyte (models/norrish.hpp, our sign convention
/// ln a_w = ln x_w - K x_s^2 - K3 x_s^3):
///   - fit_norrish_water_activity: from (molality, a_w) at one temperature; residuals in a_w.
///   - fit_norrish_freezing_point: from (molality, initial freezing point); residuals in K.
///     The model is equilibria::freezing_point with the trial constants; the Jacobian is
///     analytic by implicit differentiation of ln a_w(K, x) = ln a_w,ice(T):
///     dT/dK = -x^2 R T^2 / dH_fus(T)  (d ln a_w,ice / dT = dH_fus / (R T^2), water/ice.hpp).
///
/// Effective solute of an unknown food (the food's dissolved solids as one ideal solute of
/// apparent molar mass M, kg/mol, plus unfreezable water b, kg per kg of food solids, the
/// "bound water" of Schwartzberg 1976, J. Food Sci. 41, 152):
///   - fit_effective_solute_freezing: from (water mass fraction of the food, initial freezing
///     point). With one water content only M and b cannot both be found (the status says
///     singular); fix b (fit_bound_water = false) or give several dilutions.
///   - fit_effective_solute_ice_curve: from (water mass fraction, T, ice mass / total water),
///     e.g. DSC melting curves; the plateau at low T fixes b and the curve near the
///     freezing point fixes M.
///   The solute is a non-electrolyte with Norrish K = 0 (Raoult's law for its particles).
///
/// All inputs SI: molality mol/kg, temperatures K, fractions kg/kg. Bad rows throw
/// invalid_input naming the row and the valid range; fit failures are statuses.

#include <Eigen/Dense>
#include <cmath>
#include <limits>
#include <sstream>
#include <string>
#include <utility>
#include <vector>

#include "colligate/core/constants.hpp"
#include "colligate/core/errors.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/data/solute_record.hpp"
#include "colligate/data/solute_table.hpp"
#include "colligate/equilibria/freezing_point.hpp"
#include "colligate/equilibria/ice_fraction.hpp"
#include "colligate/fit/fitted_uncertainty.hpp"
#include "colligate/fit/levenberg_marquardt.hpp"
#include "colligate/models/norrish.hpp"
#include "colligate/water/ice.hpp"

namespace colligate::fit {

struct norrish_fit_options {
  bool fit_k3 = false;        ///< also fit the cubic constant K3
  double k_start = 2.0;       ///< start value of K
  double k3_start = 0.0;      ///< start value of K3
  fit_options least_squares;  ///< solver settings (bounds, tolerances)
};

struct effective_solute_options {
  double molar_mass_start = 0.2;       ///< kg/mol
  double bound_water_start = 0.1;      ///< kg per kg of solids
  bool fit_bound_water = true;         ///< false: b stays at bound_water_start
  double min_molar_mass = 0.005;       ///< kg/mol, bound of the fit
  double max_molar_mass = 100.0;       ///< kg/mol
  double max_bound_water = 3.0;        ///< kg per kg of solids, bound of the fit
  fit_options least_squares;           ///< solver settings (tolerances; bounds set here)
};

namespace detail {

inline constexpr const char* fitted_id = "fitted_solute";

/// A non-electrolyte record with trial constants, used while fitting.
inline data::solute_record trial_record(double molar_mass, double k, double k3) {
  data::solute_record r;
  r.id = fitted_id;
  r.name = "fitted solute";
  r.molar_mass = molar_mass;
  r.molar_mass_source = "colligate_fit_user";
  r.kind = data::solute_class::non_electrolyte;
  r.particles = 1;
  r.particles_source = "common practice";
  r.norrish.available = true;
  r.norrish.k = k;
  r.norrish.k3 = k3;
  r.norrish.k_source = "colligate_fit_user";
  r.norrish.k3_source = "colligate_fit_user";
  r.norrish.max_mass_fraction = 1.0;
  r.norrish.note = "trial constants during a fit";
  return r;
}

inline void check_rows(const char* where, const char* field, const Eigen::VectorXd& v,
                       double lo, double hi, bool lo_open, bool hi_open, const char* range) {
  for (Eigen::Index i = 0; i < v.size(); ++i) {
    const double a = v[i];
    const bool ok = std::isfinite(a) && (lo_open ? a > lo : a >= lo) && (hi_open ? a < hi : a <= hi);
    if (!ok)
      throw invalid_input(colligate::detail::describe(
          where, std::string(field) + " in data row " + std::to_string(i), a,
          std::string("must be finite and in ") + range));
  }
}

inline void check_same_size(const char* where, const Eigen::VectorXd& a, const char* na,
                            const Eigen::VectorXd& b, const char* nb) {
  if (a.size() != b.size())
    throw invalid_input(std::string(where) + ": " + na + " has " + std::to_string(a.size()) +
                        " values but " + nb + " has " + std::to_string(b.size()) +
                        "; they must match");
}

/// Mole fraction of a single non-electrolyte at molality m (mol/kg).
inline double solute_mole_fraction(double m) {
  return m / (1.0 / constants::molar_mass_water + m);
}

inline Eigen::VectorXd norrish_start(const norrish_fit_options& o) {
  Eigen::VectorXd p0(o.fit_k3 ? 2 : 1);
  p0[0] = o.k_start;
  if (o.fit_k3) p0[1] = o.k3_start;
  return p0;
}

inline std::vector<std::string> norrish_names(const norrish_fit_options& o) {
  std::vector<std::string> n{"norrish_k"};
  if (o.fit_k3) n.push_back("norrish_k3");
  return n;
}

/// Solution of one food: water mass fraction w, solids 1 - w as the effective solute.
inline solution food_solution(double w, double /*molar_mass*/, const data::solute_table& table) {
  return solution::from_masses(w, {{fitted_id, 1.0 - w}}, table);
}

}  // namespace detail

/// Norrish K (and K3) from water activities `water_activity` of a binary solution at
/// molalities `molality` (mol/kg), temperature `temperature` (K). Weights optional.
inline fit_result fit_norrish_water_activity(const Eigen::VectorXd& molality,
                                             const Eigen::VectorXd& water_activity,
                                             double temperature,
                                             const Eigen::VectorXd& weights = Eigen::VectorXd(),
                                             const norrish_fit_options& options = {}) {
  const char* where = "fit_norrish (water activity)";
  detail::check_same_size(where, molality, "molality", water_activity, "water_activity");
  detail::check_rows(where, "molality", molality, 0.0, INFINITY, true, true, "(0, inf) mol/kg");
  detail::check_rows(where, "water_activity", water_activity, 0.0, 1.0, true, false, "(0, 1]");
  if (!std::isfinite(temperature) || !(temperature > 0.0))
    throw invalid_input(colligate::detail::describe(where, "temperature", temperature,
                                                    "must be finite and > 0 K"));
  const bool k3 = options.fit_k3;
  auto model = [temperature, k3](const Eigen::MatrixXd& x, const Eigen::VectorXd& p) {
    const data::solute_table table({detail::trial_record(0.1, p[0], k3 ? p[1] : 0.0)});
    Eigen::VectorXd aw(x.rows());
    for (Eigen::Index i = 0; i < x.rows(); ++i) {
      const auto s = solution::from_molalities({{detail::fitted_id, x(i, 0)}}, 1.0, table);
      aw[i] = std::exp(models::norrish::ln_water_activity(s, 1.0, temperature));
    }
    return aw;
  };
  auto jacobian = [&model, k3](const Eigen::MatrixXd& x, const Eigen::VectorXd& p) {
    const Eigen::VectorXd aw = model(x, p);
    Eigen::MatrixXd J(x.rows(), k3 ? 2 : 1);
    for (Eigen::Index i = 0; i < x.rows(); ++i) {
      const double xs = detail::solute_mole_fraction(x(i, 0));
      J(i, 0) = -aw[i] * xs * xs;  // d a_w / dK
      if (k3) J(i, 1) = -aw[i] * xs * xs * xs;
    }
    return J;
  };
  auto r = curve_fit(model, molality, water_activity, detail::norrish_start(options), weights,
                     options.least_squares, jacobian);
  r.parameter_names = detail::norrish_names(options);
  return r;
}

/// Norrish K (and K3) from initial freezing points `freezing_point` (K) of binary solutions
/// at molalities `molality` (mol/kg). Weights optional.
inline fit_result fit_norrish_freezing_point(const Eigen::VectorXd& molality,
                                             const Eigen::VectorXd& freezing_point,
                                             const Eigen::VectorXd& weights = Eigen::VectorXd(),
                                             const norrish_fit_options& options = {}) {
  const char* where = "fit_norrish (freezing point)";
  detail::check_same_size(where, molality, "molality", freezing_point, "freezing_point");
  detail::check_rows(where, "molality", molality, 0.0, INFINITY, true, true, "(0, inf) mol/kg");
  detail::check_rows(where, "freezing_point", freezing_point, equilibria::search_min_temperature,
                     constants::ice_point, false, false, "[223.15, 273.15] K");
  const bool k3 = options.fit_k3;
  auto model = [k3](const Eigen::MatrixXd& x, const Eigen::VectorXd& p) {
    const data::solute_table table({detail::trial_record(0.1, p[0], k3 ? p[1] : 0.0)});
    Eigen::VectorXd T(x.rows());
    for (Eigen::Index i = 0; i < x.rows(); ++i) {
      const auto s = solution::from_molalities({{detail::fitted_id, x(i, 0)}}, 1.0, table);
      const auto fp = equilibria::freezing_point(s, "norrish");
      T[i] = fp.status == equilibria::solve_status::converged
                 ? fp.temperature
                 : std::numeric_limits<double>::quiet_NaN();
    }
    return T;
  };
  auto jacobian = [&model, k3](const Eigen::MatrixXd& x, const Eigen::VectorXd& p) {
    const Eigen::VectorXd T = model(x, p);
    Eigen::MatrixXd J(x.rows(), k3 ? 2 : 1);
    for (Eigen::Index i = 0; i < x.rows(); ++i) {
      const double xs = detail::solute_mole_fraction(x(i, 0));
      const double dT_dk =
          -constants::gas_constant * T[i] * T[i] / water::enthalpy_of_fusion(T[i]);
      J(i, 0) = dT_dk * xs * xs;
      if (k3) J(i, 1) = dT_dk * xs * xs * xs;
    }
    return J;
  };
  auto r = curve_fit(model, molality, freezing_point, detail::norrish_start(options), weights,
                     options.least_squares, jacobian);
  r.parameter_names = detail::norrish_names(options);
  return r;
}

/// A solute record carrying fitted Norrish constants (source key colligate_fit_user).
/// `max_mass_fraction` is the highest binary mass fraction of the data (the validated range).
inline data::solute_record norrish_solute_record(const fit_result& r, const std::string& id,
                                                 const std::string& name, double molar_mass,
                                                 double max_mass_fraction,
                                                 const std::string& note) {
  if (!(molar_mass > 0.0) || !std::isfinite(molar_mass))
    throw invalid_input(colligate::detail::describe("norrish_solute_record", "molar_mass",
                                                    molar_mass, "must be finite and > 0 kg/mol"));
  if (!(max_mass_fraction > 0.0 && max_mass_fraction < 1.0))
    throw invalid_input(colligate::detail::describe("norrish_solute_record", "max_mass_fraction",
                                                    max_mass_fraction, "must lie in (0, 1)"));
  if (r.params.size() < 1 || !r.params.allFinite())
    throw invalid_input("norrish_solute_record: the fit has no finite constants (status " +
                        std::string(to_string(r.status)) + ")");
  auto rec = detail::trial_record(molar_mass, r.params[0], r.params.size() > 1 ? r.params[1] : 0.0);
  rec.id = id;
  rec.name = name.empty() ? id : name;
  rec.norrish.max_mass_fraction = max_mass_fraction;
  if (r.params.size() < 2) rec.norrish.k3_source.clear();
  rec.norrish.note = note;
  rec.uncertainty = uncertainty_of(r);  // the fit's covariance travels with the record
  return rec;
}

namespace detail {

inline Eigen::VectorXd effective_start(const effective_solute_options& o) {
  Eigen::VectorXd p0(o.fit_bound_water ? 2 : 1);
  p0[0] = o.molar_mass_start;
  if (o.fit_bound_water) p0[1] = o.bound_water_start;
  return p0;
}

inline fit_options effective_bounds(const effective_solute_options& o) {
  fit_options f = o.least_squares;
  if (o.fit_bound_water) {
    f.lower_bounds = Eigen::Vector2d(o.min_molar_mass, 0.0);
    f.upper_bounds = Eigen::Vector2d(o.max_molar_mass, o.max_bound_water);
  } else {
    f.lower_bounds = Eigen::VectorXd::Constant(1, o.min_molar_mass);
    f.upper_bounds = Eigen::VectorXd::Constant(1, o.max_molar_mass);
  }
  return f;
}

inline std::vector<std::string> effective_names(const effective_solute_options& o) {
  std::vector<std::string> n{"molar_mass"};
  if (o.fit_bound_water) n.push_back("bound_water_per_solids");
  return n;
}

inline void check_effective_options(const char* where, const effective_solute_options& o) {
  // The bounds are options with defaults the caller may never have seen: name their values.
  const auto within = [](double lo, double hi, const char* unit) {
    std::ostringstream os;
    os.precision(6);
    os << "must lie within the bounds of the fit, [" << lo << ", " << hi << "] " << unit;
    return os.str();
  };
  if (!(o.min_molar_mass > 0.0 && o.min_molar_mass < o.max_molar_mass)) {
    std::ostringstream os;
    os.precision(6);
    os << "must be > 0 and below max_molar_mass = " << o.max_molar_mass << " kg/mol";
    throw invalid_input(colligate::detail::describe(where, "min_molar_mass", o.min_molar_mass, os.str()));
  }
  if (!(o.molar_mass_start >= o.min_molar_mass && o.molar_mass_start <= o.max_molar_mass))
    throw invalid_input(colligate::detail::describe(where, "molar_mass_start", o.molar_mass_start,
                                                    within(o.min_molar_mass, o.max_molar_mass, "kg/mol")));
  if (!(o.bound_water_start >= 0.0 && o.bound_water_start <= o.max_bound_water))
    throw invalid_input(colligate::detail::describe(where, "bound_water_start", o.bound_water_start,
                                                    within(0.0, o.max_bound_water, "kg per kg of solids")));
}

}  // namespace detail

/// Effective solute (M, b) from initial freezing points `freezing_point` (K) of the food at
/// water mass fractions `water_fraction` (kg water / kg food).
inline fit_result fit_effective_solute_freezing(const Eigen::VectorXd& water_fraction,
                                                const Eigen::VectorXd& freezing_point,
                                                const Eigen::VectorXd& weights = Eigen::VectorXd(),
                                                const effective_solute_options& options = {}) {
  const char* where = "fit_effective_solute (freezing point)";
  detail::check_effective_options(where, options);
  detail::check_same_size(where, water_fraction, "water_fraction", freezing_point, "freezing_point");
  detail::check_rows(where, "water_fraction", water_fraction, 0.0, 1.0, true, true, "(0, 1) kg/kg");
  detail::check_rows(where, "freezing_point", freezing_point, equilibria::search_min_temperature,
                     constants::ice_point, false, false, "[223.15, 273.15] K");
  const bool fit_b = options.fit_bound_water;
  const double b_fixed = options.bound_water_start;
  auto model = [fit_b, b_fixed](const Eigen::MatrixXd& x, const Eigen::VectorXd& p) {
    const data::solute_table table({detail::trial_record(p[0], 0.0, 0.0)});
    const double b = fit_b ? p[1] : b_fixed;
    Eigen::VectorXd T(x.rows());
    for (Eigen::Index i = 0; i < x.rows(); ++i) {
      const double w = x(i, 0);
      const double bound = b * (1.0 - w);
      if (!(bound < w)) {  // all water bound: the food cannot freeze
        T[i] = std::numeric_limits<double>::quiet_NaN();
        continue;
      }
      const auto fp = equilibria::freezing_point(detail::food_solution(w, p[0], table),
                                                 "norrish", bound);
      T[i] = fp.status == equilibria::solve_status::converged
                 ? fp.temperature
                 : std::numeric_limits<double>::quiet_NaN();
    }
    return T;
  };
  auto r = curve_fit(model, water_fraction, freezing_point, detail::effective_start(options),
                     weights, detail::effective_bounds(options));
  r.parameter_names = detail::effective_names(options);
  return r;
}

/// Effective solute (M, b) from an ice-fraction curve: at temperatures `temperature` (K)
/// the ice mass over total water mass `ice_fraction` of a food of water mass fraction
/// `water_fraction` (one value per row, kg water / kg food).
inline fit_result fit_effective_solute_ice_curve(const Eigen::VectorXd& water_fraction,
                                                 const Eigen::VectorXd& temperature,
                                                 const Eigen::VectorXd& ice_fraction,
                                                 const Eigen::VectorXd& weights = Eigen::VectorXd(),
                                                 const effective_solute_options& options = {}) {
  const char* where = "fit_effective_solute (ice curve)";
  detail::check_effective_options(where, options);
  detail::check_same_size(where, water_fraction, "water_fraction", temperature, "temperature");
  detail::check_same_size(where, temperature, "temperature", ice_fraction, "ice_fraction");
  detail::check_rows(where, "water_fraction", water_fraction, 0.0, 1.0, true, true, "(0, 1) kg/kg");
  detail::check_rows(where, "temperature", temperature, water::ice_model_min_temperature - 10.0,
                     constants::ice_point, false, false, "[223.15, 273.15] K");
  detail::check_rows(where, "ice_fraction", ice_fraction, 0.0, 1.0, false, true, "[0, 1)");
  const bool fit_b = options.fit_bound_water;
  const double b_fixed = options.bound_water_start;
  Eigen::MatrixXd x(temperature.size(), 2);
  x.col(0) = water_fraction;
  x.col(1) = temperature;
  auto model = [fit_b, b_fixed](const Eigen::MatrixXd& xx, const Eigen::VectorXd& p) {
    const data::solute_table table({detail::trial_record(p[0], 0.0, 0.0)});
    const double b = fit_b ? p[1] : b_fixed;
    Eigen::VectorXd ice(xx.rows());
    for (Eigen::Index i = 0; i < xx.rows(); ++i) {
      const double w = xx(i, 0);
      const double bound = b * (1.0 - w);
      if (!(bound < w)) {
        ice[i] = std::numeric_limits<double>::quiet_NaN();
        continue;
      }
      const auto u = equilibria::unfrozen_phase_at(detail::food_solution(w, p[0], table),
                                                   xx(i, 1), "norrish", bound);
      ice[i] = u.success() ? u.ice_fraction() : std::numeric_limits<double>::quiet_NaN();
    }
    return ice;
  };
  auto r = curve_fit(model, x, ice_fraction, detail::effective_start(options), weights,
                     detail::effective_bounds(options));
  r.parameter_names = detail::effective_names(options);
  return r;
}

/// A solute record for a fitted effective solute: molar mass from the fit (with its
/// variance and degrees of freedom as the record's uncertainty), Norrish K = 0.
/// The bound water is a property of the food, not of the solute: pass
/// bound_water = b * (solids mass) to freezing_point / ice_fraction.
inline data::solute_record effective_solute_record(const fit_result& r, const std::string& id,
                                                   const std::string& name,
                                                   const std::string& note) {
  if (r.params.size() < 1 || !r.params.allFinite() || !(r.params[0] > 0.0))
    throw invalid_input("effective_solute_record: the fit has no finite molar mass (status " +
                        std::string(to_string(r.status)) + ")");
  auto rec = detail::trial_record(r.params[0], 0.0, 0.0);
  rec.id = id;
  rec.name = name.empty() ? id : name;
  rec.norrish.k3_source.clear();
  rec.norrish.max_mass_fraction = 0.9;  // the food's own solids: checked by the fit data only
  rec.norrish.note = note;
  // The fit's uncertainty of M travels with the record (its variance and the data's degrees
  // of freedom). The bound water b is a property of the food, not of the record: its
  // uncertainty and its covariance with M stay with the fit result and are not propagated;
  // a prediction with the record takes b as exact.
  const auto u = uncertainty_of(r);
  if (u.stated()) {
    rec.uncertainty.names = {"molar_mass"};
    rec.uncertainty.covariance = {u.at(0, 0)};
    rec.uncertainty.degrees_of_freedom = u.degrees_of_freedom;
    rec.uncertainty.source = u.source;
  }
  return rec;
}

/// A table holding every record of `base` plus `extra` (e.g. built-ins + fitted solutes).
inline data::solute_table extend_table(const data::solute_table& base,
                                       const std::vector<data::solute_record>& extra) {
  data::solute_table t = base;
  for (const auto& r : extra) t.add(r);
  return t;
}

}  // namespace colligate::fit
