#pragma once
/// \file builtin_solutes.hpp
/// The built-in solute table. One record per solute; each value names its source key
/// (see citation.hpp). Molar masses are computed from IUPAC 2013 standard atomic weights.
///
/// Norrish constants: K from published 25 C water-activity data where a published value
/// is used; the cubic K3 (and K where noted) fitted by colligate to the CRC Handbook
/// freezing-point depressions (tests/reference/crc_freezing_points.csv), so that the
/// model holds down to the freezing curve. The note of each record names the rows.

#include <string>
#include <utility>
#include <vector>

#include "colligate/data/solute_record.hpp"
#include "colligate/data/solute_table.hpp"

namespace colligate::data {

namespace detail {

inline solute_record non_electrolyte(std::string id, std::string name, std::string formula,
                                     std::vector<std::string> aliases, double molar_mass_g,
                                     norrish_constants norrish) {
  solute_record r;
  r.id = std::move(id);
  r.name = std::move(name);
  r.formula = std::move(formula);
  r.aliases = std::move(aliases);
  r.molar_mass = molar_mass_g * 1e-3;
  r.molar_mass_source = "iupac_atomic_weights_2013";
  r.kind = solute_class::non_electrolyte;
  r.particles = 1;
  r.particles_source = "common practice";
  r.norrish = std::move(norrish);
  return r;
}

inline solute_record electrolyte(std::string id, std::string name, std::string formula,
                                 std::vector<std::string> aliases, double molar_mass_g,
                                 std::vector<ion_count> ions) {
  int particles = 0;
  for (const auto& i : ions) particles += i.count;
  solute_record r;
  r.id = std::move(id);
  r.name = std::move(name);
  r.formula = std::move(formula);
  r.aliases = std::move(aliases);
  r.molar_mass = molar_mass_g * 1e-3;
  r.molar_mass_source = "iupac_atomic_weights_2013";
  r.kind = solute_class::electrolyte;
  r.particles = particles;
  r.particles_source = "common practice";  // complete dissociation of a strong electrolyte
  r.ions = std::move(ions);
  return r;
}

inline norrish_constants norrish(double k, const char* k_source, double k3, double k4,
                                 const char* k3_source, double max_mass_fraction,
                                 const char* note) {
  norrish_constants n;
  n.available = true;
  n.k = k;
  n.k_source = k_source;
  n.k3 = k3;
  n.k4 = k4;
  n.k3_source = k3_source;
  n.max_mass_fraction = max_mass_fraction;
  n.note = note;
  return n;
}

/// An effective solute for a salt whose ions the Pitzer parameter sets do not know: record
/// `r` (a non-electrolyte with Norrish constants fitted to its freezing points) counted as
/// `particles` ideal particles per formula unit (complete dissociation, common practice).
/// Its ions do not enter the ionic strength of a mixture.
inline solute_record dissociated(solute_record r, int particles) {
  r.particles = particles;
  r.particles_source = "common practice";
  return r;
}

/// The same, with K, K3 and K4 taken in the effective volume fraction of ratio
/// `volume_ratio` (norrish_constants::volume_ratio).
inline norrish_constants norrish(double k, const char* k_source, double k3, double k4,
                                 double volume_ratio, const char* k3_source,
                                 double max_mass_fraction, const char* note) {
  norrish_constants n = norrish(k, k_source, k3, k4, k3_source, max_mass_fraction, note);
  n.volume_ratio = volume_ratio;
  return n;
}

/// A record with its dissolved solute's apparent specific heat (data/dissolved_heat_capacity.hpp).
inline solute_record with_heat_capacity(solute_record r, dissolved_heat_capacity c) {
  r.heat_capacity = std::move(c);
  return r;
}

}  // namespace detail

/// The built-in table; built once, immutable afterwards (thread-safe initialisation).
inline const solute_table& builtin_solutes() {
  using detail::dissociated;
  using detail::electrolyte;
  using detail::non_electrolyte;
  using detail::laliberte;
  using detail::norrish;
  using detail::with_heat_capacity;
  static const solute_table table(std::vector<solute_record>{
#include "colligate/data/detail/builtin_solutes.inc"
  });
  return table;
}

}  // namespace colligate::data
