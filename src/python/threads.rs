//! The threads of stocktank's parallel loops, seen from Python: the count the user chose
//! (`set_num_threads`), and thread pools that survive `fork`.
//!
//! Every binding whose work may use threads releases the GIL through [`detach`], which runs
//! the work inside a pool of this module, never in rayon's global pool: elementwise array
//! functions from the parallel threshold up (`detach_elementwise` in the parent module),
//! many-well tables, Monte Carlo, decline fits and forecasts, batch history matches,
//! pseudo-pressure. Work that never uses threads (a single table, a material-balance fit or
//! forecast, fractional flow, small elementwise inputs) stays on the calling thread, because
//! waking a pool thread costs about 50 µs here, ten times a single 50-row table (5.5 µs).
//! A process forked after a parallel call (as
//! Python's `multiprocessing` does by default on Linux) inherits a pool's bookkeeping but not
//! its threads, so work handed to an inherited pool would wait forever. The pools are
//! therefore kept with the id of the process that made them, and a forked child makes its
//! own; the chosen count is inherited.

use super::Error;
use pyo3::prelude::*;
use rayon::{ThreadPool, ThreadPoolBuilder};
use std::sync::{Arc, Mutex, MutexGuard};

/// The chosen thread count and the pools made for it.
struct Pools {
    /// The process that made `made` (0 before the first pool).
    pid: u32,
    /// The count set by `set_num_threads` (`None`: the default, [`default_threads`]).
    chosen: Option<usize>,
    /// The pools made in process `pid`, one per thread count, kept so that switching counts
    /// (a `with num_threads(1):` block in a loop) does not start threads every time.
    made: Vec<Arc<ThreadPool>>,
}

static POOLS: Mutex<Pools> = Mutex::new(Pools {
    pid: 0,
    chosen: None,
    made: Vec::new(),
});

/// The state; a poisoned lock still holds a consistent value (every update is a single
/// assignment or push), so it is used as is.
fn pools() -> MutexGuard<'static, Pools> {
    POOLS.lock().unwrap_or_else(|e| e.into_inner())
}

/// The default count, chosen as rayon chooses it for its global pool: `RAYON_NUM_THREADS`
/// when it is a whole number > 0, else one thread per available core.
fn default_threads() -> usize {
    std::env::var("RAYON_NUM_THREADS")
        .ok()
        .and_then(|v| v.trim().parse::<usize>().ok())
        .filter(|&k| k > 0)
        .unwrap_or_else(|| std::thread::available_parallelism().map_or(1, |n| n.get()))
}

impl Pools {
    /// The thread count in force.
    fn threads(&self) -> usize {
        self.chosen.unwrap_or_else(default_threads)
    }

    /// A pool of `k` threads made in this process: one made before, or a new one.
    fn pool(&mut self, k: usize) -> PyResult<Arc<ThreadPool>> {
        let pid = std::process::id();
        if self.pid != pid {
            // A forked child (or the first call): the pools' threads are in the parent.
            // Dropping a pool would signal threads that do not exist here, so the inherited
            // ones are forgotten (a small, one-off leak per fork).
            for p in self.made.drain(..) {
                std::mem::forget(p);
            }
            self.pid = pid;
        }
        if let Some(p) = self.made.iter().find(|p| p.current_num_threads() == k) {
            return Ok(p.clone());
        }
        let p = Arc::new(
            ThreadPoolBuilder::new()
                .num_threads(k)
                .thread_name(|i| format!("stocktank-{i}"))
                .build()
                .map_err(|e| {
                    pyo3::exceptions::PyRuntimeError::new_err(format!(
                        "could not start {k} threads: {e}"
                    ))
                })?,
        );
        self.made.push(p.clone());
        Ok(p)
    }
}

/// Release the GIL and run `f` inside this process's pool of the chosen thread count (every
/// parallel loop of the core then runs on that pool's threads). Should no pool start (the
/// system refuses threads), `f` runs as it would without this module.
pub(crate) fn detach<T, F>(py: Python<'_>, f: F) -> T
where
    F: FnOnce() -> T + Send,
    T: Send,
{
    let pool = {
        let mut s = pools();
        let k = s.threads();
        s.pool(k).ok()
    };
    py.detach(move || match pool {
        Some(p) => p.install(f),
        None => f(),
    })
}

/// Set the number of threads stocktank's parallel loops use, for the whole process;
/// `None` goes back to the default (the `RAYON_NUM_THREADS` environment variable, else
/// one thread per core). Returns the previous setting (`None` for the default). A process
/// forked later keeps the setting and starts its own threads.
#[pyfunction]
#[pyo3(signature = (n))]
fn set_num_threads(n: Option<i64>) -> PyResult<Option<usize>> {
    let chosen = match n {
        None => None,
        Some(k) if k >= 1 => Some(usize::try_from(k).unwrap_or(usize::MAX)),
        Some(k) => {
            return Err(
                Error::invalid("n", k as f64, "must be a whole number >= 1, or None").into(),
            );
        }
    };
    let mut s = pools();
    // Start the threads now, so that a refusal is reported here.
    if let Some(k) = chosen {
        s.pool(k)?;
    }
    Ok(std::mem::replace(&mut s.chosen, chosen))
}

/// The number of threads stocktank's parallel loops use now.
#[pyfunction]
fn get_num_threads() -> usize {
    pools().threads()
}

pub(super) fn register(m: &Bound<'_, PyModule>) -> PyResult<()> {
    m.add_function(wrap_pyfunction!(set_num_threads, m)?)?;
    m.add_function(wrap_pyfunction!(get_num_threads, m)?)?;
    Ok(())
}
