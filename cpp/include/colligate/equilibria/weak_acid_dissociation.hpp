#pragma once
/// \file weak_acid_dissociation.hpp
/// How far a weak acid of food (data/weak_acids.hpp) dissociates in water, and the freezing
/// point of its binary solution with the acid split into its forms.
///
/// Speciation of an acid H_nA of total molality m at temperature T (K): with h the molality
/// of H+, the fractions of the forms H_(n-j)A^j- are alpha_j = beta_j / sum_k beta_k,
/// beta_0 = 1, beta_j = beta_(j-1) K'_j / h, and h solves the proton (charge) balance
///
///     h = m sum_j j alpha_j(h) + K'_w / h
///
/// (a root in ln h by TOMS 748, core/roots.hpp: the left side minus the right rises with h).
/// K'_j are the constants on the molal scale at the ionic strength I of the solution:
/// ln K'_j = ln K_j - 2 j f(I), where ln gamma of an ion of charge z is z^2 f(I) and f is the
/// Debye-Hueckel term of Pitzer's equations,
///
///     f(I) = -A_phi [ sqrt(I) / (1 + b sqrt(I)) + (2 / b) ln(1 + b sqrt(I)) ],  b = 1.2,
///
/// with A_phi(T) of Clegg, Rard & Pitzer (1994) (Pitzer 1991, eq. for f^gamma; the same
/// A_phi the Pitzer model uses). The undissociated acid is given gamma = 1 and the water
/// activity in K_w is taken as 1. I (the acid's ions plus an optional background ionic
/// strength from other salts) is found by fixed-point iteration around the root. The
/// Debye-Hueckel term alone holds at low ionic strength: above 0.1 mol/kg the result is
/// flagged (validity_code::concentration_out_of_range), since the ions' short-range terms
/// are left out.
///
/// Freezing point (binary acid solution): the ice condition ln a_w(T) = ln a_w,ice(T)
/// (water/ice.hpp) with
///
///     ln a_w = ln x_w - K x_u^2 + M_w 2 A_phi I^(3/2) / (1 + b sqrt(I))
///
/// x_w and x_u the mole fractions of water and of the undissociated acid among water, the
/// undissociated acid, its anions, H+ and OH- (every form counted as one particle), K the
/// Norrish constant of the undissociated acid (data/weak_acids.hpp, fitted on that basis),
/// and the last term the Debye-Hueckel osmotic term of the ions (Pitzer 1991), consistent
/// with f(I) above. The acid is re-speciated at every T (pKa(T), A_phi(T)).

#include <algorithm>
#include <cmath>
#include <limits>
#include <string>
#include <vector>

#include "colligate/core/constants.hpp"
#include "colligate/core/errors.hpp"
#include "colligate/core/roots.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/data/weak_acids.hpp"
#include "colligate/models/detail/pitzer_kernel.hpp"
#include "colligate/water/ice.hpp"

namespace colligate::equilibria {

/// How the ions' activity coefficients are taken.
enum class ion_activity { debye_huckel, ideal };

/// Ionic strength (mol/kg) above which the Debye-Hueckel term alone is flagged.
inline constexpr double weak_acid_max_ionic_strength = 0.1;

/// The split of one acid at one state.
struct weak_acid_speciation {
  std::string acid;           ///< id of the acid
  double temperature = 0.0;   ///< K
  double acid_molality = 0.0; ///< total acid, all forms, mol/kg
  std::vector<double> pka;    ///< thermodynamic pKa of each step at T
  /// Fraction of the acid in each form: [0] undissociated H_nA, [j] the form that has lost
  /// j protons. Sums to 1.
  std::vector<double> fractions;
  double degree_of_dissociation = 0.0;  ///< 1 - fractions[0]
  double hydrogen_ion_molality = 0.0;   ///< mol/kg
  double hydroxide_molality = 0.0;      ///< mol/kg
  double ionic_strength = 0.0;          ///< mol/kg, including the background given
  double ln_gamma_univalent = 0.0;      ///< f(I): ln gamma of an ion of charge 1
  double ph = 0.0;                      ///< -log10(gamma_H m_H), molal scale
  /// Dissolved particles of the acid and of water's ions, mol/kg: m (every form once)
  /// plus H+ and OH-.
  double particle_molality = 0.0;
  /// True when every step has a temperature function; false when a 25 C pKa was used.
  bool temperature_function = true;
  root_status status = root_status::converged;
  int iterations = 0;  ///< fixed-point iterations on the ionic strength
  validity check;      ///< temperature outside a pKa function's range; ionic strength too high
};

namespace detail {

/// f(I) of the file comment at A_phi `aphi`.
inline double debye_huckel_f_gamma(double ionic_strength, double aphi) {
  const double b = models::detail::pitzer_b;
  const double s = std::sqrt(ionic_strength);
  return -aphi * (s / (1.0 + b * s) + (2.0 / b) * std::log1p(b * s));
}

/// The Debye-Hueckel part of sum_i m_i (phi - 1) at I: -2 A_phi I^(3/2) / (1 + b sqrt I).
inline double debye_huckel_osmotic_excess(double ionic_strength, double aphi) {
  const double s = std::sqrt(ionic_strength);
  return -2.0 * aphi * ionic_strength * s / (1.0 + models::detail::pitzer_b * s);
}

}  // namespace detail

/// Speciation of `acid` at total molality `molality` (mol/kg, > 0) and temperature
/// `temperature` (K), with `background_ionic_strength` (mol/kg, >= 0) from other salts of
/// the solution (it raises I, not the proton balance).
inline weak_acid_speciation speciate_weak_acid(const data::weak_acid& acid, double molality,
                                               double temperature,
                                               double background_ionic_strength = 0.0,
                                               ion_activity activity = ion_activity::debye_huckel) {
  if (!(std::isfinite(molality) && molality > 0.0))
    throw invalid_input(colligate::detail::describe("speciate_weak_acid", "molality", molality,
                                                    "must be finite and > 0 mol/kg"));
  if (!(std::isfinite(temperature) && temperature > 0.0))
    throw invalid_input(colligate::detail::describe("speciate_weak_acid", "temperature",
                                                    temperature, "must be finite and > 0 K"));
  if (!(std::isfinite(background_ionic_strength) && background_ionic_strength >= 0.0))
    throw invalid_input(colligate::detail::describe("speciate_weak_acid",
                                                    "background_ionic_strength",
                                                    background_ionic_strength,
                                                    "must be finite and >= 0 mol/kg"));
  weak_acid_speciation r;
  r.acid = acid.id;
  r.temperature = temperature;
  r.acid_molality = molality;
  const std::size_t n = acid.steps.size();
  const double ln10 = std::log(10.0);
  std::vector<double> ln_k(n);
  for (std::size_t j = 0; j < n; ++j) {
    const auto& st = acid.steps[j];
    r.pka.push_back(st.pka(temperature));
    ln_k[j] = -ln10 * r.pka.back();
    r.temperature_function = r.temperature_function && st.temperature_function;
    if (st.temperature_function && r.check.in_range() &&
        (temperature < st.min_temperature - 1e-9 || temperature > st.max_temperature + 1e-9))
      r.check = outside_range("weak acid '" + acid.id + "'", "temperature of its pKa function",
                              temperature, st.min_temperature, st.max_temperature, " K",
                              "the range of the measurements (extrapolated)", st.source);
  }
  const double ln_kw = -ln10 * data::water_ionisation().pka(temperature);
  const double aphi = activity == ion_activity::ideal
                          ? 0.0
                          : models::detail::debye_huckel_osmotic_slope(temperature);

  std::vector<double> beta(n + 1), ln_kp(n);
  double ionic = background_ionic_strength, f = 0.0, h = 0.0, ln_kwp = ln_kw;
  // Fractions at h for the conditional constants ln_kp (beta_j in logs, scaled by the
  // largest, so that no power of h under- or overflows).
  const auto fractions_at = [&](double ln_h) {
    double lb = 0.0, top = 0.0;
    beta[0] = 0.0;
    for (std::size_t j = 0; j < n; ++j) {
      lb += ln_kp[j] - ln_h;
      beta[j + 1] = lb;
      top = std::max(top, lb);
    }
    double sum = 0.0;
    for (auto& b : beta) {
      b = std::exp(b - top);
      sum += b;
    }
    for (auto& b : beta) b /= sum;
  };
  const double proton_capacity = static_cast<double>(n) * molality;
  const auto balance = [&](double ln_h) {
    fractions_at(ln_h);
    double bound = 0.0;
    for (std::size_t j = 1; j <= n; ++j) bound += static_cast<double>(j) * beta[j];
    const double hh = std::exp(ln_h);
    return hh - molality * bound - std::exp(ln_kwp - ln_h);
  };
  int it = 0;
  for (; it < 200; ++it) {
    f = detail::debye_huckel_f_gamma(ionic, aphi);
    for (std::size_t j = 0; j < n; ++j) ln_kp[j] = ln_k[j] - 2.0 * static_cast<double>(j + 1) * f;
    ln_kwp = ln_kw - 2.0 * f;
    const double sqrt_kw = std::exp(0.5 * ln_kwp);
    const double hi = std::log(proton_capacity + 2.0 * sqrt_kw);
    const double lo = ln_kwp - std::log(proton_capacity + sqrt_kw);
    const auto root = toms748_root(balance, lo, hi, balance(lo), balance(hi), 52, 200);
    r.status = root.status;
    if (root.status == root_status::no_sign_change) break;
    const double ln_h = root.x;
    fractions_at(ln_h);
    h = std::exp(ln_h);
    double charge2 = 0.0;
    for (std::size_t j = 1; j <= n; ++j) charge2 += static_cast<double>(j * j) * beta[j];
    const double oh = std::exp(ln_kwp - ln_h);
    const double next = background_ionic_strength + 0.5 * (h + oh + molality * charge2);
    const bool done = std::abs(next - ionic) <= 1e-14 * std::max(next, 1e-300);
    ionic = next;
    r.hydroxide_molality = oh;
    if (done || activity == ion_activity::ideal) break;
  }
  r.iterations = it + 1;
  if (it == 200) r.status = root_status::max_iterations;
  if (r.status == root_status::no_sign_change) {
    const double nan = std::numeric_limits<double>::quiet_NaN();
    r.fractions.assign(n + 1, nan);
    r.degree_of_dissociation = r.hydrogen_ion_molality = r.ionic_strength = r.ph = nan;
    r.particle_molality = nan;
    return r;
  }
  r.fractions = beta;
  r.degree_of_dissociation = 1.0 - beta[0];
  r.hydrogen_ion_molality = h;
  r.ionic_strength = ionic;
  r.ln_gamma_univalent = detail::debye_huckel_f_gamma(ionic, aphi);
  r.ph = -(std::log(h) + r.ln_gamma_univalent) / ln10;
  r.particle_molality = molality + h + r.hydroxide_molality;
  if (r.check.in_range() && activity == ion_activity::debye_huckel &&
      ionic > weak_acid_max_ionic_strength)
    r.check = beyond_limit("weak acid '" + acid.id + "'", "ionic strength", ionic,
                           weak_acid_max_ionic_strength, " mol/kg",
                           "the Debye-Hueckel term alone (no short-range ion terms)",
                           "pitzer_1991");
  return r;
}

/// ln a_w of a binary solution of `acid` (total molality `molality`, mol/kg) at T, the
/// undissociated part with Norrish constant `norrish_k` (file comment); `sp` receives the
/// speciation used.
inline double weak_acid_ln_water_activity(const data::weak_acid& acid, double molality,
                                          double temperature, double norrish_k,
                                          weak_acid_speciation* sp = nullptr) {
  const auto s = speciate_weak_acid(acid, molality, temperature);
  const double mw = constants::molar_mass_water;
  const double denominator = 1.0 + mw * s.particle_molality;  // (n_w + n) / n_w per kg water
  const double x_u = mw * molality * s.fractions[0] / denominator;
  const double aphi = models::detail::debye_huckel_osmotic_slope(temperature);
  const double ln_aw = -std::log(denominator) - norrish_k * x_u * x_u -
                       mw * detail::debye_huckel_osmotic_excess(s.ionic_strength, aphi);
  if (sp != nullptr) *sp = s;
  return ln_aw;
}

/// The freezing point of a binary acid solution with dissociation (file comment).
struct weak_acid_freezing_result {
  double temperature = std::numeric_limits<double>::quiet_NaN();  ///< K
  weak_acid_speciation speciation;  ///< at the freezing point
  root_status status = root_status::no_sign_change;
  /// Above the acid's highest CRC-checked molality (data::weak_acid::max_molality_checked).
  /// The pKa functions are extrapolated a few K below 0 C on the ice line (their data start
  /// at 0 C); that is part of what the CRC rows check, so speciation.check may name it while
  /// this record stays in range.
  validity check;
};

inline weak_acid_freezing_result weak_acid_freezing_point(const data::weak_acid& acid,
                                                          double molality, double norrish_k) {
  if (!std::isfinite(norrish_k))
    throw invalid_input(colligate::detail::describe("weak_acid_freezing_point", "norrish_k",
                                                    norrish_k, "must be finite"));
  weak_acid_freezing_result out;
  if (!(molality <= acid.max_molality_checked))
    out.check = beyond_limit("weak_acid_freezing_point ('" + acid.id + "')", "molality", molality,
                             acid.max_molality_checked, " mol/kg",
                             "the highest CRC Handbook row that checks it", "crc_concentrative");
  const auto g = [&](double T) {
    return weak_acid_ln_water_activity(acid, molality, T, norrish_k) -
           water::ln_water_activity_of_ice(T);
  };
  const double hi = constants::ice_point;
  const double g_hi = g(hi);
  double lo = hi, g_lo = g_hi;
  // Step down until the solution's a_w lies above that of ice (g > 0), to 215 K.
  while (g_lo < 0.0 && lo > water::ice_model_lowest_temperature + 5.0) {
    lo -= 5.0;
    g_lo = g(lo);
  }
  const auto root = toms748_root(g, lo, hi, g_lo, g_hi, 50, 200);
  out.status = root.status;
  if (root.status != root_status::no_sign_change) {
    out.temperature = root.x;
    weak_acid_ln_water_activity(acid, molality, root.x, norrish_k, &out.speciation);
  }
  return out;
}

}  // namespace colligate::equilibria
