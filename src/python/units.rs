//! Python bindings of [`crate::units::convert`]: conversion only.

use super::{In, call};
use crate::array::{OnError, lift};
use crate::units::convert;
use crate::units::{StandardConditions, standard_conditions};
use pyo3::prelude::*;

/// Convert values between two units of one quantity (see ``stocktank.units.UNITS``).
#[pyfunction]
#[pyo3(signature = (value, from_unit, to_unit))]
fn convert_units(
    py: Python<'_>,
    value: In<'_>,
    from_unit: &str,
    to_unit: &str,
) -> PyResult<Py<PyAny>> {
    let (s, o) = convert::factor(from_unit, to_unit)?;
    let from = convert::unit("from_unit", from_unit)?;
    call(py, [&value], move |[x]| {
        lift(["value"], [x], OnError::Raise, |[x]| {
            Ok(convert::check_absolute("value", x, &from)? * s + o)
        })
    })
}

/// (scale, offset) with ``to = value * scale + offset`` between two units of one quantity.
#[pyfunction]
fn unit_factor(from_unit: &str, to_unit: &str) -> PyResult<(f64, f64)> {
    Ok(convert::factor(from_unit, to_unit)?)
}

/// The quantity name of a unit (e.g. "pressure" for "kPa").
#[pyfunction]
fn unit_quantity(unit: &str) -> PyResult<&'static str> {
    Ok(convert::unit("unit", unit)?.quantity.name())
}

/// Move an ideal-gas standard volume between base conditions (psia, degF).
#[pyfunction]
#[pyo3(signature = (volume, *, from_p_sc, from_t_sc, to_p_sc, to_t_sc))]
fn rebase_gas_volume(
    py: Python<'_>,
    volume: In<'_>,
    from_p_sc: f64,
    from_t_sc: f64,
    to_p_sc: f64,
    to_t_sc: f64,
) -> PyResult<Py<PyAny>> {
    let a: StandardConditions = standard_conditions(from_p_sc, from_t_sc)
        .map_err(|e| super::rename_arg(e, &[("p_sc", "from_p_sc"), ("t_sc", "from_t_sc")]))?;
    let b: StandardConditions = standard_conditions(to_p_sc, to_t_sc)
        .map_err(|e| super::rename_arg(e, &[("p_sc", "to_p_sc"), ("t_sc", "to_t_sc")]))?;
    call(py, [&volume], move |[x]| {
        lift(["volume"], [x], OnError::Raise, |[x]| {
            convert::rebase_gas_volume(x, a, b)
        })
    })
}

pub(super) fn register(m: &Bound<'_, PyModule>) -> PyResult<()> {
    m.add_function(wrap_pyfunction!(convert_units, m)?)?;
    m.add_function(wrap_pyfunction!(unit_factor, m)?)?;
    m.add_function(wrap_pyfunction!(unit_quantity, m)?)?;
    m.add_function(wrap_pyfunction!(rebase_gas_volume, m)?)?;
    m.add("ALL_UNITS", convert::ALL_UNITS)?;
    Ok(())
}
