"""The ``colligate fit`` subcommand."""
from __future__ import annotations

import pathlib

import numpy as np
import pandas as pd

from colligate import cli, fit

REFERENCE = pathlib.Path(__file__).resolve().parents[1] / "reference"


def test_fit_norrish_csv_prints_summary_writes_plot_and_solute(tmp_path, capsys):
    # Robinson & Stokes (1959) App. 8.6 sucrose osmotic coefficients (from memory), as a_w.
    t = pd.read_csv(REFERENCE / "sucrose_osmotic_coefficients_25c.csv")
    m = t.molality_mol_per_kg.to_numpy()
    data = tmp_path / "sucrose.csv"
    pd.DataFrame({"molality": m, "water_activity": np.exp(-t.osmotic_coefficient * 0.018015268 * m)}).to_csv(
        data, index=False)
    solute = tmp_path / "sucrose.toml"
    rc = cli.main(["fit", str(data), "--model", "norrish",
                   "--save-solute", str(solute), "--molar-mass", "0.3423", "--name", "lab sucrose"])
    out = capsys.readouterr().out
    assert rc == cli.EXIT_OK
    assert "norrish_k" in out and "status: converged" in out
    assert (tmp_path / "sucrose_fit.png").read_bytes()[:4] == b"\x89PNG"
    assert fit.load_solute(solute).name == "lab sucrose"


def test_fit_missing_column_is_a_clean_error(tmp_path, capsys):
    data = tmp_path / "d.csv"
    data.write_text("molality,water_activity\n1,0.98\n2,0.96\n")
    assert cli.main(["fit", str(data), "--model", "effective"]) == cli.EXIT_ERROR
    assert "water_fraction" in capsys.readouterr().err
