//! `hydrograde.Section`: cross-sections of pipes and ducts.

use crate::arrays::{self, si};
use crate::errors::CoreResult;
use crate::state;
use hydrograde::section::{Section, TurbulentDiameter};
use pyo3::prelude::*;
use pyo3::types::{PyBytes, PyDict, PyType};

/// A flow cross-section. Build one with :meth:`circle`, :meth:`annulus`,
/// :meth:`rectangle`, :meth:`ellipse`, :meth:`triangle` (equilateral) or :meth:`custom`;
/// lengths in m.
///
/// Properties: ``area`` (m²), ``wetted_perimeter`` (m), ``hydraulic_diameter`` = 4A/P
/// (m) and ``laminar_constant`` = f·Re of fully developed laminar flow (exact solutions
/// for each shape: 64 for a circle; Shah & London 1978 for the others).
#[pyclass(name = "Section", module = "hydrograde._native", frozen, eq)]
#[derive(Clone, PartialEq)]
pub struct PySection {
    /// The core value.
    pub inner: Section,
}

fn wrap(s: hydrograde::Result<Section>) -> PyResult<PySection> {
    Ok(PySection { inner: s.py()? })
}

/// The shape's own dimensions (as the core's serde form names them), in m or m².
pub fn dimensions<'py>(py: Python<'py>, s: &Section) -> PyResult<Bound<'py, PyDict>> {
    let d = PyDict::new(py);
    let value = serde_json::to_value(s)
        .map_err(|e| pyo3::exceptions::PyValueError::new_err(e.to_string()))?;
    if let Some(fields) = value
        .as_object()
        .and_then(|o| o.values().next())
        .and_then(|v| v.as_object())
    {
        for (k, v) in fields {
            d.set_item(k, v.as_f64())?;
        }
    }
    Ok(d)
}

#[pymethods]
impl PySection {
    /// A round pipe of inside ``diameter`` (m).
    #[classmethod]
    fn circle(
        _cls: &Bound<'_, PyType>,
        #[pyo3(from_py_with = si::diameter)] diameter: f64,
    ) -> PyResult<Self> {
        wrap(Section::circle(diameter))
    }
    /// A concentric annulus: ``outer`` = inside diameter of the outer pipe, ``inner`` =
    /// outside diameter of the inner tube (m).
    #[classmethod]
    fn annulus(
        _cls: &Bound<'_, PyType>,
        #[pyo3(from_py_with = si::outer)] outer: f64,
        #[pyo3(from_py_with = si::inner)] inner: f64,
    ) -> PyResult<Self> {
        wrap(Section::annulus(outer, inner))
    }
    /// A rectangular duct of ``width`` and ``height`` (m).
    #[classmethod]
    fn rectangle(
        _cls: &Bound<'_, PyType>,
        #[pyo3(from_py_with = si::width)] width: f64,
        #[pyo3(from_py_with = si::height)] height: f64,
    ) -> PyResult<Self> {
        wrap(Section::rectangle(width, height))
    }
    /// An elliptical duct of full axes ``major`` ≥ ``minor`` (m).
    #[classmethod]
    fn ellipse(
        _cls: &Bound<'_, PyType>,
        #[pyo3(from_py_with = si::major)] major: f64,
        #[pyo3(from_py_with = si::minor)] minor: f64,
    ) -> PyResult<Self> {
        wrap(Section::ellipse(major, minor))
    }
    /// An equilateral triangular duct of ``side`` (m).
    #[classmethod]
    fn triangle(
        _cls: &Bound<'_, PyType>,
        #[pyo3(from_py_with = si::side)] side: f64,
    ) -> PyResult<Self> {
        wrap(Section::triangle(side))
    }
    /// Any other shape: flow ``area`` (m²), wetted ``perimeter`` (m) and its
    /// ``laminar_constant`` f·Re (dimensionless, on the hydraulic diameter).
    #[classmethod]
    fn custom(
        _cls: &Bound<'_, PyType>,
        #[pyo3(from_py_with = si::area)] area: f64,
        #[pyo3(from_py_with = si::perimeter)] perimeter: f64,
        #[pyo3(from_py_with = si::laminar_constant)] laminar_constant: f64,
    ) -> PyResult<Self> {
        wrap(Section::custom(area, perimeter, laminar_constant))
    }
    /// "circle", "annulus", "rectangle", "ellipse", "triangle" or "custom".
    #[getter]
    fn shape(&self) -> &'static str {
        self.inner.shape_name()
    }
    /// The shape's own dimensions as a dict (m; m² for a custom area).
    #[getter]
    fn dimensions<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyDict>> {
        dimensions(py, &self.inner)
    }
    /// Flow area, m².
    #[getter]
    fn area(&self) -> f64 {
        self.inner.area()
    }
    /// Wetted perimeter, m.
    #[getter]
    fn wetted_perimeter(&self) -> f64 {
        self.inner.wetted_perimeter()
    }
    /// Hydraulic diameter 4A/P, m.
    #[getter]
    fn hydraulic_diameter(&self) -> f64 {
        self.inner.hydraulic_diameter()
    }
    /// Laminar constant f·Re (Darcy, on the hydraulic diameter), dimensionless.
    #[getter]
    fn laminar_constant(&self) -> f64 {
        self.inner.laminar_constant()
    }
    /// True for a round pipe.
    #[getter]
    fn is_circular(&self) -> bool {
        self.inner.is_circular()
    }
    /// Warnings that apply to any flow in this section (``non_circular_section``).
    #[getter]
    fn warnings(&self) -> Vec<&'static str> {
        self.inner.warnings().names()
    }
    /// The length (m) turbulent correlations use: ``"hydraulic"`` (D_h, common
    /// practice) or ``"laminar_equivalent"`` ((64/C)·D_h; Jones 1976 for rectangles,
    /// Jones & Leung 1981 for annuli).
    #[pyo3(signature = (mode = "hydraulic"))]
    fn turbulent_diameter(&self, mode: &str) -> PyResult<f64> {
        let m: TurbulentDiameter = mode.parse().py()?;
        Ok(self.inner.turbulent_diameter(m))
    }
    /// Mean velocity (m/s) of volume ``flow`` (m³/s, signed); arrays broadcast.
    fn velocity<'py>(
        &self,
        py: Python<'py>,
        flow: &Bound<'py, PyAny>,
    ) -> PyResult<Bound<'py, PyAny>> {
        let s = self.inner;
        arrays::map(py, ["flow"], [flow], move |[q]| {
            hydrograde::error::check::finite("flow", q).map(|q| s.velocity(q))
        })
    }
    /// The shape, its dimensions and derived properties as a dict.
    fn to_dict<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyDict>> {
        let d = PyDict::new(py);
        d.set_item("shape", self.shape())?;
        d.update(dimensions(py, &self.inner)?.as_mapping())?;
        d.set_item("area", self.area())?;
        d.set_item("wetted_perimeter", self.wetted_perimeter())?;
        d.set_item("hydraulic_diameter", self.hydraulic_diameter())?;
        d.set_item("laminar_constant", self.laminar_constant())?;
        d.set_item("warnings", self.warnings())?;
        Ok(d)
    }
    /// A one-row pandas DataFrame (needs pandas).
    fn to_dataframe<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyAny>> {
        state::dataframe(py, &self.to_dict(py)?)
    }
    fn _repr_html_(&self, py: Python<'_>) -> PyResult<String> {
        state::html(py, "Section", &self.to_dict(py)?)
    }
    fn __repr__(&self, py: Python<'_>) -> PyResult<String> {
        let dims = dimensions(py, &self.inner)?;
        let args: Vec<String> = dims
            .iter()
            .map(|(k, v)| Ok(format!("{}={}", k.str()?, v.repr()?)))
            .collect::<PyResult<_>>()?;
        Ok(format!("Section.{}({})", self.shape(), args.join(", ")))
    }
    fn __reduce__<'py>(
        slf: &Bound<'py, Self>,
    ) -> PyResult<(Bound<'py, PyAny>, (Bound<'py, PyBytes>,))> {
        state::reduce(slf.as_any(), &slf.get().inner)
    }
    #[classmethod]
    fn _from_state(_cls: &Bound<'_, PyType>, state: &[u8]) -> PyResult<Self> {
        Ok(PySection {
            inner: state::loads(state)?,
        })
    }
}
