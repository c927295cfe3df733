#pragma once
/// \file single_salt_pitzer.hpp
/// Pitzer parameters of salts of food that the ion tables of the Pitzer model
/// (data/pitzer_parameters.hpp, six ions) do not hold: acetates, citrate, phosphates,
/// carbonates and bicarbonates of sodium and potassium, one salt in water. Read by
/// models/pitzer_single_salt.hpp (the closed binary form). Each row holds within its own
/// temperature window; a salt may have one row per window.
///
/// Two sets:
/// - "may_2011", at 25 C: May, Rowland, Hefter & Koenigsberger (2011), the generic 25 C
///   characterization of binary electrolyte solutions; the values were read in the pyEQL
///   database copy (src/pyEQL/database/pyeql_db.json, commit f02cb4e). They hold at 25 C and
///   1 bar only (no temperature functions are published with them); used within 0.5 K of
///   298.15 K.
/// - "colligate_ice_line_fit", on the ice line: no Pitzer parameters near 0 C were found
///   published for these salts (none at all for trisodium citrate), so beta0, beta1 and
///   C-phi were fitted by colligate's own fitter (fit/single_salt_fitter.hpp,
///   tools/fit_single_salt_ice_line.py) to every other CRC Handbook freezing-point row of
///   the salt (key "colligate_fit_crc_pitzer"; potassium acetate, which the CRC table lacks,
///   to Melinder's 2010 curve, key "colligate_fit_melinder_pitzer"), constant over the fitted
///   rows' freezing temperatures; the other rows are held out and checked. Used from the
///   lowest fitted freezing point to 273.15 K.
/// Both sets take alpha1 = 2 and b = 1.2 (no 2:2 salt is in the table); `max_molality` is
/// the top of the data each fit used.

#include <cstdio>
#include <string>
#include <vector>

#include "colligate/core/errors.hpp"

namespace colligate::data {

/// One salt M_(nu_cation) X_(nu_anion) in water, Pitzer's binary parameters at 25 C.
struct single_salt_parameters {
  std::string id;           ///< lower_snake id ("potassium_acetate")
  std::string name;         ///< display name
  std::string formula;      ///< formula as usually written ("CH3COOK")
  int cation_charge = 1;    ///< z_M
  int anion_charge = -1;    ///< z_X
  int cation_count = 1;     ///< nu_M per formula unit
  int anion_count = 1;      ///< nu_X per formula unit
  double molar_mass = 0.0;  ///< kg/mol of the anhydrous salt
  double beta0 = 0.0;
  double beta1 = 0.0;
  double beta2 = 0.0;
  double cphi = 0.0;
  double alpha1 = 2.0;
  double alpha2 = 12.0;
  double max_molality = 0.0;  ///< mol/kg, top of the data behind the fit
  std::string source;         ///< citation key (data/citation.hpp)
  std::string parameter_set = "may_2011";  ///< "may_2011" or "colligate_ice_line_fit"
  /// K, window in which the row is used; for an ice-line row, the lowest fitted freezing
  /// point or the row's own at max_molality where that is lower, rounded down to 0.1 mK
  /// (tools/fit_single_salt_ice_line.py), so the row never warns on its own data
  double min_temperature = 297.65;
  double max_temperature = 298.65;  ///< K
};

/// A row holding only a salt's charges and ions per formula unit (parameters zero): the
/// shape a fit or a caller's own parameters start from.
inline single_salt_parameters single_salt_shape(int cation_charge, int anion_charge,
                                                int cation_count, int anion_count) {
  single_salt_parameters p;
  p.cation_charge = cation_charge;
  p.anion_charge = anion_charge;
  p.cation_count = cation_count;
  p.anion_count = anion_count;
  return p;
}

/// The 25 C set's id, its temperature and the half-width of the window in which it is used.
inline constexpr const char* single_salt_parameter_set_id = "may_2011";
inline constexpr double single_salt_temperature = 298.15;
/// The parameters carry no temperature functions: they are used within 0.5 K of 25 C only
/// (a caller's 25 C written as 298 K or 298.15 K), and a temperature outside is an error.
inline constexpr double single_salt_temperature_window = 0.5;
/// The ice-line set's id (rows fitted to freezing points, constant over their window).
inline constexpr const char* single_salt_ice_line_set_id = "colligate_ice_line_fit";

/// The built-in rows (May et al. 2011, read in the pyEQL copy; molar masses from the
/// standard atomic weights).
inline const std::vector<single_salt_parameters>& single_salt_table() {
  static const std::vector<single_salt_parameters> table = {
      {"sodium_acetate", "sodium acetate", "CH3COONa", 1, -1, 1, 1, 0.082034, 0.1382, 0.3317, 0.0,
       -0.00496, 2.0, 12.0, 4.5, "may_2011"},
      {"potassium_acetate", "potassium acetate", "CH3COOK", 1, -1, 1, 1, 0.098142, 0.1556, 0.3328,
       0.0, -0.00533, 2.0, 12.0, 3.5, "may_2011"},
      {"monosodium_phosphate", "monosodium phosphate", "NaH2PO4", 1, -1, 1, 1, 0.119976, -0.05135,
       0.05496, 0.0, 0.007441, 2.0, 12.0, 6.5, "may_2011"},
      {"monopotassium_phosphate", "monopotassium phosphate", "KH2PO4", 1, -1, 1, 1, 0.136084,
       -0.1231, 0.09124, 0.0, 0.02453, 2.0, 12.0, 1.8, "may_2011"},
      {"disodium_phosphate", "disodium phosphate", "Na2HPO4", 1, -2, 2, 1, 0.141958, -0.02266,
       1.249, 0.0, 0.00752, 2.0, 12.0, 2.0, "may_2011"},
      {"dipotassium_phosphate", "dipotassium phosphate", "K2HPO4", 1, -2, 2, 1, 0.174174, 0.043,
       1.147, 0.0, 0.001486, 2.0, 12.0, 7.0, "may_2011"},
      {"trisodium_phosphate", "trisodium phosphate", "Na3PO4", 1, -3, 3, 1, 0.163940, 0.139, 5.419,
       0.0, -0.04454, 2.0, 12.0, 0.8, "may_2011"},
      {"tripotassium_phosphate", "tripotassium phosphate", "K3PO4", 1, -3, 3, 1, 0.212264, 0.3422,
       5.452, 0.0, -0.09154, 2.0, 12.0, 0.7, "may_2011"},
      {"sodium_carbonate", "sodium carbonate", "Na2CO3", 1, -2, 2, 1, 0.105988, 0.04625, 1.264, 0.0,
       0.002943, 2.0, 12.0, 3.115, "may_2011"},
      {"potassium_carbonate", "potassium carbonate", "K2CO3", 1, -2, 2, 1, 0.138204, 0.1305, 1.606,
       0.0, 0.00024, 2.0, 12.0, 8.102, "may_2011"},
      {"sodium_bicarbonate", "sodium bicarbonate", "NaHCO3", 1, -1, 1, 1, 0.084006, -0.05876, 0.5535,
       0.0, 0.008285, 2.0, 12.0, 1.3, "may_2011"},
      {"potassium_bicarbonate", "potassium bicarbonate", "KHCO3", 1, -1, 1, 1, 0.100114, -0.01558,
       0.07556, 0.0, -0.00469, 2.0, 12.0, 1.0, "may_2011"},
      // Ice line, fitted by colligate (tools/fit_single_salt_ice_line.py): beta0 and beta1 to
      // the CRC Handbook freezing points marked used_in_fit in crc_freezing_points.csv, C-phi
      // held at 0 (its 95 % interval spans zero with data to about 1 mol/kg); window from the
      // lowest fitted freezing point to 273.15 K, molality to the highest fitted row. Kept
      // where the data determine both parameters (95 % intervals exclude zero, |r| < 0.99);
      // the tool prints the salts it does not keep (KH2PO4, NaHCO3, Na2CO3) and why.
      // sodium acetate: 5 rows 0.061-1.06 mol/kg; beta0 0.1269 +/- 0.0032, beta1 0.360 +/- 0.022
      // (May et al.'s 25 C values: 0.1382, 0.3317).
      {"sodium_acetate", "sodium acetate", "CH3COONa", 1, -1, 1, 1, 0.082034, 0.126867222,
       0.359922399, 0.0, 0.0, 2.0, 12.0, 1.06, "colligate_fit_crc_pitzer", "colligate_ice_line_fit",
       269.17, 273.15},
      // potassium acetate (not in the CRC table): Melinder's (2010) curve as CoolProp carries it
      // (INCOMP::MKA; tests/reference/melinder_freezing_curves.csv), 11 rows 5, 7, ..., 25 wt%,
      // 0.536-3.396 mol/kg; beta0 0.1281 +/- 0.0024, beta1 0.702 +/- 0.062, r = -0.89; worst
      // deviation 0.10 K (the curve's own ripple about a two-constant Pitzer line). May et
      // al.'s 25 C values: 0.1556, 0.3328.
      {"potassium_acetate", "potassium acetate", "CH3COOK", 1, -1, 1, 1, 0.098142, 0.128072195,
       0.702098568, 0.0, 0.0, 2.0, 12.0, 3.396439173170848, "colligate_fit_melinder_pitzer",
       "colligate_ice_line_fit", 256.9223, 273.15},
      // potassium carbonate (E501): 6 rows 0.036-0.804 mol/kg (0.5-10 wt%); beta0 0.1394 +/-
      // 0.0038, beta1 1.131 +/- 0.066, r = -0.95 (May et al.'s 25 C values: 0.1305, 1.606).
      // Beyond 10 wt% the CRC rows are not taken, as for its Norrish record.
      {"potassium_carbonate", "potassium carbonate", "K2CO3", 1, -2, 2, 1, 0.138204,
       0.139427207, 1.13110933, 0.0, 0.0, 2.0, 12.0, 0.804, "colligate_fit_crc_pitzer",
       "colligate_ice_line_fit", 269.5767, 273.15},
      // trisodium citrate (anhydrous Na3C6H5O7, as the CRC molality column): 8 rows
      // 0.039-0.969 mol/kg; beta0 0.1765 +/- 0.0036, beta1 4.29 +/- 0.24. No Pitzer
      // parameters of it were found published.
      {"trisodium_citrate", "trisodium citrate", "Na3C6H5O7", 1, -3, 3, 1, 0.2580683, 0.176470501,
       4.29267699, 0.0, 0.0, 2.0, 12.0, 0.969, "colligate_fit_crc_pitzer", "colligate_ice_line_fit",
       268.7467, 273.15},
      // NaH2PO4: 10 rows 0.042-0.875 mol/kg; beta0 -0.160 +/- 0.012, beta1 0.474 +/- 0.066.
      {"monosodium_phosphate", "monosodium phosphate", "NaH2PO4", 1, -1, 1, 1, 0.119976,
       -0.160413948, 0.473713956, 0.0, 0.0, 2.0, 12.0, 0.875, "colligate_fit_crc_pitzer",
       "colligate_ice_line_fit", 270.68, 273.15},
      // K2HPO4: 8 rows 0.029-0.466 mol/kg; beta0 0.074 +/- 0.016, beta1 0.41 +/- 0.14.
      {"dipotassium_phosphate", "dipotassium phosphate", "K2HPO4", 1, -2, 2, 1, 0.174174,
       0.0737923324, 0.408729300, 0.0, 0.0, 2.0, 12.0, 0.466, "colligate_fit_crc_pitzer",
       "colligate_ice_line_fit", 271.3239, 273.15},
      // KHCO3: 7 rows 0.05-1.626 mol/kg; beta0 -0.0414 +/- 0.0016, beta1 -0.108 +/- 0.017.
      {"potassium_bicarbonate", "potassium bicarbonate", "KHCO3", 1, -1, 1, 1, 0.100114,
       -0.0414187618, -0.107866824, 0.0, 0.0, 2.0, 12.0, 1.626, "colligate_fit_crc_pitzer",
       "colligate_ice_line_fit", 268.7392, 273.15},
  };
  return table;
}

/// Whether a row is `salt` by id, display name or formula.
inline bool single_salt_is(const single_salt_parameters& r, const std::string& salt) {
  return r.id == salt || r.name == salt || r.formula == salt;
}

/// The first row of a salt by id, display name or formula; throws invalid_input listing
/// the salts the table has.
inline const single_salt_parameters& find_single_salt(const std::string& salt) {
  for (const auto& r : single_salt_table())
    if (single_salt_is(r, salt)) return r;
  std::string known;
  for (const auto& r : single_salt_table())
    if (known.find(r.id) == std::string::npos) known += (known.empty() ? "" : ", ") + r.id;
  throw invalid_input("single-salt Pitzer parameters: salt = '" + salt +
                      "' is not in the single-salt table; it has " + known);
}

/// The row of a salt whose temperature window holds T (K); throws invalid_input naming the
/// salt and the sets and windows it has when none does.
inline const single_salt_parameters& find_single_salt(const std::string& salt, double temperature) {
  const auto& first = find_single_salt(salt);
  std::string windows;
  for (const auto& r : single_salt_table()) {
    if (!single_salt_is(r, salt)) continue;
    if (temperature >= r.min_temperature && temperature <= r.max_temperature) return r;
    char buf[160];
    std::snprintf(buf, sizeof buf, "%s'%s' %.2f to %.2f K", windows.empty() ? "" : "; ",
                  r.parameter_set.c_str(), r.min_temperature, r.max_temperature);
    windows += buf;
  }
  char t[40];
  std::snprintf(t, sizeof t, "%.6g", temperature);
  throw invalid_input("single-salt Pitzer parameters: T = " + std::string(t) + " K for '" +
                      first.id + "' is outside every window its parameter sets hold (" + windows +
                      "; no temperature functions are published with them)");
}

}  // namespace colligate::data
