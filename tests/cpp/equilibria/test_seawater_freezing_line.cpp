// The seawater freezing line (equilibria/seawater_freezing_line.hpp) and its batch
// (batch/seawater_freezing_points.hpp): the series against the model's exact freezing
// points, the batch against the scalar line bit for bit on any thread count, rows above the
// line through the exact path, and bad salinities. Check values: the exact path of the
// same model (identities); TEOS-10 at SA 35.16504 g/kg, -1.919 C, p = 0, air-free (IOC,
// SCOR & IAPSO 2010; gsw.t_freezing), within the model's own 0.003 K of it.
#include <catch2/catch.hpp>
#include <cmath>
#include <cstdint>
#include <limits>
#include <vector>

#include "colligate/batch/seawater_freezing_points.hpp"
#include "colligate/equilibria/seawater_freezing_line.hpp"

using namespace colligate;
using equilibria::seawater_freezing_line;

TEST_CASE("the seawater freezing line equals the model's exact freezing points",
          "[equilibria][pitzer][seawater]") {
  const auto& line = equilibria::default_seawater_freezing_line();
  // Built and checked against the model at its check points (construction throws above
  // the tolerance); the difference found there is at the solver's rounding level.
  CHECK(line.largest_difference() <= seawater_freezing_line::tolerance);
  // A denser grid than the check points, including salinities near 0 where the series
  // in sqrt(SA) matters, and both ends.
  double worst = 0.0;
  for (int k = 0; k <= 400; ++k) {
    const double SA = seawater_freezing_line::max_salinity * std::pow(k / 400.0, 1.5);
    const double exact =
        equilibria::seawater_first_solid_temperature(SA, models::model_choice("pitzer")).value;
    worst = std::max(worst, std::abs(line(SA) - exact));
  }
  INFO("largest difference " << worst << " K");
  CHECK(worst <= 1e-10);
  CHECK(line(0.0) == constants::ice_point);
  // TEOS-10, SA 35.16504 g/kg: -1.919 C (IOC, SCOR & IAPSO 2010, gsw.t_freezing air-free);
  // the model is within 0.003 K of TEOS-10 (tests/python/test_electrolytes.py).
  CHECK(line(35.16504) - constants::celsius_offset == Approx(-1.919).margin(0.003));
  // Off the line: NaN.
  CHECK(std::isnan(line(seawater_freezing_line::max_salinity * 1.0001)));
  CHECK(std::isnan(line(-1.0)));
  CHECK(std::isnan(line(std::numeric_limits<double>::quiet_NaN())));
}

TEST_CASE("a line of another parameter set is its own model's",
          "[equilibria][pitzer][seawater]") {
  models::model_options o;
  o.parameter_set = "spencer_1990";
  const models::model_choice m("pitzer", o);
  const seawater_freezing_line line(m);
  CHECK(line.largest_difference() <= seawater_freezing_line::tolerance);
  const double exact = equilibria::seawater_first_solid_temperature(20.0, m).value;
  CHECK(std::abs(line(20.0) - exact) <= 1e-10);
  // The two sets differ, so the lines do (by more than the series' error).
  CHECK(std::abs(line(35.0) - equilibria::default_seawater_freezing_line()(35.0)) > 1e-6);
  // A set whose validated range (293.15-303.15 K) misses the freezing line: refused, the
  // reason named.
  models::model_options h;
  h.parameter_set = "harvie_1984";
  CHECK_THROWS_WITH(seawater_freezing_line(models::model_choice("pitzer", h)),
                    Catch::Contains("leaves its validated range") && Catch::Contains("exact path"));
}

TEST_CASE("seawater freezing points by salinity: batch equals the scalar line on any thread count",
          "[batch][seawater]") {
  const auto& line = equilibria::default_seawater_freezing_line();
  std::vector<double> SA;
  for (int k = 0; k < 1003; ++k) SA.push_back(60.0 * k / 1002.0);  // on and above the line
  SA.push_back(0.0);
  SA.push_back(-0.5);                                      // invalid
  SA.push_back(std::numeric_limits<double>::quiet_NaN());  // invalid
  SA.push_back(120.0);                                     // invalid: seawater() refuses it
  const std::size_t n = SA.size();
  std::vector<double> one(n), two(n), five(n);
  std::vector<std::uint8_t> s1(n), s2(n), s5(n);
  batch::options opt;
  opt.threads = 1;
  batch::seawater_freezing_points(SA.data(), n, opt, one.data(), s1.data());
  opt.threads = 2;
  batch::seawater_freezing_points(SA.data(), n, opt, two.data(), s2.data());
  opt.threads = 5;
  batch::seawater_freezing_points(SA.data(), n, opt, five.data(), s5.data());
  // The exact batch path on the rows above the line.
  std::vector<double> above;
  for (std::size_t i = 0; i < n; ++i) {
    INFO("row " << i << ", SA " << SA[i]);
    CHECK(s1[i] == s2[i]);
    CHECK(s1[i] == s5[i]);
    const bool same = (std::isnan(one[i]) && std::isnan(two[i]) && std::isnan(five[i])) ||
                      (one[i] == two[i] && one[i] == five[i]);
    CHECK(same);
    if (std::isfinite(SA[i]) && SA[i] >= 0.0 && SA[i] <= seawater_freezing_line::max_salinity) {
      CHECK(s1[i] == static_cast<std::uint8_t>(batch::row_status::ok));
      CHECK(one[i] == line(SA[i]));  // bit for bit
    } else if (std::isfinite(SA[i]) && SA[i] > seawater_freezing_line::max_salinity && SA[i] < 120.0) {
      // The exact path: the model's first-solid temperature.
      const double exact =
          equilibria::seawater_first_solid_temperature(SA[i], models::model_choice("pitzer")).value;
      CHECK(std::abs(one[i] - exact) <= 1e-9);
      CHECK(s1[i] == static_cast<std::uint8_t>(batch::row_status::ok));
    } else {
      CHECK(s1[i] == static_cast<std::uint8_t>(batch::row_status::invalid_input));
      CHECK(std::isnan(one[i]));
    }
  }
  // Continuous across the line's end: the series and the exact path meet there.
  const double a = line(seawater_freezing_line::max_salinity);
  const double b = equilibria::seawater_first_solid_temperature(seawater_freezing_line::max_salinity,
                                                                models::model_choice("pitzer")).value;
  CHECK(std::abs(a - b) <= 1e-10);
}
