//! The public contract of `stocktank::gas::Gas` that other domains build on.

use stocktank::gas::{Gas, GasProperty, ZMethod};
use stocktank::units::StandardConditions;

#[test]
fn gas_is_send_sync_clone_eq() {
    fn assert_traits<T: Send + Sync + Clone + PartialEq + std::fmt::Debug>() {}
    assert_traits::<Gas>();
    assert_traits::<GasProperty>();
    assert_traits::<ZMethod>();
}

#[test]
fn contract_methods() {
    let gas = Gas::new(0.7).unwrap();
    let sc = StandardConditions::default();
    let z = gas.z(2500.0, 180.0).unwrap();
    let bg = gas.bg(2500.0, 180.0, &sc).unwrap();
    // Real-gas law: Bg = (p_sc / T_sc) Z T / p (common practice, no source).
    let expected = 14.696 / 519.67 * z * (180.0 + 459.67) / 2500.0;
    assert!((bg / expected - 1.0).abs() < 1e-14);
    assert!(gas.density(2500.0, 180.0).unwrap() > 0.0);
    assert!(gas.viscosity(2500.0, 180.0).unwrap() > 0.0);
    assert!(gas.cg(2500.0, 180.0).unwrap() > 0.0);
}

#[test]
fn bad_inputs_name_the_argument() {
    let gas = Gas::new(0.7).unwrap();
    let msg = gas.z(-5.0, 100.0).unwrap_err().to_string();
    assert!(msg.contains("p_psia") && msg.contains("-5"), "{msg}");
    let msg = gas.z(1000.0, -500.0).unwrap_err().to_string();
    assert!(msg.contains("t_f"), "{msg}");
    assert!(Gas::new(0.0).is_err());
    assert!(
        Gas::new(0.7)
            .unwrap()
            .with_impurities(0.6, 0.5, 0.0)
            .is_err()
    );
}
