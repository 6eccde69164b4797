"""The study of the embedded demo field: an invented scenario used only for demonstration.

Everything in ``stocktank/data/demo_*`` is made up (the field, its wells and its numbers); it is
not data of any real field and must never be used as a reference value.

``run(out)`` works through the field the way a reservoir engineer would and writes every table
and a short report (``report.md``) into ``out``:

1. fluids: the oil calibrated to its measured bubble point, its black-oil table, the per-well
   tables of all wells in one parallel call, and the gas-cap gas table;
2. volumetric oil in place with uncertainty (Monte Carlo, rank-correlated inputs), P90/P50/P10
   and a tornado table;
3. material balance on the pressure history: drive diagnosis, Havlena–Odeh line, history match
   of oil in place and aquifer, drive indices, and a solution-gas-drive forecast;
4. decline fits of every well's monthly oil rate, forecasts to the economic limit, EUR and
   remaining volumes;
5. recovery factors of the field tying 2-4 together.
"""

import csv
import json
import pathlib
from typing import Any, Dict, List, Mapping, Sequence, Union

import numpy as np

_DATA = pathlib.Path(__file__).resolve().parent / "data"
FT3_PER_BBL = 5.614583333333333  # 42 US gal in ft3 (NIST SP 811), as src/units

CAUTION = (
    "Screening estimates from published correlations and simple reservoir models, on an "
    "invented field. Defer to measured laboratory PVT data, licensed engineers, and the "
    "regulations and reserves-reporting rules that apply where you work."
)


def load_field() -> Dict[str, Any]:
    """The demo field's description (``data/demo_field.json``)."""
    return json.loads((_DATA / "demo_field.json").read_text())


def _write_csv(path: pathlib.Path, columns: Mapping[str, Sequence[Any]]) -> pathlib.Path:
    keys = [k for k in columns if not k.startswith("_") and np.ndim(columns[k]) == 1]
    n = len(columns[keys[0]]) if keys else 0
    with path.open("w", newline="") as f:
        w = csv.writer(f)
        w.writerow(keys)
        for i in range(n):
            row = []
            for k in keys:
                v = columns[k][i]
                if isinstance(v, (float, np.floating)):
                    row.append("" if np.isnan(v) else f"{float(v):.6g}")
                else:
                    row.append(v.item() if isinstance(v, np.generic) else v)
            w.writerow(row)
    return path


def _read_csv(name: str) -> Dict[str, np.ndarray]:
    with (_DATA / name).open() as f:
        rows = list(csv.DictReader(f))
    out: Dict[str, np.ndarray] = {}
    for key in rows[0]:
        vals = [r[key] for r in rows]
        try:
            out[key] = np.array([float(v) if v != "" else np.nan for v in vals])
        except ValueError:
            out[key] = np.array(vals)
    return out


def _fluids(field: Dict[str, Any], folder: pathlib.Path) -> Dict[str, Any]:
    from . import gas as stg
    from . import oil as sto

    res, o = field["reservoir"], field["oil"]
    sc = field["standard_conditions"]
    fluid = sto.Oil(
        api=o["api"],
        gas_sg=o["gas_sg"],
        temperature_f=res["temperature_f"],
        gor=o["gor_scf_per_stb"],
        pb=o["measured_bubble_point_psia"],
        salinity_wt_pct=res["water_salinity_wt_pct"],
        p_sc=sc["p_psia"],
        t_sc=sc["t_f"],
    )
    table = sto.black_oil_table(fluid, np.linspace(300.0, 4000.0, 75), on_violation="ignore")
    sto.write_tables_csv(table, folder / "pvt_black_oil.csv")

    wells = field["wells"]
    per_well = sto.black_oil_tables(
        np.linspace(300.0, 4000.0, 38),
        [w["api"] for w in wells],
        [w["gas_sg"] for w in wells],
        res["temperature_f"],
        gor=[w["gor_scf_per_stb"] for w in wells],
        well=[w["well"] for w in wells],
        salinity_wt_pct=res["water_salinity_wt_pct"],
        on_violation="ignore",
    )
    sto.write_tables_csv(per_well, folder / "pvt_black_oil_by_well.csv")

    g = field["gas_cap_gas"]
    cap_gas = stg.Gas(g["gas_sg"], co2=g["co2"], h2s=g["h2s"], n2=g["n2"])
    gas_table = stg.gas_property_table(
        cap_gas, np.linspace(300.0, 4000.0, 38), res["temperature_f"], p_sc=sc["p_psia"], t_sc=sc["t_f"]
    )
    _write_csv(folder / "pvt_gas_cap_gas.csv", gas_table)
    return {
        "oil": fluid,
        "table": table,
        "calibration": fluid.calibration_report(),
        "per_well_pb": dict(zip([w["well"] for w in wells], per_well.attrs.get("pb_psia", []))),
    }


def _distribution(spec: Mapping[str, Any]) -> Any:
    from .volumetrics import Distribution

    kw = {k: v for k, v in spec.items() if k != "dist"}
    return Distribution(spec["dist"], **kw)


def _volumetrics(field: Dict[str, Any], folder: pathlib.Path) -> Dict[str, Any]:
    from . import volumetrics as stv

    v = field["volumetric_inputs"]
    corr = {(a, b): r for a, b, r in v["rank_correlation"]}
    result = stv.probabilistic_in_place(
        "oil",
        area=_distribution(v["area_acres"]),
        thickness=_distribution(v["net_pay_ft"]),
        porosity=_distribution(v["porosity"]),
        sw=_distribution(v["water_saturation"]),
        fvf=_distribution(v["boi_rb_per_stb"]),
        recovery_factor=_distribution(v["recovery_factor"]),
        correlation=corr,
        trials=200_000,
        seed=2026,
    )
    rows: Dict[str, List[Any]] = {"quantity": [], "p90_low": [], "p50": [], "p10_high": [], "mean": []}
    for name, key in (("oil in place, STB", "in_place"), ("recoverable oil, STB", "recoverable")):
        s = result.get(key + "_summary") or stv.summarize(result[key])
        rows["quantity"].append(name)
        rows["p90_low"].append(s["p90"])
        rows["p50"].append(s["p50"])
        rows["p10_high"].append(s["p10"])
        rows["mean"].append(s["mean"])
    _write_csv(folder / "volumetrics_summary.csv", rows)
    tornado = stv.tornado_table(result)
    tornado.to_csv(folder / "volumetrics_tornado.csv", index=False)
    return {"summary": rows, "tornado": tornado}


def _material_balance(field: Dict[str, Any], folder: pathlib.Path, pvt_table: Any) -> Dict[str, Any]:
    from . import material_balance as mb
    from .relperm import CoreyGasOil

    res = field["reservoir"]
    h = _read_csv("demo_pressure_history.csv")
    dates = h["date"].astype("datetime64[D]")
    t_days = (dates - dates[0]).astype(float)
    pvt = mb.PvtTable(
        p=pvt_table["p_psia"].to_numpy(),
        bo=pvt_table["bo_rb_per_stb"].to_numpy(),
        rs=pvt_table["rs_scf_per_stb"].to_numpy(),
        bg=pvt_table["bg_rcf_per_scf"].to_numpy() / FT3_PER_BBL,
        bw=pvt_table["bw_rb_per_stb"].to_numpy(),
        mu_o=pvt_table["oil_viscosity_cp"].to_numpy(),
        mu_g=pvt_table["gas_viscosity_cp"].to_numpy(),
    )
    m = field["volumetric_inputs"]["gas_cap_ratio_m"]
    hist = dict(
        t_days=t_days,
        p=h["p_psia"],
        np_stb=h["np_stb"],
        gp_scf=h["gp_scf"],
        wp_stb=h["wp_stb"],
        p_initial=res["initial_pressure_psia"],
        swi=res["connate_water_saturation"],
        cw=3.0e-6,
        cf=res["rock_compressibility_per_psi"],
    )
    drive = mb.classify_drive(pvt, m=m, **hist)
    line = mb.havlena_odeh_fit(pvt, case="water_drive", m=m, aquifer=mb.Aquifer(model="pot"), **hist)
    match = mb.history_match(pvt, m=m, aquifer=mb.Aquifer(model="pot", constant=1000.0), **hist)
    idx = mb.drive_indices(pvt, n=match["n"], m=m, we=match["we"], **hist)
    per_row = {"date": [str(d) for d in h["date"]], "p_psia": h["p_psia"], "p_model_psia": match["p_model"]}
    per_row["np_stb"] = h["np_stb"]
    per_row["we_rb"] = match["we"]
    for k, v in idx.items():
        if isinstance(v, np.ndarray) and v.shape == t_days.shape:
            per_row[f"drive_index_{k}"] = v
    _write_csv(folder / "material_balance_history.csv", per_row)

    kr = CoreyGasOil(swc=res["connate_water_saturation"], sgc=0.05, sorg=0.15, krg_max=0.8, ng=2.2, no=2.5)
    pb = float(field["oil"]["measured_bubble_point_psia"])
    forecast = mb.muskat_forecast(pvt, kr, p_bubble=pb, p_end=500.0, n_steps=60)
    _write_csv(
        folder / "solution_gas_drive_forecast.csv",
        {k: forecast[k] for k in ("p", "so", "sg", "gor", "np_over_n")},
    )
    summary = {
        "mechanism": drive["mechanism"],
        "evidence": list(drive["evidence"]),
        "havlena_odeh": {k: line[k] for k in ("n", "n_se", "aquifer_constant", "r2", "n_used")},
        "history_match": {
            "n_stb": match["n"],
            "m": match["m"],
            "aquifer": repr(match["aquifer"]),
            "parameters": match["parameters"],
            "rms_psi": match["rms"],
            "status": match["status"],
        },
        "muskat_recovery_to_500_psia": float(np.asarray(forecast["np_over_n"])[-1]),
    }
    with (folder / "material_balance.json").open("w") as f:
        json.dump(summary, f, indent=2, default=float)
    return summary


def _decline(field: Dict[str, Any], folder: pathlib.Path) -> Dict[str, Any]:
    from . import decline as dc

    prod = _read_csv("demo_production.csv")
    dates = prod["date"].astype("datetime64[D]")
    q_limit = field["economic_limit_stb_d"]
    d_min = field["terminal_decline_nominal_per_year"]
    fits = dc.fit_wells(
        prod["well"], dates, prod["oil_stb_d"], q_limit=q_limit, d_min=d_min, n_bootstrap=200, seed=11
    )
    _write_csv(folder / "decline_fits.csv", fits)
    fc = dc.forecast_wells(fits, q_limit=q_limit, d_min=d_min)
    _write_csv(folder / "decline_forecast_monthly.csv", fc)
    ok = fits["status"] == "ok"
    return {
        "wells": int(len(fits["well"])),
        "fitted": int(ok.sum()),
        "eur_stb": float(np.sum(fits["eur"][ok])),
        "eur_p90_stb": float(np.sum(fits["eur_p90"][ok])),
        "eur_p10_stb": float(np.sum(fits["eur_p10"][ok])),
        "remaining_stb": float(np.sum(fits["remaining"][ok])),
        "produced_stb": float(np.sum(fits["cum_produced"])),
        "not_fitted": {str(w): str(m) for w, m, s in zip(fits["well"], fits["message"], ok) if not s},
    }


def _fmt(x: float, unit: str = "") -> str:
    if abs(x) >= 1e6:
        return f"{x / 1e6:,.2f} MM{unit}"
    return f"{x:,.0f} {unit}".strip()


def _report(field: Dict[str, Any], folder: pathlib.Path, r: Dict[str, Any]) -> pathlib.Path:
    cal = r["fluids"]["calibration"]
    vol = r["volumetrics"]["summary"]
    mbs = r["material_balance"]
    dec = r["decline"]
    n_mb = mbs["history_match"]["n_stb"]
    lines = [
        f"# Field study: {field['field']}",
        "",
        f"> **Caution.** {CAUTION}",
        "",
        "## Fluids",
        f"- Oil {field['oil']['api']} degAPI, solution GOR {field['oil']['gor_scf_per_stb']:.0f} scf/STB at "
        f"{field['reservoir']['temperature_f']} degF.",
        f"- Bubble point: correlation {cal['pb_correlation_psia']:.0f} psia, measured {cal['pb_psia']:.0f} psia "
        f"(correlation scaled by {cal['pb_scale']:.3f} to honour the measurement).",
        f"- Bo at the bubble point {cal['bob']:.4f} rb/STB; oil viscosity there {cal['mu_ob_cp']:.3f} cp.",
        "- Tables: `pvt_black_oil.csv`, `pvt_black_oil_by_well.csv` (every well, one parallel call), "
        "`pvt_gas_cap_gas.csv`.",
        "",
        "## Oil in place, volumetric (Monte Carlo, 200,000 trials)",
        "P90 is the low estimate (exceeded with 90% probability), P10 the high one.",
        "",
        "| quantity | P90 (low) | P50 | P10 (high) | mean |",
        "|---|---|---|---|---|",
    ]
    for i, q in enumerate(vol["quantity"]):
        lines.append(
            f"| {q} | {_fmt(vol['p90_low'][i])} | {_fmt(vol['p50'][i])} | {_fmt(vol['p10_high'][i])} | "
            f"{_fmt(vol['mean'][i])} |"
        )
    lines += [
        "",
        "## Material balance",
        f"- Drive mechanism: **{mbs['mechanism']}**.",
    ]
    lines += [f"  - {e}" for e in mbs["evidence"]]
    ho = mbs["havlena_odeh"]
    lines += [
        f"- Havlena–Odeh line (water drive, pot aquifer, m known): N = {_fmt(ho['n'], 'STB')} "
        f"(standard error {_fmt(ho['n_se'], 'STB')}), R^2 = {ho['r2']:.4f}, {ho['n_used']} points.",
        f"- History match (pressure objective): N = {_fmt(n_mb, 'STB')}, m = {mbs['history_match']['m']:.3f}, "
        f"aquifer {mbs['history_match']['aquifer']}, RMS {mbs['history_match']['rms_psi']:.1f} psi "
        f"({mbs['history_match']['status']}).",
        f"- Solution-gas drive alone (Muskat forecast from the bubble point to 500 psia) would recover "
        f"{100 * mbs['muskat_recovery_to_500_psia']:.1f}% of N.",
        "",
        "## Decline and remaining volumes",
        f"- {dec['fitted']} of {dec['wells']} wells fitted (Arps, robust loss, bounds on b and D).",
        f"- Produced to date: {_fmt(dec['produced_stb'], 'STB')}; EUR of the fitted wells "
        f"{_fmt(dec['eur_stb'], 'STB')} (arithmetic sums of the per-well bootstrap P90 and P10: "
        f"{_fmt(dec['eur_p90_stb'], 'STB')} and {_fmt(dec['eur_p10_stb'], 'STB')}; summed percentiles are not the "
        f"field's percentiles: with independent wells the field range is narrower); remaining {_fmt(dec['remaining_stb'], 'STB')} to the economic limit of "
        f"{field['economic_limit_stb_d']} STB/d per well, hyperbolic switching to "
        f"{field['terminal_decline_nominal_per_year']:.2f}/year terminal exponential decline.",
    ]
    for w, msg in dec["not_fitted"].items():
        lines.append(f"  - {w}: not fitted ({msg})")
    rf_mb = dec["eur_stb"] / n_mb
    lines += [
        "",
        "## Recovery factor",
        f"- EUR of the current wells over material-balance N: {100 * rf_mb:.1f}%.",
        f"- EUR over volumetric P50 oil in place: {100 * dec['eur_stb'] / vol['p50'][0]:.1f}%.",
        "",
        "All tables of this study are in this folder, with units in their column names.",
        "",
    ]
    path = folder / "report.md"
    path.write_text("\n".join(lines))
    return path


def run(out: Union[str, "pathlib.Path"]) -> pathlib.Path:
    """Run the demo field study and write its tables and ``report.md`` into ``out``.

    Returns the folder. Everything is computed from the invented data shipped in
    ``stocktank/data`` (see the module docstring).
    """
    folder = pathlib.Path(out)
    folder.mkdir(parents=True, exist_ok=True)
    field = load_field()
    results: Dict[str, Any] = {}
    results["fluids"] = _fluids(field, folder)
    results["volumetrics"] = _volumetrics(field, folder)
    results["material_balance"] = _material_balance(field, folder, results["fluids"]["table"])
    results["decline"] = _decline(field, folder)
    _report(field, folder, results)
    return folder
