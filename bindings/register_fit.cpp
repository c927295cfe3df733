// Bindings for fit/: least squares, fitters, fitted solute records and solute tables.
// Thin: convert arrays, release the GIL around the C++ fitters, call the core.
#include <pybind11/eigen.h>
#include <pybind11/functional.h>
#include <pybind11/numpy.h>
#include <pybind11/pybind11.h>
#include <pybind11/stl.h>

#include <optional>
#include <string>
#include <vector>

#include "colligate/data/builtin_solutes.hpp"
#include "colligate/data/solute_table.hpp"
#include "colligate/fit/fitters.hpp"
#include "colligate/fit/levenberg_marquardt.hpp"
#include "colligate/fit/pitzer_fitter.hpp"
#include "colligate/fit/single_salt_fitter.hpp"
#include "register.hpp"

namespace colligate_bindings {

namespace {

namespace fit = colligate::fit;
namespace data = colligate::data;
using Eigen::MatrixXd;
using Eigen::VectorXd;

VectorXd optional_vector(const std::optional<VectorXd>& v) { return v ? *v : VectorXd(); }

/// The salt record for a name: in `table` if given, else in the built-in table.
const data::solute_record& find_salt(const std::string& salt, const data::solute_table* table) {
  return (table ? *table : data::builtin_solutes()).find(salt);
}

/// A record's own Pitzer row as a dict (values at 298.15 K and d/dT there), or None.
py::object record_pitzer(const data::solute_record& r) {
  if (!r.pitzer.available) return py::none();
  const auto& b = r.pitzer.binary;
  py::dict d;
  d["cation"] = b.cation;
  d["anion"] = b.anion;
  d["beta0"] = b.beta0.a[0];
  d["beta1"] = b.beta1.a[0];
  d["beta2"] = b.beta2.a[0];
  d["cphi"] = b.cphi.a[0];
  d["dbeta0_dT"] = b.beta0.a[3];
  d["dbeta1_dT"] = b.beta1.a[3];
  d["dbeta2_dT"] = b.beta2.a[3];
  d["dcphi_dT"] = b.cphi.a[3];
  d["max_molality"] = b.max_molality;
  d["min_temperature"] = r.pitzer.min_temperature;
  d["max_temperature"] = r.pitzer.max_temperature;
  d["source"] = b.source;
  d["note"] = b.note;
  return std::move(d);
}

fit::pitzer_fit_options pitzer_options(bool temperature_terms, bool beta2) {
  fit::pitzer_fit_options o;
  o.fit_temperature_terms = temperature_terms;
  o.fit_beta2 = beta2;
  return o;
}

fit::fit_options make_options(int max_iterations, const std::optional<VectorXd>& lower,
                              const std::optional<VectorXd>& upper, bool scale_covariance) {
  fit::fit_options o;
  o.max_iterations = max_iterations;
  o.lower_bounds = optional_vector(lower);
  o.upper_bounds = optional_vector(upper);
  o.scale_covariance = scale_covariance;
  return o;
}

py::dict record_row(const data::solute_record& r) {
  py::dict d = solute_row(r);
  d["pitzer"] = record_pitzer(r);
  return d;
}

}  // namespace

void register_fit(py::module_& m) {
  bound_class<fit::fit_result>(m, "FitResult")
      .def_readonly("params", &fit::fit_result::params, "Fitted parameters.")
      .def_readonly("parameter_names", &fit::fit_result::parameter_names,
                    "Parameter names (empty for curve_fit).")
      .def_property_readonly("status", [](const fit::fit_result& r) { return fit::to_string(r.status); },
                             "'converged', 'max_iterations', 'max_evaluations', 'singular' or 'non_finite'.")
      .def_property_readonly("success", &fit::fit_result::success)
      .def_readonly("message", &fit::fit_result::message)
      .def_readonly("iterations", &fit::fit_result::iterations)
      .def_readonly("function_evaluations", &fit::fit_result::function_evaluations)
      .def_readonly("jacobian_evaluations", &fit::fit_result::jacobian_evaluations)
      .def_readonly("fitted", &fit::fit_result::fitted, "Model values at the data points.")
      .def_readonly("residuals", &fit::fit_result::residuals, "Data minus model, unweighted.")
      .def_readonly("chi_square", &fit::fit_result::chi_square, "Sum of weighted squared residuals.")
      .def_readonly("n_points", &fit::fit_result::n_points)
      .def_readonly("degrees_of_freedom", &fit::fit_result::degrees_of_freedom)
      .def_readonly("residual_variance", &fit::fit_result::residual_variance, "chi_square / dof.")
      .def_readonly("covariance", &fit::fit_result::covariance,
                    "Covariance of the parameters (NaN if singular or dof = 0).")
      .def_readonly("standard_errors", &fit::fit_result::standard_errors)
      .def_readonly("r_squared", &fit::fit_result::r_squared)
      .def_readonly("reciprocal_condition", &fit::fit_result::reciprocal_condition,
                    "Reciprocal condition number of the column-scaled weighted Jacobian.")
      .def_readonly("at_bound", &fit::fit_result::at_bound)
      .def_readonly("contradictory_duplicates", &fit::fit_result::contradictory_duplicates,
                    "Groups of row indices with equal x but contradictory y.")
      .def("confidence_intervals", &fit::fit_result::confidence_intervals, py::arg("level") = 0.95,
           "(k, 2) array of lower and upper limits at ``level`` (Student t, n - k dof).");

  bound_class<data::solute_record>(m, "SoluteRecord")
      .def_readonly("id", &data::solute_record::id)
      .def_readonly("name", &data::solute_record::name)
      .def_readonly("molar_mass", &data::solute_record::molar_mass, "kg/mol")
      .def_property_readonly("norrish_k", [](const data::solute_record& r) { return r.norrish.k; })
      .def_property_readonly("norrish_k3", [](const data::solute_record& r) { return r.norrish.k3; })
      .def_property_readonly("max_mass_fraction",
                             [](const data::solute_record& r) { return r.norrish.max_mass_fraction; })
      .def_property_readonly("note", [](const data::solute_record& r) {
        return r.pitzer.available ? r.pitzer.binary.note : r.norrish.note;
      })
      .def_readonly("formula", &data::solute_record::formula)
      .def_property_readonly("kind", [](const data::solute_record& r) {
        return r.kind == data::solute_class::electrolyte ? "electrolyte" : "non_electrolyte";
      })
      .def_property_readonly("pitzer", &record_pitzer,
                             "The record's own Pitzer binary parameters (dict: values at 298.15 K, "
                             "d/dT per K, max_molality mol/kg, temperature range K), or None.")
      .def("as_dict", &record_row);

  bound_class<data::solute_table>(m, "SoluteTable")
      .def(py::init([](bool include_builtin) {
             return include_builtin ? data::builtin_solutes() : data::solute_table();
           }),
           py::arg("include_builtin") = true)
      .def("add", &data::solute_table::add, py::arg("record"),
           "Adds a record; raises if its id or a name is already taken.")
      .def("__len__", &data::solute_table::size)
      .def("__contains__", [](const data::solute_table& t, const std::string& name) {
        return t.try_find(name) != nullptr;
      })
      .def("find", [](const data::solute_table& t, const std::string& name) { return t.find(name); },
           py::arg("name"), "The record for a name (case-insensitive; ids, names, aliases).")
      .def("rows", [](const data::solute_table& t) {
        py::list rows;
        for (const auto& r : t.records()) rows.append(record_row(r));
        return rows;
      }, "All records as a list of dicts.");

  m.def(
      "make_solute_record",
      [](const std::string& id, const std::string& name, double molar_mass, double k, double k3,
         double max_mass_fraction, const std::string& note) {
        auto r = fit::detail::trial_record(molar_mass, k, k3);
        if (!(molar_mass > 0.0) || !std::isfinite(molar_mass))
          throw colligate::invalid_input(colligate::detail::describe(
              "make_solute_record", "molar_mass", molar_mass, "must be finite and > 0 kg/mol"));
        if (!std::isfinite(k) || !std::isfinite(k3))
          throw colligate::invalid_input("make_solute_record: norrish_k and norrish_k3 must be finite");
        r.id = id;
        r.name = name.empty() ? id : name;
        r.norrish.max_mass_fraction = max_mass_fraction;
        if (k3 == 0.0) r.norrish.k3_source.clear();
        r.norrish.note = note;
        return r;
      },
      py::arg("id"), py::arg("name"), py::arg("molar_mass"), py::arg("norrish_k"),
      py::arg("norrish_k3") = 0.0, py::arg("max_mass_fraction") = 0.9, py::arg("note") = "",
      "A non-electrolyte record with user-fitted Norrish constants (molar mass in kg/mol).");

  m.def(
      "curve_fit",
      [](const fit::model_function& model, const MatrixXd& x, const VectorXd& y, const VectorXd& p0,
         const std::optional<VectorXd>& weights, const std::optional<fit::jacobian_function>& jac,
         const std::optional<VectorXd>& lower, const std::optional<VectorXd>& upper,
         int max_iterations, bool scale_covariance) {
        return fit::curve_fit(model, x, y, p0, optional_vector(weights),
                              make_options(max_iterations, lower, upper, scale_covariance),
                              jac ? *jac : fit::jacobian_function());
      },
      py::arg("model"), py::arg("x"), py::arg("y"), py::arg("p0"), py::arg("weights") = py::none(),
      py::arg("jacobian") = py::none(), py::arg("lower_bounds") = py::none(),
      py::arg("upper_bounds") = py::none(), py::arg("max_iterations") = 500,
      py::arg("scale_covariance") = true, R"doc(
Levenberg-Marquardt fit of ``model(x, p)`` (x: (n, d) array; returns n values) to y.
``jacobian(x, p)`` returns the (n, k) derivatives; without it, central differences.
)doc");

  m.def(
      "fit_norrish_water_activity",
      [](const VectorXd& molality, const VectorXd& aw, double T, const std::optional<VectorXd>& w,
         bool k3, double k_start, double k3_start) {
        fit::norrish_fit_options o;
        o.fit_k3 = k3;
        o.k_start = k_start;
        o.k3_start = k3_start;
        py::gil_scoped_release release;
        return fit::fit_norrish_water_activity(molality, aw, T, optional_vector(w), o);
      },
      py::arg("molality"), py::arg("water_activity"), py::arg("temperature"),
      py::arg("weights") = py::none(), py::arg("fit_k3") = false, py::arg("k_start") = 2.0,
      py::arg("k3_start") = 0.0, "Norrish K (and K3) from (molality mol/kg, a_w) at T (K).");
  m.def(
      "fit_norrish_freezing_point",
      [](const VectorXd& molality, const VectorXd& tf, const std::optional<VectorXd>& w, bool k3,
         double k_start, double k3_start) {
        fit::norrish_fit_options o;
        o.fit_k3 = k3;
        o.k_start = k_start;
        o.k3_start = k3_start;
        py::gil_scoped_release release;
        return fit::fit_norrish_freezing_point(molality, tf, optional_vector(w), o);
      },
      py::arg("molality"), py::arg("freezing_point"), py::arg("weights") = py::none(),
      py::arg("fit_k3") = false, py::arg("k_start") = 2.0, py::arg("k3_start") = 0.0,
      "Norrish K (and K3) from (molality mol/kg, initial freezing point K).");

  auto effective_options = [](bool fit_b, double m0, double b0) {
    fit::effective_solute_options o;
    o.fit_bound_water = fit_b;
    o.molar_mass_start = m0;
    o.bound_water_start = b0;
    return o;
  };
  m.def(
      "fit_effective_solute_freezing",
      [effective_options](const VectorXd& wf, const VectorXd& tf, const std::optional<VectorXd>& w,
                          bool fit_b, double m0, double b0) {
        const auto o = effective_options(fit_b, m0, b0);
        py::gil_scoped_release release;
        return fit::fit_effective_solute_freezing(wf, tf, optional_vector(w), o);
      },
      py::arg("water_fraction"), py::arg("freezing_point"), py::arg("weights") = py::none(),
      py::arg("fit_bound_water") = true, py::arg("molar_mass_start") = 0.2,
      py::arg("bound_water_start") = 0.1,
      "Effective solute (molar mass kg/mol, bound water kg/kg solids) from freezing points.");
  m.def(
      "fit_effective_solute_ice_curve",
      [effective_options](const VectorXd& wf, const VectorXd& T, const VectorXd& ice,
                          const std::optional<VectorXd>& w, bool fit_b, double m0, double b0) {
        const auto o = effective_options(fit_b, m0, b0);
        py::gil_scoped_release release;
        return fit::fit_effective_solute_ice_curve(wf, T, ice, optional_vector(w), o);
      },
      py::arg("water_fraction"), py::arg("temperature"), py::arg("ice_fraction"),
      py::arg("weights") = py::none(), py::arg("fit_bound_water") = true,
      py::arg("molar_mass_start") = 0.2, py::arg("bound_water_start") = 0.1,
      "Effective solute from an ice-fraction curve (ice mass / total water vs T in K).");
  m.def(
      "fit_pitzer_osmotic_coefficient",
      [](const std::string& salt, const VectorXd& molality, const VectorXd& phi,
         const VectorXd& temperature, const std::optional<VectorXd>& w, bool temperature_terms,
         bool beta2, const data::solute_table* table) {
        const auto rec = find_salt(salt, table);
        const auto o = pitzer_options(temperature_terms, beta2);
        py::gil_scoped_release release;
        return fit::fit_pitzer_osmotic_coefficient(rec, molality, phi, temperature,
                                                   optional_vector(w), o);
      },
      py::arg("salt"), py::arg("molality"), py::arg("osmotic_coefficient"), py::arg("temperature"),
      py::arg("weights") = py::none(), py::arg("temperature_terms") = false,
      py::arg("beta2") = false, py::arg("table") = nullptr,
      "Pitzer beta0, beta1, C-phi of a salt from (molality mol/kg, phi) at T (K; one or per row).");
  m.def(
      "fit_pitzer_water_activity",
      [](const std::string& salt, const VectorXd& molality, const VectorXd& aw,
         const VectorXd& temperature, const std::optional<VectorXd>& w, bool temperature_terms,
         bool beta2, const data::solute_table* table) {
        const auto rec = find_salt(salt, table);
        const auto o = pitzer_options(temperature_terms, beta2);
        py::gil_scoped_release release;
        return fit::fit_pitzer_water_activity(rec, molality, aw, temperature, optional_vector(w), o);
      },
      py::arg("salt"), py::arg("molality"), py::arg("water_activity"), py::arg("temperature"),
      py::arg("weights") = py::none(), py::arg("temperature_terms") = false,
      py::arg("beta2") = false, py::arg("table") = nullptr,
      "Pitzer beta0, beta1, C-phi of a salt from (molality mol/kg, a_w) at T (K; one or per row).");
  m.def(
      "fit_pitzer_freezing_point",
      [](const std::string& salt, const VectorXd& molality, const VectorXd& tf,
         const std::optional<VectorXd>& w, bool temperature_terms, bool beta2,
         const data::solute_table* table) {
        const auto rec = find_salt(salt, table);
        const auto o = pitzer_options(temperature_terms, beta2);
        py::gil_scoped_release release;
        return fit::fit_pitzer_freezing_point(rec, molality, tf, optional_vector(w), o);
      },
      py::arg("salt"), py::arg("molality"), py::arg("freezing_point"),
      py::arg("weights") = py::none(), py::arg("temperature_terms") = false,
      py::arg("beta2") = false, py::arg("table") = nullptr,
      "Pitzer beta0, beta1, C-phi of a salt from (molality mol/kg, initial freezing point K).");
  m.def(
      "fit_single_salt_freezing_point",
      [](int cation_charge, int anion_charge, int cation_count, int anion_count,
         const VectorXd& molality, const VectorXd& tf, const std::optional<VectorXd>& w,
         bool fit_cphi) {
        const auto shape =
            data::single_salt_shape(cation_charge, anion_charge, cation_count, anion_count);
        fit::single_salt_fit_options o;
        o.fit_cphi = fit_cphi;
        py::gil_scoped_release release;
        return fit::fit_single_salt_freezing_point(shape, molality, tf, optional_vector(w), o);
      },
      py::arg("cation_charge"), py::arg("anion_charge"), py::arg("cation_count"),
      py::arg("anion_count"), py::arg("molality"), py::arg("freezing_point"),
      py::arg("weights") = py::none(), py::arg("fit_cphi") = true,
      "Pitzer beta0, beta1, C-phi (closed binary form, alpha1 = 2) of a salt of any charge "
      "type from (molality mol/kg, freezing point K), parameters constant over the data.");
  m.def(
      "pitzer_solute_record",
      [](const fit::fit_result& r, const std::string& salt, const std::string& id,
         const std::string& name, double max_molality, double min_temperature,
         double max_temperature, const std::string& note, const data::solute_table* table) {
        return fit::pitzer_solute_record(r, find_salt(salt, table), id, name, max_molality,
                                         min_temperature, max_temperature, note);
      },
      py::arg("result"), py::arg("salt"), py::arg("id"), py::arg("name"), py::arg("max_molality"),
      py::arg("min_temperature"), py::arg("max_temperature"), py::arg("note"),
      py::arg("table") = nullptr,
      "A salt record (copy of ``salt``, new id) carrying the Pitzer parameters of a fit.");
  m.def(
      "make_pitzer_solute_record",
      [](const std::string& salt, const std::string& id, const std::string& name, double beta0,
         double beta1, double cphi, double beta2, double dbeta0_dT, double dbeta1_dT,
         double dbeta2_dT, double dcphi_dT, double max_molality, double min_temperature,
         double max_temperature, const std::string& source, const std::string& note,
         const data::solute_table* table) {
        fit::pitzer_salt_parameters p;
        p.beta0 = beta0;
        p.beta1 = beta1;
        p.beta2 = beta2;
        p.cphi = cphi;
        p.dbeta0_dT = dbeta0_dT;
        p.dbeta1_dT = dbeta1_dT;
        p.dbeta2_dT = dbeta2_dT;
        p.dcphi_dT = dcphi_dT;
        return fit::pitzer_salt_record(find_salt(salt, table), id, name, p, max_molality,
                                       min_temperature, max_temperature, source, note);
      },
      py::arg("salt"), py::arg("id"), py::arg("name"), py::arg("beta0"), py::arg("beta1"),
      py::arg("cphi"), py::arg("beta2") = 0.0, py::arg("dbeta0_dT") = 0.0,
      py::arg("dbeta1_dT") = 0.0, py::arg("dbeta2_dT") = 0.0, py::arg("dcphi_dT") = 0.0,
      py::arg("max_molality") = 6.0, py::arg("min_temperature") = 293.15,
      py::arg("max_temperature") = 303.15, py::arg("source") = "colligate_fit_user",
      py::arg("note") = "", py::arg("table") = nullptr,
      "A salt record (copy of ``salt``: molar mass, ions) with its own Pitzer parameters "
      "(kg/mol, kg^2/mol^2 for C-phi; values at 298.15 K and d/dT per K).");
  m.def("norrish_solute_record", &fit::norrish_solute_record, py::arg("result"), py::arg("id"),
        py::arg("name"), py::arg("molar_mass"), py::arg("max_mass_fraction"), py::arg("note"),
        "A solute record carrying fitted Norrish constants.");
  m.def("effective_solute_record", &fit::effective_solute_record, py::arg("result"), py::arg("id"),
        py::arg("name"), py::arg("note"), "A solute record for a fitted effective solute.");
}

}  // namespace colligate_bindings
