// Bindings for the electrolyte additions: seawater, mean activity coefficients, Pitzer
// parameter sets, eutectics and salt saturation. No physics here.
#include <pybind11/pybind11.h>
#include <pybind11/stl.h>

#include <string>
#include <tuple>

#include "colligate/colligate.hpp"
#include "register.hpp"

namespace colligate_bindings {

void register_electrolytes(py::module_& m) {
  using colligate::solution;
  namespace eq = colligate::equilibria;

  m.attr("Solution").attr("seawater") = py::module_::import("builtins").attr("staticmethod")(
      py::cpp_function([](double absolute_salinity) { return solution::seawater(absolute_salinity); },
                       py::arg("absolute_salinity"),
                       "Seawater of the TEOS-10 Reference Composition (Millero et al. 2008) with "
                       "absolute salinity ``absolute_salinity`` (g of sea salt per kg of "
                       "seawater), 1 kg in total, written as the salts KCl, CaCl2, MgCl2, "
                       "Na2SO4 and NaCl."));

  m.def("pitzer_parameter_sets", [] { return colligate::data::pitzer_parameter_set_ids(); },
        "Ids of the Pitzer parameter sets; the first is the default.");
  m.def(
      "pitzer_parameter_set_range",
      [](const std::string& id) {
        const auto& s = colligate::data::find_pitzer_parameter_set(id);
        return std::make_tuple(s.min_temperature, s.max_temperature, s.description, s.range_source);
      },
      py::arg("parameter_set"),
      "(T min K, T max K, description, source key) of a Pitzer parameter set.");
  m.def(
      "mean_activity_coefficient",
      [](const solution& s, const std::string& solute, double T, const std::string& set_id) {
        const auto& set = colligate::data::find_pitzer_parameter_set(set_id);
        const auto& rec = colligate::data::builtin_solutes().find(solute);
        const auto i = s.index_of(rec.id);
        if (i >= s.size())
          throw colligate::invalid_input("mean_activity_coefficient: solute '" + solute +
                                         "' is not in the solution");
        colligate::models::check_temperature_argument("mean_activity_coefficient", T);
        colligate::models::pitzer::require_binaries(s, set);
        const double v = std::exp(colligate::models::pitzer::ln_mean_activity_coefficient(
            s, i, s.water_mass(), T, set));
        return std::make_tuple(v, colligate::models::pitzer::check(s, s.water_mass(), T, set).reason());
      },
      py::arg("solution"), py::arg("solute"), py::arg("temperature"),
      py::arg("parameter_set") = "harvie_spencer_icefit");
  m.def(
      "pitzer_osmotic_coefficient",
      [](const solution& s, double T, const std::string& set_id) {
        const auto& set = colligate::data::find_pitzer_parameter_set(set_id);
        colligate::models::check_temperature_argument("pitzer_osmotic_coefficient", T);
        colligate::models::pitzer::require_binaries(s, set);
        const double mp = colligate::models::ideal::particle_molality(s, s.water_mass());
        const double lnaw = colligate::models::pitzer::ln_water_activity(s, s.water_mass(), T, set);
        const double phi = mp > 0.0 ? -lnaw / (colligate::constants::molar_mass_water * mp) : 1.0;
        return std::make_tuple(phi, colligate::models::pitzer::check(s, s.water_mass(), T, set).reason());
      },
      py::arg("solution"), py::arg("temperature"), py::arg("parameter_set") = "harvie_spencer_icefit");
  m.def(
      "eutectic",
      [](const solution& s, const std::string& model, double bound_fraction,
         const std::string& parameter_set) {
        const auto choice = model_with_set(model, parameter_set);
        eq::eutectic_result r;
        {
          py::gil_scoped_release release;
          r = eq::eutectic(s, choice,
                           colligate::bound_water_kg(s, bound_fraction, "eutectic"));
        }
        return std::make_tuple(r.temperature, r.found, r.phase, r.formula, r.source, r.reason);
      },
      py::arg("solution"), py::arg("model") = "auto", py::arg("bound_water_fraction_of_water") = 0.0,
      py::arg("parameter_set") = "",
      "(temperature K, found, phase, formula, source key, reason) of the eutectic.");
  m.def(
      "salt_equilibrium",
      [](const solution& s, double T, const std::string& model, const std::string& parameter_set) {
        const auto choice = model_with_set(model, parameter_set);
        eq::salt_equilibrium_state r;
        {
          py::gil_scoped_release release;
          r = eq::salt_equilibrium(s, T, choice);
        }
        py::dict d;
        d["temperature_K"] = r.temperature;
        d["supersaturated"] = r.supersaturated;
        d["phase"] = r.phase ? py::object(py::str(r.phase->name)) : py::object(py::none());
        d["formula"] = r.phase ? py::object(py::str(r.phase->formula)) : py::object(py::none());
        d["phase_source"] = r.phase ? py::object(py::str(r.phase->source)) : py::object(py::none());
        d["saturation_index"] = r.saturation_index;
        d["precipitated_mol"] = r.precipitated;
        d["liquid_water_kg"] = r.liquid_water;
        d["water_activity"] = r.water_activity;
        d["metastable_water_activity"] = r.metastable_water_activity;
        d["also_supersaturated"] =
            r.also_supersaturated ? py::object(py::str(r.also_supersaturated->name)) : py::object(py::none());
        d["reason"] = r.check.reason();
        return d;
      },
      py::arg("solution"), py::arg("temperature"), py::arg("model") = "auto", py::arg("parameter_set") = "",
      "The state of ``solution`` at ``temperature`` (K) with salts allowed to crystallise "
      "(no ice), as a dict (equilibria/salt_equilibrium.hpp).");
  m.def(
      "salt_crystallisation_temperature",
      [](const solution& s, const std::string& model, const std::string& parameter_set) {
        const auto choice = model_with_set(model, parameter_set);
        eq::salt_crystallisation r;
        {
          py::gil_scoped_release release;
          r = eq::salt_crystallisation_temperature(s, choice);
        }
        py::dict d;
        d["temperature_K"] = r.temperature;
        d["phase"] = r.phase ? py::object(py::str(r.phase->name)) : py::object(py::none());
        d["formula"] = r.phase ? py::object(py::str(r.phase->formula)) : py::object(py::none());
        d["phase_source"] = r.phase ? py::object(py::str(r.phase->source)) : py::object(py::none());
        d["above_data"] = r.above_data;
        d["reason"] = r.reason;
        return d;
      },
      py::arg("solution"), py::arg("model") = "auto", py::arg("parameter_set") = "",
      "Temperature (K) at which ``solution`` first crystallises a salt on cooling, without "
      "ice, with the phase, as a dict (equilibria/salt_equilibrium.hpp).");
}

}  // namespace colligate_bindings
