"""Benchmark: fit 1,000,000 synthetic wells through the Dask path with bounded memory.

An invented set of wells is generated lazily, partition by partition, on the workers
(``dask.dataframe.from_map``; each partition holds whole wells, 60-240 months each, 10 % noise,
missing and shut-in months), fitted by ``stocktank.decline.fit_production_dask`` with
``partitioned_by_well=True`` (the data arrive grouped by well, as from files written per group
of wells; a shuffle of ~150 million rows is not what this path is for) and written to
Parquet one partition at a time, so no process ever holds more than a few partitions.

It runs on a ``distributed.LocalCluster`` with worker processes (one thread each, and one
rayon thread each so that the cores are not oversubscribed) and prints wells per second, the
peak resident memory of every worker and of the client, and the status counts.

Usage: python benches/bench_decline_dask.py [--wells 1000000] [--per-partition 5000] [--workers 2]
"""

import argparse
import os
import resource
import shutil
import tempfile
import time

os.environ.setdefault("RAYON_NUM_THREADS", "1")  # inherited by the worker processes

import numpy as np  # noqa: E402
import pandas as pd  # noqa: E402

YEAR = 365.25
MONTH = YEAR / 12.0


def make_partition(spec):
    """Whole wells of one partition, generated from the partition number (no data shipped)."""
    import stocktank as st

    part, n = spec
    rng = np.random.default_rng(1_000_003 * part + 17)
    months = rng.integers(60, 241, n)
    qi, di, b = rng.uniform(100, 2000, n), rng.uniform(0.3, 3.0, n), rng.uniform(0.2, 1.5, n)
    idx = np.repeat(np.arange(n), months)
    start = np.repeat(np.cumsum(months) - months, months)
    m = np.arange(len(idx)) - start
    q = st.arps_rate(qi[idx], di[idx], b[idx], m * MONTH) * np.exp(rng.normal(0.0, 0.1, len(idx)))
    q[rng.random(len(idx)) < 0.05] = np.nan
    q[rng.random(len(idx)) < 0.03] = 0.0
    return pd.DataFrame({"well": idx.astype(np.int64) + part * n, "time": m.astype(np.float64), "oil": q})


def peak_rss_mb():
    return resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024.0


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--wells", type=int, default=1_000_000)
    ap.add_argument("--per-partition", type=int, default=5_000)
    ap.add_argument("--workers", type=int, default=2)
    args = ap.parse_args()

    import dask.dataframe as dd
    import distributed

    from stocktank.decline import fit_production_dask

    n_parts = -(-args.wells // args.per_partition)
    specs = [(p, min(args.per_partition, args.wells - p * args.per_partition)) for p in range(n_parts)]
    out_dir = tempfile.mkdtemp(prefix="stocktank-dask-bench-")
    cluster = distributed.LocalCluster(
        n_workers=args.workers, threads_per_worker=1, processes=True, dashboard_address=None, memory_limit="3GiB"
    )
    client = distributed.Client(cluster)
    try:
        print(f"{args.wells} wells in {n_parts} partitions on {args.workers} worker processes; load {os.getloadavg()}")
        ddf = dd.from_map(make_partition, specs)
        fits = fit_production_dask(
            ddf, well="well", time="time", rates="oil", time_unit="month", partitioned_by_well=True,
            n_bootstrap=0, compute=False,
        )
        t0 = time.perf_counter()
        fits = fits.astype({"oil_status": "string", "oil_message": "string"})  # typed for Parquet
        fits.to_parquet(out_dir, write_index=True)
        elapsed = time.perf_counter() - t0
        worker_peaks = client.run(peak_rss_mb)
        res = pd.read_parquet(out_dir, columns=["oil_status", "oil_eur"])
        print(f"fitted {len(res)} wells in {elapsed:.1f} s: {len(res) / elapsed:,.0f} wells per second")
        print("peak resident memory per worker (MB):", {k.split(":")[-1]: round(v) for k, v in worker_peaks.items()})
        print(f"peak resident memory of the client (MB): {peak_rss_mb():.0f}")
        print("status counts:", res["oil_status"].value_counts().to_dict())
        print(f"total EUR of fitted wells: {res['oil_eur'].sum():.4e} STB (screening estimate)")
    finally:
        client.close()
        cluster.close()
        shutil.rmtree(out_dir, ignore_errors=True)


if __name__ == "__main__":
    main()
