"""The ``colligate`` command.

Subcommands::

    colligate demo   [--out DIR] [--no-plot] [--save FILE] [--json] [--fahrenheit]
    colligate report RECIPE.toml [--plot PNG] [--save FILE] [--json] [--fahrenheit]

``demo`` evaluates the built-in demo recipe (an invented demo scenario),
prints the report and writes the ice-curve plot
``colligate_demo_ice_curve.png`` into ``--out`` (default: the current folder).
``report`` does the same for a recipe file (see ``docs/recipe_format.md``);
it writes a plot only when ``--plot`` is given.

``--json`` prints the machine-readable report (units in the keys) instead of
text; ``--fahrenheit`` adds degF to the text report; ``--save FILE`` also
writes the printed report to FILE. Every file is written atomically and an
input file is never overwritten.

Exit status: 0 on success, 2 on a usage or input error (a one-line message on
stderr, no traceback). Validity-range warnings are printed as one line each on
stderr and do not change the exit status.
"""

from __future__ import annotations

import argparse
import os
import sys
import warnings
from typing import Sequence

__all__ = ["main", "DEMO_PLOT_NAME", "EXIT_OK", "EXIT_ERROR"]

PROG = "colligate"
DEMO_PLOT_NAME = "colligate_demo_ice_curve.png"
EXIT_OK = 0
EXIT_ERROR = 2


class _UsageError(Exception):
    pass


class _Parser(argparse.ArgumentParser):
    """ArgumentParser that raises instead of printing usage and exiting."""

    def error(self, message: str) -> None:  # type: ignore[override]
        raise _UsageError(message)


def _build_parser() -> argparse.ArgumentParser:
    try:
        import colligate as cg

        version = str(getattr(cg, "__version__", "unknown"))
    except Exception:  # pragma: no cover
        version = "unknown"

    parser = _Parser(
        prog=PROG,
        description="Freezing point, water activity and ice curve of food solutions "
        "(sorbets, ice creams, brines, syrups). Results are model estimates.",
    )
    parser.add_argument("--version", action="version", version=f"{PROG} {version}")
    sub = parser.add_subparsers(dest="command", metavar="COMMAND", parser_class=_Parser)

    def common(p: argparse.ArgumentParser) -> None:
        p.add_argument("--json", action="store_true", help="print the report as JSON (units in the keys)")
        p.add_argument("--fahrenheit", action="store_true", help="also show temperatures in degF in the text report")
        p.add_argument("--save", metavar="FILE", help="also write the printed report (text or JSON) to FILE")

    p_demo = sub.add_parser("demo", help="evaluate the built-in demo recipe (invented demo scenario)")
    p_demo.add_argument("--out", metavar="DIR", default=".", help="folder for the plot (default: current folder)")
    p_demo.add_argument("--no-plot", action="store_true", help="do not write the plot")
    common(p_demo)

    p_rep = sub.add_parser("report", help="evaluate a recipe file (TOML)")
    p_rep.add_argument("recipe", metavar="RECIPE.toml", help="recipe file, see docs/recipe_format.md")
    p_rep.add_argument("--plot", metavar="PNG", help="write the ice-curve plot to this PNG file")
    common(p_rep)
    return parser


def _short(message: object) -> str:
    text = " ".join(str(message).split())
    return text if len(text) <= 300 else text[:297] + "..."


def _run(args: argparse.Namespace) -> int:
    from ._files import atomic_write_text, check_output_path
    from .plot import plot_ice_curve
    from .recipe import load_demo_recipe, load_recipe
    from .report import build_report, format_json, format_text

    if args.command == "demo":
        recipe = load_demo_recipe()
        inputs: list[str] = []
        out_dir = args.out
        if not os.path.isdir(out_dir):
            raise ValueError(f"--out '{out_dir}': not an existing directory")
        plot_path = None if args.no_plot else os.path.join(out_dir, DEMO_PLOT_NAME)
    else:
        recipe = load_recipe(args.recipe)
        inputs = [args.recipe]
        plot_path = args.plot

    # Check every output path before computing, so a bad path fails fast.
    if plot_path is not None:
        check_output_path(plot_path, inputs, "--plot" if args.command == "report" else "plot")
    if args.save is not None:
        check_output_path(args.save, inputs, "--save")
        if plot_path is not None and os.path.abspath(args.save) == os.path.abspath(plot_path):
            raise ValueError(f"--save '{args.save}' is the same file as the plot")

    report = build_report(recipe)
    if plot_path is not None:
        written = plot_ice_curve(
            recipe.solution(),
            plot_path,
            marks=recipe.temperatures,
            model=recipe.model,
            bound_water=recipe.bound_water,
            title=f"Ice curve: {recipe.name}",
            label=recipe.label or None,
            inputs=inputs,
        )
        cautions = report.pop("cautions")
        report["files"] = {"ice_curve_png": os.path.abspath(written)}
        report["cautions"] = cautions  # cautions stay last

    text = format_json(report) if args.json else format_text(report, fahrenheit=args.fahrenheit)
    if args.save is not None:
        atomic_write_text(args.save, text, inputs, "--save")
    sys.stdout.write(text)
    sys.stdout.flush()
    return EXIT_OK


_MAX_WARNING_LINES = 3


def _print_warnings(caught: Sequence[warnings.WarningMessage]) -> None:
    """Print distinct warnings as one short stderr line each (at most a few)."""
    lines: list[str] = []
    for w in caught:
        line = _short(w.message)
        if line not in lines:
            lines.append(line)
    for line in lines[:_MAX_WARNING_LINES]:
        print(f"{PROG}: warning: {line}", file=sys.stderr)
    if len(lines) > _MAX_WARNING_LINES:
        print(f"{PROG}: warning: ... and {len(lines) - _MAX_WARNING_LINES} more distinct warning(s)", file=sys.stderr)


def main(argv: Sequence[str] | None = None) -> int:
    """Run the command line program; returns the exit status (0 ok, 2 error)."""
    argv = list(sys.argv[1:] if argv is None else argv)
    try:
        parser = _build_parser()
        args = parser.parse_args(argv)
        if args.command is None:
            parser.print_help(sys.stderr)
            return EXIT_ERROR
        with warnings.catch_warnings(record=True) as caught:
            warnings.simplefilter("always")
            try:
                status = _run(args)
            finally:
                _print_warnings(caught)
        return status
    except _UsageError as exc:
        print(f"{PROG}: error: {_short(exc)} (see '{PROG} --help')", file=sys.stderr)
        return EXIT_ERROR
    except SystemExit as exc:  # --help / --version
        return int(exc.code or 0) if not isinstance(exc.code, str) else EXIT_ERROR
    except KeyboardInterrupt:
        print(f"{PROG}: interrupted", file=sys.stderr)
        return 130
    except (ValueError, OSError, RuntimeError, ArithmeticError) as exc:
        # RecipeError, colligate.InvalidInputError and OutOfValidityRangeError
        # are ValueErrors; their messages already name the field and range. A
        # solver failure (RuntimeError) is reported the same way.
        print(f"{PROG}: error: {_short(exc)}", file=sys.stderr)
        return EXIT_ERROR


if __name__ == "__main__":  # pragma: no cover
    sys.exit(main())
