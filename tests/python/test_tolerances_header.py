"""tools/tolerances_header.py: tests/reference/tolerances.toml as the C++ header the Catch2
validation suite reads (one tolerance file for the gallery, pytest and C++)."""
from __future__ import annotations

import importlib.util
import pathlib
import sys
import tomllib

import pytest

ROOT = pathlib.Path(__file__).resolve().parents[2]
SCRIPT = ROOT / "tools" / "tolerances_header.py"


def _tool():
    if "tolerances_header" in sys.modules:
        return sys.modules["tolerances_header"]
    spec = importlib.util.spec_from_file_location("tolerances_header", SCRIPT)
    module = importlib.util.module_from_spec(spec)
    sys.modules["tolerances_header"] = module
    spec.loader.exec_module(module)
    return module


def test_row_queries_and_tolerances_translate():
    t = _tool().translate
    assert t("0.2") == "0.2"
    assert t("solute in ['sucrose', 'glucose']") == \
        '(text(r, "solute") == "sucrose" || text(r, "solute") == "glucose")'
    assert t("mass_percent <= 28") == '(num(r, "mass_percent") <= 28.0)'
    assert t("not note.str.contains('below')") == '!((text(r, "note").find("below") != std::string::npos))'
    assert t("note.str.startswith('within')") == '(text(r, "note").rfind("within", 0) == 0)'
    assert t("0.01 * a + 0.03 * (b - a)") == '((0.01 * num(r, "a")) + (0.03 * (num(r, "b") - num(r, "a"))))'
    assert t("(s == 'x') & (m == 2)") == '((text(r, "s") == "x") && (num(r, "m") == 2.0))'


@pytest.mark.parametrize("expression", ["abs(x)", "x ** 2", "x.str.lower()", "x in y", "x[0]"])
def test_forms_it_does_not_know_are_refused(expression):
    with pytest.raises(_tool().Untranslatable):
        _tool().translate(expression)


def test_every_check_of_the_tolerance_file_becomes_cpp():
    with open(ROOT / "tests" / "reference" / "tolerances.toml", "rb") as fh:
        config = tomllib.load(fh)
    text = _tool().header(config, "tolerances.toml")
    for entry in config["check"]:
        assert f'"{entry["id"]}"' in text
    assert text.count("inline bool selects_") == len(config["check"])
    # a tolerance_plus without a value for a row's key fails loudly, not silently as zero
    assert 'tolerance_plus has no value' in text


def test_an_untranslatable_check_stops_the_build_with_its_id():
    config = {"check": [{"id": "bad_check", "file": "x.csv", "published": "y", "basis": "b" * 30,
                         "rows": "", "tolerance": "abs(y)"}]}
    with pytest.raises(SystemExit, match="bad_check"):
        _tool().header(config, "tolerances.toml")
