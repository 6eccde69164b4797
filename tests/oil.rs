//! Oil correlations against outside references: handbook lab data and worked values, round
//! trips and facts of the trade.

use stocktank::oil::*;
use stocktank::units::StandardConditions;

/// Six crude oils with measured PVT data as tabulated in Ahmed, T. (2006), Reservoir
/// Engineering Handbook, 3rd ed., Gulf Professional Publishing, ch. 2 (from memory):
/// (T degF, Pb psia, Rs scf/STB, Bob rb/STB, density at Pb lbm/ft3, API, gas_sg, psep psia, Tsep degF).
type LabOil = (f64, f64, f64, f64, f64, f64, f64, f64, f64);

const AHMED_SIX_OILS: [LabOil; 6] = [
    (250.0, 2377.0, 751.0, 1.528, 38.13, 47.1, 0.851, 150.0, 60.0),
    (220.0, 2620.0, 768.0, 1.474, 40.95, 40.7, 0.855, 100.0, 75.0),
    (260.0, 2051.0, 693.0, 1.529, 37.37, 48.6, 0.911, 100.0, 72.0),
    (237.0, 2884.0, 968.0, 1.619, 38.92, 40.5, 0.898, 60.0, 120.0),
    (218.0, 3065.0, 943.0, 1.570, 37.70, 44.2, 0.781, 200.0, 60.0),
    (180.0, 4239.0, 807.0, 1.385, 46.79, 27.3, 0.848, 85.0, 173.0),
];

fn gas_for(m_is_vb: bool, o: &LabOil) -> f64 {
    if m_is_vb {
        vasquez_beggs_gas_sg_100psig(o.6, o.5, o.8, o.7).unwrap()
    } else {
        o.6
    }
}

#[test]
fn standing_pb_matches_handbook_worked_values() {
    // Ahmed (2006), ch. 2: Standing's predictions for oils 1-3 are 2181, 2503, 1883 psia
    // (from memory).
    for (o, expect) in AHMED_SIX_OILS.iter().zip([2181.0, 2503.0, 1883.0]) {
        let pb = bubble_point(PbMethod::Standing, o.2, o.6, o.5, o.0).unwrap();
        assert!((pb / expect - 1.0).abs() < 2e-3, "{pb} vs {expect}");
    }
}

#[test]
fn every_pb_correlation_within_its_scatter_of_measured() {
    // Measured bubble points of the six oils (Ahmed 2006, from memory). Correlations scatter
    // typically 5-25 % on foreign data (common practice, no source); we require 25 %.
    for m in PbMethod::ALL {
        let mut sum = 0.0;
        for o in &AHMED_SIX_OILS {
            let pb =
                bubble_point(*m, o.2, gas_for(*m == PbMethod::VasquezBeggs, o), o.5, o.0).unwrap();
            let dev = pb / o.1 - 1.0;
            assert!(dev.abs() < 0.25, "{m}: {pb} vs {}", o.1);
            sum += dev.abs();
        }
        assert!(sum / 6.0 < 0.12, "{m}: mean abs deviation {}", sum / 6.0);
    }
}

#[test]
fn every_bo_correlation_within_five_percent_of_measured() {
    // Measured Bob of the six oils (Ahmed 2006, from memory); published Bo accuracies are
    // 1-5 % (see bo_saturated docs).
    for m in BoMethod::ALL {
        for o in &AHMED_SIX_OILS {
            let bo =
                bo_saturated(*m, o.2, gas_for(*m == BoMethod::VasquezBeggs, o), o.5, o.0).unwrap();
            assert!((bo / o.3 - 1.0).abs() < 0.06, "{m}: {bo} vs {}", o.3);
        }
    }
    // Standing's Bo for oil 1 is 1.506 rb/STB in Ahmed's comparison (from memory).
    let o = AHMED_SIX_OILS[0];
    let bo = bo_saturated(BoMethod::Standing, o.2, o.6, o.5, o.0).unwrap();
    assert!((bo - 1.506).abs() < 1e-3);
}

#[test]
fn density_mass_balance_matches_measured_density() {
    // With measured Rs and Bob, the mass balance must reproduce the measured density at Pb
    // (Ahmed 2006 lab data, from memory) to within 2 % (the separator gas gravity stands in
    // for the gravity of all dissolved gas; measured deviations are 0.1-1.8 %).
    for o in &AHMED_SIX_OILS {
        let rho = oil_density(o.2, o.3, o.6, o.5, &StandardConditions::default()).unwrap();
        assert!((rho / o.4 - 1.0).abs() < 0.02, "{rho} vs {}", o.4);
    }
}

#[test]
fn density_is_a_mass_balance() {
    // Mass of 1 STB of oil plus Rs scf of gas, divided by Bo rb, with the familiar field
    // constants 62.4 and 0.0136 (common practice, no source): agree to 0.1 %.
    let (rs, bo, g, api) = (650.0, 1.35, 0.8, 33.0);
    let rho = oil_density(rs, bo, g, api, &StandardConditions::default()).unwrap();
    let sg = sg_from_api(api).unwrap();
    let textbook = (62.4 * sg + 0.0136 * rs * g) / bo;
    assert!((rho / textbook - 1.0).abs() < 1e-3);
}

#[test]
fn round_trips_over_a_grid() {
    for m in PbMethod::ALL {
        for api in [20.0, 30.0, 31.0, 45.0] {
            for g in [0.65, 0.8, 1.0] {
                for t in [100.0, 180.0, 260.0] {
                    for rs in [200.0, 600.0, 1200.0] {
                        let Ok(pb) = bubble_point(*m, rs, g, api, t) else {
                            continue;
                        };
                        let back = solution_gor(*m, pb, g, api, t).unwrap();
                        assert!((back / rs - 1.0).abs() < 1e-10, "{m} Rs(Pb)");
                        let p = 0.5 * pb;
                        let rs_p = solution_gor(*m, p, g, api, t).unwrap();
                        let p_back = bubble_point(*m, rs_p, g, api, t).unwrap();
                        assert!((p_back / p - 1.0).abs() < 1e-10, "{m} Pb(Rs(p))");
                    }
                }
            }
        }
    }
}

#[test]
fn facts_of_the_trade() {
    // Live-oil Bo is above 1 at reservoir conditions; dead-oil viscosity falls with API and
    // with temperature; Rs rises with pressure (common practice, no source).
    for m in BoMethod::ALL {
        assert!(bo_saturated(*m, 500.0, 0.8, 35.0, 180.0).unwrap() > 1.0);
    }
    for m in DeadOilViscosityMethod::ALL {
        let mut prev = f64::INFINITY;
        for api in [20.0, 25.0, 30.0, 35.0, 40.0, 45.0] {
            let mu = dead_oil_viscosity(*m, api, 180.0).unwrap();
            assert!(mu < prev && mu > 0.0, "{m} api {api}");
            prev = mu;
        }
        let mut prev = f64::INFINITY;
        for t in [100.0, 140.0, 180.0, 220.0, 260.0] {
            let mu = dead_oil_viscosity(*m, 30.0, t).unwrap();
            assert!(mu < prev, "{m} t {t}");
            prev = mu;
        }
    }
    for m in PbMethod::ALL {
        let a = solution_gor(*m, 1000.0, 0.8, 35.0, 180.0).unwrap();
        let b = solution_gor(*m, 2000.0, 0.8, 35.0, 180.0).unwrap();
        assert!(b > a);
    }
    // Gas in solution lowers viscosity; pressure above Pb raises it.
    let mu_od = dead_oil_viscosity(DeadOilViscosityMethod::BeggsRobinson, 30.0, 180.0).unwrap();
    let mu_ob = live_oil_viscosity(mu_od, 600.0).unwrap();
    assert!(mu_ob < mu_od);
    assert!(undersaturated_oil_viscosity(5000.0, 2500.0, mu_ob).unwrap() > mu_ob);
}

#[test]
fn beggs_robinson_dead_oil_by_hand() {
    // Direct evaluation of the published form (Beggs and Robinson 1975) at 30 API, 150 degF,
    // with scipy-free arithmetic, in the paper's base-10 form:
    // x = 150^-1.163 * 10^(3.0324 - 0.02023*30).
    let x = 150f64.powf(-1.163) * 10f64.powf(3.0324 - 0.02023 * 30.0);
    let expect = 10f64.powf(x) - 1.0;
    let mu = dead_oil_viscosity(DeadOilViscosityMethod::BeggsRobinson, 30.0, 150.0).unwrap();
    assert!((mu - expect).abs() < 1e-12);
    // Typical dead oil at 30 API and 150 degF is a few cp (common practice, no source).
    assert!(mu > 1.0 && mu < 10.0);
}

#[test]
fn validity_functions() {
    assert!(bubble_point_in_range(
        PbMethod::Glaso,
        600.0,
        0.8,
        35.0,
        180.0
    ));
    assert!(!bubble_point_in_range(
        PbMethod::Glaso,
        600.0,
        0.8,
        60.0,
        180.0
    ));
    assert!(!bubble_point_in_range(
        PbMethod::Standing,
        f64::NAN,
        0.8,
        35.0,
        180.0
    ));
}

#[test]
fn calibration_reports_raw_deviation() {
    let o = AHMED_SIX_OILS[0];
    let oil = Oil::new(o.5, o.6, o.2, o.0)
        .unwrap()
        .with_measured_bubble_point(o.1)
        .unwrap()
        .with_calibration(Calibration {
            bob: Some(o.3),
            mu_ob_cp: Some(0.35),
        })
        .unwrap();
    let r = oil.calibration_report().unwrap();
    assert!((r.pb_correlation_psia - 2181.0).abs() < 2.0);
    assert_eq!(r.pb_psia, o.1);
    assert!((r.pb_scale - o.1 / r.pb_correlation_psia).abs() < 1e-15);
    let m = oil.model().unwrap();
    assert_eq!(m.bo(o.1).unwrap(), o.3);
    assert!((m.viscosity(o.1).unwrap() - 0.35).abs() < 1e-12);
    assert!((m.rs(o.1).unwrap() - o.2).abs() < 1e-9);
}

#[test]
fn public_types_are_send_sync() {
    fn check<T: Send + Sync>() {}
    check::<Oil>();
    check::<OilModel>();
    check::<CalibrationReport>();
    check::<PbMethod>();
}

#[test]
fn closed_form_derivatives_match_central_differences() {
    use stocktank::oil::bubble_point::solution_gor_dp;
    use stocktank::oil::fvf::bo_saturated_drs;
    for m in PbMethod::ALL {
        for p in [300.0, 1500.0, 4000.0] {
            let h = 1e-3 * p;
            let f = |q: f64| solution_gor(*m, q, 0.8, 33.0, 190.0).unwrap();
            let fd = (f(p + h) - f(p - h)) / (2.0 * h);
            let d = solution_gor_dp(*m, p, 0.8, 33.0, 190.0).unwrap();
            assert!((d / fd - 1.0).abs() < 1e-5, "{m} {p}: {d} {fd}");
        }
    }
    for m in BoMethod::ALL {
        for rs in [50.0, 400.0, 1200.0] {
            let h = 1e-3 * rs;
            let f = |r: f64| bo_saturated(*m, r, 0.8, 33.0, 190.0).unwrap();
            let fd = (f(rs + h) - f(rs - h)) / (2.0 * h);
            let d = bo_saturated_drs(*m, rs, 0.8, 33.0, 190.0).unwrap();
            assert!((d / fd - 1.0).abs() < 1e-5, "{m} {rs}: {d} {fd}");
        }
    }
}
