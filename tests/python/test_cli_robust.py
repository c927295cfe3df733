"""The command never loses a file and never lies in a message: Ctrl-C, failures half-way,
two outputs on one path, long words, huge or deeply nested inputs, CSV errors, non-finite
JSON values. The expected behaviour is common practice for command-line tools (exit
status 130 after Ctrl-C, one-line errors); no check value comes from a publication."""

from __future__ import annotations

import json
import os
import shutil
import signal
import subprocess
import sys
import textwrap
import time
from pathlib import Path

import numpy as np
import pandas as pd
import pytest

import colligate as cg
from colligate import cli
from colligate.report import NonFiniteValueWarning, format_json, format_text

RECIPE = """\
[recipe]
name = "Robustness test syrup"
note = "NOTE"

[composition]
water = 0.8
sucrose = 0.2
"""

posix_signals = pytest.mark.skipif(sys.platform == "win32", reason="POSIX signals")


def run(capsys, *argv: str) -> tuple[int, str, str]:
    code = cli.main(list(argv))
    out, err = capsys.readouterr()
    return code, out, err


def one_line_error(code: int, err: str, *fragments: str, status: int = cli.EXIT_ERROR) -> str:
    """The one error line (validity warnings, one line each, may come before it)."""
    lines = [ln for ln in err.strip().splitlines() if not ln.startswith("colligate: warning: ")]
    assert code == status, err
    assert len(lines) == 1 and "Traceback" not in err, err
    for frag in fragments:
        assert frag in lines[0], (frag, lines[0])
    return lines[0]


def errors_only(err: str) -> list[str]:
    """stderr without the validity warnings (one line each)."""
    return [ln for ln in err.splitlines() if not ln.startswith("colligate: warning: ")]


def write_recipe(tmp_path: Path, note: str = "a syrup for tests", name: str = "r.toml") -> Path:
    p = tmp_path / name
    p.write_text(RECIPE.replace("NOTE", note), encoding="utf-8")
    return p


def console_script() -> str:
    exe = shutil.which("colligate")
    assert exe is not None, "console script 'colligate' is not installed (pip install .)"
    return exe


# ----------------------------------------------------------------- Ctrl-C


@posix_signals
def test_ctrl_c_while_colligate_imports_gives_the_one_line_message():
    # A real SIGINT, sent by the process to itself the moment the import of the compiled
    # core starts, as by a Ctrl-C typed at once: held back until the import is done (an
    # import broken half-way can abort the interpreter at exit), then the one line.
    script = textwrap.dedent("""
        import os, signal, sys
        class Interrupt:
            def find_spec(self, name, path=None, target=None):
                if name == "colligate._core":
                    os.kill(os.getpid(), signal.SIGINT)
                return None
        sys.meta_path.insert(0, Interrupt())
        sys.argv = ["colligate", "demo", "--no-plot"]
        import _colligate_cli
        sys.exit(_colligate_cli.main())
    """)
    proc = subprocess.run([sys.executable, "-c", script], capture_output=True, text=True, timeout=300)
    assert proc.returncode == cli.EXIT_INTERRUPTED, proc.stderr
    assert proc.stderr == "colligate: interrupted\n"
    assert proc.stdout == ""


def test_the_launcher_imports_nothing_heavy():
    # The entry point must be importable before colligate, numpy or pandas are loaded, so
    # that its handler is in place while they load.
    script = "import sys, _colligate_cli; print(sorted(m for m in sys.modules if m.split('.')[0] in " \
             "('colligate', 'numpy', 'pandas')))"
    proc = subprocess.run([sys.executable, "-c", script], capture_output=True, text=True, timeout=300)
    assert proc.returncode == 0, proc.stderr
    assert proc.stdout.strip() == "[]"


DEMO_FILES = sorted([cli.DEMO_PLOT_NAME, cli.DEMO_ENTHALPY_PLOT_NAME, cli.DEMO_COOLING_PLOT_NAME, cli.DEMO_CSV_NAME])


@posix_signals
def test_ctrl_c_at_any_moment_of_the_installed_command(tmp_path):
    # SIGINT at several moments of `colligate demo` (imports, computing, plotting): one
    # line and exit status 130 with none of the demo's files, or, when the signal comes
    # after the work is done, status 0 with all of them. Never a traceback, never a part.
    exe = console_script()
    interrupted = 0
    for delay in (0.3, 0.8, 1.5, 2.5, 4.0):
        out = tmp_path / f"after_{delay}"
        out.mkdir()
        proc = subprocess.Popen([exe, "demo", "--csv", "--out", str(out)], stdout=subprocess.PIPE,
                                stderr=subprocess.PIPE, text=True)
        time.sleep(delay)
        if proc.poll() is not None:  # finished before the signal: nothing to check here
            proc.communicate()
            continue
        proc.send_signal(signal.SIGINT)
        stdout, stderr = proc.communicate(timeout=300)
        assert "Traceback" not in stderr, (delay, stderr)
        if proc.returncode == 0:  # the signal came during the exit: the command had finished
            assert sorted(os.listdir(out)) == DEMO_FILES and "Cautions" in stdout
            continue
        interrupted += 1
        assert proc.returncode == cli.EXIT_INTERRUPTED, (delay, stderr)
        assert errors_only(stderr) == ["colligate: interrupted"], (delay, stderr)
        # all or none: a signal that lands after the renames finds every file in place
        assert sorted(os.listdir(out)) in ([], DEMO_FILES), (delay, os.listdir(out))
    assert interrupted >= 2, "the demo finished before most signals; the test did not test"


@posix_signals
def test_ctrl_c_while_the_demo_writes_its_files_leaves_none(tmp_path):
    # Wait until the first plot sits in its temporary file, then press Ctrl-C.
    exe = console_script()
    for attempt in range(3):
        out = tmp_path / f"attempt{attempt}"
        out.mkdir()
        proc = subprocess.Popen([exe, "demo", "--csv", "--out", str(out)], stdout=subprocess.PIPE,
                                stderr=subprocess.PIPE, text=True)
        while proc.poll() is None and not any(n.endswith(".tmp") for n in os.listdir(out)):
            time.sleep(0.005)
        if proc.poll() is not None:
            proc.communicate()
            continue
        proc.send_signal(signal.SIGINT)
        _, stderr = proc.communicate(timeout=300)
        assert proc.returncode == cli.EXIT_INTERRUPTED, stderr
        assert errors_only(stderr) == ["colligate: interrupted"], stderr
        assert sorted(os.listdir(out)) in ([], DEMO_FILES), os.listdir(out)  # all or none
        return
    pytest.fail("the demo never showed a temporary file before finishing")


def test_ctrl_c_just_before_the_files_are_renamed_leaves_none(tmp_path, capsys, monkeypatch):
    from colligate import _files

    def interrupted(self):
        raise KeyboardInterrupt

    monkeypatch.setattr(_files.OutputSet, "commit", interrupted)
    code, out, err = run(capsys, "demo", "--csv", "--out", str(tmp_path))
    assert code == cli.EXIT_INTERRUPTED and err.endswith("colligate: interrupted\n") and out == ""
    assert "Traceback" not in err
    assert os.listdir(tmp_path) == []


# ----------------------------------------------------------------- all outputs or none


def test_a_report_that_fails_half_way_leaves_no_plot(tmp_path, capsys, monkeypatch):
    import colligate.report as report

    def broken(*args, **kwargs):
        raise ValueError("table step failed (simulated)")

    src = write_recipe(tmp_path)
    monkeypatch.setattr(report, "ice_enthalpy_table", broken)
    code, out, err = run(capsys, "report", str(src), "--plot", str(tmp_path / "ice.png"),
                         "--enthalpy-plot", str(tmp_path / "h.png"), "--csv", str(tmp_path / "t.csv"),
                         "--save", str(tmp_path / "r.txt"))
    one_line_error(code, err, "simulated")
    assert out == ""
    assert sorted(os.listdir(tmp_path)) == ["r.toml"]


def test_an_internal_error_is_one_line_with_its_own_status(tmp_path, capsys, monkeypatch):
    import colligate.report as report

    def bug(*args, **kwargs):
        raise TypeError("unsupported operand (simulated bug)")

    monkeypatch.setattr(report, "build_report", bug)
    code, out, err = run(capsys, "report", str(write_recipe(tmp_path)), "--plot", str(tmp_path / "p.png"))
    one_line_error(code, err, "internal error: TypeError", "simulated bug", status=cli.EXIT_INTERNAL)
    assert sorted(os.listdir(tmp_path)) == ["r.toml"]


@pytest.mark.parametrize("wrapped", [
    # a Ctrl-C during an extension module's initialisation reaches Python as this ImportError
    # (seen with matplotlib._image when the signal came while the demo imported it)
    lambda: ImportError("initialization failed"),
    # an error raised by a clean-up while the interrupt unwound
    lambda: OSError(9, "Bad file descriptor"),
])
def test_an_error_caused_by_ctrl_c_is_reported_as_the_interrupt(tmp_path, capsys, monkeypatch, wrapped):
    import colligate.report as report

    def interrupted_import(*args, **kwargs):
        try:
            raise KeyboardInterrupt
        except KeyboardInterrupt as exc:
            raise wrapped() from exc

    monkeypatch.setattr(report, "build_report", interrupted_import)
    code, out, err = run(capsys, "report", str(write_recipe(tmp_path)), "--plot", str(tmp_path / "p.png"))
    assert code == cli.EXIT_INTERRUPTED
    assert err == "colligate: interrupted\n"
    assert out == ""
    assert sorted(os.listdir(tmp_path)) == ["r.toml"]


def test_an_import_error_without_ctrl_c_stays_an_internal_error(tmp_path, capsys, monkeypatch):
    import colligate.report as report

    monkeypatch.delenv("COLLIGATE_TRACEBACK", raising=False)

    def broken(*args, **kwargs):
        raise ImportError("initialization failed (simulated)")

    monkeypatch.setattr(report, "build_report", broken)
    code, out, err = run(capsys, "report", str(write_recipe(tmp_path)))
    one_line_error(code, err, "internal error: ImportError", "simulated", status=cli.EXIT_INTERNAL)


def test_fit_refuses_plot_and_solute_on_one_path_before_reading_anything(tmp_path, capsys):
    same = tmp_path / "x.out"
    code, out, err = run(capsys, "fit", str(tmp_path / "not_there.csv"), "--model", "norrish",
                         "--plot", str(same), "--save-solute", str(same))
    one_line_error(code, err, "--save-solute", "same file as --plot", str(same))
    assert os.listdir(tmp_path) == []


def test_fit_writes_plot_and_solute_together_or_neither(tmp_path, capsys, monkeypatch):
    data = tmp_path / "d.csv"
    # Invented demo data (not a published table): an ideal-ish solute.
    m = np.array([0.5, 1.0, 1.5, 2.0, 2.5])
    pd.DataFrame({"molality": m, "water_activity": np.exp(-0.018015 * m * (1 + 0.05 * m))}).to_csv(data, index=False)
    code, out, err = run(capsys, "fit", str(data), "--model", "norrish", "--plot", str(tmp_path / "p.png"),
                         "--save-solute", str(tmp_path / "s.toml"))
    # no --molar-mass: refused before fitting (a Norrish solute file needs it), so neither appears
    one_line_error(code, err, "--molar-mass", "--save-solute", "required")
    assert sorted(os.listdir(tmp_path)) == ["d.csv"]
    code, out, err = run(capsys, "fit", str(data), "--model", "norrish", "--plot", str(tmp_path / "p.png"),
                         "--save-solute", str(tmp_path / "s.toml"), "--molar-mass", "0.1")
    assert code == 0, err
    assert sorted(os.listdir(tmp_path)) == ["d.csv", "p.png", "s.toml"]


# ----------------------------------------------------------------- messages


def test_unwritable_directory_message_names_option_and_path(tmp_path, capsys, monkeypatch):
    from colligate import _files

    monkeypatch.setattr(_files.os, "access", lambda *a, **k: False)
    target = tmp_path / "sub.png"
    code, out, err = run(capsys, "report", str(write_recipe(tmp_path)), "--plot", str(target))
    line = one_line_error(code, err, "--plot", str(target), "not writable")
    assert ".tmp" not in line


def test_deeply_nested_toml_gives_a_clear_error(tmp_path, capsys):
    src = tmp_path / "deep.toml"
    src.write_text(RECIPE.replace("NOTE", "x") + "[options]\nmodel = " + "[" * 50000 + "]" * 50000 + "\n")
    code, out, err = run(capsys, "report", str(src))
    line = one_line_error(code, err, "deep.toml", "nested too deeply")
    assert "recursion" not in line


def test_oversized_recipe_names_file_and_limit(tmp_path, capsys):
    src = tmp_path / "huge.toml"
    with open(src, "wb") as fh:
        fh.write(RECIPE.replace("NOTE", "x").encode())
        fh.truncate(11 * 1024 * 1024)
    code, out, err = run(capsys, "report", str(src))
    one_line_error(code, err, "huge.toml", "limited to 10 MB")


def test_a_note_of_one_long_word_is_laid_out_in_lines(tmp_path):
    # A 9 MB note of one unbroken word, through the installed command. The timeout only
    # guards against a hang; nothing here measures time.
    word = "ab" * (9 * 1024 * 1024 // 2)
    src = write_recipe(tmp_path, note=word)
    proc = subprocess.run([console_script(), "report", str(src)], capture_output=True, text=True, timeout=900)
    assert proc.returncode == 0, proc.stderr[-500:]
    lines = proc.stdout.splitlines()
    assert max(len(ln) for ln in lines) <= 78
    pieces = [ln.strip() for ln in lines if set(ln.strip()) == {"a", "b"}]
    assert "".join(pieces) == word  # every character kept, in order


def test_text_layout_of_long_words_and_runs_of_spaces():
    rep = cg.report.build_report(cg.recipe.parse_recipe(RECIPE.replace("NOTE", "x")))
    for note in ("w" * 200_000, " " * 200_000 + "end", "short words " * 20_000, "x" * 77 + " y"):
        text = format_text({**rep, "note": note})
        lines = text.splitlines()
        assert max(len(ln) for ln in lines) <= 78
        assert "".join(note.split()) in "".join("".join(ln.split()) for ln in lines)


def test_json_report_writes_null_for_non_finite_values_with_a_warning():
    with pytest.warns(NonFiniteValueWarning, match=r"a\.b = inf, c\[1\] = nan: not a finite number, written as null"):
        text = format_json({"a": {"b": float("inf")}, "c": [1.0, float("nan")], "d": "x"})
    assert json.loads(text) == {"a": {"b": None}, "c": [1.0, None], "d": "x"}


def test_cli_json_report_with_an_infinite_value(tmp_path, capsys, monkeypatch):
    import colligate.report as report

    real = report.build_report

    def with_inf(recipe):
        rep = real(recipe)
        rep["water_activity_25C"] = float("inf")
        return rep

    monkeypatch.setattr(report, "build_report", with_inf)
    code, out, err = run(capsys, "report", str(write_recipe(tmp_path)), "--json")
    assert code == 0, err
    assert json.loads(out)["water_activity_25C"] is None
    assert "colligate: warning: JSON report: water_activity_25C = inf: not a finite number, written as null" in err


@pytest.mark.parametrize("content, line, column, what", [
    ("molality,water_activity\n0.5,0.99\n1.0,0.98\n1.5,abc\n", 4, "water_activity", "'abc' is not a number"),
    ("molality,water_activity\n0.5,0.99\n\n1.0,\n", 4, "water_activity", "empty cell"),
    ("molality,water_activity\n0.5,0.99\n  \n\n1.0,0.98\n2.0, \n", 6, "water_activity", "empty cell"),
    ("molality,water_activity\n0.5,0.99\ninf,0.98\n", 3, "molality", "'inf' is not finite"),
    ("molality,water_activity\n0.5,0.99\n1e999,0.98\n", 3, "molality", "'1e999' is not finite"),
])
def test_fit_csv_errors_name_file_line_and_column(tmp_path, capsys, content, line, column, what):
    data = tmp_path / "lab.csv"
    data.write_text(content)
    code, out, err = run(capsys, "fit", str(data), "--model", "norrish")
    one_line_error(code, err, "lab.csv", f"line {line}", f"column '{column}'", what)
    assert sorted(os.listdir(tmp_path)) == ["lab.csv"]


def test_fit_csv_ragged_line_and_empty_file(tmp_path, capsys):
    data = tmp_path / "ragged.csv"
    data.write_text("molality,water_activity\n0.5,0.99\n1.0,0.98,7\n")
    code, out, err = run(capsys, "fit", str(data), "--model", "norrish")
    one_line_error(code, err, "ragged.csv", "line 3")
    data.write_text("")
    code, out, err = run(capsys, "fit", str(data), "--model", "norrish")
    one_line_error(code, err, "ragged.csv", "empty")


def test_molar_mass_start_names_the_bounds_of_the_fit():
    wf = np.array([0.9, 0.8, 0.7])
    tf = np.array([272.5, 271.5, 270.0])  # invented demo data
    with pytest.raises(cg.InvalidInputError,
                       match=r"molar_mass_start = 0: must lie within the bounds of the fit, \[0\.005, 100\] kg/mol"):
        cg.fit_effective_solute(wf, tf, molar_mass_start=0.0)
    with pytest.raises(cg.InvalidInputError,
                       match=r"bound_water_start = -1: must lie within the bounds of the fit, \[0, 3\] kg per kg"):
        cg.fit_effective_solute(wf, tf, bound_water_start=-1.0)


@posix_signals
def test_report_save_to_a_named_pipe_is_refused_and_through_a_link_is_written(tmp_path, capsys):
    # The case of `colligate report good.toml --save /dev/null` run as root, with a named
    # pipe standing in for the device: refused before computing, the pipe left as it is.
    import stat

    src = write_recipe(tmp_path)
    fifo = tmp_path / "pipe"
    os.mkfifo(fifo)
    code, out, err = run(capsys, "report", str(src), "--save", str(fifo))
    one_line_error(code, err, "--save", str(fifo), "named pipe")
    assert stat.S_ISFIFO(os.lstat(fifo).st_mode) and out == ""
    assert sorted(os.listdir(tmp_path)) == ["pipe", "r.toml"]

    real = tmp_path / "reports" / "r.txt"
    real.parent.mkdir()
    real.write_text("old report\n")
    link = tmp_path / "latest.txt"
    link.symlink_to(real)
    code, out, err = run(capsys, "report", str(src), "--save", str(link))
    assert code == 0, err
    assert os.path.islink(link) and real.read_text(encoding="utf-8") == out
    assert sorted(os.listdir(real.parent)) == ["r.txt"]


@posix_signals
def test_sigterm_while_the_demo_writes_its_files_leaves_none(tmp_path):
    exe = console_script()
    for attempt in range(3):
        out = tmp_path / f"attempt{attempt}"
        out.mkdir()
        proc = subprocess.Popen([exe, "demo", "--csv", "--out", str(out)], stdout=subprocess.PIPE,
                                stderr=subprocess.PIPE, text=True)
        while proc.poll() is None and not any(n.endswith(".tmp") for n in os.listdir(out)):
            time.sleep(0.005)
        if proc.poll() is not None:
            proc.communicate()
            continue
        proc.send_signal(signal.SIGTERM)
        _, stderr = proc.communicate(timeout=300)
        assert proc.returncode == 128 + signal.SIGTERM, stderr
        assert "Traceback" not in stderr
        assert sorted(os.listdir(out)) in ([], DEMO_FILES), os.listdir(out)  # all or none
        return
    pytest.fail("the demo never showed a temporary file before finishing")
