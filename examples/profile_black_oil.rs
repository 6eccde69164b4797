//! Profiling driver for the many-well black-oil table path (`perf record` target):
//! `cargo run --release --example profile_black_oil -- [wells] [points] [repeats] [build-only]`.
//! The oils are a fixed pseudo-random spread inside Standing's (1947) data ranges.

use stocktank::array::OnError;
use stocktank::fastmath;
use stocktank::oil::{Oil, table::build_long_results};

fn main() {
    let args: Vec<usize> = std::env::args()
        .skip(1)
        .take(3)
        .map(|a| a.parse().expect("integer argument"))
        .collect();
    let wells = args.first().copied().unwrap_or(10_000);
    let points = args.get(1).copied().unwrap_or(50);
    let repeats = args.get(2).copied().unwrap_or(5);
    let frac = |k: usize, m: usize| ((k * m) % 1000) as f64 / 1000.0;
    let oils: Vec<_> = (0..wells)
        .map(|k| {
            Oil::new(
                25.0 + 20.0 * frac(k, 7919),
                0.65 + 0.25 * frac(k, 104_729),
                200.0 + 800.0 * frac(k, 31),
                120.0 + 120.0 * frac(k, 613),
            )
        })
        .collect();
    let grid: Vec<f64> = (0..points - 1)
        .map(|k| 100.0 + 5900.0 * k as f64 / (points - 2) as f64)
        .collect();
    let mut sum = 0.0;
    let t0 = std::time::Instant::now();
    for _ in 0..repeats {
        let long = build_long_results(oils.clone(), &grid, OnError::Raise).expect("tables");
        sum += long.columns[2].iter().sum::<f64>();
    }
    let dt = t0.elapsed().as_secs_f64() / repeats as f64;
    let rows = (wells * points) as f64;
    println!(
        "{wells} tables x {points}: {:.4} s per build, {:.1} ns per row (checksum {sum:.6e})",
        dt,
        dt * 1e9 / rows
    );
    // `build-only` as a fourth argument: stop here (a clean `perf record` of the builder).
    if std::env::args().nth(4).as_deref() == Some("build-only") {
        return;
    }
    // The per-fluid set-up alone (model with Pb, Bob, dead-oil viscosity; gas and water).
    let t0 = std::time::Instant::now();
    let mut acc = 0.0;
    for _ in 0..repeats {
        for o in &oils {
            let o = o.as_ref().expect("oil");
            let m = o.model().expect("model");
            let (g, _w) = o.gas_and_water().expect("gas and water");
            acc += m.pb + g.gas_sg();
        }
    }
    let ds = t0.elapsed().as_secs_f64() / repeats as f64;
    println!(
        "per-fluid set-up alone: {:.1} ns per row ({:.0} % of a table row) (checksum {acc:.6e})",
        ds * 1e9 / rows,
        100.0 * ds / dt
    );
    // The Z column alone: one Dranchuk–Abou-Kassem isotherm per fluid, through the public
    // array function (the table builder uses the same batch kernel).
    let t0 = std::time::Instant::now();
    let mut acc = 0.0;
    let p_nd = ndarray::Array1::from(grid.clone()).into_dyn();
    for _ in 0..repeats {
        for o in &oils {
            let o = o.as_ref().expect("oil");
            let g = stocktank::gas::Gas::new(o.gas_sg).expect("gas");
            let t_nd = ndarray::arr1(&[o.temperature_f]).into_dyn();
            let z = g
                .property_array(
                    stocktank::gas::GasProperty::Z,
                    p_nd.view(),
                    t_nd.view(),
                    &stocktank::units::StandardConditions::FIELD,
                    OnError::Raise,
                )
                .expect("z");
            acc += z[0];
        }
    }
    let dz = t0.elapsed().as_secs_f64() / repeats as f64;
    println!(
        "Z column alone (array function): {:.1} ns per row ({:.0} % of a table row) (checksum {acc:.6e})",
        dz * 1e9 / rows,
        100.0 * dz / dt
    );
    // The floor of the transcendental work alone: 6 ln and 7 exp per row (what a row below
    // Pb needs with the default correlations), on the same number of rows, one thread.
    let ps: Vec<f64> = (0..wells * points)
        .map(|k| 100.0 + (k % 6000) as f64)
        .collect();
    let t0 = std::time::Instant::now();
    let mut acc = 0.0;
    for _ in 0..repeats {
        for &p in &ps {
            // Independent calls, as in a table row (throughput, not latency).
            let mut s = fastmath::exp(-1e-4 * p);
            for k in 0..6 {
                let l = fastmath::ln(p + k as f64);
                s += fastmath::exp(-1e-3 * l * k as f64);
            }
            acc += s;
        }
    }
    let df = t0.elapsed().as_secs_f64() / repeats as f64;
    println!(
        "6 ln + 7 exp per row alone: {:.1} ns per row ({:.0} % of a table row) (checksum {acc:.6e})",
        df * 1e9 / rows,
        100.0 * df / dt
    );
    // The same with the system library's exp / ln, for comparison.
    let t0 = std::time::Instant::now();
    let mut acc = 0.0;
    for _ in 0..repeats {
        for &p in &ps {
            let mut s = (-1e-4 * p).exp();
            for k in 0..6 {
                let l = (p + k as f64).ln();
                s += (-1e-3 * l * k as f64).exp();
            }
            acc += s;
        }
    }
    let ds = t0.elapsed().as_secs_f64() / repeats as f64;
    println!(
        "the same with f64::ln / f64::exp: {:.1} ns per row (checksum {acc:.6e})",
        ds * 1e9 / rows
    );
}
