"""The Dask scale-out path returns exactly the single-process result.

The test starts and stops its own ``distributed.LocalCluster`` (2 worker processes, 1 thread
each); nothing depends on global state.
"""

import numpy as np
import pandas as pd
import pytest

import stocktank as st
from stocktank import decline as dc

dd = pytest.importorskip("dask.dataframe")
distributed = pytest.importorskip("distributed")

MONTH = 365.25 / 12.0


def _production(n_wells: int, seed: int) -> pd.DataFrame:
    rng = np.random.default_rng(seed)
    parts = []
    for w in range(n_wells):
        m = int(rng.integers(24, 120))
        t = np.arange(m) * MONTH
        qi, di, b = rng.uniform(50, 900), rng.uniform(0.3, 2.5), rng.uniform(0.1, 1.4)
        q = st.arps_rate(qi, di, b, t) * np.exp(rng.normal(0, 0.1, m))
        q[rng.random(m) < 0.05] = np.nan
        q[rng.random(m) < 0.03] = 0.0
        dates = (np.datetime64("2016-01", "M") + np.arange(m).astype("timedelta64[M]")).astype("datetime64[ns]")
        parts.append(pd.DataFrame({"well": f"P{w:04d}", "date": dates, "oil": q, "water": q * rng.uniform(0.2, 2.0)}))
    # a few wells that cannot be fitted travel along
    parts.append(pd.DataFrame({"well": "Z-dry", "date": parts[0]["date"][:10], "oil": 0.0, "water": 0.0}))
    return pd.concat(parts, ignore_index=True).sample(frac=1.0, random_state=seed).reset_index(drop=True)


@pytest.fixture(scope="module")
def client():
    cluster = distributed.LocalCluster(
        n_workers=2, threads_per_worker=1, processes=True, dashboard_address=None, memory_limit="1GiB"
    )
    c = distributed.Client(cluster)
    try:
        yield c
    finally:
        c.close()
        cluster.close()


def test_dask_shuffle_path_equals_single_process(client):
    df = _production(120, seed=21)
    opts = dict(rates=("oil", "water"), n_bootstrap=30, seed=5, q_limit={"oil": 2.0, "water": 1.0})
    expected = dc.fit_production(df, **opts)
    ddf = dd.from_pandas(df, npartitions=5)  # wells are split across partitions
    got = dc.fit_production_dask(ddf, **opts)
    pd.testing.assert_frame_equal(got, expected, check_exact=True)
    assert got.loc["Z-dry", "oil_status"] == "no_production"
    # lazily: one row per well
    lazy = dc.fit_production_dask(ddf, compute=False, **opts)
    assert len(lazy.compute()) == len(expected)


def test_dask_prepartitioned_path_equals_single_process(client):
    df = _production(60, seed=22)
    wells = np.array(sorted(df["well"].unique()))
    groups = np.array_split(wells, 4)

    def load(group):
        return df[df["well"].isin(group)]

    ddf = dd.from_map(load, groups)
    got = dc.fit_production_dask(ddf, partitioned_by_well=True, n_bootstrap=10)
    expected = dc.fit_production(df, n_bootstrap=10)
    pd.testing.assert_frame_equal(got, expected, check_exact=True)
