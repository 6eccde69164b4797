"""The main job runs end to end on the embedded invented field and writes what it promises.

The demo data are invented; these tests check only that the study runs and that its outputs
are internally consistent, never that a number equals an invented "expected" value.
"""

import csv
import json
import subprocess
import sys

import stocktank
from stocktank import demo


def test_demo_writes_every_table_and_the_report(tmp_path):
    out = demo.run(tmp_path / "study")
    names = {p.name for p in out.iterdir()}
    for expected in (
        "report.md",
        "pvt_black_oil.csv",
        "pvt_black_oil_by_well.csv",
        "pvt_gas_cap_gas.csv",
        "volumetrics_summary.csv",
        "volumetrics_tornado.csv",
        "material_balance.json",
        "material_balance_history.csv",
        "solution_gas_drive_forecast.csv",
        "decline_fits.csv",
        "decline_forecast_monthly.csv",
    ):
        assert expected in names, expected
    report = (out / "report.md").read_text()
    assert "Caution" in report and "licensed engineers" in report
    with (out / "volumetrics_summary.csv").open() as f:
        rows = list(csv.DictReader(f))
    # P90 is the low value (common practice, no source).
    for r in rows:
        assert float(r["p90_low"]) < float(r["p50"]) < float(r["p10_high"])
    mb = json.loads((out / "material_balance.json").read_text())
    assert mb["history_match"]["n_stb"] > 0


def test_console_entry_point(tmp_path):
    proc = subprocess.run(
        [sys.executable, "-m", "stocktank", "demo", "--out", str(tmp_path / "x")],
        capture_output=True,
        text=True,
        check=True,
    )
    assert "demo written to" in proc.stdout
    assert (tmp_path / "x" / "report.md").exists()
    assert stocktank.__version__
