//! Profiling driver for the Dranchuk–Abou-Kassem Z-factor on arrays (`perf record` target):
//! `cargo run --release --example profile_zfactor -- [points] [repeats]`, one thread with
//! `RAYON_NUM_THREADS=1`. Random points with Ppr in [0.2, 15] and Tpr in [T0, T0 + DT]
//! (environment variables, default 1.05 and 1.95), as in `benches/bench_zfactor.py`.
//! Prints the best time per point of the batch kernel alone and of the array function.

use std::time::Instant;
use stocktank::array::{BATCH, OnError};
use stocktank::gas::{ZMethod, z_dak, z_dak_batch, z_factor_array};

fn env_or(name: &str, default: f64) -> f64 {
    std::env::var(name)
        .ok()
        .and_then(|v| v.parse().ok())
        .unwrap_or(default)
}

fn main() {
    let args: Vec<usize> = std::env::args()
        .skip(1)
        .map(|a| a.parse().expect("integer argument"))
        .collect();
    let n = args.first().copied().unwrap_or(1_000_000) / BATCH * BATCH;
    let repeats = args.get(1).copied().unwrap_or(10);
    let (t0, dt) = (env_or("T0", 1.05), env_or("DT", 1.95));
    // xorshift64: a fixed pseudo-random spread, no dependency.
    let mut state: u64 = 0x9E37_79B9_7F4A_7C15;
    let mut uniform = || {
        state ^= state << 13;
        state ^= state >> 7;
        state ^= state << 17;
        (state >> 11) as f64 / (1u64 << 53) as f64
    };
    let ppr: Vec<f64> = (0..n).map(|_| 0.2 + 14.8 * uniform()).collect();
    let tpr: Vec<f64> = (0..n).map(|_| t0 + dt * uniform()).collect();
    let mut z = vec![0.0; n];
    let _ = z_dak(1.0, 1.5); // builds the starting-density table once

    let mut best_kernel = f64::MAX;
    let mut off_fast_path = 0;
    for _ in 0..repeats {
        let start = Instant::now();
        off_fast_path = 0;
        for k in (0..n).step_by(BATCH) {
            let mut x = [[0.0; BATCH]; 2];
            x[0].copy_from_slice(&ppr[k..k + BATCH]);
            x[1].copy_from_slice(&tpr[k..k + BATCH]);
            let mut zs = [0.0; BATCH];
            let done = z_dak_batch(&x, &mut zs);
            for l in 0..BATCH {
                z[k + l] = if done[l] {
                    zs[l]
                } else {
                    off_fast_path += 1;
                    z_dak(x[0][l], x[1][l]).unwrap_or(f64::NAN)
                };
            }
        }
        best_kernel = best_kernel.min(start.elapsed().as_secs_f64());
    }

    let (pa, ta) = (
        ndarray::Array1::from(ppr).into_dyn(),
        ndarray::Array1::from(tpr).into_dyn(),
    );
    let mut best_array = f64::MAX;
    for _ in 0..repeats {
        let start = Instant::now();
        let out = z_factor_array(
            pa.view(),
            ta.view(),
            ZMethod::DranchukAbouKassem,
            OnError::Coerce,
        )
        .expect("coerce does not fail");
        best_array = best_array.min(start.elapsed().as_secs_f64());
        assert_eq!(out[n / 2].to_bits(), z[n / 2].to_bits());
    }
    let ns = |t: f64| t * 1e9 / n as f64;
    println!(
        "batch kernel: {:.1} ns/point (best of {repeats}), {off_fast_path} points off the fast path",
        ns(best_kernel)
    );
    println!(
        "array function: {:.1} ns/point (best of {repeats})",
        ns(best_array)
    );
}
