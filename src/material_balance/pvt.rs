//! The PVT input of material balance: a table of black-oil properties against pressure,
//! interpolated by monotone piecewise-cubic Hermite curves.

use crate::error::{Error, Result};
use crate::oil::{Rule, Violation};

/// Black-oil properties at one pressure, interpolated from a [`PvtTable`].
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PvtPoint {
    /// Pressure, psia.
    pub p: f64,
    /// Oil formation volume factor, rb/STB.
    pub bo: f64,
    /// Solution gas-oil ratio, scf/STB.
    pub rs: f64,
    /// Gas formation volume factor, rb/scf.
    pub bg: f64,
    /// Water formation volume factor, rb/STB (1.0 when the table has no Bw column).
    pub bw: f64,
    /// Oil viscosity, cp (NaN when the table has none).
    pub mu_o: f64,
    /// Gas viscosity, cp (NaN when the table has none).
    pub mu_g: f64,
    /// dBo/dp, rb/STB/psi.
    pub dbo_dp: f64,
    /// dRs/dp, scf/STB/psi.
    pub drs_dp: f64,
    /// dBg/dp, rb/scf/psi.
    pub dbg_dp: f64,
}

/// A monotone piecewise-cubic Hermite interpolant (Fritsch & Carlson 1980): no overshoot
/// between table rows, exact at the rows, continuous first derivative.
#[derive(Debug, Clone, PartialEq)]
pub(super) struct Pchip {
    y: Vec<f64>,
    d: Vec<f64>,
}

impl Pchip {
    pub(super) fn new(x: &[f64], y: &[f64]) -> Self {
        let n = x.len();
        let mut d = vec![0.0; n];
        if n == 2 {
            let s = (y[1] - y[0]) / (x[1] - x[0]);
            d = vec![s, s];
        } else {
            let h: Vec<f64> = (0..n - 1).map(|k| x[k + 1] - x[k]).collect();
            let del: Vec<f64> = (0..n - 1).map(|k| (y[k + 1] - y[k]) / h[k]).collect();
            for k in 1..n - 1 {
                if del[k - 1] * del[k] > 0.0 {
                    let w1 = 2.0 * h[k] + h[k - 1];
                    let w2 = h[k] + 2.0 * h[k - 1];
                    d[k] = (w1 + w2) / (w1 / del[k - 1] + w2 / del[k]);
                }
            }
            // One-sided three-point ends, shape preserving (Moler 2004, Numerical Computing
            // with MATLAB, section 3.4).
            let end = |h0: f64, h1: f64, d0: f64, d1: f64| {
                let mut e = ((2.0 * h0 + h1) * d0 - h0 * d1) / (h0 + h1);
                if e * d0 <= 0.0 {
                    e = 0.0;
                } else if d0 * d1 <= 0.0 && e.abs() > 3.0 * d0.abs() {
                    e = 3.0 * d0;
                }
                e
            };
            d[0] = end(h[0], h[1], del[0], del[1]);
            d[n - 1] = end(h[n - 2], h[n - 3], del[n - 2], del[n - 3]);
        }
        Self { y: y.to_vec(), d }
    }

    /// Value and derivative on segment k at x.
    #[inline]
    pub(super) fn eval(&self, xs: &[f64], k: usize, x: f64) -> (f64, f64) {
        let h = xs[k + 1] - xs[k];
        let t = (x - xs[k]) / h;
        let (y0, y1, d0, d1) = (self.y[k], self.y[k + 1], self.d[k], self.d[k + 1]);
        let t2 = t * t;
        let t3 = t2 * t;
        let v = (2.0 * t3 - 3.0 * t2 + 1.0) * y0
            + (t3 - 2.0 * t2 + t) * h * d0
            + (-2.0 * t3 + 3.0 * t2) * y1
            + (t3 - t2) * h * d1;
        let dv = (6.0 * t2 - 6.0 * t) * y0 / h
            + (3.0 * t2 - 4.0 * t + 1.0) * d0
            + (-6.0 * t2 + 6.0 * t) * y1 / h
            + (3.0 * t2 - 2.0 * t) * d1;
        (v, dv)
    }
}

/// A black-oil PVT table: columns against pressure, as plain arrays.
///
/// Pressures ascend strictly; Bo in rb/STB, Rs in scf/STB, Bg in rb/scf, optional Bw in
/// rb/STB and optional viscosities of oil and gas in cp (needed only by the forecast).
/// Between rows every column is interpolated by a monotone cubic (Fritsch & Carlson 1980),
/// which is exact at the rows and never overshoots them. Outside the table's pressure
/// range nothing is extrapolated: it is an error.
///
/// # Examples
/// ```
/// use stocktank::material_balance::PvtTable;
/// let t = PvtTable::new(
///     vec![1000.0, 2000.0, 3000.0],
///     vec![1.20, 1.30, 1.40],
///     vec![300.0, 500.0, 700.0],
///     vec![0.0026, 0.0013, 0.0009],
/// ).unwrap();
/// let q = t.at(2000.0).unwrap();
/// assert_eq!(q.bo, 1.30);
/// assert!(t.at(3500.0).is_err());
/// ```
///
/// # References
/// Fritsch, F.N., Carlson, R.E. (1980). Monotone piecewise cubic interpolation. SIAM Journal
/// on Numerical Analysis 17(2), 238–246.
#[derive(Debug, Clone, PartialEq)]
pub struct PvtTable {
    p: Vec<f64>,
    bo: Pchip,
    rs: Pchip,
    bg: Pchip,
    bw: Option<Pchip>,
    mu_o: Option<Pchip>,
    mu_g: Option<Pchip>,
}

fn column(name: &'static str, v: &[f64], n: usize) -> Result<()> {
    if v.len() != n {
        return Err(Error::Shape(format!(
            "PVT column `{name}` has {} rows but `p` has {n}",
            v.len()
        )));
    }
    for (i, &x) in v.iter().enumerate() {
        let ok = x.is_finite() && (x > 0.0 || (name == "rs" && x == 0.0));
        if !ok {
            return Err(Error::InvalidRecord {
                arg: name.to_string(),
                row: i,
                message: format!("value {x} must be finite and > 0"),
            });
        }
    }
    Ok(())
}

impl PvtTable {
    /// Build a table from pressure (psia, strictly ascending), Bo (rb/STB), Rs (scf/STB,
    /// >= 0) and Bg (rb/scf).
    ///
    /// # Errors
    /// [`Error::Shape`] for columns of different lengths or fewer than 2 rows;
    /// [`Error::InvalidRecord`] naming the column and row of a non-positive or non-finite
    /// value or of a pressure not above the previous row's.
    ///
    /// # Examples
    /// ```
    /// use stocktank::material_balance::PvtTable;
    /// let bad = PvtTable::new(vec![2000.0, 1000.0], vec![1.3, 1.2], vec![500.0, 300.0], vec![0.0013, 0.0026]);
    /// assert!(bad.unwrap_err().to_string().contains("row 1"));
    /// ```
    pub fn new(p: Vec<f64>, bo: Vec<f64>, rs: Vec<f64>, bg: Vec<f64>) -> Result<Self> {
        let n = p.len();
        if n < 2 {
            return Err(Error::Shape(format!(
                "a PVT table needs at least 2 rows, got {n}"
            )));
        }
        column("p", &p, n)?;
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
        column("bo", &bo, n)?;
        column("rs", &rs, n)?;
        column("bg", &bg, n)?;
        Ok(Self {
            bo: Pchip::new(&p, &bo),
            rs: Pchip::new(&p, &rs),
            bg: Pchip::new(&p, &bg),
            bw: None,
            mu_o: None,
            mu_g: None,
            p,
        })
    }

    /// Add a water formation volume factor column, rb/STB.
    ///
    /// # Errors
    /// As [`PvtTable::new`] for the `bw` column.
    ///
    /// # Examples
    /// ```
    /// use stocktank::material_balance::PvtTable;
    /// let t = PvtTable::new(vec![1000.0, 2000.0], vec![1.2, 1.3], vec![300.0, 500.0], vec![0.0026, 0.0013])
    ///     .unwrap().with_bw(vec![1.03, 1.02]).unwrap();
    /// assert_eq!(t.at(1000.0).unwrap().bw, 1.03);
    /// ```
    pub fn with_bw(mut self, bw: Vec<f64>) -> Result<Self> {
        column("bw", &bw, self.p.len())?;
        self.bw = Some(Pchip::new(&self.p, &bw));
        Ok(self)
    }

    /// Add oil and gas viscosity columns, cp (needed by [`super::muskat_forecast`]).
    ///
    /// # Errors
    /// As [`PvtTable::new`] for the `mu_o` and `mu_g` columns.
    ///
    /// # Examples
    /// ```
    /// use stocktank::material_balance::PvtTable;
    /// let t = PvtTable::new(vec![1000.0, 2000.0], vec![1.2, 1.3], vec![300.0, 500.0], vec![0.0026, 0.0013])
    ///     .unwrap().with_viscosities(vec![1.1, 0.9], vec![0.013, 0.016]).unwrap();
    /// assert_eq!(t.at(2000.0).unwrap().mu_g, 0.016);
    /// ```
    pub fn with_viscosities(mut self, mu_o: Vec<f64>, mu_g: Vec<f64>) -> Result<Self> {
        column("mu_o", &mu_o, self.p.len())?;
        column("mu_g", &mu_g, self.p.len())?;
        self.mu_o = Some(Pchip::new(&self.p, &mu_o));
        self.mu_g = Some(Pchip::new(&self.p, &mu_g));
        Ok(self)
    }

    /// The consistency check of the table's rows, for lab or hand-made tables: every
    /// violation, interval by interval in pressure order (empty for a consistent table).
    /// The table is still usable; material balance on an inconsistent table gives
    /// unphysical expansion terms.
    ///
    /// # Formula
    /// Over each interval between two consecutive rows `i - 1` and `i`:
    /// ```text
    /// Rs[i] >= Rs[i-1]                                  (rs_falling_with_pressure)
    /// Bg[i] <  Bg[i-1]                                  (bg_not_falling_with_pressure)
    /// Rs rising:  Bg_mid (Rs[i] - Rs[i-1]) > Bo[i] - Bo[i-1]   (negative_total_compressibility)
    /// Rs constant (undersaturated): Bo[i] < Bo[i-1]      (bo_not_falling_above_pb)
    /// ```
    /// with Bg_mid the mean of the two rows' Bg (rb/scf). The third rule is the black-oil
    /// total compressibility below the bubble point, Bg dRs/dp > dBo/dp (common practice,
    /// no source; the same rules as [`crate::oil::BlackOilTable::check`]).
    ///
    /// # Returns
    /// The violations, each at the upper pressure of its interval (psia) with the numbers
    /// behind it.
    ///
    /// # Examples
    /// ```
    /// use stocktank::material_balance::PvtTable;
    /// use stocktank::oil::Rule;
    /// // Rs falls between the last two rows: a typing error in a lab table.
    /// let t = PvtTable::new(vec![1000.0, 2000.0, 3000.0], vec![1.20, 1.30, 1.40],
    ///     vec![300.0, 500.0, 450.0], vec![0.0026, 0.0013, 0.0009]).unwrap();
    /// let v = t.check();
    /// assert_eq!(v[0].rule, Rule::RsFallingWithPressure);
    /// assert_eq!(v[0].p_psia, 3000.0);
    /// ```
    pub fn check(&self) -> Vec<Violation> {
        let (p, bo, rs, bg) = (&self.p, &self.bo.y, &self.rs.y, &self.bg.y);
        let mut v = Vec::new();
        let mut push = |i: usize, rule: Rule, detail: String| {
            v.push(Violation {
                p_psia: p[i],
                rule,
                detail,
            })
        };
        for i in 1..p.len() {
            let over = format!("over {}-{} psia", p[i - 1], p[i]);
            let (d_rs, d_bo) = (rs[i] - rs[i - 1], bo[i] - bo[i - 1]);
            if d_rs < 0.0 {
                let d = format!("Rs {} -> {} scf/STB {over}", rs[i - 1], rs[i]);
                push(i, Rule::RsFallingWithPressure, d);
            }
            if bg[i] >= bg[i - 1] {
                let d = format!("Bg {} -> {} rb/scf {over}", bg[i - 1], bg[i]);
                push(i, Rule::BgNotFallingWithPressure, d);
            }
            if d_rs > 0.0 {
                let gas = 0.5 * (bg[i] + bg[i - 1]) * d_rs;
                if gas <= d_bo {
                    let d = format!("Bg dRs = {gas:e} <= dBo = {d_bo:e} rb/STB {over}");
                    push(i, Rule::NegativeTotalCompressibility, d);
                }
            } else if d_rs == 0.0 && d_bo >= 0.0 {
                let d = format!("Bo {} -> {} rb/STB at constant Rs {over}", bo[i - 1], bo[i]);
                push(i, Rule::BoNotFallingAbovePb, d);
            }
        }
        v
    }

    /// Lowest and highest pressure of the table, psia.
    ///
    /// # Examples
    /// ```
    /// use stocktank::material_balance::PvtTable;
    /// let t = PvtTable::new(vec![1000.0, 2000.0], vec![1.2, 1.3], vec![300.0, 500.0], vec![0.0026, 0.0013]).unwrap();
    /// assert_eq!(t.pressure_range(), (1000.0, 2000.0));
    /// ```
    pub fn pressure_range(&self) -> (f64, f64) {
        (self.p[0], self.p[self.p.len() - 1])
    }

    /// The table's pressure column, psia.
    ///
    /// # Examples
    /// ```
    /// use stocktank::material_balance::PvtTable;
    /// let t = PvtTable::new(vec![1000.0, 2000.0], vec![1.2, 1.3], vec![300.0, 500.0], vec![0.0026, 0.0013]).unwrap();
    /// assert_eq!(t.pressures(), &[1000.0, 2000.0]);
    /// ```
    pub fn pressures(&self) -> &[f64] {
        &self.p
    }

    /// True when the table has viscosity columns.
    ///
    /// # Examples
    /// ```
    /// use stocktank::material_balance::PvtTable;
    /// let t = PvtTable::new(vec![1000.0, 2000.0], vec![1.2, 1.3], vec![300.0, 500.0], vec![0.0026, 0.0013]).unwrap();
    /// assert!(!t.has_viscosities());
    /// ```
    pub fn has_viscosities(&self) -> bool {
        self.mu_o.is_some()
    }

    /// Properties at pressure `p` (psia), interpolated.
    ///
    /// # Errors
    /// [`Error::OutOfRange`] when `p` lies outside the table (no extrapolation);
    /// [`Error::InvalidArgument`] naming `p` when it is NaN.
    ///
    /// # Examples
    /// ```
    /// use stocktank::material_balance::PvtTable;
    /// let t = PvtTable::new(vec![1000.0, 2000.0], vec![1.2, 1.3], vec![300.0, 500.0], vec![0.0026, 0.0013]).unwrap();
    /// assert!((t.at(1500.0).unwrap().rs - 400.0).abs() < 1e-12);
    /// ```
    pub fn at(&self, p: f64) -> Result<PvtPoint> {
        let k = interval(&self.p, p, "PVT table")?;
        let xs = &self.p;
        let (bo, dbo) = self.bo.eval(xs, k, p);
        let (rs, drs) = self.rs.eval(xs, k, p);
        let (bg, dbg) = self.bg.eval(xs, k, p);
        let bw = self.bw.as_ref().map_or(1.0, |c| c.eval(xs, k, p).0);
        let mu_o = self.mu_o.as_ref().map_or(f64::NAN, |c| c.eval(xs, k, p).0);
        let mu_g = self.mu_g.as_ref().map_or(f64::NAN, |c| c.eval(xs, k, p).0);
        Ok(PvtPoint {
            p,
            bo,
            rs,
            bg,
            bw,
            mu_o,
            mu_g,
            dbo_dp: dbo,
            drs_dp: drs,
            dbg_dp: dbg,
        })
    }

    /// Properties at each pressure of a history; an uncovered pressure is an error naming
    /// its row.
    ///
    /// # Errors
    /// [`Error::InvalidRecord`] naming `p` and the row whose pressure the table does not
    /// cover.
    ///
    /// # Examples
    /// ```
    /// use stocktank::material_balance::PvtTable;
    /// let t = PvtTable::new(vec![1000.0, 2000.0], vec![1.2, 1.3], vec![300.0, 500.0], vec![0.0026, 0.0013]).unwrap();
    /// let e = t.at_history(&[2000.0, 1500.0, 900.0]).unwrap_err();
    /// assert!(e.to_string().contains("row 2"));
    /// ```
    pub fn at_history(&self, p: &[f64]) -> Result<Vec<PvtPoint>> {
        p.iter()
            .enumerate()
            .map(|(i, &pi)| {
                self.at(pi).map_err(|e| Error::InvalidRecord {
                    arg: "p".into(),
                    row: i,
                    message: match e {
                        Error::OutOfRange(m) => m,
                        other => other.to_string(),
                    },
                })
            })
            .collect()
    }

    /// Two-phase formation volume factor Bt = Bo + (Rsi - Rs) Bg, rb/STB, at `p` for an
    /// initial pressure `p_initial` (psia).
    ///
    /// # Errors
    /// As [`PvtTable::at`].
    ///
    /// # Examples
    /// ```
    /// use stocktank::material_balance::PvtTable;
    /// let t = PvtTable::new(vec![1000.0, 2000.0], vec![1.2, 1.3], vec![300.0, 500.0], vec![0.0026, 0.0013]).unwrap();
    /// assert!((t.bt(1000.0, 2000.0).unwrap() - (1.2 + 200.0 * 0.0026)).abs() < 1e-12);
    /// ```
    pub fn bt(&self, p: f64, p_initial: f64) -> Result<f64> {
        let q = self.at(p)?;
        let qi = self.at(p_initial)?;
        Ok(q.bo + (qi.rs - q.rs) * q.bg)
    }
}

/// The interval `k` of an increasing pressure grid (at least two rows) that holds `p`:
/// `grid[k] <= p <= grid[k + 1]`. Errors: [`Error::InvalidArgument`] naming `p` for NaN,
/// [`Error::OutOfRange`] naming `table` outside the grid (tables do not extrapolate).
pub(super) fn interval(grid: &[f64], p: f64, table: &str) -> Result<usize> {
    if p.is_nan() {
        return Err(Error::invalid("p", p, "must not be NaN"));
    }
    let n = grid.len();
    let (lo, hi) = (grid[0], grid[n - 1]);
    if p < lo || p > hi {
        return Err(Error::OutOfRange(format!(
            "pressure {p} psia lies outside the {table}'s range [{lo}, {hi}] psia"
        )));
    }
    Ok(match grid.partition_point(|&x| x <= p) {
        0 => 0,
        j if j >= n => n - 2,
        j => j - 1,
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn check_of_a_consistent_table_is_empty_and_each_rule_fires() {
        // Facts of the trade (common practice, no source): below Pb Rs and Bo rise with p,
        // Bg falls, and Bg dRs > dBo; above Pb Rs is constant and Bo falls.
        let p = vec![1000.0, 2000.0, 3000.0, 4000.0];
        let bo = vec![1.15, 1.25, 1.35, 1.34];
        let rs = vec![200.0, 400.0, 600.0, 600.0];
        let bg = vec![0.0028, 0.0014, 0.0010, 0.0008];
        let ok = PvtTable::new(p.clone(), bo.clone(), rs.clone(), bg.clone()).unwrap();
        assert!(ok.check().is_empty());
        let rules = |bo: &[f64], rs: &[f64], bg: &[f64]| -> Vec<(f64, Rule)> {
            PvtTable::new(p.clone(), bo.to_vec(), rs.to_vec(), bg.to_vec())
                .unwrap()
                .check()
                .into_iter()
                .map(|v| (v.p_psia, v.rule))
                .collect()
        };
        assert_eq!(
            rules(&bo, &[200.0, 400.0, 350.0, 350.0], &bg),
            vec![(3000.0, Rule::RsFallingWithPressure)]
        );
        assert_eq!(
            rules(&bo, &rs, &[0.0028, 0.0014, 0.0015, 0.0008]),
            vec![(3000.0, Rule::BgNotFallingWithPressure)]
        );
        // dBo = 0.5 rb/STB against Bg dRs = 0.0012 x 200 = 0.24: negative total compressibility.
        assert_eq!(
            rules(&[1.15, 1.25, 1.75, 1.74], &rs, &bg),
            vec![(3000.0, Rule::NegativeTotalCompressibility)]
        );
        assert_eq!(
            rules(&[1.15, 1.25, 1.35, 1.36], &rs, &bg),
            vec![(4000.0, Rule::BoNotFallingAbovePb)]
        );
    }
}
