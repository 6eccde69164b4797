//! [`Gas`]: the description of a natural gas (gravity, impurities, correlation choices)
//! with its properties at pressure and temperature, on scalars and on arrays.

use super::properties::{bg, cg_from_cpr, gas_density, rcf_per_scf_to_rb_per_mscf};
use super::pseudo_critical::{
    GravityCorrelation, PseudoCritical, carr_kobayashi_burrows_correction, check_impurities,
    hydrocarbon_mixing, kay, wichert_aziz,
};
use super::viscosity::{
    ViscosityMethod, dempsey_in_range, lee_gonzalez_eakin_in_range, viscosity_lee_gonzalez_eakin,
    viscosity_one_atm_carr, viscosity_ratio_dempsey,
};
use super::zfactor::{DakIsotherm, ZMethod, ZSolution, dak_solve, hall_yarborough_solve};
use crate::array::{OnError, lift};
use crate::error::{Error, Result, positive, temperature_f};
use crate::units::{RANKINE_OFFSET, StandardConditions};
use ndarray::{ArrayD, ArrayViewD};

/// Where the pseudo-critical properties of a [`Gas`] come from.
///
/// # Examples
/// ```
/// use stocktank::gas::{Gas, PseudoCriticalSource};
/// let g = Gas::new(0.7).unwrap().with_pseudo_critical(380.0, 670.0).unwrap();
/// assert!(matches!(g.source(), PseudoCriticalSource::Given(_)));
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum PseudoCriticalSource {
    /// From the gas gravity by a correlation (hydrocarbon part, then impurities).
    Gravity(GravityCorrelation),
    /// Given directly, e.g. by Kay's rule from a composition (before the Wichert–Aziz
    /// correction, which is still applied for CO2 and H2S).
    Given(PseudoCritical),
}

/// How non-hydrocarbons adjust gravity-based pseudo-criticals.
///
/// # Examples
/// ```
/// use stocktank::gas::ImpurityCorrection;
/// assert_eq!(ImpurityCorrection::default(), ImpurityCorrection::WichertAziz);
/// ```
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum ImpurityCorrection {
    /// The hydrocarbon part's pseudo-criticals from its own gravity, mixed with the
    /// impurities by Kay's rule ([`super::hydrocarbon_mixing`]), then Wichert–Aziz (1972)
    /// for CO2 and H2S. The default.
    #[default]
    WichertAziz,
    /// Carr–Kobayashi–Burrows (1954) linear corrections for N2, CO2 and H2S applied to the
    /// pseudo-criticals of the overall gravity.
    CarrKobayashiBurrows,
}

impl ImpurityCorrection {
    /// Parse `"wichert_aziz"` or `"carr_kobayashi_burrows"`.
    ///
    /// # Errors
    /// [`Error::InvalidOption`] naming `impurity_correction`.
    ///
    /// # Examples
    /// ```
    /// use stocktank::gas::ImpurityCorrection;
    /// assert_eq!(ImpurityCorrection::parse("wichert_aziz").unwrap(), ImpurityCorrection::WichertAziz);
    /// ```
    pub fn parse(s: &str) -> Result<Self> {
        match s {
            "wichert_aziz" => Ok(Self::WichertAziz),
            "carr_kobayashi_burrows" => Ok(Self::CarrKobayashiBurrows),
            _ => Err(Error::InvalidOption {
                arg: "impurity_correction",
                value: s.to_string(),
                allowed: "wichert_aziz, carr_kobayashi_burrows",
            }),
        }
    }

    /// The option name accepted by [`ImpurityCorrection::parse`].
    ///
    /// # Examples
    /// ```
    /// assert_eq!(stocktank::gas::ImpurityCorrection::default().name(), "wichert_aziz");
    /// ```
    pub fn name(&self) -> &'static str {
        match self {
            Self::WichertAziz => "wichert_aziz",
            Self::CarrKobayashiBurrows => "carr_kobayashi_burrows",
        }
    }
}

/// A gas property that [`Gas::property`] can compute.
///
/// # Examples
/// ```
/// use stocktank::gas::{Gas, GasProperty};
/// let v = Gas::new(0.7).unwrap().property(GasProperty::Viscosity, 2000.0, 150.0, &Default::default()).unwrap();
/// assert!(v > 0.0);
/// ```
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum GasProperty {
    /// Z-factor, dimensionless.
    Z,
    /// Formation volume factor, rcf/scf.
    Bg,
    /// Formation volume factor, rb/Mscf.
    BgRbPerMscf,
    /// Expansion factor 1/Bg, scf/rcf.
    Eg,
    /// Density, lbm/ft3.
    Density,
    /// Viscosity, cp.
    Viscosity,
    /// Isothermal compressibility, 1/psi.
    Cg,
}

/// A natural gas: specific gravity, impurities and the correlation choices.
///
/// Defaults of [`Gas::new`]: pseudo-criticals by Sutton (1985); for CO2, H2S or N2, the
/// hydrocarbon part mixed with the impurities and the Wichert–Aziz (1972) correction; Z by
/// Dranchuk–Abou-Kassem (1975); viscosity by Lee–Gonzalez–Eakin (1966). Builders change
/// each choice. Results are screening estimates; prefer measured PVT where available.
///
/// # Examples
/// ```
/// use stocktank::gas::Gas;
/// use stocktank::units::StandardConditions;
/// let gas = Gas::new(0.7).unwrap().with_impurities(0.05, 0.0, 0.01).unwrap();
/// let z = gas.z(3000.0, 200.0).unwrap();
/// assert!(z > 0.8 && z < 1.0);
/// let bg = gas.bg(3000.0, 200.0, &StandardConditions::FIELD).unwrap();
/// assert!(bg > 0.004 && bg < 0.006);
/// ```
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Gas {
    gas_sg: f64,
    co2: f64,
    h2s: f64,
    n2: f64,
    source: PseudoCriticalSource,
    impurity_correction: ImpurityCorrection,
    z_method: ZMethod,
    viscosity_method: ViscosityMethod,
    pc: PseudoCritical,
}

impl Gas {
    /// A sweet hydrocarbon gas of specific gravity `gas_sg` (air = 1) with the defaults.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `gas_sg` when not finite and > 0.
    ///
    /// # Examples
    /// ```
    /// let gas = stocktank::gas::Gas::new(0.65).unwrap();
    /// assert_eq!(gas.gas_sg(), 0.65);
    /// ```
    pub fn new(gas_sg: f64) -> Result<Gas> {
        positive("gas_sg", gas_sg)?;
        Gas {
            gas_sg,
            co2: 0.0,
            h2s: 0.0,
            n2: 0.0,
            source: PseudoCriticalSource::Gravity(GravityCorrelation::Sutton),
            impurity_correction: ImpurityCorrection::WichertAziz,
            z_method: ZMethod::DranchukAbouKassem,
            viscosity_method: ViscosityMethod::LeeGonzalezEakin,
            pc: PseudoCritical {
                tpc_r: f64::NAN,
                ppc_psia: f64::NAN,
            },
        }
        .refresh()
    }

    /// A gas from its composition by Kay's rule ([`super::kay`]); gravity and impurities are
    /// taken from the composition, Wichert–Aziz applies for CO2 and H2S.
    ///
    /// # Arguments
    /// * `y` - mole fractions in the order of [`super::COMPOSITION_NAMES`], summing to 1.
    /// * `c7plus_mw` - C7+ molar mass, lbm/lbmol (used when y_C7+ > 0).
    /// * `c7plus_sg` - C7+ specific gravity 60/60 degF (used when y_C7+ > 0).
    ///
    /// # Errors
    /// As [`super::kay`].
    ///
    /// # Examples
    /// ```
    /// let mut y = [0.0; 12];
    /// y[3] = 0.9; y[4] = 0.1;
    /// let gas = stocktank::gas::Gas::from_composition(&y, 0.0, 0.0).unwrap();
    /// assert!((gas.gas_sg() - (0.9 * 16.043 + 0.1 * 30.070) / 28.9647).abs() < 1e-12);
    /// ```
    pub fn from_composition(y: &[f64; 12], c7plus_mw: f64, c7plus_sg: f64) -> Result<Gas> {
        let k = kay(y, c7plus_mw, c7plus_sg)?;
        let s: f64 = y.iter().sum();
        Gas {
            gas_sg: k.gas_sg,
            co2: y[1] / s,
            h2s: y[2] / s,
            n2: y[0] / s,
            source: PseudoCriticalSource::Given(k.pc),
            impurity_correction: ImpurityCorrection::WichertAziz,
            z_method: ZMethod::DranchukAbouKassem,
            viscosity_method: ViscosityMethod::LeeGonzalezEakin,
            pc: k.pc,
        }
        .refresh()
    }

    fn refresh(mut self) -> Result<Gas> {
        check_impurities(self.co2, self.h2s, self.n2)?;
        self.pc = match (self.source, self.impurity_correction) {
            (PseudoCriticalSource::Given(pc), _) => wichert_aziz(pc, self.co2, self.h2s)?,
            (PseudoCriticalSource::Gravity(c), ImpurityCorrection::WichertAziz) => {
                let pc = hydrocarbon_mixing(self.gas_sg, self.co2, self.h2s, self.n2, c)?;
                wichert_aziz(pc, self.co2, self.h2s)?
            }
            (PseudoCriticalSource::Gravity(c), ImpurityCorrection::CarrKobayashiBurrows) => {
                let pc = c.eval(self.gas_sg)?;
                carr_kobayashi_burrows_correction(pc, self.co2, self.h2s, self.n2)?
            }
        };
        positive("tpc_r", self.pc.tpc_r)?;
        positive("ppc_psia", self.pc.ppc_psia)?;
        Ok(self)
    }

    /// Set the mole fractions of CO2, H2S and N2 (each in [0, 1], sum <= 1).
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `co2`, `h2s`, `n2`, or `gas_sg` when the gravity is
    /// too low for the impurities.
    ///
    /// # Examples
    /// ```
    /// let g = stocktank::gas::Gas::new(0.8).unwrap().with_impurities(0.12, 0.0, 0.0).unwrap();
    /// assert_eq!(g.co2(), 0.12);
    /// ```
    pub fn with_impurities(mut self, co2: f64, h2s: f64, n2: f64) -> Result<Gas> {
        self.co2 = co2;
        self.h2s = h2s;
        self.n2 = n2;
        self.refresh()
    }

    /// Use a gravity correlation for the pseudo-criticals (replaces given/Kay values).
    ///
    /// # Errors
    /// As [`Gas::with_impurities`].
    ///
    /// # Examples
    /// ```
    /// use stocktank::gas::{Gas, GravityCorrelation};
    /// let g = Gas::new(0.9).unwrap().with_gravity_correlation(GravityCorrelation::StandingCondensate).unwrap();
    /// assert!(g.pseudo_critical().tpc_r > 400.0);
    /// ```
    pub fn with_gravity_correlation(mut self, c: GravityCorrelation) -> Result<Gas> {
        self.source = PseudoCriticalSource::Gravity(c);
        self.refresh()
    }

    /// Give the (uncorrected) pseudo-critical temperature (degR) and pressure (psia)
    /// directly; Wichert–Aziz still applies for CO2 and H2S.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `tpc_r` or `ppc_psia` when not > 0.
    ///
    /// # Examples
    /// ```
    /// let g = stocktank::gas::Gas::new(0.7).unwrap().with_pseudo_critical(380.0, 670.0).unwrap();
    /// assert_eq!(g.pseudo_critical().tpc_r, 380.0);
    /// ```
    pub fn with_pseudo_critical(mut self, tpc_r: f64, ppc_psia: f64) -> Result<Gas> {
        positive("tpc_r", tpc_r)?;
        positive("ppc_psia", ppc_psia)?;
        self.source = PseudoCriticalSource::Given(PseudoCritical { tpc_r, ppc_psia });
        self.refresh()
    }

    /// Choose the impurity correction for gravity-based pseudo-criticals.
    ///
    /// # Errors
    /// As [`Gas::with_impurities`].
    ///
    /// # Examples
    /// ```
    /// use stocktank::gas::{Gas, ImpurityCorrection};
    /// let g = Gas::new(0.7).unwrap().with_impurity_correction(ImpurityCorrection::CarrKobayashiBurrows).unwrap();
    /// assert_eq!(g.impurity_correction(), ImpurityCorrection::CarrKobayashiBurrows);
    /// ```
    pub fn with_impurity_correction(mut self, c: ImpurityCorrection) -> Result<Gas> {
        self.impurity_correction = c;
        self.refresh()
    }

    /// Choose the Z-factor method.
    ///
    /// # Examples
    /// ```
    /// use stocktank::gas::{Gas, ZMethod};
    /// let g = Gas::new(0.7).unwrap().with_z_method(ZMethod::HallYarborough);
    /// assert_eq!(g.z_method(), ZMethod::HallYarborough);
    /// ```
    pub fn with_z_method(mut self, m: ZMethod) -> Gas {
        self.z_method = m;
        self
    }

    /// Choose the viscosity method.
    ///
    /// # Examples
    /// ```
    /// use stocktank::gas::{Gas, ViscosityMethod};
    /// let g = Gas::new(0.7).unwrap().with_viscosity_method(ViscosityMethod::CarrKobayashiBurrows);
    /// assert_eq!(g.viscosity_method(), ViscosityMethod::CarrKobayashiBurrows);
    /// ```
    pub fn with_viscosity_method(mut self, m: ViscosityMethod) -> Gas {
        self.viscosity_method = m;
        self
    }

    /// Gas specific gravity, air = 1.
    ///
    /// # Examples
    /// ```
    /// assert_eq!(stocktank::gas::Gas::new(0.7).unwrap().gas_sg(), 0.7);
    /// ```
    pub fn gas_sg(&self) -> f64 {
        self.gas_sg
    }
    /// CO2 mole fraction.
    ///
    /// # Examples
    /// ```
    /// assert_eq!(stocktank::gas::Gas::new(0.7).unwrap().co2(), 0.0);
    /// ```
    pub fn co2(&self) -> f64 {
        self.co2
    }
    /// H2S mole fraction.
    ///
    /// # Examples
    /// ```
    /// assert_eq!(stocktank::gas::Gas::new(0.7).unwrap().h2s(), 0.0);
    /// ```
    pub fn h2s(&self) -> f64 {
        self.h2s
    }
    /// N2 mole fraction.
    ///
    /// # Examples
    /// ```
    /// assert_eq!(stocktank::gas::Gas::new(0.7).unwrap().n2(), 0.0);
    /// ```
    pub fn n2(&self) -> f64 {
        self.n2
    }
    /// Where the pseudo-criticals come from.
    ///
    /// # Examples
    /// ```
    /// use stocktank::gas::{Gas, GravityCorrelation, PseudoCriticalSource};
    /// assert_eq!(Gas::new(0.7).unwrap().source(), PseudoCriticalSource::Gravity(GravityCorrelation::Sutton));
    /// ```
    pub fn source(&self) -> PseudoCriticalSource {
        self.source
    }
    /// The impurity correction.
    ///
    /// # Examples
    /// ```
    /// use stocktank::gas::{Gas, ImpurityCorrection};
    /// assert_eq!(Gas::new(0.7).unwrap().impurity_correction(), ImpurityCorrection::WichertAziz);
    /// ```
    pub fn impurity_correction(&self) -> ImpurityCorrection {
        self.impurity_correction
    }
    /// The Z-factor method.
    ///
    /// # Examples
    /// ```
    /// use stocktank::gas::{Gas, ZMethod};
    /// assert_eq!(Gas::new(0.7).unwrap().z_method(), ZMethod::DranchukAbouKassem);
    /// ```
    pub fn z_method(&self) -> ZMethod {
        self.z_method
    }
    /// The viscosity method.
    ///
    /// # Examples
    /// ```
    /// use stocktank::gas::{Gas, ViscosityMethod};
    /// assert_eq!(Gas::new(0.7).unwrap().viscosity_method(), ViscosityMethod::LeeGonzalezEakin);
    /// ```
    pub fn viscosity_method(&self) -> ViscosityMethod {
        self.viscosity_method
    }
    /// The pseudo-critical properties in use (after impurity corrections), degR and psia.
    ///
    /// # Examples
    /// ```
    /// let pc = stocktank::gas::Gas::new(0.7).unwrap().pseudo_critical();
    /// assert!((pc.ppc_psia - 663.3).abs() < 0.1);
    /// ```
    pub fn pseudo_critical(&self) -> PseudoCritical {
        self.pc
    }
    /// Molar mass, lbm/lbmol (28.9647 x gravity).
    ///
    /// # Examples
    /// ```
    /// assert!((stocktank::gas::Gas::new(1.0).unwrap().molar_mass() - 28.9647).abs() < 1e-12);
    /// ```
    pub fn molar_mass(&self) -> f64 {
        self.gas_sg * crate::units::AIR_MOLAR_MASS
    }

    /// Pseudo-reduced pressure and temperature at `p_psia` (psia, > 0) and `t_f` (degF).
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `p_psia` or `t_f`.
    ///
    /// # Examples
    /// ```
    /// let g = stocktank::gas::Gas::new(0.7).unwrap();
    /// let (ppr, tpr) = g.reduced(1000.0, 100.0).unwrap();
    /// assert!(ppr > 1.0 && tpr > 1.0);
    /// ```
    #[inline]
    pub fn reduced(&self, p_psia: f64, t_f: f64) -> Result<(f64, f64)> {
        let p = positive("p_psia", p_psia)?;
        let t = temperature_f("t_f", t_f)? + RANKINE_OFFSET;
        Ok((p / self.pc.ppc_psia, t / self.pc.tpc_r))
    }

    /// The Z-factor solve with its solver report (for DAK and Hall–Yarborough; for Papay
    /// the report says one step, converged).
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `p_psia` or `t_f`.
    ///
    /// # Examples
    /// ```
    /// let s = stocktank::gas::Gas::new(0.7).unwrap().z_solution(3000.0, 200.0).unwrap();
    /// assert_eq!(s.termination, stocktank::gas::Termination::Converged);
    /// ```
    #[inline]
    pub fn z_solution(&self, p_psia: f64, t_f: f64) -> Result<ZSolution> {
        let (ppr, tpr) = self.reduced(p_psia, t_f)?;
        match self.z_method {
            ZMethod::DranchukAbouKassem => dak_solve(ppr, tpr),
            ZMethod::HallYarborough => hall_yarborough_solve(ppr, tpr),
            ZMethod::Papay => {
                let (z, cpr) = ZMethod::Papay.z_cpr(ppr, tpr)?;
                Ok(ZSolution {
                    z,
                    reduced_density: f64::NAN,
                    cpr,
                    iterations: 1,
                    termination: super::zfactor::Termination::Converged,
                })
            }
        }
    }

    /// Z-factor at `p_psia` (psia) and `t_f` (degF), dimensionless.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `p_psia` or `t_f`; [`Error::NoConvergence`].
    ///
    /// # Examples
    /// ```
    /// let z = stocktank::gas::Gas::new(0.7).unwrap().z(14.696, 60.0).unwrap();
    /// assert!((z - 1.0).abs() < 0.01);
    /// ```
    #[inline]
    pub fn z(&self, p_psia: f64, t_f: f64) -> Result<f64> {
        let (ppr, tpr) = self.reduced(p_psia, t_f)?;
        self.z_method.z(ppr, tpr)
    }

    /// The Z-factor along the isotherm `t_f` (degF): the Tpr-only work of the solve done
    /// once for a pressure sweep. Its `z(p)` equals [`Gas::z`]`(p, t_f)` to the last bit.
    #[inline]
    pub(crate) fn isotherm(&self, t_f: f64) -> GasIsotherm<'_> {
        let dak = match (self.z_method, temperature_f("t_f", t_f)) {
            (ZMethod::DranchukAbouKassem, Ok(t)) => {
                DakIsotherm::new((t + RANKINE_OFFSET) / self.pc.tpc_r).ok()
            }
            _ => None,
        };
        GasIsotherm {
            gas: self,
            t_f,
            dak,
        }
    }

    /// Z-factor and gas compressibility cg (1/psi) from the analytic derivative of the EOS.
    #[inline]
    fn z_cg(&self, p_psia: f64, t_f: f64) -> Result<(f64, f64)> {
        let (ppr, tpr) = self.reduced(p_psia, t_f)?;
        let (z, cpr) = self.z_method.z_cpr(ppr, tpr)?;
        Ok((z, cg_from_cpr(cpr, self.pc.ppc_psia)?))
    }

    /// Gas formation volume factor Bg, rcf/scf, at `p_psia` and `t_f` (see
    /// [`super::bg`]).
    ///
    /// # Errors
    /// As [`Gas::z`].
    ///
    /// # Examples
    /// ```
    /// use stocktank::units::StandardConditions;
    /// let g = stocktank::gas::Gas::new(0.7).unwrap();
    /// let a = g.bg(2000.0, 150.0, &StandardConditions::FIELD).unwrap();
    /// let b = g.bg(2000.0, 150.0, &StandardConditions::FIELD_14_65).unwrap();
    /// assert!(b < a);
    /// ```
    #[inline]
    pub fn bg(&self, p_psia: f64, t_f: f64, sc: &StandardConditions) -> Result<f64> {
        bg(p_psia, t_f, self.z(p_psia, t_f)?, sc)
    }

    /// Gas density, lbm/ft3, at `p_psia` and `t_f`.
    ///
    /// # Errors
    /// As [`Gas::z`].
    ///
    /// # Examples
    /// ```
    /// let rho = stocktank::gas::Gas::new(0.7).unwrap().density(3000.0, 200.0).unwrap();
    /// assert!(rho > 9.0 && rho < 13.0);
    /// ```
    #[inline]
    pub fn density(&self, p_psia: f64, t_f: f64) -> Result<f64> {
        gas_density(p_psia, t_f, self.z(p_psia, t_f)?, self.gas_sg)
    }

    /// Gas viscosity, cp, at `p_psia` and `t_f` by the chosen method.
    ///
    /// # Errors
    /// As [`Gas::z`].
    ///
    /// # Examples
    /// ```
    /// let mu = stocktank::gas::Gas::new(0.7).unwrap().viscosity(3000.0, 200.0).unwrap();
    /// assert!(mu > 0.015 && mu < 0.03);
    /// ```
    #[inline]
    pub fn viscosity(&self, p_psia: f64, t_f: f64) -> Result<f64> {
        match self.viscosity_method {
            ViscosityMethod::LeeGonzalezEakin => Ok(self.z_and_viscosity(p_psia, t_f)?.1),
            ViscosityMethod::CarrKobayashiBurrows => self.viscosity_carr(p_psia, t_f),
        }
    }

    #[inline]
    fn viscosity_carr(&self, p_psia: f64, t_f: f64) -> Result<f64> {
        let (ppr, tpr) = self.reduced(p_psia, t_f)?;
        let mu1 = viscosity_one_atm_carr(t_f, self.gas_sg, self.co2, self.h2s, self.n2)?;
        Ok(mu1 * viscosity_ratio_dempsey(ppr, tpr)?)
    }

    /// Z and viscosity (cp) with one Z solve (the viscosity methods that need density use
    /// this Z).
    #[inline]
    pub(crate) fn z_and_viscosity(&self, p_psia: f64, t_f: f64) -> Result<(f64, f64)> {
        let z = self.z(p_psia, t_f)?;
        let mu = match self.viscosity_method {
            ViscosityMethod::LeeGonzalezEakin => {
                let rho = gas_density(p_psia, t_f, z, self.gas_sg)?;
                viscosity_lee_gonzalez_eakin(t_f, rho, self.molar_mass())?
            }
            ViscosityMethod::CarrKobayashiBurrows => self.viscosity_carr(p_psia, t_f)?,
        };
        Ok((z, mu))
    }

    /// Gas isothermal compressibility cg, 1/psi, from the analytic dZ/dp of the EOS.
    ///
    /// # Formula
    /// ```text
    /// cg = 1/p - (1/Z) dZ/dp
    /// ```
    ///
    /// # Errors
    /// As [`Gas::z`].
    ///
    /// # Examples
    /// ```
    /// let cg = stocktank::gas::Gas::new(0.7).unwrap().cg(14.696, 200.0).unwrap();
    /// assert!((cg * 14.696 - 1.0).abs() < 0.01); // nearly ideal at low pressure
    /// ```
    #[inline]
    pub fn cg(&self, p_psia: f64, t_f: f64) -> Result<f64> {
        Ok(self.z_cg(p_psia, t_f)?.1)
    }

    /// Any [`GasProperty`] at `p_psia` and `t_f` (the single dispatch used by the array
    /// version).
    ///
    /// # Errors
    /// As [`Gas::z`].
    ///
    /// # Examples
    /// ```
    /// use stocktank::gas::{Gas, GasProperty};
    /// use stocktank::units::StandardConditions;
    /// let g = Gas::new(0.7).unwrap();
    /// let sc = StandardConditions::FIELD;
    /// assert_eq!(g.property(GasProperty::Z, 2000.0, 150.0, &sc).unwrap(), g.z(2000.0, 150.0).unwrap());
    /// ```
    #[inline]
    pub fn property(
        &self,
        prop: GasProperty,
        p_psia: f64,
        t_f: f64,
        sc: &StandardConditions,
    ) -> Result<f64> {
        match prop {
            GasProperty::Z => self.z(p_psia, t_f),
            GasProperty::Bg => self.bg(p_psia, t_f, sc),
            GasProperty::BgRbPerMscf => Ok(rcf_per_scf_to_rb_per_mscf(self.bg(p_psia, t_f, sc)?)),
            GasProperty::Eg => Ok(1.0 / self.bg(p_psia, t_f, sc)?),
            GasProperty::Density => self.density(p_psia, t_f),
            GasProperty::Viscosity => self.viscosity(p_psia, t_f),
            GasProperty::Cg => self.cg(p_psia, t_f),
        }
    }

    /// [`Gas::property`] on arrays of pressure (psia) and temperature (degF), broadcast like
    /// numpy by [`crate::array::lift`] (NaN in, NaN out; errors raised or coerced to NaN).
    ///
    /// # Errors
    /// [`Error::Shape`]; with [`OnError::Raise`], the first bad element's error with its
    /// index.
    ///
    /// # Examples
    /// ```
    /// use ndarray::arr1;
    /// use stocktank::array::OnError;
    /// use stocktank::gas::{Gas, GasProperty};
    /// use stocktank::units::StandardConditions;
    /// let g = Gas::new(0.7).unwrap();
    /// let p = arr1(&[1000.0, 2000.0, 3000.0]).into_dyn();
    /// let t = arr1(&[150.0]).into_dyn();
    /// let z = g.property_array(GasProperty::Z, p.view(), t.view(), &StandardConditions::FIELD, OnError::Raise).unwrap();
    /// assert_eq!(z.len(), 3);
    /// ```
    pub fn property_array(
        &self,
        prop: GasProperty,
        p_psia: ArrayViewD<'_, f64>,
        t_f: ArrayViewD<'_, f64>,
        sc: &StandardConditions,
        on_error: OnError,
    ) -> Result<ArrayD<f64>> {
        lift(["p_psia", "t_f"], [p_psia, t_f], on_error, |[p, t]| {
            self.property(prop, p, t, sc)
        })
    }

    /// Whether (`p_psia`, `t_f`) and the gas lie in the published ranges of the gas's
    /// pseudo-critical, Z-factor and viscosity methods: `[pseudo_critical, z, viscosity]`.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `p_psia` or `t_f` when physically impossible.
    ///
    /// # Examples
    /// ```
    /// let g = stocktank::gas::Gas::new(0.7).unwrap();
    /// assert_eq!(g.in_range(3000.0, 200.0).unwrap(), [true, true, true]);
    /// ```
    pub fn in_range(&self, p_psia: f64, t_f: f64) -> Result<[bool; 3]> {
        let (ppr, tpr) = self.reduced(p_psia, t_f)?;
        let pc = match self.source {
            PseudoCriticalSource::Gravity(c) => {
                c.in_range(self.gas_sg) && self.co2 <= 0.544 && self.h2s <= 0.738
            }
            PseudoCriticalSource::Given(_) => self.co2 <= 0.544 && self.h2s <= 0.738,
        };
        let z = self.z_method.in_range(ppr, tpr);
        let mu = match self.viscosity_method {
            ViscosityMethod::LeeGonzalezEakin => lee_gonzalez_eakin_in_range(p_psia, t_f),
            ViscosityMethod::CarrKobayashiBurrows => {
                dempsey_in_range(ppr, tpr) && (0.55..=1.55).contains(&self.gas_sg)
            }
        };
        Ok([pc, z, mu])
    }
}

/// A gas at one temperature, for pressure sweeps (see [`Gas::isotherm`]).
#[derive(Debug, Clone, Copy)]
pub(crate) struct GasIsotherm<'a> {
    gas: &'a Gas,
    t_f: f64,
    dak: Option<DakIsotherm>,
}

impl GasIsotherm<'_> {
    /// Z-factor at `p_psia` (psia), with the errors of [`Gas::z`].
    #[inline]
    pub(crate) fn z(&self, p_psia: f64) -> Result<f64> {
        match &self.dak {
            Some(d) => d.z(positive("p_psia", p_psia)? / self.gas.pc.ppc_psia),
            None => self.gas.z(p_psia, self.t_f),
        }
    }

    /// Z at every pressure of `p_psia` (psia): one result per pressure, each exactly that
    /// of [`GasIsotherm::z`] (the DAK points go through the vectorised batch kernel).
    #[cfg(test)]
    pub(crate) fn z_column(&self, p_psia: &[f64]) -> Vec<Result<f64>> {
        let mut out = Vec::new();
        self.z_column_into(p_psia, &mut Vec::new(), &mut out);
        out
    }

    /// As [`GasIsotherm::z_column`], into `out` (resized to the length of `p_psia`), with
    /// `ppr` as scratch: a caller building many tables reuses both buffers.
    pub(crate) fn z_column_into(
        &self,
        p_psia: &[f64],
        ppr: &mut Vec<f64>,
        out: &mut Vec<Result<f64>>,
    ) {
        out.clear();
        match &self.dak {
            Some(d) => {
                let ppc = self.gas.pc.ppc_psia;
                ppr.clear();
                ppr.extend(p_psia.iter().map(|&p| p / ppc));
                out.resize_with(p_psia.len(), || Ok(f64::NAN));
                d.z_into(ppr, out);
                for (o, &p) in out.iter_mut().zip(p_psia) {
                    if let Err(e) = positive("p_psia", p) {
                        *o = Err(e);
                    }
                }
            }
            None => out.extend(p_psia.iter().map(|&p| self.z(p))),
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// The isotherm fast path (scalar and batched) gives exactly `Gas::z`, value or error,
    /// on and off the starting-density table, for every Z method.
    #[test]
    fn isotherm_matches_scalar_z_exactly() {
        let mut p: Vec<f64> = (1..=97).map(|i| 14.696 * 1.09f64.powi(i)).collect();
        p.extend([-1.0, f64::NAN, 0.0, 50_000.0, 3000.0]);
        for method in [
            ZMethod::DranchukAbouKassem,
            ZMethod::HallYarborough,
            ZMethod::Papay,
        ] {
            for sg in [0.57, 0.7, 1.1] {
                let gas = Gas::new(sg).unwrap().with_z_method(method);
                for t_f in [-250.0, -100.0, 60.0, 200.0, 400.0, 1500.0] {
                    let iso = gas.isotherm(t_f);
                    let col = iso.z_column(&p);
                    for (k, &pk) in p.iter().enumerate() {
                        let want = gas.z(pk, t_f);
                        // Debug text: equal values print equal (shortest round trip), and
                        // errors carrying NaN compare too.
                        let want = format!("{want:?}");
                        let ctx = format!("{method:?} sg {sg} t {t_f} p {pk}");
                        assert_eq!(format!("{:?}", iso.z(pk)), want, "{ctx}");
                        assert_eq!(format!("{:?}", col[k]), want, "{ctx}");
                    }
                }
            }
        }
    }
}
