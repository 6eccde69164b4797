"""Benchmark: formation-water properties for many (p, T, salinity) points, stocktank (Rust,
parallel above a threshold) against a numpy-vectorised implementation of the same
correlations written here.

Correlations: Bw and density by McCain (1990), Rsw by McCain (1991), compressibility by
Osif (1988) with the Dodson and Standing (1944) factor, viscosity by Meehan (1980).

The two sides run alternately in one process; the script prints the median of the per-round
ratios (numpy time / stocktank time) for one core (RAYON_NUM_THREADS=1 in a child process)
and for all cores, and the largest relative difference between the two results.

Usage: python benches/bench_water.py [--points 1000000] [--rounds 7]
"""

import argparse
import os
import statistics
import subprocess
import sys
import time

import numpy as np

import stocktank as stk

G_PER_L_PER_LBM_FT3 = 0.45359237 / 0.3048**3  # lbm/ft3 -> kg/m3, which is g/L (NIST SP 811)


def numpy_water(p, t, s, p_sc=14.696, t_sc=60.0):
    """The same correlations with numpy, whole arrays at a time."""

    def bw_raw(p, t):
        dvt = -1.0001e-2 + 1.33391e-4 * t + 5.50654e-7 * t * t
        dvp = -1.95301e-9 * p * t - 1.72834e-13 * p * p * t - 3.58922e-7 * p - 2.25341e-10 * p * p
        return (1 + dvt) * (1 + dvp)

    b = bw_raw(p, t)
    bw = b / bw_raw(p_sc, t_sc)
    rho_sc = 62.368 + 0.438603 * s + 1.60074e-3 * s * s
    rho = rho_sc / b
    a = 8.15839 - 6.12265e-2 * t + 1.91663e-4 * t**2 - 2.1654e-7 * t**3
    bb = 1.01021e-2 - 7.44241e-5 * t + 3.05553e-7 * t**2 - 2.94883e-10 * t**3
    c = -1e-7 * (9.02505 - 0.130237 * t + 8.53425e-4 * t**2 - 2.34122e-6 * t**3 + 2.37049e-9 * t**4)
    rsw = np.maximum((a + bb * p + c * p * p) * 10 ** (-0.0840655 * s * t**-0.285854), 0.0)
    c_mg_l = 10.0 * s * rho_sc * G_PER_L_PER_LBM_FT3
    cw = 1.0 / (7.033 * p + 0.5415 * c_mg_l - 537.0 * t + 403300.0) * (1 + 8.9e-3 * rsw)
    am = -0.04518 + 0.009313 * s - 0.000393 * s * s
    bm = 70.634 + 0.09576 * s * s
    mu = (am + bm / t) * (1 + 3.5e-12 * p * p * (t - 40.0))
    return bw, rho, rsw, cw, mu


def stocktank_water(p, t, s):
    return (
        stk.water_bw(p, t),
        stk.water_density(p, t, s),
        stk.water_rsw(p, t, s),
        stk.water_compressibility(p, t, s, gas_saturated=True),
        stk.water_viscosity(p, t, s),
    )


def run(points: int, rounds: int) -> None:
    rng = np.random.default_rng(7)
    p = rng.uniform(1000.0, 9000.0, points)
    t = rng.uniform(100.0, 300.0, points)
    s = rng.uniform(0.0, 25.0, points)
    a, b = numpy_water(p, t, s), stocktank_water(p, t, s)
    worst = max(float(np.max(np.abs(x / y - 1.0))) for x, y in zip(a, b))
    ratios = []
    for _ in range(rounds):
        t0 = time.perf_counter()
        numpy_water(p, t, s)
        t1 = time.perf_counter()
        stocktank_water(p, t, s)
        t2 = time.perf_counter()
        ratios.append((t1 - t0) / (t2 - t1))
    threads = os.environ.get("RAYON_NUM_THREADS", str(os.cpu_count()))
    print(
        f"{points:>9} points, {threads} thread(s): numpy/stocktank median ratio "
        f"{statistics.median(ratios):6.2f} (rounds: {', '.join(f'{r:.2f}' for r in ratios)}); "
        f"max relative difference {worst:.1e}"
    )


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--points", type=int, default=1_000_000)
    ap.add_argument("--rounds", type=int, default=7)
    ap.add_argument("--child", action="store_true", help=argparse.SUPPRESS)
    args = ap.parse_args()
    if args.child:
        run(args.points, args.rounds)
        return
    env = dict(os.environ, RAYON_NUM_THREADS="1")
    cmd = [sys.executable, __file__, "--child", "--points", str(args.points), "--rounds", str(args.rounds)]
    subprocess.run(cmd, env=env, check=True)
    run(args.points, args.rounds)


if __name__ == "__main__":
    main()
