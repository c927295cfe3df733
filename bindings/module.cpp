// colligate._core: the compiled module. Only calls the register_<area> functions.
#include <pybind11/pybind11.h>

#include "register.hpp"

PYBIND11_MODULE(_core, m) {
  m.doc() = "colligate compiled core: activity models, ice equilibrium, freezing points.";
  m.attr("__version__") = COLLIGATE_VERSION;
  // fit first: it registers SoluteTable, which the Solution factories take as table=
  colligate_bindings::register_fit(m);
  colligate_bindings::register_core(m);
  colligate_bindings::register_equilibria(m);
  colligate_bindings::register_thermal(m);
  colligate_bindings::register_batch(m);
  colligate_bindings::register_electrolytes(m);
  colligate_bindings::register_ice_curve(m);
  colligate_bindings::register_data(m);
}
