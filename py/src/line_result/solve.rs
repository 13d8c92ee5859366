//! The answers of a line's solvers: `FlowSolution`, `OperatingPoint`, `Split` and
//! `Sizing`.

use super::band;
use crate::band::{PyBand, band_dict};
use crate::state;
use hydrograde::line::{FlowSolution, OperatingPoint, SizeChoice, Sizing, Split};
use pyo3::prelude::*;
use pyo3::types::{PyBytes, PyDict, PyType};

/// The flow a line passes under a head: ``flow`` (m³/s), ``head`` (m),
/// ``drequired_head_dflow`` (s/m²), ``flow_band`` and ``iterations``.
#[pyclass(name = "FlowSolution", module = "hydrograde._native", frozen, eq)]
#[derive(Clone, PartialEq)]
pub struct PyFlowSolution {
    /// The core value.
    pub inner: FlowSolution,
}

#[pymethods]
impl PyFlowSolution {
    /// Signed flow, m³/s.
    #[getter]
    fn flow(&self) -> f64 {
        self.inner.flow
    }
    /// The head solved for, m.
    #[getter]
    fn head(&self) -> f64 {
        self.inner.head
    }
    /// d(required head)/dQ at the solution, s/m².
    #[getter]
    fn drequired_head_dflow(&self) -> f64 {
        self.inner.drequired_head_dflow
    }
    /// Band of the flow, m³/s.
    #[getter]
    fn flow_band(&self, py: Python<'_>) -> PyResult<Py<PyBand>> {
        band(py, &self.inner.flow_band)
    }
    /// Solver iterations used.
    #[getter]
    fn iterations(&self) -> usize {
        self.inner.iterations
    }
    /// The fields as a dict.
    fn to_dict<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyDict>> {
        let d = PyDict::new(py);
        d.set_item("flow", self.inner.flow)?;
        d.set_item("head", self.inner.head)?;
        d.set_item("drequired_head_dflow", self.inner.drequired_head_dflow)?;
        d.set_item("flow_band", band_dict(py, &self.inner.flow_band)?)?;
        d.set_item("iterations", self.inner.iterations)?;
        Ok(d)
    }
    fn _repr_html_(&self, py: Python<'_>) -> PyResult<String> {
        state::html(py, "FlowSolution", &self.to_dict(py)?)
    }
    fn __repr__(&self) -> String {
        let b = &self.inner.flow_band;
        format!(
            "FlowSolution(flow={:?}, head={:?}, flow_band=({:?}, {:?}))",
            self.inner.flow, self.inner.head, b.low, b.high
        )
    }
    fn __reduce__<'py>(
        slf: &Bound<'py, Self>,
    ) -> PyResult<(Bound<'py, PyAny>, (Bound<'py, PyBytes>,))> {
        state::reduce(slf.as_any(), &slf.get().inner)
    }
    #[classmethod]
    fn _from_state(_cls: &Bound<'_, PyType>, state: &[u8]) -> PyResult<Self> {
        Ok(PyFlowSolution {
            inner: state::loads(state)?,
        })
    }
}

/// Where a pump curve meets a system curve: ``flow`` (m³/s), ``head`` (m) and their
/// bands.
#[pyclass(name = "OperatingPoint", module = "hydrograde._native", frozen, eq)]
#[derive(Clone, PartialEq)]
pub struct PyOperatingPoint {
    /// The core value.
    pub inner: OperatingPoint,
}

#[pymethods]
impl PyOperatingPoint {
    /// Flow, m³/s.
    #[getter]
    fn flow(&self) -> f64 {
        self.inner.flow
    }
    /// Head, m.
    #[getter]
    fn head(&self) -> f64 {
        self.inner.head
    }
    /// Band of the flow, m³/s.
    #[getter]
    fn flow_band(&self, py: Python<'_>) -> PyResult<Py<PyBand>> {
        band(py, &self.inner.flow_band)
    }
    /// Band of the head, m.
    #[getter]
    fn head_band(&self, py: Python<'_>) -> PyResult<Py<PyBand>> {
        band(py, &self.inner.head_band)
    }
    /// The fields as a dict.
    fn to_dict<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyDict>> {
        let d = PyDict::new(py);
        d.set_item("flow", self.inner.flow)?;
        d.set_item("head", self.inner.head)?;
        d.set_item("flow_band", band_dict(py, &self.inner.flow_band)?)?;
        d.set_item("head_band", band_dict(py, &self.inner.head_band)?)?;
        Ok(d)
    }
    fn _repr_html_(&self, py: Python<'_>) -> PyResult<String> {
        state::html(py, "OperatingPoint", &self.to_dict(py)?)
    }
    fn __repr__(&self) -> String {
        format!(
            "OperatingPoint(flow={:?}, head={:?})",
            self.inner.flow, self.inner.head
        )
    }
    fn __reduce__<'py>(
        slf: &Bound<'py, Self>,
    ) -> PyResult<(Bound<'py, PyAny>, (Bound<'py, PyBytes>,))> {
        state::reduce(slf.as_any(), &slf.get().inner)
    }
    #[classmethod]
    fn _from_state(_cls: &Bound<'_, PyType>, state: &[u8]) -> PyResult<Self> {
        Ok(PyOperatingPoint {
            inner: state::loads(state)?,
        })
    }
}

/// Flows of parallel branches that need the same head: ``flows`` (m³/s, branch
/// order), ``head`` (m), ``iterations``, with ``head_band`` and ``flow_bands``.
#[pyclass(name = "Split", module = "hydrograde._native", frozen, eq)]
#[derive(Clone, PartialEq)]
pub struct PySplit {
    /// The core value.
    pub inner: Split,
}

#[pymethods]
impl PySplit {
    /// Flow in each branch, m³/s.
    #[getter]
    fn flows(&self) -> Vec<f64> {
        self.inner.flows.clone()
    }
    /// The common required head, m.
    #[getter]
    fn head(&self) -> f64 {
        self.inner.head
    }
    /// Iterations used.
    #[getter]
    fn iterations(&self) -> usize {
        self.inner.iterations
    }
    /// Band of the common head, m.
    #[getter]
    fn head_band(&self, py: Python<'_>) -> PyResult<Py<PyBand>> {
        band(py, &self.inner.head_band)
    }
    /// Band of each branch flow, m³/s (branch order).
    #[getter]
    fn flow_bands(&self, py: Python<'_>) -> PyResult<Vec<Py<PyBand>>> {
        self.inner.flow_bands.iter().map(|b| band(py, b)).collect()
    }
    fn _repr_html_(slf: &Bound<'_, Self>) -> PyResult<String> {
        state::html_object(slf.as_any(), "Split")
    }
    fn __repr__(&self) -> String {
        format!(
            "Split(flows={:?}, head={:?})",
            self.inner.flows, self.inner.head
        )
    }
    fn __reduce__<'py>(
        slf: &Bound<'py, Self>,
    ) -> PyResult<(Bound<'py, PyAny>, (Bound<'py, PyBytes>,))> {
        state::reduce(slf.as_any(), &slf.get().inner)
    }
    #[classmethod]
    fn _from_state(_cls: &Bound<'_, PyType>, state: &[u8]) -> PyResult<Self> {
        Ok(PySplit {
            inner: state::loads(state)?,
        })
    }
}

fn choice_dict<'py>(py: Python<'py>, c: &SizeChoice) -> PyResult<Bound<'py, PyDict>> {
    let d = crate::sizes::size_dict(py, &c.size)?;
    d.set_item("velocity", c.velocity)?;
    d.set_item("pressure_loss", c.pressure_loss)?;
    d.set_item("pressure_loss_band", band_dict(py, &c.pressure_loss_band)?)?;
    Ok(d)
}

/// The answer of :meth:`Line.size`: ``min_inside_diameter`` (m) meeting the limit at the
/// nominal values; ``standard`` and ``standard_at_band`` (dicts: the standard size, its
/// velocity in m/s, pressure loss in Pa and band), or None without a table.
#[pyclass(name = "Sizing", module = "hydrograde._native", frozen, eq)]
#[derive(Clone, PartialEq)]
pub struct PySizing {
    /// The core value.
    pub inner: Sizing,
}

#[pymethods]
impl PySizing {
    /// The smallest inside diameter that meets the limit at the nominal values, m.
    #[getter]
    fn min_inside_diameter(&self) -> f64 {
        self.inner.min_inside_diameter
    }
    /// The smallest standard size meeting the limit at the nominal values.
    #[getter]
    fn standard<'py>(&self, py: Python<'py>) -> PyResult<Option<Bound<'py, PyDict>>> {
        self.inner
            .standard
            .as_ref()
            .map(|c| choice_dict(py, c))
            .transpose()
    }
    /// The smallest standard size still meeting it at the band's unfavourable end.
    #[getter]
    fn standard_at_band<'py>(&self, py: Python<'py>) -> PyResult<Option<Bound<'py, PyDict>>> {
        self.inner
            .standard_at_band
            .as_ref()
            .map(|c| choice_dict(py, c))
            .transpose()
    }
    /// The fields as a dict.
    fn to_dict<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyDict>> {
        let d = PyDict::new(py);
        d.set_item("min_inside_diameter", self.inner.min_inside_diameter)?;
        d.set_item("standard", self.standard(py)?)?;
        d.set_item("standard_at_band", self.standard_at_band(py)?)?;
        Ok(d)
    }
    fn _repr_html_(&self, py: Python<'_>) -> PyResult<String> {
        state::html(py, "Sizing", &self.to_dict(py)?)
    }
    fn __repr__(&self) -> String {
        let pick = |c: &Option<SizeChoice>| {
            c.as_ref().map_or("None".to_string(), |c| {
                format!(
                    "'{} {} sch {}'",
                    c.size.table.name(),
                    c.size.nominal,
                    c.size.schedule
                )
            })
        };
        format!(
            "Sizing(min_inside_diameter={:?}, standard={}, standard_at_band={})",
            self.inner.min_inside_diameter,
            pick(&self.inner.standard),
            pick(&self.inner.standard_at_band)
        )
    }
    fn __reduce__<'py>(
        slf: &Bound<'py, Self>,
    ) -> PyResult<(Bound<'py, PyAny>, (Bound<'py, PyBytes>,))> {
        state::reduce(slf.as_any(), &slf.get().inner)
    }
    #[classmethod]
    fn _from_state(_cls: &Bound<'_, PyType>, state: &[u8]) -> PyResult<Self> {
        Ok(PySizing {
            inner: state::loads(state)?,
        })
    }
}
