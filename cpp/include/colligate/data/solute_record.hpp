#pragma once
/// \file solute_record.hpp
/// What colligate knows about one solute: identity, molar mass, how it dissociates, and
/// the constants each activity model needs, every value with its source key.
/// To add a solute, add a record to builtin_solutes.hpp (or build one at run time, e.g.
/// from a fit) and give every value a source that resolves in citation.hpp.

#include <string>
#include <vector>

namespace colligate::data {

enum class solute_class { non_electrolyte, electrolyte };

/// Norrish constants of a non-electrolyte.
///
/// Sign convention (ours): ln a_w = ln x_w - K x_s^2 - K3 x_s^3 - K4 x_s^4 for a single solute,
/// so K > 0 for sugars (activity below Raoult's law). Norrish (1966) and Chirife et al.
/// (1980) print the same constants with the opposite sign.
struct norrish_constants {
  bool available = false;
  double k = 0.0;                 ///< quadratic constant K (dimensionless)
  double k3 = 0.0;                ///< cubic constant K3 (dimensionless, 0 if unused)
  double k4 = 0.0;                ///< quartic constant K4 (dimensionless, 0 if unused)
  double max_mass_fraction = 0.0; ///< highest solute mass fraction (binary) validated
  std::string k_source;           ///< citation key for K
  std::string k3_source;          ///< citation key for K3 and K4 (empty if both are 0)
  std::string note;               ///< which data or rows set the constants
};

struct solute_record {
  std::string id;        ///< lower_snake id, unique ("sucrose", "sodium_chloride")
  std::string name;      ///< display name ("sucrose", "sodium chloride")
  std::string formula;   ///< Hill-style or common formula ("C12H22O11", "NaCl")
  std::vector<std::string> aliases;  ///< other accepted names ("saccharose", "table salt")
  double molar_mass = 0.0;           ///< kg/mol
  std::string molar_mass_source;
  solute_class kind = solute_class::non_electrolyte;
  int particles = 1;  ///< dissolved particles per formula unit (nu; 2 for NaCl)
  std::string particles_source;
  norrish_constants norrish;
};

}  // namespace colligate::data
