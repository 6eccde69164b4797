//! Large result buffers on transparent huge pages.
//!
//! A result array is fresh memory: the first write to each of its 4 KiB pages traps into
//! the operating system, which finds a page, zeroes it and maps it. Measured on our 2-core
//! test machine (a virtual machine), that costs 2-4 µs per page, about 0.5-1 ns per byte
//! written: 4-8 ns per f64, as much as a whole Dranchuk–Abou-Kassem Z solve takes per
//! point, and about half the time of a many-well black-oil table build. The faults of two
//! threads also queue on the same address-space lock, which spoils the parallel speed-up.
//!
//! Linux can back such memory with 2 MiB pages instead (transparent huge pages, when the
//! system setting `/sys/kernel/mm/transparent_hugepage/enabled` is `madvise` or `always`):
//! one fault then maps 512 times as much. [`zeroed`] asks for that with
//! `madvise(MADV_HUGEPAGE)` on the whole 2 MiB-aligned part of a large buffer before
//! anything is written to it. The advice changes neither the contents nor the ownership of
//! the memory (the buffer is an ordinary `Vec`, freed by the global allocator as usual); it
//! is a hint the kernel may ignore (no huge page free, setting `never`, another operating
//! system), and then the buffer simply uses normal pages.
//!
//! This module and [`crate::simd`] hold the crate's only `unsafe` code.

/// The size of a transparent huge page on x86-64 and aarch64 Linux (4 KiB base pages):
/// 2 MiB.
#[cfg(target_os = "linux")]
const HUGE_PAGE: usize = 2 << 20;

/// A vector of `n` zeros (`T::default()`, all-zero bytes for the number types it is used
/// with) whose memory is advised for huge pages when it spans at least one
/// whole aligned 2 MiB page (buffers from 2 MiB up; smaller ones are left alone).
///
/// The zeros come from the allocator's `calloc` path, which for large sizes maps fresh
/// memory without touching it, so the advice is in place before the first write.
pub(crate) fn zeroed<T: Copy + Default>(n: usize) -> Vec<T> {
    let v = vec![T::default(); n];
    advise_huge(&v);
    v
}

/// Advise the kernel to back the 2 MiB-aligned interior of `buf` with huge pages.
#[cfg(target_os = "linux")]
fn advise_huge<T>(buf: &[T]) {
    let start = buf.as_ptr() as usize;
    let end = start + std::mem::size_of_val(buf);
    let first = start.next_multiple_of(HUGE_PAGE);
    let last = end / HUGE_PAGE * HUGE_PAGE;
    if last > first {
        // SAFETY: `first..last` lies inside `buf`, memory this process owns and has mapped
        // (it is part of a live allocation). MADV_HUGEPAGE only sets a paging hint on that
        // range: it neither reads, writes, frees nor remaps the memory, so no Rust
        // reference or value is affected. A failure (EINVAL when the kernel has no
        // transparent huge pages) leaves the memory as it was and is ignored on purpose.
        #[allow(unsafe_code)]
        let _ = unsafe {
            libc::madvise(
                first as *mut libc::c_void,
                last - first,
                libc::MADV_HUGEPAGE,
            )
        };
    }
}

/// Elsewhere the buffer keeps the operating system's default pages.
#[cfg(not(target_os = "linux"))]
fn advise_huge<T>(_buf: &[T]) {}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn zeroed_is_zeros_of_any_size() {
        for n in [0, 1, 1000, (4 << 20) / 8 + 3] {
            let v: Vec<f64> = zeroed(n);
            assert_eq!(v.len(), n);
            assert!(v.iter().all(|&x| x == 0.0));
        }
    }
}
