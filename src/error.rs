//! The one error type of the crate.
//!
//! Every variant carries the data a user needs to find the offending input: the
//! argument's name, the value and, for arrays, the index of the element. The Python
//! layer maps each variant to its own exception class (all subclasses of
//! `ValueError`).

use std::fmt;

/// Result alias used throughout the crate.
pub type Result<T, E = Error> = std::result::Result<T, E>;

/// A multi-dimensional element index, as given by the user's array.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Index(pub Box<[usize]>);

impl fmt::Display for Index {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        if self.0.len() == 1 {
            write!(f, "{}", self.0[0])
        } else {
            write!(f, "(")?;
            for (k, i) in self.0.iter().enumerate() {
                if k > 0 {
                    write!(f, ", ")?;
                }
                write!(f, "{i}")?;
            }
            write!(f, ")")
        }
    }
}

/// A value for a message: as `{}` prints it, but in exponent form where that would run to
/// more than about 16 digits (`1e300`, not three hundred of them; `5e-324`, not 0.000...).
fn number(v: f64) -> String {
    let a = v.abs();
    if a != 0.0 && a.is_finite() && !(1e-5..1e16).contains(&a) {
        format!("{v:e}")
    } else {
        format!("{v}")
    }
}

fn at(index: &Option<Index>) -> String {
    match index {
        Some(i) => format!(" at index {i}"),
        None => String::new(),
    }
}

/// Everything that can go wrong in stocktank.
#[non_exhaustive]
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum Error {
    /// A physically impossible or otherwise invalid numeric input.
    #[error("invalid `{arg}` = {}{}: {reason}", number(*value), at(index))]
    InvalidArgument {
        /// Name of the argument as the user passed it (e.g. `"p"`, `"gas_sg"`).
        arg: &'static str,
        /// The offending value.
        value: f64,
        /// Why it is invalid (e.g. `"must be > 0 psia"`).
        reason: &'static str,
        /// Element index in the argument's own array, when the input was an array.
        index: Option<Index>,
    },
    /// Inputs whose shapes cannot be broadcast together, or have the wrong length.
    #[error("shape error: {0}")]
    Shape(String),
    /// An option (method name, policy, ...) that is not one of the allowed choices.
    #[error("invalid `{arg}` = {value:?}; expected one of: {allowed}")]
    InvalidOption {
        /// Name of the option.
        arg: &'static str,
        /// What was given.
        value: String,
        /// The allowed values, comma separated.
        allowed: &'static str,
    },
    /// A row of a table or history (a record) that breaks a rule, e.g. unsorted times.
    #[error("invalid `{arg}` at row {row}: {message}")]
    InvalidRecord {
        /// Name of the column or table.
        arg: String,
        /// Zero-based row.
        row: usize,
        /// What is wrong.
        message: String,
    },
    /// An iterative solver stopped without meeting its tolerance.
    #[error("{method} did not converge: {detail}")]
    NoConvergence {
        /// The method or solver.
        method: &'static str,
        /// What happened (iterations used, last residual, bracket state).
        detail: String,
    },
    /// A fit or linear system without a unique solution (e.g. all points at one pressure).
    #[error("singular problem in {what}: {detail}")]
    Singular {
        /// What was being solved.
        what: &'static str,
        /// Why it is singular.
        detail: String,
    },
    /// A request outside what the data supports (e.g. a pressure outside a PVT table).
    #[error("out of range: {0}")]
    OutOfRange(String),
}

impl Error {
    /// Shorthand for [`Error::InvalidArgument`] without an index.
    #[inline]
    pub fn invalid(arg: &'static str, value: f64, reason: &'static str) -> Self {
        Error::InvalidArgument {
            arg,
            value,
            reason,
            index: None,
        }
    }

    /// Attach an element index to an [`Error::InvalidArgument`]; other variants pass through.
    pub fn at_index(self, idx: &[usize]) -> Self {
        match self {
            Error::InvalidArgument {
                arg, value, reason, ..
            } => Error::InvalidArgument {
                arg,
                value,
                reason,
                index: Some(Index(idx.into())),
            },
            other => other,
        }
    }
}

/// Check `value > 0` (NaN fails), else an [`Error::InvalidArgument`] naming `arg`.
///
/// # Examples
/// ```
/// assert!(stocktank::error::positive("p", 14.7).is_ok());
/// assert!(stocktank::error::positive("p", 0.0).is_err());
/// ```
#[inline]
pub fn positive(arg: &'static str, value: f64) -> Result<f64> {
    if value > 0.0 && value.is_finite() {
        Ok(value)
    } else {
        Err(Error::invalid(arg, value, "must be finite and > 0"))
    }
}

/// Check `value >= 0` and finite, else an [`Error::InvalidArgument`] naming `arg`.
///
/// # Examples
/// ```
/// assert!(stocktank::error::non_negative("gor", 0.0).is_ok());
/// assert!(stocktank::error::non_negative("gor", -1.0).is_err());
/// ```
#[inline]
pub fn non_negative(arg: &'static str, value: f64) -> Result<f64> {
    if value >= 0.0 && value.is_finite() {
        Ok(value)
    } else {
        Err(Error::invalid(arg, value, "must be finite and >= 0"))
    }
}

/// Check `0 <= value <= 1`, else an [`Error::InvalidArgument`] naming `arg`.
///
/// # Examples
/// ```
/// assert!(stocktank::error::fraction("porosity", 0.2).is_ok());
/// assert!(stocktank::error::fraction("porosity", 1.2).is_err());
/// ```
#[inline]
pub fn fraction(arg: &'static str, value: f64) -> Result<f64> {
    if (0.0..=1.0).contains(&value) {
        Ok(value)
    } else {
        Err(Error::invalid(arg, value, "must lie in [0, 1]"))
    }
}

/// Check that a temperature in degF lies above absolute zero (-459.67 degF).
///
/// # Examples
/// ```
/// assert!(stocktank::error::temperature_f("t", 60.0).is_ok());
/// assert!(stocktank::error::temperature_f("t", -500.0).is_err());
/// ```
#[inline]
pub fn temperature_f(arg: &'static str, value: f64) -> Result<f64> {
    if value > -crate::units::RANKINE_OFFSET && value.is_finite() {
        Ok(value)
    } else {
        Err(Error::invalid(
            arg,
            value,
            "must be above absolute zero (-459.67 degF)",
        ))
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn message_names_argument_value_and_index() {
        let e = Error::invalid("p", -3.0, "must be > 0").at_index(&[2, 5]);
        assert_eq!(
            e.to_string(),
            "invalid `p` = -3 at index (2, 5): must be > 0"
        );
        let e = Error::invalid("p", -3.0, "must be > 0").at_index(&[7]);
        assert_eq!(e.to_string(), "invalid `p` = -3 at index 7: must be > 0");
    }

    #[test]
    fn extreme_values_print_in_exponent_form() {
        // Display of 1e300 is 301 digits; messages keep them short.
        let e = Error::invalid("step_days", 1e-300, "must be > 0");
        assert_eq!(e.to_string(), "invalid `step_days` = 1e-300: must be > 0");
        let e = Error::invalid("p", -1e300, "must be > 0");
        assert_eq!(e.to_string(), "invalid `p` = -1e300: must be > 0");
        let e = Error::invalid("p", 0.25, "must be > 0");
        assert_eq!(e.to_string(), "invalid `p` = 0.25: must be > 0");
        let e = Error::invalid("p", f64::NAN, "must be > 0");
        assert_eq!(e.to_string(), "invalid `p` = NaN: must be > 0");
    }

    #[test]
    fn error_is_send_sync() {
        fn assert_send_sync<T: Send + Sync>() {}
        assert_send_sync::<Error>();
    }
}
