#pragma once
/// \file ethanol_water_density.hpp
/// Density of ethanol-water mixtures at 20 C and alcohol by volume (% ABV), from the
/// International Alcoholometric Tables, OIML R 22 (1975) (source key oiml_r22_1975):
///
///     rho(p, 20 C) = sum_{k=1..12} A_k p^(k-1)      kg/m3,  p = ethanol mass fraction,
///
/// the formula from which the tables are printed; pure ethanol 789.24 kg/m3 at 20 C.
/// Alcohol by volume at 20 C, the volume of the ethanol in the mixture over the volume of
/// the mixture, both at 20 C: ABV = p rho(p) / rho_ethanol.
/// SI: kg/m3, mass fractions and volume fractions (not percent).

#include <array>
#include <cmath>
#include <string>

#include "colligate/core/errors.hpp"

namespace colligate::data {

/// Density of pure ethanol at 20 C, kg/m3 (OIML R 22, 1975).
inline constexpr double ethanol_density_20c = 789.24;

/// Coefficients A_1..A_12 of the OIML R 22 (1975) density formula at 20 C, kg/m3.
inline constexpr std::array<double, 12> oiml_r22_density_coefficients = {
    998.20123,    -192.9769495, 389.1238958,  -1668.103923, 13522.15441,  -88292.78388,
    306287.4042,  -613838.1234, 747017.2998,  -547846.1354, 223446.0334,  -39032.85426};

/// Density of an ethanol-water mixture at 20 C, kg/m3, for ethanol mass fraction `p` in
/// [0, 1] (OIML R 22, 1975). Throws invalid_input naming `p` outside that range.
inline double ethanol_water_density_20c(double p) {
  if (!(std::isfinite(p) && p >= 0.0 && p <= 1.0))
    throw invalid_input(colligate::detail::describe("ethanol_water_density_20c", "ethanol mass fraction", p,
                                         "must be finite and in [0, 1] (kg ethanol per kg of "
                                         "ethanol and water)"));
  double rho = 0.0;  // Horner form of sum A_k p^(k-1)
  for (auto it = oiml_r22_density_coefficients.rbegin(); it != oiml_r22_density_coefficients.rend(); ++it)
    rho = rho * p + *it;
  return rho;
}

/// Alcohol by volume at 20 C (volume fraction, 0..1) of a mixture of `ethanol_kg` ethanol
/// and `water_kg` water: p rho(p) / 789.24 with p = ethanol / (ethanol + water). Throws
/// invalid_input naming the argument that is negative or not finite, or when both are 0.
inline double alcohol_by_volume_20c(double ethanol_kg, double water_kg) {
  const char* where = "alcohol_by_volume_20c";
  if (!(std::isfinite(ethanol_kg) && ethanol_kg >= 0.0))
    throw invalid_input(colligate::detail::describe(where, "ethanol_kg", ethanol_kg, "must be finite and >= 0 kg"));
  if (!(std::isfinite(water_kg) && water_kg >= 0.0))
    throw invalid_input(colligate::detail::describe(where, "water_kg", water_kg, "must be finite and >= 0 kg"));
  if (!(ethanol_kg + water_kg > 0.0))
    throw invalid_input(colligate::detail::describe(where, "ethanol_kg + water_kg", ethanol_kg + water_kg,
                                         "must be > 0 kg"));
  const double p = ethanol_kg / (ethanol_kg + water_kg);
  return p * ethanol_water_density_20c(p) / ethanol_density_20c;
}

}  // namespace colligate::data
