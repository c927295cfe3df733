#pragma once
/// \file pitzer_fitter.hpp
/// Fit the Pitzer binary parameters of one salt (beta0, beta1, C-phi; beta2 for 2:2 salts;
/// optionally the linear temperature terms d/dT at T_r = 298.15 K) to a lab's own data:
///   - fit_pitzer_osmotic_coefficient: (molality, phi) at temperatures T; residuals in phi.
///   - fit_pitzer_water_activity: (molality, a_w) at temperatures T; residuals in a_w.
///   - fit_pitzer_freezing_point: (molality, initial freezing point); residuals in K.
///
/// The model is colligate's own Pitzer model (models/pitzer.hpp) on the binary solution of
/// the salt, with the trial parameters carried by the salt's record
/// (data::record_pitzer_parameters), the same path a fitted salt takes afterwards. Each
/// parameter follows the analytic temperature form of data/pitzer_parameters.hpp reduced to
///
///     P(T) = P(298.15 K) + dP/dT (T - 298.15 K)
///
/// (dP/dT = 0 unless fit_temperature_terms). With data at a single temperature the
/// temperature terms are not identifiable and the result says so (status singular).
///
/// Jacobian. ln a_w of a binary salt solution is affine in the binary parameters: B^phi and
/// C = C-phi / (2 sqrt|z_M z_X|) enter the osmotic sum linearly and the ionic strength does
/// not depend on them (Pitzer 1991, ch. 3; the kernel's equations in
/// models/detail/pitzer_kernel.hpp), and each parameter is linear in its two coefficients
/// above. So d ln a_w / d p_j = ln a_w(p + e_j) - ln a_w(p) exactly (up to rounding), and
///   phi = -ln a_w / (M_w nu m)          ->  d phi / d p_j = -(d ln a_w / d p_j) / (M_w nu m)
///   a_w = exp(ln a_w)                    ->  d a_w / d p_j = a_w d ln a_w / d p_j
///   ln a_w(T_f) = ln a_w,ice(T_f)        ->  d T_f / d p_j = -(d ln a_w / d p_j) / f'(T_f),
/// with f(T) = ln a_w(T) - ln a_w,ice(T) (implicit differentiation; f' by a central
/// difference with h = 1e-3 K, relative error about 1e-8 for this smooth f).
///
/// The fitted parameters become a salt record with its own Pitzer row
/// (pitzer_solute_record); solutions built from a table holding it use the fitted
/// parameters for that cation-anion pair, with no global state.
///
/// Inputs SI: molality mol/kg, temperature K. Caller mistakes (unknown or non-electrolyte
/// salt, ions without Pitzer parameters, non-finite or out-of-range rows, fewer points than
/// parameters) throw invalid_input naming the field; fit failures are statuses.

#include <Eigen/Dense>
#include <algorithm>
#include <cmath>
#include <cstdlib>
#include <limits>
#include <string>
#include <vector>

#include "colligate/core/constants.hpp"
#include "colligate/core/errors.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/data/pitzer_parameters.hpp"
#include "colligate/data/solute_record.hpp"
#include "colligate/data/solute_table.hpp"
#include "colligate/equilibria/freezing_point.hpp"
#include "colligate/fit/fitters.hpp"
#include "colligate/fit/fitted_uncertainty.hpp"
#include "colligate/fit/levenberg_marquardt.hpp"
#include "colligate/models/pitzer.hpp"
#include "colligate/water/ice.hpp"

namespace colligate::fit {

struct pitzer_fit_options {
  /// Also fit d/dT of every fitted parameter at T_r = 298.15 K (needs data at several
  /// temperatures, e.g. freezing points or a_w at two or more temperatures).
  bool fit_temperature_terms = false;
  /// Also fit beta2 (2:2 salts only, alpha2 = 12; Pitzer & Mayorga 1974).
  bool fit_beta2 = false;
  double beta0_start = 0.1;   ///< kg/mol
  double beta1_start = 0.3;   ///< kg/mol
  double beta2_start = 0.0;   ///< kg/mol
  double cphi_start = 0.0;    ///< kg^2/mol^2
  fit_options least_squares;  ///< solver settings (bounds, tolerances)
};

/// Pitzer binary parameters of one salt: values at 298.15 K and their temperature
/// derivatives there (per K).
struct pitzer_salt_parameters {
  double beta0 = 0.0, beta1 = 0.0, beta2 = 0.0, cphi = 0.0;
  double dbeta0_dT = 0.0, dbeta1_dT = 0.0, dbeta2_dT = 0.0, dcphi_dT = 0.0;
};

/// Temperature widening of a fitted salt's validity range beyond its data, K (colligate's
/// choice, as the 25 C harvie_1984 set is used over 298.15 +/- 5 K).
inline constexpr double pitzer_fit_temperature_margin = 5.0;

namespace detail {

/// Cation and anion of a salt record, checked for a Pitzer fit; throws invalid_input.
inline void check_pitzer_salt(const char* where, const data::solute_record& salt,
                              std::string& cation, std::string& anion) {
  if (salt.kind != data::solute_class::electrolyte || salt.ions.empty())
    throw invalid_input(std::string(where) + ": salt = '" + salt.id +
                        "' is a non-electrolyte; Pitzer parameters belong to a salt of one "
                        "cation and one anion (e.g. 'NaCl'); fit a non-electrolyte with "
                        "fit_norrish");
  int n_cat = 0, n_an = 0;
  for (const auto& ion : salt.ions) {
    (ion.charge > 0 ? cation : anion) = ion.ion;
    (ion.charge > 0 ? n_cat : n_an) += 1;
  }
  if (n_cat != 1 || n_an != 1)
    throw invalid_input(std::string(where) + ": salt = '" + salt.id +
                        "' must have exactly one cation and one anion (it has " +
                        std::to_string(n_cat) + " and " + std::to_string(n_an) + ")");
  for (const auto* ion : {&cation, &anion})
    if (data::pitzer_ion_index(*ion) >= data::pitzer_ion_count)
      throw invalid_input(std::string(where) + ": ion '" + *ion + "' of salt '" + salt.id +
                          "' is not one of the ions the Pitzer model handles (Na+, K+, Ca+2, "
                          "Mg+2, Cl-, SO4-2)");
}

inline bool is_two_two(const data::solute_record& salt) {
  for (const auto& ion : salt.ions)
    if (std::abs(ion.charge) != 2) return false;
  return true;
}

inline std::vector<std::string> pitzer_names(const pitzer_fit_options& o) {
  std::vector<std::string> base{"beta0", "beta1"};
  if (o.fit_beta2) base.push_back("beta2");
  base.push_back("cphi");
  std::vector<std::string> names = base;
  if (o.fit_temperature_terms)
    for (const auto& b : base) names.push_back("d" + b + "_dT");
  return names;
}

inline Eigen::VectorXd pitzer_start(const pitzer_fit_options& o) {
  std::vector<double> v{o.beta0_start, o.beta1_start};
  if (o.fit_beta2) v.push_back(o.beta2_start);
  v.push_back(o.cphi_start);
  const std::size_t k = v.size();
  if (o.fit_temperature_terms) v.insert(v.end(), k, 0.0);
  return Eigen::Map<const Eigen::VectorXd>(v.data(), static_cast<Eigen::Index>(v.size()));
}

/// Parameters by name (names as pitzer_names); unknown names throw.
inline pitzer_salt_parameters pitzer_from_names(const std::vector<std::string>& names,
                                                const Eigen::VectorXd& p) {
  pitzer_salt_parameters s;
  for (std::size_t j = 0; j < names.size(); ++j) {
    const double v = p[static_cast<Eigen::Index>(j)];
    const auto& n = names[j];
    if (n == "beta0") s.beta0 = v;
    else if (n == "beta1") s.beta1 = v;
    else if (n == "beta2") s.beta2 = v;
    else if (n == "cphi") s.cphi = v;
    else if (n == "dbeta0_dT") s.dbeta0_dT = v;
    else if (n == "dbeta1_dT") s.dbeta1_dT = v;
    else if (n == "dbeta2_dT") s.dbeta2_dT = v;
    else if (n == "dcphi_dT") s.dcphi_dT = v;
    else
      throw invalid_input("pitzer parameters: unknown parameter name '" + n +
                          "' (the result is not from a Pitzer fit)");
  }
  return s;
}

/// Linear temperature form on the analytic form of data/pitzer_parameters.hpp (a3 term).
inline data::t_function linear_in_t(double value, double slope) {
  return data::t_function{{value, 0.0, 0.0, slope, 0.0, 0.0}};
}

/// A copy of `salt` carrying the Pitzer row `p` (trial or fitted parameters).
inline data::solute_record with_pitzer(const data::solute_record& salt,
                                       const pitzer_salt_parameters& p, double max_molality,
                                       double min_temperature, double max_temperature,
                                       const std::string& source, const std::string& note) {
  std::string cation, anion;
  check_pitzer_salt("pitzer parameters", salt, cation, anion);
  data::solute_record r = salt;
  auto& b = r.pitzer.binary;
  b.cation = cation;
  b.anion = anion;
  b.beta0 = linear_in_t(p.beta0, p.dbeta0_dT);
  b.beta1 = linear_in_t(p.beta1, p.dbeta1_dT);
  b.beta2 = linear_in_t(p.beta2, p.dbeta2_dT);
  b.cphi = linear_in_t(p.cphi, p.dcphi_dT);
  b.max_molality = max_molality;
  b.source = source;
  b.note = note;
  r.pitzer.available = true;
  r.pitzer.min_temperature = min_temperature;
  r.pitzer.max_temperature = max_temperature;
  return r;
}

/// ln a_w of the binary solution of `trial` (1 kg water, molality m) at T.
inline double binary_ln_water_activity(const data::solute_table& table, const std::string& id,
                                       double m, double T) {
  const auto s = solution::from_molalities({{id, m}}, 1.0, table);
  return models::pitzer::ln_water_activity(s, 1.0, T);
}

/// The data kinds a Pitzer fit accepts; x columns are (molality, temperature).
enum class pitzer_data_kind { osmotic_coefficient, water_activity, freezing_point };

/// Model values at rows x = (molality, temperature; temperature unused for freezing points).
inline Eigen::VectorXd pitzer_model_values(pitzer_data_kind kind, const data::solute_record& salt,
                                           const std::vector<std::string>& names,
                                           const Eigen::MatrixXd& x, const Eigen::VectorXd& p) {
  const auto trial = with_pitzer(salt, pitzer_from_names(names, p), INFINITY, 0.0, INFINITY,
                                 "colligate_fit_user", "trial parameters during a fit");
  const data::solute_table table({trial});
  const double nu = salt.particles;
  Eigen::VectorXd f(x.rows());
  for (Eigen::Index i = 0; i < x.rows(); ++i) {
    const double m = x(i, 0);
    switch (kind) {
      case pitzer_data_kind::osmotic_coefficient:
        f[i] = -binary_ln_water_activity(table, trial.id, m, x(i, 1)) /
               (constants::molar_mass_water * nu * m);
        break;
      case pitzer_data_kind::water_activity:
        f[i] = std::exp(binary_ln_water_activity(table, trial.id, m, x(i, 1)));
        break;
      case pitzer_data_kind::freezing_point: {
        const auto s = solution::from_molalities({{trial.id, m}}, 1.0, table);
        const auto fp = equilibria::freezing_point(s, "pitzer");
        f[i] = fp.success() ? fp.temperature : std::numeric_limits<double>::quiet_NaN();
        break;
      }
    }
  }
  return f;
}

/// Analytic Jacobian of pitzer_model_values (see the file comment).
inline Eigen::MatrixXd pitzer_model_jacobian(pitzer_data_kind kind, const data::solute_record& salt,
                                             const std::vector<std::string>& names,
                                             const Eigen::MatrixXd& x, const Eigen::VectorXd& p) {
  const Eigen::Index k = p.size();
  auto table_for = [&](const Eigen::VectorXd& q) {
    return data::solute_table({with_pitzer(salt, pitzer_from_names(names, q), INFINITY, 0.0,
                                           INFINITY, "colligate_fit_user",
                                           "trial parameters during a fit")});
  };
  std::vector<data::solute_table> tables;
  tables.reserve(static_cast<std::size_t>(k + 1));
  tables.push_back(table_for(p));
  for (Eigen::Index j = 0; j < k; ++j) tables.push_back(table_for(p + Eigen::VectorXd::Unit(k, j)));
  const std::string& id = salt.id;
  const Eigen::VectorXd f = kind == pitzer_data_kind::freezing_point
                                ? pitzer_model_values(kind, salt, names, x, p)
                                : Eigen::VectorXd();
  const double nu = salt.particles;
  Eigen::MatrixXd J(x.rows(), k);
  for (Eigen::Index i = 0; i < x.rows(); ++i) {
    const double m = x(i, 0);
    const double T = kind == pitzer_data_kind::freezing_point ? f[i] : x(i, 1);
    if (!std::isfinite(T)) {
      J.row(i).setConstant(std::numeric_limits<double>::quiet_NaN());
      continue;
    }
    const double l0 = binary_ln_water_activity(tables[0], id, m, T);
    double scale = 0.0;
    switch (kind) {
      case pitzer_data_kind::osmotic_coefficient:
        scale = -1.0 / (constants::molar_mass_water * nu * m);
        break;
      case pitzer_data_kind::water_activity:
        scale = std::exp(l0);
        break;
      case pitzer_data_kind::freezing_point: {
        constexpr double h = 1e-3;  // K
        auto imbalance = [&](double t) {
          return binary_ln_water_activity(tables[0], id, m, t) - water::ln_water_activity_of_ice(t);
        };
        scale = -1.0 / ((imbalance(T + h) - imbalance(T - h)) / (2.0 * h));
        break;
      }
    }
    for (Eigen::Index j = 0; j < k; ++j)
      J(i, j) = scale * (binary_ln_water_activity(tables[static_cast<std::size_t>(j + 1)], id, m, T) - l0);
  }
  return J;
}

inline fit_result fit_pitzer_rows(const char* where, pitzer_data_kind kind,
                                  const data::solute_record& salt, const Eigen::MatrixXd& x,
                                  const Eigen::VectorXd& y, const Eigen::VectorXd& weights,
                                  const pitzer_fit_options& options) {
  std::string cation, anion;
  check_pitzer_salt(where, salt, cation, anion);
  if (options.fit_beta2 && !is_two_two(salt))
    throw invalid_input(std::string(where) + ": fit_beta2 is for 2:2 salts (e.g. MgSO4); '" +
                        salt.id + "' is not one (its beta2 is 0 by convention)");
  const auto names = pitzer_names(options);
  auto model = [kind, salt, names](const Eigen::MatrixXd& xx, const Eigen::VectorXd& p) {
    return pitzer_model_values(kind, salt, names, xx, p);
  };
  auto jacobian = [kind, salt, names](const Eigen::MatrixXd& xx, const Eigen::VectorXd& p) {
    return pitzer_model_jacobian(kind, salt, names, xx, p);
  };
  auto r = curve_fit(model, x, y, pitzer_start(options), weights, options.least_squares, jacobian);
  r.parameter_names = names;
  return r;
}

/// (molality, temperature) rows; a single temperature applies to every row.
inline Eigen::MatrixXd pitzer_rows(const char* where, const Eigen::VectorXd& molality,
                                   const Eigen::VectorXd& temperature) {
  if (temperature.size() != 1 && temperature.size() != molality.size())
    throw invalid_input(std::string(where) + ": temperature has " +
                        std::to_string(temperature.size()) + " values; give one, or one per row (" +
                        std::to_string(molality.size()) + ")");
  check_rows(where, "temperature", temperature, 0.0, INFINITY, true, true, "(0, inf) K");
  Eigen::MatrixXd x(molality.size(), 2);
  x.col(0) = molality;
  if (temperature.size() == 1)
    x.col(1).setConstant(temperature[0]);
  else
    x.col(1) = temperature;
  return x;
}

}  // namespace detail

/// Pitzer parameters of `salt` from osmotic coefficients `osmotic_coefficient` of its binary
/// solutions at molalities `molality` (mol/kg) and temperatures `temperature` (K; one value
/// for all rows, or one per row). Weights optional (relative, e.g. 1/sigma^2).
inline fit_result fit_pitzer_osmotic_coefficient(const data::solute_record& salt,
                                                 const Eigen::VectorXd& molality,
                                                 const Eigen::VectorXd& osmotic_coefficient,
                                                 const Eigen::VectorXd& temperature,
                                                 const Eigen::VectorXd& weights = Eigen::VectorXd(),
                                                 const pitzer_fit_options& options = {}) {
  const char* where = "fit_pitzer (osmotic coefficient)";
  detail::check_same_size(where, molality, "molality", osmotic_coefficient, "osmotic_coefficient");
  detail::check_rows(where, "molality", molality, 0.0, INFINITY, true, true, "(0, inf) mol/kg");
  detail::check_rows(where, "osmotic_coefficient", osmotic_coefficient, 0.0, INFINITY, true, true,
                     "(0, inf)");
  const auto x = detail::pitzer_rows(where, molality, temperature);
  return detail::fit_pitzer_rows(where, detail::pitzer_data_kind::osmotic_coefficient, salt, x,
                                 osmotic_coefficient, weights, options);
}

/// Pitzer parameters of `salt` from water activities of its binary solutions at molalities
/// `molality` (mol/kg) and temperatures `temperature` (K; one, or one per row).
inline fit_result fit_pitzer_water_activity(const data::solute_record& salt,
                                            const Eigen::VectorXd& molality,
                                            const Eigen::VectorXd& water_activity,
                                            const Eigen::VectorXd& temperature,
                                            const Eigen::VectorXd& weights = Eigen::VectorXd(),
                                            const pitzer_fit_options& options = {}) {
  const char* where = "fit_pitzer (water activity)";
  detail::check_same_size(where, molality, "molality", water_activity, "water_activity");
  detail::check_rows(where, "molality", molality, 0.0, INFINITY, true, true, "(0, inf) mol/kg");
  detail::check_rows(where, "water_activity", water_activity, 0.0, 1.0, true, true, "(0, 1)");
  const auto x = detail::pitzer_rows(where, molality, temperature);
  return detail::fit_pitzer_rows(where, detail::pitzer_data_kind::water_activity, salt, x,
                                 water_activity, weights, options);
}

/// Pitzer parameters of `salt` from initial freezing points `freezing_point` (K) of its
/// binary solutions at molalities `molality` (mol/kg).
inline fit_result fit_pitzer_freezing_point(const data::solute_record& salt,
                                            const Eigen::VectorXd& molality,
                                            const Eigen::VectorXd& freezing_point,
                                            const Eigen::VectorXd& weights = Eigen::VectorXd(),
                                            const pitzer_fit_options& options = {}) {
  const char* where = "fit_pitzer (freezing point)";
  detail::check_same_size(where, molality, "molality", freezing_point, "freezing_point");
  detail::check_rows(where, "molality", molality, 0.0, INFINITY, true, true, "(0, inf) mol/kg");
  detail::check_rows(where, "freezing_point", freezing_point, equilibria::search_min_temperature,
                     constants::ice_point, false, true, "[223.15, 273.15) K");
  Eigen::MatrixXd x(molality.size(), 2);
  x.col(0) = molality;
  x.col(1) = freezing_point;  // not used by the model; kept for duplicate detection
  return detail::fit_pitzer_rows(where, detail::pitzer_data_kind::freezing_point, salt, x,
                                 freezing_point, weights, options);
}

/// The parameters of a Pitzer fit result (zero for parameters not fitted).
inline pitzer_salt_parameters pitzer_parameters_of(const fit_result& r) {
  if (r.parameter_names.size() != static_cast<std::size_t>(r.params.size()) ||
      !r.params.allFinite())
    throw invalid_input("pitzer_solute_record: the fit has no finite Pitzer parameters (status " +
                        std::string(to_string(r.status)) + ")");
  return detail::pitzer_from_names(r.parameter_names, r.params);
}

/// A salt record (a copy of `salt`: molar mass, ions) carrying the Pitzer parameters `p`
/// as its own row, valid to `max_molality` (mol/kg) between `min_temperature` and
/// `max_temperature` (K). The copy has a new id and name and no formula or aliases, so it
/// sits beside the built-in salt in one table without ambiguous names.
inline data::solute_record pitzer_salt_record(const data::solute_record& salt,
                                              const std::string& id, const std::string& name,
                                              const pitzer_salt_parameters& p,
                                              double max_molality, double min_temperature,
                                              double max_temperature,
                                              const std::string& source, const std::string& note) {
  const char* where = "pitzer_salt_record";
  if (id.empty()) throw invalid_input(std::string(where) + ": id must not be empty");
  if (!(max_molality > 0.0) || !std::isfinite(max_molality))
    throw invalid_input(colligate::detail::describe(where, "max_molality", max_molality,
                                                    "must be finite and > 0 mol/kg"));
  if (!(min_temperature > 0.0 && min_temperature <= max_temperature) ||
      !std::isfinite(max_temperature))
    throw invalid_input(colligate::detail::describe(
        where, "min_temperature", min_temperature,
        "must be > 0 K and not above max_temperature (" + std::to_string(max_temperature) + " K)"));
  for (double v : {p.beta0, p.beta1, p.beta2, p.cphi, p.dbeta0_dT, p.dbeta1_dT, p.dbeta2_dT,
                   p.dcphi_dT})
    if (!std::isfinite(v))
      throw invalid_input(std::string(where) + ": every Pitzer parameter must be finite");
  if ((p.beta2 != 0.0 || p.dbeta2_dT != 0.0) && !detail::is_two_two(salt))
    throw invalid_input(std::string(where) + ": beta2 is for 2:2 salts only; '" + salt.id +
                        "' is not one");
  auto r = detail::with_pitzer(salt, p, max_molality, min_temperature, max_temperature,
                               source.empty() ? "colligate_fit_user" : source, note);
  r.id = id;
  r.name = name.empty() ? id : name;
  r.formula.clear();
  r.aliases.clear();
  return r;
}

/// The salt record of a Pitzer fit (source key colligate_fit_user); see pitzer_salt_record.
inline data::solute_record pitzer_solute_record(const fit_result& r,
                                                const data::solute_record& salt,
                                                const std::string& id, const std::string& name,
                                                double max_molality, double min_temperature,
                                                double max_temperature, const std::string& note) {
  auto rec = pitzer_salt_record(salt, id, name, pitzer_parameters_of(r), max_molality,
                                min_temperature, max_temperature, "colligate_fit_user", note);
  rec.uncertainty = uncertainty_of(r);  // the fit's covariance travels with the record
  return rec;
}

}  // namespace colligate::fit
