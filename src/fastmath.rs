//! Branch-free natural exponential and logarithm for loops over lanes that the compiler can
//! vectorise (batch kernels such as the Dranchuk–Abou-Kassem solve), a few units in the last
//! place from the standard library's `f64::exp` / `f64::ln`. One value at a time, on the
//! baseline x86-64 target this crate is built for (no FMA), the system library's run-time
//! FMA versions are faster: scalar code calls [`exp_scalar`] / [`ln_scalar`] (measured in
//! `examples/profile_black_oil.rs`, see [`exp_scalar`]).
//!
//! A prepared correlation that runs both ways is written once, generic over the pair
//! (`Elementary`, crate-internal): instantiated with the system library for the scalar
//! kernels and with [`exp`] / [`ln`] inside the lane loops of the black-oil table builder,
//! where the AVX2 copy of the loop computes four rows per instruction.
//!
//! Most published PVT correlations are power laws, `a x^b`; written as `exp(b ln x)` with
//! the per-fluid parts hoisted out of the pressure loop they cost one [`ln`] and one [`exp`]
//! per point. [`pow_positive`] and [`pow_positive_scalar`] are that form for a positive base.
//!
//! # Accuracy (unit-tested against `f64::exp` / `f64::ln`)
//! - [`exp`]: within 3 ulp over its whole range, results in the subnormal range included;
//!   `exp(NaN) = NaN`, `exp(+inf) = +inf`, `exp(-inf) = 0`, overflow gives `+inf`, underflow
//!   0. The Dranchuk–Abou-Kassem batch solver uses the same reduction and polynomial with a
//!   single scaling (`exp_nonpositive`, crate-internal), which gives the same bits for
//!   -700 <= x <= 0 (scaling by powers of two is exact for normal results; unit-tested).
//! - [`ln`]: within 1 ulp for positive normal and subnormal inputs; `ln(0) = -inf`,
//!   `ln(+inf) = +inf`, `ln(x < 0) = NaN`, `ln(NaN) = NaN`.
//! - [`pow_positive`]`(x, y) = exp(y ln x)`: relative error about `(|y ln x| + 4) * 1.1e-16`
//!   (the rounding of `ln x` is amplified by `y ln x`): below 5e-15 for the exponents
//!   (-1.2 to 2) and bases (1e-3 to 1e4) of the fluid correlations (unit-tested).
//!
//! # References
//! - Cody, W.J., Waite, W. (1980). Software Manual for the Elementary Functions.
//!   Prentice-Hall (the two-constant argument reduction x = n ln2 + r).
//! - Tang, P.T.P. (1990). Table-driven implementation of the logarithm function in IEEE
//!   floating-point arithmetic. ACM Transactions on Mathematical Software 16(4), 378–400
//!   (reduction of the logarithm to ln(1 + f) with f = m - 1 around 1, and the error analysis).
//! - Sun Microsystems (1993). fdlibm `e_log.c` (the minimax coefficients of
//!   2 atanh(s) = ln((1 + s) / (1 - s)) used by [`ln`], freely distributable).

const LN2_HI: f64 = 6.931_471_803_691_238e-1;
const LN2_LO: f64 = 1.908_214_929_270_587_7e-10;
/// 1.5 * 2^52: adding it to a float of magnitude below 2^51 rounds it to an integer, held in
/// the low bits of the mantissa.
const MAGIC: f64 = 6_755_399_441_055_744.0;

/// e^x, branch-free (see the module docs for the accuracy and the special values).
///
/// # Formula
/// ```text
/// x = n ln2 + r, |r| <= ln2 / 2   (Cody–Waite, ln2 split in a high and a low part)
/// e^r = sum_{k=0}^{12} r^k / k!   (Taylor, truncation < 2e-16 relative; Estrin's scheme)
/// e^x = 2^n1 2^n2 e^r,  n = n1 + n2  (two scalings so that subnormal and huge results work)
/// ```
///
/// # Arguments
/// * `x` - any f64.
///
/// # Returns
/// e^x (dimensionless), within 3 ulp of `f64::exp`.
///
/// # Examples
/// ```
/// use stocktank::fastmath::exp;
/// assert_eq!(exp(0.0), 1.0);
/// assert!((exp(1.0) / std::f64::consts::E - 1.0).abs() < 1e-15);
/// assert_eq!(exp(-800.0), 0.0);
/// assert_eq!(exp(800.0), f64::INFINITY);
/// assert!(exp(f64::NAN).is_nan());
/// ```
///
/// # References
/// Cody, W.J., Waite, W. (1980). Software Manual for the Elementary Functions. Prentice-Hall.
#[inline(always)]
pub fn exp(x: f64) -> f64 {
    // Outside [-746, 710] the result is 0 or inf anyway; the clamp keeps n in the range where
    // the two scalings are normal numbers (NaN passes through the clamp).
    let (p, n) = exp_reduced(x.clamp(-746.0, 710.0));
    // n in [-1077, 1025]: split it in halves so that each 2^k is a normal number.
    let t1 = n * 0.5 + MAGIC;
    let n1 = t1 - MAGIC;
    let t2 = (n - n1) + MAGIC;
    let k1 = t1.to_bits().wrapping_sub(MAGIC.to_bits());
    let k2 = t2.to_bits().wrapping_sub(MAGIC.to_bits());
    let s1 = f64::from_bits(k1.wrapping_add(1023) << 52);
    let s2 = f64::from_bits(k2.wrapping_add(1023) << 52);
    p * s1 * s2
}

/// e^x for x <= 0 with inputs below -700 taken as -700 (so the result is a normal number
/// and one scaling by 2^n suffices): the exponential of the Dranchuk–Abou-Kassem batch
/// solver, whose argument -0.721 rho_r^2 is never positive. Same bits as [`exp`] on
/// [-700, 0] (scaling by a power of two is exact for normal results; unit-tested).
#[inline(always)]
pub(crate) fn exp_nonpositive(x: f64) -> f64 {
    let (p, n) = exp_reduced(x.max(-700.0));
    let k = (n + MAGIC).to_bits().wrapping_sub(MAGIC.to_bits());
    p * f64::from_bits(k.wrapping_add(1023) << 52)
}

/// The largest |a| for which [`exp_small`] keeps its accuracy: 1/64.
pub(crate) const EXP_SMALL_MAX: f64 = 1.0 / 64.0;

/// e^a for |a| <= [`EXP_SMALL_MAX`], by its Taylor polynomial of degree 6 (truncation
/// a^7/7! < 1e-16 relative) in Estrin's scheme; about a third of the work of [`exp`].
/// For updating an exponential along a converging iteration (e^(x + a) = e^x e^a). Outside
/// that range the value is inaccurate (callers check the range themselves).
#[inline(always)]
pub(crate) fn exp_small(a: f64) -> f64 {
    let a2 = a * a;
    let a4 = a2 * a2;
    let q0 = (1.0 + a) + (0.5 + a * (1.0 / 6.0)) * a2;
    let q1 = (1.0 / 24.0 + a * (1.0 / 120.0)) + a2 * (1.0 / 720.0);
    q0 + q1 * a4
}

/// The shared core of [`exp`] and [`exp_nonpositive`]: `(e^r, n)` with x = n ln2 + r,
/// |r| <= ln2 / 2 (Cody–Waite reduction, ln2 split in a high and a low part) and e^r by its
/// Taylor polynomial of degree 12 (truncation below 2e-16 relative) in Estrin's scheme.
#[inline(always)]
fn exp_reduced(x: f64) -> (f64, f64) {
    let t = x * std::f64::consts::LOG2_E + MAGIC;
    let n = t - MAGIC;
    let r = (x - n * LN2_HI) - n * LN2_LO;
    const C: [f64; 13] = [
        1.0,
        1.0,
        1.0 / 2.0,
        1.0 / 6.0,
        1.0 / 24.0,
        1.0 / 120.0,
        1.0 / 720.0,
        1.0 / 5_040.0,
        1.0 / 40_320.0,
        1.0 / 362_880.0,
        1.0 / 3_628_800.0,
        1.0 / 39_916_800.0,
        1.0 / 479_001_600.0,
    ];
    // Estrin's scheme: a short dependency chain instead of Horner's twelve steps.
    let r2 = r * r;
    let r4 = r2 * r2;
    let r8 = r4 * r4;
    let q0 = (C[0] + C[1] * r) + (C[2] + C[3] * r) * r2;
    let q1 = (C[4] + C[5] * r) + (C[6] + C[7] * r) * r2;
    let q2 = (C[8] + C[9] * r) + (C[10] + C[11] * r) * r2;
    let p = (q0 + q1 * r4) + (q2 + C[12] * r4) * r8;
    (p, n)
}

/// Natural logarithm, branch-free (see the module docs for the accuracy and the special
/// values).
///
/// # Formula
/// ```text
/// x = 2^k m, m in [sqrt(1/2), sqrt(2))     (subnormal x scaled by 2^54 first)
/// f = m - 1, s = f / (2 + f), ln(1 + f) = 2 atanh(s) = 2s + s R(s^2)  (fdlibm minimax R)
/// ln x = k ln2_hi - ((f^2/2 - (s (f^2/2 + R) + k ln2_lo)) - f)
/// ```
///
/// # Arguments
/// * `x` - any f64 (the logarithm is real for x >= 0).
///
/// # Returns
/// ln x, within 1 ulp of `f64::ln`.
///
/// # Examples
/// ```
/// use stocktank::fastmath::ln;
/// assert_eq!(ln(1.0), 0.0);
/// assert!((ln(10.0) / std::f64::consts::LN_10 - 1.0).abs() < 1e-15);
/// assert_eq!(ln(0.0), f64::NEG_INFINITY);
/// assert!(ln(-1.0).is_nan());
/// ```
///
/// # References
/// Tang, P.T.P. (1990). ACM Transactions on Mathematical Software 16(4), 378–400; Sun
/// Microsystems (1993), fdlibm `e_log.c` (coefficients).
#[inline(always)]
pub fn ln(x: f64) -> f64 {
    const LG1: f64 = 6.666_666_666_666_735e-1;
    const LG2: f64 = 3.999_999_999_940_942e-1;
    const LG3: f64 = 2.857_142_874_366_239e-1;
    const LG4: f64 = 2.222_219_843_214_978_4e-1;
    const LG5: f64 = 1.818_357_216_161_805e-1;
    const LG6: f64 = 1.531_383_769_920_937_3e-1;
    const LG7: f64 = 1.479_819_860_511_658_6e-1;
    const TWO54: f64 = 18_014_398_509_481_984.0;
    // 2^52 as a float: OR-ing an integer below 2^52 into its mantissa and subtracting it
    // converts the integer to a float without an integer-to-float instruction.
    const TWO52_BITS: u64 = 0x4330_0000_0000_0000;
    const TWO52: f64 = 4_503_599_627_370_496.0;
    let sub = x < f64::MIN_POSITIVE;
    let xs = if sub { x * TWO54 } else { x };
    let bits = xs.to_bits();
    let e_biased = f64::from_bits((bits >> 52) | TWO52_BITS) - TWO52;
    let m = f64::from_bits((bits & 0x000f_ffff_ffff_ffff) | 0x3ff0_0000_0000_0000);
    let big = m > std::f64::consts::SQRT_2;
    let m = if big { 0.5 * m } else { m };
    let k = e_biased - 1023.0 + if big { 1.0 } else { 0.0 } - if sub { 54.0 } else { 0.0 };
    let f = m - 1.0;
    let s = f / (2.0 + f);
    let z = s * s;
    let w = z * z;
    let r = z * (LG1 + w * (LG3 + w * (LG5 + w * LG7))) + w * (LG2 + w * (LG4 + w * LG6));
    let hfsq = 0.5 * f * f;
    let y = k * LN2_HI - ((hfsq - (s * (hfsq + r) + k * LN2_LO)) - f);
    // Special values last, as selects: positive finite x is the common case.
    if x > 0.0 && x < f64::INFINITY {
        y
    } else if x == 0.0 {
        f64::NEG_INFINITY
    } else if x == f64::INFINITY {
        x
    } else {
        f64::NAN
    }
}

/// x^y for a positive base as `exp(y ln x)`: the power law of the fluid correlations.
///
/// # Formula
/// ```text
/// x^y = exp(y ln x)
/// ```
///
/// # Arguments
/// * `x` - base, > 0 for a real result (0 gives 0 for y > 0 and inf for y < 0; a negative
///   base or NaN gives NaN).
/// * `y` - exponent, any finite f64.
///
/// # Returns
/// x^y, relative error about `(|y ln x| + 4) * 1.1e-16` (see the module docs).
///
/// # Examples
/// ```
/// use stocktank::fastmath::pow_positive;
/// assert!((pow_positive(2.0, 10.0) - 1024.0).abs() < 1e-12);
/// assert!((pow_positive(600.0, 1.2) / 600f64.powf(1.2) - 1.0).abs() < 1e-15);
/// ```
///
/// # References
/// As [`exp`] and [`ln`].
#[inline(always)]
pub fn pow_positive(x: f64, y: f64) -> f64 {
    exp(y * ln(x))
}

/// e^x for code that evaluates one value at a time (a row loop that the compiler cannot
/// vectorise): the system library's `f64::exp`.
///
/// On x86-64 the system library picks an FMA version at run time, while this crate is built
/// for the baseline target without FMA; one value at a time, [`exp`] / [`ln`] then lose:
/// measured 6 ln + 7 exp per row at about 1.6x the time of the system library's on the
/// project's machine (`examples/profile_black_oil.rs`). [`exp`] and [`ln`] pay off where a
/// loop over lanes vectorises (the Dranchuk–Abou-Kassem batch kernel). Scalar kernels call
/// these `*_scalar` forms so that the choice stays in one place.
///
/// # Arguments
/// * `x` - any f64.
///
/// # Returns
/// e^x (the system library's, typically within 1 ulp).
///
/// # Examples
/// ```
/// assert_eq!(stocktank::fastmath::exp_scalar(0.0), 1.0);
/// ```
///
/// # References
/// The platform's C library (`exp`).
#[inline(always)]
pub fn exp_scalar(x: f64) -> f64 {
    x.exp()
}

/// ln x for code that evaluates one value at a time: the system library's `f64::ln` (see
/// [`exp_scalar`] for why).
///
/// # Arguments
/// * `x` - any f64.
///
/// # Returns
/// ln x.
///
/// # Examples
/// ```
/// assert_eq!(stocktank::fastmath::ln_scalar(1.0), 0.0);
/// ```
///
/// # References
/// The platform's C library (`log`).
#[inline(always)]
pub fn ln_scalar(x: f64) -> f64 {
    x.ln()
}

/// x^y = exp(y ln x) for a positive base, one value at a time (see [`exp_scalar`]).
///
/// # Arguments
/// * `x` - base, > 0 (0 gives 0 for y > 0).
/// * `y` - exponent.
///
/// # Returns
/// x^y, relative error about `(|y ln x| + 2) * 1.1e-16`.
///
/// # Examples
/// ```
/// assert!((stocktank::fastmath::pow_positive_scalar(600.0, 1.2) / 600f64.powf(1.2) - 1.0).abs() < 1e-15);
/// ```
///
/// # References
/// As [`exp_scalar`].
#[inline(always)]
pub fn pow_positive_scalar(x: f64, y: f64) -> f64 {
    exp_scalar(y * ln_scalar(x))
}

/// The exponential and logarithm a prepared correlation is evaluated with: the one formula
/// of each correlation is written once, generic over this choice, and instantiated twice --
/// with [`System`] where values come one at a time (the scalar kernels), with [`Lanes`]
/// inside loops over whole columns that the compiler vectorises (the black-oil table
/// builder). The two give the same values to a few units in the last place (see the module
/// docs).
pub(crate) trait Elementary {
    /// e^x.
    fn exp(x: f64) -> f64;
    /// ln x.
    fn ln(x: f64) -> f64;
    /// x^y = exp(y ln x) for a positive base.
    #[inline(always)]
    fn pow_positive(x: f64, y: f64) -> f64 {
        Self::exp(y * Self::ln(x))
    }
}

/// [`exp_scalar`] / [`ln_scalar`]: the system library, one value at a time.
pub(crate) struct System;

impl Elementary for System {
    #[inline(always)]
    fn exp(x: f64) -> f64 {
        exp_scalar(x)
    }
    #[inline(always)]
    fn ln(x: f64) -> f64 {
        ln_scalar(x)
    }
}

/// [`exp`] / [`ln`]: branch-free, for loops over lanes.
pub(crate) struct Lanes;

impl Elementary for Lanes {
    #[inline(always)]
    fn exp(x: f64) -> f64 {
        exp(x)
    }
    #[inline(always)]
    fn ln(x: f64) -> f64 {
        ln(x)
    }
}

#[cfg(test)]
mod tests {
    #[test]
    fn exp_small_matches_std_within_2_ulp_on_its_range() {
        for k in -1000..=1000 {
            let a = EXP_SMALL_MAX * k as f64 / 1000.0;
            let (got, want) = (exp_small(a), a.exp());
            assert!(
                (got - want).abs() <= 2.0 * f64::EPSILON * want,
                "{a}: {got} vs {want}"
            );
        }
        assert_eq!(exp_small(0.0), 1.0);
    }

    #[test]
    fn exp_nonpositive_matches_exp_bit_for_bit_and_std_within_3_ulp() {
        let mut worst: f64 = 0.0;
        for i in 0..=700_000 {
            let x = -700.0 * i as f64 / 700_000.0;
            let a = exp_nonpositive(x);
            assert_eq!(a.to_bits(), exp(x).to_bits(), "x = {x}");
            if x > -30.0 {
                let b = x.exp();
                worst = worst.max(((a - b) / b).abs());
            }
        }
        assert!(worst < 6.7e-16, "worst relative error {worst}"); // 3 ulp
        assert_eq!(exp_nonpositive(0.0), 1.0);
        assert_eq!(exp_nonpositive(-1e6), exp(-700.0));
    }

    use super::*;

    /// Distance in units in the last place between two finite floats of the same sign.
    fn ulps(a: f64, b: f64) -> u64 {
        if a == b {
            return 0;
        }
        (a.to_bits() as i64 - b.to_bits() as i64).unsigned_abs()
    }

    /// A deterministic spread of `n` values over [lo, hi].
    fn spread(lo: f64, hi: f64, n: usize) -> impl Iterator<Item = f64> {
        (0..=n).map(move |i| lo + (hi - lo) * i as f64 / n as f64)
    }

    #[test]
    fn exp_within_3_ulp_over_the_whole_range() {
        let mut worst = 0;
        for x in spread(-745.0, 709.7, 2_000_000).chain(spread(-1.0, 1.0, 200_000)) {
            // Also in the subnormal range (x < -708.4), where an ulp is 5e-324.
            worst = worst.max(ulps(exp(x), x.exp()));
        }
        assert!(worst <= 3, "worst {worst} ulp");
    }

    #[test]
    fn exp_special_values() {
        assert_eq!(exp(0.0), 1.0);
        assert_eq!(exp(-0.0), 1.0);
        assert!(exp(f64::NAN).is_nan());
        assert_eq!(exp(f64::INFINITY), f64::INFINITY);
        assert_eq!(exp(f64::NEG_INFINITY), 0.0);
        assert_eq!(exp(709.79), f64::INFINITY);
        assert_eq!(exp(1e300), f64::INFINITY);
        assert_eq!(exp(-746.0), 0.0);
        assert_eq!(exp(-1e300), 0.0);
        // Largest finite and smallest subnormal results.
        assert!(exp(709.78).is_finite());
        assert!(exp(-744.4) > 0.0);
        assert_eq!(exp(-1e-300), 1.0);
        assert_eq!(exp(1e-300), 1.0);
    }

    #[test]
    fn ln_within_1_ulp_over_the_whole_range() {
        let mut worst = 0;
        // Every binade from the subnormals to the largest floats, several mantissas each.
        for e in -1074..=1023 {
            for m in spread(1.0, 2.0, 64) {
                let x = m * 2f64.powi(e);
                if x > 0.0 && x.is_finite() {
                    worst = worst.max(ulps(ln(x), x.ln()));
                }
            }
        }
        // Dense near 1, where ln is small and relative accuracy hardest.
        for x in spread(0.5, 2.0, 1_000_000) {
            worst = worst.max(ulps(ln(x), x.ln()));
        }
        assert!(worst <= 1, "worst {worst} ulp");
    }

    #[test]
    fn ln_special_values() {
        assert_eq!(ln(1.0), 0.0);
        assert_eq!(ln(0.0), f64::NEG_INFINITY);
        assert_eq!(ln(-0.0), f64::NEG_INFINITY);
        assert_eq!(ln(f64::INFINITY), f64::INFINITY);
        assert!(ln(-1.0).is_nan());
        assert!(ln(f64::NEG_INFINITY).is_nan());
        assert!(ln(f64::NAN).is_nan());
        assert_eq!(ln(5e-324), (5e-324f64).ln());
        assert_eq!(ln(f64::MAX), f64::MAX.ln());
    }

    #[test]
    fn pow_positive_close_to_powf_for_correlation_exponents() {
        let mut worst: f64 = 0.0;
        for x in spread(1e-3, 1e4, 100_000) {
            for y in [
                -1.163,
                -0.515,
                -0.338,
                0.2,
                0.83,
                1.0 / 0.83,
                1.187,
                1.2,
                2.0,
            ] {
                let (a, b) = (pow_positive(x, y), x.powf(y));
                let bound = ((y * x.ln()).abs() + 4.0) * f64::EPSILON;
                assert!(((a - b) / b).abs() <= bound, "{x}^{y}: {a} vs {b}");
                worst = worst.max(((a - b) / b).abs());
            }
        }
        assert!(worst < 5e-15, "worst relative error {worst}");
    }
}
