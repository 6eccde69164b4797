//! Recovery factor arithmetic, the API (Arps et al. 1967) recovery correlations, and the
//! volumetric gas recovery at an abandonment pressure from p/z.
//!
//! Results are screening estimates: recovery-factor correlations have a wide scatter
//! around the field data they were fitted to.
//!
//! # What is from memory (Arps et al. 1967)
//! API Bulletin D14 was not at hand when this module was written. The two equations'
//! coefficients and exponents are given as the bulletin's equations are commonly reproduced in
//! reservoir-engineering handbooks (e.g. Ahmed, Reservoir Engineering Handbook, the chapter on
//! recovery efficiency), **from memory**; the tests check our code against the same equations
//! written out independently, which guards the implementation, not the recollection. The data
//! ranges in [`arps_solution_gas_validity`] and [`arps_water_drive_validity`] are likewise
//! **from memory, unverified**; the viscosity and pressure-ratio ranges of the study are not
//! recalled at all, so those functions do not invent them (they check only the equations'
//! physical domain for those inputs). No published worked example of these correlations is
//! recalled, so none is used as a check value.
//!
//! # References
//! - Arps, J.J., Brons, F., van Everdingen, A.F., Buchwald, R.W., Smith, A.E. (1967).
//!   A statistical study of recovery efficiency. API Bulletin D14, American Petroleum
//!   Institute, Dallas.
//! - Craft, B.C., Hawkins, M.F. (1959). Applied Petroleum Reservoir Engineering. Prentice-Hall,
//!   ch. 1 (volumetric gas reservoirs, p/z).

use crate::error::{Error, Result, fraction, non_negative, positive};

/// Recoverable volume from an in-place volume and a recovery factor.
///
/// # Formula
/// ```text
/// recoverable = in_place * RF
/// ```
///
/// # Arguments
/// * `in_place` - in-place volume (STB, scf or any volume unit), >= 0.
/// * `recovery_factor` - fraction in [0, 1].
///
/// # Returns
/// Recoverable volume, in the unit of `in_place`.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `in_place` or `recovery_factor`.
///
/// # Examples
/// ```
/// use stocktank::volumetrics::recoverable;
/// // 37% of 1,000,000 STB is 370,000 STB (common practice, no source).
/// assert!((recoverable(1.0e6, 0.37).unwrap() - 370_000.0).abs() < 1e-6);
/// ```
///
/// # References
/// Definition of the recovery factor (common practice, no source).
#[inline]
pub fn recoverable(in_place: f64, recovery_factor: f64) -> Result<f64> {
    Ok(non_negative("in_place", in_place)? * fraction("recovery_factor", recovery_factor)?)
}

/// Recovery factor from a recoverable (or produced) volume and the in-place volume: the
/// inverse of [`recoverable`].
///
/// # Formula
/// ```text
/// RF = recoverable / in_place
/// ```
///
/// # Arguments
/// * `recoverable` - recoverable or cumulative volume, >= 0, at most `in_place`.
/// * `in_place` - in-place volume in the same unit, > 0.
///
/// # Returns
/// Recovery factor, fraction.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `in_place` (<= 0) or `recoverable` (negative or above
/// `in_place`).
///
/// # Examples
/// ```
/// use stocktank::volumetrics::recovery_factor;
/// assert!((recovery_factor(370_000.0, 1.0e6).unwrap() - 0.37).abs() < 1e-15);
/// ```
///
/// # References
/// Definition of the recovery factor (common practice, no source).
#[inline]
pub fn recovery_factor(recoverable: f64, in_place: f64) -> Result<f64> {
    positive("in_place", in_place)?;
    non_negative("recoverable", recoverable)?;
    if recoverable > in_place {
        return Err(Error::invalid(
            "recoverable",
            recoverable,
            "must not exceed in_place",
        ));
    }
    Ok(recoverable / in_place)
}

/// Remaining recoverable volume: recoverable volume less what has been produced.
///
/// # Formula
/// ```text
/// remaining = in_place * RF - cumulative
/// ```
///
/// # Arguments
/// * `in_place` - in-place volume, >= 0.
/// * `recovery_factor` - ultimate recovery factor, fraction in [0, 1].
/// * `cumulative` - cumulative production in the same unit, >= 0, at most in_place * RF.
///
/// # Returns
/// Remaining recoverable volume, in the unit of `in_place`.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `in_place`, `recovery_factor` or `cumulative` (when it
/// exceeds the recoverable volume: the recovery factor is then too low).
///
/// # Examples
/// ```
/// use stocktank::volumetrics::remaining_recoverable;
/// assert!((remaining_recoverable(1.0e6, 0.37, 120_000.0).unwrap() - 250_000.0).abs() < 1e-6);
/// ```
///
/// # References
/// Definition of remaining recoverable volume (common practice, no source).
#[inline]
pub fn remaining_recoverable(in_place: f64, recovery_factor: f64, cumulative: f64) -> Result<f64> {
    let ur = recoverable(in_place, recovery_factor)?;
    non_negative("cumulative", cumulative)?;
    if cumulative > ur * (1.0 + 1e-12) {
        return Err(Error::invalid(
            "cumulative",
            cumulative,
            "exceeds in_place * recovery_factor (the recovery factor is too low)",
        ));
    }
    Ok((ur - cumulative).max(0.0))
}

/// Oil recovery factor of a solution-gas-drive reservoir, Arps et al. (1967) API correlation.
///
/// # Formula
/// ```text
/// RF (%) = 41.815 * [phi (1 - Sw) / Bob]^0.1611 * [k / mu_ob]^0.0979 * Sw^0.3722 * (pb / pa)^0.1741
/// ```
/// with k in darcy (the argument is md and is divided by 1000).
///
/// # Arguments
/// * `porosity` - fraction in (0, 1].
/// * `sw` - connate water saturation, fraction in (0, 1).
/// * `bob` - oil formation volume factor at the bubble point, rb/STB, > 0.
/// * `k_md` - permeability, md, > 0.
/// * `mu_ob` - oil viscosity at the bubble point, cp, > 0.
/// * `pb` - bubble-point pressure, psia, > 0.
/// * `pa` - abandonment pressure, psia, in (0, pb].
///
/// # Returns
/// Recovery factor of the oil in place, fraction (the correlation gives percent).
/// See [`arps_solution_gas_validity`] for the data range of the study. Coefficients from
/// memory (see the module documentation).
///
/// # Errors
/// [`Error::InvalidArgument`] naming the offending argument.
///
/// # Examples
/// ```
/// use stocktank::volumetrics::arps_solution_gas_drive;
/// let rf = arps_solution_gas_drive(0.2, 0.3, 1.3, 100.0, 1.0, 2500.0, 500.0).unwrap();
/// assert!(rf > 0.1 && rf < 0.4);
/// ```
///
/// # References
/// Arps, J.J. et al. (1967). A statistical study of recovery efficiency. API Bulletin D14.
#[inline]
pub fn arps_solution_gas_drive(
    porosity: f64,
    sw: f64,
    bob: f64,
    k_md: f64,
    mu_ob: f64,
    pb: f64,
    pa: f64,
) -> Result<f64> {
    positive("porosity", fraction("porosity", porosity)?)?;
    open_fraction("sw", sw)?;
    positive("bob", bob)?;
    positive("k_md", k_md)?;
    positive("mu_ob", mu_ob)?;
    positive("pb", pb)?;
    positive("pa", pa)?;
    if pa > pb {
        return Err(Error::invalid(
            "pa",
            pa,
            "abandonment pressure must be <= pb",
        ));
    }
    let pct = 41.815
        * (porosity * (1.0 - sw) / bob).powf(0.1611)
        * (k_md / 1000.0 / mu_ob).powf(0.0979)
        * sw.powf(0.3722)
        * (pb / pa).powf(0.1741);
    Ok(pct / 100.0)
}

/// Oil recovery factor of a water-drive reservoir, Arps et al. (1967) API correlation.
///
/// # Formula
/// ```text
/// RF (%) = 54.898 * [phi (1 - Sw) / Boi]^0.0422 * [k mu_wi / mu_oi]^0.0770 * Sw^-0.1903 * (pi / pa)^-0.2159
/// ```
/// with k in darcy (the argument is md and is divided by 1000).
///
/// # Arguments
/// * `porosity` - fraction in (0, 1].
/// * `sw` - connate water saturation, fraction in (0, 1).
/// * `boi` - initial oil formation volume factor, rb/STB, > 0.
/// * `k_md` - permeability, md, > 0.
/// * `mu_wi` - initial water viscosity, cp, > 0.
/// * `mu_oi` - initial oil viscosity, cp, > 0.
/// * `pi` - initial pressure, psia, > 0.
/// * `pa` - abandonment pressure, psia, in (0, pi].
///
/// # Returns
/// Recovery factor of the oil in place, fraction. See [`arps_water_drive_validity`].
/// Coefficients from memory (see the module documentation).
///
/// # Errors
/// [`Error::InvalidArgument`] naming the offending argument.
///
/// # Examples
/// ```
/// use stocktank::volumetrics::arps_water_drive;
/// let rf = arps_water_drive(0.25, 0.25, 1.2, 500.0, 0.5, 2.0, 3000.0, 1500.0).unwrap();
/// assert!(rf > 0.3 && rf < 0.7);
/// ```
///
/// # References
/// Arps, J.J. et al. (1967). A statistical study of recovery efficiency. API Bulletin D14.
#[allow(clippy::too_many_arguments)]
#[inline]
pub fn arps_water_drive(
    porosity: f64,
    sw: f64,
    boi: f64,
    k_md: f64,
    mu_wi: f64,
    mu_oi: f64,
    pi: f64,
    pa: f64,
) -> Result<f64> {
    positive("porosity", fraction("porosity", porosity)?)?;
    open_fraction("sw", sw)?;
    positive("boi", boi)?;
    positive("k_md", k_md)?;
    positive("mu_wi", mu_wi)?;
    positive("mu_oi", mu_oi)?;
    positive("pi", pi)?;
    positive("pa", pa)?;
    if pa > pi {
        return Err(Error::invalid(
            "pa",
            pa,
            "abandonment pressure must be <= pi",
        ));
    }
    let pct = 54.898
        * (porosity * (1.0 - sw) / boi).powf(0.0422)
        * (k_md / 1000.0 * mu_wi / mu_oi).powf(0.0770)
        * sw.powf(-0.1903)
        * (pi / pa).powf(-0.2159);
    Ok(pct / 100.0)
}

fn open_fraction(arg: &'static str, v: f64) -> Result<f64> {
    if v > 0.0 && v < 1.0 {
        Ok(v)
    } else {
        Err(Error::invalid(arg, v, "must lie in (0, 1)"))
    }
}

#[inline]
fn within(v: f64, lo: f64, hi: f64) -> bool {
    (lo..=hi).contains(&v)
}

/// Whether inputs lie inside the range of the solution-gas-drive data of Arps et al. (1967).
///
/// Ranges **from memory, unverified** (verify against API Bulletin D14 before relying on
/// them): porosity 0.092–0.466, Sw 0.16–0.50, k 6–940 md. The study's ranges of mu_ob and
/// pb/pa are not recalled; for those only the equation's domain is checked (mu_ob > 0,
/// 0 < pa <= pb).
///
/// # Returns
/// `true` inside the ranges; NaN inputs give `false`.
///
/// # Examples
/// ```
/// use stocktank::volumetrics::arps_solution_gas_validity;
/// assert!(arps_solution_gas_validity(0.2, 0.3, 100.0, 1.0, 2500.0, 500.0));
/// assert!(!arps_solution_gas_validity(0.05, 0.3, 100.0, 1.0, 2500.0, 500.0));
/// ```
///
/// # References
/// Arps, J.J. et al. (1967). API Bulletin D14.
pub fn arps_solution_gas_validity(
    porosity: f64,
    sw: f64,
    k_md: f64,
    mu_ob: f64,
    pb: f64,
    pa: f64,
) -> bool {
    within(porosity, 0.092, 0.466)
        && within(sw, 0.16, 0.50)
        && within(k_md, 6.0, 940.0)
        && mu_ob > 0.0
        && pa > 0.0
        && pa <= pb
}

/// Whether inputs lie inside the range of the water-drive data of Arps et al. (1967).
///
/// Ranges **from memory, unverified** (verify against API Bulletin D14 before relying on
/// them): porosity 0.111–0.35, Sw 0.052–0.47, k 11–4040 md. The study's ranges of the
/// viscosities and of pi/pa are not recalled; for those only the equation's domain is checked
/// (mu_wi > 0, mu_oi > 0, 0 < pa <= pi).
///
/// # Returns
/// `true` inside the ranges; NaN inputs give `false`.
///
/// # Examples
/// ```
/// use stocktank::volumetrics::arps_water_drive_validity;
/// assert!(arps_water_drive_validity(0.25, 0.25, 500.0, 0.5, 2.0, 3000.0, 1500.0));
/// ```
///
/// # References
/// Arps, J.J. et al. (1967). API Bulletin D14.
#[allow(clippy::too_many_arguments)]
pub fn arps_water_drive_validity(
    porosity: f64,
    sw: f64,
    k_md: f64,
    mu_wi: f64,
    mu_oi: f64,
    pi: f64,
    pa: f64,
) -> bool {
    within(porosity, 0.111, 0.35)
        && within(sw, 0.052, 0.47)
        && within(k_md, 11.0, 4040.0)
        && mu_wi > 0.0
        && mu_oi > 0.0
        && pa > 0.0
        && pa <= pi
}

/// Recovery factor of a volumetric (no water influx) gas reservoir at an abandonment
/// pressure, from p/z.
///
/// # Formula
/// ```text
/// RF = 1 - (pa / za) / (pi / zi)
/// ```
///
/// # Arguments
/// * `pi` - initial pressure, psia, > 0.
/// * `zi` - gas deviation factor at `pi` and reservoir temperature, > 0.
/// * `pa` - abandonment pressure, psia, in (0, pi].
/// * `za` - gas deviation factor at `pa`, > 0.
///
/// # Returns
/// Gas recovery factor, fraction.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `pi`, `zi`, `pa` (also when above `pi`) or `za`, or
/// naming `za` when pa/za exceeds pi/zi (a negative recovery).
///
/// # Examples
/// ```
/// use stocktank::volumetrics::gas_recovery_factor_pz;
/// let rf = gas_recovery_factor_pz(3000.0, 0.85, 500.0, 0.95).unwrap();
/// assert!((rf - (1.0 - (500.0 / 0.95) / (3000.0 / 0.85))).abs() < 1e-15);
/// ```
///
/// # References
/// Craft, B.C., Hawkins, M.F. (1959). Applied Petroleum Reservoir Engineering, ch. 1.
#[inline]
pub fn gas_recovery_factor_pz(pi: f64, zi: f64, pa: f64, za: f64) -> Result<f64> {
    positive("pi", pi)?;
    positive("zi", zi)?;
    positive("pa", pa)?;
    positive("za", za)?;
    if pa > pi {
        return Err(Error::invalid(
            "pa",
            pa,
            "abandonment pressure must be <= pi",
        ));
    }
    let rf = 1.0 - (pa / za) / (pi / zi);
    if rf < 0.0 {
        return Err(Error::invalid(
            "za",
            za,
            "pa/za exceeds pi/zi (negative recovery)",
        ));
    }
    Ok(rf)
}
