#pragma once
/// \file single_salt_pitzer.hpp
/// Pitzer parameters at 25 C of salts of food that the ion tables of the Pitzer model
/// (data/pitzer_parameters.hpp, six ions) do not hold: acetates, phosphates, carbonates
/// and bicarbonates of sodium and potassium, one salt in water. Read by
/// models/pitzer_single_salt.hpp (the closed binary form).
///
/// Source: May, Rowland, Hefter & Koenigsberger (2011), the generic 25 C characterization of
/// binary electrolyte solutions (key "may_2011"); the values were read in the pyEQL
/// database copy (src/pyEQL/database/pyeql_db.json, commit f02cb4e). They hold at 25 C and
/// 1 bar only (no temperature functions are published with them), with the usual
/// alpha1 = 2 and b = 1.2 (no 2:2 salt is in the table); `max_molality` is the top of the
/// data each fit used, as that copy states it.

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
  std::string source;
};

/// The set's id, its temperature and the half-width of the window in which it is used.
inline constexpr const char* single_salt_parameter_set_id = "may_2011";
inline constexpr double single_salt_temperature = 298.15;
/// The parameters carry no temperature functions: they are used within 0.5 K of 25 C only
/// (a caller's 25 C written as 298 K or 298.15 K), and a temperature outside is an error.
inline constexpr double single_salt_temperature_window = 0.5;

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
  };
  return table;
}

/// The row of a salt by id, display name or formula; throws invalid_input listing the
/// salts the table has.
inline const single_salt_parameters& find_single_salt(const std::string& salt) {
  for (const auto& r : single_salt_table())
    if (r.id == salt || r.name == salt || r.formula == salt) return r;
  std::string known;
  for (const auto& r : single_salt_table()) known += (known.empty() ? "" : ", ") + r.id;
  throw invalid_input("single-salt Pitzer parameters: salt = '" + salt + "' is not in the set '" +
                      std::string(single_salt_parameter_set_id) + "'; it has " + known);
}

}  // namespace colligate::data
