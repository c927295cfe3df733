// Ethanol-water: the Norrish record in the effective volume fraction (models/norrish.hpp,
// constants from tools/fit_crc_norrish.py) against the CRC Handbook freezing points, the
// proof that ln a_w falls strictly with the ethanol mole fraction, and ice curves of
// spirits and cocktails, which freeze-concentrate to 50-70 wt% ethanol.
#include <catch2/catch.hpp>
#include <algorithm>
#include <array>
#include <cmath>
#include <string>
#include <vector>

#include "colligate/core/constants.hpp"
#include "colligate/data/builtin_solutes.hpp"
#include "colligate/equilibria/freezing_point.hpp"
#include "colligate/equilibria/ice_fraction.hpp"
#include "colligate/models/water_activity.hpp"
#include "../crc_reference.hpp"

using namespace colligate;
using Catch::Matchers::WithinAbs;

namespace {

const data::norrish_constants& ethanol_constants() {
  return data::builtin_solutes().find("ethanol").norrish;
}

/// q(z) = r + (1 - z)(1 - (1 - r) z)(2 K z + 3 K3 z^2 + 4 K4 z^3) as coefficients of z^0..z^5.
/// For ln a_w = ln(1 - x) - (K z^2 + K3 z^3 + K4 z^4), z = x / (x + r (1 - x)):
///     d ln a_w / dx = -(1 - (1 - r) z) / (r (1 - z)) * q(z),
/// and the prefactor is positive on [0, 1), so ln a_w falls strictly in x iff q > 0 there.
std::array<double, 6> monotonicity_polynomial(const data::norrish_constants& n) {
  const double r = n.volume_ratio;
  const std::array<double, 3> a = {1.0, -(2.0 - r), 1.0 - r};  // (1 - z)(1 - (1 - r) z)
  const std::array<double, 4> b = {0.0, 2.0 * n.k, 3.0 * n.k3, 4.0 * n.k4};  // P'(z)
  std::array<double, 6> q{};
  for (std::size_t i = 0; i < a.size(); ++i)
    for (std::size_t j = 0; j < b.size(); ++j) q[i + j] += a[i] * b[j];
  q[0] += r;
  return q;
}

double polyval(const std::array<double, 6>& c, double z) {
  double v = 0.0;
  for (std::size_t j = c.size(); j-- > 0;) v = c[j] + z * v;
  return v;
}

/// CRC ethanol rows held out of the fit (tools/fit_crc_norrish.py: the fit used every other
/// row from the first, 0.5, 2, 4, ..., 20, 24, 28, ..., 68 wt%).
bool held_out(double percent) {
  if (percent <= 20.0) return std::fmod(percent, 2.0) == 1.0;  // 1, 3, ..., 19
  return std::fmod(percent - 22.0, 4.0) == 0.0;                 // 22, 26, ..., 66
}

double ice_fraction_at(const solution& s, double T, const models::model_choice& m = "auto") {
  const auto u = equilibria::unfrozen_phase_at(s, T, m);
  INFO("T = " << T << " K: " << to_string(u.status) << " " << u.check.reason());
  REQUIRE(u.success());
  return u.ice_fraction();
}

}  // namespace

TEST_CASE("ethanol record: volume-fraction constants to 68 wt%", "[models][norrish][ethanol]") {
  const auto& n = ethanol_constants();
  CHECK(n.available);
  CHECK(n.volume_ratio != 1.0);
  CHECK(n.max_mass_fraction == 0.68);
  CHECK(n.k3_source == "colligate_fit_crc");
  // The single-solute form, written out: ln a_w = ln x_w - K z^2 - K3 z^3 - K4 z^4 (identity
  // up to rounding, 1e-13 absolute).
  const auto s = solution::from_mass_fractions({{"ethanol", 0.4}});
  const double nw = s.water_mass() / constants::molar_mass_water;
  const double x = s.moles()[0] / (nw + s.moles()[0]);
  const double z = x / (x + n.volume_ratio * (1.0 - x));
  const double expected = std::log(1.0 - x) - n.k * z * z - n.k3 * z * z * z - n.k4 * z * z * z * z;
  CHECK_THAT(models::ln_water_activity("norrish", s, s.water_mass(), 260.0),
             WithinAbs(expected, 1e-13));
}

TEST_CASE("ethanol freezing points vs CRC Handbook held-out rows, 10-50 wt%",
          "[models][norrish][ethanol][crc]") {
  // CRC Handbook of Chemistry and Physics, 102nd ed. (2021), concentrative properties
  // (tests/reference/crc_freezing_points.csv). These rows were not used in the fit.
  // Tolerance 0.40 K: the minimax fit leaves 0.35 K on its own rows, a level set by a wave
  // of about +-0.3 K in the CRC ethanol column against Melinder's (2010) evaluated curve
  // (30-34 and 40-46 wt%), which no smooth curve follows; held-out rows at 10-50 wt% reach
  // 0.34 K (22 wt%), and 0.05 K is left for rounding of the published depressions.
  int rows = 0;
  double worst = 0.0;
  for (const auto& row : colligate_test::read_reference("crc_freezing_points.csv")) {
    if (row.at("solute") != "ethanol" || colligate_test::doubtful_crc_row(row)) continue;
    const double percent = std::stod(row.at("mass_percent"));
    if (percent < 10.0 || percent > 50.0 || !held_out(percent)) continue;
    const auto r = equilibria::freezing_point(solution::from_mass_fractions({{"ethanol", percent / 100.0}}));
    REQUIRE(r.success());
    INFO(percent << " wt%");
    CHECK(r.check.in_range());
    const double dT = constants::ice_point - r.temperature;
    CHECK_THAT(dT, WithinAbs(std::stod(row.at("depression_K")), 0.40));
    worst = std::max(worst, std::abs(dT - std::stod(row.at("depression_K"))));
    ++rows;
  }
  INFO("worst held-out deviation " << worst << " K");
  CHECK(rows == 13);  // 11, 13, 15, 17, 19, 22, 26, ..., 50 wt%
}

TEST_CASE("ethanol freezing points over the whole CRC table, 0.5-68 wt%",
          "[models][norrish][ethanol][crc]") {
  // Same table, every row (fit and held out): 0.40 K as above. Above 54 wt% the freezing
  // point lies below 233.15 K, where the ice equilibrium is extrapolated and flagged.
  int rows = 0;
  const double worst = colligate_test::worst_crc_deviation("ethanol", 68, rows);
  INFO(rows << " rows, worst deviation " << worst << " K");
  CHECK(rows == 45);
  CHECK(worst < 0.40);
}

TEST_CASE("ethanol: ln a_w falls strictly with the ethanol mole fraction, 0 <= x < 1",
          "[models][norrish][ethanol][monotonic]") {
  const auto& n = ethanol_constants();
  const double r = n.volume_ratio;
  // (1) Proof on the constants. q is a quintic; |q'(z)| <= L = sum j |q_j| on [0, 1]. Every z
  // in [0, 1] lies within h/2 of a grid point, so min over the grid of q > L h / 2 proves
  // q > 0 on all of [0, 1], hence d ln a_w / dx < 0 for every x in [0, 1).
  const auto q = monotonicity_polynomial(n);
  double L = 0.0;
  for (std::size_t j = 1; j < q.size(); ++j) L += static_cast<double>(j) * std::abs(q[j]);
  const int N = 200000;
  const double h = 1.0 / N;
  double q_min = q[0];
  for (int i = 0; i <= N; ++i) q_min = std::min(q_min, polyval(q, i * h));
  INFO("min q = " << q_min << ", L h / 2 = " << L * h / 2);
  CHECK(q_min > L * h / 2);
  CHECK(q_min > 0.2 * r);  // margin: the slope stays at least a fifth of Raoult's law's

  // (2) The same on the model's own arithmetic: the derivative sign at dense x, by the
  // analytic derivative of the record's form, and ln a_w from models::norrish falling
  // between consecutive points of a dense x grid reaching x = 1 - 1e-11.
  const auto one = solution::from_molalities({{"ethanol", 1.0}});  // 1 mol ethanol
  double previous = 0.0, first_bad_x = NAN;
  int steps = 0, bad = 0;
  for (int i = 0; i <= 100000; ++i) {
    // x from 1e-6 to 1 - 1e-11, dense in logit(x): n_w = exp(-t) mol of water per mol
    // of ethanol, x = 1 / (1 + n_w), 1 - x = n_w / (1 + n_w)
    const double t = -13.8 + (25.3 + 13.8) * i / 100000.0;
    const double n_w = std::exp(-t);
    const double x = 1.0 / (1.0 + n_w), x_w = n_w / (1.0 + n_w);
    const double z = x / (x + r * x_w);
    const double dz_dx = r / ((x + r * x_w) * (x + r * x_w));
    const double slope = -1.0 / x_w - (2 * n.k * z + 3 * n.k3 * z * z + 4 * n.k4 * z * z * z) * dz_dx;
    const double water_kg = n_w * constants::molar_mass_water;
    const double lnaw = models::ln_water_activity("norrish", one, water_kg, 250.0);
    const bool ok = slope < 0.0 && std::isfinite(lnaw) && (i == 0 || lnaw < previous);
    if (!ok && bad++ == 0) first_bad_x = x;
    if (i > 0) ++steps;
    previous = lnaw;
  }
  INFO("first x where the slope is not negative: " << first_bad_x);
  CHECK(bad == 0);
  CHECK(steps == 100000);
}

TEST_CASE("ethanol in mixtures: ln a_w falls as water is removed, to the last drop",
          "[models][norrish][ethanol][monotonic]") {
  // Along freeze concentration every mole fraction is x_i = f_i s, s = 1 - x_w, with fixed
  // particle fractions f_i (sum 1). d ln a_w / ds = -1/(1 - s) + sum_i f_i E_i'(f_i s) +
  // (Chirife sqrt term, -2 s (sum sqrt(K_i) f_i)^2 <= 0). Ethanol's binary monotonicity,
  // E'(x) < 1/(1 - x), with x = f s <= s gives f E'(f s) < f / (1 - s); summed over the
  // solutes whose own terms rise, that stays below 1/(1 - s). So the mixture's ln a_w falls
  // strictly as water is removed whenever the other solutes' own terms do not rise (sugars
  // and citric acid: K > 0, no higher terms; ions: Raoult particles). Checked below on the
  // model's arithmetic, water from the recipe's down to 1e-9 of it, dense in ln W.
  const std::vector<solution> mixtures = {
      solution::from_mass_fractions({{"ethanol", 0.10}, {"sucrose", 0.15}, {"citric_acid", 0.01}}),
      solution::from_mass_fractions({{"ethanol", 0.30}, {"sucrose", 0.02}, {"citric_acid", 0.005}}),
      solution::from_mass_fractions({{"ethanol", 0.05}, {"glucose", 0.10}, {"fructose", 0.10}}),
      solution::from_mass_fractions({{"ethanol", 0.08}, {"sucrose", 0.10}, {"sodium_chloride", 0.002}}),
  };
  for (const auto& s : mixtures) {
    double previous = -INFINITY, first_bad_W = NAN;
    int bad = 0;
    for (int i = 0; i <= 20000; ++i) {
      const double W = s.water_mass() * std::exp(-20.7 + 20.7 * i / 20000.0);  // rising W
      const double lnaw = models::ln_water_activity("norrish", s, W, 250.0);
      if (!(std::isfinite(lnaw) && lnaw > previous) && bad++ == 0) first_bad_W = W;
      previous = lnaw;
    }
    INFO(s.size() << " solutes; first water mass where ln a_w does not rise: " << first_bad_W);
    CHECK(bad == 0);
    // and so the ice equilibrium has a root at every temperature: the unfrozen water at
    // -57.65 C (215.5 K, just above the 215 K end of a_w,ice, water/ice.hpp) is finite and
    // positive.
    const auto u = equilibria::unfrozen_phase_at(s, water::ice_model_lowest_temperature + 0.5, "norrish");
    CHECK(u.success());
    CHECK(u.unfrozen_water > 0.0);
    CHECK(u.ice_fraction() < 1.0);
  }
}

TEST_CASE("ethanol 10-50 wt%: ice fraction 2, 5 and 10 K below the freezing point",
          "[equilibria][ice_fraction][ethanol]") {
  // Each solution freeze-concentrates to 50-70 wt% ethanol within 10 K (issue 10: the old
  // constants turned ln a_w upward there and the root bracket failed from 20 wt% up).
  for (double w : {0.10, 0.20, 0.30, 0.40, 0.50}) {
    const auto s = solution::from_mass_fractions({{"ethanol", w}});
    const auto fp = equilibria::freezing_point(s);
    REQUIRE(fp.success());
    double previous = 0.0;
    for (double below : {2.0, 5.0, 10.0}) {
      INFO(w * 100 << " wt%, " << below << " K below the freezing point " << fp.temperature);
      const double f = ice_fraction_at(s, fp.temperature - below);
      CHECK(std::isfinite(f));
      CHECK(f > 0.0);
      CHECK(f < 1.0);
      CHECK(f > previous);
      previous = f;
      // the checked API with the default policy does not throw either
      CHECK(std::isfinite(equilibria::ice_fraction(s, fp.temperature - below).value));
    }
  }
}

TEST_CASE("40 % ABV spirit and a cocktail: ice curve finite and monotone to -40 C",
          "[equilibria][ice_fraction][ethanol]") {
  // 40 % ABV is 33.4 wt% ethanol (OIML R 22 alcoholometric tables, common practice);
  // the cocktail: spirit, sugar, citrus acid and water (a frozen daiquiri-like mix).
  const std::vector<solution> drinks = {
      solution::from_mass_fractions({{"ethanol", 0.334}}),
      solution::from_mass_fractions({{"ethanol", 0.10}, {"sucrose", 0.15}, {"citric_acid", 0.01}}),
      solution::from_mass_fractions({{"ethanol", 0.15}, {"sucrose", 0.08}, {"citric_acid", 0.006}}),
  };
  for (const auto& s : drinks) {
    const auto fp = equilibria::freezing_point(s);
    REQUIRE(fp.success());
    CHECK(fp.temperature > constants::ice_point - 40.0);
    double previous = 0.0;
    for (double T = fp.temperature - 0.1; T >= constants::ice_point - 40.0; T -= 0.25) {
      INFO(s.size() << " solutes, freezing point " << fp.temperature << " K");
      const double f = ice_fraction_at(s, T);
      CHECK(std::isfinite(f));
      CHECK(f > previous);
      CHECK(f < 1.0);
      previous = f;
    }
  }
}
