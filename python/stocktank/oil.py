"""Oil PVT: bubble point and solution GOR, Bo, compressibility, density, viscosity,
calibration to measurements, and black-oil tables for one or thousands of wells.

Field units: psia, degF, scf/STB, rb/STB, cp, lbm/ft3, 1/psi. Every array function
broadcasts like a numpy ufunc, returns a float for scalar inputs and runs with the GIL
released. Correlations: Standing (1947), Vasquez–Beggs (1980), Glaso (1980),
Petrosky–Farshad (1993), Al-Marhoun (1988), Beggs–Robinson (1975), Beal (1946); see the Rust
crate docs (``stocktank::oil``) for formulas, published accuracies and data ranges.

Results are screening estimates: correlations scatter 5-30 % from laboratory data. Prefer
measured PVT (calibrate with ``Oil(pb=..., bob=..., mu_ob=...)``).
"""

import os
from typing import Any, Dict, Optional, Sequence, Union

import numpy as np
import numpy.typing as npt

from ._core import (
    Oil,
    api_from_sg,
    apparent_compressibility,
    black_oil_tables as _black_oil_tables,
    bo_saturated,
    bo_undersaturated,
    bubble_point,
    co_undersaturated,
    dead_oil_viscosity,
    live_oil_viscosity,
    oil_density,
    oil_molar_mass,
    sg_from_api,
    solution_gor,
    table_columns as _table_columns,
    total_fvf,
    undersaturated_oil_viscosity,
    vasquez_beggs_gas_sg_100psig,
)
from ._core import Gas as _Gas
from ._core import Water as _Water
from ._core import bo_saturated_in_range as _bo_saturated_in_range
from ._core import bubble_point_in_range as _bubble_point_in_range
from ._core import dead_oil_viscosity_in_range as _dead_oil_viscosity_in_range

__all__ = [
    "Oil",
    "api_from_sg",
    "sg_from_api",
    "oil_molar_mass",
    "bubble_point",
    "solution_gor",
    "bubble_point_in_range",
    "bo_saturated_in_range",
    "dead_oil_viscosity_in_range",
    "vasquez_beggs_gas_sg_100psig",
    "bo_saturated",
    "bo_undersaturated",
    "co_undersaturated",
    "apparent_compressibility",
    "total_fvf",
    "oil_density",
    "dead_oil_viscosity",
    "live_oil_viscosity",
    "undersaturated_oil_viscosity",
    "TABLE_UNITS",
    "black_oil_table",
    "black_oil_tables",
    "black_oil_tables_arrays",
    "write_tables_csv",
    "write_tables_parquet",
]

#: Column name -> unit of a black-oil table, in table order (psia, scf/STB, rb/STB, ...).
TABLE_UNITS: Dict[str, str] = dict(_table_columns())

# DataFrame / file column names: the table name with its unit, so files are self-describing.
_FILE_NAMES: Dict[str, str] = {
    "p": "p_psia",
    "rs": "rs_scf_per_stb",
    "bo": "bo_rb_per_stb",
    "co": "co_per_psi",
    "oil_density": "oil_density_lbm_per_ft3",
    "oil_viscosity": "oil_viscosity_cp",
    "bg": "bg_rcf_per_scf",
    "z": "z",
    "gas_viscosity": "gas_viscosity_cp",
    "gas_density": "gas_density_lbm_per_ft3",
    "bw": "bw_rb_per_stb",
    "water_viscosity": "water_viscosity_cp",
    "bt": "bt_rb_per_stb",
}


def bubble_point_in_range(
    rs: npt.ArrayLike,
    gas_sg: npt.ArrayLike,
    api: npt.ArrayLike,
    temperature_f: npt.ArrayLike,
    *,
    method: str = "standing",
) -> Union[bool, npt.NDArray[np.bool_]]:
    """Whether rs (scf/STB), gas_sg, api (degAPI), temperature_f (degF) and the resulting
    bubble point lie inside the data ranges of the correlation (bool or bool array)."""
    return _as_bool(_bubble_point_in_range(rs, gas_sg, api, temperature_f, method=method))


def _as_bool(out: Any) -> Union[bool, npt.NDArray[np.bool_]]:
    if isinstance(out, float):
        return out > 0.5
    return np.asarray(out) > 0.5


def bo_saturated_in_range(
    rs: npt.ArrayLike,
    gas_sg: npt.ArrayLike,
    api: npt.ArrayLike,
    temperature_f: npt.ArrayLike,
    *,
    method: str = "standing",
) -> Union[bool, npt.NDArray[np.bool_]]:
    """Whether rs (scf/STB), gas_sg, api (degAPI), temperature_f (degF) and the resulting Bo
    lie inside the data ranges of the Bo correlation (bool or bool array)."""
    return _as_bool(_bo_saturated_in_range(rs, gas_sg, api, temperature_f, method=method))


def dead_oil_viscosity_in_range(
    api: npt.ArrayLike, temperature_f: npt.ArrayLike, *, method: str = "beggs_robinson"
) -> Union[bool, npt.NDArray[np.bool_]]:
    """Whether api (degAPI) and temperature_f (degF) lie inside the data ranges of the dead-oil
    viscosity correlation (bool or bool array)."""
    return _as_bool(_dead_oil_viscosity_in_range(api, temperature_f, method=method))


def black_oil_table(
    oil: Oil,
    p: npt.ArrayLike,
    *,
    gas: Optional[_Gas] = None,
    water: Optional[_Water] = None,
    on_violation: str = "warn",
) -> Any:
    """The black-oil table of ``oil`` on pressure grid ``p`` (psia, strictly increasing; the
    bubble point is inserted) as a pandas DataFrame with unit-suffixed columns and a boolean
    ``is_pb``. ``gas`` (a :class:`Gas`, e.g. with CO2/H2S/N2) gives the gas columns (Bg in
    rcf/scf, Z, viscosity in cp, density in lbm/ft3) and the gas term of Bt and of the apparent
    co below Pb; default a gas of ``oil.gas_sg``. ``water`` (a :class:`Water` with the oil's
    standard conditions) gives Bw (rb/STB) and water viscosity (cp); default a brine of
    ``oil.salinity_wt_pct``. ``on_violation``: ``"warn"`` (default), ``"raise"`` (ValueError
    naming each pressure) or ``"ignore"`` for the consistency check."""
    import pandas as pd

    grid = [float(x) for x in np.asarray(p, dtype=float).ravel()]
    cols = oil.table(grid, gas=gas, water=water)
    df = pd.DataFrame({_FILE_NAMES.get(k, k): v for k, v in cols.items()})
    checks = oil.check_table(grid, gas=gas, water=water)
    _handle_violations([(0, p_, r, d) for (p_, r, d) in checks], on_violation)
    return df


def _handle_violations(violations: Sequence[Any], on_violation: str) -> None:
    if on_violation not in ("warn", "raise", "ignore") or not violations:
        if on_violation not in ("warn", "raise", "ignore"):
            raise ValueError(f"invalid `on_violation` = {on_violation!r}; expected one of: warn, raise, ignore")
        return
    lines = [f"well {w}: p = {p:.6g} psia: {rule} ({detail})" for (w, p, rule, detail) in violations[:20]]
    more = "" if len(violations) <= 20 else f"\n... and {len(violations) - 20} more"
    msg = "black-oil table consistency check failed:\n" + "\n".join(lines) + more
    if on_violation == "raise":
        raise ValueError(msg)
    if on_violation == "warn":
        import warnings

        warnings.warn(msg, RuntimeWarning, stacklevel=3)


def black_oil_tables_arrays(
    p: npt.ArrayLike,
    api: npt.ArrayLike,
    gas_sg: npt.ArrayLike,
    temperature_f: npt.ArrayLike,
    **options: Any,
) -> Dict[str, Any]:
    """Black-oil tables of many wells as numpy arrays (long format): see
    :func:`black_oil_tables` for the arguments. Returns the dict of ``_core.black_oil_tables``:
    columns (table names, units in :data:`TABLE_UNITS`), ``well`` (row index of the well),
    ``is_pb``, ``pb`` and ``rsi`` per well, ``violations`` and ``errors``. The 13 value
    columns are rows of one (13, n) array, so a column kept alone keeps the whole block in
    memory; ``.copy()`` it to let the rest go."""
    grid = [float(x) for x in np.asarray(p, dtype=float).ravel()]
    return dict(_black_oil_tables(grid, api, gas_sg, temperature_f, **options))


def black_oil_tables(
    p: npt.ArrayLike,
    api: npt.ArrayLike,
    gas_sg: npt.ArrayLike,
    temperature_f: npt.ArrayLike,
    *,
    well: Optional[Sequence[Any]] = None,
    on_violation: str = "warn",
    **options: Any,
) -> Any:
    """Black-oil tables for many wells at once (all cores, GIL released) as a long-format
    pandas DataFrame: one row per (well, pressure), columns ``well``, ``p_psia``,
    ``rs_scf_per_stb``, ``bo_rb_per_stb``, ``co_per_psi``, ``oil_density_lbm_per_ft3``,
    ``oil_viscosity_cp``, ``bg_rcf_per_scf``, ``z``, ``gas_viscosity_cp``,
    ``gas_density_lbm_per_ft3``, ``bw_rb_per_stb``, ``water_viscosity_cp``, ``bt_rb_per_stb``,
    ``is_pb``.

    Arguments: ``p`` the shared pressure grid (psia, strictly increasing; each well gets its
    own bubble point inserted); per-well array-likes broadcast to one length: ``api`` (degAPI),
    ``gas_sg`` (air = 1), ``temperature_f`` (degF) and the keyword options ``gor`` (scf/STB),
    ``pb`` (psia; with ``gor`` a measured bubble point to calibrate to), ``bob`` (rb/STB),
    ``mu_ob`` (cp), ``separator_p`` (psia), ``separator_t`` (degF), ``salinity_wt_pct``
    (NaN = not given); method names ``pb_method``, ``bo_method``, ``co_method``,
    ``dead_oil_viscosity_method``; standard conditions ``p_sc`` (psia), ``t_sc`` (degF);
    ``gas`` a :class:`Gas` for every well or a sequence of them, one per well (default: a gas
    of each well's ``gas_sg``), for the gas columns; ``water`` likewise :class:`Water` (with
    the standard conditions ``p_sc``, ``t_sc``; instead of ``salinity_wt_pct``);
    ``errors="raise"|"coerce"`` (coerce: a failing well gets NaN rows and is listed in
    ``df.attrs["errors"]``). ``well`` optionally names the wells (default 0..n-1).

    The frame's ``attrs`` hold ``pb_psia`` and ``rsi_scf_per_stb`` per well, ``violations``
    of the consistency check (well, p_psia, rule, detail) and ``errors``; the check's
    violations are warned about, raised or ignored by ``on_violation``.
    """
    import pandas as pd

    out = black_oil_tables_arrays(p, api, gas_sg, temperature_f, **options)
    idx = np.asarray(out["well"], dtype=np.int64)
    n_wells = len(out["pb"])
    if well is not None:
        names = np.asarray(list(well), dtype=object)
        if len(names) != n_wells:
            raise ValueError(f"invalid `well`: {len(names)} names for {n_wells} wells")
        keys: Any = names[idx]
        key_of = list(names)
    else:
        keys = idx
        key_of = list(range(n_wells))
    data: Dict[str, Any] = {"well": keys}
    for k in TABLE_UNITS:
        data[_FILE_NAMES[k]] = out[k]
    data["is_pb"] = out["is_pb"]
    df = pd.DataFrame(data)
    violations = [(key_of[w], p_, r, d) for (w, p_, r, d) in out["violations"]]
    df.attrs["pb_psia"] = dict(zip(key_of, np.asarray(out["pb"]).tolist()))
    df.attrs["rsi_scf_per_stb"] = dict(zip(key_of, np.asarray(out["rsi"]).tolist()))
    df.attrs["violations"] = violations
    df.attrs["errors"] = [(key_of[w], m) for (w, m) in out["errors"]]
    _handle_violations(violations, on_violation)
    return df


def write_tables_csv(df: Any, path: Union[str, "os.PathLike[str]"]) -> None:
    """Write a table DataFrame (from :func:`black_oil_table` / :func:`black_oil_tables`) as
    CSV; the unit of each column is part of its name (``p_psia``, ``bo_rb_per_stb``, ...)."""
    df.to_csv(path, index=False)


def write_tables_parquet(df: Any, path: Union[str, "os.PathLike[str]"]) -> None:
    """Write a table DataFrame as Parquet (needs pyarrow); column names carry their units and
    the file's schema metadata maps each column to its unit under ``stocktank.units``."""
    import json

    import pyarrow as pa
    import pyarrow.parquet as pq

    table = pa.Table.from_pandas(df, preserve_index=False)
    units = {_FILE_NAMES[k]: u for k, u in TABLE_UNITS.items() if _FILE_NAMES[k] in df.columns}
    meta = dict(table.schema.metadata or {})
    meta[b"stocktank.units"] = json.dumps(units).encode()
    pq.write_table(table.replace_schema_metadata(meta), path)

