#pragma once
/// \file dissolved_solutes.hpp
/// Sensible heat of the solutes dissolved in a food's water, from each solute's own
/// apparent specific heat (data/dissolved_heat_capacity.hpp) instead of the Choi & Okos
/// (1986) polynomial of its proximate component.
///
/// The composition says how much of the food is ash or carbohydrate; the water phase says
/// what is dissolved in the water. Per kg of food, solute i dissolved in x_w kg of water
/// weighs m_i = x_w (solute mass / water mass of the phase); an electrolyte belongs to ash,
/// any other solute to carbohydrate. For a solute whose record carries an apparent
/// specific heat c_i, the food's heat capacity changes by
///
///     s_c m_i [c_i(T, w_s) - c_component(T)]
///
/// where s_c = min(1, x_c / sum of m_i in component c) keeps the replaced mass within what
/// the composition holds (a composition without ash replaces nothing). w_s is the mass
/// fraction of all solutes in the unfrozen water phase. Limitation, named: below the
/// freezing point the liquid concentrates as ice forms, but c_i is taken at the unfrozen
/// concentration.
/// Solutes without an apparent specific heat (sugars, polyols, most acids) keep their
/// component's value.

#include <array>
#include <cmath>
#include <vector>

#include "colligate/core/solution.hpp"
#include "colligate/data/dissolved_heat_capacity.hpp"
#include "colligate/thermal/components.hpp"

namespace colligate::thermal {

/// The dissolved solutes of a food that carry their own apparent specific heat, per kg of
/// food, ready to add their sensible heat (see the file comment).
class dissolved_solute_heat {
 public:
  dissolved_solute_heat(const food_composition& x, const solution& water_phase) {
    const double W = water_phase.water_mass();
    const double total = water_phase.total_mass();
    const double w_s = total > 0.0 ? water_phase.total_solute_mass() / total : 0.0;
    solute_fraction_ = std::isfinite(w_s) ? w_s : 1.0;  // held at each fit's highest fraction
    double ash = 0.0, carbohydrate = 0.0;
    for (std::size_t i = 0; i < water_phase.size(); ++i) {
      const auto& r = water_phase.species()[i];
      if (!r.heat_capacity.available || !(W > 0.0)) continue;
      const bool salt = r.kind == data::solute_class::electrolyte;
      const double m = x.water * water_phase.solute_mass(i) / W;
      if (!(m > 0.0) || !std::isfinite(m)) continue;  // absurd phases keep the component value
      (salt ? ash : carbohydrate) += m;
      entries_.push_back({r.heat_capacity, m, salt ? component::ash : component::carbohydrate});
    }
    const double s_ash = ash > x.ash ? x.ash / ash : 1.0;
    const double s_carbohydrate = carbohydrate > x.carbohydrate ? x.carbohydrate / carbohydrate : 1.0;
    for (auto& e : entries_) e.mass *= e.replaces == component::ash ? s_ash : s_carbohydrate;
  }

  bool empty() const noexcept { return entries_.empty(); }

  /// Change of the food's heat capacity at T, J/(kg K) of food.
  double specific_heat(double temperature) const {
    double c = 0.0;
    for (const auto& e : entries_)
      c += e.mass * (data::apparent_specific_heat(e.heat_capacity, temperature, solute_fraction_) -
                     thermal::specific_heat(e.replaces, temperature));
    return c;
  }

  /// Change of the food's sensible heat from t1 to t2 (K), J/kg of food.
  double sensible_enthalpy(double t1, double t2) const {
    double h = 0.0;
    for (const auto& e : entries_)
      h += e.mass * (integral(e.heat_capacity, t1, t2) - thermal::sensible_enthalpy(e.replaces, t1, t2));
    return h;
  }

 private:
  struct entry {
    data::dissolved_heat_capacity heat_capacity;
    double mass;  // kg per kg of food
    component replaces;
  };

  /// Integral of the apparent specific heat from t1 to t2, J/kg: constant outside the
  /// correlation's temperature range, 4-point Gauss-Legendre on panels of at most 5 K
  /// inside it (the integrand is smooth; error below 1e-9 relative).
  double integral(const data::dissolved_heat_capacity& c, double t1, double t2) const {
    const double sign = t2 >= t1 ? 1.0 : -1.0;
    const double lo = std::min(t1, t2), hi = std::max(t1, t2);
    auto cp = [&](double T) { return data::apparent_specific_heat(c, T, solute_fraction_); };
    double sum = 0.0;
    const double below = std::min(hi, c.min_temperature) - lo;
    if (below > 0.0) sum += below * cp(c.min_temperature);
    const double above = hi - std::max(lo, c.max_temperature);
    if (above > 0.0) sum += above * cp(c.max_temperature);
    const double a = std::max(lo, c.min_temperature), b = std::min(hi, c.max_temperature);
    if (b > a) {
      static constexpr std::array<double, 4> x = {-0.8611363115940526, -0.3399810435848563,
                                                  0.3399810435848563, 0.8611363115940526};
      static constexpr std::array<double, 4> w = {0.3478548451374538, 0.6521451548625461,
                                                  0.6521451548625461, 0.3478548451374538};
      const int panels = static_cast<int>(std::ceil((b - a) / 5.0));
      const double h = (b - a) / panels;
      for (int k = 0; k < panels; ++k) {
        const double mid = a + (k + 0.5) * h;
        for (std::size_t j = 0; j < x.size(); ++j) sum += 0.5 * h * w[j] * cp(mid + 0.5 * h * x[j]);
      }
    }
    return sign * sum;
  }

  std::vector<entry> entries_;
  double solute_fraction_ = 0.0;
};

}  // namespace colligate::thermal
