//! Python bindings of hydrograde (module `hydrograde._native`).
//!
//! Thin by design: each wrapper holds a core value and delegates to it. This crate
//! converts types, maps errors, releases the GIL, broadcasts arrays and formats; no
//! formula, table or default value lives here. Files mirror the core's module names.

mod arrays;
mod errors;
mod friction;
mod state;

use hydrograde::warning::Warnings;
use pyo3::prelude::*;

#[pymodule]
fn _native(m: &Bound<'_, PyModule>) -> PyResult<()> {
    let py = m.py();
    m.add("__version__", hydrograde::VERSION)?;
    m.add("ERROR_KINDS", errors::kinds_list(py)?)?;
    let warning_names: Vec<&str> = Warnings::ALL.iter().map(|(_, n)| *n).collect();
    m.add("WARNING_NAMES", warning_names)?;

    // friction
    m.add_function(wrap_pyfunction!(friction::darcy_factor, m)?)?;
    m.add_function(wrap_pyfunction!(friction::friction, m)?)?;
    m.add_function(wrap_pyfunction!(friction::correlations, m)?)?;
    m.add_function(wrap_pyfunction!(friction::correlation_validity, m)?)?;
    m.add_class::<friction::PyFriction>()?;
    Ok(())
}
