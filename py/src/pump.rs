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
