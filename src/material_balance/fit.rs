//! Straight-line least-squares fits with a full report, and the Student-t quantile used for
//! confidence intervals.

use crate::error::{Error, Result};

/// The report of a straight-line fit y = intercept + slope x.
#[derive(Debug, Clone, PartialEq)]
pub struct LineFit {
    /// Slope, unit of y per unit of x.
    pub slope: f64,
    /// Intercept, unit of y (0 when the line was forced through the origin).
    pub intercept: f64,
    /// Standard error of the slope.
    pub slope_se: f64,
    /// Standard error of the intercept (NaN when forced through the origin).
    pub intercept_se: f64,
    /// Covariance of intercept and slope (0 when forced through the origin).
    pub covariance: f64,
    /// Coefficient of determination R^2 (for a line through the origin: 1 - SSR / sum y^2,
    /// the uncentred form).
    pub r2: f64,
    /// Residuals y - fitted, one per input point (NaN for points not used).
    pub residuals: Vec<f64>,
    /// Which input points the fit used (finite x and y, and selected by the caller).
    pub used: Vec<bool>,
    /// Number of points used.
    pub n_used: usize,
    /// True when the intercept was fixed at zero.
    pub through_origin: bool,
    /// The x values (the abscissa of the plot), one per input point.
    pub x: Vec<f64>,
    /// The y values (the ordinate of the plot), one per input point.
    pub y: Vec<f64>,
}

/// Fit y = a + b x (or y = b x with `through_origin`) by ordinary least squares.
///
/// # Formula
/// ```text
/// b = Sxy / Sxx,  a = ybar - b xbar,  s^2 = SSR / (n - 2)
/// se(b) = s / sqrt(Sxx),  se(a) = s sqrt(1/n + xbar^2 / Sxx)
/// through the origin: b = sum(xy) / sum(x^2), s^2 = SSR / (n - 1), se(b) = s / sqrt(sum x^2)
/// ```
///
/// # Arguments
/// * `x`, `y` - the points; non-finite points are skipped (and reported as unused).
/// * `select` - optional mask of points to use (same length), e.g. to drop early points.
/// * `through_origin` - force the line through (0, 0).
///
/// # Errors
/// [`Error::Shape`] for mismatched lengths; [`Error::Singular`] when fewer points than
/// parameters remain or all used x values coincide (e.g. all points at one pressure).
///
/// # Examples
/// ```
/// use stocktank::material_balance::fit_line;
/// let f = fit_line(&[1.0, 2.0, 3.0], &[3.0, 5.0, 7.0], None, false).unwrap();
/// assert!((f.slope - 2.0).abs() < 1e-12 && (f.intercept - 1.0).abs() < 1e-12);
/// assert!(fit_line(&[2.0, 2.0, 2.0], &[1.0, 2.0, 3.0], None, false).is_err());
/// ```
///
/// # References
/// Draper, N.R., Smith, H. (1998). Applied Regression Analysis, 3rd ed., Wiley, ch. 1.
pub fn fit_line(
    x: &[f64],
    y: &[f64],
    select: Option<&[bool]>,
    through_origin: bool,
) -> Result<LineFit> {
    if x.len() != y.len() {
        return Err(Error::Shape(format!(
            "x has {} points but y has {}",
            x.len(),
            y.len()
        )));
    }
    if let Some(s) = select
        && s.len() != x.len()
    {
        return Err(Error::Shape(format!(
            "the selection has {} entries but there are {} points",
            s.len(),
            x.len()
        )));
    }
    let used: Vec<bool> = (0..x.len())
        .map(|i| x[i].is_finite() && y[i].is_finite() && select.is_none_or(|s| s[i]))
        .collect();
    let n = used.iter().filter(|&&u| u).count();
    let need = if through_origin { 1 } else { 2 };
    if n <= need {
        return Err(Error::Singular {
            what: "straight-line fit",
            detail: format!(
                "{n} usable points for {need} parameters (need more points than parameters)"
            ),
        });
    }
    let pts = || (0..x.len()).filter(|&i| used[i]).map(|i| (x[i], y[i]));
    let nf = n as f64;
    let (slope, intercept, sxx_eff, xbar) = if through_origin {
        let sxx: f64 = pts().map(|(a, _)| a * a).sum();
        let sxy: f64 = pts().map(|(a, b)| a * b).sum();
        if sxx == 0.0 {
            return Err(Error::Singular {
                what: "straight-line fit",
                detail: "all used x values are zero".into(),
            });
        }
        (sxy / sxx, 0.0, sxx, 0.0)
    } else {
        let xbar = pts().map(|(a, _)| a).sum::<f64>() / nf;
        let ybar = pts().map(|(_, b)| b).sum::<f64>() / nf;
        let sxx: f64 = pts().map(|(a, _)| (a - xbar) * (a - xbar)).sum();
        let sxy: f64 = pts().map(|(a, b)| (a - xbar) * (b - ybar)).sum();
        let scale: f64 = pts()
            .map(|(a, _)| a * a)
            .sum::<f64>()
            .max(f64::MIN_POSITIVE);
        if sxx <= 1e-14 * scale {
            return Err(Error::Singular {
                what: "straight-line fit",
                detail: format!(
                    "all {n} used x values coincide (x = {xbar}); the slope is undetermined"
                ),
            });
        }
        let b = sxy / sxx;
        (b, ybar - b * xbar, sxx, xbar)
    };
    let residuals: Vec<f64> = (0..x.len())
        .map(|i| {
            if used[i] {
                y[i] - intercept - slope * x[i]
            } else {
                f64::NAN
            }
        })
        .collect();
    let ssr: f64 = residuals
        .iter()
        .filter(|r| r.is_finite())
        .map(|r| r * r)
        .sum();
    let dof = (n - need) as f64;
    let s2 = ssr / dof;
    let slope_se = (s2 / sxx_eff).sqrt();
    let intercept_se = if through_origin {
        f64::NAN
    } else {
        (s2 * (1.0 / nf + xbar * xbar / sxx_eff)).sqrt()
    };
    let sst: f64 = if through_origin {
        pts().map(|(_, b)| b * b).sum()
    } else {
        let ybar = pts().map(|(_, b)| b).sum::<f64>() / nf;
        pts().map(|(_, b)| (b - ybar) * (b - ybar)).sum()
    };
    let r2 = if sst > 0.0 { 1.0 - ssr / sst } else { 1.0 };
    let covariance = if through_origin {
        0.0
    } else {
        -xbar * s2 / sxx_eff
    };
    Ok(LineFit {
        slope,
        intercept,
        slope_se,
        intercept_se,
        covariance,
        r2,
        residuals,
        used,
        n_used: n,
        through_origin,
        x: x.to_vec(),
        y: y.to_vec(),
    })
}

/// Quantile of the standard normal distribution by Acklam's rational approximation (P.J.
/// Acklam, 2003, "An algorithm for computing the inverse normal cumulative distribution
/// function"; relative error below 1.2e-9), enough for confidence intervals.
fn normal_quantile(p: f64) -> f64 {
    let a = [
        -3.969_683_028_665_376e1,
        2.209_460_984_245_205e2,
        -2.759_285_104_469_687e2,
        1.383_577_518_672_69e2,
        -3.066_479_806_614_716e1,
        2.506_628_277_459_239,
    ];
    let b = [
        -5.447_609_879_822_406e1,
        1.615_858_368_580_409e2,
        -1.556_989_798_598_866e2,
        6.680_131_188_771_972e1,
        -1.328_068_155_288_572e1,
    ];
    let c = [
        -7.784_894_002_430_293e-3,
        -3.223_964_580_411_365e-1,
        -2.400_758_277_161_838,
        -2.549_732_539_343_734,
        4.374_664_141_464_968,
        2.938_163_982_698_783,
    ];
    let d = [
        7.784_695_709_041_462e-3,
        3.224_671_290_700_398e-1,
        2.445_134_137_142_996,
        3.754_408_661_907_416,
    ];
    let pl = 0.024_25;
    if p < pl {
        let q = (-2.0 * p.ln()).sqrt();
        (((((c[0] * q + c[1]) * q + c[2]) * q + c[3]) * q + c[4]) * q + c[5])
            / ((((d[0] * q + d[1]) * q + d[2]) * q + d[3]) * q + 1.0)
    } else if p <= 1.0 - pl {
        let q = p - 0.5;
        let r = q * q;
        (((((a[0] * r + a[1]) * r + a[2]) * r + a[3]) * r + a[4]) * r + a[5]) * q
            / (((((b[0] * r + b[1]) * r + b[2]) * r + b[3]) * r + b[4]) * r + 1.0)
    } else {
        let q = (-2.0 * (1.0 - p).ln()).sqrt();
        -(((((c[0] * q + c[1]) * q + c[2]) * q + c[3]) * q + c[4]) * q + c[5])
            / ((((d[0] * q + d[1]) * q + d[2]) * q + d[3]) * q + 1.0)
    }
}

/// Two-sided Student-t critical value t_{1-(1-level)/2, dof}, by the Cornish–Fisher
/// expansion of the t quantile about the normal one (Abramowitz & Stegun 1964, 26.7.5);
/// better than 1e-3 relative for dof >= 3.
///
/// # Examples
/// ```
/// use stocktank::material_balance::t_critical;
/// // Student-t tables (e.g. Abramowitz & Stegun 1964, Table 26.10): t_{0.975, 10} = 2.228.
/// assert!((t_critical(0.95, 10.0) - 2.228).abs() < 2e-3);
/// ```
pub fn t_critical(level: f64, dof: f64) -> f64 {
    let z = normal_quantile(0.5 + 0.5 * level);
    let z2 = z * z;
    let g1 = (z2 + 1.0) * z / 4.0;
    let g2 = ((5.0 * z2 + 16.0) * z2 + 3.0) * z / 96.0;
    let g3 = (((3.0 * z2 + 19.0) * z2 + 17.0) * z2 - 15.0) * z / 384.0;
    let g4 = ((((79.0 * z2 + 776.0) * z2 + 1482.0) * z2 - 1920.0) * z2 - 945.0) * z / 92160.0;
    z + g1 / dof + g2 / dof.powi(2) + g3 / dof.powi(3) + g4 / dof.powi(4)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn t_table_values() {
        // Student-t tables (Abramowitz & Stegun 1964, Table 26.10; from memory):
        // t_{0.975}: dof 5 -> 2.571, dof 20 -> 2.086, dof 120 -> 1.980; normal 1.960.
        assert!((t_critical(0.95, 5.0) - 2.571).abs() < 5e-3);
        assert!((t_critical(0.95, 20.0) - 2.086).abs() < 1e-3);
        assert!((t_critical(0.95, 120.0) - 1.980).abs() < 1e-3);
        assert!((normal_quantile(0.975) - 1.959_964).abs() < 1e-6);
    }
}
