// One salt in water by the closed binary Pitzer form (models/pitzer_single_salt.hpp):
// the same equations as the mixture kernel, Gibbs-Duhem consistency for unsymmetrical
// charges, and the errors the issue asks for (salt, set and temperature range named).
#include <catch2/catch.hpp>
#include <cmath>
#include <string>

#include "../gibbs_duhem.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/data/pitzer_parameters.hpp"
#include "colligate/data/single_salt_pitzer.hpp"
#include "colligate/models/pitzer.hpp"
#include "colligate/models/pitzer_single_salt.hpp"

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
  CHECK_THROWS_WITH(models::single_salt::evaluate("sodium_acetate", 1.0, 273.15),
                    Catch::Contains("sodium_acetate") && Catch::Contains("may_2011") &&
                        Catch::Contains("297.65 to 298.65 K"));
  CHECK_THROWS_WITH(models::single_salt::evaluate("sodium lactate", 1.0, 298.15),
                    Catch::Contains("sodium lactate") && Catch::Contains("potassium_acetate"));
  CHECK_THROWS_WITH(models::single_salt::evaluate("sodium_acetate", -1.0, 298.15),
                    Catch::Contains("molality") && Catch::Contains(">= 0"));
  CHECK_THROWS_AS(models::single_salt::evaluate("sodium_acetate", std::nan(""), 298.15), invalid_input);
}
