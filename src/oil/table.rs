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
//!
//! # Speed
//! What depends on the fluid only (the oil model's prepared correlations, the
//! Dranchuk–Abou-Kassem isotherm, the gas viscosity's temperature terms, the Bg and density
//! factors, the water's isotherm) is set up once per fluid. With the default correlation set
//! (Standing Pb/Rs and Bo, Vasquez–Beggs or Petrosky–Farshad co, Beggs–Robinson viscosity,
//! Lee–Gonzalez–Eakin gas viscosity) a table is then filled column by column: each quantity
//! is a loop over fixed-size lane arrays (8 rows per step) of the rows below Pb, of the rows
//! above it or of all rows, with the branch-free [`crate::fastmath::exp`] /
//! [`crate::fastmath::ln`], compiled a second time for AVX2 + FMA and chosen at run time
//! (the crate's `simd` module); each power law costs one logarithm and one exponential per
//! row, and the formulas are those of the scalar kernels (the prepared forms are generic over the
//! exponential and logarithm). The Pb row, other correlation sets and any table whose
//! values leave the conditions under which the checked methods return them without an
//! error go row by row through the checked methods, which name the bad value. The two
//! paths agree to 2.3e-15 relative in every column (unit test). [`build_long_results`]
//! allocates the long columns once, fills each fluid's rows in place (in parallel over
//! fluids, with per-thread scratch buffers) and checks them while they are in cache (by
//! branch-free folds; the row-by-row description of a violation only where one exists).
//!
//! Measured (`benches/bench_blackoil.py`, 10,000 tables of 50 pressures, one core, on the
//! project's 2-core machine shared with other builds, load average 3 to 7): 4.2x the
//! numpy-vectorised version of the same correlations, about 220 ns per row (2.8x before
//! the column kernel, load 5), 70-85x numpy called once per well. `perf` of
//! `examples/profile_black_oil.rs` (build only, one thread) puts the column kernel at about
//! 20 % of the time, the Dranchuk–Abou-Kassem isotherm at 12 %, the check and glue at
//! 10 %, and the operating system at 45 %: page faults, zeroing and unmapping of the fresh
//! long columns (113 bytes per row: 13 f64 values, the well index and the Pb flag). That
//! memory traffic, not the arithmetic, is now the floor; 20x the numpy version (about 65 ns
//! per row) is out of reach while every call hands out newly allocated arrays.

use super::fluid::{Oil, OilModel, StandingForms};
use super::fvf::{
    OilDensity, apparent_compressibility, apparent_compressibility_unchecked, oil_density,
    total_fvf, total_fvf_unchecked,
};
use super::{CoMethod, sg_from_api};
use crate::array::OnError;
use crate::error::{Error, Result};
use crate::fastmath;
use crate::gas::{
    Gas, GasIsothermVolumetrics, LeeGonzalezEakin, ViscosityMethod as GasViscosityMethod,
};
use crate::units::FT3_PER_BBL;
use crate::water::{Water, WaterIsotherm};
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
    /// Rs must not fall as pressure rises (gas only leaves solution as pressure falls).
    RsFallingWithPressure,
    /// Bg must fall as pressure rises (a gas is compressed).
    BgNotFallingWithPressure,
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
            Rule::RsFallingWithPressure => "rs_falling_with_pressure",
            Rule::BgNotFallingWithPressure => "bg_not_falling_with_pressure",
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

/// Where Pb goes in a validated grid: its row, and whether a grid point within
/// [`PB_SNAP_REL`] of Pb is taken as Pb (replaced) rather than Pb inserted before it.
fn pb_slot(pressures: &[f64], pb: f64) -> (usize, bool) {
    for (i, &p) in pressures.iter().enumerate() {
        if (p - pb).abs() <= PB_SNAP_REL * pb {
            return (i, true);
        }
        if p > pb {
            return (i, false);
        }
    }
    (pressures.len(), false)
}

/// Write the grid with Pb at its slot into `out` (length: the grid's, plus one unless a point
/// was snapped to Pb).
fn write_grid(pressures: &[f64], pb: f64, (idx, snapped): (usize, bool), out: &mut [f64]) {
    out[..idx].copy_from_slice(&pressures[..idx]);
    out[idx] = pb;
    let rest = if snapped { idx + 1 } else { idx };
    out[idx + 1..].copy_from_slice(&pressures[rest..]);
}

/// Merge Pb into a validated grid; returns the grid and Pb's row.
#[cfg(test)]
fn grid_with_pb(pressures: &[f64], pb: f64) -> (Vec<f64>, usize) {
    let slot = pb_slot(pressures, pb);
    let mut grid = vec![0.0; pressures.len() + usize::from(!slot.1)];
    write_grid(pressures, pb, slot, &mut grid);
    (grid, slot.0)
}

/// Buffers one thread reuses from table to table (no allocation per table).
#[derive(Default)]
struct Scratch {
    ppr: Vec<f64>,
    z: Vec<Result<f64>>,
}

/// Fill the 13 columns of one table in place ([`COLUMNS`] order; `cols[0]`, the pressures
/// with Pb at row `pb_index`, is already written). Returns the apparent co just below Pb.
///
/// The one evaluation behind [`BlackOilTable::build_with`] and [`build_long_results`]:
/// everything that depends on the fluid only (the oil model's prepared correlations, the
/// gas isotherm, the gas viscosity's temperature terms, the water's isotherm) is set up once.
/// With the default correlation set the columns are then computed column by column
/// ([`fill_columns`]); any other set, or a table whose values leave the ranges where the
/// column forms hold, goes row by row through the checked methods ([`fill_rows`]), which
/// also report the error of a bad value.
fn fill(
    model: &OilModel,
    gas: &Gas,
    water: &Water,
    pb_index: usize,
    cols: &mut [&mut [f64]; 13],
    scratch: &mut Scratch,
) -> Result<f64> {
    let t = model.oil.temperature_f;
    gas.isotherm(t)
        .z_column_into(cols[0], &mut scratch.ppr, &mut scratch.z);
    if fill_columns(model, gas, water, pb_index, cols, &scratch.z) {
        // The bubble-point row (both branches meet there) and the apparent co just below it.
        fill_rows(
            model,
            gas,
            water,
            pb_index,
            cols,
            &scratch.z,
            pb_index..pb_index + 1,
        )
    } else {
        let n = cols[0].len();
        fill_rows(model, gas, water, pb_index, cols, &scratch.z, 0..n)
    }
}

/// The prepared per-table forms the column kernel evaluates.
struct ColumnForms<'a> {
    oil: StandingForms<'a>,
    model: &'a OilModel,
    lge: LeeGonzalezEakin,
    gas_pv: GasIsothermVolumetrics,
    water: WaterIsotherm,
    rho_o: OilDensity,
}

/// The column-wise evaluation of one table with the default correlation set (Standing Rs
/// and Bo, a valid undersaturated co coefficient, Lee–Gonzalez–Eakin gas viscosity): each
/// quantity is a straight loop over the rows below Pb, over the rows above it, or over all
/// rows, with the branch-free exponential and logarithm ([`fastmath::Lanes`]) so that the
/// compiler vectorises it (AVX2 when the processor has it, [`crate::simd`]). Every value
/// comes from the same prepared form as the checked row path (to a few units in the last
/// place: the two exponentials differ by that).
///
/// Returns `false`, leaving the columns to [`fill_rows`], when the set is not the default
/// one or when some value is outside the conditions under which the checked path would
/// return it without an error (a failed or non-positive Z, Rs < 0, Standing's group F <= 0,
/// a non-positive or non-finite Bo, Bw or water viscosity).
fn fill_columns(
    model: &OilModel,
    gas: &Gas,
    water: &Water,
    pb_index: usize,
    cols: &mut [&mut [f64]; 13],
    z_col: &[Result<f64>],
) -> bool {
    let oil = &model.oil;
    let t = oil.temperature_f;
    let Some(standing) = model.standing_forms() else {
        return false;
    };
    if gas.viscosity_method() != GasViscosityMethod::LeeGonzalezEakin
        || !(oil.gas_sg > 0.0 && oil.api > 0.0)
    {
        return false;
    }
    let (Ok(lge), Ok(gas_pv), Ok(water_t), Ok(oil_sg)) = (
        LeeGonzalezEakin::new(t, gas.molar_mass()),
        GasIsothermVolumetrics::new(t, gas.gas_sg(), &oil.standard_conditions),
        water.isotherm(t),
        sg_from_api(oil.api),
    ) else {
        return false;
    };
    for (zi, r) in cols[7].iter_mut().zip(z_col) {
        match r {
            Ok(z) if *z > 0.0 && z.is_finite() => *zi = *z,
            _ => return false,
        }
    }
    let forms = ColumnForms {
        oil: standing,
        model,
        lge,
        gas_pv,
        water: water_t,
        rho_o: OilDensity::new(oil_sg, oil.gas_sg, &oil.standard_conditions),
    };
    columns_kernel(&forms, pb_index, cols)
}

crate::simd::multiversion! {
    fn columns_kernel(forms: &ColumnForms<'_>, pb_index: usize, cols: &mut [&mut [f64]; 13]) -> bool => columns_body
}

/// Lanes per step of the column kernel: one AVX2 register of f64. A table has only a few
/// dozen rows on each side of Pb, so the loops run over fixed-size lane arrays (the
/// compiler turns each lane loop into straight vector code) rather than over the columns
/// themselves (whose vectorised loops would leave most of a short column to their scalar
/// remainder). Measured with `examples/profile_black_oil.rs`.
const LANES: usize = 8;

/// Lanes `s..s + m` of the column `c` (`m` <= [`LANES`]), the missing lanes set to `fill`.
#[inline(always)]
fn load(c: &[f64], s: usize, m: usize, fill: f64) -> [f64; LANES] {
    let mut a = [fill; LANES];
    if m == LANES {
        a.copy_from_slice(&c[s..s + LANES]);
    } else {
        a[..m].copy_from_slice(&c[s..s + m]);
    }
    a
}

/// Store the first `m` lanes of `v` into `c[s..s + m]`.
#[inline(always)]
fn store(c: &mut [f64], s: usize, m: usize, v: &[f64; LANES]) {
    if m == LANES {
        c[s..s + LANES].copy_from_slice(v);
    } else {
        c[s..s + m].copy_from_slice(&v[..m]);
    }
}

/// The loops of [`fill_columns`]; returns whether every value met the conditions. Each
/// range of rows goes [`LANES`] rows per step; in a last, partial step the missing lanes
/// repeat the step's first pressure (a valid input: they compute valid values, dropped).
#[inline(always)]
fn columns_body(f: &ColumnForms<'_>, k: usize, cols: &mut [&mut [f64]; 13]) -> bool {
    type M = fastmath::Lanes;
    let [
        p,
        rs_c,
        bo_c,
        co_c,
        rho_o_c,
        mu_o_c,
        bg_c,
        z_c,
        mu_g_c,
        rho_g_c,
        bw_c,
        mu_w_c,
        bt_c,
    ] = cols;
    let p: &[f64] = p;
    let n = p.len();
    let rsi = f.model.rsi;
    let mut ok = [true; LANES];
    // Gas, every row: the real-gas law and Lee–Gonzalez–Eakin.
    let mut s = 0;
    while s < n {
        let m = LANES.min(n - s);
        let pl = load(p, s, m, p[s]);
        let z = load(z_c, s, m, 1.0);
        let mut bg = [0.0; LANES];
        let mut rho = [0.0; LANES];
        let mut mu = [0.0; LANES];
        for l in 0..LANES {
            bg[l] = f.gas_pv.bg(pl[l], z[l]);
            rho[l] = f.gas_pv.density(pl[l], z[l]);
            mu[l] = f.lge.at_checked_density_with::<M>(rho[l]);
        }
        store(bg_c, s, m, &bg);
        store(rho_g_c, s, m, &rho);
        store(mu_g_c, s, m, &mu);
        s += m;
    }
    // Water, every row.
    f.water.bw_column(p, bw_c);
    f.water.viscosity_column(p, mu_w_c);
    for (b, mu) in bw_c.iter().zip(mu_w_c.iter()) {
        ok[0] &= (*b > 0.0) & (*mu > 0.0);
    }
    // Oil below Pb, along the saturated curve.
    let (below, above) = (k.min(n), (k + 1).min(n));
    let mut s = 0;
    while s < below {
        let m = LANES.min(below - s);
        let pl = load(p, s, m, p[s]);
        let bg = load(bg_c, s, m, 1.0);
        // One short loop per quantity: each is turned into straight vector code.
        let [mut rs, mut bo, mut co, mut rho, mut mu, mut bt] = [[0.0; LANES]; 6];
        for l in 0..LANES {
            rs[l] = f.oil.rs::<M>(pl[l]);
        }
        // The correlations, then their calibration (a select that keeps its loop scalar;
        // cheap without the exponentials).
        for l in 0..LANES {
            bo[l] = f.oil.bo_correlation::<M>(rs[l]);
        }
        for l in 0..LANES {
            mu[l] = f.oil.viscosity_correlation::<M>(rs[l]);
        }
        for l in 0..LANES {
            bo[l] = f.oil.calibrated_bo(rs[l], bo[l]);
            mu[l] = f.oil.calibrated_viscosity(rs[l], mu[l]);
        }
        for l in 0..LANES {
            let (r, b) = (rs[l], bo[l]);
            let (drs, dbo) = f.oil.slopes(pl[l], r, b);
            let bg_rb = bg[l] / FT3_PER_BBL;
            ok[l] &= (r >= 0.0) & (f.oil.group(r) > 0.0) & (b > 0.0) & (b < f64::INFINITY);
            co[l] = apparent_compressibility_unchecked(b, dbo, bg_rb, drs);
            rho[l] = f.rho_o.at(r, b);
            bt[l] = total_fvf_unchecked(b, bg_rb, rsi, r);
        }
        store(rs_c, s, m, &rs);
        store(bo_c, s, m, &bo);
        store(co_c, s, m, &co);
        store(rho_o_c, s, m, &rho);
        store(mu_o_c, s, m, &mu);
        store(bt_c, s, m, &bt);
        s += m;
    }
    // Oil above Pb: Rs = Rsi, one logarithm of p for Bo and viscosity (the co method as a
    // constant in each copy of the loop).
    let oil_cols = [
        &mut **rs_c,
        &mut **bo_c,
        &mut **co_c,
        &mut **rho_o_c,
        &mut **mu_o_c,
        &mut **bt_c,
    ];
    let ok_above = match f.model.oil.methods.co {
        CoMethod::VasquezBeggs => {
            above_pb_rows(f, CoMethod::VasquezBeggs, p, above, bg_c, oil_cols)
        }
        CoMethod::PetroskyFarshad => {
            above_pb_rows(f, CoMethod::PetroskyFarshad, p, above, bg_c, oil_cols)
        }
    };
    ok.iter().chain(&ok_above).all(|&o| o)
}

/// The rows of one table above Pb (from row `above` on) for the co method `co`: the
/// oil columns `[rs, bo, co, oil_density, oil_viscosity, bt]`; returns the lane flags of
/// the conditions (as [`columns_body`]).
#[inline(always)]
fn above_pb_rows(
    f: &ColumnForms<'_>,
    method: CoMethod,
    p: &[f64],
    above: usize,
    bg_c: &[f64],
    oil_cols: [&mut [f64]; 6],
) -> [bool; LANES] {
    type M = fastmath::Lanes;
    let [rs_c, bo_c, co_c, rho_o_c, mu_o_c, bt_c] = oil_cols;
    let n = p.len();
    let rsi = f.model.rsi;
    let mut ok = [true; LANES];
    let mut s = above;
    while s < n {
        let m = LANES.min(n - s);
        let pl = load(p, s, m, p[s]);
        let bg = load(bg_c, s, m, 1.0);
        let rs = [rsi; LANES];
        let [mut bo, mut co, mut rho, mut mu, mut bt] = [[0.0; LANES]; 5];
        let mut ln_p = [0.0; LANES];
        for l in 0..LANES {
            ln_p[l] = <M as fastmath::Elementary>::ln(pl[l]);
        }
        for l in 0..LANES {
            bo[l] = f.model.bo_above_pb_with::<M>(method, ln_p[l]);
        }
        for l in 0..LANES {
            mu[l] = f.model.viscosity_above_pb_with::<M>(pl[l], ln_p[l]);
        }
        for l in 0..LANES {
            let b = bo[l];
            ok[l] &= (b > 0.0) & (b < f64::INFINITY);
            co[l] = f.model.co_above_pb_with::<M>(method, pl[l]);
            rho[l] = f.rho_o.at(rsi, b);
            bt[l] = total_fvf_unchecked(b, bg[l] / FT3_PER_BBL, rsi, rsi);
        }
        store(rs_c, s, m, &rs);
        store(bo_c, s, m, &bo);
        store(co_c, s, m, &co);
        store(rho_o_c, s, m, &rho);
        store(mu_o_c, s, m, &mu);
        store(bt_c, s, m, &bt);
        s += m;
    }
    ok
}

/// The checked row-by-row evaluation of rows `rows` of one table (see [`fill`]): every
/// correlation through its checked method, so that a bad value stops with the error that
/// names it. Returns the apparent co just below Pb (NaN when `pb_index` is not in `rows`).
#[allow(clippy::too_many_arguments)]
fn fill_rows(
    model: &OilModel,
    gas: &Gas,
    water: &Water,
    pb_index: usize,
    cols: &mut [&mut [f64]; 13],
    z_col: &[Result<f64>],
    rows: std::ops::Range<usize>,
) -> Result<f64> {
    let oil = &model.oil;
    let t = oil.temperature_f;
    let sc = oil.standard_conditions;
    let rsi = model.rsi;
    let [
        p,
        rs_c,
        bo_c,
        co_c,
        rho_o_c,
        mu_o_c,
        bg_c,
        z_c,
        mu_g_c,
        rho_g_c,
        bw_c,
        mu_w_c,
        bt_c,
    ] = cols;
    let p: &[f64] = p;
    // Temperature-only parts of the gas correlations, once per table.
    let lge = match gas.viscosity_method() {
        GasViscosityMethod::LeeGonzalezEakin => Some(LeeGonzalezEakin::new(t, gas.molar_mass())?),
        _ => None,
    };
    let fast_above = model.has_co_coefficient();
    let gas_pv = GasIsothermVolumetrics::new(t, gas.gas_sg(), &sc)?;
    let rho_o = OilDensity::new(sg_from_api(oil.api)?, oil.gas_sg, &sc);
    // Rs, Bo and gas_sg were validated with the model; oil_density then cannot fail on them.
    let density_checked = oil.gas_sg > 0.0 && oil.api > 0.0;
    let mut co_below_pb = f64::NAN;
    // Below and at Pb, along the saturated curve: dBo/dp = dBo/dRs * dRs/dp.
    let apparent_co = |q: f64, rs: f64, bo: f64, bg_rb: f64| -> Result<f64> {
        let (drs, dbo) = model.saturated_slopes(q, rs, bo)?;
        apparent_compressibility(bo, dbo, bg_rb, drs)
    };
    for i in rows {
        let pi = p[i];
        let z = match &z_col[i] {
            Ok(z) => *z,
            Err(e) => return Err(e.clone()),
        };
        if !(z > 0.0 && z.is_finite()) {
            // Let the checked function name the bad value.
            crate::gas::bg(pi, t, z, &sc)?;
        }
        let bg = gas_pv.bg(pi, z);
        let rho_g = gas_pv.density(pi, z);
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
        } else if i == pb_index {
            let bo = model.report.bob;
            co_below_pb = apparent_co(pi, rsi, bo, bg_rb)?;
            (rsi, bo, model.co_undersaturated(pi)?, model.viscosity(pi)?)
        } else if fast_above && pi.is_finite() {
            // Above Pb (pi > Pb on a strictly increasing grid): ln p once for Bo and mu.
            let ln_p = fastmath::ln_scalar(pi);
            (
                rsi,
                model.bo_above_pb(pi, ln_p),
                model.co_undersaturated(pi)?,
                model.viscosity_above_pb(pi, ln_p),
            )
        } else {
            (
                rsi,
                model.bo(pi)?,
                model.co_undersaturated(pi)?,
                model.viscosity(pi)?,
            )
        };
        rs_c[i] = rs;
        bo_c[i] = bo;
        co_c[i] = co;
        rho_o_c[i] = if density_checked && rs >= 0.0 && bo > 0.0 {
            rho_o.at(rs, bo)
        } else {
            oil_density(rs, bo, oil.gas_sg, oil.api, &sc)?
        };
        mu_o_c[i] = mu_o;
        bg_c[i] = bg;
        z_c[i] = z;
        mu_g_c[i] = mu_g;
        rho_g_c[i] = rho_g;
        bw_c[i] = water.bw(pi, t)?;
        mu_w_c[i] = water.viscosity(pi, t)?;
        bt_c[i] = total_fvf(bo, bg_rb, rsi, rs)?;
    }
    Ok(co_below_pb)
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
        let (gas, water) = oil.gas_and_water()?;
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
        let (pb, rsi) = (model.pb, model.rsi);
        let slot = pb_slot(pressures, pb);
        let n = pressures.len() + usize::from(!slot.1);
        let mut c: [Vec<f64>; 13] = std::array::from_fn(|_| vec![0.0; n]);
        write_grid(pressures, pb, slot, &mut c[0]);
        let co_below_pb = {
            let mut cols = c.each_mut().map(|v| v.as_mut_slice());
            fill(
                model,
                gas,
                water,
                slot.0,
                &mut cols,
                &mut Scratch::default(),
            )?
        };
        let [
            p,
            rs,
            bo,
            co,
            oil_density,
            oil_viscosity,
            bg,
            z,
            gas_viscosity,
            gas_density,
            bw,
            water_viscosity,
            bt,
        ] = c;
        Ok(Self {
            pb,
            pb_index: slot.0,
            rsi,
            temperature_f: model.oil.temperature_f,
            p,
            rs,
            bo,
            co,
            oil_density,
            oil_viscosity,
            bg,
            z,
            gas_viscosity,
            gas_density,
            bw,
            water_viscosity,
            bt,
            co_below_pb,
        })
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
        check_columns(&TableRef {
            pb: self.pb,
            pb_index: self.pb_index,
            co_below_pb: self.co_below_pb,
            p: &self.p,
            rs: &self.rs,
            bo: &self.bo,
            co: &self.co,
            oil_density: &self.oil_density,
            oil_viscosity: &self.oil_viscosity,
            bg: &self.bg,
            z: &self.z,
            gas_viscosity: &self.gas_viscosity,
            gas_density: &self.gas_density,
            bw: &self.bw,
            water_viscosity: &self.water_viscosity,
            bt: &self.bt,
        })
    }
}

/// Borrowed columns of one table (of a [`BlackOilTable`] or of one well's rows in a
/// [`LongTable`]), for [`check_columns`].
struct TableRef<'a> {
    pb: f64,
    pb_index: usize,
    co_below_pb: f64,
    p: &'a [f64],
    rs: &'a [f64],
    bo: &'a [f64],
    co: &'a [f64],
    oil_density: &'a [f64],
    oil_viscosity: &'a [f64],
    bg: &'a [f64],
    z: &'a [f64],
    gas_viscosity: &'a [f64],
    gas_density: &'a [f64],
    bw: &'a [f64],
    water_viscosity: &'a [f64],
    bt: &'a [f64],
}

impl<'a> TableRef<'a> {
    /// The 13 columns in [`COLUMNS`] order.
    fn from_columns(cols: [&'a [f64]; 13], pb: f64, pb_index: usize, co_below_pb: f64) -> Self {
        let [
            p,
            rs,
            bo,
            co,
            oil_density,
            oil_viscosity,
            bg,
            z,
            gas_viscosity,
            gas_density,
            bw,
            water_viscosity,
            bt,
        ] = cols;
        Self {
            pb,
            pb_index,
            co_below_pb,
            p,
            rs,
            bo,
            co,
            oil_density,
            oil_viscosity,
            bg,
            z,
            gas_viscosity,
            gas_density,
            bw,
            water_viscosity,
            bt,
        }
    }
}

crate::simd::multiversion! {
    fn table_is_clean(c: &TableRef<'_>) -> bool => table_is_clean_body
}

/// Whether the table breaks none of the rules of [`check_columns`] (the common case), as
/// branch-free folds that vectorise; compiled also for AVX2 (the baseline instruction set
/// has no 64-bit integer compare, and these folds took 5 % of a many-well build there).
#[inline(always)]
fn table_is_clean_body(c: &TableRef<'_>) -> bool {
    let n = c.p.len();
    let positive_columns = [
        &c.bo,
        &c.oil_density,
        &c.oil_viscosity,
        &c.bg,
        &c.z,
        &c.gas_viscosity,
        &c.gas_density,
        &c.bw,
        &c.water_viscosity,
        &c.bt,
    ];
    let finite = |c: &[f64]| c.iter().fold(true, |ok, x| ok & x.is_finite());
    let positive = |c: &[f64]| {
        c.iter()
            .fold(true, |ok, &x| ok & (x > 0.0) & (x < f64::INFINITY))
    };
    let all_good = [&c.rs, &c.co].iter().fold(true, |ok, c| ok & finite(c))
        & positive_columns.iter().fold(true, |ok, c| ok & positive(c));
    let k = c.pb_index.min(n);
    let mut broken = c.co_below_pb.is_nan() || c.co_below_pb <= 0.0;
    broken |= c.co[..k].iter().fold(false, |b, &x| b | (x <= 0.0));
    for i in 1..(k + 1).min(n) {
        let bg_rb = 0.5 * (c.bg[i] + c.bg[i - 1]) / FT3_PER_BBL;
        let gas = bg_rb * (c.rs[i] - c.rs[i - 1]);
        let oil = c.bo[i] - c.bo[i - 1];
        broken |= gas <= oil;
    }
    for i in (k + 1).max(1)..n {
        broken |= (c.bo[i] >= c.bo[i - 1]) | (c.oil_density[i] <= c.oil_density[i - 1]);
    }
    all_good & !broken
}

/// The consistency check of [`BlackOilTable::check`] on borrowed columns: at once empty
/// for a clean table ([`table_is_clean`]); otherwise every violation, row by row in
/// pressure order.
fn check_columns(c: &TableRef<'_>) -> Vec<Violation> {
    let mut v = Vec::new();
    if table_is_clean(c) {
        return v;
    }
    let n = c.p.len();
    for i in 0..n {
        let vals = [
            ("rs", c.rs[i], false),
            ("bo", c.bo[i], true),
            ("co", c.co[i], false),
            ("oil_density", c.oil_density[i], true),
            ("oil_viscosity", c.oil_viscosity[i], true),
            ("bg", c.bg[i], true),
            ("z", c.z[i], true),
            ("gas_viscosity", c.gas_viscosity[i], true),
            ("gas_density", c.gas_density[i], true),
            ("bw", c.bw[i], true),
            ("water_viscosity", c.water_viscosity[i], true),
            ("bt", c.bt[i], true),
        ];
        for (name, x, must_be_positive) in vals {
            if !x.is_finite() || (must_be_positive && x <= 0.0) {
                v.push(Violation {
                    p_psia: c.p[i],
                    rule: Rule::NonPhysicalValue,
                    detail: format!("{name} = {x}"),
                });
            }
        }
        if i < c.pb_index && c.co[i] <= 0.0 {
            v.push(Violation {
                p_psia: c.p[i],
                rule: Rule::NegativeTotalCompressibility,
                detail: format!("apparent co = {:e} 1/psi", c.co[i]),
            });
        }
        if i == 0 {
            continue;
        }
        if i <= c.pb_index {
            let bg_rb = 0.5 * (c.bg[i] + c.bg[i - 1]) / FT3_PER_BBL;
            let gas = bg_rb * (c.rs[i] - c.rs[i - 1]);
            let oil = c.bo[i] - c.bo[i - 1];
            if gas <= oil {
                v.push(Violation {
                    p_psia: c.p[i],
                    rule: Rule::NegativeTotalCompressibility,
                    detail: format!(
                        "Bg dRs = {gas:e} <= dBo = {oil:e} rb/STB over {}-{} psia",
                        c.p[i - 1],
                        c.p[i]
                    ),
                });
            }
        } else {
            if c.bo[i] >= c.bo[i - 1] {
                v.push(Violation {
                    p_psia: c.p[i],
                    rule: Rule::BoNotFallingAbovePb,
                    detail: format!("Bo {} -> {} rb/STB", c.bo[i - 1], c.bo[i]),
                });
            }
            if c.oil_density[i] <= c.oil_density[i - 1] {
                v.push(Violation {
                    p_psia: c.p[i],
                    rule: Rule::DensityNotRisingAbovePb,
                    detail: format!(
                        "density {} -> {} lbm/ft3",
                        c.oil_density[i - 1],
                        c.oil_density[i]
                    ),
                });
            }
        }
    }
    if c.co_below_pb.is_nan() || c.co_below_pb <= 0.0 {
        v.push(Violation {
            p_psia: c.pb,
            rule: Rule::NegativeTotalCompressibility,
            detail: format!("apparent co just below Pb = {:e} 1/psi", c.co_below_pb),
        });
    }
    v
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

/// The value columns of a [`LongTable`], stored in one block, column after column: one
/// allocation instead of thirteen, so that its memory is almost entirely on huge pages where
/// the system has them (see the crate's `pages` module; with one allocation per column about
/// half of each stayed on 4 KiB pages, and their page faults took a fifth of a many-well
/// build). `columns[j]` is column `j`, a slice.
///
/// # Examples
/// ```
/// use stocktank::array::OnError;
/// use stocktank::oil::{table::build_long, Oil};
/// let oils = [Oil::new(35.0, 0.8, 600.0, 200.0).unwrap()];
/// let c = build_long(&oils, &[1000.0, 3000.0], OnError::Raise).unwrap().columns;
/// assert_eq!((c.len(), c.rows()), (13, 3)); // the grid and Pb
/// assert!(c[0].contains(&1000.0) && c[0].contains(&3000.0)); // column 0: pressures
/// assert_eq!(c.iter().count(), 13);
/// let bo = c[2].to_vec();
/// let (block, rows) = c.into_block(); // column after column
/// assert_eq!(&block[2 * rows..3 * rows], &bo[..]);
/// ```
#[derive(Debug, Clone, PartialEq, Default)]
pub struct Columns {
    data: Vec<f64>,
    count: usize,
    rows: usize,
}

impl Columns {
    /// `count` columns of `rows` zeros.
    fn zeros(count: usize, rows: usize) -> Self {
        Self {
            data: crate::pages::zeroed(count * rows),
            count,
            rows,
        }
    }

    /// The number of columns.
    pub fn len(&self) -> usize {
        self.count
    }

    /// Whether there are no columns.
    pub fn is_empty(&self) -> bool {
        self.count == 0
    }

    /// The number of rows (values per column).
    pub fn rows(&self) -> usize {
        self.rows
    }

    /// The columns in order, as slices.
    pub fn iter(&self) -> impl Iterator<Item = &[f64]> {
        (0..self.count).map(|j| &self[j])
    }

    /// The columns in order, as mutable slices (`len()` of them, also with no rows).
    fn split_mut(&mut self) -> Vec<&mut [f64]> {
        let mut rest = self.data.as_mut_slice();
        (0..self.count)
            .map(|_| {
                let (head, tail) = std::mem::take(&mut rest).split_at_mut(self.rows);
                rest = tail;
                head
            })
            .collect()
    }

    /// The block (column after column) and the number of rows, without a copy.
    pub fn into_block(self) -> (Vec<f64>, usize) {
        (self.data, self.rows)
    }
}

impl std::ops::Index<usize> for Columns {
    type Output = [f64];
    fn index(&self, j: usize) -> &[f64] {
        &self.data[j * self.rows..(j + 1) * self.rows]
    }
}

impl std::ops::IndexMut<usize> for Columns {
    fn index_mut(&mut self, j: usize) -> &mut [f64] {
        &mut self.data[j * self.rows..(j + 1) * self.rows]
    }
}

/// Many tables in long format: the columns of every table stacked, with the fluid's index in
/// `well`.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct LongTable {
    /// Index of the fluid (into the input slice) of each row.
    pub well: Vec<u64>,
    /// Whether the row is the fluid's bubble point.
    pub is_pb: Vec<bool>,
    /// The 13 columns of [`COLUMNS`], in that order (`columns[j]` is column `j`).
    pub columns: Columns,
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
    build_long_results_with(oils, pressures, on_error, |_, o| o.gas_and_water())
}

/// As [`build_long_results`], the gas and water of the fluid of row `k` given by
/// `fluids(k, oil)` (e.g. each well's own gas description with its impurities) instead of
/// [`Oil::gas_and_water`]; each table is the one [`BlackOilTable::build_with`] gives.
///
/// # Errors
/// As [`build_long`]; an error of `fluids` is handled like a failed description.
///
/// # Examples
/// ```
/// use stocktank::array::OnError;
/// use stocktank::gas::Gas;
/// use stocktank::oil::{table::build_long_results_with, Oil};
/// use stocktank::water::Water;
/// let oils = vec![Oil::new(35.0, 0.8, 600.0, 200.0), Oil::new(25.0, 0.7, 300.0, 150.0)];
/// let gas = Gas::new(0.8).unwrap().with_impurities(0.1, 0.0, 0.0).unwrap();
/// let long = build_long_results_with(oils, &[1000.0], OnError::Raise, |_, _| {
///     Ok((gas, Water::new(3.0)?))
/// })
/// .unwrap();
/// assert_eq!(long.pb.len(), 2);
/// ```
pub fn build_long_results_with<F>(
    oils: Vec<Result<Oil>>,
    pressures: &[f64],
    on_error: OnError,
    fluids: F,
) -> Result<LongTable>
where
    F: Fn(usize, &Oil) -> Result<(Gas, Water)> + Sync,
{
    check_grid(pressures)?;
    if on_error == OnError::Raise {
        if let Some(e) = oils.iter().find_map(|o| o.as_ref().err()) {
            return Err(e.clone());
        }
    }
    // 1. Each fluid's model, gas and water (per-fluid work only) and its rows.
    let setups: Vec<Result<Setup>> = oils
        .into_par_iter()
        .enumerate()
        .with_min_len(64)
        .map(|(k, o)| {
            o.and_then(|o| {
                let (gas, water) = fluids(k, &o)?;
                Setup::new(&o, gas, water, pressures)
            })
        })
        .collect();
    let rows: Vec<usize> = setups
        .iter()
        .map(|s| s.as_ref().map_or(pressures.len(), |s| s.rows))
        .collect();
    let total: usize = rows.iter().sum();
    // 2. The long columns, allocated once, cut into one disjoint piece per fluid.
    let mut columns = Columns::zeros(COLUMNS.len(), total);
    let mut pieces: Vec<[&mut [f64]; 13]> = Vec::with_capacity(rows.len());
    {
        let mut rest = columns.split_mut();
        for &r in &rows {
            pieces.push(std::array::from_fn(|j| {
                let (head, tail) = std::mem::take(&mut rest[j]).split_at_mut(r);
                rest[j] = tail;
                head
            }));
        }
    }
    // 3. Every table filled in place and checked while its rows are in cache, in parallel
    //    over fluids in chunks; a failed fluid gets the user's pressures and NaN.
    let outcomes: Vec<std::result::Result<Vec<Violation>, Error>> = setups
        .par_iter()
        .zip(pieces.into_par_iter())
        .with_min_len(16)
        .map_init(Scratch::default, |scratch, (setup, mut cols)| {
            let out = setup
                .as_ref()
                .map_err(Clone::clone)
                .and_then(|s| s.fill(pressures, &mut cols, scratch));
            if out.is_err() && cols[0].len() == pressures.len() {
                cols[0].copy_from_slice(pressures);
                for c in cols.iter_mut().skip(1) {
                    c.fill(f64::NAN);
                }
            }
            out
        })
        .collect();
    if on_error == OnError::Raise {
        if let Some((k, e)) = outcomes
            .iter()
            .enumerate()
            .find_map(|(k, o)| o.as_ref().err().map(|e| (k, e)))
        {
            return Err(Error::InvalidRecord {
                arg: "oil".into(),
                row: k,
                message: e.to_string(),
            });
        }
    }
    // A fluid whose model built but whose table failed has one row too many: rare, so the
    // columns are compacted only then.
    let short = |k: usize| outcomes[k].is_err() && rows[k] != pressures.len();
    if (0..rows.len()).any(short) {
        let kept = |k: usize| if short(k) { pressures.len() } else { rows[k] };
        let mut compact = Columns::zeros(COLUMNS.len(), (0..rows.len()).map(kept).sum());
        for j in 0..COLUMNS.len() {
            let (mut from, mut to) = (0, 0);
            for (k, &r) in rows.iter().enumerate() {
                let piece = &mut compact[j][to..to + kept(k)];
                if !short(k) {
                    piece.copy_from_slice(&columns[j][from..from + r]);
                } else if j == 0 {
                    piece.copy_from_slice(pressures);
                } else {
                    piece.fill(f64::NAN);
                }
                (from, to) = (from + r, to + kept(k));
            }
        }
        columns = compact;
    }
    // 4. Well index, Pb flags and the per-fluid scalars.
    let mut out = LongTable {
        columns,
        ..LongTable::default()
    };
    let final_rows: Vec<usize> = (0..rows.len())
        .map(|k| {
            if outcomes[k].is_err() {
                pressures.len()
            } else {
                rows[k]
            }
        })
        .collect();
    let total: usize = final_rows.iter().sum();
    out.well = crate::pages::zeroed(total);
    out.is_pb = vec![false; total];
    let mut start = 0;
    for (k, (setup, outcome)) in setups.iter().zip(outcomes).enumerate() {
        let w = k as u64;
        let r = final_rows[k];
        out.well[start..start + r].fill(w);
        // A failed setup is an Err outcome too (see step 3).
        match (setup, outcome.as_ref()) {
            (Ok(s), Ok(viol)) => {
                out.is_pb[start + s.pb_slot.0] = true;
                out.pb.push(s.model.pb);
                out.rsi.push(s.model.rsi);
                out.violations.extend(viol.iter().map(|v| (w, v.clone())));
            }
            (Err(e), _) | (Ok(_), Err(e)) => {
                out.pb.push(f64::NAN);
                out.rsi.push(f64::NAN);
                out.errors.push((w, e.to_string()));
            }
        }
        start += r;
    }
    Ok(out)
}

/// One fluid of a many-well build: its model, gas and water, and where Pb goes in the grid.
struct Setup {
    model: OilModel,
    gas: Gas,
    water: Water,
    pb_slot: (usize, bool),
    rows: usize,
}

impl Setup {
    fn new(oil: &Oil, gas: Gas, water: Water, pressures: &[f64]) -> Result<Self> {
        let model = oil.model()?;
        let pb_slot = pb_slot(pressures, model.pb);
        let rows = pressures.len() + usize::from(!pb_slot.1);
        Ok(Self {
            model,
            gas,
            water,
            pb_slot,
            rows,
        })
    }

    /// Write the table into `cols` (this fluid's rows) and check it.
    fn fill(
        &self,
        pressures: &[f64],
        cols: &mut [&mut [f64]; 13],
        scratch: &mut Scratch,
    ) -> Result<Vec<Violation>> {
        write_grid(pressures, self.model.pb, self.pb_slot, cols[0]);
        let co_below_pb = fill(
            &self.model,
            &self.gas,
            &self.water,
            self.pb_slot.0,
            cols,
            scratch,
        )?;
        let view: [&[f64]; 13] = std::array::from_fn(|j| &*cols[j]);
        Ok(check_columns(&TableRef::from_columns(
            view,
            self.model.pb,
            self.pb_slot.0,
            co_below_pb,
        )))
    }
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

    /// The column kernel against the checked row path on the same tables: every column
    /// within 1e-13 relative (co below Pb, a difference of two terms, within 1e-13 of its
    /// table's largest |co|), over random oils inside Standing's (1947) ranges with and
    /// without calibration, both co methods, and grids with Pb inside, below and above.
    #[test]
    fn columns_agree_with_the_checked_rows() {
        use crate::oil::{Calibration, CoMethod, Methods};
        let mut next = crate::testing::uniform_stream(0x2545_f491_4f6c_dd1d);
        let mut worst = [0.0f64; 13];
        let mut tables = 0;
        for case in 0..600 {
            let mut oil = Oil::new(
                16.5 + 47.0 * next(),
                0.59 + 0.36 * next(),
                20.0 + 1400.0 * next(),
                100.0 + 158.0 * next(),
            )
            .unwrap();
            if case % 3 == 1 {
                let pb = oil.model().unwrap().pb * (0.8 + 0.4 * next());
                oil = oil
                    .with_measured_bubble_point(pb)
                    .unwrap()
                    .with_calibration(Calibration {
                        bob: Some(oil.model().unwrap().report.bob * (1.0 + 0.05 * next())),
                        mu_ob_cp: Some(0.3 + 2.0 * next()),
                    })
                    .unwrap();
            }
            if case % 2 == 1 {
                oil = oil.with_methods(Methods {
                    co: CoMethod::PetroskyFarshad,
                    ..Methods::default()
                });
            }
            let Ok(model) = oil.model() else { continue };
            let (gas, water) = oil.gas_and_water().unwrap();
            let top = [3000.0, 7000.0, 12000.0][case % 3];
            let grid: Vec<f64> = (0..37)
                .map(|i| 15.0 + (top - 15.0) * i as f64 / 36.0)
                .collect();
            let slot = pb_slot(&grid, model.pb);
            let n = grid.len() + usize::from(!slot.1);
            let mut a: [Vec<f64>; 13] = std::array::from_fn(|_| vec![0.0; n]);
            write_grid(&grid, model.pb, slot, &mut a[0]);
            let mut b = a.clone();
            let mut scratch = Scratch::default();
            gas.isotherm(oil.temperature_f)
                .z_column_into(&a[0], &mut scratch.ppr, &mut scratch.z);
            let mut ca = a.each_mut().map(|v| v.as_mut_slice());
            if !fill_columns(&model, &gas, &water, slot.0, &mut ca, &scratch.z) {
                continue;
            }
            let co_a = fill_rows(
                &model,
                &gas,
                &water,
                slot.0,
                &mut ca,
                &scratch.z,
                slot.0..slot.0 + 1,
            );
            let mut cb = b.each_mut().map(|v| v.as_mut_slice());
            let co_b = fill_rows(&model, &gas, &water, slot.0, &mut cb, &scratch.z, 0..n);
            assert_eq!(co_a.unwrap().to_bits(), co_b.unwrap().to_bits());
            tables += 1;
            for j in 0..13 {
                let scale = a[j].iter().fold(0.0f64, |m, x| m.max(x.abs()));
                for i in 0..n {
                    let (x, y) = (a[j][i], b[j][i]);
                    let d = if j == 3 && i < slot.0 {
                        (x - y).abs() / scale
                    } else {
                        ((x - y) / y).abs()
                    };
                    worst[j] = worst[j].max(d);
                    assert!(
                        d <= 1e-13,
                        "case {case}, {} row {i}: {x} vs {y}",
                        COLUMNS[j].0
                    );
                }
            }
        }
        assert!(tables > 300, "{tables}");
        eprintln!("largest relative difference columns vs rows: {worst:?}");
    }

    #[test]
    fn bad_grid_names_row() {
        let e = check_grid(&[1.0, 3.0, 2.0]).unwrap_err();
        assert!(e.to_string().contains("row 2"), "{e}");
    }
}
