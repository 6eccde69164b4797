"""Generate the invented demo field's production and pressure history (run once; output committed).

Everything here is invented for demonstration: the field, the wells, the numbers. The monthly
well rates follow Arps declines with noise, missing months, shut-ins and a ramp-up; the field's
pressure history is what a forward material balance (gas cap, small pot aquifer) gives for the
summed production, with survey noise. The demo then works back from these data as an engineer
would, so its answers are close to, not equal to, the parameters written below.

Usage: python scripts/make_demo_data.py   (writes python/stocktank/data/demo_*.csv)
"""

import json
import pathlib

import numpy as np
from scipy.optimize import brentq

import stocktank as st

DATA = pathlib.Path(__file__).resolve().parents[1] / "python" / "stocktank" / "data"
FT3_PER_BBL = 5.614583333333333

# Hidden "truth" of the invented reservoir (the demo must rediscover it from the data).
TRUE_N_STB = 36.0e6
TRUE_M = 0.22
TRUE_POT_RB_PER_PSI = 3000.0  # pot aquifer constant, rb/psi (We = C (pi - p))


def monthly_production(field: dict, rng: np.random.Generator) -> dict:
    months = field["production_months"]
    start = np.datetime64("2018-01", "M")
    rows = {"well": [], "date": [], "oil_stb_d": [], "gas_mscf_d": [], "water_stb_d": []}
    for w in field["wells"]:
        m0 = w["start_month"]
        k = np.arange(months - m0)
        t_days = k * 30.4375
        q = np.asarray(st.arps_rate(w["qi_stb_d"], w["di_nominal_per_year"], w["b"], t_days), dtype=float)
        q = q * np.exp(rng.normal(0.0, 0.08, q.size))
        q[:2] *= np.array([0.45, 0.8])[: q.size]  # ramp-up
        shut = rng.choice(np.arange(6, q.size), size=2, replace=False)
        q[shut] = 0.0
        missing = rng.choice(np.arange(3, q.size), size=2, replace=False)
        gor = w["gor_scf_per_stb"] * (1.0 + 1.6 * (k / months) ** 1.6)
        wc = 0.02 + 0.18 * (k / months) ** 2
        for i in range(q.size):
            rows["well"].append(w["well"])
            rows["date"].append(str(start + m0 + i))
            oil = np.nan if i in missing else q[i]
            rows["oil_stb_d"].append(round(float(oil), 2))
            rows["gas_mscf_d"].append(round(float(oil * gor[i] / 1000.0), 3))
            rows["water_stb_d"].append(round(float(oil * wc[i] / (1.0 - wc[i])), 2))
    return rows


def main() -> None:
    field = json.loads((DATA / "demo_field.json").read_text())
    rng = np.random.default_rng(20261201)
    prod = monthly_production(field, rng)

    # Field cumulatives at the end of each month (missing months produce nothing recorded).
    dates = np.array(prod["date"], dtype="datetime64[M]")
    days = ((dates + 1).astype("datetime64[D]") - dates.astype("datetime64[D]")).astype(float)
    oil = np.nan_to_num(np.array(prod["oil_stb_d"])) * days
    gas = np.nan_to_num(np.array(prod["gas_mscf_d"])) * days * 1000.0
    water = np.nan_to_num(np.array(prod["water_stb_d"])) * days
    months = np.unique(dates)
    cum = {k: np.cumsum([v[dates == mth].sum() for mth in months]) for k, v in
           (("np", oil), ("gp", gas), ("wp", water))}

    res = field["reservoir"]
    o = field["oil"]
    fluid = st.Oil(api=o["api"], gas_sg=o["gas_sg"], temperature_f=res["temperature_f"],
                   gor=o["gor_scf_per_stb"], pb=o["measured_bubble_point_psia"])
    table = st.black_oil_table(fluid, np.linspace(300.0, 4000.0, 75), on_violation="ignore")
    p_tab = table["p_psia"].to_numpy()
    bo = table["bo_rb_per_stb"].to_numpy()
    rs = table["rs_scf_per_stb"].to_numpy()
    bg = table["bg_rcf_per_scf"].to_numpy() / FT3_PER_BBL
    bw = table["bw_rb_per_stb"].to_numpy()
    pi = res["initial_pressure_psia"]
    swi, cf = res["connate_water_saturation"], res["rock_compressibility_per_psi"]
    cw = 3.0e-6
    boi, rsi, bgi = (np.interp(pi, p_tab, c) for c in (bo, rs, bg))

    def imbalance(p: float, n_p: float, g_p: float, w_p: float) -> float:
        b_o, r_s, b_g, b_w = (np.interp(p, p_tab, c) for c in (bo, rs, bg, bw))
        f = n_p * (b_o - r_s * b_g) + g_p * b_g + w_p * b_w
        eo = (b_o - boi) + (rsi - r_s) * b_g
        eg = boi * (b_g / bgi - 1.0)
        efw = (1.0 + TRUE_M) * boi * (cw * swi + cf) / (1.0 - swi) * (pi - p)
        we = TRUE_POT_RB_PER_PSI * (pi - p)
        return TRUE_N_STB * (eo + TRUE_M * eg + efw) + we - f

    survey = np.arange(5, months.size, 6)  # a pressure survey every six months
    hist = {"date": [], "p_psia": [], "np_stb": [], "gp_scf": [], "wp_stb": []}
    hist["date"].append(str(months[0])), hist["p_psia"].append(pi)
    for k in ("np_stb", "gp_scf", "wp_stb"):
        hist[k].append(0.0)
    for i in survey:
        p = brentq(imbalance, 400.0, pi, args=(cum["np"][i], cum["gp"][i], cum["wp"][i]))
        hist["date"].append(str(months[i] + 1))
        hist["p_psia"].append(round(p + rng.normal(0.0, 4.0), 1))
        hist["np_stb"].append(round(float(cum["np"][i])))
        hist["gp_scf"].append(round(float(cum["gp"][i]), -3))
        hist["wp_stb"].append(round(float(cum["wp"][i])))

    def write(name: str, cols: dict) -> None:
        keys = list(cols)
        lines = [",".join(keys)]
        for r in range(len(cols[keys[0]])):
            lines.append(",".join("" if (isinstance(cols[k][r], float) and np.isnan(cols[k][r]))
                                  else str(cols[k][r]) for k in keys))
        (DATA / name).write_text("\n".join(lines) + "\n")
        print(f"wrote {DATA / name} ({len(lines) - 1} rows)")

    write("demo_production.csv", prod)
    write("demo_pressure_history.csv", hist)


if __name__ == "__main__":
    main()
