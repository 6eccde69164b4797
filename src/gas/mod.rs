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
//!
//! # Accuracy (measured against GERG-2008)
//! Z against CoolProp 8.0 (HEOS backend, GERG-2008 mixing over reference pure-fluid
//! equations) for seven gases at 100-300 degF and 500-10,000 psia (45 points each; the
//! table and its generator are in `tests/python/data/`). Deviation of Z in percent,
//! mean absolute / maximum absolute, DAK (Hall–Yarborough within 0.1 of these):
//!
//! ```text
//! gas (gravity)             Kay pseudo-criticals   Sutton + impurity mixing + WA
//! methane (0.55)            0.82 / 1.67            0.91 / 1.49
//! lean (0.58)               0.80 / 1.67            0.54 / 1.25
//! typical (0.67)            0.65 / 1.70            0.65 / 3.17
//! rich, 5 % C4+ (0.79)      0.48 / 2.11            1.86 / 9.61
//! 15 % CO2 (0.75)           0.65 / 1.68            0.53 / 2.39
//! sour, 8 % H2S (0.70)      0.81 / 1.98            0.86 / 3.36
//! 12 % N2 (0.64)            1.00 / 1.94            0.70 / 1.44
//! ```
//! Gravity-based pseudo-criticals are weakest for the rich gas near Tpr 1.3 (up to
//! 9.6 %); prefer a composition (Kay) when one is available. DAK and Hall–Yarborough
//! agree to 0.3 % on average over the Standing–Katz chart range (at most 1.6 % for
//! Tpr >= 1.2, 5.6 % for Tpr >= 1.1, 11 % at Tpr 1.05 around the Z minimum).
//! Lee–Gonzalez–Eakin viscosity at the reference density against CoolProp, up to 8000
//! psia: methane 3.0 % mean / 8.9 % max; lean 3.2 / 10.3; sour 1.6 / 8.1; 12 % N2
//! 2.6 / 4.8; typical 4.6 / 14.5; 15 % CO2 5.3 / 13.2; rich 10.6 / 27.5 (CoolProp's
//! mixture viscosity model is itself uncertain for rich dense gas).

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
pub(crate) use properties::GasIsothermVolumetrics;
pub use properties::{bg, cg_from_cpr, gas_density, molar_mass, rcf_per_scf_to_rb_per_mscf};
pub use pseudo_critical::{
    COMPONENTS, COMPOSITION_NAMES, Component, GravityCorrelation, KayResult, PseudoCritical,
    carr_kobayashi_burrows_correction, check_impurities, hydrocarbon_mixing, kay, riazi_daubert,
    standing_condensate, standing_natural, sutton, wichert_aziz,
};
pub use pseudo_pressure::{PSEUDO_PRESSURE_MAX_PIECES, PSEUDO_PRESSURE_STEP_PSIA};
pub(crate) use viscosity::LeeGonzalezEakin;
pub use viscosity::{
    ViscosityMethod, dempsey_in_range, lee_gonzalez_eakin_in_range, viscosity_lee_gonzalez_eakin,
    viscosity_one_atm_carr, viscosity_ratio_dempsey,
};
pub use zfactor::{
    MAX_ITERATIONS, MONOTONE_TPR, Termination, Z_TOLERANCE, ZMethod, ZSolution, dak_solve,
    hall_yarborough_solve, z_dak, z_dak_batch, z_hall_yarborough, z_papay,
};
