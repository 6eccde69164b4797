//! Gas viscosity: Lee–Gonzalez–Eakin (1966) from density, and Carr–Kobayashi–Burrows (1954)
//! in the Standing (1977) / Dempsey (1965) curve fits.

use crate::error::{Error, Result, fraction, positive, temperature_f};
use crate::fastmath;
use crate::units::{KG_PER_LBM, M3_PER_FT3, RANKINE_OFFSET};

/// Gas viscosity method.
///
/// # Examples
/// ```
/// use stocktank::gas::ViscosityMethod;
/// assert_eq!(ViscosityMethod::default(), ViscosityMethod::LeeGonzalezEakin);
/// ```
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum ViscosityMethod {
    /// Lee–Gonzalez–Eakin (1966), the default.
    #[default]
    LeeGonzalezEakin,
    /// Carr–Kobayashi–Burrows (1954) with the Standing (1977) and Dempsey (1965) fits.
    CarrKobayashiBurrows,
}

impl ViscosityMethod {
    /// Parse `"lee_gonzalez_eakin"` or `"carr_kobayashi_burrows"`.
    ///
    /// # Errors
    /// [`Error::InvalidOption`] naming `viscosity_method`.
    ///
    /// # Examples
    /// ```
    /// use stocktank::gas::ViscosityMethod;
    /// assert!(ViscosityMethod::parse("lee_gonzalez_eakin").is_ok());
    /// ```
    pub fn parse(s: &str) -> Result<Self> {
        match s {
            "lee_gonzalez_eakin" => Ok(Self::LeeGonzalezEakin),
            "carr_kobayashi_burrows" => Ok(Self::CarrKobayashiBurrows),
            _ => Err(Error::InvalidOption {
                arg: "viscosity_method",
                value: s.to_string(),
                allowed: "lee_gonzalez_eakin, carr_kobayashi_burrows",
            }),
        }
    }

    /// The option name accepted by [`ViscosityMethod::parse`].
    ///
    /// # Examples
    /// ```
    /// assert_eq!(stocktank::gas::ViscosityMethod::default().name(), "lee_gonzalez_eakin");
    /// ```
    pub fn name(&self) -> &'static str {
        match self {
            Self::LeeGonzalezEakin => "lee_gonzalez_eakin",
            Self::CarrKobayashiBurrows => "carr_kobayashi_burrows",
        }
    }
}

/// lbm/ft3 in one g/cm3 (62.428), derived from the exact pound and foot.
const LBM_FT3_PER_G_CC: f64 = 1000.0 * M3_PER_FT3 / KG_PER_LBM;

/// Gas viscosity by Lee, Gonzalez and Eakin (1966).
///
/// # Formula
/// ```text
/// K = (9.4 + 0.02 M) T^1.5 / (209 + 19 M + T)
/// X = 3.5 + 986 / T + 0.01 M
/// Y = 2.4 - 0.2 X
/// mu_g = 1e-4 K exp(X rho^Y)          (cp; T in degR, rho in g/cm3, M in lbm/lbmol)
/// ```
///
/// # Arguments
/// * `t_f` - temperature, degF (data range 100 to 340 degF).
/// * `density_lbm_ft3` - gas density at (p, T), lbm/ft3, >= 0.
/// * `molar_mass` - gas molar mass, lbm/lbmol, > 0.
///
/// # Returns
/// Viscosity, cp.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `t_f`, `density_lbm_ft3` or `molar_mass`.
///
/// # Examples
/// ```
/// // Methane at 1 atm and 100 degF: 0.01160 cp (CoolProp 8.0, reference EOS); the
/// // correlation is within its stated few-percent accuracy.
/// let mu = stocktank::gas::viscosity_lee_gonzalez_eakin(100.0, 0.0393, 16.043).unwrap();
/// assert!((mu / 0.01160 - 1.0).abs() < 0.05);
/// ```
///
/// # References
/// Lee, A.L., Gonzalez, M.H., Eakin, B.E. (1966). The viscosity of natural gases.
/// J. Pet. Technol. 18(8), 997–1000.
#[inline]
pub fn viscosity_lee_gonzalez_eakin(
    t_f: f64,
    density_lbm_ft3: f64,
    molar_mass: f64,
) -> Result<f64> {
    let t = temperature_f("t_f", t_f)? + RANKINE_OFFSET;
    if !(density_lbm_ft3 >= 0.0 && density_lbm_ft3.is_finite()) {
        return Err(Error::invalid(
            "density_lbm_ft3",
            density_lbm_ft3,
            "must be finite and >= 0",
        ));
    }
    let m = positive("molar_mass", molar_mass)?;
    Ok(LeeGonzalezEakin::from_rankine(t, m).at_checked_density(density_lbm_ft3))
}

/// Lee–Gonzalez–Eakin (1966) at one fixed temperature and molar mass: K, X and Y (which do
/// not depend on density) computed once, for pressure sweeps. Gives exactly the values of
/// [`viscosity_lee_gonzalez_eakin`].
#[derive(Debug, Clone, Copy)]
pub(crate) struct LeeGonzalezEakin {
    k: f64,
    x: f64,
    y: f64,
}

impl LeeGonzalezEakin {
    /// At `t_f` (degF) and `molar_mass` (lbm/lbmol), with the argument checks of
    /// [`viscosity_lee_gonzalez_eakin`].
    #[inline]
    pub(crate) fn new(t_f: f64, molar_mass: f64) -> Result<Self> {
        let t = temperature_f("t_f", t_f)? + RANKINE_OFFSET;
        let m = positive("molar_mass", molar_mass)?;
        Ok(Self::from_rankine(t, m))
    }

    #[inline(always)]
    fn from_rankine(t: f64, m: f64) -> Self {
        let k = (9.4 + 0.02 * m) * t * t.sqrt() / (209.0 + 19.0 * m + t);
        let x = 3.5 + 986.0 / t + 0.01 * m;
        let y = 2.4 - 0.2 * x;
        LeeGonzalezEakin { k, x, y }
    }

    /// Viscosity, cp, at gas density `density_lbm_ft3` (finite, >= 0, else
    /// [`Error::InvalidArgument`] naming `density_lbm_ft3`).
    #[inline]
    pub(crate) fn viscosity(&self, density_lbm_ft3: f64) -> Result<f64> {
        if !(density_lbm_ft3 >= 0.0 && density_lbm_ft3.is_finite()) {
            return Err(Error::invalid(
                "density_lbm_ft3",
                density_lbm_ft3,
                "must be finite and >= 0",
            ));
        }
        Ok(self.at_checked_density(density_lbm_ft3))
    }

    #[inline(always)]
    fn at_checked_density(&self, density_lbm_ft3: f64) -> f64 {
        self.at_checked_density_with::<fastmath::System>(density_lbm_ft3)
    }

    /// Viscosity, cp, at a density (lbm/ft3) already known to be finite and >= 0, with the
    /// exponential and logarithm of `M` (the one formula; the black-oil table builder runs
    /// it over a column with [`fastmath::Lanes`]).
    #[inline(always)]
    pub(crate) fn at_checked_density_with<M: fastmath::Elementary>(
        &self,
        density_lbm_ft3: f64,
    ) -> f64 {
        // rho^Y as exp(Y ln rho).
        let rho = density_lbm_ft3 / LBM_FT3_PER_G_CC;
        1e-4 * self.k * M::exp(self.x * M::pow_positive(rho, self.y))
    }
}

/// Whether inputs lie in the Lee–Gonzalez–Eakin (1966) data range: 100 to 340 degF and
/// 100 to 8000 psia (four natural gases; from memory).
///
/// # Examples
/// ```
/// assert!(stocktank::gas::lee_gonzalez_eakin_in_range(2000.0, 200.0));
/// ```
#[inline]
pub fn lee_gonzalez_eakin_in_range(p_psia: f64, t_f: f64) -> bool {
    (100.0..=8000.0).contains(&p_psia) && (100.0..=340.0).contains(&t_f)
}

/// Viscosity of natural gas at one atmosphere by Carr–Kobayashi–Burrows (1954), in the
/// curve fit of Standing (1977), with the corrections for N2, CO2 and H2S.
///
/// # Formula
/// ```text
/// mu1 = (1.709e-5 - 2.062e-6 g) T + 8.188e-3 - 6.15e-3 log10 g       (T in degF)
///     + y_N2  (8.48e-3 log10 g + 9.59e-3)
///     + y_CO2 (9.08e-3 log10 g + 6.24e-3)
///     + y_H2S (8.49e-3 log10 g + 3.73e-3)                              (cp)
/// ```
///
/// # Arguments
/// * `t_f` - temperature, degF.
/// * `gas_sg` - gas specific gravity, air = 1, > 0.
/// * `co2`, `h2s`, `n2` - mole fractions in [0, 1].
///
/// # Returns
/// Viscosity at one atmosphere, cp.
///
/// # Errors
/// [`Error::InvalidArgument`] naming the bad argument.
///
/// # Examples
/// ```
/// let mu1 = stocktank::gas::viscosity_one_atm_carr(100.0, 0.6, 0.0, 0.0, 0.0).unwrap();
/// assert!(mu1 > 0.010 && mu1 < 0.012);
/// ```
///
/// # References
/// Carr, N.L., Kobayashi, R., Burrows, D.B. (1954). Trans. AIME 201, 264–272; fit by
/// Standing, M.B. (1977), Volumetric and Phase Behavior of Oil Field Hydrocarbon Systems,
/// SPE (coefficients from memory).
#[inline]
pub fn viscosity_one_atm_carr(t_f: f64, gas_sg: f64, co2: f64, h2s: f64, n2: f64) -> Result<f64> {
    let t = temperature_f("t_f", t_f)?;
    let g = positive("gas_sg", gas_sg)?;
    fraction("co2", co2)?;
    fraction("h2s", h2s)?;
    fraction("n2", n2)?;
    let lg = g.log10();
    Ok((1.709e-5 - 2.062e-6 * g) * t + 8.188e-3 - 6.15e-3 * lg
        + n2 * (8.48e-3 * lg + 9.59e-3)
        + co2 * (9.08e-3 * lg + 6.24e-3)
        + h2s * (8.49e-3 * lg + 3.73e-3))
}

const DEMPSEY: [f64; 16] = [
    -2.462_118_20,
    2.970_547_14,
    -0.286_264_054,
    0.008_054_205_22,
    2.808_609_49,
    -3.498_033_05,
    0.360_373_020,
    -0.010_443_241_3,
    -0.793_385_684,
    1.396_433_06,
    -0.149_144_925,
    0.004_410_155_12,
    0.083_938_717_8,
    -0.186_408_848,
    0.020_336_788_1,
    -0.000_609_579_263,
];

/// Ratio of gas viscosity at pressure to that at one atmosphere, Dempsey (1965) fit of the
/// Carr–Kobayashi–Burrows (1954) chart.
///
/// # Formula
/// ```text
/// ln(Tpr mu / mu1) = sum_{i=0..3} sum_{j=0..3} a_{4i+j} Tpr^i Ppr^j
/// ```
/// with a_0..a_15 of Dempsey (1965).
///
/// # Arguments
/// * `ppr` - pseudo-reduced pressure, > 0 (chart range 1 to 20).
/// * `tpr` - pseudo-reduced temperature, > 0 (chart range 1.2 to 3).
///
/// # Returns
/// mu / mu1, dimensionless.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `ppr` or `tpr`.
///
/// # Examples
/// ```
/// let r = stocktank::gas::viscosity_ratio_dempsey(3.0, 1.5).unwrap();
/// assert!(r > 1.2 && r < 2.0);
/// ```
///
/// # References
/// Dempsey, J.R. (1965). Computer routine treats gas viscosity as a variable. Oil & Gas
/// Journal 63(33), 141–143 (coefficients from memory).
#[inline]
pub fn viscosity_ratio_dempsey(ppr: f64, tpr: f64) -> Result<f64> {
    let p = positive("ppr", ppr)?;
    let t = positive("tpr", tpr)?;
    let a = &DEMPSEY;
    let poly = |k: usize| a[k] + p * (a[k + 1] + p * (a[k + 2] + p * a[k + 3]));
    let s = poly(0) + t * (poly(4) + t * (poly(8) + t * poly(12)));
    Ok(s.exp() / t)
}

/// Whether inputs lie in the range of the Dempsey (1965) fit: 1 <= Ppr <= 20 and
/// 1.2 <= Tpr <= 3 (from memory).
///
/// # Examples
/// ```
/// assert!(stocktank::gas::dempsey_in_range(3.0, 1.5));
/// ```
#[inline]
pub fn dempsey_in_range(ppr: f64, tpr: f64) -> bool {
    (1.0..=20.0).contains(&ppr) && (1.2..=3.0).contains(&tpr)
}
