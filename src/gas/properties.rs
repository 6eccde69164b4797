//! Properties that follow from Z: molar mass, formation volume factor Bg and its inverse
//! Eg, density and isothermal compressibility cg.

use crate::error::{Result, positive, temperature_f};
use crate::units::{AIR_MOLAR_MASS, FT3_PER_BBL, R_FIELD, RANKINE_OFFSET, StandardConditions};

/// Molar mass of a gas from its specific gravity, lbm/lbmol.
///
/// # Formula
/// ```text
/// M = 28.9647 g      (28.9647 lbm/lbmol is dry air, U.S. Standard Atmosphere 1976)
/// ```
///
/// # Arguments
/// * `gas_sg` - gas specific gravity, air = 1, > 0.
///
/// # Returns
/// Molar mass, lbm/lbmol.
///
/// # Errors
/// [`crate::Error::InvalidArgument`] naming `gas_sg`.
///
/// # Examples
/// ```
/// assert!((stocktank::gas::molar_mass(1.0).unwrap() - 28.9647).abs() < 1e-12);
/// ```
///
/// # References
/// Definition of gas specific gravity (ideal-gas molar-mass ratio to air); common practice.
#[inline]
pub fn molar_mass(gas_sg: f64) -> Result<f64> {
    Ok(positive("gas_sg", gas_sg)? * AIR_MOLAR_MASS)
}

/// Gas formation volume factor Bg, reservoir ft3 per standard ft3 (rcf/scf).
///
/// # Formula
/// ```text
/// Bg = (p_sc / T_sc) Z T / p         (T, T_sc in degR; Z at standard conditions = 1)
/// ```
///
/// # Arguments
/// * `p_psia` - pressure, psia, > 0.
/// * `t_f` - temperature, degF, above absolute zero.
/// * `z` - Z-factor at (p, T), > 0.
/// * `sc` - standard conditions (base pressure psia, base temperature degF).
///
/// # Returns
/// Bg in rcf/scf.
///
/// # Errors
/// [`crate::Error::InvalidArgument`] naming `p_psia`, `t_f` or `z`.
///
/// # Examples
/// ```
/// use stocktank::units::StandardConditions;
/// // An ideal gas at standard conditions occupies its standard volume.
/// let bg = stocktank::gas::bg(14.696, 60.0, 1.0, &StandardConditions::FIELD).unwrap();
/// assert!((bg - 1.0).abs() < 1e-15);
/// ```
///
/// # References
/// Real-gas law PV = ZnRT; e.g. Craft, B.C., Hawkins, M.F. (1959). Applied Petroleum
/// Reservoir Engineering. Prentice-Hall.
#[inline]
pub fn bg(p_psia: f64, t_f: f64, z: f64, sc: &StandardConditions) -> Result<f64> {
    let p = positive("p_psia", p_psia)?;
    temperature_f("t_f", t_f)?;
    let z = positive("z", z)?;
    Ok(GasIsothermVolumetrics::bg_factor(t_f, sc) * z / p)
}

/// Bg and density of one gas along one isotherm, with the temperature terms computed once:
/// the one implementation of the real-gas law behind [`bg`] and [`gas_density`], for a
/// pressure sweep (a black-oil table) that then pays one division per point for each.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct GasIsothermVolumetrics {
    bg_k: f64,
    rho_k: f64,
}

impl GasIsothermVolumetrics {
    /// Gas of specific gravity `gas_sg` (air = 1) at `t_f` (degF), standard conditions `sc`.
    ///
    /// # Errors
    /// [`crate::Error::InvalidArgument`] naming `t_f` or `gas_sg`.
    #[inline]
    pub(crate) fn new(t_f: f64, gas_sg: f64, sc: &StandardConditions) -> Result<Self> {
        temperature_f("t_f", t_f)?;
        Ok(Self {
            bg_k: Self::bg_factor(t_f, sc),
            rho_k: Self::density_factor(t_f, molar_mass(gas_sg)?),
        })
    }

    /// (p_sc / T_sc) T, psia (temperatures in degR).
    #[inline(always)]
    fn bg_factor(t_f: f64, sc: &StandardConditions) -> f64 {
        sc.p_psia / sc.t_r() * (t_f + RANKINE_OFFSET)
    }

    /// M / (R T), lbm/ft3 per psia.
    #[inline(always)]
    fn density_factor(t_f: f64, molar_mass: f64) -> f64 {
        molar_mass / (R_FIELD * (t_f + RANKINE_OFFSET))
    }

    /// Bg at `p_psia` (> 0) with Z-factor `z`, rcf/scf.
    #[inline(always)]
    pub(crate) fn bg(&self, p_psia: f64, z: f64) -> f64 {
        self.bg_k * z / p_psia
    }

    /// Density at `p_psia` with Z-factor `z` (> 0), lbm/ft3.
    #[inline(always)]
    pub(crate) fn density(&self, p_psia: f64, z: f64) -> f64 {
        self.rho_k * p_psia / z
    }
}

/// Convert Bg from rcf/scf to rb/Mscf (multiply by 1000 / 5.614583).
///
/// # Arguments
/// * `bg_rcf_per_scf` - Bg in rcf/scf.
///
/// # Returns
/// Bg in rb/Mscf.
///
/// # Examples
/// ```
/// let b = stocktank::gas::rcf_per_scf_to_rb_per_mscf(0.005615);
/// assert!((b - 1.0).abs() < 1e-4);
/// ```
#[inline]
pub fn rcf_per_scf_to_rb_per_mscf(bg_rcf_per_scf: f64) -> f64 {
    bg_rcf_per_scf * 1000.0 / FT3_PER_BBL
}

/// Gas density, lbm/ft3.
///
/// # Formula
/// ```text
/// rho_g = p M / (Z R T),   M = 28.9647 g,  R = 10.7316 psia ft3/(lbmol degR), T in degR
/// ```
///
/// # Arguments
/// * `p_psia` - pressure, psia, > 0.
/// * `t_f` - temperature, degF.
/// * `z` - Z-factor, > 0.
/// * `gas_sg` - gas specific gravity, air = 1, > 0.
///
/// # Returns
/// Density, lbm/ft3.
///
/// # Errors
/// [`crate::Error::InvalidArgument`] naming the bad argument.
///
/// # Examples
/// ```
/// // Air at 14.696 psia and 60 degF: about 0.0763 lbm/ft3 (common practice, no source).
/// let rho = stocktank::gas::gas_density(14.696, 60.0, 1.0, 1.0).unwrap();
/// assert!((rho - 0.0763).abs() < 2e-4);
/// ```
///
/// # References
/// Real-gas law; McCain, W.D. (1990). The Properties of Petroleum Fluids, 2nd ed.
#[inline]
pub fn gas_density(p_psia: f64, t_f: f64, z: f64, gas_sg: f64) -> Result<f64> {
    let p = positive("p_psia", p_psia)?;
    temperature_f("t_f", t_f)?;
    let z = positive("z", z)?;
    let m = molar_mass(gas_sg)?;
    Ok(GasIsothermVolumetrics::density_factor(t_f, m) * p / z)
}

/// Gas isothermal compressibility from the pseudo-reduced compressibility.
///
/// # Formula
/// ```text
/// cg = cpr / Ppc,   cpr = 1/Ppr - (1/Z) dZ/dPpr   (Trube 1957)
/// ```
///
/// # Arguments
/// * `cpr` - pseudo-reduced compressibility, dimensionless (from the Z solver).
/// * `ppc_psia` - pseudo-critical pressure, psia, > 0.
///
/// # Returns
/// cg in 1/psi.
///
/// # Errors
/// [`crate::Error::InvalidArgument`] naming `ppc_psia`.
///
/// # Examples
/// ```
/// // Ideal gas: cg = 1/p.
/// let cg = stocktank::gas::cg_from_cpr(1.0 / 2.0, 650.0).unwrap();
/// assert!((cg - 1.0 / 1300.0).abs() < 1e-15);
/// ```
///
/// # References
/// Trube, A.S. (1957). Compressibility of natural gases. Trans. AIME 210, 355–357.
#[inline]
pub fn cg_from_cpr(cpr: f64, ppc_psia: f64) -> Result<f64> {
    Ok(cpr / positive("ppc_psia", ppc_psia)?)
}
