//! The results of a line: `LineResult` with its `ElementResult`s; the answers of the
//! solvers (`FlowSolution`, `OperatingPoint`, `Split`, `Sizing`) are in `solve.rs`.

use crate::band::{PyBand, band_dict};
use crate::errors::CoreResult;
use crate::state;

mod solve;
use hydrograde::band::Band;
use hydrograde::line::{ElementResult, LineResult, Share};
use pyo3::prelude::*;
use pyo3::types::{PyBytes, PyDict, PyList, PyType};
pub use solve::{PyFlowSolution, PyOperatingPoint, PySizing, PySplit};

fn band(py: Python<'_>, b: &Band) -> PyResult<Py<PyBand>> {
    PyBand::object(py, b)
}

/// The line at one flow. Fields (SI): ``flow`` (m³/s), ``head_loss`` (m, friction +
/// minor), ``pressure_loss`` (Pa, ρ·g·head_loss), ``static_head`` (m, sum of rises),
/// ``required_head`` (m), ``drequired_head_dflow`` (s/m²), ``density`` (kg/m³),
/// ``inlet_pressure``/``outlet_pressure`` (Pa absolute, when an inlet pressure is
/// given), ``elements`` (per-element breakdown in route order), ``warnings``, and the
/// bands ``head_loss_band``, ``pressure_loss_band``, ``required_head_band`` (k = 2).
/// An engineering estimate; designs must be checked by a competent engineer.
#[pyclass(name = "LineResult", module = "hydrograde._native", frozen, eq)]
#[derive(Clone, PartialEq)]
pub struct PyLineResult {
    /// The core value.
    pub inner: LineResult,
}

impl PyLineResult {
    /// Wraps a core result.
    pub fn new(_py: Python<'_>, inner: LineResult) -> PyResult<Self> {
        Ok(PyLineResult { inner })
    }
}

#[pymethods]
impl PyLineResult {
    /// Flow, m³/s (signed).
    #[getter]
    fn flow(&self) -> f64 {
        self.inner.flow
    }
    /// Head loss (friction + minor), m of the flowing fluid.
    #[getter]
    fn head_loss(&self) -> f64 {
        self.inner.head_loss
    }
    /// Pressure loss ρ·g·head_loss, Pa.
    #[getter]
    fn pressure_loss(&self) -> f64 {
        self.inner.pressure_loss
    }
    /// Sum of the rises, m.
    #[getter]
    fn static_head(&self) -> f64 {
        self.inner.static_head
    }
    /// head_loss + static_head, m.
    #[getter]
    fn required_head(&self) -> f64 {
        self.inner.required_head
    }
    /// d(required_head)/d(flow), s/m².
    #[getter]
    fn drequired_head_dflow(&self) -> f64 {
        self.inner.drequired_head_dflow
    }
    /// ρ·g·required_head, Pa: the pressure rise a pump, fan or blower must supply (for a
    /// gas the figure to lead with; rises count (ρ − ρ_surroundings)·g·Δz).
    #[getter]
    fn required_pressure(&self) -> f64 {
        self.inner.required_pressure
    }
    /// Density used, kg/m³ (the mean density for a gas).
    #[getter]
    fn density(&self) -> f64 {
        self.inner.density
    }
    /// Inlet static pressure, Pa absolute (None when not given).
    #[getter]
    fn inlet_pressure(&self) -> Option<f64> {
        self.inner.inlet_pressure
    }
    /// Outlet static pressure, Pa absolute (None without an inlet pressure).
    #[getter]
    fn outlet_pressure(&self) -> Option<f64> {
        self.inner.outlet_pressure
    }
    /// Names of the warnings of the whole line.
    #[getter]
    fn warnings(&self) -> Vec<&'static str> {
        self.inner.warnings.names()
    }
    /// What the warnings found, in words (the element, the values given, the likely cause).
    #[getter]
    fn messages(&self) -> Vec<String> {
        self.inner.messages.clone()
    }
    /// Vapour pressure of the liquid, Pa (None where unknown).
    #[getter]
    fn vapour_pressure(&self) -> Option<f64> {
        self.inner.vapour_pressure
    }
    /// NPSH available (m) after row ``index`` of ``elements``: (p_total − p_v)/(ρ g).
    /// Raises for an index outside the rows, a line without an inlet pressure or a fluid
    /// without a vapour pressure.
    fn npsh_available(&self, index: usize) -> PyResult<f64> {
        self.inner.npsh_available(index).py()
    }
    /// NPSH available after row ``index`` against ``required`` (m) plus ``margin`` (m):
    /// a dict with ``available``, ``required``, ``margin`` and ``sufficient``.
    #[pyo3(signature = (index, required, margin = 0.0))]
    fn npsh_check<'py>(
        &self,
        py: Python<'py>,
        index: usize,
        required: f64,
        margin: f64,
    ) -> PyResult<Bound<'py, PyDict>> {
        let c = self.inner.npsh_check(index, required, margin).py()?;
        let d = PyDict::new(py);
        d.set_item("available", c.available)?;
        d.set_item("required", c.required)?;
        d.set_item("margin", c.margin)?;
        d.set_item("sufficient", c.sufficient)?;
        Ok(d)
    }
    /// The per-element breakdown, in route order.
    #[getter]
    fn elements(&self) -> Vec<PyElementResult> {
        self.inner
            .elements
            .iter()
            .map(|e| PyElementResult { inner: e.clone() })
            .collect()
    }
    /// Which items dominate: a table of shares, one row per element (``by="element"``:
    /// ``row``, ``name`` (its label), ``kind``, ``head_loss`` m, ``loss_share``,
    /// ``band_share``), per kind of element (``by="kind"``) or per uncertainty source
    /// (``by="source"``: ``name``, ``kind``, ``band_share``). ``loss_share`` is the share
    /// of the line's head loss; ``band_share`` the share of the variance of its band (for
    /// an element, its covariance with the total over the total's variance: the shares
    /// sum to 1 and a negative one offsets the rest). ``None`` where there is no loss or
    /// no band to share. A pandas DataFrame when pandas is installed, else a list of dicts.
    #[pyo3(signature = (by = "element"))]
    fn shares<'py>(&self, py: Python<'py>, by: &str) -> PyResult<Bound<'py, PyAny>> {
        let s = self.inner.shares();
        let (rows, columns): (&[Share], &[&str]) = match by {
            "element" => (
                &s.by_element,
                &[
                    "row",
                    "name",
                    "kind",
                    "head_loss",
                    "loss_share",
                    "band_share",
                ],
            ),
            "kind" => (
                &s.by_kind,
                &["kind", "head_loss", "loss_share", "band_share"],
            ),
            "source" => (&s.by_source, &["name", "kind", "band_share"]),
            _ => {
                return Err(hydrograde::Error::unknown_name(
                    "by",
                    by,
                    &["element", "kind", "source"],
                ))
                .py();
            }
        };
        let list = PyList::empty(py);
        for r in rows {
            let d = PyDict::new(py);
            for &c in columns {
                match c {
                    "row" => d.set_item(c, r.row)?,
                    "name" => d.set_item(c, &r.name)?,
                    "kind" => d.set_item(c, &r.kind)?,
                    "head_loss" => d.set_item(c, r.head_loss)?,
                    "loss_share" => d.set_item(c, r.loss_share)?,
                    _ => d.set_item(c, r.band_share)?,
                }
            }
            list.append(d)?;
        }
        match py.import("pandas") {
            Ok(pd) => {
                let kw = PyDict::new(py);
                kw.set_item("columns", columns.to_vec())?;
                pd.getattr("DataFrame")?.call((list,), Some(&kw))
            }
            Err(_) => Ok(list.into_any()),
        }
    }
    /// Band of head_loss, m.
    #[getter]
    fn head_loss_band(&self, py: Python<'_>) -> PyResult<Py<PyBand>> {
        band(py, &self.inner.head_loss_band)
    }
    /// Band of pressure_loss, Pa.
    #[getter]
    fn pressure_loss_band(&self, py: Python<'_>) -> PyResult<Py<PyBand>> {
        band(py, &self.inner.pressure_loss_band)
    }
    /// Band of required_head, m.
    #[getter]
    fn required_head_band(&self, py: Python<'_>) -> PyResult<Py<PyBand>> {
        band(py, &self.inner.required_head_band)
    }
    /// Everything as a dict: scalars, bands (dicts), ``elements`` (list of dicts).
    fn to_dict<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyDict>> {
        let r = &self.inner;
        let d = PyDict::new(py);
        d.set_item("flow", r.flow)?;
        d.set_item("head_loss", r.head_loss)?;
        d.set_item("pressure_loss", r.pressure_loss)?;
        d.set_item("static_head", r.static_head)?;
        d.set_item("required_head", r.required_head)?;
        d.set_item("drequired_head_dflow", r.drequired_head_dflow)?;
        d.set_item("density", r.density)?;
        d.set_item("inlet_pressure", r.inlet_pressure)?;
        d.set_item("outlet_pressure", r.outlet_pressure)?;
        d.set_item("head_loss_band", band_dict(py, &r.head_loss_band)?)?;
        d.set_item("pressure_loss_band", band_dict(py, &r.pressure_loss_band)?)?;
        d.set_item("required_head_band", band_dict(py, &r.required_head_band)?)?;
        let rows = PyList::empty(py);
        for (i, e) in r.elements.iter().enumerate() {
            let row = element_dict(py, e)?;
            row.set_item("index", i)?;
            rows.append(row)?;
        }
        d.set_item("elements", rows)?;
        d.set_item("required_pressure", r.required_pressure)?;
        d.set_item("warnings", self.warnings())?;
        d.set_item("messages", self.messages())?;
        Ok(d)
    }
    /// The per-element breakdown as a pandas DataFrame (needs pandas).
    fn to_dataframe<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyAny>> {
        state::dataframe(py, &self.to_dict(py)?)
    }
    fn _repr_html_(&self, py: Python<'_>) -> PyResult<String> {
        state::html(py, "LineResult", &self.to_dict(py)?)
    }
    /// The grade line of this result (needs matplotlib): energy grade, added band and
    /// elevation with each element at its own position, on ``ax`` (a new one when None),
    /// in the display units. Returns the Axes.
    #[pyo3(signature = (ax = None))]
    fn plot<'py>(
        slf: &Bound<'py, Self>,
        ax: Option<&Bound<'py, PyAny>>,
    ) -> PyResult<Bound<'py, PyAny>> {
        slf.py()
            .import("hydrograde.plotting")?
            .call_method1("result_plot", (slf, ax))
    }
    fn __repr__(&self) -> String {
        let r = &self.inner;
        format!(
            "LineResult(flow={:?}, required_head={:?}, head_loss={:?}, pressure_loss={:?}, elements={}, warnings={})",
            r.flow,
            r.required_head,
            r.head_loss,
            r.pressure_loss,
            r.elements.len(),
            state::names_repr(&self.warnings())
        )
    }
    fn __reduce__<'py>(
        slf: &Bound<'py, Self>,
    ) -> PyResult<(Bound<'py, PyAny>, (Bound<'py, PyBytes>,))> {
        state::reduce(slf.as_any(), &slf.get().inner)
    }
    #[classmethod]
    fn _from_state(_cls: &Bound<'_, PyType>, state: &[u8]) -> PyResult<Self> {
        Ok(PyLineResult {
            inner: state::loads(state)?,
        })
    }
}

fn element_dict<'py>(py: Python<'py>, e: &ElementResult) -> PyResult<Bound<'py, PyDict>> {
    let d = PyDict::new(py);
    d.set_item("kind", e.kind.name())?;
    d.set_item("label", &e.label)?;
    d.set_item("element", e.element)?;
    d.set_item("velocity", e.velocity)?;
    d.set_item("reynolds", e.reynolds)?;
    d.set_item("regime", e.regime.map(|r| r.name()))?;
    d.set_item("friction_factor", e.friction_factor)?;
    d.set_item("k", e.k)?;
    d.set_item("head_loss", e.head_loss)?;
    d.set_item("dhead_dflow", e.dhead_dflow)?;
    d.set_item("static_head", e.static_head)?;
    d.set_item("pressure_out", e.pressure_out)?;
    d.set_item("total_pressure_out", e.total_pressure_out)?;
    d.set_item("elevation_out", e.elevation_out)?;
    d.set_item("bore", e.bore)?;
    d.set_item("length", e.length)?;
    d.set_item("head_loss_low", e.head_loss_band.low)?;
    d.set_item("head_loss_high", e.head_loss_band.high)?;
    d.set_item("dominant", e.head_loss_band.dominant().map(|s| s.name()))?;
    d.set_item("warnings", e.warnings.names())?;
    Ok(d)
}

/// One element's share of a :class:`LineResult`: ``kind`` ("pipe", "fitting", "rise",
/// "equipment", "section_change", "pump"), ``label``, ``element`` (index in the line, None for an
/// implied change of section), ``velocity`` (m/s, None without a bore), ``reynolds``, ``regime`` and
/// ``friction_factor`` (pipes), ``k`` (fittings), ``head_loss`` (m), ``dhead_dflow``
/// (s/m²), ``static_head`` (m), ``pressure_out`` (Pa), ``warnings`` and the bands
/// ``head_loss_band`` and ``friction_factor_band``.
#[pyclass(name = "ElementResult", module = "hydrograde._native", frozen, eq)]
#[derive(Clone, PartialEq)]
pub struct PyElementResult {
    /// The core value.
    pub inner: ElementResult,
}

#[pymethods]
impl PyElementResult {
    /// "pipe", "fitting", "rise", "equipment", "section_change" or "pump".
    #[getter]
    fn kind(&self) -> &'static str {
        self.inner.kind.name()
    }
    /// The element's label: the one given (``label=``), or its kind and index
    /// (``"pipe 3"``, ``"fitting 4"``, a catalogue name and index), with ``"6 × "``
    /// before a counted fitting's; an implied change of section is named by its bores.
    #[getter]
    fn label(&self) -> &str {
        &self.inner.label
    }
    /// How many identical fittings the row stands for (``count=`` of the fitting; 1
    /// for every other row).
    #[getter]
    fn count(&self) -> u32 {
        self.inner.count
    }
    /// The row's share of the variance of the line's head loss (see
    /// :meth:`LineResult.shares`); None when the line's band has no width.
    #[getter]
    fn band_share(&self) -> Option<f64> {
        self.inner.band_share
    }
    /// Mean velocity in the element's bore, m/s (signed; None for a rise or a rated
    /// pressure drop, which have no bore of their own).
    #[getter]
    fn velocity(&self) -> Option<f64> {
        self.inner.velocity
    }
    /// Reynolds number in the element's bore (None where there is no bore).
    #[getter]
    fn reynolds(&self) -> Option<f64> {
        self.inner.reynolds
    }
    /// Index of the line element this row stands for; None for an abrupt change of
    /// section the route implies between two elements of different bore.
    #[getter]
    fn element(&self) -> Option<usize> {
        self.inner.element
    }
    /// Flow regime of a pipe (None for other elements).
    #[getter]
    fn regime(&self) -> Option<&'static str> {
        self.inner.regime.map(|r| r.name())
    }
    /// Darcy friction factor of a pipe (None for other elements).
    #[getter]
    fn friction_factor(&self) -> Option<f64> {
        self.inner.friction_factor
    }
    /// Resistance coefficient K of a fitting (None for other elements).
    #[getter]
    fn k(&self) -> Option<f64> {
        self.inner.k
    }
    /// Head loss, m.
    #[getter]
    fn head_loss(&self) -> f64 {
        self.inner.head_loss
    }
    /// d(head_loss)/d(flow), s/m².
    #[getter]
    fn dhead_dflow(&self) -> f64 {
        self.inner.dhead_dflow
    }
    /// Static head of a rise, m (0 otherwise).
    #[getter]
    fn static_head(&self) -> f64 {
        self.inner.static_head
    }
    /// Static pressure after the element, Pa absolute (None without an inlet pressure).
    #[getter]
    fn pressure_out(&self) -> Option<f64> {
        self.inner.pressure_out
    }
    /// Total pressure (static + ½ρV²) after the element, Pa absolute (None without an
    /// inlet pressure).
    #[getter]
    fn total_pressure_out(&self) -> Option<f64> {
        self.inner.total_pressure_out
    }
    /// Elevation of the element's outlet above the line's inlet, m.
    #[getter]
    fn elevation_out(&self) -> f64 {
        self.inner.elevation_out
    }
    /// The bore the velocity is referred to, m (None for rises and rated drops).
    #[getter]
    fn bore(&self) -> Option<f64> {
        self.inner.bore
    }
    /// Length of a pipe, m (None for every other row).
    #[getter]
    fn length(&self) -> Option<f64> {
        self.inner.length
    }
    /// Names of the element's warnings.
    #[getter]
    fn warnings(&self) -> Vec<&'static str> {
        self.inner.warnings.names()
    }
    /// Band of head_loss, m.
    #[getter]
    fn head_loss_band(&self, py: Python<'_>) -> PyResult<Py<PyBand>> {
        band(py, &self.inner.head_loss_band)
    }
    /// Band of friction_factor (pipes only).
    #[getter]
    fn friction_factor_band(&self, py: Python<'_>) -> PyResult<Option<Py<PyBand>>> {
        self.inner
            .friction_factor_band
            .as_ref()
            .map(|b| band(py, b))
            .transpose()
    }
    /// The fields as a dict.
    fn to_dict<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyDict>> {
        element_dict(py, &self.inner)
    }
    fn _repr_html_(&self, py: Python<'_>) -> PyResult<String> {
        state::html(py, "ElementResult", &self.to_dict(py)?)
    }
    fn __repr__(&self) -> String {
        format!(
            "ElementResult(kind='{}', label='{}', head_loss={:?})",
            self.kind(),
            self.inner.label,
            self.inner.head_loss
        )
    }
    fn __reduce__<'py>(
        slf: &Bound<'py, Self>,
    ) -> PyResult<(Bound<'py, PyAny>, (Bound<'py, PyBytes>,))> {
        state::reduce(slf.as_any(), &slf.get().inner)
    }
    #[classmethod]
    fn _from_state(_cls: &Bound<'_, PyType>, state: &[u8]) -> PyResult<Self> {
        Ok(PyElementResult {
            inner: state::loads(state)?,
        })
    }
}
