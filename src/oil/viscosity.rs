//! Oil viscosity: dead (gas-free) oil at reservoir temperature, saturated live oil, and
//! undersaturated oil above the bubble point.

use super::{DeadOilViscosityMethod, ValidRange};
use crate::error::{Error, Result, non_negative, positive};
use crate::fastmath;

/// Viscosity of the gas-free (dead) stock-tank oil at temperature `t_f`.
///
/// # Formula
/// ```text
/// Beggs–Robinson (1975): mu_od = 10^x - 1,  x = T^-1.163 10^(3.0324 - 0.02023 API)
/// Glaso (1980):          mu_od = 3.141e10 T^-3.444 (log API)^(10.313 log T - 36.447)
/// Beal (1946), Standing's fit (1981):
///                        mu_od = (0.32 + 1.8e7 / API^4.53) (360 / (T + 200))^a,
///                        a = 10^(0.43 + 8.33 / API)
/// ```
/// T in degF, log = log10.
///
/// Published accuracy (from memory): Beggs–Robinson -0.64 % average error, 13.53 % standard
/// deviation (460 dead-oil points); Glaso fitted to 26 North Sea oils; Beal's chart
/// reproduces his data to about 24 % average. Ranges in [`dead_oil_viscosity_ranges`].
///
/// # Arguments
/// * `method` - the correlation.
/// * `api` - stock-tank oil gravity, degAPI, > 0 (Glaso: > 1).
/// * `t_f` - temperature, degF, > 0 (Beal: > -200).
///
/// # Returns
/// Dead-oil viscosity, cp.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `api` or `temperature_f`.
///
/// # Examples
/// ```
/// use stocktank::oil::{dead_oil_viscosity, DeadOilViscosityMethod as M};
/// // Dead-oil viscosity falls as API and temperature rise (common practice, no source).
/// let a = dead_oil_viscosity(M::BeggsRobinson, 25.0, 150.0).unwrap();
/// let b = dead_oil_viscosity(M::BeggsRobinson, 40.0, 150.0).unwrap();
/// let c = dead_oil_viscosity(M::BeggsRobinson, 25.0, 220.0).unwrap();
/// assert!(b < a && c < a);
/// ```
///
/// # References
/// - Beggs, H.D., Robinson, J.R. (1975). Estimating the viscosity of crude oil systems.
///   Journal of Petroleum Technology 27(9), 1140–1141.
/// - Glaso, O. (1980). Journal of Petroleum Technology 32(5), 785–795.
/// - Beal, C. (1946). The viscosity of air, water, natural gas, crude oil and its associated
///   gases at oil field temperatures and pressures. Trans. AIME 165, 94–115.
/// - Standing, M.B. (1981). Volumetric and Phase Behavior of Oil Field Hydrocarbon Systems,
///   9th printing. SPE.
#[inline]
pub fn dead_oil_viscosity(method: DeadOilViscosityMethod, api: f64, t_f: f64) -> Result<f64> {
    positive("api", api)?;
    if !t_f.is_finite() {
        return Err(Error::invalid("temperature_f", t_f, "must be finite"));
    }
    Ok(match method {
        DeadOilViscosityMethod::BeggsRobinson => {
            positive("temperature_f", t_f)?;
            // The published base-10 constants (a natural-log rewrite with rounded
            // constants, 6.9824 and 0.04658, is off by up to 0.05%).
            let x = t_f.powf(-1.163) * 10f64.powf(3.0324 - 0.02023 * api);
            10f64.powf(x) - 1.0
        }
        DeadOilViscosityMethod::Glaso => {
            positive("temperature_f", t_f)?;
            if api <= 1.0 {
                return Err(Error::invalid(
                    "api",
                    api,
                    "must be > 1 degAPI for Glaso's viscosity",
                ));
            }
            3.141e10 * t_f.powf(-3.444) * api.log10().powf(10.313 * t_f.log10() - 36.447)
        }
        DeadOilViscosityMethod::Beal => {
            if t_f <= -200.0 {
                return Err(Error::invalid(
                    "temperature_f",
                    t_f,
                    "must be > -200 degF for Beal's viscosity",
                ));
            }
            let a = 10f64.powf(0.43 + 8.33 / api);
            (0.32 + 1.8e7 / api.powf(4.53)) * (360.0 / (t_f + 200.0)).powf(a)
        }
    })
}

/// The ranges of the data each dead-oil viscosity correlation was fitted to (from memory, as
/// tabulated in Ahmed 2006, ch. 2): `api` (degAPI) and `temperature_f` (degF).
///
/// # Examples
/// ```
/// use stocktank::oil::{viscosity::dead_oil_viscosity_ranges, DeadOilViscosityMethod as M};
/// assert_eq!(dead_oil_viscosity_ranges(M::BeggsRobinson)[0].min, 16.0);
/// ```
///
/// # References
/// Ahmed, T. (2006). Reservoir Engineering Handbook, 3rd ed., ch. 2 (from memory).
pub fn dead_oil_viscosity_ranges(method: DeadOilViscosityMethod) -> &'static [ValidRange] {
    macro_rules! r {
        ($arg:literal, $min:literal, $max:literal) => {
            ValidRange {
                arg: $arg,
                min: $min,
                max: $max,
            }
        };
    }
    match method {
        DeadOilViscosityMethod::BeggsRobinson => {
            &[r!("api", 16.0, 58.0), r!("temperature_f", 70.0, 295.0)]
        }
        DeadOilViscosityMethod::Glaso => &[r!("api", 20.1, 48.1), r!("temperature_f", 50.0, 300.0)],
        DeadOilViscosityMethod::Beal => &[r!("api", 10.1, 52.5), r!("temperature_f", 98.0, 250.0)],
    }
}

/// Whether `api` and `t_f` lie inside the data ranges of the dead-oil viscosity correlation.
///
/// # Examples
/// ```
/// use stocktank::oil::{viscosity::dead_oil_viscosity_in_range, DeadOilViscosityMethod as M};
/// assert!(dead_oil_viscosity_in_range(M::Glaso, 30.0, 150.0));
/// assert!(!dead_oil_viscosity_in_range(M::Glaso, 60.0, 150.0));
/// ```
///
/// # References
/// As [`dead_oil_viscosity_ranges`].
pub fn dead_oil_viscosity_in_range(method: DeadOilViscosityMethod, api: f64, t_f: f64) -> bool {
    let [ra, rt] = dead_oil_viscosity_ranges(method) else {
        return false;
    };
    ra.contains(api) && rt.contains(t_f)
}

/// Viscosity of a live oil saturated with `rs` of dissolved gas (at or below its bubble
/// point), from its dead-oil viscosity (Beggs–Robinson 1975).
///
/// # Formula
/// ```text
/// mu_o = A mu_od^B,  A = 10.715 (Rs + 100)^-0.515,  B = 5.44 (Rs + 150)^-0.338
/// ```
/// Fitted to 2073 live-oil points, Rs 20–2070 scf/STB, p 15–5265 psig, 16–58 degAPI,
/// 70–295 degF; published average error -1.83 %, standard deviation 27.25 % (from memory).
///
/// # Arguments
/// * `mu_od` - dead-oil viscosity at the same temperature, cp, > 0.
/// * `rs` - solution GOR, scf/STB, >= 0.
///
/// # Returns
/// Live-oil viscosity, cp.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `mu_od` or `rs`.
///
/// # Examples
/// ```
/// // With no dissolved gas the live-oil form returns close to the dead-oil value.
/// let mu = stocktank::oil::live_oil_viscosity(2.0, 0.0).unwrap();
/// assert!((mu - 2.0).abs() < 0.05);
/// ```
///
/// # References
/// Beggs, H.D., Robinson, J.R. (1975). Journal of Petroleum Technology 27(9), 1140–1141.
#[inline]
pub fn live_oil_viscosity(mu_od: f64, rs: f64) -> Result<f64> {
    positive("mu_od", mu_od)?;
    non_negative("rs", rs)?;
    Ok(LiveOilViscosity::new(mu_od).at(rs))
}

/// ln 10.715, the Beggs–Robinson (1975) live-oil coefficient (unit-tested).
const LN_A0: f64 = 2.371_644_628_925_540_4;

/// Beggs–Robinson (1975) live-oil viscosity of one dead oil, with ln(mu_od) computed once
/// so that a pressure sweep pays two logarithms and two exponentials per point: the one
/// implementation behind [`live_oil_viscosity`].
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct LiveOilViscosity {
    ln_mu_od: f64,
}

impl LiveOilViscosity {
    /// The dead oil of viscosity `mu_od` (cp, > 0, checked by the caller).
    #[inline]
    pub(crate) fn new(mu_od: f64) -> Self {
        Self {
            ln_mu_od: fastmath::ln_scalar(mu_od),
        }
    }

    /// mu_o = A mu_od^B = exp(ln A + B ln mu_od), cp, at `rs` (scf/STB, >= 0, checked by the
    /// caller).
    #[inline(always)]
    pub(crate) fn at(&self, rs: f64) -> f64 {
        self.at_with::<fastmath::System>(rs)
    }

    /// [`LiveOilViscosity::at`] with the exponential and logarithm of `M` (the one formula;
    /// the table builder runs it over a column with [`fastmath::Lanes`]).
    #[inline(always)]
    pub(crate) fn at_with<M: fastmath::Elementary>(&self, rs: f64) -> f64 {
        let b = 5.44 * M::exp(-0.338 * M::ln(rs + 150.0));
        M::exp(LN_A0 - 0.515 * M::ln(rs + 100.0) + b * self.ln_mu_od)
    }
}

/// Viscosity of an undersaturated oil above its bubble point (Vasquez–Beggs 1980).
///
/// # Formula
/// ```text
/// mu_o = mu_ob (p / Pb)^m,  m = 2.6 p^1.187 exp(-11.513 - 8.98e-5 p)
/// ```
/// Fitted to 3593 points, p 141–9515 psia, mu 0.117–148 cp; published average error
/// -7.54 % (from memory).
///
/// # Arguments
/// * `p` - pressure, psia, >= `pb`.
/// * `pb` - bubble-point pressure, psia, > 0.
/// * `mu_ob` - viscosity at the bubble point, cp, > 0.
///
/// # Returns
/// Oil viscosity, cp.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `p` (also when below `pb`), `pb` or `mu_ob`.
///
/// # Examples
/// ```
/// let mu = stocktank::oil::undersaturated_oil_viscosity(5000.0, 2500.0, 0.5).unwrap();
/// assert!(mu > 0.5); // viscosity rises with pressure above Pb (common practice, no source)
/// ```
///
/// # References
/// Vasquez, M., Beggs, H.D. (1980). Journal of Petroleum Technology 32(6), 968–970.
#[inline]
pub fn undersaturated_oil_viscosity(p: f64, pb: f64, mu_ob: f64) -> Result<f64> {
    positive("p", p)?;
    positive("pb", pb)?;
    positive("mu_ob", mu_ob)?;
    if p < pb {
        return Err(Error::invalid(
            "p",
            p,
            "must be >= pb for undersaturated viscosity",
        ));
    }
    Ok(mu_ob * undersaturated_viscosity_ratio(p, fastmath::ln_scalar(p), fastmath::ln_scalar(pb)))
}

/// mu_o / mu_ob of Vasquez–Beggs (1980) at `p` >= `pb` given ln p and ln Pb (the table
/// builder has both at hand): the one implementation behind
/// [`undersaturated_oil_viscosity`].
#[inline(always)]
pub(crate) fn undersaturated_viscosity_ratio(p: f64, ln_p: f64, ln_pb: f64) -> f64 {
    undersaturated_viscosity_ratio_with::<fastmath::System>(p, ln_p, ln_pb)
}

/// [`undersaturated_viscosity_ratio`] with the exponential of `M` (the one formula; the
/// table builder runs it over a column with [`fastmath::Lanes`]).
#[inline(always)]
pub(crate) fn undersaturated_viscosity_ratio_with<M: fastmath::Elementary>(
    p: f64,
    ln_p: f64,
    ln_pb: f64,
) -> f64 {
    // m = 2.6 p^1.187 exp(-11.513 - 8.98e-5 p), ratio = (p / Pb)^m.
    let m = 2.6 * M::exp(1.187 * ln_p - 11.513 - 8.98e-5 * p);
    M::exp(m * (ln_p - ln_pb))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn hoisted_forms_match_the_published_power_laws() {
        assert_eq!(LN_A0, 10.715f64.ln());
        for mu_od in [0.5, 2.0, 40.0] {
            for rs in [0.0, 150.0, 600.0, 2000.0] {
                let a = 10.715 * (rs + 100.0f64).powf(-0.515);
                let b = 5.44 * (rs + 150.0f64).powf(-0.338);
                let want = a * f64::powf(mu_od, b);
                let got = live_oil_viscosity(mu_od, rs).unwrap();
                assert!((got / want - 1.0).abs() < 1e-14, "{got} vs {want}");
            }
        }
        for (p, pb) in [(3000.0f64, 2500.0f64), (9000.0, 1000.0)] {
            let m = 2.6 * p.powf(1.187) * (-11.513 - 8.98e-5 * p).exp();
            let want = 0.7 * (p / pb).powf(m);
            let got = undersaturated_oil_viscosity(p, pb, 0.7).unwrap();
            assert!((got / want - 1.0).abs() < 1e-14, "{got} vs {want}");
        }
    }
}
