// Bindings for core/ and data/: errors, Solution, the solute and citation tables.
#include <pybind11/pybind11.h>
#include <pybind11/stl.h>

#include <sstream>

#include "colligate/batch/solution_batch.hpp"
#include "colligate/colligate.hpp"
#include "register.hpp"

namespace colligate_bindings {

/// One solute record as a dict (SI units, source keys); shared with register_fit.cpp.
py::dict solute_row(const colligate::data::solute_record& r) {
  py::dict d;
  d["id"] = r.id;
  d["name"] = r.name;
  d["formula"] = r.formula;
  d["aliases"] = r.aliases;
  d["molar_mass_kg_per_mol"] = r.molar_mass;
  d["molar_mass_source"] = r.molar_mass_source;
  d["kind"] = r.kind == colligate::data::solute_class::electrolyte ? "electrolyte" : "non_electrolyte";
  d["particles"] = r.particles;
  d["norrish_k"] = r.norrish.available ? py::cast(r.norrish.k) : py::none();
  d["norrish_k3"] = r.norrish.available ? py::cast(r.norrish.k3) : py::none();
  d["norrish_volume_ratio"] = r.norrish.available ? py::cast(r.norrish.volume_ratio) : py::none();
  d["norrish_k4"] = r.norrish.available ? py::cast(r.norrish.k4) : py::none();
  d["norrish_max_mass_fraction"] =
      r.norrish.available ? py::cast(r.norrish.max_mass_fraction) : py::none();
  d["norrish_source"] = r.norrish.k_source;
  d["norrish_higher_order_source"] = r.norrish.k3_source;
  d["norrish_note"] = r.norrish.note;
  return d;
}

namespace {

/// The caller's solute table (SoluteTable passed as table=), or the built-in one.
const colligate::data::solute_table& table_or_builtin(const colligate::data::solute_table* t) {
  return t ? *t : colligate::data::builtin_solutes();
}

py::dict citation_row(const colligate::data::citation& c) {
  py::dict d;
  d["key"] = c.key;
  d["authors"] = c.authors;
  d["year"] = c.year;
  d["title"] = c.title;
  d["container"] = c.container;
  d["identifier"] = c.identifier;
  d["detail"] = c.detail;
  return d;
}

}  // namespace

void register_core(py::module_& m) {
  using colligate::solution;
  py::register_exception<colligate::invalid_input>(m, "InvalidInputError", PyExc_ValueError);
  py::register_exception<colligate::out_of_validity_range>(m, "OutOfValidityRangeError",
                                                           PyExc_ValueError);
  py::register_exception<colligate::convergence_error>(m, "ConvergenceError", PyExc_RuntimeError);

  bound_class<colligate::validity>(m, "Validity")
      .def_property_readonly("code", [](const colligate::validity& v) { return colligate::to_string(v.code); })
      .def_property_readonly("in_range", &colligate::validity::in_range)
      .def_property_readonly("where", &colligate::validity::where,
                             "The model or function that checked.")
      .def_property_readonly("quantity", &colligate::validity::quantity)
      .def_readonly("value", &colligate::validity::value, "Value of the quantity (SI, NaN if none).")
      .def_readonly("limit", &colligate::validity::limit, "The bound crossed (NaN if none).")
      .def_readonly("range_low", &colligate::validity::range_low)
      .def_readonly("range_high", &colligate::validity::range_high)
      .def_property_readonly("source", &colligate::validity::source, "Citation key of the limit.")
      .def_property_readonly("note", &colligate::validity::note)
      .def_property_readonly("reason", &colligate::validity::reason)
      .def("__repr__", [](const colligate::validity& v) {
        return "Validity(" + std::string(colligate::to_string(v.code)) +
               (v.in_range() ? "" : ": " + v.reason()) + ")";
      });


  bound_class<solution>(m, "Solution")
      .def(py::init([](double water, const py::object& solutes,
                       const colligate::data::solute_table* table) {
             return solution::from_masses(water, to_named_amounts(solutes, "solutes"),
                                          table_or_builtin(table));
           }),
           py::arg("water"), py::arg("solutes") = py::dict(), py::kw_only(),
           py::arg("table") = nullptr)
      .def_static(
          "from_mass_fractions",
          [](const py::object& fractions, double total_mass,
             const colligate::data::solute_table* table) {
            return solution::from_mass_fractions(to_named_amounts(fractions, "fractions"),
                                                 total_mass, table_or_builtin(table));
          },
          py::arg("fractions"), py::arg("total_mass") = 1.0, py::kw_only(),
          py::arg("table") = nullptr, R"doc(
Solution from solute mass fractions; the rest of ``total_mass`` (kg) is water.

Parameters
----------
fractions : mapping of str to float
    Mass fraction of each solute, each in [0, 1), summing to less than 1.
total_mass : float
    Total mass of the solution, kg.
)doc")
      .def_static(
          "from_molalities",
          [](const py::object& molalities, double water,
             const colligate::data::solute_table* table) {
            return solution::from_molalities(to_named_amounts(molalities, "molalities"), water,
                                             table_or_builtin(table));
          },
          py::arg("molalities"), py::arg("water") = 1.0, py::kw_only(),
          py::arg("table") = nullptr, R"doc(
Solution from molalities, mol per kg of water, with ``water`` kg of water.
)doc")
      .def_static(
          "from_mole_fractions",
          [](const py::object& fractions, const colligate::data::solute_table* table) {
            return solution::from_mole_fractions(to_named_amounts(fractions, "fractions"),
                                                 table_or_builtin(table));
          },
          py::arg("fractions"), py::kw_only(), py::arg("table") = nullptr, R"doc(
Solution from solute mole fractions (formula units, undissociated); rest is water.
)doc")
      .def_static("from_brix", [](double brix) { return solution::from_brix(brix); },
                  py::arg("brix"), "Sucrose solution of the given Brix (mass percent sucrose), 1 kg.")
      .def_property_readonly("water", &solution::water_mass, "Mass of water, kg.")
      .def_property_readonly("total_mass", &solution::total_mass, "Total mass, kg.")
      .def_property_readonly("brix", &solution::brix,
                             "Total dissolved solids, mass percent (equals Brix for sucrose only).")
      .def_property_readonly("ionic_strength", [](const solution& s) { return s.ionic_strength(); },
                             "Ionic strength, mol/kg (complete dissociation).")
      .def_property_readonly(
          "species", [](const solution& s) {
            std::vector<std::string> ids;
            for (const auto& r : s.species()) ids.push_back(r.id);
            return ids;
          },
          "Solute ids, in the order given.")
      .def_property_readonly(
          "solutes", [](const solution& s) {
            py::dict d;
            for (std::size_t i = 0; i < s.size(); ++i) d[py::str(s.species()[i].id)] = s.solute_mass(i);
            return d;
          },
          "Mass of each solute, kg.")
      .def_property_readonly(
          "moles", [](const solution& s) {
            py::dict d;
            for (std::size_t i = 0; i < s.size(); ++i) d[py::str(s.species()[i].id)] = s.moles()[i];
            return d;
          },
          "Amount of each solute, mol (formula units).")
      .def(
          "molalities", [](const solution& s) {
            py::dict d;
            for (std::size_t i = 0; i < s.size(); ++i) d[py::str(s.species()[i].id)] = s.molality(i);
            return d;
          },
          "Molality of each solute, mol per kg of water.")
      .def(
          "mass_fractions", [](const solution& s) {
            py::dict d;
            d["water"] = s.water_mass_fraction();
            for (std::size_t i = 0; i < s.size(); ++i)
              d[py::str(s.species()[i].id)] = s.mass_fraction(i);
            return d;
          },
          "Mass fraction of water and of each solute.")
      .def(
          "mole_fractions", [](const solution& s) {
            py::dict d;
            d["water"] = s.water_mole_fraction();
            for (std::size_t i = 0; i < s.size(); ++i)
              d[py::str(s.species()[i].id)] = s.mole_fraction(i);
            return d;
          },
          "Mole fraction of water and of each solute (formula units, undissociated).")
      .def("with_water", &solution::with_water, py::arg("water"),
           "The same solutes with ``water`` kg of water.")
      .def("__repr__", [](const solution& s) {
        std::ostringstream os;
        os.precision(6);
        os << "Solution(water=" << s.water_mass() << " kg";
        for (std::size_t i = 0; i < s.size(); ++i)
          os << ", " << s.species()[i].id << "=" << s.solute_mass(i) << " kg";
        os << ")";
        return os.str();
      });

  m.def(
      "solute_table", [] {
        py::list rows;
        for (const auto& r : colligate::data::builtin_solutes().records()) rows.append(solute_row(r));
        return rows;
      },
      "The built-in solute table as a list of dicts (SI units, with source keys).");
  m.def(
      "citation_table", [] {
        py::list rows;
        for (const auto& c : colligate::data::citations()) rows.append(citation_row(c));
        return rows;
      },
      "All sources cited by the built-in data, as a list of dicts.");
  m.def(
      "citation", [](const std::string& key) { return citation_row(colligate::data::find_citation(key)); },
      py::arg("key"), "One source of the citation table by key.");
  m.def("models", [] {
    std::vector<std::string> ids;
    for (const auto& id : colligate::models::builtin_models().ids()) ids.push_back(id);
    return ids;
  }, "Ids of the activity models.");
  m.def("model_summaries", [] {
    py::list rows;
    for (const auto& d : colligate::models::builtin_models().models()) {
      py::dict row;
      row["id"] = d.id;
      row["summary"] = d.summary;
      row["temperature_dependent"] = d.traits.temperature_dependent;
      row["ion_activities"] = d.traits.ion_activities;
      py::list limits;  // the validated range the model's check() applies
      for (const auto& l : d.validated_range) {
        py::dict limit;
        limit["quantity"] = l.quantity;
        limit["unit"] = l.unit;
        limit["low"] = l.low;
        limit["high"] = l.high;
        limit["basis"] = l.basis;
        limit["source"] = l.source;
        limit["per_solute"] = l.per_solute;
        limits.append(limit);
      }
      row["validated_range"] = limits;
      rows.append(row);
    }
    return rows;
  }, "The registry's models as dicts: id, summary (equation and sources), temperature_dependent, "
     "ion_activities, validated_range (list of dicts: quantity, unit, low, high (NaN: no limit), "
     "basis, source key, per_solute: where each solute's own limit is kept).");
  m.def(
      "describe_model",
      [](const solution& s, const std::string& model, const std::string& parameter_set) {
        return colligate::models::describe_model(s, model_with_set(model, parameter_set));
      },
      py::arg("solution"), py::arg("model") = "auto", py::arg("parameter_set") = "",
      "Which model and constants a calculation on this solution uses.");
  m.attr("CRYOSCOPIC_CONSTANT") = colligate::constants::cryoscopic_constant;
  m.attr("ICE_POINT") = colligate::constants::ice_point;
  m.attr("GAS_CONSTANT") = colligate::constants::gas_constant;
  m.attr("MOLAR_MASS_WATER") = colligate::constants::molar_mass_water;
}

}  // namespace colligate_bindings
