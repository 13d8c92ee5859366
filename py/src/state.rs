//! Pickling and notebook rendering shared by every class.
//!
//! Pickling goes through one serde serialisation of the core value, so a wrapper's state
//! is exactly its core value and nothing hand-written. The format is MessagePack
//! (rmp-serde): self-describing like JSON (the core's internally tagged enums need
//! that) but it keeps every f64 bit for bit, NaN included (results hold NaN where a
//! field does not apply, e.g. the velocity of a rise), which JSON cannot.

use hydrograde::line::Tag;
use pyo3::exceptions::PyValueError;
use pyo3::prelude::*;
use pyo3::sync::PyOnceLock;
use pyo3::types::{PyBytes, PyDict};
use serde::Serialize;
use serde::de::DeserializeOwned;

/// The serde (MessagePack) bytes of a core value.
pub fn dumps<'py, T: Serialize>(py: Python<'py>, value: &T) -> PyResult<Bound<'py, PyBytes>> {
    let bytes = rmp_serde::to_vec_named(value)
        .map_err(|e| PyValueError::new_err(format!("cannot serialise: {e}")))?;
    Ok(PyBytes::new(py, &bytes))
}

/// A core value back from its serde (MessagePack) bytes. The core's types run their
/// constructors' checks while deserialising, so tampered or truncated bytes give an
/// `InvalidInputError` (a `HydrogradeError`), never a value that breaks a rule.
pub fn loads<T: DeserializeOwned>(bytes: &[u8]) -> PyResult<T> {
    rmp_serde::from_slice(bytes).map_err(|e| {
        crate::errors::to_py(hydrograde::Error::invalid(
            "state",
            format!("not a valid hydrograde state: {e}"),
        ))
    })
}

/// `(cls._from_state, (state,))`, the `__reduce__` value of every wrapper.
pub fn reduce<'py, T: Serialize>(
    obj: &Bound<'py, PyAny>,
    value: &T,
) -> PyResult<(Bound<'py, PyAny>, (Bound<'py, PyBytes>,))> {
    let ctor = obj.get_type().getattr("_from_state")?;
    Ok((ctor, (dumps(obj.py(), value)?,)))
}

static RENDER_HTML: PyOnceLock<Py<PyAny>> = PyOnceLock::new();
static TO_DATAFRAME: PyOnceLock<Py<PyAny>> = PyOnceLock::new();

/// The HTML table of an object's `to_dict()` (formatting lives in `hydrograde._notebook`).
pub fn html(py: Python<'_>, title: &str, dict: &Bound<'_, PyDict>) -> PyResult<String> {
    RENDER_HTML
        .import(py, "hydrograde._notebook", "render_html")?
        .call1((title, dict))?
        .extract()
}

static RENDER_OBJECT: PyOnceLock<Py<PyAny>> = PyOnceLock::new();

/// The HTML view of an object read through its own attributes (`hydrograde._notebook`).
pub fn html_object(obj: &Bound<'_, PyAny>, title: &str) -> PyResult<String> {
    RENDER_OBJECT
        .import(obj.py(), "hydrograde._notebook", "render_object")?
        .call1((title, obj))?
        .extract()
}

/// A pandas DataFrame of an object's `to_dict()` (raises ImportError without pandas).
pub fn dataframe<'py>(py: Python<'py>, dict: &Bound<'py, PyDict>) -> PyResult<Bound<'py, PyAny>> {
    TO_DATAFRAME
        .import(py, "hydrograde._notebook", "to_dataframe")?
        .call1((dict,))
}

/// A list of names as Python prints it: `['a', 'b']`.
pub fn names_repr(names: &[&str]) -> String {
    let quoted: Vec<String> = names.iter().map(|n| format!("'{n}'")).collect();
    format!("[{}]", quoted.join(", "))
}

/// A line element's core value and its [`Tag`] (label and count) back from
/// [`reduce_tagged`] bytes; bytes of the value alone (no tag) read with the default tag.
pub fn loads_tagged<T: DeserializeOwned>(bytes: &[u8]) -> PyResult<(T, Tag)> {
    match rmp_serde::from_slice::<(T, Tag)>(bytes) {
        Ok(pair) => Ok(pair),
        Err(_) => Ok((loads(bytes)?, Tag::default())),
    }
}

/// `__reduce__` of a line element: its core value alone when untagged, else with its tag.
pub fn reduce_tagged<'py, T: Serialize>(
    obj: &Bound<'py, PyAny>,
    value: &T,
    tag: &Tag,
) -> PyResult<(Bound<'py, PyAny>, (Bound<'py, PyBytes>,))> {
    if tag.is_default() {
        reduce(obj, value)
    } else {
        reduce(obj, &(value, tag))
    }
}

/// The `label=…, count=…` arguments of a line element's repr (empty when untagged).
pub fn tag_repr(tag: &Tag) -> String {
    let mut s = String::new();
    if let Some(l) = tag.label() {
        s.push_str(&format!(", label={l:?}"));
    }
    if tag.count() != 1 {
        s.push_str(&format!(", count={}", tag.count()));
    }
    s
}
