//! Python bindings of [`crate::oil`]: conversion only. Array functions lift the scalar
//! kernels with the GIL released; `Oil` is a frozen, comparable, picklable description.

use super::gas::Gas as PyGas;
use super::water::Water as PyWater;
use super::{In, call, detach, on_error};
use crate::array::{OnError, broadcast_shape, lift};
use crate::error::Error;
use crate::gas::Gas as CoreGas;
use crate::oil::table::{COLUMNS, build_long_results_with};
use crate::oil::{
    self as core, BlackOilTable, BoMethod, Calibration, CoMethod, DeadOilViscosityMethod, Methods,
    Oil as CoreOil, PbMethod,
};
use crate::units::StandardConditions;
use crate::water::Water as CoreWater;
use ndarray::ArrayViewD;
use numpy::IntoPyArray;
use pyo3::prelude::*;
use pyo3::types::{PyDict, PyList, PyTuple};

fn sc(p_sc: f64, t_sc: f64) -> PyResult<StandardConditions> {
    Ok(StandardConditions::new(p_sc, t_sc)?)
}

/// Specific gravity (60/60 degF) from API gravity (degAPI).
#[pyfunction]
#[pyo3(signature = (api, *, errors = "raise"))]
fn sg_from_api(py: Python<'_>, api: In<'_>, errors: &str) -> PyResult<Py<PyAny>> {
    let oe = on_error(errors)?;
    call(py, [&api], move |[a]| {
        lift(["api"], [a], oe, |[a]| core::sg_from_api(a))
    })
}

/// API gravity (degAPI) from specific gravity (60/60 degF).
#[pyfunction]
#[pyo3(signature = (oil_sg, *, errors = "raise"))]
fn api_from_sg(py: Python<'_>, oil_sg: In<'_>, errors: &str) -> PyResult<Py<PyAny>> {
    let oe = on_error(errors)?;
    call(py, [&oil_sg], move |[a]| {
        lift(["oil_sg"], [a], oe, |[a]| core::api_from_sg(a))
    })
}

/// Stock-tank oil molar mass, lbm/lbmol, from API gravity (Cragoe 1929).
#[pyfunction]
#[pyo3(signature = (api, *, errors = "raise"))]
fn oil_molar_mass(py: Python<'_>, api: In<'_>, errors: &str) -> PyResult<Py<PyAny>> {
    let oe = on_error(errors)?;
    call(py, [&api], move |[a]| {
        lift(["api"], [a], oe, |[a]| core::oil_molar_mass(a))
    })
}

/// Bubble-point pressure, psia, from solution GOR rs (scf/STB), gas_sg, api (degAPI),
/// temperature_f (degF).
#[pyfunction]
#[pyo3(signature = (rs, gas_sg, api, temperature_f, *, method = "standing", errors = "raise"))]
fn bubble_point(
    py: Python<'_>,
    rs: In<'_>,
    gas_sg: In<'_>,
    api: In<'_>,
    temperature_f: In<'_>,
    method: &str,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let (m, oe) = (PbMethod::parse(method)?, on_error(errors)?);
    call(py, [&rs, &gas_sg, &api, &temperature_f], move |v| {
        lift(
            ["rs", "gas_sg", "api", "temperature_f"],
            v,
            oe,
            |[r, g, a, t]| core::bubble_point(m, r, g, a, t),
        )
    })
}

/// Solution GOR, scf/STB, of an oil saturated at p (psia): the exact inverse of bubble_point.
#[pyfunction]
#[pyo3(signature = (p, gas_sg, api, temperature_f, *, method = "standing", errors = "raise"))]
fn solution_gor(
    py: Python<'_>,
    p: In<'_>,
    gas_sg: In<'_>,
    api: In<'_>,
    temperature_f: In<'_>,
    method: &str,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let (m, oe) = (PbMethod::parse(method)?, on_error(errors)?);
    call(py, [&p, &gas_sg, &api, &temperature_f], move |v| {
        lift(
            ["p", "gas_sg", "api", "temperature_f"],
            v,
            oe,
            |[p, g, a, t]| core::solution_gor(m, p, g, a, t),
        )
    })
}

/// 1.0 where the inputs lie inside the correlation's data ranges, else 0.0.
#[pyfunction]
#[pyo3(signature = (rs, gas_sg, api, temperature_f, *, method = "standing"))]
fn bubble_point_in_range(
    py: Python<'_>,
    rs: In<'_>,
    gas_sg: In<'_>,
    api: In<'_>,
    temperature_f: In<'_>,
    method: &str,
) -> PyResult<Py<PyAny>> {
    let m = PbMethod::parse(method)?;
    call(py, [&rs, &gas_sg, &api, &temperature_f], move |v| {
        lift(
            ["rs", "gas_sg", "api", "temperature_f"],
            v,
            OnError::Raise,
            |[r, g, a, t]| {
                Ok(if core::bubble_point_in_range(m, r, g, a, t) {
                    1.0
                } else {
                    0.0
                })
            },
        )
    })
}

/// 1.0 where rs, gas_sg, api, temperature_f and the resulting Bo lie inside the Bo
/// correlation's data ranges, else 0.0.
#[pyfunction]
#[pyo3(signature = (rs, gas_sg, api, temperature_f, *, method = "standing"))]
fn bo_saturated_in_range(
    py: Python<'_>,
    rs: In<'_>,
    gas_sg: In<'_>,
    api: In<'_>,
    temperature_f: In<'_>,
    method: &str,
) -> PyResult<Py<PyAny>> {
    let m = BoMethod::parse(method)?;
    call(py, [&rs, &gas_sg, &api, &temperature_f], move |v| {
        lift(
            ["rs", "gas_sg", "api", "temperature_f"],
            v,
            OnError::Raise,
            |[r, g, a, t]| {
                Ok(if core::bo_saturated_in_range(m, r, g, a, t) {
                    1.0
                } else {
                    0.0
                })
            },
        )
    })
}

/// 1.0 where api (degAPI) and temperature_f (degF) lie inside the dead-oil viscosity
/// correlation's data ranges, else 0.0.
#[pyfunction]
#[pyo3(signature = (api, temperature_f, *, method = "beggs_robinson"))]
fn dead_oil_viscosity_in_range(
    py: Python<'_>,
    api: In<'_>,
    temperature_f: In<'_>,
    method: &str,
) -> PyResult<Py<PyAny>> {
    let m = DeadOilViscosityMethod::parse(method)?;
    call(py, [&api, &temperature_f], move |v| {
        lift(["api", "temperature_f"], v, OnError::Raise, |[a, t]| {
            Ok(if core::viscosity::dead_oil_viscosity_in_range(m, a, t) {
                1.0
            } else {
                0.0
            })
        })
    })
}

/// Gas gravity corrected to 100 psig separator pressure (Vasquez–Beggs 1980).
#[pyfunction]
#[pyo3(signature = (gas_sg, api, separator_t, separator_p, *, errors = "raise"))]
fn vasquez_beggs_gas_sg_100psig(
    py: Python<'_>,
    gas_sg: In<'_>,
    api: In<'_>,
    separator_t: In<'_>,
    separator_p: In<'_>,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let oe = on_error(errors)?;
    call(py, [&gas_sg, &api, &separator_t, &separator_p], move |v| {
        lift(
            ["gas_sg", "api", "separator_t", "separator_p"],
            v,
            oe,
            |[g, a, t, p]| core::vasquez_beggs_gas_sg_100psig(g, a, t, p).map_err(separator_names),
        )
    })
}

/// The core names the separator conditions `tsep_f` and `psep_psia`; errors name them as
/// the Python user typed them.
fn separator_names(e: crate::Error) -> crate::Error {
    super::rename_arg(
        e,
        &[("tsep_f", "separator_t"), ("psep_psia", "separator_p")],
    )
}

/// Saturated oil FVF, rb/STB.
#[pyfunction]
#[pyo3(signature = (rs, gas_sg, api, temperature_f, *, method = "standing", errors = "raise"))]
fn bo_saturated(
    py: Python<'_>,
    rs: In<'_>,
    gas_sg: In<'_>,
    api: In<'_>,
    temperature_f: In<'_>,
    method: &str,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let (m, oe) = (BoMethod::parse(method)?, on_error(errors)?);
    call(py, [&rs, &gas_sg, &api, &temperature_f], move |v| {
        lift(
            ["rs", "gas_sg", "api", "temperature_f"],
            v,
            oe,
            |[r, g, a, t]| core::bo_saturated(m, r, g, a, t),
        )
    })
}

/// Undersaturated oil compressibility, 1/psi.
#[pyfunction]
#[pyo3(signature = (p, rsb, gas_sg, api, temperature_f, *, method = "vasquez_beggs", errors = "raise"))]
#[allow(clippy::too_many_arguments)]
fn co_undersaturated(
    py: Python<'_>,
    p: In<'_>,
    rsb: In<'_>,
    gas_sg: In<'_>,
    api: In<'_>,
    temperature_f: In<'_>,
    method: &str,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let (m, oe) = (CoMethod::parse(method)?, on_error(errors)?);
    call(py, [&p, &rsb, &gas_sg, &api, &temperature_f], move |v| {
        lift(
            ["p", "rsb", "gas_sg", "api", "temperature_f"],
            v,
            oe,
            |[p, r, g, a, t]| core::co_undersaturated(m, p, r, g, a, t),
        )
    })
}

/// Undersaturated oil FVF, rb/STB: Bob exp(-integral co dp) from pb to p.
#[pyfunction]
#[pyo3(signature = (p, pb, bob, rsb, gas_sg, api, temperature_f, *, method = "vasquez_beggs", errors = "raise"))]
#[allow(clippy::too_many_arguments)]
fn bo_undersaturated(
    py: Python<'_>,
    p: In<'_>,
    pb: In<'_>,
    bob: In<'_>,
    rsb: In<'_>,
    gas_sg: In<'_>,
    api: In<'_>,
    temperature_f: In<'_>,
    method: &str,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let (m, oe) = (CoMethod::parse(method)?, on_error(errors)?);
    call(
        py,
        [&p, &pb, &bob, &rsb, &gas_sg, &api, &temperature_f],
        move |v| {
            lift(
                ["p", "pb", "bob", "rsb", "gas_sg", "api", "temperature_f"],
                v,
                oe,
                |[p, pb, b, r, g, a, t]| core::bo_undersaturated(m, p, pb, b, r, g, a, t),
            )
        },
    )
}

/// Apparent oil compressibility below Pb, 1/psi.
#[pyfunction]
#[pyo3(signature = (bo, dbo_dp, bg_rb_per_scf, drs_dp, *, errors = "raise"))]
fn apparent_compressibility(
    py: Python<'_>,
    bo: In<'_>,
    dbo_dp: In<'_>,
    bg_rb_per_scf: In<'_>,
    drs_dp: In<'_>,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let oe = on_error(errors)?;
    call(py, [&bo, &dbo_dp, &bg_rb_per_scf, &drs_dp], move |v| {
        lift(
            ["bo", "dbo_dp", "bg_rb_per_scf", "drs_dp"],
            v,
            oe,
            |[b, db, g, dr]| core::apparent_compressibility(b, db, g, dr),
        )
    })
}

/// Total two-phase FVF Bt = Bo + Bg (Rsi - Rs), rb/STB.
#[pyfunction]
#[pyo3(signature = (bo, bg_rb_per_scf, rsi, rs, *, errors = "raise"))]
fn total_fvf(
    py: Python<'_>,
    bo: In<'_>,
    bg_rb_per_scf: In<'_>,
    rsi: In<'_>,
    rs: In<'_>,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let oe = on_error(errors)?;
    call(py, [&bo, &bg_rb_per_scf, &rsi, &rs], move |v| {
        lift(
            ["bo", "bg_rb_per_scf", "rsi", "rs"],
            v,
            oe,
            |[b, g, ri, r]| core::total_fvf(b, g, ri, r),
        )
    })
}

/// Oil density at reservoir conditions by mass balance, lbm/ft3.
#[pyfunction]
#[pyo3(signature = (rs, bo, gas_sg, api, *, p_sc = 14.696, t_sc = 60.0, errors = "raise"))]
#[allow(clippy::too_many_arguments)]
fn oil_density(
    py: Python<'_>,
    rs: In<'_>,
    bo: In<'_>,
    gas_sg: In<'_>,
    api: In<'_>,
    p_sc: f64,
    t_sc: f64,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let (s, oe) = (sc(p_sc, t_sc)?, on_error(errors)?);
    call(py, [&rs, &bo, &gas_sg, &api], move |v| {
        lift(["rs", "bo", "gas_sg", "api"], v, oe, |[r, b, g, a]| {
            core::oil_density(r, b, g, a, &s)
        })
    })
}

/// Dead-oil viscosity, cp.
#[pyfunction]
#[pyo3(signature = (api, temperature_f, *, method = "beggs_robinson", errors = "raise"))]
fn dead_oil_viscosity(
    py: Python<'_>,
    api: In<'_>,
    temperature_f: In<'_>,
    method: &str,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let (m, oe) = (DeadOilViscosityMethod::parse(method)?, on_error(errors)?);
    call(py, [&api, &temperature_f], move |v| {
        lift(["api", "temperature_f"], v, oe, |[a, t]| {
            core::dead_oil_viscosity(m, a, t)
        })
    })
}

/// Saturated live-oil viscosity, cp (Beggs–Robinson 1975).
#[pyfunction]
#[pyo3(signature = (mu_od, rs, *, errors = "raise"))]
fn live_oil_viscosity(
    py: Python<'_>,
    mu_od: In<'_>,
    rs: In<'_>,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let oe = on_error(errors)?;
    call(py, [&mu_od, &rs], move |v| {
        lift(["mu_od", "rs"], v, oe, |[m, r]| {
            core::live_oil_viscosity(m, r)
        })
    })
}

/// Undersaturated oil viscosity, cp (Vasquez–Beggs 1980).
#[pyfunction]
#[pyo3(signature = (p, pb, mu_ob, *, errors = "raise"))]
fn undersaturated_oil_viscosity(
    py: Python<'_>,
    p: In<'_>,
    pb: In<'_>,
    mu_ob: In<'_>,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let oe = on_error(errors)?;
    call(py, [&p, &pb, &mu_ob], move |v| {
        lift(["p", "pb", "mu_ob"], v, oe, |[p, pb, m]| {
            core::undersaturated_oil_viscosity(p, pb, m)
        })
    })
}

/// Build a core description from Python-level options (shared by `Oil` and the batch).
#[allow(clippy::too_many_arguments)]
fn make_oil(
    api: f64,
    gas_sg: f64,
    temperature_f: f64,
    gor: Option<f64>,
    pb: Option<f64>,
    bob: Option<f64>,
    mu_ob: Option<f64>,
    methods: Methods,
    separator: Option<(f64, f64)>,
    salinity_wt_pct: f64,
    sc: StandardConditions,
) -> crate::Result<CoreOil> {
    let mut o = match (gor, pb) {
        (Some(g), Some(p)) => {
            CoreOil::new(api, gas_sg, g, temperature_f)?.with_measured_bubble_point(p)?
        }
        (Some(g), None) => CoreOil::new(api, gas_sg, g, temperature_f)?,
        (None, Some(p)) => CoreOil::from_bubble_point(api, gas_sg, p, temperature_f)?,
        (None, None) => return Err(Error::invalid("gor", f64::NAN, "give gor, pb or both")),
    };
    o = o
        .with_methods(methods)
        .with_calibration(Calibration {
            bob,
            mu_ob_cp: mu_ob,
        })?
        .with_salinity_wt_pct(salinity_wt_pct)?
        .with_standard_conditions(sc);
    if let Some((p, t)) = separator {
        o = o.with_separator(p, t)?;
    }
    Ok(o)
}

fn methods(pb: &str, bo: &str, co: &str, visc: &str) -> PyResult<Methods> {
    Ok(Methods {
        pb: PbMethod::parse(pb)?,
        bo: BoMethod::parse(bo)?,
        co: CoMethod::parse(co)?,
        dead_oil_viscosity: DeadOilViscosityMethod::parse(visc)?,
    })
}

fn separator(p: Option<f64>, t: Option<f64>) -> PyResult<Option<(f64, f64)>> {
    match (p, t) {
        (Some(p), Some(t)) => Ok(Some((p, t))),
        (None, None) => Ok(None),
        (Some(p), None) => Err(Error::invalid(
            "separator_t",
            p,
            "give separator_t together with separator_p",
        )
        .into()),
        (None, Some(t)) => Err(Error::invalid(
            "separator_p",
            t,
            "give separator_p together with separator_t",
        )
        .into()),
    }
}

/// One `Gas` for every well, or a sequence of them (one per well), as given to `gas=`.
fn gas_arg(gas: Option<&Bound<'_, PyAny>>) -> PyResult<Option<Vec<CoreGas>>> {
    let Some(g) = gas else { return Ok(None) };
    if let Ok(one) = g.cast::<PyGas>() {
        return Ok(Some(vec![one.get().0]));
    }
    per_item(g, "gas", |x| x.cast::<PyGas>().ok().map(|v| v.get().0)).map(Some)
}

/// One `Water` for every well, or a sequence of them (one per well), as given to `water=`.
fn water_arg(water: Option<&Bound<'_, PyAny>>) -> PyResult<Option<Vec<CoreWater>>> {
    let Some(w) = water else { return Ok(None) };
    if let Ok(one) = w.cast::<PyWater>() {
        return Ok(Some(vec![one.get().0.clone()]));
    }
    per_item(w, "water", |x| {
        x.cast::<PyWater>().ok().map(|v| v.get().0.clone())
    })
    .map(Some)
}

fn per_item<T>(
    seq: &Bound<'_, PyAny>,
    arg: &'static str,
    get: impl Fn(&Bound<'_, PyAny>) -> Option<T>,
) -> PyResult<Vec<T>> {
    let kind = if arg == "gas" { "Gas" } else { "Water" };
    let items = seq.try_iter().map_err(|_| {
        pyo3::exceptions::PyTypeError::new_err(format!(
            "`{arg}` must be a {kind} or a sequence of {kind} (one per well), got {}",
            seq.get_type()
                .name()
                .map(|n| n.to_string())
                .unwrap_or_default()
        ))
    })?;
    let mut out = Vec::new();
    for (i, x) in items.enumerate() {
        let x = x?;
        out.push(get(&x).ok_or_else(|| {
            pyo3::exceptions::PyTypeError::new_err(format!(
                "`{arg}`[{i}] must be a {kind}, got {}",
                x.get_type()
                    .name()
                    .map(|n| n.to_string())
                    .unwrap_or_default()
            ))
        })?);
    }
    Ok(out)
}

/// The gas and water of one oil's table: the given descriptions, or the defaults of
/// `Oil::gas_and_water` (a gas of the oil's gas gravity, a brine of its salinity).
fn gas_and_water(
    oil: &CoreOil,
    gas: Option<&CoreGas>,
    water: Option<&CoreWater>,
) -> crate::Result<(CoreGas, CoreWater)> {
    let g = match gas {
        Some(g) => *g,
        None => CoreGas::new(oil.gas_sg)?,
    };
    let w = match water {
        Some(w) => {
            let (a, b) = (w.standard_conditions(), oil.standard_conditions);
            if a != b {
                let (value, reason) = if a.p_psia != b.p_psia {
                    (
                        a.p_psia,
                        "the water's p_sc (psia) differs from the oil's; give both the same standard conditions",
                    )
                } else {
                    (
                        a.t_f,
                        "the water's t_sc (degF) differs from the oil's; give both the same standard conditions",
                    )
                };
                return Err(Error::invalid("water", value, reason));
            }
            w.clone()
        }
        None => oil.gas_and_water()?.1,
    };
    Ok((g, w))
}

/// The table of one oil with optional gas and water descriptions.
fn build_one(
    oil: &CoreOil,
    gas: Option<&CoreGas>,
    water: Option<&CoreWater>,
    p: &[f64],
) -> crate::Result<BlackOilTable> {
    if gas.is_none() && water.is_none() {
        return BlackOilTable::build(oil, p);
    }
    let (g, w) = gas_and_water(oil, gas, water)?;
    BlackOilTable::build_with(&oil.model()?, &g, &w, p)
}

fn table_dict<'py>(py: Python<'py>, t: BlackOilTable) -> PyResult<Bound<'py, PyDict>> {
    let d = PyDict::new(py);
    let is_pb: Vec<bool> = (0..t.p.len()).map(|i| i == t.pb_index).collect();
    for (name, _) in COLUMNS {
        let col = t.column(name).unwrap_or(&[]).to_vec();
        d.set_item(name, col.into_pyarray(py))?;
    }
    d.set_item("is_pb", is_pb.into_pyarray(py))?;
    Ok(d)
}

/// A black oil: stock-tank gravity, gas gravity, solution GOR and/or bubble point,
/// temperature, correlation choices, measurements to calibrate to, water salinity and
/// standard conditions. Frozen, comparable, picklable.
///
/// ``p_sc`` (psia) and ``t_sc`` (degF) are the standard conditions of Rs, GOR and the gas
/// volumes: they set Bg, the gas density and the dissolved-gas mass in the oil density. The
/// correlations take Rs and GOR as given (their data were at 14.7 psia and 60 degF; 14.65 psia
/// is a 0.3 % difference in gas volume, inside their scatter, and not corrected).
#[pyclass(name = "Oil", module = "stocktank._core", frozen, eq)]
#[derive(Clone, PartialEq)]
pub struct Oil(pub CoreOil);

#[pymethods]
impl Oil {
    #[new]
    #[pyo3(signature = (
        *, api, gas_sg, temperature_f, gor = None, pb = None, bob = None, mu_ob = None,
        pb_method = "standing", bo_method = "standing", co_method = "vasquez_beggs",
        dead_oil_viscosity_method = "beggs_robinson", separator_p = None, separator_t = None,
        salinity_wt_pct = 0.0, p_sc = 14.696, t_sc = 60.0
    ))]
    #[allow(clippy::too_many_arguments)]
    fn new(
        api: f64,
        gas_sg: f64,
        temperature_f: f64,
        gor: Option<f64>,
        pb: Option<f64>,
        bob: Option<f64>,
        mu_ob: Option<f64>,
        pb_method: &str,
        bo_method: &str,
        co_method: &str,
        dead_oil_viscosity_method: &str,
        separator_p: Option<f64>,
        separator_t: Option<f64>,
        salinity_wt_pct: f64,
        p_sc: f64,
        t_sc: f64,
    ) -> PyResult<Self> {
        let m = methods(pb_method, bo_method, co_method, dead_oil_viscosity_method)?;
        let o = make_oil(
            api,
            gas_sg,
            temperature_f,
            gor,
            pb,
            bob,
            mu_ob,
            m,
            separator(separator_p, separator_t)?,
            salinity_wt_pct,
            sc(p_sc, t_sc)?,
        )
        .map_err(separator_names)?;
        o.model().map_err(separator_names)?;
        Ok(Self(o))
    }
    #[getter]
    fn api(&self) -> f64 {
        self.0.api
    }
    #[getter]
    fn gas_sg(&self) -> f64 {
        self.0.gas_sg
    }
    #[getter]
    fn temperature_f(&self) -> f64 {
        self.0.temperature_f
    }
    #[getter]
    fn gor(&self) -> Option<f64> {
        self.0.gor
    }
    #[getter]
    fn pb(&self) -> Option<f64> {
        self.0.pb_psia
    }
    #[getter]
    fn bob(&self) -> Option<f64> {
        self.0.calibration.bob
    }
    #[getter]
    fn mu_ob(&self) -> Option<f64> {
        self.0.calibration.mu_ob_cp
    }
    #[getter]
    fn pb_method(&self) -> &'static str {
        self.0.methods.pb.name()
    }
    #[getter]
    fn bo_method(&self) -> &'static str {
        self.0.methods.bo.name()
    }
    #[getter]
    fn co_method(&self) -> &'static str {
        self.0.methods.co.name()
    }
    #[getter]
    fn dead_oil_viscosity_method(&self) -> &'static str {
        self.0.methods.dead_oil_viscosity.name()
    }
    #[getter]
    fn separator_p(&self) -> Option<f64> {
        self.0.separator.map(|s| s.p_psia)
    }
    #[getter]
    fn separator_t(&self) -> Option<f64> {
        self.0.separator.map(|s| s.t_f)
    }
    #[getter]
    fn salinity_wt_pct(&self) -> f64 {
        self.0.salinity_wt_pct
    }
    #[getter]
    fn p_sc(&self) -> f64 {
        self.0.standard_conditions.p_psia
    }
    #[getter]
    fn t_sc(&self) -> f64 {
        self.0.standard_conditions.t_f
    }
    /// The bubble point the model uses, psia.
    fn bubble_point(&self) -> PyResult<f64> {
        Ok(self.0.model()?.pb)
    }
    /// The initial solution GOR the model uses, scf/STB.
    fn rsi(&self) -> PyResult<f64> {
        Ok(self.0.model()?.rsi)
    }
    /// How far the raw correlations were from the measurements, and the scales applied.
    fn calibration_report<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyDict>> {
        let r = self.0.calibration_report()?;
        let d = PyDict::new(py);
        d.set_item("pb_correlation_psia", r.pb_correlation_psia)?;
        d.set_item("pb_psia", r.pb_psia)?;
        d.set_item("pb_scale", r.pb_scale)?;
        d.set_item("bob_correlation", r.bob_correlation)?;
        d.set_item("bob", r.bob)?;
        d.set_item("bo_scale", r.bo_scale)?;
        d.set_item("mu_ob_correlation_cp", r.mu_ob_correlation_cp)?;
        d.set_item("mu_ob_cp", r.mu_ob_cp)?;
        d.set_item("mu_scale", r.mu_scale)?;
        // Raw correlation minus the value used, in percent of it (0 without a measurement).
        d.set_item(
            "pb_deviation_pct",
            100.0 * (r.pb_correlation_psia / r.pb_psia - 1.0),
        )?;
        d.set_item(
            "bob_deviation_pct",
            100.0 * (r.bob_correlation / r.bob - 1.0),
        )?;
        d.set_item(
            "mu_ob_deviation_pct",
            100.0 * (r.mu_ob_correlation_cp / r.mu_ob_cp - 1.0),
        )?;
        Ok(d)
    }
    /// Solution GOR at pressure p (psia), scf/STB.
    #[pyo3(signature = (p, *, errors = "raise"))]
    fn rs(&self, py: Python<'_>, p: In<'_>, errors: &str) -> PyResult<Py<PyAny>> {
        let (m, oe) = (self.0.model()?, on_error(errors)?);
        call(py, [&p], move |[p]| lift(["p"], [p], oe, |[p]| m.rs(p)))
    }
    /// Oil FVF at pressure p (psia), rb/STB.
    #[pyo3(signature = (p, *, errors = "raise"))]
    fn bo(&self, py: Python<'_>, p: In<'_>, errors: &str) -> PyResult<Py<PyAny>> {
        let (m, oe) = (self.0.model()?, on_error(errors)?);
        call(py, [&p], move |[p]| lift(["p"], [p], oe, |[p]| m.bo(p)))
    }
    /// Oil viscosity at pressure p (psia), cp.
    #[pyo3(signature = (p, *, errors = "raise"))]
    fn viscosity(&self, py: Python<'_>, p: In<'_>, errors: &str) -> PyResult<Py<PyAny>> {
        let (m, oe) = (self.0.model()?, on_error(errors)?);
        call(py, [&p], move |[p]| {
            lift(["p"], [p], oe, |[p]| m.viscosity(p))
        })
    }
    /// Oil compressibility at pressure p (psia), 1/psi: the undersaturated co at and above
    /// Pb, the apparent (black-oil) compressibility below it (gas liberation counted with
    /// ``gas``'s Bg; default a gas of the oil's ``gas_sg``). Same values as the table's ``co``.
    #[pyo3(signature = (p, *, gas = None, errors = "raise"))]
    fn co(
        &self,
        py: Python<'_>,
        p: In<'_>,
        gas: Option<PyRef<'_, PyGas>>,
        errors: &str,
    ) -> PyResult<Py<PyAny>> {
        let (m, oe) = (self.0.model()?, on_error(errors)?);
        let g = match gas {
            Some(g) => g.0,
            None => CoreGas::new(self.0.gas_sg)?,
        };
        call(py, [&p], move |[p]| lift(["p"], [p], oe, |[p]| m.co(p, &g)))
    }
    /// The black-oil table on the pressure grid p (psia, strictly increasing; Pb inserted):
    /// a dict of numpy arrays (see the column names in ``stocktank.oil.TABLE_UNITS``) plus a
    /// boolean ``is_pb``. ``gas`` (a ``Gas``) gives Bg, Z, gas viscosity and density (default:
    /// a gas of the oil's ``gas_sg``); ``water`` (a ``Water``, same standard conditions as
    /// the oil) gives Bw and water viscosity (default: a brine of the oil's salinity).
    #[pyo3(signature = (p, *, gas = None, water = None))]
    fn table<'py>(
        &self,
        py: Python<'py>,
        p: Vec<f64>,
        gas: Option<PyRef<'py, PyGas>>,
        water: Option<PyRef<'py, PyWater>>,
    ) -> PyResult<Bound<'py, PyDict>> {
        let o = self.0;
        let (g, w) = (gas.map(|g| g.0), water.map(|w| w.0.clone()));
        let t = py.detach(move || build_one(&o, g.as_ref(), w.as_ref(), &p))?;
        table_dict(py, t)
    }
    /// The consistency check of the table on grid p: a list of (p_psia, rule, detail).
    /// ``gas`` and ``water`` as in ``table``.
    #[pyo3(signature = (p, *, gas = None, water = None))]
    fn check_table<'py>(
        &self,
        py: Python<'py>,
        p: Vec<f64>,
        gas: Option<PyRef<'py, PyGas>>,
        water: Option<PyRef<'py, PyWater>>,
    ) -> PyResult<Bound<'py, PyList>> {
        let o = self.0;
        let (g, w) = (gas.map(|g| g.0), water.map(|w| w.0.clone()));
        let v = py.detach(move || build_one(&o, g.as_ref(), w.as_ref(), &p).map(|t| t.check()))?;
        let items: Vec<(f64, &'static str, String)> = v
            .into_iter()
            .map(|x| (x.p_psia, x.rule.name(), x.detail))
            .collect();
        PyList::new(py, items)
    }
    fn __repr__(&self) -> String {
        let o = &self.0;
        let opt = |v: Option<f64>| v.map(|x| format!("{x:?}")).unwrap_or_else(|| "None".into());
        format!(
            "Oil(api={:?}, gas_sg={:?}, temperature_f={:?}, gor={}, pb={}, bob={}, mu_ob={}, pb_method='{}', \
             bo_method='{}', co_method='{}', dead_oil_viscosity_method='{}', separator_p={}, separator_t={}, \
             salinity_wt_pct={:?}, p_sc={:?}, t_sc={:?})",
            o.api,
            o.gas_sg,
            o.temperature_f,
            opt(o.gor),
            opt(o.pb_psia),
            opt(o.calibration.bob),
            opt(o.calibration.mu_ob_cp),
            o.methods.pb,
            o.methods.bo,
            o.methods.co,
            o.methods.dead_oil_viscosity,
            opt(o.separator.map(|s| s.p_psia)),
            opt(o.separator.map(|s| s.t_f)),
            o.salinity_wt_pct,
            o.standard_conditions.p_psia,
            o.standard_conditions.t_f
        )
    }
    fn __reduce__<'py>(
        slf: &Bound<'py, Self>,
    ) -> PyResult<(Bound<'py, PyAny>, Bound<'py, PyTuple>, Bound<'py, PyAny>)> {
        let py = slf.py();
        let o = slf.get().0;
        let kw = PyDict::new(py);
        kw.set_item("api", o.api)?;
        kw.set_item("gas_sg", o.gas_sg)?;
        kw.set_item("temperature_f", o.temperature_f)?;
        kw.set_item("gor", o.gor)?;
        kw.set_item("pb", o.pb_psia)?;
        kw.set_item("bob", o.calibration.bob)?;
        kw.set_item("mu_ob", o.calibration.mu_ob_cp)?;
        kw.set_item("pb_method", o.methods.pb.name())?;
        kw.set_item("bo_method", o.methods.bo.name())?;
        kw.set_item("co_method", o.methods.co.name())?;
        kw.set_item(
            "dead_oil_viscosity_method",
            o.methods.dead_oil_viscosity.name(),
        )?;
        kw.set_item("separator_p", o.separator.map(|s| s.p_psia))?;
        kw.set_item("separator_t", o.separator.map(|s| s.t_f))?;
        kw.set_item("salinity_wt_pct", o.salinity_wt_pct)?;
        kw.set_item("p_sc", o.standard_conditions.p_psia)?;
        kw.set_item("t_sc", o.standard_conditions.t_f)?;
        let rebuild = py.import("stocktank._pickle")?.getattr("rebuild")?;
        let args = PyTuple::new(py, [slf.get_type().into_any(), kw.into_any()])?;
        Ok((rebuild, args, py.None().into_bound(py)))
    }
}

/// Broadcast the per-well inputs to one 1-D length; returns flat vectors.
fn per_well(
    names: [&'static str; 9],
    views: [ArrayViewD<'_, f64>; 9],
) -> crate::Result<[Vec<f64>; 9]> {
    let shapes: [&[usize]; 9] = views.each_ref().map(|v| v.shape());
    let shape = broadcast_shape(&names, &shapes)?;
    if shape.len() > 1 {
        return Err(Error::Shape(format!(
            "per-well inputs must be scalars or 1-D; got shape {shape:?}"
        )));
    }
    let n = shape.first().copied().unwrap_or(1);
    Ok(views.map(|v| {
        if v.len() == 1 {
            vec![*v.iter().next().unwrap_or(&f64::NAN); n]
        } else {
            v.iter().copied().collect()
        }
    }))
}

/// Black-oil tables for many wells at once (parallel, GIL released), in long format.
///
/// Per-well inputs broadcast to one length; NaN in the optional `gor`, `pb`, `bob`, `mu_ob`,
/// `separator_p`, `separator_t` means "not given" for that well. Returns a dict with the
/// columns, ``well`` (int64 row index of the well), ``is_pb``, ``pb`` and ``rsi`` per well,
/// ``violations`` (list of (well, p_psia, rule, detail)) and ``errors`` (list of (well, message)).
/// ``gas``: a ``Gas`` for every well or a sequence of them, one per well (default: a gas of
/// each well's ``gas_sg``); ``water``: likewise ``Water`` (default: a brine of
/// ``salinity_wt_pct``; give one or the other), with the standard conditions ``p_sc``, ``t_sc``.
#[pyfunction]
#[pyo3(signature = (
    p, api, gas_sg, temperature_f, *, gor = None, pb = None, bob = None, mu_ob = None,
    separator_p = None, separator_t = None, salinity_wt_pct = None,
    pb_method = "standing", bo_method = "standing", co_method = "vasquez_beggs",
    dead_oil_viscosity_method = "beggs_robinson", p_sc = 14.696, t_sc = 60.0, gas = None,
    water = None, errors = "raise"
))]
#[allow(clippy::too_many_arguments)]
fn black_oil_tables<'py>(
    py: Python<'py>,
    p: Vec<f64>,
    api: In<'py>,
    gas_sg: In<'py>,
    temperature_f: In<'py>,
    gor: Option<In<'py>>,
    pb: Option<In<'py>>,
    bob: Option<In<'py>>,
    mu_ob: Option<In<'py>>,
    separator_p: Option<In<'py>>,
    separator_t: Option<In<'py>>,
    salinity_wt_pct: Option<In<'py>>,
    pb_method: &str,
    bo_method: &str,
    co_method: &str,
    dead_oil_viscosity_method: &str,
    p_sc: f64,
    t_sc: f64,
    gas: Option<&Bound<'py, PyAny>>,
    water: Option<&Bound<'py, PyAny>>,
    errors: &str,
) -> PyResult<Bound<'py, PyDict>> {
    let m = methods(pb_method, bo_method, co_method, dead_oil_viscosity_method)?;
    let gases = gas_arg(gas)?;
    let waters = water_arg(water)?;
    if waters.is_some() && salinity_wt_pct.is_some() {
        return Err(pyo3::exceptions::PyTypeError::new_err(
            "give `salinity_wt_pct` or `water`, not both (a Water carries its own salinity)",
        ));
    }
    let (s, oe) = (sc(p_sc, t_sc)?, on_error(errors)?);
    let nan = ndarray::arr0(f64::NAN).into_dyn();
    let zero = ndarray::arr0(0.0).into_dyn();
    let opt = |a: &Option<In<'py>>, dflt: &ndarray::ArrayD<f64>| -> ndarray::ArrayD<f64> {
        match a {
            Some(a) => a.as_array().to_owned(),
            None => dflt.clone(),
        }
    };
    let inputs = [
        api.as_array().to_owned(),
        gas_sg.as_array().to_owned(),
        temperature_f.as_array().to_owned(),
        opt(&gor, &nan),
        opt(&pb, &nan),
        opt(&bob, &nan),
        opt(&mu_ob, &nan),
        opt(&separator_p, &nan),
        opt(&separator_t, &nan),
    ];
    let sal = opt(&salinity_wt_pct, &zero);
    let long = detach(py, move || -> crate::Result<_> {
        let names = [
            "api",
            "gas_sg",
            "temperature_f",
            "gor",
            "pb",
            "bob",
            "mu_ob",
            "separator_p",
            "separator_t",
        ];
        let cols = per_well(names, inputs.each_ref().map(|a| a.view()))?;
        let n = cols[0].len();
        let sal: Vec<f64> = match sal.len() {
            1 => vec![*sal.iter().next().unwrap_or(&0.0); n],
            k if k == n => sal.iter().copied().collect(),
            k => {
                return Err(Error::Shape(format!(
                    "`salinity_wt_pct` has {k} elements but there are {n} wells"
                )));
            }
        };
        let some = |x: f64| if x.is_nan() { None } else { Some(x) };
        let oils: Vec<crate::Result<CoreOil>> = (0..n)
            .map(|k| {
                let sep = match (some(cols[7][k]), some(cols[8][k])) {
                    (Some(p), Some(t)) => Some((p, t)),
                    _ => None,
                };
                make_oil(
                    cols[0][k],
                    cols[1][k],
                    cols[2][k],
                    some(cols[3][k]),
                    some(cols[4][k]),
                    some(cols[5][k]),
                    some(cols[6][k]),
                    m,
                    sep,
                    sal[k],
                    s,
                )
                .map_err(|e| e.at_index(&[k]))
            })
            .collect();
        let check = |len: Option<usize>, arg: &str| -> crate::Result<()> {
            match len {
                Some(l) if l != 1 && l != n => Err(Error::Shape(format!(
                    "`{arg}` has {l} elements but there are {n} wells"
                ))),
                _ => Ok(()),
            }
        };
        check(gases.as_ref().map(Vec::len), "gas")?;
        check(waters.as_ref().map(Vec::len), "water")?;
        let nth = |len: usize, k: usize| if len == 1 { 0 } else { k };
        build_long_results_with(oils, &p, oe, |k, o| {
            let g = gases.as_ref().map(|g| &g[nth(g.len(), k)]);
            let w = waters.as_ref().map(|w| &w[nth(w.len(), k)]);
            gas_and_water(o, g, w)
        })
    })?;
    let d = PyDict::new(py);
    d.set_item("well", long.well.into_pyarray(py))?;
    d.set_item("is_pb", long.is_pb.into_pyarray(py))?;
    // One block, column after column (see `Columns`): each column is a row view of it.
    let (block, rows) = long.columns.into_block();
    let block = numpy::PyArrayMethods::reshape(
        &numpy::PyArray1::from_vec(py, block),
        [COLUMNS.len(), rows],
    )?;
    for (j, (name, _)) in COLUMNS.iter().enumerate() {
        d.set_item(*name, block.get_item(j)?)?;
    }
    d.set_item("pb", long.pb.into_pyarray(py))?;
    d.set_item("rsi", long.rsi.into_pyarray(py))?;
    let v: Vec<(u64, f64, &'static str, String)> = long
        .violations
        .into_iter()
        .map(|(w, x)| (w, x.p_psia, x.rule.name(), x.detail))
        .collect();
    d.set_item("violations", PyList::new(py, v)?)?;
    d.set_item("errors", PyList::new(py, long.errors)?)?;
    Ok(d)
}

/// Column names and units of a black-oil table, in order.
#[pyfunction]
fn table_columns() -> Vec<(&'static str, &'static str)> {
    COLUMNS.to_vec()
}

pub(super) fn register(m: &Bound<'_, PyModule>) -> PyResult<()> {
    m.add_class::<Oil>()?;
    m.add_function(wrap_pyfunction!(sg_from_api, m)?)?;
    m.add_function(wrap_pyfunction!(api_from_sg, m)?)?;
    m.add_function(wrap_pyfunction!(oil_molar_mass, m)?)?;
    m.add_function(wrap_pyfunction!(bubble_point, m)?)?;
    m.add_function(wrap_pyfunction!(solution_gor, m)?)?;
    m.add_function(wrap_pyfunction!(bubble_point_in_range, m)?)?;
    m.add_function(wrap_pyfunction!(bo_saturated_in_range, m)?)?;
    m.add_function(wrap_pyfunction!(dead_oil_viscosity_in_range, m)?)?;
    m.add_function(wrap_pyfunction!(vasquez_beggs_gas_sg_100psig, m)?)?;
    m.add_function(wrap_pyfunction!(bo_saturated, m)?)?;
    m.add_function(wrap_pyfunction!(co_undersaturated, m)?)?;
    m.add_function(wrap_pyfunction!(bo_undersaturated, m)?)?;
    m.add_function(wrap_pyfunction!(apparent_compressibility, m)?)?;
    m.add_function(wrap_pyfunction!(total_fvf, m)?)?;
    m.add_function(wrap_pyfunction!(oil_density, m)?)?;
    m.add_function(wrap_pyfunction!(dead_oil_viscosity, m)?)?;
    m.add_function(wrap_pyfunction!(live_oil_viscosity, m)?)?;
    m.add_function(wrap_pyfunction!(undersaturated_oil_viscosity, m)?)?;
    m.add_function(wrap_pyfunction!(black_oil_tables, m)?)?;
    m.add_function(wrap_pyfunction!(table_columns, m)?)?;
    Ok(())
}
