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
/// in both (tested). It serves the salts of data/single_salt_pitzer.hpp, whose parameters
/// hold at 25 C only: a temperature further than 0.5 K from 298.15 K is an error naming the
/// salt, the set and that range; a molality above the data behind the fit is computed and
/// flagged (`reason`).

#include <cmath>
#include <sstream>
#include <string>

#include "colligate/core/constants.hpp"
#include "colligate/core/errors.hpp"
#include "colligate/data/single_salt_pitzer.hpp"
#include "colligate/models/detail/pitzer_kernel.hpp"

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

/// Osmotic coefficient, mean activity coefficient and water activity of `salt` (id, name
/// or formula of data::single_salt_table()) at molality m (mol/kg of water) and
/// temperature T (K).
inline activity evaluate(const std::string& salt, double molality, double temperature) {
  const auto& p = data::find_single_salt(salt);
  if (!std::isfinite(molality) || molality < 0.0) {
    std::ostringstream os;
    os << "single-salt activity: molality of '" << p.id << "' = " << molality
       << " mol/kg: must be finite and >= 0";
    throw invalid_input(os.str());
  }
  if (!(std::abs(temperature - data::single_salt_temperature) <= data::single_salt_temperature_window)) {
    std::ostringstream os;
    os << "single-salt activity: T = " << temperature << " K for '" << p.id << "': parameter set '"
       << data::single_salt_parameter_set_id << "' holds at 25 C only (" 
       << data::single_salt_temperature - data::single_salt_temperature_window << " to "
       << data::single_salt_temperature + data::single_salt_temperature_window
       << " K; no temperature functions are published with it)";
    throw invalid_input(os.str());
  }
  auto r = evaluate_closed_form(p, molality, detail::debye_huckel_osmotic_slope(temperature));
  if (molality > p.max_molality) {
    std::ostringstream os;
    os << "single-salt activity: molality of '" << p.id << "' = " << molality << " mol/kg: above "
       << p.max_molality << " mol/kg, the top of the data behind its parameters ["
       << p.source << "]";
    r.reason = os.str();
  }
  return r;
}

}  // namespace colligate::models::single_salt
