//! Integration tests of the material-balance domain (public API only).
//!
//! Sources of the check values are named beside each check. Synthetic round trips generate
//! a history from known parameters with the forward model and recover them.

use stocktank::Error;
use stocktank::material_balance::*;
use stocktank::relperm::CoreyGasOil;
use stocktank::units::StandardConditions;

const PB: f64 = 2500.0;
const PI: f64 = 3000.0;

/// A smooth synthetic black-oil table (a generator for round trips, not a check value).
fn pvt() -> PvtTable {
    let p: Vec<f64> = (0..=30).map(|k| 400.0 + 100.0 * k as f64).collect(); // 400..3400
    let mut bo = vec![];
    let mut rs = vec![];
    let mut bg = vec![];
    let mut muo = vec![];
    let mut mug = vec![];
    for &x in &p {
        let s = x.min(PB);
        let r = 100.0 + 0.2 * s; // scf/STB
        rs.push(r);
        let bob = 1.05 + 0.00012 * r;
        bo.push(if x <= PB {
            bob
        } else {
            (1.05 + 0.00012 * (100.0 + 0.2 * PB)) * (-1.2e-5 * (x - PB)).exp()
        });
        let z = 1.0 - 6e-5 * x + 1.2e-8 * x * x;
        bg.push(0.00504 * z * 640.0 / x); // rb/scf
        muo.push(if x <= PB {
            2.2 - 0.0005 * x
        } else {
            2.2 - 0.0005 * PB + 1e-5 * (x - PB)
        });
        mug.push(0.012 + 2.5e-6 * x);
    }
    PvtTable::new(p, bo, rs, bg)
        .unwrap()
        .with_bw(vec![1.02; 31])
        .unwrap()
        .with_viscosities(muo, mug)
        .unwrap()
}

fn reservoir() -> OilReservoir {
    OilReservoir::new(PI, 0.2, 3e-6, 4e-6).unwrap()
}

/// Forward model: given pressures and (N, m, aquifer), produce a history with a producing
/// GOR of Rs + 400 scf/STB below the bubble point and no water production.
fn synthetic(t: &[f64], p: &[f64], n: f64, m: f64, aq: Option<Aquifer>) -> OilHistory {
    let table = pvt();
    let res = reservoir();
    let k = t.len();
    let zero = OilHistory::new(
        t.to_vec(),
        p.to_vec(),
        vec![0.0; k],
        vec![0.0; k],
        vec![0.0; k],
        vec![],
        vec![],
        PI,
    )
    .unwrap();
    let terms = oil_mbe_terms(&table, &zero, &res).unwrap();
    let et = terms.et(m);
    let we = match aq {
        Some(a) => a.influx(t, p, PI).unwrap(),
        None => vec![0.0; k],
    };
    // Gp accumulates the producing GOR R = Rs + extra over each step's oil; F fixes Np:
    // F = Np Bo + (Gp_prev + R (Np - Np_prev) - Np Rs) Bg.
    let mut np: Vec<f64> = vec![];
    let mut gp: Vec<f64> = vec![];
    let (mut np_prev, mut gp_prev) = (0.0, 0.0);
    for i in 0..k {
        let q = table.at(p[i]).unwrap();
        let extra = 400.0 * ((PB - p[i]) / 500.0).clamp(0.0, 1.0);
        let r = q.rs + extra;
        let f = n * et[i] + we[i];
        let npi = (f - (gp_prev - r * np_prev) * q.bg) / (q.bo + extra * q.bg);
        let gpi = gp_prev + r * (npi - np_prev);
        np.push(npi);
        gp.push(gpi);
        np_prev = npi;
        gp_prev = gpi;
    }
    // Cumulatives must not fall: the generator's pressures decline monotonically.
    OilHistory::new(
        t.to_vec(),
        p.to_vec(),
        np,
        gp,
        vec![0.0; k],
        vec![],
        vec![],
        PI,
    )
    .unwrap()
}

fn declining(k: usize, p_end: f64) -> (Vec<f64>, Vec<f64>) {
    let t: Vec<f64> = (0..k).map(|i| 30.0 * i as f64).collect();
    let p: Vec<f64> = (0..k)
        .map(|i| {
            let x = i as f64 / (k - 1) as f64;
            PI - (PI - p_end) * (1.0 - (-2.5 * x).exp()) / (1.0 - (-2.5f64).exp())
        })
        .collect();
    (t, p)
}

// ---- Stehfest against Laplace pairs with closed forms --------------------------------------

#[test]
fn stehfest_inverts_known_pairs() {
    // Laplace pairs (Abramowitz & Stegun 1964, Table 29.3): 1/s^2 <-> t; 1/(s+a) <-> e^{-at};
    // 1/sqrt(s) <-> 1/sqrt(pi t); 1/(s (s+1)) <-> 1 - e^{-t}.
    let w = stehfest_weights(STEHFEST_TERMS).unwrap();
    for &t in &[0.1, 1.0, 5.0] {
        let f = stehfest_invert(|s| 1.0 / (s * s), t, &w).unwrap();
        assert!((f - t).abs() / t < 1e-6, "1/s^2 at {t}: {f}");
        let f = stehfest_invert(|s| 1.0 / (s + 0.5), t, &w).unwrap();
        assert!((f - (-0.5 * t).exp()).abs() < 2e-4, "1/(s+a) at {t}: {f}");
        let f = stehfest_invert(|s| 1.0 / s.sqrt(), t, &w).unwrap();
        let e = 1.0 / (std::f64::consts::PI * t).sqrt();
        assert!((f - e).abs() / e < 1e-5, "1/sqrt(s) at {t}: {f}");
        let f = stehfest_invert(|s| 1.0 / (s * (s + 1.0)), t, &w).unwrap();
        assert!((f - (1.0 - (-t).exp())).abs() < 2e-4);
    }
}

// ---- van Everdingen-Hurst --------------------------------------------------------------------

#[test]
fn veh_influx_against_table_values_and_limits() {
    // van Everdingen & Hurst (1949), Table I, infinite radial aquifer, WD(tD)
    // (values from memory): tD = 0.1 -> 0.404, 1 -> 1.569, 10 -> 7.411, 100 -> 43.01.
    for (td, wd) in [(0.1, 0.404), (1.0, 1.569), (10.0, 7.411), (100.0, 43.01)] {
        let w = veh_dimensionless_influx(td, f64::INFINITY).unwrap();
        assert!((w - wd).abs() / wd < 3e-3, "tD {td}: {w} vs {wd}");
    }
    // Early time, any reD: WD ~ 2 sqrt(tD/pi) + tD/2 (short-time expansion of the
    // Laplace solution; van Everdingen & Hurst 1949).
    for red in [f64::INFINITY, 3.0, 10.0] {
        let td = 1e-3;
        let w = veh_dimensionless_influx(td, red).unwrap();
        let e = 2.0 * (td / std::f64::consts::PI).sqrt() + td / 2.0;
        assert!((w - e).abs() / e < 1e-3, "red {red}: {w} vs {e}");
    }
    // Closed aquifer: WD -> (reD^2 - 1)/2, the aquifer's full expansion (facts of the trade,
    // common practice, no source).
    for red in [1.5, 3.0, 6.0, 10.0] {
        let w = veh_dimensionless_influx(1e6, red).unwrap();
        let e = (red * red - 1.0) / 2.0;
        assert!((w - e).abs() / e < 1e-5, "red {red}: {w} vs {e}");
    }
    // Constant-rate pD, infinite: tD = 1 -> 0.802, 10 -> 1.651 (van Everdingen & Hurst 1949,
    // Table II, values from memory); late time -> (ln tD + 0.80907)/2 (line source, Matthews
    // & Russell 1967).
    for (td, pd) in [(1.0, 0.802), (10.0, 1.651)] {
        let v = veh_dimensionless_pressure(td, f64::INFINITY).unwrap();
        assert!((v - pd).abs() / pd < 2e-3, "tD {td}: {v} vs {pd}");
    }
    let v = veh_dimensionless_pressure(1e6, f64::INFINITY).unwrap();
    assert!((v - 0.5 * ((1e6f64).ln() + 0.80907)).abs() < 1e-3);
    // Closed, late time: pD ~ 2 tD/(reD^2 - 1) + ln reD - 3/4 (pseudo-steady state,
    // common practice, no source; valid for reD >> 1).
    let red: f64 = 20.0;
    let td = 1e5;
    let v = veh_dimensionless_pressure(td, red).unwrap();
    let e = 2.0 * td / (red * red - 1.0) + red.ln() - 0.75;
    assert!((v - e).abs() / e < 1e-3, "{v} vs {e}");
}

#[test]
fn veh_superposition_of_a_single_step_is_u_dp_wd() {
    // A single pressure drop held constant: We = U dp WD(tD) (the definition of WD).
    let model = AquiferModel::VanEverdingenHurst {
        td_per_day: 0.5,
        red: 8.0,
    };
    let t = [0.0, 1e-9, 10.0, 100.0];
    let p = [PI, PI - 100.0, PI - 100.0, PI - 100.0];
    let we = Aquifer {
        model,
        constant: 40.0,
    }
    .influx(&t, &p, PI)
    .unwrap();
    // The step is averaged over its two intervals (half at t=0, half at t=1e-9).
    for k in [2, 3] {
        let e = 40.0 * 100.0 * veh_dimensionless_influx(0.5 * t[k], 8.0).unwrap();
        assert!((we[k] - e).abs() / e < 1e-4, "{} vs {e}", we[k]);
    }
}

#[test]
fn carter_tracy_tracks_van_everdingen_hurst() {
    // Carter & Tracy (1960) report agreement with the superposition solution within a few
    // per cent for smoothly declining pressure (Carter & Tracy 1960, Trans. AIME 219).
    let (t, p) = declining(60, 2300.0);
    for red in [f64::INFINITY, 10.0] {
        let veh = Aquifer {
            model: AquiferModel::VanEverdingenHurst {
                td_per_day: 1.0,
                red,
            },
            constant: 100.0,
        }
        .influx(&t, &p, PI)
        .unwrap();
        let ct = Aquifer {
            model: AquiferModel::CarterTracy {
                td_per_day: 1.0,
                red,
            },
            constant: 100.0,
        }
        .influx(&t, &p, PI)
        .unwrap();
        let last = t.len() - 1;
        assert!(
            (ct[last] - veh[last]).abs() / veh[last] < 0.03,
            "red {red}: {} vs {}",
            ct[last],
            veh[last]
        );
    }
}

// ---- Fetkovich limits --------------------------------------------------------------------------

#[test]
fn fetkovich_limits() {
    let (t, p) = declining(40, 2400.0);
    // Large aquifer with the same J: pa stays at pi, influx J (pi - pbar) dt, i.e.
    // Schilthuis steady state (Fetkovich 1971, discussion of the infinite limit).
    let j = 5.0;
    let schilthuis = Aquifer {
        model: AquiferModel::Schilthuis,
        constant: j,
    }
    .influx(&t, &p, PI)
    .unwrap();
    let big = 1e9;
    let fet = Aquifer {
        model: AquiferModel::Fetkovich { tau_days: big / j },
        constant: big,
    }
    .influx(&t, &p, PI)
    .unwrap();
    let last = t.len() - 1;
    assert!((fet[last] - schilthuis[last]).abs() / schilthuis[last] < 1e-5);
    // Tiny time constant: the aquifer equilibrates with the boundary each step, i.e. the
    // pot aquifer C (pi - p) (lagging by half a step of the averaged boundary pressure).
    let fet = Aquifer {
        model: AquiferModel::Fetkovich { tau_days: 1e-6 },
        constant: 300.0,
    }
    .influx(&t, &p, PI)
    .unwrap();
    let pot = Aquifer {
        model: AquiferModel::Pot,
        constant: 300.0,
    }
    .influx(&t, &p, PI)
    .unwrap();
    for k in 1..t.len() {
        let pbar = 0.5 * (p[k] + p[k - 1]);
        assert!((fet[k] - 300.0 * (PI - pbar)).abs() < 1e-6 * pot[k].max(1.0));
    }
    // fetkovich_aquifer: C = Wei/pi, tau = Wei/(J pi).
    let a = fetkovich_aquifer(2e7, 10.0, PI).unwrap();
    assert!((a.constant - 2e7 / PI).abs() < 1e-9);
}

// ---- Havlena-Odeh round trips ------------------------------------------------------------------

#[test]
fn havlena_odeh_volumetric_round_trip() {
    let (t, p) = declining(25, 1500.0);
    let h = synthetic(&t, &p, 5e7, 0.0, None);
    let terms = oil_mbe_terms(&pvt(), &h, &reservoir()).unwrap();
    let f = havlena_odeh_fit(&terms, HavlenaOdehCase::Volumetric, None).unwrap();
    assert!((f.n / 5e7 - 1.0).abs() < 1e-10);
    assert!(f.line.r2 > 1.0 - 1e-12);
    // The initial row (F = Et = 0) contributes nothing; every row is "used" in the origin fit.
    assert_eq!(f.line.n_used, 25);
}

#[test]
fn havlena_odeh_gas_cap_round_trips() {
    let (t, p) = declining(25, 1800.0);
    let h = synthetic(&t, &p, 3e7, 0.4, None);
    let terms = oil_mbe_terms(&pvt(), &h, &reservoir()).unwrap();
    let f = havlena_odeh_fit(&terms, HavlenaOdehCase::GasCapUnknownM, None).unwrap();
    assert!((f.n / 3e7 - 1.0).abs() < 1e-8, "{}", f.n);
    assert!((f.m - 0.4).abs() < 1e-8, "{}", f.m);
    let f = havlena_odeh_fit(&terms, HavlenaOdehCase::GasCapKnownM { m: 0.4 }, None).unwrap();
    assert!((f.n / 3e7 - 1.0).abs() < 1e-10);
}

#[test]
fn havlena_odeh_water_drive_round_trip() {
    let (t, p) = declining(30, 2000.0);
    let model = AquiferModel::VanEverdingenHurst {
        td_per_day: 0.8,
        red: 6.0,
    };
    let h = synthetic(
        &t,
        &p,
        4e7,
        0.0,
        Some(Aquifer {
            model,
            constant: 250.0,
        }),
    );
    let terms = oil_mbe_terms(&pvt(), &h, &reservoir()).unwrap();
    let f = havlena_odeh_fit(
        &terms,
        HavlenaOdehCase::WaterDrive {
            m: 0.0,
            aquifer: model,
        },
        None,
    )
    .unwrap();
    assert!((f.n / 4e7 - 1.0).abs() < 1e-8, "{}", f.n);
    assert!((f.aquifer_constant / 250.0 - 1.0).abs() < 1e-8);
}

#[test]
fn history_match_round_trip_exact_and_noisy() {
    let (t, p) = declining(40, 2000.0);
    let truth = AquiferModel::VanEverdingenHurst {
        td_per_day: 0.8,
        red: f64::INFINITY,
    };
    let h = synthetic(
        &t,
        &p,
        4e7,
        0.25,
        Some(Aquifer {
            model: truth,
            constant: 250.0,
        }),
    );
    let start = AquiferModel::VanEverdingenHurst {
        td_per_day: 0.1,
        red: f64::INFINITY,
    };
    let opts = HistoryMatchOptions {
        m: None,
        aquifer: Some(start),
        ..Default::default()
    };
    let fit = history_match(&pvt(), &h, &reservoir(), &opts).unwrap();
    assert!((fit.n / 4e7 - 1.0).abs() < 1e-5, "{fit:?}");
    assert!((fit.m - 0.25).abs() < 1e-4);
    let a = fit.report.aquifer.unwrap();
    assert!((a.constant / 250.0 - 1.0).abs() < 1e-4);
    match a.model {
        AquiferModel::VanEverdingenHurst { td_per_day, .. } => {
            assert!((td_per_day / 0.8 - 1.0).abs() < 1e-3)
        }
        _ => panic!(),
    }
    // Noise on the pressures (deterministic pseudo-random, +-5 psi): the production stays as
    // generated, the pressures the engineer measured are off. Recover N within 5% and the
    // truth inside (or near) the confidence interval.
    let mut seed: u64 = 12345;
    let mut rnd = || {
        seed = seed
            .wrapping_mul(6364136223846793005)
            .wrapping_add(1442695040888963407);
        ((seed >> 11) as f64 / (1u64 << 53) as f64) * 2.0 - 1.0
    };
    let pn: Vec<f64> = p
        .iter()
        .enumerate()
        .map(|(i, &x)| if i == 0 { x } else { (x + 5.0 * rnd()).min(PI) })
        .collect();
    let hn = OilHistory::new(
        t.clone(),
        pn,
        h.np.clone(),
        h.gp.clone(),
        h.wp.clone(),
        vec![],
        vec![],
        PI,
    )
    .unwrap();
    let fit = history_match(&pvt(), &hn, &reservoir(), &opts).unwrap();
    println!(
        "{:?} {:?} {:?} {:?}",
        fit.report.values, fit.report.ci_low, fit.report.ci_high, fit.report.status
    );
    assert!((fit.n / 4e7 - 1.0).abs() < 0.05, "N = {}", fit.n);
    assert!(fit.report.ci_low[0] < fit.n && fit.n < fit.report.ci_high[0]);
    assert!(
        fit.report.ci_low[0] < 4e7 * 1.02 && 4e7 * 0.98 < fit.report.ci_high[0],
        "{:?} {:?}",
        fit.report.ci_low,
        fit.report.ci_high
    );
}

#[test]
fn history_match_reports_why_n_m_and_aquifer_do_not_separate() {
    // N, m and a pot aquifer free together over a short, shallow decline: the expansion
    // terms Eo, Eg, Efw and the influx (pi - p) are all nearly proportional to the drop, so
    // the history cannot tell them apart. The report must say so (condition number of the
    // scaled J^T J, the correlated pairs), or the error must name the collinear pair.
    let (t, p) = declining(10, 2900.0);
    let aq = Aquifer {
        model: AquiferModel::Pot,
        constant: 500.0,
    };
    let h = synthetic(&t, &p, 3e7, 0.3, Some(aq));
    let opts = HistoryMatchOptions {
        m: None,
        aquifer: Some(AquiferModel::Pot),
        objective: Objective::Withdrawal,
        ..Default::default()
    };
    match history_match(&pvt(), &h, &reservoir(), &opts) {
        Ok(fit) => {
            println!(
                "cond {:e}, warnings {:?}",
                fit.report.condition_number, fit.report.warnings
            );
            assert!(fit.report.condition_number > CONDITION_WARNING);
            assert!(
                fit.report
                    .warnings
                    .iter()
                    .any(|w| w.contains("correlated at"))
            );
        }
        Err(Error::Singular { detail, .. }) => {
            println!("{detail}");
            assert!(detail.contains("condition number") || detail.contains("linearly dependent"));
        }
        Err(e) => panic!("{e:?}"),
    }
    // With m known the noise-free history gives N back, but over such a short decline N
    // and the pot aquifer's C stay nearly collinear, and the report says so.
    let fit = history_match(
        &pvt(),
        &h,
        &reservoir(),
        &HistoryMatchOptions {
            m: Some(0.3),
            ..opts
        },
    )
    .unwrap();
    println!(
        "m fixed: cond {:e}, warnings {:?}",
        fit.report.condition_number, fit.report.warnings
    );
    assert!((fit.n / 3e7 - 1.0).abs() < 1e-5);
    assert!(
        fit.report
            .warnings
            .iter()
            .any(|w| w.contains("`n` and `aquifer_constant` are correlated"))
    );
    // A single parameter (N alone) has condition number 1 and no warnings.
    let h = synthetic(&t, &p, 3e7, 0.0, None);
    let fit = history_match(&pvt(), &h, &reservoir(), &HistoryMatchOptions::default()).unwrap();
    assert!((fit.report.condition_number - 1.0).abs() < 1e-12 && fit.report.warnings.is_empty());
}

#[test]
fn drive_indices_sum_to_one_and_classification() {
    let (t, p) = declining(30, 2000.0);
    let model = AquiferModel::Fetkovich { tau_days: 200.0 };
    let h = synthetic(
        &t,
        &p,
        2e7,
        0.0,
        Some(Aquifer {
            model,
            constant: 3000.0,
        }),
    );
    let terms = oil_mbe_terms(&pvt(), &h, &reservoir()).unwrap();
    let we = Aquifer {
        model,
        constant: 3000.0,
    }
    .influx(&t, &p, PI)
    .unwrap();
    let d = drive_indices(&terms, 2e7, 0.0, &we).unwrap();
    for i in 1..t.len() {
        assert!((d.sum[i] - 1.0).abs() < 1e-10);
    }
    let c = classify_drive(&terms, 0.0, 0.05).unwrap();
    assert!(c.mechanism.contains("water"), "{c:?}");
    assert!(c.campbell_trend.abs() > 0.05, "not flat");
    // Volumetric history: flat Campbell plot.
    let h = synthetic(&t, &p, 2e7, 0.0, None);
    let terms = oil_mbe_terms(&pvt(), &h, &reservoir()).unwrap();
    let c = classify_drive(&terms, 0.0, 0.05).unwrap();
    assert!(c.campbell_trend.abs() < 1e-9);
    assert!((c.n_estimate / 2e7 - 1.0).abs() < 1e-9);
    assert_eq!(c.mechanism, "solution-gas drive");
}

// ---- Gas ---------------------------------------------------------------------------------------

fn z_of(p: f64) -> f64 {
    1.0 - 8e-5 * p + 1.5e-8 * p * p
}

#[test]
fn volumetric_gas_gives_an_exactly_straight_pz_line() {
    // Volumetric depletion (G Bgi = (G - Gp) Bg) makes p/z linear in Gp exactly, whatever
    // z(p) is (Craft & Hawkins 1959, ch. 1; common practice).
    let g = 8e10;
    let sc = StandardConditions::FIELD;
    let tf = 200.0;
    let pi = 5000.0;
    let bgi = gas_bg(pi, z_of(pi), tf, sc).unwrap();
    let ps: Vec<f64> = (0..12).map(|k| pi - 300.0 * k as f64).collect();
    let zs: Vec<f64> = ps.iter().map(|&p| z_of(p)).collect();
    let gp: Vec<f64> = ps
        .iter()
        .map(|&p| g * (1.0 - bgi / gas_bg(p, z_of(p), tf, sc).unwrap()))
        .collect();
    let f = pz_fit(&gp, &ps, &zs, None, Some(500.0 / z_of(500.0))).unwrap();
    assert!(f.line.r2 > 1.0 - 1e-13);
    assert!((f.g / g - 1.0).abs() < 1e-10);
    let max_res = f.line.residuals.iter().fold(0.0f64, |m, r| m.max(r.abs()));
    assert!(max_res < 1e-8);
    // Recovery at abandonment from the line: RF = 1 - (pa/za)/(pi/zi).
    let rf = 1.0 - (500.0 / z_of(500.0)) / (pi / z_of(pi));
    assert!((f.rf_abandon - rf).abs() < 1e-10);
    assert!((f.gp_abandon - rf * g).abs() / g < 1e-10);
    // The Cole plot of a volumetric reservoir is flat at G.
    let c = cole_plot(&gp, &ps, &zs, &[], 1.0, pi, z_of(pi), tf, sc).unwrap();
    for v in &c[1..] {
        assert!((v / g - 1.0).abs() < 1e-10);
    }
}

#[test]
fn gas_water_drive_and_abnormal_pressure() {
    let g = 5e10;
    let sc = StandardConditions::FIELD;
    let (tf, pi) = (180.0, 4200.0);
    let t: Vec<f64> = (0..15).map(|k| 60.0 * k as f64).collect();
    let p: Vec<f64> = (0..15).map(|k| pi - 120.0 * k as f64).collect();
    let z: Vec<f64> = p.iter().map(|&x| z_of(x)).collect();
    let model = AquiferModel::Fetkovich { tau_days: 300.0 };
    let we = Aquifer {
        model,
        constant: 2500.0,
    }
    .influx(&t, &p, pi)
    .unwrap();
    let bgi = gas_bg(pi, z_of(pi), tf, sc).unwrap();
    let gp: Vec<f64> = (0..15)
        .map(|i| {
            let bg = gas_bg(p[i], z[i], tf, sc).unwrap();
            (g * (bg - bgi) + we[i]) / bg
        })
        .collect();
    let f =
        gas_water_drive_fit(&t, &gp, &p, &z, &[], 1.0, pi, z_of(pi), tf, sc, model, None).unwrap();
    assert!((f.g / g - 1.0).abs() < 1e-9 && (f.aquifer_constant / 2500.0 - 1.0).abs() < 1e-9);
    // The Cole plot rises with aquifer support.
    let c = cole_plot(&gp, &p, &z, &[], 1.0, pi, z_of(pi), tf, sc).unwrap();
    assert!(c[14] > c[2] * 1.05);
    // Abnormal pressure: with pore and water compressibility the plain p/z line
    // overestimates G; the Ramagost-Farshad correction recovers it (Ramagost & Farshad 1981).
    let (swi, cw, cf) = (0.25, 3e-6, 1.5e-5);
    let ce = (cw * swi + cf) / (1.0 - swi);
    let gp: Vec<f64> = (0..15)
        .map(|i| {
            let bg = gas_bg(p[i], z[i], tf, sc).unwrap();
            // G Bgi = (G - Gp) Bg + G Bgi ce dp   ->  Gp = G (1 - Bgi (1 - ce dp) / Bg)
            g * (1.0 - bgi * (1.0 - ce * (pi - p[i])) / bg)
        })
        .collect();
    let plain = pz_fit(&gp, &p, &z, None, None).unwrap();
    let rf = pz_fit_abnormal(
        &gp,
        &p,
        &z,
        pi,
        swi,
        cw,
        cf,
        None,
        Some((800.0, z_of(800.0))),
    )
    .unwrap();
    assert!(plain.g > 1.05 * g);
    assert!((rf.g / g - 1.0).abs() < 1e-9, "{}", rf.g);
    let c = cole_plot(&gp, &p, &z, &[], 1.0, pi, z_of(pi), tf, sc).unwrap();
    assert!(c[1] > c[14], "abnormal pressure: the Cole plot falls");
}

// ---- Forecast ----------------------------------------------------------------------------------

#[test]
fn muskat_forecast_closes_the_material_balance() {
    let table = pvt();
    let k = CoreyGasOil::new(0.2, 0.05, 0.15, 0.7, 0.9, 2.0, 3.0).unwrap();
    let f = muskat_forecast(&table, &k, PB, 600.0, 200).unwrap();
    // Solution-gas-drive balance (Craft & Hawkins 1959, eq. 4.x in Tarner's form):
    // N = Np [Bt + (Rp - Rsi) Bg] / (Bt - Bti), i.e. (Np/N)[Bt + (Rp - Rsi) Bg] = Bt - Bti.
    let qb = table.at(PB).unwrap();
    for i in (20..f.p.len()).step_by(20) {
        let q = table.at(f.p[i]).unwrap();
        let bt = q.bo + (qb.rs - q.rs) * q.bg;
        let rp = f.gp_over_n[i] / f.np_over_n[i];
        let lhs = f.np_over_n[i] * (bt + (rp - qb.rs) * q.bg);
        let rhs = bt - qb.bo;
        assert!(
            (lhs - rhs).abs() / rhs < 2e-3,
            "p {}: {lhs} vs {rhs}",
            f.p[i]
        );
    }
    // GOR starts at Rsi and rises once gas exceeds its critical saturation.
    assert!((f.gor[0] - qb.rs).abs() < 1e-9);
    assert!(f.gor.iter().cloned().fold(0.0, f64::max) > 2.0 * qb.rs);
    // RF = Np/N (common practice, no source): with N = 1,000,000 STB and a recovery of 37%
    // the arithmetic gives 370,000 STB.
    let n_stb = 1_000_000.0;
    assert!((0.37 * n_stb - 370_000.0f64).abs() < 1e-9);
    let last = f.np_over_n.len() - 1;
    let np = f.np_over_n[last] * n_stb;
    assert!((np / n_stb - f.np_over_n[last]).abs() < 1e-15);
    assert!(f.np_over_n[last] > 0.05 && f.np_over_n[last] < 0.5);
}

#[test]
fn tarner_agrees_with_muskat_and_closes_the_balance() {
    // Two independent published methods on the same reservoir: Muskat (1945), a
    // differential equation in So integrated by RK4, and Tarner (1944), a trial-and-error
    // on the oil increment of each pressure step. They must give the same depletion path.
    let table = pvt();
    let k = CoreyGasOil::new(0.2, 0.05, 0.15, 0.7, 0.9, 2.0, 3.0).unwrap();
    let mu = muskat_forecast(&table, &k, PB, 600.0, 190).unwrap();
    let ta = tarner_forecast(&table, &k, PB, 600.0, 190).unwrap();
    assert_eq!(mu.p.len(), ta.forecast.p.len());
    let mut worst: [f64; 3] = [0.0; 3];
    for i in 1..ta.forecast.p.len() {
        assert_eq!(mu.p[i], ta.forecast.p[i]);
        worst[0] =
            worst[0].max((ta.forecast.np_over_n[i] - mu.np_over_n[i]).abs() / mu.np_over_n[i]);
        worst[1] = worst[1].max((ta.forecast.gor[i] - mu.gor[i]).abs() / mu.gor[i]);
        worst[2] = worst[2].max((ta.forecast.so[i] - mu.so[i]).abs());
    }
    // Stated tolerance with 10-psi steps: 1e-4 relative on Np/N, 3e-4 on GOR, 1e-5 on So
    // (Tarner's trapezoidal GOR integral is second order in the step: the gap shrinks
    // 100-fold for 10-fold finer steps).
    println!("Tarner vs Muskat, worst relative Np/N, GOR, abs So: {worst:?}");
    assert!(
        worst[0] < 1e-4 && worst[1] < 3e-4 && worst[2] < 1e-5,
        "{worst:?}"
    );
    // Tarner's Gp from the GOR integral equals Gp from the material balance at every row:
    // (Np/N)[Bt + (Rp - Rsi) Bg] = Bt - Bti (Craft & Hawkins 1959, ch. 4).
    let qb = table.at(PB).unwrap();
    for i in 1..ta.forecast.p.len() {
        let q = table.at(ta.forecast.p[i]).unwrap();
        let bt = q.bo + (qb.rs - q.rs) * q.bg;
        let lhs = ta.forecast.np_over_n[i] * bt
            + (ta.forecast.gp_over_n[i] - ta.forecast.np_over_n[i] * qb.rs) * q.bg;
        assert!((lhs - (bt - qb.bo)).abs() < 1e-9 * (bt - qb.bo), "row {i}");
        // The saturation equation (Craft & Hawkins 1959, ch. 4).
        let so = (1.0 - k.swc) * (1.0 - ta.forecast.np_over_n[i]) * q.bo / qb.bo;
        assert!((ta.forecast.so[i] - so).abs() < 1e-12);
        assert!((ta.forecast.sg[i] + ta.forecast.so[i] + k.swc - 1.0).abs() < 1e-12);
    }
    assert!(ta.max_mismatch < 1e-6, "{}", ta.max_mismatch);
    // GOR = Rs while Sg < Sgc (common practice, no source): gas is immobile below its
    // critical saturation, so the producing GOR is the solution GOR.
    let mut below = 0;
    for i in 0..ta.forecast.p.len() {
        if ta.forecast.sg[i] < k.sgc {
            below += 1;
            let q = table.at(ta.forecast.p[i]).unwrap();
            assert_eq!(ta.forecast.krg_over_kro[i], 0.0);
            assert!((ta.forecast.gor[i] - q.rs).abs() < 1e-9 * q.rs, "row {i}");
        }
    }
    assert!(below > 3, "the test needs rows below Sgc");
    assert!(ta.forecast.gor.iter().cloned().fold(0.0, f64::max) > 2.0 * qb.rs);
    // RF = Np/N (common practice, no source): Np = RF N.
    let last = ta.forecast.np_over_n.len() - 1;
    let n_stb = 1_000_000.0;
    assert!(
        (ta.forecast.np_over_n[last] * n_stb / n_stb - ta.forecast.np_over_n[last]).abs() < 1e-15
    );
    assert!(ta.iterations[1..].iter().all(|n| (1..200).contains(n)));
    // A coarse Tarner run (10 steps of 190 psi) stays close to the fine one at the end.
    let coarse = tarner_forecast(&table, &k, PB, 600.0, 10).unwrap();
    let rel = (coarse.forecast.np_over_n[10] - ta.forecast.np_over_n[last]).abs()
        / ta.forecast.np_over_n[last];
    assert!(rel < 0.05, "coarse {rel}");
}

#[test]
fn tarner_rejects_bad_input_and_stops_when_oil_is_immobile() {
    let table = pvt();
    let k = CoreyGasOil::new(0.2, 0.05, 0.15, 0.7, 0.9, 2.0, 3.0).unwrap();
    match tarner_forecast(&table, &k, PB, 2600.0, 10).unwrap_err() {
        Error::InvalidArgument { arg, .. } => assert_eq!(arg, "p_end"),
        e => panic!("{e:?}"),
    }
    match tarner_forecast(&table, &k, PB, 600.0, 0).unwrap_err() {
        Error::InvalidArgument { arg, .. } => assert_eq!(arg, "n_steps"),
        e => panic!("{e:?}"),
    }
    assert!(matches!(
        tarner_forecast(&table, &k, PB, 100.0, 10).unwrap_err(),
        Error::OutOfRange(_)
    ));
    // A large residual oil saturation: the oil becomes immobile before p_end.
    let tight = CoreyGasOil::new(0.2, 0.0, 0.75, 1.0, 1.0, 1.0, 1.0).unwrap();
    let f = tarner_forecast(&table, &tight, PB, 400.0, 100).unwrap();
    assert!(f.forecast.stopped_early || f.forecast.so.iter().all(|&s| s >= 0.75 - 1e-9));
}

// ---- Bad input ---------------------------------------------------------------------------------

#[test]
fn bad_histories_name_the_row() {
    let bad = |e: Error, arg: &str, row: usize| match e {
        Error::InvalidRecord { arg: a, row: r, .. } => assert!(a == arg && r == row, "{a} {r}"),
        other => panic!("{other:?}"),
    };
    let z = vec![0.0; 3];
    bad(
        OilHistory::new(
            vec![0.0, 20.0, 10.0],
            vec![3000.0; 3],
            z.clone(),
            z.clone(),
            z.clone(),
            vec![],
            vec![],
            PI,
        )
        .unwrap_err(),
        "t_days",
        2,
    );
    bad(
        OilHistory::new(
            vec![0.0, 10.0, 20.0],
            vec![3000.0, 2900.0, 3100.0],
            z.clone(),
            z.clone(),
            z.clone(),
            vec![],
            vec![],
            PI,
        )
        .unwrap_err(),
        "p",
        2,
    );
    bad(
        OilHistory::new(
            vec![0.0, 10.0, 20.0],
            vec![3000.0; 3],
            vec![0.0, -1.0, 2.0],
            z.clone(),
            z.clone(),
            vec![],
            vec![],
            PI,
        )
        .unwrap_err(),
        "np",
        1,
    );
    bad(
        OilHistory::new(
            vec![0.0, 10.0, 20.0],
            vec![3000.0; 3],
            vec![0.0, 5.0, 2.0],
            z.clone(),
            z.clone(),
            vec![],
            vec![],
            PI,
        )
        .unwrap_err(),
        "np",
        2,
    );
    // A PVT table that does not cover the history's pressures.
    let h = OilHistory::new(
        vec![0.0, 10.0, 20.0],
        vec![3000.0, 2000.0, 300.0],
        vec![0.0, 1.0, 2.0],
        vec![0.0, 1.0, 2.0],
        z.clone(),
        vec![],
        vec![],
        PI,
    )
    .unwrap();
    bad(oil_mbe_terms(&pvt(), &h, &reservoir()).unwrap_err(), "p", 2);
    // A singular fit: all points at one pressure.
    let h = OilHistory::new(
        vec![0.0, 10.0, 20.0],
        vec![PI; 3],
        vec![0.0, 1.0, 2.0],
        vec![0.0, 1.0, 2.0],
        z,
        vec![],
        vec![],
        PI,
    )
    .unwrap();
    let t = oil_mbe_terms(&pvt(), &h, &reservoir()).unwrap();
    assert!(matches!(
        havlena_odeh_fit(&t, HavlenaOdehCase::Volumetric, None),
        Err(Error::Singular { .. })
    ));
    assert!(matches!(
        havlena_odeh_fit(&t, HavlenaOdehCase::GasCapUnknownM, None),
        Err(Error::Singular { .. })
    ));
    let gp = [0.0, 1e9, 2e9];
    assert!(matches!(
        pz_fit(&gp, &[4000.0; 3], &[0.9; 3], None, None),
        Err(Error::Singular { .. })
    ));
    let e = pz_fit(
        &[0.0, 2e9, 1e9],
        &[4000.0, 3900.0, 3800.0],
        &[0.9; 3],
        None,
        None,
    )
    .unwrap_err();
    bad(e, "gp", 2);
}

#[test]
fn public_types_are_send_sync() {
    fn ok<T: Send + Sync>() {}
    ok::<PvtTable>();
    ok::<OilHistory>();
    ok::<MbeTerms>();
    ok::<HavlenaOdehFit>();
    ok::<HistoryMatch>();
    ok::<MatchReport>();
    ok::<Aquifer>();
    ok::<GasFit>();
    ok::<MuskatForecast>();
    ok::<DriveClassification>();
}
