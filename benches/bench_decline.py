"""Benchmark: fitting 2,000 synthetic wells with stocktank vs a per-well scipy curve_fit loop.

Synthetic wells (an invented set, generated here): 60-240 months, Arps parameters drawn at
random, 10 % log-normal noise, about 5 % missing months (NaN) and 3 % shut-in months (0).

Baseline: what a careful user writes by hand -- for each well drop NaN and zero months, start
at the peak, and call ``scipy.optimize.curve_fit`` on the Arps rate with bounds on di and b.
stocktank: one ``fit_wells`` call over the long-format arrays (all cores, GIL released),
``n_bootstrap=0`` so both sides do the same work (no EUR range).

The wells are split into rounds; in each round both sides fit the same wells, in alternating
order (the machine drifts between a fast and a ~2x slower state), and the ratio of the two
times is taken per round. The median of the ratios is quoted. Recovery: fraction of wells
whose b, di and EUR (both evaluated from the fit origin with the same economic limit and
horizon) lie within 10 % / 20 % of the truth.

Usage: python benches/bench_decline.py [--wells 2000] [--rounds 5]
"""

import argparse
import os
import time

import numpy as np
from scipy.optimize import curve_fit

import stocktank as st

YEAR = 365.25
MONTH = YEAR / 12.0
Q_LIMIT = 1.0
HORIZON_DAYS = 50 * YEAR


def generate(n, seed=2024):
    rng = np.random.default_rng(seed)
    wells, times, rates, truth = [], [], [], []
    for w in range(n):
        m = int(rng.integers(60, 241))
        qi, di, b = rng.uniform(100, 2000), rng.uniform(0.3, 3.0), rng.uniform(0.2, 1.5)
        t = np.arange(m) * MONTH
        q = st.arps_rate(qi, di, b, t) * np.exp(rng.normal(0.0, 0.1, m))
        q[rng.random(m) < 0.05] = np.nan
        q[rng.random(m) < 0.03] = 0.0
        wells.append(np.full(m, w))
        times.append(t)
        rates.append(q)
        truth.append((qi, di, b))
    return np.concatenate(wells), np.concatenate(times), np.concatenate(rates), np.array(truth)


def arps(t, qi, di, b):
    return qi / (1.0 + b * di * t / YEAR) ** (1.0 / b)


def scipy_loop(well, t, q, wells):
    """Per-well curve_fit; returns (qi, di, b, t0) per well (NaN when it fails)."""
    out = np.full((len(wells), 4), np.nan)
    for k, w in enumerate(wells):
        sel = well == w
        tt, qq = t[sel], q[sel]
        ok = np.isfinite(qq) & (qq > 0)
        tt, qq = tt[ok], qq[ok]
        p = int(np.argmax(qq))
        tt, qq = tt[p:] - tt[p], qq[p:]
        try:
            popt, _ = curve_fit(
                arps, tt, qq, p0=[qq[0], 1.0, 0.5], bounds=([0.0, 1e-3, 1e-3], [np.inf, 50.0, 2.0]), maxfev=5000
            )
            out[k, :3] = popt
        except RuntimeError:
            pass
        out[k, 3] = t[sel][ok][p]
    return out


def recovery(params, t0, truth):
    """Fractions within 10 % / 20 % for b, di and EUR from the fit origin t0."""
    qi, di, b = truth.T
    # the truth seen from the fit origin t0 (the peak month)
    di_t0 = di / (1.0 + b * di * t0 / YEAR)
    qi_t0 = st.arps_rate(qi, di, b, t0)
    eur_true = st.arps_eur(qi_t0, di_t0, b, Q_LIMIT, t_max=HORIZON_DAYS)
    ok = np.all(np.isfinite(params), axis=1)
    eur_fit = np.full(len(qi), np.nan)
    eur_fit[ok] = st.arps_eur(params[ok, 0], params[ok, 1], params[ok, 2], Q_LIMIT, t_max=HORIZON_DAYS)
    res = {}
    for name, got, ref in (("b", params[:, 2], b), ("di", params[:, 1], di_t0), ("eur", eur_fit, eur_true)):
        rel = np.abs(got / ref - 1.0)
        rel[~np.isfinite(rel)] = np.inf
        res[name] = ((rel < 0.1).mean(), (rel < 0.2).mean())
    return res


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--wells", type=int, default=2000)
    ap.add_argument("--rounds", type=int, default=5)
    args = ap.parse_args()
    well, t, q, truth = generate(args.wells)
    print(f"{args.wells} wells, {len(t)} records; cores {os.cpu_count()}, load average {os.getloadavg()}")
    # warm up both sides
    st.fit_wells(well[:2000], t[:2000], q[:2000], n_bootstrap=0)
    scipy_loop(well, t, q, np.arange(2))

    chunks = np.array_split(np.arange(args.wells), args.rounds)
    ours = np.full((args.wells, 4), np.nan)
    theirs = np.full((args.wells, 4), np.nan)
    ratios, t_ours, t_theirs = [], 0.0, 0.0
    for r, ch in enumerate(chunks):
        sel = (well >= ch[0]) & (well <= ch[-1])
        wsel, tsel, qsel = well[sel], t[sel], q[sel]

        def run_ours():
            res = st.fit_wells(wsel, tsel, qsel, n_bootstrap=0, q_limit=Q_LIMIT)
            ours[ch] = np.column_stack([res["qi"], res["di"], res["b"], res["t0"]])

        def run_theirs():
            theirs[ch] = scipy_loop(wsel, tsel, qsel, ch)

        sides = [run_ours, run_theirs] if r % 2 == 0 else [run_theirs, run_ours]
        times = {}
        for f in sides:
            s = time.perf_counter()
            f()
            times[f.__name__] = time.perf_counter() - s
        ratio = times["run_theirs"] / times["run_ours"]
        ratios.append(ratio)
        t_ours += times["run_ours"]
        t_theirs += times["run_theirs"]
        print(
            f"round {r}: {len(ch)} wells  stocktank {times['run_ours'] * 1e3:8.1f} ms   "
            f"curve_fit loop {times['run_theirs'] * 1e3:9.1f} ms   ratio {ratio:7.1f}"
        )
    print(f"total: stocktank {t_ours:.3f} s, curve_fit loop {t_theirs:.3f} s")
    print(f"median ratio (curve_fit time / stocktank time): {np.median(ratios):.1f}x  (target >= 100x)")
    for name, params in (("stocktank", ours), ("curve_fit", theirs)):
        rec = recovery(params[:, :3], params[:, 3], truth)
        txt = "  ".join(f"{k} {v[0]:.1%} / {v[1]:.1%}" for k, v in rec.items())
        print(f"recovery within 10 % / 20 %  {name:9s}: {txt}")
    s = time.perf_counter()
    st.fit_wells(well, t, q, n_bootstrap=100)
    print(f"for information: stocktank with a 100-refit EUR bootstrap, all wells: {time.perf_counter() - s:.2f} s")


if __name__ == "__main__":
    main()
