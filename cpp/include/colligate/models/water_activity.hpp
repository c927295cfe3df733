#pragma once
/// \file water_activity.hpp
/// One entry point for every activity model: ln a_w of a solution at temperature T,
/// chosen by model_id, with its validity. `auto` chooses the most complete model for
/// the solutes present and says so in describe_model(): Norrish when there are only
/// non-electrolytes, Pitzer when there are only electrolytes, and the Ross (1975)
/// product rule (model 'ross': Pitzer for the ions times Norrish for the
/// non-electrolytes, each in the same water) when there are both.

#include <cmath>
#include <cstdio>
#include <optional>
#include <string>

#include "colligate/core/errors.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/models/ideal.hpp"
#include "colligate/models/mixing.hpp"
#include "colligate/models/model_id.hpp"
#include "colligate/models/norrish.hpp"
#include "colligate/models/pitzer.hpp"
#include "colligate/models/raoult.hpp"

namespace colligate::models {

/// The concrete model `auto` resolves to for this solution.
inline model_id resolve(model_id m, const solution& s) {
  if (m != model_id::automatic) return m;
  if (!s.has_electrolytes()) return model_id::norrish;
  return s.has_non_electrolytes() ? model_id::ross : model_id::pitzer;
}

/// ln a_w with `water_kg` of water in place of the solution's own (for the ice curve).
inline double ln_water_activity(model_id m, const solution& s, double water_kg,
                                double temperature) {
  switch (resolve(m, s)) {
    case model_id::ideal: return ideal::ln_water_activity(s, water_kg, temperature);
    case model_id::raoult: return raoult::ln_water_activity(s, water_kg, temperature);
    case model_id::norrish: return norrish::ln_water_activity(s, water_kg, temperature);
    case model_id::pitzer: return pitzer::ln_water_activity(s, water_kg, temperature);
    case model_id::ross: return ross::ln_water_activity(s, water_kg, temperature);
    case model_id::automatic: break;
  }
  throw invalid_input("ln_water_activity: unresolved model");
}

inline validity check(model_id m, const solution& s, double water_kg, double temperature);

/// ln a_w of one solution at many (water mass, temperature) pairs, equal bit for bit to
/// ln_water_activity(m, s, water_kg, T), with the work that depends only on the species
/// done once: for Pitzer, the ions and parameter rows (detail::pitzer_system), whose
/// coefficients are also kept for the last temperature; for Ross (salt + sugar), the
/// indices of each class, the Norrish constants and the Pitzer system of the electrolytes
/// (detail::ross_system), so an evaluation copies nothing and allocates nothing. Reads the
/// amounts of `s` at each call, so it follows a solution whose amounts are overwritten in
/// place (batch rows). Holds a pointer to `s` and a cache: one evaluator per solve or per
/// thread.
class ln_water_activity_evaluator {
 public:
  ln_water_activity_evaluator(model_id m, const solution& s) : model_(resolve(m, s)), s_(&s) {
    if (model_ == model_id::pitzer) pitzer_.emplace(s, pitzer::default_parameters());
    if (model_ == model_id::ross) ross_.emplace(s, pitzer::default_parameters());
  }
  /// The concrete model (after resolving 'auto').
  model_id model() const noexcept { return model_; }
  double operator()(double water_kg, double temperature) {
    if (pitzer_) return pitzer_->ln_water_activity(s_->moles().data(), water_kg, temperature);
    if (ross_) return ross_->ln_water_activity(s_->moles().data(), water_kg, temperature);
    return ln_water_activity(model_, *s_, water_kg, temperature);
  }
  /// check(model, s, water_kg, T) for the solution and model this evaluator was prepared
  /// for, same result; for Ross its rule comparison reuses the prepared system.
  validity check(double water_kg, double temperature) {
    if (ross_) return ross::check(*s_, water_kg, temperature, *ross_);
    return models::check(model_, *s_, water_kg, temperature);
  }

 private:
  model_id model_;
  const solution* s_;
  std::optional<detail::pitzer_system> pitzer_;
  std::optional<detail::ross_system> ross_;
};

inline validity check(model_id m, const solution& s, double water_kg, double temperature) {
  switch (resolve(m, s)) {
    case model_id::ideal: return ideal::check(s, water_kg, temperature);
    case model_id::raoult: return raoult::check(s, water_kg, temperature);
    case model_id::norrish: return norrish::check(s, water_kg, temperature);
    case model_id::pitzer: return pitzer::check(s, water_kg, temperature);
    case model_id::ross: return ross::check(s, water_kg, temperature);
    case model_id::automatic: break;
  }
  throw invalid_input("check: unresolved model");
}

inline void check_temperature_argument(const char* where, double temperature) {
  if (!std::isfinite(temperature) || !(temperature > 0.0))
    throw invalid_input(colligate::detail::describe(where, "temperature", temperature,
                                                    "must be finite and > 0 K"));
}

/// Water activity at temperature T with the caller's range policy.
inline checked_value water_activity(const solution& s, double temperature,
                                    model_id m = model_id::automatic,
                                    range_policy policy = range_policy::extrapolate) {
  check_temperature_argument("water_activity", temperature);
  const double lnaw = ln_water_activity(m, s, s.water_mass(), temperature);
  return apply_policy(std::exp(lnaw), check(m, s, s.water_mass(), temperature), policy);
}

/// Osmotic coefficient phi = -ln a_w / (M_w sum nu_i m_i). For a solution without solutes, 1.
inline checked_value osmotic_coefficient(const solution& s, double temperature,
                                         model_id m = model_id::automatic,
                                         range_policy policy = range_policy::extrapolate) {
  check_temperature_argument("osmotic_coefficient", temperature);
  const double mp = ideal::particle_molality(s, s.water_mass());
  const double lnaw = ln_water_activity(m, s, s.water_mass(), temperature);
  const double phi = mp > 0.0 ? -lnaw / (constants::molar_mass_water * mp) : 1.0;
  return apply_policy(phi, check(m, s, s.water_mass(), temperature), policy);
}

/// Readable description of which model and constants a calculation uses.
inline std::string describe_model(const solution& s, model_id m = model_id::automatic) {
  const model_id r = resolve(m, s);
  std::string out = std::string("model '") + to_string(r) + "'";
  if (m == model_id::automatic) out += " (chosen by 'auto')";
  switch (r) {
    case model_id::ideal:
      out += ": ideal dilute solution, ln a_w = -M_w sum nu_i m_i";
      break;
    case model_id::raoult:
      out += ": Raoult's law with dissociated particles counted, a_w = x_w";
      break;
    case model_id::norrish:
      out += ": Norrish (1966) with the multi-solute extension of Chirife et al. (1980)";
      break;
    case model_id::pitzer:
      out += std::string(": Pitzer ion interaction (Debye-Hueckel A_phi of ") +
             (pitzer::default_parameters().aphi == data::aphi_correlation::spencer_1990
                  ? "Spencer, Moller & Weare 1990"
                  : "Clegg, Rard & Pitzer 1994") +
             ", unsymmetrical E-theta of Pitzer 1975), parameter set '" +
             pitzer::default_parameters().id + "' [" + pitzer::default_parameters().description +
             "]; non-electrolytes counted as ideal particles";
      break;
    case model_id::ross:
      out += ": Ross (1975) product rule, a_w = a_w(ions, Pitzer, parameter set '" +
             pitzer::default_parameters().id +
             "') * a_w(non-electrolytes, Norrish 1966 / Chirife et al. 1980), each evaluated "
             "in the same water";
      break;
    case model_id::automatic: break;
  }
  for (std::size_t i = 0; i < s.size(); ++i) {
    const auto& rec = s.species()[i];
    out += "; " + rec.id + ": ";
    const bool pitzer_ions = (r == model_id::pitzer || r == model_id::ross) &&
                             rec.kind == data::solute_class::electrolyte && !rec.ions.empty();
    const bool norrish_k = (r == model_id::norrish ||
                            (r == model_id::ross && rec.kind == data::solute_class::non_electrolyte)) &&
                           rec.norrish.available;
    if (pitzer_ions) {
      std::string cation, anion;
      for (const auto& ion : rec.ions) (ion.charge > 0 ? cation : anion) = ion.ion;
      const auto* row = detail::binary_for(rec, pitzer::default_parameters(), cation, anion);
      out += cation + " + " + anion + (row ? " [" + row->source + "]" : " (no Pitzer parameters)");
    } else if (norrish_k) {
      char buf[160];
      std::snprintf(buf, sizeof buf, "K = %.4g [%s]", rec.norrish.k, rec.norrish.k_source.c_str());
      out += buf;
      if (rec.norrish.k3 != 0.0) {
        std::snprintf(buf, sizeof buf, ", K3 = %.4g [%s]", rec.norrish.k3,
                      rec.norrish.k3_source.c_str());
        out += buf;
      }
    } else {
      out += std::to_string(rec.particles) + " ideal particle(s) per formula unit";
    }
  }
  return out;
}

}  // namespace colligate::models
