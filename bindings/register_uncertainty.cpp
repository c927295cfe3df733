// Bindings for the uncertainty of predictions (equilibria/prediction_uncertainty.hpp,
// fit/propagation.hpp, fit/fitted_uncertainty.hpp). Thin: convert, release the GIL, call the core.
#include <pybind11/eigen.h>
#include <pybind11/numpy.h>
#include <pybind11/pybind11.h>
#include <pybind11/stl.h>

#include <cstdint>
#include <string>
#include <vector>

#include "colligate/core/bound_water.hpp"
#include "colligate/data/builtin_solutes.hpp"
#include "colligate/data/builtin_uncertainty.hpp"
#include "colligate/data/solute_record.hpp"
#include "colligate/equilibria/prediction_uncertainty.hpp"
#include "colligate/fit/fitted_uncertainty.hpp"
#include "colligate/fit/propagation.hpp"
#include "colligate/thermal/enthalpy_uncertainty.hpp"
#include "food_helpers.hpp"
#include "register.hpp"

namespace colligate_bindings {

namespace {

namespace eq = colligate::equilibria;
namespace data = colligate::data;

eq::predicted_quantity quantity_from_string(const std::string& q) {
  for (auto v : {eq::predicted_quantity::freezing_point, eq::predicted_quantity::water_activity,
                 eq::predicted_quantity::osmotic_coefficient, eq::predicted_quantity::ice_fraction,
                 eq::predicted_quantity::unfrozen_water})
    if (q == eq::to_string(v)) return v;
  throw colligate::invalid_input("propagate_uncertainty: quantity = '" + q +
                                 "': must be one of freezing_point, water_activity, "
                                 "osmotic_coefficient, ice_fraction, unfrozen_water");
}

py::object record_uncertainty(const data::solute_record& r) {
  const auto u = data::stated_uncertainty(r);
  if (!u.stated()) return py::none();
  const auto n = static_cast<Eigen::Index>(u.size());
  Eigen::MatrixXd cov(n, n);
  for (Eigen::Index i = 0; i < n; ++i)
    for (Eigen::Index j = 0; j < n; ++j)
      cov(i, j) = u.at(static_cast<std::size_t>(i), static_cast<std::size_t>(j));
  py::dict d;
  d["names"] = u.names;
  d["covariance"] = cov;
  d["degrees_of_freedom"] = u.degrees_of_freedom;
  d["source"] = u.source;
  return std::move(d);
}

py::dict linear_dict(const eq::prediction_uncertainty& r) {
  py::dict d = uncertain_dict(r.result);
  d["sensitivities"] = r.sensitivities;
  d["constants"] = r.constants;
  d["not_stated"] = r.not_stated;
  d["reason"] = r.check.in_range() ? std::string() : r.check.reason();
  return d;
}

}  // namespace

void register_uncertainty(py::module_& m) {
  bound_class<data::solute_record>(m, "SoluteRecord")
      .def_property_readonly("uncertainty", &record_uncertainty,
                             "Covariance of the record's constants as a dict (names, covariance, "
                             "degrees_of_freedom, source), or None: uncertainty not stated.")
      .def_property_readonly("uncertainty_statement", &data::uncertainty_statement,
                             "The standard uncertainties of the record's constants with their "
                             "source, or 'not stated'.");

  m.def(
      "uncertainty_statements",
      [] {
        py::dict d;
        for (const auto& r : data::builtin_solutes().records()) d[py::str(r.id)] = data::uncertainty_statement(r);
        return d;
      },
      "The standard uncertainties of each built-in solute's constants with their source, or "
      "'not stated' (data/builtin_uncertainty.hpp).");

  m.def(
      "record_with_uncertainty",
      [](const data::solute_record& r, const std::vector<std::string>& names,
         const Eigen::MatrixXd& covariance, int degrees_of_freedom, const std::string& source) {
        const auto n = static_cast<Eigen::Index>(names.size());
        colligate::fit::detail::check_covariance("record_with_uncertainty", covariance, n);
        if (degrees_of_freedom < 0)
          throw colligate::invalid_input(colligate::detail::describe(
              "record_with_uncertainty", "degrees_of_freedom", degrees_of_freedom,
              "must be >= 0 (0: covariance taken as known)"));
        data::solute_record out = r;
        for (const auto& name : names) eq::constant_value(out, name);  // names each unknown one
        out.uncertainty = {};
        if (n == 0) return out;
        out.uncertainty.names = names;
        out.uncertainty.covariance.resize(static_cast<std::size_t>(n * n));
        for (Eigen::Index i = 0; i < n; ++i)
          for (Eigen::Index j = 0; j < n; ++j)
            out.uncertainty.covariance[static_cast<std::size_t>(i * n + j)] = covariance(i, j);
        out.uncertainty.degrees_of_freedom = degrees_of_freedom;
        out.uncertainty.source = source;
        return out;
      },
      py::arg("record"), py::arg("names"), py::arg("covariance"), py::arg("degrees_of_freedom"),
      py::arg("source") = "colligate_fit_user",
      "A copy of `record` whose constants `names` carry `covariance` (SI units squared) "
      "resting on `degrees_of_freedom` (0: known covariance, normal law).");

  m.def("correlation_matrix", &colligate::fit::correlation_matrix, py::arg("covariance"),
        "Correlation matrix r_ij = u_ij / (u_i u_j) of a covariance matrix.");

  m.def(
      "coverage_factor",
      [](double level, int degrees_of_freedom) {
        colligate::fit::uncertain_value v;
        v.degrees_of_freedom = degrees_of_freedom;
        return v.coverage_factor(level);
      },
      py::arg("level"), py::arg("degrees_of_freedom"),
      "Two-sided coverage factor: Student t with `degrees_of_freedom` (> 0), normal for 0.");

  m.def(
      "propagate_uncertainty",
      [](const colligate::solution& s, const std::string& quantity, double temperature,
         const std::string& model, double bound_fraction, const std::string& method, int draws,
         std::uint64_t seed, const std::string& parameter_set, bool salts_crystallise) {
        const auto q = quantity_from_string(quantity);
        const auto choice = model_with_set(model, parameter_set);
        const double bound = colligate::bound_water_kg(s, bound_fraction, eq::to_string(q));
        if (method == "linear") {
          eq::prediction_uncertainty r;
          {
            py::gil_scoped_release release;
            r = eq::propagate_linear(q, s, temperature, choice, bound, salts_crystallise);
          }
          return linear_dict(r);
        }
        if (method != "monte_carlo")
          throw colligate::invalid_input("propagate_uncertainty: method = '" + method +
                                         "': must be 'linear' or 'monte_carlo'");
        colligate::fit::monte_carlo_result r;
        double value = 0.0;
        std::vector<std::string> constants, not_stated;
        {
          py::gil_scoped_release release;
          r = eq::propagate_monte_carlo(q, s, temperature, choice, bound, draws, seed, salts_crystallise);
          value = eq::predict(q, s, temperature, choice, bound, salts_crystallise);
          const auto c = eq::uncertain_constants(s);
          for (std::size_t k = 0; k < c.constants.size(); ++k) constants.push_back(c.label(k, s));
          not_stated = c.not_stated;
        }
        py::dict d = monte_carlo_dict(value, r, constants, not_stated);
        d["reason"] = std::string();
        return d;
      },
      py::arg("solution"), py::arg("quantity"), py::arg("temperature"), py::arg("model") = "auto",
      py::arg("bound_water_fraction_of_water") = 0.0, py::arg("method") = "linear",
      py::arg("draws") = 100000, py::arg("seed") = 0, py::arg("parameter_set") = "",
      py::arg("salts_crystallise") = true,
      "A prediction with its standard uncertainty from the covariance of the solution's "
      "constants: method 'linear' (analytic sensitivities, GUM eq. 13) or 'monte_carlo' "
      "(`draws` samples, generator seeded with `seed`). Temperature in K (unused for the "
      "freezing point). salts_crystallise (default): a salt above its solubility crystallises "
      "as in the plain calls (first-solid freezing point, equilibrium a_w; the linear method "
      "refuses such a state when a constant is uncertain); false: metastable values.");

  m.def(
      "food_thermal_uncertainty",
      [](const py::object& composition, const colligate::solution& s, const std::string& quantity,
         double from_temperature, double to_temperature, const std::string& model,
         double bound_fraction) {
        const auto f = make_food(composition, s, bound_fraction, model);
        eq::prediction_uncertainty r;
        if (quantity != "enthalpy" && quantity != "heat_load")
          throw colligate::invalid_input("food_thermal_uncertainty: quantity = '" + quantity +
                                         "': must be 'enthalpy' or 'heat_load'");
        {
          py::gil_scoped_release release;
          r = quantity == "enthalpy" ? th::enthalpy_with_uncertainty(f, from_temperature)
                                     : th::heat_load_with_uncertainty(f, from_temperature, to_temperature);
        }
        return linear_dict(r);
      },
      py::arg("composition"), py::arg("solution"), py::arg("quantity"), py::arg("from_temperature"),
      py::arg("to_temperature") = 0.0, py::arg("model") = "auto",
      py::arg("bound_water_fraction_of_water") = 0.0,
      "Enthalpy at from_temperature (J/kg, H = 0 at 233.15 K) or the heat load H(from) - H(to) "
      "(J/kg), with its standard uncertainty by linear propagation.");
}

}  // namespace colligate_bindings
