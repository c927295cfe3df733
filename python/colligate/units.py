"""Temperature conversions used at the edges of colligate (reports and CLI).

Everything inside colligate is SI: temperatures are kelvin. Celsius and
Fahrenheit appear only where a person reads or types a number. The functions
here convert *points* on a temperature scale, not differences: a difference of
1 K is a difference of 1 degC, and 1.8 degF.

Every input is validated: it must be a finite real number and the resulting
thermodynamic temperature must be above 0 K.
"""

from __future__ import annotations

import math

__all__ = [
    "ZERO_CELSIUS_K",
    "celsius_from_kelvin",
    "kelvin_from_celsius",
    "fahrenheit_from_kelvin",
    "kelvin_from_fahrenheit",
    "TEMPERATURE_UNITS",
    "kelvin_from",
    "parse_temperature",
]

#: 0 degC expressed in kelvin (exact, by definition of the Celsius scale).
ZERO_CELSIUS_K = 273.15


def _finite(value: object, name: str, unit: str) -> float:
    if isinstance(value, bool):
        raise ValueError(f"{name} = {value!r}: must be a finite number ({unit})")
    try:
        x = float(value)  # type: ignore[arg-type]
    except (TypeError, ValueError):
        raise ValueError(f"{name} = {value!r}: must be a finite number ({unit})") from None
    if not math.isfinite(x):
        raise ValueError(f"{name} = {value!r}: must be a finite number ({unit})")
    return x


def _above_absolute_zero(kelvin: float, name: str, shown: str) -> float:
    if not kelvin > 0.0:
        raise ValueError(f"{name} = {shown}: must be above absolute zero (> 0 K, > -273.15 degC, > -459.67 degF)")
    return kelvin


def celsius_from_kelvin(kelvin: float) -> float:
    """Convert a temperature point from kelvin to degrees Celsius.

    Parameters
    ----------
    kelvin : float
        Temperature in K; finite and > 0.

    Returns
    -------
    float
        Temperature in degC.
    """
    k = _finite(kelvin, "temperature", "K")
    _above_absolute_zero(k, "temperature", f"{k} K")
    return k - ZERO_CELSIUS_K


def kelvin_from_celsius(celsius: float) -> float:
    """Convert a temperature point from degrees Celsius to kelvin.

    Parameters
    ----------
    celsius : float
        Temperature in degC; finite and > -273.15.

    Returns
    -------
    float
        Temperature in K.
    """
    c = _finite(celsius, "temperature", "degC")
    return _above_absolute_zero(c + ZERO_CELSIUS_K, "temperature", f"{c} degC")


def fahrenheit_from_kelvin(kelvin: float) -> float:
    """Convert a temperature point from kelvin to degrees Fahrenheit.

    Parameters
    ----------
    kelvin : float
        Temperature in K; finite and > 0.

    Returns
    -------
    float
        Temperature in degF (T_F = T_K * 9/5 - 459.67).
    """
    k = _finite(kelvin, "temperature", "K")
    _above_absolute_zero(k, "temperature", f"{k} K")
    return k * 9.0 / 5.0 - 459.67


def kelvin_from_fahrenheit(fahrenheit: float) -> float:
    """Convert a temperature point from degrees Fahrenheit to kelvin.

    Parameters
    ----------
    fahrenheit : float
        Temperature in degF; finite and > -459.67.

    Returns
    -------
    float
        Temperature in K.
    """
    f = _finite(fahrenheit, "temperature", "degF")
    return _above_absolute_zero((f + 459.67) * 5.0 / 9.0, "temperature", f"{f} degF")


#: Units a person may type a temperature in, and their spellings (case-insensitive).
TEMPERATURE_UNITS: dict[str, tuple[str, ...]] = {
    "C": ("c", "degc", "°c", "celsius"),
    "K": ("k", "kelvin"),
    "F": ("f", "degf", "°f", "fahrenheit"),
}


def _unit_id(unit: str) -> str:
    u = str(unit).strip().lower().replace(" ", "")
    for key, spellings in TEMPERATURE_UNITS.items():
        if u in spellings:
            return key
    raise ValueError(f"temperature unit {unit!r}: unknown; use C (degC), K or F (degF)")


def kelvin_from(value: float, unit: str) -> float:
    """A temperature point given in ``unit`` ("C", "K" or "F", see
    :data:`TEMPERATURE_UNITS`) in kelvin."""
    u = _unit_id(unit)
    if u == "C":
        return kelvin_from_celsius(value)
    if u == "F":
        return kelvin_from_fahrenheit(value)
    k = _finite(value, "temperature", "K")
    return _above_absolute_zero(k, "temperature", f"{k} K")


def parse_temperature(text: str, default_unit: str = "C") -> float:
    """A temperature typed by a person, in kelvin: a number with an optional unit
    (``"-12"``, ``"-12C"``, ``"-12 °C"``, ``"10F"``, ``"261.15 K"``); without a unit it is
    in ``default_unit``."""
    raw = str(text).strip()
    number = raw
    unit = default_unit
    for key, spellings in TEMPERATURE_UNITS.items():
        for sp in sorted(spellings, key=len, reverse=True):
            if raw.lower().endswith(sp) and len(raw) > len(sp):
                number, unit = raw[: len(raw) - len(sp)].strip(), key
                break
        if unit != default_unit or number != raw:
            break
    try:
        x = float(number)
    except ValueError:
        raise ValueError(f"temperature {text!r}: not a number with an optional unit "
                         "(C, K or F), e.g. -12C, 10F, 261.15K") from None
    return kelvin_from(x, unit)
