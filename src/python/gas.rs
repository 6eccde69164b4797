//! Python bindings of [`crate::gas`]: conversion only. Each function takes array-likes,
//! releases the GIL and calls a core array function (or a scalar kernel lifted by
//! [`crate::array::lift`]).

use super::{In, call, call_bool, call_multi, detach, on_error, to_py};
use crate::array::{OnError, lift};
use crate::gas::{
    self as core, Gas as CoreGas, GasProperty, GravityCorrelation, ImpurityCorrection,
    PseudoCriticalSource, ViscosityMethod, ZMethod,
};
use crate::units::StandardConditions;
use pyo3::prelude::*;
use pyo3::types::{PyDict, PyTuple};

/// An optional array-like argument, or a constant.
fn or_const<'py>(py: Python<'py>, a: Option<In<'py>>, v: f64) -> PyResult<In<'py>> {
    match a {
        Some(a) => Ok(a),
        None => pyo3::types::PyFloat::new(py, v).into_any().extract(),
    }
}

fn sc(p_sc: f64, t_sc: f64) -> PyResult<StandardConditions> {
    Ok(StandardConditions::new(p_sc, t_sc)?)
}

/// Z-factor from pseudo-reduced pressure ``ppr`` and temperature ``tpr`` (dimensionless).
#[pyfunction]
#[pyo3(signature = (ppr, tpr, *, method = "dak", errors = "raise"))]
fn z_factor(
    py: Python<'_>,
    ppr: In<'_>,
    tpr: In<'_>,
    method: &str,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let m = ZMethod::parse(method)?;
    let on = on_error(errors)?;
    call(py, [&ppr, &tpr], move |[p, t]| {
        core::z_factor_array(p, t, m, on)
    })
}

/// Pseudo-reduced compressibility cpr = cg * Ppc (dimensionless), analytic derivative.
#[pyfunction]
#[pyo3(signature = (ppr, tpr, *, method = "dak", errors = "raise"))]
fn pseudo_reduced_compressibility(
    py: Python<'_>,
    ppr: In<'_>,
    tpr: In<'_>,
    method: &str,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let m = ZMethod::parse(method)?;
    let on = on_error(errors)?;
    call(py, [&ppr, &tpr], move |[p, t]| core::cpr_array(p, t, m, on))
}

/// Per element, whether (Ppr, Tpr) lie in the published range of the Z-factor method.
#[pyfunction]
#[pyo3(signature = (ppr, tpr, *, method = "dak"))]
fn z_factor_in_range(
    py: Python<'_>,
    ppr: In<'_>,
    tpr: In<'_>,
    method: &str,
) -> PyResult<Py<PyAny>> {
    let m = ZMethod::parse(method)?;
    call_bool(py, [&ppr, &tpr], move |[p, t]| {
        core::z_factor_in_range_array(p, t, m)
    })
}

/// Pseudo-critical temperature (degR) and pressure (psia) from gas specific gravity.
#[pyfunction]
#[pyo3(signature = (gas_sg, *, method = "sutton", errors = "raise"))]
fn pseudo_critical(
    py: Python<'_>,
    gas_sg: In<'_>,
    method: &str,
    errors: &str,
) -> PyResult<Py<PyTuple>> {
    let c = GravityCorrelation::parse(method)?;
    let on = on_error(errors)?;
    let out = call_multi(py, [&gas_sg], move |[g]| {
        core::pseudo_critical_array(g, c, on)
    })?;
    PyTuple::new(py, out).map(|t| t.unbind())
}

/// Per element, whether ``gas_sg`` lies in the data range of the gravity correlation.
#[pyfunction]
#[pyo3(signature = (gas_sg, *, method = "sutton"))]
fn pseudo_critical_in_range(py: Python<'_>, gas_sg: In<'_>, method: &str) -> PyResult<Py<PyAny>> {
    let c = GravityCorrelation::parse(method)?;
    call_bool(py, [&gas_sg], move |[g]| {
        let f = lift(["gas_sg"], [g], OnError::Raise, |[g]| {
            Ok(if c.in_range(g) { 1.0 } else { 0.0 })
        })?;
        Ok(f.mapv(|v| v == 1.0))
    })
}

/// Wichert–Aziz (1972) correction: corrected (Tpc degR, Ppc psia) for CO2 and H2S.
#[pyfunction]
#[pyo3(signature = (tpc_r, ppc_psia, co2, h2s, *, errors = "raise"))]
fn wichert_aziz(
    py: Python<'_>,
    tpc_r: In<'_>,
    ppc_psia: In<'_>,
    co2: In<'_>,
    h2s: In<'_>,
    errors: &str,
) -> PyResult<Py<PyTuple>> {
    let on = on_error(errors)?;
    let out = call_multi(py, [&tpc_r, &ppc_psia, &co2, &h2s], move |[t, p, c, h]| {
        core::wichert_aziz_array(t, p, c, h, on)
    })?;
    PyTuple::new(py, out).map(|t| t.unbind())
}

/// Kay (1936) mixing rule: (Tpc degR, Ppc psia, gas_sg) of a composition in mole fractions.
#[pyfunction]
#[pyo3(signature = (*, n2 = None, co2 = None, h2s = None, c1 = None, c2 = None, c3 = None,
    ic4 = None, nc4 = None, ic5 = None, nc5 = None, c6 = None, c7plus = None,
    c7plus_mw = None, c7plus_sg = None, errors = "raise"))]
#[allow(clippy::too_many_arguments)]
fn pseudo_critical_kay<'py>(
    py: Python<'py>,
    n2: Option<In<'py>>,
    co2: Option<In<'py>>,
    h2s: Option<In<'py>>,
    c1: Option<In<'py>>,
    c2: Option<In<'py>>,
    c3: Option<In<'py>>,
    ic4: Option<In<'py>>,
    nc4: Option<In<'py>>,
    ic5: Option<In<'py>>,
    nc5: Option<In<'py>>,
    c6: Option<In<'py>>,
    c7plus: Option<In<'py>>,
    c7plus_mw: Option<In<'py>>,
    c7plus_sg: Option<In<'py>>,
    errors: &str,
) -> PyResult<Py<PyTuple>> {
    let on = on_error(errors)?;
    let args = [
        n2, co2, h2s, c1, c2, c3, ic4, nc4, ic5, nc5, c6, c7plus, c7plus_mw, c7plus_sg,
    ];
    let args: Vec<In<'py>> = args
        .into_iter()
        .map(|a| or_const(py, a, 0.0))
        .collect::<PyResult<_>>()?;
    let refs: [&In<'py>; 14] = std::array::from_fn(|i| &args[i]);
    let out = call_multi(py, refs, move |v| {
        let [a, b, c, d, e, f, g, h, i, j, k, l, m, n] = v;
        core::kay_array([a, b, c, d, e, f, g, h, i, j, k, l], m, n, on)
    })?;
    PyTuple::new(py, out).map(|t| t.unbind())
}

/// Gas formation volume factor Bg, rcf/scf, from pressure (psia), temperature (degF) and Z.
#[pyfunction]
#[pyo3(signature = (p_psia, t_f, z, *, p_sc = 14.696, t_sc = 60.0, errors = "raise"))]
#[allow(clippy::too_many_arguments)]
fn bg(
    py: Python<'_>,
    p_psia: In<'_>,
    t_f: In<'_>,
    z: In<'_>,
    p_sc: f64,
    t_sc: f64,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let s = sc(p_sc, t_sc)?;
    let on = on_error(errors)?;
    call(py, [&p_psia, &t_f, &z], move |[p, t, z]| {
        core::bg_array(p, t, z, &s, on)
    })
}

/// Gas density, lbm/ft3, from pressure (psia), temperature (degF), Z and gas gravity.
#[pyfunction]
#[pyo3(signature = (p_psia, t_f, z, gas_sg, *, errors = "raise"))]
fn gas_density(
    py: Python<'_>,
    p_psia: In<'_>,
    t_f: In<'_>,
    z: In<'_>,
    gas_sg: In<'_>,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let on = on_error(errors)?;
    call(py, [&p_psia, &t_f, &z, &gas_sg], move |[p, t, z, g]| {
        core::gas_density_array(p, t, z, g, on)
    })
}

/// Lee–Gonzalez–Eakin (1966) gas viscosity, cp, from temperature (degF), density
/// (lbm/ft3) and molar mass (lbm/lbmol).
#[pyfunction]
#[pyo3(signature = (t_f, density_lbm_ft3, molar_mass, *, errors = "raise"))]
fn viscosity_lee_gonzalez_eakin(
    py: Python<'_>,
    t_f: In<'_>,
    density_lbm_ft3: In<'_>,
    molar_mass: In<'_>,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let on = on_error(errors)?;
    call(
        py,
        [&t_f, &density_lbm_ft3, &molar_mass],
        move |[t, r, m]| core::viscosity_lee_gonzalez_eakin_array(t, r, m, on),
    )
}

/// Reservoir gas gravity (air = 1) of a wet gas / gas condensate by recombination.
#[pyfunction]
#[pyo3(signature = (separator_gor, separator_gas_sg, condensate_api, *, stock_tank_gor = None,
    stock_tank_gas_sg = None, condensate_mw = None, p_sc = 14.696, t_sc = 60.0, errors = "raise"))]
#[allow(clippy::too_many_arguments)]
fn recombined_gas_sg<'py>(
    py: Python<'py>,
    separator_gor: In<'py>,
    separator_gas_sg: In<'py>,
    condensate_api: In<'py>,
    stock_tank_gor: Option<In<'py>>,
    stock_tank_gas_sg: Option<In<'py>>,
    condensate_mw: Option<In<'py>>,
    p_sc: f64,
    t_sc: f64,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let s = sc(p_sc, t_sc)?;
    let on = on_error(errors)?;
    let stock_tank_gor = or_const(py, stock_tank_gor, 0.0)?;
    let stock_tank_gas_sg = or_const(py, stock_tank_gas_sg, 1.0)?;
    let base = [
        &separator_gor,
        &separator_gas_sg,
        &stock_tank_gor,
        &stock_tank_gas_sg,
        &condensate_api,
    ];
    match &condensate_mw {
        None => call(py, base, move |v| {
            core::recombined_gas_sg_array(v, None, &s, on)
        }),
        Some(m) => {
            let [a, b, c, d, e] = base;
            call(py, [a, b, c, d, e, m], move |[a, b, c, d, e, m]| {
                core::recombined_gas_sg_array([a, b, c, d, e], Some(m), &s, on)
            })
        }
    }
}

/// Gas equivalent of condensate, scf/STB, from condensate gravity (60/60 degF) and molar
/// mass (lbm/lbmol).
#[pyfunction]
#[pyo3(signature = (condensate_sg, condensate_mw, *, p_sc = 14.696, t_sc = 60.0, errors = "raise"))]
fn gas_equivalent(
    py: Python<'_>,
    condensate_sg: In<'_>,
    condensate_mw: In<'_>,
    p_sc: f64,
    t_sc: f64,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let s = sc(p_sc, t_sc)?;
    let on = on_error(errors)?;
    call(py, [&condensate_sg, &condensate_mw], move |[g, m]| {
        lift(["condensate_sg", "condensate_mw"], [g, m], on, |[g, m]| {
            core::gas_equivalent(g, m, &s)
        })
    })
}

/// Condensate molar mass, lbm/lbmol, from API gravity by Cragoe (1929).
#[pyfunction]
#[pyo3(signature = (condensate_api, *, errors = "raise"))]
fn condensate_molar_mass(
    py: Python<'_>,
    condensate_api: In<'_>,
    errors: &str,
) -> PyResult<Py<PyAny>> {
    let on = on_error(errors)?;
    call(py, [&condensate_api], move |[a]| {
        lift(["condensate_api"], [a], on, |[a]| {
            core::condensate_molar_mass_cragoe(a)
        })
    })
}

/// A natural gas: specific gravity (air = 1), impurity mole fractions and method choices.
///
/// Defaults: Sutton (1985) pseudo-criticals of the hydrocarbon part mixed with the
/// impurities, Wichert–Aziz (1972) for CO2/H2S, Dranchuk–Abou-Kassem (1975) Z,
/// Lee–Gonzalez–Eakin (1966) viscosity. Give ``tpc_r`` (degR) and ``ppc_psia`` (psia)
/// to bypass the gravity correlation. Methods take pressure ``p_psia`` (psia) and
/// temperature ``t_f`` (degF) as any array-likes and broadcast them.
#[pyclass(name = "Gas", module = "stocktank._core", frozen, eq)]
#[derive(Clone, PartialEq)]
pub struct Gas(pub CoreGas);

impl Gas {
    fn prop(
        &self,
        py: Python<'_>,
        prop: GasProperty,
        p_psia: &In<'_>,
        t_f: &In<'_>,
        s: StandardConditions,
        errors: &str,
    ) -> PyResult<Py<PyAny>> {
        let on = on_error(errors)?;
        let g = self.0;
        call(py, [p_psia, t_f], move |[p, t]| {
            g.property_array(prop, p, t, &s, on)
        })
    }
}

#[pymethods]
impl Gas {
    #[new]
    #[pyo3(signature = (gas_sg, *, co2 = 0.0, h2s = 0.0, n2 = 0.0, pseudo_critical = "sutton",
        impurity_correction = "wichert_aziz", tpc_r = None, ppc_psia = None, z_method = "dak",
        viscosity_method = "lee_gonzalez_eakin"))]
    #[allow(clippy::too_many_arguments)]
    fn new(
        gas_sg: f64,
        co2: f64,
        h2s: f64,
        n2: f64,
        pseudo_critical: Option<&str>,
        impurity_correction: &str,
        tpc_r: Option<f64>,
        ppc_psia: Option<f64>,
        z_method: &str,
        viscosity_method: &str,
    ) -> PyResult<Self> {
        let mut g = CoreGas::new(gas_sg)?
            .with_impurity_correction(ImpurityCorrection::parse(impurity_correction)?)?
            .with_z_method(ZMethod::parse(z_method)?)
            .with_viscosity_method(ViscosityMethod::parse(viscosity_method)?);
        match (tpc_r, ppc_psia) {
            (Some(t), Some(p)) => g = g.with_pseudo_critical(t, p)?,
            (None, None) => {
                let c = GravityCorrelation::parse(pseudo_critical.unwrap_or("sutton"))?;
                g = g.with_gravity_correlation(c)?;
            }
            (Some(_), None) | (None, Some(_)) => {
                return Err(crate::Error::InvalidOption {
                    arg: "tpc_r",
                    value: "only one of tpc_r and ppc_psia".into(),
                    allowed: "both tpc_r and ppc_psia, or neither",
                }
                .into());
            }
        }
        Ok(Self(g.with_impurities(co2, h2s, n2)?))
    }

    /// A gas from its composition (mole fractions summing to 1) by Kay's rule.
    #[staticmethod]
    #[pyo3(signature = (*, n2 = 0.0, co2 = 0.0, h2s = 0.0, c1 = 0.0, c2 = 0.0, c3 = 0.0,
        ic4 = 0.0, nc4 = 0.0, ic5 = 0.0, nc5 = 0.0, c6 = 0.0, c7plus = 0.0, c7plus_mw = 0.0,
        c7plus_sg = 0.0, z_method = "dak", viscosity_method = "lee_gonzalez_eakin"))]
    #[allow(clippy::too_many_arguments)]
    fn from_composition(
        n2: f64,
        co2: f64,
        h2s: f64,
        c1: f64,
        c2: f64,
        c3: f64,
        ic4: f64,
        nc4: f64,
        ic5: f64,
        nc5: f64,
        c6: f64,
        c7plus: f64,
        c7plus_mw: f64,
        c7plus_sg: f64,
        z_method: &str,
        viscosity_method: &str,
    ) -> PyResult<Self> {
        let y = [n2, co2, h2s, c1, c2, c3, ic4, nc4, ic5, nc5, c6, c7plus];
        Ok(Self(
            CoreGas::from_composition(&y, c7plus_mw, c7plus_sg)?
                .with_z_method(ZMethod::parse(z_method)?)
                .with_viscosity_method(ViscosityMethod::parse(viscosity_method)?),
        ))
    }

    /// Gas specific gravity, air = 1.
    #[getter]
    fn gas_sg(&self) -> f64 {
        self.0.gas_sg()
    }
    /// CO2 mole fraction.
    #[getter]
    fn co2(&self) -> f64 {
        self.0.co2()
    }
    /// H2S mole fraction.
    #[getter]
    fn h2s(&self) -> f64 {
        self.0.h2s()
    }
    /// N2 mole fraction.
    #[getter]
    fn n2(&self) -> f64 {
        self.0.n2()
    }
    /// Gravity correlation name, or None when the pseudo-criticals were given.
    #[getter]
    fn pseudo_critical(&self) -> Option<&'static str> {
        match self.0.source() {
            PseudoCriticalSource::Gravity(c) => Some(c.name()),
            PseudoCriticalSource::Given(_) => None,
        }
    }
    /// Impurity correction name.
    #[getter]
    fn impurity_correction(&self) -> &'static str {
        self.0.impurity_correction().name()
    }
    /// Z-factor method name.
    #[getter]
    fn z_method(&self) -> &'static str {
        self.0.z_method().name()
    }
    /// Viscosity method name.
    #[getter]
    fn viscosity_method(&self) -> &'static str {
        self.0.viscosity_method().name()
    }
    /// Pseudo-critical temperature in use (after corrections), degR.
    #[getter]
    fn tpc_r(&self) -> f64 {
        self.0.pseudo_critical().tpc_r
    }
    /// Pseudo-critical pressure in use (after corrections), psia.
    #[getter]
    fn ppc_psia(&self) -> f64 {
        self.0.pseudo_critical().ppc_psia
    }
    /// Molar mass, lbm/lbmol.
    #[getter]
    fn molar_mass(&self) -> f64 {
        self.0.molar_mass()
    }

    /// Z-factor (dimensionless) at pressure ``p_psia`` (psia) and temperature ``t_f`` (degF).
    #[pyo3(signature = (p_psia, t_f, *, errors = "raise"))]
    fn z(&self, py: Python<'_>, p_psia: In<'_>, t_f: In<'_>, errors: &str) -> PyResult<Py<PyAny>> {
        self.prop(
            py,
            GasProperty::Z,
            &p_psia,
            &t_f,
            StandardConditions::FIELD,
            errors,
        )
    }
    /// Gas formation volume factor, rcf/scf.
    #[pyo3(signature = (p_psia, t_f, *, p_sc = 14.696, t_sc = 60.0, errors = "raise"))]
    fn bg(
        &self,
        py: Python<'_>,
        p_psia: In<'_>,
        t_f: In<'_>,
        p_sc: f64,
        t_sc: f64,
        errors: &str,
    ) -> PyResult<Py<PyAny>> {
        self.prop(py, GasProperty::Bg, &p_psia, &t_f, sc(p_sc, t_sc)?, errors)
    }
    /// Gas formation volume factor, rb/Mscf.
    #[pyo3(signature = (p_psia, t_f, *, p_sc = 14.696, t_sc = 60.0, errors = "raise"))]
    fn bg_rb_per_mscf(
        &self,
        py: Python<'_>,
        p_psia: In<'_>,
        t_f: In<'_>,
        p_sc: f64,
        t_sc: f64,
        errors: &str,
    ) -> PyResult<Py<PyAny>> {
        self.prop(
            py,
            GasProperty::BgRbPerMscf,
            &p_psia,
            &t_f,
            sc(p_sc, t_sc)?,
            errors,
        )
    }
    /// Gas expansion factor Eg = 1/Bg, scf/rcf.
    #[pyo3(signature = (p_psia, t_f, *, p_sc = 14.696, t_sc = 60.0, errors = "raise"))]
    fn eg(
        &self,
        py: Python<'_>,
        p_psia: In<'_>,
        t_f: In<'_>,
        p_sc: f64,
        t_sc: f64,
        errors: &str,
    ) -> PyResult<Py<PyAny>> {
        self.prop(py, GasProperty::Eg, &p_psia, &t_f, sc(p_sc, t_sc)?, errors)
    }
    /// Gas density, lbm/ft3.
    #[pyo3(signature = (p_psia, t_f, *, errors = "raise"))]
    fn density(
        &self,
        py: Python<'_>,
        p_psia: In<'_>,
        t_f: In<'_>,
        errors: &str,
    ) -> PyResult<Py<PyAny>> {
        self.prop(
            py,
            GasProperty::Density,
            &p_psia,
            &t_f,
            StandardConditions::FIELD,
            errors,
        )
    }
    /// Gas viscosity, cp.
    #[pyo3(signature = (p_psia, t_f, *, errors = "raise"))]
    fn viscosity(
        &self,
        py: Python<'_>,
        p_psia: In<'_>,
        t_f: In<'_>,
        errors: &str,
    ) -> PyResult<Py<PyAny>> {
        self.prop(
            py,
            GasProperty::Viscosity,
            &p_psia,
            &t_f,
            StandardConditions::FIELD,
            errors,
        )
    }
    /// Gas isothermal compressibility, 1/psi (analytic dZ/dp).
    #[pyo3(signature = (p_psia, t_f, *, errors = "raise"))]
    fn cg(&self, py: Python<'_>, p_psia: In<'_>, t_f: In<'_>, errors: &str) -> PyResult<Py<PyAny>> {
        self.prop(
            py,
            GasProperty::Cg,
            &p_psia,
            &t_f,
            StandardConditions::FIELD,
            errors,
        )
    }
    /// Real-gas pseudo-pressure m(p), psia^2/cp, at each pressure (psia) of an array, at one
    /// temperature ``t_f`` (degF), from p = 0.
    #[pyo3(signature = (p_psia, t_f, *, errors = "raise"))]
    fn pseudo_pressure(
        &self,
        py: Python<'_>,
        p_psia: In<'_>,
        t_f: f64,
        errors: &str,
    ) -> PyResult<Py<PyAny>> {
        let on = on_error(errors)?;
        let g = self.0;
        // Not elementwise: the integrals between the sorted pressures run in parallel at
        // any size, so always in the pool.
        let p = p_psia.as_array();
        let scalar = p.ndim() == 0;
        let out = detach(py, move || g.pseudo_pressure(p, t_f, on))?;
        to_py(py, out, scalar)
    }
    /// Per element, whether the inputs lie in the published ranges of the gas's methods:
    /// a dict of boolean arrays with keys ``pseudo_critical``, ``z_factor``, ``viscosity``.
    fn in_range<'py>(
        &self,
        py: Python<'py>,
        p_psia: In<'py>,
        t_f: In<'py>,
    ) -> PyResult<Bound<'py, PyDict>> {
        let g = self.0;
        let d = PyDict::new(py);
        for (k, key) in ["pseudo_critical", "z_factor", "viscosity"]
            .into_iter()
            .enumerate()
        {
            let v = call_bool(py, [&p_psia, &t_f], move |[p, t]| {
                let f = lift(["p_psia", "t_f"], [p, t], OnError::Raise, |[p, t]| {
                    Ok(if g.in_range(p, t)?[k] { 1.0 } else { 0.0 })
                })?;
                Ok(f.mapv(|v| v == 1.0))
            })?;
            d.set_item(key, v)?;
        }
        Ok(d)
    }

    fn __repr__(&self) -> String {
        let g = &self.0;
        let pc = match g.source() {
            PseudoCriticalSource::Gravity(c) => format!("pseudo_critical='{}'", c.name()),
            PseudoCriticalSource::Given(pc) => {
                format!("tpc_r={:?}, ppc_psia={:?}", pc.tpc_r, pc.ppc_psia)
            }
        };
        format!(
            "Gas(gas_sg={:?}, co2={:?}, h2s={:?}, n2={:?}, {pc}, impurity_correction='{}', z_method='{}', viscosity_method='{}')",
            g.gas_sg(),
            g.co2(),
            g.h2s(),
            g.n2(),
            g.impurity_correction().name(),
            g.z_method().name(),
            g.viscosity_method().name()
        )
    }

    fn __reduce__<'py>(
        slf: &Bound<'py, Self>,
    ) -> PyResult<(Bound<'py, PyAny>, Bound<'py, PyTuple>, Bound<'py, PyAny>)> {
        let py = slf.py();
        let g = slf.get().0;
        let kwargs = PyDict::new(py);
        kwargs.set_item("gas_sg", g.gas_sg())?;
        kwargs.set_item("co2", g.co2())?;
        kwargs.set_item("h2s", g.h2s())?;
        kwargs.set_item("n2", g.n2())?;
        match g.source() {
            PseudoCriticalSource::Gravity(c) => kwargs.set_item("pseudo_critical", c.name())?,
            PseudoCriticalSource::Given(pc) => {
                kwargs.set_item("pseudo_critical", py.None())?;
                kwargs.set_item("tpc_r", pc.tpc_r)?;
                kwargs.set_item("ppc_psia", pc.ppc_psia)?;
            }
        }
        kwargs.set_item("impurity_correction", g.impurity_correction().name())?;
        kwargs.set_item("z_method", g.z_method().name())?;
        kwargs.set_item("viscosity_method", g.viscosity_method().name())?;
        let rebuild = py.import("stocktank._pickle")?.getattr("rebuild")?;
        let args = PyTuple::new(py, [slf.get_type().into_any(), kwargs.into_any()])?;
        Ok((rebuild, args, py.None().into_bound(py)))
    }
}

pub(super) fn register(m: &Bound<'_, PyModule>) -> PyResult<()> {
    m.add_class::<Gas>()?;
    m.add_function(wrap_pyfunction!(z_factor, m)?)?;
    m.add_function(wrap_pyfunction!(pseudo_reduced_compressibility, m)?)?;
    m.add_function(wrap_pyfunction!(z_factor_in_range, m)?)?;
    m.add_function(wrap_pyfunction!(pseudo_critical, m)?)?;
    m.add_function(wrap_pyfunction!(pseudo_critical_in_range, m)?)?;
    m.add_function(wrap_pyfunction!(wichert_aziz, m)?)?;
    m.add_function(wrap_pyfunction!(pseudo_critical_kay, m)?)?;
    m.add_function(wrap_pyfunction!(bg, m)?)?;
    m.add_function(wrap_pyfunction!(gas_density, m)?)?;
    m.add_function(wrap_pyfunction!(viscosity_lee_gonzalez_eakin, m)?)?;
    m.add_function(wrap_pyfunction!(recombined_gas_sg, m)?)?;
    m.add_function(wrap_pyfunction!(gas_equivalent, m)?)?;
    m.add_function(wrap_pyfunction!(condensate_molar_mass, m)?)?;
    Ok(())
}
