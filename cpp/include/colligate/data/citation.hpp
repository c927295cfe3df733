#pragma once
/// \file citation.hpp
/// The central citation table. Every constant, parameter and check value in colligate
/// carries a `source` key that resolves here (authors, year, title, where, identifier).
/// Add a source by appending one row to `citations()`.

#include <string>
#include <vector>

#include "colligate/core/errors.hpp"

namespace colligate::data {

struct citation {
  std::string key;
  std::string authors;
  int year;
  std::string title;
  std::string container;   ///< journal (volume, pages) or publisher
  std::string identifier;  ///< DOI or ISBN
  std::string detail;      ///< table, equation or page used
};

/// All sources cited by the built-in data. Immutable after first use.
inline const std::vector<citation>& citations() {
  static const std::vector<citation> table = {
      {"codata_2018", "Tiesinga, E.; Mohr, P. J.; Newell, D. B.; Taylor, B. N.", 2021,
       "CODATA recommended values of the fundamental physical constants: 2018",
       "Rev. Mod. Phys. 93, 025010", "doi:10.1103/RevModPhys.93.025010", "molar gas constant"},
      {"iapws95_2002", "Wagner, W.; Pruss, A.", 2002,
       "The IAPWS formulation 1995 for the thermodynamic properties of ordinary water "
       "substance for general and scientific use",
       "J. Phys. Chem. Ref. Data 31, 387-535", "doi:10.1063/1.1461829",
       "molar mass (Table 2), heat capacity of liquid water near 0 C"},
      {"feistel_wagner_2006", "Feistel, R.; Wagner, W.", 2006,
       "A new equation of state for H2O ice Ih", "J. Phys. Chem. Ref. Data 35, 1021-1047",
       "doi:10.1063/1.2183324", "IAPWS R10-06; heat capacity and molar volume of ice Ih"},
      {"murphy_koop_2005", "Murphy, D. M.; Koop, T.", 2005,
       "Review of the vapour pressures of ice and supercooled water for atmospheric "
       "applications",
       "Q. J. R. Meteorol. Soc. 131, 1539-1565", "doi:10.1256/qj.04.94",
       "eq. 7 (ice) and eq. 10 (liquid, including supercooled)"},
      {"iupac_atomic_weights_2013", "Meija, J. et al.", 2016,
       "Atomic weights of the elements 2013 (IUPAC Technical Report)",
       "Pure Appl. Chem. 88, 265-291", "doi:10.1515/pac-2015-0305",
       "molar masses computed from standard atomic weights"},
      {"norrish_1966", "Norrish, R. S.", 1966,
       "An equation for the activity coefficients and equilibrium relative humidities of "
       "water in confectionery syrups",
       "J. Food Technol. 1, 25-39", "doi:10.1111/j.1365-2621.1966.tb01027.x",
       "ln a_w = ln x_w + K x_s^2"},
      {"chirife_1980", "Chirife, J.; Ferro Fontan, C.; Benmergui, E. A.", 1980,
       "The prediction of water activity in aqueous solutions in connection with "
       "intermediate moisture foods. IV. a_w prediction in aqueous non electrolyte solutions",
       "J. Food Technol. 15, 59-70", "doi:10.1111/j.1365-2621.1980.tb00920.x",
       "Norrish constants (Table 1) and the multi-solute extension"},
      {"crc_concentrative",
       "Rumble, J. R. (ed.); table compiled by Wolf, A. V.; Brown, M. G.; Prentiss, P. G.", 2021,
       "Concentrative properties of aqueous solutions: density, refractive index, "
       "freezing point depression, and viscosity",
       "CRC Handbook of Chemistry and Physics, 102nd ed., CRC Press", "ISBN 9780367712600",
       "freezing-point depression vs mass percent, 20 C densities; transcribed in "
       "tests/reference/crc_freezing_points.csv"},
      {"makinen_2010", "Makinen, K. K.", 2010,
       "Sugar alcohols, caries incidence, and remineralization of caries lesions: a "
       "literature review",
       "Int. J. Dent. 2010, article 981072", "doi:10.1155/2010/981072",
       "Table 3, Norrish constant K of alditols at 25 C"},
      {"colligate_fit_crc", "colligate developers", 2026,
       "Constants fitted by colligate to the CRC Handbook freezing-point depressions",
       "colligate source tree: tools/fit_crc_norrish.py and tests/reference/crc_freezing_points.csv",
       "", "least-squares fit of Norrish constants to the rows named beside each constant"},
      {"melinder_2010", "Melinder, A.", 2010,
       "Properties of secondary working fluids for indirect systems",
       "International Institute of Refrigeration, Paris", "ISBN 978-2-913149-76-3 (from memory)",
       "freezing curve of propylene glycol-water, as fitted in CoolProp's INCOMP::MPG"},
      {"colligate_fit_melinder", "colligate developers", 2026,
       "Norrish constants of propylene glycol fitted by colligate to the Melinder (2010) "
       "freezing curve (CoolProp 8.0 INCOMP::MPG T_freeze, 5-40 wt%)",
       "colligate source tree: tools/fit_crc_norrish.py --propylene-glycol", "",
       "least-squares fit of K and K3"},
      {"colligate_fit_mk2005", "colligate developers", 2026,
       "Heat-capacity difference of supercooled water and ice fitted by colligate to the "
       "temperature dependence of the Murphy & Koop (2005) vapour-pressure ratio, 233-273 K",
       "colligate source tree, cpp/include/colligate/water/ice.hpp", "", "see ice.hpp"},
  };
  return table;
}

/// Finds a citation by key; throws invalid_input naming the key if it does not exist.
inline const citation& find_citation(const std::string& key) {
  for (const auto& c : citations())
    if (c.key == key) return c;
  throw invalid_input("find_citation: source key '" + key + "' is not in the citation table");
}

}  // namespace colligate::data
