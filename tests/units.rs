//! Unit conversions against published definitions (NIST SP 811, 2008, Appendix B).

use stocktank::units::StandardConditions;
use stocktank::units::convert::{convert, rebase_gas_volume};

fn close(a: f64, b: f64, tol: f64) {
    assert!(((a - b) / b).abs() < tol, "{a} vs {b}");
}

#[test]
fn nist_sp811_factors() {
    // NIST SP 811 (2008), Appendix B.8 and B.9.
    close(convert(1.0, "bbl", "m3").unwrap(), 1.589_873e-1, 1e-6);
    close(convert(1.0, "ft3", "m3").unwrap(), 2.831_685e-2, 1e-6);
    close(convert(1.0, "psi", "kPa").unwrap(), 6.894_757, 1e-6);
    // NIST lists the survey acre, 4.046 873 E+03 m2; the international acre used here is
    // 43,560 x 0.3048^2 = 4046.8564224 m2 (exact), 4 ppm smaller.
    close(convert(1.0, "acre", "m2").unwrap(), 4_046.856_422_4, 1e-15);
    close(convert(1.0, "acre", "m2").unwrap(), 4.046_873e3, 5e-6);
    close(convert(1.0, "cp", "Pa.s").unwrap(), 1.0e-3, 1e-15);
    close(convert(1.0, "lbm/ft3", "kg/m3").unwrap(), 1.601_846e1, 1e-6);
    close(convert(1.0, "D", "m2").unwrap(), 9.869_233e-13, 1e-6);
}

#[test]
fn acre_ft_is_7758_bbl_and_43560_ft3() {
    // Derived from 1 acre = 43,560 ft2 and 1 bbl = 42 US gal = 9702 in3 (NIST SP 811);
    // the trade's 7758 bbl/acre-ft (common practice, no source).
    assert_eq!(convert(1.0, "acre-ft", "bbl").unwrap().round(), 7758.0);
    close(convert(1.0, "acre-ft", "ft3").unwrap(), 43_560.0, 1e-14);
}

#[test]
fn temperature_and_gauge_pressure() {
    // Fixed points: water freezes at 32 degF = 0 degC = 273.15 K = 491.67 degR (NIST SP 811).
    close(convert(32.0, "degF", "K").unwrap(), 273.15, 1e-14);
    close(convert(0.0, "degC", "degR").unwrap(), 491.67, 1e-14);
    close(convert(212.0, "degF", "degC").unwrap(), 100.0, 1e-14);
    // 0 psig is one standard atmosphere, 14.6959 psia (NIST SP 811).
    close(convert(0.0, "psig", "psia").unwrap(), 14.695_949, 1e-7);
    close(convert(0.0, "barg", "kPa").unwrap(), 101.325, 1e-14);
}

#[test]
fn ratios_and_fvf() {
    // 1 sm3/sm3 = 5.614583 scf/STB (ratio of the ft3 and bbl definitions).
    close(
        convert(1.0, "sm3/sm3", "scf/STB").unwrap(),
        5.614_583_333,
        1e-9,
    );
    close(convert(1.2, "rb/STB", "rm3/sm3").unwrap(), 1.2, 1e-15);
    close(
        convert(1.0, "rb/Mscf", "rcf/scf").unwrap(),
        5.614_583_333e-3,
        1e-9,
    );
    close(
        convert(1.0, "1/psi", "1/kPa").unwrap(),
        1.0 / 6.894_757,
        1e-6,
    );
}

#[test]
fn wrong_quantity_or_unknown_unit_is_named() {
    let e = convert(1.0, "psia", "ft").unwrap_err().to_string();
    assert!(e.contains("to_unit") && e.contains("psia"), "{e}");
    let e = convert(1.0, "psia", "stone").unwrap_err().to_string();
    assert!(e.contains("to_unit") && e.contains("stone"), "{e}");
}

#[test]
fn gas_volume_between_base_conditions() {
    // Ideal gas: V2 = V1 (p1/p2)(T2/T1); 60 degF/14.696 psia to 15 degC/101.325 kPa.
    let v = rebase_gas_volume(
        1.0,
        StandardConditions::FIELD,
        StandardConditions::ISO_13443,
    )
    .unwrap();
    close(v, (14.696 / 14.695_949) * (518.67 / 519.67), 1e-6);
}
