"""Material balance of oil and gas reservoirs, aquifer influx, drive diagnostics and the
solution-gas-drive forecast. Field units: psia, days, STB, scf, rb; Bg in rb/scf.

Histories are passed as keyword arrays (``t_days``, ``p``, ``np_stb``, ``gp_scf`` and
optionally ``wp_stb``, ``wi_stb``, ``gi_scf``) with the reservoir's ``p_initial`` (psia),
``swi`` (fraction), ``cw`` and ``cf`` (1/psi). Results are dicts of floats and numpy
arrays; :func:`to_frame` turns their per-row arrays into a pandas DataFrame.

Methods: Schilthuis (1936) material balance in the Havlena–Odeh (1963) form; drive indices
(Pirson 1958); pot, Schilthuis, Fetkovich (1971), van Everdingen–Hurst (1949, Stehfest 1970
inversion) and Carter–Tracy (1960) aquifers; p/z and Ramagost–Farshad (1981) gas balances;
the Muskat (1945) and Tarner (1944) forecasts; nonlinear history matches of oil (N, m,
aquifer) and gas (G, aquifer) reservoirs. See the Rust crate docs for formulas and references.

All results are screening estimates: review them against measured data before they feed
reserves, investment or well-safety decisions.
"""

from typing import Any, Dict, Iterable, List, Mapping, Optional

import numpy as np

from ._core import (
    Aquifer,
    PvtTable,
    campbell_plot,
    classify_drive,
    cole_plot,
    drive_indices,
    fetkovich_j_linear,
    fetkovich_j_radial,
    gas_bg,
    gas_history_match,
    gas_water_drive_fit,
    havlena_odeh_fit,
    history_match,
    history_match_batch,
    muskat_forecast,
    oil_mbe_terms,
    pz_fit,
    pz_fit_abnormal,
    tarner_forecast,
    veh_constants,
    veh_dimensionless_influx,
    veh_dimensionless_pressure,
)

__all__: List[str] = [
    "Aquifer",
    "PvtTable",
    "campbell_plot",
    "classify_drive",
    "cole_plot",
    "drive_indices",
    "fetkovich_j_linear",
    "fetkovich_j_radial",
    "gas_bg",
    "gas_history_match",
    "gas_water_drive_fit",
    "havlena_odeh_fit",
    "history_match",
    "history_match_batch",
    "muskat_forecast",
    "oil_mbe_terms",
    "pz_fit",
    "pz_fit_abnormal",
    "tarner_forecast",
    "veh_constants",
    "veh_dimensionless_influx",
    "veh_dimensionless_pressure",
    "to_frame",
    "history_from_frame",
]

_HISTORY_COLUMNS = ("t_days", "p", "np_stb", "gp_scf", "wp_stb", "wi_stb", "gi_scf")


def to_frame(result: Mapping[str, Any], columns: Optional[Iterable[str]] = None) -> Any:
    """A pandas DataFrame of the per-row arrays of a result dict.

    Takes every one-dimensional array entry (or only ``columns``) whose length is the most
    common one among them; scalars and nested dicts are left out (nested ``indices`` dicts
    are flattened with their key as prefix).
    """
    import pandas as pd

    flat: Dict[str, Any] = {}
    for key, value in result.items():
        if isinstance(value, Mapping):
            for k2, v2 in value.items():
                flat[f"{key}_{k2}"] = v2
        else:
            flat[key] = value
    arrays = {k: np.asarray(v) for k, v in flat.items() if isinstance(v, np.ndarray) and np.ndim(v) == 1}
    if columns is not None:
        wanted = list(columns)
        arrays = {k: arrays[k] for k in wanted}
    if not arrays:
        return pd.DataFrame()
    lengths = [len(v) for v in arrays.values()]
    n = max(set(lengths), key=lengths.count)
    return pd.DataFrame({k: v for k, v in arrays.items() if len(v) == n})


def history_from_frame(frame: Any) -> Dict[str, np.ndarray]:
    """The history keyword arrays from a DataFrame with columns named like the keywords
    (``t_days``, ``p``, ``np_stb``, ``gp_scf`` and optionally ``wp_stb``, ``wi_stb``,
    ``gi_scf``); use as ``history_match(pvt, **history_from_frame(df), p_initial=...)``."""
    return {c: frame[c].to_numpy(dtype=float) for c in _HISTORY_COLUMNS if c in frame.columns}
