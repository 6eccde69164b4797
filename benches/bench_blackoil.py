"""Benchmark: black-oil tables for many wells, stocktank (Rust, parallel) against a
numpy-vectorised implementation of the same default correlations written here.

Default set: Standing (1947) Pb/Rs and Bo, Vasquez–Beggs (1980) co and undersaturated Bo and
viscosity, Beggs–Robinson (1975) viscosity, apparent co below Pb from closed-form derivatives, gas
Z by Dranchuk–Abou-Kassem (1975) with Sutton (1985) pseudo-criticals, gas viscosity by
Lee–Gonzalez–Eakin (1966), water Bw by McCain (1990) and viscosity by Meehan (1980).

The sides run in rotating order in one process: numpy, stocktank on one thread
(``stocktank.num_threads(1)``) and stocktank on all cores. The script prints the medians of
the per-round ratios (numpy time / stocktank time, and one thread / all cores), the ratio
against the numpy code called once per well, and the largest relative difference between
the two results. Two more sides in the rotation time a floor under any build on one core:
stocktank's Z solver alone on the tables' points, and writing a fresh result block.

Usage: python benches/bench_blackoil.py [--wells 10000] [--points 50] [--rounds 5]
"""

import argparse
import os
import statistics
import time

import numpy as np

import stocktank as st
import stocktank.oil as so

R = 10.731577089016  # psia ft3 / (lbmol degR), CODATA 2018 via NIST SP 811 (as the crate)
M_AIR = 28.9647
RHO_W = 999.016 / 0.45359237 * 0.3048**3
FT3_PER_BBL = 5.614583333333333
P_SC, T_SC = 14.696, 60.0


def dak_z(ppr, tpr, iters=60):
    a = [0.3265, -1.0700, -0.5339, 0.01569, -0.05165, 0.5475, -0.7361, 0.1844, 0.1056, 0.6134, 0.7210]
    t1 = a[0] + a[1] / tpr + a[2] / tpr**3 + a[3] / tpr**4 + a[4] / tpr**5
    t2 = a[5] + a[6] / tpr + a[7] / tpr**2
    t3 = a[8] * (a[6] / tpr + a[7] / tpr**2)
    t4 = a[9] / tpr**3
    c = 0.27 * ppr / tpr
    rho = c.copy()
    for _ in range(iters):
        r2 = rho * rho
        e = np.exp(-a[10] * r2)
        f = (1 + t1 * rho + t2 * r2 - t3 * r2 * r2 * rho + t4 * r2 * (1 + a[10] * r2) * e) * rho - c
        df = (
            1
            + 2 * t1 * rho
            + 3 * t2 * r2
            - 6 * t3 * r2 * r2 * rho
            + t4 * r2 * e * (3 + 3 * a[10] * r2 - 2 * a[10] ** 2 * r2 * r2)
        )
        step = f / df
        rho = rho - step
        if np.max(np.abs(step)) < 1e-13:
            break
    return c / rho


def numpy_tables(p_grid, api, g, t, gor):
    n = api.size
    sg = 141.5 / (api + 131.5)
    a = 0.00091 * t - 0.0125 * api
    pb = 18.2 * ((gor / g) ** 0.83 * 10**a - 1.4)
    p = np.sort(np.concatenate([np.broadcast_to(p_grid, (n, p_grid.size)), pb[:, None]], axis=1), axis=1)
    col = lambda x: x[:, None]  # noqa: E731
    below = p < col(pb)

    def rs_sat(q):
        return col(g) * ((q / 18.2 + 1.4) * 10 ** (-col(a))) ** (1 / 0.83)

    def bo_sat_of_rs(rs):
        return 0.9759 + 0.00012 * (rs * np.sqrt(col(g) / col(sg)) + 1.25 * col(t)) ** 1.2

    rs = np.where(below, np.minimum(rs_sat(p), col(gor)), col(gor))
    bob = bo_sat_of_rs(col(gor))
    acoef = (-1433 + 5 * gor + 17.2 * t - 1180 * g + 12.61 * api) * 1e-5
    bo = np.where(below, bo_sat_of_rs(rs), bob * np.exp(-col(acoef) * np.log(p / col(pb))))
    # gas
    tpc = 169.2 + 349.5 * g - 74.0 * g * g
    ppc = 756.8 - 131.0 * g - 3.6 * g * g
    tr = t + 459.67
    z = dak_z(p / col(ppc), col(tr / tpc))
    bg = P_SC / (T_SC + 459.67) * z * col(tr) / p
    mg = M_AIR * g
    rho_g = p * col(mg) / (z * R * col(tr))
    kk = (9.4 + 0.02 * mg) * tr**1.5 / (209 + 19 * mg + tr)
    xx = 3.5 + 986 / tr + 0.01 * mg
    yy = 2.4 - 0.2 * xx
    mu_g = 1e-4 * col(kk) * np.exp(col(xx) * (rho_g / 62.4279606) ** col(yy))
    bg_rb = bg / FT3_PER_BBL
    # apparent co below Pb with closed-form derivatives along the saturated curve
    drs = rs_sat(p) / (0.83 * (p + 18.2 * 1.4))
    r = np.sqrt(col(g) / col(sg))
    dbo = 0.00012 * 1.2 * (rs * r + 1.25 * col(t)) ** 0.2 * r * drs
    co = np.where(below, (-dbo + bg_rb * drs) / bo, col(acoef) / p)
    rho_air = M_AIR * P_SC / (R * (T_SC + 459.67))
    rho_o = (RHO_W * col(sg) + rs * col(g) * rho_air / FT3_PER_BBL) / bo
    mu_od = 10 ** (t**-1.163 * 10 ** (3.0324 - 0.02023 * api)) - 1  # Beggs–Robinson (1975), published constants

    def live(rs_):
        return 10.715 * (rs_ + 100) ** -0.515 * col(mu_od) ** (5.44 * (rs_ + 150) ** -0.338)

    mu_ob = live(col(gor))
    m = 2.6 * p**1.187 * np.exp(-11.513 - 8.98e-5 * p)
    mu_o = np.where(below, live(rs), mu_ob * (p / col(pb)) ** m)

    def bw_raw(q, tt):
        dvt = -1.0001e-2 + 1.33391e-4 * tt + 5.50654e-7 * tt * tt
        dvp = -1.95301e-9 * q * tt - 1.72834e-13 * q * q * tt - 3.58922e-7 * q - 2.25341e-10 * q * q
        return (1 + dvt) * (1 + dvp)

    bw = bw_raw(p, col(t)) / bw_raw(P_SC, T_SC)
    mu_w = (-0.04518 + 70.634 / col(t)) * (1 + 3.5e-12 * p * p * (col(t) - 40))
    bt = bo + bg_rb * (col(gor) - rs)
    return {"p": p, "rs": rs, "bo": bo, "co": co, "oil_density": rho_o, "oil_viscosity": mu_o, "bg": bg,
            "z": z, "gas_viscosity": mu_g, "gas_density": rho_g, "bw": bw, "water_viscosity": mu_w, "bt": bt}


def rust_tables(p_grid, api, g, t, gor):
    return so.black_oil_tables_arrays(p_grid, api, g, t, gor=gor)


def inputs(n, points, seed=1):
    rng = np.random.default_rng(seed)
    api = rng.uniform(25.0, 45.0, n)
    g = rng.uniform(0.65, 0.9, n)
    t = rng.uniform(120.0, 240.0, n)
    gor = rng.uniform(200.0, 1000.0, n)
    p_grid = np.linspace(100.0, 6000.0, points - 1)  # + Pb = `points` rows per table
    return p_grid, api, g, t, gor


def numpy_per_table(p_grid, api, g, t, gor):
    """The same numpy code called once per well (vectorised over the pressures only), as a
    per-well script would run it."""
    return [numpy_tables(p_grid, api[k : k + 1], g[k : k + 1], t[k : k + 1], gor[k : k + 1]) for k in range(api.size)]


def z_points(p_grid, api, g, t, gor):
    """The (Ppr, Tpr) of every row of the tables (grid and Pb), as the numpy code has them."""
    a = 0.00091 * t - 0.0125 * api
    pb = 18.2 * ((gor / g) ** 0.83 * 10**a - 1.4)
    p = np.sort(np.concatenate([np.broadcast_to(p_grid, (api.size, p_grid.size)), pb[:, None]], axis=1), axis=1)
    tpc = 169.2 + 349.5 * g - 74.0 * g * g
    ppc = 756.8 - 131.0 * g - 3.6 * g * g
    tpr = np.broadcast_to(((t + 459.67) / tpc)[:, None], p.shape)
    return np.ascontiguousarray(p / ppc[:, None]), np.ascontiguousarray(tpr)


def floor_sides(args):
    """Two parts of any build, timed alone on one thread: the Z column (stocktank's own
    Dranchuk–Abou-Kassem array solver on the same points, one of the thirteen columns) and
    the delivery of the result (a fresh (13, rows) float block written once, as numpy does it)."""
    ppr, tpr = z_points(*args)

    def z_alone():
        with st.num_threads(1):
            return timed(st.z_factor, ppr, tpr)

    def fresh_block():
        def write():
            np.empty((13, ppr.size)).fill(1.0)

        return timed(write)

    return z_alone, fresh_block


def measure(n, points, rounds):
    """Rotating rounds of five sides: numpy, stocktank on one thread, stocktank on all cores, and
    the two floor parts of `floor_sides`; then the per-well numpy loop against stocktank on one
    thread."""
    args = inputs(n, points)

    def one_thread(a):
        with st.num_threads(1):
            return timed(rust_tables, *a)

    z_alone, fresh_block = floor_sides(args)
    sides = {
        "numpy": lambda: timed(numpy_tables, *args),
        "one": lambda: one_thread(args),
        "all": lambda: timed(rust_tables, *args),
        "z": z_alone,
        "block": fresh_block,
    }
    t = {k: [] for k in sides}
    order = list(sides)
    for r in range(rounds):
        for k in order[r % len(order) :] + order[: r % len(order)]:
            t[k].append(sides[k]())
    loop = []
    for _ in range(rounds):
        loop.append(timed(numpy_per_table, *args) / one_thread(args))
    med = statistics.median
    return dict(
        numpy=med(t["numpy"]),
        one=med(t["one"]),
        all=med(t["all"]),
        one_ratio=med([b / a for a, b in zip(t["one"], t["numpy"])]),
        all_ratio=med([b / a for a, b in zip(t["all"], t["numpy"])]),
        speedup=med([a / c for a, c in zip(t["one"], t["all"])]),
        z=med(t["z"]),
        block=med(t["block"]),
        floor_ratio=med([b / (z + w) for b, z, w in zip(t["numpy"], t["z"], t["block"])]),
        loop_ratio=med(loop),
    )


def timed(f, *args):
    t0 = time.perf_counter()
    f(*args)
    return time.perf_counter() - t0


def agreement(n, points):
    args = inputs(min(n, 500), points, seed=2)
    a, b = numpy_tables(*args), rust_tables(*args)
    worst = {}
    for k, v in a.items():
        x = np.asarray(b[k]).reshape(v.shape)
        worst[k] = float(np.max(np.abs(x - v) / np.maximum(np.abs(v), 1e-300)))
    return worst


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--wells", type=int, default=10000)
    ap.add_argument("--points", type=int, default=50)
    ap.add_argument("--rounds", type=int, default=5)
    a = ap.parse_args()
    cores = st.get_num_threads()
    print(f"{a.wells} tables x {a.points} pressures, {a.rounds} rotating rounds, {cores} threads")
    # The machine is shared: its load says which state (fast or ~2x slower) the run saw.
    print("load average at start (1, 5, 15 min): " + ", ".join(f"{x:.1f}" for x in os.getloadavg()))
    worst = agreement(a.wells, a.points)
    print("largest relative difference numpy vs stocktank per column:")
    print("  " + ", ".join(f"{k} {v:.1e}" for k, v in worst.items()))
    m = measure(a.wells, a.points, a.rounds)
    print(f"one core : numpy {m['numpy']:.3f} s, stocktank {m['one']:.3f} s, median ratio {m['one_ratio']:.1f}x")
    print(f"one core : numpy called once per well (vectorised over pressures), median ratio {m['loop_ratio']:.1f}x")
    print(f"all cores: numpy {m['numpy']:.3f} s, stocktank {m['all']:.3f} s, median ratio {m['all_ratio']:.1f}x")
    print(f"parallel speed-up of stocktank: median ratio {m['speedup']:.2f}x on {cores} threads")
    print(
        f"floor, one core: Z column alone {m['z']:.3f} s + fresh result block {m['block']:.3f} s;"
        f" numpy / floor = {m['floor_ratio']:.1f}x (no build that computes Z and returns a fresh"
        " result can beat numpy by more than this)"
    )
    print("load average at end (1, 5, 15 min): " + ", ".join(f"{x:.1f}" for x in os.getloadavg()))


if __name__ == "__main__":
    main()
