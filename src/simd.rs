//! Runtime choice of the instruction set for the hottest array kernels.
//!
//! The wheel and the crate are compiled for baseline x86-64 (SSE2: two f64 lanes), so that
//! they run on any 64-bit PC. A few kernels (the Dranchuk–Abou-Kassem Z-factor solve) are
//! written as branch-free loops over lanes that the compiler vectorises; [`multiversion!`]
//! compiles such a kernel a second time for x86-64-v3 (AVX2 and FMA: four f64 lanes) and
//! picks that copy at run time when the processor has those features.
//!
//! Results do not depend on the copy that runs: Rust never fuses a multiply and an add on
//! its own (no floating-point contraction), and every other operation used (add, multiply,
//! divide, square root, min/max, bit manipulation) is exactly rounded under IEEE 754 in
//! both instruction sets. The tests compare the two copies bit for bit.
//!
//! This module and `pages` (huge-page advice for large buffers) hold the crate's only
//! `unsafe` code; here it is the call of the AVX2 copy, made only
//! after `is_x86_feature_detected!` has confirmed the features.

/// Whether the processor running this code has AVX2 and FMA (x86-64-v3 floating point).
/// Cached by the standard library after the first call.
#[cfg(target_arch = "x86_64")]
#[inline]
pub(crate) fn has_avx2_fma() -> bool {
    std::arch::is_x86_feature_detected!("avx2") && std::arch::is_x86_feature_detected!("fma")
}

/// Defines `fn $name(args) -> ret` that runs `$body(args)` compiled for AVX2 + FMA when the
/// processor has them, and for the baseline instruction set otherwise. `$body` must be an
/// `#[inline(always)]` function so that its whole body (and the `#[inline(always)]`
/// functions it calls) is compiled into each copy.
macro_rules! multiversion {
    ($(#[$m:meta])* $vis:vis fn $name:ident($($a:ident: $t:ty),* $(,)?) $(-> $r:ty)? => $body:path) => {
        $(#[$m])*
        $vis fn $name($($a: $t),*) $(-> $r)? {
            #[cfg(target_arch = "x86_64")]
            {
                #[target_feature(enable = "avx2,fma")]
                fn v3($($a: $t),*) $(-> $r)? {
                    $body($($a),*)
                }
                if $crate::simd::has_avx2_fma() {
                    // SAFETY: `v3` needs AVX2 and FMA, which the processor has (checked
                    // just above by the standard library's run-time detection).
                    #[allow(unsafe_code)]
                    return unsafe { v3($($a),*) };
                }
            }
            $body($($a),*)
        }
    };
}
pub(crate) use multiversion;
