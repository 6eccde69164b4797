"""Benchmark: 1,000,000-trial probabilistic oil in place with six rank-correlated inputs.

stocktank.probabilistic_in_place against the same algorithm written with numpy/scipy in this
file (inversion or numpy-generator sampling, Iman-Conover 1982 re-pairing with van der
Waerden scores, P90/P50/P10, the inputs' percentiles for a tornado, Spearman on 200,000
trials). The two sides alternate in one process; the printed figure is the median of the
per-round ratios (numpy time / stocktank time), because this machine drifts between a fast
and a ~2x slower state.

Usage: python benches/bench_volumetrics.py [trials] [rounds]
"""

import os
import sys
import time

import numpy as np
from scipy import special, stats

import stocktank as st
from stocktank import Distribution as D

C_OIL = 43560.0 / (42 * 231 / 1728)
CORR = {
    ("porosity", "sw"): -0.6,
    ("area", "thickness"): 0.4,
    ("net_to_gross", "porosity"): 0.5,
    ("thickness", "net_to_gross"): 0.3,
    ("sw", "fvf"): 0.2,
    ("area", "fvf"): -0.1,
}
NAMES = ["area", "thickness", "net_to_gross", "porosity", "sw", "fvf"]


def stocktank_run(n, seed):
    r = st.probabilistic_in_place(
        "oil",
        area=D.triangular(800, 1000, 1500),
        thickness=D.pert(20, 35, 60),
        net_to_gross=D.uniform(0.6, 0.9),
        porosity=D.normal(0.2, 0.03, low=0.05, high=0.35),
        sw=D.normal(0.3, 0.05, low=0.1, high=0.6),
        fvf=D.lognormal(mean=1.3, sd=0.05),
        correlation=CORR,
        trials=n,
        seed=seed,
    )
    return r["summary"]["p50"]


def truncnorm(rng, n, m, s, lo, hi):
    a, b = special.ndtr((lo - m) / s), special.ndtr((hi - m) / s)
    return m + s * special.ndtri(a + (b - a) * rng.random(n))


def numpy_run(n, seed):
    rng = np.random.default_rng(seed)
    s2 = np.log(1 + (0.05 / 1.3) ** 2)
    cols = [
        rng.triangular(800, 1000, 1500, n),
        20 + 40 * rng.beta(1 + 4 * 15 / 40, 1 + 4 * 25 / 40, n),
        rng.uniform(0.6, 0.9, n),
        truncnorm(rng, n, 0.2, 0.03, 0.05, 0.35),
        truncnorm(rng, n, 0.3, 0.05, 0.1, 0.6),
        rng.lognormal(np.log(1.3) - s2 / 2, np.sqrt(s2), n),
    ]
    k = len(cols)
    c = np.eye(k)
    for (a, b), r in CORR.items():
        i, j = NAMES.index(a), NAMES.index(b)
        c[i, j] = c[j, i] = r
    c = 2 * np.sin(np.pi * c / 6)
    scores = special.ndtri(np.arange(1, n + 1) / (n + 1))
    scores /= scores.std()
    s = np.column_stack([rng.permutation(scores) for _ in range(k)])
    t = np.corrcoef(s, rowvar=False)
    m = np.linalg.cholesky(c) @ np.linalg.inv(np.linalg.cholesky(t))
    s = s @ m.T
    x = np.empty((n, k))
    for j in range(k):
        x[np.argsort(s[:, j]), j] = np.sort(cols[j])
    vol = C_OIL * x[:, 0] * x[:, 1] * x[:, 2] * x[:, 3] * (1 - x[:, 4]) / x[:, 5]
    p = np.percentile(vol, [10, 50, 90])
    _ = vol.mean(), vol.std(ddof=1)
    _ = np.percentile(x, [10, 50, 90], axis=0)
    sub = min(n, 200_000)
    _ = [stats.spearmanr(x[:sub, j], vol[:sub]).statistic for j in range(k)]
    return p[1]


def main():
    n = int(sys.argv[1]) if len(sys.argv) > 1 else 1_000_000
    rounds = int(sys.argv[2]) if len(sys.argv) > 2 else 7
    threads = os.environ.get("RAYON_NUM_THREADS", "all")
    print(f"load average (1 min) at start {os.getloadavg()[0]:.2f}; stocktank threads: {threads} of {os.cpu_count()} cores")
    stocktank_run(1000, 0)
    numpy_run(1000, 0)
    ratios, ts, tn = [], [], []
    for r in range(rounds):
        sides = [("stocktank", stocktank_run), ("numpy", numpy_run)]
        if r % 2:
            sides.reverse()
        t = {}
        for name, f in sides:
            t0 = time.perf_counter()
            f(n, r)
            t[name] = time.perf_counter() - t0
        ts.append(t["stocktank"])
        tn.append(t["numpy"])
        ratios.append(t["numpy"] / t["stocktank"])
        print(f"round {r}: stocktank {t['stocktank']:.3f} s, numpy {t['numpy']:.3f} s, ratio {ratios[-1]:.2f}x")
    print(
        f"{n:,} trials, six correlated inputs: stocktank median {np.median(ts):.3f} s, "
        f"numpy median {np.median(tn):.3f} s, median ratio {np.median(ratios):.2f}x (target >= 5x, < 1 s)"
    )
    print(f"load average (1 min) at end {os.getloadavg()[0]:.2f}")


if __name__ == "__main__":
    main()
