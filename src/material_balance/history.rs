//! Production and pressure histories, validated row by row.

use crate::error::{Error, Result};

fn rec(arg: &str, row: usize, message: String) -> Error {
    Error::InvalidRecord {
        arg: arg.to_string(),
        row,
        message,
    }
}

fn check_len(name: &str, v: &[f64], n: usize) -> Result<()> {
    if v.len() != n {
        return Err(Error::Shape(format!(
            "history column `{name}` has {} rows but `t_days` has {n}",
            v.len()
        )));
    }
    Ok(())
}

/// Times strictly increasing and >= 0, days.
pub(crate) fn check_times(t: &[f64]) -> Result<()> {
    for (i, &x) in t.iter().enumerate() {
        if !(x.is_finite() && x >= 0.0) {
            return Err(rec(
                "t_days",
                i,
                format!("time {x} days must be finite and >= 0"),
            ));
        }
        if i > 0 && x <= t[i - 1] {
            return Err(rec(
                "t_days",
                i,
                format!(
                    "time {x} days is not after the previous row's {} days (times must increase strictly)",
                    t[i - 1]
                ),
            ));
        }
    }
    Ok(())
}

/// Pressures finite, > 0 and not above the initial pressure, psia.
pub(crate) fn check_pressures(p: &[f64], p_initial: f64) -> Result<()> {
    crate::error::positive("p_initial", p_initial)?;
    for (i, &x) in p.iter().enumerate() {
        if !(x.is_finite() && x > 0.0) {
            return Err(rec(
                "p",
                i,
                format!("pressure {x} psia must be finite and > 0"),
            ));
        }
        if x > p_initial {
            return Err(rec(
                "p",
                i,
                format!("pressure {x} psia is above the initial pressure {p_initial} psia"),
            ));
        }
    }
    Ok(())
}

/// Cumulative volumes finite, >= 0 and never falling.
pub(crate) fn check_cumulative(name: &str, v: &[f64]) -> Result<()> {
    for (i, &x) in v.iter().enumerate() {
        if !(x.is_finite() && x >= 0.0) {
            return Err(rec(
                name,
                i,
                format!("cumulative volume {x} must be finite and >= 0"),
            ));
        }
        if i > 0 && x < v[i - 1] {
            return Err(rec(
                name,
                i,
                format!(
                    "cumulative volume {x} falls below the previous row's {} (cumulative volumes never fall)",
                    v[i - 1]
                ),
            ));
        }
    }
    Ok(())
}

/// Pressure and cumulative production/injection history of an oil reservoir.
///
/// Rows are observations at strictly increasing times since the start of production
/// (when the reservoir stood at its initial pressure). Cumulative volumes are totals since
/// that start. Units: `t_days` days, `p` psia (average reservoir pressure), `np` STB,
/// `gp` scf, `wp` STB, `wi` STB injected water, `gi` scf injected gas.
#[derive(Debug, Clone, PartialEq)]
pub struct OilHistory {
    /// Time since the start of production, days.
    pub t_days: Vec<f64>,
    /// Average reservoir pressure, psia.
    pub p: Vec<f64>,
    /// Cumulative oil produced, STB.
    pub np: Vec<f64>,
    /// Cumulative gas produced, scf.
    pub gp: Vec<f64>,
    /// Cumulative water produced, STB.
    pub wp: Vec<f64>,
    /// Cumulative water injected, STB.
    pub wi: Vec<f64>,
    /// Cumulative gas injected, scf.
    pub gi: Vec<f64>,
}

impl OilHistory {
    /// Build and validate a history. `wi` and `gi` may be empty (no injection).
    ///
    /// # Errors
    /// [`Error::Shape`] for columns of different lengths or an empty history;
    /// [`Error::InvalidRecord`] naming the column and row of unsorted or repeated times,
    /// a negative or falling cumulative volume, a non-positive pressure or a pressure above
    /// `p_initial` (psia).
    ///
    /// # Examples
    /// ```
    /// use stocktank::material_balance::OilHistory;
    /// let h = OilHistory::new(
    ///     vec![0.0, 365.0, 365.0], vec![3000.0, 2800.0, 2600.0],
    ///     vec![0.0, 1e5, 2e5], vec![0.0, 6e7, 1.3e8], vec![0.0; 3], vec![], vec![], 3000.0,
    /// );
    /// assert!(h.unwrap_err().to_string().contains("`t_days` at row 2"));
    /// ```
    #[allow(clippy::too_many_arguments)]
    pub fn new(
        t_days: Vec<f64>,
        p: Vec<f64>,
        np: Vec<f64>,
        gp: Vec<f64>,
        wp: Vec<f64>,
        wi: Vec<f64>,
        gi: Vec<f64>,
        p_initial: f64,
    ) -> Result<Self> {
        let n = t_days.len();
        if n == 0 {
            return Err(Error::Shape("the history has no rows".into()));
        }
        let wi = if wi.is_empty() { vec![0.0; n] } else { wi };
        let gi = if gi.is_empty() { vec![0.0; n] } else { gi };
        for (name, v) in [
            ("p", &p),
            ("np", &np),
            ("gp", &gp),
            ("wp", &wp),
            ("wi", &wi),
            ("gi", &gi),
        ] {
            check_len(name, v, n)?;
        }
        check_times(&t_days)?;
        check_pressures(&p, p_initial)?;
        for (name, v) in [
            ("np", &np),
            ("gp", &gp),
            ("wp", &wp),
            ("wi", &wi),
            ("gi", &gi),
        ] {
            check_cumulative(name, v)?;
        }
        Ok(Self {
            t_days,
            p,
            np,
            gp,
            wp,
            wi,
            gi,
        })
    }

    /// Number of rows.
    ///
    /// # Examples
    /// ```
    /// use stocktank::material_balance::OilHistory;
    /// let h = OilHistory::new(vec![0.0], vec![3000.0], vec![0.0], vec![0.0], vec![0.0], vec![], vec![], 3000.0).unwrap();
    /// assert_eq!(h.len(), 1);
    /// ```
    pub fn len(&self) -> usize {
        self.t_days.len()
    }

    /// True for a history without rows (never, once validated).
    ///
    /// # Examples
    /// ```
    /// use stocktank::material_balance::OilHistory;
    /// let h = OilHistory::new(vec![0.0], vec![3000.0], vec![0.0], vec![0.0], vec![0.0], vec![], vec![], 3000.0).unwrap();
    /// assert!(!h.is_empty());
    /// ```
    pub fn is_empty(&self) -> bool {
        self.t_days.is_empty()
    }
}
