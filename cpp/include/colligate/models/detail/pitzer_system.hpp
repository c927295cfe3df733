#pragma once
/// \file pitzer_system.hpp
/// The Pitzer model prepared once for one species list: the ions present (with their
/// charges), which species feed which ion, and the parameter rows of every cation-anion
/// pair, like-charged pair and triplet among them. Evaluating it does no name lookup and
/// no heap allocation, so a solver that calls the model many times on one solution
/// (freezing point, ice curve, salt saturation, batch rows with one species list) pays the
/// preparation once. This is the only implementation of the Pitzer sums; pitzer::evaluate
/// and the equilibria call it.
///
/// Equations (Harvie, Moller & Weare 1984, eqs. 1-8; Pitzer 1991, ch. 3), with the
/// symbols and the pair functions B, B^phi, B', C^T, E-theta given in
/// models/detail/pitzer_kernel.hpp:
///
///   sum_i m_i (phi - 1) = 2 [ -A_phi I^1.5 / (1 + b sqrt I) + sum_c sum_a m_c m_a (B^phi_ca + Z C^T_phi,ca)
///        + sum_i<j (like sign) m_i m_j (theta_ij + E-theta_ij + I E-theta'_ij + sum_k m_k psi_ijk) ]
///   ln gamma_M = z_M^2 F + sum_a m_a (2 B_Ma + Z C^T_Ma) + sum_c m_c (2 Phi_Mc + sum_a m_a psi_Mca)
///        + sum_a<a' m_a m_a' psi_aa'M + |z_M| sum_c sum_a m_c m_a C^T_ca           (anions alike)
///   F = -A_phi [sqrt I / (1 + b sqrt I) + (2/b) ln(1 + b sqrt I)] + sum_c sum_a m_c m_a B'_ca
///        + sum_i<j (like sign) m_i m_j E-theta'_ij + sum_c sum_a m_c m_a (Z/2) dC^T_ca/dI
///
/// The last term of F carries the ionic-strength dependence of the extended third virial
/// coefficient (Archer 1991, 1992); it is zero for the usual form, where C^T = C^T_phi = C.
/// ln gamma is computed on the same pass as the osmotic sum (osmotic_on_molalities and
/// ln_gamma_on_molalities run one routine), so the two share every pair function.
///
/// Work done once per temperature: A_phi(T) and the parameters P(T) of the pairs and
/// triplets present, as dot products with the basis of the analytic form
/// (data::t_function), one loop over a table of the rows (by column) that the compiler
/// vectorises, one logarithm in all. Work done once per composition (the last molalities
/// are kept, composition_terms): ionic strength, one exponential per distinct alpha (2,
/// 1.4, 12) and, for ln gamma, g and g'. Work done once per evaluation: one J(x) per
/// distinct charge product (1, 2, 4) of the unsymmetrical mixing terms (the three J at
/// once, from one power, when ions of charges 1 and 2 are mixed). The temperature slope of
/// ln a_w (ln_water_activity_with_temperature_slope) adds the slopes of A_phi and of the
/// same parameters, once per temperature, and J''(x). A solver that evaluates one
/// composition at several temperatures (the freezing point) takes
/// ln_water_activity_along_temperature, which forms the parameter part of the osmotic sum
/// once per composition as six sums over the rows (so a temperature costs the basis, A_phi
/// and J).
///
/// The object caches the coefficients of the last three temperatures evaluated (and their
/// slopes of the last two): a freezing-point solve evaluates the ice point and then the
/// iterates, and a brine's salt-saturation test one more temperature, so the next row of a
/// batch finds the ice point's coefficients still there. It is therefore not
/// meant to be shared between threads: each solve or batch thread owns its own.

#include <algorithm>
#include <array>
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <cstring>
#include <limits>
#include <string>
#include <utility>
#include <vector>

#include "colligate/core/errors.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/data/pitzer_parameters.hpp"
#include "colligate/models/detail/pitzer_kernel.hpp"
#include "colligate/models/detail/pitzer_record_parameters.hpp"

namespace colligate::models::detail {

/// The basis of the analytic temperature form at T (data::t_function, T_r = 298.15 K):
/// P(T) = sum_k a_k v_k(T).
struct t_basis {
  std::array<double, 6> v{};
  explicit t_basis(double T) {
    constexpr double Tr = 298.15;
    const double inv = 1.0 / T;
    v = {1.0, inv - 1.0 / Tr, std::log(T / Tr), T - Tr, T * T - Tr * Tr,
         inv * inv - 1.0 / (Tr * Tr)};
  }
  double operator()(const data::t_function& f) const {
    return f.a[0] + f.a[1] * v[1] + f.a[2] * v[2] + f.a[3] * v[3] + f.a[4] * v[4] +
           f.a[5] * v[5];
  }
};

/// The derivatives of the basis at T, dv_k/dT: dP/dT = sum_k a_k dv_k(T).
struct t_basis_slope {
  std::array<double, 6> dv{};
  explicit t_basis_slope(double T) {
    const double inv = 1.0 / T, inv2 = inv * inv;
    dv = {0.0, -inv2, inv, 1.0, 2.0 * T, -2.0 * inv2 * inv};
  }
  double operator()(const data::t_function& f) const {
    return f.a[1] * dv[1] + f.a[2] * dv[2] + f.a[3] * dv[3] + f.a[4] * dv[4] + f.a[5] * dv[5];
  }
};

/// Ion sums of one osmotic evaluation.
struct pitzer_osmotic_sums {
  double ionic_strength = 0.0;
  double total_molality = 0.0;  ///< sum_i m_i over the ions with parameters
  double osmotic_excess = 0.0;  ///< sum_i m_i (phi - 1)
  double other_particles = 0.0; ///< ideal particles (non-electrolytes, ions without parameters), mol/kg
};

/// The rows of a parameter set with their ion names resolved to indices of
/// data::pitzer_ions (pitzer_ion_count for an ion the tables do not know). Points into
/// the set, which must outlive it.
struct indexed_parameter_rows {
  struct binary {
    std::size_t c, a;
    const data::pitzer_binary* row;
  };
  struct theta {
    std::size_t i, j;
    const data::t_function* f;
  };
  struct psi {
    std::size_t i, j, k;
    const data::t_function* f;
  };
  std::vector<binary> binaries;
  std::vector<theta> thetas;
  std::vector<psi> psis;
  data::aphi_correlation aphi;

  explicit indexed_parameter_rows(const data::pitzer_parameter_set& set) : aphi(set.aphi) {
    using data::pitzer_ion_index;
    for (const auto& b : set.binaries)
      binaries.push_back({pitzer_ion_index(b.cation), pitzer_ion_index(b.anion), &b});
    for (const auto& t : set.thetas)
      thetas.push_back({pitzer_ion_index(t.ion1), pitzer_ion_index(t.ion2), &t.theta});
    for (const auto& s : set.psis)
      psis.push_back(
          {pitzer_ion_index(s.ion1), pitzer_ion_index(s.ion2), pitzer_ion_index(s.ion3), &s.psi});
  }
};

class pitzer_system {
 public:
  static constexpr std::size_t max_pairs = n_ions * n_ions / 4 + 1;
  static constexpr std::size_t max_like = n_ions * (n_ions - 1) / 2;
  static constexpr std::size_t max_triplets = max_like * n_ions;
  /// Pair rows (beta0, beta1, beta2, C-phi), theta and psi rows: ln_water_activity_along_temperature.
  static constexpr std::size_t max_linear_rows = 4 * max_pairs + max_like + max_triplets;
  /// Distinct charge pairs of like ions of unequal charge.
  static constexpr std::size_t max_unequal = max_like;

  /// Prepares the model for the species of `s` (their amounts are read at evaluation).
  /// Salts carrying their own parameters (solute_record::pitzer) replace the set's row for
  /// their ion pair, as in pitzer::evaluate; conflicting rows throw invalid_input.
  pitzer_system(const solution& s, const data::pitzer_parameter_set& set) {
    if (has_record_binaries(s)) {
      const auto copy = with_record_binaries(s, set);
      build(s, indexed_parameter_rows(copy));
    } else if (&set == &data::harvie_spencer_icefit_parameters()) {
      static const indexed_parameter_rows rows(data::harvie_spencer_icefit_parameters());
      build(s, rows);
    } else if (&set == &data::spencer_1990_icefit_parameters()) {
      static const indexed_parameter_rows rows(data::spencer_1990_icefit_parameters());
      build(s, rows);
    } else if (&set == &data::spencer_1990_parameters()) {
      // Built-in sets are immutable statics: index them once (thread-safe initialisation).
      static const indexed_parameter_rows rows(data::spencer_1990_parameters());
      build(s, rows);
    } else if (&set == &data::harvie_1984_parameters()) {
      static const indexed_parameter_rows rows(data::harvie_1984_parameters());
      build(s, rows);
    } else if (&set == &data::archer_1992_parameters()) {
      static const indexed_parameter_rows rows(data::archer_1992_parameters());
      build(s, rows);
    } else {
      build(s, indexed_parameter_rows(set));
    }
  }

  /// Prepares the model for `part`, a solution holding some of the species of a larger
  /// one (the electrolytes of a salt + sugar mixture), and reads the amounts of the larger
  /// one at evaluation: species j of `part` is species `species_of_part[j]` there. Same
  /// arithmetic as a system prepared for `part` itself.
  pitzer_system(const solution& part, const data::pitzer_parameter_set& set,
                const std::vector<std::size_t>& species_of_part)
      : pitzer_system(part, set) {
    for (auto& t : terms_) t.species = species_of_part.at(t.species);
  }

  /// Number of ions present (slots), in the order of data::pitzer_ions: the ions of the
  /// electrolytes of the species list that the parameter tables know.
  std::size_t ion_slots() const noexcept { return n_; }

  /// Slot of ion `global_ion` (an index of data::pitzer_ions, as data::pitzer_ion_index
  /// gives it), or ion_slots() when that ion is absent or the index unknown.
  std::size_t slot_of(std::size_t global_ion) const noexcept {
    return global_ion < n_ions ? slot_of_[global_ion] : n_;
  }

  /// Index in data::pitzer_ions of the ion in `slot` (0 <= slot < ion_slots()).
  std::size_t global_ion(std::size_t slot) const {
    check_slot("pitzer_system::global_ion", slot);
    return global_[slot];
  }

  /// Charge number of the ion in `slot` (0 <= slot < ion_slots()).
  int charge_of_slot(std::size_t slot) const {
    check_slot("pitzer_system::charge_of_slot", slot);
    return z_[slot];
  }

  /// Ion molalities `m` (mol/kg, one per slot) and ideal particles `other` (mol/kg:
  /// non-electrolytes and ions the tables do not know) for `moles` (one per species of
  /// the solution it was prepared for) in `water_kg` of water.
  /// The amounts of each ion are summed first and divided by the water once, so the ion
  /// amounts of ion_moles-style callers (moles per slot in 1 kg, then divided by the water)
  /// give the same molalities bit for bit.
  void molalities(const double* moles, double water_kg, double* m, double& other) const {
    for (std::size_t k = 0; k < n_; ++k) m[k] = 0.0;
    other = 0.0;
    for (const auto& t : terms_) {
      if (t.slot < n_)
        m[t.slot] += t.count * moles[t.species];
      else
        other += t.count * (moles[t.species] / water_kg);
    }
    for (std::size_t k = 0; k < n_; ++k) m[k] /= water_kg;
  }

  /// The osmotic sums on ion molalities `m_slots` (mol/kg, one per slot) at temperature
  /// T (K). other_particles is left 0: the caller knows its ideal particles.
  pitzer_osmotic_sums osmotic_on_molalities(const double* m_slots, double T) {
    pitzer_osmotic_sums r;
    sums<false>(m_slots, T, r, nullptr);
    return r;
  }

  /// ln gamma (molal scale) of every ion present, `ln_gamma_slots[k]` for slot k, on ion
  /// molalities `m_slots` (mol/kg, one per slot) at temperature T (K); an ion of zero
  /// molality gets its trace activity coefficient. If `osm` is given it receives the
  /// osmotic sums of the same evaluation, equal bit for bit to osmotic_on_molalities().
  void ln_gamma_on_molalities(const double* m_slots, double T, double* ln_gamma_slots,
                              pitzer_osmotic_sums* osm = nullptr) {
    pitzer_osmotic_sums r;
    sums<true>(m_slots, T, r, ln_gamma_slots);
    if (osm != nullptr) *osm = r;
  }

  /// Lowest and highest temperature (K) of the bins of ln_gamma_upper_bounds, and their width.
  static constexpr double bound_bins_min_temperature = 223.15;
  static constexpr double bound_bin_width = 0.5;
  static constexpr std::size_t bound_bins = 100;  ///< 223.15 to 273.15 K

  /// Upper bounds of ln gamma (molal scale) of every ion present, `ln_gamma_hi[k]` for slot
  /// k (ln gamma_k <= ln_gamma_hi[k] as ln_gamma_on_molalities computes it), on ion
  /// molalities `m_slots` (mol/kg) at temperature T (K), for a cheap test that rules out
  /// salt saturation before the exact one (equilibria/ice_curve.hpp). The sums of
  /// ln_gamma_on_molalities with each parameter replaced by the end of its range over the
  /// bin of width bound_bin_width holding T that makes the term largest (the molalities,
  /// g(x) >= 0, g'(x) <= 0, Z and the charges fix the sign of every factor): each parameter
  /// over the bin lies between its values at the bin's ends widened by the largest distance
  /// of a C2 function from its chord (parameter_ranges). A_phi is the exact value of
  /// ln_gamma_on_molalities; E-theta, E-theta' (J(x) at x = 6 z z' A_phi(T) sqrt I) are too,
  /// or, when the last ln_water_activity_along_temperature had x within 1e-6 of this one,
  /// upper bounds from its J values with their Taylor remainders (j_near_last). The
  /// parameter ranges of a bin are computed the first time it is used and kept (they depend
  /// on the parameter rows alone). False (nothing written) when no bound is available: T
  /// outside the bins, I = 0, or a pair row in the extended form (Archer 1992).
  bool ln_gamma_upper_bounds(const double* m_slots, double T, double* ln_gamma_hi) {
    if (has_extended_ || !(T >= bound_bins_min_temperature)) return false;
    const double pos = (T - bound_bins_min_temperature) / bound_bin_width;
    if (!(pos < static_cast<double>(bound_bins))) return false;
    const auto b = static_cast<std::size_t>(pos);
    const double Ta = bound_bins_min_temperature + bound_bin_width * static_cast<double>(b);
    const double Tb = bound_bins_min_temperature + bound_bin_width * static_cast<double>(b + 1);
    if (!(Ta <= T && T <= Tb)) return false;
    composition_terms& q = composition_for(m_slots);
    if (!(q.I > 0.0)) return false;
    gamma_terms(q);
    const double* lo = nullptr;
    const double* hi = nullptr;
    parameter_ranges(b, Ta, Tb, lo, hi);
    const double* m = m_slots;
    const double I = q.I, Z = q.Z;
    const double A = debye_huckel_osmotic_slope(T, aphi_);
    double F = -A * q.f_dh;  // f_dh >= 0
    double sum_mmC = 0.0;
    for (std::size_t k = 0; k < n_; ++k) ln_gamma_hi[k] = 0.0;
    for (std::size_t k = 0; k < n_pairs_; ++k) {
      const auto& row = pairs_[k];
      const double mc = m[row.c], ma = m[row.a];
      const double mm = mc * ma;
      if (mc == 0.0 && ma == 0.0) continue;
      const std::size_t p0 = row.p0;
      const double g = row.alpha1 == 0 ? q.g2 : q.g14;    // >= 0
      const double gp = row.alpha1 == 0 ? q.gp2 : q.gp14;  // <= 0
      double B = hi[p0] + hi[p0 + 1] * g;
      double Bp = lo[p0 + 1] * gp;
      if (row.two_two) {
        B += hi[p0 + 2] * q.g12;
        Bp += lo[p0 + 2] * q.gp12;
      }
      Bp /= I;
      const double CT = hi[p0 + row.c_off];
      if (mm != 0.0) {
        F += mm * Bp;
        sum_mmC += mm * CT;
      }
      const double w = 2.0 * B + Z * CT;
      ln_gamma_hi[row.c] += ma * w;
      ln_gamma_hi[row.a] += mc * w;
    }
    j_values jv;
    const double s6 = 6.0 * A * q.sI;
    double eJ[5] = {}, exdJ[5] = {};  // bounds of |J - jv.J| and |x J' - jv.x jv.dJ|
    const bool taylor = j_near_last(s6, jv, eJ, exdJ);
    if (!taylor) fill_j<false>(s6, jv);
    for (std::size_t k = 0; k < n_like_; ++k) {
      const auto& L = like_[k];
      const double mi = m[L.i], mj = m[L.j];
      const double mm = mi * mj;
      if (mi == 0.0 && mj == 0.0) continue;
      const double theta = L.has_theta ? hi[L.p0] : 0.0;
      double et = 0.0, etp = 0.0;
      if (L.zi != L.zj) {
        const int ij = L.zi * L.zj, ii = L.zi * L.zi, jj = L.zj * L.zj;
        ensure_j<false>(s6, ij, jv);
        ensure_j<false>(s6, ii, jv);
        ensure_j<false>(s6, jj, jv);
        e_theta(static_cast<double>(ij), I, jv.J[ij], jv.J[ii], jv.J[jj], jv.x[ij] * jv.dJ[ij],
                jv.x[ii] * jv.dJ[ii], jv.x[jj] * jv.dJ[jj], et, etp);
        if (taylor) {
          // E-theta and E-theta' are linear in the J and x J' (e_theta): widen each by the
          // sizes of their coefficients times the bounds of the J and x J' errors.
          const double e_et = ij / (4.0 * I) * (eJ[ij] + 0.5 * eJ[ii] + 0.5 * eJ[jj]);
          et += e_et;
          etp += e_et / I + ij / (8.0 * I * I) * (exdJ[ij] + 0.5 * exdJ[ii] + 0.5 * exdJ[jj]);
        }
      }
      double psum = 0.0;
      for (std::size_t t = L.psi_begin; t < L.psi_end; ++t) {
        const double psi = hi[L.psi_p0 + (t - L.psi_begin)];
        psum += m[triplets_[t].k] * psi;
        if (mm != 0.0) ln_gamma_hi[triplets_[t].k] += mm * psi;
      }
      if (mm != 0.0) F += mm * etp;
      const double w = 2.0 * (theta + et) + psum;
      ln_gamma_hi[L.i] += mj * w;
      ln_gamma_hi[L.j] += mi * w;
    }
    for (std::size_t k = 0; k < n_; ++k)
      ln_gamma_hi[k] += z_[k] * z_[k] * F + std::abs(z_[k]) * sum_mmC;
    return true;
  }

  /// The osmotic sums for `moles` in `water_kg` of water at temperature T (K).
  pitzer_osmotic_sums osmotic(const double* moles, double water_kg, double T) {
    std::array<double, n_ions> m{};
    double other = 0.0;
    molalities(moles, water_kg, m.data(), other);
    auto r = osmotic_on_molalities(m.data(), T);
    r.other_particles = other;
    return r;
  }

  /// ln a_w = -M_w (sum_i m_i phi + other particles).
  double ln_water_activity(const double* moles, double water_kg, double T) {
    const auto r = osmotic(moles, water_kg, T);
    return -constants::molar_mass_water * (r.total_molality + r.osmotic_excess + r.other_particles);
  }

  /// Whether ln_water_activity_with_temperature_slope() is available: every pair row is
  /// in the analytic form (data::t_function). Rows in the extended form of Archer (1992)
  /// have no closed-form slope here.
  bool has_temperature_slope() const noexcept { return !has_extended_; }

  /// ln a_w as ln_water_activity() gives it (bit-identical) and its derivative with
  /// respect to temperature at fixed amounts, d ln a_w / dT (1/K), in closed form:
  /// -2 M_w d/dT of the bracket of the osmotic sum (file comment), through A_phi(T), the
  /// pair, theta and psi parameters P(T) and E-theta (whose T dependence enters through
  /// x = 6 z z' A_phi sqrt I alone: d(E-theta + I E-theta')/dT = zz / (8 I)
  /// sum (x J' + x^2 J'') (dA_phi/dT) / A_phi, with the halves of the ii and jj terms).
  /// Requires has_temperature_slope(); otherwise throws invalid_input.
  double ln_water_activity_with_temperature_slope(const double* moles, double water_kg, double T,
                                                  double& slope) {
    if (has_extended_)
      throw invalid_input(
          "pitzer_system: no temperature slope for pair rows in the extended form (Archer 1992)");
    std::array<double, n_ions> m{};
    double other = 0.0;
    molalities(moles, water_kg, m.data(), other);
    pitzer_osmotic_sums r;
    double d_osmotic_excess = 0.0;
    sums<false, true>(m.data(), T, r, nullptr, &d_osmotic_excess);
    r.other_particles = other;
    slope = -constants::molar_mass_water * d_osmotic_excess;
    return -constants::molar_mass_water * (r.total_molality + r.osmotic_excess + r.other_particles);
  }

  /// ln a_w and d ln a_w / dT (1/K) at fixed amounts, for a solver that evaluates one
  /// composition at several temperatures (the freezing-point Newton). The parameter part of
  /// the osmotic sum is linear in the parameters, each linear in the basis of the analytic
  /// form, so at fixed molalities it is one dot product with that basis:
  ///     sum_r w_r P_r(T) = sum_k (sum_r w_r a_rk) v_k(T),
  /// w_r the molality weights of pair, theta and psi rows (m_c m_a, m_c m_a e^(-alpha sqrt I),
  /// m_c m_a Z / (2 sqrt|z_c z_a|), m_i m_j, m_i m_j m_k). The six sums over r are formed once
  /// per composition (kept with the other molality-only terms: ionic strength, the
  /// exponentials), so a further temperature costs the basis, A_phi and E-theta (J(x) at
  /// x = 6 z z' A_phi sqrt I, with J' and J'' for the slope). Equal to
  /// ln_water_activity_with_temperature_slope() within rounding (the sums are regrouped, so
  /// not bit for bit; tests/cpp/models/test_pitzer_temperature_slope.cpp). Requires
  /// has_temperature_slope(); otherwise throws invalid_input.
  double ln_water_activity_along_temperature(const double* moles, double water_kg, double T,
                                             double& slope) {
    if (has_extended_)
      throw invalid_input(
          "pitzer_system: no temperature slope for pair rows in the extended form (Archer 1992)");
    ion_array m{};
    double other = 0.0;
    molalities(moles, water_kg, m.data(), other);
    composition_terms& q = composition_for(m.data());
    double bracket = 0.0, d_bracket = 0.0;
    if (q.I > 0.0) {
      linear_sums(q);
      const temperature_terms& t = temperature_terms_at(T);
      const double dh = q.I * q.sI / (1.0 + pitzer_b * q.sI);
      bracket = -t.aphi * dh + (q.c[0] + q.c[1] * t.v[1] + q.c[2] * t.v[2] + q.c[3] * t.v[3] +
                                q.c[4] * t.v[4] + q.c[5] * t.v[5]);
      d_bracket = -t.daphi * dh + (q.c[1] * t.dv[1] + q.c[2] * t.dv[2] + q.c[3] * t.dv[3] +
                                   q.c[4] * t.dv[4] + q.c[5] * t.dv[5]);
      if (has_unsymmetrical_) {
        // E-theta + I E-theta' of the like pairs of unequal charge, and its T slope (file
        // comment of ln_water_activity_with_temperature_slope).
        j_values j;
        const double s6 = 6.0 * t.aphi * q.sI;
        fill_j<true>(s6, j);
        const double scale = t.daphi / t.aphi;
        last_j_s6_ = s6;
        for (std::size_t u = 0; u < n_unequal_; ++u) {
          const double mm = q.mm_unequal[u];
          if (mm == 0.0) continue;
          const int zi = unequal_charges_[u].first, zj = unequal_charges_[u].second;
          const int ij = zi * zj, ii = zi * zi, jj = zj * zj;
          ensure_j<true>(s6, ij, j);
          ensure_j<true>(s6, ii, j);
          ensure_j<true>(s6, jj, j);
          double et = 0.0, etp = 0.0;
          e_theta(static_cast<double>(ij), q.I, j.J[ij], j.J[ii], j.J[jj], j.x[ij] * j.dJ[ij],
                  j.x[ii] * j.dJ[ii], j.x[jj] * j.dJ[jj], et, etp);
          bracket += mm * (et + q.I * etp);
          d_bracket += mm * ij / (8.0 * q.I) *
                       (j.dxdJ_dT(ij, scale) - 0.5 * j.dxdJ_dT(ii, scale) - 0.5 * j.dxdJ_dT(jj, scale));
        }
        last_j_ = j;
      }
    }
    slope = -constants::molar_mass_water * (2.0 * d_bracket);
    return -constants::molar_mass_water * (q.mt + 2.0 * bracket + other);
  }

 private:
  struct term {
    std::size_t species;
    std::size_t slot;  ///< n_ for ideal particles
    double count;
  };
  struct pair_row {
    std::size_t c, a;
    data::t_function beta0, beta1, beta2, cphi;
    int alpha1;  ///< index into the alphas: 0 -> 2, 1 -> 1.4
    bool two_two;
    double c_scale;  ///< 2 sqrt|z_c z_a|
    const data::extended_binary* ext;  ///< extended form (C1, omega), else nullptr
    std::size_t p0 = 0;     ///< index of beta0 in coefficients::P (beta1, beta2 follow)
    std::size_t c_off = 0;  ///< C (C0, then C1 for the extended form) at P[p0 + c_off]
  };
  struct like_row {
    std::size_t i, j;
    int zi, zj;  ///< |charges|
    data::t_function theta;
    bool has_theta;
    std::size_t psi_begin, psi_end;  ///< into triplets_
    std::size_t unequal;  ///< zi != zj: its entry of unequal_charges_
    std::size_t p0 = 0;      ///< index of theta in coefficients::P (has_theta)
    std::size_t psi_p0 = 0;  ///< index of the psi of triplet psi_begin (the others follow)
  };
  struct triplet_row {
    std::size_t k;
    data::t_function psi;
  };
  struct coefficients {
    double temperature = std::numeric_limits<double>::quiet_NaN();
    double aphi = 0.0;
    /// Every parameter at T by its index (pair_row::p0, like_row::p0 and psi_p0): the rows
    /// in the analytic form first (C-phi already divided by 2 sqrt|z_c z_a|), then per pair
    /// in the extended form beta0, beta1, C0, C1. Entries not used are left unset.
    std::array<double, max_linear_rows + 4 * max_pairs> P;
  };
  /// d/dT of the coefficients (pairs in the analytic form only), at `temperature`.
  struct coefficient_slopes {
    double temperature = std::numeric_limits<double>::quiet_NaN();
    double aphi = 0.0;
    std::array<double, max_pairs> beta0{}, beta1{}, beta2{}, c{};
    std::array<double, max_like> theta{};
    std::array<double, max_triplets> psi{};
  };

  /// The parts of the sums that depend on the molalities alone, for the last molalities
  /// seen (compared bit for bit): a freezing-point row evaluates one composition at several
  /// temperatures and its ion activities at the result. Every value is the one the sums
  /// would compute afresh, so the cache never changes a result.
  struct composition_terms {
    bool valid = false;
    ion_array m{};  ///< the key
    double I = 0.0, Z = 0.0, mt = 0.0, sI = 0.0;
    double e2 = 0.0, e14 = 0.0, e12 = 0.0;  ///< exp(-alpha sqrt I), alpha = 2, 1.4, 12
    bool has_g = false;  ///< g, g' and the Debye-Hueckel part of F below are filled
    double g2 = 0.0, g14 = 0.0, g12 = 0.0, gp2 = 0.0, gp14 = 0.0, gp12 = 0.0;
    double f_dh = 0.0;  ///< sqrt I / (1 + b sqrt I) + (2/b) ln(1 + b sqrt I)
    bool has_linear = false;  ///< c and mm_unequal below are filled
    std::array<double, 6> c{};  ///< sum_r w_r a_rk (ln_water_activity_along_temperature)
    /// sum of m_i m_j over the like pairs of unequal charge, per entry of unequal_charges_
    std::array<double, max_unequal> mm_unequal{};
  };
  /// The basis of the analytic form, its slope and A_phi with its slope at one temperature.
  struct temperature_terms {
    double temperature = std::numeric_limits<double>::quiet_NaN();
    std::array<double, 6> v{}, dv{};
    double aphi = 0.0, daphi = 0.0;
  };
  /// J(x), J'(x) (and J''(x)) at x = zz s6 for the charge products zz = 1, 2, 4 (index zz).
  struct j_values {
    std::array<double, 5> J{}, dJ{}, x{}, d2J{};
    std::array<bool, 5> have{};
    /// d(x J'(x))/dT = (x J' + x^2 J'') (dA_phi/dT) / A_phi, x proportional to A_phi;
    /// `scale` = (dA_phi/dT) / A_phi.
    double dxdJ_dT(int zz, double scale) const {
      return (x[zz] * dJ[zz] + x[zz] * x[zz] * d2J[zz]) * scale;
    }
  };

  /// J at the charge products 1, 2 and 4 at once when ions of charges 1 and 2 are mixed
  /// (one power for the three arguments, mixing_j124); nothing otherwise (ensure_j fills
  /// what a like pair needs).
  template <bool Second>
  void fill_j(double s6, j_values& j) const {
    if (!has_unsymmetrical_) return;
    double Js[3], dJs[3], d2Js[3];
    mixing_j124(s6, Js, dJs, Second ? d2Js : nullptr);
    for (int c = 0; c < 3; ++c) {
      const int zz = 1 << c;
      j.x[zz] = s6 * zz;
      j.J[zz] = Js[c];
      j.dJ[zz] = dJs[c];
      if constexpr (Second) j.d2J[zz] = d2Js[c];
      j.have[zz] = true;
    }
  }
  template <bool Second>
  static void ensure_j(double s6, int zz, j_values& j) {
    if (!j.have[zz]) fill_one_j<Second>(s6, zz, j);
  }
  template <bool Second>
  static void fill_one_j(double s6, int zz, j_values& j) {
    j.x[zz] = s6 * zz;
    mixing_j(j.x[zz], j.J[zz], j.dJ[zz], Second ? &j.d2J[zz] : nullptr);
    j.have[zz] = true;
  }

  /// J and J' for ln_gamma_upper_bounds at x = zz s6 from those of the last
  /// ln_water_activity_along_temperature (last_j_ at x_l = zz s6_l; the freezing-point
  /// Newton ends at the temperature the bound is asked for, and x changes with A_phi(T)
  /// alone), when |s6 - s6_l| <= 1e-6 s6_l: J(x) = J(x_l) + J'(x_l) d + R, d = x - x_l,
  /// |R| <= max|J''| d^2 / 2, and x J'(x) = x J'(x_l) + R', |R'| <= x max|J''| |d|, with
  /// max|J''| over [x_l, x] <= 0.2 / x_l (|x J''(x)| <= 0.049 for 1e-8 <= x <= 1e8 on a
  /// grid of ratio 1.0002, tests/cpp/models/test_pitzer_temperature_slope.cpp; 0.1 / x and
  /// x >= x_l / (1 + 1e-6) give 0.2 / x_l with room); plus 1e-14 (1 + x) for the rounding
  /// of the series that evaluates J (a few ulp of max(|J|, x / 4, 1)). Writes the bounds of
  /// the J and x J' errors into eJ and exdJ (index zz). False when the last values do not
  /// apply (the caller then evaluates J).
  bool j_near_last(double s6, j_values& jv, double* eJ, double* exdJ) const {
    const double s6l = last_j_s6_;
    if (!(s6l >= 1e-8 && 4.0 * s6l <= 1e8 && std::abs(s6 - s6l) <= 1e-6 * s6l)) return false;
    for (int zz = 1; zz < 5; ++zz) {
      if (!last_j_.have[zz]) continue;
      const double xl = last_j_.x[zz], x = s6 * zz, d = x - xl;
      const double m2 = 0.2 / xl;
      jv.x[zz] = x;
      jv.J[zz] = last_j_.J[zz] + last_j_.dJ[zz] * d;
      jv.dJ[zz] = last_j_.dJ[zz];
      jv.have[zz] = true;
      eJ[zz] = 0.5 * m2 * d * d + 1e-14 * (1.0 + x);
      exdJ[zz] = x * m2 * std::abs(d) + 1e-14 * (1.0 + x);
    }
    return true;
  }

  /// The molality-only terms of `m` (one per slot), from the cache when `m` is the last
  /// composition seen.
  composition_terms& composition_for(const double* m) {
    composition_terms& q = comp_;
    if (q.valid && std::memcmp(q.m.data(), m, n_ * sizeof(double)) == 0) return q;
    q.valid = true;
    q.has_g = false;
    q.has_linear = false;
    std::memcpy(q.m.data(), m, n_ * sizeof(double));
    double I = 0.0, Z = 0.0, mt = 0.0;
    for (std::size_t k = 0; k < n_; ++k) {
      I += 0.5 * m[k] * z_[k] * z_[k];
      Z += m[k] * std::abs(z_[k]);
      mt += m[k];
    }
    q.I = I;
    q.Z = Z;
    q.mt = mt;
    q.sI = q.e2 = q.e14 = q.e12 = 0.0;
    if (!(I > 0.0)) return q;
    const double sI = std::sqrt(I);
    q.sI = sI;
    q.e2 = need_alpha_2_ ? std::exp(-2.0 * sI) : 0.0;
    q.e14 = need_alpha_14_ ? std::exp(-1.4 * sI) : 0.0;
    q.e12 = need_alpha_12_ ? std::exp(-12.0 * sI) : 0.0;
    return q;
  }

  /// g, g' and the Debye-Hueckel part of F of ln gamma (requires I > 0).
  void gamma_terms(composition_terms& q) const {
    if (q.has_g) return;
    const double sI = q.sI;
    q.f_dh = sI / (1.0 + pitzer_b * sI) + 2.0 / pitzer_b * std::log1p(pitzer_b * sI);
    q.g2 = q.g14 = q.g12 = q.gp2 = q.gp14 = q.gp12 = 0.0;
    if (need_alpha_2_) {
      q.g2 = pitzer_g(2.0 * sI, q.e2);
      q.gp2 = pitzer_gp(2.0 * sI, q.e2);
    }
    if (need_alpha_14_) {
      q.g14 = pitzer_g(1.4 * sI, q.e14);
      q.gp14 = pitzer_gp(1.4 * sI, q.e14);
    }
    if (need_alpha_12_) {
      q.g12 = pitzer_g(12.0 * sI, q.e12);
      q.gp12 = pitzer_gp(12.0 * sI, q.e12);
    }
    q.has_g = true;
  }

  /// The six sums c_k = sum_r w_r a_rk of ln_water_activity_along_temperature and the
  /// sums of m_i m_j over the like pairs of unequal charge, per charge pair (requires I > 0
  /// and no extended row). Each row's weight multiplies its six coefficients at once (six
  /// independent sums, which the compiler vectorises), in the order of linear_rows_.
  void linear_sums(composition_terms& q) const {
    if (q.has_linear) return;
    const double* m = q.m.data();
    std::array<double, 6> c{};
    std::size_t r = 0;
    const auto add = [&c, this, &r](double w) {
      const auto& a = linear_rows_[r++];
      for (std::size_t k = 0; k < 6; ++k) c[k] += w * a[k];
    };
    for (std::size_t k = 0; k < n_pairs_; ++k) {
      const auto& row = pairs_[k];
      const double mm = m[row.c] * m[row.a];
      if (row.ext != nullptr) continue;  // not reached: no temperature slope with them
      add(mm);
      add(mm * (row.alpha1 == 0 ? q.e2 : q.e14));
      if (row.two_two) add(mm * q.e12);
      add(mm * q.Z);  // the row holds C-phi / (2 sqrt|z_c z_a|)
    }
    q.mm_unequal = {};
    for (std::size_t k = 0; k < n_like_; ++k) {
      const auto& L = like_[k];
      const double mm = m[L.i] * m[L.j];
      if (L.has_theta) add(mm);
      for (std::size_t t = L.psi_begin; t < L.psi_end; ++t) add(mm * m[triplets_[t].k]);
      if (L.zi != L.zj) q.mm_unequal[L.unequal] += mm;
    }
    q.c = c;
    q.has_linear = true;
  }

  /// The basis, its slope and A_phi with its slope at T, from a two-slot cache (the ice
  /// point, which every freezing-point row evaluates first, stays in one slot).
  const temperature_terms& temperature_terms_at(double T) {
    if (tt_[0].temperature == T) {
      tt_last_ = 0;
      return tt_[0];
    }
    if (tt_[1].temperature == T) {
      tt_last_ = 1;
      return tt_[1];
    }
    tt_last_ ^= 1;
    temperature_terms& t = tt_[tt_last_];
    t.temperature = T;
    t.v = t_basis(T).v;
    t.dv = t_basis_slope(T).dv;
    t.aphi = debye_huckel_osmotic_slope(T, aphi_);
    t.daphi = debye_huckel_osmotic_slope_derivative(T, aphi_);
    return t;
  }

  void build(const solution& s, const indexed_parameter_rows& set) {
    // Ions present, in the fixed order of data::pitzer_ions (cations, then anions).
    std::array<bool, n_ions> present{};
    for (const auto& rec : s.species()) {
      if (rec.kind != data::solute_class::electrolyte) continue;
      for (const auto& ion : rec.ions) {
        const auto k = data::pitzer_ion_index(ion.ion);
        if (k < n_ions) present[k] = true;
      }
    }
    for (std::size_t g = 0; g < n_ions; ++g) {
      slot_of_[g] = n_ions;
      if (!present[g]) continue;
      slot_of_[g] = n_;
      global_[n_] = g;
      z_[n_] = data::pitzer_ions[g].charge;
      ++n_;
    }
    for (auto& k : slot_of_) k = k < n_ ? k : n_;  // absent ions: n_
    const auto slot = [&](std::size_t g) { return g < n_ions ? slot_of_[g] : n_; };
    // Species -> ion molalities, in the order of pitzer::ion_molalities.
    for (std::size_t i = 0; i < s.size(); ++i) {
      const auto& rec = s.species()[i];
      if (rec.kind != data::solute_class::electrolyte || rec.ions.empty()) {
        terms_.push_back({i, n_, static_cast<double>(rec.particles)});
        continue;
      }
      for (const auto& ion : rec.ions)
        terms_.push_back({i, slot(data::pitzer_ion_index(ion.ion)), static_cast<double>(ion.count)});
    }
    // Cation-anion rows (the last row of a pair wins).
    for (const auto& b : set.binaries) {
      const auto c = slot(b.c), a = slot(b.a);
      if (c >= n_ || a >= n_) continue;
      const int zc = z_[c], za = z_[a];
      const bool two_two = std::abs(zc) == 2 && std::abs(za) == 2;
      const auto* ext = b.row->extended;
      pair_row row{c,  a, b.row->beta0, b.row->beta1, b.row->beta2, b.row->cphi,
                   ext == nullptr && two_two ? 1 : 0, ext == nullptr && two_two,
                   2.0 * std::sqrt(std::abs(zc * za)), ext};
      if (ext != nullptr) has_extended_ = true;
      std::size_t k = 0;
      while (k < n_pairs_ && !(pairs_[k].c == c && pairs_[k].a == a)) ++k;
      if (k == n_pairs_) ++n_pairs_;
      pairs_[k] = row;
      (row.two_two ? need_alpha_14_ : need_alpha_2_) = true;
      if (row.two_two) need_alpha_12_ = true;
    }
    // Like-charged pairs, their theta and their triplets (the last matching row wins).
    for (std::size_t i = 0; i < n_; ++i) {
      for (std::size_t j = i + 1; j < n_; ++j) {
        if ((z_[i] > 0) != (z_[j] > 0)) continue;
        like_row L{i, j, std::abs(z_[i]), std::abs(z_[j]), {}, false, n_triplets_, n_triplets_, 0};
        for (const auto& t : set.thetas) {
          const auto p = slot(t.i), q = slot(t.j);
          if ((p == i && q == j) || (p == j && q == i)) {
            L.theta = *t.f;
            L.has_theta = true;
          }
        }
        for (std::size_t k = 0; k < n_; ++k) {
          if ((z_[k] > 0) == (z_[i] > 0)) continue;
          const data::t_function* found = nullptr;
          for (const auto& t : set.psis) {
            const auto p = slot(t.i), q = slot(t.j), r = slot(t.k);
            if (r == k && ((p == i && q == j) || (p == j && q == i))) found = t.f;
          }
          if (found) triplets_[n_triplets_++] = {k, *found};
        }
        L.psi_end = n_triplets_;
        if (L.zi != L.zj) {
          has_unsymmetrical_ = true;
          // The charge pairs of unequal charge (|z| of 1 and 2 with the ions known: one).
          const std::pair<int, int> zz{std::min(L.zi, L.zj), std::max(L.zi, L.zj)};
          std::size_t u = 0;
          while (u < n_unequal_ && unequal_charges_[u] != zz) ++u;
          if (u == n_unequal_) unequal_charges_[n_unequal_++] = zz;
          L.unequal = u;
        }
        like_[n_like_++] = L;
      }
    }
    aphi_ = set.aphi;
    // The rows of the analytic form (pairs not in the extended form, theta, psi) in the
    // order at() and linear_sums() read them, by row and by column.
    // C-phi enters as C = C-phi / (2 sqrt|z_c z_a|): its row is divided once here (exact
    // for 1:1 and 2:2 pairs, whose divisor is 2 or 4).
    const auto put = [this](const data::t_function& f, double divisor) {
      for (std::size_t k = 0; k < 6; ++k) {
        linear_rows_[n_linear_][k] = f.a[k] / divisor;
        linear_cols_[k][n_linear_] = f.a[k] / divisor;
      }
      ++n_linear_;
    };
    for (std::size_t k = 0; k < n_pairs_; ++k) {
      auto& row = pairs_[k];
      if (row.ext != nullptr) continue;
      row.p0 = n_linear_;
      put(row.beta0, 1.0);
      put(row.beta1, 1.0);
      if (row.two_two) put(row.beta2, 1.0);
      row.c_off = n_linear_ - row.p0;
      put(row.cphi, row.c_scale);
    }
    for (std::size_t k = 0; k < n_like_; ++k) {
      auto& L = like_[k];
      L.p0 = n_linear_;
      if (L.has_theta) put(L.theta, 1.0);
      L.psi_p0 = n_linear_;
      for (std::size_t t = L.psi_begin; t < L.psi_end; ++t) put(triplets_[t].psi, 1.0);
    }
    // The pairs in the extended form: four values each after the rows above.
    std::size_t next = n_linear_;
    for (std::size_t k = 0; k < n_pairs_; ++k) {
      auto& row = pairs_[k];
      if (row.ext == nullptr) continue;
      row.p0 = next;
      row.c_off = 2;
      next += 4;
    }
  }

  /// The coefficients at T from the cache of the last temperatures used (on a miss the
  /// least recently used slot is refilled).
  const coefficients& at(double T) {
    for (std::size_t k = 0; k < coef_.size(); ++k) {
      if (coef_[k].temperature == T) {
        coef_used_[k] = ++coef_clock_;
        return coef_[k];
      }
    }
    std::size_t oldest = 0;
    for (std::size_t k = 1; k < coef_.size(); ++k)
      if (coef_used_[k] < coef_used_[oldest]) oldest = k;
    coef_used_[oldest] = ++coef_clock_;
    coefficients& c = coef_[oldest];
    const t_basis basis(T);
    c.temperature = T;
    c.aphi = debye_huckel_osmotic_slope(T, aphi_);
    // Every row in the analytic form at once, with the arithmetic of t_basis::operator()
    // row by row (a loop over the rows, which the compiler vectorises).
    const auto& v = basis.v;
    for (std::size_t r = 0; r < n_linear_; ++r)
      c.P[r] = linear_cols_[0][r] + linear_cols_[1][r] * v[1] + linear_cols_[2][r] * v[2] +
               linear_cols_[3][r] * v[3] + linear_cols_[4][r] * v[4] + linear_cols_[5][r] * v[5];
    for (std::size_t k = 0; k < n_pairs_; ++k) {
      const auto& p = pairs_[k];
      if (p.ext == nullptr) continue;
      // Extended form (data::extended_binary): C0 is C already; beta2 unused.
      c.P[p.p0] = p.ext->beta0(T);
      c.P[p.p0 + 1] = p.ext->beta1(T);
      c.P[p.p0 + 2] = p.ext->c0(T);
      c.P[p.p0 + 3] = p.ext->c1(T);
    }
    return c;
  }

  /// The slopes of the coefficients of at(T), from a two-slot cache (the slot not used
  /// last is refilled).
  const coefficient_slopes& slopes_at(double T) {
    if (slopes_[0].temperature == T) {
      slopes_last_ = 0;
      return slopes_[0];
    }
    if (slopes_[1].temperature == T) {
      slopes_last_ = 1;
      return slopes_[1];
    }
    slopes_last_ ^= 1;
    coefficient_slopes& sl = slopes_[slopes_last_];
    const t_basis_slope d(T);
    sl.temperature = T;
    sl.aphi = debye_huckel_osmotic_slope_derivative(T, aphi_);
    for (std::size_t k = 0; k < n_pairs_; ++k) {
      const auto& p = pairs_[k];
      sl.beta0[k] = d(p.beta0);
      sl.beta1[k] = d(p.beta1);
      sl.beta2[k] = p.two_two ? d(p.beta2) : 0.0;
      sl.c[k] = d(p.cphi) / p.c_scale;
    }
    for (std::size_t k = 0; k < n_like_; ++k)
      sl.theta[k] = like_[k].has_theta ? d(like_[k].theta) : 0.0;
    for (std::size_t k = 0; k < n_triplets_; ++k) sl.psi[k] = d(triplets_[k].psi);
    return sl;
  }

  /// The range [lo, hi] of every analytic-form parameter (by its index in coefficients::P)
  /// over the bin [Ta, Tb] (ln_gamma_upper_bounds), from the cache of bins or filled now.
  void parameter_ranges(std::size_t b, double Ta, double Tb, const double*& lo, const double*& hi) {
    const std::size_t stride = 2 * max_linear_rows;
    if (bin_ranges_.empty()) {
      bin_ranges_.assign(bound_bins * stride, 0.0);
      bin_filled_.assign(bound_bins, 0);
    }
    double* r = bin_ranges_.data() + b * stride;
    lo = r;
    hi = r + max_linear_rows;
    if (bin_filled_[b]) return;
    // Each parameter P(T) = sum_k a_k v_k(T) at the bin's ends, and its distance from the
    // straight line between them, at most (Tb - Ta)^2 / 8 max|P''| (a C2 function on an
    // interval). Over the bin max|P''| <= max(|P''(Ta)|, |P''(Tb)|) + h max|P'''|, with P''
    // summed at the ends (v_k'' = 0, 2/T^3, -1/T^2, 0, 2, 6/T^4 for the basis 1,
    // 1/T - 1/T_r, ln(T/T_r), T - T_r, T^2 - T_r^2, 1/T^2 - 1/T_r^2) and
    // |P'''| <= sum_k |a_k| max|v_k'''| (v_k''' = 0, -6/T^4, 2/T^3, 0, 0, -24/T^5, each largest
    // in magnitude at Ta). P'' itself at the ends keeps the bound tight for rows whose basis
    // coefficients are large and cancel (the default set's sulfate rows, up to 1e11), where
    // sum_k |a_k| max|v_k''| is not. Widened by 1e-12 of the magnitudes summed for the
    // rounding of this and of at().
    const t_basis va(Ta), vb(Tb);
    const double h = Tb - Ta;
    const auto second = [](double T) {
      return std::array<double, 6>{0.0, 2.0 / (T * T * T), -1.0 / (T * T), 0.0, 2.0,
                                   6.0 / (T * T * T * T)};
    };
    const std::array<double, 6> d2a = second(Ta), d2b = second(Tb);
    const std::array<double, 6> d3 = {0.0, 6.0 / (Ta * Ta * Ta * Ta), 2.0 / (Ta * Ta * Ta), 0.0,
                                      0.0, 24.0 / (Ta * Ta * Ta * Ta * Ta)};
    for (std::size_t row = 0; row < n_linear_; ++row) {
      double pa = 0.0, pb = 0.0, size = 0.0, p2a = 0.0, p2b = 0.0, size2 = 0.0, third = 0.0;
      for (std::size_t k = 0; k < 6; ++k) {
        const double a = linear_cols_[k][row];
        pa += a * va.v[k];
        pb += a * vb.v[k];
        size += std::max(std::abs(a * va.v[k]), std::abs(a * vb.v[k]));
        p2a += a * d2a[k];
        p2b += a * d2b[k];
        size2 += std::max(std::abs(a * d2a[k]), std::abs(a * d2b[k]));
        third += std::abs(a) * d3[k];
      }
      const double curvature = std::max(std::abs(p2a), std::abs(p2b)) + 1e-12 * size2 + h * third;
      const double slack = h * h / 8.0 * curvature * (1.0 + 1e-12) + 1e-12 * size + 1e-300;
      r[row] = std::min(pa, pb) - slack;
      r[max_linear_rows + row] = std::max(pa, pb) + slack;
    }
    bin_filled_[b] = 1;
  }

  void check_slot(const char* where, std::size_t slot) const {
    if (slot >= n_)
      throw invalid_input(colligate::detail::describe(
          where, "slot", static_cast<double>(slot),
          "must be in [0, " + std::to_string(n_) + "), the ions present"));
  }

  /// The one evaluation of the sums in the file comment on slot molalities `m`: the
  /// osmotic sums into `r` always, ln gamma into `lng` (one per slot) when WithGamma. The
  /// osmotic part does the same arithmetic in both instantiations.
  /// With WithSlope, also d(osmotic_excess)/dT at fixed m into `d_osm_out` (the value
  /// arithmetic is unchanged).
  template <bool WithGamma, bool WithSlope = false>
  void sums(const double* m, double T, pitzer_osmotic_sums& r, double* lng,
            double* d_osm_out = nullptr) {
    composition_terms& q = composition_for(m);
    const double I = q.I, Z = q.Z, mt = q.mt;
    r.ionic_strength = I;
    r.total_molality = mt;
    if constexpr (WithGamma)
      for (std::size_t k = 0; k < n_; ++k) lng[k] = 0.0;
    if constexpr (WithSlope) *d_osm_out = 0.0;
    if (!(I > 0.0)) return;
    const auto& p = at(T);
    const double sI = q.sI;
    const double A = p.aphi;
    double osm = -A * I * sI / (1.0 + pitzer_b * sI);
    const coefficient_slopes* dp = nullptr;
    double d_osm = 0.0;
    if constexpr (WithSlope) {
      dp = &slopes_at(T);
      d_osm = -dp->aphi * I * sI / (1.0 + pitzer_b * sI);
    }
    // exp(-alpha sqrt I) for alpha = 2 (1:1, 2:1 pairs), 1.4 and 12 (2:2 pairs).
    const double e2 = q.e2, e14 = q.e14, e12 = q.e12;
    // ln gamma only: F without its pair sums, sum_c sum_a m_c m_a C^T, and g(x), g'(x)
    // at x = alpha sqrt I from the same exponentials.
    double F = 0.0, sum_mmC = 0.0;
    double g2 = 0.0, g14 = 0.0, g12 = 0.0, gp2 = 0.0, gp14 = 0.0, gp12 = 0.0;
    if constexpr (WithGamma) {
      gamma_terms(q);
      F = -A * q.f_dh;
      g2 = q.g2;
      g14 = q.g14;
      g12 = q.g12;
      gp2 = q.gp2;
      gp14 = q.gp14;
      gp12 = q.gp12;
    }
    for (std::size_t k = 0; k < n_pairs_; ++k) {
      const auto& row = pairs_[k];
      const double mc = m[row.c], ma = m[row.a];
      const double mm = mc * ma;
      if constexpr (WithGamma) {
        if (mc == 0.0 && ma == 0.0) continue;
      } else {
        if (mm == 0.0) continue;
      }
      // This pair's parameters at T (coefficients::P).
      const double* P = p.P.data() + row.p0;
      const double beta0 = P[0], beta1 = P[1], beta2v = row.two_two ? P[2] : 0.0;
      const double C0 = P[row.c_off], C1 = row.ext != nullptr ? P[row.c_off + 1] : 0.0;
      const bool beta2 = row.two_two && beta2v != 0.0;
      double Bphi = beta0 + beta1 * (row.alpha1 == 0 ? e2 : e14);
      if (beta2) Bphi += beta2v * e12;
      // C^T_phi = C0 + C1 exp(-omega sqrt I) for the extended form, else C.
      const bool extended = row.ext != nullptr && C1 != 0.0;
      const double ew = extended ? std::exp(-(row.ext->omega * sI)) : 0.0;
      const double CTphi = extended ? C0 + C1 * ew : C0;
      if (mm != 0.0) osm += mm * (Bphi + Z * CTphi);
      if constexpr (WithSlope) {
        double dBphi = dp->beta0[k] + dp->beta1[k] * (row.alpha1 == 0 ? e2 : e14);
        if (beta2) dBphi += dp->beta2[k] * e12;
        d_osm += mm * (dBphi + Z * dp->c[k]);
      }
      if constexpr (WithGamma) {
        double B = beta0 + beta1 * (row.alpha1 == 0 ? g2 : g14);
        double Bp = beta1 * (row.alpha1 == 0 ? gp2 : gp14);
        if (beta2) {
          B += beta2v * g12;
          Bp += beta2v * gp12;
        }
        Bp /= I;
        // C^T = C0 + 4 C1 h(w) and dC^T/dI = 2 C1 (e^-w - 4 h(w)) / I, w = omega sqrt I
        // (C^T_phi = C^T + I dC^T/dI / 2 because 4 h + x h' = e^-x).
        double CT = C0, CTp = 0.0;
        if (extended) {
          const double hw = pitzer_h(row.ext->omega * sI);
          CT = C0 + 4.0 * C1 * hw;
          CTp = 2.0 * C1 * (ew - 4.0 * hw) / I;
        }
        if (mm != 0.0) {
          F += mm * (Bp + 0.5 * Z * CTp);
          sum_mmC += mm * CT;
        }
        const double w = 2.0 * B + Z * CT;
        lng[row.c] += ma * w;
        lng[row.a] += mc * w;
      }
    }
    // J(x) and J'(x) at x = 6 z z' A_phi sqrt I for the charge products 1, 2 and 4
    // (ions of charges 1 and 2 mixed: all three at once, fill_j).
    j_values jv;
    const double s6 = 6.0 * A * sI;
    fill_j<WithSlope>(s6, jv);
    const auto& J = jv.J;
    const auto& dJ = jv.dJ;
    const auto& x = jv.x;
    const auto j_of = [&](int zz) { ensure_j<WithSlope>(s6, zz, jv); };
    // d(x J'(x))/dT = (x J' + x^2 J'') (dA_phi/dT) / A_phi, x proportional to A_phi.
    const auto dxdJ_dT = [&](int zz) { return jv.dxdJ_dT(zz, dp->aphi / A); };
    for (std::size_t k = 0; k < n_like_; ++k) {
      const auto& L = like_[k];
      const double mi = m[L.i], mj = m[L.j];
      const double mm = mi * mj;
      if constexpr (WithGamma) {
        if (mi == 0.0 && mj == 0.0) continue;
      } else {
        if (mm == 0.0) continue;
      }
      const double theta = L.has_theta ? p.P[L.p0] : 0.0;
      const double* psi = p.P.data() + L.psi_p0;  // psi[t - L.psi_begin]
      double phiphi = theta, et = 0.0, etp = 0.0;
      double d_phiphi = 0.0;
      if constexpr (WithSlope) d_phiphi = dp->theta[k];
      if (L.zi != L.zj) {
        // E-theta, E-theta' (Pitzer 1975, eqs. 23-24).
        const int ij = L.zi * L.zj, ii = L.zi * L.zi, jj = L.zj * L.zj;
        j_of(ij);
        j_of(ii);
        j_of(jj);
        e_theta(static_cast<double>(ij), I, J[ij], J[ii], J[jj], x[ij] * dJ[ij], x[ii] * dJ[ii],
                x[jj] * dJ[jj], et, etp);
        phiphi = theta + et + I * etp;
        if constexpr (WithSlope)  // E-theta + I E-theta' = zz / (8 I) [x J']_ij - ...
          d_phiphi += ij / (8.0 * I) * (dxdJ_dT(ij) - 0.5 * dxdJ_dT(ii) - 0.5 * dxdJ_dT(jj));
      }
      double psum = 0.0;
      for (std::size_t t = L.psi_begin; t < L.psi_end; ++t)
        psum += m[triplets_[t].k] * psi[t - L.psi_begin];
      if (mm != 0.0) osm += mm * (phiphi + psum);
      if constexpr (WithSlope) {
        double dpsum = 0.0;
        for (std::size_t t = L.psi_begin; t < L.psi_end; ++t)
          dpsum += m[triplets_[t].k] * dp->psi[t];
        d_osm += mm * (d_phiphi + dpsum);
      }
      if constexpr (WithGamma) {
        // Phi = theta + E-theta, Phi' = E-theta'.
        if (mm != 0.0) {
          F += mm * etp;
          for (std::size_t t = L.psi_begin; t < L.psi_end; ++t)
            lng[triplets_[t].k] += mm * psi[t - L.psi_begin];
        }
        const double w = 2.0 * (theta + et) + psum;
        lng[L.i] += mj * w;
        lng[L.j] += mi * w;
      }
    }
    r.osmotic_excess = 2.0 * osm;
    if constexpr (WithSlope) *d_osm_out = 2.0 * d_osm;
    if constexpr (WithGamma)
      for (std::size_t k = 0; k < n_; ++k)
        lng[k] += z_[k] * z_[k] * F + std::abs(z_[k]) * sum_mmC;
  }

  std::size_t n_ = 0;
  std::array<int, n_ions> z_{};
  std::array<std::size_t, n_ions> global_{};   ///< slot -> index in data::pitzer_ions
  std::array<std::size_t, n_ions> slot_of_{};  ///< index in data::pitzer_ions -> slot, n_ if absent
  std::vector<term> terms_;
  std::array<pair_row, max_pairs> pairs_{};
  std::size_t n_pairs_ = 0;
  std::array<like_row, max_like> like_{};
  std::size_t n_like_ = 0;
  std::array<triplet_row, max_triplets> triplets_{};
  std::size_t n_triplets_ = 0;
  bool need_alpha_2_ = false, need_alpha_14_ = false, need_alpha_12_ = false;
  bool has_extended_ = false;  ///< a pair row in the extended form (no closed-form T slope)
  bool has_unsymmetrical_ = false;  ///< like-charged ions of charges 1 and 2 (E-theta)
  data::aphi_correlation aphi_ = data::aphi_correlation::clegg_rard_pitzer_1994;
  /// The last three temperatures (NaN: empty). Three, not two: a brine's freezing point
  /// evaluates the ice point (the same for every row), an iterate and then the salt
  /// saturation at the result (equilibria/ice_curve.hpp); with two slots the last two
  /// pushed the ice point out and every row recomputed it.
  std::array<coefficients, 3> coef_;
  std::array<std::uint64_t, 3> coef_used_{};  ///< when each slot was last used (coef_clock_)
  std::uint64_t coef_clock_ = 0;
  std::array<coefficient_slopes, 2> slopes_;  ///< the last two temperatures (NaN: empty)
  unsigned slopes_last_ = 0;  ///< slot used last
  /// The analytic-form rows (a_0..a_5) of every pair (not in the extended form), theta and
  /// psi parameter, in the order of at() and linear_sums(): by row and by column (entries
  /// from n_linear_ on are never read, so they are left unset).
  std::array<std::array<double, 6>, max_linear_rows> linear_rows_;
  std::array<std::array<double, max_linear_rows>, 6> linear_cols_;
  std::size_t n_linear_ = 0;
  /// The distinct charge pairs (|z_i| < |z_j|) of the like pairs of unequal charge.
  std::array<std::pair<int, int>, max_unequal> unequal_charges_{};
  std::size_t n_unequal_ = 0;
  composition_terms comp_;
  /// J values of the last ln_water_activity_along_temperature with unsymmetrical mixing
  /// (j_near_last), at x = zz last_j_s6_; NaN: none yet.
  j_values last_j_;
  double last_j_s6_ = std::numeric_limits<double>::quiet_NaN();
  /// Parameter ranges per bin of ln_gamma_upper_bounds (lo then hi, max_linear_rows each),
  /// allocated at its first use and filled bin by bin; bin_filled_ says which bins hold them.
  std::vector<double> bin_ranges_;
  std::vector<unsigned char> bin_filled_;
  std::array<temperature_terms, 2> tt_;
  unsigned tt_last_ = 0;
};

}  // namespace colligate::models::detail
