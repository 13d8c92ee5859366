//! `hydrograde.Pipe`, `Rise` and `Equipment`: the elements of a line besides fittings.

use crate::arrays::{self, si};
use crate::errors::CoreResult;
use crate::fitting::PyFitting;
use crate::fluid::PyFluid;
use crate::section::PySection;
use crate::state;
use hydrograde::line::{Element, Equipment, Rating, Rise, Tag};
use hydrograde::pipe::Pipe;
use pyo3::exceptions::PyTypeError;
use pyo3::prelude::*;
use pyo3::types::{PyBytes, PyDict, PyType};

/// A straight run: a :class:`Section` (or the inside diameter of a round pipe, m),
/// ``length`` (m, > 0) and absolute wall ``roughness`` (m, ≥ 0, below half the
/// hydraulic diameter). Friction from the Darcy–Weisbach equation with the core's
/// friction factor (Colebrook solved exactly by default).
#[pyclass(name = "Pipe", module = "hydrograde._native", frozen, eq)]
#[derive(Clone, PartialEq)]
pub struct PyPipe {
    /// The core value.
    pub inner: Pipe,
    /// The label it carries into a line.
    pub tag: Tag,
}

#[pymethods]
impl PyPipe {
    #[new]
    #[pyo3(signature = (section, length, roughness, *, label = None))]
    fn new(
        section: &Bound<'_, PyAny>,
        #[pyo3(from_py_with = si::length)] length: f64,
        #[pyo3(from_py_with = si::roughness)] roughness: f64,
        label: Option<&str>,
    ) -> PyResult<Self> {
        let pipe = if let Ok(s) = section.cast::<PySection>() {
            Pipe::new(s.get().inner, length, roughness)
        } else {
            let d = crate::friction::scalar("section", section)?;
            Pipe::circular(d, length, roughness)
        };
        Ok(PyPipe {
            inner: pipe.py()?,
            tag: Tag::new(label, 1).py()?,
        })
    }
    /// A run of catalogue wall ``material`` (see :func:`materials`): its typical
    /// roughness, with the material's low–high range carried into the bands.
    #[classmethod]
    #[pyo3(signature = (section, length, material, *, label = None))]
    fn of_material(
        _cls: &Bound<'_, PyType>,
        section: &Bound<'_, PyAny>,
        #[pyo3(from_py_with = si::length)] length: f64,
        material: &str,
        label: Option<&str>,
    ) -> PyResult<Self> {
        let s = if let Ok(s) = section.cast::<PySection>() {
            s.get().inner
        } else {
            hydrograde::Section::circle(crate::friction::scalar("section", section)?).py()?
        };
        Ok(PyPipe {
            inner: Pipe::of_material(s, length, material).py()?,
            tag: Tag::new(label, 1).py()?,
        })
    }
    /// Likely (low, high) roughness, m, when stated (from a catalogue material).
    #[getter]
    fn roughness_range(&self) -> Option<(f64, f64)> {
        self.inner.roughness_range()
    }
    /// The cross-section.
    #[getter]
    fn section(&self) -> PySection {
        PySection {
            inner: *self.inner.section(),
        }
    }
    /// Length, m.
    #[getter]
    fn length(&self) -> f64 {
        self.inner.length()
    }
    /// Absolute wall roughness, m.
    #[getter]
    fn roughness(&self) -> f64 {
        self.inner.roughness()
    }
    /// The bore fittings beside it refer their K to (hydraulic diameter), m.
    #[getter]
    fn bore(&self) -> f64 {
        self.inner.bore()
    }
    /// Relative roughness ε/D_h.
    #[getter]
    fn rel_roughness(&self) -> f64 {
        self.inner.rel_roughness()
    }
    /// ``(head_loss, dhead_dflow)`` at signed volumetric ``flow`` (m³/s) with the core's
    /// default friction options: the head loss (m of the flowing fluid, odd in flow) and
    /// its derivative with respect to flow (s/m², continuous through zero), the pair a
    /// Newton solver needs. ``flow`` may be an array: both come back as arrays of its
    /// shape.
    fn head_loss<'py>(
        &self,
        py: Python<'py>,
        fluid: &PyFluid,
        flow: &Bound<'py, PyAny>,
    ) -> PyResult<(Bound<'py, PyAny>, Bound<'py, PyAny>)> {
        let (p, f) = (&self.inner, &fluid.inner);
        let h = arrays::map(py, ["flow"], [flow], |[q]| p.head_loss(f, q).map(|r| r.0))?;
        let dh = arrays::map(py, ["flow"], [flow], |[q]| p.head_loss(f, q).map(|r| r.1))?;
        Ok((h, dh))
    }
    /// The same run (length, roughness and its range) with a round section of inside
    /// ``diameter`` (m).
    fn with_diameter(&self, #[pyo3(from_py_with = si::diameter)] diameter: f64) -> PyResult<Self> {
        Ok(PyPipe {
            inner: self.inner.with_diameter(diameter).py()?,
            tag: self.tag.clone(),
        })
    }
    /// The fields as a dict.
    fn to_dict<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyDict>> {
        let d = PyDict::new(py);
        d.set_item("shape", self.inner.section().shape_name())?;
        d.update(crate::section::dimensions(py, self.inner.section())?.as_mapping())?;
        d.set_item("length", self.inner.length())?;
        d.set_item("roughness", self.inner.roughness())?;
        d.set_item("rel_roughness", self.inner.rel_roughness())?;
        Ok(d)
    }
    fn _repr_html_(&self, py: Python<'_>) -> PyResult<String> {
        state::html(py, "Pipe", &self.to_dict(py)?)
    }
    fn __repr__(&self, py: Python<'_>) -> PyResult<String> {
        let section = if let hydrograde::Shape::Circle { diameter } = self.inner.section().shape() {
            format!("{diameter:?}")
        } else {
            Bound::new(py, self.section())?.repr()?.to_string()
        };
        Ok(format!(
            "Pipe({section}, length={:?}, roughness={:?}{})",
            self.inner.length(),
            self.inner.roughness(),
            state::tag_repr(&self.tag)
        ))
    }
    fn __reduce__<'py>(
        slf: &Bound<'py, Self>,
    ) -> PyResult<(Bound<'py, PyAny>, (Bound<'py, PyBytes>,))> {
        state::reduce_tagged(slf.as_any(), &slf.get().inner, &slf.get().tag)
    }
    #[classmethod]
    fn _from_state(_cls: &Bound<'_, PyType>, state: &[u8]) -> PyResult<Self> {
        let (inner, tag) = state::loads_tagged(state)?;
        Ok(PyPipe { inner, tag })
    }
    /// The label given (``None``: the line's default, kind and index).
    #[getter]
    fn label(&self) -> Option<&str> {
        self.tag.label()
    }
}

/// An elevation change of ``height`` m in the flow direction (negative = a drop).
#[pyclass(name = "Rise", module = "hydrograde._native", frozen, eq)]
#[derive(Clone, PartialEq)]
pub struct PyRise {
    /// The core value.
    pub inner: Rise,
    /// The label it carries into a line.
    pub tag: Tag,
}

#[pymethods]
impl PyRise {
    #[new]
    #[pyo3(signature = (height, *, label = None))]
    fn new(#[pyo3(from_py_with = si::height)] height: f64, label: Option<&str>) -> PyResult<Self> {
        Ok(PyRise {
            inner: Rise::new(height).py()?,
            tag: Tag::new(label, 1).py()?,
        })
    }
    /// Height, m (positive up in the flow direction).
    #[getter]
    fn height(&self) -> f64 {
        self.inner.height()
    }
    fn __repr__(&self) -> String {
        format!("Rise({:?}{})", self.height(), state::tag_repr(&self.tag))
    }
    fn __reduce__<'py>(
        slf: &Bound<'py, Self>,
    ) -> PyResult<(Bound<'py, PyAny>, (Bound<'py, PyBytes>,))> {
        state::reduce_tagged(slf.as_any(), &slf.get().inner, &slf.get().tag)
    }
    #[classmethod]
    fn _from_state(_cls: &Bound<'_, PyType>, state: &[u8]) -> PyResult<Self> {
        let (inner, tag) = state::loads_tagged(state)?;
        Ok(PyRise { inner, tag })
    }
    /// The label given (``None``: the line's default, kind and index).
    #[getter]
    fn label(&self) -> Option<&str> {
        self.tag.label()
    }
}

/// Rated equipment: a component known by its rating rather than its geometry.
/// :meth:`pressure_drop` scales a rated drop (Pa at a flow, m³/s) with Q|Q| (common
/// practice for exchangers, filters, meters); :meth:`fixed_k` is a K on a bore (m).
#[pyclass(name = "Equipment", module = "hydrograde._native", frozen, eq)]
#[derive(Clone, PartialEq)]
pub struct PyEquipment {
    /// The core value.
    pub inner: Equipment,
    /// The label it carries into a line.
    pub tag: Tag,
}

#[pymethods]
impl PyEquipment {
    /// Equipment of rated pressure ``drop`` (Pa) at flow ``at_flow`` (m³/s) of a fluid
    /// of density ``rating_density`` (kg/m³; None = water at 20 °C): in another fluid
    /// the drop scales with ρ/ρ_rating and Q|Q|.
    #[classmethod]
    #[pyo3(signature = (name, drop, at_flow, rating_density = None, *, label = None))]
    fn pressure_drop(
        _cls: &Bound<'_, PyType>,
        name: &str,
        #[pyo3(from_py_with = si::drop)] drop: f64,
        #[pyo3(from_py_with = si::at_flow)] at_flow: f64,
        #[pyo3(from_py_with = si::opt_rating_density)] rating_density: Option<f64>,
        label: Option<&str>,
    ) -> PyResult<Self> {
        let e = Equipment::pressure_drop(name, drop, at_flow);
        let e = match rating_density {
            Some(rho) => e.and_then(|e| e.with_rating_density(rho)),
            None => e,
        };
        Ok(PyEquipment {
            inner: e.py()?,
            tag: Tag::new(label, 1).py()?,
        })
    }
    /// Equipment of fixed resistance coefficient ``k`` on bore ``diameter`` (m; None =
    /// the adjoining pipe's).
    #[classmethod]
    #[pyo3(signature = (name, k, diameter = None, *, label = None))]
    fn fixed_k(
        _cls: &Bound<'_, PyType>,
        name: &str,
        #[pyo3(from_py_with = si::k)] k: f64,
        #[pyo3(from_py_with = si::opt_diameter)] diameter: Option<f64>,
        label: Option<&str>,
    ) -> PyResult<Self> {
        Ok(PyEquipment {
            inner: Equipment::fixed_k(name, k, diameter).py()?,
            tag: Tag::new(label, 1).py()?,
        })
    }
    /// The same equipment with relative half-width ``spread`` of its loss (0.1 = ±10 %).
    fn with_spread(&self, #[pyo3(from_py_with = si::spread)] spread: f64) -> PyResult<Self> {
        Ok(PyEquipment {
            inner: self.inner.clone().with_spread(spread).py()?,
            tag: self.tag.clone(),
        })
    }
    /// The label given.
    #[getter]
    fn name(&self) -> &str {
        self.inner.name()
    }
    /// Relative half-width of the likely range of the loss.
    #[getter]
    fn spread(&self) -> f64 {
        self.inner.spread()
    }
    fn __repr__(&self) -> String {
        match self.inner.rating() {
            Rating::PressureDrop {
                drop,
                at_flow,
                rating_density,
            } => format!(
                "Equipment.pressure_drop('{}', drop={drop:?}, at_flow={at_flow:?}, rating_density={rating_density:?}, spread={:?}{})",
                self.inner.name(),
                self.inner.spread(),
                state::tag_repr(&self.tag)
            ),
            Rating::FixedK { k, diameter } => format!(
                "Equipment.fixed_k('{}', k={k:?}, diameter={}, spread={:?}{})",
                self.inner.name(),
                diameter.map_or("None".to_string(), |d| format!("{d:?}")),
                self.inner.spread(),
                state::tag_repr(&self.tag)
            ),
        }
    }
    fn __reduce__<'py>(
        slf: &Bound<'py, Self>,
    ) -> PyResult<(Bound<'py, PyAny>, (Bound<'py, PyBytes>,))> {
        state::reduce_tagged(slf.as_any(), &slf.get().inner, &slf.get().tag)
    }
    #[classmethod]
    fn _from_state(_cls: &Bound<'_, PyType>, state: &[u8]) -> PyResult<Self> {
        let (inner, tag) = state::loads_tagged(state)?;
        Ok(PyEquipment { inner, tag })
    }
    /// The label given (``None``: the line's default, kind and index).
    #[getter]
    fn label(&self) -> Option<&str> {
        self.tag.label()
    }
}

/// A core element from a Python Pipe, Fitting, Rise, Equipment or Pump.
pub fn element(obj: &Bound<'_, PyAny>, index: usize) -> PyResult<(Element, Tag)> {
    if let Ok(p) = obj.cast::<PyPipe>() {
        let p = p.get();
        return Ok((Element::Pipe(p.inner.clone()), p.tag.clone()));
    }
    if let Ok(f) = obj.cast::<PyFitting>() {
        let f = f.get();
        return Ok((Element::Fitting(f.inner.clone()), f.tag.clone()));
    }
    if let Ok(r) = obj.cast::<PyRise>() {
        let r = r.get();
        return Ok((Element::Rise(r.inner), r.tag.clone()));
    }
    if let Ok(e) = obj.cast::<PyEquipment>() {
        let e = e.get();
        return Ok((Element::Equipment(e.inner.clone()), e.tag.clone()));
    }
    if let Ok(p) = obj.cast::<crate::pump::PyPump>() {
        let p = p.get();
        return Ok((Element::Pump(p.inner.clone()), p.tag.clone()));
    }
    Err(PyTypeError::new_err(format!(
        "elements[{index}]: expected Pipe, Fitting, Rise, Equipment or Pump, got {}",
        obj.get_type().name()?
    )))
}
/// The Python object of a line element with its label and count.
pub fn element_object(py: Python<'_>, e: &Element, tag: Tag) -> PyResult<Py<PyAny>> {
    Ok(match e {
        Element::Pipe(p) => Py::new(
            py,
            PyPipe {
                inner: p.clone(),
                tag,
            },
        )?
        .into_any(),
        Element::Fitting(f) => Py::new(
            py,
            PyFitting {
                inner: f.clone(),
                tag,
            },
        )?
        .into_any(),
        Element::Rise(r) => Py::new(py, PyRise { inner: *r, tag })?.into_any(),
        Element::Equipment(q) => Py::new(
            py,
            PyEquipment {
                inner: q.clone(),
                tag,
            },
        )?
        .into_any(),
        Element::Pump(c) => Py::new(
            py,
            crate::pump::PyPump {
                inner: c.clone(),
                tag,
            },
        )?
        .into_any(),
    })
}
