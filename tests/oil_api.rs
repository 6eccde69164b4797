//! OilModel::co and the many-well table builder with per-well gas and water descriptions.

use stocktank::array::OnError;
use stocktank::gas::Gas;
use stocktank::oil::{BlackOilTable, Oil, build_long_results_with};
use stocktank::water::Water;

#[test]
fn co_is_vasquez_beggs_above_pb_and_the_table_column_below() {
    let oil = Oil::new(33.0, 0.8, 500.0, 190.0).unwrap();
    let m = oil.model().unwrap();
    let gas = Gas::new(0.8).unwrap();
    // Vasquez, M., Beggs, H.D. (1980), JPT 32(6), 968-970, written out here (from memory):
    // co = (-1433 + 5 Rsb + 17.2 T - 1180 gas_sg + 12.61 API) / (1e5 p).
    for p in [m.pb, m.pb + 1.0, 4000.0, 8000.0] {
        let vb = (-1433.0 + 5.0 * 500.0 + 17.2 * 190.0 - 1180.0 * 0.8 + 12.61 * 33.0) / (1e5 * p);
        let co = m.co(p, &gas).unwrap();
        assert!((co / vb - 1.0).abs() < 1e-12, "{p}: {co} vs {vb}");
    }
    let grid: Vec<f64> = (1..40).map(|i| 60.0 * i as f64).collect();
    let t = BlackOilTable::build_with(&m, &gas, &Water::new(0.0).unwrap(), &grid).unwrap();
    for i in 0..t.pb_index {
        let co = m.co(t.p[i], &gas).unwrap();
        assert!(
            (co / t.co[i] - 1.0).abs() < 1e-12,
            "{}: {co} vs {}",
            t.p[i],
            t.co[i]
        );
    }
    assert!(m.co(-1.0, &gas).is_err());
}

#[test]
fn many_wells_with_their_own_gas_and_water() {
    let oils = vec![
        Oil::new(30.0, 0.75, 400.0, 180.0),
        Oil::new(38.0, 0.85, 700.0, 210.0),
    ];
    let gases = [
        Gas::new(0.75)
            .unwrap()
            .with_impurities(0.1, 0.0, 0.0)
            .unwrap(),
        Gas::new(0.85)
            .unwrap()
            .with_impurities(0.0, 0.05, 0.02)
            .unwrap(),
    ];
    let waters = [Water::new(2.0).unwrap(), Water::new(12.0).unwrap()];
    let grid = [800.0, 2000.0, 4000.0];
    let long = build_long_results_with(oils.clone(), &grid, OnError::Raise, |k, _| {
        Ok((gases[k], waters[k].clone()))
    })
    .unwrap();
    let mut row = 0;
    for (k, o) in oils.iter().enumerate() {
        let o = o.as_ref().unwrap();
        let single =
            BlackOilTable::build_with(&o.model().unwrap(), &gases[k], &waters[k], &grid).unwrap();
        for i in 0..single.p.len() {
            assert_eq!(long.well[row], k as u64);
            // Every column, bit for bit.
            for (c, (name, _)) in stocktank::oil::table::COLUMNS.iter().enumerate() {
                assert_eq!(
                    long.columns[c][row],
                    single.column(name).unwrap()[i],
                    "{name}"
                );
            }
            row += 1;
        }
        // The default builder uses a sweet gas of the oil's gravity: Z differs.
        let plain = BlackOilTable::build(o, &grid).unwrap();
        assert!(plain.z.iter().zip(&single.z).all(|(a, b)| a != b));
    }
    assert_eq!(row, long.well.len());
}
