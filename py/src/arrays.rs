//! Float-or-array arguments with numpy broadcasting.
//!
//! A scalar function of N numbers becomes a numpy-native function: Python floats and ints
//! in give a float out; any array-like among the arguments gives a float64 array of the
//! broadcast shape. The work runs with the GIL released, on all cores above the core's
//! [`PARALLEL_THRESHOLD`], and each element is exactly the scalar call (bit for bit).
//!
//! Every number argument also accepts a pint `Quantity` (scalar or array): it is read in
//! the SI unit of its argument ([`si_unit`]) after pint checks its dimension, and a
//! quantity of another dimension is an `InvalidInputError` naming the argument. pint is
//! never imported here: a quantity is recognised by its `m_as` and `dimensionality`.

use crate::errors::CoreResult;
use hydrograde::error::Error;
use hydrograde::friction::{PARALLEL_THRESHOLD, Strided};
use hydrograde::units;
use numpy::ndarray::{ArrayD, IxDyn};
use numpy::{
    PyArrayDescrMethods, PyArrayDyn, PyArrayMethods, PyUntypedArray, PyUntypedArrayMethods,
};
use pyo3::exceptions::PyTypeError;
use pyo3::intern;
use pyo3::prelude::*;
use pyo3::sync::PyOnceLock;
use pyo3::types::{PyBool, PyFloat, PyInt};
use rayon::prelude::*;

/// One argument: a plain number or a float64 array.
pub enum Arg<'py> {
    /// A Python float or int (numpy float64 scalars are floats).
    Scalar(f64),
    /// Any array-like, converted to float64.
    Array(Bound<'py, PyArrayDyn<f64>>),
}

static AS_ARRAY: PyOnceLock<Py<PyAny>> = PyOnceLock::new();

impl<'py> Arg<'py> {
    /// Reads argument `name`. Numbers of kind float, signed or unsigned int are accepted;
    /// booleans, complex numbers, strings and objects raise `TypeError` naming `name`.
    pub fn extract(name: &str, obj: &Bound<'py, PyAny>) -> PyResult<Self> {
        if obj.is_instance_of::<PyBool>() {
            return Err(type_error(name, "bool"));
        }
        if obj.is_instance_of::<PyFloat>() || obj.is_instance_of::<PyInt>() {
            return Ok(Arg::Scalar(obj.extract::<f64>()?));
        }
        if let Ok(a) = obj.cast::<PyArrayDyn<f64>>() {
            return Ok(Arg::Array(a.clone()));
        }
        if let Some(magnitude) = si_magnitude(name, obj)? {
            return Arg::extract(name, &magnitude);
        }
        let py = obj.py();
        let asarray = AS_ARRAY.import(py, "numpy", "asarray")?;
        let arr = asarray
            .call1((obj,))
            .map_err(|e| PyTypeError::new_err(format!("{name}: not a number or array ({e})")))?;
        let untyped = arr.cast::<PyUntypedArray>()?;
        let dtype = untyped.dtype();
        let kind = dtype.kind();
        if !matches!(kind, b'f' | b'i' | b'u') {
            return Err(type_error(name, &format!("an array of dtype {dtype}")));
        }
        let converted = arr.call_method1("astype", ("float64",))?;
        Ok(Arg::Array(converted.cast_into::<PyArrayDyn<f64>>()?))
    }
}

/// Argument names with the SI unit they are read in (as pint spells it) and what that
/// dimension is called: one table for every entry point, so that a quantity means the
/// same in every call. Names not listed are dimensionless (Reynolds numbers, ratios, K).
const ARGUMENTS: &[(&str, &str, &str)] = &[
    ("flow", "m**3/s", "a volume flow"),
    ("flows", "m**3/s", "a volume flow"),
    ("total", "m**3/s", "a volume flow"),
    ("at_flow", "m**3/s", "a volume flow"),
    ("length", "m", "a length"),
    ("diameter", "m", "a length"),
    ("bore", "m", "a length"),
    ("roughness", "m", "a length"),
    ("height", "m", "a length"),
    ("head", "m", "a length (head)"),
    ("heads", "m", "a length (head)"),
    ("section", "m", "a length"),
    ("d_in", "m", "a length"),
    ("d_out", "m", "a length"),
    ("outer", "m", "a length"),
    ("inner", "m", "a length"),
    ("width", "m", "a length"),
    ("major", "m", "a length"),
    ("minor", "m", "a length"),
    ("side", "m", "a length"),
    ("perimeter", "m", "a length"),
    ("min_inside_diameter", "m", "a length"),
    ("initial", "m", "a length"),
    ("low", "m", "a length"),
    ("high", "m", "a length"),
    ("area", "m**2", "an area"),
    ("pressure", "Pa", "a pressure"),
    ("inlet_pressure", "Pa", "a pressure"),
    ("end_pressure", "Pa", "a pressure"),
    ("max_pressure_loss", "Pa", "a pressure"),
    ("drop", "Pa", "a pressure"),
    ("vapour_pressure", "Pa", "a pressure"),
    ("temperature", "K", "a temperature"),
    ("density", "kg/m**3", "a density"),
    ("rating_density", "kg/m**3", "a density"),
    ("viscosity", "Pa*s", "a dynamic viscosity"),
    ("velocity", "m/s", "a velocity"),
    ("max_velocity", "m/s", "a velocity"),
    ("rate", "m/year", "a roughness growth rate"),
    ("years", "year", "a time"),
    ("angle_deg", "degree", "an angle"),
    ("elevation", "m", "a length"),
    ("outflow", "m**3/s", "a volume flow"),
    ("min_pressure", "Pa", "a pressure"),
];

/// Dimensionless arguments: a pint quantity must be dimensionless.
const PLAIN: &[&str] = &[
    "re",
    "rel_roughness",
    "pipe_rel_roughness",
    "value",
    "k",
    "k1",
    "k_inf",
    "k_d",
    "l_over_d",
    "r_over_d",
    "density_rel",
    "viscosity_rel",
    "k_spread",
    "spread",
    "laminar_limit",
    "turbulent_limit",
    "laminar_constant",
];

/// `(name, SI unit, dimension)` of argument `name`, the name as the core's errors hold
/// it (`&'static`).
pub fn si_unit(name: &str) -> (&'static str, &'static str, &'static str) {
    if let Some(row) = ARGUMENTS.iter().find(|r| r.0 == name) {
        return *row;
    }
    let plain = PLAIN
        .iter()
        .copied()
        .find(|n| *n == name)
        .unwrap_or("value");
    (plain, "dimensionless", "a plain number")
}

/// The magnitude of `obj` in the SI unit of argument `name` when `obj` is a pint
/// quantity (a float or an ndarray), `None` when it is not a quantity.
fn si_magnitude<'py>(name: &str, obj: &Bound<'py, PyAny>) -> PyResult<Option<Bound<'py, PyAny>>> {
    let py = obj.py();
    if !(obj.hasattr(intern!(py, "m_as"))? && obj.hasattr(intern!(py, "dimensionality"))?) {
        return Ok(None);
    }
    let (name, unit, what) = si_unit(name);
    if let Ok(m) = obj.call_method1(intern!(py, "m_as"), (unit,)) {
        return core_factor(obj, unit).map(|c| c.or(Some(m)));
    }
    let text = |attr: &Bound<'py, pyo3::types::PyString>| {
        obj.getattr(attr)
            .and_then(|u| u.str())
            .map(|s| s.to_string())
            .unwrap_or_default()
    };
    let (given, dim) = (
        text(intern!(py, "units")),
        text(intern!(py, "dimensionality")),
    );
    Err(Error::invalid(
        name,
        format!("a quantity in {given} ({dim}) where {what} ({unit}) is expected"),
    ))
    .py()
}

/// Units pint names in its long form ("D" format) that the core's unit table holds, with
/// the core's name: their factors come from the core, so that 4.5 L/s reads exactly as
/// `hydrograde.convert(4.5, "L/s", "m3/s")` does in every binding.
const CORE_UNITS: &[(&str, &str)] = &[
    ("meter", "m"),
    ("millimeter", "mm"),
    ("centimeter", "cm"),
    ("inch", "in"),
    ("foot", "ft"),
    ("meter ** 3 / second", "m3/s"),
    ("liter / second", "L/s"),
    ("liter / minute", "L/min"),
    ("meter ** 3 / hour", "m3/h"),
    ("gallon / minute", "gpm"),
    ("pascal", "Pa"),
    ("kilopascal", "kPa"),
    ("megapascal", "MPa"),
    ("bar", "bar"),
    ("pound_force_per_square_inch", "psi"),
    ("standard_atmosphere", "atm"),
    ("pascal * second", "Pa*s"),
    ("millipascal * second", "mPa*s"),
    ("centipoise", "cP"),
    ("kelvin", "K"),
    ("degree_Celsius", "degC"),
    ("degree_Fahrenheit", "degF"),
    ("meter / second", "m/s"),
    ("foot / second", "ft/s"),
];

/// The core's SI name of the pint SI units of [`ARGUMENTS`].
const CORE_SI: &[(&str, &str)] = &[
    ("m**3/s", "m3/s"),
    ("m", "m"),
    ("Pa", "Pa"),
    ("K", "K"),
    ("Pa*s", "Pa*s"),
    ("m/s", "m/s"),
];

/// The magnitude of quantity `q` in SI (pint spelling `si`) converted by the core's
/// [`units::convert`] when both units are in the core's table; `None` otherwise.
fn core_factor<'py>(q: &Bound<'py, PyAny>, si: &str) -> PyResult<Option<Bound<'py, PyAny>>> {
    let py = q.py();
    let Some((_, to)) = CORE_SI.iter().find(|r| r.0 == si) else {
        return Ok(None);
    };
    let long = q
        .getattr(intern!(py, "units"))?
        .call_method1(intern!(py, "__format__"), ("D",))?;
    let long: String = long.extract()?;
    let Some((_, from)) = CORE_UNITS.iter().find(|r| r.0 == long) else {
        return Ok(None);
    };
    let magnitude = q.getattr(intern!(py, "magnitude"))?;
    map(py, ["value"], [&magnitude], |[v]| {
        units::convert(v, from, to)
    })
    .map(Some)
}

/// A number argument of a call that takes no arrays: a float, an int, a 0-d array or a
/// pint quantity (read in the argument's SI unit).
pub fn number(name: &str, obj: &Bound<'_, PyAny>) -> PyResult<f64> {
    match Arg::extract(name, obj)? {
        Arg::Scalar(v) => Ok(v),
        Arg::Array(a) if a.ndim() == 0 => a
            .readonly()
            .as_array()
            .iter()
            .next()
            .copied()
            .ok_or_else(|| type_error(name, "an empty array")),
        Arg::Array(_) => Err(PyTypeError::new_err(format!(
            "{name}: expected a number, got an array"
        ))),
    }
}

/// A sequence argument (list, array or pint quantity of one) as a flat vector of
/// numbers in the argument's SI unit.
pub fn vector(name: &str, obj: &Bound<'_, PyAny>) -> PyResult<Vec<f64>> {
    match Arg::extract(name, obj)? {
        Arg::Scalar(v) => Ok(vec![v]),
        Arg::Array(a) => Ok(a.readonly().as_array().iter().copied().collect()),
    }
}

/// Extractors for `#[pyo3(from_py_with = …)]`: one per argument name (pyo3 passes no
/// name), each [`number`] under that name; `opt_*` also take `None`.
pub mod si {
    use pyo3::prelude::*;
    macro_rules! extractors {
        ($($name:ident $opt:ident),* $(,)?) => {$(
            #[allow(dead_code)]
            pub fn $name(obj: &Bound<'_, PyAny>) -> PyResult<f64> {
                super::number(stringify!($name), obj)
            }
            #[allow(dead_code)]
            pub fn $opt(obj: &Bound<'_, PyAny>) -> PyResult<Option<f64>> {
                if obj.is_none() {
                    Ok(None)
                } else {
                    super::number(stringify!($name), obj).map(Some)
                }
            }
        )*};
    }
    /// Pump-curve flows (m³/s) as a vector.
    pub fn flows_vec(obj: &Bound<'_, PyAny>) -> PyResult<Vec<f64>> {
        super::vector("flows", obj)
    }
    /// Pump-curve heads (m) as a vector.
    pub fn heads_vec(obj: &Bound<'_, PyAny>) -> PyResult<Vec<f64>> {
        super::vector("heads", obj)
    }
    extractors!(
        flow opt_flow, flows opt_flows, bore opt_bore, total opt_total, at_flow opt_at_flow, length opt_length,
        diameter opt_diameter, roughness opt_roughness, height opt_height, head opt_head,
        d_in opt_d_in, d_out opt_d_out, outer opt_outer, inner opt_inner, width opt_width,
        major opt_major, minor opt_minor, side opt_side, perimeter opt_perimeter,
        min_inside_diameter opt_min_inside_diameter, low opt_low, high opt_high,
        area opt_area, pressure opt_pressure, inlet_pressure opt_inlet_pressure, end_pressure opt_end_pressure,
        max_pressure_loss opt_max_pressure_loss, drop opt_drop,
        vapour_pressure opt_vapour_pressure, temperature opt_temperature,
        density opt_density, rating_density opt_rating_density, viscosity opt_viscosity, max_velocity opt_max_velocity,
        angle_deg opt_angle_deg, velocity opt_velocity, value opt_value, k opt_k, k1 opt_k1,
        k_inf opt_k_inf, k_d opt_k_d, l_over_d opt_l_over_d, r_over_d opt_r_over_d,
        density_rel opt_density_rel, viscosity_rel opt_viscosity_rel,
        k_spread opt_k_spread, spread opt_spread, laminar_limit opt_laminar_limit,
        turbulent_limit opt_turbulent_limit, laminar_constant opt_laminar_constant,
        re opt_re, rel_roughness opt_rel_roughness, pipe_rel_roughness opt_pipe_rel_roughness,
        elevation opt_elevation, outflow opt_outflow, min_pressure opt_min_pressure,
    );
}

fn type_error(name: &str, got: &str) -> PyErr {
    PyTypeError::new_err(format!(
        "{name}: expected a real number or an array of real numbers (converted to float64), got {got}"
    ))
}

/// An argument held for reading while the GIL is released.
enum Held<'py> {
    Scalar(f64),
    Array(numpy::PyReadonlyArrayDyn<'py, f64>),
}

/// An input after broadcasting, as the worker threads see it.
enum Input<'a> {
    Const(f64),
    Slice(&'a [f64]),
    /// A broadcast view of the caller's memory (no copy), with the output's shape.
    Strided(Strided<'a>, &'a [usize]),
    Owned(Vec<f64>),
}

impl Input<'_> {
    #[inline]
    fn at(&self, i: usize) -> f64 {
        match self {
            Input::Const(v) => *v,
            Input::Slice(s) => s[i],
            Input::Strided(v, shape) => {
                // Flat C-order index to the view's position, innermost axis first.
                let (mut rest, mut pos) = (i, v.offset as isize);
                for (&d, &st) in shape.iter().zip(v.strides).rev() {
                    pos += (rest % d) as isize * st;
                    rest /= d;
                }
                v.data[pos as usize]
            }
            Input::Owned(v) => v[i],
        }
    }
}

/// The numpy broadcast shape of `shapes`, or `None` when they do not broadcast.
pub fn broadcast_shape(shapes: &[Vec<usize>]) -> Option<Vec<usize>> {
    let ndim = shapes.iter().map(Vec::len).max().unwrap_or(0);
    let mut out = vec![1usize; ndim];
    for s in shapes {
        let offset = ndim - s.len();
        for (k, &d) in s.iter().enumerate() {
            let o = &mut out[offset + k];
            if *o == 1 {
                *o = d;
            } else if d != 1 && d != *o {
                return None;
            }
        }
    }
    Some(out)
}

fn shape_text(s: &[usize]) -> String {
    match s {
        [one] => format!("({one},)"),
        _ => format!(
            "({})",
            s.iter()
                .map(usize::to_string)
                .collect::<Vec<_>>()
                .join(", ")
        ),
    }
}

/// Applies `f` element-wise over the broadcast of `args` (named `names`).
///
/// Errors from `f` carry the flat index of the failing element (the first one in C
/// order). Returns a Python float when every argument is a scalar.
pub fn map<'py, const N: usize, F>(
    py: Python<'py>,
    names: [&'static str; N],
    args: [&Bound<'py, PyAny>; N],
    f: F,
) -> PyResult<Bound<'py, PyAny>>
where
    F: Fn([f64; N]) -> hydrograde::Result<f64> + Sync,
{
    let mut parsed = Vec::with_capacity(N);
    for (name, obj) in names.iter().zip(args) {
        parsed.push(Arg::extract(name, obj)?);
    }
    if parsed.iter().all(|a| matches!(a, Arg::Scalar(_))) {
        let mut xs = [0.0; N];
        for (x, a) in xs.iter_mut().zip(&parsed) {
            if let Arg::Scalar(v) = a {
                *x = *v;
            }
        }
        return Ok(PyFloat::new(py, f(xs).py()?).into_any());
    }
    let shapes: Vec<Vec<usize>> = parsed
        .iter()
        .map(|a| match a {
            Arg::Scalar(_) => Vec::new(),
            Arg::Array(arr) => arr.shape().to_vec(),
        })
        .collect();
    let Some(shape) = broadcast_shape(&shapes) else {
        let listed: Vec<String> = names
            .iter()
            .zip(&shapes)
            .map(|(n, s)| format!("{n} {}", shape_text(s)))
            .collect();
        return Err(Error::invalid(
            names[0],
            format!("shapes do not broadcast together: {}", listed.join(", ")),
        ))
        .py();
    };
    let held: Vec<Held<'py>> = parsed
        .iter()
        .map(|a| match a {
            Arg::Scalar(v) => Ok(Held::Scalar(*v)),
            Arg::Array(arr) => arr.try_readonly().map(Held::Array),
        })
        .collect::<Result<_, _>>()?;
    let views: Vec<Option<crate::broadcast::View<'_>>> = held
        .iter()
        .map(|h| match h {
            Held::Array(ro) => crate::broadcast::view(&ro.as_array(), &shape),
            Held::Scalar(_) => None,
        })
        .collect();
    let mut inputs = Vec::with_capacity(N);
    for (h, v) in held.iter().zip(&views) {
        inputs.push(match (h, v) {
            (Held::Scalar(v), _) => Input::Const(*v),
            (Held::Array(ro), Some((data, offset, strides))) => {
                let view = ro.as_array();
                match (view.shape() == shape.as_slice(), view.to_slice()) {
                    (true, Some(s)) => Input::Slice(s),
                    _ => Input::Strided(
                        Strided {
                            data,
                            offset: *offset,
                            strides,
                        },
                        &shape,
                    ),
                }
            }
            (Held::Array(ro), None) => {
                let view = ro.as_array();
                match (view.shape() == shape.as_slice(), view.to_slice()) {
                    (true, Some(s)) => Input::Slice(s),
                    _ => match view.broadcast(IxDyn(&shape)) {
                        Some(b) => Input::Owned(b.iter().copied().collect()),
                        None => {
                            return Err(Error::invalid(names[0], "shapes do not broadcast")).py();
                        }
                    },
                }
            }
        });
    }
    let n: usize = shape.iter().product();
    let mut out = vec![0.0; n];
    let result = py.detach(|| run(&inputs, &mut out, &f));
    result.py()?;
    let arr = ArrayD::from_shape_vec(IxDyn(&shape), out)
        .map_err(|e| PyTypeError::new_err(e.to_string()))?;
    Ok(PyArrayDyn::from_owned_array(py, arr).into_any())
}

fn run<const N: usize, F>(inputs: &[Input<'_>], out: &mut [f64], f: &F) -> hydrograde::Result<()>
where
    F: Fn([f64; N]) -> hydrograde::Result<f64> + Sync,
{
    let one = |(i, o): (usize, &mut f64)| -> hydrograde::Result<()> {
        let mut xs = [0.0; N];
        for (x, inp) in xs.iter_mut().zip(inputs) {
            *x = inp.at(i);
        }
        *o = f(xs).map_err(|e| e.at_index(i))?;
        Ok(())
    };
    if out.len() < PARALLEL_THRESHOLD {
        return out.iter_mut().enumerate().try_for_each(one);
    }
    match hydrograde::threads::in_pool(|| out.par_iter_mut().enumerate().try_for_each(one)) {
        // One thread allowed: the calling thread does it all.
        None => return out.iter_mut().enumerate().try_for_each(one),
        Some(Ok(())) => return Ok(()),
        Some(Err(_)) => {}
    }
    // Report the first failing element in C order, whichever thread failed first.
    for i in 0..out.len() {
        let mut xs = [0.0; N];
        for (x, inp) in xs.iter_mut().zip(inputs) {
            *x = inp.at(i);
        }
        f(xs).map_err(|e| e.at_index(i))?;
    }
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn broadcast_follows_numpy_rules() {
        assert_eq!(broadcast_shape(&[vec![3], vec![]]), Some(vec![3]));
        assert_eq!(broadcast_shape(&[vec![2, 1], vec![3]]), Some(vec![2, 3]));
        assert_eq!(broadcast_shape(&[vec![0], vec![1]]), Some(vec![0]));
        assert_eq!(broadcast_shape(&[vec![3], vec![4]]), None);
        assert_eq!(shape_text(&[3]), "(3,)");
        assert_eq!(shape_text(&[2, 3]), "(2, 3)");
    }
}
