//! Profiling driver for the many-well black-oil table path (`perf record` target):
//! `cargo run --release --example profile_black_oil -- [wells] [points] [repeats]`.
//! The oils are a fixed pseudo-random spread inside Standing's (1947) data ranges.

use stocktank::array::OnError;
use stocktank::oil::{Oil, table::build_long_results};

fn main() {
    let args: Vec<usize> = std::env::args()
        .skip(1)
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
    println!(
        "{wells} tables x {points}: {:.4} s per build, {:.1} ns per row (checksum {sum:.6e})",
        dt,
        dt * 1e9 / (wells * points) as f64
    );
}
