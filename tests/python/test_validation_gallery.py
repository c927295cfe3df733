"""The validation gallery (tools/validation_gallery.py) and the tolerance table it shares
with the tests (tests/reference/tolerances.toml): every published point within its
tolerance, and a moved reference value or an unlisted table fails the script."""
from __future__ import annotations

import importlib.util
import pathlib
import shutil
import subprocess
import sys
import tomllib

import pandas as pd

ROOT = pathlib.Path(__file__).resolve().parents[2]
REFERENCE = ROOT / "tests" / "reference"
SCRIPT = ROOT / "tools" / "validation_gallery.py"


def _gallery():
    if "validation_gallery" in sys.modules:
        return sys.modules["validation_gallery"]
    spec = importlib.util.spec_from_file_location("validation_gallery", SCRIPT)
    module = importlib.util.module_from_spec(spec)
    sys.modules["validation_gallery"] = module  # dataclasses look their module up by name
    spec.loader.exec_module(module)
    return module


def test_tolerance_table_is_complete():
    config = tomllib.loads((REFERENCE / "tolerances.toml").read_text(encoding="utf-8"))
    gallery = _gallery()
    ids = [e["id"] for e in config["check"] + config["shown"] if "id" in e]
    assert len(ids) == len(set(ids)), "check ids must be unique"
    for entry in config["check"]:
        assert entry["quantity"] in gallery.QUANTITIES, entry["id"]
        assert len(entry["basis"]) > 20, f"{entry['id']}: a tolerance needs its written basis"
        assert (REFERENCE / entry["file"]).is_file(), entry["file"]
    for entry in config["shown"]:
        assert len(entry["reason"]) > 20, entry["file"]


def test_every_published_point_within_its_tolerance():
    # The checks themselves: sources and tolerance bases are in tests/reference/tolerances.toml
    # (CRC Handbook 2021, Melinder 2010, Hamer & Wu 1972, TEOS-10 2010, ASHRAE 2006, ...).
    results, problems = _gallery().run(REFERENCE, None)
    assert problems == []
    checked = [r for r in results if r.checked]
    assert len(checked) >= 25
    assert sum(len(r.table) for r in checked) >= 400


def test_every_data_set_is_drawn():
    # One PNG per data set (issue 18): every reference table is drawn by a check or a shown
    # entry, except the six that hold no model-versus-data curve (constants, solver
    # problems, three single published values checked in the storage tests, an independent
    # code's output that checks the Pitzer equations, collected sulfate solubilities not yet
    # compared with the model), each listed with its reason.
    config = _gallery().load_config(REFERENCE)
    drawn = {e["file"] for e in config["check"] + config["shown"] if "quantity" in e}
    not_drawn = {e["file"] for e in config["shown"] if "quantity" not in e}
    assert not_drawn == {"norrish_constants.csv", "nist_strd_data.csv", "nist_strd_certified.csv",
                         "sucrose_freeze_concentration.csv", "pitzer_cross_check_25c.csv",
                         "sulfate_low_temperature_data.csv"}
    assert drawn | not_drawn == {p.name for p in REFERENCE.glob("*.csv")}
    # the ice-cream mix against the dairy method, with the tolerance of test_ingredients.py
    ice_cream = next(e for e in config["check"] if e["id"] == "ice_cream_goff_hartel")
    assert ice_cream["file"] == "goff_hartel_ice_cream_freezing_curve.csv" and ice_cream["tolerance"] == "3"


def test_moved_reference_value_and_unlisted_table_fail_the_script(tmp_path):
    copy = tmp_path / "reference"
    shutil.copytree(REFERENCE, copy)
    # Move one TEOS-10 freezing point by 0.02 K (four times its 0.005 K tolerance).
    path = copy / "seawater_teos10_freezing_points.csv"
    df = pd.read_csv(path, keep_default_na=False)
    df.loc[df.absolute_salinity_g_per_kg == 20.0, "freezing_point_C"] -= 0.02
    df.to_csv(path, index=False)
    # And a new table that no check or shown entry lists.
    (copy / "new_table.csv").write_text("x,source_key,used_in_fit\n1,crc_concentrative,no\n")
    out = subprocess.run([sys.executable, str(SCRIPT), "--no-plots", "--reference-dir", str(copy)],
                         capture_output=True, text=True, check=False)
    assert out.returncode == 1, out.stdout + out.stderr
    fails = [line for line in out.stderr.splitlines() if line.startswith("FAIL ")]
    assert len(fails) == 2, out.stderr
    assert "teos10_freezing_point" in fails[0] and "absolute_salinity_g_per_kg=20.0" in fails[0]
    assert "new_table.csv: neither checked nor listed" in fails[1]


def test_gallery_writes_one_png_per_table_and_a_page(tmp_path):
    gallery = _gallery()
    config = gallery.load_config(REFERENCE)
    # one cheap check and one shown table, through the same plotting code as the full run
    small = {"format": 1,
             "check": [e for e in config["check"] if e["id"] == "teos10_freezing_point"],
             "shown": [e for e in config["shown"] if e.get("id") == "sucrose_osmotic_25c"]}
    results = [gallery.evaluate(small["check"][0], REFERENCE),
               gallery.evaluate(small["shown"][0], REFERENCE, checked=False)]
    for r in results:
        gallery.plot(r, tmp_path / f"{r.id}.png")
        assert (tmp_path / f"{r.id}.png").stat().st_size > 10_000
    gallery.write_page(small, results, tmp_path / "gallery.md")
    page = (tmp_path / "gallery.md").read_text(encoding="utf-8")
    assert "![Seawater freezing point against TEOS-10](teos10_freezing_point.png)" in page
    assert "6 of 6 points within tolerance" in page
    assert "verify by measurement" in page
