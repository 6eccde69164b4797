//! Forecast tables at fixed steps (monthly by default) from an Arps decline.

use super::arps::Arps;
use crate::error::{Error, Result, positive};
use crate::units::DAYS_PER_MONTH;
use rayon::prelude::*;

/// One step of a forecast table.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ForecastStep {
    /// Start of the step, days since the start of the decline.
    pub t: f64,
    /// Mean rate over the step (volume / step length), per day.
    pub rate: f64,
    /// Volume produced in the step, rate x days.
    pub volume: f64,
    /// Volume produced from the forecast start to the end of this step, rate x days.
    pub cumulative: f64,
}

/// Forecast of an Arps decline in steps of `step_days`, from `t_from` days (since the start
/// of the decline) until the rate falls to the economic limit `q_limit` or the horizon
/// `t_max` days is reached; the last step is cut there, so the volumes add up exactly to
/// [`Arps::remaining`].
///
/// # Formula
/// ```text
/// volume_k = Np(min(t_k + step, t_end)) - Np(t_k),  rate_k = volume_k / (step length)
/// t_end = min(time_to_rate(q_limit), t_max)
/// ```
///
/// # Arguments
/// - `arps`: the decline (rates per day, declines nominal per year).
/// - `t_from`: forecast start, days since the start of the decline (>= 0).
/// - `q_limit`: economic-limit rate, per day (>= 0).
/// - `t_max`: horizon, days since the start of the decline (finite).
/// - `step_days`: step length, days (> 0; [`DAYS_PER_MONTH`] = 30.4375 for average months).
///
/// # Returns
/// The steps, possibly none (when `t_from >= t_end`).
///
/// # Errors
/// [`Error::InvalidArgument`] naming `t_from`, `q_limit`, `t_max` or `step_days` (also when the
/// table would have more than [`MAX_FORECAST_STEPS`] steps).
///
/// # Examples
/// ```
/// use stocktank::decline::{Arps, forecast};
/// let a = Arps::new(100.0, 0.5, 0.8, 0.08)?;
/// let steps = forecast(&a, 365.25, 5.0, 40.0 * 365.25, 30.4375)?;
/// let total: f64 = steps.iter().map(|s| s.volume).sum();
/// assert!((total - a.remaining(365.25, 5.0, 40.0 * 365.25)?).abs() < 1e-6);
/// # Ok::<(), stocktank::Error>(())
/// ```
pub fn forecast(
    arps: &Arps,
    t_from: f64,
    q_limit: f64,
    t_max: f64,
    step_days: f64,
) -> Result<Vec<ForecastStep>> {
    crate::error::non_negative("t_from", t_from)?;
    positive("step_days", step_days)?;
    if !t_max.is_finite() {
        return Err(Error::invalid(
            "t_max",
            t_max,
            "must be finite for a forecast table",
        ));
    }
    let t_end = arps.time_to_rate(q_limit)?.min(t_max);
    let mut out = Vec::new();
    if t_from >= t_end {
        return Ok(out);
    }
    let steps = ((t_end - t_from) / step_days).ceil();
    if steps > MAX_FORECAST_STEPS as f64 {
        // A table this long is a mistake in `step_days` or `t_max` (the rows would not fit
        // in memory; reserving them would abort the process).
        return Err(Error::invalid(
            "step_days",
            step_days,
            "gives more than 10,000,000 forecast steps per decline up to t_max or the \
             economic limit; use a longer step or a nearer t_max",
        ));
    }
    let n = steps as usize;
    out.reserve(n);
    let mut np_prev = arps.cumulative(t_from)?;
    let np0 = np_prev;
    for k in 0..n {
        let a = t_from + k as f64 * step_days;
        let b = (a + step_days).min(t_end);
        if b <= a {
            break;
        }
        let np = arps.cumulative(b)?;
        let v = np - np_prev;
        out.push(ForecastStep {
            t: a,
            rate: v / (b - a),
            volume: v,
            cumulative: np - np0,
        });
        np_prev = np;
    }
    Ok(out)
}

/// Forecast tables of many declines in parallel, flattened to long format.
///
/// Decline `k` is `Arps::new(qi[k], di[k], b[k], d_min)` forecast from `t_from[k]` days to
/// `q_limit` or `t_max[k]` days (see [`forecast`]). A decline whose parameters are NaN
/// (a well that could not be fitted) gets no rows.
///
/// # Returns
/// `(index, steps)`: the decline index of each row and the rows, in decline order.
///
/// # Errors
/// [`Error::Shape`] when the slices differ in length; otherwise the first error of
/// [`Arps::new`] or [`forecast`], naming its argument.
///
/// # Examples
/// ```
/// use stocktank::decline::forecast_many;
/// let (idx, rows) = forecast_many(&[100.0, f64::NAN], &[0.5, 0.5], &[0.0, 0.0], 0.0,
///     &[0.0, 0.0], 50.0, &[3650.0, 3650.0], 30.4375)?;
/// assert!(idx.iter().all(|&k| k == 0) && !rows.is_empty());
/// # Ok::<(), stocktank::Error>(())
/// ```
#[allow(clippy::too_many_arguments)]
pub fn forecast_many(
    qi: &[f64],
    di: &[f64],
    b: &[f64],
    d_min: f64,
    t_from: &[f64],
    q_limit: f64,
    t_max: &[f64],
    step_days: f64,
) -> Result<(Vec<usize>, Vec<ForecastStep>)> {
    let n = qi.len();
    for (name, len) in [
        ("di", di.len()),
        ("b", b.len()),
        ("t_from", t_from.len()),
        ("t_max", t_max.len()),
    ] {
        if len != n {
            return Err(Error::Shape(format!(
                "`{name}` has {len} values, `qi` has {n}"
            )));
        }
    }
    let parts: Vec<Result<Vec<ForecastStep>>> = (0..n)
        .into_par_iter()
        .map(|k| {
            if qi[k].is_nan() || di[k].is_nan() || b[k].is_nan() || t_from[k].is_nan() {
                return Ok(Vec::new());
            }
            let a = Arps::new(qi[k], di[k], b[k], d_min).map_err(|e| e.at_index(&[k]))?;
            forecast(&a, t_from[k], q_limit, t_max[k], step_days).map_err(|e| e.at_index(&[k]))
        })
        .collect();
    let mut idx = Vec::new();
    let mut rows = Vec::new();
    for (k, p) in parts.into_iter().enumerate() {
        let p = p?;
        idx.extend(std::iter::repeat_n(k, p.len()));
        rows.extend(p);
    }
    Ok((idx, rows))
}

/// Most steps one forecast table may have (10,000,000: daily steps for 27,000 years).
///
/// # Examples
/// ```
/// assert_eq!(stocktank::decline::MAX_FORECAST_STEPS, 10_000_000);
/// ```
pub const MAX_FORECAST_STEPS: usize = 10_000_000;

/// Default forecast step: one average month, days.
pub const MONTH_STEP_DAYS: f64 = DAYS_PER_MONTH;
