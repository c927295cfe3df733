// An effective-solute fit keeps the uncertainty of its molar mass on the record it returns,
// and predictions with that record carry it: the closed-form sensitivity of ln a_w to the
// molar mass against central differences, and the delta method against Monte Carlo.
#include <catch2/catch.hpp>
#include <cmath>
#include <string>
#include <vector>

#include "../crc_reference.hpp"
#include "../uncertainty_checks.hpp"
#include "colligate/data/builtin_solutes.hpp"
#include "colligate/equilibria/prediction_uncertainty.hpp"
#include "colligate/fit/fitters.hpp"

using namespace colligate;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;
using equilibria::predicted_quantity;
using colligate_test::central_difference;

namespace {

/// Effective solute fitted to the CRC Handbook glucose freezing points to 30 wt% (source key
/// crc_concentrative, glucose rows of tests/reference/crc_freezing_points.csv, printed to
/// 0.01 K): each row is a "food" of water fraction 1 - w whose solids are the solute.
/// `fit_b`: also fit the bound water.
fit::fit_result crc_glucose_effective_fit(bool fit_b) {
  std::vector<double> w, tf;
  for (const auto& row : colligate_test::read_reference("crc_freezing_points.csv")) {
    if (row.at("solute") != "glucose" || colligate_test::doubtful_crc_row(row)) continue;
    w.push_back(1.0 - std::stod(row.at("mass_percent")) / 100.0);
    tf.push_back(constants::ice_point - std::stod(row.at("depression_K")));
  }
  fit::effective_solute_options o;
  o.fit_bound_water = fit_b;
  o.bound_water_start = fit_b ? 0.1 : 0.0;
  return fit::fit_effective_solute_freezing(
      Eigen::Map<const Eigen::VectorXd>(w.data(), static_cast<Eigen::Index>(w.size())),
      Eigen::Map<const Eigen::VectorXd>(tf.data(), static_cast<Eigen::Index>(tf.size())), Eigen::VectorXd(), o);
}

}  // namespace

TEST_CASE("An effective-solute record carries its fit's molar-mass uncertainty", "[uncertainty][fit][effective]") {
  for (const bool fit_b : {false, true}) {
    const auto r = crc_glucose_effective_fit(fit_b);
    REQUIRE(r.success());
    const auto rec = fit::effective_solute_record(r, "my_solids", "my solids", "test");
    REQUIRE(rec.uncertainty.stated());
    CHECK(rec.uncertainty.names == std::vector<std::string>{"molar_mass"});
    CHECK(rec.uncertainty.at(0, 0) == r.covariance(0, 0));
    CHECK(rec.uncertainty.degrees_of_freedom == r.degrees_of_freedom);
    CHECK(rec.uncertainty.source == "colligate_fit_user");
    // the solids are glucose (0.18016 kg/mol, common practice). Its solutions freeze below
    // Raoult's law (Norrish K > 0), so with b = 0 the apparent molar mass comes out lower
    // (0.167 kg/mol); with b fitted, b takes up that non-ideality (0.181 kg/mol). Either
    // way within 10 % of glucose's; a standard uncertainty well below the value.
    CHECK_THAT(rec.molar_mass, WithinRel(0.18016, 0.10));
    if (!fit_b) CHECK(rec.molar_mass < 0.18016);
    CHECK(std::sqrt(rec.uncertainty.at(0, 0)) < 0.05 * rec.molar_mass);
  }
}

TEST_CASE("Molar-mass sensitivities under Norrish equal central differences", "[uncertainty][effective]") {
  // Identity check (no literature): the effective solute with built-in sucrose (K > 0),
  // lactic acid (its own sign of K) and ethanol (volume-ratio term), so every branch of the
  // particle-total sum is exercised.
  const auto r = crc_glucose_effective_fit(false);
  REQUIRE(r.success());
  std::vector<data::solute_record> recs{fit::effective_solute_record(r, "my_solids", "my solids", "test")};
  for (const char* id : {"sucrose", "lactic_acid", "ethanol"}) recs.push_back(data::builtin_solutes().find(id));
  const data::solute_table table(std::move(recs));
  const auto s = solution::from_mass_fractions(
      {{"my_solids", 0.10}, {"sucrose", 0.10}, {"lactic_acid", 0.02}, {"ethanol", 0.03}}, 1.0, table);
  struct probe { predicted_quantity q; double T; };
  for (const auto& p : {probe{predicted_quantity::freezing_point, 0.0},
                        probe{predicted_quantity::water_activity, 298.15},
                        probe{predicted_quantity::osmotic_coefficient, 298.15},
                        probe{predicted_quantity::ice_fraction, 263.15},
                        probe{predicted_quantity::unfrozen_water, 263.15}}) {
    const auto u = equilibria::propagate_linear(p.q, s, p.T, "norrish");
    INFO(equilibria::to_string(p.q));
    std::size_t k = 0;
    for (; k < u.constants.size(); ++k)
      if (u.constants[k] == "my_solids.molar_mass") break;
    REQUIRE(k < u.constants.size());
    const double fd = central_difference(p.q, s, p.T, k, 1e-4 * r.params[0], "norrish");
    INFO("analytic " << u.sensitivities[static_cast<Eigen::Index>(k)] << ", difference " << fd);
    // central difference error O(h^2) plus the solvers' 1e-9 K / 1e-12 kg tolerances
    CHECK_THAT(u.sensitivities[static_cast<Eigen::Index>(k)], WithinRel(fd, 1e-5));
  }
}

TEST_CASE("Effective solute: delta method and Monte Carlo agree", "[uncertainty][effective][monte_carlo]") {
  // The acceptance check for the effective solute (M and b fitted to the CRC glucose
  // rows; M's uncertainty propagated, b exact): the 95 % intervals within 5 % of their width,
  // 10^5 draws, seed 20261202, in a mix with built-in sucrose (stated: none).
  const auto r = crc_glucose_effective_fit(true);
  REQUIRE(r.success());
  const data::solute_table table(std::vector<data::solute_record>{
      fit::effective_solute_record(r, "my_solids", "my solids", "test"), data::builtin_solutes().find("sucrose")});
  const auto s = solution::from_mass_fractions({{"my_solids", 0.15}, {"sucrose", 0.10}}, 1.0, table);
  for (const auto q : {predicted_quantity::freezing_point, predicted_quantity::ice_fraction,
                       predicted_quantity::water_activity}) {
    const double T = q == predicted_quantity::water_activity ? 298.15 : 263.15;
    const auto lin = equilibria::propagate_linear(q, s, T, "norrish");
    const auto mc = equilibria::propagate_monte_carlo(q, s, T, "norrish", 0.0, 100000, 20261202u);
    INFO(equilibria::to_string(q) << ": delta " << lin.result.standard_uncertainty << ", Monte Carlo "
                                  << mc.standard_deviation);
    REQUIRE(mc.finite_draws == 100000);
    CHECK(lin.not_stated == std::vector<std::string>{"sucrose"});
    CHECK(lin.result.degrees_of_freedom == r.degrees_of_freedom);
    fit::uncertain_value normal = lin.result;
    normal.degrees_of_freedom = 0;
    const auto a = normal.coverage_interval(0.95);
    const auto b = mc.interval(0.95);
    const double width = b.second - b.first;
    CHECK(width > 0.0);
    CHECK_THAT(a.first, WithinAbs(b.first, 0.05 * width));
    CHECK_THAT(a.second, WithinAbs(b.second, 0.05 * width));
  }
}
