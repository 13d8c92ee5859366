//! `hydrograde.Pump`: a pump as an element of a line.

use crate::errors::CoreResult;
use crate::line::PyPumpCurve;
use crate::state;
use hydrograde::line::{PumpCurve, Tag};
use pyo3::prelude::*;
use pyo3::types::{PyBytes, PyType};

/// A pump in a line, adding the head of its :class:`PumpCurve` (m) at the line's flow:
/// evaluated as the negative loss −H(Q) with slope −dH/dQ, inside the curve's flow range
/// only (no extrapolation; reverse flow through it is an error naming it).
/// :meth:`Line.pumped_flow` finds where a line with its own pump runs.
#[pyclass(name = "Pump", module = "hydrograde._native", frozen, eq)]
#[derive(Clone, PartialEq)]
pub struct PyPump {
    /// The core value.
    pub inner: PumpCurve,
    /// The label it carries into a line.
    pub tag: Tag,
}

#[pymethods]
impl PyPump {
    #[new]
    #[pyo3(signature = (curve, *, label = None))]
    fn new(curve: &Bound<'_, PyAny>, label: Option<&str>) -> PyResult<Self> {
        let Ok(c) = curve.cast::<PyPumpCurve>() else {
            let got = curve.get_type().name()?;
            return Err(hydrograde::Error::invalid(
                "curve",
                format!("a pump needs a PumpCurve (its head against flow), got {got}"),
            ))
            .py();
        };
        Ok(PyPump {
            inner: c.get().inner.clone(),
            tag: Tag::new(label, 1).py()?,
        })
    }
    /// The pump's curve.
    #[getter]
    fn curve(&self) -> PyPumpCurve {
        PyPumpCurve {
            inner: self.inner.clone(),
        }
    }
    /// The label given (``None``: the line's default, ``"pump N"``).
    #[getter]
    fn label(&self) -> Option<&str> {
        self.tag.label()
    }
    fn __repr__(&self) -> String {
        let (lo, hi) = self.inner.range();
        format!(
            "Pump(PumpCurve(flows {lo:?}…{hi:?} m³/s){})",
            state::tag_repr(&self.tag)
        )
    }
    fn __reduce__<'py>(
        slf: &Bound<'py, Self>,
    ) -> PyResult<(Bound<'py, PyAny>, (Bound<'py, PyBytes>,))> {
        state::reduce_tagged(slf.as_any(), &slf.get().inner, &slf.get().tag)
    }
    #[classmethod]
    fn _from_state(_cls: &Bound<'_, PyType>, state: &[u8]) -> PyResult<Self> {
        let (inner, tag) = state::loads_tagged(state)?;
        Ok(PyPump { inner, tag })
    }
}

/// Where a line with its own pump runs by itself (:meth:`Line.pumped_flow`): ``flow``
/// (m³/s) at which its required head is zero, ``pump_head`` (m) the pumps' head there,
/// ``npsh_available`` (m) at the first pump's suction (None without an inlet pressure or
/// a vapour pressure), ``pump_row`` (the row of ``result.elements`` holding it),
/// ``flow_band`` (m³/s), ``result`` (the line evaluated there) and ``iterations``.
#[pyclass(name = "PumpedFlow", module = "hydrograde._native", frozen)]
pub struct PyPumpedFlow {
    /// The core value.
    pub inner: hydrograde::line::PumpedFlow,
}

#[pymethods]
impl PyPumpedFlow {
    /// Flow, m³/s.
    #[getter]
    fn flow(&self) -> f64 {
        self.inner.flow
    }
    /// The pumps' head at the flow, m.
    #[getter]
    fn pump_head(&self) -> f64 {
        self.inner.pump_head
    }
    /// d(required head)/dQ at the flow, s/m².
    #[getter]
    fn drequired_head_dflow(&self) -> f64 {
        self.inner.drequired_head_dflow
    }
    /// NPSH available at the first pump's suction, m (None when it does not apply).
    #[getter]
    fn npsh_available(&self) -> Option<f64> {
        self.inner.npsh_available
    }
    /// The row of ``result.elements`` holding the first pump.
    #[getter]
    fn pump_row(&self) -> usize {
        self.inner.pump_row
    }
    /// Band of the flow, m³/s (the pump curve taken as stated).
    #[getter]
    fn flow_band(&self, py: Python<'_>) -> PyResult<Py<crate::band::PyBand>> {
        crate::band::PyBand::object(py, &self.inner.flow_band)
    }
    /// The line evaluated at the flow.
    #[getter]
    fn result(&self, py: Python<'_>) -> PyResult<crate::line_result::PyLineResult> {
        crate::line_result::PyLineResult::new(py, self.inner.result.clone())
    }
    /// Solver iterations used.
    #[getter]
    fn iterations(&self) -> usize {
        self.inner.iterations
    }
    fn __repr__(&self) -> String {
        let npsh = self
            .inner
            .npsh_available
            .map_or(String::new(), |n| format!(", npsh_available={n:?}"));
        format!(
            "PumpedFlow(flow={:?}, pump_head={:?}{npsh})",
            self.inner.flow, self.inner.pump_head
        )
    }
}
