// Freezing times with their standard uncertainty: the closed-form partial derivatives of
// Plank's and Pham's formulas against Richardson-extrapolated differences, the chain through
// a fitted solute's constants, delta method against Monte Carlo, and the simulation's Monte
// Carlo. Finite differences appear here only, as references: the library never uses them.
#include <catch2/catch.hpp>
#include <cmath>
#include <functional>
#include <string>
#include <vector>

#include "../crc_reference.hpp"
#include "../uncertainty_checks.hpp"
#include "colligate/equilibria/prediction_uncertainty.hpp"
#include "colligate/fit/fitters.hpp"
#include "colligate/thermal/freezing_time_uncertainty.hpp"

using namespace colligate;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;

namespace {

/// Richardson extrapolation of central differences with steps h and h/2: error O(h^4).
double richardson(const std::function<double(double)>& f, double x, double h) {
  const auto central = [&](double s) { return (f(x + s) - f(x - s)) / (2.0 * s); };
  return (4.0 * central(h / 2.0) - central(h)) / 3.0;
}

/// Norrish K and K3 fitted to the CRC Handbook sucrose freezing points to 42 wt%
/// (source key crc_concentrative, "Concentrative properties of aqueous solutions", sucrose
/// rows of tests/reference/crc_freezing_points.csv, printed to 0.01 K; doubtful rows left
/// out): the fitted solute of the product below.
data::solute_record crc_fitted_sucrose() {
  const auto r = colligate_test::crc_sucrose_fit(true);
  REQUIRE(r.success());
  // molar mass of sucrose 0.3422965 kg/mol (common practice, IUPAC atomic weights)
  return fit::norrish_solute_record(r, "my_sucrose", "my sucrose", 0.3422965, 0.42, "test");
}

/// A sucrose gel: 30 % of the water phase is the fitted sucrose (invented demo product,
/// 70 % water, 30 % carbohydrate).
thermal::food fitted_product() {
  const data::solute_table table({crc_fitted_sucrose()});
  thermal::food_composition x;
  x.water = 0.70;
  x.carbohydrate = 0.30;
  return thermal::food(x, solution::from_mass_fractions({{"my_sucrose", 0.30}}, 1.0, table), 0.0, "norrish");
}

/// A 5 cm slab from +5 C in -35 C air, h = 20 W/(m^2 K), to -18 C at the centre
/// (common practice for an air-blast freezer; invented demo process).
thermal::freezing_process blast_freezer() {
  thermal::freezing_process p;
  p.shape = thermal::body_shape::slab;
  p.size = 0.05;
  p.initial_temperature = 278.15;
  p.medium_temperature = 238.15;
  p.h = 20.0;
  p.target_temperature = 255.15;
  return p;
}

}  // namespace

TEST_CASE("Plank's partial derivatives equal Richardson-extrapolated differences",
          "[thermal][freezing_time][uncertainty]") {
  // Identity check (no literature): inputs of the order of a beef slab (invented).
  const auto shape = thermal::body_shape::sphere;
  const double a = 0.06, rho = 1050.0, L = 250e3, Tf = 271.9, Tm = 243.15, h = 25.0, k = 1.4;
  const auto d = thermal::plank_time_partials(shape, a, rho, L, Tf, Tm, h, k);
  const auto t = [&](double a_, double rho_, double L_, double Tf_, double Tm_, double h_, double k_) {
    return thermal::plank_time(shape, a_, rho_, L_, Tf_, Tm_, h_, k_);
  };
  // Richardson error O(h^4) with steps 1e-3 of each input: below 1e-9 relative here.
  const double tol = 1e-8;
  CHECK_THAT(d.size, WithinRel(richardson([&](double v) { return t(v, rho, L, Tf, Tm, h, k); }, a, 1e-3 * a), tol));
  CHECK_THAT(d.density, WithinRel(richardson([&](double v) { return t(a, v, L, Tf, Tm, h, k); }, rho, 1.0), tol));
  CHECK_THAT(d.latent_heat, WithinRel(richardson([&](double v) { return t(a, rho, v, Tf, Tm, h, k); }, L, 100.0), tol));
  CHECK_THAT(d.freezing_temperature,
             WithinRel(richardson([&](double v) { return t(a, rho, L, v, Tm, h, k); }, Tf, 0.01), tol));
  CHECK_THAT(d.medium_temperature,
             WithinRel(richardson([&](double v) { return t(a, rho, L, Tf, v, h, k); }, Tm, 0.01), tol));
  CHECK_THAT(d.h, WithinRel(richardson([&](double v) { return t(a, rho, L, Tf, Tm, v, k); }, h, 0.01), tol));
  CHECK_THAT(d.k_frozen, WithinRel(richardson([&](double v) { return t(a, rho, L, Tf, Tm, h, v); }, k, 1e-3), tol));
}

TEST_CASE("Pham's partial derivatives equal Richardson-extrapolated differences",
          "[thermal][freezing_time][uncertainty]") {
  // Identity check (no literature): a 5 cm slab from +5 C in -30 C air (invented inputs).
  thermal::pham_inputs in;
  in.size = 0.05;
  in.shape_factor = 1.0;
  in.initial_temperature = 278.15;
  in.medium_temperature = 243.15;
  in.centre_temperature = 255.15;
  in.density_unfrozen = 1070.0;
  in.density_frozen = 1000.0;
  in.specific_heat_unfrozen = 3600.0;
  in.specific_heat_frozen = 1900.0;
  in.latent_heat = 230e3;
  in.k_frozen = 1.3;
  in.h = 20.0;
  const auto d = thermal::pham_time_partials(in);
  const auto check = [&](const char* name, double analytic, double thermal::pham_inputs::*field, double step) {
    auto f = [&](double v) {
      auto q = in;
      q.*field = v;
      return thermal::pham_time(q);
    };
    const double ref = richardson(f, in.*field, step);
    INFO(name << ": analytic " << analytic << ", Richardson " << ref);
    CHECK_THAT(analytic, WithinRel(ref, 1e-8) || WithinAbs(ref, 1e-9 * d.time));
  };
  check("size", d.size, &thermal::pham_inputs::size, 1e-4);
  check("E", d.shape_factor, &thermal::pham_inputs::shape_factor, 1e-3);
  check("T_i", d.initial_temperature, &thermal::pham_inputs::initial_temperature, 0.01);
  check("T_m", d.medium_temperature, &thermal::pham_inputs::medium_temperature, 0.01);
  check("T_c", d.centre_temperature, &thermal::pham_inputs::centre_temperature, 0.01);
  check("rho_u", d.density_unfrozen, &thermal::pham_inputs::density_unfrozen, 1.0);
  check("rho_f", d.density_frozen, &thermal::pham_inputs::density_frozen, 1.0);
  check("c_u", d.specific_heat_unfrozen, &thermal::pham_inputs::specific_heat_unfrozen, 1.0);
  check("c_f", d.specific_heat_frozen, &thermal::pham_inputs::specific_heat_frozen, 1.0);
  check("L", d.latent_heat, &thermal::pham_inputs::latent_heat, 100.0);
  check("k_f", d.k_frozen, &thermal::pham_inputs::k_frozen, 1e-3);
  check("h", d.h, &thermal::pham_inputs::h, 0.01);
}

TEST_CASE("Density and conductivity slopes by the ice fraction equal Richardson differences",
          "[thermal][conductivity][uncertainty]") {
  thermal::food_composition x;  // invented: a lean meat
  x.water = 0.74;
  x.protein = 0.21;
  x.fat = 0.04;
  x.ash = 0.01;
  for (const auto rule : {thermal::conductivity_rule::parallel, thermal::conductivity_rule::series}) {
    const double T = 255.15, I = 0.8;
    const auto s = thermal::food_density_conductivity_ice_slopes(x, T, I, rule);
    const auto rho = [&](double v) { return thermal::food_density_conductivity(x, T, v, rule).density; };
    const auto k = [&](double v) { return thermal::food_density_conductivity(x, T, v, rule).conductivity; };
    CHECK_THAT(s.density, WithinRel(richardson(rho, I, 1e-3), 1e-8));
    CHECK_THAT(s.conductivity, WithinRel(richardson(k, I, 1e-3), 1e-8));
  }
}

TEST_CASE("A food's freezing-time sensitivities to its fitted constants equal differences of the time",
          "[thermal][freezing_time][uncertainty]") {
  // Identity check: the chain constants -> T_f, I(T_c) -> rho_f, k_f -> time against
  // Richardson differences of the whole food_freezing_time in each constant.
  const auto f = fitted_product();
  const auto p = blast_freezer();
  const auto c = equilibria::uncertain_constants(f.water_phase());
  REQUIRE(c.values.size() == 2);
  for (const auto method : {thermal::freezing_time_method::plank, thermal::freezing_time_method::pham}) {
    const auto u = thermal::food_freezing_time_with_uncertainty(f, method, p, {});
    REQUIRE(u.sensitivities.size() == 5);
    CHECK(u.constants[0] == "my_sucrose.norrish_k");
    CHECK(u.constants[4] == "process.T_medium");
    CHECK_THAT(u.result.value, WithinRel(thermal::food_freezing_time(f, method, p), 1e-14));
    for (Eigen::Index k = 0; k < 2; ++k) {
      const auto time_at = [&](double v) {
        Eigen::VectorXd q = c.values;
        q[k] = v;
        const thermal::food g(f.composition(), equilibria::with_constants(f.water_phase(), c, q),
                              f.bound_water_fraction_of_water(), f.model());
        return thermal::food_freezing_time(g, method, p);
      };
      const double ref = richardson(time_at, c.values[k], 1e-3 * std::abs(c.values[k]));
      INFO(thermal::to_string(method) << " " << u.constants[static_cast<std::size_t>(k)] << ": analytic "
                                      << u.sensitivities[k] << ", Richardson " << ref);
      // The ice-line solvers stop at 1e-9 K / 1e-12 kg, so the differences carry about 1e-6
      // relative noise at these steps.
      CHECK_THAT(u.sensitivities[k], WithinRel(ref, 1e-5));
    }
    // process inputs: the formulas' own partials
    const auto hi = [&](double v) { auto q = p; q.h = v; return thermal::food_freezing_time(f, method, q); };
    CHECK_THAT(u.sensitivities[2], WithinRel(richardson(hi, p.h, 0.01), 1e-7));
    const auto Tm = [&](double v) { auto q = p; q.medium_temperature = v; return thermal::food_freezing_time(f, method, q); };
    CHECK_THAT(u.sensitivities[4], WithinRel(richardson(Tm, p.medium_temperature, 0.01), 1e-6));
    // no process uncertainty stated: only the fit's covariance, with its degrees of freedom
    CHECK(u.result.standard_uncertainty > 0.0);
    CHECK(u.result.degrees_of_freedom == c.block_dof[0]);
  }
}

TEST_CASE("Freezing times: delta method and Monte Carlo agree on a fitted-solute product",
          "[thermal][freezing_time][uncertainty][monte_carlo]") {
  // The acceptance check for the times: the 95 % intervals within 5 % of their
  // width (both ends), 10^4 draws (seed 20261202), for the fitted constants alone and with
  // small invented process uncertainties (u(h) = 0.4 W/(m^2 K), 2 % of h; u(size) = 0.5 mm;
  // u(T_m) = 0.5 K).
  const auto f = fitted_product();
  const auto p = blast_freezer();
  thermal::process_uncertainty small;
  small.h = 0.4;
  small.size = 0.0005;
  small.medium_temperature = 0.5;
  for (const auto& u : {thermal::process_uncertainty{}, small}) {
    for (const auto method : {thermal::freezing_time_method::plank, thermal::freezing_time_method::pham}) {
      const auto lin = thermal::food_freezing_time_with_uncertainty(f, method, p, u);
      const auto mc = thermal::food_freezing_time_monte_carlo(f, method, p, u, 10000, 20261202u);
      INFO(thermal::to_string(method) << " u(h) = " << u.h << ": delta " << lin.result.standard_uncertainty
                                      << " s, Monte Carlo " << mc.standard_deviation << " s");
      REQUIRE(mc.finite_draws == 10000);
      fit::uncertain_value normal = lin.result;
      normal.degrees_of_freedom = 0;  // the draws are normal: compare with the normal law
      const auto a = normal.coverage_interval(0.95);
      const auto b = mc.interval(0.95);
      const double width = b.second - b.first;
      CHECK_THAT(a.first, WithinAbs(b.first, 0.05 * width));
      CHECK_THAT(a.second, WithinAbs(b.second, 0.05 * width));
    }
  }
}

TEST_CASE("Freezing times: a large u(h) skews the interval, which only Monte Carlo shows",
          "[thermal][freezing_time][uncertainty][monte_carlo]") {
  // Plank's time goes nearly as 1/h, so with u(h) = 10 % of h (invented, a common size for an
  // estimated h) the distribution of the time leans to long times: the standard
  // uncertainties still agree within 5 %, but the Monte Carlo interval sits higher than the
  // symmetric delta-method one (by about 9 % of its width here). The documentation tells
  // users to take the Monte Carlo method for such cases.
  const auto f = fitted_product();
  const auto p = blast_freezer();
  thermal::process_uncertainty large;
  large.h = 2.0;
  for (const auto method : {thermal::freezing_time_method::plank, thermal::freezing_time_method::pham}) {
    const auto lin = thermal::food_freezing_time_with_uncertainty(f, method, p, large);
    const auto mc = thermal::food_freezing_time_monte_carlo(f, method, p, large, 10000, 20261202u);
    CHECK_THAT(mc.standard_deviation, WithinRel(lin.result.standard_uncertainty, 0.05));
    const auto b = mc.interval(0.95);
    CHECK(0.5 * (b.first + b.second) > lin.result.value + 0.05 * (b.second - b.first));
  }
}

TEST_CASE("Simulation time by Monte Carlo: seeded, and the spread of a linear input",
          "[thermal][simulation][uncertainty][monte_carlo]") {
  const auto f = fitted_product();
  thermal::simulation_setup s;
  s.shape = thermal::body_shape::slab;
  s.size = 0.05;
  s.initial_temperature = 278.15;
  s.medium = thermal::medium_schedule::constant(238.15);
  s.h = 20.0;
  s.target_temperature = 255.15;
  s.max_time = 1e6;
  s.intervals = 10;  // coarse mesh: this checks the propagation, not the mesh
  thermal::process_uncertainty u;
  u.h = 1.0;  // invented, 5 % of h
  const auto a = thermal::simulation_time_monte_carlo(f, s, u, 200, 7u);
  const auto b = thermal::simulation_time_monte_carlo(f, s, u, 200, 7u);
  REQUIRE(a.finite_draws == 200);
  CHECK(a.values == b.values);  // the same seed gives the same draws
  // The fitted constants move this time by far less than u(h) does, so the spread is
  // |dt/dh| u(h) to first order; the sample standard deviation of 200 draws has a relative
  // standard error of 1/sqrt(2 * 199) = 5 %: 20 % is four of those.
  const auto t_at = [&](double h) {
    auto q = s;
    q.h = h;
    return thermal::simulate_food(f, q).time_to_target;
  };
  const double slope = (t_at(s.h + 0.5) - t_at(s.h - 0.5)) / 1.0;
  CHECK_THAT(a.standard_deviation, WithinRel(std::abs(slope) * u.h, 0.20));
  CHECK_THAT(a.mean, WithinRel(t_at(s.h), 0.02));
  // A run without a target cannot give a time
  auto no_target = s;
  no_target.target_temperature = std::numeric_limits<double>::quiet_NaN();
  CHECK_THROWS_AS(thermal::simulation_time_monte_carlo(f, no_target, u, 10, 7u), invalid_input);
  thermal::process_uncertainty bad;
  bad.size = -1.0;
  CHECK_THROWS_WITH(thermal::simulation_time_monte_carlo(f, s, bad, 10, 7u), Catch::Contains("u_size"));
}
