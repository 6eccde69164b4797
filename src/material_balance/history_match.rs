//! History matching of an oil reservoir by nonlinear least squares: N, m and the aquifer
//! parameters together, with confidence intervals.
//!
//! # Method
//! Two objectives ([`Objective`]):
//! - **Withdrawal**: the residual of each row is the imbalance of the Havlena–Odeh equation
//!   in reservoir barrels, r = F - N [Eo + m Eg + (1 + m) Efw] - C We_unit(theta), theta the
//!   aquifer's shape parameters (time constant, dimensionless time per day, radius ratio).
//!   N, mN and C enter linearly, so for each theta they are solved exactly by linear least
//!   squares and Levenberg–Marquardt runs over theta alone (variable projection, Golub &
//!   Pereyra 1973). Fast, but biased when the pressures are noisy: pressure errors enter
//!   the expansion terms (errors in the variables).
//! - **Pressure** (default): the model predicts each row's average pressure from the
//!   production to date (the balance F(p) = N Et(p) + C We(p) solved row by row with a
//!   bracketed root finder, the aquifer stepped along the model's own pressures), and the
//!   residual is observed minus predicted pressure, psi. Noise in the measured pressures is
//!   then noise in the data, not in the model. Started from the withdrawal solution.
//!
//! N, C and the shape parameters are estimated in logarithms (so they stay positive and
//! their intervals are asymmetric), m directly (bounded at 0). The covariance comes from
//! the central-difference Jacobian at the solution, s^2 (J^T J)^-1 with
//! s^2 = SSR / (rows - parameters), and the intervals from the Student-t quantile.
//!
//! # Identifiability
//! Whether the history can separate the parameters (N from m, either from the aquifer) is
//! reported, not only failed on: the result carries the condition number of J^T J with
//! the Jacobian columns scaled to unit length, and plain-language warnings when it
//! exceeds [`CONDITION_WARNING`] or two parameters correlate beyond
//! [`CORRELATION_WARNING`]. When J^T J is singular (condition number above 1e14) the
//! [`Error::Singular`] message gives the condition number and the pair of parameters
//! whose sensitivities are most nearly parallel.
//!
//! # References
//! - Levenberg, K. (1944). Quarterly of Applied Mathematics 2(2), 164–168; Marquardt, D.W.
//!   (1963). Journal of SIAM 11(2), 431–441; the damping update of Nielsen, H.B. (1999),
//!   IMM-REP-1999-05, Technical University of Denmark.
//! - Golub, G.H., Pereyra, V. (1973). The differentiation of pseudo-inverses and nonlinear
//!   least squares problems whose variables separate. SIAM J. Numer. Anal. 10(2), 413–432.
//! - Havlena, D., Odeh, A.S. (1963). JPT 15(8), 896–900.

use super::aquifer::{Aquifer, AquiferModel, DimensionlessTable, InfluxStepper, Kind, cached};
use super::fit::t_critical;
use super::gas_match::{GasHistory, GasPvtTable, GasReservoir};
use super::history::OilHistory;
use super::oil::{MbeTerms, OilReservoir, oil_mbe_terms};
use super::pvt::PvtTable;
use crate::error::{Error, Result, non_negative};
use rayon::prelude::*;

/// How the Levenberg–Marquardt iteration ended.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum LmStatus {
    /// Nothing nonlinear to iterate: every parameter entered linearly.
    Linear,
    /// The relative step in the parameters fell below the tolerance.
    ConvergedStep,
    /// The relative decrease of the sum of squares fell below the tolerance.
    ConvergedCost,
    /// The gradient vanished.
    ConvergedGradient,
    /// The iteration limit was reached (the result is the best point found; treat it with
    /// care).
    MaxIterations,
}

/// What the history match minimises.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Objective {
    /// Observed minus predicted average pressure, psi (the default).
    Pressure,
    /// Imbalance of the Havlena–Odeh equation, rb (fast; biased by noisy pressures).
    Withdrawal,
}

/// A parameter of the history match.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum MatchParameter {
    /// Oil in place N, STB.
    N,
    /// Gas in place G, scf (gas history match).
    G,
    /// Gas-cap ratio m.
    M,
    /// Effective rock and water compressibility ce of a gas reservoir, 1/psi (gas history
    /// match with `fit_ce`).
    Ce,
    /// Aquifer constant C (rb/psi; rb/(psi day) for Schilthuis).
    AquiferConstant,
    /// Fetkovich time constant, days.
    TauDays,
    /// Dimensionless time per day, 1/day.
    TdPerDay,
    /// Aquifer-to-reservoir radius ratio.
    Red,
}

impl MatchParameter {
    /// The parameter's name as used in reports and in Python (`"n"`, `"m"`,
    /// `"aquifer_constant"`, `"tau_days"`, `"td_per_day"`, `"red"`; `"g"` for gas in place,
    /// `"ce"` for the effective compressibility of a gas reservoir).
    ///
    /// # Examples
    /// ```
    /// assert_eq!(stocktank::material_balance::MatchParameter::N.name(), "n");
    /// ```
    pub fn name(&self) -> &'static str {
        match self {
            MatchParameter::N => "n",
            MatchParameter::G => "g",
            MatchParameter::M => "m",
            MatchParameter::Ce => "ce",
            MatchParameter::AquiferConstant => "aquifer_constant",
            MatchParameter::TauDays => "tau_days",
            MatchParameter::TdPerDay => "td_per_day",
            MatchParameter::Red => "red",
        }
    }
}

/// What to match and how.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct HistoryMatchOptions {
    /// `Some(m)` holds the gas-cap ratio fixed; `None` fits it.
    pub m: Option<f64>,
    /// The aquifer model; its shape parameters are the starting values (or the fixed values
    /// when `fit_shape` is false). `None`: no aquifer.
    pub aquifer: Option<AquiferModel>,
    /// Fit the time constant / dimensionless time per day.
    pub fit_shape: bool,
    /// Fit the radius ratio reD of a finite van Everdingen–Hurst or Carter–Tracy aquifer.
    pub fit_red: bool,
    /// The objective.
    pub objective: Objective,
    /// Iteration limit of Levenberg–Marquardt.
    pub max_iterations: usize,
    /// Relative tolerance on the step and on the decrease of the sum of squares.
    pub tolerance: f64,
    /// Confidence level of the intervals, e.g. 0.95.
    pub confidence: f64,
}

impl Default for HistoryMatchOptions {
    fn default() -> Self {
        Self {
            m: Some(0.0),
            aquifer: None,
            fit_shape: true,
            fit_red: false,
            objective: Objective::Pressure,
            max_iterations: 100,
            tolerance: 1e-10,
            confidence: 0.95,
        }
    }
}

/// The result of a history match.
#[derive(Debug, Clone, PartialEq)]
pub struct HistoryMatch {
    /// Oil in place N, STB.
    pub n: f64,
    /// Gas-cap ratio m (fitted or given).
    pub m: f64,
    /// The regression: parameters, their uncertainty, the matched model and diagnostics.
    pub report: MatchReport,
}

/// What an oil or gas history match reports besides its in-place volume: the fitted
/// parameters with standard errors, confidence limits and correlations, the matched
/// aquifer and model, the residuals, and how the regression went.
#[derive(Debug, Clone, PartialEq)]
pub struct MatchReport {
    /// The fitted parameters, in order (the in-place volume first).
    pub parameters: Vec<MatchParameter>,
    /// Their values.
    pub values: Vec<f64>,
    /// Their standard errors.
    pub std_errors: Vec<f64>,
    /// Lower confidence limits.
    pub ci_low: Vec<f64>,
    /// Upper confidence limits.
    pub ci_high: Vec<f64>,
    /// Correlation matrix of the parameters, row-major.
    pub correlation: Vec<f64>,
    /// The matched aquifer (None without one).
    pub aquifer: Option<Aquifer>,
    /// Cumulative influx of the matched aquifer along the observed pressures, rb.
    pub we: Vec<f64>,
    /// Average pressure predicted by the matched model from the production, psia.
    pub p_model: Vec<f64>,
    /// Residual per row: observed minus predicted pressure (psi) for
    /// [`Objective::Pressure`]; for [`Objective::Withdrawal`] the Havlena–Odeh imbalance,
    /// rb (F - N Et - We for oil, F - G Et - We for gas).
    pub residuals: Vec<f64>,
    /// Root-mean-square residual over the used rows (psi or rb, as `residuals`).
    pub rms: f64,
    /// Rows used (the initial row, at the initial pressure without production, is not).
    pub used: Vec<bool>,
    /// The objective minimised.
    pub objective: Objective,
    /// Levenberg–Marquardt iterations (both stages).
    pub iterations: usize,
    /// Evaluations of the model.
    pub evaluations: usize,
    /// How the (last) iteration ended.
    pub status: LmStatus,
    /// Condition number of J^T J at the solution with the Jacobian columns scaled to unit
    /// length (1 for independent parameters; large when the history cannot separate them).
    pub condition_number: f64,
    /// Plain-language warnings: ill-conditioning (condition number above
    /// [`CONDITION_WARNING`]) and each pair of parameters correlated above
    /// [`CORRELATION_WARNING`] in absolute value.
    pub warnings: Vec<String>,
}

/// Solve the small system A x = b by Gaussian elimination with partial pivoting; None when
/// (numerically) singular.
fn solve(mut a: Vec<f64>, mut b: Vec<f64>, n: usize) -> Option<Vec<f64>> {
    let scale = (0..n).map(|i| a[i * n + i].abs()).fold(0.0f64, f64::max);
    if scale == 0.0 || !scale.is_finite() {
        return None;
    }
    for c in 0..n {
        let piv = (c..n).max_by(|&i, &j| a[i * n + c].abs().total_cmp(&a[j * n + c].abs()))?;
        if a[piv * n + c].abs() <= 1e-13 * scale {
            return None;
        }
        if piv != c {
            for k in 0..n {
                a.swap(c * n + k, piv * n + k);
            }
            b.swap(c, piv);
        }
        for r in c + 1..n {
            let f = a[r * n + c] / a[c * n + c];
            for k in c..n {
                a[r * n + k] -= f * a[c * n + k];
            }
            b[r] -= f * b[c];
        }
    }
    let mut x = vec![0.0; n];
    for c in (0..n).rev() {
        let s: f64 = (c + 1..n).map(|k| a[c * n + k] * x[k]).sum();
        x[c] = (b[c] - s) / a[c * n + c];
    }
    Some(x)
}

/// Inverse of a small matrix (column by column); None when singular.
fn inverse(a: &[f64], n: usize) -> Option<Vec<f64>> {
    let mut inv = vec![0.0; n * n];
    for c in 0..n {
        let mut e = vec![0.0; n];
        e[c] = 1.0;
        let x = solve(a.to_vec(), e, n)?;
        for r in 0..n {
            inv[r * n + c] = x[r];
        }
    }
    Some(inv)
}

fn ssq(r: &[f64]) -> f64 {
    r.iter().map(|v| v * v).sum()
}

/// Levenberg–Marquardt with Marquardt's diagonal scaling and Nielsen's damping update,
/// bound constraints by projection. Returns (u, residuals, iterations, status).
fn levenberg_marquardt<R>(
    mut res_fn: R,
    mut u: Vec<f64>,
    bounds: &[(f64, f64)],
    max_iterations: usize,
    tolerance: f64,
) -> Result<(Vec<f64>, Vec<f64>, usize, LmStatus)>
where
    R: FnMut(&[f64]) -> Result<Vec<f64>>,
{
    let q = u.len();
    let mut res = res_fn(&u)?;
    if q == 0 {
        return Ok((u, res, 0, LmStatus::Linear));
    }
    let mut cost = ssq(&res);
    let mut lambda = 1e-3;
    let mut nu = 2.0;
    let mut iterations = 0;
    let small = |step: &[f64], u: &[f64]| {
        (0..q).all(|i| step[i].abs() <= tolerance.sqrt() * (u[i].abs() + 1e-3))
    };
    while iterations < max_iterations {
        iterations += 1;
        let mut jac = vec![vec![0.0; res.len()]; q];
        for j in 0..q {
            let h = 1e-6 * u[j].abs().max(1.0);
            let mut uj = u.clone();
            uj[j] += h;
            let rj = res_fn(&uj)?;
            for k in 0..res.len() {
                jac[j][k] = (rj[k] - res[k]) / h;
            }
        }
        let mut a = vec![0.0; q * q];
        let mut g = vec![0.0; q];
        for r in 0..q {
            for c in 0..q {
                a[r * q + c] = jac[r].iter().zip(&jac[c]).map(|(x, y)| x * y).sum();
            }
            g[r] = jac[r].iter().zip(&res).map(|(x, y)| x * y).sum();
        }
        let gnorm = (0..q)
            .map(|i| g[i].abs() / a[i * q + i].sqrt().max(f64::MIN_POSITIVE))
            .fold(0.0f64, f64::max);
        if gnorm <= 1e-12 * cost.sqrt().max(f64::MIN_POSITIVE) {
            return Ok((u, res, iterations, LmStatus::ConvergedGradient));
        }
        loop {
            let mut damped = a.clone();
            for i in 0..q {
                damped[i * q + i] += lambda * a[i * q + i].max(1e-300);
            }
            let neg_g: Vec<f64> = g.iter().map(|v| -v).collect();
            let Some(step) = solve(damped, neg_g, q) else {
                lambda *= nu;
                nu *= 2.0;
                if lambda > 1e30 {
                    return Ok((u, res, iterations, LmStatus::ConvergedGradient));
                }
                continue;
            };
            let un: Vec<f64> = (0..q)
                .map(|i| (u[i] + step[i]).clamp(bounds[i].0, bounds[i].1))
                .collect();
            let actual: Vec<f64> = (0..q).map(|i| un[i] - u[i]).collect();
            let rn = res_fn(&un)?;
            let new_cost = ssq(&rn);
            if new_cost < cost {
                let pred: f64 = (0..q)
                    .map(|i| actual[i] * (lambda * a[i * q + i] * actual[i] - g[i]))
                    .sum();
                let rho = (cost - new_cost) / pred.max(f64::MIN_POSITIVE);
                let rel = (cost - new_cost) / cost.max(f64::MIN_POSITIVE);
                let was_small = small(&actual, &u);
                u = un;
                res = rn;
                cost = new_cost;
                lambda *= (1.0 / 3.0f64).max(1.0 - (2.0 * rho - 1.0).powi(3));
                nu = 2.0;
                if rel <= tolerance {
                    return Ok((u, res, iterations, LmStatus::ConvergedCost));
                }
                if was_small {
                    return Ok((u, res, iterations, LmStatus::ConvergedStep));
                }
                break;
            }
            if small(&actual, &u) {
                return Ok((u, res, iterations, LmStatus::ConvergedStep));
            }
            lambda *= nu;
            nu *= 2.0;
            if lambda > 1e30 {
                return Ok((u, res, iterations, LmStatus::ConvergedCost));
            }
        }
    }
    Ok((u, res, iterations, LmStatus::MaxIterations))
}

/// The parameter layout: u = [ln N, m?, ln C?, ln shape...].
pub(super) struct Layout {
    /// The leading (in-place) parameter: N for oil, G for gas.
    pub(super) first: MatchParameter,
    /// The second linear parameter: m for oil, ce (in units of [`CE_UNIT`]) for gas.
    pub(super) second: MatchParameter,
    pub(super) fit_m: bool,
    pub(super) m_fixed: f64,
    pub(super) aquifer: Option<AquiferModel>,
    pub(super) shape: Vec<MatchParameter>,
}

impl Layout {
    fn parameters(&self) -> Vec<MatchParameter> {
        let mut p = vec![self.first];
        if self.fit_m {
            p.push(self.second);
        }
        if self.aquifer.is_some() {
            p.push(MatchParameter::AquiferConstant);
        }
        p.extend(self.shape.iter().copied());
        p
    }

    fn n_linear(&self) -> usize {
        1 + usize::from(self.fit_m) + usize::from(self.aquifer.is_some())
    }

    fn shape_get(&self, model: &AquiferModel) -> Vec<f64> {
        self.shape
            .iter()
            .map(|w| match (w, *model) {
                (MatchParameter::TauDays, AquiferModel::Fetkovich { tau_days }) => tau_days.ln(),
                (
                    MatchParameter::TdPerDay,
                    AquiferModel::VanEverdingenHurst { td_per_day, .. }
                    | AquiferModel::CarterTracy { td_per_day, .. },
                ) => td_per_day.ln(),
                (
                    MatchParameter::Red,
                    AquiferModel::VanEverdingenHurst { red, .. }
                    | AquiferModel::CarterTracy { red, .. },
                ) => (red - 1.0).ln(),
                _ => 0.0,
            })
            .collect()
    }

    fn shape_with(&self, u: &[f64]) -> Option<AquiferModel> {
        let mut m = self.aquifer?;
        for (w, &v) in self.shape.iter().zip(u) {
            match (w, &mut m) {
                (MatchParameter::TauDays, AquiferModel::Fetkovich { tau_days }) => {
                    *tau_days = v.exp()
                }
                (
                    MatchParameter::TdPerDay,
                    AquiferModel::VanEverdingenHurst { td_per_day, .. }
                    | AquiferModel::CarterTracy { td_per_day, .. },
                ) => *td_per_day = v.exp(),
                (
                    MatchParameter::Red,
                    AquiferModel::VanEverdingenHurst { red, .. }
                    | AquiferModel::CarterTracy { red, .. },
                ) => *red = 1.0 + v.exp(),
                _ => {}
            }
        }
        Some(m)
    }

    fn shape_bounds(&self) -> Vec<(f64, f64)> {
        self.shape
            .iter()
            .map(|w| match w {
                MatchParameter::TauDays => (1e-6f64.ln(), 1e9f64.ln()),
                MatchParameter::TdPerDay => (1e-9f64.ln(), 1e5f64.ln()),
                _ => (1e-3f64.ln(), 1e4f64.ln()),
            })
            .collect()
    }

    fn bounds(&self) -> Vec<(f64, f64)> {
        // N up to 1e15 STB; G up to 1e18 scf.
        let top = if self.first == MatchParameter::G {
            1e18
        } else {
            1e15
        };
        let mut b = vec![(0.0f64.max(1.0f64.ln()), f64::ln(top))];
        if self.fit_m {
            b.push((0.0, 100.0));
        }
        if self.aquifer.is_some() {
            b.push((1e-12f64.ln(), 1e12f64.ln()));
        }
        b.extend(self.shape_bounds());
        b
    }

    /// (N, m, aquifer) from a full u.
    fn decode(&self, u: &[f64]) -> (f64, f64, Option<Aquifer>) {
        let n = u[0].exp();
        let mut k = 1;
        let m = if self.fit_m {
            k += 1;
            u[1]
        } else {
            self.m_fixed
        };
        let aq = if self.aquifer.is_some() {
            let c = u[k].exp();
            k += 1;
            self.shape_with(&u[k..])
                .map(|model| Aquifer { model, constant: c })
        } else {
            None
        };
        (n, m, aq)
    }
}

/// The balance a history match solves row by row for the model pressure.
pub(super) enum Physics<'a> {
    /// An oil reservoir with its PVT table.
    Oil {
        pvt: &'a PvtTable,
        history: &'a OilHistory,
        reservoir: &'a OilReservoir,
    },
    /// A gas reservoir: F = Gp Bg + Wp Bw = G [Bg - Bgi + Bgi ce (pi - p)] + We.
    Gas {
        table: &'a GasPvtTable,
        history: &'a GasHistory,
        reservoir: &'a GasReservoir,
        /// ce is the fitted "m" (in [`CE_UNIT`]) rather than the reservoir's.
        fit_ce: bool,
    },
}

impl Physics<'_> {
    fn len(&self) -> usize {
        match self {
            Physics::Oil { history, .. } => history.len(),
            Physics::Gas { history, .. } => history.t_days.len(),
        }
    }

    fn t_days(&self) -> &[f64] {
        match self {
            Physics::Oil { history, .. } => &history.t_days,
            Physics::Gas { history, .. } => &history.t_days,
        }
    }

    fn p_obs(&self) -> &[f64] {
        match self {
            Physics::Oil { history, .. } => &history.p,
            Physics::Gas { history, .. } => &history.p,
        }
    }

    fn p_initial(&self) -> f64 {
        match self {
            Physics::Oil { reservoir, .. } => reservoir.p_initial,
            Physics::Gas { reservoir, .. } => reservoir.p_initial,
        }
    }

    fn p_low(&self) -> f64 {
        match self {
            Physics::Oil { pvt, .. } => pvt.pressure_range().0,
            Physics::Gas { table, .. } => table.pressure_range().0,
        }
    }
}

pub(super) struct Model<'a> {
    pub(super) physics: Physics<'a>,
    pub(super) terms: MbeTerms,
    pub(super) rows: Vec<usize>,
    pub(super) table: Option<DimensionlessTable>,
    pub(super) evaluations: usize,
}

impl Model<'_> {
    fn unit_influx(&mut self, model: &AquiferModel) -> Result<Vec<f64>> {
        self.evaluations += 1;
        let t = &self.terms;
        let (td, p, pi) = (t.t_days.clone(), t.p.clone(), t.p_initial);
        model.unit_influx_with(&td, &p, pi, &mut self.table)
    }

    /// Withdrawal residuals of the used rows for (N, m, aquifer).
    fn withdrawal(&mut self, n: f64, m: f64, aq: Option<&Aquifer>) -> Result<Vec<f64>> {
        let wu = match aq {
            Some(a) => Some(self.unit_influx(&a.model)?),
            None => None,
        };
        let t = &self.terms;
        let c = aq.map_or(0.0, |a| a.constant);
        Ok(self
            .rows
            .iter()
            .map(|&i| {
                let et = t.eo[i] + m * t.eg[i] + (1.0 + m) * t.efw[i];
                t.f[i] - n * et - wu.as_ref().map_or(0.0, |w| c * w[i])
            })
            .collect())
    }

    /// Model pressures of every row for (N, m, aquifer): solve F(p) = N Et(p) + C We(p) row
    /// by row (Illinois false position in [table minimum, p_initial]).
    fn pressures(&mut self, n: f64, m: f64, aq: Option<&Aquifer>) -> Result<Vec<f64>> {
        self.evaluations += 1;
        let pi = self.physics.p_initial();
        let p_lo = self.physics.p_low();
        let rows_total = self.physics.len();
        let (model, c) = match aq {
            Some(a) => (a.model, a.constant),
            None => (AquiferModel::Pot, 0.0),
        };
        // The initial state of the balance (oil: Bo, Rs, Bg at pi; gas: Bgi) and ce.
        let (init, ce) = match &self.physics {
            Physics::Oil { pvt, reservoir, .. } => {
                let q = pvt.at(pi)?;
                let r = reservoir;
                ((q.bo, q.rs, q.bg), (r.cw * r.swi + r.cf) / (1.0 - r.swi))
            }
            Physics::Gas {
                table, reservoir, ..
            } => ((0.0, 0.0, table.bg(pi)?), reservoir.ce()),
        };
        let physics = &self.physics;
        let table = match &model {
            AquiferModel::VanEverdingenHurst { red, .. } => {
                Some(cached(&mut self.table, *red, Kind::Influx)?)
            }
            AquiferModel::CarterTracy { red, .. } => {
                Some(cached(&mut self.table, *red, Kind::Pressure)?)
            }
            _ => None,
        };
        let mut st = InfluxStepper::new(model, pi, table, rows_total);
        let t_days = physics.t_days();
        let mut out = Vec::with_capacity(rows_total);
        for (i, &ti) in t_days.iter().enumerate() {
            let (a, b) = st.affine(ti);
            let g = |p: f64| -> Result<f64> {
                match physics {
                    Physics::Oil {
                        pvt, history: h, ..
                    } => {
                        let q = pvt.at(p)?;
                        let f = h.np[i] * q.bo
                            + (h.gp[i] - h.np[i] * q.rs) * q.bg
                            + (h.wp[i] - h.wi[i]) * q.bw
                            - h.gi[i] * q.bg;
                        let (boi, rsi, bgi) = init;
                        let eo = (q.bo - boi) + (rsi - q.rs) * q.bg;
                        let eg = boi * (q.bg / bgi - 1.0);
                        let efw = boi * ce * (pi - p);
                        Ok(f - n * (eo + m * eg + (1.0 + m) * efw) - c * (a + b * p))
                    }
                    Physics::Gas {
                        table,
                        history: h,
                        reservoir,
                        fit_ce,
                    } => {
                        let bg = table.bg(p)?;
                        let bgi = init.2;
                        let f = h.gp[i] * bg + h.wp[i] * reservoir.bw;
                        let ce = if *fit_ce { m * CE_UNIT } else { ce };
                        let et = bg - bgi + bgi * ce * (pi - p);
                        Ok(f - n * et - c * (a + b * p))
                    }
                }
            };
            // Bracket the root nearest the previous row's pressure (the balance can have
            // more than one root in [p_lo, pi]; the physical one continues the history),
            // stepping outward by 1% of pi, then Illinois false position.
            let p_prev = out.last().copied().unwrap_or(pi).clamp(p_lo, pi);
            let g_prev = g(p_prev)?;
            let step = 0.01 * pi;
            let mut bracket = None;
            if g_prev == 0.0 {
                bracket = Some((p_prev, 0.0, p_prev, 0.0));
            } else {
                let mut last = [(p_prev, g_prev), (p_prev, g_prev)];
                'search: for k in 1..=200 {
                    let mut moved = false;
                    for (d, dir) in [-1.0f64, 1.0].iter().enumerate() {
                        let x = (p_prev + dir * k as f64 * step).clamp(p_lo, pi);
                        if x == last[d].0 {
                            continue;
                        }
                        moved = true;
                        let gx = g(x)?;
                        if gx == 0.0 || gx.signum() != last[d].1.signum() {
                            bracket = Some((last[d].0, last[d].1, x, gx));
                            break 'search;
                        }
                        last[d] = (x, gx);
                    }
                    if !moved {
                        break;
                    }
                }
            }
            let p = match bracket {
                None => {
                    // No sign change anywhere: the closest approach at a bound.
                    if g(p_lo)?.abs() < g(pi)?.abs() {
                        p_lo
                    } else {
                        pi
                    }
                }
                Some((mut xa, mut fa, mut xb, mut fb)) => {
                    let mut x = if fa == 0.0 { xa } else { xb };
                    if fa != 0.0 && fb != 0.0 {
                        let mut side = 0;
                        let mut x_old = f64::NAN;
                        for _ in 0..200 {
                            x = (xa * fb - xb * fa) / (fb - fa);
                            let fx = g(x)?;
                            if fx == 0.0 || (x - x_old).abs() <= 1e-10 * pi {
                                break;
                            }
                            x_old = x;
                            if fx.signum() == fb.signum() {
                                xb = x;
                                fb = fx;
                                if side == -1 {
                                    fa *= 0.5;
                                }
                                side = -1;
                            } else {
                                xa = x;
                                fa = fx;
                                if side == 1 {
                                    fb *= 0.5;
                                }
                                side = 1;
                            }
                        }
                    }
                    x
                }
            };
            st.push(ti, p, a + b * p);
            out.push(p);
        }
        Ok(out)
    }
}

/// Variable projection over the shape parameters: returns the full u at the withdrawal
/// optimum, the iterations and status.
fn withdrawal_solution(
    model: &mut Model<'_>,
    lay: &Layout,
    options: &HistoryMatchOptions,
) -> Result<(Vec<f64>, usize, LmStatus)> {
    let k = lay.n_linear();
    let mut last_coef = vec![0.0; k];
    let project = |model: &mut Model<'_>,
                   us: &[f64],
                   coef_out: &mut Vec<f64>|
     -> Result<Vec<f64>> {
        let wu = match lay.shape_with(us) {
            Some(m) => Some(model.unit_influx(&m)?),
            None => None,
        };
        let t = &model.terms;
        let rows = &model.rows;
        let mut cols: Vec<Vec<f64>> = Vec::new();
        if lay.fit_m {
            cols.push(rows.iter().map(|&i| t.eo[i] + t.efw[i]).collect());
            cols.push(rows.iter().map(|&i| t.eg[i] + t.efw[i]).collect());
        } else {
            let m = lay.m_fixed;
            cols.push(
                rows.iter()
                    .map(|&i| t.eo[i] + m * t.eg[i] + (1.0 + m) * t.efw[i])
                    .collect(),
            );
        }
        if let Some(w) = &wu {
            cols.push(rows.iter().map(|&i| w[i]).collect());
        }
        let f: Vec<f64> = rows.iter().map(|&i| t.f[i]).collect();
        let norms: Vec<f64> = cols
            .iter()
            .map(|c| c.iter().map(|v| v * v).sum::<f64>().sqrt())
            .collect();
        if norms.iter().any(|&v| !(v > 0.0 && v.is_finite())) {
            return Err(Error::Singular {
                what: "history match",
                detail: "an expansion or influx column is zero for every used row (e.g. all points at the initial pressure)".into(),
            });
        }
        let mut a = vec![0.0; k * k];
        let mut b = vec![0.0; k];
        for r in 0..k {
            for c in 0..k {
                a[r * k + c] = cols[r]
                    .iter()
                    .zip(&cols[c])
                    .map(|(x, y)| x * y)
                    .sum::<f64>()
                    / (norms[r] * norms[c]);
            }
            b[r] = cols[r].iter().zip(&f).map(|(x, y)| x * y).sum::<f64>() / norms[r];
        }
        let x = solve(a, b, k).ok_or_else(|| Error::Singular {
            what: "history match",
            detail: "the expansion and influx terms are linearly dependent over the used rows; N, m and the aquifer constant cannot be separated".into(),
        })?;
        *coef_out = x.iter().zip(&norms).map(|(v, s)| v / s).collect();
        Ok((0..f.len())
            .map(|j| f[j] - (0..k).map(|c| coef_out[c] * cols[c][j]).sum::<f64>())
            .collect())
    };
    let mut us0 = match &lay.aquifer {
        Some(m) => lay.shape_get(m),
        None => vec![],
    };
    let bounds = lay.shape_bounds();
    // Coarse scan of the first shape parameter (three points per decade across a wide
    // range, plus the user's start) for the lowest imbalance with physical coefficients
    // (N > 0, m >= 0, C >= 0): the least-squares surface in the time constant has more than
    // one valley, and a poor start can end in one with a negative N.
    if !us0.is_empty() {
        let (lo, hi) = match lay.shape[0] {
            MatchParameter::TauDays => (1.0f64.ln(), 1e5f64.ln()),
            MatchParameter::TdPerDay => (1e-4f64.ln(), 1e2f64.ln()),
            _ => (bounds[0].0, bounds[0].1),
        };
        let steps = ((hi - lo) / (std::f64::consts::LN_10 / 3.0)).ceil() as usize;
        let mut best: Option<(f64, f64)> = None;
        let mut coef = vec![0.0; k];
        for j in 0..=steps + 1 {
            let v = if j == steps + 1 {
                us0[0]
            } else {
                lo + (hi - lo) * j as f64 / steps as f64
            };
            let mut u = us0.clone();
            u[0] = v;
            let Ok(r) = project(model, &u, &mut coef) else {
                continue;
            };
            let physical = coef[0] > 0.0
                && (!lay.fit_m || coef[1] >= 0.0)
                && (lay.aquifer.is_none() || coef[k - 1] >= 0.0);
            let cost = ssq(&r);
            if physical && best.is_none_or(|(c, _)| cost < c) {
                best = Some((cost, v));
            }
        }
        if let Some((_, v)) = best {
            us0[0] = v;
        }
    }
    let mut scratch = vec![0.0; k];
    let (mut us, _, iterations, status) = levenberg_marquardt(
        |u| project(model, u, &mut scratch),
        us0.clone(),
        &bounds,
        options.max_iterations,
        options.tolerance,
    )?;
    project(model, &us, &mut last_coef)?;
    let physical = |c: &[f64]| {
        c[0] > 0.0 && (!lay.fit_m || c[1] >= 0.0) && (lay.aquifer.is_none() || c[k - 1] >= 0.0)
    };
    if !physical(&last_coef) && !us.is_empty() {
        // The unconstrained optimum is unphysical: keep the best physical scan point.
        us = us0;
        project(model, &us, &mut last_coef)?;
    }
    // Back to the full layout, kept inside the bounds.
    let n = last_coef[0];
    if n.is_nan() || n <= 0.0 {
        return Err(Error::Singular {
            what: "history match",
            detail: format!(
                "the balance gives a non-positive oil in place N = {n} STB; the data do not support this model"
            ),
        });
    }
    let mut u = vec![n.ln()];
    let mut j = 1;
    if lay.fit_m {
        u.push((last_coef[1] / n).max(0.0));
        j = 2;
    }
    if lay.aquifer.is_some() {
        let c = last_coef[j];
        u.push(if c > 0.0 {
            c.ln()
        } else {
            1e-9f64.max(1e-6 * n / 1e4).ln()
        });
    }
    u.extend(us);
    Ok((u, iterations, status))
}

/// Match N, m and the aquifer parameters of an oil reservoir to its history by nonlinear
/// least squares (see the module docs for the method and the objectives).
///
/// # Arguments
/// * `pvt`, `history`, `reservoir` - as for [`super::oil_mbe_terms`].
/// * `options` - what to fit, the starting shape of the aquifer, the objective.
///
/// # Returns
/// [`HistoryMatch`]: values, standard errors and confidence intervals of the fitted
/// parameters (N in STB, m, C, shape parameters), model pressures, influx and residuals per
/// row and how the iteration ended.
///
/// # Errors
/// [`Error::Singular`] when the parameters cannot be separated (collinear columns, all
/// points at one pressure, or a singular Jacobian at the solution, whose message names the
/// most nearly collinear pair and the condition number); [`Error::InvalidRecord`]
/// for history rows the PVT table does not cover; [`Error::InvalidArgument`] naming `m`,
/// `confidence`, `tolerance` or an aquifer parameter; [`Error::Shape`] when there are not more rows
/// than parameters.
///
/// # Examples
/// ```
/// use stocktank::material_balance::*;
/// let pvt = PvtTable::new(vec![1000.0, 3000.0], vec![1.2, 1.4], vec![300.0, 700.0], vec![0.0026, 0.0009]).unwrap();
/// let res = OilReservoir::new(3000.0, 0.2, 3e-6, 4e-6).unwrap();
/// let p = vec![3000.0, 2900.0, 2800.0, 2700.0, 2600.0];
/// let t = vec![0.0, 100.0, 200.0, 300.0, 400.0];
/// let zero = OilHistory::new(t.clone(), p.clone(), vec![0.0; 5], vec![0.0; 5], vec![0.0; 5], vec![], vec![], 3000.0).unwrap();
/// let t0 = oil_mbe_terms(&pvt, &zero, &res).unwrap();
/// // Synthetic: F = 1e7 Et + 200 (pi - p), with Gp = Np Rsi (so F = Np Bo + Np (Rsi - Rs) Bg).
/// let np: Vec<f64> = (0..5).map(|i| {
///     let q = pvt.at(p[i]).unwrap();
///     (1e7 * (t0.eo[i] + t0.efw[i]) + 200.0 * (3000.0 - p[i])) / (q.bo + (700.0 - q.rs) * q.bg)
/// }).collect();
/// let gp: Vec<f64> = np.iter().map(|n| n * 700.0).collect();
/// let h = OilHistory::new(t, p, np, gp, vec![0.0; 5], vec![], vec![], 3000.0).unwrap();
/// let opts = HistoryMatchOptions { aquifer: Some(AquiferModel::Pot), ..Default::default() };
/// let fit = history_match(&pvt, &h, &res, &opts).unwrap();
/// assert!((fit.n / 1e7 - 1.0).abs() < 1e-6);
/// ```
pub fn history_match(
    pvt: &PvtTable,
    history: &OilHistory,
    reservoir: &OilReservoir,
    options: &HistoryMatchOptions,
) -> Result<HistoryMatch> {
    check_options(options)?;
    let terms = oil_mbe_terms(pvt, history, reservoir)?;
    let lay = layout(MatchParameter::N, options);
    run(
        Physics::Oil {
            pvt,
            history,
            reservoir,
        },
        terms,
        lay,
        options,
    )
}

/// Validate the options shared by the oil and gas history matches.
pub(super) fn check_options(options: &HistoryMatchOptions) -> Result<()> {
    if !(options.confidence > 0.0 && options.confidence < 1.0) {
        return Err(Error::invalid(
            "confidence",
            options.confidence,
            "must lie in (0, 1)",
        ));
    }
    // A NaN or negative tolerance would never (or always) stop the solver, yet it reported
    // convergence.
    crate::error::positive("tolerance", options.tolerance)?;
    if let Some(m) = options.m {
        non_negative("m", m)?;
    }
    if let Some(a) = &options.aquifer {
        a.validate()?;
    }
    Ok(())
}

/// The parameter layout for the options, led by `first` (N or G).
pub(super) fn layout(first: MatchParameter, options: &HistoryMatchOptions) -> Layout {
    let mut shape = Vec::new();
    if let Some(model) = options.aquifer {
        match model {
            AquiferModel::Fetkovich { .. } if options.fit_shape => {
                shape.push(MatchParameter::TauDays)
            }
            AquiferModel::VanEverdingenHurst { red, .. }
            | AquiferModel::CarterTracy { red, .. } => {
                if options.fit_shape {
                    shape.push(MatchParameter::TdPerDay);
                }
                if options.fit_red && red.is_finite() {
                    shape.push(MatchParameter::Red);
                }
            }
            _ => {}
        }
    }
    Layout {
        first,
        second: if first == MatchParameter::G {
            MatchParameter::Ce
        } else {
            MatchParameter::M
        },
        fit_m: options.m.is_none(),
        m_fixed: options.m.unwrap_or(0.0),
        aquifer: options.aquifer,
        shape,
    }
}

/// Run the match: withdrawal solution (variable projection), then Levenberg–Marquardt on
/// the chosen objective, then the covariance report.
pub(super) fn run(
    physics: Physics<'_>,
    terms: MbeTerms,
    lay: Layout,
    options: &HistoryMatchOptions,
) -> Result<HistoryMatch> {
    let rows: Vec<usize> = (0..terms.f.len())
        .filter(|&i| {
            terms.f[i] != 0.0 || terms.eo[i] != 0.0 || terms.eg[i] != 0.0 || terms.efw[i] != 0.0
        })
        .collect();
    let params = lay.parameters();
    let p_count = params.len();
    if rows.len() <= p_count {
        return Err(Error::Shape(format!(
            "{} usable rows for {p_count} parameters: need more rows than parameters",
            rows.len()
        )));
    }
    let n_rows = physics.len();
    let p_obs: Vec<f64> = rows.iter().map(|&i| physics.p_obs()[i]).collect();
    let mut model = Model {
        physics,
        terms,
        rows: rows.clone(),
        table: None,
        evaluations: 0,
    };
    let start = withdrawal_solution(&mut model, &lay, options);
    let (mut u, mut iterations, mut status) = match start {
        Ok(s) => s,
        // The pressure match can still start from a plain guess when the withdrawal
        // solution is unphysical (noisy early rows can drive N or C negative there).
        Err(Error::Singular { .. }) if options.objective == Objective::Pressure => {
            let t = &model.terms;
            let m0 = lay.m_fixed.max(if lay.fit_m { 0.1 } else { 0.0 });
            let mut ratios: Vec<f64> = rows
                .iter()
                .map(|&i| t.f[i] / (t.eo[i] + m0 * t.eg[i] + (1.0 + m0) * t.efw[i]))
                .filter(|v| v.is_finite() && *v > 0.0)
                .collect();
            if ratios.is_empty() {
                return Err(Error::Singular {
                    what: "history match",
                    detail: "no row has a positive F/Et to start from; the data do not support this model".into(),
                });
            }
            ratios.sort_by(f64::total_cmp);
            let mut u = vec![ratios[0].ln()];
            if lay.fit_m {
                u.push(m0);
            }
            if let Some(a) = &lay.aquifer {
                u.push(1.0f64.ln());
                u.extend(lay.shape_get(a));
            }
            (u, 0, LmStatus::MaxIterations)
        }
        Err(e) => return Err(e),
    };
    let bounds = lay.bounds();
    for (v, b) in u.iter_mut().zip(&bounds) {
        *v = v.clamp(b.0, b.1);
    }
    let residual = |model: &mut Model<'_>, u: &[f64]| -> Result<Vec<f64>> {
        let (n, m, aq) = lay.decode(u);
        match options.objective {
            Objective::Withdrawal => model.withdrawal(n, m, aq.as_ref()),
            Objective::Pressure => {
                let pm = model.pressures(n, m, aq.as_ref())?;
                Ok(rows.iter().zip(&p_obs).map(|(&i, po)| po - pm[i]).collect())
            }
        }
    };
    if options.objective == Objective::Pressure {
        let (u2, _, it2, st2) = levenberg_marquardt(
            |v| residual(&mut model, v),
            u.clone(),
            &bounds,
            options.max_iterations,
            options.tolerance,
        )?;
        u = u2;
        iterations += it2;
        status = st2;
    }
    // Covariance from the central-difference Jacobian in u.
    let r0 = residual(&mut model, &u)?;
    let nr = r0.len();
    let mut jac = vec![vec![0.0; nr]; p_count];
    for j in 0..p_count {
        let h = 1e-5 * u[j].abs().max(1e-2);
        let mut up = u.clone();
        up[j] += h;
        let mut dn = u.clone();
        dn[j] -= h;
        let rp = residual(&mut model, &up)?;
        let rm = residual(&mut model, &dn)?;
        for k in 0..nr {
            jac[j][k] = (rp[k] - rm[k]) / (2.0 * h);
        }
    }
    let norms: Vec<f64> = jac
        .iter()
        .map(|c| {
            c.iter()
                .map(|v| v * v)
                .sum::<f64>()
                .sqrt()
                .max(f64::MIN_POSITIVE)
        })
        .collect();
    let mut jtj = vec![0.0; p_count * p_count];
    for r in 0..p_count {
        for c in 0..p_count {
            jtj[r * p_count + c] =
                jac[r].iter().zip(&jac[c]).map(|(x, y)| x * y).sum::<f64>() / (norms[r] * norms[c]);
        }
    }
    let eig = symmetric_eigenvalues(&jtj, p_count);
    let (e_min, e_max) = eig
        .iter()
        .fold((f64::INFINITY, 0.0f64), |(a, b), &e| (a.min(e), b.max(e)));
    let condition_number = if e_min > 0.0 {
        e_max / e_min
    } else {
        f64::INFINITY
    };
    let inv = match inverse(&jtj, p_count) {
        Some(inv) if condition_number < 1e14 => inv,
        _ => {
            return Err(Error::Singular {
                what: "history match",
                detail: format!(
                    "the Jacobian at the solution is singular (condition number of the scaled J^T J {condition_number:.3e}): \
                     the parameters {:?} are not all identifiable from this history; {}",
                    params.iter().map(|p| p.name()).collect::<Vec<_>>(),
                    collinear_pair(&jtj, &params)
                ),
            });
        }
    };
    let cost = ssq(&r0);
    let dof = (nr - p_count) as f64;
    let s2 = cost / dof;
    let tq = t_critical(options.confidence, dof);
    let mut values = Vec::with_capacity(p_count);
    let mut std_errors = Vec::with_capacity(p_count);
    let mut ci_low = Vec::with_capacity(p_count);
    let mut ci_high = Vec::with_capacity(p_count);
    let mut correlation = vec![0.0; p_count * p_count];
    for r in 0..p_count {
        for c in 0..p_count {
            correlation[r * p_count + c] =
                inv[r * p_count + c] / (inv[r * p_count + r] * inv[c * p_count + c]).sqrt();
        }
    }
    let mut warnings = Vec::new();
    if condition_number > CONDITION_WARNING {
        warnings.push(format!(
            "ill-conditioned: the condition number of the scaled J^T J is {condition_number:.3e} \
             (> {CONDITION_WARNING:.0e}); the intervals are wide and the values depend on the noise"
        ));
    }
    for r in 0..p_count {
        for c in r + 1..p_count {
            let v = correlation[r * p_count + c];
            if v.abs() > CORRELATION_WARNING {
                warnings.push(format!(
                    "`{}` and `{}` are correlated at {v:.4}: the history cannot separate them well; \
                     fix one from independent data (e.g. m from logs, the aquifer from its geology)",
                    params[r].name(),
                    params[c].name()
                ));
            }
        }
    }
    for (j, par) in params.iter().enumerate() {
        let se = (s2 * inv[j * p_count + j]).max(0.0).sqrt() / norms[j];
        let v = u[j];
        match par {
            MatchParameter::M => {
                values.push(v);
                std_errors.push(se);
                ci_low.push(v - tq * se);
                ci_high.push(v + tq * se);
            }
            MatchParameter::Ce => {
                values.push(v * CE_UNIT);
                std_errors.push(se * CE_UNIT);
                ci_low.push((v - tq * se) * CE_UNIT);
                ci_high.push((v + tq * se) * CE_UNIT);
            }
            MatchParameter::Red => {
                values.push(1.0 + v.exp());
                std_errors.push(v.exp() * se);
                ci_low.push(1.0 + (v - tq * se).exp());
                ci_high.push(1.0 + (v + tq * se).exp());
            }
            _ => {
                values.push(v.exp());
                std_errors.push(v.exp() * se);
                ci_low.push((v - tq * se).exp());
                ci_high.push((v + tq * se).exp());
            }
        }
    }
    let (n, m, aq) = lay.decode(&u);
    let we = match &aq {
        Some(a) => model
            .unit_influx(&a.model)?
            .into_iter()
            .map(|w| w * a.constant)
            .collect(),
        None => vec![0.0; n_rows],
    };
    let p_model = model.pressures(n, m, aq.as_ref())?;
    let mut residuals = vec![f64::NAN; n_rows];
    for (k, &i) in rows.iter().enumerate() {
        residuals[i] = r0[k];
    }
    let mut used = vec![false; n_rows];
    for &i in &rows {
        used[i] = true;
    }
    Ok(HistoryMatch {
        n,
        m,
        report: MatchReport {
            parameters: params,
            values,
            std_errors,
            ci_low,
            ci_high,
            correlation,
            aquifer: aq,
            we,
            p_model,
            residuals,
            rms: (cost / nr as f64).sqrt(),
            used,
            objective: options.objective,
            iterations,
            evaluations: model.evaluations,
            status,
            condition_number,
            warnings,
        },
    })
}

/// Above this condition number of the scaled J^T J the report warns (common practice in
/// regression diagnostics, no source: about 1e3 flags strong collinearity; 1e4 is used
/// here to leave room for the logarithmic parameterisation).
pub const CONDITION_WARNING: f64 = 1e4;
/// The gas match estimates ce in units of 1e-6 1/psi (so that it is of order one, like m).
pub(super) const CE_UNIT: f64 = 1e-6;
/// Above this absolute correlation between two parameters the report warns.
pub const CORRELATION_WARNING: f64 = 0.95;

/// The pair of parameters whose (scaled) Jacobian columns are the most nearly parallel.
fn collinear_pair(jtj: &[f64], params: &[MatchParameter]) -> String {
    let q = params.len();
    let mut best: Option<(f64, usize, usize)> = None;
    for r in 0..q {
        for c in r + 1..q {
            let v = jtj[r * q + c].abs();
            if best.is_none_or(|(b, _, _)| v > b) {
                best = Some((v, r, c));
            }
        }
    }
    match best {
        Some((v, r, c)) => format!(
            "the sensitivities of `{}` and `{}` are parallel to within cosine {v:.6}",
            params[r].name(),
            params[c].name()
        ),
        None => "a single parameter has no sensitivity".into(),
    }
}

/// Eigenvalues of a small symmetric matrix by cyclic Jacobi rotations (Golub & Van Loan
/// 2013, Matrix Computations, 4th ed., section 8.5).
fn symmetric_eigenvalues(a: &[f64], n: usize) -> Vec<f64> {
    let mut a = a.to_vec();
    for _sweep in 0..100 {
        let off: f64 = (0..n)
            .flat_map(|r| (0..n).filter(move |&c| c != r).map(move |c| (r, c)))
            .map(|(r, c)| a[r * n + c] * a[r * n + c])
            .sum();
        let diag: f64 = (0..n).map(|i| a[i * n + i] * a[i * n + i]).sum();
        if off <= 1e-30 * diag.max(f64::MIN_POSITIVE) {
            break;
        }
        for p in 0..n {
            for q in p + 1..n {
                let apq = a[p * n + q];
                if apq == 0.0 {
                    continue;
                }
                let theta = (a[q * n + q] - a[p * n + p]) / (2.0 * apq);
                let sign = if theta >= 0.0 { 1.0 } else { -1.0 };
                let t = sign / (theta.abs() + (theta * theta + 1.0).sqrt());
                let c = 1.0 / (t * t + 1.0).sqrt();
                let s = t * c;
                for k in 0..n {
                    let akp = a[k * n + p];
                    let akq = a[k * n + q];
                    a[k * n + p] = c * akp - s * akq;
                    a[k * n + q] = s * akp + c * akq;
                }
                for k in 0..n {
                    let apk = a[p * n + k];
                    let aqk = a[q * n + k];
                    a[p * n + k] = c * apk - s * aqk;
                    a[q * n + k] = s * apk + c * aqk;
                }
            }
        }
    }
    (0..n).map(|i| a[i * n + i]).collect()
}

/// One reservoir of a batch history match.
#[derive(Debug, Clone, PartialEq)]
pub struct HistoryMatchInput {
    /// PVT table.
    pub pvt: PvtTable,
    /// Production history.
    pub history: OilHistory,
    /// Initial state and compressibilities.
    pub reservoir: OilReservoir,
}

/// Match many reservoirs in parallel (rayon); one result per input, errors kept per item.
///
/// # Examples
/// ```
/// use stocktank::material_balance::*;
/// let out = history_match_batch(&[], &HistoryMatchOptions::default());
/// assert!(out.is_empty());
/// ```
pub fn history_match_batch(
    inputs: &[HistoryMatchInput],
    options: &HistoryMatchOptions,
) -> Vec<Result<HistoryMatch>> {
    inputs
        .par_iter()
        .map(|x| history_match(&x.pvt, &x.history, &x.reservoir, options))
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn jacobi_eigenvalues_match_numpy() {
        // numpy.linalg.eigvalsh([[4,1,2],[1,3,0],[2,0,5]]) = [1.8549, 3.4760, 6.6691]
        // (computed with numpy 2.x, rounded to 4 decimals).
        let a = [4.0, 1.0, 2.0, 1.0, 3.0, 0.0, 2.0, 0.0, 5.0];
        let mut e = symmetric_eigenvalues(&a, 3);
        e.sort_by(f64::total_cmp);
        for (x, y) in e.iter().zip([1.8549, 3.4760, 6.6691]) {
            assert!((x - y).abs() < 1e-4, "{e:?}");
        }
        // Trace and determinant are kept: 12 and 4*15 - 1*5 + 2*(-6) = 43.
        assert!((e.iter().sum::<f64>() - 12.0).abs() < 1e-12);
        assert!((e.iter().product::<f64>() - 43.0).abs() < 1e-9);
    }
}
