//! `hydrograde.Band`: an uncertainty band (GUM, coverage factor k = 2).

use crate::state;
use hydrograde::band::Band;
use pyo3::prelude::*;
use pyo3::types::{PyBytes, PyDict, PyList, PyType};

/// An expanded-uncertainty band of a result: ``low ≤ nominal ≤ high`` in the result's
/// unit, first-order propagation after the GUM (JCGM 100:2008) with coverage factor
/// k = 2. ``contributions`` lists each source's share of the variance, largest first.
#[pyclass(name = "Band", module = "hydrograde._native", frozen, eq)]
#[derive(Clone, PartialEq)]
pub struct PyBand {
    /// The core value.
    pub inner: Band,
}

impl PyBand {
    /// Wraps a core band as a Python object.
    pub fn object(py: Python<'_>, band: &Band) -> PyResult<Py<PyBand>> {
        Py::new(
            py,
            PyBand {
                inner: band.clone(),
            },
        )
    }
}

/// The dict form of a band (also used inside the dicts of results).
pub fn band_dict<'py>(py: Python<'py>, b: &Band) -> PyResult<Bound<'py, PyDict>> {
    let d = PyDict::new(py);
    d.set_item("low", b.low)?;
    d.set_item("nominal", b.nominal)?;
    d.set_item("high", b.high)?;
    let rows = PyList::empty(py);
    for c in &b.contributions {
        let r = PyDict::new(py);
        r.set_item("source", &c.source)?;
        r.set_item("share", c.share)?;
        rows.append(r)?;
    }
    d.set_item("contributions", rows)?;
    Ok(d)
}

#[pymethods]
impl PyBand {
    /// Lower end, nominal − k·u.
    #[getter]
    fn low(&self) -> f64 {
        self.inner.low
    }
    /// The nominal value.
    #[getter]
    fn nominal(&self) -> f64 {
        self.inner.nominal
    }
    /// Upper end, nominal + k·u.
    #[getter]
    fn high(&self) -> f64 {
        self.inner.high
    }
    /// ``[(source, share of the variance), …]``, largest first.
    #[getter]
    fn contributions(&self) -> Vec<(String, f64)> {
        self.inner
            .contributions
            .iter()
            .map(|c| (c.source.clone(), c.share))
            .collect()
    }
    /// Half the width of the band, k·u.
    #[getter]
    fn half_width(&self) -> f64 {
        self.inner.half_width()
    }
    /// The standard uncertainty u (k = 1).
    #[getter]
    fn standard_uncertainty(&self) -> f64 {
        self.inner.standard_uncertainty()
    }
    /// The source with the largest share, if any.
    #[getter]
    fn dominant(&self) -> Option<String> {
        self.inner.dominant().map(str::to_string)
    }
    /// The band as a dict.
    fn to_dict<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyDict>> {
        band_dict(py, &self.inner)
    }
    fn _repr_html_(&self, py: Python<'_>) -> PyResult<String> {
        state::html(py, "Band", &self.to_dict(py)?)
    }
    fn __repr__(&self) -> String {
        let b = &self.inner;
        let dom = b
            .dominant()
            .map_or(String::new(), |d| format!(", dominant='{d}'"));
        format!(
            "Band(low={:?}, nominal={:?}, high={:?}{dom})",
            b.low, b.nominal, b.high
        )
    }
    fn __reduce__<'py>(
        slf: &Bound<'py, Self>,
    ) -> PyResult<(Bound<'py, PyAny>, (Bound<'py, PyBytes>,))> {
        state::reduce(slf.as_any(), &slf.get().inner)
    }
    #[classmethod]
    fn _from_state(_cls: &Bound<'_, PyType>, state: &[u8]) -> PyResult<Self> {
        Ok(PyBand {
            inner: state::loads(state)?,
        })
    }
}
