//! Solution-gas-drive forecasts below the bubble point: the differential method of
//! Muskat (1945) ([`muskat_forecast`]) and the trial-and-error method of Tarner (1944)
//! ([`tarner_forecast`], formula in its doc).
//!
//! Muskat:
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
/// bubble point): the result of [`muskat_forecast`], and the rows of [`TarnerForecast`].
#[derive(Debug, Clone, PartialEq)]
pub struct SolutionGasForecast {
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

/// The result of [`muskat_forecast`].
pub type MuskatForecast = SolutionGasForecast;

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
    check_forecast_inputs(pvt, p_bubble, p_end, n_steps)?;
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

/// A Tarner (1944) forecast: the rows of a [`SolutionGasForecast`] plus, per step, how the
/// trial-and-error on the oil increment ended.
#[derive(Debug, Clone, PartialEq)]
pub struct TarnerForecast {
    /// Pressure (descending; the first row is the bubble point), saturations, GOR, Np/N and
    /// Gp/N per step.
    pub forecast: SolutionGasForecast,
    /// Root-finder iterations of each row (0 for the bubble-point row).
    pub iterations: Vec<usize>,
    /// Largest mismatch |Gp(MBE) - Gp(GOR)| / N at a converged step, scf/STB.
    pub max_mismatch: f64,
}

/// Relative tolerance of the Tarner root find on the oil increment (bracket width relative
/// to the increment, or mismatch of the two gas estimates relative to Gp/N + Rsi).
pub const TARNER_TOLERANCE: f64 = 1e-12;

fn check_forecast_inputs(pvt: &PvtTable, p_bubble: f64, p_end: f64, n_steps: usize) -> Result<()> {
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
    Ok(())
}

/// Forecast pressure, producing GOR and Np/N of a volumetric solution-gas-drive reservoir
/// below its bubble point by Tarner's (1944) trial-and-error method.
///
/// # Formula
/// Per unit oil in place (N = 1 STB), for each pressure step p_j -> p_(j+1), the oil
/// increment dNp is the root of Gp(MBE) - Gp(GOR) = 0, where
/// ```text
/// Bt       = Bo + (Rsi - Rs) Bg                                   rb/STB
/// Gp(MBE)  = (Bt - Bti) / Bg - Np (Bo / Bg - Rs)                  scf/STB  (material balance)
/// So       = (1 - Swc) (1 - Np) Bo / Boi                          saturation equation
/// R        = Rs + (krg/kro)(Sg) (mu_o Bo) / (mu_g Bg),  Sg = 1 - Swc - So
/// Gp(GOR)  = Gp_j + (R_j + R_(j+1)) / 2 * dNp                     scf/STB  (trapezoid)
/// Np       = Np_j + dNp
/// ```
/// Gp(MBE) - Gp(GOR) falls as dNp grows (more oil leaves less gas to balance and raises
/// R), is >= 0 at dNp = 0 and tends to -infinity as the oil becomes immobile, so the root
/// is bracketed in [0, Np_max - Np_j) and found by false position (Illinois) with a
/// bisection fallback, to a relative tolerance [`TARNER_TOLERANCE`]. Bg in rb/scf; water
/// and rock expansion are neglected below the bubble point, as in Tarner's method.
///
/// # Arguments
/// * `pvt` - PVT table with viscosity columns; must cover `p_bubble` down to `p_end`.
/// * `relperm` - gas-oil Corey curves; their `swc` is the connate water saturation.
/// * `p_bubble` - bubble point = initial pressure of the forecast, psia.
/// * `p_end` - last pressure, psia, below `p_bubble`.
/// * `n_steps` - number of equal pressure steps, >= 1.
///
/// # Returns
/// [`TarnerForecast`] with `n_steps + 1` rows (fewer when the oil becomes immobile).
///
/// # Errors
/// As [`muskat_forecast`]; [`Error::NoConvergence`] when a step's balance cannot be
/// bracketed (the table's Bt, Rs or Bg do not behave as below a bubble point) or the root
/// finder exhausts its iterations.
///
/// # Examples
/// ```
/// use stocktank::material_balance::{PvtTable, tarner_forecast};
/// use stocktank::relperm::CoreyGasOil;
/// let pvt = PvtTable::new(vec![500.0, 2500.0], vec![1.15, 1.35], vec![150.0, 550.0], vec![0.0055, 0.0010])
///     .unwrap().with_viscosities(vec![1.6, 0.8], vec![0.012, 0.019]).unwrap();
/// let k = CoreyGasOil::new(0.25, 0.05, 0.2, 0.8, 1.0, 2.0, 3.0).unwrap();
/// let f = tarner_forecast(&pvt, &k, 2500.0, 500.0, 40).unwrap();
/// assert_eq!(f.forecast.np_over_n[0], 0.0);
/// assert!(f.forecast.np_over_n.windows(2).all(|w| w[1] > w[0]));
/// ```
///
/// # References
/// - Tarner, J. (1944). How different size gas caps and pressure maintenance programs
///   affect amount of recoverable oil. Oil Weekly 144(2), June 1944 (volume and issue from
///   memory; the book below gives the method in full).
/// - Craft, B.C., Hawkins, M.F. (1959). Applied Petroleum Reservoir Engineering.
///   Prentice-Hall, ch. 4.
pub fn tarner_forecast(
    pvt: &PvtTable,
    relperm: &CoreyGasOil,
    p_bubble: f64,
    p_end: f64,
    n_steps: usize,
) -> Result<TarnerForecast> {
    check_forecast_inputs(pvt, p_bubble, p_end, n_steps)?;
    let swc = relperm.swc;
    let qb = pvt.at(p_bubble)?;
    let mut out = TarnerForecast {
        forecast: SolutionGasForecast {
            p: vec![p_bubble],
            so: vec![1.0 - swc],
            sg: vec![0.0],
            krg_over_kro: vec![relperm.krg_over_kro(0.0)],
            gor: vec![qb.rs],
            np_over_n: vec![0.0],
            gp_over_n: vec![0.0],
            stopped_early: false,
        },
        iterations: vec![0],
        max_mismatch: 0.0,
    };
    let dp_step = (p_bubble - p_end) / n_steps as f64;
    for step in 1..=n_steps {
        let p = if step == n_steps {
            p_end
        } else {
            p_bubble - dp_step * step as f64
        };
        let q = pvt.at(p)?;
        let k = out.forecast.p.len() - 1;
        let (np0, gp0, r0) = (
            out.forecast.np_over_n[k],
            out.forecast.gp_over_n[k],
            out.forecast.gor[k],
        );
        let bt = q.bo + (qb.rs - q.rs) * q.bg;
        // State at the trial oil increment x: (So, Sg, krg/kro, R, mismatch).
        let state = |x: f64| {
            let np = np0 + x;
            let so = (1.0 - swc) * (1.0 - np) * q.bo / qb.bo;
            let sg = (1.0 - swc - so).max(0.0);
            let ratio = relperm.krg_over_kro(sg);
            let r = q.rs + ratio * (q.mu_o * q.bo) / (q.mu_g * q.bg);
            let gp_mbe = (bt - qb.bo) / q.bg - np * (q.bo / q.bg - q.rs);
            let gp_gor = gp0 + 0.5 * (r0 + r) * x;
            (so, sg, ratio, r, gp_mbe - gp_gor)
        };
        // The oil is immobile once So <= Sorg: Np_max from the saturation equation.
        let np_max = 1.0 - relperm.sorg * qb.bo / ((1.0 - swc) * q.bo);
        let x_hi = np_max - np0;
        let f_lo = state(0.0).4;
        if x_hi <= 0.0 || !f_lo.is_finite() {
            out.forecast.stopped_early = true;
            break;
        }
        if f_lo < 0.0 {
            return Err(Error::NoConvergence {
                method: "Tarner forecast",
                detail: format!(
                    "at p = {p} psia the balance needs less gas than already produced with no further oil \
                     (Gp(MBE) - Gp(GOR) = {f_lo} scf/STB at dNp = 0): the PVT table does not behave as \
                     below a bubble point here"
                ),
            });
        }
        let scale = gp0 + qb.rs;
        let (x, iterations) = if f_lo == 0.0 {
            (0.0, 0)
        } else {
            illinois(|x| state(x).4, 0.0, f_lo, x_hi, scale)?
        };
        let (so, sg, ratio, r, mismatch) = state(x);
        if !ratio.is_finite() {
            out.forecast.stopped_early = true;
            break;
        }
        out.max_mismatch = out.max_mismatch.max(mismatch.abs());
        out.forecast.p.push(p);
        out.forecast.so.push(so);
        out.forecast.sg.push(sg);
        out.forecast.krg_over_kro.push(ratio);
        out.forecast.gor.push(r);
        out.forecast.np_over_n.push(np0 + x);
        out.forecast.gp_over_n.push(gp0 + 0.5 * (r0 + r) * x);
        out.iterations.push(iterations);
    }
    Ok(out)
}

/// Root of a decreasing f on [a, b) with f(a) > 0 and f -> -inf (or NaN beyond the
/// physical range) towards b: Illinois false position while both ends are finite, else
/// bisection. Returns (root, iterations).
fn illinois<F: Fn(f64) -> f64>(f: F, a: f64, fa: f64, b: f64, scale: f64) -> Result<(f64, usize)> {
    const MAX_ITER: usize = 200;
    let (mut a, mut fa) = (a, fa);
    let mut b = b;
    let mut fb = f64::NEG_INFINITY;
    let mut side = 0i8;
    for it in 1..=MAX_ITER {
        let x = if fb.is_finite() {
            let s = (a * fb - b * fa) / (fb - fa);
            if s > a && s < b { s } else { 0.5 * (a + b) }
        } else {
            0.5 * (a + b)
        };
        let fx = f(x);
        let fx = if fx.is_nan() { f64::NEG_INFINITY } else { fx };
        if fx.abs() <= TARNER_TOLERANCE * scale || (b - a) <= TARNER_TOLERANCE * b.abs().max(1e-300)
        {
            return Ok((x, it));
        }
        if fx > 0.0 {
            a = x;
            fa = fx;
            if side == 1 {
                fb *= 0.5;
            }
            side = 1;
        } else {
            b = x;
            fb = fx;
            if side == -1 {
                fa *= 0.5;
            }
            side = -1;
        }
    }
    Err(Error::NoConvergence {
        method: "Tarner forecast",
        detail: format!(
            "the oil increment did not converge in {MAX_ITER} iterations (bracket [{a}, {b}])"
        ),
    })
}
