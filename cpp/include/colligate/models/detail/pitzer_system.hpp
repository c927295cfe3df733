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
/// (data::t_function), one logarithm in all. Work done once per evaluation: one
/// exponential per distinct alpha (2, 1.4, 12) and one J(x) per distinct charge product
/// (1, 2, 4) of the unsymmetrical mixing terms (the three J at once, on interleaved
/// recurrences and from one power, when ions of charges 1 and 2 are mixed). The temperature
/// slope of ln a_w (ln_water_activity_with_temperature_slope, for the freezing-point
/// Newton) adds the slopes
/// of A_phi and of the same parameters, once per temperature, and J''(x) on the same
/// recurrences.
///
/// The object caches the coefficients of the last three temperatures evaluated (and their
/// slopes of the last two): a freezing-point solve evaluates the ice point and then the
/// iterates, and a brine's salt-saturation test one more temperature, so the next row of a
/// batch finds the ice point's coefficients still there. It is therefore not
/// meant to be shared between threads: each solve or batch thread owns its own.

#include <array>
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <limits>
#include <string>
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
  void molalities(const double* moles, double water_kg, double* m, double& other) const {
    for (std::size_t k = 0; k < n_; ++k) m[k] = 0.0;
    other = 0.0;
    for (const auto& t : terms_) {
      const double mi = moles[t.species] / water_kg;
      if (t.slot < n_)
        m[t.slot] += t.count * mi;
      else
        other += t.count * mi;
    }
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
  };
  struct like_row {
    std::size_t i, j;
    int zi, zj;  ///< |charges|
    data::t_function theta;
    bool has_theta;
    std::size_t psi_begin, psi_end;  ///< into triplets_
  };
  struct triplet_row {
    std::size_t k;
    data::t_function psi;
  };
  struct coefficients {
    double temperature = std::numeric_limits<double>::quiet_NaN();
    double aphi = 0.0;
    std::array<double, max_pairs> beta0{}, beta1{}, beta2{}, c{}, c1{};
    std::array<double, max_like> theta{};
    std::array<double, max_triplets> psi{};
  };
  /// d/dT of the coefficients (pairs in the analytic form only), at `temperature`.
  struct coefficient_slopes {
    double temperature = std::numeric_limits<double>::quiet_NaN();
    double aphi = 0.0;
    std::array<double, max_pairs> beta0{}, beta1{}, beta2{}, c{};
    std::array<double, max_like> theta{};
    std::array<double, max_triplets> psi{};
  };

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
        like_row L{i, j, std::abs(z_[i]), std::abs(z_[j]), {}, false, n_triplets_, n_triplets_};
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
        if (L.zi != L.zj) has_unsymmetrical_ = true;
        like_[n_like_++] = L;
      }
    }
    aphi_ = set.aphi;
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
    for (std::size_t k = 0; k < n_pairs_; ++k) {
      const auto& p = pairs_[k];
      if (p.ext != nullptr) {
        // Extended form (data::extended_binary): C0 is C already; beta2 unused.
        c.beta0[k] = p.ext->beta0(T);
        c.beta1[k] = p.ext->beta1(T);
        c.beta2[k] = 0.0;
        c.c[k] = p.ext->c0(T);
        c.c1[k] = p.ext->c1(T);
        continue;
      }
      c.beta0[k] = basis(p.beta0);
      c.beta1[k] = basis(p.beta1);
      c.beta2[k] = p.two_two ? basis(p.beta2) : 0.0;
      c.c[k] = basis(p.cphi) / p.c_scale;
    }
    for (std::size_t k = 0; k < n_like_; ++k)
      c.theta[k] = like_[k].has_theta ? basis(like_[k].theta) : 0.0;
    for (std::size_t k = 0; k < n_triplets_; ++k) c.psi[k] = basis(triplets_[k].psi);
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
    double I = 0.0, Z = 0.0, mt = 0.0;
    for (std::size_t k = 0; k < n_; ++k) {
      I += 0.5 * m[k] * z_[k] * z_[k];
      Z += m[k] * std::abs(z_[k]);
      mt += m[k];
    }
    r.ionic_strength = I;
    r.total_molality = mt;
    if constexpr (WithGamma)
      for (std::size_t k = 0; k < n_; ++k) lng[k] = 0.0;
    if constexpr (WithSlope) *d_osm_out = 0.0;
    if (!(I > 0.0)) return;
    const auto& p = at(T);
    const double sI = std::sqrt(I);
    const double A = p.aphi;
    double osm = -A * I * sI / (1.0 + pitzer_b * sI);
    const coefficient_slopes* dp = nullptr;
    double d_osm = 0.0;
    if constexpr (WithSlope) {
      dp = &slopes_at(T);
      d_osm = -dp->aphi * I * sI / (1.0 + pitzer_b * sI);
    }
    // exp(-alpha sqrt I) for alpha = 2 (1:1, 2:1 pairs), 1.4 and 12 (2:2 pairs).
    const double e2 = need_alpha_2_ ? std::exp(-2.0 * sI) : 0.0;
    const double e14 = need_alpha_14_ ? std::exp(-1.4 * sI) : 0.0;
    const double e12 = need_alpha_12_ ? std::exp(-12.0 * sI) : 0.0;
    // ln gamma only: F without its pair sums, sum_c sum_a m_c m_a C^T, and g(x), g'(x)
    // at x = alpha sqrt I from the same exponentials.
    double F = 0.0, sum_mmC = 0.0;
    double g2 = 0.0, g14 = 0.0, g12 = 0.0, gp2 = 0.0, gp14 = 0.0, gp12 = 0.0;
    if constexpr (WithGamma) {
      F = -A * (sI / (1.0 + pitzer_b * sI) + 2.0 / pitzer_b * std::log1p(pitzer_b * sI));
      if (need_alpha_2_) {
        g2 = pitzer_g(2.0 * sI, e2);
        gp2 = pitzer_gp(2.0 * sI, e2);
      }
      if (need_alpha_14_) {
        g14 = pitzer_g(1.4 * sI, e14);
        gp14 = pitzer_gp(1.4 * sI, e14);
      }
      if (need_alpha_12_) {
        g12 = pitzer_g(12.0 * sI, e12);
        gp12 = pitzer_gp(12.0 * sI, e12);
      }
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
      const bool beta2 = row.two_two && p.beta2[k] != 0.0;
      double Bphi = p.beta0[k] + p.beta1[k] * (row.alpha1 == 0 ? e2 : e14);
      if (beta2) Bphi += p.beta2[k] * e12;
      // C^T_phi = C0 + C1 exp(-omega sqrt I) for the extended form, else C.
      const bool extended = row.ext != nullptr && p.c1[k] != 0.0;
      const double ew = extended ? std::exp(-(row.ext->omega * sI)) : 0.0;
      const double CTphi = extended ? p.c[k] + p.c1[k] * ew : p.c[k];
      if (mm != 0.0) osm += mm * (Bphi + Z * CTphi);
      if constexpr (WithSlope) {
        double dBphi = dp->beta0[k] + dp->beta1[k] * (row.alpha1 == 0 ? e2 : e14);
        if (beta2) dBphi += dp->beta2[k] * e12;
        d_osm += mm * (dBphi + Z * dp->c[k]);
      }
      if constexpr (WithGamma) {
        double B = p.beta0[k] + p.beta1[k] * (row.alpha1 == 0 ? g2 : g14);
        double Bp = p.beta1[k] * (row.alpha1 == 0 ? gp2 : gp14);
        if (beta2) {
          B += p.beta2[k] * g12;
          Bp += p.beta2[k] * gp12;
        }
        Bp /= I;
        // C^T = C0 + 4 C1 h(w) and dC^T/dI = 2 C1 (e^-w - 4 h(w)) / I, w = omega sqrt I
        // (C^T_phi = C^T + I dC^T/dI / 2 because 4 h + x h' = e^-x).
        double CT = p.c[k], CTp = 0.0;
        if (extended) {
          const double hw = pitzer_h(row.ext->omega * sI);
          CT = p.c[k] + 4.0 * p.c1[k] * hw;
          CTp = 2.0 * p.c1[k] * (ew - 4.0 * hw) / I;
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
    // J(x) and J'(x) at x = 6 z z' A_phi sqrt I for the charge products 1, 2 and 4.
    std::array<double, 5> J{}, dJ{}, x{}, d2J{};
    std::array<bool, 5> have{};
    const double s6 = 6.0 * A * sI;
    const auto j_of = [&](int zz) {
      if (!have[zz]) {
        x[zz] = s6 * zz;
        mixing_j(x[zz], J[zz], dJ[zz], WithSlope ? &d2J[zz] : nullptr);
        have[zz] = true;
      }
    };
    if (has_unsymmetrical_) {
      // Ions of charges 1 and 2 mixed: J at the charge products 1, 2 and 4, all at once
      // (one power for the three arguments, mixing_j124).
      double Js[3], dJs[3], d2Js[3];
      mixing_j124(s6, Js, dJs, WithSlope ? d2Js : nullptr);
      for (int c = 0; c < 3; ++c) {
        const int zz = 1 << c;
        x[zz] = s6 * zz;
        J[zz] = Js[c];
        dJ[zz] = dJs[c];
        if constexpr (WithSlope) d2J[zz] = d2Js[c];
        have[zz] = true;
      }
    }
    // d(x J'(x))/dT = (x J' + x^2 J'') (dA_phi/dT) / A_phi, x proportional to A_phi.
    const auto dxdJ_dT = [&](int zz) {
      return (x[zz] * dJ[zz] + x[zz] * x[zz] * d2J[zz]) * (dp->aphi / A);
    };
    for (std::size_t k = 0; k < n_like_; ++k) {
      const auto& L = like_[k];
      const double mi = m[L.i], mj = m[L.j];
      const double mm = mi * mj;
      if constexpr (WithGamma) {
        if (mi == 0.0 && mj == 0.0) continue;
      } else {
        if (mm == 0.0) continue;
      }
      double phiphi = p.theta[k], et = 0.0, etp = 0.0;
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
        phiphi = p.theta[k] + et + I * etp;
        if constexpr (WithSlope)  // E-theta + I E-theta' = zz / (8 I) [x J']_ij - ...
          d_phiphi += ij / (8.0 * I) * (dxdJ_dT(ij) - 0.5 * dxdJ_dT(ii) - 0.5 * dxdJ_dT(jj));
      }
      double psum = 0.0;
      for (std::size_t t = L.psi_begin; t < L.psi_end; ++t) psum += m[triplets_[t].k] * p.psi[t];
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
            lng[triplets_[t].k] += mm * p.psi[t];
        }
        const double w = 2.0 * (p.theta[k] + et) + psum;
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
};

}  // namespace colligate::models::detail
