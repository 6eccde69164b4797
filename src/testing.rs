//! Helpers shared by the unit tests.

/// A deterministic stream of uniform values in [0, 1) from `seed` (xorshift64, Marsaglia
/// 2003): reproducible test inputs without a dependency.
pub(crate) fn uniform_stream(seed: u64) -> impl FnMut() -> f64 {
    let mut s = seed;
    move || {
        s ^= s << 13;
        s ^= s >> 7;
        s ^= s << 17;
        (s >> 11) as f64 / (1u64 << 53) as f64
    }
}
