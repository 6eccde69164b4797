//! Black-oil tables: every property of oil, gas and water on one pressure grid that always
//! contains the bubble point, with a consistency check, and a parallel builder for thousands
//! of fluids.
//!
//! # Columns
//! | field | unit | meaning |
//! |---|---|---|
//! | `p` | psia | pressure (the user's grid with Pb inserted) |
//! | `rs` | scf/STB | solution GOR (the initial GOR at and above Pb) |
//! | `bo` | rb/STB | oil FVF (saturated below and at Pb, exp(-integral co dp) above) |
//! | `co` | 1/psi | oil compressibility: apparent two-phase value below Pb, undersaturated at and above |
//! | `oil_density` | lbm/ft3 | mass balance of stock-tank oil and dissolved gas over Bo |
//! | `oil_viscosity` | cp | Beggs–Robinson live oil below Pb, Vasquez–Beggs above |
//! | `bg` | rcf/scf | free-gas FVF (gas of the oil's gas gravity) |
//! | `z` | - | gas deviation factor |
//! | `gas_viscosity` | cp | gas viscosity |
//! | `gas_density` | lbm/ft3 | gas density |
//! | `bw` | rb/STB | water FVF at the oil's salinity |
//! | `water_viscosity` | cp | water viscosity at the oil's salinity |
//! | `bt` | rb/STB | total FVF Bo + Bg (Rsi - Rs), with Bg in rb/scf |
//!
//! Gas properties use [`crate::gas::Gas`] with the oil's gas gravity and its default methods
//! (the free gas is taken to have the separator gas gravity, common practice, no source);
//! water properties use [`crate::water::Water`] with the oil's salinity and its defaults.
//! Gas and water columns are given at every pressure (above Pb there is no free gas in the
//! oil zone, but a gas cap or injected gas at that pressure has those properties).
//!
//! # Where the default correlations are not consistent
//! Measured over 38,724 random oils inside Standing's (1947) data ranges with a positive
//! Vasquez–Beggs co (50-point grids, 50-7000 psia), the default set (Standing Pb and Bo,
//! Vasquez–Beggs co, Beggs–Robinson viscosity) breaks [`BlackOilTable::check`] in 2.2 % of the
//! tables, in two corners only:
//! - gas-rich oils, GOR above about 900 scf/STB (in that sweep: none below 1017 scf/STB, Bob
//!   1.49 rb/STB or Pb 3447 psia; hypothesis found one at 950 scf/STB, 17 degAPI, 100 degF):
//!   just below Pb Standing's Bo grows faster with pressure than the gas it dissolves
//!   occupies, Bg dRs/dp < dBo/dp, a negative total compressibility;
//! - heavy, gas-poor, cool oils where the Vasquez–Beggs co numerator
//!   -1433 + 5 Rsb + 17.2 T - 1180 gas_sg + 12.61 API is negative: Bo then rises and density
//!   falls with pressure above Pb.
//!
//! Across the other correlation sets (random oils inside each author's own data ranges,
//! Pb and Bo by the same author; percentage of tables with any violation, below Pb / above Pb):
//!
//! | Pb and Bo | co | tables | violating | below Pb | above Pb |
//! |---|---|---|---|---|---|
//! | Standing | Vasquez–Beggs | 19,363 | 2.5 % | 2.4 % | 0.1 % |
//! | Standing | Petrosky–Farshad | 19,363 | 2.4 % | 2.4 % | 0.0 % |
//! | Vasquez–Beggs | Vasquez–Beggs | 15,767 | 1.0 % | 0.0 % | 1.0 % |
//! | Vasquez–Beggs | Petrosky–Farshad | 15,767 | 0.0 % | 0.0 % | 0.0 % |
//! | Glaso | Vasquez–Beggs | 17,914 | 20.3 % | 20.2 % | 0.1 % |
//! | Glaso | Petrosky–Farshad | 17,914 | 20.2 % | 20.2 % | 0.0 % |
//! | Petrosky–Farshad | either | 16,041 | 0.0 % | 0.0 % | 0.0 % |
//! | Al-Marhoun | Vasquez–Beggs | 17,944 | 1.9 % | 0.0 % | 1.9 % |
//! | Al-Marhoun | Petrosky–Farshad | 17,944 | 0.0 % | 0.0 % | 0.0 % |
//!
//! Glaso's set is inconsistent below Pb for gas-rich oils (his data reach 2637 scf/STB): 1.2 %
//! of the tables with GOR under 1000 scf/STB, none under 650 scf/STB, most above 1200.
//!
//! The check reports these with their pressures; calibrating Bo to a measurement or choosing
//! `co_method = petrosky_farshad` (always positive) are the usual remedies.

use super::fluid::{Oil, OilModel};
use super::fvf::{apparent_compressibility, oil_density, total_fvf};
use crate::array::OnError;
use crate::error::{Error, Result};
use crate::gas::{Gas, LeeGonzalezEakin, ViscosityMethod as GasViscosityMethod, gas_density};
use crate::units::FT3_PER_BBL;
use crate::water::Water;
use rayon::prelude::*;

/// Column names (as in files and DataFrames) and units, in table order.
pub const COLUMNS: [(&str, &str); 13] = [
    ("p", "psia"),
    ("rs", "scf/STB"),
    ("bo", "rb/STB"),
    ("co", "1/psi"),
    ("oil_density", "lbm/ft3"),
    ("oil_viscosity", "cp"),
    ("bg", "rcf/scf"),
    ("z", "-"),
    ("gas_viscosity", "cp"),
    ("gas_density", "lbm/ft3"),
    ("bw", "rb/STB"),
    ("water_viscosity", "cp"),
    ("bt", "rb/STB"),
];

/// A grid pressure within this relative distance of Pb is taken as Pb itself.
pub const PB_SNAP_REL: f64 = 1e-9;

/// Which physical rule a table breaks.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Rule {
    /// Below Pb the total compressibility must stay positive: Bg dRs/dp > dBo/dp.
    NegativeTotalCompressibility,
    /// Above Pb Bo must fall as pressure rises.
    BoNotFallingAbovePb,
    /// Above Pb oil density must rise with pressure.
    DensityNotRisingAbovePb,
    /// A value is NaN or infinite, or a property that must be positive is not.
    NonPhysicalValue,
}

impl Rule {
    /// Short name used in Python and files.
    ///
    /// # Examples
    /// ```
    /// assert_eq!(stocktank::oil::table::Rule::BoNotFallingAbovePb.name(), "bo_not_falling_above_pb");
    /// ```
    pub fn name(self) -> &'static str {
        match self {
            Rule::NegativeTotalCompressibility => "negative_total_compressibility",
            Rule::BoNotFallingAbovePb => "bo_not_falling_above_pb",
            Rule::DensityNotRisingAbovePb => "density_not_rising_above_pb",
            Rule::NonPhysicalValue => "non_physical_value",
        }
    }
}

/// One violation of the consistency rules, at one pressure of the table.
#[derive(Debug, Clone, PartialEq)]
pub struct Violation {
    /// Pressure at which (or at the upper end of the interval over which) it happens, psia.
    pub p_psia: f64,
    /// The rule broken.
    pub rule: Rule,
    /// Human-readable numbers behind it.
    pub detail: String,
}

/// A black-oil table for one fluid (see the module docs for the columns and units).
#[derive(Debug, Clone, PartialEq)]
pub struct BlackOilTable {
    /// Bubble-point pressure, psia (one of the rows of `p`).
    pub pb: f64,
    /// Row index of Pb in the columns.
    pub pb_index: usize,
    /// Initial solution GOR, scf/STB.
    pub rsi: f64,
    /// Reservoir temperature, degF.
    pub temperature_f: f64,
    /// Pressure, psia, strictly increasing.
    pub p: Vec<f64>,
    /// Solution GOR, scf/STB.
    pub rs: Vec<f64>,
    /// Oil FVF, rb/STB.
    pub bo: Vec<f64>,
    /// Oil compressibility, 1/psi (apparent below Pb, undersaturated at and above).
    pub co: Vec<f64>,
    /// Oil density, lbm/ft3.
    pub oil_density: Vec<f64>,
    /// Oil viscosity, cp.
    pub oil_viscosity: Vec<f64>,
    /// Gas FVF, rcf/scf.
    pub bg: Vec<f64>,
    /// Gas deviation factor Z.
    pub z: Vec<f64>,
    /// Gas viscosity, cp.
    pub gas_viscosity: Vec<f64>,
    /// Gas density, lbm/ft3.
    pub gas_density: Vec<f64>,
    /// Water FVF, rb/STB.
    pub bw: Vec<f64>,
    /// Water viscosity, cp.
    pub water_viscosity: Vec<f64>,
    /// Total FVF, rb/STB.
    pub bt: Vec<f64>,
    /// Apparent (two-phase) oil compressibility just below Pb, 1/psi (for the check).
    pub co_below_pb: f64,
}

/// Validate a pressure grid: finite, positive, strictly increasing.
fn check_grid(pressures: &[f64]) -> Result<()> {
    if pressures.is_empty() {
        return Err(Error::Shape("`p`: the pressure grid is empty".into()));
    }
    for (i, &p) in pressures.iter().enumerate() {
        if !(p.is_finite() && p > 0.0) {
            return Err(Error::InvalidRecord {
                arg: "p".into(),
                row: i,
                message: format!("pressure {p} psia must be finite and > 0"),
            });
        }
        if i > 0 && p <= pressures[i - 1] {
            return Err(Error::InvalidRecord {
                arg: "p".into(),
                row: i,
                message: format!(
                    "pressures must increase strictly ({} then {p} psia)",
                    pressures[i - 1]
                ),
            });
        }
    }
    Ok(())
}

/// Merge Pb into a validated grid; returns the grid and Pb's row.
fn grid_with_pb(pressures: &[f64], pb: f64) -> (Vec<f64>, usize) {
    let mut grid = Vec::with_capacity(pressures.len() + 1);
    let mut pb_index = None;
    for &p in pressures {
        if pb_index.is_none() {
            if (p - pb).abs() <= PB_SNAP_REL * pb {
                pb_index = Some(grid.len());
                grid.push(pb);
                continue;
            }
            if p > pb {
                pb_index = Some(grid.len());
                grid.push(pb);
            }
        }
        grid.push(p);
    }
    let idx = match pb_index {
        Some(i) => i,
        None => {
            grid.push(pb);
            grid.len() - 1
        }
    };
    (grid, idx)
}

impl BlackOilTable {
    /// Build the table of `oil` on the pressure grid `pressures` (psia, strictly increasing);
    /// the bubble point is inserted (a grid point within 1e-9 relative of Pb is taken as Pb).
    ///
    /// # Formula
    /// ```text
    /// p <= Pb: Rs = Rs(p) (calibrated correlation), Bo = Bo(Rs),
    ///          co = (dRs/dp) (Bg - dBo/dRs) / Bo       (derivatives in closed form)
    /// p >  Pb: Rs = Rsi, Bo = Bob exp(-integral co dp), co = undersaturated correlation
    /// Bt = Bo + Bg (Rsi - Rs)
    /// ```
    /// At Pb itself `co` is the undersaturated value; the apparent value just below Pb is in
    /// [`BlackOilTable::co_below_pb`].
    ///
    /// # Arguments
    /// * `oil` - the fluid description.
    /// * `pressures` - pressure grid, psia, finite, > 0, strictly increasing.
    ///
    /// # Returns
    /// The table. Call [`BlackOilTable::check`] for its consistency.
    ///
    /// # Errors
    /// [`Error::InvalidRecord`] naming the row of a bad pressure; [`Error::Shape`] for an empty
    /// grid; the errors of [`Oil::model`], of the gas and of the water properties.
    ///
    /// # Examples
    /// ```
    /// use stocktank::oil::{BlackOilTable, Oil};
    /// let oil = Oil::new(35.0, 0.8, 600.0, 200.0).unwrap();
    /// let t = BlackOilTable::build(&oil, &[500.0, 1500.0, 2500.0, 3500.0, 4500.0]).unwrap();
    /// assert_eq!(t.p[t.pb_index], t.pb);
    /// assert_eq!(t.p.len(), 6);
    /// assert!(t.check().is_empty());
    /// ```
    ///
    /// # References
    /// See [`crate::oil::fvf`], [`crate::oil::viscosity`], [`crate::gas`] and [`crate::water`].
    pub fn build(oil: &Oil, pressures: &[f64]) -> Result<Self> {
        check_grid(pressures)?;
        let model = oil.model()?;
        let gas = Gas::new(oil.gas_sg)?;
        let water =
            Water::new(oil.salinity_wt_pct)?.with_standard_conditions(oil.standard_conditions)?;
        Self::build_with(&model, &gas, &water, pressures)
    }

    /// As [`BlackOilTable::build`] with a resolved oil model and explicit gas and water
    /// descriptions (e.g. a gas with impurities, or a gas-saturated brine).
    ///
    /// # Errors
    /// As [`BlackOilTable::build`].
    ///
    /// # Examples
    /// ```
    /// use stocktank::gas::Gas;
    /// use stocktank::oil::{BlackOilTable, Oil};
    /// use stocktank::water::Water;
    /// let oil = Oil::new(35.0, 0.8, 600.0, 200.0).unwrap();
    /// let gas = Gas::new(0.8).unwrap().with_impurities(0.05, 0.0, 0.01).unwrap();
    /// let t = BlackOilTable::build_with(&oil.model().unwrap(), &gas, &Water::new(5.0).unwrap(), &[1000.0, 4000.0]).unwrap();
    /// assert_eq!(t.p.len(), 3);
    /// ```
    pub fn build_with(
        model: &OilModel,
        gas: &Gas,
        water: &Water,
        pressures: &[f64],
    ) -> Result<Self> {
        check_grid(pressures)?;
        let oil = &model.oil;
        let t = oil.temperature_f;
        let sc = oil.standard_conditions;
        let (pb, rsi) = (model.pb, model.rsi);
        let (p, pb_index) = grid_with_pb(pressures, pb);
        let n = p.len();
        let mut out = Self {
            pb,
            pb_index,
            rsi,
            temperature_f: t,
            p: Vec::new(),
            rs: Vec::with_capacity(n),
            bo: Vec::with_capacity(n),
            co: Vec::with_capacity(n),
            oil_density: Vec::with_capacity(n),
            oil_viscosity: Vec::with_capacity(n),
            bg: Vec::with_capacity(n),
            z: Vec::with_capacity(n),
            gas_viscosity: Vec::with_capacity(n),
            gas_density: Vec::with_capacity(n),
            bw: Vec::with_capacity(n),
            water_viscosity: Vec::with_capacity(n),
            bt: Vec::with_capacity(n),
            co_below_pb: f64::NAN,
        };
        // Temperature-only parts of the gas correlations, once per table.
        let z_column = gas.isotherm(t).z_column(&p);
        let lge = match gas.viscosity_method() {
            GasViscosityMethod::LeeGonzalezEakin => {
                Some(LeeGonzalezEakin::new(t, gas.molar_mass())?)
            }
            _ => None,
        };
        // Below and at Pb, along the saturated curve: dBo/dp = dBo/dRs * dRs/dp.
        let apparent_co = |q: f64, rs: f64, bo: f64, bg_rb: f64| -> Result<f64> {
            let (drs, dbo) = model.saturated_slopes(q, rs, bo)?;
            apparent_compressibility(bo, dbo, bg_rb, drs)
        };
        for ((i, &pi), z) in p.iter().enumerate().zip(z_column) {
            let z = z?;
            let bg = crate::gas::bg(pi, t, z, &sc)?;
            let rho_g = gas_density(pi, t, z, gas.gas_sg())?;
            let mu_g = match &lge {
                Some(lge) => lge.viscosity(rho_g)?,
                None => gas.viscosity(pi, t)?,
            };
            let bg_rb = bg / FT3_PER_BBL;
            let (rs, bo, co, mu_o) = if i < pb_index {
                let rs = model.rs(pi)?;
                let bo = model.bo_saturated(rs)?;
                (
                    rs,
                    bo,
                    apparent_co(pi, rs, bo, bg_rb)?,
                    model.viscosity_saturated(rs)?,
                )
            } else {
                let bo = if i == pb_index {
                    model.report.bob
                } else {
                    model.bo(pi)?
                };
                if i == pb_index {
                    out.co_below_pb = apparent_co(pi, rsi, bo, bg_rb)?;
                }
                (rsi, bo, model.co_undersaturated(pi)?, model.viscosity(pi)?)
            };
            out.rs.push(rs);
            out.bo.push(bo);
            out.co.push(co);
            out.oil_density
                .push(oil_density(rs, bo, oil.gas_sg, oil.api, &sc)?);
            out.oil_viscosity.push(mu_o);
            out.bg.push(bg);
            out.z.push(z);
            out.gas_viscosity.push(mu_g);
            out.gas_density.push(rho_g);
            out.bw.push(water.bw(pi, t)?);
            out.water_viscosity.push(water.viscosity(pi, t)?);
            out.bt.push(total_fvf(bo, bg_rb, rsi, rs)?);
        }
        out.p = p;
        Ok(out)
    }

    /// A column by its name in [`COLUMNS`], or `None`.
    ///
    /// # Examples
    /// ```
    /// use stocktank::oil::{BlackOilTable, Oil};
    /// let t = BlackOilTable::build(&Oil::new(35.0, 0.8, 600.0, 200.0).unwrap(), &[1000.0]).unwrap();
    /// assert_eq!(t.column("rs").unwrap().len(), 2);
    /// assert!(t.column("nope").is_none());
    /// ```
    pub fn column(&self, name: &str) -> Option<&[f64]> {
        Some(match name {
            "p" => &self.p,
            "rs" => &self.rs,
            "bo" => &self.bo,
            "co" => &self.co,
            "oil_density" => &self.oil_density,
            "oil_viscosity" => &self.oil_viscosity,
            "bg" => &self.bg,
            "z" => &self.z,
            "gas_viscosity" => &self.gas_viscosity,
            "gas_density" => &self.gas_density,
            "bw" => &self.bw,
            "water_viscosity" => &self.water_viscosity,
            "bt" => &self.bt,
            _ => return None,
        })
    }

    /// Gas FVF in rb/scf (the `bg` column divided by 5.614583 ft3/bbl), as material balance
    /// wants it next to Bo and Rs.
    ///
    /// # Examples
    /// ```
    /// use stocktank::oil::{BlackOilTable, Oil};
    /// let t = BlackOilTable::build(&Oil::new(35.0, 0.8, 600.0, 200.0).unwrap(), &[1000.0]).unwrap();
    /// assert!((t.bg_rb_per_scf()[0] * 5.614583 - t.bg[0]).abs() < 1e-9);
    /// ```
    pub fn bg_rb_per_scf(&self) -> Vec<f64> {
        self.bg.iter().map(|b| b / FT3_PER_BBL).collect()
    }

    /// The consistency check. Below Pb, between consecutive rows, the total compressibility
    /// must stay positive, Bg dRs > dBo (Bg in rb/scf, averaged over the interval), and so
    /// must the apparent `co` of each row and just below Pb; above Pb, Bo must fall and oil
    /// density must rise from row to row; every value must be finite and FVFs, densities and
    /// viscosities positive.
    ///
    /// # Returns
    /// Every violation with its pressure, empty for a consistent table.
    ///
    /// # Examples
    /// ```
    /// use stocktank::oil::{BlackOilTable, Oil};
    /// let mut t = BlackOilTable::build(&Oil::new(35.0, 0.8, 600.0, 200.0).unwrap(), &[1000.0, 5000.0]).unwrap();
    /// assert!(t.check().is_empty());
    /// t.bo[2] = t.bo[1] + 0.01; // tamper: Bo rising above Pb
    /// assert_eq!(t.check()[0].p_psia, 5000.0);
    /// ```
    ///
    /// # References
    /// Coats, K.H., Thomas, L.K., Pierson, R.G. (1998). Compositional and black oil reservoir
    /// simulation. SPE Reservoir Evaluation & Engineering 1(4), 372–379 (the black-oil
    /// consistency condition Bg dRs/dp > dBo/dp below the bubble point).
    pub fn check(&self) -> Vec<Violation> {
        let mut v = Vec::new();
        let n = self.p.len();
        // One cheap pass over the columns first: the row-by-row value check below (which
        // keeps the violations in pressure order) runs only when some value is bad.
        let positive_columns = [
            &self.bo,
            &self.oil_density,
            &self.oil_viscosity,
            &self.bg,
            &self.z,
            &self.gas_viscosity,
            &self.gas_density,
            &self.bw,
            &self.water_viscosity,
            &self.bt,
        ];
        let all_good = [&self.rs, &self.co]
            .iter()
            .all(|c| c.iter().all(|x| x.is_finite()))
            && positive_columns
                .iter()
                .all(|c| c.iter().all(|&x| x.is_finite() && x > 0.0));
        for i in 0..n {
            if !all_good {
                let vals = [
                    ("rs", self.rs[i], false),
                    ("bo", self.bo[i], true),
                    ("co", self.co[i], false),
                    ("oil_density", self.oil_density[i], true),
                    ("oil_viscosity", self.oil_viscosity[i], true),
                    ("bg", self.bg[i], true),
                    ("z", self.z[i], true),
                    ("gas_viscosity", self.gas_viscosity[i], true),
                    ("gas_density", self.gas_density[i], true),
                    ("bw", self.bw[i], true),
                    ("water_viscosity", self.water_viscosity[i], true),
                    ("bt", self.bt[i], true),
                ];
                for (name, x, must_be_positive) in vals {
                    if !x.is_finite() || (must_be_positive && x <= 0.0) {
                        v.push(Violation {
                            p_psia: self.p[i],
                            rule: Rule::NonPhysicalValue,
                            detail: format!("{name} = {x}"),
                        });
                    }
                }
            }
            if i < self.pb_index && self.co[i] <= 0.0 {
                v.push(Violation {
                    p_psia: self.p[i],
                    rule: Rule::NegativeTotalCompressibility,
                    detail: format!("apparent co = {:e} 1/psi", self.co[i]),
                });
            }
            if i == 0 {
                continue;
            }
            if i <= self.pb_index {
                let bg_rb = 0.5 * (self.bg[i] + self.bg[i - 1]) / FT3_PER_BBL;
                let gas = bg_rb * (self.rs[i] - self.rs[i - 1]);
                let oil = self.bo[i] - self.bo[i - 1];
                if gas <= oil {
                    v.push(Violation {
                        p_psia: self.p[i],
                        rule: Rule::NegativeTotalCompressibility,
                        detail: format!(
                            "Bg dRs = {gas:e} <= dBo = {oil:e} rb/STB over {}-{} psia",
                            self.p[i - 1],
                            self.p[i]
                        ),
                    });
                }
            } else {
                if self.bo[i] >= self.bo[i - 1] {
                    v.push(Violation {
                        p_psia: self.p[i],
                        rule: Rule::BoNotFallingAbovePb,
                        detail: format!("Bo {} -> {} rb/STB", self.bo[i - 1], self.bo[i]),
                    });
                }
                if self.oil_density[i] <= self.oil_density[i - 1] {
                    v.push(Violation {
                        p_psia: self.p[i],
                        rule: Rule::DensityNotRisingAbovePb,
                        detail: format!(
                            "density {} -> {} lbm/ft3",
                            self.oil_density[i - 1],
                            self.oil_density[i]
                        ),
                    });
                }
            }
        }
        if self.co_below_pb.is_nan() || self.co_below_pb <= 0.0 {
            v.push(Violation {
                p_psia: self.pb,
                rule: Rule::NegativeTotalCompressibility,
                detail: format!("apparent co just below Pb = {:e} 1/psi", self.co_below_pb),
            });
        }
        v
    }
}

/// Tables for many fluids at once, in parallel on all cores, on one shared pressure grid.
///
/// # Arguments
/// * `oils` - the fluid descriptions.
/// * `pressures` - the pressure grid, psia, strictly increasing (each table gets its own Pb
///   inserted).
///
/// # Returns
/// One result per fluid, in order: a table, or the error of that fluid (so one bad well does
/// not fail the batch).
///
/// # Errors
/// [`Error::InvalidRecord`] / [`Error::Shape`] for a bad grid (before any work).
///
/// # Examples
/// ```
/// use stocktank::oil::{build_tables, Oil};
/// let oils = [Oil::new(35.0, 0.8, 600.0, 200.0).unwrap(), Oil::new(25.0, 0.7, 300.0, 150.0).unwrap()];
/// let tables = build_tables(&oils, &[1000.0, 3000.0]).unwrap();
/// assert!(tables.iter().all(|t| t.is_ok()));
/// ```
pub fn build_tables(oils: &[Oil], pressures: &[f64]) -> Result<Vec<Result<BlackOilTable>>> {
    check_grid(pressures)?;
    Ok(oils
        .par_iter()
        .map(|o| BlackOilTable::build(o, pressures))
        .collect())
}

/// Many tables in long format: the columns of every table stacked, with the fluid's index in
/// `well`.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct LongTable {
    /// Index of the fluid (into the input slice) of each row.
    pub well: Vec<u64>,
    /// Whether the row is the fluid's bubble point.
    pub is_pb: Vec<bool>,
    /// The 13 columns of [`COLUMNS`], in that order.
    pub columns: Vec<Vec<f64>>,
    /// Bubble point of each fluid, psia (NaN where it failed).
    pub pb: Vec<f64>,
    /// Initial GOR of each fluid, scf/STB (NaN where it failed).
    pub rsi: Vec<f64>,
    /// Consistency violations: (fluid index, violation).
    pub violations: Vec<(u64, Violation)>,
    /// Fluids that failed (with `OnError::Coerce`): (index, message). Their rows carry the
    /// user's pressures with NaN properties.
    pub errors: Vec<(u64, String)>,
}

/// Build tables for many fluids in parallel and stack them in long format, with the
/// consistency check of each.
///
/// # Errors
/// A bad grid ([`Error::InvalidRecord`] / [`Error::Shape`]); with [`OnError::Raise`] the error
/// of the first failing fluid, as [`Error::InvalidRecord`] naming its row in `oils`.
///
/// # Examples
/// ```
/// use stocktank::array::OnError;
/// use stocktank::oil::{table::build_long, Oil};
/// let oils = [Oil::new(35.0, 0.8, 600.0, 200.0).unwrap(), Oil::new(25.0, 0.7, 300.0, 150.0).unwrap()];
/// let long = build_long(&oils, &[1000.0, 3000.0], OnError::Raise).unwrap();
/// assert_eq!(long.well.len(), 6);
/// assert_eq!(long.columns[0].len(), 6);
/// ```
pub fn build_long(oils: &[Oil], pressures: &[f64], on_error: OnError) -> Result<LongTable> {
    build_long_results(oils.iter().map(|o| Ok(*o)).collect(), pressures, on_error)
}

/// As [`build_long`] for fluids whose descriptions may themselves have failed to build (e.g.
/// one row of input arrays with an impossible value): a failed description is raised as
/// given (with `OnError::Raise`, the lowest failing row) or recorded in
/// [`LongTable::errors`] (with `OnError::Coerce`).
///
/// # Errors
/// As [`build_long`].
///
/// # Examples
/// ```
/// use stocktank::array::OnError;
/// use stocktank::oil::{table::build_long_results, Oil};
/// let oils = vec![Oil::new(35.0, 0.8, 600.0, 200.0), Oil::new(-1.0, 0.8, 600.0, 200.0)];
/// let long = build_long_results(oils, &[1000.0], OnError::Coerce).unwrap();
/// assert_eq!(long.errors[0].0, 1);
/// ```
pub fn build_long_results(
    oils: Vec<Result<Oil>>,
    pressures: &[f64],
    on_error: OnError,
) -> Result<LongTable> {
    build_long_results_with(oils, pressures, on_error, |_, o| {
        BlackOilTable::build(o, pressures)
    })
}

/// As [`build_long_results`], each table built by `build(k, oil)` for the fluid of row `k`
/// (e.g. [`BlackOilTable::build_with`] and the well's own gas and water descriptions).
///
/// # Errors
/// As [`build_long`]; an error of `build` is handled like a failed description.
///
/// # Examples
/// ```
/// use stocktank::array::OnError;
/// use stocktank::gas::Gas;
/// use stocktank::oil::{table::build_long_results_with, BlackOilTable, Oil};
/// use stocktank::water::Water;
/// let oils = vec![Oil::new(35.0, 0.8, 600.0, 200.0), Oil::new(25.0, 0.7, 300.0, 150.0)];
/// let gas = Gas::new(0.8).unwrap().with_impurities(0.1, 0.0, 0.0).unwrap();
/// let long = build_long_results_with(oils, &[1000.0], OnError::Raise, |_, o| {
///     BlackOilTable::build_with(&o.model()?, &gas, &Water::new(3.0)?, &[1000.0])
/// })
/// .unwrap();
/// assert_eq!(long.pb.len(), 2);
/// ```
pub fn build_long_results_with<F>(
    oils: Vec<Result<Oil>>,
    pressures: &[f64],
    on_error: OnError,
    build: F,
) -> Result<LongTable>
where
    F: Fn(usize, &Oil) -> Result<BlackOilTable> + Sync,
{
    check_grid(pressures)?;
    if on_error == OnError::Raise {
        if let Some(e) = oils.iter().find_map(|o| o.as_ref().err()) {
            return Err(e.clone());
        }
    }
    let tables: Vec<Result<BlackOilTable>> = oils
        .into_par_iter()
        .enumerate()
        .map(|(k, o)| o.and_then(|o| build(k, &o)))
        .collect();
    let mut out = LongTable {
        columns: vec![Vec::new(); COLUMNS.len()],
        ..LongTable::default()
    };
    let rows: usize = tables
        .iter()
        .map(|t| t.as_ref().map(|t| t.p.len()).unwrap_or(pressures.len()))
        .sum();
    out.well.reserve(rows);
    out.is_pb.reserve(rows);
    for c in &mut out.columns {
        c.reserve(rows);
    }
    let checks: Vec<Vec<Violation>> = tables
        .par_iter()
        .map(|t| t.as_ref().map(|t| t.check()).unwrap_or_default())
        .collect();
    for (k, (t, viol)) in tables.into_iter().zip(checks).enumerate() {
        let w = k as u64;
        match t {
            Ok(t) => {
                out.well.extend(std::iter::repeat_n(w, t.p.len()));
                out.is_pb.extend((0..t.p.len()).map(|i| i == t.pb_index));
                for (c, (name, _)) in out.columns.iter_mut().zip(COLUMNS) {
                    c.extend_from_slice(t.column(name).unwrap_or(&[]));
                }
                out.pb.push(t.pb);
                out.rsi.push(t.rsi);
                out.violations.extend(viol.into_iter().map(|v| (w, v)));
            }
            Err(e) => match on_error {
                OnError::Raise => {
                    return Err(Error::InvalidRecord {
                        arg: "oil".into(),
                        row: k,
                        message: e.to_string(),
                    });
                }
                OnError::Coerce => {
                    out.well.extend(std::iter::repeat_n(w, pressures.len()));
                    out.is_pb
                        .extend(std::iter::repeat_n(false, pressures.len()));
                    out.columns[0].extend_from_slice(pressures);
                    for c in out.columns.iter_mut().skip(1) {
                        c.extend(std::iter::repeat_n(f64::NAN, pressures.len()));
                    }
                    out.pb.push(f64::NAN);
                    out.rsi.push(f64::NAN);
                    out.errors.push((w, e.to_string()));
                }
            },
        }
    }
    Ok(out)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn grid_insertion() {
        assert_eq!(grid_with_pb(&[1.0, 3.0], 2.0), (vec![1.0, 2.0, 3.0], 1));
        assert_eq!(grid_with_pb(&[1.0, 3.0], 4.0), (vec![1.0, 3.0, 4.0], 2));
        assert_eq!(grid_with_pb(&[1.0, 3.0], 0.5), (vec![0.5, 1.0, 3.0], 0));
        assert_eq!(
            grid_with_pb(&[1.0, 2.0 * (1.0 + 1e-12), 3.0], 2.0),
            (vec![1.0, 2.0, 3.0], 1)
        );
    }

    #[test]
    fn bad_grid_names_row() {
        let e = check_grid(&[1.0, 3.0, 2.0]).unwrap_err();
        assert!(e.to_string().contains("row 2"), "{e}");
    }
}
