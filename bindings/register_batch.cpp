// Bindings for batch/: a SolutionBatch from a 2-D float64 array and the batch kernels.
// Shapes and species are checked and outputs allocated while holding the GIL; the C++
// loop then runs with the GIL released and touches no Python object.
#include <pybind11/numpy.h>
#include <pybind11/pybind11.h>
#include <pybind11/stl.h>

#include <string>
#include <vector>

#include "colligate/batch/kernels.hpp"
#include "colligate/batch/seawater_freezing_points.hpp"
#include "colligate/batch/uncertainty_kernels.hpp"
#include "colligate/batch/solution_batch.hpp"
#include "colligate/models/builtin_models.hpp"
#include "register.hpp"

namespace colligate_bindings {

namespace {

using colligate::batch::solution_batch;

const double* check_matrix(const array_in& a, std::size_t n_species, const char* what) {
  if (a.ndim() != 2 || static_cast<std::size_t>(a.shape(1)) != n_species)
    throw colligate::invalid_input(std::string(what) + " must be a 2-D array with one column per species (" +
                                   std::to_string(n_species) + " columns)");
  return a.data();
}

/// Runs a batch kernel with the GIL released. The kernel's interruption hook reacquires
/// the GIL about every 50 ms and lets Python run its signal handlers (PyErr_CheckSignals,
/// on the calling thread, which holds the interpreter's main-thread role); when a handler
/// raises (Ctrl-C: KeyboardInterrupt) the batch stops and that exception reaches Python.
template <class Kernel>
void run_interruptible(colligate::batch::options& opt, Kernel kernel) {
  bool python_error = false;
  opt.interrupted = [&python_error] {
    py::gil_scoped_acquire gil;
    if (PyErr_CheckSignals() != 0) {
      python_error = true;  // the exception stays set in the interpreter
      return true;
    }
    return false;
  };
  try {
    py::gil_scoped_release release;
    kernel();
  } catch (const colligate::batch::interrupted&) {
    if (python_error) throw py::error_already_set();
    throw;
  }
}

colligate::batch::options make_options(int threads, const std::string& policy, double bound) {
  if (threads < 0) throw colligate::invalid_input("threads = " + std::to_string(threads) + ": must be >= 0 (0 = all cores)");
  colligate::check_bound_water_fraction_of_water("batch", bound);
  colligate::batch::options o;
  o.threads = static_cast<unsigned>(threads);
  o.policy = colligate::range_policy_from_string(policy);
  o.bound_water_fraction_of_water = bound;
  return o;
}

}  // namespace

void register_batch(py::module_& m) {
  bound_class<solution_batch>(m, "SolutionBatchCore")
      .def_static(
          "from_molalities",
          [](const std::vector<std::string>& species, const array_in& data,
             const colligate::data::solute_table* table) {
            const double* p = check_matrix(data, species.size(), "molalities");
            return solution_batch::from_molalities(species, p, static_cast<std::size_t>(data.shape(0)),
                                                   table ? *table : colligate::data::builtin_solutes());
          },
          py::arg("species"), py::arg("molalities"), py::arg("table") = nullptr)
      .def_static(
          "from_mass_fractions",
          [](const std::vector<std::string>& species, const array_in& data,
             const colligate::data::solute_table* table) {
            const double* p = check_matrix(data, species.size(), "mass fractions");
            return solution_batch::from_mass_fractions(species, p, static_cast<std::size_t>(data.shape(0)),
                                                       table ? *table : colligate::data::builtin_solutes());
          },
          py::arg("species"), py::arg("mass_fractions"), py::arg("table") = nullptr)
      .def_property_readonly("rows", &solution_batch::rows)
      .def_property_readonly("species", [](const solution_batch& b) {
        std::vector<std::string> ids;
        for (const auto& r : b.species()) ids.push_back(r.id);
        return ids;
      });

  m.def("row_status_reasons", [] {
    std::vector<std::string> out;
    for (int k = 0; k < colligate::batch::row_status_count; ++k)
      out.emplace_back(colligate::batch::describe(static_cast<colligate::batch::row_status>(k)));
    return out;
  }, "Readable reason for each row status code (index = code).");

  m.def(
      "batch_freezing_points",
      [](const solution_batch& b, const std::string& model, int threads, const std::string& policy,
         double bound, const std::string& parameter_set, bool metastable) {
        const auto id = model_with_set(model, parameter_set);
        auto opt = make_options(threads, policy, bound);
        opt.salts_crystallise = !metastable;
        py::array_t<double> out(static_cast<py::ssize_t>(b.rows()));
        py::array_t<std::uint8_t> status(static_cast<py::ssize_t>(b.rows()));
        double* o = out.mutable_data();
        std::uint8_t* st = status.mutable_data();
        run_interruptible(opt, [&] { colligate::batch::freezing_points(b, id, opt, o, st); });
        return py::make_tuple(out, status);
      },
      py::arg("batch"), py::arg("model") = "auto", py::arg("threads") = 0,
      py::arg("range_policy") = "extrapolate", py::arg("bound_water_fraction_of_water") = 0.0,
      py::arg("parameter_set") = "", py::arg("metastable") = false);

  m.def(
      "seawater_freezing_points",
      [](const array_in& SA, int threads, const std::string& parameter_set) {
        if (SA.ndim() != 1)
          throw colligate::invalid_input("absolute_salinity must be a 1-D array of g/kg");
        const auto id = model_with_set("pitzer", parameter_set);
        auto opt = make_options(threads, "extrapolate", 0.0);
        const auto n = static_cast<std::size_t>(SA.shape(0));
        py::array_t<double> out(static_cast<py::ssize_t>(n));
        py::array_t<std::uint8_t> status(static_cast<py::ssize_t>(n));
        double* o = out.mutable_data();
        std::uint8_t* st = status.mutable_data();
        const double* a = SA.data();
        run_interruptible(opt, [&] { colligate::batch::seawater_freezing_points(id, a, n, opt, o, st); });
        return py::make_tuple(out, status);
      },
      py::arg("absolute_salinity"), py::arg("threads") = 0, py::arg("parameter_set") = "",
      "(freezing points K, row status codes) of Reference-Composition seawater at each absolute "
      "salinity (g/kg): the Pitzer model's freezing line (a Chebyshev series in sqrt(SA) of its "
      "exact freezing points) up to 50 g/kg, the exact path above.");

  m.def(
      "batch_water_activities",
      [](const solution_batch& b, double T, const std::string& model, int threads,
         const std::string& policy, const std::string& saturation, const std::string& parameter_set) {
        const auto id = model_with_set(model, parameter_set);
        auto opt = make_options(threads, policy, 0.0);
        opt.salts_crystallise = colligate::equilibria::salts_crystallise_from_string(saturation);
        py::array_t<double> out(static_cast<py::ssize_t>(b.rows()));
        py::array_t<std::uint8_t> status(static_cast<py::ssize_t>(b.rows()));
        double* o = out.mutable_data();
        std::uint8_t* st = status.mutable_data();
        run_interruptible(opt, [&] { colligate::batch::water_activities(b, T, id, opt, o, st); });
        return py::make_tuple(out, status);
      },
      py::arg("batch"), py::arg("temperature"), py::arg("model") = "auto", py::arg("threads") = 0,
      py::arg("range_policy") = "extrapolate", py::arg("saturation") = "equilibrium", py::arg("parameter_set") = "");

  m.def(
      "batch_ice_fractions",
      [](const solution_batch& b, const array_in& temperatures, const std::string& model,
         int threads, const std::string& policy, double bound, const std::string& parameter_set) {
        const auto id = model_with_set(model, parameter_set);
        auto opt = make_options(threads, policy, bound);
        if (temperatures.ndim() != 1)
          throw colligate::invalid_input("temperatures must be a 1-D array (K)");
        const auto nT = static_cast<std::size_t>(temperatures.shape(0));
        py::array_t<double> out({static_cast<py::ssize_t>(b.rows()), static_cast<py::ssize_t>(nT)});
        py::array_t<std::uint8_t> status({static_cast<py::ssize_t>(b.rows()), static_cast<py::ssize_t>(nT)});
        const double* t = temperatures.data();
        double* o = out.mutable_data();
        std::uint8_t* st = status.mutable_data();
        run_interruptible(opt, [&] { colligate::batch::ice_fractions(b, t, nT, id, opt, o, st); });
        return py::make_tuple(out, status);
      },
      py::arg("batch"), py::arg("temperatures"), py::arg("model") = "auto", py::arg("threads") = 0,
      py::arg("range_policy") = "extrapolate", py::arg("bound_water_fraction_of_water") = 0.0,
      py::arg("parameter_set") = "");

  m.def(
      "batch_predictions_with_uncertainty",
      [](const solution_batch& b, const std::string& quantity, double temperature, const std::string& model,
         int threads, const std::string& policy, double bound, bool salts_crystallise,
         const std::string& parameter_set) {
        namespace eq = colligate::equilibria;
        eq::predicted_quantity q = eq::predicted_quantity::freezing_point;
        bool known = false;
        for (auto v : {eq::predicted_quantity::freezing_point, eq::predicted_quantity::water_activity,
                       eq::predicted_quantity::osmotic_coefficient, eq::predicted_quantity::ice_fraction,
                       eq::predicted_quantity::unfrozen_water})
          if (quantity == eq::to_string(v)) q = v, known = true;
        if (!known)
          throw colligate::invalid_input("batch uncertainty: quantity = '" + quantity +
                                         "': must be one of freezing_point, water_activity, "
                                         "osmotic_coefficient, ice_fraction, unfrozen_water");
        const auto id = model_with_set(model, parameter_set);
        auto opt = make_options(threads, policy, bound);
        opt.salts_crystallise = salts_crystallise;
        const auto n = static_cast<py::ssize_t>(b.rows());
        py::array_t<double> value(n), u(n);
        py::array_t<std::int32_t> dof(n);
        py::array_t<std::uint8_t> status(n);
        double* v = value.mutable_data();
        double* up = u.mutable_data();
        std::int32_t* d = dof.mutable_data();
        std::uint8_t* st = status.mutable_data();
        run_interruptible(opt, [&] {
          colligate::batch::predictions_with_uncertainty(b, q, temperature, id, opt, v, up, d, st);
        });
        return py::make_tuple(value, u, dof, status);
      },
      py::arg("batch"), py::arg("quantity"), py::arg("temperature"), py::arg("model") = "auto",
      py::arg("threads") = 0, py::arg("range_policy") = "extrapolate",
      py::arg("bound_water_fraction_of_water") = 0.0, py::arg("salts_crystallise") = true,
      py::arg("parameter_set") = "",
      "Value, standard uncertainty, effective degrees of freedom and row status of `quantity` "
      "for every row (linear propagation per row in C++; temperature in K, unused for the "
      "freezing point). salts_crystallise (default): a row where a salt crystallises keeps "
      "the plain batch call's value with u = NaN; false: metastable values. parameter_set: "
      "the Pitzer parameter set for the ions (empty: the model's default set).");
}

}  // namespace colligate_bindings
