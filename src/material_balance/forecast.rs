//! Solution-gas-drive forecast below the bubble point by the differential method of
//! Muskat (1945).
//!
//! # Formula
//! ```text
//! dSo/dp = [ So (Bg/Bo) dRs/dp + So (krg/kro)(mu_o/mu_g)(1/Bo) dBo/dp
//!            - (1 - So - Swc)(1/Bg) dBg/dp ] / [1 + (krg/kro)(mu_o/mu_g)]
//! Np/N   = 1 - (Boi / Bo) So / (1 - Swc)
//! R      = Rs + (krg/kro)(mu_o Bo)/(mu_g Bg)          producing gas-oil ratio, scf/STB
//! Gp/N   = integral of R d(Np/N)                      scf/STB
//! ```
//! integrated in pressure by the classical fourth-order Runge–Kutta method, starting at
//! the bubble point with So = 1 - Swc (no free gas). Bg in rb/scf.
//!
//! # References
//! - Muskat, M. (1945). The production histories of oil producing gas-drive reservoirs.
//!   Journal of Applied Physics 16(3), 147–159.
//! - Craft, B.C., Hawkins, M.F. (1959). Applied Petroleum Reservoir Engineering.
//!   Prentice-Hall, ch. 4.

use super::pvt::PvtTable;
use crate::error::{Error, Result, positive};
use crate::relperm::CoreyGasOil;

/// A solution-gas-drive forecast, one value per pressure step (the first row is the
/// bubble point).
#[derive(Debug, Clone, PartialEq)]
pub struct MuskatForecast {
    /// Pressure, psia (descending).
    pub p: Vec<f64>,
    /// Oil saturation, fraction.
    pub so: Vec<f64>,
    /// Gas saturation 1 - So - Swc, fraction.
    pub sg: Vec<f64>,
    /// krg/kro at Sg, dimensionless.
    pub krg_over_kro: Vec<f64>,
    /// Producing (instantaneous) gas-oil ratio R, scf/STB.
    pub gor: Vec<f64>,
    /// Cumulative oil over oil in place Np/N, the recovery factor, fraction.
    pub np_over_n: Vec<f64>,
    /// Cumulative gas over oil in place Gp/N, scf/STB.
    pub gp_over_n: Vec<f64>,
    /// True when the forecast stopped early because the oil became immobile.
    pub stopped_early: bool,
}

/// Forecast pressure, producing GOR and Np/N of a volumetric solution-gas-drive reservoir
/// below its bubble point by Muskat's (1945) differential material balance.
///
/// # Arguments
/// * `pvt` - PVT table with viscosity columns; must cover `p_bubble` down to `p_end`.
/// * `relperm` - gas-oil Corey curves; their `swc` is the connate water saturation.
/// * `p_bubble` - bubble point = initial pressure of the forecast, psia.
/// * `p_end` - last pressure, psia, below `p_bubble`.
/// * `n_steps` - number of equal pressure steps, >= 1 (each integrated by RK4 with 4 substeps).
///
/// # Returns
/// [`MuskatForecast`] with `n_steps + 1` rows (fewer when the oil becomes immobile).
///
/// # Errors
/// [`Error::InvalidArgument`] naming `p_bubble`, `p_end` or `n_steps`; [`Error::OutOfRange`]
/// when the table does not cover the range or has no viscosities.
///
/// # Examples
/// ```
/// use stocktank::material_balance::{PvtTable, muskat_forecast};
/// use stocktank::relperm::CoreyGasOil;
/// let pvt = PvtTable::new(vec![500.0, 2500.0], vec![1.15, 1.35], vec![150.0, 550.0], vec![0.0055, 0.0010])
///     .unwrap().with_viscosities(vec![1.6, 0.8], vec![0.012, 0.019]).unwrap();
/// let k = CoreyGasOil::new(0.25, 0.05, 0.2, 0.8, 1.0, 2.0, 3.0).unwrap();
/// let f = muskat_forecast(&pvt, &k, 2500.0, 500.0, 40).unwrap();
/// assert_eq!(f.np_over_n[0], 0.0);
/// assert!(f.np_over_n.windows(2).all(|w| w[1] >= w[0]));
/// ```
///
/// # References
/// Muskat, M. (1945). J. Appl. Phys. 16(3), 147–159.
pub fn muskat_forecast(
    pvt: &PvtTable,
    relperm: &CoreyGasOil,
    p_bubble: f64,
    p_end: f64,
    n_steps: usize,
) -> Result<MuskatForecast> {
    positive("p_bubble", p_bubble)?;
    positive("p_end", p_end)?;
    if p_end >= p_bubble {
        return Err(Error::invalid("p_end", p_end, "must be below p_bubble"));
    }
    if n_steps == 0 {
        return Err(Error::invalid("n_steps", 0.0, "must be >= 1"));
    }
    if !pvt.has_viscosities() {
        return Err(Error::OutOfRange(
            "the PVT table has no viscosity columns (mu_o, mu_g); the forecast needs them".into(),
        ));
    }
    pvt.at(p_bubble)?;
    pvt.at(p_end)?;
    let swc = relperm.swc;
    let qb = pvt.at(p_bubble)?;
    let rhs = |p: f64, so: f64| -> Result<f64> {
        let q = pvt.at(p)?;
        let sg = (1.0 - so - swc).max(0.0);
        let r = relperm.krg_over_kro(sg);
        if !r.is_finite() {
            return Ok(f64::NAN);
        }
        let mr = q.mu_o / q.mu_g;
        let num =
            so * q.bg / q.bo * q.drs_dp + so * r * mr / q.bo * q.dbo_dp - sg / q.bg * q.dbg_dp;
        Ok(num / (1.0 + r * mr))
    };
    let row = |p: f64, so: f64| -> Result<(f64, f64, f64, f64)> {
        let q = pvt.at(p)?;
        let sg = (1.0 - so - swc).max(0.0);
        let r = relperm.krg_over_kro(sg);
        let gor = q.rs + r * (q.mu_o * q.bo) / (q.mu_g * q.bg);
        let npn = 1.0 - qb.bo / q.bo * so / (1.0 - swc);
        Ok((sg, r, gor, npn))
    };
    let mut out = MuskatForecast {
        p: vec![],
        so: vec![],
        sg: vec![],
        krg_over_kro: vec![],
        gor: vec![],
        np_over_n: vec![],
        gp_over_n: vec![],
        stopped_early: false,
    };
    let push = |out: &mut MuskatForecast, p: f64, so: f64| -> Result<()> {
        let (sg, r, gor, npn) = row(p, so)?;
        let gpn = match out.p.len() {
            0 => 0.0,
            k => out.gp_over_n[k - 1] + 0.5 * (gor + out.gor[k - 1]) * (npn - out.np_over_n[k - 1]),
        };
        out.p.push(p);
        out.so.push(so);
        out.sg.push(sg);
        out.krg_over_kro.push(r);
        out.gor.push(gor);
        out.np_over_n.push(npn);
        out.gp_over_n.push(gpn);
        Ok(())
    };
    let mut so = 1.0 - swc;
    push(&mut out, p_bubble, so)?;
    let dp_step = (p_bubble - p_end) / n_steps as f64;
    const SUB: usize = 4;
    let h = -dp_step / SUB as f64;
    let mut p = p_bubble;
    'steps: for step in 1..=n_steps {
        for _ in 0..SUB {
            let k1 = rhs(p, so)?;
            let k2 = rhs(p + 0.5 * h, so + 0.5 * h * k1)?;
            let k3 = rhs(p + 0.5 * h, so + 0.5 * h * k2)?;
            let k4 = rhs(p + h, so + h * k3)?;
            let next = so + h / 6.0 * (k1 + 2.0 * k2 + 2.0 * k3 + k4);
            if !next.is_finite() {
                out.stopped_early = true;
                break 'steps;
            }
            so = next;
            p += h;
        }
        let p_row = if step == n_steps {
            p_end
        } else {
            p_bubble - dp_step * step as f64
        };
        p = p_row;
        if !relperm.krg_over_kro((1.0 - so - swc).max(0.0)).is_finite() {
            out.stopped_early = true;
            break;
        }
        push(&mut out, p_row, so)?;
    }
    Ok(out)
}
