// Tests of the activity models: dilute limits, identities and published forms.
#include <catch2/catch.hpp>
#include <cmath>

#include "colligate/core/solution.hpp"
#include "colligate/models/water_activity.hpp"

using namespace colligate;
using Catch::Matchers::Contains;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;

namespace {
double ln_aw(const models::model_choice& m, const solution& s) {
  return models::ln_water_activity(m, s, s.water_mass(), 298.15);
}
}  // namespace

TEST_CASE("ideal model: ln a_w = -M_w sum nu m", "[models][ideal]") {
  const auto s = solution::from_molalities({{"NaCl", 0.05}, {"sucrose", 0.02}});
  // 0.05 mol/kg NaCl -> 0.1 mol/kg ions, + 0.02 sucrose = 0.12 mol/kg particles.
  CHECK_THAT(ln_aw("ideal", s), WithinRel(-0.018015268 * 0.12, 1e-14));
}

TEST_CASE("Raoult and Norrish converge to the ideal model as m -> 0", "[models][raoult][norrish]") {
  for (const char* solute : {"sucrose", "glucose", "glycerol", "ethanol", "NaCl"}) {
    for (double m : {1e-2, 1e-3, 1e-4}) {
      const auto s = solution::from_molalities({{solute, m}});
      const double ideal = ln_aw("ideal", s);
      INFO(solute << " at " << m << " mol/kg");
      // Deviation is second order in m: relative difference below 10 m (with the
      // largest Norrish constants, |K| < 10, and ln(1 + M_w m) expansions).
      CHECK_THAT(ln_aw("raoult", s), WithinRel(ideal, 10 * m));
      CHECK_THAT(ln_aw("norrish", s), WithinRel(ideal, 10 * m));
    }
  }
}

TEST_CASE("Norrish single-solute form", "[models][norrish]") {
  // ln a_w = ln x_w - K x^2 (Norrish 1966, eq. 7, our sign), sucrose K = 6.47
  // (Chirife et al. 1980, from memory). Identity check of the implementation, rel 1e-13.
  const auto s = solution::from_molalities({{"sucrose", 2.0}});
  const double nw = 1.0 / 0.018015268;
  const double x = 2.0 / (nw + 2.0);
  CHECK_THAT(ln_aw("norrish", s), WithinRel(std::log(1 - x) - 6.47 * x * x, 1e-13));
}

TEST_CASE("Norrish multi-solute extension reduces to the single-solute form", "[models][norrish]") {
  // Chirife et al. (1980): ln a_w = ln x_w - (sum sqrt(K_i) x_i)^2. Splitting one solute
  // into two equal halves of the same kind must not change a_w. Here: sucrose + maltose
  // mixture vs the formula written out.
  const auto s = solution::from_molalities({{"sucrose", 1.0}, {"glucose", 1.0}});
  const double nw = 1.0 / 0.018015268;
  const double n = nw + 2.0;
  const double x = 1.0 / n;
  const double expected = std::log(nw / n) - std::pow(std::sqrt(6.47) * x + std::sqrt(2.25) * x, 2);
  CHECK_THAT(ln_aw("norrish", s), WithinRel(expected, 1e-13));
}

TEST_CASE("prepared Norrish evaluator equals the static sum bit for bit", "[models][norrish]") {
  // Identity: the evaluator a solver or batch thread prepares (constants copied out of the
  // records, sqrt(K) taken once) does the same arithmetic as norrish::ln_water_activity on
  // the solution, so values and slopes agree exactly; lactic acid (K < 0) and ethanol
  // (volume-fraction terms) take the other branches of the sum.
  const auto s = solution::from_mass_fractions(
      {{"sucrose", 0.12}, {"glucose", 0.05}, {"lactic_acid", 0.02}, {"ethanol", 0.04}, {"glycerol", 0.03}});
  models::ln_water_activity_evaluator ev("norrish", s);
  for (double W : {s.water_mass(), 0.6 * s.water_mass(), 0.2 * s.water_mass()}) {
    CHECK(ev(W, 263.15) == models::norrish::ln_water_activity(s, W, 263.15));
    double l = 0.0, slope = 0.0, l_static = 0.0, slope_static = 0.0;
    REQUIRE(ev.with_slope(W, 263.15, l, slope));
    models::norrish::ln_water_activity_with_slope(s, W, 263.15, l_static, slope_static);
    CHECK(l == l_static);
    CHECK(slope == slope_static);
  }
}

TEST_CASE("water activity lies between 0 and 1 and osmotic coefficient tends to 1", "[models]") {
  for (auto m : {"ideal", "raoult", "norrish"}) {
    const auto s = solution::from_mass_fractions({{"sucrose", 0.3}, {"glucose", 0.1}});
    const auto aw = models::water_activity(s, 298.15, m);
    CHECK(aw.value > 0.0);
    CHECK(aw.value <= 1.0);
    const auto dilute = solution::from_molalities({{"glucose", 1e-6}});
    CHECK_THAT(models::osmotic_coefficient(dilute, 298.15, m).value, WithinAbs(1.0, 1e-5));
  }
}

TEST_CASE("models declare their validity and the policy applies it", "[models][validity]") {
  const auto salty = solution::from_molalities({{"NaCl", 2.0}});
  const auto v = models::water_activity(salty, 298.15, "norrish");
  CHECK_FALSE(v.check.in_range());
  CHECK_THAT(v.check.reason(), Contains("ionic strength"));
  CHECK(std::isnan(models::water_activity(salty, 298.15, "norrish", range_policy::nan).value));
  CHECK_THROWS_AS(models::water_activity(salty, 298.15, "norrish", range_policy::raise),
                  out_of_validity_range);
  const auto syrup = solution::from_mass_fractions({{"ethanol", 0.75}});  // above its 0.68
  CHECK_THAT(models::water_activity(syrup, 298.15).check.reason(), Contains("ethanol"));
  CHECK_THROWS_WITH(models::model_choice("pitzr"), Contains("valid models"));
}

TEST_CASE("each descriptor carries the validated range its check applies", "[models][validity]") {
  // Identity (issue 18): the registry's range_limit records are the ones check() reports, so
  // the documentation read from the registry and the warnings cannot differ.
  for (const auto& d : models::builtin_models().models()) {
    INFO(d.id);
    REQUIRE_FALSE(d.validated_range.empty());
    for (const auto& limit : d.validated_range) {
      CHECK_FALSE(limit.quantity.empty());
      CHECK_FALSE(limit.basis.empty());
      CHECK((!std::isnan(limit.high) || !limit.per_solute.empty()));
    }
  }
  const auto& norrish = *models::builtin_models().find("norrish");
  const auto& t = norrish.validated_range.front();
  REQUIRE(t.quantity == "temperature");
  const auto s = solution::from_mass_fractions({{"sucrose", 0.1}});
  const auto hot = models::water_activity(s, t.high + 5.0, "norrish");
  CHECK(hot.check.code == validity_code::temperature_out_of_range);
  CHECK(hot.check.range_low == t.low);
  CHECK(hot.check.range_high == t.high);
  CHECK_THAT(hot.check.reason(), Contains(t.basis));
  CHECK(models::water_activity(s, t.high, "norrish").check.in_range());
}
