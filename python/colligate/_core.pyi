"""
colligate compiled core: activity models, ice equilibrium, freezing points.
"""
from __future__ import annotations
import collections.abc
import numpy
import numpy.typing
import typing
__all__: list[str] = ['CRYOSCOPIC_CONSTANT', 'ConvergenceError', 'GAS_CONSTANT', 'ICE_POINT', 'InvalidInputError', 'MOLAR_MASS_WATER', 'OutOfValidityRangeError', 'Solution', 'SolutionBatchCore', 'UnfrozenPhaseState', 'batch_freezing_points', 'batch_ice_fractions', 'batch_water_activities', 'citation', 'citation_table', 'describe_model', 'enthalpy_of_fusion', 'freezing_point', 'ice_fraction', 'ice_vapour_pressure', 'liquid_vapour_pressure', 'ln_water_activity_of_ice', 'models', 'osmotic_coefficient', 'row_status_reasons', 'solute_table', 'unfrozen_phase', 'water_activity']
class InvalidInputError(ValueError):
    pass
class OutOfValidityRangeError(ValueError):
    pass
class ConvergenceError(RuntimeError):
    pass
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
    """
    @staticmethod
    def from_brix(brix: typing.SupportsFloat | typing.SupportsIndex) -> Solution:
        """
        Sucrose solution of the given Brix (mass percent sucrose), 1 kg.
        """
    @staticmethod
    def from_mass_fractions(fractions: typing.Any, total_mass: typing.SupportsFloat | typing.SupportsIndex = 1.0) -> Solution:
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
    def from_molalities(molalities: typing.Any, water: typing.SupportsFloat | typing.SupportsIndex = 1.0) -> Solution:
        """
        Solution from molalities, mol per kg of water, with ``water`` kg of water.
        """
    @staticmethod
    def from_mole_fractions(fractions: typing.Any) -> Solution:
        """
        Solution from solute mole fractions (formula units, undissociated); rest is water.
        """
    def __init__(self, water: typing.SupportsFloat | typing.SupportsIndex, solutes: typing.Any = {}) -> None:
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
class UnfrozenPhaseState:
    """
    State of a partly frozen solution at one temperature (SI).
    """
    @property
    def bound_water(self) -> float:
        """
        Unfreezable water, kg.
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
    def iterations(self) -> int:
        ...
    @property
    def reason(self) -> str:
        """
        Why the result is outside the validated range ('' if inside).
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
        Water in the food, kg.
        """
    @property
    def unfrozen_water(self) -> float:
        """
        Liquid water, kg.
        """
    @property
    def water_activity(self) -> float:
        """
        Water activity of the unfrozen phase.
        """
class SolutionBatchCore:
    """
    Many solutions with one species list (molalities, mol/kg water).
    """
    @staticmethod
    def from_mass_fractions(species: collections.abc.Sequence[str], mass_fractions: typing.Annotated[numpy.typing.ArrayLike, numpy.float64]) -> SolutionBatchCore:
        ...
    @staticmethod
    def from_molalities(species: collections.abc.Sequence[str], molalities: typing.Annotated[numpy.typing.ArrayLike, numpy.float64]) -> SolutionBatchCore:
        ...
    @property
    def rows(self) -> int:
        ...
    @property
    def species(self) -> list[str]:
        ...
def batch_freezing_points(batch: SolutionBatchCore, model: str = 'auto', threads: typing.SupportsInt | typing.SupportsIndex = 0, range_policy: str = 'extrapolate', bound_water_fraction: typing.SupportsFloat | typing.SupportsIndex = 0.0) -> tuple[numpy.typing.NDArray[numpy.float64], numpy.typing.NDArray[numpy.uint8]]:
    ...
def batch_ice_fractions(batch: SolutionBatchCore, temperatures: typing.Annotated[numpy.typing.ArrayLike, numpy.float64], model: str = 'auto', threads: typing.SupportsInt | typing.SupportsIndex = 0, range_policy: str = 'extrapolate', bound_water_fraction: typing.SupportsFloat | typing.SupportsIndex = 0.0) -> tuple[numpy.typing.NDArray[numpy.float64], numpy.typing.NDArray[numpy.uint8]]:
    ...
def batch_water_activities(batch: SolutionBatchCore, temperature: typing.SupportsFloat | typing.SupportsIndex, model: str = 'auto', threads: typing.SupportsInt | typing.SupportsIndex = 0, range_policy: str = 'extrapolate') -> tuple[numpy.typing.NDArray[numpy.float64], numpy.typing.NDArray[numpy.uint8]]:
    ...
def citation(key: str) -> dict:
    """
    One source of the citation table by key.
    """
def citation_table() -> list:
    """
    All sources cited by the built-in data, as a list of dicts.
    """
def describe_model(solution: Solution, model: str = 'auto') -> str:
    """
    Which model and constants a calculation on this solution uses.
    """
def enthalpy_of_fusion(temperature: typing.SupportsFloat | typing.SupportsIndex) -> float:
    """
    Molar enthalpy of fusion of ice at ``temperature`` (K), J/mol.
    """
def freezing_point(solution: Solution, model: str = 'auto', range_policy: str = 'extrapolate', bound_water: typing.SupportsFloat | typing.SupportsIndex = 0.0) -> tuple[float, str]:
    ...
def ice_fraction(solution: Solution, temperature: typing.Annotated[numpy.typing.ArrayLike, numpy.float64], model: str = 'auto', range_policy: str = 'extrapolate', bound_water: typing.SupportsFloat | typing.SupportsIndex = 0.0) -> tuple[numpy.typing.NDArray[numpy.float64], str, int]:
    ...
def ice_vapour_pressure(temperature: typing.SupportsFloat | typing.SupportsIndex) -> float:
    """
    Vapour pressure of ice, Pa (Murphy & Koop 2005 eq. 7).
    """
def liquid_vapour_pressure(temperature: typing.SupportsFloat | typing.SupportsIndex) -> float:
    """
    Vapour pressure of liquid or supercooled water, Pa (Murphy & Koop 2005 eq. 10).
    """
def ln_water_activity_of_ice(temperature: typing.SupportsFloat | typing.SupportsIndex) -> float:
    """
    ln a_w of a solution in equilibrium with ice at ``temperature`` (K), one atmosphere.
    """
def models() -> list[str]:
    """
    Ids of the activity models.
    """
def osmotic_coefficient(solution: Solution, temperature: typing.SupportsFloat | typing.SupportsIndex, model: str = 'auto', range_policy: str = 'extrapolate') -> tuple[float, str]:
    ...
def row_status_reasons() -> list[str]:
    """
    Readable reason for each row status code (index = code).
    """
def solute_table() -> list:
    """
    The built-in solute table as a list of dicts (SI units, with source keys).
    """
def unfrozen_phase(solution: Solution, temperature: typing.SupportsFloat | typing.SupportsIndex, model: str = 'auto', bound_water: typing.SupportsFloat | typing.SupportsIndex = 0.0) -> UnfrozenPhaseState:
    ...
def water_activity(solution: Solution, temperature: typing.SupportsFloat | typing.SupportsIndex, model: str = 'auto', range_policy: str = 'extrapolate') -> tuple[float, str]:
    ...
CRYOSCOPIC_CONSTANT: float = 1.8604572278991671
GAS_CONSTANT: float = 8.314462618
ICE_POINT: float = 273.15
MOLAR_MASS_WATER: float = 0.018015268
__version__: str = '0.1.0'
