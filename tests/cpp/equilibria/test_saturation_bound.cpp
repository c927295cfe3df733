// The first-solid salt test at the freezing point first compares upper bounds of the
// saturation indices with zero (models/detail/pitzer_system.hpp, ln_gamma_upper_bounds;
// equilibria/ice_curve.hpp, saturation_ruled_out) and runs the exact test only when a bound
// does not rule every salt out. Identities on invented compositions: the bounds lie above
// the exact ln gamma, close enough to decide ordinary rows, and the first solid found with
// the bound in front is the exact test's on rows a hair either side of the onset of
// gypsum and of mirabilite before ice (tolerances: common practice).
#include <catch2/catch.hpp>
#include <algorithm>
#include <array>
#include <cmath>
#include <limits>
#include <random>
#include <string>
#include <vector>

#include "colligate/core/solution.hpp"
#include "colligate/equilibria/freezing_point.hpp"
#include "colligate/equilibria/ice_curve.hpp"
#include "colligate/equilibria/salt_solubility.hpp"
#include "colligate/models/detail/pitzer_system.hpp"
#include "colligate/models/pitzer.hpp"
#include "colligate/models/water_activity.hpp"

using namespace colligate;

namespace {

/// Exact first-solid decision at the ice freezing point of `s` under `model` (ion
/// activities from the default Pitzer set, a_w of the whole solution): the largest
/// saturation index of the phases there, on the scalar saturation routine.
double exact_max_saturation(const solution& s, const char* model = "pitzer") {
  const auto fp = equilibria::freezing_point(s, model);
  REQUIRE(fp.success());
  const double W = s.water_mass();
  const double ln_aw = models::ln_water_activity(model, s, W, fp.temperature);
  return equilibria::most_saturated_phase(s, W, fp.temperature, ln_aw).index;
}

/// Seawater of absolute salinity SA with its sulfate scaled by `sulfate` (Na2SO4 added or
/// removed): a family that crosses gypsum saturation at the freezing point.
solution seawater_with_sulfate(double SA, double sulfate) {
  const auto sw = solution::seawater(SA);
  std::vector<std::pair<std::string, double>> out;
  for (std::size_t i = 0; i < sw.size(); ++i) {
    double v = sw.molality(i);
    if (sw.species()[i].id == "sodium_sulfate") v *= sulfate;
    out.emplace_back(sw.species()[i].id, v);
  }
  return solution::from_molalities(out);
}

/// The parameter x in [lo, hi] where exact_max_saturation(make(x)) crosses zero (bisection;
/// saturated at hi, not at lo).
template <class Make>
double onset(Make make, double lo, double hi, const char* model = "pitzer") {
  REQUIRE(exact_max_saturation(make(lo), model) < 0.0);
  REQUIRE(exact_max_saturation(make(hi), model) > 0.0);
  for (int k = 0; k < 50; ++k) {
    const double mid = 0.5 * (lo + hi);
    (exact_max_saturation(make(mid), model) > 0.0 ? hi : lo) = mid;
  }
  return 0.5 * (lo + hi);
}

/// The first solid with the bound in front (ice_curve::salt_first) against the exact
/// decision, on rows at relative distances 1e-1 ... 1e-4 either side of the onset.
template <class Make>
void check_around_onset(Make make, double x0, const char* model = "pitzer") {
  int saturated = 0, not_saturated = 0;
  for (double d : {-1e-1, -1e-2, -1e-3, -1e-4, 1e-4, 1e-3, 1e-2, 1e-1}) {
    const auto s = make(x0 * (1.0 + d));
    const double si = exact_max_saturation(s, model);
    equilibria::ice_curve curve(s, model);
    const auto first = curve.salt_first();
    INFO("relative distance " << d << ", exact largest SI " << si);
    CHECK((first.phase != nullptr) == (si > 0.0));
    (si > 0.0 ? saturated : not_saturated) += 1;
  }
  CHECK(saturated == 4);
  CHECK(not_saturated == 4);
}

}  // namespace

TEST_CASE("Pitzer ln gamma upper bounds lie above the exact values, within 0.1",
          "[models][pitzer][saturation_bound]") {
  std::mt19937_64 rng(17);
  std::uniform_real_distribution<double> u(0.0, 1.0);
  const std::vector<std::string> salts = {"NaCl", "KCl", "CaCl2", "MgCl2", "Na2SO4"};
  int checked = 0;
  double widest = 0.0;
  for (int r = 0; r < 300; ++r) {
    std::vector<std::pair<std::string, double>> mol;
    for (const auto& id : salts) mol.emplace_back(id, (r % 3 == 0 ? 2.0 : 0.6) * u(rng));
    const auto s = solution::from_molalities(mol);
    models::detail::pitzer_system sys(s, models::pitzer::default_parameters());
    std::array<double, models::detail::n_ions> m{}, exact{}, hi{};
    double other = 0.0;
    sys.molalities(s.moles().data(), s.water_mass(), m.data(), other);
    const double T = 223.15 + 50.0 * u(rng);
    sys.ln_gamma_on_molalities(m.data(), T, exact.data());
    REQUIRE(sys.ln_gamma_upper_bounds(m.data(), T, hi.data()));
    for (std::size_t k = 0; k < sys.ion_slots(); ++k) {
      INFO("row " << r << ", T " << T << ", slot " << k);
      CHECK(hi[k] >= exact[k]);
      CHECK(hi[k] - exact[k] <= 0.1);  // 0.5 K bins: up to 0.06 at I near 15 mol/kg
      widest = std::max(widest, hi[k] - exact[k]);
      ++checked;
    }
  }
  CHECK(checked == 300 * 6);
  CHECK(widest > 0.0);  // the bound is a bound, not the exact value again
  // No bound outside the bins (223.15-273.15 K): the caller then runs the exact test.
  const auto s = solution::from_molalities({{"NaCl", 0.5}});
  models::detail::pitzer_system sys(s, models::pitzer::default_parameters());
  std::array<double, models::detail::n_ions> m{}, hi{};
  double other = 0.0;
  sys.molalities(s.moles().data(), s.water_mass(), m.data(), other);
  CHECK_FALSE(sys.ln_gamma_upper_bounds(m.data(), 298.15, hi.data()));
  CHECK_FALSE(sys.ln_gamma_upper_bounds(m.data(), 220.0, hi.data()));
}

TEST_CASE("first solid with the saturation bound in front is the exact test's near gypsum onset",
          "[equilibria][saturation_bound][seawater]") {
  // Seawater of SA 40 g/kg freezes unsaturated (largest SI about -0.95, gypsum); more
  // sulfate brings gypsum to saturation at the freezing point.
  const auto make = [](double sulfate) { return seawater_with_sulfate(40.0, sulfate); };
  const double x0 = onset(make, 1.0, 20.0);
  check_around_onset(make, x0);
}

TEST_CASE("first solid with the saturation bound in front is the exact test's near mirabilite onset",
          "[equilibria][saturation_bound]") {
  // A Na2SO4 brine richer than its eutectic composition saturates in mirabilite before ice.
  const auto make = [](double m) { return solution::from_molalities({{"Na2SO4", m}}); };
  const double x0 = onset(make, 0.05, 1.5);
  check_around_onset(make, x0);
}

TEST_CASE("first solid with the saturation bound in front is the exact test's for a Na2SO4 + sucrose mixture (Ross)",
          "[equilibria][saturation_bound][ross]") {
  // The sugar lowers a_w (and the freezing point), so mirabilite comes at another Na2SO4.
  const auto make = [](double m) {
    return solution::from_molalities({{"Na2SO4", m}, {"sucrose", 0.5}});
  };
  const double x0 = onset(make, 0.05, 1.5, "ross");
  check_around_onset(make, x0, "ross");
}

TEST_CASE("ln K lower bound per temperature bin lies below ln K everywhere in the bin",
          "[equilibria][saturation_bound]") {
  // salt_phase::ln_k_lower_bound on the 1/8 K bins of ice_curve (219 K to the ice point),
  // every phase, published K and each built-in set's shift; 64 points per bin and the ends.
  // How far below: the chord gap h^2/8 |ln K''| (h = 1/8 K) with the term-wise curvature
  // bound, under 0.05 for these rows (tolerance: common practice, set by that formula).
  int checked = 0;
  double widest = 0.0;
  for (const auto* set : {&data::spencer_1990_parameters(), &data::spencer_1990_icefit_parameters(),
                          &data::harvie_1984_parameters(), &data::harvie_spencer_icefit_parameters()}) {
    for (const auto& ph : equilibria::salt_phases()) {
      const auto* shift = set->find_solubility_shift(ph.formula);
      for (int i = 0; i < 55 * 8; ++i) {
        const double a = 219.0 + i / 8.0, b = a + 1.0 / 8.0;
        const double floor = ph.ln_k_lower_bound(a, b, shift);
        double lowest = std::numeric_limits<double>::infinity();
        for (int k = 0; k <= 64; ++k) {
          const double T = k == 64 ? b : a + k * (b - a) / 64.0;
          const double lnk = ph.ln_k(T, shift);
          INFO(ph.formula << " at " << T << " K");
          CHECK(floor <= lnk);
          lowest = std::min(lowest, lnk);
          ++checked;
        }
        widest = std::max(widest, lowest - floor);
      }
    }
  }
  CHECK(checked > 0);
  CHECK(widest > 0.0);   // a bound, not ln K again
  CHECK(widest < 0.05);  // close enough not to send ordinary rows to the exact test
}

TEST_CASE("Pitzer ln gamma upper bounds from the last J values of the freezing-point solve",
          "[models][pitzer][saturation_bound]") {
  // ln_gamma_upper_bounds takes J and J' at x from the J of the last
  // ln_water_activity_along_temperature (x_last differs by A_phi(T)/A_phi(T_last)) with a
  // Taylor remainder: still above the exact ln gamma, and close to the bounds from J
  // evaluated at x: within 1e-2 |T - T_last| per K plus 1e-12 (a converged Newton stops
  // within 1e-9 K), the x J' remainder x max|J''| |x - x_last| = 0.2 |x - x_last| dominating,
  // |x - x_last| / x = |A_phi(T) / A_phi(T_last) - 1| about 3e-4 |T - T_last| per K,
  // times the E-theta' factors z z' / (8 I^2), large at small I (tolerance: from that formula).
  std::mt19937_64 rng(29);
  std::uniform_real_distribution<double> u(0.0, 1.0);
  const std::vector<std::string> salts = {"NaCl", "KCl", "CaCl2", "MgCl2", "Na2SO4"};
  int differ = 0;
  double worst = 0.0;
  for (int r = 0; r < 200; ++r) {
    std::vector<std::pair<std::string, double>> mol;
    for (const auto& id : salts) mol.emplace_back(id, (r % 3 == 0 ? 2.0 : 0.6) * u(rng));
    const auto s = solution::from_molalities(mol);
    models::detail::pitzer_system plain(s, models::pitzer::default_parameters());
    models::detail::pitzer_system after(s, models::pitzer::default_parameters());
    std::array<double, models::detail::n_ions> m{}, exact{}, hi{}, hi_last{};
    double other = 0.0, slope = 0.0;
    plain.molalities(s.moles().data(), s.water_mass(), m.data(), other);
    const double T = 223.15 + 50.0 * u(rng);
    // the last temperature of a Newton that stopped a little away from T
    const double T_last = T + (r % 2 == 0 ? 1e-6 : -3e-4) * u(rng);
    after.ln_water_activity_along_temperature(s.moles().data(), s.water_mass(), T_last, slope);
    plain.ln_gamma_on_molalities(m.data(), T, exact.data());
    REQUIRE(plain.ln_gamma_upper_bounds(m.data(), T, hi.data()));
    REQUIRE(after.ln_gamma_upper_bounds(m.data(), T, hi_last.data()));
    for (std::size_t k = 0; k < plain.ion_slots(); ++k) {
      INFO("row " << r << ", T " << T << ", slot " << k);
      CHECK(hi_last[k] >= exact[k]);
      CHECK(hi_last[k] >= hi[k] - 1e-14);  // the remainder bounds widen (up to rounding)
      CHECK(hi_last[k] - hi[k] <= 1e-2 * std::abs(T - T_last) + 1e-12);
      worst = std::max(worst, (hi_last[k] - hi[k]) / std::abs(T - T_last));
      if (hi_last[k] != hi[k]) ++differ;
    }
  }
  CHECK(differ > 0);  // the last J values were used
  INFO("largest widening per K of T - T_last: " << worst);
  CHECK(worst < 1e-2);  // 1.1e-3 with this seed
}
