"""After a build: every public Python name and every name of the C++ umbrella header has an
entry in the site's reference (the object inventory Sphinx wrote). Exit status 1 names the
missing ones.

    python docs/check_reference.py build/docs/html
"""
from __future__ import annotations

import pathlib
import sys

HERE = pathlib.Path(__file__).resolve().parent
sys.path.insert(0, str(HERE))


def documented(html_dir: pathlib.Path) -> dict[str, set[str]]:
    """Object names of the inventory, by domain ('py', 'cpp')."""
    from sphinx.util.inventory import InventoryFile

    with open(html_dir / "objects.inv", "rb") as fh:
        inv = InventoryFile.load(fh, "", lambda base, uri: uri)
    out: dict[str, set[str]] = {"py": set(), "cpp": set()}
    for role, entries in inv.items():
        domain = role.split(":", 1)[0]
        if domain in out:
            out[domain].update(entries)
    return out


def missing(html_dir: pathlib.Path) -> list[str]:
    import colligate
    from generate_pages import umbrella_names

    names = documented(html_dir)
    gaps = [f"python: colligate.{n}" for n in colligate.__all__
            if f"colligate.{n}" not in names["py"]]
    gaps += [f"c++: colligate::{layer}::{n}" for layer, n in umbrella_names()
             if f"colligate::{layer}::{n}" not in names["cpp"]]
    return gaps


def main(argv: list[str]) -> int:
    gaps = missing(pathlib.Path(argv[1]) if len(argv) > 1 else HERE.parent / "build" / "docs" / "html")
    for g in gaps:
        print(f"not in the reference: {g}", file=sys.stderr)
    return 1 if gaps else 0


if __name__ == "__main__":
    sys.exit(main(sys.argv))
