//! The Python binding layer: the only place pyo3 and numpy appear.
//!
//! One file per domain mirrors the core. Every function converts its inputs to array views,
//! releases the GIL, calls a core array function, and converts the result back: a Python
//! float when every array input was a scalar (0-d), a numpy float64 array otherwise.

use crate::array::OnError;
use crate::error::Error;
use ndarray::{ArrayD, ArrayViewD};
use numpy::{AllowTypeChange, IntoPyArray, PyArrayLikeDyn, PyUntypedArrayMethods};
use pyo3::create_exception;
use pyo3::exceptions::PyValueError;
use pyo3::prelude::*;

mod decline;
mod gas;
mod material_balance;
mod oil;
mod relperm;
mod threads;
mod units;
mod volumetrics;
mod water;

create_exception!(
    stocktank,
    StocktankError,
    PyValueError,
    "Base class of every stocktank error (a ValueError)."
);
create_exception!(
    stocktank,
    InvalidArgumentError,
    StocktankError,
    "A physically impossible or invalid input; the message names the argument, value and index."
);
create_exception!(
    stocktank,
    ShapeError,
    StocktankError,
    "Inputs whose shapes cannot be broadcast together."
);
create_exception!(
    stocktank,
    InvalidOptionError,
    StocktankError,
    "An option (method, policy) that is not one of the allowed choices."
);
create_exception!(
    stocktank,
    InvalidRecordError,
    StocktankError,
    "A row of a table or history that breaks a rule; the message names the row."
);
create_exception!(
    stocktank,
    ConvergenceError,
    StocktankError,
    "An iterative solver stopped without meeting its tolerance."
);
create_exception!(
    stocktank,
    SingularError,
    StocktankError,
    "A fit or system without a unique solution."
);
create_exception!(
    stocktank,
    OutOfRangeError,
    StocktankError,
    "A request outside what the data supports."
);

impl From<Error> for PyErr {
    fn from(e: Error) -> PyErr {
        let msg = e.to_string();
        match e {
            Error::InvalidArgument { .. } => InvalidArgumentError::new_err(msg),
            Error::Shape(_) => ShapeError::new_err(msg),
            Error::InvalidOption { .. } => InvalidOptionError::new_err(msg),
            Error::InvalidRecord { .. } => InvalidRecordError::new_err(msg),
            Error::NoConvergence { .. } => ConvergenceError::new_err(msg),
            Error::Singular { .. } => SingularError::new_err(msg),
            Error::OutOfRange(_) => OutOfRangeError::new_err(msg),
        }
    }
}

pub(crate) use threads::detach;

/// A count, seed or iteration limit as an unsigned integer: a negative (or beyond 2^64)
/// Python int is an [`Error::InvalidArgument`] naming `arg`, not the `OverflowError`
/// "can't convert negative int to unsigned" of a direct `usize`/`u64` extraction.
pub(crate) fn whole<T: TryFrom<i128>>(arg: &'static str, v: i128) -> PyResult<T> {
    T::try_from(v).map_err(|_| {
        Error::invalid(arg, v as f64, "must be a whole number from 0 to 2^64 - 1").into()
    })
}

/// Fail with a Python `MemoryError` naming `arg` when `count` items of about `bytes_each`
/// bytes cannot be allocated, found by reserving (and at once releasing) that much; the
/// allocation inside the work would abort the process or panic ("capacity overflow")
/// instead. Like numpy's `MemoryError` for an impossible array; no memory is touched.
pub(crate) fn check_memory(arg: &str, count: usize, bytes_each: usize) -> PyResult<()> {
    let bytes = count.checked_mul(bytes_each);
    if bytes.is_some_and(|b| Vec::<u8>::new().try_reserve_exact(b).is_ok()) {
        Ok(())
    } else {
        Err(pyo3::exceptions::PyMemoryError::new_err(format!(
            "`{arg}` = {count} needs about {} bytes, more than can be allocated",
            bytes.map_or_else(|| "2^64 or more".to_string(), |b| b.to_string())
        )))
    }
}

/// An [`Error::InvalidArgument`] whose core argument name is `from` renamed to the Python
/// keyword `to`, for each pair of `names` (other errors pass through): the message must name
/// what the user typed.
pub(crate) fn rename_arg(e: Error, names: &[(&'static str, &'static str)]) -> Error {
    match e {
        Error::InvalidArgument {
            arg,
            value,
            reason,
            index,
        } => Error::InvalidArgument {
            arg: names
                .iter()
                .find(|(from, _)| *from == arg)
                .map_or(arg, |(_, to)| *to),
            value,
            reason,
            index,
        },
        other => other,
    }
}

/// Any array-like input (float, int, list, any-dtype array), converted to float64. A
/// numpy masked array gives NaN at its masked elements (its data there is not a value of
/// the user's; NaN in gives NaN out).
pub(crate) struct In<'py>(PyArrayLikeDyn<'py, f64, AllowTypeChange>);

impl<'py> std::ops::Deref for In<'py> {
    type Target = PyArrayLikeDyn<'py, f64, AllowTypeChange>;

    fn deref(&self) -> &Self::Target {
        &self.0
    }
}

impl<'a, 'py> FromPyObject<'a, 'py> for In<'py> {
    type Error = PyErr;

    fn extract(ob: Borrowed<'a, 'py, PyAny>) -> PyResult<Self> {
        if is_masked_array(&ob)? {
            let filled = ob
                .call_method1("astype", ("float64",))?
                .call_method1("filled", (f64::NAN,))?;
            return Ok(Self(filled.extract()?));
        }
        Ok(Self(ob.extract()?))
    }
}

/// Whether `ob` is a `numpy.ma.MaskedArray` (looked for only among ndarray subclasses, so
/// plain arrays, numbers and lists pay one type comparison).
fn is_masked_array(ob: &Borrowed<'_, '_, PyAny>) -> PyResult<bool> {
    use numpy::PyUntypedArray;
    use pyo3::sync::PyOnceLock;
    use pyo3::types::PyType;
    let py = ob.py();
    let Ok(arr) = ob.cast::<PyUntypedArray>() else {
        return Ok(false);
    };
    if arr
        .get_type()
        .is(<PyUntypedArray as pyo3::PyTypeInfo>::type_object(py))
    {
        return Ok(false);
    }
    static MASKED: PyOnceLock<Py<PyType>> = PyOnceLock::new();
    let masked = MASKED.import(py, "numpy.ma", "MaskedArray")?;
    ob.is_instance(masked)
}

/// Parse the `errors=` keyword.
#[allow(dead_code)] // used by the domain bindings as they land
pub(crate) fn on_error(s: &str) -> PyResult<OnError> {
    Ok(OnError::parse(s)?)
}

/// Convert an array result back: a float for all-scalar inputs, else a numpy array.
pub(crate) fn to_py(py: Python<'_>, out: ArrayD<f64>, scalar: bool) -> PyResult<Py<PyAny>> {
    if scalar && out.len() == 1 {
        let v = *out.iter().next().expect("one element");
        Ok(v.into_pyobject(py)?.into_any().unbind())
    } else {
        Ok(out.into_pyarray(py).into_any().unbind())
    }
}

/// Whether elementwise work over inputs of these shapes stays below
/// [`crate::array::PARALLEL_THRESHOLD`] elements once broadcast (shapes that do not
/// broadcast count as large: the pool path then reports their error).
fn below_parallel_threshold(shapes: &[&[usize]]) -> bool {
    let names = vec![""; shapes.len()];
    crate::array::broadcast_shape(&names, shapes)
        .is_ok_and(|s| s.iter().product::<usize>() < crate::array::PARALLEL_THRESHOLD)
}

/// Release the GIL and run elementwise work `f` over inputs of the given shapes: on the
/// calling thread below the parallel threshold (the array layer then uses no threads, and
/// handing a few elements to a pool thread costs its wake-up: measured about 50 µs per call
/// of a scalar `z_factor`, against about 1 µs of work), else in the pool ([`detach`]).
fn detach_elementwise<T, F>(py: Python<'_>, shapes: &[&[usize]], f: F) -> T
where
    F: FnOnce() -> T + Send,
    T: Send,
{
    if below_parallel_threshold(shapes) {
        py.detach(f)
    } else {
        detach(py, f)
    }
}

/// Run a core array function on `N` array-like inputs with the GIL released. `f` must be
/// elementwise work through the array layer (which uses threads only above the parallel
/// threshold): small inputs run on the calling thread ([`detach_elementwise`]).
pub(crate) fn call<const N: usize, F>(
    py: Python<'_>,
    inputs: [&In<'_>; N],
    f: F,
) -> PyResult<Py<PyAny>>
where
    F: for<'a> FnOnce([ArrayViewD<'a, f64>; N]) -> crate::Result<ArrayD<f64>> + Send,
{
    let scalar = inputs.iter().all(|a| a.ndim() == 0);
    let views = inputs.map(|a| a.as_array());
    let shapes: [&[usize]; N] = inputs.map(|a| a.shape());
    let out = detach_elementwise(py, &shapes, move || f(views))?;
    to_py(py, out, scalar)
}

/// As [`call`] for validity checks: a Python bool for all-scalar inputs, else a numpy bool
/// array.
pub(crate) fn call_bool<const N: usize, F>(
    py: Python<'_>,
    inputs: [&In<'_>; N],
    f: F,
) -> PyResult<Py<PyAny>>
where
    F: for<'a> FnOnce([ArrayViewD<'a, f64>; N]) -> crate::Result<ArrayD<bool>> + Send,
{
    let scalar = inputs.iter().all(|a| a.ndim() == 0);
    let views = inputs.map(|a| a.as_array());
    let shapes: [&[usize]; N] = inputs.map(|a| a.shape());
    let out = detach_elementwise(py, &shapes, move || f(views))?;
    if scalar && out.len() == 1 {
        let v = *out.iter().next().expect("one element");
        Ok(pyo3::types::PyBool::new(py, v)
            .to_owned()
            .into_any()
            .unbind())
    } else {
        Ok(out.into_pyarray(py).into_any().unbind())
    }
}

/// As [`call`] for functions with `M` outputs; returns a tuple.
#[allow(dead_code)] // used by the domain bindings as they land
pub(crate) fn call_multi<const N: usize, const M: usize, F>(
    py: Python<'_>,
    inputs: [&In<'_>; N],
    f: F,
) -> PyResult<Vec<Py<PyAny>>>
where
    F: for<'a> FnOnce([ArrayViewD<'a, f64>; N]) -> crate::Result<[ArrayD<f64>; M]> + Send,
{
    let scalar = inputs.iter().all(|a| a.ndim() == 0);
    let views = inputs.map(|a| a.as_array());
    let shapes: [&[usize]; N] = inputs.map(|a| a.shape());
    let outs = detach_elementwise(py, &shapes, move || f(views))?;
    outs.into_iter().map(|o| to_py(py, o, scalar)).collect()
}

#[pymodule]
fn _core(m: &Bound<'_, PyModule>) -> PyResult<()> {
    let py = m.py();
    m.add("__version__", env!("CARGO_PKG_VERSION"))?;
    m.add("StocktankError", py.get_type::<StocktankError>())?;
    m.add(
        "InvalidArgumentError",
        py.get_type::<InvalidArgumentError>(),
    )?;
    m.add("ShapeError", py.get_type::<ShapeError>())?;
    m.add("InvalidOptionError", py.get_type::<InvalidOptionError>())?;
    m.add("InvalidRecordError", py.get_type::<InvalidRecordError>())?;
    m.add("ConvergenceError", py.get_type::<ConvergenceError>())?;
    m.add("SingularError", py.get_type::<SingularError>())?;
    m.add("OutOfRangeError", py.get_type::<OutOfRangeError>())?;
    threads::register(m)?;
    relperm::register(m)?;
    gas::register(m)?;
    oil::register(m)?;
    water::register(m)?;
    material_balance::register(m)?;
    decline::register(m)?;
    volumetrics::register(m)?;
    units::register(m)?;
    Ok(())
}
