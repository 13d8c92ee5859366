//! `hydrograde.Line`, `PumpCurve` and `split_flow`.

use crate::arrays::{self, si};
use crate::band::{PyUncertainty, uncertainty_dict};
use crate::errors::CoreResult;
use crate::fluid::PyFluid;
use crate::line_result::{PyFlowSolution, PyLineResult, PyOperatingPoint, PySizing, PySplit};
use crate::pipe::{element, element_object};
use crate::state;
use hydrograde::error::Error;
use hydrograde::line::{Limit, Line, LineBuilder, PumpCurve, Resize, split_flow as core_split};
use hydrograde::section::TurbulentDiameter;
use hydrograde::sizes::PipeTable;
use pyo3::prelude::*;
use pyo3::types::{PyBytes, PyDict, PyList, PySlice, PyType};

/// A 1-D numpy array of floats.
type Array1<'py> = Bound<'py, numpy::PyArray1<f64>>;

/// A route of elements in series (:class:`Pipe`, :class:`Fitting`, :class:`Rise`,
/// :class:`Equipment`), in flow order.
///
/// Options (``None`` keeps the core's default): ``correlation``, ``transition``,
/// ``laminar_limit`` and ``turbulent_limit`` (Reynolds numbers bounding the
/// transitional band) as :func:`darcy_factor`; ``turbulent_diameter`` (``"hydraulic"``
/// or ``"laminar_equivalent"``, Jones 1976, for non-circular sections);
/// ``inlet_pressure`` (Pa absolute; enables the pressure profile, cavitation and gas
/// checks); ``uncertainty`` (a preset name, ``"default"``, ``"none"`` or
/// ``"model_only"``, or an :class:`Uncertainty`: which sources the bands include).
///
/// Results are engineering estimates with stated uncertainty; designs must be checked
/// by a competent engineer against the codes and standards that apply.
#[pyclass(name = "Line", module = "hydrograde._native", frozen, eq)]
#[derive(Clone, PartialEq)]
pub struct PyLine {
    /// The core value.
    pub inner: Line,
}

#[pymethods]
impl PyLine {
    #[new]
    #[pyo3(signature = (elements, *, correlation = None, transition = None, laminar_limit = None, turbulent_limit = None, turbulent_diameter = None, inlet_pressure = None, uncertainty = None, surroundings = None, air_column_for_liquids = false, end_pressure = None))]
    #[allow(clippy::too_many_arguments)]
    fn new(
        elements: &Bound<'_, PyAny>,
        correlation: Option<&str>,
        transition: Option<&str>,
        #[pyo3(from_py_with = si::opt_laminar_limit)] laminar_limit: Option<f64>,
        #[pyo3(from_py_with = si::opt_turbulent_limit)] turbulent_limit: Option<f64>,
        turbulent_diameter: Option<&str>,
        #[pyo3(from_py_with = si::opt_inlet_pressure)] inlet_pressure: Option<f64>,
        uncertainty: Option<&Bound<'_, PyAny>>,
        surroundings: Option<PyRef<'_, PyFluid>>,
        air_column_for_liquids: bool,
        #[pyo3(from_py_with = si::opt_end_pressure)] end_pressure: Option<f64>,
    ) -> PyResult<Self> {
        let mut b = LineBuilder::new();
        for (i, obj) in elements.try_iter()?.enumerate() {
            let (e, tag) = element(&obj?, i)?;
            b.push_tagged(e, &tag).map_err(|e| e.at_index(i)).py()?;
        }
        b.set_friction(crate::friction::options(
            correlation,
            None,
            laminar_limit,
            turbulent_limit,
            transition,
        )?)
        .py()?;
        b.set_inlet_pressure(inlet_pressure).py()?;
        b.set_surroundings(surroundings.map(|f| f.inner.clone()))
            .py()?;
        b.set_air_column_for_liquids(air_column_for_liquids);
        b.set_end_pressure(end_pressure).py()?;
        if let Some(t) = turbulent_diameter {
            b.set_turbulent_diameter(t.parse::<TurbulentDiameter>().py()?);
        }
        if let Some(u) = uncertainty {
            b.set_uncertainty(PyUncertainty::from_arg(u)?).py()?;
        }
        Ok(PyLine {
            inner: b.build().py()?,
        })
    }
    /// The elements in route order.
    #[getter]
    fn elements<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyList>> {
        let list = PyList::empty(py);
        for i in 0..self.inner.len() {
            list.append(self.element_at(py, i)?)?;
        }
        Ok(list)
    }
    /// The label of each element as result rows show it: the one given, or the default
    /// (kind and index, ``"pipe 3"``), with ``"6 × "`` before a counted fitting's.
    #[getter]
    fn labels(&self) -> Vec<String> {
        (0..self.inner.len())
            .filter_map(|i| self.inner.label(i))
            .collect()
    }
    /// ``line[i]`` is element ``i`` (with its label and count); ``line[a:b]`` is the line
    /// of elements ``a`` to ``b - 1`` (same options; default labels renumber).
    fn __getitem__<'py>(
        &self,
        py: Python<'py>,
        key: &Bound<'py, PyAny>,
    ) -> PyResult<Bound<'py, PyAny>> {
        let n = self.inner.len();
        if let Ok(s) = key.cast::<PySlice>() {
            let ix = s.indices(n as isize)?;
            if ix.step != 1 {
                return Err(Error::out_of_range(
                    "step",
                    ix.step as f64,
                    "a line slice takes consecutive elements (step 1)",
                ))
                .py();
            }
            // Python's empty slices (line[3:1]) leave no element like line[3:3].
            let start = ix.start as usize;
            let end = if ix.slicelength == 0 {
                start
            } else {
                ix.stop as usize
            };
            let part = self.inner.slice(start..end).py()?;
            return Ok(Bound::new(py, PyLine { inner: part })?.into_any());
        }
        let i: isize = key.extract()?;
        let at = if i < 0 { i + n as isize } else { i };
        if !(0..n as isize).contains(&at) {
            return Err(pyo3::exceptions::PyIndexError::new_err(format!(
                "index = {i}: the line has {n} elements"
            )));
        }
        Ok(self.element_at(py, at as usize)?.into_bound(py))
    }
    /// ``line + other``: this line followed by ``other`` (labels and counts kept), under
    /// this line's options; ``other``'s must be the same except its inlet pressure.
    fn __add__(&self, other: &Bound<'_, PyAny>) -> PyResult<Py<PyAny>> {
        let py = other.py();
        match other.cast::<PyLine>() {
            Ok(o) => Ok(Py::new(
                py,
                PyLine {
                    inner: self.inner.join(&o.get().inner).py()?,
                },
            )?
            .into_any()),
            Err(_) => Ok(py.NotImplemented()),
        }
    }
    /// The elements in route order.
    fn __iter__<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyAny>> {
        Ok(self.elements(py)?.try_iter()?.into_any())
    }
    /// Sum of the rises, m.
    #[getter]
    fn static_head(&self) -> f64 {
        self.inner.static_head()
    }
    /// Inlet static pressure of the options, Pa absolute (None when not given).
    #[getter]
    fn inlet_pressure(&self) -> Option<f64> {
        self.inner.options().inlet_pressure()
    }
    /// True when some element has a loss (otherwise no flow can be solved for).
    #[getter]
    fn has_resistance(&self) -> bool {
        self.inner.has_resistance()
    }
    /// True when some fitting stops reverse flow (a check or foot valve).
    #[getter]
    fn blocks_reverse_flow(&self) -> bool {
        self.inner.blocks_reverse_flow()
    }
    /// The turbulent friction correlation of every pipe.
    #[getter]
    fn correlation(&self) -> &'static str {
        self.inner.options().friction().correlation.name()
    }
    /// The treatment of the transitional band.
    #[getter]
    fn transition(&self) -> &'static str {
        self.inner.options().friction().transition.name()
    }
    /// Reynolds number below which flow is laminar.
    #[getter]
    fn laminar_limit(&self) -> f64 {
        self.inner.options().friction().laminar_limit
    }
    /// Reynolds number above which flow is turbulent.
    #[getter]
    fn turbulent_limit(&self) -> f64 {
        self.inner.options().friction().turbulent_limit
    }
    /// The diameter used for turbulent flow in non-circular sections.
    #[getter]
    fn turbulent_diameter(&self) -> &'static str {
        self.inner.options().turbulent_diameter().name()
    }
    /// The uncertainty sources of the bands.
    #[getter]
    fn uncertainty(&self) -> PyUncertainty {
        PyUncertainty {
            inner: self.inner.options().uncertainty().clone(),
        }
    }
    /// The line at signed ``flow`` (m³/s): head loss, pressure loss, required head, the
    /// per-element breakdown, bands and warnings. ``inlet_pressure`` (Pa absolute)
    /// replaces the line's own for this evaluation (pressure profile, cavitation and gas
    /// checks); ``None`` keeps the line's.
    #[pyo3(signature = (fluid, flow, inlet_pressure = None))]
    fn evaluate(
        &self,
        py: Python<'_>,
        fluid: &PyFluid,
        #[pyo3(from_py_with = si::flow)] flow: f64,
        #[pyo3(from_py_with = si::opt_inlet_pressure)] inlet_pressure: Option<f64>,
    ) -> PyResult<PyLineResult> {
        let r = py
            .detach(|| match inlet_pressure {
                Some(p) => self.inner.evaluate_at(&fluid.inner, flow, Some(p)),
                None => self.inner.evaluate(&fluid.inner, flow),
            })
            .py()?;
        PyLineResult::new(py, r)
    }
    /// Required head (m) at signed ``flow`` (m³/s): static head + losses. Floats give a
    /// float; arrays broadcast (GIL released, all cores for large arrays).
    fn required_head<'py>(
        &self,
        py: Python<'py>,
        fluid: &PyFluid,
        flow: &Bound<'py, PyAny>,
    ) -> PyResult<Bound<'py, PyAny>> {
        let (l, f) = (&self.inner, &fluid.inner);
        arrays::map(py, ["flow"], [flow], |[q]| {
            l.required_head(f, q).map(|r| r.0)
        })
    }
    /// The system curve: required head (m) at each of ``flows`` (m³/s, any shape).
    fn system_curve<'py>(
        &self,
        py: Python<'py>,
        fluid: &PyFluid,
        flows: &Bound<'py, PyAny>,
    ) -> PyResult<Bound<'py, PyAny>> {
        let (l, f) = (&self.inner, &fluid.inner);
        arrays::map(py, ["flows"], [flows], |[q]| {
            l.required_head(f, q).map(|r| r.0)
        })
    }
    /// The system curve with its band: ``(low, nominal, high)``, three 1-D arrays of the
    /// required head (m) at each of ``flows`` (m³/s, 1-D), the same band as
    /// ``evaluate(fluid, q).required_head_band`` at each flow. Runs with the GIL released.
    #[allow(clippy::type_complexity)]
    fn system_curve_band<'py>(
        &self,
        py: Python<'py>,
        fluid: &PyFluid,
        flows: Vec<f64>,
    ) -> PyResult<(Array1<'py>, Array1<'py>, Array1<'py>)> {
        let c = py
            .detach(|| self.inner.system_curve_band(&fluid.inner, &flows))
            .py()?;
        Ok((
            numpy::PyArray1::from_vec(py, c.low),
            numpy::PyArray1::from_vec(py, c.nominal),
            numpy::PyArray1::from_vec(py, c.high),
        ))
    }
    /// The signed flow (m³/s) for which the required head equals ``head`` (m), with its band.
    fn flow_for_head(
        &self,
        py: Python<'_>,
        fluid: &PyFluid,
        #[pyo3(from_py_with = si::head)] head: f64,
    ) -> PyResult<PyFlowSolution> {
        let s = py
            .detach(|| self.inner.flow_for_head(&fluid.inner, head))
            .py()?;
        Ok(PyFlowSolution { inner: s })
    }
    /// Where ``pump``'s curve crosses this line's system curve, with bands.
    fn operating_point(
        &self,
        py: Python<'_>,
        fluid: &PyFluid,
        pump: &PyPumpCurve,
    ) -> PyResult<PyOperatingPoint> {
        let p = py
            .detach(|| self.inner.operating_point(&fluid.inner, &pump.inner))
            .py()?;
        Ok(PyOperatingPoint { inner: p })
    }
    /// Where this line, holding its own :class:`Pump`, runs by itself: the flow at which
    /// its required head (static head + losses + end pressure head − the pumps' head) is
    /// zero, solved in a kept bracket over the pumps' flow range (no extrapolation), with
    /// the NPSH available at the first pump's suction.
    fn pumped_flow(&self, py: Python<'_>, fluid: &PyFluid) -> PyResult<crate::pump::PyPumpedFlow> {
        let p = py.detach(|| self.inner.pumped_flow(&fluid.inner)).py()?;
        Ok(crate::pump::PyPumpedFlow { inner: p })
    }
    /// Sizes the line's round pipes (all take one trial bore) for ``flow`` (m³/s, ≠ 0)
    /// under exactly one limit: ``max_pressure_loss`` (Pa, friction + minor) or
    /// ``max_velocity`` (m/s); with ``table`` (``"steel"``, ``"stainless"``, ``"copper"``,
    /// ``"pvc"``) and ``schedule`` also picks the smallest standard size, at the nominal
    /// values and at the unfavourable end of the band. ``section=(start, end)`` sizes only
    /// the elements ``start`` … ``end - 1`` (the limit stays the whole line's);
    /// ``material`` (a roughness catalogue name, e.g. ``"pvc"``) makes the sized pipes of
    /// that material. Each trial resizes as :meth:`with_uniform_diameter` does.
    #[pyo3(signature = (fluid, flow, *, max_pressure_loss = None, max_velocity = None, table = None, schedule = None, section = None, material = None))]
    #[allow(clippy::too_many_arguments)]
    fn size(
        &self,
        py: Python<'_>,
        fluid: &PyFluid,
        #[pyo3(from_py_with = si::flow)] flow: f64,
        #[pyo3(from_py_with = si::opt_max_pressure_loss)] max_pressure_loss: Option<f64>,
        #[pyo3(from_py_with = si::opt_max_velocity)] max_velocity: Option<f64>,
        table: Option<&str>,
        schedule: Option<&str>,
        section: Option<(i64, i64)>,
        material: Option<String>,
    ) -> PyResult<PySizing> {
        let section = section_arg(section)?;
        let limit = match (max_pressure_loss, max_velocity) {
            (Some(p), None) => Limit::PressureLoss(p),
            (None, Some(v)) => Limit::Velocity(v),
            _ => {
                return Err(Error::invalid(
                    "max_pressure_loss",
                    "give exactly one of max_pressure_loss and max_velocity",
                ))
                .py();
            }
        };
        let table = match (table, schedule) {
            (Some(t), Some(s)) => Some((t.parse::<PipeTable>().py()?, s)),
            (None, None) => None,
            _ => {
                return Err(Error::invalid(
                    "schedule",
                    "give both table and schedule, or neither",
                ))
                .py();
            }
        };
        let s = py
            .detach(|| {
                self.inner.size_in(
                    &fluid.inner,
                    flow,
                    limit,
                    table,
                    &Resize { section, material },
                )
            })
            .py()?;
        Ok(PySizing { inner: s })
    }
    /// The same line with the likely range (``low``, ``high``; m) of the roughness of the
    /// pipe at ``index`` stated, for the roughness uncertainty.
    fn with_roughness_range(
        &self,
        index: usize,
        #[pyo3(from_py_with = si::low)] low: f64,
        #[pyo3(from_py_with = si::high)] high: f64,
    ) -> PyResult<Self> {
        let mut l = self.inner.clone();
        l.set_roughness_range(index, low, high).py()?;
        Ok(PyLine { inner: l })
    }
    /// The same line with every round pipe (of ``section=(start, end)``, the elements
    /// ``start`` … ``end - 1``, when given) of inside ``diameter`` (m), of ``material``
    /// when named. Fittings with a stated bore take the new bore; a contraction or
    /// expansion next to a resized pipe is rebuilt from the bores that meet there and
    /// removed when they are equal (the line then has fewer elements); a section border
    /// with no transition element is counted as an abrupt change with its warning;
    /// equipment with a fixed bore refuses, the error naming it.
    #[pyo3(signature = (diameter, *, section = None, material = None))]
    fn with_uniform_diameter(
        &self,
        #[pyo3(from_py_with = si::diameter)] diameter: f64,
        section: Option<(i64, i64)>,
        material: Option<String>,
    ) -> PyResult<Self> {
        let section = section_arg(section)?;
        Ok(PyLine {
            inner: self
                .inner
                .with_diameter_in(diameter, &Resize { section, material })
                .py()?,
        })
    }
    /// The elements and options as a dict.
    fn to_dict<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyDict>> {
        let d = PyDict::new(py);
        d.set_item("static_head", self.static_head())?;
        d.set_item("inlet_pressure", self.inlet_pressure())?;
        d.set_item("correlation", self.correlation())?;
        d.set_item("transition", self.transition())?;
        d.set_item("laminar_limit", self.laminar_limit())?;
        d.set_item("turbulent_limit", self.turbulent_limit())?;
        d.set_item("turbulent_diameter", self.turbulent_diameter())?;
        d.set_item(
            "uncertainty",
            uncertainty_dict(py, self.inner.options().uncertainty())?,
        )?;
        let rows = PyList::empty(py);
        for i in 0..self.inner.len() {
            let obj = self.element_at(py, i)?;
            let row = PyDict::new(py);
            row.set_item("element", obj.bind(py).repr()?)?;
            rows.append(row)?;
        }
        d.set_item("elements", rows)?;
        Ok(d)
    }
    fn _repr_html_(slf: &Bound<'_, Self>) -> PyResult<String> {
        state::html_object(slf.as_any(), "Line")
    }
    /// The system curve over ``flows`` (m³/s or a pint quantity) with its band, and with
    /// ``pump`` its curve and the operating point (needs matplotlib), on ``ax`` (a new
    /// one when None), in the display units. Returns the Axes.
    #[pyo3(signature = (fluid, flows, pump = None, ax = None))]
    fn plot_system<'py>(
        slf: &Bound<'py, Self>,
        fluid: &Bound<'py, PyAny>,
        flows: &Bound<'py, PyAny>,
        pump: Option<&Bound<'py, PyAny>>,
        ax: Option<&Bound<'py, PyAny>>,
    ) -> PyResult<Bound<'py, PyAny>> {
        slf.py()
            .import("hydrograde.plotting")?
            .call_method1("system_curve", (slf, fluid, flows, pump, ax))
    }
    /// The grade line at ``flow`` against distance (needs matplotlib); see
    /// :func:`hydrograde.plotting.grade_line`. Returns the Axes.
    #[pyo3(signature = (fluid, flow, ax = None))]
    fn plot_grade<'py>(
        slf: &Bound<'py, Self>,
        fluid: &Bound<'py, PyAny>,
        flow: &Bound<'py, PyAny>,
        ax: Option<&Bound<'py, PyAny>>,
    ) -> PyResult<Bound<'py, PyAny>> {
        slf.py()
            .import("hydrograde.plotting")?
            .call_method1("grade_line", (slf, fluid, flow, ax))
    }
    fn __repr__(&self, py: Python<'_>) -> PyResult<String> {
        let parts: Vec<String> = (0..self.inner.len())
            .map(|i| Ok(self.element_at(py, i)?.bind(py).repr()?.to_string()))
            .collect::<PyResult<_>>()?;
        Ok(format!("Line([{}])", parts.join(", ")))
    }
    fn __len__(&self) -> usize {
        self.inner.elements().len()
    }
    fn __reduce__<'py>(
        slf: &Bound<'py, Self>,
    ) -> PyResult<(Bound<'py, PyAny>, (Bound<'py, PyBytes>,))> {
        state::reduce(slf.as_any(), &slf.get().inner)
    }
    #[classmethod]
    fn _from_state(_cls: &Bound<'_, PyType>, state: &[u8]) -> PyResult<Self> {
        Ok(PyLine {
            inner: state::loads(state)?,
        })
    }
}

impl PyLine {
    /// The Python object of element `i` (an index of the line) with its label and count.
    fn element_at(&self, py: Python<'_>, i: usize) -> PyResult<Py<PyAny>> {
        let e = &self.inner.elements()[i];
        element_object(py, e, self.inner.tag(i).unwrap_or_default())
    }
}

/// A ``section=(start, end)`` argument as element indices: negative indices are refused
/// with an error naming ``section`` (a section counts elements from 0, as
/// :meth:`Line.__len__` does; no counting from the end).
fn section_arg(section: Option<(i64, i64)>) -> PyResult<Option<(usize, usize)>> {
    let Some((start, end)) = section else {
        return Ok(None);
    };
    let index = |v: i64| {
        usize::try_from(v).map_err(|_| {
            Error::out_of_range(
                "section",
                v as f64,
                "element indices of a section count from 0 (start, end with 0 ≤ start < end ≤ the number of elements); negative indices are not accepted",
            )
        })
    };
    Ok(Some((index(start).py()?, index(end).py()?)))
}

/// A pump curve through (flow m³/s, head m) points: at least 3, flows ≥ 0 strictly
/// increasing, heads non-increasing; monotone piecewise-cubic interpolation
/// (Fritsch & Carlson 1980), so the curve never rises where the data falls.
#[pyclass(name = "PumpCurve", module = "hydrograde._native", frozen, eq)]
#[derive(Clone, PartialEq)]
pub struct PyPumpCurve {
    /// The core value.
    pub inner: PumpCurve,
}

#[pymethods]
impl PyPumpCurve {
    #[new]
    fn new(
        #[pyo3(from_py_with = si::flows_vec)] flows: Vec<f64>,
        #[pyo3(from_py_with = si::heads_vec)] heads: Vec<f64>,
    ) -> PyResult<Self> {
        Ok(PyPumpCurve {
            inner: PumpCurve::new(&flows, &heads).py()?,
        })
    }
    /// The least-squares polynomial of ``degree`` (2 quadratic, 3 cubic) through
    /// (flow m³/s, head m) points, at least ``degree + 1``; its coefficients and residual
    /// are in ``fit_info``. Heads may wiggle; flows must increase strictly.
    #[classmethod]
    #[pyo3(signature = (flows, heads, degree = 2))]
    fn fit(
        _cls: &Bound<'_, PyType>,
        #[pyo3(from_py_with = si::flows_vec)] flows: Vec<f64>,
        #[pyo3(from_py_with = si::heads_vec)] heads: Vec<f64>,
        degree: i64,
    ) -> PyResult<Self> {
        let d = usize::try_from(degree).map_err(|_| {
            hydrograde::Error::out_of_range(
                "degree",
                degree as f64,
                "must be 2 (quadratic) or 3 (cubic)",
            )
        });
        Ok(PyPumpCurve {
            inner: d.and_then(|d| PumpCurve::fit(&flows, &heads, d)).py()?,
        })
    }
    /// The least-squares fit as a dict (``degree``; ``coefficients`` c₀… of
    /// H = Σ c_k Q^k, ascending, SI; ``rms_residual`` and ``max_residual``, m), or None
    /// for the monotone cubic through the points.
    #[getter]
    fn fit_info<'py>(&self, py: Python<'py>) -> PyResult<Option<Bound<'py, PyDict>>> {
        let Some(f) = self.inner.fit_info() else {
            return Ok(None);
        };
        let d = PyDict::new(py);
        d.set_item("degree", f.degree)?;
        d.set_item("coefficients", f.coefficients.clone())?;
        d.set_item("rms_residual", f.rms_residual)?;
        d.set_item("max_residual", f.max_residual)?;
        Ok(Some(d))
    }
    /// (lowest, highest) flow of the data, m³/s.
    #[getter]
    fn range(&self) -> (f64, f64) {
        self.inner.range()
    }
    /// The pump's head (m) at ``flow`` (m³/s, inside the range); arrays broadcast.
    fn head<'py>(&self, py: Python<'py>, flow: &Bound<'py, PyAny>) -> PyResult<Bound<'py, PyAny>> {
        let p = &self.inner;
        arrays::map(py, ["flow"], [flow], |[q]| p.head(q).map(|r| r.0))
    }
    fn _repr_html_(slf: &Bound<'_, Self>) -> PyResult<String> {
        state::html_object(slf.as_any(), "PumpCurve")
    }
    fn __repr__(&self) -> String {
        let (lo, hi) = self.inner.range();
        format!("PumpCurve(flows {lo:?}…{hi:?} m³/s)")
    }
    fn __reduce__<'py>(
        slf: &Bound<'py, Self>,
    ) -> PyResult<(Bound<'py, PyAny>, (Bound<'py, PyBytes>,))> {
        state::reduce(slf.as_any(), &slf.get().inner)
    }
    #[classmethod]
    fn _from_state(_cls: &Bound<'_, PyType>, state: &[u8]) -> PyResult<Self> {
        Ok(PyPumpCurve {
            inner: state::loads(state)?,
        })
    }
}

/// Splits ``total`` flow (m³/s) between parallel ``branches`` (Lines) so that all need
/// the same head.
#[pyfunction]
pub fn split_flow(
    py: Python<'_>,
    branches: Vec<PyRef<'_, PyLine>>,
    fluid: &PyFluid,
    #[pyo3(from_py_with = si::total)] total: f64,
) -> PyResult<PySplit> {
    let lines: Vec<Line> = branches.iter().map(|b| b.inner.clone()).collect();
    let s = py.detach(|| core_split(&lines, &fluid.inner, total)).py()?;
    Ok(PySplit { inner: s })
}
