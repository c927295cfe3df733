// Sorption isotherms, their fit, and the moisture equilibrium of mixed parts.
#include <catch2/catch.hpp>

#include <vector>

#include "colligate/equilibria/moisture_equilibrium.hpp"
#include "colligate/fit/sorption_fitter.hpp"

using namespace colligate;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;
using equilibria::isotherm_model;
using equilibria::sorption_isotherm;

TEST_CASE("GAB with K = 1 is BET; each isotherm inverts", "[sorption]") {
  // Identity of the forms (van den Berg 1985: GAB reduces to BET at K = 1).
  const sorption_isotherm gab{isotherm_model::gab, 0.05, 12.0, 1.0};
  const sorption_isotherm bet{isotherm_model::bet, 0.05, 12.0};
  for (double a : {0.05, 0.2, 0.4, 0.6})
    CHECK_THAT(gab.moisture_unchecked(a), WithinRel(bet.moisture_unchecked(a), 1e-14));
  const std::vector<sorption_isotherm> all = {{isotherm_model::gab, 0.06, 9.0, 0.85},
                                              {isotherm_model::bet, 0.05, 20.0},
                                              {isotherm_model::oswin, 0.11, 0.45}};
  for (const auto& iso : all)
    for (double a : {0.03, 0.25, 0.5, 0.75, 0.93}) {
      INFO(equilibria::to_string(iso.model) << " a = " << a);
      CHECK_THAT(iso.water_activity(iso.moisture(a)), WithinAbs(a, 1e-10));
    }
}

TEST_CASE("Isotherms reject water activity and moisture outside their domain", "[sorption][errors]") {
  const sorption_isotherm gab{isotherm_model::gab, 0.06, 9.0, 0.85, 298.15, 0.11, 0.85};
  CHECK_THROWS_AS(gab.moisture(0.0), invalid_input);
  CHECK_THROWS_AS(gab.moisture(1.0), invalid_input);
  CHECK_THROWS_AS(gab.water_activity(-0.1), invalid_input);
  CHECK_THROWS_AS((sorption_isotherm{isotherm_model::gab, 0.06, 9.0, 1.2}.validate()), invalid_input);
  CHECK(gab.check(0.5).in_range());
  CHECK_FALSE(gab.check(0.95).in_range());
  CHECK_THROWS_AS(equilibria::isotherm_model_from_string("henderson"), invalid_input);
}

TEST_CASE("The GAB fit recovers known constants and their intervals cover them", "[sorption][fit]") {
  // Data made from GAB (Xm 0.07, C 15, K 0.82) with a fixed, alternating error of 1.5 % of
  // X: an identity check of the fitter (no published data set in this test).
  const sorption_isotherm truth{isotherm_model::gab, 0.07, 15.0, 0.82};
  const std::vector<double> aw = {0.11, 0.23, 0.33, 0.43, 0.53, 0.64, 0.75, 0.84, 0.90};
  Eigen::VectorXd a(aw.size()), x(aw.size());
  for (std::size_t i = 0; i < aw.size(); ++i) {
    a[i] = aw[i];
    x[i] = truth.moisture(aw[i]) * (1.0 + (i % 2 ? 0.015 : -0.015));
  }
  const auto r = fit::fit_isotherm(isotherm_model::gab, a, x);
  REQUIRE(r.success());
  CHECK(r.parameter_names == std::vector<std::string>{"xm", "c", "k"});
  const auto ci = r.confidence_intervals(0.95);
  CHECK(ci(0, 0) < 0.07);
  CHECK(ci(0, 1) > 0.07);
  CHECK(ci(2, 0) < 0.82);
  CHECK(ci(2, 1) > 0.82);
  // Without error the constants come back to many digits.
  for (std::size_t i = 0; i < aw.size(); ++i) x[i] = truth.moisture(aw[i]);
  const auto exact = fit::fit_isotherm(isotherm_model::gab, a, x);
  CHECK_THAT(exact.params[0], WithinRel(0.07, 1e-6));
  CHECK_THAT(exact.params[1], WithinRel(15.0, 1e-5));
  CHECK_THAT(exact.params[2], WithinRel(0.82, 1e-6));
  for (auto m : {isotherm_model::bet, isotherm_model::oswin}) {
    const auto rr = fit::fit_isotherm(m, a, x);
    CHECK(rr.success());
  }
  Eigen::VectorXd bad = a;
  bad[0] = 1.2;
  CHECK_THROWS_AS(fit::fit_isotherm(isotherm_model::gab, bad, x), invalid_input);
  CHECK_THROWS_AS(fit::fit_isotherm(isotherm_model::gab, a.head(2), x.head(2)), invalid_input);
}

TEST_CASE("Moisture equilibrium of two layers conserves water", "[sorption][mixing]") {
  // An invented pair: a dry biscuit layer and a moist filling.
  const equilibria::moisture_part biscuit{{isotherm_model::gab, 0.055, 12.0, 0.80}, 0.30, 0.03};
  const equilibria::moisture_part filling{{isotherm_model::gab, 0.10, 4.0, 0.95}, 0.10, 0.45};
  const auto r = equilibria::moisture_equilibrium({biscuit, filling});
  REQUIRE(r.converged);
  CHECK_THAT(r.water_gained[0] + r.water_gained[1], WithinAbs(0.0, 1e-12));
  CHECK(r.water_gained[0] > 0.0);  // the dry layer takes up water
  CHECK(r.water_activity > r.initial_water_activity[0]);
  CHECK(r.water_activity < r.initial_water_activity[1]);
  CHECK_THAT(biscuit.isotherm.water_activity(r.moisture[0]), WithinAbs(r.water_activity, 1e-9));
  CHECK_THAT(filling.isotherm.water_activity(r.moisture[1]), WithinAbs(r.water_activity, 1e-9));
  // Salwin-Slawson is a tangent approximation: close to the exact answer when the parts
  // start near each other, and exact for one isotherm split in two parts.
  const equilibria::moisture_part near{{isotherm_model::gab, 0.055, 12.0, 0.80}, 0.30, 0.12};
  const equilibria::moisture_part near2{{isotherm_model::gab, 0.055, 12.0, 0.80}, 0.30, 0.13};
  CHECK_THAT(equilibria::salwin_slawson_water_activity({near, near2}),
             WithinAbs(equilibria::moisture_equilibrium({near, near2}).water_activity, 2e-3));
  CHECK_THROWS_AS(equilibria::moisture_equilibrium({}), invalid_input);
}

TEST_CASE("Clausius-Clapeyron shift and isosteric heat", "[sorption][temperature]") {
  // Identity: shifting a_w from T1 to T2 and back returns it; q > 0 raises a_w with T at
  // constant moisture (the usual direction for foods).
  const double q = 8000.0;
  const double a2 = equilibria::shift_water_activity(0.5, 298.15, 318.15, q);
  CHECK(a2 > 0.5);
  CHECK_THAT(equilibria::shift_water_activity(a2, 318.15, 298.15, q), WithinRel(0.5, 1e-12));
  // isosteric_heat and shift_water_activity are inverse operations: the heat taken from
  // two isotherms moves the cool isotherm's a_w onto the warm one's at the same moisture.
  const sorption_isotherm warm{isotherm_model::oswin, 0.09, 0.4, 0.0, 318.15};
  const sorption_isotherm cool{isotherm_model::oswin, 0.11, 0.4, 0.0, 298.15};
  const double x = 0.10;
  const double qx = equilibria::isosteric_heat(cool, warm, x);
  CHECK_THAT(equilibria::shift_water_activity(cool.water_activity(x), 298.15, 318.15, qx),
             WithinRel(warm.water_activity(x), 1e-10));
  CHECK(equilibria::isosteric_heat(cool, warm, x) > 0.0);
  CHECK_THROWS_AS(equilibria::isosteric_heat(cool, cool, x), invalid_input);
}
