//! # stocktank
//!
//! Reservoir-engineering screening calculations on whole arrays: fluid properties (PVT) of
//! gas, oil and water; in-place volumes with uncertainty; material balance; production
//! decline. Field units by default (psia, degF, scf, STB, rb, cp); see [`units`] for the
//! exact constants and standard conditions.
//!
//! Every quantity has one scalar kernel (`fn(f64, ...) -> Result<f64>`), the only
//! implementation of it. Array versions broadcast like numpy through [`array::lift`],
//! run in parallel above a size threshold, return NaN for NaN inputs and either raise on
//! or coerce (to NaN) physically impossible elements.
//!
//! The results are screening estimates. Defer to measured laboratory PVT data, licensed
//! engineers, and the regulations and reserves-reporting rules that apply to you.
#![deny(missing_docs)]
#![deny(unsafe_code)]

pub mod array;
pub mod error;
pub mod fastmath;
pub mod units;

pub mod decline;
pub mod gas;
pub mod material_balance;
pub mod oil;
pub mod relperm;
pub mod volumetrics;
pub mod water;

mod pages;
mod simd;
#[cfg(test)]
mod testing;

pub use error::{Error, Result};

#[cfg(feature = "python")]
mod python;

/// The README's Rust examples, compiled and run as doctests.
#[cfg(doctest)]
#[doc = include_str!("../README.md")]
pub struct ReadmeDoctests;
