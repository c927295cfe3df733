#pragma once
/// \file solute_record.hpp
/// What colligate knows about one solute: identity, molar mass, how it dissociates, and
/// the constants each activity model needs, every value with its source key.
/// To add a solute, add a record to builtin_solutes.hpp (or build one at run time, e.g.
/// from a fit) and give every value a source that resolves in citation.hpp.

#include <string>
#include <vector>

#include "colligate/data/constant_uncertainty.hpp"
#include "colligate/data/dissolved_heat_capacity.hpp"
#include "colligate/data/pitzer_parameters.hpp"

namespace colligate::data {

enum class solute_class { non_electrolyte, electrolyte };

/// Norrish constants of a non-electrolyte.
///
/// Sign convention (ours): ln a_w = ln x_w - K x_s^2 - K3 x_s^3 - K4 x_s^4 for a single solute,
/// so K > 0 for sugars (activity below Raoult's law). Norrish (1966) and Chirife et al.
/// (1980) print the same constants with the opposite sign.
/// With volume_ratio r != 1 the three terms are taken in the effective volume fraction
/// z_s = x_s / (x_s + r (1 - x_s)) instead of x_s (models/norrish.hpp).
struct norrish_constants {
  bool available = false;
  double k = 0.0;                 ///< quadratic constant K (dimensionless)
  double k3 = 0.0;                ///< cubic constant K3 (dimensionless, 0 if unused)
  double k4 = 0.0;                ///< quartic constant K4 (dimensionless, 0 if unused)
  /// r = q_water / q_solute of the effective volume fraction (Wohl 1946) in which K, K3, K4
  /// are taken; 1 (default) is Norrish's mole-fraction form. Source: k3_source.
  double volume_ratio = 1.0;
  double max_mass_fraction = 0.0; ///< highest solute mass fraction (binary) validated
  std::string k_source;           ///< citation key for K
  std::string k3_source;          ///< citation key for K3 and K4 (empty if both are 0)
  std::string note;               ///< which data or rows set the constants
};

/// One ion of a dissolved electrolyte: its Pitzer-table name ("Na+", "SO4-2"), charge
/// and count per formula unit (CaCl2 -> {"Ca+2", +2, 1}, {"Cl-", -1, 2}).
struct ion_count {
  std::string ion;
  int charge = 0;
  int count = 0;
};

/// Pitzer cation-anion parameters that a salt record carries itself (a salt fitted to a
/// lab's data, fit/pitzer_fitter.hpp). When `available`, every Pitzer evaluation of a
/// solution holding the record uses `binary` in place of the parameter set's row for the
/// same ion pair (models/detail/pitzer_record_parameters.hpp), so a fitted salt needs no
/// global registry: it travels with the record, through a solute_table, into the solution.
struct record_pitzer_parameters {
  bool available = false;
  pitzer_binary binary{};        ///< cation, anion, beta0/beta1/beta2/C-phi (T), max_molality, source
  double min_temperature = 0.0;  ///< K, lowest temperature the parameters are valid for
  double max_temperature = 0.0;  ///< K, highest temperature the parameters are valid for
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
  /// Ions per formula unit of an electrolyte (empty for non-electrolytes). Their charges
  /// sum to zero, so a solution made of salts is electroneutral by construction.
  std::vector<ion_count> ions;
  norrish_constants norrish;
  record_pitzer_parameters pitzer;  ///< own Pitzer binary parameters (fitted salts only)
  constant_uncertainty uncertainty;  ///< covariance of the constants; empty: "not stated"
  /// Apparent specific heat of the dissolved solute (thermal model); when not available
  /// the solute counts with its proximate component (Choi & Okos carbohydrate or ash).
  dissolved_heat_capacity heat_capacity;
};

}  // namespace colligate::data
