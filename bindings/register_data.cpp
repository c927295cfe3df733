// Bindings for the food data tables of the core: relative sweetness and lactose
// solubility, each row with its source key. No physics and no data here.
#include <pybind11/numpy.h>
#include <pybind11/pybind11.h>
#include <pybind11/stl.h>

#include "colligate/data/sugar_solubility.hpp"
#include "colligate/data/sweetness.hpp"
#include "register.hpp"

namespace colligate_bindings {

void register_data(py::module_& m) {
  namespace data = colligate::data;

  m.def(
      "sweetness_table",
      [] {
        py::list rows;
        for (const auto& r : data::sweetness_table()) {
          py::dict row;
          row["solute"] = r.solute;
          row["relative_sweetness"] = r.relative_sweetness;
          row["source"] = r.source;
          row["note"] = r.note;
          rows.append(row);
        }
        return rows;
      },
      "Relative sweetness (sucrose = 1, mass basis) as a list of dicts with ``solute``, "
      "``relative_sweetness``, ``source`` (citation key) and ``note``.");

  m.def(
      "lactose_solubility_table",
      [] {
        py::list rows;
        for (const auto& p : data::lactose_solubility_table()) {
          py::dict row;
          row["temperature"] = p.temperature;
          row["solubility"] = p.solubility;
          row["source"] = p.source;
          row["note"] = p.note;
          rows.append(row);
        }
        return rows;
      },
      "Points of the lactose solubility curve as a list of dicts with ``temperature`` (K), "
      "``solubility`` (kg anhydrous lactose per kg water), ``source`` (citation key) and "
      "``note``.");

  m.def(
      "lactose_solubility",
      [](py::array_t<double, py::array::c_style | py::array::forcecast> temperature) {
        auto out = py::array_t<double>(temperature.request().shape);
        auto* dst = out.mutable_data();
        const double* src = temperature.data();
        for (py::ssize_t i = 0; i < temperature.size(); ++i) dst[i] = data::lactose_solubility(src[i]);
        return out;
      },
      py::arg("temperature"),
      "Solubility of lactose in water, kg anhydrous lactose per kg water, at ``temperature`` "
      "(K, scalar or array): linear interpolation in :func:`lactose_solubility_table`, held "
      "at the end values outside it.\n\nRaises ValueError for a temperature that is not "
      "finite and positive.");
}

}  // namespace colligate_bindings
