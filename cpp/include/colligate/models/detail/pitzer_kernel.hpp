#pragma once
/// \file pitzer_kernel.hpp
/// Internals of the Pitzer model: the Debye-Hueckel slopes A_phi(T) (one per parameter
/// set, see data::aphi_correlation), the unsymmetrical
/// mixing function J(x) and the osmotic and activity-coefficient sums on ion molalities.
///
/// Equations (Harvie, Moller & Weare 1984, eqs. 1-8; Pitzer 1991, ch. 3):
///
///   sum_i m_i (phi - 1) = 2 [ -A_phi I^1.5 / (1 + b sqrt I)
///        + sum_c sum_a m_c m_a (B^phi_ca + Z C_ca)
///        + sum_c<c' m_c m_c' (Phi^phi_cc' + sum_a m_a psi_cc'a)
///        + sum_a<a' m_a m_a' (Phi^phi_aa' + sum_c m_c psi_aa'c) ]
///   ln gamma_M = z_M^2 F + sum_a m_a (2 B_Ma + Z C_Ma) + sum_c m_c (2 Phi_Mc + sum_a m_a psi_Mca)
///        + sum_a<a' m_a m_a' psi_aa'M + |z_M| sum_c sum_a m_c m_a C_ca      (anions alike)
///   F = -A_phi [sqrt I / (1 + b sqrt I) + (2/b) ln(1 + b sqrt I)]
///        + sum_c sum_a m_c m_a B'_ca + sum_c<c' m_c m_c' Phi'_cc' + sum_a<a' m_a m_a' Phi'_aa'
///
/// with b = 1.2, Z = sum_i m_i |z_i|, C = C-phi / (2 sqrt|z_M z_X|),
/// B^phi = beta0 + beta1 exp(-alpha1 sqrt I) + beta2 exp(-alpha2 sqrt I),
/// B = beta0 + beta1 g(alpha1 sqrt I) + beta2 g(alpha2 sqrt I), g(x) = 2 [1 - (1 + x) e^-x] / x^2,
/// B' = [beta1 g'(alpha1 sqrt I) + beta2 g'(alpha2 sqrt I)] / I,
/// g'(x) = -2 [1 - (1 + x + x^2/2) e^-x] / x^2, Phi = theta + E-theta(I),
/// Phi' = E-theta'(I), Phi^phi = theta + E-theta + I E-theta'.
/// E-theta (Pitzer 1975, eqs. 23-24): E-theta_ij = z_i z_j / (4 I) [J(x_ij) - J(x_ii)/2 - J(x_jj)/2],
/// x_ij = 6 z_i z_j A_phi sqrt I; J from the Chebyshev approximation of Harvie (1981) as
/// given by Pitzer (1991), Appendix B, eqs. B-21 to B-30 and Table B-1.

#include <array>
#include <cmath>

#include "colligate/data/pitzer_parameters.hpp"

namespace colligate::models::detail {

inline constexpr std::size_t n_ions = data::pitzer_ion_count;
using ion_array = std::array<double, n_ions>;

/// Pitzer's b, kg^1/2 mol^-1/2 (Pitzer 1991).
inline constexpr double pitzer_b = 1.2;

/// Temperatures over which A_phi(T) is validated (Clegg, Rard & Pitzer 1994), K.
inline constexpr double aphi_min_temperature = 234.15;
inline constexpr double aphi_max_temperature = 373.15;

/// Debye-Hueckel osmotic slope A_phi at 0.1 MPa, kg^1/2 mol^-1/2: Chebyshev series of
/// Clegg, Rard & Pitzer (1994), Appendix II, eqs. AII1-AII2, Table 11 (coefficients
/// copied from a public copy; the first is halved as the series requires).
/// 0.3915 at 298.15 K, 0.3767 at 273.15 K. Beyond 234.15-373.15 K it is extrapolated.
inline double debye_huckel_osmotic_slope(double temperature) {
  static constexpr std::array<double, 19> a = {
      0.797256081240 / 2,  0.573389669896e-1,  0.977632177788e-3,  0.489973732417e-2,
      -0.313151784342e-2,  0.179145971002e-2,  -0.920584241844e-3, 0.443862726879e-3,
      -0.203661129991e-3,  0.900924147948e-4,  -0.388189392385e-4, 0.164245088592e-4,
      -0.686031972567e-5,  0.283455806377e-5,  -0.115641433004e-5, 0.461489672579e-6,
      -0.177069754948e-6,  0.612464488231e-7,  -0.175689013085e-7};
  const double x = (2.0 * temperature - 607.3) / 139.0;
  double t0 = 1.0, t1 = x, sum = a[0] + a[1] * x;
  for (std::size_t k = 2; k < a.size(); ++k) {
    const double t2 = 2.0 * x * t1 - t0;
    sum += a[k] * t2;
    t0 = t1;
    t1 = t2;
  }
  return sum;
}

/// Debye-Hueckel osmotic slope A_phi of Spencer, Moller & Weare (1990), kg^1/2 mol^-1/2:
///     A_phi = a1 + a2 T + a3 T^2 + a4 T^3 + a5 / T + a6 ln T
/// (the form of their eq. 2 for the Pitzer parameters), the slope their low-temperature
/// parameters were fitted with. Coefficients read in public copies of the paper.
/// 0.3917 at 298.15 K (Harvie et al. 1984 used 0.392), 0.3781 at 273.15 K, 0.3671 at
/// 233.15 K; smooth down to the model's lower limit, 219.15 K.
inline double debye_huckel_osmotic_slope_spencer_1990(double temperature) {
  const double T = temperature;
  return 86.6836498 + T * (8.48795942e-2 + T * (-8.88785150e-5 + T * 4.88096393e-8)) -
         1327.31477 / T - 17.6460172 * std::log(T);
}

/// Temperatures over which an A_phi correlation is used, K, and its source key.
struct aphi_range {
  double min_temperature;
  double max_temperature;
  const char* source;
};

inline aphi_range aphi_validity(data::aphi_correlation correlation) {
  switch (correlation) {
    case data::aphi_correlation::spencer_1990:
      return {219.15, 298.15, "spencer_1990"};
    case data::aphi_correlation::clegg_rard_pitzer_1994:
    default:
      return {aphi_min_temperature, aphi_max_temperature, "clegg_rard_pitzer_1994"};
  }
}

/// A_phi(T) from the correlation a parameter set names.
inline double debye_huckel_osmotic_slope(double temperature, data::aphi_correlation correlation) {
  switch (correlation) {
    case data::aphi_correlation::spencer_1990:
      return debye_huckel_osmotic_slope_spencer_1990(temperature);
    case data::aphi_correlation::clegg_rard_pitzer_1994:
    default:
      return debye_huckel_osmotic_slope(temperature);
  }
}

/// J(x) and dJ/dx of the unsymmetrical mixing theory (Harvie 1981 as given by Pitzer
/// 1991, eqs. B-21 to B-30, Table B-1). J(0) = 0.
inline void mixing_j(double x, double& J, double& dJ) {
  static constexpr std::array<double, 21> aI = {
      1.925154014814667,  -0.060076477753119, -0.029779077456514, -0.007299499690937,
      0.000388260636404,  0.000636874599598,  0.000036583601823,  -0.000045036975204,
      -0.000004537895710, 0.000002937706971,  0.000000396566462,  -0.000000202099617,
      -0.000000025267769, 0.000000013522610,  0.000000001229405,  -0.000000000821969,
      -0.000000000050847, 0.000000000046333,  0.000000000001943,  -0.000000000002563,
      -0.000000000010991};
  static constexpr std::array<double, 21> aII = {
      0.628023320520852,  0.462762985338493,  0.150044637187895,  -0.028796057604906,
      -0.036552745910311, -0.001668087945272, 0.006519840398744,  0.001130378079086,
      -0.000887171310131, -0.000242107641309, 0.000087294451594,  0.000034682122751,
      -0.000004583768938, -0.000003548684306, -0.000000250453880, 0.000000216991779,
      0.000000080779570,  0.000000004558555,  -0.000000006944757, -0.000000002849257,
      0.000000000237816};
  if (!(x > 0.0)) {
    J = 0.0;
    dJ = 0.0;
    return;
  }
  const bool low = x < 1.0;
  const auto& ak = low ? aI : aII;
  // One power per call: x^-0.8 = x^0.2 / x and x^-1.1 = x^-0.1 / x.
  const double px = low ? std::pow(x, 0.2) : std::pow(x, -0.1);
  const double z = low ? 4.0 * px - 2.0 : 40.0 / 9.0 * px - 22.0 / 9.0;
  const double dz = low ? 0.8 * px / x : -4.0 / 9.0 * px / x;
  double b0 = 0, b1 = 0, b2 = 0, d0 = 0, d1 = 0, d2 = 0;
  for (int k = 20; k >= 0; --k) {
    b2 = b1;
    b1 = b0;
    d2 = d1;
    d1 = d0;
    b0 = z * b1 - b2 + ak[k];
    d0 = b1 + z * d1 - d2;
  }
  J = 0.25 * x - 1.0 + 0.5 * (b0 - b2);
  dJ = 0.25 + 0.5 * dz * (d0 - d2);
}

/// E-theta and E-theta' for ions of charges zi, zj (same sign) at ionic strength I.
inline void e_theta(int zi, int zj, double I, double aphi, double& et, double& etp) {
  et = 0.0;
  etp = 0.0;
  if (zi == zj || !(I > 0.0)) return;
  const double s = 6.0 * aphi * std::sqrt(I);
  const double xij = s * zi * zj, xii = s * zi * zi, xjj = s * zj * zj;
  double Jij, dJij, Jii, dJii, Jjj, dJjj;
  mixing_j(xij, Jij, dJij);
  mixing_j(xii, Jii, dJii);
  mixing_j(xjj, Jjj, dJjj);
  const double zz = static_cast<double>(zi * zj);
  et = zz / (4.0 * I) * (Jij - 0.5 * Jii - 0.5 * Jjj);
  etp = -et / I + zz / (8.0 * I * I) * (xij * dJij - 0.5 * xii * dJii - 0.5 * xjj * dJjj);
}

inline double pitzer_g(double x) {
  if (x < 1e-3) return 1.0 - 2.0 * x / 3.0 + x * x / 4.0;
  return 2.0 * (1.0 - (1.0 + x) * std::exp(-x)) / (x * x);
}
inline double pitzer_gp(double x) {
  if (x < 1e-3) return -x / 3.0 + x * x / 4.0;
  return -2.0 * (1.0 - (1.0 + x + 0.5 * x * x) * std::exp(-x)) / (x * x);
}

/// h(x) = [6 - (6 + 6x + 3x^2 + x^3) e^-x] / x^4 of the extended third-virial term (Archer
/// 1991, 1992); h(0) = 1/4. Below x = 1 the equal form 6 e^-x sum_{k>=4} x^(k-4)/k! avoids
/// the cancellation (identity: 6 e^x - (6 + 6x + 3x^2 + x^3) = 6 sum_{k>=4} x^k/k!).
inline double pitzer_h(double x) {
  if (x < 1.0) {
    double term = 1.0 / 24.0, sum = term;
    for (int k = 5; k < 24; ++k) {
      term *= x / k;
      sum += term;
    }
    return 6.0 * std::exp(-x) * sum;
  }
  return (6.0 - (6.0 + x * (6.0 + x * (3.0 + x))) * std::exp(-x)) / (x * x * x * x);
}

/// Parameters of one set evaluated at one temperature, indexed by ion.
struct pitzer_coefficients {
  double aphi = 0.0;
  std::array<std::array<double, n_ions>, n_ions> beta0{}, beta1{}, beta2{}, c{}, alpha1{}, alpha2{};
  /// Extended form (data::extended_binary): C1 and omega; c1 = 0 for the usual form.
  std::array<std::array<double, n_ions>, n_ions> c1{}, omega{};
  std::array<std::array<bool, n_ions>, n_ions> has_pair{};
  std::array<std::array<double, n_ions>, n_ions> theta{};
  std::array<std::array<std::array<double, n_ions>, n_ions>, n_ions> psi{};
};

inline pitzer_coefficients evaluate_coefficients(const data::pitzer_parameter_set& set, double T) {
  pitzer_coefficients p;
  p.aphi = debye_huckel_osmotic_slope(T, set.aphi);
  const auto idx = [](const std::string& n) { return data::pitzer_ion_index(n); };
  for (const auto& b : set.binaries) {
    const auto i = idx(b.cation), j = idx(b.anion);
    if (i >= n_ions || j >= n_ions) continue;
    const int zc = data::pitzer_ions[i].charge, za = data::pitzer_ions[j].charge;
    const bool two_two = std::abs(zc) == 2 && std::abs(za) == 2;
    p.has_pair[i][j] = true;
    if (b.extended != nullptr) {
      const auto& e = *b.extended;
      p.beta0[i][j] = e.beta0(T);
      p.beta1[i][j] = e.beta1(T);
      p.beta2[i][j] = 0.0;
      p.c[i][j] = e.c0(T);
      p.c1[i][j] = e.c1(T);
      p.omega[i][j] = e.omega;
      p.alpha1[i][j] = 2.0;
      p.alpha2[i][j] = 0.0;
      continue;
    }
    p.beta0[i][j] = b.beta0(T);
    p.beta1[i][j] = b.beta1(T);
    p.beta2[i][j] = two_two ? b.beta2(T) : 0.0;
    p.c[i][j] = b.cphi(T) / (2.0 * std::sqrt(std::abs(zc * za)));
    p.alpha1[i][j] = two_two ? 1.4 : 2.0;
    p.alpha2[i][j] = two_two ? 12.0 : 0.0;
  }
  for (const auto& t : set.thetas) {
    const auto i = idx(t.ion1), j = idx(t.ion2);
    if (i >= n_ions || j >= n_ions) continue;
    p.theta[i][j] = p.theta[j][i] = t.theta(T);
  }
  for (const auto& s : set.psis) {
    const auto i = idx(s.ion1), j = idx(s.ion2), k = idx(s.ion3);
    if (i >= n_ions || j >= n_ions || k >= n_ions) continue;
    p.psi[i][j][k] = p.psi[j][i][k] = s.psi(T);
  }
  return p;
}

/// Result of one evaluation on ion molalities m (mol/kg).
struct pitzer_sums {
  double ionic_strength = 0.0;
  double total_molality = 0.0;   ///< sum_i m_i
  double osmotic_excess = 0.0;   ///< sum_i m_i (phi - 1)
  ion_array ln_gamma{};          ///< ln gamma_i (molal scale)
  double osmotic_coefficient() const {
    return total_molality > 0.0 ? 1.0 + osmotic_excess / total_molality : 1.0;
  }
};

inline bool is_cation(std::size_t i) { return data::pitzer_ions[i].charge > 0; }
inline int charge(std::size_t i) { return data::pitzer_ions[i].charge; }

inline pitzer_sums evaluate(const ion_array& m, const pitzer_coefficients& p) {
  pitzer_sums r;
  double I = 0.0, Z = 0.0, mt = 0.0;
  for (std::size_t i = 0; i < n_ions; ++i) {
    I += 0.5 * m[i] * charge(i) * charge(i);
    Z += m[i] * std::abs(charge(i));
    mt += m[i];
  }
  r.ionic_strength = I;
  r.total_molality = mt;
  if (!(I > 0.0)) return r;
  const double sI = std::sqrt(I);
  const double b = pitzer_b;
  const double A = p.aphi;

  // Pair functions.
  std::array<std::array<double, n_ions>, n_ions> B{}, Bphi{}, Bp{}, Phi{}, Phip{}, Phiphi{};
  // Third-virial terms: C^T (G_ex, ln gamma), C^T_phi (osmotic), dC^T/dI; all equal to C
  // (derivative 0) for the usual form.
  std::array<std::array<double, n_ions>, n_ions> CT = p.c, CTphi = p.c, CTp{};
  for (std::size_t c = 0; c < n_ions; ++c) {
    if (!is_cation(c)) continue;
    for (std::size_t a = 0; a < n_ions; ++a) {
      if (is_cation(a) || !p.has_pair[c][a]) continue;
      const double x1 = p.alpha1[c][a] * sI, x2 = p.alpha2[c][a] * sI;
      B[c][a] = p.beta0[c][a] + p.beta1[c][a] * pitzer_g(x1) +
                (p.beta2[c][a] != 0.0 ? p.beta2[c][a] * pitzer_g(x2) : 0.0);
      Bphi[c][a] = p.beta0[c][a] + p.beta1[c][a] * std::exp(-x1) +
                   (p.beta2[c][a] != 0.0 ? p.beta2[c][a] * std::exp(-x2) : 0.0);
      Bp[c][a] = (p.beta1[c][a] * pitzer_gp(x1) +
                  (p.beta2[c][a] != 0.0 ? p.beta2[c][a] * pitzer_gp(x2) : 0.0)) /
                 I;
      if (p.c1[c][a] != 0.0) {
        // C^T = C0 + 4 C1 h(w), C^T_phi = C^T + I dC^T/dI / 2 = C0 + C1 e^-w (because
        // 4 h + x h' = e^-x), dC^T/dI = 2 C1 (e^-w - 4 h(w)) / I, w = omega sqrt I.
        const double w = p.omega[c][a] * sI, ew = std::exp(-w), hw = pitzer_h(w);
        CT[c][a] = p.c[c][a] + 4.0 * p.c1[c][a] * hw;
        CTphi[c][a] = p.c[c][a] + p.c1[c][a] * ew;
        CTp[c][a] = 2.0 * p.c1[c][a] * (ew - 4.0 * hw) / I;
      }
    }
  }
  for (std::size_t i = 0; i < n_ions; ++i) {
    for (std::size_t j = i + 1; j < n_ions; ++j) {
      if (is_cation(i) != is_cation(j)) continue;
      double et, etp;
      e_theta(std::abs(charge(i)), std::abs(charge(j)), I, A, et, etp);
      Phi[i][j] = Phi[j][i] = p.theta[i][j] + et;
      Phip[i][j] = Phip[j][i] = etp;
      Phiphi[i][j] = Phiphi[j][i] = p.theta[i][j] + et + I * etp;
    }
  }

  // Osmotic sum and F.
  double osm = -A * I * sI / (1.0 + b * sI);
  double F = -A * (sI / (1.0 + b * sI) + 2.0 / b * std::log1p(b * sI));
  double sum_mmC = 0.0;
  for (std::size_t c = 0; c < n_ions; ++c) {
    if (!is_cation(c) || m[c] == 0.0) continue;
    for (std::size_t a = 0; a < n_ions; ++a) {
      if (is_cation(a) || m[a] == 0.0) continue;
      const double mm = m[c] * m[a];
      osm += mm * (Bphi[c][a] + Z * CTphi[c][a]);
      F += mm * Bp[c][a];
      // d(Z C^T)/dm_M through I gives z_M^2 (Z/2) m_c m_a dC^T/dI: carried in F.
      if (CTp[c][a] != 0.0) F += mm * 0.5 * Z * CTp[c][a];
      sum_mmC += mm * CT[c][a];
    }
  }
  for (std::size_t i = 0; i < n_ions; ++i) {
    if (m[i] == 0.0) continue;
    for (std::size_t j = i + 1; j < n_ions; ++j) {
      if (m[j] == 0.0 || is_cation(i) != is_cation(j)) continue;
      double psum = 0.0;
      for (std::size_t k = 0; k < n_ions; ++k)
        if (is_cation(k) != is_cation(i)) psum += m[k] * p.psi[i][j][k];
      osm += m[i] * m[j] * (Phiphi[i][j] + psum);
      F += m[i] * m[j] * Phip[i][j];
    }
  }
  r.osmotic_excess = 2.0 * osm;

  // Activity coefficients.
  for (std::size_t M = 0; M < n_ions; ++M) {
    const int zM = charge(M);
    double lg = zM * zM * F + std::abs(zM) * sum_mmC;
    for (std::size_t k = 0; k < n_ions; ++k) {
      if (m[k] == 0.0) continue;
      if (is_cation(k) != is_cation(M)) {
        // opposite sign: binary terms
        const std::size_t c = is_cation(M) ? M : k, a = is_cation(M) ? k : M;
        lg += m[k] * (2.0 * B[c][a] + Z * CT[c][a]);
      } else if (k != M) {
        double psum = 0.0;
        for (std::size_t a = 0; a < n_ions; ++a)
          if (is_cation(a) != is_cation(M)) psum += m[a] * p.psi[M][k][a];
        lg += m[k] * (2.0 * Phi[M][k] + psum);
      }
    }
    // sum over pairs of ions of the opposite sign: psi_{k k' M}
    for (std::size_t k = 0; k < n_ions; ++k) {
      if (m[k] == 0.0 || is_cation(k) == is_cation(M)) continue;
      for (std::size_t l = k + 1; l < n_ions; ++l) {
        if (m[l] == 0.0 || is_cation(l) == is_cation(M)) continue;
        lg += m[k] * m[l] * p.psi[k][l][M];
      }
    }
    r.ln_gamma[M] = lg;
  }
  return r;
}

}  // namespace colligate::models::detail
