//! Integration tests of the decline module (public API only).
//!
//! Reference values: the closed forms of Arps (1945) for the exponential and harmonic
//! cases, and synthetic round trips (histories generated from known parameters).

use stocktank::decline::{
    Arps, FitOptions, FitStatus, Loss, Period, Start, cumulative, effective_decline, fit_well,
    fit_wells, forecast, nominal_decline, rate, rate_at_cumulative, remaining, time_to_rate,
};
use stocktank::units::{DAYS_PER_MONTH, DAYS_PER_YEAR};

fn rel(a: f64, b: f64) -> f64 {
    ((a - b) / b).abs()
}

#[test]
fn exponential_limit_b_to_zero() {
    // Arps (1945): b = 0 gives q = qi exp(-D t), Np = (qi - q) / D.
    let (qi, di) = (750.0, 0.45);
    for &t in &[10.0, 400.0, 5000.0] {
        let d = di / DAYS_PER_YEAR;
        let q = qi * (-d * t).exp();
        let np = (qi - q) / d;
        assert!(rel(rate(qi, di, 0.0, 0.0, t).unwrap(), q) < 1e-14);
        assert!(rel(cumulative(qi, di, 0.0, 0.0, t).unwrap(), np) < 1e-13);
        // continuity as b -> 0
        assert!(rel(rate(qi, di, 1e-9, 0.0, t).unwrap(), q) < 1e-7);
        assert!(rel(cumulative(qi, di, 1e-9, 0.0, t).unwrap(), np) < 1e-7);
    }
}

#[test]
fn harmonic_limit_b_equal_one() {
    // Arps (1945): b = 1 gives q = qi / (1 + D t), Np = qi / D ln(qi / q).
    let (qi, di) = (750.0, 0.45);
    for &t in &[10.0, 400.0, 5000.0] {
        let d = di / DAYS_PER_YEAR;
        let q = qi / (1.0 + d * t);
        let np = qi / d * (qi / q).ln();
        assert!(rel(rate(qi, di, 1.0, 0.0, t).unwrap(), q) < 1e-14);
        assert!(rel(cumulative(qi, di, 1.0, 0.0, t).unwrap(), np) < 1e-13);
        for b in [1.0 - 1e-9, 1.0 + 1e-9] {
            assert!(rel(cumulative(qi, di, b, 0.0, t).unwrap(), np) < 1e-7);
        }
    }
}

#[test]
fn hyperbolic_closed_form() {
    // Arps (1945): Np = qi^b / ((1 - b) D) (qi^(1-b) - q^(1-b)).
    let (qi, di, b, t) = (1200.0, 1.3, 0.6, 900.0);
    let d = di / DAYS_PER_YEAR;
    let q = qi * (1.0 + b * d * t).powf(-1.0 / b);
    let np = qi.powf(b) / ((1.0 - b) * d) * (qi.powf(1.0 - b) - q.powf(1.0 - b));
    assert!(rel(rate(qi, di, b, 0.0, t).unwrap(), q) < 1e-13);
    assert!(rel(cumulative(qi, di, b, 0.0, t).unwrap(), np) < 1e-12);
}

#[test]
fn terminal_switch_is_continuous_in_rate_and_slope() {
    let a = Arps::new(900.0, 2.0, 1.3, 0.08).unwrap();
    let ts = a.switch_time();
    assert!(ts.is_finite());
    let h = 1e-4;
    let (q_lo, q_hi) = (a.rate(ts - h).unwrap(), a.rate(ts + h).unwrap());
    assert!(rel(q_lo, q_hi) < 1e-6);
    // slope dq/dt on each side (one-sided differences)
    let s_lo = (a.rate(ts).unwrap() - a.rate(ts - 1.0).unwrap()) / 1.0;
    let s_hi = (a.rate(ts + 1.0).unwrap() - a.rate(ts).unwrap()) / 1.0;
    assert!(rel(s_lo, s_hi) < 1e-3, "{s_lo} {s_hi}");
    // the nominal decline is d_min on both sides at the switch
    assert!((a.decline(ts) - 0.08).abs() < 1e-12);
    assert!((a.decline(ts + 100.0) - 0.08).abs() < 1e-12);
    // the cumulative is the integral of the rate: dNp/dt = q on both sides
    for &t in &[ts - 50.0, ts + 50.0] {
        let dnp = (a.cumulative(t + 0.5).unwrap() - a.cumulative(t - 0.5).unwrap()) / 1.0;
        assert!(rel(dnp, a.rate(t).unwrap()) < 1e-6);
    }
    // b > 1 with a terminal decline has a finite ultimate cumulative
    assert!(a.cumulative(f64::INFINITY).unwrap().is_finite());
    let plain = Arps::new(900.0, 2.0, 1.3, 0.0).unwrap();
    assert!(plain.cumulative(f64::INFINITY).unwrap().is_infinite());
}

#[test]
fn time_to_rate_inverts_rate() {
    for &(b, dm) in &[(0.0, 0.0), (0.5, 0.0), (1.0, 0.1), (1.6, 0.06), (0.8, 0.9)] {
        let a = Arps::new(500.0, 1.1, b, dm).unwrap();
        for &ql in &[400.0, 50.0, 0.5] {
            let t = a.time_to_rate(ql).unwrap();
            assert!(rel(a.rate(t).unwrap(), ql) < 1e-10, "b={b} dm={dm} ql={ql}");
        }
    }
    assert_eq!(time_to_rate(100.0, 1.0, 0.5, 0.0, 200.0).unwrap(), 0.0);
}

#[test]
fn effective_nominal_conversions() {
    // 10 %/yr effective exponential = -ln(0.9) = 0.10536 /yr nominal (common practice, no source)
    let d = nominal_decline(0.10, 0.0, Period::Year).unwrap();
    assert!((d - 0.105_360_515_657_826_3).abs() < 1e-15);
    // per month: nominal per year = 12 x nominal per month for b = 0
    let dm = nominal_decline(0.01, 0.0, Period::Month).unwrap();
    assert!((dm - 12.0 * -(0.99f64.ln())).abs() < 1e-14);
    // hyperbolic secant effective: De = 1 - (1 + b D)^(-1/b); b = 1, D = 1 -> 0.5
    assert!((effective_decline(1.0, 1.0, Period::Year).unwrap() - 0.5).abs() < 1e-15);
    assert!(nominal_decline(1.0, 0.0, Period::Year).is_err());
}

#[test]
fn bad_arguments_are_named() {
    let e = rate(-1.0, 1.0, 0.5, 0.0, 1.0).unwrap_err().to_string();
    assert!(e.contains("`qi`") && e.contains("-1"), "{e}");
    let e = rate(1.0, 1.0, -0.5, 0.0, 1.0).unwrap_err().to_string();
    assert!(e.contains("`b`"), "{e}");
    let e = rate(1.0, 1.0, 0.5, 0.0, -3.0).unwrap_err().to_string();
    assert!(e.contains("`t`"), "{e}");
}

fn history(qi: f64, di: f64, b: f64, months: usize) -> (Vec<f64>, Vec<f64>) {
    let t: Vec<f64> = (0..months).map(|m| m as f64 * DAYS_PER_MONTH).collect();
    let q = t
        .iter()
        .map(|&t| rate(qi, di, b, 0.0, t).unwrap())
        .collect();
    (t, q)
}

fn no_boot() -> FitOptions {
    FitOptions {
        n_bootstrap: 0,
        ..Default::default()
    }
}

#[test]
fn exact_data_is_recovered_for_every_loss() {
    for loss in [Loss::Linear, Loss::SoftL1, Loss::Huber] {
        for &(qi, di, b) in &[(800.0, 1.5, 0.8), (300.0, 0.4, 0.0), (2000.0, 3.0, 1.6)] {
            let (t, q) = history(qi, di, b, 120);
            let f = fit_well(&t, &q, None, &FitOptions { loss, ..no_boot() }).unwrap();
            assert_eq!(f.status, FitStatus::Ok);
            assert!(
                rel(f.qi, qi) < 1e-6 && rel(f.di, di) < 1e-6,
                "{loss:?} {f:?}"
            );
            assert!((f.b - b).abs() < 1e-6, "{loss:?} {f:?}");
        }
    }
}

#[test]
fn shut_ins_missing_months_ramp_up_and_unsorted_input() {
    let (qi, di, b) = (600.0, 1.2, 0.9);
    let (mut t, mut q) = history(qi, di, b, 90);
    // ramp-up: three months before the peak, at rising rates
    for (k, f) in [0.3, 0.6, 0.9].iter().enumerate() {
        t.insert(k, -((3 - k) as f64) * DAYS_PER_MONTH);
        q.insert(k, qi * f);
    }
    q[20] = 0.0; // shut in
    q[21] = 0.0;
    q[40] = f64::NAN; // missing
    // unsorted
    t.reverse();
    q.reverse();
    let f = fit_well(&t, &q, None, &no_boot()).unwrap();
    assert_eq!(f.status, FitStatus::Ok);
    assert!(rel(f.di, di) < 1e-6 && (f.b - b).abs() < 1e-6, "{f:?}");
    assert_eq!(f.t0, 0.0);
    assert_eq!(f.n_excluded, 3 + 3);
    // the user start skips the ramp-up too; Start::First does not, and fits worse
    let g = fit_well(&t, &q, Some(0.0), &no_boot()).unwrap();
    assert!(rel(g.di, di) < 1e-6);
    let h = fit_well(
        &t,
        &q,
        None,
        &FitOptions {
            start: Start::First,
            ..no_boot()
        },
    )
    .unwrap();
    assert!(h.cost > f.cost);
}

#[test]
fn outliers_are_resisted_by_robust_losses() {
    let (qi, di, b) = (600.0, 1.2, 0.9);
    let (t, mut q) = history(qi, di, b, 120);
    for k in [10, 30, 55, 80, 100] {
        q[k] *= 0.25; // partial-month downtime recorded as a low rate
    }
    let lin = fit_well(
        &t,
        &q,
        None,
        &FitOptions {
            loss: Loss::Linear,
            ..no_boot()
        },
    )
    .unwrap();
    let rob = fit_well(
        &t,
        &q,
        None,
        &FitOptions {
            loss: Loss::SoftL1,
            ..no_boot()
        },
    )
    .unwrap();
    let hub = fit_well(
        &t,
        &q,
        None,
        &FitOptions {
            loss: Loss::Huber,
            ..no_boot()
        },
    )
    .unwrap();
    let err = |f: &stocktank::decline::WellFit| rel(f.di, di) + (f.b - b).abs();
    assert!(err(&rob) < 0.5 * err(&lin), "{} {}", err(&rob), err(&lin));
    assert!(err(&hub) < 0.5 * err(&lin), "{} {}", err(&hub), err(&lin));
}

#[test]
fn wells_that_cannot_be_fitted_get_a_status() {
    let opts = no_boot();
    let t: Vec<f64> = (0..12).map(|m| m as f64 * 30.0).collect();
    let zeros = vec![0.0; 12];
    assert_eq!(
        fit_well(&t, &zeros, None, &opts).unwrap().status,
        FitStatus::NoProduction
    );
    let rising: Vec<f64> = (0..12).map(|m| 10.0 + m as f64).collect();
    // peak start leaves one point; first start sees a rising trend
    assert_eq!(
        fit_well(&t, &rising, None, &opts).unwrap().status,
        FitStatus::TooFewPoints
    );
    let first = FitOptions {
        start: Start::First,
        ..opts
    };
    let f = fit_well(&t, &rising, None, &first).unwrap();
    assert_eq!(f.status, FitStatus::NotDeclining);
    assert!(f.message.contains("does not fall"), "{}", f.message);
    let mut neg = rising.clone();
    neg[4] = -2.0;
    let f = fit_well(&t, &neg, None, &opts).unwrap();
    assert_eq!(f.status, FitStatus::InvalidData);
    assert!(f.message.contains("-2"), "{}", f.message);
    let mut dup = t.clone();
    dup[3] = dup[2];
    assert_eq!(
        fit_well(&dup, &rising, None, &opts).unwrap().status,
        FitStatus::InvalidData
    );
    assert!(f.qi.is_nan());
}

#[test]
fn batch_equals_single_fits_and_is_independent_of_the_batch() {
    let opts = FitOptions {
        n_bootstrap: 30,
        ..Default::default()
    };
    let mut t = Vec::new();
    let mut q = Vec::new();
    let mut offsets = vec![0];
    let mut wells = Vec::new();
    for k in 0..12 {
        let (tt, mut qq) = history(
            200.0 + 50.0 * k as f64,
            0.5 + 0.2 * k as f64,
            0.1 * k as f64,
            48 + k,
        );
        // deterministic multiplicative noise
        for (i, v) in qq.iter_mut().enumerate() {
            *v *= 1.0 + 0.08 * (((i * 7 + k * 13) % 11) as f64 / 5.0 - 1.0);
        }
        t.extend(&tt);
        q.extend(&qq);
        offsets.push(t.len());
        wells.push((tt, qq));
    }
    let all = fit_wells(&t, &q, &offsets, None, &opts).unwrap();
    for (k, (tt, qq)) in wells.iter().enumerate() {
        let one = fit_well(tt, qq, None, &opts).unwrap();
        assert_eq!(all[k], one);
        assert!(
            one.eur_p90 <= one.eur_p50 && one.eur_p50 <= one.eur_p10,
            "{one:?}"
        );
    }
    // a sub-batch in another order gives identical results
    let (t2, q2): (Vec<f64>, Vec<f64>) = wells[5..7]
        .iter()
        .rev()
        .flat_map(|(a, b)| a.iter().copied().zip(b.iter().copied()))
        .unzip();
    let n6 = wells[6].0.len();
    let sub = fit_wells(&t2, &q2, &[0, n6, t2.len()], None, &opts).unwrap();
    assert_eq!(sub[0], all[6]);
    assert_eq!(sub[1], all[5]);
    assert!(fit_wells(&t, &q, &[0, 5, 3, t.len()], None, &opts).is_err());
}

#[test]
fn noisy_round_trip_recovers_most_wells() {
    // Synthetic round trip: 200 wells, 10 % log-normal noise, 5 years monthly.
    let mut seed = 12345u64;
    let mut next = || {
        seed ^= seed << 13;
        seed ^= seed >> 7;
        seed ^= seed << 17;
        (seed >> 11) as f64 / (1u64 << 53) as f64
    };
    let (mut ok_b, mut ok_d, mut ok_eur) = (0, 0, 0);
    let n = 200;
    for _ in 0..n {
        let qi = 100.0 + 1900.0 * next();
        let di = 0.3 + 2.7 * next();
        let b = 0.2 + 1.3 * next();
        let (t, mut q) = history(qi, di, b, 120);
        for v in q.iter_mut() {
            // Box-Muller normal
            let z =
                (-2.0 * next().max(1e-300).ln()).sqrt() * (std::f64::consts::TAU * next()).cos();
            *v *= (0.1 * z).exp();
        }
        let f = fit_well(
            &t,
            &q,
            None,
            &FitOptions {
                start: Start::First,
                ..no_boot()
            },
        )
        .unwrap();
        let truth = Arps::new(qi, di, b, 0.0).unwrap();
        let eur_true = truth.eur(1.0, 50.0 * DAYS_PER_YEAR + t[119]).unwrap();
        let eur_fit = f
            .arps(0.0)
            .unwrap()
            .eur(1.0, 50.0 * DAYS_PER_YEAR + t[119])
            .unwrap();
        ok_b += usize::from((f.b - b).abs() / b < 0.2);
        ok_d += usize::from(rel(f.di, di) < 0.2);
        ok_eur += usize::from(rel(eur_fit, eur_true) < 0.2);
    }
    let frac = |k: usize| k as f64 / n as f64;
    println!(
        "within 20 %: b {} di {} eur {}",
        frac(ok_b),
        frac(ok_d),
        frac(ok_eur)
    );
    assert!(frac(ok_d) > 0.8 && frac(ok_b) > 0.8 && frac(ok_eur) > 0.8);
}

#[test]
fn forecast_volumes_add_up_to_remaining() {
    let a = Arps::new(400.0, 1.4, 1.2, 0.07).unwrap();
    let rows = forecast(&a, 700.0, 3.0, 700.0 + 30.0 * DAYS_PER_YEAR, DAYS_PER_MONTH).unwrap();
    let total: f64 = rows.iter().map(|r| r.volume).sum();
    let rem = a
        .remaining(700.0, 3.0, 700.0 + 30.0 * DAYS_PER_YEAR)
        .unwrap();
    assert!(rel(total, rem) < 1e-12);
    assert!(rows.windows(2).all(|w| w[1].rate < w[0].rate));
    assert!(rel(rows.last().unwrap().cumulative, rem) < 1e-12);
}

#[test]
fn rate_against_cumulative_closed_forms() {
    // Arps (1945): b = 0: q = qi - D Np; b = 1: q = qi exp(-D Np / qi);
    // 0 < b < 1: q = qi (1 - (1 - b) D Np / qi)^(1 / (1 - b)).
    let (qi, di) = (640.0, 0.9);
    let d = di / DAYS_PER_YEAR;
    for &np in &[0.0, 1.0e4, 2.0e5] {
        assert!((rate_at_cumulative(qi, di, 0.0, 0.0, np).unwrap() - (qi - d * np)).abs() < 1e-9);
        let h = qi * (-d * np / qi).exp();
        assert!(rel(rate_at_cumulative(qi, di, 1.0, 0.0, np).unwrap(), h) < 1e-12);
        let b = 0.4;
        let hyp = qi * (1.0 - (1.0 - b) * d * np / qi).powf(1.0 / (1.0 - b));
        assert!(rel(rate_at_cumulative(qi, di, b, 0.0, np).unwrap(), hyp) < 1e-12);
    }
    // beyond the ultimate cumulative of an exponential: an error naming np
    let e = rate_at_cumulative(qi, di, 0.0, 0.0, qi / d * 1.01)
        .unwrap_err()
        .to_string();
    assert!(e.contains("`np`"), "{e}");
    // with a terminal decline, time_at_cumulative inverts cumulative on both sides of the switch
    let a = Arps::new(qi, 2.5, 1.4, 0.1).unwrap();
    for &t in &[100.0, a.switch_time() * 0.9, a.switch_time() * 1.5] {
        let np = a.cumulative(t).unwrap();
        assert!(rel(a.time_at_cumulative(np).unwrap(), t) < 1e-9);
    }
    let r = remaining(qi, di, 0.5, 0.0, 300.0, 5.0, f64::INFINITY).unwrap();
    assert!(
        rel(
            r,
            a_eur(qi, di) - cumulative(qi, di, 0.5, 0.0, 300.0).unwrap()
        ) < 1e-12
    );
    assert!(remaining(qi, di, 0.5, 0.0, 300.0, 5.0, -1.0).is_err());
}

fn a_eur(qi: f64, di: f64) -> f64 {
    stocktank::decline::eur(qi, di, 0.5, 0.0, 5.0, f64::INFINITY).unwrap()
}
