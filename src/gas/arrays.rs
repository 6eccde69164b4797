//! Array versions of the gas kernels: each is the scalar kernel lifted by
//! [`crate::array::lift`] / [`crate::array::lift_multi`] (numpy broadcasting, NaN in gives
//! NaN out, errors raised with the element's index or coerced to NaN, parallel above a
//! size threshold).

use super::condensate::recombined_gas_sg;
use super::properties::{bg, gas_density};
use super::pseudo_critical::{GravityCorrelation, PseudoCritical, kay, wichert_aziz};
use super::viscosity::viscosity_lee_gonzalez_eakin;
use super::zfactor::ZMethod;
use crate::array::{OnError, lift, lift_batched, lift_multi};
use crate::error::Result;
use crate::units::StandardConditions;
use ndarray::{ArrayD, ArrayViewD};

/// Z-factor on arrays of pseudo-reduced pressure and temperature.
///
/// # Arguments
/// * `ppr`, `tpr` - pseudo-reduced pressure and temperature (broadcast together), > 0.
/// * `method` - the Z-factor method.
/// * `on_error` - raise or coerce to NaN on bad elements.
///
/// # Returns
/// Z, dimensionless, in the broadcast shape.
///
/// # Errors
/// [`crate::Error::Shape`]; with [`OnError::Raise`], the first bad element's error.
///
/// # Examples
/// ```
/// use ndarray::arr1;
/// use stocktank::array::OnError;
/// use stocktank::gas::{z_factor_array, ZMethod};
/// let ppr = arr1(&[1.0, 2.0, 3.0]).into_dyn();
/// let tpr = arr1(&[1.5]).into_dyn();
/// let z = z_factor_array(ppr.view(), tpr.view(), ZMethod::DranchukAbouKassem, OnError::Raise).unwrap();
/// assert_eq!(z.shape(), &[3]);
/// ```
pub fn z_factor_array(
    ppr: ArrayViewD<'_, f64>,
    tpr: ArrayViewD<'_, f64>,
    method: ZMethod,
    on_error: OnError,
) -> Result<ArrayD<f64>> {
    match method {
        // Several Newton solves side by side; identical results to the scalar kernel.
        ZMethod::DranchukAbouKassem => lift_batched(
            ["ppr", "tpr"],
            [ppr, tpr],
            on_error,
            super::zfactor::z_dak_batch,
            |[p, t]| super::zfactor::z_dak(p, t),
        ),
        _ => lift(["ppr", "tpr"], [ppr, tpr], on_error, |[p, t]| {
            method.z(p, t)
        }),
    }
}

/// Pseudo-reduced compressibility cpr = cg Ppc on arrays (analytic derivative of the EOS).
///
/// # Errors
/// As [`z_factor_array`].
///
/// # Examples
/// ```
/// use ndarray::arr0;
/// use stocktank::array::OnError;
/// use stocktank::gas::{cpr_array, ZMethod};
/// let c = cpr_array(arr0(0.01).into_dyn().view(), arr0(2.0).into_dyn().view(), ZMethod::DranchukAbouKassem, OnError::Raise).unwrap();
/// assert!((c[[]] * 0.01 - 1.0).abs() < 0.01);
/// ```
pub fn cpr_array(
    ppr: ArrayViewD<'_, f64>,
    tpr: ArrayViewD<'_, f64>,
    method: ZMethod,
    on_error: OnError,
) -> Result<ArrayD<f64>> {
    lift(["ppr", "tpr"], [ppr, tpr], on_error, |[p, t]| {
        Ok(method.z_cpr(p, t)?.1)
    })
}

/// Per element, whether (Ppr, Tpr) lie in the method's published range (NaN gives false).
///
/// # Errors
/// [`crate::Error::Shape`].
///
/// # Examples
/// ```
/// use ndarray::arr1;
/// use stocktank::gas::{z_factor_in_range_array, ZMethod};
/// let ppr = arr1(&[1.0, 40.0]).into_dyn();
/// let tpr = arr1(&[1.5]).into_dyn();
/// let ok = z_factor_in_range_array(ppr.view(), tpr.view(), ZMethod::DranchukAbouKassem).unwrap();
/// assert_eq!(ok.as_slice().unwrap(), &[true, false]);
/// ```
pub fn z_factor_in_range_array(
    ppr: ArrayViewD<'_, f64>,
    tpr: ArrayViewD<'_, f64>,
    method: ZMethod,
) -> Result<ArrayD<bool>> {
    let f = lift(["ppr", "tpr"], [ppr, tpr], OnError::Raise, |[p, t]| {
        Ok(if method.in_range(p, t) { 1.0 } else { 0.0 })
    })?;
    Ok(f.mapv(|v| v == 1.0))
}

/// Pseudo-critical temperature (degR) and pressure (psia) from gas gravity, on arrays.
///
/// # Errors
/// As [`z_factor_array`] (argument `gas_sg`).
///
/// # Examples
/// ```
/// use ndarray::arr1;
/// use stocktank::array::OnError;
/// use stocktank::gas::{pseudo_critical_array, GravityCorrelation};
/// let g = arr1(&[0.6, 0.8]).into_dyn();
/// let [tpc, ppc] = pseudo_critical_array(g.view(), GravityCorrelation::Sutton, OnError::Raise).unwrap();
/// assert!(tpc[1] > tpc[0] && ppc[1] < ppc[0]);
/// ```
pub fn pseudo_critical_array(
    gas_sg: ArrayViewD<'_, f64>,
    correlation: GravityCorrelation,
    on_error: OnError,
) -> Result<[ArrayD<f64>; 2]> {
    lift_multi(["gas_sg"], [gas_sg], on_error, |[g]| {
        let pc = correlation.eval(g)?;
        Ok([pc.tpc_r, pc.ppc_psia])
    })
}

/// Wichert–Aziz (1972) correction on arrays: (Tpc degR, Ppc psia, y_CO2, y_H2S) ->
/// corrected (Tpc, Ppc).
///
/// # Errors
/// As [`z_factor_array`].
///
/// # Examples
/// ```
/// use ndarray::arr0;
/// use stocktank::array::OnError;
/// let v = |x: f64| arr0(x).into_dyn();
/// let [t, _p] = stocktank::gas::wichert_aziz_array(v(400.0).view(), v(700.0).view(), v(0.1).view(), v(0.0).view(), OnError::Raise).unwrap();
/// assert!(t[[]] < 400.0);
/// ```
pub fn wichert_aziz_array(
    tpc_r: ArrayViewD<'_, f64>,
    ppc_psia: ArrayViewD<'_, f64>,
    co2: ArrayViewD<'_, f64>,
    h2s: ArrayViewD<'_, f64>,
    on_error: OnError,
) -> Result<[ArrayD<f64>; 2]> {
    lift_multi(
        ["tpc_r", "ppc_psia", "co2", "h2s"],
        [tpc_r, ppc_psia, co2, h2s],
        on_error,
        |[t, p, c, h]| {
            crate::error::positive("tpc_r", t)?;
            crate::error::positive("ppc_psia", p)?;
            let pc = wichert_aziz(
                PseudoCritical {
                    tpc_r: t,
                    ppc_psia: p,
                },
                c,
                h,
            )?;
            Ok([pc.tpc_r, pc.ppc_psia])
        },
    )
}

/// Kay's rule on arrays of mole fractions (order of [`super::COMPOSITION_NAMES`]) plus
/// the C7+ molar mass and gravity: returns (Tpc degR, Ppc psia, gas gravity).
///
/// # Errors
/// As [`z_factor_array`].
///
/// # Examples
/// ```
/// use ndarray::arr0;
/// use stocktank::array::OnError;
/// let v = |x: f64| arr0(x).into_dyn();
/// let y = [0.0, 0.0, 0.0, 1.0, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0].map(v);
/// let [t, _, _] = stocktank::gas::kay_array(y.each_ref().map(|a| a.view()), v(0.0).view(), v(0.0).view(), OnError::Raise).unwrap();
/// assert!((t[[]] - 343.01).abs() < 1e-9);
/// ```
pub fn kay_array(
    y: [ArrayViewD<'_, f64>; 12],
    c7plus_mw: ArrayViewD<'_, f64>,
    c7plus_sg: ArrayViewD<'_, f64>,
    on_error: OnError,
) -> Result<[ArrayD<f64>; 3]> {
    let [a, b, c, d, e, f, g, h, i, j, k, l] = y;
    lift_multi(
        [
            "n2",
            "co2",
            "h2s",
            "c1",
            "c2",
            "c3",
            "ic4",
            "nc4",
            "ic5",
            "nc5",
            "c6",
            "c7plus",
            "c7plus_mw",
            "c7plus_sg",
        ],
        [a, b, c, d, e, f, g, h, i, j, k, l, c7plus_mw, c7plus_sg],
        on_error,
        |x| {
            let y: [f64; 12] = std::array::from_fn(|n| x[n]);
            let r = kay(&y, x[12], x[13])?;
            Ok([r.pc.tpc_r, r.pc.ppc_psia, r.gas_sg])
        },
    )
}

/// Bg (rcf/scf) on arrays of pressure (psia), temperature (degF) and Z.
///
/// # Errors
/// As [`z_factor_array`].
///
/// # Examples
/// ```
/// use ndarray::arr0;
/// use stocktank::array::OnError;
/// use stocktank::units::StandardConditions;
/// let v = |x: f64| arr0(x).into_dyn();
/// let b = stocktank::gas::bg_array(v(14.696).view(), v(60.0).view(), v(1.0).view(), &StandardConditions::FIELD, OnError::Raise).unwrap();
/// assert!((b[[]] - 1.0).abs() < 1e-15);
/// ```
pub fn bg_array(
    p_psia: ArrayViewD<'_, f64>,
    t_f: ArrayViewD<'_, f64>,
    z: ArrayViewD<'_, f64>,
    sc: &StandardConditions,
    on_error: OnError,
) -> Result<ArrayD<f64>> {
    lift(
        ["p_psia", "t_f", "z"],
        [p_psia, t_f, z],
        on_error,
        |[p, t, z]| bg(p, t, z, sc),
    )
}

/// Gas density (lbm/ft3) on arrays of pressure, temperature, Z and gravity.
///
/// # Errors
/// As [`z_factor_array`].
///
/// # Examples
/// ```
/// use ndarray::arr0;
/// use stocktank::array::OnError;
/// let v = |x: f64| arr0(x).into_dyn();
/// let r = stocktank::gas::gas_density_array(v(14.696).view(), v(60.0).view(), v(1.0).view(), v(1.0).view(), OnError::Raise).unwrap();
/// assert!((r[[]] - 0.0763).abs() < 2e-4);
/// ```
pub fn gas_density_array(
    p_psia: ArrayViewD<'_, f64>,
    t_f: ArrayViewD<'_, f64>,
    z: ArrayViewD<'_, f64>,
    gas_sg: ArrayViewD<'_, f64>,
    on_error: OnError,
) -> Result<ArrayD<f64>> {
    lift(
        ["p_psia", "t_f", "z", "gas_sg"],
        [p_psia, t_f, z, gas_sg],
        on_error,
        |[p, t, z, g]| gas_density(p, t, z, g),
    )
}

/// Lee–Gonzalez–Eakin viscosity (cp) on arrays of temperature (degF), density (lbm/ft3)
/// and molar mass (lbm/lbmol).
///
/// # Errors
/// As [`z_factor_array`].
///
/// # Examples
/// ```
/// use ndarray::arr0;
/// use stocktank::array::OnError;
/// let v = |x: f64| arr0(x).into_dyn();
/// let mu = stocktank::gas::viscosity_lee_gonzalez_eakin_array(v(200.0).view(), v(10.0).view(), v(20.0).view(), OnError::Raise).unwrap();
/// assert!(mu[[]] > 0.01);
/// ```
pub fn viscosity_lee_gonzalez_eakin_array(
    t_f: ArrayViewD<'_, f64>,
    density_lbm_ft3: ArrayViewD<'_, f64>,
    molar_mass: ArrayViewD<'_, f64>,
    on_error: OnError,
) -> Result<ArrayD<f64>> {
    lift(
        ["t_f", "density_lbm_ft3", "molar_mass"],
        [t_f, density_lbm_ft3, molar_mass],
        on_error,
        |[t, r, m]| viscosity_lee_gonzalez_eakin(t, r, m),
    )
}

/// [`super::recombined_gas_sg`] on arrays (condensate molar mass by Cragoe when
/// `condensate_mw` is `None`).
///
/// # Errors
/// As [`z_factor_array`].
///
/// # Examples
/// ```
/// use ndarray::arr1;
/// use stocktank::array::OnError;
/// use stocktank::units::StandardConditions;
/// let r = arr1(&[20_000.0, 100_000.0]).into_dyn();
/// let g = arr1(&[0.65]).into_dyn();
/// let z = arr1(&[0.0]).into_dyn();
/// let api = arr1(&[55.0]).into_dyn();
/// let w = stocktank::gas::recombined_gas_sg_array([r.view(), g.view(), z.view(), g.view(), api.view()], None, &StandardConditions::FIELD, OnError::Raise).unwrap();
/// assert!(w[0] > w[1]);
/// ```
pub fn recombined_gas_sg_array(
    inputs: [ArrayViewD<'_, f64>; 5],
    condensate_mw: Option<ArrayViewD<'_, f64>>,
    sc: &StandardConditions,
    on_error: OnError,
) -> Result<ArrayD<f64>> {
    let [r1, g1, r3, g3, api] = inputs;
    match condensate_mw {
        None => lift(
            [
                "separator_gor",
                "separator_gas_sg",
                "stock_tank_gor",
                "stock_tank_gas_sg",
                "condensate_api",
            ],
            [r1, g1, r3, g3, api],
            on_error,
            |[a, b, c, d, e]| recombined_gas_sg(a, b, c, d, e, None, sc),
        ),
        Some(m) => lift(
            [
                "separator_gor",
                "separator_gas_sg",
                "stock_tank_gor",
                "stock_tank_gas_sg",
                "condensate_api",
                "condensate_mw",
            ],
            [r1, g1, r3, g3, api, m],
            on_error,
            |[a, b, c, d, e, m]| recombined_gas_sg(a, b, c, d, e, Some(m), sc),
        ),
    }
}
