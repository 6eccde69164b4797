//! Python bindings of [`crate::material_balance`]: conversion only. Histories arrive as
//! keyword arrays, results leave as dicts of floats and numpy arrays.

use super::{In, call, call_multi, detach, on_error};
use crate::array::{lift, lift_multi};
use crate::error::Error;
use crate::material_balance as mb;
use crate::units::StandardConditions;
use numpy::{IntoPyArray, PyArrayMethods, PyUntypedArrayMethods};
use pyo3::prelude::*;
use pyo3::types::{PyDict, PyList, PyTuple};

fn vec1(name: &'static str, a: &In<'_>) -> PyResult<Vec<f64>> {
    if a.ndim() != 1 {
        return Err(Error::Shape(format!(
            "`{name}` must be one-dimensional, got {} dimensions",
            a.ndim()
        ))
        .into());
    }
    Ok(a.as_array().iter().copied().collect())
}

fn opt_vec1(name: &'static str, a: &Option<In<'_>>) -> PyResult<Vec<f64>> {
    match a {
        Some(a) => vec1(name, a),
        None => Ok(vec![]),
    }
}

fn arr<'py>(py: Python<'py>, v: Vec<f64>) -> Bound<'py, PyAny> {
    v.into_pyarray(py).into_any()
}

// ---- PVT table ----------------------------------------------------------------------------

/// A black-oil PVT table against pressure: p psia (strictly ascending), Bo rb/STB, Rs
/// scf/STB, Bg rb/scf, optional Bw rb/STB and viscosities mu_o, mu_g cp. Interpolated by
/// monotone cubics (Fritsch & Carlson 1980); never extrapolated. ``check()`` lists the rows
/// of a lab or hand-made table that break the black-oil consistency rules.
#[pyclass(name = "PvtTable", module = "stocktank._core", frozen)]
#[derive(Clone)]
pub struct PvtTable {
    inner: mb::PvtTable,
    cols: [Vec<f64>; 4],
    bw: Option<Vec<f64>>,
    mu: Option<(Vec<f64>, Vec<f64>)>,
}

impl PartialEq for PvtTable {
    fn eq(&self, o: &Self) -> bool {
        self.cols == o.cols && self.bw == o.bw && self.mu == o.mu
    }
}

#[pymethods]
impl PvtTable {
    #[new]
    #[pyo3(signature = (*, p, bo, rs, bg, bw = None, mu_o = None, mu_g = None))]
    #[allow(clippy::too_many_arguments)]
    fn new(
        p: In<'_>,
        bo: In<'_>,
        rs: In<'_>,
        bg: In<'_>,
        bw: Option<In<'_>>,
        mu_o: Option<In<'_>>,
        mu_g: Option<In<'_>>,
    ) -> PyResult<Self> {
        let cols = [
            vec1("p", &p)?,
            vec1("bo", &bo)?,
            vec1("rs", &rs)?,
            vec1("bg", &bg)?,
        ];
        let mut inner = mb::PvtTable::new(
            cols[0].clone(),
            cols[1].clone(),
            cols[2].clone(),
            cols[3].clone(),
        )?;
        let bw = match bw {
            Some(b) => {
                let v = vec1("bw", &b)?;
                inner = inner.with_bw(v.clone())?;
                Some(v)
            }
            None => None,
        };
        let mu = match (mu_o, mu_g) {
            (Some(a), Some(b)) => {
                let (a, b) = (vec1("mu_o", &a)?, vec1("mu_g", &b)?);
                inner = inner.with_viscosities(a.clone(), b.clone())?;
                Some((a, b))
            }
            (None, None) => None,
            _ => {
                return Err(Error::InvalidOption {
                    arg: "mu_o",
                    value: "only one viscosity column".into(),
                    allowed: "both mu_o and mu_g, or neither",
                }
                .into());
            }
        };
        Ok(Self {
            inner,
            cols,
            bw,
            mu,
        })
    }
    /// Pressure column, psia.
    #[getter]
    fn p<'py>(&self, py: Python<'py>) -> Bound<'py, PyAny> {
        arr(py, self.cols[0].clone())
    }
    /// Bo column, rb/STB.
    #[getter]
    fn bo<'py>(&self, py: Python<'py>) -> Bound<'py, PyAny> {
        arr(py, self.cols[1].clone())
    }
    /// Rs column, scf/STB.
    #[getter]
    fn rs<'py>(&self, py: Python<'py>) -> Bound<'py, PyAny> {
        arr(py, self.cols[2].clone())
    }
    /// Bg column, rb/scf.
    #[getter]
    fn bg<'py>(&self, py: Python<'py>) -> Bound<'py, PyAny> {
        arr(py, self.cols[3].clone())
    }
    /// Bw column, rb/STB (None when absent; 1.0 is used).
    #[getter]
    fn bw<'py>(&self, py: Python<'py>) -> Option<Bound<'py, PyAny>> {
        self.bw.clone().map(|v| arr(py, v))
    }
    /// Oil viscosity column, cp (None when absent).
    #[getter]
    fn mu_o<'py>(&self, py: Python<'py>) -> Option<Bound<'py, PyAny>> {
        self.mu.clone().map(|v| arr(py, v.0))
    }
    /// Gas viscosity column, cp (None when absent).
    #[getter]
    fn mu_g<'py>(&self, py: Python<'py>) -> Option<Bound<'py, PyAny>> {
        self.mu.clone().map(|v| arr(py, v.1))
    }
    /// Interpolated properties at pressure(s) ``p`` (psia): a dict with ``bo`` (rb/STB),
    /// ``rs`` (scf/STB), ``bg`` (rb/scf), ``bw`` (rb/STB), ``mu_o`` and ``mu_g`` (cp, NaN
    /// when the table has none). Pressures outside the table raise (or are NaN with
    /// ``errors="coerce"``).
    #[pyo3(signature = (p, *, errors = "raise"))]
    fn at<'py>(&self, py: Python<'py>, p: In<'py>, errors: &str) -> PyResult<Bound<'py, PyDict>> {
        let oe = on_error(errors)?;
        let t = self.inner.clone();
        let outs = call_multi(py, [&p], move |[p]| {
            lift_multi(["p"], [p], oe, |[p]| {
                let q = t.at(p).map_err(|e| match e {
                    Error::OutOfRange(_) => {
                        Error::invalid("p", p, "lies outside the PVT table's pressure range")
                    }
                    o => o,
                })?;
                Ok([q.bo, q.rs, q.bg, q.bw, q.mu_o, q.mu_g])
            })
        })?;
        let d = PyDict::new(py);
        for (k, v) in ["bo", "rs", "bg", "bw", "mu_o", "mu_g"].iter().zip(outs) {
            d.set_item(k, v)?;
        }
        Ok(d)
    }
    /// Two-phase formation volume factor Bt = Bo + (Rsi - Rs) Bg, rb/STB, at ``p`` for an
    /// initial pressure ``p_initial`` (psia).
    #[pyo3(signature = (p, *, p_initial, errors = "raise"))]
    fn bt(&self, py: Python<'_>, p: In<'_>, p_initial: f64, errors: &str) -> PyResult<Py<PyAny>> {
        let oe = on_error(errors)?;
        let t = self.inner.clone();
        // Errors name the argument that is off the table (`p` with its index, or
        // `p_initial`), as `at` does, instead of an unindexed "out of range".
        let outside = "lies outside the PVT table's pressure range";
        t.at(p_initial).map_err(|_| {
            let reason = if p_initial.is_nan() {
                "must not be NaN"
            } else {
                outside
            };
            Error::invalid("p_initial", p_initial, reason)
        })?;
        call(py, [&p], move |[p]| {
            lift(["p"], [p], oe, |[p]| {
                t.bt(p, p_initial).map_err(|e| match e {
                    Error::OutOfRange(_) => Error::invalid("p", p, outside),
                    o => o,
                })
            })
        })
    }
    /// The consistency check of the rows: a list of (p_psia, rule, detail), empty for a
    /// consistent table. Rules: ``rs_falling_with_pressure``,
    /// ``bg_not_falling_with_pressure``, ``negative_total_compressibility`` (where Rs rises,
    /// Bg dRs must exceed dBo) and ``bo_not_falling_above_pb`` (where Rs is constant).
    fn check<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyList>> {
        let items: Vec<(f64, &'static str, String)> = self
            .inner
            .check()
            .into_iter()
            .map(|x| (x.p_psia, x.rule.name(), x.detail))
            .collect();
        PyList::new(py, items)
    }
    fn __eq__(&self, other: &Bound<'_, PyAny>) -> bool {
        other
            .cast::<Self>()
            .map(|o| *o.get() == *self)
            .unwrap_or(false)
    }
    fn __repr__(&self) -> String {
        let (lo, hi) = self.inner.pressure_range();
        format!(
            "PvtTable({} rows, p {lo}..{hi} psia, bw={}, viscosities={})",
            self.cols[0].len(),
            if self.bw.is_some() { "True" } else { "False" },
            if self.mu.is_some() { "True" } else { "False" }
        )
    }
    fn __reduce__<'py>(
        slf: &Bound<'py, Self>,
    ) -> PyResult<(Bound<'py, PyAny>, Bound<'py, PyTuple>, Bound<'py, PyAny>)> {
        let py = slf.py();
        let s = slf.get();
        let kwargs = PyDict::new(py);
        for (k, v) in ["p", "bo", "rs", "bg"].iter().zip(&s.cols) {
            kwargs.set_item(k, PyList::new(py, v)?)?;
        }
        if let Some(b) = &s.bw {
            kwargs.set_item("bw", PyList::new(py, b)?)?;
        }
        if let Some((a, b)) = &s.mu {
            kwargs.set_item("mu_o", PyList::new(py, a)?)?;
            kwargs.set_item("mu_g", PyList::new(py, b)?)?;
        }
        let rebuild = py.import("stocktank._pickle")?.getattr("rebuild")?;
        let args = PyTuple::new(py, [slf.get_type().into_any(), kwargs.into_any()])?;
        Ok((rebuild, args, py.None().into_bound(py)))
    }
}

// ---- Aquifer --------------------------------------------------------------------------------

/// An aquifer model and its constant. ``model`` is one of ``"pot"`` (C rb/psi),
/// ``"schilthuis"`` (C rb/(psi day)), ``"fetkovich"`` (C = Wei/pi rb/psi, ``tau_days``),
/// ``"veh"`` (van Everdingen–Hurst, C = U rb/psi, ``td_per_day``, ``red``; ``red=inf`` for
/// an infinite aquifer) or ``"carter_tracy"`` (as ``"veh"``).
#[pyclass(name = "Aquifer", module = "stocktank._core", frozen, eq)]
#[derive(Clone, PartialEq)]
pub struct Aquifer(pub mb::Aquifer);

fn model_name(m: &mb::AquiferModel) -> &'static str {
    match m {
        mb::AquiferModel::Pot => "pot",
        mb::AquiferModel::Schilthuis => "schilthuis",
        mb::AquiferModel::Fetkovich { .. } => "fetkovich",
        mb::AquiferModel::VanEverdingenHurst { .. } => "veh",
        mb::AquiferModel::CarterTracy { .. } => "carter_tracy",
    }
}

fn need(arg: &'static str, v: Option<f64>, model: &str) -> PyResult<f64> {
    v.ok_or_else(|| {
        Error::InvalidOption {
            arg,
            value: format!("missing for model {model:?}"),
            allowed: "a number",
        }
        .into()
    })
}

#[pymethods]
impl Aquifer {
    #[new]
    #[pyo3(signature = (*, model, constant = 1.0, tau_days = None, td_per_day = None, red = f64::INFINITY))]
    fn new(
        model: &str,
        constant: f64,
        tau_days: Option<f64>,
        td_per_day: Option<f64>,
        red: f64,
    ) -> PyResult<Self> {
        crate::error::non_negative("constant", constant)?;
        let m = match model {
            "pot" => mb::AquiferModel::Pot,
            "schilthuis" => mb::AquiferModel::Schilthuis,
            "fetkovich" => mb::AquiferModel::Fetkovich {
                tau_days: need("tau_days", tau_days, model)?,
            },
            "veh" => mb::AquiferModel::VanEverdingenHurst {
                td_per_day: need("td_per_day", td_per_day, model)?,
                red,
            },
            "carter_tracy" => mb::AquiferModel::CarterTracy {
                td_per_day: need("td_per_day", td_per_day, model)?,
                red,
            },
            _ => {
                return Err(Error::InvalidOption {
                    arg: "model",
                    value: model.into(),
                    allowed: "pot, schilthuis, fetkovich, veh, carter_tracy",
                }
                .into());
            }
        };
        m.validate()?;
        Ok(Self(mb::Aquifer { model: m, constant }))
    }
    /// The Fetkovich (1971) aquifer from Wei (rb), J (bbl/(day psi)) and pi (psia).
    #[staticmethod]
    #[pyo3(signature = (*, wei_rb, j, p_initial))]
    fn fetkovich(wei_rb: f64, j: f64, p_initial: f64) -> PyResult<Self> {
        Ok(Self(mb::fetkovich_aquifer(wei_rb, j, p_initial)?))
    }
    /// Model name.
    #[getter]
    fn model(&self) -> &'static str {
        model_name(&self.0.model)
    }
    /// Aquifer constant (rb/psi; rb/(psi day) for Schilthuis).
    #[getter]
    fn constant(&self) -> f64 {
        self.0.constant
    }
    /// Fetkovich time constant, days (None for other models).
    #[getter]
    fn tau_days(&self) -> Option<f64> {
        match self.0.model {
            mb::AquiferModel::Fetkovich { tau_days } => Some(tau_days),
            _ => None,
        }
    }
    /// Dimensionless time per day, 1/day (vEH and Carter–Tracy; None otherwise).
    #[getter]
    fn td_per_day(&self) -> Option<f64> {
        match self.0.model {
            mb::AquiferModel::VanEverdingenHurst { td_per_day, .. }
            | mb::AquiferModel::CarterTracy { td_per_day, .. } => Some(td_per_day),
            _ => None,
        }
    }
    /// Radius ratio reD (inf for infinite; vEH and Carter–Tracy; None otherwise).
    #[getter]
    fn red(&self) -> Option<f64> {
        match self.0.model {
            mb::AquiferModel::VanEverdingenHurst { red, .. }
            | mb::AquiferModel::CarterTracy { red, .. } => Some(red),
            _ => None,
        }
    }
    /// Cumulative influx We (rb) at each row of a boundary-pressure history: ``t_days``
    /// (days since the start at ``p_initial``, strictly increasing) and ``p`` (psia).
    #[pyo3(signature = (t_days, p, *, p_initial))]
    fn influx<'py>(
        &self,
        py: Python<'py>,
        t_days: In<'py>,
        p: In<'py>,
        p_initial: f64,
    ) -> PyResult<Bound<'py, PyAny>> {
        let (t, pp) = (vec1("t_days", &t_days)?, vec1("p", &p)?);
        let a = self.0;
        let we = py.detach(move || a.influx(&t, &pp, p_initial))?;
        Ok(arr(py, we))
    }
    fn __repr__(&self) -> String {
        let a = &self.0;
        match a.model {
            mb::AquiferModel::Pot | mb::AquiferModel::Schilthuis => {
                format!(
                    "Aquifer(model={:?}, constant={:?})",
                    model_name(&a.model),
                    a.constant
                )
            }
            mb::AquiferModel::Fetkovich { tau_days } => {
                format!(
                    "Aquifer(model='fetkovich', constant={:?}, tau_days={tau_days:?})",
                    a.constant
                )
            }
            mb::AquiferModel::VanEverdingenHurst { td_per_day, red }
            | mb::AquiferModel::CarterTracy { td_per_day, red } => {
                format!(
                    "Aquifer(model={:?}, constant={:?}, td_per_day={td_per_day:?}, red={red:?})",
                    model_name(&a.model),
                    a.constant
                )
            }
        }
        .replace('"', "'")
    }
    fn __reduce__<'py>(
        slf: &Bound<'py, Self>,
    ) -> PyResult<(Bound<'py, PyAny>, Bound<'py, PyTuple>, Bound<'py, PyAny>)> {
        let py = slf.py();
        let s = slf.get();
        let kwargs = PyDict::new(py);
        kwargs.set_item("model", s.model())?;
        kwargs.set_item("constant", s.0.constant)?;
        if let Some(v) = s.tau_days() {
            kwargs.set_item("tau_days", v)?;
        }
        if let Some(v) = s.td_per_day() {
            kwargs.set_item("td_per_day", v)?;
        }
        if let Some(v) = s.red() {
            kwargs.set_item("red", v)?;
        }
        let rebuild = py.import("stocktank._pickle")?.getattr("rebuild")?;
        let args = PyTuple::new(py, [slf.get_type().into_any(), kwargs.into_any()])?;
        Ok((rebuild, args, py.None().into_bound(py)))
    }
}

// ---- Scalar and array kernels ---------------------------------------------------------------

/// Dimensionless cumulative influx WD(tD) of a radial aquifer at constant terminal pressure
/// (van Everdingen & Hurst 1949) by Stehfest inversion; ``red=inf`` for infinite.
#[pyfunction]
#[pyo3(signature = (td, *, red = f64::INFINITY, errors = "raise"))]
fn veh_dimensionless_influx(
    py: Python<'_>,
    td: In<'_>,
    red: f64,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let oe = on_error(errors)?;
    call(py, [&td], move |[td]| {
        lift(["td"], [td], oe, |[x]| mb::veh_dimensionless_influx(x, red))
    })
}

/// Dimensionless pressure pD(tD) of a radial aquifer at constant terminal rate (van
/// Everdingen & Hurst 1949) by Stehfest inversion; ``red=inf`` for infinite.
#[pyfunction]
#[pyo3(signature = (td, *, red = f64::INFINITY, errors = "raise"))]
fn veh_dimensionless_pressure(
    py: Python<'_>,
    td: In<'_>,
    red: f64,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let oe = on_error(errors)?;
    call(py, [&td], move |[td]| {
        lift(["td"], [td], oe, |[x]| {
            mb::veh_dimensionless_pressure(x, red)
        })
    })
}

/// van Everdingen–Hurst constants of a radial aquifer: returns ``(U rb/psi, td_per_day 1/day)``
/// from k (md), phi, mu (cp), ct (1/psi), h (ft), ro (ft) and the encroachment angle (deg).
#[pyfunction]
#[pyo3(signature = (*, k_md, phi, mu_cp, ct_per_psi, h_ft, ro_ft, theta_deg = 360.0))]
fn veh_constants(
    k_md: f64,
    phi: f64,
    mu_cp: f64,
    ct_per_psi: f64,
    h_ft: f64,
    ro_ft: f64,
    theta_deg: f64,
) -> PyResult<(f64, f64)> {
    Ok(mb::veh_constants(
        k_md, phi, mu_cp, ct_per_psi, h_ft, ro_ft, theta_deg,
    )?)
}

/// Fetkovich (1971) productivity index of a finite radial aquifer, bbl/(day psi).
#[pyfunction]
#[pyo3(signature = (*, k_md, h_ft, mu_cp, ra_ft, ro_ft, theta_deg = 360.0))]
fn fetkovich_j_radial(
    k_md: f64,
    h_ft: f64,
    mu_cp: f64,
    ra_ft: f64,
    ro_ft: f64,
    theta_deg: f64,
) -> PyResult<f64> {
    Ok(mb::fetkovich_j_radial(
        k_md, h_ft, theta_deg, mu_cp, ra_ft, ro_ft,
    )?)
}

/// Fetkovich (1971) productivity index of a finite linear aquifer, bbl/(day psi).
#[pyfunction]
#[pyo3(signature = (*, k_md, w_ft, h_ft, mu_cp, l_ft))]
fn fetkovich_j_linear(k_md: f64, w_ft: f64, h_ft: f64, mu_cp: f64, l_ft: f64) -> PyResult<f64> {
    Ok(mb::fetkovich_j_linear(k_md, w_ft, h_ft, mu_cp, l_ft)?)
}

/// Gas formation volume factor Bg = psc z T / (Tsc p), rb/scf.
#[pyfunction]
#[pyo3(signature = (p, z, *, temperature_f, p_sc = 14.696, t_sc = 60.0, errors = "raise"))]
fn gas_bg(
    py: Python<'_>,
    p: In<'_>,
    z: In<'_>,
    temperature_f: f64,
    p_sc: f64,
    t_sc: f64,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let oe = on_error(errors)?;
    let sc = StandardConditions::new(p_sc, t_sc)?;
    call(py, [&p, &z], move |[p, z]| {
        lift(["p", "z"], [p, z], oe, |[p, z]| {
            mb::gas_bg(p, z, temperature_f, sc)
        })
    })
}

// ---- Oil balance ------------------------------------------------------------------------------

struct Hist {
    h: mb::OilHistory,
    r: mb::OilReservoir,
}

#[allow(clippy::too_many_arguments)]
fn hist(
    t_days: &In<'_>,
    p: &In<'_>,
    np_stb: &In<'_>,
    gp_scf: &In<'_>,
    wp_stb: &Option<In<'_>>,
    wi_stb: &Option<In<'_>>,
    gi_scf: &Option<In<'_>>,
    p_initial: f64,
    swi: f64,
    cw: f64,
    cf: f64,
) -> PyResult<Hist> {
    let t = vec1("t_days", t_days)?;
    let n = t.len();
    let wp = match wp_stb {
        Some(w) => vec1("wp_stb", w)?,
        None => vec![0.0; n],
    };
    let h = mb::OilHistory::new(
        t,
        vec1("p", p)?,
        vec1("np_stb", np_stb)?,
        vec1("gp_scf", gp_scf)?,
        wp,
        opt_vec1("wi_stb", wi_stb)?,
        opt_vec1("gi_scf", gi_scf)?,
        p_initial,
    )
    .map_err(rename_cols)?;
    Ok(Hist {
        h,
        r: mb::OilReservoir::new(p_initial, swi, cw, cf)?,
    })
}

/// `message` with each quoted core name `` `from` `` replaced by the Python keyword `` `to` ``.
fn rename_in(message: String, names: &[(&str, &str)]) -> String {
    names.iter().fold(message, |m, (from, to)| {
        m.replace(&format!("`{from}`"), &format!("`{to}`"))
    })
}

/// The keys of a history dict of `history_match_batch`.
const HISTORY_KEYS: [&str; 7] = [
    "t_days", "p", "np_stb", "gp_scf", "wp_stb", "wi_stb", "gi_scf",
];

/// History column names of the core (`np`, `gp`, ...) as the Python keywords.
const HISTORY_NAMES: [(&str, &str); 5] = [
    ("np", "np_stb"),
    ("gp", "gp_scf"),
    ("wp", "wp_stb"),
    ("wi", "wi_stb"),
    ("gi", "gi_scf"),
];

/// Column names in errors as the Python user typed them.
fn rename_cols(e: Error) -> Error {
    match e {
        Error::Shape(m) => Error::Shape(rename_in(m, &HISTORY_NAMES)),
        Error::InvalidRecord { arg, row, message } => Error::InvalidRecord {
            arg: match arg.as_str() {
                "np" => "np_stb".into(),
                "gp" => "gp_scf".into(),
                "wp" => "wp_stb".into(),
                "wi" => "wi_stb".into(),
                "gi" => "gi_scf".into(),
                _ => arg,
            },
            row,
            message,
        },
        other => other,
    }
}

fn terms_dict<'py>(py: Python<'py>, t: mb::MbeTerms, m: f64) -> PyResult<Bound<'py, PyDict>> {
    let d = PyDict::new(py);
    d.set_item("et", arr(py, t.et(m)))?;
    d.set_item("t_days", arr(py, t.t_days))?;
    d.set_item("p", arr(py, t.p))?;
    d.set_item("np_stb", arr(py, t.np))?;
    d.set_item("f", arr(py, t.f))?;
    d.set_item("f_hydrocarbon", arr(py, t.f_hydrocarbon))?;
    d.set_item("f_water", arr(py, t.f_water))?;
    d.set_item("eo", arr(py, t.eo))?;
    d.set_item("eg", arr(py, t.eg))?;
    d.set_item("efw", arr(py, t.efw))?;
    d.set_item("rs", arr(py, t.rs))?;
    d.set_item("boi", t.boi)?;
    d.set_item("bgi", t.bgi)?;
    d.set_item("rsi", t.rsi)?;
    d.set_item("p_initial", t.p_initial)?;
    Ok(d)
}

/// The Havlena–Odeh terms of an oil history (see the Rust docs of `oil_mbe_terms`): dict of
/// ``f`` (rb), ``f_hydrocarbon``, ``f_water`` (rb), ``eo``, ``eg``, ``efw`` and ``et`` (rb/STB,
/// ``et`` for the given ``m``), ``rs`` (scf/STB) per row, and ``boi``, ``bgi``, ``rsi``.
#[pyfunction]
#[pyo3(signature = (pvt, *, t_days, p, np_stb, gp_scf, wp_stb = None, wi_stb = None, gi_scf = None, p_initial, swi = 0.0, cw = 0.0, cf = 0.0, m = 0.0))]
#[allow(clippy::too_many_arguments)]
fn oil_mbe_terms<'py>(
    py: Python<'py>,
    pvt: &PvtTable,
    t_days: In<'py>,
    p: In<'py>,
    np_stb: In<'py>,
    gp_scf: In<'py>,
    wp_stb: Option<In<'py>>,
    wi_stb: Option<In<'py>>,
    gi_scf: Option<In<'py>>,
    p_initial: f64,
    swi: f64,
    cw: f64,
    cf: f64,
    m: f64,
) -> PyResult<Bound<'py, PyDict>> {
    let hs = hist(
        &t_days, &p, &np_stb, &gp_scf, &wp_stb, &wi_stb, &gi_scf, p_initial, swi, cw, cf,
    )?;
    let table = &pvt.inner;
    let t = py.detach(|| mb::oil_mbe_terms(table, &hs.h, &hs.r))?;
    crate::error::non_negative("m", m)?;
    terms_dict(py, t, m)
}

fn parse_aquifer(a: &Option<PyRef<'_, Aquifer>>) -> Option<mb::Aquifer> {
    a.as_ref().map(|x| x.0)
}

fn line_into(py: Python<'_>, d: &Bound<'_, PyDict>, l: mb::LineFit) -> PyResult<()> {
    d.set_item("slope", l.slope)?;
    d.set_item("intercept", l.intercept)?;
    d.set_item("slope_se", l.slope_se)?;
    d.set_item("intercept_se", l.intercept_se)?;
    d.set_item("r2", l.r2)?;
    d.set_item("n_used", l.n_used)?;
    d.set_item("through_origin", l.through_origin)?;
    d.set_item("x", arr(py, l.x))?;
    d.set_item("y", arr(py, l.y))?;
    d.set_item("residuals", arr(py, l.residuals))?;
    d.set_item("used", numpy::PyArray1::from_vec(py, l.used))?;
    Ok(())
}

/// Havlena–Odeh (1963) straight-line fit. ``case``: ``"volumetric"`` (F vs Eo + Efw through
/// the origin), ``"gas_cap"`` (known ``m``), ``"gas_cap_unknown_m"`` (F/(Eo+Efw) vs
/// (Eg+Efw)/(Eo+Efw)) or ``"water_drive"`` (F/Et vs We_unit/Et with the shape of
/// ``aquifer`` and known ``m``). Returns a dict: ``n`` (STB), ``n_se``, ``m``, ``m_se``,
/// ``aquifer_constant``, ``aquifer_constant_se`` and the line (``slope``, ``intercept``,
/// their standard errors, ``r2``, ``x``, ``y``, ``residuals``, ``used``, ``n_used``).
#[pyfunction]
#[pyo3(signature = (pvt, *, t_days, p, np_stb, gp_scf, wp_stb = None, wi_stb = None, gi_scf = None, p_initial, swi = 0.0, cw = 0.0, cf = 0.0, case = "volumetric", m = 0.0, aquifer = None, select = None))]
#[allow(clippy::too_many_arguments)]
fn havlena_odeh_fit<'py>(
    py: Python<'py>,
    pvt: &PvtTable,
    t_days: In<'py>,
    p: In<'py>,
    np_stb: In<'py>,
    gp_scf: In<'py>,
    wp_stb: Option<In<'py>>,
    wi_stb: Option<In<'py>>,
    gi_scf: Option<In<'py>>,
    p_initial: f64,
    swi: f64,
    cw: f64,
    cf: f64,
    case: &str,
    m: f64,
    aquifer: Option<PyRef<'py, Aquifer>>,
    select: Option<Vec<bool>>,
) -> PyResult<Bound<'py, PyDict>> {
    let hs = hist(
        &t_days, &p, &np_stb, &gp_scf, &wp_stb, &wi_stb, &gi_scf, p_initial, swi, cw, cf,
    )?;
    let c = match case {
        "volumetric" => mb::HavlenaOdehCase::Volumetric,
        "gas_cap" => mb::HavlenaOdehCase::GasCapKnownM { m },
        "gas_cap_unknown_m" => mb::HavlenaOdehCase::GasCapUnknownM,
        "water_drive" => mb::HavlenaOdehCase::WaterDrive {
            m,
            aquifer: parse_aquifer(&aquifer)
                .ok_or_else(|| Error::InvalidOption {
                    arg: "aquifer",
                    value: "None".into(),
                    allowed: "an Aquifer (its model shape) for case=\"water_drive\"",
                })?
                .model,
        },
        _ => {
            return Err(Error::InvalidOption {
                arg: "case",
                value: case.into(),
                allowed: "volumetric, gas_cap, gas_cap_unknown_m, water_drive",
            }
            .into());
        }
    };
    let table = &pvt.inner;
    let sel = select;
    let f = py.detach(|| {
        let t = mb::oil_mbe_terms(table, &hs.h, &hs.r)?;
        mb::havlena_odeh_fit(&t, c, sel.as_deref())
    })?;
    let d = PyDict::new(py);
    d.set_item("case", case)?;
    d.set_item("n", f.n)?;
    d.set_item("n_se", f.n_se)?;
    d.set_item("m", f.m)?;
    d.set_item("m_se", f.m_se)?;
    d.set_item("aquifer_constant", f.aquifer_constant)?;
    d.set_item("aquifer_constant_se", f.aquifer_constant_se)?;
    line_into(py, &d, f.line)?;
    Ok(d)
}

fn indices_dict<'py>(py: Python<'py>, d: mb::DriveIndices) -> PyResult<Bound<'py, PyDict>> {
    let o = PyDict::new(py);
    o.set_item("depletion", arr(py, d.depletion))?;
    o.set_item("gas_cap", arr(py, d.gas_cap))?;
    o.set_item("expansion", arr(py, d.expansion))?;
    o.set_item("water", arr(py, d.water))?;
    o.set_item("sum", arr(py, d.sum))?;
    Ok(o)
}

/// Campbell-type plot data: ``F/Et`` (STB) per row for gas-cap ratio ``m`` (NaN where
/// Et = 0). Returns a dict with ``np_stb``, ``t_days`` and ``f_over_et``.
#[pyfunction]
#[pyo3(signature = (pvt, *, t_days, p, np_stb, gp_scf, wp_stb = None, wi_stb = None, gi_scf = None, p_initial, swi = 0.0, cw = 0.0, cf = 0.0, m = 0.0))]
#[allow(clippy::too_many_arguments)]
fn campbell_plot<'py>(
    py: Python<'py>,
    pvt: &PvtTable,
    t_days: In<'py>,
    p: In<'py>,
    np_stb: In<'py>,
    gp_scf: In<'py>,
    wp_stb: Option<In<'py>>,
    wi_stb: Option<In<'py>>,
    gi_scf: Option<In<'py>>,
    p_initial: f64,
    swi: f64,
    cw: f64,
    cf: f64,
    m: f64,
) -> PyResult<Bound<'py, PyDict>> {
    let hs = hist(
        &t_days, &p, &np_stb, &gp_scf, &wp_stb, &wi_stb, &gi_scf, p_initial, swi, cw, cf,
    )?;
    let table = &pvt.inner;
    let y = py.detach(|| mb::campbell_plot(&mb::oil_mbe_terms(table, &hs.h, &hs.r)?, m))?;
    let d = PyDict::new(py);
    d.set_item("t_days", arr(py, hs.h.t_days.clone()))?;
    d.set_item("np_stb", arr(py, hs.h.np.clone()))?;
    d.set_item("f_over_et", arr(py, y))?;
    Ok(d)
}

/// Drive indices (Pirson 1958) per row for oil in place ``n`` (STB), gas-cap ratio ``m`` and
/// cumulative influx ``we`` (rb, None for none): dict of ``depletion``, ``gas_cap``,
/// ``expansion``, ``water`` and ``sum`` (fractions).
#[pyfunction]
#[pyo3(signature = (pvt, *, t_days, p, np_stb, gp_scf, wp_stb = None, wi_stb = None, gi_scf = None, p_initial, swi = 0.0, cw = 0.0, cf = 0.0, n, m = 0.0, we = None))]
#[allow(clippy::too_many_arguments)]
fn drive_indices<'py>(
    py: Python<'py>,
    pvt: &PvtTable,
    t_days: In<'py>,
    p: In<'py>,
    np_stb: In<'py>,
    gp_scf: In<'py>,
    wp_stb: Option<In<'py>>,
    wi_stb: Option<In<'py>>,
    gi_scf: Option<In<'py>>,
    p_initial: f64,
    swi: f64,
    cw: f64,
    cf: f64,
    n: f64,
    m: f64,
    we: Option<In<'py>>,
) -> PyResult<Bound<'py, PyDict>> {
    let hs = hist(
        &t_days, &p, &np_stb, &gp_scf, &wp_stb, &wi_stb, &gi_scf, p_initial, swi, cw, cf,
    )?;
    let we = opt_vec1("we", &we)?;
    let table = &pvt.inner;
    let d = py.detach(|| mb::drive_indices(&mb::oil_mbe_terms(table, &hs.h, &hs.r)?, n, m, &we))?;
    indices_dict(py, d)
}

/// Plain-language classification of the drive mechanism with its evidence: dict of
/// ``mechanism`` (str), ``evidence`` (list of str), ``campbell_trend``, ``saturated``,
/// ``n_estimate`` (STB), ``implied_influx`` (rb per row) and ``indices`` (dict).
#[pyfunction]
#[pyo3(signature = (pvt, *, t_days, p, np_stb, gp_scf, wp_stb = None, wi_stb = None, gi_scf = None, p_initial, swi = 0.0, cw = 0.0, cf = 0.0, m = 0.0, tolerance = 0.05))]
#[allow(clippy::too_many_arguments)]
fn classify_drive<'py>(
    py: Python<'py>,
    pvt: &PvtTable,
    t_days: In<'py>,
    p: In<'py>,
    np_stb: In<'py>,
    gp_scf: In<'py>,
    wp_stb: Option<In<'py>>,
    wi_stb: Option<In<'py>>,
    gi_scf: Option<In<'py>>,
    p_initial: f64,
    swi: f64,
    cw: f64,
    cf: f64,
    m: f64,
    tolerance: f64,
) -> PyResult<Bound<'py, PyDict>> {
    let hs = hist(
        &t_days, &p, &np_stb, &gp_scf, &wp_stb, &wi_stb, &gi_scf, p_initial, swi, cw, cf,
    )?;
    let table = &pvt.inner;
    let c =
        py.detach(|| mb::classify_drive(&mb::oil_mbe_terms(table, &hs.h, &hs.r)?, m, tolerance))?;
    let d = PyDict::new(py);
    d.set_item("mechanism", c.mechanism)?;
    d.set_item("evidence", PyList::new(py, c.evidence)?)?;
    d.set_item("campbell_trend", c.campbell_trend)?;
    d.set_item("saturated", c.saturated)?;
    d.set_item("n_estimate", c.n_estimate)?;
    d.set_item("implied_influx", arr(py, c.implied_influx))?;
    d.set_item("indices", indices_dict(py, c.indices)?)?;
    Ok(d)
}

#[allow(clippy::too_many_arguments)]
fn match_options(
    m: Option<f64>,
    aquifer: Option<mb::Aquifer>,
    fit_shape: bool,
    fit_red: bool,
    objective: &str,
    max_iterations: i128,
    tolerance: f64,
    confidence: f64,
) -> PyResult<mb::HistoryMatchOptions> {
    let max_iterations: usize = super::whole("max_iterations", max_iterations)?;
    let objective = match objective {
        "pressure" => mb::Objective::Pressure,
        "withdrawal" => mb::Objective::Withdrawal,
        _ => {
            return Err(Error::InvalidOption {
                arg: "objective",
                value: objective.into(),
                allowed: "pressure, withdrawal",
            }
            .into());
        }
    };
    Ok(mb::HistoryMatchOptions {
        m,
        aquifer: aquifer.map(|a| a.model),
        fit_shape,
        fit_red,
        objective,
        max_iterations,
        tolerance,
        confidence,
    })
}

fn match_dict<'py>(py: Python<'py>, f: mb::HistoryMatch) -> PyResult<Bound<'py, PyDict>> {
    let d = report_dict(py, f.report)?;
    d.set_item("n", f.n)?;
    d.set_item("m", f.m)?;
    Ok(d)
}

fn gas_match_dict<'py>(py: Python<'py>, f: mb::GasHistoryMatch) -> PyResult<Bound<'py, PyDict>> {
    let d = report_dict(py, f.report)?;
    d.set_item("g", f.g)?;
    d.set_item("ce", f.ce)?;
    Ok(d)
}

/// The entries shared by the oil and gas match dicts.
fn report_dict<'py>(py: Python<'py>, f: mb::MatchReport) -> PyResult<Bound<'py, PyDict>> {
    let d = PyDict::new(py);
    let names: Vec<&str> = f.parameters.iter().map(|p| p.name()).collect();
    params_into(
        py,
        &d,
        &names,
        &f.values,
        &f.std_errors,
        (&f.ci_low, &f.ci_high),
        f.correlation,
    )?;
    d.set_item("aquifer", f.aquifer.map(Aquifer))?;
    d.set_item("we", arr(py, f.we))?;
    d.set_item("p_model", arr(py, f.p_model))?;
    d.set_item("residuals", arr(py, f.residuals))?;
    d.set_item("rms", f.rms)?;
    d.set_item("used", numpy::PyArray1::from_vec(py, f.used))?;
    d.set_item("objective", objective_name(f.objective))?;
    d.set_item("iterations", f.iterations)?;
    d.set_item("evaluations", f.evaluations)?;
    d.set_item("status", format!("{:?}", f.status))?;
    d.set_item("condition_number", f.condition_number)?;
    d.set_item("warnings", PyList::new(py, f.warnings)?)?;
    Ok(d)
}

/// The parameter entries and correlation matrix shared by the oil and gas match dicts.
fn params_into<'py>(
    py: Python<'py>,
    d: &Bound<'py, PyDict>,
    names: &[&str],
    values: &[f64],
    std_errors: &[f64],
    ci: (&[f64], &[f64]),
    correlation: Vec<f64>,
) -> PyResult<()> {
    let params = PyDict::new(py);
    for (i, name) in names.iter().enumerate() {
        let e = PyDict::new(py);
        e.set_item("value", values[i])?;
        e.set_item("std_error", std_errors[i])?;
        e.set_item("ci_low", ci.0[i])?;
        e.set_item("ci_high", ci.1[i])?;
        params.set_item(name, e)?;
    }
    d.set_item("parameters", params)?;
    let k = names.len();
    let corr = numpy::PyArray1::from_vec(py, correlation).reshape([k, k])?;
    d.set_item("correlation", corr)?;
    Ok(())
}

fn objective_name(o: mb::Objective) -> &'static str {
    match o {
        mb::Objective::Pressure => "pressure",
        mb::Objective::Withdrawal => "withdrawal",
    }
}

/// History match of N, m (``m=None`` fits it) and the aquifer (its shape parameters are the
/// start, fitted when ``fit_shape``; ``fit_red`` also fits reD) by nonlinear least squares.
/// ``objective="pressure"`` (observed minus model pressure, psi) or ``"withdrawal"``
/// (Havlena–Odeh imbalance, rb). Returns a dict with ``parameters`` (name -> value,
/// std_error, ci_low, ci_high), ``correlation``, ``n``, ``m``, ``aquifer``, per-row ``we``,
/// ``p_model``, ``residuals``, and ``rms``, ``iterations``, ``status``, ``condition_number``
/// (of the scaled J^T J) and ``warnings`` (ill-conditioning, correlated parameters).
#[pyfunction]
#[pyo3(signature = (pvt, *, t_days, p, np_stb, gp_scf, wp_stb = None, wi_stb = None, gi_scf = None, p_initial, swi = 0.0, cw = 0.0, cf = 0.0, m = None, aquifer = None, fit_shape = true, fit_red = false, objective = "pressure", max_iterations = 100, tolerance = 1e-10, confidence = 0.95))]
#[allow(clippy::too_many_arguments)]
fn history_match<'py>(
    py: Python<'py>,
    pvt: &PvtTable,
    t_days: In<'py>,
    p: In<'py>,
    np_stb: In<'py>,
    gp_scf: In<'py>,
    wp_stb: Option<In<'py>>,
    wi_stb: Option<In<'py>>,
    gi_scf: Option<In<'py>>,
    p_initial: f64,
    swi: f64,
    cw: f64,
    cf: f64,
    m: Option<f64>,
    aquifer: Option<PyRef<'py, Aquifer>>,
    fit_shape: bool,
    fit_red: bool,
    objective: &str,
    max_iterations: i128,
    tolerance: f64,
    confidence: f64,
) -> PyResult<Bound<'py, PyDict>> {
    let hs = hist(
        &t_days, &p, &np_stb, &gp_scf, &wp_stb, &wi_stb, &gi_scf, p_initial, swi, cw, cf,
    )?;
    let opts = match_options(
        m,
        parse_aquifer(&aquifer),
        fit_shape,
        fit_red,
        objective,
        max_iterations,
        tolerance,
        confidence,
    )?;
    let table = &pvt.inner;
    let f = py.detach(|| mb::history_match(table, &hs.h, &hs.r, &opts))?;
    match_dict(py, f)
}

/// Batch history match in parallel (all cores, GIL released). ``pvts`` and ``histories``
/// are equal-length lists (a history is a dict with the keyword arrays of
/// :func:`history_match`: ``t_days``, ``p``, ``np_stb``, ``gp_scf`` and optionally
/// ``wp_stb``, ``wi_stb``, ``gi_scf``; any other key is an error); ``p_initial``, ``swi``, ``cw``, ``cf`` are lists of
/// the same length. Returns a list of result dicts, or of exceptions where
/// ``errors="coerce"`` (with ``"raise"`` the first failure raises).
#[pyfunction]
#[pyo3(signature = (pvts, histories, *, p_initial, swi, cw, cf, m = None, aquifer = None, fit_shape = true, fit_red = false, objective = "pressure", max_iterations = 100, tolerance = 1e-10, confidence = 0.95, errors = "raise"))]
#[allow(clippy::too_many_arguments)]
fn history_match_batch<'py>(
    py: Python<'py>,
    pvts: Vec<PyRef<'py, PvtTable>>,
    histories: Vec<Bound<'py, PyDict>>,
    p_initial: Vec<f64>,
    swi: Vec<f64>,
    cw: Vec<f64>,
    cf: Vec<f64>,
    m: Option<f64>,
    aquifer: Option<PyRef<'py, Aquifer>>,
    fit_shape: bool,
    fit_red: bool,
    objective: &str,
    max_iterations: i128,
    tolerance: f64,
    confidence: f64,
    errors: &str,
) -> PyResult<Bound<'py, PyList>> {
    let oe = on_error(errors)?;
    let n = histories.len();
    for (name, len) in [
        ("pvts", pvts.len()),
        ("p_initial", p_initial.len()),
        ("swi", swi.len()),
        ("cw", cw.len()),
        ("cf", cf.len()),
    ] {
        if len != n {
            return Err(Error::Shape(format!(
                "`{name}` has {len} entries but `histories` has {n}"
            ))
            .into());
        }
    }
    let get = |d: &Bound<'py, PyDict>, k: &str| -> PyResult<Option<In<'py>>> {
        match d.get_item(k)? {
            Some(v) => Ok(Some(v.extract()?)),
            None => Ok(None),
        }
    };
    // Convert every history; a bad one fails the call ("raise") or becomes its exception
    // in the output list ("coerce").
    let mut inputs = Vec::with_capacity(n);
    let mut slots: Vec<Result<usize, PyErr>> = Vec::with_capacity(n);
    for (i, d) in histories.iter().enumerate() {
        let req = |k: &'static str| -> PyResult<In<'py>> {
            get(d, k)?.ok_or_else(|| {
                Error::InvalidRecord {
                    arg: "histories".into(),
                    row: i,
                    message: format!("missing key {k:?}"),
                }
                .into()
            })
        };
        let conv = (|| -> PyResult<Hist> {
            // A misspelt key (e.g. "wp_stbb") would silently drop its column.
            for k in d.keys() {
                let known = k
                    .extract::<String>()
                    .is_ok_and(|k| HISTORY_KEYS.contains(&k.as_str()));
                if !known {
                    return Err(Error::InvalidRecord {
                        arg: "histories".into(),
                        row: i,
                        message: format!(
                            "unknown key {}; the keys are {}",
                            k.repr()?,
                            HISTORY_KEYS.join(", ")
                        ),
                    }
                    .into());
                }
            }
            hist(
                &req("t_days")?,
                &req("p")?,
                &req("np_stb")?,
                &req("gp_scf")?,
                &get(d, "wp_stb")?,
                &get(d, "wi_stb")?,
                &get(d, "gi_scf")?,
                p_initial[i],
                swi[i],
                cw[i],
                cf[i],
            )
        })();
        match conv {
            Ok(hs) => {
                slots.push(Ok(inputs.len()));
                inputs.push(mb::HistoryMatchInput {
                    pvt: pvts[i].inner.clone(),
                    history: hs.h,
                    reservoir: hs.r,
                });
            }
            Err(e) => slots.push(Err(e)),
        }
    }
    let opts = match_options(
        m,
        parse_aquifer(&aquifer),
        fit_shape,
        fit_red,
        objective,
        max_iterations,
        tolerance,
        confidence,
    )?;
    let mut results: Vec<Option<crate::Result<mb::HistoryMatch>>> =
        detach(py, || mb::history_match_batch(&inputs, &opts))
            .into_iter()
            .map(Some)
            .collect();
    let out = PyList::empty(py);
    for (i, slot) in slots.into_iter().enumerate() {
        let r: Result<mb::HistoryMatch, PyErr> = match slot {
            Ok(k) => results[k]
                .take()
                .expect("each result taken once")
                .map_err(PyErr::from),
            Err(e) => Err(e),
        };
        match r {
            Ok(f) => out.append(match_dict(py, f)?)?,
            Err(err) => match oe {
                crate::array::OnError::Raise => {
                    let msg = format!("reservoir {i}: {}", err.value(py));
                    return Err(PyErr::from_type(err.get_type(py), msg));
                }
                crate::array::OnError::Coerce => out.append(err.value(py))?,
            },
        }
    }
    Ok(out)
}

// ---- Gas ----------------------------------------------------------------------------------------

fn gas_dict<'py>(py: Python<'py>, f: mb::GasFit) -> PyResult<Bound<'py, PyDict>> {
    let d = PyDict::new(py);
    d.set_item("g", f.g)?;
    d.set_item("g_se", f.g_se)?;
    d.set_item("pz_initial", f.pz_initial)?;
    d.set_item("gp_abandon", f.gp_abandon)?;
    d.set_item("rf_abandon", f.rf_abandon)?;
    d.set_item("aquifer_constant", f.aquifer_constant)?;
    d.set_item("aquifer_constant_se", f.aquifer_constant_se)?;
    line_into(py, &d, f.line)?;
    Ok(d)
}

/// OGIP by the p/z straight line of a volumetric gas reservoir: ``gp_scf`` (scf), ``p``
/// (psia), ``z``; ``pz_abandon`` (psia) gives the recovery read from the fitted line. Dict
/// of ``g`` (scf), ``g_se``, ``pz_initial`` (psia), ``gp_abandon`` (scf), ``rf_abandon`` and
/// the line report.
#[pyfunction]
#[pyo3(signature = (*, gp_scf, p, z, select = None, pz_abandon = None))]
fn pz_fit<'py>(
    py: Python<'py>,
    gp_scf: In<'py>,
    p: In<'py>,
    z: In<'py>,
    select: Option<Vec<bool>>,
    pz_abandon: Option<f64>,
) -> PyResult<Bound<'py, PyDict>> {
    let (g, pp, zz) = (vec1("gp_scf", &gp_scf)?, vec1("p", &p)?, vec1("z", &z)?);
    let f = py
        .detach(|| mb::pz_fit(&g, &pp, &zz, select.as_deref(), pz_abandon))
        .map_err(rename_gas)?;
    gas_dict(py, f)
}

fn rename_gas(e: Error) -> Error {
    match e {
        Error::Shape(m) => Error::Shape(rename_in(m, &HISTORY_NAMES)),
        Error::InvalidRecord { arg, row, message } if arg == "gp" => Error::InvalidRecord {
            arg: "gp_scf".into(),
            row,
            message,
        },
        Error::InvalidRecord { arg, row, message } if arg == "wp" => Error::InvalidRecord {
            arg: "wp_stb".into(),
            row,
            message,
        },
        o => o,
    }
}

/// OGIP of an abnormally pressured gas reservoir (Ramagost & Farshad 1981): p/z corrected by
/// 1 - ce (pi - p), ce = (cw Swi + cf)/(1 - Swi). Abandonment as ``p_abandon`` (psia) and
/// ``z_abandon``. Same dict as :func:`pz_fit`.
#[pyfunction]
#[pyo3(signature = (*, gp_scf, p, z, p_initial, swi, cw, cf, select = None, p_abandon = None, z_abandon = None))]
#[allow(clippy::too_many_arguments)]
fn pz_fit_abnormal<'py>(
    py: Python<'py>,
    gp_scf: In<'py>,
    p: In<'py>,
    z: In<'py>,
    p_initial: f64,
    swi: f64,
    cw: f64,
    cf: f64,
    select: Option<Vec<bool>>,
    p_abandon: Option<f64>,
    z_abandon: Option<f64>,
) -> PyResult<Bound<'py, PyDict>> {
    let (g, pp, zz) = (vec1("gp_scf", &gp_scf)?, vec1("p", &p)?, vec1("z", &z)?);
    let ab = match (p_abandon, z_abandon) {
        (Some(a), Some(b)) => Some((a, b)),
        (None, None) => None,
        _ => {
            return Err(Error::InvalidOption {
                arg: "p_abandon",
                value: "only one of p_abandon, z_abandon".into(),
                allowed: "both or neither",
            }
            .into());
        }
    };
    let f = py
        .detach(|| mb::pz_fit_abnormal(&g, &pp, &zz, p_initial, swi, cw, cf, select.as_deref(), ab))
        .map_err(rename_gas)?;
    gas_dict(py, f)
}

/// Cole plot: F/Eg (scf) per row of a gas history (flat at G when volumetric, rising with
/// aquifer support, falling with abnormal pressure). NaN at the initial row.
#[pyfunction]
#[pyo3(signature = (*, gp_scf, p, z, p_initial, z_initial, temperature_f, wp_stb = None, bw = 1.0, p_sc = 14.696, t_sc = 60.0))]
#[allow(clippy::too_many_arguments)]
fn cole_plot<'py>(
    py: Python<'py>,
    gp_scf: In<'py>,
    p: In<'py>,
    z: In<'py>,
    p_initial: f64,
    z_initial: f64,
    temperature_f: f64,
    wp_stb: Option<In<'py>>,
    bw: f64,
    p_sc: f64,
    t_sc: f64,
) -> PyResult<Bound<'py, PyAny>> {
    let (g, pp, zz) = (vec1("gp_scf", &gp_scf)?, vec1("p", &p)?, vec1("z", &z)?);
    let wp = opt_vec1("wp_stb", &wp_stb)?;
    let sc = StandardConditions::new(p_sc, t_sc)?;
    let y = py
        .detach(|| {
            mb::cole_plot(
                &g,
                &pp,
                &zz,
                &wp,
                bw,
                p_initial,
                z_initial,
                temperature_f,
                sc,
            )
        })
        .map_err(rename_gas)?;
    Ok(arr(py, y))
}

/// OGIP and aquifer constant of a water-drive gas reservoir: F/Eg = G + C We_unit/Eg with
/// the shape of ``aquifer``. Same dict as :func:`pz_fit` (``g``, ``aquifer_constant``, ...).
#[pyfunction]
#[pyo3(signature = (*, t_days, gp_scf, p, z, p_initial, z_initial, temperature_f, aquifer, wp_stb = None, bw = 1.0, p_sc = 14.696, t_sc = 60.0, select = None))]
#[allow(clippy::too_many_arguments)]
fn gas_water_drive_fit<'py>(
    py: Python<'py>,
    t_days: In<'py>,
    gp_scf: In<'py>,
    p: In<'py>,
    z: In<'py>,
    p_initial: f64,
    z_initial: f64,
    temperature_f: f64,
    aquifer: PyRef<'py, Aquifer>,
    wp_stb: Option<In<'py>>,
    bw: f64,
    p_sc: f64,
    t_sc: f64,
    select: Option<Vec<bool>>,
) -> PyResult<Bound<'py, PyDict>> {
    let t = vec1("t_days", &t_days)?;
    let (g, pp, zz) = (vec1("gp_scf", &gp_scf)?, vec1("p", &p)?, vec1("z", &z)?);
    let wp = opt_vec1("wp_stb", &wp_stb)?;
    let sc = StandardConditions::new(p_sc, t_sc)?;
    let model = aquifer.0.model;
    let f = py
        .detach(|| {
            mb::gas_water_drive_fit(
                &t,
                &g,
                &pp,
                &zz,
                &wp,
                bw,
                p_initial,
                z_initial,
                temperature_f,
                sc,
                model,
                select.as_deref(),
            )
        })
        .map_err(rename_gas)?;
    gas_dict(py, f)
}

/// History match of a gas reservoir: gas in place G (scf) with the aquifer constant and
/// shape (``aquifer``'s shape parameters are the start, fitted when ``fit_shape``) by
/// nonlinear least squares. History: ``t_days`` (days), ``p`` (psia), ``gp_scf``,
/// ``wp_stb``; gas table: ``table_p`` (psia, ascending) with ``table_z`` (at
/// ``temperature_f`` degF and standard conditions ``p_sc`` psia, ``t_sc`` degF) or
/// ``table_bg`` (rb/scf). ``swi``, ``cw``, ``cf`` (1/psi) give the abnormal-pressure term
/// Bgi ce (pi - p) (Ramagost & Farshad 1981), or ``fit_ce=True`` estimates ce (1/psi, in
/// [0, 1e-4]) with G; ``bw`` rb/STB. Returns a dict with ``parameters`` (name -> value,
/// std_error, ci_low, ci_high), ``correlation``, ``g`` (scf), ``ce`` (1/psi),
/// ``aquifer``, per-row ``we`` (rb), ``p_model`` (psia), ``residuals``, and ``rms``,
/// ``iterations``, ``status``, ``condition_number``, ``warnings``.
#[pyfunction]
#[pyo3(signature = (*, t_days, p, gp_scf, p_initial, table_p, table_z = None, table_bg = None, temperature_f = None, wp_stb = None, bw = 1.0, swi = 0.0, cw = 0.0, cf = 0.0, aquifer = None, fit_shape = true, fit_red = false, fit_ce = false, objective = "pressure", max_iterations = 100, tolerance = 1e-10, confidence = 0.95, p_sc = 14.696, t_sc = 60.0))]
#[allow(clippy::too_many_arguments)]
fn gas_history_match<'py>(
    py: Python<'py>,
    t_days: In<'py>,
    p: In<'py>,
    gp_scf: In<'py>,
    p_initial: f64,
    table_p: In<'py>,
    table_z: Option<In<'py>>,
    table_bg: Option<In<'py>>,
    temperature_f: Option<f64>,
    wp_stb: Option<In<'py>>,
    bw: f64,
    swi: f64,
    cw: f64,
    cf: f64,
    aquifer: Option<PyRef<'py, Aquifer>>,
    fit_shape: bool,
    fit_red: bool,
    fit_ce: bool,
    objective: &str,
    max_iterations: i128,
    tolerance: f64,
    confidence: f64,
    p_sc: f64,
    t_sc: f64,
) -> PyResult<Bound<'py, PyDict>> {
    let tp = vec1("table_p", &table_p)?;
    let table = match (&table_z, &table_bg, temperature_f) {
        (Some(z), None, Some(tf)) => {
            let sc = StandardConditions::new(p_sc, t_sc)?;
            mb::GasPvtTable::from_z(tp, vec1("table_z", z)?, tf, sc)
        }
        (None, Some(b), None) => mb::GasPvtTable::from_bg(tp, vec1("table_bg", b)?),
        _ => {
            return Err(Error::InvalidOption {
                arg: "table_z",
                value: "a combination of table_z, table_bg and temperature_f".into(),
                allowed: "table_z with temperature_f, or table_bg alone",
            }
            .into());
        }
    }
    .map_err(|e| match e {
        Error::InvalidRecord { arg, row, message } => Error::InvalidRecord {
            arg: format!("table_{arg}"),
            row,
            message,
        },
        Error::Shape(m) => Error::Shape(rename_in(
            m,
            &[("p", "table_p"), ("z", "table_z"), ("bg", "table_bg")],
        )),
        o => o,
    })?;
    let history = mb::GasHistory::new(
        vec1("t_days", &t_days)?,
        vec1("p", &p)?,
        vec1("gp_scf", &gp_scf)?,
        opt_vec1("wp_stb", &wp_stb)?,
        p_initial,
    )
    .map_err(rename_gas)?;
    let reservoir = mb::GasReservoir::new(p_initial, swi, cw, cf, bw)?;
    let o = match_options(
        None,
        parse_aquifer(&aquifer),
        fit_shape,
        fit_red,
        objective,
        max_iterations,
        tolerance,
        confidence,
    )?;
    let opts = mb::GasMatchOptions {
        aquifer: o.aquifer,
        fit_shape,
        fit_red,
        fit_ce,
        objective: o.objective,
        max_iterations: o.max_iterations,
        tolerance,
        confidence,
    };
    let f = py.detach(|| mb::gas_history_match(&table, &history, &reservoir, &opts))?;
    gas_match_dict(py, f)
}

// ---- Forecast -------------------------------------------------------------------------------------

/// The `n_steps` of a solution-gas-drive forecast as a count whose table (a row of a dozen
/// numbers per step) can be allocated: an error naming `n_steps` otherwise.
fn forecast_steps(n_steps: i128) -> PyResult<usize> {
    let n: usize = super::whole("n_steps", n_steps)?;
    super::check_memory("n_steps", n, 16 * std::mem::size_of::<f64>())?;
    Ok(n)
}

/// Solution-gas-drive forecast below the bubble point by Muskat (1945): dict of per-step
/// ``p`` (psia), ``so``, ``sg`` (fractions), ``krg_over_kro``, ``gor`` (scf/STB),
/// ``np_over_n`` (recovery factor), ``gp_over_n`` (scf/STB) and ``stopped_early``. The PVT
/// table needs viscosity columns; ``relperm`` is a :class:`CoreyGasOil` whose ``swc`` is the
/// connate water saturation.
#[pyfunction]
#[pyo3(signature = (pvt, relperm, *, p_bubble, p_end, n_steps = 100))]
fn muskat_forecast<'py>(
    py: Python<'py>,
    pvt: &PvtTable,
    relperm: PyRef<'py, super::relperm::CoreyGasOil>,
    p_bubble: f64,
    p_end: f64,
    n_steps: i128,
) -> PyResult<Bound<'py, PyDict>> {
    let k = relperm.0;
    let table = &pvt.inner;
    let n_steps = forecast_steps(n_steps)?;
    let f = py.detach(|| mb::muskat_forecast(table, &k, p_bubble, p_end, n_steps))?;
    forecast_dict(py, f)
}

/// The per-step dict shared by the Muskat and Tarner forecasts.
fn forecast_dict(py: Python<'_>, f: mb::SolutionGasForecast) -> PyResult<Bound<'_, PyDict>> {
    let d = PyDict::new(py);
    d.set_item("p", arr(py, f.p))?;
    d.set_item("so", arr(py, f.so))?;
    d.set_item("sg", arr(py, f.sg))?;
    d.set_item("krg_over_kro", arr(py, f.krg_over_kro))?;
    d.set_item("gor", arr(py, f.gor))?;
    d.set_item("np_over_n", arr(py, f.np_over_n))?;
    d.set_item("gp_over_n", arr(py, f.gp_over_n))?;
    d.set_item("stopped_early", f.stopped_early)?;
    Ok(d)
}

/// Solution-gas-drive forecast below the bubble point by Tarner's (1944) trial and error:
/// for each pressure step the oil increment that makes Gp from the material balance equal
/// Gp from the producing GOR (bracketed, safeguarded root find). Same inputs and dict as
/// :func:`muskat_forecast`, plus ``iterations`` (per row) and ``max_mismatch`` (scf/STB).
#[pyfunction]
#[pyo3(signature = (pvt, relperm, *, p_bubble, p_end, n_steps = 100))]
fn tarner_forecast<'py>(
    py: Python<'py>,
    pvt: &PvtTable,
    relperm: PyRef<'py, super::relperm::CoreyGasOil>,
    p_bubble: f64,
    p_end: f64,
    n_steps: i128,
) -> PyResult<Bound<'py, PyDict>> {
    let k = relperm.0;
    let table = &pvt.inner;
    let n_steps = forecast_steps(n_steps)?;
    let f = py.detach(|| mb::tarner_forecast(table, &k, p_bubble, p_end, n_steps))?;
    let d = forecast_dict(py, f.forecast)?;
    let it: Vec<u64> = f.iterations.iter().map(|&v| v as u64).collect();
    d.set_item("iterations", it.into_pyarray(py))?;
    d.set_item("max_mismatch", f.max_mismatch)?;
    Ok(d)
}

pub(super) fn register(m: &Bound<'_, PyModule>) -> PyResult<()> {
    m.add_function(wrap_pyfunction!(tarner_forecast, m)?)?;
    m.add_function(wrap_pyfunction!(gas_history_match, m)?)?;
    m.add_class::<PvtTable>()?;
    m.add_class::<Aquifer>()?;
    m.add_function(wrap_pyfunction!(veh_dimensionless_influx, m)?)?;
    m.add_function(wrap_pyfunction!(veh_dimensionless_pressure, m)?)?;
    m.add_function(wrap_pyfunction!(veh_constants, m)?)?;
    m.add_function(wrap_pyfunction!(fetkovich_j_radial, m)?)?;
    m.add_function(wrap_pyfunction!(fetkovich_j_linear, m)?)?;
    m.add_function(wrap_pyfunction!(gas_bg, m)?)?;
    m.add_function(wrap_pyfunction!(oil_mbe_terms, m)?)?;
    m.add_function(wrap_pyfunction!(havlena_odeh_fit, m)?)?;
    m.add_function(wrap_pyfunction!(campbell_plot, m)?)?;
    m.add_function(wrap_pyfunction!(drive_indices, m)?)?;
    m.add_function(wrap_pyfunction!(classify_drive, m)?)?;
    m.add_function(wrap_pyfunction!(history_match, m)?)?;
    m.add_function(wrap_pyfunction!(history_match_batch, m)?)?;
    m.add_function(wrap_pyfunction!(pz_fit, m)?)?;
    m.add_function(wrap_pyfunction!(pz_fit_abnormal, m)?)?;
    m.add_function(wrap_pyfunction!(cole_plot, m)?)?;
    m.add_function(wrap_pyfunction!(gas_water_drive_fit, m)?)?;
    m.add_function(wrap_pyfunction!(muskat_forecast, m)?)?;
    Ok(())
}
