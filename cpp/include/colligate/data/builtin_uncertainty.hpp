#pragma once
/// \file builtin_uncertainty.hpp
/// Standard uncertainties of the built-in solutes' constants, where a source gives them
/// (data/constant_uncertainty.hpp for the vocabulary).
///
/// What the sources give:
/// - Constants colligate fitted itself to a cited table (source key colligate_fit_crc:
///   tools/fit_crc_norrish.py, least squares on the CRC Handbook rows marked used_in_fit):
///   the fit's covariance s^2 (J^T J)^-1, s^2 = residual sum of squares / (n - k), and its
///   n - k degrees of freedom, printed by `python3 tools/fit_crc_norrish.py --covariance`.
///   It covers the scatter of the CRC rows about the model (their printed 0.01 K and the
///   model's misfit), not an error of the CRC table itself.
/// - Everything else is "not stated": the Norrish constants read from Chirife et al. (1980)
///   and Makinen (2010) (sucrose, glucose, fructose, lactose via sucrose, sorbitol, mannitol,
///   xylitol, erythritol) and the Pitzer parameters of the built-in sets are printed without
///   standard uncertainties of the constants (the Pitzer papers give the standard deviation
///   of the fitted osmotic coefficients, not a parameter covariance); ethanol's constants
///   come from a minimax fit (no covariance); propylene glycol's and potassium acetate's from
///   fits to correlations (Melinder 2010 via CoolProp), whose own uncertainty is not stated
///   (the residuals about a smooth curve are misfit, not scatter); the effective milk
///   salts are a convention. These enter a propagation as exact and are listed as such.
///
/// An entry applies only to the record as built in: a copy whose constants differ (a user's
/// own solute based on a built-in one) does not inherit it.

#include <array>
#include <cmath>
#include <cstdio>
#include <string>
#include <vector>

#include "colligate/data/constant_uncertainty.hpp"
#include "colligate/data/solute_record.hpp"

namespace colligate::data {

namespace detail {

struct builtin_uncertainty_row {
  const char* id;
  std::vector<std::string> names;
  std::vector<double> values;      ///< the constants the covariance belongs to
  std::vector<double> covariance;  ///< row-major
  int degrees_of_freedom;
  const char* source;
};

inline const std::vector<builtin_uncertainty_row>& builtin_uncertainty_rows() {
  // python3 tools/fit_crc_norrish.py --covariance (values as builtin_solutes.inc holds them)
  static const std::vector<builtin_uncertainty_row> rows = {
      {"maltose", {"norrish_k"}, {7.06744}, {0.0103729}, 16, "colligate_fit_crc"},
      {"glycerol", {"norrish_k", "norrish_k3"}, {2.68909, -4.7611},
       {0.00149645, -0.0138314, -0.0138314, 0.131919}, 8, "colligate_fit_crc"},
      {"citric_acid", {"norrish_k"}, {1.75974}, {0.0605526}, 10, "colligate_fit_crc"},
      {"lactic_acid", {"norrish_k"}, {-2.942}, {0.142927}, 7, "colligate_fit_crc"},
      {"acetic_acid", {"norrish_k"}, {-1.22098}, {6.27766e-05}, 14, "colligate_fit_crc"},
      // the food salts and phosphoric acid (effective Norrish solutes; K and K3 strongly
      // correlated, r -0.97 to -0.99: propagate with the covariance, never the u alone)
      {"sodium_acetate", {"norrish_k", "norrish_k3"}, {-13.2471, 908.675},
       {7.22998, -417.355, -417.355, 24683.8}, 3, "colligate_fit_crc"},
      {"trisodium_citrate", {"norrish_k", "norrish_k3"}, {-288.328, 12098.5},
       {695.358, -45931.2, -45931.2, 3.13074e+06}, 6, "colligate_fit_crc"},
      {"monosodium_phosphate", {"norrish_k", "norrish_k3"}, {-45.026, 971.655},
       {9.07513, -661.282, -661.282, 49559.2}, 8, "colligate_fit_crc"},
      {"monopotassium_phosphate", {"norrish_k", "norrish_k3"}, {-61.0641, 1873.7},
       {16.4217, -1352.31, -1352.31, 114539}, 8, "colligate_fit_crc"},
      {"dipotassium_phosphate", {"norrish_k", "norrish_k3"}, {-265.577, 19734.8},
       {624.314, -84069.6, -84069.6, 1.16353e+07}, 6, "colligate_fit_crc"},
      {"sodium_bicarbonate", {"norrish_k", "norrish_k3"}, {-59.5616, 2440.29},
       {31.1737, -2774.34, -2774.34, 253439}, 4, "colligate_fit_crc"},
      {"potassium_bicarbonate", {"norrish_k", "norrish_k3"}, {-38.4666, 728.404},
       {6.15659, -237.944, -237.944, 9528.48}, 5, "colligate_fit_crc"},
      {"sodium_carbonate", {"norrish_k", "norrish_k3"}, {-263.739, 15343.6},
       {839.233, -83197, -83197, 8.4251e+06}, 2, "colligate_fit_crc"},
      {"potassium_carbonate", {"norrish_k", "norrish_k3"}, {-130.279, 6513.13},
       {232.492, -18033.4, -18033.4, 1.43543e+06}, 4, "colligate_fit_crc"},
      {"phosphoric_acid", {"norrish_k"}, {7.90033},
       {0.0300643}, 10, "colligate_fit_crc"},
  };
  return rows;
}

inline double builtin_constant(const solute_record& r, const std::string& name) {
  if (name == "norrish_k") return r.norrish.k;
  if (name == "norrish_k3") return r.norrish.k3;
  return std::nan("");
}

}  // namespace detail

/// The stated uncertainty of a record's constants: its own (a fitted solute), else the
/// built-in entry above when the record holds exactly the built-in constants, else empty
/// ("not stated").
inline constant_uncertainty stated_uncertainty(const solute_record& r) {
  if (r.uncertainty.stated()) return r.uncertainty;
  for (const auto& row : detail::builtin_uncertainty_rows()) {
    if (r.id != row.id) continue;
    for (std::size_t k = 0; k < row.names.size(); ++k)
      if (!(detail::builtin_constant(r, row.names[k]) == row.values[k])) return {};
    constant_uncertainty u;
    u.names = row.names;
    u.covariance = row.covariance;
    u.degrees_of_freedom = row.degrees_of_freedom;
    u.source = row.source;
    return u;
  }
  return {};
}

/// One line for tables: "u(norrish_k) = 0.102 (colligate_fit_crc, 16 degrees of freedom)"
/// per constant, or "not stated".
inline std::string uncertainty_statement(const solute_record& r) {
  const auto u = stated_uncertainty(r);
  if (!u.stated()) return "not stated";
  std::string out;
  for (std::size_t k = 0; k < u.size(); ++k) {
    char buf[64];
    std::snprintf(buf, sizeof buf, "%.3g", std::sqrt(u.at(k, k)));
    out += (k ? "; u(" : "u(") + u.names[k] + ") = " + buf;
  }
  return out + " (" + u.source + ", " + std::to_string(u.degrees_of_freedom) + " degrees of freedom)";
}

}  // namespace colligate::data
