//! Python bindings of hydrograde (module `hydrograde._native`).

use pyo3::prelude::*;

#[pymodule]
fn _native(m: &Bound<'_, PyModule>) -> PyResult<()> {
    m.add("__version__", hydrograde::VERSION)?;
    Ok(())
}
