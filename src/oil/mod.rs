//! Oil properties (black-oil correlations): API gravity, bubble point, solution GOR, Bo,
//! compressibility, density, viscosity; calibration to measurements; black-oil tables.
//! Field units: psia, degF, scf/STB, rb/STB, cp, lbm/ft3, 1/psi.
//!
//! Layout:
//! - this module: API gravity and specific gravity, oil molar mass, the method enums;
//! - [`bubble_point`](mod@bubble_point): bubble-point pressure Pb(Rs) and its exact inverse Rs(p) by Standing
//!   (1947), Vasquez–Beggs (1980), Glaso (1980), Petrosky–Farshad (1993) and Al-Marhoun (1988),
//!   with the closed-form slope dRs/dp;
//! - [`fvf`]: saturated Bo (and dBo/dRs), undersaturated compressibility and Bo, apparent compressibility
//!   below Pb, total FVF Bt, oil density by mass balance;
//! - [`viscosity`]: dead, saturated and undersaturated oil viscosity;
//! - [`fluid`]: the [`Oil`] description with its calibration to measured Pb, Bo and viscosity;
//! - [`table`]: black-oil tables, their consistency check, and the parallel batch builder.
//!
//! Every correlation is computed outside its published range too; each family offers a
//! validity function (`*_in_range`) reporting whether the inputs lie inside the ranges of the
//! data the authors fitted.
//!
//! The results are screening estimates: correlations typically scatter 5-30 % from measured
//! laboratory data. Prefer measured PVT where it exists (see [`fluid::Calibration`]).

pub mod bubble_point;
pub mod fluid;
pub mod fvf;
pub mod table;
pub mod viscosity;

pub use bubble_point::{
    bubble_point, bubble_point_in_range, solution_gor, solution_gor_dp,
    vasquez_beggs_gas_sg_100psig,
};
pub use fluid::{Calibration, CalibrationReport, Methods, Oil, OilModel, Separator};
pub use fvf::{
    apparent_compressibility, bo_saturated, bo_saturated_drs, bo_saturated_in_range,
    bo_undersaturated, co_undersaturated, oil_density, total_fvf,
};
pub use table::{
    BlackOilTable, LongTable, Rule, Violation, build_long, build_long_results,
    build_long_results_with, build_tables,
};
pub use viscosity::{dead_oil_viscosity, live_oil_viscosity, undersaturated_oil_viscosity};

use crate::error::{Error, Result, positive};

/// Convert API gravity (degAPI) to oil specific gravity (60/60 degF, water = 1).
///
/// # Formula
/// ```text
/// SG = 141.5 / (API + 131.5)
/// ```
///
/// # Arguments
/// * `api` - stock-tank oil gravity, degAPI; must be > -131.5 (SG finite and positive).
///
/// # Returns
/// Specific gravity relative to water at 60 degF, dimensionless.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `api` when it is not finite or not above -131.5.
///
/// # Examples
/// ```
/// // Water is 10 degAPI by definition (API definition, common practice).
/// assert!((stocktank::oil::sg_from_api(10.0).unwrap() - 1.0).abs() < 1e-15);
/// ```
///
/// # References
/// American Petroleum Institute gravity definition (common practice, no source).
#[inline]
pub fn sg_from_api(api: f64) -> Result<f64> {
    if api.is_finite() && api > -131.5 {
        Ok(141.5 / (api + 131.5))
    } else {
        Err(Error::invalid(
            "api",
            api,
            "must be finite and > -131.5 degAPI",
        ))
    }
}

/// Convert oil specific gravity (60/60 degF) to API gravity (degAPI).
///
/// # Formula
/// ```text
/// API = 141.5 / SG - 131.5
/// ```
///
/// # Arguments
/// * `sg` - oil specific gravity relative to water at 60 degF, > 0.
///
/// # Returns
/// API gravity, degAPI.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `oil_sg` when it is not finite and positive.
///
/// # Examples
/// ```
/// let api = stocktank::oil::api_from_sg(0.85).unwrap();
/// assert!((api - 34.97).abs() < 0.01);
/// ```
///
/// # References
/// American Petroleum Institute gravity definition (common practice, no source).
#[inline]
pub fn api_from_sg(sg: f64) -> Result<f64> {
    positive("oil_sg", sg)?;
    Ok(141.5 / sg - 131.5)
}

/// Molar mass of a stock-tank oil estimated from its API gravity (Cragoe 1929).
///
/// # Formula
/// ```text
/// M = 6084 / (API - 5.9)
/// ```
///
/// # Arguments
/// * `api` - stock-tank oil gravity, degAPI, > 5.9; the fit covers roughly 20-80 degAPI.
///
/// # Returns
/// Molar mass, lbm/lbmol.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `api` when it is not finite or not above 5.9.
///
/// # Examples
/// ```
/// let m = stocktank::oil::oil_molar_mass(35.0).unwrap();
/// assert!((m - 209.07).abs() < 0.01);
/// ```
///
/// # References
/// Cragoe, C.S. (1929). Thermodynamic properties of petroleum products. U.S. Bureau of
/// Standards Miscellaneous Publication 97.
#[inline]
pub fn oil_molar_mass(api: f64) -> Result<f64> {
    if api.is_finite() && api > 5.9 {
        Ok(6084.0 / (api - 5.9))
    } else {
        Err(Error::invalid(
            "api",
            api,
            "must be finite and > 5.9 degAPI for Cragoe's molar mass",
        ))
    }
}

/// The range of one input (or result) in the data a correlation was fitted to.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ValidRange {
    /// Argument (or result) name, as in the function's signature: `rs`, `gas_sg`, `api`,
    /// `temperature_f`, `p`, `pb`, `bo`.
    pub arg: &'static str,
    /// Smallest value in the data, in the argument's unit.
    pub min: f64,
    /// Largest value in the data, in the argument's unit.
    pub max: f64,
}

impl ValidRange {
    /// Whether `v` lies in `[min, max]` (false for NaN).
    ///
    /// # Examples
    /// ```
    /// let r = stocktank::oil::ValidRange { arg: "api", min: 16.5, max: 63.8 };
    /// assert!(r.contains(30.0) && !r.contains(f64::NAN));
    /// ```
    #[inline]
    pub fn contains(&self, v: f64) -> bool {
        v >= self.min && v <= self.max
    }
}

macro_rules! method_enum {
    (
        $(#[$meta:meta])*
        $name:ident, $arg:literal, $allowed:literal {
            $($(#[$vmeta:meta])* $variant:ident => $text:literal),+ $(,)?
        }
    ) => {
        $(#[$meta])*
        #[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
        pub enum $name {
            $($(#[$vmeta])* $variant),+
        }

        impl $name {
            /// Every choice, in documentation order.
            pub const ALL: &'static [$name] = &[$($name::$variant),+];

            /// Parse the method's name as used in Python and in files.
            ///
            /// # Errors
            /// [`Error::InvalidOption`] listing the allowed names.
            pub fn parse(s: &str) -> Result<Self> {
                match s {
                    $($text => Ok($name::$variant),)+
                    _ => Err(Error::InvalidOption {
                        arg: $arg,
                        value: s.to_string(),
                        allowed: $allowed,
                    }),
                }
            }

            /// The method's name as used in Python and in files.
            pub fn name(self) -> &'static str {
                match self {
                    $($name::$variant => $text),+
                }
            }
        }

        impl std::fmt::Display for $name {
            fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
                f.write_str(self.name())
            }
        }
    };
}

method_enum! {
    /// Correlation for the bubble point Pb(Rs) and its inverse, the solution GOR Rs(p).
    PbMethod, "pb_method",
    "standing, vasquez_beggs, glaso, petrosky_farshad, al_marhoun" {
        /// Standing (1947), California crudes.
        Standing => "standing",
        /// Vasquez and Beggs (1980), worldwide data; uses the gas gravity at 100 psig.
        VasquezBeggs => "vasquez_beggs",
        /// Glaso (1980), North Sea crudes.
        Glaso => "glaso",
        /// Petrosky and Farshad (1993), Gulf of Mexico crudes.
        PetroskyFarshad => "petrosky_farshad",
        /// Al-Marhoun (1988), Middle East crudes.
        AlMarhoun => "al_marhoun",
    }
}

method_enum! {
    /// Correlation for the saturated oil formation volume factor Bo(Rs).
    BoMethod, "bo_method",
    "standing, vasquez_beggs, glaso, petrosky_farshad, al_marhoun" {
        /// Standing (1947).
        Standing => "standing",
        /// Vasquez and Beggs (1980); uses the gas gravity at 100 psig.
        VasquezBeggs => "vasquez_beggs",
        /// Glaso (1980).
        Glaso => "glaso",
        /// Petrosky and Farshad (1993).
        PetroskyFarshad => "petrosky_farshad",
        /// Al-Marhoun (1988).
        AlMarhoun => "al_marhoun",
    }
}

method_enum! {
    /// Correlation for the undersaturated oil compressibility co above the bubble point.
    CoMethod, "co_method", "vasquez_beggs, petrosky_farshad" {
        /// Vasquez and Beggs (1980).
        VasquezBeggs => "vasquez_beggs",
        /// Petrosky and Farshad (1993).
        PetroskyFarshad => "petrosky_farshad",
    }
}

method_enum! {
    /// Correlation for the dead (gas-free) oil viscosity at reservoir temperature.
    DeadOilViscosityMethod, "dead_oil_viscosity_method", "beggs_robinson, glaso, beal" {
        /// Beggs and Robinson (1975).
        BeggsRobinson => "beggs_robinson",
        /// Glaso (1980).
        Glaso => "glaso",
        /// Beal (1946), as fitted by Standing (1981).
        Beal => "beal",
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn api_round_trip() {
        for api in [10.0, 25.0, 35.0, 60.0] {
            let sg = sg_from_api(api).unwrap();
            assert!((api_from_sg(sg).unwrap() - api).abs() < 1e-12);
        }
        assert!(sg_from_api(f64::NAN).is_err());
        assert!(api_from_sg(0.0).is_err());
    }

    #[test]
    fn methods_parse_and_name() {
        for m in PbMethod::ALL {
            assert_eq!(PbMethod::parse(m.name()).unwrap(), *m);
        }
        let e = PbMethod::parse("nope").unwrap_err().to_string();
        assert!(e.contains("pb_method") && e.contains("standing"), "{e}");
    }
}
