//! Python bindings of [`crate::decline`].

use pyo3::prelude::*;

pub(super) fn register(_m: &Bound<'_, PyModule>) -> PyResult<()> {
    Ok(())
}
