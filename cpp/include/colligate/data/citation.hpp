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
       "freezing-point depression vs mass percent, 20 C densities; copied in "
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
      {"colligate_fit_crc_pitzer", "colligate developers", 2026,
       "Single-salt Pitzer parameters fitted by colligate to the CRC Handbook freezing-point "
       "depressions",
       "colligate source tree: tools/fit_single_salt_ice_line.py (fit/single_salt_fitter.hpp) and "
       "tests/reference/crc_freezing_points.csv",
       "", "least-squares fit of beta0 and beta1 (C-phi = 0) to every other CRC row of the salt, "
       "constant over the fitted freezing temperatures; the other rows held out"},
      {"colligate_fit_melinder_pitzer", "colligate developers", 2026,
       "Single-salt Pitzer parameters fitted by colligate to Melinder's (2010) freezing curves",
       "colligate source tree: tools/fit_single_salt_ice_line.py (fit/single_salt_fitter.hpp) and "
       "tests/reference/melinder_freezing_curves.csv (CoolProp INCOMP::MKA)",
       "", "least-squares fit of beta0 and beta1 (C-phi = 0) to the 5, 7, ..., 25 wt% rows of "
       "potassium acetate, constant over the fitted freezing temperatures; the rows between "
       "held out (on the same curve, not independent)"},
      {"melinder_2010", "Melinder, A.", 2010,
       "Properties of secondary working fluids for indirect systems",
       "International Institute of Refrigeration, Paris", "ISBN 978-2-913149-76-3 (from memory)",
       "freezing curves of propylene glycol-, NaCl- and CaCl2-water, as fitted in CoolProp's "
       "INCOMP::MPG, INCOMP::MNA and INCOMP::MCA"},
      {"colligate_fit_melinder", "colligate developers", 2026,
       "Norrish constants fitted by colligate to the Melinder (2010) freezing curves "
       "(CoolProp 8.0 T_freeze: INCOMP::MPG propylene glycol 5-40 wt%, INCOMP::MKA potassium "
       "acetate 5-25 wt%)",
       "colligate source tree: tools/fit_crc_norrish.py --propylene-glycol; "
       "tools/fit_crc_norrish.py potassium_acetate (tests/reference/melinder_freezing_curves.csv)",
       "", "least-squares fit of K and K3 (potassium acetate: to the 5, 7, ..., 25 wt% rows, the "
       "rows between held out, on the same curve)"},
      {"spencer_1990", "Spencer, R. J.; Moller, N.; Weare, J. H.", 1990,
       "The prediction of mineral solubilities in natural waters: a chemical equilibrium model "
       "for the Na-K-Ca-Mg-Cl-SO4-H2O system at temperatures below 25 C",
       "Geochim. Cosmochim. Acta 54, 575-590", "doi:10.1016/0016-7037(90)90354-N",
       "Pitzer parameters and solubility products below 25 C (valid to about -54 C); "
       "coefficients read in the PHREEQC database frezchem.dat (toner_sletten_2013), the "
       "chloride rows cross-checked against the paper's eq. 2 coefficients as copied in "
       "pytzer (MgCl2) and pypitzer (NaCl, KCl, CaCl2); "
       "the A_phi(T) polynomial of the model, coefficients read in public copies"},
      {"colligate_default_fit", "colligate developers", 2026,
       "CaCl2 Pitzer parameters on the 25 C values of Harvie, Moller & Weare (1984) with "
       "Spencer et al.'s (1990) slopes and a curvature below 25 C fitted to the evaluated ice "
       "line of Melinder (2010); MgCl2 on Harvie et al.'s 25 C values with the 25 C slopes "
       "of Silvester & Pitzer as tabulated in Pitzer (1991) ch. 3 Table 13 (read in pytzer's "
       "copy, pytzer/tables.py) and a curvature that holds it near Spencer et al.'s below 0 C; "
       "K2SO4 and MgSO4 on Harvie et al.'s 25 C values with the same table's 25 C slopes (its "
       "third column is dC/dT, C = C-phi / (2 sqrt|z_M z_X|), checked against Silvester & "
       "Pitzer's Table II as copied in pytzer's bC_*_SP78 functions), the K2SO4 curvature held "
       "near Marion & Farren's (1999) row below 0 C and the MgSO4 curvature fitted to "
       "alternate CRC freezing points; "
       "solubility-product shifts of antarcticite and halite",
       "colligate source tree: tools/fit_default_set.py", "",
       "least-squares fit to Melinder's freezing curve as represented by CoolProp "
       "INCOMP::MCA (CaCl2 1-30 wt%) and INCOMP::MMG (MgCl2 1-21 wt%), with a stated penalty "
       "on the change from the old "
       "default's parameters at 220-273.15 K; 25 C values fixed. Halite's shift also fitted "
       "to alternate rows of the Salt Institute solubility table; MgSO4 curvature to the "
       "used_in_fit rows of the CRC magnesium sulfate freezing points (0.5-14 wt%)"},
      {"salt_institute_solubility", "Salt Institute", 2013,
       "Chemical and physical properties of pure sodium chloride: solubility of salt at "
       "various temperatures", "saltinstitute.org (salt-101/chemical-physical-properties)", "",
       "table of mass per cent NaCl in the saturated solution, -21.11 to 108.7 C; read in a "
       "public copy of the page (tuticorin-salt.blogspot.com, 2013)"},
      {"chemister_mgcl2_solubility", "chemister.ru database", 2026,
       "Properties of substance: magnesium chloride; solubility in water, g/100 g of water, "
       "0-200 C", "chemister.ru (Chemdatabase, substance id 642)", "",
       "compiled solubility table (its own references not read), read in a public copy of the "
       "page; saturated phase at 25 C MgCl2.6H2O (bischofite) as the page states"},
      {"colligate_icefit", "colligate developers", 2026,
       "Low-temperature curvature of the NaCl and CaCl2 Pitzer parameters of Spencer et al. "
       "(1990), fitted to the evaluated ice lines of Melinder (2010)",
       "colligate source tree: tools/fit_brine_ice_line.py", "",
       "least-squares fit to Melinder's freezing curves as represented by CoolProp "
       "INCOMP::MNA / INCOMP::MCA (NaCl 1-23 wt%, CaCl2 1-26 wt%); 25 C values and slopes "
       "kept"},
      {"marion_farren_1999", "Marion, G. M.; Farren, R. E.", 1999,
       "Mineral solubilities in the Na-K-Mg-Ca-Cl-SO4-H2O system: a re-evaluation of the sulfate "
       "chemistry in the Spencer-Moller-Weare model",
       "Geochim. Cosmochim. Acta 63, 1305-1318", "doi:10.1016/S0016-7037(99)00102-7",
       "sulfate Pitzer parameters and sulfate salt solubility products; read in frezchem.dat "
       "(toner_sletten_2013)"},
      {"toner_sletten_2013", "Toner, J. D.; Sletten, R. S.", 2013,
       "The formation of Ca-Cl enriched groundwaters in the Dry Valleys of Antarctica by cation "
       "exchange reactions: field measurements and modeling of reactive transport",
       "Geochim. Cosmochim. Acta 110, 84-105", "doi:10.1016/j.gca.2013.02.013",
       "PHREEQC database frezchem.dat: FREZCHEM (Spencer et al. 1990; Marion & Farren 1999; "
       "Marion 2001) refitted to PHREEQC's analytic temperature form; copied from a public "
       "PHREEQC source tree (database/frezchem.dat)"},
      {"clegg_rard_pitzer_1994", "Clegg, S. L.; Rard, J. A.; Pitzer, K. S.", 1994,
       "Thermodynamic properties of 0-6 mol kg-1 aqueous sulfuric acid from 273.15 to 328.15 K",
       "J. Chem. Soc. Faraday Trans. 90, 1875-1894", "doi:10.1039/FT9949001875",
       "Appendix II, eqs. AII1-AII2 and Table 11: Chebyshev series for A_phi, 234.15-373.15 K "
       "(coefficients read in a public copy, pytzer)"},
      {"pitzer_1975", "Pitzer, K. S.", 1975,
       "Thermodynamics of electrolytes. V. Effects of higher-order electrostatic terms",
       "J. Solution Chem. 4, 249-265", "doi:10.1007/BF00646562",
       "unsymmetrical mixing E-theta, eqs. 23-24 and the J function (eq. 47 used as a check)"},
      {"pitzer_1991", "Pitzer, K. S.", 1991, "Ion interaction approach: theory and data correlation",
       "in Activity Coefficients in Electrolyte Solutions, 2nd ed., CRC Press, 75-153",
       "ISBN 0-8493-5415-3 (from memory)",
       "osmotic and activity coefficient equations; Appendix B, eqs. B-21 to B-30 and Table B-1 "
       "(Harvie's Chebyshev approximation of J, read in a public copy, pytzer); "
       "A_phi = 0.3915 at 25 C"},
      // Weak acids of food (data/weak_acids.hpp).
      {"harned_ehlers_1933", "Harned, H. S.; Ehlers, R. W.", 1933,
       "The dissociation constant of acetic acid from 0 to 60 degrees centigrade",
       "J. Am. Chem. Soc. 55, 652-656", "doi:10.1021/ja01329a027 (from memory)",
       "log10 K = -1170.48/T + 3.1649 - 0.013399 T (function from memory; pKa 4.756 at 25 C)"},
      {"bates_pinching_1949", "Bates, R. G.; Pinching, G. D.", 1949,
       "Resolution of the dissociation constants of citric acid at 0 to 50 degrees, and "
       "determination of certain related thermodynamic functions",
       "J. Am. Chem. Soc. 71, 1274-1283", "doi:10.1021/ja01172a039 (from memory)",
       "pK1, pK2, pK3 from 0 to 50 C (3.128, 4.761, 6.396 at 25 C); used through the ln K(T) "
       "functions fitted to their constants as printed in the public abstract of a University "
       "of Miami study of citric acid in NaCl and KCl solutions at 25 C (J. Solution Chem.)"},
      {"crc_organic_acid_pka", "Rumble, J. R. (ed.)", 2021,
       "Dissociation constants of organic acids and bases",
       "CRC Handbook of Chemistry and Physics, 102nd ed., CRC Press", "ISBN 9780367712600",
       "pKa at 25 C of lactic acid (3.86) and malic acid (3.40, 5.20); values from memory"},
      {"harned_robinson_1940", "Harned, H. S.; Robinson, R. A.", 1940,
       "A note on the temperature variation of the ionization constants of weak electrolytes",
       "Trans. Faraday Soc. 36, 973-978", "doi:10.1039/TF9403600973 (from memory)",
       "pKw = 4470.99/T - 6.0875 + 0.01706 T (from memory; 13.995 at 25 C)"},
      {"harvie_1984", "Harvie, C. E.; Moller, N.; Weare, J. H.", 1984,
       "The prediction of mineral solubilities in natural waters: the "
       "Na-K-Mg-Ca-H-Cl-SO4-OH-HCO3-CO3-CO2-H2O system to high ionic strengths at 25 C",
       "Geochim. Cosmochim. Acta 48, 723-751", "doi:10.1016/0016-7037(84)90098-X",
       "Table 1 (binary parameters, read in the pytzer HMW84 copy) and Table 2 "
       "(theta, psi; values from memory)"},
      {"pitzer_mayorga_1973", "Pitzer, K. S.; Mayorga, G.", 1973,
       "Thermodynamics of electrolytes. II. Activity and osmotic coefficients for strong "
       "electrolytes with one or both ions univalent",
       "J. Phys. Chem. 77, 2300-2308", "doi:10.1021/j100638a009",
       "Table II, NaCl and KCl beta0, beta1, C-phi at 25 C (values from memory, equal to the "
       "Harvie et al. 1984 Table 1 values read in pytzer except NaCl beta1 0.2664 vs 0.2644)"},
      {"hamer_wu_1972", "Hamer, W. J.; Wu, Y.-C.", 1972,
       "Osmotic coefficients and mean activity coefficients of uni-univalent electrolytes in "
       "water at 25 C", "J. Phys. Chem. Ref. Data 1, 1047-1099", "doi:10.1063/1.3253108",
       "NaCl osmotic coefficients at 25 C (values from memory)"},
      {"greenspan_1977", "Greenspan, L.", 1977,
       "Humidity fixed points of binary saturated aqueous solutions",
       "J. Res. Natl. Bur. Stand. 81A, 89-96", "doi:10.6028/jres.081A.011",
       "Table 2: NaCl 75.29 %, KCl 84.34 % relative humidity at 25 C (values from memory)"},
      {"millero_2008", "Millero, F. J.; Feistel, R.; Wright, D. G.; McDougall, T. J.", 2008,
       "The composition of Standard Seawater and the definition of the Reference-Composition "
       "Salinity Scale", "Deep-Sea Res. I 55, 50-72", "doi:10.1016/j.dsr.2007.10.001",
       "Table 4, mole fractions of the reference composition (values from memory); "
       "mean molar mass of sea salt 31.4038218 g/mol"},
      {"ross_1975", "Ross, K. D.", 1975, "Estimation of water activity in intermediate moisture foods",
       "Food Technol. 29(3), 26-34", "", "product rule a_w = prod a_w,i"},
      {"stokes_robinson_1966", "Stokes, R. H.; Robinson, R. A.", 1966,
       "Interactions in aqueous nonelectrolyte solutions. I. Solute-solvent equilibria",
       "J. Phys. Chem. 70, 2126-2131", "doi:10.1021/j100879a010",
       "ZSR (Zdanovskii-Stokes-Robinson) mixing rule (from memory)"},
      {"archer_1992", "Archer, D. G.", 1992,
       "Thermodynamic properties of the NaCl + H2O system. II. Thermodynamic properties of "
       "NaCl(aq), NaCl.2H2O(cr), and phase equilibria",
       "J. Phys. Chem. Ref. Data 21, 793-829", "doi:10.1063/1.555915",
       "ice + NaCl.2H2O eutectic, -21.2 C near 23.3 wt% (from memory); NaCl(aq) model, "
       "eq. 36 and Table 2 (beta0, beta1, C0, C1; omega = 2.5), coefficients read in a public "
       "copy (pytzer, bC_Na_Cl_A92ii, with its typo corrections)"},
      {"colligate_fit_mk2005", "colligate developers", 2026,
       "Heat-capacity difference of supercooled water and ice fitted by colligate to the "
       "temperature dependence of the Murphy & Koop (2005) vapour-pressure ratio, 233-273 K",
       "colligate source tree, cpp/include/colligate/water/ice.hpp", "", "see ice.hpp"},
      {"nist_strd_nls", "National Institute of Standards and Technology", 1999,
       "Statistical Reference Datasets: nonlinear regression",
       "https://www.itl.nist.gov/div898/strd/nls/nls_main.shtml", "",
       "Misra1a, Thurber and MGH09: data, starting values, certified values and standard "
       "deviations; copied in tests/reference/nist_strd_*.csv"},
      {"robinson_stokes_1959", "Robinson, R. A.; Stokes, R. H.", 1959, "Electrolyte Solutions",
       "2nd ed., Butterworths, London", "",
       "Appendix 8.6, osmotic coefficients of sucrose at 25 C (values in "
       "tests/reference/sucrose_osmotic_coefficients_25c.csv are from memory)"},
      {"choi_okos_1986", "Choi, Y.; Okos, M. R.", 1986,
       "Effects of temperature and composition on the thermal properties of foods",
       "in Le Maguer, M.; Jelen, P. (eds.), Food Engineering and Process Applications, vol. 1, "
       "Elsevier Applied Science, 93-101", "ISBN 1-85166-011-2 (from memory)",
       "component specific-heat polynomials, as tabulated in ASHRAE Refrigeration (2006) "
       "ch. 9 Table 1 (coefficients from memory; water above 0 C also in Singh & Heldman "
       "Table A.2.9)"},
      {"ashrae_2006_refrigeration", "ASHRAE", 2006, "Thermal properties of foods",
       "ASHRAE Handbook - Refrigeration (SI), chapter 9, ASHRAE, Atlanta", "ISBN 1-931862-86-9 (from memory)",
       "Table 3: composition, initial freezing point, specific heat above and below "
       "freezing, latent heat; rows in tests/reference/ashrae_food_properties.csv"},
      {"chen_1985", "Chen, C. S.", 1985,
       "Thermodynamic analysis of the freezing and thawing of foods: enthalpy and apparent "
       "specific heat", "J. Food Sci. 50, 1158-1162", "doi:10.1111/j.1365-2621.1985.tb13034.x (from memory)",
       "frozen-food specific heat 1.55 + 1.26 x_s + x_s R T0^2 / (M_s t^2) (kJ/(kg K))"},
      {"schwartzberg_1976", "Schwartzberg, H. G.", 1976,
       "Effective heat capacities for the freezing and thawing of food",
       "J. Food Sci. 41, 152-156", "doi:10.1111/j.1365-2621.1976.tb01123.x (from memory)",
       "unfreezable (bound) water about 0.4 kg per kg protein, as presented in ASHRAE "
       "Refrigeration (2006) ch. 9 (from memory)"},
      {"leighton_1927", "Leighton, A.", 1927,
       "On the calculation of the freezing point of ice-cream mixes and of the quantities of "
       "ice separated during the freezing process",
       "J. Dairy Sci. 10, 300-308", "doi:10.3168/jds.S0022-0302(27)93840-5 (from memory)",
       "average milk after Van Slyke: fat 3.9, lactose 4.9, protein 3.2, salts 0.89, water "
       "87.11 %; freezing point -0.55 C, of which lactose 0.306 K and salts etc. 0.244 K"},
      {"goff_hartel_2013", "Goff, H. D.; Hartel, R. W.", 2013, "Ice Cream, 7th ed.",
       "Springer, New York", "ISBN 978-1-4614-6095-4 (from memory)",
       "freezing point of mixes by Leighton's method: lactose 54.5 % of MSNF, 76.5 % of whey "
       "solids; salts depression 2.37 (MSNF + WS) / W degC; a 12 % fat, 11 % MSNF, 15 % "
       "sugar mix freezes near -2.5 C (as restated in dairy texts read in a stored copy); "
       "ch. 6 Table 6.1 (sucrose freezing-point depression by g per 100 g water, 3-180 g), "
       "Example Problems 13-14 and Table 6.2 (worked freezing curve), read in a public "
       "reproduction of that section: equilibria/leighton_method.hpp"},
      {"usda_fdc", "U.S. Department of Agriculture, Agricultural Research Service", 2019,
       "FoodData Central", "https://fdc.nal.usda.gov/ (SR Legacy and Foundation foods)", "",
       "proximate composition per 100 g; the FDC id and description are given per value"},
      {"hudson_1908", "Hudson, C. S.", 1908,
       "Further studies on the forms of milk-sugar", "J. Am. Chem. Soc. 30, 1767-1783",
       "doi:10.1021/ja01953a014 (from memory)",
       "final solubility of lactose in water vs temperature (values from memory)"},
      // Seawater freezing path (tests/reference/seawater_brine_path.csv and
      // seawater_teos10_ice_fraction.csv; what was read is in NOTES_seawater_path.md).
      {"teos10_2010", "IOC, SCOR and IAPSO", 2010,
       "The international thermodynamic equation of seawater - 2010: calculation and use of "
       "thermodynamic properties",
       "Intergovernmental Oceanographic Commission, Manuals and Guides No. 56, UNESCO", "",
       "freezing temperature of seawater (sections 3.33-3.34), evaluated with the gsw package; "
       "brine-conservative ice fractions by tools/teos10_brine_ice_fraction.py"},
      {"wolfenbarger_2022", "Wolfenbarger, N. S.; Fox-Powell, M. G.; Buffo, J. J.; Soderlund, K. M.; "
       "Blankenship, D. D.", 2022,
       "Compositional controls on the distribution of brine in Europa's ice shell",
       "J. Geophys. Res. Planets 127(9), e2022JE007305", "doi:10.1029/2022JE007305",
       "FREZCHEM v13.3 equilibrium freezing of standard seawater, output file "
       "FREZCHEM/v13.3/Seawater/Gitterman of the authors' public data repository"},
      {"vancoppenolle_2019", "Vancoppenolle, M.; Madec, G.; Thomas, M.; McDougall, T. J.", 2019,
       "Thermodynamics of sea ice phase composition revisited", "J. Geophys. Res. Oceans 124(1), "
       "615-634", "doi:10.1029/2018JC014611", "final eutectic of seawater (abstract)"},
      {"butler_2016", "Butler, B. M.; Papadimitriou, S.; Santoro, A.; Kennedy, H.", 2016,
       "Mirabilite solubility in equilibrium sea ice brines", "Geochim. Cosmochim. Acta 182, "
       "40-54 (volume and pages from memory)", "doi:10.1016/j.gca.2016.03.008",
       "onset of mirabilite precipitation in sea-ice brine (abstract)"},
      {"melnichenko_slobodyuk_2013", "Mel'nichenko, N. A.; Slobodyuk, A. B.", 2013,
       "Nuclear magnetic resonance study of sea-water freezing mechanisms: 1. Temperature "
       "dependence of relative brine content in sea ice", "J. Glaciol. 59 (issue from memory)",
       "doi:10.3189/2013JoG12J239", "hydrohalite below -23 C (abstract)"},
      {"marion_farren_komrowski_1999", "Marion, G. M.; Farren, R. E.; Komrowski, A. J.", 1999,
       "Alternative pathways for seawater freezing", "Cold Reg. Sci. Technol. 29, 259-266 "
       "(pages from memory)", "doi:10.1016/S0165-232X(99)00033-6 (from memory)",
       "equilibrium (Gitterman) and fractional (Ringer-Nelson-Thompson) paths (from memory)"},
      {"assur_1958", "Assur, A.", 1958, "Composition of sea ice and its tensile strength",
       "Arctic Sea Ice, Publ. 598, National Academy of Sciences - National Research Council, "
       "106-138 (from memory)", "",
       "phase-transition temperatures of sea-ice brine, as the breakpoints of later fits"},
      {"nelson_thompson_1954", "Nelson, K. H.; Thompson, T. G.", 1954,
       "Deposition of salts from sea water by frigid concentration",
       "J. Mar. Res. 13, 166-182 (pages from memory)", "", "fractional freezing path (from memory)"},
      {"lowe_experimental_cookery", "Lowe, B.", 1932,
       "Experimental Cookery from the Chemical and Physical Standpoint",
       "John Wiley & Sons, New York", "first edition 1932; edition of the copy read not recorded",
       "table \"Solubility of lactose in water (Hudson)\": final solubility 11.9, 16.9, 21.6 "
       "and 31.5 g per 100 g water at 0, 15, 25 and 39 C (Hudson's values; read in a public "
       "copy): data/sugar_solubility.hpp"},
      {"bender_dictionary", "Bender, D. A.", 2009, "A Dictionary of Food and Nutrition",
       "Oxford University Press, Oxford", "edition of the public copy read not recorded (year from memory)",
       "entry \"sweeteners\": relative sweetness on sucrose = 100, fructose 173, glucose 74, "
       "maltose 33, lactose 16: data/sweetness.hpp"},
      {"gaman_sherrington_1990", "Gaman, P. M.; Sherrington, K. B.", 1990,
       "The Science of Food: an Introduction to Food Science, Nutrition and Microbiology, "
       "3rd ed.",
       "Pergamon Press, Oxford", "ISBN not recorded (from memory)",
       "relative sweetness on sucrose = 100: fructose 170, glucose 75, maltose 30, lactose 15; "
       "a second source beside bender_dictionary in data/sweetness.hpp"},
      {"colligate_sweetness_oligomers", "colligate developers", 2026,
       "Relative sweetness of starch-hydrolysate oligomers",
       "maltotriose 0.1 from memory; higher saccharides (DP >= 4) and maltodextrin about 0 by "
       "common practice", "", "data/sweetness.hpp"},
      {"colligate_milk_salts", "colligate developers", 2026,
       "Effective milk-salts solute derived from Leighton (1927)",
       "colligate source tree, data/detail/builtin_solutes.inc", "",
       "0.89 g salts in 87.11 g water lower the freezing point by 0.244 K: 0.1312 osmol/kg "
       "water, an effective 77.9 g per osmole, treated as ideal particles"},
      {"colligate_de_relation", "colligate developers", 2026,
       "Starch hydrolysate oligomers represented through the dextrose equivalent",
       "common practice: number-average molar mass about 18016 / DE g/mol", "",
       "higher saccharides (DP >= 4) and maltodextrin as single ideal solutes of fixed molar mass"},
      {"oiml_r22_1975", "International Organization of Legal Metrology (OIML)", 1975,
       "International Alcoholometric Tables (OIML R 22)", "OIML, Paris", "OIML R 22 (1975)",
       "density of ethanol-water mixtures at 20 C as a polynomial in the ethanol mass fraction "
       "(coefficients A_1..A_12, the formula of the tables), pure ethanol 789.24 kg/m3 at 20 C; "
       "coefficients read in several public copies that agree digit for digit; table "
       "densities (e.g. 40 %vol: 948.05 kg/m3) read in a public copy of the tables: "
       "data/ethanol_water_density.hpp"},
      {"hyde_rothwell_1973", "Hyde, K. A.; Rothwell, J.", 1973, "Ice Cream",
       "Churchill Livingstone, Edinburgh", "book not read",
       "largest milk solids-not-fat that keeps lactose in solution (no sandiness): "
       "MSNF = (100 - fat - sugars - emulsifier - stabiliser) / 7, in % of the mix; read as "
       "quoted by M. Mullan, dairyscience.info ice-cream forum (2018), not in the book itself: "
       "data/dairy_rules.hpp"},
      {"plank_1913", "Plank, R.", 1913,
       "Die Gefrierdauer von Eisblocken", "Z. ges. Kalte-Industrie 20(6), 109-114", "",
       "freezing time of slab, infinite cylinder and sphere; shape factors P and R (as presented "
       "in ASHRAE Refrigeration, Cooling and freezing times of foods)"},
      {"pham_1986", "Pham, Q. T.", 1986,
       "Simplified equation for predicting the freezing time of foodstuffs",
       "J. Food Technol. 21, 209-219", "",
       "two-stage method, mean freezing temperature T_fm = 1.8 + 0.263 T_c + 0.105 T_a (as presented "
       "in ASHRAE Refrigeration, Cooling and freezing times of foods)"},
      {"ashrae_2006_freezing_times", "ASHRAE", 2006, "Cooling and freezing times of foods",
       "ASHRAE Handbook - Refrigeration (SI), chapter 10, ASHRAE, Atlanta", "(from memory)",
       "Plank's equation, Pham's method and the EHTD shape factors with their input definitions"},
      {"hossain_1992", "Hossain, Md. M.; Cleland, D. J.; Cleland, A. C.", 1992,
       "Prediction of freezing and thawing times for foods of regular multi-dimensional shape by "
       "using an analytically derived geometric factor", "Int. J. Refrig. 15(4), 227-234", "(from memory)",
       "equivalent heat-transfer dimensionality E = G1 + G2 E1 + G3 E2 (coefficients from memory)"},
      {"wagner_pruss_1993", "Wagner, W.; Pruss, A.", 1993,
       "International equations for the saturation properties of ordinary water substance. "
       "Revised according to the International Temperature Scale of 1990",
       "J. Phys. Chem. Ref. Data 22, 783-787", "doi:10.1063/1.555926",
       "saturation vapour pressure eq. 2.5 (IAPWS SR1-86, revised 1992)"},
      {"voller_swaminathan_1991", "Voller, V. R.; Swaminathan, C. R.", 1991,
       "General source-based method for solidification phase change",
       "Numer. Heat Transfer B 19, 175-189", "",
       "enthalpy linearisation of the implicit enthalpy method"},
      {"carslaw_jaeger_1959", "Carslaw, H. S.; Jaeger, J. C.", 1959, "Conduction of Heat in Solids",
       "2nd ed., Oxford University Press", "ISBN 0-19-853368-3",
       "section 11.2: Neumann's solution of the two-phase Stefan problem"},
      {"singh_heldman_2009", "Singh, R. P.; Heldman, D. R.", 2009, "Introduction to Food Engineering",
       "4th ed., Academic Press", "ISBN 978-0-12-370900-4",
       "ch. 7, worked example on Plank's equation (beef steak; from memory)"},
      {"crc_mean_activity", "Rumble, J. R. (ed.)", 2021,
       "Mean activity coefficients of electrolytes as a function of concentration",
       "CRC Handbook of Chemistry and Physics, CRC Press (edition of the copy not stated)", "",
       "25 C table built on Hamer & Wu (1972), Goldberg & Nuttall (1978), Goldberg (1981) "
       "(the compilations it credits, from memory); read in the pyEQL copy "
       "(tests/test_benchmark/mean_activity_coefficient.json, commit a6f8678)"},
      {"robinson_sinclair_1934", "Robinson; Sinclair", 1934,
       "Isopiestic molalities at 298.15 K (title not read)",
       "J. Am. Chem. Soc. 56", "doi:10.1021/ja01324a003",
       "KCl against NaCl; read in the "
       "compilation of isopiestic data kept with pytzer (mvdh7/pytzer datasets/iso.xlsx, "
       "commit 0cd0d63), which names this paper and its DOI"},
      {"stokes_1945", "Stokes", 1945,
       "Isopiestic molalities at 298.15 K (title not read)",
       "Trans. Faraday Soc. 41", "doi:10.1039/TF9454100637",
       "CaCl2 against NaCl; the compilation took these rows from Rard & Clegg (1997); read in the "
       "compilation of isopiestic data kept with pytzer (mvdh7/pytzer datasets/iso.xlsx, "
       "commit 0cd0d63), which names this paper and its DOI"},
      {"spedding_1976", "Spedding et al.", 1976,
       "Isopiestic molalities at 298.15 K (title not read)",
       "J. Chem. Eng. Data", "doi:10.1021/je60070a015",
       "CaCl2 against KCl; the compilation took these rows from Rard & Clegg (1997); read in the "
       "compilation of isopiestic data kept with pytzer (mvdh7/pytzer datasets/iso.xlsx, "
       "commit 0cd0d63), which names this paper and its DOI"},
      {"kuschel_seidel_1985", "Kuschel; Seidel", 1985,
       "Isopiestic molalities at 298.15 K (title not read)",
       "J. Chem. Eng. Data", "doi:10.1021/je00042a021",
       "MgCl2 and MgSO4 against KCl (the copy spells the second author 'Seldel'); read in the "
       "compilation of isopiestic data kept with pytzer (mvdh7/pytzer datasets/iso.xlsx, "
       "commit 0cd0d63), which names this paper and its DOI"},
      {"rard_miller_1981", "Rard; Miller", 1981,
       "Isopiestic molalities at 298.15 K (title not read)",
       "J. Chem. Eng. Data", "doi:10.1021/je00023a013",
       "MgSO4 against KCl; read in the "
       "compilation of isopiestic data kept with pytzer (mvdh7/pytzer datasets/iso.xlsx, "
       "commit 0cd0d63), which names this paper and its DOI"},
      {"platford_1968", "Platford", 1968,
       "Isopiestic molalities at 298.15 K (title not read)",
       "J. Chem. Eng. Data", "doi:10.1021/je60036a015",
       "Na2SO4 against NaCl; read in the "
       "compilation of isopiestic data kept with pytzer (mvdh7/pytzer datasets/iso.xlsx, "
       "commit 0cd0d63), which names this paper and its DOI"},
      {"rard_2000", "Rard et al.", 2000,
       "Isopiestic molalities at 298.15 K (title not read)",
       "J. Solution Chem.", "doi:10.1023/A:1005182316790",
       "Na2SO4 against NaCl; read in the "
       "compilation of isopiestic data kept with pytzer (mvdh7/pytzer datasets/iso.xlsx, "
       "commit 0cd0d63), which names this paper and its DOI"},
      {"robinson_wilson_stokes_1941", "Robinson; Wilson; Stokes", 1941,
       "Isopiestic molalities at 298.15 K (title not read)",
       "J. Am. Chem. Soc. 63", "doi:10.1021/ja01849a034",
       "Na2SO4 and K2SO4 against KCl; read in the "
       "compilation of isopiestic data kept with pytzer (mvdh7/pytzer datasets/iso.xlsx, "
       "commit 0cd0d63), which names this paper and its DOI"},
      {"greenspan_1977_fit", "Greenspan, L.", 1977,
       "Humidity fixed points of binary saturated aqueous solutions",
       "J. Res. Natl. Bur. Stand. 81A, 89-96", "doi:10.6028/jres.081A.011",
       "polynomial fits of the equilibrium relative humidity over saturated NaCl, KCl and "
       "MgCl2 solutions (table number not read), coefficients read in the public copy matusm/HumiFixPoints "
       "(SaturatedSolution.cs, after OIML R 121)"},
      {"starzak_peacock_1997", "Starzak, M.; Peacock, S. D.", 1997,
       "Water activity coefficient in aqueous solutions of sucrose - a comprehensive data analysis",
       "Zuckerindustrie 122(5), 380-387", "",
       "ln gamma_w = (Q/RT) x_s^2 (1 + a x_s + b x_s^2), Q = -17638 J/mol, a = -1.0038, "
       "b = -0.24653 (constants as printed in a summary of the paper; the form inferred from them)"},
      {"colligate_fit_user", "the user of colligate", 0,
       "Constants fitted by colligate.fit to the user's own data",
       "the provenance fields of the fitted-solute file", "", "see the record's note"},
      {"dean_1999_lange", "Dean, J. A. (ed.)", 1999, "Lange's Handbook of Chemistry, 15th ed.",
       "McGraw-Hill, New York", "ISBN 0-07-016384-7 (from memory)",
       "Table 5.13, compositions of aqueous antifreeze solutions: freezing point of "
       "propylene glycol-water mixtures by volume, p. 5.85; copied in "
       "tests/reference/lange_propylene_glycol_freezing.csv"},
      {"gordon_taylor_1952", "Gordon, M.; Taylor, J. S.", 1952,
       "Ideal copolymers and the second-order transitions of synthetic rubbers. I. Non-crystalline copolymers",
       "J. Appl. Chem. 2, 493-500", "doi:10.1002/jctb.5010020901", "the Gordon-Taylor equation"},
      {"couchman_karasz_1978", "Couchman, P. R.; Karasz, F. E.", 1978,
       "A classical thermodynamic discussion of the effect of composition on glass-transition temperatures",
       "Macromolecules 11, 117-119", "doi:10.1021/ma60061a021", "Tg of a mixture from the heat-capacity steps"},
      {"roos_1993", "Roos, Y. H.", 1993,
       "Melting and glass transitions of low molecular weight carbohydrates",
       "Carbohydr. Res. 238, 39-48", "doi:10.1016/0008-6215(93)87004-C",
       "table 1: Tg (onset), Delta Cp and Gordon-Taylor k of sugars with water (values from memory)"},
      {"roos_karel_1991_maltodextrin", "Roos, Y. H.; Karel, M.", 1991,
       "Phase transitions of mixtures of amorphous polysaccharides and sugars",
       "Biotechnol. Prog. 7, 49-53", "doi:10.1021/bp00007a008",
       "Tg and Gordon-Taylor k of maltodextrins (values from memory)"},
      {"roos_karel_1991_sucrose", "Roos, Y.; Karel, M.", 1991,
       "Amorphous state and delayed ice formation in sucrose solutions",
       "Int. J. Food Sci. Technol. 26, 553-566", "doi:10.1111/j.1365-2621.1991.tb02001.x",
       "Tg' = -46 C and Cg' = 80 wt% for maximally freeze-concentrated sucrose (from memory)"},
      {"johari_1987", "Johari, G. P.; Hallbrucker, A.; Mayer, E.", 1987,
       "The glass-liquid transition of hyperquenched water", "Nature 330, 552-553",
       "doi:10.1038/330552a0", "Tg of amorphous water, 136 K (food-science texts use -135 C)"},
      {"sugisaki_1968", "Sugisaki, M.; Suga, H.; Seki, S.", 1968,
       "Calorimetric study of the glassy state. IV. Heat capacities of glassy water and cubic ice",
       "Bull. Chem. Soc. Jpn. 41, 2591-2599", "doi:10.1246/bcsj.41.2591",
       "Delta Cp of water at its glass transition, 1.94 J/(g K) (value from memory)"},
      {"roos_2002", "Roos, Y. H.", 2002,
       "Importance of glass transition and water activity to spray drying and stability of dairy powders",
       "Lait 82, 475-484", "doi:10.1051/lait:2002025",
       "abstract: amorphous lactose is at its glass transition near room temperature at about 6.8 g "
       "water per 100 g lactose (a_w 0.37)"},
      {"antokolskaya_1964", "Antokolskaya, M. A. et al.", 1964,
       "Solubility of sucrose in water (sugar content and density of saturated solutions)",
       "as tabulated by Mohos, F., Confectionery and Chocolate Engineering, Wiley-Blackwell 2010, "
       "table A2.2 (copy read); the original not read", "ISBN 978-1-4051-9470-9",
       "g sucrose per 100 g water, 0-100 C every 5 C; the 0, 20 and 50 C rows equal Browne's "
       "Herzfeld table (64.18, 67.09, 72.25 per cent) as tabulated by Lowe"},
      {"jackson_silsbee_1922", "Jackson, R. F.; Silsbee, C. G.", 1922,
       "The solubility of dextrose in water", "Sci. Pap. Bur. Stand. 17, 715-724", "",
       "solubility of alpha-dextrose monohydrate (stable -5.3 to 50 C) and anhydrous dextrose "
       "(above 50 C); transition at 50 C (abstract read; the table values are from memory)"},
      {"hudson_1904", "Hudson, C. S.", 1904,
       "The hydration of milk-sugar in solution", "J. Am. Chem. Soc. 26, 1065-1082", "",
       "beta/alpha equilibrium ratio of lactose, 1.64 - 0.0027 t (from memory)"},
      {"fox_mcsweeney_1998", "Fox, P. F.; McSweeney, P. L. H.", 1998,
       "Dairy Chemistry and Biochemistry", "Blackie Academic & Professional, London",
       "ISBN 0-412-72000-0",
       "section 2.2.5: at 20 C about 7 g alpha-lactose per 100 g water dissolves at once; "
       "beta/alpha about 1.6 at equilibrium; final solubility 18.2 g per 100 g water (copy read)"},
      {"beuchat_1981", "Beuchat, L. R.", 1981, "Microbial stability as affected by water activity",
       "Cereal Foods World 26, 345-349", "",
       "table 1: minimum water activity for growth of groups of microorganisms (values from memory)"},
      {"salwin_slawson_1959", "Salwin, H.; Slawson, V.", 1959,
       "Moisture transfer in combinations of dehydrated foods", "Food Technol. 13, 715-718", "",
       "equilibrium relative humidity of mixed ingredients from their isotherms' slopes"},
      {"van_den_berg_1985", "van den Berg, C.", 1985,
       "Development of B.E.T.-like models for sorption of water on foods, theory and relevance",
       "in Simatos, D.; Multon, J. L. (eds.), Properties of Water in Foods, Martinus Nijhoff, 119-131", "",
       "the GAB isotherm and its linearised form"},
      {"cryobiology_2006_sucrose_glass", "(authors not shown in the copy read)", 2006,
       "Enthalpy relaxation of freeze concentrated sucrose-water glass", "Cryobiology (2006)", "",
       "abstract (copy read on daneshyari.com, article 2169628): DSC of frozen 40 % sucrose aged "
       "at -70 to -55 C; glass transition of the freeze-concentrated phase around -47 C"},
      {"le_meste_huang_1992", "Le Meste, M.; Huang, V.", 1992,
       "Thermomechanical properties of frozen sucrose solutions", "J. Food Sci. 57",
       "doi:10.1111/j.1365-2621.1992.tb11305.x",
       "abstract: TMA; maximum solute concentration of the amorphous phase close to 80 % (w/w); "
       "ice melting from -32 C"},
      {"ijfp_2006_trehalose_sucrose", "(authors not shown in the copy read)", 2006,
       "Glass transition and crystallization of amorphous trehalose-sucrose mixtures",
       "Int. J. Food Prop., 559-574", "doi:10.1080/10942910500269824",
       "abstract: DSC of freeze-dried sugars; Tg of dry sucrose 60 C, trehalose 106 C"},
      {"laliberte_2009", "Laliberte, M.", 2009,
       "A model for calculating the heat capacity of aqueous solutions, with updated density "
       "and viscosity data", "J. Chem. Eng. Data 54, 1725-1760", "doi:10.1021/je8008123",
       "apparent specific heat of a dissolved solute, c = a1 exp(a2 t + a3 exp(0.01 t) + a4 w_s) "
       "+ a5 w_s^a6, and its constants a1-a6 with each fit's temperature and concentration "
       "range (NaCl, KCl, CaCl2, MgCl2, Na2SO4, K2SO4, MgSO4, ethanol, acetic acid); read from "
       "the copy in the chemicals package (Laliberte2009.tsv, electrochem.py), paper not read"},
      {"may_2011", "May, P. M.; Rowland, D.; Hefter, G.; Koenigsberger, E.", 2011,
       "A generic and updatable Pitzer characterization of aqueous binary electrolyte "
       "solutions at 1 bar and 25 C",
       "J. Chem. Eng. Data 56, 5066-5077 (volume and pages from memory)", "doi:10.1021/je2009329",
       "beta0, beta1, beta2, C-phi and the top molality of the data behind each fit, 25 C, for "
       "sodium and potassium acetate, phosphates, carbonates and bicarbonates; read in the "
       "pyEQL database copy (src/pyEQL/database/pyeql_db.json, commit f02cb4e, DOI as given "
       "there), paper not read"},
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
