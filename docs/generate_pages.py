"""Pages the documentation site generates before each build (docs/conf.py calls write_all).

- models.md: "which model when", read from the compiled core: the model registry's
  descriptors (id, summary with sources, traits), the built-in solute table (Norrish
  constants with their validated concentration and source) and the Pitzer parameter sets.
- api_python.md: the Python reference, one autodoc entry per name of colligate.__all__.
- cpp_api.md: the C++ reference, one breathe entry per name the umbrella header
  colligate/colligate.hpp lifts into namespace colligate, plus the error and validity types.
Nothing here is physics or data: every number is read from colligate.
"""
from __future__ import annotations

import pathlib
import re

ROOT = pathlib.Path(__file__).resolve().parents[1]
UMBRELLA = ROOT / "cpp" / "include" / "colligate" / "colligate.hpp"


def umbrella_names() -> list[tuple[str, str]]:
    """(layer namespace, name) of every using-declaration in the umbrella header."""
    text = UMBRELLA.read_text(encoding="utf-8")
    return re.findall(r"^using\s+(\w+)::(\w+)\s*;", text, flags=re.M)


def _cell(text: object) -> str:
    return str(text).replace("|", "\\|").replace("\n", " ")


def _range_text(limit: dict) -> str:
    """'233.15-323.15 K (-40 to 50 °C)', 'up to 0.1 mol/kg', or where per-solute limits are kept."""
    low, high, unit = limit["low"], limit["high"], limit["unit"]
    if limit["per_solute"]:
        return limit["per_solute"]
    u = f" {unit}" if unit else ""
    if high != high:  # NaN: no upper limit
        return f"from {low:g}{u}"
    if low == low and low != 0.0:
        text = f"{low:g}-{high:g}{u}"
        if unit == "K":
            text += f" ({low - 273.15:.0f} to {high - 273.15:.0f} °C)"
        return text
    return f"up to {high:g}{u}"


def models_page() -> str:
    import colligate as cg
    from colligate import _core

    lines = [
        "# Which model when",
        "",
        "Generated from the model registry of the compiled core (`models/registry.hpp`) and the",
        "built-in solute table; nothing on this page is typed in by hand.",
        "",
        "`model=\"auto\"` (the default everywhere) asks the registry to choose: Pitzer for",
        "solutions with ions, Norrish for non-electrolytes, and the Ross product rule for a",
        "mixture of both. `cg.describe_model(solution)` says which model, constants and sources a",
        "calculation used. A result outside a model's validated range is still computed under",
        "the default range policy, with an `OutOfValidityRangeWarning` that names the range and",
        "its source; `range_policy=\"nan\"` or `\"raise\"` change that.",
        "",
        "```{admonition} Cautions",
        "Predictions are estimates. Water activity, brines and ethanol touch food safety: verify",
        "by measurement and defer to local codes and licensed practice.",
        "```",
        "",
        "## The models",
        "",
        "| id | equation and sources | depends on T | ion activities (salt phases) |",
        "|---|---|---|---|",
    ]
    for row in _core.model_summaries():
        lines.append(f"| `{row['id']}` | {_cell(row['summary'])} | "
                     f"{'yes' if row['temperature_dependent'] else 'no'} | "
                     f"{'yes' if row['ion_activities'] else 'no'} |")
    lines += ["", "## Validated range of each model", "",
              "The limits each model's check applies (the same records: a result outside them "
              "carries an `OutOfValidityRangeWarning` quoting the limit, its basis and its source). "
              "A limit kept per solute or salt points to where its numbers are; `source` is a key "
              "of the citation table, empty where the basis says where the limit comes from.", "",
              "| model | quantity | range | basis | source |", "|---|---|---|---|---|"]
    for row in _core.model_summaries():
        for limit in row["validated_range"]:
            lines.append(f"| `{row['id']}` | {_cell(limit['quantity'])} | {_cell(_range_text(limit))} | "
                         f"{_cell(limit['basis'])} | {'`' + limit['source'] + '`' if limit['source'] else ''} |")
    lines += ["", "## Pitzer parameter sets", "",
              "Each set carries its own temperature range (below) and a molality limit per salt; "
              "see [the electrolyte notes](../electrolytes.md). The first set is the default.", "",
              "| set | temperature range | description | source |", "|---|---|---|---|"]
    for name in cg.pitzer_parameter_sets():
        t_min, t_max, description, source = _core.pitzer_parameter_set_range(name)
        lines.append(f"| `{name}` | {t_min:.2f}-{t_max:.2f} K ({t_min - 273.15:.0f} to "
                     f"{t_max - 273.15:.0f} °C) | {_cell(description)} | `{source}` |")
    solutes = cg.solutes()
    lines += ["", "## Solutes and the range their constants were checked over", "",
              "`kind` says which model family `auto` gives the solute. The Norrish columns give "
              "the highest binary mass fraction the constant was checked at and the source key "
              "(full reference: `cg.citation(key)`, or the citation table of the C++ core).", "",
              "| solute | formula | kind | Norrish K | checked to mass fraction | source |",
              "|---|---|---|---|---|---|"]
    for sid, r in solutes.iterrows():
        k = r.get("norrish_k")
        has_k = k == k and k is not None  # NaN for solutes without a Norrish constant
        lines.append(f"| {_cell(r['name'])} (`{sid}`) | {_cell(r['formula'])} | {_cell(r['kind'])} | "
                     f"{f'{k:g}' if has_k else ''} | "
                     f"{_cell(r['norrish_max_mass_fraction']) if has_k else ''} | "
                     f"{_cell(r['norrish_source']) if has_k else ''} |")
    lines.append("")
    return "\n".join(lines)


def cpp_api_page() -> str:
    lines = [
        "# C++ API reference",
        "",
        "Generated from the doc comments of the headers (Doxygen XML, rendered by breathe). The",
        "stable API is what the umbrella header `colligate/colligate.hpp` includes; the names it",
        "lifts into namespace `colligate` are listed first.",
        "",
        "## Names of the umbrella header",
        "",
    ]
    for layer, name in umbrella_names():
        qualified = f"colligate::{layer}::{name}"
        lines += [f"### `colligate::{name}` (`{qualified}`)", "", "```{eval-rst}"]
        kind = _compound_kind(qualified)
        if kind:
            lines.append(f".. doxygen{kind}:: {qualified}")
        else:
            overloads = _function_signatures(layer, name)
            if not overloads:
                raise SystemExit(f"generate_pages: {qualified} is in the umbrella header but "
                                 "Doxygen found no class, struct or function of that name")
            for args in overloads:
                lines += [f".. doxygenfunction:: {qualified}{args}", ""]
        lines += ["```", ""]
    lines += ["## Errors, validity and range policy", "", "```{eval-rst}"]
    for name in ("invalid_input", "out_of_validity_range", "convergence_error", "validity", "range_limit"):
        lines += [f".. doxygen{_compound_kind('colligate::' + name)}:: colligate::{name}", ""]
    lines += [".. doxygenenum:: colligate::range_policy", "", ".. doxygenenum:: colligate::validity_code",
              "```", ""]
    return "\n".join(lines)


def _xml_dir() -> pathlib.Path:
    return pathlib.Path(__file__).resolve().parent / "_generated" / "doxygen" / "xml"


def _compound_kind(qualified: str) -> str:
    """'class' or 'struct' when Doxygen lists `qualified` as one, else ''."""
    import xml.etree.ElementTree as ET

    for compound in ET.parse(_xml_dir() / "index.xml").getroot().iter("compound"):
        if compound.findtext("name") == qualified and compound.get("kind") in ("class", "struct"):
            return compound.get("kind")
    return ""


def _function_signatures(layer: str, name: str) -> list[str]:
    """The parameter lists "(type, type)" of every overload of colligate::layer::name."""
    import xml.etree.ElementTree as ET

    path = _xml_dir() / f"namespacecolligate_1_1{layer}.xml"
    out = []
    for member in ET.parse(path).getroot().iter("memberdef"):
        if member.get("kind") != "function" or member.findtext("name") != name:
            continue
        types = ["".join(p.find("type").itertext()).strip() for p in member.iter("param")]
        out.append("(" + ", ".join(types) + ")")
    return out


def python_api_page() -> str:
    """One autodoc entry per name of colligate.__all__, grouped by kind."""
    import inspect
    import types

    import colligate

    groups: dict[str, list[str]] = {"Functions": [], "Classes": [], "Errors and warnings": [],
                                    "Modules": [], "Constants": []}
    for name in colligate.__all__:
        obj = getattr(colligate, name)
        target = f"colligate.{name}"
        if isinstance(obj, types.ModuleType):
            groups["Modules"].append(f".. automodule:: {target}\n   :no-members:")
        elif inspect.isclass(obj) and issubclass(obj, BaseException):
            groups["Errors and warnings"].append(f".. autoexception:: {target}")
        elif inspect.isclass(obj):
            groups["Classes"].append(f".. autoclass:: {target}\n   :members:")
        elif callable(obj):
            groups["Functions"].append(f".. autofunction:: {target}")
        else:
            groups["Constants"].append(f".. autodata:: {target}")
    lines = ["# Python API reference", "",
             "Every public name of the package (`colligate.__all__`), from its docstrings. Units "
             "are SI (K, kg, mol, J) unless a name says otherwise. Functions that return water "
             "activity, brine or ethanol results are estimates: verify by measurement before a "
             "food-safety decision and defer to local codes and licensed practice.", ""]
    for title, entries in groups.items():
        if entries:
            lines += [f"## {title}", "", "```{eval-rst}", ".. currentmodule:: colligate", ""]
            for e in entries:
                lines += [e, ""]
            lines += ["```", ""]
    return "\n".join(lines)


def write_all(out: pathlib.Path) -> None:
    out.mkdir(parents=True, exist_ok=True)
    for name, text in (("models.md", models_page()), ("cpp_api.md", cpp_api_page()),
                       ("api_python.md", python_api_page())):
        path = out / name
        if not path.exists() or path.read_text(encoding="utf-8") != text:
            path.write_text(text, encoding="utf-8")
