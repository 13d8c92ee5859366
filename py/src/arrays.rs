//! Float-or-array arguments with numpy broadcasting.
//!
//! A scalar function of N numbers becomes a numpy-native function: Python floats and ints
//! in give a float out; any array-like among the arguments gives a float64 array of the
//! broadcast shape. The work runs with the GIL released, on all cores above the core's
//! [`PARALLEL_THRESHOLD`], and each element is exactly the scalar call (bit for bit).

use crate::errors::CoreResult;
use hydrograde::error::Error;
use hydrograde::friction::PARALLEL_THRESHOLD;
use numpy::ndarray::{ArrayD, IxDyn};
use numpy::{
    PyArrayDescrMethods, PyArrayDyn, PyArrayMethods, PyUntypedArray, PyUntypedArrayMethods,
};
use pyo3::exceptions::PyTypeError;
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
    Owned(Vec<f64>),
}

impl Input<'_> {
    #[inline]
    fn at(&self, i: usize) -> f64 {
        match self {
            Input::Const(v) => *v,
            Input::Slice(s) => s[i],
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
    let mut inputs = Vec::with_capacity(N);
    for h in &held {
        inputs.push(match h {
            Held::Scalar(v) => Input::Const(*v),
            Held::Array(ro) => {
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
