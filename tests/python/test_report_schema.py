"""The JSON report follows its schema (validated with the jsonschema package)."""
from __future__ import annotations

import json

import jsonschema
import pytest

import colligate as cg
from colligate import cli
from colligate.recipe import load_demo_recipe, parse_recipe
from colligate.report import REPORT_FORMAT, build_report, format_json, report_schema

BRINE = '[recipe]\nname = "brine"\n[composition]\nwater = 0.8\nNaCl = 0.2\n[temperatures_celsius]\nstorage = -30\n'


def validate(report: dict) -> None:
    jsonschema.validate(json.loads(format_json(report)), report_schema(),
                        format_checker=jsonschema.FormatChecker())


def test_schema_is_a_valid_schema_of_this_format():
    schema = report_schema()
    jsonschema.Draft202012Validator.check_schema(schema)
    assert schema["properties"]["report_format"]["const"] == REPORT_FORMAT


@pytest.mark.parametrize("subject", ["ice_cream", "sorbet", "brine", "solution", "cocktail"])
def test_reports_validate(subject):
    if subject in ("ice_cream", "sorbet"):
        rep = build_report(load_demo_recipe(subject))
    elif subject == "brine":
        rep = build_report(parse_recipe(BRINE, "brine"))
    elif subject == "solution":
        rep = build_report(cg.Solution(water=0.8, solutes={"sucrose": 0.2}))
    else:
        rep = build_report(cg.Recipe(water=0.7, solutes={"ethanol": 0.1, "sucrose": 0.2}))
    validate(rep)


def test_schema_rejects_an_ambiguous_or_unknown_key():
    rep = build_report(cg.Solution(water=0.8, solutes={"sucrose": 0.2}))
    rep["total_solids_mass_percent"] = 20.0  # the old name without its basis
    with pytest.raises(jsonschema.ValidationError, match="total_solids_mass_percent"):
        validate(rep)


def test_cli_json_validates(tmp_path, capsys):
    assert cli.main(["demo", "--json", "--out", str(tmp_path)]) == cli.EXIT_OK
    out = capsys.readouterr().out
    jsonschema.validate(json.loads(out), report_schema())
