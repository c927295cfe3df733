#pragma once
/// \file pitzer_kernel.hpp
/// Internals of the Pitzer model shared by its evaluation: the Debye-Hueckel slopes
/// A_phi(T) (one per parameter set, see data::aphi_correlation), the unsymmetrical mixing
/// function J(x) and E-theta, and the functions g, g', h of the pair terms. The sums
/// below are evaluated in one place, detail::pitzer_system (pitzer_system.hpp).
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
/// with b = 1.2, Z = sum_i m_i |z_i|, C = C-phi / (2 sqrt|z_M z_X|) (for the extended form
/// of Archer 1991, 1992, C^T = C0 + 4 C1 h(omega sqrt I) in ln gamma, C0 + C1 e^-(omega sqrt I)
/// in the osmotic sum, and F gains sum_c sum_a m_c m_a (Z/2) dC^T/dI),
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

/// Coefficients of the A_phi series of Clegg, Rard & Pitzer (1994), Appendix II, Table 11
/// (the first halved as the series requires), in x = (2T - 607.3) / 139.
inline constexpr std::array<double, 19> clegg_rard_pitzer_1994_aphi_series = {
    0.797256081240 / 2,  0.573389669896e-1,  0.977632177788e-3,  0.489973732417e-2,
    -0.313151784342e-2,  0.179145971002e-2,  -0.920584241844e-3, 0.443862726879e-3,
    -0.203661129991e-3,  0.900924147948e-4,  -0.388189392385e-4, 0.164245088592e-4,
    -0.686031972567e-5,  0.283455806377e-5,  -0.115641433004e-5, 0.461489672579e-6,
    -0.177069754948e-6,  0.612464488231e-7,  -0.175689013085e-7};

/// Debye-Hueckel osmotic slope A_phi at 0.1 MPa, kg^1/2 mol^-1/2: Chebyshev series of
/// Clegg, Rard & Pitzer (1994), Appendix II, eqs. AII1-AII2, Table 11 (coefficients
/// copied from a public copy; the first is halved as the series requires).
/// 0.3915 at 298.15 K, 0.3767 at 273.15 K. Beyond 234.15-373.15 K it is extrapolated.
inline double debye_huckel_osmotic_slope(double temperature) {
  const auto& a = clegg_rard_pitzer_1994_aphi_series;
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

/// dA_phi/dT of debye_huckel_osmotic_slope(T) (Clegg, Rard & Pitzer 1994 series), per K:
/// the series differentiated term by term, T_k'(x) = 2 T_(k-1)(x) + 2 x T_(k-1)'(x) -
/// T_(k-2)'(x), times dx/dT = 2/139.
inline double debye_huckel_osmotic_slope_derivative(double temperature) {
  const auto& a = clegg_rard_pitzer_1994_aphi_series;
  const double x = (2.0 * temperature - 607.3) / 139.0;
  double t0 = 1.0, t1 = x, d0 = 0.0, d1 = 1.0, sum = a[1];
  for (std::size_t k = 2; k < a.size(); ++k) {
    const double t2 = 2.0 * x * t1 - t0;
    const double d2 = 2.0 * t1 + 2.0 * x * d1 - d0;
    sum += a[k] * d2;
    t0 = t1;
    t1 = t2;
    d0 = d1;
    d1 = d2;
  }
  return sum * (2.0 / 139.0);
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

/// dA_phi/dT of debye_huckel_osmotic_slope_spencer_1990(T), per K (the polynomial
/// differentiated).
inline double debye_huckel_osmotic_slope_spencer_1990_derivative(double temperature) {
  const double T = temperature;
  return 8.48795942e-2 + T * (2.0 * -8.88785150e-5 + T * 3.0 * 4.88096393e-8) +
         1327.31477 / (T * T) - 17.6460172 / T;
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

/// dA_phi/dT (per K) of the correlation a parameter set names.
inline double debye_huckel_osmotic_slope_derivative(double temperature,
                                                    data::aphi_correlation correlation) {
  switch (correlation) {
    case data::aphi_correlation::spencer_1990:
      return debye_huckel_osmotic_slope_spencer_1990_derivative(temperature);
    case data::aphi_correlation::clegg_rard_pitzer_1994:
    default:
      return debye_huckel_osmotic_slope_derivative(temperature);
  }
}

/// Chebyshev coefficients of J(x) of Harvie (1981) as given by Pitzer (1991), Table B-1:
/// for x < 1 (harvie_j_low) and x >= 1 (harvie_j_high).
inline constexpr std::array<double, 21> harvie_j_low = {
    1.925154014814667,  -0.060076477753119, -0.029779077456514, -0.007299499690937,
    0.000388260636404,  0.000636874599598,  0.000036583601823,  -0.000045036975204,
    -0.000004537895710, 0.000002937706971,  0.000000396566462,  -0.000000202099617,
    -0.000000025267769, 0.000000013522610,  0.000000001229405,  -0.000000000821969,
    -0.000000000050847, 0.000000000046333,  0.000000000001943,  -0.000000000002563,
    -0.000000000010991};
inline constexpr std::array<double, 21> harvie_j_high = {
    0.628023320520852,  0.462762985338493,  0.150044637187895,  -0.028796057604906,
    -0.036552745910311, -0.001668087945272, 0.006519840398744,  0.001130378079086,
    -0.000887171310131, -0.000242107641309, 0.000087294451594,  0.000034682122751,
    -0.000004583768938, -0.000003548684306, -0.000000250453880, 0.000000216991779,
    0.000000080779570,  0.000000004558555,  -0.000000006944757, -0.000000002849257,
    0.000000000237816};

namespace mixing_j_detail {
/// The Chebyshev sum of Table B-1 in the variable z of its piece as a power series,
/// S(z) = sum_n c_n z^n, with J = x/4 - 1 + S(z). Harvie's sum is the Clenshaw recurrence
/// b_k = a_k + z b_(k+1) - b_(k+2), S = (b_0 - b_2) / 2, whose basis is C_0 = 2, C_1 = z,
/// C_(k+1) = z C_k - C_(k-1) (C_k(z) = 2 T_k(z/2), integer coefficients): S = sum_k a_k C_k / 2
/// - a_0 / 2. The same polynomial of degree 20, so the same J up to rounding (a few units
/// in the last place: sum_n |c_n| 2^n is 1.2 on the lower piece, 4.1 on the upper, against
/// |S| of about 1; tests/cpp/models/test_pitzer_temperature_slope.cpp compares the two).
/// d and e are the coefficients of S' and S'' (padded with zeros to degree 20), so one
/// Horner loop gives S, S' and S'' on three independent chains.
struct power_series {
  std::array<double, 21> c{}, d{}, e{};
};
constexpr power_series to_power_series(const std::array<double, 21>& a) {
  double C[21][21] = {};  // C[k][n]: coefficient of z^n in C_k(z)
  C[0][0] = 2.0;
  C[1][1] = 1.0;
  for (int k = 1; k < 20; ++k)
    for (int n = 0; n < 21; ++n) C[k + 1][n] = (n > 0 ? C[k][n - 1] : 0.0) - C[k - 1][n];
  power_series p;
  for (int k = 0; k < 21; ++k)
    for (int n = 0; n < 21; ++n) p.c[n] += a[k] * C[k][n] / 2.0;
  p.c[0] -= a[0] / 2.0;
  for (int n = 0; n < 20; ++n) p.d[n] = (n + 1) * p.c[n + 1];
  for (int n = 0; n < 19; ++n) p.e[n] = (n + 2) * (n + 1) * p.c[n + 2];
  return p;
}
inline constexpr power_series j_low_series = to_power_series(harvie_j_low);
inline constexpr power_series j_high_series = to_power_series(harvie_j_high);

/// One argument x > 0 of J: its piece, z(x), z'(x), and S, S', S'' on Horner chains.
struct chain {
  const power_series* p = nullptr;
  bool low = false;
  double x = 0, z = 0, dz = 0;
  double s = 0, ds = 0, d2s = 0;
  explicit chain(double x_) : x(x_) {
    low = x < 1.0;
    // One power per call: x^-0.8 = x^0.2 / x and x^-1.1 = x^-0.1 / x.
    set(low ? std::pow(x, 0.2) : std::pow(x, -0.1));
  }
  /// With x^0.2 given (`p02`, > 0): x^-0.1 = 1 / sqrt(x^0.2) on the upper piece.
  chain(double x_, double p02) : x(x_) {
    low = x < 1.0;
    set(low ? p02 : 1.0 / std::sqrt(p02));
  }
  void set(double px) {
    p = low ? &j_low_series : &j_high_series;
    z = low ? 4.0 * px - 2.0 : 40.0 / 9.0 * px - 22.0 / 9.0;
    dz = low ? 0.8 * px / x : -4.0 / 9.0 * px / x;
    s = p->c[20];
    ds = p->d[20];
    d2s = p->e[20];
  }
  template <bool Second>
  void step(int n) {
    s = s * z + p->c[n];
    ds = ds * z + p->d[n];
    if constexpr (Second) d2s = d2s * z + p->e[n];
  }
  template <bool Second>
  void finish(double& J, double& dJ, double* d2J) const {
    if constexpr (Second) {
      // z'' = -0.8 z' / x (low), -1.1 z' / x (high).
      const double d2z = (low ? -0.8 : -1.1) * dz / x;
      *d2J = dz * dz * d2s + d2z * ds;
    }
    J = 0.25 * x - 1.0 + s;
    dJ = 0.25 + dz * ds;
  }
};
template <bool Second>
inline void j1(double x, double& J, double& dJ, double* d2J) {
  chain c(x);
  for (int n = 19; n >= 0; --n) c.step<Second>(n);
  c.finish<Second>(J, dJ, d2J);
}
template <bool Second>
inline void j3(const double* x, double* J, double* dJ, double* d2J) {
  chain p(x[0]), q(x[1]), r(x[2]);
  for (int n = 19; n >= 0; --n) {
    p.step<Second>(n);
    q.step<Second>(n);
    r.step<Second>(n);
  }
  p.finish<Second>(J[0], dJ[0], Second ? &d2J[0] : nullptr);
  q.finish<Second>(J[1], dJ[1], Second ? &d2J[1] : nullptr);
  r.finish<Second>(J[2], dJ[2], Second ? &d2J[2] : nullptr);
}
/// j3 at x, 2x and 4x from one power: (2x)^0.2 = 2^0.2 x^0.2, (4x)^0.2 = 4^0.2 x^0.2.
template <bool Second>
inline void j124(double x, double* J, double* dJ, double* d2J) {
  constexpr double two_02 = 1.148698354997035;   // 2^0.2 (tests/cpp/models/test_pitzer_temperature_slope.cpp)
  constexpr double four_02 = 1.3195079107728942;  // 4^0.2
  const double p = std::pow(x, 0.2);
  chain a(x, p), b(2.0 * x, two_02 * p), c(4.0 * x, four_02 * p);
  for (int n = 19; n >= 0; --n) {
    a.step<Second>(n);
    b.step<Second>(n);
    c.step<Second>(n);
  }
  a.finish<Second>(J[0], dJ[0], Second ? &d2J[0] : nullptr);
  b.finish<Second>(J[1], dJ[1], Second ? &d2J[1] : nullptr);
  c.finish<Second>(J[2], dJ[2], Second ? &d2J[2] : nullptr);
}
}  // namespace mixing_j_detail

/// J(x), dJ/dx and, when `d2J` is not null, d2J/dx2 of the unsymmetrical mixing theory
/// (Harvie 1981 as given by Pitzer 1991, eqs. B-21 to B-30, Table B-1), J(0) = 0: the
/// Chebyshev sum of the table as its power series in z (mixing_j_detail::power_series),
/// evaluated by Horner's rule with its first and second derivatives on chains of their own.
/// J and dJ are the same arithmetic with or without the second derivative.
inline void mixing_j(double x, double& J, double& dJ, double* d2J = nullptr) {
  if (!(x > 0.0)) {
    J = 0.0;
    dJ = 0.0;
    if (d2J) *d2J = 0.0;
    return;
  }
  if (d2J)
    mixing_j_detail::j1<true>(x, J, dJ, d2J);
  else
    mixing_j_detail::j1<false>(x, J, dJ, nullptr);
}

/// mixing_j at the three arguments x[0..2] at once (the charge products 1, 2 and 4 that
/// every unsymmetrical pair of ions of charges 1 and 2 needs): the same Horner chains per
/// argument as mixing_j, run in one loop so that they overlap in the processor instead of
/// waiting on each other.
inline void mixing_j3(const double* x, double* J, double* dJ, double* d2J = nullptr) {
  if (!(x[0] > 0.0 && x[1] > 0.0 && x[2] > 0.0)) {
    for (int c = 0; c < 3; ++c) mixing_j(x[c], J[c], dJ[c], d2J ? &d2J[c] : nullptr);
    return;
  }
  if (d2J)
    mixing_j_detail::j3<true>(x, J, dJ, d2J);
  else
    mixing_j_detail::j3<false>(x, J, dJ, nullptr);
}

/// mixing_j at x, 2x and 4x (the charge products 1, 2 and 4 of the unsymmetrical pairs of
/// ions of charges 1 and 2, x = 6 A_phi sqrt I) as mixing_j3 computes them, but with one
/// power x^0.2 for the three arguments (scaled by 2^0.2 and 4^0.2) instead of three: the
/// values differ from mixing_j's by the rounding of that scaling (a few ulp of the Chebyshev
/// variable; tests/cpp/models/test_pitzer_temperature_slope.cpp bounds the difference).
inline void mixing_j124(double x, double* J, double* dJ, double* d2J = nullptr) {
  if (!(x > 0.0)) {
    const double xs[3] = {x, 2.0 * x, 4.0 * x};
    mixing_j3(xs, J, dJ, d2J);
    return;
  }
  if (d2J)
    mixing_j_detail::j124<true>(x, J, dJ, d2J);
  else
    mixing_j_detail::j124<false>(x, J, dJ, nullptr);
}

/// E-theta and E-theta' (Pitzer 1975, eqs. 23-24) of two like-signed ions whose charge
/// product is zz (|z_i z_j|, z_i != z_j), at ionic strength I > 0, from J(x) and x J'(x) at
/// x_ij, x_ii and x_jj (x = 6 z z' A_phi sqrt I; mixing_j):
///   E-theta  = zz / (4 I) [J(x_ij) - J(x_ii)/2 - J(x_jj)/2]
///   E-theta' = -E-theta / I + zz / (8 I^2) [x_ij J'(x_ij) - x_ii J'(x_ii)/2 - x_jj J'(x_jj)/2]
inline void e_theta(double zz, double I, double J_ij, double J_ii, double J_jj, double xdJ_ij,
                    double xdJ_ii, double xdJ_jj, double& et, double& etp) {
  et = zz / (4.0 * I) * (J_ij - 0.5 * J_ii - 0.5 * J_jj);
  etp = -et / I + zz / (8.0 * I * I) * (xdJ_ij - 0.5 * xdJ_ii - 0.5 * xdJ_jj);
}

/// g(x) = 2 [1 - (1 + x) e^-x] / x^2 and g'(x) = -2 [1 - (1 + x + x^2/2) e^-x] / x^2 of
/// B and B' (Pitzer 1991, ch. 3), given `exp_minus_x` = e^-x (the caller has it from
/// B^phi); below x = 1e-3 their series to x^2, which avoids the cancellation.
inline double pitzer_g(double x, double exp_minus_x) {
  if (x < 1e-3) return 1.0 - 2.0 * x / 3.0 + x * x / 4.0;
  return 2.0 * (1.0 - (1.0 + x) * exp_minus_x) / (x * x);
}
inline double pitzer_gp(double x, double exp_minus_x) {
  if (x < 1e-3) return -x / 3.0 + x * x / 4.0;
  return -2.0 * (1.0 - (1.0 + x + 0.5 * x * x) * exp_minus_x) / (x * x);
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

/// Result of one evaluation (pitzer::evaluate), indexed by the ions of data::pitzer_ions.
struct pitzer_sums {
  double ionic_strength = 0.0;
  double total_molality = 0.0;   ///< sum_i m_i
  double osmotic_excess = 0.0;   ///< sum_i m_i (phi - 1)
  ion_array ln_gamma{};          ///< ln gamma_i (molal scale); NaN for an ion not in the solution's species
  double osmotic_coefficient() const {
    return total_molality > 0.0 ? 1.0 + osmotic_excess / total_molality : 1.0;
  }
};

}  // namespace colligate::models::detail
