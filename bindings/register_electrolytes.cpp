// Bindings for the electrolyte additions: seawater, mean activity coefficients, Pitzer
// parameter sets, eutectics and salt saturation. No physics here.
#include <pybind11/pybind11.h>
#include <pybind11/stl.h>

#include <string>
#include <tuple>
#include <vector>

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
      "single_salt_activity",
      [](const std::string& salt, const std::vector<double>& molality, double T) {
        std::vector<double> phi, ln_gamma, aw;
        std::string reason;
        for (double m : molality) {
          const auto r = colligate::models::single_salt::evaluate(salt, m, T);
          phi.push_back(r.osmotic_coefficient);
          ln_gamma.push_back(r.ln_mean_activity_coefficient);
          aw.push_back(r.water_activity);
          if (reason.empty()) reason = r.reason;
        }
        return std::make_tuple(phi, ln_gamma, aw, reason);
      },
      py::arg("salt"), py::arg("molality"), py::arg("temperature"),
      "(osmotic coefficients, ln mean activity coefficients, water activities, first range "
      "reason) of one salt of data/single_salt_pitzer.hpp in water at each molality (mol/kg), "
      "closed binary Pitzer form with the salt's row whose window holds T.");
  m.def(
      "single_salt_freezing_point",
      [](const std::string& salt, const std::vector<double>& molality) {
        std::vector<double> tf;
        std::string set, reason;
        for (double m : molality) {
          const auto r = colligate::models::single_salt::freezing_point(salt, m);
          tf.push_back(r.temperature);
          set = r.parameter_set;
          if (reason.empty()) reason = r.reason;
        }
        return std::make_tuple(tf, set, reason);
      },
      py::arg("salt"), py::arg("molality"),
      "(freezing temperatures K, parameter set, first range reason) of one salt of "
      "data/single_salt_pitzer.hpp at each molality (mol/kg), by its ice-line row.");
  m.def(
      "single_salt_molality",
      [](const std::string& salt, const std::vector<double>& mass_fraction) {
        std::vector<double> out;
        out.reserve(mass_fraction.size());
        for (double w : mass_fraction)
          out.push_back(colligate::models::single_salt::molality_from_mass_fraction(salt, w));
        return out;
      },
      py::arg("salt"), py::arg("mass_fraction"),
      "Molalities (mol/kg of water) of one salt of data/single_salt_pitzer.hpp from its mass "
      "fractions in solution (anhydrous salt, kg/kg, in [0, 1)).");
  m.def(
      "single_salt_closed_form_freezing_point",
      [](int cation_charge, int anion_charge, int cation_count, int anion_count, double beta0,
         double beta1, double cphi, const std::vector<double>& molality) {
        auto p = colligate::data::single_salt_shape(cation_charge, anion_charge, cation_count,
                                                    anion_count);
        p.beta0 = beta0;
        p.beta1 = beta1;
        p.cphi = cphi;
        std::vector<double> tf;
        for (double m : molality) {
          if (!std::isfinite(m) || m < 0.0)
            throw colligate::invalid_input(colligate::detail::describe(
                "single_salt_closed_form_freezing_point", "molality", m, "must be finite and >= 0"));
          tf.push_back(colligate::models::single_salt::freezing_temperature_closed_form(p, m));
        }
        return tf;
      },
      py::arg("cation_charge"), py::arg("anion_charge"), py::arg("cation_count"),
      py::arg("anion_count"), py::arg("beta0"), py::arg("beta1"), py::arg("cphi"),
      py::arg("molality"),
      "Freezing temperatures (K) of a salt of the given charges and counts with Pitzer "
      "parameters beta0, beta1, C-phi (alpha1 = 2) held constant, at each molality (mol/kg); "
      "no table row, no checks of range (for fits and their checks).");
  m.def(
      "single_salt_table",
      [] {
        py::list rows;
        for (const auto& r : colligate::data::single_salt_table()) {
          py::dict d;
          d["id"] = r.id;
          d["name"] = r.name;
          d["formula"] = r.formula;
          d["cation_charge"] = r.cation_charge;
          d["anion_charge"] = r.anion_charge;
          d["cation_count"] = r.cation_count;
          d["anion_count"] = r.anion_count;
          d["molar_mass_kg_per_mol"] = r.molar_mass;
          d["beta0"] = r.beta0;
          d["beta1"] = r.beta1;
          d["beta2"] = r.beta2;
          d["cphi"] = r.cphi;
          d["alpha1"] = r.alpha1;
          d["alpha2"] = r.alpha2;
          d["max_molality"] = r.max_molality;
          d["source"] = r.source;
          d["parameter_set"] = r.parameter_set;
          d["min_temperature_K"] = r.min_temperature;
          d["max_temperature_K"] = r.max_temperature;
          rows.append(d);
        }
        return rows;
      },
      "The rows of the single-salt Pitzer table, one dict each.");
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

  // Weak acids (data/weak_acids.hpp, equilibria/weak_acid_dissociation.hpp).
  const auto speciation_dict = [](const eq::weak_acid_speciation& r) {
    py::dict d;
    d["acid"] = r.acid;
    d["temperature_K"] = r.temperature;
    d["acid_molality_mol_per_kg"] = r.acid_molality;
    d["pka"] = r.pka;
    d["fractions"] = r.fractions;
    d["degree_of_dissociation"] = r.degree_of_dissociation;
    d["hydrogen_ion_molality_mol_per_kg"] = r.hydrogen_ion_molality;
    d["hydroxide_molality_mol_per_kg"] = r.hydroxide_molality;
    d["ionic_strength_mol_per_kg"] = r.ionic_strength;
    d["ln_gamma_univalent"] = r.ln_gamma_univalent;
    d["ph"] = r.ph;
    d["particle_molality_mol_per_kg"] = r.particle_molality;
    d["temperature_function"] = r.temperature_function;
    d["converged"] = r.status == colligate::root_status::converged;
    d["reason"] = r.check.reason();
    return d;
  };
  m.def(
      "weak_acids",
      [] {
        py::list out;
        for (const auto& a : colligate::data::weak_acids()) {
          for (std::size_t j = 0; j < a.steps.size(); ++j) {
            const auto& st = a.steps[j];
            py::dict d;
            d["acid"] = a.id;
            d["name"] = a.name;
            d["step"] = static_cast<int>(j + 1);
            d["pka_25c"] = st.pka_25c;
            d["pka_at_298_15_K"] = st.pka(298.15);
            d["temperature_function"] = st.temperature_function;
            d["min_temperature_K"] = st.min_temperature;
            d["max_temperature_K"] = st.max_temperature;
            d["source"] = st.source;
            d["norrish_k_undissociated"] = a.norrish_k_undissociated;
            d["norrish_k_source"] = a.norrish_k_source;
            d["norrish_k_fit_worst_deviation_K"] = a.norrish_k_fit_worst_deviation;
            d["note"] = a.note;
            out.append(d);
          }
        }
        return out;
      },
      "The dissociation steps of the built-in weak acids, one dict per step, with sources.");
  m.def(
      "acid_dissociation",
      [speciation_dict](const std::string& acid, double molality, double T,
                        double background_ionic_strength, const std::string& activity) {
        if (activity != "debye_huckel" && activity != "ideal")
          throw colligate::invalid_input("activity = '" + activity +
                                         "': valid values are 'debye_huckel' and 'ideal'");
        const auto& a = colligate::data::weak_acid_by_id(acid);
        colligate::models::check_temperature_argument("acid_dissociation", T);
        eq::weak_acid_speciation r;
        {
          py::gil_scoped_release release;
          r = eq::speciate_weak_acid(a, molality, T, background_ionic_strength,
                                     activity == "ideal" ? eq::ion_activity::ideal
                                                         : eq::ion_activity::debye_huckel);
        }
        return speciation_dict(r);
      },
      py::arg("acid"), py::arg("molality"), py::arg("temperature") = 298.15,
      py::arg("background_ionic_strength") = 0.0, py::arg("activity") = "debye_huckel",
      "Speciation of a weak acid (dict; equilibria/weak_acid_dissociation.hpp).");
  m.def(
      "weak_acid_freezing_point",
      [speciation_dict](const std::string& acid, double molality, py::object norrish_k) {
        const auto& a = colligate::data::weak_acid_by_id(acid);
        const double k = norrish_k.is_none() ? a.norrish_k_undissociated : norrish_k.cast<double>();
        if (!std::isfinite(k))
          throw colligate::invalid_input("acid = '" + acid +
                                         "': no Norrish constant of the undissociated acid has "
                                         "been fitted (give norrish_k)");
        if (!(std::isfinite(molality) && molality > 0.0))
          throw colligate::invalid_input(colligate::detail::describe(
              "weak_acid_freezing_point", "molality", molality, "must be finite and > 0 mol/kg"));
        eq::weak_acid_freezing_result r;
        {
          py::gil_scoped_release release;
          r = eq::weak_acid_freezing_point(a, molality, k);
        }
        py::dict d;
        d["temperature_K"] = r.temperature;
        d["converged"] = r.status == colligate::root_status::converged;
        d["norrish_k_undissociated"] = k;
        d["reason"] = r.check.reason();
        d["speciation"] = r.status == colligate::root_status::no_sign_change
                              ? py::object(py::none())
                              : py::object(speciation_dict(r.speciation));
        return d;
      },
      py::arg("acid"), py::arg("molality"), py::arg("norrish_k") = py::none(),
      "Freezing point (K) of a binary solution of a weak acid with the acid split into its "
      "forms, as a dict (equilibria/weak_acid_dissociation.hpp).");
}

}  // namespace colligate_bindings
