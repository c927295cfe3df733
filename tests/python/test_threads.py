"""Eight Python threads calling the scalar and the batch API at the same time get results
bit-identical to a serial run (identity test: the core has no shared mutable state and
releases the GIL in the batch kernels). No check value comes from a publication."""

from __future__ import annotations

import threading
import warnings
from concurrent.futures import ThreadPoolExecutor

import numpy as np
import pandas as pd

import colligate as cg

THREADS = 8
# Sugars, a polyol, an acid and salts. Validity warnings are switched off for the whole
# test (warnings filters are process-wide, not per thread; the values are compared, not
# their ranges).
SPECIES = ["sucrose", "glucose", "glycerol", "citric_acid", "NaCl", "KCl"]
TEMPERATURES = (268.15, 263.15, 258.15)


def compositions(n: int = 24) -> pd.DataFrame:
    rng = np.random.default_rng(2024)
    m = rng.uniform(0.0, 0.4, (n, len(SPECIES)))
    return pd.DataFrame(m, columns=SPECIES)


def scalar_results(df: pd.DataFrame, order) -> dict:
    out = {}
    for i in order:
        s = cg.Solution.from_molalities(df.iloc[i].to_dict())
        out[i] = (
            cg.freezing_point(s),
            cg.water_activity(s, T=298.15),
            tuple(float(cg.ice_fraction(s, T)) for T in TEMPERATURES),
            cg.osmotic_coefficient(s, T=298.15),
        )
    return out


def batch_results(df: pd.DataFrame, threads: int) -> tuple:
    batch = cg.SolutionBatch.from_molalities(df)
    return (
        cg.batch_freezing_point(batch, threads=threads).to_numpy(),
        cg.batch_water_activity(batch, 298.15, threads=threads).to_numpy(),
        cg.batch_ice_fraction(batch, list(TEMPERATURES), threads=threads).to_numpy(),
    )


def same_bits(a, b) -> bool:
    a, b = np.asarray(a, dtype=float), np.asarray(b, dtype=float)
    return a.shape == b.shape and a.tobytes() == b.tobytes()


def test_eight_threads_give_the_serial_results_bit_for_bit():
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", cg.OutOfValidityRangeWarning)
        warnings.simplefilter("ignore", cg.BatchRowWarning)
        check_threads()


def check_threads():
    df = compositions()
    serial_scalar = scalar_results(df, range(len(df)))
    serial_batch = batch_results(df, threads=1)
    start = threading.Barrier(THREADS)

    def work(k: int):
        start.wait()  # all threads begin together
        order = list(range(len(df)))[k % len(df):] + list(range(len(df)))[:k % len(df)]
        # each thread interleaves batch calls (with and without worker threads) and scalar calls
        b1 = batch_results(df, threads=1 + k % 2)
        sc = scalar_results(df, order)
        b2 = batch_results(df, threads=0)
        return b1, sc, b2

    with ThreadPoolExecutor(max_workers=THREADS) as pool:
        results = list(pool.map(work, range(THREADS)))

    assert len(results) == THREADS
    for b1, sc, b2 in results:
        for got in (b1, b2):
            for x, y in zip(got, serial_batch):
                assert same_bits(x, y)
        assert sc.keys() == serial_scalar.keys()
        for i, values in sc.items():
            for x, y in zip(values, serial_scalar[i]):
                assert same_bits(x, y), (i, x, y)
    # and the batch equals the scalar path, row by row
    for i in range(len(df)):
        assert same_bits(serial_batch[0][i], serial_scalar[i][0])
        assert same_bits(serial_batch[1][i], serial_scalar[i][1])
