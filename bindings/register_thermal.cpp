// Bindings for thermal/: component heat capacities, enthalpy, apparent specific heat and
// heat loads of a food. Thin: convert, release the GIL, call the core.
#include <pybind11/numpy.h>
#include <pybind11/pybind11.h>
#include <pybind11/stl.h>

#include <string>
#include <tuple>

#include "colligate/colligate.hpp"
#include "colligate/thermal/enthalpy.hpp"
#include "food_helpers.hpp"
#include "register.hpp"

namespace colligate_bindings {

void register_thermal(py::module_& m) {
  m.def(
      "component_specific_heat",
      [](const std::string& component, double T) {
        return th::specific_heat(th::component_from_string(component), T);
      },
      py::arg("component"), py::arg("temperature"),
      "Specific heat of a food component (water, ice, protein, fat, carbohydrate, fibre, ash) "
      "at ``temperature`` (K), J/(kg K); Choi & Okos (1986).");
  m.def(
      "unfrozen_specific_heat",
      [](const py::object& composition, double T) {
        return th::unfrozen_specific_heat(to_composition(composition), T);
      },
      py::arg("composition"), py::arg("temperature"),
      "Specific heat of the unfrozen food (all water liquid) at ``temperature`` (K), J/(kg K).");
  m.def(
      "latent_heat_of_fusion",
      [](const py::object& composition) {
        return th::latent_heat_of_fusion(to_composition(composition));
      },
      py::arg("composition"), "Water fraction times the heat of fusion of ice at 0 C, J/kg of food.");
  m.def(
      "chen_frozen_specific_heat", &th::chen_frozen_specific_heat, py::arg("water_fraction"),
      py::arg("solids_fraction"), py::arg("bound_water_fraction_of_water"), py::arg("initial_freezing_point"),
      py::arg("temperature"),
      "Apparent specific heat of a frozen food, J/(kg K), by the Chen (1985) correlation as "
      "presented in ASHRAE Refrigeration (2006) ch. 9; temperatures in K.");
  m.def(
      "food_enthalpy",
      [](const py::object& composition, const colligate::solution& s,
         const array_in& temperature,
         const std::string& model, double bound_fraction) {
        const auto f = make_food(composition, s, bound_fraction, model);
        auto curve = th::ice_curve_of(f);  // one curve for every temperature
        return checked_over_array(temperature, [&](double T) {
          return th::enthalpy(f, curve, T, colligate::range_policy::extrapolate);
        });
      },
      py::arg("composition"), py::arg("solution"), py::arg("temperature"),
      py::arg("model") = "auto", py::arg("bound_water_fraction_of_water") = 0.0,
      "Specific enthalpy, J/kg, H = 0 at 233.15 K; returns (values, first reason, count).");
  m.def(
      "food_apparent_specific_heat",
      [](const py::object& composition, const colligate::solution& s,
         const array_in& temperature,
         const std::string& model, double bound_fraction) {
        const auto f = make_food(composition, s, bound_fraction, model);
        auto curve = th::ice_curve_of(f);
        return checked_over_array(temperature, [&](double T) {
          return th::apparent_specific_heat(f, curve, T, colligate::range_policy::extrapolate);
        });
      },
      py::arg("composition"), py::arg("solution"), py::arg("temperature"),
      py::arg("model") = "auto", py::arg("bound_water_fraction_of_water") = 0.0,
      "Apparent specific heat dH/dT, J/(kg K); returns (values, first reason, count).");
  m.def(
      "food_heat_load",
      [](const py::object& composition, const colligate::solution& s, double from_temperature,
         double to_temperature, const std::string& model, double bound_fraction) {
        const auto f = make_food(composition, s, bound_fraction, model);
        th::heat_load_result r;
        {
          py::gil_scoped_release release;
          r = th::heat_load(f, from_temperature, to_temperature);
        }
        py::dict d;
        d["total"] = r.total;
        d["sensible"] = r.sensible;
        d["latent"] = r.latent;
        d["ice_fraction_from"] = r.ice_fraction_from;
        d["ice_fraction_to"] = r.ice_fraction_to;
        d["reason"] = r.check.reason();
        return d;
      },
      py::arg("composition"), py::arg("solution"), py::arg("from_temperature"),
      py::arg("to_temperature"), py::arg("model") = "auto", py::arg("bound_water_fraction_of_water") = 0.0,
      "Heat to remove per kg from ``from_temperature`` to ``to_temperature`` (K), J/kg, split "
      "into sensible and latent parts.");
  m.attr("ENTHALPY_REFERENCE_TEMPERATURE") = th::reference_temperature;
}

}  // namespace colligate_bindings
