// Tests of the ice equilibrium a_w,ice(T) and the vapour pressures it is checked against.
#include <catch2/catch.hpp>
#include <cmath>

#include "colligate/core/constants.hpp"
#include "colligate/water/ice.hpp"
#include "colligate/water/vapour_pressure.hpp"

using namespace colligate;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;

TEST_CASE("Murphy & Koop vapour pressures at the triple point", "[water][ice]") {
  // Triple-point pressure 611.657 Pa (Wagner & Pruss 2002, IAPWS-95, Table 1); Murphy & Koop
  // (2005) state their eqs. 7 and 10 reproduce it; 4 printed digits of agreement, rel 2e-4.
  CHECK_THAT(water::ice_vapour_pressure(273.16), WithinRel(611.657, 2e-4));
  CHECK_THAT(water::liquid_vapour_pressure(273.16), WithinRel(611.657, 2e-4));
}

TEST_CASE("ice water activity matches the Murphy & Koop (2005) vapour-pressure ratio to -40 C",
          "[water][ice]") {
  // Reference: p_ice(T) / p_liquid(T), Murphy & Koop (2005) eqs. 7 and 10, with the Poynting
  // factor exp((V_ice - V_liq)(P - p) / RT) that carries the ratio from saturation pressure
  // to one atmosphere. Required agreement: 2e-4 in a_w from 0 to -40 C.
  const double dV = constants::molar_volume_ice - constants::molar_volume_water;
  double worst = 0.0;
  for (double t_c = 0.0; t_c >= -40.0; t_c -= 0.5) {
    const double T = constants::ice_point + t_c;
    const double ratio = water::ice_vapour_pressure(T) / water::liquid_vapour_pressure(T);
    const double reference =
        ratio * std::exp(dV * constants::standard_atmosphere / (constants::gas_constant * T));
    worst = std::max(worst, std::abs(water::water_activity_of_ice(T) - reference));
  }
  INFO("largest |a_w,ice - Murphy & Koop| = " << worst);
  CHECK(worst < 2e-4);
}

TEST_CASE("enthalpy of fusion and its temperature dependence", "[water][ice]") {
  // 6007 J/mol at 0 C (CRC Handbook, enthalpy of fusion; constants.hpp).
  CHECK_THAT(water::enthalpy_of_fusion(constants::ice_point), WithinRel(6007.0, 1e-15));
  // dCp at 0 C: IAPWS-95 liquid 76.02 minus IAPWS R10-06 ice 37.77 J/(mol K).
  CHECK_THAT(water::delta_heat_capacity_of_fusion(constants::ice_point), WithinRel(38.25, 1e-12));
  // d ln a_w,ice / dT = dH_fus / (R T^2) (the defining identity; central difference, rel 1e-6).
  for (double T : {268.15, 253.15, 238.15}) {
    const double h = 1e-3;
    const double slope = (water::ln_water_activity_of_ice(T + h) - water::ln_water_activity_of_ice(T - h)) / (2 * h);
    CHECK_THAT(slope, WithinRel(water::enthalpy_of_fusion(T) / (constants::gas_constant * T * T), 1e-6));
  }
  CHECK(water::ln_water_activity_of_ice(constants::ice_point) == 0.0);
}

TEST_CASE("the cryoscopic constant is 1.86 K kg/mol", "[water][constants]") {
  // Kf of water 1.86 K kg/mol (common practice; Atkins' Physical Chemistry table of
  // cryoscopic constants, from memory). Two printed decimals, abs 5e-3.
  CHECK_THAT(constants::cryoscopic_constant, WithinAbs(1.86, 5e-3));
}

TEST_CASE("temperatures below -40 C are flagged", "[water][ice][validity]") {
  CHECK(water::ice_temperature_validity(253.15).in_range());
  CHECK_FALSE(water::ice_temperature_validity(230.0).in_range());
}
