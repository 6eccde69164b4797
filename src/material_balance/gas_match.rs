//! Nonlinear history match of a gas reservoir: gas in place G together with the aquifer
//! constant and shape, with confidence intervals, from pressure, cumulative gas and water
//! and a gas table (z or Bg against pressure).
//!
//! # Formula
//! ```text
//! F  = Gp Bg(p) + Wp Bw                                         rb
//! Et = Bg(p) - Bgi + Bgi ce (pi - p),  ce = (cw Swi + cf)/(1 - Swi)   rb/scf
//! F  = G Et + C We_unit(t, p; theta)
//! ```
//! The ce term is the abnormal-pressure (rock and connate-water expansion) correction of
//! Ramagost & Farshad (1981); with cw = cf = 0 the balance is the plain volumetric or
//! water-drive gas balance; with `fit_ce` ce is estimated with G (it enters linearly, as
//! G ce). The estimation machinery is that of the oil history match
//! ([`super::history_match`]): variable projection on the withdrawal imbalance for the
//! start, Levenberg–Marquardt on the observed-minus-model pressure (default) or on the
//! imbalance, the covariance s^2 (J^T J)^-1 from the central-difference Jacobian, and
//! Student-t intervals. G, C and the shape parameters are estimated in logarithms.
//!
//! # References
//! - Havlena, D., Odeh, A.S. (1963). The material balance as an equation of a straight
//!   line. JPT 15(8), 896–900.
//! - Ramagost, B.P., Farshad, F.F. (1981). P/Z abnormally pressured gas reservoirs. SPE 10125.
//! - Levenberg, K. (1944); Marquardt, D.W. (1963); see [`super::history_match`].

use super::aquifer::AquiferModel;
use super::gas::gas_bg;
use super::history::{check_cumulative, check_pressures, check_times};
use super::history_match::{
    CE_UNIT, HistoryMatchOptions, MatchParameter, MatchReport, Objective, Physics, check_options,
    layout, run,
};
use super::oil::MbeTerms;
use super::pvt::Pchip;
use crate::error::{Error, Result, fraction, non_negative, positive};
use crate::units::StandardConditions;

/// A gas table: Bg (rb/scf) against pressure, built from z-factors or from Bg directly.
///
/// Internally the product Bg p (proportional to z) is interpolated by a monotone cubic
/// (Fritsch & Carlson 1980), so Bg = (Bg p)(p) / p keeps its 1/p shape between rows.
/// Outside the table's pressure range nothing is extrapolated: it is an error.
///
/// # Examples
/// ```
/// use stocktank::material_balance::{GasPvtTable, gas_bg};
/// use stocktank::units::StandardConditions;
/// let sc = StandardConditions::FIELD;
/// let t = GasPvtTable::from_z(vec![1000.0, 3000.0, 5000.0], vec![0.92, 0.86, 0.95], 200.0, sc).unwrap();
/// let bg = gas_bg(3000.0, 0.86, 200.0, sc).unwrap();
/// assert!((t.bg(3000.0).unwrap() - bg).abs() < 1e-15);
/// assert!(t.bg(6000.0).is_err());
/// ```
///
/// # References
/// Fritsch, F.N., Carlson, R.E. (1980). SIAM J. Numer. Anal. 17(2), 238–246.
#[derive(Debug, Clone, PartialEq)]
pub struct GasPvtTable {
    p: Vec<f64>,
    bg: Vec<f64>,
    bg_p: Pchip,
}

impl GasPvtTable {
    /// A table from pressures (psia, strictly ascending) and z-factors at the reservoir
    /// temperature `temperature_f` (degF), with Bg = psc z T / (Tsc p) at `sc`.
    ///
    /// # Errors
    /// [`Error::Shape`] for columns of different lengths or fewer than 2 rows;
    /// [`Error::InvalidRecord`] naming `p` or `z` and the row of a bad value;
    /// [`Error::InvalidArgument`] naming `temperature_f`.
    ///
    /// # Examples
    /// ```
    /// use stocktank::material_balance::GasPvtTable;
    /// use stocktank::units::StandardConditions;
    /// let e = GasPvtTable::from_z(vec![1000.0, 900.0], vec![0.9, 0.9], 200.0, StandardConditions::FIELD);
    /// assert!(e.unwrap_err().to_string().contains("row 1"));
    /// ```
    pub fn from_z(
        p: Vec<f64>,
        z: Vec<f64>,
        temperature_f: f64,
        sc: StandardConditions,
    ) -> Result<Self> {
        check_table("z", &p, &z)?;
        crate::error::temperature_f("temperature_f", temperature_f)?;
        let bg = p
            .iter()
            .zip(&z)
            .map(|(&pp, &zz)| gas_bg(pp, zz, temperature_f, sc))
            .collect::<Result<Vec<f64>>>()?;
        Ok(Self::build(p, bg))
    }

    /// A table from pressures (psia, strictly ascending) and Bg (rb/scf).
    ///
    /// # Errors
    /// As [`GasPvtTable::from_z`], naming `bg`.
    ///
    /// # Examples
    /// ```
    /// use stocktank::material_balance::GasPvtTable;
    /// let t = GasPvtTable::from_bg(vec![1000.0, 2000.0], vec![0.0030, 0.0015]).unwrap();
    /// assert!((t.bg(1500.0).unwrap() - 0.002).abs() < 1e-15);
    /// ```
    pub fn from_bg(p: Vec<f64>, bg: Vec<f64>) -> Result<Self> {
        check_table("bg", &p, &bg)?;
        Ok(Self::build(p, bg))
    }

    fn build(p: Vec<f64>, bg: Vec<f64>) -> Self {
        let y: Vec<f64> = p.iter().zip(&bg).map(|(a, b)| a * b).collect();
        Self {
            bg_p: Pchip::new(&p, &y),
            p,
            bg,
        }
    }

    /// Lowest and highest pressure of the table, psia.
    ///
    /// # Examples
    /// ```
    /// use stocktank::material_balance::GasPvtTable;
    /// let t = GasPvtTable::from_bg(vec![1000.0, 2000.0], vec![0.0030, 0.0015]).unwrap();
    /// assert_eq!(t.pressure_range(), (1000.0, 2000.0));
    /// ```
    pub fn pressure_range(&self) -> (f64, f64) {
        (self.p[0], self.p[self.p.len() - 1])
    }

    /// The table's columns: pressures (psia) and Bg (rb/scf).
    ///
    /// # Examples
    /// ```
    /// use stocktank::material_balance::GasPvtTable;
    /// let t = GasPvtTable::from_bg(vec![1000.0, 2000.0], vec![0.0030, 0.0015]).unwrap();
    /// assert_eq!(t.columns().1, &[0.0030, 0.0015]);
    /// ```
    pub fn columns(&self) -> (&[f64], &[f64]) {
        (&self.p, &self.bg)
    }

    /// Bg at pressure `p` (psia), rb/scf, interpolated.
    ///
    /// # Errors
    /// [`Error::OutOfRange`] outside the table; [`Error::InvalidArgument`] naming `p` when NaN.
    ///
    /// # Examples
    /// ```
    /// use stocktank::material_balance::GasPvtTable;
    /// let t = GasPvtTable::from_bg(vec![1000.0, 2000.0], vec![0.0030, 0.0015]).unwrap();
    /// assert_eq!(t.bg(2000.0).unwrap(), 0.0015);
    /// ```
    pub fn bg(&self, p: f64) -> Result<f64> {
        let k = super::pvt::interval(&self.p, p, "gas table")?;
        Ok(self.bg_p.eval(&self.p, k, p).0 / p)
    }
}

fn check_table(name: &str, p: &[f64], v: &[f64]) -> Result<()> {
    let n = p.len();
    if n < 2 || v.len() != n {
        return Err(Error::Shape(format!(
            "a gas table needs at least 2 rows and equal columns: `p` has {n} rows, `{name}` {}",
            v.len()
        )));
    }
    for (col, vals) in [("p", p), (name, v)] {
        for (i, &x) in vals.iter().enumerate() {
            if !(x.is_finite() && x > 0.0) {
                return Err(Error::InvalidRecord {
                    arg: col.into(),
                    row: i,
                    message: format!("value {x} must be finite and > 0"),
                });
            }
        }
    }
    for i in 1..n {
        if p[i] <= p[i - 1] {
            return Err(Error::InvalidRecord {
                arg: "p".into(),
                row: i,
                message: format!(
                    "pressure {} psia is not above the previous row's {} psia (pressures must ascend strictly)",
                    p[i],
                    p[i - 1]
                ),
            });
        }
    }
    Ok(())
}

/// Pressure and cumulative production history of a gas reservoir: `t_days` days since the
/// start at the initial pressure, `p` average pressure psia, `gp` cumulative gas scf, `wp`
/// cumulative water STB.
#[derive(Debug, Clone, PartialEq)]
pub struct GasHistory {
    /// Time since the start of production, days.
    pub t_days: Vec<f64>,
    /// Average reservoir pressure, psia.
    pub p: Vec<f64>,
    /// Cumulative gas produced, scf.
    pub gp: Vec<f64>,
    /// Cumulative water produced, STB.
    pub wp: Vec<f64>,
}

impl GasHistory {
    /// Build and validate; `wp` may be empty (no water produced).
    ///
    /// # Errors
    /// [`Error::Shape`] for columns of different lengths or no rows;
    /// [`Error::InvalidRecord`] naming the column and row of unsorted or repeated times, a
    /// negative or falling cumulative volume, or a pressure above `p_initial` (psia).
    ///
    /// # Examples
    /// ```
    /// use stocktank::material_balance::GasHistory;
    /// let e = GasHistory::new(vec![0.0, 10.0], vec![4000.0, 3900.0], vec![0.0, -1.0], vec![], 4000.0);
    /// assert!(e.unwrap_err().to_string().contains("`gp` at row 1"));
    /// ```
    pub fn new(
        t_days: Vec<f64>,
        p: Vec<f64>,
        gp: Vec<f64>,
        wp: Vec<f64>,
        p_initial: f64,
    ) -> Result<Self> {
        let n = t_days.len();
        if n == 0 {
            return Err(Error::Shape("the history has no rows".into()));
        }
        let wp = if wp.is_empty() { vec![0.0; n] } else { wp };
        for (name, v) in [("p", &p), ("gp", &gp), ("wp", &wp)] {
            if v.len() != n {
                return Err(Error::Shape(format!(
                    "`{name}` has {} rows but `t_days` has {n}",
                    v.len()
                )));
            }
        }
        check_times(&t_days)?;
        check_pressures(&p, p_initial)?;
        check_cumulative("gp", &gp)?;
        check_cumulative("wp", &wp)?;
        Ok(Self { t_days, p, gp, wp })
    }
}

/// Initial state and compressibilities of a gas reservoir.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct GasReservoir {
    /// Initial pressure, psia.
    pub p_initial: f64,
    /// Connate water saturation, fraction [0, 1).
    pub swi: f64,
    /// Water compressibility, 1/psi (0 to ignore; matters in abnormally pressured reservoirs).
    pub cw: f64,
    /// Pore compressibility, 1/psi (0 to ignore).
    pub cf: f64,
    /// Water formation volume factor for the produced water, rb/STB.
    pub bw: f64,
}

impl GasReservoir {
    /// Build and validate.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `p_initial`, `swi`, `cw`, `cf` or `bw`.
    ///
    /// # Examples
    /// ```
    /// use stocktank::material_balance::GasReservoir;
    /// let r = GasReservoir::new(5000.0, 0.25, 3e-6, 1.5e-5, 1.02).unwrap();
    /// assert!((r.ce() - (3e-6 * 0.25 + 1.5e-5) / 0.75).abs() < 1e-20);
    /// ```
    pub fn new(p_initial: f64, swi: f64, cw: f64, cf: f64, bw: f64) -> Result<Self> {
        positive("p_initial", p_initial)?;
        fraction("swi", swi)?;
        if swi >= 1.0 {
            return Err(Error::invalid("swi", swi, "must be < 1"));
        }
        non_negative("cw", cw)?;
        non_negative("cf", cf)?;
        positive("bw", bw)?;
        Ok(Self {
            p_initial,
            swi,
            cw,
            cf,
            bw,
        })
    }

    /// Effective compressibility ce = (cw Swi + cf) / (1 - Swi), 1/psi (Ramagost & Farshad
    /// 1981).
    ///
    /// # Examples
    /// ```
    /// use stocktank::material_balance::GasReservoir;
    /// assert_eq!(GasReservoir::new(5000.0, 0.2, 0.0, 0.0, 1.0).unwrap().ce(), 0.0);
    /// ```
    pub fn ce(&self) -> f64 {
        (self.cw * self.swi + self.cf) / (1.0 - self.swi)
    }
}

/// What to match in a gas history and how.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct GasMatchOptions {
    /// The aquifer model; its shape parameters are the starting values (or the fixed
    /// values when `fit_shape` is false). `None`: a volumetric reservoir (G alone).
    pub aquifer: Option<AquiferModel>,
    /// Fit the time constant / dimensionless time per day.
    pub fit_shape: bool,
    /// Fit the radius ratio reD of a finite van Everdingen–Hurst or Carter–Tracy aquifer.
    pub fit_red: bool,
    /// Estimate the effective compressibility ce (1/psi, bounded to [0, 1e-4]) instead of
    /// taking it from the reservoir's Swi, cw and cf (abnormally pressured reservoirs;
    /// ce is often poorly determined and correlated with G: read the warnings).
    pub fit_ce: bool,
    /// The objective (observed minus model pressure by default).
    pub objective: Objective,
    /// Iteration limit of Levenberg–Marquardt.
    pub max_iterations: usize,
    /// Relative tolerance on the step and on the decrease of the sum of squares.
    pub tolerance: f64,
    /// Confidence level of the intervals, e.g. 0.95.
    pub confidence: f64,
}

impl Default for GasMatchOptions {
    fn default() -> Self {
        let o = HistoryMatchOptions::default();
        Self {
            aquifer: None,
            fit_shape: o.fit_shape,
            fit_red: o.fit_red,
            fit_ce: false,
            objective: o.objective,
            max_iterations: o.max_iterations,
            tolerance: o.tolerance,
            confidence: o.confidence,
        }
    }
}

/// The result of a gas history match.
#[derive(Debug, Clone, PartialEq)]
pub struct GasHistoryMatch {
    /// Gas in place G, scf.
    pub g: f64,
    /// Effective rock and water compressibility ce, 1/psi (fitted with `fit_ce`, else the
    /// reservoir's).
    pub ce: f64,
    /// The regression: parameters (G first), their uncertainty, the matched model and
    /// diagnostics.
    pub report: MatchReport,
}

/// Match the gas in place G and the aquifer parameters of a gas reservoir to its history
/// by nonlinear least squares (see the module docs for the balance and the method).
///
/// # Arguments
/// * `table` - Bg against pressure; must cover `p_initial` and every model pressure
///   (a model pressure below the table's range is held at its lowest pressure).
/// * `history` - time (days), pressure (psia), Gp (scf), Wp (STB).
/// * `reservoir` - initial pressure, Swi, cw, cf (abnormal-pressure term; zeros for a
///   normally pressured reservoir) and Bw.
/// * `options` - the aquifer and what to fit.
///
/// # Returns
/// [`GasHistoryMatch`] with G in scf, the aquifer constant in rb/psi (rb/(psi day) for
/// Schilthuis), shape parameters, standard errors, confidence intervals and per-row model.
///
/// # Errors
/// [`Error::InvalidRecord`] naming `p` and the row the table does not cover;
/// [`Error::OutOfRange`] when it does not cover `p_initial`; [`Error::Singular`] when the
/// parameters cannot be separated (its message names the most nearly collinear pair and
/// the condition number); [`Error::Shape`] when there are not more rows than parameters;
/// [`Error::InvalidArgument`] naming `confidence`, `tolerance` or an aquifer parameter.
///
/// # Examples
/// ```
/// use stocktank::material_balance::*;
/// use stocktank::units::StandardConditions;
/// let table = GasPvtTable::from_z(vec![1000.0, 5000.0], vec![0.9, 1.0], 200.0, StandardConditions::FIELD).unwrap();
/// let res = GasReservoir::new(5000.0, 0.2, 0.0, 0.0, 1.0).unwrap();
/// let g = 5e10;
/// let p = [5000.0, 4800.0, 4600.0, 4400.0, 4200.0];
/// let bgi = table.bg(5000.0).unwrap();
/// let gp: Vec<f64> = p.iter().map(|&x| { let bg = table.bg(x).unwrap(); g * (bg - bgi) / bg }).collect();
/// let h = GasHistory::new(vec![0.0, 90.0, 180.0, 270.0, 360.0], p.to_vec(), gp, vec![], 5000.0).unwrap();
/// let fit = gas_history_match(&table, &h, &res, &GasMatchOptions::default()).unwrap();
/// assert!((fit.g / g - 1.0).abs() < 1e-6);
/// ```
///
/// # References
/// Havlena & Odeh (1963); Ramagost & Farshad (1981); see the module docs.
pub fn gas_history_match(
    table: &GasPvtTable,
    history: &GasHistory,
    reservoir: &GasReservoir,
    options: &GasMatchOptions,
) -> Result<GasHistoryMatch> {
    let opts = HistoryMatchOptions {
        m: if options.fit_ce { None } else { Some(0.0) },
        aquifer: options.aquifer,
        fit_shape: options.fit_shape,
        fit_red: options.fit_red,
        objective: options.objective,
        max_iterations: options.max_iterations,
        tolerance: options.tolerance,
        confidence: options.confidence,
    };
    check_options(&opts)?;
    check_pressures(&history.p, reservoir.p_initial)?;
    let terms = gas_terms(table, history, reservoir, options.fit_ce)?;
    let lay = layout(MatchParameter::G, &opts);
    let f = run(
        Physics::Gas {
            table,
            history,
            reservoir,
            fit_ce: options.fit_ce,
        },
        terms,
        lay,
        &opts,
    )?;
    Ok(GasHistoryMatch {
        g: f.n,
        ce: if options.fit_ce {
            f.m * CE_UNIT
        } else {
            reservoir.ce()
        },
        report: f.report,
    })
}

/// The gas balance in the Havlena–Odeh layout of [`MbeTerms`]: F in `f`, Bg - Bgi in `eo`,
/// Bgi ce (pi - p) in `efw` (per unit G). With `fit_ce` the compressibility term moves to
/// `eg` as Bgi CE_UNIT (pi - p), so that the fitted "m" is ce in units of CE_UNIT.
fn gas_terms(
    table: &GasPvtTable,
    history: &GasHistory,
    reservoir: &GasReservoir,
    fit_ce: bool,
) -> Result<MbeTerms> {
    let pi = reservoir.p_initial;
    let bgi = table.bg(pi).map_err(|e| match e {
        Error::OutOfRange(m) => Error::OutOfRange(format!("initial pressure: {m}")),
        o => o,
    })?;
    let ce = reservoir.ce();
    let n = history.t_days.len();
    for (name, v) in [("p", &history.p), ("gp", &history.gp), ("wp", &history.wp)] {
        if v.len() != n {
            return Err(Error::Shape(format!(
                "`{name}` has {} rows but `t_days` has {n}",
                v.len()
            )));
        }
    }
    let mut t = MbeTerms {
        t_days: history.t_days.clone(),
        p: history.p.clone(),
        np: vec![0.0; n],
        f: Vec::with_capacity(n),
        f_hydrocarbon: Vec::with_capacity(n),
        f_water: Vec::with_capacity(n),
        eo: Vec::with_capacity(n),
        eg: Vec::with_capacity(n),
        efw: Vec::with_capacity(n),
        p_initial: pi,
        boi: 0.0,
        bgi,
        rsi: 0.0,
        rs: vec![0.0; n],
    };
    for i in 0..n {
        let bg = table.bg(history.p[i]).map_err(|e| Error::InvalidRecord {
            arg: "p".into(),
            row: i,
            message: match e {
                Error::OutOfRange(m) => m,
                other => other.to_string(),
            },
        })?;
        let fh = history.gp[i] * bg;
        let fw = history.wp[i] * reservoir.bw;
        t.f_hydrocarbon.push(fh);
        t.f_water.push(fw);
        t.f.push(fh + fw);
        t.eo.push(bg - bgi);
        let dp = pi - history.p[i];
        if fit_ce {
            t.eg.push(bgi * CE_UNIT * dp);
            t.efw.push(0.0);
        } else {
            t.eg.push(0.0);
            t.efw.push(bgi * ce * dp);
        }
    }
    Ok(t)
}
