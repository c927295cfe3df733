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
/// E-theta). A salt + sugar mixture under model 'ross' (Ross 1975, models/mixing.hpp) has
/// ln a_w = ln a_w,Pitzer(electrolytes in W) + ln a_w,Norrish(non-electrolytes in W), so its
/// gradient is the Pitzer derivative for a salt's constants and the Norrish derivative with
/// the non-electrolytes alone for a sugar's, its T slope the Pitzer factor's and its W slope
/// the sum of both factors'. 'auto' takes the linear path where it resolves to one of those
/// three. Under 'norrish' the molar mass of a solute without Norrish constants of its own
/// (an effective solute) has a closed form too (models/norrish_sensitivity.hpp). Other models
/// and constants (the molar mass of a solute with its own K or under 'pitzer'/'ross', a state
/// with a salt crystallised) go through Monte Carlo, which evaluates the plain prediction with
/// constants drawn from N(p, Sigma) (JCGM 101:2008).
///
/// Scalar and batch share one implementation (detail::propagate_linear_prepared): what
/// depends on the species list alone (covariance blocks, which closed form each constant
/// takes, the Pitzer rows) is prepared once in a detail::linear_plan, and the evaluator and
/// ice curve are the caller's (one per scalar call, one per batch thread), so a batch row
/// equals the scalar result bit for bit and costs no allocation.
///
/// Solutes whose constants carry no covariance (a fitted record's own, or a built-in one's
/// from data/builtin_uncertainty.hpp) are "not stated": they enter as exact and are
/// listed. Constants of different solutes are taken as uncorrelated (separate fits); the
/// degrees of freedom of the result follow Welch-Satterthwaite (GUM G.4.1) over the
/// solutes' contributions, 0 (normal law) when none comes from a fit.

#include <Eigen/Dense>
#include <algorithm>
#include <cmath>
#include <cstdint>
#include <limits>
#include <memory>
#include <optional>
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
#include "colligate/equilibria/ice_curve.hpp"
#include "colligate/equilibria/ice_fraction.hpp"
#include "colligate/fit/propagation.hpp"
#include "colligate/models/detail/pitzer_record_parameters.hpp"
#include "colligate/models/ideal.hpp"
#include "colligate/models/norrish.hpp"
#include "colligate/models/norrish_sensitivity.hpp"
#include "colligate/models/pitzer.hpp"
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

/// The plain prediction (NaN where the model gives none). With `salts_crystallise` (the
/// plain calls' default) a salt above its solubility crystallises as it does there: the
/// freezing point is that of the first solid (the salt's crystallisation temperature for a
/// brine richer than its eutectic composition, ice_curve::salt_first) and the water
/// activity that of the equilibrium state (water_activity_at_equilibrium); false gives the
/// metastable values of the solution as one liquid.
inline double predict(predicted_quantity q, const solution& s, double temperature,
                      const models::model_choice& m, double bound_water_kg,
                      bool salts_crystallise = true) {
  switch (q) {
    case predicted_quantity::freezing_point: {
      if (salts_crystallise && s.has_electrolytes()) {
        ice_curve curve(s, m, bound_water_kg);
        return first_solid_temperature_checked(curve, range_policy::extrapolate).value;
      }
      const auto r = freezing_point(s, m, bound_water_kg);
      return r.success() ? r.temperature : std::numeric_limits<double>::quiet_NaN();
    }
    case predicted_quantity::water_activity:
      if (salts_crystallise && s.has_electrolytes()) {
        models::ln_water_activity_evaluator ln_aw(m, s);
        return water_activity_at_equilibrium(ln_aw, s, temperature, range_policy::extrapolate).value;
      }
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

/// How the linear propagation differentiates ln a_w: the models with closed-form
/// sensitivities.
enum class linear_path {
  none,     ///< no closed form: Monte Carlo
  norrish,  ///< models/norrish_sensitivity.hpp; ln a_w does not depend on T
  pitzer,   ///< models/pitzer_sensitivity.hpp; non-electrolytes as ideal particles
  ross      ///< Ross (1975) product: Pitzer for the electrolytes + Norrish for the rest
};

inline linear_path linear_path_of(const std::string& model_id) {
  if (model_id == "norrish") return linear_path::norrish;
  if (model_id == "pitzer") return linear_path::pitzer;
  if (model_id == "ross") return linear_path::ross;
  return linear_path::none;
}

/// True for the models with closed-form sensitivities.
inline bool has_linear_path(const std::string& model_id) {
  return linear_path_of(model_id) != linear_path::none;
}

/// nu_eff = u^4 / sum_b (u_b^4 / nu_b) (Welch-Satterthwaite, GUM G.4.1) from u^2 and the sum
/// `denom` over the blocks with degrees of freedom; 0 (normal law) when there is none.
/// Rounded down (GUM G.4.1 note 1); the relative 1e-9 keeps a single block's own degrees of
/// freedom from rounding to one less (u^2 and its block sum are summed in other orders).
inline int welch_satterthwaite(double u2, double denom, bool any_block_with_dof) {
  if (!any_block_with_dof || !(u2 > 0.0) || !(denom > 0.0)) return 0;
  return static_cast<int>(std::floor(u2 * u2 / denom * (1.0 + 1e-9)));
}

/// Welch-Satterthwaite effective degrees of freedom (GUM G.4.1) over independent blocks,
/// for a gradient `y_gradient` over all of `c`'s constants with u^2 = `u2` (the thermal
/// propagation's form; linear_plan::combine does the same on its block ranges).
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
  return welch_satterthwaite(u2, denom, any);
}

/// Everything the linear propagation needs that depends on the species list and the model
/// alone, prepared once: the constants' covariance and blocks (uncertain_constants), the
/// resolved model, which closed form each constant takes, the Pitzer rows with the records'
/// own rows in place (models 'pitzer' and 'ross') and the Norrish terms of the
/// non-electrolytes (model 'ross'). Read-only once built: a batch builds one and every
/// thread reads it; the scalar propagate_linear builds one per call. Refuses (invalid_input)
/// a model without closed forms when some constant is uncertain; a constant without a
/// closed form under the model (an effective solute's molar mass) throws only when a
/// gradient is asked for, so a state that needs none (no ice at T) still has its u = 0.
class linear_plan {
 public:
  linear_plan(const solution& s, const models::model_choice& m)
      : constants_(uncertain_constants(s)), model_(&m.resolve(s)), path_(linear_path_of(model_->id)) {
    if (!constants_.constants.empty() && path_ == linear_path::none)
      throw invalid_input("linear propagation: model '" + model_->id +
                          "' has no closed-form sensitivities to its constants (only 'norrish', "
                          "'pitzer' and 'ross' have); use the Monte Carlo propagation");
    const std::size_t n = constants_.constants.size();
    kind_.resize(n);
    for (std::size_t k = 0; k < n; ++k) {
      const auto& uc = constants_.constants[k];
      auto& d = kind_[k];
      if (uc.name == "norrish_k" || uc.name == "norrish_k3") {
        d.kind = constant_kind::norrish;
        d.norrish = uc.name == "norrish_k" ? models::norrish_constant::k : models::norrish_constant::k3;
      } else if (models::pitzer_constant_named(uc.name, d.pitzer)) {
        d.kind = constant_kind::pitzer;
      } else if (uc.name == "molar_mass") {
        d.kind = constant_kind::molar_mass;
      }
      const bool closed = (d.kind == constant_kind::norrish && path_ != linear_path::none) ||
                          (d.kind == constant_kind::molar_mass && path_ == linear_path::norrish) ||
                          (d.kind == constant_kind::pitzer &&
                           (path_ == linear_path::pitzer || path_ == linear_path::ross));
      if (!closed) {
        d.kind = constant_kind::none;
        d.label = constants_.label(k, s);
      }
    }
    // Block ranges: the constants of one solute are consecutive (uncertain_constants).
    for (std::size_t k = 0; k < n; ++k) {
      const auto b = static_cast<std::size_t>(constants_.block_of[k]);
      if (b >= block_begin_.size()) {
        block_begin_.push_back(k);
        block_end_.push_back(k);
      }
      block_end_[b] = k + 1;
    }
    if ((path_ == linear_path::pitzer || path_ == linear_path::ross) && !constants_.constants.empty()) {
      // The caller's parameter set (model_options), the default when it names none.
      const auto& set = models::pitzer::parameters_for(m.options());
      if (models::detail::has_record_binaries(s)) {
        own_rows_ = std::make_unique<data::pitzer_parameter_set>(models::detail::with_record_binaries(s, set));
        rows_ = own_rows_.get();
      } else {
        rows_ = &set;
      }
      has_electrolytes_ = s.has_electrolytes();
    }
    if (path_ == linear_path::ross)
      for (std::size_t i = 0; i < s.size(); ++i)
        if (s.species()[i].kind != data::solute_class::electrolyte)
          non_electrolytes_.push_back(models::norrish::term_of(s, i));
  }

  const constant_set& constants() const noexcept { return constants_; }
  std::size_t size() const noexcept { return constants_.constants.size(); }
  const models::model_descriptor& model() const noexcept { return *model_; }

  /// d ln a_w / dp_k of `s` (the species the plan was built for, any amounts) with
  /// `water_kg` of water at T, for every constant, into `g` (size() values).
  void ln_aw_gradient(const solution& s, double water_kg, double T, double* g) const {
    for (std::size_t k = 0; k < kind_.size(); ++k) {
      const auto& d = kind_[k];
      const std::size_t j = constants_.constants[k].species;
      switch (d.kind) {
        case constant_kind::norrish:
          g[k] = path_ == linear_path::pitzer
                     ? 0.0  // model 'pitzer' counts non-electrolytes as ideal particles: K unused
                     : models::norrish_ln_water_activity_derivative(
                           s, water_kg, j, d.norrish,
                           path_ == linear_path::ross ? models::norrish_species::non_electrolytes_only
                                                      : models::norrish_species::all);
          break;
        case constant_kind::pitzer:  // the same for the electrolytes alone (Ross): I, Z, m_c m_a
          g[k] = models::pitzer_ln_water_activity_derivative(s, water_kg, T, j, d.pitzer);
          break;
        case constant_kind::molar_mass:  // 'norrish' only (an effective solute; closed above)
          g[k] = models::norrish_ln_water_activity_molar_mass_derivative(s, water_kg, j);
          break;
        case constant_kind::none:
          throw invalid_input("linear propagation: no closed-form sensitivity of ln a_w to '" +
                              d.label + "' under model '" + model_->id +
                              "'; use the Monte Carlo propagation for it");
      }
    }
  }

  /// d ln a_w / dT of `s` with `water_kg` at fixed amounts (1/K): 0 for 'norrish' (a_w
  /// does not depend on T), the Pitzer slope for 'pitzer', and the Pitzer factor's for
  /// 'ross' (its Norrish factor does not depend on T).
  double temperature_slope(const solution& s, double water_kg, double T) const {
    if (path_ == linear_path::norrish || (path_ == linear_path::ross && !has_electrolytes_)) return 0.0;
    double by_T = 0.0, by_W = 0.0;
    models::pitzer_slopes_on_rows(s, water_kg, T, *rows_, path_ == linear_path::ross, by_T, by_W);
    if (!std::isfinite(by_T))
      throw invalid_input("linear propagation: no closed-form temperature slope of ln a_w for this "
                          "Pitzer row (extended form); use the Monte Carlo propagation");
    return by_T;
  }

  /// d ln a_w / dW of `s` with `water_kg` at T (1/kg): the prepared evaluator's closed form
  /// for 'norrish'; the Pitzer slope for 'pitzer'; for 'ross' the sum of the two factors'
  /// slopes, each class alone in the same water. NaN when there is none.
  double water_slope(const solution& s, double water_kg, double T,
                     models::ln_water_activity_evaluator& ln_aw) const {
    double by_T = 0.0, by_W = 0.0;
    switch (path_) {
      case linear_path::norrish: {
        double lnaw = 0.0;
        return ln_aw.with_slope(water_kg, T, lnaw, by_W) ? by_W : std::numeric_limits<double>::quiet_NaN();
      }
      case linear_path::pitzer:
        models::pitzer_slopes_on_rows(s, water_kg, T, *rows_, false, by_T, by_W);
        return by_W;
      case linear_path::ross: {
        if (has_electrolytes_) models::pitzer_slopes_on_rows(s, water_kg, T, *rows_, true, by_T, by_W);
        double lnaw_ne = 0.0, slope_ne = 0.0;
        if (!non_electrolytes_.empty())
          models::norrish::ln_water_activity_with_slope(non_electrolytes_.data(), non_electrolytes_.size(),
                                                        s.moles().data(), water_kg, lnaw_ne, slope_ne);
        return by_W + slope_ne;
      }
      case linear_path::none: break;
    }
    return std::numeric_limits<double>::quiet_NaN();
  }

  /// u^2 = g^T Sigma g (GUM eq. 13) over the solutes' blocks (Sigma is block diagonal) and
  /// the Welch-Satterthwaite effective degrees of freedom (GUM G.4.1): fills u and dof.
  void combine(const double* dy, double& u, int& dof) const {
    double u2 = 0.0, denom = 0.0;
    bool any = false;
    for (std::size_t b = 0; b < block_begin_.size(); ++b) {
      double ub2 = 0.0;
      for (std::size_t i = block_begin_[b]; i < block_end_[b]; ++i)
        for (std::size_t j = block_begin_[b]; j < block_end_[b]; ++j)
          ub2 += dy[i] * constants_.covariance(static_cast<Eigen::Index>(i), static_cast<Eigen::Index>(j)) * dy[j];
      u2 += ub2;
      if (constants_.block_dof[b] > 0) {
        denom += ub2 * ub2 / constants_.block_dof[b];
        any = true;
      }
    }
    u2 = std::max(u2, 0.0);
    u = std::sqrt(u2);
    dof = welch_satterthwaite(u2, denom, any);
  }

 private:
  enum class constant_kind { none, norrish, pitzer, molar_mass };
  struct derivative {
    constant_kind kind = constant_kind::none;
    models::norrish_constant norrish = models::norrish_constant::k;
    models::pitzer_constant pitzer = models::pitzer_constant::beta0;
    std::string label;  ///< "solute.constant" of a constant without a closed form
  };
  constant_set constants_;
  const models::model_descriptor* model_;
  linear_path path_;
  std::vector<derivative> kind_;
  std::vector<std::size_t> block_begin_, block_end_;
  std::unique_ptr<data::pitzer_parameter_set> own_rows_;
  const data::pitzer_parameter_set* rows_ = nullptr;
  bool has_electrolytes_ = false;
  std::vector<models::norrish::term> non_electrolytes_;
};

/// A linear propagation's value, standard uncertainty, degrees of freedom and validity.
struct linear_outcome {
  double value = std::numeric_limits<double>::quiet_NaN();
  double standard_uncertainty = std::numeric_limits<double>::quiet_NaN();
  int degrees_of_freedom = 0;
  validity check;
};

/// models::water_activity(s, T, m) (policy 'extrapolate'), the same steps on `ln_aw`, an
/// evaluator already prepared for the species of `s`.
inline checked_value water_activity_on(models::ln_water_activity_evaluator& ln_aw, const solution& s,
                                       double temperature) {
  const double lnaw = ln_aw(s.water_mass(), temperature);
  return apply_policy_within(std::exp(lnaw), ln_aw.check(s.water_mass(), temperature),
                             range_policy::extrapolate, "water_activity", "water activity", 0.0, 1.0,
                             true, models::physical_bounds_note);
}

/// models::osmotic_coefficient(s, T, m) (policy 'extrapolate'), the same steps on `ln_aw`.
inline checked_value osmotic_coefficient_on(models::ln_water_activity_evaluator& ln_aw, const solution& s,
                                            double temperature) {
  const double mp = models::ideal::particle_molality(s, s.water_mass());
  const double lnaw = ln_aw(s.water_mass(), temperature);
  const double phi = mp > 0.0 ? -lnaw / (constants::molar_mass_water * mp) : 1.0;
  validity v = ln_aw.check(s.water_mass(), temperature);
  const double aw = std::exp(lnaw);
  if (!(aw > 0.0 && aw <= 1.0) || !std::isfinite(phi))
    v = outside_physical_bounds("osmotic_coefficient", "water activity", aw, 0.0, 1.0,
                                std::string("the osmotic coefficient would be ") + validity::fmt(phi) +
                                    "; " + models::physical_bounds_note);
  return apply_policy(phi, v, range_policy::extrapolate);
}

/// The one implementation of the linear propagation, on prepared objects: `plan` for the
/// species list, `ln_aw` an evaluator of model `m` prepared for `s` (reading its amounts),
/// and `state_at(T)` the ice-curve state of `s` at T (ice fraction and unfrozen water only).
/// The scalar propagate_linear gives it objects prepared for one solution; a batch thread
/// gives it its own, reused row after row, so a row equals the scalar result bit for bit.
/// Writes the sensitivities dy/dp into `dy` (plan.size() values; zeros where the state has
/// none). Allocates nothing for the models with closed forms inside their validated range.
///
/// On the ice line F(T, p) = ln a_w(W, p) - ln a_w,ice(T) = 0 the implicit function theorem
/// gives dT_f/dp = (d ln a_w/dp) / (dH_fus(T)/(R T^2) - d ln a_w/dT); below the freezing
/// point dW_u/dp = -(d ln a_w/dp) / (d ln a_w/dW) (file comment).
///
/// With `salts_crystallise` (as predict()) a state where a salt crystallises has no closed
/// form here: `salt_first()` (the ice_curve::salt_first of `s`) names a salt that forms
/// before ice, and a water activity above a salt's solubility is tested on `ln_aw`; both
/// throw invalid_input pointing to Monte Carlo, which evaluates predict() per draw.
template <class StateAt, class SaltFirst>
linear_outcome propagate_linear_prepared(const linear_plan& plan, predicted_quantity q, const solution& s,
                                         double temperature, const models::model_choice& m,
                                         double bound_water_kg, models::ln_water_activity_evaluator& ln_aw,
                                         StateAt&& state_at, SaltFirst&& salt_first, bool salts_crystallise,
                                         double* dy) {
  linear_outcome out;
  const std::size_t n = plan.size();
  for (std::size_t k = 0; k < n; ++k) dy[k] = 0.0;
  if (salts_crystallise && s.has_electrolytes()) {
    // A salt crystallises: the plain value (predict()) with u = 0 when no constant is
    // uncertain, else no closed form.
    if (q == predicted_quantity::freezing_point) {
      salt_first_solid first = salt_first();
      if (first.phase != nullptr) {
        if (n > 0)
          throw invalid_input(std::string("linear propagation: ") + first.phase->name +
                              " crystallises before ice (the freezing point is that salt's "
                              "crystallisation temperature), where the closed-form sensitivities "
                              "do not hold; use the Monte Carlo propagation");
        const auto v = apply_policy(first.temperature, first.check, range_policy::extrapolate);
        out.value = v.value;
        out.check = v.check;
        if (std::isfinite(out.value)) plan.combine(dy, out.standard_uncertainty, out.degrees_of_freedom);
        return out;
      }
    } else if (q == predicted_quantity::water_activity) {
      salt_equilibrium_state st;
      const auto v = water_activity_at_equilibrium(ln_aw, s, temperature, range_policy::extrapolate, &st);
      if (st.supersaturated) {
        if (n > 0)
          throw invalid_input(std::string("linear propagation: the solution is supersaturated in ") +
                              (st.phase != nullptr ? st.phase->name : std::string("a salt")) +
                              " at T = " + std::to_string(temperature) +
                              " K and the salt crystallises, where the closed-form sensitivities "
                              "do not hold; use the Monte Carlo propagation");
        out.value = v.value;
        out.check = v.check;
        if (std::isfinite(out.value)) plan.combine(dy, out.standard_uncertainty, out.degrees_of_freedom);
        return out;
      }
    }
  }
  switch (q) {
    case predicted_quantity::freezing_point: {
      const auto r = freezing_point(s, m, bound_water_kg, ln_aw);
      out.check = r.check;
      if (!r.success()) break;
      out.value = r.temperature;
      if (!std::isfinite(out.value) || n == 0) break;
      const double T = out.value;
      const double W = s.water_mass() - bound_water_kg;
      const double ice_slope = water::enthalpy_of_fusion(T) / (constants::gas_constant * T * T);
      const double denom = ice_slope - plan.temperature_slope(s, W, T);
      plan.ln_aw_gradient(s, W, T, dy);
      for (std::size_t k = 0; k < n; ++k) dy[k] /= denom;
      break;
    }
    case predicted_quantity::water_activity: {
      const auto r = water_activity_on(ln_aw, s, temperature);
      out.check = r.check;
      out.value = r.value;
      if (!std::isfinite(out.value) || n == 0) break;
      plan.ln_aw_gradient(s, s.water_mass(), temperature, dy);
      for (std::size_t k = 0; k < n; ++k) dy[k] *= out.value;
      break;
    }
    case predicted_quantity::osmotic_coefficient: {
      const auto r = osmotic_coefficient_on(ln_aw, s, temperature);
      out.check = r.check;
      out.value = r.value;
      const double mp = models::ideal::particle_molality(s, s.water_mass());
      if (!std::isfinite(out.value) || n == 0 || !(mp > 0.0)) break;
      plan.ln_aw_gradient(s, s.water_mass(), temperature, dy);
      const double scale = -1.0 / (constants::molar_mass_water * mp);
      for (std::size_t k = 0; k < n; ++k) dy[k] *= scale;
      // phi = -ln a_w / (M_w m_p): a molar mass also moves the particle molality m_p,
      // dm_p/dM_j = -nu_j m_j / M_j, so dphi/dM_j gains -phi (dm_p/dM_j) / m_p.
      for (std::size_t k = 0; k < n; ++k) {
        const auto& uc = plan.constants().constants[k];
        if (uc.name != "molar_mass") continue;
        const auto& rj = s.species()[uc.species];
        const double dmp = -rj.particles * (s.moles()[uc.species] / s.water_mass()) / rj.molar_mass;
        dy[k] -= out.value * dmp / mp;
      }
      break;
    }
    case predicted_quantity::ice_fraction:
    case predicted_quantity::unfrozen_water: {
      const auto st = state_at(temperature);
      out.check = st.check;
      if (!st.success()) break;
      out.value = q == predicted_quantity::ice_fraction ? st.ice_fraction() : st.unfrozen_water;
      if (!(st.ice > 0.0) || n == 0) break;  // not frozen: no ice to vary
      for (double x : st.precipitated)
        if (x > 0.0)
          throw invalid_input("linear propagation: a salt has crystallised at T = " +
                              std::to_string(temperature) +
                              " K, where the closed-form sensitivities do not hold; use the "
                              "Monte Carlo propagation");
      if (!(st.unfrozen_water > 0.0)) break;  // pure water: all ice, nothing to vary
      plan.ln_aw_gradient(s, st.unfrozen_water, temperature, dy);
      bool any = false;
      for (std::size_t k = 0; k < n; ++k) any = any || dy[k] != 0.0;
      if (!any) break;  // no solute whose constants enter
      const double slope = plan.water_slope(s, st.unfrozen_water, temperature, ln_aw);
      if (!(slope > 0.0))
        throw convergence_error("linear propagation: no slope d ln a_w / d W at the unfrozen state");
      // dW_u/dp = -g / slope; d(ice fraction)/dp = -dW_u/dp / W_total
      for (std::size_t k = 0; k < n; ++k) {
        const double dW = -dy[k] / slope;
        dy[k] = q == predicted_quantity::ice_fraction ? -dW / st.total_water : dW;
      }
      break;
    }
  }
  if (!std::isfinite(out.value)) return out;
  plan.combine(dy, out.standard_uncertainty, out.degrees_of_freedom);
  return out;
}

}  // namespace detail

/// Value, standard uncertainty and sensitivities of quantity `q` of `s` at `temperature`
/// (K; unused for the freezing point) under model `m`, by linear propagation
/// (detail::propagate_linear_prepared on objects prepared for `s` alone).
inline prediction_uncertainty propagate_linear(predicted_quantity q, const solution& s,
                                               double temperature, const models::model_choice& m = "auto",
                                               double bound_water_kg = 0.0, bool salts_crystallise = true) {
  if (q != predicted_quantity::freezing_point)
    models::check_temperature_argument(to_string(q), temperature);
  detail::check_bound_water(to_string(q), s, bound_water_kg);
  const detail::linear_plan plan(s, m);
  prediction_uncertainty out;
  out.not_stated = plan.constants().not_stated;
  for (std::size_t k = 0; k < plan.size(); ++k) out.constants.push_back(plan.constants().label(k, s));
  models::ln_water_activity_evaluator ln_aw(m, s);
  std::optional<ice_curve> curve;
  const auto state_at = [&](double T) {
    curve.emplace(s, m, bound_water_kg);
    return curve->at(T);
  };
  const auto salt_first = [&]() {
    curve.emplace(s, m, bound_water_kg);
    return curve->salt_first();
  };
  out.sensitivities = Eigen::VectorXd::Zero(static_cast<Eigen::Index>(plan.size()));
  const auto r = detail::propagate_linear_prepared(plan, q, s, temperature, m, bound_water_kg, ln_aw,
                                                   state_at, salt_first, salts_crystallise,
                                                   out.sensitivities.data());
  out.check = r.check;
  out.result.value = r.value;
  out.result.standard_uncertainty = r.standard_uncertainty;
  out.result.degrees_of_freedom = r.degrees_of_freedom;
  return out;
}

/// Monte Carlo propagation with `draws` samples from a generator seeded with `seed`
/// (std::mt19937_64; the same seed gives the same result on every platform's standard
/// library that implements it, normal draws aside).
inline fit::monte_carlo_result propagate_monte_carlo(predicted_quantity q, const solution& s,
                                                     double temperature, const models::model_choice& m,
                                                     double bound_water_kg, int draws,
                                                     std::uint64_t seed, bool salts_crystallise = true) {
  if (q != predicted_quantity::freezing_point)
    models::check_temperature_argument(to_string(q), temperature);
  detail::check_bound_water(to_string(q), s, bound_water_kg);
  const constant_set c = uncertain_constants(s);
  std::mt19937_64 engine(seed);
  return fit::monte_carlo(c.values, c.covariance, draws, engine, [&](const Eigen::VectorXd& p) {
    try {
      return predict(q, with_constants(s, c, p), temperature, m, bound_water_kg, salts_crystallise);
    } catch (const invalid_input&) {  // a draw outside a constant's domain (molar mass <= 0)
      return std::numeric_limits<double>::quiet_NaN();
    } catch (const convergence_error&) {  // no ice-curve state for this draw: left out, counted
      return std::numeric_limits<double>::quiet_NaN();
    }
  });
}

}  // namespace colligate::equilibria
