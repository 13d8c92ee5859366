//! The number of worker threads of the batch paths (the library's own pool).

use crate::ffi::{guard, guard_value};

/// The largest number of threads `hg_set_threads` accepts.
pub const HG_MAX_THREADS: usize = 1024;
// The header needs a literal; the build stops if it drifts from the core's limit.
const _: () = assert!(HG_MAX_THREADS == hydrograde::threads::MAX_THREADS);

/// Sets the number of threads the batch calls (`hg_darcy_factor_batch`,
/// `hg_line_system_curve`) may use, 1 to `HG_MAX_THREADS`. With 1 the library never
/// starts a thread: every call runs on the caller's thread (the setting for an embedding
/// program that runs its own threads, and for valgrind). The default is read once, at the
/// first batch, from the environment variable `HYDROGRADE_THREADS` (a whole number ≥ 1),
/// else it is the number of cores. The threads belong to the library's own pool; results
/// are the same bit for bit whatever the setting.
///
/// Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for 0 or more than `HG_MAX_THREADS` (the
/// setting is then unchanged). Thread-safe: a batch running when the setting changes
/// finishes with the threads it started with.
#[unsafe(no_mangle)]
pub extern "C" fn hg_set_threads(n: usize) -> i32 {
    guard(|| Ok(hydrograde::set_threads(n)?))
}

/// The number of threads the batch calls may use (≥ 1); see `hg_set_threads`.
/// Thread-safe.
#[unsafe(no_mangle)]
pub extern "C" fn hg_threads() -> usize {
    guard_value(1, hydrograde::threads)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::ffi::{HG_ERR_OUT_OF_RANGE, HG_OK};

    #[test]
    fn bad_counts_are_refused_and_leave_the_setting() {
        assert_eq!(hg_set_threads(2), HG_OK);
        assert_eq!(hg_set_threads(0), HG_ERR_OUT_OF_RANGE);
        assert_eq!(hg_set_threads(HG_MAX_THREADS + 1), HG_ERR_OUT_OF_RANGE);
        assert_eq!(hg_threads(), 2);
        assert_eq!(hg_set_threads(1), HG_OK);
        assert_eq!(hg_threads(), 1);
    }
}
