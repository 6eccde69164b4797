"""Production decline: Arps (1945) models, robust fits of many wells, forecasts, EUR.

Units: rates per day (STB/d or Mscf/d); model time ``t`` in days since the start of the
decline; cumulative volumes in rate x days (STB or Mscf); decline rates **nominal per year**
(``di``, ``d_min``) unless named ``d_effective``. One year is 365.25 days, one month
30.4375 days.

Production records come in long format (one row per well and month): numpy arrays
(:func:`fit_wells`), a pandas DataFrame (:func:`fit_production`) or a dask DataFrame
(:func:`fit_production_dask`). Times are ``datetime64`` dates or numbers in ``time_unit``
(``"day"``, ``"month"`` = 30.4375 days, ``"year"`` = 365.25 days) on any fixed origin. Input
need not be sorted. Missing months (NaN) and shut-in months (rate 0) are left out of the fit
with calendar time kept. Each well gets one row: parameters, standard errors, goodness of
fit, status and reason, cumulative produced, remaining volume and EUR with a bootstrap
P90/P50/P10 range (P90 is the LOW value). See the Rust docs of ``stocktank::decline`` for
the method, its objective (that of ``scipy.optimize.least_squares`` on log rates with a robust
loss) and the references.

The results are screening estimates: reserves and investment decisions need a qualified
engineer and the reserves-reporting rules that apply to you.
"""

from typing import Any, Dict, List, Mapping, Optional, Sequence, Tuple, Union

import numpy as np

from ._core import (
    arps_cumulative,
    arps_eur,
    arps_rate,
    arps_rate_at_cumulative,
    arps_remaining,
    arps_time_to_rate,
    effective_decline,
    fit_decline_batch,
    forecast_batch,
    nominal_decline,
)

__all__: List[str] = [
    "arps_rate",
    "arps_cumulative",
    "arps_time_to_rate",
    "arps_eur",
    "arps_rate_at_cumulative",
    "arps_remaining",
    "effective_decline",
    "nominal_decline",
    "fit_decline_batch",
    "forecast_batch",
    "fit_decline",
    "fit_wells",
    "forecast_wells",
    "fit_production",
    "fit_production_dask",
    "FIT_COLUMNS",
]

DAYS_PER_YEAR = 365.25
"""Days per year for decline rates (Julian year)."""
DAYS_PER_MONTH = DAYS_PER_YEAR / 12.0
"""Days per average month, 30.4375."""

FIT_COLUMNS: Tuple[str, ...] = (
    "status",
    "message",
    "qi",
    "di",
    "b",
    "qi_se",
    "di_se",
    "b_se",
    "b_at_bound",
    "di_at_bound",
    "t0",
    "t_last",
    "t_forecast",
    "t_end",
    "n_used",
    "n_excluded",
    "cost",
    "rmse_log",
    "r2_log",
    "iterations",
    "cum_produced",
    "remaining",
    "eur",
    "eur_p90",
    "eur_p50",
    "eur_p10",
)
"""Per-well result columns, in order (``t0``, ``t_last``, ``t_forecast``, ``t_end`` in the
input's time axis; the forecast starts at ``t_forecast``, the end of the last producing record's
period, where ``cum_produced`` stops)."""

_TIME_COLUMNS = ("t0", "t_last", "t_forecast", "t_end")
_EPOCH = np.datetime64("1970-01-01T00:00:00", "ns")
_UNITS = {"day": 1.0, "month": DAYS_PER_MONTH, "year": DAYS_PER_YEAR}
_FIT_OPTIONS = (
    "loss",
    "f_scale",
    "b_min",
    "b_max",
    "di_min",
    "di_max",
    "start",
    "min_points",
    "q_limit",
    "d_min",
    "horizon_years",
    "n_bootstrap",
    "seed",
    "max_iter",
    "tol",
)


def _days(time: Any, time_unit: str) -> Tuple[np.ndarray, bool]:
    """Times as float days on a fixed origin; True when they were dates."""
    arr = np.asarray(time)
    if np.issubdtype(arr.dtype, np.datetime64):
        ns = arr.astype("datetime64[ns]")
        days = (ns - _EPOCH) / np.timedelta64(1, "D")
        days = np.where(np.isnat(ns), np.nan, days)
        return np.asarray(days, dtype=np.float64), True
    if time_unit not in _UNITS:
        raise _invalid_option("time_unit", time_unit, ", ".join(_UNITS))
    return np.asarray(arr, dtype=np.float64) * _UNITS[time_unit], False


def _from_days(days: np.ndarray, dates: bool, time_unit: str) -> np.ndarray:
    """Inverse of :func:`_days`."""
    days = np.asarray(days, dtype=np.float64)
    if dates:
        ns = np.round(days * 86_400e9)
        out = np.full(days.shape, np.datetime64("NaT", "ns"))
        ok = np.isfinite(ns)
        out[ok] = _EPOCH + ns[ok].astype(np.int64).astype("timedelta64[ns]")
        return out
    return days / _UNITS[time_unit]


def _invalid_option(arg: str, value: Any, allowed: str) -> Exception:
    from ._core import InvalidOptionError

    return InvalidOptionError(f"invalid `{arg}` = {value!r}; expected one of: {allowed}")


def _group(well: Any, t_days: np.ndarray) -> Tuple[np.ndarray, Optional[np.ndarray], np.ndarray]:
    """Sorted unique wells, the record order grouping them (None if already grouped in key
    order) and the offsets. Times within a well may stay in any order (the core sorts)."""
    keys = np.asarray(well)
    if keys.ndim != 1:
        from ._core import ShapeError

        raise ShapeError(f"`well` must be one-dimensional, got shape {keys.shape}")
    n = len(keys)
    try:
        grouped = n == 0 or bool(np.all(keys[1:] >= keys[:-1]))
    except TypeError:
        grouped = False
    if grouped:
        starts = np.flatnonzero(keys[1:] != keys[:-1]) + 1 if n else np.zeros(0, np.int64)
        offsets = np.concatenate([[0], starts, [n]]).astype(np.int64) if n else np.zeros(1, np.int64)
        return keys[offsets[:-1]], None, offsets
    try:
        uniques, codes = np.unique(keys, return_inverse=True)
    except TypeError as e:  # e.g. None among strings: say which argument
        raise TypeError(f"`well` keys must be mutually sortable (one type, no None): {e}") from e
    codes = codes.reshape(-1)
    order = np.argsort(codes, kind="stable")
    counts = np.bincount(codes, minlength=len(uniques))
    offsets = np.zeros(len(uniques) + 1, dtype=np.int64)
    np.cumsum(counts, out=offsets[1:])
    return uniques, order, offsets


def _start_times(
    start_time: Optional[Union[Mapping[Any, Any], Any]], uniques: np.ndarray, time_unit: str
) -> Optional[np.ndarray]:
    if start_time is None:
        return None
    get = start_time.get if hasattr(start_time, "get") else None
    if get is None:
        raise TypeError("`start_time` must map well -> start time (a dict or a pandas Series)")
    vals = [get(w, None) for w in uniques.tolist()]
    if any(isinstance(v, (np.datetime64,)) or hasattr(v, "to_datetime64") for v in vals):
        arr = np.array(
            [np.datetime64("NaT") if v is None else np.datetime64(v, "ns") for v in vals],
            dtype="datetime64[ns]",
        )
        return _days(arr, "day")[0]
    arr = np.array([np.nan if v is None else float(v) for v in vals], dtype=np.float64)
    return arr * _UNITS[time_unit]


def fit_wells(
    well: Any,
    time: Any,
    rate: Any,
    *,
    time_unit: str = "day",
    start_time: Optional[Mapping[Any, Any]] = None,
    **options: Any,
) -> Dict[str, np.ndarray]:
    """Fit an Arps decline to every well of long-format production arrays, in parallel.

    Args:
        well: well key of each record (any sortable dtype).
        time: record dates (``datetime64``) or numbers in ``time_unit``; any order.
        rate: rate of each record, per day (STB/d or Mscf/d); NaN missing, 0 shut in.
        time_unit: unit of numeric ``time``: ``"day"``, ``"month"`` (30.4375 d) or ``"year"``.
        start_time: optional mapping well -> start of the decline (same axis as ``time``);
            other wells start at the peak (``start="peak"``) or first producing record.
        **options: keyword options of :func:`fit_decline_batch`: ``loss`` ("soft_l1",
            "huber", "linear"), ``f_scale`` (ln-rate units, 0.2), ``b_min``/``b_max``
            (0, 2), ``di_min``/``di_max`` (nominal per year, 0.001, 50), ``start``
            ("peak", "first"), ``min_points`` (6), ``q_limit`` (economic limit per day, 1.0),
            ``d_min`` (terminal nominal decline per year, 0 = none), ``horizon_years`` (50),
            ``n_bootstrap`` (100; 0 = no EUR range), ``seed`` (0), ``max_iter``, ``tol``.

    Method (see the Rust docs of ``stocktank::decline`` for formulas and references): the
    fit minimises ``0.5 * sum(C**2 * rho((r / C)**2))`` of the log-rate residuals ``r`` over
    (ln qi, ln di, b) within the bounds, the objective of ``scipy.optimize.least_squares``
    with ``loss`` and ``f_scale=C``. ``qi_se``, ``di_se``, ``b_se`` are asymptotic standard
    errors (NaN for a parameter on a bound). ``cum_produced`` is the measured volume (rate x
    time to the next record), ``remaining`` the Arps forecast from ``t_forecast`` to
    ``q_limit`` or the horizon, ``eur = cum_produced + remaining``. The EUR range is a
    residual bootstrap: ``n_bootstrap`` synthetic histories (fitted curve times resampled
    log residuals) are refitted; ``eur_p90`` is the 10th percentile (LOW), ``eur_p50`` the
    median, ``eur_p10`` the 90th percentile (HIGH), as ``numpy.percentile``. It is seeded
    from ``seed`` and the well's own data, so it is reproducible and independent of the
    batch. It reflects scatter about the Arps model only, not model or forecast risk.

    Returns:
        A dict of arrays, one element per well sorted by key: ``well`` and every name of
        :data:`FIT_COLUMNS`; ``t0``, ``t_last``, ``t_forecast``, ``t_end`` in the input's
        time axis (``datetime64[ns]`` for date input).
        Volumes in rate x days (STB, Mscf); ``di`` nominal per year.

    Raises:
        StocktankError: a ``ValueError`` naming the bad argument (a well that cannot be
            fitted is not an error: see its ``status`` and ``message``).
    """
    _check_options(options)
    t_days, dates = _days(time, time_unit)
    q = np.asarray(rate, dtype=np.float64)
    if t_days.shape != q.shape or np.shape(well) != q.shape:
        from ._core import ShapeError

        raise ShapeError(
            f"`well`, `time` and `rate` must have one shape, got {np.shape(well)}, "
            f"{t_days.shape} and {q.shape}"
        )
    uniques, order, offsets = _group(well, t_days)
    st = _start_times(start_time, uniques, time_unit)
    if order is not None:
        t_days, q = t_days[order], q[order]
    res = fit_decline_batch(t_days, q, offsets, st, **options)
    out: Dict[str, np.ndarray] = {"well": uniques}
    for name in FIT_COLUMNS:
        col = res[name]
        if name in ("status", "message"):
            out[name] = np.asarray(col, dtype=object)
        elif name in _TIME_COLUMNS:
            out[name] = _from_days(col, dates, time_unit)
        else:
            out[name] = col
    return out


def _check_options(options: Mapping[str, Any]) -> None:
    bad = sorted(set(options) - set(_FIT_OPTIONS))
    if bad:
        raise TypeError(f"unexpected keyword argument(s) {bad}; allowed: {list(_FIT_OPTIONS)}")


def fit_decline(
    time: Any,
    rate: Any,
    *,
    time_unit: str = "day",
    start_time: Optional[Any] = None,
    **options: Any,
) -> Dict[str, Any]:
    """Fit an Arps decline to one well; returns a dict of its results (see :func:`fit_wells`)."""
    q = np.asarray(rate, dtype=np.float64)
    well = np.zeros(q.shape, dtype=np.int64)
    st = None if start_time is None else {0: start_time}
    res = fit_wells(well, time, q, time_unit=time_unit, start_time=st, **options)
    return {k: v[0] for k, v in res.items() if k != "well"}


def forecast_wells(
    fits: Any,
    *,
    q_limit: float = 1.0,
    d_min: float = 0.0,
    horizon_years: float = 50.0,
    step_days: float = DAYS_PER_MONTH,
    time_unit: str = "day",
) -> Dict[str, np.ndarray]:
    """Monthly forecast tables (long format) of fitted wells from ``t_forecast``.

    Args:
        fits: the result of :func:`fit_wells` (a dict) or the per-phase columns of
            :func:`fit_production` renamed to the plain names (``qi``, ``di``, ``b``, ``t0``,
            ``t_forecast``, ``well``).
        q_limit: economic-limit rate, per day; d_min: terminal nominal decline per year;
        horizon_years: longest forecast after the last record, years (use the fit's values).
        step_days: step length, days (default one average month, 30.4375 d).
        time_unit: unit of numeric times (ignored for dates).

    Returns:
        Dict of arrays: ``well``, ``time`` (start of each step, input axis), ``rate`` (mean
        rate over the step, per day), ``volume`` (rate x days) and ``cumulative`` (from
        ``t_forecast``). The volumes of a well add up to its ``remaining``.
    """
    t0 = np.asarray(fits["t0"])
    t_last = np.asarray(fits["t_forecast"])
    dates = bool(np.issubdtype(t0.dtype, np.datetime64))
    t0d = _days(t0, time_unit)[0]
    tld = _days(t_last, time_unit)[0]
    t_from = tld - t0d
    res = forecast_batch(
        np.asarray(fits["qi"], dtype=np.float64),
        np.asarray(fits["di"], dtype=np.float64),
        np.asarray(fits["b"], dtype=np.float64),
        t_from,
        t_from + horizon_years * DAYS_PER_YEAR,
        d_min=d_min,
        q_limit=q_limit,
        step_days=step_days,
    )
    idx = res["index"]
    return {
        "well": np.asarray(fits["well"])[idx],
        "time": _from_days(t0d[idx] + res["t"], dates, time_unit),
        "rate": res["rate"],
        "volume": res["volume"],
        "cumulative": res["cumulative"],
    }


def _phase_options(options: Dict[str, Any], phase: str) -> Dict[str, Any]:
    """Options for one phase: a dict value (phase -> value) picks that phase's entry."""
    out = {}
    for k, v in options.items():
        out[k] = v[phase] if isinstance(v, Mapping) else v
    return out


def fit_production(
    df: Any,
    *,
    well: str = "well",
    time: str = "date",
    rates: Union[str, Sequence[str]] = ("oil",),
    time_unit: str = "day",
    start_time: Optional[Mapping[Any, Any]] = None,
    forecast: bool = False,
    **options: Any,
) -> Any:
    """Fit every well and phase of a long-format pandas DataFrame.

    Args:
        df: one row per well and record, with columns ``well``, ``time`` and each of
            ``rates`` (rates per day); any row order.
        well, time: column names of the well key and of the record time (dates or numbers
            in ``time_unit``).
        rates: rate column(s) to fit, e.g. ``("oil", "gas", "water")``; each is fitted on its
            own.
        start_time: optional mapping well -> decline start.
        forecast: also return the monthly forecast in long format.
        **options: as :func:`fit_wells`; a dict value (phase -> value) sets a per-phase
            option, e.g. ``q_limit={"oil": 2.0, "gas": 20.0}``.

    Returns:
        A DataFrame indexed by well (sorted) with columns ``<phase>_<name>`` for every name
        of :data:`FIT_COLUMNS`; with ``forecast=True`` a tuple (fits, forecast) where the
        forecast has columns ``well, phase, time, rate, volume, cumulative``.
    """
    import pandas as pd

    _check_options(options)
    phases = [rates] if isinstance(rates, str) else list(rates)
    cols: Dict[str, Any] = {}
    index = None
    fc_parts = []
    for ph in phases:
        opts = _phase_options(options, ph)
        res = fit_wells(
            df[well].to_numpy(),
            df[time].to_numpy(),
            df[ph].to_numpy(dtype=np.float64, na_value=np.nan),
            time_unit=time_unit,
            start_time=start_time,
            **opts,
        )
        index = res["well"]
        for name in FIT_COLUMNS:
            cols[f"{ph}_{name}"] = res[name]
        if forecast:
            fc = forecast_wells(
                res,
                q_limit=opts.get("q_limit", 1.0),
                d_min=opts.get("d_min", 0.0),
                horizon_years=opts.get("horizon_years", 50.0),
                time_unit=time_unit,
            )
            part = pd.DataFrame(fc)
            part.insert(1, "phase", ph)
            fc_parts.append(part)
    idx = pd.Index(index if index is not None else [], name=well)
    if len(idx) == 0 and len(df) == 0:
        idx = pd.Index(df[well].to_numpy()[:0], name=well)
    out = pd.DataFrame(cols, index=idx)
    if forecast:
        fc_df = pd.concat(fc_parts, ignore_index=True) if fc_parts else pd.DataFrame()
        return out, fc_df
    return out


def fit_production_dask(
    ddf: Any,
    *,
    well: str = "well",
    time: str = "date",
    rates: Union[str, Sequence[str]] = ("oil",),
    time_unit: str = "day",
    partitioned_by_well: bool = False,
    compute: bool = True,
    **options: Any,
) -> Any:
    """Fit a dask DataFrame of long-format production, one partition at a time.

    Every well must lie in a single partition. Unless ``partitioned_by_well=True`` (the
    caller guarantees it, e.g. data written one file per group of wells), the frame is first
    shuffled on the well column so that it does. Each partition is then fitted by
    :func:`fit_production` (in parallel inside the partition, GIL released) on whatever
    workers the active ``distributed`` client or dask scheduler provides. A well's result
    depends only on its own records and the options (the bootstrap is seeded from ``seed``
    and the well's data), so the result equals the single-process :func:`fit_production`
    exactly.

    Args:
        ddf: a ``dask.dataframe.DataFrame`` with columns ``well``, ``time`` and ``rates``.
        partitioned_by_well: skip the shuffle (each well already lies in one partition).
        compute: return the computed pandas DataFrame sorted by well (default) or the lazy
            dask DataFrame (one row per well, partition order).
        **options, well, time, rates, time_unit: as :func:`fit_production` (``start_time``
            and ``forecast`` are not offered here).

    Returns:
        A pandas DataFrame indexed by well, identical to :func:`fit_production` on the whole
        data, or a dask DataFrame when ``compute=False``.
    """
    _check_options(options)
    if not partitioned_by_well:
        ddf = ddf.shuffle(on=well)
    kwargs = dict(well=well, time=time, rates=rates, time_unit=time_unit, **options)
    meta = fit_production(ddf._meta, **kwargs)
    lazy = ddf.map_partitions(fit_production, meta=meta, **kwargs)
    if not compute:
        return lazy
    return lazy.compute().sort_index()
