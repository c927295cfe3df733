#pragma once
/// \file pitzer_single_salt.hpp
/// One salt in water by the Pitzer equations in their closed binary form (Pitzer &
/// Mayorga 1973; Pitzer 1991, ch. 3): osmotic coefficient, mean activity coefficient and
/// water activity of M_(nu_M) X_(nu_X) at molality m,
///
///     phi - 1   = |z_M z_X| f_phi + m (2 nu_M nu_X / nu) B_phi + m^2 (2 (nu_M nu_X)^1.5 / nu) C_phi
///     ln g_pm   = |z_M z_X| f_g   + m (2 nu_M nu_X / nu) B_g   + m^2 (2 (nu_M nu_X)^1.5 / nu) 1.5 C_phi
///     f_phi     = -A_phi sqrt(I) / (1 + b sqrt(I))
///     f_g       = -A_phi [sqrt(I) / (1 + b sqrt(I)) + (2/b) ln(1 + b sqrt(I))]
///     B_phi     = beta0 + beta1 exp(-alpha1 sqrt(I)) + beta2 exp(-alpha2 sqrt(I))
///     B_g       = 2 beta0 + 2 beta1 h(alpha1 sqrt(I)) + 2 beta2 h(alpha2 sqrt(I)),
///                 h(x) = [1 - (1 + x - x^2/2) exp(-x)] / x^2
///     ln a_w    = -phi nu m M_w,   I = m (nu_M z_M^2 + nu_X z_X^2) / 2,   b = 1.2
///
/// with A_phi(T) of Clegg, Rard & Pitzer (1994) (models/detail/pitzer_kernel.hpp), the
/// same function the mixture kernel uses, so a salt both tables hold gives the same values
/// in both (tested). It serves the salts of data/single_salt_pitzer.hpp, whose rows each hold
/// in one temperature window (25 C for the may_2011 set; the ice line, 273.15 K down to the
/// lowest fitted freezing point, for the colligate_ice_line_fit set): a temperature in no
/// window of the salt is an error naming the salt, its sets and their windows; a molality
/// above the data behind the fit is computed and flagged (`reason`).
///
/// The freezing point of one salt solution is the T at which ln a_w(m, T) equals
/// ln a_w,ice(T) (water/ice.hpp), with the salt's ice-line row and A_phi(T).

#include <array>
#include <cmath>
#include <limits>
#include <sstream>
#include <string>

#include "colligate/core/constants.hpp"
#include "colligate/core/errors.hpp"
#include "colligate/data/single_salt_pitzer.hpp"
#include "colligate/core/roots.hpp"
#include "colligate/models/detail/pitzer_kernel.hpp"
#include "colligate/water/ice.hpp"

namespace colligate::models::single_salt {

/// Values of one salt solution; `reason` is empty inside the parameters' molality range.
struct activity {
  double osmotic_coefficient = 1.0;
  double ln_mean_activity_coefficient = 0.0;
  double water_activity = 1.0;
  std::string reason;
};

/// The closed binary form at molality m (mol/kg) and Debye-Hueckel slope aphi; no checks.
inline activity evaluate_closed_form(const data::single_salt_parameters& p, double m, double aphi) {
  activity r;
  if (m == 0.0) return r;
  constexpr double b = 1.2;
  const double nm = p.cation_count, nx = p.anion_count, nu = nm + nx;
  const double zz = std::abs(static_cast<double>(p.cation_charge * p.anion_charge));
  const double I = 0.5 * m *
                   (nm * p.cation_charge * p.cation_charge + nx * p.anion_charge * p.anion_charge);
  const double sI = std::sqrt(I);
  const double x1 = p.alpha1 * sI, x2 = p.alpha2 * sI;
  const auto h = [](double x) { return (1.0 - (1.0 + x - 0.5 * x * x) * std::exp(-x)) / (x * x); };
  const double f_phi = -aphi * sI / (1.0 + b * sI);
  const double f_g = -aphi * (sI / (1.0 + b * sI) + 2.0 / b * std::log1p(b * sI));
  const double b_phi = p.beta0 + p.beta1 * std::exp(-x1) + p.beta2 * std::exp(-x2);
  const double b_g = 2.0 * p.beta0 + 2.0 * p.beta1 * h(x1) + 2.0 * p.beta2 * h(x2);
  const double wb = 2.0 * nm * nx / nu, wc = 2.0 * std::pow(nm * nx, 1.5) / nu;
  r.osmotic_coefficient = 1.0 + zz * f_phi + m * wb * b_phi + m * m * wc * p.cphi;
  r.ln_mean_activity_coefficient = zz * f_g + m * wb * b_g + m * m * wc * 1.5 * p.cphi;
  r.water_activity = std::exp(-r.osmotic_coefficient * nu * m * constants::molar_mass_water);
  return r;
}

/// The weights of beta0..C-phi in phi at molality m: phi = phi_DH + sum_j g_j p_j with
/// p = (beta0, beta1, beta2, C-phi) (the closed form is linear in them).
inline std::array<double, 4> osmotic_parameter_weights(const data::single_salt_parameters& p,
                                                       double m) {
  const double nm = p.cation_count, nx = p.anion_count, nu = nm + nx;
  const double I = 0.5 * m *
                   (nm * p.cation_charge * p.cation_charge + nx * p.anion_charge * p.anion_charge);
  const double sI = std::sqrt(I);
  const double wb = 2.0 * nm * nx / nu, wc = 2.0 * std::pow(nm * nx, 1.5) / nu;
  return {m * wb, m * wb * std::exp(-p.alpha1 * sI), m * wb * std::exp(-p.alpha2 * sI),
          m * m * wc};
}

/// d ln a_w / dT at molality m (1/K): the Debye-Hueckel term through A_phi(T); the
/// parameters are constant within a row's window.
inline double ln_water_activity_temperature_slope(const data::single_salt_parameters& p, double m,
                                                  double temperature) {
  constexpr double b = 1.2;
  const double nm = p.cation_count, nx = p.anion_count, nu = nm + nx;
  const double zz = std::abs(static_cast<double>(p.cation_charge * p.anion_charge));
  const double sI = std::sqrt(
      0.5 * m * (nm * p.cation_charge * p.cation_charge + nx * p.anion_charge * p.anion_charge));
  const double dphi_dT =
      -zz * sI / (1.0 + b * sI) * models::detail::debye_huckel_osmotic_slope_derivative(temperature);
  return -dphi_dT * nu * m * constants::molar_mass_water;
}

/// Freezing temperature (K) of the salt at molality m (mol/kg) with the row's parameters
/// held constant: the root of ln a_w(m, T) - ln a_w,ice(T) on [215 K, 273.15 K] by TOMS 748
/// (the difference falls with T there: a_w,ice falls faster than a_w). NaN when the
/// solution does not freeze above 215 K. No checks of the row's window.
inline double freezing_temperature_closed_form(const data::single_salt_parameters& p, double m) {
  if (m == 0.0) return constants::ice_point;
  const double nu_m_mw = (p.cation_count + p.anion_count) * m * constants::molar_mass_water;
  const auto h = [&](double T) {
    const double phi =
        evaluate_closed_form(p, m, models::detail::debye_huckel_osmotic_slope(T)).osmotic_coefficient;
    return -phi * nu_m_mw - water::ln_water_activity_of_ice(T);
  };
  const double lo = water::ice_model_lowest_temperature, hi = constants::ice_point;
  const auto r = toms748_root(h, lo, hi, h(lo), h(hi), 52, 100);
  return r.status == root_status::converged ? r.x : std::numeric_limits<double>::quiet_NaN();
}

namespace input {

inline void check_molality(const data::single_salt_parameters& p, double molality,
                           const char* where) {
  if (!std::isfinite(molality) || molality < 0.0) {
    std::ostringstream os;
    os << where << ": molality of '" << p.id << "' = " << molality
       << " mol/kg: must be finite and >= 0";
    throw invalid_input(os.str());
  }
}

inline std::string above_data(const data::single_salt_parameters& p, double molality,
                              const char* where) {
  if (!(molality > p.max_molality)) return {};
  std::ostringstream os;
  os << where << ": molality of '" << p.id << "' = " << molality << " mol/kg: above "
     << p.max_molality << " mol/kg, the top of the data behind its parameters ['"
     << p.parameter_set << "', " << p.source << "]";
  return os.str();
}

}  // namespace input

/// Osmotic coefficient, mean activity coefficient and water activity of `salt` (id, name
/// or formula of data::single_salt_table()) at molality m (mol/kg of water) and
/// temperature T (K), with the salt's row whose window holds T.
inline activity evaluate(const std::string& salt, double molality, double temperature) {
  input::check_molality(data::find_single_salt(salt), molality, "single-salt activity");
  const auto& p = data::find_single_salt(salt, temperature);
  auto r = evaluate_closed_form(p, molality, models::detail::debye_huckel_osmotic_slope(temperature));
  r.reason = input::above_data(p, molality, "single-salt activity");
  return r;
}

/// A freezing point of one salt solution; `reason` is empty inside the row's range.
struct freezing_point_result {
  double temperature = constants::ice_point;  ///< K; NaN when none above 215 K
  std::string parameter_set;                  ///< the row's set
  std::string reason;
};

/// Freezing point of `salt` at molality m (mol/kg) by its ice-line row
/// (data::single_salt_ice_line_set_id). A salt with no ice-line row is an error naming the
/// sets it has; a molality above the fitted data, or a freezing point below the row's window,
/// is computed and flagged.
inline freezing_point_result freezing_point(const std::string& salt, double molality) {
  const auto& first = data::find_single_salt(salt);
  input::check_molality(first, molality, "single-salt freezing point");
  const data::single_salt_parameters* row = nullptr;
  std::string sets;
  for (const auto& r : data::single_salt_table()) {
    if (!data::single_salt_is(r, salt)) continue;
    if (r.parameter_set == data::single_salt_ice_line_set_id) row = &r;
    sets += (sets.empty() ? "'" : ", '") + r.parameter_set + "'";
  }
  if (!row)
    throw invalid_input("single-salt freezing point: '" + first.id +
                        "' has no parameters on the ice line (set '" +
                        data::single_salt_ice_line_set_id + "'); its sets: " + sets);
  freezing_point_result out;
  out.parameter_set = row->parameter_set;
  out.temperature = freezing_temperature_closed_form(*row, molality);
  out.reason = input::above_data(*row, molality, "single-salt freezing point");
  if (out.reason.empty() && out.temperature < row->min_temperature) {
    std::ostringstream os;
    os << "single-salt freezing point: " << out.temperature << " K for '" << row->id
       << "' lies below " << row->min_temperature << " K, the lowest freezing point fitted ['"
       << row->parameter_set << "', " << row->source << "]";
    out.reason = os.str();
  }
  return out;
}

/// Molality (mol/kg of water) of `salt` from its mass fraction w in the solution (kg of
/// anhydrous salt per kg of solution): m = w / (M (1 - w)), M the table's molar mass of
/// the anhydrous salt. The conversion at the edge for tables and curves given in mass %
/// (divide by 100 first). w outside [0, 1) is an error naming the salt and the range.
inline double molality_from_mass_fraction(const std::string& salt, double mass_fraction) {
  const auto& p = data::find_single_salt(salt);
  if (!std::isfinite(mass_fraction) || mass_fraction < 0.0 || mass_fraction >= 1.0) {
    std::ostringstream os;
    os << "single-salt molality: mass fraction of '" << p.id << "' = " << mass_fraction
       << ": must be finite and in [0, 1) (kg of anhydrous salt per kg of solution; "
          "a mass % divided by 100)";
    throw invalid_input(os.str());
  }
  return mass_fraction / (p.molar_mass * (1.0 - mass_fraction));
}

}  // namespace colligate::models::single_salt
