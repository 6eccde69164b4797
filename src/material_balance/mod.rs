//! Material balance of oil and gas reservoirs, aquifer influx models, drive indices and
//! the solution-gas-drive forecast. Field units: psia, days, STB, scf, rb; Bg in rb/scf.
//!
//! - [`PvtTable`]: the PVT input (plain arrays, monotone-cubic interpolation).
//! - [`OilHistory`], [`oil_mbe_terms`], [`havlena_odeh_fit`]: the oil material-balance
//!   equation in the Havlena–Odeh form and its straight lines with fit reports.
//! - [`campbell_plot`], [`drive_indices`], [`classify_drive`]: diagnostics.
//! - [`history_match`], [`history_match_batch`]: nonlinear least squares of N, m and aquifer
//!   parameters with confidence intervals.
//! - [`Aquifer`], [`AquiferModel`]: pot, Schilthuis, Fetkovich, van Everdingen–Hurst and
//!   Carter–Tracy influx.
//! - [`pz_fit`], [`pz_fit_abnormal`], [`gas_water_drive_fit`], [`cole_plot`]: gas balances.
//! - [`gas_history_match`]: nonlinear least squares of G and the aquifer parameters.
//! - [`muskat_forecast`], [`tarner_forecast`]: solution-gas-drive forecasts below the
//!   bubble point.
//!
//! All results are screening estimates: they feed reserves and investment decisions only
//! after review by a qualified engineer against measured data.

mod aquifer;
mod diagnostics;
mod fit;
mod forecast;
mod gas;
mod gas_match;
mod history;
mod history_match;
mod laplace;
mod oil;
mod pvt;

pub use aquifer::{
    Aquifer, AquiferModel, DARCY_FIELD, TD_FIELD, fetkovich_aquifer, fetkovich_j_linear,
    fetkovich_j_radial, veh_constants, veh_dimensionless_influx, veh_dimensionless_pressure,
};
pub use diagnostics::{
    DriveClassification, DriveIndices, campbell_plot, classify_drive, drive_indices,
};
pub use fit::{LineFit, fit_line, t_critical};
pub use forecast::{
    MuskatForecast, SolutionGasForecast, TARNER_TOLERANCE, TarnerForecast, muskat_forecast,
    tarner_forecast,
};
pub use gas::{GasFit, cole_plot, gas_bg, gas_water_drive_fit, pz_fit, pz_fit_abnormal};
pub use gas_match::{
    GasHistory, GasHistoryMatch, GasMatchOptions, GasPvtTable, GasReservoir, gas_history_match,
};
pub use history::OilHistory;
pub use history_match::{
    CONDITION_WARNING, CORRELATION_WARNING, HistoryMatch, HistoryMatchInput, HistoryMatchOptions,
    LmStatus, MatchParameter, MatchReport, Objective, history_match, history_match_batch,
};
pub use laplace::{STEHFEST_TERMS, stehfest_invert, stehfest_weights};
pub use oil::{
    HavlenaOdehCase, HavlenaOdehFit, MbeTerms, OilReservoir, havlena_odeh_fit, oil_mbe_terms,
};
pub use pvt::{PvtPoint, PvtTable};
