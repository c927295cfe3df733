// Physical bounds and errors in the caller's terms (issue 16): no range policy returns an
// impossible number (a_w outside (0, 1], an ice fraction outside [0, 1], T <= 0) without
// an error or NaN with a reason; errors name the input, its value and the range or phase.
#include <catch2/catch.hpp>
#include <cmath>
#include <limits>
#include <string>

#include "colligate/equilibria/freezing_point.hpp"
#include "colligate/equilibria/ice_fraction.hpp"
#include "colligate/equilibria/leighton_method.hpp"
#include "colligate/fit/levenberg_marquardt.hpp"
#include "colligate/models/water_activity.hpp"
#include "colligate/thermal/enthalpy.hpp"
#include "colligate/water/ice.hpp"

using namespace colligate;
using Catch::Matchers::Contains;

namespace {
constexpr range_policy all_policies[] = {range_policy::extrapolate, range_policy::nan,
                                         range_policy::raise};

bool mentions(const std::string& text, const std::string& word) {
  return text.find(word) != std::string::npos;
}
}  // namespace

TEST_CASE("a_w,ice gives no value below 215 K nor above the ice point", "[robustness][ice]") {
  // The heat-capacity polynomial makes a_w,ice rise again below about 207 K and exceed 1
  // below about 175 K (common practice: an ice water activity increases with T, since
  // dH_fus > 0). Below 215 K there is no value under any policy.
  for (double T : {214.9, 205.0, 175.0, 150.0, 1.0}) {
    INFO("T = " << T);
    CHECK(std::isnan(water::ln_water_activity_of_ice(T)));
    for (auto p : all_policies) {
      if (p == range_policy::raise) {
        CHECK_THROWS_AS(water::water_activity_of_ice_checked(T, p), out_of_validity_range);
        continue;
      }
      const auto v = water::water_activity_of_ice_checked(T, p);
      CHECK(std::isnan(v.value));
      CHECK(v.check.code == validity_code::outside_physical_bounds);
      CHECK_THAT(v.check.reason(), Contains("215"));
    }
  }
  const auto above = water::water_activity_of_ice_checked(280.0, range_policy::extrapolate);
  CHECK(std::isnan(above.value));
  CHECK_THAT(above.check.reason(), Contains("ice melts"));
  // Extrapolated from 215 to 233.15 K: a value, flagged.
  const auto x = water::water_activity_of_ice_checked(220.0, range_policy::extrapolate);
  CHECK(x.value > 0.0);
  CHECK(x.value < 1.0);
  CHECK(x.check.code == validity_code::temperature_out_of_range);
  CHECK_THROWS_AS(water::water_activity_of_ice_checked(std::nan(""), range_policy::extrapolate),
                  invalid_input);
}

TEST_CASE("a_w,ice rises monotonically to 1 over the range it is given", "[robustness][ice]") {
  // d ln a_w,ice / dT = dH_fus / (R T^2) > 0 (common practice; Murphy & Koop 2005, eq. 7
  // over eq. 10, rises monotonically over 123-273 K).
  double prev = 0.0;
  for (double T = water::ice_model_lowest_temperature; T <= constants::ice_point; T += 0.05) {
    const double a = water::water_activity_of_ice(T);
    INFO("T = " << T);
    REQUIRE(a > prev);
    REQUIRE(a <= 1.0);
    prev = a;
  }
}

TEST_CASE("a 20 % sucrose solution at 150 K has no ice fraction, not 0", "[robustness][ice]") {
  const auto s = solution::from_mass_fractions({{"sucrose", 0.20}});
  for (auto p : {range_policy::extrapolate, range_policy::nan}) {
    const auto f = equilibria::ice_fraction(s, 150.0, "auto", p);
    CHECK(std::isnan(f.value));
    CHECK_THAT(f.check.reason(), Contains("215"));
  }
  CHECK_THROWS_AS(equilibria::ice_fraction(s, 150.0, "auto", range_policy::raise),
                  out_of_validity_range);
  const auto u = equilibria::unfrozen_phase_at(s, 150.0);
  CHECK(u.state == equilibria::phase_state::below_curve_end);
  CHECK(std::isnan(u.ice));
}

TEST_CASE("Pitzer extrapolated to a_w > 1 gives NaN with a reason, never the value",
          "[robustness][pitzer]") {
  // K2SO4 2.75 mol/kg at 240 K and Na2SO4 20 mol/kg at 25 C lie far beyond their
  // parameters' ranges; the Pitzer sums give a negative osmotic coefficient there. A
  // solution's water activity lies in (0, 1] (common practice).
  const auto k2so4 = solution::from_molalities({{"K2SO4", 2.75}});
  const auto na2so4 = solution::from_molalities({{"Na2SO4", 20.0}});
  for (auto p : {range_policy::extrapolate, range_policy::nan}) {
    const auto aw = models::water_activity(k2so4, 240.0, "pitzer", p);
    INFO(aw.check.reason());
    CHECK((std::isnan(aw.value) || (aw.value > 0.0 && aw.value <= 1.0)));
    CHECK_FALSE(aw.check.in_range());
    const auto phi = models::osmotic_coefficient(na2so4, 298.15, "pitzer", p);
    INFO(phi.check.reason());
    CHECK((std::isnan(phi.value) || phi.value >= 0.0));
    CHECK_FALSE(phi.check.in_range());
  }
  const auto phi = models::osmotic_coefficient(na2so4, 298.15, "pitzer", range_policy::extrapolate);
  CHECK(std::isnan(phi.value));
  CHECK(phi.check.code == validity_code::outside_physical_bounds);
  CHECK_THAT(phi.check.reason(), Contains("osmotic coefficient would be"));
  CHECK_THROWS_AS(models::osmotic_coefficient(na2so4, 298.15, "pitzer", range_policy::raise),
                  out_of_validity_range);
  // The ice curve's liquid state: no a_w above 1 either.
  equilibria::ice_curve curve(k2so4, "pitzer");
  const auto st = curve.at(240.0);
  CHECK((std::isnan(st.water_activity) || st.water_activity <= 1.0));
}

TEST_CASE("the dairy method gives no freezing point at or below 0 K", "[robustness][leighton]") {
  // 98 % sucrose: 4900 g per 100 g water, 27 times beyond Goff & Hartel's (2013) Table 6.1
  // (ends at 180 g); its linear extrapolation would reach below 0 K.
  const auto m = equilibria::leighton::terms_of(solution::from_brix(98.0));
  const auto fp = equilibria::leighton::freezing_point(m);
  CHECK(std::isnan(fp.value));
  CHECK(fp.check.code == validity_code::outside_physical_bounds);
  CHECK_THAT(fp.check.reason(), Contains("Table 6.1"));
  // Inside the table a value (Table 6.1 row 60 g: 3.85 K, Goff & Hartel 2013).
  const auto ok = equilibria::leighton::freezing_point(
      equilibria::leighton::terms_of(solution::from_mass_fractions({{"sucrose", 0.375}})));
  CHECK(ok.value > 260.0);
  CHECK(ok.value < constants::ice_point);
}

TEST_CASE("amounts too large for double sums are refused by name", "[robustness][solution]") {
  // 1.7e308 kg of water would make the mole count overflow (NaN mole fractions).
  try {
    solution::from_masses(1.7e308, {{"glucose", 1.0}});
    FAIL("no error");
  } catch (const invalid_input& e) {
    CHECK_THAT(e.what(), Contains("water") && Contains("1e15"));
  }
  CHECK_THROWS_AS(solution::from_molalities({{"NaCl", 1e300}}), invalid_input);
  const auto big = solution::from_masses(1e15, {{"glucose", 1e15}});
  CHECK(std::isfinite(big.water_mole_fraction()));
  CHECK(std::isfinite(big.mole_fraction(0)));
}

TEST_CASE("a water mass too small for the mole fractions is refused by name",
          "[robustness][solution]") {
  // Found by fuzzing: 4.9e-317 kg of water (subnormal) with 0.25 kg of solute gave a
  // water mole fraction of exactly 0. The least water is 1e-12 kg in every factory.
  try {
    solution::from_masses(4.9e-317, {{"sucrose", 0.25}});
    FAIL("no error");
  } catch (const invalid_input& e) {
    CHECK_THAT(e.what(), Contains("water") && Contains("1e-12"));
  }
  CHECK_THROWS_AS(solution::from_molalities({{"NaCl", 1.0}}, 1e-300), invalid_input);
  try {
    solution::from_mass_fractions({{"sucrose", 1.0 - 1e-16}}, 1e-3);
    FAIL("no error");
  } catch (const invalid_input& e) {
    CHECK_THAT(e.what(), Contains("sum of solute mass fractions") && Contains("1e-12"));
  }
  const auto least = solution::from_masses(solution::min_water, {{"glucose", 1e15}});
  CHECK(least.water_mole_fraction() > 0.0);
  CHECK(least.water_mole_fraction() < 1e-20);
}

TEST_CASE("a solution at its own freezing point: no root-finder text, ice fraction 0",
          "[robustness][glycerol]") {
  // Identity: at the initial freezing point no ice has formed yet.
  for (const char* model : {"auto", "norrish", "ideal", "raoult"}) {
    for (double w = 0.02; w < 0.75; w += 0.04) {
      const auto s = solution::from_mass_fractions({{"glycerol", w}});
      const auto fp = equilibria::freezing_point(s, model);
      if (!fp.success()) continue;
      for (double T : {fp.temperature, std::nextafter(fp.temperature, 0.0),
                       std::nextafter(fp.temperature, 400.0)}) {
        INFO(model << " w = " << w << " T = " << T);
        try {
          const auto f = equilibria::ice_fraction(s, T, model);
          CHECK(f.value >= 0.0);
          CHECK(f.value < 1e-6);
        } catch (const std::exception& e) {
          FAIL(e.what());
        }
      }
    }
  }
}

TEST_CASE("the thermal model below a eutectic speaks of the temperature and the eutectic",
          "[robustness][thermal]") {
  thermal::food_composition x;
  x.water = 0.9;
  x.ash = 0.1;
  const thermal::food f(x, solution::from_mass_fractions({{"NaCl", 0.10}}));
  // NaCl-H2O eutectic -21.2 C (Archer 1992): 240 K lies below it.
  try {
    thermal::enthalpy(f, 240.0);
    FAIL("no error");
  } catch (const out_of_validity_range& e) {
    const std::string msg = e.what();
    CHECK(mentions(msg, "temperature = 240 K"));
    CHECK(mentions(msg, "eutectic"));
    CHECK_FALSE(mentions(msg, "stopped"));
    CHECK_FALSE(mentions(msg, "below_eutectic"));
  }
  CHECK_THROWS_AS(thermal::heat_load(f, 280.0, 240.0), out_of_validity_range);
  // Unfrozen phase below the eutectic: NaN masses with the reason, no "water = nan".
  const auto u = equilibria::unfrozen_phase_at(solution::from_mass_fractions({{"NaCl", 0.10}}), 230.0);
  CHECK(u.state == equilibria::phase_state::below_curve_end);
  CHECK_THAT(u.check.reason(), Contains("eutectic"));
  CHECK_FALSE(mentions(u.check.reason(), "nan"));
}

TEST_CASE("curve_fit on data that overflow chi-square fails with a message", "[robustness][fit]") {
  // 1e155 squared overflows double: chi-square is infinite, so nothing can converge.
  Eigen::MatrixXd x(5, 1);
  Eigen::VectorXd y(5);
  for (int i = 0; i < 5; ++i) {
    x(i, 0) = i;
    y[i] = 1e155 * (1.0 + i);
  }
  const auto line = [](const Eigen::MatrixXd& xx, const Eigen::VectorXd& p) -> Eigen::VectorXd {
    return (p[0] + p[1] * xx.col(0).array()).matrix();
  };
  Eigen::VectorXd p0(2);
  p0 << 1.0, 1.0;
  const auto r = fit::curve_fit(line, x, y, p0);
  CHECK_FALSE(r.success());
  CHECK(r.status == fit::fit_status::non_finite);
  CHECK_THAT(r.message, Contains("chi-square"));
  // Non-finite Jacobian: failure too.
  const auto jac = [](const Eigen::MatrixXd& xx, const Eigen::VectorXd&) -> Eigen::MatrixXd {
    Eigen::MatrixXd J(xx.rows(), 2);
    J.setConstant(std::numeric_limits<double>::infinity());
    return J;
  };
  Eigen::VectorXd ys(5);
  for (int i = 0; i < 5; ++i) ys[i] = 2.0 + 3.0 * i + 0.01 * (i % 2);
  const auto rj = fit::curve_fit(line, x, ys, p0, {}, {}, jac);
  CHECK_FALSE(rj.success());
  CHECK(rj.status == fit::fit_status::non_finite);
}

TEST_CASE("an ice curve without a located salt onset answers without undefined behaviour",
          "[robustness][ice_curve]") {
  // Input found by fuzz/fuzz_solution.cpp (fuzz/corpus/regression_empty_salt_path): the
  // ice-only solve failed while the curve looked for its first salt, and at() then read
  // the last of no segments. Any answer is fine if it is a state (values or a reason).
  const auto s = solution::from_molalities(
      {{"K2SO4", 0.2898}, {"glucose", 0.559}, {"milk_salts", 1.231}}, 0.3657);
  for (const char* model : {"ross", "auto", "pitzer"}) {
    equilibria::ice_curve curve(s, model);
    for (double T : {250.84, 233.15, 225.0}) {
      const auto st = curve.at(T);
      INFO(model << " T = " << T << ": " << st.check.reason());
      if (st.success()) {
        CHECK(st.ice >= 0.0);
        CHECK(st.ice <= st.total_water);
      } else {
        CHECK_FALSE(st.check.in_range());
      }
    }
  }
}

TEST_CASE("an infinitesimal amount of any solute gives an osmotic coefficient of 1",
          "[robustness][osmotic]") {
  // Limiting law (common practice: phi -> 1 as m -> 0). Found by fuzzing: 1.9e-77 kg of
  // lactic acid (negative Norrish K) gave phi = -5.8e-78, because n_total - n_w rounded
  // to 0 and the K x^2 term then made ln a_w positive.
  const auto& records = data::builtin_solutes().records();
  const auto ids = models::builtin_models().ids();
  int evaluated = 0;
  for (double m : {1e-300, 1e-77, 1e-30, 1e-12})
    for (const auto& rec : records)
      for (const auto& id : ids) {
        const auto s = solution::from_molalities({{rec.id, m}});
        double phi = 0.0;
        try {
          phi = models::osmotic_coefficient(s, 260.0, id, range_policy::extrapolate).value;
        } catch (const invalid_input&) {
          continue;  // the model does not take this solute
        }
        ++evaluated;
        INFO(rec.id << " with model " << id << " at " << m << " mol/kg");
        CHECK(std::fabs(phi - 1.0) < 1e-5);
      }
  CHECK(evaluated > 300);
}
