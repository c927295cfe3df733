"""Shared fixtures: the cited reference tables in tests/reference/."""
from __future__ import annotations

import pathlib
import signal

import pandas as pd
import pytest

REFERENCE = pathlib.Path(__file__).resolve().parents[1] / "reference"


# A shell that starts a command in the background without job control starts it with
# SIGINT ignored, and Python then keeps it ignored: the Ctrl-C tests (here and in the
# commands they start) would test nothing. Give the run Python's usual Ctrl-C handling.
if hasattr(signal, "SIGINT") and signal.getsignal(signal.SIGINT) == signal.SIG_IGN:
    signal.signal(signal.SIGINT, signal.default_int_handler)


@pytest.fixture(scope="session")
def crc_freezing() -> pd.DataFrame:
    """CRC Handbook (102nd ed., 2021) freezing-point depressions; source_key per row."""
    df = pd.read_csv(REFERENCE / "crc_freezing_points.csv", keep_default_na=False)
    # rows the copy marks as doubtful are excluded (see NOTES_reference_data.md)
    return df[~df["note"].str.contains("below neighbours")]


def pytest_terminal_summary(terminalreporter, exitstatus, config):
    """Say loudly when published checks were skipped for a missing reference package."""
    from reference_packages import MISSING, REQUIREMENTS

    if MISSING:
        terminalreporter.section("PUBLISHED CHECKS NOT RUN", sep="!", red=True, bold=True)
        terminalreporter.write_line(
            f"missing reference package(s): {', '.join(sorted(MISSING))} - every check that "
            f"needs them was skipped. Install {REQUIREMENTS}; in CI (CI=true) this fails the run.",
            red=True, bold=True)
