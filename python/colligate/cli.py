"""The ``colligate`` command.

Subcommands::

    colligate demo   [--scenario ice_cream|sorbet] [--out DIR] [--no-plot] [--csv [FILE]]
                     [--save FILE] [--json] [--fahrenheit]
    colligate report RECIPE.toml [--plot PNG] [--enthalpy-plot PNG] [--cooling-plot PNG]
                     [--csv FILE] [--save FILE] [--json] [--fahrenheit]
    colligate fit DATA.csv --model norrish|effective|pitzer [--salt NaCl] [--plot PNG] [--save-solute FILE]

``demo`` evaluates a built-in demo recipe (an invented demo scenario: a
strawberry ice cream made of library ingredients, or ``--scenario sorbet``),
prints the report and writes three plots into ``--out`` (default: the current
folder): ``colligate_demo_ice_curve.png``, ``colligate_demo_enthalpy.png`` and
``colligate_demo_cooling_curve.png``; ``--csv`` also writes the ice/enthalpy
table (default name ``colligate_demo_table.csv`` in ``--out``).
``report`` does the same for a recipe file (see ``docs/recipe_format.md``);
it writes only the files asked for (``--plot``, ``--enthalpy-plot``,
``--cooling-plot``, ``--csv``).

``--json`` prints the machine-readable report (units in the keys) instead of
text; ``--fahrenheit`` adds degF to the text report; ``--save FILE`` also
writes the printed report to FILE. Every file is written atomically and an
input file is never overwritten.

Exit status: 0 on success, 2 on a usage or input error (a one-line message on
stderr, no traceback). ``demo`` and ``report`` show each warning once, grouped, in the
report (text or JSON), not on stderr; ``fit`` prints its warnings as one line each on
stderr. Warnings do not change the exit status.
"""

from __future__ import annotations

import argparse
import os
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
]

PROG = "colligate"
DEMO_PLOT_NAME = "colligate_demo_ice_curve.png"
DEMO_ENTHALPY_PLOT_NAME = "colligate_demo_enthalpy.png"
DEMO_COOLING_PLOT_NAME = "colligate_demo_cooling_curve.png"
DEMO_CSV_NAME = "colligate_demo_table.csv"
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
        p.add_argument("--fahrenheit", action="store_true", help="also show temperatures in degF in the text report")
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
    common(p_rep)

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
    return parser


def _short(message: object) -> str:
    text = " ".join(str(message).split())
    return text if len(text) <= 300 else text[:297] + "..."


def _run(args: argparse.Namespace) -> int:
    from ._files import atomic_write_text, check_output_path
    from .recipe import load_demo_recipe, load_recipe
    from .report import build_report, format_json, format_text

    if args.command == "fit":
        from .fit import run_fit_command

        sys.stdout.write(run_fit_command(args))
        sys.stdout.flush()
        return EXIT_OK
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
        ):
            if value is not None:
                outputs[key] = (value, option)

    # Check every output path before computing, so a bad path fails fast.
    checks = list(outputs.values()) + ([(args.save, "--save")] if args.save is not None else [])
    seen: dict[str, str] = {}
    for path, option in checks:
        check_output_path(path, inputs, option)
        full = os.path.abspath(path)
        if full in seen:
            raise ValueError(f"{option} '{path}' is the same file as {seen[full]}")
        seen[full] = option

    report = build_report(recipe)
    written: dict[str, str] = {}
    # Warnings of the plots and the table join the report's own (once each); none go to stderr.
    with warnings.catch_warnings(record=True) as caught:
        warnings.simplefilter("always")
        _write_outputs(recipe, outputs, inputs, written)
    _merge_warnings(report, caught)
    if written:
        cautions = report.pop("cautions")
        report["files"] = written
        report["cautions"] = cautions  # cautions stay last

    text = format_json(report) if args.json else format_text(report, fahrenheit=args.fahrenheit)
    if args.save is not None:
        atomic_write_text(args.save, text, inputs, "--save")
    sys.stdout.write(text)
    sys.stdout.flush()
    return EXIT_OK


def _write_outputs(recipe, outputs, inputs, written) -> None:
    """Write the plots and the table asked for; record each path written in ``written``."""
    from .plot import plot_cooling_curve, plot_enthalpy, plot_ice_curve
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
            )
        elif key == "enthalpy_png":
            done = plot_enthalpy(recipe, path, title=f"Enthalpy and apparent specific heat: {title}",
                                 label=label, inputs=inputs)
        elif key == "cooling_curve_png":
            done = plot_cooling_curve(recipe, path, title=f"Cooling curve: {title}", label=label, inputs=inputs)
        else:
            done = write_table_csv(ice_enthalpy_table(recipe), path, inputs, option)
        written[key] = os.path.abspath(done)


def _merge_warnings(report: dict, caught: Sequence[warnings.WarningMessage]) -> None:
    """Add warnings raised after the report was built, unless the report already has them."""
    from .report_indicators import _warning_key, group_warnings

    known = {_warning_key(w["message"]) for w in report["warnings"]}
    for w in group_warnings(caught):
        if _warning_key(w["message"]) not in known:
            report["warnings"].append(w)
            known.add(_warning_key(w["message"]))


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
