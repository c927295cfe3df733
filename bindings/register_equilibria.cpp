// Bindings for water/ and equilibria/: a_w, freezing point, ice fraction.
// Scalar functions return (value, reason); reason is "" when every input was inside the
// model's validated range. The Python layer turns reasons into warnings. The array loop
// releases the GIL and touches no Python object.
#include <pybind11/numpy.h>
#include <pybind11/pybind11.h>
#include <pybind11/stl.h>

#include <string>
#include <tuple>

#include "colligate/colligate.hpp"
#include "register.hpp"

namespace colligate_bindings {

namespace {

using colligate::solution;

std::tuple<double, std::string> as_tuple(const colligate::checked_value& v) {
  return {v.value, v.check.reason()};
}

}  // namespace

void register_equilibria(py::module_& m) {
  namespace eq = colligate::equilibria;

  m.def("ln_water_activity_of_ice", &colligate::water::ln_water_activity_of_ice,
        py::arg("temperature"),
        "ln a_w of a solution in equilibrium with ice at ``temperature`` (K), one atmosphere.");
  m.def(
      "water_activity_of_ice",
      [](double T, const std::string& policy) {
        return as_tuple(colligate::water::water_activity_of_ice_checked(
            T, colligate::range_policy_from_string(policy)));
      },
      py::arg("temperature"), py::arg("range_policy") = "extrapolate",
      "Water activity of a solution in equilibrium with ice at ``temperature`` (K), one "
      "atmosphere, and the reason when outside 233.15-273.15 K (value, reason). No value "
      "below 215 K or above the ice point (NaN, or OutOfValidityRangeError with 'raise').");
  m.def("enthalpy_of_fusion", &colligate::water::enthalpy_of_fusion, py::arg("temperature"),
        "Molar enthalpy of fusion of ice at ``temperature`` (K), J/mol.");
  m.def("ice_vapour_pressure", &colligate::water::ice_vapour_pressure, py::arg("temperature"),
        "Vapour pressure of ice, Pa (Murphy & Koop 2005 eq. 7).");
  m.def("liquid_vapour_pressure", &colligate::water::liquid_vapour_pressure,
        py::arg("temperature"),
        "Vapour pressure of liquid or supercooled water, Pa (Murphy & Koop 2005 eq. 10).");

  m.def(
      "water_activity",
      [](const solution& s, double T, const std::string& model, const std::string& policy,
         const std::string& saturation, const std::string& parameter_set) {
        const auto choice = model_with_set(model, parameter_set);
        const auto p = colligate::range_policy_from_string(policy);
        if (!eq::salts_crystallise_from_string(saturation)) {
          const auto v = colligate::models::water_activity(s, T, choice, p);
          return std::make_tuple(v.value, v.check.reason(), std::string());
        }
        colligate::models::check_temperature_argument("water_activity", T);
        colligate::models::ln_water_activity_evaluator ln_aw(choice, s);
        eq::salt_equilibrium_state st;
        const auto v = eq::water_activity_at_equilibrium(ln_aw, s, T, p, &st);
        return std::make_tuple(v.value, v.check.reason(), eq::supersaturation_notice(st));
      },
      py::arg("solution"), py::arg("temperature"), py::arg("model") = "auto",
      py::arg("range_policy") = "extrapolate", py::arg("saturation") = "equilibrium",
      py::arg("parameter_set") = "",
      "(a_w, reason, supersaturation notice). saturation='equilibrium' (default): a solution "
      "above a salt's solubility gives the a_w of its equilibrium state, salt crystallised; "
      "'metastable': the solution as one liquid.");
  m.def(
      "osmotic_coefficient",
      [](const solution& s, double T, const std::string& model, const std::string& policy,
         const std::string& parameter_set) {
        return as_tuple(colligate::models::osmotic_coefficient(
            s, T, model_with_set(model, parameter_set), colligate::range_policy_from_string(policy)));
      },
      py::arg("solution"), py::arg("temperature"), py::arg("model") = "auto",
      py::arg("range_policy") = "extrapolate", py::arg("parameter_set") = "");
  // The dairy method of Leighton (1927) / Goff & Hartel (2013) (equilibria/leighton_method.hpp).
  bound_class<eq::leighton::mix_terms>(m, "LeightonTerms")
      .def_readonly("sucrose_equivalent", &eq::leighton::mix_terms::sucrose_equivalent)
      .def_readonly("milk_solids", &eq::leighton::mix_terms::milk_solids)
      .def_readonly("water", &eq::leighton::mix_terms::water)
      .def_property_readonly("reason",
                             [](const eq::leighton::mix_terms& t) { return t.check.reason(); });
  m.def("leighton_terms", &eq::leighton::terms_of, py::arg("solution"));
  m.def(
      "leighton_freezing_point",
      [](const solution& s) { return as_tuple(eq::leighton::freezing_point(eq::leighton::terms_of(s))); },
      py::arg("solution"));
  m.def(
      "leighton_ice_fraction",
      [](const solution& s, double T) {
        return as_tuple(eq::leighton::ice_fraction(eq::leighton::terms_of(s), T));
      },
      py::arg("solution"), py::arg("temperature"));
  m.def(
      "leighton_depression",
      [](const solution& s, double frozen) {
        return as_tuple(eq::leighton::total_depression(eq::leighton::terms_of(s), frozen));
      },
      py::arg("solution"), py::arg("frozen_fraction"));

  m.def(
      "freezing_point",
      [](const solution& s, const std::string& model, const std::string& policy,
         double bound_fraction, const std::string& parameter_set, bool metastable) {
        const auto choice = model_with_set(model, parameter_set);
        const auto pol = colligate::range_policy_from_string(policy);
        const double bound = colligate::bound_water_kg(s, bound_fraction, "freezing_point");
        if (metastable || !s.has_electrolytes()) {
          const auto v = eq::freezing_point_checked(s, choice, pol, bound);
          return std::make_tuple(v.value, v.check.reason(), std::string());
        }
        eq::ice_curve curve(s, choice, bound);
        eq::salt_first_solid first;
        const auto v = eq::first_solid_temperature_checked(curve, pol, &first);
        return std::make_tuple(v.value, v.check.reason(), eq::salt_first_notice(first));
      },
      py::arg("solution"), py::arg("model") = "auto", py::arg("range_policy") = "extrapolate",
      py::arg("bound_water_fraction_of_water") = 0.0, py::arg("parameter_set") = "",
      py::arg("metastable") = false,
      "(temperature K, reason, notice): the freezing point in the sense of the first solid to "
      "form. A brine richer than its eutectic composition crystallises a salt first: the value "
      "is that salt's crystallisation temperature and the notice names it; metastable=True "
      "gives the ice freezing point of the unprecipitated liquid.");
  m.def(
      "ice_fraction",
      [](const solution& s,
         const array_in& temperature,
         const std::string& model, const std::string& policy, double bound_fraction,
         const std::string& parameter_set) {
        const auto id = model_with_set(model, parameter_set);
        const auto pol = colligate::range_policy_from_string(policy);
        eq::ice_curve curve(s, id, colligate::bound_water_kg(s, bound_fraction, "ice_fraction"));  // one curve for every temperature
        return checked_over_array(temperature,
                                  [&](double T) { return eq::ice_fraction_of(curve.at(T), pol); });
      },
      py::arg("solution"), py::arg("temperature"), py::arg("model") = "auto",
      py::arg("range_policy") = "extrapolate", py::arg("bound_water_fraction_of_water") = 0.0,
      py::arg("parameter_set") = "");

  m.def(
      "temperature_for_ice_fraction",
      [](const solution& s, const array_in& fraction, const std::string& model,
         const std::string& policy, double bound_fraction, const std::string& parameter_set) {
        const auto pol = colligate::range_policy_from_string(policy);
        eq::ice_curve curve(s, model_with_set(model, parameter_set),
                            colligate::bound_water_kg(s, bound_fraction, "temperature_for_ice_fraction"));
        return checked_over_array(
            fraction, [&](double f) { return eq::temperature_for_ice_fraction(curve, f, pol); });
      },
      py::arg("solution"), py::arg("ice_fraction"), py::arg("model") = "auto",
      py::arg("range_policy") = "extrapolate", py::arg("bound_water_fraction_of_water") = 0.0,
      py::arg("parameter_set") = "",
      "(temperatures K, first reason, count out of range) at which the solution has each ice "
      "fraction (ice mass over all the water), on one prepared ice curve.");

  m.def(
      "unfrozen_phase",
      [](const solution& s, double T, const std::string& model, double bound_fraction,
         const std::string& parameter_set) {
        return eq::unfrozen_phase_at(s, T, model_with_set(model, parameter_set),
                                     colligate::bound_water_kg(s, bound_fraction, "unfrozen_phase"));
      },
      py::arg("solution"), py::arg("temperature"), py::arg("model") = "auto",
      py::arg("bound_water_fraction_of_water") = 0.0, py::arg("parameter_set") = "",
      "The ice curve's state (IceCurveState) at ``temperature`` (K).");
  // The former name of the state class, kept for callers that name it.
  m.attr("UnfrozenPhaseState") = m.attr("IceCurveState");
}

}  // namespace colligate_bindings
