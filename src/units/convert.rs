//! Conversions between field and metric units for every quantity stocktank uses.
//!
//! Each unit is a linear map to one SI base unit of its quantity,
//! `si = value * scale + offset`, with `scale` and `offset` derived from the exact
//! constants of [`crate::units`] (NIST SP 811 (2008), Appendix B; the 2019 SI definitions).
//! A conversion goes through the SI value, so any two units of one quantity convert.
//!
//! # Quantities and units
//! | quantity | units |
//! |---|---|
//! | pressure | `psia`, `psi`, `psig`, `Pa`, `kPa`, `MPa`, `bar`, `barg`, `kPag`, `atm` |
//! | temperature | `degF`, `degR`, `degC`, `K` |
//! | volume | `m3`, `sm3`, `rm3`, `bbl`, `STB`, `rb`, `MSTB`, `MMSTB`, `ft3`, `scf`, `rcf`, `Mscf`, `MMscf`, `Bscf`, `acre-ft`, `e3m3`, `e6m3` |
//! | gas-oil ratio | `scf/STB`, `Mscf/STB`, `sm3/sm3`, `m3/m3` |
//! | formation volume factor | `rb/STB`, `rm3/sm3`, `rcf/scf`, `rb/scf`, `rb/Mscf`, `m3/m3` |
//! | density | `lbm/ft3`, `kg/m3`, `g/cm3` |
//! | viscosity | `cp`, `mPa.s`, `Pa.s` |
//! | compressibility | `1/psi`, `1/Pa`, `1/kPa`, `1/MPa`, `1/bar` |
//! | area | `acre`, `ft2`, `m2`, `ha`, `km2` |
//! | length (thickness) | `ft`, `m`, `in` |
//! | permeability | `md`, `D`, `m2`, `um2` |
//!
//! # Standard volumes
//! `scf` and `sm3`, `STB` and `sm3`, convert geometrically (1 sm3 = 35.3147 scf), as the
//! trade does. Field base conditions (60 degF, 14.696 psia) and the metric ones (15 degC,
//! 101.325 kPa, ISO 13443) differ by about 0.2% for an ideal gas; to move a gas volume
//! between base conditions use [`rebase_gas_volume`].
//!
//! # Gauge pressure
//! `psig`, `barg` and `kPag` are relative to one standard atmosphere (101.325 kPa,
//! 14.6959 psia), not the local barometric pressure.
//!
//! # References
//! - Thompson, A., Taylor, B.N. (2008). Guide for the Use of the International System of
//!   Units (SI). NIST Special Publication 811, Appendix B.
//! - ISO 13443:1996. Natural gas, standard reference conditions.

use super::{
    FT2_PER_ACRE, KELVIN_OFFSET, KG_PER_LBM, M_PER_FT, M3_PER_BBL, M3_PER_FT3, PA_PER_ATM,
    PA_PER_PSI, RANKINE_OFFSET, StandardConditions,
};
use crate::error::{Error, Result};

/// A physical quantity whose units [`convert`] knows.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Quantity {
    /// Pressure; SI base Pa.
    Pressure,
    /// Temperature; SI base K.
    Temperature,
    /// Volume (liquid, gas, reservoir or standard); SI base m3.
    Volume,
    /// Gas-oil (or gas-water) ratio, standard gas volume per standard liquid volume; SI base m3/m3.
    GasOilRatio,
    /// Formation volume factor, reservoir volume per standard volume; SI base m3/m3.
    VolumeFactor,
    /// Mass density; SI base kg/m3.
    Density,
    /// Dynamic viscosity; SI base Pa s.
    Viscosity,
    /// Isothermal compressibility; SI base 1/Pa.
    Compressibility,
    /// Area; SI base m2.
    Area,
    /// Length or thickness; SI base m.
    Length,
    /// Permeability; SI base m2.
    Permeability,
}

impl Quantity {
    /// The name used in messages and by the Python layer (e.g. `"pressure"`).
    ///
    /// # Examples
    /// ```
    /// use stocktank::units::convert::Quantity;
    /// assert_eq!(Quantity::Pressure.name(), "pressure");
    /// ```
    pub fn name(self) -> &'static str {
        match self {
            Quantity::Pressure => "pressure",
            Quantity::Temperature => "temperature",
            Quantity::Volume => "volume",
            Quantity::GasOilRatio => "gas_oil_ratio",
            Quantity::VolumeFactor => "volume_factor",
            Quantity::Density => "density",
            Quantity::Viscosity => "viscosity",
            Quantity::Compressibility => "compressibility",
            Quantity::Area => "area",
            Quantity::Length => "length",
            Quantity::Permeability => "permeability",
        }
    }

    /// The field unit of this quantity, the default everywhere in stocktank.
    ///
    /// # Examples
    /// ```
    /// use stocktank::units::convert::Quantity;
    /// assert_eq!(Quantity::Area.field_unit(), "acre");
    /// ```
    pub fn field_unit(self) -> &'static str {
        match self {
            Quantity::Pressure => "psia",
            Quantity::Temperature => "degF",
            Quantity::Volume => "bbl",
            Quantity::GasOilRatio => "scf/STB",
            Quantity::VolumeFactor => "rb/STB",
            Quantity::Density => "lbm/ft3",
            Quantity::Viscosity => "cp",
            Quantity::Compressibility => "1/psi",
            Quantity::Area => "acre",
            Quantity::Length => "ft",
            Quantity::Permeability => "md",
        }
    }

    /// All units of this quantity, comma separated (used in error messages).
    fn allowed(self) -> &'static str {
        match self {
            Quantity::Pressure => "psia, psi, psig, Pa, kPa, MPa, bar, barg, kPag, atm",
            Quantity::Temperature => "degF, degR, degC, K",
            Quantity::Volume => {
                "m3, sm3, rm3, bbl, STB, rb, MSTB, MMSTB, ft3, scf, rcf, Mscf, MMscf, Bscf, acre-ft, e3m3, e6m3"
            }
            Quantity::GasOilRatio => "scf/STB, Mscf/STB, sm3/sm3, m3/m3",
            Quantity::VolumeFactor => "rb/STB, rm3/sm3, rcf/scf, rb/scf, rb/Mscf, m3/m3",
            Quantity::Density => "lbm/ft3, kg/m3, g/cm3",
            Quantity::Viscosity => "cp, mPa.s, Pa.s",
            Quantity::Compressibility => "1/psi, 1/Pa, 1/kPa, 1/MPa, 1/bar",
            Quantity::Area => "acre, ft2, m2, ha, km2",
            Quantity::Length => "ft, m, in",
            Quantity::Permeability => "md, D, um2, m2",
        }
    }
}

/// Pa per bar (exact). NIST SP 811 (2008).
const PA_PER_BAR: f64 = 1.0e5;
/// Pascal seconds in one centipoise (exact: 1 P = 0.1 Pa s). NIST SP 811 (2008).
const PA_S_PER_CP: f64 = 1.0e-3;
/// Square metres in one darcy: 1 cp * 1 cm2 / (1 s * 1 atm), 9.869233e-13 m2 (derived from
/// the definition of the darcy and the exact cp, cm and atm). NIST SP 811 (2008) lists it.
const M2_PER_DARCY: f64 = PA_S_PER_CP * 1.0e-4 / PA_PER_ATM;

/// The linear map of one unit: `si = value * scale + offset`.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct UnitMap {
    /// The quantity of the unit.
    pub quantity: Quantity,
    /// SI units per unit.
    pub scale: f64,
    /// SI value of the unit's zero.
    pub offset: f64,
}

const fn lin(quantity: Quantity, scale: f64) -> UnitMap {
    UnitMap {
        quantity,
        scale,
        offset: 0.0,
    }
}

/// Look up a unit by its name (case-sensitive, as listed in the module docs).
///
/// # Errors
/// [`Error::InvalidOption`] naming `arg` when the unit is unknown.
///
/// # Examples
/// ```
/// use stocktank::units::convert::{unit, Quantity};
/// let u = unit("unit", "bar").unwrap();
/// assert_eq!(u.quantity, Quantity::Pressure);
/// assert_eq!(u.scale, 1.0e5);
/// ```
pub fn unit(arg: &'static str, name: &str) -> Result<UnitMap> {
    use Quantity::*;
    let ft2 = M_PER_FT * M_PER_FT;
    // Standard cubic metre per stock-tank barrel, the ratio of the two volume units.
    let scf_per_stb = M3_PER_FT3 / M3_PER_BBL;
    Ok(match name {
        // Pressure: Pa.
        "psia" | "psi" => lin(Pressure, PA_PER_PSI),
        "psig" => UnitMap {
            quantity: Pressure,
            scale: PA_PER_PSI,
            offset: PA_PER_ATM,
        },
        "Pa" => lin(Pressure, 1.0),
        "kPa" => lin(Pressure, 1.0e3),
        "kPag" => UnitMap {
            quantity: Pressure,
            scale: 1.0e3,
            offset: PA_PER_ATM,
        },
        "MPa" => lin(Pressure, 1.0e6),
        "bar" => lin(Pressure, PA_PER_BAR),
        "barg" => UnitMap {
            quantity: Pressure,
            scale: PA_PER_BAR,
            offset: PA_PER_ATM,
        },
        "atm" => lin(Pressure, PA_PER_ATM),
        // Temperature: K.
        "K" => lin(Temperature, 1.0),
        "degC" => UnitMap {
            quantity: Temperature,
            scale: 1.0,
            offset: KELVIN_OFFSET,
        },
        "degR" => lin(Temperature, 1.0 / 1.8),
        "degF" => UnitMap {
            quantity: Temperature,
            scale: 1.0 / 1.8,
            offset: RANKINE_OFFSET / 1.8,
        },
        // Volume: m3.
        "m3" | "sm3" | "rm3" => lin(Volume, 1.0),
        "e3m3" => lin(Volume, 1.0e3),
        "e6m3" => lin(Volume, 1.0e6),
        "bbl" | "STB" | "rb" => lin(Volume, M3_PER_BBL),
        "MSTB" => lin(Volume, 1.0e3 * M3_PER_BBL),
        "MMSTB" => lin(Volume, 1.0e6 * M3_PER_BBL),
        "ft3" | "scf" | "rcf" => lin(Volume, M3_PER_FT3),
        "Mscf" => lin(Volume, 1.0e3 * M3_PER_FT3),
        "MMscf" => lin(Volume, 1.0e6 * M3_PER_FT3),
        "Bscf" => lin(Volume, 1.0e9 * M3_PER_FT3),
        "acre-ft" => lin(Volume, FT2_PER_ACRE * M3_PER_FT3),
        // Gas-oil ratio: m3/m3.
        "scf/STB" => lin(GasOilRatio, scf_per_stb),
        "Mscf/STB" => lin(GasOilRatio, 1.0e3 * scf_per_stb),
        "sm3/sm3" => lin(GasOilRatio, 1.0),
        // Formation volume factor: m3/m3 (the unit "m3/m3" is taken as a volume factor).
        "rb/STB" | "rm3/sm3" | "rcf/scf" | "m3/m3" => lin(VolumeFactor, 1.0),
        "rb/scf" => lin(VolumeFactor, M3_PER_BBL / M3_PER_FT3),
        "rb/Mscf" => lin(VolumeFactor, M3_PER_BBL / M3_PER_FT3 / 1.0e3),
        // Density: kg/m3.
        "kg/m3" => lin(Density, 1.0),
        "g/cm3" => lin(Density, 1.0e3),
        "lbm/ft3" => lin(Density, KG_PER_LBM / M3_PER_FT3),
        // Viscosity: Pa s.
        "Pa.s" => lin(Viscosity, 1.0),
        "cp" | "mPa.s" => lin(Viscosity, PA_S_PER_CP),
        // Compressibility: 1/Pa.
        "1/Pa" => lin(Compressibility, 1.0),
        "1/kPa" => lin(Compressibility, 1.0e-3),
        "1/MPa" => lin(Compressibility, 1.0e-6),
        "1/bar" => lin(Compressibility, 1.0 / PA_PER_BAR),
        "1/psi" => lin(Compressibility, 1.0 / PA_PER_PSI),
        // Area: m2.
        "m2" => lin(Area, 1.0), // also the SI unit of permeability
        "ha" => lin(Area, 1.0e4),
        "km2" => lin(Area, 1.0e6),
        "ft2" => lin(Area, ft2),
        "acre" => lin(Area, FT2_PER_ACRE * ft2),
        // Length: m.
        "m" => lin(Length, 1.0),
        "ft" => lin(Length, M_PER_FT),
        "in" => lin(Length, M_PER_FT / 12.0),
        // Permeability: m2.
        "md" => lin(Permeability, 1.0e-3 * M2_PER_DARCY),
        "D" => lin(Permeability, M2_PER_DARCY),
        "um2" => lin(Permeability, 1.0e-12),
        _ => {
            return Err(Error::InvalidOption {
                arg,
                value: name.to_string(),
                allowed: ALL_UNITS,
            });
        }
    })
}

/// Every unit name known to [`unit()`], comma separated.
pub const ALL_UNITS: &str = "psia, psi, psig, Pa, kPa, kPag, MPa, bar, barg, atm, degF, degR, degC, K, \
m3, sm3, rm3, bbl, STB, rb, MSTB, MMSTB, ft3, scf, rcf, Mscf, MMscf, Bscf, acre-ft, e3m3, e6m3, \
scf/STB, Mscf/STB, sm3/sm3, rb/STB, rm3/sm3, rcf/scf, rb/scf, rb/Mscf, m3/m3, lbm/ft3, kg/m3, g/cm3, \
cp, mPa.s, Pa.s, 1/psi, 1/Pa, 1/kPa, 1/MPa, 1/bar, acre, ft2, m2, ha, km2, ft, m, in, md, D, um2";

/// The map `(scale, offset)` with `to = from_value * scale + offset` between two units of
/// one quantity.
///
/// # Errors
/// [`Error::InvalidOption`] naming `from_unit` or `to_unit` for an unknown unit, or
/// `to_unit` (listing the units of the source's quantity) when the quantities differ.
///
/// # Examples
/// ```
/// use stocktank::units::convert::factor;
/// let (s, o) = factor("degC", "degF").unwrap();
/// assert!((100.0 * s + o - 212.0).abs() < 1e-12);
/// ```
pub fn factor(from_unit: &str, to_unit: &str) -> Result<(f64, f64)> {
    let a = unit("from_unit", from_unit)?;
    let b = unit("to_unit", to_unit)?;
    // Permeability and area share the dimension m2 (md converts to m2 or um2).
    let dim = |q: Quantity| {
        if q == Quantity::Permeability {
            Quantity::Area
        } else {
            q
        }
    };
    if dim(a.quantity) != dim(b.quantity) {
        return Err(Error::InvalidOption {
            arg: "to_unit",
            value: format!(
                "{to_unit} (a {}, not a {})",
                b.quantity.name(),
                a.quantity.name()
            ),
            allowed: a.quantity.allowed(),
        });
    }
    if from_unit == to_unit {
        return Ok((1.0, 0.0));
    }
    // to = (v * sa + oa - ob) / sb
    Ok((a.scale / b.scale, (a.offset - b.offset) / b.scale))
}

/// Convert a value between two units of one quantity.
///
/// # Formula
/// ```text
/// si = value * scale_from + offset_from;   out = (si - offset_to) / scale_to
/// ```
///
/// # Arguments
/// * `value` - the value in `from_unit`.
/// * `from_unit`, `to_unit` - unit names (see the module docs).
///
/// # Returns
/// The value in `to_unit`. NaN stays NaN.
///
/// # Errors
/// As [`factor`].
///
/// # Examples
/// ```
/// use stocktank::units::convert::convert;
/// // 1 acre-ft is 7758.37 bbl (the trade's 7758).
/// let bbl = convert(1.0, "acre-ft", "bbl").unwrap();
/// assert_eq!(bbl.round(), 7758.0);
/// ```
///
/// # References
/// Thompson, A., Taylor, B.N. (2008). NIST Special Publication 811, Appendix B.
pub fn convert(value: f64, from_unit: &str, to_unit: &str) -> Result<f64> {
    let (s, o) = factor(from_unit, to_unit)?;
    check_absolute("value", value, &unit("from_unit", from_unit)?)?;
    Ok(value * s + o)
}

/// Check that `value`, in the unit `u`, is not below its quantity's absolute zero: a
/// pressure (Pa, absolute) or a temperature (K) cannot be negative. Gauge units and the
/// relative temperature scales have their zero elsewhere (-14.696 psig and -459.67 degF
/// are the absolute zeros); other quantities are not checked here.
///
/// # Arguments
/// * `arg` - the argument name for the error.
/// * `value` - the value in `u`.
/// * `u` - its unit.
///
/// # Returns
/// `value` unchanged. NaN passes.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `arg` when the value is below absolute zero.
///
/// # Examples
/// ```
/// use stocktank::units::convert::{check_absolute, unit};
/// assert!(check_absolute("t", -400.0, &unit("u", "degF").unwrap()).is_ok());
/// assert!(check_absolute("t", -500.0, &unit("u", "degF").unwrap()).is_err());
/// assert!(check_absolute("p", -15.0, &unit("u", "psig").unwrap()).is_err());
/// ```
///
/// # References
/// Thompson, A., Taylor, B.N. (2008). NIST Special Publication 811 (the absolute scales).
pub fn check_absolute(arg: &'static str, value: f64, u: &UnitMap) -> Result<f64> {
    let si = value * u.scale + u.offset;
    match u.quantity {
        Quantity::Temperature if si < 0.0 => Err(Error::invalid(
            arg,
            value,
            "must not be below absolute zero (0 K, -459.67 degF, -273.15 degC)",
        )),
        Quantity::Pressure if si < 0.0 => Err(Error::invalid(
            arg,
            value,
            "must not be below zero absolute pressure (for a gauge unit, -1 atm)",
        )),
        _ => Ok(value),
    }
}

/// Move an ideal-gas standard volume from one set of base conditions to another.
///
/// # Formula
/// ```text
/// V_to = V_from * (p_from / p_to) * (T_to / T_from)      (T absolute)
/// ```
///
/// # Arguments
/// * `volume` - gas volume at `from` base conditions (any volume unit; the same unit returns).
/// * `from`, `to` - base conditions.
///
/// # Returns
/// The volume at `to` base conditions, in the unit of `volume`.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `volume` if it is negative or not finite.
///
/// # Examples
/// ```
/// use stocktank::units::StandardConditions;
/// use stocktank::units::convert::rebase_gas_volume;
/// let v = rebase_gas_volume(1.0, StandardConditions::FIELD, StandardConditions::ISO_13443).unwrap();
/// assert!((v - 0.998_08).abs() < 1e-4);
/// ```
///
/// # References
/// Ideal gas law (Clapeyron 1834); ISO 13443:1996 for the metric base conditions.
pub fn rebase_gas_volume(
    volume: f64,
    from: StandardConditions,
    to: StandardConditions,
) -> Result<f64> {
    crate::error::non_negative("volume", volume)?;
    Ok(volume * (from.p_psia / to.p_psia) * (to.t_r() / from.t_r()))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn values_below_absolute_zero_are_errors() {
        // Absolute zero: 0 K = -273.15 degC = -459.67 degF = 0 degR (NIST SP 811).
        assert!(convert(-500.0, "degF", "K").is_err());
        assert!(convert(-274.0, "degC", "degF").is_err());
        assert!(convert(-1.0, "degR", "degF").is_err());
        assert!((convert(-459.67, "degF", "K").unwrap()).abs() < 1e-9);
        // 1 atm = 14.695949 psi: -14.7 psig is below a perfect vacuum, -14.69 is not.
        assert!(convert(-14.7, "psig", "psia").is_err());
        assert!(convert(-14.69, "psig", "psia").unwrap() > 0.0);
        assert!(convert(-1.0, "kPa", "psia").is_err());
        // Other quantities are not checked here.
        assert!(convert(-1.0, "ft", "m").is_ok());
    }

    #[test]
    fn round_trips_and_identity() {
        for name in ALL_UNITS.split(", ") {
            let u = unit("unit", name).unwrap();
            let f = u.quantity.field_unit();
            let x = convert(convert(3.25, name, f).unwrap(), f, name).unwrap();
            assert!((x - 3.25).abs() < 1e-12 * 3.25, "{name}: {x}");
        }
    }

    #[test]
    fn mismatched_quantities_are_named() {
        let e = convert(1.0, "psia", "degF").unwrap_err();
        assert!(e.to_string().contains("to_unit"), "{e}");
        let e = convert(1.0, "furlong", "ft").unwrap_err();
        assert!(e.to_string().contains("from_unit"), "{e}");
    }
}
