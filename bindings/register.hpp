#pragma once
// Private helpers shared by the binding files. No physics here.
#include <pybind11/pybind11.h>

#include <string>
#include <utility>
#include <vector>

#include "colligate/core/solution.hpp"

namespace colligate_bindings {

namespace py = pybind11;

/// One solute record as a dict (SI units, source keys).
py::dict solute_row(const colligate::data::solute_record& r);

/// Declares every bound class (name, docstring) before any definition (declare_types.cpp).
void declare_types(py::module_& m);

/// The class declared for T under `name`, to add methods and properties to.
template <class T>
py::class_<T> bound_class(py::module_& m, const char* name) {
  return py::reinterpret_borrow<py::class_<T>>(m.attr(name));
}

void register_core(py::module_& m);
void register_equilibria(py::module_& m);
void register_thermal(py::module_& m);
void register_batch(py::module_& m);
void register_fit(py::module_& m);
void register_electrolytes(py::module_& m);
void register_ice_curve(py::module_& m);
void register_data(py::module_& m);

/// Converts any mapping with .items() (dict, pandas Series) to named amounts.
inline std::vector<colligate::named_amount> to_named_amounts(const py::object& mapping,
                                                             const char* argument) {
  if (!py::hasattr(mapping, "items"))
    throw colligate::invalid_input(std::string(argument) +
                                   " must be a mapping of solute name to amount "
                                   "(dict or pandas Series)");
  std::vector<colligate::named_amount> out;
  for (auto item : mapping.attr("items")()) {
    auto pair = item.cast<py::tuple>();
    std::string name = py::str(pair[0]);
    double value;
    try {
      value = pair[1].cast<double>();
    } catch (const py::cast_error&) {
      throw colligate::invalid_input(std::string(argument) + "['" + name +
                                     "'] must be a number, got " +
                                     std::string(py::repr(pair[1])));
    }
    out.emplace_back(std::move(name), value);
  }
  return out;
}

}  // namespace colligate_bindings
