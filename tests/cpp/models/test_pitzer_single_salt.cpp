// One salt in water by the closed binary Pitzer form (models/pitzer_single_salt.hpp):
// the same equations as the mixture kernel, Gibbs-Duhem consistency for unsymmetrical
// charges, and the errors the issue asks for (salt, set and temperature range named).
#include <catch2/catch.hpp>
#include <cmath>
#include <string>
#include <tuple>
#include <vector>

#include "../gibbs_duhem.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/data/pitzer_parameters.hpp"
#include "colligate/data/single_salt_pitzer.hpp"
#include "colligate/models/pitzer.hpp"
#include "colligate/models/pitzer_single_salt.hpp"
#include "colligate/fit/single_salt_fitter.hpp"
#include "colligate/water/ice.hpp"

using namespace colligate;
using Catch::Matchers::WithinAbs;
using Catch::Matchers::WithinRel;

namespace {

// A row of the single-salt table made from a mixture set's binary row at T (identity test).
data::single_salt_parameters from_set(const data::pitzer_parameter_set& set, const char* cation,
                                      const char* anion, int zc, int za, int nc, int na, double T) {
  const auto* row = set.find_binary(cation, anion);
  REQUIRE(row != nullptr);
  REQUIRE(row->extended == nullptr);
  data::single_salt_parameters p;
  p.id = std::string(cation) + anion;
  p.cation_charge = zc;
  p.anion_charge = za;
  p.cation_count = nc;
  p.anion_count = na;
  p.beta0 = row->beta0(T);
  p.beta1 = row->beta1(T);
  p.beta2 = row->beta2(T);
  p.cphi = row->cphi(T);
  p.alpha1 = zc * -za >= 4 ? 1.4 : 2.0;
  p.alpha2 = 12.0;
  return p;
}

}  // namespace

TEST_CASE("closed binary form equals the mixture kernel for one salt (1:1, 2:1, 1:2, 2:2)",
          "[pitzer][single_salt]") {
  // Same equations, same A_phi (Clegg, Rard & Pitzer 1994, the harvie_1984 correlation):
  // equal to rounding (identity; 1e-11 relative).
  const auto& set = data::find_pitzer_parameter_set("harvie_1984");
  const double T = 298.15;
  struct salt_case {
    const char* solute;
    const char* cation;
    const char* anion;
    int zc, za, nc, na;
  };
  for (const auto& c : {salt_case{"NaCl", "Na+", "Cl-", 1, -1, 1, 1},
                        salt_case{"CaCl2", "Ca+2", "Cl-", 2, -1, 1, 2},
                        salt_case{"Na2SO4", "Na+", "SO4-2", 1, -2, 2, 1},
                        salt_case{"MgSO4", "Mg+2", "SO4-2", 2, -2, 1, 1}}) {
    const auto p = from_set(set, c.cation, c.anion, c.zc, c.za, c.nc, c.na, T);
    for (double m : {0.01, 0.1, 1.0, 2.5}) {
      INFO(c.solute << " " << m << " mol/kg");
      const auto s = solution::from_molalities({{c.solute, m}});
      const auto r = models::single_salt::evaluate_closed_form(
          p, m, models::detail::debye_huckel_osmotic_slope(T));
      CHECK_THAT(r.ln_mean_activity_coefficient,
                 WithinRel(models::pitzer::ln_mean_activity_coefficient(s, 0, 1.0, T, set), 1e-11));
      CHECK_THAT(std::log(r.water_activity),
                 WithinRel(models::pitzer::ln_water_activity(s, 1.0, T, set), 1e-11));
    }
  }
}

TEST_CASE("single-salt closed form obeys Gibbs-Duhem for 1:1, 1:2 and 1:3 salts",
          "[pitzer][single_salt]") {
  // ln g_pm(m) = (phi - 1) + integral_0^m (phi - 1)/m' dm' for one salt (identity;
  // Simpson in u = sqrt m, 4000 panels; abs 1e-7).
  const double aphi = models::detail::debye_huckel_osmotic_slope(298.15);
  for (const char* salt : {"potassium_acetate", "disodium_phosphate", "trisodium_phosphate"}) {
    const auto& p = data::find_single_salt(salt);
    const auto phi_m1 = [&](double m) {
      return models::single_salt::evaluate_closed_form(p, m, aphi).osmotic_coefficient - 1.0;
    };
    for (double m : {0.05, 0.5, 0.8}) {
      INFO(salt << " " << m << " mol/kg");
      CHECK_THAT(models::single_salt::evaluate_closed_form(p, m, aphi).ln_mean_activity_coefficient,
                 WithinAbs(colligate_test::ln_gamma_from_osmotic(phi_m1, m), 1e-7));
    }
  }
}

TEST_CASE("single-salt activity: water activity, range flag and errors", "[pitzer][single_salt]") {
  // a_w = exp(-phi nu m M_w) (definition); a pure-water limit; the molality flag above
  // the data behind the fit; a temperature away from 25 C, an unknown salt and a negative
  // molality are errors naming what is wrong.
  const auto r = models::single_salt::evaluate("sodium_acetate", 2.0, 298.15);
  CHECK_THAT(r.water_activity,
             WithinRel(std::exp(-r.osmotic_coefficient * 2.0 * 2.0 * constants::molar_mass_water), 1e-15));
  CHECK(r.reason.empty());
  const auto zero = models::single_salt::evaluate("CH3COOK", 0.0, 298.15);
  CHECK(zero.osmotic_coefficient == 1.0);
  CHECK(zero.water_activity == 1.0);
  CHECK(models::single_salt::evaluate("KH2PO4", 2.0, 298.15).reason.find("1.8 mol/kg") != std::string::npos);
  // between the ice-line window and 25 C: both sets and windows are named
  CHECK_THROWS_WITH(models::single_salt::evaluate("sodium_acetate", 1.0, 285.15),
                    Catch::Contains("sodium_acetate") && Catch::Contains("may_2011") &&
                        Catch::Contains("297.65 to 298.65 K") &&
                        Catch::Contains("colligate_ice_line_fit") && Catch::Contains("to 273.15 K"));
  // a salt with a 25 C row only, on the ice line
  CHECK_THROWS_WITH(models::single_salt::evaluate("monopotassium_phosphate", 1.0, 273.15),
                    Catch::Contains("monopotassium_phosphate") && Catch::Contains("may_2011"));
  // below the lowest ice-line window (potassium acetate's ends at its fitted 256.92 K)
  CHECK_THROWS_WITH(models::single_salt::evaluate("potassium_acetate", 1.0, 250.0),
                    Catch::Contains("potassium_acetate") && Catch::Contains("256.92 to 273.15 K"));
  CHECK_THROWS_WITH(models::single_salt::evaluate("sodium lactate", 1.0, 298.15),
                    Catch::Contains("sodium lactate") && Catch::Contains("potassium_acetate"));
  CHECK_THROWS_WITH(models::single_salt::evaluate("sodium_acetate", -1.0, 298.15),
                    Catch::Contains("molality") && Catch::Contains(">= 0"));
  CHECK_THROWS_AS(models::single_salt::evaluate("sodium_acetate", std::nan(""), 298.15), invalid_input);
}

TEST_CASE("single-salt freezing point: on the ice line, from the ice-line rows", "[pitzer][single_salt]") {
  // Identity: at the root, ln a_w(m, T_f) = -phi nu m M_w equals ln a_w,ice(T_f); no solute,
  // no depression; the depression rises with molality.
  const auto& p = data::find_single_salt("trisodium_citrate", 270.0);
  REQUIRE(p.parameter_set == data::single_salt_ice_line_set_id);
  double last = constants::ice_point;
  for (double m : {0.05, 0.2, 0.5, 0.9}) {
    const double T = models::single_salt::freezing_temperature_closed_form(p, m);
    const auto a = models::single_salt::evaluate_closed_form(
        p, m, models::detail::debye_huckel_osmotic_slope(T));
    CHECK_THAT(-a.osmotic_coefficient * 4.0 * m * constants::molar_mass_water,
               WithinAbs(water::ln_water_activity_of_ice(T), 1e-12));
    CHECK(T < last);
    last = T;
    // the public entry point uses the same row and the same root
    CHECK(models::single_salt::freezing_point("Na3C6H5O7", m).temperature == T);
  }
  CHECK(models::single_salt::freezing_temperature_closed_form(p, 0.0) == constants::ice_point);
  // activity inside the ice-line window comes from the ice-line row
  const auto r = models::single_salt::evaluate("trisodium_citrate", 0.5, 270.0);
  CHECK(r.osmotic_coefficient ==
        models::single_salt::evaluate_closed_form(p, 0.5, models::detail::debye_huckel_osmotic_slope(270.0))
            .osmotic_coefficient);
  // above the fitted molalities: computed and flagged; a salt with no ice-line row: an error
  // naming the sets it has
  CHECK(models::single_salt::freezing_point("trisodium_citrate", 1.5).reason.find("mol/kg") !=
        std::string::npos);
  CHECK_THROWS_WITH(models::single_salt::freezing_point("KH2PO4", 0.5),
                    Catch::Contains("monopotassium_phosphate") && Catch::Contains("may_2011") &&
                        Catch::Contains("colligate_ice_line_fit"));
  CHECK_THROWS_WITH(models::single_salt::freezing_point("sodium_acetate", -0.1),
                    Catch::Contains("molality") && Catch::Contains(">= 0"));
}

TEST_CASE("single-salt molality from a mass fraction", "[pitzer][single_salt]") {
  // m = w / (M (1 - w)) (common practice): 9.8142 g of CH3COOK (M 0.098142 kg/mol, standard
  // atomic weights) in 100 g of water is 1 mol/kg, whichever name the salt is given by.
  const double w = 9.8142 / 109.8142;
  CHECK_THAT(models::single_salt::molality_from_mass_fraction("potassium_acetate", w),
             Catch::Matchers::WithinRel(1.0, 1e-12));
  CHECK_THAT(models::single_salt::molality_from_mass_fraction("CH3COOK", w),
             Catch::Matchers::WithinRel(1.0, 1e-12));
  CHECK(models::single_salt::molality_from_mass_fraction("potassium acetate", 0.0) == 0.0);
  for (double bad : {-0.01, 1.0, 25.0, std::nan("")})
    CHECK_THROWS_WITH(models::single_salt::molality_from_mass_fraction("potassium_acetate", bad),
                      Catch::Contains("mass fraction of 'potassium_acetate'") &&
                          Catch::Contains("[0, 1)"));
  CHECK_THROWS_WITH(models::single_salt::molality_from_mass_fraction("sodium lactate", 0.1),
                    Catch::Contains("sodium lactate"));
}

TEST_CASE("single-salt freezing-point fit recovers the parameters its data were made with",
          "[pitzer][single_salt][fit]") {
  // Identity: freezing points computed by the closed form with known parameters of a 3:1
  // and a 1:1 salt, at 0.05-1 mol/kg, are fitted back to those parameters; the analytic
  // Jacobian agrees with central differences of the model.
  for (const auto& [zc, za, nc, na, b0, b1, c] :
       {std::tuple{1, -3, 3, 1, 0.18, 4.3, -0.02}, std::tuple{1, -1, 1, 1, 0.12, 0.35, 0.004}}) {
    auto truth = data::single_salt_shape(zc, za, nc, na);
    truth.beta0 = b0;
    truth.beta1 = b1;
    truth.cphi = c;
    Eigen::VectorXd m(8), tf(8);
    for (int i = 0; i < 8; ++i) {
      m[i] = 0.05 + 0.135 * i;
      tf[i] = models::single_salt::freezing_temperature_closed_form(truth, m[i]);
    }
    const auto r = fit::fit_single_salt_freezing_point(truth, m, tf);
    REQUIRE(r.success());
    CHECK_THAT(r.params[0], WithinAbs(b0, 1e-7));
    CHECK_THAT(r.params[1], WithinAbs(b1, 1e-6));
    CHECK_THAT(r.params[2], WithinAbs(c, 1e-7));
    CHECK(r.parameter_names == std::vector<std::string>{"beta0", "beta1", "cphi"});
    // beta0 and beta1 alone (C-phi held at 0) on data made with C-phi = 0
    truth.cphi = 0.0;
    for (int i = 0; i < 8; ++i) tf[i] = models::single_salt::freezing_temperature_closed_form(truth, m[i]);
    fit::single_salt_fit_options two;
    two.fit_cphi = false;
    const auto r2 = fit::fit_single_salt_freezing_point(truth, m, tf, Eigen::VectorXd(), two);
    REQUIRE(r2.success());
    CHECK(r2.params.size() == 2);
    CHECK_THAT(r2.params[1], WithinAbs(b1, 1e-6));
    // d T_f / d beta1 by the implicit-function Jacobian against a central difference
    const double h = 1e-4;
    auto up = truth, down = truth;
    up.beta1 += h;
    down.beta1 -= h;
    const double fd = (models::single_salt::freezing_temperature_closed_form(up, 0.6) -
                       models::single_salt::freezing_temperature_closed_form(down, 0.6)) / (2 * h);
    const double T = models::single_salt::freezing_temperature_closed_form(truth, 0.6);
    const double nu = nc + na;
    const double analytic =
        nu * 0.6 * constants::molar_mass_water *
        models::single_salt::osmotic_parameter_weights(truth, 0.6)[1] /
        (models::single_salt::ln_water_activity_temperature_slope(truth, 0.6, T) -
         water::enthalpy_of_fusion(T) / (constants::gas_constant * T * T));
    CHECK_THAT(analytic, WithinRel(fd, 1e-5));
  }
}

TEST_CASE("single-salt fit: bad input names the field and its range", "[pitzer][single_salt][fit]") {
  data::single_salt_parameters s;
  Eigen::VectorXd m(3), tf(3);
  m << 0.1, 0.3, 0.6;
  tf << 272.8, 272.1, 271.0;
  s.cation_charge = 2;
  s.anion_charge = -2;
  CHECK_THROWS_WITH(fit::fit_single_salt_freezing_point(s, m, tf), Catch::Contains("2:2"));
  s.cation_charge = 1;
  s.anion_charge = -3;
  s.cation_count = 1;
  CHECK_THROWS_WITH(fit::fit_single_salt_freezing_point(s, m, tf), Catch::Contains("not neutral"));
  s.cation_count = 3;
  tf[1] = 274.0;
  CHECK_THROWS_WITH(fit::fit_single_salt_freezing_point(s, m, tf),
                    Catch::Contains("freezing_temperature in data row 1") && Catch::Contains("273.15"));
  tf[1] = 272.1;
  m[0] = -0.1;
  CHECK_THROWS_WITH(fit::fit_single_salt_freezing_point(s, m, tf),
                    Catch::Contains("molality in data row 0"));
}
