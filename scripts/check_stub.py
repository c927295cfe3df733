"""Regenerates the type stub of colligate._core and fails if it differs from the
committed python/colligate/_core.pyi. Run with --write to update the committed stub."""
from __future__ import annotations

import pathlib
import subprocess
import sys
import tempfile

ROOT = pathlib.Path(__file__).resolve().parents[1]
COMMITTED = ROOT / "python" / "colligate" / "_core.pyi"


def generate() -> str:
    with tempfile.TemporaryDirectory() as tmp:
        subprocess.run(
            [sys.executable, "-m", "pybind11_stubgen", "colligate._core", "-o", tmp,
             "--numpy-array-use-type-var"],
            check=True, cwd=tmp, capture_output=True, text=True,
        )
        return (pathlib.Path(tmp) / "colligate" / "_core.pyi").read_text()


def main() -> int:
    fresh = generate()
    if "--write" in sys.argv:
        COMMITTED.write_text(fresh)
        print(f"wrote {COMMITTED}")
        return 0
    if not COMMITTED.exists() or COMMITTED.read_text() != fresh:
        print("python/colligate/_core.pyi is out of date: run python3 scripts/check_stub.py --write",
              file=sys.stderr)
        return 1
    print("stub up to date")
    return 0


if __name__ == "__main__":
    sys.exit(main())
