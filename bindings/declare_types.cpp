// Every class bound in colligate._core, declared with its name and docstring before any
// function or method is defined (module.cpp calls this first). Signatures then name every
// type whatever order the register_<area> functions run in; each area adds its methods to
// the declared class through bound_class<T>(). No physics here.
#include <pybind11/pybind11.h>

#include "colligate/batch/solution_batch.hpp"
#include "colligate/colligate.hpp"
#include "colligate/fit/fitters.hpp"
#include "colligate/fit/levenberg_marquardt.hpp"
#include "register.hpp"

namespace colligate_bindings {

void declare_types(py::module_& m) {
  py::class_<colligate::batch::solution_batch>(m, "SolutionBatchCore",
    "Many solutions with one species list (molalities, mol/kg water).");
  py::class_<colligate::validity>(m, "Validity",
    "Which limit a result crossed, as a record (code 'in_range' when none); ``reason`` is "
    "its text.");
  py::class_<colligate::solution>(m, "Solution",
    R"doc(
An aqueous solution: kilograms of water plus moles of each solute. Immutable.

Parameters
----------
water : float
    Mass of water, kg (> 0).
solutes : mapping of str to float
    Mass of each solute, kg (>= 0). Names are case-insensitive; ids, common names,
    formulas and aliases are accepted ("sucrose", "NaCl", "dextrose").
table : SoluteTable, optional (keyword)
    Where solute names are looked up (default: the built-in table). Every factory takes
    it; use ``colligate.fit.SoluteLibrary`` to add fitted solutes to the built-ins.
)doc");
  py::class_<colligate::equilibria::leighton::mix_terms>(m, "LeightonTerms",
    "Inputs of the Leighton dairy method, g per 100 g of mix.");
  py::class_<colligate::fit::fit_result>(m, "FitResult",
    R"doc(
Result of a least-squares fit (SI units of the fitted model).

Non-convergence is a status, not an exception: check ``success`` or ``status``.
)doc");
  py::class_<colligate::data::solute_record>(m, "SoluteRecord",
    "One solute: identity, molar mass, model constants.");
  py::class_<colligate::data::solute_table>(m, "SoluteTable",
    R"doc(
A set of solute records with name resolution. ``SoluteTable()`` starts from the built-in
table; pass one to the ``table=`` argument of the Solution factories to use fitted solutes.
)doc");
  py::class_<colligate::equilibria::ice_curve_state>(m, "IceCurveState",
    "A solution on its ice curve at one temperature (SI: K, kg, mol).");
  py::class_<colligate::equilibria::ice_curve>(m, "IceCurve",
    R"doc(
The ice curve of one solution under one activity model, prepared once.

Knows the initial freezing point and the solid phases along the freezing path (ice, then
each salt or salt hydrate as the unfrozen brine saturates in it), and answers for any
temperature (K): phase state, ice, salts crystallised, the unfrozen liquid, a_w.

Parameters
----------
solution : Solution
model : str
    Activity model id ('auto' chooses for the solutes present).
bound_water : float
    Water that cannot freeze, kg (same scale as the solution's water).
path : str
    'equilibrium' (crystallised salts stay in contact with the brine and may
    redissolve) or 'fractional' (each salt is removed as it forms).
)doc");
  py::enum_<colligate::batch::row_status>(m, "RowStatus",
                                          "Outcome of one row of a batch calculation (the code "
                                          "stored in status arrays).")
      .value("ok", colligate::batch::row_status::ok)
      .value("out_of_range", colligate::batch::row_status::out_of_range)
      .value("invalid_input", colligate::batch::row_status::invalid_input)
      .value("no_freezing_point", colligate::batch::row_status::no_freezing_point)
      .value("not_converged", colligate::batch::row_status::not_converged)
      .value("below_curve_end", colligate::batch::row_status::below_curve_end)
      .value("no_physical_value", colligate::batch::row_status::no_physical_value);
}

}  // namespace colligate_bindings
