//! Worker threads of the batch paths, under the caller's control.
//!
//! Large batches ([`crate::friction::darcy_factor_batch`] and
//! [`crate::Line::system_curve`]) can spread their points over worker threads. The
//! threads belong to a pool of hydrograde's own (never the process-wide rayon pool), so
//! an embedding program that runs its own threads decides how many hydrograde adds:
//!
//! - [`set_threads`]`(n)` sets the number of threads a batch may use (1 ≤ n ≤
//!   [`MAX_THREADS`]); [`threads`] reads it.
//! - The default is read once, at the first use, from the environment variable
//!   `HYDROGRADE_THREADS` (a whole number ≥ 1); when it is unset or not a valid number,
//!   the default is the number of cores the system reports.
//! - With 1 thread no thread is ever started: batches run on the calling thread.
//!
//! The results are the same bit for bit whatever the number of threads. Calls from
//! several threads at once are safe; a batch that is running when the setting changes
//! finishes on the pool it started on.

use crate::error::{Error, Result};
use std::sync::atomic::{AtomicUsize, Ordering};
use std::sync::{Arc, Mutex, MutexGuard};

/// The largest number of threads [`set_threads`] accepts.
pub const MAX_THREADS: usize = 1024;

/// The name of the environment variable that gives the default number of threads.
pub const THREADS_ENV: &str = "HYDROGRADE_THREADS";

/// The current setting; 0 until it is first read from the environment.
static THREADS: AtomicUsize = AtomicUsize::new(0);

/// The pool, built at the first parallel batch after each change of the setting.
static POOL: Mutex<Option<Arc<rayon::ThreadPool>>> = Mutex::new(None);

fn pool_slot() -> MutexGuard<'static, Option<Arc<rayon::ThreadPool>>> {
    // A panic while the lock was held leaves nothing half-written (the slot holds a
    // whole pool or none), so a poisoned lock is still good to use.
    POOL.lock().unwrap_or_else(|e| e.into_inner())
}

/// The default from `HYDROGRADE_THREADS`, else the number of cores.
fn default_threads() -> usize {
    std::env::var(THREADS_ENV)
        .ok()
        .and_then(|s| s.trim().parse::<usize>().ok())
        .filter(|n| (1..=MAX_THREADS).contains(n))
        .unwrap_or_else(|| {
            std::thread::available_parallelism()
                .map_or(1, |n| n.get())
                .min(MAX_THREADS)
        })
}

/// The number of threads a batch may use (≥ 1). Thread-safe.
pub fn threads() -> usize {
    match THREADS.load(Ordering::Acquire) {
        0 => {
            let n = default_threads();
            // Another thread may have set it meanwhile; its value wins.
            match THREADS.compare_exchange(0, n, Ordering::AcqRel, Ordering::Acquire) {
                Ok(_) => n,
                Err(current) => current,
            }
        }
        n => n,
    }
}

/// Sets the number of threads a batch may use: 1 runs every batch on the calling thread
/// and never starts a thread. The pool of the previous setting is let go (its threads
/// end once the batches running on it are done). Thread-safe.
///
/// # Errors
/// [`Error::OutOfRange`] when `n` is 0 or above [`MAX_THREADS`].
pub fn set_threads(n: usize) -> Result<()> {
    if !(1..=MAX_THREADS).contains(&n) {
        return Err(Error::out_of_range(
            "threads",
            n as f64,
            format!("must lie between 1 and {MAX_THREADS}"),
        ));
    }
    let mut slot = pool_slot();
    if THREADS.swap(n, Ordering::AcqRel) != n {
        *slot = None;
    }
    Ok(())
}

/// The pool for the current setting, built on first use; `None` with one thread or when
/// the system refuses to start threads (the batch then runs serially, same result).
fn pool() -> Option<Arc<rayon::ThreadPool>> {
    let n = threads();
    if n <= 1 {
        return None;
    }
    let mut slot = pool_slot();
    if let Some(p) = slot.as_ref() {
        if p.current_num_threads() == n {
            return Some(Arc::clone(p));
        }
    }
    let built = rayon::ThreadPoolBuilder::new()
        .num_threads(n)
        .thread_name(|i| format!("hydrograde-{i}"))
        .build()
        .ok()
        .map(Arc::new);
    slot.clone_from(&built);
    built
}

/// Runs `op` inside hydrograde's pool and returns its result, or returns `None` without
/// running it when only one thread is allowed (the caller then does the work serially,
/// on its own thread). Rayon calls inside `op` use hydrograde's pool, never the
/// process-wide one.
pub fn in_pool<R: Send>(op: impl FnOnce() -> R + Send) -> Option<R> {
    pool().map(|p| p.install(op))
}

#[cfg(test)]
mod tests {
    use super::*;
    use rayon::prelude::*;

    // One test changes the process-wide setting, so the checks run in sequence in it.
    #[test]
    fn setting_bounds_and_dispatch() {
        for bad in [0, MAX_THREADS + 1, usize::MAX] {
            let e = set_threads(bad).unwrap_err();
            assert_eq!(e.kind(), crate::ErrorKind::OutOfRange);
            assert!(e.to_string().starts_with("threads = "), "{e}");
        }
        assert!(threads() >= 1);

        set_threads(1).unwrap();
        assert_eq!(threads(), 1);
        assert!(pool().is_none(), "one thread must not build a pool");
        let caller = std::thread::current().id();
        assert_eq!(in_pool(|| std::thread::current().id()), None);
        let _ = caller;

        set_threads(3).unwrap();
        assert_eq!(threads(), 3);
        let workers = in_pool(rayon::current_num_threads);
        assert_eq!(
            workers,
            Some(3),
            "rayon calls inside run on the core's own pool"
        );
        let on = in_pool(|| std::thread::current().id());
        assert!(
            on.is_some_and(|id| id != caller),
            "the work runs on a worker"
        );
        let sum: Option<u64> = in_pool(|| (0..1000u64).into_par_iter().sum());
        assert_eq!(sum, Some(499_500));
        set_threads(1).unwrap();
    }
}
