"""Tests for the ``colligate`` command (colligate.cli)."""

from __future__ import annotations

import json
import os
import shutil
import subprocess
import sys
import warnings
from pathlib import Path

import pytest

import colligate as cg
from colligate import cli

RECIPE = """\
[recipe]
name = "Lime sorbet test"
basis = "percent"

[composition]
water = 70
sucrose = 22
glucose = 7.5
citric_acid = 0.5

[temperatures_celsius]
drawing = -6
serving = -13
storage = -20
"""

PNG_MAGIC = b"\x89PNG\r\n\x1a\n"


def run(capsys, *argv: str) -> tuple[int, str, str]:
    code = cli.main(list(argv))
    out, err = capsys.readouterr()
    return code, out, err


def recipe_file(tmp_path: Path, text: str = RECIPE, name: str = "lime.toml") -> Path:
    p = tmp_path / name
    p.write_text(text, encoding="utf-8")
    return p


def assert_one_line_error(code: int, out: str, err: str, *fragments: str) -> None:
    assert code == 2
    assert out == ""
    lines = err.strip().splitlines()
    assert len(lines) == 1, err
    assert lines[0].startswith("colligate: error: ")
    assert "Traceback" not in err
    for frag in fragments:
        assert frag in lines[0], (frag, lines[0])


def assert_ends_with_cautions(text: str) -> None:
    blocks = text.rstrip().split("\nCautions\n")
    assert len(blocks) == 2, "exactly one cautions block"
    assert "verify" in blocks[1].lower() and "regulations" in blocks[1].lower()
    assert "\n\n" not in blocks[1].strip(), "nothing follows the cautions block"


# ----------------------------------------------------------------- demo


def test_demo_prints_report_and_writes_plot(tmp_path, capsys):
    code, out, err = run(capsys, "demo", "--out", str(tmp_path))
    assert code == 0, err
    assert "INVENTED DEMO SCENARIO" in out
    assert "initial freezing point" in out
    assert_ends_with_cautions(out)
    assert "Heat to remove" in out and "Formulation indicators" in out
    assert "Model: auto" in out
    names = [cli.DEMO_PLOT_NAME, cli.DEMO_ENTHALPY_PLOT_NAME, cli.DEMO_COOLING_PLOT_NAME]
    for name in names:
        png = tmp_path / name
        assert png.read_bytes()[:8] == PNG_MAGIC
        assert str(png) in out
    assert sorted(os.listdir(tmp_path)) == sorted(names)  # no temporary files left


def test_demo_default_is_the_ice_cream_and_sorbet_stays_available(tmp_path, capsys):
    code, out, err = run(capsys, "demo", "--no-plot", "--out", str(tmp_path))
    assert code == 0, err
    assert "Strawberry ice cream" in out and "whole_milk" in out
    code, out, err = run(capsys, "demo", "--scenario", "sorbet", "--no-plot", "--out", str(tmp_path))
    assert code == 0, err
    assert "sorbet" in out.lower() and "INVENTED DEMO SCENARIO" in out
    assert_ends_with_cautions(out)
    assert os.listdir(tmp_path) == []


def test_demo_csv(tmp_path, capsys):
    code, out, err = run(capsys, "demo", "--no-plot", "--csv", "--out", str(tmp_path))
    assert code == 0, err
    assert os.listdir(tmp_path) == [cli.DEMO_CSV_NAME]
    import pandas as pd

    df = pd.read_csv(tmp_path / cli.DEMO_CSV_NAME, keep_default_na=False)
    for col in ("temperature_C", "ice_fraction", "unfrozen_water_kg", "enthalpy_J_per_kg", "apparent_cp_J_per_kg_K"):
        assert col in df.columns
    assert {"fill", "drawing", "serving", "storage", "initial_freezing_point"} <= set(df["point"])


def test_demo_json(tmp_path, capsys):
    code, out, err = run(capsys, "demo", "--json", "--out", str(tmp_path))
    assert code == 0, err
    rep = json.loads(out)
    for key in ("freezing_point_K", "freezing_point_C", "freezing_point_F", "water_activity_25C"):
        assert isinstance(rep[key], float), key
    assert rep["ice_table"][0]["temperature_C"] == pytest.approx(-6.0, abs=1e-9)  # the demo file's drawing temperature
    assert "invented demo scenario" in rep["label"].lower()
    for key in ("ice_curve_png", "enthalpy_png", "cooling_curve_png"):
        assert Path(rep["files"][key]).is_file()
    assert rep["heat_load"]["total_kJ_per_kg_of_batch"] > 0 and rep["indicators"]
    assert list(rep)[-1] == "cautions" and rep["cautions"]


def test_demo_fahrenheit(tmp_path, capsys):
    code, out, _ = run(capsys, "demo", "--fahrenheit", "--no-plot", "--out", str(tmp_path))
    assert code == 0
    table = out[out.index("Ice at"):out.index("Model:")]
    assert "°F" in table
    assert os.listdir(tmp_path) == []


def test_demo_out_must_be_a_directory(tmp_path, capsys):
    code, out, err = run(capsys, "demo", "--out", str(tmp_path / "missing"))
    assert_one_line_error(code, out, err, "--out", "missing")


def test_demo_overwrites_its_own_previous_plot(tmp_path, capsys):
    png = tmp_path / cli.DEMO_PLOT_NAME
    png.write_bytes(b"stale")
    code, _, _ = run(capsys, "demo", "--out", str(tmp_path))
    assert code == 0
    assert png.read_bytes()[:8] == PNG_MAGIC


# ----------------------------------------------------------------- report


def test_report_recipe_with_plot_and_save(tmp_path, capsys):
    src = recipe_file(tmp_path)
    before = src.read_bytes()
    plot = tmp_path / "lime.png"
    saved = tmp_path / "lime.txt"
    code, out, err = run(capsys, "report", str(src), "--plot", str(plot), "--save", str(saved))
    assert code == 0, err
    assert "Lime sorbet test" in out
    assert "INVENTED" not in out  # only the demo carries that label
    assert_ends_with_cautions(out)
    assert plot.read_bytes()[:8] == PNG_MAGIC
    assert saved.read_text(encoding="utf-8") == out
    assert src.read_bytes() == before
    assert sorted(os.listdir(tmp_path)) == ["lime.png", "lime.toml", "lime.txt"]


def test_report_without_plot_writes_nothing(tmp_path, capsys):
    src = recipe_file(tmp_path)
    code, out, _ = run(capsys, "report", str(src))
    assert code == 0
    assert os.listdir(tmp_path) == ["lime.toml"]
    assert "Files written" not in out


def test_report_json_save(tmp_path, capsys):
    src = recipe_file(tmp_path)
    saved = tmp_path / "lime.json"
    code, out, _ = run(capsys, "report", str(src), "--json", "--save", str(saved))
    assert code == 0
    assert json.loads(saved.read_text(encoding="utf-8")) == json.loads(out)
    rep = json.loads(out)
    assert rep["aqueous_phase_mass_kg"] == pytest.approx(1.0, abs=1e-12)  # percent basis, default batch 1 kg
    assert {"temperature_C", "ice_fraction_of_water", "unfrozen_water_kg_of_aqueous_phase",
            "dissolved_solids_mass_percent_of_unfrozen_liquid"} <= set(rep["ice_table"][0])


def test_report_thermal_plots_and_csv(tmp_path, capsys):
    src = recipe_file(tmp_path)
    before = src.read_bytes()
    code, out, err = run(capsys, "report", str(src), "--enthalpy-plot", str(tmp_path / "h.png"),
                         "--cooling-plot", str(tmp_path / "cool.png"), "--csv", str(tmp_path / "t.csv"))
    assert code == 0, err
    assert (tmp_path / "h.png").read_bytes()[:8] == PNG_MAGIC
    assert (tmp_path / "cool.png").read_bytes()[:8] == PNG_MAGIC
    header = (tmp_path / "t.csv").read_text(encoding="utf-8").splitlines()[0].split(",")
    assert header[:2] == ["point", "temperature_C"]
    assert str(tmp_path / "t.csv") in out
    assert_ends_with_cautions(out)
    assert src.read_bytes() == before
    assert sorted(os.listdir(tmp_path)) == ["cool.png", "h.png", "lime.toml", "t.csv"]


def test_report_refuses_two_outputs_to_one_file(tmp_path, capsys):
    src = recipe_file(tmp_path)
    code, out, err = run(capsys, "report", str(src), "--plot", str(tmp_path / "x.png"),
                         "--cooling-plot", str(tmp_path / "x.png"))
    assert_one_line_error(code, out, err, "same file")
    assert os.listdir(tmp_path) == ["lime.toml"]


@pytest.mark.parametrize("option", ["--plot", "--save", "--csv", "--enthalpy-plot", "--cooling-plot"])
def test_report_refuses_to_overwrite_input(tmp_path, capsys, option):
    src = recipe_file(tmp_path)
    before = src.read_bytes()
    code, out, err = run(capsys, "report", str(src), option, str(src))
    assert_one_line_error(code, out, err, option, "input")
    assert src.read_bytes() == before
    assert os.listdir(tmp_path) == ["lime.toml"]


def test_report_refuses_input_through_other_spelling(tmp_path, capsys, monkeypatch):
    src = recipe_file(tmp_path)
    before = src.read_bytes()
    monkeypatch.chdir(tmp_path)
    code, out, err = run(capsys, "report", "lime.toml", "--plot", str(tmp_path / "." / "lime.toml"))
    assert_one_line_error(code, out, err, "input")
    assert src.read_bytes() == before


def test_report_plot_into_missing_directory(tmp_path, capsys):
    src = recipe_file(tmp_path)
    code, out, err = run(capsys, "report", str(src), "--plot", str(tmp_path / "no" / "x.png"))
    assert_one_line_error(code, out, err, "does not exist")


# ----------------------------------------------------------------- errors


def test_malformed_recipe_gives_one_line_error(tmp_path, capsys):
    src = recipe_file(tmp_path, RECIPE.replace("sucrose = 22", "sucrose = -3"), name="bad.toml")
    code, out, err = run(capsys, "report", str(src))
    assert_one_line_error(code, out, err, "bad.toml", "[composition].sucrose = -3", ">= 0")


def test_percent_recipe_not_summing(tmp_path, capsys):
    src = recipe_file(tmp_path, RECIPE.replace("water = 70", "water = 60"), name="sum.toml")
    code, out, err = run(capsys, "report", str(src))
    assert_one_line_error(code, out, err, "sum.toml", "100")


def test_syntax_error_names_line(tmp_path, capsys):
    src = recipe_file(tmp_path, RECIPE.replace('name = "Lime sorbet test"', "name = Lime"), name="syn.toml")
    code, out, err = run(capsys, "report", str(src))
    assert_one_line_error(code, out, err, "syn.toml", "line 2")


def test_missing_recipe_file(tmp_path, capsys):
    code, out, err = run(capsys, "report", str(tmp_path / "absent.toml"))
    assert_one_line_error(code, out, err, "absent.toml", "not found")


@pytest.mark.parametrize("argv", [["report"], ["bake"], ["demo", "--colour"], ["report", "a.toml", "--plot"]])
def test_usage_errors(capsys, argv):
    code, out, err = run(capsys, *argv)
    assert_one_line_error(code, out, err)


def test_no_command_shows_help(capsys):
    code, out, err = run(capsys)
    assert code == 2
    assert "demo" in err and "report" in err


def test_help_and_version(capsys):
    code, out, _ = run(capsys, "--help")
    assert code == 0 and "demo" in out
    code, out, _ = run(capsys, "--version")
    assert code == 0 and out.startswith("colligate ")


def test_validity_warning_is_shown_once_in_the_report_not_on_stderr(tmp_path, capsys, monkeypatch):
    real = cg.freezing_point

    def warning_freezing_point(*args, **kwargs):
        warnings.warn("test: outside the validated range\nsecond line", cg.OutOfValidityRangeWarning)
        return real(*args, **kwargs)

    monkeypatch.setattr(cg.api, "freezing_point", warning_freezing_point)
    code, out, err = run(capsys, "report", str(recipe_file(tmp_path)), "--plot", str(tmp_path / "ice.png"))
    assert code == 0
    assert "warning" not in err and "Traceback" not in err
    assert out.count("test: outside the validated range") == 1  # once, in the Warnings section
    assert_ends_with_cautions(out)
    code, out, err = run(capsys, "report", str(recipe_file(tmp_path)), "--json")
    assert code == 0 and "warning" not in err
    assert [w["message"] for w in json.loads(out)["warnings"]] == ["test: outside the validated range\nsecond line"]


# ----------------------------------------------------------------- installed program


def test_python_dash_m(tmp_path):
    proc = subprocess.run(
        [sys.executable, "-m", "colligate", "demo", "--json", "--no-plot"],
        cwd=tmp_path,
        capture_output=True,
        text=True,
        timeout=300,
    )
    assert proc.returncode == 0, proc.stderr
    assert json.loads(proc.stdout)["cautions"]


def test_console_script_demo(tmp_path):
    exe = shutil.which("colligate")
    assert exe is not None, "console script 'colligate' is not installed (pip install .)"
    proc = subprocess.run([exe, "demo"], cwd=tmp_path, capture_output=True, text=True, timeout=300)
    assert proc.returncode == 0, proc.stderr
    assert "INVENTED DEMO SCENARIO" in proc.stdout
    assert_ends_with_cautions(proc.stdout)
    for name in (cli.DEMO_PLOT_NAME, cli.DEMO_ENTHALPY_PLOT_NAME, cli.DEMO_COOLING_PLOT_NAME):
        assert (tmp_path / name).read_bytes()[:8] == PNG_MAGIC
    # errors from the installed program: exit status 2, one line, no traceback
    bad = subprocess.run([exe, "report", "absent.toml"], cwd=tmp_path, capture_output=True, text=True, timeout=300)
    assert bad.returncode == 2
    assert bad.stderr.strip().startswith("colligate: error: ")
    assert "Traceback" not in bad.stderr
