// Binding of equilibria/ice_curve.hpp: the prepared ice curve of one solution. No physics
// here. The curve caches the path it has explored, so its methods keep the GIL (one
// Python thread at a time per curve object).
#include <pybind11/numpy.h>
#include <pybind11/pybind11.h>
#include <pybind11/stl.h>

#include <cmath>
#include <string>
#include <tuple>
#include <vector>

#include "colligate/colligate.hpp"
#include "register.hpp"

namespace colligate_bindings {

void register_ice_curve(py::module_& m) {
  namespace eq = colligate::equilibria;
  using colligate::solution;

  bound_class<eq::ice_curve_state>(m, "IceCurveState")
      .def_readonly("temperature", &eq::ice_curve_state::temperature, "Temperature, K.")
      .def_property_readonly("state", [](const eq::ice_curve_state& s) { return eq::to_string(s.state); },
                             "'liquid', 'ice_and_liquid', 'ice_salts_liquid', 'below_curve_end' or 'not_solved'.")
      .def_property_readonly("status", [](const eq::ice_curve_state& s) { return eq::to_string(s.status); })
      .def_property_readonly("success", &eq::ice_curve_state::success)
      .def_readonly("total_water", &eq::ice_curve_state::total_water, "Water in the solution, kg.")
      .def_readonly("bound_water", &eq::ice_curve_state::bound_water, "Unfreezable water, kg.")
      .def_readonly("unfrozen_water", &eq::ice_curve_state::unfrozen_water, "Liquid water, kg.")
      .def_readonly("ice", &eq::ice_curve_state::ice, "Ice, kg.")
      .def_readonly("hydrate_water", &eq::ice_curve_state::hydrate_water,
                    "Water held in crystallised salt hydrates, kg.")
      .def_readonly("water_activity", &eq::ice_curve_state::water_activity,
                    "Water activity of the unfrozen liquid.")
      .def_readonly("precipitated", &eq::ice_curve_state::precipitated,
                    "Salt crystallised, mol, one per entry of IceCurve.salts.")
      .def_property_readonly("ice_fraction", &eq::ice_curve_state::ice_fraction,
                             "Ice mass / total water mass.")
      .def_property_readonly("reason", [](const eq::ice_curve_state& s) { return s.check.reason(); },
                             "Why the state is outside the validated range or not computed ('' if inside).")
      .def_readonly("validity", &eq::ice_curve_state::check,
                    "The limit crossed, as a record (Validity).");

  bound_class<eq::ice_curve>(m, "IceCurve")
      .def(py::init([](const solution& s, const std::string& model, double bound_fraction,
                       const std::string& path, const std::string& parameter_set) {
             return std::make_unique<eq::ice_curve>(s, model_with_set(model, parameter_set),
                                                    colligate::bound_water_kg(s, bound_fraction, "IceCurve"),
                                                    eq::crystallisation_path_from_string(path));
           }),
           py::arg("solution"), py::arg("model") = "auto", py::arg("bound_water_fraction_of_water") = 0.0,
           py::arg("path") = "equilibrium", py::arg("parameter_set") = "")
      .def_property_readonly("model", [](const eq::ice_curve& c) { return c.model().id; },
                             "Id of the model used ('auto' resolved).")
      .def_property_readonly("path", [](const eq::ice_curve& c) { return eq::to_string(c.path()); })
      .def_property_readonly("bound_water", &eq::ice_curve::bound_water,
                             "Unfreezable water, kg (bound_water_fraction_of_water times the water).")
      .def_property_readonly(
          "freezing_point",
          [](eq::ice_curve& c) {
            const auto f = c.salt_first();
            if (f.phase == nullptr) {
              const auto& fp = c.initial_freezing_point();
              return std::make_tuple(fp.temperature, std::string(eq::to_string(fp.status)),
                                     fp.check.reason());
            }
            return std::make_tuple(f.temperature,
                                   std::string(std::isnan(f.temperature) ? "salt_saturated_above_data"
                                                                         : "converged"),
                                   f.check.reason());
          },
          "The tuple (temperature K, status, reason) of the first solid to form, the value "
          "colligate.freezing_point gives. That is the ice freezing point or, for a brine richer "
          "than its eutectic composition, the temperature where a salt begins to crystallise "
          "(status 'salt_saturated_above_data' and NaN when it is supersaturated already at "
          "298.15 K). first_solid() names the phase; first_solid(metastable=True) gives the ice "
          "value.")
      .def(
          "first_solid",
          [](eq::ice_curve& c, bool metastable) {
            py::dict d;
            const auto& fp = c.initial_freezing_point();
            const auto f = metastable ? eq::salt_first_solid{} : c.salt_first();
            if (f.phase == nullptr) {
              d["temperature_K"] = fp.temperature;
              d["phase"] = "ice";
              d["formula"] = "H2O";
              d["source"] = "";
              d["status"] = std::string(eq::to_string(fp.status));
              d["reason"] = fp.check.reason();
            } else {
              d["temperature_K"] = f.temperature;
              d["phase"] = f.phase->name;
              d["formula"] = f.phase->formula;
              d["source"] = f.phase->source;
              d["status"] = std::string(std::isnan(f.temperature) ? "salt_saturated_above_data" : "converged");
              d["reason"] = f.check.reason();
            }
            d["metastable"] = metastable;
            d["metastable_ice_temperature_K"] = fp.temperature;
            d["notice"] = eq::salt_first_notice(f);
            return d;
          },
          py::arg("metastable") = false,
          "The first solid to form on cooling as a dict: temperature_K, phase ('ice' or the salt "
          "phase, e.g. 'hydrohalite'), formula, source (of the salt's solubility product), status, "
          "reason, notice (why a salt forms first; '' for ice), metastable_ice_temperature_K. "
          "metastable=True: the ice freezing point of the liquid as given (salt kept dissolved).")
      .def_property_readonly(
          "salts",
          [](eq::ice_curve& c) {
            py::list out;
            for (const auto& o : c.salts()) {
              py::dict d;
              d["name"] = o.phase->name;
              d["formula"] = o.phase->formula;
              d["source"] = o.phase->source;
              d["water_of_hydration"] = o.phase->water;
              d["onset_temperature_K"] = o.temperature;
              d["ends_temperature_K"] = o.ends;
              out.append(d);
            }
            return out;
          },
          "The salt phases along the path, in the order they form (onset and end in K; "
          "end NaN if the phase stays to the end of the curve).")
      .def_property_readonly("end_temperature", [](eq::ice_curve& c) { return c.end_temperature(); },
                             "Where the curve ends, K.")
      .def_property_readonly("end_reason", [](eq::ice_curve& c) { return eq::to_string(c.end_reason()); },
                             "'final_eutectic', 'salt_data_limit', 'search_limit', "
                             "'saturated_before_ice' or 'no_freezing_point'.")
      .def(
          "eutectic",
          [](eq::ice_curve& c) {
            const auto e = eq::eutectic_of(c);
            py::dict d;
            d["temperature"] = e.temperature;
            d["found"] = e.found;
            d["phase"] = e.phase;
            d["formula"] = e.formula;
            d["source"] = e.source;
            d["reason"] = e.reason;
            return d;
          },
          "Where the curve ends as a dict: temperature (K), found (a final eutectic), phase, "
          "formula and source of the salt whose saturation ends it, and reason.")
      .def(
          "table",
          [](eq::ice_curve& c, const array_in& temperature) {
            const auto n = static_cast<std::size_t>(temperature.size());
            const double* t = temperature.data();
            std::vector<eq::ice_curve_state> states;
            states.reserve(n);
            for (std::size_t i = 0; i < n; ++i) states.push_back(c.at(t[i]));
            const auto& salts = c.salts();  // the whole path: one column per salt phase
            auto column = [&](auto get) {
              py::array_t<double> a(static_cast<py::ssize_t>(n));
              double* o = a.mutable_data();
              for (std::size_t i = 0; i < n; ++i) o[i] = get(states[i]);
              return a;
            };
            py::dict d;
            d["temperature_K"] = column([](const eq::ice_curve_state& s) { return s.temperature; });
            py::list state;
            for (const auto& s : states) state.append(eq::to_string(s.state));
            d["state"] = state;
            d["ice_fraction"] = column([](const eq::ice_curve_state& s) { return s.ice_fraction(); });
            d["ice_kg"] = column([](const eq::ice_curve_state& s) { return s.ice; });
            d["unfrozen_water_kg"] = column([](const eq::ice_curve_state& s) { return s.unfrozen_water; });
            d["hydrate_water_kg"] = column([](const eq::ice_curve_state& s) { return s.hydrate_water; });
            d["water_activity"] = column([](const eq::ice_curve_state& s) { return s.water_activity; });
            for (std::size_t j = 0; j < salts.size(); ++j)
              d[py::str(salts[j].phase->name + "_mol")] = column([j](const eq::ice_curve_state& s) {
                return j < s.precipitated.size() ? s.precipitated[j] : 0.0;
              });
            return d;
          },
          py::arg("temperature"),
          "The curve at each temperature (K) as columns (a dict of arrays, units in the keys): "
          "state, ice fraction, ice, unfrozen and hydrate water (kg), a_w, and the amount of "
          "each salt phase crystallised (mol). ``pandas.DataFrame(curve.table(T))`` gives a table.")
      .def("at", &eq::ice_curve::at, py::arg("temperature"),
           "The state at ``temperature`` (K).")
      .def(
          "temperature_for_ice_fraction",
          [](eq::ice_curve& c, double fraction, const std::string& policy) {
            const auto v = eq::temperature_for_ice_fraction(
                c, fraction, colligate::range_policy_from_string(policy));
            return std::make_tuple(v.value, v.check.reason());
          },
          py::arg("ice_fraction"), py::arg("range_policy") = "extrapolate",
          "(temperature K, reason) at which the curve has ``ice_fraction`` (ice mass over all "
          "the water, in [0, 1)); a fraction the curve cannot reach raises ValueError naming "
          "the reachable range.")
      .def(
          "reachable_ice",
          [](eq::ice_curve& c) {
            const auto r = eq::reachable_ice_of(c);
            py::dict d;
            d["freezing_point_K"] = r.freezing_point;
            d["lowest_temperature_K"] = r.lowest_temperature;
            d["largest_ice_fraction"] = r.largest_fraction;
            d["end"] = r.end;
            return d;
          },
          "The span of the curve as a dict: freezing_point_K, lowest_temperature_K (where the "
          "curve ends), largest_ice_fraction (there) and end (why it ends there).")
      .def(
          "ice_fractions",
          [](eq::ice_curve& c,
             const array_in& temperature,
             const std::string& policy) {
            const auto pol = colligate::range_policy_from_string(policy);
            // The curve caches its path: keep the GIL (one Python thread per curve).
            return checked_over_array(
                temperature, [&](double T) { return eq::ice_fraction_of(c.at(T), pol); }, false);
          },
          py::arg("temperature"), py::arg("range_policy") = "extrapolate",
          "(ice fractions, first reason, count out of range) at each temperature (K).");
}

}  // namespace colligate_bindings
