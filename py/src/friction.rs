//! `hydrograde.darcy_factor`, `hydrograde.friction` and the `Friction` result.

use crate::arrays;
use crate::errors::CoreResult;
use crate::state;
use hydrograde::friction::{self as core, Correlation, Options, Transition};
use pyo3::exceptions::PyTypeError;
use pyo3::prelude::*;
use pyo3::types::{PyBytes, PyDict, PyType};

/// Friction options from keyword arguments; `None` keeps the core's default.
pub fn options(
    correlation: Option<&str>,
    laminar_constant: Option<f64>,
    laminar_limit: Option<f64>,
    turbulent_limit: Option<f64>,
    transition: Option<&str>,
) -> PyResult<Options> {
    let mut o = Options::default();
    if let Some(c) = correlation {
        o.correlation = c.parse::<Correlation>().py()?;
    }
    if let Some(v) = laminar_constant {
        o.laminar_constant = v;
    }
    if let Some(v) = laminar_limit {
        o.laminar_limit = v;
    }
    if let Some(v) = turbulent_limit {
        o.turbulent_limit = v;
    }
    if let Some(t) = transition {
        o.transition = t.parse::<Transition>().py()?;
    }
    o.validate().py()?;
    Ok(o)
}

/// The Darcy friction factor f (dimensionless) at Reynolds number ``re`` and relative
/// roughness ``rel_roughness`` = ε/D (both dimensionless).
///
/// Floats give a float; arrays (any shape, converted to float64) broadcast together and
/// give a float64 array. Laminar flow uses f = C/Re (C = ``laminar_constant``, 64 for a
/// circle; exact, Hagen–Poiseuille); turbulent flow the chosen correlation: ``"colebrook"``
/// (Colebrook 1939, solved exactly), ``"haaland"`` (Haaland 1983), ``"swamee_jain"``
/// (Swamee & Jain 1976), ``"churchill"`` (Churchill 1977), ``"serghides"`` (Serghides
/// 1984), ``"blasius"`` (Blasius 1913), ``"fully_rough"`` (Nikuradse 1933). ``None`` for
/// any option keeps the core's default: Colebrook, C = 64, regime limits 2300 and 4000
/// (common practice), a C¹ blend between them (``transition``: ``"blend"``,
/// ``"turbulent"`` or ``"refuse"``).
///
/// Raises NotFiniteError (NaN, inf), OutOfRangeError (re ≤ 0, ε/D < 0 …),
/// UnknownNameError (correlation), NoSolutionError (transitional flow with
/// ``transition="refuse"``), InvalidInputError (shapes that do not broadcast) and
/// TypeError (non-numeric input). An error in an array names the element's flat index.
#[pyfunction]
#[pyo3(signature = (re, rel_roughness, correlation=None, *, laminar_constant=None, laminar_limit=None, turbulent_limit=None, transition=None))]
#[allow(clippy::too_many_arguments)]
pub fn darcy_factor<'py>(
    py: Python<'py>,
    re: &Bound<'py, PyAny>,
    rel_roughness: &Bound<'py, PyAny>,
    correlation: Option<&str>,
    laminar_constant: Option<f64>,
    laminar_limit: Option<f64>,
    turbulent_limit: Option<f64>,
    transition: Option<&str>,
) -> PyResult<Bound<'py, PyAny>> {
    let o = options(
        correlation,
        laminar_constant,
        laminar_limit,
        turbulent_limit,
        transition,
    )?;
    if let Some(out) = batch_fast_path(py, re, rel_roughness, &o)? {
        return Ok(out);
    }
    // Broadcast views (re[:, None] against rr[None, :]) in place, through the core batch.
    let strided =
        |a: &core::Strided<'_>, b: &core::Strided<'_>, shape: &[usize], out: &mut [f64]| {
            core::darcy_factor_batch_strided(a, b, shape, &o, out)
        };
    if let Some(out) = crate::broadcast::broadcast2(py, [re, rel_roughness], strided)? {
        return Ok(out);
    }
    arrays::map(
        py,
        ["re", "rel_roughness"],
        [re, rel_roughness],
        |[r, e]| core::darcy_factor(r, e, &o).map(|fr| fr.f),
    )
}

/// The friction factor at one point with its sensitivities, regime and warnings, as a
/// :class:`Friction`. Arguments, defaults and errors as :func:`darcy_factor`; takes
/// numbers only (use :func:`darcy_factor` for arrays).
#[pyfunction]
#[pyo3(signature = (re, rel_roughness, correlation=None, *, laminar_constant=None, laminar_limit=None, turbulent_limit=None, transition=None))]
#[allow(clippy::too_many_arguments)]
pub fn friction(
    re: &Bound<'_, PyAny>,
    rel_roughness: &Bound<'_, PyAny>,
    correlation: Option<&str>,
    laminar_constant: Option<f64>,
    laminar_limit: Option<f64>,
    turbulent_limit: Option<f64>,
    transition: Option<&str>,
) -> PyResult<PyFriction> {
    let o = options(
        correlation,
        laminar_constant,
        laminar_limit,
        turbulent_limit,
        transition,
    )?;
    let r = scalar("re", re)?;
    let e = scalar("rel_roughness", rel_roughness)?;
    Ok(PyFriction {
        inner: core::darcy_factor(r, e, &o).py()?,
    })
}

/// A number argument of a function that takes no arrays.
pub fn scalar(name: &str, obj: &Bound<'_, PyAny>) -> PyResult<f64> {
    match arrays::Arg::extract(name, obj)? {
        arrays::Arg::Scalar(v) => Ok(v),
        arrays::Arg::Array(_) => Err(PyTypeError::new_err(format!(
            "{name}: expected a number, got an array"
        ))),
    }
}

/// The names of the turbulent correlations, in the core's order.
#[pyfunction]
pub fn correlations() -> Vec<&'static str> {
    Correlation::ALL.iter().map(|c| c.name()).collect()
}

/// The published validity range and accuracy of a correlation as a dict: ``re_min``,
/// ``re_max``, ``rel_roughness_min``, ``rel_roughness_max`` (dimensionless) and
/// ``accuracy`` (largest relative deviation from exact Colebrook inside the range, as a
/// fraction). Outside the range results still compute and carry a warning.
#[pyfunction]
pub fn correlation_validity<'py>(
    py: Python<'py>,
    correlation: &str,
) -> PyResult<Bound<'py, PyDict>> {
    let v = correlation.parse::<Correlation>().py()?.validity();
    let d = PyDict::new(py);
    d.set_item("re_min", v.re_min)?;
    d.set_item("re_max", v.re_max)?;
    d.set_item("rel_roughness_min", v.rel_roughness_min)?;
    d.set_item("rel_roughness_max", v.rel_roughness_max)?;
    d.set_item("accuracy", v.accuracy)?;
    Ok(d)
}

/// A Darcy friction factor with its sensitivities.
///
/// Fields: ``f`` (Darcy friction factor, dimensionless), ``df_dre`` (∂f/∂Re),
/// ``df_drel_roughness`` (∂f/∂(ε/D)), ``regime`` (``"laminar"``, ``"transitional"`` or
/// ``"turbulent"``) and ``warnings`` (names of the validity warnings that apply).
/// The correlations are good to about ±10 % against measurements (engineering estimate).
#[pyclass(name = "Friction", module = "hydrograde._native", frozen, eq)]
#[derive(Clone, PartialEq)]
pub struct PyFriction {
    /// The core value.
    pub inner: core::Friction,
}

#[pymethods]
impl PyFriction {
    /// Darcy friction factor, dimensionless.
    #[getter]
    fn f(&self) -> f64 {
        self.inner.f
    }
    /// ∂f/∂Re, per unit Reynolds number.
    #[getter]
    fn df_dre(&self) -> f64 {
        self.inner.df_dre
    }
    /// ∂f/∂(ε/D), per unit relative roughness.
    #[getter]
    fn df_drel_roughness(&self) -> f64 {
        self.inner.df_drel_roughness
    }
    /// Flow regime: "laminar", "transitional" or "turbulent".
    #[getter]
    fn regime(&self) -> &'static str {
        self.inner.regime.name()
    }
    /// Names of the validity warnings that apply (empty when none).
    #[getter]
    fn warnings(&self) -> Vec<&'static str> {
        self.inner.warnings.names()
    }
    /// The fields as a dict of plain Python values.
    fn to_dict<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyDict>> {
        let d = PyDict::new(py);
        d.set_item("f", self.inner.f)?;
        d.set_item("df_dre", self.inner.df_dre)?;
        d.set_item("df_drel_roughness", self.inner.df_drel_roughness)?;
        d.set_item("regime", self.regime())?;
        d.set_item("warnings", self.warnings())?;
        Ok(d)
    }
    /// A one-row pandas DataFrame (needs pandas).
    fn to_dataframe<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyAny>> {
        state::dataframe(py, &self.to_dict(py)?)
    }
    fn _repr_html_(&self, py: Python<'_>) -> PyResult<String> {
        state::html(py, "Friction", &self.to_dict(py)?)
    }
    fn __repr__(&self) -> String {
        format!(
            "Friction(f={:?}, df_dre={:?}, df_drel_roughness={:?}, regime='{}', warnings={})",
            self.inner.f,
            self.inner.df_dre,
            self.inner.df_drel_roughness,
            self.regime(),
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
        Ok(PyFriction {
            inner: state::loads(state)?,
        })
    }
}

/// Same-shape, C-contiguous float64 arrays go straight to the core's batch entry point
/// (the vector kernel on the widest instruction set, all cores above its threshold) with
/// the GIL released; anything else (scalars, broadcasting, other dtypes or strides) takes
/// the general path.
fn batch_fast_path<'py>(
    py: Python<'py>,
    re: &Bound<'py, PyAny>,
    rel_roughness: &Bound<'py, PyAny>,
    o: &Options,
) -> PyResult<Option<Bound<'py, PyAny>>> {
    use numpy::ndarray::{ArrayD, IxDyn};
    use numpy::{IntoPyArray, PyArrayDyn, PyArrayMethods, PyUntypedArrayMethods};
    let (Ok(r), Ok(e)) = (
        re.cast::<PyArrayDyn<f64>>(),
        rel_roughness.cast::<PyArrayDyn<f64>>(),
    ) else {
        return Ok(None);
    };
    if r.shape() != e.shape() {
        return Ok(None);
    }
    let (Ok(r), Ok(e)) = (r.try_readonly(), e.try_readonly()) else {
        return Ok(None);
    };
    let (Ok(rs), Ok(es)) = (r.as_slice(), e.as_slice()) else {
        return Ok(None);
    };
    let shape = r.shape().to_vec();
    let mut out = vec![0.0; rs.len()];
    py.detach(|| core::darcy_factor_batch(rs, es, o, &mut out))
        .py()?;
    let Ok(arr) = ArrayD::from_shape_vec(IxDyn(&shape), out) else {
        return Ok(None);
    };
    Ok(Some(arr.into_pyarray(py).into_any()))
}
