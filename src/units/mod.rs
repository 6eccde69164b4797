//! Units, exact constants and standard (base) conditions.
//!
//! Field units are the default everywhere in stocktank. Every constant here is derived from
//! an exact definition in one place, with its source named. Metric users convert at the
//! edge (see the conversion functions of this module); there is never a second code path.

use crate::error::{Error, Result};

pub mod convert;

/// Metres in one international foot (exact). NIST SP 811 (2008), Appendix B.
pub const M_PER_FT: f64 = 0.3048;
/// Square feet in one acre (exact, by definition of the acre). NIST SP 811 (2008), Appendix B.
pub const FT2_PER_ACRE: f64 = 43_560.0;
/// Cubic metres in one US gallon: 231 in3 with 1 in = 0.0254 m (exact). NIST SP 811 (2008).
pub const M3_PER_US_GAL: f64 = 231.0 * 0.0254 * 0.0254 * 0.0254;
/// US gallons in one petroleum barrel (exact). NIST SP 811 (2008), Appendix B.
pub const US_GAL_PER_BBL: f64 = 42.0;
/// Cubic metres in one petroleum barrel: 0.158987294928 m3 (exact). NIST SP 811 (2008).
pub const M3_PER_BBL: f64 = US_GAL_PER_BBL * M3_PER_US_GAL;
/// Cubic metres in one cubic foot (exact). NIST SP 811 (2008).
pub const M3_PER_FT3: f64 = M_PER_FT * M_PER_FT * M_PER_FT;
/// Cubic feet in one barrel, 5.614583 ft3 (derived from the two exact definitions above).
pub const FT3_PER_BBL: f64 = M3_PER_BBL / M3_PER_FT3;
/// Barrels in one acre-foot, 7758.37 bbl (derived; the trade rounds it to 7758).
pub const BBL_PER_ACRE_FT: f64 = FT2_PER_ACRE / FT3_PER_BBL;
/// Kilograms in one avoirdupois pound (exact). NIST SP 811 (2008).
pub const KG_PER_LBM: f64 = 0.453_592_37;
/// Standard acceleration of gravity, m/s2 (exact). NIST SP 811 (2008).
pub const STANDARD_GRAVITY: f64 = 9.806_65;
/// Pascals in one psi (pound-force per square inch): lbf / in2 with lbf = lbm * g0 (exact
/// from the definitions), 6894.757293168 Pa. NIST SP 811 (2008), Appendix B.
pub const PA_PER_PSI: f64 = KG_PER_LBM * STANDARD_GRAVITY / (0.0254 * 0.0254);
/// Pascals in one standard atmosphere (exact). NIST SP 811 (2008).
pub const PA_PER_ATM: f64 = 101_325.0;
/// One standard atmosphere in psia (14.6959...). Derived.
pub const PSI_PER_ATM: f64 = PA_PER_ATM / PA_PER_PSI;
/// Offset between degF and degR: degR = degF + 459.67 (exact). NIST SP 811 (2008).
pub const RANKINE_OFFSET: f64 = 459.67;
/// Offset between degC and K: K = degC + 273.15 (exact). NIST SP 811 (2008).
pub const KELVIN_OFFSET: f64 = 273.15;
/// Molar gas constant, J/(mol K) (exact since the 2019 SI redefinition). CODATA 2018.
pub const R_SI: f64 = 8.314_462_618;
/// Molar gas constant in field units, psia ft3 / (lbmol degR), about 10.7316.
/// Derived from [`R_SI`]: J/(mol K) -> (Pa m3) per (mol K), times mol/lbmol and K/degR.
pub const R_FIELD: f64 = R_SI / PA_PER_PSI / M3_PER_FT3 * (KG_PER_LBM * 1000.0) / 1.8;
/// Molar mass of dry air, lbm/lbmol (28.9647). U.S. Standard Atmosphere (1976).
pub const AIR_MOLAR_MASS: f64 = 28.9647;
/// Density of pure water at 60 degF and 14.696 psia, lbm/ft3 (999.016 kg/m3 from IAPWS-95,
/// as tabulated by NIST; 62.366 lbm/ft3). The reference for oil specific gravity 60/60 degF.
pub const WATER_DENSITY_60F: f64 = 999.016 / KG_PER_LBM * M3_PER_FT3;
/// Days in one year for decline rates and forecasts: the Julian year of 365.25 days (exact by
/// definition). IAU (1976) system of astronomical constants; NIST SP 811 (2008), App. B.
pub const DAYS_PER_YEAR: f64 = 365.25;
/// Days in one average month, 30.4375 (one twelfth of [`DAYS_PER_YEAR`]). Derived.
pub const DAYS_PER_MONTH: f64 = DAYS_PER_YEAR / 12.0;

/// Standard (base) conditions at which stock-tank and standard gas volumes are measured.
///
/// The default is 14.696 psia and 60 degF (common practice, no source). Some regulators
/// use 14.65 psia and 60 degF (common practice, no source); the metric reference is
/// 15 degC and 101.325 kPa (ISO 13443:1996).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct StandardConditions {
    /// Base pressure, psia.
    pub p_psia: f64,
    /// Base temperature, degF.
    pub t_f: f64,
}

impl Default for StandardConditions {
    fn default() -> Self {
        Self::FIELD
    }
}

impl StandardConditions {
    /// 14.696 psia and 60 degF (common practice, no source).
    pub const FIELD: Self = Self {
        p_psia: 14.696,
        t_f: 60.0,
    };
    /// 14.65 psia and 60 degF, used by some regulators (common practice, no source).
    pub const FIELD_14_65: Self = Self {
        p_psia: 14.65,
        t_f: 60.0,
    };
    /// 101.325 kPa and 15 degC (ISO 13443:1996 standard reference conditions).
    pub const ISO_13443: Self = Self {
        p_psia: PSI_PER_ATM,
        t_f: 15.0 * 1.8 + 32.0,
    };

    /// Build and validate standard conditions.
    ///
    /// # Arguments
    /// * `p_psia` - base pressure, psia, > 0.
    /// * `t_f` - base temperature, degF, above absolute zero.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `p_sc` or `t_sc`.
    ///
    /// # Examples
    /// ```
    /// let sc = stocktank::units::StandardConditions::new(14.65, 60.0).unwrap();
    /// assert!((sc.t_r() - 519.67).abs() < 1e-9);
    /// ```
    pub fn new(p_psia: f64, t_f: f64) -> Result<Self> {
        crate::error::positive("p_sc", p_psia)?;
        crate::error::temperature_f("t_sc", t_f)?;
        Ok(Self { p_psia, t_f })
    }

    /// Base temperature in degR.
    ///
    /// # Examples
    /// ```
    /// assert!((stocktank::units::StandardConditions::default().t_r() - 519.67).abs() < 1e-9);
    /// ```
    #[inline]
    pub fn t_r(&self) -> f64 {
        self.t_f + RANKINE_OFFSET
    }
}

/// Convert degF to degR (degR = degF + 459.67, exact; NIST SP 811).
///
/// # Examples
/// ```
/// assert!((stocktank::units::f_to_r(60.0) - 519.67).abs() < 1e-9);
/// ```
#[inline]
pub fn f_to_r(t_f: f64) -> f64 {
    t_f + RANKINE_OFFSET
}

/// Parse a standard-conditions pair, rejecting impossible values.
///
/// Used by the binding layers; equivalent to [`StandardConditions::new`].
///
/// # Errors
/// [`Error::InvalidArgument`] naming `p_sc` or `t_sc`.
///
/// # Examples
/// ```
/// assert!(stocktank::units::standard_conditions(14.696, 60.0).is_ok());
/// ```
pub fn standard_conditions(p_psia: f64, t_f: f64) -> Result<StandardConditions, Error> {
    StandardConditions::new(p_psia, t_f)
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn derived_constants_match_published_values() {
        // NIST SP 811 (2008), Appendix B.8: 1 bbl = 1.589873 E-01 m3; 1 psi = 6.894757 E+03 Pa.
        assert_relative_eq!(M3_PER_BBL, 0.158_987_294_928, max_relative = 1e-15);
        assert_relative_eq!(PA_PER_PSI, 6_894.757_293_168, max_relative = 1e-12);
        // 5.614583 ft3 per bbl: NIST SP 811 conversion of 42 US gal.
        assert_relative_eq!(FT3_PER_BBL, 5.614_583_333, max_relative = 1e-9);
        // 7758 bbl per acre-ft (common practice, no source).
        assert_eq!(BBL_PER_ACRE_FT.round(), 7758.0);
        // R = 10.7316 psia ft3/(lbmol degR) (common practice, no source).
        assert_relative_eq!(R_FIELD, 10.7316, max_relative = 2e-5);
        // 1 atm = 14.6959 psia. NIST SP 811.
        assert_relative_eq!(PSI_PER_ATM, 14.695_949, max_relative = 1e-7);
        // 62.37 lbm/ft3 for water at 60 degF (common practice, no source).
        assert_relative_eq!(WATER_DENSITY_60F, 62.37, max_relative = 2e-4);
    }

    #[test]
    fn iso_reference_is_59_f() {
        assert_relative_eq!(StandardConditions::ISO_13443.t_f, 59.0);
    }
}
