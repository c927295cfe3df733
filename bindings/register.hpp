#pragma once
// Private helpers shared by the binding files. No physics here.
#include <pybind11/numpy.h>
#include <pybind11/pybind11.h>

#include <cstddef>
#include <string>
#include <tuple>
#include <utility>
#include <vector>

#include "colligate/core/solution.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/models/builtin_models.hpp"

namespace colligate::fit {
struct uncertain_value;      // fit/propagation.hpp
struct monte_carlo_result;   // fit/propagation.hpp
}  // namespace colligate::fit

namespace colligate_bindings {

namespace py = pybind11;

/// The model a caller names with the Pitzer parameter set it names ("": the model's
/// default set; checked by model_choice).
inline colligate::models::model_choice model_with_set(const std::string& model,
                                                      const std::string& parameter_set) {
  return colligate::models::model_choice(model, colligate::models::model_options{parameter_set});
}

/// One solute record as a dict (SI units, source keys).
py::dict solute_row(const colligate::data::solute_record& r);

/// A standard uncertainty (value, std, degrees_of_freedom) as a dict.
py::dict uncertain_dict(const colligate::fit::uncertain_value& v);

/// A Monte Carlo propagation as a dict: the value, the draws' std and mean, the draws
/// themselves ("samples"), the constants drawn and those without a stated uncertainty.
py::dict monte_carlo_dict(double value, const colligate::fit::monte_carlo_result& r,
                          const std::vector<std::string>& constants,
                          const std::vector<std::string>& not_stated);

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
void register_freezing_time(py::module_& m);
void register_storage(py::module_& m);
void register_uncertainty(py::module_& m);

using array_in = py::array_t<double, py::array::c_style | py::array::forcecast>;

/// f(T) (a checked_value) at every temperature of an array: (values, first reason, count
/// out of range). With `release_gil` the loop runs without the GIL (f must not touch
/// Python objects or state shared with other Python threads).
template <class F>
std::tuple<py::array_t<double>, std::string, std::size_t> checked_over_array(
    const array_in& temperature, F&& f, bool release_gil = true) {
  py::array_t<double> out(temperature.request().shape);
  const double* t = temperature.data();
  double* o = out.mutable_data();
  const auto n = static_cast<std::size_t>(temperature.size());
  std::string first_reason;
  std::size_t count = 0;
  auto loop = [&] {
    for (std::size_t i = 0; i < n; ++i) {
      const colligate::checked_value v = f(t[i]);
      o[i] = v.value;
      if (!v.check.in_range() && count++ == 0) first_reason = v.check.reason();
    }
  };
  if (release_gil) {
    py::gil_scoped_release release;
    loop();
  } else {
    loop();
  }
  return {out, first_reason, count};
}

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
