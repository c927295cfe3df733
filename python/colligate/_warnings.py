"""Warnings and cautions shared by every module of the package (the bottom layer).

Holds :class:`OutOfValidityRangeWarning`, the range policies, the cautions shown with
every report and by the command line, and the helper that turns a reason returned by the
compiled core into a warning. Imports nothing from the package, so every other module
can import it.
"""
from __future__ import annotations

import warnings

__all__ = ["CAUTIONS", "RANGE_POLICIES", "OutOfValidityRangeWarning", "SupersaturatedWarning"]

#: Cautions shown with every report and by the command line.
CAUTIONS = (
    "Predictions are estimates from published models and constants; real ingredients vary.",
    "Verify freezing behaviour and water activity by measurement before relying on them.",
    "Do not base food-safety decisions (water activity, brines, ethanol, freezing for "
    "safety, ice-salt baths) on these numbers alone; defer to local codes, regulations "
    "and licensed practice.",
)

RANGE_POLICIES = ("extrapolate", "nan", "raise")


class OutOfValidityRangeWarning(UserWarning):
    """A result was computed outside the validated range of its model (see the message)."""


class SupersaturatedWarning(UserWarning):
    """A solution lies above a salt's solubility; the message says which salt crystallises
    and which value was computed (the equilibrium state unless the metastable one was asked)."""


def _warn_supersaturated(notice: str) -> None:
    """Issue a supersaturation notice from the core as a :class:`SupersaturatedWarning`."""
    if notice:
        warnings.warn(notice, SupersaturatedWarning, stacklevel=3)


def _warn(reason: str, count: int = 1) -> None:
    """Issue ``reason`` (from the core) as an :class:`OutOfValidityRangeWarning`.

    Called directly by a public function, so the warning points at its caller.
    """
    if reason:
        prefix = f"{count} value(s) outside the validated range; first: " if count > 1 else ""
        warnings.warn(prefix + reason, OutOfValidityRangeWarning, stacklevel=3)
