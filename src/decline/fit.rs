//! Robust Arps fits of monthly production, one well or many wells in parallel.
//!
//! # Method
//! For one well, with records `(t_i, q_i)` (days, rate per day):
//! 1. Records are sorted by time. A negative or infinite rate, a non-finite time or a
//!    repeated time makes the well [`FitStatus::InvalidData`]. NaN rates (missing months) and rates equal
//!    to zero (shut-in months) are left out of the fit; calendar time is kept, so the decline
//!    continues through a shut-in.
//! 2. The decline starts at the peak producing rate ([`Start::Peak`], which skips an early
//!    ramp-up), at the first producing record ([`Start::First`]), or at the first producing
//!    record at or after a user start time.
//! 3. The fit minimises, over `theta = (ln qi, ln di, b)` within bounds on `di` and `b`,
//!    ```text
//!    cost(theta) = 1/2 sum_i C^2 rho(r_i^2 / C^2),   r_i = ln q_i - ln q(t_i - t0; theta)
//!    ```
//!    with `rho(z) = z` (`linear`), `2 (sqrt(1 + z) - 1)` (`soft_l1`) or
//!    `z` for `z <= 1`, `2 sqrt(z) - 1` otherwise (`huber`), and `C` = `f_scale` (in units
//!    of ln rate: 0.2 is about a 20 % deviation). This is the objective of
//!    `scipy.optimize.least_squares(fun, x0, loss=..., f_scale=C, bounds=...)`. Log rates make
//!    the noise of monthly rates (roughly proportional to the rate) homogeneous.
//! 4. The minimiser is a bounded Levenberg-Marquardt on the iteratively reweighted
//!    Gauss-Newton model (weights `rho'(z_i)`), with an active set for parameters on a bound,
//!    started from the best (lowest cost) of five two-point hyperbolas through the smoothed
//!    ends of the history, one per `b` of an even grid over the bounds. It stops when the relative decrease of the cost, the relative step or the
//!    projected gradient falls below [`FitOptions::tol`], and reports how it ended.
//! 5. Standard errors come from the weighted Gauss-Newton Hessian at the optimum scaled by
//!    the residual variance `2 cost / (n - p)` (asymptotic; approximate for robust losses);
//!    a parameter on a bound has no standard error (NaN).
//! 6. Volumes: `cum_produced` is the measured volume, each record's rate times the time to
//!    the next record (the last record uses the previous spacing; missing months count 0).
//!    `remaining` is the Arps volume (with the terminal decline `d_min`) from the end of the
//!    last producing record's period (`t_forecast`, where the measured volume stops) to the
//!    economic limit `q_limit` or the horizon (counted from `t_forecast`), and
//!    `eur = cum_produced + remaining`.
//! 7. EUR range by residual bootstrap (Efron and Tibshirani 1993, ch. 9): the log residuals
//!    of the fit are resampled with replacement onto the fitted curve, each synthetic history
//!    is refitted, and the EUR percentiles are reported as P90 (the low value, 10th
//!    percentile), P50 and P10 (high, 90th percentile), linear interpolation between order
//!    statistics. The generator is seeded from `seed` and a hash of the well's own data, so a
//!    well's result does not depend on the batch, the partition or the thread it ran in.
//!
//! The results are screening estimates.
//!
//! # References
//! - Arps, J.J. (1945). Analysis of Decline Curves. Trans. AIME 160(1), 228-247.
//! - Levenberg, K. (1944). Quart. Appl. Math. 2, 164-168; Marquardt, D.W. (1963). J. SIAM
//!   11(2), 431-441.
//! - Huber, P.J. (1964). Robust Estimation of a Location Parameter. Ann. Math. Statist.
//!   35(1), 73-101.
//! - Triggs, B. et al. (2000). Bundle Adjustment - A Modern Synthesis (robust losses in least
//!   squares, the soft-L1 form), LNCS 1883, 298-372.
//! - Efron, B. and Tibshirani, R.J. (1993). An Introduction to the Bootstrap. Chapman & Hall.

// Index loops over the 3 parameters read like the formulas they implement.
#![allow(clippy::needless_range_loop)]

use super::arps::Arps;
use crate::error::{Error, Result};
use crate::units::{DAYS_PER_MONTH, DAYS_PER_YEAR};
use rayon::prelude::*;

/// Robust loss applied to the log-rate residuals.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum Loss {
    /// Ordinary least squares, `rho(z) = z`.
    Linear,
    /// Smooth L1, `rho(z) = 2 (sqrt(1 + z) - 1)`.
    #[default]
    SoftL1,
    /// Huber (1964), `rho(z) = z` for `z <= 1`, else `2 sqrt(z) - 1`.
    Huber,
}

impl Loss {
    /// Parse `"linear"`, `"soft_l1"` or `"huber"`.
    ///
    /// # Errors
    /// [`Error::InvalidOption`] naming `loss`.
    ///
    /// # Examples
    /// ```
    /// assert!(stocktank::decline::Loss::parse("huber").is_ok());
    /// ```
    pub fn parse(s: &str) -> Result<Self> {
        match s {
            "linear" => Ok(Loss::Linear),
            "soft_l1" => Ok(Loss::SoftL1),
            "huber" => Ok(Loss::Huber),
            _ => Err(Error::InvalidOption {
                arg: "loss",
                value: s.to_string(),
                allowed: "linear, soft_l1, huber",
            }),
        }
    }

    /// `(rho(z), rho'(z))`.
    #[inline(always)]
    fn rho(self, z: f64) -> (f64, f64) {
        match self {
            Loss::Linear => (z, 1.0),
            Loss::SoftL1 => {
                let s = (1.0 + z).sqrt();
                (2.0 * (s - 1.0), 1.0 / s)
            }
            Loss::Huber => {
                if z <= 1.0 {
                    (z, 1.0)
                } else {
                    let s = z.sqrt();
                    (2.0 * s - 1.0, 1.0 / s)
                }
            }
        }
    }
}

/// Where the fitted decline starts.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum Start {
    /// At the highest producing rate (skips an early ramp-up).
    #[default]
    Peak,
    /// At the first producing record.
    First,
}

impl Start {
    /// Parse `"peak"` or `"first"`.
    ///
    /// # Errors
    /// [`Error::InvalidOption`] naming `start`.
    ///
    /// # Examples
    /// ```
    /// assert!(stocktank::decline::Start::parse("peak").is_ok());
    /// ```
    pub fn parse(s: &str) -> Result<Self> {
        match s {
            "peak" => Ok(Start::Peak),
            "first" => Ok(Start::First),
            _ => Err(Error::InvalidOption {
                arg: "start",
                value: s.to_string(),
                allowed: "peak, first",
            }),
        }
    }
}

/// Options of a decline fit. Build with [`FitOptions::default`] and adjust fields, then call
/// [`FitOptions::validate`] (the fit functions do).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FitOptions {
    /// Robust loss (default soft-L1).
    pub loss: Loss,
    /// Residual scale `C` of the loss, in ln-rate units (default 0.2); > 0.
    pub f_scale: f64,
    /// Bounds on `b` (default 0 to 2).
    pub b_bounds: (f64, f64),
    /// Bounds on the initial nominal decline `di`, per year (default 0.001 to 50).
    pub di_bounds: (f64, f64),
    /// Where the decline starts (default the peak).
    pub start: Start,
    /// Fewest producing records from the start needed to fit (default 6, at least 4).
    pub min_points: usize,
    /// Economic-limit rate, per day (default 1.0); >= 0.
    pub q_limit: f64,
    /// Terminal nominal decline for the forecast, per year (default 0 = none); >= 0.
    pub d_min: f64,
    /// Longest forecast after the last producing record, years (default 50); > 0 or inf.
    pub horizon_years: f64,
    /// Bootstrap refits for the EUR range (default 100; 0 = no range).
    pub n_bootstrap: usize,
    /// Seed of the bootstrap (default 0).
    pub seed: u64,
    /// Iteration limit of the minimiser (default 200).
    pub max_iter: usize,
    /// Relative tolerance on cost decrease, step and projected gradient (default 1e-8, as the `ftol` default of
    /// scipy.optimize.least_squares).
    pub tol: f64,
}

impl Default for FitOptions {
    fn default() -> Self {
        Self {
            loss: Loss::SoftL1,
            f_scale: 0.2,
            b_bounds: (0.0, 2.0),
            di_bounds: (1e-3, 50.0),
            start: Start::Peak,
            min_points: 6,
            q_limit: 1.0,
            d_min: 0.0,
            horizon_years: 50.0,
            n_bootstrap: 100,
            seed: 0,
            max_iter: 200,
            tol: 1e-8,
        }
    }
}

impl FitOptions {
    /// Check every option.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming the option (`f_scale`, `b_min`, `b_max`, `di_min`,
    /// `di_max`, `min_points`, `q_limit`, `d_min`, `horizon_years`, `tol`).
    ///
    /// # Examples
    /// ```
    /// let mut o = stocktank::decline::FitOptions::default();
    /// assert!(o.validate().is_ok());
    /// o.b_bounds = (1.0, 0.5);
    /// assert!(o.validate().is_err());
    /// ```
    pub fn validate(&self) -> Result<()> {
        crate::error::positive("f_scale", self.f_scale)?;
        let (b0, b1) = self.b_bounds;
        crate::error::non_negative("b_min", b0)?;
        if !(b1.is_finite() && b1 >= b0) {
            return Err(Error::invalid("b_max", b1, "must be finite and >= b_min"));
        }
        let (d0, d1) = self.di_bounds;
        crate::error::positive("di_min", d0)?;
        if !(d1.is_finite() && d1 >= d0) {
            return Err(Error::invalid("di_max", d1, "must be finite and >= di_min"));
        }
        if self.min_points < 4 {
            return Err(Error::invalid(
                "min_points",
                self.min_points as f64,
                "must be >= 4 (3 parameters and one degree of freedom)",
            ));
        }
        crate::error::non_negative("q_limit", self.q_limit)?;
        crate::error::non_negative("d_min", self.d_min)?;
        if self.horizon_years.is_nan() || self.horizon_years <= 0.0 {
            return Err(Error::invalid(
                "horizon_years",
                self.horizon_years,
                "must be > 0",
            ));
        }
        crate::error::positive("tol", self.tol)?;
        Ok(())
    }
}

/// Outcome of one well's fit.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum FitStatus {
    /// Fitted; the minimiser met its tolerance.
    Ok,
    /// Fitted, but the iteration limit was reached first (parameters are the best found).
    IterationLimit,
    /// No producing record (all rates zero, negative-free but missing, or none at all).
    NoProduction,
    /// Fewer producing records from the start than `min_points`.
    TooFewPoints,
    /// The log rate rises from the start on: there is no decline to fit.
    NotDeclining,
    /// A negative or infinite rate, a non-finite time or a repeated time.
    InvalidData,
    /// The minimiser produced no finite optimum.
    Failed,
}

impl FitStatus {
    /// The status as a short snake-case word (`"ok"`, `"iteration_limit"`, ...).
    ///
    /// # Examples
    /// ```
    /// assert_eq!(stocktank::decline::FitStatus::TooFewPoints.as_str(), "too_few_points");
    /// ```
    pub fn as_str(self) -> &'static str {
        match self {
            FitStatus::Ok => "ok",
            FitStatus::IterationLimit => "iteration_limit",
            FitStatus::NoProduction => "no_production",
            FitStatus::TooFewPoints => "too_few_points",
            FitStatus::NotDeclining => "not_declining",
            FitStatus::InvalidData => "invalid_data",
            FitStatus::Failed => "failed",
        }
    }

    /// True when parameters are available (`Ok` or `IterationLimit`).
    ///
    /// # Examples
    /// ```
    /// assert!(stocktank::decline::FitStatus::Ok.fitted());
    /// ```
    pub fn fitted(self) -> bool {
        matches!(self, FitStatus::Ok | FitStatus::IterationLimit)
    }
}

/// The result of fitting one well. Times are in the caller's time axis (days); rates per
/// day; volumes rate x days; declines nominal per year. Fields that do not apply (a well
/// that could not be fitted) are NaN.
#[derive(Debug, Clone, PartialEq)]
pub struct WellFit {
    /// Outcome.
    pub status: FitStatus,
    /// Why the well was not fitted, or an empty string.
    pub message: String,
    /// Fitted initial rate at `t0`, per day.
    pub qi: f64,
    /// Fitted initial nominal decline, per year.
    pub di: f64,
    /// Fitted Arps exponent.
    pub b: f64,
    /// Standard error of `qi`, per day (NaN on a bound).
    pub qi_se: f64,
    /// Standard error of `di`, per year (NaN on a bound).
    pub di_se: f64,
    /// Standard error of `b` (NaN on a bound).
    pub b_se: f64,
    /// True when `b` ended on one of its bounds.
    pub b_at_bound: bool,
    /// True when `di` ended on one of its bounds.
    pub di_at_bound: bool,
    /// Start of the decline, days (caller's time axis).
    pub t0: f64,
    /// Last producing record, days (caller's time axis).
    pub t_last: f64,
    /// Producing records used in the fit.
    pub n_used: usize,
    /// Records excluded from the fit: missing, shut-in (zero) and before the start.
    pub n_excluded: usize,
    /// Final cost `1/2 sum C^2 rho(r^2/C^2)`.
    pub cost: f64,
    /// Root mean square of the log residuals, `sqrt(sum r^2 / (n - 3))` (about the relative
    /// scatter of the rates).
    pub rmse_log: f64,
    /// Coefficient of determination of the log rates.
    pub r2_log: f64,
    /// Iterations of the minimiser (winning start).
    pub iterations: usize,
    /// Measured volume of all records, rate x days.
    pub cum_produced: f64,
    /// Start of the forecast, days (caller's axis): the end of the last producing record's
    /// period (its time plus the spacing to the next record), where `cum_produced` stops.
    pub t_forecast: f64,
    /// Forecast volume from `t_forecast` to the economic limit or horizon, rate x days.
    pub remaining: f64,
    /// `cum_produced + remaining`.
    pub eur: f64,
    /// Time at which the forecast stops (economic limit or horizon), days (caller's axis).
    pub t_end: f64,
    /// Low EUR estimate (10th percentile of the bootstrap), rate x days.
    pub eur_p90: f64,
    /// Median EUR of the bootstrap, rate x days.
    pub eur_p50: f64,
    /// High EUR estimate (90th percentile of the bootstrap), rate x days.
    pub eur_p10: f64,
}

impl WellFit {
    fn failed(status: FitStatus, message: String) -> Self {
        let n = f64::NAN;
        WellFit {
            status,
            message,
            qi: n,
            di: n,
            b: n,
            qi_se: n,
            di_se: n,
            b_se: n,
            b_at_bound: false,
            di_at_bound: false,
            t0: n,
            t_last: n,
            t_forecast: n,
            n_used: 0,
            n_excluded: 0,
            cost: n,
            rmse_log: n,
            r2_log: n,
            iterations: 0,
            cum_produced: n,
            remaining: n,
            eur: n,
            t_end: n,
            eur_p90: n,
            eur_p50: n,
            eur_p10: n,
        }
    }

    /// The fitted decline with the forecast's terminal decline `d_min` (per year).
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] when the well has no fitted parameters.
    ///
    /// # Examples
    /// ```
    /// use stocktank::decline::{fit_well, FitOptions};
    /// let t: Vec<f64> = (0..36).map(|m| m as f64 * 30.4375).collect();
    /// let q: Vec<f64> = t.iter().map(|&t| 500.0 / (1.0 + 0.5 * 1.2 * t / 365.25).powf(2.0)).collect();
    /// let f = fit_well(&t, &q, None, &FitOptions { n_bootstrap: 0, ..Default::default() }).unwrap();
    /// assert!((f.arps(0.0).unwrap().qi - 500.0).abs() < 1e-3);
    /// ```
    pub fn arps(&self, d_min: f64) -> Result<Arps> {
        Arps::new(self.qi, self.di, self.b, d_min)
    }
}

// ---------------------------------------------------------------------------------------
// The model in the fitted parameters theta = (ln qi, ln di, b), time in years from t0.

/// Below this `b x` the fit's model uses a series (relative error below 1e-12); above it,
/// `ln(1 + b x)` (faster than `ln_1p` and, from 1e-3 on, accurate to about 1e-13).
const SERIES_BX: f64 = 1e-3;

/// ln(qi/q) = ln(1 + b x)/b and its derivative with respect to b, at `x = di tau`.
#[inline(always)]
fn log_ratio_db(b: f64, x: f64) -> (f64, f64) {
    let bx = b * x;
    if bx.abs() < SERIES_BX {
        // series of ln(1 + b x)/b and its b-derivative around b x = 0
        let x2 = x * x;
        let (b2, x3) = (b * b, x2 * x);
        (
            x - 0.5 * b * x2 + b2 * x3 / 3.0 - 0.25 * b2 * b * x3 * x,
            -0.5 * x2 + 2.0 / 3.0 * b * x3 - 0.75 * b2 * x3 * x + 0.8 * b2 * b * x3 * x2,
        )
    } else {
        let lp = (1.0 + bx).ln() / b;
        (lp, (x / (1.0 + bx) - lp) / b)
    }
}

/// ln(qi/q) = ln(1 + b x)/b at `x = di tau` (value only).
#[inline(always)]
fn log_ratio(b: f64, x: f64) -> f64 {
    let bx = b * x;
    if bx.abs() < SERIES_BX {
        x * (1.0 - 0.5 * bx + bx * bx / 3.0 - 0.25 * bx * bx * bx)
    } else {
        (1.0 + bx).ln() / b
    }
}

/// Inverse of [`log_ratio`] in x: `(exp(b l) - 1) / b`, `l` at `b = 0`.
#[inline]
fn x_from_log_ratio(b: f64, l: f64) -> f64 {
    let y = b * l;
    if b == 0.0 {
        l
    } else if y.abs() < 1e-5 {
        l * (1.0 + y * (0.5 + y / 6.0))
    } else {
        y.exp_m1() / b
    }
}

/// ln q and its gradient with respect to theta = (ln qi, ln di, b) at `tau` years.
#[cfg(test)]
#[inline(always)]
fn model(theta: &[f64; 3], tau: f64) -> (f64, [f64; 3]) {
    let di = theta[1].exp();
    let b = theta[2];
    let x = di * tau;
    let (l, dl_db) = log_ratio_db(b, x);
    (theta[0] - l, [1.0, -x / (1.0 + b * x), -dl_db])
}

/// ln q at `tau` years.
#[inline(always)]
fn model_value(theta: &[f64; 3], tau: f64) -> f64 {
    theta[0] - log_ratio(theta[2], theta[1].exp() * tau)
}

/// Cost of theta on every `stride`-th point of (tau, y) (a cheap screen of starts).
#[inline]
fn cost_strided(
    theta: &[f64; 3],
    tau: &[f64],
    y: &[f64],
    loss: Loss,
    c: f64,
    stride: usize,
) -> f64 {
    let inv_c2 = 1.0 / (c * c);
    let (a, di, b) = (theta[0], theta[1].exp(), theta[2]);
    let mut s = 0.0;
    for (&t, &yy) in tau.iter().zip(y).step_by(stride) {
        let r = yy - a + log_ratio(b, di * t);
        s += loss.rho(r * r * inv_c2).0;
    }
    0.5 * c * c * s
}

/// Cost of theta on data (tau, y).
#[cfg(test)]
#[inline]
fn cost(theta: &[f64; 3], tau: &[f64], y: &[f64], loss: Loss, c: f64) -> f64 {
    let inv_c2 = 1.0 / (c * c);
    let (a, di, b) = (theta[0], theta[1].exp(), theta[2]);
    let mut s = 0.0;
    for (&t, &yy) in tau.iter().zip(y) {
        let r = yy - a + log_ratio(b, di * t);
        s += loss.rho(r * r * inv_c2).0;
    }
    0.5 * c * c * s
}

struct Bounds {
    lo: [f64; 3],
    hi: [f64; 3],
}

struct Solution {
    theta: [f64; 3],
    cost: f64,
    iterations: usize,
    converged: bool,
    active: [bool; 3],
    /// Weighted Gauss-Newton Hessian at the optimum.
    h: [[f64; 3]; 3],
}

/// Solve the symmetric system `a x = g` on the free indices; None if singular.
fn solve_free(a: &[[f64; 3]; 3], g: &[f64; 3], free: &[bool; 3]) -> Option<[f64; 3]> {
    let idx: Vec<usize> = (0..3).filter(|&i| free[i]).collect();
    let n = idx.len();
    let mut m = [[0.0; 4]; 3];
    for (r, &i) in idx.iter().enumerate() {
        for (c, &j) in idx.iter().enumerate() {
            m[r][c] = a[i][j];
        }
        m[r][3] = g[i];
    }
    // Gaussian elimination with partial pivoting on an n x n system (n <= 3).
    for col in 0..n {
        let p = (col..n).max_by(|&x, &y| m[x][col].abs().total_cmp(&m[y][col].abs()))?;
        if m[p][col].is_nan() || m[p][col].abs() <= 1e-300 {
            return None;
        }
        m.swap(col, p);
        for r in 0..n {
            if r != col {
                let f = m[r][col] / m[col][col];
                for c in col..4 {
                    m[r][c] -= f * m[col][c];
                }
            }
        }
    }
    let mut x = [0.0; 3];
    for (r, &i) in idx.iter().enumerate() {
        x[i] = m[r][3] / m[r][r];
        if !x[i].is_finite() {
            return None;
        }
    }
    Some(x)
}

/// Inverse of the free block of a symmetric 3x3 matrix (NaN rows/columns for fixed ones).
fn inverse_free(a: &[[f64; 3]; 3], free: &[bool; 3]) -> Option<[[f64; 3]; 3]> {
    let mut inv = [[f64::NAN; 3]; 3];
    for k in 0..3 {
        if !free[k] {
            continue;
        }
        let mut e = [0.0; 3];
        e[k] = 1.0;
        let col = solve_free(a, &e, free)?;
        for i in 0..3 {
            if free[i] {
                inv[i][k] = col[i];
            }
        }
    }
    Some(inv)
}

/// Bounded, reweighted Levenberg-Marquardt from `theta0`.
fn minimise(
    theta0: [f64; 3],
    tau: &[f64],
    y: &[f64],
    bounds: &Bounds,
    opts: &FitOptions,
    max_iter: usize,
) -> Solution {
    let c = opts.f_scale;
    let inv_c2 = 1.0 / (c * c);
    let loss = opts.loss;
    let mut theta = theta0;
    for k in 0..3 {
        theta[k] = theta[k].clamp(bounds.lo[k], bounds.hi[k]);
    }
    // cost, gradient and weighted Gauss-Newton Hessian in one pass (r = y - m, dr = -dm)
    let eval = |theta: &[f64; 3]| -> (f64, [f64; 3], [[f64; 3]; 3]) {
        let mut s = 0.0;
        let mut g = [0.0; 3];
        let mut h = [[0.0; 3]; 3];
        let (a0, di, b) = (theta[0], theta[1].exp(), theta[2]);
        let inv_b = 1.0 / b;
        for (&t, &yy) in tau.iter().zip(y) {
            let x = di * t;
            let bx = b * x;
            let inv_1pbx = 1.0 / (1.0 + bx);
            let (l, dl_db) = if bx.abs() < SERIES_BX {
                log_ratio_db(b, x)
            } else {
                // ln(1 + b x)/b and (b x/(1 + b x) - ln(1 + b x))/b^2, one division
                let lp = (1.0 + bx).ln() * inv_b;
                (lp, (x * inv_1pbx - lp) * inv_b)
            };
            let dm = [1.0, -x * inv_1pbx, -dl_db];
            let r = yy - a0 + l;
            let (rho, w) = loss.rho(r * r * inv_c2);
            s += rho;
            for i in 0..3 {
                g[i] -= w * r * dm[i];
                for j in 0..=i {
                    h[i][j] += w * dm[i] * dm[j];
                }
            }
        }
        for i in 0..3 {
            for j in 0..i {
                h[j][i] = h[i][j];
            }
        }
        (0.5 * c * c * s, g, h)
    };
    let (mut f, mut g, mut h) = eval(&theta);
    let mut lambda = 1e-3;
    let mut converged = false;
    let mut iterations = 0;
    let mut active;
    loop {
        // active set: on a bound with the descent direction pointing outward
        let on_lo = |k: usize| theta[k] <= bounds.lo[k] && g[k] > 0.0;
        let on_hi = |k: usize| theta[k] >= bounds.hi[k] && g[k] < 0.0;
        active = std::array::from_fn(|k| on_lo(k) || on_hi(k));
        let free: [bool; 3] = std::array::from_fn(|k| !active[k]);
        let gnorm = (0..3)
            .filter(|&k| free[k])
            .map(|k| g[k].abs())
            .fold(0.0, f64::max);
        if gnorm <= opts.tol * (1.0 + f) {
            converged = true;
            break;
        }
        if converged || iterations >= max_iter {
            break;
        }
        iterations += 1;
        let mut accepted = false;
        for _ in 0..30 {
            let mut a = h;
            for k in 0..3 {
                a[k][k] += lambda * h[k][k].max(1e-12);
            }
            let neg_g = [-g[0], -g[1], -g[2]];
            let Some(step) = solve_free(&a, &neg_g, &free) else {
                lambda *= 10.0;
                continue;
            };
            let mut trial = theta;
            for k in 0..3 {
                if free[k] {
                    trial[k] = (theta[k] + step[k]).clamp(bounds.lo[k], bounds.hi[k]);
                }
            }
            let (f_new, g_new, h_new) = eval(&trial);
            if f_new.is_finite() && f_new < f {
                let step_norm = (0..3)
                    .map(|k| (trial[k] - theta[k]).abs() / (1.0 + theta[k].abs()))
                    .fold(0.0, f64::max);
                let df = f - f_new;
                theta = trial;
                (f, g, h) = (f_new, g_new, h_new);
                lambda = (lambda / 3.0).max(1e-12);
                accepted = true;
                if df <= opts.tol * f.max(1e-300) || step_norm <= opts.tol {
                    converged = true;
                }
                break;
            }
            lambda *= 4.0;
            if lambda > 1e16 {
                break;
            }
        }
        if !accepted {
            // no damped step lowers the cost: a (local) minimum to working precision
            converged = true;
            break;
        }
    }
    Solution {
        theta,
        cost: f,
        iterations,
        converged,
        active,
        h,
    }
}

// ---------------------------------------------------------------------------------------
// Deterministic per-well random numbers (SplitMix64; Steele, Lea and Flood 2014).

struct SplitMix64(u64);

impl SplitMix64 {
    #[inline]
    fn next_u64(&mut self) -> u64 {
        self.0 = self.0.wrapping_add(0x9E37_79B9_7F4A_7C15);
        let mut z = self.0;
        z = (z ^ (z >> 30)).wrapping_mul(0xBF58_476D_1CE4_E5B9);
        z = (z ^ (z >> 27)).wrapping_mul(0x94D0_49BB_1331_11EB);
        z ^ (z >> 31)
    }
    /// Uniform integer in `0..n` (multiply-shift; the bias is below 2^-32 for n < 2^32).
    #[inline]
    fn below(&mut self, n: usize) -> usize {
        (((self.next_u64() >> 32) * n as u64) >> 32) as usize
    }
}

/// FNV-1a hash of the bits of a well's data, mixed with the user's seed.
fn well_seed(seed: u64, t: &[f64], q: &[f64]) -> u64 {
    let mut h: u64 = 0xcbf2_9ce4_8422_2325 ^ seed;
    for v in t.iter().chain(q) {
        for byte in v.to_bits().to_le_bytes() {
            h ^= byte as u64;
            h = h.wrapping_mul(0x0000_0100_0000_01B3);
        }
    }
    h
}

/// Percentile of sorted data by linear interpolation between order statistics (the
/// default of `numpy.percentile`).
fn percentile_sorted(v: &[f64], p: f64) -> f64 {
    if v.is_empty() {
        return f64::NAN;
    }
    let pos = p / 100.0 * (v.len() - 1) as f64;
    let lo = pos.floor() as usize;
    let hi = pos.ceil() as usize;
    v[lo] + (pos - lo as f64) * (v[hi] - v[lo])
}

// ---------------------------------------------------------------------------------------

/// Fit an Arps decline to one well's production history, robustly.
///
/// See the module documentation of `stocktank::decline` (fitting section) for the method.
///
/// # Arguments
/// - `t`: record times, days on any fixed origin (e.g. days since 1970-01-01); any order.
/// - `q`: rates at those times, per day (STB/d or Mscf/d); NaN = missing, 0 = shut in.
/// - `start_time`: optional start of the decline, days on the same axis (overrides
///   [`FitOptions::start`]); NaN means none.
/// - `opts`: options; see [`FitOptions`].
///
/// # Returns
/// A [`WellFit`]. A well that cannot be fitted is not an error: its `status` and `message`
/// say why.
///
/// # Errors
/// [`Error::Shape`] when `t` and `q` differ in length; [`Error::InvalidArgument`] for an
/// invalid option.
///
/// # Examples
/// ```
/// use stocktank::decline::{fit_well, FitOptions, FitStatus};
/// let t: Vec<f64> = (0..48).map(|m| m as f64 * 30.4375).collect();
/// let q: Vec<f64> = t.iter().map(|&t| stocktank::decline::rate(800.0, 1.5, 0.8, 0.0, t).unwrap()).collect();
/// let f = fit_well(&t, &q, None, &FitOptions { n_bootstrap: 0, ..Default::default() })?;
/// assert_eq!(f.status, FitStatus::Ok);
/// assert!((f.b - 0.8).abs() < 1e-6 && (f.di - 1.5).abs() < 1e-6);
/// # Ok::<(), stocktank::Error>(())
/// ```
///
/// # References
/// Arps (1945); Levenberg (1944); Marquardt (1963); Huber (1964); Efron and Tibshirani
/// (1993) -- see the module documentation.
pub fn fit_well(
    t: &[f64],
    q: &[f64],
    start_time: Option<f64>,
    opts: &FitOptions,
) -> Result<WellFit> {
    if t.len() != q.len() {
        return Err(Error::Shape(format!(
            "`t` has {} records but `q` has {}",
            t.len(),
            q.len()
        )));
    }
    opts.validate()?;
    Ok(fit_checked(t, q, start_time, opts))
}

fn fit_checked(t: &[f64], q: &[f64], start_time: Option<f64>, opts: &FitOptions) -> WellFit {
    // 1. sort and check records
    let mut order: Vec<usize> = (0..t.len()).collect();
    let sorted = t.windows(2).all(|w| w[0] < w[1]);
    if !sorted {
        order.sort_by(|&i, &j| t[i].total_cmp(&t[j]));
    }
    for (k, &i) in order.iter().enumerate() {
        if !t[i].is_finite() {
            return WellFit::failed(
                FitStatus::InvalidData,
                format!("time {} at the well's record {i} is not finite", t[i]),
            );
        }
        if q[i] < 0.0 {
            return WellFit::failed(
                FitStatus::InvalidData,
                format!(
                    "negative rate {} at the well's record {i} (time {})",
                    q[i], t[i]
                ),
            );
        }
        if q[i] == f64::INFINITY {
            // Not a missing month (NaN): an overflowed or mistyped rate, which would
            // otherwise turn the trend test into NaN and report "not declining".
            return WellFit::failed(
                FitStatus::InvalidData,
                format!("infinite rate at the well's record {i} (time {})", t[i]),
            );
        }
        if k > 0 && t[order[k - 1]] == t[i] {
            return WellFit::failed(
                FitStatus::InvalidData,
                format!("time {} repeats at records {} and {i}", t[i], order[k - 1]),
            );
        }
    }
    // measured volume: rate x time to the next record (last: previous spacing)
    let n = order.len();
    let mut cum_produced = 0.0;
    let mut t_forecast = f64::NAN;
    for k in 0..n {
        let i = order[k];
        let dt = if k + 1 < n {
            t[order[k + 1]] - t[i]
        } else if n > 1 {
            t[i] - t[order[k - 1]]
        } else {
            DAYS_PER_MONTH
        };
        if q[i] > 0.0 {
            cum_produced += q[i] * dt;
            t_forecast = t[i] + dt;
        }
    }
    let producing: Vec<usize> = order.iter().copied().filter(|&i| q[i] > 0.0).collect();
    if producing.is_empty() {
        return WellFit::failed(
            FitStatus::NoProduction,
            format!("no producing record among {n} (all rates zero or missing)"),
        );
    }
    // 2. start of the decline
    let start_pos = match start_time {
        Some(s) if !s.is_nan() => match producing.iter().position(|&i| t[i] >= s) {
            Some(p) => p,
            None => {
                return WellFit::failed(
                    FitStatus::TooFewPoints,
                    format!("no producing record at or after the start time {s}"),
                );
            }
        },
        _ => match opts.start {
            Start::First => 0,
            Start::Peak => {
                let mut best = 0;
                for (p, &i) in producing.iter().enumerate() {
                    if q[i] > q[producing[best]] {
                        best = p;
                    }
                }
                best
            }
        },
    };
    let used = &producing[start_pos..];
    let n_used = used.len();
    if n_used < opts.min_points {
        return WellFit::failed(
            FitStatus::TooFewPoints,
            format!(
                "{n_used} producing records from the start of the decline, need {}",
                opts.min_points
            ),
        );
    }
    let t0 = t[used[0]];
    let t_last = t[*producing.last().expect("non-empty")];
    let tau: Vec<f64> = used.iter().map(|&i| (t[i] - t0) / DAYS_PER_YEAR).collect();
    let y: Vec<f64> = used.iter().map(|&i| q[i].ln()).collect();

    // log-linear regression: initial values and the declining check
    let nf = n_used as f64;
    let mt = tau.iter().sum::<f64>() / nf;
    let my = y.iter().sum::<f64>() / nf;
    let (mut sty, mut stt) = (0.0, 0.0);
    for (&a, &b) in tau.iter().zip(&y) {
        sty += (a - mt) * (b - my);
        stt += (a - mt) * (a - mt);
    }
    let slope = sty / stt;
    if slope.is_nan() || slope >= 0.0 {
        return WellFit::failed(
            FitStatus::NotDeclining,
            format!("log rate does not fall from the start (trend {slope:+.4} per year)"),
        );
    }

    // 3-4. start: the best of a few two-point hyperbolas through the smoothed ends of the
    // history (one per b of a grid over the bounds), then the minimiser from there
    let bounds = Bounds {
        lo: [f64::NEG_INFINITY, opts.di_bounds.0.ln(), opts.b_bounds.0],
        hi: [f64::INFINITY, opts.di_bounds.1.ln(), opts.b_bounds.1],
    };
    let k3 = 3.min(n_used / 2);
    let a0 = y[..k3].iter().sum::<f64>() / k3 as f64;
    let y_end = y[n_used - k3..].iter().sum::<f64>() / k3 as f64;
    let tau_end = tau[n_used - k3..].iter().sum::<f64>() / k3 as f64
        - tau[..k3].iter().sum::<f64>() / k3 as f64;
    let drop = (a0 - y_end).max(1e-3);
    let mut theta0 = [a0, (-slope).max(opts.di_bounds.0).ln(), opts.b_bounds.0];
    let mut best_cost = f64::INFINITY;
    const GRID: usize = 5;
    let stride = n_used.div_ceil(40);
    for g in 0..GRID {
        let b =
            opts.b_bounds.0 + (opts.b_bounds.1 - opts.b_bounds.0) * g as f64 / (GRID - 1) as f64;
        let di = x_from_log_ratio(b, drop) / tau_end.max(1e-9);
        let cand = [a0, di.clamp(opts.di_bounds.0, opts.di_bounds.1).ln(), b];
        let c = cost_strided(&cand, &tau, &y, opts.loss, opts.f_scale, stride);
        if c < best_cost {
            best_cost = c;
            theta0 = cand;
        }
    }
    let sol = minimise(theta0, &tau, &y, &bounds, opts, opts.max_iter);
    if !sol.theta.iter().all(|v| v.is_finite()) || !sol.cost.is_finite() {
        return WellFit::failed(FitStatus::Failed, "no finite optimum".to_string());
    }
    let theta = sol.theta;
    let (qi, di, b) = (theta[0].exp(), theta[1].exp(), theta[2]);

    // 5. goodness of fit and standard errors
    let mut ss_res = 0.0;
    let mut ss_tot = 0.0;
    let mut resid = Vec::with_capacity(n_used);
    let mut fitted = Vec::with_capacity(n_used);
    for (&tt, &yy) in tau.iter().zip(&y) {
        let m = model_value(&theta, tt);
        resid.push(yy - m);
        fitted.push(m);
        ss_res += (yy - m) * (yy - m);
        ss_tot += (yy - my) * (yy - my);
    }
    let dof = (nf - 3.0).max(1.0);
    let s2 = 2.0 * sol.cost / dof;
    let at_bound: [bool; 3] =
        std::array::from_fn(|k| theta[k] <= bounds.lo[k] || theta[k] >= bounds.hi[k]);
    let free: [bool; 3] = std::array::from_fn(|k| !(at_bound[k] || sol.active[k]));
    let (mut se_a, mut se_u, mut se_b) = (f64::NAN, f64::NAN, f64::NAN);
    if let Some(inv) = inverse_free(&sol.h, &free) {
        se_a = (s2 * inv[0][0]).sqrt();
        se_u = (s2 * inv[1][1]).sqrt();
        se_b = (s2 * inv[2][2]).sqrt();
    }

    // 6. volumes
    let horizon = opts.horizon_years * DAYS_PER_YEAR;
    let volumes = |qi: f64, di: f64, b: f64| -> (f64, f64) {
        match Arps::new(qi, di, b, opts.d_min) {
            Ok(a) => {
                let from = t_forecast - t0;
                let t_end = a
                    .time_to_rate(opts.q_limit)
                    .unwrap_or(f64::NAN)
                    .min(from + horizon)
                    .max(from);
                (
                    a.remaining(from, opts.q_limit, from + horizon)
                        .unwrap_or(f64::NAN),
                    t_end,
                )
            }
            Err(_) => (f64::NAN, f64::NAN),
        }
    };
    let (remaining, t_end_rel) = volumes(qi, di, b);

    // 7. bootstrap
    let (mut p90, mut p50, mut p10) = (f64::NAN, f64::NAN, f64::NAN);
    if opts.n_bootstrap > 0 {
        let mut rng = SplitMix64(well_seed(opts.seed, &tau, &y));
        let mut ystar = vec![0.0; n_used];
        let mut eurs = Vec::with_capacity(opts.n_bootstrap);
        for _ in 0..opts.n_bootstrap {
            for k in 0..n_used {
                ystar[k] = fitted[k] + resid[rng.below(n_used)];
            }
            let s = minimise(theta, &tau, &ystar, &bounds, opts, opts.max_iter);
            let (r, _) = volumes(s.theta[0].exp(), s.theta[1].exp(), s.theta[2]);
            if r.is_finite() {
                eurs.push(cum_produced + r);
            }
        }
        eurs.sort_by(f64::total_cmp);
        p90 = percentile_sorted(&eurs, 10.0);
        p50 = percentile_sorted(&eurs, 50.0);
        p10 = percentile_sorted(&eurs, 90.0);
    }

    WellFit {
        status: if sol.converged {
            FitStatus::Ok
        } else {
            FitStatus::IterationLimit
        },
        message: if sol.converged {
            String::new()
        } else {
            format!("iteration limit {} reached", opts.max_iter)
        },
        qi,
        di,
        b,
        qi_se: qi * se_a,
        di_se: di * se_u,
        b_se: se_b,
        b_at_bound: at_bound[2],
        di_at_bound: at_bound[1],
        t0,
        t_last,
        t_forecast,
        n_used,
        n_excluded: n - n_used,
        cost: sol.cost,
        rmse_log: (ss_res / dof).sqrt(),
        r2_log: if ss_tot > 0.0 {
            1.0 - ss_res / ss_tot
        } else {
            f64::NAN
        },
        iterations: sol.iterations,
        cum_produced,
        remaining,
        eur: cum_produced + remaining,
        t_end: t0 + t_end_rel,
        eur_p90: p90,
        eur_p50: p50,
        eur_p10: p10,
    }
}

/// Fit many wells at once, in parallel on all cores.
///
/// The records of well `k` are `t[offsets[k]..offsets[k + 1]]` and the same range of `q`
/// (long format grouped by well; within a well any order). Each well is fitted exactly as
/// [`fit_well`] would, independently of the others, so the result of a well does not depend
/// on the batch it is in.
///
/// # Arguments
/// - `t`, `q`: as [`fit_well`], all wells concatenated.
/// - `offsets`: `n_wells + 1` non-decreasing indices, from 0 to `t.len()`.
/// - `start_times`: optional per-well start of the decline (days; NaN = none).
/// - `opts`: options shared by all wells.
///
/// # Returns
/// One [`WellFit`] per well, in the order of `offsets`.
///
/// # Errors
/// [`Error::Shape`] for inconsistent lengths; [`Error::InvalidRecord`] naming `offsets` when
/// they decrease or leave the data; [`Error::InvalidArgument`] for an invalid option.
///
/// # Examples
/// ```
/// use stocktank::decline::{fit_wells, FitOptions};
/// let t = [0.0, 30.0, 60.0, 90.0, 120.0, 150.0, 0.0, 30.0];
/// let q = [100.0, 90.0, 81.0, 73.0, 66.0, 59.0, 5.0, 0.0];
/// let fits = fit_wells(&t, &q, &[0, 6, 8], None, &FitOptions { n_bootstrap: 0, ..Default::default() })?;
/// assert!(fits[0].status.fitted());
/// assert_eq!(fits[1].status.as_str(), "too_few_points");
/// # Ok::<(), stocktank::Error>(())
/// ```
pub fn fit_wells(
    t: &[f64],
    q: &[f64],
    offsets: &[usize],
    start_times: Option<&[f64]>,
    opts: &FitOptions,
) -> Result<Vec<WellFit>> {
    if t.len() != q.len() {
        return Err(Error::Shape(format!(
            "`t` has {} records but `q` has {}",
            t.len(),
            q.len()
        )));
    }
    opts.validate()?;
    check_offsets(offsets, t.len())?;
    let n_wells = offsets.len().saturating_sub(1);
    if let Some(s) = start_times {
        if s.len() != n_wells {
            return Err(Error::Shape(format!(
                "`start_time` has {} values for {n_wells} wells",
                s.len()
            )));
        }
    }
    Ok((0..n_wells)
        .into_par_iter()
        .with_min_len(4)
        .map(|k| {
            let r = offsets[k]..offsets[k + 1];
            fit_checked(&t[r.clone()], &q[r], start_times.map(|s| s[k]), opts)
        })
        .collect())
}

fn check_offsets(offsets: &[usize], len: usize) -> Result<()> {
    if offsets.is_empty() || offsets[0] != 0 {
        return Err(Error::InvalidRecord {
            arg: "offsets".into(),
            row: 0,
            message: "must start at 0".into(),
        });
    }
    for (k, w) in offsets.windows(2).enumerate() {
        if w[1] < w[0] {
            return Err(Error::InvalidRecord {
                arg: "offsets".into(),
                row: k + 1,
                message: format!("{} is below the previous offset {}", w[1], w[0]),
            });
        }
    }
    let last = *offsets.last().expect("non-empty");
    if last != len {
        return Err(Error::InvalidRecord {
            arg: "offsets".into(),
            row: offsets.len() - 1,
            message: format!("last offset {last} must equal the number of records {len}"),
        });
    }
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn gradient_matches_finite_differences() {
        for &b in &[0.0, 1e-6, 0.3, 1.0, 1.8] {
            let theta = [5.0, 0.4, b];
            for &tau in &[0.0, 0.3, 2.0, 15.0] {
                let (_, g) = model(&theta, tau);
                for k in 0..3 {
                    let h = 1e-6;
                    let mut p = theta;
                    let mut m = theta;
                    p[k] += h;
                    m[k] -= h;
                    if k == 2 && b < h {
                        m[k] = b;
                        p[k] = b + h;
                        let fd = (model(&p, tau).0 - model(&m, tau).0) / h;
                        assert!(
                            (fd - g[k]).abs() < 1e-4 * (1.0 + g[k].abs()),
                            "b={b} tau={tau}"
                        );
                        continue;
                    }
                    let fd = (model(&p, tau).0 - model(&m, tau).0) / (2.0 * h);
                    assert!(
                        (fd - g[k]).abs() < 1e-6 * (1.0 + g[k].abs()),
                        "k={k} b={b} tau={tau}"
                    );
                }
            }
        }
    }

    #[test]
    fn reported_cost_is_the_cost_of_the_reported_theta() {
        let tau: Vec<f64> = (0..40).map(|m| m as f64 / 12.0).collect();
        let y: Vec<f64> = tau
            .iter()
            .enumerate()
            .map(|(i, &t)| 6.0 - (0.8 * t * 1.5f64).ln_1p() / 0.8 + 0.05 * ((i % 5) as f64 - 2.0))
            .collect();
        let opts = FitOptions::default();
        let bounds = Bounds {
            lo: [f64::NEG_INFINITY, opts.di_bounds.0.ln(), 0.0],
            hi: [f64::INFINITY, opts.di_bounds.1.ln(), 2.0],
        };
        let s = minimise([5.0, 0.0, 0.5], &tau, &y, &bounds, &opts, 200);
        assert!(s.converged);
        let c = cost(&s.theta, &tau, &y, opts.loss, opts.f_scale);
        assert!((c - s.cost).abs() <= 1e-14 * c.max(1.0));
        assert!((s.theta[1] - 1.5f64.ln()).abs() < 0.1 && (s.theta[2] - 0.8).abs() < 0.2);
    }

    #[test]
    fn percentile_like_numpy() {
        // numpy.percentile([1, 2, 3, 4], [10, 50, 90]) = [1.3, 2.5, 3.7]
        let v = [1.0, 2.0, 3.0, 4.0];
        assert!((percentile_sorted(&v, 10.0) - 1.3).abs() < 1e-12);
        assert!((percentile_sorted(&v, 50.0) - 2.5).abs() < 1e-12);
        assert!((percentile_sorted(&v, 90.0) - 3.7).abs() < 1e-12);
    }

    #[test]
    fn rng_below_is_in_range() {
        let mut r = SplitMix64(7);
        assert!((0..1000).all(|_| r.below(13) < 13));
    }
}
