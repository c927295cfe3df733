"""The Dask helpers give the same numbers as the local batch, on a two-worker cluster."""
from __future__ import annotations

import warnings

import numpy as np
import pandas as pd
import pytest

import colligate as cg

import dask.dataframe as dd  # noqa: E402
from distributed import Client, LocalCluster  # noqa: E402

from colligate.dask import freezing_points, ice_fractions, water_activities  # noqa: E402


@pytest.fixture(scope="module")
def client():
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        cluster = LocalCluster(n_workers=2, threads_per_worker=1, processes=True,
                               dashboard_address=None, host="127.0.0.1")
        c = Client(cluster)
    yield c
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        c.close()
        cluster.close()


def test_dask_sweep_matches_local_batch(client):
    rng = np.random.default_rng(11)
    df = pd.DataFrame(rng.uniform(0, 0.05, (4000, 3)), columns=["sucrose", "glucose", "glycerol"],
                      index=pd.RangeIndex(1000, 5000, name="candidate"))
    ddf = dd.from_pandas(df, npartitions=8)
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        remote_tf = client.compute(freezing_points(ddf, threads=1)).result()
        remote_aw = client.compute(water_activities(ddf, 298.15)).result()
        remote_ice = client.compute(ice_fractions(ddf, [263.15, 255.15])).result()
        local = cg.SolutionBatch.from_mass_fractions(df)
        local_tf = cg.batch_freezing_point(local)  # same arguments and defaults as the Dask path
        local_aw = cg.batch_water_activity(local, 298.15)
        local_ice = cg.batch_ice_fraction(local, [263.15, 255.15])
    pd.testing.assert_series_equal(remote_tf.sort_index(), local_tf, check_exact=True)
    pd.testing.assert_series_equal(remote_aw.sort_index(), local_aw, check_exact=True)
    pd.testing.assert_frame_equal(remote_ice.sort_index(), local_ice, check_exact=True)
