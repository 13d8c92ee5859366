//! Core errors as Python exceptions.
//!
//! The exception classes live in `hydrograde/_errors.py` (they need two bases:
//! `HydrogradeError` and, for bad values, `ValueError`). `BY_KIND` there maps each core
//! [`ErrorKind::name`] to its class; a test compares it with [`ErrorKind::ALL`].

use hydrograde::error::{Error, ErrorKind};
use pyo3::exceptions::PyRuntimeError;
use pyo3::prelude::*;
use pyo3::sync::PyOnceLock;
use pyo3::types::{PyDict, PyList};

static BY_KIND: PyOnceLock<Py<PyDict>> = PyOnceLock::new();

/// The stable names of every core error kind, in the core's order.
pub fn kind_names() -> Vec<&'static str> {
    ErrorKind::ALL.iter().map(|k| k.name()).collect()
}

/// Converts a core error into the Python exception of its kind, carrying the core's
/// message and its structured fields (`kind`, `parameter`, `value`, `index`).
pub fn to_py(err: Error) -> PyErr {
    Python::attach(|py| build(py, &err).unwrap_or_else(|e| e))
}

fn build(py: Python<'_>, err: &Error) -> PyResult<PyErr> {
    let table = BY_KIND.import(py, "hydrograde._errors", "BY_KIND")?;
    let Some(cls) = table.get_item(err.kind().name())? else {
        return Err(PyRuntimeError::new_err(format!(
            "hydrograde._errors.BY_KIND has no class for the core error kind '{}': {err}",
            err.kind().name()
        )));
    };
    let kwargs = PyDict::new(py);
    let (index, inner) = match err {
        Error::AtIndex { index, source } => (Some(*index), source.as_ref()),
        other => (None, other),
    };
    kwargs.set_item("index", index)?;
    let (parameter, value) = match inner {
        Error::NotFinite { name, value } => (Some(*name), Some(*value)),
        Error::OutOfRange { name, value, .. } => (Some(*name), Some(*value)),
        Error::Invalid { name, .. } => (Some(*name), None),
        _ => (None, None),
    };
    kwargs.set_item("parameter", parameter)?;
    kwargs.set_item("value", value)?;
    let exc = cls.call((err.to_string(),), Some(&kwargs))?;
    Ok(PyErr::from_value(exc))
}

/// `_native.ERROR_KINDS`: the core's error kinds as a list of names.
pub fn kinds_list(py: Python<'_>) -> PyResult<Bound<'_, PyList>> {
    PyList::new(py, kind_names())
}

/// Maps a core result into a Python result.
pub trait CoreResult<T> {
    /// The value, or the core error as its Python exception.
    fn py(self) -> PyResult<T>;
}

impl<T> CoreResult<T> for hydrograde::Result<T> {
    fn py(self) -> PyResult<T> {
        self.map_err(to_py)
    }
}

/// A whole-number argument as `usize`. A negative or too large Python int becomes the
/// core's out-of-range error naming `name` (never a bare `OverflowError`); anything that
/// is not an int is a `TypeError`.
pub fn whole_number(name: &'static str, obj: &Bound<'_, PyAny>) -> PyResult<usize> {
    if let Ok(n) = obj.extract::<usize>() {
        return Ok(n);
    }
    if !obj.is_instance_of::<pyo3::types::PyInt>() {
        return Err(pyo3::exceptions::PyTypeError::new_err(format!(
            "{name} must be an int, not {}",
            obj.get_type().name()?
        )));
    }
    // A Python int too large for a double converts to infinity, which the message shows.
    let value = obj.extract::<f64>().unwrap_or(f64::INFINITY);
    let rule = if obj.lt(0)? {
        "must not be negative".to_string()
    } else {
        format!("must be at most {}", usize::MAX)
    };
    Err(to_py(Error::out_of_range(name, value, rule)))
}
