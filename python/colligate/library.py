"""A library of your own solutes and ingredients, next to the built-in ones.

A :class:`Library` holds solutes (fitted with :mod:`colligate.fit` or written by hand:
molar mass and Norrish constant, or a salt with its own Pitzer row) and ingredients (mass
fractions, like the built-in ingredient library). Pass it to a recipe::

    lib = cg.Library.load("house.toml")                    # or cg.Library(solutes=[fitted])
    r = cg.Recipe(ingredients={"house_base": 0.8, "sucrose": 0.2}, library=lib)

A library includes the built-in solutes and ingredients unless built with
``include_builtin=False``; :meth:`Library.merge` joins two libraries. A name used twice
(an id, a display name or an alias of a solute; the key or display name of an ingredient)
is an error that names both entries. Nothing is registered globally: a library is a value
you pass around.

File format (TOML, SI units, keys of our own; read with tomllib, written with tomli-w)::

    format = "colligate-library"
    version = 1

    [solutes.house_syrup]          # the [solute] table of a fitted-solute file
    name = "house syrup solids"
    molar_mass = 0.31              # kg/mol
    norrish_k = 5.2
    max_mass_fraction = 0.6

    [ingredients.house_base]       # an ingredient, as in the built-in ingredients.toml
    name = "house base"
    water = 0.70
    sugars = { house_syrup = 0.30 }
    source = "our lab, batch 12 (measured)"

Files written by ``colligate fit --save-solute`` load too (:meth:`Library.load_file`).
"""
from __future__ import annotations

import difflib
import os
import sys
from typing import Any, Iterable, Mapping, Optional

if sys.version_info >= (3, 11):
    import tomllib
else:  # pragma: no cover
    import tomli as tomllib

from . import _core
from .fit import FORMAT_NAME as FITTED_SOLUTE_FORMAT
from .fit import FittedSolute, SoluteLibrary, solute_from_document, solute_from_entry
from .ingredients import Ingredient, IngredientError, ingredient_from_entry, library as _builtin_ingredients
from .ingredients import normal_name

__all__ = ["Library", "LibraryError", "LIBRARY_FORMAT", "LIBRARY_VERSION"]

LIBRARY_FORMAT = "colligate-library"
LIBRARY_VERSION = 1


class LibraryError(_core.InvalidInputError):
    """A library file is malformed, or two entries claim the same name."""


def _solute_names(record: Any) -> list[str]:
    return [str(record.id), str(record.name), *[str(a) for a in getattr(record, "aliases", [])]]


class Library:
    """Solutes and ingredients of your own, beside the built-in ones (see the module text).

    Parameters
    ----------
    solutes : iterable of FittedSolute
        Own solutes (from :meth:`colligate.fit.FitResult.as_solute`, :func:`colligate.load_solute`
        or a library file).
    ingredients : iterable of Ingredient
        Own ingredients; their solutes must be built-in or among ``solutes``.
    include_builtin : bool
        Start from the built-in solutes and ingredients (default True).
    """

    def __init__(self, solutes: Iterable[FittedSolute] = (), ingredients: Iterable[Ingredient] = (), *,
                 include_builtin: bool = True) -> None:
        self.include_builtin = bool(include_builtin)
        self._table = SoluteLibrary(include_builtin=self.include_builtin)
        self._own_solutes: dict[str, FittedSolute] = {}
        self._origin: dict[str, str] = {}  # own solute id / ingredient key -> where it came from
        self._ingredients: dict[str, Ingredient] = dict(_builtin_ingredients()) if self.include_builtin else {}
        for fs in solutes:
            self.add_solute(fs)
        for ing in ingredients:
            self.add_ingredient(ing)

    # ------------------------------------------------------------------ contents

    @property
    def solute_table(self) -> SoluteLibrary:
        """The solute table (built-in plus own) to pass as ``table=`` to :class:`colligate.Solution`."""
        return self._table

    @property
    def own_solutes(self) -> dict[str, FittedSolute]:
        """Own solutes by id (a copy)."""
        return dict(self._own_solutes)

    @property
    def own_ingredients(self) -> dict[str, Ingredient]:
        """Own ingredients by key (a copy)."""
        builtin = _builtin_ingredients() if self.include_builtin else {}
        return {k: v for k, v in self._ingredients.items() if k not in builtin or builtin[k] is not v}

    @property
    def ingredients(self) -> dict[str, Ingredient]:
        """Every ingredient by key, built-in and own (a copy)."""
        return dict(self._ingredients)

    def _describe(self, key: str, kind: str) -> str:
        origin = self._origin.get(key)
        return f"{kind} '{key}'" + (f" (from {origin})" if origin else " (built-in)")

    # ------------------------------------------------------------------ adding

    def add_solute(self, solute: FittedSolute, *, origin: str = "") -> "Library":
        """Add an own solute. A clash with any name already in the table is an error that
        names both entries. Returns self."""
        if not isinstance(solute, FittedSolute):
            raise LibraryError(f"add_solute: expected a FittedSolute, got {type(solute).__name__}")
        for name in _solute_names(solute.record):
            try:
                taken = self._table.find(name)
            except ValueError:
                continue
            here = f"solute '{solute.id}'" + (f" (from {origin})" if origin else "")
            raise LibraryError(f"name clash: {here} uses the name '{name}', already taken by "
                               f"{self._describe(str(taken.id), 'solute')}")
        self._table.add_solute(solute)
        self._own_solutes[solute.id] = solute
        if origin:
            self._origin[solute.id] = origin
        return self

    def add_ingredient(self, ing: Ingredient, *, origin: str = "") -> "Library":
        """Add an own ingredient (its solutes must resolve in this library). A key or display
        name already used is an error naming both entries. Returns self."""
        if not isinstance(ing, Ingredient):
            raise LibraryError(f"add_ingredient: expected an Ingredient, got {type(ing).__name__}")
        key = ing.key or normal_name(ing.name)
        here = f"ingredient '{key}'" + (f" (from {origin})" if origin else "")
        for other_key, other in self._ingredients.items():
            if normal_name(other_key) in (normal_name(key), normal_name(ing.name)) or \
                    normal_name(other.name) in (normal_name(key), normal_name(ing.name)):
                raise LibraryError(f"name clash: {here} is already taken by "
                                   f"{self._describe(other_key, 'ingredient')}")
        for sid in ing.solutes():
            try:
                self._table.find(sid)
            except ValueError as exc:
                raise LibraryError(f"{here}: {exc}") from None
        if not ing.key:
            ing = ing.with_key(key)
        self._ingredients[key] = ing
        if origin:
            self._origin[key] = origin
        return self

    # ------------------------------------------------------------------ lookup

    def ingredient(self, name: "str | Ingredient") -> Ingredient:
        """An ingredient by key or display name (case-insensitive; spaces, dashes and
        underscores alike). Unknown names raise an error listing the nearest names."""
        if isinstance(name, Ingredient):
            return name
        n = normal_name(str(name))
        if n in self._ingredients:
            return self._ingredients[n]
        for key, ing in self._ingredients.items():
            if normal_name(key) == n or normal_name(ing.name) == n:
                return ing
        near = difflib.get_close_matches(n, list(self._ingredients), n=3, cutoff=0.5)
        hint = f"; nearest names: {', '.join(near)}" if near else ""
        raise IngredientError(f"unknown ingredient '{name}'{hint} (see colligate.ingredients())")

    def solute(self, name: str) -> Any:
        """The solute record for a name (raises with the nearest names if unknown)."""
        return self._table.find(name)

    # ------------------------------------------------------------------ combining

    def merge(self, other: "Library") -> "Library":
        """A new library with the own solutes and ingredients of both (built-in ones once).
        A name both define is an error naming both entries."""
        out = Library(include_builtin=self.include_builtin or other.include_builtin)
        for lib in (self, other):
            for sid, fs in lib._own_solutes.items():
                out.add_solute(fs, origin=lib._origin.get(sid, ""))
        for lib in (self, other):
            for key, ing in lib.own_ingredients.items():
                out.add_ingredient(ing, origin=lib._origin.get(key, ""))
        return out

    # ------------------------------------------------------------------ files

    def document(self) -> dict:
        """The own solutes and ingredients as a library-file dict (see the module text)."""
        doc: dict[str, Any] = {"format": LIBRARY_FORMAT, "version": LIBRARY_VERSION}
        if self._own_solutes:
            doc["solutes"] = {sid: fs.entry() for sid, fs in self._own_solutes.items()}
        own = self.own_ingredients
        if own:
            doc["ingredients"] = {key: ing.entry() for key, ing in own.items()}
        return doc

    def to_toml(self) -> str:
        """The library file text (written with tomli-w)."""
        import tomli_w

        return "# colligate library: own solutes and ingredients (SI units: kg, mol, K)\n" + \
            tomli_w.dumps(self.document())

    def save(self, path: "str | os.PathLike[str]") -> str:
        """Write the own solutes and ingredients as a library file (atomically). Returns the path."""
        from ._files import atomic_write_text

        return atomic_write_text(path, self.to_toml(), what="library file")

    @classmethod
    def load(cls, path: "str | os.PathLike[str]", *, include_builtin: bool = True) -> "Library":
        """A library read from a library file or a fitted-solute file."""
        return cls(include_builtin=include_builtin).load_file(path)

    def load_file(self, path: "str | os.PathLike[str]") -> "Library":
        """Add the entries of a library file or of a fitted-solute file (``colligate fit
        --save-solute``). Returns self."""
        from ._files import InputFileError, read_input_bytes

        where = os.fspath(path)
        if not os.path.exists(where):
            raise LibraryError(f"{where}: file not found")
        try:
            raw = read_input_bytes(where, "library file")  # at most 10 MB, also for pipes
        except InputFileError as exc:
            raise LibraryError(str(exc)) from None
        try:
            doc = tomllib.loads(raw.decode("utf-8"))
        except UnicodeDecodeError as exc:
            raise LibraryError(f"{where}: not UTF-8 text (byte {exc.start})") from None
        except tomllib.TOMLDecodeError as exc:
            raise LibraryError(f"{where}: TOML syntax error: {exc}") from None
        except RecursionError:
            raise LibraryError(f"{where}: arrays or inline tables nested too deeply for the TOML reader") from None
        return self.add_document(doc, where)

    def add_document(self, doc: Mapping[str, Any], where: str) -> "Library":
        """Add the entries of a parsed library or fitted-solute document. Returns self."""
        fmt = doc.get("format")
        if fmt == FITTED_SOLUTE_FORMAT:
            return self.add_solute(solute_from_document(dict(doc), where), origin=where)
        if fmt != LIBRARY_FORMAT:
            raise LibraryError(f"{where}: format = {fmt!r}: expected '{LIBRARY_FORMAT}' (a library) or "
                               f"'{FITTED_SOLUTE_FORMAT}' (a file of colligate fit)")
        version = doc.get("version", 1)
        if isinstance(version, bool) or not isinstance(version, int) or not 1 <= version <= LIBRARY_VERSION:
            raise LibraryError(f"{where}: version = {version!r}: this colligate reads versions 1 to {LIBRARY_VERSION}")
        return self.add_tables(doc, where, allowed_extra=("format", "version"))

    def add_tables(self, doc: Mapping[str, Any], where: str, *, allowed_extra: tuple = ()) -> "Library":
        """Add ``solutes`` and ``ingredients`` tables (as in a library file). Returns self."""
        extra = sorted(set(doc) - {"solutes", "ingredients", *allowed_extra})
        if extra:
            raise LibraryError(f"{where}: unknown key '{extra[0]}'; a library has the tables "
                               "[solutes.<id>] and [ingredients.<key>]")
        for name in ("solutes", "ingredients"):
            if name in doc and not isinstance(doc[name], dict):
                raise LibraryError(f"{where}: {name} must be a table of tables ([{name}.<key>])")
        for sid, entry in dict(doc.get("solutes", {})).items():
            self.add_solute(solute_from_entry(entry, where, table=f"solutes.{sid}", default_id=sid), origin=where)
        for key, entry in dict(doc.get("ingredients", {})).items():
            ing = ingredient_from_entry(key, entry, f"{where}: [ingredients.{key}]", table=self._table)
            self.add_ingredient(ing, origin=where)
        return self

    def __repr__(self) -> str:
        return (f"Library(own solutes={list(self._own_solutes)}, own ingredients={list(self.own_ingredients)}, "
                f"include_builtin={self.include_builtin})")


def as_library(value: Optional["Library | SoluteLibrary"]) -> Optional[Library]:
    """A :class:`Library` from a Library, a :class:`SoluteLibrary` or None."""
    if value is None or isinstance(value, Library):
        return value
    if isinstance(value, SoluteLibrary):
        return Library(solutes=value.fitted.values(), include_builtin=True)
    raise LibraryError(f"library must be a colligate.Library, got {type(value).__name__}")
