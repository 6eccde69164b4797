"""Benchmark: history matching of an oil reservoir with a van Everdingen-Hurst aquifer.

Compares stocktank.material_balance.history_match (Rust, withdrawal objective: the
Havlena-Odeh imbalance, fitting N, m, C and tD per day) with the same model written here
in numpy and solved by scipy.optimize.least_squares, side by side in one process. The two
sides alternate; the ratio quoted is the median of per-round ratios (the machine drifts
between a fast and a slower state). Then a batch of reservoirs: stocktank's parallel
history_match_batch against the scipy model looped over a subset (per-reservoir times).
Last, the gas history match (G, C, tD per day of a vEH aquifer) against the same gas
model in numpy solved by scipy.optimize.least_squares, alternated the same way.

Usage: python benches/bench_material_balance.py [--steps 200] [--rounds 7] [--batch 1000]
                                                 [--scipy-batch 40]
"""

import argparse
import os
import statistics
import time

import numpy as np
from scipy import optimize

import stocktank as st
from stocktank import material_balance as mb

PI, PB = 3000.0, 2500.0
RES = dict(p_initial=PI, swi=0.2, cw=3e-6, cf=4e-6)


def make_pvt():
    p = np.arange(400.0, 3401.0, 100.0)
    s = np.minimum(p, PB)
    rs = 100.0 + 0.2 * s
    bo = np.where(p <= PB, 1.05 + 0.00012 * rs, (1.05 + 0.00012 * (100 + 0.2 * PB)) * np.exp(-1.2e-5 * (p - PB)))
    z = 1.0 - 6e-5 * p + 1.2e-8 * p * p
    return st.PvtTable(p=p, bo=bo, rs=rs, bg=0.00504 * z * 640.0 / p, bw=np.full(p.size, 1.02))


def history(pvt, steps, n, m, aq, seed):
    t = 30.0 * np.arange(steps + 1)
    x = np.arange(steps + 1) / steps
    p = PI - 1000.0 * (1 - np.exp(-2.5 * x)) / (1 - np.exp(-2.5))
    zero = np.zeros_like(t)
    terms = mb.oil_mbe_terms(pvt, t_days=t, p=p, np_stb=zero, gp_scf=zero, m=m, **RES)
    f = n * terms["et"] + aq.influx(t, p, p_initial=PI)
    q = pvt.at(p)
    np_ = f / (q["bo"] + (q["rs"][0] - q["rs"]) * q["bg"])
    rng = np.random.default_rng(seed)
    pn = np.minimum(p + np.r_[0, rng.normal(0, 2.0, steps)], PI)
    return dict(t_days=t, p=pn, np_stb=np_, gp_scf=np_ * q["rs"][0], wp_stb=zero)


class ScipyModel:
    """The same model in numpy: F = N (Eo + m Eg + (1+m) Efw) + C sum dp_j WD(a (t_k - t_j))."""

    def __init__(self, pvt, h):
        self.terms = mb.oil_mbe_terms(pvt, **h, **RES)
        t, p = h["t_days"], h["p"]
        self.rows = slice(1, None)
        # Pressure steps averaged over adjacent intervals (van Everdingen & Hurst 1949).
        dp = np.zeros_like(p)
        dp[0] = 0.5 * (p[0] - p[1])
        dp[1:-1] = 0.5 * (p[:-2] - p[2:])
        self.dp = dp
        lag = t[:, None] - t[None, :]
        self.mask = lag > 0
        self.lag = np.where(self.mask, lag, 1.0)
        # WD table in log-log from stocktank's own inversion (shared kernel; the solver,
        # the superposition and the least squares are what is compared).
        self.ltd = np.linspace(np.log(1e-3), np.log(1e8), 221)
        self.lwd = np.log(st.veh_dimensionless_influx(np.exp(self.ltd)))
        self.f = self.terms["f"]
        self.eo, self.eg, self.efw = self.terms["eo"], self.terms["eg"], self.terms["efw"]
        self.scale = np.abs(self.f).max()

    def we_unit(self, a):
        wd = np.exp(np.interp(np.log(a * self.lag), self.ltd, self.lwd))
        return (np.where(self.mask, wd, 0.0) * self.dp[None, :]).sum(axis=1)

    def resid(self, x):
        n, m, c, a = np.exp(x[0]), x[1], np.exp(x[2]), np.exp(x[3])
        et = self.eo + m * self.eg + (1 + m) * self.efw
        return ((self.f - n * et - c * self.we_unit(a)) / self.scale)[self.rows]

    def solve(self, x0):
        return optimize.least_squares(self.resid, x0, method="lm", xtol=1e-10, ftol=1e-10)


PI_GAS, TF_GAS = 5000.0, 200.0


def z_gas(p):
    return 1.0 - 6e-5 * p + 1.2e-8 * p * p


def gas_history(steps, g, aq, seed):
    t = 30.0 * np.arange(steps + 1)
    p = PI_GAS - 2000.0 * (1 - np.exp(-t / (10.0 * steps)))
    bg = st.gas_bg(p, z_gas(p), temperature_f=TF_GAS)
    gp = (g * (bg - bg[0]) + aq.influx(t, p, p_initial=PI_GAS)) / bg
    rng = np.random.default_rng(seed)
    pn = np.minimum(p + np.r_[0, rng.normal(0, 2.0, steps)], PI_GAS)
    return dict(t_days=t, p=pn, gp_scf=gp)


class GasScipyModel(ScipyModel):
    """The gas balance F = Gp Bg = G (Bg - Bgi) + C sum dp_j WD(a (t_k - t_j)) in numpy."""

    def __init__(self, h):
        t, p = h["t_days"], h["p"]
        bg = st.gas_bg(p, z_gas(p), temperature_f=TF_GAS)
        bgi = st.gas_bg(PI_GAS, z_gas(PI_GAS), temperature_f=TF_GAS)
        self.rows = slice(1, None)
        dp = np.zeros_like(p)
        dp[0] = 0.5 * (PI_GAS - p[1]) if p[0] == PI_GAS else 0.5 * (p[0] - p[1])
        dp[1:-1] = 0.5 * (p[:-2] - p[2:])
        self.dp = dp
        lag = t[:, None] - t[None, :]
        self.mask = lag > 0
        self.lag = np.where(self.mask, lag, 1.0)
        self.ltd = np.linspace(np.log(1e-3), np.log(1e8), 221)
        self.lwd = np.log(st.veh_dimensionless_influx(np.exp(self.ltd)))
        self.f = h["gp_scf"] * bg
        self.eg = bg - bgi
        self.scale = np.abs(self.f).max()

    def resid(self, x):
        g, c, a = np.exp(x)
        return ((self.f - g * self.eg - c * self.we_unit(a)) / self.scale)[self.rows]


def gas_section(steps, rounds):
    truth = st.Aquifer(model="veh", constant=600.0, td_per_day=0.05)
    h = gas_history(steps, 8e10, truth, 3)
    start = st.Aquifer(model="veh", constant=1.0, td_per_day=0.5)
    tp = np.arange(1000.0, 5001.0, 50.0)
    table = dict(table_p=tp, table_z=z_gas(tp), temperature_f=TF_GAS)
    model = GasScipyModel(h)
    x0 = np.log([5e10, 100.0, 0.5])

    def ours(objective="withdrawal"):
        return mb.gas_history_match(**h, p_initial=PI_GAS, aquifer=start, objective=objective, **table)

    def theirs():
        return model.solve(x0)

    r, s = ours(), theirs()
    print(f"gas: {steps} pressure steps, vEH infinite aquifer, G, C, tD/day fitted")
    print(f"  stocktank  G = {r['g']:.6e} scf, C = {r['aquifer'].constant:.2f}, tD/day = {r['aquifer'].td_per_day:.5f} "
          f"({r['iterations']} iterations, {r['status']})")
    print(f"  scipy      G = {np.exp(s.x[0]):.6e} scf, C = {np.exp(s.x[1]):.2f}, tD/day = {np.exp(s.x[2]):.5f} "
          f"({s.nfev} evaluations, status {s.status})")
    ratios, t_o, t_t, t_p = [], [], [], []
    for _ in range(rounds):
        a = time.perf_counter(); ours(); b = time.perf_counter()
        theirs(); c = time.perf_counter()
        ours("pressure"); d = time.perf_counter()
        t_o.append(b - a); t_t.append(c - b); t_p.append(d - c)
        ratios.append((c - b) / (b - a))
    print(f"  stocktank (withdrawal) {1e3 * statistics.median(t_o):.2f} ms, scipy.least_squares "
          f"{1e3 * statistics.median(t_t):.2f} ms, median ratio scipy/stocktank = {statistics.median(ratios):.1f}x")
    print(f"  stocktank pressure objective: {1e3 * statistics.median(t_p):.2f} ms")


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--steps", type=int, default=200)
    ap.add_argument("--rounds", type=int, default=7)
    ap.add_argument("--batch", type=int, default=1000)
    ap.add_argument("--scipy-batch", type=int, default=40)
    args = ap.parse_args()
    pvt = make_pvt()
    truth = st.Aquifer(model="veh", constant=250.0, td_per_day=0.8)
    h = history(pvt, args.steps, 4e7, 0.25, truth, 1)
    start = st.Aquifer(model="veh", constant=1.0, td_per_day=0.2)
    model = ScipyModel(pvt, h)
    x0 = np.log([3e7, 1.0, 100.0, 0.2])
    x0[1] = 0.1

    def ours():
        return mb.history_match(pvt, **h, **RES, m=None, aquifer=start, objective="withdrawal")

    def ours_p():
        return mb.history_match(pvt, **h, **RES, m=None, aquifer=start, objective="pressure")

    def theirs():
        return model.solve(x0)

    r_ours, r_theirs = ours(), theirs()
    print(f"machine: {os.cpu_count()} cores; {args.steps} pressure steps, vEH infinite aquifer, N, m, C, tD/day fitted")
    print(f"  stocktank  N = {r_ours['n']:.6e} STB, m = {r_ours['m']:.4f}, C = {r_ours['aquifer'].constant:.2f}, "
          f"tD/day = {r_ours['aquifer'].td_per_day:.4f}  ({r_ours['iterations']} iterations, {r_ours['status']})")
    xs = r_theirs.x
    print(f"  scipy      N = {np.exp(xs[0]):.6e} STB, m = {xs[1]:.4f}, C = {np.exp(xs[2]):.2f}, "
          f"tD/day = {np.exp(xs[3]):.4f}  ({r_theirs.nfev} evaluations, status {r_theirs.status})")
    ratios, t_o, t_t, t_p = [], [], [], []
    for _ in range(args.rounds):
        a = time.perf_counter(); ours(); b = time.perf_counter()
        theirs(); c = time.perf_counter()
        ours_p(); d = time.perf_counter()
        t_o.append(b - a); t_t.append(c - b); t_p.append(d - c)
        ratios.append((c - b) / (b - a))
    print(f"single reservoir: stocktank (withdrawal) {1e3 * statistics.median(t_o):.2f} ms, "
          f"scipy.least_squares {1e3 * statistics.median(t_t):.2f} ms, "
          f"median ratio scipy/stocktank = {statistics.median(ratios):.1f}x")
    print(f"  stocktank pressure objective (row-by-row pressure solve): {1e3 * statistics.median(t_p):.2f} ms")

    gas_section(args.steps, args.rounds)

    # Batch.
    n_b = args.batch
    ns = np.random.default_rng(5).uniform(1e7, 8e7, n_b)
    hs = [history(pvt, args.steps, n, 0.25, truth, i) for i, n in enumerate(ns)]
    kw = dict(p_initial=[PI] * n_b, swi=[0.2] * n_b, cw=[3e-6] * n_b, cf=[4e-6] * n_b)
    a = time.perf_counter()
    out = mb.history_match_batch([pvt] * n_b, hs, **kw, m=None, aquifer=start, objective="withdrawal")
    t_batch = time.perf_counter() - a
    err = np.abs(np.array([o["n"] for o in out]) / ns - 1)
    k = min(args.scipy_batch, n_b)
    a = time.perf_counter()
    for hh in hs[:k]:
        ScipyModel(pvt, hh).solve(x0)
    t_sc = (time.perf_counter() - a) / k
    print(f"batch of {n_b}: stocktank parallel {t_batch:.2f} s ({1e3 * t_batch / n_b:.2f} ms per reservoir), "
          f"median |N error| {np.median(err):.2e}; scipy sequential {1e3 * t_sc:.1f} ms per reservoir "
          f"(over {k}) -> ratio {t_sc / (t_batch / n_b):.1f}x")


if __name__ == "__main__":
    main()
