//! Relative permeability by Corey-type (Brooks–Corey) power laws of normalised saturation.
//!
//! Shared by the material-balance forecast (gas-oil ratio krg/kro) and by displacement
//! efficiency (Buckley–Leverett with oil-water curves).
//!
//! # Formula
//! ```text
//! oil-water:  Swn = (Sw - Swc) / (1 - Swc - Sorw),           clamped to [0, 1]
//!             krw = krw_max * Swn^nw
//!             krow = kro_max * (1 - Swn)^now
//! gas-oil:    Sgn = (Sg - Sgc) / (1 - Swc - Sorg - Sgc),     clamped to [0, 1]
//!             krg = krg_max * Sgn^ng
//!             Son = (1 - Swc - Sg - Sorg) / (1 - Swc - Sorg), clamped to [0, 1]
//!             krog = kro_max * Son^nog
//! ```
//! Swc is the connate (and critical) water saturation, Sorw and Sorg the residual oil
//! saturations to water and to gas (oil does not flow below them), Sgc the critical gas
//! saturation below which gas does not flow. All saturations are fractions of pore volume.
//!
//! # References
//! - Corey, A.T. (1954). The interrelation between gas and oil relative permeabilities.
//!   Producers Monthly 19(1), 38–41.
//! - Brooks, R.H., Corey, A.T. (1964). Hydraulic properties of porous media. Hydrology
//!   Paper 3, Colorado State University.

use crate::error::{Error, Result, fraction, positive};

fn end_point(arg: &'static str, v: f64) -> Result<f64> {
    if v > 0.0 && v <= 1.0 {
        Ok(v)
    } else {
        Err(Error::invalid(
            arg,
            v,
            "end-point relative permeability must lie in (0, 1]",
        ))
    }
}

/// Saturations closer than this to an end point (as a fraction of the mobile range) count as
/// the end point, so that e.g. kro is exactly zero at So = Sor despite rounding in `1 - Sw`.
const END_POINT_SNAP: f64 = 1e-12;

#[inline]
fn clamp01(x: f64) -> f64 {
    if x <= END_POINT_SNAP {
        0.0
    } else if x >= 1.0 - END_POINT_SNAP {
        1.0
    } else {
        x
    }
}

/// Corey oil-water relative permeabilities (water-wet or mixed-wet, two-phase).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct CoreyOilWater {
    /// Connate (critical) water saturation, fraction.
    pub swc: f64,
    /// Residual oil saturation to water, fraction.
    pub sorw: f64,
    /// Water relative permeability at Sw = 1 - Sorw, fraction (0, 1].
    pub krw_max: f64,
    /// Oil relative permeability at Sw = Swc, fraction (0, 1].
    pub kro_max: f64,
    /// Corey exponent of water, > 0 (often 2 to 4).
    pub nw: f64,
    /// Corey exponent of oil, > 0 (often 2 to 4).
    pub no: f64,
}

impl CoreyOilWater {
    /// Build and validate oil-water Corey curves.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming the parameter when a saturation lies outside
    /// [0, 1], when `swc + sorw >= 1`, when an end point lies outside (0, 1] or an exponent
    /// is not positive.
    ///
    /// # Examples
    /// ```
    /// use stocktank::relperm::CoreyOilWater;
    /// let k = CoreyOilWater::new(0.2, 0.25, 0.3, 0.8, 2.0, 2.0).unwrap();
    /// assert_eq!(k.krw(0.2), 0.0);
    /// assert_eq!(k.krow(0.75), 0.0); // oil at its residual saturation does not flow
    /// ```
    pub fn new(swc: f64, sorw: f64, krw_max: f64, kro_max: f64, nw: f64, no: f64) -> Result<Self> {
        fraction("swc", swc)?;
        fraction("sorw", sorw)?;
        if swc + sorw >= 1.0 {
            return Err(Error::invalid("sorw", sorw, "swc + sorw must be < 1"));
        }
        Ok(Self {
            swc,
            sorw,
            krw_max: end_point("krw_max", krw_max)?,
            kro_max: end_point("kro_max", kro_max)?,
            nw: positive("nw", nw)?,
            no: positive("no", no)?,
        })
    }

    /// Normalised water saturation Swn, clamped to [0, 1].
    #[inline]
    pub fn normalised(&self, sw: f64) -> f64 {
        clamp01((sw - self.swc) / (1.0 - self.swc - self.sorw))
    }

    /// Water relative permeability at water saturation `sw` (fraction); 0 at or below Swc.
    ///
    /// # Examples
    /// ```
    /// use stocktank::relperm::CoreyOilWater;
    /// let k = CoreyOilWater::new(0.2, 0.2, 0.5, 1.0, 2.0, 2.0).unwrap();
    /// assert!((k.krw(0.5) - 0.5 * 0.5f64.powi(2)).abs() < 1e-15);
    /// ```
    #[inline]
    pub fn krw(&self, sw: f64) -> f64 {
        self.krw_max * self.normalised(sw).powf(self.nw)
    }

    /// Oil relative permeability at water saturation `sw` (fraction); 0 at or above 1 - Sorw.
    ///
    /// # Examples
    /// ```
    /// use stocktank::relperm::CoreyOilWater;
    /// let k = CoreyOilWater::new(0.2, 0.2, 0.5, 1.0, 2.0, 2.0).unwrap();
    /// assert_eq!(k.krow(0.2), 1.0);
    /// ```
    #[inline]
    pub fn krow(&self, sw: f64) -> f64 {
        self.kro_max * (1.0 - self.normalised(sw)).powf(self.no)
    }

    /// Derivatives (dkrw/dSw, dkrow/dSw), 1/fraction; zero outside the mobile range.
    ///
    /// # Examples
    /// ```
    /// use stocktank::relperm::CoreyOilWater;
    /// let k = CoreyOilWater::new(0.0, 0.0, 1.0, 1.0, 1.0, 1.0).unwrap();
    /// assert_eq!(k.derivatives(0.5), (1.0, -1.0));
    /// ```
    #[inline]
    pub fn derivatives(&self, sw: f64) -> (f64, f64) {
        let span = 1.0 - self.swc - self.sorw;
        let s = (sw - self.swc) / span;
        if !(0.0..=1.0).contains(&s) {
            return (0.0, 0.0);
        }
        let dkrw = if s > 0.0 || self.nw <= 1.0 {
            self.krw_max * self.nw * s.powf(self.nw - 1.0) / span
        } else {
            0.0
        };
        let dkro = if s < 1.0 || self.no <= 1.0 {
            -self.kro_max * self.no * (1.0 - s).powf(self.no - 1.0) / span
        } else {
            0.0
        };
        (dkrw, dkro)
    }
}

/// Corey gas-oil relative permeabilities at connate water (gas displacing or liberated in oil).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct CoreyGasOil {
    /// Connate water saturation, fraction.
    pub swc: f64,
    /// Critical gas saturation (gas is immobile below it), fraction.
    pub sgc: f64,
    /// Residual oil saturation to gas, fraction.
    pub sorg: f64,
    /// Gas relative permeability at Sg = 1 - Swc - Sorg, fraction (0, 1].
    pub krg_max: f64,
    /// Oil relative permeability at Sg = 0, fraction (0, 1].
    pub kro_max: f64,
    /// Corey exponent of gas, > 0.
    pub ng: f64,
    /// Corey exponent of oil in the gas-oil system, > 0.
    pub no: f64,
}

impl CoreyGasOil {
    /// Build and validate gas-oil Corey curves.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming the parameter when a saturation lies outside
    /// [0, 1], when `swc + sgc + sorg >= 1`, or an end point or exponent is invalid.
    ///
    /// # Examples
    /// ```
    /// use stocktank::relperm::CoreyGasOil;
    /// let k = CoreyGasOil::new(0.2, 0.05, 0.1, 0.9, 1.0, 2.0, 2.0).unwrap();
    /// assert_eq!(k.krg(0.04), 0.0); // below the critical gas saturation gas does not flow
    /// ```
    #[allow(clippy::too_many_arguments)]
    pub fn new(
        swc: f64,
        sgc: f64,
        sorg: f64,
        krg_max: f64,
        kro_max: f64,
        ng: f64,
        no: f64,
    ) -> Result<Self> {
        fraction("swc", swc)?;
        fraction("sgc", sgc)?;
        fraction("sorg", sorg)?;
        if swc + sgc + sorg >= 1.0 {
            return Err(Error::invalid("sorg", sorg, "swc + sgc + sorg must be < 1"));
        }
        Ok(Self {
            swc,
            sgc,
            sorg,
            krg_max: end_point("krg_max", krg_max)?,
            kro_max: end_point("kro_max", kro_max)?,
            ng: positive("ng", ng)?,
            no: positive("no", no)?,
        })
    }

    /// Gas relative permeability at gas saturation `sg` (fraction); 0 at or below Sgc.
    ///
    /// # Examples
    /// ```
    /// use stocktank::relperm::CoreyGasOil;
    /// let k = CoreyGasOil::new(0.2, 0.05, 0.1, 0.9, 1.0, 2.0, 2.0).unwrap();
    /// assert!((k.krg(0.7) - 0.9).abs() < 1e-12);
    /// ```
    #[inline]
    pub fn krg(&self, sg: f64) -> f64 {
        let sgn = clamp01((sg - self.sgc) / (1.0 - self.swc - self.sorg - self.sgc));
        self.krg_max * sgn.powf(self.ng)
    }

    /// Oil relative permeability at gas saturation `sg` (fraction); 0 when the oil saturation
    /// 1 - Swc - Sg is at or below Sorg.
    ///
    /// # Examples
    /// ```
    /// use stocktank::relperm::CoreyGasOil;
    /// let k = CoreyGasOil::new(0.2, 0.05, 0.1, 0.9, 1.0, 2.0, 2.0).unwrap();
    /// assert_eq!(k.krog(0.0), 1.0);
    /// assert_eq!(k.krog(0.7), 0.0);
    /// ```
    #[inline]
    pub fn krog(&self, sg: f64) -> f64 {
        let son = clamp01((1.0 - self.swc - sg - self.sorg) / (1.0 - self.swc - self.sorg));
        self.kro_max * son.powf(self.no)
    }

    /// The ratio krg/kro at gas saturation `sg`; +infinity where oil is immobile.
    ///
    /// # Examples
    /// ```
    /// use stocktank::relperm::CoreyGasOil;
    /// let k = CoreyGasOil::new(0.2, 0.05, 0.1, 0.9, 1.0, 2.0, 2.0).unwrap();
    /// assert_eq!(k.krg_over_kro(0.01), 0.0);
    /// ```
    #[inline]
    pub fn krg_over_kro(&self, sg: f64) -> f64 {
        let kro = self.krog(sg);
        if kro > 0.0 {
            self.krg(sg) / kro
        } else {
            f64::INFINITY
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn end_points() {
        let k = CoreyOilWater::new(0.15, 0.3, 0.4, 0.9, 3.0, 2.5).unwrap();
        assert_eq!(k.krw(0.15), 0.0);
        assert!((k.krw(0.7) - 0.4).abs() < 1e-15);
        assert!((k.krow(0.15) - 0.9).abs() < 1e-15);
        assert_eq!(k.krow(0.7), 0.0);
        // Oil flows only above its critical (residual) saturation
        // (common practice, no source): kro = 0 wherever So <= Sorw.
        for sw in [0.7, 0.75, 0.9, 1.0] {
            assert_eq!(k.krow(sw), 0.0);
        }
    }

    #[test]
    fn derivatives_match_finite_differences() {
        let k = CoreyOilWater::new(0.2, 0.2, 0.5, 0.8, 2.5, 3.0).unwrap();
        for sw in [0.3, 0.45, 0.6, 0.75] {
            let h = 1e-6;
            let (dw, do_) = k.derivatives(sw);
            let fw = (k.krw(sw + h) - k.krw(sw - h)) / (2.0 * h);
            let fo = (k.krow(sw + h) - k.krow(sw - h)) / (2.0 * h);
            assert!((dw - fw).abs() < 1e-7 && (do_ - fo).abs() < 1e-7);
        }
    }

    #[test]
    fn invalid_end_points_are_named() {
        let e = CoreyGasOil::new(0.5, 0.3, 0.3, 1.0, 1.0, 2.0, 2.0).unwrap_err();
        assert!(e.to_string().contains("sorg"));
        let e = CoreyOilWater::new(0.2, 0.2, 1.5, 1.0, 2.0, 2.0).unwrap_err();
        assert!(e.to_string().contains("krw_max"));
    }
}
