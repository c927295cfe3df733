// Bindings for the food data tables of the core: relative sweetness and lactose
// solubility, each row with its source key. No physics and no data here.
#include <pybind11/numpy.h>
#include <pybind11/pybind11.h>
#include <pybind11/stl.h>

#include "colligate/data/dairy_rules.hpp"
#include "colligate/data/ethanol_water_density.hpp"
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

  m.def("ethanol_water_density_20c", &data::ethanol_water_density_20c, py::arg("ethanol_mass_fraction"),
        "Density of an ethanol-water mixture at 20 C, kg/m3, for the ethanol mass fraction "
        "(kg per kg of ethanol + water); OIML R 22 (1975), source key ``oiml_r22_1975``.");
  m.def("alcohol_by_volume_20c", &data::alcohol_by_volume_20c, py::arg("ethanol_kg"), py::arg("water_kg"),
        "Alcohol by volume at 20 C (volume fraction 0..1) of ``ethanol_kg`` ethanol in "
        "``water_kg`` water, from the OIML R 22 (1975) density formula (``oiml_r22_1975``).");
  m.attr("ETHANOL_DENSITY_20C") = data::ethanol_density_20c;
  m.def("max_msnf_for_lactose_in_solution", &data::max_msnf_for_lactose_in_solution,
        py::arg("water_fraction"), py::arg("msnf_fraction"),
        "Largest milk solids-not-fat (kg per kg of mix) that keeps lactose in solution by the "
        "rule of Hyde & Rothwell (1973), (water + MSNF) / 7; source key ``hyde_rothwell_1973``.");
}

}  // namespace colligate_bindings
