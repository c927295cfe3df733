// Bindings for freezing and thawing times (thermal/freezing_time.hpp, shape_factors.hpp,
// enthalpy_simulation.hpp, food_freezing.hpp, conductivity.hpp) and boiling points
// (equilibria/boiling_point.hpp, water/saturation_pressure.hpp). Thin: convert, release the
// GIL, call the core.
#include <pybind11/eigen.h>
#include <pybind11/numpy.h>
#include <pybind11/pybind11.h>
#include <pybind11/stl.h>

#include <cstdint>
#include <limits>
#include <map>
#include <string>
#include <vector>

#include "colligate/colligate.hpp"
#include "colligate/equilibria/boiling_point.hpp"
#include "colligate/thermal/conductivity.hpp"
#include "colligate/thermal/enthalpy_simulation.hpp"
#include "colligate/thermal/food_freezing.hpp"
#include "colligate/thermal/freezing_time.hpp"
#include "colligate/thermal/freezing_time_uncertainty.hpp"
#include "colligate/thermal/shape_factors.hpp"
#include "colligate/water/saturation_pressure.hpp"
#include "food_helpers.hpp"
#include "register.hpp"

namespace colligate_bindings {

namespace {

th::conductivity_rule rule_from_string(const std::string& s) {
  if (s == "parallel") return th::conductivity_rule::parallel;
  if (s == "series") return th::conductivity_rule::series;
  throw colligate::invalid_input("conductivity_rule = '" + s + "': valid rules are parallel, series");
}

th::simulation_setup make_setup(const std::string& shape, double size, double initial_temperature,
                                std::vector<double> medium_time, std::vector<double> medium_temperature,
                                double h, double target_temperature, double max_time, int intervals,
                                double time_step, int record_every) {
  th::simulation_setup in;
  in.shape = th::body_shape_from_string(shape);
  in.size = size;
  in.initial_temperature = initial_temperature;
  in.medium = {std::move(medium_time), std::move(medium_temperature)};
  in.h = h;
  in.target_temperature = target_temperature;
  in.max_time = max_time;
  in.intervals = intervals;
  in.time_step = time_step;
  in.record_every = record_every;
  return in;
}

th::pham_inputs make_pham(double size, double shape_factor, double T_initial, double T_medium,
                          double T_centre, double density_unfrozen, double density_frozen,
                          double c_unfrozen, double c_frozen, double latent_heat, double k_frozen,
                          double h) {
  th::pham_inputs in;
  in.size = size;
  in.shape_factor = shape_factor;
  in.initial_temperature = T_initial;
  in.medium_temperature = T_medium;
  in.centre_temperature = T_centre;
  in.density_unfrozen = density_unfrozen;
  in.density_frozen = density_frozen;
  in.specific_heat_unfrozen = c_unfrozen;
  in.specific_heat_frozen = c_frozen;
  in.latent_heat = latent_heat;
  in.k_frozen = k_frozen;
  in.h = h;
  return in;
}

py::dict result_dict(const th::simulation_result& r) {
  py::dict d;
  d["status"] = th::to_string(r.status);
  d["time_to_target"] = r.time_to_target;
  d["time"] = py::array_t<double>(r.time.size(), r.time.data());
  d["centre_temperature"] = py::array_t<double>(r.centre_temperature.size(), r.centre_temperature.data());
  d["surface_temperature"] = py::array_t<double>(r.surface_temperature.size(), r.surface_temperature.data());
  d["medium_temperature"] = py::array_t<double>(r.medium_temperature.size(), r.medium_temperature.data());
  d["heat_flux"] = py::array_t<double>(r.heat_flux.size(), r.heat_flux.data());
  d["mean_enthalpy"] = py::array_t<double>(r.mean_enthalpy.size(), r.mean_enthalpy.data());
  d["positions"] = py::array_t<double>(r.positions.size(), r.positions.data());
  d["final_temperature"] = py::array_t<double>(r.final_temperature.size(), r.final_temperature.data());
  d["final_enthalpy"] = py::array_t<double>(r.final_enthalpy.size(), r.final_enthalpy.data());
  d["volume_per_area"] = r.volume_per_area;
  d["steps"] = r.steps;
  d["max_iterations_used"] = r.max_iterations_used;
  return d;
}

th::freezing_time_method time_method_from_string(const std::string& s) {
  if (s == "plank") return th::freezing_time_method::plank;
  if (s == "pham") return th::freezing_time_method::pham;
  throw colligate::invalid_input("method = '" + s + "': valid methods are plank, pham");
}

}  // namespace

py::dict uncertain_dict(const colligate::fit::uncertain_value& v) {
  py::dict d;
  d["value"] = v.value;
  d["std"] = v.standard_uncertainty;
  d["degrees_of_freedom"] = v.degrees_of_freedom;
  return d;
}

py::dict monte_carlo_dict(double value, const colligate::fit::monte_carlo_result& r,
                          const std::vector<std::string>& constants, const std::vector<std::string>& not_stated) {
  py::dict d;
  d["value"] = value;
  d["std"] = r.standard_deviation;
  d["mean"] = r.mean;
  d["degrees_of_freedom"] = 0;
  d["draws"] = r.draws;
  d["finite_draws"] = r.finite_draws;
  d["samples"] = py::array_t<double>(static_cast<py::ssize_t>(r.values.size()), r.values.data());
  d["constants"] = constants;
  d["not_stated"] = not_stated;
  return d;
}

void register_freezing_time(py::module_& m) {
  m.def(
      "plank_time",
      [](const std::string& shape, double size, double density, double latent_heat, double T_freeze,
         double T_medium, double h, double k_frozen) {
        return th::plank_time(th::body_shape_from_string(shape), size, density, latent_heat, T_freeze,
                              T_medium, h, k_frozen);
      },
      py::arg("shape"), py::arg("size"), py::arg("density"), py::arg("latent_heat"), py::arg("T_freeze"),
      py::arg("T_medium"), py::arg("h"), py::arg("k_frozen"),
      "Plank's freezing time, s (shape slab|cylinder|sphere; size = full thickness or diameter, m).");
  m.def(
      "pham_estimate",
      [](double size, double shape_factor, double T_initial, double T_medium, double T_centre,
         double density_unfrozen, double density_frozen, double c_unfrozen, double c_frozen,
         double latent_heat, double k_frozen, double h) {
        const auto r = th::pham_estimate(make_pham(size, shape_factor, T_initial, T_medium, T_centre,
                                                   density_unfrozen, density_frozen, c_unfrozen,
                                                   c_frozen, latent_heat, k_frozen, h));
        py::dict d;
        d["time"] = r.time;
        d["mean_freezing_temperature"] = r.mean_freezing_temperature;
        d["precooling_enthalpy"] = r.precooling_enthalpy;
        d["freezing_enthalpy"] = r.freezing_enthalpy;
        d["biot"] = r.biot;
        return d;
      },
      py::arg("size"), py::arg("shape_factor"), py::arg("T_initial"), py::arg("T_medium"),
      py::arg("T_centre"), py::arg("density_unfrozen"), py::arg("density_frozen"), py::arg("c_unfrozen"),
      py::arg("c_frozen"), py::arg("latent_heat"), py::arg("k_frozen"), py::arg("h"),
      "Pham's (1986) freezing time and its parts (SI, temperatures in K).");
  m.def(
      "pham_times",
      [](const array_in& size, double shape_factor, double T_initial, double T_medium, double T_centre,
         double density_unfrozen, double density_frozen, double c_unfrozen, double c_frozen,
         double latent_heat, double k_frozen, const array_in& h) {
        if (size.size() != h.size())
          throw colligate::invalid_input("pham_times: size and h must have the same length");
        py::array_t<double> out(size.request().shape);
        const double* s = size.data();
        const double* hh = h.data();
        double* o = out.mutable_data();
        const auto n = static_cast<std::size_t>(size.size());
        auto in = make_pham(0.0, shape_factor, T_initial, T_medium, T_centre, density_unfrozen,
                            density_frozen, c_unfrozen, c_frozen, latent_heat, k_frozen, 0.0);
        {
          py::gil_scoped_release release;
          for (std::size_t i = 0; i < n; ++i) {
            in.size = s[i];
            in.h = hh[i];
            o[i] = th::pham_time(in);
          }
        }
        return out;
      },
      py::arg("size"), py::arg("shape_factor"), py::arg("T_initial"), py::arg("T_medium"),
      py::arg("T_centre"), py::arg("density_unfrozen"), py::arg("density_frozen"), py::arg("c_unfrozen"),
      py::arg("c_frozen"), py::arg("latent_heat"), py::arg("k_frozen"), py::arg("h"),
      "Pham's (1986) freezing times, s, over arrays of size (m) and h (W/(m^2 K)).");
  m.def("brick_shape_factor", &th::brick_shape_factor, py::arg("a"), py::arg("b"), py::arg("c"),
        py::arg("h"), py::arg("k_frozen"),
        "EHTD of a rectangular brick with sides a, b, c (m); Hossain, Cleland & Cleland (1992).");
  m.def("rod_shape_factor", &th::rod_shape_factor, py::arg("a"), py::arg("b"), py::arg("h"),
        py::arg("k_frozen"), "EHTD of an infinite rectangular rod a x b (m); Hossain et al. (1992).");
  m.def("finite_cylinder_shape_factor", &th::finite_cylinder_shape_factor, py::arg("diameter"),
        py::arg("height"), py::arg("h"), py::arg("k_frozen"),
        "EHTD of a finite cylinder (m); Hossain et al. (1992).");
  m.def(
      "simulate_material",
      [](std::vector<double> T, std::vector<double> H, std::vector<double> k, const std::string& shape,
         double size, double T_initial, std::vector<double> medium_time,
         std::vector<double> medium_temperature, double h, double T_target, double max_time,
         int intervals, double time_step, int record_every) {
        const th::material_table mat(std::move(T), std::move(H), std::move(k));
        const auto in = make_setup(shape, size, T_initial, std::move(medium_time),
                                   std::move(medium_temperature), h, T_target, max_time, intervals,
                                   time_step, record_every);
        th::simulation_result r;
        {
          py::gil_scoped_release release;
          r = th::simulate(mat, in);
        }
        return result_dict(r);
      },
      py::arg("temperature"), py::arg("enthalpy"), py::arg("conductivity"), py::arg("shape"),
      py::arg("size"), py::arg("T_initial"), py::arg("medium_time"), py::arg("medium_temperature"),
      py::arg("h"), py::arg("T_target"), py::arg("max_time"), py::arg("intervals"), py::arg("time_step"),
      py::arg("record_every") = 1,
      "Enthalpy-method simulation of a tabulated material (H in J/m^3, k in W/(m K) against T in K).");
  m.def(
      "simulate_food",
      [](const py::object& composition, const colligate::solution& s, double bound_fraction,
         const std::string& model, const std::string& shape, double size, double T_initial,
         std::vector<double> medium_time, std::vector<double> medium_temperature, double h,
         double T_target, double max_time, int intervals, double time_step, int record_every,
         const std::string& rule) {
        const auto f = make_food(composition, s, bound_fraction, model);
        const auto in = make_setup(shape, size, T_initial, std::move(medium_time),
                                   std::move(medium_temperature), h, T_target, max_time, intervals,
                                   time_step, record_every);
        const auto cr = rule_from_string(rule);
        th::simulation_result r;
        {
          py::gil_scoped_release release;
          r = th::simulate_food(f, in, cr);
        }
        return result_dict(r);
      },
      py::arg("composition"), py::arg("solution"), py::arg("bound_water_fraction_of_water"), py::arg("model"),
      py::arg("shape"), py::arg("size"), py::arg("T_initial"), py::arg("medium_time"),
      py::arg("medium_temperature"), py::arg("h"), py::arg("T_target"), py::arg("max_time"),
      py::arg("intervals"), py::arg("time_step"), py::arg("record_every") = 1,
      py::arg("conductivity_rule") = "parallel",
      "Enthalpy-method simulation of a food (properties from its ice curve).");
  m.def(
      "food_freezing_inputs",
      [](const py::object& composition, const colligate::solution& s, double bound_fraction,
         const std::string& model, double T_initial, double T_target, const std::string& rule) {
        const auto f = make_food(composition, s, bound_fraction, model);
        const auto r = th::freezing_inputs_of_food(f, T_initial, T_target, rule_from_string(rule));
        py::dict d;
        d["T_freeze"] = r.initial_freezing_point;
        d["latent_heat"] = r.latent_heat;
        d["density_unfrozen"] = r.density_unfrozen;
        d["density_frozen"] = r.density_frozen;
        d["c_unfrozen"] = r.specific_heat_unfrozen;
        d["c_frozen"] = r.specific_heat_frozen;
        d["k_frozen"] = r.k_frozen;
        return d;
      },
      py::arg("composition"), py::arg("solution"), py::arg("bound_water_fraction_of_water"), py::arg("model"),
      py::arg("T_initial"), py::arg("T_target"), py::arg("conductivity_rule") = "parallel",
      "Inputs of Plank's and Pham's formulas for a food (SI).");
  m.def(
      "food_properties",
      [](const py::object& composition, const colligate::solution& s, double bound_fraction,
         const std::string& model, const array_in& temperature, const std::string& rule) {
        const auto f = make_food(composition, s, bound_fraction, model);
        const auto cr = rule_from_string(rule);
        const auto n = static_cast<std::size_t>(temperature.size());
        py::array_t<double> rho(n), k(n), H(n), ice(n);
        const double* t = temperature.data();
        double *pr = rho.mutable_data(), *pk = k.mutable_data(), *ph = H.mutable_data(),
               *pi = ice.mutable_data();
        {
          py::gil_scoped_release release;
          auto curve = th::ice_curve_of(f);
          for (std::size_t i = 0; i < n; ++i) {
            const auto p = th::food_properties(f, curve, t[i], cr);
            pr[i] = p.density;
            pk[i] = p.conductivity;
            ph[i] = p.enthalpy;
            pi[i] = p.ice_fraction;
          }
        }
        py::dict d;
        d["density"] = rho;
        d["conductivity"] = k;
        d["enthalpy"] = H;
        d["ice_fraction"] = ice;
        return d;
      },
      py::arg("composition"), py::arg("solution"), py::arg("bound_water_fraction_of_water"), py::arg("model"),
      py::arg("temperature"), py::arg("conductivity_rule") = "parallel",
      "Density (kg/m^3), conductivity (W/(m K)), enthalpy (J/kg) and ice fraction of a food.");
  m.def(
      "plank_time_uncertainty",
      [](const std::string& shape, double size, double density, double latent_heat, double T_freeze,
         double T_medium, double h, double k_frozen, double u_size, double u_density, double u_latent_heat,
         double u_T_freeze, double u_T_medium, double u_h, double u_k_frozen) {
        th::plank_input_uncertainty u;
        u.size = u_size;
        u.density = u_density;
        u.latent_heat = u_latent_heat;
        u.freezing_temperature = u_T_freeze;
        u.medium_temperature = u_T_medium;
        u.h = u_h;
        u.k_frozen = u_k_frozen;
        return uncertain_dict(th::plank_time_with_uncertainty(th::body_shape_from_string(shape), size, density,
                                                              latent_heat, T_freeze, T_medium, h, k_frozen, u));
      },
      py::arg("shape"), py::arg("size"), py::arg("density"), py::arg("latent_heat"), py::arg("T_freeze"),
      py::arg("T_medium"), py::arg("h"), py::arg("k_frozen"), py::arg("u_size") = 0.0,
      py::arg("u_density") = 0.0, py::arg("u_latent_heat") = 0.0, py::arg("u_T_freeze") = 0.0,
      py::arg("u_T_medium") = 0.0, py::arg("u_h") = 0.0, py::arg("u_k_frozen") = 0.0,
      "Plank's freezing time (s) with its standard uncertainty from stated, uncorrelated standard "
      "uncertainties of its inputs (closed-form partial derivatives; normal law).");
  m.def(
      "pham_time_uncertainty",
      [](double size, double shape_factor, double T_initial, double T_medium, double T_centre,
         double density_unfrozen, double density_frozen, double c_unfrozen, double c_frozen,
         double latent_heat, double k_frozen, double h, const std::map<std::string, double>& u_in) {
        th::pham_input_uncertainty u;
        for (const auto& [k, v] : u_in) {
          if (k == "size") u.size = v;
          else if (k == "T_initial") u.initial_temperature = v;
          else if (k == "T_medium") u.medium_temperature = v;
          else if (k == "T_centre") u.centre_temperature = v;
          else if (k == "density_unfrozen") u.density_unfrozen = v;
          else if (k == "density_frozen") u.density_frozen = v;
          else if (k == "c_unfrozen") u.specific_heat_unfrozen = v;
          else if (k == "c_frozen") u.specific_heat_frozen = v;
          else if (k == "latent_heat") u.latent_heat = v;
          else if (k == "k_frozen") u.k_frozen = v;
          else if (k == "h") u.h = v;
          else
            throw colligate::invalid_input("pham_time: u_" + k +
                                           ": unknown input; valid are u_size, u_T_initial, u_T_medium, "
                                           "u_T_centre, u_density_unfrozen, u_density_frozen, u_c_unfrozen, "
                                           "u_c_frozen, u_latent_heat, u_k_frozen, u_h");
        }
        return uncertain_dict(th::pham_time_with_uncertainty(
            make_pham(size, shape_factor, T_initial, T_medium, T_centre, density_unfrozen, density_frozen,
                      c_unfrozen, c_frozen, latent_heat, k_frozen, h),
            u));
      },
      py::arg("size"), py::arg("shape_factor"), py::arg("T_initial"), py::arg("T_medium"),
      py::arg("T_centre"), py::arg("density_unfrozen"), py::arg("density_frozen"), py::arg("c_unfrozen"),
      py::arg("c_frozen"), py::arg("latent_heat"), py::arg("k_frozen"), py::arg("h"), py::arg("uncertainties"),
      "Pham's (1986) freezing time (s) with its standard uncertainty from stated, uncorrelated "
      "standard uncertainties of its inputs (a dict: input name without 'u_' -> u).");
  m.def(
      "food_freezing_time_uncertainty",
      [](const py::object& composition, const colligate::solution& s, double bound_fraction,
         const std::string& model, const std::string& method, const std::string& shape, double size,
         double shape_factor, double T_initial, double T_medium, double h, double T_target, double u_h,
         double u_size, double u_T_medium, const std::string& rule, const std::string& propagation,
         int draws, std::uint64_t seed) {
        const auto f = make_food(composition, s, bound_fraction, model);
        const auto meth = time_method_from_string(method);
        th::freezing_process p;
        p.shape = th::body_shape_from_string(shape);
        p.size = size;
        p.shape_factor = shape_factor;
        p.initial_temperature = T_initial;
        p.medium_temperature = T_medium;
        p.h = h;
        p.target_temperature = T_target;
        p.rule = rule_from_string(rule);
        th::process_uncertainty u;
        u.h = u_h;
        u.size = u_size;
        u.medium_temperature = u_T_medium;
        if (propagation == "linear") {
          colligate::equilibria::prediction_uncertainty r;
          {
            py::gil_scoped_release release;
            r = th::food_freezing_time_with_uncertainty(f, meth, p, u);
          }
          py::dict d = uncertain_dict(r.result);
          d["sensitivities"] = r.sensitivities;
          d["constants"] = r.constants;
          d["not_stated"] = r.not_stated;
          return d;
        }
        if (propagation != "monte_carlo")
          throw colligate::invalid_input("with_uncertainty = '" + propagation +
                                         "': must be 'linear' or 'monte_carlo'");
        colligate::fit::monte_carlo_result r;
        double value = 0.0;
        std::vector<std::string> labels, not_stated;
        {
          py::gil_scoped_release release;
          r = th::food_freezing_time_monte_carlo(f, meth, p, u, draws, seed);
          value = th::food_freezing_time(f, meth, p);
          const auto t = th::detail::gather_time_inputs(f, p, u);
          labels = t.labels;
          not_stated = t.constants.not_stated;
        }
        return monte_carlo_dict(value, r, labels, not_stated);
      },
      py::arg("composition"), py::arg("solution"), py::arg("bound_water_fraction_of_water"), py::arg("model"),
      py::arg("method"), py::arg("shape"), py::arg("size"), py::arg("shape_factor"), py::arg("T_initial"),
      py::arg("T_medium"), py::arg("h"), py::arg("T_target"), py::arg("u_h") = 0.0, py::arg("u_size") = 0.0,
      py::arg("u_T_medium") = 0.0, py::arg("conductivity_rule") = "parallel", py::arg("propagation") = "linear",
      py::arg("draws") = 10000, py::arg("seed") = 0,
      "A food's Plank or Pham freezing time (s) with its standard uncertainty from the covariance of "
      "its solutes' constants and the stated u(h), u(size), u(T_medium): linear (closed-form "
      "derivatives) or Monte Carlo (`draws` samples, generator seeded with `seed`).");
  m.def(
      "simulate_food_time_uncertainty",
      [](const py::object& composition, const colligate::solution& s, double bound_fraction,
         const std::string& model, const std::string& shape, double size, double T_initial,
         std::vector<double> medium_time, std::vector<double> medium_temperature, double h,
         double T_target, double max_time, int intervals, double time_step, double u_h, double u_size,
         double u_T_medium, int draws, std::uint64_t seed, const std::string& rule) {
        const auto f = make_food(composition, s, bound_fraction, model);
        const auto in = make_setup(shape, size, T_initial, std::move(medium_time),
                                   std::move(medium_temperature), h, T_target, max_time, intervals,
                                   time_step, 1000000);
        const auto cr = rule_from_string(rule);
        th::process_uncertainty u;
        u.h = u_h;
        u.size = u_size;
        u.medium_temperature = u_T_medium;
        th::freezing_process p;
        p.h = h;
        p.size = size;
        p.medium_temperature = in.medium.temperature.empty() ? 0.0 : in.medium.temperature.front();
        colligate::fit::monte_carlo_result r;
        double value = 0.0;
        std::vector<std::string> labels, not_stated;
        {
          py::gil_scoped_release release;
          r = th::simulation_time_monte_carlo(f, in, u, draws, seed, cr);
          value = th::simulate_food(f, in, cr).time_to_target;
          const auto t = th::detail::gather_time_inputs(f, p, u);
          labels = t.labels;
          not_stated = t.constants.not_stated;
        }
        return monte_carlo_dict(value, r, labels, not_stated);
      },
      py::arg("composition"), py::arg("solution"), py::arg("bound_water_fraction_of_water"), py::arg("model"),
      py::arg("shape"), py::arg("size"), py::arg("T_initial"), py::arg("medium_time"),
      py::arg("medium_temperature"), py::arg("h"), py::arg("T_target"), py::arg("max_time"),
      py::arg("intervals"), py::arg("time_step"), py::arg("u_h") = 0.0, py::arg("u_size") = 0.0,
      py::arg("u_T_medium") = 0.0, py::arg("draws") = 200, py::arg("seed") = 0,
      py::arg("conductivity_rule") = "parallel",
      "The simulation's time (s) for the centre to reach T_target with its uncertainty by Monte Carlo "
      "over the food's constants and the stated u(h), u(size), u(T_medium) (`draws` runs, seeded).");
  m.def("saturation_pressure", &colligate::water::saturation_pressure, py::arg("temperature"),
        "Saturation vapour pressure of water, Pa, at T (K); Wagner & Pruss (1993), IAPWS.");
  m.def("saturation_temperature", &colligate::water::saturation_temperature, py::arg("pressure"),
        "Boiling temperature of pure water, K, at P (Pa); Wagner & Pruss (1993), IAPWS.");
  m.def(
      "boiling_point",
      [](const colligate::solution& s, double pressure, const std::string& model, const std::string& policy) {
        colligate::equilibria::boiling_point_result r;
        const colligate::models::model_choice mc(model);
        const auto pol = colligate::range_policy_from_string(policy);
        r = colligate::equilibria::boiling_point(s, pressure, mc, pol);
        py::dict d;
        d["temperature"] = r.temperature;
        d["elevation"] = r.elevation;
        d["water_activity"] = r.water_activity;
        d["status"] = colligate::equilibria::to_string(r.status);
        d["reason"] = r.check.reason();
        return d;
      },
      py::arg("solution"), py::arg("pressure") = 101325.0, py::arg("model") = "auto",
      py::arg("range_policy") = "extrapolate",
      "Boiling point (K) of a solution at pressure (Pa) from a_w(T) p_s(T) = P, with its elevation.");
  m.def(
      "concentration_for_boiling_point",
      [](const colligate::solution& s, double temperature, double pressure, const std::string& model,
         const std::string& policy) {
        const colligate::models::model_choice mc(model);
        const auto r = colligate::equilibria::concentration_for_boiling_point(
            s, temperature, pressure, mc, colligate::range_policy_from_string(policy));
        py::dict d;
        d["solution"] = r.composition;
        d["water_activity"] = r.water_activity;
        d["status"] = colligate::equilibria::to_string(r.status);
        d["reason"] = r.check.reason();
        return d;
      },
      py::arg("solution"), py::arg("temperature"), py::arg("pressure") = 101325.0,
      py::arg("model") = "auto", py::arg("range_policy") = "extrapolate",
      "The solution with the same solutes (water adjusted) that boils at temperature (K) under pressure (Pa).");
}

}  // namespace colligate_bindings
