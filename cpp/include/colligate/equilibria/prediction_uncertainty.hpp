#pragma once
/// \file prediction_uncertainty.hpp
/// Every prediction with its standard uncertainty: the covariance of the solutes'
/// constants (data/constant_uncertainty.hpp; a fitted solute carries its fit's) carried into
/// the freezing point, the ice fraction and unfrozen water at T, the water activity and
/// the osmotic coefficient.
///
/// Linear propagation (GUM, JCGM 100:2008, eq. 13): u^2(y) = g^T Sigma g, with g = dy/dp
/// analytic. On the ice line F(T, p) = ln a_w(W, p) - ln a_w,ice(T) = 0 the implicit
/// function theorem gives
///
///     dT_f / dp = -(dF/dp) / (dF/dT) = (d ln a_w / dp) / (dH_fus(T) / (R T^2) - d ln a_w / dT)
///
/// (water/ice.hpp: d ln a_w,ice/dT = dH_fus/(R T^2); d ln a_w / dT = 0 for model 'norrish');
/// below the freezing point the unfrozen water W_u at T solves
/// ln a_w(W_u, p) = ln a_w,ice(T), so dW_u/dp = -(d ln a_w/dp) / (d ln a_w/dW) and
/// d(ice fraction)/dp = -(dW_u/dp) / W_total. The derivatives of ln a_w are closed forms:
/// models/norrish_sensitivity.hpp (model 'norrish', constants norrish_k, norrish_k3) and
/// models/pitzer_sensitivity.hpp (model 'pitzer', the constants of a salt's own Pitzer row:
/// beta0, beta1, beta2, cphi and their d/dT; its slopes by T and by W include A_phi(T) and
/// E-theta), and under 'norrish' the molar mass of a solute without Norrish constants of its
/// own (an effective solute: models/norrish_sensitivity.hpp). 'auto' takes the linear path
/// where it resolves to one of those two. Other models and constants (a salt + sugar mixture
/// under 'ross', the molar mass of a solute with its own K, a state with a salt crystallised)
/// go through Monte Carlo, which
/// evaluates the plain prediction with constants drawn from N(p, Sigma) (JCGM 101:2008).
///
/// Solutes whose constants carry no covariance (a fitted record's own, or a built-in one's
/// from data/builtin_uncertainty.hpp) are "not stated": they enter as exact and are
/// listed. Constants of different solutes are taken as uncorrelated (separate fits); the
/// degrees of freedom of the result follow Welch-Satterthwaite (GUM G.4.1) over the
/// solutes' contributions, 0 (normal law) when none comes from a fit.

#include <Eigen/Dense>
#include <cmath>
#include <cstdint>
#include <limits>
#include <random>
#include <string>
#include <vector>

#include "colligate/core/constants.hpp"
#include "colligate/core/errors.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/data/builtin_uncertainty.hpp"
#include "colligate/data/solute_table.hpp"
#include "colligate/equilibria/freezing_point.hpp"
#include "colligate/equilibria/ice_fraction.hpp"
#include "colligate/fit/propagation.hpp"
#include "colligate/models/norrish_sensitivity.hpp"
#include "colligate/models/pitzer_sensitivity.hpp"
#include "colligate/models/water_activity.hpp"
#include "colligate/water/ice.hpp"

namespace colligate::equilibria {

/// What is predicted.
enum class predicted_quantity {
  freezing_point,       ///< K
  water_activity,       ///< at T, no ice
  osmotic_coefficient,  ///< at T, no ice
  ice_fraction,         ///< ice / total water at T
  unfrozen_water        ///< liquid water at T, kg
};

inline const char* to_string(predicted_quantity q) {
  switch (q) {
    case predicted_quantity::freezing_point: return "freezing_point";
    case predicted_quantity::water_activity: return "water_activity";
    case predicted_quantity::osmotic_coefficient: return "osmotic_coefficient";
    case predicted_quantity::ice_fraction: return "ice_fraction";
    case predicted_quantity::unfrozen_water: return "unfrozen_water";
  }
  return "unknown";
}

/// One uncertain constant: a solute of the solution and the constant's name.
struct uncertain_constant {
  std::size_t species = 0;
  std::string name;
};

/// The uncertain constants of a solution, their values and joint covariance.
struct constant_set {
  std::vector<uncertain_constant> constants;
  Eigen::VectorXd values;
  Eigen::MatrixXd covariance;
  std::vector<int> block_of;       ///< species-block index of each constant
  std::vector<int> block_dof;      ///< degrees of freedom of each block (0: known)
  std::vector<std::string> not_stated;  ///< ids of solutes without a stated uncertainty

  /// "sucrose.norrish_k"
  std::string label(std::size_t c, const solution& s) const {
    return s.species()[constants[c].species].id + "." + constants[c].name;
  }
};

/// A constant of a record by name (see data/constant_uncertainty.hpp for the names).
inline double constant_value(const data::solute_record& r, const std::string& name) {
  if (name == "norrish_k") return r.norrish.k;
  if (name == "norrish_k3") return r.norrish.k3;
  if (name == "molar_mass") return r.molar_mass;
  if (r.pitzer.available) {
    const auto& b = r.pitzer.binary;
    if (name == "beta0") return b.beta0.a[0];
    if (name == "beta1") return b.beta1.a[0];
    if (name == "beta2") return b.beta2.a[0];
    if (name == "cphi") return b.cphi.a[0];
    if (name == "dbeta0_dT") return b.beta0.a[3];
    if (name == "dbeta1_dT") return b.beta1.a[3];
    if (name == "dbeta2_dT") return b.beta2.a[3];
    if (name == "dcphi_dT") return b.cphi.a[3];
  }
  throw invalid_input("uncertainty of solute '" + r.id + "': constant '" + name +
                      "' is not one the record carries (norrish_k, norrish_k3, molar_mass; "
                      "beta0, beta1, beta2, cphi and their d/dT for a record with its own Pitzer row)");
}

inline void set_constant(data::solute_record& r, const std::string& name, double v) {
  constant_value(r, name);  // names the record and the constant if unknown
  if (name == "norrish_k") r.norrish.k = v;
  else if (name == "norrish_k3") r.norrish.k3 = v;
  else if (name == "molar_mass") r.molar_mass = v;
  else if (name == "beta0") r.pitzer.binary.beta0.a[0] = v;
  else if (name == "beta1") r.pitzer.binary.beta1.a[0] = v;
  else if (name == "beta2") r.pitzer.binary.beta2.a[0] = v;
  else if (name == "cphi") r.pitzer.binary.cphi.a[0] = v;
  else if (name == "dbeta0_dT") r.pitzer.binary.beta0.a[3] = v;
  else if (name == "dbeta1_dT") r.pitzer.binary.beta1.a[3] = v;
  else if (name == "dbeta2_dT") r.pitzer.binary.beta2.a[3] = v;
  else if (name == "dcphi_dT") r.pitzer.binary.cphi.a[3] = v;
}

/// Gathers the covariance blocks of every solute of `s` (block diagonal).
inline constant_set uncertain_constants(const solution& s) {
  constant_set c;
  std::vector<double> vals;
  // A fitted record's own covariance, or a built-in one's stated uncertainty (data/builtin_uncertainty.hpp).
  std::vector<data::constant_uncertainty> stated;
  stated.reserve(s.size());
  for (const auto& r : s.species()) stated.push_back(data::stated_uncertainty(r));
  for (std::size_t i = 0; i < s.size(); ++i) {
    const auto& u = stated[i];
    if (!u.stated()) {
      c.not_stated.push_back(s.species()[i].id);
      continue;
    }
    if (u.covariance.size() != u.size() * u.size())
      throw invalid_input("uncertainty of solute '" + s.species()[i].id + "': the covariance has " +
                          std::to_string(u.covariance.size()) + " entries for " +
                          std::to_string(u.size()) + " constants; it needs their square");
    const int block = static_cast<int>(c.block_dof.size());
    c.block_dof.push_back(u.degrees_of_freedom);
    for (const auto& n : u.names) {
      c.constants.push_back({i, n});
      c.block_of.push_back(block);
      vals.push_back(constant_value(s.species()[i], n));
    }
  }
  const auto n = static_cast<Eigen::Index>(c.constants.size());
  c.values = Eigen::Map<const Eigen::VectorXd>(vals.data(), n);
  c.covariance = Eigen::MatrixXd::Zero(n, n);
  Eigen::Index at = 0;
  for (std::size_t i = 0; i < s.size(); ++i) {
    const auto& u = stated[i];
    if (!u.stated()) continue;
    const auto k = static_cast<Eigen::Index>(u.size());
    for (Eigen::Index a = 0; a < k; ++a)
      for (Eigen::Index b = 0; b < k; ++b)
        c.covariance(at + a, at + b) = u.at(static_cast<std::size_t>(a), static_cast<std::size_t>(b));
    at += k;
  }
  fit::detail::check_covariance("uncertainty of the solution's constants", c.covariance, n);
  return c;
}

/// The same solution with constants `p` (in the order of `c`): the same water and solute
/// masses (an uncertain molar mass changes the moles, not the weighed mass).
inline solution with_constants(const solution& s, const constant_set& c, const Eigen::VectorXd& p) {
  std::vector<data::solute_record> records(s.species().begin(), s.species().end());
  std::vector<named_amount> masses;
  masses.reserve(s.size());
  for (std::size_t i = 0; i < s.size(); ++i) masses.push_back({records[i].id, s.solute_mass(i)});
  for (std::size_t k = 0; k < c.constants.size(); ++k)
    set_constant(records[c.constants[k].species], c.constants[k].name, p[static_cast<Eigen::Index>(k)]);
  return solution::from_masses(s.water_mass(), masses, data::solute_table(std::move(records)));
}

/// The plain prediction (NaN where the model gives none).
inline double predict(predicted_quantity q, const solution& s, double temperature,
                      const models::model_choice& m, double bound_water_kg) {
  switch (q) {
    case predicted_quantity::freezing_point: {
      const auto r = freezing_point(s, m, bound_water_kg);
      return r.success() ? r.temperature : std::numeric_limits<double>::quiet_NaN();
    }
    case predicted_quantity::water_activity:
      return models::water_activity(s, temperature, m).value;
    case predicted_quantity::osmotic_coefficient:
      return models::osmotic_coefficient(s, temperature, m).value;
    case predicted_quantity::ice_fraction:
      return ice_fraction(s, temperature, m, range_policy::extrapolate, bound_water_kg).value;
    case predicted_quantity::unfrozen_water: {
      const auto st = unfrozen_phase_at(s, temperature, m, bound_water_kg);
      return st.success() ? st.unfrozen_water : std::numeric_limits<double>::quiet_NaN();
    }
  }
  return std::numeric_limits<double>::quiet_NaN();
}

/// A prediction with its standard uncertainty (linear propagation).
struct prediction_uncertainty {
  fit::uncertain_value result;
  Eigen::VectorXd sensitivities;     ///< dy/dp_j, in the order of `constants`
  std::vector<std::string> constants;  ///< "solute.constant"
  std::vector<std::string> not_stated;  ///< solutes whose constants enter as exact
  validity check;                     ///< of the prediction itself
};

namespace detail {

/// True for the models with closed-form sensitivities.
inline bool has_linear_path(const std::string& model_id) {
  return model_id == "norrish" || model_id == "pitzer";
}

/// d ln a_w / dp at `water_kg` and temperature T for every constant of `c` (models
/// 'norrish' and 'pitzer'; a constant the model does not use has derivative 0).
inline Eigen::VectorXd ln_aw_gradient(const solution& s, const constant_set& c, double water_kg,
                                      double T, const std::string& model_id) {
  Eigen::VectorXd g(static_cast<Eigen::Index>(c.constants.size()));
  for (std::size_t k = 0; k < c.constants.size(); ++k) {
    const auto& uc = c.constants[k];
    const bool norrish_k = uc.name == "norrish_k" || uc.name == "norrish_k3";
    models::pitzer_constant pc = models::pitzer_constant::beta0;
    const bool pitzer_k = models::pitzer_constant_named(uc.name, pc);
    double d = 0.0;
    if (model_id == "norrish" && uc.name == "molar_mass") {
      d = models::norrish_ln_water_activity_molar_mass_derivative(s, water_kg, uc.species);
    } else if (model_id == "norrish" && norrish_k) {
      d = models::norrish_ln_water_activity_derivative(
          s, water_kg, uc.species,
          uc.name == "norrish_k" ? models::norrish_constant::k : models::norrish_constant::k3);
    } else if (model_id == "pitzer" && pitzer_k) {
      d = models::pitzer_ln_water_activity_derivative(s, water_kg, T, uc.species, pc);
    } else if (model_id == "pitzer" && norrish_k) {
      d = 0.0;  // model 'pitzer' counts non-electrolytes as ideal particles: K unused
    } else {
      throw invalid_input("linear propagation: no closed-form sensitivity of ln a_w to '" +
                          c.label(k, s) + "' under model '" + model_id +
                          "'; use the Monte Carlo propagation for it");
    }
    g[static_cast<Eigen::Index>(k)] = d;
  }
  return g;
}

/// d ln a_w / dT of the solution at fixed amounts (0 for 'norrish', whose a_w does not
/// depend on T).
inline double ln_aw_temperature_slope(const solution& s, double water_kg, double T,
                                      const std::string& model_id) {
  if (model_id != "pitzer") return 0.0;
  const double d = models::pitzer_slopes(s, water_kg, T).by_temperature;
  if (!std::isfinite(d))
    throw invalid_input("linear propagation: no closed-form temperature slope of ln a_w for this "
                        "Pitzer row (extended form); use the Monte Carlo propagation");
  return d;
}

/// Welch-Satterthwaite effective degrees of freedom (GUM G.4.1) over independent blocks.
inline int effective_dof(const constant_set& c, const Eigen::VectorXd& y_gradient, double u2) {
  if (c.block_dof.empty() || !(u2 > 0.0)) return 0;
  double denom = 0.0;
  bool any = false;
  for (std::size_t b = 0; b < c.block_dof.size(); ++b) {
    if (c.block_dof[b] <= 0) continue;
    double ub2 = 0.0;
    for (std::size_t i = 0; i < c.constants.size(); ++i)
      for (std::size_t j = 0; j < c.constants.size(); ++j)
        if (c.block_of[i] == static_cast<int>(b) && c.block_of[j] == static_cast<int>(b))
          ub2 += y_gradient[static_cast<Eigen::Index>(i)] *
                 c.covariance(static_cast<Eigen::Index>(i), static_cast<Eigen::Index>(j)) *
                 y_gradient[static_cast<Eigen::Index>(j)];
    denom += ub2 * ub2 / c.block_dof[b];
    any = true;
  }
  if (!any || !(denom > 0.0)) return 0;
  // Rounded down (GUM G.4.1 note 1); the relative 1e-9 keeps a single block's own degrees
  // of freedom from rounding to one less (u^2 and its block sum are summed in other orders).
  return static_cast<int>(std::floor(u2 * u2 / denom * (1.0 + 1e-9)));
}

}  // namespace detail

/// Value, standard uncertainty and sensitivities of quantity `q` of `s` at `temperature`
/// (K; unused for the freezing point) under model `m`, by linear propagation.
inline prediction_uncertainty propagate_linear(predicted_quantity q, const solution& s,
                                               double temperature, const models::model_choice& m = "auto",
                                               double bound_water_kg = 0.0) {
  if (q != predicted_quantity::freezing_point)
    models::check_temperature_argument(to_string(q), temperature);
  detail::check_bound_water(to_string(q), s, bound_water_kg);
  const constant_set c = uncertain_constants(s);
  prediction_uncertainty out;
  out.not_stated = c.not_stated;
  for (std::size_t k = 0; k < c.constants.size(); ++k) out.constants.push_back(c.label(k, s));
  const auto nan = std::numeric_limits<double>::quiet_NaN();
  Eigen::VectorXd dy = Eigen::VectorXd::Zero(static_cast<Eigen::Index>(c.constants.size()));
  const auto& model = m.resolve(s);
  if (!c.constants.empty() && !detail::has_linear_path(model.id))
    throw invalid_input("linear propagation: model '" + model.id +
                        "' has no closed-form sensitivities to its constants (only 'norrish' "
                        "and 'pitzer' have); use the Monte Carlo propagation");
  double value = nan;
  switch (q) {
    case predicted_quantity::freezing_point: {
      const auto r = freezing_point(s, m, bound_water_kg);
      out.check = r.check;
      value = r.success() ? r.temperature : nan;
      if (std::isfinite(value) && dy.size()) {
        const double T = value;
        const double W = s.water_mass() - bound_water_kg;
        const double ice_slope = water::enthalpy_of_fusion(T) / (constants::gas_constant * T * T);
        dy = detail::ln_aw_gradient(s, c, W, T, model.id) /
             (ice_slope - detail::ln_aw_temperature_slope(s, W, T, model.id));
      }
      break;
    }
    case predicted_quantity::water_activity: {
      const auto r = models::water_activity(s, temperature, m);
      out.check = r.check;
      value = r.value;
      if (std::isfinite(value) && dy.size())
        dy = detail::ln_aw_gradient(s, c, s.water_mass(), temperature, model.id) * value;
      break;
    }
    case predicted_quantity::osmotic_coefficient: {
      const auto r = models::osmotic_coefficient(s, temperature, m);
      out.check = r.check;
      value = r.value;
      const double mp = models::ideal::particle_molality(s, s.water_mass());
      if (std::isfinite(value) && dy.size() && mp > 0.0) {
        dy = -detail::ln_aw_gradient(s, c, s.water_mass(), temperature, model.id) /
             (constants::molar_mass_water * mp);
        // phi = -ln a_w / (M_w m_p): a molar mass also moves the particle molality m_p,
        // dm_p/dM_j = -nu_j m_j / M_j, so dphi/dM_j gains -phi (dm_p/dM_j) / m_p.
        for (std::size_t k = 0; k < c.constants.size(); ++k) {
          if (c.constants[k].name != "molar_mass") continue;
          const auto j = c.constants[k].species;
          const auto& rj = s.species()[j];
          const double dmp = -rj.particles * (s.moles()[j] / s.water_mass()) / rj.molar_mass;
          dy[static_cast<Eigen::Index>(k)] -= value * dmp / mp;
        }
      }
      break;
    }
    case predicted_quantity::ice_fraction:
    case predicted_quantity::unfrozen_water: {
      ice_curve curve(s, m, bound_water_kg);
      const auto st = curve.at(temperature);
      out.check = st.check;
      if (!st.success()) break;
      value = q == predicted_quantity::ice_fraction ? st.ice_fraction() : st.unfrozen_water;
      if (!(st.ice > 0.0) || !dy.size()) break;  // not frozen: no ice to vary
      for (double x : st.precipitated)
        if (x > 0.0)
          throw invalid_input("linear propagation: a salt has crystallised at T = " +
                              std::to_string(temperature) +
                              " K, where the closed-form sensitivities do not hold; use the "
                              "Monte Carlo propagation");
      if (!(st.unfrozen_water > 0.0)) break;  // pure water: all ice, nothing to vary
      const Eigen::VectorXd g = detail::ln_aw_gradient(s, c, st.unfrozen_water, temperature, model.id);
      if (g.isZero(0.0)) break;  // no solute whose constants enter
      double slope = 0.0;
      if (model.id == "pitzer") {
        slope = models::pitzer_slopes(s, st.unfrozen_water, temperature).by_water;
      } else {
        models::ln_water_activity_evaluator ln_aw(m, s);
        double lnaw = 0.0;
        if (!ln_aw.with_slope(st.unfrozen_water, temperature, lnaw, slope)) slope = 0.0;
      }
      if (!(slope > 0.0))
        throw convergence_error("linear propagation: no slope d ln a_w / d W at the unfrozen state");
      const Eigen::VectorXd dW = -g / slope;
      dy = q == predicted_quantity::ice_fraction ? Eigen::VectorXd(-dW / st.total_water) : dW;
      break;
    }
  }
  out.sensitivities = dy;
  out.result.value = value;
  if (!std::isfinite(value)) return out;
  const double u2 = dy.size() ? fit::delta_method_variance(dy, c.covariance) : 0.0;
  out.result.standard_uncertainty = std::sqrt(u2);
  out.result.degrees_of_freedom = detail::effective_dof(c, dy, u2);
  return out;
}

/// Monte Carlo propagation with `draws` samples from a generator seeded with `seed`
/// (std::mt19937_64; the same seed gives the same result on every platform's standard
/// library that implements it, normal draws aside).
inline fit::monte_carlo_result propagate_monte_carlo(predicted_quantity q, const solution& s,
                                                     double temperature, const models::model_choice& m,
                                                     double bound_water_kg, int draws,
                                                     std::uint64_t seed) {
  if (q != predicted_quantity::freezing_point)
    models::check_temperature_argument(to_string(q), temperature);
  detail::check_bound_water(to_string(q), s, bound_water_kg);
  const constant_set c = uncertain_constants(s);
  std::mt19937_64 engine(seed);
  return fit::monte_carlo(c.values, c.covariance, draws, engine, [&](const Eigen::VectorXd& p) {
    try {
      return predict(q, with_constants(s, c, p), temperature, m, bound_water_kg);
    } catch (const invalid_input&) {  // a draw outside a constant's domain (molar mass <= 0)
      return std::numeric_limits<double>::quiet_NaN();
    } catch (const convergence_error&) {  // no ice-curve state for this draw: left out, counted
      return std::numeric_limits<double>::quiet_NaN();
    }
  });
}

}  // namespace colligate::equilibria
