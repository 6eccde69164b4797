//! Python bindings of [`crate::water`]: the `Water` description class and the free
//! functions. Conversion only: every computation is a core kernel through the one lift.

use super::{In, call, call_bool, on_error};
use crate::array::lift;
use crate::units::StandardConditions;
use crate::water::{self as core, Property, ViscosityMethod};
use pyo3::prelude::*;
use pyo3::types::{PyDict, PyTuple};

fn sc(p_sc: f64, t_sc: f64) -> PyResult<StandardConditions> {
    Ok(StandardConditions::new(p_sc, t_sc)?)
}

/// A formation water (brine) description.
///
/// Salinity in weight percent of brine (NaCl equivalent); ``gas_saturated`` water holds the
/// natural gas it can dissolve at the pressure of interest (McCain 1991 solubility); the
/// viscosity method is ``"meehan"`` (Meehan 1980, default) or ``"mccain"`` (McCain 1991);
/// ``p_sc`` (psia) and ``t_sc`` (degF) are the standard conditions of the stock-tank volume.
/// Methods take pressure ``p`` (psia) and temperature ``t`` (degF) as any array-like and
/// broadcast like numpy. Screening estimates.
#[pyclass(name = "Water", module = "stocktank._core", frozen, eq)]
#[derive(Clone, PartialEq)]
pub struct Water(pub core::Water);

impl Water {
    fn prop(
        &self,
        py: Python<'_>,
        prop: Property,
        p: In<'_>,
        t: In<'_>,
        errors: &str,
    ) -> PyResult<Py<PyAny>> {
        let oe = on_error(errors)?;
        let w = &self.0;
        call(py, [&p, &t], move |[p, t]| w.property_array(prop, p, t, oe))
    }
}

#[pymethods]
impl Water {
    #[new]
    #[pyo3(signature = (*, salinity_wt_pct = 0.0, gas_saturated = true, viscosity_method = "meehan", p_sc = 14.696, t_sc = 60.0))]
    fn new(
        salinity_wt_pct: f64,
        gas_saturated: bool,
        viscosity_method: &str,
        p_sc: f64,
        t_sc: f64,
    ) -> PyResult<Self> {
        let w = core::Water::new(salinity_wt_pct)?
            .with_gas_saturated(gas_saturated)
            .with_viscosity_method(ViscosityMethod::parse(viscosity_method)?)
            .with_standard_conditions(sc(p_sc, t_sc)?)?;
        Ok(Self(w))
    }
    /// Salinity, wt% of brine.
    #[getter]
    fn salinity_wt_pct(&self) -> f64 {
        self.0.salinity_wt_pct()
    }
    /// Whether the water is saturated with gas.
    #[getter]
    fn gas_saturated(&self) -> bool {
        self.0.gas_saturated()
    }
    /// The viscosity method, ``"meehan"`` or ``"mccain"``.
    #[getter]
    fn viscosity_method(&self) -> &'static str {
        self.0.viscosity_method().name()
    }
    /// Standard pressure, psia.
    #[getter]
    fn p_sc(&self) -> f64 {
        self.0.standard_conditions().p_psia
    }
    /// Standard temperature, degF.
    #[getter]
    fn t_sc(&self) -> f64 {
        self.0.standard_conditions().t_f
    }
    /// Formation volume factor Bw, rb/STB (McCain 1990), at ``p`` psia and ``t`` degF.
    #[pyo3(signature = (p, t, *, errors = "raise"))]
    fn bw(&self, py: Python<'_>, p: In<'_>, t: In<'_>, errors: &str) -> PyResult<Py<PyAny>> {
        self.prop(py, Property::Bw, p, t, errors)
    }
    /// Gas solubility Rsw, scf/STB (McCain 1991; 0 for gas-free water), at ``p`` psia, ``t`` degF.
    #[pyo3(signature = (p, t, *, errors = "raise"))]
    fn rsw(&self, py: Python<'_>, p: In<'_>, t: In<'_>, errors: &str) -> PyResult<Py<PyAny>> {
        self.prop(py, Property::Rsw, p, t, errors)
    }
    /// Density, lbm/ft3 (McCain 1990), at ``p`` psia and ``t`` degF.
    #[pyo3(signature = (p, t, *, errors = "raise"))]
    fn density(&self, py: Python<'_>, p: In<'_>, t: In<'_>, errors: &str) -> PyResult<Py<PyAny>> {
        self.prop(py, Property::Density, p, t, errors)
    }
    /// Isothermal compressibility without free gas, 1/psi (Osif 1988; times the Dodson and
    /// Standing 1944 factor when gas-saturated), at ``p`` psia and ``t`` degF.
    #[pyo3(signature = (p, t, *, errors = "raise"))]
    fn compressibility(
        &self,
        py: Python<'_>,
        p: In<'_>,
        t: In<'_>,
        errors: &str,
    ) -> PyResult<Py<PyAny>> {
        self.prop(py, Property::Compressibility, p, t, errors)
    }
    /// Viscosity, cp, by the chosen method, at ``p`` psia and ``t`` degF.
    #[pyo3(signature = (p, t, *, errors = "raise"))]
    fn viscosity(&self, py: Python<'_>, p: In<'_>, t: In<'_>, errors: &str) -> PyResult<Py<PyAny>> {
        self.prop(py, Property::Viscosity, p, t, errors)
    }
    /// Compressibility below the saturation pressure including released gas, 1/psi
    /// (McCain 1991); ``bg_rb_per_scf`` is the gas FVF at (p, t) in rb/scf.
    #[pyo3(signature = (p, t, bg_rb_per_scf, *, errors = "raise"))]
    fn compressibility_with_gas_release(
        &self,
        py: Python<'_>,
        p: In<'_>,
        t: In<'_>,
        bg_rb_per_scf: In<'_>,
        errors: &str,
    ) -> PyResult<Py<PyAny>> {
        let oe = on_error(errors)?;
        let w = &self.0;
        call(py, [&p, &t, &bg_rb_per_scf], move |[p, t, bg]| {
            lift(["p", "t", "bg_rb_per_scf"], [p, t, bg], oe, |[p, t, bg]| {
                w.compressibility_with_gas_release(p, t, bg)
            })
        })
    }
    /// True where (``p`` psia, ``t`` degF) lie inside the published ranges of every
    /// correlation this water uses.
    fn in_range(&self, py: Python<'_>, p: In<'_>, t: In<'_>) -> PyResult<Py<PyAny>> {
        let w = &self.0;
        call_bool(py, [&p, &t], move |[p, t]| {
            core::in_range_array(["p", "t"], [p, t], |[p, t]| w.in_range(p, t))
        })
    }
    fn __repr__(&self) -> String {
        let w = &self.0;
        let sc = w.standard_conditions();
        format!(
            "Water(salinity_wt_pct={:?}, gas_saturated={}, viscosity_method='{}', p_sc={:?}, t_sc={:?})",
            w.salinity_wt_pct(),
            if w.gas_saturated() { "True" } else { "False" },
            w.viscosity_method().name(),
            sc.p_psia,
            sc.t_f
        )
    }
    fn __reduce__<'py>(
        slf: &Bound<'py, Self>,
    ) -> PyResult<(Bound<'py, PyAny>, Bound<'py, PyTuple>, Bound<'py, PyAny>)> {
        let py = slf.py();
        let w = &slf.get().0;
        let sc = w.standard_conditions();
        let kwargs = PyDict::new(py);
        kwargs.set_item("salinity_wt_pct", w.salinity_wt_pct())?;
        kwargs.set_item("gas_saturated", w.gas_saturated())?;
        kwargs.set_item("viscosity_method", w.viscosity_method().name())?;
        kwargs.set_item("p_sc", sc.p_psia)?;
        kwargs.set_item("t_sc", sc.t_f)?;
        let rebuild = py.import("stocktank._pickle")?.getattr("rebuild")?;
        let args = PyTuple::new(py, [slf.get_type().into_any(), kwargs.into_any()])?;
        Ok((rebuild, args, py.None().into_bound(py)))
    }
}

/// Water formation volume factor Bw (McCain 1990), for gas-free or gas-saturated brine.
///
/// Parameters
/// ----------
/// p : array_like
///     Pressure, psia (> 0).
/// t : array_like
///     Temperature, degF.
/// p_sc, t_sc : float
///     Standard conditions of the stock-tank volume, psia and degF.
/// errors : {"raise", "coerce"}
///     On an impossible element raise ``InvalidArgumentError`` (naming the argument, value
///     and index) or return NaN there. NaN inputs give NaN.
///
/// Returns
/// -------
/// float or ndarray
///     Bw, rb/STB; 1 at the standard conditions. Published accuracy 2% to 5,000 psia, 260 degF.
#[pyfunction]
#[pyo3(signature = (p, t, *, p_sc = 14.696, t_sc = 60.0, errors = "raise"))]
fn water_bw(
    py: Python<'_>,
    p: In<'_>,
    t: In<'_>,
    p_sc: f64,
    t_sc: f64,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let (oe, sc) = (on_error(errors)?, sc(p_sc, t_sc)?);
    call(py, [&p, &t], move |[p, t]| {
        core::bw_mccain_array(p, t, &sc, oe)
    })
}

/// Brine density at reservoir conditions (McCain 1990): the 60 degF density over Bw.
///
/// Parameters
/// ----------
/// p : array_like
///     Pressure, psia (> 0).
/// t : array_like
///     Temperature, degF.
/// salinity_wt_pct : array_like
///     Total dissolved solids, weight percent of brine (NaCl equivalent), in [0, 100).
/// errors : {"raise", "coerce"}
///     On an impossible element raise ``InvalidArgumentError`` (naming the argument, value
///     and index) or return NaN there. NaN inputs give NaN.
///
/// Returns
/// -------
/// float or ndarray
///     Density, lbm/ft3 (dissolved gas neglected).
#[pyfunction]
#[pyo3(signature = (p, t, salinity_wt_pct, *, errors = "raise"))]
fn water_density(
    py: Python<'_>,
    p: In<'_>,
    t: In<'_>,
    salinity_wt_pct: In<'_>,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let oe = on_error(errors)?;
    call(py, [&p, &t, &salinity_wt_pct], move |[p, t, s]| {
        core::density_mccain_array(p, t, s, oe)
    })
}

/// Brine density at 60 degF and 14.696 psia (McCain 1990).
///
/// Parameters
/// ----------
/// salinity_wt_pct : array_like
///     Total dissolved solids, weight percent of brine (NaCl equivalent), in [0, 100).
/// errors : {"raise", "coerce"}
///     On an impossible element raise ``InvalidArgumentError`` (naming the argument, value
///     and index) or return NaN there. NaN inputs give NaN.
///
/// Returns
/// -------
/// float or ndarray
///     Density, lbm/ft3.
#[pyfunction]
#[pyo3(signature = (salinity_wt_pct, *, errors = "raise"))]
fn water_density_sc(py: Python<'_>, salinity_wt_pct: In<'_>, errors: &str) -> PyResult<Py<PyAny>> {
    let oe = on_error(errors)?;
    call(py, [&salinity_wt_pct], move |[s]| {
        lift(["salinity_wt_pct"], [s], oe, |[s]| {
            core::density_sc_mccain(s)
        })
    })
}

/// Solubility of natural gas (methane) in brine at its saturation pressure (McCain 1991).
///
/// Parameters
/// ----------
/// p : array_like
///     Pressure, psia (> 0).
/// t : array_like
///     Temperature, degF.
/// salinity_wt_pct : array_like
///     Total dissolved solids, weight percent of brine (NaCl equivalent), in [0, 100).
/// errors : {"raise", "coerce"}
///     On an impossible element raise ``InvalidArgumentError`` (naming the argument, value
///     and index) or return NaN there. NaN inputs give NaN.
///
/// Returns
/// -------
/// float or ndarray
///     Rsw, scf/STB. Published range 1,000-10,000 psia, 100-340 degF; accuracy 5%.
#[pyfunction]
#[pyo3(signature = (p, t, salinity_wt_pct, *, errors = "raise"))]
fn water_rsw(
    py: Python<'_>,
    p: In<'_>,
    t: In<'_>,
    salinity_wt_pct: In<'_>,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let oe = on_error(errors)?;
    call(py, [&p, &t, &salinity_wt_pct], move |[p, t, s]| {
        core::rsw_mccain_array(p, t, s, oe)
    })
}

/// Isothermal compressibility of brine without free gas (Osif 1988); with the Dodson and
/// Standing (1944) dissolved-gas factor 1 + 8.9e-3 Rsw when ``gas_saturated``.
///
/// Parameters
/// ----------
/// p : array_like
///     Pressure, psia (> 0).
/// t : array_like
///     Temperature, degF.
/// salinity_wt_pct : array_like
///     Total dissolved solids, weight percent of brine (NaCl equivalent), in [0, 100).
/// gas_saturated : bool
///     Whether the water holds its solution gas (default False: gas-free).
/// errors : {"raise", "coerce"}
///     On an impossible element raise ``InvalidArgumentError`` (naming the argument, value
///     and index) or return NaN there. NaN inputs give NaN.
///
/// Returns
/// -------
/// float or ndarray
///     cw, 1/psi. Osif's range: 1,000-20,000 psia, 200-270 degF, 0-200 g/L NaCl.
#[pyfunction]
#[pyo3(signature = (p, t, salinity_wt_pct, *, gas_saturated = false, errors = "raise"))]
fn water_compressibility(
    py: Python<'_>,
    p: In<'_>,
    t: In<'_>,
    salinity_wt_pct: In<'_>,
    gas_saturated: bool,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let oe = on_error(errors)?;
    call(py, [&p, &t, &salinity_wt_pct], move |[p, t, s]| {
        if gas_saturated {
            core::cw_gas_saturated_array(p, t, s, oe)
        } else {
            core::cw_osif_array(p, t, s, oe)
        }
    })
}

/// Compressibility of gas-saturated brine below its saturation pressure, including the gas a
/// pressure drop releases (McCain 1991): -(1/Bw) dBw/dp + (Bg/Bw) dRsw/dp.
///
/// Parameters
/// ----------
/// p : array_like
///     Pressure, psia (> 0).
/// t : array_like
///     Temperature, degF.
/// salinity_wt_pct : array_like
///     Total dissolved solids, weight percent of brine (NaCl equivalent), in [0, 100).
/// bg_rb_per_scf : array_like
///     Gas formation volume factor at (p, t), rb/scf (> 0).
/// p_sc, t_sc : float
///     Standard conditions of the stock-tank volume, psia and degF.
/// errors : {"raise", "coerce"}
///     On an impossible element raise ``InvalidArgumentError`` (naming the argument, value
///     and index) or return NaN there. NaN inputs give NaN.
///
/// Returns
/// -------
/// float or ndarray
///     cw, 1/psi. Keep within 5,000 psia (McCain's Bw range).
#[pyfunction]
#[pyo3(signature = (p, t, salinity_wt_pct, bg_rb_per_scf, *, p_sc = 14.696, t_sc = 60.0, errors = "raise"))]
#[allow(clippy::too_many_arguments)]
fn water_compressibility_with_gas_release(
    py: Python<'_>,
    p: In<'_>,
    t: In<'_>,
    salinity_wt_pct: In<'_>,
    bg_rb_per_scf: In<'_>,
    p_sc: f64,
    t_sc: f64,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let (oe, sc) = (on_error(errors)?, sc(p_sc, t_sc)?);
    call(
        py,
        [&p, &t, &salinity_wt_pct, &bg_rb_per_scf],
        move |[p, t, s, bg]| core::cw_with_gas_release_array(p, t, s, bg, &sc, oe),
    )
}

/// Brine viscosity with salinity and pressure corrections.
///
/// Parameters
/// ----------
/// p : array_like
///     Pressure, psia (> 0).
/// t : array_like
///     Temperature, degF.
/// salinity_wt_pct : array_like
///     Total dissolved solids, weight percent of brine (NaCl equivalent), in [0, 100).
/// method : {"meehan", "mccain"}
///     Meehan (1980, default) or McCain (1991). McCain's published pressure factor
///     overstates pure water by 15-21% at 5,000 psia and 52-56% at 10,000 psia (IAPWS).
/// errors : {"raise", "coerce"}
///     On an impossible element raise ``InvalidArgumentError`` (naming the argument, value
///     and index) or return NaN there. NaN inputs give NaN.
///
/// Returns
/// -------
/// float or ndarray
///     Viscosity, cp.
#[pyfunction]
#[pyo3(signature = (p, t, salinity_wt_pct, *, method = "meehan", errors = "raise"))]
fn water_viscosity(
    py: Python<'_>,
    p: In<'_>,
    t: In<'_>,
    salinity_wt_pct: In<'_>,
    method: &str,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let (oe, m) = (on_error(errors)?, parse_method(method)?);
    call(py, [&p, &t, &salinity_wt_pct], move |[p, t, s]| match m {
        ViscosityMethod::McCain1991 => core::viscosity_mccain_array(p, t, s, oe),
        _ => core::viscosity_meehan_array(p, t, s, oe),
    })
}

fn parse_method(method: &str) -> PyResult<ViscosityMethod> {
    ViscosityMethod::parse(method).map_err(|e| match e {
        crate::Error::InvalidOption { value, allowed, .. } => crate::Error::InvalidOption {
            arg: "method",
            value,
            allowed,
        }
        .into(),
        other => other.into(),
    })
}

/// Salinity in parts per million by mass (mg of solids per kg of brine) to weight percent:
/// wt% = ppm / 10,000. For mg/L use ``salinity_mg_per_l_to_wt_pct``.
#[pyfunction]
#[pyo3(signature = (ppm, *, errors = "raise"))]
fn salinity_ppm_to_wt_pct(py: Python<'_>, ppm: In<'_>, errors: &str) -> PyResult<Py<PyAny>> {
    let oe = on_error(errors)?;
    call(py, [&ppm], move |[x]| {
        lift(["ppm"], [x], oe, |[x]| core::salinity_ppm_to_wt_pct(x))
    })
}

/// Salinity in weight percent to parts per million by mass (mg/kg of brine): ppm = 10,000 wt%.
#[pyfunction]
#[pyo3(signature = (salinity_wt_pct, *, errors = "raise"))]
fn salinity_wt_pct_to_ppm(
    py: Python<'_>,
    salinity_wt_pct: In<'_>,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let oe = on_error(errors)?;
    call(py, [&salinity_wt_pct], move |[x]| {
        lift(["salinity_wt_pct"], [x], oe, |[x]| {
            core::salinity_wt_pct_to_ppm(x)
        })
    })
}

/// Salinity in mg of solids per litre of brine (litre at 60 degF, 14.696 psia) to weight
/// percent, using the brine density of McCain (1990): mg/L = 10 wt% rho(wt%)[g/L].
#[pyfunction]
#[pyo3(signature = (mg_per_l, *, errors = "raise"))]
fn salinity_mg_per_l_to_wt_pct(
    py: Python<'_>,
    mg_per_l: In<'_>,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let oe = on_error(errors)?;
    call(py, [&mg_per_l], move |[x]| {
        lift(["mg_per_l"], [x], oe, |[x]| {
            core::salinity_mg_per_l_to_wt_pct(x)
        })
    })
}

/// True where (p psia, t degF) lie in the published range of McCain's Bw.
#[pyfunction]
fn water_bw_in_range(py: Python<'_>, p: In<'_>, t: In<'_>) -> PyResult<Py<PyAny>> {
    call_bool(py, [&p, &t], |[p, t]| {
        core::in_range_array(["p", "t"], [p, t], |[p, t]| core::bw_mccain_in_range(p, t))
    })
}

/// True where the salinity (wt%) lies in the fitted range of the density correlation.
#[pyfunction]
fn water_density_sc_in_range(py: Python<'_>, salinity_wt_pct: In<'_>) -> PyResult<Py<PyAny>> {
    call_bool(py, [&salinity_wt_pct], |[s]| {
        core::in_range_array(["salinity_wt_pct"], [s], |[s]| {
            core::density_sc_mccain_in_range(s)
        })
    })
}

/// True where (p, t, salinity) lie in the published range of McCain's Rsw.
#[pyfunction]
fn water_rsw_in_range(
    py: Python<'_>,
    p: In<'_>,
    t: In<'_>,
    salinity_wt_pct: In<'_>,
) -> PyResult<Py<PyAny>> {
    call_bool(py, [&p, &t, &salinity_wt_pct], |[p, t, s]| {
        core::in_range_array(["p", "t", "salinity_wt_pct"], [p, t, s], |[p, t, s]| {
            core::rsw_mccain_in_range(p, t, s)
        })
    })
}

/// True where (p, t, salinity) lie in the published range of Osif's compressibility.
#[pyfunction]
fn water_compressibility_in_range(
    py: Python<'_>,
    p: In<'_>,
    t: In<'_>,
    salinity_wt_pct: In<'_>,
) -> PyResult<Py<PyAny>> {
    call_bool(py, [&p, &t, &salinity_wt_pct], |[p, t, s]| {
        core::in_range_array(["p", "t", "salinity_wt_pct"], [p, t, s], |[p, t, s]| {
            core::cw_osif_in_range(p, t, s)
        })
    })
}

/// True where (p, t, salinity) lie in the published range of the viscosity method.
#[pyfunction]
#[pyo3(signature = (p, t, salinity_wt_pct, *, method = "meehan"))]
fn water_viscosity_in_range(
    py: Python<'_>,
    p: In<'_>,
    t: In<'_>,
    salinity_wt_pct: In<'_>,
    method: &str,
) -> PyResult<Py<PyAny>> {
    let m = parse_method(method)?;
    call_bool(py, [&p, &t, &salinity_wt_pct], move |[p, t, s]| {
        core::in_range_array(["p", "t", "salinity_wt_pct"], [p, t, s], |[p, t, s]| {
            m.in_range(p, t, s)
        })
    })
}

pub(super) fn register(m: &Bound<'_, PyModule>) -> PyResult<()> {
    m.add_class::<Water>()?;
    m.add_function(wrap_pyfunction!(water_bw, m)?)?;
    m.add_function(wrap_pyfunction!(water_density, m)?)?;
    m.add_function(wrap_pyfunction!(water_density_sc, m)?)?;
    m.add_function(wrap_pyfunction!(water_rsw, m)?)?;
    m.add_function(wrap_pyfunction!(water_compressibility, m)?)?;
    m.add_function(wrap_pyfunction!(water_compressibility_with_gas_release, m)?)?;
    m.add_function(wrap_pyfunction!(water_viscosity, m)?)?;
    m.add_function(wrap_pyfunction!(salinity_ppm_to_wt_pct, m)?)?;
    m.add_function(wrap_pyfunction!(salinity_wt_pct_to_ppm, m)?)?;
    m.add_function(wrap_pyfunction!(salinity_mg_per_l_to_wt_pct, m)?)?;
    m.add_function(wrap_pyfunction!(water_bw_in_range, m)?)?;
    m.add_function(wrap_pyfunction!(water_density_sc_in_range, m)?)?;
    m.add_function(wrap_pyfunction!(water_rsw_in_range, m)?)?;
    m.add_function(wrap_pyfunction!(water_compressibility_in_range, m)?)?;
    m.add_function(wrap_pyfunction!(water_viscosity_in_range, m)?)?;
    Ok(())
}
