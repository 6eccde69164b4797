//! In-place volumes (deterministic and probabilistic), recovery factors and displacement
//! efficiency. Field units: acres, ft, fractions, rb/STB, rcf/scf, STB, scf, psia, cp.
//!
//! - [`inplace`]: oil and gas in place from area and thickness, from a gross rock volume or
//!   per layer, dissolved gas and the gas-cap ratio.
//! - [`distribution`] and [`montecarlo`]: input distributions and Monte Carlo volumes with
//!   Iman–Conover rank correlation, P90/P50/P10 (**P90 is the LOW value**, exceeded with 90%
//!   probability) and a tornado table.
//! - [`recovery`]: recovery factor arithmetic, Arps et al. (1967) correlations, p/z gas
//!   recovery.
//! - [`displacement`]: Buckley–Leverett (1942) fractional flow with the Welge (1952) tangent.
//!
//! Results are screening estimates for early decisions; they do not replace a reserves
//! evaluation under the rules that apply to you.

pub mod displacement;
pub mod distribution;
pub mod inplace;
pub mod montecarlo;
pub mod recovery;

pub use displacement::{
    DisplacementState, FractionalFlow, WelgeFront, darcy_constant_field, gravity_number,
};
pub use distribution::{Distribution, norm_cdf, norm_ppf};
pub use inplace::{
    Fluid, Layer, dissolved_gas_in_place, gas_cap_ratio, in_place_layers, ogip,
    ogip_from_rock_volume, ooip, ooip_from_rock_volume,
};
pub use montecarlo::{
    Correlation, InPlaceSimulation, Input, Summary, TornadoRow, VolumetricInputs, iman_conover,
    percentiles, probabilistic_in_place, spearman, summarize,
};
pub use recovery::{
    arps_solution_gas_drive, arps_solution_gas_validity, arps_water_drive,
    arps_water_drive_validity, gas_recovery_factor_pz, recoverable, recovery_factor,
    remaining_recoverable,
};
