"""The embedded demo field: an invented scenario used only for demonstration.

Everything here is made up (the field, its wells and its numbers); it is not data of any
real field and must not be used as a reference value.
"""

import csv
import pathlib
from typing import Union

import numpy as np

#: The invented demo gas: "Kestrel Flats" field, reservoir gas of well KF-3 (made up).
DEMO_GAS = {
    "field": "Kestrel Flats (invented)",
    "gas_sg": 0.68,
    "co2": 0.035,
    "h2s": 0.0,
    "n2": 0.012,
    "reservoir_temperature_f": 212.0,
    "initial_pressure_psia": 5400.0,
}


def write_gas_table(folder: pathlib.Path) -> pathlib.Path:
    """Write the gas property table of the demo gas from 200 psia to the initial pressure."""
    from .gas import Gas, gas_property_table

    g = DEMO_GAS
    gas = Gas(float(g["gas_sg"]), co2=float(g["co2"]), h2s=float(g["h2s"]), n2=float(g["n2"]))
    p = np.linspace(200.0, float(g["initial_pressure_psia"]), 27)
    table = gas_property_table(gas, p, float(g["reservoir_temperature_f"]))
    path = folder / "gas_properties.csv"
    with path.open("w", newline="") as f:
        w = csv.writer(f)
        w.writerow(list(table))
        for row in zip(*table.values()):
            w.writerow([f"{v:.6g}" for v in row])
    return path


def run(out: Union[str, "pathlib.Path"]) -> pathlib.Path:
    """Run the demo study and write its outputs into ``out``; returns the folder."""
    folder = pathlib.Path(out)
    folder.mkdir(parents=True, exist_ok=True)
    write_gas_table(folder)
    return folder
