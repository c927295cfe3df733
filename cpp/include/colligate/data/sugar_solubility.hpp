#pragma once
/// \file sugar_solubility.hpp
/// Solubility of lactose in water against temperature, for the sandiness indicator of
/// dairy frozen desserts (lactose crystallising from the unfrozen phase). SI: K and kg of
/// anhydrous lactose per kg of water. Every row names its source key, which resolves in
/// citation.hpp.

#include <cmath>
#include <string>
#include <vector>

#include "colligate/core/constants.hpp"
#include "colligate/core/errors.hpp"

namespace colligate::data {

/// One point of a solubility curve.
struct solubility_point {
  double temperature;  ///< K
  double solubility;   ///< kg solute per kg water
  std::string source;  ///< citation key
  std::string note;    ///< the value as printed in the source
};

/// Final solubility of lactose in water: Hudson's values as tabulated in Lowe,
/// Experimental Cookery, table "Solubility of lactose in water (Hudson)" (read in a public
/// copy; Hudson's paper itself not read). Printed as g per 100 g water at 0, 15, 25 and
/// 39 degC.
inline const std::vector<solubility_point>& lactose_solubility_table() {
  static const std::vector<solubility_point> table = {
      {constants::ice_point + 0.0, 0.119, "lowe_experimental_cookery", "0 C: 11.9 g per 100 g water (Hudson)"},
      {constants::ice_point + 15.0, 0.169, "lowe_experimental_cookery", "15 C: 16.9 g per 100 g water (Hudson)"},
      {constants::ice_point + 25.0, 0.216, "lowe_experimental_cookery", "25 C: 21.6 g per 100 g water (Hudson)"},
      {constants::ice_point + 39.0, 0.315, "lowe_experimental_cookery", "39 C: 31.5 g per 100 g water (Hudson)"},
  };
  return table;
}

/// Solubility of lactose in water at `temperature` (K), kg per kg water: linear
/// interpolation in lactose_solubility_table(). Below its first point the first value is
/// returned (an upper bound: solubility falls with temperature), above its last point the
/// last value. Throws invalid_input for a temperature that is not finite and positive.
inline double lactose_solubility(double temperature) {
  if (!(std::isfinite(temperature) && temperature > 0.0))
    throw invalid_input("lactose_solubility: temperature = " + std::to_string(temperature) +
                        " K must be finite and > 0 K");
  const auto& pts = lactose_solubility_table();
  if (temperature <= pts.front().temperature) return pts.front().solubility;
  for (std::size_t i = 1; i < pts.size(); ++i) {
    if (temperature <= pts[i].temperature) {
      const auto& a = pts[i - 1];
      const auto& b = pts[i];
      return a.solubility + (b.solubility - a.solubility) * (temperature - a.temperature) /
                                (b.temperature - a.temperature);
    }
  }
  return pts.back().solubility;
}

/// One solid phase's solubility curve, S in kg anhydrous solute per kg water:
///
///     ln S = a + b / T + c ln T        (T in K; van't Hoff with a constant Delta Cp term)
///
/// fitted by tools/fit_sugar_solubility.py to the rows of tests/reference/sugar_solubility.csv
/// marked used_in_fit = yes (the other rows are checks). [t_min, t_max] is the range of the
/// data; outside it a value is an extrapolation.
struct solubility_branch {
  std::string solid_phase;
  double a = 0.0, b = 0.0, c = 0.0;
  double t_min = 0.0, t_max = 0.0;  ///< K
  std::string source;               ///< citation key of the data fitted
  std::string note;

  double kg_per_kg_water(double temperature) const {
    return std::exp(a + b / temperature + c * std::log(temperature));
  }
};

/// The solubility curves of one sugar: one branch per solid phase. At a temperature the
/// stable phase is the one with the lowest solubility (dextrose: the monohydrate below
/// about 50 degC, the anhydrous form above).
struct sugar_solubility_record {
  std::string solute_id;
  std::vector<solubility_branch> branches;
};

/// Built-in curves of sucrose, lactose (final solubility, alpha/beta at equilibrium) and
/// glucose (dextrose). Constants from tools/fit_sugar_solubility.py.
inline const std::vector<sugar_solubility_record>& sugar_solubility_curves() {
  static const std::vector<sugar_solubility_record> table = {
      {"sucrose",
       {{"sucrose", -106.0098362, 4205.232972, 16.26026712, constants::ice_point, constants::ice_point + 100.0,
         "antokolskaya_1964",
         "fit to the 5, 15, ..., 95 degC rows (Antokolskaya et al. 1964, as tabulated by Mohos 2010, "
         "table A2.2); the 0, 10, ..., 100 degC rows held out, within 0.81 %"}}},
      {"lactose",
       {{"alpha-lactose monohydrate", -178.156649, 5903.424394, 27.52562064, constants::ice_point,
         constants::ice_point + 89.0, "hudson_1908",
         "final solubility; fit to Hudson's 15, 39, 64, 74 and 89 degC rows (as tabulated by Lowe); "
         "0, 25 and 49 degC held out, within 0.88 %"}}},
      {"glucose",
       {{"alpha-glucose monohydrate", -318.6806997, 11884.47158, 48.93990714, constants::ice_point + 0.5,
         constants::ice_point + 50.0, "jackson_silsbee_1922",
         "fit to the 0.5, 25, 40 and 50 degC rows, values from memory (paper not read); 15 and 30 degC "
         "held out, -1.2 % and -0.4 %"},
        {"anhydrous alpha-glucose", 8.413483502, -2431.098216, 0.0, constants::ice_point + 50.0,
         constants::ice_point + 90.0, "jackson_silsbee_1922",
         "fit to the 50 and 90 degC rows, values from memory (paper not read); 70 degC held out, +1.4 %"}}},
  };
  return table;
}

/// The curves of `solute_id`, or nullptr.
inline const sugar_solubility_record* find_sugar_solubility(const std::string& solute_id) {
  for (const auto& r : sugar_solubility_curves())
    if (r.solute_id == solute_id) return &r;
  return nullptr;
}

/// Equilibrium ratio beta/alpha of lactose in solution: K = 1.64 - 0.0027 t (t in degC;
/// Hudson 1904, value from memory); about 1.6 at 20 degC as Fox & McSweeney (1998) state.
inline double lactose_mutarotation_ratio(double temperature) {
  return 1.64 - 0.0027 * (temperature - constants::ice_point);
}

}  // namespace colligate::data
