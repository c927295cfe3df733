// Bindings for storage stability: glass transition of an aqueous phase, the maximally
// freeze-concentrated state (Tg', Cg') and the curves of the state diagram. Thin: convert,
// release the GIL for the curve loops, call the core. No physics here.
#include <pybind11/numpy.h>
#include <pybind11/pybind11.h>
#include <pybind11/eigen.h>
#include <pybind11/stl.h>

#include <cmath>
#include <limits>
#include <optional>
#include <string>
#include <tuple>

#include "colligate/core/bound_water.hpp"
#include "colligate/data/glass_transition_data.hpp"
#include "colligate/data/water_activity_limits.hpp"
#include "colligate/equilibria/moisture_equilibrium.hpp"
#include "colligate/equilibria/state_diagram.hpp"
#include "colligate/equilibria/sugar_crystallisation.hpp"
#include "colligate/fit/sorption_fitter.hpp"
#include "register.hpp"

namespace colligate_bindings {

namespace {

namespace eq = colligate::equilibria;

py::dict as_dict(const eq::glass_transition_result& r) {
  py::dict d;
  d["temperature"] = r.temperature;
  d["counted"] = r.counted;
  d["lacking"] = r.lacking;
  d["counted_solute_mass_fraction"] = r.counted_solute_mass_fraction;
  return d;
}

eq::sorption_isotherm make_isotherm(const std::string& model, double p1, double p2, double p3, double T,
                                   double aw_min, double aw_max) {
  eq::sorption_isotherm iso{eq::isotherm_model_from_string(model), p1, p2, p3, T, aw_min, aw_max};
  iso.validate();
  return iso;
}

py::dict supersaturation_dict(const eq::sugar_supersaturation& r) {
  py::dict d;
  d["solute"] = r.solute_id;
  d["temperature"] = r.temperature;
  d["concentration"] = r.concentration;
  d["solubility"] = r.solubility;
  d["ratio"] = r.ratio;
  d["glassy"] = r.glassy;
  d["crystallisation_possible"] = r.crystallisation_possible;
  d["reason"] = r.check.reason();
  return d;
}

}  // namespace

void register_storage(py::module_& m) {
  m.def(
      "glass_transition_table",
      [] {
        py::list out;
        for (const auto& r : colligate::data::glass_transition_table()) {
          py::dict d;
          d["solute"] = r.solute_id;
          d["glass_transition_temperature"] = r.temperature;
          d["gordon_taylor_k"] = r.gordon_taylor_k;
          d["heat_capacity_step"] = r.heat_capacity_step;
          d["source"] = r.source;
          d["heat_capacity_source"] = r.heat_capacity_source;
          d["note"] = r.note;
          out.append(d);
        }
        return out;
      },
      "The built-in glass-transition constants: Tg of the anhydrous solute (K), Gordon-Taylor "
      "k with water, Delta Cp at Tg (J/(kg K), 0 if not known), source keys and notes.");
  m.def("water_glass_transition_temperature",
        [] { return colligate::data::water_glass_transition_temperature; },
        "Glass transition temperature of amorphous water used by the glass curves, K.");
  m.def(
      "glass_transition",
      [](const colligate::solution& s, std::optional<double> water_kg, const std::string& rule) {
        return as_dict(eq::glass_transition(s, water_kg ? *water_kg : s.water_mass(),
                                            eq::glass_rule_from_string(rule)));
      },
      py::arg("solution"), py::arg("water_kg") = py::none(), py::arg("rule") = "gordon_taylor",
      "Glass transition of water_kg of water (default None: all the solution's water) with the "
      "solution's solutes: dict with temperature (K), counted and lacking solute ids and "
      "counted_solute_mass_fraction. Raises ValueError naming the solutes if none has data.");
  m.def(
      "maximal_freeze_concentration",
      [](const colligate::solution& s, const std::string& model, double bound_fraction,
         const std::string& rule) {
        const auto r = eq::maximal_freeze_concentration_of(
            s, colligate::models::model_choice(model),
            colligate::bound_water_kg(s, bound_fraction, "state_diagram"),
            eq::glass_rule_from_string(rule));
        py::dict d;
        d["tg_prime"] = r.tg_prime;
        d["cg_prime"] = r.cg_prime;
        d["unfrozen_water_per_solids"] = r.unfrozen_water_per_solids;
        d["ice_fraction"] = r.ice_fraction;
        d["status"] = std::string(eq::to_string(r.status));
        d["rule"] = std::string(eq::to_string(r.rule));
        d["counted"] = r.counted;
        d["lacking"] = r.lacking;
        d["reason"] = r.check.reason();
        return d;
      },
      py::arg("solution"), py::arg("model") = "auto", py::arg("bound_water_fraction_of_water") = 0.0,
      py::arg("rule") = "gordon_taylor",
      "Tg' (K) and Cg' (solute mass fraction) where the unfrozen phase on the ice curve meets "
      "its glass curve, with Wg' (kg unfrozen water per kg solutes), the ice fraction there, "
      "the solve status and the ice curve's validity reason ('' when in range).");
  m.def(
      "glass_curve",
      [](const colligate::solution& s, const array_in& fractions, const std::string& rule) {
        const auto r = eq::glass_rule_from_string(rule);
        py::array_t<double> out(fractions.request().shape);
        const double* f = fractions.data();
        double* o = out.mutable_data();
        const auto n = static_cast<std::size_t>(fractions.size());
        for (std::size_t i = 0; i < n; ++i) o[i] = eq::glass_curve_point(s, f[i], r).temperature;
        return out;
      },
      py::arg("solution"), py::arg("solute_mass_fraction"), py::arg("rule") = "gordon_taylor",
      "Tg (K) of the solution's solutes, in their proportions, at each total solute mass "
      "fraction in (0, 1].");
  m.def(
      "liquidus_curve",
      [](const colligate::solution& s, const array_in& fractions, const std::string& model) {
        py::array_t<double> out(fractions.request().shape);
        const double* f = fractions.data();
        double* o = out.mutable_data();
        const auto n = static_cast<std::size_t>(fractions.size());
        const colligate::models::model_choice mc(model);
        std::string first_reason;
        std::size_t count = 0;
        for (std::size_t i = 0; i < n; ++i) {
          const auto r = eq::liquidus_point(s, f[i], mc);
          o[i] = r.success() ? r.temperature : std::numeric_limits<double>::quiet_NaN();
          if (!r.check.in_range() && count++ == 0) first_reason = r.check.reason();
        }
        return std::make_tuple(out, first_reason, count);
      },
      py::arg("solution"), py::arg("solute_mass_fraction"), py::arg("model") = "auto",
      "Freezing point (K; NaN where none above the search limit) of the solution's solutes, "
      "in their proportions, at each total solute mass fraction in (0, 1): (values, first "
      "reason, count out of range).");

  // Sugar solubility and crystallisation.
  m.def(
      "sugar_solubility",
      [](const std::string& solute, double T) {
        const auto r = eq::sugar_solubility(solute, T);
        return std::make_tuple(r.mass_fraction, r.kg_per_kg_water, r.solid_phase, r.check.reason());
      },
      py::arg("solute"), py::arg("temperature"),
      "Solubility of a sugar (sucrose, lactose: final; glucose: stable phase) at T (K): "
      "(mass fraction of the saturated solution, kg per kg water, solid phase, reason).");
  m.def(
      "lactose_initial_solubility",
      [](double T) {
        const auto r = eq::lactose_initial_solubility(T);
        return std::make_tuple(r.mass_fraction, r.kg_per_kg_water, r.solid_phase, r.check.reason());
      },
      py::arg("temperature"), "Initial solubility of alpha-lactose at T (K), as sugar_solubility.");
  m.def("lactose_mutarotation_ratio", &colligate::data::lactose_mutarotation_ratio, py::arg("temperature"),
        "Equilibrium beta/alpha ratio of lactose in solution at T (K).");
  m.def(
      "sugar_solubility_curves",
      [] {
        py::list out;
        for (const auto& rec : colligate::data::sugar_solubility_curves())
          for (const auto& b : rec.branches) {
            py::dict d;
            d["solute"] = rec.solute_id;
            d["solid_phase"] = b.solid_phase;
            d["a"] = b.a;
            d["b"] = b.b;
            d["c"] = b.c;
            d["temperature_min"] = b.t_min;
            d["temperature_max"] = b.t_max;
            d["source"] = b.source;
            d["note"] = b.note;
            out.append(d);
          }
        return out;
      },
      "The sugar solubility curves: ln S = a + b/T + c ln T (S kg per kg water, T in K), the "
      "data range (K), source keys and notes.");
  m.def(
      "crystallisation_check",
      [](const colligate::solution& s, const std::vector<double>& temperatures, const std::string& model,
         double bound_fraction) {
        eq::crystallisation_check cc(s, colligate::models::model_choice(model),
                                     colligate::bound_water_kg(s, bound_fraction, "crystallisation_check"));
        py::dict d;
        d["sugars"] = cc.sugars();
        d["tg_prime"] = cc.glass().success() ? cc.glass().tg_prime : std::numeric_limits<double>::quiet_NaN();
        py::list at;
        for (double T : temperatures)
          for (const auto& r : cc.at(T)) at.append(supersaturation_dict(r));
        d["states"] = at;
        py::dict ranges;
        for (const auto& id : cc.sugars()) {
          py::list iv;
          for (const auto& r : cc.crystallisation_range(id)) iv.append(py::make_tuple(r.low, r.high));
          ranges[py::str(id)] = iv;
        }
        d["ranges"] = ranges;
        return d;
      },
      py::arg("solution"), py::arg("temperatures"), py::arg("model") = "auto",
      py::arg("bound_water_fraction_of_water") = 0.0,
      "Supersaturation of each sugar with a solubility curve in the unfrozen phase at each "
      "temperature (K), Tg' (K, NaN if unknown) and the temperature intervals (K) where each "
      "can crystallise (supersaturated and above Tg').");

  // Sorption isotherms.
  m.def(
      "isotherm_moisture",
      [](const std::string& model, double p1, double p2, double p3, const array_in& aw) {
        const auto iso = make_isotherm(model, p1, p2, p3, 298.15, NAN, NAN);
        py::array_t<double> out(aw.request().shape);
        const double* a = aw.data();
        double* o = out.mutable_data();
        for (py::ssize_t i = 0; i < aw.size(); ++i) o[i] = iso.moisture(a[i]);
        return out;
      },
      py::arg("model"), py::arg("p1"), py::arg("p2"), py::arg("p3"), py::arg("water_activity"),
      "Equilibrium moisture (kg water per kg dry solids) at each water activity in (0, 1).");
  m.def(
      "isotherm_water_activity",
      [](const std::string& model, double p1, double p2, double p3, const array_in& x) {
        const auto iso = make_isotherm(model, p1, p2, p3, 298.15, NAN, NAN);
        py::array_t<double> out(x.request().shape);
        const double* xi = x.data();
        double* o = out.mutable_data();
        for (py::ssize_t i = 0; i < x.size(); ++i) o[i] = iso.water_activity(xi[i]);
        return out;
      },
      py::arg("model"), py::arg("p1"), py::arg("p2"), py::arg("p3"), py::arg("moisture"),
      "Water activity at each moisture (kg water per kg dry solids, > 0).");
  m.def(
      "isotherm_range_reason",
      [](const std::string& model, double p1, double p2, double p3, double aw_min, double aw_max,
         const array_in& aw) {
        const auto iso = make_isotherm(model, p1, p2, p3, 298.15, aw_min, aw_max);
        std::string first;
        std::size_t count = 0;
        const double* a = aw.data();
        for (py::ssize_t i = 0; i < aw.size(); ++i) {
          const auto v = iso.check(a[i]);
          if (!v.in_range() && count++ == 0) first = v.reason();
        }
        return std::make_tuple(first, count);
      },
      py::arg("model"), py::arg("p1"), py::arg("p2"), py::arg("p3"), py::arg("aw_min"), py::arg("aw_max"),
      py::arg("water_activity"),
      "(first reason, count) of the water activities outside the isotherm's data range.");
  m.def(
      "fit_isotherm",
      [](const std::string& model, const Eigen::VectorXd& aw, const Eigen::VectorXd& x,
         const std::optional<Eigen::VectorXd>& w) {
        const auto mdl = eq::isotherm_model_from_string(model);
        py::gil_scoped_release release;
        return colligate::fit::fit_isotherm(mdl, aw, x, w ? *w : Eigen::VectorXd());
      },
      py::arg("model"), py::arg("water_activity"), py::arg("moisture"), py::arg("weights") = py::none(),
      "Fit a 'gab', 'bet' or 'oswin' isotherm to (a_w, moisture kg/kg dry solids) data.");
  m.def(
      "moisture_equilibrium",
      [](const std::vector<std::tuple<std::string, double, double, double, double, double>>& parts) {
        std::vector<eq::moisture_part> ps;
        for (const auto& [model, p1, p2, p3, dry, x] : parts)
          ps.push_back({make_isotherm(model, p1, p2, p3, 298.15, NAN, NAN), dry, x});
        const auto r = eq::moisture_equilibrium(ps);
        py::dict d;
        d["water_activity"] = r.water_activity;
        d["moisture"] = r.moisture;
        d["water_gained"] = r.water_gained;
        d["initial_water_activity"] = r.initial_water_activity;
        d["converged"] = r.converged;
        d["salwin_slawson_water_activity"] = eq::salwin_slawson_water_activity(ps);
        return d;
      },
      py::arg("parts"),
      "Equilibrium of parts (model, p1, p2, p3, dry solids kg, moisture kg/kg dry solids): "
      "common water activity, final moisture and water gained (kg) of each part, their "
      "initial water activities, and the Salwin-Slawson estimate.");
  m.def(
      "isosteric_heat",
      [](const std::string& m1, double a1, double b1, double c1, double t1, const std::string& m2, double a2,
         double b2, double c2, double t2, double x) {
        return eq::isosteric_heat(make_isotherm(m1, a1, b1, c1, t1, NAN, NAN),
                                  make_isotherm(m2, a2, b2, c2, t2, NAN, NAN), x);
      },
      py::arg("model1"), py::arg("p1_1"), py::arg("p2_1"), py::arg("p3_1"), py::arg("temperature1"),
      py::arg("model2"), py::arg("p1_2"), py::arg("p2_2"), py::arg("p3_2"), py::arg("temperature2"),
      py::arg("moisture"),
      "Net isosteric heat of sorption (J/mol) at a moisture from isotherms at two temperatures.");
  m.def(
      "water_activity_growth_limits",
      [] {
        py::list out;
        for (const auto& r : colligate::data::water_activity_growth_limits()) {
          py::dict d;
          d["organisms"] = r.organisms;
          d["minimum_water_activity"] = r.minimum_water_activity;
          d["source"] = r.source;
          d["note"] = r.note;
          out.append(d);
        }
        return out;
      },
      "Published minimum water activities for growth of groups of microorganisms, with sources.");
  m.def("shift_water_activity", &eq::shift_water_activity, py::arg("water_activity"),
        py::arg("reference_temperature"), py::arg("temperature"), py::arg("isosteric_heat"),
        "Water activity at T (K) at the same moisture, from a_w at the reference T and the net "
        "isosteric heat (J/mol), by Clausius-Clapeyron.");
}

}  // namespace colligate_bindings
