//! Python bindings of [`crate::gas`].

use pyo3::prelude::*;

pub(super) fn register(_m: &Bound<'_, PyModule>) -> PyResult<()> {
    Ok(())
}
