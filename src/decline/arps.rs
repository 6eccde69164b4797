//! Arps (1945) rate-time relations, with an optional switch to a terminal exponential decline.
//!
//! Time is in days from the start of the decline, rates are per day (STB/d or Mscf/d),
//! cumulative volumes are rate x days (STB or Mscf), decline rates are **nominal per year**
//! (continuous, `D = -d ln q / dt`) unless a name says otherwise. One year is
//! [`DAYS_PER_YEAR`] = 365.25 days.
//!
//! All quantities are computed from one numerically stable form that is exact at the
//! exponential (`b = 0`) and harmonic (`b = 1`) limits and continuous around them:
//!
//! ```text
//! x = D t                                  (dimensionless time)
//! L = ln(1 + b x) / b        (L = x at b = 0)
//! q = qi exp(-L)                           = qi (1 + b D t)^(-1/b)
//! Np = qi / D * (1 - exp(-(1 - b) L)) / (1 - b)   (Np = qi L / D at b = 1)
//! ```
//!
//! # References
//! - Arps, J.J. (1945). Analysis of Decline Curves. Trans. AIME 160(1), 228-247.
//! - Fetkovich, M.J. (1980). Decline Curve Analysis Using Type Curves. JPT 32(6), 1065-1077.

use crate::array::{OnError, lift};
use crate::error::{Error, Result, non_negative, positive};
use crate::units::DAYS_PER_YEAR;
use ndarray::{ArrayD, ArrayViewD};

/// Below this |product| the helpers use three-term series (relative error below 1e-16);
/// this also keeps tiny (even subnormal) `b` from underflowing to a wrong zero.
const SERIES: f64 = 1e-5;

/// `ln(1 + b x) / b`, the log of the rate ratio qi/q; equal to `x` at `b = 0`.
#[inline]
fn log_ratio(b: f64, x: f64) -> f64 {
    let y = b * x;
    if b == 0.0 {
        x
    } else if y.abs() < SERIES {
        x * (1.0 - y * (0.5 - y / 3.0))
    } else {
        y.ln_1p() / b
    }
}

/// `(1 - exp(-(1 - b) L)) / (1 - b)`, the dimensionless cumulative; equal to `L` at `b = 1`.
#[inline]
fn cum_factor(b: f64, l: f64) -> f64 {
    let e = 1.0 - b;
    let y = e * l;
    if e == 0.0 {
        l
    } else if y.abs() < SERIES {
        l * (1.0 - y * (0.5 - y / 6.0))
    } else {
        -(-y).exp_m1() / e
    }
}

/// Inverse of [`log_ratio`]: the dimensionless time `x` at which `ln(qi/q) = l`.
#[inline]
fn x_from_log_ratio(b: f64, l: f64) -> f64 {
    let y = b * l;
    if b == 0.0 {
        l
    } else if y.abs() < SERIES {
        l * (1.0 + y * (0.5 + y / 6.0))
    } else {
        y.exp_m1() / b
    }
}

/// An Arps decline with an optional terminal exponential decline (the "modified
/// hyperbolic" of common practice).
///
/// The instantaneous nominal decline of the hyperbolic part is `D(t) = di / (1 + b di t)`;
/// the terminal decline `d_min` acts as a floor: once `D(t)` falls to `d_min` the rate
/// continues as an exponential at `d_min`. The switch time is
/// `t_sw = (di / d_min - 1) / (b di)`; rate and its slope are continuous there. With
/// `d_min = 0` there is no switch (plain Arps). If `di <= d_min` the floor governs from the
/// start (an exponential at `d_min`).
///
/// # Formula
/// ```text
/// t <= t_sw:  q = qi (1 + b di t)^(-1/b)                 (b = 0: qi exp(-di t))
/// t >  t_sw:  q = q_sw exp(-d_min (t - t_sw)),  Np = Np_sw + (q_sw - q) / d_min
/// ```
/// with `di`, `d_min` per day inside the formula (nominal per year / 365.25).
///
/// # Examples
/// ```
/// use stocktank::decline::Arps;
/// // 1000 STB/d, 80 %/yr nominal, b = 0.9, 6 %/yr nominal terminal decline
/// let a = Arps::new(1000.0, 0.8, 0.9, 0.06)?;
/// let t_sw = a.switch_time();
/// assert!((a.decline(t_sw) - 0.06).abs() < 1e-12);
/// assert!(a.rate(365.25)? < 1000.0);
/// # Ok::<(), stocktank::Error>(())
/// ```
///
/// # References
/// - Arps, J.J. (1945). Analysis of Decline Curves. Trans. AIME 160(1), 228-247.
/// - Robertson, S. (1988). Generalized Hyperbolic Equation. SPE-18731-MS (hyperbolic with a
///   terminal exponential decline).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Arps {
    /// Rate at `t = 0`, per day (STB/d or Mscf/d); > 0.
    pub qi: f64,
    /// Initial nominal decline, per year; > 0.
    pub di: f64,
    /// Arps exponent, dimensionless; >= 0 (0 exponential, 1 harmonic).
    pub b: f64,
    /// Terminal nominal decline, per year; >= 0 (0 = no terminal switch).
    pub d_min: f64,
}

impl Arps {
    /// Build a decline, checking every parameter.
    ///
    /// # Arguments
    /// - `qi`: initial rate, per day (> 0).
    /// - `di`: initial nominal decline, per year (> 0).
    /// - `b`: Arps exponent (>= 0; values above 1 occur in transient flow and need
    ///   `d_min > 0` for a finite ultimate cumulative).
    /// - `d_min`: terminal nominal decline, per year (>= 0; 0 means none). A terminal
    ///   decline quoted as effective per year `De` is `nominal_decline(De, 0.0, Period::Year)`.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `qi`, `di`, `b` or `d_min`.
    ///
    /// # Examples
    /// ```
    /// assert!(stocktank::decline::Arps::new(100.0, 0.5, 0.0, 0.0).is_ok());
    /// assert!(stocktank::decline::Arps::new(100.0, 0.5, -0.1, 0.0).is_err());
    /// ```
    pub fn new(qi: f64, di: f64, b: f64, d_min: f64) -> Result<Self> {
        positive("qi", qi)?;
        positive("di", di)?;
        non_negative("b", b)?;
        non_negative("d_min", d_min)?;
        Ok(Self { qi, di, b, d_min })
    }

    /// The hyperbolic part actually used: (decline per day, b), after the floor rule.
    #[inline]
    fn head(&self) -> (f64, f64) {
        if self.d_min > 0.0 && self.di <= self.d_min {
            (self.d_min / DAYS_PER_YEAR, 0.0)
        } else {
            (self.di / DAYS_PER_YEAR, self.b)
        }
    }

    /// Time of the switch to the terminal decline, days (`inf` when there is none).
    ///
    /// # Examples
    /// ```
    /// let a = stocktank::decline::Arps::new(100.0, 1.0, 1.0, 0.1).unwrap();
    /// // (di/d_min - 1) / (b di) = 9 years
    /// assert!((a.switch_time() - 9.0 * 365.25).abs() < 1e-9);
    /// ```
    pub fn switch_time(&self) -> f64 {
        let (_, b) = self.head();
        if self.d_min > 0.0 && b > 0.0 && self.di > self.d_min {
            (self.di / self.d_min - 1.0) / (b * self.di) * DAYS_PER_YEAR
        } else {
            f64::INFINITY
        }
    }

    /// Rate and cumulative of the hyperbolic part at `t` days.
    #[inline]
    fn head_at(&self, t: f64) -> (f64, f64) {
        let (d, b) = self.head();
        let l = log_ratio(b, d * t);
        (self.qi * (-l).exp(), self.qi / d * cum_factor(b, l))
    }

    /// Rate at `t` days, per day.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `t` when `t < 0` or NaN.
    ///
    /// # Examples
    /// ```
    /// let a = stocktank::decline::Arps::new(100.0, 1.0, 0.0, 0.0).unwrap();
    /// assert!((a.rate(365.25).unwrap() - 100.0 * (-1.0f64).exp()).abs() < 1e-12);
    /// ```
    pub fn rate(&self, t: f64) -> Result<f64> {
        let t = non_negative_time(t)?;
        let t_sw = self.switch_time();
        if t <= t_sw {
            Ok(self.head_at(t).0)
        } else {
            let (q_sw, _) = self.head_at(t_sw);
            Ok(q_sw * (-self.d_min / DAYS_PER_YEAR * (t - t_sw)).exp())
        }
    }

    /// Cumulative production from 0 to `t` days (rate unit x days, e.g. STB).
    ///
    /// `t = inf` gives the ultimate cumulative (infinite for `b >= 1` without a terminal
    /// decline).
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `t` when `t < 0` or NaN.
    ///
    /// # Examples
    /// ```
    /// // exponential: Np(inf) = qi / D
    /// let a = stocktank::decline::Arps::new(100.0, 0.5, 0.0, 0.0).unwrap();
    /// assert!((a.cumulative(f64::INFINITY).unwrap() - 100.0 * 365.25 / 0.5).abs() < 1e-6);
    /// ```
    pub fn cumulative(&self, t: f64) -> Result<f64> {
        let t = non_negative_time(t)?;
        let t_sw = self.switch_time();
        if t <= t_sw {
            Ok(self.head_at(t).1)
        } else {
            let (q_sw, np_sw) = self.head_at(t_sw);
            let dm = self.d_min / DAYS_PER_YEAR;
            let q = q_sw * (-dm * (t - t_sw)).exp();
            Ok(np_sw + (q_sw - q) / dm)
        }
    }

    /// Instantaneous nominal decline at `t` days, per year.
    ///
    /// # Examples
    /// ```
    /// let a = stocktank::decline::Arps::new(100.0, 1.0, 1.0, 0.0).unwrap();
    /// assert!((a.decline(365.25) - 0.5).abs() < 1e-12);
    /// ```
    pub fn decline(&self, t: f64) -> f64 {
        if t > self.switch_time() || (self.d_min > 0.0 && self.di <= self.d_min) {
            return self.d_min;
        }
        let (d, b) = self.head();
        d * DAYS_PER_YEAR / (1.0 + b * d * t)
    }

    /// Time in days at which the rate falls to `q_limit` (per day); 0 when `q_limit >= qi`,
    /// `inf` when `q_limit = 0`.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `q_limit` when negative or NaN.
    ///
    /// # Examples
    /// ```
    /// let a = stocktank::decline::Arps::new(100.0, 0.5, 0.7, 0.05).unwrap();
    /// let t = a.time_to_rate(5.0).unwrap();
    /// assert!((a.rate(t).unwrap() - 5.0).abs() < 1e-9);
    /// ```
    pub fn time_to_rate(&self, q_limit: f64) -> Result<f64> {
        non_negative("q_limit", q_limit)?;
        if q_limit >= self.qi {
            return Ok(0.0);
        }
        if q_limit == 0.0 {
            return Ok(f64::INFINITY);
        }
        let t_sw = self.switch_time();
        let (q_sw, _) = if t_sw.is_finite() {
            self.head_at(t_sw)
        } else {
            (0.0, 0.0)
        };
        if q_limit >= q_sw {
            let (d, b) = self.head();
            Ok(x_from_log_ratio(b, (self.qi / q_limit).ln()) / d)
        } else {
            Ok(t_sw + (q_sw / q_limit).ln() / (self.d_min / DAYS_PER_YEAR))
        }
    }

    /// Cumulative production up to the economic-limit rate `q_limit` or the horizon
    /// `t_max` days, whichever comes first (EUR counted from `t = 0`).
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `q_limit` or `t_max`.
    ///
    /// # Examples
    /// ```
    /// let a = stocktank::decline::Arps::new(100.0, 0.5, 0.0, 0.0).unwrap();
    /// // exponential: Np = (qi - q_limit) / D
    /// let eur = a.eur(10.0, f64::INFINITY).unwrap();
    /// assert!((eur - 90.0 * 365.25 / 0.5).abs() < 1e-6);
    /// ```
    pub fn eur(&self, q_limit: f64, t_max: f64) -> Result<f64> {
        let t_max = non_negative("t_max", t_max).or_else(|e| {
            if t_max == f64::INFINITY {
                Ok(t_max)
            } else {
                Err(e)
            }
        })?;
        let t_end = self.time_to_rate(q_limit)?.min(t_max);
        self.cumulative(t_end)
    }

    /// Volume still to produce from `t_from` days to the economic limit `q_limit` or the
    /// horizon `t_max` days: `Np(t_end) - Np(t_from)`, 0 when `t_from >= t_end`.
    ///
    /// # Errors
    /// As [`Arps::eur`], and naming `t_from` when negative.
    ///
    /// # Examples
    /// ```
    /// let a = stocktank::decline::Arps::new(100.0, 0.5, 0.5, 0.0).unwrap();
    /// let r = a.remaining(365.25, 5.0, f64::INFINITY).unwrap();
    /// let e = a.eur(5.0, f64::INFINITY).unwrap();
    /// assert!((r - (e - a.cumulative(365.25).unwrap())).abs() < 1e-6);
    /// ```
    pub fn remaining(&self, t_from: f64, q_limit: f64, t_max: f64) -> Result<f64> {
        let t_from = non_negative("t_from", t_from)?;
        if t_max.is_nan() || t_max < 0.0 {
            return Err(Error::invalid("t_max", t_max, "must be >= 0 days (or inf)"));
        }
        let t_end = self.time_to_rate(q_limit)?.min(t_max);
        if t_from >= t_end {
            return Ok(0.0);
        }
        Ok(self.cumulative(t_end)? - self.cumulative(t_from)?)
    }

    /// Time in days at which the cumulative production reaches `np` (rate x days): the
    /// inverse of [`Arps::cumulative`], so that rate against cumulative is
    /// `rate(time_at_cumulative(np))`.
    ///
    /// # Formula
    /// ```text
    /// hyperbolic part: L = -ln(1 - (1 - b) D Np / qi) / (1 - b)   (L = D Np / qi at b = 1)
    ///                  t = (exp(b L) - 1) / (b D)                  (t = L / D at b = 0)
    /// terminal part:   t = t_sw + ln(q_sw / (q_sw - d_min (Np - Np_sw))) / d_min
    /// ```
    /// For `b = 0` this gives the straight line `q = qi - D Np` of rate against cumulative.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `np` when negative, NaN, or at or beyond the
    /// ultimate cumulative of the decline.
    ///
    /// # Examples
    /// ```
    /// let a = stocktank::decline::Arps::new(100.0, 0.5, 0.0, 0.0).unwrap();
    /// // exponential: q = qi - D Np
    /// let np = 20_000.0;
    /// let q = a.rate(a.time_at_cumulative(np).unwrap()).unwrap();
    /// assert!((q - (100.0 - 0.5 / 365.25 * np)).abs() < 1e-9);
    /// ```
    pub fn time_at_cumulative(&self, np: f64) -> Result<f64> {
        crate::error::non_negative("np", np)?;
        let t_sw = self.switch_time();
        let (q_sw, np_sw) = if t_sw.is_finite() {
            self.head_at(t_sw)
        } else {
            (0.0, f64::INFINITY)
        };
        const BEYOND: &str = "must be below the ultimate cumulative of the decline";
        if np <= np_sw {
            let (d, b) = self.head();
            let z = d * np / self.qi;
            let e = 1.0 - b;
            let arg = -e * z;
            if arg <= -1.0 {
                return Err(Error::invalid("np", np, BEYOND));
            }
            // -ln(1 - e z)/e, i.e. log_ratio with exponent -e
            let l = log_ratio(-e, z);
            let t = x_from_log_ratio(b, l) / d;
            if t.is_finite() {
                Ok(t)
            } else {
                Err(Error::invalid("np", np, BEYOND))
            }
        } else {
            let dm = self.d_min / DAYS_PER_YEAR;
            let q = q_sw - dm * (np - np_sw);
            if q <= 0.0 {
                return Err(Error::invalid("np", np, BEYOND));
            }
            Ok(t_sw + (q_sw / q).ln() / dm)
        }
    }
}

#[inline]
fn non_negative_time(t: f64) -> Result<f64> {
    if t >= 0.0 {
        Ok(t)
    } else {
        Err(Error::invalid("t", t, "must be >= 0 days"))
    }
}

/// Arps rate at `t` days (per day), with optional terminal decline `d_min`.
///
/// The scalar kernel behind [`rate_array`]; see [`Arps`] for the formula.
///
/// # Arguments
/// - `qi`: initial rate, per day (> 0); `di`: initial nominal decline, per year (> 0);
///   `b`: exponent (>= 0); `d_min`: terminal nominal decline, per year (>= 0, 0 = none);
///   `t`: time since the start of the decline, days (>= 0).
///
/// # Returns
/// Rate, per day (same unit as `qi`).
///
/// # Errors
/// [`Error::InvalidArgument`] naming the offending argument.
///
/// # Examples
/// ```
/// // harmonic: q = qi / (1 + D t)
/// let q = stocktank::decline::rate(100.0, 1.0, 1.0, 0.0, 365.25).unwrap();
/// assert!((q - 50.0).abs() < 1e-12);
/// ```
///
/// # References
/// Arps, J.J. (1945). Analysis of Decline Curves. Trans. AIME 160(1), 228-247.
#[inline]
pub fn rate(qi: f64, di: f64, b: f64, d_min: f64, t: f64) -> Result<f64> {
    Arps::new(qi, di, b, d_min)?.rate(t)
}

/// Arps cumulative production from 0 to `t` days (rate unit x days).
///
/// # Arguments
/// As [`rate`].
///
/// # Returns
/// Cumulative volume (STB for STB/d, Mscf for Mscf/d).
///
/// # Errors
/// [`Error::InvalidArgument`] naming the offending argument.
///
/// # Examples
/// ```
/// // harmonic: Np = qi / D ln(1 + D t)
/// let np = stocktank::decline::cumulative(100.0, 1.0, 1.0, 0.0, 365.25).unwrap();
/// assert!((np - 100.0 * 365.25 * 2f64.ln()).abs() < 1e-9);
/// ```
///
/// # References
/// Arps, J.J. (1945). Analysis of Decline Curves. Trans. AIME 160(1), 228-247.
#[inline]
pub fn cumulative(qi: f64, di: f64, b: f64, d_min: f64, t: f64) -> Result<f64> {
    Arps::new(qi, di, b, d_min)?.cumulative(t)
}

/// Time in days for an Arps decline to reach the rate `q_limit` (per day).
///
/// # Arguments
/// As [`rate`], with `q_limit` >= 0 in place of `t`.
///
/// # Returns
/// Days (0 when `q_limit >= qi`, `inf` when `q_limit = 0`).
///
/// # Errors
/// [`Error::InvalidArgument`] naming the offending argument.
///
/// # Examples
/// ```
/// // exponential: t = ln(qi/q) / D
/// let t = stocktank::decline::time_to_rate(100.0, 0.5, 0.0, 0.0, 10.0).unwrap();
/// assert!((t - 10f64.ln() / 0.5 * 365.25).abs() < 1e-9);
/// ```
///
/// # References
/// Arps, J.J. (1945). Analysis of Decline Curves. Trans. AIME 160(1), 228-247.
#[inline]
pub fn time_to_rate(qi: f64, di: f64, b: f64, d_min: f64, q_limit: f64) -> Result<f64> {
    Arps::new(qi, di, b, d_min)?.time_to_rate(q_limit)
}

/// Estimated ultimate recovery of an Arps decline: cumulative from 0 to the economic-limit
/// rate `q_limit`, capped at the horizon `t_max` days (`inf` for none).
///
/// # Arguments
/// As [`rate`], with `q_limit` (per day, >= 0) and `t_max` (days, >= 0 or inf).
///
/// # Returns
/// Volume (rate unit x days).
///
/// # Errors
/// [`Error::InvalidArgument`] naming the offending argument.
///
/// # Examples
/// ```
/// let e = stocktank::decline::eur(100.0, 0.5, 0.0, 0.0, 10.0, f64::INFINITY).unwrap();
/// assert!((e - 90.0 * 365.25 / 0.5).abs() < 1e-6);
/// ```
///
/// # References
/// Arps, J.J. (1945). Analysis of Decline Curves. Trans. AIME 160(1), 228-247.
#[inline]
pub fn eur(qi: f64, di: f64, b: f64, d_min: f64, q_limit: f64, t_max: f64) -> Result<f64> {
    Arps::new(qi, di, b, d_min)?.eur(q_limit, t_max)
}

/// Arps rate (per day) once the cumulative production has reached `np` (rate against
/// cumulative).
///
/// # Formula
/// `q = rate(time_at_cumulative(np))`; see [`Arps::time_at_cumulative`]. Closed forms:
/// `q = qi - D Np` (b = 0), `q = qi exp(-D Np / qi)` (b = 1),
/// `q = qi (1 - (1 - b) D Np / qi)^(1/(1-b))` otherwise (Arps 1945).
///
/// # Arguments
/// As [`rate`], with `np` (rate x days, >= 0) in place of `t`.
///
/// # Returns
/// Rate, per day.
///
/// # Errors
/// [`Error::InvalidArgument`] naming the offending argument (`np` at or beyond the
/// ultimate cumulative).
///
/// # Examples
/// ```
/// // harmonic: q = qi exp(-D Np / qi)
/// let q = stocktank::decline::rate_at_cumulative(100.0, 1.0, 1.0, 0.0, 10_000.0).unwrap();
/// assert!((q - 100.0 * (-10_000.0 / 365.25 / 100.0f64).exp()).abs() < 1e-10);
/// ```
///
/// # References
/// Arps, J.J. (1945). Analysis of Decline Curves. Trans. AIME 160(1), 228-247.
#[inline]
pub fn rate_at_cumulative(qi: f64, di: f64, b: f64, d_min: f64, np: f64) -> Result<f64> {
    let a = Arps::new(qi, di, b, d_min)?;
    a.rate(a.time_at_cumulative(np)?)
}

/// Volume still to produce from `t_from` days (since the start of the decline) to the
/// economic limit `q_limit` (per day) or the horizon `t_max` days: see [`Arps::remaining`].
///
/// # Arguments
/// As [`eur`], with `t_from` (days, >= 0).
///
/// # Returns
/// Volume (rate x days); 0 when the decline is already past the limit or the horizon.
///
/// # Errors
/// [`Error::InvalidArgument`] naming the offending argument.
///
/// # Examples
/// ```
/// use stocktank::decline::{eur, remaining, cumulative};
/// let r = remaining(100.0, 0.5, 0.0, 0.0, 365.25, 10.0, f64::INFINITY).unwrap();
/// let e = eur(100.0, 0.5, 0.0, 0.0, 10.0, f64::INFINITY).unwrap();
/// assert!((r - (e - cumulative(100.0, 0.5, 0.0, 0.0, 365.25).unwrap())).abs() < 1e-6);
/// ```
///
/// # References
/// Arps, J.J. (1945). Analysis of Decline Curves. Trans. AIME 160(1), 228-247.
#[inline]
pub fn remaining(
    qi: f64,
    di: f64,
    b: f64,
    d_min: f64,
    t_from: f64,
    q_limit: f64,
    t_max: f64,
) -> Result<f64> {
    Arps::new(qi, di, b, d_min)?.remaining(t_from, q_limit, t_max)
}

/// [`rate_at_cumulative`] over broadcast arrays.
///
/// # Errors
/// [`Error::Shape`], or the kernel's error with the element index.
///
/// # Examples
/// ```
/// use stocktank::array::OnError;
/// let s = |v: f64| ndarray::arr0(v).into_dyn();
/// let q = stocktank::decline::rate_at_cumulative_array(s(100.0).view(), s(0.5).view(),
///     s(0.0).view(), s(0.0).view(), s(0.0).view(), OnError::Raise).unwrap();
/// assert_eq!(q[[]], 100.0);
/// ```
pub fn rate_at_cumulative_array(
    qi: ArrayViewD<'_, f64>,
    di: ArrayViewD<'_, f64>,
    b: ArrayViewD<'_, f64>,
    d_min: ArrayViewD<'_, f64>,
    np: ArrayViewD<'_, f64>,
    on_error: OnError,
) -> Result<ArrayD<f64>> {
    lift(
        ["qi", "di", "b", "d_min", "np"],
        [qi, di, b, d_min, np],
        on_error,
        |[qi, di, b, d_min, np]| rate_at_cumulative(qi, di, b, d_min, np),
    )
}

/// [`remaining`] over broadcast arrays.
///
/// # Errors
/// [`Error::Shape`], or the kernel's error with the element index.
///
/// # Examples
/// ```
/// use stocktank::array::OnError;
/// let s = |v: f64| ndarray::arr0(v).into_dyn();
/// let r = stocktank::decline::remaining_array(s(100.0).view(), s(0.5).view(), s(0.0).view(),
///     s(0.0).view(), s(0.0).view(), s(10.0).view(), s(f64::INFINITY).view(), OnError::Raise).unwrap();
/// assert!((r[[]] - 65745.0).abs() < 1e-6);
/// ```
#[allow(clippy::too_many_arguments)]
pub fn remaining_array(
    qi: ArrayViewD<'_, f64>,
    di: ArrayViewD<'_, f64>,
    b: ArrayViewD<'_, f64>,
    d_min: ArrayViewD<'_, f64>,
    t_from: ArrayViewD<'_, f64>,
    q_limit: ArrayViewD<'_, f64>,
    t_max: ArrayViewD<'_, f64>,
    on_error: OnError,
) -> Result<ArrayD<f64>> {
    lift(
        ["qi", "di", "b", "d_min", "t_from", "q_limit", "t_max"],
        [qi, di, b, d_min, t_from, q_limit, t_max],
        on_error,
        |[qi, di, b, d_min, tf, q, tm]| remaining(qi, di, b, d_min, tf, q, tm),
    )
}

/// The period over which an effective decline is quoted.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Period {
    /// One year (365.25 days).
    Year,
    /// One average month (1/12 year, 30.4375 days).
    Month,
}

impl Period {
    /// Length of the period in years.
    ///
    /// # Examples
    /// ```
    /// assert_eq!(stocktank::decline::Period::Month.years(), 1.0 / 12.0);
    /// ```
    pub fn years(self) -> f64 {
        match self {
            Period::Year => 1.0,
            Period::Month => 1.0 / 12.0,
        }
    }

    /// Parse `"year"` or `"month"`.
    ///
    /// # Errors
    /// [`Error::InvalidOption`] naming `period`.
    ///
    /// # Examples
    /// ```
    /// assert!(stocktank::decline::Period::parse("month").is_ok());
    /// ```
    pub fn parse(s: &str) -> Result<Self> {
        match s {
            "year" => Ok(Period::Year),
            "month" => Ok(Period::Month),
            _ => Err(Error::InvalidOption {
                arg: "period",
                value: s.to_string(),
                allowed: "year, month",
            }),
        }
    }
}

/// Effective (secant) decline over one period from a nominal decline per year.
///
/// The effective decline is the fractional drop of the rate over the first period,
/// `1 - q(period)/qi`. For `b = 0` it is the classical `1 - exp(-D)`.
///
/// # Formula
/// ```text
/// De = 1 - (1 + b D dt)^(-1/b)        (b = 0: De = 1 - exp(-D dt))
/// ```
/// `dt` = 1 (year) or 1/12 (month).
///
/// # Arguments
/// - `d_nominal_per_year`: nominal decline, per year (>= 0).
/// - `b`: Arps exponent (>= 0).
/// - `period`: [`Period::Year`] or [`Period::Month`].
///
/// # Returns
/// Effective decline over the period, fraction in [0, 1).
///
/// # Errors
/// [`Error::InvalidArgument`] naming `d_nominal_per_year` or `b`.
///
/// # Examples
/// ```
/// use stocktank::decline::{effective_decline, Period};
/// let de = effective_decline(-(0.7f64.ln()), 0.0, Period::Year).unwrap();
/// assert!((de - 0.3).abs() < 1e-12);
/// ```
///
/// # References
/// Arps, J.J. (1945). Analysis of Decline Curves. Trans. AIME 160(1), 228-247. The secant
/// definition of the effective decline for `b > 0` is common practice (no source).
#[inline]
pub fn effective_decline(d_nominal_per_year: f64, b: f64, period: Period) -> Result<f64> {
    non_negative("d_nominal_per_year", d_nominal_per_year)?;
    non_negative("b", b)?;
    Ok(-(-log_ratio(b, d_nominal_per_year * period.years())).exp_m1())
}

/// Nominal decline per year from an effective (secant) decline over one period; the inverse
/// of [`effective_decline`].
///
/// # Formula
/// ```text
/// D = ((1 - De)^(-b) - 1) / (b dt)     (b = 0: D = -ln(1 - De) / dt)
/// ```
///
/// # Arguments
/// - `d_effective`: effective decline over the period, fraction in [0, 1).
/// - `b`: Arps exponent (>= 0).
/// - `period`: [`Period::Year`] or [`Period::Month`].
///
/// # Returns
/// Nominal decline, per year.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `d_effective` or `b`.
///
/// # Examples
/// ```
/// use stocktank::decline::{nominal_decline, Period};
/// // 30 %/yr effective exponential is 0.3567 /yr nominal
/// let d = nominal_decline(0.3, 0.0, Period::Year).unwrap();
/// assert!((d + 0.7f64.ln()).abs() < 1e-12);
/// ```
///
/// # References
/// Arps, J.J. (1945). Analysis of Decline Curves. Trans. AIME 160(1), 228-247.
#[inline]
pub fn nominal_decline(d_effective: f64, b: f64, period: Period) -> Result<f64> {
    if !(0.0..1.0).contains(&d_effective) {
        return Err(Error::invalid(
            "d_effective",
            d_effective,
            "must lie in [0, 1)",
        ));
    }
    non_negative("b", b)?;
    Ok(x_from_log_ratio(b, -(-d_effective).ln_1p()) / period.years())
}

/// [`rate`] over broadcast arrays (see [`crate::array::lift`]).
///
/// # Errors
/// [`Error::Shape`], or the kernel's error with the element index.
///
/// # Examples
/// ```
/// use ndarray::arr1;
/// use stocktank::array::OnError;
/// let t = arr1(&[0.0, 365.25]).into_dyn();
/// let s = |v: f64| ndarray::arr0(v).into_dyn();
/// let q = stocktank::decline::rate_array(s(100.0).view(), s(1.0).view(), s(1.0).view(),
///     s(0.0).view(), t.view(), OnError::Raise).unwrap();
/// assert_eq!(q[1], 50.0);
/// ```
pub fn rate_array(
    qi: ArrayViewD<'_, f64>,
    di: ArrayViewD<'_, f64>,
    b: ArrayViewD<'_, f64>,
    d_min: ArrayViewD<'_, f64>,
    t: ArrayViewD<'_, f64>,
    on_error: OnError,
) -> Result<ArrayD<f64>> {
    lift(
        ["qi", "di", "b", "d_min", "t"],
        [qi, di, b, d_min, t],
        on_error,
        |[qi, di, b, d_min, t]| rate(qi, di, b, d_min, t),
    )
}

/// [`cumulative`] over broadcast arrays.
///
/// # Errors
/// [`Error::Shape`], or the kernel's error with the element index.
///
/// # Examples
/// ```
/// use stocktank::array::OnError;
/// let s = |v: f64| ndarray::arr0(v).into_dyn();
/// let np = stocktank::decline::cumulative_array(s(100.0).view(), s(0.5).view(),
///     s(0.0).view(), s(0.0).view(), s(f64::INFINITY).view(), OnError::Raise).unwrap();
/// assert!((np[[]] - 73050.0).abs() < 1e-6);
/// ```
pub fn cumulative_array(
    qi: ArrayViewD<'_, f64>,
    di: ArrayViewD<'_, f64>,
    b: ArrayViewD<'_, f64>,
    d_min: ArrayViewD<'_, f64>,
    t: ArrayViewD<'_, f64>,
    on_error: OnError,
) -> Result<ArrayD<f64>> {
    lift(
        ["qi", "di", "b", "d_min", "t"],
        [qi, di, b, d_min, t],
        on_error,
        |[qi, di, b, d_min, t]| cumulative(qi, di, b, d_min, t),
    )
}

/// [`time_to_rate`] over broadcast arrays.
///
/// # Errors
/// [`Error::Shape`], or the kernel's error with the element index.
///
/// # Examples
/// ```
/// use stocktank::array::OnError;
/// let s = |v: f64| ndarray::arr0(v).into_dyn();
/// let t = stocktank::decline::time_to_rate_array(s(100.0).view(), s(1.0).view(),
///     s(1.0).view(), s(0.0).view(), s(50.0).view(), OnError::Raise).unwrap();
/// assert!((t[[]] - 365.25).abs() < 1e-9);
/// ```
pub fn time_to_rate_array(
    qi: ArrayViewD<'_, f64>,
    di: ArrayViewD<'_, f64>,
    b: ArrayViewD<'_, f64>,
    d_min: ArrayViewD<'_, f64>,
    q_limit: ArrayViewD<'_, f64>,
    on_error: OnError,
) -> Result<ArrayD<f64>> {
    lift(
        ["qi", "di", "b", "d_min", "q_limit"],
        [qi, di, b, d_min, q_limit],
        on_error,
        |[qi, di, b, d_min, q]| time_to_rate(qi, di, b, d_min, q),
    )
}

/// [`eur`] over broadcast arrays.
///
/// # Errors
/// [`Error::Shape`], or the kernel's error with the element index.
///
/// # Examples
/// ```
/// use stocktank::array::OnError;
/// let s = |v: f64| ndarray::arr0(v).into_dyn();
/// let e = stocktank::decline::eur_array(s(100.0).view(), s(0.5).view(), s(0.0).view(),
///     s(0.0).view(), s(10.0).view(), s(f64::INFINITY).view(), OnError::Raise).unwrap();
/// assert!((e[[]] - 65745.0).abs() < 1e-6);
/// ```
pub fn eur_array(
    qi: ArrayViewD<'_, f64>,
    di: ArrayViewD<'_, f64>,
    b: ArrayViewD<'_, f64>,
    d_min: ArrayViewD<'_, f64>,
    q_limit: ArrayViewD<'_, f64>,
    t_max: ArrayViewD<'_, f64>,
    on_error: OnError,
) -> Result<ArrayD<f64>> {
    lift(
        ["qi", "di", "b", "d_min", "q_limit", "t_max"],
        [qi, di, b, d_min, q_limit, t_max],
        on_error,
        |[qi, di, b, d_min, q, tm]| eur(qi, di, b, d_min, q, tm),
    )
}

/// [`effective_decline`] over broadcast arrays.
///
/// # Errors
/// [`Error::Shape`], or the kernel's error with the element index.
///
/// # Examples
/// ```
/// use stocktank::array::OnError;
/// use stocktank::decline::Period;
/// let s = |v: f64| ndarray::arr0(v).into_dyn();
/// let de = stocktank::decline::effective_decline_array(s(0.0).view(), s(0.0).view(),
///     Period::Month, OnError::Raise).unwrap();
/// assert_eq!(de[[]], 0.0);
/// ```
pub fn effective_decline_array(
    d_nominal_per_year: ArrayViewD<'_, f64>,
    b: ArrayViewD<'_, f64>,
    period: Period,
    on_error: OnError,
) -> Result<ArrayD<f64>> {
    lift(
        ["d_nominal_per_year", "b"],
        [d_nominal_per_year, b],
        on_error,
        |[d, b]| effective_decline(d, b, period),
    )
}

/// [`nominal_decline`] over broadcast arrays.
///
/// # Errors
/// [`Error::Shape`], or the kernel's error with the element index.
///
/// # Examples
/// ```
/// use stocktank::array::OnError;
/// use stocktank::decline::Period;
/// let s = |v: f64| ndarray::arr0(v).into_dyn();
/// let d = stocktank::decline::nominal_decline_array(s(0.0).view(), s(1.0).view(),
///     Period::Year, OnError::Raise).unwrap();
/// assert_eq!(d[[]], 0.0);
/// ```
pub fn nominal_decline_array(
    d_effective: ArrayViewD<'_, f64>,
    b: ArrayViewD<'_, f64>,
    period: Period,
    on_error: OnError,
) -> Result<ArrayD<f64>> {
    lift(
        ["d_effective", "b"],
        [d_effective, b],
        on_error,
        |[d, b]| nominal_decline(d, b, period),
    )
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn closed_forms_at_limits() {
        // b = 0: q = qi exp(-D t); Np = (qi - q)/D  (Arps 1945)
        let a = Arps::new(500.0, 0.4, 0.0, 0.0).unwrap();
        let t = 800.0;
        let d = 0.4 / DAYS_PER_YEAR;
        let q = 500.0 * (-d * t).exp();
        assert!((a.rate(t).unwrap() - q).abs() < 1e-10);
        assert!((a.cumulative(t).unwrap() - (500.0 - q) / d).abs() < 1e-7);
        // b = 1: q = qi/(1+Dt); Np = qi/D ln(qi/q)
        let a = Arps::new(500.0, 0.4, 1.0, 0.0).unwrap();
        let q = 500.0 / (1.0 + d * t);
        assert!((a.rate(t).unwrap() - q).abs() < 1e-10);
        assert!((a.cumulative(t).unwrap() - 500.0 / d * (500.0 / q).ln()).abs() < 1e-7);
    }

    #[test]
    fn floor_governs_when_di_below_d_min() {
        let a = Arps::new(100.0, 0.05, 1.2, 0.1).unwrap();
        assert_eq!(a.decline(0.0), 0.1);
        assert_eq!(a.decline(1e4), 0.1);
    }

    #[test]
    fn effective_nominal_round_trip() {
        for &b in &[0.0, 0.3, 1.0, 1.7] {
            for p in [Period::Year, Period::Month] {
                let d = 0.9;
                let de = effective_decline(d, b, p).unwrap();
                assert!((nominal_decline(de, b, p).unwrap() - d).abs() < 1e-12);
            }
        }
    }
}
