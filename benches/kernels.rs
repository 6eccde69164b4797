//! Criterion benchmarks of the Rust kernels (`cargo bench --bench kernels`).
//!
//! Per-point cost of the Z-factor solvers (scalar and array), of one black-oil table, and of
//! the Arps rate. Absolute times drift with the machine's state; compare runs made side by side.

use criterion::{Criterion, criterion_group, criterion_main};
use ndarray::Array1;
use std::hint::black_box;
use stocktank::array::OnError;
use stocktank::gas::{ZMethod, z_factor_array};
use stocktank::oil::{BlackOilTable, Oil};

/// A fixed grid of (Ppr, Tpr) points spanning Ppr 0.2-15 and Tpr 1.05-3.
fn grid(n: usize) -> (Array1<f64>, Array1<f64>) {
    let ppr = Array1::from_iter((0..n).map(|k| 0.2 + 14.8 * ((k * 7919) % n) as f64 / n as f64));
    let tpr =
        Array1::from_iter((0..n).map(|k| 1.05 + 1.95 * ((k * 104_729) % n) as f64 / n as f64));
    (ppr, tpr)
}

fn z_factor(c: &mut Criterion) {
    let (ppr, tpr) = grid(100_000);
    let (p, t) = (ppr.into_dyn(), tpr.into_dyn());
    let mut g = c.benchmark_group("z_factor_1e5_points");
    g.sample_size(20);
    for (name, method) in [
        ("dak", ZMethod::DranchukAbouKassem),
        ("hall_yarborough", ZMethod::HallYarborough),
    ] {
        g.bench_function(format!("{name}_array"), |b| {
            b.iter(|| {
                z_factor_array(
                    black_box(p.view()),
                    black_box(t.view()),
                    method,
                    OnError::Raise,
                )
            })
        });
    }
    g.bench_function("dak_scalar_loop", |b| {
        b.iter(|| {
            p.iter()
                .zip(t.iter())
                .map(|(&x, &y)| {
                    stocktank::gas::z_dak(black_box(x), black_box(y)).unwrap_or(f64::NAN)
                })
                .sum::<f64>()
        })
    });
    g.finish();
}

fn black_oil_table(c: &mut Criterion) {
    let oil = Oil::new(35.0, 0.75, 600.0, 180.0).expect("valid oil");
    let grid: Vec<f64> = (1..=50).map(|k| 100.0 * k as f64).collect();
    c.bench_function("black_oil_table_50_pressures", |b| {
        b.iter(|| BlackOilTable::build(black_box(&oil), black_box(&grid)))
    });
}

fn arps(c: &mut Criterion) {
    let t: Vec<f64> = (0..1000).map(|k| k as f64 * 30.4375).collect();
    c.bench_function("arps_rate_1000_steps", |b| {
        b.iter(|| {
            t.iter()
                .map(|&t| {
                    stocktank::decline::rate(700.0, 0.5, 0.8, 0.08, black_box(t)).unwrap_or(0.0)
                })
                .sum::<f64>()
        })
    });
}

criterion_group!(benches, z_factor, black_oil_table, arps);
criterion_main!(benches);
