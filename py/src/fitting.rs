//! `hydrograde.Fitting`: minor-loss elements.

use crate::arrays::{self, si};
use crate::errors::CoreResult;
use crate::state;
use hydrograde::fitting::{Edge, Fitting, catalogue_entries};
use hydrograde::line::Tag;
use pyo3::prelude::*;
use pyo3::types::{PyBytes, PyDict, PyList, PyType};

/// A minor-loss element: a method giving the resistance coefficient K, the bore (m)
/// whose velocity K refers to, and the relative spread of K used by the bands.
///
/// ``diameter`` (m) is the bore K refers to; when omitted the fitting takes the inside
/// diameter of the pipe before it in a line (of the pipe after it when it stands first).
/// Methods: fixed K; equivalent length L/D; 2-K (Hooper 1981); 3-K (Darby 1999, 2001);
/// sudden expansion (Borda–Carnot) and contraction; entrances, exit, bends; valve Cv
/// (US gpm at 1 psi) and Kv (m³/h at 1 bar); and the named catalogue
/// (:meth:`catalogue`). Fitting data scatter widely (±20–50 %, common practice).
#[pyclass(name = "Fitting", module = "hydrograde._native", frozen, eq)]
#[derive(Clone, PartialEq)]
pub struct PyFitting {
    /// The core value.
    pub inner: Fitting,
    /// The label and count it carries into a line.
    pub tag: Tag,
}

/// A fitting with the label and count given to its constructor.
fn tagged(f: PyResult<PyFitting>, label: Option<&str>, count: i64) -> PyResult<PyFitting> {
    Ok(PyFitting {
        tag: Tag::new(label, count).py()?,
        ..f?
    })
}

fn wrap(f: hydrograde::Result<Fitting>, diameter: Option<f64>) -> PyResult<PyFitting> {
    let mut f = f.py()?;
    if let Some(d) = diameter {
        f = f.with_diameter(d).py()?;
    }
    Ok(PyFitting {
        inner: f,
        tag: Tag::default(),
    })
}

/// The method's own parameters as a dict (from the core's serde form).
fn parameters<'py>(py: Python<'py>, f: &Fitting) -> PyResult<Bound<'py, PyDict>> {
    let d = PyDict::new(py);
    let value = serde_json::to_value(f.method())
        .map_err(|e| pyo3::exceptions::PyValueError::new_err(e.to_string()))?;
    // The core tags the method internally: {"method": "three_k", "k1": …, …}.
    if let Some(fields) = value.as_object() {
        for (k, v) in fields.iter().filter(|(k, _)| k.as_str() != "method") {
            match v.as_str() {
                Some(text) => d.set_item(k, text)?,
                None => d.set_item(k, v.as_f64())?,
            }
        }
    }
    Ok(d)
}

#[pymethods]
impl PyFitting {
    /// A fixed resistance coefficient ``value`` (dimensionless, ≥ 0).
    #[classmethod]
    #[pyo3(signature = (value, diameter = None, *, label = None, count = 1))]
    fn k(
        _cls: &Bound<'_, PyType>,
        #[pyo3(from_py_with = si::value)] value: f64,
        #[pyo3(from_py_with = si::opt_diameter)] diameter: Option<f64>,
        label: Option<&str>,
        count: i64,
    ) -> PyResult<Self> {
        tagged(wrap(Fitting::k(value), diameter), label, count)
    }
    /// A catalogue fitting by ``name`` (see :meth:`catalogue`).
    #[classmethod]
    #[pyo3(signature = (name, diameter = None, *, label = None, count = 1))]
    fn named(
        _cls: &Bound<'_, PyType>,
        name: &str,
        #[pyo3(from_py_with = si::opt_diameter)] diameter: Option<f64>,
        label: Option<&str>,
        count: i64,
    ) -> PyResult<Self> {
        tagged(wrap(Fitting::named(name), diameter), label, count)
    }
    /// An equivalent length ``l_over_d`` (L/D, dimensionless): K = f_T·L/D with the fully
    /// rough friction factor f_T of the adjoining pipe.
    #[classmethod]
    #[pyo3(signature = (l_over_d, diameter = None, *, label = None, count = 1))]
    fn equivalent_length(
        _cls: &Bound<'_, PyType>,
        #[pyo3(from_py_with = si::l_over_d)] l_over_d: f64,
        #[pyo3(from_py_with = si::opt_diameter)] diameter: Option<f64>,
        label: Option<&str>,
        count: i64,
    ) -> PyResult<Self> {
        tagged(
            wrap(Fitting::equivalent_length(l_over_d), diameter),
            label,
            count,
        )
    }
    /// The 2-K method (Hooper 1981): K = k1/Re + k_inf·(1 + 1/D[in]).
    #[classmethod]
    #[pyo3(signature = (k1, k_inf, diameter = None, *, label = None, count = 1))]
    fn two_k(
        _cls: &Bound<'_, PyType>,
        #[pyo3(from_py_with = si::k1)] k1: f64,
        #[pyo3(from_py_with = si::k_inf)] k_inf: f64,
        #[pyo3(from_py_with = si::opt_diameter)] diameter: Option<f64>,
        label: Option<&str>,
        count: i64,
    ) -> PyResult<Self> {
        tagged(wrap(Fitting::two_k(k1, k_inf), diameter), label, count)
    }
    /// The 3-K method (Darby 1999, 2001): K = k1/Re + k_inf·(1 + k_d/D[in]^0.3).
    #[classmethod]
    #[pyo3(signature = (k1, k_inf, k_d, diameter = None, *, label = None, count = 1))]
    fn three_k(
        _cls: &Bound<'_, PyType>,
        #[pyo3(from_py_with = si::k1)] k1: f64,
        #[pyo3(from_py_with = si::k_inf)] k_inf: f64,
        #[pyo3(from_py_with = si::k_d)] k_d: f64,
        #[pyo3(from_py_with = si::opt_diameter)] diameter: Option<f64>,
        label: Option<&str>,
        count: i64,
    ) -> PyResult<Self> {
        tagged(
            wrap(Fitting::three_k(k1, k_inf, k_d), diameter),
            label,
            count,
        )
    }
    /// A sudden expansion from bore ``d_in`` to ``d_out`` (m): Borda–Carnot, K on the
    /// inlet velocity.
    #[classmethod]
    #[pyo3(signature = (d_in, d_out, *, label = None, count = 1))]
    fn expansion(
        _cls: &Bound<'_, PyType>,
        #[pyo3(from_py_with = si::d_in)] d_in: f64,
        #[pyo3(from_py_with = si::d_out)] d_out: f64,
        label: Option<&str>,
        count: i64,
    ) -> PyResult<Self> {
        tagged(wrap(Fitting::expansion(d_in, d_out), None), label, count)
    }
    /// A sudden contraction from bore ``d_in`` to ``d_out`` (m), K on the outlet velocity.
    #[classmethod]
    #[pyo3(signature = (d_in, d_out, *, label = None, count = 1))]
    fn contraction(
        _cls: &Bound<'_, PyType>,
        #[pyo3(from_py_with = si::d_in)] d_in: f64,
        #[pyo3(from_py_with = si::d_out)] d_out: f64,
        label: Option<&str>,
        count: i64,
    ) -> PyResult<Self> {
        tagged(wrap(Fitting::contraction(d_in, d_out), None), label, count)
    }
    /// An inlet from a tank through a pipe end with edge ``edge``: ``"square"``
    /// (sharp-edged entrance, K = 0.5), ``"rounded"`` (K from ``r_over_d``, the rounding
    /// radius over the bore, given only for this edge) or ``"reentrant"`` (the pipe
    /// projects into the tank, K = 0.78). Reverse flow makes it an outlet into the tank.
    #[classmethod]
    #[pyo3(signature = (edge = "square", r_over_d = None, *, label = None, count = 1))]
    fn from_tank(
        _cls: &Bound<'_, PyType>,
        edge: &str,
        #[pyo3(from_py_with = si::opt_r_over_d)] r_over_d: Option<f64>,
        label: Option<&str>,
        count: i64,
    ) -> PyResult<Self> {
        tagged(
            wrap(
                Edge::named(edge, r_over_d).and_then(Fitting::from_tank),
                None,
            ),
            label,
            count,
        )
    }
    /// An outlet into a tank (the velocity head is lost, K = 1). Reverse flow makes it a
    /// square-edged inlet from the tank.
    #[classmethod]
    #[pyo3(signature = (*, label = None, count = 1))]
    fn into_tank(_cls: &Bound<'_, PyType>, label: Option<&str>, count: i64) -> PyResult<Self> {
        tagged(wrap(Ok(Fitting::into_tank()), None), label, count)
    }
    /// A bend of ``angle_deg`` (degrees) and bend radius ratio ``r_over_d``.
    #[classmethod]
    #[pyo3(signature = (angle_deg, r_over_d, diameter = None, *, label = None, count = 1))]
    fn bend(
        _cls: &Bound<'_, PyType>,
        #[pyo3(from_py_with = si::angle_deg)] angle_deg: f64,
        #[pyo3(from_py_with = si::r_over_d)] r_over_d: f64,
        #[pyo3(from_py_with = si::opt_diameter)] diameter: Option<f64>,
        label: Option<&str>,
        count: i64,
    ) -> PyResult<Self> {
        tagged(
            wrap(Fitting::bend(angle_deg, r_over_d), diameter),
            label,
            count,
        )
    }
    /// A valve of flow coefficient Cv ``value`` (US gpm of water at 1 psi drop); K is
    /// referred to ``diameter`` (or the adjoining pipe's bore).
    #[classmethod]
    #[pyo3(signature = (value, diameter = None, *, label = None, count = 1))]
    fn cv(
        _cls: &Bound<'_, PyType>,
        #[pyo3(from_py_with = si::value)] value: f64,
        #[pyo3(from_py_with = si::opt_diameter)] diameter: Option<f64>,
        label: Option<&str>,
        count: i64,
    ) -> PyResult<Self> {
        tagged(wrap(Fitting::cv(value), diameter), label, count)
    }
    /// A valve of flow coefficient Kv ``value`` (m³/h of water at 1 bar drop).
    #[classmethod]
    #[pyo3(signature = (value, diameter = None, *, label = None, count = 1))]
    fn kv(
        _cls: &Bound<'_, PyType>,
        #[pyo3(from_py_with = si::value)] value: f64,
        #[pyo3(from_py_with = si::opt_diameter)] diameter: Option<f64>,
        label: Option<&str>,
        count: i64,
    ) -> PyResult<Self> {
        tagged(wrap(Fitting::kv(value), diameter), label, count)
    }
    /// A tee, flow through the run.
    #[classmethod]
    #[pyo3(signature = (*, label = None, count = 1))]
    fn tee_run(_cls: &Bound<'_, PyType>, label: Option<&str>, count: i64) -> PyResult<Self> {
        tagged(wrap(Ok(Fitting::tee_run()), None), label, count)
    }
    /// A tee, flow through the branch.
    #[classmethod]
    #[pyo3(signature = (*, label = None, count = 1))]
    fn tee_branch(_cls: &Bound<'_, PyType>, label: Option<&str>, count: i64) -> PyResult<Self> {
        tagged(wrap(Ok(Fitting::tee_branch()), None), label, count)
    }
    /// The catalogue: one dict per named fitting with ``name``, ``description``,
    /// ``method``, ``k_spread`` and ``source``.
    #[classmethod]
    fn catalogue<'py>(cls: &Bound<'py, PyType>) -> PyResult<Bound<'py, PyList>> {
        let py = cls.py();
        let rows = PyList::empty(py);
        for e in catalogue_entries() {
            let d = PyDict::new(py);
            d.set_item("name", e.name)?;
            d.set_item("description", e.description)?;
            d.set_item("method", e.method.name())?;
            d.set_item("k_spread", e.k_spread)?;
            d.set_item("source", e.source)?;
            rows.append(d)?;
        }
        Ok(rows)
    }
    /// The same fitting with K referring to bore ``diameter`` (m).
    fn with_diameter(&self, #[pyo3(from_py_with = si::diameter)] diameter: f64) -> PyResult<Self> {
        Ok(PyFitting {
            tag: self.tag.clone(),
            ..wrap(Ok(self.inner.clone()), Some(diameter))?
        })
    }
    /// The same fitting with relative spread ``k_spread`` of K (0…1; 0.3 = ±30 %).
    fn with_k_spread(&self, #[pyo3(from_py_with = si::k_spread)] k_spread: f64) -> PyResult<Self> {
        Ok(PyFitting {
            inner: self.inner.clone().with_k_spread(k_spread).py()?,
            tag: self.tag.clone(),
        })
    }
    /// The catalogue name, or the method's name.
    #[getter]
    fn name(&self) -> String {
        self.inner.name()
    }
    /// The method's name: "k", "two_k", "three_k", "expansion", "cv" …
    #[getter]
    fn method(&self) -> &'static str {
        self.inner.method().name()
    }
    /// The method's own parameters as a dict.
    #[getter]
    fn parameters<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyDict>> {
        parameters(py, &self.inner)
    }
    /// Bore (m) whose velocity K refers to; None = the adjoining pipe's.
    #[getter]
    fn diameter(&self) -> Option<f64> {
        self.inner.diameter()
    }
    /// Where the fitting's data come from.
    #[getter]
    fn source(&self) -> &'static str {
        self.inner.source()
    }
    /// True for a fitting that stops reverse flow (check and foot valves).
    #[getter]
    fn blocks_reverse_flow(&self) -> bool {
        self.inner.blocks_reverse_flow()
    }
    /// Relative half-width of the likely range of K (rectangular distribution).
    #[getter]
    fn k_spread(&self) -> f64 {
        self.inner.k_spread()
    }
    /// K (dimensionless, on the velocity in ``bore``) at Reynolds number ``re`` (in
    /// ``bore``), bore ``bore`` (m) and relative roughness ``pipe_rel_roughness`` of the
    /// adjoining pipe. All three broadcast.
    fn k_at<'py>(
        &self,
        py: Python<'py>,
        re: &Bound<'py, PyAny>,
        bore: &Bound<'py, PyAny>,
        pipe_rel_roughness: &Bound<'py, PyAny>,
    ) -> PyResult<Bound<'py, PyAny>> {
        let f = &self.inner;
        arrays::map(
            py,
            ["re", "bore", "pipe_rel_roughness"],
            [re, bore, pipe_rel_roughness],
            |[r, b, e]| f.k_at(r, b, e).map(|(k, _)| k),
        )
    }
    /// ``(k_viscous, k_inertial)``: K split as k_viscous/Re + k_inertial, with the
    /// velocity and Reynolds number taken in ``bore`` (m, > 0); ``pipe_rel_roughness`` is
    /// ε/D of the adjoining pipe (0…0.5; L/D fittings and bends use its fully rough
    /// friction factor).
    fn resistance(
        &self,
        #[pyo3(from_py_with = si::bore)] bore: f64,
        #[pyo3(from_py_with = si::pipe_rel_roughness)] pipe_rel_roughness: f64,
    ) -> PyResult<(f64, f64)> {
        let r = self.inner.resistance(bore, pipe_rel_roughness).py()?;
        Ok((r.k_viscous, r.k_inertial))
    }
    /// The fields as a dict.
    fn to_dict<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyDict>> {
        let d = PyDict::new(py);
        d.set_item("name", self.name())?;
        d.set_item("method", self.method())?;
        d.update(parameters(py, &self.inner)?.as_mapping())?;
        d.set_item("diameter", self.diameter())?;
        d.set_item("k_spread", self.k_spread())?;
        d.set_item("source", self.source())?;
        Ok(d)
    }
    /// A one-row pandas DataFrame (needs pandas).
    fn to_dataframe<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyAny>> {
        state::dataframe(py, &self.to_dict(py)?)
    }
    fn _repr_html_(&self, py: Python<'_>) -> PyResult<String> {
        state::html(py, "Fitting", &self.to_dict(py)?)
    }
    fn __repr__(&self, py: Python<'_>) -> PyResult<String> {
        let params = parameters(py, &self.inner)?;
        let mut args: Vec<String> = params
            .iter()
            .map(|(k, v)| Ok(format!("{}={}", k.str()?, v.repr()?)))
            .collect::<PyResult<_>>()?;
        if let Some(d) = self.inner.diameter() {
            args.push(format!("diameter={d:?}"));
        }
        args.push(format!("k_spread={:?}", self.inner.k_spread()));
        Ok(format!(
            "Fitting('{}', {}{})",
            self.name(),
            args.join(", "),
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
        Ok(PyFitting { inner, tag })
    }
    /// The label given (``None``: the line's default, kind and index).
    #[getter]
    fn label(&self) -> Option<&str> {
        self.tag.label()
    }
    /// How many identical fittings this stands for in a line (one row, N·K).
    #[getter]
    fn count(&self) -> u32 {
        self.tag.count()
    }
}
