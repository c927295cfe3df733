#pragma once
/// \file pitzer_sensitivity.hpp
/// Derivatives of the Pitzer ln a_w (models/pitzer.hpp) in closed form: by the binary
/// constants a salt record carries (a fitted salt, fit/pitzer_fitter.hpp), by temperature
/// at fixed amounts and by the water mass at fixed temperature. What the law of
/// propagation of uncertainty needs on the ice line (equilibria/prediction_uncertainty.hpp).
///
/// ln a_w = -M_w (sum_i m_i + E + ideal particles), E = sum_i m_i (phi - 1), and the pair
/// term of E is 2 m_c m_a (B^phi + Z C) with B^phi = beta0 + beta1 e^(-alpha1 sqrt I) +
/// beta2 e^(-12 sqrt I) and C = C-phi / (2 sqrt|z_c z_a|) (Pitzer 1991, ch. 3; Harvie,
/// Moller & Weare 1984, eq. 3). The ionic strength does not depend on the parameters, so
///
///     d ln a_w / d beta0 = -2 M_w m_c m_a
///     d ln a_w / d beta1 = -2 M_w m_c m_a e^(-alpha1 sqrt I)
///     d ln a_w / d beta2 = -2 M_w m_c m_a e^(-12 sqrt I)          (2:2 salts)
///     d ln a_w / d C-phi = -2 M_w m_c m_a Z / (2 sqrt|z_c z_a|)
///
/// with m_c, m_a the molalities of the pair's ions in the whole solution, and the linear
/// temperature terms (dbeta0_dT ...: the a[3] term of data::t_function) the same times
/// (T - 298.15 K). The slopes of E by temperature (at fixed molalities) and by ln lambda
/// (every molality times lambda) are differentiated term by term below
/// (detail::osmotic_excess_slopes, E-theta included); with m = n / W,
/// d ln a_w / dW = M_w / W (sum_i m_i + ideal + dE/d ln lambda). They read the same rows as
/// detail::pitzer_system (a record's own row in place of the set's, the last row of a pair
/// winning) and are checked against central differences of it in
/// tests/cpp/equilibria/test_prediction_uncertainty.cpp.

#include <array>
#include <cmath>
#include <cstddef>
#include <limits>
#include <string>
#include <utility>

#include "colligate/core/constants.hpp"
#include "colligate/core/errors.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/data/pitzer_parameters.hpp"
#include "colligate/models/detail/pitzer_system.hpp"
#include "colligate/models/pitzer.hpp"

namespace colligate::models {

/// A constant of a record's own Pitzer row (data/constant_uncertainty.hpp names).
enum class pitzer_constant { beta0, beta1, beta2, cphi, dbeta0_dT, dbeta1_dT, dbeta2_dT, dcphi_dT };

/// The constant named `name`; false if it is not a Pitzer constant.
inline bool pitzer_constant_named(const std::string& name, pitzer_constant& out) {
  static const std::pair<const char*, pitzer_constant> names[] = {
      {"beta0", pitzer_constant::beta0},         {"beta1", pitzer_constant::beta1},
      {"beta2", pitzer_constant::beta2},         {"cphi", pitzer_constant::cphi},
      {"dbeta0_dT", pitzer_constant::dbeta0_dT}, {"dbeta1_dT", pitzer_constant::dbeta1_dT},
      {"dbeta2_dT", pitzer_constant::dbeta2_dT}, {"dcphi_dT", pitzer_constant::dcphi_dT}};
  for (const auto& [n, c] : names)
    if (name == n) {
      out = c;
      return true;
    }
  return false;
}

namespace detail {

// dA_phi/dT: debye_huckel_osmotic_slope_derivative(T, correlation) of pitzer_kernel.hpp.

/// d^2 J / dx^2 of mixing_j (pitzer_kernel.hpp, the second derivative of its power series
/// in z); 0 at x <= 0.
inline double mixing_j_second_derivative(double x) {
  if (!(x > 0.0)) return 0.0;
  double J = 0.0, dJ = 0.0, d2J = 0.0;
  mixing_j(x, J, dJ, &d2J);
  return d2J;
}

/// dP/dT of the analytic temperature form (data::t_function, T_r = 298.15 K).
inline double t_function_slope(const data::t_function& f, double T) {
  const double inv = 1.0 / T;
  return -f.a[1] * inv * inv + f.a[2] * inv + f.a[3] + 2.0 * f.a[4] * T -
         2.0 * f.a[5] * inv * inv * inv;
}

/// Slopes of the osmotic excess E = sum_i m_i (phi - 1) (pitzer_system.hpp, file comment) on
/// ion molalities `m` (one per data::pitzer_ions entry) at T with the rows of `set`:
/// `by_temperature` = dE/dT at fixed molalities (mol/kg/K; A_phi(T), the parameters' T form,
/// E-theta through A_phi) and `by_scale` = dE/d ln lambda with every molality times lambda
/// (mol/kg; I, Z and the products m m scale with it). With w(x) = x J'(x),
/// x = 6 z z' A_phi sqrt I, the mixing part E-theta + I E-theta' = zz / (8 I) [w_ij - w_ii/2 -
/// w_jj/2] (pitzer_kernel.hpp, e_theta). NaN by temperature for a pair in the extended form
/// (data::extended_binary: no closed-form T slope here).
inline void osmotic_excess_slopes(const ion_array& m, double T, const data::pitzer_parameter_set& set,
                                  double& by_temperature, double& by_scale) {
  by_temperature = 0.0;
  by_scale = 0.0;
  const auto& ions = data::pitzer_ions;
  double I = 0.0, Z = 0.0;
  for (std::size_t k = 0; k < n_ions; ++k) {
    I += 0.5 * m[k] * ions[k].charge * ions[k].charge;
    Z += m[k] * std::abs(ions[k].charge);
  }
  if (!(I > 0.0)) return;
  const double sI = std::sqrt(I), A = debye_huckel_osmotic_slope(T, set.aphi);
  const double dA = debye_huckel_osmotic_slope_derivative(T, set.aphi);
  const double den = 1.0 + pitzer_b * sI;
  double sT = -dA * I * sI / den;
  double sL = -A * I * sI * (1.5 + pitzer_b * sI) / (den * den);
  // Cation-anion rows: the last row of a pair wins (as pitzer_system::build).
  std::array<std::array<const data::pitzer_binary*, n_ions>, n_ions> pair{};
  for (const auto& b : set.binaries) {
    const auto c = data::pitzer_ion_index(b.cation), a = data::pitzer_ion_index(b.anion);
    if (c < n_ions && a < n_ions) pair[c][a] = &b;
  }
  for (std::size_t c = 0; c < n_ions; ++c)
    for (std::size_t a = 0; a < n_ions; ++a) {
      const auto* row = pair[c][a];
      const double mm = m[c] * m[a];
      if (row == nullptr || mm == 0.0) continue;
      const int zc = ions[c].charge, za = ions[a].charge;
      double Bphi = 0.0, I_dBphi = 0.0, C = 0.0, I_dC = 0.0, dB_dT = 0.0, dC_dT = 0.0;
      if (const auto* ext = row->extended) {
        const double e = std::exp(-2.0 * sI), ew = std::exp(-(ext->omega * sI));
        const double b1 = ext->beta1(T), c1 = ext->c1(T);
        Bphi = ext->beta0(T) + b1 * e;
        I_dBphi = -sI * b1 * e;
        C = ext->c0(T) + c1 * ew;
        I_dC = -0.5 * ext->omega * sI * c1 * ew;
        dB_dT = std::numeric_limits<double>::quiet_NaN();
      } else {
        const bool two_two = std::abs(zc) == 2 && std::abs(za) == 2;
        const double a1 = two_two ? 1.4 : 2.0;
        const double e1 = std::exp(-a1 * sI), e12 = two_two ? std::exp(-12.0 * sI) : 0.0;
        const double b1 = row->beta1(T), b2 = two_two ? row->beta2(T) : 0.0;
        const double scale = 2.0 * std::sqrt(std::abs(zc * za));
        Bphi = row->beta0(T) + b1 * e1 + b2 * e12;
        I_dBphi = -0.5 * sI * (a1 * b1 * e1 + 12.0 * b2 * e12);
        C = row->cphi(T) / scale;
        dB_dT = t_function_slope(row->beta0, T) + t_function_slope(row->beta1, T) * e1 +
                (two_two ? t_function_slope(row->beta2, T) * e12 : 0.0);
        dC_dT = t_function_slope(row->cphi, T) / scale;
      }
      sL += 2.0 * mm * (Bphi + Z * C) + mm * (I_dBphi + Z * C + Z * I_dC);
      sT += mm * (dB_dT + Z * dC_dT);
    }
  // Like-charged pairs and their triplets (the last matching row wins).
  const auto same = [](std::size_t p, std::size_t q, std::size_t i, std::size_t j) {
    return (p == i && q == j) || (p == j && q == i);
  };
  for (std::size_t i = 0; i < n_ions; ++i)
    for (std::size_t j = i + 1; j < n_ions; ++j) {
      const double mm = m[i] * m[j];
      if (mm == 0.0 || (ions[i].charge > 0) != (ions[j].charge > 0)) continue;
      const data::t_function* theta = nullptr;
      for (const auto& t : set.thetas)
        if (same(data::pitzer_ion_index(t.ion1), data::pitzer_ion_index(t.ion2), i, j)) theta = &t.theta;
      const int zi = std::abs(ions[i].charge), zj = std::abs(ions[j].charge);
      double G = 0.0, I_dG = 0.0, A_dG = 0.0;
      if (zi != zj) {
        const int ij = zi * zj;
        double sum_w = 0.0, sum_xdw = 0.0;  // sums of weight w(x) and weight x w'(x)
        for (const auto& [zz, weight] :
             {std::pair<int, double>{ij, 1.0}, {zi * zi, -0.5}, {zj * zj, -0.5}}) {
          const double x = 6.0 * zz * A * sI;
          double J = 0.0, dJ = 0.0;
          mixing_j(x, J, dJ);
          sum_w += weight * x * dJ;
          sum_xdw += weight * x * (dJ + x * mixing_j_second_derivative(x));
        }
        const double f = ij / (8.0 * I);
        G = f * sum_w;
        I_dG = -G + 0.5 * f * sum_xdw;  // x ~ sqrt I
        A_dG = f * sum_xdw;              // x ~ A_phi
      }
      double psum = 0.0, dpsum = 0.0;
      for (std::size_t k = 0; k < n_ions; ++k) {
        if (m[k] == 0.0 || (ions[k].charge > 0) == (ions[i].charge > 0)) continue;
        const data::t_function* psi = nullptr;
        for (const auto& t : set.psis)
          if (data::pitzer_ion_index(t.ion3) == k &&
              same(data::pitzer_ion_index(t.ion1), data::pitzer_ion_index(t.ion2), i, j))
            psi = &t.psi;
        if (psi == nullptr) continue;
        psum += m[k] * (*psi)(T);
        dpsum += m[k] * t_function_slope(*psi, T);
      }
      const double th = theta ? (*theta)(T) : 0.0;
      sL += 2.0 * mm * (th + G + psum) + mm * (I_dG + psum);
      sT += mm * ((theta ? t_function_slope(*theta, T) : 0.0) + A_dG * dA / A + dpsum);
    }
  by_temperature = 2.0 * sT;
  by_scale = 2.0 * sL;
}

}  // namespace detail

/// ln a_w of model 'pitzer' and its slopes by temperature (1/K, fixed amounts) and by the
/// water mass (1/kg, fixed temperature).
struct pitzer_ln_water_activity_slopes {
  double ln_water_activity = 0.0;
  double by_temperature = 0.0;
  double by_water = 0.0;
};

/// The slopes of ln a_w by temperature (1/K, fixed amounts) and by the water mass (1/kg,
/// fixed temperature) alone, on `rows`: the parameter set with the records' own rows already
/// in place of the set's (detail::with_record_binaries; prepared once per species list by
/// a caller that evaluates many rows). With `electrolytes_only` the non-electrolytes are
/// left out: the Pitzer factor of the Ross product rule (models/mixing.hpp), the
/// electrolytes alone in the same water. No allocation.
inline void pitzer_slopes_on_rows(const solution& s, double water_kg, double temperature,
                                  const data::pitzer_parameter_set& rows, bool electrolytes_only,
                                  double& by_temperature, double& by_water) {
  double other = 0.0;
  const auto m = pitzer::ion_molalities(s, water_kg, other);
  if (electrolytes_only) {  // ideal particles of the electrolytes alone (ions the tables lack)
    other = 0.0;
    for (std::size_t i = 0; i < s.size(); ++i) {
      const auto& rec = s.species()[i];
      if (rec.kind != data::solute_class::electrolyte) continue;
      const double mi = s.moles()[i] / water_kg;
      if (rec.ions.empty()) {
        other += rec.particles * mi;
        continue;
      }
      for (const auto& ion : rec.ions)
        if (data::pitzer_ion_index(ion.ion) >= detail::n_ions) other += ion.count * mi;
    }
  }
  double total = 0.0;
  for (double mi : m) total += mi;
  double by_T = 0.0, by_scale = 0.0;
  detail::osmotic_excess_slopes(m, temperature, rows, by_T, by_scale);
  const double Mw = constants::molar_mass_water;
  by_temperature = -Mw * by_T;
  by_water = Mw / water_kg * (total + other + by_scale);
}

inline pitzer_ln_water_activity_slopes pitzer_slopes(
    const solution& s, double water_kg, double temperature,
    const data::pitzer_parameter_set& set = pitzer::default_parameters()) {
  pitzer_ln_water_activity_slopes r;
  if (detail::has_record_binaries(s))
    pitzer_slopes_on_rows(s, water_kg, temperature, detail::with_record_binaries(s, set), false,
                          r.by_temperature, r.by_water);
  else
    pitzer_slopes_on_rows(s, water_kg, temperature, set, false, r.by_temperature, r.by_water);
  r.ln_water_activity = pitzer::ln_water_activity(s, water_kg, temperature, set);
  return r;
}

/// d ln a_w / d (constant `which` of species `j`'s own Pitzer row) of `s` with `water_kg`
/// of water at `temperature` (model 'pitzer'). A species without its own row has no such
/// constant (0).
inline double pitzer_ln_water_activity_derivative(const solution& s, double water_kg,
                                                  double temperature, std::size_t j,
                                                  pitzer_constant which) {
  if (j >= s.size())
    throw invalid_input("pitzer sensitivity: species index " + std::to_string(j) +
                        " is beyond the solution's " + std::to_string(s.size()) + " solutes");
  const auto& rec = s.species()[j];
  if (!rec.pitzer.available) return 0.0;
  const auto& b = rec.pitzer.binary;
  if (b.extended != nullptr)
    throw invalid_input("pitzer sensitivity: the row of '" + rec.id +
                        "' is in the extended form (Archer 1992), whose constants are not "
                        "beta0, beta1, C-phi; use the Monte Carlo propagation");
  const std::size_t gc = data::pitzer_ion_index(b.cation), ga = data::pitzer_ion_index(b.anion);
  if (gc >= data::pitzer_ion_count || ga >= data::pitzer_ion_count) return 0.0;
  const int zc = data::pitzer_ions[gc].charge, za = data::pitzer_ions[ga].charge;
  // Molalities of every ion of the solution (its I and Z), as the model counts them.
  double mc = 0.0, ma = 0.0, I = 0.0, Z = 0.0;
  for (std::size_t i = 0; i < s.size(); ++i) {
    const auto& r = s.species()[i];
    if (r.kind != data::solute_class::electrolyte) continue;
    const double mi = s.moles()[i] / water_kg;
    for (const auto& ion : r.ions) {
      const auto g = data::pitzer_ion_index(ion.ion);
      if (g >= data::pitzer_ion_count) continue;
      const double mion = ion.count * mi;
      I += 0.5 * mion * ion.charge * ion.charge;
      Z += mion * std::abs(ion.charge);
      if (g == gc) mc += mion;
      if (g == ga) ma += mion;
    }
  }
  const double mm = mc * ma;
  if (mm == 0.0) return 0.0;
  const bool two_two = std::abs(zc) == 2 && std::abs(za) == 2;
  const double sI = std::sqrt(I);
  double f = 0.0;
  switch (which) {
    case pitzer_constant::beta0:
    case pitzer_constant::dbeta0_dT: f = 1.0; break;
    case pitzer_constant::beta1:
    case pitzer_constant::dbeta1_dT: f = std::exp(-(two_two ? 1.4 : 2.0) * sI); break;
    case pitzer_constant::beta2:
    case pitzer_constant::dbeta2_dT: f = two_two ? std::exp(-12.0 * sI) : 0.0; break;
    case pitzer_constant::cphi:
    case pitzer_constant::dcphi_dT: f = Z / (2.0 * std::sqrt(std::abs(zc * za))); break;
  }
  switch (which) {
    case pitzer_constant::dbeta0_dT:
    case pitzer_constant::dbeta1_dT:
    case pitzer_constant::dbeta2_dT:
    case pitzer_constant::dcphi_dT: f *= temperature - 298.15; break;
    default: break;
  }
  return -2.0 * constants::molar_mass_water * mm * f;
}

}  // namespace colligate::models
