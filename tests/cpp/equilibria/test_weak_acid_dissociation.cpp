// Weak acids of food (data/weak_acids.hpp, equilibria/weak_acid_dissociation.hpp): the pKa
// functions against the values their sources print, the speciation against the degree of
// dissociation computed by hand from pKa, the identities (mass and charge balance), the
// range flags, and the freezing points with dissociation against the CRC Handbook rows
// not used in the fit.
#include <catch2/catch.hpp>
#include <algorithm>
#include <cmath>
#include <string>

#include "../reference_csv.hpp"
#include "colligate/core/constants.hpp"
#include "colligate/data/builtin_solutes.hpp"
#include "colligate/data/citation.hpp"
#include "colligate/data/weak_acids.hpp"
#include "colligate/equilibria/weak_acid_dissociation.hpp"

using namespace colligate;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;

namespace {

const data::weak_acid& acid(const char* id) { return data::weak_acid_by_id(id); }

/// mol/kg of water of a binary solution of mass fraction w of a solute of molar mass M (kg/mol).
double molality_of(double w, double molar_mass) { return w / (molar_mass * (1.0 - w)); }

double molar_mass(const char* solute) { return data::builtin_solutes().find(solute).molar_mass; }

/// Degree of dissociation of a monoprotic acid HA at molality m with constant K (water's
/// own ions left out): the positive root of alpha^2 m / (1 - alpha) = K, by hand.
double alpha_by_hand(double k, double m) {
  return (-k + std::sqrt(k * k + 4.0 * k * m)) / (2.0 * m);
}

}  // namespace

TEST_CASE("pKa functions give the values their sources print", "[equilibria][weak_acid]") {
  // Harned & Ehlers (1933): pKa of acetic acid 4.756 at 25 C, 4.780 at 0 C (both from
  // memory); the function is printed to 3 decimals of pKa: abs 0.0015.
  const auto& acetic = acid("acetic_acid").steps.at(0);
  CHECK_THAT(acetic.pka(298.15), WithinAbs(4.756, 0.0015));
  CHECK_THAT(acetic.pka(273.15), WithinAbs(4.780, 0.0015));
  // Bates & Pinching (1949): 3.128, 4.761, 6.396 at 25 C (the refitted ln K functions,
  // whose abstract states sigma 0.002-0.003 in ln K, i.e. about 0.001 in pK): abs 0.002.
  const auto& citric = acid("citric_acid").steps;
  REQUIRE(citric.size() == 3);
  CHECK_THAT(citric[0].pka(298.15), WithinAbs(3.128, 0.002));
  CHECK_THAT(citric[1].pka(298.15), WithinAbs(4.761, 0.002));
  CHECK_THAT(citric[2].pka(298.15), WithinAbs(6.396, 0.002));
  // ... and at 0 C 3.220, 4.837, 6.393 (Bates & Pinching 1949, from memory).
  CHECK_THAT(citric[0].pka(273.15), WithinAbs(3.220, 0.002));
  CHECK_THAT(citric[1].pka(273.15), WithinAbs(4.837, 0.002));
  CHECK_THAT(citric[2].pka(273.15), WithinAbs(6.393, 0.002));
  // Each printed 25 C value agrees with its own function within the printed digits.
  for (const auto& a : data::weak_acids())
    for (const auto& st : a.steps) {
      INFO(a.id << " pKa " << st.pka_25c);
      CHECK_THAT(st.pka(298.15), WithinAbs(st.pka_25c, 0.006));
      CHECK_NOTHROW(data::find_citation(st.source));
    }
  // Harned & Robinson (1940), from memory: pKw 13.995 at 25 C, 14.94 at 0 C.
  CHECK_THAT(data::water_ionisation().pka(298.15), WithinAbs(13.995, 0.002));
  CHECK_THAT(data::water_ionisation().pka(273.15), WithinAbs(14.94, 0.01));
}

TEST_CASE("every weak acid with a solute record names a built-in solute",
          "[equilibria][weak_acid]") {
  for (const char* id : {"acetic_acid", "lactic_acid", "citric_acid"}) {
    INFO(id);
    CHECK(data::builtin_solutes().find(id).id == id);
  }
  CHECK_THROWS_AS(data::weak_acid_by_id("vinegar"), invalid_input);
}

TEST_CASE("monoprotic acids without activity coefficients: the degree of dissociation by hand",
          "[equilibria][weak_acid]") {
  // alpha from the quadratic above with K = 10^-pKa (pKa: Harned & Ehlers 1933 for acetic
  // acid, CRC Handbook for lactic acid); water's own H+ changes alpha by about
  // K_w / (alpha m)^2, below 1e-8 here: rel 1e-8.
  for (const char* id : {"acetic_acid", "lactic_acid"}) {
    for (const double w : {0.01, 0.10}) {
      const double m = molality_of(w, molar_mass(id));
      const auto r = equilibria::speciate_weak_acid(acid(id), m, 298.15, 0.0,
                                                    equilibria::ion_activity::ideal);
      REQUIRE(r.status == root_status::converged);
      const double k = std::pow(10.0, -acid(id).steps[0].pka(298.15));
      INFO(id << " " << w * 100 << " wt%: alpha " << r.degree_of_dissociation);
      CHECK_THAT(r.degree_of_dissociation, WithinRel(alpha_by_hand(k, m), 1e-8));
    }
  }
  // What the dissociation amounts to (Harned & Ehlers 1933 pKa, by hand): acetic acid is
  // 1.0 % dissociated at 1 wt% and 0.3 % at 10 wt%.
  const auto a1 = equilibria::speciate_weak_acid(acid("acetic_acid"),
                                                 molality_of(0.01, molar_mass("acetic_acid")),
                                                 298.15, 0.0, equilibria::ion_activity::ideal);
  const auto a10 = equilibria::speciate_weak_acid(acid("acetic_acid"),
                                                  molality_of(0.10, molar_mass("acetic_acid")),
                                                  298.15, 0.0, equilibria::ion_activity::ideal);
  CHECK_THAT(a1.degree_of_dissociation, WithinAbs(0.0102, 0.0002));
  CHECK_THAT(a10.degree_of_dissociation, WithinAbs(0.0031, 0.0001));
}

TEST_CASE("Debye-Hueckel activity coefficients raise the dissociation as K' = K / gamma^2",
          "[equilibria][weak_acid]") {
  // By hand: f(I) = -A_phi [sqrt I / (1 + 1.2 sqrt I) + (2 / 1.2) ln(1 + 1.2 sqrt I)] with
  // A_phi = 0.3915 at 25 C (Pitzer 1991); K' = K exp(-2 f); alpha from the quadratic with
  // K'. A_phi of the Clegg et al. (1994) series differs from 0.3915 by < 1e-4: rel 1e-4.
  for (const char* id : {"acetic_acid", "lactic_acid"}) {
    for (const double w : {0.01, 0.10}) {
      const double m = molality_of(w, molar_mass(id));
      const auto r = equilibria::speciate_weak_acid(acid(id), m, 298.15);
      REQUIRE(r.status == root_status::converged);
      const double I = r.ionic_strength;
      const double s = std::sqrt(I);
      const double f = -0.3915 * (s / (1.0 + 1.2 * s) + (2.0 / 1.2) * std::log(1.0 + 1.2 * s));
      CHECK_THAT(r.ln_gamma_univalent, WithinRel(f, 1e-4));
      const double k = std::pow(10.0, -acid(id).steps[0].pka(298.15)) * std::exp(-2.0 * f);
      INFO(id << " " << w * 100 << " wt%");
      CHECK_THAT(r.degree_of_dissociation, WithinRel(alpha_by_hand(k, m), 1e-4));
      // Identity of the fixed point: I = (h + [OH-] + [A-]) / 2 and [A-] = h - [OH-] by
      // the charge balance, so I = h.
      CHECK_THAT(I, WithinRel(r.hydrogen_ion_molality, 1e-10));
    }
  }
}

TEST_CASE("pH of 0.1 mol/kg acetic acid", "[equilibria][weak_acid]") {
  // Common practice (textbook value from Ka = 1.75e-5): pH 2.88; two printed decimals.
  const auto r = equilibria::speciate_weak_acid(acid("acetic_acid"), 0.1, 298.15);
  CHECK_THAT(r.ph, WithinAbs(2.88, 0.01));
}

TEST_CASE("citric acid: three steps, mass and charge balance, by-hand bisection",
          "[equilibria][weak_acid]") {
  const auto& citric = acid("citric_acid");
  for (const double w : {0.01, 0.10}) {
    const double m = molality_of(w, molar_mass("citric_acid"));
    const auto r = equilibria::speciate_weak_acid(citric, m, 298.15, 0.0,
                                                  equilibria::ion_activity::ideal);
    REQUIRE(r.status == root_status::converged);
    REQUIRE(r.fractions.size() == 4);
    double sum = 0.0, bound = 0.0;
    for (std::size_t j = 0; j < 4; ++j) {
      sum += r.fractions[j];
      bound += static_cast<double>(j) * r.fractions[j];
    }
    CHECK_THAT(sum, WithinAbs(1.0, 1e-14));
    // Charge balance: H+ = citrate charges + OH-.
    CHECK_THAT(r.hydrogen_ion_molality, WithinRel(m * bound + r.hydroxide_molality, 1e-12));
    // By hand: bisection on h of h = m (a1 + 2 a2 + 3 a3) with the textbook fractions
    // a_j = prod_i<=j K_i / h^j / D (Bates & Pinching 1949 constants; water left out).
    double K[3];
    for (int j = 0; j < 3; ++j) K[j] = std::pow(10.0, -citric.steps[j].pka(298.15));
    const auto excess = [&](double h) {
      const double b1 = K[0] / h, b2 = b1 * K[1] / h, b3 = b2 * K[2] / h;
      const double D = 1.0 + b1 + b2 + b3;
      return h - m * (b1 + 2.0 * b2 + 3.0 * b3) / D;
    };
    double lo = 1e-12, hi = 3.0 * m;
    for (int i = 0; i < 200; ++i) {
      const double mid = std::sqrt(lo * hi);
      (excess(mid) < 0.0 ? lo : hi) = mid;
    }
    const double h = std::sqrt(lo * hi);
    const double alpha0 = 1.0 / (1.0 + K[0] / h + K[0] * K[1] / (h * h) +
                                 K[0] * K[1] * K[2] / (h * h * h));
    INFO(w * 100 << " wt% citric acid: alpha " << r.degree_of_dissociation);
    CHECK_THAT(r.hydrogen_ion_molality, WithinRel(h, 1e-7));
    CHECK_THAT(1.0 - r.degree_of_dissociation, WithinRel(alpha0, 1e-7));
  }
}

TEST_CASE("weak acid speciation flags what it extrapolates", "[equilibria][weak_acid]") {
  // Below the 0-50 C of Bates & Pinching (1949): the pKa function is extrapolated.
  const auto cold = equilibria::speciate_weak_acid(acid("citric_acid"), 0.5, 263.15);
  CHECK(cold.check.code == validity_code::temperature_out_of_range);
  CHECK(cold.temperature_function);
  // Lactic acid: a 25 C pKa at every temperature, said so.
  const auto lactic = equilibria::speciate_weak_acid(acid("lactic_acid"), 0.5, 268.15);
  CHECK_FALSE(lactic.temperature_function);
  CHECK(lactic.check.in_range());
  // A brine background: the Debye-Hueckel term alone is out of its range.
  const auto brine = equilibria::speciate_weak_acid(acid("lactic_acid"), 0.05, 298.15, 3.0);
  CHECK(brine.check.code == validity_code::concentration_out_of_range);
  // ... and a background ionic strength raises the dissociation (gamma < 1).
  const auto plain = equilibria::speciate_weak_acid(acid("lactic_acid"), 0.05, 298.15);
  CHECK(brine.degree_of_dissociation > plain.degree_of_dissociation);
  CHECK_THROWS_AS(equilibria::speciate_weak_acid(acid("lactic_acid"), 0.0, 298.15), invalid_input);
  CHECK_THROWS_AS(equilibria::speciate_weak_acid(acid("lactic_acid"), 0.1, 298.15, -1.0),
                  invalid_input);
}

TEST_CASE("freezing points with dissociation against the CRC rows not used in the fit",
          "[equilibria][weak_acid][validation]") {
  // CRC Handbook (2021), concentrative properties table, rows with used_in_fit = no.
  // Tolerance: the fit rows' own worst deviation (printed by tools/fit_weak_acid_norrish.py
  // and stored in the acid's norrish_k_note) plus 0.02 K for two printed digits, as for the
  // folded constants (tests/reference/tolerances.toml, crc_fitted_held_out).
  for (const char* id : {"acetic_acid", "lactic_acid", "citric_acid"}) {
    const auto& a = acid(id);
    REQUIRE(std::isfinite(a.norrish_k_undissociated));
    CHECK_NOTHROW(data::find_citation(a.norrish_k_source));
    const double tolerance = a.norrish_k_fit_worst_deviation + 0.02;
    int rows = 0;
    for (const auto& row : colligate_test::read_reference("crc_freezing_points.csv")) {
      if (row.at("solute") != id || row.at("used_in_fit") != "no") continue;
      const double w = std::stod(row.at("mass_percent")) / 100.0;
      const auto r = equilibria::weak_acid_freezing_point(a, molality_of(w, molar_mass(id)),
                                                          a.norrish_k_undissociated);
      REQUIRE(r.status == root_status::converged);
      CHECK(r.check.in_range());
      INFO(id << " " << w * 100 << " wt%: alpha at the freezing point "
              << r.speciation.degree_of_dissociation);
      CHECK_THAT(constants::ice_point - r.temperature,
                 WithinAbs(std::stod(row.at("depression_K")), tolerance));
      ++rows;
    }
    CHECK(rows >= 8);
  }
}

TEST_CASE("freezing point with dissociation beyond the checked rows is flagged",
          "[equilibria][weak_acid]") {
  // 40 wt% acetic acid (11.1 mol/kg) lies above the 36 wt% CRC row (9.367 mol/kg).
  const auto& a = acid("acetic_acid");
  const auto r = equilibria::weak_acid_freezing_point(a, 11.1, a.norrish_k_undissociated);
  CHECK(r.check.code == validity_code::concentration_out_of_range);
  CHECK(r.check.source() == "crc_concentrative");
  CHECK_THROWS_AS(equilibria::weak_acid_freezing_point(a, 1.0, std::nan("")), invalid_input);
}
