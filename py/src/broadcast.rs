//! Broadcast arguments read in place: numpy views such as `x[:, None]` described by their
//! memory and strides (0 along broadcast axes), handed to the core's strided batch or read
//! element by element, never copied.

use crate::arrays::broadcast_shape;
use crate::errors::CoreResult;
use hydrograde::friction::Strided;
use numpy::ndarray::{ArrayD, IxDyn};
use numpy::{PyArrayDyn, PyArrayMethods, PyUntypedArrayMethods};
use pyo3::exceptions::PyTypeError;
use pyo3::prelude::*;
use pyo3::types::{PyBool, PyFloat, PyInt};

/// Memory, index of the first element and per-axis strides of a broadcast view.
pub type View<'a> = (&'a [f64], usize, Vec<isize>);

/// The view of array `view` broadcast to `shape` without copying: its memory (when the
/// array is contiguous in some order, as numpy's `x[:, None]` views are), the index of its
/// first element there and one stride per axis of `shape` (0 along broadcast axes), in
/// elements. `None` when the array's memory is not contiguous.
pub fn view<'a>(view: &numpy::ndarray::ArrayViewD<'a, f64>, shape: &[usize]) -> Option<View<'a>> {
    let mem = view.to_slice_memory_order()?;
    let (dims, strides) = (view.shape(), view.strides());
    // The logical first element sits above the lowest address by every negative stride's
    // reach.
    let offset = dims
        .iter()
        .zip(strides)
        .filter(|(_, s)| **s < 0)
        .map(|(&d, &s)| (d.saturating_sub(1)) * s.unsigned_abs())
        .sum();
    let lead = shape.len().checked_sub(dims.len())?;
    let out = (0..shape.len())
        .map(|k| match k.checked_sub(lead) {
            Some(j) if dims[j] == shape[k] && dims[j] != 1 => strides[j],
            _ => 0,
        })
        .collect();
    Some((mem, offset, out))
}

/// Runs a core batch that takes two strided views (`run(a, b, shape, out)`, such as
/// [`hydrograde::friction::darcy_factor_batch_strided`]) on two arguments broadcast
/// together, reading the caller's arrays in place (no copies) with the GIL released.
/// `None` when the arguments are not plain numbers or float64 arrays with contiguous
/// memory, or do not broadcast: the caller then takes [`crate::arrays::map`], which handles (and
/// reports) every other case.
pub fn broadcast2<'py, F>(
    py: Python<'py>,
    args: [&Bound<'py, PyAny>; 2],
    run: F,
) -> PyResult<Option<Bound<'py, PyAny>>>
where
    F: Fn(&Strided<'_>, &Strided<'_>, &[usize], &mut [f64]) -> hydrograde::Result<()> + Sync,
{
    let mut scalars = [[0.0f64]; 2];
    let mut arrays = Vec::with_capacity(2);
    for (k, obj) in args.iter().enumerate() {
        if obj.is_instance_of::<PyBool>() {
            return Ok(None);
        }
        if obj.is_instance_of::<PyFloat>() || obj.is_instance_of::<PyInt>() {
            scalars[k][0] = obj.extract::<f64>()?;
            arrays.push(None);
        } else if let Ok(a) = obj.cast::<PyArrayDyn<f64>>() {
            arrays.push(Some(a.try_readonly()?));
        } else {
            return Ok(None);
        }
    }
    if arrays.iter().all(Option::is_none) {
        return Ok(None);
    }
    let shapes: Vec<Vec<usize>> = arrays
        .iter()
        .map(|a| a.as_ref().map_or_else(Vec::new, |r| r.shape().to_vec()))
        .collect();
    let Some(shape) = broadcast_shape(&shapes) else {
        return Ok(None);
    };
    let mut parts = Vec::with_capacity(2);
    for (k, a) in arrays.iter().enumerate() {
        parts.push(match a {
            None => (&scalars[k][..], 0, vec![0; shape.len()]),
            Some(ro) => match view(&ro.as_array(), &shape) {
                Some(p) => p,
                None => return Ok(None),
            },
        });
    }
    let views: Vec<Strided<'_>> = parts
        .iter()
        .map(|(data, offset, strides)| Strided {
            data,
            offset: *offset,
            strides,
        })
        .collect();
    let n: usize = shape.iter().product();
    let mut out = vec![0.0; n];
    py.detach(|| run(&views[0], &views[1], &shape, &mut out))
        .py()?;
    let arr = ArrayD::from_shape_vec(IxDyn(&shape), out)
        .map_err(|e| PyTypeError::new_err(e.to_string()))?;
    Ok(Some(PyArrayDyn::from_owned_array(py, arr).into_any()))
}
