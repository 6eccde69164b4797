//! The one array lift: broadcast inputs like numpy and map a scalar kernel over them.
//!
//! Every array function of stocktank is a scalar kernel (the single implementation of a
//! quantity) lifted by [`lift`] or [`lift_multi`]. The lift
//! - broadcasts all inputs to one common shape with numpy's rules (an incompatible shape is
//!   [`Error::Shape`]);
//! - returns NaN wherever any input is NaN, without calling the kernel (NaN in, NaN out);
//! - on a kernel error either stops with the error of the lowest element, with that element's
//!   index in the offending argument's own array ([`OnError::Raise`]), or writes NaN there and
//!   goes on ([`OnError::Coerce`]), so one bad row does not fail a batch of a million;
//! - runs in parallel on all cores (rayon) above [`PARALLEL_THRESHOLD`] elements, in chunks,
//!   with no per-element heap allocation; memory is the inputs, the outputs and a small constant
//!   (plus a contiguous copy of an input that is neither contiguous nor broadcast-free).
//!   The loops run on the current rayon pool: call inside `rayon::ThreadPool::install` to
//!   bound the threads (Python: `stocktank.num_threads(n)`). Results do not depend on the
//!   number of threads (each element is computed alone).

use crate::error::{Error, Result};
use ndarray::{ArrayD, ArrayViewD, IxDyn};
use rayon::prelude::*;
use std::borrow::Cow;

/// Number of elements from which the lift runs in parallel.
pub const PARALLEL_THRESHOLD: usize = 16_384;
/// Elements per parallel work item.
const CHUNK: usize = 4_096;

/// What to do when the kernel rejects an element.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum OnError {
    /// Stop and return the error of the first (lowest-index) bad element.
    #[default]
    Raise,
    /// Write NaN for bad elements and carry on.
    Coerce,
}

impl OnError {
    /// Parse `"raise"` or `"coerce"` (the Python `errors=` keyword).
    ///
    /// # Errors
    /// [`Error::InvalidOption`] naming `errors`.
    ///
    /// # Examples
    /// ```
    /// use stocktank::array::OnError;
    /// assert_eq!(OnError::parse("coerce").unwrap(), OnError::Coerce);
    /// assert!(OnError::parse("ignore").is_err());
    /// ```
    pub fn parse(s: &str) -> Result<Self> {
        match s {
            "raise" => Ok(OnError::Raise),
            "coerce" => Ok(OnError::Coerce),
            _ => Err(Error::InvalidOption {
                arg: "errors",
                value: s.to_string(),
                allowed: "raise, coerce",
            }),
        }
    }
}

/// The broadcast shape of several shapes, by numpy's rules (right-aligned; a dimension of
/// length 1 stretches).
///
/// # Errors
/// [`Error::Shape`] when two dimensions differ and neither is 1; the message names the
/// arguments.
///
/// # Examples
/// ```
/// use stocktank::array::broadcast_shape;
/// assert_eq!(broadcast_shape(&["p", "t"], &[&[3, 1], &[4]]).unwrap(), vec![3, 4]);
/// assert!(broadcast_shape(&["p", "t"], &[&[3], &[4]]).is_err());
/// ```
pub fn broadcast_shape(names: &[&str], shapes: &[&[usize]]) -> Result<Vec<usize>> {
    let ndim = shapes.iter().map(|s| s.len()).max().unwrap_or(0);
    let mut out = vec![1usize; ndim];
    let mut owner: Vec<Option<usize>> = vec![None; ndim];
    for (i, s) in shapes.iter().enumerate() {
        let pad = ndim - s.len();
        for (d, &len) in s.iter().enumerate() {
            let od = pad + d;
            if len == out[od] || len == 1 {
                continue;
            }
            if out[od] == 1 {
                out[od] = len;
                owner[od] = Some(i);
            } else {
                let other = owner[od].map(|j| names[j]).unwrap_or("?");
                return Err(Error::Shape(format!(
                    "`{}` with shape {:?} cannot be broadcast with `{}` with shape {:?}",
                    names[i],
                    s,
                    other,
                    shapes[owner[od].unwrap_or(0)]
                )));
            }
        }
    }
    Ok(out)
}

/// How one input is read at a flat output index.
enum Source<'a> {
    /// A single value used everywhere.
    Scalar(f64),
    /// Same shape as the output, contiguous: element k is `data[k]`.
    Direct(Cow<'a, [f64]>),
    /// Contiguous data of a smaller (broadcast) shape; `strides` are per output dimension
    /// (0 where broadcast).
    Strided(Cow<'a, [f64]>, Vec<usize>),
}

impl Source<'_> {
    #[inline(always)]
    fn get(&self, flat: usize, multi: &[usize]) -> f64 {
        match self {
            Source::Scalar(v) => *v,
            Source::Direct(d) => d[flat],
            Source::Strided(d, s) => {
                let off: usize = multi.iter().zip(s).map(|(i, st)| i * st).sum();
                d[off]
            }
        }
    }
}

fn source<'a>(view: &'a ArrayViewD<'a, f64>, out_shape: &[usize]) -> Source<'a> {
    if view.len() == 1 {
        return Source::Scalar(*view.iter().next().expect("one element"));
    }
    let data: Cow<'a, [f64]> = match view.as_slice() {
        Some(s) => Cow::Borrowed(s),
        None => Cow::Owned(view.iter().copied().collect()),
    };
    if view.shape() == out_shape {
        return Source::Direct(data);
    }
    // Standard (C-order) strides of the contiguous data, right-aligned to the output.
    let shape = view.shape();
    let pad = out_shape.len() - shape.len();
    let mut strides = vec![0usize; out_shape.len()];
    let mut acc = 1usize;
    for d in (0..shape.len()).rev() {
        strides[pad + d] = if shape[d] == 1 { 0 } else { acc };
        acc *= shape[d];
    }
    Source::Strided(data, strides)
}

/// Attach to a kernel error the index of the bad element in the named argument's own array
/// (or the output index when the error names no input, or names an input given as a
/// scalar while others are arrays, as when `rs` = 400 exceeds the 3rd of an array of `rsi`;
/// none for all-scalar inputs).
fn locate(
    e: Error,
    names: &[&str],
    shapes: &[&[usize]],
    shape: &[usize],
    multi: &[usize],
) -> Error {
    match &e {
        Error::InvalidArgument { arg, .. } => match names.iter().position(|n| n == arg) {
            Some(i) if !shapes[i].is_empty() => e.at_index(&own_index(shapes[i], multi)),
            _ if !shape.is_empty() => e.at_index(multi),
            _ => e,
        },
        _ => e,
    }
}

/// The multi-dimensional (C-order) index of flat element `flat` of an array of `shape`.
pub(crate) fn unravel(mut flat: usize, shape: &[usize], multi: &mut [usize]) {
    for d in (0..shape.len()).rev() {
        let len = shape[d].max(1);
        multi[d] = flat % len;
        flat /= len;
    }
}

#[inline(always)]
fn advance(multi: &mut [usize], shape: &[usize]) {
    for d in (0..shape.len()).rev() {
        multi[d] += 1;
        if multi[d] < shape[d] {
            return;
        }
        multi[d] = 0;
    }
}

/// The index of an error element in the argument's own array.
fn own_index(arg_shape: &[usize], multi: &[usize]) -> Vec<usize> {
    let pad = multi.len() - arg_shape.len();
    arg_shape
        .iter()
        .enumerate()
        .map(|(d, &len)| if len == 1 { 0 } else { multi[pad + d] })
        .collect()
}

/// Broadcast `N` inputs and map a kernel returning one value.
///
/// `names` are the user-facing argument names, in the order of `inputs`; a kernel error
/// naming one of them gets that argument's element index attached.
///
/// # Errors
/// [`Error::Shape`] for incompatible shapes; with [`OnError::Raise`], the kernel's error of
/// the lowest bad element.
///
/// # Examples
/// ```
/// use ndarray::{arr1, arr2};
/// use stocktank::array::{lift, OnError};
/// use stocktank::error::positive;
/// let p = arr2(&[[1.0], [2.0]]).into_dyn();
/// let t = arr1(&[10.0, 20.0, 30.0]).into_dyn();
/// let out = lift(["p", "t"], [p.view(), t.view()], OnError::Raise, |[p, t]| {
///     Ok(positive("p", p)? * t)
/// })
/// .unwrap();
/// assert_eq!(out.shape(), &[2, 3]);
/// assert_eq!(out[[1, 2]], 60.0);
/// ```
pub fn lift<const N: usize, F>(
    names: [&'static str; N],
    inputs: [ArrayViewD<'_, f64>; N],
    on_error: OnError,
    f: F,
) -> Result<ArrayD<f64>>
where
    F: Fn([f64; N]) -> Result<f64> + Sync,
{
    let [out] = lift_multi(names, inputs, on_error, |x| f(x).map(|v| [v]))?;
    Ok(out)
}

/// Broadcast `N` inputs and map a kernel returning `M` values (e.g. Tpc and Ppc).
///
/// Same rules as [`lift`]; a NaN input or a coerced error gives NaN in all `M` outputs.
///
/// # Errors
/// As [`lift`].
///
/// # Examples
/// ```
/// use ndarray::arr1;
/// use stocktank::array::{lift_multi, OnError};
/// let x = arr1(&[1.0, f64::NAN, 3.0]).into_dyn();
/// let [a, b] = lift_multi(["x"], [x.view()], OnError::Raise, |[x]| Ok([x, 2.0 * x])).unwrap();
/// assert_eq!(b[2], 6.0);
/// assert!(a[1].is_nan() && b[1].is_nan());
/// ```
pub fn lift_multi<const N: usize, const M: usize, F>(
    names: [&'static str; N],
    inputs: [ArrayViewD<'_, f64>; N],
    on_error: OnError,
    f: F,
) -> Result<[ArrayD<f64>; M]>
where
    F: Fn([f64; N]) -> Result<[f64; M]> + Sync,
{
    let shapes: [&[usize]; N] = inputs.each_ref().map(|v| v.shape());
    let shape = broadcast_shape(&names, &shapes)?;
    let total: usize = shape.iter().product();
    let sources: [Source<'_>; N] = inputs.each_ref().map(|v| source(v, &shape));
    // The multi-index is only read by strided (broadcast) sources; an error recomputes it.
    let strided = sources.iter().any(|s| matches!(s, Source::Strided(..)));
    let mut outs: [Vec<f64>; M] = std::array::from_fn(|_| crate::pages::zeroed(total));

    let run = |start: usize, mut chunk: [&mut [f64]; M]| -> Option<(Vec<usize>, Error)> {
        let len = chunk[0].len();
        let mut multi = vec![0usize; shape.len()];
        unravel(start, &shape, &mut multi);
        for k in 0..len {
            let flat = start + k;
            let x: [f64; N] = std::array::from_fn(|i| sources[i].get(flat, &multi));
            let y = if x.iter().any(|v| v.is_nan()) {
                [f64::NAN; M]
            } else {
                match f(x) {
                    Ok(y) => y,
                    Err(e) => match on_error {
                        OnError::Coerce => [f64::NAN; M],
                        OnError::Raise => {
                            unravel(flat, &shape, &mut multi);
                            return Some((multi, e));
                        }
                    },
                }
            };
            for (out, v) in chunk.iter_mut().zip(y) {
                out[k] = v;
            }
            if strided {
                advance(&mut multi, &shape);
            }
        }
        None
    };

    let first_error = if serial(total) {
        run(0, outs.each_mut().map(|v| v.as_mut_slice()))
    } else {
        let mut iters = outs.each_mut().map(|v| v.chunks_mut(CHUNK));
        let mut jobs = Vec::with_capacity(total.div_ceil(CHUNK));
        for c in 0..total.div_ceil(CHUNK) {
            jobs.push((
                c * CHUNK,
                iters.each_mut().map(|it| it.next().expect("chunk count")),
            ));
        }
        jobs.into_par_iter()
            .map(|(start, chunk)| run(start, chunk))
            .find_first(|r| r.is_some())
            .flatten()
    };

    if let Some((multi, e)) = first_error {
        return Err(locate(e, &names, &shapes, &shape, &multi));
    }
    let dim = IxDyn(&shape);
    // The output length is the product of `shape` by construction, so this cannot fail.
    Ok(outs.map(|v| ArrayD::from_shape_vec(dim.clone(), v).expect("len == shape product")))
}

/// Whether `total` elements are computed on the calling thread: below
/// [`PARALLEL_THRESHOLD`], or when the pool has a single thread. Handing the work to a lone
/// pool thread gains nothing and costs its wake-up: measured at 5-8 ns per point for 1e5
/// Z-factors called after a pause, a quarter of the computation.
fn serial(total: usize) -> bool {
    total < PARALLEL_THRESHOLD || rayon::current_num_threads() == 1
}

/// Elements handed at once to the kernel of [`lift_batched`].
///
/// # Examples
/// ```
/// assert_eq!(stocktank::array::BATCH, 8);
/// ```
pub const BATCH: usize = 8;

/// As [`lift`], but a fast kernel receives [`BATCH`] elements at a time, so that it can run
/// independent iterations side by side (instruction-level parallelism, SIMD lanes), and a
/// scalar kernel (the reference) takes every element the fast one leaves. Same
/// broadcasting, NaN, error-index, raise/coerce and parallel rules as [`lift`].
///
/// `batch(xs, ys)` gets the gathered inputs `xs` (`xs[i][l]`: input `i` of lane `l`), writes
/// values into `ys` and returns, per element, whether its value is final; for the others (points off its fast path, invalid
/// inputs) `scalar` is called, and its result or error is used. A final value must be
/// exactly what `scalar` would return. In the last batch of a chunk the unused slots are
/// filled with copies of the batch's first element and their results are discarded.
/// Elements with a NaN input give NaN (the kernels must still not panic on them).
///
/// # Errors
/// As [`lift`].
///
/// # Examples
/// ```
/// use ndarray::arr1;
/// use stocktank::array::{lift_batched, OnError, BATCH};
/// use stocktank::error::positive;
/// let x = arr1(&[1.0, 2.0, -3.0]).into_dyn();
/// // Fast path for positive inputs; the scalar kernel reports the error.
/// let batch = |[x]: &[[f64; BATCH]; 1], ys: &mut [f64; BATCH]| -> [bool; BATCH] {
///     std::array::from_fn(|l| {
///         ys[l] = 2.0 * x[l];
///         x[l] > 0.0
///     })
/// };
/// let scalar = |[x]: [f64; 1]| positive("x", x).map(|v| 2.0 * v);
/// let out = lift_batched(["x"], [x.view()], OnError::Coerce, batch, scalar).unwrap();
/// assert_eq!(out[1], 4.0);
/// assert!(out[2].is_nan());
/// assert!(lift_batched(["x"], [x.view()], OnError::Raise, batch, scalar).is_err());
/// ```
pub fn lift_batched<const N: usize, B, S>(
    names: [&'static str; N],
    inputs: [ArrayViewD<'_, f64>; N],
    on_error: OnError,
    batch: B,
    scalar: S,
) -> Result<ArrayD<f64>>
where
    B: Fn(&[[f64; BATCH]; N], &mut [f64; BATCH]) -> [bool; BATCH] + Sync,
    S: Fn([f64; N]) -> Result<f64> + Sync,
{
    let shapes: [&[usize]; N] = inputs.each_ref().map(|v| v.shape());
    let shape = broadcast_shape(&names, &shapes)?;
    let total: usize = shape.iter().product();
    let sources: [Source<'_>; N] = inputs.each_ref().map(|v| source(v, &shape));
    // The multi-index is only read by strided (broadcast) sources; an error recomputes it.
    let strided = sources.iter().any(|s| matches!(s, Source::Strided(..)));
    let mut out = crate::pages::zeroed(total);

    // Lanes `k0..k0 + m` of `chunk` from a batch result: lanes the batch kernel finished
    // (and whose inputs are not NaN) as they are, NaN for a NaN input, the rest from the
    // scalar kernel (which reports the error).
    let finish = |chunk: &mut [f64],
                  flat: usize,
                  k0: usize,
                  m: usize,
                  xs: &[[f64; BATCH]; N],
                  ys: &[f64; BATCH],
                  done: &[bool; BATCH]|
     -> Option<(Vec<usize>, Error)> {
        for j in 0..m {
            let x: [f64; N] = std::array::from_fn(|i| xs[i][j]);
            chunk[k0 + j] = if x.iter().any(|v| v.is_nan()) {
                f64::NAN
            } else if done[j] {
                ys[j]
            } else {
                match scalar(x) {
                    Ok(v) => v,
                    Err(e) => match on_error {
                        OnError::Coerce => f64::NAN,
                        OnError::Raise => {
                            let mut at = vec![0usize; shape.len()];
                            unravel(flat + j, &shape, &mut at);
                            return Some((at, e));
                        }
                    },
                }
            };
        }
        None
    };
    // Whether every lane is final and no input NaN: the common case.
    let clean = |xs: &[[f64; BATCH]; N], done: &[bool; BATCH]| {
        let mut clean = true;
        for l in 0..BATCH {
            clean &= done[l] & xs.iter().all(|x| !x[l].is_nan());
        }
        clean
    };

    let run = |start: usize, chunk: &mut [f64]| -> Option<(Vec<usize>, Error)> {
        let len = chunk.len();
        let mut k0 = 0;
        // Contiguous (or single-value) inputs, whole batches: fixed-size copies only. A loop
        // of its own, because in one loop with the partial batch below the compiler merges
        // the two copies into one memcpy call of variable length (measured: 4 % of the
        // Z-factor time).
        if !strided {
            while k0 + BATCH <= len {
                let flat = start + k0;
                let xs: [[f64; BATCH]; N] = std::array::from_fn(|i| match &sources[i] {
                    Source::Direct(d) => {
                        let mut x = [0.0; BATCH];
                        x.copy_from_slice(&d[flat..flat + BATCH]);
                        x
                    }
                    src => [src.get(flat, &[]); BATCH],
                });
                let mut ys = [0.0; BATCH];
                let done = batch(&xs, &mut ys);
                if clean(&xs, &done) {
                    chunk[k0..k0 + BATCH].copy_from_slice(&ys);
                } else if let Some(e) = finish(chunk, flat, k0, BATCH, &xs, &ys, &done) {
                    return Some(e);
                }
                k0 += BATCH;
            }
        }
        // Broadcast inputs, and the last, partial batch.
        let mut multi = vec![0usize; shape.len()];
        unravel(start + k0, &shape, &mut multi);
        while k0 < len {
            let m = BATCH.min(len - k0);
            // Lanes per input (structure of arrays).
            let flat = start + k0;
            let mut xs = [[0.0; BATCH]; N];
            for j in 0..m {
                for (x, src) in xs.iter_mut().zip(&sources) {
                    x[j] = src.get(flat + j, &multi);
                }
                if strided {
                    advance(&mut multi, &shape);
                }
            }
            for x in xs.iter_mut() {
                let first = x[0];
                x[m..].fill(first);
            }
            let mut ys = [0.0; BATCH];
            let done = batch(&xs, &mut ys);
            if m == BATCH && clean(&xs, &done) {
                chunk[k0..k0 + BATCH].copy_from_slice(&ys);
            } else if let Some(e) = finish(chunk, flat, k0, m, &xs, &ys, &done) {
                return Some(e);
            }
            k0 += m;
        }
        None
    };

    let first_error = if serial(total) {
        run(0, &mut out)
    } else {
        out.par_chunks_mut(CHUNK)
            .enumerate()
            .map(|(c, chunk)| run(c * CHUNK, chunk))
            .find_first(|r| r.is_some())
            .flatten()
    };
    if let Some((multi, e)) = first_error {
        return Err(locate(e, &names, &shapes, &shape, &multi));
    }
    // The output length is the product of `shape` by construction, so this cannot fail.
    Ok(ArrayD::from_shape_vec(IxDyn(&shape), out).expect("len == shape product"))
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::error::positive;
    use ndarray::{Array, arr0, arr1, arr2};

    fn double_positive([x]: [f64; 1]) -> Result<f64> {
        Ok(2.0 * positive("x", x)?)
    }

    #[test]
    fn scalar_and_array_agree() {
        let xs = arr1(&[1.0, 2.0, 3.0]).into_dyn();
        let out = lift(["x"], [xs.view()], OnError::Raise, double_positive).unwrap();
        for (i, &x) in xs.iter().enumerate() {
            let s = arr0(x).into_dyn();
            let one = lift(["x"], [s.view()], OnError::Raise, double_positive).unwrap();
            assert_eq!(one.shape(), &[] as &[usize]);
            assert_eq!(one[[]], out[i]);
        }
    }

    #[test]
    fn error_reports_own_index_of_broadcast_argument() {
        let p = arr2(&[[1.0], [-2.0]]).into_dyn();
        let t = arr1(&[1.0, 2.0, 3.0]).into_dyn();
        let err = lift(
            ["p", "t"],
            [p.view(), t.view()],
            OnError::Raise,
            |[p, t]| Ok(positive("p", p)? + t),
        )
        .unwrap_err();
        assert_eq!(
            err,
            Error::invalid("p", -2.0, "must be finite and > 0").at_index(&[1, 0])
        );
    }

    #[test]
    fn error_naming_a_scalar_argument_reports_the_output_index() {
        // `rs` is one number, `rsi` an array: the error names `rs` (the rule it breaks is
        // rs <= rsi) and must still say which element of the call failed.
        let rs = arr0(400.0).into_dyn();
        let rsi = arr1(&[600.0, 500.0, 300.0]).into_dyn();
        let err = lift(
            ["rs", "rsi"],
            [rs.view(), rsi.view()],
            OnError::Raise,
            |[rs, rsi]| {
                if rs > rsi {
                    Err(Error::invalid("rs", rs, "must not exceed rsi"))
                } else {
                    Ok(rsi - rs)
                }
            },
        )
        .unwrap_err();
        assert_eq!(
            err,
            Error::invalid("rs", 400.0, "must not exceed rsi").at_index(&[2])
        );
    }

    #[test]
    fn coerce_writes_nan_and_nan_propagates() {
        let x = arr1(&[1.0, -1.0, f64::NAN]).into_dyn();
        let out = lift(["x"], [x.view()], OnError::Coerce, double_positive).unwrap();
        assert_eq!(out[0], 2.0);
        assert!(out[1].is_nan() && out[2].is_nan());
    }

    #[test]
    fn parallel_path_matches_and_finds_first_error() {
        let n = 3 * PARALLEL_THRESHOLD + 17;
        let mut x = Array::linspace(1.0, 2.0, n).into_dyn();
        let out = lift(["x"], [x.view()], OnError::Raise, double_positive).unwrap();
        assert!(out.iter().zip(x.iter()).all(|(o, x)| *o == 2.0 * x));
        x[[n - 5]] = -1.0;
        x[[n - 2]] = -2.0;
        let err = lift(["x"], [x.view()], OnError::Raise, double_positive).unwrap_err();
        assert_eq!(
            err,
            Error::invalid("x", -1.0, "must be finite and > 0").at_index(&[n - 5])
        );
    }

    #[test]
    fn non_contiguous_and_broadcast_inputs() {
        let a = arr2(&[[1.0, 2.0], [3.0, 4.0]]).into_dyn();
        let at = a.t();
        let b = arr1(&[10.0, 20.0]).into_dyn();
        let out = lift(
            ["a", "b"],
            [at.view(), b.view()],
            OnError::Raise,
            |[a, b]| Ok(a + b),
        )
        .unwrap();
        assert_eq!(out, arr2(&[[11.0, 23.0], [12.0, 24.0]]).into_dyn());
    }

    #[test]
    fn batched_matches_lift() {
        // Fast path only for a > 1.5, so that both the batch and the scalar kernel are used.
        let batch = |[a, b]: &[[f64; BATCH]; 2], ys: &mut [f64; BATCH]| -> [bool; BATCH] {
            std::array::from_fn(|l| {
                ys[l] = a[l] * b[l];
                a[l] > 1.5
            })
        };
        let scalar = |[a, b]: [f64; 2]| Ok(positive("a", a)? * b);
        for n in [0, 1, 7, 8, 9, 100, 3 * PARALLEL_THRESHOLD + 5] {
            let a = Array::linspace(1.0, 2.0, n)
                .into_shape_with_order((n, 1))
                .unwrap()
                .into_dyn();
            let b = arr1(&[1.0, f64::NAN, 3.0]).into_dyn();
            let f = |[a, b]: [f64; 2]| Ok(positive("a", a)? * b);
            let x = lift(["a", "b"], [a.view(), b.view()], OnError::Raise, f).unwrap();
            let y = lift_batched(
                ["a", "b"],
                [a.view(), b.view()],
                OnError::Raise,
                batch,
                scalar,
            )
            .unwrap();
            assert_eq!(x.shape(), y.shape());
            assert!(
                x.iter()
                    .zip(y.iter())
                    .all(|(p, q)| p == q || (p.is_nan() && q.is_nan()))
            );
        }
        let mut a = Array::linspace(1.0, 2.0, 3 * PARALLEL_THRESHOLD).into_dyn();
        a[[PARALLEL_THRESHOLD + 3]] = -1.0;
        let one = arr1(&[1.0]).into_dyn();
        let err = lift_batched(
            ["a", "b"],
            [a.view(), one.view()],
            OnError::Raise,
            batch,
            scalar,
        )
        .unwrap_err();
        assert_eq!(
            err,
            Error::invalid("a", -1.0, "must be finite and > 0").at_index(&[PARALLEL_THRESHOLD + 3])
        );
        let out = lift_batched(
            ["a", "b"],
            [a.view(), one.view()],
            OnError::Coerce,
            batch,
            scalar,
        )
        .unwrap();
        assert!(out[[PARALLEL_THRESHOLD + 3]].is_nan());
    }

    #[test]
    fn incompatible_shapes_name_both_arguments() {
        let a = arr1(&[1.0, 2.0]).into_dyn();
        let b = arr1(&[1.0, 2.0, 3.0]).into_dyn();
        let err = lift(
            ["a", "b"],
            [a.view(), b.view()],
            OnError::Raise,
            |[a, b]| Ok(a + b),
        )
        .unwrap_err();
        let msg = err.to_string();
        assert!(msg.contains("`a`") && msg.contains("`b`"), "{msg}");
    }
}
