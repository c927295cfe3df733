"""
colligate compiled core: activity models, ice equilibrium, freezing points.
"""
from __future__ import annotations
import collections.abc
import numpy
import numpy.typing
import typing
__all__: list[str] = ['CRYOSCOPIC_CONSTANT', 'ConvergenceError', 'ENTHALPY_REFERENCE_TEMPERATURE', 'ETHANOL_DENSITY_20C', 'FitResult', 'GAS_CONSTANT', 'ICE_POINT', 'IceCurve', 'IceCurveState', 'InvalidInputError', 'LeightonTerms', 'MOLAR_MASS_WATER', 'OutOfValidityRangeError', 'RowStatus', 'SoluteRecord', 'SoluteTable', 'Solution', 'SolutionBatchCore', 'UnfrozenPhaseState', 'Validity', 'acid_dissociation', 'alcohol_by_volume_20c', 'batch_freezing_points', 'batch_ice_fractions', 'batch_predictions_with_uncertainty', 'batch_water_activities', 'boiling_point', 'brick_shape_factor', 'chen_frozen_specific_heat', 'citation', 'citation_table', 'component_specific_heat', 'concentration_for_boiling_point', 'correlation_matrix', 'coverage_factor', 'crystallisation_check', 'curve_fit', 'describe_model', 'effective_solute_record', 'enthalpy_of_fusion', 'ethanol_water_density_20c', 'eutectic', 'finite_cylinder_shape_factor', 'fit_effective_solute_freezing', 'fit_effective_solute_ice_curve', 'fit_isotherm', 'fit_norrish_freezing_point', 'fit_norrish_water_activity', 'fit_pitzer_freezing_point', 'fit_pitzer_osmotic_coefficient', 'fit_pitzer_water_activity', 'fit_single_salt_freezing_point', 'food_apparent_specific_heat', 'food_enthalpy', 'food_freezing_inputs', 'food_freezing_time_uncertainty', 'food_heat_load', 'food_properties', 'food_thermal_uncertainty', 'freezing_point', 'glass_curve', 'glass_transition', 'glass_transition_table', 'ice_fraction', 'ice_vapour_pressure', 'isosteric_heat', 'isotherm_moisture', 'isotherm_range_reason', 'isotherm_water_activity', 'lactose_initial_solubility', 'lactose_mutarotation_ratio', 'lactose_solubility', 'lactose_solubility_table', 'latent_heat_of_fusion', 'leighton_depression', 'leighton_freezing_point', 'leighton_ice_fraction', 'leighton_terms', 'liquid_vapour_pressure', 'liquidus_curve', 'ln_water_activity_of_ice', 'make_pitzer_solute_record', 'make_solute_record', 'max_msnf_for_lactose_in_solution', 'maximal_freeze_concentration', 'mean_activity_coefficient', 'model_summaries', 'models', 'moisture_equilibrium', 'norrish_solute_record', 'osmotic_coefficient', 'pham_estimate', 'pham_time_uncertainty', 'pham_times', 'pitzer_osmotic_coefficient', 'pitzer_parameter_set_range', 'pitzer_parameter_sets', 'pitzer_solute_record', 'plank_time', 'plank_time_uncertainty', 'propagate_uncertainty', 'record_with_uncertainty', 'rod_shape_factor', 'row_status_reasons', 'salt_crystallisation_temperature', 'salt_equilibrium', 'saturation_pressure', 'saturation_temperature', 'seawater_freezing_points', 'shift_water_activity', 'simulate_food', 'simulate_food_time_uncertainty', 'simulate_material', 'single_salt_activity', 'single_salt_closed_form_freezing_point', 'single_salt_freezing_point', 'single_salt_molality', 'single_salt_table', 'solute_table', 'sugar_solubility', 'sugar_solubility_curves', 'sweetness_table', 'temperature_for_ice_fraction', 'uncertainty_statements', 'unfrozen_phase', 'unfrozen_specific_heat', 'water_activity', 'water_activity_growth_limits', 'water_activity_of_ice', 'water_glass_transition_temperature', 'weak_acid_freezing_point', 'weak_acids']
class SolutionBatchCore:
    """
    Many solutions with one species list (molalities, mol/kg water).
    """
    @staticmethod
    def from_mass_fractions(species: collections.abc.Sequence[str], mass_fractions: typing.Annotated[numpy.typing.ArrayLike, numpy.float64], table: SoluteTable = None) -> SolutionBatchCore:
        ...
    @staticmethod
    def from_molalities(species: collections.abc.Sequence[str], molalities: typing.Annotated[numpy.typing.ArrayLike, numpy.float64], table: SoluteTable = None) -> SolutionBatchCore:
        ...
    @property
    def rows(self) -> int:
        ...
    @property
    def species(self) -> list[str]:
        ...
class Validity:
    """
    Which limit a result crossed, as a record (code 'in_range' when none); ``reason`` is its text.
    """
    def __repr__(self) -> str:
        ...
    @property
    def code(self) -> str:
        ...
    @property
    def in_range(self) -> bool:
        ...
    @property
    def limit(self) -> float:
        """
        The bound crossed (NaN if none).
        """
    @property
    def note(self) -> str:
        ...
    @property
    def quantity(self) -> str:
        ...
    @property
    def range_high(self) -> float:
        ...
    @property
    def range_low(self) -> float:
        ...
    @property
    def reason(self) -> str:
        ...
    @property
    def source(self) -> str:
        """
        Citation key of the limit.
        """
    @property
    def value(self) -> float:
        """
        Value of the quantity (SI, NaN if none).
        """
    @property
    def where(self) -> str:
        """
        The model or function that checked.
        """
class Solution:
    """
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
    """
    @staticmethod
    def from_brix(brix: typing.SupportsFloat | typing.SupportsIndex) -> Solution:
        """
        Sucrose solution of the given Brix (mass percent sucrose), 1 kg.
        """
    @staticmethod
    def from_mass_fractions(fractions: typing.Any, total_mass: typing.SupportsFloat | typing.SupportsIndex = 1.0, *, table: SoluteTable = None) -> Solution:
        """
        Solution from solute mass fractions; the rest of ``total_mass`` (kg) is water.
        
        Parameters
        ----------
        fractions : mapping of str to float
            Mass fraction of each solute, each in [0, 1), summing to less than 1.
        total_mass : float
            Total mass of the solution, kg.
        """
    @staticmethod
    def from_molalities(molalities: typing.Any, water: typing.SupportsFloat | typing.SupportsIndex = 1.0, *, table: SoluteTable = None) -> Solution:
        """
        Solution from molalities, mol per kg of water, with ``water`` kg of water.
        """
    @staticmethod
    def from_mole_fractions(fractions: typing.Any, *, table: SoluteTable = None) -> Solution:
        """
        Solution from solute mole fractions (formula units, undissociated); rest is water.
        """
    @staticmethod
    def seawater(*args, **kwargs):
        """
        (absolute_salinity: typing.SupportsFloat | typing.SupportsIndex) -> colligate._core.Solution
        
        Seawater of the TEOS-10 Reference Composition (Millero et al. 2008) with absolute salinity ``absolute_salinity`` (g of sea salt per kg of seawater), 1 kg in total, written as the salts KCl, CaCl2, MgCl2, Na2SO4 and NaCl.
        """
    def __init__(self, water: typing.SupportsFloat | typing.SupportsIndex, solutes: typing.Any = {}, *, table: SoluteTable = None) -> None:
        ...
    def __repr__(self) -> str:
        ...
    def mass_fractions(self) -> dict:
        """
        Mass fraction of water and of each solute.
        """
    def molalities(self) -> dict:
        """
        Molality of each solute, mol per kg of water.
        """
    def mole_fractions(self) -> dict:
        """
        Mole fraction of water and of each solute (formula units, undissociated).
        """
    def with_water(self, water: typing.SupportsFloat | typing.SupportsIndex) -> Solution:
        """
        The same solutes with ``water`` kg of water.
        """
    @property
    def brix(self) -> float:
        """
        Total dissolved solids, mass percent (equals Brix for sucrose only).
        """
    @property
    def ionic_strength(self) -> float:
        """
        Ionic strength, mol/kg (complete dissociation).
        """
    @property
    def moles(self) -> dict:
        """
        Amount of each solute, mol (formula units).
        """
    @property
    def solutes(self) -> dict:
        """
        Mass of each solute, kg.
        """
    @property
    def species(self) -> list[str]:
        """
        Solute ids, in the order given.
        """
    @property
    def total_mass(self) -> float:
        """
        Total mass, kg.
        """
    @property
    def water(self) -> float:
        """
        Mass of water, kg.
        """
class LeightonTerms:
    """
    Inputs of the Leighton dairy method, g per 100 g of mix.
    """
    @property
    def milk_solids(self) -> float:
        ...
    @property
    def reason(self) -> str:
        ...
    @property
    def sucrose_equivalent(self) -> float:
        ...
    @property
    def water(self) -> float:
        ...
class FitResult:
    """
    Result of a least-squares fit (SI units of the fitted model).
    
    Non-convergence is a status, not an exception: check ``success`` or ``status``.
    """
    def confidence_intervals(self, level: typing.SupportsFloat | typing.SupportsIndex = 0.95) -> typing.Annotated[numpy.typing.NDArray[numpy.float64], "[m, n]"]:
        """
        (k, 2) array of lower and upper limits at ``level`` (Student t, n - k dof).
        """
    @property
    def at_bound(self) -> list[bool]:
        ...
    @property
    def chi_square(self) -> float:
        """
        Sum of weighted squared residuals.
        """
    @property
    def contradictory_duplicates(self) -> list[list[int]]:
        """
        Groups of row indices with equal x but contradictory y.
        """
    @property
    def covariance(self) -> typing.Annotated[numpy.typing.NDArray[numpy.float64], "[m, n]"]:
        """
        Covariance of the parameters (NaN if singular or dof = 0).
        """
    @property
    def degrees_of_freedom(self) -> int:
        ...
    @property
    def fitted(self) -> typing.Annotated[numpy.typing.NDArray[numpy.float64], "[m, 1]"]:
        """
        Model values at the data points.
        """
    @property
    def function_evaluations(self) -> int:
        ...
    @property
    def iterations(self) -> int:
        ...
    @property
    def jacobian_evaluations(self) -> int:
        ...
    @property
    def message(self) -> str:
        ...
    @property
    def n_points(self) -> int:
        ...
    @property
    def parameter_names(self) -> list[str]:
        """
        Parameter names (empty for curve_fit).
        """
    @property
    def params(self) -> typing.Annotated[numpy.typing.NDArray[numpy.float64], "[m, 1]"]:
        """
        Fitted parameters.
        """
    @property
    def r_squared(self) -> float:
        ...
    @property
    def reciprocal_condition(self) -> float:
        """
        Reciprocal condition number of the column-scaled weighted Jacobian.
        """
    @property
    def residual_variance(self) -> float:
        """
        chi_square / dof.
        """
    @property
    def residuals(self) -> typing.Annotated[numpy.typing.NDArray[numpy.float64], "[m, 1]"]:
        """
        Data minus model, unweighted.
        """
    @property
    def standard_errors(self) -> typing.Annotated[numpy.typing.NDArray[numpy.float64], "[m, 1]"]:
        ...
    @property
    def status(self) -> str:
        """
        'converged', 'max_iterations', 'max_evaluations', 'singular' or 'non_finite'.
        """
    @property
    def success(self) -> bool:
        ...
class SoluteRecord:
    """
    One solute: identity, molar mass, model constants.
    """
    def as_dict(self) -> dict:
        ...
    @property
    def formula(self) -> str:
        ...
    @property
    def id(self) -> str:
        ...
    @property
    def kind(self) -> str:
        ...
    @property
    def max_mass_fraction(self) -> float:
        ...
    @property
    def molar_mass(self) -> float:
        """
        kg/mol
        """
    @property
    def name(self) -> str:
        ...
    @property
    def norrish_k(self) -> float:
        ...
    @property
    def norrish_k3(self) -> float:
        ...
    @property
    def note(self) -> str:
        ...
    @property
    def pitzer(self) -> typing.Any:
        """
        The record's own Pitzer binary parameters (dict: values at 298.15 K, d/dT per K, max_molality mol/kg, temperature range K), or None.
        """
    @property
    def uncertainty(self) -> typing.Any:
        """
        Covariance of the record's constants as a dict (names, covariance, degrees_of_freedom, source), or None: uncertainty not stated.
        """
    @property
    def uncertainty_statement(self) -> str:
        """
        The standard uncertainties of the record's constants with their source, or 'not stated'.
        """
class SoluteTable:
    """
    A set of solute records with name resolution. ``SoluteTable()`` starts from the built-in
    table; pass one to the ``table=`` argument of the Solution factories to use fitted solutes.
    """
    def __contains__(self, arg0: str) -> bool:
        ...
    def __init__(self, include_builtin: bool = True) -> None:
        ...
    def __len__(self) -> int:
        ...
    def add(self, record: SoluteRecord) -> None:
        """
        Adds a record; raises if its id or a name is already taken.
        """
    def find(self, name: str) -> SoluteRecord:
        """
        The record for a name (case-insensitive; ids, names, aliases).
        """
    def rows(self) -> list:
        """
        All records as a list of dicts.
        """
class IceCurveState:
    """
    A solution on its ice curve at one temperature (SI: K, kg, mol).
    """
    @property
    def bound_water(self) -> float:
        """
        Unfreezable water, kg.
        """
    @property
    def hydrate_water(self) -> float:
        """
        Water held in crystallised salt hydrates, kg.
        """
    @property
    def ice(self) -> float:
        """
        Ice, kg.
        """
    @property
    def ice_fraction(self) -> float:
        """
        Ice mass / total water mass.
        """
    @property
    def precipitated(self) -> list[float]:
        """
        Salt crystallised, mol, one per entry of IceCurve.salts.
        """
    @property
    def reason(self) -> str:
        """
        Why the state is outside the validated range or not computed ('' if inside).
        """
    @property
    def state(self) -> str:
        """
        'liquid', 'ice_and_liquid', 'ice_salts_liquid', 'below_curve_end' or 'not_solved'.
        """
    @property
    def status(self) -> str:
        ...
    @property
    def success(self) -> bool:
        ...
    @property
    def temperature(self) -> float:
        """
        Temperature, K.
        """
    @property
    def total_water(self) -> float:
        """
        Water in the solution, kg.
        """
    @property
    def unfrozen_water(self) -> float:
        """
        Liquid water, kg.
        """
    @property
    def validity(self) -> Validity:
        """
        The limit crossed, as a record (Validity).
        """
    @property
    def water_activity(self) -> float:
        """
        Water activity of the unfrozen liquid.
        """
class IceCurve:
    """
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
    """
    def __init__(self, solution: Solution, model: str = 'auto', bound_water_fraction_of_water: typing.SupportsFloat | typing.SupportsIndex = 0.0, path: str = 'equilibrium', parameter_set: str = '') -> None:
        ...
    def at(self, temperature: typing.SupportsFloat | typing.SupportsIndex) -> IceCurveState:
        """
        The state at ``temperature`` (K).
        """
    def eutectic(self) -> dict:
        """
        Where the curve ends as a dict: temperature (K), found (a final eutectic), phase, formula and source of the salt whose saturation ends it, and reason.
        """
    def first_solid(self, metastable: bool = False) -> dict:
        """
        The first solid to form on cooling as a dict: temperature_K, phase ('ice' or the salt phase, e.g. 'hydrohalite'), formula, source (of the salt's solubility product), status, reason, notice (why a salt forms first; '' for ice), metastable_ice_temperature_K. metastable=True: the ice freezing point of the liquid as given (salt kept dissolved).
        """
    def ice_fractions(self, temperature: typing.Annotated[numpy.typing.ArrayLike, numpy.float64], range_policy: str = 'extrapolate') -> tuple[numpy.typing.NDArray[numpy.float64], str, int]:
        """
        (ice fractions, first reason, count out of range) at each temperature (K).
        """
    def reachable_ice(self) -> dict:
        """
        The span of the curve as a dict: freezing_point_K, lowest_temperature_K (where the curve ends), largest_ice_fraction (there) and end (why it ends there).
        """
    def table(self, temperature: typing.Annotated[numpy.typing.ArrayLike, numpy.float64]) -> dict:
        """
        The curve at each temperature (K) as columns (a dict of arrays, units in the keys): state, ice fraction, ice, unfrozen and hydrate water (kg), a_w, and the amount of each salt phase crystallised (mol). ``pandas.DataFrame(curve.table(T))`` gives a table.
        """
    def temperature_for_ice_fraction(self, ice_fraction: typing.SupportsFloat | typing.SupportsIndex, range_policy: str = 'extrapolate') -> tuple[float, str]:
        """
        (temperature K, reason) at which the curve has ``ice_fraction`` (ice mass over all the water, in [0, 1)); a fraction the curve cannot reach raises ValueError naming the reachable range.
        """
    @property
    def bound_water(self) -> float:
        """
        Unfreezable water, kg (bound_water_fraction_of_water times the water).
        """
    @property
    def end_reason(self) -> str:
        """
        'final_eutectic', 'salt_data_limit', 'search_limit', 'saturated_before_ice' or 'no_freezing_point'.
        """
    @property
    def end_temperature(self) -> float:
        """
        Where the curve ends, K.
        """
    @property
    def freezing_point(self) -> tuple[float, str, str]:
        """
        The tuple (temperature K, status, reason) of the first solid to form, the value colligate.freezing_point gives. That is the ice freezing point or, for a brine richer than its eutectic composition, the temperature where a salt begins to crystallise (status 'salt_saturated_above_data' and NaN when it is supersaturated already at 298.15 K). first_solid() names the phase; first_solid(metastable=True) gives the ice value.
        """
    @property
    def model(self) -> str:
        """
        Id of the model used ('auto' resolved).
        """
    @property
    def path(self) -> str:
        ...
    @property
    def salts(self) -> list:
        """
        The salt phases along the path, in the order they form (onset and end in K; end NaN if the phase stays to the end of the curve).
        """
class RowStatus:
    """
    Outcome of one row of a batch calculation (the code stored in status arrays).
    
    Members:
    
      ok
    
      out_of_range
    
      invalid_input
    
      no_freezing_point
    
      not_converged
    
      below_curve_end
    
      no_physical_value
    """
    __members__: typing.ClassVar[dict[str, RowStatus]]
    below_curve_end: typing.ClassVar[RowStatus]
    invalid_input: typing.ClassVar[RowStatus]
    no_freezing_point: typing.ClassVar[RowStatus]
    no_physical_value: typing.ClassVar[RowStatus]
    not_converged: typing.ClassVar[RowStatus]
    ok: typing.ClassVar[RowStatus]
    out_of_range: typing.ClassVar[RowStatus]
    @typing.overload
    def __eq__(self, other: RowStatus) -> bool:
        ...
    @typing.overload
    def __eq__(self, other: typing.Any) -> bool:
        ...
    def __getstate__(self) -> int:
        ...
    def __hash__(self) -> int:
        ...
    def __index__(self) -> int:
        ...
    def __init__(self, value: typing.SupportsInt | typing.SupportsIndex) -> None:
        ...
    def __int__(self) -> int:
        ...
    @typing.overload
    def __ne__(self, other: RowStatus) -> bool:
        ...
    @typing.overload
    def __ne__(self, other: typing.Any) -> bool:
        ...
    def __repr__(self) -> str:
        ...
    def __setstate__(self, state: typing.SupportsInt | typing.SupportsIndex) -> None:
        ...
    def __str__(self) -> str:
        ...
    @property
    def name(self) -> str:
        ...
    @property
    def value(self) -> int:
        ...
class InvalidInputError(ValueError):
    pass
class OutOfValidityRangeError(ValueError):
    pass
class ConvergenceError(RuntimeError):
    pass
def acid_dissociation(acid: str, molality: typing.SupportsFloat | typing.SupportsIndex, temperature: typing.SupportsFloat | typing.SupportsIndex = 298.15, background_ionic_strength: typing.SupportsFloat | typing.SupportsIndex = 0.0, activity: str = 'debye_huckel') -> dict:
    """
    Speciation of a weak acid (dict; equilibria/weak_acid_dissociation.hpp).
    """
def alcohol_by_volume_20c(ethanol_kg: typing.SupportsFloat | typing.SupportsIndex, water_kg: typing.SupportsFloat | typing.SupportsIndex) -> float:
    """
    Alcohol by volume at 20 C (volume fraction 0..1) of ``ethanol_kg`` ethanol in ``water_kg`` water, from the OIML R 22 (1975) density formula (``oiml_r22_1975``).
    """
def batch_freezing_points(batch: SolutionBatchCore, model: str = 'auto', threads: typing.SupportsInt | typing.SupportsIndex = 0, range_policy: str = 'extrapolate', bound_water_fraction_of_water: typing.SupportsFloat | typing.SupportsIndex = 0.0, parameter_set: str = '', metastable: bool = False) -> tuple[numpy.typing.NDArray[numpy.float64], numpy.typing.NDArray[numpy.uint8]]:
    ...
def batch_ice_fractions(batch: SolutionBatchCore, temperatures: typing.Annotated[numpy.typing.ArrayLike, numpy.float64], model: str = 'auto', threads: typing.SupportsInt | typing.SupportsIndex = 0, range_policy: str = 'extrapolate', bound_water_fraction_of_water: typing.SupportsFloat | typing.SupportsIndex = 0.0, parameter_set: str = '') -> tuple[numpy.typing.NDArray[numpy.float64], numpy.typing.NDArray[numpy.uint8]]:
    ...
def batch_predictions_with_uncertainty(batch: SolutionBatchCore, quantity: str, temperature: typing.SupportsFloat | typing.SupportsIndex, model: str = 'auto', threads: typing.SupportsInt | typing.SupportsIndex = 0, range_policy: str = 'extrapolate', bound_water_fraction_of_water: typing.SupportsFloat | typing.SupportsIndex = 0.0, salts_crystallise: bool = True, parameter_set: str = '') -> tuple[numpy.typing.NDArray[numpy.float64], numpy.typing.NDArray[numpy.float64], numpy.typing.NDArray[numpy.int32], numpy.typing.NDArray[numpy.uint8]]:
    """
    Value, standard uncertainty, effective degrees of freedom and row status of `quantity` for every row (linear propagation per row in C++; temperature in K, unused for the freezing point). salts_crystallise (default): a row where a salt crystallises keeps the plain batch call's value with u = NaN; false: metastable values. parameter_set: the Pitzer parameter set for the ions (empty: the model's default set).
    """
def batch_water_activities(batch: SolutionBatchCore, temperature: typing.SupportsFloat | typing.SupportsIndex, model: str = 'auto', threads: typing.SupportsInt | typing.SupportsIndex = 0, range_policy: str = 'extrapolate', saturation: str = 'equilibrium', parameter_set: str = '') -> tuple[numpy.typing.NDArray[numpy.float64], numpy.typing.NDArray[numpy.uint8]]:
    ...
def boiling_point(solution: Solution, pressure: typing.SupportsFloat | typing.SupportsIndex = 101325.0, model: str = 'auto', range_policy: str = 'extrapolate') -> dict:
    """
    Boiling point (K) of a solution at pressure (Pa) from a_w(T) p_s(T) = P, with its elevation.
    """
def brick_shape_factor(a: typing.SupportsFloat | typing.SupportsIndex, b: typing.SupportsFloat | typing.SupportsIndex, c: typing.SupportsFloat | typing.SupportsIndex, h: typing.SupportsFloat | typing.SupportsIndex, k_frozen: typing.SupportsFloat | typing.SupportsIndex) -> float:
    """
    EHTD of a rectangular brick with sides a, b, c (m); Hossain, Cleland & Cleland (1992).
    """
def chen_frozen_specific_heat(water_fraction: typing.SupportsFloat | typing.SupportsIndex, solids_fraction: typing.SupportsFloat | typing.SupportsIndex, bound_water_fraction_of_water: typing.SupportsFloat | typing.SupportsIndex, initial_freezing_point: typing.SupportsFloat | typing.SupportsIndex, temperature: typing.SupportsFloat | typing.SupportsIndex) -> float:
    """
    Apparent specific heat of a frozen food, J/(kg K), by the Chen (1985) correlation as presented in ASHRAE Refrigeration (2006) ch. 9; temperatures in K.
    """
def citation(key: str) -> dict:
    """
    One source of the citation table by key.
    """
def citation_table() -> list:
    """
    All sources cited by the built-in data, as a list of dicts.
    """
def component_specific_heat(component: str, temperature: typing.SupportsFloat | typing.SupportsIndex) -> float:
    """
    Specific heat of a food component (water, ice, protein, fat, carbohydrate, fibre, ash) at ``temperature`` (K), J/(kg K); Choi & Okos (1986).
    """
def concentration_for_boiling_point(solution: Solution, temperature: typing.SupportsFloat | typing.SupportsIndex, pressure: typing.SupportsFloat | typing.SupportsIndex = 101325.0, model: str = 'auto', range_policy: str = 'extrapolate') -> dict:
    """
    The solution with the same solutes (water adjusted) that boils at temperature (K) under pressure (Pa).
    """
def correlation_matrix(covariance: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, n]"]) -> typing.Annotated[numpy.typing.NDArray[numpy.float64], "[m, n]"]:
    """
    Correlation matrix r_ij = u_ij / (u_i u_j) of a covariance matrix.
    """
def coverage_factor(level: typing.SupportsFloat | typing.SupportsIndex, degrees_of_freedom: typing.SupportsInt | typing.SupportsIndex) -> float:
    """
    Two-sided coverage factor: Student t with `degrees_of_freedom` (> 0), normal for 0.
    """
def crystallisation_check(solution: Solution, temperatures: collections.abc.Sequence[typing.SupportsFloat | typing.SupportsIndex], model: str = 'auto', bound_water_fraction_of_water: typing.SupportsFloat | typing.SupportsIndex = 0.0) -> dict:
    """
    Supersaturation of each sugar with a solubility curve in the unfrozen phase at each temperature (K), Tg' (K, NaN if unknown) and the temperature intervals (K) where each can crystallise (supersaturated and above Tg').
    """
def curve_fit(model: collections.abc.Callable[[typing.Annotated[numpy.typing.NDArray[numpy.float64], "[m, n]"], typing.Annotated[numpy.typing.NDArray[numpy.float64], "[m, 1]"]], typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"]], x: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, n]"], y: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"], p0: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"], weights: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"] | None = None, jacobian: collections.abc.Callable[[typing.Annotated[numpy.typing.NDArray[numpy.float64], "[m, n]"], typing.Annotated[numpy.typing.NDArray[numpy.float64], "[m, 1]"]], typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, n]"]] | None = None, lower_bounds: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"] | None = None, upper_bounds: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"] | None = None, max_iterations: typing.SupportsInt | typing.SupportsIndex = 500, scale_covariance: bool = True) -> FitResult:
    """
    Levenberg-Marquardt fit of ``model(x, p)`` (x: (n, d) array; returns n values) to y.
    ``jacobian(x, p)`` returns the (n, k) derivatives; without it, central differences.
    """
def describe_model(solution: Solution, model: str = 'auto', parameter_set: str = '') -> str:
    """
    Which model and constants a calculation on this solution uses.
    """
def effective_solute_record(result: FitResult, id: str, name: str, note: str) -> SoluteRecord:
    """
    A solute record for a fitted effective solute.
    """
def enthalpy_of_fusion(temperature: typing.SupportsFloat | typing.SupportsIndex) -> float:
    """
    Molar enthalpy of fusion of ice at ``temperature`` (K), J/mol.
    """
def ethanol_water_density_20c(ethanol_mass_fraction: typing.SupportsFloat | typing.SupportsIndex) -> float:
    """
    Density of an ethanol-water mixture at 20 C, kg/m3, for the ethanol mass fraction (kg per kg of ethanol + water); OIML R 22 (1975), source key ``oiml_r22_1975``.
    """
def eutectic(solution: Solution, model: str = 'auto', bound_water_fraction_of_water: typing.SupportsFloat | typing.SupportsIndex = 0.0, parameter_set: str = '') -> tuple[float, bool, str, str, str, str]:
    """
    (temperature K, found, phase, formula, source key, reason) of the eutectic.
    """
def finite_cylinder_shape_factor(diameter: typing.SupportsFloat | typing.SupportsIndex, height: typing.SupportsFloat | typing.SupportsIndex, h: typing.SupportsFloat | typing.SupportsIndex, k_frozen: typing.SupportsFloat | typing.SupportsIndex) -> float:
    """
    EHTD of a finite cylinder (m); Hossain et al. (1992).
    """
def fit_effective_solute_freezing(water_fraction: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"], freezing_point: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"], weights: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"] | None = None, fit_bound_water: bool = True, molar_mass_start: typing.SupportsFloat | typing.SupportsIndex = 0.2, bound_water_start: typing.SupportsFloat | typing.SupportsIndex = 0.1) -> FitResult:
    """
    Effective solute (molar mass kg/mol, bound water kg/kg solids) from freezing points.
    """
def fit_effective_solute_ice_curve(water_fraction: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"], temperature: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"], ice_fraction: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"], weights: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"] | None = None, fit_bound_water: bool = True, molar_mass_start: typing.SupportsFloat | typing.SupportsIndex = 0.2, bound_water_start: typing.SupportsFloat | typing.SupportsIndex = 0.1) -> FitResult:
    """
    Effective solute from an ice-fraction curve (ice mass / total water vs T in K).
    """
def fit_isotherm(model: str, water_activity: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"], moisture: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"], weights: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"] | None = None) -> FitResult:
    """
    Fit a 'gab', 'bet' or 'oswin' isotherm to (a_w, moisture kg/kg dry solids) data.
    """
def fit_norrish_freezing_point(molality: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"], freezing_point: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"], weights: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"] | None = None, fit_k3: bool = False, k_start: typing.SupportsFloat | typing.SupportsIndex = 2.0, k3_start: typing.SupportsFloat | typing.SupportsIndex = 0.0) -> FitResult:
    """
    Norrish K (and K3) from (molality mol/kg, initial freezing point K).
    """
def fit_norrish_water_activity(molality: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"], water_activity: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"], temperature: typing.SupportsFloat | typing.SupportsIndex, weights: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"] | None = None, fit_k3: bool = False, k_start: typing.SupportsFloat | typing.SupportsIndex = 2.0, k3_start: typing.SupportsFloat | typing.SupportsIndex = 0.0) -> FitResult:
    """
    Norrish K (and K3) from (molality mol/kg, a_w) at T (K).
    """
def fit_pitzer_freezing_point(salt: str, molality: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"], freezing_point: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"], weights: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"] | None = None, temperature_terms: bool = False, beta2: bool = False, table: SoluteTable = None) -> FitResult:
    """
    Pitzer beta0, beta1, C-phi of a salt from (molality mol/kg, initial freezing point K).
    """
def fit_pitzer_osmotic_coefficient(salt: str, molality: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"], osmotic_coefficient: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"], temperature: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"], weights: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"] | None = None, temperature_terms: bool = False, beta2: bool = False, table: SoluteTable = None) -> FitResult:
    """
    Pitzer beta0, beta1, C-phi of a salt from (molality mol/kg, phi) at T (K; one or per row).
    """
def fit_pitzer_water_activity(salt: str, molality: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"], water_activity: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"], temperature: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"], weights: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"] | None = None, temperature_terms: bool = False, beta2: bool = False, table: SoluteTable = None) -> FitResult:
    """
    Pitzer beta0, beta1, C-phi of a salt from (molality mol/kg, a_w) at T (K; one or per row).
    """
def fit_single_salt_freezing_point(cation_charge: typing.SupportsInt | typing.SupportsIndex, anion_charge: typing.SupportsInt | typing.SupportsIndex, cation_count: typing.SupportsInt | typing.SupportsIndex, anion_count: typing.SupportsInt | typing.SupportsIndex, molality: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"], freezing_point: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"], weights: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, 1]"] | None = None, fit_cphi: bool = True) -> FitResult:
    """
    Pitzer beta0, beta1, C-phi (closed binary form, alpha1 = 2) of a salt of any charge type from (molality mol/kg, freezing point K), parameters constant over the data.
    """
def food_apparent_specific_heat(composition: typing.Any, solution: Solution, temperature: typing.Annotated[numpy.typing.ArrayLike, numpy.float64], model: str = 'auto', bound_water_fraction_of_water: typing.SupportsFloat | typing.SupportsIndex = 0.0) -> tuple[numpy.typing.NDArray[numpy.float64], str, int]:
    """
    Apparent specific heat dH/dT, J/(kg K); returns (values, first reason, count).
    """
def food_enthalpy(composition: typing.Any, solution: Solution, temperature: typing.Annotated[numpy.typing.ArrayLike, numpy.float64], model: str = 'auto', bound_water_fraction_of_water: typing.SupportsFloat | typing.SupportsIndex = 0.0) -> tuple[numpy.typing.NDArray[numpy.float64], str, int]:
    """
    Specific enthalpy, J/kg, H = 0 at 233.15 K; returns (values, first reason, count).
    """
def food_freezing_inputs(composition: typing.Any, solution: Solution, bound_water_fraction_of_water: typing.SupportsFloat | typing.SupportsIndex, model: str, T_initial: typing.SupportsFloat | typing.SupportsIndex, T_target: typing.SupportsFloat | typing.SupportsIndex, conductivity_rule: str = 'parallel') -> dict:
    """
    Inputs of Plank's and Pham's formulas for a food (SI).
    """
def food_freezing_time_uncertainty(composition: typing.Any, solution: Solution, bound_water_fraction_of_water: typing.SupportsFloat | typing.SupportsIndex, model: str, method: str, shape: str, size: typing.SupportsFloat | typing.SupportsIndex, shape_factor: typing.SupportsFloat | typing.SupportsIndex, T_initial: typing.SupportsFloat | typing.SupportsIndex, T_medium: typing.SupportsFloat | typing.SupportsIndex, h: typing.SupportsFloat | typing.SupportsIndex, T_target: typing.SupportsFloat | typing.SupportsIndex, u_h: typing.SupportsFloat | typing.SupportsIndex = 0.0, u_size: typing.SupportsFloat | typing.SupportsIndex = 0.0, u_T_medium: typing.SupportsFloat | typing.SupportsIndex = 0.0, conductivity_rule: str = 'parallel', propagation: str = 'linear', draws: typing.SupportsInt | typing.SupportsIndex = 10000, seed: typing.SupportsInt | typing.SupportsIndex = 0) -> dict:
    """
    A food's Plank or Pham freezing time (s) with its standard uncertainty from the covariance of its solutes' constants and the stated u(h), u(size), u(T_medium): linear (closed-form derivatives) or Monte Carlo (`draws` samples, generator seeded with `seed`).
    """
def food_heat_load(composition: typing.Any, solution: Solution, from_temperature: typing.SupportsFloat | typing.SupportsIndex, to_temperature: typing.SupportsFloat | typing.SupportsIndex, model: str = 'auto', bound_water_fraction_of_water: typing.SupportsFloat | typing.SupportsIndex = 0.0) -> dict:
    """
    Heat to remove per kg from ``from_temperature`` to ``to_temperature`` (K), J/kg, split into sensible and latent parts.
    """
def food_properties(composition: typing.Any, solution: Solution, bound_water_fraction_of_water: typing.SupportsFloat | typing.SupportsIndex, model: str, temperature: typing.Annotated[numpy.typing.ArrayLike, numpy.float64], conductivity_rule: str = 'parallel') -> dict:
    """
    Density (kg/m^3), conductivity (W/(m K)), enthalpy (J/kg) and ice fraction of a food.
    """
def food_thermal_uncertainty(composition: typing.Any, solution: Solution, quantity: str, from_temperature: typing.SupportsFloat | typing.SupportsIndex, to_temperature: typing.SupportsFloat | typing.SupportsIndex = 0.0, model: str = 'auto', bound_water_fraction_of_water: typing.SupportsFloat | typing.SupportsIndex = 0.0) -> dict:
    """
    Enthalpy at from_temperature (J/kg, H = 0 at 233.15 K) or the heat load H(from) - H(to) (J/kg), with its standard uncertainty by linear propagation.
    """
def freezing_point(solution: Solution, model: str = 'auto', range_policy: str = 'extrapolate', bound_water_fraction_of_water: typing.SupportsFloat | typing.SupportsIndex = 0.0, parameter_set: str = '', metastable: bool = False) -> tuple[float, str, str]:
    """
    (temperature K, reason, notice): the freezing point in the sense of the first solid to form. A brine richer than its eutectic composition crystallises a salt first: the value is that salt's crystallisation temperature and the notice names it; metastable=True gives the ice freezing point of the unprecipitated liquid.
    """
def glass_curve(solution: Solution, solute_mass_fraction: typing.Annotated[numpy.typing.ArrayLike, numpy.float64], rule: str = 'gordon_taylor') -> numpy.typing.NDArray[numpy.float64]:
    """
    Tg (K) of the solution's solutes, in their proportions, at each total solute mass fraction in (0, 1].
    """
def glass_transition(solution: Solution, water_kg: typing.SupportsFloat | typing.SupportsIndex | None = None, rule: str = 'gordon_taylor') -> dict:
    """
    Glass transition of water_kg of water (default None: all the solution's water) with the solution's solutes: dict with temperature (K), counted and lacking solute ids and counted_solute_mass_fraction. Raises ValueError naming the solutes if none has data.
    """
def glass_transition_table() -> list:
    """
    The built-in glass-transition constants: Tg of the anhydrous solute (K), Gordon-Taylor k with water, Delta Cp at Tg (J/(kg K), 0 if not known), source keys and notes.
    """
def ice_fraction(solution: Solution, temperature: typing.Annotated[numpy.typing.ArrayLike, numpy.float64], model: str = 'auto', range_policy: str = 'extrapolate', bound_water_fraction_of_water: typing.SupportsFloat | typing.SupportsIndex = 0.0, parameter_set: str = '') -> tuple[numpy.typing.NDArray[numpy.float64], str, int]:
    ...
def ice_vapour_pressure(temperature: typing.SupportsFloat | typing.SupportsIndex) -> float:
    """
    Vapour pressure of ice, Pa (Murphy & Koop 2005 eq. 7).
    """
def isosteric_heat(model1: str, p1_1: typing.SupportsFloat | typing.SupportsIndex, p2_1: typing.SupportsFloat | typing.SupportsIndex, p3_1: typing.SupportsFloat | typing.SupportsIndex, temperature1: typing.SupportsFloat | typing.SupportsIndex, model2: str, p1_2: typing.SupportsFloat | typing.SupportsIndex, p2_2: typing.SupportsFloat | typing.SupportsIndex, p3_2: typing.SupportsFloat | typing.SupportsIndex, temperature2: typing.SupportsFloat | typing.SupportsIndex, moisture: typing.SupportsFloat | typing.SupportsIndex) -> float:
    """
    Net isosteric heat of sorption (J/mol) at a moisture from isotherms at two temperatures.
    """
def isotherm_moisture(model: str, p1: typing.SupportsFloat | typing.SupportsIndex, p2: typing.SupportsFloat | typing.SupportsIndex, p3: typing.SupportsFloat | typing.SupportsIndex, water_activity: typing.Annotated[numpy.typing.ArrayLike, numpy.float64]) -> numpy.typing.NDArray[numpy.float64]:
    """
    Equilibrium moisture (kg water per kg dry solids) at each water activity in (0, 1).
    """
def isotherm_range_reason(model: str, p1: typing.SupportsFloat | typing.SupportsIndex, p2: typing.SupportsFloat | typing.SupportsIndex, p3: typing.SupportsFloat | typing.SupportsIndex, aw_min: typing.SupportsFloat | typing.SupportsIndex, aw_max: typing.SupportsFloat | typing.SupportsIndex, water_activity: typing.Annotated[numpy.typing.ArrayLike, numpy.float64]) -> tuple[str, int]:
    """
    (first reason, count) of the water activities outside the isotherm's data range.
    """
def isotherm_water_activity(model: str, p1: typing.SupportsFloat | typing.SupportsIndex, p2: typing.SupportsFloat | typing.SupportsIndex, p3: typing.SupportsFloat | typing.SupportsIndex, moisture: typing.Annotated[numpy.typing.ArrayLike, numpy.float64]) -> numpy.typing.NDArray[numpy.float64]:
    """
    Water activity at each moisture (kg water per kg dry solids, > 0).
    """
def lactose_initial_solubility(temperature: typing.SupportsFloat | typing.SupportsIndex) -> tuple[float, float, str, str]:
    """
    Initial solubility of alpha-lactose at T (K), as sugar_solubility.
    """
def lactose_mutarotation_ratio(temperature: typing.SupportsFloat | typing.SupportsIndex) -> float:
    """
    Equilibrium beta/alpha ratio of lactose in solution at T (K).
    """
def lactose_solubility(temperature: typing.Annotated[numpy.typing.ArrayLike, numpy.float64]) -> numpy.typing.NDArray[numpy.float64]:
    """
    Solubility of lactose in water, kg anhydrous lactose per kg water, at ``temperature`` (K, scalar or array): linear interpolation in :func:`lactose_solubility_table`, held at the end values outside it.
    
    Raises ValueError for a temperature that is not finite and positive.
    """
def lactose_solubility_table() -> list:
    """
    Points of the lactose solubility curve as a list of dicts with ``temperature`` (K), ``solubility`` (kg anhydrous lactose per kg water), ``source`` (citation key) and ``note``.
    """
def latent_heat_of_fusion(composition: typing.Any) -> float:
    """
    Water fraction times the heat of fusion of ice at 0 C, J/kg of food.
    """
def leighton_depression(solution: Solution, frozen_fraction: typing.SupportsFloat | typing.SupportsIndex) -> tuple[float, str]:
    ...
def leighton_freezing_point(solution: Solution) -> tuple[float, str]:
    ...
def leighton_ice_fraction(solution: Solution, temperature: typing.SupportsFloat | typing.SupportsIndex) -> tuple[float, str]:
    ...
def leighton_terms(solution: Solution) -> LeightonTerms:
    ...
def liquid_vapour_pressure(temperature: typing.SupportsFloat | typing.SupportsIndex) -> float:
    """
    Vapour pressure of liquid or supercooled water, Pa (Murphy & Koop 2005 eq. 10).
    """
def liquidus_curve(solution: Solution, solute_mass_fraction: typing.Annotated[numpy.typing.ArrayLike, numpy.float64], model: str = 'auto') -> tuple[numpy.typing.NDArray[numpy.float64], str, int]:
    """
    Freezing point (K; NaN where none above the search limit) of the solution's solutes, in their proportions, at each total solute mass fraction in (0, 1): (values, first reason, count out of range).
    """
def ln_water_activity_of_ice(temperature: typing.SupportsFloat | typing.SupportsIndex) -> float:
    """
    ln a_w of a solution in equilibrium with ice at ``temperature`` (K), one atmosphere.
    """
def make_pitzer_solute_record(salt: str, id: str, name: str, beta0: typing.SupportsFloat | typing.SupportsIndex, beta1: typing.SupportsFloat | typing.SupportsIndex, cphi: typing.SupportsFloat | typing.SupportsIndex, beta2: typing.SupportsFloat | typing.SupportsIndex = 0.0, dbeta0_dT: typing.SupportsFloat | typing.SupportsIndex = 0.0, dbeta1_dT: typing.SupportsFloat | typing.SupportsIndex = 0.0, dbeta2_dT: typing.SupportsFloat | typing.SupportsIndex = 0.0, dcphi_dT: typing.SupportsFloat | typing.SupportsIndex = 0.0, max_molality: typing.SupportsFloat | typing.SupportsIndex = 6.0, min_temperature: typing.SupportsFloat | typing.SupportsIndex = 293.15, max_temperature: typing.SupportsFloat | typing.SupportsIndex = 303.15, source: str = 'colligate_fit_user', note: str = '', table: SoluteTable = None) -> SoluteRecord:
    """
    A salt record (copy of ``salt``: molar mass, ions) with its own Pitzer parameters (kg/mol, kg^2/mol^2 for C-phi; values at 298.15 K and d/dT per K).
    """
def make_solute_record(id: str, name: str, molar_mass: typing.SupportsFloat | typing.SupportsIndex, norrish_k: typing.SupportsFloat | typing.SupportsIndex, norrish_k3: typing.SupportsFloat | typing.SupportsIndex = 0.0, max_mass_fraction: typing.SupportsFloat | typing.SupportsIndex = 0.9, note: str = '') -> SoluteRecord:
    """
    A non-electrolyte record with user-fitted Norrish constants (molar mass in kg/mol).
    """
def max_msnf_for_lactose_in_solution(water_fraction: typing.SupportsFloat | typing.SupportsIndex, msnf_fraction: typing.SupportsFloat | typing.SupportsIndex) -> float:
    """
    Largest milk solids-not-fat (kg per kg of mix) that keeps lactose in solution by the rule of Hyde & Rothwell (1973), (water + MSNF) / 7; source key ``hyde_rothwell_1973``.
    """
def maximal_freeze_concentration(solution: Solution, model: str = 'auto', bound_water_fraction_of_water: typing.SupportsFloat | typing.SupportsIndex = 0.0, rule: str = 'gordon_taylor') -> dict:
    """
    Tg' (K) and Cg' (solute mass fraction) where the unfrozen phase on the ice curve meets its glass curve, with Wg' (kg unfrozen water per kg solutes), the ice fraction there, the solve status and the ice curve's validity reason ('' when in range).
    """
def mean_activity_coefficient(solution: Solution, solute: str, temperature: typing.SupportsFloat | typing.SupportsIndex, parameter_set: str = 'harvie_spencer_icefit') -> tuple[float, str]:
    ...
def model_summaries() -> list:
    """
    The registry's models as dicts: id, summary (equation and sources), temperature_dependent, ion_activities, validated_range (list of dicts: quantity, unit, low, high (NaN: no limit), basis, source key, per_solute: where each solute's own limit is kept).
    """
def models() -> list[str]:
    """
    Ids of the activity models.
    """
def moisture_equilibrium(parts: collections.abc.Sequence[tuple[str, typing.SupportsFloat | typing.SupportsIndex, typing.SupportsFloat | typing.SupportsIndex, typing.SupportsFloat | typing.SupportsIndex, typing.SupportsFloat | typing.SupportsIndex, typing.SupportsFloat | typing.SupportsIndex]]) -> dict:
    """
    Equilibrium of parts (model, p1, p2, p3, dry solids kg, moisture kg/kg dry solids): common water activity, final moisture and water gained (kg) of each part, their initial water activities, and the Salwin-Slawson estimate.
    """
def norrish_solute_record(result: FitResult, id: str, name: str, molar_mass: typing.SupportsFloat | typing.SupportsIndex, max_mass_fraction: typing.SupportsFloat | typing.SupportsIndex, note: str) -> SoluteRecord:
    """
    A solute record carrying fitted Norrish constants.
    """
def osmotic_coefficient(solution: Solution, temperature: typing.SupportsFloat | typing.SupportsIndex, model: str = 'auto', range_policy: str = 'extrapolate', parameter_set: str = '') -> tuple[float, str]:
    ...
def pham_estimate(size: typing.SupportsFloat | typing.SupportsIndex, shape_factor: typing.SupportsFloat | typing.SupportsIndex, T_initial: typing.SupportsFloat | typing.SupportsIndex, T_medium: typing.SupportsFloat | typing.SupportsIndex, T_centre: typing.SupportsFloat | typing.SupportsIndex, density_unfrozen: typing.SupportsFloat | typing.SupportsIndex, density_frozen: typing.SupportsFloat | typing.SupportsIndex, c_unfrozen: typing.SupportsFloat | typing.SupportsIndex, c_frozen: typing.SupportsFloat | typing.SupportsIndex, latent_heat: typing.SupportsFloat | typing.SupportsIndex, k_frozen: typing.SupportsFloat | typing.SupportsIndex, h: typing.SupportsFloat | typing.SupportsIndex) -> dict:
    """
    Pham's (1986) freezing time and its parts (SI, temperatures in K).
    """
def pham_time_uncertainty(size: typing.SupportsFloat | typing.SupportsIndex, shape_factor: typing.SupportsFloat | typing.SupportsIndex, T_initial: typing.SupportsFloat | typing.SupportsIndex, T_medium: typing.SupportsFloat | typing.SupportsIndex, T_centre: typing.SupportsFloat | typing.SupportsIndex, density_unfrozen: typing.SupportsFloat | typing.SupportsIndex, density_frozen: typing.SupportsFloat | typing.SupportsIndex, c_unfrozen: typing.SupportsFloat | typing.SupportsIndex, c_frozen: typing.SupportsFloat | typing.SupportsIndex, latent_heat: typing.SupportsFloat | typing.SupportsIndex, k_frozen: typing.SupportsFloat | typing.SupportsIndex, h: typing.SupportsFloat | typing.SupportsIndex, uncertainties: collections.abc.Mapping[str, typing.SupportsFloat | typing.SupportsIndex]) -> dict:
    """
    Pham's (1986) freezing time (s) with its standard uncertainty from stated, uncorrelated standard uncertainties of its inputs (a dict: input name without 'u_' -> u).
    """
def pham_times(size: typing.Annotated[numpy.typing.ArrayLike, numpy.float64], shape_factor: typing.SupportsFloat | typing.SupportsIndex, T_initial: typing.SupportsFloat | typing.SupportsIndex, T_medium: typing.SupportsFloat | typing.SupportsIndex, T_centre: typing.SupportsFloat | typing.SupportsIndex, density_unfrozen: typing.SupportsFloat | typing.SupportsIndex, density_frozen: typing.SupportsFloat | typing.SupportsIndex, c_unfrozen: typing.SupportsFloat | typing.SupportsIndex, c_frozen: typing.SupportsFloat | typing.SupportsIndex, latent_heat: typing.SupportsFloat | typing.SupportsIndex, k_frozen: typing.SupportsFloat | typing.SupportsIndex, h: typing.Annotated[numpy.typing.ArrayLike, numpy.float64]) -> numpy.typing.NDArray[numpy.float64]:
    """
    Pham's (1986) freezing times, s, over arrays of size (m) and h (W/(m^2 K)).
    """
def pitzer_osmotic_coefficient(solution: Solution, temperature: typing.SupportsFloat | typing.SupportsIndex, parameter_set: str = 'harvie_spencer_icefit') -> tuple[float, str]:
    ...
def pitzer_parameter_set_range(parameter_set: str) -> tuple[float, float, str, str]:
    """
    (T min K, T max K, description, source key) of a Pitzer parameter set.
    """
def pitzer_parameter_sets() -> list[str]:
    """
    Ids of the Pitzer parameter sets; the first is the default.
    """
def pitzer_solute_record(result: FitResult, salt: str, id: str, name: str, max_molality: typing.SupportsFloat | typing.SupportsIndex, min_temperature: typing.SupportsFloat | typing.SupportsIndex, max_temperature: typing.SupportsFloat | typing.SupportsIndex, note: str, table: SoluteTable = None) -> SoluteRecord:
    """
    A salt record (copy of ``salt``, new id) carrying the Pitzer parameters of a fit.
    """
def plank_time(shape: str, size: typing.SupportsFloat | typing.SupportsIndex, density: typing.SupportsFloat | typing.SupportsIndex, latent_heat: typing.SupportsFloat | typing.SupportsIndex, T_freeze: typing.SupportsFloat | typing.SupportsIndex, T_medium: typing.SupportsFloat | typing.SupportsIndex, h: typing.SupportsFloat | typing.SupportsIndex, k_frozen: typing.SupportsFloat | typing.SupportsIndex) -> float:
    """
    Plank's freezing time, s (shape slab|cylinder|sphere; size = full thickness or diameter, m).
    """
def plank_time_uncertainty(shape: str, size: typing.SupportsFloat | typing.SupportsIndex, density: typing.SupportsFloat | typing.SupportsIndex, latent_heat: typing.SupportsFloat | typing.SupportsIndex, T_freeze: typing.SupportsFloat | typing.SupportsIndex, T_medium: typing.SupportsFloat | typing.SupportsIndex, h: typing.SupportsFloat | typing.SupportsIndex, k_frozen: typing.SupportsFloat | typing.SupportsIndex, u_size: typing.SupportsFloat | typing.SupportsIndex = 0.0, u_density: typing.SupportsFloat | typing.SupportsIndex = 0.0, u_latent_heat: typing.SupportsFloat | typing.SupportsIndex = 0.0, u_T_freeze: typing.SupportsFloat | typing.SupportsIndex = 0.0, u_T_medium: typing.SupportsFloat | typing.SupportsIndex = 0.0, u_h: typing.SupportsFloat | typing.SupportsIndex = 0.0, u_k_frozen: typing.SupportsFloat | typing.SupportsIndex = 0.0) -> dict:
    """
    Plank's freezing time (s) with its standard uncertainty from stated, uncorrelated standard uncertainties of its inputs (closed-form partial derivatives; normal law).
    """
def propagate_uncertainty(solution: Solution, quantity: str, temperature: typing.SupportsFloat | typing.SupportsIndex, model: str = 'auto', bound_water_fraction_of_water: typing.SupportsFloat | typing.SupportsIndex = 0.0, method: str = 'linear', draws: typing.SupportsInt | typing.SupportsIndex = 100000, seed: typing.SupportsInt | typing.SupportsIndex = 0, parameter_set: str = '', salts_crystallise: bool = True) -> dict:
    """
    A prediction with its standard uncertainty from the covariance of the solution's constants: method 'linear' (analytic sensitivities, GUM eq. 13) or 'monte_carlo' (`draws` samples, generator seeded with `seed`). Temperature in K (unused for the freezing point). salts_crystallise (default): a salt above its solubility crystallises as in the plain calls (first-solid freezing point, equilibrium a_w; the linear method refuses such a state when a constant is uncertain); false: metastable values.
    """
def record_with_uncertainty(record: SoluteRecord, names: collections.abc.Sequence[str], covariance: typing.Annotated[numpy.typing.ArrayLike, numpy.float64, "[m, n]"], degrees_of_freedom: typing.SupportsInt | typing.SupportsIndex, source: str = 'colligate_fit_user') -> SoluteRecord:
    """
    A copy of `record` whose constants `names` carry `covariance` (SI units squared) resting on `degrees_of_freedom` (0: known covariance, normal law).
    """
def rod_shape_factor(a: typing.SupportsFloat | typing.SupportsIndex, b: typing.SupportsFloat | typing.SupportsIndex, h: typing.SupportsFloat | typing.SupportsIndex, k_frozen: typing.SupportsFloat | typing.SupportsIndex) -> float:
    """
    EHTD of an infinite rectangular rod a x b (m); Hossain et al. (1992).
    """
def row_status_reasons() -> list[str]:
    """
    Readable reason for each row status code (index = code).
    """
def salt_crystallisation_temperature(solution: Solution, model: str = 'auto', parameter_set: str = '') -> dict:
    """
    Temperature (K) at which ``solution`` first crystallises a salt on cooling, without ice, with the phase, as a dict (equilibria/salt_equilibrium.hpp).
    """
def salt_equilibrium(solution: Solution, temperature: typing.SupportsFloat | typing.SupportsIndex, model: str = 'auto', parameter_set: str = '') -> dict:
    """
    The state of ``solution`` at ``temperature`` (K) with salts allowed to crystallise (no ice), as a dict (equilibria/salt_equilibrium.hpp).
    """
def saturation_pressure(temperature: typing.SupportsFloat | typing.SupportsIndex) -> float:
    """
    Saturation vapour pressure of water, Pa, at T (K); Wagner & Pruss (1993), IAPWS.
    """
def saturation_temperature(pressure: typing.SupportsFloat | typing.SupportsIndex) -> float:
    """
    Boiling temperature of pure water, K, at P (Pa); Wagner & Pruss (1993), IAPWS.
    """
def seawater_freezing_points(absolute_salinity: typing.Annotated[numpy.typing.ArrayLike, numpy.float64], threads: typing.SupportsInt | typing.SupportsIndex = 0, parameter_set: str = '') -> tuple[numpy.typing.NDArray[numpy.float64], numpy.typing.NDArray[numpy.uint8]]:
    """
    (freezing points K, row status codes) of Reference-Composition seawater at each absolute salinity (g/kg): the Pitzer model's freezing line (a Chebyshev series in sqrt(SA) of its exact freezing points) up to 50 g/kg, the exact path above.
    """
def shift_water_activity(water_activity: typing.SupportsFloat | typing.SupportsIndex, reference_temperature: typing.SupportsFloat | typing.SupportsIndex, temperature: typing.SupportsFloat | typing.SupportsIndex, isosteric_heat: typing.SupportsFloat | typing.SupportsIndex) -> float:
    """
    Water activity at T (K) at the same moisture, from a_w at the reference T and the net isosteric heat (J/mol), by Clausius-Clapeyron.
    """
def simulate_food(composition: typing.Any, solution: Solution, bound_water_fraction_of_water: typing.SupportsFloat | typing.SupportsIndex, model: str, shape: str, size: typing.SupportsFloat | typing.SupportsIndex, T_initial: typing.SupportsFloat | typing.SupportsIndex, medium_time: collections.abc.Sequence[typing.SupportsFloat | typing.SupportsIndex], medium_temperature: collections.abc.Sequence[typing.SupportsFloat | typing.SupportsIndex], h: typing.SupportsFloat | typing.SupportsIndex, T_target: typing.SupportsFloat | typing.SupportsIndex, max_time: typing.SupportsFloat | typing.SupportsIndex, intervals: typing.SupportsInt | typing.SupportsIndex, time_step: typing.SupportsFloat | typing.SupportsIndex, record_every: typing.SupportsInt | typing.SupportsIndex = 1, conductivity_rule: str = 'parallel') -> dict:
    """
    Enthalpy-method simulation of a food (properties from its ice curve).
    """
def simulate_food_time_uncertainty(composition: typing.Any, solution: Solution, bound_water_fraction_of_water: typing.SupportsFloat | typing.SupportsIndex, model: str, shape: str, size: typing.SupportsFloat | typing.SupportsIndex, T_initial: typing.SupportsFloat | typing.SupportsIndex, medium_time: collections.abc.Sequence[typing.SupportsFloat | typing.SupportsIndex], medium_temperature: collections.abc.Sequence[typing.SupportsFloat | typing.SupportsIndex], h: typing.SupportsFloat | typing.SupportsIndex, T_target: typing.SupportsFloat | typing.SupportsIndex, max_time: typing.SupportsFloat | typing.SupportsIndex, intervals: typing.SupportsInt | typing.SupportsIndex, time_step: typing.SupportsFloat | typing.SupportsIndex, u_h: typing.SupportsFloat | typing.SupportsIndex = 0.0, u_size: typing.SupportsFloat | typing.SupportsIndex = 0.0, u_T_medium: typing.SupportsFloat | typing.SupportsIndex = 0.0, draws: typing.SupportsInt | typing.SupportsIndex = 200, seed: typing.SupportsInt | typing.SupportsIndex = 0, conductivity_rule: str = 'parallel') -> dict:
    """
    The simulation's time (s) for the centre to reach T_target with its uncertainty by Monte Carlo over the food's constants and the stated u(h), u(size), u(T_medium) (`draws` runs, seeded).
    """
def simulate_material(temperature: collections.abc.Sequence[typing.SupportsFloat | typing.SupportsIndex], enthalpy: collections.abc.Sequence[typing.SupportsFloat | typing.SupportsIndex], conductivity: collections.abc.Sequence[typing.SupportsFloat | typing.SupportsIndex], shape: str, size: typing.SupportsFloat | typing.SupportsIndex, T_initial: typing.SupportsFloat | typing.SupportsIndex, medium_time: collections.abc.Sequence[typing.SupportsFloat | typing.SupportsIndex], medium_temperature: collections.abc.Sequence[typing.SupportsFloat | typing.SupportsIndex], h: typing.SupportsFloat | typing.SupportsIndex, T_target: typing.SupportsFloat | typing.SupportsIndex, max_time: typing.SupportsFloat | typing.SupportsIndex, intervals: typing.SupportsInt | typing.SupportsIndex, time_step: typing.SupportsFloat | typing.SupportsIndex, record_every: typing.SupportsInt | typing.SupportsIndex = 1) -> dict:
    """
    Enthalpy-method simulation of a tabulated material (H in J/m^3, k in W/(m K) against T in K).
    """
def single_salt_activity(salt: str, molality: collections.abc.Sequence[typing.SupportsFloat | typing.SupportsIndex], temperature: typing.SupportsFloat | typing.SupportsIndex) -> tuple[list[float], list[float], list[float], str]:
    """
    (osmotic coefficients, ln mean activity coefficients, water activities, first range reason) of one salt of data/single_salt_pitzer.hpp in water at each molality (mol/kg), closed binary Pitzer form with the salt's row whose window holds T.
    """
def single_salt_closed_form_freezing_point(cation_charge: typing.SupportsInt | typing.SupportsIndex, anion_charge: typing.SupportsInt | typing.SupportsIndex, cation_count: typing.SupportsInt | typing.SupportsIndex, anion_count: typing.SupportsInt | typing.SupportsIndex, beta0: typing.SupportsFloat | typing.SupportsIndex, beta1: typing.SupportsFloat | typing.SupportsIndex, cphi: typing.SupportsFloat | typing.SupportsIndex, molality: collections.abc.Sequence[typing.SupportsFloat | typing.SupportsIndex]) -> list[float]:
    """
    Freezing temperatures (K) of a salt of the given charges and counts with Pitzer parameters beta0, beta1, C-phi (alpha1 = 2) held constant, at each molality (mol/kg); no table row, no checks of range (for fits and their checks).
    """
def single_salt_freezing_point(salt: str, molality: collections.abc.Sequence[typing.SupportsFloat | typing.SupportsIndex]) -> tuple[list[float], str, str]:
    """
    (freezing temperatures K, parameter set, first range reason) of one salt of data/single_salt_pitzer.hpp at each molality (mol/kg), by its ice-line row.
    """
def single_salt_molality(salt: str, mass_fraction: collections.abc.Sequence[typing.SupportsFloat | typing.SupportsIndex]) -> list[float]:
    """
    Molalities (mol/kg of water) of one salt of data/single_salt_pitzer.hpp from its mass fractions in solution (anhydrous salt, kg/kg, in [0, 1)).
    """
def single_salt_table() -> list:
    """
    The rows of the single-salt Pitzer table, one dict each.
    """
def solute_table() -> list:
    """
    The built-in solute table as a list of dicts (SI units, with source keys).
    """
def sugar_solubility(solute: str, temperature: typing.SupportsFloat | typing.SupportsIndex) -> tuple[float, float, str, str]:
    """
    Solubility of a sugar (sucrose, lactose: final; glucose: stable phase) at T (K): (mass fraction of the saturated solution, kg per kg water, solid phase, reason).
    """
def sugar_solubility_curves() -> list:
    """
    The sugar solubility curves: ln S = a + b/T + c ln T (S kg per kg water, T in K), the data range (K), source keys and notes.
    """
def sweetness_table() -> list:
    """
    Relative sweetness (sucrose = 1, mass basis) as a list of dicts with ``solute``, ``relative_sweetness``, ``source`` (citation key) and ``note``.
    """
def temperature_for_ice_fraction(solution: Solution, ice_fraction: typing.Annotated[numpy.typing.ArrayLike, numpy.float64], model: str = 'auto', range_policy: str = 'extrapolate', bound_water_fraction_of_water: typing.SupportsFloat | typing.SupportsIndex = 0.0, parameter_set: str = '') -> tuple[numpy.typing.NDArray[numpy.float64], str, int]:
    """
    (temperatures K, first reason, count out of range) at which the solution has each ice fraction (ice mass over all the water), on one prepared ice curve.
    """
def uncertainty_statements() -> dict:
    """
    The standard uncertainties of each built-in solute's constants with their source, or 'not stated' (data/builtin_uncertainty.hpp).
    """
def unfrozen_phase(solution: Solution, temperature: typing.SupportsFloat | typing.SupportsIndex, model: str = 'auto', bound_water_fraction_of_water: typing.SupportsFloat | typing.SupportsIndex = 0.0, parameter_set: str = '') -> IceCurveState:
    """
    The ice curve's state (IceCurveState) at ``temperature`` (K).
    """
def unfrozen_specific_heat(composition: typing.Any, temperature: typing.SupportsFloat | typing.SupportsIndex) -> float:
    """
    Specific heat of the unfrozen food (all water liquid) at ``temperature`` (K), J/(kg K).
    """
def water_activity(solution: Solution, temperature: typing.SupportsFloat | typing.SupportsIndex, model: str = 'auto', range_policy: str = 'extrapolate', saturation: str = 'equilibrium', parameter_set: str = '') -> tuple[float, str, str]:
    """
    (a_w, reason, supersaturation notice). saturation='equilibrium' (default): a solution above a salt's solubility gives the a_w of its equilibrium state, salt crystallised; 'metastable': the solution as one liquid.
    """
def water_activity_growth_limits() -> list:
    """
    Published minimum water activities for growth of groups of microorganisms, with sources.
    """
def water_activity_of_ice(temperature: typing.SupportsFloat | typing.SupportsIndex, range_policy: str = 'extrapolate') -> tuple[float, str]:
    """
    Water activity of a solution in equilibrium with ice at ``temperature`` (K), one atmosphere, and the reason when outside 233.15-273.15 K (value, reason). No value below 215 K or above the ice point (NaN, or OutOfValidityRangeError with 'raise').
    """
def water_glass_transition_temperature() -> float:
    """
    Glass transition temperature of amorphous water used by the glass curves, K.
    """
def weak_acid_freezing_point(acid: str, molality: typing.SupportsFloat | typing.SupportsIndex, norrish_k: typing.Any = None) -> dict:
    """
    Freezing point (K) of a binary solution of a weak acid with the acid split into its forms, as a dict (equilibria/weak_acid_dissociation.hpp).
    """
def weak_acids() -> list:
    """
    The dissociation steps of the built-in weak acids, one dict per step, with sources.
    """
CRYOSCOPIC_CONSTANT: float = 1.8604572278991671
ENTHALPY_REFERENCE_TEMPERATURE: float = 233.15
ETHANOL_DENSITY_20C: float = 789.24
GAS_CONSTANT: float = 8.314462618
ICE_POINT: float = 273.15
MOLAR_MASS_WATER: float = 0.018015268
__version__: str = '0.1.0'
UnfrozenPhaseState = IceCurveState
