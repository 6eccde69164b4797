//! Deterministic volumetric oil and gas in place.
//!
//! # Formula
//! ```text
//! pore volume (bbl)   Vp = 7758.37 * A * h * NTG * phi           (A acres, h ft)
//! oil in place (STB)  N  = Vp * (1 - Sw) / Boi
//! gas in place (scf)  G  = 43,560 * A * h * NTG * phi * (1 - Sw) / Bgi   (Bgi rcf/scf)
//! dissolved gas (scf) Gs = N * Rsi
//! gas-cap ratio       m  = G_cap * Bgi / (N * Boi)                (reservoir volumes)
//! ```
//! 7758.37 bbl per acre-ft and 43,560 ft3 per acre-ft come from the exact unit definitions
//! in [`crate::units`]; the trade's rounded 7758 differs by 0.005%.
//!
//! # References
//! - Craft, B.C., Hawkins, M.F. (1959). Applied Petroleum Reservoir Engineering.
//!   Prentice-Hall, ch. 1 (volumetric oil and gas in place).
//! - Schilthuis, R.J. (1936). Active oil and reservoir energy. Trans. AIME 118, 33–52
//!   (the gas-cap ratio m).

use crate::error::{Result, fraction, non_negative, positive};
use crate::units::{BBL_PER_ACRE_FT, FT2_PER_ACRE};

/// Hydrocarbon pore volume per acre-ft of gross rock, in bbl, after net-to-gross, porosity
/// and water saturation; validates the shared inputs.
#[inline]
fn hcpv_acre_ft(grv_acre_ft: f64, net_to_gross: f64, porosity: f64, sw: f64) -> Result<f64> {
    non_negative("gross_rock_volume", grv_acre_ft)?;
    fraction("net_to_gross", net_to_gross)?;
    fraction("porosity", porosity)?;
    fraction("sw", sw)?;
    Ok(grv_acre_ft * net_to_gross * porosity * (1.0 - sw))
}

/// Original oil in place from area and thickness, STB.
///
/// # Formula
/// ```text
/// N = 7758.37 * A * h * NTG * phi * (1 - Sw) / Boi
/// ```
///
/// # Arguments
/// * `area` - productive area, acres, >= 0.
/// * `thickness` - gross thickness, ft, >= 0.
/// * `net_to_gross` - net-to-gross ratio, fraction in [0, 1] (1 when `thickness` is net pay).
/// * `porosity` - porosity, fraction in [0, 1].
/// * `sw` - initial water saturation, fraction in [0, 1].
/// * `boi` - initial oil formation volume factor, rb/STB, > 0.
///
/// # Returns
/// Oil in place, STB.
///
/// # Errors
/// [`crate::Error::InvalidArgument`] naming `area`, `thickness`, `net_to_gross`, `porosity`,
/// `sw` or `boi`.
///
/// # Examples
/// ```
/// use stocktank::volumetrics::ooip;
/// // 640 acres, 50 ft, phi 0.2, Sw 0.25, Boi 1.2: about 31.03 million STB.
/// let n = ooip(640.0, 50.0, 1.0, 0.2, 0.25, 1.2).unwrap();
/// assert!((n / 1e6 - 31.033).abs() < 1e-3);
/// ```
///
/// # References
/// Craft, B.C., Hawkins, M.F. (1959). Applied Petroleum Reservoir Engineering, ch. 1.
#[inline]
pub fn ooip(
    area: f64,
    thickness: f64,
    net_to_gross: f64,
    porosity: f64,
    sw: f64,
    boi: f64,
) -> Result<f64> {
    non_negative("area", area)?;
    non_negative("thickness", thickness)?;
    ooip_from_rock_volume(area * thickness, net_to_gross, porosity, sw, boi)
}

/// Original oil in place from a gross rock volume, STB.
///
/// # Formula
/// ```text
/// N = 7758.37 * GRV * NTG * phi * (1 - Sw) / Boi
/// ```
///
/// # Arguments
/// * `gross_rock_volume` - gross rock volume, acre-ft, >= 0.
/// * `net_to_gross`, `porosity`, `sw` - fractions in [0, 1].
/// * `boi` - initial oil formation volume factor, rb/STB, > 0.
///
/// # Returns
/// Oil in place, STB.
///
/// # Errors
/// [`crate::Error::InvalidArgument`] naming the offending argument.
///
/// # Examples
/// ```
/// use stocktank::volumetrics::ooip_from_rock_volume;
/// let n = ooip_from_rock_volume(1.0, 1.0, 1.0, 0.0, 1.0).unwrap();
/// assert_eq!(n.round(), 7758.0); // one acre-ft of pore space, common practice
/// ```
///
/// # References
/// Craft, B.C., Hawkins, M.F. (1959). Applied Petroleum Reservoir Engineering, ch. 1.
#[inline]
pub fn ooip_from_rock_volume(
    gross_rock_volume: f64,
    net_to_gross: f64,
    porosity: f64,
    sw: f64,
    boi: f64,
) -> Result<f64> {
    let hc = hcpv_acre_ft(gross_rock_volume, net_to_gross, porosity, sw)?;
    positive("boi", boi)?;
    Ok(BBL_PER_ACRE_FT * hc / boi)
}

/// Original gas in place (free gas) from area and thickness, scf.
///
/// Use it for a gas reservoir or for the free gas of an oil reservoir's gas cap.
///
/// # Formula
/// ```text
/// G = 43,560 * A * h * NTG * phi * (1 - Sw) / Bgi
/// ```
///
/// # Arguments
/// * `area` - productive area, acres, >= 0.
/// * `thickness` - gross thickness, ft, >= 0.
/// * `net_to_gross`, `porosity`, `sw` - fractions in [0, 1].
/// * `bgi` - initial gas formation volume factor, rcf/scf (reservoir ft3 per standard ft3), > 0.
///
/// # Returns
/// Gas in place, scf.
///
/// # Errors
/// [`crate::Error::InvalidArgument`] naming the offending argument.
///
/// # Examples
/// ```
/// use stocktank::volumetrics::ogip;
/// // 1000 acres, 30 ft, phi 0.18, Sw 0.3, Bgi 0.005 rcf/scf: 32.93 Bscf.
/// let g = ogip(1000.0, 30.0, 1.0, 0.18, 0.3, 0.005).unwrap();
/// assert!((g / 1e9 - 32.931).abs() < 1e-3);
/// ```
///
/// # References
/// Craft, B.C., Hawkins, M.F. (1959). Applied Petroleum Reservoir Engineering, ch. 1.
#[inline]
pub fn ogip(
    area: f64,
    thickness: f64,
    net_to_gross: f64,
    porosity: f64,
    sw: f64,
    bgi: f64,
) -> Result<f64> {
    non_negative("area", area)?;
    non_negative("thickness", thickness)?;
    ogip_from_rock_volume(area * thickness, net_to_gross, porosity, sw, bgi)
}

/// Original gas in place (free gas) from a gross rock volume, scf.
///
/// # Formula
/// ```text
/// G = 43,560 * GRV * NTG * phi * (1 - Sw) / Bgi
/// ```
///
/// # Arguments
/// * `gross_rock_volume` - gross rock volume, acre-ft, >= 0.
/// * `net_to_gross`, `porosity`, `sw` - fractions in [0, 1].
/// * `bgi` - initial gas formation volume factor, rcf/scf, > 0.
///
/// # Returns
/// Gas in place, scf.
///
/// # Errors
/// [`crate::Error::InvalidArgument`] naming the offending argument.
///
/// # Examples
/// ```
/// use stocktank::volumetrics::ogip_from_rock_volume;
/// assert_eq!(ogip_from_rock_volume(1.0, 1.0, 1.0, 0.0, 1.0).unwrap(), 43_560.0);
/// ```
///
/// # References
/// Craft, B.C., Hawkins, M.F. (1959). Applied Petroleum Reservoir Engineering, ch. 1.
#[inline]
pub fn ogip_from_rock_volume(
    gross_rock_volume: f64,
    net_to_gross: f64,
    porosity: f64,
    sw: f64,
    bgi: f64,
) -> Result<f64> {
    let hc = hcpv_acre_ft(gross_rock_volume, net_to_gross, porosity, sw)?;
    positive("bgi", bgi)?;
    Ok(FT2_PER_ACRE * hc / bgi)
}

/// Gas dissolved in the oil in place, scf.
///
/// # Formula
/// ```text
/// Gs = N * Rsi
/// ```
///
/// # Arguments
/// * `ooip` - oil in place, STB, >= 0.
/// * `rsi` - initial solution gas-oil ratio, scf/STB, >= 0.
///
/// # Returns
/// Dissolved gas in place, scf.
///
/// # Errors
/// [`crate::Error::InvalidArgument`] naming `ooip` or `rsi`.
///
/// # Examples
/// ```
/// use stocktank::volumetrics::dissolved_gas_in_place;
/// assert_eq!(dissolved_gas_in_place(1.0e6, 500.0).unwrap(), 5.0e8);
/// ```
///
/// # References
/// Craft, B.C., Hawkins, M.F. (1959). Applied Petroleum Reservoir Engineering, ch. 1.
#[inline]
pub fn dissolved_gas_in_place(ooip: f64, rsi: f64) -> Result<f64> {
    Ok(non_negative("ooip", ooip)? * non_negative("rsi", rsi)?)
}

/// Gas-cap ratio m: initial gas-cap reservoir volume over initial oil-zone reservoir volume.
///
/// # Formula
/// ```text
/// m = G_cap * Bgi / (N * Boi)      (Bgi in rb/scf = rcf/scf / 5.614583)
/// ```
///
/// # Arguments
/// * `gas_cap_gas` - free gas of the gas cap, scf, >= 0.
/// * `bgi` - initial gas formation volume factor, rcf/scf, > 0.
/// * `ooip` - oil in place of the oil zone, STB, > 0.
/// * `boi` - initial oil formation volume factor, rb/STB, > 0.
///
/// # Returns
/// m, dimensionless (reservoir volume ratio).
///
/// # Errors
/// [`crate::Error::InvalidArgument`] naming the offending argument.
///
/// # Examples
/// ```
/// use stocktank::volumetrics::gas_cap_ratio;
/// // 5.614583 rcf of gas cap per rb of oil zone is m = 1.
/// let m = gas_cap_ratio(5.614_583_333_333_333e3, 1.0, 1000.0, 1.0).unwrap();
/// assert!((m - 1.0).abs() < 1e-12);
/// ```
///
/// # References
/// Schilthuis, R.J. (1936). Active oil and reservoir energy. Trans. AIME 118, 33–52.
#[inline]
pub fn gas_cap_ratio(gas_cap_gas: f64, bgi: f64, ooip: f64, boi: f64) -> Result<f64> {
    non_negative("gas_cap_gas", gas_cap_gas)?;
    positive("bgi", bgi)?;
    positive("ooip", ooip)?;
    positive("boi", boi)?;
    Ok(gas_cap_gas * bgi / crate::units::FT3_PER_BBL / (ooip * boi))
}

/// One layer or zone of a layered in-place estimate.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Layer {
    /// Area, acres.
    pub area: f64,
    /// Gross thickness, ft.
    pub thickness: f64,
    /// Net-to-gross, fraction.
    pub net_to_gross: f64,
    /// Porosity, fraction.
    pub porosity: f64,
    /// Water saturation, fraction.
    pub sw: f64,
    /// Formation volume factor: Boi in rb/STB for oil, Bgi in rcf/scf for gas.
    pub fvf: f64,
}

/// The fluid of an in-place estimate.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Fluid {
    /// Oil: result in STB, formation volume factor Boi in rb/STB.
    Oil,
    /// Free gas: result in scf, formation volume factor Bgi in rcf/scf.
    Gas,
}

/// In place of several layers or zones: per-layer volumes and their sum.
///
/// # Arguments
/// * `fluid` - [`Fluid::Oil`] (STB) or [`Fluid::Gas`] (scf).
/// * `layers` - the layers; see [`Layer`] for units.
///
/// # Returns
/// `(total, per_layer)` in STB or scf.
///
/// # Errors
/// [`crate::Error::InvalidArgument`] naming the field and the layer index.
///
/// # Examples
/// ```
/// use stocktank::volumetrics::{in_place_layers, Fluid, Layer};
/// let l = Layer { area: 100.0, thickness: 10.0, net_to_gross: 0.8, porosity: 0.2, sw: 0.3, fvf: 1.2 };
/// let (total, each) = in_place_layers(Fluid::Oil, &[l, l]).unwrap();
/// assert_eq!(total, 2.0 * each[0]);
/// ```
///
/// # References
/// Craft, B.C., Hawkins, M.F. (1959). Applied Petroleum Reservoir Engineering, ch. 1.
pub fn in_place_layers(fluid: Fluid, layers: &[Layer]) -> Result<(f64, Vec<f64>)> {
    let mut each = Vec::with_capacity(layers.len());
    for (i, l) in layers.iter().enumerate() {
        let f = match fluid {
            Fluid::Oil => ooip,
            Fluid::Gas => ogip,
        };
        let v = f(l.area, l.thickness, l.net_to_gross, l.porosity, l.sw, l.fvf)
            .map_err(|e| e.at_index(&[i]))?;
        each.push(v);
    }
    Ok((each.iter().sum(), each))
}
