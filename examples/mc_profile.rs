//! Times (and, under `perf record`, profiles) the benchmark's Monte Carlo call.
//! Usage: cargo run --release --example mc_profile -- [trials] [repeats]
use stocktank::volumetrics::{
    Correlation, Distribution as D, Fluid, Input, VolumetricInputs, probabilistic_in_place,
};

fn main() {
    let args: Vec<usize> = std::env::args()
        .skip(1)
        .map(|a| a.parse().unwrap())
        .collect();
    let n = args.first().copied().unwrap_or(1_000_000);
    let reps = args.get(1).copied().unwrap_or(10);
    let s2 = (1.0f64 + (0.05f64 / 1.3).powi(2)).ln();
    let inputs = VolumetricInputs {
        area: D::triangular(800.0, 1000.0, 1500.0).unwrap(),
        thickness: D::pert(20.0, 35.0, 60.0).unwrap(),
        net_to_gross: D::uniform(0.6, 0.9).unwrap(),
        porosity: D::normal(0.2, 0.03, 0.05, 0.35).unwrap(),
        sw: D::normal(0.3, 0.05, 0.1, 0.6).unwrap(),
        fvf: D::lognormal(1.3f64.ln() - s2 / 2.0, s2.sqrt(), 0.0, f64::INFINITY).unwrap(),
        recovery_factor: None,
    };
    use Input::*;
    let c = Correlation::from_pairs(&[
        (Porosity, Sw, -0.6),
        (Area, Thickness, 0.4),
        (NetToGross, Porosity, 0.5),
        (Thickness, NetToGross, 0.3),
        (Sw, Fvf, 0.2),
        (Area, Fvf, -0.1),
    ])
    .unwrap();
    let mut times = Vec::new();
    let mut check = 0u64;
    for r in 0..reps {
        let t0 = std::time::Instant::now();
        let sim = probabilistic_in_place(Fluid::Oil, &inputs, Some(&c), n, r as u64).unwrap();
        times.push(t0.elapsed().as_secs_f64());
        // A checksum of every sample, to see that a speed change kept the results.
        for x in sim.inputs.iter().flatten().chain(&sim.in_place) {
            check = check.rotate_left(5) ^ x.to_bits();
        }
    }
    times.sort_by(f64::total_cmp);
    println!(
        "{n} trials: median {:.4} s, min {:.4} s, checksum {check:016x}",
        times[reps / 2],
        times[0]
    );
}
