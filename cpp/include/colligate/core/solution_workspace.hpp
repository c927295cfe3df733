#pragma once
/// \file solution_workspace.hpp
/// One solution whose amounts are overwritten in place: a batch thread loads each row into
/// it, so evaluators and ice curves prepared for its species follow the rows without any
/// allocation per row. Each row gives its water (kg) and solute amounts (mol), built the
/// way the scalar factories build them, so a row computes bit for bit like a scalar call.

#include <cstddef>
#include <utility>
#include <vector>

#include "colligate/core/solution.hpp"
#include "colligate/data/solute_record.hpp"

namespace colligate {

class solution_workspace {
 public:
  /// A solution of these species (as given, built-in or fitted), all amounts zero.
  explicit solution_workspace(std::vector<data::solute_record> species)
      : s_(solution::from_molalities({}, 1.0)) {
    s_.species_ = std::move(species);
    s_.moles_.assign(s_.species_.size(), 0.0);
  }
  /// Overwrites the amounts with `moles` (mol, one per species) in `water_kg` of water.
  const solution& load(const double* moles, double water_kg) {
    for (std::size_t j = 0; j < s_.moles_.size(); ++j) s_.moles_[j] = moles[j];
    s_.water_kg_ = water_kg;
    return s_;
  }
  const solution& get() const noexcept { return s_; }

 private:
  solution s_;
};

}  // namespace colligate
