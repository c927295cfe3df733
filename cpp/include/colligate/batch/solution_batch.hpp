#pragma once
/// \file solution_batch.hpp
/// Many solutions with one species list: an N x S row-major array of solute amounts (mol)
/// and the water of each row (kg), validated row by row. Each row holds the numbers the
/// scalar factory of the same input holds (solution::from_molalities with 1 kg of water,
/// solution::from_mass_fractions with 1 kg in total), so the kernels give bit-identical
/// results to scalar calls. A bad row never aborts the batch: it is marked with a
/// row_status and skipped by the kernels (its results are NaN).

#include <cmath>
#include <cstdint>
#include <string>
#include <vector>

#include "colligate/core/errors.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/data/builtin_solutes.hpp"
#include "colligate/data/solute_record.hpp"
#include "colligate/data/solute_table.hpp"

namespace colligate::batch {

/// Outcome for one row of a batch calculation.
enum class row_status : std::uint8_t {
  ok = 0,                 ///< computed inside the model's validated range
  out_of_range = 1,       ///< computed, but outside the validated range (value per policy)
  invalid_input = 2,      ///< negative or non-finite amount, or mass fractions summing >= 1
  no_freezing_point = 3,  ///< does not freeze above the lowest temperature searched
  not_converged = 4,      ///< the solver stopped before its tolerance
  below_curve_end = 5,    ///< below the end of the ice curve (final eutectic, data limit)
  no_physical_value = 6,  ///< the formulation gives no physical value here (a_w > 1, say)
};
/// Number of row_status values (codes 0 .. row_status_count - 1).
inline constexpr int row_status_count = 7;

inline const char* describe(row_status s) {
  switch (s) {
    case row_status::ok: return "ok";
    case row_status::out_of_range: return "outside the model's validated range (extrapolated or NaN by policy)";
    case row_status::invalid_input: return "invalid input: negative or non-finite amount, or mass fractions summing to 1 or more";
    case row_status::no_freezing_point: return "does not freeze above -50 C";
    case row_status::not_converged: return "solver did not converge";
    case row_status::below_curve_end: return "below the end of the ice curve (the final eutectic of a brine, the lower limit of the salt data, or 215 K, where the ice water activity ends): no liquid is computed";
    case row_status::no_physical_value: return "the activity model gives no physical value for this row (water activity above 1 or not above 0): extrapolated too far";
  }
  return "unknown";
}

class solution_batch {
 public:
  /// Rows of molalities (mol/kg water), row-major `rows x species.size()`.
  static solution_batch from_molalities(const std::vector<std::string>& species, const double* data,
                                        std::size_t rows,
                                        const data::solute_table& table = data::builtin_solutes()) {
    solution_batch b(species, rows, table);
    const std::size_t S = species.size();
    for (std::size_t i = 0; i < rows; ++i) {
      bool ok = true;
      for (std::size_t j = 0; j < S; ++j) {
        const double m = data[i * S + j];
        if (!std::isfinite(m) || m < 0.0 || m > solution::max_amount) ok = false;
        b.moles_[i * S + j] = m * 1.0;  // as solution::from_molalities: m * water_kg
      }
      b.water_[i] = 1.0;
      if (!ok) b.mark_invalid(i);
    }
    return b;
  }

  /// Rows of solute mass fractions (the rest of each row is water).
  static solution_batch from_mass_fractions(const std::vector<std::string>& species,
                                            const double* data, std::size_t rows,
                                            const data::solute_table& table = data::builtin_solutes()) {
    solution_batch b(species, rows, table);
    const std::size_t S = species.size();
    for (std::size_t i = 0; i < rows; ++i) {
      double sum = 0.0;
      bool ok = true;
      for (std::size_t j = 0; j < S; ++j) {
        const double w = data[i * S + j];
        if (!std::isfinite(w) || w < 0.0 || w > 1.0) ok = false;
        sum += w;
      }
      if (!(sum < 1.0)) ok = false;
      // As solution::from_mass_fractions with 1 kg in total: water (1 - sum) kg, each
      // solute (w * 1) kg, moles = kg / molar mass (the same operations in the same order).
      b.water_[i] = ok ? (1.0 - sum) * 1.0 : 1.0;
      for (std::size_t j = 0; j < S; ++j)
        b.moles_[i * S + j] = ok ? (data[i * S + j] * 1.0) / b.species_[j].molar_mass : 0.0;
      if (!ok) b.mark_invalid(i);
    }
    return b;
  }

  std::size_t rows() const noexcept { return rows_; }
  std::size_t n_species() const noexcept { return species_.size(); }
  const std::vector<data::solute_record>& species() const noexcept { return species_; }
  /// Solute amounts of row i, mol (one per species).
  const double* row(std::size_t i) const noexcept { return moles_.data() + i * species_.size(); }
  /// Water of row i, kg.
  double water(std::size_t i) const noexcept { return water_[i]; }
  bool valid(std::size_t i) const noexcept { return input_status_[i] == row_status::ok; }
  /// True if any species is an electrolyte (solution::has_electrolytes of every row).
  bool has_electrolytes() const noexcept {
    for (const auto& r : species_)
      if (r.kind == data::solute_class::electrolyte) return true;
    return false;
  }
  row_status input_status(std::size_t i) const noexcept { return input_status_[i]; }

 private:
  solution_batch(const std::vector<std::string>& species, std::size_t rows,
                 const data::solute_table& table)
      : rows_(rows), moles_(rows * species.size()), water_(rows, 1.0),
        input_status_(rows, row_status::ok) {
    for (const auto& name : species) {
      const auto& rec = table.find(name);
      for (const auto& existing : species_)
        if (existing.id == rec.id)
          throw invalid_input("solution_batch: solute '" + rec.id + "' appears in two columns");
      species_.push_back(rec);
    }
  }
  void mark_invalid(std::size_t i) { input_status_[i] = row_status::invalid_input; }

  std::size_t rows_;
  std::vector<data::solute_record> species_;
  std::vector<double> moles_;  ///< mol, row-major
  std::vector<double> water_;  ///< kg per row
  std::vector<row_status> input_status_;
};

}  // namespace colligate::batch
