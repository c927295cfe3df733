#pragma once
// Private helper of the binding files: a food from Python arguments. No physics here.
#include <pybind11/pybind11.h>

#include <string>

#include "colligate/thermal/enthalpy.hpp"
#include "register.hpp"

namespace colligate_bindings {

namespace th = colligate::thermal;

inline th::food_composition to_composition(const py::object& mapping) {
  th::food_composition x;
  for (const auto& [name, value] : to_named_amounts(mapping, "composition")) {
    if (name == "water") x.water = value;
    else if (name == "protein") x.protein = value;
    else if (name == "fat") x.fat = value;
    else if (name == "carbohydrate") x.carbohydrate = value;
    else if (name == "fibre" || name == "fiber") x.fibre = value;
    else if (name == "ash") x.ash = value;
    else
      throw colligate::invalid_input("composition['" + name +
                                     "']: unknown component; valid components are water, "
                                     "protein, fat, carbohydrate, fibre, ash");
  }
  return x;
}

inline th::food make_food(const py::object& composition, const colligate::solution& s,
                          double bound_water_fraction_of_water, const std::string& model) {
  return th::food(to_composition(composition), s, bound_water_fraction_of_water,
                  colligate::models::model_choice(model));
}

}  // namespace colligate_bindings
