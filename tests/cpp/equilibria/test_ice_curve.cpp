// The ice curve: seawater against TEOS-10 and published brine crystallisation paths,
// binary brines ending at their eutectics, and the model registry taking a new model.
#include <catch2/catch.hpp>

#include <cmath>
#include <limits>
#include <memory>
#include <string>

#include "colligate/colligate.hpp"
#include "colligate/models/detail/static_evaluator.hpp"
#include "../reference_csv.hpp"

using namespace colligate;
using Catch::Matchers::Contains;
using Catch::Matchers::WithinAbs;

namespace {

double onset_celsius(equilibria::ice_curve& c, const std::string& phase) {
  for (const auto& o : c.salts())
    if (o.phase->name == phase) return o.temperature - constants::celsius_offset;
  return std::numeric_limits<double>::quiet_NaN();
}

double published_onset(const std::string& source, const std::string& phase,
                       const std::string& pathway) {
  for (const auto& row : colligate_test::read_reference("seawater_brine_path.csv"))
    if (row.at("source_key") == source && row.at("phase") == phase &&
        row.at("pathway").find(pathway) != std::string::npos)
      return std::stod(row.at("onset_temperature_C"));
  FAIL("no row " << source << " " << phase);
  return 0.0;
}

}  // namespace

TEST_CASE("seawater ice fraction follows TEOS-10 until salts change the brine",
          "[equilibria][ice_curve][seawater]") {
  // TEOS-10 (IOC, SCOR & IAPSO 2010) brine-conservative ice fractions from gsw
  // (tests/reference/seawater_teos10_ice_fraction.csv, tools/teos10_brine_ice_fraction.py),
  // SA 35.16504 g/kg, p = 0. Tolerance 0.01 of the water (the criterion); the
  // model's freezing point is within 0.003 K of TEOS-10 (test_pitzer), so the rows
  // inside TEOS-10's range agree to a few 1e-4.
  equilibria::ice_curve c(solution::seawater(35.16504));
  int rows = 0;
  for (const auto& row : colligate_test::read_reference("seawater_teos10_ice_fraction.csv")) {
    const double t = std::stod(row.at("temperature_C"));
    const double ref = std::stod(row.at("ice_fraction_of_water"));
    const auto st = c.at(t + constants::celsius_offset);
    INFO(t << " C: " << st.ice_fraction() << " vs " << ref << " (" << row.at("note") << ")");
    if (row.at("note").rfind("within_teos10_range", 0) == 0) {
      CHECK_THAT(st.ice_fraction(), WithinAbs(ref, 0.01));
      ++rows;
    } else {
      // -8 and -10 C: beyond TEOS-10's salinity range (extrapolated freezing line) and
      // below the gypsum and mirabilite onsets; the salts crystallised by then hold
      // little of the brine's salt, so the extrapolated line stays within 0.01 as well.
      CHECK(st.state == equilibria::phase_state::ice_salts_liquid);
      CHECK_THAT(st.ice_fraction(), WithinAbs(ref, 0.01));
    }
  }
  CHECK(rows == 5);
}

TEST_CASE("seawater ice curve is finite and monotonic to -30 C", "[equilibria][ice_curve][seawater]") {
  equilibria::ice_curve c(solution::seawater(35.16504));
  double prev = 0.0;
  for (double t = -2.0; t >= -30.0; t -= 0.25) {
    const auto st = c.at(t + constants::celsius_offset);
    INFO(t << " C: " << st.check.reason());
    REQUIRE(std::isfinite(st.ice_fraction()));
    CHECK(st.ice_fraction() >= prev);  // ice only grows on cooling (common practice)
    CHECK(st.ice_fraction() < 1.0);
    CHECK(st.unfrozen_water > 0.0);
    prev = st.ice_fraction();
  }
}

TEST_CASE("seawater equilibrium path: order of the salts and the final eutectic",
          "[equilibria][ice_curve][seawater]") {
  equilibria::ice_curve c(solution::seawater(35.16504));
  // Order of the equilibrium (Gitterman) path in the FREZCHEM v13.3 run of Wolfenbarger
  // et al. (2022): gypsum, mirabilite, hydrohalite, then meridianiite and sylvite.
  const auto& salts = c.salts();
  REQUIRE(salts.size() >= 4);
  CHECK(salts[0].phase->name == "gypsum");
  CHECK(salts[1].phase->name == "mirabilite");
  CHECK(salts[2].phase->name == "hydrohalite");
  // The onset temperatures of mirabilite, hydrohalite, gypsum and sylvite against Butler et
  // al. (2016) and FREZCHEM (Wolfenbarger et al. 2022) are checked in
  // tests/cpp/validation/test_published_checks.cpp with the rows and per-phase tolerances of
  // tests/reference/tolerances.toml (seawater_salt_onsets). Sylvite closes the path: with six
  // ions (five independent) ice + gypsum + mirabilite + hydrohalite + meridianiite + sylvite
  // leave the liquid no freedom (phase rule), the final eutectic.
  CHECK(c.end_reason() == equilibria::curve_end::final_eutectic);
  CHECK(c.end_temperature() - constants::celsius_offset > published_onset("vancoppenolle_2019", "final_eutectic", "equilibrium"));
  const auto below = c.at(c.end_temperature() - 1.0);
  CHECK(std::isnan(below.ice));
  CHECK_THAT(below.check.reason(), Contains("final eutectic"));
}

TEST_CASE("seawater fractional path goes on below the equilibrium eutectic",
          "[equilibria][ice_curve][seawater]") {
  equilibria::ice_curve eq(solution::seawater(35.16504));
  equilibria::ice_curve fr(solution::seawater(35.16504), "auto", 0.0,
                           equilibria::crystallisation_path::fractional);
  // Above the first salt both paths are the same curve (identity).
  CHECK(fr.at(268.15).ice == eq.at(268.15).ice);
  // Ringer-Nelson-Thompson (fractional) path: hydrohalite's onset against Nelson & Thompson
  // (1954) is checked in the validation suite (seawater_salt_onsets of tolerances.toml).
  CHECK(std::isfinite(onset_celsius(fr, "hydrohalite")));
  // Salts removed as they form leave the brine free to go on freezing: MgCl2.12H2O forms
  // (Assur 1958: -43.2 C, a compiled value; FREZCHEM's fractional path ends near -54 C,
  // Marion et al. 1999, from memory). Achieved -36.7 C for MgCl2.12H2O; the path is
  // followed to the salt data's limit (219.15 K). Checked: it forms, below the
  // equilibrium path's end, and the curve reaches at least -50 C.
  CHECK(onset_celsius(fr, "magnesium chloride dodecahydrate") < eq.end_temperature() - constants::celsius_offset);
  CHECK(fr.end_temperature() - constants::celsius_offset <= -50.0);
  const auto st = fr.at(233.15);
  CHECK(std::isfinite(st.ice_fraction()));
  CHECK(st.ice_fraction() > eq.at(eq.end_temperature() + 0.01).ice_fraction());
}

TEST_CASE("binary brines end at their eutectic with the salt hydrate named",
          "[equilibria][ice_curve][eutectic]") {
  struct binary {
    const char* salt;
    const char* hydrate;
  };
  for (const auto& b : {binary{"NaCl", "hydrohalite"}, binary{"CaCl2", "antarcticite"},
                        binary{"MgCl2", "magnesium chloride dodecahydrate"}}) {
    INFO(b.salt);
    equilibria::ice_curve c(solution::from_mass_fractions({{b.salt, 0.05}}));
    CHECK(c.end_reason() == equilibria::curve_end::final_eutectic);
    REQUIRE(c.salts().size() == 1);
    CHECK(c.salts()[0].phase->name == b.hydrate);
    const double te = c.end_temperature();
    const auto above = c.at(te + 0.01);
    CHECK(above.state == equilibria::phase_state::ice_and_liquid);
    const auto below = c.at(te - 0.5);
    CHECK(below.state == equilibria::phase_state::below_curve_end);
    CHECK_THAT(below.check.reason(), Contains(b.hydrate));
  }
}

TEST_CASE("a dilute KCl + CaCl2 brine has ice at every temperature down to its eutectic",
          "[equilibria][ice_curve][eutectic]") {
  // Found by the hypothesis property test (tests/python/test_properties.py): above 86 %
  // ice the ice-only root's first bracket step of ln W = 2 missed, and the next (4 more)
  // landed where the Pitzer sums, far beyond their molality range, give no sign change, so
  // the curve had no value from 252 K to 232 K. Identity checks, no published value:
  // colder -> more ice (common practice), the water balance closes, and each temperature
  // asked alone gives what the path gives.
  const auto s = solution::from_mass_fractions({{"KCl", 0.0078125}, {"CaCl2", 0.03125}});
  equilibria::ice_curve c(s);
  REQUIRE(c.end_reason() == equilibria::curve_end::final_eutectic);
  const double te = c.end_temperature();
  double prev = 0.0;
  for (double T = 270.0; T > te + 0.05; T -= 0.5) {
    const auto st = c.at(T);
    INFO(T << " K: " << st.check.reason());
    REQUIRE(std::isfinite(st.ice_fraction()));
    CHECK(st.ice_fraction() >= prev - 1e-12);
    CHECK(std::abs(st.ice + st.unfrozen_water + st.bound_water + st.hydrate_water - s.water_mass()) <=
          1e-12 * s.water_mass());
    prev = st.ice_fraction();
    if (T < 253.0 && T > 245.0) {
      equilibria::ice_curve alone(s);
      CHECK_THAT(alone.at(T).ice_fraction(), WithinAbs(st.ice_fraction(), 1e-9));
    }
  }
}

TEST_CASE("above the freezing point there is no ice, not an error", "[equilibria][ice_curve]") {
  equilibria::ice_curve c(solution::from_mass_fractions({{"sucrose", 0.2}}));
  const auto st = c.at(300.0);
  CHECK(st.state == equilibria::phase_state::liquid);
  CHECK(st.ice == 0.0);
  CHECK(st.success());
  CHECK_THROWS_WITH(c.at(-1.0), Contains("temperature"));
}

namespace {

/// A toy model for the registry test: ideal solution with every particle counted twice,
/// ln a_w = -2 M_w sum nu_i m_i. Not a physical model.
struct twice_ideal {
  static double ln_water_activity(const solution& s, double water_kg, double T) {
    return 2.0 * models::ideal::ln_water_activity(s, water_kg, T);
  }
  static validity check(const solution&, double, double) { return {}; }
};

}  // namespace

TEST_CASE("a new model is one descriptor added to a registry", "[models][registry]") {
  models::model_descriptor toy;
  toy.id = "twice_ideal";
  toy.summary = "test model: ideal with every particle counted twice";
  toy.traits = {false, false};
  toy.prepare = [](const solution& s,
                   const models::model_options&) -> std::unique_ptr<models::activity_evaluator> {
    return std::make_unique<models::detail::static_model_evaluator<twice_ideal>>(s);
  };
  const auto registry = models::builtin_models().with(toy);
  const auto s = solution::from_molalities({{"glucose", 0.05}});
  const auto fp = equilibria::freezing_point(s, models::model_choice("twice_ideal", registry));
  REQUIRE(fp.success());
  // Identity: the ice line at ln a_w = -2 M_w m (water/ice.hpp inversion).
  const double expected = water::temperature_of_ice_equilibrium(
      -2.0 * constants::molar_mass_water * 0.05, equilibria::search_min_temperature);
  CHECK_THAT(fp.temperature, WithinAbs(expected, 1e-9));
  // Depression twice the ideal one to first order (1.86 K kg/mol, common practice).
  CHECK_THAT(constants::ice_point - fp.temperature, WithinAbs(2 * 1.86 * 0.05, 0.005));
  // The built-in registry is unchanged; the id is unknown there.
  CHECK_THROWS_WITH(models::model_choice("twice_ideal"), Contains("valid models"));
  CHECK_THROWS_WITH(registry.with(toy), Contains("already registered"));
}
