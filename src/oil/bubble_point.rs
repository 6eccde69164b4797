//! Bubble-point pressure Pb(Rs) and its exact inverse, the solution GOR Rs(p) of a saturated
//! oil, by five published correlations.
//!
//! Each inverse is the algebraic inverse of the same correlation (not a separately fitted
//! equation), so `solution_gor(m, bubble_point(m, gor, ..), ..) == gor` to rounding and
//! `bubble_point(m, solution_gor(m, p, ..), ..) == p`.
//!
//! Published statistics (as reported by the authors on their own data; "from memory" where
//! marked) and the ranges of those data are documented on [`bubble_point`] and returned by
//! [`bubble_point_ranges`].

use super::{PbMethod, ValidRange};
use crate::error::{Error, Result, non_negative, positive, temperature_f};
use crate::fastmath;
use crate::units::f_to_r;

// Vasquez–Beggs (1980) Rs coefficients: (C1, C2, C3) for API <= 30 and API > 30.
const VB_LOW: (f64, f64, f64) = (0.0362, 1.0937, 25.7240);
const VB_HIGH: (f64, f64, f64) = (0.0178, 1.1870, 23.931);

// Al-Marhoun (1988) bubble point: Pb = a Rs^b gas_sg^c oil_sg^d T(degR)^e.
const AM_A: f64 = 5.38088e-3;
const AM_B: f64 = 0.715082;
const AM_C: f64 = -1.87784;
const AM_D: f64 = 3.1437;
const AM_E: f64 = 1.32657;

// Glaso (1980): log10 Pb = G0 + G1 x - G2 x^2, x = log10 Pb*.
const G0: f64 = 1.7669;
const G1: f64 = 1.7447;
const G2: f64 = 0.30218;

#[inline]
fn check_common(gas_sg: f64, api: f64, t_f: f64) -> Result<()> {
    positive("gas_sg", gas_sg)?;
    positive("api", api)?;
    temperature_f("temperature_f", t_f)?;
    Ok(())
}

#[inline]
fn vb_coefficients(api: f64) -> (f64, f64, f64) {
    if api <= 30.0 { VB_LOW } else { VB_HIGH }
}

/// Gas specific gravity corrected to a separator pressure of 100 psig (Vasquez–Beggs 1980),
/// the gravity their Rs, Bo and co correlations expect.
///
/// # Formula
/// ```text
/// gas_sg_100 = gas_sg * (1 + 5.912e-5 * API * Tsep * log10(psep / 114.7))
/// ```
/// with Tsep in degF and psep in psia (114.7 psia = 100 psig).
///
/// # Arguments
/// * `gas_sg` - separator gas specific gravity at `psep_psia`, `tsep_f` (air = 1), > 0.
/// * `api` - stock-tank oil gravity, degAPI, > 0.
/// * `tsep_f` - separator temperature, degF.
/// * `psep_psia` - separator pressure, psia, > 0.
///
/// # Returns
/// Gas specific gravity at 100 psig separator pressure (air = 1).
///
/// # Errors
/// [`Error::InvalidArgument`] naming `gas_sg`, `api`, `tsep_f` or `psep_psia`.
///
/// # Examples
/// ```
/// use stocktank::oil::vasquez_beggs_gas_sg_100psig;
/// // At 114.7 psia the correction vanishes.
/// assert_eq!(vasquez_beggs_gas_sg_100psig(0.75, 35.0, 80.0, 114.7).unwrap(), 0.75);
/// ```
///
/// # References
/// Vasquez, M., Beggs, H.D. (1980). Correlations for fluid physical property prediction.
/// Journal of Petroleum Technology 32(6), 968–970, SPE-6719-PA.
#[inline]
pub fn vasquez_beggs_gas_sg_100psig(
    gas_sg: f64,
    api: f64,
    tsep_f: f64,
    psep_psia: f64,
) -> Result<f64> {
    positive("gas_sg", gas_sg)?;
    positive("api", api)?;
    temperature_f("tsep_f", tsep_f)?;
    positive("psep_psia", psep_psia)?;
    let g = gas_sg * (1.0 + 5.912e-5 * api * tsep_f * (psep_psia / 114.7).log10());
    if g > 0.0 {
        Ok(g)
    } else {
        Err(Error::invalid(
            "psep_psia",
            psep_psia,
            "gives a non-positive corrected gas gravity",
        ))
    }
}

/// Bubble-point pressure of an oil with solution GOR `rs`, by the chosen correlation.
///
/// # Formula
/// ```text
/// Standing (1947):
///   Pb = 18.2 [ (Rs/gas_sg)^0.83 * 10^(0.00091 T - 0.0125 API) - 1.4 ]
/// Vasquez–Beggs (1980), gas_sg at 100 psig (see vasquez_beggs_gas_sg_100psig):
///   Pb = [ Rs / (C1 gas_sg exp(C3 API / TR)) ]^(1/C2)
///   API <= 30: C1 = 0.0362, C2 = 1.0937, C3 = 25.7240
///   API  > 30: C1 = 0.0178, C2 = 1.1870, C3 = 23.931
/// Glaso (1980):
///   log Pb = 1.7669 + 1.7447 log Pb* - 0.30218 (log Pb*)^2
///   Pb* = (Rs/gas_sg)^0.816 T^0.172 / API^0.989
/// Petrosky–Farshad (1993):
///   Pb = 112.727 [ Rs^0.5774 / (gas_sg^0.8439 10^X) - 12.340 ]
///   X = 7.916e-4 API^1.5410 - 4.561e-5 T^1.3911
/// Al-Marhoun (1988):
///   Pb = 5.38088e-3 Rs^0.715082 gas_sg^-1.87784 oil_sg^3.1437 TR^1.32657
/// ```
/// T in degF, TR = T + 459.67 in degR, log = log10, oil_sg = 141.5/(API + 131.5).
///
/// Published accuracy on the authors' data (from memory): Standing 4.8 % average absolute
/// error (105 California oils); Vasquez–Beggs (as Rs) about 12.7 % average absolute error
/// (about 6000 points worldwide); Glaso 1.28 % average error, 6.98 % standard deviation
/// (45 North Sea oils); Petrosky–Farshad 3.28 % average absolute error (Gulf of Mexico);
/// Al-Marhoun 3.66 % average absolute error (69 Middle East oils). The data ranges are in
/// [`bubble_point_ranges`]; outside them the value is still computed.
///
/// # Arguments
/// * `method` - the correlation.
/// * `rs` - solution gas-oil ratio at the bubble point, scf/STB, >= 0.
/// * `gas_sg` - dissolved (separator) gas specific gravity, air = 1, > 0.
/// * `api` - stock-tank oil gravity, degAPI, > 0.
/// * `t_f` - reservoir temperature, degF (Glaso needs > 0 degF).
///
/// # Returns
/// Bubble-point pressure, psia.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `rs`, `gas_sg`, `api` or `temperature_f` for
/// impossible inputs, or naming `rs` when the correlation gives no positive bubble point
/// (Standing and Petrosky–Farshad at very small Rs) or leaves its increasing branch (Glaso at
/// very large Rs).
///
/// # Examples
/// ```
/// use stocktank::oil::{bubble_point, PbMethod};
/// // Oil 1 of the six-oil example set in Ahmed, Reservoir Engineering Handbook (2006),
/// // ch. 2 (from memory): Rs 751 scf/STB, gas_sg 0.851, 47.1 API, 250 degF; Standing's
/// // correlation gives 2181 psia there (measured 2377 psia).
/// let pb = bubble_point(PbMethod::Standing, 751.0, 0.851, 47.1, 250.0).unwrap();
/// assert!((pb - 2181.0).abs() < 2.0);
/// ```
///
/// # References
/// - Standing, M.B. (1947). A pressure-volume-temperature correlation for mixtures of
///   California oils and gases. Drilling and Production Practice, API, 275–287.
/// - Vasquez, M., Beggs, H.D. (1980). Correlations for fluid physical property prediction.
///   Journal of Petroleum Technology 32(6), 968–970.
/// - Glaso, O. (1980). Generalized pressure-volume-temperature correlations. Journal of
///   Petroleum Technology 32(5), 785–795.
/// - Petrosky, G.E., Farshad, F.F. (1993). Pressure-volume-temperature correlations for Gulf
///   of Mexico crude oils. SPE Annual Technical Conference, SPE-26644-MS.
/// - Al-Marhoun, M.A. (1988). PVT correlations for Middle East crude oils. Journal of
///   Petroleum Technology 40(5), 650–666.
#[inline]
pub fn bubble_point(method: PbMethod, rs: f64, gas_sg: f64, api: f64, t_f: f64) -> Result<f64> {
    non_negative("rs", rs)?;
    check_common(gas_sg, api, t_f)?;
    let pb = match method {
        PbMethod::Standing => {
            let a = 0.00091 * t_f - 0.0125 * api;
            18.2 * ((rs / gas_sg).powf(0.83) * 10f64.powf(a) - 1.4)
        }
        PbMethod::VasquezBeggs => {
            let (c1, c2, c3) = vb_coefficients(api);
            (rs / (c1 * gas_sg * (c3 * api / f_to_r(t_f)).exp())).powf(1.0 / c2)
        }
        PbMethod::Glaso => {
            positive("temperature_f", t_f)?;
            if rs == 0.0 {
                0.0
            } else {
                let x = ((rs / gas_sg).powf(0.816) * t_f.powf(0.172) / api.powf(0.989)).log10();
                if x > G1 / (2.0 * G2) {
                    return Err(Error::invalid(
                        "rs",
                        rs,
                        "too large for Glaso's correlation (beyond the maximum of its quadratic)",
                    ));
                }
                10f64.powf(G0 + G1 * x - G2 * x * x)
            }
        }
        PbMethod::PetroskyFarshad => {
            let x = 7.916e-4 * api.powf(1.5410) - 4.561e-5 * t_f.powf(1.3911);
            112.727 * (rs.powf(0.5774) / (gas_sg.powf(0.8439) * 10f64.powf(x)) - 12.340)
        }
        PbMethod::AlMarhoun => {
            let oil_sg = super::sg_from_api(api)?;
            AM_A * rs.powf(AM_B) * gas_sg.powf(AM_C) * oil_sg.powf(AM_D) * f_to_r(t_f).powf(AM_E)
        }
    };
    if pb > 0.0 || (rs == 0.0 && pb == 0.0) {
        Ok(pb)
    } else {
        Err(Error::invalid(
            "rs",
            rs,
            "too small for this correlation: it gives no positive bubble point",
        ))
    }
}

/// Solution gas-oil ratio of an oil saturated at pressure `p`: the exact inverse of
/// [`bubble_point`] with the same correlation.
///
/// # Formula
/// ```text
/// Standing:          Rs = gas_sg [ (p/18.2 + 1.4) 10^(0.0125 API - 0.00091 T) ]^(1/0.83)
/// Vasquez–Beggs:     Rs = C1 gas_sg p^C2 exp(C3 API / TR)
/// Glaso:             log Pb* = [1.7447 - sqrt(1.7447^2 - 4 (0.30218)(log p - 1.7669))] / (2 (0.30218))
///                    Rs = gas_sg (Pb* API^0.989 / T^0.172)^(1/0.816)
/// Petrosky–Farshad:  Rs = [ (p/112.727 + 12.340) gas_sg^0.8439 10^X ]^(1/0.5774)
/// Al-Marhoun:        Rs = [ p / (5.38088e-3 gas_sg^-1.87784 oil_sg^3.1437 TR^1.32657) ]^(1/0.715082)
/// ```
/// Symbols as in [`bubble_point`]. Glaso's inverse is the root of his quadratic on its
/// increasing branch (the published 2.8869 - (14.1811 - 3.3093 log p)^0.5 to rounding).
///
/// # Arguments
/// * `method` - the correlation.
/// * `p` - pressure, psia, > 0 (Glaso: at most about 19,280 psia, the top of his quadratic).
/// * `gas_sg`, `api`, `t_f` - as in [`bubble_point`].
///
/// # Returns
/// Solution GOR of the saturated oil at `p`, scf/STB. Standing and Petrosky–Farshad give a
/// small positive Rs as p tends to 0 (a property of the fitted forms).
///
/// # Errors
/// [`Error::InvalidArgument`] naming `p`, `gas_sg`, `api` or `temperature_f`.
///
/// # Examples
/// ```
/// use stocktank::oil::{bubble_point, solution_gor, PbMethod};
/// for m in PbMethod::ALL {
///     let pb = bubble_point(*m, 600.0, 0.8, 35.0, 180.0).unwrap();
///     let rs = solution_gor(*m, pb, 0.8, 35.0, 180.0).unwrap();
///     assert!((rs - 600.0).abs() < 1e-9 * 600.0);
/// }
/// ```
///
/// # References
/// As [`bubble_point`].
#[inline]
pub fn solution_gor(method: PbMethod, p: f64, gas_sg: f64, api: f64, t_f: f64) -> Result<f64> {
    positive("p", p)?;
    check_common(gas_sg, api, t_f)?;
    Ok(match method {
        PbMethod::Standing => StandingRs::new(gas_sg, api, t_f).at(p),
        PbMethod::VasquezBeggs => {
            let (c1, c2, c3) = vb_coefficients(api);
            c1 * gas_sg * p.powf(c2) * (c3 * api / f_to_r(t_f)).exp()
        }
        PbMethod::Glaso => {
            positive("temperature_f", t_f)?;
            let disc = G1 * G1 - 4.0 * G2 * (p.log10() - G0);
            if disc < 0.0 {
                return Err(Error::invalid(
                    "p",
                    p,
                    "above the maximum pressure of Glaso's correlation (about 19,280 psia)",
                ));
            }
            let x = (G1 - disc.sqrt()) / (2.0 * G2);
            gas_sg * (10f64.powf(x) * api.powf(0.989) / t_f.powf(0.172)).powf(1.0 / 0.816)
        }
        PbMethod::PetroskyFarshad => {
            let x = 7.916e-4 * api.powf(1.5410) - 4.561e-5 * t_f.powf(1.3911);
            ((p / 112.727 + 12.340) * gas_sg.powf(0.8439) * 10f64.powf(x)).powf(1.0 / 0.5774)
        }
        PbMethod::AlMarhoun => {
            let oil_sg = super::sg_from_api(api)?;
            let k = AM_A * gas_sg.powf(AM_C) * oil_sg.powf(AM_D) * f_to_r(t_f).powf(AM_E);
            (p / k).powf(1.0 / AM_B)
        }
    })
}

/// Standing's (1947) saturated solution GOR of one oil with the per-oil factor hoisted out of
/// the pressure loop: the one implementation of Standing's Rs(p) behind [`solution_gor`].
///
/// Rs = gas_sg [(p/18.2 + 1.4) 10^a]^(1/0.83) = gas_sg exp((ln(p/18.2 + 1.4) + a ln 10) / 0.83),
/// a = 0.0125 API - 0.00091 T: one logarithm and one exponential per pressure.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct StandingRs {
    gas_sg: f64,
    a_ln10: f64,
}

impl StandingRs {
    /// The oil (gas_sg air = 1, api degAPI, t_f degF; validated by the caller).
    #[inline]
    pub(crate) fn new(gas_sg: f64, api: f64, t_f: f64) -> Self {
        Self {
            gas_sg,
            a_ln10: (0.0125 * api - 0.00091 * t_f) * std::f64::consts::LN_10,
        }
    }

    /// Rs at `p` (psia, > 0, checked by the caller), scf/STB.
    #[inline(always)]
    pub(crate) fn at(&self, p: f64) -> f64 {
        self.at_with::<fastmath::System>(p)
    }

    /// [`StandingRs::at`] with the exponential and logarithm of `M` (the one formula; the
    /// table builder runs it over a column with [`fastmath::Lanes`]).
    #[inline(always)]
    pub(crate) fn at_with<M: fastmath::Elementary>(&self, p: f64) -> f64 {
        self.gas_sg * M::exp((M::ln(p / 18.2 + 1.4) + self.a_ln10) * (1.0 / 0.83))
    }
}

/// Pressure derivative of the saturated solution GOR, dRs/dp, in closed form (the derivative
/// of [`solution_gor`] with the same correlation).
///
/// # Formula
/// ```text
/// Standing:          dRs/dp = Rs / (0.83 (p + 18.2 * 1.4))
/// Vasquez–Beggs:     dRs/dp = C2 Rs / p
/// Glaso:             dRs/dp = Rs / (0.816 p sqrt(1.7447^2 - 4 (0.30218)(log p - 1.7669)))
/// Petrosky–Farshad:  dRs/dp = Rs / (0.5774 (p + 112.727 * 12.340))
/// Al-Marhoun:        dRs/dp = Rs / (0.715082 p)
/// ```
///
/// # Arguments
/// As [`solution_gor`].
///
/// # Returns
/// dRs/dp, scf/STB/psi.
///
/// # Errors
/// As [`solution_gor`].
///
/// # Examples
/// ```
/// use stocktank::oil::{bubble_point::solution_gor_dp, solution_gor, PbMethod};
/// let (p, h) = (2000.0, 1e-3);
/// let fd = (solution_gor(PbMethod::Glaso, p + h, 0.8, 35.0, 180.0).unwrap()
///     - solution_gor(PbMethod::Glaso, p - h, 0.8, 35.0, 180.0).unwrap()) / (2.0 * h);
/// let d = solution_gor_dp(PbMethod::Glaso, p, 0.8, 35.0, 180.0).unwrap();
/// assert!((d / fd - 1.0).abs() < 1e-7);
/// ```
///
/// # References
/// As [`bubble_point`].
#[inline]
pub fn solution_gor_dp(method: PbMethod, p: f64, gas_sg: f64, api: f64, t_f: f64) -> Result<f64> {
    let rs = solution_gor(method, p, gas_sg, api, t_f)?;
    Ok(solution_gor_dp_given(method, p, rs, api))
}

/// dRs/dp from the already computed `rs = solution_gor(method, p, ..)` (no transcendental
/// call except Glaso's square root and logarithm).
#[inline]
pub(crate) fn solution_gor_dp_given(method: PbMethod, p: f64, rs: f64, api: f64) -> f64 {
    match method {
        PbMethod::Standing => rs / (0.83 * (p + 18.2 * 1.4)),
        PbMethod::VasquezBeggs => vb_coefficients(api).1 * rs / p,
        PbMethod::Glaso => {
            let disc = G1 * G1 - 4.0 * G2 * (p.log10() - G0);
            rs / (0.816 * p * disc.sqrt())
        }
        PbMethod::PetroskyFarshad => rs / (0.5774 * (p + 112.727 * 12.340)),
        PbMethod::AlMarhoun => rs / (AM_B * p),
    }
}

/// The ranges of the data each bubble-point correlation was fitted to (from memory of the
/// original papers, as tabulated in McCain 1990 and Ahmed 2006): arguments `rs` (scf/STB),
/// `gas_sg`, `api` (degAPI), `temperature_f` (degF) and the resulting `pb` (psia).
///
/// # Examples
/// ```
/// use stocktank::oil::{bubble_point::bubble_point_ranges, PbMethod};
/// let r = bubble_point_ranges(PbMethod::Standing);
/// assert!(r.iter().any(|v| v.arg == "api" && v.min == 16.5));
/// ```
///
/// # References
/// McCain, W.D. (1990). The Properties of Petroleum Fluids, 2nd ed. PennWell; Ahmed, T.
/// (2006). Reservoir Engineering Handbook, 3rd ed., ch. 2. Gulf Professional Publishing.
pub fn bubble_point_ranges(method: PbMethod) -> &'static [ValidRange] {
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
        PbMethod::Standing => &[
            r!("rs", 20.0, 1425.0),
            r!("gas_sg", 0.59, 0.95),
            r!("api", 16.5, 63.8),
            r!("temperature_f", 100.0, 258.0),
            r!("pb", 130.0, 7000.0),
        ],
        PbMethod::VasquezBeggs => &[
            r!("rs", 0.0, 2199.0),
            r!("gas_sg", 0.511, 1.351),
            r!("api", 15.3, 59.5),
            r!("temperature_f", 75.0, 294.0),
            r!("pb", 15.0, 6055.0),
        ],
        PbMethod::Glaso => &[
            r!("rs", 90.0, 2637.0),
            r!("gas_sg", 0.650, 1.276),
            r!("api", 22.3, 48.1),
            r!("temperature_f", 80.0, 280.0),
            r!("pb", 165.0, 7142.0),
        ],
        PbMethod::PetroskyFarshad => &[
            r!("rs", 217.0, 1406.0),
            r!("gas_sg", 0.5781, 0.8519),
            r!("api", 16.3, 45.0),
            r!("temperature_f", 114.0, 288.0),
            r!("pb", 1574.0, 6523.0),
        ],
        PbMethod::AlMarhoun => &[
            r!("rs", 26.0, 1602.0),
            r!("gas_sg", 0.752, 1.367),
            r!("api", 19.4, 44.6),
            r!("temperature_f", 74.0, 240.0),
            r!("pb", 130.0, 3573.0),
        ],
    }
}

/// Whether `rs`, `gas_sg`, `api`, `t_f` and the resulting bubble point all lie inside the
/// ranges of the data the correlation was fitted to ([`bubble_point_ranges`]).
///
/// Returns `false` for NaN or invalid inputs as well.
///
/// # Examples
/// ```
/// use stocktank::oil::{bubble_point_in_range, PbMethod};
/// assert!(bubble_point_in_range(PbMethod::Standing, 500.0, 0.75, 35.0, 180.0));
/// assert!(!bubble_point_in_range(PbMethod::Standing, 500.0, 0.75, 35.0, 350.0));
/// ```
///
/// # References
/// As [`bubble_point_ranges`].
pub fn bubble_point_in_range(method: PbMethod, rs: f64, gas_sg: f64, api: f64, t_f: f64) -> bool {
    let Ok(pb) = bubble_point(method, rs, gas_sg, api, t_f) else {
        return false;
    };
    bubble_point_ranges(method).iter().all(|r| {
        let v = match r.arg {
            "rs" => rs,
            "gas_sg" => gas_sg,
            "api" => api,
            "temperature_f" => t_f,
            _ => pb,
        };
        r.contains(v)
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn round_trips_all_methods() {
        for m in PbMethod::ALL {
            for &(rs, g, api, t) in &[
                (150.0, 0.65, 25.0, 120.0),
                (800.0, 0.9, 40.0, 220.0),
                (1500.0, 0.75, 30.0, 160.0),
            ] {
                let pb = bubble_point(*m, rs, g, api, t).unwrap();
                let back = solution_gor(*m, pb, g, api, t).unwrap();
                assert!((back - rs).abs() < 1e-9 * rs, "{m}: {back} vs {rs}");
                let rs2 = solution_gor(*m, 2000.0, g, api, t).unwrap();
                let p2 = bubble_point(*m, rs2, g, api, t).unwrap();
                assert!((p2 - 2000.0).abs() < 1e-8, "{m}");
            }
        }
    }

    #[test]
    fn glaso_inverse_matches_published_constants() {
        // Glaso (1980) prints log Pb* = 2.8869 - (14.1811 - 3.3093 log p)^0.5.
        for p in [500.0, 2000.0, 5000.0] {
            let x: f64 = (G1 - (G1 * G1 - 4.0 * G2 * (f64::log10(p) - G0)).sqrt()) / (2.0 * G2);
            let published = 2.8869 - (14.1811 - 3.3093 * f64::log10(p)).sqrt();
            assert!((x - published).abs() < 2e-4, "{x} {published}");
        }
    }

    #[test]
    fn invalid_inputs_name_argument() {
        let e = bubble_point(PbMethod::Standing, -1.0, 0.7, 30.0, 150.0).unwrap_err();
        assert!(e.to_string().contains("`rs`"));
        let e = solution_gor(PbMethod::Glaso, 1e6, 0.7, 30.0, 150.0).unwrap_err();
        assert!(e.to_string().contains("`p`"));
        let e = bubble_point(PbMethod::Standing, 1.0, 0.7, 30.0, 150.0).unwrap_err();
        assert!(e.to_string().contains("`rs`"));
    }
}
