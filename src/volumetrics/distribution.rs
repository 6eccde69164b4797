//! Input distributions for probabilistic volumes, their moments, and a seeded generator.
//!
//! Sampling is reproducible by seed on every platform and for any number of threads: the
//! trials are cut into fixed blocks, each drawn from its own xoshiro256++ stream seeded by
//! SplitMix64 from `(seed, stream, block)`. Continuous distributions are drawn by inversion
//! of their distribution function (the truncated ones on the truncated probability range);
//! PERT by the ratio of two gamma variates.
//!
//! # References
//! - Blackman, D., Vigna, S. (2021). Scrambled linear pseudorandom number generators.
//!   ACM Trans. Math. Softw. 47(4), 36 (xoshiro256++; SplitMix64 seeding).
//! - Acklam, P.J. (2003). An algorithm for computing the inverse normal cumulative
//!   distribution function (rational approximation, relative error 1.15e-9), refined here by
//!   one Halley step on erfc where full precision is needed.
//! - Marsaglia, G., Tsang, W.W. (2000). A simple method for generating gamma variables.
//!   ACM Trans. Math. Softw. 26(3), 363–372.
//! - Malcolm, D.G., Roseboom, J.H., Clark, C.E., Fazar, W. (1959). Application of a
//!   technique for research and development program evaluation. Operations Research 7(5),
//!   646–669 (the PERT beta distribution, shape parameter 4).
//! - Johnson, N.L., Kotz, S., Balakrishnan, N. (1994). Continuous Univariate Distributions,
//!   Vol. 1, 2nd ed., Wiley (moments of the truncated normal and lognormal).

use crate::error::{Error, Result};
use rayon::prelude::*;

/// Trials per generator stream (block); part of the reproducibility contract.
pub const BLOCK: usize = 8_192;

/// The xoshiro256++ generator (Blackman and Vigna 2021).
#[derive(Debug, Clone)]
pub struct Rng {
    s: [u64; 4],
}

#[inline]
fn splitmix64(state: &mut u64) -> u64 {
    *state = state.wrapping_add(0x9E37_79B9_7F4A_7C15);
    let mut z = *state;
    z = (z ^ (z >> 30)).wrapping_mul(0xBF58_476D_1CE4_E5B9);
    z = (z ^ (z >> 27)).wrapping_mul(0x94D0_49BB_1331_11EB);
    z ^ (z >> 31)
}

impl Rng {
    /// A generator for stream `stream` and block `block` of a run seeded with `seed`.
    ///
    /// # Examples
    /// ```
    /// use stocktank::volumetrics::distribution::Rng;
    /// let mut a = Rng::new(42, 0, 0);
    /// let mut b = Rng::new(42, 0, 0);
    /// assert_eq!(a.next_u64(), b.next_u64());
    /// ```
    pub fn new(seed: u64, stream: u64, block: u64) -> Self {
        let mut st = seed;
        let a = splitmix64(&mut st);
        let mut st = a ^ stream.wrapping_mul(0xD1B5_4A32_D192_ED03);
        let b = splitmix64(&mut st);
        let mut st = b ^ block.wrapping_mul(0x8CB9_2BA7_2F3D_8DD7);
        let s = [
            splitmix64(&mut st),
            splitmix64(&mut st),
            splitmix64(&mut st),
            splitmix64(&mut st),
        ];
        Rng { s }
    }

    /// The next 64 random bits.
    ///
    /// # Examples
    /// ```
    /// let mut r = stocktank::volumetrics::distribution::Rng::new(1, 0, 0);
    /// assert_ne!(r.next_u64(), r.next_u64());
    /// ```
    #[inline]
    pub fn next_u64(&mut self) -> u64 {
        let s = &mut self.s;
        let result = (s[0].wrapping_add(s[3])).rotate_left(23).wrapping_add(s[0]);
        let t = s[1] << 17;
        s[2] ^= s[0];
        s[3] ^= s[1];
        s[1] ^= s[2];
        s[0] ^= s[3];
        s[2] ^= t;
        s[3] = s[3].rotate_left(45);
        result
    }

    /// A uniform variate on the open interval (0, 1), with 53 random bits.
    ///
    /// # Examples
    /// ```
    /// let mut r = stocktank::volumetrics::distribution::Rng::new(1, 0, 0);
    /// let u = r.uniform();
    /// assert!(u > 0.0 && u < 1.0);
    /// ```
    #[inline]
    pub fn uniform(&mut self) -> f64 {
        ((self.next_u64() >> 11) as f64 + 0.5) * (1.0 / 9_007_199_254_740_992.0)
    }
}

/// Standard normal distribution function Phi(x).
///
/// # Formula
/// ```text
/// Phi(x) = erfc(-x / sqrt(2)) / 2
/// ```
///
/// # Examples
/// ```
/// use stocktank::volumetrics::distribution::norm_cdf;
/// assert!((norm_cdf(1.959_963_984_540_054) - 0.975).abs() < 1e-15);
/// ```
///
/// # References
/// Abramowitz, M., Stegun, I.A. (1964). Handbook of Mathematical Functions, 26.2.29.
#[inline]
pub fn norm_cdf(x: f64) -> f64 {
    0.5 * libm::erfc(-x * std::f64::consts::FRAC_1_SQRT_2)
}

#[inline]
fn norm_pdf(x: f64) -> f64 {
    (-0.5 * x * x).exp() / (2.0 * std::f64::consts::PI).sqrt()
}

/// Acklam's rational approximation of the normal quantile (relative error < 1.15e-9).
#[inline]
pub(crate) fn norm_ppf_fast(p: f64) -> f64 {
    const A: [f64; 6] = [
        -3.969_683_028_665_376e1,
        2.209_460_984_245_205e2,
        -2.759_285_104_469_687e2,
        1.383_577_518_672_69e2,
        -3.066_479_806_614_716e1,
        2.506_628_277_459_239,
    ];
    const B: [f64; 5] = [
        -5.447_609_879_822_406e1,
        1.615_858_368_580_409e2,
        -1.556_989_798_598_866e2,
        6.680_131_188_771_972e1,
        -1.328_068_155_288_572e1,
    ];
    const C: [f64; 6] = [
        -7.784_894_002_430_293e-3,
        -3.223_964_580_411_365e-1,
        -2.400_758_277_161_838,
        -2.549_732_539_343_734,
        4.374_664_141_464_968,
        2.938_163_982_698_783,
    ];
    const D: [f64; 4] = [
        7.784_695_709_041_462e-3,
        3.224_671_290_700_398e-1,
        2.445_134_137_142_996,
        3.754_408_661_907_416,
    ];
    const P_LOW: f64 = 0.024_25;
    let tail = |q: f64| {
        (((((C[0] * q + C[1]) * q + C[2]) * q + C[3]) * q + C[4]) * q + C[5])
            / ((((D[0] * q + D[1]) * q + D[2]) * q + D[3]) * q + 1.0)
    };
    if p < P_LOW {
        tail((-2.0 * p.ln()).sqrt())
    } else if p > 1.0 - P_LOW {
        -tail((-2.0 * (1.0 - p).ln()).sqrt())
    } else {
        let q = p - 0.5;
        let r = q * q;
        (((((A[0] * r + A[1]) * r + A[2]) * r + A[3]) * r + A[4]) * r + A[5]) * q
            / (((((B[0] * r + B[1]) * r + B[2]) * r + B[3]) * r + B[4]) * r + 1.0)
    }
}

/// Standard normal quantile Phi^-1(p), full double precision.
///
/// # Arguments
/// * `p` - probability in (0, 1); 0 gives -inf and 1 gives +inf.
///
/// # Returns
/// The z-score with Phi(z) = p.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `p` outside [0, 1].
///
/// # Examples
/// ```
/// use stocktank::volumetrics::distribution::norm_ppf;
/// assert!((norm_ppf(0.9).unwrap() - 1.281_551_565_544_600_5).abs() < 1e-14);
/// ```
///
/// # References
/// Acklam, P.J. (2003), refined by one Halley step (Halley 1694) on erfc.
pub fn norm_ppf(p: f64) -> Result<f64> {
    crate::error::fraction("p", p)?;
    if p == 0.0 {
        return Ok(f64::NEG_INFINITY);
    }
    if p == 1.0 {
        return Ok(f64::INFINITY);
    }
    let x = norm_ppf_fast(p);
    // Halley refinement; use the tail that keeps the residual accurate.
    let e = if x < 0.0 {
        norm_cdf(x) - p
    } else {
        (1.0 - p) - norm_cdf(-x)
    };
    let u = e * (2.0 * std::f64::consts::PI).sqrt() * (0.5 * x * x).exp();
    Ok(x - u / (1.0 + 0.5 * x * u))
}

/// A probability distribution of one uncertain input.
///
/// Truncation bounds of the normal and lognormal are `-inf`/`+inf` (normal) or `0`/`+inf`
/// (lognormal) when the distribution is not truncated.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Distribution {
    /// A fixed value (no uncertainty).
    Fixed {
        /// The value.
        value: f64,
    },
    /// Uniform on [low, high].
    Uniform {
        /// Lower bound.
        low: f64,
        /// Upper bound.
        high: f64,
    },
    /// Triangular on [low, high] with its mode.
    Triangular {
        /// Lower bound.
        low: f64,
        /// Most likely value.
        mode: f64,
        /// Upper bound.
        high: f64,
    },
    /// PERT (a beta distribution on [low, high] with mean (low + 4 mode + high) / 6).
    Pert {
        /// Lower bound.
        low: f64,
        /// Most likely value.
        mode: f64,
        /// Upper bound.
        high: f64,
    },
    /// Normal, optionally truncated to [low, high].
    Normal {
        /// Mean of the untruncated normal.
        mean: f64,
        /// Standard deviation of the untruncated normal, > 0.
        sd: f64,
        /// Lower truncation bound (-inf for none).
        low: f64,
        /// Upper truncation bound (+inf for none).
        high: f64,
    },
    /// Lognormal (ln X normal with mean `mu` and standard deviation `sigma`), optionally
    /// truncated to [low, high].
    Lognormal {
        /// Mean of ln X.
        mu: f64,
        /// Standard deviation of ln X, > 0.
        sigma: f64,
        /// Lower truncation bound (0 for none).
        low: f64,
        /// Upper truncation bound (+inf for none).
        high: f64,
    },
}

/// z-score of the P10 (the 90th percentile), 1.2815515655446004.
fn z90() -> f64 {
    // Phi^-1(0.9), Acklam with a Halley step; `norm_ppf` cannot fail for 0.9.
    norm_ppf(0.9).unwrap_or(1.281_551_565_544_600_5)
}

fn finite(arg: &'static str, v: f64) -> Result<f64> {
    if v.is_finite() {
        Ok(v)
    } else {
        Err(Error::invalid(arg, v, "must be finite"))
    }
}

fn ordered(low: f64, mode: f64, high: f64) -> Result<()> {
    finite("low", low)?;
    finite("mode", mode)?;
    finite("high", high)?;
    if low >= high {
        return Err(Error::invalid("high", high, "must be > low"));
    }
    if !(low..=high).contains(&mode) {
        return Err(Error::invalid("mode", mode, "must lie in [low, high]"));
    }
    Ok(())
}

fn bounds(low: f64, high: f64) -> Result<()> {
    if low.is_nan() {
        return Err(Error::invalid("low", low, "must not be NaN"));
    }
    if high.is_nan() || high <= low {
        return Err(Error::invalid(
            "high",
            high,
            "truncation bound must be > low",
        ));
    }
    Ok(())
}

impl Distribution {
    /// A fixed value.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `value` when it is not finite.
    ///
    /// # Examples
    /// ```
    /// use stocktank::volumetrics::Distribution;
    /// assert_eq!(Distribution::fixed(0.2).unwrap().mean(), 0.2);
    /// ```
    pub fn fixed(value: f64) -> Result<Self> {
        Ok(Distribution::Fixed {
            value: finite("value", value)?,
        })
    }

    /// Uniform on [low, high].
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `low` or `high` when not finite or `high <= low`.
    ///
    /// # Examples
    /// ```
    /// use stocktank::volumetrics::Distribution;
    /// assert_eq!(Distribution::uniform(1.0, 3.0).unwrap().mean(), 2.0);
    /// assert!(Distribution::uniform(3.0, 1.0).is_err());
    /// ```
    pub fn uniform(low: f64, high: f64) -> Result<Self> {
        ordered(low, low, high)?;
        Ok(Distribution::Uniform { low, high })
    }

    /// Triangular on [low, high] with mode `mode`.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `high` (`high <= low`) or `mode` (outside the bounds).
    ///
    /// # Examples
    /// ```
    /// use stocktank::volumetrics::Distribution;
    /// assert_eq!(Distribution::triangular(0.0, 3.0, 6.0).unwrap().mean(), 3.0);
    /// ```
    pub fn triangular(low: f64, mode: f64, high: f64) -> Result<Self> {
        ordered(low, mode, high)?;
        Ok(Distribution::Triangular { low, mode, high })
    }

    /// PERT on [low, high] with mode `mode` (beta with shape 4).
    ///
    /// # Errors
    /// As [`Distribution::triangular`].
    ///
    /// # Examples
    /// ```
    /// use stocktank::volumetrics::Distribution;
    /// assert_eq!(Distribution::pert(0.0, 3.0, 12.0).unwrap().mean(), 4.0);
    /// ```
    pub fn pert(low: f64, mode: f64, high: f64) -> Result<Self> {
        ordered(low, mode, high)?;
        Ok(Distribution::Pert { low, mode, high })
    }

    /// Normal with mean `mean` and standard deviation `sd`, truncated to [low, high]
    /// (pass infinite bounds for none).
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `mean`, `sd` (<= 0), `low` or `high` (`high <= low`),
    /// or `high` when the truncation range holds less than 1e-9 of the probability.
    ///
    /// # Examples
    /// ```
    /// use stocktank::volumetrics::Distribution;
    /// let d = Distribution::normal(0.2, 0.03, 0.0, f64::INFINITY).unwrap();
    /// assert!((d.mean() - 0.2).abs() < 1e-9);
    /// ```
    pub fn normal(mean: f64, sd: f64, low: f64, high: f64) -> Result<Self> {
        finite("mean", mean)?;
        crate::error::positive("sd", sd)?;
        bounds(low, high)?;
        let d = Distribution::Normal {
            mean,
            sd,
            low,
            high,
        };
        d.check_mass()?;
        Ok(d)
    }

    /// Normal from its P90 (low, 10th percentile) and P10 (high, 90th percentile) values.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `p10` when `p10 <= p90` (P90 is the low value).
    ///
    /// # Examples
    /// ```
    /// use stocktank::volumetrics::Distribution;
    /// let d = Distribution::normal_p90_p10(80.0, 120.0).unwrap();
    /// assert!((d.mean() - 100.0).abs() < 1e-12);
    /// assert!(Distribution::normal_p90_p10(120.0, 80.0).is_err());
    /// ```
    pub fn normal_p90_p10(p90: f64, p10: f64) -> Result<Self> {
        finite("p90", p90)?;
        finite("p10", p10)?;
        if p10 <= p90 {
            return Err(Error::invalid(
                "p10",
                p10,
                "must be > p90 (P90 is the low value, exceeded with 90% probability)",
            ));
        }
        let z = z90();
        Self::normal(
            0.5 * (p90 + p10),
            (p10 - p90) / (2.0 * z),
            f64::NEG_INFINITY,
            f64::INFINITY,
        )
    }

    /// Lognormal with log-mean `mu` and log-standard deviation `sigma`, truncated to
    /// [low, high] (pass 0 and +inf for none).
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `mu`, `sigma` (<= 0), `low` (< 0) or `high`.
    ///
    /// # Examples
    /// ```
    /// use stocktank::volumetrics::Distribution;
    /// let d = Distribution::lognormal(0.0, 0.5, 0.0, f64::INFINITY).unwrap();
    /// assert!((d.mean() - (0.125f64).exp()).abs() < 1e-12);
    /// ```
    pub fn lognormal(mu: f64, sigma: f64, low: f64, high: f64) -> Result<Self> {
        finite("mu", mu)?;
        crate::error::positive("sigma", sigma)?;
        bounds(low, high)?;
        if low < 0.0 {
            return Err(Error::invalid(
                "low",
                low,
                "lognormal truncation bound must be >= 0",
            ));
        }
        let d = Distribution::Lognormal {
            mu,
            sigma,
            low,
            high,
        };
        d.check_mass()?;
        Ok(d)
    }

    /// Lognormal from the mean and standard deviation of X itself (not of ln X).
    ///
    /// # Formula
    /// ```text
    /// sigma^2 = ln(1 + sd^2 / mean^2);   mu = ln(mean) - sigma^2 / 2
    /// ```
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `mean` or `sd` when not > 0.
    ///
    /// # Examples
    /// ```
    /// use stocktank::volumetrics::Distribution;
    /// let d = Distribution::lognormal_mean_sd(100.0, 30.0).unwrap();
    /// assert!((d.mean() - 100.0).abs() < 1e-9 && (d.variance().sqrt() - 30.0).abs() < 1e-9);
    /// ```
    pub fn lognormal_mean_sd(mean: f64, sd: f64) -> Result<Self> {
        crate::error::positive("mean", mean)?;
        crate::error::positive("sd", sd)?;
        let s2 = (1.0 + (sd / mean).powi(2)).ln();
        Self::lognormal(mean.ln() - 0.5 * s2, s2.sqrt(), 0.0, f64::INFINITY)
    }

    /// Lognormal from its P90 (low) and P10 (high) values.
    ///
    /// # Formula
    /// ```text
    /// mu = (ln P90 + ln P10) / 2;   sigma = (ln P10 - ln P90) / (2 * 1.28155)
    /// ```
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `p90` (<= 0) or `p10` (`p10 <= p90`).
    ///
    /// # Examples
    /// ```
    /// use stocktank::volumetrics::Distribution;
    /// let d = Distribution::lognormal_p90_p10(10.0, 40.0).unwrap();
    /// assert!(Distribution::lognormal_p90_p10(40.0, 10.0).is_err());
    /// ```
    pub fn lognormal_p90_p10(p90: f64, p10: f64) -> Result<Self> {
        crate::error::positive("p90", p90)?;
        finite("p10", p10)?;
        if p10 <= p90 {
            return Err(Error::invalid(
                "p10",
                p10,
                "must be > p90 (P90 is the low value, exceeded with 90% probability)",
            ));
        }
        let z = z90();
        let (a, b) = (p90.ln(), p10.ln());
        Self::lognormal(0.5 * (a + b), (b - a) / (2.0 * z), 0.0, f64::INFINITY)
    }

    /// Standardised truncation bounds (alpha, beta) of a normal or lognormal.
    fn alpha_beta(&self) -> Option<(f64, f64, f64, f64)> {
        match *self {
            Distribution::Normal {
                mean,
                sd,
                low,
                high,
            } => Some(((low - mean) / sd, (high - mean) / sd, mean, sd)),
            Distribution::Lognormal {
                mu,
                sigma,
                low,
                high,
            } => {
                let a = if low > 0.0 {
                    (low.ln() - mu) / sigma
                } else {
                    f64::NEG_INFINITY
                };
                Some((a, (high.ln() - mu) / sigma, mu, sigma))
            }
            _ => None,
        }
    }

    /// Probability mass inside the truncation range, computed on the side that keeps it accurate.
    fn mass(a: f64, b: f64) -> f64 {
        if a > 0.0 {
            norm_cdf(-a) - norm_cdf(-b)
        } else {
            norm_cdf(b) - norm_cdf(a)
        }
    }

    fn check_mass(&self) -> Result<()> {
        if let Some((a, b, _, _)) = self.alpha_beta() {
            let high = match *self {
                Distribution::Normal { high, .. } | Distribution::Lognormal { high, .. } => high,
                _ => f64::INFINITY,
            };
            if Self::mass(a, b) < 1e-9 {
                return Err(Error::invalid(
                    "high",
                    high,
                    "truncation range holds almost no probability (< 1e-9)",
                ));
            }
        }
        Ok(())
    }

    /// The smallest and largest values the distribution can take.
    ///
    /// # Examples
    /// ```
    /// use stocktank::volumetrics::Distribution;
    /// assert_eq!(Distribution::pert(1.0, 2.0, 4.0).unwrap().support(), (1.0, 4.0));
    /// ```
    pub fn support(&self) -> (f64, f64) {
        match *self {
            Distribution::Fixed { value } => (value, value),
            Distribution::Uniform { low, high } => (low, high),
            Distribution::Triangular { low, high, .. } | Distribution::Pert { low, high, .. } => {
                (low, high)
            }
            Distribution::Normal { low, high, .. } => (low, high),
            Distribution::Lognormal { low, high, .. } => (low, high),
        }
    }

    /// The k-th raw moment of a (truncated) lognormal.
    fn lognormal_moment(&self, k: f64) -> f64 {
        let Some((a, b, mu, sigma)) = self.alpha_beta() else {
            return f64::NAN;
        };
        let z = Self::mass(a, b);
        let part = Self::mass(a - k * sigma, b - k * sigma);
        (k * mu + 0.5 * k * k * sigma * sigma).exp() * part / z
    }

    /// The mean (analytic).
    ///
    /// # Examples
    /// ```
    /// use stocktank::volumetrics::Distribution;
    /// assert_eq!(Distribution::triangular(0.0, 0.0, 3.0).unwrap().mean(), 1.0);
    /// ```
    ///
    /// # References
    /// Johnson, Kotz, Balakrishnan (1994), ch. 13 (truncated normal) and 14 (lognormal).
    pub fn mean(&self) -> f64 {
        match *self {
            Distribution::Fixed { value } => value,
            Distribution::Uniform { low, high } => 0.5 * (low + high),
            Distribution::Triangular { low, mode, high } => (low + mode + high) / 3.0,
            Distribution::Pert { low, mode, high } => (low + 4.0 * mode + high) / 6.0,
            Distribution::Normal { .. } => {
                let (a, b, m, s) = self.alpha_beta().unwrap_or_default();
                let z = Self::mass(a, b);
                m + s * (pdf_or_zero(a) - pdf_or_zero(b)) / z
            }
            Distribution::Lognormal { .. } => self.lognormal_moment(1.0),
        }
    }

    /// The variance (analytic).
    ///
    /// # Examples
    /// ```
    /// use stocktank::volumetrics::Distribution;
    /// assert!((Distribution::uniform(0.0, 1.0).unwrap().variance() - 1.0 / 12.0).abs() < 1e-15);
    /// ```
    ///
    /// # References
    /// Johnson, Kotz, Balakrishnan (1994); Malcolm et al. (1959) for PERT.
    pub fn variance(&self) -> f64 {
        match *self {
            Distribution::Fixed { .. } => 0.0,
            Distribution::Uniform { low, high } => (high - low).powi(2) / 12.0,
            Distribution::Triangular { low, mode, high } => {
                (low * low + mode * mode + high * high - low * mode - low * high - mode * high)
                    / 18.0
            }
            Distribution::Pert { low, mode, high } => {
                let (al, be) = pert_shapes(low, mode, high);
                let w = high - low;
                al * be * w * w / ((al + be).powi(2) * (al + be + 1.0))
            }
            Distribution::Normal { .. } => {
                let (a, b, _, s) = self.alpha_beta().unwrap_or_default();
                let z = Self::mass(a, b);
                let (pa, pb) = (pdf_or_zero(a), pdf_or_zero(b));
                let ta = if a.is_finite() { a * pa } else { 0.0 };
                let tb = if b.is_finite() { b * pb } else { 0.0 };
                s * s * (1.0 + (ta - tb) / z - ((pa - pb) / z).powi(2))
            }
            Distribution::Lognormal { .. } => {
                let m1 = self.lognormal_moment(1.0);
                self.lognormal_moment(2.0) - m1 * m1
            }
        }
    }

    /// Draw `n` reproducible samples from stream `stream` of a run seeded with `seed`.
    ///
    /// The same `(seed, stream, n)` gives the same samples on every platform and for any
    /// number of threads.
    ///
    /// # Examples
    /// ```
    /// use stocktank::volumetrics::Distribution;
    /// let d = Distribution::pert(1.0, 2.0, 5.0).unwrap();
    /// assert_eq!(d.sample(1000, 7, 0), d.sample(1000, 7, 0));
    /// ```
    pub fn sample(&self, n: usize, seed: u64, stream: u64) -> Vec<f64> {
        let mut out = vec![0.0; n];
        let s = Sampler::new(self);
        out.par_chunks_mut(BLOCK)
            .enumerate()
            .for_each(|(b, chunk)| {
                let mut rng = Rng::new(seed, stream, b as u64);
                for x in chunk.iter_mut() {
                    *x = s.draw(&mut rng);
                }
            });
        out
    }
}

impl Distribution {
    /// Draw `n` reproducible samples already in ascending order.
    ///
    /// Kinds with a quantile function map uniform order statistics, generated in O(n) as
    /// normalised partial sums of n + 1 exponential variates (Devroye 1986, ch. V.3), through
    /// the quantile; PERT is sampled and sorted. The result has the distribution of a sorted
    /// iid sample (not the same numbers as [`Distribution::sample`] with the same seed).
    ///
    /// # Examples
    /// ```
    /// use stocktank::volumetrics::Distribution;
    /// let x = Distribution::normal(0.2, 0.03, 0.0, 1.0).unwrap().sample_sorted(1000, 3, 0);
    /// assert!(x.windows(2).all(|w| w[0] <= w[1]));
    /// ```
    ///
    /// # References
    /// Devroye, L. (1986). Non-Uniform Random Variate Generation. Springer, ch. V.3.
    pub fn sample_sorted(&self, n: usize, seed: u64, stream: u64) -> Vec<f64> {
        let s = Sampler::new(self);
        if s.inv(0.5).is_none() {
            return super::montecarlo::sort_values(self.sample(n, seed, stream));
        }
        // n + 1 exponential spacings, then their running sum.
        let mut e = vec![0.0; n + 1];
        e.par_chunks_mut(BLOCK).enumerate().for_each(|(b, chunk)| {
            let mut rng = Rng::new(seed, stream ^ 0x0005_0127_ED00, b as u64);
            for x in chunk.iter_mut() {
                *x = -rng.uniform().ln();
            }
        });
        let mut acc = 0.0;
        for x in e.iter_mut() {
            acc += *x;
            *x = acc;
        }
        let total = acc;
        e.truncate(n);
        e.par_iter_mut().for_each(|x| {
            *x = s
                .inv((*x / total).clamp(f64::MIN_POSITIVE, 1.0 - f64::EPSILON / 2.0))
                .unwrap_or(f64::NAN)
        });
        if n > 1 && e[0] > e[n - 1] {
            e.reverse();
        }
        // The approximate quantile may be non-monotone by ~1e-9 at its region joins.
        for i in 1..e.len() {
            let mut j = i;
            while j > 0 && e[j - 1] > e[j] {
                e.swap(j - 1, j);
                j -= 1;
            }
        }
        e
    }
}

#[inline]
fn pdf_or_zero(x: f64) -> f64 {
    if x.is_finite() { norm_pdf(x) } else { 0.0 }
}

fn pert_shapes(low: f64, mode: f64, high: f64) -> (f64, f64) {
    let w = high - low;
    (1.0 + 4.0 * (mode - low) / w, 1.0 + 4.0 * (high - mode) / w)
}

/// A distribution with its sampling constants precomputed.
enum Sampler {
    Fixed(f64),
    Uniform {
        low: f64,
        width: f64,
    },
    Triangular {
        low: f64,
        high: f64,
        fc: f64,
        a: f64,
        b: f64,
    },
    Pert {
        low: f64,
        width: f64,
        alpha: f64,
        beta: f64,
    },
    // x = loc + scale * ppf(p0 + u * dp) (flip: x = loc - scale * ppf(...)); exp() if log
    Inverse {
        loc: f64,
        scale: f64,
        p0: f64,
        dp: f64,
        flip: bool,
        log: bool,
    },
}

impl Sampler {
    fn new(d: &Distribution) -> Self {
        match *d {
            Distribution::Fixed { value } => Sampler::Fixed(value),
            Distribution::Uniform { low, high } => Sampler::Uniform {
                low,
                width: high - low,
            },
            Distribution::Triangular { low, mode, high } => Sampler::Triangular {
                low,
                high,
                fc: (mode - low) / (high - low),
                a: (high - low) * (mode - low),
                b: (high - low) * (high - mode),
            },
            Distribution::Pert { low, mode, high } => {
                let (alpha, beta) = pert_shapes(low, mode, high);
                Sampler::Pert {
                    low,
                    width: high - low,
                    alpha,
                    beta,
                }
            }
            Distribution::Normal { .. } | Distribution::Lognormal { .. } => {
                let (a, b, loc, scale) = d.alpha_beta().unwrap_or_default();
                let log = matches!(d, Distribution::Lognormal { .. });
                if a > 0.0 {
                    // Upper tail: sample the mirrored variable for accuracy.
                    let (p0, p1) = (norm_cdf(-b), norm_cdf(-a));
                    Sampler::Inverse {
                        loc,
                        scale,
                        p0,
                        dp: p1 - p0,
                        flip: true,
                        log,
                    }
                } else {
                    let (p0, p1) = (norm_cdf(a), norm_cdf(b));
                    Sampler::Inverse {
                        loc,
                        scale,
                        p0,
                        dp: p1 - p0,
                        flip: false,
                        log,
                    }
                }
            }
        }
    }

    /// The quantile at `u` for the kinds drawn by inversion (`None` for PERT). Decreasing
    /// in `u` for a mirrored (upper-tail) truncated normal or lognormal.
    #[inline]
    fn inv(&self, u: f64) -> Option<f64> {
        Some(match *self {
            Sampler::Fixed(v) => v,
            Sampler::Uniform { low, width } => low + width * u,
            Sampler::Triangular {
                low,
                high,
                fc,
                a,
                b,
            } => {
                if u < fc {
                    low + (u * a).sqrt()
                } else {
                    high - ((1.0 - u) * b).sqrt()
                }
            }
            Sampler::Pert { .. } => return None,
            Sampler::Inverse {
                loc,
                scale,
                p0,
                dp,
                flip,
                log,
            } => {
                let z = norm_ppf_fast(p0 + dp * u);
                let x = if flip {
                    loc - scale * z
                } else {
                    loc + scale * z
                };
                if log { x.exp() } else { x }
            }
        })
    }

    #[inline]
    fn draw(&self, rng: &mut Rng) -> f64 {
        match *self {
            Sampler::Fixed(v) => v,
            Sampler::Uniform { low, width } => low + width * rng.uniform(),
            Sampler::Triangular {
                low,
                high,
                fc,
                a,
                b,
            } => {
                let u = rng.uniform();
                if u < fc {
                    low + (u * a).sqrt()
                } else {
                    high - ((1.0 - u) * b).sqrt()
                }
            }
            Sampler::Pert {
                low,
                width,
                alpha,
                beta,
            } => {
                let x = gamma(alpha, rng);
                let y = gamma(beta, rng);
                low + width * x / (x + y)
            }
            Sampler::Inverse {
                loc,
                scale,
                p0,
                dp,
                flip,
                log,
            } => {
                let z = norm_ppf_fast(p0 + dp * rng.uniform());
                let x = if flip {
                    loc - scale * z
                } else {
                    loc + scale * z
                };
                if log { x.exp() } else { x }
            }
        }
    }
}

/// A gamma(shape, 1) variate for shape >= 1 (Marsaglia and Tsang 2000).
#[inline]
fn gamma(shape: f64, rng: &mut Rng) -> f64 {
    let d = shape - 1.0 / 3.0;
    let c = 1.0 / (9.0 * d).sqrt();
    loop {
        let x = norm_ppf_fast(rng.uniform());
        let v = 1.0 + c * x;
        if v <= 0.0 {
            continue;
        }
        let v = v * v * v;
        let u = rng.uniform();
        if u < 1.0 - 0.0331 * x * x * x * x || u.ln() < 0.5 * x * x + d * (1.0 - v + v.ln()) {
            return d * v;
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn ppf_inverts_cdf() {
        for p in [1e-12, 1e-6, 0.01, 0.02425, 0.3, 0.5, 0.7, 0.99, 1.0 - 1e-9] {
            let x = norm_ppf(p).unwrap();
            // Compare the smaller tail probability, which carries the precision.
            let (back, want) = if x < 0.0 {
                (norm_cdf(x), p)
            } else {
                (norm_cdf(-x), 1.0 - p)
            };
            assert!(
                ((back - want) / want).abs() < 1e-12,
                "{p}: {back} vs {want}"
            );
        }
    }
}
