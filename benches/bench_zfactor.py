"""Z-factor speed: stocktank (DAK and Hall-Yarborough) against a numpy-vectorised Newton
written here, side by side in one process.

Random points with Ppr in [0.2, 15] and Tpr in [1.05, 3]. The two sides alternate and the
median of the per-round ratios is reported (the machine drifts between a fast and a
slower state, so absolute ns/point vary; ratios are the measurement). Each round times
three sides in turn, in a rotating order: stocktank on one thread
(``stocktank.num_threads(1)``), stocktank on all cores, and numpy; the speed-up to all
cores is the median of the per-round ratios of the two stocktank sides.

Usage: python benches/bench_zfactor.py [--sizes 1e5,1e6,1e7] [--rounds 5]
       [--methods dak,hall_yarborough]
"""

import argparse
import sys
import time

import numpy as np

import stocktank as st

DAK_A = [0.3265, -1.0700, -0.5339, 0.01569, -0.05165, 0.5475, -0.7361, 0.1844, 0.1056, 0.6134, 0.7210]


def numpy_dak(ppr: np.ndarray, tpr: np.ndarray, tol: float = 1e-10, maxit: int = 50) -> np.ndarray:
    """Newton on reduced density, vectorised over all points (start: ideal gas)."""
    a1, a2, a3, a4, a5, a6, a7, a8, a9, a10, a11 = DAK_A
    c1 = a1 + a2 / tpr + a3 / tpr**3 + a4 / tpr**4 + a5 / tpr**5
    c2 = a6 + a7 / tpr + a8 / tpr**2
    c3 = a9 * (a7 / tpr + a8 / tpr**2)
    c4 = a10 / tpr**3
    rho = 0.27 * ppr / tpr
    for _ in range(maxit):
        r2 = rho * rho
        e = np.exp(-a11 * r2)
        z = 1 + c1 * rho + c2 * r2 - c3 * r2 * r2 * rho + c4 * r2 * (1 + a11 * r2) * e
        f = z - 0.27 * ppr / (rho * tpr)
        dz = c1 + 2 * c2 * rho - 5 * c3 * r2 * r2 + 2 * c4 * rho * e * (1 + a11 * r2 - a11 * a11 * r2 * r2)
        df = dz + 0.27 * ppr / (r2 * tpr)
        step = f / df
        rho = np.clip(rho - step, 1e-12, 3.5)
        if np.max(np.abs(step) / rho) < tol:
            break
    return 0.27 * ppr / (rho * tpr)


def numpy_hall_yarborough(ppr: np.ndarray, tpr: np.ndarray, tol: float = 1e-10, maxit: int = 50) -> np.ndarray:
    t = 1.0 / tpr
    a = 0.06125 * t * np.exp(-1.2 * (1 - t) ** 2)
    b = t * (14.76 - 9.76 * t + 4.58 * t * t)
    c = t * (90.7 - 242.2 * t + 42.4 * t * t)
    d = 2.18 + 2.82 * t
    y = np.clip(a * ppr, 1e-12, 0.9)
    for _ in range(maxit):
        om = 1 - y
        f = -a * ppr + (y + y**2 + y**3 - y**4) / om**3 - b * y**2 + c * y**d
        df = (1 + 4 * y + 4 * y**2 - 4 * y**3 + y**4) / om**4 - 2 * b * y + c * d * y ** (d - 1)
        step = f / df
        y = np.clip(y - step, 1e-12, 0.999)
        if np.max(np.abs(step) / y) < tol:
            break
    return a * ppr / y


def timed(f, *args) -> float:
    t0 = time.perf_counter()
    f(*args)
    return time.perf_counter() - t0


def measure(sizes, rounds: int, methods) -> list:
    rng = np.random.default_rng(2026)
    rows = []
    for n in sizes:
        ppr = rng.uniform(0.2, 15.0, n)
        tpr = rng.uniform(1.05, 3.0, n)
        for method, baseline in [("dak", numpy_dak), ("hall_yarborough", numpy_hall_yarborough)]:
            if method not in methods:
                continue
            # Same answer first (to the baseline's tolerance).
            ours = st.z_factor(ppr[:10000], tpr[:10000], method=method)
            ref = baseline(ppr[:10000], tpr[:10000])
            assert np.max(np.abs(ours / ref - 1)) < 1e-8, method

            def one_thread():
                with st.num_threads(1):
                    return timed(lambda: st.z_factor(ppr, tpr, method=method))

            sides = {
                "one": one_thread,
                "all": lambda: timed(lambda: st.z_factor(ppr, tpr, method=method)),
                "numpy": lambda: timed(baseline, ppr, tpr),
            }
            t = {k: [] for k in sides}
            order = list(sides)
            for r in range(rounds):
                for k in order[r % 3 :] + order[: r % 3]:
                    t[k].append(sides[k]())
            med = lambda v: float(np.median(v))  # noqa: E731
            rows.append(
                dict(
                    n=n,
                    method=method,
                    one_ns=1e9 * med(t["one"]) / n,
                    all_ns=1e9 * med(t["all"]) / n,
                    numpy_ns=1e9 * med(t["numpy"]) / n,
                    one_ratio=med([b / a for a, b in zip(t["one"], t["numpy"])]),
                    all_ratio=med([b / a for a, b in zip(t["all"], t["numpy"])]),
                    speedup=med([a / c for a, c in zip(t["one"], t["all"])]),
                )
            )
    return rows


def main() -> int:
    ap = argparse.ArgumentParser()
    ap.add_argument("--sizes", default="1e5,1e6")
    ap.add_argument("--rounds", type=int, default=5)
    ap.add_argument("--methods", default="dak,hall_yarborough")
    args = ap.parse_args()
    sizes = [int(float(s)) for s in args.sizes.split(",")]
    rows = measure(sizes, args.rounds, args.methods.split(","))
    cores = st.get_num_threads()
    print(f"Z-factor, Ppr 0.2-15, Tpr 1.05-3; median of {args.rounds} rotating rounds; {cores} threads")
    print(f"{'points':>9} {'method':>16} | {'1 core ns/pt':>12} {'numpy ns/pt':>11} {'x numpy':>8} | "
          f"{'all cores ns/pt':>15} {'x numpy':>8} | {'speed-up':>8}")
    for r in rows:
        print(f"{r['n']:>9} {r['method']:>16} | {r['one_ns']:12.1f} {r['numpy_ns']:11.1f} {r['one_ratio']:8.1f} | "
              f"{r['all_ns']:15.1f} {r['all_ratio']:8.1f} | {r['speedup']:8.2f}")
    return 0


if __name__ == "__main__":
    sys.exit(main())
