//! Diagnostics read before trusting a fit: the Campbell-type plot F/Et, the drive indices
//! (Pirson 1958), and a plain-language classification of the drive mechanism with the
//! evidence behind it.

use super::fit::fit_line;
use super::oil::MbeTerms;
use crate::error::{Error, Result, non_negative, positive};

/// F / Et for each row of an oil history, STB (NaN where Et = 0, e.g. the initial row).
///
/// Plotted against Np or time (Campbell et al. 1963 style): a horizontal trend is a
/// volumetric reservoir whose level is N; a rising trend means energy the expansion terms
/// do not hold (water influx, or a gas cap larger than `m`); a falling trend points at
/// pore-volume loss not in Efw, a too-large `m`, or bad data.
///
/// # Arguments
/// * `terms` - from [`super::oil_mbe_terms`]; `m` - gas-cap ratio, >= 0.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `m`.
///
/// # Examples
/// ```
/// # use stocktank::material_balance::*;
/// # let pvt = PvtTable::new(vec![1000.0, 3000.0], vec![1.2, 1.4], vec![300.0, 700.0], vec![0.0026, 0.0009]).unwrap();
/// # let h = OilHistory::new(vec![0.0, 100.0], vec![3000.0, 2000.0], vec![0.0, 1e5], vec![0.0, 8e7], vec![0.0; 2], vec![], vec![], 3000.0).unwrap();
/// let t = oil_mbe_terms(&pvt, &h, &OilReservoir::new(3000.0, 0.2, 0.0, 0.0).unwrap()).unwrap();
/// let y = campbell_plot(&t, 0.0).unwrap();
/// assert!(y[0].is_nan() && y[1] > 0.0);
/// ```
///
/// # References
/// Campbell, R.A., Campbell, J.M. Sr. (1978). Mineral Property Economics, Vol. 3: Petroleum
/// Property Evaluation. Campbell Petroleum Series (the F/Et plot); Dake, L.P. (1994). The
/// Practice of Reservoir Engineering. Elsevier, ch. 3.
pub fn campbell_plot(terms: &MbeTerms, m: f64) -> Result<Vec<f64>> {
    non_negative("m", m)?;
    let et = terms.et(m);
    Ok(et
        .iter()
        .zip(&terms.f)
        .map(|(&e, &f)| if e > 0.0 { f / e } else { f64::NAN })
        .collect())
}

/// Drive indices per row (Pirson 1958): the fraction of the hydrocarbon withdrawal supplied
/// by each source of energy.
#[derive(Debug, Clone, PartialEq)]
pub struct DriveIndices {
    /// Depletion drive (oil and dissolved-gas expansion), N Eo / Fhc.
    pub depletion: Vec<f64>,
    /// Gas-cap (segregation) drive, N m Eg / Fhc.
    pub gas_cap: Vec<f64>,
    /// Rock and connate-water expansion, N (1 + m) Efw / Fhc.
    pub expansion: Vec<f64>,
    /// Water drive, (We - (Wp - Wi) Bw) / Fhc.
    pub water: Vec<f64>,
    /// Sum of the four; 1 where the balance closes, its departure from 1 is the misfit.
    pub sum: Vec<f64>,
}

/// Drive indices of Pirson (1958) from the terms, N, m and the water influx.
///
/// # Formula
/// ```text
/// Fhc = Np Bo + (Gp - Np Rs) Bg - Gi Bg
/// DDI = N Eo / Fhc,  SDI = N m Eg / Fhc,  EDI = N (1 + m) Efw / Fhc,
/// WDI = (We - (Wp - Wi) Bw) / Fhc;     DDI + SDI + EDI + WDI = 1 when F = N Et + We
/// ```
///
/// # Arguments
/// * `terms` - from [`super::oil_mbe_terms`].
/// * `n` - oil in place N, STB, > 0; `m` - gas-cap ratio, >= 0.
/// * `we` - cumulative water influx per row, rb (empty for none).
///
/// # Returns
/// [`DriveIndices`], fractions; NaN where Fhc = 0 (the initial row).
///
/// # Errors
/// [`Error::InvalidArgument`] naming `n` or `m`; [`Error::Shape`] when `we` has the wrong
/// length.
///
/// # Examples
/// ```
/// # use stocktank::material_balance::*;
/// # let pvt = PvtTable::new(vec![1000.0, 3000.0], vec![1.2, 1.4], vec![300.0, 700.0], vec![0.0026, 0.0009]).unwrap();
/// # let h = OilHistory::new(vec![0.0, 100.0], vec![3000.0, 2000.0], vec![0.0, 1e5], vec![0.0, 8e7], vec![0.0; 2], vec![], vec![], 3000.0).unwrap();
/// let t = oil_mbe_terms(&pvt, &h, &OilReservoir::new(3000.0, 0.2, 0.0, 0.0).unwrap()).unwrap();
/// let n = t.f[1] / t.eo[1];
/// let d = drive_indices(&t, n, 0.0, &[]).unwrap();
/// assert!((d.depletion[1] - 1.0).abs() < 1e-12);
/// ```
///
/// # References
/// Pirson, S.J. (1958). Oil Reservoir Engineering, 2nd ed. McGraw-Hill.
pub fn drive_indices(terms: &MbeTerms, n: f64, m: f64, we: &[f64]) -> Result<DriveIndices> {
    positive("n", n)?;
    non_negative("m", m)?;
    let rows = terms.f.len();
    if !we.is_empty() && we.len() != rows {
        return Err(Error::Shape(format!(
            "`we` has {} rows but the history has {rows}",
            we.len()
        )));
    }
    let mut d = DriveIndices {
        depletion: Vec::with_capacity(rows),
        gas_cap: Vec::with_capacity(rows),
        expansion: Vec::with_capacity(rows),
        water: Vec::with_capacity(rows),
        sum: Vec::with_capacity(rows),
    };
    for i in 0..rows {
        let fh = terms.f_hydrocarbon[i];
        let w = if we.is_empty() { 0.0 } else { we[i] };
        let (a, b, c, e) = if fh > 0.0 {
            (
                n * terms.eo[i] / fh,
                n * m * terms.eg[i] / fh,
                n * (1.0 + m) * terms.efw[i] / fh,
                (w - terms.f_water[i]) / fh,
            )
        } else {
            (f64::NAN, f64::NAN, f64::NAN, f64::NAN)
        };
        d.depletion.push(a);
        d.gas_cap.push(b);
        d.expansion.push(c);
        d.water.push(e);
        d.sum.push(a + b + c + e);
    }
    Ok(d)
}

/// A plain-language classification of the likely drive mechanism.
#[derive(Debug, Clone, PartialEq)]
pub struct DriveClassification {
    /// The likely mechanism, e.g. "water drive" or "combination drive: gas cap and water".
    pub mechanism: String,
    /// The evidence, one sentence per finding, with numbers.
    pub evidence: Vec<String>,
    /// Relative change of F/Et across the history (last fitted minus first, over the
    /// first); near 0 for a volumetric reservoir.
    pub campbell_trend: f64,
    /// True when the pressure fell below the bubble point (Rs fell below Rsi).
    pub saturated: bool,
    /// The N used for the indices (Campbell level or its extrapolation to Np = 0), STB.
    pub n_estimate: f64,
    /// Implied water influx F - N Et per row (clipped at 0), rb.
    pub implied_influx: Vec<f64>,
    /// Drive indices computed with `n_estimate` and the implied influx.
    pub indices: DriveIndices,
}

/// Classify the drive mechanism of an oil reservoir from its Havlena–Odeh terms.
///
/// The rules: the trend of F/Et against Np (Campbell-type plot) separates volumetric
/// behaviour (flat within `tolerance`) from extra energy (rising: water influx, or a gas cap
/// larger than `m`) and from lost energy (falling); N is the plot's level (flat) or its
/// straight-line extrapolation to Np = 0 (otherwise), the influx implied by the balance is
/// F - N Et, and the drive indices over the later half of the history rank the mechanisms.
/// A mechanism supplying 20% or more beside the leading one makes it a combination drive.
///
/// # Arguments
/// * `terms` - from [`super::oil_mbe_terms`]; `m` - the gas-cap ratio believed, >= 0;
/// * `tolerance` - relative F/Et change still called flat (e.g. 0.05).
///
/// # Errors
/// [`Error::InvalidArgument`] naming `m` or `tolerance`; [`Error::Singular`] with fewer
/// than three usable rows.
///
/// # Examples
/// ```
/// # use stocktank::material_balance::*;
/// # let pvt = PvtTable::new(vec![1000.0, 3000.0], vec![1.2, 1.4], vec![300.0, 700.0], vec![0.0026, 0.0009]).unwrap();
/// # let res = OilReservoir::new(3000.0, 0.2, 0.0, 0.0).unwrap();
/// // A volumetric solution-gas-drive history generated with N = 1e7 STB.
/// let p = vec![3000.0, 2800.0, 2600.0, 2400.0, 2200.0];
/// let h0 = OilHistory::new(vec![0.0, 1.0, 2.0, 3.0, 4.0], p.clone(), vec![0.0; 5], vec![0.0; 5], vec![0.0; 5], vec![], vec![], 3000.0).unwrap();
/// let t0 = oil_mbe_terms(&pvt, &h0, &res).unwrap();
/// let np: Vec<f64> = (0..5).map(|i| 1e7 * t0.eo[i] / (t0.eo[i] / t0.eo[i].max(1e-300) * 0.0 + pvt.at(p[i]).unwrap().bo)).collect();
/// let gp: Vec<f64> = (0..5).map(|i| np[i] * pvt.at(p[i]).unwrap().rs).collect();
/// let h = OilHistory::new(vec![0.0, 1.0, 2.0, 3.0, 4.0], p, np, gp, vec![0.0; 5], vec![], vec![], 3000.0).unwrap();
/// let c = classify_drive(&oil_mbe_terms(&pvt, &h, &res).unwrap(), 0.0, 0.05).unwrap();
/// assert_eq!(c.mechanism, "solution-gas drive");
/// ```
///
/// # References
/// Pirson, S.J. (1958). Oil Reservoir Engineering. McGraw-Hill; Dake, L.P. (1994). The
/// Practice of Reservoir Engineering. Elsevier, ch. 3.
pub fn classify_drive(terms: &MbeTerms, m: f64, tolerance: f64) -> Result<DriveClassification> {
    non_negative("m", m)?;
    positive("tolerance", tolerance)?;
    let y = campbell_plot(terms, m)?;
    let line = fit_line(&terms.np, &y, None, false)?;
    let used: Vec<usize> = (0..y.len()).filter(|&i| line.used[i]).collect();
    let (first, last) = (used[0], used[used.len() - 1]);
    let y_first = line.intercept + line.slope * terms.np[first];
    let y_last = line.intercept + line.slope * terms.np[last];
    let trend = (y_last - y_first) / y_first.abs();
    let saturated = terms.rs.iter().any(|&r| r < terms.rsi * (1.0 - 1e-9));
    let mut evidence = Vec::new();
    let n_est = if trend.abs() <= tolerance {
        let mean = used.iter().map(|&i| y[i]).sum::<f64>() / used.len() as f64;
        evidence.push(format!(
            "F/Et is flat against Np (change {:+.1}% across the history, within {:.0}%): the expansion terms account for the withdrawal; N is about {:.4e} STB",
            100.0 * trend,
            100.0 * tolerance,
            mean
        ));
        mean
    } else if trend > 0.0 {
        evidence.push(format!(
            "F/Et rises by {:+.1}% across the history: more energy than the expansion terms hold (water influx, or a gas cap larger than m = {m}); N extrapolated to Np = 0 is about {:.4e} STB",
            100.0 * trend,
            line.intercept
        ));
        line.intercept
    } else {
        let min = used.iter().map(|&i| y[i]).fold(f64::INFINITY, f64::min);
        evidence.push(format!(
            "F/Et falls by {:.1}% across the history: either an influx whose share We/Et shrinks as the expansion grows (e.g. once gas comes out of solution), or less energy than assumed (m = {m} too large, compressibility or PVT in error, unreliable early pressures); N is at most the lowest F/Et, {:.4e} STB",
            100.0 * trend,
            min
        ));
        min
    };
    let n_est = if n_est > 0.0 { n_est } else { y[last] };
    if saturated {
        let i = (0..terms.rs.len())
            .find(|&i| terms.rs[i] < terms.rsi * (1.0 - 1e-9))
            .unwrap_or(0);
        evidence.push(format!(
            "pressure fell below the bubble point (Rs dropped below Rsi = {:.1} scf/STB from row {i}, p = {} psia): gas comes out of solution",
            terms.rsi, terms.p[i]
        ));
    } else {
        evidence.push("pressure stayed above the bubble point: no free gas from solution".into());
    }
    if m > 0.0 {
        evidence.push(format!("a gas cap of m = {m} was assumed"));
    }
    let et = terms.et(m);
    let implied: Vec<f64> = (0..et.len())
        .map(|i| (terms.f[i] - n_est * et[i]).max(0.0))
        .collect();
    let idx = drive_indices(terms, n_est, m, &implied)?;
    let half: Vec<usize> = used[used.len() / 2..].to_vec();
    let mean = |v: &[f64]| {
        let s: Vec<f64> = half
            .iter()
            .map(|&i| v[i])
            .filter(|x| x.is_finite())
            .collect();
        if s.is_empty() {
            0.0
        } else {
            s.iter().sum::<f64>() / s.len() as f64
        }
    };
    let depletion_name = if saturated {
        "solution-gas drive"
    } else {
        "depletion drive (oil and rock expansion)"
    };
    let mut ranked = [
        (mean(&idx.depletion), depletion_name, "depletion"),
        (mean(&idx.gas_cap), "gas-cap drive", "gas cap"),
        (
            mean(&idx.expansion),
            "compaction and connate-water expansion",
            "rock and water expansion",
        ),
        (mean(&idx.water), "water drive", "water"),
    ];
    ranked.sort_by(|a, b| b.0.total_cmp(&a.0));
    evidence.push(format!(
        "mean drive indices over the later half: {} {:.2}, {} {:.2}, {} {:.2}, {} {:.2}",
        ranked[0].2,
        ranked[0].0,
        ranked[1].2,
        ranked[1].0,
        ranked[2].2,
        ranked[2].0,
        ranked[3].2,
        ranked[3].0
    ));
    let mechanism = if ranked[1].0 >= 0.2 {
        format!("combination drive: {} and {}", ranked[0].2, ranked[1].2)
    } else {
        ranked[0].1.to_string()
    };
    Ok(DriveClassification {
        mechanism,
        evidence,
        campbell_trend: trend,
        saturated,
        n_estimate: n_est,
        implied_influx: implied,
        indices: idx,
    })
}
