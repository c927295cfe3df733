"""The documentation site's generated reference pages (docs/generate_pages.py) name every
public Python name and every name of the C++ umbrella header. scripts/docs.sh then checks the
built site's inventory against the same lists (docs/check_reference.py)."""
from __future__ import annotations

import importlib.util
import pathlib
import sys

import colligate

ROOT = pathlib.Path(__file__).resolve().parents[2]


def _module(name: str):
    if name in sys.modules:
        return sys.modules[name]
    spec = importlib.util.spec_from_file_location(name, ROOT / "docs" / f"{name}.py")
    module = importlib.util.module_from_spec(spec)
    sys.modules[name] = module
    spec.loader.exec_module(module)
    return module


def test_python_reference_page_has_every_public_name():
    page = _module("generate_pages").python_api_page()
    entries = {line.split("::", 1)[1].strip() for line in page.splitlines() if line.startswith(".. auto")}
    assert entries == {f"colligate.{n}" for n in colligate.__all__}


def test_umbrella_names_are_read_from_the_header():
    names = _module("generate_pages").umbrella_names()
    assert ("equilibria", "freezing_point") in names
    assert ("models", "water_activity") in names
    header = (ROOT / "cpp" / "include" / "colligate" / "colligate.hpp").read_text(encoding="utf-8")
    assert len(names) == header.count("\nusing ")


def test_model_page_lists_every_registered_model_with_its_sources():
    page = _module("generate_pages").models_page()
    for model in colligate.models():
        if model != "auto":
            assert f"| `{model}` |" in page
    assert "Chirife" in page and "Pitzer" in page        # sources named in the summaries
    assert "verify" in page                               # the cautions


def test_pages_on_brines_water_activity_or_ethanol_carry_the_cautions():
    # common practice: food-safety results come with "verify by measurement, defer to local
    # codes and licensed practice"
    pages = [p for p in (ROOT / "docs").rglob("*.md") if "_generated" not in p.parts]
    topics = ("brine", "water activity", "ethanol", "alcohol")
    checked = 0
    for page in pages:
        text = page.read_text(encoding="utf-8").lower()
        if any(t in text for t in topics):
            checked += 1
            assert "verify" in text and "measure" in text, page.name
    assert checked >= 5
