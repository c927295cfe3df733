#pragma once
/// \file pitzer.hpp
/// Pitzer ion-interaction model for electrolytes (salts, brines, seawater).
///
/// Each electrolyte of the solution is split into its ions (solute_record::ions); the
/// model works on ion molalities, so salts given as neutral formula units are
/// electroneutral by construction. Osmotic coefficient, water activity and ion activity
/// coefficients follow Pitzer (1973, 1991) with the mixing terms theta and psi and the
/// unsymmetrical E-theta of Pitzer (1975), in the notation of Harvie, Moller & Weare
/// (1984); equations in models/detail/pitzer_kernel.hpp, evaluated by
/// detail::pitzer_system (models/detail/pitzer_system.hpp).
///
///     ln a_w = -M_w sum_i m_i phi
///
/// Parameters come from a named set in data/pitzer_parameters.hpp (default
/// "harvie_spencer_icefit", valid 219.15-298.15 K; "spencer_1990_icefit" the default before;
/// "spencer_1990" as published;
/// "harvie_1984" at 25 C). The Debye-Hueckel slope A_phi(T) is the one each set was
/// fitted with (pitzer_parameter_set::aphi): the Spencer, Moller & Weare (1990)
/// polynomial for the two spencer sets, the Clegg, Rard & Pitzer
/// (1994) series (validated 234.15-373.15 K) for "harvie_1984".
///
/// Non-electrolytes in the solution are counted as ideal particles (ln a_w gains
/// -M_w m); the check flags them above 0.1 mol/kg. Use 'auto' (Pitzer for the ions,
/// Norrish for the non-electrolytes) for mixtures.
///
/// Validity (check): temperature inside the set's range and A_phi's; every electrolyte
/// has ions the set knows and a cation-anion row; each salt's molality at most the row's
/// max_molality.

#include <cmath>
#include <cstdio>
#include <array>
#include <limits>
#include <memory>
#include <optional>
#include <string>
#include <vector>

#include "colligate/core/constants.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/data/pitzer_parameters.hpp"
#include "colligate/models/detail/pitzer_kernel.hpp"
#include "colligate/models/detail/pitzer_record_parameters.hpp"
#include "colligate/models/detail/pitzer_system.hpp"
#include "colligate/models/detail/describe_constants.hpp"
#include "colligate/models/evaluator.hpp"
#include "colligate/models/registry.hpp"

namespace colligate::models {

struct pitzer {
  static constexpr const char* id = "pitzer";
  /// The registry entry (defined below).
  static model_descriptor descriptor();
  /// Largest total molality of non-electrolytes counted as ideal particles, mol/kg.
  static constexpr double max_non_electrolyte_molality = 0.1;

  /// The validated range with a parameter set (the descriptor lists it for the default set;
  /// check() applies it for the set in use).
  static range_limit temperature_limit(const data::pitzer_parameter_set& set) {
    return {"temperature", "K", set.min_temperature, set.max_temperature,
            "where its parameters are valid", set.range_source, ""};
  }
  static range_limit aphi_temperature_limit(const data::pitzer_parameter_set& set) {
    const auto aphi = detail::aphi_validity(set.aphi);
    return {"temperature", "K", aphi.min_temperature, aphi.max_temperature,
            "the range of the Debye-Hueckel slope A_phi, which is extrapolated", aphi.source, ""};
  }
  static const range_limit& salt_molality_limit() {  // built once, immutable
    static const range_limit limit{"molality of each salt", "mol/kg",
                                   0.0, std::numeric_limits<double>::quiet_NaN(),
                                   "the highest molality its parameters are valid for",
                                   "",
                                   "each salt's binary row of the parameter set (max molality, "
                                   "source key)"};
    return limit;
  }
  static const range_limit& non_electrolyte_limit() {  // built once, immutable
    static const range_limit limit{"non-electrolyte molality", "mol/kg",
                                   0.0, max_non_electrolyte_molality,
                                   "the Pitzer model counts non-electrolytes as ideal particles "
                                   "(use model 'auto' for mixtures)",
                                   "", ""};
    return limit;
  }
  static std::vector<range_limit> validated_range(const data::pitzer_parameter_set& set) {
    return {temperature_limit(set), aphi_temperature_limit(set), salt_molality_limit(),
            non_electrolyte_limit()};
  }

  static const data::pitzer_parameter_set& default_parameters() {
    return data::harvie_spencer_icefit_parameters();
  }

  /// The parameter set a caller's options name (model_options::parameter_set), or the
  /// default set when they name none.
  static const data::pitzer_parameter_set& parameters_for(const model_options& options) {
    return options.parameter_set.empty() ? default_parameters()
                                         : data::find_pitzer_parameter_set(options.parameter_set);
  }

  /// Throws invalid_input when an electrolyte of `s` (one cation, one anion, both known to
  /// the parameter tables, no parameters of its own) has no binary row in `set`: the
  /// message names the salt, the set and the sets that do have it. A missing binary row
  /// is never treated as zero.
  static void require_binaries(const solution& s, const data::pitzer_parameter_set& set) {
    for (const auto& rec : s.species()) {
      if (rec.kind != data::solute_class::electrolyte || rec.ions.size() != 2) continue;
      std::string cation, anion;
      for (const auto& ion : rec.ions) (ion.charge > 0 ? cation : anion) = ion.ion;
      if (cation.empty() || anion.empty() || data::pitzer_ion_index(cation) >= data::pitzer_ion_count ||
          data::pitzer_ion_index(anion) >= data::pitzer_ion_count)
        continue;
      if (detail::binary_for(rec, set, cation, anion) != nullptr) continue;
      std::string others;
      for (const auto& id : data::pitzer_parameter_sets_with_binary(cation, anion))
        others += (others.empty() ? "'" : ", '") + id + "'";
      throw invalid_input("parameter_set = '" + set.id + "': salt '" + rec.id + "' (" + cation +
                          " " + anion + ") has no binary Pitzer parameters in this set; " +
                          (others.empty() ? std::string("no built-in set has them")
                                          : "the sets that have them: " + others));
    }
  }

  /// Ion molalities (mol/kg) of the electrolytes with `water_kg` of water. Ions the
  /// parameter tables do not know are added to `other_particles` (mol/kg), as are
  /// non-electrolytes.
  static detail::ion_array ion_molalities(const solution& s, double water_kg,
                                          double& other_particles) {
    detail::ion_array m{};
    other_particles = 0.0;
    for (std::size_t i = 0; i < s.size(); ++i) {
      const auto& rec = s.species()[i];
      const double mi = s.moles()[i] / water_kg;
      if (rec.kind != data::solute_class::electrolyte || rec.ions.empty()) {
        other_particles += rec.particles * mi;
        continue;
      }
      for (const auto& ion : rec.ions) {
        const auto k = data::pitzer_ion_index(ion.ion);
        if (k < detail::n_ions)
          m[k] += ion.count * mi;
        else
          other_particles += ion.count * mi;
      }
    }
    return m;
  }

  /// The full evaluation: ion sums, ln gamma of each ion of data::pitzer_ions (NaN for an
  /// ion that no electrolyte of `s` holds) and the ideal particles `other_particles`
  /// (mol/kg). Prepares a detail::pitzer_system, the one implementation of the sums; a
  /// caller evaluating one species list many times can hold that system itself.
  static detail::pitzer_sums evaluate(const solution& s, double water_kg, double temperature,
                                      const data::pitzer_parameter_set& set,
                                      double& other_particles) {
    detail::pitzer_system system(s, set);
    detail::ion_array m{}, ln_gamma{};
    system.molalities(s.moles().data(), water_kg, m.data(), other_particles);
    detail::pitzer_osmotic_sums osm;
    system.ln_gamma_on_molalities(m.data(), temperature, ln_gamma.data(), &osm);
    detail::pitzer_sums r;
    r.ionic_strength = osm.ionic_strength;
    r.total_molality = osm.total_molality;
    r.osmotic_excess = osm.osmotic_excess;
    for (std::size_t g = 0; g < detail::n_ions; ++g) {
      const auto k = system.slot_of(g);
      r.ln_gamma[g] = k < system.ion_slots() ? ln_gamma[k] : std::numeric_limits<double>::quiet_NaN();
    }
    return r;
  }

  /// ln a_w. Prepares the species once (detail::pitzer_system); a solver calling this
  /// many times on one solution can hold a pitzer_system itself (same arithmetic).
  static double ln_water_activity(const solution& s, double water_kg, double temperature,
                                  const data::pitzer_parameter_set& set) {
    detail::pitzer_system system(s, set);
    return system.ln_water_activity(s.moles().data(), water_kg, temperature);
  }

  static double ln_water_activity(const solution& s, double water_kg, double temperature) {
    return ln_water_activity(s, water_kg, temperature, default_parameters());
  }

  /// ln of the mean molal activity coefficient of electrolyte `index` of the solution.
  static double ln_mean_activity_coefficient(const solution& s, std::size_t index,
                                             double water_kg, double temperature,
                                             const data::pitzer_parameter_set& set) {
    const auto& rec = s.species().at(index);
    if (rec.kind != data::solute_class::electrolyte || rec.ions.empty())
      throw invalid_input("mean_activity_coefficient: solute '" + rec.id +
                          "' is not an electrolyte with known ions");
    detail::pitzer_system system(s, set);
    detail::ion_array m{}, ln_gamma{};
    double other = 0.0;
    system.molalities(s.moles().data(), water_kg, m.data(), other);
    system.ln_gamma_on_molalities(m.data(), temperature, ln_gamma.data());
    double sum = 0.0;
    int nu = 0;
    for (const auto& ion : rec.ions) {
      const auto k = system.slot_of(data::pitzer_ion_index(ion.ion));
      if (k >= system.ion_slots())
        throw invalid_input("mean_activity_coefficient: ion '" + ion.ion + "' of '" + rec.id +
                            "' has no Pitzer parameters");
      sum += ion.count * ln_gamma[k];
      nu += ion.count;
    }
    return sum / nu;
  }

  /// Which species check() reads: all of them, or the electrolytes alone (the check of a
  /// solution holding only the electrolytes of `s`, as the Ross rule needs, without a copy).
  enum class species_checked { all, electrolytes_only };

  /// What check() finds by name for one species list and parameter set, kept by a caller
  /// that checks many rows of that list (an evaluator, a batch thread), so a row is
  /// checked without string lookups: the binary row of each species, the data::pitzer_ions
  /// indices of each species' ions as bits, the temperatures inside every record's window,
  /// and the answer of missing_mixing_parameters() for the last set of ions present. Filled
  /// on first use; not shared between threads.
  struct check_memo {
    bool prepared = false;
    std::vector<const data::pitzer_binary*> rows;  ///< per species (nullptr: none)
    std::vector<int> ion_bits;  ///< per species, bit g for each of its ions g of data::pitzer_ions
    int present = -1;  ///< bit g: ion g of data::pitzer_ions present; -1: nothing kept
    std::string missing;
    /// The temperatures (K) inside every electrolyte record's own parameter window as
    /// detail::record_temperature_validity tests it (its 1e-9 K margins included): a row
    /// at such a temperature skips those tests, which cannot fail there.
    double records_min_temperature = -std::numeric_limits<double>::infinity();
    double records_max_temperature = std::numeric_limits<double>::infinity();
  };

  static validity check(const solution& s, double water_kg, double temperature,
                        const data::pitzer_parameter_set& set,
                        species_checked which = species_checked::all,
                        check_memo* memo = nullptr) {
    validity v;
    // The message prefix is built only when a reason is reported.
    const auto where = [&set] { return "model 'pitzer' (parameter set '" + set.id + "')"; };
    // The set-dependent limits are built only when a state lies outside them (check() runs
    // once per batch row and must not allocate in range).
    if (temperature < set.min_temperature - 1e-9 || temperature > set.max_temperature + 1e-9) {
      // Name the salts that have no parameters at this temperature (issue 12).
      std::string salts;
      for (const auto& rec : s.species())
        if (rec.kind == data::solute_class::electrolyte)
          salts += (salts.empty() ? "'" : ", '") + rec.id + "'";
      return temperature_limit(set).outside(where(), temperature,
                           "; " + (salts.empty() ? std::string("salts have") : salts + " have") +
                               " no parameters at this temperature in this set (they are "
                               "extrapolated)");
    }
    if (const auto aphi = detail::aphi_validity(set.aphi);
        temperature < aphi.min_temperature - 1e-9 || temperature > aphi.max_temperature + 1e-9)
      return aphi_temperature_limit(set).outside(where(), temperature);
    if (memo != nullptr && !memo->prepared) prepare_memo(s, set, *memo);
    double non_electrolytes = 0.0;
    int present = 0;  // ions of the electrolytes with a positive amount (memo only)
    for (std::size_t i = 0; i < s.size(); ++i) {
      const auto& rec = s.species()[i];
      const double mi = s.moles()[i] / water_kg;
      if (rec.kind != data::solute_class::electrolyte) {
        if (which == species_checked::all) non_electrolytes += mi;
        continue;
      }
      if (memo != nullptr && s.moles()[i] > 0.0)
        present |= memo->ion_bits[i];
      if (mi == 0.0) continue;
      const data::pitzer_binary* row = nullptr;
      if (memo != nullptr) {
        row = memo->rows[i];
      } else {
        std::string cation, anion;
        for (const auto& ion : rec.ions) (ion.charge > 0 ? cation : anion) = ion.ion;
        row = (rec.ions.size() == 2) ? detail::binary_for(rec, set, cation, anion) : nullptr;
      }
      if (row == nullptr) {
        return flagged(validity_code::missing_constants, where(), "electrolyte '" + rec.id + "'",
                       "has no Pitzer parameters in this set; counted with the Debye-Hueckel "
                       "term only");
        return v;
      }
      if (mi > row->max_molality + 1e-12) {
        auto limit = salt_molality_limit();  // per salt: the set's row and its source
        limit.quantity = "molality of '" + rec.id + "'";
        limit.high = row->max_molality;
        limit.source = row->source;
        return limit.above(where(), mi);
      }
      if (memo != nullptr && temperature >= memo->records_min_temperature &&
          temperature <= memo->records_max_temperature)
        continue;
      if (auto why = detail::record_temperature_validity(rec, temperature); !why.in_range())
        return why;
    }
    const std::string* missing = nullptr;
    std::string fresh;
    if (memo != nullptr) {
      if (memo->present != present) {
        memo->missing = missing_mixing_parameters(s, set);
        memo->present = present;
      }
      missing = &memo->missing;
    } else {
      fresh = missing_mixing_parameters(s, set);
      missing = &fresh;
    }
    if (!missing->empty())
      return flagged(validity_code::missing_constants, where(), "mixing parameters",
                     "not in this set, treated as zero: " + *missing);
    if (const auto& limit = non_electrolyte_limit(); non_electrolytes > limit.high)
      v = limit.above(where(), non_electrolytes);
    return v;
  }

  static validity check(const solution& s, double water_kg, double temperature) {
    return check(s, water_kg, temperature, default_parameters());
  }

  /// Fills a check_memo for the species of `s` and `set`.
  static void prepare_memo(const solution& s, const data::pitzer_parameter_set& set,
                           check_memo& memo) {
    memo.rows.assign(s.size(), nullptr);
    memo.ion_bits.assign(s.size(), 0);
    for (std::size_t i = 0; i < s.size(); ++i) {
      const auto& rec = s.species()[i];
      if (rec.kind != data::solute_class::electrolyte) continue;
      std::string cation, anion;
      for (const auto& ion : rec.ions) {
        (ion.charge > 0 ? cation : anion) = ion.ion;
        const auto g = data::pitzer_ion_index(ion.ion);
        if (g < data::pitzer_ion_count) memo.ion_bits[i] |= 1 << g;
      }
      memo.rows[i] = (rec.ions.size() == 2) ? detail::binary_for(rec, set, cation, anion) : nullptr;
      if (rec.pitzer.available) {
        memo.records_min_temperature =
            std::max(memo.records_min_temperature, rec.pitzer.min_temperature - 1e-9);
        memo.records_max_temperature =
            std::min(memo.records_max_temperature, rec.pitzer.max_temperature + 1e-9);
      }
    }
    memo.prepared = true;
  }

  /// The mixing parameters (theta of two like-charged ions, psi of two like-charged ions
  /// and one of the other sign) that the ions present in `s` need and `set` does not list,
  /// as "theta(Na+, K+), psi(Na+, K+, Cl-)"; empty when none is missing. The sums treat a
  /// missing one as zero, so check() reports them (issue 12).
  static std::string missing_mixing_parameters(const solution& s, const data::pitzer_parameter_set& set) {
    std::array<bool, data::pitzer_ion_count> present{};
    for (std::size_t i = 0; i < s.size(); ++i) {
      const auto& rec = s.species()[i];
      if (rec.kind != data::solute_class::electrolyte || !(s.moles()[i] > 0.0)) continue;
      for (const auto& ion : rec.ions) {
        const auto g = data::pitzer_ion_index(ion.ion);
        if (g < data::pitzer_ion_count) present[g] = true;
      }
    }
    auto same = [](const std::string& a, const std::string& b, const char* x, const char* y) {
      return (a == x && b == y) || (a == y && b == x);
    };
    std::string out;
    const auto& ions = data::pitzer_ions;
    for (std::size_t i = 0; i < ions.size(); ++i) {
      for (std::size_t j = i + 1; j < ions.size(); ++j) {
        if (!present[i] || !present[j] || (ions[i].charge > 0) != (ions[j].charge > 0)) continue;
        bool theta = false;
        for (const auto& t : set.thetas) theta = theta || same(t.ion1, t.ion2, ions[i].name, ions[j].name);
        if (!theta)
          out += (out.empty() ? "" : ", ") + std::string("theta(") + ions[i].name + ", " + ions[j].name + ")";
        for (std::size_t k = 0; k < ions.size(); ++k) {
          if (!present[k] || (ions[k].charge > 0) == (ions[i].charge > 0)) continue;
          bool psi = false;
          for (const auto& p : set.psis)
            psi = psi || (same(p.ion1, p.ion2, ions[i].name, ions[j].name) && p.ion3 == ions[k].name);
          if (!psi)
            out += (out.empty() ? "" : ", ") + std::string("psi(") + ions[i].name + ", " +
                   ions[j].name + ", " + ions[k].name + ")";
        }
      }
    }
    return out;
  }

 private:
  static std::string fmt(double x) {
    char buf[32];
    std::snprintf(buf, sizeof buf, "%.6g", x);
    return buf;
  }
};


namespace detail {

/// The ion activities of a prepared pitzer_system (models::ion_activity_model's work):
/// ion amounts per slot of the solution it was prepared for, and ln a_w and ln(m gamma)
/// for other ion amounts in any water. Ideal particles (non-electrolytes in model
/// 'pitzer', ions without parameters) keep the solution's amounts.
class pitzer_system_ions {
 public:
  pitzer_system_ions(pitzer_system& system, const solution& s) : system_(&system), s_(&s) {}
  std::size_t ion_slots() const noexcept { return system_->ion_slots(); }
  std::size_t global_ion(std::size_t slot) const { return system_->global_ion(slot); }
  std::size_t slot_of(std::size_t g) const noexcept { return system_->slot_of(g); }
  void ion_moles(double* n) const {
    double other = 0.0;
    system_->molalities(s_->moles().data(), 1.0, n, other);
  }
  /// sum_i m_i phi of the ions plus the ideal particles, mol/kg, for `n` mol per slot in
  /// `water_kg`; ln(m_i gamma_i) per slot into `ln_activity` if not null.
  double particle_sum(const double* n, double water_kg, double T, double* ln_activity) {
    std::array<double, n_ions> m{}, scratch{};
    double ideal = 0.0;
    system_->molalities(s_->moles().data(), 1.0, scratch.data(), ideal);  // ideal: mol
    const std::size_t k_max = ion_slots();
    for (std::size_t k = 0; k < k_max; ++k) m[k] = n[k] / water_kg;
    pitzer_osmotic_sums osm;
    if (ln_activity) {
      std::array<double, n_ions> ln_gamma{};
      system_->ln_gamma_on_molalities(m.data(), T, ln_gamma.data(), &osm);
      for (std::size_t k = 0; k < k_max; ++k)
        ln_activity[k] = m[k] > 0.0 ? std::log(m[k]) + ln_gamma[k]
                                    : -std::numeric_limits<double>::infinity();
    } else {
      osm = system_->osmotic_on_molalities(m.data(), T);
    }
    return osm.total_molality + osm.osmotic_excess + ideal / water_kg;
  }
  /// Upper bounds of ln(m_i gamma_i) per slot (ion_activity_model::ln_activity_upper_bounds;
  /// pitzer_system::ln_gamma_upper_bounds), on the molalities particle_sum uses.
  bool ln_activity_upper_bounds(const double* n, double water_kg, double T, double* ln_activity_hi) {
    std::array<double, n_ions> m{}, ln_gamma{};
    const std::size_t k_max = ion_slots();
    for (std::size_t k = 0; k < k_max; ++k) m[k] = n[k] / water_kg;
    if (!system_->ln_gamma_upper_bounds(m.data(), T, ln_gamma.data())) return false;
    for (std::size_t k = 0; k < k_max; ++k)
      ln_activity_hi[k] = m[k] > 0.0 ? std::log(m[k]) + ln_gamma[k]
                                     : -std::numeric_limits<double>::infinity();
    return true;
  }

 private:
  pitzer_system* system_;
  const solution* s_;
};

/// What models 'pitzer' and 'ross' share, on a prepared System (pitzer_system, or
/// ross_system holding one for its electrolytes): ln a_w and its temperature slope from the
/// system, and the ion activities of the Pitzer system in `ions_` (set by the derived
/// class; empty when the solution has no ions). The derived class adds its validity check
/// and its ln a_w of ion amounts (models::ion_activity_model).
template <class System>
class pitzer_family_evaluator : public activity_evaluator, public ion_activity_model {
 public:
  double ln_water_activity(double water_kg, double temperature) override {
    return system_.ln_water_activity(s_->moles().data(), water_kg, temperature);
  }
  bool ln_water_activity_with_temperature_slope(double water_kg, double temperature,
                                                double& ln_aw, double& slope) override {
    if (!system_.has_temperature_slope()) return false;
    ln_aw = system_.ln_water_activity_with_temperature_slope(s_->moles().data(), water_kg,
                                                             temperature, slope);
    return true;
  }
  bool ln_water_activity_along_temperature(double water_kg, double temperature, double& ln_aw,
                                           double& slope) override {
    if (!system_.has_temperature_slope()) return false;
    ln_aw = system_.ln_water_activity_along_temperature(s_->moles().data(), water_kg, temperature,
                                                        slope);
    return true;
  }
  ion_activity_model* ions() noexcept override { return ions_ ? this : nullptr; }

  std::size_t ion_slots() const override { return ions_->ion_slots(); }
  std::size_t global_ion(std::size_t slot) const override { return ions_->global_ion(slot); }
  std::size_t slot_of(std::size_t g) const override { return ions_->slot_of(g); }
  void ion_moles(double* n) const override { ions_->ion_moles(n); }
  const data::pitzer_parameter_set& parameter_set() const override { return *set_; }
  /// The ions' bounds (Pitzer on their molalities, as ln_water_activity_of_ions uses them).
  bool ln_activity_upper_bounds(const double* n, double water_kg, double temperature,
                                double* ln_activity_hi) override {
    return ions_->ln_activity_upper_bounds(n, water_kg, temperature, ln_activity_hi);
  }

 protected:
  pitzer_family_evaluator(const solution& s, const data::pitzer_parameter_set& set)
      : s_(&s), set_(&set), system_(s, set) {}
  // ions_ points into system_: neither copied nor moved.
  pitzer_family_evaluator(const pitzer_family_evaluator&) = delete;
  pitzer_family_evaluator& operator=(const pitzer_family_evaluator&) = delete;

  const solution* s_;
  const data::pitzer_parameter_set* set_;
  System system_;
  std::optional<pitzer_system_ions> ions_;
  pitzer::check_memo memo_;
};

/// Model 'pitzer' prepared for one species list: the osmotic sum and the ion activities
/// on one prepared system.
class pitzer_evaluator final : public pitzer_family_evaluator<pitzer_system> {
 public:
  pitzer_evaluator(const solution& s, const data::pitzer_parameter_set& set)
      : pitzer_family_evaluator(s, set) {
    ions_.emplace(system_, s);
  }
  validity check(double water_kg, double temperature) override {
    return pitzer::check(*s_, water_kg, temperature, *set_, pitzer::species_checked::all,
                         &memo_);
  }
  double ln_water_activity_of_ions(const double* n, double water_kg, double temperature,
                                   double* ln_activity) override {
    return -constants::molar_mass_water * ions_->particle_sum(n, water_kg, temperature, ln_activity);
  }
};

}  // namespace detail

/// The registry entry of model 'pitzer' (models/builtin_models.hpp).
inline model_descriptor pitzer::descriptor() {
  const auto& set = default_parameters();
  model_descriptor d;
  d.id = id;
  d.summary = std::string("Pitzer ion interaction (Debye-Hueckel A_phi of ") +
              (set.aphi == data::aphi_correlation::spencer_1990 ? "Spencer, Moller & Weare 1990"
                                                               : "Clegg, Rard & Pitzer 1994") +
              ", unsymmetrical E-theta of Pitzer 1975), parameter set '" + set.id + "' [" +
              set.description + "]; non-electrolytes counted as ideal particles";
  d.traits = {true, true, true};
  d.auto_rank = [](const solution& s) {
    return s.has_electrolytes() && !s.has_non_electrolytes() ? 10 : 0;
  };
  d.prepare = [](const solution& s, const model_options& o) -> std::unique_ptr<activity_evaluator> {
    const auto& set = parameters_for(o);
    require_binaries(s, set);
    return std::make_unique<detail::pitzer_evaluator>(s, set);
  };
  d.describe = [](const solution& s, const model_options& o) {
    const auto& set = parameters_for(o);
    std::string out = o.parameter_set.empty() ? "" : "; parameter set '" + set.id + "' chosen";
    return out + detail::describe_each(s, [&set](const data::solute_record& r) {
      return detail::describe_pitzer_pair(r, set);
    });
  };
  d.validated_range = validated_range(set);
  return d;
}

}  // namespace colligate::models
