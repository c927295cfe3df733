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

TEST_CASE("the ice series cut short near the ice point leaves out less than 2^-60", "[water][ice]") {
  // Identity (no literature value): ln_water_activity_of_ice sums the first 16 terms of its
  // series for |w| <= ice_series_w16 and 24 for |w| <= ice_series_w24 (w = (T - T0) / T).
  // The terms left out, bounded term by term at the tier's edge, must stay below 2^-60 of the
  // value (far below its rounding, 2^-53); the shortened and the 48-term sums must then agree
  // to a few ulp (rel 1e-15: the two sums round differently, 4 ulp).
  const double limit = std::ldexp(1.0, -60);
  CHECK(water::detail::ice_series_tail_bound(16, water::detail::ice_series_w16) < limit);
  CHECK(water::detail::ice_series_tail_bound(24, water::detail::ice_series_w24) < limit);
  // The bound is not vacuous: 12 terms at the first edge, 16 at the second, do not meet it.
  CHECK(water::detail::ice_series_tail_bound(12, water::detail::ice_series_w16) > limit);
  CHECK(water::detail::ice_series_tail_bound(16, water::detail::ice_series_w24) > limit);
  const auto e = water::detail::ice_series_coefficients();
  for (double T = 273.10; T >= 215.0; T -= 0.173) {
    const double w = (T - constants::ice_point) / T;
    if (std::abs(w) > 0.3) break;
    const double full = water::detail::ice_series_sum<water::detail::ice_series_terms>(e, w);
    INFO("T = " << T);
    CHECK_THAT(water::ln_water_activity_of_ice(T), WithinRel(full, 1e-15));
  }
}
