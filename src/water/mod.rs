//! Formation water (brine) properties: formation volume factor Bw, gas solubility Rsw,
//! isothermal compressibility (gas-free, with dissolved gas, and with gas release), viscosity
//! with salinity and pressure corrections, and density with salinity. Field units.
//!
//! Every quantity has one scalar kernel (`fn(...) -> Result<f64>`); the array versions
//! (`*_array`) broadcast like numpy through [`crate::array::lift`]. The [`Water`] description
//! bundles salinity, gas saturation, the viscosity method and the standard conditions, and
//! offers `bw`, `rsw`, `density`, `compressibility` and `viscosity` at (p, T).
//!
//! # Salinity
//! Salinity is total dissolved solids as **weight percent of the brine** (`salinity_wt_pct`,
//! grams of solids per 100 g of solution), treated as sodium chloride equivalent, which is how
//! the correlations below were fitted. [`salinity_ppm_to_wt_pct`] converts parts per million
//! **by mass** (mg of solids per kg of brine): wt% = ppm / 10,000. Laboratory reports in mg/L
//! are per volume; [`salinity_mg_per_l_to_wt_pct`] converts them with the brine density at
//! 60 degF and 14.696 psia from [`density_sc_mccain`].
//!
//! # Published ranges and accuracy
//! | correlation | p, psia | T, degF | salinity, wt% | published accuracy |
//! |---|---|---|---|---|
//! | Bw, McCain (1990) | up to 5,000 | up to 260 | any (effects cancel) | within 2% |
//! | density at 60 degF, McCain (1990) | 14.696 | 60 | 0 to 26 (NaCl saturation, common practice) | not stated (from memory) |
//! | Rsw pure water, McCain (1991) | 1,000 to 10,000 | 100 to 340 | 0 | within 5% |
//! | Rsw salinity factor, McCain (1991) | - | 70 to 250 | 0 to 30 | within 3% |
//! | cw gas-free, Osif (1988) | 1,000 to 20,000 | 200 to 270 | 0 to 200 g/L NaCl (about 0 to 17 wt%) | not stated here (not at hand) |
//! | viscosity at 1 atm, McCain (1991) | 14.696 | 100 to 400 | 0 to 26 | within 5% |
//! | viscosity pressure factor, McCain (1991) | up to 14,000 | 86.5 to 167 | - | within 4% below 10,000 psia, 7% above |
//! | viscosity, Meehan (1980) | up to 10,000 (from memory) | 60 to 400 (from memory) | 0 to 26 (from memory) | not stated here (not at hand) |
//!
//! The ranges and accuracies are quoted from memory of the papers (the papers were not at
//! hand). Outside the ranges the correlations are still evaluated; call the `*_in_range`
//! functions to know.
//!
//! # Measured deviations from IAPWS-95 (pure, gas-free water)
//! IAPWS-95 as computed by CoolProp 6 (HEOS backend), liquid water, zero salinity; the
//! checks live in `tests/water.rs` and `tests/python/test_water.py`.
//!
//! | quantity | 100-300 degF, 1,000-10,000 psia | worst point |
//! |---|---|---|
//! | Bw, McCain (1990) | -0.9% to +0.9% | +0.86% (100 degF, 5,000 psia); -0.91% (300 degF, 10,000 psia) |
//! | density, McCain (1990) | -0.9% to +0.9% | mirror of Bw |
//! | cw gas-free, Osif (1988) | -8.0% to +2.1% | -7.9% at 100 degF (below its range); within 2.7% from 150 to 300 degF |
//! | viscosity, McCain (1991) | -4.3% to +56% | the pressure factor gives +53% to +56% at 10,000 psia; -8.1% at 100 degF, 1 atm |
//! | viscosity, Meehan (1980) | -3.1% to +3.5% | +3.5% at 300 degF, 10,000 psia |
//!
//! Gas solubility has no IAPWS-95 counterpart; against an independent Henry's-law estimate
//! for methane (IAPWS G7-04 Henry constant, CoolProp methane fugacity, Krichevsky–Kasarnovsky
//! Poynting factor; see `tests/python/test_water.py`) McCain's (1991) Rsw of pure water lies
//! within -10.6% to +3.3% on the same grid.
//!
//! McCain's (1991) pressure factor is the published one and is kept as published; it
//! overstates the rise of the viscosity of pure water with pressure by far more than its quoted
//! accuracy. That is why [`ViscosityMethod::Meehan1980`] is the default of [`Water`].
//!
//! These are screening estimates: defer to measured water analyses and laboratory PVT data.
//!
//! # References
//! - McCain, W.D. Jr. (1990). The Properties of Petroleum Fluids, 2nd ed. PennWell, Tulsa,
//!   chapter 16 (water formation volume factor, density).
//! - McCain, W.D. Jr. (1991). Reservoir-fluid property correlations -- state of the art.
//!   SPE Reservoir Engineering 6(2), 266-272. SPE-18571-PA.
//! - Osif, T.L. (1988). The effects of salt, gas, temperature, and pressure on the
//!   compressibility of water. SPE Reservoir Engineering 3(1), 175-181. SPE-13174-PA.
//! - Meehan, D.N. (1980). Estimating water viscosity at reservoir conditions. Petroleum
//!   Engineer International 52(8), 117-118 (from memory); and A correlation for water
//!   compressibility, Petroleum Engineer International 52(13), 125-126 (from memory).
//! - Dodson, C.R., Standing, M.B. (1944). Pressure-volume-temperature and solubility
//!   relations for natural-gas-water mixtures. Drilling and Production Practice, API, 173-179.

use crate::array::{OnError, lift};
use crate::error::{Error, Result, positive, temperature_f};
use crate::units::{KG_PER_LBM, M3_PER_FT3, StandardConditions};
use ndarray::{ArrayD, ArrayViewD};

/// Check a salinity in weight percent: finite and in [0, 100).
#[inline]
fn salinity(arg: &'static str, s: f64) -> Result<f64> {
    if (0.0..100.0).contains(&s) {
        Ok(s)
    } else {
        Err(Error::invalid(
            arg,
            s,
            "salinity must be a weight percent in [0, 100)",
        ))
    }
}

/// Check a pressure in psia.
#[inline]
fn pressure(p: f64) -> Result<f64> {
    positive("p", p)
}

/// Temperature in degF that must be > 0 degF because a correlation divides by it or raises
/// it to a power.
#[inline]
fn positive_f(t: f64) -> Result<f64> {
    if t > 0.0 && t.is_finite() {
        Ok(t)
    } else {
        Err(Error::invalid(
            "t",
            t,
            "this correlation is written in degF and needs t > 0 degF",
        ))
    }
}

// ---------------------------------------------------------------------------------------
// Salinity conversions
// ---------------------------------------------------------------------------------------

/// Convert a salinity in parts per million **by mass** (mg of dissolved solids per kg of
/// brine) to weight percent.
///
/// # Formula
/// ```text
/// S[wt%] = ppm / 10,000
/// ```
/// The assumption: ppm is a mass ratio of dissolved solids to brine (solution), not mg/L.
/// For mg/L use [`salinity_mg_per_l_to_wt_pct`].
///
/// # Arguments
/// * `ppm` - salinity, mg/kg of brine, in [0, 1,000,000).
///
/// # Returns
/// Salinity, weight percent of brine.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `ppm` when it is negative, non-finite or >= 1e6.
///
/// # Examples
/// ```
/// use stocktank::water::salinity_ppm_to_wt_pct;
/// // 35,000 ppm (about sea water) is 3.5 wt% (common practice, no source).
/// assert!((salinity_ppm_to_wt_pct(35_000.0).unwrap() - 3.5).abs() < 1e-12);
/// ```
///
/// # References
/// Definition of parts per million by mass (common practice, no source).
#[inline]
pub fn salinity_ppm_to_wt_pct(ppm: f64) -> Result<f64> {
    if (0.0..1.0e6).contains(&ppm) {
        Ok(ppm / 1.0e4)
    } else {
        Err(Error::invalid(
            "ppm",
            ppm,
            "must be a mass fraction in parts per million in [0, 1e6)",
        ))
    }
}

/// Convert a weight percent to parts per million by mass (the inverse of
/// [`salinity_ppm_to_wt_pct`]).
///
/// # Formula
/// ```text
/// ppm = 10,000 S[wt%]
/// ```
///
/// # Arguments
/// * `salinity_wt_pct` - weight percent of brine, in [0, 100).
///
/// # Returns
/// Salinity, mg of dissolved solids per kg of brine.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `salinity_wt_pct` outside [0, 100).
///
/// # Examples
/// ```
/// assert_eq!(stocktank::water::salinity_wt_pct_to_ppm(3.5).unwrap(), 35_000.0);
/// ```
///
/// # References
/// Definition of parts per million by mass (common practice, no source).
#[inline]
pub fn salinity_wt_pct_to_ppm(salinity_wt_pct: f64) -> Result<f64> {
    Ok(salinity("salinity_wt_pct", salinity_wt_pct)? * 1.0e4)
}

/// Grams per litre in one lbm/ft3.
const G_PER_L_PER_LBM_FT3: f64 = KG_PER_LBM / M3_PER_FT3;

/// Convert a salinity in mg of dissolved solids per litre of brine (at 60 degF, 14.696 psia)
/// to weight percent, using the brine density of [`density_sc_mccain`].
///
/// # Formula
/// ```text
/// C[mg/L] = 10 S rho_sc(S)[g/L]     solved for S (monotone; Newton with bisection fallback,
///                                    bracket [0, 50] wt%, tolerance 1e-12 wt%)
/// ```
/// The assumption: the litre is measured at 60 degF and 14.696 psia and the solids behave as
/// sodium chloride in the density correlation.
///
/// # Arguments
/// * `mg_per_l` - salinity, mg of dissolved solids per litre of brine, in [0, about
///   707,000] (50 wt%).
///
/// # Returns
/// Salinity, weight percent of brine.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `mg_per_l` when negative, non-finite or beyond 50 wt%
/// (about 707,000 mg/L).
///
/// # Examples
/// ```
/// use stocktank::water::{density_sc_mccain, salinity_mg_per_l_to_wt_pct};
/// let s = salinity_mg_per_l_to_wt_pct(100_000.0).unwrap();
/// // round trip: 10 * S * rho(S) in g/L gives back the mg/L
/// let rho_g_per_l = density_sc_mccain(s).unwrap() * 16.018_463;
/// assert!((10.0 * s * rho_g_per_l / 100_000.0 - 1.0).abs() < 1e-6);
/// ```
///
/// # References
/// McCain (1990), brine density at standard conditions (see [`density_sc_mccain`]).
pub fn salinity_mg_per_l_to_wt_pct(mg_per_l: f64) -> Result<f64> {
    let f = |s: f64| 10.0 * s * density_sc_raw(s) * G_PER_L_PER_LBM_FT3 - mg_per_l;
    let (mut lo, mut hi) = (0.0_f64, 50.0_f64);
    if !(0.0..=f(hi) + mg_per_l).contains(&mg_per_l) {
        return Err(Error::invalid(
            "mg_per_l",
            mg_per_l,
            "must be finite, >= 0 and at most 50 wt% of the brine (about 707,000 mg/L)",
        ));
    }
    // f is strictly increasing on [0, 50]; Newton from the dilute guess, bisection fallback.
    let mut s = (mg_per_l / (10.0 * density_sc_raw(0.0) * G_PER_L_PER_LBM_FT3)).min(hi);
    for _ in 0..100 {
        let fs = f(s);
        if fs.abs() <= 1e-9 * mg_per_l.max(1.0) {
            return Ok(s);
        }
        if fs > 0.0 {
            hi = s;
        } else {
            lo = s;
        }
        let d = 10.0 * G_PER_L_PER_LBM_FT3 * (density_sc_raw(s) + s * density_sc_slope(s));
        let next = s - fs / d;
        s = if next > lo && next < hi {
            next
        } else {
            0.5 * (lo + hi)
        };
        if hi - lo < 1e-12 {
            return Ok(s);
        }
    }
    Err(Error::NoConvergence {
        method: "salinity_mg_per_l_to_wt_pct",
        detail: format!("bracket [{lo}, {hi}] wt% after 100 iterations"),
    })
}

// ---------------------------------------------------------------------------------------
// Density and formation volume factor
// ---------------------------------------------------------------------------------------

#[inline]
fn density_sc_raw(s: f64) -> f64 {
    62.368 + 0.438_603 * s + 1.600_74e-3 * s * s
}

#[inline]
fn density_sc_slope(s: f64) -> f64 {
    0.438_603 + 2.0 * 1.600_74e-3 * s
}

/// Brine density at 60 degF and 14.696 psia from salinity, McCain (1990).
///
/// # Formula
/// ```text
/// rho_w,sc = 62.368 + 0.438603 S + 1.60074e-3 S^2      lbm/ft3, S in wt%
/// ```
///
/// # Arguments
/// * `salinity_wt_pct` - total dissolved solids, wt% of brine, [0, 100); fitted for 0 to
///   about 26 wt% (NaCl saturation, common practice, no source).
///
/// # Returns
/// Density at 60 degF and 14.696 psia, lbm/ft3.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `salinity_wt_pct` outside [0, 100).
///
/// # Examples
/// ```
/// use stocktank::water::density_sc_mccain;
/// // pure water at 60 degF: 62.37 lbm/ft3 (common practice, no source)
/// assert!((density_sc_mccain(0.0).unwrap() - 62.37).abs() < 0.01);
/// ```
///
/// # References
/// McCain, W.D. Jr. (1990). The Properties of Petroleum Fluids, 2nd ed., PennWell,
/// chapter 16, brine density at standard conditions (equation number from memory: 16-1).
#[inline]
pub fn density_sc_mccain(salinity_wt_pct: f64) -> Result<f64> {
    Ok(density_sc_raw(salinity(
        "salinity_wt_pct",
        salinity_wt_pct,
    )?))
}

/// McCain's B at 14.696 psia and 60 degF (the default standard conditions).
const FIELD_BW_BASE: f64 = bw_raw(14.696, 60.0);

/// McCain's Bw relative to the correlation's own base state (60 degF, 14.696 psia).
#[inline]
const fn bw_raw(p: f64, t: f64) -> f64 {
    let dvt = -1.0001e-2 + 1.333_91e-4 * t + 5.506_54e-7 * t * t;
    let dvp =
        -1.953_01e-9 * p * t - 1.728_34e-13 * p * p * t - 3.589_22e-7 * p - 2.253_41e-10 * p * p;
    (1.0 + dvt) * (1.0 + dvp)
}

/// d(bw_raw)/dp, 1/psi times rb/STB.
#[inline]
fn bw_raw_dp(p: f64, t: f64) -> f64 {
    let dvt = -1.0001e-2 + 1.333_91e-4 * t + 5.506_54e-7 * t * t;
    let d_dvp =
        -1.953_01e-9 * t - 2.0 * 1.728_34e-13 * p * t - 3.589_22e-7 - 2.0 * 2.253_41e-10 * p;
    (1.0 + dvt) * d_dvp
}

fn check_sc(sc: &StandardConditions) -> Result<()> {
    positive("p_sc", sc.p_psia)?;
    temperature_f("t_sc", sc.t_f)?;
    Ok(())
}

/// Water formation volume factor Bw, McCain (1990).
///
/// # Formula
/// ```text
/// dVwt = -1.0001e-2 + 1.33391e-4 T + 5.50654e-7 T^2
/// dVwp = -1.95301e-9 p T - 1.72834e-13 p^2 T - 3.58922e-7 p - 2.25341e-10 p^2
/// B(p, T) = (1 + dVwt)(1 + dVwp)
/// Bw = B(p, T) / B(p_sc, T_sc)
/// ```
/// T in degF, p in psia. dVwt and dVwp are the volume changes of water from 60 degF and
/// 14.696 psia on heating and on compression; the division by B(p_sc, T_sc) refers the
/// volume to the chosen standard conditions (at 60 degF and 14.696 psia it is 0.99998). The
/// correlation was fitted to pure-water data; McCain reports that salinity changes dVwt and
/// dVwp in opposite directions so that the result holds for brines, and that the small
/// volume of dissolved gas does not change it materially (from memory). It serves for both
/// gas-free and gas-saturated water.
///
/// # Arguments
/// * `p_psia` - pressure, psia, > 0; published range up to 5,000 psia.
/// * `t_f` - temperature, degF, above absolute zero; published range up to 260 degF.
/// * `sc` - standard conditions the stock-tank water volume is measured at.
///
/// # Returns
/// Bw, reservoir barrels per stock-tank barrel (rb/STB).
///
/// # Errors
/// [`Error::InvalidArgument`] naming `p`, `t`, `p_sc` or `t_sc` for a non-positive pressure
/// or a temperature below absolute zero; naming `p` also far above the range (beyond about
/// 50,000 psia), where the polynomial is no longer a positive volume.
///
/// # Accuracy
/// Published: within 2% in range. Measured against IAPWS-95 (CoolProp) for pure water,
/// 100-300 degF, 1,000-10,000 psia: within 0.91% (see the module docs).
///
/// # Examples
/// ```
/// use stocktank::units::StandardConditions;
/// use stocktank::water::bw_mccain;
/// let sc = StandardConditions::default();
/// assert!((bw_mccain(14.696, 60.0, &sc).unwrap() - 1.0).abs() < 1e-12);
/// // IAPWS-95 (CoolProp): pure water, 200 degF, 5,000 psia: Bw = 1.02128
/// assert!((bw_mccain(5000.0, 200.0, &sc).unwrap() / 1.02128 - 1.0).abs() < 0.02);
/// ```
///
/// # References
/// McCain, W.D. Jr. (1990). The Properties of Petroleum Fluids, 2nd ed., PennWell,
/// chapter 16 (equations from memory: 16-2 to 16-4); restated in McCain (1991), SPE
/// Reservoir Engineering 6(2), 266-272.
#[inline]
pub fn bw_mccain(p_psia: f64, t_f: f64, sc: &StandardConditions) -> Result<f64> {
    let base = bw_base(sc)?;
    bw_over_base(p_psia, t_f, base)
}

/// McCain's B at the standard conditions: the divisor that makes Bw = 1 there.
#[inline]
fn bw_base(sc: &StandardConditions) -> Result<f64> {
    check_sc(sc)?;
    bw_raw_checked(sc.p_psia, sc.t_f)
}

/// The body of [`bw_mccain`] with the standard-condition divisor computed once.
#[inline]
fn bw_over_base(p_psia: f64, t_f: f64, base: f64) -> Result<f64> {
    let p = pressure(p_psia)?;
    let t = temperature_f("t", t_f)?;
    Ok(bw_raw_checked(p, t)? / base)
}

/// [`bw_raw`], with an error where the polynomial stops being a volume (far outside range).
#[inline]
fn bw_raw_checked(p: f64, t: f64) -> Result<f64> {
    let b = bw_raw(p, t);
    if b > 0.0 {
        Ok(b)
    } else {
        Err(Error::invalid(
            "p",
            p,
            "too far above the range of McCain's Bw correlation (Bw would not be positive)",
        ))
    }
}

/// Brine density at reservoir conditions, McCain (1990): the standard-condition density
/// over the formation volume factor.
///
/// # Formula
/// ```text
/// rho_w = rho_w,sc(S) / B(p, T)
/// ```
/// with `rho_w,sc` of [`density_sc_mccain`] and `B` McCain's Bw relative to 60 degF and
/// 14.696 psia (its own base state, independent of the user's standard conditions). The mass
/// of dissolved gas is neglected (McCain 1990).
///
/// # Arguments
/// * `p_psia` - pressure, psia, > 0; published range of Bw up to 5,000 psia.
/// * `t_f` - temperature, degF, above absolute zero; published range of Bw up to 260 degF.
/// * `salinity_wt_pct` - wt% of brine, [0, 100); fitted for 0 to about 26.
///
/// # Returns
/// Density, lbm/ft3.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `p`, `t` or `salinity_wt_pct`; naming `p` also far
/// above the range, where the Bw polynomial is no longer positive.
///
/// # Accuracy
/// Measured against IAPWS-95 (CoolProp), pure water, 100-300 degF, 1,000-10,000 psia: within
/// 0.91%.
///
/// # Examples
/// ```
/// use stocktank::water::density_mccain;
/// // IAPWS-95 (CoolProp): pure water at 200 degF and 5,000 psia, 61.067 lbm/ft3
/// assert!((density_mccain(5000.0, 200.0, 0.0).unwrap() / 61.067 - 1.0).abs() < 0.02);
/// ```
///
/// # References
/// McCain, W.D. Jr. (1990). The Properties of Petroleum Fluids, 2nd ed., PennWell, chapter 16.
#[inline]
pub fn density_mccain(p_psia: f64, t_f: f64, salinity_wt_pct: f64) -> Result<f64> {
    let p = pressure(p_psia)?;
    let t = temperature_f("t", t_f)?;
    let rho_sc = density_sc_mccain(salinity_wt_pct)?;
    Ok(rho_sc / bw_raw_checked(p, t)?)
}

// ---------------------------------------------------------------------------------------
// Gas solubility
// ---------------------------------------------------------------------------------------

/// (A, B, C) of McCain's pure-water gas solubility at temperature T (degF).
#[inline]
fn rsw_coefficients(t: f64) -> (f64, f64, f64) {
    let t2 = t * t;
    let t3 = t2 * t;
    let a = 8.158_39 - 6.122_65e-2 * t + 1.916_63e-4 * t2 - 2.1654e-7 * t3;
    let b = 1.010_21e-2 - 7.442_41e-5 * t + 3.055_53e-7 * t2 - 2.948_83e-10 * t3;
    let c = -1.0e-7
        * (9.025_05 - 0.130_237 * t + 8.534_25e-4 * t2 - 2.341_22e-6 * t3 + 2.370_49e-9 * t2 * t2);
    (a, b, c)
}

/// Salinity factor Rsw/Rsw,pure = 10^(-0.0840655 S T^-0.285854).
#[inline]
fn rsw_salinity_factor(t: f64, s: f64) -> f64 {
    if s == 0.0 {
        return 1.0;
    }
    // 10^x as exp(x ln 10): the same number, cheaper than powf.
    (-0.084_065_5 * std::f64::consts::LN_10 * s * t.powf(-0.285_854)).exp()
}

/// Solubility of natural gas (methane) in brine, McCain (1991).
///
/// # Formula
/// ```text
/// A = 8.15839 - 6.12265e-2 T + 1.91663e-4 T^2 - 2.1654e-7 T^3
/// B = 1.01021e-2 - 7.44241e-5 T + 3.05553e-7 T^2 - 2.94883e-10 T^3
/// C = -1e-7 (9.02505 - 0.130237 T + 8.53425e-4 T^2 - 2.34122e-6 T^3 + 2.37049e-9 T^4)
/// Rsw,pure = A + B p + C p^2
/// log10(Rsw / Rsw,pure) = -0.0840655 S T^-0.285854
/// ```
/// T in degF, p in psia, S in wt%. The pure-water part is a fit to the methane solubility
/// data of Culberson and McKetta (1951).
///
/// # Arguments
/// * `p_psia` - pressure, psia, > 0; published range 1,000 to 10,000 psia.
/// * `t_f` - temperature, degF, > 0; published range 100 to 340 degF (salinity factor 70 to
///   250 degF).
/// * `salinity_wt_pct` - wt% of brine, [0, 100); published range 0 to 30.
///
/// # Returns
/// Rsw, standard cubic feet of gas per stock-tank barrel of water (scf/STB), at the gas
/// saturation pressure `p`. Computed as published outside its range (it does not go to zero
/// at atmospheric pressure, and the quadratic turns down above about 11,000 psia), except
/// that it is floored at 0 where the polynomial turns negative (above about 430 degF at low
/// pressure), since a solubility cannot be negative.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `p`, `t` (must be > 0 degF for the power law) or
/// `salinity_wt_pct`.
///
/// # Accuracy
/// Published: within 5% (pure water), salinity factor within 3%. Measured against an
/// independent Henry's-law estimate for methane in pure water (IAPWS G7-04 with CoolProp
/// fugacities), 100-300 degF, 1,000-10,000 psia: -10.6% to +3.3%.
///
/// # Examples
/// ```
/// use stocktank::water::rsw_mccain;
/// let r = rsw_mccain(5000.0, 200.0, 0.0).unwrap();
/// // Methane solubility in water at 200 degF and 5,000 psia is roughly 20 scf/STB
/// // (common practice, no source).
/// assert!(r > 15.0 && r < 25.0);
/// assert!(rsw_mccain(5000.0, 200.0, 10.0).unwrap() < r); // salting out
/// ```
///
/// # References
/// McCain, W.D. Jr. (1991). Reservoir-fluid property correlations -- state of the art.
/// SPE Reservoir Engineering 6(2), 266-272 (equations from memory: 16-7 to 16-9 of the 1990
/// book). Culberson, O.L., McKetta, J.J. Jr. (1951). Phase equilibria in hydrocarbon-water
/// systems III: the solubility of methane in water at pressures to 10,000 psia. Petroleum
/// Transactions AIME 192, 223-226.
#[inline]
pub fn rsw_mccain(p_psia: f64, t_f: f64, salinity_wt_pct: f64) -> Result<f64> {
    let p = pressure(p_psia)?;
    let t = positive_f(t_f)?;
    let s = salinity("salinity_wt_pct", salinity_wt_pct)?;
    let (a, b, c) = rsw_coefficients(t);
    Ok(((a + b * p + c * p * p) * rsw_salinity_factor(t, s)).max(0.0))
}

/// d(Rsw)/dp of [`rsw_mccain`], scf/STB/psi.
#[inline]
fn rsw_dp(p: f64, t: f64, s: f64) -> f64 {
    let (_, b, c) = rsw_coefficients(t);
    (b + 2.0 * c * p) * rsw_salinity_factor(t, s)
}

// ---------------------------------------------------------------------------------------
// Compressibility
// ---------------------------------------------------------------------------------------

/// Isothermal compressibility of gas-free brine, Osif (1988).
///
/// # Formula
/// ```text
/// cw = 1 / (7.033 p + 0.5415 C - 537.0 T + 403,300)
/// C = 10 S rho_w,sc(S)[g/L]       mg/L of NaCl, from wt% with the density of McCain (1990)
/// ```
/// p in psia, T in degF, C in mg/L (0.5415 per mg/L is 541.5 per g/L).
///
/// # Arguments
/// * `p_psia` - pressure, psia, > 0; published range 1,000 to 20,000 psia.
/// * `t_f` - temperature, degF; published range 200 to 270 degF.
/// * `salinity_wt_pct` - wt% of brine, [0, 100); published range 0 to 200 g/L NaCl
///   (about 0 to 17.3 wt%).
///
/// # Returns
/// cw, 1/psi.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `p`, `t` or `salinity_wt_pct`; naming `t` also when
/// the denominator is not positive (far above the range, where the formula breaks down).
///
/// # Accuracy
/// Measured against IAPWS-95 (CoolProp) for pure water at 1,000-10,000 psia: within 2.7%
/// from 150 to 300 degF, -6.6% to -7.9% at 100 degF (below the published range).
///
/// # Examples
/// ```
/// use stocktank::water::cw_osif;
/// // IAPWS-95 (CoolProp): pure water at 200 degF and 5,000 psia, 2.974e-6 1/psi
/// assert!((cw_osif(5000.0, 200.0, 0.0).unwrap() / 2.974e-6 - 1.0).abs() < 0.03);
/// ```
///
/// # References
/// Osif, T.L. (1988). The effects of salt, gas, temperature, and pressure on the
/// compressibility of water. SPE Reservoir Engineering 3(1), 175-181, equation 7 (equation
/// number from memory).
#[inline]
pub fn cw_osif(p_psia: f64, t_f: f64, salinity_wt_pct: f64) -> Result<f64> {
    let p = pressure(p_psia)?;
    let t = temperature_f("t", t_f)?;
    let s = salinity("salinity_wt_pct", salinity_wt_pct)?;
    let c_mg_per_l = 10.0 * s * density_sc_raw(s) * G_PER_L_PER_LBM_FT3;
    let den = 7.033 * p + 0.5415 * c_mg_per_l - 537.0 * t + 403_300.0;
    if den > 0.0 {
        Ok(1.0 / den)
    } else {
        Err(Error::invalid(
            "t",
            t,
            "too hot for the Osif (1988) compressibility (its denominator is not positive)",
        ))
    }
}

/// Isothermal compressibility of brine holding its dissolved gas (no free gas): the
/// gas-free value of Osif (1988) times the Dodson and Standing (1944) factor at the gas
/// solubility of McCain (1991).
///
/// # Formula
/// ```text
/// cw = cw,Osif(p, T, S) (1 + 8.9e-3 Rsw(p, T, S))
/// ```
///
/// # Arguments
/// * `p_psia` - pressure, psia, > 0 (also the gas saturation pressure of the water).
/// * `t_f` - temperature, degF, > 0.
/// * `salinity_wt_pct` - wt% of brine, [0, 100).
///
/// # Returns
/// cw, 1/psi.
///
/// # Errors
/// As [`cw_osif`] and [`rsw_mccain`].
///
/// # Examples
/// ```
/// use stocktank::water::{cw_gas_saturated, cw_osif};
/// let free = cw_osif(5000.0, 200.0, 0.0).unwrap();
/// let sat = cw_gas_saturated(5000.0, 200.0, 0.0).unwrap();
/// assert!(sat > free && sat < 1.3 * free);
/// ```
///
/// # References
/// Dodson, C.R., Standing, M.B. (1944). Drilling and Production Practice, API, 173-179;
/// factor as restated by Meehan (1980), Petroleum Engineer International (from memory).
/// Osif (1988) and McCain (1991) as in [`cw_osif`] and [`rsw_mccain`].
#[inline]
pub fn cw_gas_saturated(p_psia: f64, t_f: f64, salinity_wt_pct: f64) -> Result<f64> {
    let cw = cw_osif(p_psia, t_f, salinity_wt_pct)?;
    let rsw = rsw_mccain(p_psia, t_f, salinity_wt_pct)?;
    Ok(cw * (1.0 + 8.9e-3 * rsw.max(0.0)))
}

/// Isothermal compressibility of gas-saturated brine below its saturation pressure, where a
/// pressure drop releases gas: McCain (1991).
///
/// # Formula
/// ```text
/// cw = -(1/Bw) dBw/dp + (Bg / Bw) dRsw/dp
/// ```
/// with Bw of [`bw_mccain`], Rsw of [`rsw_mccain`] and their analytic pressure derivatives.
/// The first term is the compressibility implied by McCain's Bw polynomial (which fits
/// volumes, not their slope): at 214 degF it is 1.3e-6 1/psi at 1,000 psia, 2.9e-6 at
/// 4,000, 3.4e-6 at 5,000 and 5.1e-6 at 8,000, against 3.4e-6 falling to 2.9e-6 from Osif
/// (1988). It rises with pressure, which water does not do; above 5,000 psia (outside
/// McCain's range) it is unphysical. The gas-release term usually dominates below the
/// saturation pressure.
///
/// # Arguments
/// * `p_psia` - pressure, psia, > 0.
/// * `t_f` - temperature, degF, > 0.
/// * `salinity_wt_pct` - wt% of brine, [0, 100).
/// * `bg_rb_per_scf` - gas formation volume factor at (p, T), reservoir barrels per standard
///   cubic foot, > 0 (from the gas module or a table).
/// * `sc` - standard conditions of Bw.
///
/// # Returns
/// cw, 1/psi.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `p`, `t`, `salinity_wt_pct`, `bg_rb_per_scf`, `p_sc` or
/// `t_sc`.
///
/// # Examples
/// ```
/// use stocktank::units::StandardConditions;
/// use stocktank::water::{cw_osif, cw_with_gas_release};
/// let sc = StandardConditions::default();
/// // Bg of a lean gas at 200 degF and 2,000 psia: 0.00504 z T / p with z = 0.9 is about
/// // 1.5e-3 rb/scf (real-gas law; z from memory)
/// let c = cw_with_gas_release(2000.0, 200.0, 0.0, 1.5e-3, &sc).unwrap();
/// assert!(c > 2.0 * cw_osif(2000.0, 200.0, 0.0).unwrap()); // released gas dominates
/// ```
///
/// # References
/// McCain, W.D. Jr. (1991). Reservoir-fluid property correlations -- state of the art.
/// SPE Reservoir Engineering 6(2), 266-272.
#[inline]
pub fn cw_with_gas_release(
    p_psia: f64,
    t_f: f64,
    salinity_wt_pct: f64,
    bg_rb_per_scf: f64,
    sc: &StandardConditions,
) -> Result<f64> {
    let p = pressure(p_psia)?;
    let t = positive_f(t_f)?;
    let s = salinity("salinity_wt_pct", salinity_wt_pct)?;
    let bg = positive("bg_rb_per_scf", bg_rb_per_scf)?;
    check_sc(sc)?;
    // The base-state divisor cancels in dBw/dp / Bw; it scales Bg/Bw.
    let base = bw_raw_checked(sc.p_psia, sc.t_f)?;
    let b = bw_raw_checked(p, t)?;
    let bw = b / base;
    Ok(-bw_raw_dp(p, t) / b + bg / bw * rsw_dp(p, t, s))
}

// ---------------------------------------------------------------------------------------
// Viscosity
// ---------------------------------------------------------------------------------------

/// Viscosity of brine, McCain (1991): a power law in temperature at atmospheric pressure
/// with salinity coefficients, times a pressure factor.
///
/// # Formula
/// ```text
/// A = 109.574 - 8.40564 S + 0.313314 S^2 + 8.72213e-3 S^3
/// B = -1.12166 + 2.63951e-2 S - 6.79461e-4 S^2 - 5.47119e-5 S^3 + 1.55586e-6 S^4
/// mu_w1 = A T^B                                      (cp, at 1 atm)
/// mu_w / mu_w1 = 0.9994 + 4.0295e-5 p + 3.1062e-9 p^2
/// ```
/// T in degF, p in psia, S in wt%.
///
/// # Arguments
/// * `p_psia` - pressure, psia, > 0; published range of the pressure factor up to 14,000.
/// * `t_f` - temperature, degF, > 0; published range 100 to 400 (the pressure factor was
///   fitted from 86.5 to 167 degF).
/// * `salinity_wt_pct` - wt% of brine, [0, 100); published range 0 to 26.
///
/// # Returns
/// Viscosity, cp.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `p`, `t` (> 0 degF) or `salinity_wt_pct`.
///
/// # Accuracy
/// Published: within 5% at 1 atm; the pressure factor within 4% below 10,000 psia, 7% to
/// 15,000 psia. Measured against IAPWS-95 (CoolProp), pure water: -8.1% at 100 degF, 1 atm;
/// the pressure factor gives +15% to +21% at 5,000 psia and +52% to +56% at 10,000 psia,
/// far beyond its quoted accuracy (see the module docs).
///
/// # Examples
/// ```
/// use stocktank::water::viscosity_mccain;
/// // IAPWS (CoolProp): pure water at 200 degF and 1,000 psia, 0.3044 cp
/// assert!((viscosity_mccain(1000.0, 200.0, 0.0).unwrap() / 0.3044 - 1.0).abs() < 0.05);
/// ```
///
/// # References
/// McCain, W.D. Jr. (1991). Reservoir-fluid property correlations -- state of the art.
/// SPE Reservoir Engineering 6(2), 266-272 (equations from memory: 16-10 to 16-12 of the
/// 1990 book).
#[inline]
pub fn viscosity_mccain(p_psia: f64, t_f: f64, salinity_wt_pct: f64) -> Result<f64> {
    let p = pressure(p_psia)?;
    let t = positive_f(t_f)?;
    let s = salinity("salinity_wt_pct", salinity_wt_pct)?;
    Ok(mccain_at(mccain_mu1(t, s), p))
}

/// McCain's (1991) viscosity at 1 atm, cp, at `t` (degF, > 0) and `s` (wt%).
#[inline]
fn mccain_mu1(t: f64, s: f64) -> f64 {
    let s2 = s * s;
    let a = 109.574 - 8.405_64 * s + 0.313_314 * s2 + 8.722_13e-3 * s2 * s;
    let b = -1.121_66 + 2.639_51e-2 * s - 6.794_61e-4 * s2 - 5.471_19e-5 * s2 * s
        + 1.555_86e-6 * s2 * s2;
    a * t.powf(b)
}

/// McCain's (1991) viscosity at `p` (psia) from its 1-atm value `mu1` (cp).
#[inline(always)]
fn mccain_at(mu1: f64, p: f64) -> f64 {
    mu1 * (0.9994 + 4.0295e-5 * p + 3.1062e-9 * p * p)
}

/// Viscosity of brine, Meehan (1980): a hyperbola in temperature at atmospheric pressure
/// with salinity coefficients, times a pressure factor.
///
/// # Formula
/// ```text
/// A = -0.04518 + 0.009313 S - 0.000393 S^2
/// B = 70.634 + 0.09576 S^2
/// mu_w1 = A + B / T                                  (cp, at 1 atm)
/// mu_w = mu_w1 (1 + 3.5e-12 p^2 (T - 40))
/// ```
/// T in degF, p in psia, S in wt%.
///
/// # Arguments
/// * `p_psia` - pressure, psia, > 0; up to 10,000 psia (from memory).
/// * `t_f` - temperature, degF, > 0; 60 to 400 degF (from memory).
/// * `salinity_wt_pct` - wt% of brine, [0, 100); 0 to 26 (from memory).
///
/// # Returns
/// Viscosity, cp.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `p`, `t` (> 0 degF) or `salinity_wt_pct`; naming `t`
/// also where the result would not be positive (above about 1,500 degF).
///
/// # Accuracy
/// Published accuracy not at hand. Measured against IAPWS (CoolProp), pure water,
/// 100-300 degF, 1,000-10,000 psia: -3.1% to +3.5% (see the module docs and tests);
/// against handbook viscosities of NaCl solutions at 68 degF (CRC Handbook, from memory:
/// 1.002, 1.193 and 1.930 cp at 0, 10 and 26 wt%): -0.8% to -0.4%.
///
/// # Examples
/// ```
/// use stocktank::water::viscosity_meehan;
/// // IAPWS (CoolProp): pure water at 200 degF and 10,000 psia, 0.3209 cp
/// assert!((viscosity_meehan(10_000.0, 200.0, 0.0).unwrap() / 0.3209 - 1.0).abs() < 0.03);
/// ```
///
/// # References
/// Meehan, D.N. (1980). Estimating water viscosity at reservoir conditions. Petroleum
/// Engineer International 52(8), 117-118 (from memory), based on the data of
/// Matthews and Russell (1967), Pressure Buildup and Flow Tests in Wells, SPE Monograph 1.
#[inline]
pub fn viscosity_meehan(p_psia: f64, t_f: f64, salinity_wt_pct: f64) -> Result<f64> {
    let p = pressure(p_psia)?;
    let t = positive_f(t_f)?;
    let s = salinity("salinity_wt_pct", salinity_wt_pct)?;
    let mu = meehan_at(meehan_mu1(t, s), p, t);
    if mu > 0.0 {
        Ok(mu)
    } else {
        Err(Error::invalid(
            "t",
            t,
            "too far outside the range of Meehan's viscosity (the viscosity would not be positive)",
        ))
    }
}

/// Meehan's (1980) viscosity at 1 atm, cp, at `t` (degF, > 0) and `s` (wt%).
#[inline]
fn meehan_mu1(t: f64, s: f64) -> f64 {
    let a = -0.045_18 + 0.009_313 * s - 0.000_393 * s * s;
    let b = 70.634 + 0.095_76 * s * s;
    a + b / t
}

/// Meehan's (1980) viscosity at `p` (psia) and `t` (degF) from its 1-atm value `mu1` (cp).
#[inline(always)]
fn meehan_at(mu1: f64, p: f64, t: f64) -> f64 {
    mu1 * (1.0 + 3.5e-12 * p * p * (t - 40.0))
}

/// One brine along one isotherm, its temperature and salinity terms computed once: Bw
/// ([`bw_mccain`]) and viscosity (the chosen method) for columns of pressures, the same
/// formulas as [`Water::bw`] and [`Water::viscosity`] without the per-point checks (the
/// black-oil table builder checks the results: Bw and viscosity must come out positive).
#[derive(Debug, Clone, Copy)]
pub(crate) struct WaterIsotherm {
    t: f64,
    bw_base: f64,
    method: ViscosityMethod,
    mu1: f64,
}

impl WaterIsotherm {
    /// Bw (rb/STB) at every pressure of `p` (psia, finite, > 0) into `out`.
    #[inline(always)]
    pub(crate) fn bw_column(&self, p: &[f64], out: &mut [f64]) {
        for (o, &p) in out.iter_mut().zip(p) {
            *o = bw_raw(p, self.t) / self.bw_base;
        }
    }

    /// Viscosity (cp) at every pressure of `p` (psia, finite, > 0) into `out`.
    #[inline(always)]
    pub(crate) fn viscosity_column(&self, p: &[f64], out: &mut [f64]) {
        let (mu1, t) = (self.mu1, self.t);
        match self.method {
            ViscosityMethod::Meehan1980 => {
                for (o, &p) in out.iter_mut().zip(p) {
                    *o = meehan_at(mu1, p, t);
                }
            }
            ViscosityMethod::McCain1991 => {
                for (o, &p) in out.iter_mut().zip(p) {
                    *o = mccain_at(mu1, p);
                }
            }
        }
    }
}

/// The water viscosity correlation.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Default)]
#[non_exhaustive]
pub enum ViscosityMethod {
    /// Meehan (1980), [`viscosity_meehan`]: the default (closer to IAPWS for pure water
    /// under pressure, see the module docs).
    #[default]
    Meehan1980,
    /// McCain (1991), [`viscosity_mccain`], as published.
    McCain1991,
}

impl ViscosityMethod {
    /// The option names accepted by [`ViscosityMethod::parse`].
    pub const ALLOWED: &'static str = "meehan, mccain";

    /// Parse `"meehan"` or `"mccain"`.
    ///
    /// # Errors
    /// [`Error::InvalidOption`] naming `viscosity_method`.
    ///
    /// # Examples
    /// ```
    /// use stocktank::water::ViscosityMethod;
    /// assert_eq!(ViscosityMethod::parse("mccain").unwrap(), ViscosityMethod::McCain1991);
    /// assert!(ViscosityMethod::parse("other").is_err());
    /// ```
    pub fn parse(s: &str) -> Result<Self> {
        match s {
            "meehan" => Ok(Self::Meehan1980),
            "mccain" => Ok(Self::McCain1991),
            _ => Err(Error::InvalidOption {
                arg: "viscosity_method",
                value: s.to_string(),
                allowed: Self::ALLOWED,
            }),
        }
    }

    /// The option name (`"meehan"` or `"mccain"`).
    ///
    /// # Examples
    /// ```
    /// assert_eq!(stocktank::water::ViscosityMethod::default().name(), "meehan");
    /// ```
    pub fn name(self) -> &'static str {
        match self {
            Self::Meehan1980 => "meehan",
            Self::McCain1991 => "mccain",
        }
    }

    /// Viscosity in cp by this method (see [`viscosity_meehan`], [`viscosity_mccain`]).
    ///
    /// # Errors
    /// As the chosen correlation.
    ///
    /// # Examples
    /// ```
    /// use stocktank::water::ViscosityMethod;
    /// assert!(ViscosityMethod::McCain1991.viscosity(3000.0, 180.0, 5.0).unwrap() > 0.0);
    /// ```
    #[inline]
    pub fn viscosity(self, p_psia: f64, t_f: f64, salinity_wt_pct: f64) -> Result<f64> {
        match self {
            Self::Meehan1980 => viscosity_meehan(p_psia, t_f, salinity_wt_pct),
            Self::McCain1991 => viscosity_mccain(p_psia, t_f, salinity_wt_pct),
        }
    }

    /// Whether (p, T, S) lie in the published range of this method.
    ///
    /// # Examples
    /// ```
    /// use stocktank::water::ViscosityMethod;
    /// assert!(ViscosityMethod::Meehan1980.in_range(3000.0, 180.0, 5.0));
    /// ```
    #[inline]
    pub fn in_range(self, p_psia: f64, t_f: f64, salinity_wt_pct: f64) -> bool {
        match self {
            Self::Meehan1980 => viscosity_meehan_in_range(p_psia, t_f, salinity_wt_pct),
            Self::McCain1991 => viscosity_mccain_in_range(p_psia, t_f, salinity_wt_pct),
        }
    }
}

// ---------------------------------------------------------------------------------------
// Validity (published ranges)
// ---------------------------------------------------------------------------------------

#[inline]
fn within(x: f64, lo: f64, hi: f64) -> bool {
    x >= lo && x <= hi
}

/// Whether (p, T) lie in the published range of [`bw_mccain`] and [`density_mccain`]:
/// 14.696 (standard) to 5,000 psia and 60 (standard) to 260 degF (McCain 1990; the lower
/// ends are the correlation's base state).
///
/// # Examples
/// ```
/// use stocktank::water::bw_mccain_in_range;
/// assert!(bw_mccain_in_range(3000.0, 200.0));
/// assert!(!bw_mccain_in_range(8000.0, 200.0));
/// ```
#[inline]
pub fn bw_mccain_in_range(p_psia: f64, t_f: f64) -> bool {
    within(p_psia, 14.696, 5000.0) && within(t_f, 60.0, 260.0)
}

/// Whether the salinity lies in the fitted range of [`density_sc_mccain`]: 0 to 26 wt%
/// (about NaCl saturation at 60 degF; common practice, no source).
///
/// # Examples
/// ```
/// assert!(stocktank::water::density_sc_mccain_in_range(10.0));
/// ```
#[inline]
pub fn density_sc_mccain_in_range(salinity_wt_pct: f64) -> bool {
    within(salinity_wt_pct, 0.0, 26.0)
}

/// Whether (p, T, S) lie in the published range of [`rsw_mccain`]: 1,000 to 10,000 psia,
/// 100 to 340 degF, and for S > 0 also 70 to 250 degF and S up to 30 wt% (McCain 1991).
///
/// # Examples
/// ```
/// use stocktank::water::rsw_mccain_in_range;
/// assert!(rsw_mccain_in_range(3000.0, 200.0, 5.0));
/// assert!(!rsw_mccain_in_range(3000.0, 300.0, 5.0));
/// assert!(rsw_mccain_in_range(3000.0, 300.0, 0.0));
/// ```
#[inline]
pub fn rsw_mccain_in_range(p_psia: f64, t_f: f64, salinity_wt_pct: f64) -> bool {
    within(p_psia, 1000.0, 10_000.0)
        && within(t_f, 100.0, 340.0)
        && (salinity_wt_pct == 0.0
            || (within(salinity_wt_pct, 0.0, 30.0) && within(t_f, 70.0, 250.0)))
}

/// Whether (p, T, S) lie in the published range of [`cw_osif`]: 1,000 to 20,000 psia,
/// 200 to 270 degF and up to 200 g/L NaCl (Osif 1988), here S up to 17.3 wt% (200 g/L
/// converted with [`density_sc_mccain`]).
///
/// # Examples
/// ```
/// use stocktank::water::cw_osif_in_range;
/// assert!(cw_osif_in_range(5000.0, 220.0, 5.0));
/// assert!(!cw_osif_in_range(5000.0, 150.0, 5.0));
/// ```
#[inline]
pub fn cw_osif_in_range(p_psia: f64, t_f: f64, salinity_wt_pct: f64) -> bool {
    within(p_psia, 1000.0, 20_000.0)
        && within(t_f, 200.0, 270.0)
        && within(salinity_wt_pct, 0.0, 17.3)
}

/// Whether (p, T, S) lie in the published range of [`viscosity_mccain`]: 100 to 400 degF,
/// 0 to 26 wt% at 1 atm, and for the pressure factor up to 14,000 psia fitted at 86.5 to
/// 167 degF (McCain 1991). Points above 14.696 psia count as in range only from 100 to
/// 167 degF.
///
/// # Examples
/// ```
/// use stocktank::water::viscosity_mccain_in_range;
/// assert!(viscosity_mccain_in_range(14.696, 300.0, 10.0));
/// assert!(!viscosity_mccain_in_range(5000.0, 300.0, 10.0));
/// ```
#[inline]
pub fn viscosity_mccain_in_range(p_psia: f64, t_f: f64, salinity_wt_pct: f64) -> bool {
    let base = within(t_f, 100.0, 400.0) && within(salinity_wt_pct, 0.0, 26.0);
    let pressure_ok =
        within(p_psia, 0.0, 14.696) || (within(p_psia, 0.0, 14_000.0) && t_f <= 167.0);
    base && pressure_ok
}

/// Whether (p, T, S) lie in the range of [`viscosity_meehan`]: up to 10,000 psia, 60 to
/// 400 degF, 0 to 26 wt% (from memory).
///
/// # Examples
/// ```
/// assert!(stocktank::water::viscosity_meehan_in_range(5000.0, 200.0, 5.0));
/// ```
#[inline]
pub fn viscosity_meehan_in_range(p_psia: f64, t_f: f64, salinity_wt_pct: f64) -> bool {
    within(p_psia, 0.0, 10_000.0) && within(t_f, 60.0, 400.0) && within(salinity_wt_pct, 0.0, 26.0)
}

// ---------------------------------------------------------------------------------------
// The Water description
// ---------------------------------------------------------------------------------------

/// A formation water (brine): salinity, whether it holds dissolved gas, the viscosity method
/// and the standard conditions of its stock-tank volume.
///
/// The methods take pressure (psia) and temperature (degF) and return one property; they
/// are what a black-oil table builder calls.
///
/// - `gas_saturated = true` (the default): the water is saturated with natural gas at the
///   pressure of interest (the usual assumption in an oil or gas reservoir); [`Water::rsw`]
///   is McCain's solubility and [`Water::compressibility`] includes the Dodson–Standing
///   dissolved-gas factor.
/// - `gas_saturated = false`: gas-free water; `rsw` is 0 and `compressibility` is Osif's.
///
/// Bw and density are McCain's for either case (the dissolved gas changes them by less than
/// the correlation's accuracy, McCain 1990, from memory).
///
/// # Examples
/// ```
/// use stocktank::water::Water;
/// let w = Water::new(8.0).unwrap();
/// let (p, t) = (3000.0, 180.0);
/// let bw = w.bw(p, t).unwrap();
/// assert!(bw > 1.0 && bw < 1.05);
/// assert!(w.density(p, t).unwrap() > 62.0);
/// assert!(w.viscosity(p, t).unwrap() > 0.3);
/// assert!(w.compressibility(p, t).unwrap() > 2e-6);
/// assert!(w.rsw(p, t).unwrap() > 0.0);
/// ```
#[derive(Debug, Clone, PartialEq)]
pub struct Water {
    salinity_wt_pct: f64,
    gas_saturated: bool,
    viscosity_method: ViscosityMethod,
    standard_conditions: StandardConditions,
    /// McCain's B at the standard conditions (a function of them, cached).
    bw_base: f64,
}

impl Water {
    /// A gas-saturated brine of the given salinity with the default viscosity method
    /// (Meehan 1980) and standard conditions (14.696 psia, 60 degF).
    ///
    /// # Arguments
    /// * `salinity_wt_pct` - total dissolved solids, wt% of brine, [0, 100).
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `salinity_wt_pct`.
    ///
    /// # Examples
    /// ```
    /// assert!(stocktank::water::Water::new(-1.0).is_err());
    /// ```
    pub fn new(salinity_wt_pct: f64) -> Result<Self> {
        Ok(Self {
            salinity_wt_pct: salinity("salinity_wt_pct", salinity_wt_pct)?,
            gas_saturated: true,
            viscosity_method: ViscosityMethod::default(),
            standard_conditions: StandardConditions::default(),
            bw_base: FIELD_BW_BASE,
        })
    }

    /// Pure water (zero salinity), gas-saturated, default methods.
    ///
    /// # Examples
    /// ```
    /// assert_eq!(stocktank::water::Water::fresh().salinity_wt_pct(), 0.0);
    /// ```
    pub fn fresh() -> Self {
        Self {
            salinity_wt_pct: 0.0,
            gas_saturated: true,
            viscosity_method: ViscosityMethod::default(),
            standard_conditions: StandardConditions::default(),
            bw_base: FIELD_BW_BASE,
        }
    }

    /// The same water, gas-saturated or gas-free.
    ///
    /// # Examples
    /// ```
    /// let w = stocktank::water::Water::fresh().with_gas_saturated(false);
    /// assert_eq!(w.rsw(3000.0, 200.0).unwrap(), 0.0);
    /// ```
    pub fn with_gas_saturated(mut self, gas_saturated: bool) -> Self {
        self.gas_saturated = gas_saturated;
        self
    }

    /// The same water with another viscosity method.
    ///
    /// # Examples
    /// ```
    /// use stocktank::water::{ViscosityMethod, Water};
    /// let w = Water::fresh().with_viscosity_method(ViscosityMethod::McCain1991);
    /// assert_eq!(w.viscosity_method(), ViscosityMethod::McCain1991);
    /// ```
    pub fn with_viscosity_method(mut self, method: ViscosityMethod) -> Self {
        self.viscosity_method = method;
        self
    }

    /// The same water with other standard conditions (validated).
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `p_sc` or `t_sc`.
    ///
    /// # Examples
    /// ```
    /// use stocktank::units::StandardConditions;
    /// use stocktank::water::Water;
    /// let w = Water::fresh().with_standard_conditions(StandardConditions::ISO_13443).unwrap();
    /// assert!((w.bw(StandardConditions::ISO_13443.p_psia, 59.0).unwrap() - 1.0).abs() < 1e-12);
    /// ```
    pub fn with_standard_conditions(mut self, sc: StandardConditions) -> Result<Self> {
        self.bw_base = bw_base(&sc)?;
        self.standard_conditions = sc;
        Ok(self)
    }

    /// Salinity, wt% of brine.
    pub fn salinity_wt_pct(&self) -> f64 {
        self.salinity_wt_pct
    }
    /// Whether the water is saturated with gas.
    pub fn gas_saturated(&self) -> bool {
        self.gas_saturated
    }
    /// The viscosity method.
    pub fn viscosity_method(&self) -> ViscosityMethod {
        self.viscosity_method
    }
    /// The standard conditions of the stock-tank volume.
    pub fn standard_conditions(&self) -> StandardConditions {
        self.standard_conditions
    }

    /// This water along the isotherm `t_f` (degF), for columns of pressures.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `t` (the viscosity correlations need t > 0 degF).
    #[inline]
    pub(crate) fn isotherm(&self, t_f: f64) -> Result<WaterIsotherm> {
        let t = positive_f(temperature_f("t", t_f)?)?;
        let s = self.salinity_wt_pct;
        Ok(WaterIsotherm {
            t,
            bw_base: self.bw_base,
            method: self.viscosity_method,
            mu1: match self.viscosity_method {
                ViscosityMethod::Meehan1980 => meehan_mu1(t, s),
                ViscosityMethod::McCain1991 => mccain_mu1(t, s),
            },
        })
    }

    /// Formation volume factor Bw, rb/STB, by [`bw_mccain`].
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `p` (psia, > 0) or `t` (degF).
    ///
    /// # Examples
    /// ```
    /// let w = stocktank::water::Water::fresh();
    /// assert!((w.bw(14.696, 60.0).unwrap() - 1.0).abs() < 1e-12);
    /// ```
    #[inline]
    pub fn bw(&self, p_psia: f64, t_f: f64) -> Result<f64> {
        bw_over_base(p_psia, t_f, self.bw_base)
    }

    /// Gas solubility Rsw, scf/STB: [`rsw_mccain`] when gas-saturated, 0 when gas-free.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `p` or `t`.
    ///
    /// # Examples
    /// ```
    /// let w = stocktank::water::Water::new(3.0).unwrap();
    /// assert!(w.rsw(5000.0, 200.0).unwrap() > 10.0);
    /// ```
    #[inline]
    pub fn rsw(&self, p_psia: f64, t_f: f64) -> Result<f64> {
        if self.gas_saturated {
            rsw_mccain(p_psia, t_f, self.salinity_wt_pct)
        } else {
            pressure(p_psia)?;
            temperature_f("t", t_f)?;
            Ok(0.0)
        }
    }

    /// Density at (p, T), lbm/ft3, by [`density_mccain`].
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `p` or `t`.
    ///
    /// # Examples
    /// ```
    /// let w = stocktank::water::Water::new(10.0).unwrap();
    /// assert!(w.density(14.696, 60.0).unwrap() > 66.0);
    /// ```
    #[inline]
    pub fn density(&self, p_psia: f64, t_f: f64) -> Result<f64> {
        density_mccain(p_psia, t_f, self.salinity_wt_pct)
    }

    /// Isothermal compressibility of the single-phase water (no free gas), 1/psi:
    /// [`cw_gas_saturated`] when gas-saturated, [`cw_osif`] when gas-free.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `p` or `t`.
    ///
    /// # Examples
    /// ```
    /// let w = stocktank::water::Water::fresh();
    /// let free = w.clone().with_gas_saturated(false);
    /// assert!(w.compressibility(4000.0, 220.0).unwrap() > free.compressibility(4000.0, 220.0).unwrap());
    /// ```
    #[inline]
    pub fn compressibility(&self, p_psia: f64, t_f: f64) -> Result<f64> {
        if self.gas_saturated {
            cw_gas_saturated(p_psia, t_f, self.salinity_wt_pct)
        } else {
            cw_osif(p_psia, t_f, self.salinity_wt_pct)
        }
    }

    /// Compressibility of the gas-saturated water below its saturation pressure, including
    /// the gas a pressure drop releases, 1/psi, by [`cw_with_gas_release`].
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `p`, `t` or `bg_rb_per_scf`.
    ///
    /// # Examples
    /// ```
    /// let w = stocktank::water::Water::fresh();
    /// assert!(w.compressibility_with_gas_release(2000.0, 200.0, 1.5e-3).unwrap() > 5e-6);
    /// ```
    #[inline]
    pub fn compressibility_with_gas_release(
        &self,
        p_psia: f64,
        t_f: f64,
        bg_rb_per_scf: f64,
    ) -> Result<f64> {
        cw_with_gas_release(
            p_psia,
            t_f,
            self.salinity_wt_pct,
            bg_rb_per_scf,
            &self.standard_conditions,
        )
    }

    /// Viscosity at (p, T), cp, by the chosen method.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `p` or `t` (> 0 degF).
    ///
    /// # Examples
    /// ```
    /// let w = stocktank::water::Water::fresh();
    /// assert!((w.viscosity(1000.0, 200.0).unwrap() - 0.304).abs() < 0.01);
    /// ```
    #[inline]
    pub fn viscosity(&self, p_psia: f64, t_f: f64) -> Result<f64> {
        self.viscosity_method
            .viscosity(p_psia, t_f, self.salinity_wt_pct)
    }

    /// Whether (p, T) lie inside the published ranges of every correlation this water uses
    /// (Bw, Rsw when gas-saturated, compressibility, viscosity).
    ///
    /// # Examples
    /// ```
    /// let w = stocktank::water::Water::fresh();
    /// assert!(!w.in_range(3000.0, 150.0)); // Osif's compressibility starts at 200 degF
    /// ```
    #[inline]
    pub fn in_range(&self, p_psia: f64, t_f: f64) -> bool {
        let s = self.salinity_wt_pct;
        bw_mccain_in_range(p_psia, t_f)
            && density_sc_mccain_in_range(s)
            && (!self.gas_saturated || rsw_mccain_in_range(p_psia, t_f, s))
            && cw_osif_in_range(p_psia, t_f, s)
            && self.viscosity_method.in_range(p_psia, t_f, s)
    }
}

impl Default for Water {
    fn default() -> Self {
        Self::fresh()
    }
}

// ---------------------------------------------------------------------------------------
// Array versions (numpy broadcasting through the one lift)
// ---------------------------------------------------------------------------------------

/// The water quantities, for [`Water::property_array`] and [`Water::property`].
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
#[non_exhaustive]
pub enum Property {
    /// Formation volume factor, rb/STB.
    Bw,
    /// Gas solubility, scf/STB.
    Rsw,
    /// Density, lbm/ft3.
    Density,
    /// Compressibility without free gas, 1/psi.
    Compressibility,
    /// Viscosity, cp.
    Viscosity,
}

impl Water {
    /// One property by name, at (p, T).
    ///
    /// # Errors
    /// As the property's method.
    ///
    /// # Examples
    /// ```
    /// use stocktank::water::{Property, Water};
    /// let w = Water::fresh();
    /// assert_eq!(w.property(Property::Bw, 3000.0, 150.0), w.bw(3000.0, 150.0));
    /// ```
    #[inline]
    pub fn property(&self, property: Property, p_psia: f64, t_f: f64) -> Result<f64> {
        match property {
            Property::Bw => self.bw(p_psia, t_f),
            Property::Rsw => self.rsw(p_psia, t_f),
            Property::Density => self.density(p_psia, t_f),
            Property::Compressibility => self.compressibility(p_psia, t_f),
            Property::Viscosity => self.viscosity(p_psia, t_f),
        }
    }

    /// One property over broadcast arrays of pressure (psia) and temperature (degF).
    ///
    /// NaN in gives NaN out; a bad element raises (with its index) or becomes NaN, by
    /// `on_error`.
    ///
    /// # Errors
    /// [`Error::Shape`] for shapes that do not broadcast; with [`OnError::Raise`], the first
    /// bad element's [`Error::InvalidArgument`] naming `p` or `t` and its index.
    ///
    /// # Examples
    /// ```
    /// use ndarray::arr1;
    /// use stocktank::array::OnError;
    /// use stocktank::water::{Property, Water};
    /// let p = arr1(&[1000.0, 3000.0, 5000.0]).into_dyn();
    /// let t = ndarray::arr0(200.0).into_dyn();
    /// let bw = Water::fresh().property_array(Property::Bw, p.view(), t.view(), OnError::Raise).unwrap();
    /// assert!(bw[0] > bw[2]);
    /// ```
    pub fn property_array(
        &self,
        property: Property,
        p_psia: ArrayViewD<'_, f64>,
        t_f: ArrayViewD<'_, f64>,
        on_error: OnError,
    ) -> Result<ArrayD<f64>> {
        lift(["p", "t"], [p_psia, t_f], on_error, |[p, t]| {
            self.property(property, p, t)
        })
    }
}

/// A validity check (one of the `*_in_range` functions) over broadcast arrays: `true` where
/// every input lies in the published range, `false` elsewhere and wherever an input is NaN.
///
/// # Errors
/// [`Error::Shape`] for shapes that do not broadcast.
///
/// # Examples
/// ```
/// use stocktank::water::{in_range_array, bw_mccain_in_range};
/// let p = ndarray::arr1(&[3000.0, 8000.0, f64::NAN]).into_dyn();
/// let t = ndarray::arr0(200.0).into_dyn();
/// let ok = in_range_array(["p", "t"], [p.view(), t.view()], |[p, t]| bw_mccain_in_range(p, t)).unwrap();
/// assert_eq!(ok.as_slice().unwrap(), &[true, false, false]);
/// ```
pub fn in_range_array<const N: usize, F>(
    names: [&'static str; N],
    inputs: [ArrayViewD<'_, f64>; N],
    f: F,
) -> Result<ArrayD<bool>>
where
    F: Fn([f64; N]) -> bool + Sync,
{
    let out = lift(names, inputs, OnError::Raise, |x| {
        Ok(if f(x) { 1.0 } else { 0.0 })
    })?;
    Ok(out.mapv(|v| v == 1.0))
}

/// [`bw_mccain`] over broadcast arrays (p psia, T degF).
///
/// # Errors
/// [`Error::Shape`]; with [`OnError::Raise`] the first bad element, with its index.
///
/// # Examples
/// ```
/// use stocktank::{array::OnError, units::StandardConditions, water::bw_mccain_array};
/// let p = ndarray::arr1(&[14.696]).into_dyn();
/// let t = ndarray::arr1(&[60.0]).into_dyn();
/// let b = bw_mccain_array(p.view(), t.view(), &StandardConditions::default(), OnError::Raise).unwrap();
/// assert!((b[0] - 1.0).abs() < 1e-12);
/// ```
pub fn bw_mccain_array(
    p_psia: ArrayViewD<'_, f64>,
    t_f: ArrayViewD<'_, f64>,
    sc: &StandardConditions,
    on_error: OnError,
) -> Result<ArrayD<f64>> {
    let base = bw_base(sc)?;
    lift(["p", "t"], [p_psia, t_f], on_error, |[p, t]| {
        bw_over_base(p, t, base)
    })
}

/// Defines an array version of a (p, t, salinity) kernel.
macro_rules! pts_array {
    ($(#[$doc:meta])* $name:ident => $kernel:path) => {
        $(#[$doc])*
        ///
        /// Broadcasts `p_psia` (psia), `t_f` (degF) and `salinity_wt_pct` (wt%) like numpy;
        /// NaN in gives NaN out.
        ///
        /// # Errors
        /// [`Error::Shape`]; with [`OnError::Raise`] the first bad element's error, naming
        /// `p`, `t` or `salinity_wt_pct` and its index.
        pub fn $name(
            p_psia: ArrayViewD<'_, f64>,
            t_f: ArrayViewD<'_, f64>,
            salinity_wt_pct: ArrayViewD<'_, f64>,
            on_error: OnError,
        ) -> Result<ArrayD<f64>> {
            lift(
                ["p", "t", "salinity_wt_pct"],
                [p_psia, t_f, salinity_wt_pct],
                on_error,
                |[p, t, s]| $kernel(p, t, s),
            )
        }
    };
}

pts_array!(
    /// [`density_mccain`] over broadcast arrays, lbm/ft3.
    ///
    /// # Examples
    /// ```
    /// use stocktank::{array::OnError, water::density_mccain_array};
    /// let x = ndarray::arr1(&[3000.0, 4000.0]).into_dyn();
    /// let t = ndarray::arr0(180.0).into_dyn();
    /// let s = ndarray::arr0(5.0).into_dyn();
    /// let d = density_mccain_array(x.view(), t.view(), s.view(), OnError::Raise).unwrap();
    /// assert!(d[1] > d[0]);
    /// ```
    density_mccain_array => density_mccain
);
pts_array!(
    /// [`rsw_mccain`] over broadcast arrays, scf/STB.
    ///
    /// # Examples
    /// ```
    /// use stocktank::{array::OnError, water::rsw_mccain_array};
    /// let x = ndarray::arr1(&[3000.0, 4000.0]).into_dyn();
    /// let t = ndarray::arr0(180.0).into_dyn();
    /// let s = ndarray::arr0(5.0).into_dyn();
    /// let r = rsw_mccain_array(x.view(), t.view(), s.view(), OnError::Raise).unwrap();
    /// assert!(r[1] > r[0]);
    /// ```
    rsw_mccain_array => rsw_mccain
);
pts_array!(
    /// [`cw_osif`] over broadcast arrays, 1/psi.
    ///
    /// # Examples
    /// ```
    /// use stocktank::{array::OnError, water::cw_osif_array};
    /// let x = ndarray::arr1(&[3000.0, 4000.0]).into_dyn();
    /// let t = ndarray::arr0(220.0).into_dyn();
    /// let s = ndarray::arr0(5.0).into_dyn();
    /// let c = cw_osif_array(x.view(), t.view(), s.view(), OnError::Raise).unwrap();
    /// assert!(c[1] < c[0]);
    /// ```
    cw_osif_array => cw_osif
);
pts_array!(
    /// [`cw_gas_saturated`] over broadcast arrays, 1/psi.
    ///
    /// # Examples
    /// ```
    /// use stocktank::{array::OnError, water::cw_gas_saturated_array};
    /// let x = ndarray::arr1(&[3000.0, 4000.0]).into_dyn();
    /// let t = ndarray::arr0(220.0).into_dyn();
    /// let s = ndarray::arr0(5.0).into_dyn();
    /// let c = cw_gas_saturated_array(x.view(), t.view(), s.view(), OnError::Raise).unwrap();
    /// assert!(c[0] > 0.0);
    /// ```
    cw_gas_saturated_array => cw_gas_saturated
);
pts_array!(
    /// [`viscosity_mccain`] over broadcast arrays, cp.
    ///
    /// # Examples
    /// ```
    /// use stocktank::{array::OnError, water::viscosity_mccain_array};
    /// let x = ndarray::arr1(&[3000.0, 4000.0]).into_dyn();
    /// let t = ndarray::arr0(220.0).into_dyn();
    /// let s = ndarray::arr0(5.0).into_dyn();
    /// let m = viscosity_mccain_array(x.view(), t.view(), s.view(), OnError::Raise).unwrap();
    /// assert!(m[1] > m[0]);
    /// ```
    viscosity_mccain_array => viscosity_mccain
);
pts_array!(
    /// [`viscosity_meehan`] over broadcast arrays, cp.
    ///
    /// # Examples
    /// ```
    /// use stocktank::{array::OnError, water::viscosity_meehan_array};
    /// let x = ndarray::arr1(&[3000.0, 4000.0]).into_dyn();
    /// let t = ndarray::arr0(220.0).into_dyn();
    /// let s = ndarray::arr0(5.0).into_dyn();
    /// let m = viscosity_meehan_array(x.view(), t.view(), s.view(), OnError::Raise).unwrap();
    /// assert!(m[1] > m[0]);
    /// ```
    viscosity_meehan_array => viscosity_meehan
);

/// [`cw_with_gas_release`] over broadcast arrays, 1/psi.
///
/// # Errors
/// [`Error::Shape`]; with [`OnError::Raise`] the first bad element, with its index.
///
/// # Examples
/// ```
/// use stocktank::{array::OnError, units::StandardConditions, water::cw_with_gas_release_array};
/// let p = ndarray::arr1(&[2000.0, 3000.0]).into_dyn();
/// let t = ndarray::arr0(200.0).into_dyn();
/// let s = ndarray::arr0(0.0).into_dyn();
/// let bg = ndarray::arr1(&[1.4e-3, 1.0e-3]).into_dyn();
/// let sc = StandardConditions::default();
/// let c = cw_with_gas_release_array(p.view(), t.view(), s.view(), bg.view(), &sc, OnError::Raise).unwrap();
/// assert!(c[0] > c[1]);
/// ```
pub fn cw_with_gas_release_array(
    p_psia: ArrayViewD<'_, f64>,
    t_f: ArrayViewD<'_, f64>,
    salinity_wt_pct: ArrayViewD<'_, f64>,
    bg_rb_per_scf: ArrayViewD<'_, f64>,
    sc: &StandardConditions,
    on_error: OnError,
) -> Result<ArrayD<f64>> {
    check_sc(sc)?;
    lift(
        ["p", "t", "salinity_wt_pct", "bg_rb_per_scf"],
        [p_psia, t_f, salinity_wt_pct, bg_rb_per_scf],
        on_error,
        |[p, t, s, bg]| cw_with_gas_release(p, t, s, bg, sc),
    )
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn bw_is_one_at_standard_conditions() {
        for sc in [
            StandardConditions::FIELD,
            StandardConditions::FIELD_14_65,
            StandardConditions::ISO_13443,
        ] {
            let b = bw_mccain(sc.p_psia, sc.t_f, &sc).unwrap();
            assert!((b - 1.0).abs() < 1e-14, "{b}");
        }
    }

    #[test]
    fn cached_base_equals_computed_base() {
        assert_eq!(FIELD_BW_BASE, bw_base(&StandardConditions::FIELD).unwrap());
        let w = Water::fresh()
            .with_standard_conditions(StandardConditions::FIELD)
            .unwrap();
        assert_eq!(w, Water::fresh());
    }

    #[test]
    fn analytic_derivatives_match_finite_differences() {
        for (p, t, s) in [(2000.0, 150.0, 0.0), (6000.0, 250.0, 10.0)] {
            let h = 1e-2;
            let fd = (bw_raw(p + h, t) - bw_raw(p - h, t)) / (2.0 * h);
            assert!((bw_raw_dp(p, t) - fd).abs() < 1e-12);
            let fr =
                (rsw_mccain(p + h, t, s).unwrap() - rsw_mccain(p - h, t, s).unwrap()) / (2.0 * h);
            assert!((rsw_dp(p, t, s) - fr).abs() < 1e-9);
        }
    }

    #[test]
    fn bad_inputs_name_the_argument() {
        let e = rsw_mccain(3000.0, 200.0, -1.0).unwrap_err();
        assert!(e.to_string().contains("salinity_wt_pct"), "{e}");
        let e = viscosity_mccain(3000.0, -10.0, 1.0).unwrap_err();
        assert!(e.to_string().contains("`t`"), "{e}");
        let e = bw_mccain(0.0, 100.0, &StandardConditions::default()).unwrap_err();
        assert!(e.to_string().contains("`p`"), "{e}");
    }
}
