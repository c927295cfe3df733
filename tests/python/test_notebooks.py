"""The worked notebooks in notebooks_examples/ are stored without outputs."""

from __future__ import annotations

import json
from pathlib import Path

import pytest

NOTEBOOKS = sorted((Path(__file__).resolve().parents[2] / "notebooks_examples").glob("*.ipynb"))


@pytest.mark.parametrize("path", NOTEBOOKS, ids=[p.name for p in NOTEBOOKS])
def test_notebook_is_stored_without_outputs(path):
    nb = json.loads(path.read_text(encoding="utf-8"))
    assert nb["nbformat"] == 4
    for cell in nb["cells"]:
        if cell["cell_type"] == "code":
            assert cell["outputs"] == [], f"{path.name}: strip outputs before committing"
            assert cell["execution_count"] is None


def test_notebooks_exist():
    # The notebooks themselves are executed by nbmake (scripts/test.sh runs
    # `pytest ... notebooks_examples --nbmake`); each ends with a cited assert cell.
    assert NOTEBOOKS
