//! Wet gas and gas condensate: reservoir-gas gravity by recombining separator gas,
//! stock-tank gas and stock-tank condensate, and the gas equivalent of condensate.
//!
//! The textbook constants (4584 and 132,800 in the usual recombination formula, 133,000 for
//! the gas equivalent) are derived here from the exact units, the density of water at
//! 60 degF and the given standard conditions, so they follow the user's base conditions.

use crate::error::{Error, Result, non_negative, positive};
use crate::units::{AIR_MOLAR_MASS, FT3_PER_BBL, R_FIELD, StandardConditions, WATER_DENSITY_60F};

/// Specific gravity (60/60 degF, water = 1) from API gravity.
///
/// # Formula
/// ```text
/// SG = 141.5 / (API + 131.5)
/// ```
///
/// # Arguments
/// * `api` - API gravity, degAPI, > -131.5.
///
/// # Returns
/// Specific gravity, dimensionless.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `api` when not finite or <= -131.5.
///
/// # Examples
/// ```
/// // Water is 10 degAPI (API definition, common practice, no source).
/// assert!((stocktank::gas::api_to_sg(10.0).unwrap() - 1.0).abs() < 1e-15);
/// ```
///
/// # References
/// API gravity definition (American Petroleum Institute); common practice.
#[inline]
pub fn api_to_sg(api: f64) -> Result<f64> {
    if api.is_finite() && api > -131.5 {
        Ok(141.5 / (api + 131.5))
    } else {
        Err(Error::invalid("api", api, "must be finite and > -131.5"))
    }
}

/// API gravity from specific gravity (60/60 degF).
///
/// # Formula
/// ```text
/// API = 141.5 / SG - 131.5
/// ```
///
/// # Arguments
/// * `sg` - specific gravity, water = 1, > 0.
///
/// # Returns
/// API gravity, degAPI.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `sg`.
///
/// # Examples
/// ```
/// assert!((stocktank::gas::sg_to_api(1.0).unwrap() - 10.0).abs() < 1e-12);
/// ```
///
/// # References
/// API gravity definition; common practice.
#[inline]
pub fn sg_to_api(sg: f64) -> Result<f64> {
    Ok(141.5 / positive("sg", sg)? - 131.5)
}

/// Molar mass of stock-tank condensate from its API gravity, Cragoe (1929).
///
/// # Formula
/// ```text
/// M = 6084 / (API - 5.9)         (lbm/lbmol)
/// ```
///
/// # Arguments
/// * `api` - condensate API gravity, degAPI, > 5.9 (intended for about 40 to 70).
///
/// # Returns
/// Molar mass, lbm/lbmol.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `condensate_api` when not finite and > 5.9.
///
/// # Examples
/// ```
/// let m = stocktank::gas::condensate_molar_mass_cragoe(55.0).unwrap();
/// assert!((m - 6084.0 / 49.1).abs() < 1e-9);
/// ```
///
/// # References
/// Cragoe, C.S. (1929). Thermodynamic properties of petroleum products. U.S. Bureau of
/// Standards Misc. Pub. 97 (as quoted by Craft & Hawkins 1959; from memory).
#[inline]
pub fn condensate_molar_mass_cragoe(api: f64) -> Result<f64> {
    if api.is_finite() && api > 5.9 {
        Ok(6084.0 / (api - 5.9))
    } else {
        Err(Error::invalid(
            "condensate_api",
            api,
            "must be finite and > 5.9 degAPI",
        ))
    }
}

/// Molar volume of an ideal gas at standard conditions, scf/lbmol (379.5 at 14.696 psia
/// and 60 degF).
///
/// # Examples
/// ```
/// use stocktank::units::StandardConditions;
/// let v = stocktank::gas::molar_volume_scf(&StandardConditions::FIELD);
/// assert!((v - 379.5).abs() < 0.1);
/// ```
#[inline]
pub fn molar_volume_scf(sc: &StandardConditions) -> f64 {
    R_FIELD * sc.t_r() / sc.p_psia
}

/// Gas equivalent of stock-tank condensate, scf of gas per STB of condensate.
///
/// # Formula
/// ```text
/// GE = (rho_w 5.614583 SG / M) V_m      (about 133,000 SG / M at 14.7 psia, 60 degF)
/// ```
/// with rho_w the density of water at 60 degF (lbm/ft3) and V_m the molar volume at the
/// standard conditions (scf/lbmol).
///
/// # Arguments
/// * `condensate_sg` - condensate specific gravity, 60/60 degF, > 0.
/// * `condensate_mw` - condensate molar mass, lbm/lbmol, > 0.
/// * `sc` - standard conditions.
///
/// # Returns
/// Gas equivalent, scf/STB.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `condensate_sg` or `condensate_mw`.
///
/// # Examples
/// ```
/// use stocktank::units::StandardConditions;
/// let ge = stocktank::gas::gas_equivalent(0.75, 120.0, &StandardConditions::FIELD).unwrap();
/// // Craft & Hawkins (1959): GE = 133,000 SG / M = 831 scf/STB.
/// assert!((ge / (133_000.0 * 0.75 / 120.0) - 1.0).abs() < 2e-3);
/// ```
///
/// # References
/// Craft, B.C., Hawkins, M.F. (1959). Applied Petroleum Reservoir Engineering.
/// Prentice-Hall, ch. 2 (gas-condensate reservoirs).
#[inline]
pub fn gas_equivalent(
    condensate_sg: f64,
    condensate_mw: f64,
    sc: &StandardConditions,
) -> Result<f64> {
    let g = positive("condensate_sg", condensate_sg)?;
    let m = positive("condensate_mw", condensate_mw)?;
    Ok(WATER_DENSITY_60F * FT3_PER_BBL * g / m * molar_volume_scf(sc))
}

/// Reservoir (well-stream) gas specific gravity of a wet gas or gas condensate by
/// recombining surface gas and condensate.
///
/// # Formula
/// ```text
/// g_w = (R_sep g_sep + R_st g_st + rho_w 5.614583 SG_o V_m / 28.9647)
///     / (R_sep + R_st + GE),            GE = rho_w 5.614583 SG_o V_m / M_o
/// ```
/// (the usual 4584 SG_o and 132,800 SG_o / M_o at 14.7 psia and 60 degF).
///
/// # Arguments
/// * `separator_gor` - separator gas-condensate ratio, scf/STB, >= 0.
/// * `separator_gas_sg` - separator gas gravity, air = 1, > 0.
/// * `stock_tank_gor` - stock-tank gas-condensate ratio, scf/STB, >= 0 (0 if not measured).
/// * `stock_tank_gas_sg` - stock-tank gas gravity, air = 1, > 0 (ignored when its GOR is 0).
/// * `condensate_api` - stock-tank condensate API gravity, degAPI.
/// * `condensate_mw` - condensate molar mass, lbm/lbmol; `None` uses Cragoe (1929).
/// * `sc` - standard conditions of the gas-condensate ratios.
///
/// # Returns
/// Reservoir gas specific gravity, air = 1.
///
/// # Errors
/// [`Error::InvalidArgument`] naming the bad argument.
///
/// # Examples
/// ```
/// use stocktank::units::StandardConditions;
/// let g = stocktank::gas::recombined_gas_sg(50_000.0, 0.65, 0.0, 1.0, 55.0, None, &StandardConditions::FIELD).unwrap();
/// assert!(g > 0.65 && g < 0.75);
/// ```
///
/// # References
/// Craft, B.C., Hawkins, M.F. (1959). Applied Petroleum Reservoir Engineering. Prentice-Hall.
/// Gold, D.K., McCain, W.D., Jennings, J.W. (1989). An improved method for the determination
/// of the reservoir-gas specific gravity for retrograde gases. J. Pet. Technol. 41(7),
/// 747–752.
#[inline]
pub fn recombined_gas_sg(
    separator_gor: f64,
    separator_gas_sg: f64,
    stock_tank_gor: f64,
    stock_tank_gas_sg: f64,
    condensate_api: f64,
    condensate_mw: Option<f64>,
    sc: &StandardConditions,
) -> Result<f64> {
    let r1 = non_negative("separator_gor", separator_gor)?;
    let g1 = positive("separator_gas_sg", separator_gas_sg)?;
    let r3 = non_negative("stock_tank_gor", stock_tank_gor)?;
    let g3 = if r3 > 0.0 {
        positive("stock_tank_gas_sg", stock_tank_gas_sg)?
    } else {
        0.0
    };
    let sg_o = api_to_sg(condensate_api).map_err(|_| {
        Error::invalid(
            "condensate_api",
            condensate_api,
            "must be finite and > -131.5",
        )
    })?;
    let m_o = match condensate_mw {
        Some(m) => positive("condensate_mw", m)?,
        None => condensate_molar_mass_cragoe(condensate_api)?,
    };
    let mass_term = WATER_DENSITY_60F * FT3_PER_BBL * sg_o * molar_volume_scf(sc) / AIR_MOLAR_MASS;
    let ge = gas_equivalent(sg_o, m_o, sc)?;
    Ok((r1 * g1 + r3 * g3 + mass_term) / (r1 + r3 + ge))
}
