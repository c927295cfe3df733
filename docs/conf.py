"""Sphinx configuration of the colligate documentation site (built by scripts/docs.sh).

Generated pages (written before the build, never committed): _generated/models.md (the
model registry and the solute table, read from the compiled core), _generated/gallery/
(tools/validation_gallery.py), _generated/doxygen/ (Doxygen XML of the C++ headers, read by
breathe).
"""
from __future__ import annotations

import os
import pathlib
import sys

HERE = pathlib.Path(__file__).resolve().parent
ROOT = HERE.parent
sys.path.insert(0, str(HERE))

import colligate  # noqa: E402  (the installed package; the site documents what is installed)

project = "colligate"
author = "the colligate developers"
copyright = "the colligate developers"
release = colligate.__version__
version = release

extensions = [
    "myst_parser",
    "sphinx.ext.autodoc",
    "sphinx.ext.napoleon",
    "sphinxarg.ext",
    "breathe",
]
source_suffix = {".md": "markdown", ".rst": "restructuredtext"}
root_doc = "index"
exclude_patterns = ["_build", "README.md", "recipe_format.md", "_generated/doxygen"]
myst_heading_anchors = 3
html_theme = "alabaster"
html_static_path: list[str] = []
nitpicky = False

autodoc_default_options = {"members": True, "undoc-members": False, "show-inheritance": True}
autodoc_typehints = "description"
napoleon_numpy_docstring = True
napoleon_google_docstring = False
napoleon_use_rtype = False
napoleon_use_ivar = True  # dataclass fields are documented once, as fields of the class
myst_ref_domains = ["std", "py", "cpp"]

breathe_projects = {"colligate": str(HERE / "_generated" / "doxygen" / "xml")}
breathe_default_project = "colligate"
breathe_default_members = ("members",)
cpp_index_common_prefix = ["colligate::"]

suppress_warnings = [
    # The C++ domain warns on re-declarations that Doxygen lists for each header; the
    # reference page names each function once, so this is not a lost declaration.
    "duplicate_declaration.cpp",
]


def _generate(app) -> None:
    import generate_pages

    generate_pages.write_all(HERE / "_generated")


def setup(app):
    app.connect("builder-inited", _generate)
