// colligate._core: the compiled module. Only calls the register_<area> functions.
#include <pybind11/pybind11.h>

#include "register.hpp"

PYBIND11_MODULE(_core, m) {
  m.doc() = "colligate compiled core: activity models, ice equilibrium, freezing points.";
  m.attr("__version__") = COLLIGATE_VERSION;
  // Types first, then the areas in any order (each only adds definitions).
  colligate_bindings::declare_types(m);
  colligate_bindings::register_core(m);
  colligate_bindings::register_fit(m);
  colligate_bindings::register_equilibria(m);
  colligate_bindings::register_thermal(m);
  colligate_bindings::register_batch(m);
  colligate_bindings::register_electrolytes(m);
  colligate_bindings::register_ice_curve(m);
  colligate_bindings::register_data(m);
  colligate_bindings::register_freezing_time(m);
  colligate_bindings::register_storage(m);
  colligate_bindings::register_uncertainty(m);
}
