#!/usr/bin/env python3
"""Write tests/reference/tolerances.toml as a C++ header for the Catch2 suites.

The validation gallery and pytest read the tolerance file with pandas; the C++ checks read
this header, generated from the same file at build time (tests/cpp/CMakeLists.txt), so the
three cannot drift. Each [[check]] becomes one entry with its table, published column,
row selection and tolerance as C++ functions of a reference row.

The row queries and tolerance expressions are translated from their Python (pandas) form:
numbers, column names, arithmetic (+ - * /), comparisons, ``and``/``or``/``not``, ``&``/``|``
between comparisons, ``column in [...]``, ``column.str.contains(...)`` and
``column.str.startswith(...)``. Anything else stops the build with the check's id, so a new
form is added here before a check can use it.

    python tools/tolerances_header.py tests/reference/tolerances.toml OUT.hpp
"""
from __future__ import annotations

import ast
import json
import pathlib
import sys
import tomllib


class Untranslatable(ValueError):
    pass


def _cpp_string(text: str) -> str:
    return json.dumps(text, ensure_ascii=False)  # a C++ string literal for plain text


def _number(value) -> str:
    if isinstance(value, bool) or not isinstance(value, (int, float)):
        raise Untranslatable(f"not a number: {value!r}")
    return repr(float(value))


class _Translator:
    """Python expression (pandas query / eval syntax) -> C++ expression over `r`."""

    def __init__(self, source: str):
        self.source = source

    def fail(self, node) -> Untranslatable:
        return Untranslatable(f"cannot translate {ast.unparse(node)!r} in {self.source!r}")

    def column(self, node, kind: str) -> str:
        if not isinstance(node, ast.Name):
            raise self.fail(node)
        return f'{kind}(r, {_cpp_string(node.id)})'

    def expr(self, node) -> str:
        if isinstance(node, ast.Expression):
            return self.expr(node.body)
        if isinstance(node, ast.Constant):
            return _number(node.value)
        if isinstance(node, ast.Name):
            return self.column(node, "num")
        if isinstance(node, ast.UnaryOp):
            if isinstance(node.op, ast.Not):
                return f"!({self.expr(node.operand)})"
            if isinstance(node.op, ast.USub):
                return f"-({self.expr(node.operand)})"
            raise self.fail(node)
        if isinstance(node, ast.BoolOp):
            op = " && " if isinstance(node.op, ast.And) else " || "
            return "(" + op.join(self.expr(v) for v in node.values) + ")"
        if isinstance(node, ast.BinOp):
            ops = {ast.Add: "+", ast.Sub: "-", ast.Mult: "*", ast.Div: "/",
                   ast.BitAnd: "&&", ast.BitOr: "||"}
            op = ops.get(type(node.op))
            if op is None:
                raise self.fail(node)
            return f"({self.expr(node.left)} {op} {self.expr(node.right)})"
        if isinstance(node, ast.Compare):
            return self.compare(node)
        if isinstance(node, ast.Call):
            return self.string_method(node)
        raise self.fail(node)

    def operand(self, node, other) -> str:
        """A comparison operand: a string column when compared with a string."""
        strings = isinstance(other, ast.Constant) and isinstance(other.value, str)
        if isinstance(node, ast.Constant) and isinstance(node.value, str):
            return _cpp_string(node.value)
        if isinstance(node, ast.Name) and strings:
            return self.column(node, "text")
        return self.expr(node)

    def compare(self, node: ast.Compare) -> str:
        parts, left = [], node.left
        for op, right in zip(node.ops, node.comparators):
            if isinstance(op, (ast.In, ast.NotIn)):
                if not isinstance(right, (ast.List, ast.Tuple)) or not right.elts:
                    raise self.fail(node)
                items = [self.operand(left, e) + " == " + self.operand(e, left) for e in right.elts]
                test = "(" + " || ".join(items) + ")"
                parts.append(test if isinstance(op, ast.In) else f"!{test}")
            else:
                ops = {ast.Eq: "==", ast.NotEq: "!=", ast.Lt: "<", ast.LtE: "<=", ast.Gt: ">",
                       ast.GtE: ">="}
                if type(op) not in ops:
                    raise self.fail(node)
                parts.append(f"({self.operand(left, right)} {ops[type(op)]} {self.operand(right, left)})")
            left = right
        return parts[0] if len(parts) == 1 else "(" + " && ".join(parts) + ")"

    def string_method(self, node: ast.Call) -> str:
        f = node.func
        ok = (isinstance(f, ast.Attribute) and isinstance(f.value, ast.Attribute)
              and f.value.attr == "str" and isinstance(f.value.value, ast.Name)
              and len(node.args) == 1 and not node.keywords
              and isinstance(node.args[0], ast.Constant) and isinstance(node.args[0].value, str))
        if not ok:
            raise self.fail(node)
        col, arg = self.column(f.value.value, "text"), _cpp_string(node.args[0].value)
        if f.attr == "contains":
            return f"({col}.find({arg}) != std::string::npos)"
        if f.attr == "startswith":
            return f"({col}.rfind({arg}, 0) == 0)"
        raise self.fail(node)


def translate(source: str) -> str:
    """C++ expression for a Python/pandas expression (raises Untranslatable)."""
    return _Translator(source).expr(ast.parse(source, mode="eval"))


def _tolerance_plus(entry: dict) -> str:
    plus = entry.get("tolerance_plus")
    if not plus:
        return ""
    col = _cpp_string(plus["column"])
    lines = [f"  const std::string& key = text(r, {col});"]
    for value, add in plus["values"].items():
        lines.append(f"  if (key == {_cpp_string(value)}) return t + {_number(add)};")
    lines.append(f'  throw std::invalid_argument("tolerances.toml: {entry["id"]}: tolerance_plus has no value '
                 f'for " + key);')
    return "\n".join(lines) + "\n"


def header(config: dict, source_name: str) -> str:
    out = [f"// Generated from {source_name} by tools/tolerances_header.py at build time; do not edit.",
           "// The C++ form of the tolerances the validation gallery and pytest read (one file).",
           "#pragma once",
           "#include <stdexcept>",
           "#include <string>",
           "#include <vector>",
           "",
           '#include "reference_csv.hpp"',
           "",
           "namespace colligate_test::tolerances {",
           "",
           "/// One [[check]] of tests/reference/tolerances.toml.",
           "struct check {",
           "  const char* id;",
           "  const char* file;       ///< reference table in tests/reference",
           "  const char* published;  ///< column of the published value",
           "  const char* unit;",
           "  const char* basis;      ///< why that tolerance",
           "  bool check_beyond_range;  ///< false: rows outside the model's range are not checked",
           "  bool (*selects)(const csv_row&);     ///< the check's rows",
           "  double (*tolerance)(const csv_row&);  ///< allowed |model - published|, unit of the column",
           "};",
           "",
           "namespace generated {",
           "inline double num(const csv_row& r, const char* column) { return std::stod(r.at(column)); }",
           "inline const std::string& text(const csv_row& r, const char* column) { return r.at(column); }",
           ""]
    entries = []
    for i, e in enumerate(config.get("check", [])):
        try:
            rows = translate(e["rows"]) if e.get("rows", "") else "true"
            tol = translate(e["tolerance"])
        except (Untranslatable, SyntaxError) as err:
            raise SystemExit(f"tolerances.toml: check {e.get('id')!r}: {err}") from None
        out += [f"// {e['id']}: rows {e.get('rows', '') or '(all)'}; tolerance {e['tolerance']}",
                f"inline bool selects_{i}([[maybe_unused]] const csv_row& r) {{ return {rows}; }}",
                f"inline double tolerance_{i}([[maybe_unused]] const csv_row& r) {{",
                f"  const double t = {tol};",
                _tolerance_plus(e) + "  return t;",
                "}", ""]
        entries.append("    {" + ", ".join([
            _cpp_string(e["id"]), _cpp_string(e["file"]), _cpp_string(e["published"]),
            _cpp_string(e.get("unit", "")), _cpp_string(e["basis"]),
            "true" if e.get("check_beyond_range", True) else "false",
            f"&selects_{i}", f"&tolerance_{i}"]) + "},")
    out += ["}  // namespace generated", "",
            "/// Every check, in the file's order.",
            "inline const std::vector<check>& checks() {",
            "  using namespace generated;",
            "  static const std::vector<check> all{"] + entries + [
            "  };", "  return all;", "}", "",
            "/// The check with this id (throws std::invalid_argument naming it when there is none).",
            "inline const check& find(const std::string& id) {",
            "  for (const auto& c : checks())",
            "    if (id == c.id) return c;",
            '  throw std::invalid_argument("tests/reference/tolerances.toml has no check \'" + id + "\'");',
            "}", "",
            "/// The rows of a check's table that it selects.",
            "inline std::vector<csv_row> rows(const check& c) {",
            "  std::vector<csv_row> out;",
            "  for (auto& r : read_reference(c.file))",
            "    if (c.selects(r)) out.push_back(std::move(r));",
            "  return out;",
            "}", "",
            "/// The tolerance of one row, as the tolerance file gives it.",
            "inline double tolerance(const check& c, const csv_row& r) { return c.tolerance(r); }",
            "",
            "}  // namespace colligate_test::tolerances", ""]
    return "\n".join(out)


def main(argv=None) -> int:
    argv = sys.argv[1:] if argv is None else argv
    if len(argv) != 2:
        print(__doc__.strip().splitlines()[-1].strip(), file=sys.stderr)
        return 2
    src, dst = pathlib.Path(argv[0]), pathlib.Path(argv[1])
    with open(src, "rb") as fh:
        config = tomllib.load(fh)
    text = header(config, "tests/reference/" + src.name)
    dst.parent.mkdir(parents=True, exist_ok=True)
    if not dst.exists() or dst.read_text(encoding="utf-8") != text:  # keep the timestamp otherwise
        dst.write_text(text, encoding="utf-8")
    return 0


if __name__ == "__main__":
    sys.exit(main())
