//! Production decline: Arps (1945) rate-time models with an optional terminal exponential
//! decline, nominal and effective decline rates, cumulative volumes, time and cumulative to
//! an economic limit, EUR and remaining volumes, monthly forecast tables, and robust fits of
//! one well or many wells in parallel.
//!
//! Units: rates per day (STB/d or Mscf/d); time in days (a fixed origin of the caller's
//! choice for records, days since the start of the decline for the models); cumulative
//! volumes in rate x days (STB or Mscf); decline rates **nominal per year** unless named
//! `d_effective` (effective over a [`Period`]). One year is 365.25 days, one month 30.4375
//! days ([`crate::units::DAYS_PER_YEAR`], [`crate::units::DAYS_PER_MONTH`]).
//!
//! The results are screening estimates: reserves and investment decisions need the judgment
//! of a qualified engineer and the reserves-reporting rules that apply.
//!
//! # References
//! - Arps, J.J. (1945). Analysis of Decline Curves. Trans. AIME 160(1), 228-247.
//! - Fetkovich, M.J. (1980). Decline Curve Analysis Using Type Curves. JPT 32(6), 1065-1077.

mod arps;
mod fit;
mod forecast;

pub use arps::{
    Arps, Period, cumulative, cumulative_array, effective_decline, effective_decline_array, eur,
    eur_array, nominal_decline, nominal_decline_array, rate, rate_array, rate_at_cumulative,
    rate_at_cumulative_array, remaining, remaining_array, time_to_rate, time_to_rate_array,
};
pub use fit::{FitOptions, FitStatus, Loss, Start, WellFit, fit_well, fit_wells};
pub use forecast::{ForecastStep, MAX_FORECAST_STEPS, MONTH_STEP_DAYS, forecast, forecast_many};

#[cfg(test)]
mod tests {
    #[test]
    fn public_types_are_send_sync() {
        fn check<T: Send + Sync>() {}
        check::<super::Arps>();
        check::<super::FitOptions>();
        check::<super::WellFit>();
        check::<super::ForecastStep>();
    }
}
