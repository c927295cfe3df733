#pragma once
/// \file pitzer_ion_activities.hpp
/// Ion activities of the Pitzer model for the electrolytes of one species list, on ion
/// amounts that may differ from the species' own (a salt phase that crystallises removes
/// ions, not formula units of the dissolved salts). Used by the 'pitzer' and 'ross'
/// evaluators to serve models::ion_activity_model.
///
/// Same equations and parameters as models/pitzer.hpp (the set with the records' own
/// rows, detail::with_record_binaries); the coefficients of the last temperature are kept.

#include <array>
#include <cmath>
#include <cstddef>
#include <limits>
#include <vector>

#include "colligate/core/constants.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/data/pitzer_parameters.hpp"
#include "colligate/models/detail/pitzer_kernel.hpp"
#include "colligate/models/detail/pitzer_record_parameters.hpp"

namespace colligate::models::detail {

class pitzer_ion_activities {
 public:
  /// Prepares the electrolytes of `s`; species that are not electrolytes are ignored here
  /// (the caller adds their contribution to ln a_w).
  pitzer_ion_activities(const solution& s, const data::pitzer_parameter_set& set)
      : s_(&s), set_(with_record_binaries(s, set)) {
    std::array<bool, n_ions> present{};
    for (std::size_t i = 0; i < s.size(); ++i) {
      const auto& rec = s.species()[i];
      if (rec.kind != data::solute_class::electrolyte || rec.ions.empty()) continue;
      for (const auto& ion : rec.ions) {
        const auto g = data::pitzer_ion_index(ion.ion);
        if (g < n_ions) {
          present[g] = true;
          terms_.push_back({i, g, static_cast<double>(ion.count)});
        } else {
          unknown_.push_back({i, n_ions, static_cast<double>(ion.count)});
        }
      }
    }
    for (std::size_t g = 0; g < n_ions; ++g) {
      slot_of_[g] = n_ions;
      if (!present[g]) continue;
      slot_of_[g] = n_slots_;
      global_[n_slots_++] = g;
    }
  }

  std::size_t ion_slots() const noexcept { return n_slots_; }
  std::size_t global_ion(std::size_t slot) const { return global_.at(slot); }
  std::size_t slot_of(std::size_t g) const noexcept {
    return g < n_ions && slot_of_[g] < n_slots_ ? slot_of_[g] : n_slots_;
  }

  /// Amounts of each ion in the prepared solution, mol.
  void ion_moles(double* n) const {
    for (std::size_t k = 0; k < n_slots_; ++k) n[k] = 0.0;
    for (const auto& t : terms_) n[slot_of_[t.ion]] += t.count * s_->moles()[t.species];
  }

  /// Ions of the prepared electrolytes that have no Pitzer parameters, mol (counted as
  /// ideal particles, as in pitzer::ion_molalities).
  double unknown_ion_moles() const {
    double n = 0.0;
    for (const auto& t : unknown_) n += t.count * s_->moles()[t.species];
    return n;
  }

  /// sum_i m_i phi of the ions (mol/kg) for `n` mol per slot in `water_kg`, and, if
  /// `ln_activity` is not null, ln(m_i gamma_i) per slot.
  double osmotic_sum(const double* n, double water_kg, double T, double* ln_activity) {
    ion_array m{};
    for (std::size_t k = 0; k < n_slots_; ++k) m[global_[k]] = n[k] / water_kg;
    if (coef_temperature_ != T) {
      coef_ = evaluate_coefficients(set_, T);
      coef_temperature_ = T;
    }
    const auto r = evaluate(m, coef_);
    if (ln_activity)
      for (std::size_t k = 0; k < n_slots_; ++k) {
        const double mk = m[global_[k]];
        ln_activity[k] = mk > 0.0 ? std::log(mk) + r.ln_gamma[global_[k]]
                                  : -std::numeric_limits<double>::infinity();
      }
    return r.total_molality + r.osmotic_excess;
  }

 private:
  struct term {
    std::size_t species;
    std::size_t ion;  ///< index into data::pitzer_ions
    double count;
  };
  const solution* s_;
  data::pitzer_parameter_set set_;
  std::vector<term> terms_, unknown_;
  std::array<std::size_t, n_ions> slot_of_{};
  std::array<std::size_t, n_ions> global_{};
  std::size_t n_slots_ = 0;
  double coef_temperature_ = std::numeric_limits<double>::quiet_NaN();
  pitzer_coefficients coef_;
};

}  // namespace colligate::models::detail
