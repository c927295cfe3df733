// The fast paths for models whose ln a_w does not depend on T (ideal, Raoult, Norrish):
// the freezing point through the interpolated inverse of the ice line and the ice fraction
// by Newton with the closed-form d ln a_w / dW, against the general paths they replace,
// over random solutions (invented compositions). Identities; the tolerances are those the
// paths are required to keep (1e-9 K, 1e-12 relative; common practice).
#include <catch2/catch.hpp>
#include <algorithm>
#include <cmath>
#include <random>
#include <string>
#include <vector>

#include "colligate/core/constants.hpp"
#include "colligate/core/roots.hpp"
#include "colligate/equilibria/detail/unfrozen_water_newton.hpp"
#include "colligate/equilibria/freezing_point.hpp"
#include "colligate/equilibria/ice_curve.hpp"
#include "colligate/models/water_activity.hpp"
#include "colligate/water/ice.hpp"

using namespace colligate;

namespace {

const std::vector<std::string> species = {"sucrose", "glucose", "fructose", "lactose",
                                          "glycerol", "citric_acid", "ethanol", "lactic_acid"};

/// A random mixture of up to eight non-electrolytes, total solids up to `max_total`.
solution random_solution(std::mt19937_64& rng, double max_total) {
  std::uniform_real_distribution<double> u(0.0, 1.0);
  std::vector<named_amount> f;
  double total = max_total * u(rng);
  std::vector<double> w(species.size());
  double sw = 0.0;
  for (auto& x : w) sw += (x = u(rng) < 0.3 ? 0.0 : u(rng));
  if (sw == 0.0) w[0] = sw = 1.0;
  for (std::size_t i = 0; i < species.size(); ++i)
    if (w[i] > 0.0) f.push_back({species[i], total * w[i] / sw});
  return solution::from_mass_fractions(f);
}

}  // namespace

TEST_CASE("freezing point through the inverse ice line equals the Newton inverse within 1e-9 K",
          "[equilibria][fast]") {
  std::mt19937_64 rng(17);
  for (const char* model : {"norrish", "raoult", "ideal"}) {
    double worst = 0.0;
    int compared = 0;
    for (int i = 0; i < 3000; ++i) {
      const solution s = random_solution(rng, 0.45);
      models::ln_water_activity_evaluator ln_aw(model, s);
      const auto r = equilibria::freezing_point(s, model, 0.0, ln_aw);
      // The path before the inverse: Newton on ice.hpp from the ice point down to 223.15 K.
      const double before = water::temperature_of_ice_equilibrium(
          ln_aw(s.water_mass(), constants::ice_point), equilibria::search_min_temperature);
      if (std::isnan(before)) {
        CHECK(r.status == equilibria::solve_status::below_search_limit);
        continue;
      }
      REQUIRE(r.success());
      worst = std::max(worst, std::abs(r.temperature - before));
      ++compared;
    }
    INFO(model << ": " << compared << " solutions, worst difference " << worst << " K");
    CHECK(compared > 2000);
    CHECK(worst < 1e-9);
  }
}

TEST_CASE("closed-form d ln a_w / dW agrees with a central difference", "[models][fast]") {
  // Central difference with h = 1e-5 W: truncation about 1e-10 relative, rounding about
  // 1e-11 / 1e-5; 1e-6 relative leaves room for both (common practice).
  std::mt19937_64 rng(3);
  for (const char* model : {"norrish", "raoult", "ideal"}) {
    for (int i = 0; i < 200; ++i) {
      const solution s = random_solution(rng, 0.6);
      models::ln_water_activity_evaluator ln_aw(model, s);
      const double W = s.water_mass(), h = 1e-5 * W;
      double l = 0.0, slope = 0.0;
      REQUIRE(ln_aw.with_slope(W, 263.15, l, slope));
      CHECK(l == ln_aw(W, 263.15));  // bit-identical value
      const double fd = (ln_aw(W + h, 263.15) - ln_aw(W - h, 263.15)) / (2.0 * h);
      INFO(model << " row " << i);
      CHECK_THAT(slope, Catch::Matchers::WithinRel(fd, 1e-6));
    }
  }
}

TEST_CASE("ice fraction by Newton on the water mass or in closed form equals the TOMS 748 solve within 1e-12",
          "[equilibria][fast]") {
  std::mt19937_64 rng(29);
  std::uniform_real_distribution<double> u(0.0, 1.0);
  for (const char* model : {"norrish", "raoult", "ideal"}) {
    double worst_water = 0.0, worst_ice = 0.0;
    int compared = 0, most_iterations = 0, by_newton = 0, by_closed = 0, most_closed = 0;
    double worst_closed = 0.0;
    for (int i = 0; i < 2000; ++i) {
      const solution s = random_solution(rng, 0.4);
      const double T = 273.0 - 40.0 * u(rng);
      equilibria::ice_curve curve(s, model);
      const auto r = curve.at(T);
      models::ln_water_activity_evaluator ln_aw(model, s);
      const double L = water::ln_water_activity_of_ice(T);
      if (!(ln_aw(s.water_mass(), T) > L)) continue;  // not frozen at T
      REQUIRE(r.success());
      // The path before: TOMS 748 on u = ln W_u (core/roots.hpp).
      const auto root = solve_on_log_water([&](double v) { return ln_aw(std::exp(v), T) - L; },
                                           std::log(s.water_mass()));
      REQUIRE(root.status == root_status::converged);
      const double Wu = std::exp(root.x);
      // The Newton path itself: where it converges the curve used it (same step count);
      // where it gives up (a step leaving the bracket before its lower end is known) the
      // curve fell back on TOMS 748. It must carry nearly every state, or this comparison
      // would not test it.
      const auto newton = equilibria::detail::unfrozen_water_by_slope(ln_aw, s.water_mass(), T, L);
      // A model's own closed-form solve (Norrish: Halley on the total solute mole fraction)
      // goes first; the curve then reports its step count.
      double W_closed = 0.0;
      int closed_iterations = 0;
      if (ln_aw.water_for_ln_activity(s.water_mass(), T, L, W_closed, closed_iterations)) {
        ++by_closed;
        CHECK(closed_iterations <= 6);
        most_closed = std::max(most_closed, closed_iterations);
        CHECK(r.iterations == closed_iterations);
        CHECK(r.unfrozen_water == W_closed);
        worst_closed = std::max(worst_closed, std::abs(W_closed - Wu) / Wu);
      } else if (newton.status == root_status::converged) {
        ++by_newton;
        CHECK(newton.iterations <= 8);
        most_iterations = std::max(most_iterations, newton.iterations);
        CHECK(r.iterations == newton.iterations);
      }
      const double ice = s.water_mass() - Wu;
      worst_water = std::max(worst_water, std::abs(r.unfrozen_water - Wu) / Wu);
      if (ice / s.water_mass() > 0.01)  // near the freezing point ice is a difference of two close numbers
        worst_ice = std::max(worst_ice, std::abs(r.ice_fraction() - ice / s.water_mass()) /
                                            (ice / s.water_mass()));
      ++compared;
    }
    INFO(model << ": " << compared << " frozen states, worst relative difference: unfrozen water "
               << worst_water << ", ice fraction " << worst_ice << "; " << by_newton
               << " by Newton, at most "
               << most_iterations << " Newton steps; " << by_closed << " in closed form, at most "
               << most_closed << " Halley steps, worst relative difference " << worst_closed);
    CHECK(compared > 500);
    CHECK(by_newton + by_closed >= 0.99 * compared);
    CHECK(worst_closed < 1e-12);
    // Norrish solves in closed form every state without an effective-volume-fraction term
    // (ethanol): about 30 % of these random mixtures (each solute present with p = 0.7).
    if (std::string(model) == "norrish") CHECK(by_closed > 0.2 * compared);
    else CHECK(by_closed == 0);
    CHECK(worst_water < 1e-12);
    CHECK(worst_ice < 1e-12);
  }
}

TEST_CASE("Norrish closed-form water solve: ln a_w at the result is the target, ethanol declines",
          "[models][fast]") {
  // Identity (common practice): the water mass returned puts the model's own sum
  // (norrish::ln_water_activity) on the target to rounding; a solution with an
  // effective-volume-fraction term (ethanol) is left to the general Newton.
  std::mt19937_64 rng(31);
  std::uniform_real_distribution<double> u(0.0, 1.0);
  int solved = 0, declined_with_ethanol = 0, with_ethanol = 0;
  double worst = 0.0;
  for (int i = 0; i < 2000; ++i) {
    const solution s = random_solution(rng, 0.5);
    bool ethanol = false;
    for (const auto& rec : s.species()) ethanol = ethanol || rec.id == "ethanol";
    models::ln_water_activity_evaluator ln_aw("norrish", s);
    const double W = s.water_mass();
    const double target = ln_aw(W, 263.15) - 0.5 * u(rng);  // below a_w at W: a root below W
    double Wu = 0.0;
    int iterations = 0;
    const bool ok = ln_aw.water_for_ln_activity(W, 263.15, target, Wu, iterations);
    if (ethanol) {
      ++with_ethanol;
      if (!ok) ++declined_with_ethanol;
      continue;
    }
    if (!ok) continue;
    ++solved;
    CHECK(Wu < W);
    worst = std::max(worst, std::abs(ln_aw(Wu, 263.15) - target) / std::abs(target));
  }
  INFO(solved << " solved, worst relative residual " << worst);
  CHECK(with_ethanol > 100);
  CHECK(declined_with_ethanol == with_ethanol);
  CHECK(solved > 300);
  CHECK(worst < 1e-13);  // 1e-13: a few hundred ulps of ln a_w (the sum and the t form round differently)
}
