#pragma once
/// \file describe_constants.hpp
/// Text for describe_model(): the constants one solute uses under a model, with their
/// source keys. Built only on request, never inside a solve.

#include <cstdio>
#include <string>

#include "colligate/core/solution.hpp"
#include "colligate/data/pitzer_parameters.hpp"
#include "colligate/data/solute_record.hpp"
#include "colligate/models/detail/pitzer_record_parameters.hpp"

namespace colligate::models::detail {

inline std::string describe_ideal_particles(const data::solute_record& rec) {
  return std::to_string(rec.particles) + " ideal particle(s) per formula unit";
}

inline std::string describe_norrish_constants(const data::solute_record& rec) {
  if (!rec.norrish.available) return describe_ideal_particles(rec);
  char buf[160];
  std::snprintf(buf, sizeof buf, "K = %.4g [%s]", rec.norrish.k, rec.norrish.k_source.c_str());
  std::string out = buf;
  if (rec.norrish.k3 != 0.0) {
    std::snprintf(buf, sizeof buf, ", K3 = %.4g [%s]", rec.norrish.k3,
                  rec.norrish.k3_source.c_str());
    out += buf;
  }
  if (rec.norrish.k4 != 0.0) {
    std::snprintf(buf, sizeof buf, ", K4 = %.4g", rec.norrish.k4);
    out += buf;
  }
  if (rec.norrish.volume_ratio != 1.0) {
    std::snprintf(buf, sizeof buf, ", in the effective volume fraction with r = %.4g",
                  rec.norrish.volume_ratio);
    out += buf;
  }
  return out;
}

inline std::string describe_pitzer_pair(const data::solute_record& rec,
                                        const data::pitzer_parameter_set& set) {
  if (rec.kind != data::solute_class::electrolyte || rec.ions.empty())
    return describe_ideal_particles(rec);
  std::string cation, anion;
  for (const auto& ion : rec.ions) (ion.charge > 0 ? cation : anion) = ion.ion;
  const auto* row = binary_for(rec, set, cation, anion);
  return cation + " + " + anion + (row ? " [" + row->source + "]" : " (no Pitzer parameters)");
}

/// "; id: text" for every solute of `s`, text from `each(record)`.
template <class Each>
std::string describe_each(const solution& s, Each each) {
  std::string out;
  for (const auto& rec : s.species()) out += "; " + rec.id + ": " + each(rec);
  return out;
}

}  // namespace colligate::models::detail
