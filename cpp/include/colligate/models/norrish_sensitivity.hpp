#pragma once
/// \file norrish_sensitivity.hpp
/// Derivatives of the Norrish ln a_w (models/norrish.hpp) with respect to one solute's
/// constants K and K3, in closed form, at a given water mass: what the law of propagation
/// of uncertainty needs (equilibria/prediction_uncertainty.hpp).
///
/// With x_i = n_i / (n_w + sum nu n) and S = sum_{K_i > 0} sqrt(K_i) x_i (Chirife, Ferro
/// Fontan & Benmergui 1980, eq. 4, in our sign convention):
///
///     d ln a_w / d K_j  = -S x_j / sqrt(K_j)      (K_j > 0: the term -S^2)
///                       = -x_j^2                  (K_j <= 0: the per-solute term)
///     d ln a_w / d K3_j = -x_j^3
///
/// and for a solute with volume ratio r != 1, z_j = x_j / (x_j + r (1 - x_j)) in place of x_j
/// in the per-solute terms (-z_j^2, -z_j^3). For a single solute with K > 0 the first line
/// is -x^2, the same as the second: the derivative is continuous there. In a mixture it
/// jumps at K_j = 0 (the square-root form has an infinite slope), so a constant whose
/// interval spans zero is no case for the linear propagation: use Monte Carlo.

#include <cmath>
#include <cstddef>
#include <string>

#include "colligate/core/constants.hpp"
#include "colligate/core/errors.hpp"
#include "colligate/core/solution.hpp"

namespace colligate::models {

enum class norrish_constant { k, k3 };

/// Which solutes the Norrish sum counts: all of them (model 'norrish', electrolytes as
/// ideal particles), or the non-electrolytes alone (their class in the Ross product rule,
/// models/mixing.hpp, evaluated by itself in the same water).
enum class norrish_species { all, non_electrolytes_only };

/// d ln a_w / d (K or K3 of species `j`) of `s` with `water_kg` of water (model 'norrish',
/// or the non-electrolyte factor of model 'ross' with norrish_species::non_electrolytes_only).
inline double norrish_ln_water_activity_derivative(const solution& s, double water_kg,
                                                   std::size_t j, norrish_constant which,
                                                   norrish_species counted = norrish_species::all) {
  if (j >= s.size())
    throw invalid_input("norrish sensitivity: species index " + std::to_string(j) +
                        " is beyond the solution's " + std::to_string(s.size()) + " solutes");
  const auto& species = s.species();
  const auto& moles = s.moles();
  const bool all = counted == norrish_species::all;
  const auto counts = [&](std::size_t i) {
    return all || species[i].kind != data::solute_class::electrolyte;
  };
  const double nw = water_kg / constants::molar_mass_water;
  double n_total = nw;
  for (std::size_t i = 0; i < s.size(); ++i)
    if (counts(i)) n_total += species[i].particles * moles[i];
  const auto& rj = species[j];
  if (!rj.norrish.available || !counts(j)) return 0.0;  // an ideal particle, or not in the sum
  const double xj = moles[j] / n_total;
  if (rj.norrish.volume_ratio != 1.0) {
    const double r = rj.norrish.volume_ratio;
    const double z = xj / (xj + r * (1.0 - xj));
    return which == norrish_constant::k ? -z * z : -z * z * z;
  }
  if (which == norrish_constant::k3) return -xj * xj * xj;
  if (!(rj.norrish.k > 0.0)) return -xj * xj;
  double S = 0.0;
  for (std::size_t i = 0; i < s.size(); ++i) {
    const auto& n = species[i].norrish;
    if (counts(i) && n.available && n.volume_ratio == 1.0 && n.k > 0.0) S += std::sqrt(n.k) * moles[i] / n_total;
  }
  return -S * xj / std::sqrt(rj.norrish.k);
}

/// d ln a_w / d M_j: the molar mass of species `j` at fixed solute mass (n_j = m_j / M_j),
/// for a solute with no Norrish term of its own (an effective solute, K_j = K3_j = K4_j = 0,
/// or a record without Norrish constants), at `water_kg` of water (model 'norrish'). Such a
/// solute acts only through the particle total n = n_w + P, like the water does in the slope
/// of models/norrish.hpp: with D = 2 S^2 + sum_i g_i'(x_i) x_i (the same sum as that slope),
///
///     d ln a_w / d n_j = nu_j (D - 1) / n,     dn_j / dM_j = -n_j / M_j,
///     d ln a_w / d M_j = nu_j x_j (1 - D) / M_j.
///
/// A solute with constants of its own throws: its molar mass also enters its own term, which
/// this closed form does not cover (use Monte Carlo).
inline double norrish_ln_water_activity_molar_mass_derivative(const solution& s, double water_kg,
                                                              std::size_t j) {
  if (j >= s.size())
    throw invalid_input("norrish sensitivity: species index " + std::to_string(j) +
                        " is beyond the solution's " + std::to_string(s.size()) + " solutes");
  const auto& species = s.species();
  const auto& moles = s.moles();
  const auto& rj = species[j];
  if (rj.norrish.available && (rj.norrish.k != 0.0 || rj.norrish.k3 != 0.0 || rj.norrish.k4 != 0.0))
    throw invalid_input("linear propagation: no closed-form sensitivity of ln a_w to the molar mass of '" +
                        rj.id + "', which has Norrish constants of its own; use the Monte Carlo propagation");
  const double nw = water_kg / constants::molar_mass_water;
  double n_total = nw;
  for (std::size_t i = 0; i < s.size(); ++i) n_total += species[i].particles * moles[i];
  double sqrt_sum = 0.0, d_extra = 0.0;
  for (std::size_t i = 0; i < s.size(); ++i) {
    const auto& v = species[i].norrish;
    if (!v.available) continue;
    const double x = moles[i] / n_total;
    if (v.volume_ratio != 1.0) {
      const double r = v.volume_ratio, q = x + r * (1.0 - x), z = x / q;
      d_extra += z * (2.0 * v.k + z * (3.0 * v.k3 + 4.0 * v.k4 * z)) * (r / (q * q)) * x;
      continue;
    }
    if (v.k > 0.0)
      sqrt_sum += std::sqrt(v.k) * x;
    else
      d_extra += 2.0 * v.k * x * x;
    d_extra += x * x * x * (3.0 * v.k3 + 4.0 * v.k4 * x);
  }
  const double D = 2.0 * sqrt_sum * sqrt_sum + d_extra;
  return rj.particles * (moles[j] / n_total) * (1.0 - D) / rj.molar_mass;
}

}  // namespace colligate::models
