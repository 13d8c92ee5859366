//! `hydrograde.Band` (an uncertainty band, GUM, coverage factor k = 2), `Uncertainty`
//! (which sources enter the bands) and `monte_carlo` (the sampling check).

use crate::errors::CoreResult;
use crate::fluid::PyFluid;
use crate::line::PyLine;
use crate::state;
use hydrograde::band::{
    Band, MONTE_CARLO_SAMPLES, MonteCarlo, UncertaintyOptions,
    band_monte_carlo as core_band_monte_carlo, monte_carlo as core_monte_carlo,
};
use pyo3::exceptions::PyTypeError;
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
    d.set_item("coverage_factor", b.coverage_factor)?;
    d.set_item("coverage", b.coverage.name())?;
    d.set_item("non_linear", b.non_linear)?;
    let rows = PyList::empty(py);
    for c in &b.contributions {
        let r = PyDict::new(py);
        r.set_item("source", c.source.name())?;
        r.set_item("kind", c.source.kind())?;
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
            .map(|c| (c.source.name(), c.share))
            .collect()
    }
    /// The coverage factor k of the 95 % interval (2 for a near-normal result, down to
    /// 1.645 when one rectangular input dominates).
    #[getter]
    fn coverage_factor(&self) -> f64 {
        self.inner.coverage_factor
    }
    /// How k was chosen: ``"exact"`` (no width), ``"normal"`` or
    /// ``"dominant_rectangular"``.
    #[getter]
    fn coverage(&self) -> &'static str {
        self.inner.coverage.name()
    }
    /// ``[(source, kind, share of the variance), …]``, largest first; ``kind`` is one of
    /// ``"friction_model"``, ``"material_roughness"``, ``"pipe_roughness"``,
    /// ``"diameter"``, ``"density"``, ``"viscosity"``, ``"catalogue_k"``, ``"fitting_k"``,
    /// ``"equipment"``.
    #[getter]
    fn sources(&self) -> Vec<(String, &'static str, f64)> {
        self.inner
            .contributions
            .iter()
            .map(|c| (c.source.name(), c.source.kind(), c.share))
            .collect()
    }
    /// True when the first-order band may be unreliable: wider than 20 % of its nominal
    /// value, or (line results) a pipe's Reynolds number reaches into the
    /// laminar–turbulent transition within its own 95 % range. Take the interval from
    /// :func:`monte_carlo` then.
    #[getter]
    fn non_linear(&self) -> bool {
        self.inner.non_linear
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
        self.inner.dominant().map(|s| s.name())
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

/// Which uncertainty sources enter the bands of a :class:`Line`, and the values that
/// replace the core's defaults. Every number is a relative standard uncertainty (k = 1).
///
/// Keyword arguments left out (or ``None``) keep the core's default
/// (``Uncertainty()`` is the ``"default"`` preset): ``friction_model`` (bool, include the
/// correlation's model uncertainty), ``turbulent_model``, ``laminar_model``,
/// ``non_circular_model`` (model uncertainties of turbulent round-pipe, laminar and
/// non-circular turbulent friction), ``roughness`` (bool), ``roughness_default`` (used
/// for pipes with no material range), ``diameter`` (manufacturing tolerance of every
/// bore), ``fluid`` (bool, density and viscosity), ``fittings`` (bool, K spreads),
/// ``equipment`` (bool, equipment spreads), ``independent_materials`` (catalogue
/// material names whose pipes each get their own roughness error; by default the pipes
/// of one material share one). :meth:`preset` gives ``"default"``,
/// ``"none"`` or ``"model_only"``; :meth:`replace` changes some fields of a copy.
#[pyclass(name = "Uncertainty", module = "hydrograde._native", frozen, eq)]
#[derive(Clone, PartialEq)]
pub struct PyUncertainty {
    /// The core value.
    pub inner: UncertaintyOptions,
}

/// The keyword arguments of `Uncertainty`; `None` keeps the value of the base.
#[derive(Default)]
struct Fields {
    friction_model: Option<bool>,
    turbulent_model: Option<f64>,
    laminar_model: Option<f64>,
    non_circular_model: Option<f64>,
    roughness: Option<bool>,
    roughness_default: Option<f64>,
    diameter: Option<f64>,
    fluid: Option<bool>,
    fittings: Option<bool>,
    equipment: Option<bool>,
    independent_materials: Option<Vec<String>>,
}

impl Fields {
    fn apply(self, o: UncertaintyOptions) -> PyResult<PyUncertainty> {
        type U = UncertaintyOptions;
        let b = |o: U, v: Option<bool>, set: fn(U, bool) -> U| match v {
            Some(v) => set(o, v),
            None => o,
        };
        let f = |o: U, v: Option<f64>, set: fn(U, f64) -> hydrograde::Result<U>| match v {
            Some(v) => set(o, v).py(),
            None => Ok(o),
        };
        let o = match self.independent_materials {
            Some(m) => o.with_independent_materials(m).py()?,
            None => o,
        };
        let o = f(o, self.turbulent_model, U::with_turbulent_model)?;
        let o = f(o, self.laminar_model, U::with_laminar_model)?;
        let o = f(o, self.non_circular_model, U::with_non_circular_model)?;
        let o = f(o, self.roughness_default, U::with_roughness_default)?;
        let o = f(o, self.diameter, U::with_diameter)?;
        let o = b(o, self.friction_model, U::with_friction_model);
        let o = b(o, self.roughness, U::with_roughness);
        let o = b(o, self.fluid, U::with_fluid);
        let o = b(o, self.fittings, U::with_fittings);
        let o = b(o, self.equipment, U::with_equipment);
        Ok(PyUncertainty { inner: o })
    }
}

impl PyUncertainty {
    /// Options from a preset name or an `Uncertainty` (the `uncertainty=` argument).
    pub fn from_arg(obj: &Bound<'_, PyAny>) -> PyResult<UncertaintyOptions> {
        if let Ok(u) = obj.cast::<PyUncertainty>() {
            return Ok(u.get().inner.clone());
        }
        if let Ok(name) = obj.extract::<String>() {
            return UncertaintyOptions::preset(&name).py();
        }
        Err(PyTypeError::new_err(format!(
            "uncertainty: expected a preset name ({}) or an Uncertainty, got {}",
            UncertaintyOptions::PRESETS.join(", "),
            obj.get_type().name()?
        )))
    }
}

#[pymethods]
impl PyUncertainty {
    #[new]
    #[pyo3(signature = (*, friction_model = None, turbulent_model = None, laminar_model = None, non_circular_model = None, roughness = None, roughness_default = None, diameter = None, fluid = None, fittings = None, equipment = None, independent_materials = None))]
    #[allow(clippy::too_many_arguments)]
    fn new(
        friction_model: Option<bool>,
        turbulent_model: Option<f64>,
        laminar_model: Option<f64>,
        non_circular_model: Option<f64>,
        roughness: Option<bool>,
        roughness_default: Option<f64>,
        diameter: Option<f64>,
        fluid: Option<bool>,
        fittings: Option<bool>,
        equipment: Option<bool>,
        independent_materials: Option<Vec<String>>,
    ) -> PyResult<Self> {
        Fields {
            friction_model,
            turbulent_model,
            laminar_model,
            non_circular_model,
            roughness,
            roughness_default,
            diameter,
            fluid,
            fittings,
            equipment,
            independent_materials,
        }
        .apply(UncertaintyOptions::default())
    }
    /// A copy with the given fields changed (same keywords as the constructor).
    #[pyo3(signature = (*, friction_model = None, turbulent_model = None, laminar_model = None, non_circular_model = None, roughness = None, roughness_default = None, diameter = None, fluid = None, fittings = None, equipment = None, independent_materials = None))]
    #[allow(clippy::too_many_arguments)]
    fn replace(
        &self,
        friction_model: Option<bool>,
        turbulent_model: Option<f64>,
        laminar_model: Option<f64>,
        non_circular_model: Option<f64>,
        roughness: Option<bool>,
        roughness_default: Option<f64>,
        diameter: Option<f64>,
        fluid: Option<bool>,
        fittings: Option<bool>,
        equipment: Option<bool>,
        independent_materials: Option<Vec<String>>,
    ) -> PyResult<Self> {
        Fields {
            friction_model,
            turbulent_model,
            laminar_model,
            non_circular_model,
            roughness,
            roughness_default,
            diameter,
            fluid,
            fittings,
            equipment,
            independent_materials,
        }
        .apply(self.inner.clone())
    }
    /// The core preset ``name``: ``"default"``, ``"none"`` (zero-width bands) or
    /// ``"model_only"`` (only the friction model).
    #[classmethod]
    fn preset(_cls: &Bound<'_, PyType>, name: &str) -> PyResult<Self> {
        Ok(PyUncertainty {
            inner: UncertaintyOptions::preset(name).py()?,
        })
    }
    /// The names :meth:`preset` accepts.
    #[staticmethod]
    fn presets() -> Vec<&'static str> {
        UncertaintyOptions::PRESETS.to_vec()
    }
    /// Include the friction correlation's model uncertainty.
    #[getter]
    fn friction_model(&self) -> bool {
        self.inner.friction_model()
    }
    /// Model uncertainty of turbulent round-pipe friction (relative, k = 1).
    #[getter]
    fn turbulent_model(&self) -> f64 {
        self.inner.turbulent_model()
    }
    /// Model uncertainty of laminar friction (relative, k = 1).
    #[getter]
    fn laminar_model(&self) -> f64 {
        self.inner.laminar_model()
    }
    /// Model uncertainty of non-circular turbulent friction (relative, k = 1).
    #[getter]
    fn non_circular_model(&self) -> f64 {
        self.inner.non_circular_model()
    }
    /// Include wall roughness.
    #[getter]
    fn roughness(&self) -> bool {
        self.inner.roughness()
    }
    /// Roughness uncertainty of pipes with no material range (relative, k = 1).
    #[getter]
    fn roughness_default(&self) -> f64 {
        self.inner.roughness_default()
    }
    /// Uncertainty of every bore (relative, k = 1).
    #[getter]
    fn diameter(&self) -> f64 {
        self.inner.diameter()
    }
    /// Include the fluid's density and viscosity uncertainties.
    #[getter]
    fn fluid(&self) -> bool {
        self.inner.fluid()
    }
    /// Include fitting K spreads.
    #[getter]
    fn fittings(&self) -> bool {
        self.inner.fittings()
    }
    /// Include equipment spreads.
    #[getter]
    fn equipment(&self) -> bool {
        self.inner.equipment()
    }
    /// Catalogue materials whose pipes each get their own roughness error (every other
    /// material's pipes share one).
    #[getter]
    fn independent_materials(&self) -> Vec<String> {
        self.inner.independent_materials().to_vec()
    }
    /// The fields as a dict.
    fn to_dict<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyDict>> {
        uncertainty_dict(py, &self.inner)
    }
    fn _repr_html_(&self, py: Python<'_>) -> PyResult<String> {
        state::html(py, "Uncertainty", &self.to_dict(py)?)
    }
    fn __repr__(&self) -> String {
        let o = &self.inner;
        let b = |v: bool| if v { "True" } else { "False" };
        format!(
            "Uncertainty(friction_model={}, turbulent_model={:?}, laminar_model={:?}, \
             non_circular_model={:?}, roughness={}, roughness_default={:?}, diameter={:?}, \
             fluid={}, fittings={}, equipment={}, independent_materials={:?})",
            b(o.friction_model()),
            o.turbulent_model(),
            o.laminar_model(),
            o.non_circular_model(),
            b(o.roughness()),
            o.roughness_default(),
            o.diameter(),
            b(o.fluid()),
            b(o.fittings()),
            b(o.equipment()),
            o.independent_materials()
        )
    }
    fn __reduce__<'py>(
        slf: &Bound<'py, Self>,
    ) -> PyResult<(Bound<'py, PyAny>, (Bound<'py, PyBytes>,))> {
        state::reduce(slf.as_any(), &slf.get().inner)
    }
    #[classmethod]
    fn _from_state(_cls: &Bound<'_, PyType>, state: &[u8]) -> PyResult<Self> {
        let inner: UncertaintyOptions = state::loads(state)?;
        inner.validate().py()?;
        Ok(PyUncertainty { inner })
    }
}

/// The dict form of uncertainty options.
pub fn uncertainty_dict<'py>(
    py: Python<'py>,
    o: &UncertaintyOptions,
) -> PyResult<Bound<'py, PyDict>> {
    let d = PyDict::new(py);
    d.set_item("friction_model", o.friction_model())?;
    d.set_item("turbulent_model", o.turbulent_model())?;
    d.set_item("laminar_model", o.laminar_model())?;
    d.set_item("non_circular_model", o.non_circular_model())?;
    d.set_item("roughness", o.roughness())?;
    d.set_item("roughness_default", o.roughness_default())?;
    d.set_item("diameter", o.diameter())?;
    d.set_item("fluid", o.fluid())?;
    d.set_item("fittings", o.fittings())?;
    d.set_item("equipment", o.equipment())?;
    d.set_item("independent_materials", o.independent_materials().to_vec())?;
    Ok(d)
}

/// The result of :func:`monte_carlo`: the sampled required head of a line (m).
#[pyclass(name = "MonteCarlo", module = "hydrograde._native", frozen, eq)]
#[derive(Clone, PartialEq)]
pub struct PyMonteCarlo {
    /// The core value.
    pub inner: MonteCarlo,
}

#[pymethods]
impl PyMonteCarlo {
    /// Number of samples.
    #[getter]
    fn samples(&self) -> usize {
        self.inner.samples
    }
    /// Sample mean of the required head, m.
    #[getter]
    fn mean(&self) -> f64 {
        self.inner.mean
    }
    /// Sample standard deviation of the required head, m.
    #[getter]
    fn std_dev(&self) -> f64 {
        self.inner.std_dev
    }
    /// 2.5 % quantile of the required head, m.
    #[getter]
    fn low(&self) -> f64 {
        self.inner.low
    }
    /// 97.5 % quantile of the required head, m.
    #[getter]
    fn high(&self) -> f64 {
        self.inner.high
    }
    /// The fields as a dict.
    fn to_dict<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyDict>> {
        let d = PyDict::new(py);
        d.set_item("samples", self.inner.samples)?;
        d.set_item("mean", self.inner.mean)?;
        d.set_item("std_dev", self.inner.std_dev)?;
        d.set_item("low", self.inner.low)?;
        d.set_item("high", self.inner.high)?;
        Ok(d)
    }
    fn _repr_html_(&self, py: Python<'_>) -> PyResult<String> {
        state::html(py, "MonteCarlo", &self.to_dict(py)?)
    }
    fn __repr__(&self) -> String {
        let m = &self.inner;
        format!(
            "MonteCarlo(samples={}, mean={:?}, std_dev={:?}, low={:?}, high={:?})",
            m.samples, m.mean, m.std_dev, m.low, m.high
        )
    }
    fn __reduce__<'py>(
        slf: &Bound<'py, Self>,
    ) -> PyResult<(Bound<'py, PyAny>, (Bound<'py, PyBytes>,))> {
        state::reduce(slf.as_any(), &slf.get().inner)
    }
    #[classmethod]
    fn _from_state(_cls: &Bound<'_, PyType>, state: &[u8]) -> PyResult<Self> {
        Ok(PyMonteCarlo {
            inner: state::loads(state)?,
        })
    }
}

/// Samples ``line``'s required head (m) at ``flow`` (m³/s) ``samples`` times (100 to
/// 10,000,000, default the core's ``MONTE_CARLO_SAMPLES``) from generator ``seed``, with the line's
/// uncertainty options: a Monte Carlo check (JCGM 101:2008) of the first-order band.
/// Reproducible: the same seed gives the same numbers. Runs with the GIL released.
#[pyfunction]
#[pyo3(signature = (line, fluid, flow, samples = None, seed = 0))]
pub fn monte_carlo(
    py: Python<'_>,
    line: &PyLine,
    fluid: &PyFluid,
    #[pyo3(from_py_with = crate::arrays::si::flow)] flow: f64,
    samples: Option<&Bound<'_, PyAny>>,
    seed: u64,
) -> PyResult<PyMonteCarlo> {
    let samples = match samples {
        Some(s) => crate::errors::whole_number("samples", s)?,
        None => MONTE_CARLO_SAMPLES,
    };
    let m = py
        .detach(|| core_monte_carlo(&line.inner, &fluid.inner, flow, samples, seed))
        .py()?;
    Ok(PyMonteCarlo { inner: m })
}

/// The Monte Carlo interval offered when ``line``'s required-head band at ``flow`` (m³/s)
/// flags itself non-linear (``Band.non_linear``: wider than ±20 % of its value, or a pipe
/// whose Reynolds number reaches into the laminar–turbulent transition): a ``MonteCarlo``
/// of 20,000 samples from seed 101 (the same bits as Rust and C), whose ``low`` and
/// ``high`` are the 95 % interval to use; ``None`` when the first-order band stands.
/// Runs with the GIL released.
#[pyfunction]
pub fn band_monte_carlo(
    py: Python<'_>,
    line: &PyLine,
    fluid: &PyFluid,
    #[pyo3(from_py_with = crate::arrays::si::flow)] flow: f64,
) -> PyResult<Option<PyMonteCarlo>> {
    let m = py
        .detach(|| core_band_monte_carlo(&line.inner, &fluid.inner, flow))
        .py()?;
    Ok(m.map(|inner| PyMonteCarlo { inner }))
}
