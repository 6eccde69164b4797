//! Natural-gas properties in field units: pseudo-critical properties, Z-factor, Bg and Eg,
//! density, isothermal compressibility, viscosity and real-gas pseudo-pressure, plus the
//! recombination of wet gas / gas condensate.
//!
//! Scalar kernels (`fn(f64, ...) -> Result<f64>`) are the only implementation of each
//! quantity; the `*_array` functions and [`Gas::property_array`] lift them over numpy-style
//! broadcast arrays with [`crate::array::lift`].
//!
//! Units: pressure psia, temperature degF (degR where named `_r`), Bg rcf/scf or rb/Mscf,
//! density lbm/ft3, viscosity cp, compressibility 1/psi, pseudo-pressure psia^2/cp.
//!
//! These are screening estimates from published correlations; defer to measured
//! laboratory PVT data.

mod arrays;
mod condensate;
mod description;
mod properties;
mod pseudo_critical;
mod pseudo_pressure;
mod viscosity;
mod zfactor;

pub use arrays::{
    bg_array, cpr_array, gas_density_array, kay_array, pseudo_critical_array,
    recombined_gas_sg_array, viscosity_lee_gonzalez_eakin_array, wichert_aziz_array,
    z_factor_array, z_factor_in_range_array,
};
pub use condensate::{
    api_to_sg, condensate_molar_mass_cragoe, gas_equivalent, molar_volume_scf, recombined_gas_sg,
    sg_to_api,
};
pub use description::{Gas, GasProperty, ImpurityCorrection, PseudoCriticalSource};
pub use properties::{bg, cg_from_cpr, gas_density, molar_mass, rcf_per_scf_to_rb_per_mscf};
pub use pseudo_critical::{
    COMPONENTS, COMPOSITION_NAMES, Component, GravityCorrelation, KayResult, PseudoCritical,
    carr_kobayashi_burrows_correction, check_impurities, hydrocarbon_mixing, kay, riazi_daubert,
    standing_condensate, standing_natural, sutton, wichert_aziz,
};
pub use pseudo_pressure::PSEUDO_PRESSURE_STEP_PSIA;
pub use viscosity::{
    ViscosityMethod, dempsey_in_range, lee_gonzalez_eakin_in_range, viscosity_lee_gonzalez_eakin,
    viscosity_one_atm_carr, viscosity_ratio_dempsey,
};
pub use zfactor::{
    MAX_ITERATIONS, MONOTONE_TPR, Termination, Z_TOLERANCE, ZMethod, ZSolution, dak_solve,
    hall_yarborough_solve, z_dak, z_dak_batch, z_hall_yarborough, z_papay,
};
