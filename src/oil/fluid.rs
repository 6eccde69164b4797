//! The oil description ([`Oil`]): stock-tank gravity, gas gravity, solution GOR and/or bubble
//! point, temperature, correlation choices, separator conditions, optional measurements to
//! calibrate to, water salinity and standard conditions.
//!
//! # Calibration
//! Users often have a measured bubble point, Bo at the bubble point or viscosity at the
//! bubble point, but no full laboratory study. The chosen correlations are then adjusted so
//! that the model honours each measurement exactly (common practice, no source):
//! ```text
//! bubble point:  pressure scale  k_p = Pb,meas / Pb,corr(GOR)
//!                Pb(Rs) = k_p Pb,corr(Rs),    Rs(p) = Rs,corr(p / k_p)
//! Bo:            shrinkage scale k_B = (Bob,meas - 1) / (Bob,corr - 1)
//!                Bo(Rs) = 1 + k_B (Bo,corr(Rs) - 1)        (below and at Pb;
//!                above Pb, Bo = Bob exp(-integral co dp) from the calibrated Bob)
//! viscosity:     multiplier      k_mu = mu_ob,meas / mu_ob,corr
//!                mu(p) = k_mu mu_corr(p) for the live oil at every pressure
//! ```
//! Each scale is 1 without its measurement. [`Oil::calibration_report`] tells how far the
//! raw correlation was from each measurement. When only a bubble point is given (no GOR), the
//! GOR is the correlation's Rs at that bubble point and no pressure scale is needed.

use super::bubble_point::StandingRs;
use super::bubble_point::{
    bubble_point, solution_gor, solution_gor_dp, solution_gor_dp_given,
    vasquez_beggs_gas_sg_100psig,
};
use super::fvf::{
    StandingBo, apparent_compressibility, bo_ratio_with_coefficient_with, bo_saturated,
    bo_saturated_drs, bo_saturated_drs_given, bo_undersaturated, co_coefficient, co_undersaturated,
    co_with_coefficient_with,
};
use super::viscosity::{
    LiveOilViscosity, dead_oil_viscosity, live_oil_viscosity, undersaturated_oil_viscosity,
    undersaturated_viscosity_ratio_with,
};
use super::{BoMethod, CoMethod, DeadOilViscosityMethod, PbMethod, sg_from_api};
use crate::error::{Error, Result, non_negative, positive, temperature_f};
use crate::fastmath;
use crate::gas::Gas;
use crate::units::{FT3_PER_BBL, StandardConditions};

/// The correlation chosen for each property family.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub struct Methods {
    /// Bubble point and solution GOR.
    pub pb: PbMethod,
    /// Saturated Bo.
    pub bo: BoMethod,
    /// Undersaturated compressibility (and Bo above Pb).
    pub co: CoMethod,
    /// Dead-oil viscosity (live and undersaturated viscosity are Beggs–Robinson 1975 and
    /// Vasquez–Beggs 1980).
    pub dead_oil_viscosity: DeadOilViscosityMethod,
}

impl Default for Methods {
    /// Standing (1947) Pb and Bo, Vasquez–Beggs (1980) co, Beggs–Robinson (1975) viscosity.
    fn default() -> Self {
        Self {
            pb: PbMethod::Standing,
            bo: BoMethod::Standing,
            co: CoMethod::VasquezBeggs,
            dead_oil_viscosity: DeadOilViscosityMethod::BeggsRobinson,
        }
    }
}

/// Separator conditions at which `gas_sg` was measured (used for the Vasquez–Beggs 1980
/// correction of the gas gravity to 100 psig).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Separator {
    /// Separator pressure, psia, > 0.
    pub p_psia: f64,
    /// Separator temperature, degF.
    pub t_f: f64,
}

/// Measurements the model is calibrated to (each optional).
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct Calibration {
    /// Measured Bo at the bubble point, rb/STB, > 1.
    pub bob: Option<f64>,
    /// Measured oil viscosity at the bubble point, cp, > 0.
    pub mu_ob_cp: Option<f64>,
}

/// How far the raw correlations were from the measurements, and the scales applied.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct CalibrationReport {
    /// Bubble point of the raw correlation at the oil's GOR, psia.
    pub pb_correlation_psia: f64,
    /// The bubble point the model uses, psia (measured when given).
    pub pb_psia: f64,
    /// Pressure scale k_p (1 when no measured Pb together with a GOR).
    pub pb_scale: f64,
    /// Bo at the bubble point from the raw correlation, rb/STB.
    pub bob_correlation: f64,
    /// Bo at the bubble point the model uses, rb/STB.
    pub bob: f64,
    /// Shrinkage scale k_B applied to (Bo - 1).
    pub bo_scale: f64,
    /// Viscosity at the bubble point from the raw correlations, cp.
    pub mu_ob_correlation_cp: f64,
    /// Viscosity at the bubble point the model uses, cp.
    pub mu_ob_cp: f64,
    /// Viscosity multiplier k_mu.
    pub mu_scale: f64,
}

/// An oil (with its dissolved gas) as a black-oil fluid description.
///
/// Build with [`Oil::new`] (solution GOR known) or [`Oil::from_bubble_point`] (only the
/// bubble point known), then set options with the `with_*` methods. Give both a GOR and a
/// measured bubble point with [`Oil::with_measured_bubble_point`] to calibrate.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Oil {
    /// Stock-tank oil gravity, degAPI.
    pub api: f64,
    /// Separator (dissolved and free) gas specific gravity, air = 1.
    pub gas_sg: f64,
    /// Initial solution GOR (at and above the bubble point), scf/STB; `None` when only the
    /// bubble point is given.
    pub gor: Option<f64>,
    /// Bubble-point pressure, psia: a measurement when given together with `gor`.
    pub pb_psia: Option<f64>,
    /// Reservoir temperature, degF.
    pub temperature_f: f64,
    /// Correlation choices.
    pub methods: Methods,
    /// Separator conditions of `gas_sg`, if known.
    pub separator: Option<Separator>,
    /// Measured Bo / viscosity at the bubble point.
    pub calibration: Calibration,
    /// Formation water salinity (for the water columns of a table), weight percent NaCl
    /// equivalent.
    pub salinity_wt_pct: f64,
    /// Standard conditions of Rs and gas volumes.
    pub standard_conditions: StandardConditions,
}

/// A calibrated, validated oil model ready for evaluation (see [`Oil::model`]).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct OilModel {
    /// The description it was built from.
    pub oil: Oil,
    /// Gas gravity used by the Vasquez–Beggs correlations (corrected to 100 psig when the
    /// separator is known), else `gas_sg`.
    pub gas_sg_vb: f64,
    /// Initial solution GOR, scf/STB.
    pub rsi: f64,
    /// Bubble point, psia.
    pub pb: f64,
    /// Calibration results.
    pub report: CalibrationReport,
    mu_od: f64,
    /// Per-oil parts of the correlations, computed once (see [`Hoisted`]).
    hoisted: Hoisted,
}

/// The parts of the chosen correlations that depend on the oil only, computed once per oil
/// so that a pressure sweep pays only the pressure-dependent work (the correlations
/// themselves stay in `bubble_point`, `fvf` and `viscosity`; these are their prepared forms).
#[derive(Debug, Clone, Copy, PartialEq)]
struct Hoisted {
    /// Standing's Rs(p) when it is the bubble-point method.
    rs_standing: Option<StandingRs>,
    /// Standing's Bo(Rs) when it is the Bo method.
    bo_standing: Option<StandingBo>,
    /// Beggs–Robinson live-oil viscosity of this dead oil.
    live: LiveOilViscosity,
    /// Undersaturated co coefficient, NaN when the correlation rejects the oil (the checked
    /// functions then report the error).
    co_a: f64,
    /// ln Pb.
    ln_pb: f64,
}

impl Oil {
    /// The gas and water a black-oil table uses when none are given: the liberated gas as
    /// a sweet gas of the oil's `gas_sg` ([`Gas::new`]) and a brine of the oil's salinity at
    /// the oil's standard conditions.
    ///
    /// # Errors
    /// The errors of [`Gas::new`] and [`crate::water::Water::new`].
    ///
    /// # Examples
    /// ```
    /// use stocktank::oil::Oil;
    /// let (gas, water) = Oil::new(35.0, 0.8, 600.0, 200.0).unwrap().gas_and_water().unwrap();
    /// assert_eq!(gas, stocktank::gas::Gas::new(0.8).unwrap());
    /// assert_eq!(water.salinity_wt_pct(), 0.0);
    /// ```
    pub fn gas_and_water(&self) -> Result<(Gas, crate::water::Water)> {
        let gas = Gas::new(self.gas_sg)?;
        let water = crate::water::Water::new(self.salinity_wt_pct)?
            .with_standard_conditions(self.standard_conditions)?;
        Ok((gas, water))
    }

    /// An oil with known solution GOR; default correlations ([`Methods::default`]), no
    /// separator correction, no calibration, fresh water, field standard conditions.
    ///
    /// # Arguments
    /// * `api` - stock-tank oil gravity, degAPI, > 0.
    /// * `gas_sg` - gas specific gravity, air = 1, > 0.
    /// * `gor` - solution GOR at the bubble point, scf/STB, > 0.
    /// * `temperature_f` - reservoir temperature, degF.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `api`, `gas_sg`, `gor` or `temperature_f`.
    ///
    /// # Examples
    /// ```
    /// let oil = stocktank::oil::Oil::new(35.0, 0.8, 600.0, 200.0).unwrap();
    /// let m = oil.model().unwrap();
    /// assert!(m.pb > 2000.0 && m.pb < 4000.0);
    /// ```
    pub fn new(api: f64, gas_sg: f64, gor: f64, temperature_f: f64) -> Result<Self> {
        positive("gor", gor)?;
        Self::base(api, gas_sg, Some(gor), None, temperature_f)
    }

    /// An oil known by its bubble point only: the GOR is the chosen correlation's Rs(Pb).
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `api`, `gas_sg`, `pb` or `temperature_f`.
    ///
    /// # Examples
    /// ```
    /// let oil = stocktank::oil::Oil::from_bubble_point(35.0, 0.8, 2500.0, 200.0).unwrap();
    /// assert_eq!(oil.model().unwrap().pb, 2500.0);
    /// ```
    pub fn from_bubble_point(api: f64, gas_sg: f64, pb: f64, temperature_f: f64) -> Result<Self> {
        positive("pb", pb)?;
        Self::base(api, gas_sg, None, Some(pb), temperature_f)
    }

    fn base(api: f64, gas_sg: f64, gor: Option<f64>, pb: Option<f64>, t: f64) -> Result<Self> {
        positive("api", api)?;
        positive("gas_sg", gas_sg)?;
        temperature_f("temperature_f", t)?;
        Ok(Self {
            api,
            gas_sg,
            gor,
            pb_psia: pb,
            temperature_f: t,
            methods: Methods::default(),
            separator: None,
            calibration: Calibration::default(),
            salinity_wt_pct: 0.0,
            standard_conditions: StandardConditions::default(),
        })
    }

    /// Calibrate to a measured bubble point (keeps the GOR; scales pressure).
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `pb` when not finite and positive.
    ///
    /// # Examples
    /// ```
    /// let oil = stocktank::oil::Oil::new(35.0, 0.8, 600.0, 200.0).unwrap()
    ///     .with_measured_bubble_point(2800.0).unwrap();
    /// let m = oil.model().unwrap();
    /// assert_eq!(m.pb, 2800.0);
    /// assert!((m.rs(2800.0).unwrap() - 600.0).abs() < 1e-9);
    /// ```
    pub fn with_measured_bubble_point(mut self, pb: f64) -> Result<Self> {
        self.pb_psia = Some(positive("pb", pb)?);
        Ok(self)
    }

    /// Choose the correlations.
    ///
    /// # Examples
    /// ```
    /// use stocktank::oil::{Oil, Methods, PbMethod};
    /// let m = Methods { pb: PbMethod::Glaso, ..Methods::default() };
    /// let oil = Oil::new(35.0, 0.8, 600.0, 200.0).unwrap().with_methods(m);
    /// assert_eq!(oil.methods.pb, PbMethod::Glaso);
    /// ```
    pub fn with_methods(mut self, methods: Methods) -> Self {
        self.methods = methods;
        self
    }

    /// Set the separator conditions of `gas_sg` (Vasquez–Beggs gravity correction).
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `separator_p` or `separator_t`.
    ///
    /// # Examples
    /// ```
    /// let oil = stocktank::oil::Oil::new(35.0, 0.8, 600.0, 200.0).unwrap()
    ///     .with_separator(100.0, 75.0).unwrap();
    /// assert!(oil.separator.is_some());
    /// ```
    pub fn with_separator(mut self, p_psia: f64, t_f: f64) -> Result<Self> {
        positive("separator_p", p_psia)?;
        temperature_f("separator_t", t_f)?;
        self.separator = Some(Separator { p_psia, t_f });
        Ok(self)
    }

    /// Calibrate to measured Bo and/or viscosity at the bubble point.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `bob` (must be > 1 rb/STB) or `mu_ob` (> 0 cp).
    ///
    /// # Examples
    /// ```
    /// use stocktank::oil::{Oil, Calibration};
    /// let c = Calibration { bob: Some(1.35), mu_ob_cp: None };
    /// let oil = Oil::new(35.0, 0.8, 600.0, 200.0).unwrap().with_calibration(c).unwrap();
    /// assert!((oil.model().unwrap().bo(oil.model().unwrap().pb).unwrap() - 1.35).abs() < 1e-12);
    /// ```
    pub fn with_calibration(mut self, calibration: Calibration) -> Result<Self> {
        if let Some(b) = calibration.bob {
            if !(b > 1.0 && b.is_finite()) {
                return Err(Error::invalid(
                    "bob",
                    b,
                    "measured Bo at Pb must be finite and > 1 rb/STB",
                ));
            }
        }
        if let Some(mu) = calibration.mu_ob_cp {
            positive("mu_ob", mu)?;
        }
        self.calibration = calibration;
        Ok(self)
    }

    /// Set the formation water salinity, weight percent (0 to 30).
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `salinity_wt_pct`.
    ///
    /// # Examples
    /// ```
    /// let oil = stocktank::oil::Oil::new(35.0, 0.8, 600.0, 200.0).unwrap()
    ///     .with_salinity_wt_pct(3.5).unwrap();
    /// assert_eq!(oil.salinity_wt_pct, 3.5);
    /// ```
    pub fn with_salinity_wt_pct(mut self, salinity_wt_pct: f64) -> Result<Self> {
        non_negative("salinity_wt_pct", salinity_wt_pct)?;
        if salinity_wt_pct > 30.0 {
            return Err(Error::invalid(
                "salinity_wt_pct",
                salinity_wt_pct,
                "must be <= 30 wt%",
            ));
        }
        self.salinity_wt_pct = salinity_wt_pct;
        Ok(self)
    }

    /// Set the standard conditions of Rs and gas volumes.
    ///
    /// They set Bg, the gas density and the mass of dissolved gas in the oil density, so
    /// that Bt and the oil density are consistent with Rs in the user's scf. The
    /// correlations themselves take Rs and GOR as given, although their data were reported
    /// at 14.7 psia and 60 degF: with 14.65 psia that is a 0.3 % difference in the gas
    /// volume, well inside each correlation's scatter (see their docs), and not corrected.
    ///
    /// # Examples
    /// ```
    /// use stocktank::units::StandardConditions;
    /// let oil = stocktank::oil::Oil::new(35.0, 0.8, 600.0, 200.0).unwrap()
    ///     .with_standard_conditions(StandardConditions::FIELD_14_65);
    /// assert_eq!(oil.standard_conditions.p_psia, 14.65);
    /// ```
    pub fn with_standard_conditions(mut self, sc: StandardConditions) -> Self {
        self.standard_conditions = sc;
        self
    }

    /// Validate, resolve GOR / bubble point and apply the calibration.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] from the correlations (naming the argument), or when neither
    /// a GOR nor a bubble point was given (`gor`).
    ///
    /// # Examples
    /// ```
    /// let m = stocktank::oil::Oil::new(35.0, 0.8, 600.0, 200.0).unwrap().model().unwrap();
    /// assert_eq!(m.rsi, 600.0);
    /// ```
    pub fn model(&self) -> Result<OilModel> {
        let m = self.methods;
        let (api, t) = (self.api, self.temperature_f);
        let gas_sg_vb = match self.separator {
            Some(s) => vasquez_beggs_gas_sg_100psig(self.gas_sg, api, s.t_f, s.p_psia)?,
            None => self.gas_sg,
        };
        let g_pb = if m.pb == PbMethod::VasquezBeggs {
            gas_sg_vb
        } else {
            self.gas_sg
        };
        let (rsi, pb, pb_corr) = match (self.gor, self.pb_psia) {
            (Some(gor), Some(pb)) => (gor, pb, bubble_point(m.pb, gor, g_pb, api, t)?),
            (Some(gor), None) => {
                let pb = bubble_point(m.pb, gor, g_pb, api, t)?;
                (gor, pb, pb)
            }
            (None, Some(pb)) => (solution_gor(m.pb, pb, g_pb, api, t)?, pb, pb),
            (None, None) => {
                return Err(Error::invalid(
                    "gor",
                    f64::NAN,
                    "give a GOR, a bubble point or both",
                ));
            }
        };
        let g_bo = if m.bo == BoMethod::VasquezBeggs {
            gas_sg_vb
        } else {
            self.gas_sg
        };
        let bob_corr = bo_saturated(m.bo, rsi, g_bo, api, t)?;
        let (bob, bo_scale) = match self.calibration.bob {
            Some(b) if bob_corr > 1.0 => (b, (b - 1.0) / (bob_corr - 1.0)),
            Some(b) => {
                return Err(Error::invalid(
                    "bob",
                    b,
                    "cannot calibrate: the correlation's Bo at Pb is <= 1",
                ));
            }
            None => (bob_corr, 1.0),
        };
        let mu_od = dead_oil_viscosity(m.dead_oil_viscosity, api, t)?;
        let mu_ob_corr = live_oil_viscosity(mu_od, rsi)?;
        let (mu_ob, mu_scale) = match self.calibration.mu_ob_cp {
            Some(mu) => (mu, mu / mu_ob_corr),
            None => (mu_ob_corr, 1.0),
        };
        let g_co = if m.co == CoMethod::VasquezBeggs {
            gas_sg_vb
        } else {
            self.gas_sg
        };
        let hoisted = Hoisted {
            rs_standing: (m.pb == PbMethod::Standing).then(|| StandingRs::new(g_pb, api, t)),
            bo_standing: (m.bo == BoMethod::Standing)
                .then(|| StandingBo::new(g_bo, sg_from_api(api).unwrap_or(f64::NAN), t)),
            live: LiveOilViscosity::new(mu_od),
            co_a: match co_coefficient(m.co, rsi, g_co, api, t) {
                Ok(a) if bob > 0.0 && pb > 0.0 => a,
                _ => f64::NAN,
            },
            ln_pb: fastmath::ln_scalar(pb),
        };
        Ok(OilModel {
            oil: *self,
            hoisted,
            gas_sg_vb,
            rsi,
            pb,
            report: CalibrationReport {
                pb_correlation_psia: pb_corr,
                pb_psia: pb,
                pb_scale: pb / pb_corr,
                bob_correlation: bob_corr,
                bob,
                bo_scale,
                mu_ob_correlation_cp: mu_ob_corr,
                mu_ob_cp: mu_ob,
                mu_scale,
            },
            mu_od,
        })
    }

    /// How far the raw correlations were from the measurements (see the module docs).
    ///
    /// # Errors
    /// As [`Oil::model`].
    ///
    /// # Examples
    /// ```
    /// let oil = stocktank::oil::Oil::new(35.0, 0.8, 600.0, 200.0).unwrap()
    ///     .with_measured_bubble_point(2800.0).unwrap();
    /// let r = oil.calibration_report().unwrap();
    /// assert!((r.pb_scale * r.pb_correlation_psia - 2800.0).abs() < 1e-9);
    /// ```
    pub fn calibration_report(&self) -> Result<CalibrationReport> {
        Ok(self.model()?.report)
    }
}

impl OilModel {
    #[inline]
    fn g_for_pb(&self) -> f64 {
        if self.oil.methods.pb == PbMethod::VasquezBeggs {
            self.gas_sg_vb
        } else {
            self.oil.gas_sg
        }
    }
    #[inline]
    fn g_for_bo(&self) -> f64 {
        if self.oil.methods.bo == BoMethod::VasquezBeggs {
            self.gas_sg_vb
        } else {
            self.oil.gas_sg
        }
    }
    #[inline]
    fn g_for_co(&self) -> f64 {
        if self.oil.methods.co == CoMethod::VasquezBeggs {
            self.gas_sg_vb
        } else {
            self.oil.gas_sg
        }
    }

    /// Solution GOR at pressure `p`, scf/STB: the calibrated saturated Rs below Pb, the
    /// initial GOR at and above it.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `p`.
    ///
    /// # Examples
    /// ```
    /// let m = stocktank::oil::Oil::new(35.0, 0.8, 600.0, 200.0).unwrap().model().unwrap();
    /// assert_eq!(m.rs(m.pb + 500.0).unwrap(), 600.0);
    /// assert!(m.rs(m.pb - 500.0).unwrap() < 600.0);
    /// ```
    #[inline]
    pub fn rs(&self, p: f64) -> Result<f64> {
        positive("p", p)?;
        if p >= self.pb {
            return Ok(self.rsi);
        }
        Ok(self.rs_saturated(p)?.min(self.rsi))
    }

    /// Solution GOR of the oil if it were saturated at `p` (the calibrated correlation without
    /// the cap at the initial GOR), scf/STB.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `p`.
    ///
    /// # Examples
    /// ```
    /// let m = stocktank::oil::Oil::new(35.0, 0.8, 600.0, 200.0).unwrap().model().unwrap();
    /// assert!(m.rs_saturated(m.pb + 500.0).unwrap() > 600.0);
    /// ```
    #[inline]
    pub fn rs_saturated(&self, p: f64) -> Result<f64> {
        let q = p / self.report.pb_scale;
        if let Some(k) = &self.hoisted.rs_standing {
            if q > 0.0 && q.is_finite() {
                return Ok(k.at(q));
            }
        }
        let o = &self.oil;
        solution_gor(
            o.methods.pb,
            p / self.report.pb_scale,
            self.g_for_pb(),
            o.api,
            o.temperature_f,
        )
    }

    /// Pressure derivative of [`OilModel::rs_saturated`], scf/STB/psi (closed form; with the
    /// pressure scale k_p of the calibration, Rs'(p) = Rs,corr'(p / k_p) / k_p).
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `p`.
    ///
    /// # Examples
    /// ```
    /// let m = stocktank::oil::Oil::new(35.0, 0.8, 600.0, 200.0).unwrap().model().unwrap();
    /// assert!(m.rs_saturated_dp(1000.0).unwrap() > 0.0);
    /// ```
    #[inline]
    pub fn rs_saturated_dp(&self, p: f64) -> Result<f64> {
        let o = &self.oil;
        let k = self.report.pb_scale;
        Ok(solution_gor_dp(o.methods.pb, p / k, self.g_for_pb(), o.api, o.temperature_f)? / k)
    }

    /// Derivative of the calibrated saturated Bo with respect to Rs, rb/STB per scf/STB
    /// (closed form, times the shrinkage scale k_B).
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `rs`.
    ///
    /// # Examples
    /// ```
    /// let m = stocktank::oil::Oil::new(35.0, 0.8, 600.0, 200.0).unwrap().model().unwrap();
    /// assert!(m.bo_saturated_drs(300.0).unwrap() > 0.0);
    /// ```
    #[inline]
    pub fn bo_saturated_drs(&self, rs: f64) -> Result<f64> {
        let o = &self.oil;
        Ok(self.report.bo_scale
            * bo_saturated_drs(o.methods.bo, rs, self.g_for_bo(), o.api, o.temperature_f)?)
    }

    /// Slopes of the saturated curve at `p` < Pb, (dRs/dp in scf/STB/psi, dBo/dp in
    /// rb/STB/psi), given `rs = self.rs(p)` and `bo = self.bo_saturated(rs)` already computed
    /// (the table builder's fast path; same closed forms as [`OilModel::rs_saturated_dp`] and
    /// [`OilModel::bo_saturated_drs`]).
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `rs`.
    ///
    /// # Examples
    /// ```
    /// let m = stocktank::oil::Oil::new(35.0, 0.8, 600.0, 200.0).unwrap().model().unwrap();
    /// let rs = m.rs(1000.0).unwrap();
    /// let bo = m.bo_saturated(rs).unwrap();
    /// let (drs, dbo) = m.saturated_slopes(1000.0, rs, bo).unwrap();
    /// assert!((drs - m.rs_saturated_dp(1000.0).unwrap()).abs() < 1e-12);
    /// assert!((dbo - m.bo_saturated_drs(rs).unwrap() * drs).abs() < 1e-12);
    /// ```
    #[inline]
    pub fn saturated_slopes(&self, p: f64, rs: f64, bo: f64) -> Result<(f64, f64)> {
        let o = &self.oil;
        let kb = self.report.bo_scale;
        let drs = self.rs_slope_given(o.methods.pb, p, rs);
        let bo_corr = self.uncalibrated_bo(bo);
        if let Some(k) = &self.hoisted.bo_standing {
            return Ok((drs, kb * k.drs_given(rs, bo_corr) * drs));
        }
        let dbo_drs = kb
            * bo_saturated_drs_given(
                o.methods.bo,
                rs,
                bo_corr,
                self.g_for_bo(),
                o.api,
                o.temperature_f,
            )?;
        Ok((drs, dbo_drs * drs))
    }

    /// Oil viscosity of the saturated oil holding `rs` (at or below Pb), cp (calibrated).
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `rs`.
    ///
    /// # Examples
    /// ```
    /// let m = stocktank::oil::Oil::new(35.0, 0.8, 600.0, 200.0).unwrap().model().unwrap();
    /// assert_eq!(m.viscosity_saturated(600.0).unwrap(), m.viscosity(m.pb).unwrap());
    /// ```
    #[inline]
    pub fn viscosity_saturated(&self, rs: f64) -> Result<f64> {
        if rs == self.rsi {
            return Ok(self.report.mu_ob_cp);
        }
        if rs >= 0.0 && rs.is_finite() {
            return Ok(self.calibrated_viscosity(rs, self.hoisted.live.at(rs)));
        }
        Ok(self.calibrated_viscosity(rs, live_oil_viscosity(self.mu_od, rs)?))
    }

    /// Calibrated saturated Bo at solution GOR `rs`, rb/STB.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `rs`.
    ///
    /// # Examples
    /// ```
    /// let m = stocktank::oil::Oil::new(35.0, 0.8, 600.0, 200.0).unwrap().model().unwrap();
    /// assert_eq!(m.bo_saturated(600.0).unwrap(), m.report.bob);
    /// ```
    #[inline]
    pub fn bo_saturated(&self, rs: f64) -> Result<f64> {
        let o = &self.oil;
        let b = match &self.hoisted.bo_standing {
            Some(k) if rs >= 0.0 && k.group(rs) >= 0.0 => k.at_group(k.group(rs)),
            _ => bo_saturated(o.methods.bo, rs, self.g_for_bo(), o.api, o.temperature_f)?,
        };
        Ok(self.calibrated_bo(rs, b))
    }

    /// Oil FVF at pressure `p`, rb/STB (saturated below Pb, exp(-integral co dp) above).
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `p`.
    ///
    /// # Examples
    /// ```
    /// let m = stocktank::oil::Oil::new(35.0, 0.8, 600.0, 200.0).unwrap().model().unwrap();
    /// assert!(m.bo(m.pb + 1000.0).unwrap() < m.bo(m.pb).unwrap());
    /// ```
    #[inline]
    pub fn bo(&self, p: f64) -> Result<f64> {
        if p > self.pb && p.is_finite() && self.has_co_coefficient() {
            return Ok(self.bo_above_pb(p, fastmath::ln_scalar(p)));
        }
        if p > self.pb {
            let o = &self.oil;
            bo_undersaturated(
                o.methods.co,
                p,
                self.pb,
                self.report.bob,
                self.rsi,
                self.g_for_co(),
                o.api,
                o.temperature_f,
            )
        } else {
            self.bo_saturated(self.rs(p)?)
        }
    }

    /// Undersaturated oil compressibility at `p` >= Pb, 1/psi.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `p`.
    ///
    /// # Examples
    /// ```
    /// let m = stocktank::oil::Oil::new(35.0, 0.8, 600.0, 200.0).unwrap().model().unwrap();
    /// assert!(m.co_undersaturated(m.pb + 1000.0).unwrap() > 0.0);
    /// ```
    #[inline]
    pub fn co_undersaturated(&self, p: f64) -> Result<f64> {
        if p > 0.0 && self.has_co_coefficient() {
            return Ok(self.co_above_pb_with::<fastmath::System>(self.oil.methods.co, p));
        }
        let o = &self.oil;
        co_undersaturated(
            o.methods.co,
            p,
            self.rsi,
            self.g_for_co(),
            o.api,
            o.temperature_f,
        )
    }

    /// Oil compressibility at `p`, 1/psi: the undersaturated co at and above Pb, the apparent
    /// (black-oil) compressibility below it, where the gas the oil liberates expands too.
    ///
    /// The same values as the `co` column of [`crate::oil::BlackOilTable`] built with `gas`.
    ///
    /// # Formula
    /// ```text
    /// p >= Pb:  co = -(1/Bo) (dBo/dp)_T            (the chosen co correlation, e.g. Vasquez–Beggs)
    /// p <  Pb:  co = -(1/Bo) dBo/dp + (Bg/Bo) dRs/dp   (Bg in rb/scf, along the saturated curve)
    /// ```
    ///
    /// # Arguments
    /// * `p` - pressure, psia, > 0.
    /// * `gas` - the liberated gas, for Bg below Pb (e.g. `Gas::new(oil.gas_sg)`, the
    ///   table builder's default); unused at and above Pb.
    ///
    /// # Returns
    /// co, 1/psi.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `p`.
    ///
    /// # Examples
    /// ```
    /// use stocktank::gas::Gas;
    /// let m = stocktank::oil::Oil::new(35.0, 0.8, 600.0, 200.0).unwrap().model().unwrap();
    /// let g = Gas::new(0.8).unwrap();
    /// assert_eq!(m.co(m.pb + 500.0, &g).unwrap(), m.co_undersaturated(m.pb + 500.0).unwrap());
    /// // Below Pb the liberated gas makes the oil far more compressible.
    /// assert!(m.co(m.pb - 500.0, &g).unwrap() > 10.0 * m.co(m.pb, &g).unwrap());
    /// ```
    ///
    /// # References
    /// Vasquez, M., Beggs, H.D. (1980). Correlations for fluid physical property prediction.
    /// JPT 32(6), 968–970; Perrine (1956) and Martin (1959) for the apparent compressibility
    /// (see [`crate::oil::apparent_compressibility`]).
    pub fn co(&self, p: f64, gas: &Gas) -> Result<f64> {
        positive("p", p)?;
        if p >= self.pb {
            return self.co_undersaturated(p);
        }
        let o = &self.oil;
        let rs = self.rs(p)?;
        let bo = self.bo_saturated(rs)?;
        let (drs, dbo) = self.saturated_slopes(p, rs, bo)?;
        let bg_rb = gas.bg(p, o.temperature_f, &o.standard_conditions)? / FT3_PER_BBL;
        apparent_compressibility(bo, dbo, bg_rb, drs)
    }

    /// Oil viscosity at `p`, cp (live saturated below Pb, undersaturated above; calibrated).
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `p`.
    ///
    /// # Examples
    /// ```
    /// let m = stocktank::oil::Oil::new(35.0, 0.8, 600.0, 200.0).unwrap().model().unwrap();
    /// assert!(m.viscosity(1000.0).unwrap() > m.viscosity(m.pb).unwrap());
    /// ```
    #[inline]
    pub fn viscosity(&self, p: f64) -> Result<f64> {
        if p > self.pb && p.is_finite() {
            return Ok(self.viscosity_above_pb(p, fastmath::ln_scalar(p)));
        }
        if p > self.pb {
            undersaturated_oil_viscosity(p, self.pb, self.report.mu_ob_cp)
        } else {
            self.viscosity_saturated(self.rs(p)?)
        }
    }

    /// Bo above Pb at `p` > Pb given `ln_p` = ln p (the table builder computes it once per
    /// pressure); needs a valid co coefficient (checked by the callers).
    #[inline(always)]
    pub(crate) fn bo_above_pb(&self, p: f64, ln_p: f64) -> f64 {
        debug_assert!(p > self.pb);
        self.bo_above_pb_with::<fastmath::System>(self.oil.methods.co, ln_p)
    }

    /// [`OilModel::bo_above_pb`] with the exponential of `M` (the one formula; the table
    /// builder evaluates a column of it with [`fastmath::Lanes`]).
    /// `co` must be the model's co method (`self.oil.methods.co`; a column kernel passes it
    /// as a constant so that the choice is made once, outside its loop).
    #[inline(always)]
    pub(crate) fn bo_above_pb_with<M: fastmath::Elementary>(&self, co: CoMethod, ln_p: f64) -> f64 {
        debug_assert_eq!(co, self.oil.methods.co);
        let h = &self.hoisted;
        self.report.bob * bo_ratio_with_coefficient_with::<M>(co, h.co_a, ln_p, h.ln_pb)
    }

    /// The undersaturated co at `p` (psia, > 0) from the hoisted coefficient (valid when
    /// [`OilModel::has_co_coefficient`]), 1/psi, with the functions of `M`; `co` as in
    /// [`OilModel::bo_above_pb_with`].
    #[inline(always)]
    pub(crate) fn co_above_pb_with<M: fastmath::Elementary>(&self, co: CoMethod, p: f64) -> f64 {
        debug_assert_eq!(co, self.oil.methods.co);
        co_with_coefficient_with::<M>(co, self.hoisted.co_a, p)
    }

    /// Whether [`OilModel::bo_above_pb`] can be used (the co correlation accepted the oil,
    /// and Pb and Bob are positive).
    #[inline]
    pub(crate) fn has_co_coefficient(&self) -> bool {
        !self.hoisted.co_a.is_nan()
    }

    /// Viscosity above Pb at finite `p` > Pb given `ln_p` = ln p, cp.
    #[inline(always)]
    pub(crate) fn viscosity_above_pb(&self, p: f64, ln_p: f64) -> f64 {
        self.viscosity_above_pb_with::<fastmath::System>(p, ln_p)
    }

    /// [`OilModel::viscosity_above_pb`] with the exponential of `M` (the one formula).
    #[inline(always)]
    pub(crate) fn viscosity_above_pb_with<M: fastmath::Elementary>(
        &self,
        p: f64,
        ln_p: f64,
    ) -> f64 {
        self.report.mu_ob_cp * undersaturated_viscosity_ratio_with::<M>(p, ln_p, self.hoisted.ln_pb)
    }

    /// The calibration of saturated Bo: `b` from the correlation at `rs`, 1 + k_B (b - 1),
    /// exactly Bob at the initial GOR.
    #[inline(always)]
    fn calibrated_bo(&self, rs: f64, b: f64) -> f64 {
        // Both sides loaded and computed first, then a select: a load inside the branch
        // could not be speculated, and the branch would keep a column loop scalar.
        let (bob, rsi) = (self.report.bob, self.rsi);
        let scaled = 1.0 + self.report.bo_scale * (b - 1.0);
        if rs == rsi { bob } else { scaled }
    }

    /// The correlation's Bo behind a calibrated `bo` (the inverse of the shrinkage scale).
    #[inline(always)]
    fn uncalibrated_bo(&self, bo: f64) -> f64 {
        1.0 + (bo - 1.0) / self.report.bo_scale
    }

    /// The calibration of the live-oil viscosity: `mu` from the correlation at `rs` times
    /// k_mu, exactly the Pb value at the initial GOR.
    #[inline(always)]
    fn calibrated_viscosity(&self, rs: f64, mu: f64) -> f64 {
        let (mu_ob, rsi) = (self.report.mu_ob_cp, self.rsi);
        let scaled = self.report.mu_scale * mu;
        if rs == rsi { mu_ob } else { scaled }
    }

    /// dRs/dp (scf/STB/psi) of the calibrated saturated curve at `p` given its `rs`, for
    /// the model's bubble-point method `method` (a constant where the caller knows it).
    #[inline(always)]
    fn rs_slope_given(&self, method: PbMethod, p: f64, rs: f64) -> f64 {
        let kp = self.report.pb_scale;
        solution_gor_dp_given(method, p / kp, rs, self.oil.api) / kp
    }

    /// The default correlation set's saturated branch (Standing's Rs and Bo) in the form
    /// the table builder's column kernel evaluates, when the model uses both and its
    /// undersaturated co coefficient is valid; `None` otherwise (the builder then goes row
    /// by row through the checked methods).
    #[inline]
    pub(crate) fn standing_forms(&self) -> Option<StandingForms<'_>> {
        match (self.hoisted.rs_standing, self.hoisted.bo_standing) {
            (Some(rs), Some(bo)) if self.has_co_coefficient() => Some(StandingForms {
                model: self,
                rs,
                bo,
            }),
            _ => None,
        }
    }
}

/// Standing's (1947) Rs and Bo of one calibrated model, for columns of pressures below Pb:
/// each method is the one its checked counterpart on [`OilModel`] uses (same formula,
/// same calibration), without the checks, generic over the exponential and logarithm
/// ([`fastmath::Elementary`]). The table builder checks the preconditions on the results.
#[derive(Clone, Copy)]
pub(crate) struct StandingForms<'a> {
    model: &'a OilModel,
    rs: StandingRs,
    bo: StandingBo,
}

impl StandingForms<'_> {
    /// [`OilModel::rs`] at `p` < Pb (psia, finite, > 0), scf/STB.
    #[inline(always)]
    pub(crate) fn rs<M: fastmath::Elementary>(&self, p: f64) -> f64 {
        let m = self.model;
        self.rs.at_with::<M>(p / m.report.pb_scale).min(m.rsi)
    }

    /// Standing's correlating group F at `rs`: [`StandingForms::bo_correlation`] and
    /// [`StandingForms::slopes`] hold where it is > 0 (as the checked forms require).
    #[inline(always)]
    pub(crate) fn group(&self, rs: f64) -> f64 {
        self.bo.group(rs)
    }

    /// Standing's Bo at `rs` (F > 0) before calibration, rb/STB: with
    /// [`StandingForms::calibrated_bo`], [`OilModel::bo_saturated`] at `rs`.
    #[inline(always)]
    pub(crate) fn bo_correlation<M: fastmath::Elementary>(&self, rs: f64) -> f64 {
        self.bo.at_group_with::<M>(self.bo.group(rs))
    }

    /// The calibration of a saturated Bo `b` (rb/STB) of the correlation at `rs`.
    #[inline(always)]
    pub(crate) fn calibrated_bo(&self, rs: f64, b: f64) -> f64 {
        self.model.calibrated_bo(rs, b)
    }

    /// [`OilModel::saturated_slopes`] at `p` < Pb with its `rs` and `bo` (F > 0):
    /// (dRs/dp in scf/STB/psi, dBo/dp in rb/STB/psi).
    #[inline(always)]
    pub(crate) fn slopes(&self, p: f64, rs: f64, bo: f64) -> (f64, f64) {
        let m = self.model;
        let drs = m.rs_slope_given(PbMethod::Standing, p, rs);
        let bo_corr = m.uncalibrated_bo(bo);
        let dbo_drs = self.bo.drs_given_group(self.bo.group(rs), bo_corr);
        (drs, m.report.bo_scale * dbo_drs * drs)
    }

    /// Beggs–Robinson's (1975) live-oil viscosity at `rs` before calibration, cp: with
    /// [`StandingForms::calibrated_viscosity`], [`OilModel::viscosity_saturated`] at `rs`.
    #[inline(always)]
    pub(crate) fn viscosity_correlation<M: fastmath::Elementary>(&self, rs: f64) -> f64 {
        self.model.hoisted.live.at_with::<M>(rs)
    }

    /// The calibration of a live-oil viscosity `mu` (cp) of the correlation at `rs`.
    #[inline(always)]
    pub(crate) fn calibrated_viscosity(&self, rs: f64, mu: f64) -> f64 {
        self.model.calibrated_viscosity(rs, mu)
    }
}

impl OilModel {
    /// Dead-oil viscosity at reservoir temperature, cp (uncalibrated).
    ///
    /// # Examples
    /// ```
    /// let m = stocktank::oil::Oil::new(35.0, 0.8, 600.0, 200.0).unwrap().model().unwrap();
    /// assert!(m.dead_oil_viscosity() > m.viscosity(m.pb).unwrap());
    /// ```
    pub fn dead_oil_viscosity(&self) -> f64 {
        self.mu_od
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn calibrated_pb_round_trip() {
        for pb_meas in [1800.0, 2500.0, 3500.0] {
            let oil = Oil::new(32.0, 0.78, 550.0, 190.0)
                .unwrap()
                .with_measured_bubble_point(pb_meas)
                .unwrap();
            let m = oil.model().unwrap();
            assert_eq!(m.pb, pb_meas);
            let rs_b = m.rs(pb_meas * (1.0 - 1e-12)).unwrap();
            assert!((rs_b - 550.0).abs() < 1e-6, "{rs_b}");
        }
    }

    #[test]
    fn bo_continuous_at_pb() {
        let m = Oil::new(32.0, 0.78, 550.0, 190.0).unwrap().model().unwrap();
        let below = m.bo(m.pb * (1.0 - 1e-10)).unwrap();
        let above = m.bo(m.pb * (1.0 + 1e-10)).unwrap();
        assert!((below - above).abs() < 1e-6);
    }
}
