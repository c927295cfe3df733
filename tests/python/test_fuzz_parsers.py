"""Hypothesis fuzzing of the input parsers: recipes (TOML), the ingredient library (TOML),
fitted-solute files (TOML) and fit data (CSV).

Random bytes and structured-but-wrong documents must give a recipe, a library, a solute
or a table, or one of the package's documented errors (see the error catalogue in
DEVELOPERS.md), never an internal error such as KeyError, TypeError, AttributeError or
RecursionError. The command line on garbage prints one line and exits with status 2.
No check value here comes from a publication.
"""

from __future__ import annotations

import math

import pytest
import tomli_w
from hypothesis import HealthCheck, assume, given, settings
from hypothesis import strategies as st

import colligate as cg
from colligate import cli, fit
from colligate._files import InputFileError
from colligate.ingredients import IngredientError, _parse_library
from colligate.recipe import RecipeError, load_recipe, parse_recipe

FUZZ = settings(max_examples=300, deadline=None, suppress_health_check=[HealthCheck.too_slow,
                                                                        HealthCheck.function_scoped_fixture])

# ---------------------------------------------------------------- strategies

_finite = st.floats(allow_nan=False, allow_infinity=False, min_value=-1e6, max_value=1e6)
scalars = st.one_of(
    st.booleans(),
    st.integers(min_value=-10**6, max_value=10**6),
    st.floats(allow_nan=True, allow_infinity=True),
    st.text(max_size=20),
    st.datetimes(),
)
values = st.recursive(scalars, lambda inner: st.one_of(
    st.lists(inner, max_size=3), st.dictionaries(st.text(min_size=1, max_size=8), inner, max_size=3)),
    max_leaves=6)

SOLUTES = ["water", "sucrose", "glucose", "NaCl", "sodium chloride", "ethanol", "citric_acid", "lactose",
           "Sucrose ", "unknownium", "WATER"]
INGREDIENTS = ["water", "whole_milk", "cream_36", "sucrose", "salt", "strawberry", "no_such_thing"]
amounts = st.one_of(
    st.floats(min_value=0.0, max_value=2.0), st.integers(min_value=0, max_value=100),
    st.floats(allow_nan=True, allow_infinity=True), st.floats(-1.0, 0.0), values)
maybe = st.sampled_from([True] * 9 + [False])  # False: the unusual branch


@st.composite
def recipe_documents(draw):
    """Documents shaped like recipes: the right tables and keys, some values wrong."""
    head = {}
    if draw(maybe) or draw(maybe):
        head["name"] = draw(st.text(min_size=1, max_size=5)) if draw(maybe) else draw(values)
    good = {"note": st.text(max_size=30), "label": st.text(max_size=10), "basis": st.sampled_from(["kg", "percent"]),
            "batch_kg": st.floats(0.01, 100.0), "colour": st.just("red")}
    for key in draw(st.lists(st.sampled_from(["note", "label", "basis", "batch_kg"] * 3 + ["colour"]),
                             unique=True, max_size=3)):
        head[key] = draw(good[key]) if draw(maybe) else draw(st.one_of(amounts, st.text(max_size=5)))
    doc = {"recipe": head} if draw(maybe) else {"recipe": draw(values)}
    kind = draw(st.sampled_from(["composition", "ingredients", "both", "none"]))
    if kind in ("composition", "both"):
        doc["composition"] = {k: draw(amounts) for k in draw(st.lists(st.sampled_from(SOLUTES), unique=True,
                                                                      max_size=5))}
    if kind in ("ingredients", "both"):
        doc["ingredients"] = {k: draw(amounts) for k in draw(st.lists(st.sampled_from(INGREDIENTS), unique=True,
                                                                      max_size=4))}
    if not draw(maybe):
        doc["temperatures_celsius"] = {k: draw(st.one_of(st.floats(-100, 60), values)) for k in draw(
            st.lists(st.sampled_from(["drawing", "serving", "storage", "melting"]), unique=True, max_size=3))}
    if not draw(maybe):
        doc["options"] = {k: draw(st.one_of(amounts, st.sampled_from(["auto", "norrish", "pitzer", "nope"])))
                          for k in draw(st.lists(st.sampled_from(["model", "bound_water_fraction_of_water", "strict"]), unique=True,
                                                 max_size=2))}
    if not draw(maybe) and not draw(maybe):
        doc[draw(st.sampled_from(["extra", "composition", "options"]))] = draw(values)
    return doc


INGREDIENT_KEYS = ["name", "water", "fat", "protein", "fibre", "ash", "other_solids", "ethanol", "msnf",
                   "sugars", "acids", "salts", "other_solutes", "category", "source", "note", "colour"]


@st.composite
def library_documents(draw):
    doc = {}
    for key in draw(st.lists(st.text(alphabet="abcxyz_", min_size=1, max_size=6), unique=True, max_size=3)):
        fields = draw(st.lists(st.sampled_from(INGREDIENT_KEYS), unique=True, max_size=8))
        entry = {}
        for f in fields:
            if f in ("sugars", "acids", "salts", "other_solutes"):
                entry[f] = draw(st.one_of(values, st.dictionaries(
                    st.sampled_from(["sucrose", "glucose", "NaCl", "unknownium"]),
                    st.one_of(st.floats(0, 1), values), max_size=2)))
            elif f in ("name", "category", "source", "note"):
                entry[f] = draw(st.one_of(st.text(max_size=10), values))
            else:
                entry[f] = draw(st.one_of(st.floats(-0.5, 1.5), values))
        doc[key] = entry if draw(st.integers(0, 9)) else draw(values)
    return doc


@st.composite
def solute_documents(draw):
    solute = {k: draw(st.one_of(values, _finite, st.text(max_size=8)))
              for k in draw(st.lists(st.sampled_from(
                  ["id", "name", "molar_mass", "norrish_k", "norrish_k3", "max_mass_fraction",
                   "bound_water_per_solids", "note", "salt", "pitzer", "uncertainty"]), unique=True, max_size=8))}
    if "uncertainty" in solute and draw(st.booleans()):
        n = draw(st.integers(0, 2))
        solute["uncertainty"] = {"names": draw(st.lists(st.sampled_from(["norrish_k", "norrish_k3", "beta0", "x"]),
                                                        min_size=n, max_size=n)),
                                 "covariance": [[draw(st.one_of(_finite, values)) for _ in range(n)] for _ in range(n)],
                                 "degrees_of_freedom": draw(st.one_of(st.integers(-1, 50), values))}
    if "pitzer" in solute and draw(st.booleans()):
        solute["pitzer"] = {k: draw(st.one_of(_finite, values)) for k in draw(st.lists(st.sampled_from(
            ["beta0", "beta1", "beta2", "cphi", "max_molality", "min_temperature", "max_temperature",
             "source"]), unique=True, max_size=8))}
    doc = {"format": draw(st.one_of(st.just(fit.FORMAT_NAME), values)),
           "version": draw(st.one_of(st.integers(0, 3), values)), "solute": solute}
    if draw(st.booleans()):
        doc["fit"] = {"parameters": draw(st.dictionaries(st.text(min_size=1, max_size=5), values, max_size=2))}
    if draw(st.booleans()):
        doc["provenance"] = draw(values)
    return doc


def toml_text(doc) -> str:
    try:
        return tomli_w.dumps(doc)
    except (TypeError, ValueError):  # not representable in TOML (e.g. a table inside an array mix)
        assume(False)
        raise


# ---------------------------------------------------------------- recipes


def _recipe_or_documented_error(text: str):
    try:
        r = parse_recipe(text, "fuzz")
    except RecipeError as exc:
        assert str(exc).startswith("recipe 'fuzz': "), exc
        return None
    # a recipe that parses is valid: positive water, finite amounts
    assert r.water > 0 and math.isfinite(r.water)
    assert all(math.isfinite(v) and v >= 0 for v in r.solutes.values())
    return r


@FUZZ
@given(st.text(max_size=400))
def test_recipe_parser_on_random_text(text):
    _recipe_or_documented_error(text)


@FUZZ
@given(recipe_documents())
def test_recipe_parser_on_structured_but_wrong_documents(doc):
    _recipe_or_documented_error(toml_text(doc))


@FUZZ
@given(st.binary(max_size=400))
def test_recipe_file_of_random_bytes(tmp_path, data):
    p = tmp_path / "fuzz.toml"
    p.write_bytes(data)
    try:
        load_recipe(p)
    except RecipeError as exc:
        assert str(exc).startswith(f"recipe '{p}': ")


# ---------------------------------------------------------------- ingredient library


@FUZZ
@given(st.one_of(st.text(max_size=300), library_documents().map(toml_text)))
def test_library_parser_gives_ingredients_or_ingredient_error(text):
    try:
        lib = _parse_library(text, "fuzz library")
    except IngredientError as exc:
        assert str(exc).startswith("fuzz library: ") or str(exc).startswith("ingredient"), exc
        return
    for ing in lib.values():
        assert 0.0 <= ing.water <= 1.0 and ing.total() <= 1.0 + 0.005


# ---------------------------------------------------------------- fitted-solute files


@FUZZ
@given(st.one_of(st.binary(max_size=300), solute_documents().map(lambda d: toml_text(d).encode())))
def test_solute_file_gives_a_solute_or_invalid_input(tmp_path, data):
    p = tmp_path / "fuzz_solute.toml"
    p.write_bytes(data)
    try:
        fs = fit.load_solute(p)
    except cg.InvalidInputError as exc:
        assert str(p) in str(exc) or "solute" in str(exc), exc
        return
    assert fs.record.molar_mass > 0


# ---------------------------------------------------------------- fit data (CSV)

cells = st.one_of(st.floats(allow_nan=True, allow_infinity=True).map(repr), st.text(max_size=6),
                  st.integers(-5, 5).map(str), st.just(""))


@st.composite
def csv_documents(draw):
    cols = draw(st.lists(st.sampled_from(list(fit.FIT_DATA_COLUMNS) + ["note", "x"]), min_size=1, max_size=4))
    rows = draw(st.lists(st.lists(cells, min_size=len(cols) - 1, max_size=len(cols) + 1), max_size=6))
    return "\n".join([",".join(cols)] + [",".join(r) for r in rows]) + "\n"


@FUZZ
@given(st.one_of(st.binary(max_size=300), csv_documents().map(str.encode)))
def test_fit_data_reader_gives_numbers_or_input_file_error(tmp_path, data):
    p = tmp_path / "fuzz.csv"
    p.write_bytes(data)
    try:
        df = fit.read_fit_data(p)
    except InputFileError as exc:
        assert f"data file '{p}'" in str(exc), exc
        return
    for col in fit.FIT_DATA_COLUMNS:
        if col in df.columns:
            assert df[col].map(math.isfinite).all()


# ---------------------------------------------------------------- the command on garbage


@settings(max_examples=25, deadline=None, suppress_health_check=[HealthCheck.function_scoped_fixture])
@given(data=st.binary(max_size=200), command=st.sampled_from(["report", "fit"]))
def test_command_on_garbage_prints_one_line_and_exits_2(tmp_path, capsys, data, command):
    p = tmp_path / ("garbage.toml" if command == "report" else "garbage.csv")
    p.write_bytes(data)
    argv = ["report", str(p)] if command == "report" else ["fit", str(p), "--model", "norrish",
                                                             "--plot", str(tmp_path / "g.png")]
    code = cli.main(argv)
    out, err = capsys.readouterr()
    if code == cli.EXIT_OK:  # garbage that happens to be valid input
        return
    assert code == cli.EXIT_ERROR, err
    lines = err.strip().splitlines()
    assert len(lines) == 1 and lines[0].startswith("colligate: error: ") and "Traceback" not in err, err
    assert out == ""
    assert not (tmp_path / "g.png").exists()


@pytest.mark.parametrize("text", [
    "[recipe]\nname = 'x'\n[composition]\nwater = {a = 1}\n",
    "[recipe]\nname = 'x'\n[composition]\nwater = 1\nsucrose = [1, 2]\n",
    "recipe = 3\n",
    "[recipe]\nname = 'x'\n[ingredients]\nwhole_milk = 1\n[options]\nbound_water_fraction_of_water = 'lots'\n",
    "[recipe]\nname = 'x'\n[composition]\nwater = 1\nsucrose = 1979-05-27\n",
    "[recipe]\nname = 'x'\n[composition]\nwater = 1\n'sucr\\u00f6se' = 0.1\n",
])
def test_known_awkward_recipes(text):
    with pytest.raises(RecipeError):
        parse_recipe(text, "awkward")
