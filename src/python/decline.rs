//! Python bindings of [`crate::decline`]: conversion only.

use super::{In, call, detach, on_error};
use crate::decline::{self as core, FitOptions, Loss, Period, Start};
use numpy::{AllowTypeChange, IntoPyArray, PyArrayLike1};
use pyo3::prelude::*;
use pyo3::types::PyDict;

/// Arps (1945) rate at time ``t``, with an optional terminal exponential decline.
///
/// Args:
///     qi: initial rate, per day (STB/d or Mscf/d), > 0.
///     di: initial nominal decline, per year, > 0.
///     b: Arps exponent, >= 0 (0 exponential, 1 harmonic).
///     t: time since the start of the decline, days, >= 0.
///     d_min: terminal nominal decline, per year (default none); the rate turns
///         exponential once the hyperbolic decline falls to it. A terminal decline quoted
///         as effective per year converts with ``nominal_decline(de, 0.0)``.
///     errors: "raise" (default) or "coerce" (NaN for invalid elements).
///
/// Returns:
///     Rate, per day (float for scalar inputs, else a broadcast ndarray). NaN in, NaN out.
#[pyfunction]
#[pyo3(signature = (qi, di, b, t, *, d_min = None, errors = "raise"))]
fn arps_rate(
    py: Python<'_>,
    qi: In<'_>,
    di: In<'_>,
    b: In<'_>,
    t: In<'_>,
    d_min: Option<In<'_>>,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let oe = on_error(errors)?;
    let zero = zero_like(py, d_min)?;
    call(py, [&qi, &di, &b, &zero, &t], move |[qi, di, b, dm, t]| {
        core::rate_array(qi, di, b, dm, t, oe)
    })
}

/// Arps (1945) cumulative production from 0 to ``t`` days.
///
/// Args: as :func:`arps_rate` (``t`` may be ``inf`` for the ultimate cumulative).
///
/// Returns:
///     Volume in rate x days (STB for STB/d, Mscf for Mscf/d).
#[pyfunction]
#[pyo3(signature = (qi, di, b, t, *, d_min = None, errors = "raise"))]
fn arps_cumulative(
    py: Python<'_>,
    qi: In<'_>,
    di: In<'_>,
    b: In<'_>,
    t: In<'_>,
    d_min: Option<In<'_>>,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let oe = on_error(errors)?;
    let zero = zero_like(py, d_min)?;
    call(py, [&qi, &di, &b, &zero, &t], move |[qi, di, b, dm, t]| {
        core::cumulative_array(qi, di, b, dm, t, oe)
    })
}

/// Time for an Arps decline to fall to the rate ``q_limit``.
///
/// Args: as :func:`arps_rate`, with ``q_limit`` (per day, >= 0) in place of ``t``.
///
/// Returns:
///     Days since the start of the decline (0 when ``q_limit >= qi``, inf when 0).
#[pyfunction]
#[pyo3(signature = (qi, di, b, q_limit, *, d_min = None, errors = "raise"))]
fn arps_time_to_rate(
    py: Python<'_>,
    qi: In<'_>,
    di: In<'_>,
    b: In<'_>,
    q_limit: In<'_>,
    d_min: Option<In<'_>>,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let oe = on_error(errors)?;
    let zero = zero_like(py, d_min)?;
    call(
        py,
        [&qi, &di, &b, &zero, &q_limit],
        move |[qi, di, b, dm, q]| core::time_to_rate_array(qi, di, b, dm, q, oe),
    )
}

/// Arps EUR: cumulative from 0 to the economic-limit rate or the horizon.
///
/// Args: as :func:`arps_rate`, with ``q_limit`` (per day, >= 0) and ``t_max`` (days since
/// the start of the decline, default inf).
///
/// Returns:
///     Volume in rate x days (STB, Mscf). A screening estimate.
#[pyfunction]
#[pyo3(signature = (qi, di, b, q_limit, *, d_min = None, t_max = None, errors = "raise"))]
#[allow(clippy::too_many_arguments)]
fn arps_eur(
    py: Python<'_>,
    qi: In<'_>,
    di: In<'_>,
    b: In<'_>,
    q_limit: In<'_>,
    d_min: Option<In<'_>>,
    t_max: Option<In<'_>>,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let oe = on_error(errors)?;
    let zero = zero_like(py, d_min)?;
    let t_max = match t_max {
        Some(t) => t,
        None => f64::INFINITY.into_pyobject(py)?.into_any().extract()?,
    };
    call(
        py,
        [&qi, &di, &b, &zero, &q_limit, &t_max],
        move |[qi, di, b, dm, q, tm]| core::eur_array(qi, di, b, dm, q, tm, oe),
    )
}

/// Arps (1945) rate once the cumulative production has reached ``np`` (rate against cumulative).
///
/// Args: as :func:`arps_rate`, with ``np`` (cumulative, rate x days, >= 0) in place of
/// ``t``; ``np`` at or beyond the ultimate cumulative of the decline is an error.
///
/// Returns:
///     Rate, per day. For b = 0 this is the straight line ``q = qi - D np``.
#[pyfunction]
#[pyo3(signature = (qi, di, b, np, *, d_min = None, errors = "raise"))]
fn arps_rate_at_cumulative(
    py: Python<'_>,
    qi: In<'_>,
    di: In<'_>,
    b: In<'_>,
    np: In<'_>,
    d_min: Option<In<'_>>,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let oe = on_error(errors)?;
    let zero = zero_like(py, d_min)?;
    call(
        py,
        [&qi, &di, &b, &zero, &np],
        move |[qi, di, b, dm, np]| core::rate_at_cumulative_array(qi, di, b, dm, np, oe),
    )
}

/// Arps remaining volume from ``t_from`` days to the economic limit or the horizon.
///
/// Args: as :func:`arps_eur`, with ``t_from`` (days since the start of the decline, >= 0)
/// and ``t_max`` (days since the start of the decline, default inf).
///
/// Returns:
///     ``Np(t_end) - Np(t_from)`` in rate x days, 0 when already past the limit or horizon.
#[pyfunction]
#[pyo3(signature = (qi, di, b, t_from, q_limit, *, d_min = None, t_max = None, errors = "raise"))]
#[allow(clippy::too_many_arguments)]
fn arps_remaining(
    py: Python<'_>,
    qi: In<'_>,
    di: In<'_>,
    b: In<'_>,
    t_from: In<'_>,
    q_limit: In<'_>,
    d_min: Option<In<'_>>,
    t_max: Option<In<'_>>,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let oe = on_error(errors)?;
    let zero = zero_like(py, d_min)?;
    let t_max = match t_max {
        Some(t) => t,
        None => f64::INFINITY.into_pyobject(py)?.into_any().extract()?,
    };
    call(
        py,
        [&qi, &di, &b, &zero, &t_from, &q_limit, &t_max],
        move |[qi, di, b, dm, tf, q, tm]| core::remaining_array(qi, di, b, dm, tf, q, tm, oe),
    )
}

/// Effective (secant) decline over one period from a nominal decline per year.
///
/// ``1 - (1 + b D dt)^(-1/b)`` (``1 - exp(-D dt)`` at b = 0), dt = 1 year or 1/12.
///
/// Args:
///     d_nominal_per_year: nominal decline, per year, >= 0.
///     b: Arps exponent, >= 0.
///     period: "year" (default) or "month".
///
/// Returns:
///     Fraction in [0, 1).
#[pyfunction]
#[pyo3(signature = (d_nominal_per_year, b, *, period = "year", errors = "raise"))]
fn effective_decline(
    py: Python<'_>,
    d_nominal_per_year: In<'_>,
    b: In<'_>,
    period: &str,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let oe = on_error(errors)?;
    let p = Period::parse(period)?;
    call(py, [&d_nominal_per_year, &b], move |[d, b]| {
        core::effective_decline_array(d, b, p, oe)
    })
}

/// Nominal decline per year from an effective (secant) decline over one period.
///
/// ``((1 - De)^(-b) - 1) / (b dt)`` (``-ln(1 - De) / dt`` at b = 0).
///
/// Args:
///     d_effective: effective decline over the period, fraction in [0, 1).
///     b: Arps exponent, >= 0.
///     period: "year" (default) or "month".
///
/// Returns:
///     Nominal decline, per year.
#[pyfunction]
#[pyo3(signature = (d_effective, b, *, period = "year", errors = "raise"))]
fn nominal_decline(
    py: Python<'_>,
    d_effective: In<'_>,
    b: In<'_>,
    period: &str,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let oe = on_error(errors)?;
    let p = Period::parse(period)?;
    call(py, [&d_effective, &b], move |[d, b]| {
        core::nominal_decline_array(d, b, p, oe)
    })
}

fn zero_like<'py>(py: Python<'py>, d: Option<In<'py>>) -> PyResult<In<'py>> {
    match d {
        Some(d) => Ok(d),
        None => 0.0f64.into_pyobject(py)?.into_any().extract(),
    }
}

fn to_vec(a: &In<'_>, name: &str) -> PyResult<Vec<f64>> {
    let v = a.as_array();
    if v.ndim() > 1 {
        return Err(crate::Error::Shape(format!(
            "`{name}` must be one-dimensional, got {:?}",
            v.shape()
        ))
        .into());
    }
    Ok(v.iter().copied().collect())
}

/// Fit an Arps decline to many wells in parallel (GIL released); the core of ``fit_wells``.
///
/// Args:
///     t: record times, days on a fixed origin; q: rates per day (NaN missing, 0 shut in).
///     offsets: int array, well k is ``t[offsets[k]:offsets[k+1]]``.
///     start_time: optional per-well decline start, days (NaN = none).
///     loss, f_scale, b_min, b_max, di_min, di_max (nominal per year), start, min_points,
///     q_limit (per day), d_min (nominal per year), horizon_years, n_bootstrap, seed,
///     max_iter, tol: see ``stocktank.decline.fit_wells``.
///
/// Returns:
///     Dict of per-well arrays (``status`` and ``message`` as lists of str).
#[pyfunction]
#[pyo3(signature = (
    t, q, offsets, start_time = None, *, loss = "soft_l1", f_scale = 0.2, b_min = 0.0,
    b_max = 2.0, di_min = 1e-3, di_max = 50.0, start = "peak", min_points = 6, q_limit = 1.0,
    d_min = 0.0, horizon_years = 50.0, n_bootstrap = 100, seed = 0, max_iter = 200, tol = 1e-8
))]
#[allow(clippy::too_many_arguments)]
fn fit_decline_batch<'py>(
    py: Python<'py>,
    t: In<'py>,
    q: In<'py>,
    offsets: PyArrayLike1<'py, i64, AllowTypeChange>,
    start_time: Option<In<'py>>,
    loss: &str,
    f_scale: f64,
    b_min: f64,
    b_max: f64,
    di_min: f64,
    di_max: f64,
    start: &str,
    min_points: i128,
    q_limit: f64,
    d_min: f64,
    horizon_years: f64,
    n_bootstrap: i128,
    seed: i128,
    max_iter: i128,
    tol: f64,
) -> PyResult<Bound<'py, PyDict>> {
    let min_points: usize = super::whole("min_points", min_points)?;
    let n_bootstrap: usize = super::whole("n_bootstrap", n_bootstrap)?;
    let seed: u64 = super::whole("seed", seed)?;
    let max_iter: usize = super::whole("max_iter", max_iter)?;
    let opts = FitOptions {
        loss: Loss::parse(loss)?,
        f_scale,
        b_bounds: (b_min, b_max),
        di_bounds: (di_min, di_max),
        start: Start::parse(start)?,
        min_points,
        q_limit,
        d_min,
        horizon_years,
        n_bootstrap,
        seed,
        max_iter,
        tol,
    };
    // Each thread holds one well's bootstrap EURs at a time.
    super::check_memory(
        "n_bootstrap",
        n_bootstrap,
        rayon::current_num_threads().max(1) * std::mem::size_of::<f64>(),
    )?;
    let tv = to_vec(&t, "t")?;
    let qv = to_vec(&q, "q")?;
    let mut off = Vec::with_capacity(offsets.len()?);
    for (k, &o) in offsets.as_array().iter().enumerate() {
        if o < 0 {
            return Err(crate::Error::InvalidRecord {
                arg: "offsets".into(),
                row: k,
                message: format!("negative offset {o}"),
            }
            .into());
        }
        off.push(o as usize);
    }
    let st = start_time.map(|s| to_vec(&s, "start_time")).transpose()?;
    let fits = detach(py, move || {
        core::fit_wells(&tv, &qv, &off, st.as_deref(), &opts)
    })?;

    let out = PyDict::new(py);
    macro_rules! col {
        ($name:literal, $f:expr) => {
            out.set_item(
                $name,
                fits.iter().map($f).collect::<Vec<_>>().into_pyarray(py),
            )?;
        };
    }
    out.set_item(
        "status",
        fits.iter().map(|f| f.status.as_str()).collect::<Vec<_>>(),
    )?;
    out.set_item(
        "message",
        fits.iter().map(|f| f.message.as_str()).collect::<Vec<_>>(),
    )?;
    col!("qi", |f| f.qi);
    col!("di", |f| f.di);
    col!("b", |f| f.b);
    col!("qi_se", |f| f.qi_se);
    col!("di_se", |f| f.di_se);
    col!("b_se", |f| f.b_se);
    col!("b_at_bound", |f| f.b_at_bound);
    col!("di_at_bound", |f| f.di_at_bound);
    col!("t0", |f| f.t0);
    col!("t_last", |f| f.t_last);
    col!("t_forecast", |f| f.t_forecast);
    col!("t_end", |f| f.t_end);
    col!("n_used", |f| f.n_used as i64);
    col!("n_excluded", |f| f.n_excluded as i64);
    col!("cost", |f| f.cost);
    col!("rmse_log", |f| f.rmse_log);
    col!("r2_log", |f| f.r2_log);
    col!("iterations", |f| f.iterations as i64);
    col!("cum_produced", |f| f.cum_produced);
    col!("remaining", |f| f.remaining);
    col!("eur", |f| f.eur);
    col!("eur_p90", |f| f.eur_p90);
    col!("eur_p50", |f| f.eur_p50);
    col!("eur_p10", |f| f.eur_p10);
    Ok(out)
}

/// Forecast tables of many Arps declines in long format (parallel, GIL released).
///
/// Args:
///     qi (per day), di (nominal per year), b: per decline (NaN: no rows).
///     t_from, t_max: forecast start and horizon, days since the start of each decline.
///     d_min: terminal nominal decline per year; q_limit: economic limit per day;
///     step_days: step length, days (default one average month, 30.4375).
///
/// Returns:
///     Dict of arrays ``index`` (decline of each row), ``t`` (step start, days),
///     ``rate`` (mean rate over the step, per day), ``volume`` and ``cumulative``
///     (rate x days).
#[pyfunction]
#[pyo3(signature = (qi, di, b, t_from, t_max, *, d_min = 0.0, q_limit = 1.0, step_days = None))]
#[allow(clippy::too_many_arguments)]
fn forecast_batch<'py>(
    py: Python<'py>,
    qi: In<'py>,
    di: In<'py>,
    b: In<'py>,
    t_from: In<'py>,
    t_max: In<'py>,
    d_min: f64,
    q_limit: f64,
    step_days: Option<f64>,
) -> PyResult<Bound<'py, PyDict>> {
    let step_days = step_days.unwrap_or(core::MONTH_STEP_DAYS);
    let (qi, di, b) = (to_vec(&qi, "qi")?, to_vec(&di, "di")?, to_vec(&b, "b")?);
    let (tf, tm) = (to_vec(&t_from, "t_from")?, to_vec(&t_max, "t_max")?);
    let (idx, rows) = detach(py, move || {
        core::forecast_many(&qi, &di, &b, d_min, &tf, q_limit, &tm, step_days)
    })?;
    let out = PyDict::new(py);
    out.set_item(
        "index",
        idx.into_iter()
            .map(|k| k as i64)
            .collect::<Vec<_>>()
            .into_pyarray(py),
    )?;
    out.set_item(
        "t",
        rows.iter()
            .map(|r| r.t)
            .collect::<Vec<_>>()
            .into_pyarray(py),
    )?;
    out.set_item(
        "rate",
        rows.iter()
            .map(|r| r.rate)
            .collect::<Vec<_>>()
            .into_pyarray(py),
    )?;
    out.set_item(
        "volume",
        rows.iter()
            .map(|r| r.volume)
            .collect::<Vec<_>>()
            .into_pyarray(py),
    )?;
    out.set_item(
        "cumulative",
        rows.iter()
            .map(|r| r.cumulative)
            .collect::<Vec<_>>()
            .into_pyarray(py),
    )?;
    Ok(out)
}

pub(super) fn register(m: &Bound<'_, PyModule>) -> PyResult<()> {
    m.add_function(wrap_pyfunction!(arps_rate, m)?)?;
    m.add_function(wrap_pyfunction!(arps_cumulative, m)?)?;
    m.add_function(wrap_pyfunction!(arps_time_to_rate, m)?)?;
    m.add_function(wrap_pyfunction!(arps_eur, m)?)?;
    m.add_function(wrap_pyfunction!(arps_rate_at_cumulative, m)?)?;
    m.add_function(wrap_pyfunction!(arps_remaining, m)?)?;
    m.add_function(wrap_pyfunction!(effective_decline, m)?)?;
    m.add_function(wrap_pyfunction!(nominal_decline, m)?)?;
    m.add_function(wrap_pyfunction!(fit_decline_batch, m)?)?;
    m.add_function(wrap_pyfunction!(forecast_batch, m)?)?;
    Ok(())
}
