// The closed-form temperature slope of the Pitzer ln a_w (pitzer_system::
// ln_water_activity_with_temperature_slope) and the freezing-point Newton that uses it,
// against central differences and a plain bisection of the same equations, on invented
// compositions (seawater of the Reference Composition, single salts, a salt + sugar mix).
// Identities, no published values: the tolerances say what a central difference and the
// 1e-9 K solver tolerance allow (common practice).
#include <catch2/catch.hpp>
#include <algorithm>
#include <array>
#include <cmath>
#include <limits>
#include <vector>

#include "colligate/core/solution.hpp"
#include "colligate/equilibria/freezing_point.hpp"
#include "colligate/models/detail/pitzer_kernel.hpp"
#include "colligate/models/detail/pitzer_system.hpp"
#include "colligate/models/pitzer.hpp"
#include "colligate/models/water_activity.hpp"
#include "colligate/water/ice.hpp"

using namespace colligate;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;

namespace {
std::vector<solution> brines() {
  return {solution::seawater(35.0), solution::seawater(5.0), solution::seawater(40.0),
          solution::from_molalities({{"sodium_chloride", 2.0}}),
          solution::from_molalities({{"magnesium_sulfate", 1.0}}),
          solution::from_molalities({{"calcium_chloride", 1.5}, {"potassium_chloride", 0.5}})};
}

// Freezing point by bisection of ln a_w(T) - ln a_w,ice(T) to 1e-12 K.
template <class LnAw>
double bisected_freezing_point(LnAw&& ln_aw) {
  double lo = 223.15, hi = constants::ice_point;
  while (hi - lo > 1e-12) {
    const double mid = 0.5 * (lo + hi);
    (ln_aw(mid) - water::ln_water_activity_of_ice(mid) > 0.0 ? lo : hi) = mid;
  }
  return 0.5 * (lo + hi);
}
}  // namespace

TEST_CASE("dA_phi/dT of both correlations against central differences", "[models][pitzer][slope]") {
  using data::aphi_correlation;
  const double h = 1e-3;  // K; truncation about h^2 A'''/6, far below the tolerance
  for (const auto c : {aphi_correlation::clegg_rard_pitzer_1994, aphi_correlation::spencer_1990}) {
    for (double T = 235.0; T <= 298.0; T += 7.0) {
      const double fd = (models::detail::debye_huckel_osmotic_slope(T + h, c) -
                         models::detail::debye_huckel_osmotic_slope(T - h, c)) / (2.0 * h);
      // rounding of the difference: about 1e-16 * 0.4 / 1e-3 = 4e-14 per K
      CHECK_THAT(models::detail::debye_huckel_osmotic_slope_derivative(T, c), WithinAbs(fd, 1e-10));
    }
  }
}

TEST_CASE("J'' of the mixing function and the three-argument J", "[models][pitzer][slope]") {
  for (double x : {0.01, 0.2, 0.7, 0.99, 1.01, 2.5, 9.0, 40.0}) {
    double J, dJ, d2J, Jp, dJp, Jm, dJm;
    models::detail::mixing_j(x, J, dJ, &d2J);
    double J0, dJ0;
    models::detail::mixing_j(x, J0, dJ0);
    CHECK(J == J0);  // the same arithmetic with or without J''
    CHECK(dJ == dJ0);
    const double h = 1e-5 * x;
    models::detail::mixing_j(x + h, Jp, dJp);
    models::detail::mixing_j(x - h, Jm, dJm);
    // central difference of J': relative truncation about (h/x)^2 = 1e-10
    CHECK_THAT(d2J, WithinAbs((dJp - dJm) / (2.0 * h), 1e-7 * std::abs(dJ) / x));
  }
  for (double s : {0.003, 0.05, 0.3, 1.2, 4.0}) {  // x = s, 2s, 4s straddle the pieces
    const double x[3] = {s, 2.0 * s, 4.0 * s};
    double J[3], dJ[3], d2J[3];
    models::detail::mixing_j3(x, J, dJ, d2J);
    for (int c = 0; c < 3; ++c) {
      double J1, dJ1, d2J1;
      models::detail::mixing_j(x[c], J1, dJ1, &d2J1);
      CHECK(J[c] == J1);
      CHECK(dJ[c] == dJ1);
      CHECK(d2J[c] == d2J1);
    }
  }
  // |x J''(x)| stays below 0.1 (0.0487 at x = 0.58 on this grid): the constant of the Taylor
  // remainder of ln_gamma_upper_bounds (pitzer_system::j_near_last).
  double most = 0.0;
  for (double x = 1e-8; x < 1e8; x *= 1.0002) {
    double J, dJ, d2J;
    models::detail::mixing_j(x, J, dJ, &d2J);
    most = std::max(most, std::abs(x * d2J));
  }
  CHECK(most < 0.1);
  CHECK(most > 0.04);
  // mixing_j124: x, 2x and 4x from one power x^0.2 scaled by 2^0.2 and 4^0.2 (its constants
  // against std::pow to 1 ulp). The Chebyshev variable z then differs from mixing_j's by a
  // few ulp of its size (|z| <= 2, abs ~1e-15), and J, J', J'' by that times their z
  // derivative: abs 1e-13 on J and J x (sums of size 1), 1e-12 on J'' x^2, well above that
  // rounding and far below any physical effect (J enters E-theta multiplied by m^2 theta
  // sizes of 1e-2).
  CHECK_THAT(1.148698354997035, WithinRel(std::pow(2.0, 0.2), 2.3e-16));
  CHECK_THAT(1.3195079107728942, WithinRel(std::pow(4.0, 0.2), 2.3e-16));
  for (double s = 1e-4; s < 20.0; s *= 1.07) {  // the three arguments straddle x = 1
    double J[3], dJ[3], d2J[3];
    models::detail::mixing_j124(s, J, dJ, d2J);
    for (int c = 0; c < 3; ++c) {
      const double xc = s * (1 << c);
      double J1, dJ1, d2J1;
      models::detail::mixing_j(xc, J1, dJ1, &d2J1);
      INFO("x = " << xc);
      CHECK_THAT(J[c], WithinAbs(J1, 1e-13));
      CHECK_THAT(dJ[c] * xc, WithinAbs(dJ1 * xc, 1e-13));
      CHECK_THAT(d2J[c] * xc * xc, WithinAbs(d2J1 * xc * xc, 1e-12));
    }
  }
}

TEST_CASE("Pitzer d ln a_w / dT: value bit-identical, slope against central differences",
          "[models][pitzer][slope]") {
  for (const auto* set : {&data::harvie_spencer_icefit_parameters(), &data::spencer_1990_icefit_parameters(),
                          &data::spencer_1990_parameters(),
                          &data::harvie_1984_parameters()}) {
    for (const auto& s : brines()) {
      models::detail::pitzer_system sys(s, *set);
      REQUIRE(sys.has_temperature_slope());
      for (double T : {240.0, 255.0, 268.0, 273.15, 298.15}) {
        double slope = 0.0;
        const double v =
            sys.ln_water_activity_with_temperature_slope(s.moles().data(), s.water_mass(), T, slope);
        CHECK(v == sys.ln_water_activity(s.moles().data(), s.water_mass(), T));
        const double h = 1e-3;
        const double fd = (sys.ln_water_activity(s.moles().data(), s.water_mass(), T + h) -
                           sys.ln_water_activity(s.moles().data(), s.water_mass(), T - h)) / (2.0 * h);
        // truncation about h^2 |L'''| / 6 and rounding about 1e-16 |L| / h: both below
        // 1e-6 of the slope or 1e-11 per K
        CHECK_THAT(slope, WithinAbs(fd, 1e-6 * std::abs(fd) + 1e-11));
      }
    }
  }
}

TEST_CASE("Archer (1992) rows have no closed-form slope; the solver keeps its secant path",
          "[models][pitzer][slope][archer]") {
  const auto s = solution::from_molalities({{"sodium_chloride", 1.0}});
  models::detail::pitzer_system sys(s, data::archer_1992_parameters());
  CHECK_FALSE(sys.has_temperature_slope());
  double slope = 0.0;
  CHECK_THROWS_AS(sys.ln_water_activity_with_temperature_slope(s.moles().data(), 1.0, 260.0, slope),
                  invalid_input);
}

TEST_CASE("freezing point with the closed-form slope equals a bisection of the same equations",
          "[models][pitzer][slope][freezing]") {
  for (const auto& s : brines()) {
    const double T = equilibria::freezing_point(s, "pitzer").temperature;
    const double ref = bisected_freezing_point(
        [&](double t) { return models::pitzer::ln_water_activity(s, s.water_mass(), t); });
    CHECK_THAT(T, WithinAbs(ref, 1e-9));  // the solver's tolerance
  }
  // Ross: NaCl (Pitzer, T-dependent) + sucrose (Norrish) in the same water.
  for (double w_salt : {0.005, 0.02, 0.05}) {
    for (double w_sugar : {0.05, 0.15, 0.30}) {
      const auto s = solution::from_mass_fractions({{"sodium_chloride", w_salt}, {"sucrose", w_sugar}});
      const double T = equilibria::freezing_point(s, "ross").temperature;
      models::ln_water_activity_evaluator ln_aw("ross", s);
      const double ref = bisected_freezing_point([&](double t) { return ln_aw(s.water_mass(), t); });
      CHECK_THAT(T, WithinAbs(ref, 1e-9));
    }
  }
}

TEST_CASE("J as a power series equals Harvie's Chebyshev recurrence", "[models][pitzer][slope]") {
  // Identity (common practice): mixing_j evaluates the Chebyshev sum of Pitzer (1991)
  // Table B-1 rewritten as a polynomial in z; the Clenshaw recurrence of the table itself,
  // b_k = a_k + z b_(k+1) - b_(k+2), J = x/4 - 1 + (b_0 - b_2)/2, with its z derivative,
  // must give the same J and J' to rounding (sum |c_n| 2^n is at most 4.1, so a few 1e-16
  // absolute; 1e-14 allows for the z(x) map and the x/4 - 1 cancellation).
  const auto clenshaw = [](double x, double& J, double& dJ) {
    const bool low = x < 1.0;
    const auto& a = low ? models::detail::harvie_j_low : models::detail::harvie_j_high;
    const double px = low ? std::pow(x, 0.2) : std::pow(x, -0.1);
    const double z = low ? 4.0 * px - 2.0 : 40.0 / 9.0 * px - 22.0 / 9.0;
    const double dz = low ? 0.8 * px / x : -4.0 / 9.0 * px / x;
    double b0 = 0, b1 = 0, b2 = 0, d0 = 0, d1 = 0, d2 = 0;
    for (int k = 20; k >= 0; --k) {
      b2 = b1;
      b1 = b0;
      d2 = d1;
      d1 = d0;
      b0 = z * b1 - b2 + a[k];
      d0 = b1 + z * d1 - d2;
    }
    J = 0.25 * x - 1.0 + 0.5 * (b0 - b2);
    dJ = 0.25 + 0.5 * dz * (d0 - d2);
  };
  for (double x = 1e-3; x < 500.0; x *= 1.13) {
    double J, dJ, Jc, dJc;
    models::detail::mixing_j(x, J, dJ);
    clenshaw(x, Jc, dJc);
    INFO("x = " << x);
    CHECK_THAT(J, WithinAbs(Jc, 1e-14 * std::max(1.0, std::abs(Jc))));
    CHECK_THAT(dJ, WithinAbs(dJc, 1e-14 * std::max(1.0, std::abs(dJc))));
  }
}

TEST_CASE("ln a_w along temperature equals the slope path within rounding",
          "[models][pitzer][slope]") {
  // Identity (common practice): ln_water_activity_along_temperature regroups the osmotic
  // sum per composition (parameter rows summed with their molality weights once, then one
  // dot product with the temperature basis); value and slope equal those of
  // ln_water_activity_with_temperature_slope up to rounding (|ln a_w| below 0.2 here:
  // 1e-15 absolute is a few ulp of the terms summed; the slope sums terms of up to about
  // 1e-4 per K that partly cancel (4.5e-7 per K for seawater at 273.15 K with
  // spencer_1990_icefit), so 1e-16 per K absolute, 1e-12 of those terms).
  // The default set's K2SO4 and MgSO4 rows (tools/fit_default_set.py, fit_sulfate) hold four
  // curvature shapes that cancel in coefficients up to 1e11, so one parameter is itself a sum
  // of terms up to about 1e4 (and its slope of terms up to about 1e2 per K) whose rounding the
  // two groupings take differently: the limits add 4 ulp of the largest term of any binary
  // row at T, times 0.1, the largest molality weight Mw m_c m_a of these brines (1.5 mol/kg
  // CaCl2: 0.018 x 1.5 x 3.0); 3e-14 and 9e-16 per K found for 1 mol/kg MgSO4.
  const auto term_scale = [](const data::pitzer_parameter_set& set, double T, bool derivative) {
    constexpr double Tr = 298.15;
    const std::array<double, 6> f = {1.0, 1.0 / T - 1.0 / Tr, std::log(T / Tr), T - Tr, T * T - Tr * Tr,
                                     1.0 / (T * T) - 1.0 / (Tr * Tr)};
    const std::array<double, 6> df = {0.0, -1.0 / (T * T), 1.0 / T, 1.0, 2.0 * T, -2.0 / (T * T * T)};
    double largest = 0.0;
    for (const auto& b : set.binaries)
      for (const auto* p : {&b.beta0, &b.beta1, &b.beta2, &b.cphi})
        for (std::size_t j = 0; j < 6; ++j)
          largest = std::max(largest, std::abs(p->a[j] * (derivative ? df[j] : f[j])));
    return largest;
  };
  constexpr double ulp4 = 4.0 * std::numeric_limits<double>::epsilon();
  for (const auto* set : {&data::harvie_spencer_icefit_parameters(), &data::spencer_1990_icefit_parameters(),
                          &data::spencer_1990_parameters(), &data::harvie_1984_parameters()}) {
    for (const auto& s : brines()) {
      models::detail::pitzer_system sys(s, *set);
      for (double T : {240.0, 255.0, 268.0, 273.15, 298.15}) {
        double slope = 0.0, slope_ref = 0.0;
        const double v = sys.ln_water_activity_along_temperature(s.moles().data(), s.water_mass(), T, slope);
        const double ref = sys.ln_water_activity_with_temperature_slope(s.moles().data(), s.water_mass(),
                                                                        T, slope_ref);
        INFO(set->id << " T = " << T);
        CHECK_THAT(v, WithinAbs(ref, 1e-15 + ulp4 * 0.1 * term_scale(*set, T, false)));
        CHECK_THAT(slope, WithinAbs(slope_ref, 1e-16 + ulp4 * 0.1 * term_scale(*set, T, true)));
      }
    }
  }
  // The per-composition sums are kept for the last molalities only and never change a value:
  // the same calls in another order, on a fresh system each, give the same bits.
  const auto sea = solution::seawater(35.16504);
  const auto& set = models::pitzer::default_parameters();
  models::detail::pitzer_system kept(sea, set);
  for (double W : {1.0, 0.5, 1.0, 0.25, 0.5}) {
    for (double T : {273.15, 265.0, 273.15}) {
      models::detail::pitzer_system fresh(sea, set);
      double a = 0.0, b = 0.0;
      CHECK(kept.ln_water_activity_along_temperature(sea.moles().data(), W, T, a) ==
            fresh.ln_water_activity_along_temperature(sea.moles().data(), W, T, b));
      CHECK(a == b);
      CHECK(kept.ln_water_activity(sea.moles().data(), W, T) ==
            models::detail::pitzer_system(sea, set).ln_water_activity(sea.moles().data(), W, T));
    }
  }
  // Archer's extended rows have no slope here either.
  const auto nacl = solution::from_molalities({{"sodium_chloride", 1.0}});
  models::detail::pitzer_system archer(nacl, data::archer_1992_parameters());
  double slope = 0.0;
  CHECK_THROWS_AS(archer.ln_water_activity_along_temperature(nacl.moles().data(), 1.0, 260.0, slope),
                  invalid_input);
}
