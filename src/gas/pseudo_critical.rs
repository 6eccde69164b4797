//! Pseudo-critical temperature and pressure of natural gas: from gas specific gravity
//! (Sutton 1985; Standing 1977, natural-gas and condensate-gas curves), from a composition
//! (Kay 1936 with a component table and Riazi–Daubert 1987 for the C7+ fraction), and the
//! corrections for non-hydrocarbons (Wichert–Aziz 1972 for CO2 and H2S; Carr–Kobayashi–
//! Burrows 1954 for N2, CO2 and H2S; or Kay mixing of the hydrocarbon part with the
//! impurities).
//!
//! Temperatures are in degR, pressures in psia, gravities relative to air (gas) or water at
//! 60 degF (liquid C7+).

use crate::error::{Error, Result, fraction, positive};
use crate::units::AIR_MOLAR_MASS;

/// Pseudo-critical temperature (degR) and pressure (psia) of a gas.
///
/// # Examples
/// ```
/// let pc = stocktank::gas::sutton(0.7).unwrap();
/// assert!(pc.tpc_r > 300.0 && pc.ppc_psia > 600.0);
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PseudoCritical {
    /// Pseudo-critical temperature, degR.
    pub tpc_r: f64,
    /// Pseudo-critical pressure, psia.
    pub ppc_psia: f64,
}

/// Correlation of pseudo-critical properties from gas specific gravity.
///
/// # Examples
/// ```
/// use stocktank::gas::GravityCorrelation;
/// assert_eq!(GravityCorrelation::default(), GravityCorrelation::Sutton);
/// ```
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum GravityCorrelation {
    /// Sutton (1985), the default.
    #[default]
    Sutton,
    /// Standing (1977), natural-gas (dry gas) curve.
    StandingNatural,
    /// Standing (1977), condensate-gas (wet gas) curve.
    StandingCondensate,
}

impl GravityCorrelation {
    /// Parse `"sutton"`, `"standing_natural"` or `"standing_condensate"`.
    ///
    /// # Errors
    /// [`Error::InvalidOption`] naming `pseudo_critical`.
    ///
    /// # Examples
    /// ```
    /// use stocktank::gas::GravityCorrelation;
    /// assert_eq!(GravityCorrelation::parse("sutton").unwrap(), GravityCorrelation::Sutton);
    /// ```
    pub fn parse(s: &str) -> Result<Self> {
        match s {
            "sutton" => Ok(Self::Sutton),
            "standing_natural" => Ok(Self::StandingNatural),
            "standing_condensate" => Ok(Self::StandingCondensate),
            _ => Err(Error::InvalidOption {
                arg: "pseudo_critical",
                value: s.to_string(),
                allowed: "sutton, standing_natural, standing_condensate",
            }),
        }
    }

    /// The option name accepted by [`GravityCorrelation::parse`].
    ///
    /// # Examples
    /// ```
    /// assert_eq!(stocktank::gas::GravityCorrelation::Sutton.name(), "sutton");
    /// ```
    pub fn name(&self) -> &'static str {
        match self {
            Self::Sutton => "sutton",
            Self::StandingNatural => "standing_natural",
            Self::StandingCondensate => "standing_condensate",
        }
    }

    /// Pseudo-critical properties of a gas of specific gravity `gas_sg` by this correlation.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `gas_sg` when it is not finite and > 0.
    ///
    /// # Examples
    /// ```
    /// use stocktank::gas::GravityCorrelation;
    /// let pc = GravityCorrelation::Sutton.eval(0.7).unwrap();
    /// assert!((pc.tpc_r - 377.59).abs() < 0.01);
    /// ```
    #[inline]
    pub fn eval(&self, gas_sg: f64) -> Result<PseudoCritical> {
        match self {
            Self::Sutton => sutton(gas_sg),
            Self::StandingNatural => standing_natural(gas_sg),
            Self::StandingCondensate => standing_condensate(gas_sg),
        }
    }

    /// Whether `gas_sg` lies in the range of the correlation's data.
    ///
    /// Sutton (1985): 0.57 to 1.68 (264 gas samples; from memory). Standing (1977) curves:
    /// 0.57 to 1.7 (from memory; the curves were drawn over the gravity range of
    /// California natural and condensate gases).
    ///
    /// # Examples
    /// ```
    /// use stocktank::gas::GravityCorrelation;
    /// assert!(GravityCorrelation::Sutton.in_range(0.7));
    /// assert!(!GravityCorrelation::Sutton.in_range(2.5));
    /// ```
    #[inline]
    pub fn in_range(&self, gas_sg: f64) -> bool {
        match self {
            Self::Sutton => (0.57..=1.68).contains(&gas_sg),
            _ => (0.57..=1.7).contains(&gas_sg),
        }
    }
}

/// Sutton (1985) pseudo-critical properties from gas specific gravity.
///
/// # Formula
/// ```text
/// Tpc = 169.2 + 349.5 g - 74.0 g^2      (degR)
/// Ppc = 756.8 - 131.0 g -  3.6 g^2      (psia)
/// ```
/// with g the gas specific gravity (air = 1) of the hydrocarbon gas.
///
/// # Arguments
/// * `gas_sg` - gas specific gravity, air = 1, > 0 (data range 0.57 to 1.68).
///
/// # Returns
/// Tpc in degR and Ppc in psia.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `gas_sg` when it is not finite and > 0.
///
/// # Examples
/// ```
/// let pc = stocktank::gas::sutton(0.65).unwrap();
/// assert!((pc.tpc_r - 365.1).abs() < 0.1 && (pc.ppc_psia - 670.1).abs() < 0.1);
/// ```
///
/// # References
/// Sutton, R.P. (1985). Compressibility factors for high-molecular-weight reservoir gases.
/// SPE 14265, SPE Annual Technical Conference, Las Vegas.
#[inline]
pub fn sutton(gas_sg: f64) -> Result<PseudoCritical> {
    let g = positive("gas_sg", gas_sg)?;
    Ok(PseudoCritical {
        tpc_r: 169.2 + 349.5 * g - 74.0 * g * g,
        ppc_psia: 756.8 - 131.0 * g - 3.6 * g * g,
    })
}

/// Standing (1977) pseudo-critical properties, natural-gas (dry gas) curve.
///
/// # Formula
/// ```text
/// Tpc = 168 + 325 g - 12.5 g^2     (degR)
/// Ppc = 677 + 15.0 g - 37.5 g^2    (psia)
/// ```
///
/// # Arguments
/// * `gas_sg` - gas specific gravity, air = 1, > 0.
///
/// # Returns
/// Tpc in degR and Ppc in psia.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `gas_sg` when it is not finite and > 0.
///
/// # Examples
/// ```
/// let pc = stocktank::gas::standing_natural(0.7).unwrap();
/// assert!((pc.tpc_r - 389.375).abs() < 1e-9);
/// ```
///
/// # References
/// Standing, M.B. (1977). Volumetric and Phase Behavior of Oil Field Hydrocarbon Systems.
/// SPE, Dallas (the curve fits as usually quoted, e.g. Ahmed 2006, Reservoir Engineering
/// Handbook, from memory).
#[inline]
pub fn standing_natural(gas_sg: f64) -> Result<PseudoCritical> {
    let g = positive("gas_sg", gas_sg)?;
    Ok(PseudoCritical {
        tpc_r: 168.0 + 325.0 * g - 12.5 * g * g,
        ppc_psia: 677.0 + 15.0 * g - 37.5 * g * g,
    })
}

/// Standing (1977) pseudo-critical properties, condensate-gas (wet gas) curve.
///
/// # Formula
/// ```text
/// Tpc = 187 + 330 g - 71.5 g^2     (degR)
/// Ppc = 706 - 51.7 g - 11.1 g^2    (psia)
/// ```
///
/// # Arguments
/// * `gas_sg` - gas specific gravity (reservoir gas), air = 1, > 0.
///
/// # Returns
/// Tpc in degR and Ppc in psia.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `gas_sg` when it is not finite and > 0.
///
/// # Examples
/// ```
/// let pc = stocktank::gas::standing_condensate(1.0).unwrap();
/// assert!((pc.tpc_r - 445.5).abs() < 1e-9 && (pc.ppc_psia - 643.2).abs() < 1e-9);
/// ```
///
/// # References
/// Standing, M.B. (1977). Volumetric and Phase Behavior of Oil Field Hydrocarbon Systems.
/// SPE, Dallas (curve fits as usually quoted, from memory).
#[inline]
pub fn standing_condensate(gas_sg: f64) -> Result<PseudoCritical> {
    let g = positive("gas_sg", gas_sg)?;
    Ok(PseudoCritical {
        tpc_r: 187.0 + 330.0 * g - 71.5 * g * g,
        ppc_psia: 706.0 - 51.7 * g - 11.1 * g * g,
    })
}

/// Check the three impurity mole fractions: each in [0, 1], sum <= 1.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `co2`, `h2s` or `n2`.
///
/// # Examples
/// ```
/// assert!(stocktank::gas::check_impurities(0.1, 0.05, 0.02).is_ok());
/// assert!(stocktank::gas::check_impurities(0.6, 0.5, 0.0).is_err());
/// ```
#[inline]
pub fn check_impurities(co2: f64, h2s: f64, n2: f64) -> Result<()> {
    fraction("co2", co2)?;
    fraction("h2s", h2s)?;
    fraction("n2", n2)?;
    if co2 + h2s + n2 > 1.0 + 1e-12 {
        // Name the last non-zero fraction: callers without an `n2` argument (Wichert–Aziz)
        // must not be told about one.
        let (arg, value) = if n2 > 0.0 {
            ("n2", n2)
        } else if h2s > 0.0 {
            ("h2s", h2s)
        } else {
            ("co2", co2)
        };
        return Err(Error::invalid(
            arg,
            value,
            "mole fractions co2 + h2s + n2 must not sum above 1",
        ));
    }
    Ok(())
}

/// Wichert–Aziz (1972) correction of pseudo-critical properties for CO2 and H2S.
///
/// # Formula
/// ```text
/// A = y_CO2 + y_H2S,  B = y_H2S
/// eps  = 120 (A^0.9 - A^1.6) + 15 (B^0.5 - B^4)        (degR)
/// Tpc' = Tpc - eps
/// Ppc' = Ppc Tpc' / (Tpc + B (1 - B) eps)
/// ```
///
/// # Arguments
/// * `pc` - uncorrected pseudo-criticals (degR, psia), e.g. by Kay's rule or a gravity
///   correlation.
/// * `co2`, `h2s` - mole fractions, in [0, 1], sum <= 1. Data range of the method: CO2 up to
///   54.4 mol%, H2S up to 73.8 mol% (from memory).
///
/// # Returns
/// Corrected Tpc (degR) and Ppc (psia).
///
/// # Errors
/// [`Error::InvalidArgument`] naming `co2` or `h2s` when outside [0, 1] or summing above 1.
///
/// # Examples
/// ```
/// use stocktank::gas::{wichert_aziz, PseudoCritical};
/// let pc = PseudoCritical { tpc_r: 400.0, ppc_psia: 700.0 };
/// assert_eq!(wichert_aziz(pc, 0.0, 0.0).unwrap(), pc);
/// assert!(wichert_aziz(pc, 0.1, 0.2).unwrap().tpc_r < 400.0);
/// ```
///
/// # References
/// Wichert, E., Aziz, K. (1972). Calculate Z's for sour gases. Hydrocarbon Processing 51(5),
/// 119–122.
#[inline]
pub fn wichert_aziz(pc: PseudoCritical, co2: f64, h2s: f64) -> Result<PseudoCritical> {
    check_impurities(co2, h2s, 0.0)?;
    let a = co2 + h2s;
    let b = h2s;
    if a == 0.0 {
        return Ok(pc);
    }
    let eps = 120.0 * (a.powf(0.9) - a.powf(1.6)) + 15.0 * (b.sqrt() - b.powi(4));
    let tpc = pc.tpc_r - eps;
    Ok(PseudoCritical {
        tpc_r: tpc,
        ppc_psia: pc.ppc_psia * tpc / (pc.tpc_r + b * (1.0 - b) * eps),
    })
}

/// Carr–Kobayashi–Burrows (1954) correction of pseudo-critical properties for N2, CO2, H2S.
///
/// # Formula
/// ```text
/// Tpc' = Tpc - 80 y_CO2 + 130 y_H2S - 250 y_N2      (degR)
/// Ppc' = Ppc + 440 y_CO2 + 600 y_H2S - 170 y_N2     (psia)
/// ```
///
/// # Arguments
/// * `pc` - pseudo-criticals of the gas from its gravity (degR, psia).
/// * `co2`, `h2s`, `n2` - mole fractions in [0, 1], sum <= 1.
///
/// # Returns
/// Corrected Tpc (degR) and Ppc (psia).
///
/// # Errors
/// [`Error::InvalidArgument`] naming the fraction outside [0, 1] (or the last non-zero one
/// if they sum above 1).
///
/// # Examples
/// ```
/// use stocktank::gas::{carr_kobayashi_burrows_correction, PseudoCritical};
/// let pc = PseudoCritical { tpc_r: 400.0, ppc_psia: 700.0 };
/// let c = carr_kobayashi_burrows_correction(pc, 0.0, 0.0, 0.1).unwrap();
/// assert!((c.tpc_r - 375.0).abs() < 1e-12 && (c.ppc_psia - 683.0).abs() < 1e-12);
/// ```
///
/// # References
/// Carr, N.L., Kobayashi, R., Burrows, D.B. (1954). Viscosity of hydrocarbon gases under
/// pressure. Trans. AIME 201, 264–272 (correction as quoted by Ahmed 2006; from memory).
#[inline]
pub fn carr_kobayashi_burrows_correction(
    pc: PseudoCritical,
    co2: f64,
    h2s: f64,
    n2: f64,
) -> Result<PseudoCritical> {
    check_impurities(co2, h2s, n2)?;
    Ok(PseudoCritical {
        tpc_r: pc.tpc_r - 80.0 * co2 + 130.0 * h2s - 250.0 * n2,
        ppc_psia: pc.ppc_psia + 440.0 * co2 + 600.0 * h2s - 170.0 * n2,
    })
}

/// One pure component of the Kay mixing table: molar mass and critical constants.
///
/// # Examples
/// ```
/// let c1 = stocktank::gas::COMPONENTS[3];
/// assert_eq!(c1.name, "c1");
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Component {
    /// Short name (`"n2"`, `"co2"`, `"c1"`, ...).
    pub name: &'static str,
    /// Molar mass, lbm/lbmol.
    pub molar_mass: f64,
    /// Critical temperature, degR.
    pub tc_r: f64,
    /// Critical pressure, psia.
    pub pc_psia: f64,
}

/// The component table of Kay's rule, in the order N2, CO2, H2S, C1, C2, C3, iC4, nC4, iC5,
/// nC5, C6 (normal hexane).
///
/// Critical constants and molar masses as tabulated in the GPSA Engineering Data Book
/// (1987), Fig. 23-2 (from memory; each value is checked against CoolProp's critical point
/// within 0.5 % in the tests).
///
/// # Examples
/// ```
/// assert_eq!(stocktank::gas::COMPONENTS[1].name, "co2");
/// ```
pub const COMPONENTS: [Component; 11] = [
    Component {
        name: "n2",
        molar_mass: 28.0134,
        tc_r: 227.16,
        pc_psia: 493.1,
    },
    Component {
        name: "co2",
        molar_mass: 44.010,
        tc_r: 547.58,
        pc_psia: 1071.0,
    },
    Component {
        name: "h2s",
        molar_mass: 34.082,
        tc_r: 672.12,
        pc_psia: 1300.0,
    },
    Component {
        name: "c1",
        molar_mass: 16.043,
        tc_r: 343.01,
        pc_psia: 666.4,
    },
    Component {
        name: "c2",
        molar_mass: 30.070,
        tc_r: 549.59,
        pc_psia: 706.5,
    },
    Component {
        name: "c3",
        molar_mass: 44.097,
        tc_r: 665.73,
        pc_psia: 616.0,
    },
    Component {
        name: "ic4",
        molar_mass: 58.123,
        tc_r: 734.13,
        pc_psia: 527.9,
    },
    Component {
        name: "nc4",
        molar_mass: 58.123,
        tc_r: 765.29,
        pc_psia: 550.6,
    },
    Component {
        name: "ic5",
        molar_mass: 72.150,
        tc_r: 828.77,
        pc_psia: 490.4,
    },
    Component {
        name: "nc5",
        molar_mass: 72.150,
        tc_r: 845.47,
        pc_psia: 488.6,
    },
    Component {
        name: "c6",
        molar_mass: 86.177,
        tc_r: 913.27,
        pc_psia: 436.9,
    },
];

/// Names of the composition inputs of [`kay`], in order (the C7+ fraction last).
///
/// # Examples
/// ```
/// assert_eq!(stocktank::gas::COMPOSITION_NAMES[11], "c7plus");
/// ```
pub const COMPOSITION_NAMES: [&str; 12] = [
    "n2", "co2", "h2s", "c1", "c2", "c3", "ic4", "nc4", "ic5", "nc5", "c6", "c7plus",
];

/// Riazi–Daubert (1987) critical temperature and pressure of a petroleum fraction from its
/// molar mass and specific gravity.
///
/// # Formula
/// ```text
/// theta = a M^b g^c exp(d M + e g)
/// Tc (degR):  a = 544.4,    b = 0.2998,  c = 1.0555, d = -1.3478e-4, e = -0.61641
/// Pc (psia):  a = 4.5203e4, b = -0.8063, c = 1.6015, d = -1.8078e-3, e = -0.3084
/// ```
///
/// # Arguments
/// * `molar_mass` - molar mass of the fraction, lbm/lbmol, > 0 (data range 70 to 700).
/// * `sg` - liquid specific gravity at 60/60 degF, > 0 (data range 0.63 to 0.97).
///
/// # Returns
/// Tc in degR and Pc in psia.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `c7plus_mw` or `c7plus_sg`.
///
/// # Examples
/// ```
/// // n-heptane (M = 100.2, g = 0.688): Tc = 972.5 degR, Pc = 396.8 psia (GPSA);
/// // the correlation is within a few percent.
/// let c = stocktank::gas::riazi_daubert(100.2, 0.688).unwrap();
/// assert!((c.tpc_r / 972.5 - 1.0).abs() < 0.05 && (c.ppc_psia / 396.8 - 1.0).abs() < 0.05);
/// ```
///
/// # References
/// Riazi, M.R., Daubert, T.E. (1987). Characterization parameters for petroleum fractions.
/// Ind. Eng. Chem. Res. 26(4), 755–759 (coefficients from memory).
#[inline]
pub fn riazi_daubert(molar_mass: f64, sg: f64) -> Result<PseudoCritical> {
    let m = positive("c7plus_mw", molar_mass)?;
    let g = positive("c7plus_sg", sg)?;
    let tc = 544.4 * m.powf(0.2998) * g.powf(1.0555) * (-1.3478e-4 * m - 0.61641 * g).exp();
    let pc = 4.5203e4 * m.powf(-0.8063) * g.powf(1.6015) * (-1.8078e-3 * m - 0.3084 * g).exp();
    Ok(PseudoCritical {
        tpc_r: tc,
        ppc_psia: pc,
    })
}

/// A gas composition for Kay's rule: pseudo-criticals and gravity.
///
/// # Examples
/// ```
/// let mut y = [0.0; 12];
/// y[4] = 1.0;
/// assert!(stocktank::gas::kay(&y, 0.0, 0.0).unwrap().gas_sg > 1.0); // ethane
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct KayResult {
    /// Pseudo-critical temperature and pressure (uncorrected for CO2/H2S), degR and psia.
    pub pc: PseudoCritical,
    /// Gas specific gravity, air = 1 (molar mass / 28.9647).
    pub gas_sg: f64,
}

/// Kay (1936) mixing rule: mole-fraction-weighted critical constants of a composition.
///
/// # Formula
/// ```text
/// Tpc = sum y_i Tc_i,  Ppc = sum y_i Pc_i,  M = sum y_i M_i,  g = M / 28.9647
/// ```
/// The C7+ fraction uses [`riazi_daubert`] for its Tc and Pc.
///
/// # Arguments
/// * `y` - mole fractions in the order of [`COMPOSITION_NAMES`] (N2, CO2, H2S, C1, C2, C3,
///   iC4, nC4, iC5, nC5, C6, C7+), each in [0, 1]; they must sum to 1 within 1e-3 (the
///   function normalises them to exactly 1).
/// * `c7plus_mw` - molar mass of C7+, lbm/lbmol (used when y_C7+ > 0).
/// * `c7plus_sg` - specific gravity of C7+, 60/60 degF (used when y_C7+ > 0).
///
/// # Returns
/// Pseudo-criticals (degR, psia) and the gas specific gravity.
///
/// # Errors
/// [`Error::InvalidArgument`] naming the component outside [0, 1], or `c1` when the sum
/// differs from 1 by more than 1e-3.
///
/// # Examples
/// ```
/// let mut y = [0.0; 12];
/// y[3] = 1.0; // pure methane
/// let k = stocktank::gas::kay(&y, 0.0, 0.0).unwrap();
/// assert!((k.pc.tpc_r - 343.01).abs() < 1e-9);
/// assert!((k.gas_sg - 16.043 / 28.9647).abs() < 1e-12);
/// ```
///
/// # References
/// Kay, W.B. (1936). Density of hydrocarbon gases and vapors at high temperature and
/// pressure. Ind. Eng. Chem. 28(9), 1014–1019.
pub fn kay(y: &[f64; 12], c7plus_mw: f64, c7plus_sg: f64) -> Result<KayResult> {
    let mut sum = 0.0;
    for (i, &v) in y.iter().enumerate() {
        fraction(COMPOSITION_NAMES[i], v)?;
        sum += v;
    }
    if (sum - 1.0).abs() > 1e-3 {
        return Err(Error::invalid(
            "c1",
            y[3],
            "mole fractions must sum to 1 (within 1e-3)",
        ));
    }
    let (mut t, mut p, mut m) = (0.0, 0.0, 0.0);
    for (c, &v) in COMPONENTS.iter().zip(y.iter()) {
        t += v * c.tc_r;
        p += v * c.pc_psia;
        m += v * c.molar_mass;
    }
    if y[11] > 0.0 {
        let plus = riazi_daubert(c7plus_mw, c7plus_sg)?;
        t += y[11] * plus.tpc_r;
        p += y[11] * plus.ppc_psia;
        m += y[11] * c7plus_mw;
    }
    Ok(KayResult {
        pc: PseudoCritical {
            tpc_r: t / sum,
            ppc_psia: p / sum,
        },
        gas_sg: m / sum / AIR_MOLAR_MASS,
    })
}

/// Pseudo-criticals of a gas from its overall gravity and impurities by mixing the
/// hydrocarbon part (its gravity through a gravity correlation) with the pure impurities by
/// Kay's rule.
///
/// # Formula
/// ```text
/// y_i = y_N2 + y_CO2 + y_H2S
/// g_hc = (g - (y_N2 M_N2 + y_CO2 M_CO2 + y_H2S M_H2S) / 28.9647) / (1 - y_i)
/// Tpc = (1 - y_i) Tpc_hc(g_hc) + sum y_j Tc_j,  Ppc likewise
/// ```
/// The caller then applies [`wichert_aziz`] for CO2 and H2S.
///
/// # Arguments
/// * `gas_sg` - overall gas specific gravity (air = 1), > 0.
/// * `co2`, `h2s`, `n2` - mole fractions, each in [0, 1], sum < 1.
/// * `correlation` - the gravity correlation for the hydrocarbon part.
///
/// # Returns
/// Tpc (degR) and Ppc (psia) before the Wichert–Aziz correction.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `gas_sg` when the hydrocarbon part would have a
/// gravity <= 0.3 (lighter than any hydrocarbon gas: the impurities are too heavy for the
/// given overall gravity), or a fraction out of range.
///
/// # Examples
/// ```
/// use stocktank::gas::{hydrocarbon_mixing, GravityCorrelation, sutton};
/// let a = hydrocarbon_mixing(0.7, 0.0, 0.0, 0.0, GravityCorrelation::Sutton).unwrap();
/// assert_eq!(a, sutton(0.7).unwrap());
/// ```
///
/// # References
/// The hydrocarbon-fraction adjustment as presented by Standing (1981), Volumetric and
/// Phase Behavior of Oil Field Hydrocarbon Systems, 9th printing, SPE, and McCain (1990),
/// The Properties of Petroleum Fluids, 2nd ed., PennWell (from memory). Kay (1936).
#[inline]
pub fn hydrocarbon_mixing(
    gas_sg: f64,
    co2: f64,
    h2s: f64,
    n2: f64,
    correlation: GravityCorrelation,
) -> Result<PseudoCritical> {
    positive("gas_sg", gas_sg)?;
    check_impurities(co2, h2s, n2)?;
    let yi = co2 + h2s + n2;
    if yi == 0.0 {
        return correlation.eval(gas_sg);
    }
    if yi >= 1.0 {
        let t = n2 * COMPONENTS[0].tc_r + co2 * COMPONENTS[1].tc_r + h2s * COMPONENTS[2].tc_r;
        let p =
            n2 * COMPONENTS[0].pc_psia + co2 * COMPONENTS[1].pc_psia + h2s * COMPONENTS[2].pc_psia;
        return Ok(PseudoCritical {
            tpc_r: t,
            ppc_psia: p,
        });
    }
    let m_imp = n2 * COMPONENTS[0].molar_mass
        + co2 * COMPONENTS[1].molar_mass
        + h2s * COMPONENTS[2].molar_mass;
    let g_hc = (gas_sg - m_imp / AIR_MOLAR_MASS) / (1.0 - yi);
    if g_hc <= 0.3 || !g_hc.is_finite() {
        return Err(Error::invalid(
            "gas_sg",
            gas_sg,
            "too light for the given impurities (hydrocarbon part would have gravity <= 0.3)",
        ));
    }
    let hc = correlation.eval(g_hc)?;
    Ok(PseudoCritical {
        tpc_r: (1.0 - yi) * hc.tpc_r
            + n2 * COMPONENTS[0].tc_r
            + co2 * COMPONENTS[1].tc_r
            + h2s * COMPONENTS[2].tc_r,
        ppc_psia: (1.0 - yi) * hc.ppc_psia
            + n2 * COMPONENTS[0].pc_psia
            + co2 * COMPONENTS[1].pc_psia
            + h2s * COMPONENTS[2].pc_psia,
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn sutton_at_common_gravities() {
        // Direct evaluation of the published polynomials (Sutton 1985).
        let pc = sutton(0.7).unwrap();
        assert!((pc.tpc_r - (169.2 + 244.65 - 36.26)).abs() < 1e-9);
        assert!((pc.ppc_psia - (756.8 - 91.7 - 1.764)).abs() < 1e-9);
    }

    #[test]
    fn wichert_aziz_lowers_tpc() {
        let pc = PseudoCritical {
            tpc_r: 400.0,
            ppc_psia: 700.0,
        };
        let c = wichert_aziz(pc, 0.1, 0.0).unwrap();
        // eps = 120 (0.1^0.9 - 0.1^1.6) = 120 (0.125893 - 0.025119) = 12.093
        assert!((400.0 - c.tpc_r - 12.093).abs() < 1e-3);
    }
}
