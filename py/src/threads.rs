//! The number of worker threads of the batch paths (the core's own pool).

use crate::errors::{CoreResult, whole_number};
use pyo3::prelude::*;

/// Sets the number of threads array calls and system curves may use (1 to 1024). With 1
/// no thread is ever started: everything runs on the calling thread. The default comes
/// from the environment variable ``HYDROGRADE_THREADS``, else the number of cores.
/// Results are the same bit for bit whatever the setting.
#[pyfunction]
pub fn set_threads(n: &Bound<'_, PyAny>) -> PyResult<()> {
    hydrograde::set_threads(whole_number("threads", n)?).py()
}

/// The number of threads array calls and system curves may use.
#[pyfunction]
pub fn threads() -> usize {
    hydrograde::threads()
}
