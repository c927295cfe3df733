#pragma once
/// \file solution.hpp
/// The solution value type: kilograms of water plus moles of each solute.
///
/// Immutable and validated at construction. Factories take amounts (kg), molalities
/// (mol per kg water), mass fractions (rest is water), mole fractions (formula units,
/// rest is water) or Brix (mass percent sucrose). Solute names resolve through a
/// solute_table (case-insensitive; names, formulas and aliases accepted); a solute given
/// twice, under any of its names, is an error.

#include <cmath>
#include <string>
#include <utility>
#include <vector>

#include "colligate/core/constants.hpp"
#include "colligate/core/errors.hpp"
#include "colligate/data/builtin_solutes.hpp"
#include "colligate/data/solute_record.hpp"
#include "colligate/data/solute_table.hpp"

namespace colligate {

/// A named amount given by a caller: (solute name, value in the factory's unit).
using named_amount = std::pair<std::string, double>;

class solution_workspace;

class solution {
 public:
  /// Largest amount a factory accepts, in its own unit (kg, mol/kg): far beyond any food
  /// batch, and small enough that every derived sum (total mass, moles, mole fractions)
  /// stays finite in double precision.
  static constexpr double max_amount = 1e15;

  /// Least water a factory accepts, kg: with solutes up to `max_amount` the water mole
  /// fraction then stays above about 1e-30, far from underflow (a subnormal water mass
  /// gave a water mole fraction of exactly 0, found by fuzzing).
  static constexpr double min_water = 1e-12;

  /// Water plus solute masses, kg.
  static solution from_masses(double water_kg, const std::vector<named_amount>& solute_kg,
                              const data::solute_table& table = data::builtin_solutes()) {
    check_amount("solution", "water", water_kg, "kg");
    if (!(water_kg > 0.0))
      throw invalid_input(detail::describe("solution", "water", water_kg,
                                           "a solution needs water > 0 kg"));
    check_least_water("solution", "water", water_kg);
    solution s;
    s.water_kg_ = water_kg;
    for (const auto& [name, kg] : solute_kg) {
      check_amount("solution", "solutes['" + name + "']", kg, "kg");
      const auto& rec = table.find(name);
      s.add_species(rec, kg / rec.molar_mass, name);
    }
    return s;
  }

  /// Molalities, mol per kg of water, with `water_kg` of water.
  static solution from_molalities(const std::vector<named_amount>& molalities,
                                  double water_kg = 1.0,
                                  const data::solute_table& table = data::builtin_solutes()) {
    check_amount("from_molalities", "water", water_kg, "kg");
    if (!(water_kg > 0.0))
      throw invalid_input(detail::describe("from_molalities", "water", water_kg,
                                           "a solution needs water > 0 kg"));
    check_least_water("from_molalities", "water", water_kg);
    solution s;
    s.water_kg_ = water_kg;
    for (const auto& [name, m] : molalities) {
      check_amount("from_molalities", "molalities['" + name + "']", m, "mol/kg");
      const auto& rec = table.find(name);
      s.add_species(rec, m * water_kg, name);
    }
    return s;
  }

  /// Solute mass fractions; the rest of `total_kg` is water. The fractions must sum to
  /// less than 1.
  static solution from_mass_fractions(const std::vector<named_amount>& fractions,
                                      double total_kg = 1.0,
                                      const data::solute_table& table = data::builtin_solutes()) {
    check_amount("from_mass_fractions", "total_mass", total_kg, "kg");
    if (!(total_kg > 0.0))
      throw invalid_input(
          detail::describe("from_mass_fractions", "total_mass", total_kg, "must be > 0 kg"));
    double sum = 0.0;
    for (const auto& [name, w] : fractions) {
      check_amount("from_mass_fractions", "fractions['" + name + "']", w, "");
      if (w > 1.0)
        throw invalid_input(detail::describe("from_mass_fractions", "fractions['" + name + "']",
                                             w, "a mass fraction must lie in [0, 1)"));
      sum += w;
    }
    if (!(sum < 1.0))
      throw invalid_input(detail::describe(
          "from_mass_fractions", "sum of solute mass fractions", sum,
          "must be below 1 (the rest is water); give percentages as fractions (20 % -> 0.20)"));
    if (!((1.0 - sum) * total_kg >= min_water))
      throw invalid_input(detail::describe(
          "from_mass_fractions", "sum of solute mass fractions", sum,
          "leaves less than 1e-12 kg of water in total_mass; a solution needs water >= 1e-12 kg"));
    std::vector<named_amount> masses;
    for (const auto& [name, w] : fractions) masses.emplace_back(name, w * total_kg);
    return from_masses((1.0 - sum) * total_kg, masses, table);
  }

  /// Solute mole fractions of formula units (undissociated); the rest is water.
  /// The solution holds one mole of water plus solutes in total.
  static solution from_mole_fractions(const std::vector<named_amount>& fractions,
                                      const data::solute_table& table = data::builtin_solutes()) {
    double sum = 0.0;
    for (const auto& [name, x] : fractions) {
      check_amount("from_mole_fractions", "fractions['" + name + "']", x, "");
      sum += x;
    }
    if (!(sum < 1.0))
      throw invalid_input(detail::describe("from_mole_fractions", "sum of solute mole fractions",
                                           sum, "must be below 1 (the rest is water)"));
    const double water_kg = (1.0 - sum) * constants::molar_mass_water;
    std::vector<named_amount> molalities;
    for (const auto& [name, x] : fractions) molalities.emplace_back(name, x / water_kg);
    return from_molalities(molalities, water_kg, table);
  }

  /// Sucrose solution of the given Brix (mass percent sucrose), 1 kg in total.
  static solution from_brix(double brix,
                            const data::solute_table& table = data::builtin_solutes()) {
    if (!std::isfinite(brix) || brix < 0.0 || brix >= 100.0)
      throw invalid_input(detail::describe("from_brix", "brix", brix,
                                           "must be finite and in [0, 100) mass percent"));
    return from_mass_fractions({{"sucrose", brix / 100.0}}, 1.0, table);
  }

  /// Seawater of the TEOS-10 Reference Composition with absolute salinity SA, g of sea
  /// salt per kg of seawater; 1 kg of seawater in total (water 1 - SA/1000 kg).
  ///
  /// Mole fractions of Millero, Feistel, Wright & McDougall (2008), Deep-Sea Res. I 55,
  /// 50, Table 4 (mean molar mass 31.4038218 g/mol). The Pitzer tables know Na, K, Ca, Mg,
  /// Cl and SO4, so the minor ions are lumped with a major ion of the same charge (Sr with
  /// Ca; Br, HCO3, B(OH)4, F, OH with Cl; CO3 with SO4; 0.3 % of the ions), which keeps
  /// the charge balance; neutral B(OH)3 and CO2 (0.03 % of the solute) are left out. The
  /// ions are then written as the salts KCl, CaCl2, MgCl2, Na2SO4 and NaCl.
  static solution seawater(double absolute_salinity,
                           const data::solute_table& table = data::builtin_solutes()) {
    if (!std::isfinite(absolute_salinity) || absolute_salinity < 0.0 ||
        absolute_salinity >= 120.0)
      throw invalid_input(detail::describe("seawater", "absolute_salinity", absolute_salinity,
                                           "must be finite and in [0, 120) g/kg"));
    // Millero et al. (2008) Table 4, mole fractions X_j.
    const double x_na = 0.4188071, x_mg = 0.0471678, x_ca = 0.0091823, x_k = 0.0091159,
                 x_sr = 0.0000810, x_cl = 0.4874839, x_so4 = 0.0252152, x_hco3 = 0.0015340,
                 x_br = 0.0007520, x_co3 = 0.0002134, x_boh4 = 0.0000900, x_f = 0.0000610,
                 x_oh = 0.0000071;
    const double mean_molar_mass = 31.4038218e-3;  // kg/mol, Millero et al. (2008)
    const double water_kg = 1.0 - absolute_salinity / 1000.0;
    const double n_salt = absolute_salinity / 1000.0 / mean_molar_mass;  // mol per kg seawater
    const double scale = n_salt / water_kg;  // mol/kg water per unit mole fraction
    const double ca = x_ca + x_sr, so4 = x_so4 + x_co3;
    (void)(x_cl + x_hco3 + x_br + x_boh4 + x_f + x_oh);  // lumped Cl: follows from the balance
    return from_molalities({{"potassium_chloride", x_k * scale},
                            {"calcium_chloride", ca * scale},
                            {"magnesium_chloride", x_mg * scale},
                            {"sodium_sulfate", so4 * scale},
                            {"sodium_chloride", (x_na - 2.0 * so4) * scale}},
                           water_kg, table);
  }

  // --- accessors (SI) -------------------------------------------------------------

  double water_mass() const noexcept { return water_kg_; }
  double water_moles() const noexcept { return water_kg_ / constants::molar_mass_water; }
  std::size_t size() const noexcept { return species_.size(); }
  const std::vector<data::solute_record>& species() const noexcept { return species_; }
  const std::vector<double>& moles() const noexcept { return moles_; }

  double solute_mass(std::size_t i) const { return moles_.at(i) * species_.at(i).molar_mass; }
  double molality(std::size_t i) const { return moles_.at(i) / water_kg_; }

  double total_solute_mass() const noexcept {
    double m = 0.0;
    for (std::size_t i = 0; i < species_.size(); ++i) m += moles_[i] * species_[i].molar_mass;
    return m;
  }
  double total_mass() const noexcept { return water_kg_ + total_solute_mass(); }
  double mass_fraction(std::size_t i) const { return solute_mass(i) / total_mass(); }
  double water_mass_fraction() const noexcept { return water_kg_ / total_mass(); }

  /// Mole fraction of solute i counting formula units (no dissociation).
  double mole_fraction(std::size_t i) const { return moles_.at(i) / total_formula_moles(); }
  double water_mole_fraction() const noexcept { return water_moles() / total_formula_moles(); }

  /// Total dissolved solids as mass percent. Equals refractometric Brix only for pure
  /// sucrose solutions.
  double brix() const noexcept { return 100.0 * total_solute_mass() / total_mass(); }

  /// Ionic strength, mol/kg, assuming complete dissociation into the record's ions:
  /// I = 1/2 sum_i m_i z_i^2 (1:1 -> m, 2:1 -> 3m, 2:2 -> 4m).
  double ionic_strength() const noexcept { return ionic_strength(water_kg_); }

  /// Ionic strength with `water_kg` of water in place of the solution's own.
  double ionic_strength(double water_kg) const noexcept {
    double I = 0.0;
    for (std::size_t i = 0; i < species_.size(); ++i) {
      if (species_[i].kind != data::solute_class::electrolyte) continue;
      const double m = moles_[i] / water_kg;
      if (species_[i].ions.empty()) {  // record without ion data: 1:1 or 2:1 by particle count
        I += (species_[i].particles == 2 ? 1.0 : 3.0) * m;
        continue;
      }
      for (const auto& ion : species_[i].ions) I += 0.5 * m * ion.count * ion.charge * ion.charge;
    }
    return I;
  }

  /// True if any solute is an electrolyte.
  bool has_electrolytes() const noexcept {
    for (const auto& r : species_)
      if (r.kind == data::solute_class::electrolyte) return true;
    return false;
  }

  /// True if any solute is a non-electrolyte.
  bool has_non_electrolytes() const noexcept {
    for (const auto& r : species_)
      if (r.kind == data::solute_class::non_electrolyte) return true;
    return false;
  }

  /// The solutes of one class only (electrolytes or non-electrolytes), same water. Used
  /// by the combining rules, which evaluate each class at the same water.
  solution only(data::solute_class kind) const {
    solution s;
    s.water_kg_ = water_kg_;
    for (std::size_t i = 0; i < species_.size(); ++i) {
      if (species_[i].kind != kind) continue;
      s.species_.push_back(species_[i]);
      s.moles_.push_back(moles_[i]);
    }
    return s;
  }

  /// The same solutes with a different mass of water (used by the ice curve).
  solution with_water(double water_kg) const {
    check_amount("with_water", "water", water_kg, "kg");
    if (!(water_kg > 0.0))
      throw invalid_input(detail::describe("with_water", "water", water_kg, "must be > 0 kg"));
    solution s = *this;
    s.water_kg_ = water_kg;
    return s;
  }

  /// Index of a solute by any of its names, or size() if absent.
  std::size_t index_of(const std::string& id) const {
    for (std::size_t i = 0; i < species_.size(); ++i)
      if (species_[i].id == id) return i;
    return species_.size();
  }

 private:
  friend class solution_workspace;  // one solution whose amounts are overwritten in place
  solution() = default;

  double total_formula_moles() const noexcept {
    double n = water_moles();
    for (double x : moles_) n += x;
    return n;
  }

  static void check_least_water(const char* where, const char* field, double water_kg) {
    if (water_kg < min_water)
      throw invalid_input(detail::describe(where, field, water_kg,
                                           "a solution needs water >= 1e-12 kg"));
  }

  static void check_amount(const char* where, const std::string& field, double value,
                           const char* unit) {
    if (!std::isfinite(value) || value < 0.0 || value > max_amount)
      throw invalid_input(detail::describe(
          where, field, value,
          std::string("must be finite, >= 0 and <= 1e15") + (*unit ? std::string(" ") + unit : "")));
  }

  void add_species(const data::solute_record& rec, double moles, const std::string& given) {
    for (std::size_t i = 0; i < species_.size(); ++i)
      if (species_[i].id == rec.id)
        throw invalid_input("solution: solute '" + rec.id + "' is given twice, as '" +
                            given_names_[i] + "' and as '" + given + "'");
    species_.push_back(rec);
    moles_.push_back(moles);
    given_names_.push_back(given);
  }

  double water_kg_ = 1.0;
  std::vector<data::solute_record> species_;
  std::vector<double> moles_;
  std::vector<std::string> given_names_;  ///< names as the caller spelled them (messages)
};

}  // namespace colligate
