#pragma once
/// \file salt_solubility.hpp
/// Solubility of the salt phases that coexist with ice in Na-K-Ca-Mg-Cl-SO4 brines, as
/// solubility products K(T) of the same low-temperature model as the Pitzer set
/// "spencer_1990" (Spencer, Moller & Weare 1990; sulfates from Marion & Farren 1999),
/// as published; a parameter set that changes a salt's activities carries the matching
/// shift of that phase's K (data::pitzer_parameter_set::solubility_shifts: hydrohalite and
/// antarcticite in the default set "spencer_1990_icefit"), applied by ln_k(T, set).
///
/// For a phase  M_p X_q . n H2O = p M + q X + n H2O:
///
///     saturation index  SI = ln(IAP) - ln K,   IAP = (m_M gamma_M)^p (m_X gamma_X)^q a_w^n
///
/// SI > 0 means the solution is supersaturated: the salt would crystallise.
/// ln K(T) = ln 10 * log10 K(T) with PHREEQC's analytic form
///     log10 K = A1 + A2 T + A3 / T + A4 log10 T + A5 / T^2 + A6 T^2,
/// coefficients copied from the PHREEQC database frezchem.dat (Toner & Sletten 2013
/// refit of the FREZCHEM functions). Cross-checks: halite log10 K(298.15 K) = 1.576 and
/// the same file's ice expression reproduce our ice model within 5e-4 in a_w at 253 K
/// (tests/cpp/equilibria/test_eutectic.cpp). Valid 219.15-298.15 K.

#include <algorithm>
#include <array>
#include <cmath>
#include <limits>
#include <string>
#include <utility>
#include <vector>

#include "colligate/core/solution.hpp"
#include "colligate/data/pitzer_parameters.hpp"
#include "colligate/models/pitzer.hpp"

namespace colligate::equilibria {

struct salt_phase {
  std::string name;     ///< mineral name ("hydrohalite")
  std::string formula;  ///< "NaCl.2H2O"
  std::vector<std::pair<std::string, int>> ions;  ///< ion name, count per formula unit
  int water = 0;                                  ///< waters of hydration
  std::array<double, 6> log10_k{};                ///< A1..A6 of the analytic form
  std::string source;

  /// ln K(T) as published (no set's shift).
  double ln_k(double T) const { return ln_k(T, nullptr); }
  /// ln K(T) with a parameter set's shift of this phase added to A1..A6 (nullptr: none;
  /// data::pitzer_parameter_set::find_solubility_shift(formula) gives it).
  double ln_k(double T, const std::array<double, 6>* shift) const {
    return ln_k(T, std::log10(T), shift);
  }
  /// The same with log10(T) given (`log10_t`): a test of many phases at one temperature
  /// takes the logarithm once.
  double ln_k(double T, double log10_t, const std::array<double, 6>* shift) const {
    double sum = 0.0;
    const auto add = [&](const std::array<double, 6>& a) {
      sum += a[0] + a[1] * T + a[2] / T + a[3] * log10_t + a[4] / (T * T) + a[5] * T * T;
    };
    add(log10_k);
    if (shift != nullptr) add(*shift);
    return std::log(10.0) * sum;
  }
  /// A lower bound of ln K(T) (with `shift` as in ln_k) over the whole interval
  /// a <= T <= b (219.15 K <= a < b): the smaller of the values at the ends, less the
  /// chord's largest gap to a convex-or-not curve, (b - a)^2 / 8 max|ln K''|, with
  /// |ln K''| <= ln 10 (2|A3|/a^3 + |A4|/(ln 10 a^2) + 6|A5|/a^4 + 2|A6|) term by term
  /// (each term's size falls with T), less 1e-12 of the terms' sizes for the rounding of
  /// the two evaluations. For a saturation bound, which needs ln K from below.
  double ln_k_lower_bound(double a, double b, const std::array<double, 6>* shift) const {
    std::array<double, 6> A = log10_k;
    if (shift != nullptr)
      for (int k = 0; k < 6; ++k) A[k] += (*shift)[k];
    const double ln10 = std::log(10.0);
    const double curvature = ln10 * (2.0 * std::abs(A[2]) / (a * a * a) +
                                     std::abs(A[3]) / (ln10 * a * a) +
                                     6.0 * std::abs(A[4]) / (a * a * a * a) + 2.0 * std::abs(A[5]));
    const double la = std::log10(a), lb = std::log10(b);
    double size = 0.0;
    for (const auto& [T, lt] : {std::pair{a, la}, std::pair{b, lb}})
      size = std::max(size, ln10 * (std::abs(A[0]) + std::abs(A[1] * T) + std::abs(A[2] / T) +
                                    std::abs(A[3] * lt) + std::abs(A[4] / (T * T)) +
                                    std::abs(A[5] * T * T)));
    return std::min(ln_k(a, la, shift), ln_k(b, lb, shift)) - (b - a) * (b - a) / 8.0 * curvature -
           1e-12 * size;
  }
  /// ln K(T) that goes with the activities of parameter set `set`.
  double ln_k(double T, const data::pitzer_parameter_set& set) const {
    return ln_k(T, set.find_solubility_shift(formula));
  }
};

inline constexpr double salt_phase_min_temperature = 219.15;
inline constexpr double salt_phase_max_temperature = 298.15;

/// The salt phases known to colligate (frezchem.dat PHASES rows).
inline const std::vector<salt_phase>& salt_phases() {
  static const std::vector<salt_phase> phases = {
      // hydrohalite and antarcticite: the default set "spencer_1990_icefit" carries the
      // shift of their K that goes with its NaCl and CaCl2 activities below 25 C
      // (data/pitzer_parameters.hpp, solubility_shifts).
      {"hydrohalite", "NaCl.2H2O", {{"Na+", 1}, {"Cl-", 1}}, 2,
       {-2366.884053, -1.81627952, 24690.3183, 1098.482092, 1523945.4, 0.001033303},
       "spencer_1990"},
      {"halite", "NaCl", {{"Na+", 1}, {"Cl-", 1}}, 0,
       {596.809454, 0.73058662, 9360.9197, -315.516708, -1749318.4, -0.000495535},
       "spencer_1990"},
      {"sylvite", "KCl", {{"K+", 1}, {"Cl-", 1}}, 0,
       {-114.93339, -0.1612449, -3569.5943, 66.15685, 307041.4, 9.81432E-05}, "spencer_1990"},
      {"antarcticite", "CaCl2.6H2O", {{"Ca+2", 1}, {"Cl-", 2}}, 6,
       {-38613.99886, -14.14140164, 1381731.005, 15479.47256, -52024247.5, 0.005422163},
       "spencer_1990"},
      {"magnesium chloride dodecahydrate", "MgCl2.12H2O", {{"Mg+2", 1}, {"Cl-", 2}}, 12,
       {6251.417981, 18.27412717, 610125.588, -4799.728491, -54142200.5, -0.014127812},
       "spencer_1990"},
      // The hydrates of concentrated MgCl2 brines above -17 C (octahydrate) and -3.4 C
      // (bischofite, the salt of a saturated MgCl2 solution at room temperature); the
      // default set carries the shift of bischofite's K that goes with its MgCl2 activities.
      {"magnesium chloride octahydrate", "MgCl2.8H2O", {{"Mg+2", 1}, {"Cl-", 2}}, 8,
       {989.331411, 0.28201417, -27059.8088, -395.438891, 0, 0}, "spencer_1990"},
      {"bischofite", "MgCl2.6H2O", {{"Mg+2", 1}, {"Cl-", 2}}, 6,
       {326.68721, 0.05106637, -10563.0802, -121.990076, 0, 0}, "spencer_1990"},
      {"mirabilite", "Na2SO4.10H2O", {{"Na+", 2}, {"SO4-2", 1}}, 10,
       {-20.12422, 0.07613508, 0, 0, 0, -4.26568E-05}, "marion_farren_1999"},
      {"meridianiite", "MgSO4.11H2O", {{"Mg+2", 1}, {"SO4-2", 1}}, 11,
       {-13.417432, 0.04061372, 0, 0, 0, 0}, "marion_farren_1999"},
      {"epsomite", "MgSO4.7H2O", {{"Mg+2", 1}, {"SO4-2", 1}}, 7,
       {1.718069, 0, -1073.1417, 0, 0, 0}, "marion_farren_1999"},
      {"arcanite", "K2SO4", {{"K+", 2}, {"SO4-2", 1}}, 0, {2.822914, 0, -1371.198, 0, 0, 0},
       "marion_farren_1999"},
      {"gypsum", "CaSO4.2H2O", {{"Ca+2", 1}, {"SO4-2", 1}}, 2,
       {-2136.655631, -1.43513531, 47367.1982, 944.564423, -1086550.1, 0.000855338},
       "marion_farren_1999"},
  };
  return phases;
}

/// The most supersaturated phase of a solution state.
struct saturation {
  double index = -std::numeric_limits<double>::infinity();  ///< ln(IAP / K); > 0: crystallises
  const salt_phase* phase = nullptr;
};

/// Largest saturation index over the salt phases whose ions are present, for the
/// solutes of `s` in `water_kg` of water at T, with the water activity `ln_aw` of the
/// whole solution (so non-electrolytes lower a_w for hydrates), with the ion activity
/// coefficients and solubility shifts of Pitzer set `set` (the default set unless named).
inline saturation most_saturated_phase(
    const solution& s, double water_kg, double T, double ln_aw,
    const data::pitzer_parameter_set& set = models::pitzer::default_parameters()) {
  saturation out;
  if (!s.has_electrolytes()) return out;
  double other = 0.0;
  const auto ions = s.only(data::solute_class::electrolyte);
  // The prepared system applies the parameters a fitted salt record carries.
  models::detail::pitzer_system system(ions, set);
  std::array<double, models::detail::n_ions> m{}, ln_gamma{};
  system.molalities(ions.moles().data(), water_kg, m.data(), other);
  system.ln_gamma_on_molalities(m.data(), T, ln_gamma.data());
  for (const auto& ph : salt_phases()) {
    double ln_iap = ph.water * ln_aw;
    bool present = true;
    for (const auto& [ion, count] : ph.ions) {
      const auto k = system.slot_of(data::pitzer_ion_index(ion));
      if (k >= system.ion_slots() || !(m[k] > 0.0)) {
        present = false;
        break;
      }
      ln_iap += count * (std::log(m[k]) + ln_gamma[k]);
    }
    if (!present) continue;
    const double si = ln_iap - ph.ln_k(T, set);
    if (si > out.index) {
      out.index = si;
      out.phase = &ph;
    }
  }
  return out;
}

}  // namespace colligate::equilibria
