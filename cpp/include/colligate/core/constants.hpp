#pragma once
/// \file constants.hpp
/// Physical constants used everywhere in colligate, in SI units, each with its source.
/// This is the only place a physical constant is written down; every other header
/// refers to these names.

namespace colligate::constants {

/// Molar gas constant R, J/(mol K). CODATA 2018 exact value
/// (Tiesinga et al. 2021, Rev. Mod. Phys. 93, 025010).
inline constexpr double gas_constant = 8.314462618;

/// Molar mass of water M_w, kg/mol (IAPWS-95; Wagner & Pruss 2002, J. Phys. Chem.
/// Ref. Data 31, 387, Table 2: 18.015268 g/mol).
inline constexpr double molar_mass_water = 0.018015268;

/// Normal melting point of ice at 101325 Pa, K (ice point; Wagner & Pruss 2002).
inline constexpr double ice_point = 273.15;

/// Offset between the Celsius and Kelvin scales, K (SI definition).
inline constexpr double celsius_offset = 273.15;

/// Standard atmosphere, Pa (SI definition).
inline constexpr double standard_atmosphere = 101325.0;

/// Molar enthalpy of fusion of ice at the ice point, J/mol: 333.55 kJ/kg
/// (Feistel & Wagner 2006, J. Phys. Chem. Ref. Data 35, 1021, IAPWS R10-06 Table 4)
/// times M_w gives 6009; the widely quoted 6.007 kJ/mol (CRC Handbook, "Enthalpy of
/// fusion") is used, the difference being below the spread of the freezing data.
inline constexpr double enthalpy_of_fusion_ice = 6007.0;

/// Isobaric molar heat capacity of liquid water at 0 C, J/(mol K): 4.2199 kJ/(kg K)
/// (IAPWS-95, Wagner & Pruss 2002) times M_w.
inline constexpr double heat_capacity_water_0c = 76.02;

/// Isobaric molar heat capacity of ice Ih at 0 C, J/(mol K): 2.0966 kJ/(kg K)
/// (Feistel & Wagner 2006, IAPWS R10-06) times M_w.
inline constexpr double heat_capacity_ice_0c = 37.77;

/// Molar volumes at the ice point, m^3/mol: ice Ih 1.9652e-5 (Feistel & Wagner 2006),
/// liquid 1.8018e-5 (IAPWS-95). Used for the Poynting correction of vapour pressures.
inline constexpr double molar_volume_ice = 1.9652e-5;
inline constexpr double molar_volume_water = 1.8018e-5;

/// Cryoscopic constant of water, K kg/mol: R T0^2 M_w / dH_fus = 1.86
/// (common practice; follows from the constants above).
inline constexpr double cryoscopic_constant =
    gas_constant * ice_point * ice_point * molar_mass_water / enthalpy_of_fusion_ice;

}  // namespace colligate::constants
