//! Python bindings of [`crate::relperm`]: the Corey curves as picklable, comparable classes
//! whose methods take any array-like saturation.

use super::{In, call};
use crate::array::{OnError, lift};
use crate::relperm::{CoreyGasOil as CoreGasOil, CoreyOilWater as CoreOilWater};
use pyo3::prelude::*;
use pyo3::types::PyTuple;

/// Corey oil-water relative permeabilities (Corey 1954; Brooks–Corey 1964).
///
/// Saturations are fractions of pore volume. ``krw(sw)`` and ``krow(sw)`` take any
/// array-like water saturation and return a float for a scalar, else an ndarray.
#[pyclass(name = "CoreyOilWater", module = "stocktank._core", frozen, eq)]
#[derive(Clone, PartialEq)]
pub struct CoreyOilWater(pub CoreOilWater);

#[pymethods]
impl CoreyOilWater {
    #[new]
    #[pyo3(signature = (*, swc, sorw, krw_max = 1.0, kro_max = 1.0, nw = 2.0, no = 2.0))]
    fn new(swc: f64, sorw: f64, krw_max: f64, kro_max: f64, nw: f64, no: f64) -> PyResult<Self> {
        Ok(Self(CoreOilWater::new(
            swc, sorw, krw_max, kro_max, nw, no,
        )?))
    }
    #[getter]
    fn swc(&self) -> f64 {
        self.0.swc
    }
    #[getter]
    fn sorw(&self) -> f64 {
        self.0.sorw
    }
    #[getter]
    fn krw_max(&self) -> f64 {
        self.0.krw_max
    }
    #[getter]
    fn kro_max(&self) -> f64 {
        self.0.kro_max
    }
    #[getter]
    fn nw(&self) -> f64 {
        self.0.nw
    }
    #[getter]
    fn no(&self) -> f64 {
        self.0.no
    }
    /// Water relative permeability at water saturation ``sw`` (fraction).
    fn krw(&self, py: Python<'_>, sw: In<'_>) -> PyResult<Py<PyAny>> {
        let k = self.0;
        call(py, [&sw], move |[s]| {
            lift(["sw"], [s], OnError::Raise, |[s]| Ok(k.krw(s)))
        })
    }
    /// Oil relative permeability at water saturation ``sw`` (fraction).
    fn krow(&self, py: Python<'_>, sw: In<'_>) -> PyResult<Py<PyAny>> {
        let k = self.0;
        call(py, [&sw], move |[s]| {
            lift(["sw"], [s], OnError::Raise, |[s]| Ok(k.krow(s)))
        })
    }
    fn __repr__(&self) -> String {
        let k = &self.0;
        format!(
            "CoreyOilWater(swc={:?}, sorw={:?}, krw_max={:?}, kro_max={:?}, nw={:?}, no={:?})",
            k.swc, k.sorw, k.krw_max, k.kro_max, k.nw, k.no
        )
    }
    fn __reduce__<'py>(
        slf: &Bound<'py, Self>,
    ) -> PyResult<(Bound<'py, PyAny>, Bound<'py, PyTuple>, Bound<'py, PyAny>)> {
        let py = slf.py();
        let k = slf.get().0;
        let kwargs = pyo3::types::PyDict::new(py);
        kwargs.set_item("swc", k.swc)?;
        kwargs.set_item("sorw", k.sorw)?;
        kwargs.set_item("krw_max", k.krw_max)?;
        kwargs.set_item("kro_max", k.kro_max)?;
        kwargs.set_item("nw", k.nw)?;
        kwargs.set_item("no", k.no)?;
        let rebuild = py.import("stocktank._pickle")?.getattr("rebuild")?;
        let args = PyTuple::new(py, [slf.get_type().into_any(), kwargs.into_any()])?;
        Ok((rebuild, args, py.None().into_bound(py)))
    }
}

/// Corey gas-oil relative permeabilities at connate water (Corey 1954).
///
/// ``krg(sg)`` is zero below the critical gas saturation ``sgc``; ``krog(sg)`` is zero
/// where the oil saturation ``1 - swc - sg`` is at or below ``sorg``.
#[pyclass(name = "CoreyGasOil", module = "stocktank._core", frozen, eq)]
#[derive(Clone, PartialEq)]
pub struct CoreyGasOil(pub CoreGasOil);

#[pymethods]
impl CoreyGasOil {
    #[new]
    #[pyo3(signature = (*, swc, sgc, sorg, krg_max = 1.0, kro_max = 1.0, ng = 2.0, no = 2.0))]
    fn new(
        swc: f64,
        sgc: f64,
        sorg: f64,
        krg_max: f64,
        kro_max: f64,
        ng: f64,
        no: f64,
    ) -> PyResult<Self> {
        Ok(Self(CoreGasOil::new(
            swc, sgc, sorg, krg_max, kro_max, ng, no,
        )?))
    }
    #[getter]
    fn swc(&self) -> f64 {
        self.0.swc
    }
    #[getter]
    fn sgc(&self) -> f64 {
        self.0.sgc
    }
    #[getter]
    fn sorg(&self) -> f64 {
        self.0.sorg
    }
    #[getter]
    fn krg_max(&self) -> f64 {
        self.0.krg_max
    }
    #[getter]
    fn kro_max(&self) -> f64 {
        self.0.kro_max
    }
    #[getter]
    fn ng(&self) -> f64 {
        self.0.ng
    }
    #[getter]
    fn no(&self) -> f64 {
        self.0.no
    }
    /// Gas relative permeability at gas saturation ``sg`` (fraction).
    fn krg(&self, py: Python<'_>, sg: In<'_>) -> PyResult<Py<PyAny>> {
        let k = self.0;
        call(py, [&sg], move |[s]| {
            lift(["sg"], [s], OnError::Raise, |[s]| Ok(k.krg(s)))
        })
    }
    /// Oil relative permeability at gas saturation ``sg`` (fraction).
    fn krog(&self, py: Python<'_>, sg: In<'_>) -> PyResult<Py<PyAny>> {
        let k = self.0;
        call(py, [&sg], move |[s]| {
            lift(["sg"], [s], OnError::Raise, |[s]| Ok(k.krog(s)))
        })
    }
    /// The ratio krg/kro at gas saturation ``sg``; inf where oil is immobile.
    fn krg_over_kro(&self, py: Python<'_>, sg: In<'_>) -> PyResult<Py<PyAny>> {
        let k = self.0;
        call(py, [&sg], move |[s]| {
            lift(["sg"], [s], OnError::Raise, |[s]| Ok(k.krg_over_kro(s)))
        })
    }
    fn __repr__(&self) -> String {
        let k = &self.0;
        format!(
            "CoreyGasOil(swc={:?}, sgc={:?}, sorg={:?}, krg_max={:?}, kro_max={:?}, ng={:?}, no={:?})",
            k.swc, k.sgc, k.sorg, k.krg_max, k.kro_max, k.ng, k.no
        )
    }
    fn __reduce__<'py>(
        slf: &Bound<'py, Self>,
    ) -> PyResult<(Bound<'py, PyAny>, Bound<'py, PyTuple>, Bound<'py, PyAny>)> {
        let py = slf.py();
        let k = slf.get().0;
        let kwargs = pyo3::types::PyDict::new(py);
        kwargs.set_item("swc", k.swc)?;
        kwargs.set_item("sgc", k.sgc)?;
        kwargs.set_item("sorg", k.sorg)?;
        kwargs.set_item("krg_max", k.krg_max)?;
        kwargs.set_item("kro_max", k.kro_max)?;
        kwargs.set_item("ng", k.ng)?;
        kwargs.set_item("no", k.no)?;
        let rebuild = py.import("stocktank._pickle")?.getattr("rebuild")?;
        let args = PyTuple::new(py, [slf.get_type().into_any(), kwargs.into_any()])?;
        Ok((rebuild, args, py.None().into_bound(py)))
    }
}

pub(super) fn register(m: &Bound<'_, PyModule>) -> PyResult<()> {
    m.add_class::<CoreyOilWater>()?;
    m.add_class::<CoreyGasOil>()?;
    Ok(())
}
