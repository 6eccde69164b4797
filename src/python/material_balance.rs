//! Python bindings of [`crate::material_balance`].

use pyo3::prelude::*;

pub(super) fn register(_m: &Bound<'_, PyModule>) -> PyResult<()> {
    Ok(())
}
