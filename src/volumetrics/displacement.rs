//! Displacement efficiency of a waterflood or water drive: Buckley–Leverett fractional flow
//! with the Welge tangent, from Corey relative permeabilities ([`CoreyOilWater`]).
//!
//! # Formula
//! ```text
//! lambda_w = krw / mu_w,   lambda_o = kro / mu_o
//! fw = lambda_w (1 - G lambda_o) / (lambda_w + lambda_o)                  (water cut, reservoir)
//! G  = 0.001127 * 0.4331 * k A (rho_w - rho_o) sin(alpha) / q_t           (cp, optional gravity)
//! front (Welge):   dfw/dSw(Swf) = (fw(Swf) - fw(Swi)) / (Swf - Swi)
//! breakthrough:    Qi_bt = 1 / fw'(Swf),   Sw_avg = Swf + (1 - fw(Swf)) / fw'(Swf)
//! after:           fw'(Sw2) = 1 / Qi,      Sw_avg = Sw2 + (1 - fw(Sw2)) Qi
//! before:          Sw_avg = Swi + Qi (1 - fw(Swi))
//! displacement efficiency  ED = (Sw_avg - Swi) / (1 - Swi)
//! ```
//! Qi is the water injected in (movable-unit-free) pore volumes, reservoir conditions.
//! The gravity number G uses k in md, A in ft2, the water-oil density difference as a
//! specific gravity difference, alpha the dip angle (positive when water flows updip) and
//! q_t the total reservoir rate in rb/day; 0.001127 rb/(day ft cp) per (md ft2 psi/ft) is
//! Darcy's law in field units and 0.4331 psi/ft the gradient of water of specific gravity 1,
//! both derived here from the exact units.
//!
//! The front is found as the point of largest secant slope from (Swi, fw(Swi)), which is the
//! tangent point for an S-shaped fw and the end point 1 - Sorw (a piston-like front) when fw
//! is linear or concave. The tangent is refined by bisection on the tangency condition to
//! 1e-12 in saturation.
//!
//! # References
//! - Buckley, S.E., Leverett, M.C. (1942). Mechanism of fluid displacement in sands.
//!   Trans. AIME 146, 107–116.
//! - Welge, H.J. (1952). A simplified method for computing oil recovery by gas or water
//!   drive. Trans. AIME 195, 91–98.
//! - Craig, F.F. (1971). The Reservoir Engineering Aspects of Waterflooding. SPE Monograph 3.

use crate::error::{Error, Result, fraction, positive};
use crate::relperm::CoreyOilWater;
use crate::units::{FT3_PER_BBL, M_PER_FT, M3_PER_FT3, PA_PER_PSI, STANDARD_GRAVITY};

/// Darcy's law constant in field units: rb/day per (md ft2 (psi/ft) / cp), 0.0011271.
/// Derived from 1 darcy = 9.869233e-13 m2 (definition via cp, cm2, atm; NIST SP 811).
///
/// # Examples
/// ```
/// // 0.001127 (common practice, no source).
/// assert!((stocktank::volumetrics::darcy_constant_field() - 0.001127).abs() < 1e-6);
/// ```
pub fn darcy_constant_field() -> f64 {
    let m2_per_md = 1.0e-3 * 1.0e-3 * 1.0e-4 / crate::units::PA_PER_ATM;
    let ft2 = M_PER_FT * M_PER_FT;
    let grad = PA_PER_PSI / M_PER_FT; // Pa/m per psi/ft
    let q_m3_s = m2_per_md * ft2 * grad / 1.0e-3; // per cp
    q_m3_s * 86_400.0 / (M3_PER_FT3 * FT3_PER_BBL)
}

/// Pressure gradient of water of specific gravity 1 (at 60 degF), psi/ft, 0.4331.
fn water_gradient_psi_per_ft() -> f64 {
    let rho = crate::units::WATER_DENSITY_60F * crate::units::KG_PER_LBM / M3_PER_FT3; // kg/m3
    rho * STANDARD_GRAVITY * M_PER_FT / PA_PER_PSI
}

/// Gravity number G (cp) of the fractional-flow equation for a dipping bed.
///
/// # Formula
/// ```text
/// G = 0.001127 * 0.4331 * k A (rho_w - rho_o) sin(alpha) / q_t
/// ```
///
/// # Arguments
/// * `k_md` - absolute permeability, md, > 0.
/// * `area_ft2` - cross-sectional area normal to flow, ft2, > 0.
/// * `delta_sg` - water minus oil specific gravity (60/60 degF) at reservoir conditions.
/// * `dip_deg` - dip angle, degrees, positive when water flows updip, in [-90, 90].
/// * `qt_rb_per_day` - total reservoir rate, rb/day, > 0.
///
/// # Returns
/// G in cp (0 for a horizontal bed).
///
/// # Errors
/// [`Error::InvalidArgument`] naming the offending argument.
///
/// # Examples
/// ```
/// use stocktank::volumetrics::gravity_number;
/// assert_eq!(gravity_number(100.0, 1000.0, 0.3, 0.0, 500.0).unwrap(), 0.0);
/// ```
///
/// # References
/// Buckley and Leverett (1942); Craig (1971), SPE Monograph 3, ch. 3.
pub fn gravity_number(
    k_md: f64,
    area_ft2: f64,
    delta_sg: f64,
    dip_deg: f64,
    qt_rb_per_day: f64,
) -> Result<f64> {
    positive("k_md", k_md)?;
    positive("area_ft2", area_ft2)?;
    if !delta_sg.is_finite() {
        return Err(Error::invalid("delta_sg", delta_sg, "must be finite"));
    }
    if !(-90.0..=90.0).contains(&dip_deg) {
        return Err(Error::invalid(
            "dip_deg",
            dip_deg,
            "must lie in [-90, 90] degrees",
        ));
    }
    positive("qt_rb_per_day", qt_rb_per_day)?;
    Ok(darcy_constant_field()
        * water_gradient_psi_per_ft()
        * k_md
        * area_ft2
        * delta_sg
        * dip_deg.to_radians().sin()
        / qt_rb_per_day)
}

/// Fractional flow of water for one set of Corey curves, viscosities and gravity number.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FractionalFlow {
    /// Oil-water relative permeabilities.
    pub relperm: CoreyOilWater,
    /// Oil viscosity at reservoir conditions, cp.
    pub mu_o: f64,
    /// Water viscosity at reservoir conditions, cp.
    pub mu_w: f64,
    /// Gravity number G, cp (0 for a horizontal bed); see [`gravity_number`].
    pub gravity: f64,
    /// Initial water saturation, fraction (>= Swc, < 1 - Sorw).
    pub swi: f64,
}

/// The Welge front and breakthrough of a Buckley–Leverett displacement.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct WelgeFront {
    /// Water saturation just behind the front, fraction.
    pub sw_front: f64,
    /// Reservoir water cut at the front, fraction.
    pub fw_front: f64,
    /// dfw/dSw at the front (slope of the Welge tangent), 1/fraction.
    pub slope: f64,
    /// Average water saturation behind the front at breakthrough, fraction.
    pub sw_avg_breakthrough: f64,
    /// Water injected at breakthrough, pore volumes.
    pub pv_breakthrough: f64,
    /// Displacement efficiency at breakthrough, fraction of the initial oil.
    pub ed_breakthrough: f64,
}

/// State after a given volume of water injected.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct DisplacementState {
    /// Water injected, pore volumes.
    pub pv_injected: f64,
    /// Water saturation at the outlet, fraction.
    pub sw_outlet: f64,
    /// Reservoir water cut at the outlet, fraction (0 before breakthrough).
    pub fw_outlet: f64,
    /// Average water saturation of the swept zone, fraction.
    pub sw_avg: f64,
    /// Displacement efficiency, fraction of the initial oil.
    pub ed: f64,
}

impl FractionalFlow {
    /// Build and validate.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `mu_o`, `mu_w` (not > 0), `gravity` (not finite) or
    /// `swi` (below Swc or at/above 1 - Sorw).
    ///
    /// # Examples
    /// ```
    /// use stocktank::relperm::CoreyOilWater;
    /// use stocktank::volumetrics::FractionalFlow;
    /// let k = CoreyOilWater::new(0.2, 0.2, 0.3, 0.8, 2.0, 2.0).unwrap();
    /// assert!(FractionalFlow::new(k, 2.0, 0.5, 0.0, 0.2).is_ok());
    /// assert!(FractionalFlow::new(k, 2.0, 0.5, 0.0, 0.1).is_err());
    /// ```
    pub fn new(
        relperm: CoreyOilWater,
        mu_o: f64,
        mu_w: f64,
        gravity: f64,
        swi: f64,
    ) -> Result<Self> {
        positive("mu_o", mu_o)?;
        positive("mu_w", mu_w)?;
        if !gravity.is_finite() {
            return Err(Error::invalid("gravity", gravity, "must be finite"));
        }
        fraction("swi", swi)?;
        if swi < relperm.swc - 1e-12 {
            return Err(Error::invalid("swi", swi, "must be >= swc"));
        }
        if swi >= 1.0 - relperm.sorw {
            return Err(Error::invalid(
                "swi",
                swi,
                "must be < 1 - sorw (oil must be mobile)",
            ));
        }
        Ok(Self {
            relperm,
            mu_o,
            mu_w,
            gravity,
            swi,
        })
    }

    /// Reservoir water cut fw at water saturation `sw` (fraction).
    ///
    /// # Examples
    /// ```
    /// use stocktank::relperm::CoreyOilWater;
    /// use stocktank::volumetrics::FractionalFlow;
    /// let k = CoreyOilWater::new(0.2, 0.2, 0.3, 0.8, 2.0, 2.0).unwrap();
    /// let f = FractionalFlow::new(k, 2.0, 0.5, 0.0, 0.2).unwrap();
    /// assert_eq!(f.fw(0.2), 0.0);
    /// assert_eq!(f.fw(0.8), 1.0);
    /// ```
    #[inline]
    pub fn fw(&self, sw: f64) -> f64 {
        let lw = self.relperm.krw(sw) / self.mu_w;
        let lo = self.relperm.krow(sw) / self.mu_o;
        lw * (1.0 - self.gravity * lo) / (lw + lo)
    }

    /// dfw/dSw at water saturation `sw` (analytic), 1/fraction.
    ///
    /// # Examples
    /// ```
    /// use stocktank::relperm::CoreyOilWater;
    /// use stocktank::volumetrics::FractionalFlow;
    /// let k = CoreyOilWater::new(0.0, 0.0, 1.0, 1.0, 1.0, 1.0).unwrap();
    /// let f = FractionalFlow::new(k, 1.0, 1.0, 0.0, 0.0).unwrap();
    /// assert!((f.dfw(0.3) - 1.0).abs() < 1e-12);
    /// ```
    #[inline]
    pub fn dfw(&self, sw: f64) -> f64 {
        let k = &self.relperm;
        let (dkw, dko) = k.derivatives(sw);
        let (lw, lo) = (k.krw(sw) / self.mu_w, k.krow(sw) / self.mu_o);
        let (dlw, dlo) = (dkw / self.mu_w, dko / self.mu_o);
        let g = self.gravity;
        let n = lw - g * lw * lo;
        let dn = dlw - g * (dlw * lo + lw * dlo);
        let d = lw + lo;
        let dd = dlw + dlo;
        (dn * d - n * dd) / (d * d)
    }

    fn secant(&self, s: f64) -> f64 {
        (self.fw(s) - self.fw(self.swi)) / (s - self.swi)
    }

    /// The Welge tangent: front saturation, breakthrough time and displacement efficiency.
    ///
    /// # Errors
    /// [`Error::NoConvergence`] if the tangent cannot be bracketed (not expected for Corey
    /// curves; reported rather than returning a wrong front).
    ///
    /// # Examples
    /// ```
    /// use stocktank::relperm::CoreyOilWater;
    /// use stocktank::volumetrics::FractionalFlow;
    /// // Straight-line relative permeabilities and equal viscosities: a piston-like front.
    /// let k = CoreyOilWater::new(0.2, 0.2, 1.0, 1.0, 1.0, 1.0).unwrap();
    /// let w = FractionalFlow::new(k, 1.0, 1.0, 0.0, 0.2).unwrap().welge().unwrap();
    /// assert!((w.sw_front - 0.8).abs() < 1e-9);
    /// ```
    ///
    /// # References
    /// Welge, H.J. (1952). Trans. AIME 195, 91–98.
    pub fn welge(&self) -> Result<WelgeFront> {
        let hi = 1.0 - self.relperm.sorw;
        let lo = self.swi;
        const N: usize = 4000;
        let step = (hi - lo) / N as f64;
        let mut best = (f64::NEG_INFINITY, hi);
        let mut best_i = N;
        for i in 1..=N {
            let s = lo + step * i as f64;
            let m = self.secant(s);
            // Ties go to the larger saturation (a linear fw gives a piston-like front).
            if m >= best.0 * (1.0 - 1e-12) {
                best = (m, s);
                best_i = i;
            }
        }
        let swf = if best_i == N {
            // Secant grows up to the end point: shock to 1 - Sorw (piston-like).
            hi
        } else {
            // Refine on g(S) = fw'(S) (S - Swi) - (fw(S) - fw(Swi)), positive before the
            // tangent point and negative after it.
            let g = |s: f64| self.dfw(s) * (s - self.swi) - (self.fw(s) - self.fw(self.swi));
            let mut a = lo + step * (best_i.saturating_sub(1).max(1)) as f64;
            let mut b = (lo + step * (best_i + 1) as f64).min(hi);
            let (ga, gb) = (g(a), g(b));
            if ga.is_nan() || gb.is_nan() || ga * gb > 0.0 {
                // The maximum sits on a grid point with no sign change nearby (flat secant):
                // accept the grid maximum, which is within one grid step.
                if ga * gb > 0.0 && (ga.abs() < 1e-9 || gb.abs() < 1e-9) {
                    best.1
                } else {
                    return Err(Error::NoConvergence {
                        method: "Welge tangent",
                        detail: format!("no sign change of the tangency condition on [{a}, {b}]"),
                    });
                }
            } else {
                let mut fa = ga;
                for _ in 0..200 {
                    let m = 0.5 * (a + b);
                    let fm = g(m);
                    if (fm > 0.0) == (fa > 0.0) {
                        a = m;
                        fa = fm;
                    } else {
                        b = m;
                    }
                    if b - a < 1e-13 {
                        break;
                    }
                }
                0.5 * (a + b)
            }
        };
        let fwf = self.fw(swf);
        let slope = if swf >= hi {
            self.secant(hi)
        } else {
            self.dfw(swf)
        };
        // Average saturation at breakthrough: Swf + (1 - fwf)/slope.
        let sw_avg = swf + (1.0 - fwf) / slope;
        Ok(WelgeFront {
            sw_front: swf,
            fw_front: fwf,
            slope,
            sw_avg_breakthrough: sw_avg,
            pv_breakthrough: 1.0 / slope,
            ed_breakthrough: (sw_avg - self.swi) / (1.0 - self.swi),
        })
    }

    /// Displacement state after `pv_injected` pore volumes of water.
    ///
    /// # Arguments
    /// * `front` - the result of [`FractionalFlow::welge`].
    /// * `pv_injected` - cumulative water injected, pore volumes, >= 0.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `pv_injected`.
    ///
    /// # Examples
    /// ```
    /// use stocktank::relperm::CoreyOilWater;
    /// use stocktank::volumetrics::FractionalFlow;
    /// let k = CoreyOilWater::new(0.2, 0.2, 0.3, 0.8, 2.0, 2.0).unwrap();
    /// let f = FractionalFlow::new(k, 2.0, 0.5, 0.0, 0.2).unwrap();
    /// let w = f.welge().unwrap();
    /// let late = f.state(&w, 10.0).unwrap();
    /// assert!(late.ed > w.ed_breakthrough && late.ed <= 0.75 + 1e-12);
    /// ```
    ///
    /// # References
    /// Welge, H.J. (1952). Trans. AIME 195, 91–98.
    pub fn state(&self, front: &WelgeFront, pv_injected: f64) -> Result<DisplacementState> {
        crate::error::non_negative("pv_injected", pv_injected)?;
        let fwi = self.fw(self.swi);
        let hi = 1.0 - self.relperm.sorw;
        let (sw2, fw2, sw_avg) = if pv_injected <= front.pv_breakthrough {
            (self.swi, fwi, self.swi + pv_injected * (1.0 - fwi))
        } else {
            let target = 1.0 / pv_injected;
            // fw' decreases from the front to 1 - Sorw; find fw'(S) = 1/Qi by bisection.
            let s = if front.sw_front >= hi || self.dfw(hi) >= target {
                hi
            } else {
                let (mut a, mut b) = (front.sw_front, hi);
                for _ in 0..200 {
                    let m = 0.5 * (a + b);
                    if self.dfw(m) > target {
                        a = m;
                    } else {
                        b = m;
                    }
                    if b - a < 1e-13 {
                        break;
                    }
                }
                0.5 * (a + b)
            };
            let f = self.fw(s);
            (s, f, (s + (1.0 - f) * pv_injected).min(hi))
        };
        Ok(DisplacementState {
            pv_injected,
            sw_outlet: sw2,
            fw_outlet: if pv_injected <= front.pv_breakthrough {
                fwi
            } else {
                fw2
            },
            sw_avg,
            ed: (sw_avg - self.swi) / (1.0 - self.swi),
        })
    }
}
