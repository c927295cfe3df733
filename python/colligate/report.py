"""Reports: the numbers of one recipe or solution, as a dict, as text and as tables.

:func:`build_report` evaluates a :class:`~colligate.recipe.Recipe` or a
:class:`colligate.Solution` and returns a plain, JSON-ready dict whose keys carry their
units (``freezing_point_K``, ``unfrozen_water_kg``, ...). :func:`format_text` lays that
dict out as a plain text report; :func:`format_json` serialises it;
:func:`ice_enthalpy_table` and :func:`write_table_csv` give the ice/enthalpy table.

This module only hands names on from the three layers, imported in this order:
:mod:`colligate.report_compute` (calls the core), :mod:`colligate.report_indicators`
(derived figures and the report dict), :mod:`colligate.report_layout` (text, JSON, CSV).

Every report ends with cautions: the values are model estimates, to be checked by
measurement, and food-safety decisions follow local codes, regulations and licensed
practice.
"""

from __future__ import annotations

from ._warnings import CAUTIONS
from .report_compute import (  # noqa: F401
    AW_REFERENCE_T_K,
    EUTECTIC_MARGIN_K,
    HEAT_LOAD_FROM_C,
    TABLE_COLUMNS,
    TABLE_RANGE_C,
    THERMAL_MIN_K,
    VERIFY_NOTE,
    WATER_ACTIVITY_NOTE,
    heat_load_end,
    ice_enthalpy_table,
)
from .report_indicators import REPORT_FORMAT, build_report  # noqa: F401
from .report_layout import NonFiniteValueWarning, format_json, format_text, write_table_csv  # noqa: F401

def report_schema() -> dict:
    """The JSON schema (draft 2020-12) of the report dict of :func:`build_report` and of
    ``colligate report --json``, as a dict (validate with the ``jsonschema`` package)."""
    import json
    from importlib import resources

    return json.loads((resources.files("colligate") / "data" / "report.schema.json").read_text(encoding="utf-8"))


__all__ = [
    "REPORT_FORMAT",
    "report_schema",
    "CAUTIONS",
    "VERIFY_NOTE",
    "build_report",
    "format_text",
    "format_json",
    "ice_enthalpy_table",
    "write_table_csv",
    "NonFiniteValueWarning",
]
