"""The mutation drill (tools/mutation_drill.py) plants each bug by replacing one exact piece
of source text. A refactor that changes that text silently disables the mutation, so every
mutation's text must occur exactly once in its file (the drill itself refuses otherwise,
but it is not part of CI)."""
import importlib.util
import sys
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parents[2]
_spec = importlib.util.spec_from_file_location("mutation_drill", ROOT / "tools" / "mutation_drill.py")
drill = importlib.util.module_from_spec(_spec)
sys.modules["mutation_drill"] = drill  # dataclasses look their module up there
_spec.loader.exec_module(drill)


@pytest.mark.parametrize("mutation", drill.MUTATIONS, ids=lambda m: m.name)
def test_each_planted_bug_still_finds_its_text_once(mutation):
    text = (ROOT / mutation.path).read_text(encoding="utf-8")
    assert text.count(mutation.old) == 1, (
        f"{mutation.name}: its text occurs {text.count(mutation.old)} times in {mutation.path}; "
        "update tools/mutation_drill.py")
    assert mutation.new != mutation.old
