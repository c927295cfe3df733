"""The ``colligate`` command.

Subcommands::

    colligate demo   [--scenario ice_cream|sorbet] [--out DIR] [--no-plot] [--csv [FILE]]
                     [--save FILE] [--json] [--fahrenheit]
    colligate report RECIPE.toml [--plot PNG] [--enthalpy-plot PNG] [--cooling-plot PNG]
                     [--csv FILE] [--save FILE] [--json] [--fahrenheit]
    colligate fit DATA.csv --model norrish|effective|pitzer [--salt NaCl] [--plot PNG] [--save-solute FILE]
    colligate freeze-time RECIPE.toml|demo --size M --initial C --medium C --h W_M2K --target C
                     [--shape slab|cylinder|sphere] [--plot PNG] [--json]
    colligate side-by-side A.toml B.toml [MORE.toml ...] [--at TEMP ...] [--frozen SHARE ...]
                     [--plot FILE] [--save FILE] [--json] [--fahrenheit]

``demo`` evaluates a built-in demo recipe (an invented demo scenario: a
strawberry ice cream made of library ingredients, or ``--scenario sorbet``),
prints the report and writes three plots into ``--out`` (default: the current
folder): ``colligate_demo_ice_curve.png``, ``colligate_demo_enthalpy.png`` and
``colligate_demo_cooling_curve.png``; ``--csv`` also writes the ice/enthalpy
table (default name ``colligate_demo_table.csv`` in ``--out``).
``report`` does the same for a recipe file (see ``docs/recipe_format.md``);
it writes only the files asked for (``--plot``, ``--enthalpy-plot``,
``--cooling-plot``, ``--csv``).

``side-by-side`` compares two or more recipe files: one column per recipe (freezing
point, water activity, dissolved solids, sweetness, ice at common temperatures given with
``--at`` such as ``-12C``, ``10F`` or ``261K``, and the temperature at which a share of
the water given with ``--frozen`` is frozen); ``--plot`` draws their ice curves on one set
of axes; ``--json`` prints the comparison (schema: ``colligate/data/comparison.schema.json``).

``--json`` prints the machine-readable report (units in the keys) instead of
text; ``--fahrenheit`` adds degF to the text report; ``--save FILE`` also
writes the printed report to FILE. Every file is written atomically and an
input file is never overwritten.

Exit status: 0 on success, 2 on a usage or input error (a one-line message on
stderr, no traceback), 130 after Ctrl-C (``colligate: interrupted``; also while
Python is still importing, through the launcher ``_colligate_cli``), 143 after SIGTERM
(the installed command), 3 on an internal error (a bug: one line;
``COLLIGATE_TRACEBACK=1`` shows where).
``demo`` and ``report`` show each warning once, grouped, in the report (text or JSON),
not on stderr; the other commands print their warnings as one line each on stderr.
Warnings do not change the exit status. A command writes all its files or none: each
goes to a temporary file, and all are renamed into place only once everything has been
computed.
"""

from __future__ import annotations

import argparse
import os
import re
import sys
import warnings
from typing import Sequence

__all__ = [
    "main",
    "DEMO_PLOT_NAME",
    "DEMO_ENTHALPY_PLOT_NAME",
    "DEMO_COOLING_PLOT_NAME",
    "DEMO_CSV_NAME",
    "EXIT_OK",
    "EXIT_ERROR",
    "EXIT_INTERNAL",
    "EXIT_INTERRUPTED",
]

PROG = "colligate"
DEMO_PLOT_NAME = "colligate_demo_ice_curve.png"
DEMO_ENTHALPY_PLOT_NAME = "colligate_demo_enthalpy.png"
DEMO_COOLING_PLOT_NAME = "colligate_demo_cooling_curve.png"
DEMO_CSV_NAME = "colligate_demo_table.csv"
EXIT_OK = 0
EXIT_ERROR = 2
EXIT_INTERNAL = 3
EXIT_INTERRUPTED = 130  # 128 + SIGINT, as shells report a Ctrl-C


class _UsageError(Exception):
    pass


class _Parser(argparse.ArgumentParser):
    """ArgumentParser that raises instead of printing usage and exiting."""

    def error(self, message: str) -> None:  # type: ignore[override]
        raise _UsageError(message)


def _build_parser() -> argparse.ArgumentParser:
    try:
        from ._version import __version__ as version
    except ImportError:  # pragma: no cover - only in a source tree without a build
        from ._core import __version__ as version

    parser = _Parser(
        prog=PROG,
        description="Freezing point, water activity and ice curve of food solutions "
        "(sorbets, ice creams, brines, syrups). Results are model estimates.",
    )
    parser.add_argument("--version", action="version", version=f"{PROG} {version}")
    sub = parser.add_subparsers(dest="command", metavar="COMMAND", parser_class=_Parser)

    def common(p: argparse.ArgumentParser) -> None:
        p.add_argument("--json", action="store_true", help="print the report as JSON (units in the keys)")
        p.add_argument("--fahrenheit", action="store_true", help="also show temperatures in degF in the text report and on the ice-curve plot")
        p.add_argument("--save", metavar="FILE", help="also write the printed report (text or JSON) to FILE")

    from .recipe import DEFAULT_DEMO_SCENARIO, DEMO_SCENARIOS

    p_demo = sub.add_parser("demo", help="evaluate a built-in demo recipe (invented demo scenario)")
    p_demo.add_argument("--scenario", choices=list(DEMO_SCENARIOS), default=DEFAULT_DEMO_SCENARIO,
                        help=f"which invented demo scenario (default: {DEFAULT_DEMO_SCENARIO})")
    p_demo.add_argument("--out", metavar="DIR", default=".", help="folder for the plots (default: current folder)")
    p_demo.add_argument("--no-plot", action="store_true", help="do not write the plots")
    p_demo.add_argument("--csv", metavar="FILE", nargs="?", const=DEMO_CSV_NAME,
                        help=f"also write the ice/enthalpy table as CSV (default name {DEMO_CSV_NAME} in --out)")
    common(p_demo)

    p_rep = sub.add_parser("report", help="evaluate a recipe file (TOML)")
    p_rep.add_argument("recipe", metavar="RECIPE.toml", help="recipe file, see docs/recipe_format.md")
    p_rep.add_argument("--plot", metavar="PNG", help="write the ice-curve plot to this PNG file")
    p_rep.add_argument("--enthalpy-plot", metavar="PNG",
                       help="write the enthalpy and apparent specific heat plot to this PNG file")
    p_rep.add_argument("--cooling-plot", metavar="PNG",
                       help="write the cooling curve (temperature vs heat removed) to this PNG file")
    p_rep.add_argument("--csv", metavar="FILE", help="write the ice/enthalpy table to this CSV file")
    p_rep.add_argument("--contributions-plot", metavar="FILE",
                       help="write each ingredient's share of the freezing-point depression, sweetness "
                       "and water kept liquid at the serving temperature to this plot file")
    common(p_rep)

    p_cmp = sub.add_parser("side-by-side", help="compare two or more recipe files (TOML) side by side")
    p_cmp.add_argument("recipes", metavar="RECIPE.toml", nargs="+", help="two or more recipe files")
    p_cmp.add_argument("--at", metavar="TEMP", action="append",
                       help="a temperature at which to compare the ice, e.g. -12C, 10F or 261K (a bare "
                       "number is degC); repeat for more (default -6, -12 and -18 C)")
    p_cmp.add_argument("--frozen", metavar="SHARE", action="append", type=float,
                       help="a share of the water frozen (0-1) whose temperature is compared; repeat "
                       "for more (default 0.5 and 0.7)")
    p_cmp.add_argument("--plot", metavar="FILE", help="write the ice curves of all the recipes to one plot "
                       "(.png, .svg, .pdf ...)")
    common(p_cmp)

    p_fit = sub.add_parser("fit", help="fit model constants to a CSV of your own data (see colligate.fit)")
    p_fit.add_argument("data", metavar="DATA.csv", help="CSV whose header names the units: concentration as "
                       "molality, mass_fraction or mass_percent (wt%%); temperatures as freezing_point_K or "
                       "freezing_point_C, temperature_K or temperature_C; water_activity, osmotic_coefficient; "
                       "effective: water_fraction + freezing point, or temperature + ice_fraction")
    p_fit.add_argument("--model", choices=["norrish", "effective", "pitzer"], required=True, help="what to fit")
    p_fit.add_argument("--salt", help="pitzer: the salt whose parameters are fitted (e.g. NaCl); columns "
                       "molality + osmotic_coefficient, water_activity or freezing_point_K (+ temperature_K)")
    p_fit.add_argument("--temperature-terms", action="store_true",
                       help="pitzer: also fit d/dT of each parameter at 298.15 K")
    p_fit.add_argument("--T", type=float, default=298.15, help="temperature of water-activity data, K")
    p_fit.add_argument("--k3", action="store_true", help="norrish: also fit the cubic constant K3")
    p_fit.add_argument("--plot", metavar="PNG", help="plot file (default: DATA_fit.png beside the data)")
    p_fit.add_argument("--name", help="name of the fitted solute (with --save-solute)")
    p_fit.add_argument("--molar-mass", type=float, help="norrish: molar mass of the solute, kg/mol (needed "
                       "with a mass_fraction or mass_percent column and with --save-solute)")
    p_fit.add_argument("--save-solute", metavar="FILE", help="write the fitted solute as TOML")
    from .cli_freeze_time import add_parser as add_freeze_time

    add_freeze_time(sub)
    return parser


def _short(message: object, limit: int = 300) -> str:
    text = " ".join(str(message).split())
    return text if len(text) <= limit else text[: limit - 3] + "..."


def _run(args: argparse.Namespace) -> int:
    from ._files import OutputSet

    if args.command == "fit":
        from .fit import run_fit_command

        sys.stdout.write(run_fit_command(args))
        sys.stdout.flush()
        return EXIT_OK
    if args.command == "freeze-time":
        from .cli_freeze_time import run as run_freeze_time
        from .recipe import load_demo_recipe, load_recipe

        recipe = load_demo_recipe() if args.recipe == "demo" else load_recipe(args.recipe)
        sys.stdout.write(run_freeze_time(args, recipe, [] if args.recipe == "demo" else [args.recipe]))
        return EXIT_OK
    if args.command == "side-by-side":
        return _run_side_by_side(args)

    from .plot import check_plot_path
    from .recipe import load_demo_recipe, load_recipe
    from .report import build_report, format_json, format_text

    # outputs: key in the report's "files" -> (path, option name for messages)
    outputs: dict[str, tuple[str, str]] = {}
    if args.command == "demo":
        recipe = load_demo_recipe(args.scenario)
        inputs: list[str] = []
        out_dir = args.out
        if not os.path.isdir(out_dir):
            raise ValueError(f"--out '{out_dir}': not an existing directory")
        if not args.no_plot:
            outputs["ice_curve_png"] = (os.path.join(out_dir, DEMO_PLOT_NAME), "plot")
            outputs["enthalpy_png"] = (os.path.join(out_dir, DEMO_ENTHALPY_PLOT_NAME), "plot")
            outputs["cooling_curve_png"] = (os.path.join(out_dir, DEMO_COOLING_PLOT_NAME), "plot")
        if args.csv is not None:
            csv_path = args.csv if os.path.dirname(args.csv) else os.path.join(out_dir, args.csv)
            outputs["table_csv"] = (csv_path, "--csv")
    else:
        recipe = load_recipe(args.recipe)
        inputs = [args.recipe]
        for key, value, option in (
            ("ice_curve_png", args.plot, "--plot"),
            ("enthalpy_png", args.enthalpy_plot, "--enthalpy-plot"),
            ("cooling_curve_png", args.cooling_plot, "--cooling-plot"),
            ("table_csv", args.csv, "--csv"),
            ("contributions_png", args.contributions_plot, "--contributions-plot"),
        ):
            if value is not None:
                outputs[key] = (value, option)

    # All outputs of the command or none: every path is checked (and a path used twice
    # refused) before computing; files go to temporary files and are renamed into place
    # together at the end. A failure or Ctrl-C before that leaves no file behind.
    with OutputSet(inputs) as out:
        for key, (path, option) in outputs.items():
            if key.endswith("_png"):
                check_plot_path(path, inputs, option)  # a format matplotlib can write
            out.plan(path, option)
        if args.save is not None:
            out.plan(args.save, "--save")

        report = build_report(recipe)
        written: dict[str, str] = {}
        # Warnings of the plots and the table join the report's own (once each); none go to stderr.
        with warnings.catch_warnings(record=True) as caught:
            warnings.simplefilter("always")
            _write_outputs(recipe, outputs, inputs, written, out, args.fahrenheit)
        _merge_warnings(report, caught)
        if written:
            cautions = report.pop("cautions")
            report["files"] = written
            report["cautions"] = cautions  # cautions stay last

        text = format_json(report) if args.json else format_text(report, fahrenheit=args.fahrenheit)
        if args.save is not None:
            out.write_text(args.save, text)
        out.commit()
    sys.stdout.write(text)
    sys.stdout.flush()
    return EXIT_OK


def _write_outputs(recipe, outputs, inputs, written, out, fahrenheit: bool) -> None:
    """Write the plots and the table asked for into the output set ``out``; record each
    path written in ``written``."""
    from .plot import plot_contributions, plot_cooling_curve, plot_enthalpy, plot_ice_curve
    from .report import ice_enthalpy_table, write_table_csv

    title = recipe.name
    label = recipe.label or None
    for key, (path, option) in outputs.items():
        if key == "ice_curve_png":
            done = plot_ice_curve(
                recipe.solution(),
                path,
                marks=recipe.temperatures,
                model=recipe.model,
                bound_water_fraction_of_water=recipe.bound_water_fraction_of_water,
                title=f"Ice curve: {title}",
                label=label,
                inputs=inputs,
                outputs=out,
                fahrenheit=fahrenheit,
            )
        elif key == "enthalpy_png":
            done = plot_enthalpy(recipe, path, title=f"Enthalpy and apparent specific heat: {title}",
                                 label=label, inputs=inputs, outputs=out)
        elif key == "cooling_curve_png":
            done = plot_cooling_curve(recipe, path, title=f"Cooling curve: {title}", label=label,
                                      inputs=inputs, outputs=out)
        elif key == "contributions_png":
            done = plot_contributions(recipe, path, title=f"What each ingredient does: {title}", label=label,
                                      inputs=inputs, outputs=out)
        else:
            done = write_table_csv(ice_enthalpy_table(recipe), path, inputs, option, outputs=out)
        written[key] = os.path.abspath(done)


def _merge_warnings(report: dict, caught: Sequence[warnings.WarningMessage]) -> None:
    """Add warnings raised after the report was built, unless the report already has them."""
    from .report_indicators import _warning_key, group_warnings

    known = {_warning_key(w["message"]) for w in report["warnings"]}
    for w in group_warnings(caught):
        if _warning_key(w["message"]) not in known:
            report["warnings"].append(w)
            known.add(_warning_key(w["message"]))


def _run_side_by_side(args: argparse.Namespace) -> int:
    """``colligate side-by-side``: compare recipe files (paths and outputs checked first)."""
    from ._files import atomic_write_text, check_output_path
    from .compare import compare_recipes, format_comparison_json, format_comparison_text, plot_comparison
    from .plot import check_plot_path
    from .recipe import load_recipe
    from .units import parse_temperature

    if len(args.recipes) < 2:
        raise ValueError(f"side-by-side: got {len(args.recipes)} recipe file(s); give at least two")
    temps = None if not args.at else [parse_temperature(t) for t in args.at]
    fractions = args.frozen if args.frozen else None
    inputs = list(args.recipes)
    if args.plot is not None:
        check_plot_path(args.plot, inputs, "--plot")
    if args.save is not None:
        check_output_path(args.save, inputs, "--save")
        if args.plot is not None and os.path.abspath(args.plot) == os.path.abspath(args.save):
            raise ValueError(f"--save '{args.save}' is the same file as --plot")
    recipes, problems = [], []
    for path in args.recipes:
        try:
            recipes.append(load_recipe(path))
        except ValueError as exc:
            problems.append(str(exc))
    if problems:
        raise ValueError("; ".join(problems))
    kwargs = {} if fractions is None else {"ice_fractions": fractions}
    comparison = compare_recipes(recipes, temperatures=temps, **kwargs)
    if args.plot is not None:
        done = plot_comparison(recipes, args.plot, temperatures=comparison["temperatures_K"],
                               fahrenheit=args.fahrenheit, inputs=inputs)
        cautions = comparison.pop("cautions")
        comparison["files"] = {"ice_curves_plot": os.path.abspath(done)}
        comparison["cautions"] = cautions
    text = (format_comparison_json(comparison) if args.json
            else format_comparison_text(comparison, fahrenheit=args.fahrenheit))
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


def _join_negative_values(argv: list[str]) -> list[str]:
    """``--at -12C`` as ``--at=-12C``: argparse would take a value starting with '-' for an
    option; a temperature below zero is the usual case here."""
    out: list[str] = []
    i = 0
    while i < len(argv):
        if argv[i] == "--at" and i + 1 < len(argv) and re.match(r"-\.?\d", argv[i + 1]):
            out.append(f"--at={argv[i + 1]}")
            i += 2
            continue
        out.append(argv[i])
        i += 1
    return out


def _interrupted() -> int:
    try:
        print(f"{PROG}: interrupted", file=sys.stderr)
    except Exception:  # stderr closed: nothing more to say
        pass
    return EXIT_INTERRUPTED


def _stdout_gone() -> int:
    """stdout was closed by its reader (``colligate demo | head``): stop quietly. Point
    stdout at the null device so the interpreter's final flush does not fail again."""
    try:
        devnull = os.open(os.devnull, os.O_WRONLY)
        os.dup2(devnull, sys.stdout.fileno())
    except (OSError, ValueError, AttributeError):
        pass
    return EXIT_ERROR


def main(argv: Sequence[str] | None = None) -> int:
    """Run the command line program; returns the exit status (0 ok, 2 error, 130 Ctrl-C,
    3 internal error)."""
    try:
        argv = _join_negative_values(list(sys.argv[1:] if argv is None else argv))
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
    except KeyboardInterrupt:
        return _interrupted()
    except _UsageError as exc:
        print(f"{PROG}: error: {_short(exc)} (see '{PROG} --help')", file=sys.stderr)
        return EXIT_ERROR
    except SystemExit as exc:  # --help / --version
        return int(exc.code or 0) if not isinstance(exc.code, str) else EXIT_ERROR
    except BrokenPipeError:
        return _stdout_gone()
    except Exception as exc:
        if _caused_by_interrupt(exc):
            # A Ctrl-C that landed inside an extension module's initialisation (ImportError
            # "initialization failed") or inside a clean-up (an error raised while the
            # interrupt unwound) is still a Ctrl-C.
            return _interrupted()
        return _failed(exc)


def _caused_by_interrupt(exc: BaseException) -> bool:
    """True when a KeyboardInterrupt is in the exception's chain (cause or context)."""
    seen: set[int] = set()
    e: BaseException | None = exc
    while e is not None and id(e) not in seen:
        if isinstance(e, KeyboardInterrupt):
            return True
        seen.add(id(e))
        e = e.__cause__ or e.__context__
    return False


def _failed(exc: Exception) -> int:
    """The one-line message and exit status of a failure that is not a Ctrl-C: status 2 for
    a problem of the input or the machine, 3 for a bug in colligate."""
    try:
        if os.environ.get("COLLIGATE_TRACEBACK"):
            import traceback

            traceback.print_exception(type(exc), exc, exc.__traceback__)
        if isinstance(exc, (ValueError, OSError, RuntimeError, ArithmeticError)):
            # RecipeError, colligate.InvalidInputError, OutputPathError, InputFileError and
            # OutOfValidityRangeError are ValueErrors; their messages already name the field
            # and range. A solver failure (RuntimeError) is reported the same way. Every
            # problem of a recipe is listed, so errors get more room than warnings.
            print(f"{PROG}: error: {_short(exc, 2000)}", file=sys.stderr)
            return EXIT_ERROR
        print(f"{PROG}: internal error: {type(exc).__name__}: {_short(exc)} (please report it; set "
              "COLLIGATE_TRACEBACK=1 to see where)", file=sys.stderr)
        return EXIT_INTERNAL
    except KeyboardInterrupt:
        return _interrupted()


if __name__ == "__main__":  # pragma: no cover
    sys.exit(main())
