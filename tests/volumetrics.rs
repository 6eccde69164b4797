//! Integration tests of the volumetrics domain (public API only). Every reference value names
//! its source.

use stocktank::Error;
use stocktank::relperm::CoreyOilWater;
use stocktank::volumetrics::*;

fn rel(a: f64, b: f64) -> f64 {
    ((a - b) / b).abs()
}

#[test]
fn acre_ft_constants_from_unit_definitions() {
    // 1 acre = 43,560 ft2 and 1 bbl = 5.614583 ft3 (NIST SP 811, 2008): 1 acre-ft of pore
    // space is 7758 bbl (common practice, no source) and 43,560 ft3.
    let n = ooip_from_rock_volume(1.0, 1.0, 1.0, 0.0, 1.0).unwrap();
    assert!((n - 43_560.0 / (42.0 * 231.0 / 1728.0)).abs() < 1e-9);
    assert_eq!(n.round(), 7758.0);
    assert_eq!(
        ogip_from_rock_volume(1.0, 1.0, 1.0, 0.0, 1.0).unwrap(),
        43_560.0
    );
}

#[test]
fn recovery_fact_of_the_trade() {
    // 37% of 1,000,000 STB in place is 370,000 STB (common practice, no source).
    assert!((recoverable(1.0e6, 0.37).unwrap() - 370_000.0).abs() < 1e-6);
    assert!((recovery_factor(370_000.0, 1.0e6).unwrap() - 0.37).abs() < 1e-15);
}

#[test]
fn oil_flows_only_above_its_critical_saturation() {
    // kro = 0 wherever So <= Sorw (common practice, no source), so fw = 1 there.
    let k = CoreyOilWater::new(0.2, 0.25, 0.4, 0.9, 2.0, 3.0).unwrap();
    let f = FractionalFlow::new(k, 3.0, 0.5, 0.0, 0.2).unwrap();
    for sw in [0.75, 0.8, 0.95] {
        assert_eq!(k.krow(sw), 0.0);
        assert_eq!(f.fw(sw), 1.0);
    }
}

#[test]
fn bad_inputs_name_the_argument() {
    let e = ooip(640.0, 50.0, 1.0, 1.2, 0.25, 1.2).unwrap_err();
    assert!(
        matches!(
            e,
            Error::InvalidArgument {
                arg: "porosity",
                ..
            }
        ),
        "{e}"
    );
    let e = ooip(640.0, 50.0, 1.0, 0.2, -0.1, 1.2).unwrap_err();
    assert!(matches!(e, Error::InvalidArgument { arg: "sw", .. }), "{e}");
    let e = ooip(-640.0, 50.0, 1.0, 0.2, 0.2, 1.2).unwrap_err();
    assert!(
        matches!(e, Error::InvalidArgument { arg: "area", .. }),
        "{e}"
    );
    let e = ogip(640.0, -5.0, 1.0, 0.2, 0.2, 0.004).unwrap_err();
    assert!(
        matches!(
            e,
            Error::InvalidArgument {
                arg: "thickness",
                ..
            }
        ),
        "{e}"
    );
    let e = Distribution::lognormal_p90_p10(50.0, 20.0).unwrap_err();
    assert!(
        matches!(e, Error::InvalidArgument { arg: "p10", .. }),
        "{e}"
    );
    assert!(e.to_string().contains("P90 is the low value"));
    let e = Distribution::triangular(1.0, 5.0, 3.0).unwrap_err();
    assert!(
        matches!(e, Error::InvalidArgument { arg: "mode", .. }),
        "{e}"
    );
    let e = Distribution::normal(0.2, -0.1, 0.0, 1.0).unwrap_err();
    assert!(matches!(e, Error::InvalidArgument { arg: "sd", .. }), "{e}");
    let e = Correlation::new(3, vec![1.0, 0.9, -0.9, 0.9, 1.0, 0.9, -0.9, 0.9, 1.0]).unwrap_err();
    assert!(e.to_string().contains("positive definite"), "{e}");
    let e = Correlation::new(2, vec![1.0, 1.5, 1.5, 1.0]).unwrap_err();
    assert!(
        e.to_string().contains("correlation") && e.to_string().contains("(0, 1)"),
        "{e}"
    );
    // A porosity distribution that can leave [0, 1] is refused.
    let mut inp = inputs();
    inp.porosity = Distribution::normal(0.2, 0.05, f64::NEG_INFINITY, f64::INFINITY).unwrap();
    let e = probabilistic_in_place(Fluid::Oil, &inp, None, 100, 1).unwrap_err();
    assert!(
        matches!(
            e,
            Error::InvalidArgument {
                arg: "porosity",
                ..
            }
        ),
        "{e}"
    );
    let e = in_place_layers(
        Fluid::Oil,
        &[
            Layer {
                area: 1.0,
                thickness: 1.0,
                net_to_gross: 1.0,
                porosity: 0.2,
                sw: 0.2,
                fvf: 1.1,
            },
            Layer {
                area: 1.0,
                thickness: 1.0,
                net_to_gross: 1.4,
                porosity: 0.2,
                sw: 0.2,
                fvf: 1.1,
            },
        ],
    )
    .unwrap_err();
    assert!(
        e.to_string().contains("net_to_gross") && e.to_string().contains("index 1"),
        "{e}"
    );
}

fn inputs() -> VolumetricInputs {
    VolumetricInputs {
        area: Distribution::triangular(800.0, 1000.0, 1500.0).unwrap(),
        thickness: Distribution::pert(20.0, 35.0, 60.0).unwrap(),
        net_to_gross: Distribution::uniform(0.6, 0.9).unwrap(),
        porosity: Distribution::normal(0.2, 0.03, 0.05, 0.35).unwrap(),
        sw: Distribution::normal(0.3, 0.05, 0.1, 0.6).unwrap(),
        fvf: Distribution::lognormal_mean_sd(1.3, 0.05).unwrap(),
        recovery_factor: None,
    }
}

#[test]
fn sample_moments_match_analytic_moments() {
    // Analytic moments: Johnson, Kotz, Balakrishnan (1994); Malcolm et al. (1959) for PERT.
    let n = 400_000;
    let ds = [
        Distribution::uniform(2.0, 5.0).unwrap(),
        Distribution::triangular(1.0, 2.0, 6.0).unwrap(),
        Distribution::pert(1.0, 2.0, 6.0).unwrap(),
        Distribution::normal(10.0, 2.0, f64::NEG_INFINITY, f64::INFINITY).unwrap(),
        Distribution::normal(0.2, 0.05, 0.15, 0.3).unwrap(),
        Distribution::normal(0.2, 0.05, 0.28, f64::INFINITY).unwrap(),
        Distribution::lognormal(1.0, 0.4, 0.0, f64::INFINITY).unwrap(),
        Distribution::lognormal(1.0, 0.4, 2.0, 4.0).unwrap(),
    ];
    for (s, d) in ds.iter().enumerate() {
        let x = d.sample(n, 11, s as u64);
        let m = x.iter().sum::<f64>() / n as f64;
        let v = x.iter().map(|a| (a - m).powi(2)).sum::<f64>() / (n - 1) as f64;
        let se = (d.variance() / n as f64).sqrt();
        assert!(
            (m - d.mean()).abs() < 5.0 * se,
            "{d:?}: mean {m} vs {}",
            d.mean()
        );
        assert!(
            rel(v, d.variance()) < 0.02,
            "{d:?}: var {v} vs {}",
            d.variance()
        );
        let (lo, hi) = d.support();
        assert!(
            x.iter().all(|&a| a >= lo && a <= hi),
            "{d:?} left its support"
        );
    }
}

#[test]
fn lognormal_product_percentiles_match_closed_form() {
    // ln N = ln c + ln A + ln h - ln B is normal with mu = sum of mus and sigma^2 = sum of
    // sigma^2, so P90 = exp(mu - 1.28155 sigma) (closed form of the lognormal quantile).
    let (ma, sa) = (7.0, 0.3);
    let (mh, sh) = (3.5, 0.25);
    let (mb, sb) = (0.25, 0.05);
    let inp = VolumetricInputs {
        area: Distribution::lognormal(ma, sa, 0.0, f64::INFINITY).unwrap(),
        thickness: Distribution::lognormal(mh, sh, 0.0, f64::INFINITY).unwrap(),
        net_to_gross: Distribution::fixed(1.0).unwrap(),
        porosity: Distribution::fixed(0.2).unwrap(),
        sw: Distribution::fixed(0.25).unwrap(),
        fvf: Distribution::lognormal(mb, sb, 0.0, f64::INFINITY).unwrap(),
        recovery_factor: None,
    };
    let sim = probabilistic_in_place(Fluid::Oil, &inp, None, 400_000, 3).unwrap();
    let c = ooip_from_rock_volume(1.0, 1.0, 0.2, 0.25, 1.0).unwrap();
    let mu = c.ln() + ma + mh - mb;
    let sigma = (sa * sa + sh * sh + sb * sb).sqrt();
    let z = norm_ppf(0.9).unwrap();
    // scipy.stats.norm.ppf(0.9) = 1.2815515655446004
    assert!((z - 1.281_551_565_544_600_4).abs() < 1e-14);
    let s = sim.summary;
    assert!(rel(s.p90, (mu - z * sigma).exp()) < 0.006, "P90 {}", s.p90);
    assert!(rel(s.p50, mu.exp()) < 0.005, "P50 {}", s.p50);
    assert!(rel(s.p10, (mu + z * sigma).exp()) < 0.006, "P10 {}", s.p10);
    assert!(
        rel(s.mean, (mu + 0.5 * sigma * sigma).exp()) < 0.005,
        "mean {}",
        s.mean
    );
    // P90 is the LOW value (common practice, no source).
    assert!(s.p90 < s.p50 && s.p50 < s.p10);
}

#[test]
fn reproducible_by_seed() {
    let c = Correlation::from_pairs(&[(Input::Porosity, Input::Sw, -0.6)]).unwrap();
    let a = probabilistic_in_place(Fluid::Oil, &inputs(), Some(&c), 50_000, 42).unwrap();
    let b = probabilistic_in_place(Fluid::Oil, &inputs(), Some(&c), 50_000, 42).unwrap();
    let d = probabilistic_in_place(Fluid::Oil, &inputs(), Some(&c), 50_000, 43).unwrap();
    assert_eq!(a, b);
    assert_ne!(a.in_place, d.in_place);
}

#[test]
fn iman_conover_hits_target_and_keeps_marginals() {
    let c = Correlation::from_pairs(&[
        (Input::Porosity, Input::Sw, -0.6),
        (Input::Area, Input::Thickness, 0.4),
        (Input::NetToGross, Input::Porosity, 0.5),
    ])
    .unwrap();
    let ind = probabilistic_in_place(Fluid::Oil, &inputs(), None, 200_000, 5).unwrap();
    let cor = probabilistic_in_place(Fluid::Oil, &inputs(), Some(&c), 200_000, 5).unwrap();
    let r = |i: Input, j: Input| spearman(&cor.inputs[i as usize], &cor.inputs[j as usize]);
    assert!((r(Input::Porosity, Input::Sw) + 0.6).abs() < 0.02);
    assert!((r(Input::Area, Input::Thickness) - 0.4).abs() < 0.02);
    assert!((r(Input::NetToGross, Input::Porosity) - 0.5).abs() < 0.02);
    assert!(r(Input::Area, Input::Sw).abs() < 0.02);
    // Iman–Conover only re-pairs: each column keeps the same multiset of values.
    let mut cols: Vec<Vec<f64>> = ind.inputs[..3].to_vec();
    let c3 = Correlation::new(3, vec![1.0, 0.5, -0.3, 0.5, 1.0, 0.2, -0.3, 0.2, 1.0]).unwrap();
    iman_conover(&mut cols, &c3, 17).unwrap();
    for (orig, col) in ind.inputs.iter().zip(&cols) {
        let mut a = orig.clone();
        let mut b = col.clone();
        a.sort_by(f64::total_cmp);
        b.sort_by(f64::total_cmp);
        assert_eq!(a, b);
    }
    assert!((spearman(&cols[0], &cols[2]) + 0.3).abs() < 0.02);
    // Correlated inputs keep their distribution (drawn as sorted quantiles).
    for (j, d) in [(3usize, inputs().porosity), (1, inputs().thickness)] {
        let x = &cor.inputs[j];
        let m = x.iter().sum::<f64>() / x.len() as f64;
        let se = (d.variance() / x.len() as f64).sqrt();
        assert!((m - d.mean()).abs() < 5.0 * se, "{j}: {m} vs {}", d.mean());
    }
}

/// Spearman's (1904) coefficient written out: Pearson correlation of the ranks (1..n, by
/// a plain sort; the samples here have no ties).
fn spearman_by_definition(a: &[f64], b: &[f64]) -> f64 {
    let rank = |x: &[f64]| {
        let mut idx: Vec<usize> = (0..x.len()).collect();
        idx.sort_by(|&i, &j| x[i].total_cmp(&x[j]));
        let mut r = vec![0.0; x.len()];
        for (k, &i) in idx.iter().enumerate() {
            r[i] = (k + 1) as f64;
        }
        r
    };
    let (ra, rb) = (rank(a), rank(b));
    let n = a.len() as f64;
    let m = (n + 1.0) / 2.0;
    let sab: f64 = ra.iter().zip(&rb).map(|(x, y)| (x - m) * (y - m)).sum();
    let saa: f64 = ra.iter().map(|x| (x - m) * (x - m)).sum();
    let sbb: f64 = rb.iter().map(|y| (y - m) * (y - m)).sum();
    sab / (saa * sbb).sqrt()
}

#[test]
fn tornado_rank_correlations_are_spearman_on_the_first_200k_trials() {
    // Correlated inputs take their ranks from the re-pairing, the others are ranked again:
    // both must give Spearman's coefficient of the first 200,000 trials.
    let c = Correlation::from_pairs(&[
        (Input::Porosity, Input::Sw, -0.6),
        (Input::Area, Input::Thickness, 0.4),
        (Input::Sw, Input::Fvf, 0.2),
    ])
    .unwrap();
    let sim = probabilistic_in_place(Fluid::Oil, &inputs(), Some(&c), 260_000, 21).unwrap();
    let m = 200_000;
    for row in &sim.tornado {
        let x = &sim.inputs[row.input as usize][..m];
        let want = spearman_by_definition(x, &sim.in_place[..m]);
        assert!(
            (row.rank_correlation - want).abs() < 1e-12,
            "{:?}: {} vs {want}",
            row.input,
            row.rank_correlation
        );
    }
}

#[test]
fn tornado_ranks_the_widest_input_first() {
    let mut inp = inputs();
    inp.area = Distribution::uniform(100.0, 3000.0).unwrap();
    let sim = probabilistic_in_place(Fluid::Oil, &inp, None, 50_000, 9).unwrap();
    assert_eq!(sim.tornado[0].input, Input::Area);
    assert!(sim.tornado.windows(2).all(|w| w[0].swing >= w[1].swing));
    // Higher water saturation lowers the volume.
    let sw = sim.tornado.iter().find(|t| t.input == Input::Sw).unwrap();
    assert!(sw.volume_at_high < sw.volume_at_low && sw.rank_correlation < 0.0);
}

#[test]
fn recoverable_distribution() {
    let mut inp = inputs();
    inp.recovery_factor = Some(Distribution::fixed(0.37).unwrap());
    let sim = probabilistic_in_place(Fluid::Oil, &inp, None, 10_000, 1).unwrap();
    let r = sim.recoverable_summary.unwrap();
    assert!(rel(r.p50, 0.37 * sim.summary.p50) < 1e-12);
}

#[test]
fn buckley_leverett_piston_front_for_straight_lines() {
    // Straight-line relative permeabilities and equal viscosities: fw is linear in Sw and
    // the front is piston-like (common practice, no source): Swf = 1 - Sor, breakthrough
    // at the movable pore volume, all movable oil recovered then.
    let k = CoreyOilWater::new(0.2, 0.3, 1.0, 1.0, 1.0, 1.0).unwrap();
    let f = FractionalFlow::new(k, 1.0, 1.0, 0.0, 0.2).unwrap();
    let w = f.welge().unwrap();
    assert!((w.sw_front - 0.7).abs() < 1e-12);
    assert!((w.pv_breakthrough - 0.5).abs() < 1e-12);
    assert!((w.ed_breakthrough - 0.5 / 0.8).abs() < 1e-12);
}

#[test]
fn welge_tangent_closed_form_for_quadratic_curves() {
    // Swc = Sor = 0, krw = Sw^2, kro = (1 - Sw)^2, equal viscosities: the tangency
    // condition 2(1 - S) = S^2 + (1 - S)^2 gives Swf = 1/sqrt(2), breakthrough at
    // 2(sqrt(2) - 1) pore volumes (derived by hand from the Welge 1952 construction).
    let k = CoreyOilWater::new(0.0, 0.0, 1.0, 1.0, 2.0, 2.0).unwrap();
    let f = FractionalFlow::new(k, 1.0, 1.0, 0.0, 0.0).unwrap();
    let w = f.welge().unwrap();
    let r2 = std::f64::consts::SQRT_2;
    assert!((w.sw_front - 1.0 / r2).abs() < 1e-10, "{}", w.sw_front);
    assert!((w.pv_breakthrough - 2.0 * (r2 - 1.0)).abs() < 1e-9);
    assert!((w.sw_avg_breakthrough - 2.0 * (r2 - 1.0)).abs() < 1e-9);
}

#[test]
fn welge_tangent_satisfies_its_defining_equation() {
    for (mu_o, g) in [(0.5, 0.0), (2.0, 0.0), (20.0, 0.0), (5.0, 0.5)] {
        let k = CoreyOilWater::new(0.2, 0.25, 0.35, 0.9, 3.0, 2.0).unwrap();
        let f = FractionalFlow::new(k, mu_o, 0.5, g, 0.2).unwrap();
        let w = f.welge().unwrap();
        let secant = (f.fw(w.sw_front) - f.fw(0.2)) / (w.sw_front - 0.2);
        assert!(
            rel(f.dfw(w.sw_front), secant) < 1e-8,
            "mu_o {mu_o}: {} vs {secant}",
            f.dfw(w.sw_front)
        );
        // Recovery grows with injection and never exceeds the movable oil.
        let mut last = 0.0;
        let mut pvs = [0.1, 0.3, w.pv_breakthrough, 1.0, 2.0, 5.0, 50.0];
        pvs.sort_by(f64::total_cmp);
        for pv in pvs {
            let s = f.state(&w, pv).unwrap();
            assert!(s.ed >= last - 1e-12 && s.ed <= (0.8 - 0.25) / 0.8 + 1e-12);
            last = s.ed;
        }
    }
}

#[test]
fn gravity_helps_updip_water() {
    let k = CoreyOilWater::new(0.2, 0.25, 0.35, 0.9, 3.0, 2.0).unwrap();
    let flat = FractionalFlow::new(k, 5.0, 0.5, 0.0, 0.2)
        .unwrap()
        .welge()
        .unwrap();
    let g = gravity_number(500.0, 50_000.0, 0.25, 10.0, 1000.0).unwrap();
    assert!(g > 0.0);
    let up = FractionalFlow::new(k, 5.0, 0.5, g, 0.2)
        .unwrap()
        .welge()
        .unwrap();
    assert!(up.ed_breakthrough > flat.ed_breakthrough);
}

#[test]
fn gas_recovery_pz() {
    // RF = 1 - (pa/za)/(pi/zi) (Craft and Hawkins 1959); ideal gas, pa = pi/4: 75%.
    assert!((gas_recovery_factor_pz(4000.0, 1.0, 1000.0, 1.0).unwrap() - 0.75).abs() < 1e-15);
    assert!(gas_recovery_factor_pz(1000.0, 1.0, 4000.0, 1.0).is_err());
}

#[test]
fn public_types_are_send_sync() {
    fn ok<T: Send + Sync>() {}
    ok::<Distribution>();
    ok::<Correlation>();
    ok::<InPlaceSimulation>();
    ok::<FractionalFlow>();
    ok::<WelgeFront>();
    ok::<VolumetricInputs>();
    ok::<stocktank::units::convert::UnitMap>();
}

#[test]
fn arps_correlations_against_the_equations_written_out() {
    // Arps et al. (1967), API Bulletin D14, as commonly reproduced in handbooks (from memory):
    // percent recovery; k in darcy.
    let (phi, sw, bob, k, mu, pb, pa): (f64, f64, f64, f64, f64, f64, f64) =
        (0.22, 0.27, 1.35, 150.0, 0.9, 2800.0, 400.0);
    let sgd = 41.815
        * (phi * (1.0 - sw) / bob).powf(0.1611)
        * (k / 1000.0 / mu).powf(0.0979)
        * sw.powf(0.3722)
        * (pb / pa).powf(0.1741)
        / 100.0;
    assert!(
        rel(
            arps_solution_gas_drive(phi, sw, bob, k, mu, pb, pa).unwrap(),
            sgd
        ) < 1e-14
    );
    let (mu_w, mu_o, pi): (f64, f64, f64) = (0.4, 3.0, 3500.0);
    let wd = 54.898
        * (phi * (1.0 - sw) / bob).powf(0.0422)
        * (k / 1000.0 * mu_w / mu_o).powf(0.0770)
        * sw.powf(-0.1903)
        * (pi / 1500.0).powf(-0.2159)
        / 100.0;
    assert!(
        rel(
            arps_water_drive(phi, sw, bob, k, mu_w, mu_o, pi, 1500.0).unwrap(),
            wd
        ) < 1e-14
    );
    // The validity functions check the recalled data ranges and the equations' domain only.
    assert!(arps_solution_gas_validity(phi, sw, k, mu, pb, pa));
    assert!(!arps_solution_gas_validity(phi, sw, k, mu, pb, pb + 1.0));
    assert!(!arps_solution_gas_validity(phi, sw, k, f64::NAN, pb, pa));
    assert!(arps_water_drive_validity(
        phi, sw, k, mu_w, mu_o, pi, 1500.0
    ));
    assert!(!arps_water_drive_validity(
        phi, sw, 5000.0, mu_w, mu_o, pi, 1500.0
    ));
}
