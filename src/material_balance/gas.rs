//! Gas material balance: p/z against Gp for a volumetric reservoir with OGIP regression
//! and recovery at abandonment, the abnormal-pressure correction of Ramagost & Farshad
//! (1981), the water-drive straight line, and the Cole plot.
//!
//! # Formula
//! ```text
//! volumetric:        p/z = pi/zi (1 - Gp / G)
//! abnormal pressure: p/z [1 - ce (pi - p)] = pi/zi (1 - Gp / G),  ce = (cw Swi + cf) / (1 - Swi)
//! water drive:       F = Gp Bg + Wp Bw = G Eg + We,   Eg = Bg - Bgi
//!                    F / Eg = G + C We_unit / Eg
//! Cole plot:         F / Eg against Gp: flat for a volumetric reservoir (level G),
//!                    rising with aquifer support, falling early with abnormal pressure
//! ```

use super::aquifer::AquiferModel;
use super::fit::{LineFit, fit_line};
use crate::error::{Error, Result, fraction, non_negative, positive};
use crate::units::{FT3_PER_BBL, StandardConditions, f_to_r};

/// Gas formation volume factor Bg = psc z T / (Tsc p), rb/scf.
///
/// # Arguments
/// * `p` psia, > 0; `z` dimensionless, > 0; `temperature_f` reservoir temperature, degF;
/// * `sc` standard conditions.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `p`, `z` or `temperature_f`.
///
/// # Examples
/// ```
/// use stocktank::material_balance::gas_bg;
/// use stocktank::units::StandardConditions;
/// // 0.02827 z T / p rcf/scf at 14.7 psia and 60 degF (common practice, no source).
/// let bg = gas_bg(2000.0, 0.9, 200.0, StandardConditions::FIELD).unwrap();
/// assert!((bg * 5.614583 - 0.02827 * 0.9 * 659.67 / 2000.0).abs() < 1e-5);
/// ```
pub fn gas_bg(p: f64, z: f64, temperature_f: f64, sc: StandardConditions) -> Result<f64> {
    positive("p", p)?;
    positive("z", z)?;
    crate::error::temperature_f("temperature_f", temperature_f)?;
    Ok(sc.p_psia * z * f_to_r(temperature_f) / (sc.t_r() * p) / FT3_PER_BBL)
}

/// The result of a gas material-balance fit.
#[derive(Debug, Clone, PartialEq)]
pub struct GasFit {
    /// Original gas in place G, scf.
    pub g: f64,
    /// Standard error of G, scf.
    pub g_se: f64,
    /// Fitted initial p/z (corrected p/z for the abnormal-pressure fit), psia; NaN for the
    /// water-drive line.
    pub pz_initial: f64,
    /// Cumulative gas at the abandonment p/z read from the fitted line, scf (NaN when no
    /// abandonment point was given).
    pub gp_abandon: f64,
    /// Recovery factor at abandonment, fraction of G (NaN when none given).
    pub rf_abandon: f64,
    /// Aquifer constant of the water-drive line (NaN otherwise).
    pub aquifer_constant: f64,
    /// Its standard error.
    pub aquifer_constant_se: f64,
    /// The fitted line and its report.
    pub line: LineFit,
}

fn check_same(names: [&str; 2], a: &[f64], b: &[f64]) -> Result<()> {
    if a.len() != b.len() {
        return Err(Error::Shape(format!(
            "`{}` has {} rows but `{}` has {}",
            names[1],
            b.len(),
            names[0],
            a.len()
        )));
    }
    Ok(())
}

fn check_z(z: &[f64]) -> Result<()> {
    for (i, &v) in z.iter().enumerate() {
        if !(v.is_finite() && v > 0.0) {
            return Err(Error::InvalidRecord {
                arg: "z".into(),
                row: i,
                message: format!("z-factor {v} must be finite and > 0"),
            });
        }
    }
    Ok(())
}

fn check_positive_rows(name: &str, v: &[f64]) -> Result<()> {
    for (i, &x) in v.iter().enumerate() {
        if !(x.is_finite() && x > 0.0) {
            return Err(Error::InvalidRecord {
                arg: name.into(),
                row: i,
                message: format!("value {x} must be finite and > 0"),
            });
        }
    }
    Ok(())
}

fn pz_line(
    gp: &[f64],
    y: Vec<f64>,
    select: Option<&[bool]>,
    pz_abandon: Option<f64>,
) -> Result<GasFit> {
    let line = fit_line(gp, &y, select, false)?;
    let (a, b) = (line.intercept, line.slope);
    if b >= 0.0 {
        return Err(Error::Singular {
            what: "p/z straight line",
            detail: format!("the fitted slope {b} psia/scf does not decline; G is undetermined"),
        });
    }
    let g = -a / b;
    let var = (line.intercept_se / b).powi(2) + (a * line.slope_se / (b * b)).powi(2)
        - 2.0 * a / (b * b * b) * line.covariance;
    let (gp_a, rf_a) = match pz_abandon {
        Some(pa) => {
            non_negative("pz_abandon", pa)?;
            ((pa - a) / b, 1.0 - pa / a)
        }
        None => (f64::NAN, f64::NAN),
    };
    Ok(GasFit {
        g,
        g_se: var.max(0.0).sqrt(),
        pz_initial: a,
        gp_abandon: gp_a,
        rf_abandon: rf_a,
        aquifer_constant: f64::NAN,
        aquifer_constant_se: f64::NAN,
        line,
    })
}

/// OGIP by the p/z straight line of a volumetric gas reservoir, with recovery at an
/// abandonment p/z read from the fitted line.
///
/// # Formula
/// ```text
/// p/z = a + b Gp   (least squares),   G = -a / b,
/// Gp_abandon = (pz_abandon - a) / b,  RF = 1 - pz_abandon / a
/// se(G) by the delta method from the covariance of (a, b)
/// ```
///
/// # Arguments
/// * `gp` - cumulative gas, scf, never falling; `p` - average pressure, psia, > 0;
///   `z` - gas deviation factor, > 0; same length.
/// * `select` - optional mask of rows to use.
/// * `pz_abandon` - p/z at abandonment, psia (the trade takes pa / z(pa)).
///
/// # Returns
/// [`GasFit`].
///
/// # Errors
/// [`Error::InvalidRecord`] naming the column and row of a bad value or a falling `gp`;
/// [`Error::Singular`] when the points do not determine a declining line (e.g. all at one
/// pressure).
///
/// # Examples
/// ```
/// use stocktank::material_balance::pz_fit;
/// // An exactly straight line: pi/zi = 5000 psia, G = 1e10 scf.
/// let gp = [0.0, 1e9, 2e9, 4e9];
/// let pz: Vec<f64> = gp.iter().map(|g| 5000.0 * (1.0 - g / 1e10)).collect();
/// let f = pz_fit(&gp, &pz, &[1.0; 4], None, Some(500.0)).unwrap();
/// assert!((f.g - 1e10).abs() < 1.0);
/// assert!((f.rf_abandon - 0.9).abs() < 1e-12);
/// ```
///
/// # References
/// Craft, B.C., Hawkins, M.F. (1959). Applied Petroleum Reservoir Engineering.
/// Prentice-Hall, ch. 1; Dake, L.P. (1978). Fundamentals of Reservoir Engineering, ch. 1.
pub fn pz_fit(
    gp: &[f64],
    p: &[f64],
    z: &[f64],
    select: Option<&[bool]>,
    pz_abandon: Option<f64>,
) -> Result<GasFit> {
    check_same(["gp", "p"], gp, p)?;
    check_same(["gp", "z"], gp, z)?;
    super::history::check_cumulative("gp", gp)?;
    check_positive_rows("p", p)?;
    check_z(z)?;
    let y: Vec<f64> = p.iter().zip(z).map(|(a, b)| a / b).collect();
    pz_line(gp, y, select, pz_abandon)
}

/// OGIP of an abnormally pressured (over-pressured) gas reservoir by the method of
/// Ramagost & Farshad (1981): p/z corrected for rock and connate-water expansion.
///
/// # Formula
/// ```text
/// (p/z) [1 - ce (pi - p)] = pi/zi (1 - Gp / G),   ce = (cw Swi + cf) / (1 - Swi)
/// ```
///
/// # Arguments
/// As [`pz_fit`], plus `p_initial` psia, `swi` fraction, `cw` and `cf` 1/psi, and the
/// abandonment as `(p_abandon psia, z_abandon)`.
///
/// # Errors
/// As [`pz_fit`]; [`Error::InvalidArgument`] naming `swi`, `cw`, `cf` or `p_initial`;
/// [`Error::InvalidRecord`] naming `p` for a pressure above `p_initial`.
///
/// # Examples
/// ```
/// use stocktank::material_balance::pz_fit_abnormal;
/// let (pi, ce): (f64, f64) = (9000.0, 2e-5);
/// let gp = [0.0, 1e10, 2e10, 3e10];
/// // Build p/z from the corrected line with G = 1e11 and solve for p with z = 1.
/// let p: Vec<f64> = gp.iter().map(|g| {
///     let rhs = pi * (1.0 - g / 1e11);
///     // p (1 - ce (pi - p)) = rhs  ->  ce p^2 + (1 - ce pi) p - rhs = 0
///     let (a, b): (f64, f64) = (ce, 1.0 - ce * pi);
///     (-b + (b * b + 4.0 * a * rhs).sqrt()) / (2.0 * a)
/// }).collect();
/// let f = pz_fit_abnormal(&gp, &p, &[1.0; 4], pi, 0.0, 0.0, 2e-5, None, None).unwrap();
/// assert!((f.g / 1e11 - 1.0).abs() < 1e-9);
/// ```
///
/// # References
/// Ramagost, B.P., Farshad, F.F. (1981). P/Z abnormally pressured gas reservoirs. SPE 10125.
#[allow(clippy::too_many_arguments)]
pub fn pz_fit_abnormal(
    gp: &[f64],
    p: &[f64],
    z: &[f64],
    p_initial: f64,
    swi: f64,
    cw: f64,
    cf: f64,
    select: Option<&[bool]>,
    abandon: Option<(f64, f64)>,
) -> Result<GasFit> {
    check_same(["gp", "p"], gp, p)?;
    check_same(["gp", "z"], gp, z)?;
    fraction("swi", swi)?;
    if swi >= 1.0 {
        return Err(Error::invalid("swi", swi, "must be < 1"));
    }
    non_negative("cw", cw)?;
    non_negative("cf", cf)?;
    super::history::check_cumulative("gp", gp)?;
    super::history::check_pressures(p, p_initial)?;
    check_z(z)?;
    let ce = (cw * swi + cf) / (1.0 - swi);
    let y: Vec<f64> = (0..p.len())
        .map(|i| p[i] / z[i] * (1.0 - ce * (p_initial - p[i])))
        .collect();
    let pz_a = match abandon {
        Some((pa, za)) => {
            positive("p_abandon", pa)?;
            positive("z_abandon", za)?;
            Some(pa / za * (1.0 - ce * (p_initial - pa)))
        }
        None => None,
    };
    pz_line(gp, y, select, pz_a)
}

/// Underground withdrawal F = Gp Bg + Wp Bw (rb) and gas expansion Eg = Bg - Bgi (rb/scf).
#[allow(clippy::too_many_arguments)]
fn gas_terms(
    gp: &[f64],
    p: &[f64],
    z: &[f64],
    wp: &[f64],
    bw: f64,
    p_initial: f64,
    z_initial: f64,
    temperature_f: f64,
    sc: StandardConditions,
) -> Result<(Vec<f64>, Vec<f64>)> {
    check_same(["gp", "p"], gp, p)?;
    check_same(["gp", "z"], gp, z)?;
    if !wp.is_empty() {
        check_same(["gp", "wp"], gp, wp)?;
        super::history::check_cumulative("wp", wp)?;
    }
    positive("bw", bw)?;
    positive("z_initial", z_initial)?;
    super::history::check_cumulative("gp", gp)?;
    super::history::check_pressures(p, p_initial)?;
    check_z(z)?;
    let bgi = gas_bg(p_initial, z_initial, temperature_f, sc)?;
    let mut f = Vec::with_capacity(p.len());
    let mut eg = Vec::with_capacity(p.len());
    for i in 0..p.len() {
        let bg = gas_bg(p[i], z[i], temperature_f, sc)?;
        let w = if wp.is_empty() { 0.0 } else { wp[i] };
        f.push(gp[i] * bg + w * bw);
        eg.push(bg - bgi);
    }
    Ok((f, eg))
}

/// The Cole plot: F / Eg (scf) for each row of a gas history.
///
/// Flat at the level G for a volumetric reservoir; rising with aquifer support; falling
/// (from above G) in an abnormally pressured reservoir whose rock and water expansion the
/// p/z line ignores. NaN where Eg = 0 (the initial row).
///
/// # Arguments
/// `gp` scf, `p` psia, `z`, `wp` STB (empty for none), `bw` rb/STB, `p_initial` psia,
/// `z_initial`, `temperature_f` degF, `sc` standard conditions.
///
/// # Errors
/// [`Error::InvalidRecord`] naming the column and row of a bad value; argument errors
/// naming `bw`, `z_initial`, `temperature_f`.
///
/// # Examples
/// ```
/// use stocktank::material_balance::cole_plot;
/// use stocktank::units::StandardConditions;
/// // Volumetric, z = 1: p = pi (1 - Gp/G) gives F/Eg = G at every row.
/// let gp = [0.0, 1e9, 2e9];
/// let p: Vec<f64> = gp.iter().map(|g| 4000.0 * (1.0 - g / 1e10)).collect();
/// let c = cole_plot(&gp, &p, &[1.0; 3], &[], 1.0, 4000.0, 1.0, 180.0, StandardConditions::FIELD).unwrap();
/// assert!(c[0].is_nan() && (c[2] / 1e10 - 1.0).abs() < 1e-12);
/// ```
///
/// # References
/// Cole, F.W. (1969). Reservoir Engineering Manual. Gulf Publishing; Pletcher, J.L. (2002).
/// Improvements to reservoir material-balance methods. SPE Reservoir Evaluation &
/// Engineering 5(1), 49–59.
#[allow(clippy::too_many_arguments)]
pub fn cole_plot(
    gp: &[f64],
    p: &[f64],
    z: &[f64],
    wp: &[f64],
    bw: f64,
    p_initial: f64,
    z_initial: f64,
    temperature_f: f64,
    sc: StandardConditions,
) -> Result<Vec<f64>> {
    let (f, eg) = gas_terms(gp, p, z, wp, bw, p_initial, z_initial, temperature_f, sc)?;
    Ok(f.iter()
        .zip(&eg)
        .map(|(&a, &b)| if b > 0.0 { a / b } else { f64::NAN })
        .collect())
}

/// OGIP and aquifer constant of a water-drive gas reservoir by the straight line
/// F / Eg = G + C We_unit / Eg (Havlena & Odeh 1963 applied to gas).
///
/// # Arguments
/// `t_days` days since the start at `p_initial`; `gp` scf; `p` psia; `z`; `wp` STB (empty
/// for none); `bw` rb/STB; `p_initial` psia; `z_initial`; `temperature_f` degF; `sc`;
/// `aquifer` the model shape; `select` optional row mask.
///
/// # Errors
/// As [`cole_plot`] and [`super::Aquifer::influx`]; [`Error::Singular`] when the points do
/// not determine the line.
///
/// # Examples
/// ```
/// use stocktank::material_balance::{gas_water_drive_fit, gas_bg, AquiferModel};
/// use stocktank::units::StandardConditions;
/// let sc = StandardConditions::FIELD;
/// let (pi, g, c) = (4000.0, 5e10, 300.0);
/// let t = [0.0, 100.0, 200.0, 300.0, 400.0];
/// let p = [4000.0, 3800.0, 3650.0, 3500.0, 3380.0];
/// let bgi = gas_bg(pi, 1.0, 200.0, sc).unwrap();
/// let gp: Vec<f64> = (0..5).map(|i| {
///     let bg = gas_bg(p[i], 1.0, 200.0, sc).unwrap();
///     (g * (bg - bgi) + c * (pi - p[i])) / bg
/// }).collect();
/// let f = gas_water_drive_fit(&t, &gp, &p, &[1.0; 5], &[], 1.0, pi, 1.0, 200.0, sc,
///     AquiferModel::Pot, None).unwrap();
/// assert!((f.g / g - 1.0).abs() < 1e-9 && (f.aquifer_constant / c - 1.0).abs() < 1e-9);
/// ```
///
/// # References
/// Havlena, D., Odeh, A.S. (1963). JPT 15(8), 896–900.
#[allow(clippy::too_many_arguments)]
pub fn gas_water_drive_fit(
    t_days: &[f64],
    gp: &[f64],
    p: &[f64],
    z: &[f64],
    wp: &[f64],
    bw: f64,
    p_initial: f64,
    z_initial: f64,
    temperature_f: f64,
    sc: StandardConditions,
    aquifer: AquiferModel,
    select: Option<&[bool]>,
) -> Result<GasFit> {
    check_same(["gp", "t_days"], gp, t_days)?;
    let (f, eg) = gas_terms(gp, p, z, wp, bw, p_initial, z_initial, temperature_f, sc)?;
    let wu = aquifer.unit_influx(t_days, p, p_initial)?;
    let n = f.len();
    let x: Vec<f64> = (0..n)
        .map(|i| if eg[i] > 0.0 { wu[i] / eg[i] } else { f64::NAN })
        .collect();
    let y: Vec<f64> = (0..n)
        .map(|i| if eg[i] > 0.0 { f[i] / eg[i] } else { f64::NAN })
        .collect();
    let line = fit_line(&x, &y, select, false)?;
    Ok(GasFit {
        g: line.intercept,
        g_se: line.intercept_se,
        pz_initial: f64::NAN,
        gp_abandon: f64::NAN,
        rf_abandon: f64::NAN,
        aquifer_constant: line.slope,
        aquifer_constant_se: line.slope_se,
        line,
    })
}
