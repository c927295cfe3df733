"""colligate: freezing points, water activity and ice-fraction curves of food solutions.

All quantities are SI: temperatures in K, masses in kg, amounts in mol, molalities in
mol per kg of water. The numerics live in the compiled module ``colligate._core``; this
package adds warnings, pandas tables, reports, plots and the ``colligate`` command.

Predictions are estimates: verify by measurement before relying on them for food
safety, and defer to local codes and licensed practice.
"""
from __future__ import annotations

try:
    from . import _core
except ImportError as exc:  # pragma: no cover - only without a build
    raise ImportError(
        "colligate's compiled module colligate._core is missing; install the package with "
        "'pip install .' from the source tree (it builds the C++ core)"
    ) from exc

from .batch import (  # noqa: E402,F401
    ROW_STATUS,
    RowStatus,
    BatchRowWarning,
    SolutionBatch,
    batch_freezing_point,
    batch_ice_fraction,
    batch_water_activity,
    seawater_freezing_point,
)
from . import fit  # noqa: E402,F401  (colligate.fit: fitting constants to your data)
from .fit import (  # noqa: E402,F401
    FitResult,
    SoluteLibrary,
    fit_effective_solute,
    fit_norrish,
    fit_pitzer,
    load_solute,
)

try:
    from ._version import __version__
except ImportError:  # pragma: no cover
    __version__ = _core.__version__

from .api import (  # noqa: E402,F401
    CAUTIONS,
    RANGE_POLICIES,
    ConvergenceError,
    InvalidInputError,
    OutOfValidityRangeError,
    OutOfValidityRangeWarning,
    IceCurve,
    IceCurveState,
    Solution,
    UnfrozenPhase,
    Validity,
    UnfrozenPhaseState,
    apparent_specific_heat,
    citation,
    citations,
    describe_model,
    enthalpy,
    eutectic,
    freezing_point,
    frozen_specific_heat_chen,
    heat_load,
    ice_fraction,
    temperature_for_ice_fraction,
    leighton_freezing_point,
    leighton_ice_fraction,
    mean_activity_coefficient, salt_equilibrium, salt_crystallisation_temperature, SupersaturatedWarning,
    models,
    osmotic_coefficient,
    pitzer_parameter_sets,
    single_salt_activity, single_salt_freezing_point, single_salt_molality, single_salt_parameters,
    weak_acids, acid_dissociation, acid_freezing_point,
    lactose_solubility, lactose_solubility_table,
    alcohol_by_volume_20c,
    ethanol_water_density_20c,
    max_msnf_for_lactose_in_solution,
    solutes,
    sweetness_table,
    unfrozen_phase,
    water_activity,
    water_activity_of_ice,
)
from .ingredients import Ingredient, ingredients  # noqa: E402
from . import uncertainty  # noqa: E402,F401  (colligate.uncertainty: predictions with their uncertainty)
from .uncertainty import PoorlyDeterminedFitWarning, UncertainValue  # noqa: E402,F401
from .library import Library, LibraryError  # noqa: E402
from .recipe import Recipe, SuspectUnitWarning  # noqa: E402
from . import storage  # noqa: E402,F401  (colligate.storage: glass transition, state diagram)
from .storage import StateDiagram, glass_transition, glass_transition_table, state_diagram  # noqa: E402
from .storage import solubility, crystallisation_check  # noqa: E402
from . import sorption  # noqa: E402,F401  (colligate.sorption: isotherms, mixed foods)
from .sorption import fit_gab, fit_bet, fit_oswin, moisture_equilibrium  # noqa: E402
from . import freezing_time  # noqa: E402,F401  (colligate.freezing_time: times and boiling points)
from .freezing_time import (  # noqa: E402,F401
    FREEZING_TIME_CAUTION,
    FreezingSimulation,
    boiling_point,
    boiling_point_elevation,
    brick_shape_factor,
    concentration_for_boiling_point,
    finite_cylinder_shape_factor,
    food_freezing_time,
    freezing_inputs,
    pham_estimate,
    pham_time,
    pham_times,
    plank_time,
    rod_shape_factor,
    saturation_pressure,
    saturation_temperature,
    simulate_freezing,
    thermal_properties,
)

__all__ = [
    "Solution", "IceCurve", "IceCurveState", "Validity", "RowStatus", "fit", "fit_norrish",
    "fit_pitzer", "fit_effective_solute", "FitResult", "SoluteLibrary", "load_solute",
    "SolutionBatch", "BatchRowWarning", "ROW_STATUS", "batch_freezing_point",
    "batch_water_activity", "batch_ice_fraction", "seawater_freezing_point", "UnfrozenPhaseState", "freezing_point",
    "water_activity", "osmotic_coefficient", "ice_fraction", "temperature_for_ice_fraction",
    "unfrozen_phase", "leighton_freezing_point", "leighton_ice_fraction", "solutes",
    "citations", "citation", "models", "describe_model", "water_activity_of_ice", "enthalpy",
    "apparent_specific_heat", "heat_load", "frozen_specific_heat_chen", "Ingredient",
    "ingredients", "Recipe", "Library", "LibraryError", "alcohol_by_volume_20c",
    "ethanol_water_density_20c", "max_msnf_for_lactose_in_solution", "SuspectUnitWarning",
    "eutectic", "mean_activity_coefficient", "pitzer_parameter_sets", "sweetness_table",
    "single_salt_activity", "single_salt_freezing_point", "single_salt_molality", "single_salt_parameters",
    "weak_acids", "acid_dissociation", "acid_freezing_point",
    "salt_equilibrium", "salt_crystallisation_temperature", "SupersaturatedWarning",
    "lactose_solubility", "lactose_solubility_table", "InvalidInputError",
    "OutOfValidityRangeError", "OutOfValidityRangeWarning", "ConvergenceError", "CAUTIONS",
    "RANGE_POLICIES", "FREEZING_TIME_CAUTION", "FreezingSimulation", "boiling_point",
    "boiling_point_elevation", "brick_shape_factor", "concentration_for_boiling_point",
    "finite_cylinder_shape_factor", "food_freezing_time", "freezing_inputs", "pham_estimate", "pham_time",
    "pham_times", "plank_time", "rod_shape_factor", "saturation_pressure",
    "saturation_temperature", "simulate_freezing", "thermal_properties", "__version__",
    "storage", "StateDiagram", "glass_transition", "glass_transition_table", "state_diagram",
    "solubility", "crystallisation_check", "sorption", "fit_gab", "fit_bet", "fit_oswin",
    "moisture_equilibrium", "uncertainty", "UncertainValue", "PoorlyDeterminedFitWarning",
]
