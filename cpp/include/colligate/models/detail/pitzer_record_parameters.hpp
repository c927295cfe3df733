#pragma once
/// \file pitzer_record_parameters.hpp
/// Pitzer binary parameters carried by solute records (data::record_pitzer_parameters, e.g.
/// a salt fitted with fit/pitzer_fitter.hpp). A solution holding such a record is evaluated
/// with a copy of the parameter set in which the record's row takes the place of the set's
/// row for the same cation-anion pair (or is added if the set has none). Nothing global is
/// changed: the set is copied per evaluation, only when some record carries parameters.

#include <cmath>
#include <string>
#include <vector>

#include "colligate/core/errors.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/data/pitzer_parameters.hpp"
#include "colligate/data/solute_record.hpp"

namespace colligate::models::detail {

/// True when some species of `s` carries its own Pitzer binary parameters.
inline bool has_record_binaries(const solution& s) {
  for (const auto& rec : s.species())
    if (rec.pitzer.available) return true;
  return false;
}

inline bool same_t_function(const data::t_function& a, const data::t_function& b) {
  return a.a == b.a;
}

inline bool same_binary_values(const data::pitzer_binary& a, const data::pitzer_binary& b) {
  return same_t_function(a.beta0, b.beta0) && same_t_function(a.beta1, b.beta1) &&
         same_t_function(a.beta2, b.beta2) && same_t_function(a.cphi, b.cphi) &&
         a.extended == b.extended;
}

/// `set` with the binary rows carried by the records of `s` in place of the set's rows.
/// Two records of one solution carrying different parameters for the same ion pair are a
/// caller mistake (the pair can have one set of parameters only) and throw invalid_input.
inline data::pitzer_parameter_set with_record_binaries(const solution& s,
                                                       const data::pitzer_parameter_set& set) {
  data::pitzer_parameter_set out = set;
  std::vector<const data::solute_record*> owner(out.binaries.size(), nullptr);
  for (const auto& rec : s.species()) {
    if (!rec.pitzer.available) continue;
    const auto& b = rec.pitzer.binary;
    std::size_t k = 0;
    while (k < out.binaries.size() &&
           !(out.binaries[k].cation == b.cation && out.binaries[k].anion == b.anion))
      ++k;
    if (k == out.binaries.size()) {
      out.binaries.push_back(b);
      owner.push_back(&rec);
      continue;
    }
    if (owner[k] != nullptr && !same_binary_values(out.binaries[k], b))
      throw invalid_input("Pitzer model: solutes '" + owner[k]->id + "' and '" + rec.id +
                          "' carry different parameters for the ion pair " + b.cation + " " +
                          b.anion + "; a solution can use one set of parameters per ion pair");
    out.binaries[k] = b;
    owner[k] = &rec;
  }
  return out;
}

/// The binary row used for electrolyte `rec` (cation-anion pair): the record's own if it
/// carries one, else the set's (nullptr if neither).
inline const data::pitzer_binary* binary_for(const data::solute_record& rec,
                                             const data::pitzer_parameter_set& set,
                                             const std::string& cation,
                                             const std::string& anion) {
  if (rec.pitzer.available && rec.pitzer.binary.cation == cation &&
      rec.pitzer.binary.anion == anion)
    return &rec.pitzer.binary;
  return set.find_binary(cation, anion);
}

/// In range, or the record of temperature T (K) outside the range of a record's own
/// parameters.
inline validity record_temperature_validity(const data::solute_record& rec, double T) {
  if (!rec.pitzer.available) return {};
  const auto& p = rec.pitzer;
  if (T >= p.min_temperature - 1e-9 && T <= p.max_temperature + 1e-9) return {};
  return outside_range("model 'pitzer'", "temperature for the parameters of '" + rec.id + "'",
                       T, p.min_temperature, p.max_temperature, " K",
                       "the range of the data behind them", p.binary.source);
}

}  // namespace colligate::models::detail
