#pragma once
/// \file weak_acids.hpp
/// Dissociation constants of the weak acids of food (acetic, lactic, citric, malic) and of
/// water, each with its source key (citation.hpp). Read by
/// equilibria/weak_acid_dissociation.hpp, which splits an acid into its undissociated and
/// dissociated forms.
///
/// Each step j (H_(n-j+1)A^(j-1)- = H+ + H_(n-j)A^j-) has its thermodynamic constant K_j
/// (molal scale, infinite-dilution standard state). Where the source gives a temperature
/// function it is stored as printed, in the form
///
///     ln K(T) = f [c0 + c1 / T + c2 ln T + c3 T]
///
/// with f = 1 when the source prints ln K and f = ln 10 when it prints log10 K. An acid
/// whose source gives the 25 C value only keeps pKa(25 C) at every temperature; the
/// speciation says so (temperature_function = false). The enthalpies of ionisation of the
/// carboxylic acids are small (acetic acid: pKa 4.780 at 0 C and 4.756 at 25 C by the
/// Harned & Ehlers function below), so the 25 C value moves the degree of dissociation by
/// a few per cent at most over 0 to -20 C.

#include <array>
#include <cmath>
#include <limits>
#include <string>
#include <vector>

#include "colligate/core/errors.hpp"

namespace colligate::data {

/// One dissociation step of an acid.
struct acid_dissociation_step {
  double pka_25c = 0.0;        ///< pKa at 298.15 K as printed by `source`
  bool temperature_function = false;
  std::array<double, 4> c{};   ///< c0..c3 of ln K(T) = factor [c0 + c1/T + c2 ln T + c3 T]
  double factor = 1.0;         ///< 1 (coefficients of ln K) or ln 10 (of log10 K)
  double min_temperature = 298.15;  ///< K, range of the measurements behind the function
  double max_temperature = 298.15;  ///< K
  std::string source;

  /// pKa at temperature T (K): the temperature function, or pka_25c at every T.
  double pka(double T) const {
    if (!temperature_function) return pka_25c;
    const double ln_k = factor * (c[0] + c[1] / T + c[2] * std::log(T) + c[3] * T);
    return -ln_k / std::log(10.0);
  }
};

/// A weak acid: the built-in solute it belongs to and its dissociation steps.
struct weak_acid {
  /// lower_snake id ("acetic_acid"): the id of its built-in solute record where the table
  /// has one (acetic, lactic, citric acid); malic acid has none, since no published
  /// freezing-point or water-activity table of it has been read.
  std::string id;
  std::string name;       ///< display name
  std::vector<acid_dissociation_step> steps;  ///< K1, K2, ... in order
  std::string note;
  /// Norrish constant K of the undissociated acid (sign convention of
  /// solute_record::norrish_constants) for the freezing point with dissociation
  /// (equilibria/weak_acid_freezing_point); NaN when none has been fitted.
  double norrish_k_undissociated = std::numeric_limits<double>::quiet_NaN();
  std::string norrish_k_source;  ///< citation key of that K (empty when NaN)
  std::string norrish_k_note;    ///< the rows it was fitted to and how it was checked
  /// Worst |deviation| (K) of the fit rows, the basis of the held-out check's tolerance.
  double norrish_k_fit_worst_deviation = std::numeric_limits<double>::quiet_NaN();
  /// Highest molality (mol/kg) of the CRC rows that check the freezing point with
  /// dissociation (the validated range of weak_acid_freezing_point), from the top row's
  /// mass percent and the molar mass, rounded up in the last digit (lactic acid 20 wt%:
  /// 2.7754, where the table prints 2.775); NaN when none.
  double max_molality_checked = std::numeric_limits<double>::quiet_NaN();
};

namespace detail {
inline acid_dissociation_step pka_only(double pka, const char* source) {
  acid_dissociation_step s;
  s.pka_25c = pka;
  s.source = source;
  return s;
}
inline acid_dissociation_step pka_function(double pka, std::array<double, 4> c, double factor,
                                           double t_min, double t_max, const char* source) {
  acid_dissociation_step s;
  s.pka_25c = pka;
  s.temperature_function = true;
  s.c = c;
  s.factor = factor;
  s.min_temperature = t_min;
  s.max_temperature = t_max;
  s.source = source;
  return s;
}
}  // namespace detail

/// The ionisation of water, H2O = H+ + OH-: pKw(T) = 4470.99/T - 6.0875 + 0.01706 T
/// (Harned & Robinson 1940, from memory; 13.995 at 25 C, 14.941 at 0 C), stored as
/// log10 Kw = -4470.99/T + 6.0875 - 0.01706 T. Measured 0-60 C.
inline const acid_dissociation_step& water_ionisation() {
  static const acid_dissociation_step w = detail::pka_function(
      13.995, {6.0875, -4470.99, 0.0, -0.01706}, std::log(10.0), 273.15, 333.15,
      "harned_robinson_1940");
  return w;
}

/// The built-in weak acids (immutable after first use).
inline const std::vector<weak_acid>& weak_acids() {
  using detail::pka_function;
  using detail::pka_only;
  const double ln10 = std::log(10.0);
  static const std::vector<weak_acid> table = {
      {"acetic_acid",
       "acetic acid",
       // Harned & Ehlers (1933): log10 K = -1170.48/T + 3.1649 - 0.013399 T, 0-60 C
       // (function from memory; it gives pKa 4.756 at 25 C, the CRC Handbook value).
       {pka_function(4.756, {3.1649, -1170.48, 0.0, -0.013399}, ln10, 273.15, 333.15,
                     "harned_ehlers_1933")},
       "pKa(T) of Harned & Ehlers (1933)",
       -1.23848, "colligate_fit_crc",
       "K of the undissociated acid fitted (least squares, tools/fit_weak_acid_norrish.py) to the "
       "15 CRC Handbook acetic acid rows 0.5-36 wt% marked used_in_fit (worst 0.051 K); the 14 "
       "held-out rows 0.040 K",
       0.0511, 9.367},
      {"lactic_acid",
       "lactic acid",
       // CRC Handbook, dissociation constants of organic acids in aqueous solution: 3.86
       // at 25 C (from memory); no temperature function read.
       {pka_only(3.86, "crc_organic_acid_pka")},
       "pKa at 25 C used at every temperature",
       -3.24446, "colligate_fit_crc",
       "K of the undissociated acid fitted (least squares, tools/fit_weak_acid_norrish.py) to the "
       "8 CRC Handbook D-lactic acid rows 0.5-18 wt% marked used_in_fit (worst 0.136 K); the 8 "
       "held-out rows 0.131 K. The CRC rows lie below the ideal depression at 1 wt% (0.19 K "
       "against 0.21 K for undissociated monomer), which no K can follow: commercial lactic acid "
       "holds lactoyllactic acid (from memory), so the molality column may overstate the monomer",
       0.1357, 2.776},
      {"citric_acid",
       "citric acid",
       // Bates & Pinching (1949), measured 0-50 C; the temperature functions as refitted to
       // their constants in the ln K form printed in the abstract of "Dissociation constants
       // for citric acid in NaCl and KCl solutions and their mixtures at 25 C" (J. Solution
       // Chem., University of Miami; read in its public abstract). They give pKa 3.128,
       // 4.761, 6.396 at 25 C; the 25 C values below are those of Bates & Pinching as the
       // CRC Handbook prints them (3.13, 4.76, 6.40). The abstract as read prints "+" before
       // the 1/T terms of K2 and K3; only "-" reproduces Bates & Pinching's constants (at 25 C
       // 4.761 and 6.396; at 0 C 4.837 and 6.393, from memory; checked in
       // tests/cpp/equilibria/test_weak_acid_dissociation.cpp), so the sign is taken as lost
       // in that copy.
       {pka_function(3.13, {-646.52280, 14264.1855, 115.34510, -0.2204}, 1.0, 273.15, 323.15,
                     "bates_pinching_1949"),
        pka_function(4.76, {-52.19970, -1842.97387, 11.19421, -0.05487}, 1.0, 273.15, 323.15,
                     "bates_pinching_1949"),
        pka_function(6.40, {-129.89305, -394.04129, 25.36088, -0.09394}, 1.0, 273.15, 323.15,
                     "bates_pinching_1949")},
       "pKa(T) of Bates & Pinching (1949)",
       1.22654, "colligate_fit_crc",
       "K of the undissociated acid fitted (least squares, tools/fit_weak_acid_norrish.py) to the "
       "11 CRC Handbook citric acid rows 0.5-30 wt% marked used_in_fit (worst 0.060 K); the 10 "
       "held-out rows 0.064 K (the constant with dissociation folded in: 0.085 K)",
       0.0601, 2.231},
      {"malic_acid",
       "malic acid",
       // CRC Handbook, dissociation constants of organic acids: 3.40 and 5.20 at 25 C (from
       // memory); no temperature function read.
       {pka_only(3.40, "crc_organic_acid_pka"), pka_only(5.20, "crc_organic_acid_pka")},
       "pKa at 25 C used at every temperature; no freezing-point or water-activity table of "
       "malic acid read, so no Norrish constant and no solute record",
       std::numeric_limits<double>::quiet_NaN(), "", "",
       std::numeric_limits<double>::quiet_NaN(), std::numeric_limits<double>::quiet_NaN()},
  };
  return table;
}

/// The weak acid with this id, or nullptr when there is none.
inline const weak_acid* find_weak_acid(const std::string& id) {
  for (const auto& a : weak_acids())
    if (a.id == id) return &a;
  return nullptr;
}

/// The weak acid with this id; throws invalid_input naming the known ids.
inline const weak_acid& weak_acid_by_id(const std::string& id) {
  if (const auto* a = find_weak_acid(id)) return *a;
  std::string known;
  for (const auto& a : weak_acids()) known += (known.empty() ? "'" : ", '") + a.id + "'";
  throw invalid_input("acid = '" + id + "': the weak acids with dissociation constants are " +
                      known);
}

}  // namespace colligate::data
