//! Probabilistic in-place volumes: Monte Carlo with rank correlation (Iman–Conover),
//! P90/P50/P10 and a sensitivity (tornado) table.
//!
//! The trade's convention is used throughout: **P90 is the LOW value** (exceeded with 90%
//! probability, the 10th percentile of the samples), P50 the median and P10 the HIGH value
//! (exceeded with 10% probability, the 90th percentile). Percentiles interpolate linearly
//! between order statistics (numpy's default "linear" method).
//!
//! # Method
//! 1. Each input is sampled independently from its [`Distribution`] (reproducible by seed).
//! 2. Inputs that take part in a correlation are re-paired by Iman and Conover (1982): van
//!    der Waerden scores Phi^-1(i/(n+1)), permuted independently per input (scatter shuffle
//!    of Rao 1961 and Sandelius 1962 with Fisher–Yates inside each bucket and Lemire's exact
//!    index draws: every permutation equally likely), are transformed
//!    by `P Q^-1` (Cholesky factors of the target and of the scores' sample correlation) and
//!    each input's sorted samples are placed in the rank order of its transformed scores
//!    (the first input needs no ranking, as its transformed
//!    scores are a positive multiple of its permuted scores).
//!    The marginal distributions are untouched. The target is a rank (Spearman) correlation;
//!    it is converted to the Pearson correlation of the normal scores by
//!    rho_p = 2 sin(pi rho_s / 6) (Pearson 1907) when that matrix is positive definite.
//! 3. The volume is evaluated per trial; P90/P50/P10, mean and standard deviation follow.
//! 4. Tornado: each input in turn at its own P90 and P10 sample values, the others at their
//!    P50, ranked by the swing of the volume; plus the Spearman rank correlation of each
//!    input with the volume (estimated from the first 200,000 trials).
//!
//! # References
//! - Iman, R.L., Conover, W.J. (1982). A distribution-free approach to inducing rank
//!   correlation among input variables. Commun. Statist. Simula. Computa. 11(3), 311–334.
//! - Rao, C.R. (1961). Generation of random permutations of given number of elements
//!   using random sampling numbers. Sankhya A 23, 305–307; Sandelius, M. (1962). A simple
//!   randomization procedure. J. Royal Statistical Society B 24(2), 472–481 (from memory).
//! - Durstenfeld, R. (1964). Algorithm 235: Random permutation. Communications of the ACM
//!   7(7), 420 (the Fisher–Yates shuffle in place).
//! - Lemire, D. (2019). Fast random integer generation in an interval. ACM Transactions on
//!   Modeling and Computer Simulation 29(1), 3 (multiply-shift index draw).
//! - Pearson, K. (1907). On further methods of determining correlation. Drapers' Company
//!   Research Memoirs, Biometric Series IV.
//! - Murtha, J.A. (1994). Incorporating historical data into Monte Carlo simulation.
//!   SPE Computer Applications 6(2) (Monte Carlo volumetrics in practice).
//! - Hyndman, R.J., Fan, Y. (1996). Sample quantiles in statistical packages. The American
//!   Statistician 50(4), 361–365 (definition 7, the linear interpolation used here).

use super::distribution::{Distribution, Rng, norm_ppf_fast};
use super::inplace::Fluid;
use crate::error::{Error, Result};
use crate::units::{BBL_PER_ACRE_FT, FT2_PER_ACRE};
use rayon::prelude::*;

/// The uncertain inputs of a volumetric estimate, in this order.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Input {
    /// Area, acres.
    Area,
    /// Gross thickness, ft.
    Thickness,
    /// Net-to-gross, fraction.
    NetToGross,
    /// Porosity, fraction.
    Porosity,
    /// Water saturation, fraction.
    Sw,
    /// Formation volume factor: Boi rb/STB (oil) or Bgi rcf/scf (gas).
    Fvf,
    /// Recovery factor, fraction (optional; gives recoverable volumes).
    RecoveryFactor,
}

impl Input {
    /// All inputs, in column order.
    pub const ALL: [Input; 7] = [
        Input::Area,
        Input::Thickness,
        Input::NetToGross,
        Input::Porosity,
        Input::Sw,
        Input::Fvf,
        Input::RecoveryFactor,
    ];

    /// The argument name (as in the Python API).
    ///
    /// # Examples
    /// ```
    /// assert_eq!(stocktank::volumetrics::Input::Sw.name(), "sw");
    /// ```
    pub fn name(self) -> &'static str {
        match self {
            Input::Area => "area",
            Input::Thickness => "thickness",
            Input::NetToGross => "net_to_gross",
            Input::Porosity => "porosity",
            Input::Sw => "sw",
            Input::Fvf => "fvf",
            Input::RecoveryFactor => "recovery_factor",
        }
    }

    /// Parse an argument name.
    ///
    /// # Errors
    /// [`Error::InvalidOption`] naming `correlation`.
    ///
    /// # Examples
    /// ```
    /// use stocktank::volumetrics::Input;
    /// assert_eq!(Input::parse("porosity").unwrap(), Input::Porosity);
    /// ```
    pub fn parse(s: &str) -> Result<Self> {
        Input::ALL
            .into_iter()
            .find(|i| i.name() == s)
            .ok_or_else(|| Error::InvalidOption {
                arg: "correlation",
                value: s.to_string(),
                allowed: "area, thickness, net_to_gross, porosity, sw, fvf, recovery_factor",
            })
    }

    fn index(self) -> usize {
        self as usize
    }
}

/// The uncertain inputs of a probabilistic volumetric estimate.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct VolumetricInputs {
    /// Area, acres (support >= 0).
    pub area: Distribution,
    /// Gross thickness, ft (support >= 0).
    pub thickness: Distribution,
    /// Net-to-gross, fraction (support in [0, 1]).
    pub net_to_gross: Distribution,
    /// Porosity, fraction (support in [0, 1]).
    pub porosity: Distribution,
    /// Water saturation, fraction (support in [0, 1]).
    pub sw: Distribution,
    /// Boi in rb/STB (oil) or Bgi in rcf/scf (gas), support > 0.
    pub fvf: Distribution,
    /// Recovery factor, fraction (support in [0, 1]); `None` for in-place volumes only.
    pub recovery_factor: Option<Distribution>,
}

impl VolumetricInputs {
    fn get(&self, i: Input) -> Option<&Distribution> {
        match i {
            Input::Area => Some(&self.area),
            Input::Thickness => Some(&self.thickness),
            Input::NetToGross => Some(&self.net_to_gross),
            Input::Porosity => Some(&self.porosity),
            Input::Sw => Some(&self.sw),
            Input::Fvf => Some(&self.fvf),
            Input::RecoveryFactor => self.recovery_factor.as_ref(),
        }
    }

    /// Check each input's support against its physical range.
    fn validate(&self) -> Result<()> {
        for i in Input::ALL {
            let Some(d) = self.get(i) else { continue };
            let (lo, hi) = d.support();
            let (ok, reason) = match i {
                Input::Area | Input::Thickness => (
                    lo >= 0.0,
                    "distribution support must be >= 0 (truncate the distribution at 0)",
                ),
                Input::Fvf => (
                    lo > 0.0 || (lo == 0.0 && matches!(d, Distribution::Lognormal { .. })),
                    "distribution support must be > 0 (truncate the distribution above 0)",
                ),
                _ => (
                    lo >= 0.0 && hi <= 1.0,
                    "distribution support must lie in [0, 1] (truncate the distribution)",
                ),
            };
            if !ok {
                let bad = if lo < 0.0 || (i == Input::Fvf && lo <= 0.0) {
                    lo
                } else {
                    hi
                };
                return Err(Error::invalid(i.name(), bad, reason));
            }
        }
        Ok(())
    }
}

/// A validated, symmetric, positive-definite correlation matrix.
#[derive(Debug, Clone, PartialEq)]
pub struct Correlation {
    k: usize,
    data: Vec<f64>,
}

/// Cholesky factor (lower, row-major) of a k x k matrix, or the failing pivot row.
fn cholesky(k: usize, a: &[f64]) -> std::result::Result<Vec<f64>, usize> {
    let mut l = vec![0.0; k * k];
    for i in 0..k {
        for j in 0..=i {
            let mut s = a[i * k + j];
            for p in 0..j {
                s -= l[i * k + p] * l[j * k + p];
            }
            if i == j {
                if s <= 1e-12 {
                    return Err(i);
                }
                l[i * k + i] = s.sqrt();
            } else {
                l[i * k + j] = s / l[j * k + j];
            }
        }
    }
    Ok(l)
}

impl Correlation {
    /// Validate a k x k rank-correlation matrix given row-major.
    ///
    /// # Errors
    /// [`Error::Shape`] when `data.len() != k * k`; [`Error::InvalidArgument`] naming
    /// `correlation` with the (row, column) index when an entry lies outside [-1, 1], the
    /// diagonal is not 1, the matrix is not symmetric, or it is not positive definite.
    ///
    /// # Examples
    /// ```
    /// use stocktank::volumetrics::Correlation;
    /// assert!(Correlation::new(2, vec![1.0, -0.6, -0.6, 1.0]).is_ok());
    /// // Three inputs each correlated -0.9 with the others is impossible.
    /// let bad = vec![1.0, -0.9, -0.9, -0.9, 1.0, -0.9, -0.9, -0.9, 1.0];
    /// assert!(Correlation::new(3, bad).is_err());
    /// ```
    pub fn new(k: usize, data: Vec<f64>) -> Result<Self> {
        if data.len() != k * k {
            return Err(Error::Shape(format!(
                "`correlation` must be {k} x {k}, got {} values",
                data.len()
            )));
        }
        for i in 0..k {
            for j in 0..k {
                let v = data[i * k + j];
                let at = |e: Error| e.at_index(&[i, j]);
                if !(-1.0..=1.0).contains(&v) {
                    return Err(at(Error::invalid("correlation", v, "must lie in [-1, 1]")));
                }
                if i == j && v != 1.0 {
                    return Err(at(Error::invalid("correlation", v, "diagonal must be 1")));
                }
                if (v - data[j * k + i]).abs() > 1e-12 {
                    return Err(at(Error::invalid(
                        "correlation",
                        v,
                        "matrix must be symmetric",
                    )));
                }
            }
        }
        if let Err(row) = cholesky(k, &data) {
            return Err(Error::invalid(
                "correlation",
                data[row * k + row],
                "matrix is not positive definite (the correlations contradict each other)",
            )
            .at_index(&[row, row]));
        }
        Ok(Correlation { k, data })
    }

    /// Build the 7 x 7 matrix of [`Input::ALL`] from pairs, identity elsewhere.
    ///
    /// # Errors
    /// [`Error::InvalidArgument`] naming `correlation` for a pair of an input with itself,
    /// a coefficient outside [-1, 1], a pair given twice with different values, or a matrix
    /// that is not positive definite.
    ///
    /// # Examples
    /// ```
    /// use stocktank::volumetrics::{Correlation, Input};
    /// let c = Correlation::from_pairs(&[(Input::Porosity, Input::Sw, -0.6)]).unwrap();
    /// assert_eq!(c.get(4, 3), -0.6);
    /// ```
    pub fn from_pairs(pairs: &[(Input, Input, f64)]) -> Result<Self> {
        let k = Input::ALL.len();
        let mut data = vec![0.0; k * k];
        let mut set = vec![false; k * k];
        for i in 0..k {
            data[i * k + i] = 1.0;
        }
        for &(a, b, r) in pairs {
            let (i, j) = (a.index(), b.index());
            if i == j {
                return Err(Error::invalid(
                    "correlation",
                    r,
                    "an input cannot be paired with itself",
                )
                .at_index(&[i, j]));
            }
            if set[i * k + j] && data[i * k + j] != r {
                return Err(Error::invalid(
                    "correlation",
                    r,
                    "pair given twice with different values",
                )
                .at_index(&[i, j]));
            }
            data[i * k + j] = r;
            data[j * k + i] = r;
            set[i * k + j] = true;
            set[j * k + i] = true;
        }
        Self::new(k, data)
    }

    /// Entry (i, j).
    ///
    /// # Examples
    /// ```
    /// use stocktank::volumetrics::Correlation;
    /// assert_eq!(Correlation::new(1, vec![1.0]).unwrap().get(0, 0), 1.0);
    /// ```
    pub fn get(&self, i: usize, j: usize) -> f64 {
        self.data[i * self.k + j]
    }

    /// Size k of the k x k matrix.
    ///
    /// # Examples
    /// ```
    /// use stocktank::volumetrics::Correlation;
    /// assert_eq!(Correlation::new(1, vec![1.0]).unwrap().dim(), 1);
    /// ```
    pub fn dim(&self) -> usize {
        self.k
    }
}

/// A parallel sum over `0..n` whose result does not depend on the thread schedule: fixed
/// blocks summed in parallel, then the block sums added in order.
fn det_sum<F>(n: usize, f: F) -> f64
where
    F: Fn(std::ops::Range<usize>) -> f64 + Sync,
{
    let block = 1 << 15;
    let parts: Vec<f64> = (0..n.div_ceil(block))
        .into_par_iter()
        .map(|b| f(b * block..((b + 1) * block).min(n)))
        .collect();
    parts.iter().sum()
}

/// Order-preserving 64-bit key of an f64 (a bijection; NaN sorts last).
#[inline]
fn key64(x: f64) -> u64 {
    let b = x.to_bits();
    if b >> 63 == 1 { !b } else { b | (1 << 63) }
}

/// Order-preserving 32-bit key of an f64 through its nearest f32 (monotone: a <= b gives
/// key(a) <= key(b); values closer than f32 resolution share a key and are ordered by index).
#[inline]
fn key32(x: f64) -> u32 {
    let b = (x as f32).to_bits();
    if b >> 31 == 1 { !b } else { b | (1 << 31) }
}

#[inline]
fn from_key64(k: u64) -> f64 {
    f64::from_bits(if k >> 63 == 1 { k & !(1 << 63) } else { !k })
}

/// Uniform integer draws below a bound from 32-bit halves of the generator's words:
/// Lemire's (2019) multiply-shift with his rejection step, so every value is exactly equally
/// likely; two draws per 64-bit word.
struct Below32<'a> {
    rng: &'a mut Rng,
    word: u64,
    spare: bool,
}

impl<'a> Below32<'a> {
    fn new(rng: &'a mut Rng) -> Self {
        Below32 {
            rng,
            word: 0,
            spare: false,
        }
    }

    #[inline]
    fn bits(&mut self) -> u32 {
        if self.spare {
            self.spare = false;
            (self.word >> 32) as u32
        } else {
            self.word = self.rng.next_u64();
            self.spare = true;
            self.word as u32
        }
    }

    /// A uniform integer in `0..m`, 1 <= m <= 2^32 - 1.
    #[inline]
    fn below(&mut self, m: u32) -> u32 {
        let mut x = self.bits() as u64 * m as u64;
        if (x as u32) < m {
            let t = m.wrapping_neg() % m;
            while (x as u32) < t {
                x = self.bits() as u64 * m as u64;
            }
        }
        (x >> 32) as u32
    }
}

/// One uniformly random permutation applied to each of the `L` equally long slices, by the
/// scatter shuffle: each position goes to one of about n / 2048 buckets drawn uniformly at
/// random, then each bucket (small enough to stay in cache) is shuffled by Fisher–Yates
/// (Durstenfeld 1964). Index draws are exact (Lemire 2019, with rejection), so every
/// permutation is equally likely; unlike one Fisher–Yates pass over the whole array it
/// touches memory in a few sequential streams.
///
/// # References
/// Rao, C.R. (1961). Generation of random permutations of given number of elements using
/// random sampling numbers. Sankhya A 23, 305–307; Sandelius, M. (1962). A simple
/// randomization procedure. J. Royal Statistical Society B 24(2), 472–481 (from memory).
fn scatter_shuffle<const L: usize>(src: [&[f64]; L], rng: &mut Rng) -> [Vec<f64>; L] {
    let n = src.first().map_or(0, |s| s.len());
    let nb = bucket_count(n);
    let mut draw = Below32::new(rng);
    let b: Vec<u16> = (0..n).map(|_| draw.below(nb as u32) as u16).collect();
    let mut next = vec![0usize; nb];
    for &k in &b {
        next[k as usize] += 1;
    }
    let mut acc = 0;
    for e in next.iter_mut() {
        let c = *e;
        *e = acc;
        acc += c;
    }
    // Zeroed by the allocator (fresh pages), then every element is overwritten.
    let mut out: [Vec<f64>; L] = std::array::from_fn(|_| vec![0.0; n]);
    for (t, &k) in b.iter().enumerate() {
        let slot = &mut next[k as usize];
        for (o, s) in out.iter_mut().zip(&src) {
            o[*slot] = s[t];
        }
        *slot += 1;
    }
    let mut start = 0;
    for &stop in &next {
        for i in (1..stop - start).rev() {
            let j = draw.below(i as u32 + 1) as usize;
            for o in out.iter_mut() {
                o.swap(start + i, start + j);
            }
        }
        start = stop;
    }
    out
}

/// Number of buckets for [`scatter_shuffle`]: about 2048 items per bucket.
fn bucket_count(n: usize) -> usize {
    (n / 2048).clamp(1, u16::MAX as usize)
}

/// The packed words `key32 << 32 | index` of `x` in ascending order (an argsort by 32-bit
/// keys, ties by index, in the low 32 bits), sorted in the memory of `x`.
fn key_order_owned(x: Vec<f64>) -> Vec<u64> {
    let mut packed: Vec<u64> = x
        .into_iter()
        .enumerate()
        .map(|(i, v)| ((key32(v) as u64) << 32) | i as u64)
        .collect();
    // Scores are symmetric about 0: split there (one pass) so that two threads can sort
    // the halves of each column (any split is correct; this one is balanced).
    split_sort(&mut packed, (key32(0.0) as u64) << 32);
    packed
}

/// Sort `v`: partition around `pivot` (one pass), then sort the two sides in parallel.
fn split_sort(v: &mut [u64], pivot: u64) {
    if v.len() < 1 << 16 {
        v.sort_unstable();
        return;
    }
    let (mut i, mut j) = (0, v.len());
    loop {
        while i < j && v[i] < pivot {
            i += 1;
        }
        while i < j && v[j - 1] >= pivot {
            j -= 1;
        }
        if i >= j {
            break;
        }
        v.swap(i, j - 1);
        i += 1;
        j -= 1;
    }
    let (lo, hi) = v.split_at_mut(i);
    rayon::join(|| lo.sort_unstable(), || hi.sort_unstable());
}

/// Sort f64 values exactly (NaN last), through their order-preserving integer keys (which
/// reuse the vector's memory).
pub(crate) fn sort_values(x: Vec<f64>) -> Vec<f64> {
    let mut k: Vec<u64> = x.into_iter().map(key64).collect();
    k.sort_unstable();
    k.into_iter().map(from_key64).collect()
}

/// Spare vectors of n f64 handed from one step of a run to the next. Large vectors are
/// returned to the system when freed, and fresh pages cost a fault and a zeroing per 4 KiB
/// (measured: filling 16 MB of fresh memory took 3 to 10 times as long as a pass over warm
/// memory on the development machine), so a step that frees a column lends it to a later step. Contents are unspecified;
/// every taker overwrites all n values, so results do not depend on which vector it gets.
struct Pool {
    n: usize,
    free: std::sync::Mutex<Vec<Vec<f64>>>,
}

impl Pool {
    fn new(n: usize) -> Self {
        Pool {
            n,
            free: std::sync::Mutex::new(Vec::new()),
        }
    }

    /// A vector of length n (spare if any, else fresh).
    fn take(&self) -> Vec<f64> {
        let spare = self.free.lock().ok().and_then(|mut f| f.pop());
        spare.unwrap_or_else(|| vec![0.0; self.n])
    }

    /// Lend a vector back (kept only if it has length n).
    fn give(&self, v: Vec<f64>) {
        if v.len() == self.n {
            if let Ok(mut f) = self.free.lock() {
                f.push(v);
            }
        }
    }
}

/// Re-pair the columns in place so that their rank correlation approaches `target`
/// (Iman and Conover 1982). All columns must have the same length n >= 2.
///
/// # Arguments
/// * `columns` - the independent samples of each input (k columns of n trials).
/// * `target` - the k x k rank-correlation matrix.
/// * `seed` - seed of the score permutations.
///
/// # Errors
/// [`Error::Shape`] when the number of columns differs from the matrix size or the columns'
/// lengths differ; [`Error::Singular`] when the scores' correlation cannot be factored.
///
/// # Examples
/// ```
/// use stocktank::volumetrics::{iman_conover, Correlation, Distribution};
/// let mut cols = vec![
///     Distribution::uniform(0.0, 1.0).unwrap().sample(10_000, 1, 0),
///     Distribution::uniform(0.0, 1.0).unwrap().sample(10_000, 1, 1),
/// ];
/// let c = Correlation::new(2, vec![1.0, 0.7, 0.7, 1.0]).unwrap();
/// iman_conover(&mut cols, &c, 9).unwrap();
/// let r = stocktank::volumetrics::spearman(&cols[0], &cols[1]);
/// assert!((r - 0.7).abs() < 0.02);
/// ```
///
/// # References
/// Iman, R.L., Conover, W.J. (1982). Commun. Statist. Simula. Computa. 11(3), 311–334.
pub fn iman_conover(columns: &mut [Vec<f64>], target: &Correlation, seed: u64) -> Result<()> {
    let n = columns.first().map_or(0, |c| c.len());
    iman_conover_impl(columns, target, seed, false, 0, &Pool::new(n)).map(|_| ())
}

/// [`iman_conover`]; `presorted` promises that every column is already in ascending order.
/// Returns, for every column but the first, the rank (0-based, within the whole column) of
/// the samples of trials `0..keep_ranks` after the re-pairing (empty vectors when
/// `keep_ranks` is 0 and for the first column). Vectors it frees go to `pool`.
fn iman_conover_impl(
    columns: &mut [Vec<f64>],
    target: &Correlation,
    seed: u64,
    presorted: bool,
    keep_ranks: usize,
    pool: &Pool,
) -> Result<Vec<Vec<u32>>> {
    let k = columns.len();
    if k != target.k {
        return Err(Error::Shape(format!(
            "{} columns for a {} x {} `correlation`",
            k, target.k, target.k
        )));
    }
    if k == 0 {
        return Ok(Vec::new());
    }
    let n = columns[0].len();
    if columns.iter().any(|c| c.len() != n) {
        return Err(Error::Shape(
            "all columns must have the same number of trials".into(),
        ));
    }
    if n < 2 {
        return Ok(vec![Vec::new(); k]);
    }
    // Van der Waerden scores, then an independent random permutation per column.
    let mut base: Vec<f64> = (0..n)
        .into_par_iter()
        .map(|i| norm_ppf_fast((i + 1) as f64 / (n + 1) as f64))
        .collect();
    let sd = (base.iter().map(|x| x * x).sum::<f64>() / n as f64).sqrt();
    base.par_iter_mut().for_each(|x| *x /= sd);
    // Each column sorted (unless the caller promised it is).
    if !presorted {
        columns
            .par_iter_mut()
            .for_each(|col| *col = sort_values(std::mem::take(col)));
    }
    // One uniformly random permutation of the scores per column (scatter shuffle). Column
    // 0's transformed scores are a positive multiple of its own (M is lower triangular), so
    // its sorted samples simply travel with its scores through the same permutation: no
    // ranking for it.
    let col0 = std::mem::take(&mut columns[0]);
    let shuffled: Vec<(Vec<f64>, Option<Vec<f64>>)> = (0..k)
        .into_par_iter()
        .map(|j| {
            let mut rng = Rng::new(seed, 0x1C_0000 + j as u64, 0);
            if j == 0 {
                let [s, c] = scatter_shuffle([&base, &col0], &mut rng);
                (s, Some(c))
            } else {
                let [s] = scatter_shuffle([&base], &mut rng);
                (s, None)
            }
        })
        .collect();
    pool.give(base);
    pool.give(col0);
    let mut scores: Vec<Vec<f64>> = Vec::with_capacity(k);
    for (j, (s, c)) in shuffled.into_iter().enumerate() {
        scores.push(s);
        if let Some(c) = c {
            columns[j] = c;
        }
    }
    // Sample correlation T of the scores (unit variance, zero mean by symmetry): every pair's
    // products summed in one pass over the columns, in fixed blocks (as `det_sum`).
    let pairs: Vec<(usize, usize)> = (0..k).flat_map(|i| (0..i).map(move |j| (i, j))).collect();
    let block = 1 << 15;
    let parts: Vec<Vec<f64>> = (0..n.div_ceil(block))
        .into_par_iter()
        .map(|b| {
            let r = b * block..((b + 1) * block).min(n);
            let cs: Vec<&[f64]> = scores.iter().map(|c| &c[r.clone()]).collect();
            let mut acc = vec![0.0; pairs.len()];
            // `t` is the row: it indexes every column.
            #[allow(clippy::needless_range_loop)]
            for t in 0..r.len() {
                for (a, &(i, j)) in acc.iter_mut().zip(&pairs) {
                    *a += cs[i][t] * cs[j][t];
                }
            }
            acc
        })
        .collect();
    let mut t = vec![0.0; k * k];
    for i in 0..k {
        t[i * k + i] = 1.0;
    }
    for (p, &(i, j)) in pairs.iter().enumerate() {
        let c = parts.iter().map(|a| a[p]).sum::<f64>() / n as f64;
        t[i * k + j] = c;
        t[j * k + i] = c;
    }
    // Pearson target of the normal scores for the requested Spearman correlation.
    let adjusted: Vec<f64> = target
        .data
        .iter()
        .map(|&r| 2.0 * (std::f64::consts::PI * r / 6.0).sin())
        .collect();
    let p = cholesky(k, &adjusted)
        .or_else(|_| cholesky(k, &target.data))
        .map_err(|_| Error::Singular {
            what: "Iman–Conover",
            detail: "target correlation is not positive definite".into(),
        })?;
    let q = cholesky(k, &t).map_err(|_| Error::Singular {
        what: "Iman–Conover",
        detail: "sample correlation of the scores is not positive definite (too few trials)".into(),
    })?;
    // M = P Q^-1 (lower triangular): solve M Q = P row by row.
    let mut m = vec![0.0; k * k];
    for i in 0..k {
        for j in (0..=i).rev() {
            let mut s = p[i * k + j];
            for l in (j + 1)..=i {
                s -= m[i * k + l] * q[l * k + j];
            }
            m[i * k + j] = s / q[j * k + j];
        }
    }
    // S* = S M^T in place, one pass over the rows (in parallel blocks); within a row the
    // columns go from the highest down, as column j needs the scores of columns <= j.
    // Column 0 keeps its scores (see above).
    let mut blocks: Vec<Vec<&mut [f64]>> = (0..n.div_ceil(block)).map(|_| Vec::new()).collect();
    for col in scores.iter_mut() {
        for (b, piece) in col.chunks_mut(block).enumerate() {
            blocks[b].push(piece);
        }
    }
    blocks.into_par_iter().for_each(|mut cs| {
        for t in 0..cs[0].len() {
            for j in (1..k).rev() {
                let mj = &m[j * k..j * k + j + 1];
                let mut s = mj[j] * cs[j][t];
                for (l, &ml) in mj[..j].iter().enumerate() {
                    s += ml * cs[l][t];
                }
                cs[j][t] = s;
            }
        }
    });
    // Place each column's sorted samples in the rank order of its scores (column 0 is
    // placed already); the rank of each of the first `keep` trials is noted on the way. The
    // scores' memory holds the packed sort keys; the placed column takes a spare vector.
    let keep = keep_ranks.min(n);
    let s0 = scores.remove(0);
    pool.give(s0);
    let mut kept: Vec<Vec<u32>> = vec![Vec::new(); k];
    columns[1..]
        .par_iter_mut()
        .zip(scores.into_par_iter())
        .zip(kept[1..].par_iter_mut())
        .for_each(|((col, s), kept)| {
            let order = key_order_owned(s);
            let sorted = std::mem::replace(col, pool.take());
            if keep > 0 {
                kept.resize(keep, 0);
            }
            for (r, &p) in order.iter().enumerate() {
                let i = p as u32 as usize;
                col[i] = sorted[r];
                if i < keep {
                    kept[i] = r as u32;
                }
            }
            pool.give(sorted);
        });
    Ok(kept)
}

/// Spearman rank correlation of two equally long samples (ties ranked arbitrarily); NaN when
/// either sample is constant or shorter than 2.
///
/// # Examples
/// ```
/// use stocktank::volumetrics::spearman;
/// assert_eq!(spearman(&[1.0, 2.0, 3.0], &[10.0, 20.0, 35.0]), 1.0);
/// ```
///
/// # References
/// Spearman, C. (1904). The proof and measurement of association between two things.
/// American Journal of Psychology 15(1), 72–101.
pub fn spearman(a: &[f64], b: &[f64]) -> f64 {
    let n = a.len().min(b.len());
    if n < 2 {
        return f64::NAN;
    }
    rank_correlation(&ranks(&a[..n]), &ranks(&b[..n]))
}

/// Ranks 0..n of a sample (exact order; equal values ranked by position); empty when the
/// sample is constant.
fn ranks(x: &[f64]) -> Vec<f64> {
    if x.iter().all(|&v| v == x[0]) {
        return Vec::new();
    }
    let mut keyed: Vec<(u64, u32)> = x
        .iter()
        .enumerate()
        .map(|(i, &v)| (key64(v), i as u32))
        .collect();
    keyed.sort_unstable();
    let mut r = vec![0.0; x.len()];
    for (k, &(_, i)) in keyed.iter().enumerate() {
        r[i as usize] = k as f64;
    }
    r
}

/// Ranks 0..m of the first m trials among themselves, from their ranks `global` (distinct,
/// each < n) within all n trials: a bit per global rank, then each rank's position among the
/// set bits. The same order as ranking the m values again, in O(n / 64 + m).
fn ranks_from_global(global: &[u32], n: usize) -> Vec<f64> {
    let mut bits = vec![0u64; n.div_ceil(64)];
    for &g in global {
        bits[g as usize / 64] |= 1 << (g % 64);
    }
    let mut below = Vec::with_capacity(bits.len());
    let mut acc = 0u32;
    for &w in &bits {
        below.push(acc);
        acc += w.count_ones();
    }
    global
        .iter()
        .map(|&g| {
            let (w, b) = (g as usize / 64, g % 64);
            let under = bits[w] & ((1u64 << b) - 1);
            (below[w] + under.count_ones()) as f64
        })
        .collect()
}

/// Pearson correlation of two rank vectors of equal length (NaN if either is empty).
fn rank_correlation(ra: &[f64], rb: &[f64]) -> f64 {
    let n = ra.len();
    if n < 2 || rb.len() != n {
        return f64::NAN;
    }
    let mean = (n as f64 - 1.0) / 2.0;
    let (mut sab, mut saa, mut sbb) = (0.0, 0.0, 0.0);
    for i in 0..n {
        let (x, y) = (ra[i] - mean, rb[i] - mean);
        sab += x * y;
        saa += x * x;
        sbb += y * y;
    }
    sab / (saa * sbb).sqrt()
}

/// Percentiles of a sample, linear interpolation between order statistics (numpy "linear",
/// Hyndman and Fan 1996 definition 7). Reorders `data`.
///
/// # Arguments
/// * `data` - the sample (reordered in place); NaN values are not allowed.
/// * `q` - cumulative probabilities in [0, 1] (0.1 gives the P90, the LOW value).
///
/// # Errors
/// [`Error::InvalidArgument`] naming `q` outside [0, 1] or `data` when it is empty.
///
/// # Examples
/// ```
/// use stocktank::volumetrics::percentiles;
/// let mut x = vec![4.0, 1.0, 3.0, 2.0];
/// assert_eq!(percentiles(&mut x, &[0.5]).unwrap(), vec![2.5]);
/// ```
///
/// # References
/// Hyndman, R.J., Fan, Y. (1996). The American Statistician 50(4), 361–365.
pub fn percentiles(data: &mut [f64], q: &[f64]) -> Result<Vec<f64>> {
    let n = data.len();
    if n == 0 {
        return Err(Error::invalid("data", f64::NAN, "sample is empty"));
    }
    // The order statistics needed (lo and lo + 1 of each q), found by nested selection.
    let mut plan = Vec::with_capacity(q.len());
    let mut need = Vec::with_capacity(2 * q.len());
    for &p in q {
        crate::error::fraction("q", p)?;
        let h = (n - 1) as f64 * p;
        let lo = (h.floor() as usize).min(n - 1);
        let frac = h - lo as f64;
        need.push(lo);
        if frac > 0.0 && lo + 1 < n {
            need.push(lo + 1);
        }
        plan.push((lo, frac));
    }
    need.sort_unstable();
    need.dedup();
    let mut found = Vec::with_capacity(need.len());
    select_many(data, &need, 0, &mut found);
    found.sort_unstable_by_key(|&(i, _)| i);
    let at = |i: usize| found[found.binary_search_by_key(&i, |&(j, _)| j).unwrap_or(0)].1;
    Ok(plan
        .into_iter()
        .map(|(lo, frac)| {
            let a = at(lo);
            if frac > 0.0 && lo + 1 < n {
                a + frac * (at(lo + 1) - a)
            } else {
                a
            }
        })
        .collect())
}

/// The tornado's cumulative probabilities: P90 (low), P50, P10 (high).
const TORNADO_Q: [f64; 3] = [0.1, 0.5, 0.9];

/// Quantile `q` of an ascending, non-empty sample; the same interpolation as [`percentiles`].
fn quantile_sorted(sorted: &[f64], q: f64) -> f64 {
    let n = sorted.len();
    let h = (n - 1) as f64 * q;
    let lo = (h.floor() as usize).min(n - 1);
    let frac = h - lo as f64;
    let a = sorted[lo];
    if frac > 0.0 && lo + 1 < n {
        a + frac * (sorted[lo + 1] - a)
    } else {
        a
    }
}

/// Place the order statistics `idx` (sorted, unique, relative to `data`) by nested
/// selection; pushes `(offset + index, value)`.
fn select_many(data: &mut [f64], idx: &[usize], offset: usize, out: &mut Vec<(usize, f64)>) {
    if idx.is_empty() {
        return;
    }
    let mid = idx.len() / 2;
    let k = idx[mid];
    let (left, v, right) = data.select_nth_unstable_by(k, |x, y| x.total_cmp(y));
    out.push((offset + k, *v));
    select_many(left, &idx[..mid], offset, out);
    let shifted: Vec<usize> = idx[mid + 1..].iter().map(|&i| i - k - 1).collect();
    select_many(right, &shifted, offset + k + 1, out);
}

/// Summary of a probabilistic volume. **P90 is the low value** (exceeded with 90%
/// probability), P10 the high value.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Summary {
    /// Low estimate: exceeded with 90% probability (10th percentile).
    pub p90: f64,
    /// Median: exceeded with 50% probability.
    pub p50: f64,
    /// High estimate: exceeded with 10% probability (90th percentile).
    pub p10: f64,
    /// Sample mean.
    pub mean: f64,
    /// Sample standard deviation (n - 1 denominator).
    pub sd: f64,
    /// Number of trials.
    pub trials: usize,
}

/// Summarise a sample: P90 (low), P50, P10 (high), mean and standard deviation.
///
/// # Errors
/// [`Error::InvalidArgument`] naming `data` when it is empty or holds NaN.
///
/// # Examples
/// ```
/// use stocktank::volumetrics::summarize;
/// let s = summarize(&[1.0, 2.0, 3.0, 4.0, 5.0]).unwrap();
/// assert!(s.p90 < s.p50 && s.p50 < s.p10);
/// assert_eq!(s.p50, 3.0);
/// ```
pub fn summarize(data: &[f64]) -> Result<Summary> {
    summarize_with(data, &Pool::new(data.len()))
}

/// [`summarize`] with its scratch copy of `data` taken from (and returned to) `pool`.
fn summarize_with(data: &[f64], pool: &Pool) -> Result<Summary> {
    if let Some(i) = data.iter().position(|x| x.is_nan()) {
        return Err(Error::invalid("data", f64::NAN, "sample holds NaN").at_index(&[i]));
    }
    let n = data.len();
    let mut copy = pool.take();
    copy.copy_from_slice(data);
    let p = percentiles(&mut copy, &[0.1, 0.5, 0.9]);
    pool.give(copy);
    let p = p?;
    let mean = det_sum(n, |r| r.map(|t| data[t]).sum()) / n as f64;
    let var = if n > 1 {
        det_sum(n, |r| r.map(|t| (data[t] - mean) * (data[t] - mean)).sum()) / (n - 1) as f64
    } else {
        0.0
    };
    Ok(Summary {
        p90: p[0],
        p50: p[1],
        p10: p[2],
        mean,
        sd: var.sqrt(),
        trials: n,
    })
}

/// One row of a tornado (sensitivity) table.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct TornadoRow {
    /// The input.
    pub input: Input,
    /// The input's own P90 (low, 10th percentile) and P10 (high, 90th percentile) values.
    pub input_low: f64,
    /// See `input_low`.
    pub input_high: f64,
    /// Volume with this input at its low value and the others at their P50.
    pub volume_at_low: f64,
    /// Volume with this input at its high value and the others at their P50.
    pub volume_at_high: f64,
    /// |volume_at_high - volume_at_low|.
    pub swing: f64,
    /// Spearman rank correlation of the input with the volume over the trials.
    pub rank_correlation: f64,
}

/// The result of [`probabilistic_in_place`].
#[derive(Debug, Clone, PartialEq)]
pub struct InPlaceSimulation {
    /// In-place volume of every trial: STB (oil) or scf (gas).
    pub in_place: Vec<f64>,
    /// Recoverable volume of every trial (in place times recovery factor), if a recovery
    /// factor was given.
    pub recoverable: Option<Vec<f64>>,
    /// The sampled inputs, one column per [`Input`] in [`Input::ALL`] order (the recovery
    /// factor column is empty when none was given).
    pub inputs: Vec<Vec<f64>>,
    /// Summary of `in_place`.
    pub summary: Summary,
    /// Summary of `recoverable`.
    pub recoverable_summary: Option<Summary>,
    /// Sensitivity of the in-place volume, sorted by decreasing swing.
    pub tornado: Vec<TornadoRow>,
}

#[inline]
fn volume(fluid: Fluid, x: [f64; 6]) -> f64 {
    let [a, h, ntg, phi, sw, fvf] = x;
    let c = match fluid {
        Fluid::Oil => BBL_PER_ACRE_FT,
        Fluid::Gas => FT2_PER_ACRE,
    };
    c * a * h * ntg * phi * (1.0 - sw) / fvf
}

/// Monte Carlo oil or gas in place (and recoverable volume) with correlated inputs.
///
/// # Formula
/// ```text
/// oil (STB): N = 7758.37 A h NTG phi (1 - Sw) / Boi;   gas (scf): G = 43,560 A h NTG phi (1 - Sw) / Bgi
/// recoverable = in place * RF
/// ```
///
/// # Arguments
/// * `fluid` - [`Fluid::Oil`] or [`Fluid::Gas`].
/// * `inputs` - the input distributions (units in [`VolumetricInputs`]).
/// * `correlation` - optional 7 x 7 rank-correlation matrix over [`Input::ALL`]
///   (see [`Correlation::from_pairs`]).
/// * `trials` - number of trials, >= 2.
/// * `seed` - seed; the same seed gives the same result on every machine.
///
/// # Returns
/// The samples, their summary (P90 = low, P10 = high) and the tornado table.
///
/// # Errors
/// [`Error::InvalidArgument`] naming the input whose distribution reaches outside its
/// physical range (e.g. `porosity` outside [0, 1], negative `area`), naming `trials` when
/// < 2, or naming `correlation` when a fixed input is correlated.
///
/// # Examples
/// ```
/// use stocktank::volumetrics::{probabilistic_in_place, Distribution as D, Fluid, VolumetricInputs};
/// let inputs = VolumetricInputs {
///     area: D::triangular(800.0, 1000.0, 1400.0).unwrap(),
///     thickness: D::pert(20.0, 30.0, 45.0).unwrap(),
///     net_to_gross: D::fixed(0.8).unwrap(),
///     porosity: D::normal(0.2, 0.02, 0.0, 1.0).unwrap(),
///     sw: D::uniform(0.2, 0.35).unwrap(),
///     fvf: D::fixed(1.25).unwrap(),
///     recovery_factor: None,
/// };
/// let sim = probabilistic_in_place(Fluid::Oil, &inputs, None, 20_000, 1).unwrap();
/// assert!(sim.summary.p90 < sim.summary.p50 && sim.summary.p50 < sim.summary.p10);
/// ```
///
/// # References
/// Iman and Conover (1982); Murtha (1994); Craft and Hawkins (1959), ch. 1.
pub fn probabilistic_in_place(
    fluid: Fluid,
    inputs: &VolumetricInputs,
    correlation: Option<&Correlation>,
    trials: usize,
    seed: u64,
) -> Result<InPlaceSimulation> {
    if trials < 2 {
        return Err(Error::invalid("trials", trials as f64, "must be >= 2"));
    }
    inputs.validate()?;
    let k = Input::ALL.len();
    if let Some(c) = correlation {
        if c.k != k {
            return Err(Error::Shape(format!(
                "`correlation` must be {k} x {k}, got {0} x {0}",
                c.k
            )));
        }
    }
    // Inputs that take part in a correlation.
    let active: Vec<usize> = match correlation {
        Some(c) => (0..k)
            .filter(|&i| (0..k).any(|j| j != i && c.get(i, j) != 0.0))
            .collect(),
        None => Vec::new(),
    };
    for &i in &active {
        match inputs.get(Input::ALL[i]) {
            None => {
                return Err(Error::invalid(
                    "correlation",
                    f64::NAN,
                    "recovery_factor is correlated but no recovery_factor distribution was given",
                ));
            }
            Some(Distribution::Fixed { value }) => {
                return Err(Error::invalid(
                    "correlation",
                    *value,
                    "a fixed input cannot be correlated",
                )
                .at_index(&[i]));
            }
            _ => {}
        }
    }
    // Sample every input (an absent recovery factor stays empty); correlated inputs are
    // drawn in ascending order, ready for the Iman–Conover placement.
    let mut cols: Vec<Vec<f64>> = Input::ALL
        .par_iter()
        .map(|&i| match inputs.get(i) {
            Some(d) if active.contains(&i.index()) => {
                d.sample_sorted(trials, seed, i.index() as u64)
            }
            Some(d) => d.sample(trials, seed, i.index() as u64),
            None => Vec::new(),
        })
        .collect();
    // Percentiles of the sorted (correlated) columns, before their re-pairing.
    let sorted_qs: Vec<Option<[f64; 3]>> = (0..6)
        .map(|j| {
            active
                .contains(&j)
                .then(|| TORNADO_Q.map(|q| quantile_sorted(&cols[j], q)))
        })
        .collect();
    // Correlate the inputs that take part in a correlation; keep the ranks of the tornado's
    // first `n_rank` trials that the re-pairing finds anyway.
    let n_rank = trials.min(200_000);
    let pool = Pool::new(trials);
    let mut known_ranks: Vec<Vec<u32>> = vec![Vec::new(); k];
    if let Some(c) = correlation {
        if !active.is_empty() {
            let m = active.len();
            let mut sub = vec![0.0; m * m];
            for (a, &i) in active.iter().enumerate() {
                for (b, &j) in active.iter().enumerate() {
                    sub[a * m + b] = c.get(i, j);
                }
            }
            let sub = Correlation::new(m, sub)?;
            let mut taken: Vec<Vec<f64>> = active
                .iter()
                .map(|&i| std::mem::take(&mut cols[i]))
                .collect();
            let kept =
                iman_conover_impl(&mut taken, &sub, seed ^ 0x005E_ED1C, true, n_rank, &pool)?;
            for ((&i, col), kept) in active.iter().zip(taken).zip(kept) {
                cols[i] = col;
                known_ranks[i] = kept;
            }
        }
    }
    let mut in_place = pool.take();
    in_place
        .par_iter_mut()
        .enumerate()
        .for_each(|(t, v)| *v = volume(fluid, std::array::from_fn(|j| cols[j][t])));
    let recoverable = inputs.recovery_factor.map(|_| {
        let mut r = pool.take();
        r.par_iter_mut()
            .zip(in_place.par_iter())
            .zip(cols[Input::RecoveryFactor.index()].par_iter())
            .for_each(|((r, v), rf)| *r = v * rf);
        r
    });
    // The summaries and the tornado's rank correlations side by side.
    let (summaries, rank_corr) = rayon::join(
        || -> Result<(Summary, Option<Summary>)> {
            let summary = summarize_with(&in_place, &pool)?;
            let recoverable_summary = match &recoverable {
                Some(r) => Some(summarize_with(r, &pool)?),
                None => None,
            };
            Ok((summary, recoverable_summary))
        },
        || {
            // Spearman of each input with the volume over the first `n_rank` trials: the
            // volume is ranked once; a correlated input's ranks follow from those of its
            // re-pairing.
            let vol_ranks = ranks(&in_place[..n_rank]);
            (0..6)
                .into_par_iter()
                .map(|j| {
                    let x = &cols[j][..n_rank];
                    let r = if known_ranks[j].len() == n_rank && x.iter().any(|&v| v != x[0]) {
                        ranks_from_global(&known_ranks[j], trials)
                    } else {
                        ranks(x)
                    };
                    rank_correlation(&r, &vol_ranks)
                })
                .collect::<Vec<f64>>()
        },
    );
    let (summary, recoverable_summary) = summaries?;
    // Tornado: each input at its P90/P10, the others at their P50 (the correlated inputs'
    // percentiles were read from their sorted samples before the re-pairing).
    let qs: Vec<[f64; 3]> = cols[..6]
        .par_iter()
        .enumerate()
        .map(|(j, c)| {
            if let Some(q) = sorted_qs[j] {
                return q;
            }
            let mut copy = c.clone();
            let p = percentiles(&mut copy, &TORNADO_Q).unwrap_or_else(|_| vec![f64::NAN; 3]);
            [p[0], p[1], p[2]]
        })
        .collect();
    let mut tornado: Vec<TornadoRow> = (0..6)
        .map(|j| {
            let at = |v: f64| {
                volume(
                    fluid,
                    std::array::from_fn(|l| if l == j { v } else { qs[l][1] }),
                )
            };
            let (lo, hi) = (qs[j][0], qs[j][2]);
            let (vl, vh) = (at(lo), at(hi));
            TornadoRow {
                input: Input::ALL[j],
                input_low: lo,
                input_high: hi,
                volume_at_low: vl,
                volume_at_high: vh,
                swing: (vh - vl).abs(),
                rank_correlation: rank_corr[j],
            }
        })
        .collect();
    tornado.sort_by(|a, b| b.swing.total_cmp(&a.swing));
    Ok(InPlaceSimulation {
        in_place,
        recoverable,
        inputs: cols,
        summary,
        recoverable_summary,
        tornado,
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Samples that stress the bucket estimate: heavy tails, ties, infinities, signed zeros.
    fn awkward(n: usize, seed: u64) -> Vec<Vec<f64>> {
        let mut rng = Rng::new(seed, 0, 0);
        let u: Vec<f64> = (0..n).map(|_| rng.uniform()).collect();
        vec![
            u.iter().map(|&v| norm_ppf_fast(v)).collect(),
            u.iter().map(|&v| (8.0 * norm_ppf_fast(v)).exp()).collect(),
            u.iter().map(|&v| (v * 7.0).floor()).collect(),
            u.iter()
                .enumerate()
                .map(|(i, &v)| match i % 97 {
                    0 => f64::INFINITY,
                    1 => f64::NEG_INFINITY,
                    2 => -0.0,
                    3 => 0.0,
                    _ => v - 0.5,
                })
                .collect(),
            vec![3.5; n],
            u.iter().map(|&v| 1e-300 * v).collect(),
        ]
    }

    #[test]
    fn sort_values_matches_std_sort() {
        for n in [0, 1, 2, 5, 3000, 70_000] {
            for x in awkward(n, n as u64) {
                let mut want = x.clone();
                want.sort_by(|a, b| a.total_cmp(b));
                let got = sort_values(x.clone());
                assert!(
                    got.iter()
                        .zip(&want)
                        .all(|(a, b)| a.to_bits() == b.to_bits())
                );
                assert_eq!(got.len(), n);
            }
        }
    }

    #[test]
    fn key_order_matches_std_argsort() {
        for n in [1, 2, 5, 3000, 70_000] {
            for x in awkward(n, 7 + n as u64) {
                let mut want: Vec<u32> = (0..n as u32).collect();
                want.sort_by_key(|&i| (key32(x[i as usize]), i));
                let got: Vec<u32> = key_order_owned(x).into_iter().map(|p| p as u32).collect();
                assert_eq!(got, want);
            }
        }
    }

    #[test]
    fn ranks_from_global_match_ranking_again() {
        // Ranks of the first m of n distinct values, from their ranks among all n.
        for (n, m) in [(2, 1), (64, 64), (65, 10), (70_000, 30_000)] {
            let mut rng = Rng::new(n as u64, 3, 0);
            let x: Vec<f64> = (0..n).map(|_| rng.uniform()).collect();
            let all = ranks(&x);
            let global: Vec<u32> = all[..m].iter().map(|&r| r as u32).collect();
            let want = if m > 1 { ranks(&x[..m]) } else { vec![0.0] };
            assert_eq!(ranks_from_global(&global, n), want);
        }
    }

    #[test]
    fn split_sort_sorts() {
        for n in [0, 5, 70_000, 200_000] {
            let mut rng = Rng::new(n as u64, 4, 0);
            let v: Vec<u64> = (0..n).map(|_| rng.next_u64() >> (n % 7)).collect();
            for pivot in [0, 1 << 62, 1 << 63, u64::MAX] {
                let mut got = v.clone();
                split_sort(&mut got, pivot);
                let mut want = v.clone();
                want.sort_unstable();
                assert_eq!(got, want);
            }
        }
    }

    #[test]
    fn scatter_shuffle_is_a_uniform_permutation() {
        // A permutation, and item 0 lands uniformly over 8 slices of the positions
        // (chi-square with 7 degrees of freedom; 24.3 is its 0.999 quantile, scipy.stats.chi2).
        let n = 10_000;
        let mut hits = [0usize; 8];
        let items: Vec<f64> = (0..n).map(|i| i as f64).collect();
        let twice: Vec<f64> = items.iter().map(|v| 2.0 * v).collect();
        for s in 0..2000 {
            let mut rng = Rng::new(s, 1, 0);
            let [p, p2] = scatter_shuffle([&items, &twice], &mut rng);
            if s == 0 {
                // The same permutation of both slices.
                assert!(p.iter().zip(&p2).all(|(a, b)| 2.0 * a == *b));
                let mut q = p.clone();
                q.sort_by(f64::total_cmp);
                assert_eq!(q, items);
            }
            let at = p.iter().position(|&v| v == 0.0).unwrap();
            hits[at * 8 / n] += 1;
        }
        let e = 2000.0 / 8.0;
        let chi2: f64 = hits.iter().map(|&h| (h as f64 - e).powi(2) / e).sum();
        assert!(chi2 < 24.3, "{hits:?}");
    }
}
