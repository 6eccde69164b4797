//! The general material-balance equation of an oil reservoir (Schilthuis 1936) in the
//! Havlena–Odeh (1963) form, and its straight-line solutions.
//!
//! # Formula
//! ```text
//! F   = Np Bo + (Gp - Np Rs) Bg + (Wp - Wi) Bw - Gi Bg          underground withdrawal, rb
//!       (= Np [Bo + (Rp - Rs) Bg] + ...; injected gas and water taken at reservoir Bg, Bw)
//! Eo  = (Bo - Boi) + (Rsi - Rs) Bg                               oil + dissolved gas, rb/STB
//! Eg  = Boi (Bg / Bgi - 1)                                       gas cap, rb/STB
//! Efw = Boi (cw Swi + cf) (pi - p) / (1 - Swi)                   connate water + rock, rb/STB
//! F   = N [Eo + m Eg + (1 + m) Efw] + We = N Et + We
//! ```
//! N is the oil initially in place (STB), m the ratio of the initial gas-cap to oil
//! reservoir volumes, We the cumulative water influx (rb). Bg is in rb/scf.
//!
//! # References
//! - Schilthuis, R.J. (1936). Active oil and reservoir energy. Trans. AIME 118, 33–52.
//! - Havlena, D., Odeh, A.S. (1963). The material balance as an equation of a straight
//!   line. Journal of Petroleum Technology 15(8), 896–900.
//! - Dake, L.P. (1978). Fundamentals of Reservoir Engineering. Elsevier, ch. 3.

use super::aquifer::AquiferModel;
use super::fit::{LineFit, fit_line};
use super::history::OilHistory;
use super::pvt::PvtTable;
use crate::error::{Error, Result, fraction, non_negative, positive};

/// Initial state and compressibilities of an oil reservoir.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct OilReservoir {
    /// Initial reservoir pressure, psia.
    pub p_initial: f64,
    /// Connate (initial) water saturation, fraction [0, 1).
    pub swi: f64,
    /// Water compressibility, 1/psi.
    pub cw: f64,
    /// Pore (formation) compressibility, 1/psi.
    pub cf: f64,
}

impl OilReservoir {
    /// Build and validate.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `p_initial`, `swi`, `cw` or `cf`.
    ///
    /// # Examples
    /// ```
    /// use stocktank::material_balance::OilReservoir;
    /// assert!(OilReservoir::new(3000.0, 0.2, 3e-6, 4e-6).is_ok());
    /// assert!(OilReservoir::new(3000.0, 1.0, 3e-6, 4e-6).is_err());
    /// ```
    pub fn new(p_initial: f64, swi: f64, cw: f64, cf: f64) -> Result<Self> {
        positive("p_initial", p_initial)?;
        fraction("swi", swi)?;
        if swi >= 1.0 {
            return Err(Error::invalid("swi", swi, "must be < 1"));
        }
        non_negative("cw", cw)?;
        non_negative("cf", cf)?;
        Ok(Self {
            p_initial,
            swi,
            cw,
            cf,
        })
    }
}

/// The Havlena–Odeh terms of an oil history, one value per row.
#[derive(Debug, Clone, PartialEq)]
pub struct MbeTerms {
    /// Time, days (copied from the history).
    pub t_days: Vec<f64>,
    /// Pressure, psia.
    pub p: Vec<f64>,
    /// Cumulative oil, STB.
    pub np: Vec<f64>,
    /// Underground withdrawal F, rb (including net water production).
    pub f: Vec<f64>,
    /// Hydrocarbon withdrawal Np Bo + (Gp - Np Rs) Bg - Gi Bg, rb (F without the water terms).
    pub f_hydrocarbon: Vec<f64>,
    /// Net water withdrawal (Wp - Wi) Bw, rb.
    pub f_water: Vec<f64>,
    /// Oil and dissolved-gas expansion Eo, rb/STB.
    pub eo: Vec<f64>,
    /// Gas-cap expansion Eg, rb/STB.
    pub eg: Vec<f64>,
    /// Connate-water and rock expansion Efw per unit (1 + m), rb/STB.
    pub efw: Vec<f64>,
    /// Initial pressure, psia.
    pub p_initial: f64,
    /// Initial Bo, rb/STB.
    pub boi: f64,
    /// Initial Bg, rb/scf.
    pub bgi: f64,
    /// Initial Rs, scf/STB.
    pub rsi: f64,
    /// Rs at each row, scf/STB (tells whether gas has come out of solution).
    pub rs: Vec<f64>,
}

impl MbeTerms {
    /// Total expansion Et = Eo + m Eg + (1 + m) Efw, rb/STB, for a gas-cap ratio `m`.
    ///
    /// # Examples
    /// ```
    /// # use stocktank::material_balance::*;
    /// # let pvt = PvtTable::new(vec![1000.0, 3000.0], vec![1.2, 1.4], vec![300.0, 700.0], vec![0.0026, 0.0009]).unwrap();
    /// # let h = OilHistory::new(vec![0.0, 100.0], vec![3000.0, 2000.0], vec![0.0, 1e5], vec![0.0, 8e7], vec![0.0; 2], vec![], vec![], 3000.0).unwrap();
    /// let t = oil_mbe_terms(&pvt, &h, &OilReservoir::new(3000.0, 0.2, 0.0, 0.0).unwrap()).unwrap();
    /// assert_eq!(t.et(0.0), t.eo);
    /// ```
    pub fn et(&self, m: f64) -> Vec<f64> {
        (0..self.eo.len())
            .map(|i| self.eo[i] + m * self.eg[i] + (1.0 + m) * self.efw[i])
            .collect()
    }
}

/// Compute the Havlena–Odeh terms F, Eo, Eg and Efw of an oil history.
///
/// # Arguments
/// * `pvt` - the PVT table; it must cover the initial pressure and every pressure of the
///   history (Bw is taken as 1.0 rb/STB when the table has no Bw column).
/// * `history` - the production history.
/// * `reservoir` - initial pressure, Swi, cw, cf.
///
/// # Returns
/// [`MbeTerms`] (see the module docs for the formulas).
///
/// # Errors
/// [`Error::InvalidRecord`] naming `p` and the row whose pressure the PVT table does not
/// cover (or that lies above the initial pressure); [`Error::OutOfRange`] when the table
/// does not cover the initial pressure.
///
/// # Examples
/// ```
/// use stocktank::material_balance::*;
/// let pvt = PvtTable::new(vec![1000.0, 3000.0], vec![1.2, 1.4], vec![300.0, 700.0], vec![0.0026, 0.0009]).unwrap();
/// let h = OilHistory::new(vec![0.0, 100.0], vec![3000.0, 3000.0], vec![0.0, 1e5], vec![0.0, 7e7], vec![0.0; 2], vec![], vec![], 3000.0).unwrap();
/// let t = oil_mbe_terms(&pvt, &h, &OilReservoir::new(3000.0, 0.2, 0.0, 0.0).unwrap()).unwrap();
/// assert!((t.f[1] - 1.4e5).abs() < 1e-6); // Np Bo when Rp = Rs
/// ```
///
/// # References
/// Havlena, D., Odeh, A.S. (1963). JPT 15(8), 896–900.
pub fn oil_mbe_terms(
    pvt: &PvtTable,
    history: &OilHistory,
    reservoir: &OilReservoir,
) -> Result<MbeTerms> {
    super::history::check_pressures(&history.p, reservoir.p_initial)?;
    let init = pvt.at(reservoir.p_initial).map_err(|e| match e {
        Error::OutOfRange(m) => Error::OutOfRange(format!("initial pressure: {m}")),
        o => o,
    })?;
    let pts = pvt.at_history(&history.p)?;
    let n = history.len();
    let ce = (reservoir.cw * reservoir.swi + reservoir.cf) / (1.0 - reservoir.swi);
    let mut t = MbeTerms {
        t_days: history.t_days.clone(),
        p: history.p.clone(),
        np: history.np.clone(),
        f: Vec::with_capacity(n),
        f_hydrocarbon: Vec::with_capacity(n),
        f_water: Vec::with_capacity(n),
        eo: Vec::with_capacity(n),
        eg: Vec::with_capacity(n),
        efw: Vec::with_capacity(n),
        p_initial: reservoir.p_initial,
        boi: init.bo,
        bgi: init.bg,
        rsi: init.rs,
        rs: Vec::with_capacity(n),
    };
    for (i, q) in pts.iter().enumerate() {
        let fh = history.np[i] * q.bo + (history.gp[i] - history.np[i] * q.rs) * q.bg
            - history.gi[i] * q.bg;
        let fw = (history.wp[i] - history.wi[i]) * q.bw;
        t.f_hydrocarbon.push(fh);
        t.f_water.push(fw);
        t.f.push(fh + fw);
        t.eo.push((q.bo - init.bo) + (init.rs - q.rs) * q.bg);
        t.eg.push(init.bo * (q.bg / init.bg - 1.0));
        t.efw.push(init.bo * ce * (reservoir.p_initial - q.p));
        t.rs.push(q.rs);
    }
    Ok(t)
}

/// Which Havlena–Odeh straight line to draw.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum HavlenaOdehCase {
    /// No gas cap, no water influx (undersaturated depletion or solution-gas drive):
    /// F = N (Eo + Efw), a line through the origin of slope N.
    Volumetric,
    /// Gas cap of known size m, no influx: F = N (Eo + m Eg + (1 + m) Efw), through the
    /// origin, slope N.
    GasCapKnownM {
        /// Gas-cap ratio m (dimensionless, >= 0).
        m: f64,
    },
    /// Gas cap of unknown size, no influx: F / (Eo + Efw) = N + m N (Eg + Efw) / (Eo + Efw);
    /// intercept N, slope m N.
    GasCapUnknownM,
    /// Water influx of a known model shape with unknown constant, gas cap m known (0 for
    /// none): F / Et = N + C We_unit / Et; intercept N, slope the aquifer constant C.
    WaterDrive {
        /// Gas-cap ratio m (dimensionless, >= 0).
        m: f64,
        /// The aquifer shape whose unit influx forms the abscissa.
        aquifer: AquiferModel,
    },
}

/// The result of a Havlena–Odeh straight-line fit.
#[derive(Debug, Clone, PartialEq)]
pub struct HavlenaOdehFit {
    /// The case fitted.
    pub case: HavlenaOdehCase,
    /// Oil initially in place N, STB.
    pub n: f64,
    /// Standard error of N, STB.
    pub n_se: f64,
    /// Gas-cap ratio m (given or fitted).
    pub m: f64,
    /// Standard error of m (NaN when m was given).
    pub m_se: f64,
    /// Aquifer constant C (NaN without an aquifer); unit as in [`AquiferModel`].
    pub aquifer_constant: f64,
    /// Standard error of C.
    pub aquifer_constant_se: f64,
    /// The line itself: x and y of the plot, slope, intercept, errors, R^2, residuals and
    /// used points.
    pub line: LineFit,
}

/// Fit a Havlena–Odeh straight line to an oil history.
///
/// # Arguments
/// * `terms` - from [`oil_mbe_terms`].
/// * `case` - which line (see [`HavlenaOdehCase`]).
/// * `select` - optional mask of rows to use; rows where the plotted quantities are not
///   finite (e.g. the initial row, where Et = 0) are skipped anyway.
///
/// # Errors
/// [`Error::Singular`] when the points do not determine the line (too few points, or all
/// at one abscissa, e.g. all at one pressure); [`Error::InvalidArgument`] naming `m`;
/// errors of the aquifer model.
///
/// # Examples
/// ```
/// use stocktank::material_balance::*;
/// let pvt = PvtTable::new(vec![1000.0, 3000.0], vec![1.2, 1.4], vec![300.0, 700.0], vec![0.0026, 0.0009]).unwrap();
/// let res = OilReservoir::new(3000.0, 0.2, 0.0, 0.0).unwrap();
/// let h = OilHistory::new(vec![0.0, 1.0, 2.0], vec![3000.0, 3000.0, 3000.0], vec![0.0, 1.0, 2.0],
///     vec![0.0; 3], vec![0.0; 3], vec![], vec![], 3000.0).unwrap();
/// let t = oil_mbe_terms(&pvt, &h, &res).unwrap();
/// // All points at one pressure: the fit is singular, never a number.
/// assert!(matches!(havlena_odeh_fit(&t, HavlenaOdehCase::Volumetric, None),
///     Err(stocktank::Error::Singular { .. })));
/// ```
///
/// # References
/// Havlena, D., Odeh, A.S. (1963). JPT 15(8), 896–900; Havlena, D., Odeh, A.S. (1964).
/// The material balance as an equation of a straight line—Part II, field cases. JPT 16(7),
/// 815–822.
pub fn havlena_odeh_fit(
    terms: &MbeTerms,
    case: HavlenaOdehCase,
    select: Option<&[bool]>,
) -> Result<HavlenaOdehFit> {
    let n = terms.f.len();
    let nan = f64::NAN;
    match case {
        HavlenaOdehCase::Volumetric | HavlenaOdehCase::GasCapKnownM { .. } => {
            let m = match case {
                HavlenaOdehCase::GasCapKnownM { m } => non_negative("m", m)?,
                _ => 0.0,
            };
            let x = terms.et(m);
            // All-zero expansion (all points at the initial pressure) is singular.
            let line = fit_line(&x, &terms.f, select, true)?;
            Ok(HavlenaOdehFit {
                case,
                n: line.slope,
                n_se: line.slope_se,
                m,
                m_se: nan,
                aquifer_constant: nan,
                aquifer_constant_se: nan,
                line,
            })
        }
        HavlenaOdehCase::GasCapUnknownM => {
            let mut x = vec![nan; n];
            let mut y = vec![nan; n];
            for i in 0..n {
                let d = terms.eo[i] + terms.efw[i];
                if d > 0.0 {
                    x[i] = (terms.eg[i] + terms.efw[i]) / d;
                    y[i] = terms.f[i] / d;
                }
            }
            let line = fit_line(&x, &y, select, false)?;
            let nn = line.intercept;
            if nn <= 0.0 {
                return Err(Error::Singular {
                    what: "Havlena-Odeh gas-cap fit",
                    detail: format!(
                        "the intercept N = {nn} STB is not positive; the data do not support this case"
                    ),
                });
            }
            let m = line.slope / nn;
            let var = m
                * m
                * ((line.slope_se / line.slope).powi(2) + (line.intercept_se / nn).powi(2)
                    - 2.0 * line.covariance / (line.slope * nn));
            Ok(HavlenaOdehFit {
                case,
                n: nn,
                n_se: line.intercept_se,
                m,
                m_se: var.max(0.0).sqrt(),
                aquifer_constant: nan,
                aquifer_constant_se: nan,
                line,
            })
        }
        HavlenaOdehCase::WaterDrive { m, aquifer } => {
            non_negative("m", m)?;
            let et = terms.et(m);
            let wu = aquifer.unit_influx(&terms.t_days, &terms.p, terms.p_initial)?;
            let x: Vec<f64> = (0..n)
                .map(|i| if et[i] > 0.0 { wu[i] / et[i] } else { nan })
                .collect();
            let y: Vec<f64> = (0..n)
                .map(|i| if et[i] > 0.0 { terms.f[i] / et[i] } else { nan })
                .collect();
            let line = fit_line(&x, &y, select, false)?;
            Ok(HavlenaOdehFit {
                case,
                n: line.intercept,
                n_se: line.intercept_se,
                m,
                m_se: nan,
                aquifer_constant: line.slope,
                aquifer_constant_se: line.slope_se,
                line,
            })
        }
    }
}
